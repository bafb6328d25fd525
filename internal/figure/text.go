package figure

import (
	"slices"
	"strings"

	"cloudwind/internal/quantity"
)

// Text of exported figures: the embedded fonts of gonum/plot lack Greek
// letters, superscripts and other symbols, so labels are spelt in ASCII.

// asciiSpelling spells in ASCII the characters of cloudwind's labels that the
// fonts embedded in gonum/plot cannot draw, or that are clearer spelt out.
var asciiSpelling = map[rune]string{
	'χ': "chi", 'Λ': "Lambda", 'λ': "lambda", 'μ': "mu", 'γ': "gamma", 'α': "alpha", 'β': "beta",
	'τ': "tau", 'ρ': "rho", 'σ': "sigma", 'Δ': "Delta", 'δ': "delta", 'π': "pi", 'θ': "theta",
	'ν': "nu", 'ε': "eps", 'η': "eta", 'κ': "kappa", 'ω': "omega", 'φ': "phi", 'ξ': "xi",
	'☉': "sun", '⊙': "sun", '𝒩': "N", '·': " ", '×': "x", '−': "-", '–': "-", '—': "--", '…': "...",
	'≈': "~", '∼': "~", '∝': "~", '≤': "<=", '≥': ">=", '±': "+/-", '°': "deg", '√': "sqrt", '∞': "inf",
	'→': "->", '‘': "'", '’': "'", '“': `"`, '”': `"`, '\u00a0': " ", 'é': "e", 'è': "e", 'ö': "o", 'ü': "u",
}

// scriptChar returns the ASCII character of a superscript (kind 1) or
// subscript (kind 2) digit or sign, or kind 0 for any other rune.
func scriptChar(r rune) (byte, int) {
	for kind, set := range [...]string{"⁰¹²³⁴⁵⁶⁷⁸⁹⁺⁻", "₀₁₂₃₄₅₆₇₈₉₊₋"} {
		if i := slices.Index([]rune(set), r); i >= 0 {
			return "0123456789+-"[i], kind + 1
		}
	}
	return 0, 0
}

// asciiText returns s in ASCII for the figure fonts: control characters
// removed (Sanitize), a run of superscripts written "^-3", of subscripts
// "_2", the characters of asciiSpelling spelt out (χ → chi, ☉ → sun), and any
// other non-ASCII rune replaced by '?'.
func asciiText(s string) string {
	var b strings.Builder
	run := 0
	for _, r := range quantity.Sanitize(s) {
		if c, kind := scriptChar(r); kind != 0 {
			if kind != run {
				b.WriteString([...]string{"", "^", "_"}[kind])
			}
			b.WriteByte(c)
			run = kind
			continue
		}
		run = 0
		if name, ok := asciiSpelling[r]; ok {
			b.WriteString(name)
		} else if r < 0x80 {
			b.WriteRune(r)
		} else {
			b.WriteByte('?')
		}
	}
	return b.String()
}
