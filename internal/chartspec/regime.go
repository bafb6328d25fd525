package chartspec

import (
	"math"
	"strconv"

	"cloudwind/model"
)

// Regime returns how many radiative criteria predict survival in each
// cell of χ × r_cl (or, with r.MapMach, χ × Mach at the current r_cl), at
// r.Cols × r.Rows cells clamped to 10…200 × 5…100. r_crit does not depend
// on r_cl, so a χ column needs one evaluation; Mach rows take the fast
// path (model.Result.Reevaluate).
func Regime(r Request) *RegimeMap {
	nx := max(10, min(200, r.Cols))
	ny := max(5, min(100, r.Rows))
	xlo, xhi := chiRange(r.Params.Chi)
	rc := math.Log10(float64(r.Params.RCloud / model.Parsec))
	m := &RegimeMap{NX: nx, NY: ny, Counts: make([]int, nx*ny)}
	m.X = Axis{Label: "χ = ρ_cl/ρ_hot", Log: true, Min: xlo, Max: xhi}
	rad := radiative(r.Criteria)
	m.Total = len(rad)
	if r.MapMach {
		m.Title = "criteria predicting survival: χ × Mach at the current r_cl"
		m.Y = Axis{Label: "Mach", Log: true, Min: -1, Max: 1}
		m.Mark = &Marker{Kind: Point, X: math.Log10(r.Params.Chi), Y: math.Log10(r.Params.Mach), Label: "now"}
	} else {
		m.Title = "criteria predicting survival: χ × r_cl"
		m.Y = Axis{Label: "r_cl (pc)", Log: true, Min: min(-2, rc-1), Max: max(4, rc+1)}
		m.Mark = &Marker{Kind: Point, X: math.Log10(r.Params.Chi), Y: rc, Label: "now"}
	}
	var res model.Result
	for i := 0; i < nx; i++ {
		q := r.Params
		q.Chi = math.Pow(10, xlo+(xhi-xlo)*(float64(i)+0.5)/float64(nx))
		if res.Evaluate(q, r.Cooling, r.Criteria) != nil {
			for j := 0; j < ny; j++ {
				m.Counts[j*nx+i] = -1 // no valid state: drawn empty
			}
			continue
		}
		for j := 0; j < ny; j++ {
			y := m.Y.Min + (m.Y.Max-m.Y.Min)*(float64(j)+0.5)/float64(ny)
			n := 0
			if r.MapMach {
				if res.Reevaluate(math.Pow(10, y), r.Params.RCloud) != nil {
					m.Counts[j*nx+i] = -1
					continue
				}
				for _, k := range rad {
					if res.Outcomes[k].Verdict == model.Survives {
						n++
					}
				}
			} else {
				rcl := math.Pow(10, y)
				for _, k := range rad {
					if o := res.Outcomes[k]; o.HasThreshold() && rcl > float64(o.RCrit/model.Parsec) {
						n++
					}
				}
			}
			m.Counts[j*nx+i] = n
		}
	}
	m.Caption = Caption(r)
	m.Note = "each cell: how many of the " + strconv.Itoa(m.Total) + " radiative criteria predict survival; mixed cells are where they disagree"
	return m
}
