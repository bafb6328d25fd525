package chart

import (
	"iter"
	"math"
	"strconv"

	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
)

// axisRange returns the visible range [lo, hi] of a: a.Min and a.Max when
// both are finite (swapped if reversed), otherwise the data extent
// [dataLo, dataHi]; a single value v becomes [v−d, v+d] with d = 0.5 axis
// units (half a decade on a log axis) or 10⁻³|v| if larger. ok is false,
// and [0, 1] is returned, when neither gives a usable range.
func axisRange(a chartspec.Axis, dataLo, dataHi float64) (lo, hi float64, ok bool) {
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

// A tick is a labelled value on an axis, in axis units.
type tick struct {
	v     float64
	label []rune
}

// tickSets yields candidate sets of ticks for [lo, hi], densest first,
// none with more than maxTicks ticks: on a log axis integer decades
// labelled "1e-2", "1e0", "1e3" (every decade, then every 2nd, 3rd, 5th,
// 10th, …), preceded for ranges of two decades or less by 1-2-5 mantissas
// ("2e1"); on a linear axis multiples of 1, 2 and 5 × 10ⁿ. The last set
// yielded has at most one tick.
func tickSets(lo, hi float64, log bool, maxTicks int) iter.Seq[[]tick] {
	maxTicks = max(maxTicks, 1)
	if log {
		return logTickSets(lo, hi, maxTicks)
	}
	return linearTickSets(lo, hi, maxTicks)
}

// tickEps absorbs rounding when testing whether a tick lies in the range.
const tickEps = 1e-9

// logTickSets yields the candidate tick sets of a log axis.
func logTickSets(lo, hi float64, maxTicks int) iter.Seq[[]tick] {
	return func(yield func([]tick) bool) {
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
				var set []tick
				for k := int(math.Floor(lo)) - 1; k <= int(math.Ceil(hi)); k++ {
					for _, m := range ms {
						v := float64(k) + math.Log10(float64(m))
						if v >= lo-tickEps && v <= hi+tickEps {
							set = append(set, tick{v, decadeLabel(m, k)})
						}
					}
				}
				if len(set) <= maxTicks && !yield(set) {
					return
				}
			}
		}
		for step := decadeStepAtLeast((nd + maxTicks - 1) / maxTicks); ; step = nextDecadeStep(step) {
			var set []tick
			for k := ceilMultiple(kmin, step); k <= kmax; k += step {
				set = append(set, tick{float64(k), decadeLabel(1, k)})
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
func linearTickSets(lo, hi float64, maxTicks int) iter.Seq[[]tick] {
	return func(yield func([]tick) bool) {
		e := int(math.Floor(math.Log10((hi - lo) / float64(maxTicks))))
		mant := 1
		for range 60 {
			step := float64(mant) * math.Pow10(e)
			k0, k1 := math.Ceil(lo/step-tickEps), math.Floor(hi/step+tickEps)
			if k1-k0 < float64(maxTicks) { // also false for NaN (step underflowed)
				maxAbs := math.Max(math.Abs(lo), math.Abs(hi))
				sig := int(math.Floor(math.Log10(maxAbs))) - int(math.Floor(math.Log10(step))) + 1
				sig = min(max(sig, 1), 15)
				var set []tick
				for k := k0; k <= k1; k++ {
					v := k * step
					if math.Abs(v) < step*1e-6 {
						v = 0
					}
					set = append(set, tick{v, []rune(quantity.FormatSig(v, sig))})
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
func pickTicks(sets iter.Seq[[]tick], fits func([]tick) bool) []tick {
	var fallback []tick
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
func pickXTicks(sets iter.Seq[[]tick], col func(float64) int, w int) []placedTick {
	place := func(ts []tick) ([]placedTick, bool) {
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
	ticks := pickTicks(sets, func(ts []tick) bool { _, ok := place(ts); return ok })
	pts, _ := place(ticks)
	return pts
}

// placeYTicks chooses the y-axis ticks of a plot ph rows high over
// [lo, hi] that fit without touching, and places them with row; margin is
// the width of the longest label plus one, where the plot starts.
func placeYTicks(lo, hi float64, log bool, ph int, row func(float64) int) (ticks []placedTick, margin int) {
	chosen := pickTicks(tickSets(lo, hi, log, ph/2+1), func(ts []tick) bool {
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

// rowsApart reports whether consecutive rows differ by at least 2, so
// that y-axis labels keep a blank row between them.
func rowsApart(rows []int) bool {
	for i := 1; i < len(rows); i++ {
		if d := rows[i] - rows[i-1]; d < 2 && d > -2 {
			return false
		}
	}
	return true
}
