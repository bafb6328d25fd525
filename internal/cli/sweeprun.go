package cli

import (
	"context"
	"errors"
	"fmt"
	"io"
	"strconv"
	"sync"
	"time"

	"cloudwind/internal/report"

	"cloudwind/model"
)

// sweepChunk is the number of grid points one worker formats at a time.
const sweepChunk = 2048

// chunkResult is one formatted chunk, or the error that stopped it.
type chunkResult struct {
	buf []byte
	err error
}

// runSweepTo evaluates the grid in parallel and writes rows to w in grid
// order. Memory stays flat: at most 2 × workers chunks are in flight.
func runSweepTo(ctx context.Context, e *env, opt *sweepOptions, w io.Writer) error {
	cols := opt.cols
	if err := opt.format.Header(w, cols, sweepMeta(opt)); err != nil {
		return err
	}
	rows := opt.shard.hi - opt.shard.lo
	nChunks := (rows + sweepChunk - 1) / sweepChunk
	type job struct {
		k   int
		out chan chunkResult
	}
	jobs := make(chan job)
	queue := make(chan chan chunkResult, 2*opt.workers)
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()
	pool := sync.Pool{New: func() any { return make([]byte, 0, 1<<20) }}

	var wg sync.WaitGroup
	for range opt.workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			sw := newSweepWorker(opt, cols)
			for j := range jobs {
				buf := pool.Get().([]byte)[:0]
				buf, err := sw.chunk(buf, j.k)
				j.out <- chunkResult{buf, err}
			}
		}()
	}
	// Dispatcher: the queue's capacity bounds the chunks in flight.
	go func() {
		defer close(queue)
		defer close(jobs)
		for k := 0; k < nChunks; k++ {
			out := make(chan chunkResult, 1)
			select {
			case queue <- out:
			case <-ctx.Done():
				return
			}
			select {
			case jobs <- job{k, out}:
			case <-ctx.Done():
				return
			}
		}
	}()

	var bar *progressBar
	if opt.progress {
		bar = &progressBar{w: e.stderr, total: rows, start: time.Now()}
	}
	var werr error
	done := 0
	for out := range queue {
		var r chunkResult
		select {
		case r = <-out:
		case <-ctx.Done():
		}
		if werr == nil {
			switch {
			case ctx.Err() != nil:
				werr = ctx.Err()
			case r.err != nil:
				werr = r.err
			default:
				_, werr = w.Write(r.buf)
			}
			if werr != nil {
				cancel()
			}
		}
		if r.buf != nil {
			pool.Put(r.buf[:0])
		}
		done += sweepChunk
		if bar != nil && werr == nil {
			bar.update(min(done, rows), false)
		}
	}
	wg.Wait()
	if werr == nil && ctx.Err() != nil {
		werr = ctx.Err() // cancelled before every chunk was queued
	}
	if werr != nil {
		if errors.Is(werr, context.Canceled) {
			return errors.New("interrupted; no output file was written")
		}
		return werr
	}
	if bar != nil {
		bar.update(rows, true)
	}
	if opt.format.Footer != "" {
		_, werr = io.WriteString(w, opt.format.Footer)
	}
	return werr
}

// sweepWorker evaluates and formats points. It keeps the thermal state of
// the last point, so that points differing only in radius and Mach number
// take the fast path (model.Result.Reevaluate).
type sweepWorker struct {
	opt   *sweepOptions
	cols  []report.Column
	idx   []int
	prev  []int // axis indices of the last evaluated point; nil before the first
	res   model.Result
	vals  []float64 // the last value of each numeric column
	text  [][]byte  // its formatted text, reused while the value repeats
	seen  []bool    // text holds the formatting of vals
	coolZ float64
	cf    model.CoolingFunction
	fast  []bool // axis k may change on the fast path
}

func newSweepWorker(opt *sweepOptions, cols []report.Column) *sweepWorker {
	sw := &sweepWorker{opt: opt, cols: cols, idx: make([]int, len(opt.grid.axes)),
		vals: make([]float64, len(cols)), text: make([][]byte, len(cols)), seen: make([]bool, len(cols)),
		fast: make([]bool, len(opt.grid.axes))}
	for k, a := range opt.grid.axes {
		sw.fast[k] = a.field == model.FieldMach || a.field == model.FieldRCloud
	}
	return sw
}

// chunk appends the rows of chunk k of the shard to buf.
func (sw *sweepWorker) chunk(buf []byte, k int) ([]byte, error) {
	sh := &sw.opt.shard
	lo := sh.lo + k*sweepChunk
	hi := min(lo+sweepChunk, sh.hi)
	for i := lo; i < hi; i++ {
		if err := sw.evaluate(i); err != nil {
			return buf, err
		}
		sw.format()
		buf = sw.opt.format.AppendRow(buf, sw.cols, sw.text, i == sh.lo)
	}
	return buf, nil
}

// format fills sw.text with the fields of the current point. Along the
// fast axes most columns repeat (every thermal quantity, r_crit), so a
// value equal to the column's last one reuses its text.
func (sw *sweepWorker) format() {
	js := sw.opt.format.JSON
	for c := range sw.cols {
		col := &sw.cols[c]
		if col.IsString {
			s := col.Str(&sw.res)
			if js {
				sw.text[c] = strconv.AppendQuote(sw.text[c][:0], s)
			} else {
				sw.text[c] = append(sw.text[c][:0], s...)
			}
			continue
		}
		v := col.Num(&sw.res)
		if sw.seen[c] && v == sw.vals[c] {
			continue
		}
		sw.vals[c], sw.seen[c] = v, true
		if t := col.Twin; t >= 0 && sw.vals[t] == v {
			sw.text[c] = append(sw.text[c][:0], sw.text[t]...)
			continue
		}
		sw.text[c] = report.AppendNumber(sw.text[c][:0], v, js)
	}
}

// evaluate computes point i into sw.res.
func (sw *sweepWorker) evaluate(i int) error {
	g := &sw.opt.grid
	g.point(i, sw.idx)
	if sw.prev != nil && sw.onlyFastChanged() {
		p := sw.res.Params
		g.apply(&p, sw.idx)
		copy(sw.prev, sw.idx)
		return sw.res.Reevaluate(p.Mach, p.RCloud)
	}
	p := sw.opt.base
	g.apply(&p, sw.idx)
	if sw.cf == nil || p.Metallicity != sw.coolZ {
		cf, err := sw.opt.cooling.Function(p.Metallicity)
		if err != nil {
			return fmt.Errorf("metallicity %s: %w", model.FormatNumber(p.Metallicity, 6), err)
		}
		sw.cf, sw.coolZ = cf, p.Metallicity
	}
	if err := sw.res.Evaluate(p, sw.cf, sw.opt.criteria); err != nil {
		return fmt.Errorf("grid point %d: %w", i, err)
	}
	if sw.prev == nil {
		sw.prev = make([]int, len(sw.idx))
	}
	copy(sw.prev, sw.idx)
	return nil
}

// onlyFastChanged reports whether the current point differs from the last
// one only on fast axes (radius, Mach number).
func (sw *sweepWorker) onlyFastChanged() bool {
	for k := range sw.idx {
		if sw.idx[k] != sw.prev[k] && !sw.fast[k] {
			return false
		}
	}
	return true
}
