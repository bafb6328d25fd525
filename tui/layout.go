package tui

// Layout constants: below minWidth×minHeight the explorer shows a note
// instead of panes; from wideWidth the derived pane sits beside the chart.
const (
	minWidth   = 60
	minHeight  = 16
	wideWidth  = 100
	leftNarrow = 30
	leftWide   = 40
)

// layout is the geometry of one frame.
type layout struct {
	leftW, rightW     int
	bodyH             int
	inputsH, derivedH int
	critH, chartH     int
}

// computeLayout splits the window. Every pane has a fixed place: nothing
// overlaps at any size from minWidth×minHeight up.
func (a *App) computeLayout() layout {
	var l layout
	l.bodyH = a.height - 3 // header, status and hint lines
	l.leftW = leftNarrow
	if a.width >= wideWidth {
		l.leftW = leftWide
	}
	l.rightW = a.width - l.leftW
	l.inputsH = min(a.in.Rows()+3, l.bodyH-4)
	if a.in.Editing() {
		l.inputsH = min(l.inputsH+1, l.bodyH-4)
	}
	l.derivedH = l.bodyH - l.inputsH
	l.critH = min(len(a.res.Criteria)+4, l.bodyH/2)
	l.chartH = l.bodyH - l.critH
	return l
}

// tooSmall reports whether the window is below the minimum.
func (a *App) tooSmall() bool { return a.width < minWidth || a.height < minHeight }

// chartSize returns the chart's drawing area (inside its border).
func (a *App) chartSize() (w, h int) {
	if a.tooSmall() {
		return 0, 0
	}
	l := a.computeLayout()
	return l.rightW - 2, l.chartH - 2
}

// resize gives every pane its size in the current layout.
func (a *App) resize() {
	a.help.SetSize(a.width, a.height)
	a.prompt.SetSize(a.width, a.height)
	if a.tooSmall() {
		return
	}
	l := a.computeLayout()
	a.in.SetSize(l.leftW, l.inputsH)
	a.derived.SetSize(l.leftW, l.derivedH)
	a.chart.SetSize(l.rightW, l.chartH)
	a.criteria.SetSize(l.rightW, l.critH)
	a.details.SetSize(min(a.width-4, 90), l.bodyH)
}
