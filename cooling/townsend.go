package cooling

import (
	"errors"
	"fmt"
	"math"

	"cloudwind/model"
)

// Exact cooling times on a piecewise power law (Townsend 2009, ApJS 181,
// 391, arXiv:0901.3146; the segment integrals and their inverse are derived
// here). On a segment where Λ = Λ_k (T/T_k)^{α_k} the integral of T^m/Λ has
// a closed form, so summing segments is exact for the curve as
// interpolated: there is no step size and no ODE solver.

// Process is the thermodynamic path of cooling gas.
type Process int

const (
	Isochoric Process = iota // constant density: n_H fixed
	Isobaric                 // constant pressure: n_H T fixed
)

// String returns "isochoric" or "isobaric".
func (pr Process) String() string {
	switch pr {
	case Isochoric:
		return "isochoric"
	case Isobaric:
		return "isobaric"
	}
	return fmt.Sprintf("Process(%d)", int(pr))
}

// Gas is the composition and density of cooling gas. The composition is
// held constant while it cools (see TimeToCool for what that costs).
type Gas struct {
	NH        model.NumberDensity // n_H at the initial temperature T0, cm⁻³; > 0
	TotalPerH float64             // n_tot/n_H, all particles per H nucleus; fully ionised H+He: 2+3y (derived); > 0
}

// CoolingTime is the result of TimeToCool.
type CoolingTime struct {
	Time model.Time // time to cool from T0 to T1, s
	// FloorFraction is the fraction of Time accrued while the gas is within
	// 0.1 dex above the effective floor, in [0, 1]; 0 when T1 lies more than
	// 0.1 dex above it (cloudwind's choice).
	FloorFraction float64
	// FloorDominated is FloorFraction > 0.5: most of the time is spent just
	// above the floor, so the answer depends mainly on where the floor is
	// (cloudwind's flag: in CIE, Λ collapses just above 10^4 K, measured on
	// published tables).
	FloorDominated bool
	// Floor is the effective floor, max(floor, first node): Λ = 0 below
	// the first node, so cooling stops there as it does at a floor.
	Floor model.Temperature
}

// floorBandDex is the width of the band above the floor whose share of the
// time is reported (cloudwind's choice).
const floorBandDex = 0.1

// floorDominatedAbove is the FloorFraction above which a time is flagged
// (cloudwind's choice).
const floorDominatedAbove = 0.5

// nodeTolerance is the relative distance below the first node within which
// a temperature counts as on it, so that a temperature obtained as
// 10^(log10 T_0) is not put below the table by rounding (common practice, no
// source).
const nodeTolerance = 1e-12

// resyncEvery is how many segments T^q/Λ is carried from node to node by
// multiplication before it is recomputed from the node values; carrying
// it saves an exp per segment and drifts by at most ~1 ulp per step
// (common practice, no source).
const resyncEvery = 64

// Sentinel errors of TimeToCool and TemperatureAfter.
var (
	ErrBadProcess     = errors.New("unknown cooling process")
	ErrBadTemperature = errors.New("temperature must be positive and finite")
	ErrBadFloor       = errors.New("floor must be zero or positive and finite")
	ErrBadGas         = errors.New("n_H and n_tot/n_H must be positive and finite")
	ErrBadTime        = errors.New("time must be zero or positive")
	ErrNotCooling     = errors.New("final temperature above the initial temperature")
	ErrBelowFloor     = errors.New("temperature below the cooling floor")
)

// Integral returns the exact integral
//
//	I_m(a, b) = ∫_a^b T^m / Λ(T) dT,  in K^{m+1} / (erg cm³ s⁻¹),
//
// of the piecewise power law, the extension above the last node included.
// Per segment, with Λ = Λ_k (T/T_k)^{α_k} and p = m − α_k + 1,
//
//	∫_a^b T^m/Λ dT = (T_k^{α_k}/Λ_k) (b^p − a^p)/p     (p ≠ 0)
//	               = (T_k^{α_k}/Λ_k) ln(b/a)            (p = 0),
//
// evaluated as (a^{m+1}/Λ(a)) expm1(p ln(b/a))/p, which stays accurate as
// p → 0 (Townsend 2009). m = 0 gives the isochoric
// and m = 1 the isobaric cooling time; other integers work too.
//
// Special cases are:
//
//	Integral(a, a, m) = 0
//	Integral(a, b, m) = −Integral(b, a, m)        for a > b
//	Integral(a, b, m) = +Inf   for a < b if a is below the first node (Λ = 0), a ≤ 0 included
//	Integral(a, +Inf, m) = +Inf                   for m ≥ 0
//	Integral(NaN, b, m) = Integral(a, NaN, m) = NaN
func (p *PowerLaw) Integral(a, b model.Temperature, m int) float64 {
	x, y := float64(a), float64(b)
	switch {
	case math.IsNaN(x) || math.IsNaN(y):
		return math.NaN()
	case x == y:
		return 0
	case x > y:
		return -p.Integral(b, a, m)
	}
	la, ok := p.clampToTable(math.Log(x))
	if !ok {
		return math.Inf(1)
	}
	return p.integral(la, math.Log(y), float64(m+1))
}

// clampToTable moves lt onto the first node when it lies within
// nodeTolerance below it; ok is false when lt is further below (or NaN).
func (p *PowerLaw) clampToTable(lt float64) (float64, bool) {
	switch {
	case lt >= p.lnT[0]:
		return lt, true
	case lt >= p.lnT[0]-nodeTolerance:
		return p.lnT[0], true
	}
	return lt, false
}

// integral returns ∫ T^{q−1}/Λ dT between ln T = la and lb, for
// lnT[0] ≤ la ≤ lb (lb may be +Inf), as the sum over segments of
// G(lo) expm1(p Δ)/p with G = T^q/Λ and p = q − α (Townsend 2009). G is
// carried from node to node as G e^{pΔ} = G + G
// expm1(pΔ), so a whole segment costs one expm1.
func (p *PowerLaw) integral(la, lb, q float64) float64 {
	if !(lb > la) {
		return 0
	}
	n := len(p.lnT)
	k := n - 1
	if la < p.lnT[n-1] {
		k = p.segment(la)
	}
	sum, lo := 0.0, la
	g := math.Exp(q*lo - (p.lnL[k] + p.segSlope(k)*(lo-p.lnT[k]))) // G(lo)
	// Whole and partial segments inside the table.
	for carried := 1; k < n-1; k, carried = k+1, carried+1 {
		if carried%resyncEvery == 0 {
			g = math.Exp(q*lo - p.lnL[k]) // lo is node k here
		}
		hi := p.lnT[k+1]
		end := hi
		if lb < hi {
			end = lb
		}
		pw, d := q-p.slope[k], end-lo
		x := pw * d
		if x == 0 { // p = 0: the logarithmic case, G ln(b/a)
			sum += g * d
		} else {
			e := math.Expm1(x)
			sum += g * e / pw
			g += g * e
		}
		if lb <= hi {
			return sum
		}
		lo = hi
	}
	// The extension above the last node, Λ ∝ T^{1/2} (range policy, see PowerLaw).
	return sum + g*expm1Over(q-ExtensionSlope, lb-lo)
}

// segSlope returns the slope of segment k, the extension's for k = n−1.
func (p *PowerLaw) segSlope(k int) float64 {
	if k >= len(p.slope) {
		return ExtensionSlope
	}
	return p.slope[k]
}

// expm1Over returns (e^{p d} − 1)/p, and d when p d = 0.
func expm1Over(pw, d float64) float64 {
	x := pw * d
	if x == 0 {
		return d
	}
	return math.Expm1(x) / pw
}

// prefactor returns C with t = C ∫ T^m/Λ dT, and q = m+1, for the process
// (derived: thermal energy f n_tot k T lost at n_H² Λ per volume, with n_H
// constant when isochoric and n_H T constant when isobaric):
//
//	isochoric: t = (3/2)(n_tot/n_H)(k/n_H) ∫ dT/Λ
//	isobaric:  t = (5/2)(n_tot/n_H) k/(n_H0 T0) ∫ T dT/Λ
func prefactor(proc Process, g Gas, t0 float64) (c, q float64, err error) {
	nH, x := float64(g.NH), g.TotalPerH
	if !(nH > 0) || math.IsInf(nH, 1) || !(x > 0) || math.IsInf(x, 1) {
		return 0, 0, fmt.Errorf("n_H = %s cm⁻³, n_tot/n_H = %s: %w", num(nH), num(x), ErrBadGas)
	}
	const k = model.Boltzmann
	switch proc {
	case Isochoric:
		return 1.5 * x * k / nH, 1, nil
	case Isobaric:
		return 2.5 * x * k / (nH * t0), 2, nil
	}
	return 0, 0, fmt.Errorf("%v: %w", proc, ErrBadProcess)
}

// checkTemperature validates a temperature argument.
func checkTemperature(name string, t model.Temperature) error {
	if v := float64(t); !(v > 0) || math.IsInf(v, 1) {
		return fmt.Errorf("%s = %s K: %w", name, num(v), ErrBadTemperature)
	}
	return nil
}

// effectiveFloor returns max(floor, first node) in K and as ln T.
func (p *PowerLaw) effectiveFloor(floor model.Temperature) (tf, lf float64, err error) {
	f := float64(floor)
	if !(f >= 0) || math.IsInf(f, 1) {
		return 0, 0, fmt.Errorf("floor = %s K: %w", num(f), ErrBadFloor)
	}
	if lnf := math.Log(f); lnf > p.lnT[0] {
		return f, lnf, nil
	}
	return math.Pow(10, p.log10T[0]), p.lnT[0], nil
}

// TimeToCool returns the time gas takes to cool from t0 to t1 (t1 ≤ t0)
// along the process, at constant composition, with Λ per n_H² from p
// (Townsend 2009; the prefactors derived, see prefactor):
//
//	isochoric: t = (3/2)(n_tot/n_H)(k/n_H) ∫_{T1}^{T0} dT/Λ
//	isobaric:  t = (5/2)(n_tot/n_H) k/(n_H0 T0) ∫_{T1}^{T0} T dT/Λ,
//
// with n_H0 = g.NH the density at t0 and k = model.Boltzmann. The
// integrals are exact for the piecewise power law (see Integral).
//
// Cooling stops at the effective floor max(floor, first node), since Λ = 0
// below the first node; floor = 0 means no floor other than the table's.
// A t1 below the effective floor is never reached: TimeToCool returns
// ErrBelowFloor rather than +Inf, so the caller can say why. The result
// reports the share of the time spent within 0.1 dex above the floor and
// flags it when above one half (cloudwind's choice).
//
// Approximation: n_tot/n_H is held constant, i.e. the gas is treated as
// fully ionised throughout. That is wrong below about 2×10^4 K, where
// n_e/n_H drops and n_tot/n_H falls from ≈2.25 to ≈1.1 (derived: 2+3y fully
// ionised, 1+y neutral): the thermal energy, and so the time spent there,
// is overestimated by up to ≈2× (derived). Λ_CIE collapses there too, so
// the floor flag usually fires first.
//
// Special cases are:
//
//	TimeToCool(proc, g, t0, t0, floor) = 0        for t0 ≥ effective floor
//	TimeToCool(…, t1 > t0, …)         → ErrNotCooling
//	TimeToCool(…, t1 < eff. floor, …) → ErrBelowFloor
//	t0, t1 ≤ 0, NaN or +Inf           → ErrBadTemperature
//	floor < 0, NaN or +Inf            → ErrBadFloor
//	g.NH, g.TotalPerH ≤ 0, NaN, +Inf  → ErrBadGas
//	unknown proc                      → ErrBadProcess
//
// Time overflows to +Inf (with FloorFraction 0) only for absurd inputs,
// such as T0 ~ 10^300 K.
func (p *PowerLaw) TimeToCool(proc Process, g Gas, t0, t1, floor model.Temperature) (CoolingTime, error) {
	if err := checkTemperature("t0", t0); err != nil {
		return CoolingTime{}, err
	}
	if err := checkTemperature("t1", t1); err != nil {
		return CoolingTime{}, err
	}
	tf, lf, err := p.effectiveFloor(floor)
	if err != nil {
		return CoolingTime{}, err
	}
	c, q, err := prefactor(proc, g, float64(t0))
	if err != nil {
		return CoolingTime{}, err
	}
	if t1 > t0 {
		return CoolingTime{}, fmt.Errorf("t1 = %s K > t0 = %s K: %w", num(float64(t1)), num(float64(t0)), ErrNotCooling)
	}
	l0, l1 := math.Log(float64(t0)), math.Log(float64(t1))
	if l1 < lf {
		if l1 < lf-nodeTolerance {
			return CoolingTime{}, fmt.Errorf("t1 = %s K, effective floor %s K: %w", num(float64(t1)), num(tf), ErrBelowFloor)
		}
		l1 = lf
		l0 = math.Max(l0, lf)
	}
	res := CoolingTime{Floor: model.Temperature(tf)}
	total := p.integral(l1, l0, q)
	res.Time = model.Time(c * total)
	if band := math.Min(l0, lf+floorBandDex*math.Ln10); total > 0 && !math.IsInf(total, 1) && l1 < band {
		res.FloorFraction = math.Min(1, p.integral(l1, band, q)/total)
		res.FloorDominated = res.FloorFraction > floorDominatedAbove
	}
	return res, nil
}

// TemperatureAfter returns the temperature of gas that starts at t0 and
// cools along the process for a time dt: the exact inverse of TimeToCool
// (derived). Within a
// segment, with x = dt Λ(b)/(C b^{m+1}) for gas at T = b and C the
// prefactor of TimeToCool,
//
//	ln a = ln b + log1p(−p x)/p   (p ≠ 0),   ln a = ln b − x   (p = 0);
//
// when that would leave the segment, the segment's whole time is subtracted
// and the walk continues below. The gas reaches the effective floor
// max(floor, first node) in a finite time and stays there. The same
// constant-composition approximation as TimeToCool applies.
//
// Special cases are:
//
//	TemperatureAfter(proc, g, t0, 0, floor)    = t0
//	TemperatureAfter(proc, g, t0, +Inf, floor) = effective floor (or t0 if below it)
//	TemperatureAfter(…, t0 < eff. floor, …)    = t0 (Λ = 0: no cooling)
//	dt < 0 or NaN → ErrBadTime; other bad inputs as for TimeToCool
func (p *PowerLaw) TemperatureAfter(proc Process, g Gas, t0 model.Temperature, dt model.Time, floor model.Temperature) (model.Temperature, error) {
	if err := checkTemperature("t0", t0); err != nil {
		return 0, err
	}
	tf, lf, err := p.effectiveFloor(floor)
	if err != nil {
		return 0, err
	}
	c, q, err := prefactor(proc, g, float64(t0))
	if err != nil {
		return 0, err
	}
	tau := float64(dt)
	if !(tau >= 0) {
		return 0, fmt.Errorf("dt = %s s: %w", num(tau), ErrBadTime)
	}
	lb := math.Log(float64(t0))
	switch {
	case lb <= lf || tau == 0:
		return t0, nil
	case math.IsInf(tau, 1):
		return model.Temperature(tf), nil
	}
	la, atFloor := p.coolLn(lb, lf, q, tau/c)
	if atFloor {
		return model.Temperature(tf), nil
	}
	return model.Temperature(math.Exp(la)), nil
}

// coolLn walks down from ln T = lb (> lf) for the reduced time s = t/C and
// returns the final ln T, or atFloor when the floor lf is reached. On each
// segment the whole reduced time from b down to lo is
// G(b) expm1(−pΔ)/(−p), G = T^q/Λ (derived from the segment integral).
func (p *PowerLaw) coolLn(lb, lf, q, s float64) (la float64, atFloor bool) {
	n := len(p.lnT)
	k := n - 1 // segment whose interior lies just below lb
	if lb <= p.lnT[n-1] {
		k = p.segment(lb)
		if k > 0 && p.lnT[k] >= lb {
			k--
		}
	}
	g := math.Exp(q*lb - (p.lnL[k] + p.segSlope(k)*(lb-p.lnT[k]))) // G at lb
	for carried := 1; k >= 0; k, carried = k-1, carried+1 {
		alpha := p.segSlope(k)
		if carried%resyncEvery == 0 {
			g = math.Exp(q*lb - (p.lnL[k] + alpha*(lb-p.lnT[k])))
		}
		lo := p.lnT[k]
		if lo < lf {
			lo = lf
		}
		pw, d := q-alpha, lb-lo
		e, seg := 0.0, g*d
		if x := -pw * d; x != 0 {
			e = math.Expm1(x)
			seg = g * e / -pw
		}
		if s < seg {
			// ln a = ln b + log1p(−p x)/p, x = s/G(b) (derived).
			x := s / g
			d := x
			if y := -pw * x; y != 0 {
				d = -math.Log1p(y) / pw
			}
			la = lb - d
			if !(la > lo) { // rounding (or log1p(−1) = −Inf) at the lower end
				la = lo
			}
			return la, la <= lf
		}
		s -= seg
		lb = lo
		if lo <= lf {
			return lf, true
		}
		g += g * e
	}
	return lf, true // unreachable for lf ≥ lnT[0]: the floor ends every walk
}
