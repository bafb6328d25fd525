package chart

import (
	"math"
	"strconv"

	"github.com/NimbleMarkets/ntcharts/canvas"

	"cloudwind/internal/chartspec"
)

// Shade ramps for maps counting more than 9 criteria, from "none" to "all";
// both have shadeLevels glyphs.
const (
	shadeRamp      = "·░▒▓█"
	shadeRampASCII = ".-=*#"
	shadeLevels    = 5
)

// RenderRegimeMap draws m in a block of exactly w columns and h rows: h
// lines joined by "\n", each w cells wide as lipgloss.Width measures.
// Each plot cell shows the count of the map cell under it as a digit (a
// shade glyph when m.Total > 9), on the background st.Heat gives that
// count, so that the map reads without colour: 0 and m.Total are cells
// where the criteria agree, the digits between where they disagree, 't' a
// cell where none survives but some predict "transformed"
// (m.Transformed). In cells of class chartspec.Depends every other cell
// (a checkerboard) shows '?' instead, so that the count stays readable
// beside the mark. Counts below zero are shown blank (no data) and counts
// above m.Total as '!'. Simulation runs (m.Runs) are drawn over the cells
// as ✓ (grew or survived), ◐ (transformed) and ✗ (destroyed); S, T and D in
// ASCII. The block holds axes with decade labels, the current point m.Mark
// ('◆', 'X' in ASCII), a legend of every glyph in use and m.Note when room
// allows. Blocks smaller than 20×6 hold only the note "too small". It
// never panics.
func RenderRegimeMap(m *chartspec.RegimeMap, w, h int, st *Styles) string {
	st = stylesOrDefault(st)
	if w < minChartWidth || h < minChartHeight {
		return tooSmallBlock(w, h, st)
	}
	if m == nil {
		m = &chartspec.RegimeMap{}
	}
	rm := mapRender{m: m, st: st, s: newSurface(w, h), total: max(m.Total, 0), ramp: []rune(shadeRamp)}
	if st.ASCII {
		rm.ramp = []rune(shadeRampASCII)
	}
	if !rm.layout() {
		return tooSmallBlock(w, h, st)
	}
	rm.draw()
	return rm.s.String()
}

// A mapRender is the state of one RenderRegimeMap call.
type mapRender struct {
	m     *chartspec.RegimeMap
	st    *Styles
	s     *surface
	total int    // m.Total, at least 0
	ramp  []rune // shade glyphs, shadeLevels of them

	f                  frame
	x0, pw             int
	xlo, xhi, ylo, yhi float64
	ok                 bool // both ranges usable
	xt, yt             []placedTick
	heat               []uint8               // style id of each st.Heat shade
	legend             [][][]textSpan        // legend rows of entries, each a list of spans
	runCells           map[canvas.Point]rune // the runs' cells and glyphs (placeRuns)
	axisID, dimID      uint8
	warnID, markID     uint8
}

// A textSpan is a run of text in one style.
type textSpan struct {
	rs []rune
	id uint8
}

// spansWidth returns the cells spans take.
func spansWidth(sp []textSpan) int {
	n := 0
	for _, p := range sp {
		n += len(p.rs)
	}
	return n
}

// writeSpans writes sp from (x, y) and returns the column after them.
func writeSpans(s *surface, x, y int, sp []textSpan) int {
	for _, p := range sp {
		s.write(x, y, p.rs, p.id, kindText)
		x += len(p.rs)
	}
	return x
}

// layout computes the frame, the ranges, the ticks and the legend; false
// means the block is too small for a map.
func (rm *mapRender) layout() bool {
	m, st, s := rm.m, rm.st, rm.s
	rm.axisID, rm.dimID, rm.warnID, rm.markID = s.addStyle(st.AxisLabel), s.addStyle(st.Dim), s.addStyle(st.Warning), s.addStyle(st.Title)
	for _, hs := range st.Heat {
		rm.heat = append(rm.heat, s.addStyle(hs))
	}
	var xok, yok bool
	rm.xlo, rm.xhi, xok = axisRange(m.X, math.NaN(), math.NaN())
	rm.ylo, rm.yhi, yok = axisRange(m.Y, math.NaN(), math.NaN())
	rm.ok = xok && yok

	rm.legend = packSpans(rm.legendEntries(false), s.w)
	f, ok := layoutFrame(s.h, m.Title != "", m.Y.Label != "", m.X.Label != "", m.Note != "", len(rm.legend))
	if !ok {
		return false
	}
	rm.f = f
	rm.x0 = 1
	if yok {
		rm.yt, rm.x0 = placeYTicks(rm.ylo, rm.yhi, m.Y.Log, f.ph, rm.row)
	}
	rm.pw = s.w - rm.x0 - 1
	if rm.pw < minPlotWidth {
		return false
	}
	if xok {
		rm.xt = pickXTicks(tickSets(rm.xlo, rm.xhi, m.X.Log, rm.pw/3+1), rm.col, s.w)
	}
	rm.placeRuns()
	return true
}

// col returns the surface column of the x value v.
func (rm *mapRender) col(v float64) int { return rm.x0 + areaCell(v, rm.xlo, rm.xhi, rm.pw) }

// row returns the surface row of the y value v.
func (rm *mapRender) row(v float64) int {
	return rm.f.top + rm.f.ph - 1 - areaCell(v, rm.ylo, rm.yhi, rm.f.ph)
}

// heatID returns the style id of count k: the st.Heat shade at the same
// fraction of its length as k of the total.
func (rm *mapRender) heatID(k int) uint8 {
	if len(rm.heat) == 0 {
		return 0
	}
	if rm.total == 0 {
		return rm.heat[0]
	}
	return rm.heat[int(math.Round(float64(k)*float64(len(rm.heat)-1)/float64(rm.total)))]
}

// glyph returns the cell glyph of count k (0 ≤ k ≤ total): its digit, or
// a shade when the total has two digits.
func (rm *mapRender) glyph(k int) rune {
	if rm.total <= 9 {
		return rune('0' + k)
	}
	return rm.ramp[int(math.Round(float64(k)*float64(shadeLevels-1)/float64(rm.total)))]
}

// legendKey returns the colour key: a swatch per count (per shade beyond
// 9) and "of N criteria predict survival".
func (rm *mapRender) legendKey() []textSpan {
	if rm.total == 0 {
		return []textSpan{{[]rune("no criteria counted"), rm.dimID}}
	}
	var sp []textSpan
	text := " of " + strconv.Itoa(rm.total) + " criteria predict survival"
	if rm.total <= 9 {
		// In colour each swatch is " k " on its shade; without, "0 1 2 …".
		for k := 0; k <= rm.total; k++ {
			switch {
			case rm.st.Color:
				sp = append(sp, textSpan{[]rune{' ', rm.glyph(k), ' '}, rm.heatID(k)})
			case k > 0:
				sp = append(sp, textSpan{[]rune{' '}, rm.axisID}, textSpan{[]rune{rm.glyph(k)}, rm.heatID(k)})
			default:
				sp = append(sp, textSpan{[]rune{rm.glyph(k)}, rm.heatID(k)})
			}
		}
		return append(sp, textSpan{[]rune(text), rm.axisID})
	}
	sp = append(sp, textSpan{[]rune("0 "), rm.axisID})
	for l := range shadeLevels {
		k := int(math.Round(float64(l) * float64(rm.total) / float64(shadeLevels-1)))
		sp = append(sp, textSpan{[]rune{rm.glyph(k)}, rm.heatID(k)})
	}
	return append(sp, textSpan{[]rune(" " + strconv.Itoa(rm.total) + text), rm.axisID})
}

// legendKeyText returns the key without swatches, for narrow blocks.
func (rm *mapRender) legendKeyText() []textSpan {
	if rm.total == 0 {
		return rm.legendKey()
	}
	dots := "…"
	if rm.st.ASCII {
		dots = "-"
	}
	n := strconv.Itoa(rm.total)
	return []textSpan{{clipRunes([]rune("0"+dots+n+" of "+n+" criteria predict survival"), rm.s.w, rm.st.ASCII), rm.axisID}}
}

// legendMark returns the legend entry of the current point, if any.
func (rm *mapRender) legendMark() []textSpan {
	mk := rm.m.Mark
	if mk == nil {
		return nil
	}
	label := textRunes(mk.Label, rm.st.ASCII)
	if len(label) == 0 {
		label = []rune("current")
	}
	id, glyph := rm.markID, rm.markGlyph(mk)
	if mk.Warn {
		id = rm.warnID
		label = append([]rune{'!'}, label...)
	}
	sp := []textSpan{{[]rune{glyph, ' '}, id}, {label, rm.axisID}}
	if !rm.markVisible(mk) {
		sp = append(sp, textSpan{[]rune(" (outside the map)"), rm.dimID})
	}
	return sp
}

// markGlyph returns the glyph of the mark: the point glyph, or the line
// glyph of a VLine or HLine mark.
func (rm *mapRender) markGlyph(mk *chartspec.Marker) rune {
	switch {
	case mk.Kind == chartspec.VLine:
		return vlineRune
	case mk.Kind == chartspec.HLine && rm.st.ASCII:
		return hlineRuneASCII
	case mk.Kind == chartspec.HLine:
		return hlineRune
	case rm.st.ASCII:
		return pointRuneASCII
	}
	return pointRune
}

// markVisible reports whether the mark falls inside the map.
func (rm *mapRender) markVisible(mk *chartspec.Marker) bool {
	inX := isFiniteValue(mk.X) && mk.X >= rm.xlo && mk.X <= rm.xhi
	inY := isFiniteValue(mk.Y) && mk.Y >= rm.ylo && mk.Y <= rm.yhi
	switch mk.Kind {
	case chartspec.VLine:
		return rm.ok && inX
	case chartspec.HLine:
		return rm.ok && inY
	}
	return rm.ok && inX && inY
}

// draw draws the axes, the texts, the cells, the mark and the legend.
func (rm *mapRender) draw() {
	m, st, s, f := rm.m, rm.st, rm.s, rm.f
	drawAxes(s, f, rm.x0, rm.pw, rm.xt, rm.yt, axesGlyphs(st.ASCII), rm.axisID)
	ylabel := textRunes(m.Y.Label, rm.st.ASCII)
	if f.ylabel >= 0 {
		s.write(0, f.ylabel, clipRunes(ylabel, s.w, st.ASCII), rm.axisID, kindText)
	}
	if title := textRunes(m.Title, rm.st.ASCII); len(title) > 0 {
		id := s.addStyle(st.Title)
		if f.title >= 0 {
			writeCentred(s, 0, s.w, f.title, title, id, st.ASCII)
		} else if f.ylabel >= 0 && len(ylabel)+3+len(title) <= s.w {
			s.write(s.w-len(title), f.ylabel, title, id, kindText)
		}
	}
	if f.xtitle >= 0 {
		writeCentred(s, rm.x0, rm.pw, f.xtitle, textRunes(m.X.Label, rm.st.ASCII), rm.axisID, st.ASCII)
	}
	if f.note >= 0 {
		s.write(0, f.note, clipRunes(textRunes(m.Note, rm.st.ASCII), s.w, st.ASCII), rm.dimID, kindText)
	}
	for r := 0; r < f.nleg && r < len(rm.legend); r++ {
		x := 0
		for i, e := range rm.legend[r] {
			if i > 0 {
				x += legendGap
			}
			x = writeSpans(s, x, f.legend+r, clipSpans(e, s.w-x, st.ASCII))
		}
		if r == f.nleg-1 && f.nleg < len(rm.legend) {
			ell := []rune("…")
			if st.ASCII {
				ell = []rune("...")
			}
			s.write(min(x+1, s.w-len(ell)), f.legend+r, ell, rm.axisID, kindText)
		}
	}
	if !rm.drawCells() {
		writeCentred(s, rm.x0, rm.pw, f.top+(f.ph-1)/2, []rune("no data"), rm.dimID, st.ASCII)
	}
	rm.drawRuns()
	rm.drawMark()
}

// drawCells fills the plot with the counts, sampling the map cell under
// the centre of each plot cell; false means there was nothing to draw.
func (rm *mapRender) drawCells() bool {
	m := rm.m
	if !rm.ok || m.NX <= 0 || m.NY <= 0 || len(m.Counts) == 0 {
		return false
	}
	for cy := 0; cy < rm.f.ph; cy++ {
		j := int((float64(rm.f.ph-1-cy) + 0.5) * float64(m.NY) / float64(rm.f.ph))
		for cx := 0; cx < rm.pw; cx++ {
			i := int((float64(cx) + 0.5) * float64(m.NX) / float64(rm.pw))
			k, idx := -1, j*m.NX+i
			if idx >= 0 && idx < len(m.Counts) { // idx < 0: NX×NY overflowed
				k = m.Counts[idx]
			}
			x, y := rm.x0+cx, rm.f.top+cy
			switch {
			case k < 0: // no data: left blank
			case k > rm.total:
				rm.s.put(x, y, impossibleRune, rm.warnID, kindGuide)
			case rm.class(idx) == chartspec.Depends && (cx+cy)%2 == 1:
				rm.s.put(x, y, dependsRune, rm.heatID(k), kindGuide)
			case k == 0 && rm.transformed(idx) > 0:
				rm.s.put(x, y, transformedRune, rm.heatID(k), kindGuide)
			default:
				rm.s.put(x, y, rm.glyph(k), rm.heatID(k), kindGuide)
			}
		}
	}
	return true
}

// drawMark draws the current point, or its line for a VLine or HLine mark.
func (rm *mapRender) drawMark() {
	mk := rm.m.Mark
	if mk == nil || !rm.markVisible(mk) {
		return
	}
	id, g := rm.markID, rm.markGlyph(mk)
	if mk.Warn {
		id = rm.warnID
	}
	switch mk.Kind {
	case chartspec.VLine:
		for y := rm.f.top; y < rm.f.top+rm.f.ph; y++ {
			rm.s.put(rm.col(mk.X), y, g, id, kindText)
		}
	case chartspec.HLine:
		for x := rm.x0; x < rm.x0+rm.pw; x++ {
			rm.s.put(x, rm.row(mk.Y), g, id, kindText)
		}
	default:
		rm.s.put(rm.col(mk.X), rm.row(mk.Y), g, id, kindText)
	}
}
