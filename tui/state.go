package tui

import (
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// The App's state: the inputs and their evaluation, their history, the
// pinned scenario A and the status line. Every change of the inputs goes
// through change, which evaluates the new state first.

// snapshot is a complete state of the inputs: what undo restores and what
// compare mode pins.
type snapshot struct {
	params  model.Params
	cooling *cooling.Source
	cf      model.CoolingFunction
	wind    windInputs // the outflow view's own inputs
}

// pinned is scenario A of compare mode.
type pinned struct {
	snapshot
	res model.Result
}

// status is the status line: a message or an error.
type status struct {
	text  string
	isErr bool
}

// maxHistory bounds the undo stack.
const maxHistory = 200

// change applies a new snapshot if it is valid: the metallicity may need
// a new cooling curve, and everything is re-evaluated, the wind of the
// outflow view too. An invalid one is refused with the reason in the
// status line and the last good state stays; so is one whose wind is not
// valid while the outflow view is shown or when a wind input changed (in
// the other views the wind's validity does not hold the inputs back: the
// outflow view then says why it cannot be drawn).
func (a *App) change(next snapshot, note string) tea.Cmd {
	if next.cooling != a.cur.cooling || next.params.Metallicity != a.cur.params.Metallicity || next.cf == nil {
		cf, err := next.cooling.Function(next.params.Metallicity)
		if err != nil {
			a.setStatus("Z: "+err.Error(), true)
			return nil
		}
		next.cf = cf
	}
	var res model.Result
	if err := res.Evaluate(next.params, next.cf, a.cfg.Criteria); err != nil {
		a.setStatus(a.in.FieldMessage(err), true)
		return nil
	}
	we := evalWind(next, a.cfg.Criteria)
	if !we.ok() && (a.outflowShown() || next.wind != a.cur.wind) {
		a.setStatus(a.windMessage(we.err), true)
		return nil
	}
	a.history = append(a.history, a.cur)
	if len(a.history) > maxHistory {
		a.history = a.history[1:]
	}
	rescore := next.cooling != a.cur.cooling
	a.cur, a.res, a.wind = next, res, we
	a.setStatus(note, false)
	return a.afterChange(rescore)
}

// afterChange requests the chart of the new state and, when the cooling
// source changed and outcomes are loaded, their scores with it.
func (a *App) afterChange(coolingChanged bool) tea.Cmd {
	if coolingChanged && a.outcomes != nil {
		a.outcomesGen++
		return tea.Batch(a.requestChart(), rescoreOutcomes(a.outcomesGen, a.outcomes, a.cur.cooling, a.cfg.Criteria))
	}
	return a.requestChart()
}

// undo returns to the previous snapshot.
func (a *App) undo() tea.Cmd {
	if len(a.history) == 0 {
		a.setStatus("nothing to undo", false)
		return nil
	}
	prev := a.history[len(a.history)-1]
	a.history = a.history[:len(a.history)-1]
	var res model.Result
	if err := res.Evaluate(prev.params, prev.cf, a.cfg.Criteria); err != nil {
		a.setStatus(err.Error(), true)
		return nil
	}
	rescore := prev.cooling != a.cur.cooling
	a.cur, a.res, a.wind = prev, res, evalWind(prev, a.cfg.Criteria)
	a.setStatus("undone", false)
	return a.afterChange(rescore)
}

// applyCooling switches to a resolved cooling source.
func (a *App) applyCooling(m coolingMsg) tea.Cmd {
	if m.err != nil {
		a.setStatus(oneLine(m.err.Error()), true)
		return nil
	}
	next := a.cur
	next.cooling, next.cf = m.src, nil
	return a.change(next, "cooling: "+m.src.Desc)
}

// applyScenario switches to a loaded scenario; a bad one leaves the
// current state and explains why.
func (a *App) applyScenario(m scenarioMsg) tea.Cmd {
	if m.err != nil {
		a.setStatus(oneLine(m.err.Error())+" — the current state is kept", true)
		return nil
	}
	next := snapshot{params: m.sc.Params, cooling: m.src, wind: windFrom(m.sc.Outflow)}
	before := a.scenario
	a.scenario = m.sc.Name
	note := "loaded " + scenarioLabel(m.sc)
	if m.sc.Outflow != nil && !a.outflowShown() {
		note += " (with an outflow: 7 shows it)"
	}
	cmd := a.change(next, note)
	if a.status.isErr {
		a.scenario = before
	}
	return cmd
}

// scenarioLabel names a scenario for the status line and header.
func scenarioLabel(sc scenario.Scenario) string {
	name := quantity.Sanitize(sc.Name)
	if name == "" {
		name = "unnamed scenario"
	}
	return name
}

// currentScenario describes the current state as a scenario for saving,
// with the [outflow] table when the wind's inputs came from a scenario or
// were changed here (the launch radius is not part of it).
func (a *App) currentScenario() scenario.Scenario {
	name := a.scenario
	if name == "" {
		name = "saved from the explorer"
	}
	sc := scenario.Scenario{Name: name, Params: a.cur.params, Cooling: a.cur.cooling.Spec, Table: a.cur.cooling.Table}
	if a.cur.wind.given {
		inj := a.cur.wind.inj
		sc.Outflow = &inj
	}
	return sc
}

func (a *App) setStatus(text string, isErr bool) {
	a.status = status{a.styles.T(quantity.Sanitize(text)), isErr}
}

// cloneResult copies a Result so that later evaluations do not share its
// slices.
func cloneResult(r *model.Result) model.Result {
	c := *r
	c.Outcomes = append([]model.Outcome(nil), r.Outcomes...)
	c.Cautions = append([]model.Caution(nil), r.Cautions...)
	return c
}
