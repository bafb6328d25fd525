package model

import (
	"errors"
	"math"
)

// This file holds an adaptive explicit Runge–Kutta integrator: the
// Dormand–Prince 5(4) pair with local extrapolation (the fifth-order
// solution is propagated, the embedded fourth-order one only estimates the
// error), first-same-as-last (FSAL), and the standard step-size control.
//
// References:
//
//   - Dormand, J. R. & Prince, P. J. 1980, "A family of embedded
//     Runge-Kutta formulae", J. Comput. Appl. Math. 6, 19–26 (the method,
//     the pair RK5(4)7M).
//   - Hairer, E., Nørsett, S. P. & Wanner, G. 1993, Solving Ordinary
//     Differential Equations I, 2nd ed., Springer, §II.4 (the error norm,
//     the step-size controller and the starting step).
//
// The Butcher tableau below was written from memory of the standard
// tableau, not copied from a code or a book. The tests verify it: every
// order condition up to order 5 for the propagated weights and up to order
// 4 for the embedded ones holds in exact arithmetic (to rounding), and the
// observed convergence orders are 5 and 4 (dopri_test.go).

// Sentinel errors of the integrator.
var (
	// ErrStepTooSmall reports that the step size fell below the resolution of
	// the time variable: the problem is too stiff or singular there.
	ErrStepTooSmall = errors.New("step size too small")
	// ErrMaxSteps reports that the step budget ran out before the end time.
	ErrMaxSteps = errors.New("too many steps")
)

// Dormand & Prince (1980), RK5(4)7M: nodes c_i, coupling coefficients
// a_ij, fifth-order weights b_i (= a_7j: FSAL) and the differences
// e_i = b_i − b̂_i to the fourth-order weights b̂ = (5179/57600, 0,
// 7571/16695, 393/640, −92097/339200, 187/2100, 1/40). Go evaluates these
// rational constant expressions exactly before rounding them once.
const (
	dpC2 = 1.0 / 5
	dpC3 = 3.0 / 10
	dpC4 = 4.0 / 5
	dpC5 = 8.0 / 9
	// c6 = c7 = 1.

	dpA21 = 1.0 / 5

	dpA31 = 3.0 / 40
	dpA32 = 9.0 / 40

	dpA41 = 44.0 / 45
	dpA42 = -56.0 / 15
	dpA43 = 32.0 / 9

	dpA51 = 19372.0 / 6561
	dpA52 = -25360.0 / 2187
	dpA53 = 64448.0 / 6561
	dpA54 = -212.0 / 729

	dpA61 = 9017.0 / 3168
	dpA62 = -355.0 / 33
	dpA63 = 46732.0 / 5247
	dpA64 = 49.0 / 176
	dpA65 = -5103.0 / 18656

	dpB1 = 35.0 / 384 // b_2 = 0, b_7 = 0
	dpB3 = 500.0 / 1113
	dpB4 = 125.0 / 192
	dpB5 = -2187.0 / 6784
	dpB6 = 11.0 / 84

	dpE1 = 71.0 / 57600 // e_2 = 0
	dpE3 = -71.0 / 16695
	dpE4 = 71.0 / 1920
	dpE5 = -17253.0 / 339200
	dpE6 = 22.0 / 525
	dpE7 = -1.0 / 40
)

// Step-size controller of Hairer, Nørsett & Wanner (1993) §II.4:
// h_new = h·min(facMax, max(facMin, safety·err^{−1/5})), with facMax = 1
// on the step after a rejection.
const (
	dpSafety = 0.9
	dpFacMin = 0.2
	dpFacMax = 5.0
)

// odeFunc evaluates the right-hand side dy/dt = f(t, y) into dydt. It must
// not retain y or dydt, and must not change y.
type odeFunc func(t float64, y, dydt []float64)

// dopriOptions are the controls of a dopri integrator.
type dopriOptions struct {
	RelTol, AbsTol float64 // mixed error tolerance: sc_i = AbsTol + RelTol·max(|y_i|, |ŷ_i|)
	MaxSteps       int     // budget of attempted steps (accepted + rejected)
}

// dopri integrates one system y' = f(t, y) with the Dormand–Prince 5(4)
// pair. All storage is allocated by newDopri; stepping allocates nothing.
type dopri struct {
	f   odeFunc
	opt dopriOptions

	t, h  float64   // current time and the next step size to try
	y, dy []float64 // state and f(t, y) at the current accepted point

	tPrev         float64   // previous accepted point, for dense output
	yPrev, dyPrev []float64 // state and derivative there

	k              [5][]float64 // stages k2…k6
	ynew, dynew    []float64    // trial solution and f there (k7, FSAL)
	ytmp, errv     []float64    // stage argument; embedded error estimate h Σ e_i k_i
	rejectedBefore bool         // the last attempt was rejected

	steps, rejected, evals int
}

// newDopri returns an integrator for a system of n equations.
func newDopri(f odeFunc, n int, opt dopriOptions) *dopri {
	buf := make([]float64, 13*n) // one backing array for every vector
	next := func() []float64 { v := buf[:n:n]; buf = buf[n:]; return v }
	d := &dopri{f: f, opt: opt}
	d.y, d.dy, d.yPrev, d.dyPrev = next(), next(), next(), next()
	for i := range d.k {
		d.k[i] = next()
	}
	d.ynew, d.dynew, d.ytmp, d.errv = next(), next(), next(), next()
	return d
}

// norm returns the root-mean-square norm of v scaled by
// sc_i = AbsTol + RelTol·max(|a_i|, |b_i|) (Hairer et al. 1993, §II.4).
func (d *dopri) norm(v, a, b []float64) float64 {
	var sum float64
	for i, x := range v {
		sc := d.opt.AbsTol + d.opt.RelTol*math.Max(math.Abs(a[i]), math.Abs(b[i]))
		sum += (x / sc) * (x / sc)
	}
	return math.Sqrt(sum / float64(len(v)))
}

// reset starts an integration at (t0, y0) toward tEnd > t0: it evaluates
// f there and chooses the first step by the starting-step algorithm of
// Hairer et al. (1993) §II.4 (two evaluations of f; recalled, not copied).
// Where that algorithm falls back to an absolute 10⁻⁶ this uses
// 10⁻⁶ (t_end − t0), since the time variable here is dimensionless.
func (d *dopri) reset(t0 float64, y0 []float64, tEnd float64) {
	d.t = t0
	copy(d.y, y0)
	d.f(t0, d.y, d.dy)
	d.steps, d.rejected, d.evals, d.rejectedBefore = 0, 0, 1, false
	d.tPrev = t0
	copy(d.yPrev, d.y)
	copy(d.dyPrev, d.dy)

	d0, d1 := d.norm(d.y, d.y, d.y), d.norm(d.dy, d.y, d.y)
	h0 := 1e-6 * (tEnd - t0)
	if d0 >= 1e-5 && d1 >= 1e-5 {
		h0 = 0.01 * d0 / d1
	}
	h0 = math.Min(h0, tEnd-t0)
	for i := range d.y {
		d.ytmp[i] = d.y[i] + h0*d.dy[i]
	}
	d.f(t0+h0, d.ytmp, d.dynew)
	d.evals++
	for i := range d.errv {
		d.errv[i] = (d.dynew[i] - d.dy[i]) / h0
	}
	d2 := d.norm(d.errv, d.y, d.y)
	var h1 float64
	if m := math.Max(d1, d2); m <= 1e-15 || math.IsNaN(m) {
		h1 = math.Max(1e-6*(tEnd-t0), 1e-3*h0)
	} else {
		h1 = math.Pow(0.01/m, 1.0/5)
	}
	d.h = math.Min(math.Min(100*h0, h1), tEnd-t0)
}

// trial computes one Dormand–Prince step of size h from the current point
// into ynew (fifth order), dynew = f(t+h, ynew) and errv (the difference to
// the embedded fourth-order solution), and returns the scaled error norm.
// It does not move the current point.
func (d *dopri) trial(h float64) float64 {
	t, y, k1 := d.t, d.y, d.dy
	k2, k3, k4, k5, k6 := d.k[0], d.k[1], d.k[2], d.k[3], d.k[4]
	k7, yt, yn := d.dynew, d.ytmp, d.ynew
	for i := range y {
		yt[i] = y[i] + h*dpA21*k1[i]
	}
	d.f(t+dpC2*h, yt, k2)
	for i := range y {
		yt[i] = y[i] + h*(dpA31*k1[i]+dpA32*k2[i])
	}
	d.f(t+dpC3*h, yt, k3)
	for i := range y {
		yt[i] = y[i] + h*(dpA41*k1[i]+dpA42*k2[i]+dpA43*k3[i])
	}
	d.f(t+dpC4*h, yt, k4)
	for i := range y {
		yt[i] = y[i] + h*(dpA51*k1[i]+dpA52*k2[i]+dpA53*k3[i]+dpA54*k4[i])
	}
	d.f(t+dpC5*h, yt, k5)
	for i := range y {
		yt[i] = y[i] + h*(dpA61*k1[i]+dpA62*k2[i]+dpA63*k3[i]+dpA64*k4[i]+dpA65*k5[i])
	}
	d.f(t+h, yt, k6)
	for i := range y {
		yn[i] = y[i] + h*(dpB1*k1[i]+dpB3*k3[i]+dpB4*k4[i]+dpB5*k5[i]+dpB6*k6[i])
	}
	d.f(t+h, yn, k7) // FSAL: this is k1 of the next step
	d.evals += 6
	for i := range y {
		d.errv[i] = h * (dpE1*k1[i] + dpE3*k3[i] + dpE4*k4[i] + dpE5*k5[i] + dpE6*k6[i] + dpE7*k7[i])
	}
	return d.norm(d.errv, y, yn)
}

// accept moves the current point to the last trial, of size h.
func (d *dopri) accept(h float64) {
	d.tPrev = d.t
	d.yPrev, d.y, d.ynew = d.y, d.ynew, d.yPrev
	d.dyPrev, d.dy, d.dynew = d.dy, d.dynew, d.dyPrev
	d.t += h
	d.steps++
}

// advance takes one accepted step toward tEnd, never beyond it, retrying
// with smaller steps as the error control demands. A non-finite error
// estimate (f returned NaN or ±Inf) counts as a rejection. It returns
// ErrStepTooSmall when h drops below 16 ulp of t and ErrMaxSteps when the
// budget of attempts is spent.
func (d *dopri) advance(tEnd float64) error {
	hMin := 16 * 2.220446049250313e-16 * math.Max(math.Abs(d.t), math.Abs(tEnd)) // 16 ε max(|t|, |t_end|)
	for {
		if d.steps+d.rejected >= d.opt.MaxSteps {
			return ErrMaxSteps
		}
		h := d.h
		last := false
		if d.t+h >= tEnd || tEnd-(d.t+h) < hMin {
			h, last = tEnd-d.t, true
		}
		if h < hMin {
			return ErrStepTooSmall
		}
		err := d.trial(h)
		if !(err <= 1) { // includes NaN
			d.rejected++
			d.rejectedBefore = true
			fac := dpFacMin
			if err > 0 && !math.IsInf(err, 1) {
				fac = math.Max(dpFacMin, dpSafety*math.Pow(err, -1.0/5))
			}
			d.h = h * fac
			continue
		}
		facMax := dpFacMax
		if d.rejectedBefore {
			facMax = 1 // Hairer et al. (1993) §II.4: no growth right after a rejection
		}
		fac := facMax
		if err > 0 {
			fac = math.Min(facMax, math.Max(dpFacMin, dpSafety*math.Pow(err, -1.0/5)))
		}
		d.rejectedBefore = false
		d.accept(h)
		if last {
			d.t = tEnd // exact, free of the rounding of t + h
		}
		d.h = fac * h
		return nil
	}
}

// hermiteCubic evaluates at θ ∈ [0, 1] the cubic Hermite interpolant through
// (0, y0) and (h, y1) with slopes f0 and f1, written as
// (1−θ)y0 + θy1 + θ(θ−1)[(1−2θ)(y1−y0) + (θ−1)h f0 + θ h f1]. Its error is
// O(h⁴): third order, exact for cubics.
func hermiteCubic(th, h, y0, y1, f0, f1 float64) float64 {
	return (1-th)*y0 + th*y1 + th*(th-1)*((1-2*th)*(y1-y0)+(th-1)*h*f0+th*h*f1)
}

// bisectFirst returns the smallest θ ∈ (0, 1] at which in(θ) becomes true, to
// 2⁻⁴⁸, given in(0) false and in(1) true (bisection).
func bisectFirst(in func(float64) bool) float64 {
	lo, hi := 0.0, 1.0
	for range 48 {
		mid := 0.5 * (lo + hi)
		if in(mid) {
			hi = mid
		} else {
			lo = mid
		}
	}
	return hi
}
