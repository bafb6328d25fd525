package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/key"

	"cloudwind/internal/quantity"
)

// KeyMap is the explorer's one keymap. Every binding carries its help
// text, so the help overlay and the hint line are generated from the data
// that drives Update; bindings that do not apply are disabled and vanish
// from help.
type KeyMap struct {
	Up, Down          key.Binding // select an input, a criterion or a quantity; scroll text
	PageUp, PageDown  key.Binding // scroll the focused pane (or an overlay, or the full-screen chart) a page
	Top, Bottom       key.Binding // to its first or last line
	Inc, Dec          key.Binding // step the selected input finely
	IncBig, DecBig    key.Binding // step it coarsely
	Edit              key.Binding // type a value
	Undo, Reset       key.Binding
	ResetAll          key.Binding
	Advanced          key.Binding // show γ, μ, T_floor, conventions, cooling
	Focus, FocusBack  key.Binding // move between panes
	Zoom              key.Binding // the chart takes the whole window
	View1, View2      key.Binding
	View3, View4      key.Binding
	View5, View6      key.Binding
	View7             key.Binding
	NextView          key.Binding
	Family            key.Binding // threshold chart: a family over Mach numbers
	MapAxis           key.Binding // regime map: χ × r_cl or χ × Mach
	Carry             key.Binding // outflow view: r_crit along the wind or the carried cloud
	Details           key.Binding
	Pin, Unpin        key.Binding // compare mode
	Scenarios         key.Binding
	Outcomes          key.Binding // load simulation outcomes, or clear them
	Save              key.Binding
	ExportChart       key.Binding // the chart as a figure; the plan view as text
	ExportState       key.Binding
	Palette           key.Binding
	Help              key.Binding
	Quit              key.Binding
	ForceQuit         key.Binding // ctrl+c, also while typing (not in help: Quit lists it)
	Accept, Cancel    key.Binding // in prompts and overlays
	Yes, No           key.Binding // in the question before overwriting a file
	PromptUp, PromDwn key.Binding // in the scenario menu
}

// DefaultKeyMap returns the explorer's keys.
func DefaultKeyMap() KeyMap {
	b := func(help1, help2 string, keys ...string) key.Binding {
		return key.NewBinding(key.WithKeys(keys...), key.WithHelp(help1, help2))
	}
	return KeyMap{
		Up:          b("↑/k", "select up", "up", "k"),
		Down:        b("↓/j", "select down", "down", "j"),
		PageUp:      b("pgup", "page up", "pgup"),
		PageDown:    b("pgdn", "page down", "pgdown"),
		Top:         b("home", "to the top", "home"),
		Bottom:      b("end", "to the bottom", "end"),
		Inc:         b("→/l", "increase", "right", "l"),
		Dec:         b("←/h", "decrease", "left", "h"),
		IncBig:      b("shift+→/L", "increase ×10", "shift+right", "L"),
		DecBig:      b("shift+←/H", "decrease ×10", "shift+left", "H"),
		Edit:        b("enter/e", "type a value", "enter", "e"),
		Undo:        b("u", "undo", "u"),
		Reset:       b("r", "reset input", "r"),
		ResetAll:    b("R", "reset all", "R"),
		Advanced:    b("a", "more inputs", "a"),
		Focus:       b("tab", "next pane", "tab"),
		FocusBack:   b("shift+tab", "previous pane", "shift+tab"),
		Zoom:        b("z", "full-screen chart", "z"),
		View1:       b("1", "r_crit vs χ", "1"),
		View2:       b("2", "cooling curve", "2"),
		View3:       b("3", "ratios vs r_cl", "3"),
		View4:       b("4", "regime map", "4"),
		View5:       b("5", "evolution", "5"),
		View6:       b("6", "simulation plan", "6"),
		View7:       b("7", "outflow along r", "7"),
		NextView:    b("v", "next chart", "v"),
		Family:      b("f", "family over Mach", "f"),
		MapAxis:     b("m", "switch map axes", "m"),
		Carry:       b("c", "carried cloud (7)", "c"),
		Details:     b("d", "details", "d"),
		Pin:         b("p", "pin as A (compare)", "p"),
		Unpin:       b("P", "unpin A", "P"),
		Scenarios:   b("o", "open scenario", "o"),
		Outcomes:    b("O", "load sim. outcomes", "O"),
		Save:        b("s", "save scenario", "s"),
		ExportChart: b("x", "export chart SVG/PNG", "x"),
		ExportState: b("J", "export state JSON", "J"),
		Palette:     b("t", "light/dark palette", "t"),
		Help:        b("?", "help", "?"),
		Quit:        b("q", "quit", "q", "ctrl+c"),
		ForceQuit:   b("ctrl+c", "quit", "ctrl+c"),
		Accept:      b("enter", "accept", "enter"),
		Cancel:      b("esc", "cancel", "esc"),
		Yes:         b("y", "yes, overwrite", "y", "Y"),
		No:          b("n/esc", "no, keep the file", "n", "N"),
		PromptUp:    b("↑", "previous", "up"),
		PromDwn:     b("↓", "next", "down"),
	}
}

// all returns every binding of k, for changes that apply to all.
func (k *KeyMap) all() []*key.Binding {
	return []*key.Binding{&k.Up, &k.Down, &k.PageUp, &k.PageDown, &k.Top, &k.Bottom, &k.Inc, &k.Dec, &k.IncBig,
		&k.DecBig, &k.Edit, &k.Undo, &k.Reset, &k.ResetAll, &k.Advanced, &k.Focus, &k.FocusBack, &k.Zoom, &k.View1,
		&k.View2, &k.View3, &k.View4, &k.View5, &k.View6, &k.View7, &k.NextView, &k.Family, &k.MapAxis, &k.Carry, &k.Details, &k.Pin,
		&k.Unpin, &k.Scenarios, &k.Outcomes, &k.Save, &k.ExportChart, &k.ExportState, &k.Palette, &k.Help, &k.Quit, &k.ForceQuit,
		&k.Accept, &k.Cancel, &k.Yes, &k.No, &k.PromptUp, &k.PromDwn}
}

// keyWords spells the arrows of key names as words for ASCII help.
var keyWords = strings.NewReplacer("↑", "up", "↓", "down", "←", "left", "→", "right")

// useASCII rewrites every binding's help text in plain ASCII: arrows in
// key names as words (shift+→ → shift+right), descriptions through
// quantity.ASCII (χ → chi).
func (k *KeyMap) useASCII() {
	for _, b := range k.all() {
		h := b.Help()
		b.SetHelp(quantity.ASCII(keyWords.Replace(h.Key)), quantity.ASCII(h.Desc))
	}
}

// ShortHelp returns the bindings of the one-line hint.
func (k KeyMap) ShortHelp() []key.Binding {
	return []key.Binding{k.Up, k.Inc, k.Edit, k.Zoom, k.NextView, k.Focus, k.Details, k.Help, k.Quit}
}

// helpGroup is a titled group of bindings in the help overlay.
type helpGroup struct {
	title string
	keys  []key.Binding
}

// FullHelp returns the bindings of the help overlay, in columns.
func (k KeyMap) FullHelp() [][]key.Binding {
	var out [][]key.Binding
	for _, g := range k.groups() {
		out = append(out, g.keys)
	}
	return out
}

// groups returns the bindings of the help overlay in titled groups.
func (k KeyMap) groups() []helpGroup {
	return []helpGroup{
		{"Inputs", []key.Binding{k.Up, k.Down, k.Inc, k.Dec, k.IncBig, k.DecBig, k.Edit, k.Undo, k.Reset, k.ResetAll, k.Advanced}},
		{"Panes", []key.Binding{k.Focus, k.FocusBack, k.PageUp, k.PageDown, k.Top, k.Bottom, k.Details, k.Help, k.Quit}},
		{"Charts", []key.Binding{k.View1, k.View2, k.View3, k.View4, k.View5, k.View6, k.View7, k.NextView, k.Zoom, k.Family, k.MapAxis, k.Carry}},
		{"Compare and files", []key.Binding{k.Pin, k.Unpin, k.Scenarios, k.Outcomes, k.Save, k.ExportChart, k.ExportState, k.Palette}},
	}
}
