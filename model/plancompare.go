package model

import (
	"fmt"
	"math"
	"sort"
)

// Comparison mode of the planner: one plan per pair of neighbouring
// threshold radii, at a radius where the criteria on either side disagree.

// PlanComparison is the plan of a simulation that separates the criteria
// whose threshold radius is RLower from those whose threshold is RUpper.
type PlanComparison struct {
	RLower, RUpper Length   // adjacent distinct threshold radii
	LowerIDs       []string // criteria with r_crit = RLower: they predict survival at RCloud
	UpperIDs       []string // criteria with r_crit = RUpper: they predict destruction at RCloud
	RCloud         Length   // (RLower RUpper)^{1/2}, the geometric mean
	Survive        []string // every criterion predicting survival at RCloud, in input order
	Destroy        []string // every criterion predicting destruction at RCloud, in input order
	Plan           Plan     // the plan at RCloud
}

// ComparePlans plans the simulations that tell the criteria of r apart. It
// sorts the distinct finite threshold radii; criteria whose radii agree to
// 1e-9 relative form one group, and criteria without a threshold (the
// adiabatic baseline, or no cooling) only ever appear in Destroy. For each
// adjacent pair of groups it plans a run at the geometric mean of the two
// radii, where the groups disagree; pairs closer than a factor 4 get a
// WarnCloseThresholds caution. Pairs whose mean lies outside the accepted
// radius range are left out. The trajectory of each plan follows the branch
// of set.Criterion or, when that is "", of the first criterion of the lower
// group, which predicts growth there: the run must last long enough to see
// the growth it predicts, or its absence. set.DisplacementRcl and
// set.DisplacementKnown are ignored, since the displacement depends on
// r_cl. It returns the errors of MakePlan.
func ComparePlans(r *Result, set PlanSettings) ([]PlanComparison, error) {
	if err := set.Validate(); err != nil {
		return nil, err
	}
	if r == nil || len(r.Outcomes) != len(r.Criteria) {
		return nil, fmt.Errorf("compare plans: the problem is not evaluated")
	}
	res := *r
	res.Outcomes = append([]Outcome(nil), r.Outcomes...)
	res.Cautions = append([]Caution(nil), r.Cautions...)
	cs := res.Criteria
	set.DisplacementRcl, set.DisplacementKnown = 0, false
	var idx []int
	for i, o := range res.Outcomes {
		if o.HasThreshold() && o.RCrit > 0 {
			idx = append(idx, i)
		}
	}
	sort.SliceStable(idx, func(a, b int) bool { return res.Outcomes[idx[a]].RCrit < res.Outcomes[idx[b]].RCrit })
	type group struct {
		r   float64
		ids []string
	}
	var groups []group
	for _, i := range idx {
		rc := float64(res.Outcomes[i].RCrit)
		if n := len(groups); n > 0 && rc-groups[n-1].r <= 1e-9*groups[n-1].r {
			groups[n-1].ids = append(groups[n-1].ids, cs[i].ID)
			continue
		}
		groups = append(groups, group{rc, []string{cs[i].ID}})
	}
	var out []PlanComparison
	for k := 0; k+1 < len(groups); k++ {
		lo, hi := groups[k], groups[k+1]
		rc := Length(math.Sqrt(lo.r) * math.Sqrt(hi.r)) // geometric mean without overflow
		if rc < MinRCloud || rc > MaxRCloud || res.Reevaluate(res.Params.Mach, rc) != nil {
			continue
		}
		c := PlanComparison{RLower: Length(lo.r), RUpper: Length(hi.r), LowerIDs: lo.ids, UpperIDs: hi.ids, RCloud: rc}
		for i, o := range res.Outcomes {
			if o.Verdict == Survives {
				c.Survive = append(c.Survive, cs[i].ID)
			} else {
				c.Destroy = append(c.Destroy, cs[i].ID)
			}
		}
		var err error
		ps := set
		if ps.Criterion == "" {
			ps.Criterion = lo.ids[0]
		}
		if c.Plan, err = MakePlan(&res, ps); err != nil {
			return nil, err
		}
		if f := hi.r / lo.r; f < closeThresholds {
			c.Plan.warn(WarnCloseThresholds, LevelCaution, "Gronke, Oh, Ji & Norman 2022, arXiv:2107.13012 (confirmed: stochastic near threshold)",
				"the thresholds differ by only a factor %.3g, so the run sits within a factor %.3g of both, where outcomes are stochastic and conventions alone shift published radii by factors 2–10", f, math.Sqrt(f))
			c.Plan.sortWarnings()
		}
		out = append(out, c)
	}
	return out, nil
}

// TellsApart reports whether the criteria of r disagree: some with a
// cooling time predict survival and some destruction, so that a run at r
// would separate them.
func TellsApart(r *Result) bool {
	grow, die := false, false
	for i, o := range r.Outcomes {
		if r.Criteria[i].Cool == CoolNone {
			continue
		}
		if o.Verdict == Survives {
			grow = true
		} else {
			die = true
		}
	}
	return grow && die
}
