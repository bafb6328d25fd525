package cooling

import (
	"errors"
	"fmt"
	"math"

	"cloudwind/model"
)

// Normalisation is the density product a source tabulates Λ against.
// cloudwind stores every curve per n_H²; the source's own normalisation is
// kept in Meta and shown to the user.
type Normalisation int

const (
	PerNH2  Normalisation = iota // L = n_H² Λ
	PerNeNH                      // L = n_e n_H Λ
	PerNeNt                      // L = n_e n_t Λ, n_t all ions and neutrals (SD93 "Λ_N")
	PerN2                        // L = n² Λ; ambiguous, treated as n_H² with a warning
)

var normNames = [...]string{"nH2", "nenH", "nent", "n2"}

// String returns "nH2", "nenH", "nent" or "n2", the names used in files and
// on the command line.
func (n Normalisation) String() string {
	if n < 0 || int(n) >= len(normNames) {
		return fmt.Sprintf("Normalisation(%d)", int(n))
	}
	return normNames[n]
}

// Symbol returns the density product as written in formulas, e.g. "n_e n_H".
func (n Normalisation) Symbol() string {
	switch n {
	case PerNeNH:
		return "n_e n_H"
	case PerNeNt:
		return "n_e n_t"
	case PerN2:
		return "n²"
	}
	return "n_H²"
}

// ParseNormalisation parses a Normalisation name (case-insensitive).
func ParseNormalisation(s string) (Normalisation, error) {
	for i, n := range normNames {
		if equalFold(s, n) {
			return Normalisation(i), nil
		}
	}
	return 0, fmt.Errorf("unknown normalisation %q (want nH2, nenH, nent or n2)", s)
}

func equalFold(a, b string) bool {
	if len(a) != len(b) {
		return false
	}
	for i := 0; i < len(a); i++ {
		x, y := a[i], b[i]
		if 'A' <= x && x <= 'Z' {
			x += 'a' - 'A'
		}
		if 'A' <= y && y <= 'Z' {
			y += 'a' - 'A'
		}
		if x != y {
			return false
		}
	}
	return true
}

// Meta describes where a cooling curve comes from. It travels with the
// curve so that every display can say what is loaded.
type Meta struct {
	Name          string        // short name, e.g. "built-in CIE (KWH96+V97 H+He, CHIANTI-fit metals)"
	Citation      string        // the sources
	Normalisation Normalisation // the source's own normalisation (values are stored per n_H²)
	HeliumRatio   float64       // y = n_He/n_H assumed by the source; 0 when unknown
	Metallicity   float64       // Z in Z☉ of this curve; NaN when it does not apply
	Mixture       string        // abundance set of the metals, e.g. "Grevesse & Sauval 1998"
	Historical    bool          // a historical fit kept for comparison
	Caveats       []string      // e.g. "CIE, optically thin, low density; no photoionisation, no non-equilibrium ionisation"
	Warnings      []string      // problems noticed while loading; shown to the user
}

// Standard caveat of every CIE curve.
const CaveatCIE = "CIE, optically thin, low density; no photoionisation, no non-equilibrium ionisation"

// RangeStatus says how Λ at a temperature was obtained.
type RangeStatus int

const (
	InTable    RangeStatus = iota // between the first and last node
	BelowTable                    // below the first node: Λ = 0
	AboveTable                    // above the last node: bremsstrahlung-slope extension
)

// String returns "in table", "below table" or "above table".
func (r RangeStatus) String() string {
	switch r {
	case BelowTable:
		return "below table"
	case AboveTable:
		return "above table (extended as T^1/2)"
	}
	return "in table"
}

// ExtensionSlope is the power of T used above the last node: Λ ∝ T^{1/2},
// the slope of thermal bremsstrahlung (Rybicki & Lightman 1979 eq. 5.15b;
// cloudwind's range policy).
const ExtensionSlope = 0.5

// PowerLaw is the canonical form of every cooling function: a piecewise
// power law through nodes (T_i, Λ_i), Λ per n_H² in erg cm³ s⁻¹, that is
// linear in log10 T – log10 Λ between nodes. It is immutable once built and
// safe for concurrent use.
//
// Range policy (cloudwind's choice): between the first and last node Λ
// is interpolated; above the last node it continues as Λ_last (T/T_last)^{1/2}
// (bremsstrahlung slope) and Classify reports AboveTable; below the first
// node Λ = 0 and Classify reports BelowTable. A cooling floor is the
// caller's: model applies Params.TFloor, and the cooling-time functions take
// the floor as an argument.
type PowerLaw struct {
	log10T, log10L []float64 // nodes, strictly increasing log10T; finite log10L
	slope          []float64 // slope[i] = d log Λ/d log T on [i, i+1]
	lnT, lnL       []float64 // the nodes as natural logs, for fast evaluation
	uniform        bool      // nodes evenly spaced in log T (to 1e-9 dex)
	x0, invDx      float64   // first ln T and 1/spacing when uniform
	cells          float64   // number of cells, n−1, as a float
	meta           Meta
}

// Sentinel errors of NewPowerLaw.
var (
	ErrTooFewNodes   = errors.New("a cooling curve needs at least 2 nodes")
	ErrNotIncreasing = errors.New("temperatures must be strictly increasing")
	ErrNotFinite     = errors.New("values must be finite")
)

// NewPowerLaw builds a PowerLaw from nodes given as log10 T (K) and
// log10 Λ (erg cm³ s⁻¹, per n_H²). The slices are copied.
func NewPowerLaw(log10T, log10Lambda []float64, meta Meta) (*PowerLaw, error) {
	n := len(log10T)
	if n != len(log10Lambda) {
		return nil, fmt.Errorf("cooling: %d temperatures but %d values", n, len(log10Lambda))
	}
	if n < 2 {
		return nil, ErrTooFewNodes
	}
	p := &PowerLaw{
		log10T: append([]float64(nil), log10T...),
		log10L: append([]float64(nil), log10Lambda...),
		slope:  make([]float64, n-1),
		lnT:    make([]float64, n),
		lnL:    make([]float64, n),
		meta:   meta,
	}
	for i := 0; i < n; i++ {
		x, y := p.log10T[i], p.log10L[i]
		if math.IsNaN(x) || math.IsInf(x, 0) || math.IsNaN(y) || math.IsInf(y, 0) {
			return nil, fmt.Errorf("node %d: %w", i, ErrNotFinite)
		}
		if i > 0 && !(x > p.log10T[i-1]) {
			return nil, fmt.Errorf("node %d (log T = %g): %w", i, x, ErrNotIncreasing)
		}
		p.lnT[i], p.lnL[i] = x*math.Ln10, y*math.Ln10
	}
	for i := 0; i < n-1; i++ {
		p.slope[i] = (p.log10L[i+1] - p.log10L[i]) / (p.log10T[i+1] - p.log10T[i])
	}
	dx := (p.log10T[n-1] - p.log10T[0]) / float64(n-1)
	p.uniform = true
	for i := 1; i < n; i++ {
		if math.Abs(p.log10T[i]-p.log10T[0]-float64(i)*dx) > 1e-9 {
			p.uniform = false
			break
		}
	}
	p.x0, p.invDx, p.cells = p.lnT[0], 1/(dx*math.Ln10), float64(n-1)
	return p, nil
}

// nodeSlack is how far below the first node, in ln T, a temperature still
// counts as on it: a few ulps of ln T, so that T = 10^log10T[0] computed by
// a caller is not cut off by rounding.
const nodeSlack = 1e-12

// Lambda returns Λ(t) per n_H² in erg cm³ s⁻¹ under the range policy.
//
// Special cases are:
//
//	Lambda(t < first node) = 0
//	Lambda(NaN) = 0
func (p *PowerLaw) Lambda(t model.Temperature) model.CoolingRate {
	lt := math.Log(float64(t))
	if p.uniform {
		// Fast path: the cell index from the even spacing. Rounding may put
		// a temperature on a node into the neighbouring cell, whose line
		// meets the node at the same value (the curve is continuous).
		if f := (lt - p.x0) * p.invDx; f >= 0 && f < p.cells {
			i := int(f)
			return model.CoolingRate(math.Exp(p.lnL[i] + p.slope[i]*(lt-p.lnT[i])))
		}
	}
	n := len(p.lnT)
	if !(lt >= p.lnT[0]) { // also NaN
		// A temperature that rounding put a hair below the first node
		// (10^log10 T) counts as on it.
		if !(lt >= p.lnT[0]-nodeSlack) {
			return 0
		}
		lt = p.lnT[0]
	}
	if lt >= p.lnT[n-1] {
		return model.CoolingRate(math.Exp(p.lnL[n-1] + ExtensionSlope*(lt-p.lnT[n-1])))
	}
	i := p.segment(lt)
	return model.CoolingRate(math.Exp(p.lnL[i] + p.slope[i]*(lt-p.lnT[i])))
}

// segment returns i with lnT[i] ≤ lt < lnT[i+1], for lt inside the table.
func (p *PowerLaw) segment(lt float64) int {
	n := len(p.lnT)
	if p.uniform {
		i := int((lt - p.x0) * p.invDx)
		// Rounding can put lt one cell off; correct it.
		if i > n-2 {
			i = n - 2
		}
		if i > 0 && lt < p.lnT[i] {
			i--
		} else if i < n-2 && lt >= p.lnT[i+1] {
			i++
		}
		return i
	}
	lo, hi := 0, n-1 // invariant: lnT[lo] ≤ lt < lnT[hi]
	for hi-lo > 1 {
		m := int(uint(lo+hi) >> 1)
		if p.lnT[m] <= lt {
			lo = m
		} else {
			hi = m
		}
	}
	return lo
}

// Nodes returns the nodes as log10 T and log10 Λ; callers must not modify
// the slices. It makes *PowerLaw a model.PiecewisePowerLaw.
func (p *PowerLaw) Nodes() (log10T, log10Lambda []float64) { return p.log10T, p.log10L }

// ValidRange returns the temperatures of the first and last node. It makes
// *PowerLaw a model.RangedCooling.
func (p *PowerLaw) ValidRange() (lo, hi model.Temperature) {
	return model.Temperature(math.Pow(10, p.log10T[0])), model.Temperature(math.Pow(10, p.log10T[len(p.log10T)-1]))
}

// Classify reports whether Λ(t) comes from the table or the range policy.
func (p *PowerLaw) Classify(t model.Temperature) RangeStatus {
	lt := math.Log10(float64(t))
	switch {
	case !(lt >= p.log10T[0]-nodeSlack):
		return BelowTable
	case lt > p.log10T[len(p.log10T)-1]:
		return AboveTable
	}
	return InTable
}

// Meta returns the curve's metadata.
func (p *PowerLaw) Meta() Meta { return p.meta }

// String names the curve.
func (p *PowerLaw) String() string { return p.meta.Name }

// Sample turns an analytic function Λ(T) (per n_H², erg cm³ s⁻¹, > 0) into
// a PowerLaw with nodes every dlog dex from tMin to tMax (both included).
// Log-log interpolation of a smooth curve at 0.01 dex errs by at most ~0.5%
// (measured on the primordial curve: 0.45% at the steep H rise).
func Sample(f func(model.Temperature) model.CoolingRate, tMin, tMax model.Temperature, dlog float64, meta Meta) (*PowerLaw, error) {
	a, b := math.Log10(float64(tMin)), math.Log10(float64(tMax))
	if !(b > a) || !(dlog > 0) {
		return nil, fmt.Errorf("cooling: bad sampling range [%s, %s] K step %s dex", num(float64(tMin)), num(float64(tMax)), num(dlog))
	}
	n := int(math.Round((b-a)/dlog)) + 1
	if n < 2 {
		n = 2
	}
	xs, ys := make([]float64, n), make([]float64, n)
	for i := range xs {
		xs[i] = a + (b-a)*float64(i)/float64(n-1)
		v := float64(f(model.Temperature(math.Pow(10, xs[i]))))
		if !(v > 0) || math.IsInf(v, 0) {
			return nil, fmt.Errorf("cooling: Λ(10^%.3f K) = %s is not a positive finite number", xs[i], num(v))
		}
		ys[i] = math.Log10(v)
	}
	return NewPowerLaw(xs, ys, meta)
}

// num writes v for messages with six significant figures, without
// exponent padding (1e6, not 1e+06).
func num(v float64) string { return model.FormatNumber(v, 6) }
