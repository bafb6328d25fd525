package cooling

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"strconv"
	"strings"
	"sync"

	"cloudwind/internal/safetext"
	"cloudwind/internal/suggest"
	"cloudwind/model"
)

// A SpecError is a mistake in how a cooling function was named (a usage
// error), as opposed to a file that could not be read or parsed.
type SpecError struct{ msg string }

func (e *SpecError) Error() string { return e.msg }

func specErrorf(format string, args ...any) error { return &SpecError{fmt.Sprintf(format, args...)} }

// An Opener opens a file for reading; "-" may mean standard input. The
// name it returns is what messages call the input.
type Opener func(path string) (r io.Reader, name string, closeFn func(), err error)

// DefaultSpec is the cooling function used when none is named.
const DefaultSpec = "builtin"

// Names lists the cooling functions that can be named, with a
// summary each.
func Names() []struct{ Name, Summary string } {
	return []struct{ Name, Summary string }{
		{"builtin", "CIE (KWH96+Voronov H+He, CHIANTI-fit metals) from 10^4 K; below, KI02 capped at the CIE value at 10^4 K; scaled by --metallicity (default)"},
		{"builtin-hhe", "builtin without metals: H+He CIE from 10^4 K; below, KI02's Lyα term, capped the same way"},
		{"hhe-kwh96", "H+He with the KWH96 rates as published (Cen's factor on He+ excitation), for comparison"},
		{"rosen-bregman-1995", "historical fit (Rosen & Bregman 1995), 300 K–10^9 K"},
		{"tozzi-norman-2001", "historical fit for Z = 0.3 Z☉ (Tozzi & Norman 2001), kT ≥ 0.1 keV"},
	}
}

// A Source is a resolved cooling spec: it builds the cooling
// function for a metallicity.
type Source struct {
	Spec       string                            // as given
	Table      []string                          // table settings, for a table file
	Desc       string                            // for people
	Meta       *Meta                             // nil for the analytic forms
	ZDependent bool                              // the curve changes with Z
	NeOverNH   func(t model.Temperature) float64 // n_e/n_H when known, else nil
	fixed      model.CoolingFunction
	at         func(z float64) (*PowerLaw, error)
}

// Function returns the cooling function at metallicity z.
func (c *Source) Function(z float64) (model.CoolingFunction, error) {
	if c.fixed != nil {
		return c.fixed, nil
	}
	p, err := c.at(z)
	if err != nil {
		return nil, err
	}
	return p, nil
}

// builtinCurve is the built-in cooling function, built once per run (an
// immutable value computed on first use; not mutable state).
var builtinCurve = sync.OnceValues(NewBuiltin)

// Resolve parses a cooling spec: a name of Names, const:Λ,
// powerlaw:L0,T0,SLOPE, or a table file opened with open and read with the
// table settings (directive words, TableOptions.Apply). flag names
// the setting in messages. Mistakes in the spec are *SpecError; problems
// with a file are other errors.
func Resolve(flag, spec string, table []string, open Opener) (*Source, error) {
	if len(table) > 0 && isNamedOrAnalytic(spec) {
		return nil, specErrorf("table settings apply to a table file, but %s is %q", flag, safetext.Terminal(spec))
	}
	ne := func(y float64) func(model.Temperature) float64 {
		return func(t model.Temperature) float64 { return NeOverNH(t, y) }
	}
	// The built-in curves are not CIE below 10^4 K (KI02), where the CIE
	// n_e/n_H would not describe them: NaN there, "not known".
	neBuiltin := func(t model.Temperature) float64 {
		if t < ki02Top {
			return math.NaN()
		}
		return NeOverNH(t, BuiltinHeliumRatio)
	}
	switch spec {
	case "builtin":
		b, err := builtinCurve()
		if err != nil {
			return nil, err
		}
		m0, _ := b.At(1)
		meta := m0.Meta()
		return &Source{Spec: spec, Desc: "built-in (CIE from 1e4 K: KWH96+V97 H+He, CHIANTI-fit metals; below, KI02 capped at the CIE value at 1e4 K), metals scaled with Z", Meta: &meta,
			ZDependent: true, at: b.At, NeOverNH: neBuiltin}, nil
	case "builtin-hhe":
		b, err := builtinCurve()
		if err != nil {
			return nil, err
		}
		return fixedCurve(spec, b.HHe(), neBuiltin), nil
	case "hhe-kwh96":
		p, err := Primordial(BuiltinHeliumRatio, KWH96Options())
		if err != nil {
			return nil, err
		}
		return fixedCurve(spec, p, ne(BuiltinHeliumRatio)), nil
	case "rosen-bregman-1995":
		p, err := RosenBregman95()
		if err != nil {
			return nil, err
		}
		return fixedCurve(spec, p, nil), nil
	case "tozzi-norman-2001":
		p, err := TozziNorman01()
		if err != nil {
			return nil, err
		}
		return fixedCurve(spec, p, nil), nil
	}
	if kind, arg, ok := strings.Cut(spec, ":"); ok && (kind == "const" || kind == "powerlaw") {
		return parseAnalytic(flag, spec, kind, arg)
	}
	if spec == "" {
		return nil, specErrorf("%s: empty (want a name, const:LAMBDA, powerlaw:L0,T0,SLOPE or a file)", flag)
	}
	return loadTable(flag, spec, table, open)
}

// IsFileSpec reports whether spec names a table file rather than a built-in
// curve or an analytic form, so that a path relative to a scenario file
// can be resolved against the file's directory.
func IsFileSpec(spec string) bool { return spec != "" && !isNamedOrAnalytic(spec) }

func isNamedOrAnalytic(spec string) bool {
	for _, c := range Names() {
		if c.Name == spec {
			return true
		}
	}
	return strings.HasPrefix(spec, "const:") || strings.HasPrefix(spec, "powerlaw:")
}

// fixedCurve wraps a curve that does not depend on Z.
func fixedCurve(spec string, p *PowerLaw, ne func(model.Temperature) float64) *Source {
	meta := p.Meta()
	return &Source{Spec: spec, Desc: meta.Name, Meta: &meta, at: func(float64) (*PowerLaw, error) { return p, nil }, NeOverNH: ne}
}

// loadTable reads a user table named by spec.
func loadTable(flag, path string, settings []string, open Opener) (*Source, error) {
	opt := TableOptions{NeOverNH: NeOverNH}
	for _, s := range settings {
		if err := opt.Apply(s); err != nil {
			return nil, specErrorf("table setting %q: %v", safetext.Terminal(s), err)
		}
	}
	r, name, closeFn, err := open(path)
	if err != nil {
		if errors.Is(err, fs.ErrNotExist) && !strings.ContainsAny(path, "/.") {
			var names []string
			for _, c := range Names() {
				names = append(names, c.Name)
			}
			hint := "see the list of names in the help"
			if s := suggest.Closest(path, append(names, "const:", "powerlaw:")); s != "" {
				hint = fmt.Sprintf("did you mean %q?", s)
			}
			return nil, specErrorf("%s: %q is neither a cooling function name nor a file (%s)", flag, safetext.Terminal(path), hint)
		}
		return nil, fmt.Errorf("%s: %w", flag, err)
	}
	defer closeFn()
	t, err := ParseTable(r, name, opt)
	if err != nil {
		if errors.Is(err, ErrNoNormalisation) {
			return nil, specErrorf("%s %s: the table's normalisation is required (never guessed): add the table setting 'norm: nH2|nenH|nent|n2' or a '# norm:' directive", flag, safetext.Terminal(path))
		}
		return nil, fmt.Errorf("%s: %w", flag, err)
	}
	meta := t.Meta()
	src := &Source{Spec: path, Table: settings, Desc: safetext.Terminal(meta.Name), Meta: &meta, at: t.At}
	if _, _, ok := t.ZRange(); ok {
		src.ZDependent = true
	}
	return src, nil
}

// parseAnalytic parses const:LAMBDA and powerlaw:L0,T0,SLOPE.
func parseAnalytic(flag, spec, kind, arg string) (*Source, error) {
	if kind == "const" {
		v, err := parsePositive(arg)
		if err != nil {
			return nil, specErrorf("%s const: Λ %v", flag, err)
		}
		c := model.ConstantCooling{Value: model.CoolingRate(v)}
		return &Source{Spec: spec, Desc: c.String() + " (per n_H²)", fixed: c}, nil
	}
	parts := strings.Split(arg, ",")
	if len(parts) != 3 {
		return nil, specErrorf("%s powerlaw: want three values L0,T0,SLOPE (got %d)", flag, len(parts))
	}
	l0, err := parsePositive(parts[0])
	if err != nil {
		return nil, specErrorf("%s powerlaw: L0 %v", flag, err)
	}
	t0, err := parsePositive(parts[1])
	if err != nil {
		return nil, specErrorf("%s powerlaw: T0 %v", flag, err)
	}
	slope, err := strconv.ParseFloat(strings.TrimSpace(parts[2]), 64)
	if err != nil || math.IsNaN(slope) || math.IsInf(slope, 0) || math.Abs(slope) > 20 {
		return nil, specErrorf("%s powerlaw: SLOPE must be a number between -20 and 20 (got %q)", flag, safetext.Terminal(parts[2]))
	}
	c := model.PowerLawCooling{L0: model.CoolingRate(l0), T0: model.Temperature(t0), Slope: slope}
	return &Source{Spec: spec, Desc: c.String() + " (per n_H²)", fixed: c}, nil
}

// parsePositive parses a finite positive number without a unit, also
// written 10^x (model.ScanNumber).
func parsePositive(s string) (float64, error) {
	t := strings.TrimSpace(s)
	v, n, err := model.ScanNumber(t)
	if err != nil || n != len(t) || !(v > 0) || math.IsInf(v, 0) {
		return 0, fmt.Errorf("must be a finite number greater than 0 (got %q)", safetext.Clip(t, 24))
	}
	return v, nil
}
