package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// criteriaPane is the criteria table: ratio, limit, r_crit, margin and
// verdict per criterion; with a pinned A, r_crit of A and B, B/A and the
// verdicts A→B. Marks: * constants not verified, ! inputs outside the
// calibrated range.
type criteriaPane struct {
	styles        *Styles
	keys          *KeyMap
	width, height int
	focused       bool

	selected int
	res      *model.Result // the current evaluation
	pin      *model.Result // the pinned scenario A's, or nil
}

func newCriteriaPane(styles *Styles, keys *KeyMap) criteriaPane {
	return criteriaPane{styles: styles, keys: keys}
}

// SetSize sets the pane's size, border included.
func (cp *criteriaPane) SetSize(w, h int) { cp.width, cp.height = w, h }

// SetFocused says whether the pane has the focus (shows the selection).
func (cp *criteriaPane) SetFocused(f bool) { cp.focused = f }

// SetResult sets the evaluation shown and the pinned one (nil for none).
func (cp *criteriaPane) SetResult(res, pin *model.Result) { cp.res, cp.pin = res, pin }

// Selected returns the index of the selected criterion.
func (cp *criteriaPane) Selected() int { return cp.selected }

// Update moves the selection.
func (cp criteriaPane) Update(msg tea.Msg) (criteriaPane, tea.Cmd) {
	if k, ok := msg.(tea.KeyMsg); ok {
		n := len(cp.res.Criteria)
		switch {
		case key.Matches(k, cp.keys.Up):
			cp.selected = (cp.selected - 1 + n) % n
		case key.Matches(k, cp.keys.Down):
			cp.selected = (cp.selected + 1 + n) % n
		}
	}
	return cp, nil
}

// View draws the pane in its border.
func (cp criteriaPane) View() string {
	title := "Criteria"
	if cp.pin != nil {
		title = "Criteria — A pinned vs B now"
	}
	return strings.Join(box(title, cp.body(cp.width-2), cp.width, cp.height, cp.focused, cp.styles), "\n")
}

// body renders the table for a body w cells wide.
func (cp criteriaPane) body(w int) []string {
	st := cp.styles
	compact := w < 70
	idW := 21
	if compact {
		idW = 17
	}
	var head string
	switch {
	case cp.pin != nil:
		head = fit("  criterion", idW) + fit("r_crit A", 11) + fit("r_crit B", 11) + fit("B/A", 7) + "A → B"
	case compact:
		head = fit("  criterion", idW) + fit("r_crit", 11) + fit("margin", 8) + "verdict"
	default:
		head = fit("  criterion", idW) + fit("ratio", 9) + fit("limit", 7) + fit("r_crit", 11) + fit("margin", 8) + "verdict"
	}
	lines := []string{st.Dim.Render(head)}
	anyUnverified, anyOut := false, false
	for i := range cp.res.Criteria {
		c, o := &cp.res.Criteria[i], cp.res.Outcomes[i]
		name := fit(quantity.Sanitize(c.ID), idW-3) + " "
		if cp.focused && i == cp.selected {
			name = st.Selected.Render("▸ " + name)
		} else {
			name = st.Label.Render("  " + name)
		}
		rc := "none"
		if o.HasThreshold() {
			rc = quantity.Format(model.DimLength, float64(o.RCrit))
		}
		var row string
		switch {
		case cp.pin != nil:
			oa := cp.pin.Outcomes[i]
			rca := "none"
			if oa.HasThreshold() {
				rca = quantity.Format(model.DimLength, float64(oa.RCrit))
			}
			ratio := "—"
			if o.HasThreshold() && oa.HasThreshold() {
				ratio = quantity.FormatSig(float64(o.RCrit/oa.RCrit), 3)
			}
			row = name + fit(rca, 10) + " " + fit(rc, 10) + " " + fit(ratio, 6) + " " +
				verdictGlyph(oa.Verdict) + "→" + verdictText(st, o.Verdict, true)
		case compact:
			row = name + fit(rc, 10) + " " + fit(quantity.FormatSig(o.Margin, 3), 7) + " " + verdictText(st, o.Verdict, true)
		default:
			limit := quantity.FormatSig(o.Threshold, 3)
			if c.Cool == model.CoolNone {
				limit = "—"
			}
			row = name + fit(quantity.FormatSig(o.Ratio, 3), 8) + " " + fit(limit, 6) + " " + fit(rc, 10) + " " +
				fit(quantity.FormatSig(o.Margin, 3), 7) + " " + verdictText(st, o.Verdict, false)
		}
		marks := ""
		if !c.Verified {
			marks += st.Unverified.Render(" *")
			anyUnverified = true
		}
		if !o.InRange() {
			marks += st.Warning.Render(" !" + strings.Join(o.Leaves.Names(), ","))
			anyOut = true
		}
		lines = append(lines, row+marks)
	}
	var legend []string
	if anyUnverified {
		legend = append(legend, st.Unverified.Render("*")+" unverified constant")
	}
	if anyOut {
		legend = append(legend, st.Warning.Render("!")+" outside calibrated range")
	}
	legend = append(legend, "d details")
	lines = append(lines, st.Dim.Render(strings.Join(legend, " · ")))
	return lines
}

// verdictText is the verdict as glyph and word, never colour alone.
func verdictText(st *Styles, v model.Verdict, short bool) string {
	if v == model.Survives {
		if short {
			return st.Survives.Render("✓ grows")
		}
		return st.Survives.Render("✓ survives")
	}
	if short {
		return st.Destroyed.Render("✗ dest.")
	}
	return st.Destroyed.Render("✗ destroyed")
}

// verdictGlyph is a one-glyph verdict for compact cells.
func verdictGlyph(v model.Verdict) string {
	if v == model.Survives {
		return "✓"
	}
	return "✗"
}
