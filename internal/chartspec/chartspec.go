// Package chartspec builds the explorer's charts as data: curves, markers
// and regime-map cells computed from cloudwind/model and cloudwind/cooling,
// independent of how they are drawn. The explorer draws them in the
// terminal (cloudwind/tui/chart) and exports them with gonum/plot
// (cloudwind/internal/figure); a script can build the same figures from a
// Request without the explorer.
//
// # Conventions
//
// Coordinates on a log axis are log10 values (log10 χ, log10 of r in pc,
// log10 of T in K, log10 of Λ in erg cm³ s⁻¹). NaN or ±Inf in a series
// breaks the curve: the builders never fail, and a point that cannot be
// evaluated is NaN.
//
// # Notation of the texts
//
// Titles, axis labels, legend names and notes are written as people read
// them in a terminal: Greek letters and Unicode superscripts as they are
// (χ, Λ, cm⁻³), a subscript after an underscore that follows a one-letter
// symbol (r_cl, t_cool,mix, ρ_hot, k_B), a superscript after a caret
// (T^1/2). Exported figures (cloudwind/internal/figure) draw those
// subscripts and superscripts as lowered and raised text.
package chartspec

import "cloudwind/model"

// A Series is one curve.
type Series struct {
	Name   string    // legend text
	X, Y   []float64 // points, in axis units (log10 on log axes); NaN or ±Inf breaks the line
	Index  int       // style and glyph index (criterion order), see chart.Styles.SeriesStyle
	Dashed bool      // drawn lighter/dotted: e.g. the pinned scenario A in compare mode
}

// MarkerKind is the shape of a Marker.
type MarkerKind int

const (
	VLine MarkerKind = iota // vertical line at X
	HLine                   // horizontal line at Y
	Point                   // a point at (X, Y)
)

// A Marker marks a value of interest: the current χ or r_cl, T_mix, T_hot.
type Marker struct {
	Kind  MarkerKind
	X, Y  float64 // axis units
	Label string  // short, ASCII preferred
	Warn  bool    // drawn in the warning style (e.g. outside the cooling table)
}

// An Axis describes one axis.
type Axis struct {
	Label    string  // with unit, e.g. "χ" or "r_crit (pc)"
	Log      bool    // values are log10; ticks are labelled 1e-2, 1e0, …
	Min, Max float64 // visible range in axis units
}

// A Band is the range a curve moves over when an unverified constant is
// off by its uncertainty factor either way: for the threshold chart,
// r_crit from Outcome.RCritLow to RCritHigh. It is drawn lighter than its
// curve, in the curve's style (Index).
type Band struct {
	Name   string    // whose band, e.g. "Li et al. 2020 (α ×/÷ 2)"
	X      []float64 // axis units, as the curve's
	Lo, Hi []float64 // the band's edges at X; NaN or ±Inf breaks the band
	Index  int       // the style index of its curve
}

// A RunMark is a simulation run placed on a chart at its inputs (its χ
// and r_cl, or χ and Mach), with what happened to its cloud.
type RunMark struct {
	X, Y    float64 // axis units
	Outcome model.RunOutcome
	Label   string // the run's label, for people
}

// A Zone is a stretch [Lo, Hi] of the x axis to mark (axis units), e.g.
// radii where the criteria disagree.
type Zone struct{ Lo, Hi float64 }

// A LineChart is a set of curves on two axes.
type LineChart struct {
	Title  string
	X, Y   Axis
	Series []Series
	Bands  []Band // uncertainty bands, drawn under the series
	// Zones are stretches of the x axis marked on the axis and shaded
	// under the curves, all named by ZoneName in the legend.
	Zones    []Zone
	ZoneName string
	// BandFactor is the uncertainty factor of the bands as people read it:
	// "×/÷ 2", or "×/÷ 2–4" when they differ; "" without bands. Each band is
	// r_crit when the unverified α is off by that factor either way.
	BandFactor string
	// DashedName names the dashed curves as a group in a terminal legend,
	// e.g. "pinned A": a dashed curve with the Index of a solid one then has
	// no entry of its own. "" lists every curve.
	DashedName string
	Markers    []Marker
	Runs       []RunMark // simulation outcomes on the chart; nil for none
	RunsName   string    // where the runs come from, for the legend ("demo (fictional)", a file name)
	Note       string    // one line under the chart, e.g. a caution
	Caption    string    // the scenario (Caption), for exported figures
}

// Agreement classifies a regime-map cell by the verdicts of the criteria
// with a cooling time there.
type Agreement uint8

const (
	// AllAgree: every criterion gives the same verdict, and none flips
	// within its uncertainty band or across the convention spread.
	AllAgree Agreement = iota
	// Disagree: the criteria give different verdicts, and none flips.
	Disagree
	// Depends: the verdict of at least one criterion flips within its
	// uncertainty band (model.Outcome.DependsOnConstant) or across the
	// convention spread, whether or not the criteria agree at the nominal
	// constants and convention. It takes precedence over the other two.
	Depends
)

// String returns "all agree", "criteria disagree" or "depends on constants
// or conventions".
func (a Agreement) String() string {
	switch a {
	case Disagree:
		return "criteria disagree"
	case Depends:
		return "depends on constants or conventions"
	}
	return "all agree"
}

// A RegimeMap is a grid of cells over two axes, each cell holding how many
// of the criteria predict survival, so that disagreement shows at a glance,
// and whether the criteria agree there (Class).
type RegimeMap struct {
	Title  string
	X, Y   Axis
	NX, NY int   // cells along X and Y
	Counts []int // NX×NY counts, row-major from the lowest Y: Counts[j*NX+i]; a negative count marks a cell without a valid state (drawn blank)
	// Transformed counts, per cell, the criteria predicting "transformed"
	// (model.Transformed): with Counts it tells the cells where none
	// survives but the criteria still disagree. Nil when no criterion can
	// predict it.
	Transformed []int
	Class       []Agreement // NX×NY classes, indexed as Counts; nil for a map without classes
	Total       int         // number of criteria counted (the largest possible count)
	// SpreadEvery is the step, in cells along each axis, of the sub-grid
	// on which the convention spread was evaluated (interpolated between):
	// 1 is every cell, 0 means the spread was not evaluated.
	SpreadEvery int
	Mark        *Marker
	Runs        []RunMark // simulation outcomes on the map; nil for none
	RunsName    string    // where the runs come from, for the legend
	Note        string
	Caption     string // the scenario (Caption), for exported figures
}
