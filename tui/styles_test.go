package tui

import (
	"slices"
	"testing"

	"cloudwind/tui/chart"
)

// TestChartStylesFollowStyles checks that the chart styles are derived
// from the explorer's: the same flags, one style per palette colour, and
// the default glyphs (rules of NewStyles).
func TestChartStylesFollowStyles(t *testing.T) {
	for _, p := range []Palette{DarkPalette(), LightPalette()} {
		for _, color := range []bool{true, false} {
			for _, ascii := range []bool{true, false} {
				s := NewStyles(p, color, ascii)
				c := s.Chart
				if c.Color != color || c.ASCII != ascii {
					t.Errorf("NewStyles(%s, %v, %v).Chart has Color %v, ASCII %v", p.Name, color, ascii, c.Color, c.ASCII)
				}
				if len(c.Series) != len(p.Series) || len(c.Heat) != len(p.Heat) || !slices.Equal(c.Glyphs, chart.DefaultGlyphs()) {
					t.Errorf("NewStyles(%s, %v, %v).Chart: %d series styles, %d shades, glyphs %q; want %d, %d, %q",
						p.Name, color, ascii, len(c.Series), len(c.Heat), string(c.Glyphs), len(p.Series), len(p.Heat), string(chart.DefaultGlyphs()))
				}
			}
		}
	}
}
