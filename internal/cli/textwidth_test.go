package cli

import (
	"strings"
	"testing"
	"unicode/utf8"

	"cloudwind/internal/report"
)

// TestTextOutputWidth: the text output of every command fits
// report.TextWidth (100) columns, for the fiducial inputs and for inputs
// that make long numbers and many cautions (a layout rule of cloudwind).
func TestTextOutputWidth(t *testing.T) {
	extreme := []string{"--chi", "1e7", "--mach", "100", "--radius", "1Mpc"}
	for _, args := range [][]string{
		{"eval"}, append([]string{"eval"}, extreme...), {"eval", "--cooling", "rosen-bregman-1995", "--density-product", "n2"},
		{"evolve"}, {"evolve", "--criterion", "gronke-oh-2018", "--radius", "30pc"},
		{"plan"}, {"plan", "--compare"}, {"plan", "--question", "entrainment", "--mhd"},
		{"cooling"}, {"cooling", "--vs", "rosen-bregman-1995"}, {"cooling", "--cooling", "tozzi-norman-2001"},
		{"outflow"}, {"outflow", "--carry", "--radius", "1pc"}, {"outflow", "--radius", "200pc", "--r-max", "1e3", "--edot", "1e45", "--mdot", "1e3"},
		{"help"}, {"eval", "--help"}, {"sweep", "--help"}, {"plan", "--help"}, {"outflow", "--help"},
	} {
		code, out, errs := runCmd(t, "", args...)
		if code != 0 {
			t.Errorf("%q: exit %d: %s", args, code, errs)
			continue
		}
		for i, l := range strings.Split(out, "\n") {
			if n := utf8.RuneCountInString(l); n > report.TextWidth {
				t.Errorf("%q line %d has %d columns, want ≤ %d: %q", args, i+1, n, report.TextWidth, l)
			}
		}
	}
}
