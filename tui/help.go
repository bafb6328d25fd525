package tui

import (
	"fmt"
	"strings"

	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
)

// helpOverlay is the help: the overlay of every key in columns, and the
// one-line hint under the panes, both generated from the keymap, so that
// they show what drives Update (disabled bindings vanish).
type helpOverlay struct {
	styles        *Styles
	keys          *KeyMap
	help          help.Model // renders the hint line
	width, height int
	open          bool
}

func newHelpOverlay(styles *Styles, keys *KeyMap) helpOverlay {
	return helpOverlay{styles: styles, keys: keys, help: help.New()}
}

// SetSize sets the window size the overlay and the hint fit in.
func (h *helpOverlay) SetSize(w, hgt int) {
	h.width, h.height = w, hgt
	h.help.Width = w
}

// Show opens the overlay.
func (h *helpOverlay) Show() { h.open = true }

// Open reports whether the overlay is shown.
func (h *helpOverlay) Open() bool { return h.open }

// Update closes the overlay on its keys and quits on the quit key.
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
	}
	return h, nil
}

// ShortView is the one-line hint (the keymap's ShortHelp).
func (h helpOverlay) ShortView() string { return h.help.ShortHelpView(h.keys.ShortHelp()) }

// View draws the overlay box (the keymap's FullHelp in columns).
func (h helpOverlay) View() string {
	var cols [][]string
	for _, group := range h.keys.FullHelp() {
		var col []string
		for _, b := range group {
			if !b.Enabled() {
				continue
			}
			kh := b.Help()
			col = append(col, fmt.Sprintf("%-10s %s", kh.Key, kh.Desc))
		}
		cols = append(cols, col)
	}
	var lines []string
	rows := 0
	for _, c := range cols {
		rows = max(rows, len(c))
	}
	colW := 30
	if h.width < 100 {
		colW = (h.width - 8) / 3
	}
	for i := 0; i < rows; i++ {
		var b strings.Builder
		for _, c := range cols {
			cell := ""
			if i < len(c) {
				cell = c[i]
			}
			b.WriteString(fit(cell, colW))
		}
		lines = append(lines, b.String())
	}
	st := h.styles
	lines = append(lines, "", st.Dim.Render("Units with typed values: 30 pc, 0.2 kpc, 2e4 K, 1 keV, 3e3 (K cm⁻³)."),
		st.Dim.Render("* unverified constant · ! outside calibrated range · ⚠ outside the cooling table"),
		st.Help.Render("? or esc close"))
	w := min(h.width-2, 3*colW+4)
	return strings.Join(box("Keys", lines, w, min(len(lines)+2, h.height-3), true, st), "\n")
}
