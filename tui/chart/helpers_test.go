package chart

import (
	"math"
	"strings"
	"testing"

	"github.com/charmbracelet/lipgloss"

	"cloudwind/internal/chartspec"
	"cloudwind/tui/internal/golden"
)

// Helpers and fixtures of the chart and regime-map tests.

// checkChartBlock fails unless out is exactly h lines of exactly w cells.
func checkChartBlock(t *testing.T, what, out string, w, h int) {
	t.Helper()
	if h <= 0 {
		if out != "" {
			t.Fatalf("%s at %d×%d = %q, want empty", what, w, h, out)
		}
		return
	}
	lines := strings.Split(out, "\n")
	if len(lines) != h {
		t.Fatalf("%s at %d×%d has %d lines, want %d", what, w, h, len(lines), h)
	}
	for i, l := range lines {
		if lw := lipgloss.Width(l); lw != w {
			t.Fatalf("%s at %d×%d: line %d is %d wide, want %d: %q", what, w, h, i, lw, w, l)
		}
	}
}

// chartTestStyles returns the colourless, ASCII and braille style sets:
// what the explorer's styles give without colour, with --ascii and with
// colour (here with the dark palette's series colours, ANSI 256-colour
// indices).
func chartTestStyles() map[string]*Styles {
	plain := DefaultStyles()
	ascii := DefaultStyles()
	ascii.ASCII = true
	braille := colourStyles(lipgloss.NewStyle)
	return map[string]*Styles{"plain": &plain, "ascii": &ascii, "braille": &braille}
}

// colourStyles returns coloured braille styles made by newStyle.
func colourStyles(newStyle func() lipgloss.Style) Styles {
	st := DefaultStyles()
	st.Color = true
	fg := func(c string) lipgloss.Style { return newStyle().Foreground(lipgloss.Color(c)) }
	st.Title, st.AxisLabel, st.Dim, st.Warning, st.Legend = fg("212").Bold(true), fg("245"), fg("245"), fg("214"), fg("252")
	st.Series = nil
	for _, c := range []string{"39", "214", "170", "42", "203", "250", "226", "51"} {
		st.Series = append(st.Series, fg(c))
	}
	for _, c := range []string{"52", "94", "136", "142", "71", "35", "42"} {
		st.Heat = append(st.Heat, newStyle().Background(lipgloss.Color(c)).Foreground(lipgloss.Color("252")))
	}
	return st
}

// syntheticThresholds returns the (a, b) of the synthetic threshold radii
// r_crit = a χ^b (pc) used by the chart and map fixtures: numbers chosen
// to spread curves over the axes, not results of any criterion.
func syntheticThresholds() []syntheticThreshold {
	return []syntheticThreshold{
		{"S1 χ^1", 1e-3, 1.0}, {"S2 χ^0.5", 2e-2, 0.5}, {"S3 χ^1.5", 5e-4, 1.5},
		{"S4 χ^0.25", 0.3, 0.25}, {"S5 χ^0.75", 1e-2, 0.75}, {"S6 χ^2", 3e-5, 2.0},
	}
}

// A syntheticThreshold is r_crit = a χ^b (pc), named for the legend.
type syntheticThreshold struct {
	name string
	a, b float64
}

// synthThresholdChart returns r_crit vs χ on log–log axes: six synthetic
// curves of n points, a VLine at the current χ = 100 and an HLine at the
// current r_cl = 1 pc.
func synthThresholdChart(n int) *chartspec.LineChart {
	c := &chartspec.LineChart{
		Title: "threshold radius vs χ (synthetic)",
		X:     chartspec.Axis{Label: "χ = ρ_cl/ρ_hot", Log: true, Min: 1, Max: 4},
		Y:     chartspec.Axis{Label: "r_crit (pc)", Log: true, Min: -3, Max: 3},
		Markers: []chartspec.Marker{
			{Kind: chartspec.VLine, X: 2, Label: "χ=100"},
			{Kind: chartspec.HLine, Y: 0, Label: "r_cl=1 pc"},
		},
		Note: "synthetic data r_crit = a χ^b, for layout tests only",
	}
	for i, p := range syntheticThresholds() {
		s := chartspec.Series{Name: p.name, Index: i}
		for k := range n {
			lx := 1 + 3*float64(k)/float64(n-1)
			s.X = append(s.X, lx)
			s.Y = append(s.Y, math.Log10(p.a)+p.b*lx)
		}
		c.Series = append(c.Series, s)
	}
	return c
}

// synthCoolingChart returns a synthetic cooling curve Λ(T): Gaussian peaks in
// log T standing for H (10^4.25 K), O (10^5.35 K) and Fe (10^6.3 K), a
// low-temperature bump, a floor and a T^{1/2} tail; shapes and numbers
// are chosen for layout tests, not taken from a table. The VLines mark
// T_floor, T_cl, T_mix and T_hot, the last outside the table (Warn).
func synthCoolingChart() *chartspec.LineChart {
	g := func(x, mu, sigma float64) float64 { return math.Exp(-(x - mu) * (x - mu) / (2 * sigma * sigma)) }
	s := chartspec.Series{Name: "Λ(T) synthetic"}
	for k := range 301 {
		lt := 1.5 + 7*float64(k)/300
		step := 1 / (1 + math.Exp(-(lt-4.3)*10))
		lam := 2e-22*g(lt, 5.35, 0.22) + 1.2e-22*g(lt, 4.25, 0.10) + 5e-23*g(lt, 6.3, 0.25) +
			2.5e-27*math.Sqrt(math.Pow(10, lt))*step + 3e-27*g(lt, 3.3, 0.6) + 1e-28
		s.X = append(s.X, lt)
		s.Y = append(s.Y, math.Log10(lam))
	}
	return &chartspec.LineChart{
		Title:  "cooling function (synthetic)",
		X:      chartspec.Axis{Label: "T (K)", Log: true, Min: 1, Max: 9},
		Y:      chartspec.Axis{Label: "Λ (erg cm³ s⁻¹)", Log: true, Min: -28, Max: -21},
		Series: []chartspec.Series{s},
		Markers: []chartspec.Marker{
			{Kind: chartspec.VLine, X: 3.7, Label: "T_floor"},
			{Kind: chartspec.VLine, X: 4.0, Label: "T_cl"},
			{Kind: chartspec.VLine, X: 5.5, Label: "T_mix"},
			{Kind: chartspec.VLine, X: 8.7, Label: "T_hot", Warn: true},
		},
		Note: "synthetic curve; T_hot lies above the table's last node (1e8.5 K)",
	}
}

// chartGrid splits a rendered, colourless block into rows of runes.
func chartGrid(out string) [][]rune {
	var g [][]rune
	for _, l := range strings.Split(golden.SGR.ReplaceAllString(out, ""), "\n") {
		g = append(g, []rune(l))
	}
	return g
}

// chartPlotRect finds the plot area of a rendered chart from its axes: the
// corner '└' (or '+' in ASCII) below the y axis. It returns the first
// plot column x0, the top plot row, the plot width and height.
func chartPlotRect(t *testing.T, g [][]rune, ascii bool) (x0, top, pw, ph int) {
	t.Helper()
	gl := axesGlyphs(ascii)
	for y := len(g) - 1; y >= 0; y-- {
		for x, r := range g[y] {
			if r != gl.corner || x+1 >= len(g[y]) || (g[y][x+1] != gl.horiz && g[y][x+1] != gl.xtick) {
				continue
			}
			x0 = x + 1
			for pw = 0; x0+pw < len(g[y]) && (g[y][x0+pw] == gl.horiz || g[y][x0+pw] == gl.xtick); pw++ {
			}
			for top = y - 1; top > 0 && (g[top-1][x] == gl.vert || g[top-1][x] == gl.ytick); top-- {
			}
			return x0, top, pw, y - top
		}
	}
	t.Fatalf("no axes found in\n%s", string(chartJoinRows(g)))
	return
}

// chartJoinRows joins rows of runes with newlines.
func chartJoinRows(g [][]rune) []rune {
	var out []rune
	for i, r := range g {
		if i > 0 {
			out = append(out, '\n')
		}
		out = append(out, r...)
	}
	return out
}
