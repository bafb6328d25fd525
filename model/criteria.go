package model

import (
	"fmt"
	"math"
	"strings"
)

// CoolingTimeKind names the cooling time τ_cool,X a criterion compares.
type CoolingTimeKind int

const (
	CoolNone    CoolingTimeKind = iota // no cooling: the adiabatic baseline
	CoolHot                            // t_cool of the wind, State.TCoolHot
	CoolMix                            // t_cool of mixed gas at T_mix, State.TCoolMix
	CoolMinMix                         // minimum along the mixing isobar, State.TCoolMinMix
	CoolCold                           // t_cool of the cloud, State.TCoolCold
	CoolShocked                        // t_cool of wind gas swept up in the bow shock, State.TCoolShocked
	CoolGrow                           // not a cooling time: the growth time t_grow of the growth model, State.TGrow
)

var coolNames = [...]string{"none", "hot", "mix", "minmix", "cold", "shocked", "grow"}

// String returns "none", "hot", "mix", "minmix" or "cold".
func (k CoolingTimeKind) String() string {
	if k < 0 || int(k) >= len(coolNames) {
		return fmt.Sprintf("CoolingTimeKind(%d)", int(k))
	}
	return coolNames[k]
}

// Symbol returns the kind as it is written in formulas, e.g. "t_cool,mix".
func (k CoolingTimeKind) Symbol() string {
	switch k {
	case CoolNone:
		return "no cooling"
	case CoolGrow:
		return "t_grow"
	}
	return "t_cool," + k.String()
}

// radiusPower returns p in τ_X/τ_dyn ∝ r_cl^{-p} at a fixed thermal state:
// 1 for every cooling time (they do not depend on r_cl, and both dynamical
// times are ∝ r_cl), 1/4 for t_grow = χ r_cl/(3 v_mix) with v_mix ∝ r_cl^{1/4}
// (derived from MixingVelocity and GrowthTime).
func (k CoolingTimeKind) radiusPower() float64 {
	if k == CoolGrow {
		return 0.25
	}
	return 1
}

// ParseCoolingTimeKind parses the String form of a CoolingTimeKind.
func ParseCoolingTimeKind(s string) (CoolingTimeKind, error) {
	for i, n := range coolNames {
		if s == n {
			return CoolingTimeKind(i), nil
		}
	}
	return 0, fmt.Errorf("unknown cooling time %q (want one of %s)", s, strings.Join(coolNames[:], ", "))
}

// DynamicalTimeKind names the dynamical time τ_dyn,Y a criterion compares.
type DynamicalTimeKind int

const (
	DynCloudCrushing DynamicalTimeKind = iota // t_cc = χ^{1/2} r_cl/v_w
	DynShear                                  // t_shear = r_cl/v_w
	// DynTurbulentCC is the cloud-crushing time in turbulent gas,
	// t̃_cc = t_cc/(1 + (M_turb/(f M))²)^{1/2} with f = Criterion.FMix: the
	// form of arXiv:2510.03552's criterion (abstract, f_mix ~ 0.6). It equals
	// t_cc at M_turb = 0 and χ^{1/2} r_cl f/(M_turb c_s,hot) without a wind.
	DynTurbulentCC
)

var dynNames = [...]string{"t_cc", "t_shear", "t_cc,turb"}

// String returns "t_cc", "t_shear" or "t_cc,turb".
func (k DynamicalTimeKind) String() string {
	if k < 0 || int(k) >= len(dynNames) {
		return fmt.Sprintf("DynamicalTimeKind(%d)", int(k))
	}
	return dynNames[k]
}

// ParseDynamicalTimeKind parses "t_cc", "t_shear" or "t_cc,turb".
func ParseDynamicalTimeKind(s string) (DynamicalTimeKind, error) {
	for i, n := range dynNames {
		if s == n {
			return DynamicalTimeKind(i), nil
		}
	}
	return 0, fmt.Errorf("unknown dynamical time %q (want t_cc, t_shear or t_cc,turb)", s)
}

// A Citation identifies the paper a criterion comes from.
type Citation struct {
	Authors  string // e.g. "Gronke & Oh"
	Year     int
	Journal  string // e.g. "MNRAS 480, L111"; "" when unknown
	ArXiv    string // e.g. "1806.02728"
	Equation string // equation number as read from the paper; "" when not read
}

// String formats the citation on one line.
func (c Citation) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "%s %d", c.Authors, c.Year)
	if c.Journal != "" {
		b.WriteString(", " + c.Journal)
	}
	if c.ArXiv != "" {
		b.WriteString(", arXiv:" + c.ArXiv)
	}
	if c.Equation != "" {
		b.WriteString(", eq. " + c.Equation)
	}
	return b.String()
}

// An Interval is a closed range [Min, Max]; ±Inf leaves a side open.
type Interval struct{ Min, Max float64 }

// Unbounded is the interval that contains every value.
func Unbounded() Interval { return Interval{math.Inf(-1), math.Inf(1)} }

// Contains reports whether x lies in the interval.
func (i Interval) Contains(x float64) bool { return x >= i.Min && x <= i.Max }

// IsUnbounded reports whether the interval is open on both sides.
func (i Interval) IsUnbounded() bool { return math.IsInf(i.Min, -1) && math.IsInf(i.Max, 1) }

// Calibration is the parameter range a criterion was calibrated on.
type Calibration struct {
	Chi      Interval // density contrast χ
	Mach     Interval // wind Mach number
	TCloud   Interval // cloud temperature in K
	MachTurb Interval // turbulent Mach number; the zero Interval means not stated (M_turb = 0 only)
	Status   string   // where the range comes from and how sure it is
}

// FieldSet is a set of Params fields, used to say which inputs leave a
// criterion's calibrated range.
type FieldSet uint8

// Members of a FieldSet.
const (
	SetChi FieldSet = 1 << iota
	SetMach
	SetTCloud
	SetMachTurb
)

// Names returns the Field… names in the set, in a fixed order.
func (f FieldSet) Names() []string {
	var out []string
	for i, n := range []string{FieldChi, FieldMach, FieldTCloud, FieldMachTurb} {
		if f&(1<<i) != 0 {
			out = append(out, n)
		}
	}
	return out
}

// A Criterion is a published survival criterion in the general form
//
//	τ_X / τ_dyn,Y < α (χ/100)^β,
//
// under which the cloud survives and grows; otherwise it is destroyed.
// Abruzzo et al. frame the published criteria this way [AFB23]. τ_X is a
// cooling time (or, for the infall criterion, the growth time). With a
// WarmTemperature the criterion has a third outcome (Farber & Gronke
// 2022): a cloud colder than it that fails the test is "transformed"
// entirely to gas at WarmTemperature when that warm gas passes the same
// test, and destroyed otherwise.
type Criterion struct {
	ID       string // stable identifier, lower-case letters, digits and '-'
	Label    string // short human name
	Citation Citation
	Cool     CoolingTimeKind   // τ_X; CoolNone for the adiabatic baseline
	Dyn      DynamicalTimeKind // τ_dyn,Y
	Alpha    float64           // α > 0
	Beta     float64           // β, the power of χ/100
	FMix     float64           // f in t̃_cc for DynTurbulentCC; default 0.6 (arXiv:2510.03552, abstract)
	// WarmTemperature is the temperature a colder cloud may be transformed to
	// (~10⁴ K, Farber & Gronke 2022); 0 for two-outcome criteria.
	WarmTemperature Temperature
	Verified        bool   // true when α and β were checked against the paper
	Status          string // the verification status of α and β, for people
	// Uncertainty is the factor ≥ 1 by which an unverified α may be off:
	// r_crit is shown as a range from it. 0 means the default: 2 (×/÷ 2,
	// cloudwind's choice) when Verified is false, 1 when it is true.
	Uncertainty float64
	Range       Calibration // where it was calibrated
	Note        string      // a one-line summary of the physics
}

// DefaultUncertainty is the factor an unverified constant may be off by
// when a criterion does not say: ×/÷ 2 (cloudwind's choice: published
// threshold radii differ by factors 2–10 from conventions alone).
const DefaultUncertainty = 2.0

// DefaultFMix is f_mix ~ 0.6 of arXiv:2510.03552 (confirmed from the
// abstract, where it is quoted as approximate).
const DefaultFMix = 0.6

// UncertaintyFactor returns the criterion's uncertainty factor with the
// default filled in.
func (c *Criterion) UncertaintyFactor() float64 {
	switch {
	case c.Uncertainty >= 1:
		return c.Uncertainty
	case c.Verified:
		return 1
	}
	return DefaultUncertainty
}

// fMix returns FMix with the default filled in.
func (c *Criterion) fMix() float64 {
	if c.FMix > 0 {
		return c.FMix
	}
	return DefaultFMix
}

// HasThirdOutcome reports whether the criterion can predict Transformed.
func (c *Criterion) HasThirdOutcome() bool { return c.WarmTemperature > 0 }

// Threshold returns α (χ/100)^β, the value the ratio must stay below.
func (c *Criterion) Threshold(chi float64) float64 {
	if c.Beta == 0 {
		return c.Alpha
	}
	return c.Alpha * math.Pow(chi/100, c.Beta)
}

// Formula writes the criterion in the general form, e.g.
// "t_cool,mix / t_cc < 1".
func (c *Criterion) Formula() string {
	if c.Cool == CoolNone {
		return "no cooling: destroyed within ~3–10 t_cc"
	}
	rhs := num(c.Alpha)
	if c.Beta != 0 {
		if c.Alpha == 1 {
			rhs = fmt.Sprintf("(χ/100)^%s", num(c.Beta))
		} else {
			rhs = fmt.Sprintf("%s (χ/100)^%s", num(c.Alpha), num(c.Beta))
		}
	}
	f := fmt.Sprintf("%s / %s < %s", c.Cool.Symbol(), c.Dyn, rhs)
	if c.Dyn == DynTurbulentCC {
		f += ", t_cc,turb = t_cc/(1 + (M_turb/(" + num(c.fMix()) + " M))²)^1/2"
	}
	if c.HasThirdOutcome() {
		f += "; below " + num(float64(c.WarmTemperature)) + " K: the same test for the " + num(float64(c.WarmTemperature)) + " K gas and for the cold side, transformed when only the first passes"
	}
	return f
}

// Validate reports the first invalid field of c as a *FieldError whose
// Field is the criteria-file key.
func (c *Criterion) Validate() error {
	bad := func(field string, v float64, reason string) error {
		return &FieldError{Field: field, Value: v, Reason: reason, Err: ErrOutOfBounds}
	}
	if c.ID == "" {
		return bad("id", 0, "must not be empty")
	}
	for _, r := range c.ID {
		if !(r >= 'a' && r <= 'z' || r >= '0' && r <= '9' || r == '-') {
			return bad("id", 0, fmt.Sprintf("%q may hold only a–z, 0–9 and '-'", c.ID))
		}
	}
	if c.Cool < CoolNone || c.Cool > CoolGrow {
		return &FieldError{Field: "cooling_time", Reason: fmt.Sprintf("unknown cooling time %d", int(c.Cool)), Err: ErrUnknown}
	}
	if c.Dyn < DynCloudCrushing || c.Dyn > DynTurbulentCC {
		return &FieldError{Field: "dynamical_time", Reason: fmt.Sprintf("unknown dynamical time %d", int(c.Dyn)), Err: ErrUnknown}
	}
	if c.Cool == CoolNone {
		return nil
	}
	if math.IsNaN(c.Alpha) || math.IsInf(c.Alpha, 0) || c.Alpha <= 0 {
		return bad("alpha", c.Alpha, fmt.Sprintf("must be a finite number greater than 0 (got %s)", num(c.Alpha)))
	}
	if math.IsNaN(c.Beta) || math.IsInf(c.Beta, 0) || math.Abs(c.Beta) > 10 {
		return bad("beta", c.Beta, fmt.Sprintf("must be a finite number between -10 and 10 (got %s)", num(c.Beta)))
	}
	if u := c.Uncertainty; u != 0 && !(u >= 1 && u <= 1000) {
		return bad("uncertainty", u, fmt.Sprintf("must be a factor from 1 to 1000 (got %s)", num(u)))
	}
	if f := c.FMix; f != 0 && !(f > 0 && f <= 100) {
		return bad("f_mix", f, fmt.Sprintf("must be greater than 0 and at most 100 (got %s)", num(f)))
	}
	if w := float64(c.WarmTemperature); w != 0 && !(w >= MinTCloud && w <= MaxTCloud) {
		return bad("warm_temperature", w, fmt.Sprintf("must be from %s to %s K, or 0 for none (got %s)", num(MinTCloud), num(MaxTCloud), num(w)))
	}
	for _, iv := range []struct {
		name string
		i    Interval
	}{{"range.chi", c.Range.Chi}, {"range.mach", c.Range.Mach}, {"range.t_cloud", c.Range.TCloud}} {
		if math.IsNaN(iv.i.Min) || math.IsNaN(iv.i.Max) || iv.i.Min > iv.i.Max {
			return bad(iv.name, iv.i.Min, fmt.Sprintf("must be [min, max] with min ≤ max (got [%s, %s])", num(iv.i.Min), num(iv.i.Max)))
		}
	}
	return nil
}

// Verdict is a criterion's prediction for a cloud.
type Verdict int

const (
	Destroyed   Verdict = iota // shredded and mixed into the wind
	Survives                   // survives and grows
	Transformed                // transformed entirely to warmer (~10⁴ K) gas, which survives (Farber & Gronke 2022)
)

// Verdicts lists the verdicts in display order.
func Verdicts() []Verdict { return []Verdict{Survives, Transformed, Destroyed} }

// String returns "survives-and-grows", "transformed" or "destroyed".
func (v Verdict) String() string {
	switch v {
	case Survives:
		return "survives-and-grows"
	case Transformed:
		return "transformed"
	}
	return "destroyed"
}

// An Outcome is a criterion evaluated on a State.
type Outcome struct {
	Ratio     float64  // τ_X/τ_dyn,Y at r_cl; +Inf without cooling
	Threshold float64  // α (χ/100)^β
	RCrit     Length   // threshold radius; +Inf when there is none
	Margin    float64  // r_cl/r_crit (= threshold/ratio for cooling times); > 1 means survival
	Verdict   Verdict  // Survives when Ratio < Threshold; Transformed or Destroyed otherwise
	Leaves    FieldSet // inputs outside the criterion's calibrated range

	// RCritLow and RCritHigh bound r_crit when α is off by the criterion's
	// uncertainty factor u either way: r_crit u^{∓1/p} with τ_X/τ_dyn ∝
	// r_cl^{-p} (derived). Both equal RCrit for a verified constant.
	RCritLow, RCritHigh Length
	// DependsOnConstant is true when r_cl lies inside [RCritLow, RCritHigh]:
	// the verdict then rests on the unverified constant.
	DependsOnConstant bool
	// For a three-outcome criterion whose cloud is colder than its
	// WarmTemperature, Ratio is the cold side's test (its mixed gas between
	// T_cl and T_w), WarmRatio and WarmThreshold the test of the gas at T_w
	// against the hot wind, and RWarm the radius above which that gas
	// survives (transformed, or survives when r_cl > RCrit too). NaN and 0
	// otherwise.
	WarmRatio, WarmThreshold float64
	RWarm                    Length
}

// HasThreshold reports whether a finite threshold radius exists.
func (o Outcome) HasThreshold() bool {
	return !math.IsInf(float64(o.RCrit), 0) && !math.IsNaN(float64(o.RCrit))
}

// InRange reports whether the inputs lie inside the calibrated range.
func (o Outcome) InRange() bool { return o.Leaves == 0 }

// CoolingTime returns the cooling time of the given kind (for CoolGrow the
// growth time); +Inf for CoolNone.
func (s *State) CoolingTime(k CoolingTimeKind) Time {
	switch k {
	case CoolHot:
		return s.TCoolHot
	case CoolMix:
		return s.TCoolMix
	case CoolMinMix:
		return s.TCoolMinMix
	case CoolCold:
		return s.TCoolCold
	case CoolShocked:
		return s.TCoolShocked
	case CoolGrow:
		return s.TGrow
	}
	return Time(math.Inf(1))
}

// DynamicalTime returns the dynamical time of the given kind; for
// DynTurbulentCC with f = DefaultFMix (TurbulentCrushingTime takes f).
func (s *State) DynamicalTime(k DynamicalTimeKind) Time {
	switch k {
	case DynShear:
		return s.TShear
	case DynTurbulentCC:
		return s.TurbulentCrushingTime(DefaultFMix)
	}
	return s.TCC
}

// TurbulentCrushingTime returns t̃_cc = t_cc/(1 + (M_turb/(f M))²)^{1/2}
// (arXiv:2510.03552, abstract), written as χ^{1/2} r_cl/(c_s,hot (M² +
// (M_turb/f)²)^{1/2}) so that it stays finite for any M > 0 (derived).
func (s *State) TurbulentCrushingTime(f float64) Time {
	q := &s.Params
	if q.MachTurb == 0 {
		return s.TCC
	}
	u := q.MachTurb / f
	return Time(math.Sqrt(q.Chi) * float64(q.RCloud) / (float64(s.CsHot) * math.Hypot(q.Mach, u)))
}

// dynamicalTime returns criterion c's dynamical time.
func (s *State) dynamicalTime(c *Criterion) Time {
	if c.Dyn == DynTurbulentCC {
		return s.TurbulentCrushingTime(c.fMix())
	}
	return s.DynamicalTime(c.Dyn)
}

// Evaluate applies criterion c to the state. The ratio scales as
// τ_X/τ_dyn ∝ r_cl^{-p} at a fixed thermal state, with p = 1 for cooling
// times (both dynamical times are ∝ r_cl and no cooling time depends on it)
// and p = 1/4 for t_grow (derived), so the threshold radius has the closed
// form r_crit = r_cl (ratio/threshold)^{1/p}: for cooling times
//
//	r_crit = v_w τ_cool,X / (χ^{1/2} α (χ/100)^β)   for τ_dyn = t_cc,
//	r_crit = v_w τ_cool,X / (α (χ/100)^β)           for τ_dyn = t_shear.
func (s *State) Evaluate(c *Criterion) Outcome {
	var o Outcome
	s.evaluate(&o, c, c.Threshold(s.Params.Chi))
	return o
}

// evaluate applies c with its threshold α (χ/100)^β already computed and
// writes the outcome to o (in place: sweeps call it at every point).
func (s *State) evaluate(o *Outcome, c *Criterion, threshold float64) {
	q := &s.Params
	nan := math.NaN()
	*o = Outcome{WarmRatio: nan, WarmThreshold: nan}
	if !c.Range.Chi.Contains(q.Chi) {
		o.Leaves |= SetChi
	}
	if !c.Range.Mach.Contains(q.Mach) {
		o.Leaves |= SetMach
	}
	if !c.Range.TCloud.Contains(float64(q.TCloud)) {
		o.Leaves |= SetTCloud
	}
	if !c.Range.MachTurb.Contains(q.MachTurb) {
		o.Leaves |= SetMachTurb
	}
	if c.Cool == CoolNone {
		o.Ratio, o.Threshold = math.Inf(1), nan
		o.RCrit, o.Margin, o.Verdict = Length(math.Inf(1)), 0, Destroyed
		o.RCritLow, o.RCritHigh = o.RCrit, o.RCrit
		return
	}
	tc := float64(s.CoolingTime(c.Cool))
	td := float64(s.dynamicalTime(c))
	threeWay := c.HasThirdOutcome() && q.TCloud < c.WarmTemperature
	if threeWay {
		tc = float64(s.coldSideCoolingTime(c.WarmTemperature))
	}
	o.Threshold = threshold
	o.Ratio = tc / td
	p := c.Cool.radiusPower()
	rc := float64(q.RCloud) * radiusFactor(o.Ratio/o.Threshold, p)
	o.RCrit = Length(rc)
	o.Margin = float64(q.RCloud) / rc
	if p == 1 {
		o.Margin = o.Threshold / o.Ratio // exactly, without the round trip through r_crit
	}
	u := radiusFactor(c.UncertaintyFactor(), p) // r_crit ∝ α^{-1/p}
	o.RCritLow, o.RCritHigh = Length(rc/u), Length(rc*u)
	o.DependsOnConstant = u > 1 && q.RCloud > o.RCritLow && q.RCloud < o.RCritHigh
	switch {
	case threeWay:
		// Three outcomes (Farber & Gronke 2022, abstract; the forms are
		// cloudwind's reading, from memory): the gas at T_w survives when it
		// passes the test against the hot wind (warmTest); the cold phase
		// survives too when its own mixed gas, between T_cl and T_w, cools
		// back within the same form (Ratio above); gas at T_w that survives
		// while the cold phase does not is the transformed cloud.
		o.WarmRatio, o.WarmThreshold = s.warmTest(c)
		o.RWarm = Length(float64(q.RCloud) * o.WarmRatio / o.WarmThreshold) // the warm ratio ∝ 1/r_cl too
		switch {
		case !(o.WarmRatio < o.WarmThreshold):
			o.Verdict = Destroyed
		case o.Ratio < o.Threshold:
			o.Verdict = Survives
		default:
			o.Verdict = Transformed
		}
	case o.Ratio < o.Threshold:
		o.Verdict = Survives
	}
}

// coldSideCoolingTime returns the cooling time of the gas that mixes the
// cold cloud with warm gas at T_w at the common pressure: at the geometric
// mean T = (T_cl T_w)^{1/2} (the mixed-gas temperature of Begelman & Fabian
// 1990 applied to the cold and warm phases; cloudwind's reading of Farber
// & Gronke 2022, from memory). Below 10⁴ K its Λ is the low-temperature
// part of the cooling function.
func (s *State) coldSideCoolingTime(tw Temperature) Time {
	q := &s.Params
	t := MixTemperature(q.TCloud, tw)
	n := ParticleDensity(q.Pressure, t)
	mu := q.MuCold // both phases are cold-side gas
	nH := HydrogenDensity(MassDensity(n, mu), q.HydrogenFraction)
	lam := CoolingRate(0)
	if s.cf != nil {
		lam = s.lambda(s.cf, t)
	}
	return CoolingTime(q.HeatCapacity.Factor(), n, t, s.densityProduct(n, nH), lam)
}

// radiusFactor returns x^{1/p} for the closed form of r_crit; x for p = 1.
func radiusFactor(x, p float64) float64 {
	if p == 1 {
		return x
	}
	return math.Pow(x, 1/p)
}

// warmTest applies criterion c to the gas the cloud would become if it
// were transformed to T_w = c.WarmTemperature at the same pressure (a
// reading of Farber & Gronke 2022 from memory): χ_w = T_hot/T_w (one μ),
// the same mass, so r_w = r_cl (T_w/T_cl)^{1/3}, its mixed gas at
// (T_w T_hot)^{1/2}, and t_cc,w = χ_w^{1/2} r_w/v_w. It returns the warm
// ratio τ_X,w/τ_dyn,w and threshold α (χ_w/100)^β. Only mixed-gas and
// cloud cooling times are re-derived; other kinds keep the state's value.
func (s *State) warmTest(c *Criterion) (ratio, threshold float64) {
	q := &s.Params
	tw := c.WarmTemperature
	chiW := float64(s.THot) / float64(tw) * q.MuCold / q.MuHot
	if !(chiW > 1) {
		return math.Inf(1), c.Threshold(chiW)
	}
	rw := float64(q.RCloud) * math.Cbrt(float64(tw)/float64(q.TCloud))
	f := q.HeatCapacity.Factor()
	tc := float64(s.CoolingTime(c.Cool))
	switch c.Cool {
	case CoolMix, CoolMinMix:
		tm := MixTemperature(tw, s.THot)
		n := ParticleDensity(q.Pressure, tm)
		rho := Density(math.Sqrt(float64(MassDensity(ParticleDensity(q.Pressure, tw), q.MuCold)) * float64(s.RhoHot)))
		nH := HydrogenDensity(rho, q.HydrogenFraction)
		lam := CoolingRate(0)
		if s.cf != nil {
			lam = s.lambda(s.cf, tm)
		}
		tc = float64(CoolingTime(f, n, tm, s.densityProduct(n, nH), lam))
	case CoolCold:
		n := ParticleDensity(q.Pressure, tw)
		nH := HydrogenDensity(MassDensity(n, q.MuCold), q.HydrogenFraction)
		lam := CoolingRate(0)
		if s.cf != nil {
			lam = s.lambda(s.cf, tw)
		}
		tc = float64(CoolingTime(f, n, tw, s.densityProduct(n, nH), lam))
	}
	td := math.Sqrt(chiW) * rw / float64(s.VWind)
	switch c.Dyn {
	case DynShear:
		td = rw / float64(s.VWind)
	case DynTurbulentCC:
		td = math.Sqrt(chiW) * rw / (float64(s.CsHot) * math.Hypot(q.Mach, q.MachTurb/c.fMix()))
	}
	return tc / td, c.Threshold(chiW)
}
