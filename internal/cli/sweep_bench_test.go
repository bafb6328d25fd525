package cli

import (
	"context"
	"io"
	"os"
	"strings"
	"testing"

	"cloudwind/internal/report"
)

// benchSweep sets up a 10⁶-point sweep (χ 100 values × r 10⁴ values) with
// all criteria and the built-in cooling function.
func benchSweep(b *testing.B, workers int) (*env, *sweepOptions) {
	b.Helper()
	var sf scenarioFlags
	f := newFlagSet("sweep", "", "")
	sf.register(f)
	e := &env{args: []string{"--chi", "log:10:1e4:100", "--radius", "log:0.01:1e4:10000"}, stdin: strings.NewReader(""), stdout: io.Discard, stderr: io.Discard, getenv: os.Getenv}
	if err := f.parse(e); err != nil {
		b.Fatal(err)
	}
	opt, err := sweepSetup(e, &sf, f, "csv", workers, false)
	if err != nil {
		b.Fatal(err)
	}
	if opt.grid.total != 1_000_000 {
		b.Fatalf("grid has %d points", opt.grid.total)
	}
	return e, opt
}

// BenchmarkSweep1e6CSV: the figure, a 10⁶-point sweep written as
// CSV to a discarding writer, on every core (GOMAXPROCS workers).
func BenchmarkSweep1e6CSV(b *testing.B) {
	e, opt := benchSweep(b, 2)
	for b.Loop() {
		if err := runSweepTo(context.Background(), e, opt, io.Discard); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSweep1e6CSVOneWorker is the same on one worker, for the
// speed-up from the second core.
func BenchmarkSweep1e6CSVOneWorker(b *testing.B) {
	e, opt := benchSweep(b, 1)
	for b.Loop() {
		if err := runSweepTo(context.Background(), e, opt, io.Discard); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSweepEvaluateOnly evaluates the 10⁶ points on one worker
// without formatting, to split the time between evaluation and output.
func BenchmarkSweepEvaluateOnly(b *testing.B) {
	_, opt := benchSweep(b, 1)
	cols := report.SweepColumns(opt.criteria)
	sw := newSweepWorker(opt, cols)
	for b.Loop() {
		sw.prev = nil
		for i := 0; i < opt.grid.total; i++ {
			if err := sw.evaluate(i); err != nil {
				b.Fatal(err)
			}
		}
	}
}

// BenchmarkSweepEvaluateAndColumns adds reading the column values, still
// without text formatting.
func BenchmarkSweepEvaluateAndColumns(b *testing.B) {
	_, opt := benchSweep(b, 1)
	cols := report.SweepColumns(opt.criteria)
	sw := newSweepWorker(opt, cols)
	for b.Loop() {
		sw.prev = nil
		for i := 0; i < opt.grid.total; i++ {
			if err := sw.evaluate(i); err != nil {
				b.Fatal(err)
			}
			for c, col := range sw.cols {
				if col.IsString {
					_ = col.Str(&sw.res)
				} else {
					sw.vals[c] = col.Num(&sw.res)
				}
			}
		}
	}
}
