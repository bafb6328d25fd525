package model

import (
	"fmt"
	"math"
)

// This file evaluates every criterion along an outflow: for a cloud of
// fixed radius at rest at each radius of a log grid, the criteria of the
// wind-tunnel problem with the local χ, M and P (Wind.CloudParams), and the
// wind's own validity there (its cooling time against its flow time).

// Defaults of ProfileGrid: the range and resolution the outflow view asks
// for (cloudwind's choice).
const (
	DefaultProfileMin    = 0.1 // RMin in units of R
	DefaultProfileMax    = 100 // RMax in units of R
	DefaultProfilePoints = 200
	maxProfilePoints     = 100000 // a typo guard
)

// ProfileGrid is the radius grid of a WindProfile: Points radii evenly
// spaced in log r from RMin to RMax, both included. A zero field means
// "use the default".
type ProfileGrid struct {
	RMin   Length // smallest radius; default 0.1 R
	RMax   Length // largest radius; default 100 R
	Points int    // number of radii, 2 to 100000; default 200
}

// WithDefaults returns g with every zero field set to its default for the
// wind of injection radius bigR.
func (g ProfileGrid) WithDefaults(bigR Length) ProfileGrid {
	if g.RMin == 0 {
		g.RMin = DefaultProfileMin * bigR
	}
	if g.RMax == 0 {
		g.RMax = DefaultProfileMax * bigR
	}
	if g.Points == 0 {
		g.Points = DefaultProfilePoints
	}
	return g
}

// A WindProfileRow is the outflow and every criterion at one radius.
type WindProfileRow struct {
	Wind      WindPoint // the wind at r: M, v, c_s, ρ, n, P/k_B, T, χ, t_flow = r/v
	TCool     Time      // the wind's own cooling time, Wind.CoolingTime
	Adiabatic bool      // TCool > TFlow: the adiabatic solution is self-consistent here
	// Err says why the criteria could not be evaluated here (χ ≤ 1 beyond
	// RChiOne, or an input out of range); the fields below are then zero.
	Err      error
	Outcomes []Outcome // Outcomes[i] belongs to WindProfile.Criteria[i]: ratio, r_crit, margin, verdict
	Disagree bool      // TellsApart: criteria with a cooling time disagree here
	TCC      Time      // cloud-crushing time of the cloud here, State.TCC
	TCoolMix Time      // cooling time of mixed gas here, State.TCoolMix
	TGrow    Time      // growth time here, State.TGrow
}

// A WindProfile is every criterion evaluated along an outflow for one
// cloud radius.
type WindProfile struct {
	RCloud   Length      // the cloud radius r_cl, the same at every radius
	Criteria []Criterion // the criteria, in order
	Grid     ProfileGrid // the grid, with defaults filled in
	Rows     []WindProfileRow
	// RCool is the smallest radius of the grid's range where the wind's
	// cooling time falls to its flow time (CoolingRadius, refined between
	// the first row that cools and the one before it); Cools reports
	// whether there is one. RCool = RMin when the wind cools there already.
	RCool Length
	Cools bool
}

// Profile evaluates every criterion in cs, with cooling function cf, for
// a cloud of radius rCl at rest at each radius of grid: Evaluate on
// CloudParams(r, rCl), so χ(r) = T(r)/T_cl, M(r) and P(r) are the local
// wind's. Each row also holds the wind there and whether its adiabatic
// solution holds (t_cool > r/v). Rows beyond RChiOne carry the error of
// CloudParams. One Result is reused for every radius and the outcomes of
// all rows share one backing array. It returns an error for a nil cf, an
// invalid criterion, cloud radius or grid.
func (w *Wind) Profile(rCl Length, cf CoolingFunction, cs []Criterion, grid ProfileGrid) (WindProfile, error) {
	if cf == nil {
		return WindProfile{}, fmt.Errorf("wind profile: no cooling function")
	}
	if err := CheckField(FieldRCloud, float64(rCl)); err != nil {
		return WindProfile{}, err
	}
	for i := range cs {
		if err := cs[i].Validate(); err != nil {
			return WindProfile{}, fmt.Errorf("wind profile: criterion %q: %w", cs[i].ID, err)
		}
	}
	g := grid.WithDefaults(w.Params.Radius)
	lo, hi := float64(g.RMin), float64(g.RMax)
	if !(lo > 0 && hi > lo && !math.IsInf(hi, 1)) {
		return WindProfile{}, fmt.Errorf("wind profile: want 0 < r_min < r_max < +Inf, got [%s, %s] cm", num(lo), num(hi))
	}
	if g.Points < 2 || g.Points > maxProfilePoints {
		return WindProfile{}, fmt.Errorf("wind profile: want 2 to %d radii, got %d", maxProfilePoints, g.Points)
	}
	prof := WindProfile{RCloud: rCl, Criteria: cs, Grid: g, Rows: make([]WindProfileRow, g.Points)}
	nc := len(cs)
	flat := make([]Outcome, g.Points*nc)
	var res Result
	step := math.Log(hi/lo) / float64(g.Points-1)
	coolAt := -1
	for i := range prof.Rows {
		r := lo * math.Exp(float64(i)*step)
		if i == g.Points-1 {
			r = hi // exact, free of the rounding of exp
		}
		row := &prof.Rows[i]
		row.Wind = w.At(Length(r))
		row.TCool = w.coolingTime(row.Wind, cf)
		row.Adiabatic = row.TCool > row.Wind.TFlow
		if !row.Adiabatic && coolAt < 0 {
			coolAt = i
		}
		p := w.cloudParams(row.Wind, rCl)
		if err := res.Evaluate(p, cf, cs); err != nil {
			row.Err = fmt.Errorf("cloud at r = %s R: %w", num3(r/float64(w.Params.Radius)), err)
			continue
		}
		row.Outcomes = flat[i*nc : (i+1)*nc : (i+1)*nc]
		copy(row.Outcomes, res.Outcomes)
		row.Disagree = TellsApart(&res)
		row.TCC, row.TCoolMix, row.TGrow = res.TCC, res.TCoolMix, res.TGrow
	}
	switch {
	case coolAt == 0:
		prof.RCool, prof.Cools = prof.Rows[0].Wind.R, true
	case coolAt > 0:
		a, b := float64(prof.Rows[coolAt-1].Wind.R), float64(prof.Rows[coolAt].Wind.R)
		prof.RCool = w.coolingCrossing(cf, a, b, w.coolingFlowSign(a, cf), w.coolingFlowSign(b, cf))
		prof.Cools = true
	}
	return prof, nil
}
