// Package report builds the documents cloudwind writes for scripts and
// people, shared by the commands and the explorer: the JSON state document
// (schema cloudwind.eval/1), the cooling description and the plan text.
package report

import (
	"fmt"
	"math"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/safetext"

	"cloudwind/cooling"
	"cloudwind/model"
)

// StateSchema names the layout of the state document (cloudwind eval's
// JSON and the explorer's JSON export); it changes only when a field
// changes meaning or disappears.
const StateSchema = "cloudwind.eval/1"

// JSONNumber returns v, or nil (JSON null) when v is NaN or ±Inf.
func JSONNumber(v float64) any {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	return v
}

// jsonInterval returns [min, max] with open ends as null.
func jsonInterval(i model.Interval) []any { return []any{JSONNumber(i.Min), JSONNumber(i.Max)} }

// StateDocument describes an evaluated state for JSON output: inputs,
// cooling function, every derived quantity (keys carry their unit, e.g.
// t_cc_myr), every criterion's outcome, and the cautions.
func StateDocument(r *model.Result, src *cooling.Source, cf model.CoolingFunction, version string) map[string]any {
	q := r.Params
	doc := map[string]any{
		"schema":  StateSchema,
		"version": version,
		"inputs": map[string]any{
			"chi":               q.Chi,
			"mach":              q.Mach,
			"pressure_kcm3":     float64(q.Pressure),
			"t_cloud_k":         float64(q.TCloud),
			"radius_pc":         quantity.Convert(model.DimLength, float64(q.RCloud)),
			"metallicity_zsun":  q.Metallicity,
			"gamma":             q.Gamma,
			"mu_cloud":          q.MuCold,
			"mu_hot":            q.MuHot,
			"mixture":           q.Mixture.Name,
			"hydrogen_fraction": q.HydrogenFraction,
			"t_floor_k":         floorK(q),
			"heat_capacity":     q.HeatCapacity.String(),
			"heat_capacity_f":   q.HeatCapacity.Factor(),
			"density_product":   q.DensityProduct.String(),
			"mix_cooling":       q.MixCooling.String(),
			"mach_turb":         q.MachTurb,
		},
		"cooling": CoolingDocument(src, cf),
	}
	derived := map[string]any{}
	for _, qt := range model.Quantities() {
		derived[quantity.JSONKey(qt.Key, qt.Dim)] = JSONNumber(quantity.Convert(qt.Dim, qt.Value(&r.State)))
	}
	doc["derived"] = derived
	// The growth model and its sensitivity: t_grow under each choice of the
	// cold side's cooling time, in t_cc.
	byKind := map[string]any{}
	for _, k := range model.MixCoolingKinds() {
		byKind[k.String()] = JSONNumber(float64(r.GrowthTimeWith(k) / r.TCC))
	}
	doc["growth_model"] = map[string]any{
		"mix_cooling": q.MixCooling.String(), "default": model.DefaultMixCooling.String(), "reason": model.MixCoolingReason,
		"t_grow_tcc_by_mix_cooling": byKind,
	}
	crit := make([]map[string]any, len(r.Criteria))
	for i := range r.Criteria {
		c, o := &r.Criteria[i], r.Outcomes[i]
		leaves := o.Leaves.Names()
		if leaves == nil {
			leaves = []string{}
		}
		crit[i] = map[string]any{
			"id":             c.ID,
			"label":          c.Label,
			"formula":        c.Formula(),
			"cooling_time":   c.Cool.String(),
			"dynamical_time": c.Dyn.String(),
			"alpha":          JSONNumber(c.Alpha),
			"beta":           JSONNumber(c.Beta),
			"threshold":      JSONNumber(o.Threshold),
			"ratio":          JSONNumber(o.Ratio),
			"radius_crit_pc": JSONNumber(quantity.Convert(model.DimLength, float64(o.RCrit))),
			"radius_crit_range_pc": []any{JSONNumber(quantity.Convert(model.DimLength, float64(o.RCritLow))),
				JSONNumber(quantity.Convert(model.DimLength, float64(o.RCritHigh)))},
			"uncertainty_factor":  c.UncertaintyFactor(),
			"depends_on_constant": o.DependsOnConstant,
			"third_outcome":       c.HasThirdOutcome(),
			"warm_ratio":          JSONNumber(o.WarmRatio),
			"warm_threshold":      JSONNumber(o.WarmThreshold),
			"margin":              JSONNumber(o.Margin),
			"verdict":             o.Verdict.String(),
			"verified":            c.Verified,
			"status":              c.Status,
			"in_range":            o.InRange(),
			"out_of_range":        leaves,
			"calibrated_range": map[string]any{
				"chi": jsonInterval(c.Range.Chi), "mach": jsonInterval(c.Range.Mach), "t_cloud_k": jsonInterval(c.Range.TCloud),
				"mach_turb": jsonInterval(c.Range.MachTurb),
				"status":    c.Range.Status,
			},
			"citation": c.Citation.String(),
			"arxiv":    c.Citation.ArXiv,
			"note":     c.Note,
		}
	}
	doc["criteria"] = crit
	doc["shocked_gas"] = map[string]any{
		"state":          map[bool]string{true: "post-shock (Rankine–Hugoniot, M > 1)", false: "stagnation (M ≤ 1)"}[r.Shocked],
		"t_k":            JSONNumber(float64(r.TShocked)),
		"n_cm3":          JSONNumber(float64(r.NShocked)),
		"t_cool_myr":     JSONNumber(quantity.Convert(model.DimTime, float64(r.TCoolShocked))),
		"used_by":        "criteria with cooling_time shocked (li-2020)",
		"relations_from": "textbook Rankine–Hugoniot and isentropic stagnation relations (from memory)",
	}
	cautions := make([]map[string]string, 0, len(r.Cautions))
	for _, c := range r.Cautions {
		cautions = append(cautions, map[string]string{"field": c.Field, "message": c.Message})
	}
	doc["cautions"] = cautions
	return doc
}

// CoolingName names the cooling function in use.
func CoolingName(src *cooling.Source, cf model.CoolingFunction) string {
	if p, ok := cf.(*cooling.PowerLaw); ok {
		return safetext.Terminal(p.Meta().Name)
	}
	return src.Desc
}

// CoolingDocument describes the cooling function in use for JSON output.
func CoolingDocument(src *cooling.Source, cf model.CoolingFunction) map[string]any {
	out := map[string]any{"spec": src.Spec, "name": CoolingName(src, cf), "z_dependent": src.ZDependent}
	p, ok := cf.(*cooling.PowerLaw)
	if !ok {
		out["normalisation"] = "nH2"
		return out
	}
	m := p.Meta()
	lo, hi := p.ValidRange()
	out["citation"] = m.Citation
	out["source_normalisation"] = m.Normalisation.String()
	out["helium_ratio"] = JSONNumber(m.HeliumRatio)
	out["metallicity_zsun"] = JSONNumber(m.Metallicity)
	out["mixture"] = m.Mixture
	out["historical"] = m.Historical
	out["table_range_k"] = []any{JSONNumber(float64(lo)), JSONNumber(float64(hi))}
	out["caveats"] = nonNil(m.Caveats)
	out["warnings"] = nonNil(m.Warnings)
	return out
}

func nonNil(s []string) []string {
	if s == nil {
		return []string{}
	}
	return s
}

// floorK is the cooling floor in K for JSON: 0 when there is none.
func floorK(p model.Params) float64 {
	tf, _ := p.Floor()
	return float64(tf)
}

// SpreadDocument describes the convention spread (model.ConventionSpread)
// of criteria cs for JSON: per criterion the range of r_crit over every
// convention, how many conventions give each verdict, and each case.
func SpreadDocument(cases []model.ConventionCase, spreads []model.Spread, cs []model.Criterion) []map[string]any {
	out := make([]map[string]any, len(spreads))
	for i, sp := range spreads {
		var rows []map[string]any
		for k, c := range cases {
			rows = append(rows, map[string]any{"heat_capacity": c.HeatCapacity.String(), "density_product": c.DensityProduct.String(),
				"cooling": c.Cooling + 1, "radius_crit_pc": JSONNumber(quantity.Convert(model.DimLength, float64(sp.RCrit[k]))),
				"verdict": sp.Verdict[k].String()})
		}
		counts := map[string]int{}
		for _, v := range model.Verdicts() {
			counts[v.String()] = sp.Count[v]
		}
		out[i] = map[string]any{
			"id": cs[i].ID, "label": cs[i].Label,
			"radius_crit_min_pc": JSONNumber(quantity.Convert(model.DimLength, float64(sp.RCritMin))),
			"radius_crit_max_pc": JSONNumber(quantity.Convert(model.DimLength, float64(sp.RCritMax))),
			"verdict_counts":     counts, "unanimous": sp.Unanimous(), "summary": SpreadSummary(cs[i], sp, len(cases)),
			"cases": rows,
		}
	}
	return out
}

// SpreadSummary says in one line what the spread means for the verdict:
// "survives-and-grows under every convention (6)", or "depends on the
// convention: 4 survive, 2 destroyed".
func SpreadSummary(c model.Criterion, sp model.Spread, n int) string {
	if sp.Unanimous() {
		for _, v := range model.Verdicts() {
			if sp.Count[v] > 0 {
				return fmt.Sprintf("%s under every convention (%d)", v, n)
			}
		}
	}
	var parts []string
	for _, v := range model.Verdicts() {
		if sp.Count[v] > 0 {
			parts = append(parts, fmt.Sprintf("%d %s", sp.Count[v], v))
		}
	}
	return "depends on the convention: " + strings.Join(parts, ", ")
}
