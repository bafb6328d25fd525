package chart

import (
	"github.com/NimbleMarkets/ntcharts/canvas"

	"cloudwind/internal/chartspec"
)

// Markers of a line chart: dotted lines under the series, point glyphs
// over them, and labels placed where they cover the least.

// markerStyleID returns the style of a marker: warning or dim.
func (lc *lineRender) markerStyleID(m *chartspec.Marker) uint8 {
	if m.Warn {
		return lc.warnID
	}
	return lc.dimID
}

// drawMarkerLine draws a VLine or HLine marker as a dotted line across
// the plot, under the series.
func (lc *lineRender) drawMarkerLine(m *chartspec.Marker) {
	id := lc.markerStyleID(m)
	switch {
	case m.Kind == chartspec.VLine && isFiniteValue(m.X) && lc.xs.contains(m.X):
		x := lc.col(m.X)
		for y := lc.f.top; y < lc.f.top+lc.f.ph; y++ {
			lc.s.put(x, y, vlineRune, id, kindGuide)
		}
		lc.drawn = true
	case m.Kind == chartspec.HLine && isFiniteValue(m.Y) && lc.ys.contains(m.Y):
		y, r := lc.row(m.Y), hlineRune
		if lc.st.ASCII {
			r = hlineRuneASCII
		}
		for x := lc.x0; x < lc.x0+lc.pw; x++ {
			if c := lc.s.at(x, y); c.kind == kindNone {
				*c = cell{r: r, s: id, kind: kindGuide}
			}
		}
		lc.drawn = true
	}
}

// pointVisible reports whether a Point marker lies in the plot range.
func (lc *lineRender) pointVisible(m *chartspec.Marker) bool {
	return m.Kind == chartspec.Point && isFiniteValue(m.X) && isFiniteValue(m.Y) && lc.xs.contains(m.X) && lc.ys.contains(m.Y)
}

// drawMarkerPoint draws a Point marker's glyph over the series.
func (lc *lineRender) drawMarkerPoint(m *chartspec.Marker) {
	if !lc.pointVisible(m) {
		return
	}
	r := pointRune
	if lc.st.ASCII {
		r = pointRuneASCII
	}
	lc.s.put(lc.col(m.X), lc.row(m.Y), r, lc.markerStyleID(m), kindText)
	lc.drawn = true
}

// labelMarker writes a marker's label beside it where it covers the
// fewest curve cells, never over another label; a Warn label starts
// with "!" so that the warning survives without colour.
func (lc *lineRender) labelMarker(m *chartspec.Marker) {
	text := textRunes(m.Label, lc.st.ASCII)
	if len(text) == 0 {
		return
	}
	if m.Warn {
		text = append([]rune{'!'}, text...)
	}
	text = clipRunes(text, lc.pw, lc.st.ASCII)
	n, top, bottom, right := len(text), lc.f.top, lc.f.top+lc.f.ph-1, lc.x0+lc.pw
	var cands []canvas.Point
	switch {
	case m.Kind == chartspec.VLine && isFiniteValue(m.X) && lc.xs.contains(m.X):
		x := lc.col(m.X)
		for y := top; y <= bottom; y++ {
			cands = append(cands, canvas.Point{X: x + 1, Y: y}, canvas.Point{X: x - n, Y: y})
		}
	case m.Kind == chartspec.HLine && isFiniteValue(m.Y) && lc.ys.contains(m.Y):
		y := lc.row(m.Y)
		for x := right - n; x >= lc.x0; x-- {
			cands = append(cands, canvas.Point{X: x, Y: y - 1}, canvas.Point{X: x, Y: y + 1})
		}
	case lc.pointVisible(m):
		x, y := lc.col(m.X), lc.row(m.Y)
		cands = []canvas.Point{{X: x + 2, Y: y}, {X: x - n - 1, Y: y}, {X: x - n/2, Y: y - 1}, {X: x - n/2, Y: y + 1}}
	}
	lc.place(text, cands, lc.markerStyleID(m))
}

// place writes text at the candidate position, inside the plot, that
// covers the fewest occupied cells (curves count more than guide lines);
// it gives up rather than cover another label.
func (lc *lineRender) place(text []rune, cands []canvas.Point, id uint8) {
	const textCost = 1000
	best, bestCost := -1, textCost
	for i, p := range cands {
		if !lc.inPlot(p.X, p.Y) || !lc.inPlot(p.X+len(text)-1, p.Y) {
			continue
		}
		cost := 0
		for k := range text {
			switch lc.s.at(p.X+k, p.Y).kind {
			case kindText:
				cost += textCost
			case kindCurve:
				cost += 3
			case kindGuide:
				cost++
			}
		}
		if cost < bestCost {
			best, bestCost = i, cost
			if cost == 0 {
				break
			}
		}
	}
	if best >= 0 {
		lc.s.write(cands[best].X, cands[best].Y, text, id, kindText)
	}
}
