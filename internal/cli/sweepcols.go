package cli

import (
	"math"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// A sweepColumn is one column of sweep output.
type sweepColumn struct {
	name        string // column name, e.g. "t_cc_myr"
	unit        string // astropy unit string; "" when dimensionless
	description string
	isString    bool
	num         func(r *model.Result) float64 // display-unit value
	str         func(r *model.Result) string
	jsonKey     []byte // `"name":`, set by sweepColumns
	twin        int    // an earlier column that holds the same value when the criteria share a form; -1 for none
}

// sweepDerivedKeys are the derived quantities every sweep row carries.
var sweepDerivedKeys = []string{
	"t_hot", "t_mix", "t_minmix", "n_cloud", "n_hot", "v_wind", "t_cc", "t_shear", "t_drag",
	"t_cool_hot", "t_cool_mix", "t_cool_minmix", "t_cool_cold", "t_grow", "l_shatter", "mass_cloud",
}

// sweepColumns returns the columns of a sweep with criteria cs: the six
// inputs, the main derived quantities, then per criterion its ratio,
// threshold radius, margin and verdict.
func sweepColumns(cs []model.Criterion) []sweepColumn {
	in := func(name string, k quantity.Kind, desc string, get func(p *model.Params) float64) sweepColumn {
		return sweepColumn{name: quantity.JSONKey(name, k), unit: quantity.UnitASCII(k), description: desc,
			num: func(r *model.Result) float64 { return quantity.Convert(k, get(&r.Params)) }}
	}
	cols := []sweepColumn{
		in("chi", model.Dimensionless, "density contrast rho_cloud/rho_wind (input)", func(p *model.Params) float64 { return p.Chi }),
		in("mach", model.Dimensionless, "wind Mach number against the hot adiabatic sound speed (input)", func(p *model.Params) float64 { return p.Mach }),
		in("pressure", model.DimPressure, "pressure P/k_B (input)", func(p *model.Params) float64 { return float64(p.Pressure) }),
		in("t_cloud", model.DimTemperature, "cloud temperature (input)", func(p *model.Params) float64 { return float64(p.TCloud) }),
		in("radius", model.DimLength, "cloud radius (input)", func(p *model.Params) float64 { return float64(p.RCloud) }),
		in("metallicity", model.DimMetallicity, "metallicity in solar units (input)", func(p *model.Params) float64 { return p.Metallicity }),
	}
	qs := map[string]model.Quantity{}
	for _, q := range model.Quantities() {
		qs[q.Key] = q
	}
	for _, key := range sweepDerivedKeys {
		q, ok := qs[key]
		if !ok {
			panic("cloudwind: unknown derived quantity " + key)
		}
		get := q.Value
		dim := q.Dim
		cols = append(cols, sweepColumn{name: quantity.JSONKey(key, dim), unit: quantity.UnitASCII(dim),
			description: q.Name + ": " + q.Formula + " (" + q.Source + ")",
			num:         func(r *model.Result) float64 { return quantity.Convert(dim, get(&r.State)) }})
	}
	for i := range cols {
		cols[i].twin = -1
	}
	first := len(cols) // index of the first criterion column
	for i := range cs {
		c := &cs[i]
		base := strings.ReplaceAll(c.ID, "-", "_")
		// Criteria with the same τ_cool and τ_dyn share the ratio; with the
		// same α and β too, r_crit and the margin. Their text is formatted
		// once (the worker still compares the values).
		twin := [4]int{-1, -1, -1, -1}
		for j := 0; j < i; j++ {
			d := &cs[j]
			if d.Cool == c.Cool && d.Dyn == c.Dyn && twin[0] < 0 {
				twin[0] = first + 4*j
			}
			if d.Cool == c.Cool && d.Dyn == c.Dyn && d.Alpha == c.Alpha && d.Beta == c.Beta && twin[1] < 0 {
				twin[1], twin[2] = first+4*j+1, first+4*j+2
			}
		}
		label := c.Label + " (" + c.Formula() + ")"
		cols = append(cols,
			sweepColumn{name: base + "_ratio", description: label + ": " + c.Cool.Symbol() + "/" + c.Dyn.String() + " at r_cl",
				num: func(r *model.Result) float64 { return r.Outcomes[i].Ratio }},
			sweepColumn{name: base + "_radius_crit_pc", unit: "pc", description: label + ": threshold radius r_crit",
				num: func(r *model.Result) float64 { return quantity.Convert(model.DimLength, float64(r.Outcomes[i].RCrit)) }},
			sweepColumn{name: base + "_margin", description: label + ": r_cl/r_crit (> 1 survives)",
				num: func(r *model.Result) float64 { return r.Outcomes[i].Margin }},
			sweepColumn{name: base + "_verdict", description: label + ": survives-and-grows or destroyed", isString: true,
				str: func(r *model.Result) string { return r.Outcomes[i].Verdict.String() }},
		)
		for k := 0; k < 3; k++ {
			cols[len(cols)-4+k].twin = twin[k]
		}
	}
	for i := range cols {
		cols[i].jsonKey = append(strconv.AppendQuote(nil, cols[i].name), ':')
	}
	return cols
}

// appendNumber appends v with nine significant figures (enough for a
// 1e-6 cross-check after the reader's own rounding), "nan" or "inf" as
// numpy and astropy read them, or JSON null when json is set.
func appendNumber(b []byte, v float64, json bool) []byte {
	switch {
	case math.IsNaN(v):
		if json {
			return append(b, "null"...)
		}
		return append(b, "nan"...)
	case math.IsInf(v, 1):
		if json {
			return append(b, "null"...)
		}
		return append(b, "inf"...)
	case math.IsInf(v, -1):
		if json {
			return append(b, "null"...)
		}
		return append(b, "-inf"...)
	}
	return strconv.AppendFloat(b, v, 'g', 9, 64)
}
