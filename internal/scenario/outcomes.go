package scenario

import (
	"bufio"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"regexp"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/safetext"
	"cloudwind/model"
)

// Outcomes files hold simulation runs and what happened to the cloud, to
// score the criteria against: CSV with a header row, or ECSV (astropy's
// Enhanced CSV, whose YAML header may give each column a unit). Columns,
// by name (case-insensitive; the unit suffixes of cloudwind's own sweep
// columns are accepted too):
//
//	chi              density contrast
//	mach             wind Mach number
//	pressure         P/k_B in K cm⁻³ (pressure_kcm3), or
//	n_hot            the wind's particle density in cm⁻³ (n_hot_cm3)
//	t_cloud          cloud temperature in K (t_cloud_k)
//	r_cl             cloud radius in pc (radius, radius_pc)
//	outcome          grew, survived, destroyed or transformed (required)
//	metallicity      Z in Z☉ (metallicity_zsun), optional
//	mach_turb        turbulent Mach number, optional
//	label, source    text, optional
//
// A value may carry a unit ("30 pc", "1e4 K"); an ECSV column unit applies
// to the values without one. Inputs a file leaves out take the base
// scenario's values, and LoadOutcomes reports which.

// MaxOutcomeRuns bounds the runs of one outcomes file.
const MaxOutcomeRuns = 100000

// An OutcomesError is a problem in an outcomes file, with its line (0 when
// the problem has none).
type OutcomesError = ParseError

// outcomeColumn is a column LoadOutcomes knows.
type outcomeColumn struct {
	names []string // accepted spellings, lower case, the first canonical
	field string   // model.Field… name of an input; "" for outcome, label and source
	kind  quantity.Kind
}

func outcomeColumns() []outcomeColumn {
	return []outcomeColumn{
		{[]string{"chi"}, model.FieldChi, model.Dimensionless},
		{[]string{"mach"}, model.FieldMach, model.Dimensionless},
		{[]string{"pressure", "pressure_kcm3"}, model.FieldPressure, model.DimPressure},
		{[]string{"n_hot", "n_hot_cm3"}, "n_hot", model.DimNumberDensity},
		{[]string{"t_cloud", "t_cloud_k"}, model.FieldTCloud, model.DimTemperature},
		{[]string{"r_cl", "radius", "radius_pc"}, model.FieldRCloud, model.DimLength},
		{[]string{"metallicity", "metallicity_zsun"}, model.FieldMetallicity, model.DimMetallicity},
		{[]string{"mach_turb"}, model.FieldMachTurb, model.Dimensionless},
		{[]string{"outcome"}, "", 0},
		{[]string{"label"}, "", 0},
		{[]string{"source"}, "", 0},
	}
}

// Outcomes is a loaded outcomes file.
type Outcomes struct {
	Runs []model.SimRun
	// Defaulted lists the inputs the file leaves out, which took the base
	// scenario's values (Field… names, and "pressure" for a file without
	// pressure or n_hot).
	Defaulted []string
}

// ecsvUnit matches a column's entry in an ECSV header: name and unit.
var ecsvUnit = regexp.MustCompile(`name:\s*"?([^",}]+)"?.*?unit:\s*"?([^",}]+)"?`)

// LoadOutcomes reads an outcomes file; name is used in errors. base gives
// the inputs and conventions of the runs that the file does not state.
// Every error names the file and the line.
func LoadOutcomes(r io.Reader, name string, base model.Params) (Outcomes, error) {
	fail := func(line int, format string, a ...any) (Outcomes, error) {
		return Outcomes{}, &ParseError{File: name, Line: line, Err: fmt.Errorf(format, a...)}
	}
	br := bufio.NewReader(io.LimitReader(r, 64<<20+1))
	var body strings.Builder
	units := map[string]string{}
	lineNo, first := 0, true
	delim := ','
	ecsv := false
	for {
		l, err := br.ReadString('\n')
		if l == "" && err != nil {
			if !errors.Is(err, io.EOF) {
				return fail(lineNo, "read: %v", err)
			}
			break
		}
		lineNo++
		if body.Len()+len(l) > 64<<20 {
			return fail(lineNo, "%w: more than 64 MiB", ErrTooLarge)
		}
		t := strings.TrimRight(l, "\r\n")
		if first {
			first = false
			t = strings.TrimPrefix(t, "\uFEFF")
			ecsv = strings.HasPrefix(t, "# %ECSV")
		}
		if strings.HasPrefix(strings.TrimSpace(t), "#") {
			if ecsv {
				if strings.Contains(t, "delimiter: ' '") || strings.Contains(t, `delimiter: " "`) {
					delim = ' '
				}
				if m := ecsvUnit.FindStringSubmatch(t); m != nil {
					units[strings.ToLower(strings.TrimSpace(m[1]))] = strings.TrimSpace(m[2])
				}
			}
			body.WriteString("\n") // keep line numbers
			continue
		}
		if ecsv && delim == ',' && !strings.Contains(t, ",") && strings.Contains(t, " ") {
			delim = ' '
		}
		body.WriteString(t + "\n")
	}
	cr := csv.NewReader(strings.NewReader(body.String()))
	cr.Comma, cr.FieldsPerRecord, cr.TrimLeadingSpace = delim, -1, true
	cr.ReuseRecord = false
	var header []string
	col := map[string]int{} // canonical name → index
	known := outcomeColumns()
	out := Outcomes{}
	for {
		rec, err := cr.Read()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			var pe *csv.ParseError
			if errors.As(err, &pe) {
				return fail(pe.Line, "%v", pe.Err)
			}
			return fail(0, "%v", err)
		}
		line, _ := cr.FieldPos(0)
		if len(rec) == 1 && strings.TrimSpace(rec[0]) == "" {
			continue
		}
		if header == nil {
			header = rec
			for i, h := range rec {
				h = strings.ToLower(strings.TrimSpace(h))
				found := false
				for _, c := range known {
					for _, n := range c.names {
						if h == n {
							if _, dup := col[c.names[0]]; dup {
								return fail(line, "column %q appears twice", safetext.Clip(h, 24))
							}
							col[c.names[0]], found = i, true
						}
					}
				}
				if !found {
					var all []string
					for _, c := range known {
						all = append(all, c.names...)
					}
					return fail(line, "unknown column %q%s (columns: %s)", safetext.Clip(h, 24), suggest(h, all), strings.Join(canonical(known), ", "))
				}
			}
			if _, ok := col["outcome"]; !ok {
				return fail(line, "no outcome column: each run needs one of grew, survived, destroyed or transformed")
			}
			_, hasP := col["pressure"]
			_, hasN := col["n_hot"]
			if hasP && hasN {
				return fail(line, "give pressure or n_hot, not both")
			}
			for _, c := range known {
				if _, ok := col[c.names[0]]; !ok && c.field != "" && c.field != "n_hot" {
					if c.field == model.FieldPressure && hasN {
						continue
					}
					out.Defaulted = append(out.Defaulted, c.field)
				}
			}
			continue
		}
		if len(out.Runs) == MaxOutcomeRuns {
			return fail(line, "%w: more than %d runs", ErrTooLarge, MaxOutcomeRuns)
		}
		if len(rec) != len(header) {
			return fail(line, "%d fields, but the header has %d columns", len(rec), len(header))
		}
		run := model.SimRun{Params: base, Label: fmt.Sprintf("line %d", line)}
		var nHot float64
		for _, c := range known {
			i, ok := col[c.names[0]]
			if !ok {
				continue
			}
			v := strings.TrimSpace(rec[i])
			switch c.names[0] {
			case "outcome":
				o, err := model.ParseRunOutcome(v)
				if err != nil {
					return fail(line, "%v", err)
				}
				run.Outcome = o
			case "label":
				if err := plainText("label", v); err != nil {
					return fail(line, "%v", err)
				}
				if v != "" {
					run.Label = v
				}
			case "source":
				if err := plainText("source", v); err != nil {
					return fail(line, "%v", err)
				}
				run.Source = v
			default:
				if u := units[strings.ToLower(strings.TrimSpace(header[i]))]; u != "" && !hasLetters(v) {
					v += " " + astropyUnit(u)
				}
				x, err := quantity.ParseValue(c.kind, v)
				if err != nil {
					return fail(line, "%s: %v", c.names[0], err)
				}
				if c.field == "n_hot" {
					nHot = x
					continue
				}
				if err := model.CheckField(c.field, x); err != nil {
					return fail(line, "%v", err)
				}
				run.Params.SetField(c.field, x)
			}
		}
		if nHot > 0 { // P/k_B = n_hot T_hot with T_hot = χ T_cl μ_hot/μ_cl (pressure equilibrium)
			q := run.Params.WithDefaults()
			run.Params.Pressure = model.Pressure(nHot * float64(model.HotTemperature(q.TCloud, q.Chi, q.MuCold, q.MuHot)))
		}
		if err := run.Params.Validate(); err != nil {
			return fail(line, "%v", err)
		}
		out.Runs = append(out.Runs, run)
	}
	if header == nil {
		return fail(0, "no header row (want a line of column names such as chi,mach,pressure,t_cloud,r_cl,outcome)")
	}
	if len(out.Runs) == 0 {
		return fail(0, "no runs after the header")
	}
	return out, nil
}

// canonical lists the first spelling of every column.
func canonical(cs []outcomeColumn) []string {
	var out []string
	for _, c := range cs {
		out = append(out, c.names[0])
	}
	return out
}

func hasLetters(s string) bool {
	return strings.IndexFunc(s, func(r rune) bool { return r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' }) >= 0
}

// astropyUnit spells an astropy unit string the way ParseValue reads it.
func astropyUnit(u string) string {
	switch strings.ReplaceAll(u, " ", "") {
	case "K/cm3":
		return "K cm-3"
	case "cm-3", "1/cm3":
		return "cm-3"
	case "solMass":
		return "Msun"
	}
	return u
}
