package model

import (
	"fmt"
	"math"
	"sort"
)

// This file integrates cloudwind's semi-analytic growth and entrainment ODE
// (see Evolve: the [TOG21] mixing velocity, growth as in [GO20],
// destruction in κ t_cc and ram drag) for one cloud: the settings with
// their defaults and statuses, the right-hand side, Evolve and its
// Trajectory. Inside, time is in t_cc,0 (the cloud-crushing time at the
// initial radius r0), mass in m0, velocity in v_w and position in r0. With
// ρ_cl and ρ_hot fixed (isobaric) the radius is r/r0 = (m/m0)^{1/3}.

// Event levels of Evolve (cloudwind's choices), and its mass cap.
const (
	DestroyedMass  = 1e-3 // m/m0 below which the cloud is destroyed and the integration stops
	DoubledMass    = 2.0  // m/m0 that defines the mass-doubling time
	EntrainedSpeed = 0.1  // |Δv|/v_w at or below which the cloud is entrained
	// MassCap is the m/m0 at which Evolve stops a growing cloud: long before
	// it the fixed-wind model means nothing, and exponential growth would
	// overflow (a cloudwind choice).
	MassCap = 1e12
)

// minMassODE floors m/m0 inside the right-hand side so that a trial stage
// that overshoots below zero gets finite rates. Accepted solutions stop at
// DestroyedMass long before, so it does not change results.
const minMassODE = 1e-12

// A Trajectory is a solution of the cloud ODE, sampled at the integrator's
// accepted steps, t = 0 included. Every number is dimensionless.
type Trajectory struct {
	T []float64 // time t/t_cc,0
	M []float64 // mass m/m0
	V []float64 // velocity v/v_w (the wind blows at v/v_w = 1)
	X []float64 // position x/r0
	S []float64 // branch weight S ∈ [0, 1]: 1 grows, 0 is destroyed

	// Event times in t_cc,0, located inside a step on the cubic Hermite
	// interpolant of the step. Each is NaN when the event did not happen
	// before the integration stopped.
	TEntrain float64 // first time |v_w − v| ≤ EntrainedSpeed v_w; 0 if so at the start
	TDouble  float64 // first time m = DoubledMass m0
	TDestroy float64 // the time m = DestroyedMass m0, where the integration stops

	Destroyed bool // stopped at TDestroy
	Capped    bool // stopped when m reached MassCap m0

	// GrowthNote is "" unless the branch says the cloud grows at r0 but its
	// mass has not doubled by the end of the run: then it says so and why,
	// naming the long time (t_grow,0 and the growth model's cooling time).
	GrowthNote string

	Ratio0   float64        // the criterion's τ_cool/τ_dyn at r0; +Inf without cooling
	TGrow0   float64        // t_grow,0/t_cc,0 = m0/ṁ_grow(t = 0, S = 1); +Inf without growth
	Settings EvolveSettings // the settings used, with defaults filled in

	Steps, Rejected, Evals int // accepted and rejected steps; right-hand-side evaluations

	dm, dv  []float64 // d(m/m0)/dt and d(v/v_w)/dt at each sample, for At
	sqrtChi float64   // d(x/r0)/dt = χ^{1/2} v/v_w in these units
}

// At returns m/m0, v/v_w and x/r0 at time tcc (in t_cc,0), interpolated
// between samples with the cubic Hermite polynomial through the values and
// derivatives at both ends: third order, and exact where the solution is a
// cubic. It serves charts on a uniform time grid.
//
// Special cases are:
//
//	At(t ≤ 0 or NaN) = the initial state
//	At(t ≥ T[end])   = the last state (at t_end or where the run stopped)
//	At(t) of an empty Trajectory = 0, 0, 0
func (tr *Trajectory) At(tcc float64) (m, v, x float64) {
	n := len(tr.T)
	switch {
	case n == 0 || len(tr.M) < n || len(tr.V) < n || len(tr.X) < n:
		return 0, 0, 0
	case !(tcc > tr.T[0]):
		return tr.M[0], tr.V[0], tr.X[0]
	case tcc >= tr.T[n-1]:
		return tr.M[n-1], tr.V[n-1], tr.X[n-1]
	}
	i := sort.SearchFloat64s(tr.T, tcc) // T[i-1] < tcc ≤ T[i]
	h := tr.T[i] - tr.T[i-1]
	th := (tcc - tr.T[i-1]) / h
	// Slopes times h; secants (linear interpolation) for a hand-built Trajectory.
	sm0, sv0, sx0 := tr.M[i]-tr.M[i-1], tr.V[i]-tr.V[i-1], tr.X[i]-tr.X[i-1]
	sm1, sv1, sx1 := sm0, sv0, sx0
	if len(tr.dm) == n && len(tr.dv) == n {
		sm0, sm1, sv0, sv1 = h*tr.dm[i-1], h*tr.dm[i], h*tr.dv[i-1], h*tr.dv[i]
		sx0, sx1 = h*tr.sqrtChi*tr.V[i-1], h*tr.sqrtChi*tr.V[i]
	}
	m = hermiteCubic(th, 1, tr.M[i-1], tr.M[i], sm0, sm1)
	v = hermiteCubic(th, 1, tr.V[i-1], tr.V[i], sv0, sv1)
	x = hermiteCubic(th, 1, tr.X[i-1], tr.X[i], sx0, sx1)
	return m, v, x
}

// cloudODE is the right-hand side of Evolve's ODE in the units above. With
// μ = m/m0, ρ = r/r0 = μ^{1/3} and Δ = 1 − v/v_w:
//
//	dμ/dt = S g0 ρ² ρ^{1/4} [M_f] − (1 − S) μ/(κ ρ)   (sphere)
//	dμ/dt = S g0 μ [M_f]          − (1 − S) μ/(κ ρ)   (fragmented)
//	dv/dt = (ṁ_grow/m) Δ + D Δ|Δ|/ρ
//	dx/dt = χ^{1/2} v
//
// where g0 = t_cc,0/t_grow,0 = 3 f_A v_mix,0/(χ^{1/2} v_w) follows from
// ṁ_grow = S ρ_hot v_mix f_A 4π r² and m0 = (4π/3) ρ_cl r0³ (derived),
// v_mix ∝ r^{1/4} at fixed t_cool ([TOG21]), M_f = (|Δ| v_w/c_s,hot)^{1/2}
// is the optional Mach factor ([GO20], from memory), and
// D = 3 C_D (1 + v_A²/v_w²)/(8 χ^{1/2}) follows from F_drag/m (derived;
// magnetic factor McCourt et al. 2015, arXiv:1409.6719).
type cloudODE struct {
	g0       float64 // t_cc,0/t_grow,0; 0 when growth is switched off
	machW    float64 // v_w/c_s,hot when the Mach factor is on, else 0
	invKappa float64 // 1/κ; 0 when loss is switched off
	drag     float64 // D; 0 when ram drag is switched off
	sqrtChi  float64 // χ^{1/2} = (v_w t_cc,0/r0)
	ratio0   float64 // the criterion's ratio at r0; +Inf gives S = 0 always
	thr      float64 // its threshold α (χ/100)^β
	power    float64 // p in ratio ∝ r^{-p}: 1 for cooling times, 1/4 for t_grow
	warm0    float64 // a three-outcome criterion's warm-gas ratio at r0 (∝ 1/r); +Inf destroys
	warm     bool    // the criterion has the three outcomes at this state
	warmThr  float64 // its threshold
	width    float64 // n of the smooth branch
	smooth   bool
	fragment bool
}

// branch returns S at radius ρ = r/r0. A criterion's ratio τ_cool/τ_dyn is
// ∝ 1/r at fixed thermal state (t_cc and t_shear are both ∝ r), so
// ratio(r) = ratio(r0)·r0/r with the threshold fixed: the criterion is
// evaluated at the current radius (cloudwind's choice: a shrinking cloud
// can cross the threshold).
func (o *cloudODE) branch(rho float64) float64 {
	if math.IsInf(o.ratio0, 1) {
		return 0
	}
	rp := rho
	if o.power != 1 {
		rp = math.Pow(rho, o.power)
	}
	u := o.ratio0 / (rp * o.thr) // ratio/threshold
	if o.warm {
		u = o.warm0 / (rho * o.warmThr) // a three-outcome criterion: the gas at T_w grows, survived or transformed
		if math.IsInf(u, 1) {
			return 0 // no warm gas survives (State.evaluate: destroyed)
		}
	}
	if o.smooth {
		return 1 / (1 + math.Pow(u, o.width)) // cloudwind's modelling choice, not a published result
	}
	if u < 1 {
		return 1
	}
	return 0
}

// eval is the odeFunc of the system, dy = f(y).
func (o *cloudODE) eval(_ float64, y, dy []float64) {
	mu := math.Max(y[0], minMassODE)
	rho := math.Cbrt(mu)
	s := o.branch(rho)
	delta := 1 - y[1]
	grow := 0.0
	if s > 0 {
		if o.fragment {
			grow = s * o.g0 * mu // A ∝ m, v_mix frozen at r0 (turbulent fragmentation, [GOJN22])
		} else {
			grow = s * o.g0 * rho * rho * math.Sqrt(math.Sqrt(rho)) // ∝ r² v_mix(r), derived
		}
		if o.machW > 0 {
			grow *= math.Sqrt(math.Abs(delta) * o.machW) // × (|Δv|/c_s,hot)^{1/2}, [GO20] (from memory)
		}
	}
	loss := (1 - s) * mu * o.invKappa / rho                  // ṁ_loss = (1 − S) m/(κ t_cc(r)), t_cc(r) ∝ r
	dy[0] = grow - loss                                      // dm/dt = ṁ_grow − ṁ_loss
	dy[1] = grow/mu*delta + o.drag*delta*math.Abs(delta)/rho // (ṁ_grow/m)Δv + F_drag/m, derived; lost mass keeps v
	dy[2] = o.sqrtChi * y[1]                                 // dx/dt = v
}

// newCloudODE builds the right-hand side for state s, criterion c and the
// defaulted, validated settings set.
func newCloudODE(s *State, c *Criterion, set *EvolveSettings) (*cloudODE, error) {
	if err := s.Params.Validate(); err != nil {
		return nil, fmt.Errorf("evolve: invalid state: %w", err)
	}
	for _, v := range [...]float64{float64(s.VWind), float64(s.CsCold), float64(s.CsHot), float64(s.TSoundCold)} {
		if !(v > 0) || math.IsInf(v, 1) {
			return nil, fmt.Errorf("evolve: the state has v_w, c_s or t_sc = %s: derive it with Derive", num(v))
		}
	}
	if err := c.Validate(); err != nil {
		return nil, fmt.Errorf("evolve: criterion %q: %w", c.ID, err)
	}
	o := &cloudODE{sqrtChi: math.Sqrt(s.Params.Chi), width: set.Width, ratio0: math.Inf(1), thr: 1, power: 1, warm0: math.Inf(1), warmThr: 1,
		smooth: set.Branch == BranchSmooth, fragment: set.Area == AreaFragmented}
	mixCooling := s.Params.WithDefaults().MixCooling // the one growth model of the state
	tc := s.CoolingTime(mixCooling)
	vmix0 := float64(MixingVelocity(set.AlphaV, s.CsCold, tc, s.TSoundCold)) // [TOG21] form; 0 when t_cool = +Inf
	if !(vmix0 >= 0) || math.IsInf(vmix0, 1) {
		return nil, fmt.Errorf("evolve: %s = %s s gives v_mix = %s", mixCooling.Symbol(), num(float64(tc)), num(vmix0))
	}
	if set.Disable&TermGrowth == 0 {
		o.g0 = 3 * set.AreaFactor * vmix0 / (o.sqrtChi * float64(s.VWind)) // t_cc,0/t_grow,0 (derived)
	}
	if set.MachFactor {
		o.machW = float64(s.VWind / s.CsHot)
	}
	if set.Disable&TermLoss == 0 {
		o.invKappa = 1 / set.Kappa
	}
	if b := set.AlfvenOverWind; set.Disable&TermRamDrag == 0 {
		o.drag = 3 * set.DragCoefficient * (1 + b*b) / (8 * o.sqrtChi) // ram drag with McCourt et al. 2015's factor
	}
	if c.Cool != CoolNone { // the adiabatic baseline keeps S = 0
		out := s.Evaluate(c)
		if !(out.Ratio >= 0) || !(out.Threshold > 0) || math.IsInf(out.Threshold, 1) {
			return nil, fmt.Errorf("evolve: criterion %q gives ratio %s and threshold %s", c.ID, num(out.Ratio), num(out.Threshold))
		}
		o.ratio0, o.thr, o.power = out.Ratio, out.Threshold, c.Cool.radiusPower()
		if out.WarmRatio >= 0 && out.WarmThreshold > 0 {
			o.warm0, o.warmThr, o.warm = out.WarmRatio, out.WarmThreshold, true
		}
	}
	return o, nil
}

// Evolve integrates cloudwind's cloud-growth and entrainment ODE for the
// cloud of s, whose branch S follows criterion c at the current radius,
// from t = 0 (m = m0, v = V0 v_w, x = 0) to TEnd t_cc,0, or until m <
// DestroyedMass m0 or m > MassCap m0. Zero fields of set take their
// defaults. In CGS, with Δv = v_w − v and r = (3m/(4πρ_cl))^{1/3}:
//
//	ṁ_grow = S ρ_hot v_mix f_A 4π r²,   ṁ_loss = (1 − S) m/(κ t_cc(r))
//	dm/dt  = ṁ_grow − ṁ_loss
//	dv/dt  = (ṁ_grow/m) Δv + ½ C_D ρ_hot Δv|Δv| π r² (1 + v_A²/v_w²)/m
//	dx/dt  = v
//
// with t_cc(r) = χ^{1/2} r/v_w and v_mix = α_v c_s,cl (t_cool,X
// c_s,cl/r)^{−1/4} ([TOG21]; [GO20] for the use in growth). Lost mass
// carries the cloud's own momentum. The drag boost (1 + v_A²/v_w²) is
// McCourt et al. 2015 (arXiv:1409.6719) as its abstract states it, with v_w
// (not Δv). With the fragmented area model A ∝ m and v_mix stays at its r0
// value. The integrator is the adaptive Dormand–Prince 5(4) pair with
// tolerances RelTol and AbsTol on (m/m0, v/v_w, x/r0).
//
// Evolve returns a *FieldError from set.Validate, and an error for a nil or
// invalid State or Criterion. When the integrator fails it returns the
// trajectory so far with an error wrapping ErrMaxSteps or ErrStepTooSmall.
// No number it returns is NaN except the event times, as documented.
func Evolve(s *State, c *Criterion, set EvolveSettings) (Trajectory, error) {
	if s == nil || c == nil {
		return Trajectory{}, fmt.Errorf("evolve: nil state or criterion")
	}
	set = set.WithDefaults()
	if err := set.Validate(); err != nil {
		return Trajectory{}, err
	}
	o, err := newCloudODE(s, c, &set)
	if err != nil {
		return Trajectory{}, err
	}
	nan := math.NaN()
	tr := Trajectory{TEntrain: nan, TDouble: nan, TDestroy: nan, Ratio0: o.ratio0, Settings: set, sqrtChi: o.sqrtChi}
	tr.TGrow0 = 1 / o.g0 // t_grow,0 = χ r0/(3 f_A v_mix,0) in t_cc,0 (derived); +Inf without growth
	if o.machW > 0 {
		tr.TGrow0 /= math.Sqrt(math.Abs(1-set.V0) * o.machW)
	}
	d := newDopri(o.eval, 3, dopriOptions{RelTol: set.RelTol, AbsTol: set.AbsTol, MaxSteps: set.MaxSteps})
	d.reset(0, []float64{1, set.V0, 0}, set.TEnd)
	buf := make([]float64, 7*64) // room for 64 samples before append reallocates
	for i, p := range [...]*[]float64{&tr.T, &tr.M, &tr.V, &tr.X, &tr.S, &tr.dm, &tr.dv} {
		*p = buf[64*i : 64*i : 64*(i+1)]
	}
	tr.push(o, 0, d.y, d.dy)
	if math.Abs(1-set.V0) <= EntrainedSpeed {
		tr.TEntrain = 0
	}
	for d.t < set.TEnd {
		if err = d.advance(set.TEnd); err != nil {
			err = fmt.Errorf("evolve: at t = %s t_cc,0: %w", num(d.t), err)
			break
		}
		if tr.events(o, d) {
			break
		}
		tr.push(o, d.t, d.y, d.dy)
	}
	tr.Steps, tr.Rejected, tr.Evals = d.steps, d.rejected, d.evals
	if n := len(tr.M) - 1; err == nil && tr.S[0] > 0.5 && math.IsNaN(tr.TDouble) && !tr.Destroyed {
		k := s.Params.WithDefaults().MixCooling
		tc := float64(s.CoolingTime(k)) / float64(s.TCC)
		tr.GrowthNote = fmt.Sprintf("the criterion says the cloud grows, but m/m0 reaches only %s by t = %s t_cc: t_grow,0 = %s t_cc,0, set by the growth model's cooling time %s = %s t_cc,0, which makes v_mix = %s c_s,cl",
			num3(tr.M[n]), num3(tr.T[n]), num3(tr.TGrow0), k.Symbol(), num3(tc), num3(float64(MixingVelocity(set.AlphaV, s.CsCold, s.CoolingTime(k), s.TSoundCold)/s.CsCold)))
	}
	return tr, err
}

// push appends the sample (t, y) with derivative dy.
func (tr *Trajectory) push(o *cloudODE, t float64, y, dy []float64) {
	tr.T, tr.M, tr.V, tr.X = append(tr.T, t), append(tr.M, y[0]), append(tr.V, y[1]), append(tr.X, y[2])
	tr.S = append(tr.S, o.branch(math.Cbrt(math.Max(y[0], minMassODE))))
	tr.dm, tr.dv = append(tr.dm, dy[0]), append(tr.dv, dy[1])
}

// events locates the events inside the last accepted step of d on the
// cubic Hermite interpolant through its ends, found by bisection. It
// reports whether the integration stops; it has then appended the last
// sample, at the stopping event. A level crossed and recrossed within one
// step is not seen.
func (tr *Trajectory) events(o *cloudODE, d *dopri) bool {
	t0, h := d.tPrev, d.t-d.tPrev
	y0, y1, f0, f1 := d.yPrev, d.y, d.dyPrev, d.dy
	at := func(i int, th float64) float64 { return hermiteCubic(th, h, y0[i], y1[i], f0[i], f1[i]) }
	if math.IsNaN(tr.TDouble) && y0[0] < DoubledMass && y1[0] >= DoubledMass {
		tr.TDouble = t0 + h*bisectFirst(func(th float64) bool { return at(0, th) >= DoubledMass })
	}
	if math.IsNaN(tr.TEntrain) && math.Abs(1-y1[1]) <= EntrainedSpeed {
		tr.TEntrain = t0 + h*bisectFirst(func(th float64) bool { return math.Abs(1-at(1, th)) <= EntrainedSpeed })
	}
	var th float64
	switch {
	case y1[0] < DestroyedMass:
		th = bisectFirst(func(th float64) bool { return at(0, th) < DestroyedMass })
		tr.Destroyed, tr.TDestroy = true, t0+h*th
	case y1[0] > MassCap:
		th = bisectFirst(func(th float64) bool { return at(0, th) > MassCap })
		tr.Capped = true
	default:
		return false
	}
	tStop := t0 + h*th
	if tr.TEntrain > tStop { // after the stop: not reached
		tr.TEntrain = math.NaN()
	}
	if tr.TDouble > tStop {
		tr.TDouble = math.NaN()
	}
	var y, dy [3]float64
	for i := range y {
		y[i] = at(i, th)
	}
	o.eval(tStop, y[:], dy[:])
	tr.push(o, tStop, y[:], dy[:])
	return true
}
