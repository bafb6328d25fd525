package tui

import (
	"strconv"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/chartspec"
	"cloudwind/tui/chart"
)

// viewKind is the chart on screen.
type viewKind int

const (
	viewThreshold viewKind = iota // r_crit vs χ
	viewCooling                   // Λ(T)
	viewRatios                    // τ_cool/τ_dyn vs r_cl
	viewRegime                    // regime map
	viewEvolution                 // m/m0 and v/v_w vs t/t_cc
	viewPlan                      // simulation plan
	viewCount
)

func (v viewKind) String() string {
	return [...]string{"threshold radius vs χ", "cooling curve Λ(T)", "timescale ratios vs r_cl", "regime map",
		"evolution vs t/t_cc", "simulation plan"}[v]
}

// chartState is a chart received: the data of one view and the request
// it answers.
type chartState struct {
	gen    int
	view   viewKind
	line   *chartspec.LineChart
	line2  *chartspec.LineChart // the evolution view's second chart (v/v_w)
	regime *chartspec.RegimeMap
	text   []string // the plan view
}

// chartPane shows one chart: which one, with which options (a family
// over Mach numbers, the map's axes), and the latest data received. The
// chart is computed in a command from a copied request; each request has
// a new generation, and data of an older one is dropped when it arrives.
// The chart keys are global, so the App handles them and sets the pane.
type chartPane struct {
	styles        *Styles
	keys          *KeyMap
	width, height int
	focused       bool     // the pane has the focus: ↑/↓ and the page keys scroll the plan text
	scroll        scroller // the plan text

	kind    viewKind
	family  bool // threshold chart: the selected criterion at four Mach numbers
	mapMach bool // regime map: χ × Mach
	gen     int  // generation of the latest request
	shown   chartState
}

func newChartPane(styles *Styles, keys *KeyMap) chartPane {
	return chartPane{styles: styles, keys: keys}
}

// SetSize sets the pane's size, border included.
func (cp *chartPane) SetSize(w, h int) { cp.width, cp.height = w, h }

// SetFocused says whether the pane has the focus.
func (cp *chartPane) SetFocused(f bool) { cp.focused = f }

// Kind returns the chart chosen.
func (cp *chartPane) Kind() viewKind { return cp.kind }

// SetKind chooses the chart.
func (cp *chartPane) SetKind(v viewKind) {
	if v != cp.kind {
		cp.scroll = scroller{}
	}
	cp.kind = v
}

// IsText reports whether the chosen view is text (the plan), which
// scrolls and exports as text.
func (cp *chartPane) IsText() bool { return cp.kind == viewPlan }

// ToggleFamily switches the family mode and returns it.
func (cp *chartPane) ToggleFamily() bool { cp.family = !cp.family; return cp.family }

// ToggleMapAxis switches the map's y axis between r_cl and Mach and
// reports whether it is Mach now.
func (cp *chartPane) ToggleMapAxis() bool { cp.mapMach = !cp.mapMach; return cp.mapMach }

// Shown returns the chart on screen.
func (cp *chartPane) Shown() chartState { return cp.shown }

// Request starts computing the chosen chart from req, with the pane's
// options; results of older requests are dropped when they arrive.
func (cp *chartPane) Request(req chartspec.Request) tea.Cmd {
	cp.gen++
	req.Family, req.MapMach = cp.family, cp.mapMach
	return computeChart(cp.gen, cp.kind, req)
}

// Update takes the chart data of the latest request, and scrolls the
// plan text by a key.
func (cp chartPane) Update(msg tea.Msg) (chartPane, tea.Cmd) {
	switch m := msg.(type) {
	case chartMsg:
		if m.gen == cp.gen { // stale results are dropped
			cp.shown = chartState{gen: m.gen, view: m.view, line: m.line, line2: m.line2, regime: m.regime, text: m.text}
		}
	case tea.KeyMsg:
		if c := cp.shown; c.text != nil && c.view == cp.kind {
			cp.scroll.scrollKey(m, cp.keys, len(cp.textLines(cp.width-2)), cp.height-2)
		}
	}
	return cp, nil
}

// textLines returns the plan text wrapped to w cells.
func (cp chartPane) textLines(w int) []string {
	st := cp.styles
	var lines []string
	for _, l := range cp.shown.text {
		lines = append(lines, st.T(l))
	}
	return wrapLines(lines, w)
}

// Title names the chart.
func (cp chartPane) Title() string {
	t := strconv.Itoa(int(cp.kind)+1) + " " + cp.kind.String()
	if cp.kind == viewThreshold && cp.family {
		t += " (family)"
	}
	if cp.kind == viewRegime && cp.mapMach {
		t += " (χ × Mach)"
	}
	return t
}

// View draws the pane in its border.
func (cp chartPane) View() string {
	return strings.Join(box(cp.Title(), cp.body(cp.width-2, cp.height-2), cp.width, cp.height, cp.focused, cp.styles), "\n")
}

// body draws the latest chart in w×h cells, or a note while the first
// one is computed.
func (cp chartPane) body(w, h int) []string {
	c, st := cp.shown, &cp.styles.Chart
	var s string
	switch {
	case c.view != cp.kind || (c.line == nil && c.regime == nil && c.text == nil):
		return cp.styles.block([]string{cp.styles.Dim.Render(cp.styles.T("computing…"))}, w, h)
	case c.text != nil:
		hint := "tab here or z"
		if cp.focused {
			hint = "PgUp/PgDn"
		}
		return cp.styles.block(cp.scroll.window(cp.textLines(w), h, -1, hint, cp.styles), w, h)
	case c.line2 != nil:
		s = chart.RenderPanels([]*chartspec.LineChart{c.line, c.line2}, w, h, st)
	case c.line != nil:
		s = chart.RenderLine(c.line, w, h, st)
	default:
		s = chart.RenderRegimeMap(c.regime, w, h, st)
	}
	return cp.styles.block(strings.Split(s, "\n"), w, h)
}
