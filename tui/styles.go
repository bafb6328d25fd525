package tui

import (
	"github.com/charmbracelet/lipgloss"

	"cloudwind/tui/chart"
)

// A Palette is a set of colours for one kind of screen. Meaning never
// rests on colour alone: verdicts carry a word and a glyph, curves a glyph
// in the legend, map cells a digit or shade.
type Palette struct {
	Name        string
	Text        lipgloss.TerminalColor
	Dim         lipgloss.TerminalColor
	Accent      lipgloss.TerminalColor // focus, selection
	Border      lipgloss.TerminalColor
	Survives    lipgloss.TerminalColor
	Transformed lipgloss.TerminalColor // the third verdict (transformed to warm gas)
	Destroyed   lipgloss.TerminalColor
	Warning     lipgloss.TerminalColor
	Error       lipgloss.TerminalColor
	Series      []lipgloss.TerminalColor // one per curve, in criterion order
	Heat        []lipgloss.TerminalColor // regime map, from "none survive" to "all survive"
}

// DarkPalette suits a dark terminal; its colours are bright enough for a
// projector (ANSI 256-colour indices; common practice, no source).
func DarkPalette() Palette {
	return Palette{
		Name: "dark", Text: lipgloss.Color("252"), Dim: lipgloss.Color("245"), Accent: lipgloss.Color("212"),
		Border: lipgloss.Color("240"), Survives: lipgloss.Color("42"), Transformed: lipgloss.Color("180"), Destroyed: lipgloss.Color("203"),
		Warning: lipgloss.Color("214"), Error: lipgloss.Color("196"),
		Series: []lipgloss.TerminalColor{lipgloss.Color("39"), lipgloss.Color("214"), lipgloss.Color("170"),
			lipgloss.Color("42"), lipgloss.Color("203"), lipgloss.Color("250"), lipgloss.Color("226"), lipgloss.Color("51")},
		Heat: []lipgloss.TerminalColor{lipgloss.Color("52"), lipgloss.Color("94"), lipgloss.Color("136"),
			lipgloss.Color("142"), lipgloss.Color("71"), lipgloss.Color("35"), lipgloss.Color("42")},
	}
}

// LightPalette suits a light terminal or a projector with a white screen:
// dark, saturated colours.
func LightPalette() Palette {
	return Palette{
		Name: "light", Text: lipgloss.Color("16"), Dim: lipgloss.Color("240"), Accent: lipgloss.Color("125"),
		Border: lipgloss.Color("245"), Survives: lipgloss.Color("22"), Transformed: lipgloss.Color("94"), Destroyed: lipgloss.Color("124"),
		Warning: lipgloss.Color("130"), Error: lipgloss.Color("160"),
		Series: []lipgloss.TerminalColor{lipgloss.Color("19"), lipgloss.Color("130"), lipgloss.Color("90"),
			lipgloss.Color("22"), lipgloss.Color("124"), lipgloss.Color("238"), lipgloss.Color("94"), lipgloss.Color("30")},
		Heat: []lipgloss.TerminalColor{lipgloss.Color("224"), lipgloss.Color("223"), lipgloss.Color("229"),
			lipgloss.Color("193"), lipgloss.Color("157"), lipgloss.Color("120"), lipgloss.Color("77")},
	}
}

// Styles are the interface's styles, named by meaning. There is one
// Styles value per App, built by NewStyles and passed down; nothing is
// global. Chart holds the chart renderers' styles, derived from the same
// palette.
type Styles struct {
	Palette     Palette
	Color       bool // false under NO_COLOR: every style below is colourless
	ASCII       bool // no braille glyphs: charts draw with plain runes
	Title       lipgloss.Style
	Border      lipgloss.Style // a pane
	Focused     lipgloss.Style // the focused pane
	Label       lipgloss.Style
	Value       lipgloss.Style
	Unit        lipgloss.Style
	Dim         lipgloss.Style
	Selected    lipgloss.Style // the selected row
	Survives    lipgloss.Style
	Transformed lipgloss.Style
	Destroyed   lipgloss.Style
	Warning     lipgloss.Style // cautions, out-of-range marks
	Unverified  lipgloss.Style // the mark on unverified constants
	OutOfTable  lipgloss.Style // temperatures outside the cooling table
	Status      lipgloss.Style
	Error       lipgloss.Style
	Help        lipgloss.Style
	Chart       chart.Styles // axes, curves (one style and glyph each), map shades
}

// NewStyles builds the styles of a palette. With color false (NO_COLOR)
// no style sets a colour; with ascii true charts use runes, not braille.
func NewStyles(p Palette, color, ascii bool) Styles {
	fg := func(c lipgloss.TerminalColor) lipgloss.Style {
		if !color {
			return lipgloss.NewStyle()
		}
		return lipgloss.NewStyle().Foreground(c)
	}
	border := lipgloss.NormalBorder()
	if ascii {
		border = asciiBorder()
	}
	s := Styles{
		Palette: p, Color: color, ASCII: ascii,
		Title:       fg(p.Accent).Bold(true),
		Border:      lipgloss.NewStyle().Border(border).BorderForeground(borderColor(p.Border, color)),
		Focused:     lipgloss.NewStyle().Border(border).BorderForeground(borderColor(p.Accent, color)),
		Label:       fg(p.Text),
		Value:       fg(p.Text).Bold(true),
		Unit:        fg(p.Dim),
		Dim:         fg(p.Dim),
		Selected:    fg(p.Accent).Bold(true),
		Survives:    fg(p.Survives).Bold(true),
		Transformed: fg(p.Transformed).Bold(true),
		Destroyed:   fg(p.Destroyed),
		Warning:     fg(p.Warning),
		Unverified:  fg(p.Warning),
		OutOfTable:  fg(p.Warning),
		Status:      fg(p.Dim),
		Error:       fg(p.Error).Bold(true),
		Help:        fg(p.Dim),
	}
	if !color {
		s.Selected = lipgloss.NewStyle().Reverse(true)
		s.Title = lipgloss.NewStyle().Bold(true)
	}
	s.Chart = chart.Styles{Color: color, ASCII: ascii, Title: s.Title, AxisLabel: fg(p.Dim), Dim: s.Dim, Warning: s.Warning,
		Legend: fg(p.Text), Glyphs: chart.DefaultGlyphs()}
	for _, c := range p.Series {
		s.Chart.Series = append(s.Chart.Series, fg(c))
	}
	for _, c := range p.Heat {
		if color {
			s.Chart.Heat = append(s.Chart.Heat, lipgloss.NewStyle().Background(c).Foreground(p.Text))
		} else {
			s.Chart.Heat = append(s.Chart.Heat, lipgloss.NewStyle())
		}
	}
	return s
}

// borderColor returns c, or no colour without color.
func borderColor(c lipgloss.TerminalColor, color bool) lipgloss.TerminalColor {
	if !color {
		return lipgloss.NoColor{}
	}
	return c
}

// asciiBorder draws pane borders with plain ASCII.
func asciiBorder() lipgloss.Border {
	return lipgloss.Border{Top: "-", Bottom: "-", Left: "|", Right: "|", TopLeft: "+", TopRight: "+", BottomLeft: "+", BottomRight: "+"}
}
