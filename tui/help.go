package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"
)

// helpOverlay is the help: the overlay of every key in titled groups, and
// the one-line hint under the panes, both generated from the keymap, so
// that they show what drives Update (disabled bindings vanish). The groups
// are set in as many columns as the window holds, with a gap between
// columns, and the overlay scrolls when they are taller than the window.
type helpOverlay struct {
	styles        *Styles
	keys          *KeyMap
	help          help.Model // renders the hint line
	width, height int
	open          bool
	scroll        scroller
}

func newHelpOverlay(styles *Styles, keys *KeyMap) helpOverlay {
	h := help.New()
	if styles.ASCII {
		h.ShortSeparator, h.FullSeparator, h.Ellipsis = " | ", "   ", "~"
	}
	return helpOverlay{styles: styles, keys: keys, help: h}
}

// SetSize sets the window size the overlay and the hint fit in.
func (h *helpOverlay) SetSize(w, hgt int) {
	h.width, h.height = w, hgt
	h.help.Width = w
}

// Show opens the overlay at its top.
func (h *helpOverlay) Show() { h.open, h.scroll = true, scroller{} }

// Open reports whether the overlay is shown.
func (h *helpOverlay) Open() bool { return h.open }

// Update closes the overlay on its keys, scrolls it, and quits on the
// quit key.
func (h helpOverlay) Update(msg tea.Msg) (helpOverlay, tea.Cmd) {
	k, ok := msg.(tea.KeyMsg)
	if !ok {
		return h, nil
	}
	switch {
	case key.Matches(k, h.keys.Help, h.keys.Cancel, h.keys.Accept):
		h.open = false
	case key.Matches(k, h.keys.Quit):
		return h, tea.Quit
	default:
		h.scroll.scrollKey(k, h.keys, len(h.lines()), h.boxHeight()-2)
	}
	return h, nil
}

// ShortView is the one-line hint (the keymap's ShortHelp).
func (h helpOverlay) ShortView() string { return h.help.ShortHelpView(h.keys.ShortHelp()) }

// helpGap is the blank cells between two columns of the overlay.
const helpGap = 4

// column renders one group: its title and a line per enabled binding,
// keys aligned; it returns the lines and their width.
func (h helpOverlay) column(g helpGroup) ([]string, int) {
	st := h.styles
	keyW := 0
	for _, b := range g.keys {
		if b.Enabled() {
			keyW = max(keyW, ansi.StringWidth(b.Help().Key))
		}
	}
	lines := []string{st.Title.Render(g.title)}
	width := ansi.StringWidth(g.title)
	for _, b := range g.keys {
		if !b.Enabled() {
			continue
		}
		kh := b.Help()
		line := st.fit(kh.Key, keyW) + "  " + kh.Desc
		lines = append(lines, line)
		width = max(width, ansi.StringWidth(line))
	}
	return lines, width
}

// lines lays the groups out in columns that fit the box, most columns
// first, and adds the notes under them.
func (h helpOverlay) lines() []string {
	st := h.styles
	var cols [][]string
	var widths []int
	for _, g := range h.keys.groups() {
		c, w := h.column(g)
		cols, widths = append(cols, c), append(widths, w)
	}
	avail := h.maxWidth() - 3 // the borders and a blank cell before the right one
	var out []string
	for n := len(cols); n >= 1; n-- {
		// Groups in order, n per row of columns.
		total, fits := 0, true
		for i := 0; i < len(cols); i += n {
			rowW := 0
			for j := i; j < min(i+n, len(cols)); j++ {
				rowW += widths[j] + helpGap
			}
			fits = fits && rowW-helpGap <= avail
			total = max(total, rowW-helpGap)
		}
		if !fits && n > 1 {
			continue
		}
		for i := 0; i < len(cols); i += n {
			if i > 0 {
				out = append(out, "")
			}
			rows := 0
			for j := i; j < min(i+n, len(cols)); j++ {
				rows = max(rows, len(cols[j]))
			}
			for r := range rows {
				var b strings.Builder
				for j := i; j < min(i+n, len(cols)); j++ {
					cell := ""
					if r < len(cols[j]) {
						cell = cols[j][r]
					}
					if j < min(i+n, len(cols))-1 {
						cell = st.fit(cell, widths[j]+helpGap)
					}
					b.WriteString(cell)
				}
				out = append(out, b.String())
			}
		}
		break
	}
	notes := []string{"Typed values may carry units: 30 pc, 0.2 kpc, 2e4 K, 1 keV, 3e3 (K cm⁻³).",
		"Typing replaces the selected value; ←/→ first to edit it.",
		"* unverified constant · ! outside calibrated range · ⚠ outside the cooling table",
		"Verdicts: ✓ survives · ◐ transformed (to warm gas) · ✗ destroyed · ? depends on an unverified α (r_cl inside r_crit's band).",
		"Charts: a light band around a curve is r_crit if α is off by its uncertainty factor; O places simulation runs (✓ ◐ ✗) on charts 1 and 4.",
		"Outflow (7): a Chevalier & Clegg wind sets χ, Mach and P/k_B at each radius; the panes show the cloud at the launch radius; c the carried cloud.",
		"? or esc close"}
	out = append(out, "")
	for i, n := range notes {
		sty := st.Dim
		if i == len(notes)-1 {
			sty = st.Help
		}
		out = append(out, wrapText("", sty.Render(st.T(n)), avail)...)
	}
	return out
}

// maxWidth is the widest the overlay may be: the window less a margin,
// at most 110 cells.
func (h helpOverlay) maxWidth() int { return max(4, min(h.width-2, 110)) }

// boxWidth is the overlay's width: that of its widest line.
func (h helpOverlay) boxWidth() int {
	w := 0
	for _, l := range h.lines() {
		w = max(w, ansi.StringWidth(l))
	}
	return min(h.maxWidth(), w+3) // a blank cell before the right border
}

// boxHeight is the overlay's height: its lines, at most the window less
// the header, status and hint lines.
func (h helpOverlay) boxHeight() int { return max(3, min(len(h.lines())+2, h.height-3)) }

// View draws the overlay box.
func (h helpOverlay) View() string {
	bh := h.boxHeight()
	body := h.scroll.window(h.lines(), bh-2, -1, "PgUp/PgDn", h.styles)
	return strings.Join(box("Keys", body, h.boxWidth(), bh, true, h.styles), "\n")
}
