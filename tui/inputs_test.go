package tui

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// selectInput moves the selection to the input with field, showing the
// advanced inputs when needed.
func selectInput(t *testing.T, a *App, field string) *input {
	t.Helper()
	for i := range a.in.all {
		if a.in.all[i].field == field && a.in.all[i].advanced && !a.in.advanced {
			press(a, "a")
		}
	}
	for range len(a.in.all) + 1 {
		if in := a.in.Current(); in.field == field {
			return in
		}
		press(a, "down")
	}
	t.Fatalf("no input %s", field)
	return nil
}

// typeInto opens the text field of the input with field and types text
// (replacing the selected value), then enter.
func typeInto(t *testing.T, a *App, field, text string) {
	t.Helper()
	selectInput(t, a, field)
	press(a, "enter")
	typeText(a, text)
	press(a, "enter")
}

// TestTypingReplacesSelection: the text field opens with the value
// selected; the first character typed replaces it (30 pc + "0.2 kpc" is
// 200 pc, not 300.2 kpc), while Backspace or an arrow first edits it. The
// path prompt behaves the same.
func TestTypingReplacesSelection(t *testing.T) {
	a := newTestApp(t, 120, 40)
	typeInto(t, a, model.FieldRCloud, "30")
	typeInto(t, a, model.FieldRCloud, "0.2 kpc")
	if got := float64(a.cur.params.RCloud / model.Parsec); math.Abs(got-200) > 1e-9 {
		t.Errorf("r_cl after typing 0.2 kpc over 30 = %g pc, want 200", got)
	}
	press(a, "enter")
	if !a.in.edit.Selected() || !strings.Contains(screen(a), "typing replaces 200") {
		t.Errorf("the opened field does not say that typing replaces the value:\n%s", screen(a))
	}
	press(a, "backspace") // edits "200": "20"
	typeText(a, "5")
	press(a, "enter")
	if got := float64(a.cur.params.RCloud / model.Parsec); math.Abs(got-205) > 1e-9 {
		t.Errorf("r_cl after backspace and 5 on 200 = %g pc, want 205", got)
	}
	press(a, "enter", "left") // an arrow keeps the value: "205" with the cursor moved
	typeText(a, "1")
	press(a, "enter")
	if got := float64(a.cur.params.RCloud / model.Parsec); math.Abs(got-2015) > 1e-9 {
		t.Errorf("r_cl after ← and 1 on 205 = %g pc, want 2015", got)
	}
	press(a, "s")
	typeText(a, "x.toml")
	if got := a.prompt.input.Value(); got != "x.toml" {
		t.Errorf("the path prompt after typing x.toml holds %q, want it to replace the suggestion", got)
	}
}

// TestEveryCLISpelling: every enumerated input takes the spellings of the
// command line and scenario files.
func TestEveryCLISpelling(t *testing.T) {
	a := newTestApp(t, 120, 40)
	for _, c := range []struct {
		text string
		want model.HeatCapacity
	}{{"isobaric", model.Isobaric}, {"isochoric", model.Isochoric}, {"5/2", model.Isobaric}, {"ISOCHORIC", model.Isochoric}} {
		typeInto(t, a, model.FieldHeatCapacity, c.text)
		if a.status.isErr || a.cur.params.HeatCapacity != c.want {
			t.Errorf("f %q: %v, status %+v", c.text, a.cur.params.HeatCapacity, a.status)
		}
	}
	for _, c := range []struct {
		text string
		want model.DensityProduct
	}{{"n2", model.N2}, {"nh2", model.NH2}, {"N2", model.N2}, {"n_H²", model.NH2}} {
		typeInto(t, a, model.FieldDensityProduct, c.text)
		if a.status.isErr || a.cur.params.DensityProduct != c.want {
			t.Errorf("n×n %q: %v, status %+v", c.text, a.cur.params.DensityProduct, a.status)
		}
	}
	for _, m := range model.Mixtures() {
		typeInto(t, a, fieldMixture, m.Name)
		if a.status.isErr || a.cur.params.Mixture != m {
			t.Errorf("mixture %q: %v, status %+v", m.Name, a.cur.params.Mixture.Name, a.status)
		}
	}
	for _, c := range cooling.Names() {
		typeInto(t, a, fieldCooling, c.Name)
		if a.status.isErr || a.cur.cooling.Spec != c.Name {
			t.Errorf("cooling %q: spec %q, status %+v", c.Name, a.cur.cooling.Spec, a.status)
		}
	}
	typeInto(t, a, model.FieldDensityProduct, "n3")
	if !a.status.isErr || !strings.Contains(a.status.text, "nh2, n2") {
		t.Errorf("n×n n3: status %+v, want a refusal listing nh2, n2", a.status)
	}
}

// TestDefaultsShown: unset optional conventions show the value used,
// marked as the default, never 0; a typed value is used or refused, never
// replaced.
func TestDefaultsShown(t *testing.T) {
	a := newTestApp(t, 120, 40)
	press(a, "a")
	q := a.cur.params.WithDefaults()
	for _, c := range []struct {
		label string
		v     float64
		k     model.Dimension
	}{{"γ", q.Gamma, model.Dimensionless}, {"μ_cl", q.MuCold, model.Dimensionless}, {"μ_hot", q.MuHot, model.Dimensionless},
		{"X", q.HydrogenFraction, model.Dimensionless}, {"T_floor", float64(q.TCloud), model.DimTemperature}} {
		want := c.label + strings.Repeat(" ", 9-len([]rune(c.label))) + quantity.Format(c.k, c.v) + " (default)"
		if !strings.Contains(screen(a), want) {
			t.Errorf("the inputs pane lacks %q\n%s", want, screen(a))
		}
	}
	// 0 for μ_cl is refused with CheckField's reason; μ_cl stays unset.
	typeInto(t, a, model.FieldMuCold, "0")
	if !a.status.isErr || !strings.Contains(a.status.text, "μ_cl: must be at least 0.1") || a.cur.params.MuCold != 0 {
		t.Errorf("μ_cl 0: status %+v, μ_cl %g", a.status, a.cur.params.MuCold)
	}
	typeInto(t, a, model.FieldMuCold, "0.62")
	if a.cur.params.MuCold != 0.62 || strings.Contains(screen(a), "0.62 (default)") {
		t.Errorf("μ_cl 0.62: %g, shown as a default: %v", a.cur.params.MuCold, strings.Contains(screen(a), "0.62 (default)"))
	}
	typeInto(t, a, model.FieldMuCold, "default")
	if a.cur.params.MuCold != 0 {
		t.Errorf("μ_cl default: %g, want unset (0)", a.cur.params.MuCold)
	}
	// 0 for T_floor is no floor, shown as none; the model sees no floor.
	typeInto(t, a, model.FieldTFloor, "0")
	if a.status.isErr || a.cur.params.TFloor != model.NoFloor || !strings.Contains(screen(a), "T_floor  none") {
		t.Errorf("T_floor 0: status %+v, T_floor %g, screen:\n%s", a.status, float64(a.cur.params.TFloor), screen(a))
	}
	if _, ok := a.res.Params.Floor(); ok {
		t.Error("T_floor 0: the evaluation still has a floor")
	}
	// Saved and loaded again, no floor stays no floor and unset stays unset.
	path := filepath.Join(t.TempDir(), "nofloor.toml")
	askPath(a, "s", path)
	f, err := os.Open(path)
	if err != nil {
		t.Fatalf("save: %v (status %+v)", err, a.status)
	}
	sc, err := scenario.Parse(f, path)
	f.Close()
	if err != nil || sc.Params.TFloor != model.NoFloor || sc.Params.MuCold != 0 || sc.Params.Gamma != 0 {
		t.Errorf("saved scenario: %v; T_floor %g (want no floor), μ_cl %g and γ %g (want unset)", err, float64(sc.Params.TFloor), sc.Params.MuCold, sc.Params.Gamma)
	}
	// Stepping γ down never reaches 1 or 0 silently: it is refused there.
	selectInput(t, a, model.FieldGamma)
	for range 100 {
		press(a, "left")
	}
	if a.cur.params.Gamma <= 1 || !a.status.isErr || !strings.Contains(a.status.text, "γ: must be greater than 1") {
		t.Errorf("γ stepped down 100 times: %g, status %+v", a.cur.params.Gamma, a.status)
	}
}
