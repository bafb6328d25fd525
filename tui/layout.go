package tui

import (
	"strings"

	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"
)

// fit returns s cut with "…" or padded with spaces to exactly w cells.
func fit(s string, w int) string {
	if w <= 0 {
		return ""
	}
	n := ansi.StringWidth(s)
	if n > w {
		s = ansi.Truncate(s, w, "…")
		n = ansi.StringWidth(s)
	}
	return s + strings.Repeat(" ", w-n)
}

// block returns lines as exactly h lines of exactly w cells.
func block(lines []string, w, h int) []string {
	out := make([]string, h)
	for i := range out {
		if i < len(lines) {
			out[i] = fit(lines[i], w)
		} else {
			out[i] = strings.Repeat(" ", max(w, 0))
		}
	}
	return out
}

// box draws a bordered pane of exactly w×h cells with title in the top
// border; body lines are cut or padded to fit. Below 4×3 it returns blanks.
func box(title string, body []string, w, h int, focused bool, st *Styles) []string {
	if w < 4 || h < 3 {
		return block(nil, w, h)
	}
	b := lipgloss.NormalBorder()
	if st.ASCII {
		b = asciiBorder()
	}
	edge := st.Border
	if focused {
		edge = st.Focused
	}
	color := func(s string) string {
		return lipgloss.NewStyle().Foreground(edge.GetBorderTopForeground()).Render(s)
	}
	if !st.Color {
		color = func(s string) string { return s }
	}
	t := ""
	if title != "" {
		t = " " + title + " "
		if focused && !st.Color {
			t = "[" + title + "]"
		}
	}
	t = fit(t, max(0, min(ansi.StringWidth(t), w-4)))
	tStyled := st.Title.Render(t)
	if !focused {
		tStyled = st.Label.Render(t)
	}
	top := color(b.TopLeft+b.Top) + tStyled + color(strings.Repeat(b.Top, w-3-ansi.StringWidth(t))+b.TopRight)
	out := []string{top}
	for _, l := range block(body, w-2, h-2) {
		out = append(out, color(b.Left)+l+color(b.Right))
	}
	out = append(out, color(b.BottomLeft+strings.Repeat(b.Bottom, w-2)+b.BottomRight))
	return out
}

// beside joins blocks of equal height side by side.
func beside(cols ...[]string) []string {
	if len(cols) == 0 {
		return nil
	}
	h := 0
	for _, c := range cols {
		h = max(h, len(c))
	}
	out := make([]string, h)
	for i := range out {
		var b strings.Builder
		for _, c := range cols {
			if i < len(c) {
				b.WriteString(c[i])
			}
		}
		out[i] = b.String()
	}
	return out
}

// overlay draws the lines of top centred over base (both w wide).
func overlay(base, top []string, w int) []string {
	out := append([]string(nil), base...)
	h := len(base)
	tw := 0
	for _, l := range top {
		tw = max(tw, ansi.StringWidth(l))
	}
	x := max(0, (w-tw)/2)
	y := max(0, (h-len(top))/2)
	for i, l := range top {
		if y+i >= h {
			break
		}
		row := out[y+i]
		left := ansi.Truncate(row, x, "")
		left += strings.Repeat(" ", x-ansi.StringWidth(left))
		right := ansi.TruncateLeft(row, x+ansi.StringWidth(l), "")
		out[y+i] = fit(left+l+right, w)
	}
	return out
}
