package cli

import (
	"crypto/sha256"
	"encoding/hex"
	"slices"
	"strings"
	"testing"
)

// goldenColumns16 are the 16 columns of the NumPy reference script
// (testdata/bench/numpy_sweep.py).
const goldenColumns16 = "chi,mach,pressure_kcm3,radius_pc,t_hot_k,t_mix_k,n_hot_cm3,v_wind_kms,t_cc_myr,t_cool_mix_myr,t_cool_hot_myr," +
	"gronke_oh_2018_ratio,gronke_oh_2018_radius_crit_pc,gronke_oh_2018_verdict,sparre_2020_radius_crit_pc,sparre_2020_verdict"

// sweepDataPart returns the rows of a sweep's output without the header
// that carries the program's version: ECSV's '#' lines, the JSON document's
// metadata before "rows":[.
func sweepDataPart(t *testing.T, format, out string) string {
	t.Helper()
	switch format {
	case "ecsv":
		i := strings.Index(out, "\n# schema: astropy-2.0\n")
		if i < 0 {
			t.Fatal("ECSV output without its schema line")
		}
		return out[i:]
	case "json":
		i := strings.Index(out, `"rows":[`)
		if i < 0 {
			t.Fatal(`JSON output without "rows":[`)
		}
		return out[i:]
	}
	return out
}

// TestSweepGoldenHashes: the sweep's output, byte for byte, is what it was
// before the formatting and evaluation were optimised. The SHA-256 values
// are the output of the pre-optimisation code (commit 825abb1, measured with
// this test on that code), so any change to a written byte fails here.
func TestSweepGoldenHashes(t *testing.T) {
	// 20 × 5 × 5 × 100 = 50,000 points.
	grid50k := []string{"sweep", "--chi", "log:10:1e4:20", "--mach", "0.5,1,1.5,2,3", "--pressure", "log:10:1e5:5", "--radius", "log:0.1:1e3:100"}
	// Cloud temperature and metallicity swept too (the slow axes, a new
	// cooling function per metallicity), another convention, a constant Λ.
	gridSlow := []string{"sweep", "--chi", "log:3:3e3:7", "--mach", "0.3,1,4", "--t-cloud", "8000,2e4", "--metallicity", "0.1,1", "--radius", "log:0.01:1e4:40"}
	cases := []struct {
		name string
		args []string
		hash string
	}{
		{"50k csv", append(grid50k, "--format", "csv"), "44000536fe785c04cbeb8953c2118807f9a93f96ea46ea96850b3565386dd24b"},
		{"50k ecsv", append(grid50k, "--format", "ecsv"), "f0f79a3cfa429a4064e264062f7260def7e1a2f43c7d3667b43e4a9eac0d3146"},
		{"50k json", append(grid50k, "--format", "json"), "e60921748256fc23f5d8efccceab4d8df2fe144c42fa5d5b5b15b12692d594a3"},
		{"50k jsonl", append(grid50k, "--format", "jsonl"), "1fae073eaf65365c3d7e17733968fc6c624b80a7e2c7c72462488adc7fb3f2ca"},
		{"50k csv 16 columns", append(grid50k, "--format", "csv", "--columns", goldenColumns16), "f96f923b34a567ead1e5d4ae6db8095b105904d7585664d7b14bfb033606314b"},
		{"50k csv 16 columns one worker", append(grid50k, "--format", "csv", "--columns", goldenColumns16, "--workers", "1"), "f96f923b34a567ead1e5d4ae6db8095b105904d7585664d7b14bfb033606314b"},
		{"50k jsonl verdicts", append(grid50k, "--format", "jsonl", "--columns", "radius_pc,*_verdict,*_margin"), "48b1108440a824a4ba5e7f8506d661df3d82cfa130e41a87e55ae03b4e282e07"},
		{"slow axes csv", append(gridSlow, "--format", "csv"), "279f35882b411b40bdcaf3a49c2f5271708634ad6dd9bd3f69ceb379d0a81fd5"},
		{"slow axes json n2", append(gridSlow, "--format", "json", "--density-product", "n2"), "f364776ab5cc86230a8c9cb90b513fc45f8c3b7a4d9ab38d5a478d4d45ef32b5"},
		{"slow axes ecsv const", append(gridSlow, "--format", "ecsv", "--cooling", "const:1e-22"), "7cc7ae066f87385a9d169bb4db574d19739ed004f327f4040cf5255bf375c199"},
	}
	for _, c := range cases {
		format := c.args[len(c.args)-1]
		for i, a := range c.args {
			if a == "--format" {
				format = c.args[i+1]
			}
		}
		out := mustRun(t, c.args...)
		sum := sha256.Sum256([]byte(sweepDataPart(t, format, out)))
		if got := hex.EncodeToString(sum[:]); got != c.hash {
			t.Errorf("%s: cloudwind %s: SHA-256 %s, want %s (the pre-optimisation output)", c.name, strings.Join(c.args, " "), got, c.hash)
		}
	}
}

// TestSweepGridNext: stepping the axis indices point by point (the
// workers' odometer) visits the points of sweepGrid.point in order, the
// radius fastest (the documented row order; no published source).
func TestSweepGridNext(t *testing.T) {
	g := newSweepGrid([]sweepAxis{{values: make([]float64, 3)}, {values: make([]float64, 1)}, {values: make([]float64, 4)}, {values: make([]float64, 2)}})
	idx, want := make([]int, 4), make([]int, 4)
	g.point(0, idx)
	for i := 1; i < g.total; i++ {
		g.next(idx)
		g.point(i, want)
		if !slices.Equal(idx, want) {
			t.Fatalf("after %d steps next gives %v, point(%d) gives %v", i, idx, i, want)
		}
	}
}
