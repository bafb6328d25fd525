package model

// Dimension is the physical dimension of a derived quantity; interfaces use
// it to pick a display unit.
type Dimension int

// The dimensions of derived quantities and inputs.
const (
	Dimensionless    Dimension = iota
	DimTemperature             // K
	DimNumberDensity           // cm⁻³
	DimDensity                 // g cm⁻³
	DimVelocity                // cm s⁻¹
	DimTime                    // s
	DimLength                  // cm
	DimMass                    // g
	DimColumn                  // cm⁻²
	DimPressure                // P/k_B, K cm⁻³
	DimCooling                 // erg cm³ s⁻¹
	DimMetallicity             // Z☉
	DimPower                   // erg s⁻¹
	DimMassRate                // g s⁻¹
	DimensionCount             // number of dimensions; not a dimension
)

// A Quantity describes one derived quantity of a State: how to name it,
// where its formula comes from, and how to read it. The list returned by
// Quantities drives every table, JSON object and column of derived values.
type Quantity struct {
	Key     string    // snake_case key without unit, e.g. "t_cool_mix"
	Symbol  string    // as written in formulas, e.g. "t_cool,mix"
	Name    string    // a few words for people
	Dim     Dimension // its dimension (its value is CGS)
	Formula string    // the formula, in the notation of this package's doc comments
	Source  string    // citation or "derived"
	Value   func(s *State) float64
}

// radiusQuantities are the keys of the quantities that State.deriveRadius
// sets, or that are computed from those: the only ones that change when
// the cloud radius alone does.
var radiusQuantities = map[string]bool{
	"t_cc": true, "t_shear": true, "t_sc_cloud": true, "t_drag": true, "mass_cloud": true, "column_cloud": true,
	"v_mix": true, "t_grow": true, "t_cool_hot_per_t_cc": true, "t_grow_per_t_cc": true,
}

// RadiusFree reports whether q keeps its value, bit for bit, when only the
// cloud radius changes: through Result.Reevaluate with the Mach number of
// the last evaluation, or through Evaluate at another radius. A sweep reads
// such a quantity once along its radius axis.
func (q Quantity) RadiusFree() bool { return !radiusQuantities[q.Key] }

// Quantities returns the derived quantities in display order.
func Quantities() []Quantity {
	return []Quantity{
		{"t_hot", "T_hot", "wind temperature", DimTemperature, "χ T_cl μ_hot/μ_cl", "pressure equilibrium (derived)", func(s *State) float64 { return float64(s.THot) }},
		{"t_mix", "T_mix", "mixed-gas temperature", DimTemperature, "(T_cl T_hot)^1/2", "Begelman & Fabian 1990 (attribution from memory)", func(s *State) float64 { return float64(s.TMix) }},
		{"t_minmix", "T_minmix", "temperature of fastest cooling on the mixing isobar", DimTemperature, "argmin over T_cl ≤ T ≤ T_hot of t_cool at fixed P", "Abruzzo et al. 2023 (definition from memory)", func(s *State) float64 { return float64(s.TMinMix) }},
		{"n_cloud", "n_cl", "cloud particle density", DimNumberDensity, "(P/k_B)/T_cl", "ideal gas", func(s *State) float64 { return float64(s.NCold) }},
		{"n_hot", "n_hot", "wind particle density", DimNumberDensity, "(P/k_B)/T_hot", "ideal gas", func(s *State) float64 { return float64(s.NHot) }},
		{"n_mix", "n_mix", "mixed-gas particle density", DimNumberDensity, "(P/k_B)/T_mix", "Begelman & Fabian 1990", func(s *State) float64 { return float64(s.NMix) }},
		{"nh_cloud", "n_H,cl", "cloud hydrogen density", DimNumberDensity, "X ρ_cl/m_H", "composition (derived)", func(s *State) float64 { return float64(s.NHCold) }},
		{"nh_hot", "n_H,hot", "wind hydrogen density", DimNumberDensity, "X ρ_hot/m_H", "composition (derived)", func(s *State) float64 { return float64(s.NHHot) }},
		{"rho_cloud", "ρ_cl", "cloud mass density", DimDensity, "μ_cl m_p n_cl", "definition", func(s *State) float64 { return float64(s.RhoCold) }},
		{"rho_hot", "ρ_hot", "wind mass density", DimDensity, "μ_hot m_p n_hot", "definition", func(s *State) float64 { return float64(s.RhoHot) }},
		{"cs_cloud", "c_s,cl", "cloud sound speed", DimVelocity, "(γ k_B T_cl/(μ_cl m_p))^1/2", "adiabatic sound speed", func(s *State) float64 { return float64(s.CsCold) }},
		{"cs_hot", "c_s,hot", "wind sound speed", DimVelocity, "(γ k_B T_hot/(μ_hot m_p))^1/2", "adiabatic sound speed", func(s *State) float64 { return float64(s.CsHot) }},
		{"v_wind", "v_w", "wind speed", DimVelocity, "M c_s,hot", "Mach number against the hot adiabatic sound speed", func(s *State) float64 { return float64(s.VWind) }},
		{"t_cc", "t_cc", "cloud-crushing time", DimTime, "χ^1/2 r_cl/v_w", "Klein, McKee & Colella 1994", func(s *State) float64 { return float64(s.TCC) }},
		{"t_shear", "t_shear", "wind crossing time of the cloud", DimTime, "r_cl/v_w", "Abruzzo et al. 2023 (definition from memory)", func(s *State) float64 { return float64(s.TShear) }},
		{"t_sc_cloud", "t_sc,cl", "cloud sound-crossing time", DimTime, "r_cl/c_s,cl", "definition", func(s *State) float64 { return float64(s.TSoundCold) }},
		{"t_drag", "t_drag", "drag (entrainment) time", DimTime, "χ r_cl/v_w", "order of magnitude, as in Gronke & Oh 2018 (from memory)", func(s *State) float64 { return float64(s.TDrag) }},
		{"t_cool_hot", "t_cool,hot", "cooling time of the wind", DimTime, "f n_hot k_B T_hot/(𝒩 Λ(T_hot))", "definition of t_cool", func(s *State) float64 { return float64(s.TCoolHot) }},
		{"t_cool_mix", "t_cool,mix", "cooling time of mixed gas", DimTime, "f n_mix k_B T_mix/(𝒩 Λ(T_mix))", "Gronke & Oh 2018", func(s *State) float64 { return float64(s.TCoolMix) }},
		{"t_cool_minmix", "t_cool,minmix", "shortest cooling time on the mixing isobar", DimTime, "min over T_cl ≤ T ≤ T_hot of f k_B T²/(ξ P Λ(T))", "Abruzzo et al. 2023 (definition from memory)", func(s *State) float64 { return float64(s.TCoolMinMix) }},
		{"t_shocked", "T_shock", "temperature of the wind gas swept up ahead of the cloud", DimTemperature, "T_hot × (T₂/T₁ of the Rankine–Hugoniot jump for M > 1, or 1 + (γ−1)M²/2 at stagnation for M ≤ 1)", "Li et al. 2020 (the swept-up gas; confirmed); the relations textbook, from memory", func(s *State) float64 { return float64(s.TShocked) }},
		{"n_shocked", "n_shock", "density of the swept-up wind gas", DimNumberDensity, "n_hot × (ρ₂/ρ₁, or (T₀/T)^{1/(γ−1)} at stagnation)", "textbook relations, from memory", func(s *State) float64 { return float64(s.NShocked) }},
		{"t_cool_shocked", "t_cool,shocked", "cooling time of the swept-up wind gas", DimTime, "f n_shock k_B T_shock/(𝒩 Λ(T_shock))", "Li et al. 2020 (confirmed: their criterion's cooling time)", func(s *State) float64 { return float64(s.TCoolShocked) }},
		{"t_cool_cold", "t_cool,cl", "cooling time of the cloud", DimTime, "f n_cl k_B T_cl/(𝒩 Λ(T_cl))", "definition of t_cool", func(s *State) float64 { return float64(s.TCoolCold) }},
		{"v_mix", "v_mix", "mixing-layer inflow speed", DimVelocity, "c_s,cl (t_cool,X/t_sc,cl)^-1/4, X = mix_cooling (default minmix)", "Tan, Oh & Gronke 2021; prefactor 1 from memory; X is cloudwind's choice", func(s *State) float64 { return float64(s.VMix) }},
		{"t_grow", "t_grow", "mass-growth time", DimTime, "χ r_cl/(3 v_mix)", "ṁ = ρ_hot v_mix 4π r_cl² (derived; Gronke & Oh 2020)", func(s *State) float64 { return float64(s.TGrow) }},
		{"lambda_hot", "Λ(T_hot)", "cooling function of the wind", DimCooling, "Λ(T_hot), per n_H²", "cooling function", func(s *State) float64 { return float64(s.LambdaHot) }},
		{"lambda_mix", "Λ(T_mix)", "cooling function of mixed gas", DimCooling, "Λ(T_mix), per n_H²", "cooling function", func(s *State) float64 { return float64(s.LambdaMix) }},
		{"lambda_cold", "Λ(T_cl)", "cooling function of the cloud", DimCooling, "Λ(T_cl), per n_H²", "cooling function", func(s *State) float64 { return float64(s.LambdaCold) }},
		{"mass_cloud", "m_cl", "cloud mass", DimMass, "(4π/3) r_cl³ ρ_cl", "uniform sphere", func(s *State) float64 { return float64(s.MassCold) }},
		{"column_cloud", "N_cl", "cloud column density", DimColumn, "n_cl r_cl", "radius times density (through the centre: twice this)", func(s *State) float64 { return float64(s.ColumnCold) }},
		{"l_cool_cold", "l_cool,cl", "cooling length of the cold side", DimLength, "c_s,cl t_cool,X, X = mix_cooling (default minmix)", "McCourt et al. 2018 (with t_cool,cl); X is cloudwind's choice", func(s *State) float64 { return float64(s.LCoolCold) }},
		{"l_shatter", "l_shatter", "shattering length", DimLength, "min over T_cl ≤ T ≤ T_hot of c_s t_cool at fixed P", "McCourt et al. 2018", func(s *State) float64 { return float64(s.LShatter) }},
		{"t_cool_hot_per_t_cc", "t_cool,hot/t_cc", "wind cooling time in crushing times", Dimensionless, "t_cool,hot/t_cc", "Kanjilal, Dutta & Sharma 2021 (run length)", func(s *State) float64 { return float64(s.TCoolHot / s.TCC) }},
		{"t_grow_per_t_cc", "t_grow/t_cc", "growth time in crushing times", Dimensionless, "t_grow/t_cc", "derived", func(s *State) float64 { return float64(s.TGrow / s.TCC) }},
	}
}

// Power is an energy per unit time in erg s⁻¹, such as the energy
// injection rate Ė of an outflow.
type Power float64

// MassRate is a mass per unit time in g s⁻¹, such as the mass injection
// rate Ṁ of an outflow or a star-formation rate.
type MassRate float64
