package figure

import (
	"math"
	"strings"
	"unicode"

	"codeberg.org/go-fonts/dejavu/dejavusans"
	"golang.org/x/image/font/opentype"
	"golang.org/x/image/font/sfnt"

	"cloudwind/internal/quantity"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
)

// Text of exported figures. The chart texts use the notation of
// chartspec (r_cl, t_cool,mix, cm⁻³, T^1/2); figures draw them in DejaVu
// Sans, which has the Greek letters and symbols cloudwind writes (χ, ρ, Λ,
// μ, ☉, ≈, ∝, …), with subscripts and superscripts drawn as smaller,
// lowered or raised text in the same font. gonum/plot's own fonts cannot
// do this: Liberation lacks ⁰, ⁹, ⁻ and ☉ (10⁻² would print as 10²), and
// its LaTeX handler panics on ^ and _ outside math mode.

// The typeface of every text in a figure.
var sansTypeface = font.Font{Typeface: "DejaVu", Variant: "Sans"}

// Geometry of scripts, as fractions of the font size: the size of a
// subscript or superscript and how far it is lowered or raised (common
// typographic practice, close to what TeX does; no source).
const (
	scriptScale = 0.7
	superRise   = 0.36
	subDrop     = 0.16
)

// A scriptKind says how a span of text is set.
type scriptKind uint8

const (
	baseline scriptKind = iota
	superscript
	subscript
)

// A span is a run of text set one way.
type span struct {
	text string
	kind scriptKind
}

// parseMarkup splits s (sanitized first: it may come from a user's file)
// into spans: Unicode superscript and subscript digits and signs (cm⁻³,
// m₀) become raised or lowered ASCII; "^" followed by a signed number or
// fraction ("T^1/2", "10^-2") or by "{…}" starts a superscript; "_"
// after a one-letter symbol (a letter, Greek or Latin, that does not end a
// longer word: r_cl, ρ_hot, k_B, t_cool,mix, v_∞) starts a subscript of
// letters, digits, ∞ and inner commas. Any other "^" or "_" is text (my_table.txt).
func parseMarkup(s string) []span {
	rs := []rune(quantity.Sanitize(s))
	var out []span
	add := func(t string, k scriptKind) {
		if t == "" {
			return
		}
		if n := len(out); n > 0 && out[n-1].kind == k {
			out[n-1].text += t
			return
		}
		out = append(out, span{t, k})
	}
	for i := 0; i < len(rs); i++ {
		r := rs[i]
		if c, kind := quantity.Script(r); kind != 0 {
			add(string(c), scriptKind(kind))
			continue
		}
		switch {
		case r == '^':
			if end, body := superArgument(rs, i+1); end > i+1 {
				add(body, superscript)
				i = end - 1
				continue
			}
		case r == '_' && symbolBefore(rs, i):
			if end := subscriptEnd(rs, i+1); end > i+1 {
				add(string(rs[i+1:end]), subscript)
				i = end - 1
				continue
			}
		}
		add(string(r), baseline)
	}
	return out
}

// superArgument returns the end of the superscript starting at rs[k] and
// its text: "{…}" up to the closing brace, or a number with an optional
// sign, digits and '.' or '/' between digits; end is k when there is none.
func superArgument(rs []rune, k int) (end int, body string) {
	if k < len(rs) && rs[k] == '{' {
		for j := k + 1; j < len(rs); j++ {
			if rs[j] == '}' {
				return j + 1, strings.ReplaceAll(string(rs[k+1:j]), "−", "-")
			}
		}
		return k, ""
	}
	j := k
	if j < len(rs) && (rs[j] == '-' || rs[j] == '+' || rs[j] == '−') {
		j++
	}
	digits := j
	for j < len(rs) && (isDigit(rs[j]) || (rs[j] == '.' || rs[j] == '/') && j+1 < len(rs) && isDigit(rs[j+1]) && j > digits) {
		j++
	}
	if j == digits {
		return k, ""
	}
	return j, strings.ReplaceAll(string(rs[k:j]), "−", "-")
}

// symbolBefore reports whether the '_' at rs[i] follows a one-letter
// symbol: a letter not preceded by another letter or a digit.
func symbolBefore(rs []rune, i int) bool {
	if i < 1 || !unicode.IsLetter(rs[i-1]) {
		return false
	}
	return i < 2 || !(unicode.IsLetter(rs[i-2]) || isDigit(rs[i-2]))
}

// subscriptEnd returns the end of the subscript starting at rs[k]:
// letters and digits, and commas between them.
func subscriptEnd(rs []rune, k int) int {
	j := k
	for j < len(rs) {
		r := rs[j]
		switch {
		case unicode.IsLetter(r) || isDigit(r) || r == '∞': // v_∞, the terminal speed
			j++
		case r == ',' && j > k && j+1 < len(rs) && (unicode.IsLetter(rs[j+1]) || isDigit(rs[j+1])):
			j++
		default:
			return j
		}
	}
	return j
}

func isDigit(r rune) bool { return r >= '0' && r <= '9' }

// richText is the text.Handler of every figure text: single lines in
// DejaVu Sans with the subscripts and superscripts of parseMarkup. A rune
// the font lacks is drawn in its ASCII spelling (quantity.ASCII), never as
// a blank or a wrong glyph; missingGlyphs finds such runes.
type richText struct {
	fonts *font.Cache
	buf   sfnt.Buffer
}

var _ text.Handler = (*richText)(nil)

// newRichText parses DejaVu Sans (embedded by codeberg.org/go-fonts/dejavu)
// into a font cache of the figure's own.
func newRichText() (*richText, error) {
	f, err := opentype.Parse(dejavusans.TTF)
	if err != nil {
		return nil, err
	}
	return &richText{fonts: font.NewCache(font.Collection{{Font: sansTypeface, Face: f}})}, nil
}

// Cache returns the handler's fonts.
func (h *richText) Cache() *font.Cache { return h.fonts }

// Extents returns the extents of fnt.
func (h *richText) Extents(fnt font.Font) font.Extents {
	face := h.fonts.Lookup(fnt, fnt.Size)
	return face.Extents()
}

// Lines splits txt into lines.
func (h *richText) Lines(txt string) []string {
	return strings.Split(strings.TrimRight(txt, "\n"), "\n")
}

// covered reports whether the font has a glyph for r.
func (h *richText) covered(face font.Face, r rune) bool {
	i, err := face.Face.GlyphIndex(&h.buf, r)
	return err == nil && i != 0
}

// spans returns the spans of a line with every rune the font lacks
// replaced by its ASCII spelling.
func (h *richText) spans(line string, fnt font.Font) []span {
	face := h.fonts.Lookup(fnt, fnt.Size)
	sp := parseMarkup(line)
	for i := range sp {
		if strings.IndexFunc(sp[i].text, func(r rune) bool { return !h.covered(face, r) }) < 0 {
			continue
		}
		var b strings.Builder
		for _, r := range sp[i].text {
			if h.covered(face, r) {
				b.WriteRune(r)
			} else {
				b.WriteString(quantity.ASCII(string(r)))
			}
		}
		sp[i].text = b.String()
	}
	return sp
}

// missingGlyphs returns the runes of txt, after markup, that the font
// lacks (and that are therefore spelt in ASCII).
func (h *richText) missingGlyphs(txt string) []rune {
	face := h.fonts.Lookup(font.From(sansTypeface, 10), 10)
	var out []rune
	for _, sp := range parseMarkup(txt) {
		for _, r := range sp.text {
			if !h.covered(face, r) {
				out = append(out, r)
			}
		}
	}
	return out
}

// face returns the face of a span of kind k in fnt.
func (h *richText) face(fnt font.Font, k scriptKind) font.Face {
	size := fnt.Size
	if k != baseline {
		size *= scriptScale
	}
	return h.fonts.Lookup(fnt, size)
}

// shift returns how far a span of kind k is raised (negative: lowered).
func shift(fnt font.Font, k scriptKind) vg.Length {
	switch k {
	case superscript:
		return superRise * fnt.Size
	case subscript:
		return -subDrop * fnt.Size
	}
	return 0
}

// lineWidth returns the width of one line.
func (h *richText) lineWidth(line string, fnt font.Font) vg.Length {
	var w vg.Length
	for _, sp := range h.spans(line, fnt) {
		face := h.face(fnt, sp.kind)
		w += face.Width(sp.text)
	}
	return w
}

// Box returns the width of a line and the font's ascent and descent, as
// gonum/plot's plain handler does: scripts stay within the line's box
// closely enough for labels.
func (h *richText) Box(txt string, fnt font.Font) (width, height, depth vg.Length) {
	face := h.fonts.Lookup(fnt, fnt.Size)
	ext := face.Extents()
	return h.lineWidth(txt, fnt), ext.Ascent, ext.Descent
}

// Draw draws txt with sty at pt: the alignment and rotation of
// gonum/plot's plain handler, and each span in its size at its height.
func (h *richText) Draw(c vg.Canvas, txt string, sty text.Style, pt vg.Point) {
	txt = strings.TrimRight(txt, "\n")
	if txt == "" {
		return
	}
	fnt := sty.Font
	c.SetColor(sty.Color)
	if sty.Rotation != 0 {
		c.Push()
		c.Rotate(sty.Rotation)
	}
	sin64, cos64 := math.Sincos(sty.Rotation)
	sin, cos := vg.Length(sin64), vg.Length(cos64)
	pt.X, pt.Y = pt.Y*sin+pt.X*cos, pt.Y*cos-pt.X*sin
	lines := h.Lines(txt)
	pt.Y += sty.Height(txt)*vg.Length(sty.YAlign) - h.Extents(fnt).Ascent
	for i, line := range lines {
		x := pt.X + vg.Length(sty.XAlign)*h.lineWidth(line, fnt)
		y := pt.Y + vg.Length(len(lines)-i)*fnt.Size
		for _, sp := range h.spans(line, fnt) {
			face := h.face(fnt, sp.kind)
			c.FillString(face, vg.Point{X: x, Y: y + shift(fnt, sp.kind)}, sp.text)
			x += face.Width(sp.text)
		}
	}
	if sty.Rotation != 0 {
		c.Pop()
	}
}
