package cooling

import (
	"io"
	"math"
	"strings"
	"testing"

	"cloudwind/model"
)

// spNoFiles is an Opener for specs that must not open a file.
func spNoFiles(t *testing.T) Opener {
	return func(path string) (io.Reader, string, func(), error) {
		t.Fatalf("Resolve opened %q for a named curve", path)
		return nil, "", nil, nil
	}
}

// TestResolveBuiltinLowTemperature checks what the commands get for the
// built-in names: the capped KI02 part named in Meta, the range from
// 10 K, and n_e/n_H given only where the curve is CIE (NaN, "not known",
// below 10^4 K, where it is KI02's or the cap).
func TestResolveBuiltinLowTemperature(t *testing.T) {
	for _, spec := range []string{"builtin", "builtin-hhe"} {
		src, err := Resolve("--cooling", spec, nil, spNoFiles(t))
		if err != nil {
			t.Fatalf("Resolve(%q): %v", spec, err)
		}
		if !strings.Contains(src.Meta.Name, "KI02") || !strings.Contains(src.Meta.Name, "capped") || !strings.Contains(src.Meta.Citation, "Koyama & Inutsuka 2002") {
			t.Errorf("Resolve(%q).Meta = %q / %q, want the capped KI02 named", spec, src.Meta.Name, src.Meta.Citation)
		}
		cf, err := src.Function(1)
		if err != nil {
			t.Fatal(err)
		}
		p := cf.(*PowerLaw)
		if lo, _ := p.ValidRange(); math.Abs(float64(lo)/10-1) > 1e-12 {
			t.Errorf("Resolve(%q): range from %g K, want 10 K", spec, float64(lo))
		}
		if v := src.NeOverNH(5000); !math.IsNaN(v) {
			t.Errorf("Resolve(%q).NeOverNH(5000 K) = %g, want NaN (not CIE there)", spec, v)
		}
		if v, want := src.NeOverNH(1e6), NeOverNH(1e6, BuiltinHeliumRatio); v != want {
			t.Errorf("Resolve(%q).NeOverNH(1e6 K) = %g, want %g", spec, v, want)
		}
	}
	src, err := Resolve("--cooling", "hhe-kwh96", nil, spNoFiles(t))
	if err != nil {
		t.Fatal(err)
	}
	cf, _ := src.Function(0)
	if lo, _ := cf.(*PowerLaw).ValidRange(); math.Abs(float64(lo)/1e4-1) > 1e-12 || cf.Lambda(model.Temperature(5000)) != 0 {
		t.Errorf("hhe-kwh96 starts at %g K, want the CIE-only 1e4 K", float64(lo))
	}
	if !strings.Contains(src.Meta.Name, "KWH96 as published") {
		t.Errorf("hhe-kwh96 Meta.Name = %q, want KWH96 as published", src.Meta.Name)
	}
}
