package cli

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"slices"
	"sort"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/internal/scenario"
	"cloudwind/internal/suggest"
	"cloudwind/model"
)

// flagSet wraps flag.FlagSet with one-line errors, suggestions for typos
// and help text with examples.
type flagSet struct {
	fs       *flag.FlagSet
	cmd      string
	synopsis string // usage line and description
	examples string
}

func newFlagSet(cmd, synopsis, examples string) *flagSet {
	fs := flag.NewFlagSet(cmd, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	return &flagSet{fs: fs, cmd: cmd, synopsis: synopsis, examples: examples}
}

// parse parses args. --help prints help to stdout and returns errHelpShown.
func (f *flagSet) parse(e *env) error {
	for _, a := range e.args {
		if a == "--" {
			break
		}
		if a == "-h" || a == "--help" || a == "-help" {
			f.printHelp(e.stdout)
			return errHelpShown
		}
	}
	if err := f.fs.Parse(e.args); err != nil {
		return f.explain(err)
	}
	if f.fs.NArg() > 0 {
		return usagef("unexpected argument %q (flags start with --; run 'cloudwind %s --help')", sanitizeArg(f.fs.Arg(0)), f.cmd)
	}
	return nil
}

// explain rewrites the flag package's errors as one line with a hint.
func (f *flagSet) explain(err error) error {
	msg := err.Error()
	const undefined = "flag provided but not defined: "
	if name, ok := strings.CutPrefix(msg, undefined); ok {
		name = strings.TrimLeft(name, "-")
		var names []string
		f.fs.VisitAll(func(fl *flag.Flag) { names = append(names, fl.Name) })
		hint := fmt.Sprintf("run 'cloudwind %s --help' for the flags", f.cmd)
		if s := suggest.Closest(name, names); s != "" {
			hint = fmt.Sprintf("did you mean --%s?", s)
		}
		return usagef("unknown flag --%s (%s)", sanitizeArg(name), hint)
	}
	if name, ok := strings.CutPrefix(msg, "flag needs an argument: "); ok {
		return usagef("--%s needs a value", strings.TrimLeft(sanitizeArg(name), "-"))
	}
	// The flag package's "invalid value %q for flag -NAME: ERR": our Set
	// methods word ERR; name the flag the way it is typed.
	if rest, ok := strings.CutPrefix(msg, "invalid value "); ok {
		if i := strings.Index(rest, " for flag -"); i >= 0 {
			name, why, _ := strings.Cut(rest[i+len(" for flag -"):], ": ")
			return usagef("--%s: %s", sanitizeArg(name), sanitizeArg(why))
		}
	}
	return usagef("%s", sanitizeArg(msg))
}

func (f *flagSet) printHelp(w io.Writer) {
	const col = 28 // where the usage text starts
	var b bytes.Buffer
	for _, l := range strings.Split(strings.TrimSpace(f.synopsis), "\n") {
		b.WriteString(report.FitLines(l, report.TextWidth) + "\n")
	}
	b.WriteString("\nFlags:\n")
	pad := strings.Repeat(" ", col)
	f.fs.VisitAll(func(fl *flag.Flag) {
		name, usage := flag.UnquoteUsage(fl)
		line := "  --" + fl.Name
		if name != "" {
			line += " " + name
		}
		// The default goes at the end of the first line of the usage, so
		// that a multi-line usage does not seem to give it to its last line.
		first, rest, multi := strings.Cut(usage, "\n")
		if fl.DefValue != "" && fl.DefValue != "false" {
			first += fmt.Sprintf(" (default %s)", fl.DefValue)
		}
		parts := []string{first}
		if multi {
			parts = append(parts, strings.Split(rest, "\n")...)
		}
		head := line + strings.Repeat(" ", max(1, col-len(line)))
		if len(line) > col-2 {
			b.WriteString(line + "\n")
			head = pad
		}
		for _, p := range parts {
			for _, l := range report.Wrap(p, report.TextWidth, head, pad) {
				b.WriteString(strings.TrimRight(l, " ") + "\n")
			}
			head = pad
		}
	})
	if f.examples != "" {
		fmt.Fprintf(&b, "\nExamples:\n%s\n", strings.TrimRight(f.examples, "\n"))
	}
	w.Write(b.Bytes())
}

// float defines a number flag without a unit, read by model.ScanNumber (so
// 10^x is accepted) rather than the flag package's own parser.
func (f *flagSet) float(p *float64, name string, def float64, usage string) {
	*p = def
	f.fs.Var(&numberFlag{f: p}, name, usage)
}

// int defines a whole-number flag from lo to hi; values out of range are
// refused with the one range wording ("must be at least 2 (got 1)").
func (f *flagSet) int(p *int, name string, def, lo, hi int, usage string) {
	*p = def
	f.fs.Var(&numberFlag{i: p, lo: lo, hi: hi}, name, usage)
}

// A numberFlag is a flag.Value holding a float64 (f) or an int (i, from lo
// to hi).
type numberFlag struct {
	f      *float64
	i      *int
	lo, hi int
}

func (n *numberFlag) String() string {
	switch {
	case n.f != nil:
		return model.FormatNumber(*n.f, 6)
	case n.i != nil:
		return strconv.Itoa(*n.i)
	}
	return ""
}

func (n *numberFlag) Set(s string) error {
	t := strings.TrimSpace(s)
	v, k, err := model.ScanNumber(t)
	if errors.Is(err, model.ErrNumberRange) {
		return fmt.Errorf("%q is out of range", sanitizeArg(t))
	}
	if err != nil || k != len(t) {
		if n.i != nil {
			return fmt.Errorf("want a whole number (got %q)", sanitizeArg(t))
		}
		return fmt.Errorf("want a number without a unit (got %q)", sanitizeArg(t))
	}
	if n.f != nil {
		*n.f = v
		return nil
	}
	if v != math.Trunc(v) {
		return fmt.Errorf("want a whole number (got %q)", sanitizeArg(t))
	}
	switch {
	case v < float64(n.lo):
		return fmt.Errorf("must be at least %d (got %s)", n.lo, model.FormatNumber(v, 6))
	case v > float64(n.hi):
		return fmt.Errorf("must not exceed %d (got %s)", n.hi, model.FormatNumber(v, 6))
	}
	*n.i = int(v)
	return nil
}

// set reports whether the named flag was given on the command line.
func (f *flagSet) set(name string) bool {
	found := false
	f.fs.Visit(func(fl *flag.Flag) {
		if fl.Name == name {
			found = true
		}
	})
	return found
}

// scenarioFlags are the inputs shared by every command that evaluates a
// scenario. Values are strings so that they may carry units.
type scenarioFlags struct {
	chi, mach, pressure, tCloud, radius, metallicity string
	gamma, mu, muCloud, muHot, hydrogen, tFloor      string
	machTurb                                         string
	mixture, heatCapacity, densityProduct, mixCool   string
	cooling, criteria                                string
	table                                            tableSettings

	scenario string             // --scenario: a scenario file that gives the base inputs
	fs       *flagSet           // the flag set registered on, to tell given flags from defaults
	base     *scenario.Scenario // the loaded --scenario file, after load
}

// scenarioFlag describes one numeric scenario flag.
type scenarioFlag struct {
	name  string        // flag name without dashes
	field string        // model.Field… it sets
	kind  quantity.Kind // dimension for units
	ptr   func(*scenarioFlags) *string
	def   string
	usage string
}

// numericScenarioFlags lists the numeric scenario flags in help order.
func numericScenarioFlags() []scenarioFlag {
	fid := model.Fiducial()
	g := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
	return []scenarioFlag{
		{"chi", model.FieldChi, model.Dimensionless, func(s *scenarioFlags) *string { return &s.chi }, g(fid.Chi), "density contrast χ = ρ_cloud/ρ_wind (> 1)"},
		{"mach", model.FieldMach, model.Dimensionless, func(s *scenarioFlags) *string { return &s.mach }, g(fid.Mach), "wind Mach number against the hot adiabatic sound speed"},
		{"pressure", model.FieldPressure, model.DimPressure, func(s *scenarioFlags) *string { return &s.pressure }, g(float64(fid.Pressure)), "pressure P/k_B in K cm-3 (or with a unit: \"1e-13 erg cm-3\", \"1e-14 Pa\")"},
		{"t-cloud", model.FieldTCloud, model.DimTemperature, func(s *scenarioFlags) *string { return &s.tCloud }, g(float64(fid.TCloud)), "cloud temperature in K (or \"1 keV\")"},
		{"radius", model.FieldRCloud, model.DimLength, func(s *scenarioFlags) *string { return &s.radius }, "1 pc", "cloud radius: number with optional unit pc (default), kpc, au, km, m, cm"},
		{"metallicity", model.FieldMetallicity, model.DimMetallicity, func(s *scenarioFlags) *string { return &s.metallicity }, g(fid.Metallicity), "metallicity Z in solar units"},
		{"mach-turb", model.FieldMachTurb, model.Dimensionless, func(s *scenarioFlags) *string { return &s.machTurb }, "0", "turbulent Mach number M_turb of the hot gas (turbulent criteria)"},
		{"gamma", model.FieldGamma, model.Dimensionless, func(s *scenarioFlags) *string { return &s.gamma }, "5/3", "adiabatic index γ"},
		{"mu", model.FieldMu, model.Dimensionless, func(s *scenarioFlags) *string { return &s.mu }, g(model.DefaultMu), "mean molecular weight μ of both phases"},
		{"mu-cloud", model.FieldMuCold, model.Dimensionless, func(s *scenarioFlags) *string { return &s.muCloud }, "", "μ of the cloud, if different (then T_hot = χ T_cl μ_hot/μ_cl)"},
		{"mu-hot", model.FieldMuHot, model.Dimensionless, func(s *scenarioFlags) *string { return &s.muHot }, "", "μ of the wind, if different"},
		{"hydrogen-fraction", model.FieldHydrogenFraction, model.Dimensionless, func(s *scenarioFlags) *string { return &s.hydrogen }, "", "hydrogen mass fraction X (default: that of --mixture)"},
		{"t-floor", model.FieldTFloor, model.DimTemperature, func(s *scenarioFlags) *string { return &s.tFloor }, "", "cooling floor in K: Λ = 0 below it (default: the cloud temperature; 0 for no floor,\nso that Λ applies wherever the cooling function has values)"},
	}
}

// register adds the scenario flags to f.
func (s *scenarioFlags) register(f *flagSet) { s.registerExcept(f) }

// registerExcept adds the scenario flags but the numeric ones named in
// skip, which stay empty (the model default, or the --scenario file's
// value): outflow takes χ, M and P from its wind.
func (s *scenarioFlags) registerExcept(f *flagSet, skip ...string) {
	for _, sf := range numericScenarioFlags() {
		if slices.Contains(skip, sf.name) {
			continue
		}
		f.fs.StringVar(sf.ptr(s), sf.name, sf.def, sf.usage)
	}
	var mix []string
	for _, m := range model.Mixtures() {
		mix = append(mix, m.Name)
	}
	f.fs.StringVar(&s.mixture, "mixture", model.Asplund2009.Name, "solar mixture for n_H: "+strings.Join(mix, ", "))
	f.fs.StringVar(&s.heatCapacity, "heat-capacity", "isochoric", "f in t_cool = f n k T/(𝒩 Λ): isochoric (3/2) or isobaric (5/2)")
	f.fs.StringVar(&s.densityProduct, "density-product", "nh2", "𝒩 in t_cool: nh2 (n_H², physical), n2 (n², total particles) or neni (n_e n_i, fully ionised)")
	f.fs.StringVar(&s.mixCool, "mix-cooling", model.DefaultMixCooling.String(), "the growth model: the cold side's cooling time in v_mix, t_grow, l_cool,cl and the evolution:\nminmix (the shortest along the mixing isobar; cloudwind's choice, because t_cool at the\nfloor T_cl sits on the steep edge of the cooling table), cold (at T_cl), mix or hot")
	registerCoolingFlags(f, &s.cooling, &s.table, "cooling", "table")
	f.fs.StringVar(&s.criteria, "criteria", "", "TOML file that corrects or adds criteria ('-' for stdin)")
	f.fs.StringVar(&s.scenario, "scenario", "", "start from this scenario file (TOML, as the explorer saves it; see README);\nthe other flags given override its values")
	s.fs = f
}

// given reports whether the named flag was on the command line.
func (s *scenarioFlags) given(name string) bool { return s.fs != nil && s.fs.set(name) }

// load refuses more than one reader of standard input, then reads the
// --scenario file, if one is named, into s.base, and takes its cooling
// function and table settings unless --cooling or --table were given. A
// table path in the file is relative to the file's directory. Every
// command calls it before parse and source.
func (s *scenarioFlags) load(e *env) error {
	stdin := 0
	for _, v := range []string{s.scenario, s.cooling, s.criteria} {
		if v == "-" {
			stdin++
		}
	}
	if stdin > 1 {
		return usagef("only one of --scenario, --cooling and --criteria can read standard input")
	}
	if s.scenario == "" || s.base != nil {
		return nil
	}
	r, name, closeFn, err := openInput(e, s.scenario)
	if err != nil {
		return fmt.Errorf("--scenario: %w", err)
	}
	sc, err := scenario.Parse(r, name)
	closeFn()
	if err != nil {
		return fmt.Errorf("--scenario: %w", err)
	}
	if s.scenario != "-" {
		sc.Cooling = scenario.CoolingSpec(sc.Cooling, filepath.Dir(s.scenario))
	}
	if !s.given("cooling") && sc.Cooling != "" {
		s.cooling = sc.Cooling
		if !s.given("table") {
			s.table = tableSettings(sc.Table)
		}
	}
	s.base = &sc
	return nil
}

// flagForField maps a model.Field… name to the flag that sets it.
func flagForField(field string) string {
	switch field {
	case model.FieldHeatCapacity, model.FieldDensityProduct, model.FieldMixCooling:
		return "--" + strings.ReplaceAll(field, "_", "-")
	}
	for _, sf := range numericScenarioFlags() {
		if sf.field == field {
			return "--" + sf.name
		}
	}
	return field
}

// source resolves --cooling and its --table settings.
func (s *scenarioFlags) source(e *env) (*coolingSource, error) {
	return resolveCooling(e, "--cooling", s.cooling, s.table)
}

// params loads the --scenario file, parses the scenario flags over it into
// model.Params and validates them.
func (s *scenarioFlags) params(e *env) (model.Params, error) {
	if err := s.load(e); err != nil {
		return model.Params{}, err
	}
	p, err := s.parse()
	if err != nil {
		return p, err
	}
	if err := p.Validate(); err != nil {
		return p, fieldUsage(err)
	}
	return p, nil
}

// parse reads the scenario flags into model.Params without validating
// them; an empty numeric flag leaves its field zero (the default). Over a
// loaded --scenario file only the flags given on the command line apply.
func (s *scenarioFlags) parse() (model.Params, error) {
	var p model.Params
	// apply reports whether a flag is to be read: always without a
	// scenario file, and over one only when given.
	apply := func(name string) bool { return s.base == nil || s.given(name) }
	if s.base != nil {
		p = s.base.Params
	}
	for _, sf := range numericScenarioFlags() {
		if !apply(sf.name) {
			continue
		}
		raw := strings.TrimSpace(*sf.ptr(s))
		if raw == "" {
			continue // optional: model default
		}
		if sf.name == "gamma" && raw == "5/3" {
			p.Gamma = model.DefaultGamma
			continue
		}
		v, err := quantity.ParseValue(sf.kind, raw)
		if err != nil {
			return p, usagef("--%s: %v", sf.name, err)
		}
		// A value given is used or refused, never replaced by a default:
		// 0 is checked as 0, except that a floor of 0 K means no floor.
		if err := model.CheckField(sf.field, v); err != nil {
			return p, fieldUsage(err)
		}
		if sf.field == model.FieldTFloor && v == 0 {
			v = float64(model.NoFloor)
		}
		p.SetField(sf.field, v)
	}
	if apply("mixture") {
		m, ok := model.MixtureByName(s.mixture)
		if !ok {
			return p, usagef("--mixture: unknown mixture %q (want one of %s)", sanitizeArg(s.mixture), mixtureNames())
		}
		p.Mixture = m
	}
	if apply("heat-capacity") {
		switch s.heatCapacity {
		case "isochoric":
			p.HeatCapacity = model.Isochoric
		case "isobaric":
			p.HeatCapacity = model.Isobaric
		default:
			return p, usagef("--heat-capacity: want isochoric or isobaric (got %q)", sanitizeArg(s.heatCapacity))
		}
	}
	if apply("mix-cooling") {
		k, err := model.ParseCoolingTimeKind(s.mixCool)
		if err != nil || k == model.CoolNone {
			return p, usagef("--mix-cooling: want minmix, cold, mix or hot (got %q)", sanitizeArg(s.mixCool))
		}
		p.MixCooling = k
	}
	if apply("density-product") {
		d, err := model.ParseDensityProduct(s.densityProduct)
		if err != nil {
			return p, usagef("--density-product: want nh2, n2 or neni (got %q)", sanitizeArg(s.densityProduct))
		}
		p.DensityProduct = d
	}
	return p, nil
}

// evaluated is a parsed and evaluated scenario of the single-point
// commands (eval, evolve, plan).
type evaluated struct {
	name     string // the --scenario file's name for it, or ""
	file     string // the --scenario file, or ""
	params   model.Params
	cooling  *coolingSource
	cf       model.CoolingFunction // the cooling function at params.Metallicity
	criteria []model.Criterion
	res      model.Result

	spreadCases []model.ConventionCase // eval's convention spread
	spread      []model.Spread
	spreadName  string // the second cooling function of the spread, if any
	scores      *outcomeScores
}

// evaluate parses the scenario flags, resolves the cooling function at the
// scenario's metallicity, loads the criteria and evaluates them.
func (s *scenarioFlags) evaluate(e *env) (*evaluated, error) {
	var sc evaluated
	var err error
	if sc.params, err = s.params(e); err != nil {
		return nil, err
	}
	if s.base != nil {
		sc.name, sc.file = s.base.Name, s.scenario
	}
	if sc.cooling, err = s.source(e); err != nil {
		return nil, err
	}
	if sc.cf, err = sc.cooling.Function(sc.params.Metallicity); err != nil {
		return nil, usagef("--metallicity: %v", err)
	}
	if sc.criteria, err = loadCriteria(e, s.criteria); err != nil {
		return nil, err
	}
	if sc.res, err = model.Evaluate(sc.params, sc.cf, sc.criteria); err != nil {
		return nil, err
	}
	return &sc, nil
}

// checkFormat refuses a --format value that is not one of allowed.
func checkFormat(format string, allowed ...string) error {
	for _, a := range allowed {
		if format == a {
			return nil
		}
	}
	return usagef("--format: want %s (got %q)", orList(allowed), sanitizeArg(format))
}

// orList writes "a, b or c".
func orList(s []string) string {
	if len(s) == 1 {
		return s[0]
	}
	return strings.Join(s[:len(s)-1], ", ") + " or " + s[len(s)-1]
}

// fieldUsage turns a validation error into a usage error naming the flag.
func fieldUsage(err error) error {
	var fe *model.FieldError
	if errors.As(err, &fe) {
		return usagef("%s: %s", flagForField(fe.Field), fe.Reason)
	}
	return usagef("%v", err)
}

func mixtureNames() string {
	var n []string
	for _, m := range model.Mixtures() {
		n = append(n, m.Name)
	}
	return strings.Join(n, ", ")
}

// loadCriteria returns the built-in criteria, corrected and extended by the
// --criteria file when one is given.
func loadCriteria(e *env, path string) ([]model.Criterion, error) {
	base := model.BuiltinCriteria()
	if path == "" {
		return base, nil
	}
	r, name, closeFn, err := openInput(e, path)
	if err != nil {
		return nil, err
	}
	defer closeFn()
	cs, err := scenario.LoadCriteria(r, name, base)
	if err != nil {
		return nil, fmt.Errorf("--criteria: %w", err)
	}
	return cs, nil
}

// sanitizeArg makes user text safe to echo to a terminal.
func sanitizeArg(s string) string {
	s = quantity.Sanitize(s)
	if r := []rune(s); len(r) > 60 {
		s = string(r[:59]) + "…"
	}
	return s
}

// sortedKeys returns the keys of m in order.
func sortedKeys[V any](m map[string]V) []string {
	k := make([]string, 0, len(m))
	for s := range m {
		k = append(k, s)
	}
	sort.Strings(k)
	return k
}
