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
	"cloudwind/internal/chartspec"
	"cloudwind/internal/figure"
	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
)

// Commands: the tea.Cmd producers. Each does its work off the update
// loop from copies of what it needs and reports back with a message
// (msgs.go); files are opened only here, through the Opener main passes
// in, and written atomically.

// computeChart builds the chart of view from req for request gen.
func computeChart(gen int, view viewKind, req chartspec.Request) tea.Cmd {
	return func() tea.Msg { return buildChart(gen, view, req) }
}

// buildChart builds the chart of view from req.
func buildChart(gen int, view viewKind, req chartspec.Request) chartMsg {
	m := chartMsg{gen: gen, view: view}
	switch view {
	case viewThreshold:
		m.line = chartspec.ThresholdChart(req)
	case viewCooling:
		m.line = chartspec.CoolingChart(req)
	case viewRatios:
		m.line = chartspec.RatioChart(req)
	case viewRegime:
		m.regime = chartspec.Regime(req)
	case viewEvolution:
		m.line, m.line2 = chartspec.EvolutionCharts(req)
	case viewPlan:
		m.text = planLines(req)
	}
	return m
}

// resolveCooling resolves a cooling spec (a table is a file).
func resolveCooling(spec string, table []string, open cooling.Opener) tea.Cmd {
	return func() tea.Msg {
		src, err := cooling.Resolve("cooling", spec, table, open)
		return coolingMsg{src, err}
	}
}

// loadScenario reads a scenario file.
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

// loadDemo resolves the cooling source of a demo scenario.
func loadDemo(sc scenario.Scenario, open cooling.Opener) tea.Cmd {
	return func() tea.Msg { return resolveScenario(sc, open, "") }
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

// saveScenario writes sc to path atomically; a table path in sc is
// rewritten relative to path's directory.
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

// exportChart writes the chart on screen to path as a figure.
func exportChart(path string, c chartState) tea.Cmd {
	return func() tea.Msg {
		var err error
		switch {
		case c.line != nil:
			err = figure.WriteLineChart(c.line, path)
		case c.regime != nil:
			err = figure.WriteRegimeMap(c.regime, path)
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
// eval --format json).
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
