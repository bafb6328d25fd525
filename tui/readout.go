package tui

import (
	"math"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// derivedKeys are the quantities of the derived pane, in order (keys of
// model.Quantities).
var derivedKeys = []string{
	"t_hot", "t_mix", "t_minmix", "n_hot", "v_wind", "t_cc", "t_shear",
	"t_cool_hot", "t_cool_mix", "t_cool_minmix", "t_cool_cold", "t_drag", "t_grow",
	"l_shatter", "mass_cloud", "t_cool_hot_per_t_cc",
}

// derivedRows returns the derived quantities shown, in order.
func derivedRows() []model.Quantity {
	all := map[string]model.Quantity{}
	for _, q := range model.Quantities() {
		all[q.Key] = q
	}
	out := make([]model.Quantity, 0, len(derivedKeys))
	for _, k := range derivedKeys {
		out = append(out, all[k])
	}
	return out
}

// tableStatus says whether the cooling table covers a temperature
// quantity: "", "above table" or "below table".
func tableStatus(cf model.CoolingFunction, key string, s *model.State) string {
	p, ok := cf.(*cooling.PowerLaw)
	if !ok {
		return ""
	}
	var t model.Temperature
	switch key {
	case "t_hot":
		t = s.THot
	case "t_mix":
		t = s.TMix
	case "t_minmix":
		t = s.TMinMix
	default:
		return ""
	}
	switch p.Classify(t) {
	case cooling.AboveTable:
		return "above table"
	case cooling.BelowTable:
		return "below table"
	}
	return ""
}

// readout is the derived-values pane: symbol, value with unit, and in
// compare mode the ratio B/A, with a mark on temperatures outside the
// cooling table and the cautions of the evaluation under them.
type readout struct {
	styles        *Styles
	keys          *KeyMap
	width, height int
	focused       bool

	rows     []model.Quantity // fixed at start
	selected int
	scroll   scroller
	res      *model.Result // the current evaluation
	pin      *model.Result // the pinned scenario A's, or nil
	cf       model.CoolingFunction
	launch   string // the state of res in the outflow view ("at launch, 1 R"), "" for the inputs'
}

func newReadout(styles *Styles, keys *KeyMap) readout {
	return readout{styles: styles, keys: keys, rows: derivedRows()}
}

// SetSize sets the pane's size, border included.
func (r *readout) SetSize(w, h int) { r.width, r.height = w, h }

// SetFocused says whether the pane has the focus (shows the selection).
func (r *readout) SetFocused(f bool) { r.focused = f }

// SetResult sets the evaluation shown, the pinned one (nil for none) and
// the cooling function it used.
func (r *readout) SetResult(res, pin *model.Result, cf model.CoolingFunction) {
	r.res, r.pin, r.cf = res, pin, cf
}

// Update moves the selection (a row, a page, to the ends) and scrolls to
// keep it visible.
func (r readout) Update(msg tea.Msg) (readout, tea.Cmd) {
	if k, ok := msg.(tea.KeyMsg); ok {
		n := len(r.rows)
		switch {
		case key.Matches(k, r.keys.Up):
			r.selected = (r.selected - 1 + n) % n
		case key.Matches(k, r.keys.Down):
			r.selected = (r.selected + 1 + n) % n
		case pageKey(k, r.keys, &r.selected, n, r.height-2):
		}
		r.scroll.follow(len(r.lines(r.width-2)), r.height-2, r.selected)
	}
	return r, nil
}

// Selected returns the selected quantity.
func (r *readout) Selected() model.Quantity { return r.rows[r.selected] }

// View draws the pane in its border.
func (r readout) View() string {
	title := "Derived"
	if r.launch != "" {
		title += " " + r.launch
	}
	return strings.Join(box(title, r.body(r.width-2, r.height-2), r.width, r.height, r.focused, r.styles), "\n")
}

// body renders the rows for a body of w×h cells, scrolled.
func (r readout) body(w, h int) []string {
	return r.scroll.window(r.lines(w), h, r.selected, scrollHint(r.focused), r.styles)
}

// lines renders every row for a body w cells wide, and the cautions.
func (r readout) lines(w int) []string {
	st := r.styles
	lines := make([]string, 0, len(r.rows))
	symW := 18
	if w < 36 {
		symW = 16
	}
	for i, q := range r.rows {
		v := q.Value(&r.res.State)
		val := st.Format(q.Dim, v)
		cell := st.Value.Render(val)
		if r.pin != nil {
			va := q.Value(&r.pin.State)
			if ratio := v / va; isFiniteValue(ratio) && va != 0 {
				cell += st.Dim.Render("  B/A " + st.Sig(ratio, 3))
			}
		}
		if note := tableStatus(r.cf, q.Key, &r.res.State); note != "" {
			cell += " " + st.OutOfTable.Render(st.warnMark()+" "+note)
		}
		var label string
		if r.focused && i == r.selected {
			label = st.Selected.Render(st.fit(st.cursor()+st.T(q.Symbol), symW-1)) + " "
		} else {
			label = st.Label.Render(st.fit("  "+st.T(q.Symbol), symW-1)) + " "
		}
		lines = append(lines, label+cell)
	}
	// The cold-gas line carries the caution when T_cl leaves the table.
	for _, c := range r.res.Cautions {
		lines = append(lines, st.Warning.Render(st.warnMark()+" "+st.T(quantity.Sanitize(c.Message))))
	}
	return lines
}

// isFiniteValue reports whether v is neither NaN nor ±Inf.
func isFiniteValue(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
