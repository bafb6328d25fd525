package tui

// Layout constants: below minWidth×minHeight the explorer shows a note
// instead of panes; from wideWidth×wideHeight the panes sit in two columns
// (inputs and derived values beside chart and criteria); below it they
// stack: the chart across the whole width on top, under it the inputs (or
// the derived values while they have the focus) beside the criteria.
// Common practice, no source: chosen so that 80×24 shows every legend
// entry of every chart and all six built-in criteria.
const (
	minWidth   = 60
	minHeight  = 16
	wideWidth  = 100
	wideHeight = 30
	leftNarrow = 30
	leftWide   = 40
	// minChartRows is the height the stacked layout keeps for the chart
	// pane when the panes under it would like more.
	minChartRows = 11
)

// layout is the geometry of one frame.
type layout struct {
	stacked           bool // chart on top, panes under it
	zoom              bool // the chart takes the whole body
	leftW, rightW     int
	bodyH             int
	inputsH, derivedH int
	critH, chartH     int
	chartW            int
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
	inputsNeed := a.in.Rows() + 2
	critNeed := len(a.res.Criteria) + 3 // head, rows, borders
	switch {
	case a.zoom:
		l.zoom = true
		l.chartW, l.chartH = a.width, l.bodyH
	case a.width < wideWidth || a.height < wideHeight:
		l.stacked = true
		bottom := min(max(inputsNeed, critNeed), max(l.bodyH-minChartRows, l.bodyH/2))
		l.chartW, l.chartH = a.width, l.bodyH-bottom
		l.inputsH, l.derivedH, l.critH = bottom, bottom, bottom
	default:
		l.inputsH = min(inputsNeed, l.bodyH-4)
		l.derivedH = l.bodyH - l.inputsH
		l.critH = min(critNeed, l.bodyH/2)
		l.chartW, l.chartH = l.rightW, l.bodyH-l.critH
	}
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
	return l.chartW - 2, l.chartH - 2
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
	a.chart.SetSize(l.chartW, l.chartH)
	a.criteria.SetSize(l.rightW, l.critH)
	a.details.SetSize(min(a.width-4, 90), l.bodyH)
}
