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
			lines = append(lines, "  r_cl = "+quantity.Format(model.DimLength, float64(c.RCloud))+": "+strings.Join(c.Survive, ", ")+
				" survive; "+strings.Join(c.Destroy, ", ")+" destroyed — "+quantity.FormatSig(c.Plan.RunTcc, 3)+" t_cc, "+
				quantity.FormatSig(c.Plan.Cells, 3)+" cells, "+quantity.FormatSig(c.Plan.CoreHours, 3)+" core-hours")
		}
	}
	return lines
}
