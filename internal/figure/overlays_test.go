package figure

import (
	"image/png"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"cloudwind/internal/chartspec"
	"cloudwind/model"
)

// overlayChart is a small line chart with a band of ±0.3 dex around its
// one curve and a run of each outcome (numbers chosen for the test).
func overlayChart() *chartspec.LineChart {
	xs := []float64{1, 2, 3, 4}
	return &chartspec.LineChart{
		Title:      "bands and runs",
		X:          chartspec.Axis{Label: "χ", Log: true, Min: 1, Max: 4},
		Y:          chartspec.Axis{Label: "r_crit (pc)", Log: true, Min: -2, Max: 4},
		Series:     []chartspec.Series{{Name: "curve", X: xs, Y: []float64{0, 1, 2, 3}}},
		Bands:      []chartspec.Band{{Name: "curve", X: xs, Lo: []float64{-0.3, 0.7, 1.7, 2.7}, Hi: []float64{0.3, 1.3, 2.3, 3.3}}},
		BandFactor: "×/÷ 2",
		Runs: []chartspec.RunMark{{X: 2, Y: 2, Outcome: model.RunGrew}, {X: 3, Y: 0, Outcome: model.RunTransformed},
			{X: 3.5, Y: -1, Outcome: model.RunDestroyed}},
		RunsName: "test runs",
	}
}

// TestFigureOverlays: a band is a translucent fill with its legend entry,
// each run outcome has an entry, and a chart without them has neither.
func TestFigureOverlays(t *testing.T) {
	dir := t.TempDir()
	with, without := filepath.Join(dir, "with.svg"), filepath.Join(dir, "without.svg")
	c := overlayChart()
	if err := WriteLineChart(c, with); err != nil {
		t.Fatal(err)
	}
	c.Bands, c.Runs = nil, nil
	if err := WriteLineChart(c, without); err != nil {
		t.Fatal(err)
	}
	joined := func(p string) string { return strings.Join(svgTexts(t, p), "") }
	for _, want := range []string{"shaded:", "unverified", "simulation run (test runs): grew or survived", "transformed", "destroyed"} {
		if !strings.Contains(joined(with), want) {
			t.Errorf("figure with overlays lacks the text %q", want)
		}
		if strings.Contains(joined(without), want) && want != "transformed" && want != "destroyed" {
			t.Errorf("figure without overlays has the text %q", want)
		}
	}
	raw, err := os.ReadFile(with)
	if err != nil {
		t.Fatal(err)
	}
	plain, err := os.ReadFile(without)
	if err != nil {
		t.Fatal(err)
	}
	// The band's fill: the series colour at the band's opacity.
	op := "fill-opacity:0.2196" // 0x38/0xff
	if !strings.Contains(string(raw), op) || strings.Contains(string(plain), op) {
		t.Errorf("band fill %q: in the figure with a band %v, without %v", op, strings.Contains(string(raw), op), strings.Contains(string(plain), op))
	}
}

// TestFigureGrowsForLegend: a legend of many long entries makes the
// figure taller instead of squeezing the plot.
func TestFigureGrowsForLegend(t *testing.T) {
	c := overlayChart()
	for i := range 10 {
		s := c.Series[0]
		s.Name, s.Index = "a long criterion label number "+strings.Repeat("x", i)+" (with a parenthesis)", i
		c.Series = append(c.Series, s)
	}
	path := filepath.Join(t.TempDir(), "tall.png")
	if err := WriteLineChart(c, path); err != nil {
		t.Fatal(err)
	}
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	cfg, err := png.DecodeConfig(f)
	if err != nil {
		t.Fatal(err)
	}
	if cfg.Width != 1800 || cfg.Height <= 1200 {
		t.Errorf("figure with a 14-entry legend is %d×%d px, want 1800 wide and taller than 1200", cfg.Width, cfg.Height)
	}
}

// TestRegimeFigureClasses: hatched cells and "t" cells are named in the
// legend, runs too, and a cell where none grows but some are transformed
// reads "t".
func TestRegimeFigureClasses(t *testing.T) {
	m := &chartspec.RegimeMap{Title: "classes", X: chartspec.Axis{Label: "χ", Log: true, Min: 1, Max: 4}, Y: chartspec.Axis{Label: "r", Log: true, Min: -2, Max: 4},
		NX: 3, NY: 2, Total: 3, Counts: []int{0, 1, 3, 0, 2, 3}, Transformed: []int{1, 0, 0, 0, 0, 0},
		Class: []chartspec.Agreement{chartspec.Disagree, chartspec.Depends, chartspec.AllAgree, chartspec.AllAgree, chartspec.Depends, chartspec.AllAgree},
		Runs:  []chartspec.RunMark{{X: 2, Y: 0, Outcome: model.RunSurvived}}}
	path := filepath.Join(t.TempDir(), "classes.svg")
	if err := WriteRegimeMap(m, path); err != nil {
		t.Fatal(err)
	}
	all := strings.Join(svgTexts(t, path), "")

	for _, want := range []string{"hatched: uncertain verdict", "t: transformed, none grows", "run: grew or survived"} {
		if !strings.Contains(all, want) {
			t.Errorf("regime figure lacks %q", want)
		}
	}
	if cells := cellTexts(t, path); len(cells) != 6 || cells[0] != "t" {
		t.Errorf("regime figure cells %q, want six with the first \"t\"", cells)
	}
}

// TestFigureZones: zones are a translucent grey fill named in the legend,
// and a chart without zones has neither.
func TestFigureZones(t *testing.T) {
	dir := t.TempDir()
	with, without := filepath.Join(dir, "with.svg"), filepath.Join(dir, "without.svg")
	c := overlayChart()
	c.Bands, c.Runs = nil, nil
	c.Zones, c.ZoneName = []chartspec.Zone{{Lo: 1.5, Hi: 2.5}, {Lo: 3.8, Hi: 5}}, "criteria disagree" // the second reaches beyond the axis: clipped
	if err := WriteLineChart(c, with); err != nil {
		t.Fatal(err)
	}
	c.Zones = nil
	if err := WriteLineChart(c, without); err != nil {
		t.Fatal(err)
	}
	if got := strings.Join(svgTexts(t, with), ""); !strings.Contains(got, "shaded: criteria disagree") {
		t.Errorf("figure with zones lacks their legend entry: %q", got)
	}
	if got := strings.Join(svgTexts(t, without), ""); strings.Contains(got, "criteria disagree") {
		t.Errorf("figure without zones names them: %q", got)
	}
	raw, err := os.ReadFile(with)
	if err != nil {
		t.Fatal(err)
	}
	plain, err := os.ReadFile(without)
	if err != nil {
		t.Fatal(err)
	}
	op := "fill-opacity:0.1882" // zoneGrey's alpha 0x30/0xff
	if n := strings.Count(string(raw), op); n < 3 || strings.Contains(string(plain), op) {
		t.Errorf("zone fill %q: %d times in the figure with two zones and their legend thumbnail (want ≥ 3), in the one without: %v",
			op, n, strings.Contains(string(plain), op))
	}
}
