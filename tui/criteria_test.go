package tui

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"cloudwind/model"
)

// criterionRow returns the criteria-table line of the criterion labelled
// label (its first 14 characters, as the narrow table shows them).
func criterionRow(t *testing.T, a *App, label string) string {
	t.Helper()
	prefix := label
	if len([]rune(prefix)) > 14 {
		prefix = string([]rune(prefix)[:14])
	}
	for _, l := range strings.Split(screen(a), "\n") {
		if strings.Contains(l, "  "+prefix) && strings.Contains(l, " pc") {
			return l
		}
	}
	t.Fatalf("no row of %q on screen:\n%s", label, screen(a))
	return ""
}

// TestCriteriaTableBands: at 120×40 every criterion whose constant is
// unverified shows r_crit with its band from the evaluation (r_crit ×/÷ its
// uncertainty factor), the others none; the table names criteria by label.
func TestCriteriaTableBands(t *testing.T) {
	a := newTestApp(t, 120, 40)
	st := &a.styles
	s := screen(a)
	for i := range a.res.Criteria {
		c, o := &a.res.Criteria[i], a.res.Outcomes[i]
		if strings.Contains(s, "  "+c.ID+" ") {
			t.Errorf("the table names %s by its id", c.ID)
		}
		if !o.HasThreshold() {
			continue
		}
		row := criterionRow(t, a, c.Label)
		band := "(" + st.Sig(float64(o.RCritLow/model.Parsec), 3) + "–" + st.Sig(float64(o.RCritHigh/model.Parsec), 3) + ")"
		switch u := c.UncertaintyFactor(); {
		case u > 1 && !strings.Contains(row, band):
			t.Errorf("%s (×/÷ %g): row %q lacks the band %s", c.ID, u, row, band)
		case u == 1 && strings.Contains(row, "–"):
			t.Errorf("%s is verified but its row shows a band: %q", c.ID, row)
		}
		if want := o.DependsOnConstant; strings.Contains(row, "depends on α") != want {
			t.Errorf("%s: row %q; depends on the constant: %v", c.ID, row, want)
		}
	}
}

// TestThreeVerdicts: a cold cloud where Farber & Gronke 2022 predicts
// "transformed" shows it with its own glyph and word, in the table and
// in ASCII, and the details give the warm-gas test.
func TestThreeVerdicts(t *testing.T) {
	for _, c := range []struct {
		w, h  int
		ascii bool
		want  string
	}{{80, 24, false, "◐ transf."}, {120, 40, false, "◐ transformed"}, {120, 40, true, "(~) transformed"}} {
		a := newTestAppWith(t, c.w, c.h, func(cfg *Config) { cfg.ASCII = c.ascii })
		press(a, coldKeys()...)
		k := -1
		for i := range a.res.Criteria {
			if a.res.Criteria[i].ID == "farber-gronke-2022" {
				k = i
			}
		}
		if k < 0 || a.res.Outcomes[k].Verdict != model.Transformed {
			t.Fatalf("the cold cloud: farber-gronke-2022 is not transformed (%v)", a.res.Outcomes)
		}
		if row := criterionRow(t, a, "Farber & Gronke 2022"); !strings.Contains(row, c.want) {
			t.Errorf("%d×%d ascii %v: row %q lacks %q", c.w, c.h, c.ascii, row, c.want)
		}
	}
	a := newTestApp(t, 120, 40)
	press(a, coldKeys()...)
	press(a, "tab", "tab", "down", "down", "down", "down", "d")
	if s := screen(a); !strings.Contains(s, "warm gas: the cloud fails the main test") || !strings.Contains(s, "passes → transformed") {
		t.Errorf("the details of farber-gronke-2022 lack the warm-gas test:\n%s", s)
	}
}

// TestDetailsSpread: the details of a criterion give r_crit under each of
// the six conventions of model.ConventionSpread and the summary, and the
// spread is evaluated again only when the state changes.
func TestDetailsSpread(t *testing.T) {
	a := newTestApp(t, 120, 40)
	press(a, "tab", "tab", "d")
	cases, sp, err := model.ConventionSpread(a.cur.params, a.cur.cf, nil, a.cfg.Criteria)
	if err != nil {
		t.Fatal(err)
	}
	_, lines := a.details.body(200)
	text := strings.Join(lines, "\n")
	for k, c := range cases {
		want := a.styles.Format(model.DimLength, float64(sp[0].RCrit[k]))
		name := strings.TrimSuffix(c.String(), ", cooling 1")
		if !strings.Contains(text, name) || !strings.Contains(text, want) {
			t.Errorf("details lack the case %q with r_crit %s:\n%s", name, want, text)
		}
	}
	if !strings.Contains(text, "depends on the convention: 2 survives-and-grows, 4 destroyed") {
		t.Errorf("details lack the spread's summary:\n%s", text)
	}
	before := a.spread.s.spreads
	press(a, "down", "up")
	if &a.spread.s.spreads[0] != &before[0] {
		t.Error("the spread was evaluated again although the state did not change")
	}
}

// TestMachTurbInput: M_turb steps by 0.05 from 0, is refused below 0 with
// CheckField's reason, and moves the turbulent criterion's r_crit.
func TestMachTurbInput(t *testing.T) {
	a := newTestApp(t, 120, 40)
	k := -1
	for i := range a.res.Criteria {
		if a.res.Criteria[i].ID == "turbulent-wind-2025" {
			k = i
		}
	}
	r0 := a.res.Outcomes[k].RCrit
	selectInput(t, a, model.FieldMachTurb)
	press(a, "right")
	if got := a.cur.params.MachTurb; math.Abs(got-0.05) > 1e-12 {
		t.Errorf("M_turb after one step = %g, want 0.05", got)
	}
	press(a, "left", "left")
	if !a.status.isErr || !strings.Contains(a.status.text, "M_turb: must be at least 0") || a.cur.params.MachTurb != 0 {
		t.Errorf("M_turb stepped below 0: %g, status %+v", a.cur.params.MachTurb, a.status)
	}
	typeInto(t, a, model.FieldMachTurb, "2")
	// t̃_cc = t_cc/(1 + (M_turb/(f_mix M))²)^1/2 is shorter, so the ratio and
	// r_crit ∝ ratio grow (derived).
	if a.cur.params.MachTurb != 2 || !(a.res.Outcomes[k].RCrit > r0) {
		t.Errorf("M_turb 2: %g, r_crit of turbulent-wind-2025 %g pc, want more than the %g pc at M_turb = 0",
			a.cur.params.MachTurb, float64(a.res.Outcomes[k].RCrit/model.Parsec), float64(r0/model.Parsec))
	}
}

// TestOutcomes: O loads the demo (the suggestion), places its runs on
// the threshold chart and the regime map and scores the criteria; the
// scores follow a change of the cooling function; O again clears them; a
// bad file is reported with its line and nothing changes.
func TestOutcomes(t *testing.T) {
	a := newTestApp(t, 120, 40)
	press(a, "O", "enter")
	if a.outcomes == nil || len(a.outcomes.runs) != 12 || len(a.outcomes.scores) != len(a.cfg.Criteria) {
		t.Fatalf("O, enter: outcomes %+v, status %+v", a.outcomes, a.status)
	}
	if c := a.chart.Shown(); c.line == nil || len(c.line.Runs) != 12 {
		t.Errorf("the threshold chart holds %d runs, want 12", len(c.line.Runs))
	}
	press(a, "4")
	if c := a.chart.Shown(); c.regime == nil || len(c.regime.Runs) != 12 {
		t.Errorf("the regime map holds %v runs, want 12", c.regime)
	}
	if row := criterionRow(t, a, "Gronke & Oh 2018"); !strings.Contains(row, scoreText(a.outcomes.scores[0])) {
		t.Errorf("the table lacks the score %s: %q", scoreText(a.outcomes.scores[0]), row)
	}
	// A stale reply is dropped.
	old := a.outcomes
	a.Update(outcomesMsg{gen: a.outcomesGen - 1, set: &outcomeSet{name: "stale"}})
	if a.outcomes != old {
		t.Error("a stale outcomes message replaced the loaded outcomes")
	}
	// The scores are evaluated again with a new cooling function.
	before := append([]model.Score(nil), a.outcomes.scores...)
	typeInto(t, a, fieldCooling, "const:1e-21")
	if a.outcomes == nil || a.outcomes.scores == nil || equalScores(before, a.outcomes.scores) {
		t.Errorf("after a new cooling function the scores are %v (before %v)", a.outcomes.scores, before)
	}
	press(a, "u") // undo goes back to the built-in function, and so do the scores
	if a.outcomes == nil || !equalScores(before, a.outcomes.scores) {
		t.Errorf("after undo the scores are %v, want %v", a.outcomes.scores, before)
	}
	press(a, "O")
	if a.outcomes != nil || !strings.Contains(a.status.text, "cleared") {
		t.Errorf("second O: outcomes %v, status %+v", a.outcomes, a.status)
	}
	if c := a.chart.Shown(); c.regime == nil || len(c.regime.Runs) != 0 {
		t.Error("the regime map still shows runs after clearing")
	}
	// A bad line: the status names file and line; nothing is loaded.
	bad := filepath.Join(t.TempDir(), "bad.csv")
	if err := os.WriteFile(bad, []byte("chi,r_cl,outcome\n100,10,grew\n100,3,exploded\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	askPath(a, "O", bad)
	if a.outcomes != nil || !a.status.isErr || !strings.Contains(a.status.text, "bad.csv:3") {
		t.Errorf("bad outcomes file: outcomes %v, status %+v", a.outcomes, a.status)
	}
}

func equalScores(a, b []model.Score) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// TestNeNi: the density product takes n_e n_i in the command line's
// spellings and the header says so.
func TestNeNi(t *testing.T) {
	a := newTestApp(t, 120, 40)
	for _, text := range []string{"neni", "n_e n_i"} {
		typeInto(t, a, model.FieldDensityProduct, "nh2")
		typeInto(t, a, model.FieldDensityProduct, text)
		if a.status.isErr || a.cur.params.DensityProduct != model.NeNi {
			t.Errorf("n×n %q: %v, status %+v", text, a.cur.params.DensityProduct, a.status)
		}
	}
	if h := a.header(); !strings.Contains(h, "𝒩=n_e n_i") {
		t.Errorf("header %q lacks 𝒩=n_e n_i", h)
	}
}
