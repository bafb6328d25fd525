package model

import (
	"errors"
	"math"
	"testing"
)

// Tests of the Dormand–Prince 5(4) integrator. The reference values are
// closed-form solutions (derived below each problem) and the order
// conditions of Runge–Kutta methods (Butcher trees up to order 5, with
// 1/γ(t) as in Hairer, Nørsett & Wanner 1993, §II.2).

// dpTableau returns the Butcher tableau of dopri.go as arrays: c, A (row i
// has the coefficients of stage i), the fifth-order weights b and the
// fourth-order weights b̂ = b − e.
func dpTableau() (c [7]float64, a [7][7]float64, b, bh [7]float64) {
	c = [7]float64{0, dpC2, dpC3, dpC4, dpC5, 1, 1}
	a[1] = [7]float64{dpA21}
	a[2] = [7]float64{dpA31, dpA32}
	a[3] = [7]float64{dpA41, dpA42, dpA43}
	a[4] = [7]float64{dpA51, dpA52, dpA53, dpA54}
	a[5] = [7]float64{dpA61, dpA62, dpA63, dpA64, dpA65}
	b = [7]float64{dpB1, 0, dpB3, dpB4, dpB5, dpB6, 0}
	a[6] = b // FSAL: the last stage is f at the fifth-order solution
	e := [7]float64{dpE1, 0, dpE3, dpE4, dpE5, dpE6, dpE7}
	for i := range bh {
		bh[i] = b[i] - e[i]
	}
	return c, a, b, bh
}

// TestDopriOrderConditions checks the tableau written from memory against
// the order conditions: Σ_j a_ij = c_i, the 17 conditions of order ≤ 5 for
// b and the 8 of order ≤ 4 for b̂, while b̂ must fail an order-5 one (else
// the error estimate would vanish).
func TestDopriOrderConditions(t *testing.T) {
	c, a, b, bh := dpTableau()
	const tol = 1e-14 // rounding of rationals with 6-digit denominators
	for i := range c {
		var s float64
		for j := range i {
			s += a[i][j]
		}
		if math.Abs(s-c[i]) > tol {
			t.Errorf("row %d: Σ_j a_ij = %.17g, want c_%d = %.17g", i+1, s, i+1, c[i])
		}
	}
	// Stage vectors that appear in the trees: ac = A c, ac2 = A c², ...
	mul := func(v [7]float64) (w [7]float64) {
		for i := range w {
			for j := range v {
				w[i] += a[i][j] * v[j]
			}
		}
		return w
	}
	pw := func(k float64) (w [7]float64) {
		for i := range w {
			w[i] = math.Pow(c[i], k)
		}
		return w
	}
	prod := func(u, v [7]float64) (w [7]float64) {
		for i := range w {
			w[i] = u[i] * v[i]
		}
		return w
	}
	one := pw(0)
	ac, ac2, ac3 := mul(c), mul(pw(2)), mul(pw(3))
	aac := mul(ac)
	type cond struct {
		name  string
		order int
		v     [7]float64
		want  float64 // 1/γ(t)
	}
	conds := []cond{
		{"Σb = 1", 1, one, 1},
		{"Σbc = 1/2", 2, c, 1.0 / 2},
		{"Σbc² = 1/3", 3, pw(2), 1.0 / 3},
		{"Σb(Ac) = 1/6", 3, ac, 1.0 / 6},
		{"Σbc³ = 1/4", 4, pw(3), 1.0 / 4},
		{"Σb c(Ac) = 1/8", 4, prod(c, ac), 1.0 / 8},
		{"Σb(Ac²) = 1/12", 4, ac2, 1.0 / 12},
		{"Σb(AAc) = 1/24", 4, aac, 1.0 / 24},
		{"Σbc⁴ = 1/5", 5, pw(4), 1.0 / 5},
		{"Σb c²(Ac) = 1/10", 5, prod(pw(2), ac), 1.0 / 10},
		{"Σb (Ac)² = 1/20", 5, prod(ac, ac), 1.0 / 20},
		{"Σb c(Ac²) = 1/15", 5, prod(c, ac2), 1.0 / 15},
		{"Σb c(AAc) = 1/30", 5, prod(c, aac), 1.0 / 30},
		{"Σb(Ac³) = 1/20", 5, ac3, 1.0 / 20},
		{"Σb A(c·Ac) = 1/40", 5, mul(prod(c, ac)), 1.0 / 40},
		{"Σb(AAc²) = 1/60", 5, mul(ac2), 1.0 / 60},
		{"Σb(AAAc) = 1/120", 5, mul(aac), 1.0 / 120},
	}
	dot := func(w, v [7]float64) (s float64) {
		for i := range w {
			s += w[i] * v[i]
		}
		return s
	}
	failsOrder5 := false
	for _, k := range conds {
		if got := dot(b, k.v); math.Abs(got-k.want) > tol {
			t.Errorf("fifth-order weights: %s: got %.17g", k.name, got)
		}
		got := dot(bh, k.v)
		if k.order <= 4 && math.Abs(got-k.want) > tol {
			t.Errorf("fourth-order weights: %s: got %.17g", k.name, got)
		}
		if k.order == 5 && math.Abs(got-k.want) > 1e-6 {
			failsOrder5 = true
		}
	}
	if !failsOrder5 {
		t.Errorf("fourth-order weights satisfy every order-5 condition: the error estimate would vanish")
	}
}

// sinProblem is y' = −y + sin t, whose solution with y(0) = y0 is
// y = (sin t − cos t)/2 + (y0 + 1/2) e^{−t} (derived: the particular
// solution (sin t − cos t)/2 has derivative (cos t + sin t)/2 = −y_p + sin t),
// together with y' = y, solution y0 e^t.
func sinProblem(t float64, y, dy []float64) {
	dy[0] = -y[0] + math.Sin(t)
	dy[1] = y[1]
}

func sinExact(t float64) [2]float64 {
	return [2]float64{(math.Sin(t)-math.Cos(t))/2 + 1.5*math.Exp(-t), math.Exp(t)}
}

// fixedSteps integrates sinProblem from (0, (1, 1)) to tEnd in n equal
// steps, propagating the fifth-order solution, or the embedded
// fourth-order one when fourth is set, and returns the largest error.
func fixedSteps(n int, tEnd float64, fourth bool) float64 {
	d := newDopri(sinProblem, 2, dopriOptions{RelTol: 1, AbsTol: 1, MaxSteps: 1 << 30})
	d.reset(0, []float64{1, 1}, tEnd)
	h := tEnd / float64(n)
	for range n {
		d.trial(h)
		if fourth {
			for i := range d.ynew {
				d.ynew[i] -= d.errv[i] // ŷ = y5 − (y5 − ŷ)
			}
			d.f(d.t+h, d.ynew, d.dynew)
		}
		d.accept(h)
	}
	ex := sinExact(tEnd)
	return math.Max(math.Abs(d.y[0]-ex[0]), math.Abs(d.y[1]-ex[1]))
}

// TestDopriConvergenceOrder measures the global error ratio of fixed-step
// runs at h and h/2 over t ∈ [0, 2] with 20–160 steps: 2^p with p = 5 for
// the propagated solution, 32, and p = 4, 16, for the embedded one. The
// bands (about ±12 %) allow for the next-order terms at these step sizes
// (observed: 29.3–31.3 and 15.2–15.8).
func TestDopriConvergenceOrder(t *testing.T) {
	for _, c := range []struct {
		fourth   bool
		want     float64
		lo, hi   float64
		nCoarse  int
		label    string
		maxError float64
	}{
		{false, 32, 28, 36, 20, "fifth-order solution", 1e-7},
		{true, 16, 14, 18, 20, "embedded fourth-order solution", 1e-5},
	} {
		for n := c.nCoarse; n <= 4*c.nCoarse; n *= 2 {
			e1, e2 := fixedSteps(n, 2, c.fourth), fixedSteps(2*n, 2, c.fourth)
			if r := e1 / e2; r < c.lo || r > c.hi {
				t.Errorf("%s: error(h)/error(h/2) at %d steps = %.4g (errors %.3g, %.3g), want %g in [%g, %g]",
					c.label, n, r, e1, e2, c.want, c.lo, c.hi)
			}
			if e1 > c.maxError {
				t.Errorf("%s: error %.3g at %d steps, want below %g", c.label, e1, n, c.maxError)
			}
		}
	}
}

// TestDopriLocalErrorEstimate checks the embedded estimate over one step
// from the exact initial value: it is the local error of the fourth-order
// solution, O(h⁵) (ratio 32 when h halves), and close to the true local
// error of that solution, while the fifth-order local error is O(h⁶) (64).
func TestDopriLocalErrorEstimate(t *testing.T) {
	one := func(h float64) (est, err5, err4 float64) {
		d := newDopri(sinProblem, 2, dopriOptions{RelTol: 1, AbsTol: 1, MaxSteps: 10})
		d.reset(0, []float64{1, 1}, 1)
		d.trial(h)
		ex := sinExact(h)
		return math.Abs(d.errv[0]), math.Abs(d.ynew[0] - ex[0]), math.Abs(d.ynew[0] - d.errv[0] - ex[0])
	}
	for _, h := range []float64{0.4, 0.2, 0.1} {
		est1, e51, e41 := one(h)
		est2, e52, e42 := one(h / 2)
		if r := est1 / est2; r < 26 || r > 38 {
			t.Errorf("estimate(h = %g)/estimate(h/2) = %.4g, want ≈ 32", h, r)
		}
		if r := e51 / e52; r < 50 || r > 80 {
			t.Errorf("fifth-order local error ratio at h = %g: %.4g, want ≈ 64", h, r)
		}
		if r := est1 / e41; r < 0.8 || r > 1.25 {
			t.Errorf("estimate/true fourth-order local error at h = %g: %.4g, want ≈ 1", h, r)
		}
		_ = e42
	}
}

// TestDopriTolerance runs the adaptive integrator to t = 10 at shrinking
// tolerances: the error must fall with the tolerance and stay within a
// small multiple of it, and the step count must rise.
func TestDopriTolerance(t *testing.T) {
	prevErr, prevSteps := math.Inf(1), 0
	for _, tol := range []float64{1e-4, 1e-6, 1e-8, 1e-10, 1e-12} {
		d := newDopri(sinProblem, 2, dopriOptions{RelTol: tol, AbsTol: tol, MaxSteps: 100000})
		d.reset(0, []float64{1, 1}, 10)
		for d.t < 10 {
			if err := d.advance(10); err != nil {
				t.Fatalf("tol %g: %v", tol, err)
			}
		}
		ex := sinExact(10)
		e := math.Max(math.Abs(d.y[0]-ex[0]), math.Abs(d.y[1]-ex[1])/ex[1])
		if !(e < prevErr) || e > 100*tol {
			t.Errorf("tol %g: error %.3g (previous %.3g), want smaller than before and below 100 tol", tol, e, prevErr)
		}
		if d.steps <= prevSteps {
			t.Errorf("tol %g: %d steps, previous tolerance took %d", tol, d.steps, prevSteps)
		}
		if d.t != 10 {
			t.Errorf("tol %g: stopped at t = %.17g, want exactly 10", tol, d.t)
		}
		prevErr, prevSteps = e, d.steps
	}
}

// TestDopriStiff: y' = −10⁶ (y − cos t) is stiff; an explicit method needs
// h ≲ 3.3×10⁻⁶ for stability (the DOPRI5 stability interval on the real
// axis reaches about −3.3, from memory), so 10 time units take ~3×10⁶
// steps. With a budget of 2000 the integrator must stop with ErrMaxSteps
// rather than hang.
func TestDopriStiff(t *testing.T) {
	f := func(t float64, y, dy []float64) { dy[0] = -1e6 * (y[0] - math.Cos(t)) }
	d := newDopri(f, 1, dopriOptions{RelTol: 1e-6, AbsTol: 1e-9, MaxSteps: 2000})
	d.reset(0, []float64{0}, 10)
	var err error
	for d.t < 10 && err == nil {
		err = d.advance(10)
	}
	if !errors.Is(err, ErrMaxSteps) {
		t.Errorf("stiff problem: error %v at t = %g, want ErrMaxSteps", err, d.t)
	}
	if d.steps+d.rejected != 2000 {
		t.Errorf("stiff problem: %d attempts, want the budget of 2000", d.steps+d.rejected)
	}
}

// TestDopriNaN: a right-hand side that turns NaN at t > 1 must end in
// ErrStepTooSmall, not in NaN results.
func TestDopriNaN(t *testing.T) {
	f := func(t float64, y, dy []float64) {
		dy[0] = 1
		if t > 1 {
			dy[0] = math.NaN()
		}
	}
	d := newDopri(f, 1, dopriOptions{RelTol: 1e-8, AbsTol: 1e-8, MaxSteps: 100000})
	d.reset(0, []float64{0}, 2)
	var err error
	for d.t < 2 && err == nil {
		err = d.advance(2)
	}
	if !errors.Is(err, ErrStepTooSmall) {
		t.Errorf("NaN right-hand side: error %v, want ErrStepTooSmall", err)
	}
	if math.IsNaN(d.y[0]) || d.t > 1 {
		t.Errorf("NaN right-hand side: accepted y = %g at t = %g", d.y[0], d.t)
	}
}

// TestDopriNoAllocs: stepping allocates nothing.
func TestDopriNoAllocs(t *testing.T) {
	d := newDopri(sinProblem, 2, dopriOptions{RelTol: 1e-9, AbsTol: 1e-9, MaxSteps: 1 << 30})
	d.reset(0, []float64{1, 1}, 1e6)
	if n := testing.AllocsPerRun(100, func() { _ = d.advance(1e6) }); n != 0 {
		t.Errorf("advance allocates %g times per step", n)
	}
}

// TestHermite: the interpolant is exact for cubics (derived: four
// conditions fix a cubic) and bisect finds a level to 2⁻⁴⁸.
func TestHermite(t *testing.T) {
	p := func(x float64) float64 { return 2 - x + 3*x*x - 0.5*x*x*x }
	dp := func(x float64) float64 { return -1 + 6*x - 1.5*x*x }
	t0, h := 0.3, 1.7
	for _, th := range []float64{0, 0.1, 0.5, 0.77, 1} {
		got := hermiteCubic(th, h, p(t0), p(t0+h), dp(t0), dp(t0+h))
		if want := p(t0 + th*h); math.Abs(got-want) > 1e-14 {
			t.Errorf("hermiteCubic(%g) = %.17g, want %.17g", th, got, want)
		}
	}
	if th := bisectFirst(func(x float64) bool { return x*x >= 0.5 }); math.Abs(th-math.Sqrt(0.5)) > 1e-14 {
		t.Errorf("bisectFirst(x² ≥ 1/2) = %.17g, want %.17g", th, math.Sqrt(0.5))
	}
}
