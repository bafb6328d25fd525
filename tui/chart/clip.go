package chart

import (
	"math"

	"cloudwind/internal/chartspec"
)

// Clipping the polylines of a line chart to its axis ranges.

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
