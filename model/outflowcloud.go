package model

import (
	"fmt"
	"math"
	"sort"
)

// This file carries one cloud outward through a Chevalier & Clegg wind:
// the growth and entrainment ODE of Evolve with the thermal state taken at
// the cloud's current radius r(t). Inside, the
// state is y = (m/m0, v/v_∞, r/R) against τ = t v_∞/R.
//
// At each evaluation the wind at r gives v_w, c_s,hot, ρ_hot, T_hot and
// P; pressure equilibrium at T_cl gives ρ_cl = μ m_p (P/k_B)/T_cl, so the
// cloud's radius follows both its mass and the pressure,
// r_cl = (3m/(4πρ_cl))^{1/3}: a cloud of fixed mass swells as the wind's
// pressure falls (outside R, P ∝ r^{-10/3} for r ≫ R gives r_cl ∝ r^{10/9},
// derived from ρ ∝ r^{-2} and T ∝ r^{-4/3}). The cooling times the
// growth model and the criterion need are recomputed there: Λ at T_hot
// and T_mix, Λ(T_cl) once, and the minimum along the mixing isobar, whose
// temperature is reused while it stays inside [T_cl, T_hot] (the minimum
// over a range is the minimum over any sub-range that contains it).

// Defaults of CarrySettings (cloudwind's choices).
const (
	// DefaultCarryEnd is REnd in units of R: the outer end of the profile.
	DefaultCarryEnd = 100.0
	// DefaultCarryTimeFactor sets TMax = 100 REnd/v_∞: a cloud that has not
	// reached REnd by then moved on average at under 1% of the terminal speed.
	DefaultCarryTimeFactor = 100.0
	// MaxLaunchSpeed is the largest launch speed accepted, in units of v_∞.
	MaxLaunchSpeed = 100.0
)

// Field names of CarrySettings used in FieldError.
const (
	FieldLaunchRadius = "launch_radius"
	FieldLaunchSpeed  = "launch_speed"
	FieldEndRadius    = "end_radius"
	FieldMaxTime      = "max_time"
)

// CarrySettings are the inputs of Wind.Carry. A zero field means "use the
// default" stated on it.
type CarrySettings struct {
	R0   Length   // launch radius r0; required: > 0 and below Wind.RChiOne
	V0   Velocity // launch speed in the galaxy's frame, ≥ 0; default 0 (at rest)
	REnd Length   // the run stops where the cloud reaches it; default 100 R
	TMax Time     // the run stops at this time after launch; default 100 REnd/v_∞
	// ODE holds α_v, f_A, κ, C_D, v_A/v_w (a constant fraction of the local
	// wind speed), the Mach factor, the branch and its width, the terms
	// switched off and the numerical controls, with Evolve's defaults and
	// meanings. Its V0 and TEnd are not used (V0 and TMax are), and only
	// AreaSphere is supported: A = f_A 4π r_cl².
	ODE EvolveSettings
}

// WithDefaults returns s with every zero field set to its default for
// wind w.
func (s CarrySettings) WithDefaults(w *Wind) CarrySettings {
	if s.REnd == 0 {
		s.REnd = DefaultCarryEnd * w.Params.Radius
	}
	if s.TMax == 0 {
		s.TMax = Time(DefaultCarryTimeFactor * float64(s.REnd) / float64(w.VInf))
	}
	s.ODE = s.ODE.WithDefaults()
	return s
}

// Validate checks s (after defaults) for wind w and returns a *FieldError
// naming the first invalid setting, or nil.
func (s CarrySettings) Validate(w *Wind) error {
	q := s.WithDefaults(w)
	bad := func(field string, v float64, reason string) error {
		return &FieldError{field, v, fmt.Sprintf("%s (got %s)", reason, num(v)), ErrOutOfBounds}
	}
	r0, chiOne := float64(q.R0), float64(w.RChiOne)
	switch {
	case math.IsNaN(r0) || math.IsInf(r0, 0):
		return &FieldError{FieldLaunchRadius, r0, fmt.Sprintf("must be a finite number (got %s)", num(r0)), ErrNotFinite}
	case !(r0 > 0):
		return bad(FieldLaunchRadius, r0, "must be greater than 0 cm")
	case !(r0 < chiOne):
		return bad(FieldLaunchRadius, r0, fmt.Sprintf("must lie inside %s cm, where the wind is still hotter than the cloud", num(chiOne)))
	case !(q.V0 >= 0 && float64(q.V0) <= MaxLaunchSpeed*float64(w.VInf)):
		return bad(FieldLaunchSpeed, float64(q.V0), fmt.Sprintf("must be a finite speed from 0 to %g v_∞ = %s cm s⁻¹", MaxLaunchSpeed, num(MaxLaunchSpeed*float64(w.VInf))))
	case !(q.REnd > q.R0) || math.IsInf(float64(q.REnd), 1):
		return bad(FieldEndRadius, float64(q.REnd), fmt.Sprintf("must be a finite radius beyond the launch radius %s cm", num(r0)))
	case !(q.TMax > 0) || math.IsInf(float64(q.TMax), 1):
		return bad(FieldMaxTime, float64(q.TMax), "must be a finite time greater than 0 s")
	}
	if err := q.ODE.Validate(); err != nil {
		return err
	}
	if q.ODE.Area != AreaSphere {
		return &FieldError{"area", float64(q.ODE.Area), "a carried cloud supports the sphere area model only", ErrUnknown}
	}
	return nil
}

// CarryStop says why a carried cloud's run ended.
type CarryStop int

const (
	StopReached   CarryStop = iota // the cloud reached REnd
	StopColdWind                   // it reached RChiOne (before REnd), where the wind is no hotter than the cloud
	StopDestroyed                  // its mass fell to DestroyedMass m0
	StopMassCap                    // its mass reached MassCap m0
	StopTime                       // TMax passed first
)

var carryStopNames = [...]string{"reached", "cold-wind", "destroyed", "mass-cap", "time-cap"}

// String returns "reached", "cold-wind", "destroyed", "mass-cap" or
// "time-cap".
func (s CarryStop) String() string { return evolveEnumName(int(s), carryStopNames[:], "CarryStop") }

// A CarriedPoint is the state of a carried cloud at one radius.
type CarriedPoint struct {
	R     Length   // radius of the cloud's centre
	T     Time     // time since launch
	M     float64  // m/m0
	V     Velocity // cloud speed in the galaxy's frame
	VWind Velocity // wind speed at R
	Chi   float64  // χ = T_wind/T_cl at R
	RCl   Length   // cloud radius (3m/(4πρ_cl))^{1/3}, ρ_cl from the local pressure
	S     float64  // branch weight: 1 grows, 0 is destroyed
	MDot  MassRate // dm/dt
}

// A CarriedCloud is the path of one cloud carried outward through a
// Chevalier & Clegg wind, sampled at the integrator's accepted steps,
// launch included (R, T, … have one entry per sample).
type CarriedCloud struct {
	R     []Length   // radius r of the cloud
	T     []Time     // time since launch
	M     []float64  // m/m0
	V     []Velocity // cloud speed
	VWind []Velocity // wind speed v_w(r)
	Chi   []float64  // χ(r) = T_wind(r)/T_cl
	RCl   []Length   // cloud radius
	S     []float64  // branch weight S ∈ [0, 1]
	MDot  []MassRate // dm/dt

	Launch   Params        // the wind-tunnel problem at launch: CloudParams(r0, r_cl,0)
	M0       Mass          // launch mass (4π/3) r_cl,0³ ρ_cl(r0)
	TCC0     Time          // cloud-crushing time at launch, χ(r0)^{1/2} r_cl,0/v_w(r0)
	Settings CarrySettings // the settings, with defaults filled in
	Stop     CarryStop     // why the run ended
	RStop    Length        // where it ended: REnd or RChiOne when reached, else the last radius

	// Events, located inside a step on the cubic Hermite interpolant of the
	// step; NaN when they did not happen before the run ended.
	REntrain Length // first radius where |v_w − v| ≤ EntrainedSpeed v_w; r0 if so at launch
	TEntrain Time
	RDouble  Length // first radius where m = DoubledMass m0
	TDouble  Time
	RDestroy Length // where m = DestroyedMass m0
	TDestroy Time

	// RWindCools is the first radius on the path where the wind's own
	// cooling time falls to its flow time (Wind.CoolingRadius from r0 to
	// RStop); past it the adiabatic wind is not self-consistent. WindCools
	// reports whether there is one.
	RWindCools Length
	WindCools  bool

	Steps, Rejected, Evals int // accepted and rejected steps; right-hand-side evaluations

	// Dimensionless samples for interpolation: τ = t v_∞/R, ξ = r/R, μ =
	// m/m0, u = v/v_∞, and dμ/dτ, du/dτ.
	tau, xi, mu, u, dmu, du []float64
	ode                     *carryODE
}

// carryLocal is everything the right-hand side computes at one state.
type carryLocal struct {
	y        [3]float64 // the state it was computed at
	pt       WindPoint
	rCl      float64 // cm
	s        float64 // branch weight
	mdot     float64 // dm/dt, g s⁻¹
	dvdt     float64 // cm s⁻²
	ratio    float64 // the criterion's τ_cool/τ_dyn; +Inf without cooling
	thr      float64 // its threshold α (χ/100)^β
	vmix     float64 // cm s⁻¹
	tcc      float64 // s
	tcoolMix float64 // the growth model's cooling time, s
}

// carryODE is the right-hand side of the carried cloud.
type carryODE struct {
	w   *Wind
	cf  CoolingFunction
	c   *Criterion
	set EvolveSettings // defaulted

	bigR, vInf, tUnit, m0 float64 // R, v_∞, R/v_∞, m0 (CGS)
	tCl, csCl, muMp       float64 // T_cl, c_s,cl, μ m_p
	f, xH, xiIso          float64 // heat-capacity factor, X, ξ = 𝒩/n² on the isobar
	lamCold               float64 // Λ(T_cl) with the floor
	mixKind               CoolingTimeKind
	growOn, lossOn        bool
	dragOn, smooth        bool
	dragBoost             float64 // 1 + (v_A/v_w)²
	// general: the criterion is applied through State.Evaluate at the
	// local state (shocked-gas and growth-time cooling, the three-outcome
	// test, the turbulent crushing time), not through the fast path below.
	general bool
	st      State // scratch state of the general path

	// The minimum of T²/Λ on the isobar, found over [T_cl, mmHi]; valid
	// for any T_hot in [mmT, mmHi].
	mmHi, mmT, mmLam float64
	mmOK, mmSet      bool

	last carryLocal // the last evaluation
}

func newCarryODE(w *Wind, cf CoolingFunction, c *Criterion, set EvolveSettings, m0 float64) *carryODE {
	q := &w.Params
	o := &carryODE{w: w, cf: cf, c: c, set: set, m0: m0}
	o.bigR, o.vInf = float64(q.Radius), float64(w.VInf)
	o.tUnit = o.bigR / o.vInf
	o.tCl = float64(q.TCloud)
	o.csCl = float64(SoundSpeed(q.TCloud, q.Mu, q.Gamma))
	o.muMp = q.Mu * float64(ProtonMass)
	o.f, o.xH = q.HeatCapacity.Factor(), q.HydrogenFraction
	o.xiIso = 1
	if q.DensityProduct == NH2 { // (X μ m_p/m_H)², one μ (State.minimaAlongIsobar with δ = 0)
		r := o.xH * o.muMp / float64(HydrogenAtomMass)
		o.xiIso = r * r
	}
	o.lamCold = o.lambda(o.tCl)
	o.mixKind = q.MixCooling
	o.growOn = set.Disable&TermGrowth == 0
	o.lossOn = set.Disable&TermLoss == 0
	o.dragOn = set.Disable&TermRamDrag == 0
	o.smooth = set.Branch == BranchSmooth
	o.dragBoost = 1 + set.AlfvenOverWind*set.AlfvenOverWind
	switch {
	case c.Cool == CoolShocked, c.Cool == CoolGrow, c.HasThirdOutcome(), c.Dyn == DynTurbulentCC:
		o.general = true
	}
	return o
}

// lambda returns Λ(t) with the cooling floor, as State.lambda.
func (o *carryODE) lambda(t float64) float64 {
	q := &o.w.Params
	if q.TFloor != NoFloor && Temperature(t) < q.TFloor {
		return 0
	}
	return float64(o.cf.Lambda(Temperature(t)))
}

// densityProduct returns 𝒩 for particle density n and mass density rho.
func (o *carryODE) densityProduct(n, rho float64) float64 {
	if o.w.Params.DensityProduct == N2 {
		return n * n
	}
	nh := o.xH * rho / float64(HydrogenAtomMass)
	return nh * nh
}

// coolingTime returns the cooling time of kind k at the local state: the
// formulas of State.derive with T_hot = T(r), n = (P/k_B)/T, ρ = μ m_p n.
func (o *carryODE) coolingTime(k CoolingTimeKind, pt *WindPoint, rhoCl float64) float64 {
	p, tHot := float64(pt.Pressure), float64(pt.T)
	switch k {
	case CoolHot:
		return float64(o.w.coolingTime(*pt, o.cf))
	case CoolMix:
		tMix := math.Sqrt(o.tCl * tHot)
		n := p / tMix
		rho := math.Sqrt(rhoCl * float64(pt.Rho))
		return float64(CoolingTime(o.f, NumberDensity(n), Temperature(tMix), o.densityProduct(n, rho), CoolingRate(o.lambda(tMix))))
	case CoolCold:
		n := p / o.tCl
		return float64(CoolingTime(o.f, NumberDensity(n), Temperature(o.tCl), o.densityProduct(n, rhoCl), CoolingRate(o.lamCold)))
	case CoolMinMix:
		hi := math.Max(tHot, o.tCl)
		if !o.mmSet || hi > o.mmHi || hi < o.mmT {
			m, _ := minLogRatio(o.cf, Temperature(o.tCl), Temperature(hi), CoolingRate(o.lamCold), CoolingRate(o.lambda(hi)), 2, 2.5)
			o.mmHi, o.mmT, o.mmLam, o.mmOK, o.mmSet = hi, float64(m.T), float64(m.Lambda), m.ok && m.Lambda > 0, true
		}
		if !o.mmOK {
			return math.Inf(1)
		}
		return o.f * Boltzmann * o.mmT * o.mmT / (o.xiIso * p * o.mmLam) // f k T²/(ξ P Λ), derived: t_cool at fixed P
	}
	return math.Inf(1)
}

// local computes the right-hand side at y = (m/m0, v/v_∞, r/R) in CGS:
// the physics of cloudODE (evolve.go) with the wind at r.
func (o *carryODE) local(y []float64) carryLocal {
	var l carryLocal
	copy(l.y[:], y)
	mu := math.Max(y[0], minMassODE)
	l.pt = o.w.At(Length(math.Max(y[2], 0) * o.bigR))
	pt := &l.pt
	chi := math.Max(pt.Chi, 1) // trial stages past RChiOne: the run stops there (Carry)
	rhoHot, vw, csHot := float64(pt.Rho), float64(pt.V), float64(pt.Cs)
	rhoCl := o.muMp * float64(pt.Pressure) / o.tCl // pressure equilibrium at T_cl, one μ
	m := mu * o.m0
	l.rCl = math.Cbrt(3 * m / (4 * math.Pi * rhoCl))
	v := y[1] * o.vInf
	delta := vw - v
	l.tcc = math.Sqrt(chi) * l.rCl / vw // t_cc(r) with the local v_w, as Evolve

	// Branch: the criterion at the current radius and the local state (as Evolve).
	l.ratio, l.thr = math.Inf(1), 1
	u := math.Inf(1)
	switch {
	case o.c.Cool == CoolNone:
	case o.general:
		u = o.generalBranch(&l, pt, chi)
	default:
		td := l.tcc
		if o.c.Dyn == DynShear {
			td = l.rCl / vw
		}
		l.ratio = o.coolingTime(o.c.Cool, pt, rhoCl) / td
		l.thr = o.c.Threshold(chi)
		u = l.ratio / l.thr
	}
	switch {
	case math.IsInf(l.ratio, 1), math.IsInf(u, 1):
		l.s = 0
	case o.smooth:
		l.s = 1 / (1 + math.Pow(u, o.set.Width)) // cloudwind's modelling choice, not a published result
	case u < 1:
		l.s = 1
	}

	grow := 0.0
	if o.growOn && l.s > 0 {
		l.tcoolMix = o.coolingTime(o.mixKind, pt, rhoCl)
		l.vmix = float64(MixingVelocity(o.set.AlphaV, Velocity(o.csCl), Time(l.tcoolMix), Time(l.rCl/o.csCl))) // [TOG21] form
		if o.set.MachFactor {
			l.vmix *= math.Sqrt(math.Abs(delta) / csHot) // × (|Δv|/c_s,hot)^{1/2}, [GO20] (from memory)
		}
		grow = l.s * rhoHot * l.vmix * o.set.AreaFactor * 4 * math.Pi * l.rCl * l.rCl // ṁ_grow = S ρ_hot v_mix f_A 4π r² (as Evolve)
	}
	loss := 0.0
	if o.lossOn {
		loss = (1 - l.s) * m / (o.set.Kappa * l.tcc) // ṁ_loss = (1 − S) m/(κ t_cc(r)) (as Evolve)
	}
	drag := 0.0
	if o.dragOn {
		drag = 0.5 * o.set.DragCoefficient * rhoHot * delta * math.Abs(delta) * math.Pi * l.rCl * l.rCl * o.dragBoost // ram drag, McCourt et al. 2015 factor
	}
	l.mdot = grow - loss           // dm/dt = ṁ_grow − ṁ_loss
	l.dvdt = grow/m*delta + drag/m // (ṁ_grow/m)Δv + F_drag/m, derived; lost mass keeps v
	return l
}

// generalBranch applies the criterion through State.Evaluate to the
// wind-tunnel problem at the local state (Wind.CloudParams with r_cl and
// χ ≥ 1), sets l.ratio and l.thr and returns ratio/threshold, or for a
// three-outcome criterion the warm gas's ratio/threshold, as Evolve's
// branch does at t = 0. A state that cannot be derived gives +Inf (S = 0).
func (o *carryODE) generalBranch(l *carryLocal, pt *WindPoint, chi float64) float64 {
	p := o.w.cloudParams(*pt, Length(l.rCl))
	p.Chi = chi
	if err := o.st.derive(p, o.cf); err != nil {
		return math.Inf(1)
	}
	out := o.st.Evaluate(o.c)
	if !(out.Ratio >= 0) || !(out.Threshold > 0) {
		return math.Inf(1)
	}
	l.ratio, l.thr = out.Ratio, out.Threshold
	if out.WarmRatio >= 0 && out.WarmThreshold > 0 {
		return out.WarmRatio / out.WarmThreshold
	}
	return out.Ratio / out.Threshold
}

// eval is the odeFunc of the system in τ = t v_∞/R.
func (o *carryODE) eval(_ float64, y, dy []float64) {
	o.last = o.local(y)
	dy[0] = o.last.mdot * o.tUnit / o.m0
	dy[1] = o.last.dvdt * o.tUnit / o.vInf
	dy[2] = y[1] // d(r/R)/dτ = v/v_∞
}

// Carry integrates the cloud-growth and entrainment ODE of Evolve for a
// cloud of radius rCl launched at radius set.R0 with speed set.V0 through
// the wind, with the thermal state at its current radius r(t): in CGS, with
// Δv = v_w(r) − v and r_cl = (3m/(4πρ_cl(r)))^{1/3}, ρ_cl = μ m_p P(r)/(k_B
// T_cl),
//
//	ṁ_grow = S ρ_hot(r) v_mix f_A 4π r_cl²,   ṁ_loss = (1 − S) m/(κ t_cc)
//	dm/dt  = ṁ_grow − ṁ_loss
//	dv/dt  = (ṁ_grow/m) Δv + ½ C_D ρ_hot Δv|Δv| π r_cl² (1 + v_A²/v_w²)/m
//	dr/dt  = v
//
// with t_cc = χ(r)^{1/2} r_cl/v_w(r), v_mix = α_v c_s,cl (t_cool,X c_s,cl/r_cl)^{−1/4}
// ([TOG21]; t_cool,X of the local isobar, X = MixCooling) and S from
// criterion c at the local χ, M, P and r_cl. No gravity and no
// pressure-gradient force act (WindAssumptions). The run ends at REnd, at
// RChiOne if that comes first, when m falls to DestroyedMass m0 or reaches
// MassCap m0, or at TMax. The integrator is Dormand–Prince 5(4) [DP80]
// with tolerances ODE.RelTol and ODE.AbsTol on (m/m0, v/v_∞, r/R).
//
// Carry returns a *FieldError from set.Validate or CloudParams at launch,
// and an error for a nil cooling function or criterion or an invalid
// criterion. When the integrator fails it returns the path so far with an
// error wrapping ErrMaxSteps or ErrStepTooSmall.
func (w *Wind) Carry(rCl Length, cf CoolingFunction, c *Criterion, set CarrySettings) (CarriedCloud, error) {
	if cf == nil || c == nil {
		return CarriedCloud{}, fmt.Errorf("carry: nil cooling function or criterion")
	}
	if err := c.Validate(); err != nil {
		return CarriedCloud{}, fmt.Errorf("carry: criterion %q: %w", c.ID, err)
	}
	if err := set.Validate(w); err != nil {
		return CarriedCloud{}, err
	}
	set = set.WithDefaults(w)
	launch, err := w.CloudParams(set.R0, rCl)
	if err != nil {
		return CarriedCloud{}, err
	}
	pt0 := w.At(set.R0)
	rhoCl0 := float64(MassDensity(ParticleDensity(pt0.Pressure, w.Params.TCloud), w.Params.Mu))
	m0 := float64(CloudMass(rCl, Density(rhoCl0)))
	o := newCarryODE(w, cf, c, set.ODE, m0)
	nan := math.NaN()
	cc := CarriedCloud{Launch: launch, M0: Mass(m0), Settings: set, ode: o,
		REntrain: Length(nan), TEntrain: Time(nan), RDouble: Length(nan), TDouble: Time(nan), RDestroy: Length(nan), TDestroy: Time(nan)}
	cc.TCC0 = CloudCrushingTime(rCl, pt0.Chi, pt0.V)
	cc.reserve(128) // room for 128 samples before append reallocates; runs to 100 R take ~100
	rStop, stopAt := set.REnd, StopReached
	if w.RChiOne < rStop {
		rStop, stopAt = w.RChiOne, StopColdWind
	}
	xiStop := float64(rStop) / o.bigR
	tauMax := float64(set.TMax) / o.tUnit

	d := newDopri(o.eval, 3, dopriOptions{RelTol: set.ODE.RelTol, AbsTol: set.ODE.AbsTol, MaxSteps: set.ODE.MaxSteps})
	d.reset(0, []float64{1, float64(set.V0) / o.vInf, float64(set.R0) / o.bigR}, tauMax)
	cc.push(o, 0, d.y, o.local(d.y))
	if l := cc.last(); math.Abs(float64(l.pt.V)-float64(set.V0)) <= EntrainedSpeed*float64(l.pt.V) {
		cc.REntrain, cc.TEntrain = set.R0, 0
	}
	cc.Stop = StopTime
	for d.t < tauMax {
		if err = d.advance(tauMax); err != nil {
			err = fmt.Errorf("carry: at r = %s R: %w", num(d.y[2]), err)
			break
		}
		l := o.last
		if l.y != [3]float64{d.y[0], d.y[1], d.y[2]} { // the FSAL evaluation is at the accepted point; recompute if not
			l = o.local(d.y)
		}
		if cc.events(o, d, xiStop, stopAt) {
			break
		}
		cc.push(o, d.t, d.y, l)
	}
	if cc.Stop == StopTime || err != nil {
		cc.RStop = cc.R[len(cc.R)-1]
	}
	cc.Steps, cc.Rejected, cc.Evals = d.steps, d.rejected, d.evals
	if rc, ok, e := w.CoolingRadius(cf, set.R0, cc.RStop); e == nil && ok {
		cc.RWindCools, cc.WindCools = rc, true
	}
	return cc, err
}

// reserve gives every sample slice capacity n.
func (cc *CarriedCloud) reserve(n int) {
	for _, p := range [...]*[]float64{&cc.tau, &cc.xi, &cc.mu, &cc.u, &cc.dmu, &cc.du, &cc.M, &cc.Chi, &cc.S} {
		*p = make([]float64, 0, n)
	}
	cc.R, cc.RCl = make([]Length, 0, n), make([]Length, 0, n)
	cc.V, cc.VWind = make([]Velocity, 0, n), make([]Velocity, 0, n)
	cc.T, cc.MDot = make([]Time, 0, n), make([]MassRate, 0, n)
}

// last returns the local state at the last sample.
func (cc *CarriedCloud) last() carryLocal {
	n := len(cc.xi) - 1
	return cc.ode.local([]float64{cc.mu[n], cc.u[n], cc.xi[n]})
}

// push appends the sample at τ with state y and its local evaluation l.
func (cc *CarriedCloud) push(o *carryODE, tau float64, y []float64, l carryLocal) {
	cc.tau, cc.xi, cc.mu, cc.u = append(cc.tau, tau), append(cc.xi, y[2]), append(cc.mu, y[0]), append(cc.u, y[1])
	cc.dmu = append(cc.dmu, l.mdot*o.tUnit/o.m0)
	cc.du = append(cc.du, l.dvdt*o.tUnit/o.vInf)
	cc.R = append(cc.R, Length(y[2]*o.bigR))
	cc.T = append(cc.T, Time(tau*o.tUnit))
	cc.M = append(cc.M, y[0])
	cc.V = append(cc.V, Velocity(y[1]*o.vInf))
	cc.VWind = append(cc.VWind, l.pt.V)
	cc.Chi = append(cc.Chi, l.pt.Chi)
	cc.RCl = append(cc.RCl, Length(l.rCl))
	cc.S = append(cc.S, l.s)
	cc.MDot = append(cc.MDot, MassRate(l.mdot))
}

// events locates the events inside the last accepted step of d on the
// cubic Hermite interpolant through its ends (bisection, as Evolve). It
// reports whether the run stops; it has then appended the last sample, at
// the first stopping event. A level crossed and recrossed within one step
// is not seen.
func (cc *CarriedCloud) events(o *carryODE, d *dopri, xiStop float64, atStop CarryStop) bool {
	t0, h := d.tPrev, d.t-d.tPrev
	y0, y1, f0, f1 := d.yPrev, d.y, d.dyPrev, d.dy
	at := func(i int, th float64) float64 { return hermiteCubic(th, h, y0[i], y1[i], f0[i], f1[i]) }
	entrained := func(th float64) bool {
		vw := float64(o.w.At(Length(at(2, th) * o.bigR)).V)
		return math.Abs(vw-at(1, th)*o.vInf) <= EntrainedSpeed*vw
	}
	// Stopping events: the earliest in the step wins.
	stop, thStop := CarryStop(-1), 2.0
	try := func(s CarryStop, crossed bool, in func(float64) bool) {
		if !crossed {
			return
		}
		if th := bisectFirst(in); th < thStop {
			stop, thStop = s, th
		}
	}
	try(StopDestroyed, y1[0] < DestroyedMass, func(th float64) bool { return at(0, th) < DestroyedMass })
	try(StopMassCap, y1[0] > MassCap, func(th float64) bool { return at(0, th) > MassCap })
	try(atStop, y1[2] >= xiStop, func(th float64) bool { return at(2, th) >= xiStop })
	limit := 1.0
	if stop >= 0 {
		limit = thStop
	}
	if math.IsNaN(float64(cc.TDouble)) && y0[0] < DoubledMass && y1[0] >= DoubledMass {
		if th := bisectFirst(func(th float64) bool { return at(0, th) >= DoubledMass }); th <= limit {
			cc.TDouble, cc.RDouble = Time((t0+h*th)*o.tUnit), Length(at(2, th)*o.bigR)
		}
	}
	if math.IsNaN(float64(cc.TEntrain)) && entrained(1) {
		if th := bisectFirst(entrained); th <= limit {
			cc.TEntrain, cc.REntrain = Time((t0+h*th)*o.tUnit), Length(at(2, th)*o.bigR)
		}
	}
	if stop < 0 {
		return false
	}
	var y [3]float64
	for i := range y {
		y[i] = at(i, thStop)
	}
	if stop == atStop {
		y[2] = xiStop // exact, free of the bisection's last bit
	}
	tStop := t0 + h*thStop
	cc.push(o, tStop, y[:], o.local(y[:]))
	cc.Stop, cc.RStop = stop, Length(y[2]*o.bigR)
	if stop == StopDestroyed {
		cc.TDestroy, cc.RDestroy = Time(tStop*o.tUnit), cc.RStop
	}
	return true
}

// AtRadius returns the cloud's state where its centre passes radius r,
// interpolated between samples with the cubic Hermite polynomial in time
// (third order, as Trajectory.At) and the radius matched by bisection;
// the wind, χ, r_cl, S and dm/dt are then recomputed at that state. It
// reports false outside the path, [R[0], R[end]]. The path's radius
// increases with time wherever the cloud moves outward, as it does from
// any launch speed ≥ 0 (the wind pushes it outward and nothing pulls it
// back).
//
// Special cases are:
//
//	AtRadius(r < R[0] or r > R[end] or NaN) = zero CarriedPoint, false
func (cc *CarriedCloud) AtRadius(r Length) (CarriedPoint, bool) {
	n := len(cc.xi)
	if n == 0 || cc.ode == nil {
		return CarriedPoint{}, false
	}
	if !(r >= cc.R[0] && r <= cc.R[n-1]) {
		return CarriedPoint{}, false
	}
	o := *cc.ode                                                      // a copy: the isobar cache is not shared
	xi := math.Min(math.Max(float64(r)/o.bigR, cc.xi[0]), cc.xi[n-1]) // free of the rounding of r/R at the ends
	i := sort.SearchFloat64s(cc.xi, xi)                               // xi[i-1] < ξ ≤ xi[i]
	var y [3]float64
	tau := cc.tau[0]
	if i == 0 {
		y = [3]float64{cc.mu[0], cc.u[0], cc.xi[0]}
	} else {
		h := cc.tau[i] - cc.tau[i-1]
		xAt := func(th float64) float64 { return hermiteCubic(th, h, cc.xi[i-1], cc.xi[i], cc.u[i-1], cc.u[i]) }
		th := bisectFirst(func(th float64) bool { return xAt(th) >= xi })
		y[0] = hermiteCubic(th, h, cc.mu[i-1], cc.mu[i], cc.dmu[i-1], cc.dmu[i])
		y[1] = hermiteCubic(th, h, cc.u[i-1], cc.u[i], cc.du[i-1], cc.du[i])
		y[2] = xi
		tau = cc.tau[i-1] + th*h
	}
	return cc.point(&o, tau, y), true
}

// AtTime returns the cloud's state at time t after launch, interpolated
// between samples with the cubic Hermite polynomial in time, with the
// wind, χ, r_cl, S and dm/dt recomputed at that state as AtRadius does. It
// reports false outside [0, T[end]].
//
// Special cases are:
//
//	AtTime(t < 0 or t > T[end] or NaN) = zero CarriedPoint, false
func (cc *CarriedCloud) AtTime(t Time) (CarriedPoint, bool) {
	n := len(cc.tau)
	if n == 0 || cc.ode == nil {
		return CarriedPoint{}, false
	}
	if !(t >= 0 && t <= cc.T[n-1]) {
		return CarriedPoint{}, false
	}
	o := *cc.ode                                     // a copy: the isobar cache is not shared
	tau := math.Min(float64(t)/o.tUnit, cc.tau[n-1]) // free of the rounding of t v_∞/R at the end
	i := sort.SearchFloat64s(cc.tau, tau)            // tau[i-1] < τ ≤ tau[i]
	y := [3]float64{cc.mu[0], cc.u[0], cc.xi[0]}
	if i > 0 {
		h := cc.tau[i] - cc.tau[i-1]
		th := (tau - cc.tau[i-1]) / h
		y[0] = hermiteCubic(th, h, cc.mu[i-1], cc.mu[i], cc.dmu[i-1], cc.dmu[i])
		y[1] = hermiteCubic(th, h, cc.u[i-1], cc.u[i], cc.du[i-1], cc.du[i])
		y[2] = hermiteCubic(th, h, cc.xi[i-1], cc.xi[i], cc.u[i-1], cc.u[i])
	}
	return cc.point(&o, tau, y), true
}

// point returns the CarriedPoint at τ and state y, recomputing the local
// quantities with o.
func (cc *CarriedCloud) point(o *carryODE, tau float64, y [3]float64) CarriedPoint {
	l := o.local(y[:])
	return CarriedPoint{R: Length(y[2] * o.bigR), T: Time(tau * o.tUnit), M: y[0], V: Velocity(y[1] * o.vInf),
		VWind: l.pt.V, Chi: l.pt.Chi, RCl: Length(l.rCl), S: l.s, MDot: MassRate(l.mdot)}
}

// ColdMassFlux returns the cold mass flux through radius r of a steady
// stream of such clouds launched at r0 carrying cold mass at the rate
// launched (N clouds per unit time of mass m0 each: launched = N m0),
//
//	Ṁ_cold(r) = N m(r) = launched · m(r)/m0,
//
// since in a steady stream every cloud crosses r once (the path moves
// outward), carrying the mass it has there (derived; clouds are assumed
// not to interact or to change the wind). It reports false outside the
// path.
func (cc *CarriedCloud) ColdMassFlux(r Length, launched MassRate) (MassRate, bool) {
	p, ok := cc.AtRadius(r)
	if !ok {
		return 0, false
	}
	return MassRate(float64(launched) * p.M), true
}

// A GrowthRateSpread measures how constant a carried cloud's growth rate
// dm/dt is over a range of radii: the check against Gronke & Oh 2020's
// statement that in a Chevalier & Clegg wind "the mass growth rate is
// constant" ([GO20], abstract; qualitative, no number is given there).
type GrowthRateSpread struct {
	RLo, RHi Length   // the range measured, clipped to the path
	Points   int      // radii sampled, evenly in log r, ends included
	Mean     MassRate // (m(RHi) − m(RLo))/(t(RHi) − t(RLo)): the mean rate over the range
	Min, Max MassRate // the extremes of dm/dt at the sampled radii
	// Spread is (Max − Min)/Mean: 0 for a constant rate.
	Spread float64
	// SlopeR is the least-squares d ln(dm/dt)/d ln r over the sampled radii
	// (where dm/dt > 0): 0 for a constant rate.
	SlopeR float64
	// Growing reports whether dm/dt > 0 at every sampled radius; Spread
	// and SlopeR mean little otherwise.
	Growing bool
}

// Points of GrowthSpread's sampling in log r.
const growthSpreadPoints = 65

// GrowthSpread measures dm/dt over [rLo, rHi] ∩ [R[0], R[end]] at 65
// radii evenly spaced in log r (AtRadius):
//
//	Spread = (max ṁ − min ṁ)/⟨ṁ⟩,   ⟨ṁ⟩ = Δm/Δt,   SlopeR = d ln ṁ/d ln r (least squares),
//
// cloudwind's measure of the constancy [GO20] states (no number is given
// there). It returns an error when the range misses the path or is not
// rLo < rHi.
func (cc *CarriedCloud) GrowthSpread(rLo, rHi Length) (GrowthRateSpread, error) {
	n := len(cc.R)
	if n < 2 {
		return GrowthRateSpread{}, fmt.Errorf("growth spread: the path has no steps")
	}
	lo, hi := math.Max(float64(rLo), float64(cc.R[0])), math.Min(float64(rHi), float64(cc.R[n-1]))
	if !(lo < hi) {
		return GrowthRateSpread{}, fmt.Errorf("growth spread: [%s, %s] cm does not overlap the path [%s, %s] cm", num(float64(rLo)), num(float64(rHi)), num(float64(cc.R[0])), num(float64(cc.R[n-1])))
	}
	g := GrowthRateSpread{RLo: Length(lo), RHi: Length(hi), Points: growthSpreadPoints, Growing: true,
		Min: MassRate(math.Inf(1)), Max: MassRate(math.Inf(-1))}
	var first, lastP CarriedPoint
	var sx, sy, sxx, sxy, k float64
	for j := range growthSpreadPoints {
		r := lo * math.Pow(hi/lo, float64(j)/(growthSpreadPoints-1))
		if j == growthSpreadPoints-1 {
			r = hi
		}
		p, ok := cc.AtRadius(Length(r))
		if !ok {
			continue // rounding at an end
		}
		if j == 0 {
			first = p
		}
		lastP = p
		g.Min, g.Max = min(g.Min, p.MDot), max(g.Max, p.MDot)
		if !(p.MDot > 0) {
			g.Growing = false
			continue
		}
		x, y := math.Log(r), math.Log(float64(p.MDot))
		sx, sy, sxx, sxy, k = sx+x, sy+y, sxx+x*x, sxy+x*y, k+1
	}
	g.Mean = MassRate((lastP.M - first.M) * float64(cc.M0) / float64(lastP.T-first.T))
	g.Spread = float64(g.Max-g.Min) / float64(g.Mean)
	if den := k*sxx - sx*sx; k >= 2 && den > 0 {
		g.SlopeR = (k*sxy - sx*sy) / den
	} else {
		g.SlopeR = math.NaN()
	}
	return g, nil
}

// GrowingPath returns the radii of the first stretch of the path over
// which the cloud grows (dm/dt > 0 at consecutive samples, from the first
// such sample), and whether there are at least two: the natural range of
// GrowthSpread. The stretch ends at the last growing sample, before the
// branch turns to destruction or the run ends.
func (cc *CarriedCloud) GrowingPath() (lo, hi Length, ok bool) {
	i := 0
	for i < len(cc.MDot) && !(cc.MDot[i] > 0) {
		i++
	}
	j := i
	for j+1 < len(cc.MDot) && cc.MDot[j+1] > 0 {
		j++
	}
	if i >= len(cc.MDot) || j == i {
		return 0, 0, false
	}
	return cc.R[i], cc.R[j], true
}
