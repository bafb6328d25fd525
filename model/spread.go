package model

import (
	"fmt"
	"math"
)

// A ConventionCase is one convention of the spread: f, 𝒩 and the cooling
// function (0 for the first, 1 for the second when one is given).
type ConventionCase struct {
	HeatCapacity   HeatCapacity
	DensityProduct DensityProduct
	Cooling        int
}

// String writes the case as "f = 3/2, n_H², cooling 1".
func (c ConventionCase) String() string {
	f := "3/2"
	if c.HeatCapacity == Isobaric {
		f = "5/2"
	}
	n := map[DensityProduct]string{NH2: "n_H²", N2: "n²", NeNi: "n_e n_i"}[c.DensityProduct]
	return fmt.Sprintf("f = %s, %s, cooling %d", f, n, c.Cooling+1)
}

// A Spread is one criterion evaluated under every convention: the range of
// its threshold radius and how many conventions give each verdict.
type Spread struct {
	RCritMin, RCritMax Length    // over the conventions with a threshold; +Inf when none has one
	Count              [3]int    // conventions giving Destroyed, Survives and Transformed (indexed by Verdict)
	RCrit              []Length  // per case, in the order of Cases
	Verdict            []Verdict // per case
}

// Unanimous reports whether every convention gives the same verdict.
func (s Spread) Unanimous() bool {
	n := 0
	for _, c := range s.Count {
		if c > 0 {
			n++
		}
	}
	return n <= 1
}

// ConventionSpread evaluates criteria cs for problem p under every
// convention the literature uses for the cooling time: f ∈ {3/2, 5/2} ×
// 𝒩 ∈ {n_H², n², n_e n_i} (the convention spread that moves published
// threshold radii by factors 2–10; derived from the factors f and 𝒩), each
// with cf and, when second is not nil, with second too. It returns the
// cases in order and one Spread per criterion. p's own conventions are
// among the cases; its other inputs are kept.
func ConventionSpread(p Params, cf, second CoolingFunction, cs []Criterion) ([]ConventionCase, []Spread, error) {
	var cases []ConventionCase
	cfs := []CoolingFunction{cf}
	if second != nil {
		cfs = append(cfs, second)
	}
	for k := range cfs {
		for _, h := range []HeatCapacity{Isochoric, Isobaric} {
			for _, d := range DensityProducts() {
				cases = append(cases, ConventionCase{h, d, k})
			}
		}
	}
	out := make([]Spread, len(cs))
	for i := range out {
		out[i] = Spread{RCritMin: Length(math.Inf(1)), RCritMax: Length(math.Inf(1))}
	}
	var r Result
	for _, c := range cases {
		q := p
		q.HeatCapacity, q.DensityProduct = c.HeatCapacity, c.DensityProduct
		if err := r.Evaluate(q, cfs[c.Cooling], cs); err != nil {
			return nil, nil, err
		}
		for i, o := range r.Outcomes {
			s := &out[i]
			s.RCrit = append(s.RCrit, o.RCrit)
			s.Verdict = append(s.Verdict, o.Verdict)
			s.Count[o.Verdict]++
			if !o.HasThreshold() {
				continue
			}
			if math.IsInf(float64(s.RCritMin), 1) || o.RCrit < s.RCritMin {
				s.RCritMin = o.RCrit
			}
			if math.IsInf(float64(s.RCritMax), 1) || o.RCrit > s.RCritMax {
				s.RCritMax = o.RCrit
			}
		}
	}
	return cases, out, nil
}
