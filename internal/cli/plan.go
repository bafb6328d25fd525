package cli

import (
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"
	"text/tabwriter"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

const planSynopsis = `Usage: cloudwind plan [scenario flags] [--cells-per-radius N --box LxWxH --run-tcc N --cfl C ...] [--format text|json]

Plan a wind-tunnel simulation of the scenario that can show whether the
cloud survives: the run length in t_cc (from a stated rule unless given),
the box along and across the wind in r_cl (from the cloud's displacement,
integrated with 'cloudwind evolve' physics, plus a tail, unless the frame
tracks the cloud), the cell size, cell and step counts, cell-updates,
core-hours and memory; the wind's cooling time beside the run length, and
resolution warnings with their published sources. --compare adds one plan
per pair of neighbouring threshold radii: where to put r_cl to tell those
criteria apart, and what that costs. Throughput and bytes per cell are
assumptions you should replace with your code's figures.`

const planExamples = `  cloudwind plan --chi 100 --mach 1.5 --radius 10pc
  cloudwind plan --cells-per-radius 32 --tracking --question entrainment --format json
  cloudwind plan --box 120x20x20 --run-tcc 40 --throughput 5e6 --mhd
  cloudwind plan --compare`

func runPlan(e *env) error {
	f := newFlagSet("plan", planSynopsis, planExamples)
	var sf scenarioFlags
	sf.register(f)
	d := model.DefaultPlanSettings()
	var cells float64
	f.float(&cells, "cells-per-radius", d.CellsPerRadius, "cells per cloud radius R = r_cl/Δx")
	box := f.fs.String("box", "auto", "box in r_cl, along × across × across the wind: LxWxH (W = H), or auto")
	var run float64
	f.float(&run, "run-tcc", 0, "run length in t_cc (0: automatic from the question)")
	var cfl float64
	f.float(&cfl, "cfl", d.CFL, "Courant number C in Δt = C Δx/(v_w + c_s,hot)")
	tracking := f.fs.Bool("tracking", false, "the frame follows the cloud (no room needed for its displacement)")
	var throughput float64
	f.float(&throughput, "throughput", d.CellUpdatesPerCoreSecond, "cell-updates per core-second of your code (an assumption by default)")
	var bytes float64
	f.float(&bytes, "bytes-per-cell", d.BytesPerCell, "memory per cell in bytes (an assumption by default)")
	mhd := f.fs.Bool("mhd", false, "magnetohydrodynamics (resolution advice ≥ 64 cells per radius)")
	question := f.fs.String("question", "growth", "what the run must show: growth, entrainment or destruction")
	criterion := f.fs.String("criterion", "gronke-oh-2018", "the criterion whose branch the displacement integration follows")
	compare := f.fs.Bool("compare", false, "add one plan per pair of neighbouring threshold radii")
	format := f.fs.String("format", "text", "output format: text or json")
	if err := f.parse(e); err != nil {
		return err
	}
	var err error
	// Only what the user gave is set; the rest stays zero, so that the
	// plan reports cloudwind's defaults as defaults, with their status.
	given := func(name string, v float64) float64 {
		if f.set(name) {
			return v
		}
		return 0
	}
	// A value given is checked as given, 0 included (model.CheckField).
	for _, c := range []struct {
		name, field string
		v           float64
	}{{"cells-per-radius", model.FieldCellsPerRadius, cells}, {"cfl", model.FieldCFL, cfl},
		{"throughput", model.FieldThroughput, throughput}, {"bytes-per-cell", model.FieldBytesPerCell, bytes}} {
		if !f.set(c.name) {
			continue
		}
		if err := model.CheckField(c.field, c.v); err != nil {
			var fe *model.FieldError
			errors.As(err, &fe)
			return usagef("--%s: %s", c.name, fe.Reason)
		}
	}
	set := model.PlanSettings{CellsPerRadius: given("cells-per-radius", cells), RunTcc: run, CFL: given("cfl", cfl), Tracking: *tracking,
		CellUpdatesPerCoreSecond: given("throughput", throughput), BytesPerCell: given("bytes-per-cell", bytes), MHD: *mhd}
	if set.Question, err = model.ParseQuestion(*question); err != nil {
		return usagef("--question: %v", err)
	}
	if *box != "auto" {
		if set.BoxAlongRcl, set.BoxAcrossRcl, err = parseBox(*box); err != nil {
			return usagef("--box: %v", err)
		}
	}
	if err := set.Validate(); err != nil {
		var fe *model.FieldError
		if errors.As(err, &fe) {
			return usagef("--%s: %s", planFlagName(fe.Field), fe.Reason)
		}
		return usagef("%v", err)
	}
	if err := checkFormat(*format, "text", "json"); err != nil {
		return err
	}
	sc, err := sf.evaluate(e)
	if err != nil {
		return err
	}
	sel, err := selectCriteria(sc.criteria, *criterion)
	if err != nil {
		return err
	}
	disp := model.EvolveDisplacement(sc.cf, &sel[0], model.EvolveSettings{})
	pl, err := model.MakePlanWith(&sc.res.State, set, disp)
	if err != nil {
		return err
	}
	var cmp []model.PlanComparison
	if *compare {
		if cmp, err = model.ComparePlans(sc.params, sc.cf, sc.criteria, set, disp); err != nil {
			return err
		}
	}
	if *format == "json" {
		return writePlanJSON(e.stdout, &pl, cmp, set)
	}
	return writePlanText(e.stdout, &sc.res, &pl, cmp, set, report.CoolingName(sc.cooling, sc.cf))
}

// parseBox parses LxW or LxWxH (W = H) in r_cl.
func parseBox(s string) (along, across float64, err error) {
	parts := strings.Split(strings.ToLower(s), "x")
	if len(parts) != 2 && len(parts) != 3 {
		return 0, 0, fmt.Errorf("want LxWxH in cloud radii, e.g. 120x20x20 (got %q)", sanitizeArg(s))
	}
	var v [3]float64
	for i, p := range parts {
		if v[i], err = strconv.ParseFloat(strings.TrimSpace(p), 64); err != nil || !(v[i] > 0) || v[i] > 1e6 {
			return 0, 0, fmt.Errorf("%q is not a positive length in r_cl", sanitizeArg(p))
		}
	}
	if len(parts) == 3 && v[1] != v[2] {
		return 0, 0, fmt.Errorf("the planner takes a square cross-section: W and H must be equal (got %s and %s)", model.FormatNumber(v[1], 6), model.FormatNumber(v[2], 6))
	}
	return v[0], v[1], nil
}

// planFlagName maps a PlanSettings field key to its flag.
func planFlagName(field string) string {
	switch field {
	case "cell_updates_per_core_second":
		return "throughput"
	case "box_along_rcl", "box_across_rcl":
		return "box"
	}
	return strings.ReplaceAll(strings.TrimSuffix(field, "_rcl"), "_", "-")
}

// planJSON describes a plan with the field names.
func planJSON(pl *model.Plan) map[string]any {
	var warns []map[string]any
	for _, w := range pl.Warnings {
		warns = append(warns, map[string]any{"code": string(w.Code), "level": w.Level.String(), "message": w.Message, "source": w.Source})
	}
	if warns == nil {
		warns = []map[string]any{}
	}
	return map[string]any{
		"radius_pc":                   float64(pl.RCloud / model.Parsec),
		"cells_per_radius":            pl.Settings.CellsPerRadius,
		"dx_pc":                       float64(pl.Dx / model.Parsec),
		"box_rcl":                     []float64{pl.BoxAlongRcl, pl.BoxAcrossRcl, pl.BoxAcrossRcl},
		"box_rule":                    pl.BoxRule,
		"displacement_rcl":            finite(pl.DisplacementRcl),
		"cells":                       pl.Cells,
		"dt_myr":                      float64(pl.Dt / model.Megayear),
		"steps":                       pl.Steps,
		"cell_updates":                pl.CellUpdates,
		"core_hours":                  pl.CoreHours,
		"memory_bytes":                pl.MemoryBytes,
		"run_tcc":                     pl.RunTcc,
		"run_myr":                     float64(pl.RunTime / model.Megayear),
		"run_rule":                    pl.RunRule,
		"t_cool_hot_tcc":              finite(pl.TCoolHotTcc),
		"t_grow_tcc":                  finite(pl.TGrowTcc),
		"t_drag_tcc":                  finite(pl.TDragTcc),
		"shatter_cells":               finite(pl.ShatterCells),
		"advised_cells_per_radius":    finite(pl.AdvisedCellsPerRadius),
		"advised_cells_per_radius_by": pl.AdvisedSource,
		"warnings":                    warns,
	}
}

func writePlanJSON(w io.Writer, pl *model.Plan, cmp []model.PlanComparison, set model.PlanSettings) error {
	doc := planJSON(pl)
	doc["schema"] = "cloudwind.plan/1"
	doc["version"] = versionString()
	var as []map[string]any
	for _, a := range planAssumptions(set) {
		as = append(as, map[string]any{"setting": a.Field, "value": a.Value, "unit": a.Unit, "default": a.Default, "status": a.Status, "note": a.Note})
	}
	doc["assumptions"] = as
	if cmp != nil {
		var rows []map[string]any
		for i := range cmp {
			c := &cmp[i]
			rows = append(rows, map[string]any{
				"between_pc": []float64{float64(c.RLower / model.Parsec), float64(c.RUpper / model.Parsec)},
				"lower_ids":  c.LowerIDs, "upper_ids": c.UpperIDs, "survive": c.Survive, "destroy": c.Destroy,
				"plan": planJSON(&c.Plan),
			})
		}
		doc["comparison"] = rows
	}
	return report.WriteJSON(w, doc)
}

func writePlanText(w io.Writer, res *model.Result, pl *model.Plan, cmp []model.PlanComparison, set model.PlanSettings, cooling string) error {
	var b strings.Builder
	q := res.Params
	fmt.Fprintf(&b, "Simulation plan: χ = %s, M = %s, r_cl = %s, question: %s; cooling: %s\n\n", quantity.FormatSig(q.Chi, 3), quantity.FormatSig(q.Mach, 3),
		quantity.Format(model.DimLength, float64(q.RCloud)), pl.Settings.Question, cooling)
	b.WriteString(report.PlanText(pl))
	if cmp != nil {
		fmt.Fprintf(&b, "\nTo tell the criteria apart (one run per pair of neighbouring thresholds)\n")
		tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "  r_cl\tbetween\tsurvive\tdestroyed\trun\tcells\tcore-hours")
		for i := range cmp {
			c := &cmp[i]
			fmt.Fprintf(tw, "  %s\t%s–%s\t%s\t%s\t%s t_cc\t%s\t%s\n", quantity.Format(model.DimLength, float64(c.RCloud)),
				quantity.Format(model.DimLength, float64(c.RLower)), quantity.Format(model.DimLength, float64(c.RUpper)),
				strings.Join(c.Survive, ","), strings.Join(c.Destroy, ","), quantity.FormatSig(c.Plan.RunTcc, 3),
				quantity.FormatSig(c.Plan.Cells, 3), quantity.FormatSig(c.Plan.CoreHours, 3))
		}
		tw.Flush()
	}
	fmt.Fprintf(&b, "\nAssumptions\n")
	at := report.Table{Indent: "  ", Wrap: []bool{false, false, false, true}}
	for _, a := range planAssumptions(set) {
		val := quantity.FormatSig(a.Value, 3)
		if a.Value == 0 {
			val = "auto"
		}
		at.Row(a.Field, val+" "+a.Unit, a.Status, a.Note)
	}
	b.WriteString(at.String())
	return writeTrimmed(w, b.String())
}

// planAssumptions lists the settings with their status. The displacement
// row is left out: the command integrates it (model.EvolveDisplacement),
// and a plan that had to fall back says so in its warnings.
func planAssumptions(set model.PlanSettings) []model.PlanAssumption {
	var out []model.PlanAssumption
	for _, a := range set.Assumptions() {
		if a.Field != "displacement" {
			out = append(out, a)
		}
	}
	return out
}
