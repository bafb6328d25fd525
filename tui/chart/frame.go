package chart

import "github.com/NimbleMarkets/ntcharts/canvas/runes"

// A frame is the vertical layout of a chart block: the row of each part
// around the plot, −1 for a part left out for lack of room.
type frame struct {
	title, ylabel int // title and y-axis title rows
	top, ph       int // first plot row and number of plot rows
	axis, ticks   int // x-axis row and x tick-label row
	xtitle        int // x-axis title row
	legend, nleg  int // first legend row and number of legend rows
	note          int // note row
}

// minPlotRows is the fewest plot rows worth drawing.
const minPlotRows = 3

// layoutFrame divides h rows between the plot and the parts around it,
// giving up parts in reverse order of importance (title, note, x-axis
// title, legend rows, y-axis title) while the plot keeps enough rows: the
// legend names every curve as long as the plot keeps minPlotRows. ok is
// false when not even minPlotRows fit.
func layoutFrame(h int, title, ylabel, xtitle, note bool, legendRows int) (f frame, ok bool) {
	r := h - 2 // the axis and tick-label rows are always drawn
	if r < minPlotRows {
		return frame{}, false
	}
	take := func(want bool, minPlot int) bool {
		if want && r-1 >= minPlot {
			r--
			return true
		}
		return false
	}
	hasY := take(ylabel, 3)
	nleg := 0
	for nleg < legendRows && take(true, minPlotRows) {
		nleg++
	}
	hasX := take(xtitle, 4)
	hasNote := take(note, 6)
	hasTitle := take(title, 8)

	f = frame{title: -1, ylabel: -1, xtitle: -1, note: -1}
	row := 0
	if hasTitle {
		f.title, row = row, row+1
	}
	if hasY {
		f.ylabel, row = row, row+1
	}
	f.top, f.ph = row, r
	row += r
	f.axis, f.ticks = row, row+1
	row += 2
	if hasX {
		f.xtitle, row = row, row+1
	}
	f.legend, f.nleg = row, nleg
	row += nleg
	if hasNote {
		f.note = row
	}
	return f, true
}

// axisGlyphs are the runes of the axes.
type axisGlyphs struct{ vert, horiz, corner, ytick, xtick rune }

// axesGlyphs returns box-drawing axes (ntcharts' runes) or ASCII ones.
func axesGlyphs(ascii bool) axisGlyphs {
	if ascii {
		return axisGlyphs{'|', '-', '+', '+', '+'}
	}
	return axisGlyphs{runes.LineVertical, runes.LineHorizontal, runes.LineUpRight, runes.LineVerticalLeft, runes.LineHorizontalDown}
}

// A placedTick is a tick label at a cell: pos is a column on the x axis
// (start is the label's first column) or a row on the y axis.
type placedTick struct {
	pos, start int
	label      []rune
}

// drawAxes draws the y axis in column x0−1 beside the plot rows, the x
// axis along row f.axis, their tick marks and the tick labels: y labels
// right-aligned against the axis, x labels on row f.ticks.
func drawAxes(s *surface, f frame, x0, pw int, xt, yt []placedTick, g axisGlyphs, id uint8) {
	ax := x0 - 1
	for y := f.top; y < f.top+f.ph; y++ {
		s.put(ax, y, g.vert, id, kindGuide)
	}
	s.put(ax, f.axis, g.corner, id, kindGuide)
	for x := x0; x < x0+pw; x++ {
		s.put(x, f.axis, g.horiz, id, kindGuide)
	}
	for _, t := range yt {
		s.put(ax, t.pos, g.ytick, id, kindGuide)
		s.write(ax-len(t.label), t.pos, t.label, id, kindText)
	}
	for _, t := range xt {
		s.put(t.pos, f.axis, g.xtick, id, kindGuide)
		s.write(t.start, f.ticks, t.label, id, kindText)
	}
}

// A legendItem is one legend entry: a key (a glyph or swatch) and a text.
type legendItem struct {
	key, text     []rune
	keyID, textID uint8
	keep          bool // the text is never shortened (the keys of bands and runs; fitLegend shortens curve names)
	of            int  // 1 + the index of the series the entry names; 0 for other entries
}

// width returns the cells the item takes: key, a space, text.
func (it legendItem) width() int {
	if len(it.text) == 0 {
		return len(it.key)
	}
	return len(it.key) + 1 + len(it.text)
}

// legendGap is the blank cells between legend items on a row.
const legendGap = 3

// packLegend splits items into rows at most w cells wide, in order.
func packLegend(items []legendItem, w int) [][]legendItem {
	var rows [][]legendItem
	used := 0
	for _, it := range items {
		n := it.width()
		if len(rows) == 0 || used+legendGap+n > w {
			rows = append(rows, nil)
			used = n
		} else {
			used += legendGap + n
		}
		rows[len(rows)-1] = append(rows[len(rows)-1], it)
	}
	return rows
}

// drawLegend draws the first n rows of a packed legend from row y, each
// item clipped to the width left; with rows left over, the last drawn
// row ends in an ellipsis.
func drawLegend(s *surface, rows [][]legendItem, y, n int, ascii bool) {
	for r := 0; r < n && r < len(rows); r++ {
		x := 0
		for i, it := range rows[r] {
			if i > 0 {
				x += legendGap
			}
			key := clipRunes(it.key, s.w-x, ascii)
			s.write(x, y+r, key, it.keyID, kindText)
			x += len(key)
			if len(it.text) > 0 && x+1 < s.w {
				text := clipRunes(it.text, s.w-x-1, ascii)
				s.write(x+1, y+r, text, it.textID, kindText)
				x += 1 + len(text)
			}
		}
		if r == n-1 && n < len(rows) {
			ell := []rune("…")
			if ascii {
				ell = []rune("...")
			}
			s.write(min(x+1, s.w-len(ell)), y+r, ell, rows[r][0].textID, kindText)
		}
	}
}

// writeCentred writes rs centred in [x0, x0+n) on row y, clipped to n.
func writeCentred(s *surface, x0, n, y int, rs []rune, id uint8, ascii bool) {
	rs = clipRunes(rs, n, ascii)
	s.write(x0+(n-len(rs))/2, y, rs, id, kindText)
}
