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
// 6 × 4 in size at 300 dpi, the ASCII spelling of labels) unless a comment
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
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	d := xml.NewDecoder(f)
	var texts []string
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
		case xml.EndElement:
			inText = false
		case xml.CharData:
			if inText {
				texts = append(texts, string(tok))
			}
		}
	}
	return texts
}

// checkPNG decodes a PNG file and checks its size: 6 × 4 in at 300 dpi.
func checkPNG(t *testing.T, path string) {
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
	if b := img.Bounds(); b.Dx() != 1800 || b.Dy() != 1200 {
		t.Errorf("%s is %d×%d pixels, want 1800×1200 (6×4 in at 300 dpi)", path, b.Dx(), b.Dy())
	}
}

func TestWriteLineChart(t *testing.T) {
	dir := t.TempDir()
	svg, pngPath := filepath.Join(dir, "chart.svg"), filepath.Join(dir, "chart.PNG")
	for _, p := range []string{svg, pngPath} {
		if err := WriteLineChart(testLineChart(), p); err != nil {
			t.Fatalf("WriteLineChart(%s): %v", p, err)
		}
	}
	texts := svgTexts(t, svg)
	for _, want := range []string{
		"r_crit vs chi (P/k_B = 10^3 K cm^-3)",                    // the title, ASCII-mapped
		"Gronke & Oh 2018", "Lambda-weighted mu Msun", "pinned A", // legend
		"chi", "r_crit (pc)", // axis labels
		"1e0", "1e1", "1e-2", // decade ticks
		"chi = 100", "r_cl = 1 pc", "now", // marker labels
		"T_mix outside the cooling table -- caution", // the note (em dash spelt --)
	} {
		if !slices.Contains(texts, want) {
			t.Errorf("SVG texts %q lack %q", texts, want)
		}
	}
	if slices.Contains(texts, "off the chart") {
		t.Errorf("SVG shows the label of a marker outside the axis range")
	}
	for _, s := range texts {
		if strings.ContainsFunc(s, func(r rune) bool { return r >= 0x80 }) {
			t.Errorf("SVG text %q is not ASCII", s)
		}
	}
	checkPNG(t, pngPath)
	entries, _ := os.ReadDir(dir)
	if len(entries) != 2 {
		t.Errorf("directory holds %d entries, want the 2 figures and no temporary files", len(entries))
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
	for _, want := range []string{"Regime map", "Criteria predicting survival", "6 of 6", "0 of 6", "current", "chi", "r_cl (pc)", "1e1", "6 criteria"} {
		if !slices.Contains(texts, want) {
			t.Errorf("SVG texts %q lack %q", texts, want)
		}
	}
	// Each of the 12 cells is large enough to carry its count.
	digits := 0
	for _, s := range texts {
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
	texts := svgTexts(t, p)
	if !slices.Contains(texts, "no data") || !slices.Contains(texts, "?") || slices.Contains(texts, "-1") {
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
		{1e-2, 1e2, []string{"1e-2", "1e-1", "1e0", "1e1", "1e2"}},
		{0.2, 0.8, []string{"2e-1", "5e-1"}},                                                           // no decade inside: 2 and 5 labelled
		{2, 5, []string{"2e0", "3e0", "4e0", "5e0"}},                                                   // within a factor 3: all labelled
		{1e-16, 1e16, []string{"1e-16", "1e-12", "1e-8", "1e-4", "1e0", "1e4", "1e8", "1e12", "1e16"}}, // every 4th decade
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

func TestASCIIText(t *testing.T) {
	cases := map[string]string{
		"K cm⁻³":              "K cm^-3",
		"χ":                   "chi",
		"M☉":                  "Msun",
		"Λ (erg cm³ s⁻¹)":     "Lambda (erg cm^3 s^-1)",
		"μ_hot":               "mu_hot",
		"10⁻¹²":               "10^-12",
		"x² + y¹":             "x^2 + y^1",
		"n·T":                 "n T",
		"H₂O":                 "H_2O",
		"t⁺₋":                 "t^+_-",
		"τ ≈ 3×10⁴ yr":        "tau ~ 3x10^4 yr",
		"Z/Z☉ ≤ 1 − ε":        "Z/Zsun <= 1 - eps",
		"日本":                  "??",
		"a\x1b[31mb\tc\u202e": "a[31mb c", // control characters and bidi overrides removed (Sanitize)
		"plain ASCII 1e-2":    "plain ASCII 1e-2",
	}
	for in, want := range cases {
		if got := asciiText(in); got != want {
			t.Errorf("asciiText(%q) = %q, want %q", in, got, want)
		}
	}
	for r := range asciiSpelling {
		if s := asciiText(string(r)); strings.ContainsFunc(s, func(r rune) bool { return r >= 0x80 }) {
			t.Errorf("asciiText(%q) = %q is not ASCII", r, s)
		}
	}
}
