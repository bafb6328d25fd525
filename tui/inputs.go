package tui

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// inputsPane lists the inputs (inputdefs.go); one is selected, and one
// may be edited as text. It moves the selection, shows the advanced
// inputs, scrolls when they do not fit, and opens, types into and closes
// the text field itself; a new value goes through App.change, which asks
// the pane for it (Step, ApplyEdit, Reset) so that it is evaluated before
// it is taken.
type inputsPane struct {
	styles        *Styles
	keys          *KeyMap
	width, height int
	focused       bool

	params      model.Params // the values shown, as given (zero optional fields are defaults)
	wind        windInputs   // the outflow view's own inputs
	outflow     bool         // the outflow view is shown: its inputs first, those the wind sets dimmed
	coolingSpec string       // the cooling spec in use, for typing and stepping
	coolingName string       // its display name

	all      []input
	selected int // index into visible()
	advanced bool
	editing  bool
	edit     textField
	scroll   scroller
}

func newInputsPane(styles *Styles, keys *KeyMap) inputsPane {
	return inputsPane{styles: styles, keys: keys, all: inputs(), edit: newTextField(styles, 120)}
}

// SetSize sets the pane's size, border included.
func (ip *inputsPane) SetSize(w, h int) { ip.width, ip.height = w, h }

// SetFocused says whether the pane has the focus (shows the selection).
func (ip *inputsPane) SetFocused(f bool) { ip.focused = f }

// SetValues sets the inputs shown, the wind's and the cooling function
// in use.
func (ip *inputsPane) SetValues(p model.Params, w windInputs, coolingSpec, coolingName string) {
	ip.params, ip.wind, ip.coolingSpec, ip.coolingName = p, w, coolingSpec, coolingName
}

// SetOutflow switches between the inputs of the outflow view and the
// others, keeping the selected input when it is in both lists.
func (ip *inputsPane) SetOutflow(on bool) {
	if on == ip.outflow {
		return
	}
	cur := ip.Current()
	ip.outflow, ip.selected, ip.scroll = on, 0, scroller{}
	if on && cur.byWind {
		return // the first wind input rather than one the wind sets
	}
	for i, in := range ip.visible() {
		if in == cur {
			ip.selected = i
		}
	}
}

// Outflow reports whether the pane shows the outflow view's inputs.
func (ip *inputsPane) Outflow() bool { return ip.outflow }

// Update handles the pane's own keys: selection, pages, more inputs, and
// the text field (open, type, esc to close).
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
	n := len(ip.visible())
	switch {
	case key.Matches(k, ip.keys.Up):
		ip.move(-1)
	case key.Matches(k, ip.keys.Down):
		ip.move(1)
	case pageKey(k, ip.keys, &ip.selected, n, ip.height-2):
	case key.Matches(k, ip.keys.Edit):
		ip.startEdit()
	case key.Matches(k, ip.keys.Advanced):
		ip.advanced = !ip.advanced
		ip.selected, ip.scroll = 0, scroller{}
	}
	ip.scroll.follow(len(ip.lines()), ip.height-2, ip.selectedLine())
	return ip, nil
}

// lines returns the pane's lines: one per input (and the text field under
// the selected one while typing); the hint for more inputs is in the
// bottom border.
func (ip inputsPane) lines() []string {
	st := ip.styles
	var body []string
	for i, in := range ip.visible() {
		label := st.fit(st.T(in.label), 9)
		val := st.Value.Render(st.T(ip.ValueText(in)))
		if ip.outflow && in.byWind {
			val = st.Dim.Render(st.T(ip.ValueText(in)))
		}
		if ip.focused && i == ip.selected {
			body = append(body, st.Selected.Render(st.cursor()+label)+val)
		} else {
			body = append(body, st.Label.Render("  "+label)+val)
		}
		if ip.editing && i == ip.selected {
			body = append(body, "  "+st.T(ip.edit.View()))
		}
	}
	return body
}

// selectedLine returns the line of the selected input (and of the text
// field under it while typing), which scrolling keeps visible.
func (ip inputsPane) selectedLine() int {
	if ip.editing {
		return ip.selected + 1
	}
	return ip.selected
}

// ValueText formats the value of in as the pane shows it: a wind input's
// from the wind inputs, an input the wind sets as such in the outflow
// view, any other from the model's inputs (valueText).
func (ip *inputsPane) ValueText(in *input) string {
	switch {
	case in.wind:
		return windText(in, &ip.wind, ip.styles)
	case ip.outflow && in.byWind:
		return byWindText(in, &ip.params, ip.styles)
	}
	return valueText(in, &ip.params, ip.coolingName, ip.styles)
}

// View draws the pane in its border; in the outflow view the title says
// so and the bottom border that χ, Mach and P/k_B come from the wind.
func (ip inputsPane) View() string {
	body := ip.scroll.window(ip.lines(), ip.height-2, ip.selectedLine(), scrollHint(ip.focused), ip.styles)
	more := "a: more inputs"
	if ip.advanced {
		more = "a: fewer inputs"
	}
	title := "Inputs"
	if ip.outflow {
		title = "Inputs: wind and cloud"
		more = "χ, Mach, P/k_B: set by the wind"
		if visibleLen(ip.styles.T(more)) > ip.width-6 {
			more = "χ, M, P: by the wind"
		}
	}
	return strings.Join(boxWithFooter(title, more, body, ip.width, ip.height, ip.focused, ip.styles), "\n")
}

// Rows returns how many lines the pane holds now.
func (ip *inputsPane) Rows() int { return len(ip.lines()) }

// Editing reports whether a value is being typed.
func (ip *inputsPane) Editing() bool { return ip.editing }

// visible returns the inputs shown now, in order: the model's inputs
// (the advanced ones too after a); in the outflow view the wind's inputs
// (SFR, α, β or Ė, Ṁ; R; the launch radius), then the cloud's r_cl, T_cl
// and Z (shared with the other views), then those the wind sets, then the
// advanced ones.
func (ip *inputsPane) visible() []*input {
	var out []*input
	add := func(keep func(in *input) bool) {
		for i := range ip.all {
			if in := &ip.all[i]; keep(in) {
				out = append(out, in)
			}
		}
	}
	if !ip.outflow {
		add(func(in *input) bool { return !in.wind && (!in.advanced || ip.advanced) })
		return out
	}
	rates := ip.wind.rates()
	add(func(in *input) bool {
		return in.wind && (in.rates == rates || in.field == model.FieldWindRadius || in.field == fieldLaunch)
	})
	for _, f := range []string{model.FieldRCloud, model.FieldTCloud, model.FieldMetallicity} {
		add(func(in *input) bool { return in.field == f })
	}
	add(func(in *input) bool { return !in.wind && !in.advanced && in.byWind })
	if ip.advanced {
		add(func(in *input) bool { return in.advanced })
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
// negative; coarse steps pass ±coarseFactor), from the value in use (the
// default of an unset optional input). The new value is checked with
// model.CheckField: a step to a value the model would read as "unset" (0)
// is refused, never replaced by the default. For the cooling input it
// returns the name to switch to instead.
func (ip *inputsPane) Step(p model.Params, n int, coolingSpec string) (model.Params, string, error) {
	in := ip.Current()
	sign := 1
	if n < 0 {
		sign = -1
	}
	switch {
	case in.field == fieldCooling:
		names := cooling.Names()
		i := 0
		for k, c := range names {
			if c.Name == coolingSpec {
				i = k
			}
		}
		return p, names[((i+sign)%len(names)+len(names))%len(names)].Name, nil
	case in.isEnum():
		k := len(in.choices)
		in.setEnum(&p, ((in.getEnum(&p)+sign)%k+k)%k)
		return p, "", nil
	}
	v := in.used(&p)
	if in.log {
		v *= math.Pow(10, float64(n)*in.fine)
	} else {
		v += float64(n) * in.fine * quantity.Factor(in.dim)
		v = roundTo(v, in.fine*quantity.Factor(in.dim)) // no 0.30000000000000004
	}
	if err := model.CheckField(in.field, v); err != nil {
		return p, "", errors.New(ip.FieldMessage(err))
	}
	in.set(&p, v)
	return p, "", nil
}

// Reset returns p with the selected input set to its value in initial
// (unset again if it was unset); for the cooling input it reports cooling
// instead, and p is unchanged.
func (ip *inputsPane) Reset(p, initial model.Params) (next model.Params, isCooling bool) {
	in := ip.Current()
	switch {
	case in.field == fieldCooling:
		return p, true
	case in.isEnum():
		in.setEnum(&p, in.getEnum(&initial))
	default:
		in.set(&p, in.get(&initial))
	}
	return p, false
}

// EditText returns the text the field opens with for in: the cooling
// spec, a choice's command-line name, or the number in use without unit.
func (ip *inputsPane) EditText(in *input) string {
	switch {
	case in.field == fieldCooling:
		return ip.coolingSpec
	case in.isEnum():
		return in.choices[in.getEnum(&ip.params)].names[0]
	case in.field == model.FieldTFloor && ip.params.TFloor == model.NoFloor:
		return "none"
	case in.field == fieldLaunch:
		return strings.TrimSpace(quantity.FormatSig(ip.wind.launch, 6))
	case in.wind:
		return strings.TrimSpace(quantity.Number(in.dim, ip.wind.value(in.field)))
	}
	return strings.TrimSpace(quantity.Number(in.dim, in.used(&ip.params)))
}

// startEdit opens the text field for the selected input with its value,
// selected, so that typing replaces it.
func (ip *inputsPane) startEdit() {
	ip.editing = true
	ip.edit.Start(ip.EditText(ip.Current()))
}

// StopEdit closes the text field.
func (ip *inputsPane) StopEdit() {
	ip.editing = false
	ip.edit.Stop()
}

// EditHint describes the open text field for the status line.
func (ip *inputsPane) EditHint() string {
	in := ip.Current()
	what := "type a value"
	switch {
	case in.field == fieldCooling:
		what = "type a cooling name, const:Λ, powerlaw:L0,T0,S or a table path"
	case in.isEnum():
		what = "type " + in.choiceNames()
	case in.optional:
		what = "type a value, or default"
		if in.field == model.FieldTFloor {
			what = "type a temperature, 0 or none for no floor, or default"
		}
	case in.field == fieldLaunch:
		what = "type a multiple of R (1, 0.5 R) or a radius (300 pc)"
	}
	if ip.edit.Selected() {
		if what == "type a value" {
			what = "typing replaces " + quantity.Sanitize(ip.edit.Value())
		} else {
			what += ": replaces " + quantity.Sanitize(ip.edit.Value())
		}
		return what + " · ←/→ edit it · enter accept · esc cancel"
	}
	return what + " · enter accept · esc cancel"
}

// ApplyEdit parses the typed text into p, exactly as typed: a number with
// an optional unit (quantity.ParseValue) checked by model.CheckField, a
// choice by any of its names, "default" for an unset optional input, and
// for T_floor 0 or "none" for no floor (model.NoFloor). For the cooling
// input it returns the spec to resolve instead.
func (ip *inputsPane) ApplyEdit(p model.Params) (model.Params, string, error) {
	return applyText(ip.Current(), p, ip.edit.Value(), ip)
}

// applyText is ApplyEdit for in and text: the one path of a typed value;
// ip words the errors.
func applyText(in *input, p model.Params, text string, ip *inputsPane) (model.Params, string, error) {
	text = strings.TrimSpace(text)
	switch {
	case in.field == fieldCooling:
		if text == "" {
			return p, "", errors.New("cooling: empty")
		}
		return p, text, nil
	case in.isEnum():
		if i := in.match(text); i >= 0 {
			in.setEnum(&p, i)
			return p, "", nil
		}
		return p, "", fmt.Errorf("%s: %q is not one of %s", in.label, quantity.Sanitize(text), in.choiceNames())
	case in.optional && strings.EqualFold(text, "default"):
		in.set(&p, 0)
		return p, "", nil
	case in.field == model.FieldTFloor && strings.EqualFold(text, "none"):
		p.TFloor = model.NoFloor
		return p, "", nil
	}
	v, err := quantity.ParseValue(in.dim, text)
	if err != nil {
		return p, "", fmt.Errorf("%s: %w", in.label, err)
	}
	if err := model.CheckField(in.field, v); err != nil {
		return p, "", errors.New(ip.FieldMessage(err))
	}
	if in.field == model.FieldTFloor && v == 0 {
		p.TFloor = model.NoFloor // a floor of 0 K: none
		return p, "", nil
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
