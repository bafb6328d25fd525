package tui

import (
	"strings"

	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// planLines is the text of the plan view: the simulation plan at the
// current inputs for a growth study with the default settings, the
// cloud's displacement integrated under the first radiative criterion's
// branch, and the comparison of plans across the criteria's threshold
// radii. It runs in a command (computeChart), like the charts.
func planLines(r chartspec.Request) []string {
	res, err := model.Evaluate(r.Params, r.Cooling, r.Criteria)
	if err != nil {
		return []string{err.Error()}
	}
	set := model.PlanSettings{}
	pl, err := model.MakePlan(&res, set)
	if err != nil {
		return []string{err.Error()}
	}
	lines := []string{"Plan for a growth study at r_cl = " + quantity.Format(model.DimLength, float64(r.Params.RCloud)) +
		" (defaults; cloudwind plan sets every assumption)", ""}
	lines = append(lines, strings.Split(strings.TrimRight(report.PlanText(&pl), "\n"), "\n")...)
	cmp, err := model.ComparePlans(&res, set)
	if err == nil && len(cmp) > 0 {
		lines = append(lines, "", "To tell the criteria apart:")
		for i := range cmp {
			c := &cmp[i]
			lines = append(lines, "  r_cl = "+quantity.Format(model.DimLength, float64(c.RCloud))+": "+verdictGroups(&res, c.RCloud)+" — "+
				quantity.FormatSig(c.Plan.RunTcc, 3)+" t_cc, "+quantity.FormatSig(c.Plan.Cells, 3)+" cells, "+quantity.FormatSig(c.Plan.CoreHours, 3)+" core-hours")
		}
	}
	return lines
}

// verdictGroups names the criteria by label grouped by their verdict at
// radius rCl ("A, B survive; C transformed; D, E destroyed"), the groups
// that are empty left out. It re-evaluates a copy of res.
func verdictGroups(res *model.Result, rCl model.Length) string {
	r := cloneResult(res)
	if r.Reevaluate(r.Params.Mach, rCl) != nil {
		return "—"
	}
	by := map[model.Verdict][]string{}
	for i := range r.Criteria {
		v := r.Outcomes[i].Verdict
		by[v] = append(by[v], chartspec.CriterionName(&r.Criteria[i]))
	}
	var parts []string
	for _, v := range model.Verdicts() {
		if len(by[v]) == 0 {
			continue
		}
		word := map[model.Verdict]string{model.Survives: " survive", model.Transformed: " transformed", model.Destroyed: " destroyed"}[v]
		parts = append(parts, strings.Join(by[v], ", ")+word)
	}
	return strings.Join(parts, "; ")
}
