package tui

import (
	"strconv"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
)

// A scroller is the first visible line of a pane, overlay or chart whose
// lines may not all fit. It shows that there is more: the first visible
// row says how many lines are above ("↑ 3 above"), the last how many are
// below ("↓ 5 more"), with a hint of how to get there; a line that must
// stay visible (the selected row) always does.
type scroller struct {
	top int
}

// minScrollRows is the fewest rows that hold indicators and a line.
const minScrollRows = 3

// start returns the first line shown of n lines in h rows, from s.top,
// moved so that line keep (none when keep < 0) is visible, and the rows
// left for lines after the indicators.
func (s scroller) start(n, h, keep int) (top, rows int, up, down bool) {
	if n <= h || h < minScrollRows {
		return 0, min(n, max(h, 0)), false, false
	}
	top = max(0, min(s.top, n-(h-1)))
	for range 4 {
		up = top > 0
		rows = h
		if up {
			rows--
		}
		down = top+rows < n
		if down {
			rows--
		}
		switch {
		case keep >= 0 && keep < top:
			top = keep
			if top == 1 { // "↑ 1 above" would hide as much as it tells
				top = 0
			}
		case keep >= 0 && keep >= top+rows:
			top = keep - rows + 1
		default:
			return top, rows, up, down
		}
	}
	return top, rows, up, down
}

// window returns the lines to show in h rows with the indicators; hint
// says how to scroll ("PgDn", "tab here").
func (s scroller) window(lines []string, h, keep int, hint string, st *Styles) []string {
	top, rows, up, down := s.start(len(lines), h, keep)
	out := make([]string, 0, h)
	arrowUp, arrowDown := "↑ ", "↓ "
	if st.ASCII {
		arrowUp, arrowDown = "^ ", "v "
	}
	if hint != "" {
		hint = st.sep() + hint
	}
	if up {
		out = append(out, st.Dim.Render(arrowUp+strconv.Itoa(top)+" above"+hint))
	}
	out = append(out, lines[top:top+rows]...)
	if down {
		out = append(out, st.Dim.Render(arrowDown+strconv.Itoa(len(lines)-top-rows)+" more"+hint))
	}
	return out
}

// follow stores the start that window uses, so that later moves scroll
// from what is on screen.
func (s *scroller) follow(n, h, keep int) {
	s.top, _, _, _ = s.start(n, h, keep)
}

// scrollKey scrolls by a key of the keymap (↑/↓ a line, PgUp/PgDn a
// page, Home/End to the ends) and reports whether it was one.
func (s *scroller) scrollKey(k tea.KeyMsg, keys *KeyMap, n, h int) bool {
	page := max(1, h-2)
	switch {
	case key.Matches(k, keys.Up):
		s.top--
	case key.Matches(k, keys.Down):
		s.top++
	case key.Matches(k, keys.PageUp):
		s.top -= page
	case key.Matches(k, keys.PageDown):
		s.top += page
	case key.Matches(k, keys.Top):
		s.top = 0
	case key.Matches(k, keys.Bottom):
		s.top = n
	default:
		return false
	}
	s.top = max(0, min(s.top, n-(h-1)))
	return true
}

// pageKey moves a selection sel of n rows by a page key (PgUp/PgDn by
// the rows shown, Home/End to the ends) and reports whether it was one.
func pageKey(k tea.KeyMsg, keys *KeyMap, sel *int, n, h int) bool {
	page := max(1, h-2)
	switch {
	case key.Matches(k, keys.PageUp):
		*sel = max(0, *sel-page)
	case key.Matches(k, keys.PageDown):
		*sel = min(n-1, *sel+page)
	case key.Matches(k, keys.Top):
		*sel = 0
	case key.Matches(k, keys.Bottom):
		*sel = n - 1
	default:
		return false
	}
	return true
}

// scrollHint is the hint of a scrolled pane: how to scroll it when it has
// the focus, how to give it the focus when not.
func scrollHint(focused bool) string {
	if focused {
		return "PgUp/PgDn"
	}
	return "tab here"
}
