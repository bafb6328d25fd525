package model

import (
	"errors"
	"math"
)

// This file holds a bracketed root finder: Brent's method, which combines
// bisection, the secant rule and inverse quadratic interpolation and never
// leaves the bracket.
//
// Reference: Brent, R. P. 1973, Algorithms for Minimization without
// Derivatives, Prentice-Hall, chapter 4 (the procedure "zero"). [Bre73]
//
// The code was written from the algorithm as that chapter describes it
// (the acceptance tests for an interpolated step and the tolerance
// 2ε|b| + t), recalled, not copied from a code or a book. The tests check
// it on functions with known roots, double-root-like flat functions and
// brackets given in either order (root_test.go).

// Sentinel errors of the root finder.
var (
	// ErrNoBracket reports that f does not change sign between the ends
	// given, so no root is bracketed.
	ErrNoBracket = errors.New("root not bracketed")
	// ErrNoConvergence reports that the iteration budget ran out before the
	// bracket shrank to the tolerance.
	ErrNoConvergence = errors.New("root finder did not converge")
)

// machEps is the float64 unit roundoff ε = 2⁻⁵² used in Brent's tolerance.
const machEps = 2.220446049250313e-16

// brentRoot returns a zero of f in [a, b] given fa = f(a) and fb = f(b) of
// opposite signs (or one of them zero), to within 2ε|x| + tol (tol ≥ 0),
// in at most maxIter evaluations of f [Bre73]. It returns ErrNoBracket
// when fa and fb have the same sign or either is NaN, and the best point
// so far with ErrNoConvergence when the budget runs out.
func brentRoot(f func(float64) float64, a, b, fa, fb, tol float64, maxIter int) (float64, error) {
	switch {
	case math.IsNaN(fa) || math.IsNaN(fb):
		return math.NaN(), ErrNoBracket
	case fa == 0:
		return a, nil
	case fb == 0:
		return b, nil
	case (fa > 0) == (fb > 0):
		return math.NaN(), ErrNoBracket
	}
	// c is the previous point whose f has the sign opposite to f(b); d is
	// the last step and e the one before (Brent's names).
	c, fc := a, fa
	d := b - a
	e := d
	for range maxIter {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) { // b is always the best estimate
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		t := 2*machEps*math.Abs(b) + tol
		m := 0.5 * (c - b)
		if math.Abs(m) <= t || fb == 0 {
			return b, nil
		}
		if math.Abs(e) < t || math.Abs(fa) <= math.Abs(fb) {
			d, e = m, m // bisection: the last steps were too small or did not help
		} else {
			var p, q float64
			s := fb / fa
			if a == c {
				p, q = 2*m*s, 1-s // secant rule
			} else {
				q0, r := fa/fc, fb/fc // inverse quadratic interpolation
				p = s * (2*m*q0*(q0-r) - (b-a)*(r-1))
				q = (q0 - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			} else {
				p = -p
			}
			s, e = e, d
			if 2*p < 3*m*q-math.Abs(t*q) && p < math.Abs(0.5*s*q) {
				d = p / q // accept the interpolated step
			} else {
				d, e = m, m
			}
		}
		a, fa = b, fb
		switch {
		case math.Abs(d) > t:
			b += d
		case m > 0:
			b += t
		default:
			b -= t
		}
		fb = f(b)
		if math.IsNaN(fb) {
			return b, ErrNoConvergence
		}
	}
	return b, ErrNoConvergence
}
