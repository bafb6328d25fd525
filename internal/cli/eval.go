package cli

import (
	"fmt"
	"io"
	"math"
	"strings"
	"text/tabwriter"

	"cloudwind/internal/safetext"

	"cloudwind/internal/quantity"

	"cloudwind/cooling"
	"cloudwind/internal/report"
	"cloudwind/model"
)

const evalSynopsis = `Usage: cloudwind eval [flags]

Evaluate one cloud-in-wind scenario: every derived quantity (temperatures,
densities, speeds, the cloud-crushing, shear, drag, growth and cooling times,
cooling and shattering lengths) and, for every survival criterion, the ratio
τ_cool/τ_dyn, the threshold radius r_crit, the margin r_cl/r_crit and the
verdict. Criteria whose constants were not checked against their paper are
marked, and so are inputs outside a criterion's calibrated range.`

const evalExamples = `  cloudwind eval
  cloudwind eval --chi 300 --mach 1.5 --pressure 3e3 --radius "10 pc"
  cloudwind eval --radius 0.2kpc --heat-capacity isobaric --density-product n2
  cloudwind eval --cooling powerlaw:4e-22,1e5,-0.7 --format json
  cloudwind eval --criteria my-criteria.toml
  cloudwind eval --scenario my-run.toml --mach 2   # a saved scenario, with one input changed`

func runEval(e *env) error {
	f := newFlagSet("eval", evalSynopsis, evalExamples)
	var sf scenarioFlags
	sf.register(f)
	format := f.fs.String("format", "text", "output format: text or json")
	var spreadSpec string
	var spreadTable tableSettings
	registerCoolingFlags(f, &spreadSpec, &spreadTable, "spread-cooling", "spread-table")
	outcomes := f.fs.String("outcomes", "", "score every criterion against simulation outcomes in FILE (CSV or ECSV; '-' for stdin;\n'demo' for cloudwind's fictional example)")
	if err := f.parse(e); err != nil {
		return err
	}
	if err := checkFormat(*format, "text", "json"); err != nil {
		return err
	}
	if *outcomes == "-" && (sf.scenario == "-" || sf.cooling == "-" || sf.criteria == "-") {
		return usagef("only one input can read standard input; --outcomes - and another '-' were given")
	}
	sc, err := sf.evaluate(e)
	if err != nil {
		return err
	}
	var second model.CoolingFunction
	if f.set("spread-cooling") {
		src, err := resolveCooling(e, "--spread-cooling", spreadSpec, spreadTable)
		if err != nil {
			return err
		}
		if second, err = src.Function(sc.params.Metallicity); err != nil {
			return usagef("--spread-cooling at --metallicity: %v", err)
		}
		sc.spreadName = report.CoolingName(src, second)
	}
	if sc.spreadCases, sc.spread, err = model.ConventionSpread(sc.params, sc.cf, second, sc.criteria); err != nil {
		return err
	}
	if *outcomes != "" {
		if sc.scores, err = scoreOutcomes(e, sc, *outcomes); err != nil {
			return err
		}
	}
	if *format == "json" {
		return writeEvalJSON(e.stdout, sc)
	}
	return writeEvalText(e.stdout, sc)
}

func writeEvalJSON(w io.Writer, sc *evaluated) error {
	doc := report.StateDocument(&sc.res, sc.cooling, sc.cf, versionString())
	doc["convention_spread"] = report.SpreadDocument(sc.spreadCases, sc.spread, sc.criteria)
	if sc.scores != nil {
		doc["outcomes"] = scoresJSON(sc)
	}
	return report.WriteJSON(w, doc)
}

// finite returns v, or nil (JSON null) when v is NaN or ±Inf.
func finite(v float64) any { return report.JSONNumber(v) }

// coolingName names the cooling function in use.
func coolingName(src *coolingSource, cf model.CoolingFunction) string {
	return report.CoolingName(src, cf)
}

// coolingJSON describes the cooling function in use for JSON output.
func coolingJSON(src *coolingSource, cf model.CoolingFunction) map[string]any {
	return report.CoolingDocument(src, cf)
}

func writeEvalText(w io.Writer, sc *evaluated) error {
	r := &sc.res
	q := r.Params
	var b strings.Builder
	switch {
	case sc.file != "" && sc.name != "":
		fmt.Fprintf(&b, "Scenario %q (%s)\n", sanitizeArg(sc.name), sanitizeArg(sc.file))
	case sc.file != "":
		fmt.Fprintf(&b, "Scenario (%s)\n", sanitizeArg(sc.file))
	default:
		fmt.Fprintf(&b, "Scenario\n")
	}
	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	row := func(cells ...string) { fmt.Fprintln(tw, "  "+strings.Join(cells, "\t")) }
	row("χ (density contrast)", quantity.Number(model.Dimensionless, q.Chi))
	row("Mach number", quantity.Number(model.Dimensionless, q.Mach))
	row("P/k_B", quantity.Format(model.DimPressure, float64(q.Pressure)))
	row("T_cl", quantity.Format(model.DimTemperature, float64(q.TCloud)))
	row("r_cl", quantity.Format(model.DimLength, float64(q.RCloud)))
	zNote := ""
	if !sc.cooling.ZDependent {
		zNote = "  (this cooling function does not depend on Z)"
	}
	row("Z", quantity.Format(model.DimMetallicity, q.Metallicity)+zNote)
	row("γ, μ_cl, μ_hot", fmt.Sprintf("%s, %s, %s", quantity.FormatSig(q.Gamma, 4), quantity.FormatSig(q.MuCold, 4), quantity.FormatSig(q.MuHot, 4)))
	row("X (hydrogen)", fmt.Sprintf("%s  (%s)", quantity.FormatSig(q.HydrogenFraction, 4), q.Mixture.Name))
	if tf, ok := q.Floor(); ok {
		row("T_floor", quantity.Format(model.DimTemperature, float64(tf)))
	} else {
		row("T_floor", "none (Λ applies wherever the cooling function has values)")
	}
	row("convention", conventionText(q))
	row("cooling", coolingName(sc.cooling, sc.cf))
	if p, ok := sc.cf.(*cooling.PowerLaw); ok {
		m := p.Meta()
		lo, hi := p.ValidRange()
		row("", fmt.Sprintf("per %s in the source; tabulated %s–%s; y = %s", m.Normalisation.Symbol(),
			quantity.Format(model.DimTemperature, float64(lo)), quantity.Format(model.DimTemperature, float64(hi)), quantity.FormatSig(m.HeliumRatio, 3)))
		for _, w := range m.Warnings {
			row("", "warning: "+quantity.Sanitize(w))
		}
	}
	tw.Flush()

	fmt.Fprintf(&b, "\nDerived\n")
	dt := report.Table{Indent: "  ", Wrap: []bool{false, false, true, true}}
	for _, qt := range model.Quantities() {
		dt.Row(qt.Symbol, quantity.Format(qt.Dim, qt.Value(&r.State)), qt.Formula, qt.Source)
	}
	b.WriteString(dt.String())
	// The growth model and its sensitivity to its one choice.
	var alt []string
	for _, k := range model.MixCoolingKinds() {
		alt = append(alt, fmt.Sprintf("%s %s t_cc", k, quantity.FormatSig(float64(r.GrowthTimeWith(k)/r.TCC), 3)))
	}
	fmt.Fprintf(&b, "\nGrowth model: v_mix, t_grow and l_cool,cl use %s (--mix-cooling %s)", q.MixCooling.Symbol(), q.MixCooling)
	if q.MixCooling == model.DefaultMixCooling {
		fmt.Fprintf(&b, ", %s", model.MixCoolingReason)
	}
	fmt.Fprintf(&b, ".\n  t_grow under each choice: %s\n", strings.Join(alt, ", "))

	fmt.Fprintf(&b, "\nCriteria: survives and grows when τ_X/τ_dyn < α (χ/100)^β\n")
	ct := report.Table{Indent: "  ", Wrap: []bool{true, true, true, false, true}, MinWidths: []int{16, 21, 14, 0, 20}}
	ct.Row("criterion", "test: ratio < limit", "r_crit (range)", "margin", "verdict")
	unverified, outside, depends, third := false, false, false, false
	for i := range r.Criteria {
		c, o := &r.Criteria[i], r.Outcomes[i]
		marks := ""
		if !c.Verified {
			marks += "*"
			unverified = true
		}
		if o.DependsOnConstant {
			marks += "~"
			depends = true
		}
		if !o.InRange() {
			marks += " !" + strings.Join(o.Leaves.Names(), ",")
			outside = true
		}
		if c.HasThirdOutcome() {
			third = true
		}
		test := c.Cool.Symbol() + "/" + c.Dyn.String()
		limit := quantity.FormatSig(o.Threshold, 3)
		rc := quantity.Format(model.DimLength, float64(o.RCrit))
		if o.RCritLow != o.RCritHigh && o.HasThreshold() {
			rc += " (" + quantity.Number(model.DimLength, float64(o.RCritLow)) + "–" + quantity.Format(model.DimLength, float64(o.RCritHigh)) + ")"
		}
		if c.Cool == model.CoolNone {
			test, limit, rc = "no cooling", "—", "none"
		}
		cmp := test + " = " + quantity.FormatSig(o.Ratio, 3) + " < " + limit
		if c.Cool == model.CoolNone {
			cmp = test
		}
		ct.Row(quantity.Sanitize(c.Label), cmp, rc, quantity.FormatSig(o.Margin, 3), verdictWord(o.Verdict)+" "+marks)
	}
	b.WriteString(ct.String())
	if unverified {
		fmt.Fprintf(&b, "  * constant not verified against the paper: the range is r_crit with α ×/÷ the uncertainty factor (2 by default)\n")
	}
	if depends {
		fmt.Fprintf(&b, "  ~ the verdict depends on the constant: r_cl lies inside that range\n")
	}
	if outside {
		fmt.Fprintf(&b, "  ! inputs outside the range the criterion was calibrated on\n")
	}
	if third {
		fmt.Fprintf(&b, "  Farber & Gronke 2022 has a third outcome: a cloud colder than 10⁴ K can be transformed entirely to 10⁴ K gas\n")
	}
	// The convention spread: r_crit under every f × 𝒩 (× cooling function).
	n := len(sc.spreadCases)
	what := "f = 3/2 or 5/2 × 𝒩 = n_H², n² or n_e n_i"
	if sc.spreadName != "" {
		what += ", with " + sc.cooling.Desc + " and with " + sc.spreadName
	}
	fmt.Fprintf(&b, "\nConvention spread (%s: %d cases)\n", what, n)
	st := report.Table{Indent: "  ", Wrap: []bool{true, false, true}, MinWrap: 20}
	for i := range r.Criteria {
		sp := sc.spread[i]
		span := "no threshold"
		if !math.IsInf(float64(sp.RCritMin), 1) {
			span = quantity.Number(model.DimLength, float64(sp.RCritMin)) + "–" + quantity.Format(model.DimLength, float64(sp.RCritMax))
		}
		st.Row(quantity.Sanitize(r.Criteria[i].Label), span, report.SpreadSummary(r.Criteria[i], sp, n))
	}
	b.WriteString(st.String())
	if sc.scores != nil {
		writeScoresText(&b, sc)
	}
	if len(r.Cautions) > 0 {
		fmt.Fprintf(&b, "\nCautions\n")
		for _, c := range r.Cautions {
			fmt.Fprintf(&b, "  - %s\n", c.Message)
		}
	}
	return writeTrimmed(w, b.String())
}

// writeTrimmed writes text for a terminal: each line through the one
// sanitiser (text from criteria files, tables and file names cannot act on
// the terminal), with the spaces that tabwriter leaves at line ends
// removed, and wrapped to report.TextWidth columns.
func writeTrimmed(w io.Writer, text string) error {
	lines := strings.Split(text, "\n")
	for i, l := range lines {
		lines[i] = strings.TrimRight(safetext.Terminal(l), " ")
	}
	_, err := io.WriteString(w, report.FitLines(strings.Join(lines, "\n"), report.TextWidth))
	return err
}

// conventionText states the cooling-time convention in words.
func conventionText(q model.Params) string {
	f := "f = 3/2 (isochoric)"
	if q.HeatCapacity == model.Isobaric {
		f = "f = 5/2 (isobaric)"
	}
	n := "𝒩 = n_H²"
	if q.DensityProduct == model.N2 {
		n = "𝒩 = n² (total particles)"
	}
	return "t_cool = f n k_B T/(𝒩 Λ) with " + f + ", " + n
}

// verdictWord writes a verdict for text output, never by colour alone.
func verdictWord(v model.Verdict) string {
	switch v {
	case model.Survives:
		return "✓ survives-and-grows"
	case model.Transformed:
		return "◐ transformed"
	}
	return "✗ destroyed"
}
