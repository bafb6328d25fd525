package chart

import (
	"math"
	"strings"
	"unicode/utf8"

	"cloudwind/internal/quantity"

	"github.com/charmbracelet/lipgloss"
)

// A surface is the cell grid the chart renderers draw on: one rune, one
// style and one occupancy kind per terminal cell. It plays the part of
// ntcharts' canvas.Model, whose 560-byte cells and per-cell Render calls
// cost about 2 ms per frame at 120×40 (measured), and it renders runs of
// equally styled cells with one escape sequence each.
type surface struct {
	w, h   int
	cells  []cell
	styles []lipgloss.Style // by style id; id 0 is unstyled
}

// A cell is one terminal cell of a surface.
type cell struct {
	r    rune  // the glyph; 0 is blank
	s    uint8 // style id, an index into surface.styles
	kind uint8 // what occupies the cell, used to place labels
}

// Occupancy kinds of a cell, from free to most important.
const (
	kindNone  uint8 = iota
	kindGuide       // an axis, marker line or map cell
	kindCurve       // part of a series
	kindText        // a label, tag or marker glyph: never overwritten by labels
)

// newSurface returns a blank w×h surface (w, h ≥ 0).
func newSurface(w, h int) *surface {
	w, h = max(w, 0), max(h, 0)
	return &surface{w: w, h: h, cells: make([]cell, w*h), styles: []lipgloss.Style{{}}}
}

// addStyle registers st and returns its id (0, unstyled, once 255 styles
// are registered).
func (s *surface) addStyle(st lipgloss.Style) uint8 {
	if len(s.styles) >= 255 {
		return 0
	}
	s.styles = append(s.styles, st)
	return uint8(len(s.styles) - 1)
}

// at returns the cell at column x, row y, or nil outside the surface.
func (s *surface) at(x, y int) *cell {
	if x < 0 || y < 0 || x >= s.w || y >= s.h {
		return nil
	}
	return &s.cells[y*s.w+x]
}

// put sets the cell at (x, y); positions outside the surface are ignored.
func (s *surface) put(x, y int, r rune, id, kind uint8) {
	if c := s.at(x, y); c != nil {
		*c = cell{r: r, s: id, kind: kind}
	}
}

// write puts rs from (x, y) rightwards, clipped to the surface.
func (s *surface) write(x, y int, rs []rune, id, kind uint8) {
	for i, r := range rs {
		s.put(x+i, y, r, id, kind)
	}
}

// String renders the surface: exactly h lines of exactly w cells joined
// by "\n", each run of equally styled cells wrapped in its style once.
func (s *surface) String() string {
	if s.h == 0 {
		return ""
	}
	pre := make([]string, len(s.styles))
	suf := make([]string, len(s.styles))
	for i := 1; i < len(s.styles); i++ {
		// lipgloss wraps text as prefix + text + reset; render a probe once
		// per style instead of once per cell.
		out := s.styles[i].Render("X")
		if j := strings.IndexByte(out, 'X'); j >= 0 {
			pre[i], suf[i] = out[:j], out[j+1:]
		}
	}
	var b strings.Builder
	b.Grow(s.h * (s.w*3 + 1))
	for y := 0; y < s.h; y++ {
		if y > 0 {
			b.WriteByte('\n')
		}
		row := s.cells[y*s.w : (y+1)*s.w]
		for x := 0; x < len(row); {
			id := row[x].s
			b.WriteString(pre[id])
			for ; x < len(row) && row[x].s == id; x++ {
				if row[x].r == 0 {
					b.WriteByte(' ')
				} else {
					b.WriteRune(row[x].r)
				}
			}
			b.WriteString(suf[id])
		}
	}
	return b.String()
}

// textRunes returns s made safe for a cell grid: sanitized (s may come
// from a user's file), spelt in ASCII when ascii is set (quantity.ASCII:
// χ → chi, cm⁻³ → cm^-3), with runes wider than one cell replaced by '?'
// and zero-width runes dropped, so that one rune is one cell.
func textRunes(s string, ascii bool) []rune {
	s = quantity.Sanitize(s)
	if ascii {
		s = quantity.ASCII(strings.ReplaceAll(s, "×/÷", "x or /")) // "×/÷ 2": by a factor 2 either way
	}
	rs := make([]rune, 0, utf8.RuneCountInString(s))
	for _, r := range s {
		if r < utf8.RuneSelf {
			rs = append(rs, r)
			continue
		}
		switch lipgloss.Width(string(r)) {
		case 0:
		case 1:
			rs = append(rs, r)
		default:
			rs = append(rs, '?')
		}
	}
	return rs
}

// clipRunes shortens rs to at most n cells, ending in an ellipsis when cut.
func clipRunes(rs []rune, n int, ascii bool) []rune {
	if len(rs) <= n {
		return rs
	}
	if n <= 0 {
		return nil
	}
	ell := '…'
	if ascii {
		ell = '~'
	}
	out := append([]rune(nil), rs[:n-1]...)
	return append(out, ell)
}

// tooSmallBlock returns a w×h block holding the note "too small", or a
// blank block when even that does not fit.
func tooSmallBlock(w, h int, st *Styles) string {
	s := newSurface(w, h)
	msg := []rune("too small")
	if h > 0 && w >= len(msg) {
		s.write((w-len(msg))/2, (h-1)/2, msg, s.addStyle(st.Dim), kindText)
	}
	return s.String()
}

// stylesOrDefault returns st, or DefaultStyles when st is nil.
func stylesOrDefault(st *Styles) *Styles {
	if st != nil {
		return st
	}
	d := DefaultStyles()
	return &d
}

// isFiniteValue reports whether v is neither NaN nor ±Inf.
func isFiniteValue(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
