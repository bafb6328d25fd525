package cooling

import (
	"fmt"
	"io/fs"
	"math"

	"cloudwind/assets"
	"cloudwind/model"
)

// Builtin is cloudwind's built-in cooling function: collisional ionisation
// equilibrium (CIE) down to about 1.3×10^4 K, and the neutral-ISM fit of
// Koyama & Inutsuka (2002) below 10^4 K, joined continuously.
//
// Above the join temperature T_j(Z) it is the CIE curve
//
//	Λ(T, Z) = Λ_H+He(T) + (Z/Z☉) (n_e/n_H)(T) Λ_met(T)   per n_H²,
//
// (cooling reference §0 and §6), where Λ_H+He is the primordial solver
// (PrimordialCIE: Cen 1992/KWH96 rates with Voronov 1997 for H and the He+
// excitation term without Cen's factor, HepBlack81) at
// y = n_He/n_H = 0.0851, Λ_met is the fit to the metal part of the CHIANTI
// curves of Ryden & Pogge (2021), per n_e n_H, and n_e/n_H comes from the
// same H+He solver. Metal electrons are neglected in n_e/n_H: ≤1% above
// 10^5 K, more below 2×10^4 K where metals supply the electrons (cooling
// reference §1 and §7). Its nodes run from 10^4 to 10^8 K every 0.01 dex.
//
// From 10 K to 10^4 K it is KoyamaInutsuka02Lambda(T, Z), sampled every
// 0.01 dex: the fit's cooling term, with its fine-structure term scaled by
// Z and no heating.
//
// The join (cloudwind's choice): the two curves do not cross where both
// apply. At 10^4 K, the top of KI02's range, KI02 lies 350–700 times
// above CIE for Z ≤ 1 (CIE collapses there; KI02 describes gas ionised by
// more than collisions), and for Z ≤ 3 it stays above CIE at every
// temperature (at least 1.6 times; measured), so no temperature hands over
// from one to the other without a jump. Between 10^4 K and T_j the curve
// is therefore held at KI02's value at 10^4 K, and T_j is the temperature
// at which the CIE curve (as interpolated between its nodes) first reaches
// that value; above T_j it is the CIE curve unchanged. That is the lowest
// continuous, nowhere decreasing curve that is KI02 below 10^4 K and CIE
// above some temperature, and it neither rescales a fit nor uses one
// beyond its range. T_j depends on Z (1.300×10^4 K at Z = 0, 1.288×10^4 K
// at Z = 1, 1.227×10^4 K at Z = 10; measured) and is an extra node of the
// curve, so the join is exact: the two sides agree there to rounding.
// JoinTemperature returns it.
//
// Beyond the nodes (10 K and 10^8 K) the PowerLaw range policy applies;
// the caller's cooling floor applies as everywhere.
//
// A Builtin is built once by NewBuiltin, is immutable, and is safe for
// concurrent use; At combines the precomputed parts for any Z.
type Builtin struct {
	log10T  []float64 // CIE nodes, 10^4–10^8 K
	hhe     []float64 // Λ_H+He per n_H², erg cm³ s⁻¹
	met     []float64 // (n_e/n_H) Λ_met per n_H² at Z = Z☉, erg cm³ s⁻¹
	lowT    []float64 // KI02 nodes, 10 K–10^4 K (10^4 K included)
	kiLya   []float64 // KI02 Lyα term at lowT, erg cm³ s⁻¹
	kiFS    []float64 // KI02 fine-structure term at lowT, Z = Z☉, erg cm³ s⁻¹
	primord *PowerLaw // At(0)
	metals  *PowerLaw // the CIE metal part alone at Z = Z☉
	fitAcc  string    // stated accuracy of the metal fit
}

// BuiltinHeliumRatio is the He/H number ratio y of the built-in curve: that
// of the Grevesse & Sauval (1998) mixture of the CHIANTI curves (0.0851,
// DERIVED from X = 0.7347, Y = 0.2483; cooling reference §7).
const BuiltinHeliumRatio = 0.0851

// Range of the built-in nodes: log10 T from builtinLo/100 to builtinHi/100
// in steps of 0.01 dex for the CIE part, the range of the CHIANTI curves
// (cooling reference §7), and from builtinLowLo/100 to builtinLo/100 for
// the KI02 part (10 K, the lower end of the range KI02 describe, from
// memory). Integers, so that every node is the correctly rounded i/100.
const (
	builtinLowLo = 100
	builtinLo    = 400
	builtinHi    = 800
)

// builtinMixture names the abundance set of the metal part.
const builtinMixture = "Grevesse & Sauval 1998"

// citeChiantiFit credits the source of the metal fit (CC-BY-4.0 attribution).
const citeChiantiFit = "metals: cloudwind fit (a derived work) to the CHIANTI CIE curves of Ryden & Pogge 2021, " +
	"Interstellar and Intergalactic Medium, Cambridge University Press, companion data, CC-BY-4.0"

// NewBuiltin builds the built-in curve from the primordial solver and the
// embedded metal fit (assets/chianti_metals_fit.txt). It fails only if the
// embedded file is damaged.
func NewBuiltin() (*Builtin, error) { return newBuiltin(assets.FS, metalFitFile) }

// newBuiltin builds a Builtin with the metal fit read from fsys, so that
// tests can supply damaged files.
func newBuiltin(fsys fs.FS, name string) (*Builtin, error) {
	fit, err := loadMetalFit(fsys, name)
	if err != nil {
		return nil, fmt.Errorf("built-in cooling: %w", err)
	}
	if fit.lo > builtinLo/100.0+1e-9 || fit.hi < builtinHi/100.0-1e-9 {
		return nil, fmt.Errorf("built-in cooling: metal fit valid over 10^%g–10^%g K, need 10^4–10^8 K", fit.lo, fit.hi)
	}
	n := builtinHi - builtinLo + 1
	b := &Builtin{
		log10T: make([]float64, n),
		hhe:    make([]float64, n),
		met:    make([]float64, n),
		fitAcc: fit.accuracy(),
	}
	yM := make([]float64, n)
	for i := range b.log10T {
		x := float64(builtinLo+i) / 100
		t := model.Temperature(math.Pow(10, x))
		ion, c := PrimordialCIE(t, BuiltinHeliumRatio, PrimordialOptions{})
		b.log10T[i] = x
		b.hhe[i] = float64(c.Total())
		b.met[i] = ion.NeOverNH * math.Pow(10, fit.log10Lambda(x)) // n_e n_H → n_H², cooling reference §1, §7
		if !(b.hhe[i] > 0) || !(b.met[i] > 0) || math.IsInf(b.hhe[i], 0) || math.IsInf(b.met[i], 0) {
			return nil, fmt.Errorf("built-in cooling: non-positive Λ at 10^%.2f K", x)
		}
		yM[i] = math.Log10(b.met[i])
	}
	nLow := builtinLo - builtinLowLo + 1
	b.lowT, b.kiLya, b.kiFS = make([]float64, nLow), make([]float64, nLow), make([]float64, nLow)
	for i := range b.lowT {
		x := float64(builtinLowLo+i) / 100
		T := math.Pow(10, x)
		if i == nLow-1 {
			T = ki02Top // exactly 10^4 K, the plateau value
		}
		b.lowT[i] = x
		b.kiLya[i], b.kiFS[i] = ki02Terms(T)
	}
	if b.primord, err = b.At(0); err != nil {
		return nil, err
	}
	mm := b.meta(1, math.NaN())
	mm.Name = "CIE metal part of the built-in curve (CHIANTI fit), Z = 1 Z☉, 1e4-1e8 K"
	mm.Citation = citeChiantiFit
	if b.metals, err = NewPowerLaw(b.log10T, yM, mm); err != nil {
		return nil, err
	}
	return b, nil
}

// At returns the built-in cooling function at metallicity z (in Z☉) as a
// PowerLaw: the KI02 part on 0.01-dex nodes from 10 K to 10^4 K, the
// plateau at KI02's 10^4 K value up to the join temperature T_j(z), a node
// at T_j, and the CIE part Λ_H+He + z (n_e/n_H) Λ_met on the 0.01-dex
// nodes above T_j up to 10^8 K (see Builtin). It takes about as long as
// building one 700-node PowerLaw, so sweeps may call it per metallicity.
//
// The metal part scales linearly in Z, which the CHIANTI curves follow to
// within 7% from 10^-3 to 10 Z☉ (cooling reference §6–§7); above 10 Z☉
// Meta.Warnings says so. It returns an error for z < 0, NaN or ±Inf.
func (b *Builtin) At(z float64) (*PowerLaw, error) {
	xs, ys, tj, err := b.nodes(z)
	if err != nil {
		return nil, err
	}
	return NewPowerLaw(xs, ys, b.meta(z, tj))
}

// JoinTemperature returns T_j(z), the temperature above 10^4 K at which
// the CIE part takes over from KI02's value at 10^4 K (see Builtin), for
// a metallicity z in Z☉. It returns an error for z < 0, NaN or ±Inf.
func (b *Builtin) JoinTemperature(z float64) (model.Temperature, error) {
	if err := checkMetallicity(z); err != nil {
		return 0, err
	}
	lp := math.Log10(b.kiLya[len(b.kiLya)-1] + z*b.kiFS[len(b.kiFS)-1])
	xj, _, err := b.join(z, lp)
	if err != nil {
		return 0, err
	}
	return model.Temperature(math.Pow(10, xj)), nil
}

// checkMetallicity validates a metallicity argument.
func checkMetallicity(z float64) error {
	if math.IsNaN(z) || math.IsInf(z, 0) || z < 0 {
		return fmt.Errorf("metallicity Z = %s Z☉: want a finite Z ≥ 0", num(z))
	}
	return nil
}

// join returns log10 T_j for metallicity z, where the CIE interpolant first
// reaches lp = log10 of KI02 at 10^4 K, and k, the first CIE node above
// it. Between nodes k−1 and k the CIE curve is a straight line in log–log,
// so T_j is found exactly by solving that line (derived).
func (b *Builtin) join(z, lp float64) (xj float64, k int, err error) {
	cie := func(i int) float64 { return math.Log10(b.hhe[i] + z*b.met[i]) }
	prev := cie(0)
	if !(prev < lp) {
		// Cannot happen for the embedded data (CIE is ~700 times below KI02
		// at 10^4 K); refuse rather than join with a jump.
		return 0, 0, fmt.Errorf("built-in cooling at Z = %s Z☉: CIE above KI02 at 10^4 K, no continuous join", num(z))
	}
	for k = 1; k < len(b.log10T); k++ {
		c := cie(k)
		if c >= lp {
			x0, x1 := b.log10T[k-1], b.log10T[k]
			xj = x0 + (lp-prev)/(c-prev)*(x1-x0)
			return math.Min(math.Max(xj, x0), x1), k, nil
		}
		prev = c
	}
	return 0, 0, fmt.Errorf("built-in cooling at Z = %s Z☉: the CIE curve never reaches KI02's value at 10^4 K", num(z))
}

// nodes returns the nodes of the built-in curve at metallicity z and the
// join temperature T_j in K.
func (b *Builtin) nodes(z float64) (xs, ys []float64, tj float64, err error) {
	if err := checkMetallicity(z); err != nil {
		return nil, nil, 0, err
	}
	nLow := len(b.lowT)
	lp := math.Log10(b.kiLya[nLow-1] + z*b.kiFS[nLow-1]) // KI02 at 10^4 K: the plateau
	xj, k, err := b.join(z, lp)
	if err != nil {
		return nil, nil, 0, err
	}
	n := nLow + len(b.log10T) // an upper bound: low nodes, CIE nodes above 10^4 K, the join
	xs, ys = make([]float64, 0, n), make([]float64, 0, n)
	for i, x := range b.lowT {
		xs, ys = append(xs, x), append(ys, math.Log10(b.kiLya[i]+z*b.kiFS[i]))
	}
	// The plateau over the CIE nodes below the join (node 0 is 10^4 K,
	// already the last KI02 node).
	for i := 1; i < k; i++ {
		xs, ys = append(xs, b.log10T[i]), append(ys, lp)
	}
	if xj > b.log10T[k-1] && xj < b.log10T[k] {
		xs, ys = append(xs, xj), append(ys, lp)
	}
	for i := k; i < len(b.log10T); i++ {
		xs, ys = append(xs, b.log10T[i]), append(ys, math.Log10(b.hhe[i]+z*b.met[i]))
	}
	return xs, ys, math.Pow(10, xj), nil
}

// meta describes the built-in curve at metallicity z with join temperature
// tj (K; NaN for the metal part alone). Each call returns fresh slices, so
// callers cannot affect one another.
func (b *Builtin) meta(z, tj float64) Meta {
	nLow := len(b.lowT)
	plateau := b.kiLya[nLow-1] + z*b.kiFS[nLow-1]
	cie4 := b.hhe[0] + z*b.met[0]
	tjs := model.FormatNumber(tj, 4)
	m := Meta{
		Name:          fmt.Sprintf("built-in, Z = %.3g Z☉ (CIE from %s K: KWH96+V97 H+He, CHIANTI-fit metals; KI02 below 1e4 K)", z, tjs),
		Citation:      "H+He: " + citeKWH96 + "; " + citeVoronov + "; " + citeBlack81 + "; " + citeChiantiFit + "; " + citeKI02,
		Normalisation: PerNeNH,
		HeliumRatio:   BuiltinHeliumRatio,
		Metallicity:   z,
		Mixture:       builtinMixture,
		Caveats: []string{
			"above " + tjs + " K: " + CaveatCIE,
			caveatKI02,
			fmt.Sprintf("join (cloudwind's choice): at 1e4 K, the top of its range, KI02 is %.0f times CIE, so Λ is held at "+
				"KI02's 1e4 K value, %s erg cm³ s⁻¹, from 1e4 K up to %s K, where the CIE curve reaches it", plateau/cie4,
				model.FormatNumber(plateau, 3), tjs),
			caveatKI02Z,
			caveatFloor,
			"H+He computed per n_H² from rate coefficients; the metal part is tabulated per n_e n_H (CHIANTI, " +
				"normalisation inferred) and converted with n_e/n_H of the H+He solver at y = 0.0851",
			"metal electrons are neglected in n_e/n_H: ≤1% above 1e5 K; below 2e4 K the conversion inherits the " +
				"H+He solver's n_e/n_H, where KWH96 and CHIANTI disagree most",
			b.fitAcc,
			caveatHepBlack81 + "; at Z = 0.1 the total is up to 16% above CHIANTI near 1.1e5 K (measured)",
			"metal part scales linearly with Z at Grevesse & Sauval 1998 abundance ratios",
		},
	}
	if z == 0 {
		m.Name = fmt.Sprintf("built-in H+He, metal-free (CIE from %s K: KWH96+V97, B81 He+ excitation; KI02 Lyα below 1e4 K)", tjs)
		m.Citation = citeKWH96 + "; " + citeVoronov + "; " + citeBlack81 + "; " + citeKI02
		m.Normalisation = PerNH2
	}
	if z > 10 {
		m.Warnings = []string{fmt.Sprintf("Z = %.3g Z☉ is above 10 Z☉, the highest metallicity of the CHIANTI curves the linear Z scaling was checked against", z)}
	}
	return m
}

// HHe returns the built-in curve without metals, At(0), y = 0.0851: the
// H+He CIE curve above the join and KI02's Lyα term below 10^4 K.
func (b *Builtin) HHe() *PowerLaw { return b.primord }

// Metals returns the CIE metal part alone at Z = 1 Z☉, per n_H², on the
// CIE nodes from 10^4 to 10^8 K: (n_e/n_H) Λ_met. The KI02 fine-structure
// term below 10^4 K is not part of it.
func (b *Builtin) Metals() *PowerLaw { return b.metals }
