package cooling

import (
	"math"

	"cloudwind/model"
)

// The constants of C_ff come from model/constants.go (CODATA 2018).
const (
	planck              = model.Planck
	speedOfLight        = float64(model.SpeedOfLight)
	elementaryChargeESU = model.ElementaryCharge
)

// kiloElectronVolt is 1 keV in erg (exact; CODATA 2018 eV).
const kiloElectronVolt = 1e3 * model.ElectronVolt

// electronMass is m_e in g, as a plain number for the constants below.
const electronMass = float64(model.ElectronMass)

// freeFreeA and freeFreeB are the two factors of C_ff (FreeFreePrefactor):
// 2^5 π e^6/(3 h m_e c^3) in erg cm³ s⁻¹ cm⁻¹ s, and 2πk/(3 m_e) in cm² s⁻² K⁻¹.
// Go constants cannot take the square root of the second.
const (
	esuSquared = elementaryChargeESU * elementaryChargeESU
	freeFreeA  = 32 * math.Pi * esuSquared * esuSquared * esuSquared /
		(3 * planck * electronMass * speedOfLight * speedOfLight * speedOfLight)
	freeFreeB = 2 * math.Pi * model.Boltzmann / (3 * electronMass)
)

// FreeFreePrefactor returns the thermal bremsstrahlung constant of
// Rybicki & Lightman (1979) eq. 5.15b (equation number FROM MEMORY),
//
//	C_ff = (2^5 π e^6 / (3 h m_e c^3)) (2π k / (3 m_e))^{1/2},
//
// in erg cm³ s⁻¹ K^-1/2, computed from the CODATA 2018 constants:
// 1.42556e-27 (derived). Rybicki & Lightman quote it rounded as 1.4e-27
// (FROM MEMORY). The emissivity of a plasma is ε_ff = C_ff T^{1/2} n_e n_i
// Z_i² ḡ_B.
func FreeFreePrefactor() float64 { return freeFreeA * math.Sqrt(freeFreeB) }

// GauntKWH96 returns the frequency-averaged free-free Gaunt factor used by
// Katz, Weinberg & Hernquist (1996) after Cen (1992),
//
//	ḡ_ff(T) = 1.1 + 0.34 exp(−(5.5 − log10 T)²/3),
//
// (KWH96, via public code; secondary). It lies between 1.1 and 1.44 and is
// 1.44 at 10^5.5 K.
//
// Special cases are:
//
//	GauntKWH96(t ≤ 0) = 1.1
//	GauntKWH96(NaN) = NaN
func GauntKWH96(t model.Temperature) float64 {
	T := float64(t)
	if T <= 0 {
		return 1.1 // the limit as log10 T → −∞
	}
	d := 5.5 - math.Log10(T)
	return 1.1 + 0.34*math.Exp(-d*d/3)
}

// FreeFree returns the free-free (thermal bremsstrahlung) cooling of fully
// ionised hydrogen and helium per n_H², in erg cm³ s⁻¹,
//
//	Λ_ff = C_ff T^{1/2} ḡ (n_p + 4 n_He++) n_e / n_H² = C_ff T^{1/2} ḡ (1 + 4y)(1 + 2y),
//
// with C_ff = FreeFreePrefactor() (Rybicki & Lightman 1979 eq. 5.15b, FROM
// MEMORY), y = n_He/n_H and gaunt the frequency-averaged Gaunt factor ḡ_B
// (a constant such as 1.2, the typical value Rybicki & Lightman give, FROM
// MEMORY; or GauntKWH96(t)). The weight (1 + 4y)(1 + 2y) = (n_p + 4 n_He)
// n_e/n_H² is derived for fully ionised H+He. Example: 2.661e-23 at 10^8 K
// with ḡ = 1.2 and y = 0.0833 (derived).
//
// Special cases are:
//
//	FreeFree(t ≤ 0, y, gaunt) = 0
//	FreeFree(t, y < 0, gaunt) = NaN
//	FreeFree(NaN, y, gaunt) = FreeFree(t, NaN, gaunt) = NaN
func FreeFree(t model.Temperature, y, gaunt float64) model.CoolingRate {
	T := float64(t)
	switch {
	case math.IsNaN(T) || math.IsNaN(y) || y < 0:
		return model.CoolingRate(math.NaN())
	case T <= 0:
		return 0
	}
	return model.CoolingRate(FreeFreePrefactor() * math.Sqrt(T) * gaunt * (1 + 4*y) * (1 + 2*y))
}
