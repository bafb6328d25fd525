package tui

import (
	"math"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// The details of a criterion: its form, citation and constants, the
// verdict now with r_crit's band, the quantities its own test uses (the
// swept-up gas of the bow shock, the warm-gas test of a third outcome,
// the turbulent crushing time), r_crit under every convention, the
// calibrated range, and its score against loaded simulation outcomes.

// conventionSpread is model.ConventionSpread of one state: the cases and
// one Spread per criterion.
type conventionSpread struct {
	cases   []model.ConventionCase
	spreads []model.Spread
	err     error
}

// spreadCache keeps the convention spread of the last state asked for, so
// that the six evaluations run once per change of the inputs while the
// details are open, not on every message.
type spreadCache struct {
	params model.Params
	cf     model.CoolingFunction
	valid  bool
	s      conventionSpread
}

// get returns the spread of p with cooling function cf, computing it when
// p or cf changed (six evaluations: microseconds, fine in Update).
func (c *spreadCache) get(p model.Params, cf model.CoolingFunction, cs []model.Criterion) conventionSpread {
	if !c.valid || c.params != p || c.cf != cf {
		cases, sp, err := model.ConventionSpread(p, cf, nil, cs)
		c.params, c.cf, c.valid, c.s = p, cf, true, conventionSpread{cases, sp, err}
	}
	return c.s
}

// criterionDetails writes the details of criterion i with wrap (a
// labelled, wrapped paragraph) and add (a line as it is).
func (d detailsPane) criterionDetails(i int, wrap func(label, text string), add func(line string)) {
	c, o := &d.res.Criteria[i], d.res.Outcomes[i]
	wrap("criterion:", "survives and grows when "+c.Formula())
	wrap("citation:", c.Citation.String())
	if c.Citation.Equation == "" {
		wrap("equation:", "not read from the paper; no equation number is cited")
	}
	verified := "verified against the paper"
	if !c.Verified {
		verified = "NOT verified"
	}
	wrap("constants:", "α = "+quantity.FormatSig(c.Alpha, 3)+", β = "+quantity.FormatSig(c.Beta, 3)+" — "+verified+": "+c.Status)
	if c.Cool == model.CoolNone {
		wrap("now:", "→ "+verdictWord(o.Verdict))
	} else {
		now := c.Cool.Symbol() + "/" + c.Dyn.String() + " = " + quantity.FormatSig(o.Ratio, 3) + " (limit " + quantity.FormatSig(o.Threshold, 3) +
			"), r_crit = " + quantity.Format(model.DimLength, float64(o.RCrit)) + ", margin r_cl/r_crit = " + quantity.FormatSig(o.Margin, 3) +
			" → " + verdictWord(o.Verdict)
		if o.DependsOnConstant {
			now += "; this depends on the constant: r_cl lies inside r_crit's band"
		}
		wrap("now:", now)
		if u := c.UncertaintyFactor(); u > 1 && o.HasThreshold() {
			wrap("band:", "r_crit = "+quantity.FormatSig(float64(o.RCritLow/model.Parsec), 3)+"–"+quantity.Format(model.DimLength, float64(o.RCritHigh))+
				" if the unverified α is off by ×/÷ "+quantity.FormatSig(u, 3)+" either way")
		}
	}
	d.ownTest(c, o, wrap)
	d.conventions(i, wrap, add)
	wrap("calibrated:", rangeText(c.Range))
	if !o.InRange() {
		wrap("caution:", "the inputs leave the calibrated range in "+strings.Join(o.Leaves.Names(), ", "))
	}
	conv := "f = " + quantity.FormatSig(d.params.HeatCapacity.Factor(), 2) + " (" + d.params.HeatCapacity.String() + "), 𝒩 = " + densityWord(d.params.DensityProduct)
	wrap("convention:", conv+" (the paper's own convention is not confirmed)")
	wrap("physics:", c.Note)
	if d.outcomes != nil && i < len(d.outcomes.scores) {
		wrap("runs:", scoreDetails(d.outcomes, i))
	}
}

// ownTest describes the quantities of c's own test: the swept-up gas of
// the bow shock (CoolShocked), the warm-gas test of a third outcome, the
// turbulent crushing time.
func (d detailsPane) ownTest(c *model.Criterion, o model.Outcome, wrap func(label, text string)) {
	s := &d.res.State
	if c.Cool == model.CoolShocked {
		which := "the Rankine–Hugoniot post-shock state (M > 1)"
		if !s.Shocked {
			which = "the stagnation state (M ≤ 1: no shock)"
		}
		wrap("swept-up gas:", which+": T = "+quantity.Format(model.DimTemperature, float64(s.TShocked))+
			", n = "+quantity.Format(model.DimNumberDensity, float64(s.NShocked))+
			", t_cool,shocked = "+quantity.Format(model.DimTime, float64(s.TCoolShocked)))
	}
	if c.HasThirdOutcome() {
		tw := quantity.Format(model.DimTemperature, float64(c.WarmTemperature))
		switch {
		case !math.IsNaN(o.WarmRatio):
			res := "passes → transformed"
			if !(o.WarmRatio < o.WarmThreshold) {
				res = "fails → destroyed"
			}
			wrap("warm gas:", "the cloud fails the main test; as gas at "+tw+" its ratio would be "+quantity.FormatSig(o.WarmRatio, 3)+
				" against the limit "+quantity.FormatSig(o.WarmThreshold, 3)+": "+res)
		case o.Verdict == model.Survives:
			wrap("warm gas:", "not needed: the cloud passes the main test")
		default:
			wrap("warm gas:", "not applied: the cloud is not colder than "+tw+", so it cannot be transformed")
		}
	}
	if c.Dyn == model.DynTurbulentCC {
		f := c.FMix
		if f <= 0 {
			f = model.DefaultFMix
		}
		wrap("turbulence:", "M_turb = "+quantity.FormatSig(s.Params.MachTurb, 3)+", f_mix = "+quantity.FormatSig(f, 3)+
			": t̃_cc = "+quantity.Format(model.DimTime, float64(s.TurbulentCrushingTime(f)))+" (t_cc = "+quantity.Format(model.DimTime, float64(s.TCC))+")")
	}
}

// conventions writes r_crit and the verdict under every convention of
// the spread, and the one-line summary.
func (d detailsPane) conventions(i int, wrap func(label, text string), add func(line string)) {
	st, sp := d.styles, d.spread
	c := &d.res.Criteria[i]
	if c.Cool == model.CoolNone {
		return
	}
	switch {
	case sp.err != nil:
		wrap("conventions:", "not evaluated: "+sp.err.Error())
		return
	case i >= len(sp.spreads):
		return
	}
	s := sp.spreads[i]
	wrap("conventions:", "r_crit under each f × 𝒩 with the cooling function in use — "+report.SpreadSummary(*c, s, len(sp.cases)))
	for k, cs := range sp.cases {
		rc := "none"
		if r := s.RCrit[k]; !math.IsInf(float64(r), 0) && !math.IsNaN(float64(r)) {
			rc = st.Format(model.DimLength, float64(r))
		}
		name := strings.TrimSuffix(cs.String(), ", cooling 1")
		add("  " + st.fit(st.T(name), 18) + st.fit(rc, 12) + verdictText(st, s.Verdict[k], false, false))
	}
}

// scoreDetails describes criterion i's score against the outcomes: hits
// and misses, and what it said for the runs of each outcome.
func scoreDetails(o *outcomeSet, i int) string {
	sc := o.scores[i]
	parts := []string{strconv.Itoa(sc.Hits) + " of " + strconv.Itoa(sc.Hits+sc.Misses) + " runs of " + o.name + " predicted right"}
	for _, g := range []struct {
		name string
		outs []model.RunOutcome
	}{{"grew or survived", []model.RunOutcome{model.RunGrew, model.RunSurvived}}, {"transformed", []model.RunOutcome{model.RunTransformed}},
		{"destroyed", []model.RunOutcome{model.RunDestroyed}}} {
		var n [3]int
		total := 0
		for _, ro := range g.outs {
			for v := range n {
				n[v] += sc.Confusion[ro][v]
				total += sc.Confusion[ro][v]
			}
		}
		if total == 0 {
			continue
		}
		var said []string
		for _, v := range model.Verdicts() {
			if n[v] > 0 {
				said = append(said, verdictWord(v)+" ×"+strconv.Itoa(n[v]))
			}
		}
		parts = append(parts, strconv.Itoa(total)+" "+g.name+" (predicted "+strings.Join(said, ", ")+")")
	}
	return strings.Join(parts, "; ") + " (a transformed run counts as survival for a criterion without a third outcome)"
}
