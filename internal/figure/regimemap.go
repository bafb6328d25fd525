package figure

import (
	"fmt"
	"image/color"
	"math"
	"slices"
	"strconv"

	"cloudwind/internal/chartspec"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Shades of the regime map: viridis (van der Walt & Smith 2015, the
// default colour map of matplotlib) at 0, 1/4, 1/2, 3/4 and 1, interpolated
// linearly. Its lightness rises monotonically, so grey-scale prints keep
// the order of the shades.
var viridis = [...]color.RGBA{
	{0x44, 0x01, 0x54, 0xff}, {0x3B, 0x52, 0x8B, 0xff}, {0x21, 0x91, 0x8C, 0xff},
	{0x5E, 0xC9, 0x62, 0xff}, {0xFD, 0xE7, 0x25, 0xff},
}

// Colours of map cells without a valid state and of impossible counts.
var (
	noDataColor   = color.RGBA{0xe0, 0xe0, 0xe0, 0xff}
	badCountColor = color.RGBA{0x99, 0x99, 0x99, 0xff}
)

// shade returns the colour of a map cell in which n of total criteria
// predict survival: noDataColor for n < 0, badCountColor for n > total.
func shade(n, total int) color.RGBA {
	switch {
	case n < 0:
		return noDataColor
	case n > total:
		return badCountColor
	}
	f := 0.0
	if total > 0 {
		f = math.Max(0, math.Min(1, float64(n)/float64(total)))
	}
	x := f * float64(len(viridis)-1)
	i := min(int(x), len(viridis)-2)
	t := x - float64(i)
	a, b := viridis[i], viridis[i+1]
	lerp := func(u, v uint8) uint8 { return uint8(math.Round(float64(u) + t*(float64(v)-float64(u)))) }
	return color.RGBA{lerp(a.R, b.R), lerp(a.G, b.G), lerp(a.B, b.B), 0xff}
}

// legendCounts returns the counts the map legend shows, largest first:
// every count up to 12 criteria, seven evenly spaced ones beyond.
func legendCounts(total int) []int {
	var out []int
	for k := total; k >= 0; k-- {
		if total <= 12 || k == total || int(math.Round(float64(k)*6/float64(total))) != int(math.Round(float64(k+1)*6/float64(total))) {
			out = append(out, k)
		}
	}
	return out
}

// boxThumb fills a legend thumbnail with one colour.
type boxThumb color.RGBA

// Thumbnail fills c.
func (b boxThumb) Thumbnail(c *draw.Canvas) {
	c.SetColor(color.RGBA(b))
	c.Fill(c.Rectangle.Path())
}

// drawRegimeMap draws m on dc: the note and caption at the bottom, the
// legend of shades in a strip at the right, the map in the rest.
func drawRegimeMap(h *richText, dc draw.Canvas, m *chartspec.RegimeMap) error {
	var notes []string
	if m.Note != "" {
		notes = []string{m.Note}
	}
	dc = drawFooter(h, dc, notes, m.Caption)
	var items []legendItem
	for _, n := range legendCounts(m.Total) {
		items = append(items, legendItem{fmt.Sprintf("%d of %d", n, m.Total), boxThumb(shade(n, m.Total))})
	}
	if slices.IndexFunc(m.Counts, func(n int) bool { return n < 0 }) >= 0 {
		items = append(items, legendItem{"no data", boxThumb(noDataColor)})
	}
	if slices.Contains(m.Class, chartspec.Depends) {
		items = append(items, legendItem{"hatched: uncertain verdict", hatchThumb{}})
	}
	if transformedOnly(m) {
		items = append(items, legendItem{"t: transformed, none grows", boxThumb(shade(0, m.Total))})
	}
	items = append(items, runLegend(m.Runs, "")...) // the note names the runs' source
	plotArea := drawLegendStrip(h, dc, items, "Criteria predicting survival")
	p := newPlot(h, m.Title, 11)
	xlo, xhi := axisRange(m.X, nil)
	ylo, yhi := axisRange(m.Y, nil)
	p.Add(&cellPlotter{h: h, m: m, xlo: xlo, xhi: xhi, ylo: ylo, yhi: yhi})
	if m.Mark != nil {
		p.Add(&markerPlotter{h: h, markers: []chartspec.Marker{*m.Mark}, xlog: m.X.Log, ylog: m.Y.Log})
	}
	if len(m.Runs) > 0 {
		p.Add(&runPlotter{runs: m.Runs, xlog: m.X.Log, ylog: m.Y.Log})
	}
	setupAxis(h, &p.X, m.X, xlo, xhi)
	setupAxis(h, &p.Y, m.Y, ylo, yhi)
	p.Draw(plotArea)
	return nil
}

// cellPlotter draws the cells of a regime map over [xlo, xhi] × [ylo, yhi]
// (axis units), each with its count when the cells are large enough.
type cellPlotter struct {
	h                  *richText
	m                  *chartspec.RegimeMap
	xlo, xhi, ylo, yhi float64
}

// Plot fills the cells.
func (cp *cellPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	m := cp.m
	dx, dy := (cp.xhi-cp.xlo)/float64(m.NX), (cp.yhi-cp.ylo)/float64(m.NY)
	at := func(v float64, log bool) float64 { d, _ := dataValue(v, log); return d }
	for j := range m.NY {
		y0, y1 := trY(at(cp.ylo+float64(j)*dy, m.Y.Log)), trY(at(cp.ylo+float64(j+1)*dy, m.Y.Log))
		for i := range m.NX {
			x0, x1 := trX(at(cp.xlo+float64(i)*dx, m.X.Log)), trX(at(cp.xlo+float64(i+1)*dx, m.X.Log))
			k := j*m.NX + i
			n := m.Counts[k]
			cell := vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x1, Y: y1}}
			c.SetColor(shade(n, m.Total))
			c.Fill(cell.Path())
			ink, label := color.Color(color.White), strconv.Itoa(n)
			if 2*n > m.Total {
				ink = color.Black
			}
			if n >= 0 && k < len(m.Class) && m.Class[k] == chartspec.Depends {
				hatch(c, cell, ink)
			}
			if n < 0 || x1-x0 < vg.Points(9) || y1-y0 < vg.Points(8) {
				continue
			}
			switch {
			case n > m.Total:
				label = "?"
			case n == 0 && k < len(m.Transformed) && m.Transformed[k] > 0:
				label = "t"
			}
			sty := cp.h.textStyle(7, ink)
			sty.XAlign, sty.YAlign = draw.XCenter, draw.YCenter
			c.FillText(sty, vg.Point{X: (x0 + x1) / 2, Y: (y0 + y1) / 2}, label)
		}
	}
}

// drawLegendStrip draws items in a strip at the right of dc, under a
// heading, each entry shortened with "…" to fit a strip at most 45% of
// dc's width, and returns the rest of dc. With no items it returns dc.
func drawLegendStrip(h *richText, dc draw.Canvas, items []legendItem, heading string) draw.Canvas {
	if len(items) == 0 {
		return dc
	}
	l := plot.NewLegend()
	l.TextStyle = h.textStyle(9, color.Black)
	l.Left, l.Top = true, true
	l.ThumbnailWidth = vg.Points(28)
	l.Padding = vg.Points(2)
	pad := vg.Points(8)
	maxW := 0.45*(dc.Max.X-dc.Min.X) - 2*pad
	heading = fitText(l.TextStyle, heading, maxW)
	for _, it := range items {
		l.Add(fitText(l.TextStyle, it.text, maxW-l.ThumbnailWidth-l.TextStyle.Width(" ")), it.thumb)
	}
	r := l.Rectangle(dc)
	w := max(r.Max.X-r.Min.X, l.TextStyle.Width(heading)) + 2*pad
	strip := draw.Crop(dc, dc.Max.X-dc.Min.X-w+pad, -pad, pad, -vg.Points(24))
	strip.FillText(l.TextStyle, vg.Point{X: strip.Min.X, Y: strip.Max.Y - l.TextStyle.Height(heading)}, heading)
	strip.Max.Y -= l.TextStyle.Height(heading) + vg.Points(4)
	l.Draw(strip)
	return draw.Crop(dc, 0, -w-vg.Points(rightMargin), 0, 0)
}

// hatchStep is the spacing of the hatching of cells that depend on
// constants or conventions, in points (no source: visible at slide size
// without hiding the count).
const hatchStep = 3

// hatch draws diagonal lines across cell r in colour ink: the mark of a
// cell whose verdicts depend on constants or conventions. The lines are
// those of x + y = k hatchStep on the whole canvas, clipped to the cell,
// so that they run on unbroken across neighbouring hatched cells.
func hatch(c draw.Canvas, r vg.Rectangle, ink color.Color) {
	sty := draw.LineStyle{Color: ink, Width: vg.Points(0.4)}
	step := vg.Points(hatchStep)
	lo, hi := r.Min.X+r.Min.Y, r.Max.X+r.Max.Y
	for d := vg.Length(math.Ceil(float64(lo/step))) * step; d <= hi; d += step {
		xa, xb := max(r.Min.X, d-r.Max.Y), min(r.Max.X, d-r.Min.Y)
		if xa < xb {
			c.StrokeLine2(sty, xa, d-xa, xb, d-xb)
		}
	}
}

// hatchThumb is the legend thumbnail of hatched cells.
type hatchThumb struct{}

// Thumbnail hatches c on a mid shade.
func (hatchThumb) Thumbnail(c *draw.Canvas) {
	c.SetColor(shade(1, 2))
	c.Fill(c.Rectangle.Path())
	hatch(*c, c.Rectangle, color.White)
}

// transformedOnly reports whether a cell of m has no survivor but a
// transformed verdict (labelled "t").
func transformedOnly(m *chartspec.RegimeMap) bool {
	for k, t := range m.Transformed {
		if t > 0 && k < len(m.Counts) && m.Counts[k] == 0 {
			return true
		}
	}
	return false
}
