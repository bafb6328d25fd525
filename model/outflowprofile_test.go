package model

import (
	"errors"
	"math"
	"testing"
)

// TestWindProfile: every row is what Evaluate gives on CloudParams at that
// radius (the profile adds no physics of its own), the grid is log-spaced
// with exact ends, rows beyond RChiOne carry CloudParams' error, and the
// profile's cooling radius is CoolingRadius's.
func TestWindProfile(t *testing.T) {
	w := mustWind(t, FiducialWind())
	cf := newStubTable()
	cs := BuiltinCriteria()
	bigR := w.Params.Radius
	grid := ProfileGrid{RMin: bigR / 10, RMax: 2 * w.RChiOne, Points: 61}
	rCl := 2 * Parsec
	prof, err := w.Profile(rCl, cf, cs, grid)
	if err != nil {
		t.Fatal(err)
	}
	if len(prof.Rows) != 61 || prof.Rows[0].Wind.R != grid.RMin || prof.Rows[60].Wind.R != grid.RMax {
		t.Fatalf("grid: %d rows from %g to %g, want 61 from %g to %g", len(prof.Rows), float64(prof.Rows[0].Wind.R), float64(prof.Rows[60].Wind.R), float64(grid.RMin), float64(grid.RMax))
	}
	step := math.Log(float64(grid.RMax/grid.RMin)) / 60
	beyond, disagree := 0, 0
	for i, row := range prof.Rows {
		r := row.Wind.R
		near(t, "log step", math.Log(float64(r/grid.RMin)), float64(i)*step, 1e-12)
		if row.Wind != w.At(r) {
			t.Errorf("row %d: wind %+v, want At(r) = %+v", i, row.Wind, w.At(r))
		}
		if tc := w.CoolingTime(r, cf); row.TCool != tc || row.Adiabatic != (tc > row.Wind.TFlow) {
			t.Errorf("row %d: t_cool %g, adiabatic %v; want %g, %v", i, float64(row.TCool), row.Adiabatic, float64(tc), tc > row.Wind.TFlow)
		}
		p, perr := w.CloudParams(r, rCl)
		if perr != nil {
			var fe *FieldError
			if row.Err == nil || !errors.As(row.Err, &fe) || fe.Field != FieldChi || row.Outcomes != nil || r <= w.RChiOne {
				t.Errorf("row %d at %g R (RChiOne %g R): Err %v, outcomes %v; want χ's FieldError beyond RChiOne only", i, float64(r/bigR), float64(w.RChiOne/bigR), row.Err, row.Outcomes)
			}
			beyond++
			continue
		}
		res, err := Evaluate(p, cf, cs)
		if err != nil || row.Err != nil {
			t.Fatalf("row %d: Evaluate %v, row error %v", i, err, row.Err)
		}
		if !sameOutcomes(row.Outcomes, res.Outcomes) || row.Disagree != TellsApart(&res) || row.TCC != res.TCC || row.TCoolMix != res.TCoolMix || row.TGrow != res.TGrow {
			t.Errorf("row %d at %g R: outcomes %+v (disagree %v), want Evaluate's %+v (%v)", i, float64(r/bigR), row.Outcomes, row.Disagree, res.Outcomes, TellsApart(&res))
		}
		if row.Disagree {
			disagree++
		}
	}
	if beyond == 0 || beyond == len(prof.Rows) {
		t.Errorf("%d rows beyond RChiOne, want some but not all with this grid", beyond)
	}
	if disagree == 0 {
		t.Errorf("no row where the criteria disagree; the built-in thresholds differ by ×10 (li-2020 vs gronke-oh-2018), so some radius should separate them")
	}
	rc, ok, err := w.CoolingRadius(cf, grid.RMin, grid.RMax)
	if err != nil || ok != prof.Cools {
		t.Fatalf("CoolingRadius: %v, %v; profile Cools %v", ok, err, prof.Cools)
	}
	if ok {
		near(t, "profile RCool vs CoolingRadius", float64(prof.RCool), float64(rc), 1e-10)
	}

	// Defaults: 200 radii from 0.1 R to 100 R.
	def, err := w.Profile(rCl, cf, cs, ProfileGrid{})
	if err != nil {
		t.Fatal(err)
	}
	if n := len(def.Rows); n != DefaultProfilePoints || def.Rows[0].Wind.R != DefaultProfileMin*bigR || def.Rows[n-1].Wind.R != DefaultProfileMax*bigR {
		t.Errorf("default grid: %d rows from %g R to %g R", n, float64(def.Rows[0].Wind.R/bigR), float64(def.Rows[n-1].Wind.R/bigR))
	}

	for _, c := range []struct {
		name string
		rCl  Length
		cf   CoolingFunction
		cs   []Criterion
		g    ProfileGrid
	}{
		{"nil cooling", rCl, nil, cs, grid},
		{"no radius", 0, cf, cs, grid},
		{"one point", rCl, cf, cs, ProfileGrid{Points: 1}},
		{"reversed", rCl, cf, cs, ProfileGrid{RMin: 2 * bigR, RMax: bigR}},
		{"bad criterion", rCl, cf, []Criterion{{ID: "Bad"}}, grid},
	} {
		if _, err := w.Profile(c.rCl, c.cf, c.cs, c.g); err == nil {
			t.Errorf("Profile (%s): no error", c.name)
		}
	}
}

// sameOutcomes compares outcomes field by field, NaN equal to NaN (the
// adiabatic baseline's threshold).
func sameOutcomes(a, b []Outcome) bool {
	if len(a) != len(b) {
		return false
	}
	same := func(x, y float64) bool { return x == y || math.IsNaN(x) && math.IsNaN(y) }
	for i := range a {
		x, y := a[i], b[i]
		if !same(x.Ratio, y.Ratio) || !same(x.Threshold, y.Threshold) || !same(float64(x.RCrit), float64(y.RCrit)) ||
			!same(x.Margin, y.Margin) || x.Verdict != y.Verdict || x.Leaves != y.Leaves {
			return false
		}
	}
	return true
}

// TestWindProfileAllocations: the profile's allocations do not grow with
// the number of radii (one Result is reused, outcomes share one array).
func TestWindProfileAllocations(t *testing.T) {
	w := mustWind(t, FiducialWind())
	cf, cs := newStubTable(), BuiltinCriteria()
	allocs := func(n int) float64 {
		return testing.AllocsPerRun(5, func() {
			if _, err := w.Profile(Parsec, cf, cs, ProfileGrid{Points: n}); err != nil {
				t.Fatal(err)
			}
		})
	}
	if a, b := allocs(20), allocs(400); a != b || b > 10 {
		t.Errorf("Profile allocations: %g for 20 radii, %g for 400; want the same, at most 10", a, b)
	}
}

// TestWindProfileScaling: at fixed radius the criteria's threshold radii
// do not depend on r_cl (derived: τ_cool does not depend on
// it and both τ_dyn ∝ r_cl), so two profiles for different clouds share
// r_crit(r) row by row, and the verdict flips where r_cl crosses it.
func TestWindProfileScaling(t *testing.T) {
	w := mustWind(t, FiducialWind())
	cf, cs := newStubTable(), BuiltinCriteria()
	a, err := w.Profile(0.3*Parsec, cf, cs, ProfileGrid{Points: 40})
	if err != nil {
		t.Fatal(err)
	}
	b, err := w.Profile(30*Parsec, cf, cs, ProfileGrid{Points: 40})
	if err != nil {
		t.Fatal(err)
	}
	for i := range a.Rows {
		for j, oa := range a.Rows[i].Outcomes {
			ob := b.Rows[i].Outcomes[j]
			if !oa.HasThreshold() {
				continue
			}
			near(t, "r_crit independent of r_cl", float64(ob.RCrit), float64(oa.RCrit), 1e-12)
			for _, c := range []struct {
				rCl Length
				o   Outcome
			}{{a.RCloud, oa}, {b.RCloud, ob}} {
				if (c.rCl > c.o.RCrit) != (c.o.Verdict == Survives) {
					t.Errorf("row %d, %s: r_cl = %g pc, r_crit = %g pc, verdict %v", i, cs[j].ID, float64(c.rCl/Parsec), float64(c.o.RCrit/Parsec), c.o.Verdict)
				}
			}
		}
	}
}
