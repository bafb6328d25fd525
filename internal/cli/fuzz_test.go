package cli

import (
	"errors"
	"io"
	"io/fs"
	"math"
	"strings"
	"testing"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"

	"cloudwind/cooling"
	"cloudwind/model"
)

// FuzzParseAxis: no sweep spec may panic; every error is a usage error and
// every accepted axis has finite values.
func FuzzParseAxis(f *testing.F) {
	for _, s := range []string{"100", "1,3,10", "lin:1:2:3", "log:0.1pc:1kpc:41", "log:0:10:5", "lin:1:2:0", "lin:a:b:c", "log:1e308:1e-308:9", "lin:1 K:2 K:2", ",,", "lin:::"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		vs, err := parseAxis("radius", model.DimLength, s)
		if err != nil {
			var ue *usageError
			if !errors.As(err, &ue) {
				t.Fatalf("parseAxis(%q): %v is not a usage error", s, err)
			}
			return
		}
		if len(vs) == 0 || len(vs) > maxAxisPoints {
			t.Fatalf("parseAxis(%q): %d values", s, len(vs))
		}
	})
}

// FuzzCoolingSpec: no cooling spec naming an analytic form may panic.
func FuzzCoolingSpec(f *testing.F) {
	for _, s := range []string{"const:1e-22", "const:10^-21.4", "powerlaw:1e-22,1e5,-0.7", "powerlaw:1,2", "const:-1", "const:10^999", "powerlaw:,,", "const:"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		if !strings.HasPrefix(s, "const:") && !strings.HasPrefix(s, "powerlaw:") {
			s = "const:" + s
		}
		src, err := cooling.Resolve("--cooling", s, nil, nil)
		if err != nil {
			return
		}
		cf, err := src.Function(1)
		if err != nil {
			t.Fatalf("%q: resolved but no function: %v", s, err)
		}
		if v := float64(cf.Lambda(1e5)); !(v >= 0) {
			t.Fatalf("%q: Λ(1e5 K) = %g", s, v)
		}
	})
}

// FuzzParseBox: no --box value may panic.
func FuzzParseBox(f *testing.F) {
	for _, s := range []string{"120x20x20", "10x", "x", "1e9x1x1", "60X20", "NaNx1x1"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		a, b, err := parseBox(s)
		if err == nil && (!(a > 0) || !(b > 0)) {
			t.Fatalf("parseBox(%q) = %g, %g without error", s, a, b)
		}
	})
}

// FuzzRadiusValue: no outflow radius flag value may panic; one accepted is
// a positive, finite length, and a plain number is that multiple of R.
func FuzzRadiusValue(f *testing.F) {
	for _, s := range []string{"0.1", "100R", "30pc", "2 kpc", "1e400", "-1", "R", "", "0", "10^2", "3 parsec", "1e-300"} {
		f.Add(s)
	}
	bigR := 300 * model.Parsec
	f.Fuzz(func(t *testing.T, s string) {
		r, err := radiusValue("r-min", s, bigR)
		if err != nil {
			var ue *usageError
			if !errors.As(err, &ue) || !strings.Contains(err.Error(), "--r-min") {
				t.Fatalf("radiusValue(%q): %v is not a usage error naming --r-min", s, err)
			}
			return
		}
		if !(r > 0) || math.IsInf(float64(r), 0) {
			t.Fatalf("radiusValue(%q) = %g cm without error", s, float64(r))
		}
	})
}

// FuzzScenarioFlag: any value of any numeric scenario flag is used as given
// or refused with a usage error naming the flag, never replaced by a
// default: when parse accepts it, the field holds the parsed value (a floor
// of 0 K is NoFloor, "no floor").
func FuzzScenarioFlag(f *testing.F) {
	for _, s := range []string{"0", "0.0", "-0", "5/3", "1e-400", "10^-3", "3 pc", "0 K", "1e308", "  7  ", "0x10", "nan"} {
		f.Add(uint8(0), s)
	}
	flags := numericScenarioFlags()
	f.Fuzz(func(t *testing.T, which uint8, v string) {
		sf := flags[int(which)%len(flags)]
		var s scenarioFlags
		for _, o := range flags {
			*o.ptr(&s) = o.def
		}
		s.mixture, s.heatCapacity, s.densityProduct, s.mixCool = model.Asplund2009.Name, "isochoric", "nh2", "minmix"
		*sf.ptr(&s) = v
		p, err := s.parse()
		if err != nil {
			var ue *usageError
			if !errors.As(err, &ue) || !strings.Contains(err.Error(), "--"+sf.name) {
				t.Fatalf("--%s %q: %v is not a usage error naming the flag", sf.name, v, err)
			}
			return
		}
		raw := strings.TrimSpace(v)
		if raw == "" || (sf.name == "gamma" && raw == "5/3") {
			return
		}
		want, perr := quantity.ParseValue(sf.kind, raw)
		if perr != nil {
			t.Fatalf("--%s %q accepted although ParseValue refuses it: %v", sf.name, v, perr)
		}
		if sf.field == model.FieldTFloor && want == 0 {
			want = float64(model.NoFloor)
		}
		if got, _ := p.Field(sf.field); got != want {
			t.Fatalf("--%s %q: field holds %g, want the value given %g", sf.name, v, got, want)
		}
	})
}

// FuzzTableSettings: no --table setting may panic, and a setting that is
// accepted alone is accepted in a resolution of a table read from memory.
func FuzzTableSettings(f *testing.F) {
	for _, s := range []string{"norm: nH2", "columns: T=1 lambda=2", "log: T=yes lambda=auto", "Z: 0.1 1", "y: 0.0851", "clip-below: 1e4", "header: yes", "skip: 4", "norm:", ":", "columns: T=0", "log: T=maybe", "skip: -1", "Z: 1 0.1"} {
		f.Add(s)
	}
	const table = "1e4 1e-23\n1e5 1e-22\n1e6 1e-22\n"
	f.Fuzz(func(t *testing.T, s string) {
		opt := cooling.TableOptions{}
		if opt.Apply(s) != nil {
			return
		}
		open := func(string) (io.Reader, string, func(), error) {
			return strings.NewReader(table), "mem.txt", func() {}, nil
		}
		src, err := cooling.Resolve("--cooling", "mem.txt", []string{"norm: nH2", s}, open)
		if err != nil {
			return // e.g. columns that the table does not have: an error, not a panic
		}
		if _, err := src.Function(1); err != nil && src.ZDependent {
			return
		}
	})
}

// FuzzCoolingName: any spec (name, analytic form, or path) resolves or is
// refused with an error; names that are neither files nor known get a
// usage error (*cooling.SpecError), never a panic.
func FuzzCoolingName(f *testing.F) {
	for _, s := range []string{"builtin", "bultin", "hhe-kwh96", "rosen-bregman-1995", "tozzi", "", "-", "./x.txt", "/nonexistent/t.txt", "a:b", "const:", "powerlaw:"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		open := func(path string) (io.Reader, string, func(), error) {
			return nil, "", nil, &fs.PathError{Op: "open", Path: path, Err: fs.ErrNotExist}
		}
		src, err := cooling.Resolve("--cooling", s, nil, open)
		if err == nil && src == nil {
			t.Fatalf("Resolve(%q) = nil, nil", s)
		}
	})
}

// FuzzShardAndColumns: no --shard or --columns value may panic; a shard
// accepted lies inside the grid, and a selection accepted names columns
// of the header, each once.
func FuzzShardAndColumns(f *testing.F) {
	for _, s := range []string{"0/4", "3/4", "4/4", "-1/2", "1/0", "a/b", "1/2/3", "chi,*_verdict", "[", "*", "radius", "chi,chi", ",", " 2 / 5 "} {
		f.Add(s, 1222)
	}
	cols := report.SweepColumns(model.BuiltinCriteria())
	f.Fuzz(func(t *testing.T, s string, total int) {
		if total < 0 {
			total = -total
		}
		if sh, err := parseShard(s, total); err == nil {
			if sh.lo < 0 || sh.hi < sh.lo || sh.hi > total || sh.k < 0 || sh.k >= sh.n {
				t.Fatalf("parseShard(%q, %d) = %+v", s, total, sh)
			}
		}
		sel, err := report.SelectColumns(cols, s)
		if err != nil {
			return
		}
		seen := map[string]bool{}
		for k, c := range sel {
			if seen[c.Name] || (c.Twin >= k) {
				t.Fatalf("SelectColumns(%q): column %d %s seen twice or twin %d not before it", s, k, c.Name, c.Twin)
			}
			seen[c.Name] = true
		}
	})
}
