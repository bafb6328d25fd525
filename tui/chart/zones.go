package chart

import "math"

// Zones of a line chart (chartspec.LineChart.Zones): stretches of the x
// axis, e.g. the radii where the criteria disagree. A zone is marked on
// the x axis itself with a heavy line ('━', '~' in ASCII), which reads
// without colour, and with braille the free cells of its columns are
// shaded with a single faint dot. Its legend entry is the axis glyph and
// the chart's ZoneName.

// Glyphs of zones: the axis mark, its ASCII form, and the braille shade
// (dot 2 alone: U+2802).
const (
	zoneRune        = '━'
	zoneRuneASCII   = '~'
	zoneRuneBraille = '⠂'
)

// zoneColumns calls f with every plot column of the chart's zones,
// clipped to the plot.
func (lc *lineRender) zoneColumns(f func(x int)) {
	for _, z := range lc.c.Zones {
		lo, hi := math.Max(z.Lo, lc.xs.lo), math.Min(z.Hi, lc.xs.hi)
		if !isFiniteValue(lo) || !isFiniteValue(hi) || lo > hi {
			continue
		}
		for x := lc.col(lo); x <= lc.col(hi); x++ {
			f(x)
		}
	}
}

// drawZoneAxis marks the zones on the x axis, keeping its ticks.
func (lc *lineRender) drawZoneAxis() {
	r := zoneRune
	if lc.st.ASCII {
		r = zoneRuneASCII
	}
	h := axesGlyphs(lc.st.ASCII).horiz
	lc.zoneColumns(func(x int) {
		if c := lc.s.at(x, lc.f.axis); c != nil && c.r == h {
			*c = cell{r: r, s: lc.axisID, kind: kindGuide}
		}
	})
}

// shadeZones fills the free plot cells of the zones' columns with the
// braille shade (with braille only: in rune mode the axis mark alone
// shows them, so that no glyph is mistaken for a curve's). It runs after
// the curves, so that it never merges into their dots.
func (lc *lineRender) shadeZones() {
	if !lc.braille {
		return
	}
	lc.zoneColumns(func(x int) {
		for y := lc.f.top; y < lc.f.top+lc.f.ph; y++ {
			if c := lc.s.at(x, y); c != nil && c.kind == kindNone && lc.inPlot(x, y) {
				*c = cell{r: zoneRuneBraille, s: lc.dimID, kind: kindGuide}
			}
		}
	})
}

// zoneLegend returns the legend entry of the zones, if any.
func (lc *lineRender) zoneLegend(textID uint8) []legendItem {
	if len(lc.c.Zones) == 0 {
		return nil
	}
	key := zoneRune
	if lc.st.ASCII {
		key = zoneRuneASCII
	}
	name := lc.c.ZoneName
	if name == "" {
		name = "marked zone"
	}
	return []legendItem{{key: []rune{key}, text: textRunes(name, lc.st.ASCII), keyID: lc.axisID, textID: textID, keep: true}}
}
