package report

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// This file holds what the outflow command and the explorer's outflow
// view share: the columns of a wind profile and of a carried cloud, where
// along the wind each criterion lets the cloud survive, the cautions of
// an outflow, and the metadata describing the wind.

// OutflowSchema names the layout of the outflow command's JSON document.
const OutflowSchema = "cloudwind.outflow/1"

// SmallCloudFraction is the largest r_cl/r at which a cloud counts as
// small against its distance from the centre: beyond it the wind's state
// changes across the cloud and the wind-tunnel criteria do not apply as
// they were calibrated (cloudwind's choice of 0.1; no published value).
const SmallCloudFraction = 0.1

// A ProfileField is one column of a wind profile: a Column and the value
// of a row, in display units (Text for string and boolean columns).
type ProfileField struct {
	Column
	Value func(row *model.WindProfileRow) float64
	Flag  func(row *model.WindProfileRow) bool
	Text  func(row *model.WindProfileRow) string
}

// ProfileFields returns the columns of a wind profile along wind w with
// criteria cs: the radius, the wind's state, whether it is adiabatic, the
// cloud's times, then per criterion its ratio, threshold radius, margin
// and verdict, and whether the criteria disagree. Criterion columns of a
// row without a cloud (χ ≤ 1, beyond RChiOne) are NaN and "none".
func ProfileFields(w *model.Wind, cs []model.Criterion) []ProfileField {
	bigR := float64(w.Params.Radius)
	num := func(key string, k quantity.Kind, desc string, get func(row *model.WindProfileRow) float64) ProfileField {
		return ProfileField{Column: Column{Name: quantity.JSONKey(key, k), Unit: quantity.UnitASCII(k), Description: desc},
			Value: func(row *model.WindProfileRow) float64 { return quantity.Convert(k, get(row)) }}
	}
	cloud := func(get func(row *model.WindProfileRow) float64) func(row *model.WindProfileRow) float64 {
		return func(row *model.WindProfileRow) float64 {
			if row.Err != nil {
				return math.NaN()
			}
			return get(row)
		}
	}
	fs := []ProfileField{
		num("r_over_R", model.Dimensionless, "radius in units of the injection radius R", func(row *model.WindProfileRow) float64 { return float64(row.Wind.R) / bigR }),
		num("r", model.DimLength, "radius r from the centre", func(row *model.WindProfileRow) float64 { return float64(row.Wind.R) }),
		num("chi", model.Dimensionless, "density contrast of a cloud in pressure equilibrium, T_wind/T_cl (one mu)", func(row *model.WindProfileRow) float64 { return row.Wind.Chi }),
		num("mach", model.Dimensionless, "wind Mach number v/c_s (Chevalier & Clegg 1985)", func(row *model.WindProfileRow) float64 { return row.Wind.Mach }),
		num("v_wind", model.DimVelocity, "wind speed", func(row *model.WindProfileRow) float64 { return float64(row.Wind.V) }),
		num("cs_hot", model.DimVelocity, "adiabatic sound speed of the wind", func(row *model.WindProfileRow) float64 { return float64(row.Wind.Cs) }),
		num("n_hot", model.DimNumberDensity, "wind particle density rho/(mu m_p)", func(row *model.WindProfileRow) float64 { return float64(row.Wind.N) }),
		num("pressure", model.DimPressure, "wind pressure P/k_B", func(row *model.WindProfileRow) float64 { return float64(row.Wind.Pressure) }),
		num("t_hot", model.DimTemperature, "wind temperature", func(row *model.WindProfileRow) float64 { return float64(row.Wind.T) }),
		num("t_flow", model.DimTime, "flow time r/v", func(row *model.WindProfileRow) float64 { return float64(row.Wind.TFlow) }),
		num("t_cool_wind", model.DimTime, "cooling time of the wind", func(row *model.WindProfileRow) float64 { return float64(row.TCool) }),
		{Column: Column{Name: "adiabatic", Description: "t_cool,wind > r/v: the adiabatic solution is self-consistent here", IsBool: true},
			Flag: func(row *model.WindProfileRow) bool { return row.Adiabatic }},
		num("t_cc", model.DimTime, "cloud-crushing time of the cloud here, chi^1/2 r_cl/v_w (Klein, McKee & Colella 1994)", cloud(func(row *model.WindProfileRow) float64 { return float64(row.TCC) })),
		num("t_cool_mix", model.DimTime, "cooling time of mixed gas here (Gronke & Oh 2018)", cloud(func(row *model.WindProfileRow) float64 { return float64(row.TCoolMix) })),
		num("t_grow", model.DimTime, "mass-growth time here, chi r_cl/(3 v_mix)", cloud(func(row *model.WindProfileRow) float64 { return float64(row.TGrow) })),
	}
	for i := range cs {
		c := &cs[i]
		base := strings.ReplaceAll(c.ID, "-", "_")
		label := c.Label + " (" + c.Formula() + ")"
		out := func(get func(o *model.Outcome) float64) func(row *model.WindProfileRow) float64 {
			return func(row *model.WindProfileRow) float64 {
				if row.Err != nil {
					return math.NaN()
				}
				return get(&row.Outcomes[i])
			}
		}
		fs = append(fs,
			ProfileField{Column: Column{Name: base + "_ratio", Description: label + ": " + c.Cool.Symbol() + "/" + c.Dyn.String() + " at r_cl"},
				Value: out(func(o *model.Outcome) float64 { return o.Ratio })},
			ProfileField{Column: Column{Name: base + "_radius_crit_pc", Unit: "pc", Description: label + ": threshold radius r_crit"},
				Value: out(func(o *model.Outcome) float64 { return quantity.Convert(model.DimLength, float64(o.RCrit)) })},
			ProfileField{Column: Column{Name: base + "_margin", Description: label + ": r_cl/r_crit (> 1 survives)"},
				Value: out(func(o *model.Outcome) float64 { return o.Margin })},
			ProfileField{Column: Column{Name: base + "_verdict", IsString: true, Description: label + ": survives-and-grows, transformed or destroyed; none beyond the radius where chi = 1"},
				Text: func(row *model.WindProfileRow) string {
					if row.Err != nil {
						return "none"
					}
					return row.Outcomes[i].Verdict.String()
				}},
		)
	}
	fs = append(fs, ProfileField{Column: Column{Name: "disagree", Description: "the criteria with a cooling time give different verdicts here", IsBool: true},
		Flag: func(row *model.WindProfileRow) bool { return row.Err == nil && row.Disagree }})
	for i := range fs {
		fs[i].Twin = -1
		fs[i].JSONKey = append(strconv.AppendQuote(nil, fs[i].Name), ':')
	}
	return fs
}

// A CarriedField is one column of a carried cloud's path.
type CarriedField struct {
	Column
	Value func(p *model.CarriedPoint) float64
}

// CarriedFields returns the columns of a carried cloud's path (after the
// criterion's id): radius, time, mass, speeds, χ, cloud radius, branch and
// dm/dt. bigR is the injection radius and m0 the launch mass.
func CarriedFields(bigR model.Length, m0 model.Mass) []CarriedField {
	num := func(key string, k quantity.Kind, desc string, get func(p *model.CarriedPoint) float64) CarriedField {
		return CarriedField{Column: Column{Name: quantity.JSONKey(key, k), Unit: quantity.UnitASCII(k), Description: desc},
			Value: func(p *model.CarriedPoint) float64 { return quantity.Convert(k, get(p)) }}
	}
	fs := []CarriedField{
		num("r_over_R", model.Dimensionless, "radius of the cloud's centre in units of the injection radius R", func(p *model.CarriedPoint) float64 { return float64(p.R / bigR) }),
		num("r", model.DimLength, "radius of the cloud's centre", func(p *model.CarriedPoint) float64 { return float64(p.R) }),
		num("t", model.DimTime, "time since launch", func(p *model.CarriedPoint) float64 { return float64(p.T) }),
		num("m_m0", model.Dimensionless, "cloud mass over its launch mass (the cold mass flux of a steady stream of such clouds over its value at launch)", func(p *model.CarriedPoint) float64 { return p.M }),
		num("mass", model.DimMass, "cloud mass", func(p *model.CarriedPoint) float64 { return p.M * float64(m0) }),
		num("v_cloud", model.DimVelocity, "cloud speed in the galaxy's frame", func(p *model.CarriedPoint) float64 { return float64(p.V) }),
		num("v_wind", model.DimVelocity, "wind speed at the cloud", func(p *model.CarriedPoint) float64 { return float64(p.VWind) }),
		num("chi", model.Dimensionless, "density contrast T_wind/T_cl at the cloud", func(p *model.CarriedPoint) float64 { return p.Chi }),
		num("r_cl", model.DimLength, "cloud radius (3m/(4 pi rho_cl))^1/3 at the local pressure", func(p *model.CarriedPoint) float64 { return float64(p.RCl) }),
		num("branch", model.Dimensionless, "branch weight S: 1 grows, 0 is destroyed", func(p *model.CarriedPoint) float64 { return p.S }),
		num("mdot", model.DimMassRate, "dm/dt of the cloud", func(p *model.CarriedPoint) float64 { return float64(p.MDot) }),
	}
	for i := range fs {
		fs[i].Twin = -1
		fs[i].JSONKey = append(strconv.AppendQuote(nil, fs[i].Name), ':')
	}
	return fs
}

// CarriedSamples returns n points of a carried cloud's path evenly spaced
// in log r from launch to where the run stopped (both included), or only
// the launch point when it did not move.
func CarriedSamples(cc *model.CarriedCloud, n int) []model.CarriedPoint {
	if len(cc.R) == 0 {
		return nil
	}
	lo, hi := float64(cc.R[0]), float64(cc.R[len(cc.R)-1])
	if !(hi > lo) || n < 2 {
		p, _ := cc.AtRadius(cc.R[0])
		return []model.CarriedPoint{p}
	}
	out := make([]model.CarriedPoint, 0, n)
	for i := range n {
		r := lo * math.Pow(hi/lo, float64(i)/float64(n-1))
		if i == n-1 {
			r = hi
		}
		if p, ok := cc.AtRadius(model.Length(r)); ok {
			out = append(out, p)
		}
	}
	return out
}

// A Span is a stretch of radii [Lo, Hi] of a profile's grid.
type Span struct{ Lo, Hi model.Length }

// SurvivalSpans returns, for criterion i of prof, the stretches of the
// grid where the cloud survives (verdict Survives), from grid point to
// grid point.
func SurvivalSpans(prof *model.WindProfile, i int) []Span {
	return spans(prof, func(row *model.WindProfileRow) bool {
		return row.Err == nil && row.Outcomes[i].Verdict == model.Survives
	})
}

// DisagreementSpans returns the stretches where the criteria disagree.
func DisagreementSpans(prof *model.WindProfile) []Span {
	return spans(prof, func(row *model.WindProfileRow) bool { return row.Err == nil && row.Disagree })
}

func spans(prof *model.WindProfile, in func(row *model.WindProfileRow) bool) []Span {
	var out []Span
	open := false
	for j := range prof.Rows {
		row := &prof.Rows[j]
		switch {
		case in(row) && !open:
			out = append(out, Span{row.Wind.R, row.Wind.R})
			open = true
		case in(row):
			out[len(out)-1].Hi = row.Wind.R
		default:
			open = false
		}
	}
	return out
}

// SpansText describes spans in units of R ("0.1–3.2 R, 20–100 R"), with
// "nowhere" for none and "everywhere" when one span covers the grid.
func SpansText(prof *model.WindProfile, ss []Span, bigR model.Length) string {
	if len(ss) == 0 {
		return "nowhere"
	}
	if len(ss) == 1 && len(prof.Rows) > 0 && ss[0].Lo == prof.Rows[0].Wind.R && ss[0].Hi == prof.Rows[len(prof.Rows)-1].Wind.R {
		return "everywhere on the grid"
	}
	parts := make([]string, len(ss))
	for i, s := range ss {
		lo, hi := quantity.FormatSig(float64(s.Lo/bigR), 2), quantity.FormatSig(float64(s.Hi/bigR), 2)
		if s.Lo == s.Hi {
			parts[i] = "at " + lo + " R"
			continue
		}
		parts[i] = lo + "–" + hi + " R"
	}
	return strings.Join(parts, ", ")
}

// OutflowCautions returns the cautions of a wind profile, one line each:
// where the wind stops being adiabatic, where the wind is no hotter than
// the cloud, where the cloud is not small against its distance from the
// centre, and where the inputs leave each criterion's calibrated range.
func OutflowCautions(w *model.Wind, prof *model.WindProfile) []string {
	bigR := w.Params.Radius
	inR := func(r model.Length) string { return quantity.FormatSig(float64(r/bigR), 3) + " R" }
	var out []string
	if prof.Cools {
		out = append(out, fmt.Sprintf("the wind's own cooling time falls below its flow time r/v beyond %s (%s): the adiabatic solution is not self-consistent there",
			inR(prof.RCool), quantity.Format(model.DimLength, float64(prof.RCool))))
	}
	g := prof.Grid
	if w.RChiOne <= g.RMax {
		out = append(out, fmt.Sprintf("beyond %s the wind is no hotter than the cloud (χ ≤ 1): no criterion applies", inR(w.RChiOne)))
	}
	if rLim := model.Length(float64(prof.RCloud) / SmallCloudFraction); rLim > g.RMin {
		out = append(out, fmt.Sprintf("inside %s the cloud (r_cl = %s) is larger than %s of its distance from the centre: the wind changes across it, and the wind-tunnel criteria do not apply as calibrated (cloudwind's choice of %s)",
			inR(rLim), quantity.Format(model.DimLength, float64(prof.RCloud)), quantity.FormatSig(SmallCloudFraction, 2), quantity.FormatSig(SmallCloudFraction, 2)))
	}
	for i := range prof.Criteria {
		c := &prof.Criteria[i]
		left := spans(prof, func(row *model.WindProfileRow) bool { return row.Err == nil && !row.Outcomes[i].InRange() })
		if len(left) == 0 || c.Cool == model.CoolNone {
			continue
		}
		var fields model.FieldSet
		for j := range prof.Rows {
			if row := &prof.Rows[j]; row.Err == nil {
				fields |= row.Outcomes[i].Leaves
			}
		}
		out = append(out, fmt.Sprintf("%s leaves its calibrated range (%s): %s", c.ID, strings.Join(fields.Names(), ", "), SpansText(prof, left, bigR)))
	}
	return out
}

// OutflowMeta describes wind w, the cloud radius rCl and the cooling
// function for ECSV and JSON: the inputs as given, the rates and the
// wind's derived scales, the statuses and the assumptions.
func OutflowMeta(w *model.Wind, rCl model.Length, cooling, program string) []Meta {
	q := w.Params
	var in []Meta
	if q.SFR != 0 {
		in = append(in, KV(quantity.JSONKey("sfr", model.DimMassRate), quantity.Convert(model.DimMassRate, float64(q.SFR))),
			KV("energy_loading", q.EnergyLoading), KV("mass_loading", q.MassLoading))
	} else {
		in = append(in, KV(quantity.JSONKey("energy_rate", model.DimPower), float64(q.EnergyRate)),
			KV(quantity.JSONKey("mass_rate", model.DimMassRate), quantity.Convert(model.DimMassRate, float64(q.MassRate))))
	}
	in = append(in, KV(quantity.JSONKey("injection_radius", model.DimLength), quantity.Convert(model.DimLength, float64(q.Radius))),
		KV("t_cloud_k", float64(q.TCloud)), KV(quantity.JSONKey("radius", model.DimLength), quantity.Convert(model.DimLength, float64(rCl))),
		KV("metallicity_zsun", q.Metallicity), KV("gamma", q.Gamma), KV("mu", q.Mu), KV("mix_cooling", q.MixCooling.String()))
	var assume []any
	for _, a := range model.WindAssumptions() {
		assume = append(assume, a)
	}
	return []Meta{
		KV("program", program),
		KV("inputs", in),
		KV("wind", []Meta{
			KV(quantity.JSONKey("energy_rate", model.DimPower), float64(w.EnergyRate)),
			KV(quantity.JSONKey("mass_rate", model.DimMassRate), quantity.Convert(model.DimMassRate, float64(w.MassRate))),
			KV(quantity.JSONKey("v_inf", model.DimVelocity), quantity.Convert(model.DimVelocity, float64(w.VInf))),
			KV("t_centre_k", float64(w.TCentre)), KV("t_at_injection_radius_k", float64(w.TAtR)),
			KV(quantity.JSONKey("r_chi_one", model.DimLength), quantity.Convert(model.DimLength, float64(w.RChiOne))),
		}),
		KV("cooling", cooling),
		KV("status", model.WindStatus),
		KV("loading_status", model.WindLoadingStatus),
		KV("assumptions", assume),
	}
}
