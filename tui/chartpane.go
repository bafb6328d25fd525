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
	viewOutflow                   // r_crit vs r along an outflow, or the carried cloud
	viewCount
)

func (v viewKind) String() string {
	return [...]string{"threshold radius vs χ", "cooling curve Λ(T)", "timescale ratios vs r_cl", "regime map",
		"evolution vs t/t_cc", "simulation plan", "outflow: r_crit vs r/R"}[v]
}

// chartState is a chart received: the data of one view and the request
// it answers.
type chartState struct {
	gen     int
	view    viewKind
	carry   bool // the outflow view's carried cloud
	line    *chartspec.LineChart
	line2   *chartspec.LineChart // the second panel: v/v_w of the evolution view, v of the carried cloud
	regime  *chartspec.RegimeMap
	text    []string           // the plan view
	outflow *chartspec.Outflow // the outflow view's data; nil when its wind is not valid
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
	carry   bool // outflow view: the carried cloud instead of r_crit along the wind
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

// ToggleCarry switches the outflow view between r_crit along the wind and
// the carried cloud, and reports whether it shows the carried cloud now.
func (cp *chartPane) ToggleCarry() bool { cp.carry = !cp.carry; return cp.carry }

// Carried reports whether the outflow view shows the carried cloud (in
// any view: the option is kept while another is shown).
func (cp *chartPane) Carried() bool { return cp.carry }

// UsesSelected reports whether the chosen chart shows the selected
// criterion: the threshold chart's family, the carried cloud's events.
func (cp *chartPane) UsesSelected() bool {
	return (cp.kind == viewThreshold && cp.family) || (cp.kind == viewOutflow && cp.carry)
}

// Outflow returns the outflow data on screen, nil when the outflow view is
// not drawn or its wind is not valid.
func (cp *chartPane) Outflow() *chartspec.Outflow {
	if cp.shown.view != viewOutflow || cp.kind != viewOutflow {
		return nil
	}
	return cp.shown.outflow
}

// Shown returns the chart on screen.
func (cp *chartPane) Shown() chartState { return cp.shown }

// Request starts computing the chosen chart from req, with the pane's
// options; results of older requests are dropped when they arrive.
func (cp *chartPane) Request(req chartspec.Request) tea.Cmd {
	cp.gen++
	req.Family, req.MapMach, req.Carry = cp.family, cp.mapMach, cp.carry && cp.kind == viewOutflow
	return computeChart(cp.gen, cp.kind, req)
}

// Update takes the chart data of the latest request, and scrolls the
// plan text by a key.
func (cp chartPane) Update(msg tea.Msg) (chartPane, tea.Cmd) {
	switch m := msg.(type) {
	case chartMsg:
		if m.gen == cp.gen { // stale results are dropped
			cp.shown = chartState{gen: m.gen, view: m.view, carry: m.carry, line: m.line, line2: m.line2, regime: m.regime, text: m.text, outflow: m.outflow}
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

// Name names the chosen chart: the view, and the outflow view's panel.
func (cp chartPane) Name() string {
	if cp.kind == viewOutflow && cp.carry {
		return "outflow: carried cloud vs r/R"
	}
	return cp.kind.String()
}

// Title names the chart.
func (cp chartPane) Title() string {
	t := strconv.Itoa(int(cp.kind)+1) + " " + cp.Name()
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
	case c.view != cp.kind || (c.line == nil && c.regime == nil && c.text == nil) || (cp.kind == viewOutflow && c.carry != cp.carry):
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
