package cooling

import (
	"math"
	"testing"

	"cloudwind/model"
)

// BenchmarkLambda measures one Λ(T) lookup on a 451-node uniform table.
func BenchmarkLambda(b *testing.B) {
	xs, ys := make([]float64, 451), make([]float64, 451)
	for i := range xs {
		xs[i] = 4 + 0.01*float64(i)
		ys[i] = -22 + 0.3*math.Sin(xs[i]*3)
	}
	p, err := NewPowerLaw(xs, ys, Meta{})
	if err != nil {
		b.Fatal(err)
	}
	ts := make([]model.Temperature, 1024)
	for i := range ts {
		ts[i] = model.Temperature(math.Pow(10, 4+4.5*float64(i)/1024))
	}
	var sink model.CoolingRate
	i := 0
	for b.Loop() {
		sink += p.Lambda(ts[i&1023])
		i++
	}
	_ = sink
}
