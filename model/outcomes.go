package model

import (
	"fmt"
	"math"
	"strings"
)

// RunOutcome is what happened to the cloud in a simulation.
type RunOutcome int

const (
	RunDestroyed   RunOutcome = iota // the cloud was shredded and mixed away
	RunSurvived                      // the cold gas survived without clear growth
	RunGrew                          // the cold gas survived and grew
	RunTransformed                   // the cloud was transformed entirely to warmer (~10⁴ K) gas
)

var runOutcomeNames = [...]string{"destroyed", "survived", "grew", "transformed"}

// RunOutcomes lists the outcomes in display order.
func RunOutcomes() []RunOutcome {
	return []RunOutcome{RunGrew, RunSurvived, RunTransformed, RunDestroyed}
}

// String returns "destroyed", "survived", "grew" or "transformed".
func (o RunOutcome) String() string {
	if o < 0 || int(o) >= len(runOutcomeNames) {
		return fmt.Sprintf("RunOutcome(%d)", int(o))
	}
	return runOutcomeNames[o]
}

// ParseRunOutcome parses the String form of a RunOutcome.
func ParseRunOutcome(s string) (RunOutcome, error) {
	for i, n := range runOutcomeNames {
		if strings.EqualFold(s, n) {
			return RunOutcome(i), nil
		}
	}
	return 0, fmt.Errorf("unknown outcome %q (want grew, survived, destroyed or transformed)", s)
}

// A SimRun is one simulation with its outcome: the inputs in Params (CGS,
// conventions as the run used them where known), and where it comes from.
type SimRun struct {
	Params  Params
	Outcome RunOutcome
	Label   string // for people, e.g. "run 12"
	Source  string // the paper or the user's own runs, with its status
}

// Matches reports whether criterion c's verdict v predicts run outcome o.
// Grew and survived are survival; a transformed run matches Transformed
// and, for a criterion without a third outcome, Survives, since gas at
// ~10⁴ K survives (cloudwind's choice, stated with the scores).
func Matches(c *Criterion, v Verdict, o RunOutcome) bool {
	switch o {
	case RunGrew, RunSurvived:
		return v == Survives
	case RunTransformed:
		return v == Transformed || (!c.HasThirdOutcome() && v == Survives)
	}
	return v == Destroyed
}

// A Score is how well one criterion predicts a set of simulation outcomes.
type Score struct {
	Hits, Misses int
	// Confusion[o][v] counts the runs with outcome o (RunOutcome) that the
	// criterion gave verdict v (Verdict).
	Confusion [4][3]int
}

// Accuracy returns hits/(hits + misses), NaN without runs.
func (s Score) Accuracy() float64 {
	if s.Hits+s.Misses == 0 {
		return math.NaN()
	}
	return float64(s.Hits) / float64(s.Hits+s.Misses)
}

// ScoreCriteria evaluates every criterion of cs on every run (Evaluate,
// with the cooling function coolingAt returns for the run's metallicity)
// and scores its verdicts against the outcomes (Matches). It also returns
// each run's Result, in order, for display. A run whose inputs are invalid
// is an error naming the run.
func ScoreCriteria(runs []SimRun, coolingAt func(z float64) (CoolingFunction, error), cs []Criterion) ([]Score, []Result, error) {
	scores := make([]Score, len(cs))
	results := make([]Result, len(runs))
	for i := range runs {
		r := &runs[i]
		cf, err := coolingAt(r.Params.Metallicity)
		if err != nil {
			return nil, nil, fmt.Errorf("run %d (%s): %w", i+1, r.Label, err)
		}
		if err := results[i].Evaluate(r.Params, cf, cs); err != nil {
			return nil, nil, fmt.Errorf("run %d (%s): %w", i+1, r.Label, err)
		}
		for k, o := range results[i].Outcomes {
			s := &scores[k]
			s.Confusion[r.Outcome][o.Verdict]++
			if Matches(&cs[k], o.Verdict, r.Outcome) {
				s.Hits++
			} else {
				s.Misses++
			}
		}
	}
	return scores, results, nil
}
