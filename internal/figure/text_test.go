package figure

import (
	"fmt"
	"math"
	"slices"
	"testing"

	"cloudwind/cooling"
	"cloudwind/internal/chartspec"
	"cloudwind/model"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
)

// Expected spans follow the notation of chartspec's texts (its package
// doc); the scenario is the Gronke & Oh fiducial problem at χ = 300 and
// r_cl = 10 pc (inputs of this test, no source).

func TestParseMarkup(t *testing.T) {
	b, sup, sub := baseline, superscript, subscript
	cases := []struct {
		in   string
		want []span
	}{
		{"r_crit (pc)", []span{{"r", b}, {"crit", sub}, {" (pc)", b}}},
		{"t_cool,mix/t_cc", []span{{"t", b}, {"cool,mix", sub}, {"/t", b}, {"cc", sub}}},
		{"χ = ρ_cl/ρ_hot", []span{{"χ = ρ", b}, {"cl", sub}, {"/ρ", b}, {"hot", sub}}},
		{"P/k_B = 10³ K cm⁻³", []span{{"P/k", b}, {"B", sub}, {" = 10", b}, {"3", sup}, {" K cm", b}, {"-3", sup}}},
		{"n_H²", []span{{"n", b}, {"H", sub}, {"2", sup}}},
		{"Λ ∝ T^1/2 (extended)", []span{{"Λ ∝ T", b}, {"1/2", sup}, {" (extended)", b}}},
		{"10^-2", []span{{"10", b}, {"-2", sup}}},
		{"2×10^{−3}", []span{{"2×10", b}, {"-3", sup}}},
		{"m/m₀", []span{{"m/m", b}, {"0", sub}}},
		{"v_∞ = (2Ė/Ṁ)^1/2", []span{{"v", b}, {"∞", sub}, {" = (2Ė/Ṁ)", b}, {"1/2", sup}}},
		{"T_cl, r_cl", []span{{"T", b}, {"cl", sub}, {", r", b}, {"cl", sub}}},
		{"my_table.txt", []span{{"my_table.txt", b}}}, // not a one-letter symbol: text
		{"a^b and x_", []span{{"a^b and x_", b}}},     // nothing to raise or lower
		{"", nil},
	}
	for _, c := range cases {
		if got := parseMarkup(c.in); !slices.Equal(got, c.want) {
			t.Errorf("parseMarkup(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}

// chartTexts returns every text the figures of the explorer's charts
// draw for a scenario: titles, axis labels, tick labels, series names,
// marker labels, notes and captions, the regime map's legend, in compare
// mode and in the family of Mach numbers too.
func chartTexts(t *testing.T) []string {
	src, err := cooling.Resolve("cooling", "builtin", nil, nil)
	if err != nil {
		t.Fatal(err)
	}
	p := model.Fiducial()
	p.Chi, p.RCloud = 300, 10*model.Parsec
	cf, err := src.Function(p.Metallicity)
	if err != nil {
		t.Fatal(err)
	}
	req := chartspec.Request{Params: p, Cooling: cf, Criteria: model.BuiltinCriteria(), Cols: 40, Rows: 20,
		CoolingName: src.Desc, Pin: &chartspec.Inputs{Params: p, Cooling: cf}}
	var lines []*chartspec.LineChart
	var maps []*chartspec.RegimeMap
	for _, family := range []bool{false, true} {
		req.Family, req.MapMach = family, family
		m, v := chartspec.EvolutionCharts(req)
		lines = append(lines, chartspec.ThresholdChart(req), chartspec.CoolingChart(req), chartspec.RatioChart(req), m, v)
		maps = append(maps, chartspec.Regime(req))
	}
	// The outflow view: r_crit along the fiducial wind and the carried cloud.
	fw := model.FiducialWind()
	req.Pin, req.Family, req.MapMach, req.Wind, req.Carry = nil, false, false, &fw, true
	o, err := chartspec.NewOutflow(req)
	if err != nil {
		t.Fatal(err)
	}
	m, v := o.CarriedCharts(req)
	lines = append(lines, o.ProfileChart(req), m, v)
	texts := []string{"…", "! ", "no data", "Criteria predicting survival", "shaded: " + o.ProfileChart(req).ZoneName}
	for _, tk := range append(logTicks(1e-30, 1e30), logTicks(0.2, 0.8)...) {
		texts = append(texts, tk.Label)
	}
	add := func(title, note, caption string, axes ...chartspec.Axis) {
		texts = append(texts, title, note, caption)
		for _, a := range axes {
			texts = append(texts, a.Label)
		}
	}
	for _, c := range lines {
		add(c.Title, c.Note, c.Caption, c.X, c.Y)
		for _, s := range c.Series {
			texts = append(texts, s.Name)
		}
		for _, m := range c.Markers {
			texts = append(texts, m.Label)
		}
	}
	for _, m := range maps {
		add(m.Title, m.Note, m.Caption, m.X, m.Y)
		texts = append(texts, m.Mark.Label)
		for _, n := range legendCounts(m.Total) {
			texts = append(texts, fmt.Sprintf("%d of %d", n, m.Total))
		}
	}
	return texts
}

// TestFontCoversChartTexts fails when the figure font lacks a glyph that
// an exported chart needs, which would then be spelt in ASCII.
func TestFontCoversChartTexts(t *testing.T) {
	h, err := newRichText()
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range chartTexts(t) {
		if miss := h.missingGlyphs(s); len(miss) > 0 {
			t.Errorf("the figure font lacks %q, needed for %q", string(miss), s)
		}
	}
	// Symbols of cloudwind's texts the charts may carry in notes and names.
	for _, r := range "χρΛμγαβτΔσ☉≈∝≤≥×−–—…·→∞±°" {
		if miss := h.missingGlyphs(string(r)); len(miss) > 0 {
			t.Errorf("the figure font lacks %q", string(miss))
		}
	}
}

// TestMissingGlyphSpelt: a rune the font lacks is drawn in its ASCII
// spelling, not as a blank box or another glyph.
func TestMissingGlyphSpelt(t *testing.T) {
	h, err := newRichText()
	if err != nil {
		t.Fatal(err)
	}
	if miss := h.missingGlyphs("f 𝒩 Λ"); !slices.Equal(miss, []rune{'𝒩'}) {
		t.Fatalf("missingGlyphs(f 𝒩 Λ) = %q, want the script N only", string(miss))
	}
	got := h.spans("f 𝒩 Λ", font.From(sansTypeface, 10))
	if want := []span{{"f N Λ", baseline}}; !slices.Equal(got, want) {
		t.Errorf("spans(f 𝒩 Λ) = %q, want %q", got, want)
	}
}

// A recorder is a canvas that records where each text is drawn, in the
// canvas's coordinates (it follows rotations, the only transform the
// figures use for text).
type recorder struct {
	*vgimg.Canvas
	angles []float64 // the rotation of each pushed state, innermost last
	boxes  []textBox
}

type textBox struct {
	text string
	rect vg.Rectangle
}

func newRecorder(w, h vg.Length) *recorder {
	return &recorder{Canvas: vgimg.New(w, h), angles: []float64{0}}
}

func (r *recorder) Push() { r.angles = append(r.angles, r.angles[len(r.angles)-1]); r.Canvas.Push() }
func (r *recorder) Pop()  { r.angles = r.angles[:len(r.angles)-1]; r.Canvas.Pop() }
func (r *recorder) Rotate(a float64) {
	r.angles[len(r.angles)-1] += a
	r.Canvas.Rotate(a)
}

func (r *recorder) FillString(f font.Face, pt vg.Point, s string) {
	ext := f.Extents()
	w := f.Width(s)
	corners := []vg.Point{{X: pt.X, Y: pt.Y - ext.Descent}, {X: pt.X + w, Y: pt.Y + ext.Ascent}}
	sin, cos := math.Sincos(r.angles[len(r.angles)-1])
	var box vg.Rectangle
	for i, c := range corners {
		q := vg.Point{X: c.X*vg.Length(cos) - c.Y*vg.Length(sin), Y: c.X*vg.Length(sin) + c.Y*vg.Length(cos)}
		if i == 0 {
			box = vg.Rectangle{Min: q, Max: q}
		}
		box.Min.X, box.Min.Y = min(box.Min.X, q.X), min(box.Min.Y, q.Y)
		box.Max.X, box.Max.Y = max(box.Max.X, q.X), max(box.Max.Y, q.Y)
	}
	r.boxes = append(r.boxes, textBox{s, box})
	r.Canvas.FillString(f, pt, s)
}

// TestTextsInsideFrame draws the cooling curve (a long legend name,
// markers near the edges), the threshold chart, the two evolution panels
// and the regime map, and requires every text to lie inside the figure.
func TestTextsInsideFrame(t *testing.T) {
	src, err := cooling.Resolve("cooling", "builtin", nil, nil)
	if err != nil {
		t.Fatal(err)
	}
	p := model.Fiducial()
	p.Chi, p.RCloud = 3e4, 10*model.Parsec // T_hot near the right edge of the cooling chart
	cf, _ := src.Function(p.Metallicity)
	req := chartspec.Request{Params: p, Cooling: cf, Criteria: model.BuiltinCriteria(), Cols: 40, Rows: 20,
		CoolingName: src.Desc + " with a very long name that no legend strip could hold on one line"}
	cool := chartspec.CoolingChart(req)
	cool.Series[0].Name = req.CoolingName
	m, v := chartspec.EvolutionCharts(req)
	figs := map[string]struct {
		height vg.Length
		draw   func(h *richText, dc draw.Canvas) error
	}{
		"cooling": {figureHeight, func(h *richText, dc draw.Canvas) error {
			return drawLineCharts(h, dc, []*chartspec.LineChart{cool})
		}},
		"threshold": {figureHeight, func(h *richText, dc draw.Canvas) error {
			return drawLineCharts(h, dc, []*chartspec.LineChart{chartspec.ThresholdChart(req)})
		}},
		"evolution": {figureHeight + panelHeight, func(h *richText, dc draw.Canvas) error {
			return drawLineCharts(h, dc, []*chartspec.LineChart{m, v})
		}},
		"regime": {figureHeight, func(h *richText, dc draw.Canvas) error { return drawRegimeMap(h, dc, chartspec.Regime(req)) }},
	}
	for name, f := range figs {
		h, err := newRichText()
		if err != nil {
			t.Fatal(err)
		}
		rec := newRecorder(figureWidth, f.height)
		if err := renderSafely(func(dc draw.Canvas) error { return f.draw(h, dc) }, draw.New(rec)); err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if len(rec.boxes) < 10 {
			t.Fatalf("%s: recorded %d texts, want the figure's texts", name, len(rec.boxes))
		}
		const slack = 0.5 // points: rounding of glyph extents
		for _, b := range rec.boxes {
			if b.rect.Min.X < -slack || b.rect.Min.Y < -slack || b.rect.Max.X > figureWidth+slack || b.rect.Max.Y > f.height+slack {
				t.Errorf("%s: text %q at %v leaves the %v × %v figure", name, b.text, b.rect, figureWidth, f.height)
			}
		}
	}
}
