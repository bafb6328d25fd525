package model

import (
	"fmt"
	"math"
)

// State holds every quantity derived from Params and a cooling function.
// Each field names the function or formula that computes it. Times that do
// not exist (no cooling: Λ = 0) are +Inf.
type State struct {
	Params Params // the inputs, with defaults filled in

	THot Temperature // wind temperature, HotTemperature
	TMix Temperature // mixed-gas temperature (T_cl T_hot)^{1/2}, MixTemperature

	NCold, NHot, NMix    NumberDensity // total particle densities, ParticleDensity
	NHCold, NHHot, NHMix NumberDensity // hydrogen densities, HydrogenDensity
	RhoCold, RhoHot      Density       // mass densities, MassDensity
	RhoMix               Density       // (ρ_cl ρ_hot)^{1/2} [BF90]

	CsCold, CsHot Velocity // adiabatic sound speeds, SoundSpeed
	VWind         Velocity // M c_s,hot

	TCC         Time // cloud-crushing time, CloudCrushingTime
	TShear      Time // r_cl/v_w, ShearTime
	TSoundCold  Time // cloud sound-crossing time r_cl/c_s,cl
	TDrag       Time // χ r_cl/v_w, DragTime
	TCoolHot    Time // t_cool of the wind at T_hot, n_hot
	TCoolMix    Time // t_cool at T_mix, n_mix
	TCoolCold   Time // t_cool of the cloud at T_cl, n_cl
	TCoolMinMix Time // minimum isobaric t_cool over T ∈ [T_cl, T_hot]
	TMinMix     Temperature

	// The wind gas swept up in the cloud's leading bow shock (Li et al. 2020,
	// arXiv:1909.02632, abstract): for M > 1 the post-shock state of the
	// Rankine–Hugoniot jump, for M ≤ 1 the gas compressed isentropically to
	// stagnation ahead of the cloud (textbook relations, from memory; checks
	// derived). Shocked says which.
	Shocked      bool
	TShocked     Temperature
	NShocked     NumberDensity
	TCoolShocked Time

	LambdaHot, LambdaMix, LambdaCold CoolingRate // Λ at T_hot, T_mix, T_cl

	MassCold   Mass          // (4π/3) r_cl³ ρ_cl, CloudMass
	ColumnCold ColumnDensity // n_cl r_cl, CloudColumn
	LCoolCold  Length        // c_s,cl t_cool,X with X = Params.MixCooling, CoolingLength
	LShatter   Length        // min over T ∈ [T_cl, T_hot] of c_s t_cool at fixed P [McC18]
	TShatter   Temperature   // where that minimum lies
	VMix       Velocity      // MixingVelocity with α_v = 1 and t_cool,X, X = Params.MixCooling
	TGrow      Time          // GrowthTime with VMix
	Cautions   []Caution     // inputs outside the cooling function's range, physically absurd inputs, and similar

	nThermal int             // Cautions[:nThermal] do not depend on the Mach number or the radius
	cf       CoolingFunction // the cooling function derived with, for the Mach-dependent cooling times
	windMach float64         // the Mach number VWind and the shocked state were derived for
}

// A Caution is a warning about the inputs that does not make them invalid.
type Caution struct {
	Field   string // the Params field concerned (a Field… name), or "" for general
	Message string
}

// Derive computes the State of p with cooling function cf. It returns the
// error of p.Validate() when p is invalid, and an error when cf is nil.
func Derive(p Params, cf CoolingFunction) (State, error) {
	var s State
	err := s.derive(p, cf)
	return s, err
}

func (s *State) derive(p Params, cf CoolingFunction) error {
	if err := p.Validate(); err != nil {
		return err
	}
	if cf == nil {
		return fmt.Errorf("model: no cooling function")
	}
	q := p.WithDefaults()
	*s = State{Params: q, Cautions: s.Cautions[:0], cf: cf}
	f := q.HeatCapacity.Factor()

	s.THot = HotTemperature(q.TCloud, q.Chi, q.MuCold, q.MuHot)
	s.TMix = MixTemperature(q.TCloud, s.THot)
	s.NCold = ParticleDensity(q.Pressure, q.TCloud)
	s.NHot = ParticleDensity(q.Pressure, s.THot)
	s.NMix = ParticleDensity(q.Pressure, s.TMix)
	s.RhoCold = MassDensity(s.NCold, q.MuCold)
	s.RhoHot = MassDensity(s.NHot, q.MuHot)
	s.RhoMix = Density(math.Sqrt(float64(s.RhoCold) * float64(s.RhoHot)))
	x := q.HydrogenFraction
	s.NHCold = HydrogenDensity(s.RhoCold, x)
	s.NHHot = HydrogenDensity(s.RhoHot, x)
	s.NHMix = HydrogenDensity(s.RhoMix, x)

	s.CsCold = SoundSpeed(q.TCloud, q.MuCold, q.Gamma)
	s.CsHot = SoundSpeed(s.THot, q.MuHot, q.Gamma)

	s.LambdaHot = s.lambda(cf, s.THot)
	s.LambdaMix = s.lambda(cf, s.TMix)
	s.LambdaCold = s.lambda(cf, q.TCloud)
	s.TCoolHot = CoolingTime(f, s.NHot, s.THot, s.densityProduct(s.NHot, s.NHHot), s.LambdaHot)
	s.TCoolMix = CoolingTime(f, s.NMix, s.TMix, s.densityProduct(s.NMix, s.NHMix), s.LambdaMix)
	s.TCoolCold = CoolingTime(f, s.NCold, q.TCloud, s.densityProduct(s.NCold, s.NHCold), s.LambdaCold)

	s.minimaAlongIsobar(cf, f)
	s.LCoolCold = CoolingLength(s.CsCold, s.CoolingTime(q.MixCooling))
	s.rangeCautions(cf)
	if q.TCloud > MaxColdCloud {
		s.Cautions = append(s.Cautions, Caution{FieldTCloud, fmt.Sprintf("T_cl = %s K is not cold gas: the criteria compare a cloud near 10⁴ K with a hotter wind (cloudwind's limit for this caution: %s K)", num3(float64(q.TCloud)), num3(MaxColdCloud))})
	}
	s.nThermal = len(s.Cautions)
	s.deriveFlow()
	return nil
}

// deriveFlow computes what depends on the Mach number and the radius. No
// cooling time depends on either, so sweeps over them need only this.
func (s *State) deriveFlow() {
	s.deriveWind()
	s.deriveRadius()
}

// deriveWind computes what depends on the Mach number but not on the
// radius: the wind speed and the swept-up gas.
func (s *State) deriveWind() {
	q := &s.Params
	s.VWind = Velocity(q.Mach * float64(s.CsHot))
	s.deriveShocked()
	s.windMach = q.Mach
}

// deriveRadius computes what depends on the radius, with the wind of
// deriveWind, and the flow cautions.
func (s *State) deriveRadius() {
	q := &s.Params
	s.TCC = CloudCrushingTime(q.RCloud, q.Chi, s.VWind)
	s.TShear = ShearTime(q.RCloud, s.VWind)
	s.TSoundCold = SoundCrossingTime(q.RCloud, s.CsCold)
	s.TDrag = DragTime(q.RCloud, q.Chi, s.VWind)
	s.MassCold = CloudMass(q.RCloud, s.RhoCold)
	s.ColumnCold = CloudColumn(s.NCold, q.RCloud)
	s.VMix = MixingVelocity(1, s.CsCold, s.CoolingTime(q.MixCooling), s.TSoundCold)
	s.TGrow = GrowthTime(q.RCloud, q.Chi, s.VMix)
	s.flowCautions()
}

// ShockJump returns the density, pressure and temperature ratios across a
// normal shock of Mach number m in gas of adiabatic index γ (the
// Rankine–Hugoniot jump conditions; textbook, formulas from memory):
//
//	ρ₂/ρ₁ = (γ+1)M²/((γ−1)M² + 2),  P₂/P₁ = (2γM² − (γ−1))/(γ+1),
//	T₂/T₁ = (P₂/P₁)/(ρ₂/ρ₁).
//
// Special cases are:
//
//	ShockJump(1, γ) = 1, 1, 1
//	ShockJump(m < 1, γ) = the same formulas (an expansion shock, unphysical)
func ShockJump(m, gamma float64) (rho, p, t float64) {
	m2 := m * m
	rho = (gamma + 1) * m2 / ((gamma-1)*m2 + 2)
	p = (2*gamma*m2 - (gamma - 1)) / (gamma + 1)
	return rho, p, p / rho
}

// Stagnation returns the temperature and density ratios of gas brought to
// rest isentropically from Mach number m (textbook, from memory):
//
//	T₀/T = 1 + (γ−1)M²/2,  ρ₀/ρ = (T₀/T)^{1/(γ−1)}.
func Stagnation(m, gamma float64) (t, rho float64) {
	t = 1 + (gamma-1)*m*m/2
	return t, math.Pow(t, 1/(gamma-1))
}

// deriveShocked computes the state and cooling time of the wind gas swept
// up ahead of the cloud: the post-shock state for M > 1, the stagnation
// state for M ≤ 1. It depends on the Mach number, so it belongs to the flow
// part of the state (the sweep fast path re-derives it when the Mach number
// changes).
func (s *State) deriveShocked() {
	q := &s.Params
	var rhoR, tR float64
	if s.Shocked = q.Mach > 1; s.Shocked {
		rhoR, _, tR = ShockJump(q.Mach, q.Gamma)
	} else {
		tR, rhoR = Stagnation(q.Mach, q.Gamma)
	}
	s.TShocked = Temperature(float64(s.THot) * tR)
	s.NShocked = NumberDensity(float64(s.NHot) * rhoR)
	nH := NumberDensity(float64(s.NHHot) * rhoR)
	lam := CoolingRate(0)
	if s.cf != nil {
		lam = s.lambda(s.cf, s.TShocked)
	}
	s.TCoolShocked = CoolingTime(q.HeatCapacity.Factor(), s.NShocked, s.TShocked, s.densityProduct(s.NShocked, nH), lam)
}

// GrowthTimeWith returns t_grow of s (α_v = 1, A = 4π r², as State.TGrow)
// with the cold-side cooling time of kind k instead of Params.MixCooling:
// the sensitivity of the growth model to that one choice.
func (s *State) GrowthTimeWith(k CoolingTimeKind) Time {
	return GrowthTime(s.Params.RCloud, s.Params.Chi, MixingVelocity(1, s.CsCold, s.CoolingTime(k), s.TSoundCold))
}

// MixCoolingKinds lists the cooling times the growth model can use, the
// default first.
func MixCoolingKinds() []CoolingTimeKind {
	return []CoolingTimeKind{CoolMinMix, CoolCold, CoolMix, CoolHot}
}

// Limits of the cautions for physically absurd inputs. They are
// cloudwind's choice (common practice, no source): inputs beyond them are
// valid numbers, but no published criterion was meant for them.
const (
	// RelativisticWind is the wind speed, as a fraction of c, above which
	// the Newtonian formulas of every criterion are in doubt.
	RelativisticWind = 0.1
	// MaxCloudRadius is the cloud radius above which a "cloud" is larger
	// than a galaxy's halo (~100 kpc): most likely a unit mistake.
	MaxCloudRadius = 100 * Kiloparsec
	// MaxColdCloud is the cloud temperature above which the cloud is not
	// cold gas: the criteria concern clouds near 10⁴ K.
	MaxColdCloud = 1e6
)

// flowCautions replaces the cautions that depend on the Mach number or the
// radius: a wind near or above the speed of light, a cloud larger than a
// halo. It runs at every point of a sweep, so its messages are joined
// without fmt.
func (s *State) flowCautions() {
	s.Cautions = s.Cautions[:s.nThermal]
	switch beta := float64(s.VWind) / SpeedOfLight; {
	case beta >= 1:
		s.Cautions = append(s.Cautions, Caution{FieldMach, "the wind speed M c_s,hot = " + num3(beta) + " c exceeds the speed of light: these inputs are unphysical, and every formula here is Newtonian"})
	case beta >= RelativisticWind:
		s.Cautions = append(s.Cautions, Caution{FieldMach, "the wind speed M c_s,hot = " + num3(beta) + " c is a noticeable fraction of the speed of light; every formula here is Newtonian"})
	}
	// Li et al. 2020's "failed pressure confinement" regime (arXiv:1909.02632,
	// abstract: the ambient hot gas cools too fast to confine the cloud).
	if s.TCoolHot < s.TCC {
		// A fixed text (the ratio is the derived t_cool,hot/t_cc): sweeps
		// rebuild this caution at every radius, and formatting a number
		// there cost more than the criteria.
		s.Cautions = append(s.Cautions, Caution{FieldChi, "the wind cools faster than the cloud is crushed (t_cool,hot < t_cc; see t_cool,hot/t_cc): Li et al. 2020's failed-pressure-confinement regime, outside every criterion's wind-tunnel picture"})
	}
	if s.Params.RCloud > MaxCloudRadius {
		s.Cautions = append(s.Cautions, Caution{FieldRCloud, "r_cl = " + num3(float64(s.Params.RCloud/Kiloparsec)) + " kpc is larger than a galaxy's halo (~100 kpc): check the unit"})
	}
}

// lambda returns Λ(t) with the cooling floor applied: Λ = 0 below T_floor.
func (s *State) lambda(cf CoolingFunction, t Temperature) CoolingRate {
	if t < s.Params.TFloor {
		return 0
	}
	return cf.Lambda(t)
}

// densityProduct returns 𝒩 for gas of particle density n and hydrogen
// density nH under the chosen convention.
func (s *State) densityProduct(n, nH NumberDensity) float64 {
	switch s.Params.DensityProduct {
	case N2:
		return float64(n) * float64(n)
	case NeNi:
		return float64(nH) * float64(nH) * s.eiPerH2()
	}
	return float64(nH) * float64(nH)
}

// eiPerH2 is n_e n_i/n_H² for the state's composition (fully ionised).
func (s *State) eiPerH2() float64 {
	q := &s.Params
	m := q.Mixture
	yOverX := m.Y / m.X
	if q.HydrogenFraction != m.X { // the mixture's Y:Z split for another X
		yOverX = (1 - q.HydrogenFraction) * m.Y / (m.Y + m.Z) / q.HydrogenFraction
	}
	return electronIonPerH2(q.HydrogenFraction, yOverX)
}

// minimaAlongIsobar finds the minimum cooling time and the shattering length
// over T ∈ [T_cl, T_hot] at the common pressure.
//
// At fixed P/k_B, t_cool(T) = f k_B T²/(ξ(T) (P/k_B) Λ(T)) with ξ ≡ 𝒩/n²
// (derived from t_cool = f n k_B T/(𝒩 Λ) with n = P/(k_B T)). ξ = 1 under
// N2 and (X μ m_p/m_H)² under NH2. With μ_cl ≠ μ_hot, μ along the mixing
// line is interpolated as a power law in T between the phases, μ(T) = μ_cl
// (T/T_cl)^δ with δ = ln(μ_hot/μ_cl)/ln(T_hot/T_cl), which gives (μ_cl
// μ_hot)^{1/2} at T_mix as ρ_mix = (ρ_cl ρ_hot)^{1/2} requires (a modelling
// choice of cloudwind). Then t_cool ∝ T^{2−2δ}/Λ under NH2 and c_s t_cool ∝
// T^{2.5−2.5δ}/Λ, power laws in T, so the minima are found exactly on
// piecewise power laws.
func (s *State) minimaAlongIsobar(cf CoolingFunction, f float64) {
	q := &s.Params
	lo, hi := q.TCloud, s.THot
	delta := 0.0
	if q.MuCold != q.MuHot {
		delta = math.Log(q.MuHot/q.MuCold) / math.Log(float64(hi)/float64(lo))
	}
	mu := func(t Temperature) float64 { return q.MuCold * math.Pow(float64(t)/float64(lo), delta) }
	ei := s.eiPerH2()
	xi := func(t Temperature) float64 {
		if q.DensityProduct == N2 {
			return 1
		}
		r := q.HydrogenFraction * mu(t) * float64(ProtonMass) / float64(HydrogenAtomMass)
		if q.DensityProduct == NeNi {
			return r * r * ei // 𝒩 = n_e n_i = n_H² (n_e n_i/n_H²)
		}
		return r * r
	}
	tcool := func(m isobarPoint) Time {
		if m.Lambda <= 0 {
			return Time(math.Inf(1))
		}
		t := float64(m.T)
		return Time(f * Boltzmann * t * t / (xi(m.T) * float64(q.Pressure) * float64(m.Lambda)))
	}
	eT := 2.0
	if q.DensityProduct != N2 {
		eT -= 2 * delta
	}
	eL := eT + 0.5 - 0.5*delta
	// T_cl ≥ T_floor (Validate), so the floor does not reach [T_cl, T_hot].
	m0, m1 := minLogRatio(cf, lo, hi, s.LambdaCold, s.LambdaHot, eT, eL)
	if m0.ok {
		s.TMinMix, s.TCoolMinMix = m0.T, tcool(m0)
	} else {
		s.TMinMix, s.TCoolMinMix = Temperature(math.NaN()), Time(math.Inf(1))
	}
	if m1.ok {
		s.TShatter = m1.T
		s.LShatter = CoolingLength(SoundSpeed(m1.T, mu(m1.T), q.Gamma), tcool(m1))
	} else {
		s.TShatter, s.LShatter = Temperature(math.NaN()), Length(math.Inf(1))
	}
}

// rangeCautions reports the temperatures of interest that lie outside the
// cooling function's valid range.
func (s *State) rangeCautions(cf CoolingFunction) {
	r, ok := cf.(RangedCooling)
	if !ok {
		return
	}
	lo, hi := r.ValidRange()
	for _, c := range []struct {
		field, name string
		t           Temperature
	}{
		{FieldTCloud, "T_cl", s.Params.TCloud},
		{FieldChi, "T_mix", s.TMix},
		{FieldChi, "T_hot", s.THot},
	} {
		if c.t < lo {
			s.Cautions = append(s.Cautions, Caution{c.field, fmt.Sprintf("%s = %s K is below the cooling table (from %s K): Λ = 0 there", c.name, num3(float64(c.t)), num3(float64(lo)))})
		} else if c.t > hi {
			s.Cautions = append(s.Cautions, Caution{c.field, fmt.Sprintf("%s = %s K is above the cooling table (to %s K): Λ is extrapolated there", c.name, num3(float64(c.t)), num3(float64(hi)))})
		}
	}
}
