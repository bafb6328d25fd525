package cooling

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"cloudwind/model"
	"gonum.org/v1/gonum/floats/scalar"
	"gonum.org/v1/gonum/integrate/quad"
)

// twBremsC is the normalisation of the test law Λ = C T^{1/2}; any positive
// value works (FreeFreePrefactor times 1.5, rounded; synthetic).
const twBremsC = 2.1e-27

// twBrems returns Λ = twBremsC T^{1/2} with nodes every 0.5 dex from 10^4
// to 10^6 K; above 10^6 K the T^{1/2} extension continues the same law.
func twBrems(t *testing.T) *PowerLaw {
	t.Helper()
	var xs, ys []float64
	for x := 4.0; x <= 6; x += 0.5 {
		xs = append(xs, x)
		ys = append(ys, math.Log10(twBremsC)+0.5*x)
	}
	p, err := NewPowerLaw(xs, ys, Meta{Name: "brems"})
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestCoolingTimeBremsstrahlung checks an analytic case (tolerance 1e-12).
// For Λ = C T^{1/2}, derived:
//
//	isochoric: t = (3/2) x (k/n_H) 2(√T0 − √T1)/C = 3 n_tot k (√T0 − √T1)/(n_H² C)
//	isobaric:  t = (5/2) x k/(n_H T0) (2/3)(T0^{3/2} − T1^{3/2})/C
func TestCoolingTimeBremsstrahlung(t *testing.T) {
	p := twBrems(t)
	g := Gas{NH: 1e-3, TotalPerH: 2.25}
	const k = model.Boltzmann
	cases := []struct{ t0, t1 float64 }{
		{1e6, 1e4},     // whole table
		{3.7e5, 2.2e4}, // inside, partial segments at both ends
		{1e8, 1e4},     // through the extension above 10^6 K
		{5e8, 2e6},     // extension only
		{1e5, 1e5},     // zero interval
	}
	for _, c := range cases {
		nTot, nH := g.TotalPerH*float64(g.NH), float64(g.NH)
		want := 3 * nTot * k * (math.Sqrt(c.t0) - math.Sqrt(c.t1)) / (nH * nH * twBremsC)
		got, err := p.TimeToCool(Isochoric, g, model.Temperature(c.t0), model.Temperature(c.t1), 1e4)
		if err != nil || !scalar.EqualWithinAbsOrRel(float64(got.Time), want, 0, 1e-12) {
			t.Errorf("TimeToCool(isochoric, %g→%g) = %g, %v; want %g", c.t0, c.t1, float64(got.Time), err, want)
		}
		want = 2.5 * g.TotalPerH * k / (nH * c.t0) * (2.0 / 3) * (math.Pow(c.t0, 1.5) - math.Pow(c.t1, 1.5)) / twBremsC
		got, err = p.TimeToCool(Isobaric, g, model.Temperature(c.t0), model.Temperature(c.t1), 1e4)
		if err != nil || !scalar.EqualWithinAbsOrRel(float64(got.Time), want, 0, 1e-12) {
			t.Errorf("TimeToCool(isobaric, %g→%g) = %g, %v; want %g", c.t0, c.t1, float64(got.Time), err, want)
		}
		// The integrals themselves (analytic).
		for m, want := range []float64{
			2 * (math.Sqrt(c.t0) - math.Sqrt(c.t1)) / twBremsC,
			(2.0 / 3) * (math.Pow(c.t0, 1.5) - math.Pow(c.t1, 1.5)) / twBremsC,
			(2.0 / 5) * (math.Pow(c.t0, 2.5) - math.Pow(c.t1, 2.5)) / twBremsC,
		} {
			got := p.Integral(model.Temperature(c.t1), model.Temperature(c.t0), m)
			if !scalar.EqualWithinAbsOrRel(got, want, 0, 1e-12) {
				t.Errorf("Integral(%g, %g, %d) = %g, want %g", c.t1, c.t0, m, got, want)
			}
		}
	}
}

// twCurve is a random piecewise power law with its nodes and slopes kept
// by the test, so that the reference quadrature does not use the code
// under test.
type twCurve struct {
	p      *PowerLaw
	xs, ys []float64 // log10 T, log10 Λ
	slopes []float64 // d log Λ/d log T per segment; the extension has 1/2
}

// lnLambda returns ln Λ at u = ln T for u in segment k (k = len(xs)−1 is
// the extension).
func (c twCurve) lnLambda(k int, u float64) float64 {
	s := ExtensionSlope
	if k < len(c.slopes) {
		s = c.slopes[k]
	}
	return math.Ln10 * (c.ys[k] + s*(u/math.Ln10-c.xs[k]))
}

// twRandomCurve draws nodes on a 1/64-dex grid and slopes in [−4, 4]; a
// quarter of the segments get slope q exactly and a quarter q ± 1e-10 (the
// p = 0 and p ≈ 0 cases). log10 Λ values are
// multiples of 2^-40, so a slope of exactly 1 or 2 survives NewPowerLaw's
// division without rounding.
func twRandomCurve(t *testing.T, r *rand.Rand, q float64) twCurve {
	t.Helper()
	n := 2 + r.IntN(12)
	var c twCurve
	x, y := 4.0, -22.0
	for i := 0; i < n; i++ {
		c.xs, c.ys = append(c.xs, x), append(c.ys, y)
		dx := float64(1+r.IntN(64)) / 64
		var s float64
		switch r.IntN(4) {
		case 0:
			s = q
		case 1:
			s = q + 1e-10*float64(1-2*r.IntN(2))
		default:
			s = 8*r.Float64() - 4
		}
		y = math.Round((y+s*dx)*(1<<40)) / (1 << 40)
		x += dx
	}
	p, err := NewPowerLaw(c.xs, c.ys, Meta{})
	if err != nil {
		t.Fatal(err)
	}
	c.p = p
	for i := 0; i+1 < n; i++ {
		c.slopes = append(c.slopes, (c.ys[i+1]-c.ys[i])/(c.xs[i+1]-c.xs[i]))
	}
	return c
}

// quadIntegral integrates T^{q−1}/Λ dT = T^q/Λ d ln T from ln T = la to lb
// with 64-point Gauss–Legendre on each segment separately (gonum quad).
func (c twCurve) quadIntegral(la, lb, q float64) float64 {
	sum := 0.0
	n := len(c.xs)
	for k := 0; k < n; k++ {
		lo, hi := c.xs[k]*math.Ln10, math.Inf(1)
		if k+1 < n {
			hi = c.xs[k+1] * math.Ln10
		}
		lo, hi = math.Max(lo, la), math.Min(hi, lb)
		if !(hi > lo) {
			continue
		}
		f := func(u float64) float64 { return math.Exp(q*u - c.lnLambda(k, u)) }
		sum += quad.Fixed(f, lo, hi, 64, quad.Legendre{}, 0)
	}
	return sum
}

// TestIntegralQuadrature checks the exact integrals against numerical
// quadrature on random piecewise power laws (tolerance 1e-12 relative, or
// 1e-10 if the quadrature limits it; here 1e-12 holds).
func TestIntegralQuadrature(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	exactLog := 0
	for trial := 0; trial < 400; trial++ {
		m := trial % 2
		q := float64(m + 1)
		c := twRandomCurve(t, r, q)
		for _, s := range c.p.slope {
			if s == q {
				exactLog++
			}
		}
		x0, x1 := c.xs[0], c.xs[len(c.xs)-1]+0.5 // into the extension
		for j := 0; j < 4; j++ {
			a := x0 + (x1-x0)*r.Float64()
			b := a + (x1-a)*r.Float64()
			if j == 0 {
				a, b = x0, x1-0.5 // exactly the table
			}
			ta, tb := model.Temperature(math.Pow(10, a)), model.Temperature(math.Pow(10, b))
			la, _ := c.p.clampToTable(math.Log(float64(ta)))
			want := c.quadIntegral(la, math.Log(float64(tb)), q)
			got := c.p.Integral(ta, tb, m)
			if !scalar.EqualWithinAbsOrRel(got, want, 0, 1e-12) {
				t.Errorf("trial %d: Integral(10^%.6g, 10^%.6g, %d) = %.16g, quadrature %.16g (rel %.2g)",
					trial, a, b, m, got, want, math.Abs(got-want)/want)
			}
		}
	}
	if exactLog < 100 {
		t.Errorf("only %d segments with slope exactly m+1: the p = 0 branch is not exercised", exactLog)
	}
}

// TestIntegralSpecialCases checks the "Special cases are:" rows of
// Integral (definition of the range policy, see PowerLaw).
func TestIntegralSpecialCases(t *testing.T) {
	p := twBrems(t)
	nan := model.Temperature(math.NaN())
	inf := model.Temperature(math.Inf(1))
	if got := p.Integral(2e4, 2e4, 0); got != 0 {
		t.Errorf("Integral(2e4, 2e4, 0) = %g, want 0", got)
	}
	if got, want := p.Integral(3e5, 2e4, 1), -p.Integral(2e4, 3e5, 1); got != want {
		t.Errorf("Integral(3e5, 2e4, 1) = %g, want %g", got, want)
	}
	for _, a := range []model.Temperature{9e3, 0, -1} {
		if got := p.Integral(a, 2e4, 0); !math.IsInf(got, 1) {
			t.Errorf("Integral(%g, 2e4, 0) = %g below the table, want +Inf", float64(a), got)
		}
	}
	if got := p.Integral(2e4, inf, 0); !math.IsInf(got, 1) {
		t.Errorf("Integral(2e4, +Inf, 0) = %g, want +Inf", got)
	}
	if got := p.Integral(nan, 2e4, 0); !math.IsNaN(got) {
		t.Errorf("Integral(NaN, 2e4, 0) = %g, want NaN", got)
	}
	if got := p.Integral(2e4, nan, 1); !math.IsNaN(got) {
		t.Errorf("Integral(2e4, NaN, 1) = %g, want NaN", got)
	}
	// 10^4 computed from the node's log10 lands on the node, not below it.
	lo, _ := p.ValidRange()
	if got := p.Integral(lo*(1-1e-14), 2e4, 0); math.IsInf(got, 0) || !(got > 0) {
		t.Errorf("Integral(first node × (1−1e-14), 2e4, 0) = %g, want finite", got)
	}
}

// twTable is a smooth 401-node curve from 10^4 to 10^8 K every 0.01 dex with
// a CIE-like shape: a steep rise above 10^4 K, a peak near 10^5.3 K and a
// T^{1/2}-like tail (synthetic; shape after the primordial and solar CIE
// curves).
func twTable(tb testing.TB) *PowerLaw {
	tb.Helper()
	xs, ys := make([]float64, 401), make([]float64, 401)
	for i := range xs {
		x := 4 + 0.01*float64(i)
		xs[i] = x
		ys[i] = -21.2 - 2.5*math.Exp(-(x-4)/0.15) - 0.25*(x-5.3)*(x-5.3) + 0.05*(x-4)*(x-4)
	}
	p, err := NewPowerLaw(xs, ys, Meta{Name: "synthetic 401-node"})
	if err != nil {
		tb.Fatal(err)
	}
	return p
}

// twCondition returns κ = I(T1, T0)/(T1^q/Λ(T1)): the factor by which a
// relative rounding error of the time becomes a relative error of T1 in the
// inverse (derived: dT/T = dI/(T^q/Λ)). Rounding of doubles limits any
// method's round trip to about 1e-14 κ.
func twCondition(p *PowerLaw, t0, t1 float64, m int) float64 {
	g := math.Pow(t1, float64(m+1)) / float64(p.Lambda(model.Temperature(t1)))
	return p.Integral(model.Temperature(t1), model.Temperature(t0), m) / g
}

// TestTemperatureAfterRoundTrip checks TemperatureAfter(TimeToCool(T0→T1))
// = T1 (inverse by round trip; 1e-10 relative, scaled by the conditioning
// κ where κ > 10^3) and the converse in time (1e-12, widened for very short
// intervals).
func TestTemperatureAfterRoundTrip(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	g := Gas{NH: 0.01, TotalPerH: 2.3}
	check := func(name string, p *PowerLaw, proc Process, t0, t1, floor float64) {
		t.Helper()
		ct, err := p.TimeToCool(proc, g, model.Temperature(t0), model.Temperature(t1), model.Temperature(floor))
		if err != nil {
			t.Errorf("%s: TimeToCool(%v, %g→%g) error %v", name, proc, t0, t1, err)
			return
		}
		got, err := p.TemperatureAfter(proc, g, model.Temperature(t0), ct.Time, model.Temperature(floor))
		tol := 1e-10 * math.Max(1, twCondition(p, t0, t1, int(proc))/1e3)
		if err != nil || !scalar.EqualWithinRel(float64(got), t1, tol) {
			t.Errorf("%s: TemperatureAfter(%v, %g, TimeToCool(%g→%g) = %g) = %.15g, %v; want %g (±%.1g)",
				name, proc, t0, t0, t1, float64(ct.Time), float64(got), err, t1, tol)
			return
		}
		// Converse: the time back to the temperature reached (1e-12).
		half := ct.Time / 2
		mid, err := p.TemperatureAfter(proc, g, model.Temperature(t0), half, model.Temperature(floor))
		if err != nil {
			t.Errorf("%s: TemperatureAfter(%v, %g, %g) error %v", name, proc, t0, float64(half), err)
			return
		}
		// Rounding mid to a double moves ln T by ~1e-16 |ln T|, which a
		// short interval magnifies by 1/Δln T (derived).
		tolT := 1e-12 + 1e-14*math.Abs(math.Log(t0))/math.Log(t0/float64(mid))
		back, err := p.TimeToCool(proc, g, model.Temperature(t0), mid, model.Temperature(floor))
		if err != nil || !scalar.EqualWithinRel(float64(back.Time), float64(half), tolT) {
			t.Errorf("%s: TimeToCool(%v, %g→%g) = %g, %v; want %g (±%.1g)", name, proc, t0, float64(mid), float64(back.Time), err, float64(half), tolT)
		}
	}
	// Many segments: the 401-node table, end to end and in between.
	big := twTable(t)
	for _, proc := range []Process{Isochoric, Isobaric} {
		check("401 nodes", big, proc, 1e8, 1e4, 1e4)
		check("401 nodes", big, proc, 3e7, 1.3e4, 1e4)
		check("401 nodes", big, proc, 2e6, 1e5, 1e4)
		check("401 nodes + extension", big, proc, 1e9, 1e6, 1e4)
	}
	// Random curves with p = 0 and p ≈ 0 segments.
	for trial := 0; trial < 300; trial++ {
		proc := Process(trial % 2)
		c := twRandomCurve(t, r, float64(proc)+1)
		x0, x1 := c.xs[0], c.xs[len(c.xs)-1]+0.3
		a := x0 + (x1-x0)*r.Float64()
		b := a + (x1-a)*r.Float64()
		check("random", c.p, proc, math.Pow(10, b), math.Pow(10, a), 0)
	}
}

// TestTemperatureAfterFloor checks that gas reaches the floor in the time
// TimeToCool gives and stays there (range and floor policy, see
// PowerLaw).
func TestTemperatureAfterFloor(t *testing.T) {
	p := twTable(t)
	g := Gas{NH: 1e-3, TotalPerH: 2.25}
	const floor = 1.2e4
	for _, proc := range []Process{Isochoric, Isobaric} {
		ct, err := p.TimeToCool(proc, g, 1e6, floor, floor)
		if err != nil {
			t.Fatalf("TimeToCool(%v, 1e6→%g) error %v", proc, floor, err)
		}
		for _, k := range []float64{1, 1.5, 1e6, math.Inf(1)} {
			got, err := p.TemperatureAfter(proc, g, 1e6, ct.Time*model.Time(k), floor)
			// Exactly the floor (definition).
			if err != nil || (k > 1 && got != floor) || !scalar.EqualWithinRel(float64(got), floor, 1e-10) {
				t.Errorf("TemperatureAfter(%v, 1e6, %g × t_floor) = %.15g, %v; want %g", proc, k, float64(got), err, floor)
			}
		}
		got, err := p.TemperatureAfter(proc, g, 1e6, ct.Time*0.999, floor)
		if err != nil || !(got > floor) {
			t.Errorf("TemperatureAfter(%v, 1e6, 0.999 t_floor) = %g, %v; want above %g", proc, float64(got), err, floor)
		}
		// Below the floor nothing changes (Λ = 0 there; definition).
		if got, err := p.TemperatureAfter(proc, g, 1.1e4, 1e20, floor); err != nil || got != 1.1e4 {
			t.Errorf("TemperatureAfter(%v, 1.1e4 < floor, 1e20) = %g, %v; want 1.1e4", proc, float64(got), err)
		}
		if got, err := p.TemperatureAfter(proc, g, 3e5, 0, floor); err != nil || got != 3e5 {
			t.Errorf("TemperatureAfter(%v, 3e5, 0) = %g, %v; want 3e5", proc, float64(got), err)
		}
	}
	// floor = 0: the first node is the effective floor (range policy).
	if got, err := p.TemperatureAfter(Isochoric, g, 1e6, 1e30, 0); err != nil || !scalar.EqualWithinRel(float64(got), 1e4, 1e-12) {
		t.Errorf("TemperatureAfter(isochoric, 1e6, 1e30, floor 0) = %g, %v; want 1e4 (first node)", float64(got), err)
	}
}

// TestFloorDominated checks the floor-dominated flag on a CIE-like cliff
// (Λ falls 10^3.5 between 1.5e4 and 1e4 K, as CIE tables do, measured) and
// on a flat curve.
func TestFloorDominated(t *testing.T) {
	cliff, err := NewPowerLaw(
		[]float64{4, math.Log10(1.5e4), 5, 6},
		[]float64{-25.5, -22, -21.5, -22}, Meta{})
	if err != nil {
		t.Fatal(err)
	}
	flat, err := NewPowerLaw([]float64{4, 8}, []float64{-22, -22}, Meta{})
	if err != nil {
		t.Fatal(err)
	}
	g := Gas{NH: 1e-3, TotalPerH: 2.25}
	ct, err := cliff.TimeToCool(Isochoric, g, 1e6, 1e4, 1e4)
	if err != nil || !ct.FloorDominated || !(ct.FloorFraction > 0.5) {
		t.Errorf("cliff: TimeToCool(isochoric, 1e6→1e4) = %+v, %v; want FloorDominated", ct, err)
	}
	ct, err = flat.TimeToCool(Isochoric, g, 1e6, 1e4, 1e4)
	// Flat Λ: t ∝ ΔT, so the fraction is (10^4.1 − 10^4)/(10^6 − 10^4) (analytic).
	want := (math.Pow(10, 4.1) - 1e4) / (1e6 - 1e4)
	if err != nil || ct.FloorDominated || !scalar.EqualWithinRel(ct.FloorFraction, want, 1e-12) {
		t.Errorf("flat: TimeToCool(isochoric, 1e6→1e4) = %+v, %v; want FloorFraction %g, not dominated", ct, err, want)
	}
	// Stopping more than 0.1 dex above the floor: nothing accrues near it.
	if ct, err := cliff.TimeToCool(Isochoric, g, 1e6, 2e4, 1e4); err != nil || ct.FloorFraction != 0 || ct.FloorDominated {
		t.Errorf("cliff: TimeToCool(isochoric, 1e6→2e4, floor 1e4) = %+v, %v; want FloorFraction 0", ct, err)
	}
}

// TestTimeToCoolAdditiveMonotone checks t(T0→T1) = t(T0→Tm) + t(Tm→T1)
// (additivity of the integral; isochoric only, since the isobaric
// prefactor depends on T0) and that t grows as T1 falls (Λ > 0).
func TestTimeToCoolAdditiveMonotone(t *testing.T) {
	p := twTable(t)
	g := Gas{NH: 0.1, TotalPerH: 2.25}
	t0 := model.Temperature(5e7)
	prev := -1.0
	for lt := 7.6; lt >= 4; lt -= 0.037 {
		t1 := model.Temperature(math.Pow(10, lt))
		whole, err := p.TimeToCool(Isochoric, g, t0, t1, 1e4)
		if err != nil {
			t.Fatalf("TimeToCool(isochoric, %g→%g) error %v", float64(t0), float64(t1), err)
		}
		if !(float64(whole.Time) > prev) {
			t.Errorf("TimeToCool(isochoric, %g→%g) = %g, not above %g for a higher T1", float64(t0), float64(t1), float64(whole.Time), prev)
		}
		prev = float64(whole.Time)
		tm := model.Temperature(math.Sqrt(float64(t0) * float64(t1)))
		a, _ := p.TimeToCool(Isochoric, g, t0, tm, 1e4)
		b, _ := p.TimeToCool(Isochoric, g, tm, t1, 1e4)
		if !scalar.EqualWithinRel(float64(a.Time+b.Time), float64(whole.Time), 1e-13) {
			t.Errorf("TimeToCool(isochoric) %g→%g→%g: %g + %g ≠ %g", float64(t0), float64(tm), float64(t1), float64(a.Time), float64(b.Time), float64(whole.Time))
		}
		// Isobaric at the same pressure: the leg from Tm starts at n_H0 T0/Tm.
		wp, _ := p.TimeToCool(Isobaric, g, t0, t1, 1e4)
		ap, _ := p.TimeToCool(Isobaric, g, t0, tm, 1e4)
		gm := Gas{NH: g.NH * model.NumberDensity(float64(t0)/float64(tm)), TotalPerH: g.TotalPerH}
		bp, _ := p.TimeToCool(Isobaric, gm, tm, t1, 1e4)
		if !scalar.EqualWithinRel(float64(ap.Time+bp.Time), float64(wp.Time), 1e-13) {
			t.Errorf("TimeToCool(isobaric) %g→%g→%g: %g + %g ≠ %g", float64(t0), float64(tm), float64(t1), float64(ap.Time), float64(bp.Time), float64(wp.Time))
		}
	}
}

// TestCoolingTimeRejects checks each sentinel error (definitions in the doc
// comments) and that no input panics.
func TestCoolingTimeRejects(t *testing.T) {
	p := twTable(t)
	g := Gas{NH: 1e-3, TotalPerH: 2.25}
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		proc          Process
		g             Gas
		t0, t1, floor float64
		want          error
	}{
		{Isochoric, g, nan, 1e4, 1e4, ErrBadTemperature},
		{Isochoric, g, 1e6, -1, 1e4, ErrBadTemperature},
		{Isochoric, g, inf, 1e5, 1e4, ErrBadTemperature},
		{Isochoric, g, 1e6, 0, 0, ErrBadTemperature},
		{Isobaric, g, 1e6, 1e5, -1, ErrBadFloor},
		{Isobaric, g, 1e6, 1e5, nan, ErrBadFloor},
		{Isobaric, g, 1e6, 1e5, inf, ErrBadFloor},
		{Isochoric, Gas{NH: 0, TotalPerH: 2}, 1e6, 1e5, 1e4, ErrBadGas},
		{Isochoric, Gas{NH: 1, TotalPerH: nan}, 1e6, 1e5, 1e4, ErrBadGas},
		{Isochoric, Gas{NH: model.NumberDensity(inf), TotalPerH: 2}, 1e6, 1e5, 1e4, ErrBadGas},
		{Process(7), g, 1e6, 1e5, 1e4, ErrBadProcess},
		{Isochoric, g, 1e5, 1e6, 1e4, ErrNotCooling},
		{Isochoric, g, 1e6, 1.1e4, 1.2e4, ErrBelowFloor},
		{Isobaric, g, 1e6, 9e3, 0, ErrBelowFloor}, // below the first node
	}
	for _, c := range cases {
		_, err := p.TimeToCool(c.proc, c.g, model.Temperature(c.t0), model.Temperature(c.t1), model.Temperature(c.floor))
		if !errors.Is(err, c.want) {
			t.Errorf("TimeToCool(%v, %+v, %g→%g, floor %g) error = %v, want %v", c.proc, c.g, c.t0, c.t1, c.floor, err, c.want)
		}
		if c.want == ErrNotCooling || c.want == ErrBelowFloor {
			continue // TemperatureAfter has no t1
		}
		_, err = p.TemperatureAfter(c.proc, c.g, model.Temperature(c.t0), 1e10, model.Temperature(c.floor))
		if c.want == ErrBadTemperature && c.t0 > 0 && c.t0 < inf {
			continue // only t1 was bad
		}
		if !errors.Is(err, c.want) {
			t.Errorf("TemperatureAfter(%v, %+v, %g, 1e10, floor %g) error = %v, want %v", c.proc, c.g, c.t0, c.floor, err, c.want)
		}
	}
	for _, dt := range []float64{-1, nan, math.Inf(-1)} {
		if _, err := p.TemperatureAfter(Isochoric, g, 1e6, model.Time(dt), 1e4); !errors.Is(err, ErrBadTime) {
			t.Errorf("TemperatureAfter(isochoric, 1e6, %g) error = %v, want %v", dt, err, ErrBadTime)
		}
	}
}

// BenchmarkTimeToCool times one isobaric cooling time across the whole
// 401-node table, 10^8 → 10^4 K, floor fraction included.
func BenchmarkTimeToCool(b *testing.B) {
	p := twTable(b)
	g := Gas{NH: 1e-3, TotalPerH: 2.25}
	for b.Loop() {
		if _, err := p.TimeToCool(Isobaric, g, 1e8, 1e4, 1e4); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkTemperatureAfter times the inverse across the same table.
func BenchmarkTemperatureAfter(b *testing.B) {
	p := twTable(b)
	g := Gas{NH: 1e-3, TotalPerH: 2.25}
	ct, err := p.TimeToCool(Isobaric, g, 1e8, 1.01e4, 1e4)
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		if _, err := p.TemperatureAfter(Isobaric, g, 1e8, ct.Time, 1e4); err != nil {
			b.Fatal(err)
		}
	}
}
