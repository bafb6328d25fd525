package figure

import (
	"fmt"
	"math"
	"strconv"

	"cloudwind/internal/chartspec"

	"gonum.org/v1/plot"
)

// dataValue converts an axis coordinate (log10 on log axes) to the data
// value gonum/plot draws, and reports whether it can be drawn.
func dataValue(v float64, log bool) (float64, bool) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, false
	}
	if !log {
		return v, true
	}
	if math.Abs(v) > logLimit {
		return 0, false
	}
	return math.Pow(10, v), true
}

// axisRange returns the range of a in axis units: its Min and Max when they
// are usable, else the range of data, widened when it is a single value.
func axisRange(a chartspec.Axis, data []float64) (lo, hi float64) {
	_, okLo := dataValue(a.Min, a.Log)
	_, okHi := dataValue(a.Max, a.Log)
	if okLo && okHi && a.Min < a.Max {
		return a.Min, a.Max
	}
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range data {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	switch {
	case lo > hi:
		return 0, 1
	case lo == hi:
		return lo - 0.5, hi + 0.5
	}
	return lo, hi
}

// setupAxis styles a plot axis for a, with range [lo, hi] in axis units.
// Call it after adding the data: plot.Add widens the range.
func setupAxis(h *richText, pa *plot.Axis, a chartspec.Axis, lo, hi float64) {
	pa.Label.Text = a.Label
	h.setFont(&pa.Label.TextStyle, 10)
	h.setFont(&pa.Tick.Label, 9)
	if a.Log {
		pa.Scale = plot.LogScale{}
		pa.Tick.Marker = plot.TickerFunc(logTicks)
	}
	pa.Min, _ = dataValue(lo, a.Log)
	pa.Max, _ = dataValue(hi, a.Log)
}

// logTicks returns ticks for a log axis from vmin to vmax (> 0):
// decades labelled "10^-2" (drawn 10⁻²; about eight labels at most; the
// rest minor), and minor ticks at 2…9 × 10^k when the range spans six
// decades or fewer. When fewer than two decades fall in the range, the
// minor ticks at 2 and 5 × 10^k are labelled too ("2×10^-1"), and all of
// them within a factor of 3.
func logTicks(vmin, vmax float64) []plot.Tick {
	if !(vmin > 0 && vmax > vmin) || math.IsInf(vmax, 0) {
		return nil
	}
	lo, hi := int(math.Floor(math.Log10(vmin))), int(math.Ceil(math.Log10(vmax)))
	step := max(1, (hi-lo+7)/8)
	var ticks, minor []plot.Tick
	labelled := 0
	for d := lo; d <= hi; d++ {
		v := math.Pow(10, float64(d))
		t := plot.Tick{Value: v}
		if mod(d, step) == 0 {
			t.Label = "10^" + strconv.Itoa(d)
			if v >= vmin && v <= vmax {
				labelled++
			}
		}
		ticks = append(ticks, t)
		for m := 2; m <= 9 && hi-lo <= 6 && d < hi; m++ {
			t := plot.Tick{Value: float64(m) * v}
			if m == 2 || m == 5 || vmax < 3*vmin {
				t.Label = fmt.Sprintf("%d×10^%d", m, d)
			}
			minor = append(minor, t)
		}
	}
	if labelled >= 2 {
		for i := range minor {
			minor[i].Label = ""
		}
	}
	return append(ticks, minor...)
}
