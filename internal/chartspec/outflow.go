package chartspec

import (
	"errors"
	"math"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// The outflow view: every criterion along a Chevalier & Clegg (1985) wind
// (model.Wind.Profile) and a cloud carried outward through it
// (model.Wind.Carry), as charts against r/R.

// carriedPoints is the number of radii, evenly in log r, at which the
// carried charts sample each path (cloudwind's choice: more than a
// terminal's columns, few enough to stay fast).
const carriedPoints = 121

// An Outflow is the data of the outflow view: the wind of a Request,
// every criterion along it for the request's cloud (r_cl, T_cl, Z), and
// with Request.Carry the cloud carried from the launch radius for each
// criterion. Build it with NewOutflow; it is read-only afterwards.
type Outflow struct {
	Wind    model.Wind
	Profile model.WindProfile // the default grid: 0.1–100 R, 200 radii
	Launch  model.Length      // launch radius r_0 of the carried cloud
	Carried []CarriedRun      // one per criterion, in order; nil without Request.Carry
}

// A CarriedRun is the cloud carried for one criterion: its path and,
// when it grows (Grows), how constant its growth rate is over the
// stretch where it does (model.CarriedCloud.GrowthSpread over
// GrowingPath). Err is the error of Carry; Cloud then holds the path so
// far, if any.
type CarriedRun struct {
	Cloud  model.CarriedCloud
	Spread model.GrowthRateSpread
	Grows  bool
	Err    error
}

// NewOutflow evaluates the outflow of r: the wind (model.NewWind on
// r.Wind), every criterion of r along it for a cloud of radius
// r.Params.RCloud (Profile on the default grid), and with r.Carry the
// cloud launched at rest at r.Launch (default R) and carried to 100 R for
// each criterion. It returns the *model.FieldError of an invalid wind, or
// the error of the profile.
func NewOutflow(r Request) (*Outflow, error) {
	if r.Wind == nil {
		return nil, errors.New("no outflow: the request has no wind")
	}
	w, err := model.NewWind(*r.Wind)
	if err != nil {
		return nil, err
	}
	o := &Outflow{Wind: w, Launch: r.Launch}
	if o.Launch == 0 {
		o.Launch = w.Params.Radius
	}
	if o.Profile, err = o.Wind.Profile(r.Params.RCloud, r.Cooling, r.Criteria, model.ProfileGrid{}); err != nil {
		return nil, err
	}
	if !r.Carry {
		return o, nil
	}
	o.Carried = make([]CarriedRun, len(r.Criteria))
	for i := range r.Criteria {
		cr := &o.Carried[i]
		cr.Cloud, cr.Err = o.Wind.Carry(r.Params.RCloud, r.Cooling, &r.Criteria[i], model.CarrySettings{R0: o.Launch})
		if cr.Err != nil {
			continue
		}
		if lo, hi, ok := cr.Cloud.GrowingPath(); ok {
			if g, err := cr.Cloud.GrowthSpread(lo, hi); err == nil {
				cr.Spread, cr.Grows = g, true
			}
		}
	}
	return o, nil
}

// OutflowCaption describes the outflow of r in one line for exported
// figures: the injection (SFR with the loadings, or the rates), R, the
// cloud (r_cl, T_cl, Z) and the cooling function.
func OutflowCaption(r Request, w *model.Wind) string {
	q := w.Params
	var parts []string
	if q.SFR != 0 {
		parts = append(parts, "SFR = "+quantity.Format(model.DimMassRate, float64(q.SFR)),
			"α = "+quantity.FormatSig(q.EnergyLoading, 3), "β = "+quantity.FormatSig(q.MassLoading, 3))
	}
	parts = append(parts, "Ė = "+quantity.Format(model.DimPower, float64(w.EnergyRate)),
		"Ṁ = "+quantity.Format(model.DimMassRate, float64(w.MassRate)),
		"R = "+quantity.Format(model.DimLength, float64(q.Radius)),
		"r_cl = "+quantity.Format(model.DimLength, float64(r.Params.RCloud)),
		"T_cl = "+quantity.Format(model.DimTemperature, float64(q.TCloud)),
		"Z = "+quantity.Format(model.DimMetallicity, q.Metallicity),
		"cooling: "+coolingName(r))
	return "Chevalier & Clegg 1985 wind: " + strings.Join(parts, ", ")
}

// inR returns log10(x/R) for the outflow's injection radius R, NaN when
// it is not finite.
func (o *Outflow) inR(x model.Length) float64 {
	v := float64(x / o.Wind.Params.Radius)
	if !(v > 0) || math.IsInf(v, 0) {
		return math.NaN()
	}
	return math.Log10(v)
}

// RText words a radius in units of R with three figures: "41.9 R".
func (o *Outflow) RText(x model.Length) string {
	return quantity.FormatSig(float64(x/o.Wind.Params.Radius), 3) + " R"
}

// ProfileChart returns r_crit(r) of every radiative criterion along the
// wind against r/R (log–log), with r_cl as a horizontal line, the radii
// where the criteria disagree as zones (report.DisagreementSpans, each
// grid point's cell), and vertical lines at the launch radius, where the
// wind's own cooling time falls to its flow time (Profile.RCool) and
// where χ falls to 1 (Wind.RChiOne), when they lie on the grid.
func (o *Outflow) ProfileChart(r Request) *LineChart {
	prof := &o.Profile
	bigR := o.Wind.Params.Radius
	n := len(prof.Rows)
	xs := make([]float64, n)
	for j := range prof.Rows {
		xs[j] = o.inR(prof.Rows[j].Wind.R)
	}
	c := &LineChart{
		Title:    "r_crit vs r/R, R = " + quantity.Format(model.DimLength, float64(bigR)),
		X:        Axis{Label: "r/R (R = " + quantity.Format(model.DimLength, float64(bigR)) + ", the injection radius)", Log: true, Min: o.inR(prof.Grid.RMin), Max: o.inR(prof.Grid.RMax)},
		Y:        Axis{Label: "r_crit (pc)", Log: true},
		ZoneName: "criteria disagree",
		Note:     "a cloud survives and grows where r_cl lies above a criterion's curve; adiabatic Chevalier & Clegg 1985 wind (relations from memory)",
		Caption:  OutflowCaption(r, &o.Wind),
	}
	for _, i := range radiative(prof.Criteria) {
		ys := make([]float64, n)
		for j := range prof.Rows {
			ys[j] = math.NaN()
			if row := &prof.Rows[j]; row.Err == nil {
				ys[j] = logPc(row.Outcomes[i].RCrit)
			}
		}
		c.Series = append(c.Series, Series{Name: CriterionName(&prof.Criteria[i]), X: xs, Y: ys, Index: i})
	}
	// Each grid point stands for the cell half a step either side of it in log r.
	half := 0.0
	if n > 1 {
		half = (xs[n-1] - xs[0]) / float64(n-1) / 2
	}
	for _, s := range report.DisagreementSpans(prof) {
		c.Zones = append(c.Zones, Zone{Lo: max(o.inR(s.Lo)-half, c.X.Min), Hi: min(o.inR(s.Hi)+half, c.X.Max)})
	}
	c.Markers = append(c.Markers, Marker{Kind: HLine, Y: logPc(prof.RCloud), Label: "r_cl"},
		Marker{Kind: VLine, X: o.inR(o.Launch), Label: "launch"})
	if prof.Cools {
		c.Markers = append(c.Markers, Marker{Kind: VLine, X: o.inR(prof.RCool), Label: "wind cools", Warn: true})
	}
	if o.Wind.RChiOne <= prof.Grid.RMax {
		c.Markers = append(c.Markers, Marker{Kind: VLine, X: o.inR(o.Wind.RChiOne), Label: "χ = 1", Warn: true})
	}
	c.Y.Min, c.Y.Max = seriesRange(c.Series, logPc(prof.RCloud))
	return c
}

// CarriedCharts returns the carried clouds' m/m₀ (log) and speed v in
// km s⁻¹ against r/R from the launch radius, one curve per criterion's
// branch (model.Wind.Carry with the default settings, launched at rest),
// each to where its run stopped. The events of the criterion r.Selected
// are marked: where the cloud is entrained and where the wind cools on
// its path (on the speed panel), where its mass doubles and where it is
// destroyed (on the mass panel); the notes
// give them and its growth-rate measure, which Gronke & Oh 2020 state is
// constant in such a wind. Without carried runs the charts are empty
// with a note saying so.
func (o *Outflow) CarriedCharts(r Request) (mass, vel *LineChart) {
	bigR := o.Wind.Params.Radius
	end := model.DefaultCarryEnd * bigR
	for i := range o.Carried {
		if o.Carried[i].Err == nil {
			end = o.Carried[i].Cloud.Settings.REnd
			break
		}
	}
	lo, hi := o.inR(o.Launch), o.inR(end)
	caption := OutflowCaption(r, &o.Wind)
	mass = &LineChart{
		Title:   "m/m₀ vs r/R, launched at " + o.RText(o.Launch),
		X:       Axis{Label: "r/R (R = " + quantity.Format(model.DimLength, float64(bigR)) + ")", Log: true, Min: lo, Max: hi},
		Y:       Axis{Label: "m/m₀", Log: true},
		Caption: caption,
	}
	vkms := quantity.Convert(model.DimVelocity, float64(o.Wind.VInf))
	vel = &LineChart{
		Title:   "speed v vs r/R",
		X:       mass.X,
		Y:       Axis{Label: "v (km s⁻¹)", Min: 0, Max: 1.05 * vkms},
		Caption: caption,
	}
	if o.Carried == nil {
		mass.Note = "no carried cloud"
		return mass, vel
	}
	xs := grid(lo, hi, carriedPoints)
	for i := range o.Carried {
		cr := &o.Carried[i]
		if cr.Err != nil || len(cr.Cloud.R) == 0 {
			continue
		}
		cc := &cr.Cloud
		stop := o.inR(cc.R[len(cc.R)-1])
		var px, pm, pv []float64
		add := func(x float64, rr model.Length) {
			p, ok := cc.AtRadius(rr)
			if !ok {
				return
			}
			m := math.NaN()
			if p.M > 0 {
				m = math.Log10(p.M)
			}
			px, pm, pv = append(px, x), append(pm, m), append(pv, quantity.Convert(model.DimVelocity, float64(p.V)))
		}
		for _, x := range xs {
			if x >= stop {
				break
			}
			add(x, model.Length(math.Pow(10, x))*bigR)
		}
		add(stop, cc.R[len(cc.R)-1]) // the end of the run, exactly
		name := CriterionName(&r.Criteria[i])
		mass.Series = append(mass.Series, Series{Name: name, X: px, Y: pm, Index: i})
		vel.Series = append(vel.Series, Series{Name: name, X: px, Y: pv, Index: i})
	}
	mass.Markers = []Marker{{Kind: HLine, Y: math.Log10(model.DoubledMass), Label: "2 m₀"}}
	vel.Markers = []Marker{{Kind: HLine, Y: vkms, Label: "v_∞"}}
	if sel := r.Selected; sel >= 0 && sel < len(o.Carried) && o.Carried[sel].Err == nil {
		cc := &o.Carried[sel].Cloud
		if p, ok := cc.AtRadius(cc.REntrain); ok {
			vel.Markers = append(vel.Markers, Marker{Kind: Point, X: o.inR(cc.REntrain), Y: quantity.Convert(model.DimVelocity, float64(p.V)), Label: "entrained"})
		}
		if finite(float64(cc.RDouble)) {
			mass.Markers = append(mass.Markers, Marker{Kind: Point, X: o.inR(cc.RDouble), Y: math.Log10(model.DoubledMass), Label: "doubled"})
		}
		if finite(float64(cc.RDestroy)) {
			mass.Markers = append(mass.Markers, Marker{Kind: Point, X: o.inR(cc.RDestroy), Y: math.Log10(model.DestroyedMass), Label: "destroyed"})
		}
		if cc.WindCools { // on the speed panel, whose top is free of the mass panel's event labels
			vel.Markers = append(vel.Markers, Marker{Kind: VLine, X: o.inR(cc.RWindCools), Label: "wind cools", Warn: true})
		}
		name := CriterionName(&r.Criteria[sel])
		mass.Note = name + ": " + o.Fate(sel) + o.eventsSuffix(sel)
		vel.Note = name + ": " + o.Growth(sel)
	}
	mass.Y.Min, mass.Y.Max = seriesRange(mass.Series, 0, math.Log10(model.DestroyedMass))
	return mass, vel
}

// Fate words how the carried run of criterion i ended: "destroyed at
// 41.9 R", "reached 100 R, 5.01 m₀" (the mass there), "χ = 1 at 129 R,
// …", "mass cap at …", "time cap at …, …", or the error.
func (o *Outflow) Fate(i int) string {
	if i < 0 || i >= len(o.Carried) {
		return "not carried"
	}
	cr := &o.Carried[i]
	if cr.Err != nil {
		return "failed: " + quantity.Sanitize(cr.Err.Error())
	}
	cc := &cr.Cloud
	with := ""
	if n := len(cc.M); n > 0 {
		with = ", " + quantity.FormatSig(cc.M[n-1], 3) + " m₀"
	}
	switch cc.Stop {
	case model.StopReached:
		return "reached " + o.RText(cc.RStop) + with
	case model.StopColdWind:
		return "χ = 1 at " + o.RText(cc.RStop) + with
	case model.StopDestroyed:
		return "destroyed at " + o.RText(cc.RDestroy)
	case model.StopMassCap:
		return "mass cap at " + o.RText(cc.RStop)
	}
	return "time cap at " + o.RText(cc.RStop) + with
}

// eventsSuffix words the entrainment and doubling of run i, "" for none:
// "; entrained at 3.2 R, doubled at 10.1 R".
func (o *Outflow) eventsSuffix(i int) string {
	if ev := o.Events(i); ev != "—" {
		return "; " + ev
	}
	return ""
}

// Events words where the carried run of criterion i was entrained and
// where its mass doubled ("entrained at 3.2 R, doubled at 10.1 R"), "—"
// for neither.
func (o *Outflow) Events(i int) string {
	if i < 0 || i >= len(o.Carried) || o.Carried[i].Err != nil {
		return "—"
	}
	cc := &o.Carried[i].Cloud
	var ev []string
	if finite(float64(cc.REntrain)) {
		ev = append(ev, "entrained at "+o.RText(cc.REntrain))
	}
	if finite(float64(cc.RDouble)) {
		ev = append(ev, "doubled at "+o.RText(cc.RDouble))
	}
	if len(ev) == 0 {
		return "—"
	}
	return strings.Join(ev, ", ")
}

// Growth words the growth-rate measure of run i: the mean dm/dt over the
// stretch where the cloud grows, the spread (max − min)/mean and the
// slope d ln(dm/dt)/d ln r, with Gronke & Oh 2020's statement that the
// rate is constant in such a wind ([GO20] abstract; no number is given
// there), or that the cloud does not grow.
func (o *Outflow) Growth(i int) string {
	if i < 0 || i >= len(o.Carried) || o.Carried[i].Err != nil {
		return "no growth rate"
	}
	cr := &o.Carried[i]
	if !cr.Grows {
		return "does not grow"
	}
	g := cr.Spread
	return "mean dm/dt " + quantity.Format(model.DimMassRate, float64(g.Mean)) + " over " +
		quantity.FormatSig(float64(g.RLo/o.Wind.Params.Radius), 3) + "–" + o.RText(g.RHi) +
		", spread " + percent(g.Spread) + ", d ln(dm/dt)/d ln r = " + quantity.FormatSig(g.SlopeR, 2) +
		" (Gronke & Oh 2020: constant in such a wind)"
}

// SpreadText is the spread of run i's growth rate as a percentage, "—"
// when it does not grow.
func (o *Outflow) SpreadText(i int) string {
	if i < 0 || i >= len(o.Carried) || !o.Carried[i].Grows {
		return "—"
	}
	return percent(o.Carried[i].Spread.Spread)
}

// percent writes a fraction as a percentage with two figures, "—" when
// it is not finite.
func percent(x float64) string {
	if !finite(x) {
		return "—"
	}
	return quantity.FormatSig(100*x, 2) + "%"
}

// Survives words where the cloud survives and grows along the profile by
// criterion i (report.SurvivalSpans in units of R), "no threshold" for a
// criterion without one.
func (o *Outflow) Survives(i int) string {
	if i < 0 || i >= len(o.Profile.Criteria) || o.Profile.Criteria[i].Cool == model.CoolNone {
		return "no threshold"
	}
	return report.SpansText(&o.Profile, report.SurvivalSpans(&o.Profile, i), o.Wind.Params.Radius)
}

// Disagreement words where the criteria disagree along the profile.
func (o *Outflow) Disagreement() string {
	ds := report.DisagreementSpans(&o.Profile)
	if len(ds) == 0 {
		return "nowhere on the grid"
	}
	return report.SpansText(&o.Profile, ds, o.Wind.Params.Radius)
}
