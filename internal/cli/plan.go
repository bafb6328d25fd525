package cli

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

const planSynopsis = `Usage: cloudwind plan [scenario flags] [--cells-per-radius N --block B --box LxWxH --run-tcc N ...]
                      [--ladder R1,R2,...] [--budget CORE-HOURS] [--format text|json|csv] [-o FILE]

Plan a wind-tunnel simulation of the scenario that can answer its question
(growth, entrainment or destruction), or say why it cannot. The run length
comes from the cloud's own trajectory on the branch of --criterion
(integrated as 'cloudwind evolve' does): until its mass doubles, plus half
again, at least 10 t_cc, never beyond --run-cap (200 t_cc); past the cap,
or when every criterion predicts destruction, the plan says so first, with
the timescale that is too long, and proposes what a run could answer
instead (the destruction time, or the radius at which growth becomes
testable). The box along the wind holds the cloud's displacement, the grid
has whole cells per axis rounded up to multiples of --block, and the cost
(steps, cell-updates, core-hours, memory) follows from those integers.
--ladder gives the same run at several resolutions, for a convergence
study; --compare adds one plan per pair of neighbouring threshold radii.

A campaign: give any of --chi --mach --pressure --t-cloud --radius
--metallicity as a list or range (the grid syntax of 'cloudwind sweep'), and
plan prints one row per run, marks the runs whose criteria disagree (a run
there tells them apart), and totals the core-hours against --budget; -o
writes the rows as CSV or JSON. Throughput and bytes per cell are
assumptions you should replace with your code's figures.`

const planExamples = `  cloudwind plan --chi 100 --mach 1.5 --radius 30pc
  cloudwind plan --radius 30pc --block 16 --ladder 8,16,32,64
  cloudwind plan --cells-per-radius 32 --tracking --question entrainment --format json
  cloudwind plan --radius log:1pc:100pc:5 --mach 1,1.5 --budget 1e5 -o campaign.csv
  cloudwind plan --compare`

// planFlags are the settings of a plan beyond the scenario.
type planFlags struct {
	cells, run, runCap, cfl, throughput, bytes, budget float64
	block                                              int
	box, question, criterion, ladder, format, out      string
	tracking, mhd, compare                             bool
}

func (pf *planFlags) register(f *flagSet) {
	d := model.DefaultPlanSettings()
	f.float(&pf.cells, "cells-per-radius", d.CellsPerRadius, "cells per cloud radius R = r_cl/Δx")
	f.int(&pf.block, "block", d.Block, 1, 4096, "round the cells per axis up to a multiple of this block size (block-structured codes)")
	f.fs.StringVar(&pf.box, "box", "auto", "box in r_cl, along × across × across the wind: LxWxH (W = H), or auto")
	f.float(&pf.run, "run-tcc", 0, "run length in t_cc (0: automatic from the question and the trajectory)")
	f.float(&pf.runCap, "run-cap", d.RunCapTcc, "the longest automatic run in t_cc; past it the plan says the question is not testable")
	f.float(&pf.cfl, "cfl", d.CFL, "Courant number C in Δt = C Δx/(v_w + c_s,hot)")
	f.fs.BoolVar(&pf.tracking, "tracking", false, "the frame follows the cloud (no room needed for its displacement)")
	f.float(&pf.throughput, "throughput", d.CellUpdatesPerCoreSecond, "cell-updates per core-second of your code (an assumption by default)")
	f.float(&pf.bytes, "bytes-per-cell", d.BytesPerCell, "memory per cell in bytes (an assumption by default)")
	f.fs.BoolVar(&pf.mhd, "mhd", false, "magnetohydrodynamics (resolution advice ≥ 64 cells per radius)")
	f.fs.StringVar(&pf.question, "question", "growth", "what the run must show: growth, entrainment or destruction")
	f.fs.StringVar(&pf.criterion, "criterion", "gronke-oh-2018", "the criterion whose branch the trajectory follows")
	f.fs.BoolVar(&pf.compare, "compare", false, "add one plan per pair of neighbouring threshold radii")
	f.fs.StringVar(&pf.ladder, "ladder", "", "a resolution ladder: the same run at each R of a comma list, e.g. 8,16,32,64")
	f.float(&pf.budget, "budget", 0, "core-hours available: a campaign's total is set against it (0: no budget)")
	f.fs.StringVar(&pf.format, "format", "text", "output format: text or json; csv too for a campaign (default: from -o)")
	f.fs.StringVar(&pf.out, "o", "", "write to FILE (atomically) instead of stdout")
}

// settings turns the flags into model.PlanSettings. Only what the user
// gave is set; the rest stays zero, so that the plan reports cloudwind's
// defaults as defaults, with their status.
func (pf *planFlags) settings(f *flagSet) (model.PlanSettings, error) {
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
	}{{"cells-per-radius", model.FieldCellsPerRadius, pf.cells}, {"cfl", model.FieldCFL, pf.cfl},
		{"throughput", model.FieldThroughput, pf.throughput}, {"bytes-per-cell", model.FieldBytesPerCell, pf.bytes},
		{"run-cap", model.FieldRunCap, pf.runCap}} {
		if !f.set(c.name) {
			continue
		}
		if err := model.CheckField(c.field, c.v); err != nil {
			var fe *model.FieldError
			errors.As(err, &fe)
			return model.PlanSettings{}, usagef("--%s: %s", c.name, fe.Reason)
		}
	}
	if f.set("budget") && !(pf.budget >= 0) || math.IsInf(pf.budget, 0) {
		return model.PlanSettings{}, usagef("--budget: must be a finite number of core-hours ≥ 0 (got %s)", model.FormatNumber(pf.budget, 6))
	}
	set := model.PlanSettings{CellsPerRadius: given("cells-per-radius", pf.cells), RunTcc: pf.run, CFL: given("cfl", pf.cfl), Tracking: pf.tracking,
		CellUpdatesPerCoreSecond: given("throughput", pf.throughput), BytesPerCell: given("bytes-per-cell", pf.bytes), MHD: pf.mhd,
		RunCapTcc: given("run-cap", pf.runCap), Block: int(given("block", float64(pf.block))), Criterion: pf.criterion}
	var err error
	if set.Question, err = model.ParseQuestion(pf.question); err != nil {
		return set, usagef("--question: %v", err)
	}
	if pf.box != "auto" {
		if set.BoxAlongRcl, set.BoxAcrossRcl, err = parseBox(pf.box); err != nil {
			return set, usagef("--box: %v", err)
		}
	}
	if err := set.Validate(); err != nil {
		var fe *model.FieldError
		if errors.As(err, &fe) {
			return set, usagef("--%s: %s", planFlagName(fe.Field), fe.Reason)
		}
		return set, usagef("%v", err)
	}
	return set, nil
}

// parseLadder parses --ladder: a comma list of resolutions R ≥ 1.
func parseLadder(s string) ([]float64, error) {
	if strings.TrimSpace(s) == "" {
		return nil, nil
	}
	var rs []float64
	for _, item := range strings.Split(s, ",") {
		t := strings.TrimSpace(item)
		v, n, err := model.ScanNumber(t)
		if err != nil || n != len(t) {
			return nil, usagef("--ladder: %q is not a number of cells per radius (want a list such as 8,16,32,64)", sanitizeArg(t))
		}
		if err := model.CheckField(model.FieldCellsPerRadius, v); err != nil {
			var fe *model.FieldError
			errors.As(err, &fe)
			return nil, usagef("--ladder %s: %s", sanitizeArg(t), fe.Reason)
		}
		rs = append(rs, v)
	}
	if len(rs) > 32 {
		return nil, usagef("--ladder: at most 32 resolutions (got %d)", len(rs))
	}
	return rs, nil
}

func runPlan(e *env) error {
	f := newFlagSet("plan", planSynopsis, planExamples)
	var sf scenarioFlags
	sf.register(f)
	var pf planFlags
	pf.register(f)
	if err := f.parse(e); err != nil {
		return err
	}
	set, err := pf.settings(f)
	if err != nil {
		return err
	}
	ladder, err := parseLadder(pf.ladder)
	if err != nil {
		return err
	}
	if err := sf.load(e); err != nil {
		return err
	}
	if isCampaign(&sf) {
		return runCampaign(e, &sf, f, &pf, set)
	}
	format, err := formatFor(pf.format, f.set("format"), pf.out, "text", "text", "json")
	if err != nil {
		return err
	}
	if err := checkFormat(format, "text", "json"); err != nil {
		return err
	}
	target, err := checkOutput(pf.out)
	if err != nil {
		return err
	}
	sc, err := sf.evaluate(e)
	if err != nil {
		return err
	}
	if _, err := selectCriteria(sc.criteria, pf.criterion); err != nil {
		return err
	}
	pl, err := model.MakePlan(&sc.res, set)
	if err != nil {
		return err
	}
	var cmp []model.PlanComparison
	if pf.compare {
		cs := set
		cs.Criterion = "" // each pair follows its surviving group's branch
		if cmp, err = model.ComparePlans(&sc.res, cs); err != nil {
			return err
		}
	}
	write := func(w io.Writer) error {
		if format == "json" {
			return writePlanJSON(w, &pl, cmp, set, ladder)
		}
		return writePlanText(w, &sc.res, &pl, cmp, set, ladder, report.CoolingName(sc.cooling, sc.cf))
	}
	if target == nil {
		return write(e.stdout)
	}
	return target.Write(write)
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
		"testable":                    pl.Testable,
		"verdict":                     pl.Verdict,
		"suggestion":                  pl.Suggestion,
		"all_destroyed":               pl.AllDestroyed,
		"radius_testable_pc":          finite(positiveOrNaN(float64(pl.RTestable / model.Parsec))),
		"criterion":                   pl.Criterion,
		"radius_pc":                   float64(pl.RCloud / model.Parsec),
		"cells_per_radius":            pl.Settings.CellsPerRadius,
		"block":                       pl.Settings.Block,
		"grid":                        []int{pl.Nx, pl.Ny, pl.Nz},
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
		"run_cap_tcc":                 pl.Settings.RunCapTcc,
		"t_double_tcc":                finite(pl.TDoubleTcc),
		"t_entrain_tcc":               finite(pl.TEntrainTcc),
		"t_destroy_tcc":               finite(pl.TDestroyTcc),
		"t_cool_hot_tcc":              finite(pl.TCoolHotTcc),
		"t_grow_tcc":                  finite(pl.TGrowTcc),
		"t_drag_tcc":                  finite(pl.TDragTcc),
		"shatter_cells":               finite(pl.ShatterCells),
		"advised_cells_per_radius":    finite(pl.AdvisedCellsPerRadius),
		"advised_cells_per_radius_by": pl.AdvisedSource,
		"warnings":                    warns,
	}
}

func positiveOrNaN(v float64) float64 {
	if v > 0 {
		return v
	}
	return math.NaN()
}

// gridJSON describes a rung of a resolution ladder.
func gridJSON(g model.Grid) map[string]any {
	return map[string]any{"cells_per_radius": g.CellsPerRadius, "grid": []int{g.Nx, g.Ny, g.Nz}, "cells": g.Cells,
		"dx_pc": float64(g.Dx / model.Parsec), "steps": g.Steps, "core_hours": g.CoreHours, "memory_bytes": g.MemoryBytes}
}

func writePlanJSON(w io.Writer, pl *model.Plan, cmp []model.PlanComparison, set model.PlanSettings, ladder []float64) error {
	doc := planJSON(pl)
	doc["schema"] = "cloudwind.plan/1"
	doc["version"] = versionString()
	var as []map[string]any
	for _, a := range set.Assumptions() {
		as = append(as, map[string]any{"setting": a.Field, "value": a.Value, "unit": a.Unit, "default": a.Default, "status": a.Status, "note": a.Note})
	}
	doc["assumptions"] = as
	if ladder != nil {
		var rungs []map[string]any
		for _, R := range ladder {
			rungs = append(rungs, gridJSON(pl.AtResolution(R)))
		}
		doc["ladder"] = rungs
	}
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

func writePlanText(w io.Writer, res *model.Result, pl *model.Plan, cmp []model.PlanComparison, set model.PlanSettings, ladder []float64, cooling string) error {
	var b strings.Builder
	q := res.Params
	fmt.Fprintf(&b, "Simulation plan: χ = %s, M = %s, r_cl = %s, question: %s; cooling: %s; growth model: %s\n\n", quantity.FormatSig(q.Chi, 3), quantity.FormatSig(q.Mach, 3),
		quantity.Format(model.DimLength, float64(q.RCloud)), pl.Settings.Question, cooling, q.MixCooling.Symbol())
	b.WriteString(report.PlanText(pl))
	if ladder != nil {
		fmt.Fprintf(&b, "\nResolution ladder (the same run and box at each R)\n")
		lt := report.Table{Indent: "  "}
		lt.Row("R", "grid", "Δx", "steps", "core-hours", "memory")
		for _, R := range ladder {
			g := pl.AtResolution(R)
			lt.Row(quantity.FormatSig(R, 3), report.GridText(g), quantity.Format(model.DimLength, float64(g.Dx)), quantity.FormatSig(g.Steps, 3),
				quantity.FormatSig(g.CoreHours, 3), quantity.FormatSig(g.MemoryBytes/1e9, 3)+" GB")
		}
		b.WriteString(lt.String())
	}
	if cmp != nil {
		fmt.Fprintf(&b, "\nTo tell the criteria apart (one run per pair of neighbouring thresholds)\n")
		ct := report.Table{Indent: "  ", Wrap: []bool{false, false, true, true}}
		ct.Row("r_cl", "between", "survive", "destroyed", "run", "grid", "core-hours")
		for i := range cmp {
			c := &cmp[i]
			run := quantity.FormatSig(c.Plan.RunTcc, 3) + " t_cc"
			if !c.Plan.Testable {
				run += " (not testable)"
			}
			ct.Row(quantity.Format(model.DimLength, float64(c.RCloud)),
				quantity.Format(model.DimLength, float64(c.RLower))+"–"+quantity.Format(model.DimLength, float64(c.RUpper)),
				strings.Join(c.Survive, ", "), strings.Join(c.Destroy, ", "), run,
				report.GridText(c.Plan.Grid), quantity.FormatSig(c.Plan.CoreHours, 3))
		}
		b.WriteString(ct.String())
	}
	fmt.Fprintf(&b, "\nAssumptions\n")
	for _, a := range set.Assumptions() {
		val := quantity.FormatSig(a.Value, 3)
		if a.Value == 0 {
			val = "auto"
		}
		fmt.Fprintf(&b, "  %s = %s (%s)\n", a.Field, strings.TrimSpace(val+" "+a.Unit), a.Status)
		for _, l := range report.Wrap(a.Note, report.TextWidth, "      ", "      ") {
			b.WriteString(l + "\n")
		}
	}
	return writeTrimmed(w, b.String())
}
