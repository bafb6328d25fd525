package model

import (
	"fmt"
	"math"
	"strings"
)

// CoolingTimeKind names the cooling time τ_cool,X a criterion compares.
type CoolingTimeKind int

const (
	CoolNone   CoolingTimeKind = iota // no cooling: the adiabatic baseline
	CoolHot                           // t_cool of the wind, State.TCoolHot
	CoolMix                           // t_cool of mixed gas at T_mix, State.TCoolMix
	CoolMinMix                        // minimum along the mixing isobar, State.TCoolMinMix
	CoolCold                          // t_cool of the cloud, State.TCoolCold
)

var coolNames = [...]string{"none", "hot", "mix", "minmix", "cold"}

// String returns "none", "hot", "mix", "minmix" or "cold".
func (k CoolingTimeKind) String() string {
	if k < 0 || int(k) >= len(coolNames) {
		return fmt.Sprintf("CoolingTimeKind(%d)", int(k))
	}
	return coolNames[k]
}

// Symbol returns the kind as it is written in formulas, e.g. "t_cool,mix".
func (k CoolingTimeKind) Symbol() string {
	if k == CoolNone {
		return "no cooling"
	}
	return "t_cool," + k.String()
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
)

var dynNames = [...]string{"t_cc", "t_shear"}

// String returns "t_cc" or "t_shear".
func (k DynamicalTimeKind) String() string {
	if k < 0 || int(k) >= len(dynNames) {
		return fmt.Sprintf("DynamicalTimeKind(%d)", int(k))
	}
	return dynNames[k]
}

// ParseDynamicalTimeKind parses "t_cc" or "t_shear".
func ParseDynamicalTimeKind(s string) (DynamicalTimeKind, error) {
	for i, n := range dynNames {
		if s == n {
			return DynamicalTimeKind(i), nil
		}
	}
	return 0, fmt.Errorf("unknown dynamical time %q (want t_cc or t_shear)", s)
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
	Chi    Interval // density contrast χ
	Mach   Interval // wind Mach number
	TCloud Interval // cloud temperature in K
	Status string   // where the range comes from and how sure it is
}

// FieldSet is a set of Params fields, used to say which inputs leave a
// criterion's calibrated range.
type FieldSet uint8

// Members of a FieldSet.
const (
	SetChi FieldSet = 1 << iota
	SetMach
	SetTCloud
)

// Names returns the Field… names in the set, in a fixed order.
func (f FieldSet) Names() []string {
	var out []string
	for i, n := range []string{FieldChi, FieldMach, FieldTCloud} {
		if f&(1<<i) != 0 {
			out = append(out, n)
		}
	}
	return out
}

// A Criterion is a published survival criterion in the general form
//
//	τ_cool,X / τ_dyn,Y < α (χ/100)^β,
//
// under which the cloud survives and grows; otherwise it is destroyed.
// Abruzzo et al. frame the published criteria this way [AFB23].
type Criterion struct {
	ID       string // stable identifier, lower-case letters, digits and '-'
	Label    string // short human name
	Citation Citation
	Cool     CoolingTimeKind   // τ_cool,X; CoolNone for the adiabatic baseline
	Dyn      DynamicalTimeKind // τ_dyn,Y
	Alpha    float64           // α > 0
	Beta     float64           // β, the power of χ/100
	Verified bool              // true when α and β were checked against the paper
	Status   string            // the verification status of α and β, for people
	Range    Calibration       // where it was calibrated
	Note     string            // a one-line summary of the physics
}

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
	rhs := fmt.Sprintf("%s", num(c.Alpha))
	if c.Beta != 0 {
		if c.Alpha == 1 {
			rhs = fmt.Sprintf("(χ/100)^%s", num(c.Beta))
		} else {
			rhs = fmt.Sprintf("%s (χ/100)^%s", num(c.Alpha), num(c.Beta))
		}
	}
	return fmt.Sprintf("%s / %s < %s", c.Cool.Symbol(), c.Dyn, rhs)
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
	if c.Cool < CoolNone || c.Cool > CoolCold {
		return &FieldError{Field: "cooling_time", Reason: fmt.Sprintf("unknown cooling time %d", int(c.Cool)), Err: ErrUnknown}
	}
	if c.Dyn != DynCloudCrushing && c.Dyn != DynShear {
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
	Destroyed Verdict = iota // shredded and mixed into the wind
	Survives                 // survives and grows
)

// String returns "destroyed" or "survives-and-grows".
func (v Verdict) String() string {
	if v == Survives {
		return "survives-and-grows"
	}
	return "destroyed"
}

// An Outcome is a criterion evaluated on a State.
type Outcome struct {
	Ratio     float64  // τ_cool,X/τ_dyn,Y at r_cl; +Inf without cooling
	Threshold float64  // α (χ/100)^β
	RCrit     Length   // threshold radius; +Inf when there is none
	Margin    float64  // r_cl/r_crit = threshold/ratio; > 1 means survival
	Verdict   Verdict  // Survives when Ratio < Threshold
	Leaves    FieldSet // inputs outside the criterion's calibrated range
}

// HasThreshold reports whether a finite threshold radius exists.
func (o Outcome) HasThreshold() bool {
	return !math.IsInf(float64(o.RCrit), 0) && !math.IsNaN(float64(o.RCrit))
}

// InRange reports whether the inputs lie inside the calibrated range.
func (o Outcome) InRange() bool { return o.Leaves == 0 }

// CoolingTime returns the cooling time of the given kind; +Inf for CoolNone.
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
	}
	return Time(math.Inf(1))
}

// DynamicalTime returns the dynamical time of the given kind.
func (s *State) DynamicalTime(k DynamicalTimeKind) Time {
	if k == DynShear {
		return s.TShear
	}
	return s.TCC
}

// Evaluate applies criterion c to the state. The threshold radius has the
// closed form (physics reference §5, derived)
//
//	r_crit = v_w τ_cool,X / (χ^{1/2} α (χ/100)^β)   for τ_dyn = t_cc,
//	r_crit = v_w τ_cool,X / (α (χ/100)^β)           for τ_dyn = t_shear,
//
// since both dynamical times are proportional to r_cl and no cooling time
// depends on it.
func (s *State) Evaluate(c *Criterion) Outcome {
	return s.evaluate(c, c.Threshold(s.Params.Chi))
}

// evaluate applies c with its threshold α (χ/100)^β already computed.
func (s *State) evaluate(c *Criterion, threshold float64) Outcome {
	q := &s.Params
	var o Outcome
	if !c.Range.Chi.Contains(q.Chi) {
		o.Leaves |= SetChi
	}
	if !c.Range.Mach.Contains(q.Mach) {
		o.Leaves |= SetMach
	}
	if !c.Range.TCloud.Contains(float64(q.TCloud)) {
		o.Leaves |= SetTCloud
	}
	if c.Cool == CoolNone {
		o.Ratio, o.Threshold = math.Inf(1), math.NaN()
		o.RCrit, o.Margin, o.Verdict = Length(math.Inf(1)), 0, Destroyed
		return o
	}
	tc := float64(s.CoolingTime(c.Cool))
	td := float64(s.DynamicalTime(c.Dyn))
	o.Threshold = threshold
	o.Ratio = tc / td
	crossing := float64(s.VWind) * tc / o.Threshold // v_w τ_cool / (α (χ/100)^β)
	if c.Dyn == DynCloudCrushing {
		crossing /= math.Sqrt(q.Chi)
	}
	o.RCrit = Length(crossing)
	o.Margin = o.Threshold / o.Ratio
	if o.Ratio < o.Threshold {
		o.Verdict = Survives
	}
	return o
}
