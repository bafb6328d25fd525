package tui

import (
	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/chartspec"
	"cloudwind/internal/report"
	"cloudwind/internal/scenario"
)

// The keys that work whatever pane has the focus (App.handleKey routes
// here after prompts and overlays): views, zoom, compare, files, undo.

// globalKey handles the keys that work in every pane; ok is false for
// the others.
func (a *App) globalKey(msg tea.KeyMsg) (cmd tea.Cmd, ok bool) {
	k := &a.keys
	switch {
	case key.Matches(msg, k.Quit):
		return tea.Quit, true
	case key.Matches(msg, k.Help):
		a.help.Show()
	case key.Matches(msg, k.Details):
		a.details.Show()
	case key.Matches(msg, k.Focus):
		a.focus = (a.focus + 1) % focusCount
	case key.Matches(msg, k.FocusBack):
		a.focus = (a.focus + focusCount - 1) % focusCount
	case key.Matches(msg, k.Zoom):
		a.zoom = !a.zoom
		a.setStatus(map[bool]string{true: "full-screen chart: the keys still act on the " + a.focus.String() + " pane; z or esc back",
			false: "all panes"}[a.zoom], false)
		return a.requestChart(), true
	case key.Matches(msg, k.View1, k.View2, k.View3, k.View4, k.View5, k.View6, k.View7):
		return a.setView(viewKind(msg.String()[0] - '1')), true
	case key.Matches(msg, k.NextView):
		return a.setView((a.chart.Kind() + 1) % viewCount), true
	case key.Matches(msg, k.Family):
		a.setStatus("family over Mach numbers "+onOff(a.chart.ToggleFamily())+" (threshold chart; the selected criterion)", false)
		return a.requestChart(), true
	case key.Matches(msg, k.MapAxis):
		axes := "χ × r_cl"
		if a.chart.ToggleMapAxis() {
			axes = "χ × Mach"
		}
		a.setStatus("regime map axes: "+axes, false)
		return a.requestChart(), true
	case key.Matches(msg, k.Carry):
		return a.toggleCarry(), true
	case key.Matches(msg, k.Pin):
		a.pin = &pinned{snapshot: a.cur, res: cloneResult(&a.res)}
		a.setStatus("pinned the current scenario as A; changes now make B (P unpins)", false)
		return a.requestChart(), true
	case key.Matches(msg, k.Unpin):
		if a.pin != nil {
			a.pin = nil
			a.setStatus("compare mode off", false)
			return a.requestChart(), true
		}
	case key.Matches(msg, k.Palette):
		p := LightPalette()
		if a.styles.Palette.Name == "light" {
			p = DarkPalette()
		}
		a.styles = NewStyles(p, a.cfg.Color, a.cfg.ASCII)
		a.setStatus(p.Name+" palette", false)
	case key.Matches(msg, k.Scenarios):
		open := a.cfg.Open
		a.prompt.ChooseScenario(a.cfg.Demos, func(sc scenario.Scenario) tea.Cmd { return loadDemo(sc, open) },
			a.pathAction(func(path string) tea.Cmd { return loadScenario(path, a.cfg.Open) }))
	case key.Matches(msg, k.Outcomes):
		return a.toggleOutcomes(), true
	case key.Matches(msg, k.Save, k.ExportChart, k.ExportState):
		a.askFile(msg)
	case key.Matches(msg, k.Undo):
		return a.undo(), true
	case key.Matches(msg, k.ResetAll):
		return a.change(a.initial, "reset every input"), true
	default:
		return nil, false
	}
	return nil, true
}

// askFile opens the path prompt of s, x or J.
func (a *App) askFile(msg tea.KeyMsg) {
	k := &a.keys
	switch {
	case key.Matches(msg, k.Save):
		sc := a.currentScenario()
		a.askOutput("save scenario to", "scenario.toml", func(path string) (output, error) { return saveScenarioOutput(path, sc), nil })
	case key.Matches(msg, k.ExportChart) && a.chart.IsText():
		c, caption := a.chart.Shown(), chartspec.Caption(a.chartRequest())
		a.askOutput("export the plan to (.txt or .md)", "cloudwind-plan.txt", func(path string) (output, error) { return chartOutput(path, c, caption) })
	case key.Matches(msg, k.ExportChart):
		c, caption := a.chart.Shown(), chartspec.Caption(a.chartRequest())
		a.askOutput("export chart to (.svg or .png)", "cloudwind-chart.svg", func(path string) (output, error) { return chartOutput(path, c, caption) })
	case key.Matches(msg, k.ExportState):
		doc := report.StateDocument(&a.res, a.cur.cooling, a.cur.cf, a.cfg.Version)
		a.askOutput("export state to", "cloudwind-state.json", func(path string) (output, error) { return stateOutput(path, doc), nil })
	}
}

// toggleCarry switches the outflow view between r_crit along the wind and
// the carried cloud; from another view it opens the outflow view on the
// carried cloud.
func (a *App) toggleCarry() tea.Cmd {
	if !a.outflowShown() {
		if !a.chart.Carried() {
			a.chart.ToggleCarry()
		}
		cmd := a.setView(viewOutflow)
		if !a.status.isErr {
			a.setStatus("outflow: the carried cloud (c again: r_crit along the wind)", false)
		}
		return cmd
	}
	if a.chart.ToggleCarry() {
		a.setStatus("carried cloud, per criterion (criteria pane: ↑/↓ marks one's events)", false)
	} else {
		a.setStatus("outflow: r_crit along the wind", false)
	}
	return a.requestChart()
}

// syncKeys words the keys whose meaning depends on the state: x exports
// the plan view as text, O clears loaded outcomes, c goes back from the
// carried cloud.
func (a *App) syncKeys() {
	help := "carried cloud (7)"
	if a.outflowShown() && a.chart.Carried() {
		help = "r_crit along r (7)"
	}
	a.keys.Carry.SetHelp(a.keys.Carry.Help().Key, a.styles.T(help))
	help = "export chart SVG/PNG"
	if a.chart.IsText() {
		help = "export plan text"
	}
	a.keys.ExportChart.SetHelp(a.keys.ExportChart.Help().Key, help)
	help = "load sim. outcomes"
	if a.outcomes != nil {
		help = "clear sim. outcomes"
	}
	a.keys.Outcomes.SetHelp(a.keys.Outcomes.Help().Key, help)
}
