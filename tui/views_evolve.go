package tui

import (
	"math"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// evolutionCharts: m/m0 (log) and v/v_w against t/t_cc,0, one curve per
// criterion's branch (model.Evolve with the default settings, whose
// constants and statuses `cloudwind evolve` lists).
func evolutionCharts(r chartRequest) (mass, vel *LineChart) {
	const n = 201
	set := model.DefaultEvolveSettings()
	mass = &LineChart{
		Title: "cloud mass m/m0 vs t/t_cc (one curve per criterion's branch)",
		X:     Axis{Label: "t/t_cc", Min: 0, Max: set.TEnd},
		Y:     Axis{Label: "m/m0", Log: true},
		Note:  "default constants, several from memory: see cloudwind evolve",
	}
	vel = &LineChart{
		Title: "cloud velocity v/v_w vs t/t_cc",
		X:     Axis{Label: "t/t_cc", Min: 0, Max: set.TEnd},
		Y:     Axis{Label: "v/v_w", Min: 0, Max: 1},
		Note:  "entrained at v ≥ 0.9 v_w; destroyed at m < 1e-3 m0",
	}
	s, err := model.Derive(r.params, r.cf)
	if err != nil {
		mass.Note = err.Error()
		return mass, vel
	}
	ts := make([]float64, n)
	for i := range ts {
		ts[i] = set.TEnd * float64(i) / float64(n-1)
	}
	for i := range r.criteria {
		c := &r.criteria[i]
		tr, err := model.Evolve(&s, c, set)
		if err != nil || len(tr.T) == 0 {
			continue
		}
		end := tr.T[len(tr.T)-1]
		ms, vs := make([]float64, n), make([]float64, n)
		for k, t := range ts {
			ms[k], vs[k] = math.NaN(), math.NaN()
			if t <= end {
				m, v, _ := tr.At(t)
				if m > 0 {
					ms[k] = math.Log10(m)
				}
				vs[k] = v
			}
		}
		name := quantity.Sanitize(c.ID)
		mass.Series = append(mass.Series, Series{Name: name, X: ts, Y: ms, Index: i})
		vel.Series = append(vel.Series, Series{Name: name, X: ts, Y: vs, Index: i})
	}
	mass.Y.Min, mass.Y.Max = seriesRange(mass.Series, 0, -3)
	vel.Markers = []Marker{{Kind: HLine, Y: 0.9, Label: "0.9 v_w"}}
	mass.Markers = []Marker{{Kind: HLine, Y: math.Log10(2), Label: "2 m0"}}
	return mass, vel
}

// planLines: the simulation plan at the current inputs for a growth
// study with the default settings, the cloud's displacement integrated
// under the first radiative criterion's branch, and the comparison of
// plans across the criteria's threshold radii.
func planLines(r chartRequest) []string {
	s, err := model.Derive(r.params, r.cf)
	if err != nil {
		return []string{err.Error()}
	}
	rad := radiative(r.criteria)
	if len(rad) == 0 {
		return []string{"no radiative criterion to plan for"}
	}
	disp := model.EvolveDisplacement(r.cf, &r.criteria[rad[0]], model.EvolveSettings{})
	set := model.PlanSettings{}
	pl, err := model.MakePlanWith(&s, set, disp)
	if err != nil {
		return []string{err.Error()}
	}
	lines := []string{"Plan for a growth study at r_cl = " + quantity.Format(model.DimLength, float64(r.params.RCloud)) +
		" (defaults; cloudwind plan sets every assumption)", ""}
	lines = append(lines, strings.Split(strings.TrimRight(report.PlanText(&pl), "\n"), "\n")...)
	cmp, err := model.ComparePlans(r.params, r.cf, r.criteria, set, disp)
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
