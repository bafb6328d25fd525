package tui

import (
	"fmt"
	"math"
	"strings"

	"github.com/charmbracelet/x/ansi"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// detailsLines explains the focused item: an input, a derived quantity or
// a criterion, with its formula, citation, convention and verification
// status.
func (a *App) detailsLines(w int) (title string, lines []string) {
	st := &a.styles
	wrap := func(label, text string) {
		lines = append(lines, wrapText(st.Dim.Render(label)+" ", quantity.Sanitize(text), w)...)
	}
	conv := fmt.Sprintf("f = %s (%s), 𝒩 = %s", quantity.FormatSig(a.cur.params.HeatCapacity.Factor(), 2), a.cur.params.HeatCapacity, densityWord(a.cur.params.DensityProduct))
	switch a.focus {
	case focusInputs:
		in := a.in.current()
		title = "input " + in.label
		wrap("meaning:", in.about)
		if !in.isEnum() && in.field != "cooling" {
			wrap("value:", valueText(in, &a.cur.params, ""))
			step := fmt.Sprintf("%s per step (×10 with shift)", quantity.FormatSig(in.fine, 2))
			if in.log {
				step = fmt.Sprintf("×%s per step (%s dex; ×10 with shift)", quantity.FormatSig(pow10(in.fine), 3), quantity.FormatSig(in.fine, 2))
			}
			wrap("step:", step)
			wrap("typing:", "enter, then a number with an optional unit, e.g. "+typingExample(in.dim))
		}
		if in.field == "cooling" {
			a.coolingDetails(wrap)
		}
	case focusDerived:
		q := a.derived[a.derivedSel]
		title = q.Symbol + " — " + q.Name
		wrap("value:", quantity.Format(q.Dim, q.Value(&a.res.State)))
		wrap("formula:", q.Formula)
		wrap("source:", q.Source)
		wrap("convention:", conv)
		if note := tableStatus(a.cur.cf, q.Key, &a.res.State); note != "" {
			wrap("caution:", "this temperature lies "+note+" of the cooling function")
		}
	case focusCriteria:
		c, o := &a.res.Criteria[a.critSel], a.res.Outcomes[a.critSel]
		title = quantity.Sanitize(c.Label) + " (" + quantity.Sanitize(c.ID) + ")"
		wrap("criterion:", "survives and grows when "+c.Formula())
		wrap("citation:", c.Citation.String())
		if c.Citation.Equation == "" {
			wrap("equation:", "not read from the paper; no equation number is cited")
		}
		verified := "verified against the paper"
		if !c.Verified {
			verified = "NOT verified"
		}
		wrap("constants:", fmt.Sprintf("α = %s, β = %s — %s: %s", quantity.FormatSig(c.Alpha, 3), quantity.FormatSig(c.Beta, 3), verified, c.Status))
		if c.Cool != model.CoolNone {
			wrap("now:", fmt.Sprintf("%s/%s = %s (limit %s), r_crit = %s, margin r_cl/r_crit = %s → %s",
				c.Cool.Symbol(), c.Dyn, quantity.FormatSig(o.Ratio, 3), quantity.FormatSig(o.Threshold, 3),
				quantity.Format(model.DimLength, float64(o.RCrit)), quantity.FormatSig(o.Margin, 3), o.Verdict))
		}
		wrap("calibrated:", rangeText(c.Range))
		if !o.InRange() {
			wrap("caution:", "the inputs leave the calibrated range in "+strings.Join(o.Leaves.Names(), ", "))
		}
		wrap("convention:", conv+" (the paper's own convention is not confirmed)")
		wrap("physics:", c.Note)
	}
	lines = append(lines, "", st.Help.Render("↑/↓ next item · d or esc close"))
	return title, lines
}

// coolingDetails describes the cooling function in use.
func (a *App) coolingDetails(wrap func(label, text string)) {
	wrap("in use:", report.CoolingName(a.cur.cooling, a.cur.cf))
	p, ok := a.cur.cf.(*cooling.PowerLaw)
	if !ok {
		wrap("form:", "analytic, per n_H²")
		return
	}
	m := p.Meta()
	lo, hi := p.ValidRange()
	wrap("source:", m.Citation)
	wrap("table:", fmt.Sprintf("%s – %s, stored per n_H² (source per %s), He/H = %s", quantity.Format(model.DimTemperature, float64(lo)),
		quantity.Format(model.DimTemperature, float64(hi)), m.Normalisation.Symbol(), quantity.FormatSig(m.HeliumRatio, 3)))
	for _, c := range m.Caveats {
		wrap("caveat:", c)
	}
	for _, w := range m.Warnings {
		wrap("warning:", w)
	}
}

func densityWord(d model.DensityProduct) string {
	if d == model.N2 {
		return "n² (total particles)"
	}
	return "n_H²"
}

func typingExample(d model.Dimension) string {
	switch d {
	case model.DimLength:
		return `"30 pc", "0.2 kpc", "1e19 cm"`
	case model.DimTemperature:
		return `"2e4", "1 keV"`
	case model.DimPressure:
		return `"3e3", "1e-13 erg cm-3"`
	}
	return `"300", "1.5e2"`
}

func pow10(x float64) float64 { return math.Pow(10, x) }

// visibleLen is the width of s in cells, ignoring styling.
func visibleLen(s string) int { return ansi.StringWidth(s) }

// rangeText describes a calibrated range.
func rangeText(c model.Calibration) string {
	var parts []string
	add := func(name string, i model.Interval, unit string) {
		if i.IsUnbounded() {
			return
		}
		parts = append(parts, fmt.Sprintf("%s %s–%s%s", name, quantity.FormatSig(i.Min, 3), quantity.FormatSig(i.Max, 3), unit))
	}
	add("χ", c.Chi, "")
	add("M", c.Mach, "")
	add("T_cl", c.TCloud, " K")
	if len(parts) == 0 {
		return "no limits known (" + c.Status + ")"
	}
	return strings.Join(parts, ", ") + " (" + c.Status + ")"
}

// wrapText wraps text after a styled label to width w (label on the first
// line, continuation lines indented).
func wrapText(label, text string, w int) []string {
	words := strings.Fields(text)
	var lines []string
	line := label
	indent := "  "
	for _, wd := range words {
		if visibleLen(line)+len([]rune(wd))+1 > w && visibleLen(line) > len(indent) {
			lines = append(lines, line)
			line = indent
		}
		if !strings.HasSuffix(line, " ") && line != indent {
			line += " "
		}
		line += wd
	}
	return append(lines, line)
}
