package model

import (
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

// ComparePlans plans the simulations that tell the criteria cs apart for
// the problem p with cooling function cf. It sorts the distinct finite
// threshold radii; criteria whose radii agree to 1e-9 relative form one
// group, and criteria without a threshold (the adiabatic baseline, or no
// cooling) only ever appear in Destroy. For each adjacent pair of groups it
// plans a run at the geometric mean of the two radii, where the groups
// disagree; pairs closer than a factor 4 get a WarnCloseThresholds caution.
// Pairs whose mean lies outside the accepted radius range are left out.
//
// The displacement of each plan comes from disp; when disp is nil or
// reports it unknown, the flagged ram-drag estimate is used.
// set.DisplacementRcl and set.DisplacementKnown are ignored, since the
// displacement depends on r_cl. It returns the errors of Evaluate and of
// set.Validate.
func ComparePlans(p Params, cf CoolingFunction, cs []Criterion, set PlanSettings, disp DisplacementFunc) ([]PlanComparison, error) {
	if err := set.Validate(); err != nil {
		return nil, err
	}
	res, err := Evaluate(p, cf, cs)
	if err != nil {
		return nil, err
	}
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
		r := float64(res.Outcomes[i].RCrit)
		if n := len(groups); n > 0 && r-groups[n-1].r <= 1e-9*groups[n-1].r {
			groups[n-1].ids = append(groups[n-1].ids, cs[i].ID)
			continue
		}
		groups = append(groups, group{r, []string{cs[i].ID}})
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
		if c.Plan, err = makePlan(&res.State, set, disp); err != nil {
			return nil, err
		}
		if f := hi.r / lo.r; f < closeThresholds {
			c.Plan.warn(WarnCloseThresholds, LevelCaution, "Gronke, Oh, Ji & Norman 2022, arXiv:2107.13012 (confirmed: stochastic near threshold); physics reference §4.3",
				"the thresholds differ by only a factor %.3g, so the run sits within a factor %.3g of both, where outcomes are stochastic and conventions alone shift published radii by factors 2–10", f, math.Sqrt(f))
			c.Plan.sortWarnings()
		}
		out = append(out, c)
	}
	return out, nil
}

// MakePlanWith is MakePlan with the cloud's displacement x(t_end)/r_cl
// from disp (for example EvolveDisplacement), which the automatic box
// length along the wind needs when the frame does not track the cloud.
func MakePlanWith(s *State, set PlanSettings, disp DisplacementFunc) (Plan, error) {
	return makePlan(s, set, disp)
}

// EvolveDisplacement returns a DisplacementFunc that integrates the cloud's
// trajectory (Evolve) with cooling function cf under criterion c's branch
// and settings set, and reports x/r_cl where the run ends (or where the
// cloud is destroyed).
func EvolveDisplacement(cf CoolingFunction, c *Criterion, set EvolveSettings) DisplacementFunc {
	return func(p Params, runTcc float64) (float64, bool) {
		s, err := Derive(p, cf)
		if err != nil || !(runTcc > 0) {
			return 0, false
		}
		set.TEnd = runTcc
		tr, err := Evolve(&s, c, set)
		if err != nil || len(tr.X) == 0 {
			return 0, false
		}
		return tr.X[len(tr.X)-1], true
	}
}
