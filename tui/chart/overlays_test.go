package chart

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"github.com/NimbleMarkets/ntcharts/canvas/runes"

	"cloudwind/internal/chartspec"
	"cloudwind/model"
	"cloudwind/tui/internal/golden"
)

// Tests of the overlays: uncertainty bands and simulation runs on line
// charts, the classes of the regime map, and the fitting of long legends.

// synthBandedChart is synthThresholdChart with bands of ±0.3 dex (a factor
// 2) around S2 and S5, and four runs (numbers chosen for layout tests).
func synthBandedChart(n int) *chartspec.LineChart {
	c := synthThresholdChart(n)
	for _, i := range []int{1, 4} {
		s := c.Series[i]
		b := chartspec.Band{Name: s.Name, X: s.X, Index: s.Index}
		for _, y := range s.Y {
			b.Lo, b.Hi = append(b.Lo, y-0.3), append(b.Hi, y+0.3)
		}
		c.Bands = append(c.Bands, b)
	}
	c.BandFactor = "×/÷ 2"
	c.Runs = []chartspec.RunMark{{X: 1.5, Y: 2, Outcome: model.RunGrew}, {X: 2.5, Y: -2, Outcome: model.RunDestroyed},
		{X: 3.5, Y: 1, Outcome: model.RunTransformed}, {X: 3, Y: 2.5, Outcome: model.RunSurvived}}
	return c
}

func TestOverlayGolden(t *testing.T) {
	sts := chartTestStyles()
	m := synthClassMap(60, 30)
	for _, sz := range [][2]int{{80, 24}, {120, 40}} {
		for _, mode := range []string{"plain", "ascii", "braille"} {
			sub := "bands_" + mode + "_" + strconv.Itoa(sz[0]) + "x" + strconv.Itoa(sz[1])
			out := RenderLine(synthBandedChart(200), sz[0], sz[1], sts[mode])
			checkChartBlock(t, sub, out, sz[0], sz[1])
			golden.Check(t, "TestOverlayGolden", sub, out)
			if mode == "braille" {
				continue
			}
			sub = "classes_" + mode + "_" + strconv.Itoa(sz[0]) + "x" + strconv.Itoa(sz[1])
			out = RenderRegimeMap(m, sz[0], sz[1], sts[mode])
			checkChartBlock(t, sub, out, sz[0], sz[1])
			golden.Check(t, "TestOverlayGolden", sub, out)
		}
	}
}

// TestBandFills: in rune mode a band of ±0.3 dex around a flat curve at 0
// on an axis of ±2 over 20 rows fills the cells it overlaps and no
// others; in braille it sets dots only within it; the legend names it.
func TestBandFills(t *testing.T) {
	c := &chartspec.LineChart{
		X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: -2, Max: 2},
		Series:     []chartspec.Series{{Name: "flat", X: []float64{0, 1}, Y: []float64{0, 0}}},
		Bands:      []chartspec.Band{{Name: "flat", X: []float64{0, 1}, Lo: []float64{-0.3, -0.3}, Hi: []float64{0.3, 0.3}}},
		BandFactor: "×/÷ 2",
	}
	for _, mode := range []string{"plain", "ascii", "braille"} {
		st := chartTestStyles()[mode]
		out := RenderLine(c, 60, 26, st)
		g := chartGrid(out)
		x0, top, pw, ph := chartPlotRect(t, g, st.ASCII)
		fill := bandRune
		if st.ASCII {
			fill = bandRuneASCII
		}
		for y := top; y < top+ph; y++ {
			// The row's value range: the centre of row y is lo + (ph−1−(y−top)) × step.
			step := 4 / float64(ph-1)
			if mode == "braille" {
				step = 4 / float64(4*ph-1)
			}
			for x := x0; x < x0+pw; x++ {
				r := g[y][x]
				switch {
				case mode != "braille":
					centre := -2 + float64(ph-1-(y-top))*step
					inBand := math.Abs(centre) <= 0.3+step/2
					if (r == fill) && !inBand {
						t.Fatalf("%s: band glyph at row %d (centre %g) outside the band\n%s", mode, y, centre, out)
					}
					if inBand && r != fill && r != st.Glyph(0) {
						t.Fatalf("%s: row %d (centre %g) inside the band holds %q\n%s", mode, y, centre, r, out)
					}
				case runes.IsBraillePattern(r) && r != runes.BrailleBlockOffset:
					lowest := -2 + float64(4*(ph-1-(y-top)))*step // the value of the cell's lowest dot row
					if lowest > 0.3 || lowest+3*step < -0.3 {
						t.Fatalf("braille: dots at row %d ([%g, %g]) outside the band\n%s", y, lowest, lowest+3*step, out)
					}
				}
			}
		}
		if !strings.Contains(out, "band: "+map[bool]string{true: "alpha x or / 2", false: "α ×/÷ 2"}[st.ASCII]) {
			t.Errorf("%s: the legend lacks the band entry\n%s", mode, out)
		}
	}
}

// TestRunsLand: every run is drawn as its outcome's glyph in the cell of
// its coordinates, and the legend names the glyphs used.
func TestRunsLand(t *testing.T) {
	c := synthBandedChart(50)
	for _, mode := range []string{"plain", "ascii"} {
		st := chartTestStyles()[mode]
		out := RenderLine(c, 90, 30, st)
		g := chartGrid(out)
		x0, top, pw, ph := chartPlotRect(t, g, st.ASCII)
		for _, r := range c.Runs {
			x := x0 + int(math.Round((r.X-1)/3*float64(pw-1)))
			y := top + ph - 1 - int(math.Round((r.Y+3)/6*float64(ph-1)))
			if want := runGlyph(r.Outcome, st.ASCII); g[y][x] != want {
				t.Errorf("%s: run %v at (%g, %g): cell (%d, %d) holds %q, want %q\n%s", mode, r.Outcome, r.X, r.Y, x, y, g[y][x], want, out)
			}
		}
		for _, want := range []string{"run grew/survived", "transformed", "destroyed"} {
			if !strings.Contains(out, want) {
				t.Errorf("%s: legend lacks %q\n%s", mode, want, out)
			}
		}
	}
	if runGlyph(model.RunGrew, false) == runGlyph(model.RunTransformed, false) || runGlyph(model.RunTransformed, true) == runGlyph(model.RunDestroyed, true) {
		t.Error("run glyphs are not distinct")
	}
	// Two runs with different outcomes in one cell: '&', named in the
	// legend; two with the same outcome keep its glyph.
	c.Runs = []chartspec.RunMark{{X: 2, Y: 1, Outcome: model.RunGrew}, {X: 2, Y: 1, Outcome: model.RunDestroyed},
		{X: 3, Y: -1, Outcome: model.RunGrew}, {X: 3, Y: -1, Outcome: model.RunSurvived}}
	m := synthClassMap(30, 15)
	m.Runs = c.Runs
	for name, out := range map[string]string{"line": RenderLine(c, 90, 30, chartTestStyles()["plain"]), "map": RenderRegimeMap(m, 90, 30, chartTestStyles()["plain"])} {
		if strings.Count(out, string(mixedRune)) != 2 || !strings.Contains(out, "& mixed outcomes") || !strings.Contains(out, "✓") {
			t.Errorf("%s: shared cells are not marked as expected\n%s", name, out)
		}
	}
}

// TestLegendFitKeepsEveryEntry: eight long names in a 78×9 block (the
// chart pane of an 80×24 terminal) keep one entry each, shortened, and
// the bands' entry stays whole.
func TestLegendFitKeepsEveryEntry(t *testing.T) {
	c := synthBandedChart(50)
	c.Runs = nil
	names := []string{"Gronke & Oh 2018", "Li et al. 2020", "Sparre et al. 2020", "Abruzzo et al. 2023", "Farber & Gronke 2022",
		"Tan, Oh & Gronke 2023 (infall)", "Turbulent wind (arXiv:2510.03552)", "Turbulent box (Gronke+ 2022; George+ 2025)"}
	c.Series = append(c.Series, c.Series[0], c.Series[1])
	for i := range c.Series {
		c.Series[i].Name, c.Series[i].Index = names[i], i
	}
	st := chartTestStyles()["plain"]
	out := RenderLine(c, 78, 9, st)
	for i, n := range names {
		short := strings.TrimSuffix(dropParenthesisString(n), "")
		if !strings.Contains(out, string(st.Glyph(i))+" "+short) {
			t.Errorf("legend lacks %q\n%s", string(st.Glyph(i))+" "+short, out)
		}
	}
	if !strings.Contains(out, "░ band: α ×/÷ 2") || strings.Contains(out, "…\n") {
		t.Errorf("the band entry is missing or the legend was cut\n%s", out)
	}
	// The same names at 40 columns: cut with an ellipsis, every key kept.
	out = RenderLine(c, 40, 12, st)
	for i := range names {
		if !strings.Contains(out, string(st.Glyph(i))+" ") {
			t.Errorf("40 columns: the entry of %q has gone\n%s", names[i], out)
		}
	}
}

func dropParenthesisString(s string) string { return string(dropParenthesis([]rune(s))) }

// synthClassMap is synthRegimeMap with classes: Depends within 0.3 dex of
// a synthetic threshold, Disagree where the count is between 0 and the
// total, AllAgree elsewhere; a strip of cells where none survives but one
// is transformed; and three runs.
func synthClassMap(nx, ny int) *chartspec.RegimeMap {
	m := synthRegimeMap(nx, ny)
	m.Class = make([]chartspec.Agreement, nx*ny)
	m.Transformed = make([]int, nx*ny)
	th := syntheticThresholds()
	for j := range ny {
		ly := m.Y.Min + (m.Y.Max-m.Y.Min)*(float64(j)+0.5)/float64(ny)
		for i := range nx {
			lx := m.X.Min + (m.X.Max-m.X.Min)*(float64(i)+0.5)/float64(nx)
			k := j*nx + i
			if n := m.Counts[k]; n > 0 && n < m.Total {
				m.Class[k] = chartspec.Disagree
			}
			for _, p := range th {
				if math.Abs(ly-(math.Log10(p.a)+p.b*lx)) < 0.3 {
					m.Class[k] = chartspec.Depends
				}
			}
			if m.Counts[k] == 0 && lx > 3.5 {
				m.Transformed[k], m.Class[k] = 1, chartspec.Disagree
			}
		}
	}
	m.SpreadEvery = 2
	m.Runs = []chartspec.RunMark{{X: 1.5, Y: 2, Outcome: model.RunGrew}, {X: 3, Y: -1, Outcome: model.RunDestroyed}, {X: 3.7, Y: -1.5, Outcome: model.RunTransformed}}
	return m
}

// TestRegimeMapClasses: cells of class Depends alternate '?' with their
// count, 't' marks cells where none survives but some are transformed,
// runs are drawn, and the legend explains each glyph.
func TestRegimeMapClasses(t *testing.T) {
	m := &chartspec.RegimeMap{X: chartspec.Axis{Min: 0, Max: 1}, Y: chartspec.Axis{Min: 0, Max: 1}, NX: 3, NY: 1, Total: 3,
		Counts: []int{2, 0, 3}, Transformed: []int{0, 1, 0}, Class: []chartspec.Agreement{chartspec.Depends, chartspec.Disagree, chartspec.AllAgree},
		SpreadEvery: 1, Runs: []chartspec.RunMark{{X: 0.9, Y: 0.5, Outcome: model.RunDestroyed}}}
	for _, mode := range []string{"plain", "ascii"} {
		st := chartTestStyles()[mode]
		out := RenderRegimeMap(m, 66, 16, st)
		g := chartGrid(out)
		x0, top, pw, ph := chartPlotRect(t, g, st.ASCII)
		run := runGlyph(model.RunDestroyed, st.ASCII)
		rx, ry := x0+int(0.9*float64(pw)), top+ph-1-int(0.5*float64(ph))
		for y := top; y < top+ph; y++ {
			for x := x0; x < x0+pw; x++ {
				r, third := g[y][x], int((float64(x-x0)+0.5)*3/float64(pw))
				want := []rune{'2', 't', '3'}[third]
				if third == 0 && (x-x0+y-top)%2 == 1 {
					want = dependsRune
				}
				if x == rx && y == ry {
					want = run
				}
				if r != want {
					t.Fatalf("%s: cell (%d, %d) = %q, want %q\n%s", mode, x, y, r, want, out)
				}
			}
		}
		for _, want := range []string{"? depends on constants or conventions", "t none grows, some transformed", "0 or 3: all agree, else they disagree", " run destroyed"} {
			if !strings.Contains(out, want) {
				t.Errorf("%s: legend lacks %q\n%s", mode, want, out)
			}
		}
	}
}

// TestDashedGroup: with DashedName, dashed curves that repeat solid ones
// share one legend entry; without it each has its own.
func TestDashedGroup(t *testing.T) {
	c := synthThresholdChart(50)
	n := len(c.Series)
	for i := range n {
		a := c.Series[i]
		a.Name, a.Dashed = "A "+a.Name, true
		for k := range a.Y {
			a.Y = append([]float64(nil), a.Y...)
			a.Y[k] += 0.2
		}
		c.Series = append(c.Series, a)
	}
	st := chartTestStyles()["plain"]
	if out := RenderLine(c, 100, 30, st); strings.Count(out, "A S") != n || strings.Contains(out, "pinned") {
		t.Errorf("without DashedName: %d entries of A's curves, want %d\n%s", strings.Count(out, "A S"), n, out)
	}
	c.DashedName = "pinned A (sparser)"
	out := RenderLine(c, 100, 30, st)
	if strings.Contains(out, "A S") || !strings.Contains(out, string(dashedRune)+" pinned A (sparser)") {
		t.Errorf("with DashedName: A's curves are listed, or the group entry is missing\n%s", out)
	}
}
