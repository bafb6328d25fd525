package chart

import (
	"github.com/NimbleMarkets/ntcharts/canvas"

	"cloudwind/internal/chartspec"
)

// The regime map's classes, runs and legend.

// Cell glyphs beside the counts.
const (
	dependsRune     = '?' // every other cell of class chartspec.Depends
	transformedRune = 't' // none survives, some predict "transformed"
	impossibleRune  = '!' // a count above the total (should not occur)
)

// class returns the class of map cell idx (AllAgree without classes).
func (rm *mapRender) class(idx int) chartspec.Agreement {
	if idx < 0 || idx >= len(rm.m.Class) {
		return chartspec.AllAgree
	}
	return rm.m.Class[idx]
}

// transformed returns how many criteria predict "transformed" in map cell
// idx (0 without that count).
func (rm *mapRender) transformed(idx int) int {
	if idx < 0 || idx >= len(rm.m.Transformed) {
		return 0
	}
	return rm.m.Transformed[idx]
}

// legendEntries returns the legend entries in order of importance: the
// count key, the current point, the '?' of cells that depend on constants
// or conventions, the runs, what agreement the digits show, and 't'.
// Entries only appear for what the map shows.
func (rm *mapRender) legendEntries(mixed bool) [][]textSpan {
	m, ascii := rm.m, rm.st.ASCII
	key := rm.legendKey()
	if spansWidth(key) > rm.s.w {
		key = rm.legendKeyText()
	}
	out := [][]textSpan{key}
	if mk := rm.legendMark(); len(mk) > 0 {
		out = append(out, mk)
	}
	has := map[chartspec.Agreement]bool{}
	for _, c := range m.Class {
		has[c] = true
	}
	if has[chartspec.Depends] {
		text := " depends on constants or conventions"
		if m.SpreadEvery == 0 {
			text = " depends on an unverified constant"
		}
		out = append(out, []textSpan{{[]rune{dependsRune}, rm.axisID}, {[]rune(text), rm.axisID}})
	}
	runs := runLegend(m.Runs, ascii, rm.markID, rm.axisID)
	if mixed {
		runs = append(runs, mixedLegend(ascii, rm.markID, rm.axisID))
	}
	for _, it := range runs {
		out = append(out, []textSpan{{it.key, it.keyID}, {append([]rune{' '}, it.text...), it.textID}})
	}
	if m.Class != nil && rm.total > 1 {
		agree := string(rm.glyph(0)) + " or " + string(rm.glyph(rm.total)) + ": all agree, else they disagree"
		out = append(out, []textSpan{{textRunes(agree, ascii), rm.axisID}})
	}
	for i, n := range m.Transformed {
		if n > 0 && i < len(m.Counts) && m.Counts[i] == 0 {
			out = append(out, []textSpan{{[]rune{transformedRune}, rm.axisID}, {[]rune(" none grows, some transformed"), rm.axisID}})
			break
		}
	}
	return out
}

// packSpans packs legend entries into rows at most w cells wide, in order.
func packSpans(entries [][]textSpan, w int) [][][]textSpan {
	var rows [][][]textSpan
	used := 0
	for _, e := range entries {
		n := spansWidth(e)
		if len(rows) == 0 || used+legendGap+n > w {
			rows = append(rows, nil)
			used = n
		} else {
			used += legendGap + n
		}
		rows[len(rows)-1] = append(rows[len(rows)-1], e)
	}
	return rows
}

// clipSpans shortens spans to at most n cells, ending in an ellipsis when
// cut.
func clipSpans(sp []textSpan, n int, ascii bool) []textSpan {
	if spansWidth(sp) <= n {
		return sp
	}
	var out []textSpan
	for _, p := range sp {
		if len(p.rs) >= n {
			return append(out, textSpan{clipRunes(p.rs, n, ascii), p.id})
		}
		out = append(out, p)
		n -= len(p.rs)
	}
	return out
}

// placeRuns places the map's runs on the plot (after layout) and, when
// runs with different outcomes share a cell, adds the entry of '&' to the
// legend (its last row ends in an ellipsis when there is no room).
func (rm *mapRender) placeRuns() {
	if !rm.ok {
		return
	}
	inside := func(x, y float64) bool { return x >= rm.xlo && x <= rm.xhi && y >= rm.ylo && y <= rm.yhi }
	at := func(x, y float64) canvas.Point { return canvas.Point{X: rm.col(x), Y: rm.row(y)} }
	var mixed bool
	if rm.runCells, mixed = placeRuns(rm.m.Runs, rm.st.ASCII, inside, at); mixed {
		rm.legend = packSpans(rm.legendEntries(true), rm.s.w)
	}
}

// drawRuns draws the runs placed by placeRuns.
func (rm *mapRender) drawRuns() {
	for p, g := range rm.runCells {
		rm.s.put(p.X, p.Y, g, rm.markID, kindText)
	}
}
