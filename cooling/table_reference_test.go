package cooling

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// Tests that read the CHIANTI reference set beside the repository
// (cooling reference §7; never copied into it).

// tblReferenceDir finds ../shared/reference beside the module root, or
// $CLOUDWIND_REFERENCE_DIR. With CI=true a missing directory fails the test.
func tblReferenceDir(t *testing.T) string {
	t.Helper()
	dir := os.Getenv("CLOUDWIND_REFERENCE_DIR")
	if dir == "" {
		wd, err := os.Getwd()
		if err != nil {
			t.Fatal(err)
		}
		for d := wd; ; d = filepath.Dir(d) {
			if _, err := os.Stat(filepath.Join(d, "go.mod")); err == nil {
				dir = filepath.Join(d, "..", "shared", "reference")
				break
			}
			if filepath.Dir(d) == d {
				break
			}
		}
	}
	if _, err := os.Stat(filepath.Join(dir, "cie-cooling-chianti")); dir == "" || err != nil {
		if os.Getenv("CI") == "true" {
			t.Fatalf("reference data not found (dir %q): set CLOUDWIND_REFERENCE_DIR", dir)
		}
		t.Skipf("reference data not found (dir %q)", dir)
	}
	return filepath.Join(dir, "cie-cooling-chianti")
}

// TestTableChiantiReference loads the CHIANTI reference files by naming
// their columns and checks nodes (cooling reference §8 rows 17–20, file
// values per n_e n_H, exact at nodes to 0.001 dex), converted here with
// the fully ionised n_e/n_H = 1+2y (§1) at y = 0.0851 (He/H of the files'
// GS98 abundances, 10^(10.93−12); from memory).
func TestTableChiantiReference(t *testing.T) {
	dir := tblReferenceDir(t)
	const y = 0.0851
	shift := math.Log10(1 + 2*y)
	checks := map[string][][2]float64{
		"cooling_z0.001.txt": {{4.22, -21.766}, {6.0, -23.296}, {8.0, -22.630}},
		"cooling_z1.txt":     {{5.36, -21.217}, {5.0, -21.266}, {6.0, -21.892}, {7.0, -22.525}, {8.0, -22.610}},
	}
	files, err := filepath.Glob(filepath.Join(dir, "*.txt"))
	if err != nil || len(files) < 10 {
		t.Fatalf("reference files: %v, %v", files, err)
	}
	for _, f := range files {
		fh, err := os.Open(f)
		if err != nil {
			t.Fatal(err)
		}
		tab, err := ParseTable(fh, filepath.Base(f), TableOptions{Norm: ptr(PerNeNH), HeliumRatio: ptr(y), LambdaColumns: []int{2}})
		fh.Close()
		if err != nil {
			t.Errorf("ParseTable(%s): %v", filepath.Base(f), err)
			continue
		}
		xs, ys := tblNodes(t, tab, math.NaN())
		if len(xs) != 401 {
			t.Errorf("%s: %d nodes, want 401 (log T 4.00–8.00 every 0.01)", filepath.Base(f), len(xs))
		}
		for _, c := range checks[filepath.Base(f)] {
			i := int(math.Round((c[0] - 4) / 0.01))
			if !scalar.EqualWithinAbs(xs[i], c[0], 1e-9) || !scalar.EqualWithinAbs(ys[i]-shift, c[1], 1e-9) {
				t.Errorf("%s: node (%g, %.4f) − log(1+2y), want (%g, %g)", filepath.Base(f), xs[i], ys[i]-shift, c[0], c[1])
			}
		}
	}
}
