package tui

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// inputsPane lists the inputs (inputdefs.go); one is selected, and one
// may be edited as text. It moves the selection, shows the advanced
// inputs and opens, types into and closes the text field itself; a new
// value goes through App.change, which asks the pane for it (Step,
// ApplyEdit, Reset) so that it is evaluated before it is taken.
type inputsPane struct {
	styles        *Styles
	keys          *KeyMap
	width, height int
	focused       bool

	params      model.Params // the values shown
	coolingSpec string       // the cooling spec in use, for typing and stepping
	coolingName string       // its display name

	all      []input
	selected int // index into visible()
	advanced bool
	editing  bool
	edit     textinput.Model
}

func newInputsPane(styles *Styles, keys *KeyMap) inputsPane {
	ti := textinput.New()
	ti.Prompt = "> "
	ti.Cursor.SetMode(cursor.CursorStatic) // no blinking: fewer redraws over SSH
	ti.CharLimit = 120
	return inputsPane{styles: styles, keys: keys, all: inputs(), edit: ti}
}

// SetSize sets the pane's size, border included.
func (ip *inputsPane) SetSize(w, h int) { ip.width, ip.height = w, h }

// SetFocused says whether the pane has the focus (shows the selection).
func (ip *inputsPane) SetFocused(f bool) { ip.focused = f }

// SetValues sets the inputs shown and the cooling function in use.
func (ip *inputsPane) SetValues(p model.Params, coolingSpec, coolingName string) {
	ip.params, ip.coolingSpec, ip.coolingName = p, coolingSpec, coolingName
}

// Update handles the pane's own keys: selection, more inputs, and the
// text field (open, type, esc to close).
func (ip inputsPane) Update(msg tea.Msg) (inputsPane, tea.Cmd) {
	k, ok := msg.(tea.KeyMsg)
	if !ok {
		return ip, nil
	}
	if ip.editing {
		if key.Matches(k, ip.keys.Cancel) {
			ip.StopEdit()
			return ip, nil
		}
		var cmd tea.Cmd
		ip.edit, cmd = ip.edit.Update(k)
		return ip, cmd
	}
	switch {
	case key.Matches(k, ip.keys.Up):
		ip.move(-1)
	case key.Matches(k, ip.keys.Down):
		ip.move(1)
	case key.Matches(k, ip.keys.Edit):
		ip.startEdit()
	case key.Matches(k, ip.keys.Advanced):
		ip.advanced = !ip.advanced
		ip.selected = 0
	}
	return ip, nil
}

// View draws the pane in its border.
func (ip inputsPane) View() string {
	st := ip.styles
	var body []string
	for i, in := range ip.visible() {
		label := fit(in.label, 9)
		val := valueText(in, &ip.params, ip.coolingName)
		if ip.focused && i == ip.selected {
			body = append(body, st.Selected.Render("▸ "+label)+st.Value.Render(val))
		} else {
			body = append(body, st.Label.Render("  "+label)+st.Value.Render(val))
		}
		if ip.editing && i == ip.selected {
			body = append(body, "  "+ip.edit.View())
		}
	}
	more := "a: more inputs"
	if ip.advanced {
		more = "a: fewer inputs"
	}
	body = append(body, st.Dim.Render(more))
	return strings.Join(box("Inputs", body, ip.width, ip.height, ip.focused, st), "\n")
}

// Rows returns how many inputs are shown now.
func (ip *inputsPane) Rows() int { return len(ip.visible()) }

// Editing reports whether a value is being typed.
func (ip *inputsPane) Editing() bool { return ip.editing }

// visible returns the inputs shown now.
func (ip *inputsPane) visible() []*input {
	var out []*input
	for i := range ip.all {
		if !ip.all[i].advanced || ip.advanced {
			out = append(out, &ip.all[i])
		}
	}
	return out
}

// Current returns the selected input.
func (ip *inputsPane) Current() *input {
	vis := ip.visible()
	ip.selected = max(0, min(ip.selected, len(vis)-1))
	return vis[ip.selected]
}

// move changes the selection by d, wrapping.
func (ip *inputsPane) move(d int) {
	n := len(ip.visible())
	ip.selected = ((ip.selected+d)%n + n) % n
}

// Step returns p with the selected input stepped by n fine steps (n may be
// negative; coarse steps pass ±coarseFactor). For the cooling input it
// returns the name to switch to instead.
func (ip *inputsPane) Step(p model.Params, n int, coolingSpec string) (model.Params, string) {
	in := ip.Current()
	switch {
	case in.field == "cooling":
		names := cooling.Names()
		i := 0
		for k, c := range names {
			if c.Name == coolingSpec {
				i = k
			}
		}
		sign := 1
		if n < 0 {
			sign = -1
		}
		return p, names[((i+sign)%len(names)+len(names))%len(names)].Name
	case in.isEnum():
		sign := 1
		if n < 0 {
			sign = -1
		}
		k := len(in.options)
		in.setEnum(&p, ((in.getEnum(&p)+sign)%k+k)%k)
		return p, ""
	}
	v := in.get(&p)
	if in.field == model.FieldTFloor && v == 0 {
		v = float64(p.TCloud) // the floor follows T_cl until set
	}
	if in.log {
		v *= math.Pow(10, float64(n)*in.fine)
	} else {
		v += float64(n) * in.fine * quantity.Factor(in.dim)
		v = roundTo(v, in.fine*quantity.Factor(in.dim)) // no 0.30000000000000004
	}
	in.set(&p, v)
	return p, ""
}

// Reset returns p with the selected input set to its value in initial;
// for the cooling input it reports cooling instead, and p is unchanged.
func (ip *inputsPane) Reset(p, initial model.Params) (next model.Params, isCooling bool) {
	in := ip.Current()
	switch {
	case in.field == "cooling":
		return p, true
	case in.isEnum():
		in.setEnum(&p, in.getEnum(&initial))
	default:
		in.set(&p, in.get(&initial))
	}
	return p, false
}

// startEdit opens the text field for the selected input with its value.
func (ip *inputsPane) startEdit() {
	in := ip.Current()
	ip.editing = true
	switch {
	case in.field == "cooling":
		ip.edit.SetValue(ip.coolingSpec)
	case in.isEnum():
		ip.edit.SetValue(in.options[in.getEnum(&ip.params)])
	default:
		ip.edit.SetValue(strings.TrimSpace(quantity.Number(in.dim, in.get(&ip.params))))
	}
	ip.edit.CursorEnd()
	ip.edit.Focus()
}

// StopEdit closes the text field.
func (ip *inputsPane) StopEdit() {
	ip.editing = false
	ip.edit.Blur()
}

// ApplyEdit parses the typed text into p. For the cooling input it
// returns the spec to resolve instead.
func (ip *inputsPane) ApplyEdit(p model.Params) (model.Params, string, error) {
	in := ip.Current()
	text := strings.TrimSpace(ip.edit.Value())
	switch {
	case in.field == "cooling":
		if text == "" {
			return p, "", errors.New("cooling: empty")
		}
		return p, text, nil
	case in.isEnum():
		for i, o := range in.options {
			if strings.EqualFold(o, text) || strings.EqualFold(strings.Fields(o)[0], text) {
				in.setEnum(&p, i)
				return p, "", nil
			}
		}
		return p, "", fmt.Errorf("%s: %q is not one of %s", in.label, quantity.Sanitize(text), strings.Join(in.options, ", "))
	}
	v, err := quantity.ParseValue(in.dim, text)
	if err != nil {
		return p, "", fmt.Errorf("%s: %w", in.label, err)
	}
	in.set(&p, v)
	return p, "", nil
}

// FieldMessage words a validation error with the input's label.
func (ip *inputsPane) FieldMessage(err error) string {
	msg := err.Error()
	for _, in := range ip.all {
		if strings.HasPrefix(msg, in.field+":") {
			return in.label + msg[len(in.field):] + " — kept the last valid value"
		}
	}
	return msg + " — kept the last valid value"
}
