package tui

import (
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// The explorer's one path for text: every number, unit, symbol and
// message a pane shows goes through its Styles, which spells it in plain
// ASCII under --ascii (quantity.Printer), before the text is measured and
// fitted, so that columns stay aligned in both character sets.

// P returns the printer of numbers and units for the styles' character set.
func (st *Styles) P() quantity.Printer { return quantity.Printer{ASCII: st.ASCII} }

// T returns s in the styles' character set: unchanged, or spelt in ASCII
// (with the separator " · " as " | ").
func (st *Styles) T(s string) string {
	if st.ASCII {
		s = strings.ReplaceAll(s, " · ", " | ")
		s = strings.ReplaceAll(s, "×/÷", "x or /") // "×/÷ 2": by a factor 2 either way
	}
	return st.P().Text(s)
}

// Format formats the CGS value v of kind k with its unit.
func (st *Styles) Format(k model.Dimension, v float64) string { return st.P().Format(k, v) }

// Sig formats v with n significant figures.
func (st *Styles) Sig(v float64, n int) string { return st.P().Sig(v, n) }

// ellipsis is the mark of text cut to fit.
func (st *Styles) ellipsis() string {
	if st.ASCII {
		return "~"
	}
	return "…"
}

// sep separates items on one line.
func (st *Styles) sep() string {
	if st.ASCII {
		return " | "
	}
	return " · "
}

// cursor marks the selected row.
func (st *Styles) cursor() string {
	if st.ASCII {
		return "> "
	}
	return "▸ "
}

// warnMark marks a caution.
func (st *Styles) warnMark() string {
	if st.ASCII {
		return "(!)"
	}
	return "⚠"
}

// errMark marks an error in the status line.
func (st *Styles) errMark() string {
	if st.ASCII {
		return "[x]"
	}
	return "✗"
}
