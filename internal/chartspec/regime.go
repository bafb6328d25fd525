package chartspec

import (
	"math"
	"strconv"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// Regime returns, in each cell of χ × r_cl (or, with r.MapMach, χ × Mach
// at the current r_cl), how many radiative criteria predict survival and
// whether they agree there (RegimeMap.Class), at r.Cols × r.Rows cells
// clamped to 10…200 × 5…100; r.Runs are placed at their χ and r_cl (or
// Mach).
//
// r_crit does not depend on r_cl, so a χ column needs one evaluation, and
// a cell's verdicts, and whether one of them lies inside its uncertainty
// band, follow from comparing r_cl with r_crit and its band (derived from
// model.State.Evaluate); only when a criterion can predict "transformed"
// is every cell re-evaluated. Mach rows take the fast path
// (model.Result.Reevaluate). The convention spread (the cases of
// model.ConventionSpread) is evaluated on a coarser sub-grid, every
// SpreadEvery cells, and interpolated between (conventionGrid).
func Regime(r Request) *RegimeMap {
	nx := max(10, min(200, r.Cols))
	ny := max(5, min(100, r.Rows))
	xlo, xhi := chiRange(r.Params.Chi)
	rc := math.Log10(float64(r.Params.RCloud / model.Parsec))
	m := &RegimeMap{NX: nx, NY: ny, Counts: make([]int, nx*ny), Class: make([]Agreement, nx*ny)}
	m.X = Axis{Label: "χ = ρ_cl/ρ_hot", Log: true, Min: xlo, Max: xhi}
	rad := radiative(r.Criteria)
	m.Total = len(rad)
	third := false // some criterion can predict "transformed" here
	for _, k := range rad {
		c := &r.Criteria[k]
		third = third || (c.HasThirdOutcome() && r.Params.WithDefaults().TCloud < c.WarmTemperature)
	}
	if third {
		m.Transformed = make([]int, nx*ny)
	}
	if r.MapMach {
		m.Title = "criteria predicting survival: χ × Mach at the current r_cl"
		m.Y = Axis{Label: "Mach", Log: true, Min: -1, Max: 1}
		m.Mark = &Marker{Kind: Point, X: math.Log10(r.Params.Chi), Y: math.Log10(r.Params.Mach), Label: "now"}
		m.Runs = runMarks(r.Runs, func(p *model.Params) float64 { return math.Log10(p.Mach) })
	} else {
		m.Title = "criteria predicting survival: χ × r_cl"
		m.Y = Axis{Label: "r_cl (pc)", Log: true, Min: min(-2, rc-1), Max: max(4, rc+1)}
		m.Mark = &Marker{Kind: Point, X: math.Log10(r.Params.Chi), Y: rc, Label: "now"}
		m.Runs = runMarks(r.Runs, func(p *model.Params) float64 { return logPc(p.RCloud) })
	}
	m.RunsName = quantity.Sanitize(r.RunsName)
	cx := func(i int) float64 { return math.Pow(10, xlo+(xhi-xlo)*(float64(i)+0.5)/float64(nx)) }
	cy := func(j int) float64 { return m.Y.Min + (m.Y.Max-m.Y.Min)*(float64(j)+0.5)/float64(ny) }
	spread := newConventionGrid(r, rad, nx, ny, cx, cy)
	m.SpreadEvery = spread.step
	var res model.Result
	for i := 0; i < nx; i++ {
		q := r.Params
		q.Chi = cx(i)
		if res.Evaluate(q, r.Cooling, r.Criteria) != nil {
			for j := 0; j < ny; j++ {
				m.Counts[j*nx+i] = -1 // no valid state: drawn empty
			}
			continue
		}
		for j := 0; j < ny; j++ {
			y := cy(j)
			var tally cellTally
			switch {
			case r.MapMach || third:
				mach, rcl := r.Params.Mach, model.Length(math.Pow(10, y))*model.Parsec
				if r.MapMach {
					mach, rcl = math.Pow(10, y), r.Params.RCloud
				}
				if res.Reevaluate(mach, rcl) != nil {
					m.Counts[j*nx+i] = -1
					continue
				}
				for _, k := range rad {
					o := &res.Outcomes[k]
					tally.add(o.Verdict, o.DependsOnConstant)
				}
			default: // the fast path: r_crit and its band do not depend on r_cl
				rcl := model.Length(math.Pow(10, y)) * model.Parsec
				for _, k := range rad {
					o := &res.Outcomes[k]
					v := model.Destroyed
					if o.HasThreshold() && rcl > o.RCrit {
						v = model.Survives
					}
					tally.add(v, o.RCritHigh > o.RCritLow && rcl > o.RCritLow && rcl < o.RCritHigh)
				}
			}
			lr := y // log10 r_cl in pc at this cell
			if r.MapMach {
				lr = rc
			}
			idx := j*nx + i
			m.Counts[idx] = tally.survive
			if m.Transformed != nil {
				m.Transformed[idx] = tally.transformed
			}
			m.Class[idx] = tally.class(spread.flips(i, j, lr))
		}
	}
	m.Caption = Caption(r)
	m.Note = regimeNote(m.Total, m.SpreadEvery) + runsNote(m.RunsName, len(m.Runs), r.MapMach)
	return m
}

// regimeNote says what a cell holds and how its class is found.
func regimeNote(total, every int) string {
	note := "each cell: how many of the " + strconv.Itoa(total) + " radiative criteria predict survival; marked where a verdict flips within an unverified α's band"
	switch {
	case every == 1:
		note += " or across the conventions of f and the density product"
	case every > 1:
		note += " or across the conventions of f and the density product (every " + ordinal(every) + " cell, interpolated)"
	}
	return note
}

// runsNote says where the runs on a chart come from and how they are
// placed; "" without runs.
func runsNote(name string, n int, mach bool) string {
	if n == 0 {
		return ""
	}
	at := "χ and r_cl"
	if mach {
		at = "χ and Mach"
	}
	if name == "" {
		name = "a file"
	}
	return "; " + strconv.Itoa(n) + " simulation runs from " + name + " at their " + at + " (their other inputs may differ)"
}

// ordinal writes 2 as "2nd", 3 as "3rd", 4 as "4th".
func ordinal(n int) string {
	s := strconv.Itoa(n)
	switch {
	case n%100 >= 11 && n%100 <= 13:
		return s + "th"
	case n%10 == 1:
		return s + "st"
	case n%10 == 2:
		return s + "nd"
	case n%10 == 3:
		return s + "rd"
	}
	return s + "th"
}

// cellTally counts the verdicts of one cell.
type cellTally struct {
	survive, transformed, destroyed int
	band                            bool // a verdict lies within its uncertainty band
}

func (t *cellTally) add(v model.Verdict, inBand bool) {
	switch v {
	case model.Survives:
		t.survive++
	case model.Transformed:
		t.transformed++
	default:
		t.destroyed++
	}
	t.band = t.band || inBand
}

// class returns the cell's class; conventions says whether a verdict
// flips across the convention spread.
func (t *cellTally) class(conventions bool) Agreement {
	kinds := 0
	for _, n := range [...]int{t.survive, t.transformed, t.destroyed} {
		if n > 0 {
			kinds++
		}
	}
	switch {
	case t.band || conventions:
		return Depends
	case kinds > 1:
		return Disagree
	}
	return AllAgree
}
