package tui

import (
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"

	"cloudwind/cooling"
	"cloudwind/model"
)

// BenchmarkStepView measures one parameter step (→ on χ), the
// re-evaluation it triggers and the next frame at 120×40 (the chart is
// drawn from the last data; its own recomputation runs off the update
// loop and is measured by BenchmarkChart*).
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

// BenchmarkChartRegime200x100 computes a regime map of 200×100 cells.
func BenchmarkChartRegime200x100(b *testing.B) {
	a := newTestApp(b, 120, 40)
	req := chartRequest{view: viewRegime, params: a.cur.params, cf: a.cur.cf, criteria: model.BuiltinCriteria(), cols: 200, rows: 100}
	for b.Loop() {
		m := computeChart(req).(chartMsg)
		if m.regime.NX != 200 || m.regime.NY != 100 {
			b.Fatal("wrong map size")
		}
	}
}

// BenchmarkChartRegimeMach200x100 is the χ × Mach map.
func BenchmarkChartRegimeMach200x100(b *testing.B) {
	a := newTestApp(b, 120, 40)
	req := chartRequest{view: viewRegime, mapMach: true, params: a.cur.params, cf: a.cur.cf, criteria: model.BuiltinCriteria(), cols: 200, rows: 100}
	for b.Loop() {
		computeChart(req)
	}
}

// BenchmarkChartThresholdFamily computes the threshold chart with a family
// of four Mach numbers.
func BenchmarkChartThresholdFamily(b *testing.B) {
	a := newTestApp(b, 120, 40)
	req := chartRequest{view: viewThreshold, family: true, params: a.cur.params, cf: a.cur.cf, criteria: model.BuiltinCriteria()}
	for b.Loop() {
		computeChart(req)
	}
}

// BenchmarkChartEvolution computes the evolution view: one trajectory per
// criterion to 100 t_cc.
func BenchmarkChartEvolution(b *testing.B) {
	a := newTestApp(b, 120, 40)
	req := chartRequest{view: viewEvolution, params: a.cur.params, cf: a.cur.cf, criteria: model.BuiltinCriteria()}
	for b.Loop() {
		computeChart(req)
	}
}

// BenchmarkChartPlan computes the plan view, comparison included.
func BenchmarkChartPlan(b *testing.B) {
	a := newTestApp(b, 120, 40)
	req := chartRequest{view: viewPlan, params: a.cur.params, cf: a.cur.cf, criteria: model.BuiltinCriteria()}
	for b.Loop() {
		computeChart(req)
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
