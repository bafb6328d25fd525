package model

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// TestConventionSpread: the spread holds the six conventions of f × 𝒩 for
// one cooling function, twelve for two; its r_crit range brackets every
// case; at the fiducial problem with Λ = 10^-21.4 Gronke & Oh's r_crit runs
// from 2.5528 pc (f = 3/2, n²) to 21.717 pc (f = 5/2, n_H²) (derived, five
// figures).
func TestConventionSpread(t *testing.T) {
	cs := BuiltinCriteria()
	cases, sp, err := ConventionSpread(fiducial(), lambdaGO18, nil, cs)
	if err != nil {
		t.Fatal(err)
	}
	if len(cases) != 6 || len(sp) != len(cs) {
		t.Fatalf("%d cases, %d spreads", len(cases), len(sp))
	}
	go18 := sp[0]
	lo, hi := float64(go18.RCritMin/Parsec), float64(go18.RCritMax/Parsec)
	if !scalar.EqualWithinRel(lo, 2.5528, 1e-4) || !scalar.EqualWithinRel(hi, 21.717, 1e-4) {
		t.Errorf("GO18 spread %g–%g pc, want 2.5528–21.717 (derived)", lo, hi)
	}
	for i, s := range sp {
		n := 0
		for k, r := range s.RCrit {
			n += 1
			if !math.IsInf(float64(r), 1) && (r < s.RCritMin || r > s.RCritMax) {
				t.Errorf("%s case %v: r_crit %g outside [%g, %g]", cs[i].ID, cases[k], float64(r), float64(s.RCritMin), float64(s.RCritMax))
			}
		}
		if s.Count[0]+s.Count[1]+s.Count[2] != n || n != 6 {
			t.Errorf("%s: counts %v for %d cases", cs[i].ID, s.Count, n)
		}
	}
	if !sp[len(sp)-1].Unanimous() { // adiabatic: destroyed under every convention
		t.Error("the adiabatic baseline is not unanimous")
	}
	cases, _, err = ConventionSpread(fiducial(), lambdaGO18, ConstantCooling{Value: 1e-22}, cs)
	if err != nil || len(cases) != 12 {
		t.Errorf("with a second cooling function: %d cases, %v", len(cases), err)
	}
}

// TestScoreCriteria: runs built so that a criterion's verdict is known
// (radii far above and below its threshold) score as hits and misses as
// Matches says (a rule of this package).
func TestScoreCriteria(t *testing.T) {
	cs := BuiltinCriteria()
	s := mustDerive(t, fiducial(), lambdaGO18)
	rc := s.Evaluate(&cs[0]).RCrit // gronke-oh-2018
	run := func(r Length, o RunOutcome) SimRun {
		p := fiducial()
		p.RCloud = r
		return SimRun{Params: p, Outcome: o, Label: "test", Source: "constructed"}
	}
	runs := []SimRun{run(100*rc, RunGrew), run(rc/100, RunDestroyed), run(100*rc, RunDestroyed), run(rc/100, RunTransformed)}
	scores, res, err := ScoreCriteria(runs, func(float64) (CoolingFunction, error) { return lambdaGO18, nil }, cs)
	if err != nil || len(res) != 4 {
		t.Fatal(err)
	}
	go18 := scores[0]
	if go18.Hits != 2 || go18.Misses != 2 || go18.Confusion[RunGrew][Survives] != 1 || go18.Confusion[RunDestroyed][Destroyed] != 1 ||
		go18.Confusion[RunDestroyed][Survives] != 1 || go18.Confusion[RunTransformed][Destroyed] != 1 {
		t.Errorf("GO18 score %+v", go18)
	}
	if a := go18.Accuracy(); a != 0.5 {
		t.Errorf("accuracy %g, want 0.5", a)
	}
	fg, _ := CriterionByID(cs, "farber-gronke-2022")
	if !Matches(fg, Transformed, RunTransformed) || Matches(fg, Survives, RunTransformed) || !Matches(&cs[0], Survives, RunTransformed) {
		t.Error("Matches: transformed runs")
	}
	for _, o := range RunOutcomes() {
		if got, err := ParseRunOutcome(o.String()); err != nil || got != o {
			t.Errorf("ParseRunOutcome(%q) = %v, %v", o, got, err)
		}
	}
}
