package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/internal/scenario"
)

// promptKind says what a prompt is for.
type promptKind int

const (
	promptSave promptKind = iota
	promptExportChart
	promptExportState
	promptLoad
	promptScenarios // a menu: demos and "load a file…"
)

// prompt is a one-line question for a path, or the scenario menu.
type prompt struct {
	kind     promptKind
	question string
	input    textinput.Model
	demos    []scenario.Scenario
	choice   int // in the menu: index into demos, or len(demos) for "load a file…"
}

func newPathPrompt(kind promptKind, question, suggestion string) *prompt {
	ti := textinput.New()
	ti.Prompt = "> "
	ti.Cursor.SetMode(cursor.CursorStatic) // no blinking: fewer redraws over SSH
	ti.CharLimit = 4096
	ti.SetValue(suggestion)
	ti.CursorEnd()
	ti.Focus()
	return &prompt{kind: kind, question: question, input: ti}
}

func newScenarioMenu(demos []scenario.Scenario) *prompt {
	return &prompt{kind: promptScenarios, question: "open a scenario", demos: demos}
}

// updatePrompt handles keys while a prompt is open.
func (a *App) updatePrompt(msg tea.KeyMsg) tea.Cmd {
	p := a.prompt
	if key.Matches(msg, a.keys.Cancel) {
		a.prompt = nil
		return nil
	}
	if p.kind == promptScenarios {
		n := len(p.demos) + 1
		switch {
		case key.Matches(msg, a.keys.PromptUp, a.keys.Up):
			p.choice = (p.choice + n - 1) % n
		case key.Matches(msg, a.keys.PromDwn, a.keys.Down):
			p.choice = (p.choice + 1) % n
		case key.Matches(msg, a.keys.Accept):
			a.prompt = nil
			if p.choice == len(p.demos) {
				a.prompt = newPathPrompt(promptLoad, "load scenario from", "scenario.toml")
				return nil
			}
			sc := p.demos[p.choice]
			open := a.cfg.Open
			return func() tea.Msg { return resolveScenario(sc, open, "") }
		case key.Matches(msg, a.keys.Quit) && msg.String() == "ctrl+c":
			return tea.Quit
		}
		return nil
	}
	if msg.Type == tea.KeyEnter {
		path := strings.TrimSpace(p.input.Value())
		a.prompt = nil
		if path == "" {
			a.setStatus("no file name given", true)
			return nil
		}
		switch p.kind {
		case promptSave:
			return saveScenario(path, a.currentScenario())
		case promptExportChart:
			return exportChart(path, a.chart)
		case promptExportState:
			return exportState(path, report.StateDocument(&a.res, a.cur.cooling, a.cur.cf, a.cfg.Version))
		case promptLoad:
			return loadScenario(path, a.cfg.Open)
		}
		return nil
	}
	if msg.String() == "ctrl+c" {
		return tea.Quit
	}
	var cmd tea.Cmd
	p.input, cmd = p.input.Update(msg)
	return cmd
}

// promptView draws the prompt as an overlay box.
func (a *App) promptView(w int) []string {
	p := a.prompt
	st := &a.styles
	var body []string
	if p.kind == promptScenarios {
		for i, d := range p.demos {
			line := "  " + quantity.Sanitize(d.Name)
			if i == p.choice {
				line = st.Selected.Render("▸ " + quantity.Sanitize(d.Name))
			}
			body = append(body, line)
			if i == p.choice && d.Description != "" {
				body = append(body, st.Dim.Render("    "+quantity.Sanitize(d.Description)))
			}
		}
		last := "  load a scenario file…"
		if p.choice == len(p.demos) {
			last = st.Selected.Render("▸ load a scenario file…")
		}
		body = append(body, last, "", st.Help.Render("↑/↓ choose · enter open · esc cancel"))
	} else {
		body = []string{p.input.View(), "", st.Help.Render("enter accept · esc cancel")}
	}
	bw := min(w-4, 76)
	return box(p.question, body, bw, len(body)+2, true, st)
}
