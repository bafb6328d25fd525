package cooling

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strings"
	"testing"

	"cloudwind/model"
	"gonum.org/v1/gonum/floats/scalar"
)

func ptr[T any](v T) *T { return &v }

// tblParse parses src and fails the test on error.
func tblParse(t *testing.T, src string, opt TableOptions) *Table {
	t.Helper()
	tab, err := ParseTable(strings.NewReader(src), "test.txt", opt)
	if err != nil {
		t.Fatalf("ParseTable: %v", err)
	}
	return tab
}

// tblNodes returns the nodes of tab.At(z).
func tblNodes(t *testing.T, tab *Table, z float64) (xs, ys []float64) {
	t.Helper()
	p, err := tab.At(z)
	if err != nil {
		t.Fatalf("At(%g): %v", z, err)
	}
	return p.Nodes()
}

// A small table of cloudwind's own layout (synthetic values, typical CIE
// magnitudes per n_e n_H; no source).
const tblOwn = "# cloudwind-table\n" +
	"# norm: nenH\n" +
	"# columns: T=1 lambda=2,3,4\n" +
	"# log: T=yes lambda=yes\n" +
	"# Z: 0.1 0.3 1\n" +
	"# y: 0.0851\n" +
	"# Source: synthetic\n" +
	"4.5 -21.9 -21.8 -21.5\n" +
	"5.0 -21.7 -21.4 -21.0\n" +
	"5.5 -21.8 -21.5 -21.1\n" +
	"6.0 -22.3 -22.1 -21.8\n"

// TestParseTableMalformed gives one malformed input per sentinel error and
// checks the *ParseError and its line (ParseTable's validation list; lines
// counted by hand).
func TestParseTableMalformed(t *testing.T) {
	nh2 := TableOptions{Norm: ptr(PerNH2)}
	own := "# cloudwind-table\n# norm: nH2\n"
	cases := []struct {
		name string
		src  string
		opt  TableOptions
		want error
		line int
	}{
		{"non-numeric", "1e4 1e-22\n2e4 abc\n", nh2, ErrNotNumeric, 2},
		{"empty CSV field", "1e4,1e-22\n2e4,\n", nh2, ErrNotNumeric, 2},
		{"NaN", "# c\n1e4 1e-22\n2e4 NaN\n", nh2, ErrNotFinite, 3},
		{"overflow", "1e4 1e-22\n2e4 1e999\n", nh2, ErrNotFinite, 2},
		{"ragged", "1e4 1e-22\n2e4 2e-22\n3e4 3e-22 7\n", nh2, ErrColumnCount, 3},
		{"column beyond width", "\n1e4 1e-22\n2e4 2e-22\n", TableOptions{Norm: ptr(PerNH2), LambdaColumns: []int{5}}, ErrColumnCount, 2},
		{"one row", "1e4 1e-22\n", nh2, ErrTooFewRows, 0},
		{"one row left after clipping", "1e3 1e-22\n1e4 2e-22\n", TableOptions{Norm: ptr(PerNH2), ClipBelow: 5e3}, ErrTooFewRows, 0},
		{"duplicate T", "1e4 1e-22\n2e4 2e-22\n2e4 3e-22\n", nh2, ErrNotIncreasing, 3},
		{"decreasing log T", "4.0 -22\n4.2 -21\n4.1 -21.5\n", nh2, ErrNotIncreasing, 3},
		{"T = 0", "0 1e-22\n2e4 2e-22\n", nh2, ErrNonPositive, 1},
		{"net heating", "1e3 1e-23\n5e3 -1e-23\n1e4 1e-22\n", nh2, ErrNetHeating, 2},
		{"Z count", own + "# columns: T=1 lambda=2,3\n# Z: 0.1\n4 -22 -21\n5 -22 -21\n", TableOptions{}, ErrZCount, 4},
		{"two columns no Z", "4 -22 -21\n5 -22 -21\n", TableOptions{Norm: ptr(PerNH2), LambdaColumns: []int{2, 3}}, ErrZCount, 0},
		{"Z not increasing", own + "# columns: T=1 lambda=2,3\n# Z: 1 0.1\n4 -22 -21\n5 -22 -21\n", TableOptions{}, ErrZOrder, 4},
		{"SI units", "1e4 1e-35\n1e5 2e-35\n1e6 3e-35\n", nh2, ErrImplausible, 2},
		{"no normalisation", "4 -22\n5 -21\n", TableOptions{}, ErrNoNormalisation, 0},
		{"directives without magic line", "# norm: nH2\n4 -22\n5 -21\n", TableOptions{}, ErrNoNormalisation, 0},
		{"conflict", own + "4 -22\n5 -21\n", TableOptions{Norm: ptr(PerNeNH)}, ErrConflict, 2},
		{"bad directive", own + "# log: T=maybe\n4 -22\n5 -21\n", TableOptions{}, ErrDirective, 3},
		{"repeated directive", own + "# norm: nenH\n4 -22\n5 -21\n", TableOptions{}, ErrDirective, 3},
		{"column twice", own + "# columns: T=1 lambda=1\n4 -22\n5 -21\n", TableOptions{}, ErrColumnSpec, 3},
		{"HHe without metals", "4 -22 -23\n5 -21 -23\n", TableOptions{Norm: ptr(PerNH2), HHeColumn: 2}, ErrColumnSpec, 0},
		{"log T declared, linear data", own + "# log: T=yes\n4 -22\n1e5 -21\n", TableOptions{}, ErrLogScale, 5},
		{"linear Λ declared, log data", "4 -22\n5 -21\n", TableOptions{Norm: ptr(PerNH2), LogLambda: ptr(false)}, ErrLogScale, 0},
		{"no y for nenH", "4 -22\n5 -21\n", TableOptions{Norm: ptr(PerNeNH)}, ErrNoHeliumRatio, 0},
		{"negative y", own + "# y: -1\n4 -22\n5 -21\n", TableOptions{}, ErrSetting, 3},
		{"long line", "4 -22\n5 " + strings.Repeat("1", maxLineBytes) + "\n", nh2, ErrTooLarge, 2},
		{"NeOverNH ≤ 0", "4 -22\n5 -21\n", TableOptions{Norm: ptr(PerNeNH), HeliumRatio: ptr(0.08),
			NeOverNH: func(model.Temperature, float64) float64 { return 0 }}, ErrNonPositive, 1},
	}
	for _, c := range cases {
		_, err := ParseTable(strings.NewReader(c.src), "bad.txt", c.opt)
		var pe *ParseError
		if !errors.As(err, &pe) || !errors.Is(err, c.want) || pe.Line != c.line || pe.File != "bad.txt" {
			t.Errorf("%s: ParseTable(%q) error = %v, want %v at bad.txt line %d", c.name, c.src[:min(len(c.src), 60)], err, c.want, c.line)
		}
	}
}

// TestParseTableBadOptions checks that invalid options are errors on line
// 0 (definitions in TableOptions).
func TestParseTableBadOptions(t *testing.T) {
	src := "4 -22 -21\n5 -21 -20.5\n"
	for _, c := range []struct {
		opt  TableOptions
		want error
	}{
		{TableOptions{LambdaColumns: []int{0}}, ErrColumnSpec},
		{TableOptions{LambdaColumns: []int{-2}}, ErrColumnSpec},
		{TableOptions{TColumn: maxColumnNumber + 1}, ErrColumnSpec},
		{TableOptions{NHColumn: 3}, ErrColumnSpec},
		{TableOptions{HHeColumn: 2, MetalsColumn: 3, LambdaColumns: []int{2}}, ErrColumnSpec},
		{TableOptions{HHeColumn: 2, MetalsColumn: 3, Z: []float64{1}}, ErrZCount},
		{TableOptions{LambdaColumns: []int{2, 3}, Z: []float64{0, math.NaN()}}, ErrZOrder},
		{TableOptions{HeliumRatio: ptr(math.Inf(1))}, ErrSetting},
		{TableOptions{ClipBelow: -1}, ErrSetting},
		{TableOptions{SkipLines: -1}, ErrSetting},
		{TableOptions{Norm: ptr(Normalisation(9))}, ErrSetting},
	} {
		if c.opt.Norm == nil {
			c.opt.Norm = ptr(PerNH2)
		}
		_, err := ParseTable(strings.NewReader(src), "opt", c.opt)
		var pe *ParseError
		if !errors.As(err, &pe) || !errors.Is(err, c.want) || pe.Line != 0 {
			t.Errorf("ParseTable(%+v) error = %v, want %v at line 0", c.opt, err, c.want)
		}
	}
}

// endlessComments is an input larger than any limit: "# x" lines forever.
type endlessComments struct{ n int }

func (e *endlessComments) Read(p []byte) (int, error) {
	for i := range p {
		p[i] = "# x\n"[e.n%4]
		e.n++
	}
	return len(p), nil
}

// TestParseTableLimits checks the size limits (common practice, no source).
func TestParseTableLimits(t *testing.T) {
	_, err := ParseTable(&endlessComments{}, "big", TableOptions{Norm: ptr(PerNH2)})
	if !errors.Is(err, ErrTooLarge) {
		t.Errorf("ParseTable(endless input) error = %v, want %v", err, ErrTooLarge)
	}
	if testing.Short() {
		return
	}
	var b strings.Builder
	for i := 0; i <= maxTableRows; i++ {
		b.WriteString("1 1\n")
	}
	_, err = ParseTable(strings.NewReader(b.String()), "rows", TableOptions{Norm: ptr(PerNH2)})
	var pe *ParseError
	if !errors.As(err, &pe) || !errors.Is(err, ErrTooLarge) || pe.Line != maxTableRows+1 {
		t.Errorf("ParseTable(%d rows) error = %v, want %v at line %d", maxTableRows+1, err, ErrTooLarge, maxTableRows+1)
	}
}

// TestParseTableOwnLayout loads the directive file and checks conversion
// and metadata (derived: Λ_hd = (n_e/n_H) Λ_nenH; the fully ionised 1+2y
// fallback).
func TestParseTableOwnLayout(t *testing.T) {
	tab := tblParse(t, tblOwn, TableOptions{})
	m := tab.Meta()
	if m.Normalisation != PerNeNH || m.HeliumRatio != 0.0851 || m.Name != "test.txt" {
		t.Errorf("Meta() = %+v; want nenH, y = 0.0851, name test.txt", m)
	}
	if lo, hi, ok := tab.ZRange(); lo != 0.1 || hi != 1 || !ok {
		t.Errorf("ZRange() = %g, %g, %v; want 0.1, 1, true", lo, hi, ok)
	}
	shift := math.Log10(1 + 2*0.0851) // derived, fully ionised n_e/n_H
	rows := [][]float64{{4.5, -21.9, -21.8, -21.5}, {5.0, -21.7, -21.4, -21.0}, {5.5, -21.8, -21.5, -21.1}, {6.0, -22.3, -22.1, -21.8}}
	for j, z := range []float64{0.1, 0.3, 1} {
		xs, ys := tblNodes(t, tab, z)
		for i, r := range rows {
			// Nodes reproduced after conversion (exact to rounding).
			if xs[i] != r[0] || !scalar.EqualWithinAbs(ys[i], r[j+1]+shift, 1e-12) {
				t.Errorf("At(%g) node %d = (%g, %.15g), want (%g, %.15g)", z, i, xs[i], ys[i], r[0], r[j+1]+shift)
			}
		}
	}
	if !tblHasWarning(m.Warnings, "1+2y") || !tblHasWarning(m.Warnings, "unknown directive") {
		t.Errorf("Meta().Warnings = %q; want the 1+2y fallback and the unknown directive", m.Warnings)
	}
	// The same table through options only, agreeing directives allowed.
	opt := TableOptions{Norm: ptr(PerNeNH), LambdaColumns: []int{2, 3, 4}, Z: []float64{0.1, 0.3, 1}, HeliumRatio: ptr(0.0851), LogT: ptr(true)}
	tab2 := tblParse(t, tblOwn, opt)
	_, a := tblNodes(t, tab, 0.3)
	_, b := tblNodes(t, tab2, 0.3)
	for i := range a {
		if a[i] != b[i] {
			t.Errorf("agreeing option and directive: node %d = %g, want %g", i, b[i], a[i])
		}
	}
}

func tblHasWarning(ws []string, sub string) bool {
	for _, w := range ws {
		if strings.Contains(w, sub) {
			return true
		}
	}
	return false
}

// TestTableLinearZ checks linear interpolation in Z, node by node, and the
// range (cloudwind's rule: linear in Z, not log Z; error outside).
func TestTableLinearZ(t *testing.T) {
	src := "4.5 1e-22 2e-22 6e-22\n5 2e-22 3e-22 7e-22\n6 1e-23 2e-23 5e-23\n"
	tab := tblParse(t, src, TableOptions{Norm: ptr(PerNH2), LambdaColumns: []int{2, 3, 4}, Z: []float64{0, 0.5, 2}})
	cols := [][]float64{{1e-22, 2e-22, 6e-22}, {2e-22, 3e-22, 7e-22}, {1e-23, 2e-23, 5e-23}}
	for _, c := range []struct{ z, w float64 }{{0, 0}, {0.25, 0.5}, {0.5, 1}, {1.25, 1.5}, {2, 2}} {
		_, ys := tblNodes(t, tab, c.z)
		for i, r := range cols {
			// w is the position between columns: 0 → col 2, 1 → col 3, 2 → col 4 (derived).
			j := min(int(c.w), 1)
			f := c.w - float64(j)
			want := (1-f)*r[j] + f*r[j+1]
			if got := math.Pow(10, ys[i]); !scalar.EqualWithinRel(got, want, 1e-13) {
				t.Errorf("At(%g) row %d: Λ = %g, want %g", c.z, i, got, want)
			}
		}
	}
	for _, z := range []float64{-0.1, 2.01, math.NaN(), math.Inf(1)} {
		if _, err := tab.At(z); !errors.Is(err, ErrMetallicityRange) {
			t.Errorf("At(%g) error = %v, want %v", z, err, ErrMetallicityRange)
		}
	}
}

// tblW09 writes a table in the style of Wiersma, Schaye & Smith 2009's CIE
// "z_collis" table (columns as its README describes them): T
// linear from 10^2 to 10^9 K every 0.25 dex; Λ_HHe/n_H², n_e/n_H, metals
// only, then two element columns. Values are synthetic; the low-T rows are
// negative (net heating) as in the real files.
func tblW09() (string, [][3]float64) {
	var b strings.Builder
	b.WriteString("# synthetic W09-style CIE table: T, HHe, ne/nH, metals, C, O\n")
	var rows [][3]float64
	for x := 2.0; x <= 9.0001; x += 0.25 {
		T := math.Pow(10, x)
		hhe := 1e-22 * math.Exp(-(x-5)*(x-5)/4)
		met := 3e-22 * math.Exp(-(x-5.5)*(x-5.5)/2)
		if x < 3.6 {
			hhe, met = -1e-25, -2e-25
		}
		fmt.Fprintf(&b, "%.6e %.6e %.4f %.6e %.3e %.3e\n", T, hhe, 1.16, met, met/4, met/3)
		rows = append(rows, [3]float64{T, hhe, met})
	}
	return b.String(), rows
}

// TestTableW09 loads the W09-style table through its HHe and metals
// columns (derived: Λ_HHe + 0.3 Λ_met at nodes, exact).
func TestTableW09(t *testing.T) {
	src, rows := tblW09()
	opt := TableOptions{Norm: ptr(PerNH2), HHeColumn: 2, MetalsColumn: 4, NeColumn: 3}
	_, err := ParseTable(strings.NewReader(src), "w09", opt)
	var pe *ParseError
	if !errors.As(err, &pe) || !errors.Is(err, ErrNetHeating) || pe.Line != 2 {
		t.Errorf("ParseTable(W09 without clipping) error = %v, want %v at line 2", err, ErrNetHeating)
	}
	opt.ClipBelow = 1e4
	tab := tblParse(t, src, opt)
	if !tblHasWarning(tab.Meta().Warnings, "8 rows below") {
		t.Errorf("Meta().Warnings = %q; want the 8 clipped rows reported", tab.Meta().Warnings)
	}
	xs, ys := tblNodes(t, tab, 0.3)
	k := 0
	for _, r := range rows {
		if r[0] < 1e4*(1-1e-9) {
			continue
		}
		hhe, met := tblRound(r[1]), tblRound(r[2])
		want := hhe + 0.3*met
		if !scalar.EqualWithinRel(math.Pow(10, xs[k]), tblRound(r[0]), 1e-12) || !scalar.EqualWithinRel(math.Pow(10, ys[k]), want, 1e-14) {
			t.Errorf("At(0.3) node %d = (10^%g, 10^%g), want (%g, %g)", k, xs[k], ys[k], tblRound(r[0]), want)
		}
		k++
	}
	if k != len(xs) {
		t.Errorf("At(0.3) has %d nodes, want %d", len(xs), k)
	}
	if lo, hi, ok := tab.ZRange(); lo != 0 || !math.IsInf(hi, 1) || !ok {
		t.Errorf("ZRange() = %g, %g, %v; want 0, +Inf, true", lo, hi, ok)
	}
	p, err := tab.At(5)
	if err != nil || !tblHasWarning(p.Meta().Warnings, "above 3") {
		t.Errorf("At(5) = %v; want a warning above 3 Z☉", err)
	}
	if _, err := tab.At(-1); !errors.Is(err, ErrMetallicityRange) {
		t.Errorf("At(-1) error = %v, want %v", err, ErrMetallicityRange)
	}
}

// tblRound rounds as the %.6e of tblW09 does.
func tblRound(v float64) float64 {
	var r float64
	fmt.Sscanf(fmt.Sprintf("%.6e", v), "%g", &r)
	return r
}

// tblSD93 writes a Sutherland & Dopita 1993-style CIE file (the format of
// the authors' files): 4 header lines, 12 columns, log T 4.0–8.5 every
// 0.05, n_H = 1.000, log(lambda net) per n_H² and log(lambda norm) =
// log(net/(n_e n_t)), both printed to 2 decimals. Values are synthetic.
func tblSD93() (src string, lognet, ne, nt []float64) {
	var b strings.Builder
	b.WriteString("CIE cooling curve (synthetic)\nSolar abundances\n\n" +
		"log(T)  ne  nH  nt  log(lambda net)  log(lambda norm)  log(U)  log(taucool)  P12  rho24  Ci  mubar\n")
	for i := 0; i <= 90; i++ {
		x := 4 + 0.05*float64(i)
		e := 1.2 * (1 - math.Exp(-(x-3.9)*3))
		n := 1.099
		l := math.Round((-21-0.8*math.Abs(x-5.3)+0.1*(x-4))*100) / 100
		norm := math.Round((l-math.Log10(e*n))*100) / 100
		fmt.Fprintf(&b, "%.2f %.4e 1.000 %.3f %.2f %.2f 1.0 10.0 1.0 1.0 0.5 0.6\n", x, e, n, l, norm)
		v, _ := parseNumber(fmt.Sprintf("%.4e", e))
		lognet, ne, nt = append(lognet, l), append(ne, v), append(nt, n)
	}
	return b.String(), lognet, ne, nt
}

// TestTableSD93 loads the SD93-style file by its net column (per n_H²) and
// by its norm column converted with the file's n_e, n_H and n_t (nodes
// exact; conversion within 0.02 dex, the rounding of the printed logs).
func TestTableSD93(t *testing.T) {
	src, lognet, ne, nt := tblSD93()
	net := tblParse(t, src, TableOptions{SkipLines: 4, Norm: ptr(PerNH2), LambdaColumns: []int{5}})
	_, ys := tblNodes(t, net, math.NaN())
	for i := range ys {
		if !scalar.EqualWithinAbs(ys[i], lognet[i], 1e-12) {
			t.Errorf("SD93 net: node %d log Λ = %.15g, want %g", i, ys[i], lognet[i])
		}
	}
	norm := tblParse(t, src, TableOptions{SkipLines: 4, Norm: ptr(PerNeNt), LambdaColumns: []int{6}, NeColumn: 2, NHColumn: 3, NtColumn: 4})
	if norm.Meta().Normalisation != PerNeNt {
		t.Errorf("Meta().Normalisation = %v, want nent", norm.Meta().Normalisation)
	}
	_, yn := tblNodes(t, norm, math.NaN())
	for i := range yn {
		if math.Abs(yn[i]-lognet[i]) > 0.02 {
			t.Errorf("SD93 norm × n_e n_t: node %d log Λ = %.4f, net column %g (want within 0.02 dex)", i, yn[i], lognet[i])
		}
		// Exact conversion of the norm column (derived: Λ_hd = (n_e/n_H)(n_t/n_H) Λ_N).
		want := math.Round((lognet[i]-math.Log10(ne[i]*nt[i]))*100)/100 + math.Log10(ne[i]*nt[i])
		if !scalar.EqualWithinAbs(yn[i], want, 1e-12) {
			t.Errorf("SD93 norm: node %d log Λ = %.15g, want %.15g", i, yn[i], want)
		}
	}
	if w := norm.Meta().Warnings; len(w) != 0 {
		t.Errorf("SD93 norm: warnings %q, want none (n_e, n_t from the file)", w)
	}
}

// tblChianti writes a file in the style of Ryden & Pogge 2021's CHIANTI
// curves: '#'
// comments, an uncommented column-name row, log T from 4 to 5 every
// 0.01 and log Λ per n_e n_H. Values are synthetic.
func tblChianti() (string, []float64) {
	var b strings.Builder
	b.WriteString("#\n# CIE cooling function (synthetic)\n#   logT = 4.0 to 5.0\n#\n" +
		"logT   Total    Cont   FFCont  FBCont  2PCont\n")
	var total []float64
	for i := 0; i <= 100; i++ {
		x := 4 + 0.01*float64(i)
		l := math.Round((-23+1.6*(x-4)/(0.25+(x-4)))*1000) / 1000
		fmt.Fprintf(&b, "%.3f %.3f %.3f %.3f %.3f %.3f\n", x, l, l-0.5, l-3, l-3.2, l-0.6)
		total = append(total, l)
	}
	return b.String(), total
}

// TestTableChianti loads the CHIANTI-style file by naming its columns and
// converts per n_e n_H to n_H² with a caller's n_e/n_H (derived).
func TestTableChianti(t *testing.T) {
	src, total := tblChianti()
	neOverNH := func(T model.Temperature, y float64) float64 { return (1 + 2*y) * float64(T) / (float64(T) + 1e4) }
	tab := tblParse(t, src, TableOptions{Norm: ptr(PerNeNH), HeliumRatio: ptr(0.0851), NeOverNH: neOverNH})
	if names := tab.ColumnNames(); len(names) != 6 || names[0] != "logT" || names[1] != "Total" {
		t.Errorf("ColumnNames() = %q, want logT Total …", names)
	}
	xs, ys := tblNodes(t, tab, math.NaN())
	for i := range ys {
		// Λ_hd = (n_e/n_H) Λ_nenH (derived), with the caller's n_e/n_H.
		want := total[i] + math.Log10(neOverNH(model.Temperature(math.Pow(10, xs[i])), 0.0851))
		if !scalar.EqualWithinAbs(ys[i], want, 1e-12) {
			t.Errorf("CHIANTI-style node %d: log Λ = %.15g, want %.15g", i, ys[i], want)
		}
	}
	if !tblHasWarning(tab.Meta().Warnings, "below 20000 K") {
		t.Errorf("Meta().Warnings = %q; want the low-T n_e/n_H warning", tab.Meta().Warnings)
	}
	// A second non-numeric row is an error, not a header.
	bad := strings.Replace(src, "4.050", "logT", 1)
	if _, err := ParseTable(strings.NewReader(bad), "c", TableOptions{Norm: ptr(PerNeNH), HeliumRatio: ptr(0.0851)}); !errors.Is(err, ErrNotNumeric) {
		t.Errorf("ParseTable(second name row) error = %v, want %v", err, ErrNotNumeric)
	}
}

// TestTableFormat checks the accepted syntax: CRLF, commas, BOM, inline
// comments, Fortran exponents, blank lines, an explicit header row, and the
// auto-detected logs (cloudwind's format).
func TestTableFormat(t *testing.T) {
	want := []float64{-22, math.Log10(2e-22), math.Log10(3e-22)}
	for _, c := range []struct {
		name string
		src  string
		opt  TableOptions
	}{
		{"CRLF commas BOM", "\uFEFFT,Lambda\r\n1e4, 1e-22\r\n\r\n2e4 ,2e-22\r\n3e4,3e-22\r\n", TableOptions{}},
		{"comments Fortran", "# T L\n1e4 1.0D-22 # first\n2e4 2.0d-22\n\n3e4 3e-22\n", TableOptions{}},
		{"explicit header", "1 2\n1e4 1e-22\n2e4 2e-22\n3e4 3e-22\n", TableOptions{HeaderRow: true}},
		{"logs", "4 -22\n4.301029995663981 -21.698970004336019\n4.477121254719663 -21.522878745280337\n", TableOptions{}},
	} {
		c.opt.Norm = ptr(PerNH2)
		tab := tblParse(t, c.src, c.opt)
		xs, ys := tblNodes(t, tab, math.NaN())
		for i := range want {
			if !scalar.EqualWithinAbs(ys[i], want[i], 1e-12) || !scalar.EqualWithinAbs(xs[i], math.Log10(1e4*float64(i+1)), 1e-12) {
				t.Errorf("%s: node %d = (%g, %g), want (%g, %g)", c.name, i, xs[i], ys[i], math.Log10(1e4*float64(i+1)), want[i])
			}
		}
		if c.opt.HeaderRow && !tblHasWarning(tab.Meta().Warnings, "looks like data") {
			t.Errorf("%s: warnings %q, want the numeric header noted", c.name, tab.Meta().Warnings)
		}
	}
	// n2 is read as n_H², with a warning (cloudwind's choice: n² is ambiguous).
	tab := tblParse(t, "4 -22\n5 -21\n", TableOptions{Norm: ptr(PerN2)})
	if _, ys := tblNodes(t, tab, math.NaN()); ys[0] != -22 || !tblHasWarning(tab.Meta().Warnings, "ambiguous") {
		t.Errorf("n2: log Λ = %g, warnings %q; want −22 and the ambiguity warning", ys[0], tab.Meta().Warnings)
	}
	// A row exactly at the clip temperature is kept.
	tab = tblParse(t, "5e3 -1e-23\n1e4 1e-22\n2e4 2e-22\n", TableOptions{Norm: ptr(PerNH2), ClipBelow: 1e4})
	if xs, _ := tblNodes(t, tab, math.NaN()); len(xs) != 2 || xs[0] != 4 {
		t.Errorf("clip at 1e4: nodes %v, want from log T = 4", xs)
	}
}

// TestParseTableCleansText checks that control characters from the file
// and the name never reach an error message (style rule 3.4).
func TestParseTableCleansText(t *testing.T) {
	src := "1e4 1e-22\n2e4 \x1b[31mred\u202e\n"
	_, err := ParseTable(strings.NewReader(src), "evil\x1b]0;title\x07.txt", TableOptions{Norm: ptr(PerNH2)})
	if err == nil {
		t.Fatal("ParseTable(control characters) succeeded, want an error")
	}
	if msg := err.Error(); strings.ContainsAny(msg, "\x1b\x07\u202e") {
		t.Errorf("ParseTable error %q contains control characters", msg)
	}
}

// FuzzParseTable checks that no input panics and that every error is a
// *ParseError; a table that loads must give a curve at a valid Z.
func FuzzParseTable(f *testing.F) {
	w09, _ := tblW09()
	sd93, _, _, _ := tblSD93()
	chianti, _ := tblChianti()
	for _, s := range []string{tblOwn, w09, sd93, chianti, "4 -22\n5 -21\n", "1e4,1e-22\n2e4,2e-22\n",
		"# cloudwind-table\n# norm: nH2\n# columns: T=1 HHe=2 metals=3\n# clip-below: 1e4\n1e3 -1 -1\n1e4 1e-22 1e-22\n1e5 2e-22 0\n"} {
		for preset := range uint8(8) {
			f.Add(s, preset)
		}
	}
	f.Fuzz(func(t *testing.T, src string, preset uint8) {
		opt := []TableOptions{
			{},
			{Norm: ptr(PerNH2), ClipBelow: 1e4},
			{Norm: ptr(PerNeNH), HeliumRatio: ptr(0.08), NeOverNH: func(T model.Temperature, y float64) float64 { return 1 + 2*y }},
			{Norm: ptr(PerNeNt), SkipLines: 4, LambdaColumns: []int{6}, NeColumn: 2, NHColumn: 3, NtColumn: 4},
			{Norm: ptr(PerNH2), HHeColumn: 2, MetalsColumn: 4, NeColumn: 3, ClipBelow: 1e4},
			{Norm: ptr(PerN2), LambdaColumns: []int{2, 3, 4}, Z: []float64{0.1, 0.3, 1}, LogT: ptr(true), LogLambda: ptr(true)},
			{Norm: ptr(PerNeNt), HeliumRatio: ptr(0.1), HeaderRow: true},
			{Norm: ptr(PerNeNH), HeliumRatio: ptr(0.08), LogT: ptr(false), LogLambda: ptr(false), LambdaColumns: []int{3}},
		}[preset%8]
		tab, err := ParseTable(strings.NewReader(src), "fuzz", opt)
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("ParseTable error %v (%T) is not a *ParseError", err, err)
			}
			return
		}
		z := math.NaN()
		if lo, _, ok := tab.ZRange(); ok {
			z = lo
		}
		p, err := tab.At(z)
		if err != nil {
			t.Fatalf("At(%g) on a loaded table: %v", z, err)
		}
		lo, hi := p.ValidRange()
		_ = p.Lambda(model.Temperature(math.Sqrt(float64(lo) * float64(hi))))
	})
}

var _ io.Reader = &endlessComments{}

// TestTableOptionsApply checks that command-line settings in directive
// words load a table as the directives would (format rule of this package).
func TestTableOptionsApply(t *testing.T) {
	var o TableOptions
	for _, d := range []string{"norm: nenH", "columns: T=1 lambda=2,3", "log: T=yes lambda=yes", "Z: 0.1 1", "y: 0.0851", "skip: 1"} {
		if err := o.Apply(d); err != nil {
			t.Fatalf("Apply(%q): %v", d, err)
		}
	}
	if o.Norm == nil || *o.Norm != PerNeNH || o.TColumn != 1 || len(o.LambdaColumns) != 2 || o.LogT == nil || !*o.LogT ||
		len(o.Z) != 2 || o.HeliumRatio == nil || *o.HeliumRatio != 0.0851 || o.SkipLines != 1 {
		t.Fatalf("Apply gave %+v", o)
	}
	src := "ignored first line\n4.0 -22.0 -21.9\n4.5 -21.5 -21.0\n5.0 -21.4 -20.9\n"
	tab, err := ParseTable(strings.NewReader(src), "cli.txt", o)
	if err != nil {
		t.Fatalf("ParseTable with applied options: %v", err)
	}
	if lo, hi, ok := tab.ZRange(); !ok || lo != 0.1 || hi != 1 {
		t.Errorf("ZRange() = %g, %g, %v; want 0.1, 1, true", lo, hi, ok)
	}
	for _, bad := range []string{"norm nH2", "colour: red", "norm: per-volume", "skip: -1", "columns: T=0"} {
		var o TableOptions
		if err := o.Apply(bad); err == nil {
			t.Errorf("Apply(%q) accepted", bad)
		}
	}
	if err := o.Apply("norm: nH2"); !errors.Is(err, ErrConflict) {
		t.Errorf("second norm: %v, want ErrConflict", err)
	}
}
