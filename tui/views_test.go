package tui

import (
	"strings"
	"testing"

	"cloudwind/internal/quantity"
	"cloudwind/tui/internal/golden"
)

// A viewCase is a state of the explorer reached by keys from the start.
type viewCase struct {
	name string
	keys []string
}

// viewCases are the states every golden and ASCII test draws: each chart,
// each overlay, compare mode, the full-screen chart, scrolled panes and
// the text field.
func viewCases() []viewCase {
	down := func(n int) []string { return strings.Split(strings.Repeat("down ", n), " ")[:n] }
	return []viewCase{
		{"threshold", []string{"1"}},
		{"cooling", []string{"2"}},
		{"ratios", []string{"3"}},
		{"regime", []string{"4"}},
		{"evolution", []string{"5"}},
		{"plan", []string{"6"}},
		{"details", []string{"tab", "tab", "d"}},
		{"help", []string{"?"}},
		{"help_scrolled", []string{"?", "pgdown"}},
		{"compare", []string{"p", "right", "right"}},
		{"zoom_threshold", []string{"z"}},
		{"zoom_evolution", []string{"5", "z"}},
		{"zoom_plan_end", []string{"6", "z", "end"}},
		{"plan_focused", []string{"6", "shift+tab", "pgdown"}},
		{"advanced", append([]string{"a"}, down(12)...)},
		{"editing", append(down(5), "enter")},
		{"derived_focused", append([]string{"tab"}, down(15)...)},
		{"details_input", []string{"d"}},
		{"details_derived", []string{"tab", "down", "d"}},
		{"details_cooling", []string{"a", "up", "d"}},
		{"scenarios", []string{"o"}},
		{"details_shocked", []string{"tab", "tab", "down", "d"}},
		{"details_turbulent", append(append([]string{"tab", "tab"}, down(6)...), "d")},
		{"outcomes", []string{"O", "enter"}},
		{"outcomes_regime", []string{"O", "enter", "4"}},
		{"outcomes_details", []string{"O", "enter", "tab", "tab", "d", "end"}},
		{"outcomes_zoom", []string{"O", "enter", "z"}},
		{"cold", coldKeys()},
		{"cold_regime", append(coldKeys(), "4")},
		{"cold_details", append(coldKeys(), "tab", "tab", "down", "down", "down", "down", "d")},
		{"outflow", []string{"7"}},
		{"outflow_carried", []string{"7", "c"}},
		{"outflow_details", []string{"7", "shift+tab", "d"}},
		{"outflow_input_details", append(append([]string{"7"}, down(8)...), "d")},
		{"outflow_demo", append(demoKeys(5), "7")},
		{"outflow_demo_carried", append(demoKeys(5), "7", "c")},
		{"zoom_outflow", []string{"7", "z"}},
	}
}

// demoKeys open demo scenario n (1-based) from the scenario menu.
func demoKeys(n int) []string {
	keys := []string{"o"}
	for range n - 1 {
		keys = append(keys, "down")
	}
	return append(keys, "enter")
}

// coldKeys type a cold cloud: χ = 3000, P/k_B = 10⁴ K cm⁻³, T_cl = 800 K,
// r_cl = 3 pc, where farber-gronke-2022 predicts "transformed" (inputs of
// this test; chartspec's TestChartsNameCriteriaByLabel checks the verdict).
func coldKeys() []string {
	return []string{"enter", "3000", "enter", "down", "down", "enter", "1e4", "enter", "down", "down", "enter", "800", "enter",
		"down", "enter", "3", "enter", "up", "up", "up", "up", "up"}
}

// TestGoldenViews compares every view case at 80×24 and 120×40 with
// golden files (no colour), and a few with --ascii.
func TestGoldenViews(t *testing.T) {
	for _, size := range [][2]int{{80, 24}, {120, 40}} {
		w, h := size[0], size[1]
		for _, vc := range viewCases() {
			a := newTestApp(t, w, h)
			press(a, vc.keys...)
			golden.Check(t, "TestGoldenViews", sizeName(vc.name, w, h), screen(a))
		}
		for _, name := range []string{"threshold", "compare", "help", "plan", "outcomes", "cold_regime", "outflow", "outflow_carried", "outflow_demo"} {
			a := newTestAppWith(t, w, h, func(c *Config) { c.ASCII = true })
			for _, vc := range viewCases() {
				if vc.name == name {
					press(a, vc.keys...)
				}
			}
			golden.Check(t, "TestGoldenViews", sizeName("ascii_"+name, w, h), screen(a))
		}
	}
}

// TestASCIIOnly draws every view case at 80×24 and 120×40 with --ascii,
// with and without colour, and requires every byte of the frame to be
// ASCII (colour escapes are ASCII too).
func TestASCIIOnly(t *testing.T) {
	for _, size := range [][2]int{{80, 24}, {120, 40}} {
		for _, color := range []bool{false, true} {
			for _, vc := range viewCases() {
				a := newTestAppWith(t, size[0], size[1], func(c *Config) { c.ASCII, c.Color = true, color })
				press(a, vc.keys...)
				checkASCII(t, vc.name, size, a.View())
				press(a, "x") // the export prompt, and the status line's messages
				checkASCII(t, vc.name+" + x", size, a.View())
				press(a, "esc", "right", "right", "right", "right", "right", "right", "right", "right", "right", "right", "right")
				checkASCII(t, vc.name+" + steps", size, a.View())
			}
		}
	}
}

func checkASCII(t *testing.T, what string, size [2]int, frame string) {
	t.Helper()
	for i := 0; i < len(frame); i++ {
		if frame[i] >= 0x80 {
			line := frame[strings.LastIndexByte(frame[:i], '\n')+1:]
			if j := strings.IndexByte(line, '\n'); j >= 0 {
				line = line[:j]
			}
			t.Errorf("%s at %d×%d with --ascii: byte 0x%x in %q", what, size[0], size[1], frame[i], line)
			return
		}
	}
}

func sizeName(s string, w, h int) string {
	return s + "_" + itoa(w) + "x" + itoa(h)
}

func itoa(n int) string { return strings.TrimSpace(quantity.FormatSig(float64(n), 6)) }
