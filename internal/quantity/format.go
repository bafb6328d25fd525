// Package quantity is the one place where CGS values become display
// strings with units (format.go), where typed values with units are parsed
// back (units.go), and where those strings get their plain-ASCII spelling
// for terminals and fonts without Unicode (ascii.go).
package quantity

import (
	"math"
	"strconv"
	"strings"

	"cloudwind/model"
)

// Kind is the physical kind of a displayed number, model's Dimension; it
// selects the display unit, its conversion from CGS and the significant
// figures.
type Kind = model.Dimension

// A displayUnit converts a CGS value of one Kind for display.
type displayUnit struct {
	label  string  // Unicode label for people, e.g. "km s⁻¹"
	plain  string  // the label in plain ASCII for terminals without Unicode, e.g. "km s^-1"
	ascii  string  // the same unit as an astropy unit string, e.g. "km / s"
	suffix string  // JSON key suffix naming the unit, e.g. "kms"
	factor float64 // display value = CGS value / factor
	sig    int     // significant figures shown
}

// displayUnits is the single table of display units.
var displayUnits = [model.DimensionCount]displayUnit{
	model.Dimensionless:    {"", "", "", "", 1, 3},
	model.DimTemperature:   {"K", "K", "K", "k", 1, 3},
	model.DimNumberDensity: {"cm⁻³", "cm^-3", "cm-3", "cm3", 1, 3},
	model.DimDensity:       {"g cm⁻³", "g cm^-3", "g / cm3", "gcm3", 1, 3},
	model.DimVelocity:      {"km s⁻¹", "km s^-1", "km / s", "kms", float64(model.KilometrePerSecond), 4},
	model.DimTime:          {"Myr", "Myr", "Myr", "myr", float64(model.Megayear), 3},
	model.DimLength:        {"pc", "pc", "pc", "pc", float64(model.Parsec), 3},
	model.DimMass:          {"M☉", "Msun", "solMass", "msun", float64(model.SolarMass), 3},
	model.DimColumn:        {"cm⁻²", "cm^-2", "cm-2", "cm2", 1, 3},
	model.DimPressure:      {"K cm⁻³", "K cm^-3", "K / cm3", "kcm3", 1, 3},
	model.DimCooling:       {"erg cm³ s⁻¹", "erg cm^3 s^-1", "erg cm3 / s", "ergcm3s", 1, 3},
	model.DimMetallicity:   {"Z☉", "Zsun", "", "zsun", 1, 3},
	model.DimPower:         {"erg s⁻¹", "erg s^-1", "erg / s", "ergs", 1, 3},
	model.DimMassRate:      {"M☉ yr⁻¹", "Msun yr^-1", "solMass / yr", "msunyr", float64(model.SolarMassPerYear), 3},
}

// Unit returns the display label of k's unit ("" when dimensionless).
func Unit(k Kind) string { return displayUnits[k].label }

// UnitASCII returns k's unit as an astropy unit string ("" when
// dimensionless or when astropy has no unit for it).
func UnitASCII(k Kind) string { return displayUnits[k].ascii }

// JSONKey returns key with the suffix of k's display unit, e.g.
// JSONKey("t_cc", DimTime) = "t_cc_myr".
func JSONKey(key string, k Kind) string {
	if u := displayUnits[k].suffix; u != "" {
		return key + "_" + u
	}
	return key
}

// Convert returns the CGS value v in k's display unit.
func Convert(k Kind, v float64) float64 { return v / displayUnits[k].factor }

// Number formats the CGS value v in k's display unit without the unit,
// with k's significant figures. NaN shows as "—" and ±Inf as "∞" or "−∞":
// they are never printed as numbers.
func Number(k Kind, v float64) string {
	u := displayUnits[k]
	return formatSig(v/u.factor, u.sig)
}

// Format formats the CGS value v with k's display unit, e.g. "151.4 km s⁻¹".
func Format(k Kind, v float64) string {
	s := Number(k, v)
	if u := displayUnits[k].label; u != "" && !math.IsNaN(v) {
		return s + " " + u
	}
	return s
}

// FormatSig formats a display-unit value with n significant figures.
func FormatSig(v float64, n int) string { return formatSig(v, n) }

// formatSig writes v with n significant figures: plainly when
// 10⁻³ ≤ |v| < 10⁵, otherwise as mantissa and exponent ("3.98e-22").
func formatSig(v float64, n int) string {
	switch {
	case math.IsNaN(v):
		return "—"
	case math.IsInf(v, 1):
		return "∞"
	case math.IsInf(v, -1):
		return "−∞"
	case v == 0:
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e-3 && a < 1e5 {
		// Digits after the point so that n figures show, trailing zeros cut.
		d := n - 1 - int(math.Floor(math.Log10(a)))
		if d < 0 {
			d = 0
		}
		s := strconv.FormatFloat(v, 'f', d, 64)
		// Rounding may have added a digit (9.995 → 10.00); that is harmless.
		if strings.Contains(s, ".") {
			s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
		}
		return s
	}
	s := strconv.FormatFloat(v, 'e', n-1, 64)
	mant, exp, _ := strings.Cut(s, "e")
	if strings.Contains(mant, ".") {
		mant = strings.TrimRight(strings.TrimRight(mant, "0"), ".")
	}
	if exp[0] == '+' {
		exp = exp[1:]
	}
	neg := exp[0] == '-'
	exp = strings.TrimLeft(strings.TrimPrefix(exp, "-"), "0")
	if neg {
		exp = "-" + exp
	}
	return mant + "e" + exp
}

// Factor returns the CGS size of one display unit of k: Convert(k, v) =
// v / Factor(k).
func Factor(k Kind) float64 { return displayUnits[k].factor }
