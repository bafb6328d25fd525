package cooling

import (
	"math"
	"testing"

	"cloudwind/model"
)

// TestFreeFreePrefactor checks C_ff computed from the CODATA 2018 constants
// against 1.42556e-27 (derived; 1e-4) and Rybicki & Lightman's "1.4e-27"
// (FROM MEMORY; 2%).
func TestFreeFreePrefactor(t *testing.T) {
	got := FreeFreePrefactor()
	if !biWithin(got, 1.42556e-27, 1e-4) {
		t.Errorf("FreeFreePrefactor() = %.6g, want 1.42556e-27 ± 1e-4 (derived from CODATA 2018)", got)
	}
	if !biWithin(got, 1.4e-27, 0.02) {
		t.Errorf("FreeFreePrefactor() = %.6g, want 1.4e-27 ± 2%% (Rybicki & Lightman 1979, from memory)", got)
	}
	// e in esu from CODATA 2018 (e = 1.602176634e-19 C exact, c exact):
	// 4.803204712570263e-10 statC (derived).
	if !biWithin(elementaryChargeESU, 4.803204712570263e-10, 1e-15) {
		t.Errorf("elementaryChargeESU = %.16g, want 4.803204712570263e-10 (CODATA 2018, derived)", elementaryChargeESU)
	}
}

// TestFreeFree checks the fully ionised H+He bremsstrahlung per n_H²
// against values derived from C_ff and the weights, and its scalings
// (derived).
func TestFreeFree(t *testing.T) {
	for _, tc := range []struct {
		t, y, g, want, tol float64
	}{
		{1e8, 0.0833, 1.2, 2.661e-23, 1e-3}, // derived
		{1e8, 0.0787, 1.2, 2.603e-23, 1e-3}, // derived
		{1e8, 0, 1.0, 1.4256e-23, 1e-4},     // derived: C_ff T^{1/2} at 10^8 K
		{1e8, 0, 1.2, 1.711e-23, 1e-3},      // derived: with ḡ = 1.2
	} {
		if got := float64(FreeFree(model.Temperature(tc.t), tc.y, tc.g)); !biWithin(got, tc.want, tc.tol) {
			t.Errorf("FreeFree(%g, %g, %g) = %.5g, want %.4g ± %g (derived)", tc.t, tc.y, tc.g, got, tc.want, tc.tol)
		}
	}
	// Λ ∝ T^{1/2} ḡ, and the weight (1 + 4y)(1 + 2y) (derived).
	base := float64(FreeFree(1e6, 0.1, 1.3))
	if got := float64(FreeFree(4e6, 0.1, 1.3)); !biWithin(got, 2*base, 1e-14) {
		t.Errorf("FreeFree(4e6, 0.1, 1.3) = %g, want 2 × FreeFree(1e6, 0.1, 1.3) = %g", got, 2*base)
	}
	if got, want := float64(FreeFree(1e6, 0.1, 1.3)), float64(FreeFree(1e6, 0, 1.3))*1.4*1.2; !biWithin(got, want, 1e-14) {
		t.Errorf("FreeFree(1e6, 0.1, 1.3) = %g, want (1.4)(1.2) × FreeFree(1e6, 0, 1.3) = %g", got, want)
	}
	// Special cases.
	if got := FreeFree(0, 0.1, 1.2); got != 0 {
		t.Errorf("FreeFree(0, 0.1, 1.2) = %g, want 0", float64(got))
	}
	if got := FreeFree(-1, 0.1, 1.2); got != 0 {
		t.Errorf("FreeFree(-1, 0.1, 1.2) = %g, want 0", float64(got))
	}
	for _, tc := range [][2]float64{{math.NaN(), 0.1}, {1e6, -0.1}, {1e6, math.NaN()}} {
		if got := FreeFree(model.Temperature(tc[0]), tc[1], 1.2); !math.IsNaN(float64(got)) {
			t.Errorf("FreeFree(%g, %g, 1.2) = %g, want NaN", tc[0], tc[1], float64(got))
		}
	}
	// The primordial solver's free-free term is the same physics with
	// KWH96's rounded coefficient 1.42e-27 and Gaunt factor, weighted by
	// the actual ionisation (derived): C T^{1/2} ḡ (x_H+ + y x_He+ + 4y x_He++) n_e/n_H.
	const y = 0.0833
	ion, c := PrimordialCIE(1e8, y, PrimordialOptions{})
	want := 1.42e-27 * 1e4 * GauntKWH96(1e8) * (ion.XHp + y*(ion.XHep+4*ion.XHepp)) * ion.NeOverNH
	if got := float64(c.FreeFree); !biWithin(got, want, 1e-12) {
		t.Errorf("PrimordialCIE(1e8, %g).FreeFree = %.8g, want %.8g (derived)", y, got, want)
	}
	// Fully ionised, it is FreeFree scaled by 1.42e-27/C_ff (derived; 1e-4
	// for the residual neutral and He+ fractions at 10^8 K).
	if got, want := float64(c.FreeFree), float64(FreeFree(1e8, y, GauntKWH96(1e8)))*1.42e-27/FreeFreePrefactor(); !biWithin(got, want, 1e-4) {
		t.Errorf("PrimordialCIE(1e8, %g).FreeFree = %.6g, want %.6g (derived)", y, got, want)
	}
}

// TestGauntKWH96 checks ḡ_ff = 1.1 + 0.34 exp(−(5.5 − log10 T)²/3)
// (KWH96, via public code) at its peak and in its limits.
func TestGauntKWH96(t *testing.T) {
	for _, tc := range []struct{ t, want float64 }{
		{math.Pow(10, 5.5), 1.44},              // peak: 1.1 + 0.34
		{1e4, 1.1 + 0.34*math.Exp(-1.5*1.5/3)}, // derived
		{1e8, 1.1 + 0.34*math.Exp(-2.5*2.5/3)}, // derived
		{0, 1.1},                               // special case
	} {
		if got := GauntKWH96(model.Temperature(tc.t)); !biWithin(got, tc.want, 1e-14) {
			t.Errorf("GauntKWH96(%g) = %.15g, want %.15g", tc.t, got, tc.want)
		}
	}
	if got := GauntKWH96(model.Temperature(math.NaN())); !math.IsNaN(got) {
		t.Errorf("GauntKWH96(NaN) = %g, want NaN", got)
	}
}
