package cooling

import (
	"errors"
	"math"
	"testing"

	"cloudwind/model"
	"gonum.org/v1/gonum/floats/scalar"
)

// testCurve has uneven nodes with a peak, so that both the uniform and the
// binary-search paths are exercised (synthetic; no physical source).
func testCurve(t *testing.T, uniform bool) *PowerLaw {
	t.Helper()
	xs := []float64{4, 4.3, 4.9, 5.35, 6, 7.2, 8}
	ys := []float64{-23.5, -21.6, -21.4, -21.2, -21.9, -22.6, -22.5}
	if uniform {
		xs = []float64{4, 4.5, 5, 5.5, 6, 6.5, 7}
	}
	p, err := NewPowerLaw(xs, ys, Meta{Name: "test"})
	if err != nil {
		t.Fatal(err)
	}
	return p
}

func TestPowerLawNodes(t *testing.T) {
	for _, uniform := range []bool{false, true} {
		p := testCurve(t, uniform)
		xs, ys := p.Nodes()
		for i := range xs {
			got := math.Log10(float64(p.Lambda(model.Temperature(math.Pow(10, xs[i])))))
			// Exact at nodes (format rule: the canonical form passes through its nodes).
			if !scalar.EqualWithinAbs(got, ys[i], 1e-12) {
				t.Errorf("uniform=%v: log Λ at node %d (log T = %g) = %.15g, want %.15g", uniform, i, xs[i], got, ys[i])
			}
			if i == 0 {
				continue
			}
			// Linear in log–log between nodes (definition of the canonical form).
			for _, w := range []float64{0.1, 0.5, 0.93} {
				x := xs[i-1] + w*(xs[i]-xs[i-1])
				want := ys[i-1] + w*(ys[i]-ys[i-1])
				got := math.Log10(float64(p.Lambda(model.Temperature(math.Pow(10, x)))))
				if !scalar.EqualWithinAbs(got, want, 1e-12) {
					t.Errorf("uniform=%v: log Λ(10^%g) = %.15g, want %.15g (linear between nodes)", uniform, x, got, want)
				}
			}
		}
	}
}

func TestPowerLawRangePolicy(t *testing.T) {
	p := testCurve(t, false)
	// Below the first node: Λ = 0 (the range policy).
	for _, temp := range []model.Temperature{9999, 1, 0, -5, model.Temperature(math.NaN())} {
		if l := p.Lambda(temp); l != 0 {
			t.Errorf("Lambda(%g) = %g below the table, want 0", float64(temp), float64(l))
		}
	}
	if c := p.Classify(5e3); c != BelowTable {
		t.Errorf("Classify(5e3) = %v, want below table", c)
	}
	// Above the last node: Λ ∝ T^{1/2} from the last node (the range policy).
	top := p.Lambda(1e8)
	for _, k := range []float64{2, 10, 1e3} {
		got := float64(p.Lambda(model.Temperature(1e8 * k)))
		if !scalar.EqualWithinRel(got, float64(top)*math.Sqrt(k), 1e-12) {
			t.Errorf("Lambda(%g) = %g, want %g (T^1/2 extension)", 1e8*k, got, float64(top)*math.Sqrt(k))
		}
	}
	if c := p.Classify(2e8); c != AboveTable {
		t.Errorf("Classify(2e8) = %v, want above table", c)
	}
	if c := p.Classify(1e5); c != InTable {
		t.Errorf("Classify(1e5) = %v, want in table", c)
	}
	lo, hi := p.ValidRange()
	if !scalar.EqualWithinRel(float64(lo), 1e4, 1e-12) || !scalar.EqualWithinRel(float64(hi), 1e8, 1e-12) {
		t.Errorf("ValidRange() = %g, %g; want 1e4, 1e8", float64(lo), float64(hi))
	}
}

func TestNewPowerLawRejects(t *testing.T) {
	cases := []struct {
		xs, ys []float64
		want   error
	}{
		{[]float64{4}, []float64{-22}, ErrTooFewNodes},
		{[]float64{4, 4}, []float64{-22, -21}, ErrNotIncreasing},
		{[]float64{5, 4}, []float64{-22, -21}, ErrNotIncreasing},
		{[]float64{4, math.NaN()}, []float64{-22, -21}, ErrNotFinite},
		{[]float64{4, 5}, []float64{math.Inf(-1), -21}, ErrNotFinite},
	}
	for _, c := range cases {
		if _, err := NewPowerLaw(c.xs, c.ys, Meta{}); !errors.Is(err, c.want) {
			t.Errorf("NewPowerLaw(%v, %v) error = %v, want %v", c.xs, c.ys, err, c.want)
		}
	}
}

// TestPowerLawInModel checks that the canonical form plugs into model and
// that model's exact minimum search uses its nodes.
func TestPowerLawInModel(t *testing.T) {
	p := testCurve(t, false)
	var cf model.CoolingFunction = p
	if _, ok := cf.(model.PiecewisePowerLaw); !ok {
		t.Fatal("*PowerLaw is not a model.PiecewisePowerLaw")
	}
	if _, ok := cf.(model.RangedCooling); !ok {
		t.Fatal("*PowerLaw is not a model.RangedCooling")
	}
	s, err := model.Derive(model.Fiducial(), p)
	if err != nil {
		t.Fatal(err)
	}
	// t_cool ∝ T²/Λ along the isobar (derived: n ∝ 1/T at fixed P): the
	// node search must find the minimum a fine brute-force scan finds.
	best, bestT := math.Inf(1), 0.0
	for lt := 4.0; lt <= 6.0; lt += 1e-4 {
		if v := 2*lt - math.Log10(float64(p.Lambda(model.Temperature(math.Pow(10, lt))))); v < best {
			best, bestT = v, lt
		}
	}
	if got := math.Log10(float64(s.TMinMix)); math.Abs(got-bestT) > 2e-4 {
		t.Errorf("TMinMix = 10^%.4f K, brute force 10^%.4f K", got, bestT)
	}
}
