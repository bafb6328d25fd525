package chartspec

import (
	"math"
	"strings"
	"testing"

	"cloudwind/cooling"
	"cloudwind/model"
)

// testRequest is the Gronke & Oh fiducial problem at χ = 300 and r_cl =
// 10 pc with the built-in cooling function and criteria (inputs of this
// test, no source).
func testRequest(t testing.TB) Request {
	t.Helper()
	src, err := cooling.Resolve("cooling", "builtin", nil, nil)
	if err != nil {
		t.Fatal(err)
	}
	p := model.Fiducial()
	p.Chi, p.RCloud = 300, 10*model.Parsec
	p = p.WithDefaults()
	cf, err := src.Function(p.Metallicity)
	if err != nil {
		t.Fatal(err)
	}
	return Request{Params: p, Cooling: cf, Criteria: model.BuiltinCriteria(), Cols: 60, Rows: 20}
}

// finiteCount returns how many points of s are finite.
func finiteCount(s Series) int {
	n := 0
	for _, v := range s.Y {
		if !math.IsNaN(v) && !math.IsInf(v, 0) {
			n++
		}
	}
	return n
}

func TestThresholdChart(t *testing.T) {
	r := testRequest(t)
	c := ThresholdChart(r)
	if got, want := len(c.Series), len(radiative(r.Criteria)); got != want {
		t.Fatalf("ThresholdChart: %d series, want one per radiative criterion (%d)", got, want)
	}
	for _, s := range c.Series {
		if finiteCount(s) == 0 {
			t.Errorf("ThresholdChart: series %q has no finite point", s.Name)
		}
	}
	if !(c.Y.Min < c.Y.Max) || c.X.Min > 1 || c.X.Max < 4 {
		t.Errorf("ThresholdChart axes: x [%g, %g], y [%g, %g]; want χ over at least 10…10⁴ and a y range", c.X.Min, c.X.Max, c.Y.Min, c.Y.Max)
	}
	// Compare mode adds A's curves, dashed, and a point at A.
	r.Pin = &Inputs{Params: r.Params, Cooling: r.Cooling}
	c = ThresholdChart(r)
	dashed := 0
	for _, s := range c.Series {
		if s.Dashed {
			dashed++
		}
	}
	if dashed != len(radiative(r.Criteria)) || c.Markers[len(c.Markers)-1].Label != "A" {
		t.Errorf("ThresholdChart with a pin: %d dashed series and last marker %+v", dashed, c.Markers[len(c.Markers)-1])
	}
	// Family mode: four Mach numbers of the selected criterion.
	r.Pin, r.Family = nil, true
	c = ThresholdChart(r)
	if len(c.Series) != 4 || !strings.Contains(c.Title, "four Mach numbers") {
		t.Errorf("ThresholdChart in family mode: %d series, title %q", len(c.Series), c.Title)
	}
}

func TestBuildersToleratePoorRequests(t *testing.T) {
	// Out-of-range selections and no criteria give charts, not panics.
	r := testRequest(t)
	r.Family, r.Selected = true, 99
	if c := ThresholdChart(r); len(c.Series) != 4 {
		t.Errorf("ThresholdChart with Selected out of range: %d series, want 4 (the first criterion's family)", len(c.Series))
	}
	r.Criteria = nil
	for name, c := range map[string]*LineChart{"threshold": ThresholdChart(r), "ratios": RatioChart(r)} {
		if c == nil {
			t.Errorf("%s chart without criteria is nil", name)
		}
	}
	if m := Regime(r); m.Total != 0 || len(m.Counts) != m.NX*m.NY {
		t.Errorf("Regime without criteria: total %d, %d counts for %d×%d", m.Total, len(m.Counts), m.NX, m.NY)
	}
	if mass, vel := EvolutionCharts(r); len(mass.Series) != 0 || len(vel.Series) != 0 {
		t.Errorf("EvolutionCharts without criteria drew %d and %d series", len(mass.Series), len(vel.Series))
	}
}

func TestRegime(t *testing.T) {
	r := testRequest(t)
	for _, tc := range []struct{ cols, rows, nx, ny int }{{60, 20, 60, 20}, {0, 0, 10, 5}, {1000, 1000, 200, 100}} {
		r.Cols, r.Rows = tc.cols, tc.rows
		m := Regime(r)
		if m.NX != tc.nx || m.NY != tc.ny || len(m.Counts) != m.NX*m.NY {
			t.Errorf("Regime(%d×%d cells available) = %d×%d with %d counts, want %d×%d", tc.cols, tc.rows, m.NX, m.NY, len(m.Counts), tc.nx, tc.ny)
		}
		for _, n := range m.Counts {
			if n > m.Total {
				t.Fatalf("Regime: a count %d above the total %d", n, m.Total)
			}
		}
	}
	// More criteria survive at larger clouds: the top row counts at least
	// as many as the bottom row in every column (r_crit does not depend
	// on r_cl; derived).
	r.Cols, r.Rows = 40, 20
	m := Regime(r)
	for i := range m.NX {
		if lo, hi := m.Counts[i], m.Counts[(m.NY-1)*m.NX+i]; lo >= 0 && hi < lo {
			t.Errorf("Regime column %d: %d survive at the smallest r_cl, %d at the largest", i, lo, hi)
		}
	}
	r.MapMach = true
	if m := Regime(r); m.Y.Label != "Mach" || m.Mark == nil {
		t.Errorf("Regime in Mach mode: y axis %q, mark %v", m.Y.Label, m.Mark)
	}
}

func TestCoolingAndRatioCharts(t *testing.T) {
	r := testRequest(t)
	c := CoolingChart(r)
	if len(c.Series) != 1 || finiteCount(c.Series[0]) == 0 {
		t.Fatalf("CoolingChart: %d series", len(c.Series))
	}
	labels := map[string]bool{}
	for _, m := range c.Markers {
		labels[m.Label] = true
	}
	for _, want := range []string{"T_cl", "T_mix", "T_hot"} {
		if !labels[want] {
			t.Errorf("CoolingChart lacks the marker %s: %v", want, c.Markers)
		}
	}
	rc := RatioChart(r)
	if len(rc.Series) != 7 || rc.Markers[1].Kind != HLine || rc.Markers[1].Y != 0 {
		t.Errorf("RatioChart: %d series (want 7), markers %v (want the line 1)", len(rc.Series), rc.Markers)
	}
}

func BenchmarkRegime200x100(b *testing.B) {
	r := testRequest(b)
	r.Cols, r.Rows = 200, 100
	for b.Loop() {
		if m := Regime(r); m.NX != 200 || m.NY != 100 {
			b.Fatal("wrong map size")
		}
	}
}

// BenchmarkRegimeMach200x100 is the χ × Mach map.
func BenchmarkRegimeMach200x100(b *testing.B) {
	r := testRequest(b)
	r.Cols, r.Rows, r.MapMach = 200, 100, true
	for b.Loop() {
		Regime(r)
	}
}

// BenchmarkThresholdFamily computes the threshold chart with a family of
// four Mach numbers.
func BenchmarkThresholdFamily(b *testing.B) {
	r := testRequest(b)
	r.Family = true
	for b.Loop() {
		ThresholdChart(r)
	}
}

// BenchmarkEvolution computes the evolution charts: one trajectory per
// criterion to 100 t_cc.
func BenchmarkEvolution(b *testing.B) {
	r := testRequest(b)
	for b.Loop() {
		EvolutionCharts(r)
	}
}
