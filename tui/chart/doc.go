// Package chart draws chart data (cloudwind/internal/chartspec values) in
// the terminal for the explorer: line charts with log or linear axes,
// markers and a legend, panels sharing one legend (RenderPanels), and
// regime maps of survival counts. Every render is a block of exactly w
// columns and h rows, never panics, and reads without colour: curves carry
// glyphs, map cells digits or shades, and a curve drawn over an earlier one
// leaves the earlier one visible every few columns and says so in the
// legend (overlap.go). Uncertainty bands and simulation runs are drawn with
// glyphs of their own (bands.go); regime-map cells whose verdicts depend on
// constants or conventions alternate '?' with their count, and runs sit on
// the map as on the line charts (regimelegend.go). With ASCII set every text is spelt in plain ASCII
// (χ → chi, cm⁻³ → cm^-3).
//
// Curves are braille patterns drawn with ntcharts' graph.BrailleGrid on
// a light cell grid of the package's own (surface.go), or glyph runes
// when colour is off or ASCII is asked for. ntcharts' axes are linear and
// its tick labels sit one cell off the data, so axes, decade labels and
// ticks are drawn here at the braille-grid positions. The legend keeps a
// row per line of entries as long as the plot keeps three rows, so that
// every curve is named even in small blocks.
package chart
