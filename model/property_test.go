package model_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"cloudwind/cooling"
	"cloudwind/model"
)

// Property tests over random valid inputs drawn across the documented
// ranges of the literature (χ 10–10⁵, M 0.1–10, P/k_B 10–10⁷ K cm⁻³, T_cl
// 10³–10⁵ K, r_cl 10⁻³–10³ pc, Z 0–3 Z☉; the input ranges cloudwind
// documents, common practice, no source) with the built-in cooling curve.
// The expectations are properties of the formulas (derived), not values:
// no NaN or negative time reaches the output, the closed forms of r_crit
// scale as they say, and a wind faster than light always carries a caution.

// randomParams draws a valid problem, log-uniformly where the literature
// spans decades.
func randomParams(rng *rand.Rand) model.Params {
	logU := func(lo, hi float64) float64 { return math.Pow(10, lo+(hi-lo)*rng.Float64()) }
	p := model.Params{
		Chi:         logU(1, 5),
		Mach:        logU(-1, 1),
		Pressure:    model.Pressure(logU(1, 7)),
		TCloud:      model.Temperature(logU(3, 5)),
		RCloud:      model.Length(logU(-3, 3)) * model.Parsec,
		Metallicity: 3 * rng.Float64(),
	}
	if rng.IntN(4) == 0 {
		p.HeatCapacity = model.Isobaric
	}
	if rng.IntN(4) == 0 {
		p.DensityProduct = model.N2
	}
	return p
}

// finiteOrInf reports whether a time is a number ≥ 0 or +Inf (a time that
// does not exist, such as a cooling time without cooling).
func finiteOrInf(v float64) bool { return v >= 0 && !math.IsNaN(v) }

func builtinAt(t *testing.T, b *cooling.Builtin, z float64) model.CoolingFunction {
	t.Helper()
	cf, err := b.At(z)
	if err != nil {
		t.Fatalf("Builtin.At(%g): %v", z, err)
	}
	return cf
}

func TestPropertiesEvaluate(t *testing.T) {
	b, err := cooling.NewBuiltin()
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(1, 2))
	cs := model.BuiltinCriteria()
	const n = 3000
	for i := 0; i < n; i++ {
		p := randomParams(rng)
		if p.Validate() != nil {
			continue // e.g. T_hot above the accepted range at χ = 10⁵, T_cl = 10⁵ K
		}
		cf := builtinAt(t, b, p.Metallicity)
		r, err := model.Evaluate(p, cf, cs)
		if err != nil {
			t.Fatalf("Evaluate(%+v) = %v", p, err)
		}
		s := &r.State
		for name, v := range map[string]model.Time{"t_cc": s.TCC, "t_shear": s.TShear, "t_drag": s.TDrag, "t_cool,hot": s.TCoolHot,
			"t_cool,mix": s.TCoolMix, "t_cool,cl": s.TCoolCold, "t_cool,minmix": s.TCoolMinMix, "t_grow": s.TGrow, "t_sc,cl": s.TSoundCold} {
			if !finiteOrInf(float64(v)) {
				t.Fatalf("Evaluate(%+v): %s = %g, want ≥ 0 or +Inf", p, name, float64(v))
			}
		}
		for _, q := range model.Quantities() {
			if v := q.Value(s); math.IsNaN(v) {
				t.Fatalf("Evaluate(%+v): quantity %s is NaN", p, q.Key)
			}
		}
		if float64(s.VWind) >= model.SpeedOfLight && !hasCaution(s, model.FieldMach) {
			t.Fatalf("Evaluate(%+v): v_w = %g c without a caution", p, float64(s.VWind)/model.SpeedOfLight)
		}
		// r_crit ∝ v_w ∝ M at fixed thermal state (closed form, derived):
		// doubling the Mach number doubles every finite threshold radius.
		r2 := r
		r2.Outcomes = append([]model.Outcome(nil), r.Outcomes...)
		if p.Mach*2 <= model.MaxMach {
			if err := r2.Reevaluate(p.Mach*2, p.RCloud); err != nil {
				t.Fatal(err)
			}
		}
		for k, o := range r.Outcomes {
			if math.IsNaN(o.Ratio) || o.Ratio < 0 || math.IsNaN(float64(o.RCrit)) || o.RCrit < 0 {
				t.Fatalf("Evaluate(%+v): %s ratio %g, r_crit %g", p, cs[k].ID, o.Ratio, float64(o.RCrit))
			}
			rc := float64(o.RCrit)
			c := &cs[k]
			linear := c.Cool != model.CoolShocked && c.Cool != model.CoolGrow && c.Dyn != model.DynTurbulentCC
			if linear && p.Mach*2 <= model.MaxMach && rc > 0 && !math.IsInf(rc, 0) {
				if got := float64(r2.Outcomes[k].RCrit) / rc; math.Abs(got-2) > 1e-9 {
					t.Fatalf("%s: r_crit(2M)/r_crit(M) = %.12g, want 2 (%+v)", cs[k].ID, got, p)
				}
			}
		}
	}
}

// TestPropertiesRoundTrip: every criterion evaluated at its own threshold
// radius returns its threshold (the closed form of r_crit, derived), and
// the uncertainty band brackets r_crit.
func TestPropertiesRoundTrip(t *testing.T) {
	b, err := cooling.NewBuiltin()
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(7, 8))
	cs := model.BuiltinCriteria()
	for i := 0; i < 500; i++ {
		p := randomParams(rng)
		p.MachTurb = rng.Float64()
		if p.Validate() != nil {
			continue
		}
		r, err := model.Evaluate(p, builtinAt(t, b, p.Metallicity), cs)
		if err != nil {
			t.Fatal(err)
		}
		for k, o := range r.Outcomes {
			if !o.HasThreshold() || o.RCrit < model.MinRCloud || o.RCrit > model.MaxRCloud {
				continue
			}
			if !(o.RCritLow <= o.RCrit && o.RCrit <= o.RCritHigh) {
				t.Fatalf("%s: band [%g, %g] does not hold r_crit %g", cs[k].ID, float64(o.RCritLow), float64(o.RCritHigh), float64(o.RCrit))
			}
			r2 := r
			r2.Outcomes = append([]model.Outcome(nil), r.Outcomes...)
			r2.Cautions = append([]model.Caution(nil), r.Cautions...)
			if err := r2.Reevaluate(p.Mach, o.RCrit); err != nil {
				t.Fatal(err)
			}
			if got := r2.Outcomes[k].Ratio / r2.Outcomes[k].Threshold; math.Abs(got-1) > 1e-9 {
				t.Fatalf("%s at its r_crit: ratio/threshold = %.12g, want 1 (%+v)", cs[k].ID, got, p)
			}
		}
	}
}

func hasCaution(s *model.State, field string) bool {
	for _, c := range s.Cautions {
		if c.Field == field {
			return true
		}
	}
	return false
}

// TestPropertiesFasterThanLight: a wind at or above c always carries a
// caution, whatever else the inputs are.
func TestPropertiesFasterThanLight(t *testing.T) {
	p := model.Fiducial()
	p.Chi, p.Mach = 1e7, 100 // v_w ≈ 16 c with T_cl = 10⁴ K
	r, err := model.Evaluate(p, model.ConstantCooling{Value: 1e-22}, model.BuiltinCriteria())
	if err != nil {
		t.Fatal(err)
	}
	if !hasCaution(&r.State, model.FieldMach) {
		t.Errorf("v_w = %g c: no caution in %v", float64(r.VWind)/model.SpeedOfLight, r.Cautions)
	}
	// Reevaluate to a slow wind drops the caution; back again restores it.
	if err := r.Reevaluate(0.1, p.RCloud); err != nil || hasCaution(&r.State, model.FieldMach) {
		t.Errorf("after Reevaluate(M = 0.1): %v, cautions %v", err, r.Cautions)
	}
	if err := r.Reevaluate(100, 2e6*model.Kiloparsec/1000); err != nil || !hasCaution(&r.State, model.FieldMach) || !hasCaution(&r.State, model.FieldRCloud) {
		t.Errorf("after Reevaluate(M = 100, 2 Mpc): %v, cautions %v", err, r.Cautions)
	}
}

func TestPropertiesEvolveAndPlan(t *testing.T) {
	b, err := cooling.NewBuiltin()
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(3, 4))
	cs := model.BuiltinCriteria()
	const n = 300
	for i := 0; i < n; i++ {
		p := randomParams(rng)
		if p.Validate() != nil {
			continue
		}
		cf := builtinAt(t, b, p.Metallicity)
		r, err := model.Evaluate(p, cf, cs)
		if err != nil {
			t.Fatal(err)
		}
		c := &cs[rng.IntN(len(cs))]
		tr, err := model.Evolve(&r.State, c, model.EvolveSettings{TEnd: 50})
		if err != nil {
			t.Fatalf("Evolve(%+v, %s) = %v", p, c.ID, err)
		}
		for k := range tr.T {
			if !(tr.T[k] >= 0) || !(tr.M[k] >= 0) || math.IsNaN(tr.V[k]) || math.IsNaN(tr.X[k]) || math.IsInf(tr.M[k], 0) {
				t.Fatalf("Evolve(%+v, %s): sample %d t=%g m=%g v=%g x=%g", p, c.ID, k, tr.T[k], tr.M[k], tr.V[k], tr.X[k])
			}
		}
		pl, err := model.MakePlan(&r, model.PlanSettings{})
		if err != nil {
			t.Fatalf("MakePlan(%+v) = %v", p, err)
		}
		for name, v := range map[string]float64{"cells": pl.Cells, "steps": pl.Steps, "cell-updates": pl.CellUpdates,
			"core-hours": pl.CoreHours, "memory": pl.MemoryBytes, "run": pl.RunTcc, "Δt": float64(pl.Dt), "Δx": float64(pl.Dx)} {
			if !(v > 0) || math.IsInf(v, 0) {
				t.Fatalf("MakePlan(%+v): %s = %g, want finite and > 0", p, name, v)
			}
		}
	}
}

// TestPropertiesRadiusFree: a quantity that says it is radius-free
// (Quantity.RadiusFree) keeps its value bit for bit when only the cloud
// radius changes, through Reevaluate with the same Mach number and through
// a full Evaluate; every other quantity changes at some of the points
// (derived from State.deriveRadius, no source). Sweeps rely on the first
// to read such columns once along their radius axis.
func TestPropertiesRadiusFree(t *testing.T) {
	b, err := cooling.NewBuiltin()
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(5, 6))
	cs := model.BuiltinCriteria()
	qs := model.Quantities()
	changed := make([]bool, len(qs))
	tested := 0
	for tested < 500 {
		p := randomParams(rng)
		if p.Validate() != nil {
			continue
		}
		cf := builtinAt(t, b, p.Metallicity)
		r, err := model.Evaluate(p, cf, cs)
		if err != nil {
			t.Fatalf("Evaluate(%+v) = %v", p, err)
		}
		r2 := p
		r2.RCloud *= model.Length(math.Pow(10, 2*rng.Float64()-1))
		if r2.Validate() != nil {
			continue
		}
		tested++
		fast := r
		fast.Outcomes = append([]model.Outcome(nil), r.Outcomes...)
		if err := fast.Reevaluate(p.Mach, r2.RCloud); err != nil {
			t.Fatalf("Reevaluate(%g, %g): %v", p.Mach, float64(r2.RCloud), err)
		}
		full, err := model.Evaluate(r2, cf, cs)
		if err != nil {
			t.Fatalf("Evaluate(%+v) = %v", r2, err)
		}
		for i, q := range qs {
			v0, vFast, vFull := q.Value(&r.State), q.Value(&fast.State), q.Value(&full.State)
			same := math.Float64bits(v0) == math.Float64bits(vFast) && math.Float64bits(v0) == math.Float64bits(vFull)
			if q.RadiusFree() && !same {
				t.Fatalf("%s is radius-free but changes from %v to %v (Reevaluate) and %v (Evaluate) at %+v, r_cl → %g cm",
					q.Key, v0, vFast, vFull, p, float64(r2.RCloud))
			}
			changed[i] = changed[i] || !same
		}
	}
	for i, q := range qs {
		if !q.RadiusFree() && !changed[i] {
			t.Errorf("%s is not radius-free but never changed with the radius at %d points", q.Key, tested)
		}
	}
}
