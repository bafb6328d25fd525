package model

import (
	"errors"
	"fmt"
	"math"
	"slices"
)

// Question is what a planned simulation is meant to find out; it sets the
// automatic run length and the resolution advice.
type Question int

const (
	QuestionGrowth      Question = iota // does the cloud survive and grow
	QuestionEntrainment                 // is the cloud entrained (brought to the wind speed)
	QuestionDestruction                 // how fast is the cloud destroyed
)

var questionNames = [...]string{"growth", "entrainment", "destruction"}

// String returns "growth", "entrainment" or "destruction".
func (q Question) String() string {
	if q < 0 || int(q) >= len(questionNames) {
		return fmt.Sprintf("Question(%d)", int(q))
	}
	return questionNames[q]
}

// ParseQuestion parses the String form of a Question.
func ParseQuestion(s string) (Question, error) {
	if i := slices.Index(questionNames[:], s); i >= 0 {
		return Question(i), nil
	}
	return 0, fmt.Errorf("unknown question %q (want growth, entrainment or destruction)", s)
}

// Defaults of PlanSettings. Each is an assumption of the kind its doc
// states; PlanSettings.Assumptions gives the reasons for display.
const (
	// DefaultCellsPerRadius is R = r_cl/Δx = 16, twice the minimum of 8 quoted
	// for [GO18] (secondary source); physics reference §7 suggests < 8 poor,
	// 8–16 marginal, ≥ 32 good for growth studies (a suggestion, not a source).
	DefaultCellsPerRadius = 16.0
	// DefaultBoxAcrossRcl is L_y = L_z = 20 r_cl, the upper end of the ~10–20
	// r_cl recalled for published boxes (from memory).
	DefaultBoxAcrossRcl = 20.0
	// DefaultUpstreamRcl is 5 r_cl of wind ahead of the cloud (an assumption).
	DefaultUpstreamRcl = 5.0
	// DefaultTailRcl is 35 r_cl behind the cloud: with the upstream margin,
	// the 40 r_cl short end of the ~40–150 r_cl recalled along the wind (from
	// memory).
	DefaultTailRcl = 35.0
	// DefaultCFL is the Courant number 0.3 (common practice, no source).
	DefaultCFL = 0.3
	// DefaultCellUpdatesPerCoreSecond is 10⁶ (an assumption, not measured).
	DefaultCellUpdatesPerCoreSecond = 1e6
	// DefaultBytesPerCell is 8 float64 variables × 8 bytes × 4 for scratch
	// and ghost storage = 256 (an assumption, not measured).
	DefaultBytesPerCell = 8 * 8 * 4.0
)

// Rules of the automatic run length and of the fallback displacement
// (physics reference §5.9, §6.4, §7).
const (
	growthRunFactor   = 3.0  // t_end ≳ "a few" t_grow; 3 is cloudwind's choice (§7, derived rule)
	destructionRunTcc = 10.0 // upper end of the 3–10 t_cc of non-radiative destruction (§5.9, confirmed range)
	fallbackDragCoeff = 1.0  // C_D ~ 0.5–1 (§6.4, from memory); 1 travels furthest of that range
	convergedColumn   = 1e18 // cm⁻²; [GO20]'s speculated galaxy-scale convergence column (§7, confirmed as speculation)
	closeThresholds   = 4.0  // thresholds closer than this factor are flagged (cloudwind's choice)
)

// Field names of PlanSettings used in FieldError.
const (
	FieldCellsPerRadius = "cells_per_radius"
	FieldBoxAlong       = "box_along"
	FieldBoxAcross      = "box_across"
	FieldUpstream       = "upstream"
	FieldTail           = "tail"
	FieldRunTcc         = "run_tcc"
	FieldCFL            = "cfl"
	FieldThroughput     = "cell_updates_per_core_second"
	FieldBytesPerCell   = "bytes_per_cell"
	FieldQuestion       = "question"
	FieldDisplacement   = "displacement"
)

// PlanSettings are the choices of a simulation plan. A zero value in any
// numeric field means "use the default" (or "automatic") stated on it.
type PlanSettings struct {
	CellsPerRadius           float64  // R = r_cl/Δx; default DefaultCellsPerRadius
	BoxAlongRcl              float64  // L_x along the wind in r_cl; 0 = upstream + displacement + tail
	BoxAcrossRcl             float64  // L_y = L_z in r_cl; default DefaultBoxAcrossRcl
	UpstreamRcl              float64  // wind ahead of the cloud in r_cl; default DefaultUpstreamRcl
	TailRcl                  float64  // room behind the cloud in r_cl; default DefaultTailRcl
	Tracking                 bool     // a cloud-tracking frame: the displacement is not added to the box
	RunTcc                   float64  // t_end in t_cc; 0 = the automatic rule of the Question
	CFL                      float64  // Courant number C; default DefaultCFL
	CellUpdatesPerCoreSecond float64  // throughput; default DefaultCellUpdatesPerCoreSecond
	BytesPerCell             float64  // memory per cell in bytes; default DefaultBytesPerCell
	MHD                      bool     // magnetised run: the resolution advice rises to 64 cells/r_cl
	Question                 Question // what the run should find out; default QuestionGrowth
	DisplacementRcl          float64  // x(t_end)/r_cl from a trajectory integration; used when DisplacementKnown
	DisplacementKnown        bool     // false: a ram-drag-only estimate is used and flagged
}

// DefaultPlanSettings returns the settings with every fixed default filled
// in; the box length along the wind and the run length stay automatic.
func DefaultPlanSettings() PlanSettings { return PlanSettings{}.WithDefaults() }

// WithDefaults returns p with every zero fixed default filled in.
// BoxAlongRcl and RunTcc stay zero, meaning automatic.
func (p PlanSettings) WithDefaults() PlanSettings {
	def := func(v *float64, d float64) {
		if *v == 0 {
			*v = d
		}
	}
	def(&p.CellsPerRadius, DefaultCellsPerRadius)
	def(&p.BoxAcrossRcl, DefaultBoxAcrossRcl)
	def(&p.UpstreamRcl, DefaultUpstreamRcl)
	def(&p.TailRcl, DefaultTailRcl)
	def(&p.CFL, DefaultCFL)
	def(&p.CellUpdatesPerCoreSecond, DefaultCellUpdatesPerCoreSecond)
	def(&p.BytesPerCell, DefaultBytesPerCell)
	return p
}

// Validate checks every field of p and returns a *FieldError naming the
// first invalid one, or nil. Zero is valid wherever it means the default.
// The bounds catch typos, not physics: R from 1 to 10⁴, boxes from 2 r_cl
// (one cloud diameter), C in (0, 1].
func (p PlanSettings) Validate() error {
	for _, c := range [...]struct {
		field string
		v     float64
	}{
		{FieldCellsPerRadius, p.CellsPerRadius}, {FieldBoxAlong, p.BoxAlongRcl}, {FieldBoxAcross, p.BoxAcrossRcl},
		{FieldUpstream, p.UpstreamRcl}, {FieldTail, p.TailRcl}, {FieldRunTcc, p.RunTcc}, {FieldCFL, p.CFL},
		{FieldThroughput, p.CellUpdatesPerCoreSecond}, {FieldBytesPerCell, p.BytesPerCell},
	} {
		if c.v == 0 {
			continue // the default
		}
		if err := CheckField(c.field, c.v); err != nil {
			return err
		}
	}
	if p.Question < QuestionGrowth || p.Question > QuestionDestruction {
		return &FieldError{FieldQuestion, float64(p.Question), fmt.Sprintf("unknown question %d", int(p.Question)), ErrUnknown}
	}
	if d := p.DisplacementRcl; p.DisplacementKnown && !(d >= 0 && d <= 1e7) {
		return &FieldError{FieldDisplacement, d, fmt.Sprintf("must be a finite displacement from 0 to 1e7 r_cl (got %s)", num(d)), ErrOutOfBounds}
	}
	return nil
}

// A PlanAssumption is one setting of a plan with its value and status, for
// display beside the plan.
type PlanAssumption struct {
	Field   string  // a Field… name, or "cost" for the cost model
	Value   float64 // the value used; 0 when automatic
	Unit    string  // e.g. "r_cl", "t_cc"; "" for a pure number
	Default bool    // true when the value is cloudwind's default, not the user's
	Status  string  // "assumption", "from memory", "common practice", "derived" or "set by the user"
	Note    string  // why, and where it comes from
}

// Assumptions returns each setting of p (defaults filled in) with its
// status, in display order.
func (p PlanSettings) Assumptions() []PlanAssumption {
	q := p.WithDefaults()
	item := func(field string, given, v float64, unit, status, note string) PlanAssumption {
		if given != 0 {
			return PlanAssumption{field, v, unit, false, "set by the user", note}
		}
		return PlanAssumption{field, v, unit, true, status, note}
	}
	along := "automatic: upstream + displacement x(t_end) + tail (physics reference §7, derived)"
	if q.Tracking {
		along = "automatic in the cloud-tracking frame: upstream + tail"
	}
	out := []PlanAssumption{
		item(FieldCellsPerRadius, p.CellsPerRadius, q.CellsPerRadius, "cells per r_cl", "assumption", "16 = twice the 8 quoted as Gronke & Oh's minimum for converged growth (secondary); physics reference §7 suggests < 8 poor, 8–16 marginal, ≥ 32 good for growth studies"),
		item(FieldBoxAlong, p.BoxAlongRcl, q.BoxAlongRcl, "r_cl", "derived", along),
		item(FieldUpstream, p.UpstreamRcl, q.UpstreamRcl, "r_cl", "assumption", "room for the bow shock ahead of the cloud; no source"),
		item(FieldTail, p.TailRcl, q.TailRcl, "r_cl", "from memory", "with the upstream margin 40 r_cl, the short end of the ~40–150 r_cl recalled for published boxes (FROM MEMORY); gas stripped early may travel up to v_w t_end"),
		item(FieldBoxAcross, p.BoxAcrossRcl, q.BoxAcrossRcl, "r_cl", "from memory", "upper end of the ~10–20 r_cl recalled for published boxes (FROM MEMORY): mixed gas must not leave the domain (Kanjilal et al. 2021, confirmed)"),
		item(FieldRunTcc, p.RunTcc, q.RunTcc, "t_cc", "derived", "automatic: "+autoRunRule(q.Question)),
		item(FieldCFL, p.CFL, q.CFL, "", "common practice", "Courant number 0.3: common practice, no source"),
		item(FieldThroughput, p.CellUpdatesPerCoreSecond, q.CellUpdatesPerCoreSecond, "cell-updates per core-second", "assumption", "typical of modern finite-volume codes on one CPU core, not measured"),
		item(FieldBytesPerCell, p.BytesPerCell, q.BytesPerCell, "bytes", "assumption", "8 float64 variables (enough for MHD) × 4 for ghost zones, copies and scratch; not measured"),
	}
	switch {
	case q.Tracking:
	case q.DisplacementKnown:
		out = append(out, PlanAssumption{FieldDisplacement, q.DisplacementRcl, "r_cl", false, "set by the user", "x(t_end)/r_cl from a trajectory integration"})
	default:
		out = append(out, PlanAssumption{FieldDisplacement, 0, "r_cl", true, "from memory", "unknown: ram-drag-only estimate with constant mass and C_D = 1 (C_D ~ 0.5–1 FROM MEMORY; §6.4, derived)"})
	}
	return append(out, PlanAssumption{"cost", 0, "", true, "derived", "N_cells = L_x L_y L_z R³, Δt = C Δx/(v_w + c_s,hot) (§7, derived): a lower bound without cooling sub-cycling or faster signals in shocked gas"})
}

// WarningLevel grades a PlanWarning.
type WarningLevel int

const (
	LevelInfo    WarningLevel = iota // worth knowing
	LevelCaution                     // the plan may not answer its question
	LevelSerious                     // the plan will not answer its question as it stands
)

// String returns "info", "caution" or "serious".
func (l WarningLevel) String() string {
	if l < LevelInfo || l > LevelSerious {
		return fmt.Sprintf("WarningLevel(%d)", int(l))
	}
	return [...]string{"info", "caution", "serious"}[l]
}

// WarningCode identifies the kind of a PlanWarning, for programs.
type WarningCode string

// The kinds of plan warnings.
const (
	WarnBackgroundCooling      WarningCode = "background-cooling"
	WarnTooShortForGrowth      WarningCode = "too-short-for-growth"
	WarnShorterThanDrag        WarningCode = "shorter-than-drag"
	WarnBelowMinimumResolution WarningCode = "resolution-minimum"
	WarnGrowthResolution       WarningCode = "resolution-growth"
	WarnMHDResolution          WarningCode = "resolution-mhd"
	WarnSupersonic             WarningCode = "supersonic-convergence"
	WarnRadiativeConvergence   WarningCode = "radiative-convergence"
	WarnShatteringUnresolved   WarningCode = "shattering-unresolved"
	WarnCellColumn             WarningCode = "cell-column"
	WarnDisplacementUnknown    WarningCode = "displacement-unknown"
	WarnBoxTooShort            WarningCode = "box-too-short"
	WarnCloseThresholds        WarningCode = "close-thresholds"
)

// A PlanWarning says why a plan may not answer its question.
type PlanWarning struct {
	Code    WarningCode  // the kind, for programs
	Level   WarningLevel // how much it matters
	Message string       // for people, numbers with three significant figures
	Source  string       // the published source with its status, or the rule of the physics reference
}

// Plan is a costed wind-tunnel simulation for one scenario. Lengths and
// times are CGS; counts and ratios are plain numbers.
type Plan struct {
	Settings PlanSettings // with defaults filled in; BoxAlongRcl and RunTcc stay 0 when automatic

	RCloud          Length  // cloud radius r_cl
	Dx              Length  // cell size Δx = r_cl/R
	BoxAlongRcl     float64 // L_x in r_cl
	BoxAcrossRcl    float64 // L_y = L_z in r_cl
	DisplacementRcl float64 // x(t_end)/r_cl added to the box; 0 when tracking
	BoxRule         string  // how L_x was chosen

	Cells       float64 // N_cells = L_x L_y L_z R³ (box in r_cl)
	Dt          Time    // Δt = C Δx/(v_w + c_s,hot)
	Steps       float64 // ⌈t_end/Δt⌉ = ⌈N_cc χ^{1/2} R (M+1)/(M C)⌉ with one μ
	CellUpdates float64 // N_cells × N_steps
	CoreHours   float64 // cell-updates / throughput / 3600 s
	MemoryBytes float64 // N_cells × bytes per cell

	RunTcc      float64 // t_end in t_cc
	RunTime     Time    // t_end
	RunRule     string  // how t_end was chosen
	TCoolHotTcc float64 // t_cool,hot/t_cc, to set beside RunTcc; +Inf without cooling
	TGrowTcc    float64 // t_grow/t_cc; +Inf without growth
	TDragTcc    float64 // t_drag/t_cc = χ^{1/2}

	ShatterCells float64       // l_shatter/Δx; +Inf without cooling
	CellColumn   ColumnDensity // n_cl Δx, the column of one cell of cloud gas

	AdvisedCellsPerRadius float64 // the resolution the sources advise for the question
	AdvisedSource         string  // where that advice comes from

	Warnings []PlanWarning // most serious first
}

// A DisplacementFunc returns the displacement x(t_end)/r_cl of a cloud in
// problem p after runTcc cloud-crushing times, and whether it is known; a
// caller wires it to a trajectory integrator.
type DisplacementFunc func(p Params, runTcc float64) (displacementRcl float64, ok bool)

// MakePlan plans a wind-tunnel simulation of the derived state s with the
// settings set (physics reference §7): run length, box (with the given
// displacement, or a flagged ram-drag estimate when it is unknown), cell
// size, time step, cost, and the warnings whose conditions hold. It returns
// set's *FieldError when a setting is invalid, and an error when s is nil
// or not derived.
func MakePlan(s *State, set PlanSettings) (Plan, error) {
	return makePlan(s, set, nil)
}

func makePlan(s *State, set PlanSettings, disp DisplacementFunc) (Plan, error) {
	if err := set.Validate(); err != nil {
		return Plan{}, err
	}
	if s == nil || !(s.TCC > 0) || math.IsInf(float64(s.TCC), 0) {
		return Plan{}, errors.New("make plan: the state is not derived")
	}
	q := set.WithDefaults()
	pl := Plan{Settings: q, RCloud: s.Params.RCloud}
	tcc := float64(s.TCC)
	pl.TCoolHotTcc = float64(s.TCoolHot) / tcc
	pl.TGrowTcc = float64(s.TGrow) / tcc
	pl.TDragTcc = float64(s.TDrag) / tcc
	pl.runLength(q)
	pl.box(s, q, disp)

	// Cost (physics reference §7, derived): N_cells = L_x L_y L_z/Δx³ with
	// Δx = r_cl/R; Δt = C Δx/(v_w + c_s,hot), the largest initial signal speed.
	R := q.CellsPerRadius
	dx := float64(s.Params.RCloud) / R
	pl.Dx = Length(dx)
	pl.BoxAcrossRcl = q.BoxAcrossRcl
	pl.Cells = pl.BoxAlongRcl * pl.BoxAcrossRcl * pl.BoxAcrossRcl * R * R * R
	pl.Dt = Time(q.CFL * dx / float64(s.VWind+s.CsHot))
	pl.RunTime = Time(pl.RunTcc * tcc)
	pl.Steps = math.Ceil(float64(pl.RunTime) / float64(pl.Dt))
	pl.CellUpdates = pl.Cells * pl.Steps
	pl.CoreHours = pl.CellUpdates / q.CellUpdatesPerCoreSecond / 3600
	pl.MemoryBytes = pl.Cells * q.BytesPerCell
	pl.ShatterCells = float64(s.LShatter) / dx
	pl.CellColumn = CloudColumn(s.NCold, pl.Dx)
	pl.warnings(s, q)
	return pl, nil
}

// autoRunRule states the automatic run length for question q.
func autoRunRule(q Question) string {
	switch q {
	case QuestionGrowth:
		return "max(3 t_grow, 10 t_cc) (physics reference §7, derived; 3 is cloudwind's 'a few', 10 t_cc from §5.9)"
	case QuestionEntrainment:
		return "max(3 t_grow, t_drag = χ^1/2 t_cc, 10 t_cc) (physics reference §7, derived)"
	}
	return "10 t_cc, the upper end of the 3–10 t_cc of non-radiative destruction (physics reference §5.9, confirmed range)"
}

// runLength sets RunTcc and RunRule (physics reference §5.9 and §7): the
// automatic rule's largest term, or the user's value.
func (pl *Plan) runLength(q PlanSettings) {
	if q.RunTcc > 0 {
		pl.RunTcc, pl.RunRule = q.RunTcc, "set by the user"
		return
	}
	pl.RunTcc, pl.RunRule = destructionRunTcc, q.Question.String()+": "+autoRunRule(q.Question)
	if q.Question == QuestionDestruction {
		return
	}
	term := "10 t_cc"
	if g := growthRunFactor * pl.TGrowTcc; g > pl.RunTcc && !math.IsInf(g, 0) {
		pl.RunTcc, term = g, "3 t_grow"
	}
	if q.Question == QuestionEntrainment && pl.TDragTcc > pl.RunTcc {
		pl.RunTcc, term = pl.TDragTcc, "t_drag"
	}
	pl.RunRule += "; here " + term
}

// box sets the box along the wind: upstream + x(t_end) + tail, with x = 0 in
// a cloud-tracking frame (physics reference §7, derived).
func (pl *Plan) box(s *State, q PlanSettings, disp DisplacementFunc) {
	x, how := 0.0, "tracking frame"
	switch {
	case q.Tracking:
	case q.DisplacementKnown:
		x, how = q.DisplacementRcl, "given"
	default:
		ok := false
		if disp != nil {
			x, ok = disp(s.Params, pl.RunTcc)
			ok = ok && x >= 0 && !math.IsInf(x, 0)
		}
		if ok {
			how = "integrated"
		} else {
			x, how = ramDragDisplacement(s.Params.Chi, pl.RunTcc, fallbackDragCoeff), "ram-drag estimate"
			pl.warn(WarnDisplacementUnknown, LevelCaution, "physics reference §6.4 and §7 (derived; C_D = 1 from memory)",
				"the displacement x(t_end) is unknown: the box uses a ram-drag-only estimate of %.3g r_cl (C_D = 1, constant mass); a growing cloud is entrained faster and travels further, up to v_w t_end = %.3g r_cl; integrate the trajectory or use a cloud-tracking frame",
				x, pl.RunTcc*math.Sqrt(s.Params.Chi))
		}
	}
	pl.DisplacementRcl = x
	auto := q.UpstreamRcl + x + q.TailRcl
	pl.BoxRule = fmt.Sprintf("%s upstream + %s displacement (%s) + %s tail", num3(q.UpstreamRcl), num3(x), how, num3(q.TailRcl))
	pl.BoxAlongRcl = auto
	if q.BoxAlongRcl > 0 {
		pl.BoxAlongRcl, pl.BoxRule = q.BoxAlongRcl, "set by the user; automatic would be "+pl.BoxRule
		if q.BoxAlongRcl < auto {
			pl.warn(WarnBoxTooShort, LevelCaution, "physics reference §7 (derived); Kanjilal, Dutta & Sharma 2021, arXiv:2009.00525 (confirmed: mixed gas must not leave the domain)",
				"the box along the wind, %.3g r_cl, is shorter than upstream + displacement + tail = %.3g r_cl: the cloud or its mixed gas may leave the domain", q.BoxAlongRcl, auto)
		}
	}
}

// ramDragDisplacement returns x/r_cl of a cloud of constant mass, at rest
// at t = 0, after N = runTcc cloud-crushing times under ram drag alone,
//
//	x/r_cl = χ^{1/2} N − (8χ/(3C_D)) ln(1 + 3 C_D N/(8 χ^{1/2})),
//
// integrating Δv = v_w/(1 + t/t_drag), t_drag = (8/(3C_D)) χ r_cl/v_w
// (physics reference §6.4, derived). Accretion entrains a growing cloud
// faster, so this underestimates its displacement; χ^{1/2} N bounds it.
func ramDragDisplacement(chi, runTcc, cD float64) float64 {
	k := 8 * chi / (3 * cD) // v_w t_drag / r_cl
	return math.Sqrt(chi)*runTcc - k*math.Log1p(math.Sqrt(chi)*runTcc/k)
}

func (pl *Plan) warn(code WarningCode, lvl WarningLevel, src, format string, a ...any) {
	pl.Warnings = append(pl.Warnings, PlanWarning{code, lvl, fmt.Sprintf(format, a...), src})
}

// warnings adds every warning whose condition holds, most serious first.
func (pl *Plan) warnings(s *State, q PlanSettings) {
	R, mach := q.CellsPerRadius, s.Params.Mach
	if pl.RunTcc >= pl.TCoolHotTcc {
		pl.warn(WarnBackgroundCooling, LevelSerious, "Kanjilal, Dutta & Sharma 2021, arXiv:2009.00525 (confirmed)",
			"the wind cools during the run: t_end = %.3g t_cc ≥ t_cool,hot = %.3g t_cc; switch off cooling in the hot phase or shorten the run, so that the background does not cool catastrophically", pl.RunTcc, pl.TCoolHotTcc)
	}
	lvl := LevelCaution
	if q.Question == QuestionDestruction {
		lvl = LevelInfo
	}
	if math.IsInf(pl.TGrowTcc, 1) || math.IsNaN(pl.TGrowTcc) {
		pl.warn(WarnTooShortForGrowth, lvl, "physics reference §6.2 and §7 (derived)",
			"no growth can be seen: t_grow is infinite because the cloud gas does not cool (Λ(T_cl) = 0)")
	} else if pl.RunTcc < growthRunFactor*pl.TGrowTcc {
		pl.warn(WarnTooShortForGrowth, lvl, "physics reference §7 (derived rule t_end ≳ a few t_grow; 3 is cloudwind's choice)",
			"the run ends before growth could be seen: t_end = %.3g t_cc < 3 t_grow = %.3g t_cc", pl.RunTcc, growthRunFactor*pl.TGrowTcc)
	}
	if q.Question == QuestionEntrainment && pl.RunTcc < pl.TDragTcc {
		pl.warn(WarnShorterThanDrag, LevelCaution, "physics reference §3.5 and §7: t_drag ~ χ^1/2 t_cc (order of magnitude, from memory, as in Gronke & Oh 2018)",
			"the run ends before the cloud can be entrained: t_end = %.3g t_cc < t_drag = χ^1/2 t_cc = %.3g t_cc", pl.RunTcc, pl.TDragTcc)
	}
	pl.AdvisedCellsPerRadius, pl.AdvisedSource = 32, "physics reference §7 suggested level for growth studies (not a published threshold)"
	if q.Question == QuestionDestruction { // adiabatic destruction converges at ~100
		pl.AdvisedCellsPerRadius, pl.AdvisedSource = 100, "Yirak et al. 2010, arXiv:0912.4777 (confirmed): ~100 cells/r_cl converge an adiabatic clump"
	}
	if R < 8 {
		sub := ""
		if mach < 1 {
			sub = "; for subsonic winds Leary, Richie & Schneider 2026 (arXiv:2602.10082, confirmed) find mass growth and acceleration converged at 4 cells/r_cl"
		}
		pl.warn(WarnBelowMinimumResolution, LevelSerious, "Gronke & Oh 2018, arXiv:1806.02728: minimum for converged growth (secondary: quoted by a third party, not in the abstract)",
			"R = %.3g cells per cloud radius is below the 8 quoted as the minimum for converged growth%s", R, sub)
	} else if R < 32 && q.Question == QuestionGrowth {
		pl.warn(WarnGrowthResolution, LevelCaution, "physics reference §7 suggested levels (cloudwind's suggestion, not a published threshold)",
			"R = %.3g cells per cloud radius is marginal for a growth study: suggested levels are < 8 poor, 8–16 marginal, ≥ 32 good (16–32 counted as marginal here)", R)
	}
	if q.MHD {
		if pl.AdvisedCellsPerRadius < 64 {
			pl.AdvisedCellsPerRadius, pl.AdvisedSource = 64, "Banda-Barragán, Federrath, Crocker & Bicknell 2018, arXiv:1706.06607 (confirmed): ≥ 64 cells/r_cl in MHD"
		}
		if R < 64 {
			pl.warn(WarnMHDResolution, LevelCaution, "Banda-Barragán, Federrath, Crocker & Bicknell 2018, arXiv:1706.06607 (confirmed, abstract)",
				"MHD run at R = %.3g < 64 cells/r_cl, the resolution at which the dynamical properties of MHD wind–cloud runs converge", R)
		}
	}
	if mach > 1 {
		lvl := LevelCaution
		if q.Question == QuestionGrowth {
			lvl = LevelInfo
		}
		pl.warn(WarnSupersonic, lvl, "Leary, Richie & Schneider 2026, arXiv:2602.10082 (confirmed)",
			"supersonic wind (M = %.3g): in radiative supersonic runs cloud destruction and velocity were not converged even at 48 cells/r_cl; treat them as resolution-dependent at any R", mach)
	}
	yirak := "radiative runs did not self-converge even at 100 cells/r_cl: plan a resolution study"
	lvl = LevelInfo
	if R < 100 {
		yirak = fmt.Sprintf("R = %s < ~100 cells/r_cl, where an adiabatic clump converges; %s", num3(R), yirak)
		if q.Question == QuestionDestruction {
			lvl = LevelCaution
		}
	}
	pl.warn(WarnRadiativeConvergence, lvl, "Yirak et al. 2010, arXiv:0912.4777 (confirmed)", "%s", yirak)
	if pl.ShatterCells < 1 {
		pl.warn(WarnShatteringUnresolved, LevelInfo, "McCourt et al. 2018, arXiv:1610.01164 (confirmed, abstract); physics reference §7",
			"the shattering length l_shatter = %.3g Δx is not resolved; this matters only if fragmentation itself is the science", pl.ShatterCells)
	}
	if float64(pl.CellColumn) > convergedColumn {
		pl.warn(WarnCellColumn, LevelInfo, "Gronke & Oh 2020, arXiv:1907.04771 (confirmed as their speculation)",
			"one cell of cloud gas holds a column n_cl Δx = %.3g cm⁻², above the ~1e18 cm⁻² galaxy-scale simulations may need to resolve to converge in cold-gas mass", float64(pl.CellColumn))
	}
	pl.sortWarnings()
}

// sortWarnings puts the most serious warnings first, keeping their order
// otherwise.
func (pl *Plan) sortWarnings() {
	slices.SortStableFunc(pl.Warnings, func(a, b PlanWarning) int { return int(b.Level) - int(a.Level) })
}
