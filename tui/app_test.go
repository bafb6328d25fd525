package tui

import (
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// fileOpener opens real files, as main does.
func fileOpener(path string) (io.Reader, string, func(), error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, "", nil, err
	}
	return f, path, func() { f.Close() }, nil
}

// testParams is a fixed state for the tests: the Gronke & Oh fiducial
// problem at χ = 300 and r_cl = 10 pc (inputs of this test, no source).
func testParams() model.Params {
	p := model.Fiducial()
	p.Chi, p.RCloud = 300, 10*model.Parsec
	return p
}

// newTestApp builds an explorer at w×h without colour, with the built-in
// cooling function and every command's result fed back through Update.
func newTestApp(t testing.TB, w, h int) *App {
	t.Helper()
	return newTestAppWith(t, w, h, nil)
}

// newTestAppWith is newTestApp with the configuration changed by edit
// (nil for none) before the explorer is built.
func newTestAppWith(t testing.TB, w, h int, edit func(*Config)) *App {
	t.Helper()
	src, err := cooling.Resolve("cooling", "builtin", nil, fileOpener)
	if err != nil {
		t.Fatal(err)
	}
	demos, err := scenario.Demos()
	if err != nil {
		t.Fatal(err)
	}
	cfg := Config{Params: testParams(), Cooling: src, Criteria: model.BuiltinCriteria(), Palette: DarkPalette(),
		Color: false, Open: fileOpener, Version: "test", Demos: demos}
	if edit != nil {
		edit(&cfg)
	}
	a, err := New(cfg)
	if err != nil {
		t.Fatal(err)
	}
	drain(a, a.Init())
	drain(a, func() tea.Msg { return tea.WindowSizeMsg{Width: w, Height: h} })
	return a
}

// drain runs cmd and feeds its messages back until nothing is left. It
// reports whether a quit was requested.
func drain(a *App, cmd tea.Cmd) (quit bool) {
	for cmd != nil {
		msg := cmd()
		switch m := msg.(type) {
		case tea.QuitMsg:
			return true
		case tea.BatchMsg:
			for _, c := range m {
				quit = drain(a, c) || quit
			}
			return quit
		case nil:
			return false
		}
		_, cmd = a.Update(msg)
	}
	return false
}

// press sends keys, running the resulting commands.
func press(a *App, keys ...string) (quit bool) {
	for _, k := range keys {
		var msg tea.KeyMsg
		switch k {
		case "right":
			msg = tea.KeyMsg{Type: tea.KeyRight}
		case "left":
			msg = tea.KeyMsg{Type: tea.KeyLeft}
		case "up":
			msg = tea.KeyMsg{Type: tea.KeyUp}
		case "down":
			msg = tea.KeyMsg{Type: tea.KeyDown}
		case "enter":
			msg = tea.KeyMsg{Type: tea.KeyEnter}
		case "esc":
			msg = tea.KeyMsg{Type: tea.KeyEsc}
		case "tab":
			msg = tea.KeyMsg{Type: tea.KeyTab}
		case "shift+right":
			msg = tea.KeyMsg{Type: tea.KeyShiftRight}
		case "ctrl+u":
			msg = tea.KeyMsg{Type: tea.KeyCtrlU}
		case "backspace":
			msg = tea.KeyMsg{Type: tea.KeyBackspace}
		case "pgdown":
			msg = tea.KeyMsg{Type: tea.KeyPgDown}
		case "pgup":
			msg = tea.KeyMsg{Type: tea.KeyPgUp}
		case "home":
			msg = tea.KeyMsg{Type: tea.KeyHome}
		case "end":
			msg = tea.KeyMsg{Type: tea.KeyEnd}
		case "shift+tab":
			msg = tea.KeyMsg{Type: tea.KeyShiftTab}
		default:
			msg = tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(k)}
		}
		_, cmd := a.Update(msg)
		if drain(a, cmd) {
			quit = true
		}
	}
	return quit
}

// typeText types text into an open text field.
func typeText(a *App, text string) {
	_, cmd := a.Update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(text)})
	drain(a, cmd)
}

// screen returns the frame without styling.
func screen(a *App) string { return ansi.Strip(a.View()) }

func TestStepChi(t *testing.T) {
	a := newTestApp(t, 120, 40)
	before := a.cur.params.Chi
	rBefore := a.res.Outcomes[0].RCrit
	press(a, "right")
	if got, want := a.cur.params.Chi, before*1.1220184543019633; !near(got, want, 1e-12) { // one fine step: ×10^0.05 (input definition)
		t.Errorf("χ after → = %g, want %g", got, want)
	}
	if a.res.Outcomes[0].RCrit == rBefore {
		t.Error("r_crit of gronke-oh-2018 did not change with χ")
	}
	if !strings.Contains(screen(a), quantity.FormatSig(a.cur.params.Chi, 3)) {
		t.Errorf("the new χ %s is not on screen", quantity.FormatSig(a.cur.params.Chi, 3))
	}
	press(a, "shift+right") // a coarse step: ten fine ones
	if got, want := a.cur.params.Chi, before*1.1220184543019633*math10(0.5); !near(got, want, 1e-9) {
		t.Errorf("χ after shift+→ = %g, want %g", got, want)
	}
	press(a, "u", "u")
	if a.cur.params.Chi != before {
		t.Errorf("χ after two undos = %g, want %g", a.cur.params.Chi, before)
	}
}

func near(a, b, tol float64) bool { return a == b || (a-b)/b < tol && (b-a)/b < tol }

func math10(x float64) float64 { return math.Pow(10, x) }

func TestTypedValues(t *testing.T) {
	a := newTestApp(t, 120, 40)
	// Select r_cl (sixth input) and type a value with a unit.
	press(a, "down", "down", "down", "down", "down", "enter", "ctrl+u")
	typeText(a, "30 pc")
	press(a, "enter")
	if got := a.cur.params.RCloud / model.Parsec; !near(float64(got), 30, 1e-12) {
		t.Fatalf("r_cl after typing 30 pc = %g pc", float64(got))
	}
	// A bad unit is refused with the reason; the last good state stays.
	press(a, "enter", "ctrl+u")
	typeText(a, "3 parsecs")
	press(a, "enter")
	if !a.status.isErr || !strings.Contains(a.status.text, `unknown unit "parsecs"`) {
		t.Errorf("status after a bad unit: %+v", a.status)
	}
	if got := a.cur.params.RCloud / model.Parsec; !near(float64(got), 30, 1e-12) {
		t.Errorf("r_cl changed to %g pc after a refused value", float64(got))
	}
	// χ = 0.5 parses but is not physical: refused, naming the input.
	press(a, "up", "up", "up", "up", "up", "enter", "ctrl+u")
	typeText(a, "0.5")
	press(a, "enter")
	if !a.status.isErr || !strings.Contains(a.status.text, "χ: must be greater than 1") || a.cur.params.Chi != 300 {
		t.Errorf("χ = 0.5: status %+v, χ %g", a.status, a.cur.params.Chi)
	}
	if !strings.Contains(screen(a), "χ: must be greater than 1") {
		t.Error("the refusal is not in the status line")
	}
}

func TestStaleChartDropped(t *testing.T) {
	a := newTestApp(t, 120, 40)
	old := a.requestChart()
	fresh := a.requestChart()
	drain(a, fresh)
	got := a.chart.shown
	drain(a, old) // arrives late: its generation is stale
	if a.chart.shown.gen != got.gen || a.chart.shown.gen != a.chart.gen {
		t.Errorf("a stale chart replaced the current one: gen %d, want %d", a.chart.shown.gen, a.chart.gen)
	}
}

func TestViewsAndFocus(t *testing.T) {
	a := newTestApp(t, 120, 40)
	for i, want := range []string{"threshold radius vs χ", "cooling curve", "timescale ratios", "regime map", "cloud mass m/m₀", "Plan for a growth study", "r_crit vs r/R"} {
		press(a, string(rune('1'+i)))
		if s := screen(a); !strings.Contains(s, want) {
			t.Errorf("view %d: %q not on screen", i+1, want)
		}
		if a.chart.shown.view != viewKind(i) {
			t.Errorf("view %d: chart of view %d on screen", i+1, a.chart.shown.view+1)
		}
	}
	press(a, "tab", "tab", "down", "d")
	if !a.details.Open() || !strings.Contains(screen(a), "arXiv:1909.02632") {
		t.Errorf("details of li-2020 (second criterion) not shown:\n%s", screen(a))
	}
	press(a, "esc", "?")
	if !strings.Contains(screen(a), "type a value") {
		t.Error("help overlay lacks the keymap's help text")
	}
	press(a, "esc")
	if press(a, "q") != true {
		t.Error("q did not quit")
	}
}

func TestCompareMode(t *testing.T) {
	a := newTestApp(t, 120, 40)
	press(a, "p", "right", "right")
	s := screen(a)
	if !strings.Contains(s, "r_crit A") || !strings.Contains(s, "B/A") {
		t.Errorf("compare mode table missing:\n%s", s)
	}
	if a.pin == nil || a.pin.params.Chi == a.cur.params.Chi {
		t.Fatal("pin did not keep A")
	}
	press(a, "P")
	if a.pin != nil || strings.Contains(screen(a), "r_crit A") {
		t.Error("unpin did not leave compare mode")
	}
}

func TestAdvancedCooling(t *testing.T) {
	a := newTestApp(t, 120, 40)
	press(a, "a")
	for a.in.Current().field != "cooling" {
		press(a, "down")
	}
	press(a, "right") // the next named cooling function
	if a.cur.cooling.Spec != "builtin-hhe" {
		t.Errorf("cooling after → = %q, want builtin-hhe (the next name)", a.cur.cooling.Spec)
	}
	press(a, "enter", "ctrl+u")
	typeText(a, "const:10^-21.4")
	press(a, "enter")
	if _, ok := a.cur.cf.(model.ConstantCooling); !ok {
		t.Errorf("typed const cooling not applied: %T", a.cur.cf)
	}
	press(a, "enter", "ctrl+u")
	typeText(a, "no-such-table.txt")
	press(a, "enter")
	if !a.status.isErr {
		t.Error("a missing table file gave no error")
	}
	if _, ok := a.cur.cf.(model.ConstantCooling); !ok {
		t.Error("a failed cooling change replaced the cooling function")
	}
}

func TestScenarioFiles(t *testing.T) {
	a := newTestApp(t, 120, 40)
	dir := t.TempDir()
	path := filepath.Join(dir, "s.toml")
	press(a, "right", "s", "ctrl+u")
	typeText(a, path)
	press(a, "enter")
	if a.status.isErr {
		t.Fatalf("save: %s", a.status.text)
	}
	f, _ := os.Open(path)
	sc, err := scenario.Parse(f, path)
	f.Close()
	if err != nil || !near(sc.Params.Chi, a.cur.params.Chi, 1e-15) {
		t.Fatalf("saved scenario: %v, χ %g want %g", err, sc.Params.Chi, a.cur.params.Chi)
	}
	// A bad file explains the line and keeps the state.
	os.WriteFile(path, []byte("[inputs]\nchi = 300\nmach = -1\n"), 0o644)
	chi := a.cur.params.Chi
	press(a, "o", "up", "enter", "ctrl+u")
	typeText(a, path)
	press(a, "enter")
	if !a.status.isErr || !strings.Contains(a.status.text, ":3:") || a.cur.params.Chi != chi {
		t.Errorf("bad scenario: status %+v, χ %g (want an error naming line 3 and χ %g)", a.status, a.cur.params.Chi, chi)
	}
	// A demo loads.
	press(a, "o", "enter")
	if a.scenario == "" || !strings.Contains(a.scenario, "Demo (fictional)") {
		t.Errorf("demo not loaded: scenario %q, status %+v", a.scenario, a.status)
	}
}

// TestExportFromPrompt exports the chart and the state through their
// prompts, and refuses an empty path.
func TestExportFromPrompt(t *testing.T) {
	a := newTestApp(t, 120, 40)
	dir := t.TempDir()
	svg, js := filepath.Join(dir, "c.svg"), filepath.Join(dir, "s.json")
	press(a, "x", "ctrl+u")
	typeText(a, svg)
	press(a, "enter", "J", "ctrl+u")
	typeText(a, js)
	press(a, "enter")
	for _, p := range []string{svg, js} {
		if st, err := os.Stat(p); err != nil || st.Size() == 0 {
			t.Errorf("export to %s: %v (status %+v)", p, err, a.status)
		}
	}
	press(a, "s", "ctrl+u", "enter")
	if !a.status.isErr || a.status.text != "no file name given" || a.prompt.Open() {
		t.Errorf("empty path: status %+v, prompt open %v", a.status, a.prompt.Open())
	}
}

// TestEverySize draws every view (the outflow view's carried cloud too),
// in the panes and full screen, at every size from 0×0 to 130×45 (in
// steps) and requires exactly the window's lines and widths, "terminal too
// small" below 60×16, no panic.
func TestEverySize(t *testing.T) {
	a := newTestApp(t, 120, 40)
	views := []string{"1", "2", "3", "4", "5", "6", "7", "c"} // c: the outflow view's carried cloud
	for pass := range 2 {
		if pass == 1 {
			press(a, "c", "z", "a") // back to r_crit along r; the full-screen chart, and every input
		}
		for _, v := range views {
			press(a, v)
			for w := 0; w <= 130; w += 7 {
				for h := 0; h <= 45; h += 3 {
					a.Update(tea.WindowSizeMsg{Width: w, Height: h}) // the chart keeps its last data; drawing is what is tested
					out := a.View()
					if w == 0 || h == 0 {
						continue
					}
					lines := strings.Split(out, "\n")
					if len(lines) != h {
						t.Fatalf("view %s at %d×%d: %d lines", v, w, h, len(lines))
					}
					for i, l := range lines {
						if n := ansi.StringWidth(l); n != w {
							t.Fatalf("view %s at %d×%d: line %d is %d wide: %q", v, w, h, i, n, ansi.Strip(l))
						}
					}
					small, says := w < minWidth || h < minHeight, strings.Contains(out, "terminal too small")
					if w >= 20 && h >= 3 && small != says { // the note needs 20×3 to be read whole
						t.Fatalf("view %s at %d×%d: too small %v, says so %v", v, w, h, small, says)
					}
				}
			}
		}
	}
}

// TestReadmeCapture keeps the README's screen capture equal to the golden
// view it was taken from.
func TestReadmeCapture(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	golden, err := os.ReadFile(filepath.Join("testdata", "TestGoldenViews", "threshold_80x24.golden"))
	if err != nil {
		t.Fatal(err)
	}
	var lines []string
	for _, l := range strings.Split(strings.TrimRight(string(golden), "\n"), "\n") {
		lines = append(lines, strings.TrimRight(l, " "))
	}
	if !strings.Contains(string(readme), strings.Join(lines, "\n")) {
		t.Error("README.md's explorer capture differs from testdata/TestGoldenViews/threshold_80x24.golden; paste the golden into the README")
	}
}
