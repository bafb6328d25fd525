package chart

import (
	"iter"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"

	"github.com/NimbleMarkets/ntcharts/canvas"
	"github.com/NimbleMarkets/ntcharts/canvas/graph"
	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"

	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
	"cloudwind/tui/internal/golden"
)

func TestChartGolden(t *testing.T) {
	sts := chartTestStyles()
	charts := map[string]*chartspec.LineChart{"threshold": synthThresholdChart(200), "cooling": synthCoolingChart()}
	for name, c := range charts {
		for _, sz := range [][2]int{{80, 24}, {120, 40}} {
			for _, mode := range []string{"plain", "ascii", "braille"} {
				sub := name + "_" + mode + "_" + strconv.Itoa(sz[0]) + "x" + strconv.Itoa(sz[1])
				t.Run(sub, func(t *testing.T) {
					out := RenderLine(c, sz[0], sz[1], sts[mode])
					checkChartBlock(t, sub, out, sz[0], sz[1])
					golden.Check(t, "TestChartGolden", sub, out)
				})
			}
		}
	}
}

// degenerateLineCharts returns charts that must render without panicking.
func degenerateLineCharts() map[string]*chartspec.LineChart {
	nan := math.NaN()
	return map[string]*chartspec.LineChart{
		"threshold": synthThresholdChart(50),
		"nil":       nil,
		"empty":     {},
		"noseries":  {X: chartspec.Axis{Label: "x", Min: 0, Max: 1}, Y: chartspec.Axis{Label: "y", Min: 0, Max: 1}, Title: "t", Note: "n"},
		"minmax":    {X: chartspec.Axis{Min: 2, Max: 2, Log: true}, Y: chartspec.Axis{Min: -1, Max: -1}, Series: []chartspec.Series{{Name: "s", X: []float64{2}, Y: []float64{-1}}}},
		"nanrange":  {X: chartspec.Axis{Min: nan, Max: nan}, Y: chartspec.Axis{Min: math.Inf(-1), Max: math.Inf(1)}, Series: []chartspec.Series{{Name: "s", X: []float64{1, 2}, Y: []float64{3, 4}}}},
		"allnan":    {X: chartspec.Axis{Min: nan, Max: nan}, Y: chartspec.Axis{Min: nan, Max: nan}, Series: []chartspec.Series{{Name: "s", X: []float64{nan, nan}, Y: []float64{nan, math.Inf(1)}}}},
		"single":    {Series: []chartspec.Series{{Name: "p", X: []float64{1}, Y: []float64{2}}}},
		"reversed":  {X: chartspec.Axis{Min: 5, Max: -5}, Y: chartspec.Axis{Min: 1e300, Max: -1e300}, Series: []chartspec.Series{{X: []float64{-1e308, 1e308}, Y: []float64{0, 1}}}, Markers: []chartspec.Marker{{Kind: chartspec.Point, X: 0, Y: 0, Label: "p"}}},
		"ragged":    {X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1}, Series: []chartspec.Series{{Name: strings.Repeat("long ", 40), X: []float64{0, 1, 2}, Y: []float64{0}, Index: -3, Dashed: true}}},
	}
}

func TestChartEverySize(t *testing.T) {
	for name, c := range degenerateLineCharts() {
		for mode, st := range chartTestStyles() {
			for w := 0; w <= 60; w++ {
				for h := 0; h <= 20; h++ {
					checkChartBlock(t, name+"/"+mode, RenderLine(c, w, h, st), w, h)
				}
			}
			for _, sz := range [][2]int{{300, 100}, {300, 6}, {20, 100}, {61, 21}} {
				checkChartBlock(t, name+"/"+mode, RenderLine(c, sz[0], sz[1], st), sz[0], sz[1])
			}
		}
	}
	checkChartBlock(t, "nil styles", RenderLine(synthThresholdChart(10), 80, 24, nil), 80, 24)
}

func TestChartTooSmall(t *testing.T) {
	st := chartTestStyles()["plain"]
	if out := RenderLine(synthThresholdChart(10), 19, 6, st); !strings.Contains(out, "too small") {
		t.Errorf("RenderLine at 19×6 = %q, want a \"too small\" note", out)
	}
	if out := RenderLine(synthThresholdChart(10), 8, 3, st); strings.TrimSpace(out) != "" {
		t.Errorf("RenderLine at 8×3 = %q, want blank", out)
	}
}

func TestChartPointLandsInCell(t *testing.T) {
	nan := math.NaN()
	c := &chartspec.LineChart{
		X:      chartspec.Axis{Label: "x", Min: 0, Max: 10},
		Y:      chartspec.Axis{Label: "y", Min: 0, Max: 10},
		Series: []chartspec.Series{{Name: "pts", X: []float64{0, nan, 10, nan, 5}, Y: []float64{0, nan, 10, nan, 5}}},
	}
	for _, mode := range []string{"plain", "ascii"} {
		st := chartTestStyles()[mode]
		g := chartGrid(RenderLine(c, 60, 20, st))
		x0, top, pw, ph := chartPlotRect(t, g, st.ASCII)
		glyph := st.Glyph(0)
		// The point mapping is the one of ntcharts' BrailleGrid with one
		// dot per cell: v ↦ round(v (n−1)/10).
		for _, p := range [][2]float64{{0, 0}, {10, 10}, {5, 5}} {
			x := x0 + int(math.Round(p[0]*float64(pw-1)/10))
			y := top + ph - 1 - int(math.Round(p[1]*float64(ph-1)/10))
			if g[y][x] != glyph {
				t.Errorf("%s: point (%g, %g) at cell (%d, %d) = %q, want %q\n%s", mode, p[0], p[1], x, y, g[y][x], glyph, string(chartJoinRows(g)))
			}
		}
		n := 0
		for y := top; y < top+ph; y++ {
			n += strings.Count(string(g[y][x0:x0+pw]), string(glyph))
		}
		if n != 3 {
			t.Errorf("%s: %d cells hold %q, want 3 (isolated points, NaN between)", mode, n, glyph)
		}
	}
}

func TestChartOutsideRangeDrawsNothing(t *testing.T) {
	st := chartTestStyles()["plain"]
	c := &chartspec.LineChart{
		X:      chartspec.Axis{Label: "x", Min: 0, Max: 1},
		Y:      chartspec.Axis{Label: "y", Min: 0, Max: 1},
		Series: []chartspec.Series{{Name: "away", Index: 0, X: []float64{2, 3, 4}, Y: []float64{0.5, 0.5, 0.5}}},
	}
	out := RenderLine(c, 60, 16, st)
	g := chartGrid(out)
	x0, top, pw, ph := chartPlotRect(t, g, false)
	for y := top; y < top+ph; y++ {
		if strings.ContainsRune(string(g[y][x0:x0+pw]), st.Glyph(0)) {
			t.Errorf("series outside the range drew in row %d:\n%s", y, out)
		}
	}
	if !strings.Contains(out, "no data") {
		t.Errorf("chart with nothing visible lacks \"no data\":\n%s", out)
	}
}

func TestChartClipsToPlot(t *testing.T) {
	// A line from inside to far outside, and one crossing the plot
	// through two edges, in both modes: nothing may land outside the plot.
	c := &chartspec.LineChart{
		X: chartspec.Axis{Label: "x", Min: 0, Max: 1},
		Y: chartspec.Axis{Label: "y", Min: 0, Max: 1},
		Series: []chartspec.Series{
			{Name: "out", Index: 0, X: []float64{0.5, 1e9}, Y: []float64{0.5, -3e9}},
			{Name: "through", Index: 1, X: []float64{-1, 2}, Y: []float64{-0.5, 1.5}},
		},
	}
	for mode, st := range chartTestStyles() {
		out := RenderLine(c, 50, 14, st)
		g := chartGrid(out)
		x0, top, pw, ph := chartPlotRect(t, g, st.ASCII)
		for y := range g {
			for x, r := range g[y] {
				inside := x >= x0 && x < x0+pw && y >= top && y < top+ph
				curve := r >= 0x2800 && r <= 0x28ff || ((r == st.Glyph(0) || r == st.Glyph(1)) && y < top+ph)
				if curve && !inside && y >= top && x != x0-1 { // x0−1 is the y axis, whose ASCII tick is '+'

					t.Errorf("%s: curve rune %q at (%d, %d) outside the plot [%d,%d)×[%d,%d)\n%s", mode, r, x, y, x0, x0+pw, top, top+ph, out)
				}
			}
		}
		if !strings.ContainsRune(string(chartJoinRows(g)), st.Glyph(1)) {
			t.Errorf("%s: the crossing series is not drawn:\n%s", mode, out)
		}
	}
}

func TestChartNaNBreaksLine(t *testing.T) {
	st := chartTestStyles()["plain"]
	c := &chartspec.LineChart{
		X:      chartspec.Axis{Label: "x", Min: 0, Max: 4},
		Y:      chartspec.Axis{Label: "y", Min: 0, Max: 4},
		Series: []chartspec.Series{{Name: "s", X: []float64{0, 1, 2, 3, 4}, Y: []float64{0, 1, math.NaN(), 3, 4}}},
	}
	g := chartGrid(RenderLine(c, 70, 20, st))
	x0, top, pw, ph := chartPlotRect(t, g, false)
	col := func(v float64) int { return x0 + int(math.Round(v*float64(pw-1)/4)) }
	for x := col(1) + 1; x < col(3); x++ {
		for y := top; y < top+ph; y++ {
			if g[y][x] == st.Glyph(0) {
				t.Fatalf("glyph at (%d, %d), in the gap a NaN point must leave\n%s", x, y, string(chartJoinRows(g)))
			}
		}
	}
}

func TestChartLegendAndSanitize(t *testing.T) {
	c := synthThresholdChart(20)
	c.Series[0].Name = "evil\x1b[2Jname"
	for mode, st := range chartTestStyles() {
		out := RenderLine(c, 120, 40, st)
		if strings.Contains(out, "\x1b[2J") {
			t.Errorf("%s: an escape sequence from a series name reached the output", mode)
		}
		for _, sr := range c.Series {
			name := quantity.Sanitize(sr.Name)
			if st.ASCII {
				name = quantity.ASCII(name)
			}
			if !strings.Contains(out, string(st.Glyph(sr.Index))+" "+name) {
				t.Errorf("%s: legend lacks %q\n%s", mode, string(st.Glyph(sr.Index))+" "+name, out)
			}
		}
	}
}

func TestChartBrailleTagsCurves(t *testing.T) {
	st := chartTestStyles()["braille"]
	out := golden.SGR.ReplaceAllString(RenderLine(synthThresholdChart(100), 100, 30, st), "")
	g := chartGrid(out)
	x0, top, pw, ph := chartPlotRect(t, g, false)
	var plot strings.Builder
	for y := top; y < top+ph; y++ {
		plot.WriteString(string(g[y][x0 : x0+pw]))
	}
	if !strings.ContainsFunc(plot.String(), func(r rune) bool { return r > 0x2800 && r <= 0x28ff }) {
		t.Fatalf("braille mode drew no braille:\n%s", out)
	}
	for i := range syntheticThresholds() {
		if !strings.ContainsRune(plot.String(), st.Glyph(i)) {
			t.Errorf("curve %d has no %q tag in the plot:\n%s", i, st.Glyph(i), out)
		}
	}
}

func TestDotScaleMatchesBrailleGrid(t *testing.T) {
	// The ticks use dotScale; the curves use ntcharts' GridPoint. They must agree.
	const w, h = 37, 11
	g := graph.NewBrailleGrid(w, h, -2.5, 3.25, -28, -21)
	xs, ys := dotScale{-2.5, 3.25, 2 * w}, dotScale{-28, -21, 4 * h}
	for k := 0; k <= 1000; k++ {
		x := -2.5 + 5.75*float64(k)/1000
		y := -28 + 7*float64(k)/1000
		p := g.GridPoint(canvas.Float64Point{X: x, Y: y})
		if p.X != xs.dot(x) || p.Y != ys.n-1-ys.dot(y) {
			t.Fatalf("GridPoint(%g, %g) = %v, dotScale gives (%d, %d)", x, y, p, xs.dot(x), ys.n-1-ys.dot(y))
		}
	}
}

func TestChartTickUnderMarker(t *testing.T) {
	// A VLine at a decade sits in the column of that decade's tick mark,
	// and the decade's label is centred there.
	c := synthThresholdChart(10)
	c.Markers = []chartspec.Marker{{Kind: chartspec.VLine, X: 2}}
	for mode, st := range chartTestStyles() {
		g := chartGrid(RenderLine(c, 80, 24, st))
		x0, top, _, ph := chartPlotRect(t, g, st.ASCII)
		x := -1
		for i, r := range g[top] {
			if r == vlineRune && i >= x0 {
				x = i
			}
		}
		if x < 0 {
			t.Fatalf("%s: no marker line in the top plot row", mode)
		}
		axis := top + ph
		if g[axis][x] != axesGlyphs(st.ASCII).xtick {
			t.Errorf("%s: axis below the marker at column %d is %q, want a tick", mode, x, g[axis][x])
		}
		if lab := string(g[axis+1][x-1 : x+2]); lab != "1e2" {
			t.Errorf("%s: label under the marker = %q, want \"1e2\"", mode, lab)
		}
	}
}

func TestChartMarkers(t *testing.T) {
	st := chartTestStyles()["ascii"]
	c := synthCoolingChart()
	c.Markers = append(c.Markers, chartspec.Marker{Kind: chartspec.Point, X: 5.35, Y: -21.7, Label: "peak"})
	out := RenderLine(c, 100, 30, st)
	if !strings.ContainsRune(out, pointRuneASCII) {
		t.Errorf("cooling chart lacks the point marker %q:\n%s", pointRuneASCII, out)
	}
	for _, want := range []string{"T_floor", "T_cl", "T_mix", "!T_hot", "peak"} {
		if !strings.Contains(out, want) {
			t.Errorf("cooling chart lacks %q:\n%s", want, out)
		}
	}
}

func TestChartDashedIsSparser(t *testing.T) {
	st := chartTestStyles()["plain"]
	count := func(dashed bool) int {
		c := &chartspec.LineChart{X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1},
			Series: []chartspec.Series{{X: []float64{0, 1}, Y: []float64{0.5, 0.5}, Dashed: dashed}}}
		return strings.Count(RenderLine(c, 60, 12, st), string(st.Glyph(0)))
	}
	solid, dashed := count(false), count(true)
	if dashed < solid/3 || dashed > 2*solid/3 {
		t.Errorf("dashed line has %d glyphs, solid %d: want about half", dashed, solid)
	}
}

func TestClipSegment(t *testing.T) {
	for _, tc := range []struct {
		x0, y0, x1, y1 float64
		vis            bool
		ax, ay, bx, by float64
	}{
		{0.2, 0.2, 0.8, 0.8, true, 0.2, 0.2, 0.8, 0.8}, // inside
		{-1, 0.5, 2, 0.5, true, 0, 0.5, 1, 0.5},        // through both x edges
		{0.5, 0.5, 0.5, 3, true, 0.5, 0.5, 0.5, 1},     // out through the top
		{2, 2, 3, 3, false, 0, 0, 0, 0},                // outside
		{-1, 0, 0, -1, false, 0, 0, 0, 0},              // misses the corner
		{0, 2, 1, 2, false, 0, 0, 0, 0},                // parallel, outside
		{0, 0, math.Inf(1), 1, false, 0, 0, 0, 0},      // infinite
	} {
		ax, ay, bx, by, vis := clipSegment(tc.x0, tc.y0, tc.x1, tc.y1, 0, 1, 0, 1)
		if vis != tc.vis || (vis && (math.Abs(ax-tc.ax) > 1e-12 || math.Abs(ay-tc.ay) > 1e-12 || math.Abs(bx-tc.bx) > 1e-12 || math.Abs(by-tc.by) > 1e-12)) {
			t.Errorf("clipSegment(%g, %g, %g, %g) = (%g, %g, %g, %g, %v), want (%g, %g, %g, %g, %v)",
				tc.x0, tc.y0, tc.x1, tc.y1, ax, ay, bx, by, vis, tc.ax, tc.ay, tc.bx, tc.by, tc.vis)
		}
	}
}

// firstTickSet returns the i-th set a tick-set sequence yields.
func firstTickSet(sets iter.Seq[[]tick], i int) []tick {
	for set := range sets {
		if i == 0 {
			return set
		}
		i--
	}
	return nil
}

func TestTickSets(t *testing.T) {
	labels := func(ts []tick) string {
		var out []string
		for _, tk := range ts {
			out = append(out, string(tk.label))
		}
		return strings.Join(out, " ")
	}
	if got := labels(firstTickSet(tickSets(-2.1, 3, true, 20), 0)); got != "1e-2 1e-1 1e0 1e1 1e2 1e3" {
		t.Errorf("log ticks of [-2.1, 3] = %q", got)
	}
	if got := labels(firstTickSet(tickSets(0.1, 1.9, true, 20), 1)); got != "2e0 5e0 1e1 2e1 5e1" {
		t.Errorf("1-2-5 log ticks of [0.1, 1.9] = %q", got)
	}
	// Crowded: 61 decades in 60 columns keep labels 2 cells apart.
	pts := pickXTicks(tickSets(-30, 30, true, 30), func(v float64) int { return int(math.Round((v + 30))) }, 62)
	if len(pts) < 2 {
		t.Fatalf("no ticks for a crowded log axis")
	}
	for i := 1; i < len(pts); i++ {
		if pts[i].start < pts[i-1].start+len(pts[i-1].label)+2 {
			t.Errorf("crowded labels %q and %q overlap", string(pts[i-1].label), string(pts[i].label))
		}
	}
	if got := labels(pickTicks(tickSets(0, 1, false, 20), func(ts []tick) bool { return len(ts) <= 6 })); got != "0 0.2 0.4 0.6 0.8 1" {
		t.Errorf("linear ticks of [0, 1] = %q", got)
	}
}

func TestChartANSIWidth(t *testing.T) {
	// Real escape sequences (a 256-colour renderer of its own, so no
	// global state changes) must not change the measured width.
	r := lipgloss.NewRenderer(os.Stdout)
	r.SetColorProfile(termenv.ANSI256)
	st := colourStyles(r.NewStyle)
	out := RenderLine(synthThresholdChart(200), 80, 24, &st)
	if !strings.Contains(out, "\x1b[") {
		t.Fatalf("no escape sequences in coloured output")
	}
	checkChartBlock(t, "coloured", out, 80, 24)
}

func BenchmarkRenderLine(b *testing.B) {
	c := synthThresholdChart(200)
	for mode, st := range chartTestStyles() {
		b.Run(mode, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				RenderLine(c, 80, 20, st)
			}
		})
	}
}

// TestChartOverlapsStayVisible draws two identical curves: in every mode
// both glyphs (rune mode) or both styles (braille) stay on screen, and the
// legend says that the second overlaps the first.
func TestChartOverlapsStayVisible(t *testing.T) {
	c := synthThresholdChart(20)
	c.Series = c.Series[:2]
	c.Series[1].X, c.Series[1].Y = c.Series[0].X, c.Series[0].Y
	for mode, st := range chartTestStyles() {
		out := RenderLine(c, 100, 30, st)
		g := chartGrid(out)
		x0, top, pw, ph := chartPlotRect(t, g, st.ASCII)
		count := map[rune]int{}
		for y := top; y < top+ph; y++ {
			for x := x0; x < x0+pw; x++ {
				count[g[y][x]]++
			}
		}
		if mode != "braille" {
			a, b := st.Glyph(c.Series[0].Index), st.Glyph(c.Series[1].Index)
			if count[a] < 5 || count[b] < 5 {
				t.Errorf("%s: identical curves show %d cells of %q and %d of %q; want both visible\n%s", mode, count[a], a, count[b], b, out)
			}
		}
		want := string(st.Glyph(c.Series[1].Index)) + " " + quantity.Sanitize(c.Series[1].Name)
		if st.ASCII {
			want = string(st.Glyph(c.Series[1].Index)) + " " + quantity.ASCII(c.Series[1].Name)
		}
		if !strings.Contains(out, want+" (overlaps "+string(st.Glyph(c.Series[0].Index))+")") {
			t.Errorf("%s: the legend does not say that %q overlaps the first curve\n%s", mode, want, out)
		}
	}
}
