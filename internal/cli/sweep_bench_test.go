package cli

import (
	"context"
	"io"
	"os"
	"strings"
	"testing"

	"cloudwind/internal/report"
)

// The benchmarks of sweep. Figures are quoted in notes, never checked by a
// timed test (DEVELOPERS.md); BenchmarkSweepVsNumPy measures the speed
// against the NumPy script as a ratio in one run.

// numpyGrid is the 10⁶-point grid of testdata/bench/numpy_sweep.py:
// 25 pressures × 100 χ × 4 Mach numbers × 100 radii.
var numpyGrid = []string{"--chi", "log:10:1e4:100", "--mach", "0.5,1,1.5,2", "--pressure", "log:10:1e5:25", "--radius", "log:0.1:1e3:100"}

// benchSweepArgs sets up a sweep with the given flags (and --columns when
// cols is not empty) on the given number of workers.
func benchSweepArgs(b *testing.B, workers int, cols string, args ...string) (*env, *sweepOptions) {
	b.Helper()
	var sf scenarioFlags
	f := newFlagSet("sweep", "", "")
	sf.register(f)
	e := &env{args: args, stdin: strings.NewReader(""), stdout: io.Discard, stderr: io.Discard, getenv: os.Getenv}
	if err := f.parse(e); err != nil {
		b.Fatal(err)
	}
	opt, err := sweepSetup(e, &sf, f, "csv", workers, true)
	if err != nil {
		b.Fatal(err)
	}
	if cols != "" {
		if opt.cols, err = report.SelectColumns(opt.cols, cols); err != nil {
			b.Fatal(err)
		}
		opt.columnSpec = cols
	}
	return e, opt
}

// benchSweep sets up a 10⁶-point sweep (χ 100 values × r 10⁴ values) with
// all criteria and the built-in cooling function.
func benchSweep(b *testing.B, workers int) (*env, *sweepOptions) {
	b.Helper()
	e, opt := benchSweepArgs(b, workers, "", "--chi", "log:10:1e4:100", "--radius", "log:0.01:1e4:10000")
	if opt.grid.total != 1_000_000 {
		b.Fatalf("grid has %d points", opt.grid.total)
	}
	return e, opt
}

// runBenchSweep runs the sweep of opt to a discarding writer as text, or
// as Parquet when opt.parquet is set, and reports ns/row.
func runBenchSweep(b *testing.B, e *env, opt *sweepOptions) {
	b.Helper()
	rows := opt.grid.total
	run := runSweepTo
	if opt.parquet {
		run = runSweepParquet
	}
	for b.Loop() {
		if err := run(context.Background(), e, opt, io.Discard); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(rows), "ns/row")
}

// BenchmarkSweep1e6CSV: the figure, a 10⁶-point sweep written as
// CSV to a discarding writer, every column, on two workers.
func BenchmarkSweep1e6CSV(b *testing.B) {
	e, opt := benchSweep(b, 2)
	runBenchSweep(b, e, opt)
}

// BenchmarkSweep1e6CSVOneWorker is the same on one worker, for the
// speed-up from the second core.
func BenchmarkSweep1e6CSVOneWorker(b *testing.B) {
	e, opt := benchSweep(b, 1)
	runBenchSweep(b, e, opt)
}

// BenchmarkSweep1e6CSV16Columns is the NumPy script's sweep in process:
// its grid and its 16 columns (--columns), to a discarding writer, on one
// and on two workers.
func BenchmarkSweep1e6CSV16Columns(b *testing.B) {
	for _, w := range []struct {
		name    string
		workers int
	}{{"workers=1", 1}, {"workers=2", 2}} {
		b.Run(w.name, func(b *testing.B) {
			e, opt := benchSweepArgs(b, w.workers, goldenColumns16, numpyGrid...)
			runBenchSweep(b, e, opt)
		})
	}
}

// BenchmarkSweepEvaluate evaluates the 10⁶ points on one worker without
// formatting, to split the time between evaluation and output: every
// criterion, and only the two the 16 columns name; evaluation alone, and
// with reading the column values.
func BenchmarkSweepEvaluate(b *testing.B) {
	for _, c := range []struct{ name, cols string }{{"all columns", ""}, {"16 columns", goldenColumns16}} {
		for _, withColumns := range []bool{false, true} {
			name := c.name + "/evaluate"
			if withColumns {
				name += " and columns"
			}
			b.Run(name, func(b *testing.B) {
				_, opt := benchSweepArgs(b, 1, c.cols, numpyGrid...)
				plan, err := planSweep(opt)
				if err != nil {
					b.Fatal(err)
				}
				sw := newSweepWorker(opt, plan)
				row := func(int) {}
				if withColumns {
					row = func(int) { sw.values() }
				}
				for b.Loop() {
					sw.prev = nil
					if err := sw.eachRow(0, opt.grid.total, row); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(opt.grid.total), "ns/row")
			})
		}
	}
}

// BenchmarkSweepFormat measures the formatting path alone: the column
// values of the first 2¹⁵ points of the NumPy script's grid, evaluated
// beforehand, turned into CSV rows (text reuse of repeated values, the
// numbers' digits, the row) on one core. It reports ns/row and rows/s.
func BenchmarkSweepFormat(b *testing.B) {
	const rows = 1 << 15
	for _, c := range []struct{ name, cols string }{{"16 columns", goldenColumns16}, {"all columns", ""}} {
		b.Run(c.name, func(b *testing.B) {
			_, opt := benchSweepArgs(b, 1, c.cols, numpyGrid...)
			plan, err := planSweep(opt)
			if err != nil {
				b.Fatal(err)
			}
			sw := newSweepWorker(opt, plan)
			nc := len(sw.cols)
			num, str := make([]float64, rows*nc), make([]string, rows*nc)
			opt.grid.point(0, sw.idx)
			for i := 0; i < rows; i++ {
				if i > 0 {
					opt.grid.next(sw.idx)
				}
				if err := sw.evaluate(i); err != nil {
					b.Fatal(err)
				}
				sw.values()
				copy(num[i*nc:], sw.num)
				copy(str[i*nc:], sw.str)
			}
			buf := make([]byte, 0, 1<<20)
			bytes := 0
			for b.Loop() {
				for i := 0; i < rows; i++ {
					copy(sw.num, num[i*nc:(i+1)*nc])
					copy(sw.str, str[i*nc:(i+1)*nc])
					sw.format()
					buf = opt.format.AppendRow(buf, sw.cols, sw.text, i == 0)
					if len(buf) > 1<<20-4096 {
						bytes += len(buf)
						buf = buf[:0]
					}
				}
			}
			perRow := float64(b.Elapsed().Nanoseconds()) / float64(b.N) / rows
			b.ReportMetric(perRow, "ns/row")
			b.ReportMetric(1e9/perRow, "rows/s")
			b.ReportMetric(float64(bytes+len(buf))/float64(b.N)/rows, "B/row")
		})
	}
}

// BenchmarkSweep1e6Parquet16Columns: the same sweep as
// BenchmarkSweep1e6CSV16Columns written as Parquet to a discarding
// writer; the pair gives the ratio of the two formats in one run.
func BenchmarkSweep1e6Parquet16Columns(b *testing.B) {
	for _, w := range []struct {
		name    string
		workers int
	}{{"workers=1", 1}, {"workers=2", 2}} {
		b.Run(w.name, func(b *testing.B) {
			e, opt := benchSweepArgs(b, w.workers, goldenColumns16, numpyGrid...)
			opt.parquet = true
			runBenchSweep(b, e, opt)
		})
	}
}
