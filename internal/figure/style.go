package figure

import (
	"image/color"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Colours of the series: the Okabe–Ito palette (Okabe & Ito 2008, "Color
// Universal Design"), distinguishable with the common colour-vision
// deficiencies, without its yellow, which vanishes on white.
// In order: blue, vermillion, bluish green, reddish purple, orange, sky
// blue, black.
var seriesColors = [...]color.RGBA{{0x00, 0x72, 0xB2, 0xff}, {0xD5, 0x5E, 0x00, 0xff}, {0x00, 0x9E, 0x73, 0xff},
	{0xCC, 0x79, 0xA7, 0xff}, {0xE6, 0x9F, 0x00, 0xff}, {0x56, 0xB4, 0xE9, 0xff}, {0x00, 0x00, 0x00, 0xff}}

// seriesDashes are dash patterns in points, one per series, so that curves
// stay apart in grey-scale prints; the count is coprime with the colours'.
var seriesDashes = [...][]vg.Length{nil, {6, 3}, {2, 2}, {8, 3, 2, 3}, {4, 2, 1, 2, 1, 2}, {1, 3}, {10, 3, 2, 3, 2, 3}, {12, 4}}

// lineStyle returns the line style of series index i; dashed (a pinned
// comparison curve) is thinner and lighter with the same pattern.
func lineStyle(i int, dashed bool) draw.LineStyle {
	c := seriesColors[mod(i, len(seriesColors))]
	sty := draw.LineStyle{Color: c, Width: vg.Points(1.6), Dashes: seriesDashes[mod(i, len(seriesDashes))]}
	if dashed {
		c.R, c.G, c.B = c.R/2+0x7f, c.G/2+0x7f, c.B/2+0x7f
		sty.Color, sty.Width = c, vg.Points(1)
	}
	return sty
}

// mod returns i mod n in 0…n-1 for any sign of i.
func mod(i, n int) int { return (i%n + n) % n }

// textStyle returns the style of a text of size points in colour c,
// drawn by h.
func (h *richText) textStyle(size float64, c color.Color) text.Style {
	return text.Style{Color: c, Font: font.From(sansTypeface, vg.Points(size)), Handler: h}
}

// setFont sets the font of sty to size points, drawn by h.
func (h *richText) setFont(sty *text.Style, size float64) {
	sty.Font = font.From(sansTypeface, vg.Points(size))
	sty.Handler = h
}
