package model

import (
	"fmt"
	"math"
)

// A CoolingFunction gives Λ(T) in erg cm³ s⁻¹, normalised per n_H²: the
// volumetric loss rate of gas at temperature T is n_H² Λ(T) (or n² Λ(T)
// under the N2 convention). Λ must be ≥ 0 and finite; zero means the gas
// does not cool (below a floor, say).
type CoolingFunction interface {
	Lambda(t Temperature) CoolingRate
}

// A PiecewisePowerLaw is a CoolingFunction that is a power law between
// consecutive nodes in log10 T – log10 Λ and a power law beyond the end
// nodes. Nodes returns the nodes in ascending log10 T; callers must not
// modify the slices. A function with no nodes is a single power law. Model
// code uses the nodes to find extrema along an isobar exactly, since on each
// segment T^a/Λ is monotonic.
type PiecewisePowerLaw interface {
	CoolingFunction
	Nodes() (log10T, log10Lambda []float64)
}

// A RangedCooling reports the temperature range where its values come from
// data or a fit rather than an extension. Model code reports the
// temperatures of interest that fall outside it.
type RangedCooling interface {
	CoolingFunction
	ValidRange() (lo, hi Temperature)
}

// ConstantCooling is Λ(T) = Value at every temperature: the normalisation
// used to state analytic criteria such as [GO18]'s Λ_mix = 10^-21.4.
type ConstantCooling struct {
	Value CoolingRate // Λ in erg cm³ s⁻¹, per n_H²
}

// Lambda returns c.Value.
func (c ConstantCooling) Lambda(Temperature) CoolingRate { return c.Value }

// Nodes returns no nodes: Λ is one power law (of slope 0).
func (c ConstantCooling) Nodes() (log10T, log10Lambda []float64) { return nil, nil }

// String describes the function.
func (c ConstantCooling) String() string {
	return fmt.Sprintf("constant Λ = %s erg cm³ s⁻¹", FormatNumber(float64(c.Value), 4))
}

// PowerLawCooling is Λ(T) = L0 (T/T0)^Slope at every temperature.
type PowerLawCooling struct {
	L0    CoolingRate // Λ at T0, erg cm³ s⁻¹ per n_H²
	T0    Temperature // pivot temperature, K
	Slope float64     // d ln Λ / d ln T
}

// Lambda returns L0 (T/T0)^Slope.
func (c PowerLawCooling) Lambda(t Temperature) CoolingRate {
	return CoolingRate(float64(c.L0) * math.Pow(float64(t)/float64(c.T0), c.Slope))
}

// Nodes returns no nodes: Λ is one power law.
func (c PowerLawCooling) Nodes() (log10T, log10Lambda []float64) { return nil, nil }

// String describes the function.
func (c PowerLawCooling) String() string {
	return fmt.Sprintf("power law Λ = %s (T/%s K)^%s erg cm³ s⁻¹", FormatNumber(float64(c.L0), 4), FormatNumber(float64(c.T0), 4), FormatNumber(c.Slope, 4))
}

// isobarPoint is a temperature on the mixing isobar with Λ there.
type isobarPoint struct {
	T      Temperature
	Lambda CoolingRate
	ok     bool // false when Λ = 0 over the whole range
}

// log10OrNegInf returns log10 x, or −Inf for x ≤ 0.
func log10OrNegInf(x float64) float64 {
	if !(x > 0) {
		return math.Inf(-1)
	}
	return math.Log10(x)
}

// minLogRatio returns, for e = e0 and e = e1, the temperature in [lo, hi]
// (lo ≤ hi) that minimises
//
//	g(T) = e·log10 T − log10 Λ(T),
//
// with Λ there. lLo and lHi are Λ(lo) and Λ(hi), which the caller already
// has. For a PiecewisePowerLaw g is linear in log T on every segment, so its
// minimum lies at an end or a node and the search is exact (and reads Λ at
// the nodes without calling Lambda). For any other CoolingFunction it
// samples 257 points evenly in log T and refines the best bracket by
// golden-section search (Kiefer 1953).
func minLogRatio(cf CoolingFunction, lo, hi Temperature, lLo, lHi CoolingRate, e0, e1 float64) (m0, m1 isobarPoint) {
	logLo, logHi := math.Log10(float64(lo)), math.Log10(float64(hi))
	yLo, yHi := log10OrNegInf(float64(lLo)), log10OrNegInf(float64(lHi))
	// The ends, where extensions and floors apply through Lambda.
	m0, g0 := isobarPoint{lo, lLo, true}, e0*logLo-yLo
	m1, g1 := isobarPoint{lo, lLo, true}, e1*logLo-yLo
	if v := e0*logHi - yHi; v < g0 {
		m0, g0 = isobarPoint{hi, lHi, true}, v
	}
	if v := e1*logHi - yHi; v < g1 {
		m1, g1 = isobarPoint{hi, lHi, true}, v
	}
	if pw, isPW := cf.(PiecewisePowerLaw); isPW {
		xs, ys := pw.Nodes()
		// First node strictly above lo (binary search).
		i, j := 0, len(xs)
		for i < j {
			h := int(uint(i+j) >> 1)
			if xs[h] <= logLo {
				i = h + 1
			} else {
				j = h
			}
		}
		b0, b1 := -1, -1
		for ; i < len(xs) && xs[i] < logHi; i++ {
			x, y := xs[i], ys[i]
			if v := e0*x - y; v < g0 {
				g0, b0 = v, i
			}
			if v := e1*x - y; v < g1 {
				g1, b1 = v, i
			}
		}
		if b0 >= 0 {
			m0 = isobarPoint{Temperature(math.Pow(10, xs[b0])), CoolingRate(math.Pow(10, ys[b0])), true}
		}
		if b1 >= 0 {
			m1 = isobarPoint{Temperature(math.Pow(10, xs[b1])), CoolingRate(math.Pow(10, ys[b1])), true}
		}
	} else {
		at := func(t Temperature) float64 { return log10OrNegInf(float64(cf.Lambda(t))) }
		if t, v := sampledMin(at, logLo, logHi, e0); v < g0 {
			m0, g0 = isobarPoint{t, cf.Lambda(t), true}, v
		}
		if t, v := sampledMin(at, logLo, logHi, e1); v < g1 {
			m1, g1 = isobarPoint{t, cf.Lambda(t), true}, v
		}
	}
	m0.ok, m1.ok = !math.IsInf(g0, 1), !math.IsInf(g1, 1)
	return m0, m1
}

// sampledMin minimises e·x − at(10^x) over the interior of [logLo, logHi]
// by sampling and golden-section refinement; at returns log10 Λ.
func sampledMin(at func(Temperature) float64, logLo, logHi, e float64) (Temperature, float64) {
	const n = 256
	gAt := func(x float64) float64 { return e*x - at(Temperature(math.Pow(10, x))) }
	best, bestG := -1, math.Inf(1)
	step := (logHi - logLo) / n
	for k := 1; k < n; k++ {
		if v := gAt(logLo + float64(k)*step); v < bestG {
			best, bestG = k, v
		}
	}
	if best < 0 {
		return Temperature(math.NaN()), math.Inf(1)
	}
	bestX := logLo + float64(best)*step
	a, b := bestX-step, bestX+step
	const r = 0.6180339887498949 // (√5 − 1)/2
	c, d := b-r*(b-a), a+r*(b-a)
	gc, gd := gAt(c), gAt(d)
	for k := 0; k < 60 && b-a > 1e-12; k++ {
		if gc < gd {
			b, d, gd = d, c, gc
			c = b - r*(b-a)
			gc = gAt(c)
		} else {
			a, c, gc = c, d, gd
			d = a + r*(b-a)
			gd = gAt(d)
		}
	}
	if x := (a + b) / 2; gAt(x) < bestG {
		bestX, bestG = x, gAt(x)
	}
	return Temperature(math.Pow(10, bestX)), bestG
}
