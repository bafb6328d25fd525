package figure

import (
	"encoding/xml"
	"errors"
	"image/png"
	"io"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"cloudwind/internal/chartspec"
)

// Expected values in this file are rules of this package (file formats, the
// 6 × 4 in size at 300 dpi, the notation of chart texts) unless a comment
// names another source. The charts are synthetic: their numbers mean
// nothing.

// testLineChart returns a chart that uses every feature: log axes, Unicode
// labels, a series broken by NaN, a dashed series, markers of each kind.
func testLineChart() *chartspec.LineChart {
	xs := []float64{0, 0.5, 1, 1.5, 2, 2.5, 3}
	return &chartspec.LineChart{
		Title: "r_crit vs χ (P/k_B = 10³ K cm⁻³)",
		X:     chartspec.Axis{Label: "χ", Log: true, Min: 0, Max: 3},
		Y:     chartspec.Axis{Label: "r_crit (pc)", Log: true, Min: -2, Max: 2},
		Series: []chartspec.Series{
			{Name: "Gronke & Oh 2018", X: xs, Y: []float64{-1, -0.5, 0, 0.5, 1, 1.5, 2.5}, Index: 0},
			{Name: "Λ-weighted μ M☉", X: xs, Y: []float64{1, math.NaN(), 0, math.Inf(1), -1, -1.5, -2}, Index: 1},
			{Name: "pinned A", X: xs, Y: []float64{0, 0, 0, 0, 0, 0, 0}, Index: 1, Dashed: true},
			{Name: "beyond the float range", X: []float64{0, 1}, Y: []float64{400, -400}, Index: 9},
		},
		Markers: []chartspec.Marker{
			{Kind: chartspec.VLine, X: 2, Label: "χ = 100"},
			{Kind: chartspec.HLine, Y: 0, Label: "r_cl = 1 pc"},
			{Kind: chartspec.Point, X: 1, Y: 1, Label: "now", Warn: true},
			{Kind: chartspec.VLine, X: 7, Label: "off the chart"},
		},
		Note: "T_mix outside the cooling table — caution",
	}
}

// testRegimeMap returns a 4×3 map over log axes with a marked point.
func testRegimeMap() *chartspec.RegimeMap {
	return &chartspec.RegimeMap{
		Title: "Regime map",
		X:     chartspec.Axis{Label: "χ", Log: true, Min: 1, Max: 3},
		Y:     chartspec.Axis{Label: "r_cl (pc)", Log: true, Min: -1, Max: 2},
		NX:    4, NY: 3,
		Counts: []int{0, 1, 2, 3, 1, 2, 3, 4, 2, 3, 5, 6},
		Total:  6,
		Mark:   &chartspec.Marker{Kind: chartspec.Point, X: 2, Y: 0.5, Label: "current"},
		Note:   "6 criteria",
	}
}

// svgTexts parses an SVG file as XML and returns the text of its <text>
// elements.
func svgTexts(t *testing.T, path string) []string {
	t.Helper()
	texts, _ := svgTextSizes(t, path)
	return texts
}

// svgTextSizes returns the text of the <text> elements of an SVG file and
// the font size of each, from its style ("font-size:7px").
func svgTextSizes(t *testing.T, path string) (texts []string, sizes []string) {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	d := xml.NewDecoder(f)
	inText := false
	for {
		tok, err := d.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("%s is not well-formed XML: %v", path, err)
		}
		switch tok := tok.(type) {
		case xml.StartElement:
			inText = tok.Name.Local == "text"
			if inText {
				size := ""
				for _, a := range tok.Attr {
					if a.Name.Local == "style" {
						if _, rest, ok := strings.Cut(a.Value, "font-size:"); ok {
							size, _, _ = strings.Cut(rest, ";")
						}
					}
				}
				sizes = append(sizes, size)
			}
		case xml.EndElement:
			inText = false
		case xml.CharData:
			if inText {
				texts = append(texts, string(tok))
			}
		}
	}
	return texts, sizes
}

// cellTexts returns the texts of a regime map's cells: those in the
// cells' 7-point font.
func cellTexts(t *testing.T, path string) []string {
	texts, sizes := svgTextSizes(t, path)
	var out []string
	for i, s := range texts {
		if strings.TrimSpace(sizes[i]) == "7px" {
			out = append(out, s)
		}
	}
	return out
}

// checkPNG decodes a PNG file and checks its size: 6 × 4 in at 300 dpi.
func checkPNG(t *testing.T, path string) { checkPNGSize(t, path, 1800, 1200) }

// checkPNGSize decodes a PNG file and checks its size in pixels.
func checkPNGSize(t *testing.T, path string, w, h int) {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	img, err := png.Decode(f)
	if err != nil {
		t.Fatalf("%s does not decode as PNG: %v", path, err)
	}
	if b := img.Bounds(); b.Dx() != w || b.Dy() != h {
		t.Errorf("%s is %d×%d pixels, want %d×%d (at 300 dpi)", path, b.Dx(), b.Dy(), w, h)
	}
}

func TestWriteLineChart(t *testing.T) {
	dir := t.TempDir()
	svg, pngPath := filepath.Join(dir, "chart.svg"), filepath.Join(dir, "chart.PNG")
	c := testLineChart()
	c.Caption = "χ = 300, cooling: test"
	for _, p := range []string{svg, pngPath} {
		if err := WriteLineChart(c, p); err != nil {
			t.Fatalf("WriteLineChart(%s): %v", p, err)
		}
	}
	texts := svgTexts(t, svg)
	// Texts are drawn span by span: a subscript or superscript is a text
	// element of its own.
	for _, want := range []string{
		"r", "crit", " vs χ (P/k", "B", " = 10", "3", " K cm", "-3", // the title, with real symbols
		"Gronke & Oh 2018", "Λ-weighted μ M☉", "pinned A", // legend
		"χ", " (pc)", // axis labels
		"10", "0", "1", "-2", // decade ticks 10⁰, 10¹, 10⁻²
		"χ = 100", "r", "cl", " = 1 pc", "! now", // marker labels; a warning marked without colour
		"T", "mix", " outside the cooling table — caution", // the note
		"χ = 300, cooling: test", // the caption
	} {
		if !slices.Contains(texts, want) {
			t.Errorf("SVG texts %q lack %q", texts, want)
		}
	}
	if slices.Contains(texts, "off the chart") {
		t.Errorf("SVG shows the label of a marker outside the axis range")
	}
	for _, s := range texts {
		if strings.ContainsAny(s, "_^") {
			t.Errorf("SVG text %q shows markup instead of a subscript or superscript", s)
		}
	}
	checkPNG(t, pngPath)
	entries, _ := os.ReadDir(dir)
	if len(entries) != 2 {
		t.Errorf("directory holds %d entries, want the 2 figures and no temporary files", len(entries))
	}
}

// TestWritePanels exports the evolution view's two charts: both panels,
// one legend, every note, a taller figure.
func TestWritePanels(t *testing.T) {
	dir := t.TempDir()
	top, bottom := testLineChart(), testLineChart()
	top.Title, bottom.Title = "upper panel", "lower panel"
	bottom.Note = "lower note"
	svg, pngPath := filepath.Join(dir, "two.svg"), filepath.Join(dir, "two.png")
	for _, p := range []string{svg, pngPath} {
		if err := WritePanels([]*chartspec.LineChart{top, bottom}, p); err != nil {
			t.Fatalf("WritePanels(%s): %v", p, err)
		}
	}
	texts := svgTexts(t, svg)
	for _, want := range []string{"upper panel", "lower panel", "lower note", " outside the cooling table — caution"} {
		if !slices.Contains(texts, want) {
			t.Errorf("SVG texts %q lack %q", texts, want)
		}
	}
	n := 0
	for _, s := range texts {
		if s == "Gronke & Oh 2018" {
			n++
		}
	}
	if n != 1 {
		t.Errorf("the shared legend names the first series %d times, want once", n)
	}
	checkPNGSize(t, pngPath, 1800, 1950) // 6 × (4 + 2.5) in at 300 dpi
	if err := WritePanels(nil, filepath.Join(dir, "none.svg")); err == nil {
		t.Error("WritePanels(no charts) = nil, want an error")
	}
}

func TestWriteRegimeMap(t *testing.T) {
	dir := t.TempDir()
	svg, pngPath := filepath.Join(dir, "map.svg"), filepath.Join(dir, "map.png")
	for _, p := range []string{svg, pngPath} {
		if err := WriteRegimeMap(testRegimeMap(), p); err != nil {
			t.Fatalf("WriteRegimeMap(%s): %v", p, err)
		}
	}
	texts := svgTexts(t, svg)
	for _, want := range []string{"Regime map", "Criteria predicting survival", "6 of 6", "0 of 6", "current", "χ", "cl", " (pc)", "10", "6 criteria"} {
		if !slices.Contains(texts, want) {
			t.Errorf("SVG texts %q lack %q", texts, want)
		}
	}
	// Each of the 12 cells is large enough to carry its count.
	digits := 0
	for _, s := range cellTexts(t, svg) {
		if len(s) == 1 && s[0] >= '0' && s[0] <= '6' {
			digits++
		}
	}
	if digits != 12 {
		t.Errorf("SVG has %d cell counts, want 12", digits)
	}
	checkPNG(t, pngPath)
}

func TestWriteErrors(t *testing.T) {
	dir := t.TempDir()
	for _, name := range []string{"chart.pdf", "chart", "chart.svg.txt"} {
		p := filepath.Join(dir, name)
		err := WriteLineChart(testLineChart(), p)
		if !errors.Is(err, ErrFormat) || !strings.Contains(err.Error(), p) {
			t.Errorf("WriteLineChart(%s) = %v, want an ErrFormat error naming the path", name, err)
		}
	}
	bad := []*chartspec.RegimeMap{
		{NX: 2, NY: 2, Counts: []int{1, 2, 3}, Total: 3},
		{NX: 2, NY: 1, Counts: []int{1, 2, 3}, Total: 3},
		{NX: 0, NY: 0},
		nil,
	}
	for i, m := range bad {
		if err := WriteRegimeMap(m, filepath.Join(dir, "map.svg")); err == nil {
			t.Errorf("WriteRegimeMap(bad map %d) = nil, want an error", i)
		}
	}
	if err := WriteLineChart(nil, filepath.Join(dir, "x.svg")); err == nil {
		t.Error("WriteLineChart(nil) = nil, want an error")
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 0 {
		t.Errorf("failed exports left %d files", len(entries))
	}
}

func TestWriteFailedLeavesNoFile(t *testing.T) {
	dir := t.TempDir()
	// A directory in the way: the rename over it fails after the figure was
	// written to a temporary file, which must then be removed.
	target := filepath.Join(dir, "busy.svg")
	if err := os.Mkdir(target, 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(target, "keep"), nil, 0o644); err != nil {
		t.Fatal(err)
	}
	err := WriteLineChart(testLineChart(), target)
	if err == nil || !strings.Contains(err.Error(), target) {
		t.Fatalf("WriteLineChart over a directory = %v, want an error naming %s", err, target)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 1 {
		t.Errorf("directory holds %d entries after the failed export, want only the directory in the way", len(entries))
	}
	missing := filepath.Join(dir, "no-such-dir", "map.png")
	if err := WriteRegimeMap(testRegimeMap(), missing); err == nil || !strings.Contains(err.Error(), missing) {
		t.Errorf("WriteRegimeMap into a missing directory = %v, want an error naming %s", err, missing)
	}
}

func TestWriteDegenerateCharts(t *testing.T) {
	// Charts with nothing drawable must still export, not panic.
	dir := t.TempDir()
	charts := []*chartspec.LineChart{
		{},
		{X: chartspec.Axis{Log: true, Min: 3, Max: 1}, Y: chartspec.Axis{Log: true, Min: math.NaN(), Max: math.Inf(1)}},
		{X: chartspec.Axis{Log: true}, Y: chartspec.Axis{Log: true}, Series: []chartspec.Series{{Name: "one point", X: []float64{1}, Y: []float64{1}}}},
		{X: chartspec.Axis{Log: true, Min: -500, Max: 500}, Y: chartspec.Axis{Min: 1, Max: 1},
			Series: []chartspec.Series{{X: []float64{-400, 0, 1}, Y: []float64{1, 1, 1, 1}}}, Markers: []chartspec.Marker{{Kind: chartspec.Point, X: math.NaN()}}},
	}
	for i, c := range charts {
		if err := WriteLineChart(c, filepath.Join(dir, "c.svg")); err != nil {
			t.Errorf("WriteLineChart(degenerate chart %d) = %v, want nil", i, err)
		}
	}
	m := &chartspec.RegimeMap{X: chartspec.Axis{Log: true, Min: math.NaN()}, NX: 1, NY: 1, Counts: []int{0}}
	if err := WriteRegimeMap(m, filepath.Join(dir, "m.svg")); err != nil {
		t.Errorf("WriteRegimeMap(1 cell, no criteria) = %v, want nil", err)
	}
	// Negative counts are cells without a valid state (chartspec.RegimeMap), drawn
	// blank; a count above Total is drawn "?".
	m = testRegimeMap()
	m.Counts[0], m.Counts[11] = -1, 7
	p := filepath.Join(dir, "holes.svg")
	if err := WriteRegimeMap(m, p); err != nil {
		t.Fatalf("WriteRegimeMap(map with blank cells) = %v, want nil", err)
	}
	texts, cells := svgTexts(t, p), cellTexts(t, p)
	if !slices.Contains(texts, "no data") || !slices.Contains(cells, "?") || slices.Contains(cells, "-1") {
		t.Errorf("SVG texts %q: want a \"no data\" legend entry, a \"?\" cell and no \"-1\"", texts)
	}
}

func TestLogTicks(t *testing.T) {
	labels := func(lo, hi float64) []string {
		var out []string
		for _, tk := range logTicks(lo, hi) {
			if tk.Label != "" && tk.Value >= lo && tk.Value <= hi {
				out = append(out, tk.Label)
			}
		}
		return out
	}
	cases := []struct {
		lo, hi float64
		want   []string
	}{
		{1e-2, 1e2, []string{"10^-2", "10^-1", "10^0", "10^1", "10^2"}},
		{0.2, 0.8, []string{"2×10^-1", "5×10^-1"}},                                                              // no decade inside: 2 and 5 labelled
		{2, 5, []string{"2×10^0", "3×10^0", "4×10^0", "5×10^0"}},                                                // within a factor 3: all labelled
		{1e-16, 1e16, []string{"10^-16", "10^-12", "10^-8", "10^-4", "10^0", "10^4", "10^8", "10^12", "10^16"}}, // every 4th decade
	}
	for _, c := range cases {
		if got := labels(c.lo, c.hi); !slices.Equal(got, c.want) {
			t.Errorf("logTicks(%g, %g) labels %q, want %q", c.lo, c.hi, got, c.want)
		}
	}
	if got := logTicks(0, 1); got != nil {
		t.Errorf("logTicks(0, 1) = %v, want nil (log axes need positive ranges)", got)
	}
}
