package cooling

import (
	"errors"
	"fmt"
	"math"

	"cloudwind/model"
)

// Historical fits, kept for comparison with the literature that used them.
// They are labelled Historical in Meta and are not the built-in curve.

// RosenBregman95Lambda returns the Rosen & Bregman (1995) piecewise power
// law in erg cm³ s⁻¹ (SECONDARY: the coefficients as in several
// independent public code files):
//
//	Λ = 2.2380e-32 T^2.0     for   300 ≤ T < 2000 K
//	    1.0012e-30 T^1.5     for  2000 ≤ T < 8000 K
//	    4.6240e-36 T^2.867   for  8000 ≤ T < 10^5 K
//	    1.7800e-18 T^-0.65   for  10^5 ≤ T < 4×10^7 K
//	    3.2217e-27 T^0.5     for         T ≥ 4×10^7 K
//
// The 10^5–4×10^7 K coefficient is 1.78e-18, which is continuous to 0.1% at
// both ends; one public version has 1.67e-18, which leaves a 6% jump at
// 10^5 K (measured). The paper writes L = n² Λ with an ambiguous density;
// cloudwind treats it as n_H² (cloudwind's choice, labelled).
//
// Special cases are:
//
//	RosenBregman95Lambda(t < 300 K) = 0
//	RosenBregman95Lambda(NaN) = NaN
func RosenBregman95Lambda(t model.Temperature) model.CoolingRate {
	T := float64(t)
	var l float64
	switch {
	case math.IsNaN(T):
		l = math.NaN()
	case T < 300:
		l = 0
	case T < 2000:
		l = 2.2380e-32 * T * T
	case T < 8000:
		l = 1.0012e-30 * math.Pow(T, 1.5)
	case T < 1e5:
		l = 4.6240e-36 * math.Pow(T, 2.867)
	case T < 4e7:
		l = 1.7800e-18 * math.Pow(T, -0.65)
	default:
		l = 3.2217e-27 * math.Sqrt(T)
	}
	return model.CoolingRate(l)
}

// RosenBregman95 returns the Rosen & Bregman (1995) fit (see
// RosenBregman95Lambda) sampled every 0.01 dex from 300 K to 10^9 K. Above
// the last node the range policy's T^{1/2} extension is exactly the fit's
// last segment.
func RosenBregman95() (*PowerLaw, error) {
	meta := Meta{
		Name:          "Rosen & Bregman 1995 (historical fit)",
		Citation:      "Rosen & Bregman 1995, ApJ 440, 634 (journal reference from memory; coefficients via several public code files, unverified against the paper)",
		Normalisation: PerN2,
		Metallicity:   math.NaN(), // not known: the paper was not checked
		Historical:    true,
		Caveats: []string{
			"historical piecewise power law, kept for comparison; fit range 300 K and above",
			"coefficient 1.78e-18 for 1e5-4e7 K (continuous to 0.1%; a public variant has 1.67e-18)",
		},
		Warnings: []string{
			"Rosen & Bregman write the loss rate as n² Λ with an ambiguous density (one public code notes it is " +
				"\"really proportional to N_H N_e\"); treated here as n_H² Λ",
		},
	}
	// Start a hair above 300 K so that rounding of 10^log10(300) cannot put
	// the first node below the fit's range.
	return Sample(RosenBregman95Lambda, 300*(1+1e-12), 1e9, 0.01, meta)
}

// ErrBelowValidity is returned by a historical fit asked for a temperature
// below the range where it may be used.
var ErrBelowValidity = errors.New("temperature below the fit's range of validity")

// tozziNormanMinKeV is the lowest kT at which the Tozzi & Norman (2001) fit
// may be used, 0.1 keV (cloudwind's choice: measured against Sutherland &
// Dopita 1993 it diverges from tabulated cooling below that).
const tozziNormanMinKeV = 0.1

// tozziNormanMaxLog10T is the top of its sampled range: 10^8.5 K, the upper
// end of the measured agreement with SD93.
const tozziNormanMaxLog10T = 8.5

// TozziNorman01Lambda returns the Tozzi & Norman (2001) fit for Z = 0.3 Z☉,
//
//	Λ = [C1 (kT/keV)^-1.7 + C2 (kT/keV)^0.5 + C3] × 10^-22 erg cm³ s⁻¹,
//	C1 = 8.6e-3, C2 = 5.8e-2, C3 = 6.3e-2,
//
// (SECONDARY: the constants as in public code, not checked against the
// paper; one file has a variant with C2 = 5.8e-3, a typo, since the T^{1/2}
// term matches Rybicki & Lightman bremsstrahlung only with 5.8e-2). The
// value is in the source's normalisation, taken as per n_e n_H: measured
// that way it agrees with Sutherland & Dopita (1993) [Fe/H] = −0.5 within
// ±20% for 10^6.1 ≤ T ≤ 10^8.5 K (measured).
//
// It returns ErrBelowValidity for kT < 0.1 keV (T < 1.16×10^6 K), where
// the fit diverges from tabulated cooling, and for NaN.
//
// Special cases are:
//
//	TozziNorman01Lambda(+Inf) = +Inf, nil
func TozziNorman01Lambda(t model.Temperature) (model.CoolingRate, error) {
	T := float64(t)
	kT := model.Boltzmann * T / kiloElectronVolt // keV
	if !(kT >= tozziNormanMinKeV) {
		return 0, fmt.Errorf("kT = %s keV (T = %s K) is below %s keV, the limit of the Tozzi & Norman 2001 fit: %w", model.FormatNumber(kT, 3), num(T), num(tozziNormanMinKeV), ErrBelowValidity)
	}
	const c1, c2, c3 = 8.6e-3, 5.8e-2, 6.3e-2 // Tozzi & Norman 2001, via public code (secondary, unchecked against the paper)
	return model.CoolingRate((c1*math.Pow(kT, -1.7) + c2*math.Sqrt(kT) + c3) * 1e-22), nil
}

// TozziNorman01 returns the Tozzi & Norman (2001) fit (see
// TozziNorman01Lambda) converted to n_H² and sampled every 0.01 dex from
// kT = 0.1 keV (1.16×10^6 K) to 10^8.5 K. Below the first node the range
// policy gives Λ = 0 and reports BelowTable.
//
// Conversion: the fit is taken as per n_e n_H (cloudwind's choice; the
// measured agreement above assumes it), so Λ_hd = (n_e/n_H) Λ with n_e/n_H
// from the primordial solver at y = 0.0851 (fully ionised above 0.1 keV: 1
// + 2y to 0.1%). The helium ratio the fit assumed is not known here.
func TozziNorman01() (*PowerLaw, error) {
	tMin := model.Temperature(tozziNormanMinKeV * kiloElectronVolt / model.Boltzmann)
	f := func(t model.Temperature) model.CoolingRate {
		l, err := TozziNorman01Lambda(t)
		if err != nil {
			return model.CoolingRate(math.NaN()) // Sample reports it
		}
		return model.CoolingRate(NeOverNH(t, BuiltinHeliumRatio)) * l
	}
	meta := Meta{
		Name:          "Tozzi & Norman 2001, Z = 0.3 Z☉ (historical fit)",
		Citation:      "Tozzi & Norman 2001, ApJ 546, 63 (journal reference from memory; coefficients via public code, unverified against the paper)",
		Normalisation: PerNeNH,
		HeliumRatio:   0, // not stated by the source; the conversion uses 0.0851
		Metallicity:   0.3,
		Historical:    true,
		Caveats: []string{
			"historical analytic fit, kept for comparison; valid only for kT ≥ 0.1 keV",
			"normalisation taken as n_e n_H (measured agreement with SD93 [Fe/H] = -0.5 within 20% for 10^6.1-10^8.5 K); " +
				"converted to n_H² with n_e/n_H of the H+He solver at y = 0.0851",
		},
	}
	// Round tMin up slightly so that the first node is not below 0.1 keV
	// by rounding.
	return Sample(f, tMin*(1+1e-12), model.Temperature(math.Pow(10, tozziNormanMaxLog10T)), 0.01, meta)
}
