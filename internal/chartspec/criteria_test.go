package chartspec

import (
	"math"
	"strings"
	"testing"

	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// coldRequest is testRequest for a cloud at 800 K, χ = 3000, P/k_B =
// 10⁴ K cm⁻³ and r_cl = 3 pc, where farber-gronke-2022 predicts
// "transformed" (inputs of this test, no source; the verdict checked
// below).
func coldRequest(t *testing.T) Request {
	t.Helper()
	r := testRequest(t)
	r.Params.Chi, r.Params.Pressure, r.Params.TCloud, r.Params.TFloor = 3000, 1e4, 800, 0
	r.Params.RCloud = 3 * model.Parsec
	return r
}

// demoRuns are the fictional demo outcomes of internal/scenario.
func demoRuns(t *testing.T, base model.Params) []model.SimRun {
	t.Helper()
	base.TFloor = 0 // the floor follows each run's T_cl
	o, err := scenario.LoadOutcomes(strings.NewReader(scenario.DemoOutcomes), "demo", base)
	if err != nil {
		t.Fatal(err)
	}
	return o.Runs
}

// TestThresholdBands: every unverified radiative criterion has a band
// whose edges are r_crit ×/÷ its uncertainty factor (r_crit ∝ α^-1 for
// cooling times, derived: model.State.Evaluate), nobody else has one, and
// neither the family nor the pinned curves get one.
func TestThresholdBands(t *testing.T) {
	r := testRequest(t)
	c := ThresholdChart(r)
	want := 0
	for _, i := range radiative(r.Criteria) {
		if r.Criteria[i].UncertaintyFactor() > 1 {
			want++
		}
	}
	if want == 0 || len(c.Bands) != want {
		t.Fatalf("ThresholdChart: %d bands, want %d (one per unverified radiative criterion)", len(c.Bands), want)
	}
	if c.BandFactor != "×/÷ 2" {
		t.Errorf("ThresholdChart band factor %q, want ×/÷ 2", c.BandFactor)
	}
	for _, b := range c.Bands {
		cr := &r.Criteria[b.Index]
		if cr.Verified || !strings.HasPrefix(b.Name, CriterionName(cr)) {
			t.Errorf("band %q belongs to %s (verified %v)", b.Name, cr.ID, cr.Verified)
		}
		var curve *Series
		for i := range c.Series {
			if c.Series[i].Index == b.Index {
				curve = &c.Series[i]
			}
		}
		if cr.Cool == model.CoolGrow {
			continue // r_crit ∝ α^-4 for t_grow
		}
		d := math.Log10(cr.UncertaintyFactor())
		for k := range b.X {
			if y := curve.Y[k]; finite(y) && (math.Abs(b.Hi[k]-y-d) > 1e-9 || math.Abs(y-b.Lo[k]-d) > 1e-9) {
				t.Fatalf("band of %s at log χ = %g: [%g, %g] around %g, want ±%g dex", cr.ID, b.X[k], b.Lo[k], b.Hi[k], y, d)
			}
		}
		if lo, hi := c.Y.Min, c.Y.Max; !(lo <= minFinite(b.Lo)) || !(hi >= maxFinite(b.Hi)) {
			t.Errorf("band of %s leaves the y axis [%g, %g]", cr.ID, lo, hi)
		}
	}
	r.Family = true
	if c := ThresholdChart(r); len(c.Bands) != 0 || c.BandFactor != "" {
		t.Errorf("family mode: %d bands, factor %q; want none", len(c.Bands), c.BandFactor)
	}
	r.Family, r.Pin = false, &Inputs{Params: r.Params, Cooling: r.Cooling}
	if c := ThresholdChart(r); len(c.Bands) != want {
		t.Errorf("with a pin: %d bands, want %d (B's only)", len(c.Bands), want)
	}
}

func minFinite(v []float64) float64 {
	m := math.Inf(1)
	for _, x := range v {
		if finite(x) {
			m = min(m, x)
		}
	}
	return m
}

func maxFinite(v []float64) float64 {
	m := math.Inf(-1)
	for _, x := range v {
		if finite(x) {
			m = max(m, x)
		}
	}
	return m
}

// TestChartsNameCriteriaByLabel: legends carry labels, never ids.
func TestChartsNameCriteriaByLabel(t *testing.T) {
	r := coldRequest(t)
	mass, _ := EvolutionCharts(r)
	for _, c := range []*LineChart{ThresholdChart(r), mass} {
		for _, s := range c.Series {
			for _, cr := range r.Criteria {
				if strings.Contains(s.Name, cr.ID) {
					t.Errorf("%s: series %q names criterion %s by its id", c.Title, s.Name, cr.ID)
				}
			}
		}
	}
	// The transformed branch says so.
	found := false
	for _, s := range mass.Series {
		found = found || s.Name == "Farber & Gronke 2022 (transformed)"
	}
	if !found {
		t.Errorf("EvolutionCharts at a transformed verdict: no series \"Farber & Gronke 2022 (transformed)\" among %v", mass.Series)
	}
	r.Family = true
	if c := ThresholdChart(r); !strings.Contains(c.Title, "Gronke & Oh 2018") || c.Series[0].Name != "M = 0.5" {
		t.Errorf("family: title %q, first series %q", c.Title, c.Series[0].Name)
	}
}

// TestRunsPlaced: the demo runs land at their χ and r_cl (or Mach), inside
// the threshold chart's y axis.
func TestRunsPlaced(t *testing.T) {
	r := testRequest(t)
	r.Runs, r.RunsName = demoRuns(t, r.Params), "demo (fictional)"
	c := ThresholdChart(r)
	if len(c.Runs) != len(r.Runs) || c.RunsName != "demo (fictional)" {
		t.Fatalf("ThresholdChart: %d runs named %q, want %d", len(c.Runs), c.RunsName, len(r.Runs))
	}
	for i, m := range c.Runs {
		run := &r.Runs[i]
		if math.Abs(m.X-math.Log10(run.Params.Chi)) > 1e-12 || math.Abs(m.Y-logPc(run.Params.RCloud)) > 1e-12 || m.Outcome != run.Outcome {
			t.Errorf("run %s at (%g, %g) %v, want (log χ, log r_cl) = (%g, %g) %v", run.Label, m.X, m.Y, m.Outcome,
				math.Log10(run.Params.Chi), logPc(run.Params.RCloud), run.Outcome)
		}
		if m.Y < c.Y.Min || m.Y > c.Y.Max {
			t.Errorf("run %s at log r_cl = %g outside the y axis [%g, %g]", run.Label, m.Y, c.Y.Min, c.Y.Max)
		}
	}
	r.MapMach = true
	m := Regime(r)
	if len(m.Runs) != len(r.Runs) || math.Abs(m.Runs[0].Y-math.Log10(r.Runs[0].Params.Mach)) > 1e-12 {
		t.Errorf("Regime (χ × Mach): %d runs, first at y = %g, want log10 Mach", len(m.Runs), m.Runs[0].Y)
	}
}

// conventionVerdicts returns the verdicts of the radiative criteria of r
// at χ and r_cl under every convention of model.ConventionSpread, and
// whether one lies inside its uncertainty band at the nominal convention.
func conventionVerdicts(t *testing.T, r Request, chi float64, rcl model.Length) (nominal []model.Verdict, flips, band bool) {
	t.Helper()
	p := r.Params
	p.Chi, p.RCloud = chi, rcl
	_, sp, err := model.ConventionSpread(p, r.Cooling, nil, r.Criteria)
	if err != nil {
		t.Fatal(err)
	}
	res, err := model.Evaluate(p, r.Cooling, r.Criteria)
	if err != nil {
		t.Fatal(err)
	}
	for _, k := range radiative(r.Criteria) {
		nominal = append(nominal, res.Outcomes[k].Verdict)
		band = band || res.Outcomes[k].DependsOnConstant
		// Only the main test counts (a flip of the warm test alone does not).
		survives := sp[k].Count[model.Survives]
		flips = flips || (survives > 0 && survives < len(sp[k].Verdict))
	}
	return nominal, flips, band
}

// TestRegimeClasses checks the class of every cell on the columns where
// the convention spread is evaluated (no interpolation there) against a
// direct evaluation at the cell's centre: Depends exactly where a verdict
// lies inside its band or flips across the conventions, else AllAgree
// exactly where every verdict is the same.
func TestRegimeClasses(t *testing.T) {
	for name, r := range map[string]Request{"fiducial": testRequest(t), "cold": coldRequest(t)} {
		r.Cols, r.Rows = 24, 12
		m := Regime(r)
		if len(m.Class) != m.NX*m.NY || m.SpreadEvery != 1 {
			t.Fatalf("%s: %d classes for %d×%d cells, spread every %d (want 1 at 24 columns)", name, len(m.Class), m.NX, m.NY, m.SpreadEvery)
		}
		seen := map[Agreement]int{}
		for j := range m.NY {
			for i := range m.NX {
				chi := math.Pow(10, m.X.Min+(m.X.Max-m.X.Min)*(float64(i)+0.5)/float64(m.NX))
				rcl := model.Length(math.Pow(10, m.Y.Min+(m.Y.Max-m.Y.Min)*(float64(j)+0.5)/float64(m.NY))) * model.Parsec
				nominal, flips, band := conventionVerdicts(t, r, chi, rcl)
				want := AllAgree
				for _, v := range nominal {
					if v != nominal[0] {
						want = Disagree
					}
				}
				if flips || band {
					want = Depends
				}
				got := m.Class[j*m.NX+i]
				seen[got]++
				if got != want {
					t.Errorf("%s: cell (%d, %d) at χ = %.4g, r_cl = %.4g pc: %v, want %v (verdicts %v, band %v, conventions flip %v)",
						name, i, j, chi, float64(rcl/model.Parsec), got, want, nominal, band, flips)
				}
			}
		}
		if seen[AllAgree] == 0 || seen[Depends] == 0 {
			t.Errorf("%s: classes seen %v; want cells that agree and cells that depend on constants or conventions", name, seen)
		}
	}
	// Transformed verdicts are counted where they can occur.
	r := coldRequest(t)
	r.Cols, r.Rows = 30, 15
	m := Regime(r)
	n := 0
	for _, v := range m.Transformed {
		n += v
	}
	if m.Transformed == nil || n == 0 {
		t.Errorf("Regime of a cold cloud: no transformed verdict counted (%v)", m.Transformed != nil)
	}
	if m := Regime(testRequest(t)); m.Transformed != nil {
		t.Error("Regime at T_cl = 10⁴ K counts transformed verdicts, which no criterion can give there")
	}
}

// TestRegimeSpreadSubGrid: at 200 columns the spread is evaluated on a
// coarser grid, and the note says so.
func TestRegimeSpreadSubGrid(t *testing.T) {
	r := testRequest(t)
	r.Cols, r.Rows = 200, 100
	m := Regime(r)
	if m.SpreadEvery != 4 || !strings.Contains(m.Note, "every 4th cell") {
		t.Errorf("Regime 200×100: spread every %d, note %q; want every 4th cell", m.SpreadEvery, m.Note)
	}
	if got := ordinal(1) + ordinal(2) + ordinal(3) + ordinal(11) + ordinal(22); got != "1st2nd3rd11th22nd" {
		t.Errorf("ordinal: %q", got)
	}
}
