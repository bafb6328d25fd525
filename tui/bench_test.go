package tui

import (
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"

	"cloudwind/cooling"
	"cloudwind/internal/chartspec"
	"cloudwind/model"
)

// BenchmarkStepView measures one parameter step (→ on χ), the
// re-evaluation it triggers and the next frame at 120×40 (the chart is
// drawn from the last data; its own recomputation runs off the update
// loop and is measured by the benchmarks of internal/chartspec).
func BenchmarkStepView(b *testing.B) {
	a := newTestApp(b, 120, 40)
	right, left := tea.KeyMsg{Type: tea.KeyRight}, tea.KeyMsg{Type: tea.KeyLeft}
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		k := right
		if i%2 == 1 {
			k = left
		}
		a.Update(k)
		_ = a.View()
	}
}

// BenchmarkFirstFrame measures building the explorer and drawing its first
// complete frame (first chart included) at 120×40. The built-in cooling
// curve is built once per process and shared (sync.OnceValues).
func BenchmarkFirstFrame(b *testing.B) {
	for b.Loop() {
		a := newTestApp(b, 120, 40)
		_ = a.View()
	}
}

// BenchmarkPlanLines computes the plan view, comparison included.
func BenchmarkPlanLines(b *testing.B) {
	a := newTestApp(b, 120, 40)
	req := chartspec.Request{Params: a.cur.params, Cooling: a.cur.cf, Criteria: model.BuiltinCriteria()}
	for b.Loop() {
		planLines(req)
	}
}

// BenchmarkStepViewColour is BenchmarkStepView with 256-colour output, as
// a terminal gets it (the colour profile is set for this benchmark only).
func BenchmarkStepViewColour(b *testing.B) {
	prev := lipgloss.ColorProfile()
	lipgloss.SetColorProfile(termenv.ANSI256)
	defer lipgloss.SetColorProfile(prev)
	src, err := cooling.Resolve("cooling", "builtin", nil, fileOpener)
	if err != nil {
		b.Fatal(err)
	}
	a, err := New(Config{Params: testParams(), Cooling: src, Criteria: model.BuiltinCriteria(), Palette: DarkPalette(), Color: true})
	if err != nil {
		b.Fatal(err)
	}
	drain(a, a.Init())
	drain(a, func() tea.Msg { return tea.WindowSizeMsg{Width: 120, Height: 40} })
	right, left := tea.KeyMsg{Type: tea.KeyRight}, tea.KeyMsg{Type: tea.KeyLeft}
	for i := 0; b.Loop(); i++ {
		k := right
		if i%2 == 1 {
			k = left
		}
		a.Update(k)
		_ = a.View()
	}
}

// BenchmarkStepViewOutflow is BenchmarkStepView in the outflow view: a
// step of SFR, the wind and the criteria at its launch radius evaluated in
// Update (evalWind), and the next frame (the profile is recomputed off the
// update loop, measured by internal/chartspec's BenchmarkOutflowProfile).
func BenchmarkStepViewOutflow(b *testing.B) {
	a := newTestApp(b, 120, 40)
	press(a, "7")
	right, left := tea.KeyMsg{Type: tea.KeyRight}, tea.KeyMsg{Type: tea.KeyLeft}
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		k := right
		if i%2 == 1 {
			k = left
		}
		a.Update(k)
		_ = a.View()
	}
}
