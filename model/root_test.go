package model

import (
	"errors"
	"math"
	"testing"
)

// Tests of brentRoot [Bre73] on functions whose roots are known in closed
// form (derived), on a flat triple root, with the bracket in either order,
// and its error paths.
func TestBrentRoot(t *testing.T) {
	for _, c := range []struct {
		name       string
		f          func(float64) float64
		a, b, want float64
		maxEvals   int // superlinear convergence: far fewer than bisection's ~50
	}{
		{"x² − 2", func(x float64) float64 { return x*x - 2 }, 0, 2, math.Sqrt2, 12},
		{"x² − 2 (reversed)", func(x float64) float64 { return x*x - 2 }, 2, 0, math.Sqrt2, 12},
		{"e^x − 10", func(x float64) float64 { return math.Exp(x) - 10 }, -5, 5, math.Ln10, 15},
		{"ln x + 1", func(x float64) float64 { return math.Log(x) + 1 }, 1e-3, 50, 1 / math.E, 20},
		{"(x − 1)³ (flat)", func(x float64) float64 { return (x - 1) * (x - 1) * (x - 1) }, -3, 4, 1, 200},
		{"tanh(20(x − 0.3)) (steep)", func(x float64) float64 { return math.Tanh(20 * (x - 0.3)) }, -1, 1, 0.3, 30},
	} {
		evals := 0
		f := func(x float64) float64 { evals++; return c.f(x) }
		x, err := brentRoot(f, c.a, c.b, c.f(c.a), c.f(c.b), 1e-14, 400)
		if err != nil {
			t.Errorf("brentRoot(%s, [%g, %g]): %v", c.name, c.a, c.b, err)
			continue
		}
		// The bracket shrinks to 2ε|x| + tol (Brent's stopping rule), so the
		// root is within twice that.
		if tol := 2 * (2*machEps*math.Abs(c.want) + 1e-14); math.Abs(x-c.want) > tol {
			t.Errorf("brentRoot(%s) = %.17g, want %.17g (±%g)", c.name, x, c.want, tol)
		}
		if evals > c.maxEvals {
			t.Errorf("brentRoot(%s) took %d evaluations, want ≤ %d", c.name, evals, c.maxEvals)
		}
	}
	// A root at an end is returned as is.
	if x, err := brentRoot(func(x float64) float64 { return x }, 0, 1, 0, 1, 0, 10); x != 0 || err != nil {
		t.Errorf("brentRoot(x, [0, 1]) = %g, %v; want 0 exactly", x, err)
	}
	// No sign change, or NaN at an end: ErrNoBracket.
	sq := func(x float64) float64 { return x*x + 1 }
	if _, err := brentRoot(sq, -1, 1, 2, 2, 0, 10); !errors.Is(err, ErrNoBracket) {
		t.Errorf("brentRoot(x² + 1, [−1, 1]): err = %v, want ErrNoBracket", err)
	}
	if _, err := brentRoot(sq, -1, 1, math.NaN(), 2, 0, 10); !errors.Is(err, ErrNoBracket) {
		t.Errorf("brentRoot with f(a) = NaN: err = %v, want ErrNoBracket", err)
	}
	// A budget too small for the tolerance: ErrNoConvergence, inside the bracket.
	x, err := brentRoot(func(x float64) float64 { return x*x - 2 }, 0, 2, -2, 2, 0, 2)
	if !errors.Is(err, ErrNoConvergence) || !(x >= 0 && x <= 2) {
		t.Errorf("brentRoot with 2 evaluations = %g, %v; want a point in [0, 2] and ErrNoConvergence", x, err)
	}
}
