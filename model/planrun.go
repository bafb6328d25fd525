package model

import (
	"fmt"
	"math"
)

// planTrajectory integrates the cloud under criterion c's branch for the
// planner, up to the cap (or the user's longer run).
func planTrajectory(s *State, c *Criterion, q PlanSettings) (Trajectory, error) {
	ev := q.Evolve
	ev.TEnd = math.Max(q.RunCapTcc, q.RunTcc)
	tr, err := Evolve(s, c, ev)
	if err != nil && len(tr.T) == 0 {
		return tr, fmt.Errorf("make plan: the trajectory under %s: %w", c.ID, err)
	}
	return tr, nil // a trajectory cut short by the integrator still gives its events so far
}

// autoRunRule states the automatic run length for question q.
func autoRunRule(q Question) string {
	switch q {
	case QuestionGrowth:
		return "1.5 × the time the cloud's mass takes to double on the followed criterion's branch (integrated), at least 10 t_cc, at most the cap (cloudwind's rule)"
	case QuestionEntrainment:
		return "1.5 × the time the cloud takes to be entrained (|Δv| ≤ 0.1 v_w, integrated), at least 10 t_cc, at most the cap (cloudwind's rule)"
	}
	return "1.5 × the destruction time when the followed branch destroys the cloud, at least 10 t_cc, the upper end of the 3–10 t_cc of non-radiative destruction (Nakamura et al. 2006, confirmed range)"
}

// runLength sets the run length, its rule, and the verdict on whether the
// question can be answered.
func (pl *Plan) runLength(r *Result, ci int, tr *Trajectory) {
	q := pl.Settings
	c := &r.Criteria[ci]
	limit := q.RunCapTcc
	if q.RunTcc > 0 {
		pl.RunTcc, pl.RunRule = q.RunTcc, "set by the user"
		limit = q.RunTcc
	}
	// need is the time the question needs on this trajectory; NaN when the
	// trajectory never shows it.
	need, event := math.NaN(), ""
	switch q.Question {
	case QuestionGrowth:
		need, event = tr.TDouble, "the mass doubles"
	case QuestionEntrainment:
		need, event = tr.TEntrain, "the cloud is entrained"
	case QuestionDestruction:
		need, event = tr.TDestroy, "the cloud is destroyed"
	}
	if q.RunTcc == 0 {
		run := destructionRunTcc
		if !math.IsNaN(need) {
			run = math.Max(runMargin*need, minRunTcc)
		}
		pl.RunTcc = math.Min(run, q.RunCapTcc)
		pl.RunRule = q.Question.String() + ": " + autoRunRule(q.Question)
		if !math.IsNaN(need) {
			pl.RunRule += fmt.Sprintf("; here %s at %s t_cc", event, num3(need))
		}
	}
	pl.RunTime = Time(pl.RunTcc * float64(r.TCC))

	switch {
	case q.Question == QuestionGrowth && pl.AllDestroyed:
		pl.Testable = false
		pl.Verdict = fmt.Sprintf("every criterion predicts destruction at r_cl = %s pc (the smallest threshold radius is %s pc): a growth run would show the cloud destroyed",
			num3(float64(r.Params.RCloud/Parsec)), num3(smallestThresholdPc(r)))
	case q.Question == QuestionGrowth && (tr.Destroyed || tr.S[0] < 0.5):
		pl.Testable = false
		pl.Verdict = fmt.Sprintf("on the branch of %s the cloud is destroyed%s: a growth run would show destruction", c.Label, atTime(tr.TDestroy))
	case q.Question == QuestionDestruction && !tr.Destroyed:
		pl.Verdict = fmt.Sprintf("on the branch of %s the cloud is not destroyed within %s t_cc: a run shows destruction only if that criterion is wrong", c.Label, num3(tr.T[len(tr.T)-1]))
	case math.IsNaN(need) || need > limit:
		pl.Testable = false
		why := ""
		switch {
		case q.Question == QuestionGrowth && tr.GrowthNote != "":
			why = ": " + tr.GrowthNote
		case q.Question == QuestionGrowth:
			why = fmt.Sprintf(": t_grow = %s t_cc", num3(pl.TGrowTcc))
		case q.Question == QuestionEntrainment:
			why = fmt.Sprintf(": the drag time alone is t_drag = χ^1/2 t_cc = %s t_cc", num3(pl.TDragTcc))
		}
		if math.IsNaN(need) {
			pl.Verdict = fmt.Sprintf("a practical run would not show it: on the branch of %s %s within %s t_cc%s", c.Label, notEvent(event), num3(limit), why)
		} else {
			pl.Verdict = fmt.Sprintf("a practical run would not show it: on the branch of %s %s only at %s t_cc, past the %s t_cc %s%s",
				c.Label, event, num3(need), num3(limit), capWord(q), why)
		}
	}
	if !pl.Testable && q.Question == QuestionGrowth {
		pl.suggest(r, ci)
	}
}

// capWord names the limit of the run: the cap or the user's run length.
func capWord(q PlanSettings) string {
	if q.RunTcc > 0 {
		return "run length set"
	}
	return "cap"
}

func notEvent(event string) string {
	switch event {
	case "the mass doubles":
		return "the mass does not double"
	case "the cloud is entrained":
		return "the cloud is not entrained"
	}
	return "the cloud is not destroyed"
}

func atTime(t float64) string {
	if math.IsNaN(t) {
		return ""
	}
	return " at " + num3(t) + " t_cc"
}

// smallestThresholdPc is the smallest finite threshold radius in pc.
func smallestThresholdPc(r *Result) float64 {
	best := math.Inf(1)
	for _, o := range r.Outcomes {
		if o.HasThreshold() {
			best = math.Min(best, float64(o.RCrit/Parsec))
		}
	}
	return best
}

// suggest proposes what an untestable growth plan's run could answer: the
// destruction time at this radius, or growth at the smallest radius where
// the followed branch doubles the cloud's mass within the cap.
func (pl *Plan) suggest(r *Result, ci int) {
	q := pl.Settings
	rt, td := growthTestableRadius(r, ci, q)
	pl.RTestable, pl.TDoubleAt = rt, td
	d := q
	d.Question, d.RunTcc, d.BoxAlongRcl = QuestionDestruction, 0, 0
	dest, err := MakePlan(r, d)
	s := ""
	if err == nil {
		s = fmt.Sprintf("at this radius, the destruction time (question destruction: %s t_cc, %s core-hours)",
			num3(dest.RunTcc), num3(dest.CoreHours))
	}
	if rt > 0 {
		if s != "" {
			s += "; "
		}
		s += fmt.Sprintf("growth becomes testable from r_cl ≈ %s pc, where the mass doubles at %s t_cc on the branch of %s",
			num3(float64(rt/Parsec)), num3(td), r.Criteria[ci].Label)
	} else if s != "" {
		s += fmt.Sprintf("; no radius up to %s pc makes growth testable within %s t_cc on the branch of %s",
			num3(float64(MaxRCloud/Parsec)), num3(q.RunCapTcc), r.Criteria[ci].Label)
	}
	pl.Suggestion = s
}

// growthTestableRadius returns the smallest cloud radius (≥ r_cl) at which
// the trajectory under criterion ci doubles its mass within the cap, and
// the doubling time there in t_cc, or (0, NaN) when no radius up to
// MaxRCloud does. Larger clouds grow faster in units of their own t_cc
// (t_grow/t_cc ∝ r^{-1/4} at fixed t_cool, derived from v_mix ∝ r^{1/4}) and
// pass every threshold, so the radius is found by doubling then bisection
// in log r.
func growthTestableRadius(r *Result, ci int, q PlanSettings) (Length, float64) {
	cp := *r
	cp.Outcomes = append([]Outcome(nil), r.Outcomes...)
	cp.Cautions = append([]Caution(nil), r.Cautions...)
	c := &cp.Criteria[ci]
	ev := q.Evolve
	ev.TEnd = q.RunCapTcc
	doubles := func(rc Length) (bool, float64) {
		if cp.Reevaluate(cp.Params.Mach, rc) != nil {
			return false, math.NaN()
		}
		tr, err := Evolve(&cp.State, c, ev)
		if err != nil || math.IsNaN(tr.TDouble) {
			return false, math.NaN()
		}
		return true, tr.TDouble
	}
	lo := r.Params.RCloud
	if o := r.Outcomes[ci]; o.HasThreshold() && o.RCrit > lo {
		lo = o.RCrit
	}
	hi := lo
	ok, td := doubles(hi)
	for !ok {
		lo, hi = hi, 2*hi
		if hi > MaxRCloud {
			return 0, math.NaN()
		}
		ok, td = doubles(hi)
	}
	if hi == lo {
		return hi, td
	}
	for k := 0; k < 40 && float64(hi/lo) > 1.001; k++ {
		mid := Length(math.Sqrt(float64(lo) * float64(hi)))
		if ok2, t2 := doubles(mid); ok2 {
			hi, td = mid, t2
		} else {
			lo = mid
		}
	}
	return hi, td
}

// A PlanAssumption is one setting of a plan with its value and status, for
// display beside the plan.
type PlanAssumption struct {
	Field   string  // a Field… name, or "cost" for the cost model
	Value   float64 // the value used; 0 when automatic
	Unit    string  // e.g. "r_cl", "t_cc"; "" for a pure number
	Default bool    // true when the value is cloudwind's default, not the user's
	Status  string  // "assumption", "from memory", "common practice", "derived" or "set by the user"
	Note    string  // why, and where it comes from
}

// Assumptions returns each setting of p (defaults filled in) with its
// status, in display order.
func (p PlanSettings) Assumptions() []PlanAssumption {
	q := p.WithDefaults()
	item := func(field string, given, v float64, unit, status, note string) PlanAssumption {
		if given != 0 {
			return PlanAssumption{field, v, unit, false, "set by the user", note}
		}
		return PlanAssumption{field, v, unit, true, status, note}
	}
	along := "automatic: upstream + the trajectory's displacement x(t_end) + tail (derived)"
	if q.Tracking {
		along = "automatic in the cloud-tracking frame: upstream + tail"
	}
	out := []PlanAssumption{
		item(FieldCellsPerRadius, p.CellsPerRadius, q.CellsPerRadius, "cells per r_cl", "assumption", "16 = twice the 8 quoted as Gronke & Oh 2018's minimum for converged growth (secondary); cloudwind counts < 8 as poor, 8–16 as marginal, ≥ 32 as good for growth studies"),
		item(FieldBlock, float64(p.Block), float64(q.Block), "cells", "assumption", "cells per axis are rounded up to a multiple of the block size; 1 = no rounding"),
		item(FieldBoxAlong, p.BoxAlongRcl, q.BoxAlongRcl, "r_cl", "derived", along),
		item(FieldUpstream, p.UpstreamRcl, q.UpstreamRcl, "r_cl", "assumption", "room for the bow shock ahead of the cloud; no source"),
		item(FieldTail, p.TailRcl, q.TailRcl, "r_cl", "from memory", "with the upstream margin 40 r_cl, the short end of the ~40–150 r_cl recalled for published boxes (from memory); gas stripped early may travel up to v_w t_end"),
		item(FieldBoxAcross, p.BoxAcrossRcl, q.BoxAcrossRcl, "r_cl", "from memory", "upper end of the ~10–20 r_cl recalled for published boxes (from memory): mixed gas must not leave the domain (Kanjilal et al. 2021, confirmed)"),
		item(FieldRunTcc, p.RunTcc, q.RunTcc, "t_cc", "derived", "automatic: "+autoRunRule(q.Question)),
		item(FieldRunCap, p.RunCapTcc, q.RunCapTcc, "t_cc", "assumption", "about twice the ~100 t_cc of the longest radiative wind-tunnel runs recalled (from memory): past it the plan says the question needs an impractical run"),
		item(FieldCFL, p.CFL, q.CFL, "", "common practice", "Courant number 0.3: common practice, no source"),
		item(FieldThroughput, p.CellUpdatesPerCoreSecond, q.CellUpdatesPerCoreSecond, "cell-updates per core-second", "assumption", "typical of modern finite-volume codes on one CPU core, not measured"),
		item(FieldBytesPerCell, p.BytesPerCell, q.BytesPerCell, "bytes", "assumption", "8 float64 variables (enough for MHD) × 4 for ghost zones, copies and scratch; not measured"),
	}
	if !q.Tracking && q.DisplacementKnown {
		out = append(out, PlanAssumption{FieldDisplacement, q.DisplacementRcl, "r_cl", false, "set by the user", "x(t_end)/r_cl given instead of the trajectory's"})
	}
	return append(out, PlanAssumption{"cost", 0, "", true, "derived", "N_cells = Nx Ny Nz, Δt = C Δx/(v_w + c_s,hot) (the Courant condition at the largest initial signal speed): a lower bound without cooling sub-cycling or faster signals in shocked gas"})
}
