package chart

import (
	"strconv"
	"strings"
	"testing"

	"cloudwind/internal/chartspec"
	"cloudwind/tui/internal/golden"
)

// synthZonedChart is synthThresholdChart with two zones, [1.5, 2] and
// [3.2, 4.5] in log χ (the second reaching past the axis), named as the
// outflow view names its zones (numbers chosen for layout tests).
func synthZonedChart(n int) *chartspec.LineChart {
	c := synthThresholdChart(n)
	c.Zones, c.ZoneName = []chartspec.Zone{{Lo: 1.5, Hi: 2}, {Lo: 3.2, Hi: 4.5}}, "criteria disagree"
	return c
}

// TestZonesGolden draws the zoned chart in every mode at both sizes.
func TestZonesGolden(t *testing.T) {
	sts := chartTestStyles()
	for _, sz := range [][2]int{{80, 24}, {120, 40}} {
		for _, mode := range []string{"plain", "ascii", "braille"} {
			sub := "zones_" + mode + "_" + strconv.Itoa(sz[0]) + "x" + strconv.Itoa(sz[1])
			out := RenderLine(synthZonedChart(200), sz[0], sz[1], sts[mode])
			checkChartBlock(t, sub, out, sz[0], sz[1])
			golden.Check(t, "TestZonesGolden", sub, out)
		}
	}
}

// TestZonesMarked: on the x axis exactly the columns of the zones carry
// the zone glyph (ticks kept); with braille the free plot cells of those
// columns and no others hold the shade; the legend names the zones; a
// chart without zones has no zone glyph.
func TestZonesMarked(t *testing.T) {
	for _, mode := range []string{"plain", "ascii", "braille"} {
		st := chartTestStyles()[mode]
		c := synthZonedChart(50)
		out := RenderLine(c, 70, 20, st)
		g := chartGrid(out)
		bare := *c
		bare.Zones = nil // the same layout, with the axis unbroken for chartPlotRect
		x0, top, pw, ph := chartPlotRect(t, chartGrid(RenderLine(&bare, 70, 20, st)), st.ASCII)
		axis := top + ph
		mark := zoneRune
		if st.ASCII {
			mark = zoneRuneASCII
		}
		// The column of log χ = v on the 1…4 axis: the renderer's scale, in
		// dots (two per cell across in braille).
		sx := 1
		if mode == "braille" {
			sx = 2
		}
		scale := dotScale{1, 4, pw * sx}
		col := func(v float64) int { return x0 + scale.dot(v)/sx }
		inZone := func(x int) bool { return (x >= col(1.5) && x <= col(2)) || x >= col(3.2) }
		gl := axesGlyphs(st.ASCII)
		for x := x0; x < x0+pw; x++ {
			r := g[axis][x]
			switch {
			case r == gl.xtick:
			case inZone(x) && r != mark:
				t.Errorf("%s: axis column %d inside a zone holds %q, want %q\n%s", mode, x, r, mark, out)
			case !inZone(x) && r != gl.horiz:
				t.Errorf("%s: axis column %d outside the zones holds %q\n%s", mode, x, r, out)
			}
			for y := top; y < axis; y++ {
				if shaded := g[y][x] == zoneRuneBraille; shaded && (mode != "braille" || !inZone(x)) {
					t.Fatalf("%s: shade at (%d, %d), outside a zone or without braille\n%s", mode, x, y, out)
				}
			}
		}
		if mode == "braille" && !strings.ContainsRune(out, zoneRuneBraille) {
			t.Errorf("braille: no zone is shaded\n%s", out)
		}
		if !strings.Contains(golden.SGR.ReplaceAllString(out, ""), string(mark)+" criteria disagree") {
			t.Errorf("%s: the legend lacks the zones' entry\n%s", mode, out)
		}
		if out := RenderLine(&bare, 70, 20, st); strings.ContainsRune(out, mark) || strings.Contains(out, "criteria disagree") {
			t.Errorf("%s: a chart without zones marks or names one\n%s", mode, out)
		}
	}
}
