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
	Outflow  *scenario.Outflow // the scenario's [outflow]; nil takes model.FiducialWind's injection
}

// focus says which pane takes the selection keys.
type focus int

const (
	focusInputs focus = iota
	focusDerived
	focusCriteria
	focusChart
	focusCount
)

func (f focus) String() string {
	return [...]string{"inputs", "derived", "criteria", "chart"}[f]
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
	wind     windEval     // the wind of cur and the criteria at its launch radius (outflow view)
	history  []snapshot   // undo stack
	initial  snapshot     // what reset returns to
	pin      *pinned
	scenario string
	focus    focus
	zoom     bool // the chart takes the whole body (z)
	status   status

	outcomes    *outcomeSet // loaded simulation outcomes (O), or nil
	outcomesGen int         // generation of the latest load or rescore; older replies are dropped
	spread      spreadCache // the convention spread the details show

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
	if cfg.ASCII {
		a.keys.useASCII()
	}
	a.styles = NewStyles(cfg.Palette, cfg.Color, cfg.ASCII)
	st, k := &a.styles, &a.keys
	a.in, a.derived, a.criteria = newInputsPane(st, k), newReadout(st, k), newCriteriaPane(st, k)
	a.chart, a.details, a.prompt, a.help = newChartPane(st, k), newDetailsPane(st, k), newPrompt(st, k), newHelpOverlay(st, k)
	cf, err := cfg.Cooling.Function(cfg.Params.Metallicity)
	if err != nil {
		return nil, err
	}
	a.cur = snapshot{cfg.Params, cfg.Cooling, cf, windFrom(cfg.Outflow)} // as given: unset optional inputs stay unset and show their defaults
	if err := a.res.Evaluate(a.cur.params, cf, cfg.Criteria); err != nil {
		return nil, err
	}
	a.wind = evalWind(a.cur, cfg.Criteria)
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
		a.setStatus(msg.text, msg.isErr)
	case coolingMsg:
		return a.applyCooling(msg)
	case outputCheckedMsg:
		return a.applyChecked(msg)
	case scenarioMsg:
		return a.applyScenario(msg)
	case outcomesMsg:
		return a.applyOutcomes(msg)
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
	outflow := a.outflowShown()
	a.in.SetValues(a.cur.params, a.cur.wind, a.cur.cooling.Spec, report.CoolingName(a.cur.cooling, a.cur.cf))
	a.in.SetOutflow(outflow)
	res := a.windResult()
	if res != &a.res {
		pin = nil // compare mode compares the inputs of the other views
	}
	a.derived.SetResult(res, pin, a.cur.cf)
	a.derived.SetLaunch(a.launchTitle())
	a.criteria.SetResult(res, pin, a.outcomeScores())
	a.criteria.SetOutflow(a.outflowData(), a.chart.Carried(), outflow)
	a.in.SetFocused(a.focus == focusInputs)
	a.derived.SetFocused(a.focus == focusDerived)
	a.criteria.SetFocused(a.focus == focusCriteria)
	a.chart.SetFocused(a.focus == focusChart || a.zoom)
	a.syncKeys()
	about := subject{focus: a.focus}
	switch a.focus {
	case focusInputs:
		about.input = a.in.Current()
	case focusDerived:
		about.quantity = a.derived.Selected()
	case focusCriteria:
		about.criterion = a.criteria.Selected()
	case focusChart: // the chart explains nothing of its own but the outflow: the selected input
		if !outflow {
			about = subject{focus: focusInputs, input: a.in.Current()}
		}
	}
	a.details.SetState(about, a.cur.params, a.cur.cooling, a.cur.cf, res)
	a.details.SetOutflow(outflow, &a.cur.wind, &a.wind, a.outflowData(), a.criteria.Selected())
	if a.details.Open() && about.focus == focusCriteria {
		sp := a.cur.params
		if res != &a.res {
			sp = res.Params // the cloud at the launch radius
		}
		a.details.SetSpread(a.spread.get(sp, a.cur.cf, a.cfg.Criteria))
	}
	a.details.SetOutcomes(a.outcomes)
	a.resize()
}

// handleKey routes a key: prompts and overlays first, then global keys,
// then the focused pane (the full-screen chart takes the page keys).
func (a *App) handleKey(msg tea.KeyMsg) tea.Cmd {
	var cmd tea.Cmd
	k := &a.keys
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
		if a.details.Open() && key.Matches(msg, k.Up, k.Down) {
			// Moving the selection keeps the details open on the new item.
			return a.updateFocused(msg)
		}
		return cmd
	case a.zoom && key.Matches(msg, k.PageUp, k.PageDown, k.Top, k.Bottom),
		a.zoom && a.focus == focusChart && key.Matches(msg, k.Up, k.Down):
		a.chart, cmd = a.chart.Update(msg)
		return cmd
	case a.zoom && key.Matches(msg, k.Cancel):
		a.zoom = false
		a.setStatus("all panes", false)
		return a.requestChart()
	}
	if cmd, ok := a.globalKey(msg); ok {
		return cmd
	}
	if a.focus == focusInputs {
		return a.updateInputs(msg)
	}
	return a.updateFocused(msg)
}

// updateFocused forwards a key to the focused pane. A new criterion
// selected redraws the charts that show the selected one (the threshold
// chart's family, the carried cloud's events).
func (a *App) updateFocused(msg tea.KeyMsg) tea.Cmd {
	var cmd tea.Cmd
	switch a.focus {
	case focusInputs:
		a.in, cmd = a.in.Update(msg)
	case focusDerived:
		a.derived, cmd = a.derived.Update(msg)
	case focusCriteria:
		sel := a.criteria.Selected()
		a.criteria, cmd = a.criteria.Update(msg)
		if a.criteria.Selected() != sel && a.chart.UsesSelected() {
			return tea.Batch(cmd, a.requestChart())
		}
	case focusChart:
		a.chart, cmd = a.chart.Update(msg)
	}
	return cmd
}

// updateInputs handles a key for the inputs pane: the keys that change a
// value go through change, the others to the pane.
func (a *App) updateInputs(msg tea.KeyMsg) tea.Cmd {
	k := &a.keys
	if key.Matches(msg, k.Inc, k.Dec, k.IncBig, k.DecBig, k.Reset, k.Edit) && a.in.Outflow() && a.in.Current().byWind {
		a.setStatus(a.in.Current().label+" is set by the wind in the outflow view (d explains); the other views keep their own", false)
		return nil
	}
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
	case key.Matches(msg, k.Reset) && a.in.Current().wind:
		in := a.in.Current()
		next := a.cur
		if a.initial.wind.rates() != a.cur.wind.rates() { // the other form of the injection: all of it
			next.wind.inj = a.initial.wind.inj
		}
		next.wind.set(in.field, a.initial.wind.value(in.field))
		next.wind.given = a.initial.wind.given || a.cur.wind.given
		return a.change(next, "reset "+in.label)
	case key.Matches(msg, k.Reset):
		next, isCooling := a.in.Reset(a.cur.params, a.initial.params)
		if isCooling {
			return a.requestCooling(a.initial.cooling.Spec, a.initial.cooling.Table)
		}
		return a.change(snapshot{next, a.cur.cooling, a.cur.cf, a.cur.wind}, "reset "+a.in.Current().label)
	default:
		return a.updateFocused(msg)
	}
	if a.in.Current().wind {
		w, err := a.in.stepWind(a.cur.wind, steps)
		if err != nil {
			a.setStatus(err.Error(), true)
			return nil
		}
		next := a.cur
		next.wind = w
		return a.change(next, "")
	}
	p, coolingName, err := a.in.Step(a.cur.params, steps, a.cur.cooling.Spec)
	if err != nil {
		a.setStatus(err.Error(), true)
		return nil
	}
	if coolingName != "" {
		return a.requestCooling(coolingName, nil)
	}
	next := a.cur
	next.params = p
	return a.change(next, "")
}

// applyEdit takes the typed value (enter while typing).
func (a *App) applyEdit() tea.Cmd {
	if a.in.Current().wind {
		w, err := a.in.applyWindText(a.cur.wind, a.in.edit.Value())
		a.in.StopEdit()
		if err != nil {
			a.setStatus(err.Error(), true)
			return nil
		}
		next := a.cur
		next.wind = w
		return a.change(next, "")
	}
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

// setView switches the chart. Entering the outflow view clears the status
// line, which then says that the wind is from memory and how many
// cautions there are, or why the wind of the current inputs is not valid.
func (a *App) setView(v viewKind) tea.Cmd {
	if v == viewOutflow && a.chart.Kind() != viewOutflow {
		a.setStatus("", false)
	}
	a.chart.SetKind(v)
	if v == viewOutflow && !a.wind.ok() {
		a.setStatus(a.windMessage(a.wind.err), true)
	}
	return a.requestChart()
}

// requestChart starts computing the chart of the current view from a
// copy of the inputs; results of older requests are dropped.
func (a *App) requestChart() tea.Cmd { return a.chart.Request(a.chartRequest()) }

// chartRequest is the request of the current state's charts.
func (a *App) chartRequest() chartspec.Request {
	cw, ch := a.chartSize()
	req := chartspec.Request{Params: a.cur.params, Cooling: a.cur.cf, Criteria: a.cfg.Criteria,
		Selected: a.criteria.Selected(), Cols: cw, Rows: ch, CoolingName: report.CoolingName(a.cur.cooling, a.cur.cf)}
	if a.pin != nil {
		req.Pin = &chartspec.Inputs{Params: a.pin.params, Cooling: a.pin.cf}
	}
	if a.outcomes != nil {
		req.Runs, req.RunsName = a.outcomes.runs, a.outcomes.name
	}
	if a.outflowShown() {
		wp := a.cur.wind.params(a.cur.params)
		req.Wind, req.Launch = &wp, model.Length(a.cur.wind.launch)*a.cur.wind.inj.Radius
	}
	return req
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
