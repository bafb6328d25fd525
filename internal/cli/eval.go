package cli

import (
	"fmt"
	"io"
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
	if err := f.parse(e); err != nil {
		return err
	}
	if err := checkFormat(*format, "text", "json"); err != nil {
		return err
	}
	sc, err := sf.evaluate(e)
	if err != nil {
		return err
	}
	if *format == "json" {
		return writeEvalJSON(e.stdout, sc)
	}
	return writeEvalText(e.stdout, sc)
}

func writeEvalJSON(w io.Writer, sc *evaluated) error {
	return report.WriteJSON(w, report.StateDocument(&sc.res, sc.cooling, sc.cf, versionString()))
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

	fmt.Fprintf(&b, "\nCriteria: survives and grows when τ_cool/τ_dyn < α (χ/100)^β\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  id\ttest\tratio\tlimit\tr_crit\tmargin\tverdict\tnotes")
	unverified, outside := false, false
	for i := range r.Criteria {
		c, o := &r.Criteria[i], r.Outcomes[i]
		marks := ""
		if !c.Verified {
			marks += " *"
			unverified = true
		}
		if !o.InRange() {
			marks += " ! " + strings.Join(o.Leaves.Names(), ",")
			outside = true
		}
		test := c.Cool.Symbol() + "/" + c.Dyn.String()
		limit := quantity.FormatSig(o.Threshold, 3)
		rc := quantity.Format(model.DimLength, float64(o.RCrit))
		if c.Cool == model.CoolNone {
			test, limit, rc = "no cooling", "—", "none"
		}
		verdict := "✗ destroyed"
		if o.Verdict == model.Survives {
			verdict = "✓ survives-and-grows"
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", quantity.Sanitize(c.ID), test, quantity.FormatSig(o.Ratio, 3), limit, rc, quantity.FormatSig(o.Margin, 3), verdict, marks)
	}
	tw.Flush()
	if unverified {
		fmt.Fprintf(&b, "  * constants not verified against the paper; see 'status' in --format json\n")
	}
	if outside {
		fmt.Fprintf(&b, "  ! inputs outside the range the criterion was calibrated on\n")
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
