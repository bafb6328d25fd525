package chartspec

import (
	"math"

	"cloudwind/model"
)

// The convention spread of the regime map. Every cell would need one
// evaluation per convention (six: f ∈ {3/2, 5/2} × 𝒩 ∈ {n_H², n², n_e n_i},
// the cases of model.ConventionSpread), which would make the map six
// times as slow; r_crit varies smoothly with log χ and log Mach, so the
// range of every criterion's log r_crit over the conventions is evaluated
// on a sub-grid of at most maxSpreadCols × maxSpreadRows cells and
// interpolated linearly between (a choice of this package). A verdict
// flips across the conventions at radius r_cl when the smallest r_crit lies
// below r_cl and the largest above it (r_cl > r_crit is survival, derived
// from model.State.Evaluate); conventions giving no threshold count as
// r_crit = +Inf. Only the main test is compared: a flip of the
// transformed-gas test alone is not counted.

// The largest sub-grid of the convention spread (no source: about 300
// evaluations and 7500 re-evaluations, a few milliseconds).
const (
	maxSpreadCols = 50
	maxSpreadRows = 25
)

// A conventionGrid holds the range of every radiative criterion's
// log10 r_crit (pc) over the conventions at the cells of a sub-grid.
type conventionGrid struct {
	step       int   // sub-grid step in cells; 0 when the spread could not be evaluated
	cols, rows []int // the sub-grid's cells along x and y; rows is {0} for χ × r_cl, whose r_crit does not depend on r_cl
	nk         int   // radiative criteria
	lo, hi     []float64
}

// newConventionGrid evaluates the spread for the map of r with nx × ny
// cells whose centres are χ = cx(i) and y = cy(j) (log10 Mach with
// r.MapMach).
func newConventionGrid(r Request, rad []int, nx, ny int, cx func(int) float64, cy func(int) float64) conventionGrid {
	g := conventionGrid{nk: len(rad)}
	cases, _, err := model.ConventionSpread(r.Params, r.Cooling, nil, r.Criteria)
	if err != nil || len(rad) == 0 {
		return g
	}
	g.step = (nx + maxSpreadCols - 1) / maxSpreadCols
	if r.MapMach {
		g.step = max(g.step, (ny+maxSpreadRows-1)/maxSpreadRows)
	}
	g.cols = subGrid(nx, g.step)
	g.rows = []int{0}
	if r.MapMach {
		g.rows = subGrid(ny, g.step)
	}
	n := len(g.cols) * len(g.rows) * g.nk
	g.lo, g.hi = make([]float64, n), make([]float64, n)
	for i := range g.lo {
		g.lo[i], g.hi[i] = math.Inf(1), math.Inf(-1)
	}
	res := make([]model.Result, len(cases))
	ok := make([]bool, len(cases))
	for a, i := range g.cols {
		for c, cs := range cases {
			q := r.Params
			q.Chi = cx(i)
			q.HeatCapacity, q.DensityProduct = cs.HeatCapacity, cs.DensityProduct
			ok[c] = res[c].Evaluate(q, r.Cooling, r.Criteria) == nil
		}
		for b, j := range g.rows {
			for c := range cases {
				if !ok[c] || (r.MapMach && res[c].Reevaluate(math.Pow(10, cy(j)), r.Params.RCloud) != nil) {
					continue
				}
				for k, ci := range rad {
					v := math.Inf(1) // no threshold: never survives
					if o := &res[c].Outcomes[ci]; o.HasThreshold() {
						v = logPc(o.RCrit)
					}
					at := (b*len(g.cols)+a)*g.nk + k
					if !math.IsNaN(v) {
						g.lo[at], g.hi[at] = min(g.lo[at], v), max(g.hi[at], v)
					}
				}
			}
		}
	}
	return g
}

// subGrid returns 0, step, 2 step, … below n, and n−1.
func subGrid(n, step int) []int {
	var out []int
	for i := 0; i < n; i += step {
		out = append(out, i)
	}
	if out[len(out)-1] != n-1 {
		out = append(out, n-1)
	}
	return out
}

// flips reports whether some criterion's verdict at cell (i, j), where
// log10 r_cl in pc is lr, differs between conventions.
func (g *conventionGrid) flips(i, j int, lr float64) bool {
	if g.step == 0 {
		return false
	}
	a, ta := bracket(g.cols, g.step, i)
	b, tb := 0, 0.0
	if len(g.rows) > 1 {
		b, tb = bracket(g.rows, g.step, j)
	}
	for k := range g.nk {
		lo := g.interp(g.lo, a, b, ta, tb, k)
		hi := g.interp(g.hi, a, b, ta, tb, k)
		if lo < lr && lr < hi {
			return true
		}
	}
	return false
}

// bracket returns the sub-grid interval [at[a], at[a+1]] holding cell i
// of a sub-grid of the given step and i's position t ∈ [0, 1] in it (a is
// the only point, t = 0, when at has one point).
func bracket(at []int, step, i int) (a int, t float64) {
	if len(at) < 2 {
		return 0, 0
	}
	a = max(0, min(i/step, len(at)-2))
	return a, float64(i-at[a]) / float64(at[a+1]-at[a])
}

// interp interpolates values v of criterion k bilinearly between the
// sub-grid points (a, b), (a+1, b), (a, b+1), (a+1, b+1) at (ta, tb); when
// a corner is not finite (a case without threshold), it returns the
// nearest corner's value instead.
func (g *conventionGrid) interp(v []float64, a, b int, ta, tb float64, k int) float64 {
	nc, nr := len(g.cols), len(g.rows)
	at := func(a, b int) float64 { return v[(min(b, nr-1)*nc+min(a, nc-1))*g.nk+k] }
	c00, c10, c01, c11 := at(a, b), at(a+1, b), at(a, b+1), at(a+1, b+1)
	if !finite(c00) || !finite(c10) || !finite(c01) || !finite(c11) {
		return at(a+int(math.Round(ta)), b+int(math.Round(tb)))
	}
	return (1-tb)*((1-ta)*c00+ta*c10) + tb*((1-ta)*c01+ta*c11)
}
