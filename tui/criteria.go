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
	scroll   scroller
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

// Update moves the selection (a row, a page, to the ends) and scrolls to
// keep it visible.
func (cp criteriaPane) Update(msg tea.Msg) (criteriaPane, tea.Cmd) {
	if k, ok := msg.(tea.KeyMsg); ok {
		n := len(cp.res.Criteria)
		switch {
		case key.Matches(k, cp.keys.Up):
			cp.selected = (cp.selected - 1 + n) % n
		case key.Matches(k, cp.keys.Down):
			cp.selected = (cp.selected + 1 + n) % n
		case pageKey(k, cp.keys, &cp.selected, n, cp.height-2):
		}
		cp.scroll.follow(len(cp.lines(cp.width-2)), cp.height-2, cp.selected+1)
	}
	return cp, nil
}

// View draws the pane in its border.
func (cp criteriaPane) View() string {
	title := "Criteria"
	if cp.pin != nil {
		title = "Criteria — A pinned vs B now"
	}
	body := cp.scroll.window(cp.lines(cp.width-2), cp.height-2, cp.selected+1, scrollHint(cp.focused), cp.styles)
	return strings.Join(boxWithFooter(title, cp.footer(cp.width-2), body, cp.width, cp.height, cp.focused, cp.styles), "\n")
}

// footer is the legend of the table's marks, set in the bottom border:
// only the marks in use, shorter in a narrow pane.
func (cp criteriaPane) footer(w int) string {
	anyUnverified, anyOut := false, false
	for i := range cp.res.Criteria {
		anyUnverified = anyUnverified || !cp.res.Criteria[i].Verified
		anyOut = anyOut || !cp.res.Outcomes[i].InRange()
	}
	var legend []string
	if anyUnverified {
		legend = append(legend, map[bool]string{true: "* unverified", false: "* unverified constant"}[w < 70])
	}
	if anyOut {
		legend = append(legend, map[bool]string{true: "! uncalibrated", false: "! outside calibrated range"}[w < 70])
	}
	legend = append(legend, "d details")
	return strings.Join(legend, cp.styles.sep())
}

// lines renders the table for a body w cells wide: the head and a row per
// criterion (the selected one is line selected+1).
func (cp criteriaPane) lines(w int) []string {
	st := cp.styles
	compact := w < 70
	idW := 21
	if compact {
		idW = 17
	}
	var head string
	switch {
	case cp.pin != nil && compact:
		head = st.fit("  criterion", idW) + st.fit("r_crit A", 10) + st.fit("r_crit B", 10) + st.T("A → B")
	case cp.pin != nil:
		head = st.fit("  criterion", idW) + st.fit("r_crit A", 11) + st.fit("r_crit B", 11) + st.fit("B/A", 7) + st.T("A → B")
	case compact:
		head = st.fit("  criterion", idW) + st.fit("r_crit", 11) + st.fit("margin", 8) + "verdict"
	default:
		head = st.fit("  criterion", idW) + st.fit("ratio", 9) + st.fit("limit", 7) + st.fit("r_crit", 11) + st.fit("margin", 8) + "verdict"
	}
	lines := []string{st.Dim.Render(head)}
	for i := range cp.res.Criteria {
		c, o := &cp.res.Criteria[i], cp.res.Outcomes[i]
		name := st.fit(st.T(quantity.Sanitize(c.ID)), idW-3) + " "
		if cp.focused && i == cp.selected {
			name = st.Selected.Render(st.cursor() + name)
		} else {
			name = st.Label.Render("  " + name)
		}
		rc := "none"
		if o.HasThreshold() {
			rc = st.Format(model.DimLength, float64(o.RCrit))
		}
		var row string
		switch {
		case cp.pin != nil && compact:
			oa := cp.pin.Outcomes[i]
			rca := "none"
			if oa.HasThreshold() {
				rca = st.Format(model.DimLength, float64(oa.RCrit))
			}
			row = name + st.fit(rca, 9) + " " + st.fit(rc, 9) + " " + verdictGlyph(st, oa.Verdict) + st.T("→") + verdictGlyph(st, o.Verdict)
		case cp.pin != nil:
			oa := cp.pin.Outcomes[i]
			rca := "none"
			if oa.HasThreshold() {
				rca = st.Format(model.DimLength, float64(oa.RCrit))
			}
			ratio := st.T("—")
			if o.HasThreshold() && oa.HasThreshold() {
				ratio = st.Sig(float64(o.RCrit/oa.RCrit), 3)
			}
			row = name + st.fit(rca, 10) + " " + st.fit(rc, 10) + " " + st.fit(ratio, 6) + " " +
				verdictGlyph(st, oa.Verdict) + st.T("→") + verdictText(st, o.Verdict, true)
		case compact:
			row = name + st.fit(rc, 10) + " " + st.fit(st.Sig(o.Margin, 3), 7) + " " + verdictText(st, o.Verdict, true)
		default:
			limit := st.Sig(o.Threshold, 3)
			if c.Cool == model.CoolNone {
				limit = st.T("—")
			}
			row = name + st.fit(st.Sig(o.Ratio, 3), 8) + " " + st.fit(limit, 6) + " " + st.fit(rc, 10) + " " +
				st.fit(st.Sig(o.Margin, 3), 7) + " " + verdictText(st, o.Verdict, false)
		}
		marks := ""
		if !c.Verified {
			marks += st.Unverified.Render(" *")
		}
		if !o.InRange() {
			marks += st.Warning.Render(" !" + st.T(strings.Join(o.Leaves.Names(), ",")))
		}
		lines = append(lines, row+marks)
	}
	return lines
}

// verdictText is the verdict as glyph and word, never colour alone.
func verdictText(st *Styles, v model.Verdict, short bool) string {
	if v == model.Survives {
		if short {
			return st.Survives.Render(verdictGlyph(st, v) + " grows")
		}
		return st.Survives.Render(verdictGlyph(st, v) + " survives")
	}
	if short {
		return st.Destroyed.Render(verdictGlyph(st, v) + " dest.")
	}
	return st.Destroyed.Render(verdictGlyph(st, v) + " destroyed")
}

// verdictGlyph is a one-glyph verdict for compact cells: ✓ or ✗, [ok] or
// [x] in ASCII.
func verdictGlyph(st *Styles, v model.Verdict) string {
	if v == model.Survives {
		return st.T("✓")
	}
	return st.T("✗")
}
