package tui

import (
	"fmt"
	"path/filepath"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
)

// Commands: the tea.Cmd producers. Each does its work off the update
// loop from copies of what it needs and reports back with a message
// (msgs.go); files are opened only here, through the Opener main passes
// in, and written only by the commands of files.go.

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
	case viewOutflow:
		m.carry = req.Carry
		o, err := chartspec.NewOutflow(req)
		switch {
		case err != nil:
			m.line = &chartspec.LineChart{Title: "outflow", Note: "no outflow: " + oneLine(err.Error())}
		case req.Carry:
			m.outflow = o
			m.line, m.line2 = o.CarriedCharts(req)
		default:
			m.outflow = o
			m.line = o.ProfileChart(req)
		}
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

// oneLine joins a message onto one line for the status line.
func oneLine(s string) string {
	return strings.Join(strings.Fields(s), " ")
}
