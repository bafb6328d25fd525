package tui

// Blocks of text: every pane draws itself as lines of exactly its width
// with these helpers, and App joins them side by side and overlays the
// prompts and help.

import (
	"strings"

	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"
)

// fit returns s cut with "…" ("~" in ASCII) or padded with spaces to
// exactly w cells.
func (st *Styles) fit(s string, w int) string {
	if w <= 0 {
		return ""
	}
	n := ansi.StringWidth(s)
	if n > w {
		s = ansi.Truncate(s, w, st.ellipsis())
		n = ansi.StringWidth(s)
	}
	return s + strings.Repeat(" ", w-n)
}

// block returns lines as exactly h lines of exactly w cells.
func (st *Styles) block(lines []string, w, h int) []string {
	out := make([]string, max(h, 0))
	for i := range out {
		if i < len(lines) {
			out[i] = st.fit(lines[i], w)
		} else {
			out[i] = strings.Repeat(" ", max(w, 0))
		}
	}
	return out
}

// box draws a bordered pane of exactly w×h cells with title in the top
// border; body lines are cut or padded to fit. Below 4×3 it returns blanks.
func box(title string, body []string, w, h int, focused bool, st *Styles) []string {
	return boxWithFooter(title, "", body, w, h, focused, st)
}

// boxWithFooter is box with a short note (a key hint, a legend of marks)
// set in the bottom border, so that it takes no row of the body.
func boxWithFooter(title, footer string, body []string, w, h int, focused bool, st *Styles) []string {
	if w < 4 || h < 3 {
		return st.block(nil, w, h)
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
	t, title := "", st.T(title)
	if title != "" {
		t = " " + title + " "
		if focused && !st.Color {
			t = "[" + title + "]"
		}
	}
	t = st.fit(t, max(0, min(ansi.StringWidth(t), w-4)))
	tStyled := st.Title.Render(t)
	if !focused {
		tStyled = st.Label.Render(t)
	}
	top := color(b.TopLeft+b.Top) + tStyled + color(strings.Repeat(b.Top, w-3-ansi.StringWidth(t))+b.TopRight)
	out := []string{top}
	for _, l := range st.block(body, w-2, h-2) {
		out = append(out, color(b.Left)+l+color(b.Right))
	}
	bottom := color(b.BottomLeft + strings.Repeat(b.Bottom, w-2) + b.BottomRight)
	if footer = st.T(footer); footer != "" && w > 8 {
		f := st.fit(" "+footer+" ", min(ansi.StringWidth(footer)+2, w-4))
		bottom = color(b.BottomLeft+b.Bottom) + st.Dim.Render(f) + color(strings.Repeat(b.Bottom, w-3-ansi.StringWidth(f))+b.BottomRight)
	}
	return append(out, bottom)
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
func (st *Styles) overlay(base, top []string, w int) []string {
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
		out[y+i] = st.fit(left+l+right, w)
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
		if line != "" && !strings.HasSuffix(line, " ") && line != indent {
			line += " "
		}
		line += wd
	}
	return append(lines, line)
}

// wrapLines wraps plain text lines to w cells without collapsing their
// spacing: a line cut at a space goes on under its value column (after
// the first run of two or more spaces, as in "  label      value"), or two
// cells in from its own indentation.
func wrapLines(lines []string, w int) []string {
	var out []string
	for _, l := range lines {
		out = append(out, wrapHanging(l, w)...)
	}
	return out
}

// wrapHanging wraps one plain line (see wrapLines).
func wrapHanging(l string, w int) []string {
	if w < 8 || ansi.StringWidth(l) <= w {
		return []string{l}
	}
	rs := []rune(l)
	lead := 0
	for lead < len(rs) && rs[lead] == ' ' {
		lead++
	}
	hang := lead + 2
	if gap := strings.Index(string(rs[lead:]), "  "); gap > 0 {
		col := lead + len([]rune(string(rs[lead:])[:gap]))
		for col < len(rs) && rs[col] == ' ' {
			col++
		}
		if col < len(rs) && col <= w/2 {
			hang = col
		}
	}
	var out []string
	for {
		if ansi.StringWidth(string(rs)) <= w {
			return append(out, string(rs))
		}
		cut, width := 0, 0
		for i, r := range rs {
			width += ansi.StringWidth(string(r))
			if width > w {
				break
			}
			if r == ' ' && i > hang {
				cut = i
			}
		}
		if cut == 0 { // one long word: cut it
			cut = w
			for ansi.StringWidth(string(rs[:cut])) > w {
				cut--
			}
		}
		out = append(out, strings.TrimRight(string(rs[:cut]), " "))
		rest := rs[cut:]
		for len(rest) > 0 && rest[0] == ' ' {
			rest = rest[1:]
		}
		rs = append([]rune(strings.Repeat(" ", hang)), rest...)
	}
}
