package chart

import (
	"strings"
	"testing"

	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
)

// twoPanels returns two charts with the same series, as the evolution
// view has (synthetic data, no source).
func twoPanels() []*chartspec.LineChart {
	a, b := synthThresholdChart(20), synthThresholdChart(20)
	a.Title, b.Title = "upper panel", "lower panel"
	return []*chartspec.LineChart{a, b}
}

func TestPanelsEverySize(t *testing.T) {
	for mode, st := range chartTestStyles() {
		for w := 0; w <= 90; w += 3 {
			for h := 0; h <= 30; h++ {
				checkChartBlock(t, "panels/"+mode, RenderPanels(twoPanels(), w, h, st), w, h)
			}
		}
		checkChartBlock(t, "no panels/"+mode, RenderPanels(nil, 40, 12, st), 40, 12)
		checkChartBlock(t, "nil panel/"+mode, RenderPanels([]*chartspec.LineChart{nil, nil}, 40, 12, st), 40, 12)
	}
}

// TestPanelsShareOneLegend: at 78×9 (the chart pane of an 80×24
// terminal) the panels stand side by side and one legend names every
// curve; at 78×37 they are stacked.
func TestPanelsShareOneLegend(t *testing.T) {
	st := chartTestStyles()["ascii"]
	cs := twoPanels()
	for _, sz := range [][2]int{{78, 9}, {78, 37}} {
		out := RenderPanels(cs, sz[0], sz[1], st)
		for _, sr := range cs[0].Series {
			entry := string(st.Glyph(sr.Index)) + " " + quantity.ASCII(sr.Name)
			if n := strings.Count(out, entry); n != 1 {
				t.Errorf("%d×%d: legend entry %q appears %d times, want once\n%s", sz[0], sz[1], entry, n, out)
			}
		}
		if strings.Contains(out, "too small") {
			t.Errorf("%d×%d: a panel is too small\n%s", sz[0], sz[1], out)
		}
		// Two x axes: beside each other on one row, or on two rows.
		axisRows := 0
		for _, l := range strings.Split(out, "\n") {
			if strings.Contains(l, "++---") {
				axisRows++
			}
		}
		if want := map[int]int{9: 1, 37: 2}[sz[1]]; axisRows != want {
			t.Errorf("%d×%d: x axes on %d rows, want %d\n%s", sz[0], sz[1], axisRows, want, out)
		}
	}
}
