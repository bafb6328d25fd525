package model

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// Tests of Evolve against the analytic limits of its ODE (accretion only,
// fragmented growth, ram drag only, destruction only; derived in the
// comments here). Tolerances: the integrator runs at RelTol 1e-10 or
// tighter, so DERIVED values are required to 1e-7 relative unless a
// comment says otherwise.

// evolveCooling is the analytic cooling function of these tests (no
// physical source; a single power law keeps every cooling time finite).
var evolveCooling = PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}

// alwaysGrows is a criterion that holds at every radius reached here
// (α = 10⁹), so S = 1: the growth branch alone.
var alwaysGrows = Criterion{ID: "always", Cool: CoolMix, Dyn: DynCloudCrushing, Alpha: 1e9,
	Range: Calibration{Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded()}}

func evolveState(t *testing.T, rCl Length) State {
	t.Helper()
	p := fiducial()
	p.RCloud = rCl
	return mustDerive(t, p, evolveCooling)
}

func mustEvolve(t *testing.T, s *State, c *Criterion, set EvolveSettings) Trajectory {
	t.Helper()
	tr, err := Evolve(s, c, set)
	if err != nil {
		t.Fatalf("Evolve(%s, %+v): %v", c.ID, set, err)
	}
	return tr
}

// growthTime returns t_grow,0/t_cc,0 = [χ r0/(3 f_A v_mix,0)]/[χ^{1/2} r0/v_w]
// computed in CGS from the State, with v_mix,0 = α_v c_s,cl (t_cool,cl/t_sc,cl)^{-1/4}
// ([TOG21] form; t_grow for a sphere derived).
func growthTime(s *State, alphaV, fA float64) float64 {
	chi, r0 := s.Params.Chi, float64(s.Params.RCloud)
	vmix := alphaV * float64(s.CsCold) * math.Pow(float64(s.TCoolCold)/(r0/float64(s.CsCold)), -0.25)
	tcc := math.Sqrt(chi) * r0 / float64(s.VWind)
	return chi * r0 / (3 * fA * vmix) / tcc
}

// TestEvolveAccretionOnly: S = 1 and no ram drag. Momentum conservation
// gives Δv = Δv0 m0/m (derived); the sphere grows as
// m = m0 (1 + t/(4 t_grow,0))⁴ (derived, AreaSphere). So the cloud is
// entrained (Δv/Δv0 = 0.1 at m/m0 = 10) at t = 4 t_grow,0 (10^{1/4} − 1)
// and doubles at t = 4 t_grow,0 (2^{1/4} − 1) (derived).
func TestEvolveAccretionOnly(t *testing.T) {
	s := evolveState(t, Parsec)
	tr := mustEvolve(t, &s, &alwaysGrows, EvolveSettings{Disable: TermRamDrag, RelTol: 1e-11, AbsTol: 1e-13})
	tg := growthTime(&s, 1, 1)
	near(t, "TGrow0", tr.TGrow0, tg, 1e-12)
	near(t, "TGrow0 vs State.TGrow/State.TCC", tr.TGrow0, float64(s.TGrow/s.TCC), 1e-12)
	for i, ti := range tr.T {
		want := math.Pow(1+ti/(4*tg), 4)
		if math.Abs(tr.M[i]-want) > 1e-8*want {
			t.Fatalf("m(%g)/m0 = %.10g, want (1 + t/(4 t_grow))⁴ = %.10g", ti, tr.M[i], want)
		}
		if d := (1 - tr.V[i]) * tr.M[i]; math.Abs(d-1) > 1e-8 {
			t.Fatalf("Δv m/(Δv0 m0) at t = %g: %.10g, want 1", ti, d)
		}
		if tr.S[i] != 1 {
			t.Fatalf("S(%g) = %g, want 1", ti, tr.S[i])
		}
	}
	near(t, "TEntrain (m/m0 = 10)", tr.TEntrain, 4*tg*(math.Pow(10, 0.25)-1), 1e-7)
	near(t, "TDouble", tr.TDouble, 4*tg*(math.Pow(2, 0.25)-1), 1e-7)
	m, v, _ := tr.At(tr.TEntrain)
	near(t, "m/m0 at TEntrain", m, 10, 1e-7)
	near(t, "Δv/Δv0 at TEntrain", 1-v, 0.1, 1e-6)
	if !math.IsNaN(tr.TDestroy) || tr.Destroyed || tr.Capped || tr.T[len(tr.T)-1] != DefaultTEnd {
		t.Errorf("accretion only: stopped at %g (destroyed %v, capped %v, TDestroy %g), want t_end = %g",
			tr.T[len(tr.T)-1], tr.Destroyed, tr.Capped, tr.TDestroy, DefaultTEnd)
	}
}

// TestEvolveFragmented: with A ∝ m and v_mix frozen at r0 the mass grows
// as m0 exp(t/t_grow,0), t_grow,0 = χ r0/(3 f_A v_mix,0) (derived),
// and with accretion only Δv = Δv0 e^{−t/t_grow,0} (momentum conservation).
// So TDouble = t_grow,0 ln 2 and TEntrain = t_grow,0 ln 10 (derived).
func TestEvolveFragmented(t *testing.T) {
	s := evolveState(t, Parsec)
	set := EvolveSettings{Area: AreaFragmented, Disable: TermRamDrag, AreaFactor: 1.5, AlphaV: 0.7, RelTol: 1e-11, AbsTol: 1e-13}
	tr := mustEvolve(t, &s, &alwaysGrows, set)
	tg := growthTime(&s, 0.7, 1.5)
	near(t, "TGrow0", tr.TGrow0, tg, 1e-12)
	for i, ti := range tr.T {
		if want := math.Exp(ti / tg); math.Abs(tr.M[i]-want) > 1e-8*want {
			t.Fatalf("m(%g)/m0 = %.10g, want exp(t/t_grow) = %.10g", ti, tr.M[i], want)
		}
		if want := math.Exp(-ti / tg); math.Abs(1-tr.V[i]-want) > 1e-8 {
			t.Fatalf("Δv(%g)/v_w = %.10g, want exp(−t/t_grow) = %.10g", ti, 1-tr.V[i], want)
		}
	}
	near(t, "TDouble", tr.TDouble, tg*math.Ln2, 1e-7)
	near(t, "TEntrain", tr.TEntrain, tg*math.Ln10, 1e-7)

	// Past MassCap the run stops there: m0 e^{t/t_grow} = 10¹² at t = t_grow ln 10¹².
	set.TEnd = 1000
	tr = mustEvolve(t, &s, &alwaysGrows, set)
	n := len(tr.T) - 1
	if !tr.Capped || tr.Destroyed {
		t.Fatalf("fragmented to t = 1000 t_cc: capped %v, destroyed %v, want capped", tr.Capped, tr.Destroyed)
	}
	near(t, "m at the cap", tr.M[n], MassCap, 1e-6)
	near(t, "time of the cap", tr.T[n], tg*math.Log(MassCap), 1e-6)
}

// TestEvolveRamDragOnly: no growth and no loss (constant m and r), C_D = 1.
// Then Δv = Δv0/(1 + t/t_drag), t_drag = (8/(3 C_D)) χ r/Δv0 (derived),
// so at t = t_drag Δv = v_w/2 for Δv0 = v_w;
// entrainment (Δv = 0.1 v_w) at 9 t_drag; and x = χ^{1/2}(t − t_drag
// ln(1 + t/t_drag)) r0 per t_cc,0 (derived by integrating v). The wind
// field multiplies the drag by (1 + v_A²/v_w²) (McCourt et al. 2015), which
// divides t_drag by it.
func TestEvolveRamDragOnly(t *testing.T) {
	s := evolveState(t, Parsec)
	tcc := float64(s.TCC)
	for _, c := range []struct{ v0, vA float64 }{{0, 0}, {0.5, 0}, {0, 1}, {-0.5, 0.5}} {
		set := EvolveSettings{Disable: TermGrowth | TermLoss, DragCoefficient: 1, V0: c.v0, AlfvenOverWind: c.vA,
			TEnd: 400, RelTol: 1e-11, AbsTol: 1e-13}
		tr := mustEvolve(t, &s, &alwaysGrows, set)
		dv0 := 1 - c.v0
		// (8/(3 C_D)) χ r/Δv0 in CGS, over t_cc, over (1 + v_A²/v_w²).
		td := 8.0 / 3 * s.Params.Chi * float64(s.Params.RCloud) / (dv0 * float64(s.VWind)) / tcc / (1 + c.vA*c.vA)
		for i, ti := range tr.T {
			if want := dv0 / (1 + ti/td); math.Abs(1-tr.V[i]-want) > 1e-8 {
				t.Fatalf("v0 %g, v_A %g: Δv(%g) = %.10g, want Δv0/(1 + t/t_drag) = %.10g", c.v0, c.vA, ti, 1-tr.V[i], want)
			}
			if tr.M[i] != 1 {
				t.Fatalf("m(%g) = %g with growth and loss off, want 1", ti, tr.M[i])
			}
		}
		_, v, x := tr.At(td)
		near(t, "Δv/Δv0 at t_drag", (1-v)/dv0, 0.5, 1e-7)
		wantX := math.Sqrt(s.Params.Chi) * (td - dv0*td*math.Log(2))
		near(t, "x(t_drag)/r0", x, wantX, 1e-7)
		if dv0 > EntrainedSpeed {
			near(t, "TEntrain = t_drag (Δv0/0.1 − 1)", tr.TEntrain, td*(dv0/EntrainedSpeed-1), 1e-7)
		}
	}
}

// TestEvolveDestructionOnly: S = 0 (the adiabatic baseline) and no ram
// drag. dm/dt = −m/(κ t_cc(r)) with t_cc ∝ r ∝ m^{1/3} gives
// d(m^{1/3})/dt = −1/(3κ t_cc,0), so m^{1/3} = m0^{1/3}(1 − t/(3κ t_cc,0)),
// and m = 10⁻³ m0 (m^{1/3} = 0.1 m0^{1/3}) at t = 0.9·3κ = 2.7κ t_cc,0
// (derived). Lost mass carries its own momentum,
// so v stays v0. With ram drag on the mass history is unchanged.
func TestEvolveDestructionOnly(t *testing.T) {
	s := evolveState(t, Parsec)
	adiabatic, _ := CriterionByID(BuiltinCriteria(), "adiabatic")
	for _, kappa := range []float64{2, 4, 10} {
		for _, drag := range []bool{false, true} {
			set := EvolveSettings{Kappa: kappa, V0: 0.3, RelTol: 1e-11, AbsTol: 1e-14}
			if !drag {
				set.Disable = TermRamDrag
			}
			tr := mustEvolve(t, &s, adiabatic, set)
			n := len(tr.T) - 1
			if !tr.Destroyed {
				t.Fatalf("κ = %g: not destroyed by t = %g", kappa, tr.T[n])
			}
			near(t, "TDestroy/κ", tr.TDestroy/kappa, 2.7, 1e-9)
			near(t, "last sample time", tr.T[n], tr.TDestroy, 1e-15)
			near(t, "last sample mass", tr.M[n], DestroyedMass, 1e-8)
			for i, ti := range tr.T {
				want := math.Pow(1-ti/(3*kappa), 3)
				if math.Abs(tr.M[i]-want) > 1e-9 {
					t.Fatalf("κ = %g: m(%g) = %.12g, want (1 − t/(3κ))³ = %.12g", kappa, ti, tr.M[i], want)
				}
				if !drag && tr.V[i] != 0.3 {
					t.Fatalf("κ = %g: v(%g) = %.17g, want v0 = 0.3 exactly", kappa, ti, tr.V[i])
				}
				if tr.S[i] != 0 {
					t.Fatalf("κ = %g: S(%g) = %g, want 0", kappa, ti, tr.S[i])
				}
			}
			// Hermite interpolation is exact for this cubic m(t) (derived).
			m, _, _ := tr.At(0.5 * tr.TDestroy)
			near(t, "At(TDestroy/2)", m, math.Pow(1-0.5*2.7/3, 3), 1e-9)
			if !math.IsNaN(tr.TDouble) || !math.IsNaN(tr.TEntrain) {
				t.Errorf("κ = %g: TDouble %g, TEntrain %g, want NaN (not reached)", kappa, tr.TDouble, tr.TEntrain)
			}
		}
	}
}

// mixedSetup is a cloud of f times the threshold radius of gronke-oh-2018
// (t_cool,mix/t_cc = 1 at f = 1) on the smooth branch, so S starts at
// 1/(1 + f⁻⁴) and growth, loss, accretion drag and ram drag (magnetised,
// Mach factor on) all act at once.
func mixedSetup(t *testing.T, f Length) (State, *Criterion, EvolveSettings) {
	t.Helper()
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	s0 := evolveState(t, Parsec)
	s := evolveState(t, f*s0.Evaluate(c).RCrit)
	set := EvolveSettings{Branch: BranchSmooth, Width: 4, MachFactor: true, AlfvenOverWind: 0.5, DragCoefficient: 0.7,
		Kappa: 3, AreaFactor: 1.3, AlphaV: 0.8, V0: 0.2, TEnd: 8}
	return s, c, set
}

// TestEvolveMomentumBudget checks the momentum bookkeeping of Evolve's ODE
//
//	d(m v)/dt = ṁ_grow v_w − ṁ_loss v + F_drag,   dm/dt = ṁ_grow − ṁ_loss,
//
// along the mixed trajectory: the left sides by central finite differences
// (δ = 10⁻³ t_cc,0) of runs that end exactly at t ± δ, the right sides
// recomputed here in CGS from Evolve's ODE with the State's quantities. The
// tolerance, 10⁻⁶ of the largest term, covers the O(δ²) difference error.
func TestEvolveMomentumBudget(t *testing.T) {
	s, c, set := mixedSetup(t, 1) // S falls from 0.5 to 0.05 by t = 8 t_cc
	set.RelTol, set.AbsTol = 1e-13, 1e-15
	chi, m0 := s.Params.Chi, float64(s.MassCold)
	vw, rhoCl, rhoHot := float64(s.VWind), float64(s.RhoCold), float64(s.RhoHot)
	tcc0 := float64(s.TCC)
	end := func(te float64) (m, v float64) {
		set.TEnd = te
		tr := mustEvolve(t, &s, c, set)
		n := len(tr.T) - 1
		return tr.M[n] * m0, tr.V[n] * vw // CGS
	}
	const delta = 1e-3
	for _, tk := range []float64{0.5, 1, 2, 4, 7} {
		m, v := end(tk)
		mp, vp := end(tk + delta)
		mm, vm := end(tk - delta)
		dmv := (mp*vp - mm*vm) / (2 * delta * tcc0)
		dm := (mp - mm) / (2 * delta * tcc0)
		// Right-hand sides of Evolve's ODE, CGS.
		r := math.Cbrt(3 * m / (4 * math.Pi * rhoCl))
		dv := vw - v
		tccR := math.Sqrt(chi) * r / vw
		ratio := float64(s.TCoolMix) / tccR // gronke-oh-2018: t_cool,mix/t_cc(r), threshold 1
		S := 1 / (1 + math.Pow(ratio, set.Width))
		vmix := set.AlphaV * float64(s.CsCold) * math.Pow(float64(s.TCoolCold)*float64(s.CsCold)/r, -0.25)
		vmix *= math.Sqrt(math.Abs(dv) / float64(s.CsHot))
		grow := S * rhoHot * vmix * set.AreaFactor * 4 * math.Pi * r * r
		loss := (1 - S) * m / (set.Kappa * tccR)
		fd := 0.5 * set.DragCoefficient * rhoHot * dv * math.Abs(dv) * math.Pi * r * r * (1 + set.AlfvenOverWind*set.AlfvenOverWind)
		want := grow*vw - loss*v + fd
		scale := math.Max(math.Abs(grow*vw), math.Max(math.Abs(loss*v), math.Abs(fd)))
		if math.Abs(dmv-want) > 1e-6*scale {
			t.Errorf("t = %g t_cc: d(mv)/dt = %.9g, want ṁ_grow v_w − ṁ_loss v + F_drag = %.9g (terms %.3g, %.3g, %.3g)",
				tk, dmv, want, grow*vw, -loss*v, fd)
		}
		if math.Abs(dm-(grow-loss)) > 1e-6*math.Max(grow, loss) {
			t.Errorf("t = %g t_cc: dm/dt = %.9g, want ṁ_grow − ṁ_loss = %.9g", tk, dm, grow-loss)
		}
		if !(S > 0.01 && S < 0.99) {
			t.Errorf("t = %g t_cc: S = %g, want a mixed state", tk, S)
		}
	}
}

// TestEvolveConvergence: the final m and v of a mixed trajectory (at twice
// the threshold radius: S rises from 0.94 towards 1 and the cloud grows)
// converge as the tolerance shrinks from 1e-4 to 1e-10, against a 1e-13
// reference, with every difference smaller than the one before.
func TestEvolveConvergence(t *testing.T) {
	s, c, set := mixedSetup(t, 2)
	set.TEnd = 30
	final := func(tol float64) (float64, float64) {
		set.RelTol, set.AbsTol = tol, tol*1e-2
		tr := mustEvolve(t, &s, c, set)
		n := len(tr.T) - 1
		return tr.M[n], tr.V[n]
	}
	mRef, vRef := final(1e-13)
	prevM, prevV := math.Inf(1), math.Inf(1)
	for _, tol := range []float64{1e-4, 1e-6, 1e-8, 1e-10} {
		m, v := final(tol)
		dM, dV := math.Abs(m-mRef)/mRef, math.Abs(v-vRef)
		if !(dM < prevM) || !(dV < prevV) || dM > 100*tol || dV > 100*tol {
			t.Errorf("tol %g: |Δm|/m = %.3g, |Δv| = %.3g (previous %.3g, %.3g); want decreasing and below 100 tol",
				tol, dM, dV, prevM, prevV)
		}
		prevM, prevV = dM, dV
	}
	if m, _ := final(1e-8); !(m > 2) {
		t.Errorf("convergence trajectory: m(30 t_cc) = %g m0, want a growing cloud", m)
	}
}

// TestEvolveSmoothApproachesSharp: with ratio/threshold = 1/2 (r0 = 2
// r_crit) the sharp branch has S = 1 throughout; the smooth one has
// S = 1/(1 + 2^{−n}) at t = 0 and approaches it as n grows. With
// ratio/threshold = 2 the same holds for S = 0 and destruction at 2.7κ.
func TestEvolveSmoothApproachesSharp(t *testing.T) {
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	s0 := evolveState(t, Parsec)
	rc := s0.Evaluate(c).RCrit
	for _, f := range []Length{2, 0.5} {
		s := evolveState(t, f*rc)
		sharp := mustEvolve(t, &s, c, EvolveSettings{TEnd: 30, RelTol: 1e-12, AbsTol: 1e-14})
		end := func(tr Trajectory) float64 { return tr.M[len(tr.M)-1] }
		prev := math.Inf(1)
		for _, n := range []float64{2, 4, 8, 16, 32, 64} {
			smooth := mustEvolve(t, &s, c, EvolveSettings{TEnd: 30, Branch: BranchSmooth, Width: n, RelTol: 1e-12, AbsTol: 1e-14})
			d := math.Abs(math.Log(end(smooth) / end(sharp)))
			if !(d < prev) && d > 1e-9 {
				t.Errorf("r0 = %g r_crit, n = %g: |ln(m_smooth/m_sharp)| = %.3g, not below %.3g", float64(f), n, d, prev)
			}
			if n == 64 && d > 1e-6 {
				t.Errorf("r0 = %g r_crit, n = 64: |ln(m_smooth/m_sharp)| = %.3g, want < 1e-6", float64(f), d)
			}
			prev = d
		}
		if f == 0.5 {
			near(t, "sharp TDestroy below r_crit", sharp.TDestroy, 2.7*DefaultKappa, 1e-8)
		} else if sharp.S[0] != 1 || sharp.Destroyed {
			t.Errorf("r0 = 2 r_crit: S0 = %g, destroyed %v; want growth", sharp.S[0], sharp.Destroyed)
		}
	}
}

// TestEvolveEntrainedAtStart: a cloud already within 0.1 v_w of the wind
// has TEntrain = 0.
func TestEvolveEntrainedAtStart(t *testing.T) {
	s := evolveState(t, Parsec)
	tr := mustEvolve(t, &s, &alwaysGrows, EvolveSettings{V0: 0.95, TEnd: 5})
	if tr.TEntrain != 0 {
		t.Errorf("V0 = 0.95: TEntrain = %g, want 0", tr.TEntrain)
	}
}

// TestEvolveSettingsValidate: every invalid setting is named.
func TestEvolveSettingsValidate(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		key string
		set EvolveSettings
	}{
		{"kappa", EvolveSettings{Kappa: -4}},
		{"kappa", EvolveSettings{Kappa: nan}},
		{"alpha_v", EvolveSettings{AlphaV: -1}},
		{"alpha_v", EvolveSettings{AlphaV: inf}},
		{"area_factor", EvolveSettings{AreaFactor: -0.5}},
		{"drag_coefficient", EvolveSettings{DragCoefficient: -1}},
		{"alfven_over_wind", EvolveSettings{AlfvenOverWind: -0.1}},
		{"v0", EvolveSettings{V0: nan}},
		{"v0", EvolveSettings{V0: 1e3}},
		{"width", EvolveSettings{Width: -4}},
		{"t_end", EvolveSettings{TEnd: -1}},
		{"t_end", EvolveSettings{TEnd: inf}},
		{"rel_tol", EvolveSettings{RelTol: 1}},
		{"rel_tol", EvolveSettings{RelTol: 1e-20}},
		{"abs_tol", EvolveSettings{AbsTol: -1e-9}},
		{"max_steps", EvolveSettings{MaxSteps: -5}},
		{"branch", EvolveSettings{Branch: 2}},
		{"area", EvolveSettings{Area: -1}},
		{"disable", EvolveSettings{Disable: 8}},
	}
	s := evolveState(t, Parsec)
	keys := map[string]bool{}
	for _, k := range DefaultEvolveSettings().Constants() {
		keys[k.Key] = true
	}
	for i, c := range cases {
		var fe *FieldError
		err := c.set.Validate()
		if !errors.As(err, &fe) || fe.Field != c.key {
			t.Errorf("case %d: Validate() = %v, want a *FieldError on %s", i, err, c.key)
			continue
		}
		if !keys[fe.Field] {
			t.Errorf("case %d: field %q is not a Constants key", i, fe.Field)
		}
		if _, err := Evolve(&s, &alwaysGrows, c.set); !errors.As(err, &fe) || fe.Field != c.key {
			t.Errorf("case %d: Evolve accepted invalid %s (err %v)", i, c.key, err)
		}
	}
	if err := (EvolveSettings{}).Validate(); err != nil {
		t.Errorf("zero settings: Validate() = %v", err)
	}
	// Invalid state and criterion.
	if _, err := Evolve(nil, &alwaysGrows, EvolveSettings{}); err == nil {
		t.Errorf("Evolve(nil state) = nil error")
	}
	if _, err := Evolve(&State{}, &alwaysGrows, EvolveSettings{}); err == nil {
		t.Errorf("Evolve(zero State) = nil error")
	}
	bad := alwaysGrows
	bad.Alpha = -1
	if _, err := Evolve(&s, &bad, EvolveSettings{}); err == nil {
		t.Errorf("Evolve(criterion with α = −1) = nil error")
	}
	if _, err := Evolve(&s, nil, EvolveSettings{}); err == nil {
		t.Errorf("Evolve(nil criterion) = nil error")
	}
}

// TestEvolveMaxSteps: a spent step budget returns the partial trajectory
// and an error wrapping ErrMaxSteps.
func TestEvolveMaxSteps(t *testing.T) {
	s := evolveState(t, Parsec)
	tr, err := Evolve(&s, &alwaysGrows, EvolveSettings{MaxSteps: 3})
	if !errors.Is(err, ErrMaxSteps) {
		t.Fatalf("Evolve with MaxSteps 3: error %v, want ErrMaxSteps", err)
	}
	if len(tr.T) != 4 || tr.Steps != 3 {
		t.Errorf("Evolve with MaxSteps 3: %d samples, %d steps; want 4 and 3", len(tr.T), tr.Steps)
	}
}

// TestEvolveConstants: every setting is listed once with a status, the
// defaults agree with DefaultEvolveSettings, and the settings the physics
// reference marks FROM MEMORY say so.
func TestEvolveConstants(t *testing.T) {
	ks := DefaultEvolveSettings().Constants()
	if len(ks) != 15 {
		t.Errorf("Constants() lists %d settings, want 15 (every EvolveSettings field)", len(ks))
	}
	seen := map[string]bool{}
	for _, k := range ks {
		if seen[k.Key] || k.Key == "" || k.Name == "" || k.Symbol == "" || k.Status == "" {
			t.Errorf("Constants(): bad or duplicate entry %+v", k)
		}
		seen[k.Key] = true
		if k.Value != k.Default || k.Text != k.DefText {
			t.Errorf("Constants() of the defaults: %s = %g (%q), default %g (%q)", k.Key, k.Value, k.Text, k.Default, k.DefText)
		}
	}
	want := map[string]float64{"alpha_v": 1, "area_factor": 1, "kappa": 4, "drag_coefficient": 0.5, "alfven_over_wind": 0,
		"mach_factor": 0, "v0": 0, "width": 4, "t_end": 100}
	for _, k := range ks {
		if w, ok := want[k.Key]; ok && k.Default != w {
			t.Errorf("default of %s = %g, want %g", k.Key, k.Default, w)
		}
		switch k.Key {
		case "alpha_v", "area_factor", "kappa", "drag_coefficient", "mach_factor":
			if !strings.Contains(k.Status, "from memory") {
				t.Errorf("status of %s does not say 'from memory': %q", k.Key, k.Status)
			}
		case "width":
			if !strings.Contains(k.Status, "not a published result") {
				t.Errorf("status of width: %q", k.Status)
			}
		}
	}
	got := EvolveSettings{MachFactor: true, Area: AreaFragmented, Kappa: 7}.Constants()
	for _, k := range got {
		if k.Key == "mach_factor" && (k.Text != "on" || k.Value != 1) || k.Key == "area" && k.Text != "fragmented" ||
			k.Key == "kappa" && k.Value != 7 {
			t.Errorf("Constants(): %s = %g (%q)", k.Key, k.Value, k.Text)
		}
	}
	for _, name := range []string{"sharp", "smooth"} {
		if b, err := ParseBranchMode(name); err != nil || b.String() != name {
			t.Errorf("ParseBranchMode(%q) = %v, %v", name, b, err)
		}
	}
	for _, name := range []string{"sphere", "fragmented"} {
		if a, err := ParseAreaModel(name); err != nil || a.String() != name {
			t.Errorf("ParseAreaModel(%q) = %v, %v", name, a, err)
		}
	}
	if _, err := ParseAreaModel("cube"); err == nil {
		t.Errorf("ParseAreaModel(cube) = nil error")
	}
}

// TestEvolveNoSilentNaN runs every criterion under every switch, for
// clouds well below, at and above threshold and with cooling functions
// that include Λ = 0, and requires finite series.
func TestEvolveNoSilentNaN(t *testing.T) {
	cfs := []CoolingFunction{evolveCooling, ConstantCooling{0}, lambdaGO18, newStubTable()}
	cs := BuiltinCriteria()
	for _, cf := range cfs {
		for _, r := range []Length{1e-3 * Parsec, Parsec, 100 * Parsec} {
			p := fiducial()
			p.RCloud = r
			s := mustDerive(t, p, cf)
			for i := range cs {
				for _, set := range []EvolveSettings{
					{}, {Branch: BranchSmooth, MachFactor: true},
					{Area: AreaFragmented, V0: 2, AlfvenOverWind: 3, TEnd: 300},
				} {
					tr, err := Evolve(&s, &cs[i], set)
					if err != nil {
						t.Fatalf("%s, %v, r = %g pc, %+v: %v", cs[i].ID, cf, float64(r/Parsec), set, err)
					}
					for j := range tr.T {
						for _, v := range []float64{tr.T[j], tr.M[j], tr.V[j], tr.X[j], tr.S[j]} {
							if math.IsNaN(v) || math.IsInf(v, 0) {
								t.Fatalf("%s, r = %g pc, %+v: non-finite sample %d", cs[i].ID, float64(r/Parsec), set, j)
							}
						}
					}
					if math.IsNaN(tr.Ratio0) || math.IsNaN(tr.TGrow0) {
						t.Fatalf("%s: Ratio0 %g, TGrow0 %g", cs[i].ID, tr.Ratio0, tr.TGrow0)
					}
				}
			}
		}
	}
}

// TestTrajectoryAt: At reproduces the samples, clamps outside the run and
// handles an empty or hand-built Trajectory without panicking.
func TestTrajectoryAt(t *testing.T) {
	s, c, set := mixedSetup(t, 1)
	tr := mustEvolve(t, &s, c, set)
	for i := range tr.T {
		m, v, x := tr.At(tr.T[i])
		if m != tr.M[i] || v != tr.V[i] || x != tr.X[i] {
			t.Fatalf("At(T[%d] = %g) = %g, %g, %g, want the sample %g, %g, %g", i, tr.T[i], m, v, x, tr.M[i], tr.V[i], tr.X[i])
		}
	}
	n := len(tr.T) - 1
	for _, c := range []struct {
		t float64
		i int
	}{{-1, 0}, {math.NaN(), 0}, {1e9, n}, {math.Inf(1), n}} {
		if m, v, x := tr.At(c.t); m != tr.M[c.i] || v != tr.V[c.i] || x != tr.X[c.i] {
			t.Errorf("At(%g) = %g, %g, %g, want sample %d", c.t, m, v, x, c.i)
		}
	}
	var empty Trajectory
	if m, v, x := empty.At(1); m != 0 || v != 0 || x != 0 {
		t.Errorf("empty At(1) = %g, %g, %g", m, v, x)
	}
	hand := Trajectory{T: []float64{0, 2}, M: []float64{1, 3}, V: []float64{0, 1}, X: []float64{0, 4}}
	if m, v, x := hand.At(1); m != 2 || v != 0.5 || x != 2 {
		t.Errorf("hand-built At(1) = %g, %g, %g, want linear 2, 0.5, 2", m, v, x)
	}
}

// BenchmarkEvolve integrates the fiducial cloud (1 pc, destroyed at
// 2.7κ t_cc under gronke-oh-2018) and a 30 pc cloud that survives to
// t_end = 100 t_cc, with the default settings.
func BenchmarkEvolve(b *testing.B) {
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	for _, bc := range []struct {
		name string
		r    Length
	}{{"fiducial-1pc", Parsec}, {"survives-30pc", 30 * Parsec}} {
		b.Run(bc.name, func(b *testing.B) {
			p := fiducial()
			p.RCloud = bc.r
			s, err := Derive(p, evolveCooling)
			if err != nil {
				b.Fatal(err)
			}
			var tr Trajectory
			b.ReportAllocs()
			for b.Loop() {
				if tr, err = Evolve(&s, c, EvolveSettings{TEnd: 100}); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(tr.Steps), "steps/op")
			b.ReportMetric(float64(tr.Evals), "evals/op")
		})
	}
}

// TestEvolveGrowthNote: a branch that says "grows" but whose mass has not
// doubled by the end of the run is reported with the long time named (a
// rule of Evolve); a doubling run and a destroyed cloud carry no note.
func TestEvolveGrowthNote(t *testing.T) {
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	p := fiducial()
	p.RCloud = 30 * Parsec
	p.MixCooling = CoolCold
	cf := PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}
	s := mustDerive(t, p, cf)
	tr, err := Evolve(&s, c, EvolveSettings{TEnd: 0.1 * float64(GrowthTime(p.RCloud, p.Chi, s.VMix)/s.TCC)})
	if err != nil {
		t.Fatal(err)
	}
	if tr.S[0] != 1 || !strings.Contains(tr.GrowthNote, "t_cool,cold") || !strings.Contains(tr.GrowthNote, "reaches only") {
		t.Errorf("short run of a growing branch: S0 = %g, note %q", tr.S[0], tr.GrowthNote)
	}
	tr, err = Evolve(&s, c, EvolveSettings{TEnd: 1e4})
	if err != nil || math.IsNaN(tr.TDouble) || tr.GrowthNote != "" {
		t.Errorf("long run: doubled at %g, note %q, %v", tr.TDouble, tr.GrowthNote, err)
	}
	p.RCloud = 0.01 * Parsec
	s = mustDerive(t, p, cf)
	if tr, err = Evolve(&s, c, EvolveSettings{}); err != nil || tr.GrowthNote != "" {
		t.Errorf("destroyed cloud: note %q, %v", tr.GrowthNote, err)
	}
}
