package chart

import (
	"math"
	"sort"
	"strings"

	"github.com/NimbleMarkets/ntcharts/canvas"
	"github.com/NimbleMarkets/ntcharts/canvas/graph"
	"github.com/NimbleMarkets/ntcharts/canvas/runes"

	"cloudwind/internal/chartspec"
	"cloudwind/model"
)

// Uncertainty bands and simulation runs on a line chart. A band fills the
// region between its edges under the curves: in braille a stipple of
// every other dot of every other dot row, in the curve's colour made
// faint; with runes a light fill glyph. A run is a glyph for its outcome
// over everything but the marker labels.

// Glyphs of bands: the rune-mode fill, its ASCII form, and the braille
// stipple as the legend shows it (dots 1 and 3: U+2805).
const (
	bandRune        = '░'
	bandRuneASCII   = ','
	bandRuneBraille = '⠅'
)

// The legend key of a group of dashed curves (LineChart.DashedName).
const (
	dashedRune      = '┈'
	dashedRuneASCII = '-'
)

// runGlyph returns the glyph of a simulation run's outcome: ✓ for a cloud
// that grew or survived, ◐ transformed, ✗ destroyed; S, T and D in ASCII.
func runGlyph(o model.RunOutcome, ascii bool) rune {
	switch o {
	case model.RunGrew, model.RunSurvived:
		if ascii {
			return 'S'
		}
		return '✓'
	case model.RunTransformed:
		if ascii {
			return 'T'
		}
		return '◐'
	}
	if ascii {
		return 'D'
	}
	return '✗'
}

// runLegend returns the legend entries of runs: one per glyph present, in
// the order survived, transformed, destroyed, the first saying "run".
// (Where the runs come from is in the explorer's status line and details.)
func runLegend(runs []chartspec.RunMark, ascii bool, keyID, textID uint8) []legendItem {
	has := map[rune]bool{}
	for _, r := range runs {
		has[runGlyph(r.Outcome, ascii)] = true
	}
	var items []legendItem
	for _, e := range []struct {
		o    model.RunOutcome
		text string
	}{{model.RunGrew, "grew/survived"}, {model.RunTransformed, "transformed"}, {model.RunDestroyed, "destroyed"}} {
		g := runGlyph(e.o, ascii)
		if !has[g] {
			continue
		}
		text := e.text
		if len(items) == 0 {
			text = "run " + text
		}
		items = append(items, legendItem{key: []rune{g}, text: textRunes(text, ascii), keyID: keyID, textID: textID, keep: true})
	}
	return items
}

// bandAt returns the edges of b at x, interpolated linearly between its
// points (b.X increasing); ok is false outside b.X or where an edge is not
// finite.
func bandAt(b *chartspec.Band, x float64) (lo, hi float64, ok bool) {
	n := min(len(b.X), len(b.Lo), len(b.Hi))
	k := sort.SearchFloat64s(b.X[:n], x)
	switch {
	case n == 0 || k == n:
		return 0, 0, false
	case b.X[k] == x || k == 0:
		if b.X[k] != x {
			return 0, 0, false
		}
		lo, hi = b.Lo[k], b.Hi[k]
	default:
		t := (x - b.X[k-1]) / (b.X[k] - b.X[k-1])
		lo = b.Lo[k-1] + t*(b.Lo[k]-b.Lo[k-1])
		hi = b.Hi[k-1] + t*(b.Hi[k]-b.Hi[k-1])
	}
	return lo, hi, isFiniteValue(lo) && isFiniteValue(hi)
}

// drawBand fills b's region: every braille dot whose centre lies between
// the edges, thinned to a stipple, or in rune mode every cell the band
// overlaps. Only free cells take the fill, so marker lines stay whole; it
// goes under the curves, which replace it.
func (lc *lineRender) drawBand(b *chartspec.Band, id uint8) {
	nx, ny := lc.xs.n, lc.ys.n
	var g *graph.BrailleGrid
	if lc.braille {
		g = graph.NewBrailleGrid(lc.pw, lc.f.ph, lc.xs.lo, lc.xs.hi, lc.ys.lo, lc.ys.hi)
	}
	glyph := bandRune
	if lc.st.ASCII {
		glyph = bandRuneASCII
	}
	for gx := 0; gx < nx; gx++ {
		x := lc.xs.lo + (lc.xs.hi-lc.xs.lo)*float64(gx)/float64(max(nx-1, 1))
		lo, hi, ok := bandAt(b, x)
		if !ok {
			continue
		}
		lo, hi = math.Max(lo, lc.ys.lo), math.Min(hi, lc.ys.hi)
		if lo > hi {
			continue
		}
		scale := float64(ny-1) / (lc.ys.hi - lc.ys.lo)
		// Braille: the dots whose centre lies in the band. Runes: the
		// cells the band overlaps (a cell spans ±1/2 around its centre),
		// so that a band narrower than a cell still shows beside its curve.
		d0 := int(math.Ceil((lo - lc.ys.lo) * scale))
		d1 := int(math.Floor((hi - lc.ys.lo) * scale))
		if g == nil {
			d0 = int(math.Round((lo - lc.ys.lo) * scale))
			d1 = int(math.Round((hi - lc.ys.lo) * scale))
		}
		for d := max(d0, 0); d <= min(d1, ny-1); d++ {
			gy := ny - 1 - d // from the top
			if g != nil {
				if gx%2 == 0 && gy%2 == 0 {
					g.Set(canvas.Point{X: gx, Y: gy})
				}
				continue
			}
			if c := lc.s.at(lc.x0+gx, lc.f.top+gy); c != nil && c.kind == kindNone {
				*c = cell{r: glyph, s: id, kind: kindGuide}
			}
		}
	}
	if g == nil {
		return
	}
	for y, row := range g.BraillePatterns() {
		for x, r := range row {
			c := lc.s.at(lc.x0+x, lc.f.top+y)
			if r == runes.BrailleBlockOffset || c == nil || (c.kind != kindNone && !(c.kind == kindGuide && runes.IsBraillePattern(c.r))) {
				continue
			}
			if runes.IsBraillePattern(c.r) {
				r = runes.CombineBraillePatterns(c.r, r)
			}
			*c = cell{r: r, s: id, kind: kindGuide}
		}
	}
}

// bandStyleID registers the style of a band: its curve's colour, faint;
// dim without colour.
func (lc *lineRender) bandStyleID(b *chartspec.Band) uint8 {
	if !lc.st.Color {
		return lc.dimID
	}
	return lc.s.addStyle(lc.st.SeriesStyle(b.Index).Faint(true))
}

// bandLegend returns the legend entry of the bands, if any: "band: α ×/÷ 2"
// (r_crit when the unverified α is off by that factor either way; the
// help overlay says so in full).
func (lc *lineRender) bandLegend(textID uint8) []legendItem {
	if len(lc.c.Bands) == 0 {
		return nil
	}
	key := bandRune
	switch {
	case lc.st.ASCII:
		key = bandRuneASCII
	case lc.braille:
		key = bandRuneBraille
	}
	return []legendItem{{key: []rune{key}, text: textRunes(strings.TrimSpace("band: α "+lc.c.BandFactor), lc.st.ASCII), keyID: lc.dimID, textID: textID, keep: true}}
}

// mixedRune marks a cell holding runs with different outcomes.
const mixedRune = '&'

// placeRuns returns the cell of every run that inside accepts, with its
// outcome's glyph, or mixedRune where runs with different glyphs share a
// cell; mixed reports whether that happened.
func placeRuns(runs []chartspec.RunMark, ascii bool, inside func(x, y float64) bool, at func(x, y float64) canvas.Point) (cells map[canvas.Point]rune, mixed bool) {
	cells = map[canvas.Point]rune{}
	for _, r := range runs {
		if !isFiniteValue(r.X) || !isFiniteValue(r.Y) || !inside(r.X, r.Y) {
			continue
		}
		p, g := at(r.X, r.Y), runGlyph(r.Outcome, ascii)
		if old, ok := cells[p]; ok && old != g {
			g, mixed = mixedRune, true
		}
		cells[p] = g
	}
	return cells, mixed
}

// mixedLegend is the legend entry of cells with runs of different
// outcomes.
func mixedLegend(ascii bool, keyID, textID uint8) legendItem {
	return legendItem{key: []rune{mixedRune}, text: textRunes("mixed outcomes", ascii), keyID: keyID, textID: textID, keep: true}
}

// placeRuns places the chart's runs on the plot (after layout) and, when
// runs with different outcomes share a cell, adds the entry of '&' to the
// legend, shortening names to keep the legend's rows.
func (lc *lineRender) placeRuns() {
	inside := func(x, y float64) bool { return lc.xs.contains(x) && lc.ys.contains(y) }
	at := func(x, y float64) canvas.Point { return canvas.Point{X: lc.col(x), Y: lc.row(y)} }
	var mixed bool
	lc.runCells, mixed = placeRuns(lc.c.Runs, lc.st.ASCII, inside, at)
	if mixed && !lc.noLegend {
		items := append(append([]legendItem(nil), lc.items...), mixedLegend(lc.st.ASCII, lc.runID, lc.legendID))
		lc.legend, lc.items = fitLegend(items, lc.s.w, max(lc.f.nleg, 1), lc.st.ASCII)
	}
}

// drawRuns draws the runs placed by placeRuns.
func (lc *lineRender) drawRuns(id uint8) {
	for p, g := range lc.runCells {
		lc.s.put(p.X, p.Y, g, id, kindText)
		lc.drawn = true
	}
}
