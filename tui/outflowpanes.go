package tui

import (
	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// The panes in the outflow view: the criteria table says where along the
// wind each criterion lets the cloud survive and grow (or, with the
// carried cloud, how each criterion's cloud ended and how constant its
// growth rate was), the derived values are those of the cloud at the
// launch radius, and the chart's details explain the wind: its scales,
// cautions, statuses and assumptions.

// outflowData returns the outflow on screen, nil while it is computed or
// when the wind is not valid.
func (a *App) outflowData() *chartspec.Outflow { return a.chart.Outflow() }

// launchTitle names the state the derived and criteria panes show in the
// outflow view ("at launch, 1 R"), "" in the other views or when the
// wind is not valid.
func (a *App) launchTitle() string {
	if !a.outflowShown() || !a.wind.ok() {
		return ""
	}
	return "at launch, " + quantity.FormatSig(a.cur.wind.launch, 3) + " R"
}

// SetOutflow sets what the pane shows in the outflow view: the outflow
// data (nil while computed), whether the carried cloud is shown, and
// whether the outflow view is on screen.
func (cp *criteriaPane) SetOutflow(o *chartspec.Outflow, carry, on bool) {
	cp.outflow, cp.carry, cp.outflowOn = o, carry, on
}

// outflowTitle is the pane's title in the outflow view.
func (cp criteriaPane) outflowTitle() string {
	if cp.carry {
		return "Criteria: the carried cloud"
	}
	return "Criteria along the wind"
}

// outflowLines renders the outflow table for a body w cells wide: per
// criterion where the cloud survives and grows along the wind (and, wide,
// the verdict at launch), or with the carried cloud its fate, its events
// (wide) and the spread of its growth rate.
func (cp criteriaPane) outflowLines(w int) []string {
	st := cp.styles
	compact := w < compactWidth
	nameW := 24
	switch {
	case compact:
		nameW = 19
	case w >= fullWidth:
		nameW = 26
	}
	o := cp.outflow
	if o != nil && cp.carry && o.Carried == nil {
		o = nil // the profile's data while the carried cloud is computed
	}
	rest := max(0, w-nameW)
	var head string
	switch {
	case cp.carry && compact:
		head = st.fit("  criterion", nameW) + st.fit("fate of the cloud", rest-7) + "spread"
	case cp.carry:
		head = st.fit("  criterion", nameW) + st.fit("fate of the carried cloud", 26) + st.fit("events", max(0, rest-34)) + "spread"
	case compact:
		head = st.fit("  criterion", nameW) + "survives and grows at"
	default:
		head = st.fit("  criterion", nameW) + st.fit("survives and grows at", rest-12) + "at launch"
	}
	lines := []string{st.Dim.Render(st.T(head))}
	for i := range cp.res.Criteria {
		c := &cp.res.Criteria[i]
		name := st.fit(shortName(st, st.T(criterionName(c)), nameW-3), nameW-3) + " "
		if cp.focused && i == cp.selected {
			name = st.Selected.Render(st.cursor() + name)
		} else {
			name = st.Label.Render("  " + name)
		}
		dash := st.T("—")
		var row string
		switch {
		case o == nil:
			row = name + st.Dim.Render(dash)
		case cp.carry && compact:
			row = name + st.fit(st.T(o.Fate(i)), rest-8) + " " + st.T(o.SpreadText(i))
		case cp.carry:
			row = name + st.fit(st.T(o.Fate(i)), 25) + " " + st.fit(st.T(o.Events(i)), max(0, rest-35)) + " " + st.T(o.SpreadText(i))
		case compact:
			row = name + st.fit(st.T(o.Survives(i)), rest-2)
		default:
			verdict := dash
			if c.Cool != model.CoolNone {
				oc := cp.res.Outcomes[i]
				verdict = verdictText(st, oc.Verdict, true, oc.DependsOnConstant)
			}
			row = name + st.fit(st.T(o.Survives(i)), rest-13) + " " + verdict
		}
		if !c.Verified {
			row += st.Unverified.Render(" *")
		}
		lines = append(lines, row)
	}
	return lines
}

// outflowFooter is the legend of the outflow table's marks.
func (cp criteriaPane) outflowFooter(w int) string {
	for _, text := range []string{"* unverified constant · d details", "* unverified · d details"} {
		if visibleLen(text) <= w-2 {
			return text
		}
	}
	return "d details"
}

// SetLaunch names the state the pane shows ("at launch, 1 R"), "" for the
// inputs'.
func (r *readout) SetLaunch(title string) { r.launch = title }

// SetOutflow sets what the outflow details explain: whether the outflow
// view is shown, its inputs, the wind and its launch state, the outflow
// on screen (nil while computed; with the carried clouds when they are
// shown), and the selected criterion.
func (d *detailsPane) SetOutflow(on bool, in *windInputs, we *windEval, o *chartspec.Outflow, sel int) {
	d.outflowOn, d.windIn, d.wind, d.outflow, d.selected = on, in, we, o, sel
}

// outflowDetails explains the outflow view: the wind and its scales, the
// carried cloud of the selected criterion and its growth rate, the
// cautions, the statuses of the model (from memory), the cloud at launch,
// where the criteria let the cloud survive and where they disagree, and
// the model's assumptions.
func (d detailsPane) outflowDetails(wrap func(label, text string), line func(string)) string {
	we, o := d.wind, d.outflow
	if we == nil || !we.ok() {
		msg := "no wind"
		if we != nil {
			msg = oneLine(we.err.Error())
		}
		wrap("not valid:", msg)
		wrap("status:", model.WindStatus)
		return "outflow"
	}
	w := &we.wind
	q := w.Params
	bigR := q.Radius
	inR := func(x model.Length) string {
		return quantity.FormatSig(float64(x/bigR), 3) + " R (" + quantity.Format(model.DimLength, float64(x)) + ")"
	}
	from := ""
	if q.SFR != 0 {
		from = " from SFR = " + quantity.Format(model.DimMassRate, float64(q.SFR)) + " with α = " + quantity.FormatSig(q.EnergyLoading, 3) +
			", β = " + quantity.FormatSig(q.MassLoading, 3)
	}
	if from != "" {
		from = "," + from
	}
	wrap("wind:", "Chevalier & Clegg 1985, adiabatic"+from+": Ė = "+quantity.Format(model.DimPower, float64(w.EnergyRate))+
		", Ṁ = "+quantity.Format(model.DimMassRate, float64(w.MassRate))+", R = "+quantity.Format(model.DimLength, float64(bigR))+
		", v_∞ = (2Ė/Ṁ)^1/2 = "+quantity.Format(model.DimVelocity, float64(w.VInf)))
	wrap("temperature:", "T(0) = "+quantity.Format(model.DimTemperature, float64(w.TCentre))+", T(R) = "+
		quantity.Format(model.DimTemperature, float64(w.TAtR))+"; χ = T_wind/T_cl falls to 1 at "+inR(w.RChiOne)+": no criterion applies beyond")
	if o != nil && o.Carried != nil && d.selected >= 0 && d.selected < len(o.Carried) {
		name := criterionName(&o.Profile.Criteria[d.selected])
		wrap("carried:", name+" (↑/↓ in the criteria pane), launched at rest at "+inR(o.Launch)+": "+o.Fate(d.selected)+
			"; events: "+o.Events(d.selected))
		wrap("growth rate:", o.Growth(d.selected)+"; spread = (max − min)/mean of dm/dt, 0 for a constant rate")
	}
	if o == nil {
		wrap("along r:", "computing…")
	} else {
		for _, c := range report.OutflowCautions(w, &o.Profile) {
			wrap(d.styles.warnMark()+" caution:", c)
		}
		if !o.Profile.Cools {
			wrap("wind cools:", "nowhere on the grid ("+quantity.FormatSig(float64(o.Profile.Grid.RMin/bigR), 3)+"–"+
				quantity.FormatSig(float64(o.Profile.Grid.RMax/bigR), 3)+" R): its own cooling time stays above its flow time r/v")
		}
	}
	wrap("status:", model.WindStatus)
	wrap("loading:", model.WindLoadingStatus)
	line("")
	at := we.at
	wrap("at launch:", "r_0 = "+inR(we.launch)+": χ = "+quantity.FormatSig(at.Chi, 3)+", M = "+quantity.FormatSig(at.Mach, 3)+
		", P/k_B = "+quantity.Format(model.DimPressure, float64(at.Pressure))+" (the derived values and the criteria's verdicts there)")
	if o != nil {
		prof := &o.Profile
		wrap("disagree:", "the criteria with a cooling time disagree at "+o.Disagreement())
		line(d.styles.Dim.Render(d.styles.T("survives and grows along the wind, by criterion (r_cl = " + quantity.Format(model.DimLength, float64(prof.RCloud)) + "):")))
		for i := range prof.Criteria {
			wrap("  "+criterionName(&prof.Criteria[i])+":", o.Survives(i))
		}
	}
	line("")
	for _, a := range model.WindAssumptions() {
		wrap("assumes:", a)
	}
	if d.windIn != nil && !d.windIn.given {
		wrap("inputs:", "SFR, α, β and R of cloudwind's illustrative outflow (not a published set-up); s saves them as [outflow] once one of them is changed")
	}
	return "outflow along r (Chevalier & Clegg 1985)"
}

// outflowInputDetails adds what the outflow view makes of input in: for
// an input the wind sets, where its value comes from there.
func (d detailsPane) outflowInputDetails(in *input, wrap func(label, text string)) {
	if !d.outflowOn || !in.byWind {
		return
	}
	text := "set by the wind at each radius: χ(r) = T_wind(r)/T_cl for a cloud in pressure equilibrium (one μ), M(r) and P(r) of the wind"
	switch in.field {
	case model.FieldMachTurb:
		text = "the outflow has no turbulence: M_turb = 0 along it"
	case model.FieldMuCold, model.FieldMuHot:
		text = "the wind and its clouds have one μ, the scenario's mu (default 0.6); μ_cl and μ_hot apply to the other views"
	}
	if we := d.wind; we != nil && we.ok() && in.field != model.FieldMachTurb && in.field != model.FieldMuCold && in.field != model.FieldMuHot {
		text += "; at the launch radius χ = " + quantity.FormatSig(we.at.Chi, 3) + ", M = " + quantity.FormatSig(we.at.Mach, 3) +
			", P/k_B = " + quantity.Format(model.DimPressure, float64(we.at.Pressure))
	}
	wrap("in the outflow view:", text)
}
