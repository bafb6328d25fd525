package figure

import (
	"image/color"
	"strings"

	"cloudwind/internal/chartspec"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// drawLineCharts draws charts on dc as panels one above the other: the
// notes and the caption at the bottom, then the legend of the first
// chart's series, then the panels in the space left.
func drawLineCharts(h *richText, dc draw.Canvas, charts []*chartspec.LineChart) error {
	var foot []string
	for _, c := range charts {
		if c.Note != "" && (len(foot) == 0 || foot[len(foot)-1] != c.Note) {
			foot = append(foot, c.Note)
		}
	}
	dc = drawFooter(h, dc, foot, charts[0].Caption)
	dc = drawLegendRows(h, dc, chartLegend(charts[0]))
	n := vg.Length(len(charts))
	height := (dc.Max.Y - dc.Min.Y) / n
	for i, c := range charts {
		top := dc.Max.Y - vg.Length(i)*height
		panel := draw.Canvas{Canvas: dc.Canvas, Rectangle: vg.Rectangle{Min: vg.Point{X: dc.Min.X, Y: top - height}, Max: vg.Point{X: dc.Max.X, Y: top}}}
		if i > 0 {
			panel = draw.Crop(panel, 0, 0, 0, -vg.Points(panelGap))
		}
		titleSize := 11.0
		if len(charts) > 1 {
			titleSize = 10
		}
		drawLinePlot(h, panel, c, titleSize)
	}
	return nil
}

// chartLegend returns the legend entries of c: its series, its bands,
// its zones and its runs.
func chartLegend(c *chartspec.LineChart) []legendItem {
	var legend []legendItem
	for _, s := range c.Series {
		legend = append(legend, legendItem{s.Name, &plotter.Line{LineStyle: lineStyle(s.Index, s.Dashed)}})
	}
	legend = append(legend, bandLegend(c)...)
	legend = append(legend, zoneLegend(c)...)
	return append(legend, runLegend(c.Runs, c.RunsName)...)
}

// legendExtra returns the height a figure of charts needs beyond its
// standard size for the rows of its legend beyond legendFreeRows.
func legendExtra(h *richText, charts []*chartspec.LineChart) vg.Length {
	if len(charts) == 0 || charts[0] == nil {
		return 0
	}
	avail := figureWidth - 2*vg.Points(figureMargin) - 2*vg.Points(legendPad)
	rows, lineH := packLegendRows(h.textStyle(9, color.Black), avail, chartLegend(charts[0]))
	return vg.Length(max(0, len(rows)-legendFreeRows)) * lineH
}

// Margins in points (no source: chosen to read at slide size): the space
// between panels, and at the right of a plot, where half of the last x
// tick label reaches beyond the axis.
const (
	panelGap    = 10
	rightMargin = 12
)

// drawLinePlot draws the plot of c (title, axes, series, markers) on dc.
func drawLinePlot(h *richText, dc draw.Canvas, c *chartspec.LineChart, titleSize float64) {
	dc = draw.Crop(dc, 0, -vg.Points(rightMargin), 0, 0)
	var xs, ys []float64
	var lines []plot.Plotter
	for _, s := range c.Series {
		sty := lineStyle(s.Index, s.Dashed)
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
	p := newPlot(h, c.Title, titleSize)
	xlo, xhi := axisRange(c.X, xs)
	ylo, yhi := axisRange(c.Y, ys)
	if len(c.Zones) > 0 {
		p.Add(&zonePlotter{zones: c.Zones, xlog: c.X.Log})
	}
	if len(c.Bands) > 0 {
		p.Add(&bandPlotter{bands: c.Bands, xlog: c.X.Log, ylog: c.Y.Log, ylo: ylo, yhi: yhi})
	}
	p.Add(lines...)
	p.Add(&markerPlotter{h: h, markers: c.Markers, xlog: c.X.Log, ylog: c.Y.Log})
	if len(c.Runs) > 0 {
		p.Add(&runPlotter{runs: c.Runs, xlog: c.X.Log, ylog: c.Y.Log})
	}
	setupAxis(h, &p.X, c.X, xlo, xhi)
	setupAxis(h, &p.Y, c.Y, ylo, yhi)
	p.Draw(dc)
}

// newPlot returns a plot whose every text is drawn by h, titled title.
func newPlot(h *richText, title string, size float64) *plot.Plot {
	p := plot.New()
	p.TextHandler = h
	p.Title.Text = title
	h.setFont(&p.Title.TextStyle, size)
	p.Title.Padding = vg.Points(6)
	h.setFont(&p.Legend.TextStyle, 9)
	return p
}

// A markerPlotter draws Markers as dashed lines or rings with labels.
type markerPlotter struct {
	h          *richText
	markers    []chartspec.Marker
	xlog, ylog bool
}

// Plot draws the markers. Labels of vertical lines stack downwards from
// the top of the plot, so that labels of nearby lines do not overprint;
// every label is kept inside the plot area, on a light backing.
func (mp *markerPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	row := 0
	for _, m := range mp.markers {
		col := color.RGBA{0x55, 0x55, 0x55, 0xff} // grey; warnings in vermillion
		if m.Warn {
			col = seriesColors[1]
		}
		sty := draw.LineStyle{Color: col, Width: vg.Points(1), Dashes: []vg.Length{vg.Points(4), vg.Points(3)}}
		lab := mp.h.textStyle(8, col)
		pad := vg.Points(3)
		x, okx := dataValue(m.X, mp.xlog)
		y, oky := dataValue(m.Y, mp.ylog)
		var at vg.Point
		switch {
		case m.Kind == chartspec.VLine && okx:
			if !c.ContainsX(trX(x)) {
				continue
			}
			c.StrokeLine2(sty, trX(x), c.Min.Y, trX(x), c.Max.Y)
			row++
			at = vg.Point{X: trX(x) + pad, Y: c.Max.Y - pad - vg.Length(row)*lab.Height("0")}
		case m.Kind == chartspec.HLine && oky:
			if !c.ContainsY(trY(y)) {
				continue
			}
			c.StrokeLine2(sty, c.Min.X, trY(y), c.Max.X, trY(y))
			at = vg.Point{X: c.Min.X + pad, Y: trY(y) + pad}
		case m.Kind == chartspec.Point && okx && oky:
			at = vg.Point{X: trX(x), Y: trY(y)}
			if !c.Contains(at) {
				continue
			}
			c.DrawGlyph(draw.GlyphStyle{Color: color.White, Radius: vg.Points(5), Shape: draw.CircleGlyph{}}, at)
			c.DrawGlyph(draw.GlyphStyle{Color: color.Black, Radius: vg.Points(5), Shape: draw.RingGlyph{}}, at)
			c.DrawGlyph(draw.GlyphStyle{Color: color.Black, Radius: vg.Points(2.5), Shape: draw.CrossGlyph{}}, at)
			at.X, at.Y = at.X+pad, at.Y+vg.Points(6)
		default:
			continue
		}
		if m.Label == "" {
			continue
		}
		txt := m.Label
		if m.Warn {
			txt = "! " + txt // the warning does not rest on colour
		}
		placeLabel(c, lab, at, txt, pad)
	}
}

// placeLabel writes txt with its lower left corner at at, moved to the
// left of at when it would leave c on the right, and kept inside c.
func placeLabel(c draw.Canvas, lab draw.TextStyle, at vg.Point, txt string, pad vg.Length) {
	w, hgt := lab.Width(txt), lab.Height(txt)
	if at.X+w > c.Max.X-pad {
		at.X -= w + 2*pad
	}
	at.X = max(c.Min.X+pad, min(at.X, c.Max.X-pad-w))
	at.Y = max(c.Min.Y+pad, min(at.Y, c.Max.Y-pad-hgt))
	lab.XAlign, lab.YAlign = draw.XLeft, draw.YBottom
	box := lab.Rectangle(txt).Add(at)
	c.SetColor(color.NRGBA{0xff, 0xff, 0xff, 0xcc}) // a light backing keeps the label readable over curves and cells
	c.Fill(box.Path())
	c.FillText(lab, at, txt)
}

// A legendItem is one entry of a legend.
type legendItem struct {
	text  string
	thumb plot.Thumbnailer
}

// Legend geometry, in points (no source: chosen to read at slide size).
const (
	legendThumb = 22 // thumbnail width
	legendGap   = 4  // between a thumbnail and its text
	legendSep   = 14 // between entries on a row
	legendPad   = 6  // around the legend
)

// drawLegendRows draws items in rows under the plot, packed left to right
// in the width of dc, each entry shortened with "…" if it alone is wider;
// it returns the rest of dc above the legend (dc itself without items).
func drawLegendRows(h *richText, dc draw.Canvas, items []legendItem) draw.Canvas {
	if len(items) == 0 {
		return dc
	}
	sty := h.textStyle(9, color.Black)
	pad := vg.Points(legendPad)
	rows, lineH := packLegendRows(sty, dc.Max.X-dc.Min.X-2*pad, items)
	top := dc.Min.Y + pad + vg.Length(len(rows))*lineH
	for r, row := range rows {
		base := top - vg.Length(r+1)*lineH
		for _, p := range row {
			x0 := dc.Min.X + pad + p.x
			thumb := draw.Canvas{Canvas: dc.Canvas, Rectangle: vg.Rectangle{
				Min: vg.Point{X: x0, Y: base}, Max: vg.Point{X: x0 + vg.Points(legendThumb), Y: base + sty.Height("Mg")}}}
			p.item.thumb.Thumbnail(&thumb)
			t := sty
			t.XAlign, t.YAlign = draw.XLeft, draw.YBottom
			dc.FillText(t, vg.Point{X: x0 + vg.Points(legendThumb+legendGap), Y: base + sty.FontExtents().Descent}, p.text)
		}
	}
	return draw.Crop(dc, 0, 0, top+pad-dc.Min.Y, 0)
}

// A placedLegend is a legend entry placed on its row: its text as shown
// and its offset from the row's start.
type placedLegend struct {
	item legendItem
	text string
	x    vg.Length
}

// packLegendRows packs items into rows avail wide, in order, each entry
// shortened with "…" if it alone is wider; it returns the rows and the
// height of one.
func packLegendRows(sty draw.TextStyle, avail vg.Length, items []legendItem) ([][]placedLegend, vg.Length) {
	var rows [][]placedLegend
	var x vg.Length
	for _, it := range items {
		txt := fitText(sty, it.text, avail-vg.Points(legendThumb+legendGap))
		w := vg.Points(legendThumb+legendGap) + sty.Width(txt)
		if len(rows) == 0 || x+vg.Points(legendSep)+w > avail {
			rows = append(rows, nil)
			x = 0
		} else {
			x += vg.Points(legendSep)
		}
		rows[len(rows)-1] = append(rows[len(rows)-1], placedLegend{it, txt, x})
		x += w
	}
	return rows, sty.Height("Mg") * 1.3
}

// fitText returns txt, or txt shortened with "…" to at most w wide.
func fitText(sty draw.TextStyle, txt string, w vg.Length) string {
	if sty.Width(txt) <= w {
		return txt
	}
	rs := []rune(txt)
	for len(rs) > 0 && sty.Width(string(rs)+"…") > w {
		rs = rs[:len(rs)-1]
	}
	return string(rs) + "…"
}

// wrapText splits txt at spaces into at most n lines no wider than w,
// the last shortened with "…" when the text does not fit.
func wrapText(sty draw.TextStyle, txt string, w vg.Length, n int) []string {
	var lines []string
	rest := txt
	for len(lines) < n-1 && sty.Width(rest) > w {
		words := strings.Fields(rest)
		k := 1
		for k < len(words) && sty.Width(strings.Join(words[:k+1], " ")) <= w {
			k++
		}
		lines = append(lines, fitText(sty, strings.Join(words[:k], " "), w))
		rest = strings.Join(words[k:], " ")
	}
	if rest != "" {
		lines = append(lines, fitText(sty, rest, w))
	}
	return lines
}

// drawFooter writes the notes and then the caption at the bottom of dc,
// each note wrapped to at most three lines and the caption to two, and
// returns the rest of dc above them.
func drawFooter(h *richText, dc draw.Canvas, notes []string, caption string) draw.Canvas {
	type line struct {
		text string
		sty  draw.TextStyle
	}
	pad := vg.Points(4)
	w := dc.Max.X - dc.Min.X - 2*pad
	var lines []line
	for _, n := range notes {
		sty := h.textStyle(8, color.Black)
		for _, l := range wrapText(sty, n, w, 3) {
			lines = append(lines, line{l, sty})
		}
	}
	if caption != "" {
		sty := h.textStyle(7.5, color.RGBA{0x44, 0x44, 0x44, 0xff})
		for _, l := range wrapText(sty, caption, w, 2) {
			lines = append(lines, line{l, sty})
		}
	}
	if len(lines) == 0 {
		return dc
	}
	y := dc.Min.Y + pad
	for i := len(lines) - 1; i >= 0; i-- {
		l := lines[i]
		dc.FillText(l.sty, vg.Point{X: dc.Min.X + pad, Y: y + l.sty.FontExtents().Descent}, l.text)
		y += l.sty.Height("Mg") * 1.25
	}
	return draw.Crop(dc, 0, 0, y+pad-dc.Min.Y, 0)
}
