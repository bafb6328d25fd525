package cooling

import (
	"os"
	"path/filepath"
	"testing"
)

// The CHIANTI CIE curves of Ryden & Pogge (2021, companion data,
// CC-BY-4.0) ship with the repository as test data, in
// testdata/cie-cooling-chianti/ at the module root, with their licence and
// an attribution README. They are read only by tests and by
// cooling/internal/fitmetals.

// chiantiDir returns the directory of the CHIANTI curves: that named by
// $CLOUDWIND_REFERENCE_DIR when it is set (a directory holding
// cie-cooling-chianti/, or that directory itself), else
// testdata/cie-cooling-chianti/ at the module root. The files are part of
// the repository, so a missing file fails the test; it never skips.
func chiantiDir(t testing.TB) string {
	t.Helper()
	var cands []string
	if d := os.Getenv("CLOUDWIND_REFERENCE_DIR"); d != "" {
		cands = []string{filepath.Join(d, "cie-cooling-chianti"), d}
	} else if root, err := moduleRoot(); err == nil {
		cands = []string{filepath.Join(root, "testdata", "cie-cooling-chianti")}
	} else {
		t.Fatalf("CHIANTI reference curves: %v", err)
	}
	for _, d := range cands {
		if _, err := os.Stat(filepath.Join(d, "cooling_z1.txt")); err == nil {
			return d
		}
	}
	t.Fatalf("CHIANTI reference curves not found in %q (they ship in testdata/cie-cooling-chianti; CLOUDWIND_REFERENCE_DIR overrides)", cands)
	return ""
}

// moduleRoot walks up from the working directory to the directory holding
// go.mod.
func moduleRoot() (string, error) {
	dir, err := os.Getwd()
	if err != nil {
		return "", err
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			return dir, nil
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			return "", os.ErrNotExist
		}
		dir = parent
	}
}
