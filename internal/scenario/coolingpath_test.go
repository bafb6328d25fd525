package scenario

import (
	"path/filepath"
	"strings"
	"testing"
)

// TestSavedCoolingRoundTrip checks that a table path saved in a scenario
// file is found again when the file is loaded from its own directory.
func TestSavedCoolingRoundTrip(t *testing.T) {
	root := t.TempDir()
	table := filepath.Join(root, "tables", "sd93.txt")
	for _, file := range []string{
		filepath.Join(root, "runs", "a.toml"),        // a sibling directory
		filepath.Join(root, "a.toml"),                // the parent
		filepath.Join(root, "tables", "a.toml"),      // the table's own directory
		filepath.Join(root, "x", "y", "z", "a.toml"), // deeper
	} {
		saved, err := SavedCoolingSpec(table, file)
		if err != nil {
			t.Fatalf("SavedCoolingSpec(%s): %v", file, err)
		}
		if filepath.IsAbs(saved) {
			t.Errorf("savedCooling for %s = %q, want a relative path", file, saved)
		}
		if back := filepath.Clean(CoolingSpec(saved, filepath.Dir(file))); back != table {
			t.Errorf("saved %q in %s loads as %q, want %q", saved, file, back, table)
		}
	}
	// Names and formulas are kept as they are.
	for _, spec := range []string{"", "builtin", "const:1e-22", "powerlaw:1e-22,1e5,-0.7"} {
		if got, err := SavedCoolingSpec(spec, filepath.Join(root, "a.toml")); err != nil || got != spec {
			t.Errorf("SavedCoolingSpec(%q) = %q, %v; want it unchanged", spec, got, err)
		}
	}
	// A table from standard input cannot be named in a file.
	if _, err := SavedCoolingSpec("-", filepath.Join(root, "a.toml")); err == nil || !strings.Contains(err.Error(), "standard input") {
		t.Errorf("SavedCoolingSpec(-): error %v, want one about standard input", err)
	}
}
