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
	width, height int

	kind    viewKind
	family  bool // threshold chart: the selected criterion at four Mach numbers
	mapMach bool // regime map: χ × Mach
	gen     int  // generation of the latest request
	shown   chartState
}

func newChartPane(styles *Styles) chartPane { return chartPane{styles: styles} }

// SetSize sets the pane's size, border included.
func (cp *chartPane) SetSize(w, h int) { cp.width, cp.height = w, h }

// Kind returns the chart chosen.
func (cp *chartPane) Kind() viewKind { return cp.kind }

// SetKind chooses the chart.
func (cp *chartPane) SetKind(v viewKind) { cp.kind = v }

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

// Update takes the chart data of the latest request.
func (cp chartPane) Update(msg tea.Msg) (chartPane, tea.Cmd) {
	if m, ok := msg.(chartMsg); ok && m.gen == cp.gen { // stale results are dropped
		cp.shown = chartState{gen: m.gen, view: m.view, line: m.line, line2: m.line2, regime: m.regime, text: m.text}
	}
	return cp, nil
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
	return strings.Join(box(cp.Title(), cp.body(cp.width-2, cp.height-2), cp.width, cp.height, false, cp.styles), "\n")
}

// body draws the latest chart in w×h cells, or a note while the first
// one is computed.
func (cp chartPane) body(w, h int) []string {
	c, st := cp.shown, &cp.styles.Chart
	var s string
	switch {
	case c.view != cp.kind || (c.line == nil && c.regime == nil && c.text == nil):
		return block([]string{cp.styles.Dim.Render("computing…")}, w, h)
	case c.text != nil:
		return block(wrapLines(c.text, w), w, h)
	case c.line2 != nil:
		top := h / 2
		s = chart.RenderLine(c.line, w, top, st) + "\n" + chart.RenderLine(c.line2, w, h-top, st)
	case c.line != nil:
		s = chart.RenderLine(c.line, w, h, st)
	default:
		s = chart.RenderRegimeMap(c.regime, w, h, st)
	}
	return block(strings.Split(s, "\n"), w, h)
}
