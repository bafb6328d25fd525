package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
)

// A pathAction is what a path prompt does with the path typed (trimmed;
// possibly empty) when it is accepted.
type pathAction func(path string) tea.Cmd

// prompt is the one-line question for a path, or the scenario menu, drawn
// over the panes while open. The App opens it with the action to take;
// the prompt runs the action when the answer is accepted, so that the
// action reads the state at that moment.
type prompt struct {
	styles *Styles
	keys   *KeyMap
	width  int
	open   bool

	question string
	input    textinput.Model
	act      pathAction

	menu   bool // the scenario menu: demos and "load a file…"
	demos  []scenario.Scenario
	choice int // in the menu: index into demos, or len(demos) for "load a file…"
	onDemo func(scenario.Scenario) tea.Cmd
	onLoad pathAction
}

func newPrompt(styles *Styles, keys *KeyMap) prompt {
	return prompt{styles: styles, keys: keys}
}

// SetSize sets the width the prompt is centred in; the box is at most 76
// cells wide.
func (p *prompt) SetSize(w, _ int) { p.width = w }

// Open reports whether the prompt is shown.
func (p *prompt) Open() bool { return p.open }

// AskPath opens a question for a path, suggesting suggestion; act runs
// on enter.
func (p *prompt) AskPath(question, suggestion string, act pathAction) {
	ti := textinput.New()
	ti.Prompt = "> "
	ti.Cursor.SetMode(cursor.CursorStatic) // no blinking: fewer redraws over SSH
	ti.CharLimit = 4096
	ti.SetValue(suggestion)
	ti.CursorEnd()
	ti.Focus()
	*p = prompt{styles: p.styles, keys: p.keys, width: p.width, open: true, question: question, input: ti, act: act}
}

// ChooseScenario opens the scenario menu: onDemo runs for a chosen demo;
// "load a file…" asks for a path and runs onLoad with it.
func (p *prompt) ChooseScenario(demos []scenario.Scenario, onDemo func(scenario.Scenario) tea.Cmd, onLoad pathAction) {
	*p = prompt{styles: p.styles, keys: p.keys, width: p.width, open: true, question: "open a scenario", menu: true,
		demos: demos, onDemo: onDemo, onLoad: onLoad}
}

// Update handles keys while the prompt is open: esc cancels, enter
// accepts, ctrl+c quits; the menu moves its choice, the path prompt
// edits its text.
func (p prompt) Update(msg tea.Msg) (prompt, tea.Cmd) {
	k, ok := msg.(tea.KeyMsg)
	if !ok || !p.open {
		return p, nil
	}
	if key.Matches(k, p.keys.Cancel) {
		p.open = false
		return p, nil
	}
	if p.menu {
		n := len(p.demos) + 1
		switch {
		case key.Matches(k, p.keys.PromptUp, p.keys.Up):
			p.choice = (p.choice + n - 1) % n
		case key.Matches(k, p.keys.PromDwn, p.keys.Down):
			p.choice = (p.choice + 1) % n
		case key.Matches(k, p.keys.Accept):
			p.open = false
			if p.choice == len(p.demos) {
				p.AskPath("load scenario from", "scenario.toml", p.onLoad)
				return p, nil
			}
			return p, p.onDemo(p.demos[p.choice])
		case key.Matches(k, p.keys.ForceQuit):
			return p, tea.Quit
		}
		return p, nil
	}
	if k.Type == tea.KeyEnter {
		p.open = false
		return p, p.act(strings.TrimSpace(p.input.Value()))
	}
	if key.Matches(k, p.keys.ForceQuit) {
		return p, tea.Quit
	}
	var cmd tea.Cmd
	p.input, cmd = p.input.Update(k)
	return p, cmd
}

// View draws the prompt's box, or nothing when it is closed.
func (p prompt) View() string {
	if !p.open {
		return ""
	}
	st := p.styles
	var body []string
	if p.menu {
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
	bw := min(p.width-4, 76)
	return strings.Join(box(p.question, body, bw, len(body)+2, true, st), "\n")
}
