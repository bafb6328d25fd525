package chart

import (
	"strings"

	"cloudwind/internal/chartspec"
)

// minPanelRows is the fewest rows a panel stacked above another gets;
// with less, panels go side by side.
const minPanelRows = 10

// RenderPanels draws charts in a block of exactly w columns and h rows, as
// panels sharing one legend (that of the first chart, whose series the
// others repeat: the evolution view's m/m₀ and v/v_w): the panels one
// above the other when each gets at least 10 rows, else side by side, and
// the legend under them, naming every curve while the panels keep their
// plots. Like RenderLine it never panics.
func RenderPanels(charts []*chartspec.LineChart, w, h int, st *Styles) string {
	st = stylesOrDefault(st)
	switch {
	case w <= 0 || h <= 0:
		return tooSmallBlock(w, h, st)
	case len(charts) == 0:
		return RenderLine(nil, w, h, st)
	case len(charts) == 1:
		return RenderLine(charts[0], w, h, st)
	}
	first := charts[0]
	if first == nil {
		first = &chartspec.LineChart{}
	}
	var items []legendItem
	lg := newSurface(w, 0)
	legendID := lg.addStyle(st.Legend)
	for i := range first.Series {
		sr := &first.Series[i]
		name := textRunes(sr.Name, st.ASCII)
		if len(name) == 0 {
			name = []rune("(unnamed)")
		}
		items = append(items, legendItem{key: []rune{st.Glyph(sr.Index)}, text: name, keyID: lg.addStyle(st.SeriesStyle(sr.Index)), textID: legendID})
	}
	rows := packLegend(items, w)
	n := len(charts)
	stacked := (h-len(rows))/n >= minPanelRows || w/n < minChartWidth
	// Keep the legend only while every panel can still be drawn.
	panelH := func(nleg int) int {
		if stacked {
			return (h - nleg) / n
		}
		return h - nleg
	}
	nleg := len(rows)
	for nleg > 0 && panelH(nleg) < minChartHeight {
		nleg--
	}
	if nleg < len(rows) { // shorten the names to keep every entry (legend.go)
		rows, _ = fitLegend(items, w, nleg, st.ASCII)
		nleg = min(nleg, len(rows))
	}
	ph := panelH(nleg)
	if ph < minChartHeight { // not even the panels fit: the first chart alone
		return RenderLine(charts[0], w, h, st)
	}
	var out []string
	if stacked {
		for i, c := range charts {
			hh := ph
			if i == n-1 {
				hh = h - nleg - ph*(n-1)
			}
			out = append(out, strings.Split(renderLine(c, w, hh, st, false), "\n")...)
		}
	} else {
		cols := make([][]string, n)
		for i, c := range charts {
			ww := w / n
			if i == n-1 {
				ww = w - (w/n)*(n-1)
			} else {
				ww-- // a blank column between panels, so that their texts stay apart
			}
			cols[i] = strings.Split(renderLine(c, ww, ph, st, false), "\n")
			if i < n-1 {
				for y := range cols[i] {
					cols[i][y] += " "
				}
			}
		}
		for y := 0; y < ph; y++ {
			var b strings.Builder
			for _, col := range cols {
				b.WriteString(col[y])
			}
			out = append(out, b.String())
		}
	}
	if nleg > 0 {
		s := newSurface(w, nleg)
		s.styles = lg.styles
		drawLegend(s, rows, 0, nleg, st.ASCII)
		out = append(out, strings.Split(s.String(), "\n")...)
	}
	return strings.Join(out, "\n")
}
