package model

import (
	"errors"
	"fmt"
	"math"
)

// This file holds the steady adiabatic outflow of Chevalier & Clegg 1985
// [CC85]: energy Ė and mass Ṁ injected uniformly inside a radius R,
// spherical, steady, no gravity, no radiative cooling. The Mach number
// M(r) solves an implicit relation on each side of R ([CC85]; the
// relations are from memory, WindStatus says so for people);
// mass conservation and Bernoulli's constant then give every other
// quantity. A cold cloud at T_cl in pressure equilibrium at radius r sees
// χ(r) = T(r)/T_cl (one μ), M(r) and P(r), so CloudParams turns the wind
// into the Params of the wind-tunnel problem at r.
//
// Inside, the relations are solved for x = ln M, in which both sides are
// smooth and free of overflow for every r from 0 to +Inf:
//
//	inside:  ln(r/R) = F(x) = −a ln(1 + u/(1+3γ)) + b ln(1 + 2u/(1+γ)),
//	outside: 2 ln(r/R) = G(x) = (2/(γ−1)) x + c ln(1 + 2u/(1+γ)),
//
// with u = M⁻² − 1 = expm1(−2x), a = (3γ+1)/(5γ+1), b = (γ+1)/(2(5γ+1))
// and c = (γ+1)/(2(γ−1)) (derived from the relations by taking logs).
// Since 2(a − b) = 1, F(x) = x + C_in + O(e^{2x}) as M → 0 with
// C_in = a ln(1+3γ) + b ln(2/(1+γ)), and G(x) = (2/(γ−1))x + c ln((γ−1)/(γ+1))
// + O(e^{−2x}) as M → ∞ (derived). Both bounds bracket the root, which
// brentRoot [Bre73] then finds to a few ulp in x.

// WindStatus is the verification status of the outflow model, for people.
const WindStatus = "Chevalier & Clegg 1985 (Nature 317, 44) adiabatic wind: the implicit Mach-number relations inside and outside R are from memory, not checked against the paper, and no equation number is cited; the tests check only what follows from them (M(R) = 1 on both branches, the r ≫ R limits, constant mass and energy flux outside R, ρv = Ṁ r/(4πR³) inside)"

// WindLoadingStatus is the status of the star-formation loading of an
// outflow, for people.
const WindLoadingStatus = "Ė = α · 3×10⁴¹ erg s⁻¹ per M☉ yr⁻¹ of star formation and Ṁ = β · SFR: the supernova energy per unit star formation is from memory, not checked against a source"

// WindAssumptions lists the assumptions of the outflow model, one line
// each, for people.
func WindAssumptions() []string {
	return []string{
		"adiabatic: the wind does not cool; past the radius where its own cooling time falls below the flow time r/v the solution is not self-consistent",
		"spherical and steady, with energy and mass injected uniformly inside R",
		"no gravity (of the galaxy or its halo) and no pressure-gradient force on the cloud",
		"clouds in pressure equilibrium with the local wind, at T_cl, with one μ for wind and cloud: χ(r) = T_wind(r)/T_cl",
		"every criterion is applied at each radius as in a wind tunnel with the local χ, M and P: it was calibrated on a uniform wind",
	}
}

// WindParams holds the inputs of a Chevalier & Clegg (1985) outflow and of
// the clouds carried in it. Give either EnergyRate and MassRate, or SFR
// with EnergyLoading and MassLoading. A zero value in an optional field
// means "use the default" stated on that field.
type WindParams struct {
	EnergyRate    Power    // Ė in erg s⁻¹; with MassRate, instead of SFR
	MassRate      MassRate // Ṁ in g s⁻¹; with EnergyRate
	SFR           MassRate // star-formation rate in g s⁻¹ (SolarMassPerYear is 1 M☉ yr⁻¹); with the loadings, instead of the rates
	EnergyLoading float64  // α in Ė = α · SupernovaPowerPerSFR · SFR; required with SFR
	MassLoading   float64  // β in Ṁ = β · SFR; required with SFR

	Radius      Length      // injection radius R in cm
	TCloud      Temperature // cloud temperature T_cl in K
	Metallicity float64     // Z in Z☉, ≥ 0; selects the cooling curve, which the caller builds

	Gamma float64 // adiabatic index γ of wind and clouds; default 5/3
	Mu    float64 // one mean molecular weight for wind and clouds; default 0.6

	// Conventions of every cooling time, as in Params.
	Mixture          Mixture         // solar mixture for n_H; default Asplund2009
	HydrogenFraction float64         // X; default Mixture.X
	TFloor           Temperature     // cooling floor; default TCloud; NoFloor for none
	HeatCapacity     HeatCapacity    // f in t_cool; default Isochoric
	DensityProduct   DensityProduct  // 𝒩 in t_cool; default NH2
	MixCooling       CoolingTimeKind // cold-side cooling time of the growth model; default DefaultMixCooling
}

// Field names of the outflow inputs used in FieldError, in the snake_case
// of the JSON output. The others are those of Params (FieldTCloud,
// FieldMetallicity, FieldGamma, FieldMu, …).
const (
	FieldEnergyRate    = "energy_rate"
	FieldMassRate      = "mass_rate"
	FieldSFR           = "sfr"
	FieldEnergyLoading = "energy_loading"
	FieldMassLoading   = "mass_loading"
	FieldWindRadius    = "injection_radius"
)

// ErrConflict reports inputs that exclude each other.
var ErrConflict = errors.New("conflicting inputs")

// Accepted ranges of the outflow inputs. Like those of Params they catch
// typos and unit mistakes, not physics: starburst and AGN outflows have Ė ~
// 10⁴⁰–10⁴⁵ erg s⁻¹ and R ~ 0.1–0.5 kpc (from memory); loadings above 10
// (α) or 100 (β) are not in use.
var windFieldRanges = map[string]fieldRange{
	FieldEnergyRate:    {1e30, 1e50, false, 1, " erg s⁻¹"},
	FieldMassRate:      {1e15, 1e32, false, 1, " g s⁻¹"},
	FieldSFR:           {1e-6 * float64(SolarMassPerYear), 1e5 * float64(SolarMassPerYear), false, 1 / float64(SolarMassPerYear), " M☉ yr⁻¹"},
	FieldEnergyLoading: {0, 10, true, 1, ""},
	FieldMassLoading:   {0, 100, true, 1, ""},
	FieldWindRadius:    {1e-3 * float64(Parsec), 1e6 * float64(Parsec), false, 1 / float64(Parsec), " pc"},
}

// CheckWindField checks a value given explicitly for an outflow input
// named by FieldEnergyRate, FieldMassRate, FieldSFR, FieldEnergyLoading,
// FieldMassLoading or FieldWindRadius (CGS), and otherwise defers to
// CheckField. It returns a *FieldError or nil.
func CheckWindField(field string, v float64) error {
	if r, ok := windFieldRanges[field]; ok {
		return r.check(field, v)
	}
	return CheckField(field, v)
}

// FiducialWind returns an illustrative outflow (cloudwind's choice, not a
// published set-up): SFR = 10 M☉ yr⁻¹ with α = β = 1, R = 300 pc (within
// the 0.1–0.5 kpc recalled as typical, from memory), clouds at
// T_cl = 10⁴ K and Z = 1 Z☉, and the default conventions. Its terminal
// speed is 976 km s⁻¹ and its temperature at R about 10⁷ K.
func FiducialWind() WindParams {
	return WindParams{SFR: 10 * SolarMassPerYear, EnergyLoading: 1, MassLoading: 1,
		Radius: 300 * Parsec, TCloud: 1e4, Metallicity: 1}
}

// WithDefaults returns p with every zero optional field set to its default.
func (p WindParams) WithDefaults() WindParams {
	q := p.cloudTemplate().WithDefaults()
	p.Gamma, p.Mu, p.Mixture, p.HydrogenFraction, p.TFloor, p.MixCooling = q.Gamma, q.Mu, q.Mixture, q.HydrogenFraction, q.TFloor, q.MixCooling
	return p
}

// cloudTemplate returns the Params of a cloud in this outflow with every
// input that does not depend on the radius; χ, M, P/k_B and r_cl are 0.
func (p WindParams) cloudTemplate() Params {
	return Params{TCloud: p.TCloud, Metallicity: p.Metallicity, Gamma: p.Gamma, Mu: p.Mu,
		Mixture: p.Mixture, HydrogenFraction: p.HydrogenFraction, TFloor: p.TFloor,
		HeatCapacity: p.HeatCapacity, DensityProduct: p.DensityProduct, MixCooling: p.MixCooling}
}

// Rates returns the injection rates Ė and Ṁ: as given, or from the
// star-formation rate,
//
//	Ė = α · SupernovaPowerPerSFR · SFR,   Ṁ = β · SFR,
//
// when SFR is set (typical [CC85] inputs, from memory; WindLoadingStatus).
func (p WindParams) Rates() (Power, MassRate) {
	if p.SFR != 0 {
		return Power(p.EnergyLoading * SupernovaPowerPerSFR * float64(p.SFR)), MassRate(p.MassLoading * float64(p.SFR))
	}
	return p.EnergyRate, p.MassRate
}

// Validate checks every field of p (after defaults) and returns a
// *FieldError naming the first invalid one, or nil. Giving the rates and
// the star-formation inputs together is an error wrapping ErrConflict. The
// wind must be hotter than the clouds at its centre, and its central
// temperature (γ−1) μ m_p Ė/(γ k_B Ṁ) must not exceed MaxTHot.
func (p WindParams) Validate() error {
	sfrMode := p.SFR != 0 || p.EnergyLoading != 0 || p.MassLoading != 0
	rateMode := p.EnergyRate != 0 || p.MassRate != 0
	energyField := FieldEnergyRate
	type fieldValue struct {
		field string
		v     float64
	}
	var checks []fieldValue
	switch {
	case sfrMode && rateMode:
		return &FieldError{FieldSFR, float64(p.SFR), "give either the injection rates Ė and Ṁ or the star-formation rate with the loadings α and β, not both", ErrConflict}
	case sfrMode:
		energyField = FieldEnergyLoading
		checks = []fieldValue{{FieldSFR, float64(p.SFR)}, {FieldEnergyLoading, p.EnergyLoading}, {FieldMassLoading, p.MassLoading}}
	default:
		checks = []fieldValue{{FieldEnergyRate, float64(p.EnergyRate)}, {FieldMassRate, float64(p.MassRate)}}
	}
	checks = append(checks, fieldValue{FieldWindRadius, float64(p.Radius)})
	for _, c := range checks {
		if err := CheckWindField(c.field, c.v); err != nil {
			return err
		}
	}
	// The cloud inputs and conventions, in the words of Params.Validate; χ,
	// M, P/k_B and r_cl get harmless stand-ins, since they come from the wind.
	c := p.cloudTemplate()
	c.Chi, c.Mach, c.Pressure, c.RCloud = 2, 1, 1, Parsec
	if err := c.Validate(); err != nil {
		return err
	}
	q := p.WithDefaults()
	eDot, mDot := q.Rates()
	t0 := windCentralTemperature(float64(eDot), float64(mDot), q.Gamma, q.Mu)
	if !(t0 <= MaxTHot) {
		v := float64(p.EnergyRate)
		if sfrMode {
			v = p.EnergyLoading
		}
		return &FieldError{energyField, v, fmt.Sprintf("the wind's central temperature (γ−1) μ m_p Ė/(γ k_B Ṁ) = %s K exceeds %s K", num3(t0), num(MaxTHot)), ErrOutOfBounds}
	}
	if !(t0 > float64(q.TCloud)) {
		return &FieldError{FieldTCloud, float64(q.TCloud), fmt.Sprintf("the wind is nowhere hotter than the clouds: its central temperature %s K is not above T_cl = %s K", num3(t0), num3(float64(q.TCloud))), ErrOutOfBounds}
	}
	return nil
}

// windCentralTemperature returns T(0) = μ m_p c_s(0)²/(γ k_B) with
// c_s(0)² = (γ−1) Ė/Ṁ, Bernoulli's constant at M = 0 (derived from
// v²/2 + c_s²/(γ−1) = Ė/Ṁ of [CC85]).
func windCentralTemperature(eDot, mDot, gamma, mu float64) float64 {
	cs2 := (gamma - 1) * eDot / mDot
	return mu * float64(ProtonMass) * cs2 / (gamma * Boltzmann)
}

// TerminalSpeed returns the terminal speed of an adiabatic outflow with
// energy and mass injection rates eDot and mDot,
//
//	v_∞ = (2Ė/Ṁ)^{1/2},
//
// Bernoulli's constant v²/2 + c_s²/(γ−1) = Ė/Ṁ at c_s = 0 [CC85] (the
// relation from memory, the limit derived).
//
// Special cases are:
//
//	TerminalSpeed(Ė, 0) = +Inf
//	TerminalSpeed(Ė < 0, Ṁ) = NaN
func TerminalSpeed(eDot Power, mDot MassRate) Velocity {
	return Velocity(math.Sqrt(2 * float64(eDot) / float64(mDot)))
}

// cc85 holds the exponents of the Chevalier & Clegg relations for one γ.
type cc85 struct {
	gamma float64
	a, b  float64 // (3γ+1)/(5γ+1) and (γ+1)/(2(5γ+1)), the inside exponents
	c     float64 // (γ+1)/(2(γ−1)), the outside exponent of the second factor
	e     float64 // 2/(γ−1), the outside exponent of M; also k in v = v_∞ M/(M² + k)^{1/2}
	cIn   float64 // a ln(1+3γ) + b ln(2/(1+γ)), the M → 0 offset of F
	cOut  float64 // c ln((γ−1)/(γ+1)), the M → ∞ offset of G
}

func newCC85(gamma float64) cc85 {
	g := cc85{gamma: gamma}
	g.a = (3*gamma + 1) / (5*gamma + 1)
	g.b = (gamma + 1) / (2 * (5*gamma + 1))
	g.c = (gamma + 1) / (2 * (gamma - 1))
	g.e = 2 / (gamma - 1)
	g.cIn = g.a*math.Log(1+3*gamma) + g.b*math.Log(2/(1+gamma))
	g.cOut = g.c * math.Log((gamma-1)/(gamma+1))
	return g
}

// insideSwitch is the ln M below which F is evaluated in its asymptotic
// form, where M⁻² would overflow expm1 long before (x < −354).
const insideSwitch = -20.0

// logInside returns F(x) − x = ln(r/(R M)) on the subsonic branch, x = ln M ≤ 0.
func (g *cc85) logInside(x float64) float64 {
	if x < insideSwitch {
		e2 := math.Exp(2 * x)
		return g.cIn - g.a*math.Log1p(3*g.gamma*e2) + g.b*math.Log1p(0.5*(g.gamma-1)*e2)
	}
	return g.insideF(x) - x
}

// insideF returns F(x) = ln(r/R) on the subsonic branch, x = ln M ≤ 0.
// In the expm1 form F(0) = 0 exactly.
func (g *cc85) insideF(x float64) float64 {
	if x < insideSwitch {
		return x + g.logInside(x)
	}
	u := math.Expm1(-2 * x) // M⁻² − 1 ≥ 0
	return -g.a*math.Log1p(u/(1+3*g.gamma)) + g.b*math.Log1p(2*u/(1+g.gamma))
}

// outsideG returns G(x) = 2 ln(r/R) on the supersonic branch, x = ln M ≥ 0.
// G(0) = 0 exactly; G(+Inf) = +Inf.
func (g *cc85) outsideG(x float64) float64 {
	u := math.Expm1(-2 * x) // M⁻² − 1 ∈ (−1, 0]
	return g.e*x + g.c*math.Log1p(2*u/(1+g.gamma))
}

// Tolerance and budget of the Mach-number solve: 10⁻¹⁵ in ln M is a
// relative 10⁻¹⁵ in M; Brent needs ~10 evaluations on these brackets.
const (
	machTol     = 1e-15
	machMaxIter = 200
)

// logMach returns x = ln M at r/R = rho: the subsonic root inside, the
// supersonic one outside.
func (g *cc85) logMach(rho float64) float64 {
	switch {
	case math.IsNaN(rho) || rho < 0:
		return math.NaN()
	case rho == 0:
		return math.Inf(-1)
	case rho == 1:
		return 0
	case math.IsInf(rho, 1):
		return math.Inf(1)
	}
	lr := math.Log(rho)
	var x float64
	var err error
	// The bounds below hold in exact arithmetic; the margin of 10⁻⁹ (1 + |bound|)
	// in ln M keeps them on the right side of the root despite rounding
	// (slopes F' ≈ 1 and G' ≈ 2/(γ−1) there turn it into a margin ≫ 1 ulp).
	if rho < 1 {
		// F(x) ≤ x + C_in (the dropped terms are ≤ 0 since a ≥ b), so F(x0) ≤ ln ρ at x0.
		x0 := math.Min(lr-g.cIn, 0)
		x0 -= 1e-9 * (1 - x0)
		f := func(x float64) float64 { return g.insideF(x) - lr }
		x, err = brentRoot(f, x0, 0, f(x0), -lr, machTol, machMaxIter)
	} else {
		// G(x) ≥ e x + c ln((γ−1)/(γ+1)) (the dropped term is ≥ it), so G(x1) ≥ 2 ln ρ at x1.
		x1 := (2*lr - g.cOut) / g.e
		x1 += 1e-9 * (1 + x1)
		f := func(x float64) float64 { return g.outsideG(x) - 2*lr }
		x, err = brentRoot(f, 0, x1, -2*lr, f(x1), machTol, machMaxIter)
	}
	if err != nil {
		// The brackets above are proven; brentRoot converges on them (root_test.go).
		panic("model: Chevalier & Clegg Mach number: " + err.Error())
	}
	return x
}

// CC85RadiusInside returns r/R at which the Chevalier & Clegg (1985) wind
// has Mach number mach on its subsonic branch inside the injection radius,
//
//	r/R = ((3γ + M⁻²)/(1 + 3γ))^{−(3γ+1)/(5γ+1)} ((γ − 1 + 2M⁻²)/(1 + γ))^{(γ+1)/(2(5γ+1))},
//
// [CC85] (the relation is from memory, no equation number read). Computed
// in logs, so it is exact at M = 1 and free of overflow as M → 0, where r/R
// → M e^{C_in} (derived).
//
// Special cases are:
//
//	CC85RadiusInside(0, γ) = 0
//	CC85RadiusInside(1, γ) = 1
//	CC85RadiusInside(M < 0 or M > 1 or NaN, γ) = NaN
//	CC85RadiusInside(M, γ ≤ 1 or NaN) = NaN
func CC85RadiusInside(mach, gamma float64) float64 {
	if !(gamma > 1) || math.IsInf(gamma, 1) || !(mach >= 0 && mach <= 1) {
		return math.NaN()
	}
	g := newCC85(gamma)
	return math.Exp(g.insideF(math.Log(mach)))
}

// CC85RadiusOutside returns r/R at which the Chevalier & Clegg (1985) wind
// has Mach number mach on its supersonic branch outside the injection
// radius, from
//
//	(r/R)² = M^{2/(γ−1)} ((γ − 1 + 2M⁻²)/(1 + γ))^{(γ+1)/(2(γ−1))},
//
// [CC85] (the relation is from memory, no equation number read). Computed
// in logs, so it is exact at M = 1 and free of overflow for large M.
//
// Special cases are:
//
//	CC85RadiusOutside(1, γ) = 1
//	CC85RadiusOutside(+Inf, γ) = +Inf
//	CC85RadiusOutside(M < 1 or NaN, γ) = NaN
//	CC85RadiusOutside(M, γ ≤ 1 or NaN) = NaN
func CC85RadiusOutside(mach, gamma float64) float64 {
	if !(gamma > 1) || math.IsInf(gamma, 1) || !(mach >= 1) {
		return math.NaN()
	}
	g := newCC85(gamma)
	return math.Exp(0.5 * g.outsideG(math.Log(mach)))
}

// CC85Mach returns the Mach number M of the Chevalier & Clegg (1985) wind
// at r/R = rOverR, the root of
//
//	CC85RadiusInside(M, γ) = r/R  (M < 1, r < R),   CC85RadiusOutside(M, γ) = r/R  (M > 1, r > R),
//
// the subsonic branch inside and the supersonic one outside [CC85]
// (relations from memory). It is found by Brent's
// method [Bre73] on ln M between bounds that bracket it (derived, see
// outflow.go), to a relative 10⁻¹⁵ in M (plus 2ε|ln M|); round trips
// through the relations return r/R to 2×10⁻¹⁴.
//
// Special cases are:
//
//	CC85Mach(0, γ) = 0
//	CC85Mach(1, γ) = 1
//	CC85Mach(+Inf, γ) = +Inf
//	CC85Mach(r < 0 or NaN, γ) = NaN
//	CC85Mach(r, γ ≤ 1 or NaN) = NaN
func CC85Mach(rOverR, gamma float64) float64 {
	if !(gamma > 1) || math.IsInf(gamma, 1) {
		return math.NaN()
	}
	g := newCC85(gamma)
	return math.Exp(g.logMach(rOverR))
}

// A Wind is a validated Chevalier & Clegg (1985) outflow, ready to be
// evaluated at any radius. Build it with NewWind.
type Wind struct {
	Params     WindParams  // the inputs, with defaults filled in
	EnergyRate Power       // Ė, as given or from the star-formation rate (Rates)
	MassRate   MassRate    // Ṁ, likewise
	VInf       Velocity    // terminal speed (2Ė/Ṁ)^{1/2}, TerminalSpeed
	TCentre    Temperature // temperature at r = 0, (γ−1) μ m_p Ė/(γ k_B Ṁ)
	TAtR       Temperature // temperature at R, where M = 1
	// RChiOne is the radius beyond which the wind is no hotter than the
	// clouds (χ ≤ 1): c_s(r) = v_∞ (M² + 2/(γ−1))^{-1/2} equals c_s,cl at
	// M² = v_∞²/c_s,cl² − 2/(γ−1) (derived). No criterion applies beyond it.
	RChiOne Length

	g cc85
}

// NewWind validates p and returns its Wind, or the *FieldError of
// p.Validate.
func NewWind(p WindParams) (Wind, error) {
	if err := p.Validate(); err != nil {
		return Wind{}, err
	}
	q := p.WithDefaults()
	w := Wind{Params: q, g: newCC85(q.Gamma)}
	w.EnergyRate, w.MassRate = q.Rates()
	w.VInf = TerminalSpeed(w.EnergyRate, w.MassRate)
	w.TCentre = Temperature(windCentralTemperature(float64(w.EnergyRate), float64(w.MassRate), q.Gamma, q.Mu))
	w.TAtR = w.At(q.Radius).T
	csCl := float64(SoundSpeed(q.TCloud, q.Mu, q.Gamma))
	vi := float64(w.VInf)
	m2 := vi*vi/(csCl*csCl) - w.g.e // > 0 since T(0) > T_cl (Validate)
	if m := math.Sqrt(m2); m < 1 {
		w.RChiOne = Length(CC85RadiusInside(m, q.Gamma) * float64(q.Radius))
	} else {
		w.RChiOne = Length(CC85RadiusOutside(m, q.Gamma) * float64(q.Radius))
	}
	return w, nil
}

// A WindPoint is the state of the outflow at one radius.
type WindPoint struct {
	R        Length        // radius r
	Mach     float64       // M = v/c_s
	V        Velocity      // wind speed v
	Cs       Velocity      // adiabatic sound speed c_s
	Rho      Density       // mass density ρ
	N        NumberDensity // total particle density ρ/(μ m_p)
	Pressure Pressure      // P/k_B = ρ c_s²/(γ k_B)
	T        Temperature   // μ m_p c_s²/(γ k_B)
	Chi      float64       // χ = T/T_cl, pressure equilibrium with one μ
	TFlow    Time          // flow time r/v (finite at r = 0: the limit)
}

// At returns the wind at radius r. With M from CC85Mach and Bernoulli's
// constant and mass conservation ([CC85]; relations from memory):
//
//	v = v_∞ M (M² + 2/(γ−1))^{-1/2},   c_s = v/M,
//	ρ v = Ṁ r/(4πR³) (r < R),   ρ v = Ṁ/(4πr²) (r ≥ R),
//	P = ρ c_s²/γ,   T = μ m_p c_s²/(γ k_B),   χ = T/T_cl.
//
// Special cases are:
//
//	At(0)    = the centre: M = 0, v = 0, finite ρ, T = TCentre
//	At(+Inf) = M = +Inf, v = v_∞, c_s = ρ = P = T = 0
//	At(r < 0 or NaN) = every number NaN
func (w *Wind) At(r Length) WindPoint {
	rr, bigR := float64(r), float64(w.Params.Radius)
	pt := WindPoint{R: r}
	if math.IsNaN(rr) || rr < 0 {
		nan := math.NaN()
		return WindPoint{r, nan, Velocity(nan), Velocity(nan), Density(nan), NumberDensity(nan), Pressure(nan), Temperature(nan), nan, Time(nan)}
	}
	g := &w.g
	vi, mdot := float64(w.VInf), float64(w.MassRate)
	rho := rr / bigR
	x := g.logMach(rho)
	var v, cs, dens, tflow float64
	if rho < 1 {
		mach := math.Exp(x)
		s := math.Sqrt(mach*mach + g.e)
		v, cs = vi*mach/s, vi/s
		q := rho / mach // r/(R M), finite as r → 0
		if x < insideSwitch {
			q = math.Exp(g.logInside(x))
		}
		tflow = bigR * q * s / vi                                // r/v
		dens = mdot / (4 * math.Pi * bigR * bigR) * tflow / bigR // ρ = Ṁ r/(4πR³ v)
		pt.Mach = mach
	} else {
		em := math.Exp(-x) // 1/M, 0 at r = +Inf
		s := math.Sqrt(1 + g.e*em*em)
		v, cs = vi/s, vi*em/s
		dens = mdot / (4 * math.Pi * v) / rr / rr // Ṁ/(4π r² v), without overflow
		tflow = rr / v
		pt.Mach = math.Exp(x)
	}
	mu, gamma := w.Params.Mu, w.Params.Gamma
	pt.V, pt.Cs, pt.Rho, pt.TFlow = Velocity(v), Velocity(cs), Density(dens), Time(tflow)
	pt.N = NumberDensity(dens / (mu * float64(ProtonMass)))
	pt.Pressure = Pressure(dens * cs * cs / (gamma * Boltzmann))
	pt.T = Temperature(mu * float64(ProtonMass) * cs * cs / (gamma * Boltzmann))
	pt.Chi = float64(pt.T) / float64(w.Params.TCloud)
	return pt
}

// Mach returns the wind's Mach number at radius r,
//
//	M(r) = CC85Mach(r/R, γ),
//
// [CC85] (from memory, WindStatus).
//
// Special cases are:
//
//	Mach(0) = 0, Mach(R) = 1, Mach(+Inf) = +Inf
//	Mach(r < 0 or NaN) = NaN
func (w *Wind) Mach(r Length) float64 {
	return math.Exp(w.g.logMach(float64(r) / float64(w.Params.Radius)))
}

// CoolingTime returns the wind's own cooling time at radius r,
//
//	t_cool = f n k_B T/(𝒩 Λ(T)),
//
// with the conventions of the wind's Params (f, 𝒩 = n_H² or n², the
// cooling floor), as State.TCoolHot for a cloud there (the definition of
// package doc, Conventions).
//
// Special cases are:
//
//	CoolingTime(r, nil) = +Inf (no cooling)
//	CoolingTime(r, cf) = +Inf where Λ(T) = 0 or T is below the floor
func (w *Wind) CoolingTime(r Length, cf CoolingFunction) Time {
	return w.coolingTime(w.At(r), cf)
}

func (w *Wind) coolingTime(pt WindPoint, cf CoolingFunction) Time {
	if cf == nil {
		return Time(math.Inf(1))
	}
	q := &w.Params
	var lam CoolingRate
	if q.TFloor == NoFloor || pt.T >= q.TFloor {
		lam = cf.Lambda(pt.T)
	}
	np := float64(pt.N)
	prod := np * np
	if q.DensityProduct == NH2 {
		nh := float64(HydrogenDensity(pt.Rho, q.HydrogenFraction))
		prod = nh * nh
	}
	return CoolingTime(q.HeatCapacity.Factor(), pt.N, pt.T, prod, lam)
}

// FlowTime returns the wind's flow time at radius r,
//
//	t_flow = r/v(r),
//
// the time over which the adiabatic solution must hold there (a
// definition; compare CoolingTime).
//
// Special cases are:
//
//	FlowTime(0) = R e^{C_in} (2/(γ−1))^{1/2}/v_∞, the limit r → 0 (derived; v ∝ r there)
//	FlowTime(+Inf) = +Inf
func (w *Wind) FlowTime(r Length) Time { return w.At(r).TFlow }

// coolingFlowSign is t_cool/(t_cool + t_flow) − 1/2: positive where the
// wind stays adiabatic, negative where it cools within a flow time, and
// finite even where t_cool = +Inf, so that Brent's method can use it.
func (w *Wind) coolingFlowSign(r float64, cf CoolingFunction) float64 {
	pt := w.At(Length(r))
	tc := float64(w.coolingTime(pt, cf))
	if math.IsInf(tc, 1) {
		return 0.5
	}
	return tc/(tc+float64(pt.TFlow)) - 0.5
}

// coolingCrossing returns the radius between lo and hi (lo < hi, sign
// positive at lo and ≤ 0 at hi) where t_cool = t_flow, by Brent's method
// on ln r.
func (w *Wind) coolingCrossing(cf CoolingFunction, lo, hi float64, fLo, fHi float64) Length {
	f := func(lr float64) float64 { return w.coolingFlowSign(math.Exp(lr), cf) }
	lr, err := brentRoot(f, math.Log(lo), math.Log(hi), fLo, fHi, 1e-12, 200)
	if err != nil && !errors.Is(err, ErrNoConvergence) {
		return Length(hi) // not bracketed after all (rounding at a flat crossing): the sample that cools
	}
	return Length(math.Exp(lr))
}

// Samples per decade of radius of CoolingRadius's search.
const coolingSamplesPerDecade = 32

// CoolingRadius returns the smallest radius r_cool in [lo, hi] at which
// the wind's own cooling time is no longer than its flow time,
//
//	t_cool(r_cool) = r_cool/v(r_cool),
//
// and whether there is one: past it the adiabatic solution is not
// self-consistent ([CC85]'s solution assumes no cooling; the
// comparison is cloudwind's test of that). The ratio is sampled 32 times per decade (at least 16
// intervals) and the first crossing refined by Brent's method on ln r
// [Bre73] to 10⁻¹² in ln r; a dip below and back within one sample
// interval is missed. It returns lo when the wind already cools there. It
// returns an error for a nil cf or a range that is not 0 < lo ≤ hi < +Inf.
func (w *Wind) CoolingRadius(cf CoolingFunction, lo, hi Length) (Length, bool, error) {
	if cf == nil {
		return 0, false, fmt.Errorf("cooling radius: no cooling function")
	}
	l, h := float64(lo), float64(hi)
	if !(l > 0 && l <= h && !math.IsInf(h, 1)) {
		return 0, false, fmt.Errorf("cooling radius: want 0 < lo ≤ hi < +Inf, got [%s, %s] cm", num(l), num(h))
	}
	n := max(16, int(math.Ceil(coolingSamplesPerDecade*math.Log10(h/l))))
	prevR, prev := l, w.coolingFlowSign(l, cf)
	if prev <= 0 {
		return lo, true, nil
	}
	for i := 1; i <= n; i++ {
		r := l * math.Pow(h/l, float64(i)/float64(n))
		if i == n {
			r = h
		}
		s := w.coolingFlowSign(r, cf)
		if s <= 0 {
			return w.coolingCrossing(cf, prevR, r, prev, s), true, nil
		}
		prevR, prev = r, s
	}
	return 0, false, nil
}

// CloudParams returns the Params of a cloud of radius rCl at rest at
// radius r in the wind, so that every criterion can be evaluated there
// with Evaluate:
//
//	χ = T(r)/T_cl,   M = M(r),   P/k_B = P(r)/k_B,
//
// pressure equilibrium with one μ (derived: P = n k_B T is the same in
// both phases), with T_cl, Z, γ, μ and the conventions of the wind. It returns
// them with the error of their Validate, wrapped with the radius
// (errors.As finds the *FieldError).
//
// Special cases are:
//
//	CloudParams(r ≥ RChiOne, …) = χ ≤ 1, and a *FieldError on FieldChi
//	CloudParams(0, …) = M = 0, and a *FieldError on FieldMach
func (w *Wind) CloudParams(r, rCl Length) (Params, error) {
	pt := w.At(r)
	p := w.cloudParams(pt, rCl)
	if err := p.Validate(); err != nil {
		return p, fmt.Errorf("cloud at r = %s R: %w", num3(float64(r/w.Params.Radius)), err)
	}
	return p, nil
}

func (w *Wind) cloudParams(pt WindPoint, rCl Length) Params {
	p := w.Params.cloudTemplate()
	p.Chi, p.Mach, p.Pressure, p.RCloud = pt.Chi, pt.Mach, pt.Pressure, rCl
	return p
}
