package tui

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"

	"cloudwind/internal/suggest"
	"cloudwind/model"
)

// inputUnit is a unit a user may type after a number.
type inputUnit struct {
	names  []string // spellings accepted, compared case-sensitively
	factor float64  // CGS value = typed value × factor
}

// keV is 1 keV expressed as a temperature, 1000 eV / k_B (derived from the
// exact 2019-SI values of e and k_B, CODATA 2018).
const keV = 1e3 * model.ElectronVolt / model.Boltzmann

// inputUnits lists the units accepted for each kind; the first is the
// default when none is typed.
var inputUnits = map[Kind][]inputUnit{
	model.DimLength: {
		{names: []string{"pc"}, factor: float64(model.Parsec)},
		{names: []string{"kpc"}, factor: float64(model.Kiloparsec)},
		{names: []string{"Mpc"}, factor: 1e6 * float64(model.Parsec)},
		{names: []string{"au", "AU"}, factor: float64(model.AstronomicalUnit)},
		{names: []string{"km"}, factor: 1e5},
		{names: []string{"m"}, factor: 1e2},
		{names: []string{"cm"}, factor: 1},
	},
	model.DimTemperature: {
		{names: []string{"K"}, factor: 1},
		{names: []string{"keV"}, factor: keV},
		{names: []string{"eV"}, factor: keV / 1e3},
	},
	model.DimPressure: {
		{names: []string{"K cm-3", "K cm^-3", "K cm⁻³", "K/cm3", "K/cm^3", "K / cm3"}, factor: 1},
		{names: []string{"erg cm-3", "erg/cm3", "erg cm^-3", "dyn cm-2", "dyn/cm2", "erg / cm3"}, factor: 1 / model.Boltzmann},
		// 1 Pa = 1 J m⁻³ = 10 erg cm⁻³ (SI definition).
		{names: []string{"Pa", "J m-3", "J/m3", "J m^-3"}, factor: 10 / model.Boltzmann},
	},
	model.DimTime: {
		{names: []string{"Myr"}, factor: float64(model.Megayear)},
		{names: []string{"kyr"}, factor: 1e3 * float64(model.Year)},
		{names: []string{"Gyr"}, factor: 1e9 * float64(model.Year)},
		{names: []string{"yr"}, factor: float64(model.Year)},
		{names: []string{"s"}, factor: 1},
	},
	model.DimVelocity: {
		{names: []string{"km/s", "km s-1", "km s^-1", "km s⁻¹", "km / s"}, factor: float64(model.KilometrePerSecond)},
		{names: []string{"cm/s", "cm s-1", "cm s^-1", "cm / s"}, factor: 1},
	},
	model.DimCooling: {
		{names: []string{"erg cm3 s-1", "erg cm^3 s^-1", "erg cm³ s⁻¹", "erg cm3 / s"}, factor: 1},
	},
	model.DimMetallicity: {
		{names: []string{"Zsun", "Z☉", "solar"}, factor: 1},
	},
	model.Dimensionless: {},
}

// ErrSyntax is wrapped by every error of ParseValue.
var ErrSyntax = errors.New("invalid value")

// ParseValue parses a number with an optional unit, such as "30 pc",
// "0.5kpc", "2e3", "1e4 K" or "10^4.5 K", into the CGS value of kind k. With no unit the
// kind's default display unit is assumed (pc, K, K cm⁻³, Myr, km s⁻¹).
// NaN, Inf, empty input and unknown units are errors.
func ParseValue(k Kind, s string) (float64, error) {
	s = strings.TrimSpace(s)
	if s == "" {
		return 0, fmt.Errorf("%w: empty", ErrSyntax)
	}
	// The number is the longest prefix strconv accepts, or 10^x with x
	// such a prefix.
	num, pow10 := s, false
	if rest, ok := strings.CutPrefix(s, "10^"); ok {
		num, pow10 = rest, true
	}
	end := numberPrefix(num)
	if end == 0 {
		if pow10 {
			return 0, fmt.Errorf("%w: %q: 10^ needs a number after it", ErrSyntax, clip(s))
		}
		return 0, fmt.Errorf("%w: %q does not start with a number", ErrSyntax, clip(s))
	}
	v, err := strconv.ParseFloat(num[:end], 64)
	if err != nil {
		if errors.Is(err, strconv.ErrRange) {
			return 0, fmt.Errorf("%w: %q is out of range", ErrSyntax, clip(num[:end]))
		}
		return 0, fmt.Errorf("%w: %q is not a number", ErrSyntax, clip(num[:end]))
	}
	if pow10 {
		if v = math.Pow(10, v); !isFiniteValue(v) || v == 0 {
			return 0, fmt.Errorf("%w: %q is out of range", ErrSyntax, clip(s[:3+end]))
		}
	}
	unit := strings.TrimSpace(num[end:])
	units := inputUnits[k]
	scaled := func(f float64) (float64, error) {
		if x := v * f; isFiniteValue(x) {
			return x, nil
		}
		return 0, fmt.Errorf("%w: %q is out of range", ErrSyntax, clip(s))
	}
	if unit == "" {
		if len(units) == 0 {
			return v, nil
		}
		return scaled(units[0].factor)
	}
	for _, u := range units {
		for _, n := range u.names {
			if unit == n {
				return scaled(u.factor)
			}
		}
	}
	if len(units) == 0 {
		return 0, fmt.Errorf("%w: %q takes no unit (got %q)", ErrSyntax, clip(s), clip(unit))
	}
	var names []string
	for _, u := range units {
		names = append(names, u.names...)
	}
	if n := suggest.Closest(unit, names); n != "" {
		return 0, fmt.Errorf("%w: unknown unit %q (did you mean %q? use %s)", ErrSyntax, clip(unit), n, unitList(units))
	}
	return 0, fmt.Errorf("%w: unknown unit %q (use %s)", ErrSyntax, clip(unit), unitList(units))
}

// numberPrefix returns the length of the decimal floating-point literal at
// the start of s (sign, digits, point, exponent); 0 if there is none.
// "inf" and "nan" are not numbers here.
func numberPrefix(s string) int {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	digits := 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i, digits = i+1, digits+1
	}
	if i < len(s) && s[i] == '.' {
		i++
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i, digits = i+1, digits+1
		}
	}
	if digits == 0 {
		return 0
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		if k > j {
			i = k
		}
	}
	return i
}

// unitList names the accepted units, first spelling of each.
func unitList(units []inputUnit) string {
	names := make([]string, len(units))
	for i, u := range units {
		names[i] = u.names[0]
	}
	return strings.Join(names, ", ")
}

// clip shortens text quoted back in an error and removes anything that
// could act on a terminal.
func clip(s string) string {
	s = Sanitize(s)
	if r := []rune(s); len(r) > 24 {
		return string(r[:23]) + "…"
	}
	return s
}

// Sanitize removes control characters (including escape sequences' ESC and
// C1 controls) and invalid UTF-8 from text that came from a file or a user,
// so that it cannot act on the terminal. Tabs become spaces.
func Sanitize(s string) string {
	return strings.Map(func(r rune) rune {
		switch {
		case r == '\t':
			return ' '
		case r == unicode.ReplacementChar, unicode.IsControl(r):
			return -1
		case r >= 0x2028 && r <= 0x202E, r >= 0x2066 && r <= 0x2069: // line separators, bidi overrides
			return -1
		}
		return r
	}, s)
}

// isFiniteValue reports whether v is neither NaN nor ±Inf.
func isFiniteValue(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
