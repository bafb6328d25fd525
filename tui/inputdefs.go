package tui

import (
	"math"
	"strings"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// An input is one editable setting of the inputs pane.
type input struct {
	label    string          // as shown, e.g. "χ"
	field    string          // model.Field… (or fieldMixture, fieldCooling)
	dim      model.Dimension // unit for display and typing
	advanced bool            // shown behind the Advanced key
	optional bool            // zero in model.Params means the default (p.WithDefaults)
	log      bool            // steps multiply (fine and coarse in dex) instead of add
	fine     float64         // one step: dex when log, else an absolute amount in display units
	wind     bool            // an input of the outflow view (windInputs), not of model.Params
	rates    bool            // a wind input shown when the injection is given as Ė and Ṁ (SFR, α and β otherwise)
	byWind   bool            // set by the wind in the outflow view: shown dimmed there, not stepped
	choices  []choice        // an enumeration: cycled by the step keys, typed by any of its names
	getEnum  func(p *model.Params) int
	setEnum  func(p *model.Params, i int)
	about    string // one line for the details pane
}

// A choice is one option of an enumerated input: how the pane shows it
// and the names typing accepts for it (case-insensitive), the first being
// the command line's and scenario files' spelling, which the text field
// starts with.
type choice struct {
	label string
	names []string
}

// The inputs that are not numeric fields of model.Params.
const (
	fieldMixture = "mixture"
	fieldCooling = "cooling"
)

// get returns the numeric input's value in CGS as stored (0 for an unset
// optional input).
func (in *input) get(p *model.Params) float64 {
	v, _ := p.Field(in.field)
	return v
}

// used returns the value the model uses for the numeric input: the
// default when it is unset (p.WithDefaults), the cloud temperature for a
// cooling floor that is unset or none.
func (in *input) used(p *model.Params) float64 {
	q := p.WithDefaults()
	if in.field == model.FieldTFloor && q.TFloor == model.NoFloor {
		return float64(q.TCloud)
	}
	v, _ := q.Field(in.field)
	return v
}

// set sets the numeric input's value in CGS.
func (in *input) set(p *model.Params, v float64) { p.SetField(in.field, v) }

// isEnum reports whether the input cycles through choices.
func (in *input) isEnum() bool { return in.choices != nil }

// isDefault reports whether the optional input is unset in p.
func (in *input) isDefault(p *model.Params) bool { return in.optional && in.get(p) == 0 }

// match returns the choice that text names, or -1.
func (in *input) match(text string) int {
	for i, c := range in.choices {
		names := append([]string{c.label, quantity.ASCII(c.label)}, c.names...)
		for _, n := range names {
			if strings.EqualFold(n, text) {
				return i
			}
		}
	}
	return -1
}

// choiceNames lists the first name of every choice, for messages.
func (in *input) choiceNames() string {
	names := make([]string, len(in.choices))
	for i, c := range in.choices {
		names[i] = c.names[0]
	}
	return strings.Join(names, ", ")
}

// coarseFactor is how many fine steps one coarse step makes.
const coarseFactor = 10

// inputs returns the inputs in pane order.
func inputs() []input {
	mixtures := model.Mixtures()
	var mixChoices []choice
	for _, m := range mixtures {
		mixChoices = append(mixChoices, choice{m.Name, []string{m.Name}})
	}
	return []input{
		{label: "χ", field: model.FieldChi, dim: model.Dimensionless, log: true, fine: 0.05, byWind: true,
			about: "density contrast ρ_cl/ρ_hot; T_hot = χ T_cl μ_hot/μ_cl"},
		{label: "Mach", field: model.FieldMach, dim: model.Dimensionless, fine: 0.05, byWind: true,
			about: "wind Mach number against the adiabatic sound speed of the hot gas"},
		{label: "P/k_B", field: model.FieldPressure, dim: model.DimPressure, log: true, fine: 0.05, byWind: true,
			about: "thermal pressure over Boltzmann's constant, the same in cloud and wind"},
		{label: "Z", field: model.FieldMetallicity, dim: model.DimMetallicity, log: true, fine: 0.05,
			about: "metallicity in solar units; scales the metal part of the cooling function"},
		{label: "T_cl", field: model.FieldTCloud, dim: model.DimTemperature, log: true, fine: 0.02,
			about: "cloud temperature (the cooling floor follows it unless T_floor is set)"},
		{label: "r_cl", field: model.FieldRCloud, dim: model.DimLength, log: true, fine: 0.05,
			about: "cloud radius"},
		{label: "M_turb", field: model.FieldMachTurb, dim: model.Dimensionless, fine: 0.05, byWind: true,
			about: "turbulent Mach number of the wind (0 for none); the turbulent criteria use it in t̃_cc = t_cc/(1 + (M_turb/(f_mix M))²)^1/2"},
		{label: "γ", field: model.FieldGamma, dim: model.Dimensionless, advanced: true, optional: true, fine: 0.01,
			about: "adiabatic index (default 5/3)"},
		{label: "μ_cl", field: model.FieldMuCold, dim: model.Dimensionless, advanced: true, optional: true, fine: 0.01, byWind: true,
			about: "mean molecular weight of the cloud (default 0.6, as most simulations use for both phases)"},
		{label: "μ_hot", field: model.FieldMuHot, dim: model.Dimensionless, advanced: true, optional: true, fine: 0.01, byWind: true,
			about: "mean molecular weight of the wind (default 0.6)"},
		{label: "X", field: model.FieldHydrogenFraction, dim: model.Dimensionless, advanced: true, optional: true, fine: 0.005,
			about: "hydrogen mass fraction, for n_H = X ρ/m_H (default: that of the mixture)"},
		{label: "mixture", field: fieldMixture, advanced: true, choices: mixChoices,
			getEnum: func(p *model.Params) int {
				for i, m := range mixtures {
					if m.Name == p.Mixture.Name {
						return i
					}
				}
				return 0
			},
			setEnum: func(p *model.Params, i int) { p.Mixture = mixtures[i] }, // an unset X follows the mixture
			about:   "solar mixture of X, Y, Z (Asplund et al. 2021 Table 4 values); an unset X follows it"},
		{label: "T_floor", field: model.FieldTFloor, dim: model.DimTemperature, advanced: true, optional: true, log: true, fine: 0.02,
			about: "cooling floor: Λ = 0 below it (default: the cloud temperature; type 0 or none for no floor)"},
		{label: "f", field: model.FieldHeatCapacity, advanced: true,
			choices: []choice{{"3/2 isochoric", []string{"isochoric", "3/2", "1.5"}}, {"5/2 isobaric", []string{"isobaric", "5/2", "2.5"}}},
			getEnum: func(p *model.Params) int { return int(p.HeatCapacity) },
			setEnum: func(p *model.Params, i int) { p.HeatCapacity = model.HeatCapacity(i) },
			about:   "heat capacity in t_cool = f n k_B T/(𝒩 Λ)"},
		{label: "n×n", field: model.FieldDensityProduct, advanced: true,
			choices: []choice{{"n_H²", []string{"nh2", "n_H^2", "nH2"}}, {"n² (total)", []string{"n2", "n²", "n^2", "total"}},
				{"n_e n_i", []string{"neni", "n_e n_i", "ne ni", "n_e*n_i"}}},
			getEnum: func(p *model.Params) int { return densityIndex(p.DensityProduct) },
			setEnum: func(p *model.Params, i int) { p.DensityProduct = model.DensityProducts()[i] },
			about:   "density product in t_cool: n_H² (physical for Λ per n_H²), n² (simplified form) or n_e n_i (fully ionised gas of the mixture)"},
		{label: "growth", field: model.FieldMixCooling, advanced: true,
			choices: []choice{{"t_cool,minmix", []string{"minmix"}}, {"t_cool,cold", []string{"cold"}}, {"t_cool,mix", []string{"mix"}}, {"t_cool,hot", []string{"hot"}}},
			getEnum: func(p *model.Params) int {
				k := p.WithDefaults().MixCooling
				for i, m := range model.MixCoolingKinds() {
					if m == k {
						return i
					}
				}
				return 0
			},
			setEnum: func(p *model.Params, i int) { p.MixCooling = model.MixCoolingKinds()[i] },
			about:   "the growth model: the cold side's cooling time in v_mix, t_grow, l_cool,cl and the evolution; minmix by default (" + model.MixCoolingReason + ")"},
		{label: "cooling", field: fieldCooling, advanced: true,
			about: "cooling function: step through " + coolingNames() + ", or type one, const:Λ, powerlaw:L0,T0,S or a table path"},
		// The outflow view's own inputs (windInputs), in pane order there.
		{label: "SFR", field: model.FieldSFR, dim: model.DimMassRate, log: true, fine: 0.05, wind: true,
			about: "star-formation rate feeding the wind: Ė = α · 3×10⁴¹ erg s⁻¹ per M☉ yr⁻¹ and Ṁ = β · SFR (" + model.WindLoadingStatus + ")"},
		{label: "α", field: model.FieldEnergyLoading, dim: model.Dimensionless, log: true, fine: 0.05, wind: true,
			about: "energy loading: the fraction of the supernova energy that drives the wind, Ė = α · 3×10⁴¹ erg s⁻¹ per M☉ yr⁻¹ (0 < α ≤ 10)"},
		{label: "β", field: model.FieldMassLoading, dim: model.Dimensionless, log: true, fine: 0.05, wind: true,
			about: "mass loading: Ṁ = β · SFR (0 < β ≤ 100)"},
		{label: "Edot", field: model.FieldEnergyRate, dim: model.DimPower, log: true, fine: 0.05, wind: true, rates: true,
			about: "energy injection rate Ė of the wind (a scenario that gives the rates instead of the star-formation rate)"},
		{label: "Mdot", field: model.FieldMassRate, dim: model.DimMassRate, log: true, fine: 0.05, wind: true, rates: true,
			about: "mass injection rate Ṁ of the wind"},
		{label: "R", field: model.FieldWindRadius, dim: model.DimLength, log: true, fine: 0.05, wind: true,
			about: "injection radius: energy and mass are injected uniformly inside R; the wind is sonic at R (Chevalier & Clegg 1985)"},
		{label: "launch", field: fieldLaunch, dim: model.Dimensionless, log: true, fine: 0.05, wind: true,
			about: "launch radius r_0 of the carried cloud, in units of R; the cloud starts there at rest, and the derived values and the criteria pane's verdicts are those of the cloud there"},
	}
}

// densityIndex returns the index of d in model.DensityProducts (0 for an
// unknown value, which Validate refuses).
func densityIndex(d model.DensityProduct) int {
	for i, x := range model.DensityProducts() {
		if x == d {
			return i
		}
	}
	return 0
}

// coolingNames lists the names of cooling.Names.
func coolingNames() string {
	var names []string
	for _, c := range cooling.Names() {
		names = append(names, c.Name)
	}
	return strings.Join(names, ", ")
}

// roundTo rounds v to a multiple of step/1000, removing float noise from
// repeated additions.
func roundTo(v, step float64) float64 {
	q := step / 1000
	return math.Round(v/q) * q
}

// valueText formats the value of in for the pane: the value used, marked
// "(default)" for an unset optional input, "none" for no cooling floor.
func valueText(in *input, p *model.Params, coolingName string, st *Styles) string {
	switch {
	case in.field == fieldCooling:
		return coolingName
	case in.isEnum():
		return st.T(in.choices[in.getEnum(p)].label)
	case in.field == model.FieldTFloor && p.TFloor == model.NoFloor:
		return "none"
	case in.isDefault(p):
		return st.Format(in.dim, in.used(p)) + " (default)"
	}
	return st.Format(in.dim, in.get(p))
}
