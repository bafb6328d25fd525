package model

import (
	"errors"
	"math"
	"testing"
)

// Tests of Wind.Carry. The physics is Evolve's with the state of the local
// wind, so the first test checks exactly that; the others check derived
// limits and scalings (each derived in its comment), the events, the
// interpolation, convergence, and two published statements for clouds in a
// Chevalier & Clegg wind: Gronke & Oh 2020's constant growth rate and
// Dutta, Sharma & Gronke 2025's suppressed growth (both qualitative, from
// the abstracts).

// carryWind is the fiducial outflow with the synthetic stub table of
// bench_test.go (no physical source; shape only).
func carryWind(t testing.TB) (Wind, CoolingFunction) {
	t.Helper()
	return mustWind(t, FiducialWind()), newStubTable()
}

func mustCarry(t testing.TB, w *Wind, rCl Length, cf CoolingFunction, c *Criterion, set CarrySettings) CarriedCloud {
	t.Helper()
	cc, err := w.Carry(rCl, cf, c, set)
	if err != nil {
		t.Fatalf("Carry(%g pc, %s, %+v): %v", float64(rCl/Parsec), c.ID, set, err)
	}
	return cc
}

// TestCarryMatchesEvolve: at any state (r, m, v) the carried cloud's
// dm/dt, dv/dt and branch are those of Evolve at t = 0 for the
// wind-tunnel problem at r (CloudParams with r_cl = (3m/(4πρ_cl(r)))^{1/3}
// and v0 = v/v_w(r)), converted from Evolve's units (m0, v_w, t_cc) to
// CGS, for every built-in criterion, every growth model and a mixed set of
// settings.
func TestCarryMatchesEvolve(t *testing.T) {
	cf := newStubTable()
	settings := []EvolveSettings{
		{},
		{Branch: BranchSmooth, Width: 3, MachFactor: true, AlfvenOverWind: 0.5, DragCoefficient: 0.8, Kappa: 3, AreaFactor: 1.3, AlphaV: 0.7},
		{Disable: TermRamDrag | TermLoss},
	}
	states := []struct{ rho, mu, u float64 }{{1, 1, 0}, {0.4, 0.7, 0.05}, {3, 2.5, 0.4}, {20, 1.5, 0.8}}
	for _, kind := range MixCoolingKinds() {
		wp := FiducialWind()
		wp.MixCooling = kind
		w := mustWind(t, wp)
		for _, c := range BuiltinCriteria() {
			for si, set := range settings {
				set = set.WithDefaults()
				for _, st := range states {
					r := Length(st.rho) * w.Params.Radius
					pt := w.At(r)
					rhoCl := float64(MassDensity(ParticleDensity(pt.Pressure, w.Params.TCloud), w.Params.Mu))
					m0 := float64(CloudMass(Parsec, Density(rhoCl)))
					o := newCarryODE(&w, cf, &c, set, m0)
					l := o.local([]float64{st.mu, st.u, st.rho})
					p, err := w.CloudParams(r, Length(l.rCl))
					if err != nil {
						t.Fatal(err)
					}
					s := mustDerive(t, p, cf)
					es := set
					es.V0, es.TEnd = st.u*float64(w.VInf)/float64(pt.V), 1e-3
					tr := mustEvolve(t, &s, &c, es)
					where := func(what string) string {
						return what + " (" + kind.String() + ", " + c.ID + ", settings " + string(rune('0'+si)) + ")"
					}
					near(t, where("m = μ m0 vs State.MassCold"), st.mu*m0, float64(s.MassCold), 1e-12)
					dm := tr.dm[0] * float64(s.MassCold) / float64(s.TCC)
					dv := tr.dv[0] * float64(s.VWind) / float64(s.TCC)
					if math.Abs(l.mdot-dm) > 1e-10*math.Abs(dm) || math.Abs(l.dvdt-dv) > 1e-10*math.Abs(dv) || math.Abs(l.s-tr.S[0]) > 1e-12*tr.S[0] {
						t.Errorf("%s at r = %g R, m = %g m0, v = %g v_∞: dm/dt %.12g, dv/dt %.12g, S %g; Evolve %.12g, %.12g, %g",
							where("carried"), st.rho, st.mu, st.u, l.mdot, l.dvdt, l.s, dm, dv, tr.S[0])
					}
				}
			}
		}
	}
}

// always is a criterion that holds everywhere on these paths (α = 10⁹), so
// S = 1: the growth branch alone.
var always = Criterion{ID: "always", Cool: CoolMix, Dyn: DynCloudCrushing, Alpha: 1e9,
	Range: Calibration{Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded()}}

// TestCarryGrowthScaling: on the growth branch (S = 1, no Mach factor)
// with the default growth model t_cool,minmix = f k_B T_m²/(ξ P Λ(T_m)),
// whose temperature T_m stays fixed while T_hot > T_m (for the stub table
// T_m = 10^4.2 K, the foot of its steep drop),
//
//	ṁ = ρ_hot v_mix 4π r_cl²,  v_mix ∝ (t_cool/r_cl)^{-1/4} ∝ P^{1/4} r_cl^{1/4},
//	r_cl ∝ (m/P)^{1/3}   ⇒   ṁ ∝ ρ_hot P^{-1/2} m^{3/4}   (derived),
//
// so ṁ/(ρ_hot P^{-1/2} m^{3/4}) is one constant along the path while
// T_hot(r) > T_m (to ~90 R here; beyond, the minimum sits at T_hot).
// For r ≫ R (ρ_hot ∝ r^{-2}, P ∝ r^{-10/3}) this is ṁ ∝ r^{-1/3} m^{3/4}:
// the rate is constant only where m grows as r^{4/9} (derived).
func TestCarryGrowthScaling(t *testing.T) {
	w, cf := carryWind(t)
	for _, rCl := range []Length{0.3 * Parsec, 3 * Parsec} {
		cc := mustCarry(t, &w, rCl, cf, &always, CarrySettings{R0: w.Params.Radius})
		tm := mustDerive(t, cc.Launch, cf).TMinMix
		k0, checked := 0.0, 0
		for i := range cc.R {
			pt := w.At(cc.R[i])
			if pt.T <= tm {
				continue
			}
			checked++
			k := float64(cc.MDot[i]) / (float64(pt.Rho) / math.Sqrt(float64(pt.Pressure)) * math.Pow(cc.M[i], 0.75))
			if i == 0 {
				k0 = k
				continue
			}
			if math.Abs(k/k0-1) > 1e-12 {
				t.Fatalf("r_cl = %g pc, r = %g R: ṁ/(ρ_hot P^{-1/2} m^{3/4}) = %.15g, at launch %.15g", float64(rCl/Parsec), float64(cc.R[i]/w.Params.Radius), k, k0)
			}
		}
		if checked < len(cc.R)/2 {
			t.Errorf("r_cl = %g pc: only %d of %d samples have T_hot > T_m = %g K", float64(rCl/Parsec), checked, len(cc.R), float64(tm))
		}
		if cc.Stop != StopReached || cc.S[len(cc.S)-1] != 1 {
			t.Errorf("r_cl = %g pc: stop %v, S = %g at the end; want the growth branch to 100 R", float64(rCl/Parsec), cc.Stop, cc.S[len(cc.S)-1])
		}
	}
}

// TestCarryGronkeOh2020 is our measurement against a qualitative published
// statement: Gronke & Oh 2020 (arXiv:1907.04771, abstract) find that in a
// Chevalier & Clegg wind "the mass growth rate is constant". With the
// fiducial outflow, the stub table and the gronke-oh-2018 branch, a 1 pc
// cloud launched at rest at R grows from R to 9.3 R (then the criterion
// fails and it is destroyed), and over that stretch dm/dt stays within 6.8%
// of its mean ((max − min)/mean; slope d ln ṁ/d ln r = −0.03): constant, as
// stated. The tolerance 0.1 covers the measurement, not a published number.
// It holds only in a band of sizes (TestCarryGrowthScaling): we measured
// spreads of 0.81 (slope +0.56) for 0.1 pc and 1.06 (slope −0.26) for 30 pc
// clouds launched at R, checked here as "≥ 0.5 with slopes of opposite
// sign".
func TestCarryGronkeOh2020(t *testing.T) {
	w, cf := carryWind(t)
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	bigR := w.Params.Radius
	spread := func(rCl Length) GrowthRateSpread {
		cc := mustCarry(t, &w, rCl, cf, c, CarrySettings{R0: bigR})
		lo, hi, ok := cc.GrowingPath()
		if !ok {
			t.Fatalf("r_cl = %g pc: no growing stretch", float64(rCl/Parsec))
		}
		g, err := cc.GrowthSpread(lo, hi)
		if err != nil || !g.Growing {
			t.Fatalf("r_cl = %g pc: GrowthSpread = %+v, %v", float64(rCl/Parsec), g, err)
		}
		return g
	}
	g := spread(Parsec)
	if g.RLo != bigR || !(g.RHi > 5*bigR) || !(g.Spread < 0.1) || !(math.Abs(g.SlopeR) < 0.1) {
		t.Errorf("1 pc at R: dm/dt over %g–%g R: spread %.3g, slope %.3g; want a stretch beyond 5 R with spread < 0.1 and |slope| < 0.1",
			float64(g.RLo/bigR), float64(g.RHi/bigR), g.Spread, g.SlopeR)
	}
	small, large := spread(0.1*Parsec), spread(30*Parsec)
	if !(small.Spread > 0.5 && large.Spread > 0.5 && small.SlopeR > 0 && large.SlopeR < 0) {
		t.Errorf("0.1 pc: spread %.3g, slope %.3g; 30 pc: spread %.3g, slope %.3g; want both spreads > 0.5, slopes of opposite sign",
			small.Spread, small.SlopeR, large.Spread, large.SlopeR)
	}
}

// TestCarryDuttaSuppressed checks the direction of Dutta, Sharma & Gronke
// 2025 (arXiv:2506.08545, abstract): along a
// Chevalier & Clegg wind χ falls steeply downstream and cold-mass growth
// is suppressed compared with a plane-parallel wind. The plane-parallel
// wind is Evolve on the launch conditions (Launch), same criterion and
// settings. At every common time the carried cloud has grown less, and
// the suppression deepens downstream: our measurement of
// (m − m0)_carried/(m − m0)_tunnel at equal times falls from 0.89 at 1.5 R
// to 0.50 at 9 R, checked as "decreasing, and below 0.6 at 9 R". χ falls
// below a quarter of χ(r0) by 3 R (T ∝ r^{-4/3} alone gives 3^{-4/3} ≈
// 0.23 for r ≫ R; derived); we measured 0.15.
func TestCarryDuttaSuppressed(t *testing.T) {
	w, cf := carryWind(t)
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	bigR := w.Params.Radius
	cc := mustCarry(t, &w, Parsec, cf, c, CarrySettings{R0: bigR})
	s := mustDerive(t, cc.Launch, cf)
	tr := mustEvolve(t, &s, c, EvolveSettings{TEnd: 1.2 * float64(cc.T[len(cc.T)-1]/cc.TCC0)})
	p9, ok := cc.AtRadius(9 * bigR)
	if !ok {
		t.Fatal("the carried cloud did not reach 9 R")
	}
	for i := 1; i <= 50; i++ {
		tt := p9.T * Time(float64(i)/50)
		p, _ := cc.AtTime(tt)
		m, _, _ := tr.At(float64(tt / cc.TCC0))
		if !(p.M < m) {
			t.Errorf("t = %g Myr: carried m = %.6g m0, wind tunnel %.6g m0; want less growth along the outflow", float64(tt/Megayear), p.M, m)
		}
	}
	prev := 1.0
	for _, rho := range []float64{1.5, 2, 3, 5, 7, 9} {
		p, _ := cc.AtRadius(Length(rho) * bigR)
		m, _, _ := tr.At(float64(p.T / cc.TCC0))
		f := (p.M - 1) / (m - 1)
		if !(f < prev) || rho == 9 && !(f < 0.6) {
			t.Errorf("at %g R: growth carried/tunnel = %.3g (previous %.3g); want decreasing, below 0.6 at 9 R", rho, f, prev)
		}
		prev = f
		if p.Chi >= cc.Chi[0] {
			t.Errorf("χ(%g R) = %.3g ≥ χ(r0) = %.3g", rho, p.Chi, cc.Chi[0])
		}
	}
	if p3, _ := cc.AtRadius(3 * bigR); !(p3.Chi < 0.25*cc.Chi[0]) {
		t.Errorf("χ(3 R) = %.3g, χ(R) = %.3g; want a steep fall", p3.Chi, cc.Chi[0])
	}
}

// TestCarryDestructionOnly: the adiabatic baseline (S = 0) with ram drag
// off and v0 = 0: nothing moves the cloud, so r stays r0, and
// dm/dt = −m/(κ t_cc) with t_cc ∝ r_cl ∝ m^{1/3} gives
// m = m0 (1 − t/(3κ t_cc,0))³, destroyed at 2.7κ t_cc,0 (derived, as
// TestEvolveDestructionOnly).
func TestCarryDestructionOnly(t *testing.T) {
	w, cf := carryWind(t)
	ad, _ := CriterionByID(BuiltinCriteria(), "adiabatic")
	for _, kappa := range []float64{2, 4} {
		cc := mustCarry(t, &w, Parsec, cf, ad, CarrySettings{R0: 2 * w.Params.Radius,
			ODE: EvolveSettings{Kappa: kappa, Disable: TermRamDrag, RelTol: 1e-11, AbsTol: 1e-14}})
		if cc.Stop != StopDestroyed {
			t.Fatalf("κ = %g: stop %v, want destroyed", kappa, cc.Stop)
		}
		near(t, "TDestroy/(κ t_cc,0)", float64(cc.TDestroy/cc.TCC0)/kappa, 2.7, 1e-8)
		for i := range cc.T {
			want := math.Pow(1-float64(cc.T[i]/cc.TCC0)/(3*kappa), 3)
			if math.Abs(cc.M[i]-want) > 1e-9 || cc.R[i] != 2*w.Params.Radius || cc.V[i] != 0 {
				t.Fatalf("κ = %g, t = %g t_cc: m = %.12g (want %.12g), r = %g R, v = %g", kappa, float64(cc.T[i]/cc.TCC0), cc.M[i], want, float64(cc.R[i]/w.Params.Radius), float64(cc.V[i]))
			}
		}
		if cc.RDestroy != 2*w.Params.Radius || !math.IsNaN(float64(cc.REntrain)) || !math.IsNaN(float64(cc.RDouble)) {
			t.Errorf("κ = %g: RDestroy %g, REntrain %g, RDouble %g; want r0, NaN, NaN", kappa, float64(cc.RDestroy), float64(cc.REntrain), float64(cc.RDouble))
		}
	}
}

// TestCarryEvents: where and why runs stop, and the events located on the
// interpolant.
func TestCarryEvents(t *testing.T) {
	w, cf := carryWind(t)
	bigR := w.Params.Radius
	dragOnly := EvolveSettings{Disable: TermGrowth | TermLoss}
	// Drag alone (constant mass) carries the cloud to REnd, exactly there.
	cc := mustCarry(t, &w, 0.1*Parsec, cf, &always, CarrySettings{R0: bigR, REnd: 30 * bigR, ODE: dragOnly})
	n := len(cc.R) - 1
	if cc.Stop != StopReached || cc.R[n] != 30*bigR || cc.RStop != 30*bigR {
		t.Errorf("drag only to 30 R: stop %v at %g R (last sample %g R)", cc.Stop, float64(cc.RStop/bigR), float64(cc.R[n]/bigR))
	}
	for i := range cc.M {
		if cc.M[i] != 1 {
			t.Fatalf("drag only: m = %g at %g R, want 1", cc.M[i], float64(cc.R[i]/bigR))
		}
	}
	// Entrainment where |v_w − v| = 0.1 v_w (EntrainedSpeed).
	if math.IsNaN(float64(cc.REntrain)) {
		t.Fatalf("drag only to 30 R, 0.1 pc: not entrained")
	}
	p, _ := cc.AtRadius(cc.REntrain)
	near(t, "|v_w − v|/v_w at REntrain", float64((p.VWind-p.V)/p.VWind), EntrainedSpeed, 1e-6)
	near(t, "t at REntrain", float64(p.T), float64(cc.TEntrain), 1e-9)
	// Beyond RChiOne the run stops there.
	cc = mustCarry(t, &w, 10*Parsec, cf, &always, CarrySettings{R0: bigR, REnd: 2 * w.RChiOne, ODE: dragOnly})
	if cc.Stop != StopColdWind || cc.RStop != w.RChiOne || cc.R[len(cc.R)-1] != w.RChiOne {
		t.Errorf("REnd beyond RChiOne: stop %v at %g R, want cold-wind at RChiOne = %g R", cc.Stop, float64(cc.RStop/bigR), float64(w.RChiOne/bigR))
	}
	// A short TMax.
	tmax := Time(0.01 * float64(bigR) / float64(w.VInf))
	cc = mustCarry(t, &w, Parsec, cf, &always, CarrySettings{R0: bigR, TMax: tmax})
	if n := len(cc.T) - 1; cc.Stop != StopTime || cc.T[n] != tmax || cc.RStop != cc.R[n] {
		t.Errorf("TMax: stop %v at t = %g (want %g)", cc.Stop, float64(cc.T[n]), float64(tmax))
	}
	// Launched at the wind speed: entrained at launch.
	v0 := w.At(2 * bigR).V
	cc = mustCarry(t, &w, Parsec, cf, &always, CarrySettings{R0: 2 * bigR, V0: v0, REnd: 3 * bigR})
	if cc.REntrain != 2*bigR || cc.TEntrain != 0 {
		t.Errorf("launched at v_w: REntrain %g R, TEntrain %g; want r0, 0", float64(cc.REntrain/bigR), float64(cc.TEntrain))
	}
	// Doubling where m = 2 m0.
	cc = mustCarry(t, &w, Parsec, cf, &always, CarrySettings{R0: bigR})
	if math.IsNaN(float64(cc.RDouble)) {
		t.Fatal("growth branch: mass did not double")
	}
	p, _ = cc.AtRadius(cc.RDouble)
	near(t, "m at RDouble", p.M, DoubledMass, 1e-6)
	near(t, "t at RDouble", float64(p.T), float64(cc.TDouble), 1e-9)
}

// TestCarryInterpolation: AtRadius and AtTime reproduce the samples, are
// consistent with each other between samples, and the cold mass flux of a
// steady stream is launched · m(r)/m0 (derived, ColdMassFlux).
func TestCarryInterpolation(t *testing.T) {
	w, cf := carryWind(t)
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	cc := mustCarry(t, &w, Parsec, cf, c, CarrySettings{R0: w.Params.Radius})
	for i := range cc.R {
		p, ok := cc.AtRadius(cc.R[i])
		q, ok2 := cc.AtTime(cc.T[i])
		if !ok || !ok2 {
			t.Fatalf("sample %d: outside the path", i)
		}
		for _, x := range []CarriedPoint{p, q} {
			if math.Abs(x.M/cc.M[i]-1) > 1e-12 || math.Abs(float64(x.T-cc.T[i])) > 1e-9*float64(cc.T[len(cc.T)-1]) ||
				math.Abs(float64(x.V-cc.V[i])) > 1e-9*float64(w.VInf) || math.Abs(float64(x.R/cc.R[i])-1) > 1e-12 {
				t.Fatalf("sample %d at %g R: interpolated %+v, sample m %g, t %g, v %g", i, float64(cc.R[i]/w.Params.Radius), x, cc.M[i], float64(cc.T[i]), float64(cc.V[i]))
			}
		}
		if i > 0 { // midway in time: the same state by either route
			mid, _ := cc.AtTime((cc.T[i-1] + cc.T[i]) / 2)
			back, ok := cc.AtRadius(mid.R)
			if !ok || math.Abs(back.M/mid.M-1) > 1e-9 || math.Abs(float64(back.T/mid.T)-1) > 1e-9 {
				t.Fatalf("between samples %d and %d: AtTime %+v, AtRadius %+v", i-1, i, mid, back)
			}
		}
	}
	launched := MassRate(0.1 * float64(SolarMassPerYear))
	for _, rho := range []float64{1, 2, 5} {
		p, _ := cc.AtRadius(Length(rho) * w.Params.Radius)
		f, ok := cc.ColdMassFlux(Length(rho)*w.Params.Radius, launched)
		if !ok || f != MassRate(float64(launched)*p.M) {
			t.Errorf("ColdMassFlux(%g R) = %g, %v; want launched × m/m0 = %g", rho, float64(f), ok, float64(launched)*p.M)
		}
	}
	if f, _ := cc.ColdMassFlux(w.Params.Radius, launched); f != launched {
		t.Errorf("ColdMassFlux(r0) = %g, want the launched flux %g", float64(f), float64(launched))
	}
	for _, r := range []Length{w.Params.Radius / 2, 1e3 * w.Params.Radius, Length(math.NaN())} {
		if _, ok := cc.AtRadius(r); ok {
			t.Errorf("AtRadius(%g) reports a point outside the path", float64(r))
		}
		if _, ok := cc.ColdMassFlux(r, launched); ok {
			t.Errorf("ColdMassFlux(%g) reports a flux outside the path", float64(r))
		}
	}
	if _, ok := cc.AtTime(-1); ok {
		t.Error("AtTime(−1) reports a point")
	}
	if _, err := cc.GrowthSpread(1e3*w.Params.Radius, 2e3*w.Params.Radius); err == nil {
		t.Error("GrowthSpread outside the path: no error")
	}
}

// TestCarryConvergence: the state at 20 R converges as the tolerance
// shrinks, each tolerance closer to a 1e-12 reference than the one before.
func TestCarryConvergence(t *testing.T) {
	w, cf := carryWind(t)
	final := func(tol float64) (float64, float64) {
		cc := mustCarry(t, &w, 3*Parsec, cf, &always, CarrySettings{R0: w.Params.Radius / 2, REnd: 20 * w.Params.Radius,
			ODE: EvolveSettings{RelTol: tol, AbsTol: tol * 1e-2, MachFactor: true}})
		n := len(cc.M) - 1
		return cc.M[n], float64(cc.T[n])
	}
	mRef, tRef := final(1e-12)
	prevM, prevT := math.Inf(1), math.Inf(1)
	for _, tol := range []float64{1e-4, 1e-6, 1e-8, 1e-10} {
		m, tt := final(tol)
		dM, dT := math.Abs(m/mRef-1), math.Abs(tt/tRef-1)
		if !(dM < prevM || dM < 1e-11) || !(dT < prevT || dT < 1e-11) || dM > 100*tol || dT > 100*tol {
			t.Errorf("tol %g: |Δm|/m = %.3g, |Δt|/t = %.3g (previous %.3g, %.3g); want decreasing and below 100 tol", tol, dM, dT, prevM, prevT)
		}
		prevM, prevT = dM, dT
	}
}

func TestCarryValidate(t *testing.T) {
	w, cf := carryWind(t)
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	bigR := w.Params.Radius
	for _, tc := range []struct {
		name  string
		set   CarrySettings
		field string
	}{
		{"no r0", CarrySettings{}, FieldLaunchRadius},
		{"r0 NaN", CarrySettings{R0: Length(math.NaN())}, FieldLaunchRadius},
		{"r0 beyond RChiOne", CarrySettings{R0: 2 * w.RChiOne}, FieldLaunchRadius},
		{"v0 < 0", CarrySettings{R0: bigR, V0: -1}, FieldLaunchSpeed},
		{"v0 huge", CarrySettings{R0: bigR, V0: 1e3 * w.VInf}, FieldLaunchSpeed},
		{"REnd ≤ r0", CarrySettings{R0: bigR, REnd: bigR / 2}, FieldEndRadius},
		{"TMax < 0", CarrySettings{R0: bigR, TMax: -1}, FieldMaxTime},
		{"κ < 0", CarrySettings{R0: bigR, ODE: EvolveSettings{Kappa: -1}}, "kappa"},
		{"fragmented", CarrySettings{R0: bigR, ODE: EvolveSettings{Area: AreaFragmented}}, "area"},
	} {
		_, err := w.Carry(Parsec, cf, c, tc.set)
		var fe *FieldError
		if !errors.As(err, &fe) || fe.Field != tc.field {
			t.Errorf("%s: Carry error %v, want a *FieldError on %q", tc.name, err, tc.field)
		}
	}
	set := CarrySettings{R0: bigR}
	var fe *FieldError
	if _, err := w.Carry(0, cf, c, set); !errors.As(err, &fe) || fe.Field != FieldRCloud {
		t.Errorf("r_cl = 0: %v, want a *FieldError on radius", err)
	}
	if _, err := w.Carry(Parsec, nil, c, set); err == nil {
		t.Error("nil cooling function: no error")
	}
	if _, err := w.Carry(Parsec, cf, nil, set); err == nil {
		t.Error("nil criterion: no error")
	}
	if _, err := w.Carry(Parsec, cf, &Criterion{ID: "x", Cool: CoolMix, Alpha: -1}, set); err == nil {
		t.Error("invalid criterion: no error")
	}
	if s := (CarryStop(9)).String(); s != "CarryStop(9)" || StopColdWind.String() != "cold-wind" {
		t.Errorf("CarryStop strings: %q, %q", s, StopColdWind.String())
	}
}
