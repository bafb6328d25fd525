package chart

import "math/bits"

// Overlapping curves. A curve drawn over an earlier one would hide it
// where they coincide (braille dots merge but take the last style; glyphs
// replace glyphs), and two criteria with the same threshold would look
// like one. So every plot cell remembers which series pass through it; a
// cell shared by several shows the last drawn, except in every third
// column, which shows an earlier one (in turn when there are several), so
// that a covered curve keeps its glyph or colour every few columns
// ("oo+oo+"); and a
// series that shares nearly all its cells (overlapShare) with an earlier
// one says so in the legend, "(overlaps +)", when the legend has room.

// maxOwners is the most series whose cells are remembered (one bit each).
const maxOwners = 64

// overlapShare is the fraction of its cells a series must share with an
// earlier one for the legend to say that it overlaps it: curves that only
// run close on a coarse grid are not reported (a rule of this package).
const overlapShare = 0.9

// own records that series i passes through the cell (x, y).
func (lc *lineRender) own(x, y, i int) {
	if i >= maxOwners || x < 0 || y < 0 || x >= lc.s.w || y >= lc.s.h {
		return
	}
	if lc.owners == nil {
		lc.owners = make([]uint64, lc.s.w*lc.s.h)
	}
	lc.owners[y*lc.s.w+x] |= 1 << i
}

// resolveOverlaps gives every third column's curve cells that several
// series share the glyph (in rune mode) and style of an earlier one, the
// earlier ones in turn.
func (lc *lineRender) resolveOverlaps() {
	for idx, m := range lc.owners {
		n := bits.OnesCount64(m)
		if n < 2 {
			continue
		}
		c := &lc.s.cells[idx]
		if c.kind != kindCurve {
			continue
		}
		x := idx % lc.s.w
		if x%3 != 0 {
			continue // the last drawn stays
		}
		i := nthBit(m, (x/3)%(n-1))
		c.s = lc.sid[i]
		if !lc.braille {
			c.r = lc.st.Glyph(lc.c.Series[i].Index)
		}
	}
}

// nthBit returns the index of the k-th set bit of m (k from 0).
func nthBit(m uint64, k int) int {
	for ; k > 0; k-- {
		m &= m - 1
	}
	return bits.TrailingZeros64(m)
}

// overlaps returns, for each series, the earlier series it shares at
// least overlapShare of its cells with (the one it shares most with), or
// -1.
func (lc *lineRender) overlaps() []int {
	n := min(len(lc.c.Series), maxOwners)
	cells := make([]int, n)
	shared := make([][]int, n)
	for i := range shared {
		shared[i] = make([]int, n)
	}
	for _, m := range lc.owners {
		for i := 0; i < n; i++ {
			if m&(1<<i) == 0 {
				continue
			}
			cells[i]++
			for j := 0; j < i; j++ {
				if m&(1<<j) != 0 {
					shared[i][j]++
				}
			}
		}
	}
	out := make([]int, len(lc.c.Series))
	for i := range out {
		out[i] = -1
		if i >= n || cells[i] == 0 {
			continue
		}
		best := 0
		for j := 0; j < i; j++ {
			if shared[i][j] > best && float64(shared[i][j]) >= overlapShare*float64(cells[i]) {
				out[i], best = j, shared[i][j]
			}
		}
	}
	return out
}

// legendWithOverlaps returns the packed legend with "(overlaps g)" after
// each series that mostly coincides with an earlier one, if it still
// fits in the rows reserved for the legend; else the plain legend.
func (lc *lineRender) legendWithOverlaps() [][]legendItem {
	ov := lc.overlaps()
	items := append([]legendItem(nil), lc.items...)
	marked := false
	for k := range items {
		i := items[k].of - 1
		if i < 0 || i >= len(ov) || ov[i] < 0 {
			continue
		}
		items[k].text = append(append([]rune(nil), items[k].text...), []rune(" (overlaps "+string(lc.st.Glyph(lc.c.Series[ov[i]].Index))+")")...)
		marked = true
	}
	if !marked {
		return lc.legend
	}
	if rows := packLegend(items, lc.s.w); len(rows) <= lc.f.nleg {
		return rows
	}
	return lc.legend
}
