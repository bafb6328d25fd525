package model

import (
	"math"
	"testing"
)

// TestMakePlanWithEvolveDisplacement wires the trajectory into the plan:
// the automatic box along the wind is upstream + x(t_end)/r_cl + tail
// (physics reference §7, derived), with x from Evolve.
func TestMakePlanWithEvolveDisplacement(t *testing.T) {
	p := Fiducial()
	p.RCloud = 30 * Parsec
	cf := PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}
	s := mustDerive(t, p, cf)
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	disp := EvolveDisplacement(cf, c, EvolveSettings{})
	pl, err := MakePlanWith(&s, PlanSettings{}, disp)
	if err != nil {
		t.Fatal(err)
	}
	set := DefaultEvolveSettings()
	set.TEnd = pl.RunTcc
	tr, err := Evolve(&s, c, set)
	if err != nil {
		t.Fatal(err)
	}
	x := tr.X[len(tr.X)-1]
	if !(x > 0) || math.Abs(pl.DisplacementRcl/x-1) > 1e-12 {
		t.Errorf("plan displacement %g r_cl, trajectory ends at %g r_cl", pl.DisplacementRcl, x)
	}
	q := pl.Settings
	if want := q.UpstreamRcl + x + q.TailRcl; math.Abs(pl.BoxAlongRcl/want-1) > 1e-12 {
		t.Errorf("box along %g r_cl, want upstream + x + tail = %g", pl.BoxAlongRcl, want)
	}
	for _, w := range pl.Warnings {
		if w.Code == WarnDisplacementUnknown {
			t.Errorf("displacement known, but the plan warns: %s", w.Message)
		}
	}
}
