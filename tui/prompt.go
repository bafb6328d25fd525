package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
)

// A pathAction is what a path prompt does with the path typed (trimmed;
// possibly empty) when it is accepted.
type pathAction func(path string) tea.Cmd

// prompt is the one-line question for a path, the yes/no question before
// a file is overwritten, or the scenario menu, drawn over the panes while
// open. The App opens it with the action to take; the prompt runs the
// action when the answer is accepted, so that the action reads the state
// at that moment.
type prompt struct {
	styles *Styles
	keys   *KeyMap
	width  int
	open   bool

	question string
	input    textField
	act      pathAction

	confirm bool // a yes/no question: onYes on y, onNo on n or esc
	detail  []string
	onYes   func() tea.Cmd
	onNo    func() tea.Cmd

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

// reset returns a closed prompt with p's styles, keys and width.
func (p *prompt) reset() prompt {
	return prompt{styles: p.styles, keys: p.keys, width: p.width}
}

// AskPath opens a question for a path, suggesting suggestion (selected,
// so that typing replaces it); act runs on enter.
func (p *prompt) AskPath(question, suggestion string, act pathAction) {
	*p = p.reset()
	p.open, p.question, p.act = true, question, act
	p.input = newTextField(p.styles, 4096)
	p.input.Start(suggestion)
}

// Confirm opens a yes/no question with detail lines under it (a path in
// full): onYes runs on y, onNo on n or esc.
func (p *prompt) Confirm(question string, detail []string, onYes, onNo func() tea.Cmd) {
	*p = p.reset()
	p.open, p.confirm, p.question, p.detail, p.onYes, p.onNo = true, true, question, detail, onYes, onNo
}

// ChooseScenario opens the scenario menu: onDemo runs for a chosen demo;
// "load a file…" asks for a path and runs onLoad with it.
func (p *prompt) ChooseScenario(demos []scenario.Scenario, onDemo func(scenario.Scenario) tea.Cmd, onLoad pathAction) {
	*p = p.reset()
	p.open, p.question, p.menu, p.demos, p.onDemo, p.onLoad = true, "open a scenario", true, demos, onDemo, onLoad
}

// Update handles keys while the prompt is open: esc cancels, enter
// accepts, ctrl+c quits; the question takes y or n; the menu moves its
// choice; the path prompt edits its text.
func (p prompt) Update(msg tea.Msg) (prompt, tea.Cmd) {
	k, ok := msg.(tea.KeyMsg)
	if !ok || !p.open {
		return p, nil
	}
	if key.Matches(k, p.keys.ForceQuit) {
		return p, tea.Quit
	}
	switch {
	case p.confirm:
		switch {
		case key.Matches(k, p.keys.Yes):
			p.open = false
			return p, p.onYes()
		case key.Matches(k, p.keys.No, p.keys.Cancel):
			p.open = false
			return p, p.onNo()
		}
		return p, nil
	case key.Matches(k, p.keys.Cancel):
		p.open = false
		return p, nil
	case p.menu:
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
		}
		return p, nil
	case k.Type == tea.KeyEnter:
		p.open = false
		return p, p.act(strings.TrimSpace(p.input.Value()))
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
	bw := min(p.width-4, 76)
	var body []string
	switch {
	case p.confirm:
		for _, d := range p.detail {
			body = append(body, wrapText("", st.T(quantity.Sanitize(d)), bw-2)...)
		}
		body = append(body, "", st.Help.Render("y yes, overwrite · n or esc no, keep it"))
	case p.menu:
		for i, d := range p.demos {
			name := st.T(quantity.Sanitize(d.Name))
			line := "  " + name
			if i == p.choice {
				line = st.Selected.Render(st.cursor() + name)
			}
			body = append(body, line)
			if i == p.choice && d.Description != "" {
				for _, l := range wrapHanging("    "+st.T(quantity.Sanitize(d.Description)), bw-2) {
					body = append(body, st.Dim.Render(l))
				}
			}
		}
		last := "load a scenario file…"
		if p.choice == len(p.demos) {
			body = append(body, st.Selected.Render(st.cursor()+st.T(last)))
		} else {
			body = append(body, "  "+st.T(last))
		}
		body = append(body, "", st.Help.Render(st.T("↑/↓ choose · enter open · esc cancel")))
	default:
		hint := "enter accept · esc cancel"
		if p.input.Selected() {
			hint = "typing replaces the suggestion · ←/→ edit it · " + hint
		}
		body = []string{p.input.View(), "", st.Help.Render(st.T(hint))}
	}
	for i := range body {
		body[i] = st.T(body[i])
	}
	return strings.Join(box(p.question, body, bw, len(body)+2, true, st), "\n")
}
