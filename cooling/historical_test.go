package cooling

import (
	"errors"
	"math"
	"testing"

	"cloudwind/model"
)

// TestRosenBregman95Continuity checks that the segments of the Rosen &
// Bregman (1995) fit meet within 0.2% at 10^5 and 4×10^7 K (0.1%
// measured).
func TestRosenBregman95Continuity(t *testing.T) {
	for _, tb := range []float64{2000, 8000, 1e5, 4e7} { // every break; 1e5 and 4e7 K bound the 1.78e-18 segment
		below := float64(RosenBregman95Lambda(model.Temperature(tb * (1 - 1e-12))))
		at := float64(RosenBregman95Lambda(model.Temperature(tb)))
		if !biWithin(below, at, 0.002) {
			t.Errorf("RosenBregman95Lambda just below %g K = %.6g, at it %.6g; want equal within 0.2%% (measured 0.1%%)", tb, below, at)
		}
	}
	if v := RosenBregman95Lambda(299); v != 0 {
		t.Errorf("RosenBregman95Lambda(299) = %g, want 0 below the fit's range", float64(v))
	}
	if v := RosenBregman95Lambda(model.Temperature(math.NaN())); !math.IsNaN(float64(v)) {
		t.Errorf("RosenBregman95Lambda(NaN) = %g, want NaN", float64(v))
	}
	// Segment values (the coefficients of RosenBregman95Lambda, derived).
	for _, tc := range []struct{ t, want float64 }{
		{1000, 2.2380e-32 * 1e6},
		{1e6, 1.7800e-18 * math.Pow(1e6, -0.65)},
		{1e8, 3.2217e-27 * 1e4},
	} {
		if got := float64(RosenBregman95Lambda(model.Temperature(tc.t))); !biWithin(got, tc.want, 1e-14) {
			t.Errorf("RosenBregman95Lambda(%g) = %.8g, want %.8g (Rosen & Bregman 1995 coefficients)", tc.t, got, tc.want)
		}
	}
}

// TestRosenBregman95Curve checks the sampled curve: range, labels, and
// agreement with the formula away from the joints.
func TestRosenBregman95Curve(t *testing.T) {
	p, err := RosenBregman95()
	if err != nil {
		t.Fatal(err)
	}
	m := p.Meta()
	if !m.Historical || m.Normalisation != PerN2 || len(m.Warnings) == 0 {
		t.Errorf("RosenBregman95().Meta() = %+v, want Historical, n2 and a warning about the density factor", m)
	}
	if lo, hi := p.ValidRange(); !biWithin(float64(lo), 300, 1e-12) || !biWithin(float64(hi), 1e9, 1e-12) {
		t.Errorf("RosenBregman95().ValidRange() = %g, %g K, want 300, 1e9 K", float64(lo), float64(hi))
	} else if p.Lambda(300*(1+1e-9)) == 0 {
		t.Errorf("RosenBregman95().Lambda(300 K) = 0, want the fit's value")
	}
	// Power laws between nodes are exact away from the joints (derived);
	// 1e-9 for rounding.
	for _, T := range []float64{500, 5000, 3e4, 1e6, 1e7, 3e8} {
		if got, want := float64(p.Lambda(model.Temperature(T))), float64(RosenBregman95Lambda(model.Temperature(T))); !biWithin(got, want, 1e-9) {
			t.Errorf("RosenBregman95().Lambda(%g) = %.8g, want %.8g", T, got, want)
		}
	}
	// Above the last node the range policy's T^1/2 is the last segment.
	if got, want := float64(p.Lambda(1e10)), float64(RosenBregman95Lambda(1e10)); !biWithin(got, want, 1e-9) {
		t.Errorf("RosenBregman95().Lambda(1e10) = %.8g, want %.8g", got, want)
	}
}

// TestTozziNorman01 checks the fit's value (Tozzi & Norman 2001, via public
// code), its refusal below kT = 0.1 keV, and the sampled curve.
func TestTozziNorman01(t *testing.T) {
	// At kT = 1 keV: (C1 + C2 + C3) × 1e-22 = 1.296e-23 (derived from the constants).
	t1keV := model.Temperature(kiloElectronVolt / model.Boltzmann)
	if got, err := TozziNorman01Lambda(t1keV); err != nil || !biWithin(float64(got), 1.296e-23, 1e-12) {
		t.Errorf("TozziNorman01Lambda(%g K = 1 keV) = %g, %v; want 1.296e-23, nil (derived from the Tozzi & Norman 2001 constants)", float64(t1keV), float64(got), err)
	}
	// The public variant "0.63 + 0.58 sqrt(T) + 0.086 T^-1.7" in 1e-23,
	// T in keV (public code, secondary), at 4 keV: 0.63 + 1.16 + 0.086 × 4^-1.7.
	want := (0.63 + 0.58*2 + 0.086*math.Pow(4, -1.7)) * 1e-23
	if got, err := TozziNorman01Lambda(4 * t1keV); err != nil || !biWithin(float64(got), want, 1e-12) {
		t.Errorf("TozziNorman01Lambda(4 keV) = %g, %v; want %g (the public variant of Tozzi & Norman 2001)", float64(got), err, want)
	}
	t01 := 0.1 * t1keV // 0.1 keV = 1.16045e6 K
	for _, T := range []model.Temperature{t01 * (1 - 1e-9), 1e6, 1e4, 0, -1, model.Temperature(math.NaN())} {
		if v, err := TozziNorman01Lambda(T); !errors.Is(err, ErrBelowValidity) {
			t.Errorf("TozziNorman01Lambda(%g K) = %g, %v; want ErrBelowValidity below 0.1 keV", float64(T), float64(v), err)
		}
	}
	if _, err := TozziNorman01Lambda(t01 * (1 + 1e-9)); err != nil {
		t.Errorf("TozziNorman01Lambda(%g K, just above 0.1 keV) error %v, want nil", float64(t01), err)
	}
	p, err := TozziNorman01()
	if err != nil {
		t.Fatal(err)
	}
	lo, hi := p.ValidRange()
	if lo < t01 || !biWithin(float64(lo), float64(t01), 1e-9) || !biWithin(float64(hi), math.Pow(10, 8.5), 1e-12) {
		t.Errorf("TozziNorman01().ValidRange() = %g, %g K; want 0.1 keV = %g K, 10^8.5 K", float64(lo), float64(hi), float64(t01))
	}
	if s := p.Classify(1e6); s != BelowTable || p.Lambda(1e6) != 0 {
		t.Errorf("TozziNorman01() at 1e6 K: %v, Λ = %g; want below table, 0", s, float64(p.Lambda(1e6)))
	}
	// Converted to n_H² with n_e/n_H = 1 + 2y when fully ionised (derived;
	// 1e-3 for interpolation and the residual neutral fraction).
	l7, err := TozziNorman01Lambda(1e7)
	if err != nil {
		t.Fatalf("TozziNorman01Lambda(1e7) error: %v", err)
	}
	if got, want := float64(p.Lambda(1e7)), (1+2*BuiltinHeliumRatio)*float64(l7); !biWithin(got, want, 1e-3) {
		t.Errorf("TozziNorman01().Lambda(1e7) = %.5g, want (1+2y) × %.5g = %.5g", got, float64(l7), want)
	}
	if m := p.Meta(); !m.Historical || m.Normalisation != PerNeNH || m.Metallicity != 0.3 {
		t.Errorf("TozziNorman01().Meta() = %+v, want Historical, nenH, Z 0.3", m)
	}
}
