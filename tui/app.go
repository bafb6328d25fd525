package tui

import (
	"os"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/chartspec"
	"cloudwind/internal/report"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// Config is what the explorer starts from. main builds it from the command
// line; nothing in it is global.
type Config struct {
	Params   model.Params      // initial inputs (validated by the caller)
	Cooling  *cooling.Source   // initial cooling function
	Criteria []model.Criterion // the criteria, built-in or from a criteria file
	Scenario string            // name of the loaded scenario, if any
	Palette  Palette
	Color    bool           // false under NO_COLOR
	ASCII    bool           // no braille, ASCII borders
	Open     cooling.Opener // file access for tables and scenarios (used in commands only)
	Version  string
	Demos    []scenario.Scenario
}

// focus says which pane takes the selection keys.
type focus int

const (
	focusInputs focus = iota
	focusDerived
	focusCriteria
	focusCount
)

func (f focus) String() string {
	return [...]string{"inputs", "derived", "criteria"}[f]
}

// App is the explorer: the root Bubble Tea model. It holds the inputs and
// their evaluation (state.go), routes messages to its panes and composes
// their views (app_view.go); the panes own their state.
type App struct {
	cfg    Config
	keys   KeyMap
	styles Styles // the panes share it: the palette switch restyles them all
	width  int
	height int

	cur      snapshot
	res      model.Result // the evaluation of cur
	history  []snapshot   // undo stack
	initial  snapshot     // what reset returns to
	pin      *pinned
	scenario string
	focus    focus
	status   status

	in       inputsPane
	derived  readout
	criteria criteriaPane
	chart    chartPane
	details  detailsPane
	prompt   prompt
	help     helpOverlay
}

// New returns the explorer for cfg. It evaluates the initial state; an
// invalid one is an error (main validates before).
func New(cfg Config) (*App, error) {
	a := &App{cfg: cfg, keys: DefaultKeyMap(), scenario: cfg.Scenario}
	a.styles = NewStyles(cfg.Palette, cfg.Color, cfg.ASCII)
	st, k := &a.styles, &a.keys
	a.in, a.derived, a.criteria = newInputsPane(st, k), newReadout(st, k), newCriteriaPane(st, k)
	a.chart, a.details, a.prompt, a.help = newChartPane(st), newDetailsPane(st, k), newPrompt(st, k), newHelpOverlay(st, k)
	cf, err := cfg.Cooling.Function(cfg.Params.Metallicity)
	if err != nil {
		return nil, err
	}
	a.cur = snapshot{normalise(cfg.Params), cfg.Cooling, cf}
	if err := a.res.Evaluate(a.cur.params, cf, cfg.Criteria); err != nil {
		return nil, err
	}
	a.initial = a.cur
	a.sync()
	return a, nil
}

// Init starts the first chart computation.
func (a *App) Init() tea.Cmd { return a.requestChart() }

// Update handles a message, then hands the panes the new state.
func (a *App) Update(msg tea.Msg) (tea.Model, tea.Cmd) {
	cmd := a.update(msg)
	a.sync()
	return a, cmd
}

func (a *App) update(msg tea.Msg) tea.Cmd {
	switch msg := msg.(type) {
	case tea.WindowSizeMsg:
		a.width, a.height = msg.Width, msg.Height
		return a.requestChart()
	case chartMsg:
		a.chart, _ = a.chart.Update(msg)
	case statusMsg:
		a.status = status{msg.text, msg.isErr}
	case coolingMsg:
		return a.applyCooling(msg)
	case scenarioMsg:
		return a.applyScenario(msg)
	case tea.KeyMsg:
		return a.handleKey(msg)
	}
	return nil
}

// sync hands the panes what they show: the state, the focus and their
// sizes. Update calls it after every message.
func (a *App) sync() {
	var pin *model.Result
	if a.pin != nil {
		pin = &a.pin.res
	}
	a.in.SetValues(a.cur.params, a.cur.cooling.Spec, report.CoolingName(a.cur.cooling, a.cur.cf))
	a.derived.SetResult(&a.res, pin, a.cur.cf)
	a.criteria.SetResult(&a.res, pin)
	a.in.SetFocused(a.focus == focusInputs)
	a.derived.SetFocused(a.focus == focusDerived)
	a.criteria.SetFocused(a.focus == focusCriteria)
	about := subject{focus: a.focus}
	switch a.focus {
	case focusInputs:
		about.input = a.in.Current()
	case focusDerived:
		about.quantity = a.derived.Selected()
	case focusCriteria:
		about.criterion = a.criteria.Selected()
	}
	a.details.SetState(about, a.cur.params, a.cur.cooling, a.cur.cf, &a.res)
	a.resize()
}

// handleKey routes a key: prompts and overlays first, then global keys,
// then the focused pane.
func (a *App) handleKey(msg tea.KeyMsg) tea.Cmd {
	var cmd tea.Cmd
	switch {
	case a.prompt.Open():
		a.prompt, cmd = a.prompt.Update(msg)
		return cmd
	case a.in.Editing():
		if msg.Type == tea.KeyEnter {
			return a.applyEdit()
		}
		a.in, cmd = a.in.Update(msg)
		return cmd
	case a.help.Open():
		a.help, cmd = a.help.Update(msg)
		return cmd
	case a.details.Open():
		a.details, cmd = a.details.Update(msg)
		if a.details.Open() && key.Matches(msg, a.keys.Up, a.keys.Down) {
			// Moving the selection keeps the details open on the new item.
			return a.updateFocused(msg)
		}
		return cmd
	}
	k := &a.keys
	switch {
	case key.Matches(msg, k.Quit):
		return tea.Quit
	case key.Matches(msg, k.Help):
		a.help.Show()
	case key.Matches(msg, k.Details):
		a.details.Show()
	case key.Matches(msg, k.Focus):
		a.focus = (a.focus + 1) % focusCount
	case key.Matches(msg, k.FocusBack):
		a.focus = (a.focus + focusCount - 1) % focusCount
	case key.Matches(msg, k.View1):
		return a.setView(viewThreshold)
	case key.Matches(msg, k.View2):
		return a.setView(viewCooling)
	case key.Matches(msg, k.View3):
		return a.setView(viewRatios)
	case key.Matches(msg, k.View4):
		return a.setView(viewRegime)
	case key.Matches(msg, k.View5):
		return a.setView(viewEvolution)
	case key.Matches(msg, k.View6):
		return a.setView(viewPlan)
	case key.Matches(msg, k.NextView):
		return a.setView((a.chart.Kind() + 1) % viewCount)
	case key.Matches(msg, k.Family):
		a.setStatus("family over Mach numbers "+onOff(a.chart.ToggleFamily())+" (threshold chart; the selected criterion)", false)
		return a.requestChart()
	case key.Matches(msg, k.MapAxis):
		axes := "χ × r_cl"
		if a.chart.ToggleMapAxis() {
			axes = "χ × Mach"
		}
		a.setStatus("regime map axes: "+axes, false)
		return a.requestChart()
	case key.Matches(msg, k.Pin):
		a.pin = &pinned{snapshot: a.cur, res: cloneResult(&a.res)}
		a.setStatus("pinned the current scenario as A; changes now make B (P unpins)", false)
		return a.requestChart()
	case key.Matches(msg, k.Unpin):
		if a.pin != nil {
			a.pin = nil
			a.setStatus("compare mode off", false)
			return a.requestChart()
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
	case key.Matches(msg, k.Save):
		a.prompt.AskPath("save scenario to", "scenario.toml",
			a.pathAction(func(path string) tea.Cmd { return saveScenario(path, a.currentScenario()) }))
	case key.Matches(msg, k.ExportChart):
		a.prompt.AskPath("export chart to (.svg or .png)", "cloudwind-chart.svg",
			a.pathAction(func(path string) tea.Cmd { return exportChart(path, a.chart.Shown()) }))
	case key.Matches(msg, k.ExportState):
		a.prompt.AskPath("export state to", "cloudwind-state.json", a.pathAction(func(path string) tea.Cmd {
			return exportState(path, report.StateDocument(&a.res, a.cur.cooling, a.cur.cf, a.cfg.Version))
		}))
	case key.Matches(msg, k.Undo):
		return a.undo()
	case key.Matches(msg, k.ResetAll):
		return a.change(a.initial, "reset every input")
	default:
		if a.focus == focusInputs {
			return a.updateInputs(msg)
		}
		return a.updateFocused(msg)
	}
	return nil
}

// updateFocused forwards a key to the focused pane.
func (a *App) updateFocused(msg tea.KeyMsg) tea.Cmd {
	var cmd tea.Cmd
	switch a.focus {
	case focusInputs:
		a.in, cmd = a.in.Update(msg)
	case focusDerived:
		a.derived, cmd = a.derived.Update(msg)
	case focusCriteria:
		a.criteria, cmd = a.criteria.Update(msg)
	}
	return cmd
}

// updateInputs handles a key for the inputs pane: the keys that change a
// value go through change, the others to the pane.
func (a *App) updateInputs(msg tea.KeyMsg) tea.Cmd {
	k := &a.keys
	steps := 0
	switch {
	case key.Matches(msg, k.Inc):
		steps = 1
	case key.Matches(msg, k.Dec):
		steps = -1
	case key.Matches(msg, k.IncBig):
		steps = coarseFactor
	case key.Matches(msg, k.DecBig):
		steps = -coarseFactor
	case key.Matches(msg, k.Reset):
		next, isCooling := a.in.Reset(a.cur.params, a.initial.params)
		if isCooling {
			return a.requestCooling(a.initial.cooling.Spec, a.initial.cooling.Table)
		}
		return a.change(snapshot{next, a.cur.cooling, a.cur.cf}, "reset "+a.in.Current().label)
	default:
		return a.updateFocused(msg)
	}
	p, coolingName := a.in.Step(a.cur.params, steps, a.cur.cooling.Spec)
	if coolingName != "" {
		return a.requestCooling(coolingName, nil)
	}
	next := a.cur
	next.params = p
	return a.change(next, "")
}

// applyEdit takes the typed value (enter while typing).
func (a *App) applyEdit() tea.Cmd {
	p, spec, err := a.in.ApplyEdit(a.cur.params)
	a.in.StopEdit()
	if err != nil {
		a.setStatus(err.Error(), true)
		return nil
	}
	if spec != "" {
		return a.requestCooling(spec, nil)
	}
	next := a.cur
	next.params = p
	return a.change(next, "")
}

// pathAction wraps what a path prompt does: an empty path is refused in
// the status line.
func (a *App) pathAction(f pathAction) pathAction {
	return func(path string) tea.Cmd {
		if path == "" {
			a.setStatus("no file name given", true)
			return nil
		}
		return f(path)
	}
}

// setView switches the chart.
func (a *App) setView(v viewKind) tea.Cmd {
	a.chart.SetKind(v)
	return a.requestChart()
}

// requestChart starts computing the chart of the current view from a
// copy of the inputs; results of older requests are dropped.
func (a *App) requestChart() tea.Cmd {
	cw, ch := a.chartSize()
	req := chartspec.Request{Params: a.cur.params, Cooling: a.cur.cf, Criteria: a.cfg.Criteria,
		Selected: a.criteria.Selected(), Cols: cw, Rows: ch}
	if a.pin != nil {
		req.Pin = &chartspec.Inputs{Params: a.pin.params, Cooling: a.pin.cf}
	}
	return a.chart.Request(req)
}

// requestCooling resolves a cooling spec in a command (a table is a file).
func (a *App) requestCooling(spec string, table []string) tea.Cmd {
	return resolveCooling(spec, table, a.cfg.Open)
}

func onOff(b bool) string {
	if b {
		return "on"
	}
	return "off"
}

// Run starts the explorer on the terminal and returns when the user quits.
func Run(cfg Config) error {
	a, err := New(cfg)
	if err != nil {
		return err
	}
	opts := []tea.ProgramOption{tea.WithAltScreen()}
	if os.Getenv("CLOUDWIND_DEBUG_LOG") != "" {
		f, err := tea.LogToFile(os.Getenv("CLOUDWIND_DEBUG_LOG"), "cloudwind")
		if err == nil {
			defer f.Close()
		}
	}
	_, err = tea.NewProgram(a, opts...).Run()
	return err
}
