package tui

import (
	"errors"
	"fmt"
	"image/color"
	"io"
	"math"
	"path/filepath"
	"slices"
	"strconv"
	"strings"

	"cloudwind/internal/atomicfile"
	"cloudwind/internal/quantity"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

// Exported figures are 6 × 4 in, a common size for one figure on a slide
// or a page, and PNGs have 300 dpi, the usual print resolution (common
// practice, no source).
const (
	exportWidth  = 6 * vg.Inch
	exportHeight = 4 * vg.Inch
	exportDPI    = 300
	// figLogLimit bounds |log10 v| on log axes: 10^±308 is the float64 range,
	// so points beyond ±300 decades are dropped rather than sent to
	// plot.LogScale, which panics on 0 and misbehaves on +Inf.
	figLogLimit = 300
)

// ExportLineChart writes c to path as an SVG or a PNG (300 dpi, 6 × 4 in),
// chosen by the extension .svg or .png (any case); other extensions are an
// error. Log axes get decade ticks labelled 1e-2, 1e0, …; text is spelt in
// ASCII (χ → chi, cm⁻³ → cm^-3, M☉ → Msun), since the embedded fonts lack
// superscripts. Series are told apart by colour and dash pattern, markers
// are dashed lines or rings with labels, and the note goes under the chart.
// The file is written atomically (WriteFileAtomic); every error names path.
func ExportLineChart(c *LineChart, path string) error {
	if c == nil {
		return fmt.Errorf("export %s: no chart to export", quantity.Sanitize(path))
	}
	return exportFigure(path, func(dc draw.Canvas) error { return figLineChart(dc, c) })
}

// ExportRegimeMap writes m to path like ExportLineChart: a map of cells
// shaded by how many criteria predict survival, with the count written in
// each cell when the cells are large enough, a legend of the shades, and
// m.Mark drawn on top. Cell (i, j) spans 1/NX of m.X's range from m.X.Min
// and 1/NY of m.Y's range from m.Y.Min, in axis units. Cells with a
// negative count (no valid state) are light grey and labelled "no data" in
// the legend; counts above m.Total, which should not occur, are mid-grey
// with "?". It returns an error when len(m.Counts) is not NX×NY.
func ExportRegimeMap(m *RegimeMap, path string) error {
	if m == nil {
		return fmt.Errorf("export %s: no regime map to export", quantity.Sanitize(path))
	}
	if m.NX < 1 || m.NY < 1 || len(m.Counts) != m.NX*m.NY {
		return fmt.Errorf("export %s: regime map has %d counts for %d×%d cells", quantity.Sanitize(path), len(m.Counts), m.NX, m.NY)
	}
	return exportFigure(path, func(dc draw.Canvas) error { return figRegimeMap(dc, m) })
}

// ErrExportFormat is wrapped by the error for an unsupported file extension.
var ErrExportFormat = errors.New("unsupported figure format")

// exportFigure renders a figure for path's format, then writes it atomically.
func exportFigure(path string, render func(draw.Canvas) error) error {
	name := quantity.Sanitize(path)
	var canvas vg.CanvasWriterTo
	switch ext := strings.ToLower(filepath.Ext(path)); ext {
	case ".svg":
		canvas = vgsvg.New(exportWidth, exportHeight)
	case ".png":
		canvas = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(exportWidth, exportHeight), vgimg.UseDPI(exportDPI))}
	default:
		return fmt.Errorf("export %s: %w %q (want .svg or .png)", name, ErrExportFormat, quantity.Sanitize(ext))
	}
	if err := figRender(render, draw.New(canvas)); err != nil {
		return fmt.Errorf("export %s: %w", name, err)
	}
	return atomicfile.Write(path, func(w io.Writer) error {
		if _, err := canvas.WriteTo(w); err != nil {
			return fmt.Errorf("write %s: %w", name, err)
		}
		return nil
	})
}

// figRender runs render and turns a panic of the plotting library into
// an error. The inputs are checked before they reach the library (finite
// values, positive values on log axes), so this is a last line of defence.
func figRender(render func(draw.Canvas) error, dc draw.Canvas) (err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("plotting failed: %v", r)
		}
	}()
	dc.SetColor(color.White)
	dc.Fill(dc.Rectangle.Path())
	return render(dc)
}

// Colours of the series: the Okabe–Ito palette (Okabe & Ito 2008, "Color
// Universal Design"), distinguishable with the common colour-vision
// deficiencies, without its yellow, which vanishes on white.
// In order: blue, vermillion, bluish green, reddish purple, orange, sky
// blue, black.
var figColors = [...]color.RGBA{{0x00, 0x72, 0xB2, 0xff}, {0xD5, 0x5E, 0x00, 0xff}, {0x00, 0x9E, 0x73, 0xff},
	{0xCC, 0x79, 0xA7, 0xff}, {0xE6, 0x9F, 0x00, 0xff}, {0x56, 0xB4, 0xE9, 0xff}, {0x00, 0x00, 0x00, 0xff}}

// figDashes are dash patterns in points, one per series, so that curves
// stay apart in grey-scale prints; the count is coprime with the colours'.
var figDashes = [...][]vg.Length{nil, {6, 3}, {2, 2}, {8, 3, 2, 3}, {4, 2, 1, 2, 1, 2}, {1, 3}, {10, 3, 2, 3, 2, 3}, {12, 4}}

// figLineStyle returns the line style of series index i; dashed (a pinned
// comparison curve) is thinner and lighter with the same pattern.
func figLineStyle(i int, dashed bool) draw.LineStyle {
	c := figColors[figMod(i, len(figColors))]
	sty := draw.LineStyle{Color: c, Width: vg.Points(1.6), Dashes: figDashes[figMod(i, len(figDashes))]}
	if dashed {
		c.R, c.G, c.B = c.R/2+0x7f, c.G/2+0x7f, c.B/2+0x7f
		sty.Color, sty.Width = c, vg.Points(1)
	}
	return sty
}

// figMod returns i mod n in 0…n-1 for any sign of i.
func figMod(i, n int) int { return (i%n + n) % n }

// figFont returns Liberation Sans, embedded in gonum/plot, at size points:
// sans-serif reads better on slides than the default serif.
func figFont(size float64) font.Font {
	return font.From(font.Font{Typeface: "Liberation", Variant: "Sans"}, vg.Points(size))
}

// figTextStyle returns a plain-text style of figFont.
func figTextStyle(size float64, c color.Color) text.Style {
	return text.Style{Color: c, Font: figFont(size), Handler: plot.DefaultTextHandler}
}

// figValue converts an axis coordinate (log10 on log axes) to the data
// value gonum/plot draws, and reports whether it can be drawn.
func figValue(v float64, log bool) (float64, bool) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, false
	}
	if !log {
		return v, true
	}
	if math.Abs(v) > figLogLimit {
		return 0, false
	}
	return math.Pow(10, v), true
}

// figRange returns the range of a in axis units: its Min and Max when they
// are usable, else the range of data, widened when it is a single value.
func figRange(a Axis, data []float64) (lo, hi float64) {
	_, okLo := figValue(a.Min, a.Log)
	_, okHi := figValue(a.Max, a.Log)
	if okLo && okHi && a.Min < a.Max {
		return a.Min, a.Max
	}
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range data {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	switch {
	case lo > hi:
		return 0, 1
	case lo == hi:
		return lo - 0.5, hi + 0.5
	}
	return lo, hi
}

// figSetupAxis styles a plot axis for a, with range [lo, hi] in axis units.
// Call it after adding the data: plot.Add widens the range.
func figSetupAxis(pa *plot.Axis, a Axis, lo, hi float64) {
	pa.Label.Text = figText(a.Label)
	pa.Label.TextStyle.Font = figFont(10)
	pa.Tick.Label.Font = figFont(9)
	if a.Log {
		pa.Scale = plot.LogScale{}
		pa.Tick.Marker = plot.TickerFunc(figLogTicks)
	}
	pa.Min, _ = figValue(lo, a.Log)
	pa.Max, _ = figValue(hi, a.Log)
}

// figLogTicks returns ticks for a log axis from vmin to vmax (> 0):
// decades labelled "1e-2" (about eight labels at most; the rest minor),
// and minor ticks at 2…9 × 10^k when the range spans six decades or fewer.
// When fewer than two decades fall in the range, the minor ticks at 2 and 5
// × 10^k are labelled too ("2e-1"), and all of them within a factor of 3.
func figLogTicks(vmin, vmax float64) []plot.Tick {
	if !(vmin > 0 && vmax > vmin) || math.IsInf(vmax, 0) {
		return nil
	}
	lo, hi := int(math.Floor(math.Log10(vmin))), int(math.Ceil(math.Log10(vmax)))
	step := max(1, (hi-lo+7)/8)
	var ticks, minor []plot.Tick
	labelled := 0
	for d := lo; d <= hi; d++ {
		v := math.Pow(10, float64(d))
		t := plot.Tick{Value: v}
		if figMod(d, step) == 0 {
			t.Label = "1e" + strconv.Itoa(d)
			if v >= vmin && v <= vmax {
				labelled++
			}
		}
		ticks = append(ticks, t)
		for m := 2; m <= 9 && hi-lo <= 6 && d < hi; m++ {
			t := plot.Tick{Value: float64(m) * v}
			if m == 2 || m == 5 || vmax < 3*vmin {
				t.Label = fmt.Sprintf("%de%d", m, d)
			}
			minor = append(minor, t)
		}
	}
	if labelled >= 2 {
		for i := range minor {
			minor[i].Label = ""
		}
	}
	return append(ticks, minor...)
}

// figLineChart draws c on dc.
func figLineChart(dc draw.Canvas, c *LineChart) error {
	dc = figNote(dc, c.Note)
	var legend []figLegendItem
	var xs, ys []float64
	var lines []plot.Plotter
	for _, s := range c.Series {
		sty := figLineStyle(s.Index, s.Dashed)
		legend = append(legend, figLegendItem{figText(s.Name), &plotter.Line{LineStyle: sty}})
		var cur plotter.XYs // data values: 10^x on log axes
		flush := func() {
			if len(cur) > 1 {
				lines = append(lines, &plotter.Line{XYs: cur, LineStyle: sty})
			}
			cur = nil
		}
		for i := range min(len(s.X), len(s.Y)) {
			x, okx := figValue(s.X[i], c.X.Log)
			y, oky := figValue(s.Y[i], c.Y.Log)
			if !okx || !oky {
				flush()
				continue
			}
			xs, ys = append(xs, s.X[i]), append(ys, s.Y[i])
			cur = append(cur, plotter.XY{X: x, Y: y})
		}
		flush()
	}
	p := figNewPlot(c.Title)
	p.Add(lines...)
	p.Add(&figMarkers{markers: c.Markers, xlog: c.X.Log, ylog: c.Y.Log})
	xlo, xhi := figRange(c.X, xs)
	ylo, yhi := figRange(c.Y, ys)
	figSetupAxis(&p.X, c.X, xlo, xhi)
	figSetupAxis(&p.Y, c.Y, ylo, yhi)
	p.Draw(figLegend(dc, legend, ""))
	return nil
}

// figNewPlot returns a plot with title in figFont.
func figNewPlot(title string) *plot.Plot {
	p := plot.New()
	p.Title.Text = figText(title)
	p.Title.TextStyle.Font = figFont(11)
	p.Title.Padding = vg.Points(6)
	return p
}

// A figMarkers draws Markers as dashed lines or rings with labels.
type figMarkers struct {
	markers    []Marker
	xlog, ylog bool
}

// Plot draws the markers; each label sits one line lower than the last,
// so that labels of nearby markers do not overprint.
func (mp *figMarkers) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for i, m := range mp.markers {
		col := color.RGBA{0x55, 0x55, 0x55, 0xff} // grey; warnings in vermillion
		if m.Warn {
			col = figColors[1]
		}
		sty := draw.LineStyle{Color: col, Width: vg.Points(1), Dashes: []vg.Length{vg.Points(4), vg.Points(3)}}
		lab := figTextStyle(8, col)
		pad := vg.Points(3)
		row := c.Max.Y - pad - vg.Length(i+1)*lab.Height("0")
		x, okx := figValue(m.X, mp.xlog)
		y, oky := figValue(m.Y, mp.ylog)
		var at vg.Point
		switch {
		case m.Kind == VLine && okx:
			at = vg.Point{X: trX(x), Y: row}
			if !c.ContainsX(at.X) {
				continue
			}
			c.StrokeLine2(sty, at.X, c.Min.Y, at.X, c.Max.Y)
		case m.Kind == HLine && oky:
			at = vg.Point{X: c.Min.X + pad, Y: trY(y) + pad}
			if !c.ContainsY(trY(y)) {
				continue
			}
			c.StrokeLine2(sty, c.Min.X, trY(y), c.Max.X, trY(y))
		case m.Kind == Point && okx && oky:
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
		txt := figText(m.Label)
		box := lab.Rectangle(txt).Add(at)
		c.SetColor(color.NRGBA{0xff, 0xff, 0xff, 0xcc}) // a light backing keeps the label readable on map cells
		c.Fill(box.Path())
		c.FillText(lab, at, txt)
	}
}

// A figLegendItem is one line of a legend.
type figLegendItem struct {
	text  string
	thumb plot.Thumbnailer
}

// figLegend draws items in a strip at the right of dc, under an optional
// heading, and returns the rest of dc. With no items it returns dc.
func figLegend(dc draw.Canvas, items []figLegendItem, heading string) draw.Canvas {
	if len(items) == 0 {
		return dc
	}
	l := plot.NewLegend()
	l.TextStyle = figTextStyle(9, color.Black)
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

// figNote writes note in one line at the bottom of dc, shortened with
// "..." to fit, and returns the rest of dc.
func figNote(dc draw.Canvas, note string) draw.Canvas {
	note = figText(note)
	if note == "" {
		return dc
	}
	sty := figTextStyle(8, color.Black)
	pad := vg.Points(4)
	maxW := dc.Max.X - dc.Min.X - 2*pad
	if sty.Width(note) > maxW {
		for len(note) > 0 && sty.Width(note+"...") > maxW {
			note = note[:len(note)-1] // ASCII after figText: bytes are runes
		}
		note += "..."
	}
	h := sty.Height(note) + 2*pad
	dc.FillText(sty, vg.Point{X: dc.Min.X + pad, Y: dc.Min.Y + pad + sty.FontExtents().Descent}, note)
	return draw.Crop(dc, 0, 0, h, 0)
}

// Shades of the regime map: figViridis (van der Walt & Smith 2015, the
// default colour map of matplotlib) at 0, 1/4, 1/2, 3/4 and 1, interpolated
// linearly. Its lightness rises monotonically, so grey-scale prints keep
// the order of the shades.
var figViridis = [...]color.RGBA{
	{0x44, 0x01, 0x54, 0xff}, {0x3B, 0x52, 0x8B, 0xff}, {0x21, 0x91, 0x8C, 0xff},
	{0x5E, 0xC9, 0x62, 0xff}, {0xFD, 0xE7, 0x25, 0xff},
}

// Colours of map cells without a valid state and of impossible counts.
var (
	figNoData = color.RGBA{0xe0, 0xe0, 0xe0, 0xff}
	figBadCnt = color.RGBA{0x99, 0x99, 0x99, 0xff}
)

// figShade returns the colour of a map cell in which n of total criteria
// predict survival: figNoData for n < 0, figBadCnt for n > total.
func figShade(n, total int) color.RGBA {
	switch {
	case n < 0:
		return figNoData
	case n > total:
		return figBadCnt
	}
	f := 0.0
	if total > 0 {
		f = math.Max(0, math.Min(1, float64(n)/float64(total)))
	}
	x := f * float64(len(figViridis)-1)
	i := min(int(x), len(figViridis)-2)
	t := x - float64(i)
	a, b := figViridis[i], figViridis[i+1]
	lerp := func(u, v uint8) uint8 { return uint8(math.Round(float64(u) + t*(float64(v)-float64(u)))) }
	return color.RGBA{lerp(a.R, b.R), lerp(a.G, b.G), lerp(a.B, b.B), 0xff}
}

// figLegendCounts returns the counts the map legend shows, largest first:
// every count up to 12 criteria, seven evenly spaced ones beyond.
func figLegendCounts(total int) []int {
	var out []int
	for k := total; k >= 0; k-- {
		if total <= 12 || k == total || int(math.Round(float64(k)*6/float64(total))) != int(math.Round(float64(k+1)*6/float64(total))) {
			out = append(out, k)
		}
	}
	return out
}

// figBoxThumb fills a legend thumbnail with one colour.
type figBoxThumb color.RGBA

// Thumbnail fills c.
func (b figBoxThumb) Thumbnail(c *draw.Canvas) {
	c.SetColor(color.RGBA(b))
	c.Fill(c.Rectangle.Path())
}

// figRegimeMap draws m on dc.
func figRegimeMap(dc draw.Canvas, m *RegimeMap) error {
	dc = figNote(dc, m.Note)
	var items []figLegendItem
	for _, n := range figLegendCounts(m.Total) {
		items = append(items, figLegendItem{fmt.Sprintf("%d of %d", n, m.Total), figBoxThumb(figShade(n, m.Total))})
	}
	if slices.IndexFunc(m.Counts, func(n int) bool { return n < 0 }) >= 0 {
		items = append(items, figLegendItem{"no data", figBoxThumb(figNoData)})
	}
	plotArea := figLegend(dc, items, "Criteria predicting survival")
	p := figNewPlot(m.Title)
	xlo, xhi := figRange(m.X, nil)
	ylo, yhi := figRange(m.Y, nil)
	p.Add(&figCells{m: m, xlo: xlo, xhi: xhi, ylo: ylo, yhi: yhi})
	if m.Mark != nil {
		p.Add(&figMarkers{markers: []Marker{*m.Mark}, xlog: m.X.Log, ylog: m.Y.Log})
	}
	figSetupAxis(&p.X, m.X, xlo, xhi)
	figSetupAxis(&p.Y, m.Y, ylo, yhi)
	p.Draw(plotArea)
	return nil
}

// figCells draws the cells of a regime map over [xlo, xhi] × [ylo, yhi]
// (axis units), each with its count when the cells are large enough.
type figCells struct {
	m                  *RegimeMap
	xlo, xhi, ylo, yhi float64
}

// Plot fills the cells.
func (cp *figCells) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	m := cp.m
	dx, dy := (cp.xhi-cp.xlo)/float64(m.NX), (cp.yhi-cp.ylo)/float64(m.NY)
	at := func(v float64, log bool) float64 { d, _ := figValue(v, log); return d }
	for j := range m.NY {
		y0, y1 := trY(at(cp.ylo+float64(j)*dy, m.Y.Log)), trY(at(cp.ylo+float64(j+1)*dy, m.Y.Log))
		for i := range m.NX {
			x0, x1 := trX(at(cp.xlo+float64(i)*dx, m.X.Log)), trX(at(cp.xlo+float64(i+1)*dx, m.X.Log))
			n := m.Counts[j*m.NX+i]
			c.SetColor(figShade(n, m.Total))
			c.Fill(vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x1, Y: y1}}.Path())
			if n < 0 || x1-x0 < vg.Points(9) || y1-y0 < vg.Points(8) {
				continue
			}
			ink, label := color.Color(color.White), strconv.Itoa(n)
			if 2*n > m.Total {
				ink = color.Black
			}
			if n > m.Total {
				label = "?"
			}
			sty := figTextStyle(7, ink)
			sty.XAlign, sty.YAlign = draw.XCenter, draw.YCenter
			c.FillText(sty, vg.Point{X: (x0 + x1) / 2, Y: (y0 + y1) / 2}, label)
		}
	}
}
