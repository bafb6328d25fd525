package quantity

import (
	"strings"
	"unicode/utf8"
)

// The plain-ASCII spelling of what this package and cloudwind's texts
// write in Unicode, for terminals and fonts without it (the explorer's
// --ascii): χ → chi, M☉ → Msun, cm⁻³ → cm^-3, ∞ → inf, ✓ → [ok].

// A Printer formats numbers, units and texts for one character set: the
// Unicode of Format and Number, or, with ASCII set, plain ASCII in which
// every byte is below 0x80. Its zero value is the Unicode printer.
type Printer struct {
	ASCII bool
}

// Number is Number(k, v), spelt in ASCII by an ASCII printer ("inf",
// "-inf", "--" for NaN).
func (p Printer) Number(k Kind, v float64) string { return p.Text(Number(k, v)) }

// Sig is FormatSig(v, n), spelt in ASCII by an ASCII printer.
func (p Printer) Sig(v float64, n int) string { return p.Text(formatSig(v, n)) }

// Unit returns the label of k's display unit: Unit(k), or its plain
// spelling ("cm^-3", "km s^-1", "Msun", "K cm^-3") for an ASCII printer.
func (p Printer) Unit(k Kind) string {
	if p.ASCII {
		return displayUnits[k].plain
	}
	return displayUnits[k].label
}

// Format is Format(k, v) with p's unit label: "151.4 km s⁻¹", or
// "151.4 km s^-1" for an ASCII printer.
func (p Printer) Format(k Kind, v float64) string {
	s := p.Number(k, v)
	if u := p.Unit(k); u != "" && v == v { // v == v: not NaN
		return s + " " + u
	}
	return s
}

// Text returns s unchanged, or spelt in ASCII (ASCII) by an ASCII printer.
func (p Printer) Text(s string) string {
	if p.ASCII {
		return ASCII(s)
	}
	return s
}

// UnitPlain returns the plain-ASCII label of k's display unit, e.g.
// "cm^-3" for cm⁻³ ("" when dimensionless).
func UnitPlain(k Kind) string { return displayUnits[k].plain }

// asciiSpelling spells in ASCII the non-ASCII characters of cloudwind's
// labels, units, verdicts, formulas and notes. Characters not listed
// become '?'.
var asciiSpelling = map[rune]string{
	// Greek letters, by their names.
	'α': "alpha", 'β': "beta", 'γ': "gamma", 'δ': "delta", 'ε': "eps", 'ζ': "zeta", 'η': "eta", 'θ': "theta",
	'κ': "kappa", 'λ': "lambda", 'μ': "mu", 'µ': "mu", 'ν': "nu", 'ξ': "xi", 'π': "pi", 'ρ': "rho", 'σ': "sigma",
	'τ': "tau", 'φ': "phi", 'χ': "chi", 'ψ': "psi", 'ω': "omega",
	'Γ': "Gamma", 'Δ': "Delta", 'Θ': "Theta", 'Λ': "Lambda", 'Ξ': "Xi", 'Π': "Pi", 'Σ': "Sigma", 'Φ': "Phi",
	'Ψ': "Psi", 'Ω': "Omega",
	// Astronomical and mathematical symbols.
	'☉': "sun", '⊙': "sun", '𝒩': "N", '×': "x", '÷': "/", '−': "-", '–': "-", '—': "--", '…': "...", '·': "-", '•': "*",
	'Ė': "Edot", 'Ṁ': "Mdot", '≫': ">>", '≪': "<<", '≈': "~", '∼': "~", '∝': "~", '≤': "<=", '≥': ">=", '≠': "!=", '±': "+/-", '°': "deg", '√': "sqrt",
	'∞': "inf", '½': "1/2", '¼': "1/4", '¾': "3/4", '§': "sec. ", '′': "'", '″': `"`, 'Å': "A",
	// Arrows, marks and verdicts.
	'→': "->", '←': "<-", '↑': "^", '↓': "v", '⇒': "=>", '↔': "<->",
	'✓': "[ok]", '✔': "[ok]", '✗': "[x]", '✘': "[x]", '▸': ">", '►': ">", '◆': "X", '⚠': "(!)",
	// Typography.
	'‘': "'", '’': "'", '“': `"`, '”': `"`, '\u00a0': " ", '\u2009': " ", '\u202f': " ",
	'é': "e", 'è': "e", 'ê': "e", 'ë': "e", 'á': "a", 'à': "a", 'ä': "a", 'ö': "o", 'ó': "o", 'ü': "u",
	'ú': "u", 'í': "i", 'ñ': "n", 'ç': "c", 'ø': "o", 'å': "a",
	// Box drawing and shades, in case a drawn block is spelt.
	'─': "-", '│': "|", '┌': "+", '┐': "+", '└': "+", '┘': "+", '├': "+", '┤': "+", '┬': "+", '┴': "+",
	'┼': "+", '░': ".", '▒': "=", '▓': "*", '█': "#",
}

// scriptRunes are the superscript and the subscript digits and signs, in
// the order of scriptASCII.
const (
	superRunes  = "⁰¹²³⁴⁵⁶⁷⁸⁹⁺⁻⁼⁽⁾"
	subRunes    = "₀₁₂₃₄₅₆₇₈₉₊₋₌₍₎"
	scriptASCII = "0123456789+-=()"
)

// Script returns the ASCII character of a superscript (kind 1) or
// subscript (kind 2) digit, sign or bracket, or kind 0 for any other rune.
func Script(r rune) (c byte, kind int) {
	for k, set := range [...]string{superRunes, subRunes} {
		i := 0
		for _, s := range set {
			if s == r {
				return scriptASCII[i], k + 1
			}
			i++
		}
	}
	return 0, 0
}

// ASCII returns s spelt in plain ASCII: a run of superscripts as "^-3"
// (cm⁻³ → cm^-3), of subscripts as "_2", the characters of asciiSpelling
// by their spelling (χ → chi, M☉ → Msun, ∞ → inf, ✓ → [ok], ▸ → >), and any
// other non-ASCII rune as '?'. ASCII text comes back unchanged, so the
// function is idempotent; every byte of the result is below 0x80.
func ASCII(s string) string {
	ascii := true
	for i := 0; i < len(s); i++ {
		if s[i] >= utf8.RuneSelf {
			ascii = false
			break
		}
	}
	if ascii {
		return s
	}
	var b strings.Builder
	b.Grow(len(s) + 8)
	run := 0
	for _, r := range s {
		if c, kind := Script(r); kind != 0 {
			if kind != run {
				b.WriteString([...]string{"", "^", "_"}[kind])
			}
			b.WriteByte(c)
			run = kind
			continue
		}
		run = 0
		switch name, ok := asciiSpelling[r]; {
		case r < utf8.RuneSelf:
			b.WriteRune(r)
		case ok:
			b.WriteString(name)
		case r >= 0x2800 && r <= 0x28ff: // braille patterns: a dot
			b.WriteByte('*')
		default:
			b.WriteByte('?')
		}
	}
	return b.String()
}
