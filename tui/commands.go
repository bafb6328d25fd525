package tui

import (
	"encoding/json"
	"fmt"
	"io"
	"path/filepath"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/atomicfile"
	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// Messages. Commands do the work that is not instant (charts, maps, files)
// off the update loop and report back with one of these.

// chartMsg carries a computed chart for request gen.
type chartMsg struct {
	gen    int
	view   viewKind
	line   *LineChart
	line2  *LineChart
	regime *RegimeMap
	text   []string
}

// statusMsg sets the status line.
type statusMsg struct {
	text  string
	isErr bool
}

// coolingMsg carries a resolved cooling source (or the error).
type coolingMsg struct {
	src *cooling.Source
	err error
}

// scenarioMsg carries a loaded scenario and its cooling source.
type scenarioMsg struct {
	sc  scenario.Scenario
	src *cooling.Source
	err error
}

// chartRequest is everything a chart computation reads: copies, so that
// the command never touches the App.
type chartRequest struct {
	gen      int
	view     viewKind
	params   model.Params
	cf       model.CoolingFunction
	criteria []model.Criterion
	pin      *snapshot
	family   bool
	mapMach  bool
	selected int // criterion selected in the table (family mode)
	cols     int // chart area, for the regime map's resolution
	rows     int
}

// requestChart bumps the generation and starts computing the chart of the
// current view; results of older generations are dropped when they arrive.
func (a *App) requestChart() tea.Cmd {
	a.gen++
	cw, ch := a.chartSize()
	req := chartRequest{gen: a.gen, view: a.view, params: a.cur.params, cf: a.cur.cf, criteria: a.cfg.Criteria,
		family: a.family, mapMach: a.mapMach, selected: a.critSel, cols: cw, rows: ch}
	if a.pin != nil {
		p := a.pin.snapshot
		req.pin = &p
	}
	return func() tea.Msg { return computeChart(req) }
}

// computeChart builds the chart of a request.
func computeChart(r chartRequest) tea.Msg {
	m := chartMsg{gen: r.gen, view: r.view}
	switch r.view {
	case viewThreshold:
		m.line = thresholdChart(r)
	case viewCooling:
		m.line = coolingChart(r)
	case viewRatios:
		m.line = ratioChart(r)
	case viewRegime:
		m.regime = regimeMap(r)
	case viewEvolution:
		m.line, m.line2 = evolutionCharts(r)
	case viewPlan:
		m.text = planLines(r)
	}
	return m
}

// requestCooling resolves a cooling spec in a command (a table is a file).
func (a *App) requestCooling(spec string, table []string) tea.Cmd {
	open := a.cfg.Open
	return func() tea.Msg {
		src, err := cooling.Resolve("cooling", spec, table, open)
		return coolingMsg{src, err}
	}
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

// loadScenario reads a scenario file in a command.
func loadScenario(path string, open cooling.Opener) tea.Cmd {
	return func() tea.Msg {
		if open == nil {
			return scenarioMsg{err: fmt.Errorf("no file access")}
		}
		r, name, closeFn, err := open(path)
		if err != nil {
			return scenarioMsg{err: fmt.Errorf("open %s: %w", quantity.Sanitize(path), err)}
		}
		defer closeFn()
		sc, err := scenario.Parse(r, name)
		if err != nil {
			return scenarioMsg{err: err}
		}
		return resolveScenario(sc, open, filepath.Dir(path))
	}
}

// resolveScenario resolves a scenario's cooling source; a relative table
// path is taken relative to the scenario file's directory.
func resolveScenario(sc scenario.Scenario, open cooling.Opener, dir string) scenarioMsg {
	spec := sc.Cooling
	if spec == "" {
		spec = cooling.DefaultSpec
	}
	spec = scenario.CoolingSpec(spec, dir)
	src, err := cooling.Resolve("scenario cooling", spec, sc.Table, open)
	return scenarioMsg{sc: sc, src: src, err: err}
}

// applyScenario switches to a loaded scenario; a bad one leaves the
// current state and explains why.
func (a *App) applyScenario(m scenarioMsg) tea.Cmd {
	if m.err != nil {
		a.setStatus(oneLine(m.err.Error())+" — the current state is kept", true)
		return nil
	}
	next := snapshot{params: normalise(m.sc.Params), cooling: m.src}
	before := a.scenario
	a.scenario = m.sc.Name
	cmd := a.change(next, "loaded "+scenarioLabel(m.sc))
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

// currentScenario describes the current state as a scenario for saving.
func (a *App) currentScenario() scenario.Scenario {
	name := a.scenario
	if name == "" {
		name = "saved from the explorer"
	}
	return scenario.Scenario{Name: name, Params: a.cur.params, Cooling: a.cur.cooling.Spec, Table: a.cur.cooling.Table}
}

// saveScenario writes sc to path atomically in a command; a table path in
// sc is rewritten relative to path's directory.
func saveScenario(path string, sc scenario.Scenario) tea.Cmd {
	return func() tea.Msg {
		var err error
		if sc.Cooling, err = scenario.SavedCoolingSpec(sc.Cooling, path); err != nil {
			return statusMsg{"not saved: " + oneLine(err.Error()), true}
		}
		err = atomicfile.Write(path, func(w io.Writer) error { return scenario.Write(w, sc) })
		if err != nil {
			return statusMsg{oneLine(err.Error()), true}
		}
		return statusMsg{"saved scenario to " + quantity.Sanitize(path), false}
	}
}

// exportChart writes the chart on screen to path in a command.
func exportChart(path string, c chartState) tea.Cmd {
	return func() tea.Msg {
		var err error
		switch {
		case c.line != nil:
			err = ExportLineChart(c.line, path)
		case c.regime != nil:
			err = ExportRegimeMap(c.regime, path)
		default:
			err = fmt.Errorf("no chart yet")
		}
		if err != nil {
			return statusMsg{oneLine(err.Error()), true}
		}
		return statusMsg{"exported the chart to " + quantity.Sanitize(path), false}
	}
}

// exportState writes the evaluated state as JSON (the schema of cloudwind
// eval --format json) in a command.
func exportState(path string, doc map[string]any) tea.Cmd {
	return func() tea.Msg {
		err := atomicfile.Write(path, func(w io.Writer) error {
			enc := json.NewEncoder(w)
			enc.SetIndent("", "  ")
			return enc.Encode(doc)
		})
		if err != nil {
			return statusMsg{oneLine(err.Error()), true}
		}
		return statusMsg{"exported the state to " + quantity.Sanitize(path), false}
	}
}

// oneLine joins a message onto one line for the status line.
func oneLine(s string) string {
	return strings.Join(strings.Fields(s), " ")
}
