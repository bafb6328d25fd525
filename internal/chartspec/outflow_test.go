package chartspec

import (
	"errors"
	"math"
	"strings"
	"testing"

	"cloudwind/internal/report"
	"cloudwind/model"
)

// outflowRequest is testRequest with the fiducial outflow of
// model.FiducialWind (SFR = 10 M☉ yr⁻¹, α = β = 1, R = 300 pc; cloudwind's
// choice) and its cloud's r_cl of 10 pc (inputs of this test, no source).
func outflowRequest(t testing.TB) Request {
	t.Helper()
	r := testRequest(t)
	fw := model.FiducialWind()
	r.Wind = &fw
	return r
}

// markerLabels returns the labels of c's markers.
func markerLabels(c *LineChart) map[string]Marker {
	out := map[string]Marker{}
	for _, m := range c.Markers {
		out[m.Label] = m
	}
	return out
}

// TestOutflowProfileChart: one curve per radiative criterion along
// 0.1–100 R in r/R, r_crit at each radius that of Profile, the zones
// covering exactly the grid points where the criteria disagree, and the
// launch radius, r_cl and the radius where the wind cools marked.
func TestOutflowProfileChart(t *testing.T) {
	r := outflowRequest(t)
	o, err := NewOutflow(r)
	if err != nil {
		t.Fatal(err)
	}
	c := o.ProfileChart(r)
	if got, want := len(c.Series), len(radiative(r.Criteria)); got != want {
		t.Fatalf("ProfileChart: %d series, want one per radiative criterion (%d)", got, want)
	}
	// The axis: the default grid, 0.1–100 R (model.DefaultProfileMin/Max), in log10 r/R.
	if !near(c.X.Min, -1) || !near(c.X.Max, 2) || !c.X.Log || !c.Y.Log {
		t.Errorf("ProfileChart x axis [%g, %g] log %v, y log %v; want [-1, 2], log–log", c.X.Min, c.X.Max, c.X.Log, c.Y.Log)
	}
	prof := &o.Profile
	for k, s := range c.Series {
		i := s.Index
		for j, row := range prof.Rows {
			want := math.NaN()
			if row.Err == nil {
				want = logPc(row.Outcomes[i].RCrit)
			}
			if got := s.Y[j]; !(got == want || math.IsNaN(got) && math.IsNaN(want)) {
				t.Fatalf("series %d (%s) at r = %g R: %g, want log10 r_crit/pc = %g", k, s.Name, math.Pow(10, s.X[j]), got, want)
			}
		}
	}
	// Every grid point lies in a zone exactly when the criteria disagree there.
	if len(c.Zones) == 0 {
		t.Fatal("ProfileChart: no zone, but the criteria disagree along the fiducial wind (model's outflow profile tests)")
	}
	for j, row := range prof.Rows {
		x, in := c.Series[0].X[j], false
		for _, z := range c.Zones {
			in = in || (x >= z.Lo && x <= z.Hi)
		}
		if want := row.Err == nil && row.Disagree; in != want {
			t.Errorf("grid point %d (r = %g R) in a zone %v, criteria disagree there %v", j, math.Pow(10, x), in, want)
		}
	}
	if len(c.Zones) != len(report.DisagreementSpans(prof)) || c.ZoneName == "" {
		t.Errorf("ProfileChart: %d zones named %q, want one per disagreement span (%d), named", len(c.Zones), c.ZoneName, len(report.DisagreementSpans(prof)))
	}
	m := markerLabels(c)
	if l, ok := m["launch"]; !ok || l.Kind != VLine || !near(l.X, 0) {
		t.Errorf("ProfileChart: launch marker %+v (%v), want a vertical line at r = R (the default launch)", l, ok)
	}
	if rc, ok := m["r_cl"]; !ok || rc.Kind != HLine || !near(rc.Y, 1) {
		t.Errorf("ProfileChart: r_cl marker %+v (%v), want a horizontal line at 10 pc", rc, ok)
	}
	if !prof.Cools {
		t.Fatal("the fiducial wind does not cool on the grid; the test expects it to (measured: beyond 10.4 R)")
	}
	if wc, ok := m["wind cools"]; !ok || !wc.Warn || !near(wc.X, math.Log10(float64(prof.RCool/o.Wind.Params.Radius))) {
		t.Errorf("ProfileChart: wind-cools marker %+v (%v), want a warning line at RCool", wc, ok)
	}
	// χ = 1 lies at 129 R for the fiducial wind (measured), beyond the grid: no marker.
	if _, ok := m["χ = 1"]; ok || o.Wind.RChiOne <= prof.Grid.RMax {
		t.Errorf("ProfileChart: a χ = 1 marker %v with RChiOne = %g R", ok, float64(o.Wind.RChiOne/o.Wind.Params.Radius))
	}
	if !strings.Contains(c.Caption, "SFR = 10 M☉ yr⁻¹") || !strings.Contains(c.Caption, "r_cl = 10 pc") || !strings.Contains(c.Note, "from memory") {
		t.Errorf("ProfileChart caption %q or note %q lacks the injection, the cloud or the status", c.Caption, c.Note)
	}
}

// TestOutflowChiOneMarked: a wind whose χ falls to 1 inside the grid
// marks it (a 10⁵ K cloud in the fiducial wind: T(0) = 1.38e7 K, measured).
func TestOutflowChiOneMarked(t *testing.T) {
	r := outflowRequest(t)
	r.Wind.TCloud, r.Params.TCloud = 1e5, 1e5
	o, err := NewOutflow(r)
	if err != nil {
		t.Fatal(err)
	}
	m := markerLabels(o.ProfileChart(r))
	if c1, ok := m["χ = 1"]; !ok || !c1.Warn || !near(c1.X, math.Log10(float64(o.Wind.RChiOne/o.Wind.Params.Radius))) {
		t.Errorf("χ = 1 marker %+v (%v), want a warning line at RChiOne = %g R", c1, ok, float64(o.Wind.RChiOne/o.Wind.Params.Radius))
	}
}

// TestOutflowInvalidWind: an invalid wind is an error wrapping its
// *model.FieldError, and a request without one an error, not a panic.
func TestOutflowInvalidWind(t *testing.T) {
	r := outflowRequest(t)
	r.Wind.TCloud = 1e8 // above T(0) = 1.38e7 K (measured): the wind is nowhere hotter than the cloud
	var fe *model.FieldError
	if _, err := NewOutflow(r); !errors.As(err, &fe) || fe.Field != model.FieldTCloud {
		t.Errorf("NewOutflow with T_cl above the wind's central temperature: %v, want a FieldError on %s", err, model.FieldTCloud)
	}
	r.Wind = nil
	if o, err := NewOutflow(r); err == nil || o != nil {
		t.Errorf("NewOutflow without a wind = %v, %v; want an error", o, err)
	}
}

// TestOutflowCarriedCharts: a curve per criterion from the launch radius
// to where its run stopped, m/m₀ = 1 and v = 0 at launch (at rest), the
// selected criterion's events marked where Carry located them, and its
// fate and growth rate in the notes.
func TestOutflowCarriedCharts(t *testing.T) {
	r := outflowRequest(t)
	r.Carry = true
	o, err := NewOutflow(r)
	if err != nil {
		t.Fatal(err)
	}
	if len(o.Carried) != len(r.Criteria) {
		t.Fatalf("NewOutflow carried %d clouds, want one per criterion (%d)", len(o.Carried), len(r.Criteria))
	}
	// Select a criterion whose cloud doubles and is destroyed (abruzzo-2023 at 10 pc: measured).
	r.Selected = -1
	for i := range r.Criteria {
		if r.Criteria[i].ID == "abruzzo-2023" {
			r.Selected = i
		}
	}
	if r.Selected < 0 {
		t.Fatal("no abruzzo-2023 among the built-in criteria")
	}
	cc := &o.Carried[r.Selected].Cloud
	if o.Carried[r.Selected].Err != nil || !finite(float64(cc.RDouble)) || !finite(float64(cc.RDestroy)) {
		t.Fatalf("abruzzo-2023's carried 10 pc cloud: %v, doubled at %g, destroyed at %g; the test expects both (measured)", o.Carried[r.Selected].Err, float64(cc.RDouble), float64(cc.RDestroy))
	}
	mass, vel := o.CarriedCharts(r)
	if len(mass.Series) != len(r.Criteria) || len(vel.Series) != len(r.Criteria) {
		t.Fatalf("CarriedCharts: %d and %d series, want %d each", len(mass.Series), len(vel.Series), len(r.Criteria))
	}
	for k, s := range mass.Series {
		v := vel.Series[k]
		run := &o.Carried[s.Index].Cloud
		if !near(s.X[0], 0) || !near(s.Y[0], 0) || v.Y[0] != 0 {
			t.Errorf("%s starts at (%g, %g) with v = %g, want r = R, m = m₀ and v = 0", s.Name, s.X[0], s.Y[0], v.Y[0])
		}
		if end := math.Log10(float64(run.R[len(run.R)-1] / o.Wind.Params.Radius)); !near(s.X[len(s.X)-1], end) {
			t.Errorf("%s ends at log r/R = %g, want where its run stopped (%g)", s.Name, s.X[len(s.X)-1], end)
		}
	}
	m := markerLabels(mass)
	if d, ok := m["doubled"]; !ok || d.Kind != Point || !near(d.X, math.Log10(float64(cc.RDouble/o.Wind.Params.Radius))) || !near(d.Y, math.Log10(2)) {
		t.Errorf("doubled marker %+v (%v), want a point at RDouble, m = 2 m₀", d, ok)
	}
	if d, ok := m["destroyed"]; !ok || !near(d.X, math.Log10(float64(cc.RDestroy/o.Wind.Params.Radius))) || !near(d.Y, -3) {
		t.Errorf("destroyed marker %+v (%v), want a point at RDestroy, m = 10⁻³ m₀", d, ok)
	}
	if !strings.Contains(mass.Note, "destroyed at") || !strings.Contains(vel.Note, "spread") || !strings.Contains(vel.Note, "Gronke & Oh 2020") {
		t.Errorf("CarriedCharts notes: %q, %q; want the fate and the growth-rate measure", mass.Note, vel.Note)
	}
	if v, ok := markerLabels(vel)["v_∞"]; !ok || !near(v.Y, float64(o.Wind.VInf)/1e5) || vel.Y.Max < v.Y {
		t.Errorf("v_∞ marker %+v (%v) in km s⁻¹ with the axis to %g", v, ok, vel.Y.Max)
	}
	// Without carried runs: empty charts that say so.
	r.Carry = false
	o2, err := NewOutflow(r)
	if err != nil {
		t.Fatal(err)
	}
	if mass, _ := o2.CarriedCharts(r); len(mass.Series) != 0 || mass.Note == "" {
		t.Errorf("CarriedCharts without runs: %d series, note %q", len(mass.Series), mass.Note)
	}
}

// TestOutflowTexts: the words of the criteria pane and the details agree
// with the model's results.
func TestOutflowTexts(t *testing.T) {
	r := outflowRequest(t)
	r.Carry = true
	o, err := NewOutflow(r)
	if err != nil {
		t.Fatal(err)
	}
	for i := range r.Criteria {
		c := &r.Criteria[i]
		want := report.SpansText(&o.Profile, report.SurvivalSpans(&o.Profile, i), o.Wind.Params.Radius)
		if c.Cool == model.CoolNone {
			want = "no threshold"
		}
		if got := o.Survives(i); got != want {
			t.Errorf("Survives(%s) = %q, want %q", c.ID, got, want)
		}
		fate := o.Fate(i)
		switch cc := &o.Carried[i].Cloud; cc.Stop {
		case model.StopDestroyed:
			if !strings.HasPrefix(fate, "destroyed at "+o.RText(cc.RDestroy)) {
				t.Errorf("Fate(%s) = %q, want destroyed at %s", c.ID, fate, o.RText(cc.RDestroy))
			}
		case model.StopReached:
			if !strings.HasPrefix(fate, "reached "+o.RText(cc.RStop)) {
				t.Errorf("Fate(%s) = %q, want reached %s", c.ID, fate, o.RText(cc.RStop))
			}
		}
		if g := o.Growth(i); o.Carried[i].Grows != !strings.HasPrefix(g, "does not grow") {
			t.Errorf("Growth(%s) = %q with Grows %v", c.ID, g, o.Carried[i].Grows)
		}
	}
	if o.Fate(-1) != "not carried" || o.Growth(99) != "no growth rate" || o.SpreadText(99) != "—" || o.Events(-1) != "—" {
		t.Error("the texts of an index out of range are not the words for none")
	}
}

// near reports whether a and b agree to 1e-9 (absolute; log10 values).
func near(a, b float64) bool { return math.Abs(a-b) <= 1e-9 }

// BenchmarkOutflowProfile builds the outflow view's profile chart: the
// wind, a 200-radius profile with every built-in criterion (model's
// BenchmarkWindProfile measures the profile alone: ≤ 1 ms is its target)
// and the chart.
func BenchmarkOutflowProfile(b *testing.B) {
	r := outflowRequest(b)
	b.ReportAllocs()
	for b.Loop() {
		o, err := NewOutflow(r)
		if err != nil {
			b.Fatal(err)
		}
		o.ProfileChart(r)
	}
}

// BenchmarkOutflowCarried builds the carried-cloud panels: the profile,
// a cloud carried from R to 100 R for every built-in criterion, and the
// charts sampled at 121 radii.
func BenchmarkOutflowCarried(b *testing.B) {
	r := outflowRequest(b)
	r.Carry = true
	b.ReportAllocs()
	for b.Loop() {
		o, err := NewOutflow(r)
		if err != nil {
			b.Fatal(err)
		}
		o.CarriedCharts(r)
	}
}
