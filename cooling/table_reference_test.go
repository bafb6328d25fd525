package cooling

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// Tests that read the CHIANTI reference set (testdata/cie-cooling-chianti,
// Ryden & Pogge 2021 companion data, CC-BY-4.0; see its README).

// tblReferenceDir returns the directory of the CHIANTI curves (chiantiDir).
func tblReferenceDir(t *testing.T) string {
	t.Helper()
	return chiantiDir(t)
}

// TestTableChiantiReference loads the CHIANTI reference files by naming
// their columns and checks nodes (file values of Ryden & Pogge 2021, per
// n_e n_H, exact at nodes to 0.001 dex), converted here with the fully
// ionised n_e/n_H = 1+2y (derived) at y = 0.0851 (He/H of the files'
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
