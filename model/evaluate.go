package model

// A Result is a State with every criterion evaluated on it.
type Result struct {
	State
	Criteria []Criterion // the criteria, in order
	Outcomes []Outcome   // Outcomes[i] belongs to Criteria[i]

	thresholds []float64 // α (χ/100)^β of each criterion, reused by Reevaluate
}

// Evaluate derives the state of p with cooling function cf and evaluates
// every criterion in cs on it. It returns the error of Derive.
func Evaluate(p Params, cf CoolingFunction, cs []Criterion) (Result, error) {
	var r Result
	err := r.Evaluate(p, cf, cs)
	return r, err
}

// Evaluate recomputes r in place, reusing its storage: the allocation-free
// path for sweeps.
func (r *Result) Evaluate(p Params, cf CoolingFunction, cs []Criterion) error {
	if err := r.State.derive(p, cf); err != nil {
		return err
	}
	r.Criteria = cs
	if cap(r.Outcomes) < len(cs) {
		r.Outcomes = make([]Outcome, len(cs))
	}
	r.Outcomes = r.Outcomes[:len(cs)]
	if cap(r.thresholds) < len(cs) {
		r.thresholds = make([]float64, len(cs))
	}
	r.thresholds = r.thresholds[:len(cs)]
	for i := range cs {
		r.thresholds[i] = cs[i].Threshold(r.Params.Chi)
		r.State.evaluate(&r.Outcomes[i], &cs[i], r.thresholds[i])
	}
	return nil
}

// Reevaluate recomputes r for another Mach number and cloud radius, keeping
// every other input: the fast path for sweeps. Of the cooling times only
// that of the bow-shock gas (CoolShocked) depends on either, and it is
// recomputed (deriveFlow) when the Mach number changes; the thermal state,
// the other Λ lookups and the search along the mixing isobar are reused.
// r must hold a successful Evaluate (or Reevaluate), whose state it relies
// on. It returns
// a *FieldError for an invalid mach or rCl and leaves r unchanged then.
func (r *Result) Reevaluate(mach float64, rCl Length) error {
	// The bounds of Validate for these two fields, checked directly; the full
	// Validate then only runs to word the error.
	if !(mach > 0 && mach <= MaxMach && rCl >= MinRCloud && rCl <= MaxRCloud) {
		p := r.Params
		p.Mach, p.RCloud = mach, rCl
		if err := p.Validate(); err != nil {
			return err
		}
	}
	r.Params.Mach, r.Params.RCloud = mach, rCl
	if mach == r.windMach {
		r.State.deriveRadius() // along the radius the wind and the swept-up gas stay
	} else {
		r.State.deriveFlow()
	}
	for i := range r.Criteria {
		r.State.evaluate(&r.Outcomes[i], &r.Criteria[i], r.thresholds[i])
	}
	return nil
}
