package cooling

import (
	"errors"
	"io/fs"
	"math"
	"strconv"
	"strings"
	"testing"

	"cloudwind/assets"
)

// TestEmbeddedAssets checks that every embedded data file parses and has
// the header fields the project requires (source, licence, units, log
// base), and that SOURCES.md describes it. A new asset needs a parser here.
func TestEmbeddedAssets(t *testing.T) {
	sources, err := fs.ReadFile(assets.FS, "SOURCES.md")
	if err != nil {
		t.Fatalf("assets.FS: SOURCES.md: %v", err)
	}
	n := 0
	err = fs.WalkDir(assets.FS, ".", func(path string, d fs.DirEntry, err error) error {
		if err != nil || d.IsDir() || path == "SOURCES.md" {
			return err
		}
		n++
		if !strings.Contains(string(sources), "## "+path) {
			t.Errorf("SOURCES.md has no section \"## %s\"", path)
		}
		switch path {
		case metalFitFile:
			m, err := loadMetalFit(assets.FS, path)
			if err != nil {
				t.Errorf("loadMetalFit(assets.FS, %q) error: %v", path, err)
				return nil
			}
			for _, k := range []string{"source", "licence", "units", "log base"} {
				if len(m.header[k]) == 0 || m.header[k][0] == "" {
					t.Errorf("asset %s: header field %q missing", path, k)
				}
			}
			for _, want := range []string{"Ryden", "Pogge", "2021", "Cambridge University Press"} {
				if !strings.Contains(m.header["source"][0], want) {
					t.Errorf("asset %s: source %q lacks %q", path, m.header["source"][0], want)
				}
			}
			if !strings.Contains(m.header["licence"][0], "CC-BY-4.0") || !strings.Contains(m.header["derived work"][0], "not the original data") {
				t.Errorf("asset %s: licence %q / derived work %q, want CC-BY-4.0 and a derived-work statement", path, m.header["licence"][0], m.header["derived work"][0])
			}
			if len(m.knots) > 30 {
				t.Errorf("asset %s: %d knots, want a compact fit (≤ 30)", path, len(m.knots))
			}
		default:
			t.Errorf("embedded asset %s has no parser in TestEmbeddedAssets", path)
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if n == 0 {
		t.Error("assets.FS embeds no data file")
	}
}

// TestParseMetalFitErrors checks that malformed coefficient files are
// rejected with errMetalFit and, where a row is at fault, its line.
func TestParseMetalFitErrors(t *testing.T) {
	good, err := fs.ReadFile(assets.FS, metalFitFile)
	if err != nil {
		t.Fatal(err)
	}
	g := string(good)
	lines := strings.Split(g, "\n")
	firstKnot := 0
	for i, l := range lines {
		if strings.HasPrefix(l, "log10T") {
			firstKnot = i + 1 // 0-based index of the first knot row
			break
		}
	}
	swap := append([]string(nil), lines...)
	swap[firstKnot], swap[firstKnot+1] = swap[firstKnot+1], swap[firstKnot]
	for _, tc := range []struct {
		name, text, line string
	}{
		{"no licence", strings.Replace(g, "# licence:", "# licensed:", 1), ""},
		{"no source", strings.Replace(g, "# source:", "# origin:", 1), ""},
		{"no units", strings.Replace(g, "# units:", "# unit", 1), ""},
		{"no log base", strings.Replace(g, "# log base:", "# base:", 1), ""},
		{"wrong normalisation", strings.Replace(g, "# normalisation: nenH", "# normalisation: nH2", 1), ""},
		{"wrong log base", strings.Replace(g, "# log base: 10", "# log base: e", 1), ""},
		{"bad valid", strings.Replace(g, "# valid: log10 T", "# valid: T", 1), ""},
		{"bad accuracy", strings.Replace(g, "# max-rel-error: 4.00", "# max-rel-error: x", 1), ""},
		{"no column names", strings.Replace(g, "log10T log10Lambda\n", "", 1), ""},
		{"not increasing", strings.Join(swap, "\n"), "line " + strconv.Itoa(firstKnot+2)},
		{"not a number", strings.Replace(g, "\n8.0000 ", "\n8.0000x ", 1), "line "},
		{"NaN", strings.Replace(g, "\n8.0000 ", "\nNaN ", 1), "line "},
		{"three columns", strings.Replace(g, "\n8.0000 ", "\n8.0000 1 ", 1), "line "},
		{"too few knots", strings.Join(lines[:firstKnot+3], "\n"), ""},
	} {
		_, err := parseMetalFit(strings.NewReader(tc.text))
		if !errors.Is(err, errMetalFit) || !strings.Contains(err.Error(), tc.line) {
			t.Errorf("parseMetalFit(%s) error = %v, want errMetalFit naming %q", tc.name, err, tc.line)
		}
	}
	if _, err := parseMetalFit(strings.NewReader(g)); err != nil {
		t.Errorf("parseMetalFit(embedded file) error: %v", err)
	}
}

// TestMetalFitAccuracy checks that the embedded fit reproduces its own
// target, Λ_met = (Λ_z1 − Λ_z0.001)/0.999 from the file values (Ryden &
// Pogge 2021), within the accuracy its header states, band by band.
func TestMetalFitAccuracy(t *testing.T) {
	m, err := loadMetalFit(assets.FS, metalFitFile)
	if err != nil {
		t.Fatal(err)
	}
	if len(m.bands) == 0 {
		t.Fatal("metal fit states no accuracy")
	}
	x, met, _ := biChiantiMetals(t)
	for _, b := range m.bands {
		if b.maxRel > 0.05 {
			t.Errorf("metal fit states %.2f%% over 10^%g–10^%g K, want ≤ 5%% (requirement for the built-in)", 100*b.maxRel, b.lo, b.hi)
		}
		worst, where := 0.0, 0.0
		for i, xi := range x {
			if xi < b.lo-1e-9 || xi > b.hi+1e-9 {
				continue
			}
			e := math.Abs(math.Pow(10, m.log10Lambda(xi))/met[i] - 1)
			if e > worst {
				worst, where = e, xi
			}
		}
		if worst > b.maxRel {
			t.Errorf("metal fit over 10^%g–10^%g K: largest error %.3f%% at 10^%.2f K, header states %.2f%%", b.lo, b.hi, 100*worst, where, 100*b.maxRel)
		}
		t.Logf("metal fit 10^%g–10^%g K: largest error %.2f%% at 10^%.2f K (stated %.2f%%)", b.lo, b.hi, 100*worst, where, 100*b.maxRel)
	}
}

// TestChiantiReference checks the reference curves as this package reads
// them: node values (file values of Ryden & Pogge 2021, exact at nodes to
// the 0.001 dex of the files), the effective metallicities of the half-dex
// files (measured, ±0.01 dex) and the linear-Z model (measured, 7%). They
// guard the reading and the facts about the files the built-in relies on.
func TestChiantiReference(t *testing.T) {
	z1, z0 := biReadChianti(t, "cooling_z1.txt"), biReadChianti(t, "cooling_z0.001.txt")
	at := func(c biChiantiCurve, x float64) float64 { return c.y[int(math.Round((x-4)*100))] }
	peak := func(c biChiantiCurve, lo, hi float64) (float64, float64) {
		bx, by := 0.0, math.Inf(-1)
		for i, x := range c.x {
			if x >= lo && x <= hi && c.y[i] > by {
				bx, by = x, c.y[i]
			}
		}
		return bx, by
	}
	const dex = 0.0005
	if x, y := peak(z0, 4, 4.5); math.Abs(x-4.22) > 1e-9 || math.Abs(y+21.766) > dex {
		t.Errorf("cooling_z0.001.txt H peak 10^%.3f at 10^%.2f K, want 10^-21.766 at 10^4.22 K (file values)", y, x)
	}
	if x, y := peak(z1, 4, 8); math.Abs(x-5.36) > 1e-9 || math.Abs(y+21.217) > dex {
		t.Errorf("cooling_z1.txt peak 10^%.3f at 10^%.2f K, want 10^-21.217 at 10^5.36 K (file values)", y, x)
	}
	for _, tc := range []struct {
		c    biChiantiCurve
		name string
		x, y float64
	}{
		{z1, "z1", 5, -21.266}, {z1, "z1", 6, -21.892}, {z1, "z1", 7, -22.525}, {z1, "z1", 8, -22.610}, // file values
		{z0, "z0.001", 6, -23.296}, {z0, "z0.001", 8, -22.630}, // file values
	} {
		if got := at(tc.c, tc.x); math.Abs(got-tc.y) > dex {
			t.Errorf("cooling_%s.txt at 10^%g K = 10^%.3f, want 10^%.3f (file values)", tc.name, tc.x, got, tc.y)
		}
	}
	x, met, base := biChiantiMetals(t)
	for _, tc := range []struct {
		file   string
		log10Z float64
	}{
		{"cooling_z0.005.txt", -2.5}, {"cooling_z0.05.txt", -1.5}, {"cooling_z0.5.txt", -0.5}, {"cooling_z5.txt", 0.5}, // measured: half-dex values
		{"cooling_z0.01.txt", -2}, {"cooling_z0.1.txt", -1}, {"cooling_z10.txt", 1}, // measured: as labelled
	} {
		c := biReadChianti(t, tc.file)
		num, den := 0.0, 0.0
		for i, xi := range x {
			if xi >= 5-1e-9 && xi <= 5.8+1e-9 {
				d := math.Pow(10, c.y[i]) - base[i]
				num, den = num+d*met[i], den+met[i]*met[i]
			}
		}
		z := num / den
		if math.Abs(math.Log10(z)-tc.log10Z) > 0.01 {
			t.Errorf("effective Z of %s = 10^%.3f, want 10^%g ± 0.01 dex (measured)", tc.file, math.Log10(z), tc.log10Z)
		}
		z = math.Pow(10, tc.log10Z)
		for i, xi := range x {
			if xi < 4.3-1e-9 {
				continue
			}
			want := math.Pow(10, c.y[i])
			if got := base[i] + z*met[i]; math.Abs(got/want-1) > 0.07 {
				t.Errorf("linear-Z model for %s at 10^%.2f K = %.4g, file %.4g; want within 7%% (measured)", tc.file, xi, got, want)
			}
		}
	}
}
