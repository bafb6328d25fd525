package quantity

import (
	"errors"
	"math"
	"strings"
	"testing"

	"cloudwind/model"
)

func TestFormatSig(t *testing.T) {
	// Format rules of this package (no physical source).
	cases := []struct {
		v    float64
		n    int
		want string
	}{
		{151.4234, 4, "151.4"},
		{0.0645741, 3, "0.0646"},
		{1e6, 3, "1e6"},
		{3.981e-22, 3, "3.98e-22"},
		{-2.5e-7, 2, "-2.5e-7"},
		{99999, 3, "99999"},
		{1, 3, "1"},
		{0, 3, "0"},
		{math.NaN(), 3, "—"},
		{math.Inf(1), 3, "∞"},
		{math.Inf(-1), 3, "−∞"},
	}
	for _, c := range cases {
		if got := formatSig(c.v, c.n); got != c.want {
			t.Errorf("formatSig(%g, %d) = %q, want %q", c.v, c.n, got, c.want)
		}
	}
}

func TestFormatUnits(t *testing.T) {
	// Derived: c_s(1e6 K, μ = 0.6) = 151.423 km/s.
	if got := Format(model.DimVelocity, float64(model.SoundSpeed(1e6, 0.6, 5.0/3))); got != "151.4 km s⁻¹" {
		t.Errorf("Format(velocity, c_s(1e6 K)) = %q, want %q", got, "151.4 km s⁻¹")
	}
	if got := Format(model.DimLength, float64(model.Parsec)*2.5528); got != "2.55 pc" {
		t.Errorf("Format(length, 2.5528 pc) = %q", got)
	}
	if got := Format(model.DimTime, math.Inf(1)); got != "∞ Myr" {
		t.Errorf("Format(time, +Inf) = %q, want %q", got, "∞ Myr")
	}
	if got := Format(model.DimTime, math.NaN()); got != "—" {
		t.Errorf("Format(time, NaN) = %q, want %q", got, "—")
	}
}

func TestParseValue(t *testing.T) {
	pc := float64(model.Parsec)
	cases := []struct {
		k    Kind
		in   string
		want float64
	}{
		{model.DimLength, "30 pc", 30 * pc},
		{model.DimLength, "30pc", 30 * pc},
		{model.DimLength, "30", 30 * pc},
		{model.DimLength, "0.5 kpc", 500 * pc},
		{model.DimLength, "1e19 cm", 1e19},
		{model.DimLength, "206264.80624709636 au", pc}, // 1 pc = 648000/π au (IAU 2015 B2)
		{model.DimTemperature, "1e4", 1e4},
		{model.DimTemperature, "1 keV", 1.160451812e7}, // 1 keV/k_B (CODATA 2018 exact e, k_B)
		{model.DimPressure, "2e3", 2e3},
		{model.DimPressure, "1e3 K cm-3", 1e3},
		{model.DimPressure, "1.380649e-13 erg cm-3", 1e3},
		{model.DimPressure, "1.380649e-14 Pa", 1e3}, // 1 Pa = 10 erg cm⁻³ (SI definition); k_B CODATA 2018 exact
		{model.DimPressure, "1.380649e-14 J m-3", 1e3},
		{model.DimTime, "2 Myr", 2 * float64(model.Megayear)},
		{model.Dimensionless, "  100 ", 100},
		{model.Dimensionless, "-3.5e+2", -350},
		{model.DimMetallicity, "0.3 Zsun", 0.3},
		{model.DimTemperature, "10^4.5", math.Pow(10, 4.5)},
		{model.DimTemperature, "10^4.5 K", math.Pow(10, 4.5)},
		{model.DimLength, "10^-1kpc", 100 * pc},
		{model.Dimensionless, "10^2", 100},
	}
	for _, c := range cases {
		got, err := ParseValue(c.k, c.in)
		if err != nil || math.Abs(got-c.want) > 1e-9*math.Abs(c.want) {
			t.Errorf("ParseValue(%d, %q) = %g, %v; want %g", c.k, c.in, got, err, c.want)
		}
	}
	bad := []struct {
		k    Kind
		in   string
		frag string
	}{
		{model.DimLength, "", "empty"},
		{model.DimLength, "pc", "does not start with a number"},
		{model.DimLength, "30 parsec", `unknown unit "parsec"`},
		{model.DimLength, "NaN", "does not start with a number"},
		{model.DimLength, "inf pc", "does not start with a number"},
		{model.DimLength, "1e999 pc", "out of range"},
		{model.Dimensionless, "100 pc", "takes no unit"},
		{model.DimLength, "3\x1b[31m pc", "unknown unit"},
		{model.DimTemperature, "1e4 C", "use K, keV, eV"},
		{model.DimTemperature, "1 kev", `did you mean "keV"?`},
		{model.DimTemperature, "10^", "10^ needs a number"},
		{model.DimTemperature, "10^K", "10^ needs a number"},
		{model.DimTemperature, "10^400", "out of range"},
		{model.DimTemperature, "10^-400", "out of range"},
		{model.DimLength, "3 kcp", `did you mean "kpc"?`},
	}
	for _, c := range bad {
		_, err := ParseValue(c.k, c.in)
		if err == nil || !errors.Is(err, ErrSyntax) || !strings.Contains(err.Error(), c.frag) {
			t.Errorf("ParseValue(%d, %q) error = %v, want one containing %q", c.k, c.in, err, c.frag)
		}
		if err != nil && strings.ContainsRune(err.Error(), 0x1b) {
			t.Errorf("ParseValue(%q): error %q carries an escape character", c.in, err)
		}
	}
}

func TestSanitize(t *testing.T) {
	in := "ok\x1b[2Jname\x07\r\n\ttab\u202e\x9b"
	if got := Sanitize(in); got != "ok[2Jname tab" {
		t.Errorf("Sanitize(%q) = %q", in, got)
	}
}

func FuzzParseValue(f *testing.F) {
	for _, s := range []string{"30 pc", "1e4", "0.5kpc", "-1e-3 K cm-3", "nan", "1e999", "1.2.3", "+.5e-1 au", "\x00", "9e9999 Myr"} {
		f.Add(int(model.DimLength), s)
	}
	f.Fuzz(func(t *testing.T, k int, s string) {
		kind := Kind(uint(k) % uint(model.DimensionCount))
		v, err := ParseValue(kind, s)
		if err == nil && !isFiniteValue(v) {
			t.Fatalf("ParseValue(%d, %q) = %g without error", kind, s, v)
		}
		if err != nil && (!errors.Is(err, ErrSyntax) || strings.ContainsAny(err.Error(), "\x1b\x07")) {
			t.Fatalf("ParseValue(%d, %q): bad error %v", kind, s, err)
		}
	})
}
