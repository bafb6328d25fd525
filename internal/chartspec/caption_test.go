package chartspec

import (
	"math"
	"strings"
	"testing"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// TestCaptions requires every builder to caption its chart with the
// scenario: each input's value as the formatter writes it, and the cooling
// function's name.
func TestCaptions(t *testing.T) {
	r := testRequest(t)
	r.CoolingName = "my cooling"
	mass, vel := EvolutionCharts(r)
	captions := map[string]string{
		"threshold": ThresholdChart(r).Caption, "cooling": CoolingChart(r).Caption, "ratios": RatioChart(r).Caption,
		"regime": Regime(r).Caption, "mass": mass.Caption, "velocity": vel.Caption,
	}
	want := []string{"χ = " + quantity.FormatSig(r.Params.Chi, 3), "M = " + quantity.FormatSig(r.Params.Mach, 3),
		"P/k_B = " + quantity.Format(model.DimPressure, float64(r.Params.Pressure)),
		"T_cl = " + quantity.Format(model.DimTemperature, float64(r.Params.TCloud)),
		"Z = " + quantity.Format(model.DimMetallicity, r.Params.Metallicity), "cooling: my cooling"}
	for name, c := range captions {
		for _, w := range want {
			if !strings.Contains(c, w) {
				t.Errorf("%s chart caption %q lacks %q", name, c, w)
			}
		}
	}
	r.CoolingName = ""
	if c := Caption(r); !strings.Contains(c, "cooling: built-in, Z = 1 Z☉ (CIE") {
		t.Errorf("Caption without a cooling name = %q, want the table's name", c)
	}
}

// TestCoolingChartNoFloor: with no cooling floor (model.NoFloor) the chart
// has a finite temperature range and no T_floor marker, and says so.
func TestCoolingChartNoFloor(t *testing.T) {
	r := testRequest(t)
	r.Params.TFloor = model.NoFloor
	c := CoolingChart(r)
	if math.IsNaN(c.X.Min) || math.IsInf(c.X.Min, 0) || !(c.X.Min < c.X.Max) {
		t.Fatalf("CoolingChart without a floor: x range [%g, %g]", c.X.Min, c.X.Max)
	}
	for _, m := range c.Markers {
		if m.Label == "T_floor" {
			t.Errorf("CoolingChart without a floor marks T_floor at %g", m.X)
		}
	}
	if !strings.Contains(c.Note, "no cooling floor") {
		t.Errorf("CoolingChart without a floor: note %q", c.Note)
	}
	r.Params.TFloor = r.Params.TCloud / 4
	found := false
	for _, m := range CoolingChart(r).Markers {
		found = found || m.Label == "T_floor"
	}
	if !found {
		t.Error("CoolingChart with a floor below T_cl does not mark it")
	}
}
