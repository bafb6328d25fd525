package cooling

import (
	"math"
	"testing"

	"cloudwind/model"
)

// biLambdaHHe returns the primordial Λ per n_H² as a float64.
func biLambdaHHe(t model.Temperature, y float64, opt PrimordialOptions) float64 {
	_, c := PrimordialCIE(t, y, opt)
	return float64(c.Total())
}

// biExtremum finds the maximum (sign = +1) or minimum (sign = −1) of
// Λ_H+He(T) for log10 T in [a, b] by golden-section search (Kiefer 1953);
// the bracket must hold a single extremum. It returns T and Λ there.
func biExtremum(a, b, y float64, opt PrimordialOptions, sign float64) (model.Temperature, float64) {
	g := func(x float64) float64 { return -sign * biLambdaHHe(biAt10(x), y, opt) }
	const r = 0.6180339887498949 // (√5 − 1)/2
	c, d := b-r*(b-a), a+r*(b-a)
	gc, gd := g(c), g(d)
	for b-a > 1e-9 {
		if gc < gd {
			b, d, gd = d, c, gc
			c = b - r*(b-a)
			gc = g(c)
		} else {
			a, c, gc = c, d, gd
			d = a + r*(b-a)
			gd = g(d)
		}
	}
	x := (a + b) / 2
	return biAt10(x), biLambdaHHe(biAt10(x), y, opt)
}

// biRoundsTo reports whether got agrees with want, quoted to sig significant
// figures, to within half a unit in the last quoted digit.
func biRoundsTo(got, want float64, sig int) bool {
	half := 0.5 * math.Pow(10, math.Floor(math.Log10(math.Abs(want)))-float64(sig-1))
	return math.Abs(got-want) <= half*(1+1e-9)
}

// biWithin reports whether got is within rel of want.
func biWithin(got, want, rel float64) bool { return math.Abs(got-want) <= rel*math.Abs(want) }

var biKWH96 = KWH96Options()

// TestPrimordialKWH96Prototype checks the plain KWH96 solver against the
// numbers a Python prototype of the same rates produced (measured, not
// published; a Go implementation of the same rates should reproduce them to
// rounding). Tolerances: half a unit in the last quoted digit.
func TestPrimordialKWH96Prototype(t *testing.T) {
	// Values at fixed temperatures (prototype, 3 significant figures).
	for _, tc := range []struct {
		t, y, want float64
	}{
		{1e6, 0.0787, 5.66e-24}, // prototype Λ(10^6 K)
		{1e6, 0.064, 5.22e-24},  // prototype
		{1e7, 0.0787, 9.76e-24}, // prototype Λ(10^7 K)
		{1e7, 0.064, 9.09e-24},  // prototype
		{1e8, 0.0787, 2.52e-23}, // prototype Λ(10^8 K)
		{1e8, 0.064, 2.35e-23},  // prototype
	} {
		got := biLambdaHHe(model.Temperature(tc.t), tc.y, biKWH96)
		if !biRoundsTo(got, tc.want, 3) {
			t.Errorf("PrimordialCIE(%g K, y=%g, KWH96) Λ = %.4g, want %.3g (Python prototype of the same rates, measured)", tc.t, tc.y, got, tc.want)
		}
	}
	// Peaks and the minimum (prototype).
	for _, tc := range []struct {
		name        string
		lo, hi, y   float64 // search bracket in log10 T
		sign        float64
		wantT, tolT float64 // K, absolute
		wantL, tolL float64 // relative tolerance on Λ
	}{
		{"H peak", 4.1, 4.5, 0.0787, 1, 1.92e4, 50, 1.617e-22, 0.0005 / 1.617}, // prototype: 1.617e-22 at 1.92e4 K
		{"H peak", 4.1, 4.5, 0.064, 1, 1.92e4, 50, 1.617e-22, 0.0005 / 1.617},  // prototype: "same for any y"
		{"He+ peak", 4.8, 5.1, 0.0787, 1, 8.56e4, 50, 6.26e-23, 0.005 / 6.26},  // prototype: 6.26e-23 at 8.56e4 K
		{"He+ peak", 4.8, 5.1, 0.0830, 1, 8.56e4, 500, 6.58e-23, 0.005 / 6.58}, // prototype (position not quoted for this y)
		{"He+ peak", 4.8, 5.1, 0.064, 1, 8.56e4, 500, 5.21e-23, 0.005 / 5.21},  // prototype (position not quoted for this y)
		{"minimum", 5.8, 6.2, 0.0787, -1, 9.7e5, 5e3, 5.66e-24, 0.005 / 5.66},  // prototype: 5.66e-24 at 9.7e5 K
	} {
		T, L := biExtremum(tc.lo, tc.hi, tc.y, biKWH96, tc.sign)
		if math.Abs(float64(T)-tc.wantT) > tc.tolT || !biWithin(L, tc.wantL, tc.tolL) {
			t.Errorf("PrimordialCIE(y=%g, KWH96) %s = %.4g at %.4g K, want %.4g at %.3g K (Python prototype of the same rates, measured)",
				tc.y, tc.name, L, float64(T), tc.wantL, tc.wantT)
		}
	}
	// Composition (prototype, y = 0.0787).
	s, c := PrimordialCIE(1e4, 0.0787, biKWH96)
	if !biRoundsTo(s.XH0, 0.999, 3) || !biRoundsTo(float64(c.Total()), 5.1e-27, 2) {
		t.Errorf("PrimordialCIE(1e4 K, KWH96): x_H0 = %.5f, Λ = %.4g; want 0.999, 5.1e-27 (Python prototype of the same rates, measured)", s.XH0, float64(c.Total()))
	}
	if _, c := PrimordialCIE(1e5, 0.0787, biKWH96); math.Abs(float64(c.ExcitationHep/c.Total())-0.74) > 0.005 {
		t.Errorf("PrimordialCIE(1e5 K, KWH96): He+ excitation share %.4f, want 0.74 (Python prototype of the same rates, measured)", float64(c.ExcitationHep/c.Total()))
	}
	_, c = PrimordialCIE(1e6, 0.0787, biKWH96)
	if ff, rec := float64(c.FreeFree/c.Total()), float64(c.RecombinationHp/c.Total()); math.Abs(ff-0.54) > 0.005 || math.Abs(rec-0.22) > 0.005 {
		t.Errorf("PrimordialCIE(1e6 K, KWH96): free-free share %.4f, H recombination %.4f; want 0.54, 0.22 (Python prototype of the same rates, measured)", ff, rec)
	}
	if _, c := PrimordialCIE(1e8, 0.0787, biKWH96); math.Abs(float64(c.FreeFree/c.Total())-0.98) > 0.005 {
		t.Errorf("PrimordialCIE(1e8 K, KWH96): free-free share %.4f, want 0.98 (Python prototype of the same rates, measured)", float64(c.FreeFree/c.Total()))
	}
	// Slopes d lnΛ/d lnT (prototype: 0.41 over 10^7–10^8 K, 0.48 over 10^8–10^9 K).
	for _, tc := range []struct{ a, b, want float64 }{{7, 8, 0.41}, {8, 9, 0.48}} {
		got := math.Log10(biLambdaHHe(biAt10(tc.b), 0.0787, biKWH96) / biLambdaHHe(biAt10(tc.a), 0.0787, biKWH96))
		if math.Abs(got-tc.want) > 0.005 {
			t.Errorf("PrimordialCIE(KWH96) slope over 10^%g–10^%g K = %.4f, want %.2f (Python prototype of the same rates, measured)", tc.a, tc.b, got, tc.want)
		}
	}
}

// TestPrimordialChecks checks the default (KWH96 + Voronov H) solver
// against Wiersma et al. 2009 (W09, Cloudy 07.02) and Sutherland & Dopita
// 1993 (SD93) mzero, with cloudwind's tolerances, and against the measured
// Voronov-H peak.
func TestPrimordialChecks(t *testing.T) {
	def := PrimordialOptions{}
	// Λ(10^8 K), y = 0.0787, ±10% of W09 2.62e-23 and of SD93 2.40e-23.
	if got := biLambdaHHe(1e8, 0.0787, def); !biWithin(got, 2.62e-23, 0.10) || !biWithin(got, 2.40e-23, 0.10) {
		t.Errorf("PrimordialCIE(1e8 K, y=0.0787) Λ = %.4g, want within 10%% of 2.62e-23 and 2.40e-23 (W09, SD93 mzero)", got)
	}
	// Λ(10^6 K) ±12% of W09 5.24e-24 (y = 0.0787) and of SD93 mzero
	// 5.62e-24 (y ≈ 0.064), each at its own y. The KWH96 He+ excitation
	// (with Cen's factor) meets both; the default meets SD93 (5.578e-24,
	// −0.7%, measured) but not W09: 6.139e-24, 17.2% high (measured), since
	// dropping the factor raises He+ excitation to 12% of Λ at 10^6 K. That
	// miss is reported, not hidden: the default's W09 ratio is pinned to its
	// measured value (±0.001) so that it cannot drift unnoticed.
	for _, opt := range []PrimordialOptions{def, {HepExcitation: HepKWH96}, biKWH96} {
		if got := biLambdaHHe(1e6, 0.064, opt); !biWithin(got, 5.62e-24, 0.12) {
			t.Errorf("PrimordialCIE(1e6 K, y=0.064, %v) Λ = %.4g, want 5.62e-24 ± 12%% (SD93 mzero)", opt, got)
		}
		got := biLambdaHHe(1e6, 0.0787, opt)
		if opt == def {
			if r := got / 5.24e-24; math.Abs(r-1.172) > 0.001 {
				t.Errorf("PrimordialCIE(1e6 K, y=0.0787) Λ = %.4g = %.4f × W09, want the measured 1.172 ± 0.001 (the ±12%% not met)", got, r)
			}
			continue
		}
		if !biWithin(got, 5.24e-24, 0.12) {
			t.Errorf("PrimordialCIE(1e6 K, y=0.0787, %v) Λ = %.4g, want 5.24e-24 ± 12%% (W09)", opt, got)
		}
	}
	// H peak in [1.7e4, 2.1e4] K with Λ in [1.0e-22, 1.7e-22].
	for _, opt := range []PrimordialOptions{def, biKWH96} {
		T, L := biExtremum(4.1, 4.5, 0.0787, opt, 1)
		if T < 1.7e4 || T > 2.1e4 || L < 1.0e-22 || L > 1.7e-22 {
			t.Errorf("PrimordialCIE(%v) H peak %.4g at %.4g K, want [1.0e-22, 1.7e-22] in [1.7e4, 2.1e4] K (W09 1.31e-22 at 1.85e4 K, SD93 1.05e-22 at 1.78e4 K)", opt.HIonisation, L, float64(T))
		}
	}
	// He+ peak in [7.9e4, 9.0e4] K, height ±35% of W09 8.62e-23 (y = 0.0787).
	if T, L := biExtremum(4.8, 5.1, 0.0787, def, 1); T < 7.9e4 || T > 9.0e4 || !biWithin(L, 8.62e-23, 0.35) {
		t.Errorf("PrimordialCIE He+ peak %.4g at %.4g K, want 8.62e-23 ± 35%% in [7.9e4, 9.0e4] K (W09)", L, float64(T))
	}
	// Slope over 10^7.5–10^8.5 K = 0.45 ± 0.05 (the built-in nodes
	// end at 10^8 K, so the solver is evaluated directly).
	for _, y := range []float64{0.0787, BuiltinHeliumRatio} {
		got := math.Log10(biLambdaHHe(biAt10(8.5), y, def) / biLambdaHHe(biAt10(7.5), y, def))
		if math.Abs(got-0.45) > 0.05 {
			t.Errorf("PrimordialCIE(y=%g) slope over 10^7.5–10^8.5 K = %.4f, want 0.45 ± 0.05 (prototype 0.41–0.48)", y, got)
		}
	}
	// With Voronov the prototype's H peak is 1.313e-22 at 1.85e4 K. That
	// prototype kept KWH96's H ionisation-cooling term; replacing it by
	// 13.6 eV × the Voronov rate (derived: KWH96's term is 13.6 eV × its
	// rate), raises the peak by 1.0% (measured), hence 1.5%.
	if T, L := biExtremum(4.1, 4.5, 0.0787, def, 1); math.Abs(float64(T)-1.85e4) > 50 || !biWithin(L, 1.313e-22, 0.015) {
		t.Errorf("PrimordialCIE Voronov H peak %.4g at %.4g K, want 1.313e-22 ± 1.5%% at 1.85e4 K (prototype, measured)", L, float64(T))
	}
}

// gfHelium are rows of Gnat & Ferland (2012, ApJS 199, 20) Table 1B,
// helium, from a public copy of the table (SECONDARY for the copy;
// three significant figures): T, the He+ cooling efficiency per n_e n_He+,
// and the CIE cooling per n_e n_He (erg cm³ s⁻¹).
var gfHelium = []struct{ t, hep, cie float64 }{
	{6.08e4, 2.84e-22, 2.85e-22},
	{7.09e4, 8.18e-22, 6.09e-22},
	{7.86e4, 1.52e-21, 7.69e-22},
	{8.70e4, 2.66e-21, 7.77e-22},
	{1.02e5, 5.60e-21, 6.12e-22},
	{1.24e5, 1.28e-20, 3.86e-22},
	{1.69e5, 3.38e-20, 1.96e-22},
}

// gfRowTolerance returns the relative uncertainty that rounding to three
// figures puts on a comparison with a row (derived): half a unit in the
// last digit of the efficiency, plus that of T times the sensitivity
// d ln k/d ln T = 473638/T − 0.397 of the excitation coefficient.
func gfRowTolerance(T, eff float64) float64 {
	half := func(v float64) float64 { return 0.5 * math.Pow(10, math.Floor(math.Log10(v))-2) / v }
	return half(eff) + half(T)*math.Abs(473638/T-0.397)
}

// TestHepExcitationGnatFerland checks the He+ excitation term per
// n_e n_He+ against the He+ cooling efficiency of Gnat & Ferland (2012)
// (gfHelium). Without Cen's factor (the default,
// HepBlack81) the ratio lies in 0.86–1.02 from 10^4.8 to 10^5.2 K, with it
// (HepKWH96) in 0.38–0.57 (measured from the table); each band is
// widened by the rows' rounding (gfRowTolerance). Outside 10^4.8–10^5.2 K
// the two rows are checked at their own measured ratios (derived from the
// table with the formula): 1.018 at 6.08e4 K and 0.836 at 1.69e5 K.
//
// It also pins the measured ratio of the whole He cooling to Gnat &
// Ferland's CIE column (1.01 at 6.08e4 K rising to 1.54 at 1.24e5 K): the
// coefficient is right there, so the excess is the KWH96 He+ fraction,
// 1.5–1.6 times the one their columns imply (CIE/efficiency) at
// 1–1.7×10^5 K (measured). Tolerance 2%: the rows' rounding plus the
// small share of He0 and He++ terms, which differ between the codes.
func TestHepExcitationGnatFerland(t *testing.T) {
	const y = 0.0833 // Gnat & Ferland 2012 Table 2 He/H
	perHep := func(T float64, opt PrimordialOptions) float64 {
		s, c := PrimordialCIE(model.Temperature(T), y, opt)
		return float64(c.ExcitationHep) / (s.NeOverNH * y * s.XHep)
	}
	lo, hi := math.Pow(10, 4.8), math.Pow(10, 5.2)
	heCIE := []float64{1.013, 1.131, 1.252, 1.374, 1.479, 1.535, 1.472} // measured ratios, built-in He / GF12 CIE column
	for i, r := range gfHelium {
		tol := gfRowTolerance(r.t, r.hep)
		got := perHep(r.t, PrimordialOptions{}) / r.hep
		switch {
		case r.t >= lo && r.t <= hi:
			if got < 0.86*(1-tol) || got > 1.02*(1+tol) {
				t.Errorf("He+ excitation (HepBlack81) at %.3g K = %.4f × Gnat & Ferland 2012, want 0.86–1.02 (± %.2f%%)", r.t, got, 100*tol)
			}
			if k := perHep(r.t, PrimordialOptions{HepExcitation: HepKWH96}) / r.hep; k < 0.38*(1-tol) || k > 0.57*(1+tol) {
				t.Errorf("He+ excitation (HepKWH96) at %.3g K = %.4f × Gnat & Ferland 2012, want 0.38–0.57 (± %.2f%%)", r.t, k, 100*tol)
			}
		case r.t < lo:
			if !biWithin(got, 1.018, tol) {
				t.Errorf("He+ excitation (HepBlack81) at %.3g K = %.4f × Gnat & Ferland 2012, want 1.018 ± %.2f%%", r.t, got, 100*tol)
			}
		default:
			if !biWithin(got, 0.836, tol) {
				t.Errorf("He+ excitation (HepBlack81) at %.3g K = %.4f × Gnat & Ferland 2012, want 0.836 ± %.2f%%", r.t, got, 100*tol)
			}
		}
		s, c := PrimordialCIE(model.Temperature(r.t), y, PrimordialOptions{})
		he := float64(c.ExcitationHep+c.IonisationHe0+c.IonisationHep+c.RecombinationHep+c.RecombinationHepp+c.DielectronicHep) / (s.NeOverNH * y)
		if !biWithin(he/r.cie, heCIE[i], 0.02) {
			t.Errorf("He cooling per n_e n_He at %.3g K = %.4f × Gnat & Ferland 2012's CIE column, want the measured %.3f ± 2%%", r.t, he/r.cie, heCIE[i])
		}
	}
}

// TestVoronovRate checks the Voronov (1997) form at U = ΔE/kT = 1:
// k = A e^{-1}/(X + 1) = 2.91e-8 × 0.367879/1.232 = 8.6894e-9 cm³ s⁻¹
// (derived from the cion.dat coefficients of Debian's mocassin-data).
func TestVoronovRate(t *testing.T) {
	T := voronovHdE * model.ElectronVolt / model.Boltzmann // U = 1
	if got, want := voronovRate(T), 2.91e-8*math.Exp(-1)/1.232; !biWithin(got, want, 1e-12) || !biWithin(got, 8.6894e-9, 1e-4) {
		t.Errorf("voronovRate(%g K) = %.6g, want %.6g (derived)", T, got, want)
	}
}

// TestPrimordialBookkeeping checks identities (derived): fractions sum to
// one, n_e/n_H = x_H+ + y (x_He+ + 2 x_He++), the total is the sum of the
// terms, every term is ≥ 0, and at 10^8 K the gas is fully ionised
// (n_e/n_H → 1 + 2y, derived).
func TestPrimordialBookkeeping(t *testing.T) {
	for _, opt := range []PrimordialOptions{{}, biKWH96} {
		for x := 2.0; x <= 9; x += 0.05 {
			for _, y := range []float64{0, 0.0787, 0.0851, 0.3} {
				s, c := PrimordialCIE(biAt10(x), y, opt)
				if math.Abs(s.XH0+s.XHp-1) > 1e-12 || math.Abs(s.XHe0+s.XHep+s.XHepp-1) > 1e-12 {
					t.Fatalf("PrimordialCIE(10^%.2f K, y=%g, %v) fractions %+v do not sum to 1", x, y, opt.HIonisation, s)
				}
				if ne := s.XHp + y*(s.XHep+2*s.XHepp); math.Abs(s.NeOverNH-ne) > 1e-12 {
					t.Fatalf("PrimordialCIE(10^%.2f K, y=%g) NeOverNH = %g, want %g", x, y, s.NeOverNH, ne)
				}
				terms := []model.CoolingRate{c.ExcitationH0, c.ExcitationHep, c.IonisationH0, c.IonisationHe0, c.IonisationHep,
					c.RecombinationHp, c.RecombinationHep, c.RecombinationHepp, c.DielectronicHep, c.FreeFree}
				sum := 0.0
				for _, v := range terms {
					if !(v >= 0) || math.IsInf(float64(v), 0) {
						t.Fatalf("PrimordialCIE(10^%.2f K, y=%g) has a term %g, want finite ≥ 0", x, y, float64(v))
					}
					sum += float64(v)
				}
				if !biWithin(float64(c.Total()), sum, 1e-14) {
					t.Fatalf("PrimordialCIE(10^%.2f K, y=%g) Total() = %g, want the sum %g", x, y, float64(c.Total()), sum)
				}
				if got := NeOverNH(biAt10(x), y); opt.HIonisation == VoronovH && got != s.NeOverNH {
					t.Fatalf("NeOverNH(10^%.2f K, %g) = %g, want %g", x, y, got, s.NeOverNH)
				}
			}
		}
	}
	if s := PrimordialIonisation(1e8, 0.0851, PrimordialOptions{}); !biWithin(s.NeOverNH, 1+2*0.0851, 1e-4) {
		t.Errorf("PrimordialIonisation(1e8 K, 0.0851).NeOverNH = %.6g, want 1 + 2y = 1.1702 (derived)", s.NeOverNH)
	}
}

// TestPrimordialSpecialCases checks the documented special cases, and
// that rates underflowing at low T give the all-neutral limit, not NaN
// (cloudwind's guard).
func TestPrimordialSpecialCases(t *testing.T) {
	for _, T := range []float64{0, -5, 1, 50, 300, 1000, 3000} {
		s, c := PrimordialCIE(model.Temperature(T), 0.0851, PrimordialOptions{})
		if math.IsNaN(s.NeOverNH+s.XH0+s.XHp+s.XHe0+s.XHep+s.XHepp) || math.IsNaN(float64(c.Total())) {
			t.Errorf("PrimordialCIE(%g K) = %+v, %g; want no NaN", T, s, float64(c.Total()))
		}
		if s.XH0 < 0.999999 || s.XHe0 < 0.999999 || !(c.Total() >= 0) {
			t.Errorf("PrimordialCIE(%g K) = %+v, Λ = %g; want all neutral and Λ ≥ 0", T, s, float64(c.Total()))
		}
	}
	if s, c := PrimordialCIE(0, 0.0851, PrimordialOptions{}); s != (Ionisation{XH0: 1, XHe0: 1}) || c.Total() != 0 {
		t.Errorf("PrimordialCIE(0 K) = %+v, %g; want all neutral, 0", s, float64(c.Total()))
	}
	// Γ_eHe0 underflows to exactly 0 here (exp(−285335/300) < 1e-308).
	if r := cenRates(300, PrimordialOptions{}); r.gHe0 != 0 {
		t.Errorf("cenRates(300 K).gHe0 = %g, want an underflow to 0 (the case this test guards)", r.gHe0)
	}
	for _, tc := range []struct{ t, y float64 }{
		{math.NaN(), 0.08}, {math.Inf(1), 0.08}, {1e5, -0.1}, {1e5, math.NaN()}, {1e5, math.Inf(1)},
	} {
		s, c := PrimordialCIE(model.Temperature(tc.t), tc.y, PrimordialOptions{})
		if !math.IsNaN(s.NeOverNH) || !math.IsNaN(s.XH0) || !math.IsNaN(float64(c.Total())) {
			t.Errorf("PrimordialCIE(%g K, y=%g) = %+v, %g; want NaN", tc.t, tc.y, s, float64(c.Total()))
		}
		if v := NeOverNH(model.Temperature(tc.t), tc.y); !math.IsNaN(v) {
			t.Errorf("NeOverNH(%g K, %g) = %g, want NaN", tc.t, tc.y, v)
		}
	}
	// Very high T: no NaN even when recombination underflows.
	if s, c := PrimordialCIE(1e300, 0.08, PrimordialOptions{}); math.IsNaN(s.NeOverNH) || math.IsNaN(float64(c.Total())) || s.XHepp != 1 {
		t.Errorf("PrimordialCIE(1e300 K) = %+v, %g; want fully ionised, no NaN", s, float64(c.Total()))
	}
	for _, y := range []float64{-1, math.NaN(), math.Inf(1)} {
		if p, err := Primordial(y, PrimordialOptions{}); err == nil {
			t.Errorf("Primordial(%g) = %v, nil; want an error", y, p)
		}
	}
	if got := HIonisation(7).String(); got != "HIonisation(7)" {
		t.Errorf("HIonisation(7).String() = %q, want \"HIonisation(7)\"", got)
	}
	if got := HepExcitation(7).String(); got != "HepExcitation(7)" {
		t.Errorf("HepExcitation(7).String() = %q, want \"HepExcitation(7)\"", got)
	}
}

// TestPrimordialSampled checks the sampled curve against the solver
// between nodes: log-log interpolation at 0.01 dex errs by ≤0.45% near the
// H rise and <0.11% above 2×10^4 K (measured).
func TestPrimordialSampled(t *testing.T) {
	p, err := Primordial(0.0787, PrimordialOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if lo, hi := p.ValidRange(); !biWithin(float64(lo), 1e4, 1e-12) || !biWithin(float64(hi), 1e9, 1e-12) {
		t.Errorf("Primordial(0.0787).ValidRange() = %g, %g K, want 1e4, 1e9 K", float64(lo), float64(hi))
	}
	for x := 4.0025; x < 9; x += 0.005 {
		tol := 0.0011 // measured, above 2e4 K
		if x < math.Log10(2e4) {
			tol = 0.0050 // measured, near the H rise (0.45%)
		}
		got, want := float64(p.Lambda(biAt10(x))), biLambdaHHe(biAt10(x), 0.0787, PrimordialOptions{})
		if !biWithin(got, want, tol) {
			t.Errorf("Primordial(0.0787).Lambda(10^%.4f K) = %.5g, want %.5g ± %.2f%% (measured sampling error)", x, got, want, 100*tol)
		}
	}
	if m := p.Meta(); m.Normalisation != PerNH2 || m.HeliumRatio != 0.0787 || m.Metallicity != 0 {
		t.Errorf("Primordial(0.0787).Meta() = %+v, want nH2, y 0.0787, Z 0", m)
	}
}
