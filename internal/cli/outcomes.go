package cli

import (
	"fmt"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// outcomeScores are eval's scores of the criteria against simulation runs.
type outcomeScores struct {
	name      string // the file, or "demo"
	loaded    scenario.Outcomes
	scores    []model.Score
	results   []model.Result
	criteria  []model.Criterion
	defaulted []string
}

// scoreOutcomes loads an outcomes file (or the fictional demo) with the
// scenario's inputs as the base of what it leaves out, and scores every
// criterion against it.
func scoreOutcomes(e *env, sc *evaluated, path string) (*outcomeScores, error) {
	var loaded scenario.Outcomes
	var err error
	name := path
	if path == scenario.DemoOutcomesName {
		loaded, err = scenario.LoadOutcomes(strings.NewReader(scenario.DemoOutcomes), "demo outcomes (fictional)", sc.params)
	} else {
		r, n, closeFn, oerr := openInput(e, path)
		if oerr != nil {
			return nil, fmt.Errorf("--outcomes: %w", oerr)
		}
		name = n
		loaded, err = scenario.LoadOutcomes(r, n, sc.params)
		closeFn()
	}
	if err != nil {
		return nil, fmt.Errorf("--outcomes: %w", err)
	}
	at := func(z float64) (model.CoolingFunction, error) { return sc.cooling.Function(z) }
	scores, results, err := model.ScoreCriteria(loaded.Runs, at, sc.criteria)
	if err != nil {
		return nil, fmt.Errorf("--outcomes %s: %w", sanitizeArg(name), err)
	}
	return &outcomeScores{name: name, loaded: loaded, scores: scores, results: results, criteria: sc.criteria, defaulted: loaded.Defaulted}, nil
}

// writeScoresText writes the scores: one line per criterion, then its
// confusion matrix, then the runs the file left inputs out of.
func writeScoresText(b *strings.Builder, sc *evaluated) {
	o := sc.scores
	fmt.Fprintf(b, "\nScores against %d simulation runs (%s)\n", len(o.loaded.Runs), o.name)
	if len(o.defaulted) > 0 {
		fmt.Fprintf(b, "  the file gives no %s: those take the scenario's values\n", strings.Join(o.defaulted, ", "))
	}
	fmt.Fprintf(b, "  a transformed run counts as survival for a criterion without a third outcome (cloudwind's choice)\n")
	t := report.Table{Indent: "  ", Wrap: []bool{true}, MinWrap: 20}
	t.Row("criterion", "hits", "misses", "accuracy", "grew/surv.", "transf.", "destroyed")
	for i, s := range o.scores {
		c := s.Confusion
		row := func(os ...model.RunOutcome) string {
			var n [3]int
			for _, x := range os {
				for v := range n {
					n[v] += c[x][v]
				}
			}
			return fmt.Sprintf("%d %d %d", n[model.Survives], n[model.Transformed], n[model.Destroyed])
		}
		t.Row(quantity.Sanitize(o.criteria[i].Label), fmt.Sprint(s.Hits), fmt.Sprint(s.Misses), quantity.FormatSig(s.Accuracy(), 3),
			row(model.RunGrew, model.RunSurvived), row(model.RunTransformed), row(model.RunDestroyed))
	}
	b.WriteString(t.String())
	fmt.Fprintf(b, "  the last three columns: runs with that outcome the criterion said survive, transformed, destroyed\n")
}

// scoresJSON describes the scores for eval --format json.
func scoresJSON(sc *evaluated) map[string]any {
	o := sc.scores
	var crit []map[string]any
	for i, s := range o.scores {
		conf := map[string]map[string]int{}
		for _, ro := range model.RunOutcomes() {
			m := map[string]int{}
			for _, v := range model.Verdicts() {
				m[v.String()] = s.Confusion[ro][v]
			}
			conf[ro.String()] = m
		}
		crit = append(crit, map[string]any{"id": o.criteria[i].ID, "label": o.criteria[i].Label, "hits": s.Hits, "misses": s.Misses,
			"accuracy": report.JSONNumber(s.Accuracy()), "confusion": conf})
	}
	var runs []map[string]any
	for i, r := range o.loaded.Runs {
		q := r.Params
		verdicts := map[string]string{}
		for k, out := range o.results[i].Outcomes {
			verdicts[o.criteria[k].ID] = out.Verdict.String()
		}
		runs = append(runs, map[string]any{"label": r.Label, "source": r.Source, "outcome": r.Outcome.String(),
			"inputs": map[string]any{"chi": q.Chi, "mach": q.Mach, "pressure_kcm3": float64(q.Pressure), "t_cloud_k": float64(q.TCloud),
				"radius_pc": float64(q.RCloud / model.Parsec), "metallicity_zsun": q.Metallicity, "mach_turb": q.MachTurb},
			"verdicts": verdicts})
	}
	def := o.defaulted
	if def == nil {
		def = []string{}
	}
	return map[string]any{"file": o.name, "scores": crit, "runs": runs, "defaulted_inputs": def,
		"transformed_rule": "a transformed run counts as survival for a criterion without a third outcome (cloudwind's choice)"}
}
