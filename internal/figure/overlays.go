package figure

import (
	"image/color"

	"cloudwind/internal/chartspec"
	"cloudwind/model"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Overlays of the figures: uncertainty bands (a light fill in the curve's
// colour between dotted edges, so that grey-scale prints keep them), and
// simulation runs (a glyph per outcome: a filled triangle for a cloud that
// grew or survived, a ring with a dot for one transformed, a cross for one
// destroyed, each on a white disc).

// bandAlpha is the opacity of a band's fill (no source: light enough for
// the curves to stay readable through overlapping bands).
const bandAlpha = 0x38

// bandPlotter draws the bands of a line chart within the y range
// [ylo, yhi] (axis units).
type bandPlotter struct {
	bands      []chartspec.Band
	xlog, ylog bool
	ylo, yhi   float64
}

// Plot fills each band over every run of points where both edges are
// finite, with the edges clamped to the y range (the band's intersection
// with the plot), and strokes the edges dotted.
func (bp *bandPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for _, b := range bp.bands {
		col := seriesColors[mod(b.Index, len(seriesColors))]
		fill := color.NRGBA{col.R, col.G, col.B, bandAlpha}
		edge := draw.LineStyle{Color: col, Width: vg.Points(0.6), Dashes: []vg.Length{vg.Points(1), vg.Points(2)}}
		n := min(len(b.X), len(b.Lo), len(b.Hi))
		var lo, hi []vg.Point
		flush := func() {
			if len(lo) > 1 {
				var path vg.Path
				path.Move(hi[0])
				for _, q := range hi[1:] {
					path.Line(q)
				}
				for k := len(lo) - 1; k >= 0; k-- {
					path.Line(lo[k])
				}
				path.Close()
				c.SetColor(fill)
				c.Fill(path)
				c.StrokeLines(edge, lo)
				c.StrokeLines(edge, hi)
			}
			lo, hi = nil, nil
		}
		for k := range n {
			x, okx := dataValue(b.X[k], bp.xlog)
			yl, okl := dataValue(min(max(b.Lo[k], bp.ylo), bp.yhi), bp.ylog)
			yh, okh := dataValue(min(max(b.Hi[k], bp.ylo), bp.yhi), bp.ylog)
			if !okx || !okl || !okh || !finiteAll(b.Lo[k], b.Hi[k]) {
				flush()
				continue
			}
			lo = append(lo, vg.Point{X: trX(x), Y: trY(yl)})
			hi = append(hi, vg.Point{X: trX(x), Y: trY(yh)})
		}
		flush()
	}
}

// finiteAll reports whether every value is neither NaN nor ±Inf.
func finiteAll(vs ...float64) bool {
	for _, v := range vs {
		if _, ok := dataValue(v, false); !ok {
			return false
		}
	}
	return true
}

// bandThumb is the legend thumbnail of the bands: a grey fill between
// dotted edges.
type bandThumb struct{}

// Thumbnail draws the thumbnail in c.
func (bandThumb) Thumbnail(c *draw.Canvas) {
	r := c.Rectangle
	pad := (r.Max.Y - r.Min.Y) / 5
	box := vg.Rectangle{Min: vg.Point{X: r.Min.X, Y: r.Min.Y + pad}, Max: vg.Point{X: r.Max.X, Y: r.Max.Y - pad}}
	c.SetColor(color.NRGBA{0x55, 0x55, 0x55, bandAlpha})
	c.Fill(box.Path())
	edge := draw.LineStyle{Color: color.Gray{0x55}, Width: vg.Points(0.6), Dashes: []vg.Length{vg.Points(1), vg.Points(2)}}
	c.StrokeLine2(edge, box.Min.X, box.Min.Y, box.Max.X, box.Min.Y)
	c.StrokeLine2(edge, box.Min.X, box.Max.Y, box.Max.X, box.Max.Y)
}

// bandLegend returns the legend entry of the bands, if any.
func bandLegend(c *chartspec.LineChart) []legendItem {
	if len(c.Bands) == 0 {
		return nil
	}
	return []legendItem{{"shaded: r_crit if the unverified α is off " + c.BandFactor, bandThumb{}}}
}

// runGlyphs are the glyph of each run outcome (grew and survived share
// one) and its colour: Okabe–Ito bluish green, orange and vermillion.
func runStyle(o model.RunOutcome) draw.GlyphStyle {
	r := vg.Points(3.5)
	switch o {
	case model.RunGrew, model.RunSurvived:
		return draw.GlyphStyle{Color: seriesColors[2], Radius: r, Shape: draw.PyramidGlyph{}}
	case model.RunTransformed:
		return draw.GlyphStyle{Color: seriesColors[4], Radius: r, Shape: ringDotGlyph{}}
	}
	return draw.GlyphStyle{Color: seriesColors[1], Radius: r, Shape: draw.CrossGlyph{}}
}

// ringDotGlyph is a ring with a dot at its centre.
type ringDotGlyph struct{}

// DrawGlyph draws the glyph at pt.
func (ringDotGlyph) DrawGlyph(c *draw.Canvas, sty draw.GlyphStyle, pt vg.Point) {
	draw.RingGlyph{}.DrawGlyph(c, sty, pt)
	dot := sty
	dot.Radius = sty.Radius / 3
	draw.CircleGlyph{}.DrawGlyph(c, dot, pt)
}

// runPlotter draws simulation runs at their coordinates (axis units).
type runPlotter struct {
	runs       []chartspec.RunMark
	xlog, ylog bool
}

// Plot draws every run inside the plot on a white disc.
func (rp *runPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for _, r := range rp.runs {
		x, okx := dataValue(r.X, rp.xlog)
		y, oky := dataValue(r.Y, rp.ylog)
		if !okx || !oky {
			continue
		}
		at := vg.Point{X: trX(x), Y: trY(y)}
		if !c.Contains(at) {
			continue
		}
		sty := runStyle(r.Outcome)
		c.DrawGlyph(draw.GlyphStyle{Color: color.White, Radius: sty.Radius + vg.Points(1.5), Shape: draw.CircleGlyph{}}, at)
		c.DrawGlyph(sty, at)
	}
}

// glyphThumb is the legend thumbnail of a run glyph.
type glyphThumb draw.GlyphStyle

// Thumbnail draws the glyph at the centre of c.
func (g glyphThumb) Thumbnail(c *draw.Canvas) {
	r := c.Rectangle
	c.DrawGlyph(draw.GlyphStyle(g), vg.Point{X: (r.Min.X + r.Max.X) / 2, Y: (r.Min.Y + r.Max.Y) / 2})
}

// runLegend returns the legend entries of runs: one per glyph present,
// the first naming where the runs come from.
func runLegend(runs []chartspec.RunMark, name string) []legendItem {
	has := map[model.RunOutcome]bool{}
	for _, r := range runs {
		o := r.Outcome
		if o == model.RunSurvived {
			o = model.RunGrew
		}
		has[o] = true
	}
	var items []legendItem
	for _, e := range []struct {
		o    model.RunOutcome
		text string
	}{{model.RunGrew, "grew or survived"}, {model.RunTransformed, "transformed"}, {model.RunDestroyed, "destroyed"}} {
		if !has[e.o] {
			continue
		}
		text := e.text
		if len(items) == 0 {
			text = "run: " + text
			if name != "" {
				text = "simulation run (" + name + "): " + e.text
			}
		}
		items = append(items, legendItem{text, glyphThumb(runStyle(e.o))})
	}
	return items
}

// Zones (chartspec.LineChart.Zones) are stretches of the x axis, e.g.
// where the criteria disagree: a light grey fill across the plot's height
// with a hatched strip along its bottom edge, so that a grey-scale print
// keeps them, drawn under everything else.

// zoneGrey is the fill of zones (no source: light enough for curves and
// bands to read through it).
var zoneGrey = color.NRGBA{0x88, 0x88, 0x88, 0x30}

// zonePlotter draws the zones of a line chart.
type zonePlotter struct {
	zones []chartspec.Zone
	xlog  bool
}

// Plot fills each zone, clipped to the plot, and hatches its foot.
func (zp *zonePlotter) Plot(c draw.Canvas, p *plot.Plot) {
	trX, _ := p.Transforms(&c)
	foot := vg.Points(4)
	hatch := draw.LineStyle{Color: color.Gray{0x55}, Width: vg.Points(0.6)}
	for _, z := range zp.zones {
		lo, okl := dataValue(z.Lo, zp.xlog)
		hi, okh := dataValue(z.Hi, zp.xlog)
		if !okl || !okh {
			continue
		}
		x0, x1 := max(trX(lo), c.Min.X), min(trX(hi), c.Max.X)
		if !(x0 < x1) {
			continue
		}
		r := vg.Rectangle{Min: vg.Point{X: x0, Y: c.Min.Y}, Max: vg.Point{X: x1, Y: c.Max.Y}}
		c.SetColor(zoneGrey)
		c.Fill(r.Path())
		for x := x0; x < x1; x += foot {
			c.StrokeLine2(hatch, x, c.Min.Y, min(x+foot, x1), c.Min.Y+foot)
		}
	}
}

// zoneThumb is the legend thumbnail of the zones: the grey fill with its
// hatched foot.
type zoneThumb struct{}

// Thumbnail draws the thumbnail in c.
func (zoneThumb) Thumbnail(c *draw.Canvas) {
	r := c.Rectangle
	c.SetColor(zoneGrey)
	c.Fill(r.Path())
	hatch := draw.LineStyle{Color: color.Gray{0x55}, Width: vg.Points(0.6)}
	h := (r.Max.Y - r.Min.Y) / 3
	for x := r.Min.X; x < r.Max.X; x += h {
		c.StrokeLine2(hatch, x, r.Min.Y, min(x+h, r.Max.X), r.Min.Y+h)
	}
}

// zoneLegend returns the legend entry of the zones, if any.
func zoneLegend(c *chartspec.LineChart) []legendItem {
	if len(c.Zones) == 0 {
		return nil
	}
	name := c.ZoneName
	if name == "" {
		name = "marked zone"
	}
	return []legendItem{{"shaded: " + name, zoneThumb{}}}
}
