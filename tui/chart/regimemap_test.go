package chart

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"cloudwind/internal/chartspec"
	"cloudwind/tui/internal/golden"
)

// synthRegimeMap returns an nx×ny map over χ = 10…10⁴ and r_cl =
// 10⁻²…10³ pc counting, per cell centre, how many of the six synthetic
// thresholds r_crit = a χ^b (see syntheticThresholds) lie below r_cl: a
// boundary that moves with χ. The mark is the current point χ = 100,
// r_cl = 1 pc.
func synthRegimeMap(nx, ny int) *chartspec.RegimeMap {
	m := &chartspec.RegimeMap{
		Title: "criteria predicting survival (synthetic)",
		X:     chartspec.Axis{Label: "χ = ρ_cl/ρ_hot", Log: true, Min: 1, Max: 4},
		Y:     chartspec.Axis{Label: "r_cl (pc)", Log: true, Min: -2, Max: 3},
		NX:    nx, NY: ny, Counts: make([]int, nx*ny),
		Mark: &chartspec.Marker{Kind: chartspec.Point, X: 2, Y: 0, Label: "current χ, r_cl"},
		Note: "synthetic counts from r_crit = a χ^b, for layout tests only",
	}
	th := syntheticThresholds()
	m.Total = len(th)
	for j := range ny {
		ly := m.Y.Min + (m.Y.Max-m.Y.Min)*(float64(j)+0.5)/float64(ny)
		for i := range nx {
			lx := m.X.Min + (m.X.Max-m.X.Min)*(float64(i)+0.5)/float64(nx)
			for _, p := range th {
				if ly > math.Log10(p.a)+p.b*lx {
					m.Counts[j*nx+i]++
				}
			}
		}
	}
	return m
}

func TestRegimeMapGolden(t *testing.T) {
	sts := chartTestStyles()
	m := synthRegimeMap(60, 30)
	for _, sz := range [][2]int{{80, 24}, {120, 40}} {
		for _, mode := range []string{"plain", "ascii"} {
			sub := "regime_" + mode + "_" + strconv.Itoa(sz[0]) + "x" + strconv.Itoa(sz[1])
			t.Run(sub, func(t *testing.T) {
				out := RenderRegimeMap(m, sz[0], sz[1], sts[mode])
				checkChartBlock(t, sub, out, sz[0], sz[1])
				golden.Check(t, "TestRegimeMapGolden", sub, out)
			})
		}
	}
	// More than nine criteria: shades instead of digits.
	many := synthRegimeMap(60, 30)
	many.Total = 12
	for i := range many.Counts {
		many.Counts[i] *= 2
	}
	out := RenderRegimeMap(many, 80, 24, sts["plain"])
	checkChartBlock(t, "shades", out, 80, 24)
	golden.Check(t, "TestRegimeMapGolden", "regime_shades_80x24", out)
}

// degenerateRegimeMaps returns maps that must render without panicking.
func degenerateRegimeMaps() map[string]*chartspec.RegimeMap {
	nan := math.NaN()
	return map[string]*chartspec.RegimeMap{
		"synthetic": synthRegimeMap(20, 10),
		"nil":       nil,
		"empty":     {},
		"nocells":   {X: chartspec.Axis{Label: "x", Min: 0, Max: 1}, Y: chartspec.Axis{Label: "y", Min: 0, Max: 1}, Total: 3, Title: "t", Note: "n"},
		"minmax":    {X: chartspec.Axis{Min: 1, Max: 1, Log: true}, Y: chartspec.Axis{Min: 2, Max: 2}, NX: 1, NY: 1, Counts: []int{1}, Total: 1},
		"nanrange":  {X: chartspec.Axis{Min: nan, Max: nan}, Y: chartspec.Axis{Min: nan, Max: 1}, NX: 2, NY: 2, Counts: []int{0, 1, 2, 3}, Total: 3},
		"short":     {X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1}, NX: 5, NY: 5, Counts: []int{1, 2}, Total: 2, Mark: &chartspec.Marker{Kind: chartspec.Point, X: nan, Y: 0}},
		"wild":      {X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1}, NX: 2, NY: 1, Counts: []int{-5, 99}, Total: -1, Mark: &chartspec.Marker{Kind: chartspec.HLine, Y: 0.5, Warn: true}},
		"huge":      {X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1}, NX: 1 << 40, NY: 1 << 40, Counts: []int{1}, Total: 1},
		"single":    {X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1}, NX: 1, NY: 1, Counts: []int{4}, Total: 40, Mark: &chartspec.Marker{Kind: chartspec.VLine, X: 0.5}},
	}
}

func TestRegimeMapEverySize(t *testing.T) {
	for name, m := range degenerateRegimeMaps() {
		for mode, st := range chartTestStyles() {
			for w := 0; w <= 60; w++ {
				for h := 0; h <= 20; h++ {
					checkChartBlock(t, name+"/"+mode, RenderRegimeMap(m, w, h, st), w, h)
				}
			}
			for _, sz := range [][2]int{{300, 100}, {300, 6}, {20, 100}} {
				checkChartBlock(t, name+"/"+mode, RenderRegimeMap(m, sz[0], sz[1], st), sz[0], sz[1])
			}
		}
	}
	checkChartBlock(t, "nil styles", RenderRegimeMap(synthRegimeMap(5, 5), 80, 24, nil), 80, 24)
}

func TestRegimeMapCells(t *testing.T) {
	// Two map cells side by side, counts 0 and 3: the left half of the
	// plot shows '0', the right half '3', on every row.
	m := &chartspec.RegimeMap{X: chartspec.Axis{Label: "x", Min: 0, Max: 1}, Y: chartspec.Axis{Label: "y", Min: 0, Max: 1}, NX: 2, NY: 1, Counts: []int{0, 3}, Total: 3}
	st := chartTestStyles()["plain"]
	out := RenderRegimeMap(m, 60, 16, st)
	g := chartGrid(out)
	x0, top, pw, ph := chartPlotRect(t, g, false)
	for y := top; y < top+ph; y++ {
		want := strings.Repeat("0", pw/2) + strings.Repeat("3", pw-pw/2)
		if got := string(g[y][x0 : x0+pw]); got != want {
			t.Fatalf("row %d = %q, want %q\n%s", y, got, want, out)
		}
	}
	if !strings.Contains(out, "of 3 criteria predict survival") {
		t.Errorf("legend missing:\n%s", out)
	}
}

func TestRegimeMapMark(t *testing.T) {
	// The mark at the centre of the top-right quarter lands in the plot
	// cell covering it.
	m := &chartspec.RegimeMap{X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1}, NX: 2, NY: 2, Counts: []int{0, 1, 1, 2}, Total: 2,
		Mark: &chartspec.Marker{Kind: chartspec.Point, X: 0.75, Y: 0.75, Label: "now"}}
	for _, mode := range []string{"plain", "ascii"} {
		st := chartTestStyles()[mode]
		out := RenderRegimeMap(m, 50, 14, st)
		g := chartGrid(out)
		x0, top, pw, ph := chartPlotRect(t, g, st.ASCII)
		x, y := x0+int(0.75*float64(pw)), top+ph-1-int(0.75*float64(ph))
		want := pointRune
		if st.ASCII {
			want = pointRuneASCII
		}
		if g[y][x] != want {
			t.Errorf("%s: cell (%d, %d) = %q, want the mark %q\n%s", mode, x, y, g[y][x], want, out)
		}
		if !strings.Contains(out, string(want)+" now") {
			t.Errorf("%s: legend lacks the mark:\n%s", mode, out)
		}
	}
	m.Mark.X = 5
	if out := RenderRegimeMap(m, 70, 14, chartTestStyles()["plain"]); !strings.Contains(out, "outside the map") {
		t.Errorf("a mark outside the map is not reported:\n%s", out)
	}
}

func BenchmarkRenderRegimeMap(b *testing.B) {
	m := synthRegimeMap(200, 100)
	for mode, st := range chartTestStyles() {
		b.Run(mode, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				RenderRegimeMap(m, 120, 40, st)
			}
		})
	}
}
