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
	// for [GO18] (secondary source); cloudwind counts < 8 as poor, 8–16 as
	// marginal and ≥ 32 as good for growth studies (its own suggestion).
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
	// DefaultRunCapTcc is the longest run the automatic rules propose, 200
	// t_cc: about twice the ~100 t_cc of the longest published radiative
	// wind-tunnel runs recalled (from memory). Past it the plan says the
	// question cannot be answered in a practical run, and why.
	DefaultRunCapTcc = 200.0
	// DefaultBlock is 1: cells per axis are not rounded. Block-structured
	// codes want multiples of their block size (e.g. 16).
	DefaultBlock = 1
)

// Rules of the automatic run length (cloudwind's choices, stated with
// their reasons where they are used).
const (
	runMargin         = 1.5  // the run lasts 1.5 × the time the question needs: the event, and half again to see it continue
	minRunTcc         = 10.0 // no run shorter than the 10 t_cc upper end of non-radiative destruction (Nakamura et al. 2006, confirmed range 3–10 t_cc)
	destructionRunTcc = 10.0 // the upper end of the 3–10 t_cc of non-radiative destruction (Nakamura et al. 2006, abstract, confirmed)
	fallbackDragCoeff = 1.0  // C_D ~ 0.5–1 (from memory); 1 travels furthest of that range
	convergedColumn   = 1e18 // cm⁻²; [GO20]'s speculated galaxy-scale convergence column (confirmed as speculation)
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
	FieldRunCap         = "run_cap_tcc"
	FieldBlock          = "block"
	FieldCFL            = "cfl"
	FieldThroughput     = "cell_updates_per_core_second"
	FieldBytesPerCell   = "bytes_per_cell"
	FieldQuestion       = "question"
	FieldCriterion      = "criterion"
	FieldDisplacement   = "displacement"
)

// PlanSettings are the choices of a simulation plan. A zero value in any
// numeric field means "use the default" (or "automatic") stated on it.
type PlanSettings struct {
	CellsPerRadius           float64        // R = r_cl/Δx; default DefaultCellsPerRadius
	BoxAlongRcl              float64        // L_x along the wind in r_cl; 0 = upstream + displacement + tail
	BoxAcrossRcl             float64        // L_y = L_z in r_cl; default DefaultBoxAcrossRcl
	UpstreamRcl              float64        // wind ahead of the cloud in r_cl; default DefaultUpstreamRcl
	TailRcl                  float64        // room behind the cloud in r_cl; default DefaultTailRcl
	Tracking                 bool           // a cloud-tracking frame: the displacement is not added to the box
	RunTcc                   float64        // t_end in t_cc; 0 = the automatic rule of the Question
	RunCapTcc                float64        // the longest automatic run in t_cc; default DefaultRunCapTcc
	Block                    int            // cells per axis are rounded up to a multiple of it; default 1
	CFL                      float64        // Courant number C; default DefaultCFL
	CellUpdatesPerCoreSecond float64        // throughput; default DefaultCellUpdatesPerCoreSecond
	BytesPerCell             float64        // memory per cell in bytes; default DefaultBytesPerCell
	MHD                      bool           // magnetised run: the resolution advice rises to 64 cells/r_cl
	Question                 Question       // what the run should find out; default QuestionGrowth
	Criterion                string         // id of the criterion whose branch the trajectory follows; "" = the first with a cooling time
	Evolve                   EvolveSettings // the trajectory's settings; its TEnd is the planner's
	DisplacementRcl          float64        // x(t_end)/r_cl given by the user; used when DisplacementKnown
	DisplacementKnown        bool           // true: use DisplacementRcl instead of the trajectory's
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
	def(&p.RunCapTcc, DefaultRunCapTcc)
	if p.Block == 0 {
		p.Block = DefaultBlock
	}
	return p
}

// Validate checks every field of p and returns a *FieldError naming the
// first invalid one, or nil. Zero is valid wherever it means the default.
// The bounds catch typos, not physics (CheckField gives them).
func (p PlanSettings) Validate() error {
	for _, c := range [...]struct {
		field string
		v     float64
	}{
		{FieldCellsPerRadius, p.CellsPerRadius}, {FieldBoxAlong, p.BoxAlongRcl}, {FieldBoxAcross, p.BoxAcrossRcl},
		{FieldUpstream, p.UpstreamRcl}, {FieldTail, p.TailRcl}, {FieldRunTcc, p.RunTcc}, {FieldRunCap, p.RunCapTcc},
		{FieldBlock, float64(p.Block)}, {FieldCFL, p.CFL},
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
	ev := p.Evolve
	ev.TEnd = 0 // the planner's
	return ev.Validate()
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
	WarnNotTestable            WarningCode = "not-testable"
	WarnAllDestroyed           WarningCode = "all-destroyed"
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
	Source  string       // the published source with its status, or "cloudwind's choice" with the reason
}

// A Grid is the concrete mesh of a plan: whole cells per axis, each a
// multiple of the block size, and the cost that follows from them.
type Grid struct {
	CellsPerRadius float64 // R = r_cl/Δx
	Dx             Length  // Δx = r_cl/R
	Nx, Ny, Nz     int     // cells along, across and across the wind
	Cells          float64 // Nx Ny Nz
	Dt             Time    // Δt = C Δx/(v_w + c_s,hot)
	Steps          float64 // ⌈t_end/Δt⌉
	CellUpdates    float64 // Cells × Steps
	CoreHours      float64 // cell-updates / throughput / 3600 s
	MemoryBytes    float64 // Cells × bytes per cell
}

// Plan is a costed wind-tunnel simulation for one scenario. Lengths and
// times are CGS; counts and ratios are plain numbers.
type Plan struct {
	Settings  PlanSettings // with defaults filled in; BoxAlongRcl and RunTcc stay 0 when automatic
	Criterion string       // the criterion whose branch the trajectory followed

	// Testable is false when the question cannot be answered by a run up to
	// the cap (Settings.RunCapTcc) or at all (growth of a destroyed cloud);
	// Verdict says so first and why, and Suggestion proposes what a run could
	// answer instead. Both are "" when Testable holds without remark.
	Testable   bool
	Verdict    string
	Suggestion string
	// AllDestroyed is true when every criterion with a cooling time predicts
	// destruction at r_cl.
	AllDestroyed bool
	// RTestable is the smallest cloud radius at which the growth question
	// becomes testable within the cap (growth plans only; 0 when none was
	// found, or when the plan is testable as it stands), and TDoubleAt the
	// mass-doubling time there in its own t_cc.
	RTestable Length
	TDoubleAt float64

	RCloud          Length  // cloud radius r_cl
	BoxAlongRcl     float64 // L_x asked for, in r_cl
	BoxAcrossRcl    float64 // L_y = L_z asked for, in r_cl
	DisplacementRcl float64 // x(t_end)/r_cl added to the box; 0 when tracking
	BoxRule         string  // how L_x was chosen
	Grid                    // the mesh at Settings.CellsPerRadius; its box is N Δx ≥ the box asked for

	RunTcc      float64 // t_end in t_cc
	RunTime     Time    // t_end
	RunRule     string  // how t_end was chosen
	TDoubleTcc  float64 // when the trajectory's mass doubles, in t_cc; NaN when it does not within the cap
	TEntrainTcc float64 // when it is entrained; NaN when it is not
	TDestroyTcc float64 // when it is destroyed; NaN when it is not
	TCoolHotTcc float64 // t_cool,hot/t_cc, to set beside RunTcc; +Inf without cooling
	TGrowTcc    float64 // t_grow/t_cc; +Inf without growth
	TDragTcc    float64 // t_drag/t_cc = χ^{1/2}

	ShatterCells float64       // l_shatter/Δx; +Inf without cooling
	CellColumn   ColumnDensity // n_cl Δx, the column of one cell of cloud gas

	AdvisedCellsPerRadius float64 // the resolution the sources advise for the question
	AdvisedSource         string  // where that advice comes from

	Warnings []PlanWarning // most serious first

	state *State // the state planned, for AtResolution
}

// MakePlan plans a wind-tunnel simulation of the evaluated problem r with
// the settings set: the run length from the cloud's own trajectory (Evolve
// under the branch of set.Criterion: until the mass doubles for a growth
// question, until it is entrained, or the destruction time), capped at
// set.RunCapTcc, with a verdict when the question cannot be answered in
// such a run; the box (upstream + the trajectory's displacement + tail);
// a concrete grid of whole cells per axis rounded to set.Block; the cost
// from those integers; and the warnings whose conditions hold. It returns
// set's *FieldError when a setting is invalid, and an error when r is nil,
// not evaluated, or names no such criterion.
func MakePlan(r *Result, set PlanSettings) (Plan, error) {
	if err := set.Validate(); err != nil {
		return Plan{}, err
	}
	if r == nil || !(r.TCC > 0) || math.IsInf(float64(r.TCC), 0) {
		return Plan{}, errors.New("make plan: the problem is not evaluated")
	}
	ci, err := planCriterion(r, set.Criterion)
	if err != nil {
		return Plan{}, err
	}
	q := set.WithDefaults()
	s := &r.State
	tcc := float64(s.TCC)
	pl := Plan{Settings: q, Criterion: r.Criteria[ci].ID, Testable: true, RCloud: s.Params.RCloud, state: s,
		TCoolHotTcc: float64(s.TCoolHot) / tcc, TGrowTcc: float64(s.TGrow) / tcc, TDragTcc: float64(s.TDrag) / tcc}
	tr, err := planTrajectory(s, &r.Criteria[ci], q)
	if err != nil {
		return Plan{}, err
	}
	pl.TDoubleTcc, pl.TEntrainTcc, pl.TDestroyTcc = tr.TDouble, tr.TEntrain, tr.TDestroy
	pl.AllDestroyed = allDestroyed(r)
	pl.runLength(r, ci, &tr)
	pl.box(s, q, &tr)
	pl.Grid = pl.AtResolution(q.CellsPerRadius)
	pl.ShatterCells = float64(s.LShatter) / float64(pl.Dx)
	pl.CellColumn = CloudColumn(s.NCold, pl.Dx)
	pl.warnings(s, q)
	return pl, nil
}

// planCriterion returns the index of the criterion named by id, or of the
// first criterion with a cooling time when id is "".
func planCriterion(r *Result, id string) (int, error) {
	for i := range r.Criteria {
		if (id == "" && r.Criteria[i].Cool != CoolNone) || (id != "" && r.Criteria[i].ID == id) {
			return i, nil
		}
	}
	if id == "" {
		return 0, errors.New("make plan: no criterion has a cooling time to follow")
	}
	return 0, &FieldError{FieldCriterion, 0, fmt.Sprintf("no criterion %q among the %d evaluated", id, len(r.Criteria)), ErrUnknown}
}

// allDestroyed reports whether every criterion with a cooling time predicts
// destruction (the adiabatic baseline always does and is not counted).
func allDestroyed(r *Result) bool {
	any := false
	for i, o := range r.Outcomes {
		if r.Criteria[i].Cool == CoolNone {
			continue
		}
		any = true
		if o.Verdict == Survives {
			return false
		}
	}
	return any
}

// AtResolution returns the grid of the plan at R cells per cloud radius,
// with the same run and box: the rungs of a resolution ladder. Cells per
// axis are ⌈L R/block⌉ block (derived); Δt = C Δx/(v_w + c_s,hot), the
// largest initial signal speed (Courant–Friedrichs–Lewy condition; derived).
func (pl *Plan) AtResolution(R float64) Grid {
	q := pl.Settings
	dx := float64(pl.RCloud) / R
	cells := func(lRcl float64) int {
		n := math.Ceil(lRcl*R/float64(q.Block)-1e-9) * float64(q.Block)
		if n < float64(q.Block) {
			n = float64(q.Block)
		}
		if n > math.MaxInt32 {
			n = math.MaxInt32
		}
		return int(n)
	}
	g := Grid{CellsPerRadius: R, Dx: Length(dx), Nx: cells(pl.BoxAlongRcl), Ny: cells(pl.BoxAcrossRcl), Nz: cells(pl.BoxAcrossRcl)}
	g.Cells = float64(g.Nx) * float64(g.Ny) * float64(g.Nz)
	if pl.state != nil {
		g.Dt = Time(q.CFL * dx / float64(pl.state.VWind+pl.state.CsHot))
	}
	if g.Dt > 0 {
		g.Steps = math.Ceil(float64(pl.RunTime) / float64(g.Dt))
	}
	g.CellUpdates = g.Cells * g.Steps
	g.CoreHours = g.CellUpdates / q.CellUpdatesPerCoreSecond / 3600
	g.MemoryBytes = g.Cells * q.BytesPerCell
	return g
}

// box sets the box along the wind: upstream + x(t_end) + tail, with x = 0 in
// a cloud-tracking frame and x from the trajectory otherwise (derived).
func (pl *Plan) box(s *State, q PlanSettings, tr *Trajectory) {
	x, how := 0.0, "tracking frame"
	switch {
	case q.Tracking:
	case q.DisplacementKnown:
		x, how = q.DisplacementRcl, "given"
	case len(tr.T) > 0:
		end := math.Min(pl.RunTcc, tr.T[len(tr.T)-1])
		_, _, x = tr.At(end)
		how = "integrated"
		if !(x >= 0) || math.IsInf(x, 0) {
			x, how = ramDragDisplacement(s.Params.Chi, pl.RunTcc, fallbackDragCoeff), "ram-drag estimate"
			pl.warn(WarnDisplacementUnknown, LevelCaution, "derived from ram drag alone; C_D = 1 from memory",
				"the displacement x(t_end) could not be integrated: the box uses a ram-drag-only estimate of %.3g r_cl (C_D = 1, constant mass); a growing cloud is entrained faster and travels further, up to v_w t_end = %.3g r_cl",
				x, pl.RunTcc*math.Sqrt(s.Params.Chi))
		}
	}
	pl.DisplacementRcl = x
	auto := q.UpstreamRcl + x + q.TailRcl
	pl.BoxRule = fmt.Sprintf("%s upstream + %s displacement (%s) + %s tail", num3(q.UpstreamRcl), num3(x), how, num3(q.TailRcl))
	pl.BoxAlongRcl, pl.BoxAcrossRcl = auto, q.BoxAcrossRcl
	if q.BoxAlongRcl > 0 {
		pl.BoxAlongRcl, pl.BoxRule = q.BoxAlongRcl, "set by the user; automatic would be "+pl.BoxRule
		if q.BoxAlongRcl < auto {
			pl.warn(WarnBoxTooShort, LevelCaution, "Kanjilal, Dutta & Sharma 2021, arXiv:2009.00525 (confirmed: mixed gas must not leave the domain)",
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
// (derived from F = ½ C_D ρ_hot Δv² π r²). Accretion entrains a growing
// cloud faster, so this underestimates its displacement; χ^{1/2} N bounds it.
func ramDragDisplacement(chi, runTcc, cD float64) float64 {
	k := 8 * chi / (3 * cD) // v_w t_drag / r_cl
	return math.Sqrt(chi)*runTcc - k*math.Log1p(math.Sqrt(chi)*runTcc/k)
}

func (pl *Plan) warn(code WarningCode, lvl WarningLevel, src, format string, a ...any) {
	pl.Warnings = append(pl.Warnings, PlanWarning{code, lvl, fmt.Sprintf(format, a...), src})
}

// sortWarnings puts the most serious warnings first, keeping their order
// otherwise.
func (pl *Plan) sortWarnings() {
	slices.SortStableFunc(pl.Warnings, func(a, b PlanWarning) int { return int(b.Level) - int(a.Level) })
}
