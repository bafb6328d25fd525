package suggest

import (
	"strings"
	"testing"
)

func TestDistance(t *testing.T) {
	for _, c := range []struct {
		a, b string
		want int
		why  string
	}{
		{"kitten", "sitting", 3, "the textbook Levenshtein example (from memory)"},
		{"ca", "abc", 3, "optimal string alignment, not full Damerau-Levenshtein, which gives 2 (from memory)"},
		{"alpah", "alpha", 1, "a swap of neighbours costs 1 (common practice, no source)"},
		{"", "abc", 3, "insertions only (common practice, no source)"},
		{"χ", "x", 1, "counted in runes, not bytes (common practice, no source)"},
		{"same", "same", 0, "identity (common practice, no source)"},
	} {
		if got := Distance(c.a, c.b); got != c.want {
			t.Errorf("Distance(%q, %q) = %d, want %d: %s", c.a, c.b, got, c.want, c.why)
		}
		if got := Distance(c.b, c.a); got != c.want {
			t.Errorf("Distance(%q, %q) = %d, want %d (symmetry)", c.b, c.a, got, c.want)
		}
	}
}

func TestClosest(t *testing.T) {
	known := []string{"alpha", "beta", "label", "cooling_time", "dynamical_time", "verified", "Grevesse & Sauval 1998", "mach", "chi"}
	for word, want := range map[string]string{
		"alpah":                  "alpha", // swapped neighbours
		"lable":                  "label", // swapped neighbours
		"bta":                    "beta",  // one deletion
		"ALPHA":                  "alpha", // case
		"coolingtime":            "cooling_time",
		"dynamical-time":         "dynamical_time",
		"verifed":                "verified",
		"dynamic_time":           "dynamical_time",         // two deletions in a long word
		"grevesse & sauval 1989": "Grevesse & Sauval 1998", // returned as given
		"mahc":                   "mach",
		"chu":                    "chi",
		"colour":                 "",
		"x":                      "", // one edit from nothing useful
		"ab":                     "",
		"":                       "",
		"mxch":                   "mach",
		"mxcx":                   "", // two edits in a short word
		strings.Repeat("a", 65):  "", // too long to compare
	} {
		if got := Closest(word, known); got != want {
			t.Errorf("Closest(%q) = %q, want %q", word, got, want)
		}
	}
	// Ties go to the candidate first in byte order, whatever the order given.
	if a, b := Closest("bat", []string{"cat", "bar"}), Closest("bat", []string{"bar", "cat"}); a != "bar" || b != "bar" {
		t.Errorf("tie: Closest = %q and %q, want bar both times", a, b)
	}
}

func FuzzClosest(f *testing.F) {
	f.Add("alpah", "alpha")
	f.Add("χχ", "")
	f.Fuzz(func(t *testing.T, word, cand string) {
		got := Closest(word, []string{cand})
		if got != "" && got != cand {
			t.Fatalf("Closest(%q, [%q]) = %q, not a candidate", word, cand, got)
		}
		if d := Distance(word, cand); d < 0 || d > max(len([]rune(word)), len([]rune(cand))) {
			t.Fatalf("Distance(%q, %q) = %d out of range", word, cand, d)
		}
	})
}
