package model

import (
	"math"
	"sort"
	"testing"
)

// stubTable is a tabulated cooling function for benchmarks and tests: 401
// nodes 0.01 dex apart from 10^4 to 10^8 K of a smooth synthetic curve with
// a peak near 2×10^5 K (no physical source; shape only), interpolated
// linearly in log T – log Λ with a binary search, as a real table is.
type stubTable struct{ x, y []float64 }

func newStubTable() *stubTable {
	t := &stubTable{}
	for i := 0; i <= 400; i++ {
		lt := 4 + 0.01*float64(i)
		ll := -21.2 - 1.5*(lt-5.3)*(lt-5.3)/(1+0.8*math.Abs(lt-5.3))
		if lt < 4.2 {
			ll -= 10 * (4.2 - lt)
		}
		t.x, t.y = append(t.x, lt), append(t.y, ll)
	}
	return t
}

func (t *stubTable) Nodes() ([]float64, []float64) { return t.x, t.y }

func (t *stubTable) Lambda(temp Temperature) CoolingRate {
	lt := math.Log10(float64(temp))
	i := sort.SearchFloat64s(t.x, lt)
	switch {
	case i == 0:
		i = 1
	case i >= len(t.x):
		i = len(t.x) - 1
	}
	w := (lt - t.x[i-1]) / (t.x[i] - t.x[i-1])
	return CoolingRate(math.Pow(10, t.y[i-1]+w*(t.y[i]-t.y[i-1])))
}

func TestStubTableMinMix(t *testing.T) {
	// The node search must agree with a brute-force scan of the same table.
	tab := newStubTable()
	p := Fiducial()
	s, err := Derive(p, tab)
	if err != nil {
		t.Fatal(err)
	}
	best := math.Inf(1)
	for lt := 4.0; lt <= 6.0; lt += 1e-4 {
		tt := Temperature(math.Pow(10, lt))
		if v := 2*lt - math.Log10(float64(tab.Lambda(tt))); v < best {
			best = v
		}
	}
	got := 2*math.Log10(float64(s.TMinMix)) - math.Log10(float64(tab.Lambda(s.TMinMix)))
	if got > best+1e-9 {
		t.Errorf("minimum of 2 log T − log Λ: node search %g, brute force %g", got, best)
	}
}

// BenchmarkEvaluate measures one full evaluation: every derived quantity
// and every built-in criterion, with a 401-node tabulated cooling function.
func BenchmarkEvaluate(b *testing.B) {
	tab := newStubTable()
	cs := BuiltinCriteria()
	p := Fiducial()
	var r Result
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		p.Chi = 50 + float64(i%200)
		if err := r.Evaluate(p, tab, cs); err != nil {
			b.Fatal(err)
		}
	}
}
