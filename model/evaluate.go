package model

// A Result is a State with every criterion evaluated on it.
type Result struct {
	State
	Criteria []Criterion // the criteria, in order
	Outcomes []Outcome   // Outcomes[i] belongs to Criteria[i]
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
	for i := range cs {
		r.Outcomes[i] = r.State.Evaluate(&cs[i])
	}
	return nil
}
