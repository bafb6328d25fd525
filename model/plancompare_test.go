package model

import (
	"math"
	"testing"
)

// TestMakePlanTrajectory wires the trajectory into the plan: the automatic
// box along the wind is upstream + x(t_end)/r_cl + tail (derived), with x
// from an independent Evolve of the same branch to the same end time.
func TestMakePlanTrajectory(t *testing.T) {
	p := Fiducial()
	p.RCloud = 30 * Parsec
	cf := PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}
	r, err := Evaluate(p, cf, BuiltinCriteria())
	if err != nil {
		t.Fatal(err)
	}
	pl, err := MakePlan(&r, PlanSettings{})
	if err != nil {
		t.Fatal(err)
	}
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	tr, err := Evolve(&r.State, c, EvolveSettings{TEnd: pl.RunTcc})
	if err != nil {
		t.Fatal(err)
	}
	x := tr.X[len(tr.X)-1]
	if !(x > 0) || math.Abs(pl.DisplacementRcl/x-1) > 1e-6 {
		t.Errorf("plan displacement %g r_cl, trajectory ends at %g r_cl", pl.DisplacementRcl, x)
	}
	q := pl.Settings
	if want := q.UpstreamRcl + pl.DisplacementRcl + q.TailRcl; math.Abs(pl.BoxAlongRcl/want-1) > 1e-12 {
		t.Errorf("box along %g r_cl, want upstream + x + tail = %g", pl.BoxAlongRcl, want)
	}
	for _, w := range pl.Warnings {
		if w.Code == WarnDisplacementUnknown {
			t.Errorf("displacement integrated, but the plan warns: %s", w.Message)
		}
	}
}
