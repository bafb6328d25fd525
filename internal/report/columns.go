package report

import (
	"fmt"
	"path"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/safetext"
	"cloudwind/internal/suggest"
	"cloudwind/model"
)

// A Column is one column of sweep output.
type Column struct {
	Name        string // column name, e.g. "t_cc_myr"
	Unit        string // astropy unit string; "" when dimensionless
	Description string
	IsString    bool
	IsBool      bool                          // a boolean: ECSV datatype bool (True/False), JSON true/false
	Num         func(r *model.Result) float64 // display-unit value
	Str         func(r *model.Result) string
	JSONKey     []byte // `"name":`, set by sweepColumns
	Twin        int    // an earlier column that holds the same value when the criteria share a form; -1 for none
	// RadiusFree: the value stays the same, bit for bit, when only the
	// cloud radius changes (model.Quantity.RadiusFree), so a sweep reads it
	// once along its radius axis.
	RadiusFree bool
}

// sweepDerivedKeys are the derived quantities every sweep row carries.
var sweepDerivedKeys = []string{
	"t_hot", "t_mix", "t_minmix", "n_cloud", "n_hot", "v_wind", "t_cc", "t_shear", "t_drag",
	"t_cool_hot", "t_cool_mix", "t_cool_minmix", "t_cool_cold", "t_grow", "l_shatter", "mass_cloud",
}

// sweepColumns returns the columns of a sweep with criteria cs: the six
// inputs, the main derived quantities, then per criterion its ratio,
// threshold radius, margin and verdict.
func SweepColumns(cs []model.Criterion) []Column {
	in := func(name string, k quantity.Kind, desc string, get func(p *model.Params) float64) Column {
		return Column{Name: quantity.JSONKey(name, k), Unit: quantity.UnitASCII(k), Description: desc, RadiusFree: name != "radius",
			Num: func(r *model.Result) float64 { return quantity.Convert(k, get(&r.Params)) }}
	}
	cols := []Column{
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
		cols = append(cols, Column{Name: quantity.JSONKey(key, dim), Unit: quantity.UnitASCII(dim),
			Description: q.Name + ": " + q.Formula + " (" + q.Source + ")", RadiusFree: q.RadiusFree(),
			Num: func(r *model.Result) float64 { return quantity.Convert(dim, get(&r.State)) }})
	}
	for i := range cols {
		cols[i].Twin = -1
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
			Column{Name: base + "_ratio", Description: label + ": " + c.Cool.Symbol() + "/" + c.Dyn.String() + " at r_cl",
				Num: func(r *model.Result) float64 { return r.Outcomes[i].Ratio }},
			Column{Name: base + "_radius_crit_pc", Unit: "pc", Description: label + ": threshold radius r_crit",
				Num: func(r *model.Result) float64 { return quantity.Convert(model.DimLength, float64(r.Outcomes[i].RCrit)) }},
			Column{Name: base + "_margin", Description: label + ": r_cl/r_crit (> 1 survives)",
				Num: func(r *model.Result) float64 { return r.Outcomes[i].Margin }},
			Column{Name: base + "_verdict", Description: label + ": survives-and-grows, transformed or destroyed", IsString: true,
				Str: func(r *model.Result) string { return r.Outcomes[i].Verdict.String() }},
		)
		for k := 0; k < 3; k++ {
			cols[len(cols)-4+k].Twin = twin[k]
		}
	}
	for i := range cols {
		cols[i].JSONKey = append(strconv.AppendQuote(nil, cols[i].Name), ':')
	}
	return cols
}

// SelectColumns returns the columns of cols named by spec, a comma list of
// names as in the header, each of which may be a glob (path.Match syntax:
// "*_radius_crit_pc", "t_cool_*"), in the order of the list; a glob's
// matches keep the header's order. A name that matches nothing, an
// invalid glob and a column selected twice are errors; a name that is
// close to a column's suggests it. Twins are remapped to the selection,
// and dropped when the twin is not selected before its column.
func SelectColumns(cols []Column, spec string) ([]Column, error) {
	index := make(map[string]int, len(cols))
	names := make([]string, len(cols))
	for i, c := range cols {
		index[c.Name], names[i] = i, c.Name
	}
	var picked []int
	chosen := make(map[int]bool)
	add := func(i int, item string) error {
		if chosen[i] {
			return fmt.Errorf("column %q is selected twice (by %q)", cols[i].Name, item)
		}
		chosen[i] = true
		picked = append(picked, i)
		return nil
	}
	for _, raw := range strings.Split(spec, ",") {
		item := strings.TrimSpace(raw)
		if item == "" {
			return nil, fmt.Errorf("empty column name in %q (want a comma list such as chi,radius_pc,*_verdict)", safetext.Clip(spec, 60))
		}
		if !strings.ContainsAny(item, `*?[\`) {
			i, ok := index[item]
			if !ok {
				msg := fmt.Sprintf("unknown column %q", safetext.Clip(item, 40))
				s := suggest.Closest(item, names)
				for _, n := range names { // a name without its unit suffix: radius → radius_pc
					if s == "" && strings.HasPrefix(n, item+"_") && strings.Count(n[len(item)+1:], "_") == 0 {
						s = n
					}
				}
				if s != "" {
					return nil, fmt.Errorf("%s (did you mean %q?)", msg, s)
				}
				return nil, fmt.Errorf("%s (run with --format csv and no --columns to see every name)", msg)
			}
			if err := add(i, item); err != nil {
				return nil, err
			}
			continue
		}
		n := 0
		for i, name := range names {
			ok, err := path.Match(item, name)
			if err != nil {
				return nil, fmt.Errorf("invalid pattern %q: %v", safetext.Clip(item, 40), err)
			}
			if ok {
				if err := add(i, item); err != nil {
					return nil, err
				}
				n++
			}
		}
		if n == 0 {
			return nil, fmt.Errorf("pattern %q matches no column", safetext.Clip(item, 40))
		}
	}
	out := make([]Column, len(picked))
	pos := make(map[int]int, len(picked))
	for k, i := range picked {
		pos[i] = k
	}
	for k, i := range picked {
		c := cols[i]
		if t, ok := pos[c.Twin]; c.Twin >= 0 && ok && t < k {
			c.Twin = t
		} else {
			c.Twin = -1
		}
		out[k] = c
	}
	return out, nil
}
