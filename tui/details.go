package tui

import (
	"math"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/cooling"
	"cloudwind/internal/chartspec"
	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/model"
)

// subject is what the details pane explains: the selected item of the
// focused pane.
type subject struct {
	focus     focus
	input     *input         // with focusInputs
	quantity  model.Quantity // with focusDerived
	criterion int            // with focusCriteria: an index into the result's criteria
}

// detailsPane is the details overlay: an input, a derived quantity or a
// criterion explained with its formula, citation, convention and
// verification status. Its keys close it; the App moves the selection
// under it, so that it follows to the next item.
type detailsPane struct {
	styles        *Styles
	keys          *KeyMap
	width, height int // the box width and the most rows it may take
	open          bool
	scroll        scroller

	about    subject
	params   model.Params
	cooling  *cooling.Source
	cf       model.CoolingFunction
	res      *model.Result
	spread   conventionSpread // of the state, for a criterion (set while open)
	outcomes *outcomeSet      // loaded simulation outcomes, or nil

	outflowOn bool               // the outflow view is shown
	windIn    *windInputs        // its inputs
	wind      *windEval          // its wind and the cloud at launch
	outflow   *chartspec.Outflow // its data on screen, nil while computed
	selected  int                // the selected criterion, whose carried cloud is explained
}

func newDetailsPane(styles *Styles, keys *KeyMap) detailsPane {
	return detailsPane{styles: styles, keys: keys}
}

// SetSize sets the box width and the most rows the box may take.
func (d *detailsPane) SetSize(w, h int) { d.width, d.height = w, h }

// SetState sets what is explained and the state it is explained in.
func (d *detailsPane) SetState(about subject, p model.Params, src *cooling.Source, cf model.CoolingFunction, res *model.Result) {
	d.about, d.params, d.cooling, d.cf, d.res = about, p, src, cf, res
}

// SetSpread sets the convention spread of the state.
func (d *detailsPane) SetSpread(s conventionSpread) { d.spread = s }

// SetOutcomes sets the loaded simulation outcomes (nil for none).
func (d *detailsPane) SetOutcomes(o *outcomeSet) { d.outcomes = o }

// Show opens the overlay at its top.
func (d *detailsPane) Show() { d.open, d.scroll = true, scroller{} }

// Open reports whether the overlay is shown.
func (d *detailsPane) Open() bool { return d.open }

// Update closes the overlay on its keys and quits on the quit key.
func (d detailsPane) Update(msg tea.Msg) (detailsPane, tea.Cmd) {
	k, ok := msg.(tea.KeyMsg)
	if !ok {
		return d, nil
	}
	switch {
	case key.Matches(k, d.keys.Details, d.keys.Cancel, d.keys.Accept):
		d.open = false
	case key.Matches(k, d.keys.Quit):
		return d, tea.Quit
	case key.Matches(k, d.keys.PageUp, d.keys.PageDown, d.keys.Top, d.keys.Bottom):
		_, lines := d.body(d.width - 2)
		d.scroll.scrollKey(k, d.keys, len(lines), d.height-2)
	case key.Matches(k, d.keys.Up, d.keys.Down):
		d.scroll = scroller{} // the next item, from its top
	}
	return d, nil
}

// View draws the overlay box, as tall as its text allows, scrolled when
// the text is taller than the window.
func (d detailsPane) View() string {
	title, lines := d.body(d.width - 2)
	h := min(len(lines)+2, d.height)
	body := d.scroll.window(lines, h-2, -1, "PgUp/PgDn", d.styles)
	return strings.Join(box(title, body, d.width, h, true, d.styles), "\n")
}

// body returns the title and the lines of text for a body w cells wide.
func (d detailsPane) body(w int) (title string, lines []string) {
	st := d.styles
	wrap := func(label, text string) {
		lines = append(lines, wrapText(st.Dim.Render(label)+" ", st.T(quantity.Sanitize(text)), w)...)
	}
	conv := "f = " + quantity.FormatSig(d.params.HeatCapacity.Factor(), 2) + " (" + d.params.HeatCapacity.String() + "), 𝒩 = " + densityWord(d.params.DensityProduct)
	switch d.about.focus {
	case focusInputs:
		in := d.about.input
		title = "input " + in.label
		wrap("meaning:", in.about)
		switch {
		case in.wind:
			wrap("value:", windText(in, d.windIn, st))
		case d.outflowOn && in.byWind:
			wrap("value:", byWindText(in, &d.params, st)+" (the other views: "+valueText(in, &d.params, "", st)+")")
		case !in.isEnum() && in.field != fieldCooling:
			wrap("value:", valueText(in, &d.params, "", st))
		}
		if !in.isEnum() && in.field != fieldCooling {
			step := quantity.FormatSig(in.fine, 2) + " per step (×10 with shift)"
			if in.log {
				step = "×" + quantity.FormatSig(pow10(in.fine), 3) + " per step (" + quantity.FormatSig(in.fine, 2) + " dex; ×10 with shift)"
			}
			wrap("step:", step)
			typing := "enter, then a number with an optional unit, e.g. " + typingExample(in.dim)
			if in.field == fieldLaunch {
				typing = `enter, then a multiple of R ("1", "0.5 R") or a radius ("300 pc")`
			}
			wrap("typing:", typing)
		}
		if in.isEnum() {
			var names []string
			for _, c := range in.choices {
				names = append(names, c.label+" ("+strings.Join(c.names, ", ")+")")
			}
			wrap("choices:", strings.Join(names, "; "))
		}
		if in.field == fieldCooling {
			d.coolingDetails(wrap)
		}
		d.outflowInputDetails(in, wrap)
	case focusDerived:
		q := d.about.quantity
		title = q.Symbol + " — " + q.Name
		wrap("value:", quantity.Format(q.Dim, q.Value(&d.res.State)))
		wrap("formula:", q.Formula)
		wrap("source:", q.Source)
		wrap("convention:", conv)
		switch q.Key {
		case "t_grow", "v_mix", "t_grow_per_t_cc", "l_cool_cold":
			// The sensitivity of the growth model to its one choice.
			var alt []string
			for _, k := range model.MixCoolingKinds() {
				alt = append(alt, k.String()+" "+quantity.FormatSig(float64(d.res.GrowthTimeWith(k)/d.res.TCC), 3)+" t_cc")
			}
			wrap("growth model:", "uses "+d.res.Params.MixCooling.Symbol()+" (input \"growth\"); t_grow under each choice: "+strings.Join(alt, ", "))
		}
		if note := tableStatus(d.cf, q.Key, &d.res.State); note != "" {
			wrap("caution:", "this temperature lies "+note+" of the cooling function")
		}
	case focusCriteria:
		c := &d.res.Criteria[d.about.criterion]
		title = criterionName(c) + " (" + quantity.Sanitize(c.ID) + ")"
		if d.outflowOn && d.wind != nil && d.wind.ok() {
			wrap("in the outflow view:", "evaluated for the cloud at the launch radius, "+quantity.FormatSig(d.windIn.launch, 3)+" R (χ, M and P/k_B of the wind there)")
		}
		d.criterionDetails(d.about.criterion, wrap, func(l string) { lines = append(lines, st.fit(l, w)) })
	case focusChart: // the outflow view's chart (sync sends the other charts' details to the selected input)
		title = d.outflowDetails(wrap, func(l string) { lines = append(lines, st.fit(l, w)) })
	}
	lines = append(lines, "", st.Help.Render(st.T("↑/↓ next item · PgUp/PgDn scroll · d or esc close")))
	return st.T(title), lines
}

// coolingDetails describes the cooling function in use.
func (d detailsPane) coolingDetails(wrap func(label, text string)) {
	wrap("in use:", report.CoolingName(d.cooling, d.cf))
	p, ok := d.cf.(*cooling.PowerLaw)
	if !ok {
		wrap("form:", "analytic, per n_H²")
		return
	}
	m := p.Meta()
	lo, hi := p.ValidRange()
	wrap("source:", m.Citation)
	wrap("table:", quantity.Format(model.DimTemperature, float64(lo))+" – "+quantity.Format(model.DimTemperature, float64(hi))+
		", stored per n_H² (source per "+m.Normalisation.Symbol()+"), He/H = "+quantity.FormatSig(m.HeliumRatio, 3))
	for _, c := range m.Caveats {
		wrap("caveat:", c)
	}
	for _, w := range m.Warnings {
		wrap("warning:", w)
	}
}

func densityWord(d model.DensityProduct) string {
	switch d {
	case model.N2:
		return "n² (total particles)"
	case model.NeNi:
		return "n_e n_i"
	}
	return "n_H²"
}

func typingExample(d model.Dimension) string {
	switch d {
	case model.DimLength:
		return `"30 pc", "0.2 kpc", "1e19 cm"`
	case model.DimTemperature:
		return `"2e4", "1 keV"`
	case model.DimPressure:
		return `"3e3", "1e-13 erg cm-3"`
	case model.DimMassRate:
		return `"20", "20 Msun/yr", "1e27 g/s"`
	case model.DimPower:
		return `"3e42", "3e42 erg/s", "3e35 W"`
	}
	return `"300", "1.5e2"`
}

func pow10(x float64) float64 { return math.Pow(10, x) }

// rangeText describes a calibrated range: the bounds of χ, M, T_cl and
// M_turb with the range's status, and for a range without turbulence (the
// zero MachTurb interval) that it holds at M_turb = 0 only.
func rangeText(c model.Calibration) string {
	var parts []string
	add := func(name string, i model.Interval, unit string) {
		if i.IsUnbounded() {
			return
		}
		parts = append(parts, name+" "+quantity.FormatSig(i.Min, 3)+"–"+quantity.FormatSig(i.Max, 3)+unit)
	}
	add("χ", c.Chi, "")
	add("M", c.Mach, "")
	add("T_cl", c.TCloud, " K")
	noTurb := c.MachTurb == model.Interval{}
	if !noTurb {
		add("M_turb", c.MachTurb, "")
	}
	text := "no limits known (" + c.Status + ")"
	if len(parts) > 0 {
		text = strings.Join(parts, ", ") + " (" + c.Status + ")"
	}
	if noTurb {
		text += "; without turbulence only (M_turb = 0)"
	}
	return text
}
