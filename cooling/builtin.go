package cooling

import (
	"fmt"
	"io/fs"
	"math"

	"cloudwind/assets"
	"cloudwind/model"
)

// Builtin is cloudwind's built-in CIE cooling function,
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
// reference §1 and §7). The nodes run from 10^4 to 10^8 K every 0.01 dex;
// beyond them the PowerLaw range policy applies.
//
// A Builtin is built once by NewBuiltin, is immutable, and is safe for
// concurrent use; At combines the precomputed parts for any Z.
type Builtin struct {
	log10T  []float64 // nodes
	hhe     []float64 // Λ_H+He per n_H², erg cm³ s⁻¹
	met     []float64 // (n_e/n_H) Λ_met per n_H² at Z = Z☉, erg cm³ s⁻¹
	primord *PowerLaw // Λ_H+He alone
	metals  *PowerLaw // the metal part alone at Z = Z☉
	fitAcc  string    // stated accuracy of the metal fit
}

// BuiltinHeliumRatio is the He/H number ratio y of the built-in curve: that
// of the Grevesse & Sauval (1998) mixture of the CHIANTI curves (0.0851,
// DERIVED from X = 0.7347, Y = 0.2483; cooling reference §7).
const BuiltinHeliumRatio = 0.0851

// Range of the built-in nodes: log10 T from builtinLo/100 to builtinHi/100
// in steps of 0.01 dex, the range of the CHIANTI curves (cooling reference
// §7). Integers, so that every node is the correctly rounded i/100.
const (
	builtinLo = 400
	builtinHi = 800
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
	yH, yM := make([]float64, n), make([]float64, n)
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
		yH[i], yM[i] = math.Log10(b.hhe[i]), math.Log10(b.met[i])
	}
	if b.primord, err = NewPowerLaw(b.log10T, yH, primordialMeta(BuiltinHeliumRatio, PrimordialOptions{})); err != nil {
		return nil, err
	}
	mm := b.meta(1)
	mm.Name = "metal part of the built-in CIE curve (CHIANTI fit), Z = 1 Z☉"
	mm.Citation = citeChiantiFit
	if b.metals, err = NewPowerLaw(b.log10T, yM, mm); err != nil {
		return nil, err
	}
	return b, nil
}

// At returns the built-in cooling function at metallicity z (in Z☉) as a
// PowerLaw on the 0.01-dex nodes from 10^4 to 10^8 K,
// Λ = Λ_H+He + z (n_e/n_H) Λ_met at every node. It takes about as long as
// building one 401-node PowerLaw, so sweeps may call it per metallicity.
//
// The metal part scales linearly in Z, which the CHIANTI curves follow to
// within 7% from 10^-3 to 10 Z☉ (cooling reference §6–§7); above 10 Z☉
// Meta.Warnings says so. It returns an error for z < 0, NaN or ±Inf.
func (b *Builtin) At(z float64) (*PowerLaw, error) {
	if math.IsNaN(z) || math.IsInf(z, 0) || z < 0 {
		return nil, fmt.Errorf("metallicity Z = %s Z☉: want a finite Z ≥ 0", num(z))
	}
	ys := make([]float64, len(b.log10T))
	for i := range ys {
		ys[i] = math.Log10(b.hhe[i] + z*b.met[i])
	}
	return NewPowerLaw(b.log10T, ys, b.meta(z))
}

// meta describes the built-in curve at metallicity z. Each call returns
// fresh slices, so callers cannot affect one another.
func (b *Builtin) meta(z float64) Meta {
	m := Meta{
		Name:          fmt.Sprintf("built-in CIE, Z = %.3g Z☉ (KWH96+V97 H+He, CHIANTI-fit metals)", z),
		Citation:      "H+He: " + citeKWH96 + "; " + citeVoronov + "; " + citeBlack81 + "; " + citeChiantiFit,
		Normalisation: PerNeNH,
		HeliumRatio:   BuiltinHeliumRatio,
		Metallicity:   z,
		Mixture:       builtinMixture,
		Caveats: []string{
			CaveatCIE,
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
		m.Normalisation = PerNH2
	}
	if z > 10 {
		m.Warnings = []string{fmt.Sprintf("Z = %.3g Z☉ is above 10 Z☉, the highest metallicity of the CHIANTI curves the linear Z scaling was checked against", z)}
	}
	return m
}

// HHe returns the hydrogen-helium part alone (Z = 0) on the same nodes,
// y = 0.0851.
func (b *Builtin) HHe() *PowerLaw { return b.primord }

// Metals returns the metal part alone at Z = 1 Z☉, per n_H², on the same
// nodes: (n_e/n_H) Λ_met.
func (b *Builtin) Metals() *PowerLaw { return b.metals }
