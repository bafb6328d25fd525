package tui

// Blocks of text: every pane draws itself as lines of exactly its width
// with these helpers, and App joins them side by side and overlays the
// prompts and help.

import (
	"strconv"
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

// splitLines splits a pane's view into its lines.
func splitLines(view string) []string { return strings.Split(view, "\n") }

// visibleLen is the width of s in cells, ignoring styling.
func visibleLen(s string) int { return ansi.StringWidth(s) }

// wrapText wraps text after a styled label to width w (label on the first
// line, continuation lines indented).
func wrapText(label, text string, w int) []string {
	words := strings.Fields(text)
	var lines []string
	line := label
	indent := "  "
	for _, wd := range words {
		if visibleLen(line)+len([]rune(wd))+1 > w && visibleLen(line) > len(indent) {
			lines = append(lines, line)
			line = indent
		}
		if !strings.HasSuffix(line, " ") && line != indent {
			line += " "
		}
		line += wd
	}
	return append(lines, line)
}

// wrapLines wraps text lines to w cells, indenting continuations.
func wrapLines(lines []string, w int) []string {
	var out []string
	for _, l := range lines {
		if visibleLen(l) <= w {
			out = append(out, l)
			continue
		}
		trimmed := strings.TrimLeft(l, " ")
		indent := strings.Repeat(" ", len(l)-len(trimmed))
		out = append(out, wrapText(indent, trimmed, w)...)
	}
	return out
}

// scrollWindow keeps the selected line visible in h lines.
func scrollWindow(lines []string, sel, h int, follow bool) []string {
	if len(lines) <= h || h <= 0 {
		return lines
	}
	start := 0
	if follow && sel >= h {
		start = sel - h + 1
	}
	end := min(len(lines), start+h)
	out := lines[start:end]
	if end < len(lines) {
		out[len(out)-1] = "  … " + strconv.Itoa(len(lines)-end+1) + " more (tab to this pane, ↓)"
	}
	return out
}
