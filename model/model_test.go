package model

import (
	"errors"
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// Check values are derived (algebra from the stated conventions and
// CODATA 2018 constants, quoted to five or six figures), or name their own
// source. Tolerance 1e-4 relative.
const refTol = 1e-4

func near(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if !scalar.EqualWithinRel(got, want, tol) {
		t.Errorf("%s = %.7g, want %.7g (±%g relative)", what, got, want, tol)
	}
}

// The fiducial problem of the derived check values: χ = 100, P/k = 1e3,
// T_cl = 1e4 K, M = 1, μ = 0.6, γ = 5/3.
func fiducial() Params {
	p := Fiducial()
	p.Mu = 0.6
	return p
}

func mustDerive(t *testing.T, p Params, cf CoolingFunction) State {
	t.Helper()
	s, err := Derive(p, cf)
	if err != nil {
		t.Fatalf("Derive(%+v): %v", p, err)
	}
	return s
}

var lambdaGO18 = ConstantCooling{CoolingRate(math.Pow(10, -21.4))} // [GO18] normalisation Λ_mix = 10^-21.4

func TestConstants(t *testing.T) {
	// 1 pc ÷ 1 km/s = 0.977792 Myr (derived from CODATA/IAU constants).
	near(t, "pc/(km/s) in Myr", float64(Parsec)/float64(KilometrePerSecond)/float64(Megayear), 0.977792, refTol)
	// IAU 2015 Resolution B2 note 4: 1 pc = (648000/π) au = 3.0856775814913673e18 cm.
	near(t, "Parsec", float64(Parsec), 3.0856775814913673e18, 1e-15)
	// M☉ = (GM)☉/G = 1.3271244e26/6.67430e-8 = 1.98841e33 g ((GM)☉ of IAU 2015
	// Resolution B3 from memory, G CODATA 2018; the division derived).
	near(t, "SolarMass", float64(SolarMass), 1.98841e33, 1e-5)
	// m_H = 1.00782503223 u = 1.6735328e-24 g (secondary source: the value public
	// codes take from NIST and the Atomic Mass Evaluation).
	near(t, "HydrogenAtomMass", float64(HydrogenAtomMass), 1.6735328e-24, 1e-7)
}

func TestMixtureMu(t *testing.T) {
	// A09 (X, Y, Z = 0.7381, 0.2485, 0.0134, [AAG21] Table 4) → μ = 0.59906; AG89 →
	// 0.61415 (derived from 1/μ = 2X + 3Y/4 + Z/2).
	near(t, "A09 μ", Asplund2009.MuIonised(), 0.59906, refTol)
	near(t, "AG89 μ", AndersGrevesse1989.MuIonised(), 0.61415, refTol)
	for _, m := range Mixtures() {
		if s := m.X + m.Y + m.Z; math.Abs(s-1) > 2e-4 {
			t.Errorf("mixture %s: X+Y+Z = %g, want 1 (±2e-4; AAG21 Table 4 rounds to 4 figures)", m.Name, s)
		}
	}
}

func TestSoundSpeed(t *testing.T) {
	// Derived: c_s(1e6 K, μ = 0.6) = 151.423 km/s; c_s(1e4 K) = 15.1423 km/s.
	near(t, "SoundSpeed(1e6, 0.6, 5/3)", float64(SoundSpeed(1e6, 0.6, 5.0/3))/1e5, 151.423, refTol)
	near(t, "SoundSpeed(1e4, 0.6, 5/3)", float64(SoundSpeed(1e4, 0.6, 5.0/3))/1e5, 15.1423, refTol)
	// Derived: c_s(1e4 K, μ = 1.22) = 10.62 km/s (four figures).
	near(t, "SoundSpeed(1e4, 1.22, 5/3)", float64(SoundSpeed(1e4, 1.22, 5.0/3))/1e5, 10.62, 5e-4)
}

func TestFiducialState(t *testing.T) {
	s := mustDerive(t, fiducial(), lambdaGO18)
	// Derived (pressure equilibrium, T_mix = (T_cl T_hot)^{1/2} [BF90]): n_cl = 0.1, n_hot = 1e-3 cm⁻³, T_hot = 1e6, T_mix = 1e5 K, n_mix = 1e-2.
	near(t, "NCold", float64(s.NCold), 0.1, refTol)
	near(t, "NHot", float64(s.NHot), 1e-3, refTol)
	near(t, "THot", float64(s.THot), 1e6, refTol)
	near(t, "TMix", float64(s.TMix), 1e5, refTol)
	near(t, "NMix", float64(s.NMix), 1e-2, refTol)
	// Derived: ρ_hot = 1.00357e-27 g cm⁻³ (μ = 0.6).
	near(t, "RhoHot", float64(s.RhoHot), 1.00357e-27, refTol)
	// Derived: v_w = 151.423 km/s, t_cc = 0.064574 Myr, t_shear = t_cc/10, χ^{1/2} t_cc = 0.64574 Myr.
	near(t, "VWind", float64(s.VWind)/1e5, 151.423, refTol)
	near(t, "TCC", float64(s.TCC/Megayear), 0.064574, refTol)
	near(t, "TShear", float64(s.TShear/Megayear), 0.0064574, refTol)
	near(t, "TDrag", float64(s.TDrag/Megayear), 0.64574, refTol)
	// Derived identity (one μ): t_cc = t_sc,cl / M.
	near(t, "TSoundCold/M", float64(s.TSoundCold), float64(s.TCC), 1e-12)
	// Derived: t_cool,mix = 5.2021e12 s = 0.164843 Myr with f = 3/2, 𝒩 = n² and the
	// [GO18] normalisation Λ_mix = 10^-21.4.
	p := fiducial()
	p.DensityProduct = N2
	s = mustDerive(t, p, lambdaGO18)
	near(t, "TCoolMix (s)", float64(s.TCoolMix), 5.2021e12, refTol)
	near(t, "TCoolMix (Myr)", float64(s.TCoolMix/Megayear), 0.164843, refTol)
	// Derived: r = 1 pc, n = 0.1, μ = 0.6 → m = 1.2351e31 g = 6.2113e-3 M☉, N = 3.0857e17 cm⁻².
	near(t, "MassCold (g)", float64(s.MassCold), 1.2351e31, refTol)
	near(t, "MassCold (M☉)", float64(s.MassCold/SolarMass), 6.2113e-3, refTol)
	near(t, "ColumnCold", float64(s.ColumnCold), 3.0857e17, refTol)
}

// go18 returns the Gronke & Oh 2018 outcome at p.
func go18(t *testing.T, p Params, cf CoolingFunction) Outcome {
	t.Helper()
	s := mustDerive(t, p, cf)
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	return s.Evaluate(c)
}

func TestGronkeOhNormalisation(t *testing.T) {
	// Derived, and the statement: Λ_mix = 10^-21.4, χ = 100, T_cl = 1e4, P/k = 1e3,
	// M = 1, μ = 0.6, γ = 5/3, f = 3/2, 𝒩 = n² give r_crit = 2.5528 pc ("few pc" in [GO18]).
	base := fiducial()
	base.DensityProduct = N2
	near(t, "r_crit,GO fiducial (pc)", float64(go18(t, base, lambdaGO18).RCrit/Parsec), 2.5528, refTol)

	// Derived from r_crit ∝ T_cl^{5/2} M χ/(P Λ): P/k = 2e3 → 1.2764 pc; M = 1.5 → 3.8292 pc; T_cl = 2e4 → 14.441 pc (Λ fixed).
	cases := []struct {
		name string
		set  func(*Params)
		want float64
	}{
		{"P/k = 2e3", func(p *Params) { p.Pressure = 2e3 }, 1.2764},
		{"M = 1.5", func(p *Params) { p.Mach = 1.5 }, 3.8292},
		{"T_cl = 2e4", func(p *Params) { p.TCloud = 2e4 }, 14.441},
	}
	for _, c := range cases {
		p := base
		c.set(&p)
		near(t, "r_crit,GO "+c.name+" (pc)", float64(go18(t, p, lambdaGO18).RCrit/Parsec), c.want, refTol)
	}

	// Derived (convention sensitivity): f = 5/2, 𝒩 = n_H² (X = 0.7381) → 21.717 pc.
	p := fiducial()
	p.HeatCapacity, p.DensityProduct = Isobaric, NH2
	near(t, "r_crit,GO f=5/2 nH2 (pc)", float64(go18(t, p, lambdaGO18).RCrit/Parsec), 21.717, refTol)
	// Derived, the other conventions.
	p.HeatCapacity = Isochoric
	near(t, "r_crit,GO f=3/2 nH2 (pc)", float64(go18(t, p, lambdaGO18).RCrit/Parsec), 13.030, refTol)
	p.HeatCapacity, p.DensityProduct = Isobaric, N2
	near(t, "r_crit,GO f=5/2 n2 (pc)", float64(go18(t, p, lambdaGO18).RCrit/Parsec), 4.2547, refTol)
}

// TestGronkeOhScaling checks r_crit ∝ T_cl^{5/2} M χ/(P Λ_mix) at fixed Λ
// (derived from the [GO18] criterion) over a grid of multiplicative steps.
func TestGronkeOhScaling(t *testing.T) {
	base := fiducial()
	r0 := float64(go18(t, base, lambdaGO18).RCrit)
	for _, k := range []float64{0.3, 2, 7.5} {
		for name, c := range map[string]struct {
			set   func(*Params)
			scale float64
		}{
			"T_cl":     {func(p *Params) { p.TCloud *= Temperature(k) }, math.Pow(k, 2.5)},
			"Mach":     {func(p *Params) { p.Mach *= k }, k},
			"Pressure": {func(p *Params) { p.Pressure *= Pressure(k) }, 1 / k},
			"chi":      {func(p *Params) { p.Chi *= k }, k},
		} {
			p := base
			c.set(&p)
			if name == "chi" && p.Chi <= 1 {
				continue
			}
			got := float64(go18(t, p, lambdaGO18).RCrit) / r0
			near(t, "r_crit scale with "+name, got, c.scale, 1e-12)
		}
		cf := ConstantCooling{lambdaGO18.Value * CoolingRate(k)}
		near(t, "r_crit scale with Λ", float64(go18(t, base, cf).RCrit)/r0, 1/k, 1e-12)
	}
}

// TestRoundTrip evaluates every criterion at r_cl = r_crit and expects the
// ratio to equal the threshold (the definition of r_crit; 1e-12).
func TestRoundTrip(t *testing.T) {
	pl := PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}
	for _, cf := range []CoolingFunction{lambdaGO18, pl} {
		for _, chi := range []float64{10, 100, 1000, 3e4} {
			p := fiducial()
			p.Chi, p.Mach = chi, 1.7
			s := mustDerive(t, p, cf)
			for _, c := range BuiltinCriteria() {
				o := s.Evaluate(&c)
				if c.Cool == CoolNone {
					if o.HasThreshold() || o.Verdict != Destroyed {
						t.Errorf("%s: adiabatic outcome %+v, want no threshold and destroyed", c.ID, o)
					}
					continue
				}
				q := p
				q.RCloud = o.RCrit
				if q.RCloud*1.001 > MaxRCloud {
					continue // beyond the accepted radii
				}
				s2 := mustDerive(t, q, cf)
				o2 := s2.Evaluate(&c)
				near(t, c.ID+" ratio at r_crit / threshold", o2.Ratio/o2.Threshold, 1, 1e-12)
				near(t, c.ID+" margin at r_crit", o2.Margin, 1, 1e-12)
				// Just above r_crit survives; just below is destroyed.
				q.RCloud = o.RCrit * 1.001
				sUp := mustDerive(t, q, cf)
				if v := sUp.Evaluate(&c).Verdict; v != Survives {
					t.Errorf("%s χ=%g: verdict at 1.001 r_crit = %v, want survives", c.ID, chi, v)
				}
				q.RCloud = o.RCrit * 0.999
				sDown := mustDerive(t, q, cf)
				if v := sDown.Evaluate(&c).Verdict; v != Destroyed {
					t.Errorf("%s χ=%g: verdict at 0.999 r_crit = %v, want destroyed", c.ID, chi, v)
				}
			}
		}
	}
}

func TestIsobaricRatios(t *testing.T) {
	// Derived: same f and ξ, χ = 100, Λ_mix/Λ_hot = 3 → t_cool,hot/t_cool,mix = 300.
	// A power law through T_mix = 1e5 and T_hot = 1e6 with Λ_mix/Λ_hot = 3 has slope −log10(3).
	cf := PowerLawCooling{L0: 3e-22, T0: 1e5, Slope: -math.Log10(3)}
	p := fiducial()
	p.DensityProduct = N2
	s := mustDerive(t, p, cf)
	near(t, "t_cool,hot/t_cool,mix", float64(s.TCoolHot/s.TCoolMix), 300, 1e-12)
	// Derived: t_cool,cl/t_cool,mix = χ⁻¹ Λ(T_mix)/Λ(T_cl).
	near(t, "t_cool,cl/t_cool,mix", float64(s.TCoolCold/s.TCoolMix), float64(s.LambdaMix/s.LambdaCold)/100, 1e-12)
}

func TestMinMix(t *testing.T) {
	p := fiducial()
	// Constant Λ: t_cool ∝ T² along the isobar, so the minimum is at T_cl.
	s := mustDerive(t, p, lambdaGO18)
	near(t, "TMinMix const", float64(s.TMinMix), 1e4, 1e-12)
	near(t, "TCoolMinMix const", float64(s.TCoolMinMix), float64(s.TCoolCold), 1e-12)
	// Λ ∝ T^3: t_cool ∝ T^{-1}, so the minimum is at T_hot.
	s = mustDerive(t, p, PowerLawCooling{1e-22, 1e5, 3})
	near(t, "TMinMix T^3", float64(s.TMinMix), float64(s.THot), 1e-12)
	near(t, "TCoolMinMix T^3", float64(s.TCoolMinMix), float64(s.TCoolHot), 1e-12)
	// A peaked piecewise law: rising as T^4 to 2e4 K, then falling as T^-1.
	// t_cool ∝ T²/Λ is smallest at the peak node.
	pk := testPeak{}
	s = mustDerive(t, p, pk)
	near(t, "TMinMix peak", float64(s.TMinMix), 2e4, 1e-12)
	// The same function without its nodes goes through the sampled search.
	s2 := mustDerive(t, p, noNodes{pk})
	near(t, "TMinMix peak (sampled)", float64(s2.TMinMix), 2e4, 1e-6)
	near(t, "TCoolMinMix peak (sampled)", float64(s2.TCoolMinMix), float64(s.TCoolMinMix), 1e-6)
	if !(s.TCoolMinMix < s.TCoolMix && s.TCoolMinMix < s.TCoolCold) {
		t.Errorf("minimum %g not below t_cool,mix %g and t_cool,cl %g", float64(s.TCoolMinMix), float64(s.TCoolMix), float64(s.TCoolCold))
	}
}

// testPeak is Λ = 1e-22 (T/2e4)^4 below 2e4 K and 1e-22 (T/2e4)^-1 above:
// a synthetic peaked curve for the minimum search (no physical source).
type testPeak struct{}

func (testPeak) Lambda(t Temperature) CoolingRate {
	x := float64(t) / 2e4
	if x < 1 {
		return CoolingRate(1e-22 * x * x * x * x)
	}
	return CoolingRate(1e-22 / x)
}
func (testPeak) Nodes() ([]float64, []float64) {
	return []float64{math.Log10(2e4)}, []float64{-22}
}

type noNodes struct{ cf CoolingFunction }

func (n noNodes) Lambda(t Temperature) CoolingRate { return n.cf.Lambda(t) }

func TestSeparateMu(t *testing.T) {
	// Derived from equal P = ρ k_B T/(μ m_p): T_hot = χ T_cl μ_hot/μ_cl; ρ_cl/ρ_hot must stay χ.
	p := fiducial()
	p.MuCold, p.MuHot = 1.22, 0.6
	s := mustDerive(t, p, lambdaGO18)
	near(t, "THot", float64(s.THot), 100*1e4*0.6/1.22, 1e-12)
	near(t, "ρ_cl/ρ_hot", float64(s.RhoCold/s.RhoHot), 100, 1e-12)
	near(t, "ρ_mix", float64(s.RhoMix), math.Sqrt(float64(s.RhoCold*s.RhoHot)), 1e-12)
}

func TestNoCooling(t *testing.T) {
	s := mustDerive(t, fiducial(), ConstantCooling{0})
	if !math.IsInf(float64(s.TCoolMix), 1) || !math.IsInf(float64(s.TCoolMinMix), 1) || !math.IsInf(float64(s.LShatter), 1) {
		t.Errorf("Λ = 0: TCoolMix %g, TCoolMinMix %g, LShatter %g; want +Inf", float64(s.TCoolMix), float64(s.TCoolMinMix), float64(s.LShatter))
	}
	for _, c := range BuiltinCriteria() {
		o := s.Evaluate(&c)
		if o.Verdict != Destroyed || o.HasThreshold() {
			t.Errorf("Λ = 0, %s: verdict %v, threshold %v; want destroyed, none", c.ID, o.Verdict, o.HasThreshold())
		}
	}
}

func TestCalibrationRange(t *testing.T) {
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	p := fiducial()
	s := mustDerive(t, p, lambdaGO18)
	if o := s.Evaluate(c); !o.InRange() {
		t.Errorf("fiducial leaves GO18 range: %v", o.Leaves.Names())
	}
	p.Chi, p.Mach = 1e4, 3
	s = mustDerive(t, p, lambdaGO18)
	o := s.Evaluate(c)
	if got := o.Leaves.Names(); len(got) != 2 || got[0] != FieldChi || got[1] != FieldMach {
		t.Errorf("χ = 1e4, M = 3: leaves %v, want [chi mach]", got)
	}
}

type rangedConst struct{ ConstantCooling }

func (rangedConst) ValidRange() (Temperature, Temperature) { return 2e4, 1e8 }

func TestRangeCautions(t *testing.T) {
	s := mustDerive(t, fiducial(), rangedConst{lambdaGO18})
	if len(s.Cautions) != 1 || s.Cautions[0].Field != FieldTCloud {
		t.Errorf("T_cl = 1e4 below a table from 2e4 K: cautions %+v, want one on t_cloud", s.Cautions)
	}
}

func TestValidateRejects(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		field string
		set   func(*Params)
	}{
		{FieldChi, func(p *Params) { p.Chi = 1 }},
		{FieldChi, func(p *Params) { p.Chi = -100 }},
		{FieldChi, func(p *Params) { p.Chi = nan }},
		{FieldChi, func(p *Params) { p.Chi = 1e9 }},
		{FieldChi, func(p *Params) { p.Chi, p.TCloud = 1e7, 1e5 }}, // T_hot = 1e12 K
		{FieldMach, func(p *Params) { p.Mach = 0 }},
		{FieldMach, func(p *Params) { p.Mach = inf }},
		{FieldPressure, func(p *Params) { p.Pressure = -1e3 }},
		{FieldPressure, func(p *Params) { p.Pressure = 0 }},
		{FieldTCloud, func(p *Params) { p.TCloud = 0 }},
		{FieldTCloud, func(p *Params) { p.TCloud = Temperature(nan) }},
		{FieldRCloud, func(p *Params) { p.RCloud = -Parsec }},
		{FieldRCloud, func(p *Params) { p.RCloud = 0 }},
		{FieldRCloud, func(p *Params) { p.RCloud = Length(inf) }},
		{FieldMetallicity, func(p *Params) { p.Metallicity = -0.1 }},
		{FieldMetallicity, func(p *Params) { p.Metallicity = nan }},
		{FieldGamma, func(p *Params) { p.Gamma = 1 }},
		{FieldGamma, func(p *Params) { p.Gamma = 0.5 }},
		{FieldMu, func(p *Params) { p.Mu = -0.6 }},
		{FieldMuCold, func(p *Params) { p.MuCold = 50 }},
		{FieldMuHot, func(p *Params) { p.MuHot = inf }},
		{FieldHydrogenFraction, func(p *Params) { p.HydrogenFraction = 1.5 }},
		{FieldTFloor, func(p *Params) { p.TFloor = 2e4 }}, // above T_cl = 1e4
		{FieldTFloor, func(p *Params) { p.TFloor = -2 }},  // negative and not NoFloor
		{FieldHeatCapacity, func(p *Params) { p.HeatCapacity = 7 }},
		{FieldDensityProduct, func(p *Params) { p.DensityProduct = -1 }},
	}
	for i, c := range cases {
		p := fiducial()
		c.set(&p)
		err := p.Validate()
		var fe *FieldError
		if !errors.As(err, &fe) {
			t.Errorf("case %d: Validate() = %v, want a *FieldError on %s", i, err, c.field)
			continue
		}
		if fe.Field != c.field {
			t.Errorf("case %d: Validate() names %q (%v), want %q", i, fe.Field, err, c.field)
		}
		if _, err := Derive(p, lambdaGO18); err == nil {
			t.Errorf("case %d: Derive accepted invalid %s", i, c.field)
		}
	}
	if err := fiducial().Validate(); err != nil {
		t.Errorf("fiducial: Validate() = %v", err)
	}
}

// TestNoSilentNaN sweeps valid inputs across their whole accepted range and
// requires every derived number and outcome to be a number (±Inf allowed
// only where documented).
func TestNoSilentNaN(t *testing.T) {
	cfs := []CoolingFunction{lambdaGO18, PowerLawCooling{1e-22, 1e5, -0.7}, testPeak{}, noNodes{testPeak{}}}
	for _, cf := range cfs {
		for _, chi := range []float64{1.0001, 10, 1e4, 1e7} {
			for _, tcl := range []Temperature{1, 1e4, 1e6} {
				for _, pk := range []Pressure{MinPressure, 1e3, MaxPressure} {
					p := Params{Chi: chi, Mach: 1, Pressure: pk, TCloud: tcl, RCloud: Parsec}
					if p.Validate() != nil {
						continue
					}
					r, err := Evaluate(p, cf, BuiltinCriteria())
					if err != nil {
						t.Fatalf("Evaluate(%+v): %v", p, err)
					}
					for _, v := range []float64{float64(r.THot), float64(r.TMix), float64(r.TCC), float64(r.TCoolMix), float64(r.TCoolMinMix), float64(r.TMinMix), float64(r.LShatter), float64(r.TGrow)} {
						if math.IsNaN(v) {
							t.Fatalf("NaN in state for %+v with %T", p, cf)
						}
					}
					for i, o := range r.Outcomes {
						if math.IsNaN(o.Ratio) || math.IsNaN(o.Margin) || math.IsNaN(float64(o.RCrit)) {
							t.Fatalf("NaN in outcome %s for %+v: %+v", r.Criteria[i].ID, p, o)
						}
					}
				}
			}
		}
	}
}

func TestBuiltinCriteria(t *testing.T) {
	want := []string{"gronke-oh-2018", "li-2020", "sparre-2020", "abruzzo-2023", "farber-gronke-2022",
		"tan-oh-gronke-2023", "turbulent-wind-2025", "turbulent-box", "adiabatic"}
	cs := BuiltinCriteria()
	if len(cs) != len(want) {
		t.Fatalf("BuiltinCriteria() has %d criteria, want %d", len(cs), len(want))
	}
	for i, c := range cs {
		if c.ID != want[i] {
			t.Errorf("criterion %d id %q, want %q", i, c.ID, want[i])
		}
		if err := c.Validate(); err != nil {
			t.Errorf("%s: Validate() = %v", c.ID, err)
		}
		if c.Status == "" || c.Citation.Authors == "" || c.Range.Status == "" {
			t.Errorf("%s: missing status, citation or range status", c.ID)
		}
	}
	// Criteria whose constants are from memory (not in their papers' abstracts)
	// must be unverified here.
	for _, id := range []string{"li-2020", "sparre-2020", "abruzzo-2023", "farber-gronke-2022", "turbulent-box"} {
		if c, _ := CriterionByID(cs, id); c.Verified {
			t.Errorf("%s is marked verified; its constants are from memory", id)
		}
	}
}

func TestCriterionFormula(t *testing.T) {
	cs := BuiltinCriteria()
	for id, want := range map[string]string{
		"gronke-oh-2018":      "t_cool,mix / t_cc < 1",
		"abruzzo-2023":        "t_cool,minmix / t_shear < 1",
		"farber-gronke-2022":  "t_cool,mix / t_cc < (χ/100)^-0.5; below 10000 K: the same test for the 10000 K gas and for the cold side, transformed when only the first passes",
		"tan-oh-gronke-2023":  "t_grow / t_cc < 4",
		"li-2020":             "t_cool,shocked / t_cc < 10",
		"turbulent-wind-2025": "t_cool,mix / t_cc,turb < 1, t_cc,turb = t_cc/(1 + (M_turb/(0.6 M))²)^1/2",
	} {
		c, _ := CriterionByID(cs, id)
		if got := c.Formula(); got != want {
			t.Errorf("%s Formula() = %q, want %q", id, got, want)
		}
	}
}

// TestReevaluate checks the sweep fast path against a full evaluation
// (identity: no cooling time depends on the Mach number or radius).
func TestReevaluate(t *testing.T) {
	cs := BuiltinCriteria()
	cf := testPeak{}
	var fast Result
	if err := fast.Evaluate(fiducial(), cf, cs); err != nil {
		t.Fatal(err)
	}
	for _, mach := range []float64{0.3, 1, 4.5} {
		for _, r := range []Length{0.01 * Parsec, 3 * Parsec, 2 * Kiloparsec} {
			if err := fast.Reevaluate(mach, r); err != nil {
				t.Fatal(err)
			}
			p := fiducial()
			p.Mach, p.RCloud = mach, r
			full, err := Evaluate(p, cf, cs)
			if err != nil {
				t.Fatal(err)
			}
			if !reflect.DeepEqual(full.State, fast.State) {
				t.Errorf("Reevaluate(%g, %g pc): state differs from a full evaluation:\n%+v\n%+v", mach, float64(r/Parsec), fast.State, full.State)
			}
			for i := range cs {
				if fmt.Sprint(full.Outcomes[i]) != fmt.Sprint(fast.Outcomes[i]) { // NaN thresholds compare as text
					t.Errorf("Reevaluate(%g, %g pc): %s outcome %+v, want %+v", mach, float64(r/Parsec), cs[i].ID, fast.Outcomes[i], full.Outcomes[i])
				}
			}
		}
	}
	before := fast.Params
	if err := fast.Reevaluate(-1, Parsec); err == nil || fast.Params != before {
		t.Errorf("Reevaluate(-1, 1 pc) = %v and changed the params; want an error and no change", err)
	}
}

// TestParamsField checks the name → field mapping against the fields
// themselves (a format rule of Params, no physical source).
func TestParamsField(t *testing.T) {
	var p Params
	names := []string{FieldChi, FieldMach, FieldPressure, FieldTCloud, FieldRCloud, FieldMetallicity,
		FieldGamma, FieldMu, FieldMuCold, FieldMuHot, FieldHydrogenFraction, FieldTFloor}
	for i, n := range names {
		if !p.SetField(n, float64(i+1)) {
			t.Fatalf("SetField(%q) refused", n)
		}
	}
	want := Params{Chi: 1, Mach: 2, Pressure: 3, TCloud: 4, RCloud: 5, Metallicity: 6, Gamma: 7, Mu: 8, MuCold: 9, MuHot: 10, HydrogenFraction: 11, TFloor: 12}
	if p != want {
		t.Errorf("after SetField: %+v, want %+v", p, want)
	}
	for i, n := range names {
		if v, ok := p.Field(n); !ok || v != float64(i+1) {
			t.Errorf("Field(%q) = %g, %v; want %d", n, v, ok, i+1)
		}
	}
	if p.SetField(FieldHeatCapacity, 1) || p.SetField("nope", 1) {
		t.Error("SetField accepted a name that is not a numeric input")
	}
	if _, ok := p.Field("nope"); ok {
		t.Error(`Field("nope") reported a value`)
	}
}

// TestCheckFieldExplicitZero: a value given explicitly is checked as given;
// 0 is not read as "the default" (a rule of this package).
func TestCheckFieldExplicitZero(t *testing.T) {
	for _, f := range []string{FieldGamma, FieldMu, FieldMuCold, FieldMuHot, FieldHydrogenFraction, FieldChi, FieldMach, FieldPressure, FieldTCloud, FieldRCloud} {
		err := CheckField(f, 0)
		var fe *FieldError
		if !errors.As(err, &fe) || fe.Field != f || !strings.Contains(fe.Reason, "got 0") {
			t.Errorf("CheckField(%s, 0) = %v, want a FieldError quoting 0", f, err)
		}
	}
	if err := CheckField(FieldTFloor, 0); err != nil {
		t.Errorf("CheckField(t_floor, 0) = %v, want nil (no floor)", err)
	}
	if err := CheckField(FieldMetallicity, 0); err != nil {
		t.Errorf("CheckField(metallicity, 0) = %v, want nil (metal-free is valid)", err)
	}
	if err := CheckField("no_such_field", 1); !errors.Is(err, ErrUnknown) {
		t.Errorf("CheckField(unknown) = %v, want ErrUnknown", err)
	}
}

// TestNoFloor: with NoFloor, Λ is applied below T_cl; with the default floor
// it is 0 there (the floor rule of Params.TFloor).
func TestNoFloor(t *testing.T) {
	p := Fiducial()
	p.TFloor = NoFloor
	if err := p.Validate(); err != nil {
		t.Fatalf("Validate(NoFloor) = %v", err)
	}
	cf := ConstantCooling{Value: 1e-22}
	s := State{Params: p.WithDefaults()}
	if got := s.lambda(cf, 10); got != 1e-22 {
		t.Errorf("lambda(10 K) with no floor = %g, want 1e-22", got)
	}
	s.Params.TFloor = s.Params.TCloud
	if got := s.lambda(cf, 10); got != 0 {
		t.Errorf("lambda(10 K) with the floor at T_cl = %g, want 0", got)
	}
}

// TestGrowthModel: one setting, Params.MixCooling, chooses the cold-side
// cooling time of v_mix, t_grow and l_cool,cl; its default is minmix
// (cloudwind's choice, DefaultMixCooling). The formulas are those of
// MixingVelocity and GrowthTime (derived).
func TestGrowthModel(t *testing.T) {
	p := fiducial()
	if got := p.WithDefaults().MixCooling; got != CoolMinMix {
		t.Fatalf("default MixCooling = %v, want minmix", got)
	}
	cf := PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}
	for _, k := range MixCoolingKinds() {
		q := p
		q.MixCooling = k
		s := mustDerive(t, q, cf)
		tc := s.CoolingTime(k)
		wantV := MixingVelocity(1, s.CsCold, tc, s.TSoundCold)
		if s.VMix != wantV || s.TGrow != GrowthTime(q.RCloud, q.Chi, wantV) || s.LCoolCold != CoolingLength(s.CsCold, tc) {
			t.Errorf("%v: v_mix %g, t_grow %g, l_cool %g; want them from %s", k, float64(s.VMix), float64(s.TGrow), float64(s.LCoolCold), k.Symbol())
		}
		for _, other := range MixCoolingKinds() {
			q2 := q
			q2.MixCooling = other
			s2 := mustDerive(t, q2, cf)
			if got := s.GrowthTimeWith(other); got != s2.TGrow {
				t.Errorf("GrowthTimeWith(%v) from a %v state = %g, want %g", other, k, float64(got), float64(s2.TGrow))
			}
		}
	}
	bad := p
	bad.MixCooling = 9
	var fe *FieldError
	if err := bad.Validate(); !errors.As(err, &fe) || fe.Field != FieldMixCooling {
		t.Errorf("Validate(MixCooling 9) = %v, want a FieldError on %s", err, FieldMixCooling)
	}
}
