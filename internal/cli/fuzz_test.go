package cli

import (
	"errors"
	"strings"
	"testing"

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
