package cooling

import (
	"testing"

	"cloudwind/model"
)

// BenchmarkEvaluateBuiltin measures one full model evaluation (every
// derived quantity, the exact minimum along the mixing isobar and every
// built-in criterion) with the built-in 401-node cooling curve.
func BenchmarkEvaluateBuiltin(b *testing.B) {
	bi, err := NewBuiltin()
	if err != nil {
		b.Fatal(err)
	}
	cf, err := bi.At(1)
	if err != nil {
		b.Fatal(err)
	}
	cs := model.BuiltinCriteria()
	p := model.Fiducial()
	var r model.Result
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		p.Chi = 50 + float64(i%200)
		if err := r.Evaluate(p, cf, cs); err != nil {
			b.Fatal(err)
		}
	}
}
