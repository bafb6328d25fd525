package quantity

import (
	"math"
	"testing"
	"unicode/utf8"

	"cloudwind/model"
)

// Expected spellings are rules of this package (no physical source).

func TestASCII(t *testing.T) {
	cases := []struct{ in, want string }{
		{"χ = ρ_cl/ρ_hot", "chi = rho_cl/rho_hot"},
		{"1.2 M☉", "1.2 Msun"},
		{"3.33e-4 cm⁻³", "3.33e-4 cm^-3"},
		{"erg cm³ s⁻¹", "erg cm^3 s^-1"},
		{"10⁴–4×10⁴ K", "10^4-4x10^4 K"},
		{"n_H²", "n_H^2"},
		{"∞", "inf"},
		{"−∞", "-inf"},
		{"✓ survives", "[ok] survives"},
		{"✗ destroyed", "[x] destroyed"},
		{"▸ χ", "> chi"},
		{"a → b", "a -> b"},
		{"Λ ∝ T^1/2", "Lambda ~ T^1/2"},
		{"x₂", "x_2"},
		{"plain ascii", "plain ascii"},
		{"日本", "??"},
		{"⣿", "*"},
	}
	for _, c := range cases {
		if got := ASCII(c.in); got != c.want {
			t.Errorf("ASCII(%q) = %q, want %q", c.in, got, c.want)
		}
		if again := ASCII(ASCII(c.in)); again != ASCII(c.in) {
			t.Errorf("ASCII is not idempotent on %q: %q then %q", c.in, ASCII(c.in), again)
		}
	}
}

// TestPrinterASCII formats every kind with extreme values and requires
// plain ASCII from the ASCII printer and the Unicode of Format from the
// zero printer.
func TestPrinterASCII(t *testing.T) {
	ap, up := Printer{ASCII: true}, Printer{}
	for k := model.Dimensionless; k < model.DimensionCount; k++ {
		for _, v := range []float64{0, 1.5 * Factor(k), 3e-9 * Factor(k), 4e12 * Factor(k), math.Inf(1), math.Inf(-1), math.NaN()} {
			got := ap.Format(k, v)
			for i := 0; i < len(got); i++ {
				if got[i] >= utf8.RuneSelf {
					t.Fatalf("Printer{ASCII}.Format(%d, %g) = %q: not ASCII", k, v, got)
				}
			}
			if u := up.Format(k, v); u != Format(k, v) {
				t.Errorf("Printer{}.Format(%d, %g) = %q, want Format's %q", k, v, u, Format(k, v))
			}
			if got != ASCII(Format(k, v)) {
				t.Errorf("Printer{ASCII}.Format(%d, %g) = %q, want the ASCII spelling of %q", k, v, got, Format(k, v))
			}
		}
	}
	if got := ap.Sig(math.Inf(1), 3); got != "inf" {
		t.Errorf("Printer{ASCII}.Sig(+Inf) = %q, want inf", got)
	}
}

// TestPlainUnitsParse requires every plain unit label of a kind that takes
// typed units to be accepted by ParseValue with the same factor, so that
// what --ascii shows can be typed back.
func TestPlainUnitsParse(t *testing.T) {
	for k := model.Dimensionless; k < model.DimensionCount; k++ {
		u := UnitPlain(k)
		if len(inputUnits[k]) == 0 || u == "" {
			continue
		}
		v, err := ParseValue(k, "2 "+u)
		if err != nil {
			t.Errorf("ParseValue(%d, %q): %v", k, "2 "+u, err)
			continue
		}
		if want := 2 * Factor(k); math.Abs(v-want) > 1e-12*want {
			t.Errorf("ParseValue(%d, %q) = %g, want %g", k, "2 "+u, v, want)
		}
	}
}
