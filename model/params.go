package model

import (
	"errors"
	"fmt"
	"math"
)

// HeatCapacity selects the factor f in t_cool = f n k_B T / (𝒩 Λ).
type HeatCapacity int

const (
	// Isochoric uses f = 3/2 = 1/(γ−1) for γ = 5/3: thermal energy per volume.
	Isochoric HeatCapacity = iota
	// Isobaric uses f = 5/2 = γ/(γ−1) for γ = 5/3: enthalpy per volume, the
	// natural choice for gas cooling at fixed pressure.
	Isobaric
)

// Factor returns f: 3/2 for Isochoric and 5/2 for Isobaric.
func (h HeatCapacity) Factor() float64 {
	if h == Isobaric {
		return 2.5
	}
	return 1.5
}

// String returns "isochoric" or "isobaric".
func (h HeatCapacity) String() string {
	if h == Isobaric {
		return "isobaric"
	}
	return "isochoric"
}

// DensityProduct selects the density product 𝒩 that multiplies Λ in the
// volumetric cooling rate 𝒩 Λ(T).
type DensityProduct int

const (
	// NH2 uses 𝒩 = n_H², with n_H = X ρ / m_H from the composition. It is the
	// normalisation cloudwind's cooling functions carry, so the loss rate is
	// the physical one.
	NH2 DensityProduct = iota
	// N2 uses 𝒩 = n², n the total particle density: the simplified form many
	// analytic estimates use. It is a labelled convention, not a unit
	// conversion; it gives cooling times shorter by (n_H/n)² ≈ 0.196.
	N2
	// NeNi uses 𝒩 = n_e n_i for fully ionised gas of the mixture's
	// composition: n_e = n_H (1 + X)/(2X) and n_i = n_H (1 + Y/(4X)), metals
	// neglected (standard approximations; the formulas are from memory, the
	// A09 values 1.1774 and 1.0842 derived). It is the normalisation of
	// Sutherland & Dopita 1993's Λ_N.
	NeNi
)

// DensityProducts lists the density-product conventions, the default first.
func DensityProducts() []DensityProduct { return []DensityProduct{NH2, N2, NeNi} }

// String returns "nh2", "n2" or "neni", the names used on the command line.
func (d DensityProduct) String() string {
	switch d {
	case N2:
		return "n2"
	case NeNi:
		return "neni"
	}
	return "nh2"
}

// ParseDensityProduct parses the String form of a DensityProduct.
func ParseDensityProduct(s string) (DensityProduct, error) {
	for _, d := range DensityProducts() {
		if d.String() == s {
			return d, nil
		}
	}
	return 0, fmt.Errorf("unknown density product %q (want nh2, n2 or neni)", s)
}

// electronIonPerH2 returns n_e n_i / n_H² for fully ionised gas with
// hydrogen mass fraction x and helium-to-hydrogen mass ratio y/x:
// (1 + X)/(2X) × (1 + Y/(4X)) (standard approximations, metals neglected).
func electronIonPerH2(x, yOverX float64) float64 {
	return (1 + x) / (2 * x) * (1 + yOverX/4)
}

// Params holds the inputs of a cloud-in-wind problem. A zero value in an
// optional field means "use the default" stated on that field.
type Params struct {
	Chi         float64     // density contrast χ = ρ_cl/ρ_hot; > 1
	Mach        float64     // wind Mach number against the hot adiabatic sound speed; > 0
	Pressure    Pressure    // P/k_B in K cm⁻³, the same in both phases
	TCloud      Temperature // cloud temperature T_cl in K
	RCloud      Length      // cloud radius r_cl in cm
	Metallicity float64     // Z in units of Z☉; ≥ 0. Selects the cooling curve; the caller builds it.

	Gamma  float64 // adiabatic index γ; default 5/3
	Mu     float64 // mean molecular weight of both phases; default 0.6
	MuCold float64 // μ of the cloud; default Mu
	MuHot  float64 // μ of the wind; default Mu. With MuCold ≠ MuHot, T_hot = χ T_cl μ_hot/μ_cl.

	Mixture          Mixture     // solar mixture for n_H; default Asplund2009
	HydrogenFraction float64     // hydrogen mass fraction X; default Mixture.X
	TFloor           Temperature // cooling floor: Λ = 0 below it; default TCloud; NoFloor for none

	HeatCapacity   HeatCapacity   // f in t_cool; default Isochoric (3/2)
	DensityProduct DensityProduct // 𝒩 in t_cool; default NH2

	// MachTurb is the turbulent Mach number of the hot gas, M_turb =
	// σ_turb/c_s,hot; default 0 (no turbulence). It enters only the
	// turbulent criteria (DynTurbulentCC).
	MachTurb float64

	// MixCooling is the cooling time on the cold side of the mixing layer:
	// the one growth model of v_mix, t_grow, l_cool,cl and the evolution.
	// Default CoolMinMix (DefaultMixCooling, cloudwind's choice); CoolCold,
	// CoolMix and CoolHot are selectable. CoolNone means the default.
	MixCooling CoolingTimeKind
}

// Default values of the optional fields and of the fiducial problem.
const (
	DefaultGamma = 5.0 / 3.0 // monatomic ideal gas
	// DefaultMu is μ = 0.6 for both phases, the single value most wind-tunnel
	// simulations use (status: from memory); fully ionised A09 gas has 0.5991.
	DefaultMu = 0.6
)

// NoFloor, as Params.TFloor, asks for no cooling floor: Λ applies at every
// temperature the cooling function covers (below its range it is 0 by the
// cooling function's own policy). People write it as a floor of 0 K; the
// zero value of TFloor means the default floor, T_cl.
const NoFloor Temperature = -1

// Floor returns the cooling floor of p after defaults and whether there is
// one: (T_cl, true) by default, (0, false) for NoFloor.
func (p Params) Floor() (Temperature, bool) {
	q := p.WithDefaults()
	if q.TFloor == NoFloor {
		return 0, false
	}
	return q.TFloor, true
}

// DefaultMixCooling is the default of Params.MixCooling: the shortest
// cooling time along the mixing isobar, t_cool,minmix. It is cloudwind's
// modelling choice, for this reason: with a cooling floor at T_cl, Λ(T_cl)
// lies on the steep low-temperature edge of any CIE curve (it falls by
// orders of magnitude between 1.5×10⁴ and 10⁴ K and differs between tables
// by factors of several), so t_cool(T_cl) says more about the table's last
// rows than about the layer. The mixing-layer picture of Tan, Oh & Gronke
// 2021 (arXiv:2008.12302, abstract: v_in ≈ c_s,cold (t_cool/t_sc,cold)^{-1/4})
// evaluates the cooling where gas actually cools on its way down, near the
// minimum of t_cool along the isobar; which temperature they used is from
// memory. Gronke & Oh 2020 used the cold gas's cooling time (from memory).
const DefaultMixCooling = CoolMinMix

// MixCoolingReason is DefaultMixCooling's reason in one line, for people.
const MixCoolingReason = "cloudwind's modelling choice: t_cool(T_cl) sits on the steep edge of the cooling table at the floor, so the growth model uses the shortest cooling time of the mixing layer, where gas cools on its way down (Tan, Oh & Gronke 2021, arXiv:2008.12302, form confirmed; the temperature from memory)"

// Fiducial returns the fiducial problem of the Gronke & Oh (2018) scaling:
// χ = 100, M = 1, P/k_B = 10³ K cm⁻³, T_cl = 10⁴ K, r_cl = 1 pc, Z = 1,
// and the default conventions.
func Fiducial() Params {
	return Params{Chi: 100, Mach: 1, Pressure: 1e3, TCloud: 1e4, RCloud: Parsec, Metallicity: 1}
}

// WithDefaults returns p with every zero optional field set to its default.
func (p Params) WithDefaults() Params {
	if p.Gamma == 0 {
		p.Gamma = DefaultGamma
	}
	if p.Mu == 0 {
		p.Mu = DefaultMu
	}
	if p.MuCold == 0 {
		p.MuCold = p.Mu
	}
	if p.MuHot == 0 {
		p.MuHot = p.Mu
	}
	if p.Mixture == (Mixture{}) {
		p.Mixture = Asplund2009
	}
	if p.HydrogenFraction == 0 {
		p.HydrogenFraction = p.Mixture.X
	}
	if p.TFloor == 0 {
		p.TFloor = p.TCloud
	}
	if p.MixCooling == CoolNone {
		p.MixCooling = DefaultMixCooling
	}
	return p
}

// Field names used in FieldError, in the snake_case of the JSON output.
const (
	FieldChi              = "chi"
	FieldMach             = "mach"
	FieldPressure         = "pressure"
	FieldTCloud           = "t_cloud"
	FieldRCloud           = "radius"
	FieldMetallicity      = "metallicity"
	FieldGamma            = "gamma"
	FieldMu               = "mu"
	FieldMuCold           = "mu_cloud"
	FieldMuHot            = "mu_hot"
	FieldHydrogenFraction = "hydrogen_fraction"
	FieldTFloor           = "t_floor"
	FieldHeatCapacity     = "heat_capacity"
	FieldDensityProduct   = "density_product"
	FieldMixCooling       = "mix_cooling"
	FieldMachTurb         = "mach_turb"
)

// Sentinel errors wrapped by FieldError.
var (
	ErrNotFinite   = errors.New("must be a finite number")
	ErrOutOfBounds = errors.New("out of the accepted range")
	ErrUnknown     = errors.New("unknown value")
)

// A FieldError reports an invalid input field.
type FieldError struct {
	Field  string  // one of the Field… names
	Value  float64 // the offending value
	Reason string  // what is wrong, for people
	Err    error   // ErrNotFinite, ErrOutOfBounds or ErrUnknown
}

func (e *FieldError) Error() string { return e.Field + ": " + e.Reason }

// Unwrap returns the underlying error.
func (e *FieldError) Unwrap() error { return e.Err }

// Accepted input ranges. They are wide enough for every published set-up
// (χ 10–10⁵, up to 10⁵ in Chen & Oh 2024, arXiv:2311.04275; M up to ~10 in
// Scannapieco & Brüggen 2015, from memory; P/k_B 10¹–10⁷ K cm⁻³ from the
// CGM to starburst winds, from memory) and
// exist to catch typos and unit mistakes, not to judge physics.
const (
	MaxChi          = 1e8
	MaxMach         = 1e3
	MinPressure     = 1e-6 // K cm⁻³
	MaxPressure     = 1e12 // K cm⁻³
	MinTCloud       = 1.0  // K
	MaxTCloud       = 1e8  // K
	MaxTHot         = 1e11 // K
	MinRCloud       = 1e-9 * Parsec
	MaxRCloud       = 1e7 * Parsec
	MaxMetallicity  = 1e3
	MaxGamma        = 3.0
	MinMu           = 0.1
	MaxMu           = 10.0
	MinHydrogenFrac = 1e-3
	MaxHydrogenFrac = 1.0
)

// fieldRange is the accepted range of a numeric input, with the unit its
// messages quote values in (the radius in pc).
type fieldRange struct {
	lo, hi float64
	open   bool    // lo itself is refused
	scale  float64 // display value = CGS value × scale
	unit   string
}

// fieldRanges gives the accepted range of every numeric input but t_floor,
// whose upper bound is the cloud temperature.
var fieldRanges = map[string]fieldRange{
	FieldChi:              {1, MaxChi, true, 1, ""},
	FieldMach:             {0, MaxMach, true, 1, ""},
	FieldPressure:         {MinPressure, MaxPressure, false, 1, " K cm⁻³"},
	FieldTCloud:           {MinTCloud, MaxTCloud, false, 1, " K"},
	FieldRCloud:           {float64(MinRCloud), float64(MaxRCloud), false, 1 / float64(Parsec), " pc"},
	FieldMetallicity:      {0, MaxMetallicity, false, 1, " Z☉"},
	FieldGamma:            {1, MaxGamma, true, 1, ""},
	FieldMu:               {MinMu, MaxMu, false, 1, ""},
	FieldMuCold:           {MinMu, MaxMu, false, 1, ""},
	FieldMuHot:            {MinMu, MaxMu, false, 1, ""},
	FieldHydrogenFraction: {MinHydrogenFrac, MaxHydrogenFrac, false, 1, ""},
	FieldMachTurb:         {0, MaxMach, false, 1, ""},

	// PlanSettings. The bounds catch typos, not physics: R from 1 to 10⁴,
	// boxes from 2 r_cl (one cloud diameter), C in (0, 1].
	FieldCellsPerRadius: {1, 1e4, false, 1, ""},
	FieldBoxAlong:       {2, 1e6, false, 1, " r_cl"},
	FieldBoxAcross:      {2, 1e4, false, 1, " r_cl"},
	FieldUpstream:       {0, 1e4, false, 1, " r_cl"},
	FieldTail:           {0, 1e6, false, 1, " r_cl"},
	FieldRunTcc:         {0, 1e7, true, 1, " t_cc"},
	FieldRunCap:         {1, 1e7, false, 1, " t_cc"},
	FieldBlock:          {1, 4096, false, 1, ""},
	FieldCFL:            {0, 1, true, 1, ""},
	FieldThroughput:     {0, 1e15, true, 1, ""},
	FieldBytesPerCell:   {0, 1e6, true, 1, ""},

	// EvolveSettings, by key.
	"alpha_v":          {0, 100, true, 1, ""},
	"area_factor":      {0, 100, true, 1, ""},
	"kappa":            {0, 1000, true, 1, ""},
	"drag_coefficient": {0, 100, true, 1, ""},
	"alfven_over_wind": {0, 1000, false, 1, ""},
	"v0":               {-100, 100, false, 1, ""},
	"width":            {0, 1000, true, 1, ""},
	"t_end":            {0, 1e6, true, 1, " t_cc"},
	"rel_tol":          {1e-14, 0.1, false, 1, ""},
	"abs_tol":          {0, 1, true, 1, ""},
	"max_steps":        {1, 1e8, false, 1, ""},
}

// CheckField checks a value given explicitly for the numeric input or
// setting named by a Field… name or setting key (CGS, as SetField takes it)
// against its accepted range, and returns a *FieldError or nil. Unlike the
// Validate methods, which read a zero optional field as "use the default",
// it treats 0 as the value given: CheckField(FieldGamma, 0) is an error.
// For FieldTFloor, 0 (no floor) and any temperature ≥ 0 pass; the
// comparison with T_cl is Validate's. It knows the inputs of Params, the
// numeric fields of PlanSettings and the keys of EvolveSettings; other
// names are an error wrapping ErrUnknown.
func CheckField(field string, v float64) error {
	if field == FieldTFloor {
		if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
			return &FieldError{FieldTFloor, v, fmt.Sprintf("must be a finite temperature ≥ 0 K, 0 for no floor (got %s)", num(v)), ErrOutOfBounds}
		}
		return nil
	}
	r, ok := fieldRanges[field]
	if !ok {
		return &FieldError{field, v, "unknown input", ErrUnknown}
	}
	return r.check(field, v)
}

// check returns the *FieldError of v against r, in the one wording of every
// range message: "must be a finite number", "must be greater than LO",
// "must be at least LO", "must not exceed HI", each followed by
// "(got V)" in the range's unit.
func (r fieldRange) check(field string, v float64) error {
	scale := r.scale
	if scale == 0 {
		scale = 1
	}
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return &FieldError{field, v, fmt.Sprintf("must be a finite number (got %s)", num(v)), ErrNotFinite}
	case r.open && v <= r.lo:
		return &FieldError{field, v, fmt.Sprintf("must be greater than %s%s (got %s%s)", num(r.lo*scale), r.unit, num(v*scale), r.unit), ErrOutOfBounds}
	case !r.open && v < r.lo:
		return &FieldError{field, v, fmt.Sprintf("must be at least %s%s (got %s%s)", num(r.lo*scale), r.unit, num(v*scale), r.unit), ErrOutOfBounds}
	case v > r.hi:
		return &FieldError{field, v, fmt.Sprintf("must not exceed %s%s (got %s%s)", num(r.hi*scale), r.unit, num(v*scale), r.unit), ErrOutOfBounds}
	}
	return nil
}

// Validate checks every field of p (after defaults) and returns a
// *FieldError naming the first invalid one, or nil.
func (p Params) Validate() error {
	q := p.WithDefaults()
	for _, c := range [...]struct {
		field string
		v     float64
	}{
		{FieldChi, p.Chi}, {FieldMach, p.Mach}, {FieldPressure, float64(p.Pressure)}, {FieldTCloud, float64(p.TCloud)},
		{FieldRCloud, float64(p.RCloud)}, {FieldMetallicity, p.Metallicity}, {FieldGamma, q.Gamma}, {FieldMu, q.Mu},
		{FieldMuCold, q.MuCold}, {FieldMuHot, q.MuHot}, {FieldHydrogenFraction, q.HydrogenFraction},
		{FieldMachTurb, q.MachTurb},
	} {
		if err := CheckField(c.field, c.v); err != nil {
			return err
		}
	}
	if tf := float64(q.TFloor); q.TFloor != NoFloor {
		if err := CheckField(FieldTFloor, tf); err != nil {
			return err
		}
		if tf > float64(q.TCloud) {
			return &FieldError{FieldTFloor, tf, fmt.Sprintf("the cooling floor %s K is above the cloud temperature %s K", num(tf), num(float64(q.TCloud))), ErrOutOfBounds}
		}
	}
	if q.HeatCapacity != Isochoric && q.HeatCapacity != Isobaric {
		return &FieldError{FieldHeatCapacity, float64(q.HeatCapacity), fmt.Sprintf("unknown heat-capacity convention %d", q.HeatCapacity), ErrUnknown}
	}
	if q.MixCooling < CoolHot || q.MixCooling > CoolCold {
		return &FieldError{FieldMixCooling, float64(q.MixCooling), fmt.Sprintf("unknown cooling time %d for the growth model (want hot, mix, minmix or cold)", q.MixCooling), ErrUnknown}
	}
	if q.DensityProduct != NH2 && q.DensityProduct != N2 && q.DensityProduct != NeNi {
		return &FieldError{FieldDensityProduct, float64(q.DensityProduct), fmt.Sprintf("unknown density-product convention %d", q.DensityProduct), ErrUnknown}
	}
	if th := HotTemperature(q.TCloud, q.Chi, q.MuCold, q.MuHot); th > MaxTHot {
		return &FieldError{FieldChi, q.Chi, fmt.Sprintf("the wind temperature χ T_cl μ_hot/μ_cl = %s K exceeds %s K", num(float64(th)), num(MaxTHot)), ErrOutOfBounds}
	}
	return nil
}

// num writes v for people with six significant figures, as %g does but
// without exponent padding: 1e8, not 1e+08.
func num(v float64) string { return FormatNumber(v, 6) }

// num3 is num with three significant figures.
func num3(v float64) string { return FormatNumber(v, 3) }

// numericFields maps the Field… names of the numeric inputs to their
// Params fields: the one place that knows which name is which field.
var numericFields = [...]struct {
	name string
	ptr  func(p *Params) *float64
}{
	{FieldChi, func(p *Params) *float64 { return &p.Chi }},
	{FieldMach, func(p *Params) *float64 { return &p.Mach }},
	{FieldPressure, func(p *Params) *float64 { return (*float64)(&p.Pressure) }},
	{FieldTCloud, func(p *Params) *float64 { return (*float64)(&p.TCloud) }},
	{FieldRCloud, func(p *Params) *float64 { return (*float64)(&p.RCloud) }},
	{FieldMetallicity, func(p *Params) *float64 { return &p.Metallicity }},
	{FieldGamma, func(p *Params) *float64 { return &p.Gamma }},
	{FieldMu, func(p *Params) *float64 { return &p.Mu }},
	{FieldMuCold, func(p *Params) *float64 { return &p.MuCold }},
	{FieldMuHot, func(p *Params) *float64 { return &p.MuHot }},
	{FieldHydrogenFraction, func(p *Params) *float64 { return &p.HydrogenFraction }},
	{FieldTFloor, func(p *Params) *float64 { return (*float64)(&p.TFloor) }},
	{FieldMachTurb, func(p *Params) *float64 { return &p.MachTurb }},
}

// field returns a pointer to the numeric input named by a Field… name.
func (p *Params) field(name string) (*float64, bool) {
	for _, f := range numericFields {
		if f.name == name {
			return f.ptr(p), true
		}
	}
	return nil, false
}

// SetField sets the numeric input named by a Field… name (FieldChi,
// FieldRCloud, …) to v in CGS (the radius in cm, pressure as P/k_B in
// K cm⁻³). It reports false, changing nothing, for any other name. It does
// not validate: call Validate.
func (p *Params) SetField(name string, v float64) bool {
	ptr, ok := p.field(name)
	if ok {
		*ptr = v
	}
	return ok
}

// Field returns the numeric input named by a Field… name, in CGS, and
// false for any other name.
func (p *Params) Field(name string) (float64, bool) {
	ptr, ok := p.field(name)
	if !ok {
		return 0, false
	}
	return *ptr, true
}
