package model

import "testing"

// Benchmarks of the outflow, with the fiducial wind and the 401-node stub
// table of bench_test.go. Targets (the issue): a 200-radius profile with
// every built-in criterion in ≤ 1 ms; a cloud carried to 100 R in ≤ 5 ms.

// BenchmarkWindMach measures one Mach-number solve and the flow there,
// alternating inside and outside R.
func BenchmarkWindMach(b *testing.B) {
	w := mustWind(b, FiducialWind())
	radii := []Length{0.3 * w.Params.Radius, 3 * w.Params.Radius, 0.97 * w.Params.Radius, 40 * w.Params.Radius}
	b.ReportAllocs()
	var sink float64
	for i := 0; b.Loop(); i++ {
		sink += w.At(radii[i%len(radii)]).Mach
	}
	_ = sink
}

// BenchmarkWindProfile measures a 200-radius profile from 0.1 R to 100 R
// of a 1 pc cloud with every built-in criterion.
func BenchmarkWindProfile(b *testing.B) {
	w := mustWind(b, FiducialWind())
	cf, cs := newStubTable(), BuiltinCriteria()
	b.ReportAllocs()
	for b.Loop() {
		if _, err := w.Profile(Parsec, cf, cs, ProfileGrid{Points: 200}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkCarriedCloud measures clouds launched at rest at R and carried
// to 100 R: a 30 pc cloud on the gronke-oh-2018 branch (it grows, then is
// stripped, and arrives), and a 1 pc cloud on the growth branch throughout
// (it grows ×19), and a 300 pc cloud on li-2020's shocked-gas
// criterion, which is applied through State.Evaluate at every step.
func BenchmarkCarriedCloud(b *testing.B) {
	w := mustWind(b, FiducialWind())
	cf := newStubTable()
	c, _ := CriterionByID(BuiltinCriteria(), "gronke-oh-2018")
	li, _ := CriterionByID(BuiltinCriteria(), "li-2020")
	for _, bc := range []struct {
		name string
		rCl  Length
		c    *Criterion
	}{{"gronke-oh-2018/30pc", 30 * Parsec, c}, {"growing/1pc", Parsec, &always}, {"li-2020/300pc", 300 * Parsec, li}} {
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				cc, err := w.Carry(bc.rCl, cf, bc.c, CarrySettings{R0: w.Params.Radius})
				if err != nil || cc.Stop != StopReached {
					b.Fatalf("stop %v, %v", cc.Stop, err)
				}
			}
		})
	}
}
