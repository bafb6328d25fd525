package tui

import (
	"strings"
	"testing"

	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
)

// TestLegendsComplete80x24: at 80×24, in the panes and full screen, every
// curve of every line chart is named in the legend.
func TestLegendsComplete80x24(t *testing.T) {
	for _, zoom := range []bool{false, true} {
		a := newTestApp(t, 80, 24)
		if zoom {
			press(a, "z")
		}
		for _, v := range []string{"1", "2", "3", "5", "7", "c"} { // c: the outflow view's carried cloud
			press(a, v)
			c := a.chart.Shown()
			s := screen(a)
			for _, lc := range []*chartspec.LineChart{c.line, c.line2} {
				if lc == nil {
					continue
				}
				for _, sr := range lc.Series {
					if name := quantity.Sanitize(sr.Name); !legendNames(s, name) {
						t.Errorf("view %s (zoom %v) at 80×24: the legend lacks %q\n%s", v, zoom, name, s)
					}
				}
				if len(lc.Zones) > 0 && !strings.Contains(s, "━ "+lc.ZoneName) {
					t.Errorf("view %s (zoom %v) at 80×24: the legend lacks the zones' entry %q\n%s", v, zoom, lc.ZoneName, s)
				}
			}
			if v == "7" && (c.line == nil || len(c.line.Zones) == 0) {
				t.Errorf("the outflow view (zoom %v) marks no zone where the criteria disagree", zoom)
			}
		}
	}
}

// legendNames reports whether screen s names a curve called name in its
// legend: in full, without a trailing parenthesis, or cut with "…" after
// at least 8 of its characters (the shortening of tui/chart's legends).
func legendNames(s, name string) bool {
	if strings.Contains(s, name) {
		return true
	}
	if i := strings.LastIndex(name, " ("); i > 0 && strings.HasSuffix(name, ")") {
		name = name[:i]
		if strings.Contains(s, name+"  ") || strings.Contains(s, name+" │") || strings.Contains(s, name+"│") || strings.Contains(s, name+" (overlaps") {
			return true
		}
	}
	rs := []rune(name)
	for n := len(rs) - 1; n >= 8; n-- {
		if strings.Contains(s, string(rs[:n])+"…") {
			return true
		}
	}
	return false
}

// TestScrollKeepsSelection: with every input shown at 80×24 the inputs pane
// scrolls; whichever input is selected, its row is on screen, and the
// pane says what is above and below.
func TestScrollKeepsSelection(t *testing.T) {
	a := newTestApp(t, 80, 24)
	press(a, "a")
	n := len(a.in.visible())
	sawAbove, sawBelow := false, false
	for i := 0; i < 2*n; i++ {
		in := a.in.Current()
		s := screen(a)
		if !strings.Contains(s, "▸ "+a.styles.fit(in.label, 9)) {
			t.Fatalf("input %d (%s) selected but not on screen:\n%s", i%n, in.label, s)
		}
		sawAbove = sawAbove || strings.Contains(s, " above · PgUp/PgDn")
		sawBelow = sawBelow || strings.Contains(s, " more · PgUp/PgDn")
		press(a, "down")
	}
	if !sawAbove || !sawBelow {
		t.Errorf("the scrolled inputs pane never said what is above (%v) or below (%v)", sawAbove, sawBelow)
	}
	press(a, "end")
	if a.in.Current().field != fieldCooling {
		t.Errorf("end selects %s, want the last input", a.in.Current().field)
	}
	press(a, "home")
	if a.in.selected != 0 {
		t.Errorf("home selects input %d, want the first", a.in.selected)
	}
}

// TestScrollHintFollowsFocus: a scrolled pane without the focus says to
// tab to it; with the focus it says how to scroll, never "tab here".
func TestScrollHintFollowsFocus(t *testing.T) {
	a := newTestApp(t, 120, 30)
	press(a, "6")
	if !strings.Contains(screen(a), "more · tab here or z") {
		t.Fatalf("the plan without the focus does not say how to reach it:\n%s", screen(a))
	}
	press(a, "shift+tab") // inputs → chart
	if a.focus != focusChart {
		t.Fatalf("shift+tab from the inputs gives the focus to %s, want the chart", a.focus)
	}
	s := screen(a)
	if strings.Contains(s, "tab here") || !strings.Contains(s, "more · PgUp/PgDn") {
		t.Errorf("the focused plan still says tab here, or not how to scroll:\n%s", s)
	}
	press(a, "end")
	lines := a.chart.textLines(a.chart.width - 2)
	if last := strings.TrimSpace(lines[len(lines)-1]); !strings.Contains(screen(a), last) {
		t.Errorf("end does not show the plan's last line %q:\n%s", last, screen(a))
	}
}

// TestZoom: z gives the chart the whole body at 80×24, the keys still
// change the selected input and the status line shows it, esc goes back.
func TestZoom(t *testing.T) {
	a := newTestApp(t, 80, 24)
	_, h := a.chartSize()
	press(a, "z")
	_, hz := a.chartSize()
	if !a.zoom || hz != 24-3-2 || hz <= h {
		t.Fatalf("zoom: chart %d rows, want the body less its border (%d), more than %d", hz, 24-5, h)
	}
	if strings.Contains(screen(a), "Criteria") {
		t.Error("the full-screen chart still shows the criteria pane")
	}
	chi := a.cur.params.Chi
	press(a, "right")
	if a.cur.params.Chi <= chi || !strings.Contains(screen(a), "χ = "+quantity.FormatSig(a.cur.params.Chi, 3)) {
		t.Errorf("→ in the full-screen chart: χ %g → %g, status line:\n%s", chi, a.cur.params.Chi, screen(a))
	}
	if !strings.Contains(screen(a), "criteria predict survival") {
		t.Error("the full-screen status line does not count the verdicts")
	}
	press(a, "esc")
	if a.zoom {
		t.Error("esc did not leave the full-screen chart")
	}
}

// TestHelpColumnsApart: at 80×24 every binding of the help reads whole,
// key and description, with columns apart, on one of its pages.
func TestHelpColumnsApart(t *testing.T) {
	a := newTestApp(t, 80, 24)
	press(a, "?")
	var pages strings.Builder
	for range 5 {
		pages.WriteString(screen(a))
		press(a, "pgdown")
	}
	text := pages.String()
	for _, g := range a.keys.groups() {
		for _, b := range g.keys {
			h := b.Help()
			if !strings.Contains(text, h.Key) || !strings.Contains(text, h.Desc+"  ") && !strings.Contains(text, h.Desc+" │") {
				t.Errorf("help at 80×24 lacks %q %q whole, with space after it", h.Key, h.Desc)
			}
		}
	}
}

// TestEveryViewReadable80x24: no chart at 80×24, in the panes or full
// screen, says "too small".
func TestEveryViewReadable80x24(t *testing.T) {
	for _, keys := range [][]string{nil, {"z"}} {
		a := newTestApp(t, 80, 24)
		press(a, keys...)
		for v := viewThreshold; v < viewCount; v++ {
			press(a, string(rune('1'+int(v))))
			if s := screen(a); strings.Contains(s, "too small") {
				t.Errorf("view %d (%v) at 80×24 is too small:\n%s", v+1, keys, s)
			}
		}
	}
}
