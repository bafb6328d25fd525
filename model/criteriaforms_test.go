package model

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// Checks of the criteria as their abstracts state them. Check values: the
// Rankine–Hugoniot jump and isentropic stagnation values (derived from the
// textbook relations, four figures), ξ(n_e n_i) ≈ 0.25 (derived),
// and identities of the forms (derived, exact up to rounding).

func TestShockJumpAndStagnation(t *testing.T) {
	// Derived check: γ = 5/3, M = 2 → ρ₂/ρ₁ = 2.2857, P₂/P₁ = 4.75, T₂/T₁ = 2.0781.
	rho, p, tt := ShockJump(2, 5.0/3)
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"ρ₂/ρ₁", rho, 2.2857}, {"P₂/P₁", p, 4.75}, {"T₂/T₁", tt, 2.0781}} {
		if !scalar.EqualWithinRel(c.got, c.want, 5e-5) {
			t.Errorf("ShockJump(2, 5/3) %s = %.6g, want %.5g", c.name, c.got, c.want)
		}
	}
	// M = 1 is no jump (derived).
	if rho, p, tt := ShockJump(1, 5.0/3); rho != 1 || p != 1 || tt != 1 {
		t.Errorf("ShockJump(1) = %g, %g, %g, want 1, 1, 1", rho, p, tt)
	}
	// Derived check: M = 1 → T₀/T = 4/3, ρ₀/ρ = 1.5396.
	t0, r0 := Stagnation(1, 5.0/3)
	if !scalar.EqualWithinRel(t0, 4.0/3, 1e-12) || !scalar.EqualWithinRel(r0, 1.5396, 5e-5) {
		t.Errorf("Stagnation(1, 5/3) = %.6g, %.6g, want 4/3, 1.5396", t0, r0)
	}
}

func TestLiAndSparreDiffer(t *testing.T) {
	// Li et al. 2020 cool the gas swept up in the bow shock, Sparre et al.
	// 2020 the unshocked wind (abstracts): for M > 1 the shocked state of
	// the jump conditions, so the two differ.
	cs := BuiltinCriteria()
	li, _ := CriterionByID(cs, "li-2020")
	sp, _ := CriterionByID(cs, "sparre-2020")
	for _, mach := range []float64{0.5, 1, 1.5, 3} {
		p := fiducial()
		p.Mach = mach
		s := mustDerive(t, p, PowerLawCooling{L0: 4e-23, T0: 1e6, Slope: -0.7})
		if s.Shocked != (mach > 1) {
			t.Errorf("M = %g: Shocked = %v", mach, s.Shocked)
		}
		var wantT float64
		if mach > 1 {
			_, _, tr := ShockJump(mach, DefaultGamma)
			wantT = float64(s.THot) * tr
		} else {
			tr, _ := Stagnation(mach, DefaultGamma)
			wantT = float64(s.THot) * tr
		}
		if !scalar.EqualWithinRel(float64(s.TShocked), wantT, 1e-12) {
			t.Errorf("M = %g: T_shocked = %g, want %g", mach, float64(s.TShocked), wantT)
		}
		ol, os := s.Evaluate(li), s.Evaluate(sp)
		if ol.RCrit == os.RCrit {
			t.Errorf("M = %g: li-2020 and sparre-2020 give the same r_crit %g", mach, float64(ol.RCrit))
		}
	}
}

func TestTurbulentWindReducesToGronkeOh(t *testing.T) {
	// arXiv:2510.03552 (abstract): t̃_cc = t_cc at M_turb = 0, so the
	// criterion equals Gronke & Oh 2018 there, to 1e-12.
	cs := BuiltinCriteria()
	go18, _ := CriterionByID(cs, "gronke-oh-2018")
	tw, _ := CriterionByID(cs, "turbulent-wind-2025")
	for _, chi := range []float64{30, 100, 1000} {
		p := fiducial()
		p.Chi = chi
		s := mustDerive(t, p, lambdaGO18)
		a, b := s.Evaluate(go18), s.Evaluate(tw)
		if !scalar.EqualWithinRel(a.Ratio, b.Ratio, 1e-12) || !scalar.EqualWithinRel(float64(a.RCrit), float64(b.RCrit), 1e-12) {
			t.Errorf("χ = %g: GO18 ratio %g r_crit %g, turbulent wind %g %g", chi, a.Ratio, float64(a.RCrit), b.Ratio, float64(b.RCrit))
		}
		// With turbulence t̃_cc = t_cc/(1 + (M_turb/(0.6 M))²)^{1/2} (the abstract's form).
		p.MachTurb = 0.6
		s = mustDerive(t, p, lambdaGO18)
		want := float64(s.TCC) / math.Sqrt(1+math.Pow(0.6/(0.6*p.Mach), 2))
		if got := float64(s.TurbulentCrushingTime(0.6)); !scalar.EqualWithinRel(got, want, 1e-12) {
			t.Errorf("TurbulentCrushingTime = %g, want %g", got, want)
		}
	}
}

func TestInfallCriterion(t *testing.T) {
	// Tan, Oh & Gronke 2023 (abstract): survival iff t_grow < 4 t_cc, with
	// t_grow from the growth model. t_grow/t_cc ∝ r^{-1/4} (derived), so
	// r_crit = r_cl (ratio/4)^4.
	cs := BuiltinCriteria()
	c, _ := CriterionByID(cs, "tan-oh-gronke-2023")
	s := mustDerive(t, fiducial(), lambdaGO18)
	o := s.Evaluate(c)
	ratio := float64(s.TGrow / s.TCC)
	if !scalar.EqualWithinRel(o.Ratio, ratio, 1e-12) || o.Threshold != 4 {
		t.Errorf("ratio %g threshold %g, want t_grow/t_cc = %g and 4", o.Ratio, o.Threshold, ratio)
	}
	if want := float64(s.Params.RCloud) * math.Pow(ratio/4, 4); !scalar.EqualWithinRel(float64(o.RCrit), want, 1e-12) {
		t.Errorf("r_crit = %g, want %g", float64(o.RCrit), want)
	}
	if (o.Verdict == Survives) != (ratio < 4) {
		t.Errorf("verdict %v for t_grow/t_cc = %g", o.Verdict, ratio)
	}
}

func TestThreeOutcomes(t *testing.T) {
	// Farber & Gronke 2022 (abstract): clouds colder than ~10⁴ K can be
	// destroyed, survive, or be transformed entirely to ~10⁴ K gas. With Λ
	// rising as T² (a test stub, no source: it makes the warm gas's mixed
	// phase cool as fast as the cold one's, as near a cooling peak), an
	// 800 K cloud in a 3×10⁶ K wind: a small cloud is destroyed, a large one
	// survives, and between them it is transformed when the 10⁴ K gas passes
	// the same test (cloudwind's reading of the forms, from memory).
	cs := BuiltinCriteria()
	fg, _ := CriterionByID(cs, "farber-gronke-2022")
	seen := map[Verdict]bool{}
	for k := -30; k <= 30; k++ {
		r := math.Pow(10, float64(k)/10) // 10⁻³ to 10³ pc, 0.1 dex apart
		p := fiducial()
		p.TCloud, p.Chi, p.RCloud = 800, 3750, Length(r)*Parsec
		s := mustDerive(t, p, PowerLawCooling{L0: 1e-22, T0: 1e5, Slope: 2})
		o := s.Evaluate(fg)
		seen[o.Verdict] = true
		if o.Verdict == Transformed && !(o.WarmRatio < o.WarmThreshold && o.Ratio >= o.Threshold) {
			t.Errorf("r = %g pc: transformed with ratio %g/%g, warm %g/%g", r, o.Ratio, o.Threshold, o.WarmRatio, o.WarmThreshold)
		}
	}
	for _, v := range Verdicts() {
		if !seen[v] {
			t.Errorf("no radius gave %v (saw %v)", v, seen)
		}
	}
	// At T_cl = 10⁴ K there is nothing warmer to become: two outcomes.
	s := mustDerive(t, fiducial(), lambdaGO18)
	if o := s.Evaluate(fg); o.Verdict == Transformed || !math.IsNaN(o.WarmRatio) {
		t.Errorf("T_cl = 1e4 K: verdict %v, warm ratio %g", o.Verdict, o.WarmRatio)
	}
}

func TestUncertaintyBand(t *testing.T) {
	// An unverified α carries ×/÷ 2 (the default factor): r_crit ∝ 1/α for
	// cooling times and ∝ α^-4 for t_grow (derived).
	cs := BuiltinCriteria()
	s := mustDerive(t, fiducial(), lambdaGO18)
	for i := range cs {
		c := &cs[i]
		o := s.Evaluate(c)
		if !o.HasThreshold() {
			continue
		}
		u := c.UncertaintyFactor()
		if c.Verified && u != 1 || !c.Verified && u != DefaultUncertainty {
			t.Errorf("%s: factor %g (verified %v)", c.ID, u, c.Verified)
		}
		k := u
		if c.Cool == CoolGrow {
			k = math.Pow(u, 4)
		}
		if !scalar.EqualWithinRel(float64(o.RCritHigh), float64(o.RCrit)*k, 1e-12) || !scalar.EqualWithinRel(float64(o.RCritLow), float64(o.RCrit)/k, 1e-12) {
			t.Errorf("%s: band [%g, %g] around %g, want ×/÷ %g", c.ID, float64(o.RCritLow), float64(o.RCritHigh), float64(o.RCrit), k)
		}
		inside := s.Params.RCloud > o.RCritLow && s.Params.RCloud < o.RCritHigh
		if o.DependsOnConstant != (inside && k > 1) {
			t.Errorf("%s: depends on the constant %v, r_cl inside the band %v", c.ID, o.DependsOnConstant, inside)
		}
	}
	c := cs[1]
	c.Uncertainty = 0.5
	if err := c.Validate(); err == nil {
		t.Error("Validate(uncertainty 0.5) = nil, want an error")
	}
}

func TestElectronIonConvention(t *testing.T) {
	// Derived: ξ(n_e n_i) ≈ 0.25 for the ionised
	// A09 mixture at μ = 0.6, against ξ(n_H²) = 0.1959: t_cool(n_e n_i) /
	// t_cool(n_H²) = 0.1959/0.2501 along an isobar.
	p := fiducial()
	p.DensityProduct = NeNi
	a := mustDerive(t, p, lambdaGO18)
	p.DensityProduct = NH2
	b := mustDerive(t, p, lambdaGO18)
	want := electronIonPerH2(Asplund2009.X, Asplund2009.Y/Asplund2009.X)
	if !scalar.EqualWithinRel(want, 1.1774*1.0842, 2e-4) { // derived for A09: (1+X)/(2X) and 1 + Y/(4X)
		t.Errorf("n_e n_i/n_H² = %g, want 1.1774 × 1.0842", want)
	}
	if got := float64(b.TCoolMix / a.TCoolMix); !scalar.EqualWithinRel(got, want, 1e-12) {
		t.Errorf("t_cool,mix(nh2)/t_cool,mix(neni) = %g, want %g", got, want)
	}
	xi := 0.1959 * want // ξ(n_H²) = (X μ m_p/m_H)² = 0.1959 (derived) × n_e n_i/n_H²
	if !scalar.EqualWithinRel(xi, 0.25, 0.01) {
		t.Errorf("ξ(n_e n_i) = %g, want ≈ 0.25", xi)
	}
	if d, err := ParseDensityProduct("neni"); err != nil || d != NeNi {
		t.Errorf("ParseDensityProduct(neni) = %v, %v", d, err)
	}
	var fe *FieldError
	p.DensityProduct = 7
	if err := p.Validate(); !errors.As(err, &fe) || fe.Field != FieldDensityProduct {
		t.Errorf("Validate(density product 7) = %v", err)
	}
}

func TestFailedConfinementCaution(t *testing.T) {
	// Li et al. 2020 (abstract): "failed pressure confinement" when the
	// ambient hot gas cools too fast: a caution when t_cool,hot < t_cc.
	p := fiducial()
	p.RCloud = 1e5 * Parsec // t_cc grows with r_cl, t_cool,hot does not
	s := mustDerive(t, p, lambdaGO18)
	found := false
	for _, c := range s.Cautions {
		found = found || c.Field == FieldChi && s.TCoolHot < s.TCC
	}
	if s.TCoolHot < s.TCC && !found {
		t.Errorf("t_cool,hot/t_cc = %g without the failed-confinement caution: %v", float64(s.TCoolHot/s.TCC), s.Cautions)
	}
	if !(s.TCoolHot < s.TCC) {
		t.Fatalf("the scenario does not make the wind cool within t_cc (%g)", float64(s.TCoolHot/s.TCC))
	}
}
