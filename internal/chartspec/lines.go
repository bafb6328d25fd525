package chartspec

import (
	"math"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// ThresholdChart returns r_crit of every radiative criterion against χ,
// or with r.Family that of the selected criterion at several Mach
// numbers; with r.Pin, A's curves are added dashed. Each criterion whose
// constant is unverified (UncertaintyFactor > 1) gets a band from
// Outcome.RCritLow to RCritHigh (not in family mode, nor for A), and the
// runs of r.Runs are placed at their χ and r_cl.
func ThresholdChart(r Request) *LineChart {
	const n = 121
	lo, hi := chiRange(r.Params.Chi)
	xs := grid(lo, hi, n)
	c := &LineChart{
		Title:   "threshold radius r_crit vs χ",
		X:       Axis{Label: "χ = ρ_cl/ρ_hot", Log: true, Min: lo, Max: hi},
		Y:       Axis{Label: "r_crit (pc)", Log: true},
		Note:    "a cloud survives and grows where r_cl lies above a criterion's curve",
		Caption: Caption(r),
	}
	rad := radiative(r.Criteria)
	sel := r.Selected
	if sel < 0 || sel >= len(r.Criteria) {
		sel = 0
	}
	if len(r.Criteria) > 0 && r.Criteria[sel].Cool == model.CoolNone && len(rad) > 0 {
		sel = rad[0]
	}
	add := func(p model.Params, cf model.CoolingFunction, prefix string, dashed bool) {
		if r.Family && !dashed && len(r.Criteria) > 0 {
			machs := []float64{p.Mach / 2, p.Mach, p.Mach * 2, p.Mach * 4}
			ys := make([][]float64, len(machs))
			for k := range ys {
				ys[k] = make([]float64, n)
			}
			var res model.Result
			for i, x := range xs {
				q := p
				q.Chi = math.Pow(10, x)
				err := res.Evaluate(q, cf, r.Criteria)
				for k, m := range machs {
					ys[k][i] = math.NaN()
					if err == nil && res.Reevaluate(m, p.RCloud) == nil {
						ys[k][i] = logPc(res.Outcomes[sel].RCrit)
					}
				}
			}
			for k, m := range machs {
				c.Series = append(c.Series, Series{Name: "M = " + quantity.FormatSig(m, 3), X: xs, Y: ys[k], Index: k})
			}
			c.Title = "threshold radius vs χ: " + CriterionName(&r.Criteria[sel]) + " at four Mach numbers"
			return
		}
		ys := make([][]float64, len(r.Criteria))
		var bandLo, bandHi [][]float64
		if !dashed {
			bandLo, bandHi = make([][]float64, len(r.Criteria)), make([][]float64, len(r.Criteria))
		}
		for _, i := range rad {
			ys[i] = make([]float64, n)
			if bandLo != nil && r.Criteria[i].UncertaintyFactor() > 1 {
				bandLo[i], bandHi[i] = make([]float64, n), make([]float64, n)
			}
		}
		var res model.Result
		for k, x := range xs {
			q := p
			q.Chi = math.Pow(10, x)
			err := res.Evaluate(q, cf, r.Criteria)
			for _, i := range rad {
				ys[i][k] = math.NaN()
				if err == nil {
					ys[i][k] = logPc(res.Outcomes[i].RCrit)
				}
				if bandLo != nil && bandLo[i] != nil {
					bandLo[i][k], bandHi[i][k] = math.NaN(), math.NaN()
					if err == nil {
						bandLo[i][k], bandHi[i][k] = logPc(res.Outcomes[i].RCritLow), logPc(res.Outcomes[i].RCritHigh)
					}
				}
			}
		}
		for _, i := range rad {
			name := CriterionName(&r.Criteria[i])
			c.Series = append(c.Series, Series{Name: prefix + name, X: xs, Y: ys[i], Index: i, Dashed: dashed})
			if bandLo != nil && bandLo[i] != nil {
				u := r.Criteria[i].UncertaintyFactor()
				c.Bands = append(c.Bands, Band{Name: name + " (α ×/÷ " + quantity.FormatSig(u, 3) + ")", X: xs, Lo: bandLo[i], Hi: bandHi[i], Index: i})
			}
		}
	}
	if r.Pin != nil {
		add(r.Pin.Params, r.Pin.Cooling, "A ", true)
		c.DashedName = pinnedName
	}
	add(r.Params, r.Cooling, "", false)
	c.BandFactor = bandFactor(r.Criteria, c.Bands)
	c.Markers = append(c.Markers,
		Marker{Kind: VLine, X: math.Log10(r.Params.Chi), Label: "χ"},
		Marker{Kind: HLine, Y: logPc(r.Params.RCloud), Label: "r_cl"})
	if r.Pin != nil {
		c.Markers = append(c.Markers, Marker{Kind: Point, X: math.Log10(r.Pin.Params.Chi), Y: logPc(r.Pin.Params.RCloud), Label: "A"})
	}
	c.Runs = runMarks(r.Runs, func(p *model.Params) float64 { return logPc(p.RCloud) })
	c.RunsName = quantity.Sanitize(r.RunsName)
	c.Note += runsNote(c.RunsName, len(c.Runs), false)
	extra := []float64{logPc(r.Params.RCloud)}
	for _, m := range c.Runs {
		extra = append(extra, m.Y)
	}
	all := append([]Series(nil), c.Series...)
	for _, b := range c.Bands { // the bands stay inside the axes too
		all = append(all, Series{Y: b.Lo}, Series{Y: b.Hi})
	}
	c.Y.Min, c.Y.Max = seriesRange(all, extra...)
	return c
}

// pinnedName names the dashed curves of scenario A in compare mode.
const pinnedName = "pinned A (sparser)"

// CriterionName is the name people read for c: its label, or its id when
// it has none (a criteria file may leave the label out). Sanitized.
func CriterionName(c *model.Criterion) string {
	if c.Label != "" {
		return quantity.Sanitize(c.Label)
	}
	return quantity.Sanitize(c.ID)
}

// bandFactor words the uncertainty factor of the bands: the factor when
// every band has the same one, else the range of factors; "" without
// bands.
func bandFactor(cs []model.Criterion, bands []Band) string {
	if len(bands) == 0 {
		return ""
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, b := range bands {
		u := cs[b.Index].UncertaintyFactor()
		lo, hi = min(lo, u), max(hi, u)
	}
	f := quantity.FormatSig(lo, 3)
	if hi != lo {
		f += "–" + quantity.FormatSig(hi, 3)
	}
	return "×/÷ " + f
}

// CoolingChart returns Λ(T) of the current cooling function (and of A's
// when pinned) with T_floor, T_cl, T_minmix, T_mix and T_hot marked; a
// temperature outside the table is marked as a warning.
func CoolingChart(r Request) *LineChart {
	const n = 241
	s, err := model.Derive(r.Params, r.Cooling)
	if err != nil {
		return &LineChart{Title: "cooling curve", Note: err.Error()}
	}
	floor, hasFloor := s.Params.Floor() // (0, false) for no floor
	lo := math.Log10(min(1e4, float64(s.Params.TCloud)/2))
	if hasFloor {
		lo = min(lo, math.Log10(float64(floor)/2))
	}
	hi := math.Log10(max(1e8, 2*float64(s.THot)))
	xs := grid(lo, hi, n)
	curve := func(cf model.CoolingFunction) []float64 {
		ys := make([]float64, n)
		for i, x := range xs {
			v := float64(cf.Lambda(model.Temperature(math.Pow(10, x))))
			ys[i] = math.NaN()
			if v > 0 {
				ys[i] = math.Log10(v)
			}
		}
		return ys
	}
	name := "Λ(T)"
	if p, ok := r.Cooling.(*cooling.PowerLaw); ok {
		name = quantity.Sanitize(p.Meta().Name)
	}
	c := &LineChart{
		Title:   "cooling function Λ(T) per n_H²",
		X:       Axis{Label: "T (K)", Log: true, Min: lo, Max: hi},
		Y:       Axis{Label: "Λ (erg cm³ s⁻¹)", Log: true},
		Series:  []Series{{Name: name, X: xs, Y: curve(r.Cooling), Index: 0}},
		Note:    "above the table Λ ∝ T^1/2 (extended); below it Λ = 0; Λ = 0 below T_floor in the model",
		Caption: Caption(r),
	}
	if !hasFloor {
		c.Note = "above the table Λ ∝ T^1/2 (extended); below it Λ = 0; no cooling floor in the model"
	}
	if r.Pin != nil && r.Pin.Cooling != r.Cooling {
		aname := "A: Λ(T)"
		if p, ok := r.Pin.Cooling.(*cooling.PowerLaw); ok {
			aname = "A: " + quantity.Sanitize(p.Meta().Name)
		}
		c.Series = append(c.Series, Series{Name: aname, X: xs, Y: curve(r.Pin.Cooling), Index: 1, Dashed: true})
	}
	outside := func(t model.Temperature) bool {
		p, ok := r.Cooling.(*cooling.PowerLaw)
		return ok && p.Classify(t) != cooling.InTable
	}
	mark := func(t model.Temperature, label string) {
		if t > 0 && !math.IsNaN(float64(t)) {
			c.Markers = append(c.Markers, Marker{Kind: VLine, X: math.Log10(float64(t)), Label: label, Warn: outside(t)})
		}
	}
	if hasFloor && floor != s.Params.TCloud {
		mark(floor, "T_floor")
	}
	mark(s.Params.TCloud, "T_cl")
	mark(s.TMinMix, "T_minmix")
	mark(s.TMix, "T_mix")
	mark(s.THot, "T_hot")
	c.Y.Min, c.Y.Max = seriesRange(c.Series)
	return c
}

// RatioChart returns the timescale ratios of the problem against r_cl
// (each is a power law of r_cl at fixed χ, M and P), with the line 1
// where each ratio crosses its order-unity threshold.
func RatioChart(r Request) *LineChart {
	const n = 121
	c0 := math.Log10(float64(r.Params.RCloud / model.Parsec))
	lo, hi := c0-3, c0+3
	xs := grid(lo, hi, n)
	type ratio struct {
		name string
		get  func(s *model.State) float64
	}
	ratios := []ratio{
		{"t_cool,mix/t_cc", func(s *model.State) float64 { return float64(s.TCoolMix / s.TCC) }},
		{"t_cool,hot/t_cc", func(s *model.State) float64 { return float64(s.TCoolHot / s.TCC) }},
		{"t_cool,minmix/t_shear", func(s *model.State) float64 { return float64(s.TCoolMinMix / s.TShear) }},
		{"t_cool,cl/t_sc,cl", func(s *model.State) float64 { return float64(s.TCoolCold / s.TSoundCold) }},
		{"t_grow/t_cc", func(s *model.State) float64 { return float64(s.TGrow / s.TCC) }},
		{"l_shatter/r_cl", func(s *model.State) float64 { return float64(s.LShatter / s.Params.RCloud) }},
		{"t_drag/t_cc", func(s *model.State) float64 { return float64(s.TDrag / s.TCC) }},
	}
	c := &LineChart{
		Title:   "timescale ratios vs r_cl",
		X:       Axis{Label: "r_cl (pc)", Log: true, Min: lo, Max: hi},
		Y:       Axis{Label: "ratio", Log: true},
		Note:    "survival needs t_cool/t_dyn below the criterion's threshold (1 for Gronke & Oh; see the table)",
		Caption: Caption(r),
	}
	add := func(p model.Params, cf model.CoolingFunction, prefix string, dashed bool) {
		ys := make([][]float64, len(ratios))
		for k := range ys {
			ys[k] = make([]float64, n)
		}
		var res model.Result
		okBase := res.Evaluate(p, cf, r.Criteria) == nil
		for i, x := range xs {
			ok := okBase && res.Reevaluate(p.Mach, model.Length(math.Pow(10, x))*model.Parsec) == nil
			for k, rt := range ratios {
				ys[k][i] = math.NaN()
				if v := rt.get(&res.State); ok && v > 0 && !math.IsInf(v, 0) {
					ys[k][i] = math.Log10(v)
				}
			}
		}
		for k, rt := range ratios {
			c.Series = append(c.Series, Series{Name: prefix + rt.name, X: xs, Y: ys[k], Index: k, Dashed: dashed})
		}
	}
	if r.Pin != nil {
		add(r.Pin.Params, r.Pin.Cooling, "A ", true)
		c.DashedName = pinnedName
	}
	add(r.Params, r.Cooling, "", false)
	c.Markers = []Marker{{Kind: VLine, X: c0, Label: "r_cl"}, {Kind: HLine, Y: 0, Label: "1"}}
	c.Y.Min, c.Y.Max = seriesRange(c.Series, 0)
	return c
}
