// Package figure writes the explorer's charts (cloudwind/internal/chartspec
// values) as figures for slides and papers: SVG or PNG files drawn with
// gonum/plot. It has no terminal dependencies, so the command line can
// write the same figures.
package figure

import (
	"errors"
	"fmt"
	"image/color"
	"io"
	"path/filepath"
	"strings"

	"cloudwind/internal/atomicfile"
	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

// Exported figures are 6 × 4 in, a common size for one figure on a slide
// or a page, and PNGs have 300 dpi, the usual print resolution (common
// practice, no source).
const (
	figureWidth  = 6 * vg.Inch
	figureHeight = 4 * vg.Inch
	figureDPI    = 300
	// logLimit bounds |log10 v| on log axes: 10^±308 is the float64 range,
	// so points beyond ±300 decades are dropped rather than sent to
	// plot.LogScale, which panics on 0 and misbehaves on +Inf.
	logLimit = 300
)

// WriteLineChart writes c to path as an SVG or a PNG (300 dpi, 6 × 4 in),
// chosen by the extension .svg or .png (any case); other extensions are an
// error. Log axes get decade ticks labelled 1e-2, 1e0, …; text is spelt in
// ASCII (χ → chi, cm⁻³ → cm^-3, M☉ → Msun), since the embedded fonts lack
// superscripts. Series are told apart by colour and dash pattern, markers
// are dashed lines or rings with labels, and the note goes under the chart.
// The file is written atomically (atomicfile.Write); every error names path.
func WriteLineChart(c *chartspec.LineChart, path string) error {
	if c == nil {
		return fmt.Errorf("export %s: no chart to export", quantity.Sanitize(path))
	}
	return writeFigure(path, func(dc draw.Canvas) error { return drawLineChart(dc, c) })
}

// WriteRegimeMap writes m to path like WriteLineChart: a map of cells
// shaded by how many criteria predict survival, with the count written in
// each cell when the cells are large enough, a legend of the shades, and
// m.Mark drawn on top. Cell (i, j) spans 1/NX of m.X's range from m.X.Min
// and 1/NY of m.Y's range from m.Y.Min, in axis units. Cells with a
// negative count (no valid state) are light grey and labelled "no data" in
// the legend; counts above m.Total, which should not occur, are mid-grey
// with "?". It returns an error when len(m.Counts) is not NX×NY.
func WriteRegimeMap(m *chartspec.RegimeMap, path string) error {
	if m == nil {
		return fmt.Errorf("export %s: no regime map to export", quantity.Sanitize(path))
	}
	if m.NX < 1 || m.NY < 1 || len(m.Counts) != m.NX*m.NY {
		return fmt.Errorf("export %s: regime map has %d counts for %d×%d cells", quantity.Sanitize(path), len(m.Counts), m.NX, m.NY)
	}
	return writeFigure(path, func(dc draw.Canvas) error { return drawRegimeMap(dc, m) })
}

// ErrFormat is wrapped by the error for an unsupported file extension.
var ErrFormat = errors.New("unsupported figure format")

// writeFigure renders a figure for path's format, then writes it atomically.
func writeFigure(path string, render func(draw.Canvas) error) error {
	name := quantity.Sanitize(path)
	var canvas vg.CanvasWriterTo
	switch ext := strings.ToLower(filepath.Ext(path)); ext {
	case ".svg":
		canvas = vgsvg.New(figureWidth, figureHeight)
	case ".png":
		canvas = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(figureWidth, figureHeight), vgimg.UseDPI(figureDPI))}
	default:
		return fmt.Errorf("export %s: %w %q (want .svg or .png)", name, ErrFormat, quantity.Sanitize(ext))
	}
	if err := renderSafely(render, draw.New(canvas)); err != nil {
		return fmt.Errorf("export %s: %w", name, err)
	}
	return atomicfile.Write(path, func(w io.Writer) error {
		if _, err := canvas.WriteTo(w); err != nil {
			return fmt.Errorf("write %s: %w", name, err)
		}
		return nil
	})
}

// renderSafely runs render and turns a panic of the plotting library into
// an error. The inputs are checked before they reach the library (finite
// values, positive values on log axes), so this is a last line of defence.
func renderSafely(render func(draw.Canvas) error, dc draw.Canvas) (err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("plotting failed: %v", r)
		}
	}()
	dc.SetColor(color.White)
	dc.Fill(dc.Rectangle.Path())
	return render(dc)
}
