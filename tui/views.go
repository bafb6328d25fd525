package tui

import (
	"fmt"
	"math"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// The chart builders turn model evaluations into chart data. They run in
// commands (computeChart), read only their request, and never fail: points
// that cannot be evaluated are NaN, which breaks a curve.

// chiRange is the χ axis of the threshold chart and the regime map, in
// log10: 10 to 10⁴, widened to hold the current χ.
func chiRange(chi float64) (lo, hi float64) {
	lo, hi = 1, 4
	c := math.Log10(chi)
	return min(lo, c-0.5), max(hi, c+0.5)
}

// radiative returns the indices of the criteria that have a threshold.
func radiative(cs []model.Criterion) []int {
	var out []int
	for i := range cs {
		if cs[i].Cool != model.CoolNone {
			out = append(out, i)
		}
	}
	return out
}

// logPc returns log10 of a length in pc, NaN when it is not finite.
func logPc(r model.Length) float64 {
	v := float64(r / model.Parsec)
	if !(v > 0) || math.IsInf(v, 0) {
		return math.NaN()
	}
	return math.Log10(v)
}

// thresholdChart: r_crit of every criterion against χ, or in family mode
// of the selected criterion at several Mach numbers; with a pinned A, A's
// curves dashed.
func thresholdChart(r chartRequest) *LineChart {
	const n = 121
	lo, hi := chiRange(r.params.Chi)
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = lo + (hi-lo)*float64(i)/float64(n-1)
	}
	c := &LineChart{
		Title: "threshold radius r_crit vs χ",
		X:     Axis{Label: "χ = ρ_cl/ρ_hot", Log: true, Min: lo, Max: hi},
		Y:     Axis{Label: "r_crit (pc)", Log: true},
		Note:  "a cloud survives and grows where r_cl lies above a criterion's curve",
	}
	rad := radiative(r.criteria)
	sel := r.selected
	if r.criteria[sel].Cool == model.CoolNone && len(rad) > 0 {
		sel = rad[0]
	}
	add := func(p model.Params, cf model.CoolingFunction, prefix string, dashed bool) {
		if r.family && !dashed {
			machs := []float64{p.Mach / 2, p.Mach, p.Mach * 2, p.Mach * 4}
			ys := make([][]float64, len(machs))
			for k := range ys {
				ys[k] = make([]float64, n)
			}
			var res model.Result
			for i, x := range xs {
				q := p
				q.Chi = math.Pow(10, x)
				err := res.Evaluate(q, cf, r.criteria)
				for k, m := range machs {
					ys[k][i] = math.NaN()
					if err == nil && res.Reevaluate(m, p.RCloud) == nil {
						ys[k][i] = logPc(res.Outcomes[sel].RCrit)
					}
				}
			}
			for k, m := range machs {
				c.Series = append(c.Series, Series{Name: fmt.Sprintf("%s M = %s", r.criteria[sel].ID, quantity.FormatSig(m, 3)), X: xs, Y: ys[k], Index: k})
			}
			c.Title = "threshold radius vs χ: " + quantity.Sanitize(r.criteria[sel].Label) + " at four Mach numbers"
			return
		}
		ys := make([][]float64, len(r.criteria))
		for _, i := range rad {
			ys[i] = make([]float64, n)
		}
		var res model.Result
		for k, x := range xs {
			q := p
			q.Chi = math.Pow(10, x)
			err := res.Evaluate(q, cf, r.criteria)
			for _, i := range rad {
				ys[i][k] = math.NaN()
				if err == nil {
					ys[i][k] = logPc(res.Outcomes[i].RCrit)
				}
			}
		}
		for _, i := range rad {
			c.Series = append(c.Series, Series{Name: prefix + quantity.Sanitize(r.criteria[i].ID), X: xs, Y: ys[i], Index: i, Dashed: dashed})
		}
	}
	if r.pin != nil {
		add(r.pin.params, r.pin.cf, "A ", true)
	}
	add(r.params, r.cf, "", false)
	c.Markers = append(c.Markers,
		Marker{Kind: VLine, X: math.Log10(r.params.Chi), Label: "χ"},
		Marker{Kind: HLine, Y: logPc(r.params.RCloud), Label: "r_cl"})
	if r.pin != nil {
		c.Markers = append(c.Markers, Marker{Kind: Point, X: math.Log10(r.pin.params.Chi), Y: logPc(r.pin.params.RCloud), Label: "A"})
	}
	c.Y.Min, c.Y.Max = seriesRange(c.Series, logPc(r.params.RCloud))
	return c
}

// seriesRange returns a padded y range over every finite point and extra.
func seriesRange(ss []Series, extra ...float64) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	see := func(v float64) {
		if !math.IsNaN(v) && !math.IsInf(v, 0) {
			lo, hi = min(lo, v), max(hi, v)
		}
	}
	for _, s := range ss {
		for _, v := range s.Y {
			see(v)
		}
	}
	for _, v := range extra {
		see(v)
	}
	if math.IsInf(lo, 1) {
		return 0, 1
	}
	if hi-lo < 0.5 {
		mid := (hi + lo) / 2
		lo, hi = mid-0.25, mid+0.25
	}
	pad := 0.05 * (hi - lo)
	return lo - pad, hi + pad
}

// coolingChart: Λ(T) of the current cooling function (and of A's when
// pinned) with T_floor, T_cl, T_minmix, T_mix and T_hot marked; a
// temperature outside the table is marked as a warning.
func coolingChart(r chartRequest) *LineChart {
	const n = 241
	var s model.State
	s, err := model.Derive(r.params, r.cf)
	if err != nil {
		return &LineChart{Title: "cooling curve", Note: err.Error()}
	}
	floor := s.Params.TFloor
	lo := math.Log10(min(1e4, float64(floor)/2, float64(s.Params.TCloud)/2))
	hi := math.Log10(max(1e8, 2*float64(s.THot)))
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = lo + (hi-lo)*float64(i)/float64(n-1)
	}
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
	if p, ok := r.cf.(*cooling.PowerLaw); ok {
		name = quantity.Sanitize(p.Meta().Name)
	}
	c := &LineChart{
		Title:  "cooling function Λ(T) per n_H²",
		X:      Axis{Label: "T (K)", Log: true, Min: lo, Max: hi},
		Y:      Axis{Label: "Λ (erg cm³ s⁻¹)", Log: true},
		Series: []Series{{Name: name, X: xs, Y: curve(r.cf), Index: 0}},
		Note:   "above the table Λ ∝ T^1/2 (extended); below it Λ = 0; Λ = 0 below T_floor in the model",
	}
	if r.pin != nil && r.pin.cf != r.cf {
		aname := "A: Λ(T)"
		if p, ok := r.pin.cf.(*cooling.PowerLaw); ok {
			aname = "A: " + quantity.Sanitize(p.Meta().Name)
		}
		c.Series = append(c.Series, Series{Name: aname, X: xs, Y: curve(r.pin.cf), Index: 1, Dashed: true})
	}
	outside := func(t model.Temperature) bool {
		p, ok := r.cf.(*cooling.PowerLaw)
		return ok && p.Classify(t) != cooling.InTable
	}
	mark := func(t model.Temperature, label string) {
		if t > 0 && !math.IsNaN(float64(t)) {
			c.Markers = append(c.Markers, Marker{Kind: VLine, X: math.Log10(float64(t)), Label: label, Warn: outside(t)})
		}
	}
	if floor != s.Params.TCloud {
		mark(floor, "T_floor")
	}
	mark(s.Params.TCloud, "T_cl")
	mark(s.TMinMix, "T_minmix")
	mark(s.TMix, "T_mix")
	mark(s.THot, "T_hot")
	c.Y.Min, c.Y.Max = seriesRange(c.Series)
	return c
}

// ratioChart: the timescale ratios of the problem against r_cl (each is a
// power law of r_cl at fixed χ, M and P), with the line 1 where each
// ratio crosses its order-unity threshold.
func ratioChart(r chartRequest) *LineChart {
	const n = 121
	c0 := math.Log10(float64(r.params.RCloud / model.Parsec))
	lo, hi := c0-3, c0+3
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = lo + (hi-lo)*float64(i)/float64(n-1)
	}
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
		Title: "timescale ratios vs r_cl",
		X:     Axis{Label: "r_cl (pc)", Log: true, Min: lo, Max: hi},
		Y:     Axis{Label: "ratio", Log: true},
		Note:  "survival needs t_cool/t_dyn below the criterion's threshold (1 for Gronke & Oh; see the table)",
	}
	add := func(p model.Params, cf model.CoolingFunction, prefix string, dashed bool) {
		ys := make([][]float64, len(ratios))
		for k := range ys {
			ys[k] = make([]float64, n)
		}
		var res model.Result
		okBase := res.Evaluate(p, cf, r.criteria) == nil
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
	if r.pin != nil {
		add(r.pin.params, r.pin.cf, "A ", true)
	}
	add(r.params, r.cf, "", false)
	c.Markers = []Marker{{Kind: VLine, X: c0, Label: "r_cl"}, {Kind: HLine, Y: 0, Label: "1"}}
	c.Y.Min, c.Y.Max = seriesRange(c.Series, 0)
	return c
}

// regimeMap: how many radiative criteria predict survival in each cell of
// χ × r_cl (or χ × Mach at the current r_cl). r_crit does not depend on
// r_cl, so a χ column needs one evaluation; Mach rows take the fast path.
func regimeMap(r chartRequest) *RegimeMap {
	nx := max(10, min(200, r.cols))
	ny := max(5, min(100, r.rows))
	xlo, xhi := chiRange(r.params.Chi)
	rc := math.Log10(float64(r.params.RCloud / model.Parsec))
	m := &RegimeMap{NX: nx, NY: ny, Counts: make([]int, nx*ny)}
	m.X = Axis{Label: "χ = ρ_cl/ρ_hot", Log: true, Min: xlo, Max: xhi}
	rad := radiative(r.criteria)
	m.Total = len(rad)
	if r.mapMach {
		m.Title = "criteria predicting survival: χ × Mach at the current r_cl"
		m.Y = Axis{Label: "Mach", Log: true, Min: -1, Max: 1}
		m.Mark = &Marker{Kind: Point, X: math.Log10(r.params.Chi), Y: math.Log10(r.params.Mach), Label: "now"}
	} else {
		m.Title = "criteria predicting survival: χ × r_cl"
		m.Y = Axis{Label: "r_cl (pc)", Log: true, Min: min(-2, rc-1), Max: max(4, rc+1)}
		m.Mark = &Marker{Kind: Point, X: math.Log10(r.params.Chi), Y: rc, Label: "now"}
	}
	var res model.Result
	for i := 0; i < nx; i++ {
		q := r.params
		q.Chi = math.Pow(10, xlo+(xhi-xlo)*(float64(i)+0.5)/float64(nx))
		if res.Evaluate(q, r.cf, r.criteria) != nil {
			for j := 0; j < ny; j++ {
				m.Counts[j*nx+i] = -1 // no valid state: drawn empty
			}
			continue
		}
		for j := 0; j < ny; j++ {
			y := m.Y.Min + (m.Y.Max-m.Y.Min)*(float64(j)+0.5)/float64(ny)
			n := 0
			if r.mapMach {
				if res.Reevaluate(math.Pow(10, y), r.params.RCloud) != nil {
					m.Counts[j*nx+i] = -1
					continue
				}
				for _, k := range rad {
					if res.Outcomes[k].Verdict == model.Survives {
						n++
					}
				}
			} else {
				rcl := math.Pow(10, y)
				for _, k := range rad {
					if o := res.Outcomes[k]; o.HasThreshold() && rcl > float64(o.RCrit/model.Parsec) {
						n++
					}
				}
			}
			m.Counts[j*nx+i] = n
		}
	}
	m.Note = fmt.Sprintf("each cell: how many of the %d radiative criteria predict survival; mixed cells are where they disagree", m.Total)
	return m
}
