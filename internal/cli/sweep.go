package cli

import (
	"fmt"
	"io"
	"math/bits"
	"os"
	"runtime"
	"strconv"
	"strings"
	"time"

	"cloudwind/internal/report"

	"cloudwind/model"
)

const sweepSynopsis = `Usage: cloudwind sweep [grid flags] [scenario flags] [--format csv|ecsv|json|jsonl] [-o FILE]

Evaluate every criterion over a grid of inputs: the Cartesian product of
the swept flags. Each of --chi --mach --pressure --t-cloud --radius
--metallicity takes a single value, a comma list ("1,3,10"), or a range
lin:A:B:N or log:A:B:N (N points, both ends included; values may carry
units, e.g. "log:0.1pc:1kpc:31"). One row per grid point: the inputs, the
main derived quantities, and for each criterion its ratio, threshold radius
(pc), margin and verdict (--columns picks some). The radius varies fastest, then the Mach number,
χ, pressure, cloud temperature and metallicity.

Formats: csv; ecsv (astropy's Enhanced CSV: units, descriptions and the
run's settings in a YAML header); json (one document with metadata and a
rows array); jsonl (JSON Lines, one row object per line, for large grids);
parquet (Apache Parquet: typed columns, units and the run's settings in the
file's key-value metadata; needs -o FILE or a redirect).
Output goes to stdout, or with -o to FILE, written atomically: an
interrupted or failed run leaves no partial file.`

const sweepExamples = `  cloudwind sweep --chi log:10:1e4:61 --radius log:0.01:1e3:101 --format csv -o grid.csv
  cloudwind sweep --chi 100,300,1000 --mach 0.5,1,1.5 --radius "log:0.1pc:1kpc:41" -o grid.ecsv
  cloudwind sweep --metallicity lin:0.1:1:10 --cooling builtin --format jsonl | head`

// sweepOptions are the parsed flags of sweep.
type sweepOptions struct {
	base     model.Params
	grid     sweepGrid
	cooling  *coolingSource
	criteria []model.Criterion
	format   report.Format
	out      string
	workers  int
	progress bool
	parquet  bool // --format parquet: runSweepParquet writes the rows

	cols       []report.Column // the columns written: every one, or --columns
	columnSpec string          // --columns as given; "" for every column
	shard      sweepShard
}

// sweepShard is --shard K/N: the K-th of N contiguous slices of the grid,
// rows [lo, hi) in grid order.
type sweepShard struct {
	k, n   int
	lo, hi int
}

// parseShard parses --shard K/N (0 ≤ K < N) and returns the rows of the
// K-th of N contiguous slices of total points: [⌊K·total/N⌋, ⌊(K+1)·total/N⌋),
// so that the slices of K = 0…N−1 follow one another and cover the grid.
func parseShard(spec string, total int) (sweepShard, error) {
	if spec == "" {
		return sweepShard{k: 0, n: 1, lo: 0, hi: total}, nil
	}
	ks, ns, ok := strings.Cut(strings.TrimSpace(spec), "/")
	k, errK := strconv.Atoi(strings.TrimSpace(ks))
	n, errN := strconv.Atoi(strings.TrimSpace(ns))
	switch {
	case !ok || errK != nil || errN != nil:
		return sweepShard{}, usagef("--shard: want K/N, the K-th of N slices counted from 0, as in --shard 3/64 (got %q)", sanitizeArg(spec))
	case n < 1 || n > maxShards:
		return sweepShard{}, usagef("--shard: N must be from 1 to %d (got %d)", maxShards, n)
	case k < 0 || k >= n:
		return sweepShard{}, usagef("--shard: K must be from 0 to N−1 = %d (got %d); a job array's task ids run 0…N−1, as with sbatch --array=0-%d", n-1, k, n-1)
	}
	at := func(j int) int { // ⌊j·total/N⌋ without overflow
		hi, lo := bits.Mul64(uint64(j), uint64(total))
		q, _ := bits.Div64(hi, lo, uint64(n))
		return int(q)
	}
	return sweepShard{k: k, n: n, lo: at(k), hi: at(k + 1)}, nil
}

// maxShards is the largest N of --shard.
const maxShards = 1_000_000

func runSweep(e *env) error {
	f := newFlagSet("sweep", sweepSynopsis, sweepExamples)
	var sf scenarioFlags
	sf.register(f)
	format := f.fs.String("format", "csv", "output format: csv, ecsv, json, jsonl or parquet (default: from the -o file's extension, else csv)")
	out := f.fs.String("o", "", "write to FILE (atomically) instead of stdout")
	force := f.fs.Bool("force", false, fmt.Sprintf("run grids larger than %d points", maxGridDefault))
	columns := f.fs.String("columns", "", "write only these columns: a comma list of header names, each may be a glob\n(\"chi,radius_pc,*_radius_crit_pc,*_verdict\"); default every column")
	shard := f.fs.String("shard", "", "evaluate only the K-th of N contiguous slices of the grid (K from 0), for job arrays:\nthe N outputs, headers aside, concatenate to the single-process output")
	var workers int
	f.int(&workers, "workers", runtime.GOMAXPROCS(0), 1, 1024, "parallel workers")
	if err := f.parse(e); err != nil {
		return err
	}
	fmtName, err := formatFor(*format, f.set("format"), *out, "csv", "csv", "ecsv", "json", "jsonl", "parquet")
	if err != nil {
		return err
	}
	opt, err := sweepSetup(e, &sf, f, fmtName, workers, *force)
	if err != nil {
		return err
	}
	opt.out = *out
	if f.set("columns") {
		if opt.cols, err = report.SelectColumns(opt.cols, *columns); err != nil {
			return usagef("--columns: %v", err)
		}
		opt.columnSpec = *columns
	}
	if opt.shard, err = parseShard(*shard, opt.grid.total); err != nil {
		return err
	}
	opt.progress = isTerminal(e.stderr) && opt.shard.hi-opt.shard.lo >= 200_000
	// The output is checked before anything is computed.
	target, err := checkOutput(opt.out)
	if err != nil {
		return err
	}
	if opt.parquet && target == nil && isTerminal(e.stdout) {
		return usagef("--format parquet writes a binary file: give -o FILE.parquet, or redirect standard output")
	}
	ctx, stop := interruptContext()
	defer stop()
	run := runSweepTo
	if opt.parquet {
		run = runSweepParquet
	}
	if target == nil {
		return run(ctx, e, opt, e.stdout)
	}
	return target.Write(func(w io.Writer) error { return run(ctx, e, opt, w) })
}

// sweepSetup parses and validates everything before any output.
func sweepSetup(e *env, sf *scenarioFlags, f *flagSet, format string, workers int, force bool) (*sweepOptions, error) {
	opt := &sweepOptions{workers: workers}
	var ok bool
	if format == "parquet" {
		opt.parquet, opt.format = true, report.Format{Name: "parquet"}
	} else if opt.format, ok = report.LookupFormat(format); !ok {
		return nil, usagef("--format: want csv, ecsv, json, jsonl or parquet (got %q)", sanitizeArg(format))
	}
	// The swept flags, parsed as specs; the single-valued rest as eval does.
	flagsByName := map[string]scenarioFlag{}
	for _, s := range numericScenarioFlags() {
		flagsByName[s.name] = s
	}
	if err := sf.load(e); err != nil {
		return nil, err
	}
	var axes []sweepAxis
	plain := *sf
	for _, name := range sweepAxisOrder {
		s := flagsByName[name]
		spec := *s.ptr(sf)
		vs, err := parseAxis(name, s.kind, spec)
		if err != nil {
			return nil, err
		}
		if len(vs) == 1 {
			continue // a single value: keep it as a plain input
		}
		axes = append(axes, sweepAxis{flag: name, field: s.field, kind: s.kind, spec: spec, values: vs})
		*s.ptr(&plain) = "" // parsed by the axis
	}
	base, err := plain.parse()
	if err != nil {
		return nil, err
	}
	for _, a := range axes {
		setField(&base, a.field, a.values[0]) // a valid value for the checks below
	}
	if err := base.Validate(); err != nil {
		return nil, fieldUsage(err)
	}
	opt.base = base
	opt.grid = newSweepGrid(axes)
	if opt.grid.total > maxGridDefault && !force {
		return nil, usagef("the grid has %s points, more than %d; pass --force to run it", gridSize(opt.grid.total), maxGridDefault)
	}
	if err := opt.grid.validate(base); err != nil {
		return nil, err
	}
	if opt.cooling, err = sf.source(e); err != nil {
		return nil, err
	}
	if opt.criteria, err = loadCriteria(e, sf.criteria); err != nil {
		return nil, err
	}
	opt.cols = report.SweepColumns(opt.criteria)
	opt.shard = sweepShard{k: 0, n: 1, lo: 0, hi: opt.grid.total}
	// Every metallicity must give a cooling function.
	for _, z := range metallicities(opt) {
		if _, err := opt.cooling.Function(z); err != nil {
			return nil, usagef("--metallicity %g: %v", z, err)
		}
	}
	return opt, nil
}

// metallicities returns the metallicities of the sweep.
func metallicities(opt *sweepOptions) []float64 {
	for _, a := range opt.grid.axes {
		if a.field == model.FieldMetallicity {
			return a.values
		}
	}
	return []float64{opt.base.Metallicity}
}

func gridSize(n int) string {
	if n == int(^uint(0)>>1) {
		return "more than 9.2e18"
	}
	return fmt.Sprintf("%d", n)
}

// isTerminal reports whether w is a terminal.
func isTerminal(w io.Writer) bool {
	if c, ok := w.(*checkedWriter); ok {
		w = c.w
	}
	f, ok := w.(*os.File)
	return ok && isTTY(f)
}

// sweepMeta describes the run for ECSV and JSON headers.
func sweepMeta(opt *sweepOptions) []report.Meta {
	q := opt.base.WithDefaults()
	var grid []report.Meta
	for _, a := range opt.grid.axes {
		grid = append(grid, report.KV(a.flag, a.spec))
	}
	var crit []any
	for _, c := range opt.criteria {
		crit = append(crit, []report.Meta{
			report.KV("id", c.ID), report.KV("label", c.Label), report.KV("formula", c.Formula()), report.KV("cooling_time", c.Cool.String()),
			report.KV("dynamical_time", c.Dyn.String()), report.KV("alpha", c.Alpha), report.KV("beta", c.Beta), report.KV("verified", c.Verified),
			report.KV("status", c.Status), report.KV("citation", c.Citation.String()),
			report.KV("calibrated_range", []report.Meta{report.KV("chi", []any{c.Range.Chi.Min, c.Range.Chi.Max}), report.KV("mach", []any{c.Range.Mach.Min, c.Range.Mach.Max}),
				report.KV("t_cloud_k", []any{c.Range.TCloud.Min, c.Range.TCloud.Max}), report.KV("status", c.Range.Status)}),
		})
	}
	cool := []report.Meta{report.KV("spec", opt.cooling.Spec), report.KV("description", opt.cooling.Desc)}
	if m := opt.cooling.Meta; m != nil {
		cool = append(cool, report.KV("citation", m.Citation), report.KV("source_normalisation", m.Normalisation.String()),
			report.KV("helium_ratio", m.HeliumRatio), report.KV("mixture", m.Mixture), report.KV("historical", m.Historical),
			report.KV("caveats", stringsToAny(m.Caveats)), report.KV("warnings", stringsToAny(m.Warnings)))
	}
	// fixed_inputs: the inputs that were not swept, in the header's names.
	swept := map[string]bool{}
	for _, a := range opt.grid.axes {
		swept[a.field] = true
	}
	var fixed []report.Meta
	for _, in := range []struct {
		field, key string
		v          float64
	}{{model.FieldChi, "chi", q.Chi}, {model.FieldMach, "mach", q.Mach}, {model.FieldPressure, "pressure_kcm3", float64(q.Pressure)},
		{model.FieldTCloud, "t_cloud_k", float64(q.TCloud)}, {model.FieldRCloud, "radius_pc", float64(q.RCloud / model.Parsec)},
		{model.FieldMetallicity, "metallicity_zsun", q.Metallicity}} {
		if !swept[in.field] {
			fixed = append(fixed, report.KV(in.key, in.v))
		}
	}
	var names []any
	for _, c := range opt.cols {
		names = append(names, c.Name)
	}
	sel := "all"
	if opt.columnSpec != "" {
		sel = opt.columnSpec
	}
	sh := opt.shard
	return []report.Meta{
		report.KV("program", "cloudwind "+versionString()),
		report.KV("grid", grid),
		report.KV("grid_points", opt.grid.total),
		report.KV("row_order", "radius fastest, then mach, chi, pressure, t_cloud, metallicity"),
		report.KV("shard", []report.Meta{report.KV("index", sh.k), report.KV("count", sh.n), report.KV("first_row", sh.lo), report.KV("rows", sh.hi-sh.lo)}),
		report.KV("columns", []report.Meta{report.KV("selection", sel), report.KV("names", names)}),
		report.KV("fixed_inputs", fixed),
		report.KV("conventions", []report.Meta{report.KV("heat_capacity", q.HeatCapacity.String()), report.KV("heat_capacity_f", q.HeatCapacity.Factor()),
			report.KV("density_product", q.DensityProduct.String()), report.KV("mix_cooling", q.MixCooling.String()), report.KV("gamma", q.Gamma), report.KV("mu_cloud", q.MuCold), report.KV("mu_hot", q.MuHot),
			report.KV("hydrogen_fraction", q.HydrogenFraction), report.KV("mixture", q.Mixture.Name), report.KV("t_floor_k", tFloorMeta(opt.base)),
			report.KV("mach_reference", "hot-gas adiabatic sound speed"), report.KV("lambda_normalisation", "per n_H^2")}),
		report.KV("cooling", cool),
		report.KV("criteria", crit),
	}
}

// tFloorMeta is the floor, "t_cloud" when it follows the cloud
// temperature, or "none".
func tFloorMeta(p model.Params) any {
	if p.TFloor == 0 {
		return "t_cloud"
	}
	if _, ok := p.Floor(); !ok {
		return "none"
	}
	return float64(p.TFloor)
}

func stringsToAny(s []string) []any {
	out := make([]any, len(s))
	for i, v := range s {
		out[i] = v
	}
	return out
}

// progressBar draws a one-line progress bar on a terminal.
type progressBar struct {
	w     io.Writer
	total int
	start time.Time
	last  time.Time
}

func (p *progressBar) update(done int, final bool) {
	now := time.Now()
	if !final && now.Sub(p.last) < 100*time.Millisecond {
		return
	}
	p.last = now
	const width = 30
	frac := float64(done) / float64(p.total)
	n := int(frac * width)
	fmt.Fprintf(p.w, "\r[%s%s] %3.0f%%  %d/%d points  %.1f s", strings.Repeat("=", n), strings.Repeat(" ", width-n), 100*frac, done, p.total, now.Sub(p.start).Seconds())
	if final {
		fmt.Fprint(p.w, "\n")
	}
}
