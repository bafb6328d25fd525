package figure

import (
	"image/color"

	"cloudwind/internal/chartspec"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// drawLineChart draws c on dc.
func drawLineChart(dc draw.Canvas, c *chartspec.LineChart) error {
	dc = drawNote(dc, c.Note)
	var legend []legendItem
	var xs, ys []float64
	var lines []plot.Plotter
	for _, s := range c.Series {
		sty := lineStyle(s.Index, s.Dashed)
		legend = append(legend, legendItem{asciiText(s.Name), &plotter.Line{LineStyle: sty}})
		var cur plotter.XYs // data values: 10^x on log axes
		flush := func() {
			if len(cur) > 1 {
				lines = append(lines, &plotter.Line{XYs: cur, LineStyle: sty})
			}
			cur = nil
		}
		for i := range min(len(s.X), len(s.Y)) {
			x, okx := dataValue(s.X[i], c.X.Log)
			y, oky := dataValue(s.Y[i], c.Y.Log)
			if !okx || !oky {
				flush()
				continue
			}
			xs, ys = append(xs, s.X[i]), append(ys, s.Y[i])
			cur = append(cur, plotter.XY{X: x, Y: y})
		}
		flush()
	}
	p := newPlot(c.Title)
	p.Add(lines...)
	p.Add(&markerPlotter{markers: c.Markers, xlog: c.X.Log, ylog: c.Y.Log})
	xlo, xhi := axisRange(c.X, xs)
	ylo, yhi := axisRange(c.Y, ys)
	setupAxis(&p.X, c.X, xlo, xhi)
	setupAxis(&p.Y, c.Y, ylo, yhi)
	p.Draw(drawLegend(dc, legend, ""))
	return nil
}

// newPlot returns a plot with title in sansFont.
func newPlot(title string) *plot.Plot {
	p := plot.New()
	p.Title.Text = asciiText(title)
	p.Title.TextStyle.Font = sansFont(11)
	p.Title.Padding = vg.Points(6)
	return p
}

// A markerPlotter draws Markers as dashed lines or rings with labels.
type markerPlotter struct {
	markers    []chartspec.Marker
	xlog, ylog bool
}

// Plot draws the markers; each label sits one line lower than the last,
// so that labels of nearby markers do not overprint.
func (mp *markerPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for i, m := range mp.markers {
		col := color.RGBA{0x55, 0x55, 0x55, 0xff} // grey; warnings in vermillion
		if m.Warn {
			col = seriesColors[1]
		}
		sty := draw.LineStyle{Color: col, Width: vg.Points(1), Dashes: []vg.Length{vg.Points(4), vg.Points(3)}}
		lab := textStyle(8, col)
		pad := vg.Points(3)
		row := c.Max.Y - pad - vg.Length(i+1)*lab.Height("0")
		x, okx := dataValue(m.X, mp.xlog)
		y, oky := dataValue(m.Y, mp.ylog)
		var at vg.Point
		switch {
		case m.Kind == chartspec.VLine && okx:
			at = vg.Point{X: trX(x), Y: row}
			if !c.ContainsX(at.X) {
				continue
			}
			c.StrokeLine2(sty, at.X, c.Min.Y, at.X, c.Max.Y)
		case m.Kind == chartspec.HLine && oky:
			at = vg.Point{X: c.Min.X + pad, Y: trY(y) + pad}
			if !c.ContainsY(trY(y)) {
				continue
			}
			c.StrokeLine2(sty, c.Min.X, trY(y), c.Max.X, trY(y))
		case m.Kind == chartspec.Point && okx && oky:
			at = vg.Point{X: trX(x), Y: trY(y)}
			if !c.Contains(at) {
				continue
			}
			c.DrawGlyph(draw.GlyphStyle{Color: color.White, Radius: vg.Points(5), Shape: draw.CircleGlyph{}}, at)
			c.DrawGlyph(draw.GlyphStyle{Color: color.Black, Radius: vg.Points(5), Shape: draw.RingGlyph{}}, at)
			c.DrawGlyph(draw.GlyphStyle{Color: color.Black, Radius: vg.Points(2.5), Shape: draw.CrossGlyph{}}, at)
			at.Y += vg.Points(6)
		default:
			continue
		}
		if m.Label == "" {
			continue
		}
		lab.XAlign = draw.XLeft
		at.X += pad
		if at.X > (c.Min.X+c.Max.X)/2 {
			lab.XAlign, at.X = draw.XRight, at.X-2*pad
		}
		txt := asciiText(m.Label)
		box := lab.Rectangle(txt).Add(at)
		c.SetColor(color.NRGBA{0xff, 0xff, 0xff, 0xcc}) // a light backing keeps the label readable on map cells
		c.Fill(box.Path())
		c.FillText(lab, at, txt)
	}
}

// A legendItem is one line of a legend.
type legendItem struct {
	text  string
	thumb plot.Thumbnailer
}

// drawLegend draws items in a strip at the right of dc, under an optional
// heading, and returns the rest of dc. With no items it returns dc.
func drawLegend(dc draw.Canvas, items []legendItem, heading string) draw.Canvas {
	if len(items) == 0 {
		return dc
	}
	l := plot.NewLegend()
	l.TextStyle = textStyle(9, color.Black)
	l.Left, l.Top = true, true
	l.ThumbnailWidth = vg.Points(28)
	l.Padding = vg.Points(2)
	for _, it := range items {
		l.Add(it.text, it.thumb)
	}
	r := l.Rectangle(dc)
	pad := vg.Points(8)
	w := max(r.Max.X-r.Min.X, l.TextStyle.Width(heading)) + 2*pad
	w = min(w, 0.45*(dc.Max.X-dc.Min.X))
	strip := draw.Crop(dc, dc.Max.X-dc.Min.X-w+pad, -pad, pad, -vg.Points(24))
	if heading != "" {
		strip.FillText(l.TextStyle, vg.Point{X: strip.Min.X, Y: strip.Max.Y - l.TextStyle.Height(heading)}, heading)
		strip.Max.Y -= l.TextStyle.Height(heading) + vg.Points(4)
	}
	l.Draw(strip)
	return draw.Crop(dc, 0, -w, 0, 0)
}

// drawNote writes note in one line at the bottom of dc, shortened with
// "..." to fit, and returns the rest of dc.
func drawNote(dc draw.Canvas, note string) draw.Canvas {
	note = asciiText(note)
	if note == "" {
		return dc
	}
	sty := textStyle(8, color.Black)
	pad := vg.Points(4)
	maxW := dc.Max.X - dc.Min.X - 2*pad
	if sty.Width(note) > maxW {
		for len(note) > 0 && sty.Width(note+"...") > maxW {
			note = note[:len(note)-1] // ASCII after asciiText: bytes are runes
		}
		note += "..."
	}
	h := sty.Height(note) + 2*pad
	dc.FillText(sty, vg.Point{X: dc.Min.X + pad, Y: dc.Min.Y + pad + sty.FontExtents().Descent}, note)
	return draw.Crop(dc, 0, 0, h, 0)
}
