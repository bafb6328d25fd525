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

// A LineChart is a set of curves on two axes.
type LineChart struct {
	Title   string
	X, Y    Axis
	Series  []Series
	Markers []Marker
	Note    string // one line under the chart, e.g. a caution
	Caption string // the scenario (Caption), for exported figures
}

// A RegimeMap is a grid of cells over two axes, each cell holding how many
// of the criteria predict survival, so that disagreement shows at a glance.
type RegimeMap struct {
	Title   string
	X, Y    Axis
	NX, NY  int   // cells along X and Y
	Counts  []int // NX×NY counts, row-major from the lowest Y: Counts[j*NX+i]; a negative count marks a cell without a valid state (drawn blank)
	Total   int   // number of criteria counted (the largest possible count)
	Mark    *Marker
	Note    string
	Caption string // the scenario (Caption), for exported figures
}
