package tui

import (
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
)

// View composes the frame: header, the panes (inputs and derived values
// on the left, chart and criteria on the right), an overlay if one is
// open, the status line and the key hint.
func (a *App) View() string {
	if a.width == 0 || a.height == 0 {
		return ""
	}
	if a.tooSmall() {
		return strings.Join(a.tooSmallFrame(), "\n")
	}
	st := &a.styles
	l := a.computeLayout()
	left := append(splitLines(a.in.View()), splitLines(a.derived.View())...)
	right := append(splitLines(a.chart.View()), splitLines(a.criteria.View())...)
	body := beside(left, right)
	switch {
	case a.prompt.Open():
		body = overlay(body, splitLines(a.prompt.View()), a.width)
	case a.help.Open():
		body = overlay(body, splitLines(a.help.View()), a.width)
	case a.details.Open():
		body = overlay(body, splitLines(a.details.View()), a.width)
	}
	out := make([]string, 0, a.height)
	out = append(out, fit(a.header(), a.width))
	out = append(out, block(body, a.width, l.bodyH)...)
	out = append(out, fit(a.statusLine(), a.width), fit(st.Help.Render(a.help.ShortView()), a.width))
	return strings.Join(out, "\n")
}

// tooSmallFrame is the frame for a window below the minimum.
func (a *App) tooSmallFrame() []string {
	msg := []string{
		"terminal too small",
		"need " + strconv.Itoa(minWidth) + "×" + strconv.Itoa(minHeight) + ", have " + strconv.Itoa(a.width) + "×" + strconv.Itoa(a.height),
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
	parts = append(parts, "f="+quantity.FormatSig(q.HeatCapacity.Factor(), 2)+" 𝒩="+densityWord(q.DensityProduct))
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
		v := a.chart.Kind()
		return st.Status.Render(" " + strconv.Itoa(len(a.res.Criteria)) + " criteria · chart " + strconv.Itoa(int(v)+1) + "/" +
			strconv.Itoa(int(viewCount)) + ": " + v.String() + " · ? help")
	}
	if a.status.isErr {
		return st.Error.Render(" ✗ " + a.status.text)
	}
	return st.Status.Render(" " + a.status.text)
}
