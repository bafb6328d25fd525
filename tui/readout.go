package tui

import (
	"fmt"
	"strings"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// derivedKeys are the quantities of the derived pane, in order (keys of
// model.Quantities).
var derivedKeys = []string{
	"t_hot", "t_mix", "t_minmix", "n_hot", "v_wind", "t_cc", "t_shear",
	"t_cool_hot", "t_cool_mix", "t_cool_minmix", "t_cool_cold", "t_drag", "t_grow",
	"l_shatter", "mass_cloud", "t_cool_hot_per_t_cc",
}

// derivedRows returns the derived quantities shown, in order.
func derivedRows() []model.Quantity {
	all := map[string]model.Quantity{}
	for _, q := range model.Quantities() {
		all[q.Key] = q
	}
	out := make([]model.Quantity, 0, len(derivedKeys))
	for _, k := range derivedKeys {
		out = append(out, all[k])
	}
	return out
}

// tableStatus says whether the cooling table covers a temperature
// quantity: "", "above table" or "below table".
func tableStatus(cf model.CoolingFunction, key string, s *model.State) string {
	p, ok := cf.(*cooling.PowerLaw)
	if !ok {
		return ""
	}
	var t model.Temperature
	switch key {
	case "t_hot":
		t = s.THot
	case "t_mix":
		t = s.TMix
	case "t_minmix":
		t = s.TMinMix
	default:
		return ""
	}
	switch p.Classify(t) {
	case cooling.AboveTable:
		return "above table"
	case cooling.BelowTable:
		return "below table"
	}
	return ""
}

// derivedLines renders the derived pane's body: symbol, value with unit,
// and in compare mode the ratio B/A.
func (a *App) derivedLines(w, h int) []string {
	st := &a.styles
	rows := a.derived
	lines := make([]string, 0, len(rows))
	symW := 18
	if w < 36 {
		symW = 16
	}
	for i, q := range rows {
		v := q.Value(&a.res.State)
		val := quantity.Format(q.Dim, v)
		cell := st.Value.Render(val)
		if a.pin != nil {
			va := q.Value(&a.pin.res.State)
			if r := v / va; isFiniteValue(r) && va != 0 {
				cell += st.Dim.Render("  B/A " + quantity.FormatSig(r, 3))
			}
		}
		if note := tableStatus(a.cur.cf, q.Key, &a.res.State); note != "" {
			cell += " " + st.OutOfTable.Render("⚠ "+note)
		}
		label := fit(q.Symbol, symW)
		if a.focus == focusDerived && i == a.derivedSel {
			label = st.Selected.Render(fit("▸ "+q.Symbol, symW))
		} else {
			label = st.Label.Render(fit("  "+q.Symbol, symW))
		}
		lines = append(lines, label+cell)
	}
	// The cold-gas line carries the caution when T_cl leaves the table.
	for _, c := range a.res.Cautions {
		lines = append(lines, st.Warning.Render("⚠ "+quantity.Sanitize(c.Message)))
	}
	return scrollWindow(lines, a.derivedSel, h, a.focus == focusDerived)
}

// scrollWindow keeps the selected line visible in h lines.
func scrollWindow(lines []string, sel, h int, follow bool) []string {
	if len(lines) <= h || h <= 0 {
		return lines
	}
	start := 0
	if follow && sel >= h {
		start = sel - h + 1
	}
	end := min(len(lines), start+h)
	out := lines[start:end]
	if end < len(lines) {
		out[len(out)-1] = fmt.Sprintf("  … %d more (tab to this pane, ↓)", len(lines)-end+1)
	}
	return out
}

// verdictText is the verdict as glyph and word, never colour alone.
func (a *App) verdictText(v model.Verdict, short bool) string {
	st := &a.styles
	if v == model.Survives {
		if short {
			return st.Survives.Render("✓ grows")
		}
		return st.Survives.Render("✓ survives")
	}
	if short {
		return st.Destroyed.Render("✗ dest.")
	}
	return st.Destroyed.Render("✗ destroyed")
}

// criteriaLines renders the criteria table: ratio, limit, r_crit, margin
// and verdict per criterion; with a pinned A, r_crit of A and B, B/A and
// the verdicts A→B. Marks: * constants not verified, ! inputs outside the
// calibrated range.
func (a *App) criteriaLines(w int) []string {
	st := &a.styles
	compact := w < 70
	idW := 21
	if compact {
		idW = 17
	}
	var head string
	switch {
	case a.pin != nil:
		head = fit("  criterion", idW) + fmt.Sprintf("%-11s%-11s%-7s%s", "r_crit A", "r_crit B", "B/A", "A → B")
	case compact:
		head = fit("  criterion", idW) + fmt.Sprintf("%-11s%-8s%s", "r_crit", "margin", "verdict")
	default:
		head = fit("  criterion", idW) + fmt.Sprintf("%-9s%-7s%-11s%-8s%s", "ratio", "limit", "r_crit", "margin", "verdict")
	}
	lines := []string{st.Dim.Render(head)}
	anyUnverified, anyOut := false, false
	for i := range a.res.Criteria {
		c, o := &a.res.Criteria[i], a.res.Outcomes[i]
		name := fit(quantity.Sanitize(c.ID), idW-3) + " "
		if a.focus == focusCriteria && i == a.critSel {
			name = st.Selected.Render("▸ " + name)
		} else {
			name = st.Label.Render("  " + name)
		}
		rc := "none"
		if o.HasThreshold() {
			rc = quantity.Format(model.DimLength, float64(o.RCrit))
		}
		var row string
		switch {
		case a.pin != nil:
			oa := a.pin.res.Outcomes[i]
			rca := "none"
			if oa.HasThreshold() {
				rca = quantity.Format(model.DimLength, float64(oa.RCrit))
			}
			ratio := "—"
			if o.HasThreshold() && oa.HasThreshold() {
				ratio = quantity.FormatSig(float64(o.RCrit/oa.RCrit), 3)
			}
			row = name + fit(rca, 10) + " " + fit(rc, 10) + " " + fit(ratio, 6) + " " +
				verdictGlyph(oa.Verdict) + "→" + a.verdictText(o.Verdict, true)
		case compact:
			row = name + fit(rc, 10) + " " + fit(quantity.FormatSig(o.Margin, 3), 7) + " " + a.verdictText(o.Verdict, true)
		default:
			limit := quantity.FormatSig(o.Threshold, 3)
			if c.Cool == model.CoolNone {
				limit = "—"
			}
			row = name + fit(quantity.FormatSig(o.Ratio, 3), 8) + " " + fit(limit, 6) + " " + fit(rc, 10) + " " +
				fit(quantity.FormatSig(o.Margin, 3), 7) + " " + a.verdictText(o.Verdict, false)
		}
		marks := ""
		if !c.Verified {
			marks += st.Unverified.Render(" *")
			anyUnverified = true
		}
		if !o.InRange() {
			marks += st.Warning.Render(" !" + strings.Join(o.Leaves.Names(), ","))
			anyOut = true
		}
		lines = append(lines, row+marks)
	}
	var legend []string
	if anyUnverified {
		legend = append(legend, st.Unverified.Render("*")+" unverified constant")
	}
	if anyOut {
		legend = append(legend, st.Warning.Render("!")+" outside calibrated range")
	}
	legend = append(legend, "d details")
	lines = append(lines, st.Dim.Render(strings.Join(legend, " · ")))
	return lines
}

// verdictGlyph is a one-glyph verdict for compact cells.
func verdictGlyph(v model.Verdict) string {
	if v == model.Survives {
		return "✓"
	}
	return "✗"
}

// inputLines renders the inputs pane.
func (a *App) inputLines(w int) []string {
	st := &a.styles
	var lines []string
	coolName := report.CoolingName(a.cur.cooling, a.cur.cf)
	for i, in := range a.in.visible() {
		label := fit(in.label, 9)
		val := valueText(in, &a.cur.params, coolName)
		if a.focus == focusInputs && i == a.in.selected {
			lines = append(lines, st.Selected.Render("▸ "+label)+st.Value.Render(val))
		} else {
			lines = append(lines, st.Label.Render("  "+label)+st.Value.Render(val))
		}
		if a.in.editing && i == a.in.selected {
			lines = append(lines, "  "+a.in.edit.View())
		}
	}
	more := "a: more inputs"
	if a.in.advanced {
		more = "a: fewer inputs"
	}
	lines = append(lines, st.Dim.Render(more))
	return lines
}
