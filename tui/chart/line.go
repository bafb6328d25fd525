package chart

import (
	"math"

	"github.com/NimbleMarkets/ntcharts/canvas"
	"github.com/NimbleMarkets/ntcharts/canvas/graph"
	"github.com/NimbleMarkets/ntcharts/canvas/runes"

	"cloudwind/internal/chartspec"
)

// Smallest blocks the renderers draw a chart in; smaller ones get a
// "too small" note.
const (
	minChartWidth  = 20
	minChartHeight = 6
	minPlotWidth   = 8 // plot columns left after the y tick labels
)

// Marker glyphs.
const (
	vlineRune      = ':'
	hlineRune      = '·'
	hlineRuneASCII = '-'
	pointRune      = '◆'
	pointRuneASCII = 'X'
)

// RenderLine draws c in a block of exactly w columns and h rows: h
// lines joined by "\n", each w cells wide as lipgloss.Width measures.
// The block holds the axes with their titles, decade tick labels on log
// axes ("1e-2", "1e0", "1e3") and a few round ticks on linear ones, the
// series, the markers, a legend (glyph and name) and c.Note when room
// allows.
//
// Series are braille curves (via ntcharts' graph.BrailleGrid) when
// st.Color && !st.ASCII, each tagged with its glyph near its end so that
// the legend does not rest on colour; otherwise every series is drawn
// with its glyph st.Glyph(Index), lighter and sparser when Dashed. Bands
// (c.Bands) are drawn under the series as a braille stipple or a light
// fill ('░', ',' in ASCII), and runs (c.Runs) over them as ✓, ◐ and ✗ (S,
// T, D in ASCII), each with a legend entry (bands.go). Zones (c.Zones)
// are marked on the x axis and, with braille, shaded (zones.go). Long legends are
// shortened so that every curve keeps an entry (legend.go).
// Everything is clipped to the plot area; NaN and ±Inf points break a
// line. Blocks smaller than 20×6 hold only the note "too small"; a nil
// chart or one without data shows "no data". It never panics.
func RenderLine(c *chartspec.LineChart, w, h int, st *Styles) string {
	return renderLine(c, w, h, stylesOrDefault(st), true)
}

// renderLine is RenderLine, with or without the legend (RenderPanels
// draws one legend for all its panels).
func renderLine(c *chartspec.LineChart, w, h int, st *Styles, withLegend bool) string {
	if w < minChartWidth || h < minChartHeight {
		return tooSmallBlock(w, h, st)
	}
	if c == nil {
		c = &chartspec.LineChart{}
	}
	lc := lineRender{c: c, st: st, braille: st.Color && !st.ASCII, s: newSurface(w, h), noLegend: !withLegend}
	if !lc.layout() {
		return tooSmallBlock(w, h, st)
	}
	lc.draw()
	return lc.s.String()
}

// A lineRender is the state of one RenderLine call.
type lineRender struct {
	c        *chartspec.LineChart
	st       *Styles
	s        *surface
	braille  bool
	noLegend bool

	f        frame
	x0, pw   int      // first plot column, plot columns
	sx, sy   int      // dots per cell across and down: 2×4 braille, 1×1 runes
	xs, ys   dotScale // axis value → dot; ys counts dots up from the bottom
	xt, yt   []placedTick
	items    []legendItem   // one per series, then the bands' and the runs' entries
	legend   [][]legendItem // items packed in rows
	sid      []uint8        // style id of each series
	owners   []uint64       // per surface cell: bit i set when series i passes through it (overlap.go)
	axisID   uint8
	dimID    uint8
	warnID   uint8
	runID    uint8
	legendID uint8
	runCells map[canvas.Point]rune // the runs' cells and glyphs (placeRuns)
	drawn    bool                  // something was drawn in the plot area
}

// layout computes the frame, the scales and the ticks; false means the
// block is too small for a plot.
func (lc *lineRender) layout() bool {
	c, st, s := lc.c, lc.st, lc.s
	lc.axisID, lc.dimID, lc.warnID = s.addStyle(st.AxisLabel), s.addStyle(st.Dim), s.addStyle(st.Warning)
	dxlo, dxhi := lc.extent(c.X, true)
	dylo, dyhi := lc.extent(c.Y, false)
	xlo, xhi, xok := axisRange(c.X, dxlo, dxhi)
	ylo, yhi, yok := axisRange(c.Y, dylo, dyhi)

	legendID := s.addStyle(st.Legend)
	lc.legendID = legendID
	var items []legendItem
	lc.sid = make([]uint8, len(c.Series))
	solid := map[int]bool{} // indices of solid curves, for c.DashedName
	for i := range c.Series {
		solid[c.Series[i].Index] = solid[c.Series[i].Index] || !c.Series[i].Dashed
	}
	grouped := false
	for i := range c.Series {
		sr := &c.Series[i]
		lc.sid[i] = lc.seriesStyleID(sr)
		if sr.Dashed && c.DashedName != "" && solid[sr.Index] {
			grouped = true // named by the group's entry
			continue
		}
		name := textRunes(sr.Name, lc.st.ASCII)
		if len(name) == 0 {
			name = []rune("(unnamed)")
		}
		it := legendItem{key: []rune{st.Glyph(sr.Index)}, text: name, keyID: lc.sid[i], textID: legendID, of: i + 1}
		if sr.Dashed {
			it.textID = lc.dimID
		}
		items = append(items, it)
	}
	if grouped {
		key := dashedRune
		if st.ASCII {
			key = dashedRuneASCII
		}
		items = append(items, legendItem{key: []rune{key}, text: textRunes(c.DashedName, st.ASCII), keyID: lc.dimID, textID: lc.dimID, keep: true})
	}
	items = append(items, lc.bandLegend(legendID)...)
	items = append(items, lc.zoneLegend(legendID)...)
	lc.runID = s.addStyle(st.Title)
	items = append(items, runLegend(c.Runs, st.ASCII, lc.runID, legendID)...)
	lc.items = items
	if !lc.noLegend {
		lc.legend = packLegend(items, s.w)
	}

	f, ok := layoutFrame(s.h, c.Title != "", c.Y.Label != "", c.X.Label != "", c.Note != "", len(lc.legend))
	if !ok {
		return false
	}
	if f.nleg < len(lc.legend) { // shorten the names to keep every entry (legend.go)
		lc.legend, lc.items = fitLegend(items, s.w, f.nleg, st.ASCII)
		if f, ok = layoutFrame(s.h, c.Title != "", c.Y.Label != "", c.X.Label != "", c.Note != "", len(lc.legend)); !ok {
			return false
		}
	}
	lc.f = f
	lc.sx, lc.sy = 1, 1
	if lc.braille {
		lc.sx, lc.sy = 2, 4
	}
	lc.ys = dotScale{ylo, yhi, f.ph * lc.sy}
	lc.x0 = 1
	if yok {
		lc.yt, lc.x0 = placeYTicks(ylo, yhi, c.Y.Log, f.ph, lc.row)
	}
	lc.pw = s.w - lc.x0 - 1 // one spare column on the right for the last tick label
	if lc.pw < minPlotWidth {
		return false
	}
	lc.xs = dotScale{xlo, xhi, lc.pw * lc.sx}
	if xok {
		lc.xt = pickXTicks(tickSets(xlo, xhi, c.X.Log, lc.pw/3+1), lc.col, s.w)
	}
	lc.placeRuns()
	return true
}

// extent returns the smallest and largest finite coordinate of all
// series along x (or y), or NaN when there is none; it returns a's range
// untouched when that is finite, the data being needed only without it.
func (lc *lineRender) extent(a chartspec.Axis, x bool) (lo, hi float64) {
	if isFiniteValue(a.Min) && isFiniteValue(a.Max) {
		return a.Min, a.Max
	}
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, sr := range lc.c.Series {
		vs := sr.Y
		if x {
			vs = sr.X
		}
		for _, v := range vs {
			if isFiniteValue(v) {
				lo, hi = math.Min(lo, v), math.Max(hi, v)
			}
		}
	}
	if lo > hi {
		return math.NaN(), math.NaN()
	}
	return lo, hi
}

// col returns the surface column of the x value v (in range).
func (lc *lineRender) col(v float64) int { return lc.x0 + lc.xs.dot(v)/lc.sx }

// row returns the surface row of the y value v (in range).
func (lc *lineRender) row(v float64) int {
	return lc.f.top + (lc.ys.n-1-lc.ys.dot(v))/lc.sy
}

// inPlot reports whether the cell (x, y) lies in the plot area.
func (lc *lineRender) inPlot(x, y int) bool {
	return x >= lc.x0 && x < lc.x0+lc.pw && y >= lc.f.top && y < lc.f.top+lc.f.ph
}

// seriesStyleID registers the style of a series: its palette colour,
// faint when dashed.
func (lc *lineRender) seriesStyleID(sr *chartspec.Series) uint8 {
	style := lc.st.SeriesStyle(sr.Index)
	if sr.Dashed {
		if !lc.st.Color {
			return lc.s.addStyle(lc.st.Dim)
		}
		style = style.Faint(true)
	}
	return lc.s.addStyle(style)
}

// draw draws everything on the surface, bottom layer first: axes (with
// the zones' marks) and texts, marker lines, bands, series, the zones'
// shade, tags, point markers, runs, marker labels.
func (lc *lineRender) draw() {
	c, st, s, f := lc.c, lc.st, lc.s, lc.f
	drawAxes(s, f, lc.x0, lc.pw, lc.xt, lc.yt, axesGlyphs(st.ASCII), lc.axisID)
	lc.drawZoneAxis()
	ylabel := textRunes(c.Y.Label, lc.st.ASCII)
	if f.ylabel >= 0 {
		s.write(0, f.ylabel, clipRunes(ylabel, s.w, st.ASCII), lc.axisID, kindText)
	}
	lc.drawTitle(ylabel)
	if f.xtitle >= 0 {
		writeCentred(s, lc.x0, lc.pw, f.xtitle, textRunes(c.X.Label, lc.st.ASCII), lc.axisID, st.ASCII)
	}
	if f.note >= 0 {
		s.write(0, f.note, clipRunes(textRunes(c.Note, lc.st.ASCII), s.w, st.ASCII), lc.dimID, kindText)
	}

	for i := range c.Markers {
		lc.drawMarkerLine(&c.Markers[i])
	}
	for i := range c.Bands {
		lc.drawBand(&c.Bands[i], lc.bandStyleID(&c.Bands[i]))
	}
	ends := make([][]canvas.Point, len(c.Series))
	for i := range c.Series {
		sr := &c.Series[i]
		if lc.braille {
			ends[i] = lc.drawBraille(sr, lc.sid[i], i)
		} else {
			ends[i] = lc.drawRunes(sr, lc.sid[i], i)
		}
		lc.drawn = lc.drawn || len(ends[i]) > 0
	}
	lc.resolveOverlaps()
	lc.shadeZones()
	if !lc.noLegend {
		drawLegend(s, lc.legendWithOverlaps(), f.legend, f.nleg, st.ASCII)
	}
	if lc.braille {
		for i := range c.Series {
			lc.tag(&c.Series[i], lc.sid[i], ends[i])
		}
	}
	for i := range c.Markers {
		lc.drawMarkerPoint(&c.Markers[i])
	}
	lc.drawRuns(lc.runID)
	for i := range c.Markers {
		lc.labelMarker(&c.Markers[i])
	}
	if !lc.drawn {
		writeCentred(s, lc.x0, lc.pw, f.top+(f.ph-1)/2, []rune("no data"), lc.dimID, st.ASCII)
	}
}

// drawTitle writes the title on its own row, or right-aligned on the
// y-axis title row when it fits there.
func (lc *lineRender) drawTitle(ylabel []rune) {
	s, f := lc.s, lc.f
	title := textRunes(lc.c.Title, lc.st.ASCII)
	if len(title) == 0 {
		return
	}
	id := s.addStyle(lc.st.Title)
	switch {
	case f.title >= 0:
		writeCentred(s, 0, s.w, f.title, title, id, lc.st.ASCII)
	case f.ylabel >= 0 && len(ylabel)+3+len(title) <= s.w:
		s.write(s.w-len(title), f.ylabel, title, id, kindText)
	}
}

// drawBraille draws sr as braille: one ntcharts BrailleGrid for the
// series, its dots set along graph.GetLinePoints, then its patterns merged
// into the surface (dots of earlier series kept, the last style winning,
// as ntcharts' DrawBrailleRune does). Dashed series draw 3 dots of every
// 6. It returns the cells of the segment ends in data order.
func (lc *lineRender) drawBraille(sr *chartspec.Series, id uint8, order int) []canvas.Point {
	g := graph.NewBrailleGrid(lc.pw, lc.f.ph, lc.xs.lo, lc.xs.hi, lc.ys.lo, lc.ys.hi)
	var ends []canvas.Point
	n := 0
	set := func(p canvas.Point) {
		if !sr.Dashed || n%6 < 3 {
			g.Set(p)
		}
		n++
	}
	lc.eachSegment(sr, func(x0, y0, x1, y1 float64) {
		a := g.GridPoint(canvas.Float64Point{X: x0, Y: y0})
		b := g.GridPoint(canvas.Float64Point{X: x1, Y: y1})
		if adjacent(a, b) { // most segments of a dense series: no line to trace
			set(a)
			set(b)
		} else {
			for _, p := range graph.GetLinePoints(a, b) {
				set(p)
			}
		}
		ends = appendCell(ends, canvas.Point{X: lc.x0 + a.X/2, Y: lc.f.top + a.Y/4})
		ends = appendCell(ends, canvas.Point{X: lc.x0 + b.X/2, Y: lc.f.top + b.Y/4})
	})
	if len(ends) == 0 {
		return nil
	}
	for y, row := range g.BraillePatterns() {
		for x, r := range row {
			c := lc.s.at(lc.x0+x, lc.f.top+y)
			if r == runes.BrailleBlockOffset || c == nil || c.kind == kindText {
				continue
			}
			if runes.IsBraillePattern(c.r) {
				r = runes.CombineBraillePatterns(c.r, r)
			}
			*c = cell{r: r, s: id, kind: kindCurve}
			lc.own(lc.x0+x, lc.f.top+y, order)
		}
	}
	return ends
}

// drawRunes draws sr with its glyph in every cell its line passes
// through; dashed series skip every other cell. It returns the cells of
// the segment ends in data order.
func (lc *lineRender) drawRunes(sr *chartspec.Series, id uint8, order int) []canvas.Point {
	glyph := lc.st.Glyph(sr.Index)
	var ends []canvas.Point
	prev := canvas.Point{X: -1, Y: -1}
	n := 0
	set := func(p canvas.Point) {
		if p == prev {
			return
		}
		prev = p
		n++
		if sr.Dashed && n%2 == 0 {
			return
		}
		if c := lc.s.at(p.X, p.Y); c != nil && c.kind != kindText && lc.inPlot(p.X, p.Y) {
			*c = cell{r: glyph, s: id, kind: kindCurve}
			lc.own(p.X, p.Y, order)
		}
	}
	lc.eachSegment(sr, func(x0, y0, x1, y1 float64) {
		a := canvas.Point{X: lc.col(x0), Y: lc.row(y0)}
		b := canvas.Point{X: lc.col(x1), Y: lc.row(y1)}
		if a == b {
			set(a)
		} else {
			pts := graph.GetLinePoints(a, b)
			if pts[0] != a { // GetLinePoints may run from b to a
				for i, j := 0, len(pts)-1; i < j; i, j = i+1, j-1 {
					pts[i], pts[j] = pts[j], pts[i]
				}
			}
			for _, p := range pts {
				set(p)
			}
		}
		ends = appendCell(appendCell(ends, a), b)
	})
	return ends
}

// adjacent reports whether a and b are the same or neighbouring dots.
func adjacent(a, b canvas.Point) bool {
	return a.X-b.X <= 1 && b.X-a.X <= 1 && a.Y-b.Y <= 1 && b.Y-a.Y <= 1
}

// appendCell appends p unless it repeats the last cell.
func appendCell(ps []canvas.Point, p canvas.Point) []canvas.Point {
	if len(ps) > 0 && ps[len(ps)-1] == p {
		return ps
	}
	return append(ps, p)
}

// tag writes the glyph of a braille series on its last visible cell not
// yet holding a label or another tag, so that curves can be told apart
// without colour.
func (lc *lineRender) tag(sr *chartspec.Series, id uint8, ends []canvas.Point) {
	for i := len(ends) - 1; i >= 0; i-- {
		p := ends[i]
		if c := lc.s.at(p.X, p.Y); c != nil && c.kind != kindText && lc.inPlot(p.X, p.Y) {
			*c = cell{r: lc.st.Glyph(sr.Index), s: id, kind: kindText}
			return
		}
	}
}
