package tui

import (
	"fmt"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

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
	l.inputsH = min(len(a.in.visible())+3, l.bodyH-4)
	if a.in.editing {
		l.inputsH = min(l.inputsH+1, l.bodyH-4)
	}
	l.derivedH = l.bodyH - l.inputsH
	l.critH = min(len(a.res.Criteria)+4, l.bodyH/2)
	l.chartH = l.bodyH - l.critH
	return l
}

// chartSize returns the chart's drawing area (inside its border).
func (a *App) chartSize() (w, h int) {
	if a.width < minWidth || a.height < minHeight {
		return 0, 0
	}
	l := a.computeLayout()
	return l.rightW - 2, l.chartH - 2
}

// View draws the frame.
func (a *App) View() string {
	if a.width == 0 || a.height == 0 {
		return ""
	}
	if a.width < minWidth || a.height < minHeight {
		return strings.Join(a.tooSmall(), "\n")
	}
	st := &a.styles
	l := a.computeLayout()
	left := append(
		box("Inputs", a.inputLines(l.leftW-2), l.leftW, l.inputsH, a.focus == focusInputs, st),
		box("Derived", a.derivedLines(l.leftW-2, l.derivedH-2), l.leftW, l.derivedH, a.focus == focusDerived, st)...)
	critTitle := "Criteria"
	if a.pin != nil {
		critTitle = "Criteria — A pinned vs B now"
	}
	right := append(
		box(a.chartTitle(), a.chartLines(l.rightW-2, l.chartH-2), l.rightW, l.chartH, false, st),
		box(critTitle, a.criteriaLines(l.rightW-2), l.rightW, l.critH, a.focus == focusCriteria, st)...)
	body := beside(left, right)
	switch {
	case a.prompt != nil:
		body = overlay(body, a.promptView(a.width), a.width)
	case a.showHelp:
		body = overlay(body, a.helpView(), a.width)
	case a.showDetails:
		w := min(a.width-4, 90)
		title, lines := a.detailsLines(w - 2)
		body = overlay(body, box(title, lines, w, min(len(lines)+2, l.bodyH), true, st), a.width)
	}
	out := make([]string, 0, a.height)
	out = append(out, fit(a.header(), a.width))
	out = append(out, block(body, a.width, l.bodyH)...)
	out = append(out, fit(a.statusLine(), a.width), fit(st.Help.Render(a.help.ShortHelpView(a.keys.ShortHelp())), a.width))
	return strings.Join(out, "\n")
}

// tooSmall is the frame for a window below the minimum.
func (a *App) tooSmall() []string {
	msg := []string{
		"terminal too small",
		fmt.Sprintf("need %d×%d, have %d×%d", minWidth, minHeight, a.width, a.height),
		"enlarge it, or q to quit",
	}
	lines := make([]string, a.height)
	top := max(0, (a.height-len(msg))/2)
	for i := range lines {
		s := ""
		if k := i - top; k >= 0 && k < len(msg) {
			s = strings.Repeat(" ", max(0, (a.width-len([]rune(msg[k])))/2)) + msg[k]
		}
		lines[i] = fit(s, a.width)
	}
	return lines
}

// header names the program, scenario, cooling function and convention.
func (a *App) header() string {
	st := &a.styles
	parts := []string{st.Title.Render("cloudwind")}
	if a.scenario != "" {
		parts = append(parts, quantity.Sanitize(a.scenario))
	}
	q := a.cur.params
	parts = append(parts, fmt.Sprintf("f=%s 𝒩=%s", quantity.FormatSig(q.HeatCapacity.Factor(), 2), densityWord(q.DensityProduct)))
	parts = append(parts, report.CoolingName(a.cur.cooling, a.cur.cf))
	if a.pin != nil {
		parts = append(parts, st.Warning.Render("compare: A pinned"))
	}
	return " " + strings.Join(parts, st.Dim.Render(" · "))
}

// statusLine shows the last message or error.
func (a *App) statusLine() string {
	st := &a.styles
	if a.status.text == "" {
		return st.Status.Render(" " + fmt.Sprintf("%d criteria · chart %d/%d: %s · ? help", len(a.res.Criteria), a.view+1, viewCount, a.view))
	}
	if a.status.isErr {
		return st.Error.Render(" ✗ " + a.status.text)
	}
	return st.Status.Render(" " + a.status.text)
}

// chartTitle names the chart pane.
func (a *App) chartTitle() string {
	t := fmt.Sprintf("%d %s", a.view+1, a.view)
	if a.view == viewThreshold && a.family {
		t += " (family)"
	}
	if a.view == viewRegime && a.mapMach {
		t += " (χ × Mach)"
	}
	return t
}

// chartLines draws the latest chart, or a note while the first one is
// computed.
func (a *App) chartLines(w, h int) []string {
	c := a.chart
	var s string
	switch {
	case c.view != a.view || (c.line == nil && c.regime == nil && c.text == nil):
		return block([]string{a.styles.Dim.Render("computing…")}, w, h)
	case c.text != nil:
		return block(a.wrapLines(c.text, w), w, h)
	case c.line2 != nil:
		top := h / 2
		s = RenderLineChart(c.line, w, top, &a.styles) + "\n" + RenderLineChart(c.line2, w, h-top, &a.styles)
	case c.line != nil:
		s = RenderLineChart(c.line, w, h, &a.styles)
	default:
		s = RenderRegimeMap(c.regime, w, h, &a.styles)
	}
	return block(strings.Split(s, "\n"), w, h)
}

// helpView is the help overlay, generated from the keymap.
func (a *App) helpView() []string {
	var cols [][]string
	for _, group := range a.keys.FullHelp() {
		var col []string
		for _, b := range group {
			if !b.Enabled() {
				continue
			}
			h := b.Help()
			col = append(col, fmt.Sprintf("%-10s %s", h.Key, h.Desc))
		}
		cols = append(cols, col)
	}
	var lines []string
	rows := 0
	for _, c := range cols {
		rows = max(rows, len(c))
	}
	colW := 30
	if a.width < 100 {
		colW = (a.width - 8) / 3
	}
	for i := 0; i < rows; i++ {
		var b strings.Builder
		for _, c := range cols {
			cell := ""
			if i < len(c) {
				cell = c[i]
			}
			b.WriteString(fit(cell, colW))
		}
		lines = append(lines, b.String())
	}
	lines = append(lines, "", a.styles.Dim.Render("Units with typed values: 30 pc, 0.2 kpc, 2e4 K, 1 keV, 3e3 (K cm⁻³)."),
		a.styles.Dim.Render("* unverified constant · ! outside calibrated range · ⚠ outside the cooling table"),
		a.styles.Help.Render("? or esc close"))
	w := min(a.width-2, 3*colW+4)
	return box("Keys", lines, w, min(len(lines)+2, a.height-3), true, &a.styles)
}

// derivedValue is used by tests: the display text of a derived quantity.
func (a *App) derivedValue(key string) string {
	for _, q := range model.Quantities() {
		if q.Key == key {
			return quantity.Format(q.Dim, q.Value(&a.res.State))
		}
	}
	return ""
}

// wrapLines wraps text lines to w cells, indenting continuations.
func (a *App) wrapLines(lines []string, w int) []string {
	var out []string
	for _, l := range lines {
		if visibleLen(l) <= w {
			out = append(out, l)
			continue
		}
		trimmed := strings.TrimLeft(l, " ")
		indent := strings.Repeat(" ", len(l)-len(trimmed))
		out = append(out, wrapText(indent, trimmed, w)...)
	}
	return out
}
