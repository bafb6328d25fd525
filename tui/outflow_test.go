package tui

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/charmbracelet/x/ansi"

	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// Tests of the outflow view (7): its inputs, their checks and undo, the
// inputs the wind sets, scenarios with and without [outflow], the carried
// cloud, stale results and the export. The wind is model.FiducialWind's
// (SFR = 10 M☉ yr⁻¹, α = β = 1, R = 300 pc; cloudwind's choice) unless a
// test loads another.

// msunYr returns a mass rate in M☉ yr⁻¹.
func msunYr(r model.MassRate) float64 { return float64(r / model.SolarMassPerYear) }

// TestOutflowInputs: the view lists the wind's inputs first; SFR steps by
// 0.05 dex and the chart is recomputed with it; typed values take units
// ("20 Msun/yr", "200 pc"); a value out of range is refused with the reason
// and the last value kept; undo restores the step before.
func TestOutflowInputs(t *testing.T) {
	a := newTestApp(t, 120, 40)
	press(a, "7")
	vis := a.in.visible()
	var labels []string
	for _, in := range vis[:8] {
		labels = append(labels, in.label)
	}
	if got, want := strings.Join(labels, " "), "SFR α β R launch r_cl T_cl Z"; got != want {
		t.Fatalf("outflow inputs: %q, want %q", got, want)
	}
	if a.in.Current().field != model.FieldSFR {
		t.Errorf("the outflow view selects %s, want SFR", a.in.Current().field)
	}
	gen, before := a.chart.gen, a.chart.Shown().line
	press(a, "right")
	if got := msunYr(a.cur.wind.inj.SFR); !near(got, 10*math.Pow(10, 0.05), 1e-12) { // one fine step: ×10^0.05 (input definition)
		t.Errorf("SFR after → = %g M☉/yr, want %g", got, 10*math.Pow(10, 0.05))
	}
	if a.chart.gen == gen || a.chart.Shown().line == before || a.chart.Shown().outflow == nil ||
		msunYr(a.chart.Shown().outflow.Wind.Params.SFR) != msunYr(a.cur.wind.inj.SFR) {
		t.Error("the outflow chart was not recomputed with the new SFR")
	}
	if !strings.Contains(screen(a), "11.2 M☉ yr⁻¹") { // 10 × 10^0.05 = 11.22 (derived)
		t.Errorf("the new SFR is not on screen:\n%s", screen(a))
	}
	typeInto(t, a, model.FieldSFR, "20 Msun/yr")
	typeInto(t, a, model.FieldWindRadius, "200 pc")
	if msunYr(a.cur.wind.inj.SFR) != 20 || !near(float64(a.cur.wind.inj.Radius/model.Parsec), 200, 1e-12) {
		t.Errorf("typed SFR %g M☉/yr and R %g pc, want 20 and 200", msunYr(a.cur.wind.inj.SFR), float64(a.cur.wind.inj.Radius/model.Parsec))
	}
	// The range of model.CheckWindField: SFR ≤ 10⁵ M☉ yr⁻¹, 0 < α.
	typeInto(t, a, model.FieldSFR, "1e9")
	if !a.status.isErr || !strings.Contains(a.status.text, "SFR: must not exceed") || msunYr(a.cur.wind.inj.SFR) != 20 {
		t.Errorf("SFR = 1e9: status %+v, SFR %g", a.status, msunYr(a.cur.wind.inj.SFR))
	}
	typeInto(t, a, model.FieldEnergyLoading, "0")
	if !a.status.isErr || !strings.Contains(a.status.text, "α: must be greater than 0") || a.cur.wind.inj.EnergyLoading != 1 {
		t.Errorf("α = 0: status %+v, α %g", a.status, a.cur.wind.inj.EnergyLoading)
	}
	typeInto(t, a, model.FieldSFR, "3 parsecs")
	if !a.status.isErr || !strings.Contains(a.status.text, `unknown unit "parsecs"`) {
		t.Errorf("SFR in parsecs: status %+v", a.status)
	}
	press(a, "u", "u")
	if got := msunYr(a.cur.wind.inj.SFR); !near(got, 10*math.Pow(10, 0.05), 1e-12) || a.cur.wind.inj.Radius != 300*model.Parsec {
		t.Errorf("after two undos: SFR %g M☉/yr, R %g pc; want the stepped SFR and 300 pc", got, float64(a.cur.wind.inj.Radius/model.Parsec))
	}
	press(a, "u")
	if got := msunYr(a.cur.wind.inj.SFR); got != 10 {
		t.Errorf("after three undos SFR = %g M☉/yr, want 10", got)
	}
}

// TestOutflowLaunch: the launch radius is typed as a multiple of R or a
// length, must lie inside the radius where χ = 1, and sets the state the
// derived and criteria panes show.
func TestOutflowLaunch(t *testing.T) {
	a := newTestApp(t, 120, 40)
	press(a, "7")
	typeInto(t, a, fieldLaunch, "0.5 R")
	if a.cur.wind.launch != 0.5 {
		t.Fatalf("launch after 0.5 R = %g R (status %+v)", a.cur.wind.launch, a.status)
	}
	typeInto(t, a, fieldLaunch, "600 pc") // R = 300 pc
	if !near(a.cur.wind.launch, 2, 1e-12) {
		t.Errorf("launch after 600 pc = %g R, want 2", a.cur.wind.launch)
	}
	if res := a.windResult(); res == &a.res || !near(res.Params.Chi, a.wind.wind.At(2*300*model.Parsec).Chi, 1e-12) {
		t.Errorf("the panes show χ = %g, want the wind's at the launch radius", res.Params.Chi)
	}
	if s := screen(a); !strings.Contains(s, "Derived at launch, 2 R") || !strings.Contains(s, "launch   2 R (600 pc)") {
		t.Errorf("the launch state is not named on screen:\n%s", s)
	}
	// The run ends at 100 R (model.DefaultCarryEnd), inside χ = 1 at 129 R in the fiducial wind (measured).
	typeInto(t, a, fieldLaunch, "110")
	if !a.status.isErr || !strings.Contains(a.status.text, "launch: must lie inside 100 R, where the carried cloud's run ends") || !near(a.cur.wind.launch, 2, 1e-12) {
		t.Errorf("launch = 110 R: status %+v, launch %g", a.status, a.cur.wind.launch)
	}
	// A 10⁵ K cloud: χ = 1 at 23 R (measured: cloudwind outflow --t-cloud 1e5), inside the run's end.
	typeInto(t, a, model.FieldTCloud, "1e5")
	typeInto(t, a, fieldLaunch, "30")
	if !a.status.isErr || !strings.Contains(a.status.text, "launch: must lie inside 23 R") || !strings.Contains(a.status.text, "where the wind is still hotter than the cloud") ||
		!near(a.cur.wind.launch, 2, 1e-12) {
		t.Errorf("launch = 30 R with T_cl = 1e5 K: status %+v, launch %g", a.status, a.cur.wind.launch)
	}
	typeInto(t, a, fieldLaunch, "-1")
	if !a.status.isErr || !strings.Contains(a.status.text, "launch: must be a finite multiple of R greater than 0") {
		t.Errorf("launch = -1: status %+v", a.status)
	}
}

// TestOutflowSetByWind: χ, Mach, P/k_B and M_turb show "set by the wind"
// in the outflow view and are not stepped there; the other views keep
// their values.
func TestOutflowSetByWind(t *testing.T) {
	a := newTestApp(t, 80, 24)
	press(a, "7")
	selectInput(t, a, model.FieldChi)
	chi := a.cur.params.Chi
	press(a, "right", "enter")
	if a.cur.params.Chi != chi || a.in.Editing() || !strings.Contains(a.status.text, "χ is set by the wind") {
		t.Errorf("→ and enter on χ in the outflow view: χ %g (want %g), editing %v, status %+v", a.cur.params.Chi, chi, a.in.Editing(), a.status)
	}
	if s := screen(a); !strings.Contains(s, "χ        set by the wind") || !strings.Contains(s, "χ, M, P: by the wind") {
		t.Errorf("the outflow view does not say that the wind sets χ:\n%s", s)
	}
	press(a, "1")
	if s := ansi.Strip(a.in.View()); !strings.Contains(s, "χ        300") || strings.Contains(s, "set by the wind") {
		t.Errorf("the inputs of view 1 after the outflow view:\n%s", s)
	}
}

// TestOutflowInvalidWind: a T_cl above the wind's central temperature
// (1.38e7 K, measured) is taken in the other views, where it is valid; the
// outflow view then says why it cannot be drawn, and refuses such a change
// while it is shown.
func TestOutflowInvalidWind(t *testing.T) {
	a := newTestApp(t, 120, 40)
	typeInto(t, a, model.FieldTCloud, "2e7")
	if a.status.isErr || a.cur.params.TCloud != 2e7 {
		t.Fatalf("T_cl = 2e7 K in view 1: status %+v", a.status)
	}
	press(a, "7")
	if !a.status.isErr || !strings.Contains(a.status.text, "wind: T_cl: the wind is nowhere hotter than the clouds") {
		t.Errorf("the outflow view with T_cl = 2e7 K: status %+v", a.status)
	}
	if c := a.chart.Shown().line; c == nil || !strings.Contains(c.Note, "no outflow") || a.chart.Shown().outflow != nil {
		t.Errorf("the outflow chart of an invalid wind: %+v", c)
	}
	typeInto(t, a, model.FieldTCloud, "1e4")
	typeInto(t, a, model.FieldTCloud, "3e7")
	if !a.status.isErr || a.cur.params.TCloud != 1e4 {
		t.Errorf("T_cl = 3e7 K in the outflow view: status %+v, T_cl %g", a.status, float64(a.cur.params.TCloud))
	}
}

// TestOutflowScenarios: the 5th demo sets the wind's inputs from its
// [outflow] (SFR 20 M☉ yr⁻¹, α 0.6, β 0.5, R 200 pc: the demo file);
// saving writes them back; a scenario without [outflow] takes the
// fiducial injection, and saving it writes none until a wind input
// changes.
func TestOutflowScenarios(t *testing.T) {
	dir := t.TempDir()
	a := newTestApp(t, 120, 40)
	press(a, demoKeys(5)...)
	w := a.cur.wind.inj
	if msunYr(w.SFR) != 20 || w.EnergyLoading != 0.6 || w.MassLoading != 0.5 || w.Radius != 200*model.Parsec || !a.cur.wind.given {
		t.Fatalf("the outflow demo's wind: %+v", a.cur.wind)
	}
	if !strings.Contains(a.status.text, "7 shows it") {
		t.Errorf("loading the outflow demo: status %+v", a.status)
	}
	path := filepath.Join(dir, "of.toml")
	askPath(a, "s", path)
	if sc := parseFile(t, path); sc.Outflow == nil || *sc.Outflow != w {
		t.Errorf("saved outflow %+v, want %+v", sc.Outflow, w)
	}
	press(a, demoKeys(1)...)
	if msunYr(a.cur.wind.inj.SFR) != 10 || a.cur.wind.given {
		t.Errorf("a demo without [outflow]: wind %+v, want the fiducial injection, not given", a.cur.wind)
	}
	plain := filepath.Join(dir, "plain.toml")
	askPath(a, "s", plain)
	if sc := parseFile(t, plain); sc.Outflow != nil {
		t.Errorf("a scenario without wind inputs saved [outflow] %+v", sc.Outflow)
	}
	press(a, "7", "right")
	askPath(a, "s", plain)
	press(a, "y")
	if sc := parseFile(t, plain); sc.Outflow == nil || sc.Outflow.SFR != a.cur.wind.inj.SFR {
		t.Errorf("after a wind step, saved [outflow] %+v, want SFR %g M☉/yr", sc.Outflow, msunYr(a.cur.wind.inj.SFR))
	}
}

// parseFile reads a scenario file.
func parseFile(t *testing.T, path string) scenario.Scenario {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	sc, err := scenario.Parse(f, path)
	if err != nil {
		t.Fatal(err)
	}
	return sc
}

// TestOutflowStartsFromConfig: a start with an [outflow] given as rates
// (as --scenario passes it) shows Ė and Ṁ instead of SFR, α and β.
func TestOutflowStartsFromConfig(t *testing.T) {
	// Ė = 3e42 erg s⁻¹ and Ṁ = 10 M☉ yr⁻¹: the fiducial wind's rates (model.FiducialWind).
	o := &scenario.Outflow{EnergyRate: 3e42, MassRate: 10 * model.SolarMassPerYear, Radius: 300 * model.Parsec}
	a := newTestAppWith(t, 120, 40, func(c *Config) { c.Outflow = o })
	press(a, "7")
	var labels []string
	for _, in := range a.in.visible()[:4] {
		labels = append(labels, in.label)
	}
	if got := strings.Join(labels, " "); got != "Edot Mdot R launch" || !a.wind.ok() {
		t.Errorf("inputs of a wind given by its rates: %q (wind error %v)", got, a.wind.err)
	}
	if s := screen(a); !strings.Contains(s, "Edot     3e42 erg s⁻¹") {
		t.Errorf("Ė is not shown:\n%s", s)
	}
}

// TestOutflowCarried: c shows the carried cloud, from any view; a result
// of the profile that arrives after the switch is dropped; moving the
// criterion selection redraws the events; c again goes back.
func TestOutflowCarried(t *testing.T) {
	a := newTestApp(t, 120, 40)
	old := a.requestChart() // view 1, superseded
	press(a, "c")
	if a.chart.Kind() != viewOutflow || !a.chart.Carried() {
		t.Fatalf("c from view 1: view %d, carried %v", a.chart.Kind()+1, a.chart.Carried())
	}
	c := a.chart.Shown()
	if c.line2 == nil || c.outflow == nil || len(c.outflow.Carried) != len(a.cfg.Criteria) {
		t.Fatalf("the carried cloud's panels are not shown: %+v", c)
	}
	drain(a, old)
	if a.chart.Shown().gen != c.gen {
		t.Error("a stale chart replaced the carried cloud")
	}
	s := screen(a)
	for _, want := range []string{"7 outflow: carried cloud vs r/R", "m/m₀", "v (km s⁻¹)", "Criteria: the carried cloud", "spread"} {
		if !strings.Contains(s, want) {
			t.Errorf("the carried view lacks %q:\n%s", want, s)
		}
	}
	note := c.line.Note
	press(a, "tab", "tab", "down") // the criteria pane, the next criterion
	if a.chart.Shown().gen == c.gen || a.chart.Shown().line.Note == note {
		t.Errorf("selecting another criterion did not redraw its events: note %q", a.chart.Shown().line.Note)
	}
	press(a, "c")
	if a.chart.Carried() || a.chart.Shown().line2 != nil || !strings.Contains(screen(a), "7 outflow: r_crit vs r/R") {
		t.Error("c again did not go back to r_crit along the wind")
	}
}

// TestOutflowExport: x writes the profile as one figure and the carried
// cloud as two panels, with the outflow's caption.
func TestOutflowExport(t *testing.T) {
	dir := t.TempDir()
	a := newTestApp(t, 120, 40)
	press(a, "7")
	for _, tc := range []struct {
		name  string
		wants []string
	}{{"profile.svg", []string{"vs r/R, R = 300 pc", "criteria disagree", "SFR = 10"}}, {"carried.svg", []string{"launched at", "speed v vs r/R"}}} {
		if tc.name == "carried.svg" {
			press(a, "c")
		}
		path := filepath.Join(dir, tc.name)
		askPath(a, "x", path)
		b, err := os.ReadFile(path)
		if err != nil {
			t.Fatalf("x on the outflow view: %v (status %+v)", err, a.status)
		}
		for _, want := range tc.wants {
			if !bytes.Contains(b, []byte(want)) {
				t.Errorf("%s lacks %q", tc.name, want)
			}
		}
	}
}
