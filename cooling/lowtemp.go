package cooling

import (
	"math"

	"cloudwind/model"
)

// Cooling below 10^4 K: the fit of Koyama & Inutsuka (2002, ApJ 564, L97;
// KI02) to the cooling of the neutral interstellar medium, which the
// built-in curve uses below 10^4 K, capped at the CIE value at 10^4 K
// (see Builtin).
//
// Status: the formula and its constants are CONFIRMED only through
// secondary sources, several public code files that agree (KI_heat =
// 2.0e-26, KI_v1 = 1e7, KI_v2 = 1.4e-2, KI_T1 = 1.184e5, KI_T2 = 1e3, KI_T3
// = 92); the paper itself was not read, so no equation number is given.
// That the printed paper had a typo, corrected by Vázquez-Semadeni et al.
// (2007), is from memory; which term it concerned was not checked. The
// constants below are those of the public codes.
//
// Checks that could be made here (derived, see lowtemp_test.go): the
// products Γ v1 = 2.0e-19 and Γ v2 = 2.8e-28 erg cm³ s⁻¹ are the
// coefficients of Λ as it is commonly quoted (secondary); and the thermal
// equilibrium n Λ(T) = Γ that KI02's fit is built for falls at warm-neutral
// temperatures (~5×10^3 K) for n = 1 cm⁻³ and at cold-neutral ones (~40 K)
// for n = 100 cm⁻³, the two stable phases of the neutral ISM. That supports
// the normalisation per n² (n the hydrogen density, from memory), which
// cloudwind takes as per n_H².
//
// What the fit is and is not: it describes neutral gas with heating, not
// collisional ionisation equilibrium. KI02 write the net loss rate per unit
// volume as n² Λ − n Γ (from memory); cloudwind uses the cooling term only
// (no heating, no ionising background), so gas cools through the
// temperature at which KI02's gas would settle, down to the caller's
// floor. The first term is hydrogen Lyα cooling, the second fine-structure
// cooling (the 92 K is that of the C⁺ 158 µm line; from memory), which is
// metal cooling: cloudwind scales it with Z/Z☉ and leaves the Lyα term
// alone (cloudwind's choice; KI02's fit is for solar-neighbourhood gas,
// from memory). The fit is used only up to 10^4 K, the top of the range it
// describes (the neutral ISM, T ≲ 10^4 K; from memory).

// The constants of KI02 as public codes write them (SECONDARY; unverified
// against the paper): Λ/Γ = v1 exp(−T1/(T + T2)) + v2 T^{1/2} exp(−T3/T).
const (
	ki02Gamma = 2.0e-26 // Γ, heating rate per H, erg s⁻¹ ("KI_heat")
	ki02V1    = 1e7     // cm³ ("KI_v1")
	ki02V2    = 1.4e-2  // cm³ K^-1/2 ("KI_v2")
	ki02T1    = 1.184e5 // K ("KI_T1")
	ki02T2    = 1e3     // K ("KI_T2")
	ki02T3    = 92      // K ("KI_T3")
)

// ki02Top is the top of the range of the KI02 fit, 10^4 K (the fit
// describes T ≲ 10^4 K; from memory), and the bottom of the built-in
// curve's CIE part.
const ki02Top = 1e4

// ki02Terms returns the two terms of the KI02 fit at T (K) in
// erg cm³ s⁻¹: the Lyα term Γ v1 exp(−T1/(T+T2)) and the fine-structure
// term Γ v2 T^{1/2} exp(−T3/T) at solar metallicity.
func ki02Terms(T float64) (lya, fs float64) {
	lya = ki02Gamma * ki02V1 * math.Exp(-ki02T1/(T+ki02T2))
	fs = ki02Gamma * ki02V2 * math.Sqrt(T) * math.Exp(-ki02T3/T)
	return lya, fs
}

// KoyamaInutsuka02Lambda returns the cooling term of the Koyama &
// Inutsuka (2002) fit for the neutral ISM at temperature t and
// metallicity z (in Z☉), per n_H² in erg cm³ s⁻¹,
//
//	Λ = Γ [v1 exp(−T1/(T + T2)) + z v2 T^{1/2} exp(−T3/T)]
//	  = 2.0e-19 exp(−1.184e5/(T + 1000)) + z 2.8e-28 T^{1/2} exp(−92/T),
//
// with Γ = 2e-26 erg s⁻¹, v1 = 1e7 cm³, v2 = 1.4e-2 cm³ K^-1/2,
// T1 = 1.184e5 K, T2 = 1000 K, T3 = 92 K. The formula and constants are
// confirmed only through public code (SECONDARY; unverified against the
// paper; a typo in the printed paper corrected by Vázquez-Semadeni et al.
// 2007 is from memory). The factor z on the fine-structure (metal) term is
// cloudwind's choice; z = 1 is the fit as published. It is the cooling
// term only: KI02's heating Γ is not subtracted. Meant for
// 10 K ≲ T ≲ 10^4 K (from memory).
//
// Special cases are:
//
//	KoyamaInutsuka02Lambda(t ≤ 0, z) = 0
//	KoyamaInutsuka02Lambda(t, z < 0) = NaN
//	KoyamaInutsuka02Lambda(NaN, z) = KoyamaInutsuka02Lambda(t, NaN) = NaN
func KoyamaInutsuka02Lambda(t model.Temperature, z float64) model.CoolingRate {
	T := float64(t)
	switch {
	case math.IsNaN(T) || math.IsNaN(z) || z < 0:
		return model.CoolingRate(math.NaN())
	case T <= 0:
		return 0
	}
	lya, fs := ki02Terms(T)
	return model.CoolingRate(lya + z*fs)
}

// Citation and caveats of the KI02 part, for Meta.
const (
	citeKI02 = "below 1e4 K: Koyama & Inutsuka 2002, ApJ 564, L97 (constants via public code, unverified against " +
		"the paper; a typo correction by Vázquez-Semadeni et al. 2007 is from memory)"
	caveatKI02 = "below 1e4 K: the Koyama & Inutsuka 2002 fit for neutral gas, not CIE, per n² with n the H density " +
		"(from memory), taken as per n_H²; cooling term only: KI02 define it with a heating rate of 2e-26 erg/s per H, " +
		"which is not included, and there is no ionising background"
	caveatKI02Z = "below 1e4 K the KI02 fine-structure term (metal cooling) is scaled by Z/Z☉ and the H Lyα term is " +
		"not (cloudwind's choice); at Z = 0 only Lyα remains, negligible below about 5000 K (no H2 cooling here)"
	caveatFloor = "the cooling floor still applies: Λ = 0 below T_floor (by default T_cl)"
)
