package cooling

//go:generate go run ./internal/fitmetals

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/interp"
)

// The metal part of the built-in cooling function: a natural cubic spline
// in log10 T – log10 Λ through 24 knots, fitted by cooling/internal/fitmetals
// to the metal part of the CHIANTI-based CIE curves of Ryden & Pogge (2021,
// Interstellar and Intergalactic Medium, Cambridge University Press,
// companion data, CC-BY-4.0),
//
//	Λ_met(T) = (Λ_z1(T) − Λ_z0.001(T)) / 0.999,
//
// per unit Z/Z☉ and per n_e n_H, Grevesse & Sauval (1998) abundances. The
// knots are embedded as assets/chianti_metals_fit.txt, whose header carries
// the attribution and the measured accuracy.

// metalFitFile is the name of the coefficient file in assets.FS.
const metalFitFile = "chianti_metals_fit.txt"

// metalFitKeys returns the header fields a coefficient file must have.
func metalFitKeys() []string {
	return []string{
		"source", "licence", "derived work", "abundances", "normalisation",
		"units", "log base", "form", "valid", "max-rel-error",
	}
}

// errMetalFit marks a malformed coefficient file.
var errMetalFit = errors.New("malformed metal fit file")

// fitBand is the stated accuracy of the fit over a range of log10 T.
type fitBand struct {
	lo, hi float64 // log10 T range
	maxRel float64 // largest |fit/target − 1| there
}

// metalFit is a parsed coefficient file. It is not modified after parsing.
type metalFit struct {
	header      map[string][]string // header values by key (a key may repeat)
	knots, vals []float64           // log10 T and log10 Λ_met (per n_e n_H) at the knots
	lo, hi      float64             // validity range, log10 T
	bands       []fitBand
	spline      *interp.NaturalCubic
}

// parseMetalFit reads a coefficient file: "# key: value" header lines (and
// other comments), one column-name row, then rows "log10T log10Lambda" with
// strictly increasing, finite log10 T. Errors name the line.
func parseMetalFit(r io.Reader) (*metalFit, error) {
	m := &metalFit{header: map[string][]string{}}
	sc := bufio.NewScanner(r)
	line, named := 0, false
	for sc.Scan() {
		line++
		s := strings.TrimSpace(sc.Text())
		if s == "" {
			continue
		}
		if c, ok := strings.CutPrefix(s, "#"); ok {
			if k, v, ok := strings.Cut(c, ":"); ok {
				k = strings.TrimSpace(k)
				m.header[k] = append(m.header[k], strings.TrimSpace(v))
			}
			continue
		}
		f := strings.Fields(s)
		if !named {
			if len(f) != 2 || f[0] != "log10T" {
				return nil, fmt.Errorf("line %d: want the column names \"log10T log10Lambda\": %w", line, errMetalFit)
			}
			named = true
			continue
		}
		if len(f) != 2 {
			return nil, fmt.Errorf("line %d: want 2 columns, got %d: %w", line, len(f), errMetalFit)
		}
		x, err1 := strconv.ParseFloat(f[0], 64)
		y, err2 := strconv.ParseFloat(f[1], 64)
		if err1 != nil || err2 != nil || math.IsInf(x, 0) || math.IsNaN(x) || math.IsInf(y, 0) || math.IsNaN(y) {
			return nil, fmt.Errorf("line %d: not a finite number: %w", line, errMetalFit)
		}
		if n := len(m.knots); n > 0 && !(x > m.knots[n-1]) {
			return nil, fmt.Errorf("line %d: log10 T not increasing: %w", line, errMetalFit)
		}
		m.knots, m.vals = append(m.knots, x), append(m.vals, y)
	}
	if err := sc.Err(); err != nil {
		return nil, err
	}
	if len(m.knots) < 4 {
		return nil, fmt.Errorf("%d knots, want at least 4: %w", len(m.knots), errMetalFit)
	}
	for _, k := range metalFitKeys() {
		if len(m.header[k]) == 0 {
			return nil, fmt.Errorf("header field %q missing: %w", k, errMetalFit)
		}
	}
	if n := m.header["normalisation"][0]; !strings.HasPrefix(n, PerNeNH.String()+" ") && n != PerNeNH.String() {
		return nil, fmt.Errorf("normalisation %q, want nenH: %w", n, errMetalFit)
	}
	if b := m.header["log base"][0]; !strings.HasPrefix(b, "10") {
		return nil, fmt.Errorf("log base %q, want 10: %w", b, errMetalFit)
	}
	if _, err := fmt.Sscanf(m.header["valid"][0], "log10 T %g to %g", &m.lo, &m.hi); err != nil || !(m.lo < m.hi) {
		return nil, fmt.Errorf("valid range %q: %w", m.header["valid"][0], errMetalFit)
	}
	if m.lo < m.knots[0]-1e-9 || m.hi > m.knots[len(m.knots)-1]+1e-9 {
		return nil, fmt.Errorf("valid range [%g, %g] outside the knots: %w", m.lo, m.hi, errMetalFit)
	}
	for _, v := range m.header["max-rel-error"] {
		var b fitBand
		if _, err := fmt.Sscanf(v, "%g %g %g", &b.lo, &b.hi, &b.maxRel); err != nil || !(b.lo < b.hi) || !(b.maxRel >= 0) {
			return nil, fmt.Errorf("max-rel-error %q: %w", v, errMetalFit)
		}
		m.bands = append(m.bands, b)
	}
	// The knots are strictly increasing and at least 4, so Fit cannot panic.
	var s interp.NaturalCubic
	if err := s.Fit(m.knots, m.vals); err != nil {
		return nil, fmt.Errorf("spline: %w", err)
	}
	m.spline = &s
	return m, nil
}

// loadMetalFit reads and parses the coefficient file name from fsys.
func loadMetalFit(fsys fs.FS, name string) (*metalFit, error) {
	f, err := fsys.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	m, err := parseMetalFit(f)
	if err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	return m, nil
}

// log10Lambda returns log10 Λ_met (per n_e n_H, erg cm³ s⁻¹) at log10 T =
// x, which the caller keeps inside [m.lo, m.hi].
func (m *metalFit) log10Lambda(x float64) float64 { return m.spline.Predict(x) }

// accuracy describes the stated accuracy of the fit for Meta, e.g.
// "metal fit within 3.37% (10^4.00–10^4.30 K), 1.81% (…) of its CHIANTI target".
func (m *metalFit) accuracy() string {
	var b strings.Builder
	b.WriteString("metal fit reproduces the CHIANTI metal part within ")
	for i, r := range m.bands {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "%.1f%% (10^%.1f–10^%.1f K)", 100*r.maxRel, r.lo, r.hi)
	}
	return b.String()
}
