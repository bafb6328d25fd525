package tui

import (
	"fmt"
	"os"
	"strings"

	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
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

// viewKind is the chart on screen.
type viewKind int

const (
	viewThreshold viewKind = iota // r_crit vs χ
	viewCooling                   // Λ(T)
	viewRatios                    // τ_cool/τ_dyn vs r_cl
	viewRegime                    // regime map
	viewEvolution                 // m/m0 and v/v_w vs t/t_cc
	viewPlan                      // simulation plan
	viewCount
)

func (v viewKind) String() string {
	return [...]string{"threshold radius vs χ", "cooling curve Λ(T)", "timescale ratios vs r_cl", "regime map",
		"evolution vs t/t_cc", "simulation plan"}[v]
}

// snapshot is a complete state of the inputs: what undo restores and what
// compare mode pins.
type snapshot struct {
	params  model.Params
	cooling *cooling.Source
	cf      model.CoolingFunction
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

// App is the explorer: the root Bubble Tea model. It routes messages to
// its panes and composes their views; the panes own their state.
type App struct {
	cfg    Config
	keys   KeyMap
	styles Styles
	help   help.Model
	width  int
	height int

	cur      snapshot
	res      model.Result // the evaluation of cur
	history  []snapshot   // undo stack
	initial  snapshot     // what reset returns to
	pin      *pinned
	scenario string

	in          inputsPane
	derived     []model.Quantity // the derived pane's rows, fixed at start
	focus       focus
	derivedSel  int
	critSel     int
	view        viewKind
	family      bool
	mapMach     bool
	showHelp    bool
	showDetails bool
	prompt      *prompt
	status      status

	gen   int        // generation of the latest chart request
	chart chartState // the latest chart received
}

// chartState is the chart on screen and the request it answers.
type chartState struct {
	gen    int
	view   viewKind
	line   *LineChart
	line2  *LineChart // the evolution view's second chart (v/v_w)
	regime *RegimeMap
	text   []string // the plan view
}

// maxHistory bounds the undo stack.
const maxHistory = 200

// New returns the explorer for cfg. It evaluates the initial state; an
// invalid one is an error (main validates before).
func New(cfg Config) (*App, error) {
	a := &App{cfg: cfg, keys: DefaultKeyMap(), help: help.New(), in: newInputsPane(), derived: derivedRows(), scenario: cfg.Scenario}
	a.styles = NewStyles(cfg.Palette, cfg.Color, cfg.ASCII)
	cf, err := cfg.Cooling.Function(cfg.Params.Metallicity)
	if err != nil {
		return nil, err
	}
	a.cur = snapshot{normalise(cfg.Params), cfg.Cooling, cf}
	if err := a.res.Evaluate(a.cur.params, cf, cfg.Criteria); err != nil {
		return nil, err
	}
	a.initial = a.cur
	return a, nil
}

// normalise fills the defaults of p but keeps a zero T_floor, which means
// "follow the cloud temperature".
func normalise(p model.Params) model.Params {
	q := p.WithDefaults()
	q.TFloor = p.TFloor
	return q
}

// Init starts the first chart computation.
func (a *App) Init() tea.Cmd { return a.requestChart() }

// Update handles a message.
func (a *App) Update(msg tea.Msg) (tea.Model, tea.Cmd) {
	switch msg := msg.(type) {
	case tea.WindowSizeMsg:
		a.width, a.height = msg.Width, msg.Height
		a.help.Width = msg.Width
		return a, a.requestChart()
	case chartMsg:
		if msg.gen == a.gen { // stale results are dropped
			a.chart = chartState{gen: msg.gen, view: msg.view, line: msg.line, line2: msg.line2, regime: msg.regime, text: msg.text}
		}
		return a, nil
	case statusMsg:
		a.status = status{msg.text, msg.isErr}
		return a, nil
	case coolingMsg:
		return a, a.applyCooling(msg)
	case scenarioMsg:
		return a, a.applyScenario(msg)
	case tea.KeyMsg:
		return a, a.handleKey(msg)
	}
	return a, nil
}

// handleKey routes a key: overlays and prompts first, then global keys,
// then the focused pane.
func (a *App) handleKey(msg tea.KeyMsg) tea.Cmd {
	switch {
	case a.prompt != nil:
		return a.updatePrompt(msg)
	case a.in.editing:
		return a.updateEdit(msg)
	case a.showHelp:
		if key.Matches(msg, a.keys.Help, a.keys.Cancel, a.keys.Accept) {
			a.showHelp = false
		} else if key.Matches(msg, a.keys.Quit) {
			return tea.Quit
		}
		return nil
	case a.showDetails:
		if key.Matches(msg, a.keys.Details, a.keys.Cancel, a.keys.Accept) {
			a.showDetails = false
			return nil
		}
		if key.Matches(msg, a.keys.Quit) {
			return tea.Quit
		}
		// Moving the selection keeps the details open on the new item.
		a.moveSelection(msg)
		return nil
	}
	k := &a.keys
	switch {
	case key.Matches(msg, k.Quit):
		return tea.Quit
	case key.Matches(msg, k.Help):
		a.showHelp = true
	case key.Matches(msg, k.Details):
		a.showDetails = true
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
		return a.setView((a.view + 1) % viewCount)
	case key.Matches(msg, k.Family):
		a.family = !a.family
		a.setStatus(fmt.Sprintf("family over Mach numbers %s (threshold chart; the selected criterion)", onOff(a.family)), false)
		return a.requestChart()
	case key.Matches(msg, k.MapAxis):
		a.mapMach = !a.mapMach
		axes := "χ × r_cl"
		if a.mapMach {
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
		a.prompt = newScenarioMenu(a.cfg.Demos)
	case key.Matches(msg, k.Save):
		a.prompt = newPathPrompt(promptSave, "save scenario to", "scenario.toml")
	case key.Matches(msg, k.ExportChart):
		a.prompt = newPathPrompt(promptExportChart, "export chart to (.svg or .png)", "cloudwind-chart.svg")
	case key.Matches(msg, k.ExportState):
		a.prompt = newPathPrompt(promptExportState, "export state to", "cloudwind-state.json")
	case key.Matches(msg, k.Undo):
		return a.undo()
	case key.Matches(msg, k.ResetAll):
		return a.change(a.initial, "reset every input")
	default:
		if a.focus == focusInputs {
			return a.updateInputs(msg)
		}
		a.moveSelection(msg)
	}
	return nil
}

func onOff(b bool) string {
	if b {
		return "on"
	}
	return "off"
}

// moveSelection moves the selection of the derived or criteria pane.
func (a *App) moveSelection(msg tea.KeyMsg) {
	d := 0
	switch {
	case key.Matches(msg, a.keys.Up):
		d = -1
	case key.Matches(msg, a.keys.Down):
		d = 1
	default:
		return
	}
	switch a.focus {
	case focusInputs:
		a.in.move(d)
	case focusDerived:
		n := len(a.derived)
		a.derivedSel = (a.derivedSel + d + n) % n
	case focusCriteria:
		n := len(a.res.Criteria)
		a.critSel = (a.critSel + d + n) % n
	}
}

// updateInputs handles the inputs pane's keys.
func (a *App) updateInputs(msg tea.KeyMsg) tea.Cmd {
	k := &a.keys
	steps := 0
	switch {
	case key.Matches(msg, k.Up, k.Down):
		a.moveSelection(msg)
	case key.Matches(msg, k.Inc):
		steps = 1
	case key.Matches(msg, k.Dec):
		steps = -1
	case key.Matches(msg, k.IncBig):
		steps = coarseFactor
	case key.Matches(msg, k.DecBig):
		steps = -coarseFactor
	case key.Matches(msg, k.Edit):
		a.in.startEdit(&a.cur.params, a.cur.cooling.Spec)
	case key.Matches(msg, k.Advanced):
		a.in.advanced = !a.in.advanced
		a.in.selected = 0
	case key.Matches(msg, k.Reset):
		in := a.in.current()
		next := a.cur
		switch {
		case in.field == "cooling":
			return a.requestCooling(a.initial.cooling.Spec, a.initial.cooling.Table)
		case in.isEnum():
			in.setEnum(&next.params, in.getEnum(&a.initial.params))
		default:
			in.set(&next.params, in.get(&a.initial.params))
		}
		return a.change(next, "reset "+in.label)
	}
	if steps == 0 {
		return nil
	}
	p, coolingName := a.in.step(a.cur.params, steps, a.cur.cooling.Spec)
	if coolingName != "" {
		return a.requestCooling(coolingName, nil)
	}
	next := a.cur
	next.params = p
	return a.change(next, "")
}

// updateEdit handles keys while a value is typed.
func (a *App) updateEdit(msg tea.KeyMsg) tea.Cmd {
	switch {
	case key.Matches(msg, a.keys.Cancel):
		a.in.stopEdit()
		return nil
	case msg.Type == tea.KeyEnter:
		p, spec, err := a.in.applyEdit(a.cur.params)
		a.in.stopEdit()
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
	var cmd tea.Cmd
	a.in.edit, cmd = a.in.edit.Update(msg)
	return cmd
}

// change applies a new snapshot if it is valid: the metallicity may need
// a new cooling curve, and everything is re-evaluated. An invalid one is
// refused with the reason in the status line and the last good state
// stays.
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
		a.setStatus(a.fieldMessage(err), true)
		return nil
	}
	a.history = append(a.history, a.cur)
	if len(a.history) > maxHistory {
		a.history = a.history[1:]
	}
	a.cur, a.res = next, res
	a.setStatus(note, false)
	return a.requestChart()
}

// fieldMessage words a validation error with the input's label.
func (a *App) fieldMessage(err error) string {
	msg := err.Error()
	for _, in := range a.in.all {
		if strings.HasPrefix(msg, in.field+":") {
			return in.label + msg[len(in.field):] + " — kept the last valid value"
		}
	}
	return msg + " — kept the last valid value"
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
	a.cur, a.res = prev, res
	a.setStatus("undone", false)
	return a.requestChart()
}

// setView switches the chart.
func (a *App) setView(v viewKind) tea.Cmd {
	a.view = v
	return a.requestChart()
}

func (a *App) setStatus(text string, isErr bool) { a.status = status{quantity.Sanitize(text), isErr} }

// cloneResult copies a Result so that later evaluations do not share its
// slices.
func cloneResult(r *model.Result) model.Result {
	c := *r
	c.Outcomes = append([]model.Outcome(nil), r.Outcomes...)
	c.Cautions = append([]model.Caution(nil), r.Cautions...)
	return c
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
