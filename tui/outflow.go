package tui

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// The outflow view's state: the wind's own inputs (the injection of a
// Chevalier & Clegg wind and the launch radius of the carried cloud),
// which live in the snapshot beside model.Params, and the wind they make
// with the cloud's r_cl, T_cl, Z and conventions, evaluated with every
// change (a few root solves and one evaluation of the criteria).

// windInputs are the inputs of the outflow view that model.Params does
// not hold.
type windInputs struct {
	inj    scenario.Outflow // SFR with the loadings α and β, or the rates Ė and Ṁ; and the injection radius R
	launch float64          // launch radius r_0 of the carried cloud in units of R
	given  bool             // from a scenario's [outflow] or changed here: s writes [outflow]
}

// fieldLaunch names the launch radius input: CarrySettings' launch radius
// (model.FieldLaunchRadius), here in units of R.
const fieldLaunch = model.FieldLaunchRadius

// defaultLaunch is the launch radius when none is given: R, as the
// outflow command's --launch-radius.
const defaultLaunch = 1.0

// windFrom returns the wind inputs of a scenario's [outflow], or those
// of model.FiducialWind when it has none (nil).
func windFrom(o *scenario.Outflow) windInputs {
	if o != nil {
		return windInputs{inj: *o, launch: defaultLaunch, given: true}
	}
	fw := model.FiducialWind()
	return windInputs{inj: scenario.Outflow{SFR: fw.SFR, EnergyLoading: fw.EnergyLoading, MassLoading: fw.MassLoading, Radius: fw.Radius},
		launch: defaultLaunch}
}

// params returns the model.WindParams of w with the cloud and the
// conventions of p (scenario.Scenario.Wind).
func (w windInputs) params(p model.Params) model.WindParams {
	sc := scenario.Scenario{Params: p, Outflow: &w.inj}
	wp, _ := sc.Wind()
	return wp
}

// rates reports whether the injection is given as Ė and Ṁ.
func (w windInputs) rates() bool { return w.inj.SFR == 0 }

// value returns the wind input named by field: CGS, or r_0/R for the
// launch radius.
func (w *windInputs) value(field string) float64 {
	switch field {
	case model.FieldSFR:
		return float64(w.inj.SFR)
	case model.FieldEnergyLoading:
		return w.inj.EnergyLoading
	case model.FieldMassLoading:
		return w.inj.MassLoading
	case model.FieldEnergyRate:
		return float64(w.inj.EnergyRate)
	case model.FieldMassRate:
		return float64(w.inj.MassRate)
	case model.FieldWindRadius:
		return float64(w.inj.Radius)
	case fieldLaunch:
		return w.launch
	}
	return math.NaN()
}

// set sets the wind input named by field and marks the inputs as given.
func (w *windInputs) set(field string, v float64) {
	switch field {
	case model.FieldSFR:
		w.inj.SFR = model.MassRate(v)
	case model.FieldEnergyLoading:
		w.inj.EnergyLoading = v
	case model.FieldMassLoading:
		w.inj.MassLoading = v
	case model.FieldEnergyRate:
		w.inj.EnergyRate = model.Power(v)
	case model.FieldMassRate:
		w.inj.MassRate = model.MassRate(v)
	case model.FieldWindRadius:
		w.inj.Radius = model.Length(v)
	case fieldLaunch:
		w.launch = v
	}
	w.given = true
}

// checkWindValue checks one wind input's value: model.CheckWindField, and
// for the launch radius a finite multiple of R greater than 0 (where it
// must lie inside the radius where χ = 1 is checked with the whole wind,
// evalWind).
func checkWindValue(field string, v float64) error {
	if field == fieldLaunch {
		if !(v > 0) || math.IsInf(v, 0) {
			return &model.FieldError{Field: fieldLaunch, Value: v, Reason: "must be a finite multiple of R greater than 0 (got " + quantity.FormatSig(v, 3) + ")", Err: model.ErrOutOfBounds}
		}
		return nil
	}
	return model.CheckWindField(field, v)
}

// parseLaunch reads a typed launch radius: a plain number (or one ending
// in R) is a multiple of R, a number with a length unit a radius, divided
// by bigR.
func parseLaunch(text string, bigR model.Length) (float64, error) {
	t := strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(text), "R"))
	if v, n, err := model.ScanNumber(t); err == nil && n == len(t) {
		return v, nil
	}
	v, err := quantity.ParseValue(model.DimLength, text)
	if err != nil {
		return 0, fmt.Errorf("want a multiple of R (\"0.5\") or a length (\"150 pc\"): %w", err)
	}
	return v / float64(bigR), nil
}

// windEval is the wind of a snapshot and the criteria at its launch
// radius, or why there is none.
type windEval struct {
	wind   model.Wind
	launch model.Length // r_0
	at     model.Params // the cloud at r_0 (Wind.CloudParams)
	res    model.Result // the criteria there
	err    error        // a *model.FieldError of the wind or the launch radius, or the cloud's error
}

// ok reports whether the wind and the cloud at launch are valid.
func (we *windEval) ok() bool { return we.err == nil }

// evalWind builds the wind of s and evaluates the criteria for the cloud
// at its launch radius.
func evalWind(s snapshot, cs []model.Criterion) windEval {
	var we windEval
	w, err := model.NewWind(s.wind.params(s.params))
	if err != nil {
		we.err = err
		return we
	}
	we.wind = w
	we.launch = model.Length(s.wind.launch) * w.Params.Radius
	// The launch radius must lie inside the carried run's end (100 R) and
	// where the wind is still hotter than the cloud (CarrySettings.Validate,
	// whose reasons are in cm: worded here in units of R).
	end := model.DefaultCarryEnd * w.Params.Radius
	if !(we.launch < min(w.RChiOne, end)) {
		where := quantity.FormatSig(model.DefaultCarryEnd, 3) + " R, where the carried cloud's run ends"
		if w.RChiOne < end {
			where = quantity.FormatSig(float64(w.RChiOne/w.Params.Radius), 3) + " R (" + quantity.Format(model.DimLength, float64(w.RChiOne)) +
				"), where the wind is still hotter than the cloud"
		}
		we.err = &model.FieldError{Field: fieldLaunch, Value: s.wind.launch, Err: model.ErrOutOfBounds,
			Reason: "must lie inside " + where + " (got " + quantity.FormatSig(s.wind.launch, 3) + " R)"}
		return we
	}
	if err := (model.CarrySettings{R0: we.launch}).Validate(&w); err != nil {
		we.err = err
		return we
	}
	if we.at, err = w.CloudParams(we.launch, s.params.RCloud); err != nil {
		we.err = err
		return we
	}
	we.err = we.res.Evaluate(we.at, s.cf, cs)
	return we
}

// windMessage words a wind error for the status line, naming the input.
func (a *App) windMessage(err error) string {
	var fe *model.FieldError
	if errors.As(err, &fe) {
		if errors.Is(err, model.ErrConflict) {
			return "wind: " + fe.Reason
		}
		return "wind: " + a.in.FieldMessage(fe)
	}
	return "wind: " + oneLine(err.Error())
}

// outflowShown reports whether the outflow view is on screen.
func (a *App) outflowShown() bool { return a.chart.Kind() == viewOutflow }

// windResult returns the evaluation the derived and criteria panes show:
// the cloud at the launch radius in the outflow view (when the wind is
// valid), else the inputs'.
func (a *App) windResult() *model.Result {
	if a.outflowShown() && a.wind.ok() {
		return &a.wind.res
	}
	return &a.res
}

// stepWind returns w with the selected wind input stepped by n fine
// steps (log steps: every wind input is positive).
func (ip *inputsPane) stepWind(w windInputs, n int) (windInputs, error) {
	in := ip.Current()
	v := w.value(in.field) * math.Pow(10, float64(n)*in.fine)
	if err := checkWindValue(in.field, v); err != nil {
		return w, errors.New(ip.FieldMessage(err))
	}
	w.set(in.field, v)
	return w, nil
}

// applyWindText parses the typed value of the selected wind input into w:
// a number with an optional unit (quantity.ParseValue, "20 Msun/yr",
// "200 pc"), for the launch radius a multiple of R or a length.
func (ip *inputsPane) applyWindText(w windInputs, text string) (windInputs, error) {
	in := ip.Current()
	var v float64
	var err error
	if in.field == fieldLaunch {
		v, err = parseLaunch(text, w.inj.Radius)
	} else {
		v, err = quantity.ParseValue(in.dim, strings.TrimSpace(text))
	}
	if err != nil {
		return w, fmt.Errorf("%s: %w", in.label, err)
	}
	if err := checkWindValue(in.field, v); err != nil {
		return w, errors.New(ip.FieldMessage(err))
	}
	w.set(in.field, v)
	return w, nil
}

// windText formats the value of a wind input: the launch radius in units
// of R and in pc.
func windText(in *input, w *windInputs, st *Styles) string {
	v := w.value(in.field)
	if in.field == fieldLaunch {
		return st.Sig(v, 3) + " R (" + st.Format(model.DimLength, v*float64(w.inj.Radius)) + ")"
	}
	return st.Format(in.dim, v)
}

// byWindText is the value shown for an input the wind sets, in the
// outflow view.
func byWindText(in *input, p *model.Params, st *Styles) string {
	if in.field == model.FieldMuCold || in.field == model.FieldMuHot {
		return st.T("wind: one μ = " + st.Sig(p.WithDefaults().Mu, 3))
	}
	return "set by the wind"
}
