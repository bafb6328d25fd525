package quantity

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"cloudwind/internal/safetext"
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
	model.DimNumberDensity: {
		{names: []string{"cm-3", "cm^-3", "cm⁻³", "1/cm3", "/cm3"}, factor: 1},
	},
	model.DimMetallicity: {
		{names: []string{"Zsun", "Z☉", "solar"}, factor: 1},
	},
	model.DimPower: {
		{names: []string{"erg/s", "erg s-1", "erg s^-1", "erg s⁻¹", "erg / s"}, factor: 1},
		{names: []string{"W"}, factor: 1e7}, // 1 W = 10⁷ erg s⁻¹ (SI definition)
	},
	model.DimMassRate: {
		{names: []string{"Msun/yr", "Msun yr-1", "Msun yr^-1", "M☉ yr⁻¹", "M☉/yr", "solMass / yr"}, factor: float64(model.SolarMassPerYear)},
		{names: []string{"g/s", "g s-1", "g s^-1", "g s⁻¹", "g / s"}, factor: 1},
	},
	model.Dimensionless: {},
}

// ErrSyntax is wrapped by every error of ParseValue.
var ErrSyntax = errors.New("invalid value")

// ParseValue parses a number with an optional unit, such as "30 pc",
// "0.5kpc", "2e3", "1e4 K" or "10^4.5 K", into the CGS value of kind k. With
// no unit the kind's default display unit is assumed (pc, K, K cm⁻³, Myr,
// km s⁻¹). The number is read by model.ScanNumber. NaN, Inf, empty input
// and unknown units are errors wrapping ErrSyntax.
func ParseValue(k Kind, s string) (float64, error) {
	s = strings.TrimSpace(s)
	if s == "" {
		return 0, fmt.Errorf("%w: empty", ErrSyntax)
	}
	v, end, err := model.ScanNumber(s)
	switch {
	case errors.Is(err, model.ErrNumberRange):
		return 0, fmt.Errorf("%w: %q is out of range", ErrSyntax, clip(s))
	case err != nil && strings.HasPrefix(s, "10^"):
		return 0, fmt.Errorf("%w: %q: 10^ needs a number after it", ErrSyntax, clip(s))
	case err != nil:
		return 0, fmt.Errorf("%w: %q does not start with a number", ErrSyntax, clip(s))
	}
	unit := strings.TrimSpace(s[end:])
	units := inputUnits[k]
	scaled := func(f float64) (float64, error) {
		if x := v * f; isFiniteValue(x) && (x != 0 || v == 0) {
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
func clip(s string) string { return safetext.Clip(s, 24) }

// Sanitize returns text that came from a file, a file name or a flag value
// with everything removed that could act on a terminal (safetext.Terminal).
func Sanitize(s string) string { return safetext.Terminal(s) }

// isFiniteValue reports whether v is neither NaN nor ±Inf.
func isFiniteValue(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
