package cooling

import (
	"fmt"
	"io/fs"
	"math"

	"cloudwind/assets"
	"cloudwind/model"
)

// Builtin is cloudwind's built-in cooling function: collisional ionisation
// equilibrium (CIE) from 10^4 K to 10^8 K, and below 10^4 K the neutral-ISM
// fit of Koyama & Inutsuka (2002) capped at the CIE value at 10^4 K.
//
// At and above 10^4 K it is the CIE curve
//
//	Λ(T, Z) = Λ_H+He(T) + (Z/Z☉) (n_e/n_H)(T) Λ_met(T)   per n_H²,
//
// (in the style of Wiersma, Schaye & Smith 2009, eq. 4, as the README of
// their tables quotes it), where Λ_H+He is the primordial solver
// (PrimordialCIE: Cen 1992/KWH96 rates with Voronov 1997 for H and the He+
// excitation term without Cen's factor, HepBlack81) at
// y = n_He/n_H = 0.0851, Λ_met is the fit to the metal part of the CHIANTI
// curves of Ryden & Pogge (2021), per n_e n_H, and n_e/n_H comes from the
// same H+He solver. Metal electrons are neglected in n_e/n_H: ≤1% above
// 10^5 K, more below 2×10^4 K where metals supply the electrons
// (measured: Sutherland & Dopita 1993 solar has n_e/n_H = 1.209 against
// 1.196 from H+He alone). Its nodes run from 10^4 to 10^8 K every 0.01 dex.
// This part is the curve as it was before the part below 10^4 K was added,
// node for node, so every result for temperatures at and above 10^4 K
// (the default cloud temperature of 10^4 K included) is unchanged.
//
// Below 10^4 K it is (cloudwind's choice)
//
//	Λ(T, Z) = min(Λ_KI02(T, Z), Λ_CIE(10^4 K, Z)),
//
// where Λ_KI02 is KoyamaInutsuka02Lambda(T, Z) sampled every 0.01 dex
// from 10 K (the fit's cooling term, with its fine-structure term scaled by
// Z and no heating) and Λ_CIE(10^4 K, Z) is the CIE curve's own value at
// its bottom node (1.22×10^-26 erg cm³ s⁻¹ at Z = 1; measured). The
// reason: the CIE curve stays authoritative at and above 10^4 K. At
// 10^4 K, the top of its range, KI02 lies 350–700 times above CIE for
// Z ≤ 1 and 66 times at Z = 10 (measured): it describes gas ionised by
// more than collisions, whose cooling is balanced by a heating term not
// included here, so it cannot be joined to CIE at 10^4 K without a jump or
// without changing Λ(10^4 K). KI02 is therefore used only where it lies
// below the CIE value at 10^4 K, and Λ is held at that value between the
// cap temperature T_cap(Z) and 10^4 K, which discards KI02's part there.
// The curve is continuous at 10^4 K by construction (KI02 is above the cap
// there for every Z ≥ 0: at 10^4 K its Lyα term is 699 times the H+He
// part and its fine-structure term 4.5 times the CIE metal part;
// measured) and nowhere decreasing below 10^4 K (both KI02 terms increase
// with T).
//
// T_cap is the temperature at which KI02, as interpolated between its
// nodes, first reaches the cap; it is found by solving the log–log
// segment between the two KI02 nodes around it (derived) and is an extra
// node of the curve, so the curve is an exact piecewise power law and the
// two sides agree at T_cap to rounding. T_cap depends on Z: 5839 K at
// Z = 0, 5730 K at Z = 0.1, 2084 K at Z = 1 and 750 K at Z = 10
// (measured). CapTemperature returns it.
//
// There is no ionising background anywhere. Beyond the nodes (10 K and
// 10^8 K) the PowerLaw range policy applies; the caller's cooling floor
// applies as everywhere (Λ = 0 below T_floor, by default T_cl).
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
// derived from X = 0.7347, Y = 0.2483, Asplund, Amarsi & Grevesse 2021,
// Table 4).
const BuiltinHeliumRatio = 0.0851

// Range of the built-in nodes: log10 T from builtinLo/100 to builtinHi/100
// in steps of 0.01 dex for the CIE part, the range of the CHIANTI curves
// (log T = 4.00–8.00 in the files of Ryden & Pogge 2021), and from
// builtinLowLo/100 to builtinLo/100 for the KI02 part (10 K, the lower end
// of the range KI02 describe, from memory). Integers, so that every node is
// the correctly rounded i/100.
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
		b.met[i] = ion.NeOverNH * math.Pow(10, fit.log10Lambda(x)) // n_e n_H → n_H²: derived, Λ per n_e n_H times n_e/n_H
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
			T = ki02Top // exactly 10^4 K, the top of KI02's range
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
	mm.Caveats = append([]string{CaveatCIE}, b.cieCaveats()...) // nothing below 1e4 K
	if b.metals, err = NewPowerLaw(b.log10T, yM, mm); err != nil {
		return nil, err
	}
	return b, nil
}

// At returns the built-in cooling function at metallicity z (in Z☉) as a
// PowerLaw (see Builtin): KI02 on its 0.01-dex nodes from 10 K up to the
// cap temperature T_cap(z), a node at T_cap, the cap Λ_CIE(10^4 K, z) on
// the 0.01-dex nodes from T_cap to 10^4 K, and the CIE part
// Λ_H+He + z (n_e/n_H) Λ_met on its 0.01-dex nodes from 10^4 K to 10^8 K.
// It takes about as long as building one 700-node PowerLaw, so sweeps may
// call it per metallicity.
//
// The metal part scales linearly in Z, which the CHIANTI curves follow to
// within 7% from 10^-3 to 10 Z☉ (measured, with the corrected Z of the
// files labelled 0.005, 0.05, 0.5 and 5; see fitmetals); above 10 Z☉
// Meta.Warnings says so. It returns an error for z < 0, NaN or ±Inf.
func (b *Builtin) At(z float64) (*PowerLaw, error) {
	xs, ys, tcap, err := b.nodes(z)
	if err != nil {
		return nil, err
	}
	return NewPowerLaw(xs, ys, b.meta(z, tcap))
}

// CapTemperature returns T_cap(z), the temperature below 10^4 K at which
// the KI02 part, as interpolated between its nodes, first reaches the cap
// Λ_CIE(10^4 K, z), for a metallicity z in Z☉: below T_cap the built-in
// curve is KI02, from T_cap to 10^4 K it is the cap (see Builtin). It is
// 5839 K at z = 0, 2084 K at z = 1 and 750 K at z = 10 (measured). It
// returns an error for z < 0, NaN or ±Inf.
func (b *Builtin) CapTemperature(z float64) (model.Temperature, error) {
	if err := checkMetallicity(z); err != nil {
		return 0, err
	}
	xc, _, err := b.capNode(z, b.capLog10(z))
	if err != nil {
		return 0, err
	}
	return model.Temperature(math.Pow(10, xc)), nil
}

// checkMetallicity validates a metallicity argument.
func checkMetallicity(z float64) error {
	if math.IsNaN(z) || math.IsInf(z, 0) || z < 0 {
		return fmt.Errorf("metallicity Z = %s Z☉: want a finite Z ≥ 0", num(z))
	}
	return nil
}

// capLog10 returns log10 of the cap at metallicity z: the CIE curve at its
// bottom node, 10^4 K (see Builtin).
func (b *Builtin) capLog10(z float64) float64 { return math.Log10(b.hhe[0] + z*b.met[0]) }

// ki02Log10 returns log10 of KI02 at metallicity z at low-temperature node i.
func (b *Builtin) ki02Log10(i int, z float64) float64 { return math.Log10(b.kiLya[i] + z*b.kiFS[i]) }

// capNode returns log10 T_cap for metallicity z, where the KI02
// interpolant first reaches lc = log10 of the cap, and k, the first KI02
// node at or above the cap. Between nodes k−1 and k KI02 is interpolated
// as a straight line in log–log, so T_cap is found exactly by solving that
// line (derived).
func (b *Builtin) capNode(z, lc float64) (xc float64, k int, err error) {
	prev := b.ki02Log10(0, z)
	if !(prev < lc) {
		// Cannot happen for the embedded data (KI02 is ~10^-5 of the cap at
		// 10 K); refuse rather than start the curve on the cap.
		return 0, 0, fmt.Errorf("built-in cooling at Z = %s Z☉: KI02 at 10 K above the CIE value at 10^4 K", num(z))
	}
	for k = 1; k < len(b.lowT); k++ {
		y := b.ki02Log10(k, z)
		if y >= lc {
			x0, x1 := b.lowT[k-1], b.lowT[k]
			xc = x0 + (lc-prev)/(y-prev)*(x1-x0)
			return math.Min(math.Max(xc, x0), x1), k, nil
		}
		prev = y
	}
	// Cannot happen for the embedded data (KI02 is at least 4.5 times the
	// cap at 10^4 K for every Z); refuse rather than jump at 10^4 K.
	return 0, 0, fmt.Errorf("built-in cooling at Z = %s Z☉: KI02 below the CIE value at 10^4 K, no continuous join", num(z))
}

// nodes returns the nodes of the built-in curve at metallicity z and the
// cap temperature T_cap in K.
func (b *Builtin) nodes(z float64) (xs, ys []float64, tcap float64, err error) {
	if err := checkMetallicity(z); err != nil {
		return nil, nil, 0, err
	}
	lc := b.capLog10(z)
	xc, k, err := b.capNode(z, lc)
	if err != nil {
		return nil, nil, 0, err
	}
	nLow := len(b.lowT)
	n := nLow + len(b.log10T) // an upper bound: KI02 nodes, the cap node, CIE nodes above 10^4 K
	xs, ys = make([]float64, 0, n), make([]float64, 0, n)
	for i := 0; i < k; i++ { // KI02 below the cap
		xs, ys = append(xs, b.lowT[i]), append(ys, b.ki02Log10(i, z))
	}
	if xc > b.lowT[k-1] && xc < b.lowT[k] {
		xs, ys = append(xs, xc), append(ys, lc)
	}
	// The cap on the KI02 nodes from T_cap to below 10^4 K; the last KI02
	// node, 10^4 K, is the first CIE node, whose value is the cap itself.
	for i := k; i < nLow-1; i++ {
		xs, ys = append(xs, b.lowT[i]), append(ys, lc)
	}
	for i := range b.log10T {
		xs, ys = append(xs, b.log10T[i]), append(ys, math.Log10(b.hhe[i]+z*b.met[i]))
	}
	return xs, ys, math.Pow(10, xc), nil
}

// meta describes the built-in curve at metallicity z with cap temperature
// tcap (K; NaN for the metal part alone). Each call returns fresh slices,
// so callers cannot affect one another.
func (b *Builtin) meta(z, tcap float64) Meta {
	nLow := len(b.lowT)
	ki4 := b.kiLya[nLow-1] + z*b.kiFS[nLow-1] // KI02 at 10^4 K
	cie4 := b.hhe[0] + z*b.met[0]             // the cap
	tcs := model.FormatNumber(tcap, 4)
	m := Meta{
		Name:          fmt.Sprintf("built-in, Z = %.3g Z☉ (CIE from 1e4 K; KI02 below, capped)", z),
		Citation:      "H+He: " + citeKWH96 + "; " + citeVoronov + "; " + citeBlack81 + "; " + citeChiantiFit + "; " + citeKI02,
		Normalisation: PerNeNH,
		HeliumRatio:   BuiltinHeliumRatio,
		Metallicity:   z,
		Mixture:       builtinMixture,
		Caveats: append([]string{
			"at and above 1e4 K: " + CaveatCIE + "; unchanged by the part below 1e4 K, so results for T_cl ≥ 1e4 K are as before",
			caveatKI02,
			fmt.Sprintf("below 1e4 K (cloudwind's choice): Λ = min(KI02, the CIE value at 1e4 K, %s erg cm³ s⁻¹), so that "+
				"the CIE curve stays unchanged at and above 1e4 K: KI02 up to T_cap = %s K, that value from there to 1e4 K; "+
				"this discards KI02 between %s K and 1e4 K (%.0f times CIE at 1e4 K: it describes gas ionised by more than "+
				"collisions, with a heating term not included here)",
				model.FormatNumber(cie4, 3), tcs, tcs, ki4/cie4),
			caveatKI02Z,
			caveatFloor,
		}, b.cieCaveats()...),
	}
	if z == 0 {
		m.Name = "built-in H+He, metal-free (CIE from 1e4 K; KI02 Lyα below, capped)"
		m.Citation = citeKWH96 + "; " + citeVoronov + "; " + citeBlack81 + "; " + citeKI02
		m.Normalisation = PerNH2
	}
	if z > 10 {
		m.Warnings = []string{fmt.Sprintf("Z = %.3g Z☉ is above 10 Z☉, the highest metallicity of the CHIANTI curves the linear Z scaling was checked against", z)}
	}
	return m
}

// cieCaveats returns the caveats of the CIE part, fresh on each call.
func (b *Builtin) cieCaveats() []string {
	return []string{
		"H+He computed per n_H² from rate coefficients; the metal part is tabulated per n_e n_H (CHIANTI, " +
			"normalisation inferred) and converted with n_e/n_H of the H+He solver at y = 0.0851",
		"metal electrons are neglected in n_e/n_H: ≤1% above 1e5 K; below 2e4 K the conversion inherits the " +
			"H+He solver's n_e/n_H, where KWH96 and CHIANTI disagree most",
		b.fitAcc,
		caveatHepBlack81 + "; at Z = 0.1 the total is up to 16% above CHIANTI near 1.1e5 K (measured)",
		"metal part scales linearly with Z at Grevesse & Sauval 1998 abundance ratios",
	}
}

// HHe returns the built-in curve without metals, At(0), y = 0.0851: the
// H+He CIE curve from 10^4 K and, below 10^4 K, KI02's Lyα term capped at
// the H+He value at 10^4 K.
func (b *Builtin) HHe() *PowerLaw { return b.primord }

// Metals returns the CIE metal part alone at Z = 1 Z☉, per n_H², on the
// CIE nodes from 10^4 to 10^8 K: (n_e/n_H) Λ_met. The KI02 fine-structure
// term below 10^4 K is not part of it.
func (b *Builtin) Metals() *PowerLaw { return b.metals }
