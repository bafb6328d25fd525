package cooling

import (
	"fmt"
	"math"

	"cloudwind/model"
)

// Validation of the raw rows of a user table and conversion to n_H².

// minNormal is the smallest normal float64, 2^-1022.
const minNormal = 0x1p-1022

// buildTable validates raw rows, drops the clipped ones, converts Λ to n_H²
// and checks magnitudes (the conversion derived from the normalisations,
// the checks cloudwind's choice).
func buildTable(raw *rawTable) (*Table, error) {
	s := raw.set
	warn := append([]string(nil), raw.warnings...)
	if len(raw.t) < 2 {
		return nil, &ParseError{Err: fmt.Errorf("%d data rows: %w", len(raw.t), ErrTooFewRows)}
	}
	logT, err := decideLogT(raw, s.logT)
	if err != nil {
		return nil, err
	}
	logL, err := decideLogLambda(raw, s.logL)
	if err != nil {
		return nil, err
	}
	// Temperatures: positive, strictly increasing as stored (log10).
	x := make([]float64, len(raw.t))
	for i, v := range raw.t {
		if logT {
			x[i] = v
		} else if x[i] = math.Log10(v); !(v > 0) {
			return nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("T = %s K: %w", num(v), ErrNonPositive)}
		}
		if !(math.Pow(10, x[i]) > 0) {
			return nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("T = 10^%g K underflows: %w", v, ErrNonPositive)}
		}
		if i > 0 && !(x[i] > x[i-1]) {
			return nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("T = %s after %s: %w", num(v), num(raw.t[i-1]), ErrNotIncreasing)}
		}
	}
	// Clipping drops every row below the clip temperature.
	first := 0
	if s.clip > 0 {
		lc := math.Log10(s.clip) - clipTolerance
		heating := 0
		for first < len(x) && x[first] < lc {
			if !logL && raw.heats(first) {
				heating++
			}
			first++
		}
		if first > 0 {
			warn = append(warn, fmt.Sprintf("%s below T = %s K dropped (clip below), %d of them with net heating", plural(first, "row"), num(s.clip), heating))
		}
	}
	n := len(x) - first
	if n < 2 {
		return nil, &ParseError{Err: fmt.Errorf("%d data rows at or above T = %s K: %w", n, num(s.clip), ErrTooFewRows)}
	}
	t := &Table{log10T: x[first:], names: raw.names}
	conv, w, err := raw.conversion(first, x, logT)
	if err != nil {
		return nil, err
	}
	warn = append(warn, w...)
	column := func(vals []float64, col int, zeroOK bool) ([]float64, error) {
		out := make([]float64, n)
		for k := range out {
			i := first + k
			v := vals[i]
			if logL {
				if v = math.Pow(10, v); v == 0 {
					return nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("column %d: Λ = 10^%g underflows: %w", col, vals[i], ErrNonPositive)}
				}
			} else if v < 0 || (v == 0 && !zeroOK) {
				return nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("column %d: Λ = %s at T = %s K: %w", col, num(v), model.FormatNumber(math.Pow(10, x[i]), 4), ErrNetHeating)}
			}
			switch out[k] = v * conv[k]; {
			case math.IsInf(out[k], 0):
				return nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("column %d: Λ = %s after conversion: %w", col, num(out[k]), ErrNotFinite)}
			case out[k] < minNormal && !(zeroOK && out[k] == 0):
				// Subnormal values could round to 0 when interpolated in Z.
				return nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("column %d: Λ = %s underflows: %w", col, num(out[k]), ErrNonPositive)}
			}
		}
		return out, nil
	}
	if s.hheCol > 0 {
		if t.hhe, err = column(raw.hhe, s.hheCol, false); err != nil {
			return nil, err
		}
		if t.metals, err = column(raw.met, s.metCol, true); err != nil {
			return nil, err
		}
		if err := raw.plausible(t.log10T, first, t.hhe, nil, s.hheCol); err != nil {
			return nil, err
		}
		if err := raw.plausible(t.log10T, first, t.hhe, t.metals, s.metCol); err != nil {
			return nil, err
		}
	} else {
		t.lambda = make([][]float64, len(s.lamCols))
		for j, c := range s.lamCols {
			if t.lambda[j], err = column(raw.lam[j], c, false); err != nil {
				return nil, err
			}
			if err := raw.plausible(t.log10T, first, t.lambda[j], nil, c); err != nil {
				return nil, err
			}
		}
		if len(s.z) > 0 {
			t.z = s.z
		}
	}
	if wide, at := wideSteps(t.log10T); wide > 0 {
		warn = append(warn, fmt.Sprintf("%s wider than %g dex in log T (first at line %d): log-log interpolation across them is coarse", plural(wide, "step"), wideStepDex, raw.line[first+at]))
	}
	t.meta = Meta{
		Citation:      "user-supplied table",
		Normalisation: s.norm,
		Metallicity:   math.NaN(),
		Caveats:       []string{"user-supplied table: cloudwind checks its format and magnitudes, not its physics"},
		Warnings:      warn,
	}
	if s.haveY {
		t.meta.HeliumRatio = s.y
	}
	return t, nil
}

// heats reports whether row i has Λ ≤ 0 in a Λ, HHe or metals column
// (linear mode; metals may be 0).
func (raw *rawTable) heats(i int) bool {
	for _, c := range raw.lam {
		if c[i] <= 0 {
			return true
		}
	}
	return (raw.hhe != nil && raw.hhe[i] <= 0) || (raw.met != nil && raw.met[i] < 0)
}

// decideLogT applies the log T rule: auto means log when every T < 20; an
// explicit setting must agree with the data (cloudwind's rule).
func decideLogT(raw *rawTable, given *bool) (bool, error) {
	big := -1 // first row with T ≥ 20
	for i, v := range raw.t {
		if v >= autoLogTBelow {
			big = i
			break
		}
	}
	switch {
	case given == nil:
		return big < 0, nil
	case *given && big >= 0:
		return false, &ParseError{Line: raw.line[big], Err: fmt.Errorf("T declared log10 but T = %s: %w", num(raw.t[big]), ErrLogScale)}
	case !*given && big < 0:
		return false, &ParseError{Err: fmt.Errorf("T declared linear but every T is below %d K (log10?): %w", autoLogTBelow, ErrLogScale)}
	}
	return *given, nil
}

// decideLogLambda applies the log Λ rule: auto means log when every Λ < 0
// (over all Λ, HHe and metals columns); an explicit setting must agree.
func decideLogLambda(raw *rawTable, given *bool) (bool, error) {
	cols := append(append([][]float64(nil), raw.lam...), raw.hhe, raw.met)
	row, col := -1, -1 // first value ≥ 0
	for i := range raw.t {
		for j, c := range cols {
			if c != nil && c[i] >= 0 {
				row, col = i, j
				break
			}
		}
		if row >= 0 {
			break
		}
	}
	switch {
	case given == nil:
		return row < 0, nil
	case *given && row >= 0:
		return false, &ParseError{Line: raw.line[row], Err: fmt.Errorf("Λ declared log10 but value %s ≥ 0: %w", num(cols[col][row]), ErrLogScale)}
	case !*given && row < 0:
		return false, &ParseError{Err: fmt.Errorf("Λ declared linear but every value is negative (log10?): %w", ErrLogScale)}
	}
	return *given, nil
}

// conversion returns, for the rows from first on, the factor that turns the
// table's Λ into Λ per n_H² (derived from L = n_H² Λ_hd = n_e n_H Λ_nenH =
// n_e n_t Λ_N):
//
//	nH2, n2: 1;  nenH: n_e/n_H;  nent: (n_e/n_H)(n_t/n_H).
func (raw *rawTable) conversion(first int, x []float64, logT bool) ([]float64, []string, error) {
	s := raw.set
	n := len(x) - first
	f := make([]float64, n)
	var warn []string
	switch s.norm {
	case PerN2:
		warn = append(warn, "normalisation n² is ambiguous; treated as n_H² (check what your code means by n)")
		fallthrough
	case PerNH2:
		for k := range f {
			f[k] = 1
		}
		return f, warn, nil
	}
	needY := (s.neCol == 0) || (s.norm == PerNeNt && s.ntCol == 0)
	if needY && !s.haveY {
		return nil, nil, &ParseError{Err: fmt.Errorf("normalisation %v without n_e or n_t columns: %w", s.norm, ErrNoHeliumRatio)}
	}
	ratio := func(i, col int, vals []float64, what string) (float64, error) {
		v := vals[i]
		if s.nhCol > 0 {
			v /= raw.nh[i]
		}
		if !(v > 0) || math.IsInf(v, 0) {
			return 0, &ParseError{Line: raw.line[i], Err: fmt.Errorf("column %d: %s = %s: %w", col, what, num(v), ErrNonPositive)}
		}
		return v, nil
	}
	lowT := false
	for k := range f {
		i := first + k
		var ne float64
		var err error
		switch {
		case s.neCol > 0:
			if ne, err = ratio(i, s.neCol, raw.ne, "n_e/n_H"); err != nil {
				return nil, nil, err
			}
		case s.neOverNH != nil:
			ne = s.neOverNH(model.Temperature(math.Pow(10, x[i])), s.y)
			if !(ne > 0) || math.IsInf(ne, 0) {
				return nil, nil, &ParseError{Line: raw.line[i], Err: fmt.Errorf("n_e/n_H = %s from NeOverNH at T = %s K: %w", num(ne), model.FormatNumber(math.Pow(10, x[i]), 4), ErrNonPositive)}
			}
		default:
			ne = 1 + 2*s.y // fully ionised H+He (derived: n_e = n_H + 2 n_He)
		}
		if s.neCol == 0 && x[i] < math.Log10(fallbackNeBelow) {
			lowT = true
		}
		f[k] = ne
		if s.norm == PerNeNt {
			nt := 1 + s.y // all H and He nuclei; metals neglected
			if s.ntCol > 0 {
				if nt, err = ratio(i, s.ntCol, raw.nt, "n_t/n_H"); err != nil {
					return nil, nil, err
				}
			}
			f[k] *= nt
		}
	}
	switch {
	case s.neCol == 0 && s.neOverNH == nil:
		warn = append(warn, fmt.Sprintf("n_e/n_H = 1+2y = %s assumed (fully ionised H+He)", model.FormatNumber(1+2*s.y, 4)))
	}
	if lowT {
		warn = append(warn, fmt.Sprintf("n_e/n_H below %s K comes from a fallback, not the table, and is unreliable there", num(fallbackNeBelow)))
	}
	if s.norm == PerNeNt && s.ntCol == 0 {
		warn = append(warn, fmt.Sprintf("n_t/n_H = 1+y = %s assumed (metals neglected)", model.FormatNumber(1+s.y, 4)))
	}
	return f, warn, nil
}

// plausible checks a converted column (lam, or lam + metals at Z☉ when
// metals is not nil) at T ≥ 10^4.5 K against (1e-26, 1e-19) erg cm³ s⁻¹
// (cloudwind's plausibility window).
func (raw *rawTable) plausible(log10T []float64, first int, lam, metals []float64, col int) error {
	for k, x := range log10T {
		if x < plausibleMinLog10T {
			continue
		}
		v := lam[k]
		if metals != nil {
			v += metals[k]
		}
		if !(v > plausibleMin && v < plausibleMax) {
			return &ParseError{Line: raw.line[first+k], Err: fmt.Errorf("column %d: Λ = %s erg cm³ s⁻¹ per n_H² at T = %s K, outside (%s, %s): %w",
				col, model.FormatNumber(v, 3), model.FormatNumber(math.Pow(10, x), 4), num(plausibleMin), num(plausibleMax), ErrImplausible)}
		}
	}
	return nil
}

// wideSteps counts steps wider than wideStepDex and returns the index of
// the row after the first one.
func wideSteps(x []float64) (count, at int) {
	for i := 1; i < len(x); i++ {
		if x[i]-x[i-1] > wideStepDex+1e-9 {
			if count == 0 {
				at = i
			}
			count++
		}
	}
	return count, at
}

// plural returns "1 row", "2 rows".
func plural(n int, noun string) string {
	if n == 1 {
		return "1 " + noun
	}
	return fmt.Sprintf("%d %ss", n, noun)
}
