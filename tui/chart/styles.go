package chart

import "github.com/charmbracelet/lipgloss"

// Styles are the chart renderers' styles, named by meaning. The explorer
// derives them from its own styles (tui.Styles.Chart), so that one palette
// colours the panes and the charts; DefaultStyles is the colourless set.
type Styles struct {
	Color     bool // colours in use: series are drawn as braille unless ASCII
	ASCII     bool // no braille or box-drawing glyphs: plain runes
	Title     lipgloss.Style
	AxisLabel lipgloss.Style   // axis titles, tick labels, the map legend
	Dim       lipgloss.Style   // notes, marker lines, the pinned scenario's legend text
	Warning   lipgloss.Style   // markers outside the cooling table, impossible map counts
	Legend    lipgloss.Style   // series names
	Series    []lipgloss.Style // one per curve, in criterion order (cycling)
	Heat      []lipgloss.Style // regime-map shades from "none survive" to "all survive"
	Glyphs    []rune           // one per curve (cycling): legend keys, tags on braille curves, rune mode
}

// DefaultGlyphs are the curve glyphs of DefaultStyles.
func DefaultGlyphs() []rune { return []rune{'*', '+', 'o', 'x', '#', '.', '%', '@', '='} }

// DefaultStyles returns colourless styles with Unicode glyphs: series are
// drawn with their glyphs, not as braille.
func DefaultStyles() Styles {
	plain := lipgloss.NewStyle()
	return Styles{
		Title: lipgloss.NewStyle().Bold(true), AxisLabel: plain, Dim: plain, Warning: plain, Legend: plain,
		Glyphs: DefaultGlyphs(),
	}
}

// SeriesStyle returns the style of curve i (cycling; negative i counts as
// 0), unstyled when there are no series styles.
func (s *Styles) SeriesStyle(i int) lipgloss.Style {
	if len(s.Series) == 0 {
		return lipgloss.NewStyle()
	}
	return s.Series[max(i, 0)%len(s.Series)]
}

// Glyph returns the glyph of curve i (cycling; negative i counts as 0),
// '*' when there are no glyphs.
func (s *Styles) Glyph(i int) rune {
	if len(s.Glyphs) == 0 {
		return '*'
	}
	return s.Glyphs[max(i, 0)%len(s.Glyphs)]
}
