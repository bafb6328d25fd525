package cooling

import (
	"fmt"
	"math"

	"cloudwind/model"
)

// Primordial (hydrogen + helium) cooling in collisional ionisation
// equilibrium, from the rate coefficients of Cen (1992) as adopted by Katz,
// Weinberg & Hernquist (1996, KWH96), with Voronov (1997) for the
// collisional ionisation of H by default, and by default without Cen's
// factor (1 + T_5^{1/2})⁻¹ on the He+ excitation cooling (HepBlack81;
// measured against Gnat & Ferland 2012, Table 1B).
//
// Provenance of the coefficients: the original KWH96 table was not viewed.
// The ionisation and recombination rates are those of a table adapted from
// KWH96 in the documentation of a public hydrodynamics code, and the
// cooling coefficients are identical in two independent public code files,
// one citing Cen (1992); all are SECONDARY. The Voronov coefficients are
// those of cion.dat in Debian's mocassin-data, with the column order ΔE, P,
// A, X, K still to be checked against Voronov (1997). Cen (1992) also has
// density-dependent He(2³S) terms ∝ n_e² n_He+; they are negligible at the
// low densities of interest and omitted (cloudwind's choice).

// HIonisation selects the collisional ionisation rate of H0.
type HIonisation int

const (
	// VoronovH is Voronov (1997) for H0 collisional ionisation and its
	// ionisation cooling (13.6 eV per ionisation). It puts the H peak on
	// the Cloudy-based Wiersma et al. (2009) value to within 1%
	// (measured). The default.
	VoronovH HIonisation = iota
	// KWH96H is the Cen (1992)/KWH96 rate Γ_eH0 and cooling term, for
	// comparison (24–54% high at the H peak against Wiersma et al. 2009 and
	// Sutherland & Dopita 1993, measured).
	KWH96H
)

// String returns "Voronov 1997" or "KWH96".
func (h HIonisation) String() string {
	switch h {
	case VoronovH:
		return "Voronov 1997"
	case KWH96H:
		return "KWH96"
	}
	return fmt.Sprintf("HIonisation(%d)", int(h))
}

// HepExcitation selects the form of the He+ collisional-excitation
// cooling coefficient,
//
//	5.54e-17 T^-0.397 exp(−473638/T) erg cm³ s⁻¹   (× n_e n_He+),
//
// with or without Cen's (1992) factor (1 + T_5^{1/2})⁻¹.
type HepExcitation int

const (
	// HepBlack81 is the coefficient without Cen's factor, the form usually
	// attributed to Black (1981, MNRAS 197, 553); that attribution is
	// SECONDARY (a public code's documentation) and from memory, not read
	// in Black's paper. It gives 0.90–1.02 of the He+ cooling efficiency of
	// Gnat & Ferland (2012, ApJS 199, 20, Table 1B, helium) from 7.1×10^4
	// to 1.24×10^5 K, where the factor leaves 0.43–0.55 (measured against
	// the rows of their table). The default.
	HepBlack81 HepExcitation = iota
	// HepKWH96 is the coefficient with Cen's factor, as Cen (1992) and
	// KWH96 publish it, for comparison: it makes the H+He curve 25–35% low
	// between 5×10^4 and 3×10^5 K against Cloudy- and CHIANTI-based curves.
	HepKWH96
)

// String returns "Black 1981 form" or "KWH96".
func (h HepExcitation) String() string {
	switch h {
	case HepBlack81:
		return "Black 1981 form"
	case HepKWH96:
		return "KWH96"
	}
	return fmt.Sprintf("HepExcitation(%d)", int(h))
}

// PrimordialOptions configures the primordial CIE solver. The zero value
// is the default: Voronov (1997) for H ionisation and the He+ excitation
// coefficient without Cen's factor (HepBlack81).
type PrimordialOptions struct {
	HIonisation   HIonisation   // H0 collisional ionisation rate; default (and any unknown value) VoronovH
	HepExcitation HepExcitation // He+ excitation cooling; default (and any unknown value) HepBlack81
}

// KWH96Options returns the rates of Cen (1992)/KWH96 as published: their H
// ionisation rate and Cen's factor on the He+ excitation cooling. They give
// the "hhe-kwh96" comparison curve.
func KWH96Options() PrimordialOptions {
	return PrimordialOptions{HIonisation: KWH96H, HepExcitation: HepKWH96}
}

// Ionisation is the ionisation state of hydrogen and helium. Hydrogen
// fractions are of n_H, helium fractions of n_He; each set sums to 1.
type Ionisation struct {
	NeOverNH float64 // n_e/n_H from H and He alone (metal electrons neglected)
	XH0      float64 // n_H0/n_H
	XHp      float64 // n_H+/n_H
	XHe0     float64 // n_He0/n_He
	XHep     float64 // n_He+/n_He
	XHepp    float64 // n_He++/n_He
}

// PrimordialCooling is the breakdown of the primordial cooling function,
// every term per n_H² in erg cm³ s⁻¹ (the density products of Cen 1992's
// cooling terms divided by n_H²).
type PrimordialCooling struct {
	ExcitationH0      model.CoolingRate // collisional excitation of H0
	ExcitationHep     model.CoolingRate // collisional excitation of He+
	IonisationH0      model.CoolingRate // collisional ionisation of H0
	IonisationHe0     model.CoolingRate // collisional ionisation of He0
	IonisationHep     model.CoolingRate // collisional ionisation of He+
	RecombinationHp   model.CoolingRate // radiative recombination of H+
	RecombinationHep  model.CoolingRate // radiative recombination of He+
	RecombinationHepp model.CoolingRate // radiative recombination of He++
	DielectronicHep   model.CoolingRate // dielectronic recombination of He+
	FreeFree          model.CoolingRate // free-free, KWH96 Gaunt factor
}

// Total returns the sum of the terms, Λ per n_H² in erg cm³ s⁻¹.
func (c PrimordialCooling) Total() model.CoolingRate {
	return c.ExcitationH0 + c.ExcitationHep + c.IonisationH0 + c.IonisationHe0 + c.IonisationHep +
		c.RecombinationHp + c.RecombinationHep + c.RecombinationHepp + c.DielectronicHep + c.FreeFree
}

// The voronovH… constants are the Voronov (1997) fit coefficients for H I
// as given in cion.dat of Debian's mocassin-data (first row, "13.6 0.
// 2.91E-08 0.2320 0.39"), read in the column order ΔE [eV], P,
// A [cm³ s⁻¹], X, K (the column order is to be checked against Voronov
// 1997).
const (
	voronovHdE = 13.6    // ΔE, eV
	voronovHP  = 0.0     // P
	voronovHA  = 2.91e-8 // A, cm³ s⁻¹
	voronovHX  = 0.232   // X
	voronovHK  = 0.39    // K
)

// rates holds the rate coefficients (cm³ s⁻¹) at one temperature.
type rates struct {
	aHp, aHep, ad, aHepp float64 // recombination: H+, He+ (radiative), He+ (dielectronic), He++
	gH0, gHe0, gHep      float64 // collisional ionisation: H0, He0, He+
}

// cenRates returns the Cen (1992)/KWH96 rate coefficients at T (K) > 0,
// with Voronov (1997) for Γ_eH0 unless opt says otherwise. T_n = T/10^n,
// f = (1 + T_5^{1/2})⁻¹. All from KWH96 via public code (SECONDARY) except
// the Voronov rate.
func cenRates(T float64, opt PrimordialOptions) rates {
	sqrtT := math.Sqrt(T)
	f := 1 / (1 + math.Sqrt(T/1e5))
	sup := math.Pow(T/1e3, -0.2) / (1 + math.Pow(T/1e6, 0.7)) // T3^-0.2/(1+T6^0.7)
	r := rates{
		aHp:   8.40e-11 / sqrtT * sup,                                                          // α_H+, KWH96 (secondary)
		aHep:  1.50e-10 * math.Pow(T, -0.6353),                                                 // α_He+, KWH96 (secondary)
		ad:    1.9e-3 * math.Pow(T, -1.5) * math.Exp(-470000/T) * (1 + 0.3*math.Exp(-94000/T)), // α_d, KWH96 (secondary)
		aHepp: 3.36e-10 / sqrtT * sup,                                                          // α_He++ = 4 α_H+, KWH96 (secondary)
		gHe0:  2.38e-11 * sqrtT * math.Exp(-285335.4/T) * f,                                    // Γ_eHe0, KWH96 (secondary)
		gHep:  5.68e-12 * sqrtT * math.Exp(-631515/T) * f,                                      // Γ_eHe+, KWH96 (secondary)
	}
	if opt.HIonisation == KWH96H {
		r.gH0 = 5.85e-11 * sqrtT * math.Exp(-157809.1/T) * f // Γ_eH0, KWH96 (secondary)
	} else {
		r.gH0 = voronovRate(T) // Γ_eH0, Voronov 1997 via cion.dat (to be checked against the paper)
	}
	return r
}

// voronovRate returns the Voronov (1997) collisional ionisation rate of H0
// in cm³ s⁻¹,
//
//	k = A (1 + P U^{1/2}) U^K e^{−U} / (X + U),  U = ΔE/(k_B T),
//
// (Voronov 1997; functional form FROM MEMORY; coefficients from
// cion.dat, see voronovHA).
func voronovRate(T float64) float64 {
	u := voronovHdE * model.ElectronVolt / (model.Boltzmann * T)
	return voronovHA * (1 + voronovHP*math.Sqrt(u)) * math.Pow(u, voronovHK) * math.Exp(-u) / (voronovHX + u)
}

// balance solves the CIE ionisation balance with no radiation field
// (algebra DERIVED from the rates; KWH96's form too, from memory):
//
//	n_H0/n_H = α_H+/(α_H+ + Γ_eH0),
//	n_He0 : n_He+ : n_He++ = (α_He+ + α_d)/Γ_eHe0 : 1 : Γ_eHe+/α_He++,
//	n_e = n_H+ + n_He+ + 2 n_He++.
//
// A rate that underflows to zero at low T (Γ_eHe0 below a few hundred K in
// float64) gives the all-neutral limit, never NaN (cloudwind's guard).
func balance(r rates, y float64) Ionisation {
	var s Ionisation
	// Hydrogen.
	if d := r.aHp + r.gH0; d > 0 {
		s.XH0, s.XHp = r.aHp/d, r.gH0/d
	} else {
		s.XH0 = 1 // no rates at all: treat as neutral
	}
	// Helium: ratios to n_He+, scaled by their largest to avoid overflow.
	switch {
	case !(r.gHe0 > 0):
		s.XHe0 = 1 // no ionisation of He0: all neutral
	case !(r.aHepp > 0):
		s.XHepp = 1 // no recombination of He++: all doubly ionised
	default:
		r0 := (r.aHep + r.ad) / r.gHe0 // n_He0/n_He+
		r2 := r.gHep / r.aHepp         // n_He++/n_He+
		m := math.Max(1, math.Max(r0, r2))
		if math.IsInf(m, 1) {
			if math.IsInf(r0, 1) {
				s.XHe0 = 1
			} else {
				s.XHepp = 1
			}
			break
		}
		d := 1/m + r0/m + r2/m
		s.XHe0, s.XHep, s.XHepp = r0/m/d, 1/m/d, r2/m/d
	}
	s.NeOverNH = s.XHp + y*(s.XHep+2*s.XHepp)
	return s
}

// primordialInputOK reports whether (t, y) is in the solver's domain apart
// from t ≤ 0, which has its own special case.
func primordialInputOK(T, y float64) bool {
	return !math.IsNaN(T) && !math.IsInf(T, 1) && !math.IsNaN(y) && !math.IsInf(y, 0) && y >= 0
}

func nanIonisation() Ionisation {
	n := math.NaN()
	return Ionisation{n, n, n, n, n, n}
}

// neutralIonisation is the ionisation state at T ≤ 0.
func neutralIonisation() Ionisation { return Ionisation{XH0: 1, XHe0: 1} }

// PrimordialIonisation returns the CIE ionisation state of hydrogen and
// helium at temperature t for a helium-to-hydrogen number ratio y, with no
// radiation field (the rates of cenRates).
//
// Special cases are:
//
//	PrimordialIonisation(t ≤ 0, y, opt) = all neutral, NeOverNH = 0
//	PrimordialIonisation(t, y < 0 or ±Inf, opt) = NaN fields
//	PrimordialIonisation(NaN or +Inf, y, opt) = NaN fields
func PrimordialIonisation(t model.Temperature, y float64, opt PrimordialOptions) Ionisation {
	T := float64(t)
	switch {
	case !primordialInputOK(T, y):
		return nanIonisation()
	case T <= 0:
		return neutralIonisation()
	}
	return balance(cenRates(T, opt), y)
}

// NeOverNH returns n_e/n_H of hydrogen and helium in CIE at temperature t
// for y = n_He/n_H, with the default rates (Voronov 1997 for H). Metal
// electrons are neglected: ≤1% above 10^5 K, more below 2×10^4 K where H is
// partly neutral and metals supply electrons (measured: Sutherland &
// Dopita 1993 solar has n_e/n_H = 1.209 against 1.196 from H+He). Its
// signature suits a loader that converts per-n_e-n_H tables to n_H².
// Special cases are those of PrimordialIonisation.
func NeOverNH(t model.Temperature, y float64) float64 {
	return PrimordialIonisation(t, y, PrimordialOptions{}).NeOverNH
}

// PrimordialCIE returns the CIE ionisation state and the cooling function
// of hydrogen and helium at temperature t, per n_H², for y = n_He/n_H. The
// cooling terms are those of Cen (1992) as adopted by KWH96 (SECONDARY, see
// cenRates), each multiplied by its density product and divided by n_H²;
// with VoronovH the H ionisation cooling is 13.6 eV × the Voronov rate
// (derived: the KWH96 term is 13.6 eV × its rate), and with HepBlack81 (the
// default) the He+ excitation term lacks Cen's factor (see HepExcitation).
//
// Special cases are:
//
//	PrimordialCIE(t ≤ 0, y, opt) = all neutral, zero cooling
//	PrimordialCIE(t, y < 0 or ±Inf, opt) = NaN
//	PrimordialCIE(NaN or +Inf, y, opt) = NaN
func PrimordialCIE(t model.Temperature, y float64, opt PrimordialOptions) (Ionisation, PrimordialCooling) {
	T := float64(t)
	switch {
	case !primordialInputOK(T, y):
		n := model.CoolingRate(math.NaN())
		return nanIonisation(), PrimordialCooling{n, n, n, n, n, n, n, n, n, n}
	case T <= 0:
		return neutralIonisation(), PrimordialCooling{}
	}
	r := cenRates(T, opt)
	s := balance(r, y)
	ne := s.NeOverNH
	sqrtT := math.Sqrt(T)
	f := 1 / (1 + math.Sqrt(T/1e5))
	sup := math.Pow(T/1e3, -0.2) / (1 + math.Pow(T/1e6, 0.7))
	nH0, nHp := s.XH0, s.XHp                           // per n_H
	nHe0, nHep, nHepp := y*s.XHe0, y*s.XHep, y*s.XHepp // per n_H
	var c PrimordialCooling
	c.ExcitationH0 = model.CoolingRate(7.50e-19 * math.Exp(-118348/T) * f * ne * nH0) // KWH96 (secondary)
	// He+ excitation: the KWH96 coefficient (SECONDARY) with Cen's factor f
	// only for HepKWH96; without it, the form attributed to Black (1981)
	// (SECONDARY, from memory), which matches Gnat & Ferland (2012) Table
	// 1B to 0.90–1.02 over 7×10^4–1.2×10^5 K (measured).
	hep := 5.54e-17 * math.Pow(T, -0.397) * math.Exp(-473638/T)
	if opt.HepExcitation == HepKWH96 {
		hep *= f
	}
	c.ExcitationHep = model.CoolingRate(hep * ne * nHep)
	if opt.HIonisation == KWH96H {
		c.IonisationH0 = model.CoolingRate(1.27e-21 * sqrtT * math.Exp(-157809.1/T) * f * ne * nH0) // KWH96 (secondary)
	} else {
		c.IonisationH0 = model.CoolingRate(voronovHdE * model.ElectronVolt * r.gH0 * ne * nH0) // 13.6 eV × Voronov rate (derived)
	}
	c.IonisationHe0 = model.CoolingRate(9.38e-22 * sqrtT * math.Exp(-285335.4/T) * f * ne * nHe0)                                        // KWH96 (secondary)
	c.IonisationHep = model.CoolingRate(4.95e-22 * sqrtT * math.Exp(-631515/T) * f * ne * nHep)                                          // KWH96 (secondary)
	c.RecombinationHp = model.CoolingRate(8.70e-27 * sqrtT * sup * ne * nHp)                                                             // KWH96 (secondary)
	c.RecombinationHep = model.CoolingRate(1.55e-26 * math.Pow(T, 0.3647) * ne * nHep)                                                   // KWH96 (secondary)
	c.RecombinationHepp = model.CoolingRate(3.48e-26 * sqrtT * sup * ne * nHepp)                                                         // KWH96 (secondary)
	c.DielectronicHep = model.CoolingRate(1.24e-13 * math.Pow(T, -1.5) * math.Exp(-470000/T) * (1 + 0.3*math.Exp(-94000/T)) * ne * nHep) // KWH96 (secondary)
	// Free-free with KWH96's coefficient 1.42e-27 (0.4% below the
	// Rybicki & Lightman value FreeFreePrefactor) and Gaunt factor.
	c.FreeFree = model.CoolingRate(1.42e-27 * GauntKWH96(t) * sqrtT * (nHp + nHep + 4*nHepp) * ne) // KWH96 (secondary)
	return s, c
}

// Primordial returns the primordial CIE cooling curve Λ_H+He(T) per n_H²
// for y = n_He/n_H, sampled every 0.01 dex from 10^4 to 10^9 K (the range
// over which the rates were compared with Cloudy-based tables: measured
// against Wiersma et al. 2009). The source computes Λ per n_H² directly.
func Primordial(y float64, opt PrimordialOptions) (*PowerLaw, error) {
	if math.IsNaN(y) || math.IsInf(y, 0) || y < 0 {
		return nil, fmt.Errorf("helium ratio y = %g: want a finite y ≥ 0", y)
	}
	f := func(t model.Temperature) model.CoolingRate {
		_, c := PrimordialCIE(t, y, opt)
		return c.Total()
	}
	return Sample(f, 1e4, 1e9, 0.01, primordialMeta(y, opt))
}

// primordialMeta describes the primordial curve.
func primordialMeta(y float64, opt PrimordialOptions) Meta {
	name, cite := "primordial CIE (KWH96+V97 H, B81 He+ excitation)", citeKWH96+"; "+citeVoronov+"; "+citeBlack81
	caveat := caveatHepBlack81
	switch {
	case opt.HIonisation == KWH96H && opt.HepExcitation == HepKWH96:
		name, cite, caveat = "primordial CIE (KWH96 as published)", citeKWH96, caveatHepKWH96
	case opt.HIonisation == KWH96H:
		name, cite = "primordial CIE (KWH96 H, B81 He+ excitation)", citeKWH96+"; "+citeBlack81
	case opt.HepExcitation == HepKWH96:
		name, cite, caveat = "primordial CIE (KWH96+V97 H)", citeKWH96+"; "+citeVoronov, caveatHepKWH96
	}
	return Meta{
		Name:          name,
		Citation:      cite,
		Normalisation: PerNH2,
		HeliumRatio:   y,
		Metallicity:   0,
		Caveats: []string{
			CaveatCIE,
			"H+He rates of Cen (1992)/KWH96 from secondary sources (original table not viewed)",
			caveat,
		},
	}
}

// Citations used in Meta.
const (
	citeKWH96   = "Cen 1992, ApJS 78, 341, as adopted by Katz, Weinberg & Hernquist 1996 (rates via secondary sources)"
	citeVoronov = "Voronov 1997 (H ionisation; coefficients from mocassin-data cion.dat, to be checked against the paper)"
	citeBlack81 = "He+ excitation without Cen's factor: the form attributed to Black 1981, MNRAS 197, 553 " +
		"(attribution secondary, from memory), checked against Gnat & Ferland 2012, ApJS 199, 20, Table 1B"
)

// Caveats on the He+ region, measured against the CHIANTI curves of Ryden &
// Pogge (2021) and the helium table of Gnat & Ferland (2012).
const (
	caveatHepBlack81 = "He+ excitation without Cen's factor matches Gnat & Ferland 2012's He+ cooling efficiency to 0.90-1.02 " +
		"at 7e4-1.2e5 K, but the KWH96 ionisation balance keeps about 1.5 times their He+ fraction at 1e5-1.7e5 K, " +
		"so H+He is up to 32% above the metal-free CHIANTI curve near 1.3e5 K (measured)"
	caveatHepKWH96 = "Cen's factor (1 + T_5^1/2)^-1 on He+ excitation, as published: 0.43-0.55 of Gnat & Ferland 2012's " +
		"He+ cooling efficiency at 7e4-1.2e5 K, so H+He is up to 35% below the CHIANTI curves between 5e4 and 3e5 K (measured)"
)
