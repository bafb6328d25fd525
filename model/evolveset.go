package model

import (
	"fmt"
	"strings"
)

// Settings of the evolution: branch, area model, switches and the
// constants with their status.

// BranchMode selects how the branch weight S follows the criterion.
type BranchMode int

const (
	// BranchSharp sets S = 1 while the criterion holds at the current radius
	// and S = 0 otherwise (cloudwind's model). The default.
	BranchSharp BranchMode = iota
	// BranchSmooth sets S = 1/(1 + (ratio/threshold)^n), n = Width: a
	// modelling choice, not a published result.
	BranchSmooth
)

// AreaModel selects the area through which the cloud accretes.
type AreaModel int

const (
	// AreaSphere uses A = f_A 4π r² with v_mix at the current radius, which
	// gives m = m0 (1 + t/(4 t_grow,0))⁴ (derived from ṁ ∝ A v_mix ∝ m^{3/4}).
	// The default.
	AreaSphere AreaModel = iota
	// AreaFragmented uses A ∝ m with v_mix frozen at r0 (droplets of fixed
	// size; turbulent fragmentation, [GOJN22]), which gives
	// m = m0 exp(t/t_grow,0).
	AreaFragmented
)

var (
	branchNames = [...]string{"sharp", "smooth"}
	areaNames   = [...]string{"sphere", "fragmented"}
)

// String returns "sharp" or "smooth".
func (b BranchMode) String() string { return evolveEnumName(int(b), branchNames[:], "BranchMode") }

// String returns "sphere" or "fragmented".
func (a AreaModel) String() string { return evolveEnumName(int(a), areaNames[:], "AreaModel") }

// ParseBranchMode parses the String form of a BranchMode.
func ParseBranchMode(s string) (BranchMode, error) {
	i, err := evolveEnumParse(s, branchNames[:], "branch mode")
	return BranchMode(i), err
}

// ParseAreaModel parses the String form of an AreaModel.
func ParseAreaModel(s string) (AreaModel, error) {
	i, err := evolveEnumParse(s, areaNames[:], "area model")
	return AreaModel(i), err
}

func evolveEnumName(i int, names []string, typ string) string {
	if i < 0 || i >= len(names) {
		return fmt.Sprintf("%s(%d)", typ, i)
	}
	return names[i]
}

func evolveEnumParse(s string, names []string, what string) (int, error) {
	for i, n := range names {
		if s == n {
			return i, nil
		}
	}
	return 0, fmt.Errorf("unknown %s %q (want one of %s)", what, s, strings.Join(names, ", "))
}

// EvolveTerms is a set of terms of the ODE, used to switch terms off.
type EvolveTerms uint8

// Members of EvolveTerms.
const (
	TermGrowth  EvolveTerms = 1 << iota // ṁ_grow and the accretion drag it brings
	TermLoss                            // ṁ_loss of the destruction branch
	TermRamDrag                         // the ram-pressure drag F_drag
	allTerms    = TermGrowth | TermLoss | TermRamDrag
)

// String lists the terms, e.g. "growth+ram-drag", or returns "none".
func (e EvolveTerms) String() string {
	var parts []string
	for i, n := range [...]string{"growth", "loss", "ram-drag"} {
		if e&(1<<i) != 0 {
			parts = append(parts, n)
		}
	}
	if len(parts) == 0 {
		return "none"
	}
	return strings.Join(parts, "+")
}

// EvolveSettings are the parameters of Evolve. A zero field means "use the
// default" stated on it, so a term is switched off with Disable rather than
// with a zero coefficient. Constants lists every setting with its status.
type EvolveSettings struct {
	AlphaV          float64     // α_v in v_mix = α_v c_s,cl (t_cool c_s,cl/r)^{-1/4}; default 1 (from memory)
	AreaFactor      float64     // f_A in A = f_A 4π r²; default 1 (from memory)
	Kappa           float64     // κ in t_destroy = κ t_cc; default 4 (literature 2–10)
	DragCoefficient float64     // C_D; default 0.5 (from memory, ~0.5–1)
	AlfvenOverWind  float64     // v_A/v_w of the wind's magnetic field; default 0
	MachFactor      bool        // multiply v_mix by (|Δv|/c_s,hot)^{1/2}; default off (from memory)
	V0              float64     // initial velocity v0/v_w; default 0
	Branch          BranchMode  // default BranchSharp
	Width           float64     // n of BranchSmooth; default 4 (a modelling choice)
	Area            AreaModel   // default AreaSphere
	Disable         EvolveTerms // terms switched off; default none
	TEnd            float64     // end time in t_cc,0; default 100
	RelTol          float64     // relative tolerance; default 1e-8
	AbsTol          float64     // absolute tolerance on m/m0, v/v_w and x/r0; default 1e-10
	MaxSteps        int         // budget of attempted steps; default 100000
}

// Defaults of EvolveSettings.
const (
	DefaultAlphaV          = 1.0    // from memory (the prefactor of the [TOG21] form)
	DefaultAreaFactor      = 1.0    // A = 4π r², cloudwind's default ([GO20]'s area from memory)
	DefaultKappa           = 4.0    // from memory, within the ~3–10 t_cc of Nakamura et al. 2006
	DefaultDragCoefficient = 0.5    // from memory (C_D ~ 0.5–1 is the usual range)
	DefaultSmoothWidth     = 4.0    // "n ~ 4": cloudwind's modelling choice
	DefaultTEnd            = 100.0  // t_cc,0; published runs last ~20–100+ t_cc (from memory)
	DefaultRelTol          = 1e-8   // numerical control
	DefaultAbsTol          = 1e-10  // numerical control
	DefaultMaxSteps        = 100000 // numerical control
)

// DefaultEvolveSettings returns the settings with every default filled in.
func DefaultEvolveSettings() EvolveSettings { return EvolveSettings{}.WithDefaults() }

// WithDefaults returns s with every zero field set to its default.
func (s EvolveSettings) WithDefaults() EvolveSettings {
	for _, f := range [...]struct {
		v *float64
		d float64
	}{
		{&s.AlphaV, DefaultAlphaV}, {&s.AreaFactor, DefaultAreaFactor}, {&s.Kappa, DefaultKappa},
		{&s.DragCoefficient, DefaultDragCoefficient}, {&s.Width, DefaultSmoothWidth}, {&s.TEnd, DefaultTEnd},
		{&s.RelTol, DefaultRelTol}, {&s.AbsTol, DefaultAbsTol},
	} {
		if *f.v == 0 {
			*f.v = f.d
		}
	}
	if s.MaxSteps == 0 {
		s.MaxSteps = DefaultMaxSteps
	}
	return s
}

// Validate checks s (after defaults) and returns a *FieldError whose Field
// is the Constants key of the first invalid setting, or nil.
func (s EvolveSettings) Validate() error {
	q := s.WithDefaults()
	for _, c := range [...]struct {
		key string
		v   float64
	}{
		{"alpha_v", q.AlphaV}, {"area_factor", q.AreaFactor}, {"kappa", q.Kappa}, {"drag_coefficient", q.DragCoefficient},
		{"alfven_over_wind", q.AlfvenOverWind}, {"v0", q.V0}, {"width", q.Width}, {"t_end", q.TEnd},
		{"rel_tol", q.RelTol}, {"abs_tol", q.AbsTol}, {"max_steps", float64(q.MaxSteps)},
	} {
		if err := CheckField(c.key, c.v); err != nil {
			return err
		}
	}
	unknown := func(key string, v int) error {
		return &FieldError{key, float64(v), fmt.Sprintf("unknown value %d", v), ErrUnknown}
	}
	switch {
	case q.Branch != BranchSharp && q.Branch != BranchSmooth:
		return unknown("branch", int(q.Branch))
	case q.Area != AreaSphere && q.Area != AreaFragmented:
		return unknown("area", int(q.Area))
	case q.Disable&^allTerms != 0:
		return unknown("disable", int(q.Disable))
	}
	return nil
}

// An EvolveConstant describes one setting of Evolve for display: its
// value, its default and how sure the default is.
type EvolveConstant struct {
	Key     string  // snake_case key; the Field of Validate's FieldError
	Name    string  // a few words for people
	Symbol  string  // as written in formulas
	Value   float64 // the value; 0/1 for a switch, the enum value for a choice
	Default float64 // the default, coded as Value
	Text    string  // the value's name for a switch or choice; "" for a number
	DefText string  // the default's name for a switch or choice; "" for a number
	Status  string  // where the default comes from and how sure it is
}

// Constants lists every setting of s (after defaults) in display order,
// with its default and the status of that default.
func (s EvolveSettings) Constants() []EvolveConstant {
	q, d := s.WithDefaults(), DefaultEvolveSettings()
	num := func(key, name, sym string, v, def float64, status string) EvolveConstant {
		return EvolveConstant{Key: key, Name: name, Symbol: sym, Value: v, Default: def, Status: status}
	}
	onOff := func(b bool) (float64, string) {
		if b {
			return 1, "on"
		}
		return 0, "off"
	}
	mv, mt := onOff(q.MachFactor)
	mdv, mdt := onOff(d.MachFactor)
	const fm = statusFromMemory
	return []EvolveConstant{
		num("alpha_v", "mixing-velocity prefactor", "α_v", q.AlphaV, d.AlphaV,
			"value "+fm+"; the form v_mix ∝ c_s,cl (t_cool/t_sc,cl)^-1/4 is confirmed (Tan, Oh & Gronke 2021, abstract)"),
		num("area_factor", "accretion-area factor", "f_A", q.AreaFactor, d.AreaFactor,
			"A = f_A 4π r²: Gronke & Oh 2020's area definition is "+fm+" (a tail adds area)"),
		num("kappa", "destruction time in t_cc", "κ", q.Kappa, d.Kappa,
			"κ = 4 "+fm+"; the range 2–10 (adiabatic destruction in ~3–10 t_cc) is confirmed (Nakamura et al. 2006, abstract)"),
		num("drag_coefficient", "drag coefficient", "C_D", q.DragCoefficient, d.DragCoefficient,
			"the standard sphere value, ~0.5–1: "+fm),
		num("alfven_over_wind", "wind Alfvén speed over v_w", "v_A/v_w", q.AlfvenOverWind, d.AlfvenOverWind,
			"drag × (1 + v_A²/v_w²): McCourt et al. 2015 (arXiv:1409.6719), confirmed from the abstract"),
		{"mach_factor", "Mach factor in v_mix", "(Δv/c_s,hot)^1/2", mv, mdv, mt, mdt,
			"an extra Mach factor in Gronke & Oh 2020's fit: " + fm + ", uncertain"},
		num("v0", "initial velocity over v_w", "v0/v_w", q.V0, d.V0, "initial condition: 0 is a cloud at rest when the wind arrives"),
		{"branch", "branch switch", "S", float64(q.Branch), float64(d.Branch), q.Branch.String(), d.Branch.String(),
			"sharp: S = 1 while the criterion holds at the current radius (cloudwind's reading of a criterion as a switch); smooth: a modelling choice, not a published result"},
		num("width", "smooth-branch width", "n", q.Width, d.Width,
			"S = 1/(1 + (ratio/threshold)^n): a modelling choice, not a published result"),
		{"area", "area model", "A", float64(q.Area), float64(d.Area), q.Area.String(), d.Area.String(),
			"sphere: A = f_A 4π r² (derived from ṁ = ρ_hot v_mix A); fragmented: A ∝ m, exponential growth (Gronke, Oh, Ji & Norman 2022, abstract; growth-time prefactor " + fm + ")"},
		{"disable", "terms switched off", "—", float64(q.Disable), float64(d.Disable), q.Disable.String(), d.Disable.String(),
			"for limits and tests"},
		num("t_end", "end time in t_cc,0", "t_end", q.TEnd, d.TEnd,
			"radiative runs last ~20–100+ t_cc ("+fm+")"),
		num("rel_tol", "relative tolerance", "rtol", q.RelTol, d.RelTol, "numerical control"),
		num("abs_tol", "absolute tolerance", "atol", q.AbsTol, d.AbsTol, "numerical control"),
		num("max_steps", "step budget", "N_max", float64(q.MaxSteps), float64(d.MaxSteps), "numerical control"),
	}
}
