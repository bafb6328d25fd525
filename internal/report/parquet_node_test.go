package report

import (
	"bytes"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"cloudwind/internal/safetext"
)

// The independent reader: hyparquet, a pure-JavaScript Parquet reader from
// the npm registry, run by Node on testdata/parquet/read_parquet.mjs. The
// package is fetched, checked against a pinned SHA-512 and unpacked by
// testdata/parquet/fetch-hyparquet.sh; the test looks for it in
// $CLOUDWIND_HYPARQUET_DIR, or else in the user cache directory
// (cloudwind/hyparquet, where `fetch-hyparquet.sh ~/.cache/cloudwind`
// puts it on Linux).

// hyparquetScript is the reader script, from this package's directory.
var hyparquetScript = filepath.Join("..", "..", "testdata", "parquet", "read_parquet.mjs")

// requireHyparquet returns node and the hyparquet package directory, or
// skips the test (fails it when CI=true) with what to install.
func requireHyparquet(t *testing.T) (node, dir string) {
	t.Helper()
	dir = os.Getenv("CLOUDWIND_HYPARQUET_DIR")
	fetchTo := "DIR, and set CLOUDWIND_HYPARQUET_DIR to the directory it prints"
	if dir == "" {
		if cache, err := os.UserCacheDir(); err == nil {
			fetchTo = filepath.Join(cache, "cloudwind")
			dir = filepath.Join(fetchTo, "hyparquet")
		}
	}
	missing := func(msg string) {
		msg += "; to run this check: apt-get install -y nodejs; bash testdata/parquet/fetch-hyparquet.sh " + safetext.Terminal(fetchTo)
		if os.Getenv("CI") == "true" {
			t.Fatal(msg)
		}
		t.Skip(msg)
	}
	node, err := exec.LookPath("node")
	if err != nil {
		missing("node is not installed")
	}
	if dir == "" {
		missing("CLOUDWIND_HYPARQUET_DIR is not set and there is no user cache directory")
	}
	if _, err := os.Stat(filepath.Join(dir, "src", "node.js")); err != nil {
		missing("the npm package hyparquet is not at " + safetext.Terminal(dir))
	}
	return node, dir
}

// hyparquetCase writes n rows of mixed columns as Parquet and as CSV and
// returns the two paths. Every number has at most nine significant figures,
// so the CSV text (AppendNumber, %.9g) is the exact double and the script
// can compare exactly.
func hyparquetCase(t *testing.T, n int) (pq, csv string, csvText []byte) {
	t.Helper()
	cols := []Column{
		{Name: "chi", Description: "density contrast (input)"},
		{Name: "radius_pc", Unit: "pc", Description: "cloud radius (input)"},
		{Name: "go18_verdict", IsString: true, Description: "verdict"},
		{Name: "adiabatic", IsBool: true, Description: "t_cool,wind > r/v"},
		{Name: "t_cc_myr", Unit: "Myr", Description: "cloud-crushing time"},
		{Name: "criterion", IsString: true, Description: "criterion id"},
		{Name: "mass_cloud_msun", Unit: "solMass", Description: "cloud mass"},
	}
	// NaN, ±Inf, zeros, tiny and huge (the extremes of the double range
	// written with nine figures), and ordinary values; common practice, no
	// source.
	special := []string{"nan", "inf", "-inf", "0", "-0", "4.94065646e-324", "2.22507386e-308",
		"1.79769313e+308", "-1.79769313e+308", "1e-300", "3.0857e+18", "-2.5e-22", "1", "123456789"}
	ids := []string{"go18", "li20", "abruzzo22"}
	cn, cs, cb := make([][]float64, len(cols)), make([][]string, len(cols)), make([][]bool, len(cols))
	for i := 0; i < n; i++ {
		num := func(s string) float64 {
			switch s {
			case "nan":
				return math.NaN()
			case "inf":
				return math.Inf(1)
			case "-inf":
				return math.Inf(-1)
			}
			v, err := strconv.ParseFloat(s, 64)
			if err != nil {
				t.Fatal(err)
			}
			return v
		}
		cn[0] = append(cn[0], num(special[i%len(special)]))
		// Nine-figure values over 40 decades: 1.23456789e-20 … e+19.
		cn[1] = append(cn[1], num(strconv.FormatFloat(1.23456789+float64(i%97)*1e-8, 'f', 8, 64)+"e"+strconv.Itoa(i%40-20)))
		cs[2] = append(cs[2], testVerdicts[(i/5)%3])
		cb[3] = append(cb[3], i%7 < 3)
		cn[4] = append(cn[4], num(special[(i*5+3)%len(special)]))
		cs[5] = append(cs[5], ids[i%3])
		cn[6] = append(cn[6], float64(i)*0.5-37)
	}
	b := fromColumns(cols, n, cn, cs, cb)

	dir := t.TempDir()
	pq = filepath.Join(dir, "sweep.parquet")
	csv = filepath.Join(dir, "sweep.csv")
	data := writeParquet(t, cols, testMeta, b.slice(0, n/3), b.slice(n/3, n))
	if err := os.WriteFile(pq, data, 0o644); err != nil {
		t.Fatal(err)
	}
	var out bytes.Buffer
	if err := CSVHeader(&out, cols, nil); err != nil {
		t.Fatal(err)
	}
	var line []byte
	for i := 0; i < n; i++ {
		line = line[:0]
		for c, col := range cols {
			if c > 0 {
				line = append(line, ',')
			}
			switch {
			case col.IsString:
				line = append(line, b.Str[c][i]...)
			case col.IsBool:
				line = strconv.AppendBool(line, b.Bool[c][i])
			default:
				line = AppendNumber(line, b.num(i, c), false)
			}
		}
		out.Write(append(line, '\n'))
	}
	if err := os.WriteFile(csv, out.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	return pq, csv, out.Bytes()
}

// runHyparquet runs the script and returns its output, made safe to show.
func runHyparquet(t *testing.T, node, dir, pq, csv string) (string, error) {
	t.Helper()
	out, err := exec.Command(node, hyparquetScript, dir, pq, csv).CombinedOutput()
	lines := strings.Split(strings.TrimRight(string(out), "\n"), "\n")
	for i, l := range lines {
		lines[i] = safetext.Terminal(l)
	}
	return strings.Join(lines, "\n"), err
}

// TestParquetReadByHyparquet reads files written in two batches with
// hyparquet and checks, in the script, the schema, the dictionary encoding
// of the strings, the key–value metadata and every value against the CSV
// of the same rows: 400 rows, and RowGroupRows+10 rows, whose second row
// group has its own dictionary pages.
func TestParquetReadByHyparquet(t *testing.T) {
	node, dir := requireHyparquet(t)
	for _, tc := range []struct {
		rows int
		want string
	}{
		{400, "rows 400 in 1 row groups"},
		{RowGroupRows + 10, "rows " + strconv.Itoa(RowGroupRows+10) + " in 2 row groups"},
	} {
		pq, csv, _ := hyparquetCase(t, tc.rows)
		out, err := runHyparquet(t, node, dir, pq, csv)
		if err != nil {
			t.Errorf("hyparquet check of %d rows failed: %v\n%s", tc.rows, err, out)
			continue
		}
		t.Logf("%s", out)
		for _, want := range []string{tc.want, "metadata keys cloudwind.columns cloudwind.meta", "codecs SNAPPY",
			"columns chi:number radius_pc:number go18_verdict:string adiabatic:bool t_cc_myr:number criterion:string mass_cloud_msun:number",
			"\nok"} {
			if !strings.Contains(out, want) {
				t.Errorf("hyparquet output for %d rows lacks %q:\n%s", tc.rows, want, out)
			}
		}
	}
}

// TestParquetReadByHyparquetDetects changes one number of the CSV by two
// units in its ninth figure, and a verdict, and expects the script to report both: the
// check can fail.
func TestParquetReadByHyparquetDetects(t *testing.T) {
	node, dir := requireHyparquet(t)
	pq, csv, text := hyparquetCase(t, 50)
	lines := strings.Split(string(text), "\n")
	f := strings.Split(lines[3], ",") // row 3
	old := f[1]
	f[1] = strconv.FormatFloat(mustParse(t, f[1])*(1+2e-8), 'g', 9, 64)
	if f[1] == old {
		t.Fatalf("the changed value %s is the same text", old)
	}
	f[2] = "transformed-x"
	lines[3] = strings.Join(f, ",")
	if err := os.WriteFile(csv, []byte(strings.Join(lines, "\n")), 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := runHyparquet(t, node, dir, pq, csv)
	if err == nil {
		t.Fatalf("hyparquet check passed a CSV with a changed value:\n%s", out)
	}
	for _, want := range []string{"mismatch: row 3 column radius_pc", "mismatch: row 3 column go18_verdict"} {
		if !strings.Contains(out, want) {
			t.Errorf("hyparquet output lacks %q:\n%s", want, out)
		}
	}
}

func mustParse(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatal(err)
	}
	return v
}
