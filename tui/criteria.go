package tui

import (
	"strconv"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/chartspec"
	"cloudwind/model"
)

// criteriaPane is the criteria table: per criterion (by label) r_crit
// with its band when the constant is unverified, the margin, the score
// against loaded simulation outcomes, and the verdict (three: survives,
// transformed, destroyed; "?" when it depends on the constant), with the
// ratio and the limit in a wide pane; with a pinned A, r_crit of A and B,
// B/A and the verdicts A→B. Marks: * constants not verified, ! inputs
// outside the calibrated range.
type criteriaPane struct {
	styles        *Styles
	keys          *KeyMap
	width, height int
	focused       bool

	selected int
	scroll   scroller
	res      *model.Result // the current evaluation
	pin      *model.Result // the pinned scenario A's, or nil
	scores   []model.Score // against loaded simulation outcomes, one per criterion; nil for none

	outflowOn bool               // the outflow view is shown: the table along the wind
	outflow   *chartspec.Outflow // its data, nil while computed or when the wind is not valid
	carry     bool               // the outflow view shows the carried cloud
}

func newCriteriaPane(styles *Styles, keys *KeyMap) criteriaPane {
	return criteriaPane{styles: styles, keys: keys}
}

// SetSize sets the pane's size, border included.
func (cp *criteriaPane) SetSize(w, h int) { cp.width, cp.height = w, h }

// SetFocused says whether the pane has the focus (shows the selection).
func (cp *criteriaPane) SetFocused(f bool) { cp.focused = f }

// SetResult sets the evaluation shown, the pinned one (nil for none) and
// the scores against simulation outcomes (nil for none).
func (cp *criteriaPane) SetResult(res, pin *model.Result, scores []model.Score) {
	cp.res, cp.pin, cp.scores = res, pin, scores
}

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
	title, footer := "Criteria", cp.footer(cp.width-2)
	switch {
	case cp.outflowOn:
		title, footer = cp.outflowTitle(), cp.outflowFooter(cp.width-2)
	case cp.pin != nil:
		title = "Criteria — A pinned vs B now"
	}
	body := cp.scroll.window(cp.lines(cp.width-2), cp.height-2, cp.selected+1, scrollHint(cp.focused), cp.styles)
	return strings.Join(boxWithFooter(title, footer, body, cp.width, cp.height, cp.focused, cp.styles), "\n")
}

// footer is the legend of the table's marks, set in the bottom border:
// only the marks in use, shorter in a narrow pane.
func (cp criteriaPane) footer(w int) string {
	anyUnverified, anyOut, anyDepends := false, false, false
	for i := range cp.res.Criteria {
		anyUnverified = anyUnverified || !cp.res.Criteria[i].Verified
		anyOut = anyOut || !cp.res.Outcomes[i].InRange()
		anyDepends = anyDepends || cp.res.Outcomes[i].DependsOnConstant
	}
	// The longest wording that fits the border (w − 2 cells), then shorter,
	// then without "?" (the verdict cell says "dep." itself).
	for level := range 3 {
		short := level > 0
		var legend []string
		if anyUnverified {
			legend = append(legend, map[bool]string{true: "* unverified", false: "* unverified α (r_crit band)"}[short])
		}
		if anyDepends && level < 2 {
			legend = append(legend, map[bool]string{true: "? dep. on α", false: "? depends on α"}[short])
		}
		if anyOut {
			legend = append(legend, map[bool]string{true: "! uncalibrated", false: "! outside calibrated range"}[short])
		}
		legend = append(legend, "d details")
		text := strings.Join(legend, cp.styles.sep())
		if visibleLen(text) <= w-2 || level == 2 {
			return text
		}
	}
	return ""
}

// Table widths: below compactWidth the narrow table (r_crit without its
// band, short verdicts); from fullWidth the ratio and the limit too.
const (
	compactWidth = 70
	fullWidth    = 100
)

// lines renders the table for a body w cells wide: the head and a row per
// criterion (the selected one is line selected+1).
func (cp criteriaPane) lines(w int) []string {
	if cp.outflowOn {
		return cp.outflowLines(w)
	}
	st := cp.styles
	compact, full := w < compactWidth, w >= fullWidth
	nameW := 24
	switch {
	case compact:
		nameW = 19
	case full:
		nameW = 26
	}
	scored := cp.scores != nil && len(cp.scores) == len(cp.res.Criteria)
	// The margin column gives way to the runs' score but in the full table.
	third := st.fit("margin", 8)
	if scored {
		third = st.fit("runs ok", 8)
		if full {
			third = st.fit("margin", 8) + st.fit("runs ok", 8)
		}
	}
	var head string
	switch {
	case cp.pin != nil && compact:
		head = st.fit("  criterion", nameW) + st.fit("r_crit A", 10) + st.fit("r_crit B", 10) + st.T("A → B")
	case cp.pin != nil:
		head = st.fit("  criterion", nameW) + st.fit("r_crit A", 11) + st.fit("r_crit B", 11) + st.fit("B/A", 7) + st.T("A → B")
	case compact:
		head = st.fit("  criterion", nameW) + st.fit("r_crit", 10) + third + "verdict"
	case full:
		head = st.fit("  criterion", nameW) + st.fit("ratio", 9) + st.fit("limit", 7) + st.fit("r_crit (band)", 24) + third + "verdict"
	default:
		head = st.fit("  criterion", nameW) + st.fit("r_crit (band)", 24) + third + "verdict"
	}
	lines := []string{st.Dim.Render(head)}
	for i := range cp.res.Criteria {
		c, o := &cp.res.Criteria[i], cp.res.Outcomes[i]
		name := st.fit(shortName(st, st.T(criterionName(c)), nameW-3), nameW-3) + " "
		if cp.focused && i == cp.selected {
			name = st.Selected.Render(st.cursor() + name)
		} else {
			name = st.Label.Render("  " + name)
		}
		rc := rcritText(st, o, false)
		cols := st.fit(st.Sig(o.Margin, 3), 7) + " "
		if scored {
			score := st.fit(scoreText(cp.scores[i]), 7) + " "
			if full {
				cols += score
			} else {
				cols = score
			}
		}
		var row string
		switch {
		case cp.pin != nil && compact:
			oa := cp.pin.Outcomes[i]
			row = name + st.fit(rcritText(st, oa, true), 9) + " " + st.fit(rcritText(st, o, true), 9) + " " + verdictGlyph(st, oa.Verdict) + st.T("→") + verdictGlyph(st, o.Verdict)
		case cp.pin != nil:
			oa := cp.pin.Outcomes[i]
			ratio := st.T("—")
			if o.HasThreshold() && oa.HasThreshold() {
				ratio = st.Sig(float64(o.RCrit/oa.RCrit), 3)
			}
			row = name + st.fit(rcritText(st, oa, true), 10) + " " + st.fit(rcritText(st, o, true), 10) + " " + st.fit(ratio, 6) + " " +
				verdictGlyph(st, oa.Verdict) + st.T("→") + verdictText(st, o.Verdict, true, o.DependsOnConstant)
		case compact:
			row = name + st.fit(rcritText(st, o, true), 9) + " " + cols + verdictText(st, o.Verdict, true, o.DependsOnConstant)
		case full:
			limit := st.Sig(o.Threshold, 3)
			if c.Cool == model.CoolNone {
				limit = st.T("—")
			}
			row = name + st.fit(st.Sig(o.Ratio, 3), 8) + " " + st.fit(limit, 6) + " " + st.fit(rc, 23) + " " + cols + verdictText(st, o.Verdict, false, o.DependsOnConstant)
		default:
			row = name + st.fit(rc, 23) + " " + cols + verdictText(st, o.Verdict, false, o.DependsOnConstant)
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

// criterionName is the name people read: the label (the id when a
// criteria file gives none).
func criterionName(c *model.Criterion) string { return chartspec.CriterionName(c) }

// shortName fits a criterion's name into w cells: whole, else without a
// trailing parenthesis ("Tan, Oh & Gronke 2023 (infall)" → "Tan, Oh &
// Gronke 2023"), then cut with an ellipsis.
func shortName(st *Styles, name string, w int) string {
	if visibleLen(name) <= w {
		return name
	}
	if i := strings.LastIndex(name, " ("); i > 0 && strings.HasSuffix(name, ")") {
		name = name[:i]
	}
	return st.fit(name, w)
}

// rcritText formats r_crit, "none" without a threshold, and unless short
// its band when the constant is unverified: "23.7 pc (11.9–47.4)".
func rcritText(st *Styles, o model.Outcome, short bool) string {
	if !o.HasThreshold() {
		return "none"
	}
	s := st.Format(model.DimLength, float64(o.RCrit))
	if !short && o.RCritHigh > o.RCritLow {
		s += " (" + st.Sig(float64(o.RCritLow/model.Parsec), 3) + st.T("–") + st.Sig(float64(o.RCritHigh/model.Parsec), 3) + ")"
	}
	return s
}

// scoreText is a criterion's score against simulation runs: hits/runs.
func scoreText(s model.Score) string {
	return strconv.Itoa(s.Hits) + "/" + strconv.Itoa(s.Hits+s.Misses)
}
