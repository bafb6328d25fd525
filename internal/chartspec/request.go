package chartspec

import (
	"fmt"
	"math"
	"strings"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// A Request is everything a chart builder reads. The builders only read
// it, so a copy can be handed to another goroutine.
type Request struct {
	Params   model.Params          // the inputs (validated; zero optional fields mean their defaults)
	Cooling  model.CoolingFunction // Λ(T) at Params.Metallicity
	Criteria []model.Criterion
	Pin      *Inputs // scenario A of a comparison, drawn dashed; nil for none
	Family   bool    // ThresholdChart: the Selected criterion at four Mach numbers
	MapMach  bool    // Regime: χ × Mach at the current r_cl instead of χ × r_cl
	Selected int     // the criterion of the family (an index into Criteria)
	Cols     int     // cells available across: the regime map's resolution (clamped to 10…200)
	Rows     int     // cells available down (clamped to 5…100)

	CoolingName string // the cooling function's name for captions; "" names it from Cooling

	Runs     []model.SimRun // simulation outcomes to place on the threshold chart and the regime map; nil for none
	RunsName string         // where they come from, for the legends

	// The outflow view (NewOutflow): the wind, with T_cl, Z and the
	// conventions of Params, and the cloud carried through it.
	Wind   *model.WindParams // the outflow; nil for none
	Launch model.Length      // launch radius r_0 of the carried cloud; 0 means the injection radius R
	Carry  bool              // NewOutflow carries a cloud for every criterion (CarriedCharts)
}

// Caption describes the scenario of r in one line, for the caption of an
// exported figure: χ, M, P/k_B, T_cl, r_cl, Z and the cooling function.
// The labels use the notation of the chart texts (see LineChart).
func Caption(r Request) string {
	p := r.Params
	parts := []string{
		"χ = " + quantity.FormatSig(p.Chi, 3),
		"M = " + quantity.FormatSig(p.Mach, 3),
		"P/k_B = " + quantity.Format(model.DimPressure, float64(p.Pressure)),
		"T_cl = " + quantity.Format(model.DimTemperature, float64(p.TCloud)),
		"r_cl = " + quantity.Format(model.DimLength, float64(p.RCloud)),
		"Z = " + quantity.Format(model.DimMetallicity, p.Metallicity),
		"cooling: " + coolingName(r),
	}
	return strings.Join(parts, ", ")
}

// coolingName names r's cooling function: r.CoolingName, else a table's
// name, else the analytic form.
func coolingName(r Request) string {
	if r.CoolingName != "" {
		return quantity.Sanitize(r.CoolingName)
	}
	switch cf := r.Cooling.(type) {
	case nil:
		return "none"
	case *cooling.PowerLaw:
		return quantity.Sanitize(cf.Meta().Name)
	case fmt.Stringer:
		return quantity.Sanitize(cf.String())
	}
	return "analytic"
}

// Inputs are the inputs of one scenario: what a comparison pins.
type Inputs struct {
	Params  model.Params
	Cooling model.CoolingFunction
}

// chiRange is the χ axis of the threshold chart and the regime map, in
// log10: 10 to 10⁴, widened to hold the current χ.
func chiRange(chi float64) (lo, hi float64) {
	lo, hi = 1, 4
	c := math.Log10(chi)
	return min(lo, c-0.5), max(hi, c+0.5)
}

// runMarks places runs on a chart: x = log10 χ, y = y(run) (log10 r_cl
// in pc, or log10 Mach). Runs whose coordinates are not finite are left
// out.
func runMarks(runs []model.SimRun, y func(p *model.Params) float64) []RunMark {
	var out []RunMark
	for i := range runs {
		r := &runs[i]
		m := RunMark{X: math.Log10(r.Params.Chi), Y: y(&r.Params), Outcome: r.Outcome, Label: quantity.Sanitize(r.Label)}
		if finite(m.X) && finite(m.Y) {
			out = append(out, m)
		}
	}
	return out
}

// finite reports whether v is neither NaN nor ±Inf.
func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// radiative returns the indices of the criteria that have a threshold.
func radiative(cs []model.Criterion) []int {
	var out []int
	for i := range cs {
		if cs[i].Cool != model.CoolNone {
			out = append(out, i)
		}
	}
	return out
}

// logPc returns log10 of a length in pc, NaN when it is not finite.
func logPc(r model.Length) float64 {
	v := float64(r / model.Parsec)
	if !(v > 0) || math.IsInf(v, 0) {
		return math.NaN()
	}
	return math.Log10(v)
}

// seriesRange returns a padded y range over every finite point and extra.
func seriesRange(ss []Series, extra ...float64) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	see := func(v float64) {
		if !math.IsNaN(v) && !math.IsInf(v, 0) {
			lo, hi = min(lo, v), max(hi, v)
		}
	}
	for _, s := range ss {
		for _, v := range s.Y {
			see(v)
		}
	}
	for _, v := range extra {
		see(v)
	}
	if math.IsInf(lo, 1) {
		return 0, 1
	}
	if hi-lo < 0.5 {
		mid := (hi + lo) / 2
		lo, hi = mid-0.25, mid+0.25
	}
	pad := 0.05 * (hi - lo)
	return lo - pad, hi + pad
}

// grid returns n points evenly spaced from lo to hi.
func grid(lo, hi float64, n int) []float64 {
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = lo + (hi-lo)*float64(i)/float64(n-1)
	}
	return xs
}
