package cli

import (
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// maxCampaign bounds the runs of one campaign: each plan integrates a
// trajectory, and a campaign is read by people (cloudwind's choice).
const maxCampaign = 10000

// isCampaign reports whether any swept scenario flag holds more than one
// value (a list or a range), which makes plan a campaign.
func isCampaign(sf *scenarioFlags) bool {
	for _, s := range numericScenarioFlags() {
		spec := strings.TrimSpace(*s.ptr(sf))
		if strings.Contains(spec, ",") || strings.HasPrefix(spec, "lin:") || strings.HasPrefix(spec, "log:") {
			return true
		}
	}
	return false
}

// A campaignRow is one planned run of a campaign.
type campaignRow struct {
	params     model.Params
	plan       model.Plan
	tellsApart bool
	survive    []string
	destroy    []string
	cumulative float64 // core-hours of this run and every run before it
}

// runCampaign plans one run per point of the scenario grid.
func runCampaign(e *env, sf *scenarioFlags, f *flagSet, pf *planFlags, set model.PlanSettings) error {
	if pf.compare {
		return usagef("--compare plans one scenario; a campaign already plans every point of its grid")
	}
	format, err := formatFor(pf.format, f.set("format"), pf.out, "text", "text", "csv", "json")
	if err != nil {
		return err
	}
	if err := checkFormat(format, "text", "csv", "json"); err != nil {
		return err
	}
	opt, err := sweepSetup(e, sf, f, "csv", 1, true)
	if err != nil {
		return err
	}
	if opt.grid.total > maxCampaign {
		return usagef("the campaign has %s runs, more than %d; plan a coarser grid", gridSize(opt.grid.total), maxCampaign)
	}
	if _, err := selectCriteria(opt.criteria, pf.criterion); err != nil {
		return err
	}
	target, err := checkOutput(pf.out)
	if err != nil {
		return err
	}
	rows := make([]campaignRow, 0, opt.grid.total)
	idx := make([]int, len(opt.grid.axes))
	total := 0.0
	for i := 0; i < opt.grid.total; i++ {
		p := opt.base
		opt.grid.point(i, idx)
		opt.grid.apply(&p, idx)
		cf, err := opt.cooling.Function(p.Metallicity)
		if err != nil {
			return err
		}
		res, err := model.Evaluate(p, cf, opt.criteria)
		if err != nil {
			return fmt.Errorf("run %d: %w", i+1, err)
		}
		pl, err := model.MakePlan(&res, set)
		if err != nil {
			return fmt.Errorf("run %d: %w", i+1, err)
		}
		row := campaignRow{params: res.Params, plan: pl, tellsApart: model.TellsApart(&res)}
		for k, o := range res.Outcomes {
			if res.Criteria[k].Cool == model.CoolNone {
				continue
			}
			if o.Verdict == model.Survives {
				row.survive = append(row.survive, res.Criteria[k].ID)
			} else {
				row.destroy = append(row.destroy, res.Criteria[k].ID)
			}
		}
		if pl.Testable {
			total += pl.CoreHours
		}
		row.cumulative = total
		rows = append(rows, row)
	}
	write := func(w io.Writer) error {
		switch format {
		case "csv":
			return writeCampaignCSV(w, rows, pf.budget)
		case "json":
			return writeCampaignJSON(w, rows, opt, set, pf.budget, total)
		}
		return writeCampaignText(w, rows, opt, pf.budget, total)
	}
	if target == nil {
		return write(e.stdout)
	}
	return target.Write(write)
}

// withinBudget reports whether a run fits the budget (always without one).
func withinBudget(r *campaignRow, budget float64) bool {
	return budget == 0 || (r.plan.Testable && r.cumulative <= budget)
}

func campaignColumns() []string {
	return []string{"run", "chi", "mach", "pressure_kcm3", "t_cloud_k", "radius_pc", "metallicity_zsun", "testable", "tells_apart",
		"survive", "destroy", "criterion", "run_tcc", "t_double_tcc", "nx", "ny", "nz", "cells", "core_hours", "memory_gb",
		"cumulative_core_hours", "within_budget", "verdict"}
}

// campaignRecord is the CSV record of a row; numbers with nine significant
// figures, as the sweep writes them.
func campaignRecord(i int, r *campaignRow, budget float64) []string {
	q, pl := r.params, &r.plan
	n := func(v float64) string { return string(report.AppendNumber(nil, v, false)) }
	return []string{strconv.Itoa(i + 1), n(q.Chi), n(q.Mach), n(float64(q.Pressure)), n(float64(q.TCloud)), n(float64(q.RCloud / model.Parsec)),
		n(q.Metallicity), strconv.FormatBool(pl.Testable), strconv.FormatBool(r.tellsApart), strings.Join(r.survive, ";"), strings.Join(r.destroy, ";"),
		pl.Criterion, n(pl.RunTcc), n(pl.TDoubleTcc), strconv.Itoa(pl.Nx), strconv.Itoa(pl.Ny), strconv.Itoa(pl.Nz), n(pl.Cells), n(pl.CoreHours),
		n(pl.MemoryBytes / 1e9), n(r.cumulative), strconv.FormatBool(withinBudget(r, budget)), pl.Verdict}
}

func writeCampaignCSV(w io.Writer, rows []campaignRow, budget float64) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(campaignColumns()); err != nil {
		return err
	}
	for i := range rows {
		rec := campaignRecord(i, &rows[i], budget)
		for k := range rec {
			rec[k] = string(safeCSV(rec[k]))
		}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// safeCSV removes what could act on a terminal from a CSV field (verdicts
// quote criterion labels from criteria files).
func safeCSV(s string) string { return quantity.Sanitize(s) }

func writeCampaignJSON(w io.Writer, rows []campaignRow, opt *sweepOptions, set model.PlanSettings, budget, total float64) error {
	var out []map[string]any
	for i := range rows {
		r := &rows[i]
		q := r.params
		doc := planJSON(&r.plan)
		doc["run"] = i + 1
		doc["inputs"] = map[string]any{"chi": q.Chi, "mach": q.Mach, "pressure_kcm3": float64(q.Pressure), "t_cloud_k": float64(q.TCloud),
			"radius_pc": float64(q.RCloud / model.Parsec), "metallicity_zsun": q.Metallicity}
		doc["tells_apart"] = r.tellsApart
		doc["survive"], doc["destroy"] = nonEmpty(r.survive), nonEmpty(r.destroy)
		doc["cumulative_core_hours"] = r.cumulative
		doc["within_budget"] = withinBudget(r, budget)
		out = append(out, doc)
	}
	var as []map[string]any
	for _, a := range set.Assumptions() {
		as = append(as, map[string]any{"setting": a.Field, "value": a.Value, "unit": a.Unit, "default": a.Default, "status": a.Status, "note": a.Note})
	}
	doc := map[string]any{
		"schema": "cloudwind.campaign/1", "version": versionString(), "meta": report.OrderedJSON(sweepMeta(opt)),
		"assumptions": as, "runs": out, "total_core_hours": total, "budget_core_hours": report.JSONNumber(nanIfZero(budget)),
		"within_budget": budget == 0 || total <= budget,
	}
	return report.WriteJSON(w, doc)
}

func nonEmpty(s []string) []string {
	if s == nil {
		return []string{}
	}
	return s
}

func nanIfZero(v float64) float64 {
	if v == 0 {
		return math.NaN()
	}
	return v
}

func writeCampaignText(w io.Writer, rows []campaignRow, opt *sweepOptions, budget, total float64) error {
	var b strings.Builder
	fmt.Fprintf(&b, "Campaign: %d runs over", len(rows))
	for _, a := range opt.grid.axes {
		fmt.Fprintf(&b, " --%s %s", a.flag, a.spec)
	}
	q := opt.base
	fmt.Fprintf(&b, "\nfixed: χ = %s, M = %s, P/k_B = %s, T_cl = %s, r_cl = %s, Z = %s (where not swept); growth model %s\n",
		quantity.FormatSig(q.Chi, 3), quantity.FormatSig(q.Mach, 3), quantity.Format(model.DimPressure, float64(q.Pressure)),
		quantity.Format(model.DimTemperature, float64(q.TCloud)), quantity.Format(model.DimLength, float64(q.RCloud)),
		quantity.FormatSig(q.Metallicity, 3), q.WithDefaults().MixCooling.Symbol())
	fmt.Fprintf(&b, "◆ = the criteria disagree there, so the run tells them apart; ✗ = not testable (verdicts below);\ngrow/die = criteria predicting growth/destruction\n\n")
	// Only the swept inputs get a column; the fixed ones are in the header.
	t := report.Table{Indent: "  "}
	head := []string{"run"}
	for _, ax := range opt.grid.axes {
		head = append(head, ax.flag)
	}
	t.Row(append(head, "", "grow/die", "run", "grid", "core-hours", "cumulative")...)
	for i := range rows {
		r := &rows[i]
		pl := r.plan
		apart, untestable := " ", " "
		if r.tellsApart {
			apart = "◆"
		}
		run := quantity.FormatSig(pl.RunTcc, 3) + " t_cc"
		hours := quantity.FormatSig(pl.CoreHours, 3)
		if !pl.Testable {
			untestable, hours = "✗", "—"
		}
		mark := apart + untestable
		if !withinBudget(r, budget) && pl.Testable {
			hours += " over"
		}
		cells := []string{strconv.Itoa(i + 1)}
		for _, ax := range opt.grid.axes {
			v, _ := r.params.Field(ax.field)
			cells = append(cells, quantity.Format(ax.kind, v))
		}
		grid := fmt.Sprintf("%d×%d×%d", pl.Nx, pl.Ny, pl.Nz)
		t.Row(append(cells, mark, fmt.Sprintf("%d/%d", len(r.survive), len(r.destroy)), run, grid, hours, quantity.FormatSig(r.cumulative, 3))...)
	}
	b.WriteString(t.String())
	apart, untestable := 0, 0
	for i := range rows {
		if rows[i].tellsApart && rows[i].plan.Testable {
			apart++
		}
		if !rows[i].plan.Testable {
			untestable++
		}
	}
	fmt.Fprintf(&b, "\nTotal: %s core-hours for the %d testable runs (%d of them tell criteria apart); %d not testable.\n",
		quantity.FormatSig(total, 3), len(rows)-untestable, apart, untestable)
	if budget > 0 {
		verdict := "within the budget"
		if total > budget {
			verdict = fmt.Sprintf("over the budget by %s core-hours: the runs marked \"over\" do not fit", quantity.FormatSig(total-budget, 3))
		}
		fmt.Fprintf(&b, "Budget: %s core-hours, %s.\n", quantity.FormatSig(budget, 3), verdict)
	}
	for i := range rows {
		if pl := &rows[i].plan; !pl.Testable {
			fmt.Fprintf(&b, "  ✗ run %d: %s\n", i+1, pl.Verdict)
		}
	}
	return writeTrimmed(w, b.String())
}
