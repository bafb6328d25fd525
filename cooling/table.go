package cooling

import (
	"errors"
	"fmt"
	"io"
	"math"

	"cloudwind/model"
)

// User cooling tables (cloudwind's format). ParseTable reads a plain-text
// table, validates it and converts every Λ column to n_H² once; Table.At
// then builds the *PowerLaw for a metallicity.

// Limits that keep any input from exhausting memory (common practice, no
// source).
const (
	maxTableBytes   = 10 << 20  // whole input
	maxTableRows    = 1_000_000 // data rows
	maxLineBytes    = 1 << 16   // one line
	maxColumnNumber = 1000      // highest column a setting may name
)

// Plausibility window for Λ per n_H² at T ≥ 10^4.5 K: it catches SI-versus-
// cgs (a 10^-13 factor) and forgotten logarithms (cloudwind's choice).
const (
	plausibleMinLog10T = 4.5
	plausibleMin       = 1e-26 // erg cm³ s⁻¹
	plausibleMax       = 1e-19 // erg cm³ s⁻¹
)

// Thresholds of load warnings (cloudwind's choices; below 2×10^4 K H is
// partly neutral and metals supply electrons, so n_e/n_H from H+He alone is
// unreliable).
const (
	wideStepDex      = 0.2   // warn about coarser log T steps
	fallbackNeBelow  = 2e4   // K; n_e/n_H from a fallback is unreliable below
	metalsWarnAboveZ = 3     // Z☉; the HHe+metals form is extrapolated above
	autoLogTBelow    = 20    // all T < 20 ⇒ log10 T
	clipTolerance    = 1e-12 // dex: a row at the clip temperature is kept despite rounding
)

// Sentinel errors of ParseTable, wrapped in *ParseError. ErrNotIncreasing and
// ErrNotFinite (see NewPowerLaw) are used as well.
var (
	ErrNonPositive      = errors.New("value must be positive")
	ErrTooFewRows       = errors.New("a cooling table needs at least 2 rows")
	ErrColumnCount      = errors.New("wrong number of columns")
	ErrNotNumeric       = errors.New("not a number")
	ErrNetHeating       = errors.New("net heating (Λ ≤ 0): clip the rows below a temperature to drop them")
	ErrZCount           = errors.New("number of metallicities differs from the number of Λ columns")
	ErrZOrder           = errors.New("metallicities must be finite, non-negative and increasing")
	ErrImplausible      = errors.New("implausible Λ (SI units, or a logarithm read as linear?)")
	ErrNoNormalisation  = errors.New("normalisation not given: state nH2, nenH, nent or n2")
	ErrConflict         = errors.New("option and directive disagree")
	ErrDirective        = errors.New("malformed directive")
	ErrColumnSpec       = errors.New("bad column selection")
	ErrLogScale         = errors.New("log/linear setting disagrees with the data")
	ErrNoHeliumRatio    = errors.New("the conversion needs y = n_He/n_H")
	ErrSetting          = errors.New("invalid setting")
	ErrTooLarge         = errors.New("input too large")
	ErrMetallicityRange = errors.New("metallicity outside the table's range")
)

// ParseError is an error in a user cooling table. Line is 1-based; it is 0
// when the error concerns the file as a whole or the caller's options.
type ParseError struct {
	File string // name given to ParseTable, control characters removed
	Line int    // line of the offending row or directive; 0 for the whole file
	Err  error  // wraps one of the sentinel errors
}

// Error returns "FILE:LINE: message", or "FILE: message" when Line is 0.
func (e *ParseError) Error() string {
	if e.Line > 0 {
		return fmt.Sprintf("%s:%d: %v", e.File, e.Line, e.Err)
	}
	return fmt.Sprintf("%s: %v", e.File, e.Err)
}

// Unwrap returns the underlying error.
func (e *ParseError) Unwrap() error { return e.Err }

// TableOptions says how to read a user table. Zero values mean "not given":
// the directive of the same name applies, else the stated default. A setting
// given both here and by a directive must agree, or ParseTable fails with
// ErrConflict. Column numbers are 1-based.
type TableOptions struct {
	TColumn       int   // column of T; default 1
	LambdaColumns []int // columns of Λ, one per metallicity; default {2} unless HHe/metals are given
	HHeColumn     int   // column of Λ_HHe (H and He only); with MetalsColumn
	MetalsColumn  int   // column of Λ_metals,☉ (metals at solar Z); with HHeColumn
	NeColumn      int   // column of n_e, or n_e/n_H; for nenH and nent
	NHColumn      int   // column of n_H dividing the n_e and n_t columns (SD93 files); default: they are ratios
	NtColumn      int   // column of n_t, or n_t/n_H, for nent; default n_t/n_H = 1+y
	SkipLines     int   // lines at the top to ignore unread (SD93 files have 4); default 0
	HeaderRow     bool  // the first non-comment line names the columns (it is auto-detected when every token is non-numeric)

	LogT      *bool          // T column holds log10 T; nil: auto (all T < 20 ⇒ log)
	LogLambda *bool          // Λ columns hold log10 Λ; nil: auto (all Λ < 0 ⇒ log)
	Norm      *Normalisation // density product of the Λ columns; required here or by directive, never guessed

	Z           []float64         // Z/Z☉ of each Λ column, increasing; required for several columns
	HeliumRatio *float64          // y = n_He/n_H; needed when n_e/n_H or n_t/n_H comes from a fallback
	ClipBelow   model.Temperature // drop every row with T below this (K); 0: drop none

	// NeOverNH gives n_e/n_H at T for nenH and nent tables without an n_e
	// column; pass the built-in primordial solver's (cooling.NeOverNH).
	// nil: fully ionised H+He, 1+2y, with a warning.
	NeOverNH func(t model.Temperature, y float64) float64
}

// Table is a validated user table with every Λ column converted to n_H²
// normalisation. It is immutable and safe for concurrent use.
type Table struct {
	log10T []float64   // strictly increasing
	z      []float64   // Z of each column of lambda; nil for one column without Z
	lambda [][]float64 // [column][row] Λ per n_H², erg cm³ s⁻¹, > 0
	hhe    []float64   // Λ_HHe per n_H² (HHe+metals form), > 0
	metals []float64   // Λ_metals,☉ per n_H² (HHe+metals form), ≥ 0
	names  []string    // column names from the header row, if any
	meta   Meta
}

// ParseTable reads a user cooling table from r; name identifies it in
// errors and in Meta. Every failure is a *ParseError naming the line.
//
// # Format
//
// Plain text, one row per line; columns separated by whitespace, or by
// commas when a line contains one. '#' starts a comment; blank lines and
// CRLF line ends are accepted. Numbers are decimal (a Fortran exponent such
// as 1.0D-22 is accepted); the n_e, n_H and n_t columns are always linear.
// Only the columns the settings name are read; every row must have the same
// number of columns. The first non-comment line
// is taken as column names when every token on it is non-numeric (as in
// CHIANTI-style files) or when HeaderRow says so; any other non-numeric
// token is an error.
//
// # Directives
//
// A file of cloudwind's own layout starts with the line "# cloudwind-table";
// the comment lines that follow it, before the first row, may hold
// directives of the form "# key: value" (keys case-insensitive):
//
//	# cloudwind-table
//	# norm: nenH                  nH2, nenH, nent or n2 (required here or as an option)
//	# columns: T=1 lambda=2,3,4   also HHe=, metals=, ne=, nH=, nt=
//	# log: T=yes lambda=yes       yes, no or auto
//	# Z: 0.1 0.3 1                Z/Z☉ of each lambda column, increasing
//	# y: 0.0851                   n_He/n_H
//	# clip-below: 1e4             K; drop every row below
//	# header: yes                 the first row names the columns
//
// A comment line whose first word before a colon is not a directive key
// draws a warning; comment lines without "word:" are free text. Without
// the first line, comments are only comments.
//
// # Conversion and validation
//
// Λ is converted to n_H² once (derived from the definitions of the
// normalisations):
// Λ_hd = (n_e/n_H) Λ_nenH = (n_e/n_H)(n_t/n_H) Λ_N; n2 is treated as nH2
// with a warning. The source's normalisation is kept in Meta. ParseTable
// rejects non-numeric, NaN or infinite values, ragged rows, fewer than 2
// rows, T not strictly increasing, T ≤ 0 or Λ ≤ 0 in linear mode (net
// heating: rows below ClipBelow are dropped, all of them, so no hole is
// interpolated across; the count goes to Meta.Warnings), a Z count that
// differs from the Λ columns, non-increasing Z, and Λ per n_H² outside
// (1e-26, 1e-19) erg cm³ s⁻¹ at T ≥ 10^4.5 K. It warns about log T steps
// above 0.2 dex, the n2 normalisation and n_e/n_H from a fallback below
// 2×10^4 K. Inputs above 10 MB, 10^6 rows or 64 KiB per line are refused.
func ParseTable(r io.Reader, name string, opt TableOptions) (*Table, error) {
	name = cleanText(name)
	raw, err := readTable(r, opt)
	if err != nil {
		return nil, fileError(name, err)
	}
	t, err := buildTable(raw)
	if err != nil {
		return nil, fileError(name, err)
	}
	t.meta.Name = name
	return t, nil
}

// fileError puts the file name into a *ParseError (making one, Line 0, if
// err is not one already).
func fileError(name string, err error) error {
	var pe *ParseError
	if errors.As(err, &pe) {
		pe.File = name
		return pe
	}
	return &ParseError{File: name, Err: err}
}

// Meta returns the table's metadata: the source's normalisation, y, and the
// warnings raised while loading.
func (t *Table) Meta() Meta {
	m := t.meta
	m.Caveats = append([]string(nil), m.Caveats...)
	m.Warnings = append([]string(nil), m.Warnings...)
	return m
}

// ColumnNames returns the names from the table's header row (control
// characters removed), or nil.
func (t *Table) ColumnNames() []string { return append([]string(nil), t.names...) }

// ZRange reports the metallicities At accepts, in Z☉: [Zmin, Zmax] of the Λ
// columns, or [0, +Inf) for the HHe+metals form. ok is false for a table
// with one Λ column and no Z, whose curve At returns for any Z.
func (t *Table) ZRange() (lo, hi float64, ok bool) {
	switch {
	case t.hhe != nil:
		return 0, math.Inf(1), true
	case t.z == nil:
		return math.NaN(), math.NaN(), false
	}
	return t.z[0], t.z[len(t.z)-1], true
}

// At returns the cooling curve at metallicity z (Z/Z☉), per n_H², with
// nodes at the table's temperatures (cloudwind's rules):
//
//   - HHe+metals form: Λ = Λ_HHe + z Λ_metals,☉ for any z ≥ 0, with a
//     warning in Meta above 3 Z☉ (W09's metal scaling by n_e/n_H is not
//     applied);
//   - several Λ columns: linear interpolation in z (not log z) between the
//     two bracketing columns, node by node; z outside [Zmin, Zmax] is
//     ErrMetallicityRange;
//   - one column without Z: that curve, whatever z (NaN included), with a
//     warning in Meta when z is not NaN.
func (t *Table) At(z float64) (*PowerLaw, error) {
	meta := t.Meta()
	meta.Metallicity = z
	n := len(t.log10T)
	ys := make([]float64, n)
	switch {
	case t.hhe != nil:
		if !(z >= 0) || math.IsInf(z, 1) {
			return nil, fmt.Errorf("z = %s Z☉, want ≥ 0: %w", num(z), ErrMetallicityRange)
		}
		if z > metalsWarnAboveZ {
			meta.Warnings = append(meta.Warnings, fmt.Sprintf("Z = %s Z☉ is above %s Z☉: the metal column is extrapolated linearly", num(z), num(float64(metalsWarnAboveZ))))
		}
		for i := range ys {
			ys[i] = math.Log10(t.hhe[i] + z*t.metals[i])
		}
	case t.z == nil:
		if !math.IsNaN(z) {
			meta.Warnings = append(meta.Warnings, fmt.Sprintf("the table has no metallicity: Z = %s Z☉ not applied", num(z)))
		}
		meta.Metallicity = math.NaN()
		for i := range ys {
			ys[i] = math.Log10(t.lambda[0][i])
		}
	default:
		lo, hi := t.z[0], t.z[len(t.z)-1]
		if !(z >= lo && z <= hi) {
			return nil, fmt.Errorf("z = %s Z☉ outside [%s, %s]: %w", num(z), num(lo), num(hi), ErrMetallicityRange)
		}
		j := 0
		for j < len(t.z)-2 && z > t.z[j+1] {
			j++
		}
		if len(t.z) == 1 || z == t.z[j] {
			for i := range ys {
				ys[i] = math.Log10(t.lambda[j][i])
			}
			break
		}
		w := (z - t.z[j]) / (t.z[j+1] - t.z[j]) // linear in Z (cloudwind's choice: Λ is affine in Z)
		for i := range ys {
			ys[i] = math.Log10((1-w)*t.lambda[j][i] + w*t.lambda[j+1][i])
		}
	}
	p, err := NewPowerLaw(t.log10T, ys, meta)
	if err != nil { // the parser has established the invariants
		return nil, fmt.Errorf("table %s at Z = %s: %w", meta.Name, num(z), err)
	}
	return p, nil
}
