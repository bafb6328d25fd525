package model

import "math"

// This file holds the closed-form relations of the cloud-in-wind problem,
// one function each, in the notation of the package doc (Conventions).

// HotTemperature returns the wind temperature in pressure equilibrium with a
// cloud at tCl,
//
//	T_hot = χ T_cl μ_hot/μ_cl,
//
// which follows from P = ρ k_B T/(μ m_p) being equal in both phases (derived;
// with one μ, T_hot = χ T_cl exactly).
func HotTemperature(tCl Temperature, chi, muCold, muHot float64) Temperature {
	return Temperature(chi * float64(tCl) * muHot / muCold)
}

// ParticleDensity returns the total particle number density of gas at
// pressure p and temperature t, n = (P/k_B)/T (ideal gas).
//
// Special cases are:
//
//	ParticleDensity(p, 0) = +Inf
func ParticleDensity(p Pressure, t Temperature) NumberDensity {
	return NumberDensity(float64(p) / float64(t))
}

// MassDensity returns ρ = μ m_p n for particle density n and mean molecular
// weight mu (m_p is the mass unit of μ here, cloudwind's choice; m_H or m_u
// would change ρ by 0.05% or 0.7%, derived).
func MassDensity(n NumberDensity, mu float64) Density {
	return Density(mu * float64(ProtonMass) * float64(n))
}

// HydrogenDensity returns the hydrogen nucleus density n_H = X ρ/m_H for mass
// density rho and hydrogen mass fraction x (definition of X).
func HydrogenDensity(rho Density, x float64) NumberDensity {
	return NumberDensity(x * float64(rho) / float64(HydrogenAtomMass))
}

// SoundSpeed returns the adiabatic sound speed
//
//	c_s = (γ k_B T/(μ m_p))^{1/2}
//
// of gas at temperature t with mean molecular weight mu and adiabatic index
// gamma (the textbook adiabatic sound speed).
func SoundSpeed(t Temperature, mu, gamma float64) Velocity {
	return Velocity(math.Sqrt(gamma * Boltzmann * float64(t) / (mu * float64(ProtonMass))))
}

// CloudCrushingTime returns the cloud-crushing time
//
//	t_cc = χ^{1/2} r_cl / v_w
//
// of a cloud of radius rCl and density contrast chi in a wind of speed vW
// [KMC94]; the cloud–wind form as stated in the abstract of [KDS21]. Equation
// numbers were not read from the papers.
//
// Special cases are:
//
//	CloudCrushingTime(r > 0, χ, 0) = +Inf
func CloudCrushingTime(rCl Length, chi float64, vW Velocity) Time {
	return Time(math.Sqrt(chi) * float64(rCl) / float64(vW))
}

// ShearTime returns t_shear = r_cl/v_w, the time a hot-phase fluid element
// takes to cross the cloud: the dynamical time of [AFB23] (their exact
// definition, r_cl or 2r_cl over v_w, is from memory; cloudwind uses r_cl).
func ShearTime(rCl Length, vW Velocity) Time {
	return Time(float64(rCl) / float64(vW))
}

// SoundCrossingTime returns t_sc = r/c_s, the sound-crossing time of a
// cloud of radius r with sound speed cs.
func SoundCrossingTime(r Length, cs Velocity) Time {
	return Time(float64(r) / float64(cs))
}

// MixTemperature returns the temperature of mixed gas,
//
//	T_mix = (T_cl T_hot)^{1/2},
//
// the geometric mean [BF90] (attribution from memory; the form is how [GO18]
// phrase "mixed gas").
func MixTemperature(tCl, tHot Temperature) Temperature {
	return Temperature(math.Sqrt(float64(tCl) * float64(tHot)))
}

// CoolingTime returns the cooling time
//
//	t_cool = f n k_B T / (𝒩 Λ(T))
//
// of gas with particle density n at temperature t, where f is the
// heat-capacity factor (3/2 isochoric, 5/2 isobaric), densityProduct is 𝒩 in
// cm⁻⁶ (n_H² or n²) and lambda is Λ(T) (definition; f and 𝒩 are the
// labelled conventions of the package doc).
//
// Special cases are:
//
//	CoolingTime(f, n, t, 𝒩, 0) = +Inf
func CoolingTime(f float64, n NumberDensity, t Temperature, densityProduct float64, lambda CoolingRate) Time {
	if lambda <= 0 {
		return Time(math.Inf(1))
	}
	return Time(f * float64(n) * Boltzmann * float64(t) / (densityProduct * float64(lambda)))
}

// DragTime returns the ram-pressure entrainment time
//
//	t_drag = χ r_cl / v_w = χ^{1/2} t_cc,
//
// the standard order-of-magnitude statement (as in the introduction of
// [GO18]; status: from memory). For a sphere with drag coefficient C_D the
// exact time to halve the velocity difference is (8/(3C_D)) χ r_cl/v_w
// (derived from F_drag = ½ C_D ρ_hot Δv² π r_cl² at constant mass).
func DragTime(rCl Length, chi float64, vW Velocity) Time {
	return Time(chi * float64(rCl) / float64(vW))
}

// CloudMass returns the mass of a uniform sphere, m = (4π/3) r³ ρ.
func CloudMass(r Length, rho Density) Mass {
	x := float64(r)
	return Mass(4 * math.Pi / 3 * x * x * x * float64(rho))
}

// CloudColumn returns the column density N = n r of a cloud of radius r and
// particle density n (derived for a sphere; through the centre it is 2 n r).
func CloudColumn(n NumberDensity, r Length) ColumnDensity {
	return ColumnDensity(float64(n) * float64(r))
}

// CoolingLength returns l_cool = c_s t_cool, the distance sound travels in a
// cooling time [McC18].
func CoolingLength(cs Velocity, tCool Time) Length {
	return Length(float64(cs) * float64(tCool))
}

// MixingVelocity returns the hot-gas inflow velocity into a radiative
// mixing layer,
//
//	v_mix = α_v c_s,cl (t_cool,cl / t_sc,cl)^{-1/4},
//
// with t_sc,cl = r_cl/c_s,cl. The t_cool^{-1/4} scaling is that of [TOG21]
// (abstract) and [GO20]; the prefactor α_v ≈ 1 is from memory.
//
// Special cases are:
//
//	MixingVelocity(α, cs, +Inf, t) = 0
func MixingVelocity(alphaV float64, csCold Velocity, tCoolCold, tSoundCold Time) Velocity {
	x := float64(tCoolCold) / float64(tSoundCold)
	return Velocity(alphaV * float64(csCold) / math.Sqrt(math.Sqrt(x))) // x^{-1/4}, without Pow's cost
}

// GrowthTime returns the mass-growth time of a spherical cloud accreting
// cooled wind gas over its whole surface,
//
//	t_grow = m/ṁ = χ r_cl / (3 v_mix),
//
// from ṁ = ρ_hot v_mix 4π r_cl² (derived; [GO20]'s
// area definition is from memory).
//
// Special cases are:
//
//	GrowthTime(r, χ, 0) = +Inf
func GrowthTime(rCl Length, chi float64, vMix Velocity) Time {
	return Time(chi * float64(rCl) / (3 * float64(vMix)))
}
