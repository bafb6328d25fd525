// Command fitmetals fits the compact metal cooling curve that cloudwind
// embeds (assets/chianti_metals_fit.txt) to the open CHIANTI-based CIE
// curves of Ryden & Pogge (2021), and writes the coefficient file.
//
// It is run by `go generate ./cooling` from the module root and reads
//
//	testdata/cie-cooling-chianti/cooling_z1.txt
//	testdata/cie-cooling-chianti/cooling_z0.001.txt
//
// relative to the module root, where they ship as test data with their
// licence and attribution; $CLOUDWIND_REFERENCE_DIR (a directory holding
// cie-cooling-chianti/, or that directory itself) overrides that, and -data
// overrides both. The target is the
// metal part per unit Z/Z☉, normalised per n_e n_H as the files are
// (inferred, the files do not state it: their hydrogen peak matches Gnat &
// Ferland 2012's value per n_e n_H to ~1.5%):
//
//	Λ_met(T) = (Λ_z1(T) − Λ_z0.001(T)) / 0.999.
//
// The fit is a natural cubic spline in log10 T – log10 Λ through a few dozen
// knots (gonum interp.NaturalCubic, the same spline cloudwind evaluates at
// run time). For fixed knot positions the spline is linear in the knot
// values, so those are found by weighted linear least squares (QR, gonum
// mat); the knot positions are then moved by pattern search (Hooke & Jeeves
// 1961) to reduce the largest weighted error. Knot positions are rounded to
// 1e-4 dex and values to 1e-6 dex, and the accuracy written to the header
// is measured on exactly what is written. The weights follow the rounding of
// the files (0.001 dex): above ~10^7.5 K, and beside the hydrogen peak, the
// metal part is a small difference of two rounded logs, so it is noisy and
// weighted down.
//
// The data files are not embedded in the program: only the knots of the
// fit, a derived work, are written to assets/, with the attribution that
// CC-BY-4.0 requires.
package main

import (
	"bufio"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/interp"
	"gonum.org/v1/gonum/mat"
)

const (
	zBase = 0.001 // metallicity of the base file cooling_z0.001.txt, Z☉
	// roundingDex is the half-width of the rounding of the files' log
	// values (they are printed to 0.001 dex); its standard deviation is
	// roundingDex/√3.
	roundingDex = 0.0005
	// floorDex is a model-error floor added to the weights so that clean
	// points are not weighted without limit (derived: about 0.5%).
	floorDex = 0.002
)

func main() {
	if err := run(os.Args[1:], os.Stdout); err != nil {
		fmt.Fprintln(os.Stderr, "fitmetals:", err)
		os.Exit(1)
	}
}

func run(args []string, stdout io.Writer) error {
	fl := flag.NewFlagSet("fitmetals", flag.ContinueOnError)
	root, rootErr := moduleRoot()
	defData, defOut := "", ""
	if rootErr == nil {
		defData = filepath.Join(root, "testdata", "cie-cooling-chianti")
		defOut = filepath.Join(root, "assets", "chianti_metals_fit.txt")
	}
	if d := os.Getenv("CLOUDWIND_REFERENCE_DIR"); d != "" {
		defData = d
		if _, err := os.Stat(filepath.Join(d, "cie-cooling-chianti", "cooling_z1.txt")); err == nil {
			defData = filepath.Join(d, "cie-cooling-chianti")
		}
	}
	data := fl.String("data", defData, "directory holding cooling_z1.txt and cooling_z0.001.txt")
	out := fl.String("out", defOut, "coefficient file to write")
	nKnots := fl.Int("knots", 24, "number of spline knots")
	resid := fl.Bool("resid", false, "print the relative residual at every node")
	iters := fl.Int("iter", 20000, "cost evaluations for the knot-position search (0: uniform knots)")
	if err := fl.Parse(args); err != nil {
		return err
	}
	if *data == "" || *out == "" {
		return fmt.Errorf("cannot find go.mod (%v); give -data and -out", rootErr)
	}
	if *nKnots < 4 {
		return errors.New("need at least 4 knots")
	}
	x1, l1, err := readTotal(filepath.Join(*data, "cooling_z1.txt"))
	if err != nil {
		return err
	}
	x0, l0, err := readTotal(filepath.Join(*data, "cooling_z0.001.txt"))
	if err != nil {
		return err
	}
	if len(x1) != len(x0) {
		return fmt.Errorf("files have %d and %d rows", len(x1), len(x0))
	}
	t := target{x: x1, y: make([]float64, len(x1)), w: make([]float64, len(x1))}
	for i := range x1 {
		if math.Abs(x1[i]-x0[i]) > 1e-9 {
			return fmt.Errorf("row %d: log T %g and %g differ", i, x1[i], x0[i])
		}
		a, b := math.Pow(10, l1[i]), math.Pow(10, l0[i])
		met := (a - b) / (1 - zBase)
		if !(met > 0) {
			return fmt.Errorf("log T = %.2f: metal part %g is not positive", x1[i], met)
		}
		t.y[i] = math.Log10(met)
		// Rounding noise of log10 Λ_met, propagated from both files.
		s := roundingDex / math.Sqrt(3) * math.Hypot(a, b) / (a - b)
		t.w[i] = 1 / math.Hypot(s, floorDex)
	}
	lo, hi := t.x[0], t.x[len(t.x)-1]
	knots := make([]float64, *nKnots)
	for i := range knots {
		knots[i] = lo + (hi-lo)*float64(i)/float64(*nKnots-1)
	}
	if *iters > 0 {
		knots = optimiseKnots(t, knots, *iters)
	}
	// Round the knots to 1e-4 dex and the values to 1e-6 dex as written,
	// then measure the accuracy of exactly what is written.
	for i := range knots {
		knots[i] = math.Round(knots[i]*1e4) / 1e4
	}
	vals, err := t.fit(knots)
	if err != nil {
		return err
	}
	for i := range vals {
		vals[i] = math.Round(vals[i]*1e6) / 1e6
	}
	acc, err := measure(t, knots, vals)
	if err != nil {
		return err
	}
	if *resid {
		if err := printResiduals(stdout, t, knots, vals); err != nil {
			return err
		}
	}
	fmt.Fprintf(stdout, "fitmetals: %d knots, rms error %.2f%%\n", len(knots), 100*acc.rms)
	for b, r := range bands {
		fmt.Fprintf(stdout, "  10^%.2f-10^%.2f K: max error %.2f%% at 10^%.2f K\n", r[0], r[1], 100*acc.max[b], acc.at[b])
	}
	return writeAtomic(*out, func(w io.Writer) error { return write(w, knots, vals, acc, lo, hi, len(t.x)) })
}

// moduleRoot walks up from the working directory to the directory holding
// go.mod.
func moduleRoot() (string, error) {
	dir, err := os.Getwd()
	if err != nil {
		return "", err
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			return dir, nil
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			return "", errors.New("no go.mod above the working directory")
		}
		dir = parent
	}
}

// readTotal reads the logT and Total columns of a CHIANTI cooling file:
// '#' comments, one uncommented column-name row, then numeric rows.
func readTotal(path string) (log10T, log10L []float64, err error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, nil, err
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	line := 0
	for sc.Scan() {
		line++
		s := strings.TrimSpace(sc.Text())
		if s == "" || strings.HasPrefix(s, "#") {
			continue
		}
		fs := strings.Fields(s)
		if len(fs) < 2 {
			return nil, nil, fmt.Errorf("%s:%d: want at least 2 columns", path, line)
		}
		x, errX := strconv.ParseFloat(fs[0], 64)
		y, errY := strconv.ParseFloat(fs[1], 64)
		if errX != nil || errY != nil {
			if len(log10T) == 0 && fs[0] == "logT" {
				continue // the column-name row
			}
			return nil, nil, fmt.Errorf("%s:%d: not a number", path, line)
		}
		if n := len(log10T); n > 0 && !(x > log10T[n-1]) {
			return nil, nil, fmt.Errorf("%s:%d: log T not increasing", path, line)
		}
		log10T, log10L = append(log10T, x), append(log10L, y)
	}
	if err := sc.Err(); err != nil {
		return nil, nil, err
	}
	if len(log10T) < 10 {
		return nil, nil, fmt.Errorf("%s: only %d rows", path, len(log10T))
	}
	return log10T, log10L, nil
}

// target is the curve to fit: log10 T, log10 Λ_met and weights (1/σ in dex).
type target struct{ x, y, w []float64 }

// basis returns the matrix B with B[i][j] the natural cubic spline through
// knots with unit value at knot j and zero at the others, evaluated at x_i.
// The spline is linear in its knot values, so S(x_i) = Σ_j B[i][j] v_j.
func basis(knots, x []float64) (*mat.Dense, error) {
	b := mat.NewDense(len(x), len(knots), nil)
	unit := make([]float64, len(knots))
	for j := range knots {
		unit[j] = 1
		var s interp.NaturalCubic
		if err := s.Fit(knots, unit); err != nil {
			return nil, err
		}
		for i, xi := range x {
			b.Set(i, j, s.Predict(xi))
		}
		unit[j] = 0
	}
	return b, nil
}

// fit returns the knot values minimising Σ w_i² (S(x_i) − y_i)².
func (t target) fit(knots []float64) ([]float64, error) {
	b, err := basis(knots, t.x)
	if err != nil {
		return nil, err
	}
	r, c := b.Dims()
	a := mat.NewDense(r, c, nil)
	rhs := mat.NewVecDense(r, nil)
	for i := 0; i < r; i++ {
		for j := 0; j < c; j++ {
			a.Set(i, j, t.w[i]*b.At(i, j))
		}
		rhs.SetVec(i, t.w[i]*t.y[i])
	}
	var v mat.VecDense
	if err := v.SolveVec(a, rhs); err != nil {
		return nil, err
	}
	return append([]float64(nil), v.RawVector().Data...), nil
}

// spline returns the fitted spline.
func spline(knots, vals []float64) (*interp.NaturalCubic, error) {
	var s interp.NaturalCubic
	if err := s.Fit(knots, vals); err != nil {
		return nil, err
	}
	return &s, nil
}

// optimiseKnots moves the interior knots to reduce the largest weighted
// residual, measured as the L8 norm (a smooth stand-in for the maximum), by
// pattern search (Hooke & Jeeves 1961): each knot in turn is tried a step
// to the left and to the right and kept where the cost drops; the step is
// halved when no move helps. Knots stay at least minGap apart. It stops
// after evals cost evaluations or when the step is below 1e-4 dex.
func optimiseKnots(t target, knots []float64, evals int) []float64 {
	const minGap = 0.02 // dex: at least two data nodes between knots
	k := append([]float64(nil), knots...)
	n := len(k)
	cost := func(k []float64) float64 {
		v, err := t.fit(k)
		if err != nil {
			return math.Inf(1)
		}
		s, err := spline(k, v)
		if err != nil {
			return math.Inf(1)
		}
		sum := 0.0
		for i, x := range t.x {
			r := t.w[i] * (s.Predict(x) - t.y[i])
			sum += math.Pow(r*r, 4)
		}
		return math.Pow(sum, 1.0/8)
	}
	best := cost(k)
	used := 1
	for step := 0.04; step >= 1e-4 && used < evals; {
		improved := false
		for i := 1; i < n-1 && used < evals; i++ {
			for _, d := range []float64{-step, step} {
				x := k[i] + d
				if !(x-k[i-1] >= minGap && k[i+1]-x >= minGap) {
					continue
				}
				old := k[i]
				k[i] = x
				c := cost(k)
				used++
				if c < best {
					best, improved = c, true
					break
				}
				k[i] = old
			}
		}
		if !improved {
			step /= 2
		}
	}
	return k
}

// bands are the log10 T ranges over which the accuracy is measured and
// stated: below 10^4.3 K the metal part is a small difference beside the
// hydrogen peak; above 10^7.5 K it is a small, noisy difference
// (measured on the files).
var bands = [...][2]float64{{4.0, 4.3}, {4.3, 7.5}, {7.5, 8.0}}

// accuracy is the measured error of the fit against its target.
type accuracy struct {
	max, at [len(bands)]float64 // largest |fit/target − 1| in each band, and where (log10 T)
	rms     float64             // rms relative error over the whole range
}

func measure(t target, knots, vals []float64) (accuracy, error) {
	s, err := spline(knots, vals)
	if err != nil {
		return accuracy{}, err
	}
	var a accuracy
	sum := 0.0
	for i, x := range t.x {
		e := math.Abs(math.Pow(10, s.Predict(x)-t.y[i]) - 1)
		sum += e * e
		for b, r := range bands {
			if x >= r[0]-1e-9 && x <= r[1]+1e-9 && e > a.max[b] {
				a.max[b], a.at[b] = e, x
			}
		}
	}
	a.rms = math.Sqrt(sum / float64(len(t.x)))
	return a, nil
}

// printResiduals prints log10 T, the relative error of the fit and its
// weight (1/σ in dex) at every node.
func printResiduals(w io.Writer, t target, knots, vals []float64) error {
	s, err := spline(knots, vals)
	if err != nil {
		return err
	}
	for i, x := range t.x {
		fmt.Fprintf(w, "%.2f %+.3f%% w=%.0f\n", x, 100*(math.Pow(10, s.Predict(x)-t.y[i])-1), t.w[i])
	}
	return nil
}

// write writes the coefficient file: the header of key: value comment
// lines that cloudwind parses and shows, then the knots.
func write(w io.Writer, knots, vals []float64, acc accuracy, lo, hi float64, nData int) error {
	bw := bufio.NewWriter(w)
	p := func(format string, a ...any) { fmt.Fprintf(bw, format+"\n", a...) }
	p("# cloudwind asset: metal part of the CIE cooling function, as fit coefficients")
	p("# generated by: go generate ./cooling (cooling/internal/fitmetals); do not edit")
	p("# source: Ryden, B. S. & Pogge, R. W. 2021, Interstellar and Intergalactic Medium, Cambridge University Press, companion data (Chapter 10, cooling_z1.txt and cooling_z0.001.txt; CHIANTI with ChiantiPy, collisional ionisation equilibrium, n_e = 0.004 cm^-3)")
	p("# licence: CC-BY-4.0 (Creative Commons Attribution 4.0 International, https://creativecommons.org/licenses/by/4.0/), as the source data")
	p("# derived work: the knots below are a least-squares fit made by cloudwind to the metal part of those curves; they are not the original data, which are not embedded in cloudwind (the repository carries them as test data only, testdata/cie-cooling-chianti)")
	p("# quantity: metal part per unit Z/Zsun, Lambda_met = (Lambda_z1 - Lambda_z0.001)/0.999 (cloudwind's choice: the two files differ only in their metals, and CIE metal cooling per n_e n_H is linear in Z)")
	p("# abundances: Grevesse & Sauval 1998 (sun_photospheric_1998_grevesse); He/H by number y = 0.0851 (derived from their X = 0.7347, Y = 0.2483 as tabulated by Asplund, Amarsi & Grevesse 2021, A&A 653, A141, Table 4)")
	p("# normalisation: nenH (L = n_e n_H Lambda; inferred from the data, not stated by the authors)")
	p("# units: T in K; Lambda in erg cm^3 s^-1")
	p("# log base: 10 (columns are log10 T and log10 Lambda)")
	p("# form: natural cubic spline (second derivative zero at both ends) through the knots, in log10 T - log10 Lambda")
	p("# valid: log10 T %.2f to %.2f", lo, hi)
	p("# accuracy: largest |fit/target - 1| over each band of log10 T (the target is a small difference of two rounded logs below 10^4.3 K, beside the hydrogen peak, and above 10^7.5 K); rms %.2f%% over all %d nodes", 100*acc.rms, nData)
	for b, r := range bands {
		p("# max-rel-error: %.2f %.2f %.4f (at log10 T = %.2f)", r[0], r[1], ceil4(acc.max[b]), acc.at[b])
	}
	p("log10T log10Lambda")
	for i := range knots {
		p("%.4f %.6f", knots[i], vals[i])
	}
	return bw.Flush()
}

// ceil4 rounds x up to 4 decimals, so that the stated bound holds.
func ceil4(x float64) float64 { return math.Ceil(x*1e4) / 1e4 }

// writeAtomic writes a file through a temporary file and a rename.
func writeAtomic(path string, fill func(io.Writer) error) error {
	tmp, err := os.CreateTemp(filepath.Dir(path), ".fitmetals-*")
	if err != nil {
		return err
	}
	defer os.Remove(tmp.Name())
	if err := fill(tmp); err != nil {
		tmp.Close()
		return err
	}
	if err := tmp.Close(); err != nil {
		return err
	}
	if err := os.Chmod(tmp.Name(), 0o644); err != nil {
		return err
	}
	return os.Rename(tmp.Name(), path)
}
