package tui

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// FuzzPromptInput types text into the text field of every input and
// presses enter, through the App's own path (Update with the key). It
// must never panic; a refused value leaves the state as it was; an
// accepted value is exactly what quantity.ParseValue gives for the text
// (0 for T_floor being no floor), the choice the text names, or unset for
// "default". Run: go test ./tui -run '^$' -fuzz '^FuzzPromptInput$' -fuzztime 20000x.
func FuzzPromptInput(f *testing.F) {
	seeds := []string{"300", "30 pc", "0.2 kpc", "1e19 cm", "2e4", "1 keV", "3e3", "1e-13 erg cm-3", "10^4.5 K",
		"0", "-1", "default", "none", "nh2", "n2", "isobaric", "A21", "builtin", "NaN", "inf", "1e400", "", " ",
		"3 parsecs", "0x10", "1_000", "５", "\x1b[2J", "χ", "1e-400 pc"}
	for i, s := range seeds {
		f.Add(uint8(i), s)
	}
	a := newTestApp(f, 120, 40)
	a.in.advanced = true
	start := a.cur
	f.Fuzz(func(t *testing.T, which uint8, text string) {
		a.cur, a.status, a.history = start, status{}, nil
		if err := a.res.Evaluate(a.cur.params, a.cur.cf, a.cfg.Criteria); err != nil {
			t.Fatal(err)
		}
		a.sync()
		vis := a.in.visible()
		a.in.selected = int(which) % len(vis)
		in := a.in.Current()
		a.in.startEdit()
		a.in.edit.input.SetValue(text)
		a.in.edit.selected = false
		typed := a.in.edit.Value() // what the field holds: the text input drops what it cannot take
		before := a.cur.params
		a.Update(tea.KeyMsg{Type: tea.KeyEnter})
		if a.in.Editing() {
			t.Fatalf("%s %q: the field is still open after enter", in.label, typed)
		}
		after := a.cur.params
		if a.status.isErr || in.field == fieldCooling { // refused, or a cooling spec resolved in a command
			if after != before {
				t.Fatalf("%s %q refused (%s) but the inputs changed", in.label, typed, a.status.text)
			}
			return
		}
		word := strings.TrimSpace(typed)
		switch {
		case in.isEnum():
			if i := in.match(word); i < 0 || in.getEnum(&after) != i {
				t.Fatalf("%s %q accepted as choice %d, want the choice it names (%d)", in.label, typed, in.getEnum(&after), i)
			}
		case in.optional && strings.EqualFold(word, "default"):
			if in.get(&after) != 0 {
				t.Fatalf("%s default: %g, want unset", in.label, in.get(&after))
			}
		case in.field == model.FieldTFloor && strings.EqualFold(word, "none"):
			if after.TFloor != model.NoFloor {
				t.Fatalf("T_floor none: %g, want model.NoFloor", float64(after.TFloor))
			}
		default:
			want, err := quantity.ParseValue(in.dim, typed)
			if err != nil {
				t.Fatalf("%s %q accepted, but ParseValue refuses it: %v", in.label, typed, err)
			}
			if in.field == model.FieldTFloor && want == 0 {
				if after.TFloor != model.NoFloor {
					t.Fatalf("T_floor %q: %g, want no floor", typed, float64(after.TFloor))
				}
				break
			}
			// The value the model uses, not only the one stored: a 0 stored in
			// an optional field would be replaced by its default.
			if got := in.used(&after); got != want || in.get(&after) != want {
				t.Fatalf("%s %q accepted as %g (used %g), want ParseValue's %g", in.label, typed, in.get(&after), got, want)
			}
		}
		_ = a.View()
	})
}
