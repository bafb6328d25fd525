package tui

import (
	"fmt"
	"path/filepath"
	"strconv"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// Simulation outcomes (O): a file of runs and what happened to their
// clouds (scenario.LoadOutcomes; "demo" is cloudwind's fictional
// example), read in a command through the Opener, placed on the threshold
// chart and the regime map, and scored against every criterion
// (model.ScoreCriteria) for the criteria table and the details. The runs
// keep the inputs they were loaded with (what the file leaves out takes
// the scenario's values at that moment); the scores are computed again
// with the new cooling function when it changes.

// outcomeSet is a loaded outcomes file and its scores.
type outcomeSet struct {
	name      string // for legends: "fictional demo" or the file's base name
	path      string // for messages: "demo" or the file as opened
	runs      []model.SimRun
	defaulted []string      // the inputs the file leaves out (Field… names)
	scores    []model.Score // one per criterion, with the cooling function of gen
}

// outcomesMsg carries loaded and scored outcomes (or the error) for
// request gen.
type outcomesMsg struct {
	gen int
	set *outcomeSet
	err error
}

// loadOutcomes reads an outcomes file (or the demo) with base as the
// inputs it leaves out, and scores the criteria on it.
func loadOutcomes(gen int, path string, open cooling.Opener, base model.Params, src *cooling.Source, cs []model.Criterion) tea.Cmd {
	return func() tea.Msg {
		set := &outcomeSet{name: "fictional demo", path: scenario.DemoOutcomesName}
		var loaded scenario.Outcomes
		var err error
		if path == scenario.DemoOutcomesName {
			loaded, err = scenario.LoadOutcomes(strings.NewReader(scenario.DemoOutcomes), "demo outcomes (fictional)", base)
		} else {
			if open == nil {
				return outcomesMsg{gen: gen, err: fmt.Errorf("no file access")}
			}
			r, name, closeFn, oerr := open(path)
			if oerr != nil {
				return outcomesMsg{gen: gen, err: fmt.Errorf("open %s: %w", quantity.Sanitize(path), oerr)}
			}
			set.name, set.path = quantity.Sanitize(filepath.Base(name)), quantity.Sanitize(name)
			loaded, err = scenario.LoadOutcomes(r, name, base)
			closeFn()
		}
		if err != nil {
			return outcomesMsg{gen: gen, err: err}
		}
		if len(loaded.Runs) == 0 {
			return outcomesMsg{gen: gen, err: fmt.Errorf("%s: no runs", set.path)}
		}
		set.runs, set.defaulted = loaded.Runs, loaded.Defaulted
		return scoreOutcomes(gen, set, src, cs)
	}
}

// rescoreOutcomes scores set again, with the cooling source src.
func rescoreOutcomes(gen int, set *outcomeSet, src *cooling.Source, cs []model.Criterion) tea.Cmd {
	cp := *set
	return func() tea.Msg { return scoreOutcomes(gen, &cp, src, cs) }
}

// scoreOutcomes scores every criterion of cs on set's runs, with the
// cooling function src gives at each run's metallicity.
func scoreOutcomes(gen int, set *outcomeSet, src *cooling.Source, cs []model.Criterion) outcomesMsg {
	scores, _, err := model.ScoreCriteria(set.runs, src.Function, cs)
	if err != nil {
		return outcomesMsg{gen: gen, err: fmt.Errorf("%s: %w", set.path, err)}
	}
	set.scores = scores
	return outcomesMsg{gen: gen, set: set}
}

// toggleOutcomes asks for an outcomes file, or clears the loaded one.
func (a *App) toggleOutcomes() tea.Cmd {
	if a.outcomes != nil {
		a.outcomes = nil
		a.outcomesGen++ // a load or rescore under way is dropped
		a.setStatus("cleared the simulation outcomes (O loads them again)", false)
		return a.requestChart()
	}
	a.prompt.AskPath("load simulation outcomes from (CSV or ECSV; demo: fictional example)", scenario.DemoOutcomesName,
		a.pathAction(func(path string) tea.Cmd {
			a.outcomesGen++
			return loadOutcomes(a.outcomesGen, path, a.cfg.Open, a.cur.params, a.cur.cooling, a.cfg.Criteria)
		}))
	return nil
}

// applyOutcomes takes loaded or rescored outcomes of the latest request;
// an error leaves what was shown and explains why.
func (a *App) applyOutcomes(m outcomesMsg) tea.Cmd {
	if m.gen != a.outcomesGen {
		return nil // stale
	}
	if m.err != nil {
		a.setStatus(oneLine(m.err.Error()), true)
		return nil
	}
	fresh := a.outcomes == nil || a.outcomes.path != m.set.path || len(a.outcomes.runs) != len(m.set.runs)
	a.outcomes = m.set
	if fresh {
		note := "loaded " + strconv.Itoa(len(m.set.runs)) + " simulation runs from " + m.set.name
		if len(m.set.defaulted) > 0 {
			note += "; the file gives no " + strings.Join(m.set.defaulted, ", ") + ": those took the scenario's values"
		}
		a.setStatus(note+"; scores in the criteria table, O clears", false)
	}
	return a.requestChart()
}

// outcomeScores returns the scores of the loaded outcomes, or nil.
func (a *App) outcomeScores() []model.Score {
	if a.outcomes == nil {
		return nil
	}
	return a.outcomes.scores
}
