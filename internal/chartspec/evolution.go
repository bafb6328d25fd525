package chartspec

import (
	"math"

	"cloudwind/model"
)

// EvolutionCharts returns m/m0 (log) and v/v_w against t/t_cc,0, one
// curve per criterion's branch (model.Evolve with the default settings,
// whose constants and statuses `cloudwind evolve` lists). A criterion
// whose verdict is Transformed follows its growing branch (the gas at the
// warm temperature grows, as model.Evolve treats it), and its curve says
// "transformed".
func EvolutionCharts(r Request) (mass, vel *LineChart) {
	const n = 201
	set := model.DefaultEvolveSettings()
	mass = &LineChart{
		Title:   "cloud mass m/m₀ vs t/t_cc (one curve per criterion's branch)",
		X:       Axis{Label: "t/t_cc", Min: 0, Max: set.TEnd},
		Y:       Axis{Label: "m/m₀", Log: true},
		Note:    "default constants, several from memory: see cloudwind evolve",
		Caption: Caption(r),
	}
	vel = &LineChart{
		Title:   "cloud velocity v/v_w vs t/t_cc",
		X:       Axis{Label: "t/t_cc", Min: 0, Max: set.TEnd},
		Y:       Axis{Label: "v/v_w", Min: 0, Max: 1},
		Note:    "entrained at v ≥ 0.9 v_w; destroyed at m < 10⁻³ m₀",
		Caption: Caption(r),
	}
	s, err := model.Derive(r.Params, r.Cooling)
	if err != nil {
		mass.Note = err.Error()
		return mass, vel
	}
	ts := make([]float64, n)
	for i := range ts {
		ts[i] = set.TEnd * float64(i) / float64(n-1)
	}
	for i := range r.Criteria {
		c := &r.Criteria[i]
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
		name := CriterionName(c)
		if c.Cool != model.CoolNone && s.Evaluate(c).Verdict == model.Transformed {
			name += " (transformed)"
		}
		mass.Series = append(mass.Series, Series{Name: name, X: ts, Y: ms, Index: i})
		vel.Series = append(vel.Series, Series{Name: name, X: ts, Y: vs, Index: i})
	}
	mass.Y.Min, mass.Y.Max = seriesRange(mass.Series, 0, -3)
	vel.Markers = []Marker{{Kind: HLine, Y: 0.9, Label: "0.9 v_w"}}
	mass.Markers = []Marker{{Kind: HLine, Y: math.Log10(2), Label: "2 m₀"}}
	return mass, vel
}
