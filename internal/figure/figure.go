// Package figure writes the explorer's charts (cloudwind/internal/chartspec
// values) as figures for slides and papers: SVG or PNG files drawn with
// gonum/plot. It has no terminal dependencies, so the command line can
// write the same figures.
//
// Texts are set in DejaVu Sans with real symbols: Greek letters, M☉,
// subscripts (r_cl, t_cool,mix) and superscripts (cm⁻³, 10⁻²) drawn as
// smaller lowered or raised text (text.go). Every figure carries the
// chart's note and the scenario caption under it, and keeps its legend
// and labels inside its frame.
package figure

import (
	"bytes"
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
// or a page, 6 × 6 in with two panels, and PNGs have 300 dpi, the usual
// print resolution (common practice, no source). A line chart whose legend
// needs more than legendFreeRows rows grows by the extra rows, so that the
// plot keeps its height.
const (
	figureWidth    = 6 * vg.Inch
	figureHeight   = 4 * vg.Inch
	panelHeight    = 2.5 * vg.Inch // each panel after the first adds this
	figureDPI      = 300
	figureMargin   = 4 // points of white around everything, so that raised scripts and font boxes stay inside
	legendFreeRows = 3
	// logLimit bounds |log10 v| on log axes: 10^±308 is the float64 range,
	// so points beyond ±300 decades are dropped rather than sent to
	// plot.LogScale, which panics on 0 and misbehaves on +Inf.
	logLimit = 300
)

// A Format is a file format of figures.
type Format int

// The formats.
const (
	SVG Format = iota + 1 // scalable, fonts embedded
	PNG                   // 300 dpi
)

// String returns "svg" or "png".
func (f Format) String() string {
	switch f {
	case SVG:
		return "svg"
	case PNG:
		return "png"
	}
	return "unknown"
}

// ErrFormat is wrapped by the error for an unsupported file extension.
var ErrFormat = errors.New("unsupported figure format")

// FormatOf returns the format a path names by its extension, .svg or .png
// in any case, or an error wrapping ErrFormat that names the path.
func FormatOf(path string) (Format, error) {
	switch ext := strings.ToLower(filepath.Ext(path)); ext {
	case ".svg":
		return SVG, nil
	case ".png":
		return PNG, nil
	default:
		return 0, fmt.Errorf("export %s: %w %q (want .svg or .png)", quantity.Sanitize(path), ErrFormat, quantity.Sanitize(ext))
	}
}

// WriteLineChart writes c to path as an SVG or a PNG (6 × 4 in), chosen by
// the extension (FormatOf). Log axes get decade ticks labelled 10⁻², 10⁰,
// …; series are told apart by colour and dash pattern and named in a
// legend under the plot; uncertainty bands are light fills in their
// curve's colour between dotted edges, simulation runs glyphs per outcome
// (overlays.go), both in the legend; markers are dashed lines or rings
// with labels; the note and the caption go under the legend. The file is written
// atomically (atomicfile.Write); every error names path.
func WriteLineChart(c *chartspec.LineChart, path string) error {
	if c == nil {
		return fmt.Errorf("export %s: no chart to export", quantity.Sanitize(path))
	}
	return writeFile(path, func(w io.Writer, f Format) error { return EncodeLineChart(w, f, c) })
}

// WritePanels writes charts to path like WriteLineChart, as panels one
// above the other sharing the first chart's legend (the evolution view's
// m/m₀ and v/v_w, whose curves are the same criteria), with every panel's
// note and the first caption under them. The figure is 6 in wide and 2.5 in
// taller per panel after the first.
func WritePanels(charts []*chartspec.LineChart, path string) error {
	if len(charts) == 0 || charts[0] == nil {
		return fmt.Errorf("export %s: no chart to export", quantity.Sanitize(path))
	}
	return writeFile(path, func(w io.Writer, f Format) error { return EncodePanels(w, f, charts) })
}

// WriteRegimeMap writes m to path like WriteLineChart: a map of cells
// shaded by how many criteria predict survival, with the count written in
// each cell when the cells are large enough ("t" where none survives but
// some are transformed), cells of class chartspec.Depends hatched, a
// legend of the shades, the hatching and the runs' glyphs, and m.Mark and
// m.Runs drawn on top. Cell (i, j) spans 1/NX of m.X's range from m.X.Min
// and 1/NY of m.Y's range from m.Y.Min, in axis units. Cells with a
// negative count (no valid state) are light grey and labelled "no data" in
// the legend; counts above m.Total, which should not occur, are mid-grey
// with "?". It returns an error when len(m.Counts) is not NX×NY.
func WriteRegimeMap(m *chartspec.RegimeMap, path string) error {
	if err := checkMap(m); err != nil {
		return fmt.Errorf("export %s: %w", quantity.Sanitize(path), err)
	}
	return writeFile(path, func(w io.Writer, f Format) error { return EncodeRegimeMap(w, f, m) })
}

// EncodeLineChart writes c to w in format f (see WriteLineChart).
func EncodeLineChart(w io.Writer, f Format, c *chartspec.LineChart) error {
	if c == nil {
		return errors.New("no chart to export")
	}
	charts := []*chartspec.LineChart{c}
	height := func(h *richText) vg.Length { return figureHeight + legendExtra(h, charts) }
	return encode(w, f, height, func(h *richText, dc draw.Canvas) error { return drawLineCharts(h, dc, charts) })
}

// EncodePanels writes charts to w in format f (see WritePanels).
func EncodePanels(w io.Writer, f Format, charts []*chartspec.LineChart) error {
	for _, c := range charts {
		if c == nil {
			return errors.New("no chart to export")
		}
	}
	if len(charts) == 0 {
		return errors.New("no chart to export")
	}
	height := func(h *richText) vg.Length {
		return figureHeight + vg.Length(len(charts)-1)*panelHeight + legendExtra(h, charts)
	}
	return encode(w, f, height, func(h *richText, dc draw.Canvas) error { return drawLineCharts(h, dc, charts) })
}

// EncodeRegimeMap writes m to w in format f (see WriteRegimeMap).
func EncodeRegimeMap(w io.Writer, f Format, m *chartspec.RegimeMap) error {
	if err := checkMap(m); err != nil {
		return err
	}
	height := func(*richText) vg.Length { return figureHeight }
	return encode(w, f, height, func(h *richText, dc draw.Canvas) error { return drawRegimeMap(h, dc, m) })
}

// checkMap refuses a map whose counts do not fill its grid.
func checkMap(m *chartspec.RegimeMap) error {
	if m == nil {
		return errors.New("no regime map to export")
	}
	if m.NX < 1 || m.NY < 1 || len(m.Counts) != m.NX*m.NY {
		return fmt.Errorf("regime map has %d counts for %d×%d cells", len(m.Counts), m.NX, m.NY)
	}
	return nil
}

// writeFile encodes a figure in path's format, then writes it to path
// atomically; errors name path.
func writeFile(path string, enc func(io.Writer, Format) error) error {
	f, err := FormatOf(path)
	if err != nil {
		return err
	}
	name := quantity.Sanitize(path)
	var buf bytes.Buffer
	if err := enc(&buf, f); err != nil {
		return fmt.Errorf("export %s: %w", name, err)
	}
	return atomicfile.Write(path, func(w io.Writer) error {
		_, err := w.Write(buf.Bytes())
		return err
	})
}

// encode renders a figure of the height height gives (measured with the
// figure's fonts) in format f and writes it to w.
func encode(w io.Writer, f Format, height func(*richText) vg.Length, render func(*richText, draw.Canvas) error) error {
	h, err := newRichText()
	if err != nil {
		return err
	}
	ht := height(h)
	var canvas vg.CanvasWriterTo
	switch f {
	case SVG:
		canvas = vgsvg.NewWith(vgsvg.UseWH(figureWidth, ht), vgsvg.EmbedFonts(true))
	case PNG:
		canvas = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(figureWidth, ht), vgimg.UseDPI(figureDPI))}
	default:
		return fmt.Errorf("%w %d", ErrFormat, int(f))
	}
	if err := renderSafely(func(dc draw.Canvas) error { return render(h, dc) }, draw.New(canvas)); err != nil {
		return err
	}
	_, err = canvas.WriteTo(w)
	return err
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
	m := vg.Points(figureMargin)
	return render(draw.Crop(dc, m, -m, m, -m))
}
