package main

import (
	"errors"
	"fmt"
	"io/fs"
	"math"
	"strconv"
	"strings"
	"sync"

	"cloudwind/cooling"
	"cloudwind/model"
)

// defaultCooling is the cooling function used when --cooling is not given.
const defaultCooling = "builtin"

// namedCurves are the cooling functions a --cooling value can name.
var namedCurves = []struct{ name, summary string }{
	{"builtin", "CIE: KWH96+Voronov H+He and a CHIANTI fit for metals, scaled by --metallicity (default)"},
	{"builtin-hhe", "the H+He part of builtin alone (metal-free)"},
	{"hhe-kwh96", "H+He with the plain KWH96 hydrogen rates, for comparison"},
	{"rosen-bregman-1995", "historical fit (Rosen & Bregman 1995), 300 K–10^9 K"},
	{"tozzi-norman-2001", "historical fit for Z = 0.3 Z☉ (Tozzi & Norman 2001), kT ≥ 0.1 keV"},
}

// coolingHelp is the usage text of --cooling.
func coolingHelp() string {
	var b strings.Builder
	b.WriteString("cooling function Λ(T): a name, const:LAMBDA (erg cm3 s-1 per n_H², 10^x allowed),\\npowerlaw:L0,T0,SLOPE for Λ = L0 (T/T0)^SLOPE, or a table FILE ('-' for stdin) with --table settings.\\nNames:")
	for _, c := range namedCurves {
		fmt.Fprintf(&b, "\n  %-19s %s", c.name, c.summary)
	}
	return strings.ReplaceAll(b.String(), "\\n", "\n")
}

// tableSettings collects repeated --table "key: value" settings.
type tableSettings []string

func (t *tableSettings) String() string { return strings.Join(*t, "; ") }
func (t *tableSettings) Set(v string) error {
	*t = append(*t, v)
	return nil
}

// registerCoolingFlags adds a cooling flag and its table flag.
func registerCoolingFlags(f *flagSet, spec *string, table *tableSettings, name, tableName string) {
	f.fs.StringVar(spec, name, defaultCooling, coolingHelp())
	f.fs.Var(table, tableName, "how to read a table given to --"+name+", in the words of a table's directive lines;\nrepeat it: --"+tableName+" 'norm: nenH' --"+tableName+" 'columns: T=1 lambda=2' --"+tableName+" 'log: T=yes lambda=yes'\n(keys: norm, columns, log, Z, y, clip-below, header, skip)")
}

// A coolingSource is a resolved --cooling value: it builds the cooling
// function for a metallicity.
type coolingSource struct {
	spec       string
	desc       string        // for people
	meta       *cooling.Meta // nil for the analytic forms
	zDependent bool          // the curve changes with Z
	fixed      model.CoolingFunction
	at         func(z float64) (*cooling.PowerLaw, error)
	neOverNH   func(t model.Temperature) float64 // n_e/n_H when known, else nil
}

// function returns the cooling function at metallicity z.
func (c *coolingSource) function(z float64) (model.CoolingFunction, error) {
	if c.fixed != nil {
		return c.fixed, nil
	}
	p, err := c.at(z)
	if err != nil {
		return nil, err
	}
	return p, nil
}

// curve returns the function at z as *cooling.PowerLaw when it is one.
func (c *coolingSource) curve(z float64) (*cooling.PowerLaw, error) {
	if c.at == nil {
		return nil, nil
	}
	return c.at(z)
}

// builtinCurve is the built-in cooling function, built once per run.
var builtinCurve = sync.OnceValues(cooling.NewBuiltin)

// resolveCooling parses a cooling spec; flag names the flag for errors.
func resolveCooling(e *env, flag, spec string, table tableSettings) (*coolingSource, error) {
	if len(table) > 0 && isNamedOrAnalytic(spec) {
		return nil, usagef("--table settings apply to a table file, but %s is %q", flag, sanitizeArg(spec))
	}
	ne := func(y float64) func(model.Temperature) float64 {
		return func(t model.Temperature) float64 { return cooling.NeOverNH(t, y) }
	}
	switch spec {
	case "builtin":
		b, err := builtinCurve()
		if err != nil {
			return nil, err
		}
		m0, _ := b.At(1)
		meta := m0.Meta()
		return &coolingSource{spec: spec, desc: "built-in CIE (KWH96+V97 H+He, CHIANTI-fit metals), metals scaled with Z", meta: &meta,
			zDependent: true, at: b.At, neOverNH: ne(cooling.BuiltinHeliumRatio)}, nil
	case "builtin-hhe", "hhe-kwh96":
		var p *cooling.PowerLaw
		var err error
		if spec == "builtin-hhe" {
			var b *cooling.Builtin
			if b, err = builtinCurve(); err == nil {
				p = b.HHe()
			}
		} else {
			p, err = cooling.Primordial(cooling.BuiltinHeliumRatio, cooling.PrimordialOptions{HIonisation: cooling.KWH96H})
		}
		if err != nil {
			return nil, err
		}
		return fixedCurve(spec, p, ne(cooling.BuiltinHeliumRatio)), nil
	case "rosen-bregman-1995":
		p, err := cooling.RosenBregman95()
		if err != nil {
			return nil, err
		}
		return fixedCurve(spec, p, nil), nil
	case "tozzi-norman-2001":
		p, err := cooling.TozziNorman01()
		if err != nil {
			return nil, err
		}
		return fixedCurve(spec, p, nil), nil
	}
	if kind, arg, ok := strings.Cut(spec, ":"); ok && (kind == "const" || kind == "powerlaw") {
		return parseAnalytic(flag, spec, kind, arg)
	}
	if spec == "" {
		return nil, usagef("%s: empty (want a name, const:LAMBDA, powerlaw:L0,T0,SLOPE or a file)", flag)
	}
	return loadTable(e, flag, spec, table)
}

func isNamedOrAnalytic(spec string) bool {
	for _, c := range namedCurves {
		if c.name == spec {
			return true
		}
	}
	return strings.HasPrefix(spec, "const:") || strings.HasPrefix(spec, "powerlaw:")
}

// fixedCurve wraps a curve that does not depend on Z.
func fixedCurve(spec string, p *cooling.PowerLaw, ne func(model.Temperature) float64) *coolingSource {
	meta := p.Meta()
	return &coolingSource{spec: spec, desc: meta.Name, meta: &meta, at: func(float64) (*cooling.PowerLaw, error) { return p, nil }, neOverNH: ne}
}

// loadTable reads a user table named by spec.
func loadTable(e *env, flag, path string, settings tableSettings) (*coolingSource, error) {
	opt := cooling.TableOptions{NeOverNH: cooling.NeOverNH}
	for _, s := range settings {
		if err := opt.Apply(s); err != nil {
			return nil, usagef("--table %q: %v", sanitizeArg(s), err)
		}
	}
	r, name, closeFn, err := openInput(e, path)
	if err != nil {
		if errors.Is(err, fs.ErrNotExist) && !strings.ContainsAny(path, "/.") {
			var names []string
			for _, c := range namedCurves {
				names = append(names, c.name)
			}
			hint := "run with --help for the names"
			if s := suggest(path, append(names, "const:", "powerlaw:")); s != "" {
				hint = fmt.Sprintf("did you mean %q?", s)
			}
			return nil, usagef("%s: %q is neither a cooling function name nor a file (%s)", flag, sanitizeArg(path), hint)
		}
		return nil, fmt.Errorf("%s: %w", flag, err)
	}
	defer closeFn()
	t, err := cooling.ParseTable(r, name, opt)
	if err != nil {
		if errors.Is(err, cooling.ErrNoNormalisation) {
			return nil, usagef("%s %s: the table's normalisation is required (never guessed): add --table 'norm: nH2|nenH|nent|n2' or a '# norm:' directive", flag, sanitizeArg(path))
		}
		return nil, fmt.Errorf("%s: %w", flag, err)
	}
	meta := t.Meta()
	src := &coolingSource{spec: path, desc: sanitizeArg(meta.Name), meta: &meta, at: t.At}
	if _, _, ok := t.ZRange(); ok {
		src.zDependent = true
	}
	return src, nil
}

// parseAnalytic parses const:LAMBDA and powerlaw:L0,T0,SLOPE.
func parseAnalytic(flag, spec, kind, arg string) (*coolingSource, error) {
	if kind == "const" {
		v, err := parsePositive(arg)
		if err != nil {
			return nil, usagef("%s const: Λ %v", flag, err)
		}
		c := model.ConstantCooling{Value: model.CoolingRate(v)}
		return &coolingSource{spec: spec, desc: c.String() + " (per n_H²)", fixed: c}, nil
	}
	parts := strings.Split(arg, ",")
	if len(parts) != 3 {
		return nil, usagef("%s powerlaw: want three values L0,T0,SLOPE (got %d)", flag, len(parts))
	}
	l0, err := parsePositive(parts[0])
	if err != nil {
		return nil, usagef("%s powerlaw: L0 %v", flag, err)
	}
	t0, err := parsePositive(parts[1])
	if err != nil {
		return nil, usagef("%s powerlaw: T0 %v", flag, err)
	}
	slope, err := strconv.ParseFloat(strings.TrimSpace(parts[2]), 64)
	if err != nil || math.IsNaN(slope) || math.IsInf(slope, 0) || math.Abs(slope) > 20 {
		return nil, usagef("%s powerlaw: SLOPE must be a number between -20 and 20 (got %q)", flag, sanitizeArg(parts[2]))
	}
	c := model.PowerLawCooling{L0: model.CoolingRate(l0), T0: model.Temperature(t0), Slope: slope}
	return &coolingSource{spec: spec, desc: c.String() + " (per n_H²)", fixed: c}, nil
}

// parsePositive parses a finite positive number, also written 10^x.
func parsePositive(s string) (float64, error) {
	s = strings.TrimSpace(s)
	var v float64
	var err error
	if x, ok := strings.CutPrefix(s, "10^"); ok {
		v, err = strconv.ParseFloat(x, 64)
		v = math.Pow(10, v)
	} else {
		v, err = strconv.ParseFloat(s, 64)
	}
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
		return 0, fmt.Errorf("must be a finite number greater than 0 (got %q)", sanitizeArg(s))
	}
	return v, nil
}
