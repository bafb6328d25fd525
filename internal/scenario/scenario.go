package scenario

import (
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"cloudwind/internal/safetext"
	"cloudwind/model"
)

// A Scenario is one cloud-in-wind problem as the explorer saves and loads
// it: a name for people, the inputs and conventions, and the cooling
// function. The file layout is in the package documentation.
type Scenario struct {
	Name        string // shown in the explorer; "" when the file gives none
	Description string // free text; "" when the file gives none
	Demo        bool   // true for cloudwind's fictional demo scenarios

	// Params holds the inputs and conventions in CGS (RCloud in cm, not pc).
	// A zero optional field means the model default, as in model.Params.
	Params model.Params

	// Cooling names the cooling function as the --cooling flag does: a name
	// ("builtin", ...), const:LAMBDA, powerlaw:L0,T0,SLOPE, or the path of a
	// table file, relative to the scenario file's directory. "" means the
	// program's default. This package stores it; the program resolves it.
	Cooling string
	// Table holds settings for a table named by Cooling, in the words of a
	// table's directive lines ("norm: nH2", "columns: T=1 lambda=2"); nil
	// when there are none.
	Table []string

	// Outflow is the [outflow] table, the injection of a Chevalier &
	// Clegg wind; nil when the file has none. The wind's other inputs are
	// the scenario's t_cloud, metallicity and conventions (Wind).
	Outflow *Outflow
}

// Outflow holds the injection of an outflow in CGS (the file gives the
// star-formation and mass rates in M☉ yr⁻¹, the energy rate in erg s⁻¹ and
// the injection radius in pc): either the star-formation rate with the
// loadings, or the two rates, as in model.WindParams.
type Outflow struct {
	SFR           model.MassRate
	EnergyLoading float64
	MassLoading   float64
	EnergyRate    model.Power
	MassRate      model.MassRate
	Radius        model.Length
}

// Wind returns the outflow's model.WindParams, with T_cl, Z and the
// conventions of s.Params, and whether s has an outflow.
func (s *Scenario) Wind() (model.WindParams, bool) {
	if s.Outflow == nil {
		return model.WindParams{}, false
	}
	o, p := s.Outflow, &s.Params
	return model.WindParams{SFR: o.SFR, EnergyLoading: o.EnergyLoading, MassLoading: o.MassLoading,
		EnergyRate: o.EnergyRate, MassRate: o.MassRate, Radius: o.Radius,
		TCloud: p.TCloud, Metallicity: p.Metallicity, Gamma: p.Gamma, Mu: p.Mu,
		Mixture: p.Mixture, HydrogenFraction: p.HydrogenFraction, TFloor: p.TFloor,
		HeatCapacity: p.HeatCapacity, DensityProduct: p.DensityProduct, MixCooling: p.MixCooling}, true
}

// scenarioTables returns the tables of a scenario file.
func scenarioTables() []string {
	return []string{"scenario", "inputs", "conventions", "cooling", "outflow"}
}

// outflowKeys returns the keys of [outflow], which are model.Field… names.
func outflowKeys() []string {
	return []string{model.FieldSFR, model.FieldEnergyLoading, model.FieldMassLoading,
		model.FieldEnergyRate, model.FieldMassRate, model.FieldWindRadius}
}

// scenarioKeys returns the keys of [scenario].
func scenarioKeys() []string { return []string{"name", "description", "demo"} }

// coolingKeys returns the keys of [cooling].
func coolingKeys() []string { return []string{"spec", "table"} }

// inputKeys returns the keys of [inputs], which are model.Field… names.
func inputKeys() []string {
	return []string{model.FieldChi, model.FieldMach, model.FieldPressure, model.FieldTCloud,
		model.FieldRCloud, model.FieldMetallicity, model.FieldMachTurb}
}

// conventionKeys returns the keys of [conventions]; all but mixture are
// model.Field… names.
func conventionKeys() []string {
	return []string{model.FieldGamma, model.FieldMu, model.FieldMuCold, model.FieldMuHot, "mixture",
		model.FieldHydrogenFraction, model.FieldTFloor, model.FieldHeatCapacity, model.FieldDensityProduct, model.FieldMixCooling}
}

// Parse reads a scenario file; name is the file name used in
// errors. Inputs the file leaves out take the values of model.Fiducial(),
// conventions it leaves out take the model defaults, and the result passes
// (model.Params).Validate. Every error is a *ParseError with the file name
// and the line of the offending key or table header; an invalid input also
// wraps the *model.FieldError of Validate, reported on the line of its key.
func Parse(r io.Reader, name string) (Scenario, error) {
	doc, err := ParseTOML(r)
	var s Scenario
	if err == nil {
		s, err = scenarioFrom(doc.Root)
	}
	if err != nil {
		var pe *ParseError
		if errors.As(err, &pe) {
			pe.File = name
		}
		return Scenario{}, err
	}
	return s, nil
}

// scenarioFrom builds a Scenario from a parsed file.
func scenarioFrom(root *Table) (Scenario, error) {
	if len(root.Keys) > 0 {
		k := root.Keys[0]
		v := root.Values[k]
		if slices.Contains(scenarioTables(), k) {
			return Scenario{}, errAt(v.Line, "%s must be a table, as in [%s], not %s", k, k, article(v.Kind))
		}
		return Scenario{}, errAt(v.Line, "key %q is outside any table; put it under [scenario], [inputs], [conventions] or [cooling]", clip(k))
	}
	s := Scenario{Params: model.Fiducial()}
	lines := map[string]int{} // key → line; keys are unique across the tables
	for _, c := range children(root) {
		if !slices.Contains(scenarioTables(), c.key) {
			return Scenario{}, errAt(c.t.Line, "unknown table %s%s", c.header(), suggest(c.key, scenarioTables()))
		}
		if c.array {
			return Scenario{}, errAt(c.t.Line, "write [%s], not [[%s]]", c.key, c.key)
		}
		lines["["+c.key+"]"] = c.t.Line
		set := func(k string, v Value) error {
			lines[k] = v.Line
			if owner := keyTable(k); owner != "" && owner != c.key {
				return errAt(v.Line, "key %q belongs in [%s], not [%s]", k, owner, c.key)
			}
			switch c.key {
			case "scenario":
				return setScenarioKey(&s, k, v)
			case "inputs":
				return setInputKey(&s.Params, k, v)
			case "conventions":
				return setConventionKey(&s.Params, k, v)
			case "outflow":
				if s.Outflow == nil {
					s.Outflow = &Outflow{}
				}
				return setOutflowKey(s.Outflow, k, v)
			}
			return setCoolingKey(&s, k, v)
		}
		for _, k := range c.t.Keys {
			if err := set(k, c.t.Values[k]); err != nil {
				return Scenario{}, err
			}
		}
		for _, sub := range children(c.t) {
			if keyTable(sub.key) == "" {
				return Scenario{}, errAt(sub.t.Line, "unknown table %s: [%s] has no sub-tables", sub.header(), c.key)
			}
			// A known key given a table: the setter reports the type.
			if err := set(sub.key, tableValue(c.t, sub.key)); err != nil {
				return Scenario{}, err
			}
		}
	}
	if _, ok := lines["spec"]; !ok && lines["table"] > 0 {
		return Scenario{}, errAt(lines["table"], "table settings describe a table file, so [cooling] needs spec = \"PATH\" too")
	}
	if err := s.Params.Validate(); err != nil {
		return Scenario{}, errAt(fieldLine(err, lines), "%w", err)
	}
	if _, ok := lines["[outflow]"]; ok && s.Outflow == nil {
		s.Outflow = &Outflow{} // an empty [outflow]: Validate names what is missing
	}
	if w, ok := s.Wind(); ok {
		if s.Params.MuCold != 0 || s.Params.MuHot != 0 {
			l := lines[model.FieldMuCold]
			if l == 0 {
				l = lines[model.FieldMuHot]
			}
			return Scenario{}, errAt(l, "an outflow has one μ for the wind and its clouds: set mu, not mu_cloud or mu_hot")
		}
		if err := w.Validate(); err != nil {
			l := lines["[outflow]"]
			var fe *model.FieldError
			if errors.As(err, &fe) && lines[fe.Field] > 0 {
				l = lines[fe.Field]
			}
			return Scenario{}, errAt(l, "[outflow]: %w", err)
		}
	}
	return s, nil
}

// setOutflowKey sets a key of [outflow]; rates are given in M☉ yr⁻¹, the
// energy rate in erg s⁻¹ and the injection radius in pc. A number may not
// be 0: leave the key out.
func setOutflowKey(o *Outflow, key string, v Value) error {
	if !slices.Contains(outflowKeys(), key) {
		return unknownKey(key, v.Line, "[outflow]", outflowKeys())
	}
	x, err := numberValue(key, v)
	if err != nil {
		return err
	}
	switch key {
	case model.FieldSFR, model.FieldMassRate:
		x *= float64(model.SolarMassPerYear)
	case model.FieldWindRadius:
		x *= float64(model.Parsec)
	}
	if math.IsInf(x, 0) {
		return errAt(v.Line, "%s = %g is out of range", key, v.Num)
	}
	if err := model.CheckWindField(key, x); err != nil {
		return errAt(v.Line, "%w", err)
	}
	switch key {
	case model.FieldSFR:
		o.SFR = model.MassRate(x)
	case model.FieldEnergyLoading:
		o.EnergyLoading = x
	case model.FieldMassLoading:
		o.MassLoading = x
	case model.FieldEnergyRate:
		o.EnergyRate = model.Power(x)
	case model.FieldMassRate:
		o.MassRate = model.MassRate(x)
	case model.FieldWindRadius:
		o.Radius = model.Length(x)
	}
	return nil
}

// keyTable returns the table a scenario key belongs in, or "".
func keyTable(key string) string {
	for _, t := range []struct {
		name string
		keys []string
	}{{"scenario", scenarioKeys()}, {"inputs", inputKeys()}, {"conventions", conventionKeys()}, {"cooling", coolingKeys()}, {"outflow", outflowKeys()}} {
		if slices.Contains(t.keys, key) {
			return t.name
		}
	}
	return ""
}

// fieldLine returns the line to blame for a Validate error: the line of the
// key the *model.FieldError names or, when the file leaves that key out,
// of a key that entered the check (T_hot = χ T_cl μ_hot/μ_cl for chi).
func fieldLine(err error, lines map[string]int) int {
	var fe *model.FieldError
	if errors.As(err, &fe) {
		related := map[string][]string{
			model.FieldChi:    {model.FieldTCloud, model.FieldMuHot, model.FieldMuCold, model.FieldMu},
			model.FieldTFloor: {model.FieldTCloud},
			model.FieldMuCold: {model.FieldMu},
			model.FieldMuHot:  {model.FieldMu},
		}
		for _, k := range append([]string{fe.Field}, related[fe.Field]...) {
			if l, ok := lines[k]; ok {
				return l
			}
		}
	}
	for _, t := range []string{"[inputs]", "[conventions]"} {
		if l, ok := lines[t]; ok {
			return l
		}
	}
	return 1
}

// setScenarioKey sets a key of [scenario].
func setScenarioKey(s *Scenario, key string, v Value) error {
	var err error
	switch key {
	case "name":
		s.Name, err = textValue(key, v)
	case "description":
		s.Description, err = textValue(key, v)
	case "demo":
		err = kindError(key, v, "true or false", KindBool)
		s.Demo = v.Bool
	default:
		err = unknownKey(key, v.Line, "[scenario]", scenarioKeys())
	}
	return err
}

// setInputKey sets a key of [inputs]. The radius is given in pc.
func setInputKey(p *model.Params, key string, v Value) error {
	if !slices.Contains(inputKeys(), key) {
		return unknownKey(key, v.Line, "[inputs]", inputKeys())
	}
	x, err := numberValue(key, v)
	if err != nil {
		return err
	}
	if key == model.FieldRCloud { // given in pc
		r := x * float64(model.Parsec)
		if math.IsInf(r, 0) {
			return errAt(v.Line, "radius = %g pc is out of range", x)
		}
		x = r
	}
	p.SetField(key, x)
	return nil
}

// setConventionKey sets a key of [conventions]. A number may not be 0,
// which model.Params reads as "use the default": the file says that by
// leaving the key out.
func setConventionKey(p *model.Params, key string, v Value) error {
	switch key {
	case "mixture":
		s, err := textValue(key, v)
		if err != nil {
			return err
		}
		m, ok := model.MixtureByName(s)
		if !ok {
			var names []string
			for _, m := range model.Mixtures() {
				names = append(names, m.Name)
			}
			return errAt(v.Line, "unknown mixture %q (want one of %s)%s", clip(s), strings.Join(names, ", "), suggest(s, names))
		}
		p.Mixture = m
		return nil
	case model.FieldHeatCapacity:
		h, err := choiceValue(key, v, []model.HeatCapacity{model.Isochoric, model.Isobaric})
		p.HeatCapacity = h
		return err
	case model.FieldDensityProduct:
		d, err := choiceValue(key, v, model.DensityProducts())
		p.DensityProduct = d
		return err
	case model.FieldMixCooling:
		k, err := choiceValue(key, v, model.MixCoolingKinds())
		p.MixCooling = k
		return err
	}
	if !slices.Contains(conventionKeys(), key) {
		return unknownKey(key, v.Line, "[conventions]", conventionKeys())
	}
	x, err := numberValue(key, v)
	if err != nil {
		return err
	}
	// A value given is used or refused, never replaced by a default
	// (model.CheckField): 0 is checked as 0, except that a floor of 0 K
	// means no floor.
	if err := model.CheckField(key, x); err != nil {
		return errAt(v.Line, "%w", err)
	}
	if key == model.FieldTFloor && x == 0 {
		x = float64(model.NoFloor)
	}
	p.SetField(key, x)
	return nil
}

// choiceValue returns the option whose String form the string value v is.
func choiceValue[T fmt.Stringer](key string, v Value, options []T) (T, error) {
	var zero T
	s, err := textValue(key, v)
	if err != nil {
		return zero, err
	}
	names := make([]string, len(options))
	for i, o := range options {
		if names[i] = o.String(); names[i] == s {
			return o, nil
		}
	}
	want := names[len(names)-1]
	if len(names) > 1 {
		want = strings.Join(names[:len(names)-1], ", ") + " or " + want
	}
	return zero, errAt(v.Line, "unknown %s %q (want %s)%s", key, clip(s), want, suggest(s, names))
}

// setCoolingKey sets a key of [cooling].
func setCoolingKey(s *Scenario, key string, v Value) error {
	switch key {
	case "spec":
		spec, err := textValue(key, v)
		if err == nil && strings.TrimSpace(spec) == "" {
			err = errAt(v.Line, "spec must not be empty; leave [cooling] out for the default cooling function")
		}
		s.Cooling = spec
		return err
	case "table":
		if v.Kind != KindArray {
			return errAt(v.Line, "table must be an array of strings, not %s, as in [\"norm: nH2\", \"columns: T=1 lambda=2\"]", article(v.Kind))
		}
		s.Table = nil
		for _, e := range v.Array {
			t, err := textValue("table", e)
			if err != nil {
				return err
			}
			if strings.TrimSpace(t) == "" {
				return errAt(e.Line, "table settings must not be empty")
			}
			s.Table = append(s.Table, t)
		}
		return nil
	}
	return unknownKey(key, v.Line, "[cooling]", coolingKeys())
}

// textValue returns a string value that is plain text (plainText);
// description may span lines.
func textValue(key string, v Value) (string, error) {
	if err := kindError(key, v, "a string", KindString); err != nil {
		return "", err
	}
	if err := plainText(key, v.Str); err != nil {
		return "", errAt(v.Line, "%w", err)
	}
	return v.Str, nil
}

// plainText refuses text that could act on a terminal or read differently
// from what it is: invalid UTF-8 and every rune the one sanitiser removes
// (safetext.Unsafe: control, format and bidirectional characters, line
// separators), except line feeds in a description, which a multi-line
// string holds.
func plainText(key, s string) error {
	if !utf8.ValidString(s) {
		return fmt.Errorf("%s is not valid UTF-8", key)
	}
	for _, r := range s {
		if r == '\n' && key == "description" {
			continue
		}
		switch {
		case r == '\t' || unicode.IsControl(r):
			return fmt.Errorf("%s contains the control character %U; strings must be plain text", key, r)
		case safetext.Unsafe(r):
			return fmt.Errorf("%s contains %U, a format or bidirectional character or a line separator; strings must be plain text", key, r)
		}
	}
	return nil
}

// checkWritable returns an error when s holds something Parse
// would refuse.
func checkWritable(s Scenario) error {
	texts := []struct{ key, s string }{{"name", s.Name}, {"description", s.Description}, {"cooling spec", s.Cooling}}
	for _, t := range s.Table {
		texts = append(texts, struct{ key, s string }{"table setting", t})
		if strings.TrimSpace(t) == "" {
			return errors.New("empty table setting")
		}
	}
	for _, t := range texts {
		if err := plainText(t.key, t.s); err != nil {
			return err
		}
	}
	if len(s.Table) > 0 && s.Cooling == "" {
		return errors.New("table settings without a cooling spec")
	}
	if w, ok := s.Wind(); ok {
		if s.Params.MuCold != 0 || s.Params.MuHot != 0 {
			return errors.New("an outflow with mu_cloud or mu_hot")
		}
		if err := w.Validate(); err != nil {
			return fmt.Errorf("outflow: %w", err)
		}
	}
	if s.Cooling != "" && strings.TrimSpace(s.Cooling) == "" {
		return errors.New("cooling spec is blank")
	}
	p := s.Params
	if p.Mixture != (model.Mixture{}) {
		if m, ok := model.MixtureByName(p.Mixture.Name); !ok || m != p.Mixture {
			return fmt.Errorf("mixture %q is not one of model.Mixtures()", p.Mixture.Name)
		}
	}
	return p.Validate()
}

// Write writes s in the layout of the package documentation:
// every input, and only the conventions that are not zero (zero means the
// model default). Parse reads the result back to an equal
// Scenario: numbers are written with strconv's shortest round-tripping
// form, and the radius, stored in cm and written in pc, is written as the
// value in pc that converts back to the same cm value (one exists whenever
// the radius was given in pc; otherwise the nearest is written, within a
// unit in the last place). It returns an error, and writes nothing, when s
// holds something Parse would refuse.
func Write(w io.Writer, s Scenario) error {
	if err := checkWritable(s); err != nil {
		return fmt.Errorf("write scenario: %w", err)
	}
	var b strings.Builder
	kv := func(key, value, comment string) {
		line := key + " = " + value
		if comment != "" {
			line = fmt.Sprintf("%-24s # %s", line, comment)
		}
		b.WriteString(line + "\n")
	}
	b.WriteString("# cloudwind scenario\n[scenario]\n")
	kv("name", strconv.Quote(s.Name), "")
	if s.Description != "" {
		kv("description", strconv.Quote(s.Description), "")
	}
	kv("demo", strconv.FormatBool(s.Demo), "")

	p := s.Params
	b.WriteString("\n[inputs]\n")
	kv(model.FieldChi, formatFloat(p.Chi), "rho_cl/rho_hot")
	kv(model.FieldMach, formatFloat(p.Mach), "")
	kv(model.FieldPressure, formatFloat(float64(p.Pressure)), "P/k_B in K cm^-3")
	kv(model.FieldTCloud, formatFloat(float64(p.TCloud)), "K")
	kv(model.FieldRCloud, formatParsecs(p.RCloud), "pc")
	kv(model.FieldMetallicity, formatFloat(p.Metallicity), "Z/Z_sun")
	if p.MachTurb != 0 {
		kv(model.FieldMachTurb, formatFloat(p.MachTurb), "turbulent Mach number of the hot gas")
	}

	var conv []string
	num := func(key string, v float64) {
		if v != 0 {
			conv = append(conv, key+" = "+formatFloat(v))
		}
	}
	num(model.FieldGamma, p.Gamma)
	num(model.FieldMu, p.Mu)
	num(model.FieldMuCold, p.MuCold)
	num(model.FieldMuHot, p.MuHot)
	if p.Mixture != (model.Mixture{}) {
		conv = append(conv, "mixture = "+strconv.Quote(p.Mixture.Name))
	}
	num(model.FieldHydrogenFraction, p.HydrogenFraction)
	if p.TFloor == model.NoFloor {
		conv = append(conv, model.FieldTFloor+" = 0  # no cooling floor")
	} else {
		num(model.FieldTFloor, float64(p.TFloor))
	}
	if p.HeatCapacity != model.Isochoric {
		conv = append(conv, model.FieldHeatCapacity+" = "+strconv.Quote(p.HeatCapacity.String()))
	}
	if p.DensityProduct != model.NH2 {
		conv = append(conv, model.FieldDensityProduct+" = "+strconv.Quote(p.DensityProduct.String()))
	}
	if p.MixCooling != model.CoolNone {
		conv = append(conv, model.FieldMixCooling+" = "+strconv.Quote(p.MixCooling.String()))
	}
	if len(conv) > 0 {
		b.WriteString("\n[conventions]\n" + strings.Join(conv, "\n") + "\n")
	}

	if s.Cooling != "" {
		b.WriteString("\n[cooling]\n")
		kv("spec", strconv.Quote(s.Cooling), "")
		if len(s.Table) > 0 {
			q := make([]string, len(s.Table))
			for i, t := range s.Table {
				q[i] = strconv.Quote(t)
			}
			kv("table", "["+strings.Join(q, ", ")+"]", "")
		}
	}
	if o := s.Outflow; o != nil {
		b.WriteString("\n[outflow]\n")
		msunYr := float64(model.SolarMassPerYear)
		for _, f := range []struct {
			key     string
			v, unit float64
			comment string
		}{{model.FieldSFR, float64(o.SFR), msunYr, "star-formation rate in M_sun/yr"},
			{model.FieldEnergyLoading, o.EnergyLoading, 1, "alpha in Edot = alpha 3e41 erg/s per M_sun/yr"},
			{model.FieldMassLoading, o.MassLoading, 1, "beta in Mdot = beta SFR"},
			{model.FieldEnergyRate, float64(o.EnergyRate), 1, "Edot in erg/s"},
			{model.FieldMassRate, float64(o.MassRate), msunYr, "Mdot in M_sun/yr"},
			{model.FieldWindRadius, float64(o.Radius), float64(model.Parsec), "R in pc"}} {
			if f.v != 0 {
				kv(f.key, formatIn(f.v, f.unit), f.comment)
			}
		}
	}
	if _, err := io.WriteString(w, b.String()); err != nil {
		return fmt.Errorf("write scenario: %w", err)
	}
	return nil
}

// formatFloat writes x in strconv's shortest form that reads back as x,
// which is valid TOML; -0 keeps its sign.
func formatFloat(x float64) string {
	if x == 0 && math.Signbit(x) {
		return "-0.0"
	}
	return strconv.FormatFloat(x, 'g', -1, 64)
}

// formatParsecs writes r (cm) in pc, choosing among the floats nearest to
// r/pc the one that Parse converts back to r exactly, with the
// shortest text.
func formatParsecs(r model.Length) string { return formatIn(float64(r), float64(model.Parsec)) }

// formatIn writes the CGS value v in units of unit, as the value that
// converts back (× unit) to the same v when one exists within two units in
// the last place, else the nearest.
func formatIn(v, unit float64) string {
	y := v / unit
	best := ""
	for _, c := range []float64{y, math.Nextafter(y, math.Inf(1)), math.Nextafter(y, math.Inf(-1)),
		math.Nextafter(math.Nextafter(y, math.Inf(1)), math.Inf(1)),
		math.Nextafter(math.Nextafter(y, math.Inf(-1)), math.Inf(-1))} {
		if c*unit != v {
			continue
		}
		if s := formatFloat(c); best == "" || len(s) < len(best) {
			best = s
		}
	}
	if best == "" {
		return formatFloat(y)
	}
	return best
}
