package tui

import (
	"math"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// An input is one editable setting of the inputs pane.
type input struct {
	label    string          // as shown, e.g. "χ"
	field    string          // model.Field… (or "cooling")
	dim      model.Dimension // unit for display and typing
	advanced bool            // shown behind the Advanced key
	log      bool            // steps multiply (fine and coarse in dex) instead of add
	fine     float64         // one step: dex when log, else an absolute amount in display units
	options  []string        // an enumeration: cycled by the step keys
	getEnum  func(p *model.Params) int
	setEnum  func(p *model.Params, i int)
	about    string // one line for the details pane
}

// get returns the numeric input's value in CGS.
func (in *input) get(p *model.Params) float64 {
	v, _ := p.Field(in.field)
	return v
}

// set sets the numeric input's value in CGS.
func (in *input) set(p *model.Params, v float64) { p.SetField(in.field, v) }

// isEnum reports whether the input cycles through options.
func (in *input) isEnum() bool { return in.options != nil }

// coarseFactor is how many fine steps one coarse step makes.
const coarseFactor = 10

// inputs returns the inputs in pane order.
func inputs() []input {
	mixtures := model.Mixtures()
	var mixNames []string
	for _, m := range mixtures {
		mixNames = append(mixNames, m.Name)
	}
	return []input{
		{label: "χ", field: model.FieldChi, dim: model.Dimensionless, log: true, fine: 0.05,
			about: "density contrast ρ_cl/ρ_hot; T_hot = χ T_cl μ_hot/μ_cl"},
		{label: "Mach", field: model.FieldMach, dim: model.Dimensionless, fine: 0.05,
			about: "wind Mach number against the adiabatic sound speed of the hot gas"},
		{label: "P/k_B", field: model.FieldPressure, dim: model.DimPressure, log: true, fine: 0.05,
			about: "thermal pressure over Boltzmann's constant, the same in cloud and wind"},
		{label: "Z", field: model.FieldMetallicity, dim: model.DimMetallicity, log: true, fine: 0.05,
			about: "metallicity in solar units; scales the metal part of the cooling function"},
		{label: "T_cl", field: model.FieldTCloud, dim: model.DimTemperature, log: true, fine: 0.02,
			about: "cloud temperature (the cooling floor follows it unless T_floor is set)"},
		{label: "r_cl", field: model.FieldRCloud, dim: model.DimLength, log: true, fine: 0.05,
			about: "cloud radius"},
		{label: "γ", field: model.FieldGamma, dim: model.Dimensionless, advanced: true, fine: 0.01,
			about: "adiabatic index (default 5/3)"},
		{label: "μ_cl", field: model.FieldMuCold, dim: model.Dimensionless, advanced: true, fine: 0.01,
			about: "mean molecular weight of the cloud (default 0.6, as most simulations use for both phases)"},
		{label: "μ_hot", field: model.FieldMuHot, dim: model.Dimensionless, advanced: true, fine: 0.01,
			about: "mean molecular weight of the wind (default 0.6)"},
		{label: "X", field: model.FieldHydrogenFraction, dim: model.Dimensionless, advanced: true, fine: 0.005,
			about: "hydrogen mass fraction, for n_H = X ρ/m_H (default: that of the mixture)"},
		{label: "mixture", field: "mixture", advanced: true, options: mixNames,
			getEnum: func(p *model.Params) int {
				for i, m := range mixtures {
					if m.Name == p.Mixture.Name {
						return i
					}
				}
				return 0
			},
			setEnum: func(p *model.Params, i int) { p.Mixture, p.HydrogenFraction = mixtures[i], mixtures[i].X },
			about:   "solar mixture of X, Y, Z (Asplund et al. 2021 Table 4 values)"},
		{label: "T_floor", field: model.FieldTFloor, dim: model.DimTemperature, advanced: true, log: true, fine: 0.02,
			about: "cooling floor: Λ = 0 below it (default: the cloud temperature)"},
		{label: "f", field: model.FieldHeatCapacity, advanced: true, options: []string{"3/2 isochoric", "5/2 isobaric"},
			getEnum: func(p *model.Params) int { return int(p.HeatCapacity) },
			setEnum: func(p *model.Params, i int) { p.HeatCapacity = model.HeatCapacity(i) },
			about:   "heat capacity in t_cool = f n k_B T/(𝒩 Λ)"},
		{label: "n×n", field: model.FieldDensityProduct, advanced: true, options: []string{"n_H²", "n² (total)"},
			getEnum: func(p *model.Params) int { return int(p.DensityProduct) },
			setEnum: func(p *model.Params, i int) { p.DensityProduct = model.DensityProduct(i) },
			about:   "density product in t_cool: n_H² (physical for Λ per n_H²) or n² (simplified form)"},
		{label: "cooling", field: "cooling", advanced: true,
			about: "cooling function: step through the named ones, or type a name, const:Λ, powerlaw:L0,T0,S or a table path"},
	}
}

// roundTo rounds v to a multiple of step/1000, removing float noise from
// repeated additions.
func roundTo(v, step float64) float64 {
	q := step / 1000
	return math.Round(v/q) * q
}

// valueText formats the value of in for the pane.
func valueText(in *input, p *model.Params, coolingName string) string {
	switch {
	case in.field == "cooling":
		return coolingName
	case in.isEnum():
		return in.options[in.getEnum(p)]
	case in.field == model.FieldTFloor && p.TFloor == 0:
		return "= T_cl"
	}
	return quantity.Format(in.dim, in.get(p))
}
