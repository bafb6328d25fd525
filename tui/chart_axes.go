package tui

import (
	"iter"
	"math"
	"strconv"

	"cloudwind/internal/quantity"

	"github.com/NimbleMarkets/ntcharts/canvas/runes"
)

// axisRange returns the visible range [lo, hi] of a: a.Min and a.Max when
// both are finite (swapped if reversed), otherwise the data extent
// [dataLo, dataHi]; a single value v becomes [v−d, v+d] with d = 0.5 axis
// units (half a decade on a log axis) or 10⁻³|v| if larger. ok is false,
// and [0, 1] is returned, when neither gives a usable range.
func axisRange(a Axis, dataLo, dataHi float64) (lo, hi float64, ok bool) {
	lo, hi = a.Min, a.Max
	if !isFiniteValue(lo) || !isFiniteValue(hi) {
		lo, hi = dataLo, dataHi
	}
	if !isFiniteValue(lo) || !isFiniteValue(hi) {
		return 0, 1, false
	}
	if hi < lo {
		lo, hi = hi, lo
	}
	if hi == lo {
		d := math.Max(0.5, math.Abs(lo)*1e-3)
		lo, hi = lo-d, hi+d
	}
	if !isFiniteValue(hi-lo) || !(hi > lo) {
		return 0, 1, false
	}
	return lo, hi, true
}

// A dotScale maps axis values to dot indices 0…n−1 exactly as ntcharts'
// graph.BrailleGrid.GridPoint does: lo at dot 0, hi at dot n−1, rounded to
// the nearest dot. Dots are braille dots (2 per cell across, 4 down) or,
// in rune mode, whole cells.
type dotScale struct {
	lo, hi float64
	n      int
}

// dot returns the dot of v, which must lie in [lo, hi], clamped to 0…n−1
// against rounding at the ends.
func (sc dotScale) dot(v float64) int {
	if sc.n <= 1 {
		return 0
	}
	d := int(math.Round((v - sc.lo) * (float64(sc.n-1) / (sc.hi - sc.lo))))
	return min(max(d, 0), sc.n-1)
}

// contains reports whether v lies in [lo, hi].
func (sc dotScale) contains(v float64) bool { return v >= sc.lo && v <= sc.hi }

// areaCell returns the cell 0…n−1 whose interval holds v when [lo, hi] is
// cut into n equal cells (the regime map's convention), clamped at the ends.
func areaCell(v, lo, hi float64, n int) int {
	c := int(math.Floor((v - lo) / (hi - lo) * float64(n)))
	return min(max(c, 0), n-1)
}

// A chartTick is a labelled value on an axis, in axis units.
type chartTick struct {
	v     float64
	label []rune
}

// tickSets yields candidate sets of ticks for [lo, hi], densest first,
// none with more than maxTicks ticks: on a log axis integer decades
// labelled "1e-2", "1e0", "1e3" (every decade, then every 2nd, 3rd, 5th,
// 10th, …), preceded for ranges of two decades or less by 1-2-5 mantissas
// ("2e1"); on a linear axis multiples of 1, 2 and 5 × 10ⁿ. The last set
// yielded has at most one tick.
func tickSets(lo, hi float64, log bool, maxTicks int) iter.Seq[[]chartTick] {
	maxTicks = max(maxTicks, 1)
	if log {
		return logTickSets(lo, hi, maxTicks)
	}
	return linearTickSets(lo, hi, maxTicks)
}

// tickEps absorbs rounding when testing whether a tick lies in the range.
const tickEps = 1e-9

// logTickSets yields the candidate tick sets of a log axis.
func logTickSets(lo, hi float64, maxTicks int) iter.Seq[[]chartTick] {
	return func(yield func([]chartTick) bool) {
		if math.Abs(lo) > 1e6 || math.Abs(hi) > 1e6 { // 10^(10^6): nothing sensible to label
			return
		}
		kmin, kmax := int(math.Ceil(lo-tickEps)), int(math.Floor(hi+tickEps))
		nd := kmax - kmin + 1
		if nd <= 2 {
			mants := [][]int{{1, 2, 3, 4, 5, 6, 7, 8, 9}, {1, 2, 5}, {1, 3}}
			if nd == 2 {
				mants = mants[1:]
			}
			for _, ms := range mants {
				var set []chartTick
				for k := int(math.Floor(lo)) - 1; k <= int(math.Ceil(hi)); k++ {
					for _, m := range ms {
						v := float64(k) + math.Log10(float64(m))
						if v >= lo-tickEps && v <= hi+tickEps {
							set = append(set, chartTick{v, decadeLabel(m, k)})
						}
					}
				}
				if len(set) <= maxTicks && !yield(set) {
					return
				}
			}
		}
		for step := decadeStepAtLeast((nd + maxTicks - 1) / maxTicks); ; step = nextDecadeStep(step) {
			var set []chartTick
			for k := ceilMultiple(kmin, step); k <= kmax; k += step {
				set = append(set, chartTick{float64(k), decadeLabel(1, k)})
			}
			if !yield(set) || len(set) <= 1 {
				return
			}
		}
	}
}

// decadeLabel returns the ASCII label of m×10^k: "1e-2", "2e3".
func decadeLabel(m, k int) []rune {
	return []rune(strconv.Itoa(m) + "e" + strconv.Itoa(k))
}

// decadeStepAtLeast returns the smallest step of the sequence 1, 2, 3, 5,
// 10, 20, 50, 100, … that is at least n.
func decadeStepAtLeast(n int) int {
	s := 1
	for s < n {
		s = nextDecadeStep(s)
	}
	return s
}

// nextDecadeStep returns the step after s in 1, 2, 3, 5, 10, 20, 50, 100, ….
func nextDecadeStep(s int) int {
	switch s {
	case 2:
		return 3
	case 3:
		return 5
	}
	p := 1
	for p*10 <= s {
		p *= 10
	}
	if s/p == 2 {
		return 5 * p
	}
	return 2 * s
}

// ceilMultiple returns the smallest multiple of step (> 0) that is ≥ k.
func ceilMultiple(k, step int) int {
	r := ((k % step) + step) % step
	if r == 0 {
		return k
	}
	return k + step - r
}

// linearTickSets yields the candidate tick sets of a linear axis.
func linearTickSets(lo, hi float64, maxTicks int) iter.Seq[[]chartTick] {
	return func(yield func([]chartTick) bool) {
		e := int(math.Floor(math.Log10((hi - lo) / float64(maxTicks))))
		mant := 1
		for range 60 {
			step := float64(mant) * math.Pow10(e)
			k0, k1 := math.Ceil(lo/step-tickEps), math.Floor(hi/step+tickEps)
			if k1-k0 < float64(maxTicks) { // also false for NaN (step underflowed)
				maxAbs := math.Max(math.Abs(lo), math.Abs(hi))
				sig := int(math.Floor(math.Log10(maxAbs))) - int(math.Floor(math.Log10(step))) + 1
				sig = min(max(sig, 1), 15)
				var set []chartTick
				for k := k0; k <= k1; k++ {
					v := k * step
					if math.Abs(v) < step*1e-6 {
						v = 0
					}
					set = append(set, chartTick{v, []rune(quantity.FormatSig(v, sig))})
				}
				if !yield(set) || len(set) <= 1 {
					return
				}
			}
			switch mant {
			case 1:
				mant = 2
			case 2:
				mant = 5
			default:
				mant, e = 1, e+1
			}
		}
	}
}

// pickTicks returns the densest set with at least two ticks that fits,
// else the densest set that fits, else nil.
func pickTicks(sets iter.Seq[[]chartTick], fits func([]chartTick) bool) []chartTick {
	var fallback []chartTick
	for set := range sets {
		if !fits(set) {
			continue
		}
		if len(set) >= 2 {
			return set
		}
		if fallback == nil {
			fallback = set
		}
	}
	return fallback
}

// spreadX returns the first column of each label centred on its column
// cols[i] and kept inside [0, w), and whether neighbouring labels leave at
// least gap blank cells between them.
func spreadX(cols []int, labels [][]rune, w, gap int) ([]int, bool) {
	starts := make([]int, len(cols))
	end := math.MinInt / 2
	ok := true
	for i, c := range cols {
		n := len(labels[i])
		s := min(max(c-(n-1)/2, 0), w-n)
		if s < 0 || s < end+gap {
			ok = false
		}
		starts[i] = s
		end = s + n
	}
	return starts, ok
}

// pickXTicks chooses the densest tick set whose labels, centred on the
// columns col(v), fit in w columns with two blank cells between them.
func pickXTicks(sets iter.Seq[[]chartTick], col func(float64) int, w int) []placedTick {
	place := func(ts []chartTick) ([]placedTick, bool) {
		cols, labels := make([]int, len(ts)), make([][]rune, len(ts))
		for i, t := range ts {
			cols[i], labels[i] = col(t.v), t.label
		}
		starts, ok := spreadX(cols, labels, w, 2)
		pts := make([]placedTick, len(ts))
		for i := range ts {
			pts[i] = placedTick{pos: cols[i], start: starts[i], label: labels[i]}
		}
		return pts, ok
	}
	ticks := pickTicks(sets, func(ts []chartTick) bool { _, ok := place(ts); return ok })
	pts, _ := place(ticks)
	return pts
}

// rowsApart reports whether consecutive rows differ by at least 2, so
// that y-axis labels keep a blank row between them.
// placeYTicks chooses the y-axis ticks of a plot ph rows high over
// [lo, hi] that fit without touching, and places them with row; margin is
// the width of the longest label plus one, where the plot starts.
func placeYTicks(lo, hi float64, log bool, ph int, row func(float64) int) (ticks []placedTick, margin int) {
	chosen := pickTicks(tickSets(lo, hi, log, ph/2+1), func(ts []chartTick) bool {
		rows := make([]int, len(ts))
		for i, t := range ts {
			rows[i] = row(t.v)
		}
		return rowsApart(rows)
	})
	for _, t := range chosen {
		ticks = append(ticks, placedTick{pos: row(t.v), label: t.label})
		margin = max(margin, len(t.label))
	}
	return ticks, margin + 1
}

func rowsApart(rows []int) bool {
	for i := 1; i < len(rows); i++ {
		if d := rows[i] - rows[i-1]; d < 2 && d > -2 {
			return false
		}
	}
	return true
}

// A chartFrame is the vertical layout of a chart block: the row of each part
// around the plot, −1 for a part left out for lack of room.
type chartFrame struct {
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
// giving up parts in reverse order of importance (title, note, extra
// legend rows, x-axis title, first legend row, y-axis title) while the
// plot keeps enough rows. ok is false when not even minPlotRows fit.
func layoutFrame(h int, title, ylabel, xtitle, note bool, legendRows int) (f chartFrame, ok bool) {
	r := h - 2 // the axis and tick-label rows are always drawn
	if r < minPlotRows {
		return chartFrame{}, false
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
	if take(legendRows > 0, 3) {
		nleg = 1
	}
	hasX := take(xtitle, 4)
	for nleg < legendRows && take(true, 6) {
		nleg++
	}
	hasNote := take(note, 6)
	hasTitle := take(title, 8)

	f = chartFrame{title: -1, ylabel: -1, xtitle: -1, note: -1}
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
func drawAxes(s *chartSurface, f chartFrame, x0, pw int, xt, yt []placedTick, g axisGlyphs, id uint8) {
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
func drawLegend(s *chartSurface, rows [][]legendItem, y, n int, ascii bool) {
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
func writeCentred(s *chartSurface, x0, n, y int, rs []rune, id uint8, ascii bool) {
	rs = clipRunes(rs, n, ascii)
	s.write(x0+(n-len(rs))/2, y, rs, id, kindText)
}
