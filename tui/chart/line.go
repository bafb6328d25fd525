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
// with its glyph st.Glyph(Index), lighter and sparser when Dashed.
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

	f      frame
	x0, pw int      // first plot column, plot columns
	sx, sy int      // dots per cell across and down: 2×4 braille, 1×1 runes
	xs, ys dotScale // axis value → dot; ys counts dots up from the bottom
	xt, yt []placedTick
	items  []legendItem   // one per series
	legend [][]legendItem // items packed in rows
	sid    []uint8        // style id of each series
	owners []uint64       // per surface cell: bit i set when series i passes through it (overlap.go)
	axisID uint8
	dimID  uint8
	warnID uint8
	drawn  bool // something was drawn in the plot area
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
	var items []legendItem
	lc.sid = make([]uint8, len(c.Series))
	for i := range c.Series {
		sr := &c.Series[i]
		lc.sid[i] = lc.seriesStyleID(sr)
		name := textRunes(sr.Name, lc.st.ASCII)
		if len(name) == 0 {
			name = []rune("(unnamed)")
		}
		it := legendItem{key: []rune{st.Glyph(sr.Index)}, text: name, keyID: lc.sid[i], textID: legendID}
		if sr.Dashed {
			it.textID = lc.dimID
		}
		items = append(items, it)
	}
	lc.items = items
	if !lc.noLegend {
		lc.legend = packLegend(items, s.w)
	}

	f, ok := layoutFrame(s.h, c.Title != "", c.Y.Label != "", c.X.Label != "", c.Note != "", len(lc.legend))
	if !ok {
		return false
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

// draw draws everything on the surface, bottom layer first: axes and
// texts, marker lines, series, tags, point markers, marker labels.
func (lc *lineRender) draw() {
	c, st, s, f := lc.c, lc.st, lc.s, lc.f
	drawAxes(s, f, lc.x0, lc.pw, lc.xt, lc.yt, axesGlyphs(st.ASCII), lc.axisID)
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

// eachSegment calls seg with every visible piece of sr's polyline,
// clipped to the axis ranges; an isolated finite point inside them comes
// as a segment of zero length. NaN and ±Inf points break the line.
func (lc *lineRender) eachSegment(sr *chartspec.Series, seg func(x0, y0, x1, y1 float64)) {
	n := min(len(sr.X), len(sr.Y))
	ok := func(k int) bool { return k >= 0 && k < n && isFiniteValue(sr.X[k]) && isFiniteValue(sr.Y[k]) }
	for k := 0; k < n; k++ {
		if !ok(k) {
			continue
		}
		x, y := sr.X[k], sr.Y[k]
		if ok(k + 1) {
			if ax, ay, bx, by, vis := clipSegment(x, y, sr.X[k+1], sr.Y[k+1], lc.xs.lo, lc.xs.hi, lc.ys.lo, lc.ys.hi); vis {
				seg(ax, ay, bx, by)
			}
		} else if !ok(k-1) && lc.xs.contains(x) && lc.ys.contains(y) {
			seg(x, y, x, y)
		}
	}
}

// clipSegment clips the segment (x0, y0)–(x1, y1) to the rectangle
// [xlo, xhi]×[ylo, yhi] with the Liang–Barsky algorithm (Liang, Y.-D. and
// Barsky, B. A., "A new concept and method for line clipping", ACM Trans.
// Graph. 3(1), 1984, pp. 1–22); vis is false when nothing is inside.
func clipSegment(x0, y0, x1, y1, xlo, xhi, ylo, yhi float64) (ax, ay, bx, by float64, vis bool) {
	dx, dy := x1-x0, y1-y0
	if !isFiniteValue(dx) || !isFiniteValue(dy) {
		return 0, 0, 0, 0, false
	}
	t0, t1 := 0.0, 1.0
	for _, pq := range [4][2]float64{{-dx, x0 - xlo}, {dx, xhi - x0}, {-dy, y0 - ylo}, {dy, yhi - y0}} {
		p, q := pq[0], pq[1]
		if p == 0 {
			if q < 0 { // parallel to this edge and outside it
				return 0, 0, 0, 0, false
			}
			continue
		}
		r := q / p
		if p < 0 {
			if r > t1 {
				return 0, 0, 0, 0, false
			}
			t0 = math.Max(t0, r)
		} else {
			if r < t0 {
				return 0, 0, 0, 0, false
			}
			t1 = math.Min(t1, r)
		}
	}
	return x0 + t0*dx, y0 + t0*dy, x0 + t1*dx, y0 + t1*dy, true
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
