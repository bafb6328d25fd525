package report

import (
	"strings"
	"unicode/utf8"
)

// TextWidth is the width text output is laid out for: it fits a terminal
// of 100 columns and a printed page (cloudwind's choice).
const TextWidth = 100

// Wrap breaks text into lines of at most width runes at spaces, the first
// line starting with first and the others with rest (a hanging indent). A
// word longer than a whole line is cut.
func Wrap(text string, width int, first, rest string) []string {
	var lines []string
	line, n, empty := first, runeLen(first), true
	flush := func() {
		lines = append(lines, line)
		line, n, empty = rest, runeLen(rest), true
	}
	for _, w := range strings.Fields(text) {
		wl := runeLen(w)
		if !empty && n+1+wl > width {
			flush()
		}
		for empty && n+wl > width && width-n >= 1 {
			r := []rune(w)
			k := width - n
			line += string(r[:k])
			w, wl = string(r[k:]), wl-k
			empty = false
			flush()
		}
		if w == "" {
			continue
		}
		if !empty {
			line += " "
			n++
		}
		line += w
		n += wl
		empty = false
	}
	if !empty || len(lines) == 0 {
		lines = append(lines, line)
	}
	return lines
}

func runeLen(s string) int { return utf8.RuneCountInString(s) }

// A Table lays out rows of cells in columns for text output, two spaces
// apart after an indent, within Width runes: when the natural widths do not
// fit, the columns marked in Wrap are narrowed (to no less than MinWrap
// runes) and their cells wrap within the column.
type Table struct {
	Width   int    // total width; TextWidth when 0
	Indent  string // written before every line, e.g. "  "
	Wrap    []bool // Wrap[i]: column i may wrap; columns beyond the slice may not
	MinWrap int    // the narrowest a wrapping column becomes; 16 when 0
	// MinWidths[i], when > 0, is the narrowest column i becomes instead.
	MinWidths []int
	rows      [][]string
}

// Row adds a row. Missing cells are empty.
func (t *Table) Row(cells ...string) { t.rows = append(t.rows, cells) }

// String renders the table, each line without trailing spaces.
func (t *Table) String() string {
	width := t.Width
	if width == 0 {
		width = TextWidth
	}
	minWrap := t.MinWrap
	if minWrap == 0 {
		minWrap = 16
	}
	n := 0
	for _, r := range t.rows {
		n = max(n, len(r))
	}
	if n == 0 {
		return ""
	}
	w := make([]int, n)
	for _, r := range t.rows {
		for i, c := range r {
			w[i] = max(w[i], utf8.RuneCountInString(c))
		}
	}
	total := func() int {
		s := utf8.RuneCountInString(t.Indent) + 2*(n-1)
		for _, x := range w {
			s += x
		}
		return s
	}
	wraps := func(i int) bool { return i < len(t.Wrap) && t.Wrap[i] }
	// Narrow the widest wrapping column a rune at a time until it fits.
	for total() > width {
		best := -1
		for i := range w {
			lim := minWrap
			if i < len(t.MinWidths) && t.MinWidths[i] > 0 {
				lim = t.MinWidths[i]
			}
			if wraps(i) && w[i] > lim && (best < 0 || w[i] > w[best]) {
				best = i
			}
		}
		if best < 0 {
			break
		}
		w[best]--
	}
	var b strings.Builder
	for _, r := range t.rows {
		cells := make([][]string, n)
		height := 1
		for i := 0; i < n; i++ {
			c := ""
			if i < len(r) {
				c = r[i]
			}
			if wraps(i) && utf8.RuneCountInString(c) > w[i] {
				cells[i] = Wrap(c, w[i], "", "")
			} else {
				cells[i] = []string{c}
			}
			height = max(height, len(cells[i]))
		}
		for k := 0; k < height; k++ {
			line := t.Indent
			for i := 0; i < n; i++ {
				c := ""
				if k < len(cells[i]) {
					c = cells[i][k]
				}
				if i > 0 {
					line += "  "
				}
				line += c
				if i < n-1 {
					line += strings.Repeat(" ", max(0, w[i]-utf8.RuneCountInString(c)))
				}
			}
			b.WriteString(strings.TrimRight(line, " "))
			b.WriteByte('\n')
		}
	}
	return b.String()
}

// FitLines wraps every line of text longer than width (TextWidth when 0)
// at spaces, continuing with a hanging indent under the line's second
// column (after its first run of two or more spaces), or four spaces in
// from the line's own indent when there is no such column or it lies
// beyond 40 runes. The part of the line before that column is kept as it
// is; lines that fit are kept whole.
func FitLines(text string, width int) string {
	if width == 0 {
		width = TextWidth
	}
	lines := strings.Split(text, "\n")
	var out []string
	for _, l := range lines {
		if runeLen(l) <= width {
			out = append(out, l)
			continue
		}
		lead := len(l) - len(strings.TrimLeft(l, " "))
		head, body, indent := l[:lead], l[lead:], lead+4
		if i := strings.Index(l[lead:], "  "); i >= 0 {
			j := lead + i
			for j < len(l) && l[j] == ' ' {
				j++
			}
			if col := runeLen(l[:j]); col <= 40 {
				head, body, indent = l[:j], l[j:], col
			}
		}
		out = append(out, Wrap(body, width, head, strings.Repeat(" ", indent))...)
	}
	return strings.Join(out, "\n")
}
