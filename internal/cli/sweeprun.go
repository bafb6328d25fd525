package cli

import (
	"context"
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"
	"sync"
	"time"

	"cloudwind/internal/report"

	"cloudwind/model"
)

// sweepChunk is the number of grid points one worker formats at a time.
const sweepChunk = 2048

// runSweepTo evaluates the grid in parallel and writes rows to w in grid
// order. Memory stays flat: at most 2 × workers chunks are in flight.
func runSweepTo(ctx context.Context, e *env, opt *sweepOptions, w io.Writer) error {
	plan, err := planSweep(opt)
	if err != nil {
		return err
	}
	if err := opt.format.Header(w, opt.cols, sweepMeta(opt)); err != nil {
		return err
	}
	pool := sync.Pool{New: func() any { return make([]byte, 0, 1<<20) }}
	err = runChunks(ctx, e, opt, sweepChunk, 2*opt.workers,
		func() func(lo, hi int) ([]byte, error) {
			sw := newSweepWorker(opt, plan)
			return func(lo, hi int) ([]byte, error) { return sw.chunk(pool.Get().([]byte)[:0], lo, hi) }
		},
		func(buf []byte) error { _, err := w.Write(buf); return err },
		func(buf []byte) { pool.Put(buf[:0]) })
	if err == nil && opt.format.Footer != "" {
		_, err = io.WriteString(w, opt.format.Footer)
	}
	return err
}

// runChunks is the pipeline of every sweep format: the shard's rows are
// cut into chunks of unit rows (the last may be shorter), counted from the
// shard's first row; the chunks are produced on opt.workers goroutines
// (newWorker gives each its own producer, called with the chunk's grid
// rows [lo, hi)) and consumed in grid order on this one, with at most
// inFlight chunks produced and not yet consumed, so memory stays flat.
// release returns a chunk's storage once consumed (or dropped after an
// error). It draws the progress bar, stops at the first
// error, and reports an interruption as such.
func runChunks[T any](ctx context.Context, e *env, opt *sweepOptions, unit, inFlight int,
	newWorker func() func(lo, hi int) (T, error), consume func(T) error, release func(T)) error {
	type result struct {
		v   T
		err error
		ok  bool
	}
	type job struct {
		k   int
		out chan result
	}
	rows := opt.shard.hi - opt.shard.lo
	nChunks := (rows + unit - 1) / unit
	jobs := make(chan job)
	queue := make(chan chan result, inFlight)
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()

	var wg sync.WaitGroup
	for range opt.workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			produce := newWorker()
			for j := range jobs {
				lo := opt.shard.lo + j.k*unit
				v, err := produce(lo, min(lo+unit, opt.shard.hi))
				j.out <- result{v, err, true}
			}
		}()
	}
	// Dispatcher: the queue's capacity bounds the chunks in flight.
	go func() {
		defer close(queue)
		defer close(jobs)
		for k := 0; k < nChunks; k++ {
			out := make(chan result, 1)
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
		var r result
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
				werr = consume(r.v)
			}
			if werr != nil {
				cancel()
			}
		}
		if r.ok {
			release(r.v)
		}
		done += unit
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
	return nil
}

// sweepPlan is what the workers compute: the columns written, read from
// results that hold only the criteria those columns name. With --columns
// naming two criteria, the other criteria are not evaluated at all; each
// criterion's outcome depends on nothing but the state and itself, so the
// values written are the same.
type sweepPlan struct {
	cols     []report.Column
	criteria []model.Criterion
}

// planSweep returns the plan of opt: opt.cols and opt.criteria, or when
// the columns name only some criteria, those criteria and the same columns
// built for them.
func planSweep(opt *sweepOptions) (sweepPlan, error) {
	all := sweepPlan{cols: opt.cols, criteria: opt.criteria}
	written := make(map[string]bool, len(opt.cols))
	names := make([]string, len(opt.cols))
	for i, c := range opt.cols {
		written[c.Name], names[i] = true, c.Name
	}
	var sub []model.Criterion
	for _, c := range opt.criteria {
		base := strings.ReplaceAll(c.ID, "-", "_")
		for _, suffix := range []string{"_ratio", "_radius_crit_pc", "_margin", "_verdict"} {
			if written[base+suffix] {
				sub = append(sub, c)
				break
			}
		}
	}
	if len(sub) == len(opt.criteria) {
		return all, nil
	}
	cols, err := report.SelectColumns(report.SweepColumns(sub), strings.Join(names, ","))
	if err != nil {
		return sweepPlan{}, fmt.Errorf("the columns of the criteria evaluated: %w", err) // cannot happen: the names are SweepColumns' own
	}
	return sweepPlan{cols: cols, criteria: sub}, nil
}

// sweepWorker evaluates and formats points. It keeps the thermal state of
// the last point, so that points differing only in radius and Mach number
// take the fast path (model.Result.Reevaluate).
type sweepWorker struct {
	opt      *sweepOptions
	criteria []model.Criterion
	cols     []report.Column
	idx      []int // axis indices of the current point
	prev     []int // axis indices of the last evaluated point; nil before the first
	res      model.Result
	num      []float64 // the current point's value of each numeric column
	str      []string  // the current point's value of each string column
	lo, hi   []float64 // every value in [lo, hi] has the numeric column's text (report.AppendNumberRange)
	strs     []string  // the value each string column's text holds
	text     [][]byte  // the formatted fields, reused while the value repeats
	seen     []bool    // text holds a formatting: of a value in [lo, hi], or of strs
	coolZ    float64
	cf       model.CoolingFunction
	fast     []bool // axis k may change on the fast path
	kMach    int    // the Mach-number axis, or -1
	kRadius  int    // the radius axis, or -1
	// radiusOnly: the current point differs from the last evaluated one in
	// its radius alone, so the radius-free columns (report.Column.RadiusFree)
	// keep their values in num and str.
	radiusOnly bool
}

func newSweepWorker(opt *sweepOptions, plan sweepPlan) *sweepWorker {
	n := len(plan.cols)
	sw := &sweepWorker{opt: opt, criteria: plan.criteria, cols: plan.cols, idx: make([]int, len(opt.grid.axes)),
		num: make([]float64, n), str: make([]string, n), lo: make([]float64, n), hi: make([]float64, n), strs: make([]string, n),
		text: make([][]byte, n), seen: make([]bool, n), fast: make([]bool, len(opt.grid.axes)), kMach: -1, kRadius: -1}
	for k, a := range opt.grid.axes {
		switch a.field {
		case model.FieldMach:
			sw.fast[k], sw.kMach = true, k
		case model.FieldRCloud:
			sw.fast[k], sw.kRadius = true, k
		}
	}
	return sw
}

// eachRow evaluates grid rows lo to hi (exclusive) in grid order into
// sw.res, calling row after each.
func (sw *sweepWorker) eachRow(lo, hi int, row func(i int)) error {
	g := &sw.opt.grid
	g.point(lo, sw.idx)
	for i := lo; i < hi; i++ {
		if i > lo {
			g.next(sw.idx)
		}
		if err := sw.evaluate(i); err != nil {
			return err
		}
		row(i)
	}
	return nil
}

// chunk appends grid rows lo to hi (exclusive) to buf.
func (sw *sweepWorker) chunk(buf []byte, lo, hi int) ([]byte, error) {
	first := sw.opt.shard.lo
	err := sw.eachRow(lo, hi, func(i int) {
		sw.values()
		sw.format()
		buf = sw.opt.format.AppendRow(buf, sw.cols, sw.text, i == first)
	})
	return buf, err
}

// values reads the columns of the current point into sw.num and sw.str.
func (sw *sweepWorker) values() {
	for c := range sw.cols {
		col := &sw.cols[c]
		if sw.radiusOnly && col.RadiusFree {
			continue
		}
		if col.IsString {
			sw.str[c] = col.Str(&sw.res)
		} else {
			sw.num[c] = col.Num(&sw.res)
		}
	}
}

// format fills sw.text with the fields of sw.num and sw.str. Along the
// fast axes most columns repeat (every thermal quantity), or change only
// in their last bits (r_crit, computed from the radius), so a value whose
// text is the column's last text keeps it: one equal to the last string,
// or inside the last number's interval of equal text.
func (sw *sweepWorker) format() {
	js := sw.opt.format.JSON
	for c := range sw.cols {
		col := &sw.cols[c]
		if col.IsString {
			s := sw.str[c]
			if sw.seen[c] && s == sw.strs[c] {
				continue
			}
			sw.strs[c], sw.seen[c] = s, true
			if js {
				sw.text[c] = strconv.AppendQuote(sw.text[c][:0], s)
			} else {
				sw.text[c] = append(sw.text[c][:0], s...)
			}
			continue
		}
		v := sw.num[c]
		if sw.seen[c] && v >= sw.lo[c] && v <= sw.hi[c] { // never for NaN
			continue
		}
		sw.seen[c] = true
		if t := col.Twin; t >= 0 && sw.num[t] == v {
			sw.text[c] = append(sw.text[c][:0], sw.text[t]...)
			sw.lo[c], sw.hi[c] = sw.lo[t], sw.hi[t]
			continue
		}
		sw.text[c], sw.lo[c], sw.hi[c] = report.AppendNumberRange(sw.text[c][:0], v, js)
	}
}

// evaluate computes point i, whose axis indices are in sw.idx, into sw.res.
func (sw *sweepWorker) evaluate(i int) error {
	g := &sw.opt.grid
	if sw.prev != nil && sw.onlyFastChanged() {
		mach, r := sw.res.Params.Mach, float64(sw.res.Params.RCloud)
		if k := sw.kMach; k >= 0 {
			mach = g.axes[k].values[sw.idx[k]]
		}
		if k := sw.kRadius; k >= 0 {
			r = g.axes[k].values[sw.idx[k]]
		}
		copy(sw.prev, sw.idx)
		sw.radiusOnly = mach == sw.res.Params.Mach
		err := sw.res.Reevaluate(mach, model.Length(r))
		if err != nil {
			sw.radiusOnly = false
		}
		return err
	}
	sw.radiusOnly = false
	p := sw.opt.base
	g.apply(&p, sw.idx)
	if sw.cf == nil || p.Metallicity != sw.coolZ {
		cf, err := sw.opt.cooling.Function(p.Metallicity)
		if err != nil {
			return fmt.Errorf("metallicity %s: %w", model.FormatNumber(p.Metallicity, 6), err)
		}
		sw.cf, sw.coolZ = cf, p.Metallicity
	}
	if err := sw.res.Evaluate(p, sw.cf, sw.criteria); err != nil {
		return fmt.Errorf("grid point %d: %w", i, err)
	}
	if sw.prev == nil {
		sw.prev = make([]int, len(sw.idx))
	}
	copy(sw.prev, sw.idx)
	return nil
}

// next advances idx from a point's axis indices to those of the next
// point (the last axis fastest).
func (g *sweepGrid) next(idx []int) {
	for k := len(g.axes) - 1; k >= 0; k-- {
		if idx[k]++; idx[k] < len(g.axes[k].values) {
			return
		}
		idx[k] = 0
	}
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
