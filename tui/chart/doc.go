// Package chart draws chart data (cloudwind/internal/chartspec values) in
// the terminal for the explorer: line charts with log or linear axes,
// markers and a legend, and regime maps of survival counts. Every render
// is a block of exactly w columns and h rows, never panics, and reads
// without colour: curves carry glyphs, map cells digits or shades.
//
// Curves are braille patterns drawn with ntcharts' graph.BrailleGrid on
// a light cell grid of the package's own (surface.go), or glyph runes
// when colour is off or ASCII is asked for. ntcharts' axes are linear and
// its tick labels sit one cell off the data, so axes, decade labels and
// ticks are drawn here at the braille-grid positions.
package chart
