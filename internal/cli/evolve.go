package cli

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strings"
	"text/tabwriter"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/internal/suggest"
	"cloudwind/model"
)

const evolveSynopsis = `Usage: cloudwind evolve [scenario flags] [--until TCC] [--criterion ID|all] [evolution flags] [--format text|csv|ecsv|json]

Integrate the semi-analytic evolution of the cloud: its mass m, velocity v
and position x in the wind against t/t_cc. The
cloud grows by accreting cooled wind gas (ṁ = ρ_hot v_mix A, the mixing-layer
scaling of Gronke & Oh 2020 and Tan et al. 2021) when the chosen criterion
says it survives at its current radius, and loses mass on t_destroy = κ t_cc
otherwise; it gains momentum by accretion and by ram-pressure drag (C_D),
optionally magnetic (1 + v_A²/v_w², McCourt et al. 2015). One trajectory per
criterion's branch. Reports the entrainment time (|Δv| ≤ 0.1 v_w), the
mass-doubling time and the time of destruction (m < 10⁻³ m0). Every
constant is settable; those from memory are marked.`

const evolveExamples = `  cloudwind evolve --chi 100 --radius 30pc
  cloudwind evolve --criterion gronke-oh-2018 --until 50 --format csv > traj.csv
  cloudwind evolve --branch smooth --width 4 --kappa 6 --drag-coefficient 1 --format json
  cloudwind evolve --area fragmented --mix-cooling minmix`

// evolveFlags are the settings of the evolution.
type evolveFlags struct {
	until, alphaV, areaFactor, kappa, cd, va, v0, width, rtol float64
	machFactor                                                bool
	branch, area, criterion                                   string
	samples                                                   int
}

func (f *evolveFlags) register(fs *flagSet) {
	d := model.DefaultEvolveSettings()
	fs.float(&f.until, "until", d.TEnd, "end time in cloud-crushing times t_cc (of the initial cloud)")
	fs.fs.StringVar(&f.criterion, "criterion", "all", "the criterion whose branch the cloud follows: an id, or all")
	fs.fs.StringVar(&f.area, "area", "sphere", "sphere (A ∝ r²) or fragmented (A ∝ m, v_mix fixed: exponential growth)")
	fs.float(&f.v0, "v0", 0, "initial cloud velocity in v_w")
	fs.int(&f.samples, "samples", 201, 2, 100000, "output times, evenly spaced from 0 to --until (2–100000)")
	f.registerModel(fs)
}

// registerModel adds the flags of the growth and entrainment model (its
// branch and constants), shared by evolve and outflow --carry, and sets
// the others to their defaults.
func (f *evolveFlags) registerModel(fs *flagSet) {
	d := model.DefaultEvolveSettings()
	f.until, f.area = d.TEnd, "sphere"
	fs.fs.StringVar(&f.branch, "branch", "sharp", "sharp (grow or shrink by the criterion) or smooth (S = 1/(1+(ratio/limit)^n))")
	fs.float(&f.width, "width", d.Width, "n of the smooth branch (a modelling choice)")
	fs.float(&f.alphaV, "alpha-v", d.AlphaV, "α_v in v_mix = α_v c_s,cl (t_cool/t_sc,cl)^-1/4 (from memory)")
	fs.float(&f.areaFactor, "area-factor", d.AreaFactor, "f_A in A = f_A 4π r² (from memory)")
	fs.float(&f.kappa, "kappa", d.Kappa, "κ in t_destroy = κ t_cc (literature 2–10)")
	fs.float(&f.cd, "drag-coefficient", d.DragCoefficient, "C_D of the ram-pressure drag (from memory, ~0.5–1)")
	fs.float(&f.va, "va-over-vw", 0, "v_A/v_w of a magnetised wind: drag × (1 + v_A²/v_w²)")
	fs.fs.BoolVar(&f.machFactor, "mach-factor", false, "multiply v_mix by (|Δv|/c_s,hot)^1/2 (from memory, uncertain)")
	fs.float(&f.rtol, "rtol", d.RelTol, "relative tolerance of the integrator")
}

// settings turns the flags into model.EvolveSettings.
func (f *evolveFlags) settings() (model.EvolveSettings, error) {
	// In EvolveSettings zero means "the default"; on the command line a
	// value given is checked as given (model.CheckField), 0 included.
	for _, c := range []struct {
		name, key string
		v         float64
	}{{"until", "t_end", f.until}, {"alpha-v", "alpha_v", f.alphaV}, {"area-factor", "area_factor", f.areaFactor},
		{"kappa", "kappa", f.kappa}, {"drag-coefficient", "drag_coefficient", f.cd}, {"width", "width", f.width},
		{"rtol", "rel_tol", f.rtol}, {"va-over-vw", "alfven_over_wind", f.va}, {"v0", "v0", f.v0}} {
		if err := model.CheckField(c.key, c.v); err != nil {
			var fe *model.FieldError
			errors.As(err, &fe)
			return model.EvolveSettings{}, usagef("--%s: %s", c.name, fe.Reason)
		}
	}
	s := model.EvolveSettings{AlphaV: f.alphaV, AreaFactor: f.areaFactor, Kappa: f.kappa, DragCoefficient: f.cd,
		AlfvenOverWind: f.va, MachFactor: f.machFactor, V0: f.v0, Width: f.width, TEnd: f.until, RelTol: f.rtol}
	var err error
	if s.Branch, err = model.ParseBranchMode(f.branch); err != nil {
		return s, usagef("--branch: %v", err)
	}
	if s.Area, err = model.ParseAreaModel(f.area); err != nil {
		return s, usagef("--area: %v", err)
	}
	if err := s.Validate(); err != nil {
		var fe *model.FieldError
		if errors.As(err, &fe) {
			return s, usagef("--%s: %s", evolveFlagName(fe.Field), fe.Reason)
		}
		return s, usagef("%v", err)
	}
	return s, nil
}

// evolveFlagName maps an EvolveSettings field key to its flag.
func evolveFlagName(field string) string {
	switch field {
	case "t_end":
		return "until"
	case "alfven_over_wind":
		return "va-over-vw"
	case "rel_tol":
		return "rtol"
	}
	return strings.ReplaceAll(field, "_", "-")
}

// selectCriteria returns the criteria named by --criterion.
func selectCriteria(cs []model.Criterion, id string) ([]model.Criterion, error) {
	if id == "all" {
		return cs, nil
	}
	if c, ok := model.CriterionByID(cs, id); ok {
		return []model.Criterion{*c}, nil
	}
	var ids []string
	for _, c := range cs {
		ids = append(ids, c.ID)
	}
	msg := fmt.Sprintf("--criterion: unknown id %q", sanitizeArg(id))
	if s := suggest.Closest(id, ids); s != "" {
		msg += fmt.Sprintf(" (did you mean %q?)", s)
	} else {
		msg += " (want one of " + strings.Join(ids, ", ") + ", or all)"
	}
	return nil, usagef("%s", msg)
}

// evolveRun is one criterion's trajectory.
type evolveRun struct {
	c   model.Criterion
	tr  model.Trajectory
	err error
}

func runEvolve(e *env) error {
	f := newFlagSet("evolve", evolveSynopsis, evolveExamples)
	var sf scenarioFlags
	sf.register(f)
	var ef evolveFlags
	ef.register(f)
	format := f.fs.String("format", "text", "output format: text, csv, ecsv or json")
	if err := f.parse(e); err != nil {
		return err
	}
	set, err := ef.settings()
	if err != nil {
		return err
	}
	if err := checkFormat(*format, "text", "csv", "ecsv", "json"); err != nil {
		return err
	}
	sc, err := sf.evaluate(e)
	if err != nil {
		return err
	}
	cs, err := selectCriteria(sc.criteria, ef.criterion)
	if err != nil {
		return err
	}
	runs := make([]evolveRun, len(cs))
	for i := range cs {
		runs[i].c = cs[i]
		runs[i].tr, runs[i].err = model.Evolve(&sc.res.State, &cs[i], set)
	}
	out := evolveOutput{res: &sc.res, set: set, runs: runs, samples: ef.samples, cooling: report.CoolingName(sc.cooling, sc.cf)}
	switch *format {
	case "csv":
		return out.writeDelimited(e.stdout, false)
	case "ecsv":
		return out.writeDelimited(e.stdout, true)
	case "json":
		return out.writeJSON(e.stdout)
	}
	return out.writeText(e.stdout)
}

type evolveOutput struct {
	res     *model.Result
	set     model.EvolveSettings
	runs    []evolveRun
	samples int
	cooling string
}

// grid returns the output times of run r: evenly spaced to t_end, or to
// the destruction time when the cloud is destroyed earlier.
func (o *evolveOutput) grid(r *evolveRun) []float64 {
	end := o.set.TEnd
	if n := len(r.tr.T); n > 0 {
		end = min(end, r.tr.T[n-1])
	}
	ts := make([]float64, o.samples)
	for i := range ts {
		ts[i] = end * float64(i) / float64(o.samples-1)
	}
	return ts
}

// evolveColumns are the columns of csv/ecsv output.
func evolveColumns() []report.Column {
	return []report.Column{
		{Name: "criterion", IsString: true, Description: "criterion whose branch the cloud follows"},
		{Name: "t_tcc", Description: "time in cloud-crushing times of the initial cloud, t/t_cc,0"},
		{Name: "m_m0", Description: "cloud mass over its initial mass"},
		{Name: "v_vw", Description: "cloud velocity over the wind speed"},
		{Name: "x_rcl", Description: "cloud position over its initial radius"},
	}
}

func (o *evolveOutput) writeDelimited(w io.Writer, ecsv bool) error {
	cols := evolveColumns()
	sep := ","
	if ecsv {
		sep = " "
		if err := report.ECSVHeader(w, cols, o.meta()); err != nil {
			return err
		}
	} else {
		names := make([]string, len(cols))
		for i, c := range cols {
			names[i] = c.Name
		}
		if _, err := io.WriteString(w, strings.Join(names, ",")+"\n"); err != nil {
			return err
		}
	}
	var b []byte
	for i := range o.runs {
		r := &o.runs[i]
		if r.err != nil {
			continue
		}
		for _, t := range o.grid(r) {
			m, v, x := r.tr.At(t)
			b = append(b, r.c.ID...)
			for _, val := range []float64{t, m, v, x} {
				b = append(b, sep...)
				b = report.AppendNumber(b, val, false)
			}
			b = append(b, '\n')
		}
	}
	_, err := w.Write(b)
	return err
}

// meta describes the run for ECSV and JSON.
func (o *evolveOutput) meta() []report.Meta {
	var consts []report.Meta
	for _, c := range o.set.Constants() {
		var v, d any = c.Text, c.DefText
		if c.Text == "" {
			v, d = c.Value, c.Default
		}
		consts = append(consts, report.KV(c.Key, []report.Meta{report.KV("value", v), report.KV("default", d), report.KV("status", c.Status)}))
	}
	var summ []any
	for i := range o.runs {
		r := &o.runs[i]
		item := []report.Meta{report.KV("criterion", r.c.ID)}
		if r.err != nil {
			item = append(item, report.KV("error", r.err.Error()))
		} else {
			item = append(item, report.KV("t_entrain_tcc", r.tr.TEntrain), report.KV("t_double_tcc", r.tr.TDouble),
				report.KV("t_destroy_tcc", r.tr.TDestroy), report.KV("destroyed", r.tr.Destroyed))
		}
		summ = append(summ, item)
	}
	q := o.res.Params
	return []report.Meta{
		report.KV("program", "cloudwind "+versionString()),
		report.KV("inputs", []report.Meta{report.KV("chi", q.Chi), report.KV("mach", q.Mach), report.KV("pressure_kcm3", float64(q.Pressure)), report.KV("t_cloud_k", float64(q.TCloud)),
			report.KV("radius_pc", float64(q.RCloud/model.Parsec)), report.KV("metallicity_zsun", q.Metallicity)}),
		report.KV("t_cc0_myr", float64(o.res.TCC/model.Megayear)),
		report.KV("cooling", o.cooling),
		report.KV("settings", []report.Meta{report.KV("branch", o.set.Branch.String()), report.KV("area", o.set.Area.String()), report.KV("mix_cooling", q.MixCooling.String()),
			report.KV("t_end_tcc", o.set.TEnd), report.KV("rel_tol", o.set.RelTol)}),
		report.KV("constants", consts),
		report.KV("summary", summ),
	}
}

func (o *evolveOutput) writeJSON(w io.Writer) error {
	var runs []map[string]any
	for i := range o.runs {
		r := &o.runs[i]
		item := map[string]any{"criterion": r.c.ID}
		if r.err != nil {
			item["error"] = r.err.Error()
			runs = append(runs, item)
			continue
		}
		ts := o.grid(r)
		var samples []map[string]any
		for _, t := range ts {
			m, v, x := r.tr.At(t)
			samples = append(samples, map[string]any{"t_tcc": t, "m_m0": finite(m), "v_vw": finite(v), "x_rcl": finite(x)})
		}
		item["t_entrain_tcc"] = finite(r.tr.TEntrain)
		item["t_double_tcc"] = finite(r.tr.TDouble)
		item["t_destroy_tcc"] = finite(r.tr.TDestroy)
		item["destroyed"] = r.tr.Destroyed
		item["t_grow0_tcc"] = finite(r.tr.TGrow0)
		item["ratio0"] = finite(r.tr.Ratio0)
		item["steps"] = r.tr.Steps
		item["growth_note"] = r.tr.GrowthNote
		item["samples"] = samples
		runs = append(runs, item)
	}
	doc := map[string]any{"schema": "cloudwind.evolve/1", "meta": report.OrderedJSON(o.meta()), "trajectories": runs}
	return report.WriteJSON(w, doc)
}

func (o *evolveOutput) writeText(w io.Writer) error {
	var b strings.Builder
	q := o.res.Params
	fmt.Fprintf(&b, "Cloud evolution: χ = %s, M = %s, r_cl = %s, t_cc,0 = %s; cooling: %s\n", quantity.FormatSig(q.Chi, 3), quantity.FormatSig(q.Mach, 3),
		quantity.Format(model.DimLength, float64(q.RCloud)), quantity.Format(model.DimTime, float64(o.res.TCC)), o.cooling)
	fmt.Fprintf(&b, "branch %s, area %s, growth model: v_mix from %s (--mix-cooling), until %s t_cc,0\n\n", o.set.Branch, o.set.Area, q.MixCooling.Symbol(), quantity.FormatSig(o.set.TEnd, 3))
	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  criterion\tt_grow,0/t_cc\tentrained\tdoubled\tdestroyed\tend: m/m0\tv/v_w\tx/r_cl")
	when := func(t float64) string {
		if math.IsNaN(t) {
			return "—"
		}
		return quantity.FormatSig(t, 3) + " t_cc"
	}
	for i := range o.runs {
		r := &o.runs[i]
		if r.err != nil {
			fmt.Fprintf(tw, "  %s\terror: %s\n", r.c.ID, r.err)
			continue
		}
		n := len(r.tr.T) - 1
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", quantity.Sanitize(r.c.ID), quantity.FormatSig(r.tr.TGrow0, 3), when(r.tr.TEntrain), when(r.tr.TDouble),
			when(r.tr.TDestroy), quantity.FormatSig(r.tr.M[n], 3), quantity.FormatSig(r.tr.V[n], 3), quantity.FormatSig(r.tr.X[n], 3))
	}
	tw.Flush()
	for i := range o.runs {
		if r := &o.runs[i]; r.err == nil && r.tr.GrowthNote != "" {
			fmt.Fprintf(&b, "  ! %s: %s\n", r.c.ID, r.tr.GrowthNote)
		}
	}
	fmt.Fprintf(&b, "\nConstants (every one settable; the status says how sure it is)\n")
	ct := report.Table{Indent: "  ", Wrap: []bool{false, false, true}}
	for _, c := range o.set.Constants() {
		val := c.Text
		if val == "" {
			val = quantity.FormatSig(c.Value, 3)
		}
		if c.Key == "disable" && c.Text == "none" {
			continue // only for limits and tests
		}
		ct.Row(c.Symbol, val, c.Status)
	}
	b.WriteString(ct.String())
	fmt.Fprintf(&b, "\nentrained: first |Δv| ≤ 0.1 v_w; doubled: m = 2 m0; destroyed: m < 10⁻³ m0 (the run stops). Times in t_cc of the initial cloud.\n")
	return writeTrimmed(w, b.String())
}
