package tui

import (
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// View composes the frame: header, the panes in the layout of the window
// (layout.go), an overlay if one is open, the status line and the key
// hint.
func (a *App) View() string {
	if a.width == 0 || a.height == 0 {
		return ""
	}
	if a.tooSmall() {
		return strings.Join(a.tooSmallFrame(), "\n")
	}
	st := &a.styles
	l := a.computeLayout()
	var body []string
	switch {
	case l.zoom:
		body = splitLines(a.chart.View())
	case l.stacked:
		left := a.in.View()
		if a.focus == focusDerived {
			left = a.derived.View()
		}
		body = append(splitLines(a.chart.View()), beside(splitLines(left), splitLines(a.criteria.View()))...)
	default:
		left := append(splitLines(a.in.View()), splitLines(a.derived.View())...)
		right := append(splitLines(a.chart.View()), splitLines(a.criteria.View())...)
		body = beside(left, right)
	}
	switch {
	case a.prompt.Open():
		body = st.overlay(body, splitLines(a.prompt.View()), a.width)
	case a.help.Open():
		body = st.overlay(body, splitLines(a.help.View()), a.width)
	case a.details.Open():
		body = st.overlay(body, splitLines(a.details.View()), a.width)
	}
	out := make([]string, 0, a.height)
	out = append(out, st.fit(a.header(), a.width))
	out = append(out, st.block(body, a.width, l.bodyH)...)
	out = append(out, st.fit(a.statusLine(), a.width), st.fit(st.Help.Render(a.help.ShortView()), a.width))
	return strings.Join(out, "\n")
}

// tooSmallFrame is the frame for a window below the minimum.
func (a *App) tooSmallFrame() []string {
	st := &a.styles
	msg := []string{
		"terminal too small",
		st.T("need " + strconv.Itoa(minWidth) + "×" + strconv.Itoa(minHeight) + ", have " + strconv.Itoa(a.width) + "×" + strconv.Itoa(a.height)),
		"enlarge it, or q to quit",
	}
	lines := make([]string, a.height)
	top := max(0, (a.height-len(msg))/2)
	for i := range lines {
		s := ""
		if k := i - top; k >= 0 && k < len(msg) {
			s = strings.Repeat(" ", max(0, (a.width-len([]rune(msg[k])))/2)) + msg[k]
		}
		lines[i] = st.fit(s, a.width)
	}
	return lines
}

// header names the program, scenario, cooling function and convention.
func (a *App) header() string {
	st := &a.styles
	parts := []string{st.Title.Render("cloudwind")}
	if a.scenario != "" {
		parts = append(parts, st.T(quantity.Sanitize(a.scenario)))
	}
	q := a.cur.params
	parts = append(parts, st.T("f="+quantity.FormatSig(q.HeatCapacity.Factor(), 2)+" 𝒩="+densityWord(q.DensityProduct)))
	parts = append(parts, st.T(report.CoolingName(a.cur.cooling, a.cur.cf)))
	if a.pin != nil {
		parts = append(parts, st.Warning.Render("compare: A pinned"))
	}
	return " " + strings.Join(parts, st.Dim.Render(st.sep()))
}

// statusLine shows the last message or error; with none, what is on
// screen, and in the full-screen chart the selected input and how many
// criteria predict survival, which the hidden panes would show.
func (a *App) statusLine() string {
	st := &a.styles
	switch {
	case a.in.Editing():
		return st.Status.Render(" " + st.T(a.in.EditHint()))
	case a.status.text != "":
		if a.status.isErr {
			return st.Error.Render(" " + st.errMark() + " " + a.status.text)
		}
		return st.Status.Render(" " + a.status.text)
	case a.zoom:
		in := a.in.Current()
		res := a.windResult()
		survive, transformed, n := 0, 0, 0
		for i := range res.Criteria {
			if res.Criteria[i].Cool == model.CoolNone {
				continue
			}
			n++
			switch res.Outcomes[i].Verdict {
			case model.Survives:
				survive++
			case model.Transformed:
				transformed++
			}
		}
		count := strconv.Itoa(survive) + " of " + strconv.Itoa(n) + " criteria predict survival"
		if transformed > 0 {
			count += ", " + strconv.Itoa(transformed) + " transformed"
		}
		if res != &a.res {
			count += " at launch"
		}
		return st.Status.Render(" " + st.T(in.label+" = "+a.in.ValueText(in)+" (←/→)"+st.sep()+count+st.sep()+"z back"))
	}
	v := a.chart.Kind()
	chart := "chart " + strconv.Itoa(int(v)+1) + "/" + strconv.Itoa(int(viewCount))
	if v == viewOutflow { // the chart's title names it
		return st.Status.Render(" " + st.T(chart+st.sep()+a.outflowStatus()+st.sep()+"? help"))
	}
	chart += ": " + a.chart.Name()
	return st.Status.Render(" " + st.T(strconv.Itoa(len(a.res.Criteria))+" criteria"+st.sep()+chart+st.sep()+"? help"))
}

// outflowStatus is the outflow view's part of the status line: the key
// of the other panel, how many cautions there are and that the wind's
// relations are from memory, with where the details are.
func (a *App) outflowStatus() string {
	other := "c carried cloud"
	if a.chart.Carried() {
		other = "c r_crit vs r"
	}
	where := "tab to chart, d"
	if a.focus == focusChart {
		where = "d"
	}
	cautions := ""
	if o := a.outflowData(); o != nil {
		cautions = a.styles.warnMark() + " " + strconv.Itoa(len(report.OutflowCautions(&o.Wind, &o.Profile))) + " cautions, "
	}
	return other + a.styles.sep() + cautions + "wind from memory: " + where
}
