package cli

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/internal/scenario"
	"cloudwind/model"
)

const outflowSynopsis = `Usage: cloudwind outflow [wind flags] [cloud flags] [--r-min X --r-max X --points N] [--carry [carry flags]] [--format text|csv|ecsv|json] [-o FILE]

Evaluate every criterion along a galactic outflow: the steady adiabatic wind
of Chevalier & Clegg 1985, with energy and mass injected uniformly inside a
radius R (give the star-formation rate with energy and mass loadings, or the
rates Ė and Ṁ). At each radius of a log grid a cloud of radius r_cl in
pressure equilibrium sees the local χ = T_wind/T_cl, Mach number and
pressure; every criterion gives its threshold radius and verdict there, and
the output says where along the wind the cloud survives and where the
criteria disagree. With --carry the cloud is launched at --launch-radius and
carried outward by the evolve model with the wind's state at its current
radius: its mass and speed against r, where it is entrained, doubled or
destroyed, and how constant its growth rate is (Gronke & Oh 2020 state it is
constant in such a wind). Assumed: adiabatic, spherical, steady, no gravity,
clouds in pressure equilibrium; the cautions say where these fail.`

const outflowExamples = `  cloudwind outflow --sfr 20 --energy-loading 0.6 --mass-loading 0.5 --injection-radius 200pc
  cloudwind outflow --edot 3e42 --mdot 2 --radius 10pc --format csv -o profile.csv
  cloudwind outflow --scenario saved.toml --carry --launch-radius 1 --format json
  cloudwind outflow --carry --criterion gronke-oh-2018 --launch-speed 100km/s --end-radius 50`

// outflowFlags are the outflow command's own flags; the cloud and the
// conventions are scenario flags (without --chi, --mach, --pressure).
type outflowFlags struct {
	sfr, eLoad, mLoad, edot, mdot, injR string
	rMin, rMax                          string
	points                              int
	carry                               bool
	launchR, launchV, endR, coldRate    string
	samples                             int
	criterion, format, out              string
	ef                                  evolveFlags
}

// The flags outflow does not take from the scenario flags: the wind sets them.
var outflowSkipped = []string{"chi", "mach", "pressure", "mach-turb", "mu-cloud", "mu-hot"}

func (o *outflowFlags) register(f *flagSet) {
	fw := model.FiducialWind()
	g := func(v float64) string { return model.FormatNumber(v, 6) }
	f.fs.StringVar(&o.sfr, "sfr", g(float64(fw.SFR/model.SolarMassPerYear)), "star-formation rate in M☉/yr (or with a unit: \"0.3 g/s\"); with the loadings")
	f.fs.StringVar(&o.eLoad, "energy-loading", g(fw.EnergyLoading), "α in Ė = α · 3×10⁴¹ erg/s per M☉/yr of star formation (from memory)")
	f.fs.StringVar(&o.mLoad, "mass-loading", g(fw.MassLoading), "β in Ṁ = β · SFR")
	f.fs.StringVar(&o.edot, "edot", "", "energy injection rate Ė in erg/s, instead of --sfr and the loadings; with --mdot")
	f.fs.StringVar(&o.mdot, "mdot", "", "mass injection rate Ṁ in M☉/yr (or \"g/s\"); with --edot")
	f.fs.StringVar(&o.injR, "injection-radius", g(float64(fw.Radius/model.Parsec))+" pc", "radius R inside which energy and mass are injected")
	f.fs.StringVar(&o.rMin, "r-min", g(model.DefaultProfileMin), "innermost radius of the grid: a multiple of R, or a length (\"30pc\")")
	f.fs.StringVar(&o.rMax, "r-max", g(model.DefaultProfileMax), "outermost radius of the grid: a multiple of R, or a length (\"30kpc\")")
	f.int(&o.points, "points", model.DefaultProfilePoints, 2, 100000, "radii of the log grid (text shows 16 unless given)")
	f.fs.BoolVar(&o.carry, "carry", false, "carry a cloud outward from --launch-radius (csv and ecsv then hold its path)")
	f.fs.StringVar(&o.launchR, "launch-radius", "1", "where the carried cloud starts: a multiple of R, or a length")
	f.fs.StringVar(&o.launchV, "launch-speed", "0", "its speed at launch in km/s, in the galaxy's frame")
	f.fs.StringVar(&o.endR, "end-radius", g(model.DefaultCarryEnd), "where the carried run stops: a multiple of R, or a length")
	f.fs.StringVar(&o.coldRate, "cold-rate", "", "the cold mass a steady stream of such clouds launches per unit time, in M☉/yr: the flux at the end is this × m/m0")
	f.int(&o.samples, "samples", 101, 2, 100000, "radii of the carried path in csv, ecsv and json, evenly in log r")
	f.fs.StringVar(&o.criterion, "criterion", "all", "the criterion whose branch the carried cloud follows: an id, or all")
	f.fs.StringVar(&o.format, "format", "text", "output format: text, csv, ecsv or json (-o FILE.csv, .ecsv or .json sets it too)")
	f.fs.StringVar(&o.out, "o", "", "write to FILE (atomically) instead of stdout")
	o.ef.registerModel(f)
}

// windFlagName maps a model.Field… of the wind to its flag.
func windFlagName(field string) string {
	switch field {
	case model.FieldSFR:
		return "--sfr"
	case model.FieldEnergyLoading:
		return "--energy-loading"
	case model.FieldMassLoading:
		return "--mass-loading"
	case model.FieldEnergyRate:
		return "--edot"
	case model.FieldMassRate:
		return "--mdot"
	case model.FieldWindRadius:
		return "--injection-radius"
	}
	return flagForField(field)
}

// windValue parses the value of a wind flag with its unit and checks it.
func windValue(flag, field string, k quantity.Kind, raw string) (float64, error) {
	v, err := quantity.ParseValue(k, raw)
	if err != nil {
		return 0, usagef("--%s: %v", flag, err)
	}
	if err := model.CheckWindField(field, v); err != nil {
		var fe *model.FieldError
		if errors.As(err, &fe) {
			return 0, usagef("--%s: %s", flag, fe.Reason)
		}
		return 0, usagef("--%s: %v", flag, err)
	}
	return v, nil
}

// wind builds the outflow's inputs: the --scenario file's [outflow] (or
// the fiducial outflow), the flags given over it, and the cloud's T_cl, Z
// and conventions from the scenario flags.
func (o *outflowFlags) wind(f *flagSet, sf *scenarioFlags) (model.WindParams, model.Length, error) {
	p, err := sf.parse()
	if err != nil {
		return model.WindParams{}, 0, err
	}
	if p.TCloud == 0 {
		p.TCloud = model.Fiducial().TCloud
	}
	if p.RCloud == 0 {
		p.RCloud = model.Parsec
	}
	if err := model.CheckField(model.FieldRCloud, float64(p.RCloud)); err != nil {
		return model.WindParams{}, 0, fieldUsage(err)
	}
	fw := model.FiducialWind()
	inj := scenario.Outflow{SFR: fw.SFR, EnergyLoading: fw.EnergyLoading, MassLoading: fw.MassLoading, Radius: fw.Radius}
	if sf.base != nil && sf.base.Outflow != nil {
		inj = *sf.base.Outflow
	}
	rateGiven := f.set("edot") || f.set("mdot")
	sfrGiven := f.set("sfr") || f.set("energy-loading") || f.set("mass-loading")
	switch {
	case rateGiven && sfrGiven:
		return model.WindParams{}, 0, usagef("give --edot and --mdot, or --sfr with --energy-loading and --mass-loading, not both")
	case rateGiven:
		if inj.SFR != 0 {
			inj = scenario.Outflow{Radius: inj.Radius}
		}
		if f.set("edot") {
			v, err := windValue("edot", model.FieldEnergyRate, model.DimPower, o.edot)
			if err != nil {
				return model.WindParams{}, 0, err
			}
			inj.EnergyRate = model.Power(v)
		}
		if f.set("mdot") {
			v, err := windValue("mdot", model.FieldMassRate, model.DimMassRate, o.mdot)
			if err != nil {
				return model.WindParams{}, 0, err
			}
			inj.MassRate = model.MassRate(v)
		}
		if inj.EnergyRate == 0 {
			return model.WindParams{}, 0, usagef("--mdot needs --edot: the energy injection rate in erg/s")
		}
		if inj.MassRate == 0 {
			return model.WindParams{}, 0, usagef("--edot needs --mdot: the mass injection rate in M☉/yr")
		}
	case sfrGiven:
		if inj.SFR == 0 {
			inj = scenario.Outflow{SFR: fw.SFR, EnergyLoading: fw.EnergyLoading, MassLoading: fw.MassLoading, Radius: inj.Radius}
		}
		for _, c := range []struct {
			flag, field, raw string
			k                quantity.Kind
			dst              *float64
		}{{"sfr", model.FieldSFR, o.sfr, model.DimMassRate, (*float64)(&inj.SFR)},
			{"energy-loading", model.FieldEnergyLoading, o.eLoad, model.Dimensionless, &inj.EnergyLoading},
			{"mass-loading", model.FieldMassLoading, o.mLoad, model.Dimensionless, &inj.MassLoading}} {
			if !f.set(c.flag) {
				continue
			}
			v, err := windValue(c.flag, c.field, c.k, c.raw)
			if err != nil {
				return model.WindParams{}, 0, err
			}
			*c.dst = v
		}
	}
	if f.set("injection-radius") {
		v, err := windValue("injection-radius", model.FieldWindRadius, model.DimLength, o.injR)
		if err != nil {
			return model.WindParams{}, 0, err
		}
		inj.Radius = model.Length(v)
	}
	sc := scenario.Scenario{Params: p, Outflow: &inj}
	wp, _ := sc.Wind()
	if err := wp.Validate(); err != nil {
		var fe *model.FieldError
		if errors.As(err, &fe) {
			if errors.Is(err, model.ErrConflict) {
				return wp, 0, usagef("%s", fe.Reason)
			}
			return wp, 0, usagef("%s: %s", windFlagName(fe.Field), fe.Reason)
		}
		return wp, 0, usagef("%v", err)
	}
	return wp, p.RCloud, nil
}

// radiusValue parses a radius flag: a plain number is a multiple of R,
// anything with a unit a length.
func radiusValue(flag, raw string, bigR model.Length) (model.Length, error) {
	t := strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(raw), "R"))
	if v, n, err := model.ScanNumber(t); err == nil && n == len(t) {
		r := v * float64(bigR)
		if !(v > 0) || math.IsInf(r, 0) {
			return 0, usagef("--%s: must be a positive multiple of R (got %s)", flag, sanitizeArg(raw))
		}
		return model.Length(r), nil
	}
	v, err := quantity.ParseValue(model.DimLength, raw)
	if err != nil {
		return 0, usagef("--%s: want a multiple of R (\"0.5\") or a length (\"150pc\"): %v", flag, err)
	}
	if !(v > 0) {
		return 0, usagef("--%s: must be a positive length (got %s)", flag, sanitizeArg(raw))
	}
	return model.Length(v), nil
}

// outflowRun is everything the outflow command computed.
type outflowRun struct {
	wind    model.Wind
	prof    model.WindProfile
	cooling string
	carry   bool
	set     model.CarrySettings // as given (zero fields: defaults)
	carried []carriedRun
	samples int
	cold    model.MassRate // --cold-rate, 0 when not given
}

// carriedRun is one criterion's carried cloud.
type carriedRun struct {
	c      model.Criterion
	cc     model.CarriedCloud
	spread model.GrowthRateSpread
	grows  bool // spread was measured over a growing stretch
	err    error
}

func runOutflow(e *env) error {
	f := newFlagSet("outflow", outflowSynopsis, outflowExamples)
	var sf scenarioFlags
	sf.registerExcept(f, outflowSkipped...)
	var o outflowFlags
	o.register(f)
	if err := f.parse(e); err != nil {
		return err
	}
	if !o.carry {
		for _, name := range []string{"launch-radius", "launch-speed", "end-radius", "cold-rate", "samples", "criterion",
			"branch", "width", "alpha-v", "area-factor", "kappa", "drag-coefficient", "va-over-vw", "mach-factor", "rtol"} {
			if f.set(name) {
				return usagef("--%s applies to the carried cloud: add --carry", name)
			}
		}
	}
	format, err := formatFor(o.format, f.set("format"), o.out, "text", "text", "csv", "ecsv", "json")
	if err != nil {
		return err
	}
	if err := checkFormat(format, "text", "csv", "ecsv", "json"); err != nil {
		return err
	}
	target, err := checkOutput(o.out)
	if err != nil {
		return err
	}
	if err := sf.load(e); err != nil {
		return err
	}
	wp, rCl, err := o.wind(f, &sf)
	if err != nil {
		return err
	}
	w, err := model.NewWind(wp)
	if err != nil {
		return err
	}
	bigR := w.Params.Radius
	var grid model.ProfileGrid
	if grid.RMin, err = radiusValue("r-min", o.rMin, bigR); err != nil {
		return err
	}
	if grid.RMax, err = radiusValue("r-max", o.rMax, bigR); err != nil {
		return err
	}
	if !(grid.RMax > grid.RMin) {
		return usagef("--r-max (%s) must be beyond --r-min (%s)", quantity.Format(model.DimLength, float64(grid.RMax)), quantity.Format(model.DimLength, float64(grid.RMin)))
	}
	grid.Points = o.points
	if format == "text" && !f.set("points") {
		grid.Points = 16
	}
	src, err := sf.source(e)
	if err != nil {
		return err
	}
	cf, err := src.Function(wp.Metallicity)
	if err != nil {
		return usagef("--metallicity: %v", err)
	}
	cs, err := loadCriteria(e, sf.criteria)
	if err != nil {
		return err
	}
	run := outflowRun{wind: w, cooling: report.CoolingName(src, cf), carry: o.carry, samples: o.samples}
	if run.prof, err = w.Profile(rCl, cf, cs, grid); err != nil {
		return err
	}
	if o.carry {
		if err := o.runCarry(&run, cf, cs); err != nil {
			return err
		}
	}
	write := func(out io.Writer) error {
		switch format {
		case "csv", "ecsv":
			return run.writeDelimited(out, format == "ecsv")
		case "json":
			return run.writeJSON(out)
		}
		return run.writeText(out)
	}
	if target == nil {
		return write(e.stdout)
	}
	return target.Write(write)
}

// runCarry reads the carry flags and carries the cloud for each criterion.
func (o *outflowFlags) runCarry(run *outflowRun, cf model.CoolingFunction, cs []model.Criterion) error {
	w := &run.wind
	bigR := w.Params.Radius
	ode, err := o.ef.settings()
	if err != nil {
		return err
	}
	set := model.CarrySettings{ODE: ode}
	if set.R0, err = radiusValue("launch-radius", o.launchR, bigR); err != nil {
		return err
	}
	if set.REnd, err = radiusValue("end-radius", o.endR, bigR); err != nil {
		return err
	}
	v0, err := quantity.ParseValue(model.DimVelocity, o.launchV)
	if err != nil {
		return usagef("--launch-speed: %v", err)
	}
	set.V0 = model.Velocity(v0)
	if err := set.Validate(w); err != nil {
		var fe *model.FieldError
		if errors.As(err, &fe) {
			name := map[string]string{model.FieldLaunchRadius: "launch-radius", model.FieldLaunchSpeed: "launch-speed", model.FieldEndRadius: "end-radius"}[fe.Field]
			if name == "" {
				name = evolveFlagName(fe.Field)
			}
			return usagef("--%s: %s", name, fe.Reason)
		}
		return usagef("%v", err)
	}
	if o.coldRate != "" {
		v, err := quantity.ParseValue(model.DimMassRate, o.coldRate)
		if err != nil {
			return usagef("--cold-rate: %v", err)
		}
		if !(v > 0) {
			return usagef("--cold-rate: must be a positive mass rate (got %s)", sanitizeArg(o.coldRate))
		}
		run.cold = model.MassRate(v)
	}
	sel, err := selectCriteria(cs, o.criterion)
	if err != nil {
		return err
	}
	run.set = set
	for i := range sel {
		cr := carriedRun{c: sel[i]}
		cr.cc, cr.err = w.Carry(run.prof.RCloud, cf, &sel[i], set)
		if cr.err == nil {
			if lo, hi, ok := cr.cc.GrowingPath(); ok {
				if g, err := cr.cc.GrowthSpread(lo, hi); err == nil {
					cr.spread, cr.grows = g, true
				}
			}
		}
		run.carried = append(run.carried, cr)
	}
	return nil
}

// profileFields returns the columns of the profile.
func (r *outflowRun) profileFields() []report.ProfileField {
	return report.ProfileFields(&r.wind, r.prof.Criteria)
}

// writeDelimited writes the profile, or with --carry the carried paths, as
// CSV or ECSV.
func (r *outflowRun) writeDelimited(w io.Writer, ecsv bool) error {
	sep := byte(',')
	if ecsv {
		sep = ' '
	}
	bools := [2]string{"false", "true"}
	if ecsv {
		bools = [2]string{"False", "True"} // astropy's ECSV booleans
	}
	var b []byte
	var cols []report.Column
	if !r.carry {
		fs := r.profileFields()
		for _, f := range fs {
			cols = append(cols, f.Column)
		}
		for j := range r.prof.Rows {
			row := &r.prof.Rows[j]
			for i, f := range fs {
				if i > 0 {
					b = append(b, sep)
				}
				switch {
				case f.IsBool:
					b = append(b, bools[b2i(f.Flag(row))]...)
				case f.IsString:
					b = append(b, f.Text(row)...)
				default:
					b = report.AppendNumber(b, f.Value(row), false)
				}
			}
			b = append(b, '\n')
		}
	} else {
		cols = append(cols, report.Column{Name: "criterion", IsString: true, Description: "criterion whose branch the cloud follows"})
		fs := report.CarriedFields(r.wind.Params.Radius, r.launchMass())
		for _, f := range fs {
			cols = append(cols, f.Column)
		}
		for i := range r.carried {
			cr := &r.carried[i]
			if cr.err != nil {
				continue
			}
			for _, p := range report.CarriedSamples(&cr.cc, r.samples) {
				b = append(b, cr.c.ID...)
				for _, f := range fs {
					b = append(b, sep)
					b = report.AppendNumber(b, f.Value(&p), false)
				}
				b = append(b, '\n')
			}
		}
	}
	var err error
	if ecsv {
		err = report.ECSVHeader(w, cols, r.meta())
	} else {
		err = report.CSVHeader(w, cols, nil)
	}
	if err != nil {
		return err
	}
	_, err = w.Write(b)
	return err
}

func b2i(v bool) int {
	if v {
		return 1
	}
	return 0
}

// launchMass is the carried cloud's launch mass (the same for every
// criterion: it depends only on r_cl and the pressure at launch).
func (r *outflowRun) launchMass() model.Mass {
	for i := range r.carried {
		if r.carried[i].err == nil {
			return r.carried[i].cc.M0
		}
	}
	return 0
}

// meta describes the run for ECSV and JSON.
func (r *outflowRun) meta() []report.Meta {
	m := report.OutflowMeta(&r.wind, r.prof.RCloud, r.cooling, "cloudwind "+versionString())
	g := r.prof.Grid
	bigR := float64(r.wind.Params.Radius)
	m = append(m, report.KV("grid", []report.Meta{report.KV("r_min_over_R", float64(g.RMin)/bigR), report.KV("r_max_over_R", float64(g.RMax)/bigR), report.KV("points", g.Points)}))
	var rc any
	if r.prof.Cools {
		rc = float64(r.prof.RCool) / bigR
	}
	m = append(m, report.KV("r_wind_cools_over_R", rc))
	var cau []any
	for _, c := range report.OutflowCautions(&r.wind, &r.prof) {
		cau = append(cau, c)
	}
	m = append(m, report.KV("cautions", cau))
	if r.carry {
		q := r.set.WithDefaults(&r.wind)
		settings := []report.Meta{report.KV("launch_radius_over_R", float64(q.R0)/bigR),
			report.KV("launch_speed_kms", quantity.Convert(model.DimVelocity, float64(q.V0))),
			report.KV("end_radius_over_R", float64(q.REnd)/bigR), report.KV("branch", q.ODE.Branch.String()), report.KV("rel_tol", q.ODE.RelTol)}
		for _, c := range q.ODE.Constants() {
			if c.Text == "" {
				settings = append(settings, report.KV(c.Key, c.Value))
			}
		}
		m = append(m, report.KV("carry", settings))
		var summ []any
		for i := range r.carried {
			summ = append(summ, r.carriedSummary(&r.carried[i]))
		}
		m = append(m, report.KV("carried", summ))
	}
	return m
}

// carriedSummary describes one carried run: its fate, events and the
// constancy of its growth rate.
func (r *outflowRun) carriedSummary(cr *carriedRun) []report.Meta {
	item := []report.Meta{report.KV("criterion", cr.c.ID)}
	if cr.err != nil {
		return append(item, report.KV("error", cr.err.Error()))
	}
	cc := &cr.cc
	bigR := float64(r.wind.Params.Radius)
	inR := func(x model.Length) any { return report.JSONNumber(float64(x) / bigR) }
	myr := func(t model.Time) any { return report.JSONNumber(quantity.Convert(model.DimTime, float64(t))) }
	n := len(cc.R) - 1
	item = append(item,
		report.KV("stop", cc.Stop.String()),
		report.KV("r_stop_over_R", inR(cc.RStop)),
		report.KV("r_entrain_over_R", inR(cc.REntrain)), report.KV("t_entrain_myr", myr(cc.TEntrain)),
		report.KV("r_double_over_R", inR(cc.RDouble)), report.KV("t_double_myr", myr(cc.TDouble)),
		report.KV("r_destroy_over_R", inR(cc.RDestroy)), report.KV("t_destroy_myr", myr(cc.TDestroy)),
		report.KV("m_end_m0", cc.M[n]),
		report.KV("v_end_kms", quantity.Convert(model.DimVelocity, float64(cc.V[n]))),
		report.KV("mass0_msun", quantity.Convert(model.DimMass, float64(cc.M0))),
		report.KV("t_cc0_myr", myr(cc.TCC0)),
		report.KV("steps", cc.Steps))
	if r.cold > 0 {
		item = append(item, report.KV("cold_rate_launch_msunyr", quantity.Convert(model.DimMassRate, float64(r.cold))),
			report.KV("cold_rate_end_msunyr", quantity.Convert(model.DimMassRate, float64(r.cold)*cc.M[n])))
	}
	var wc any
	if cc.WindCools {
		wc = float64(cc.RWindCools) / bigR
	}
	item = append(item, report.KV("r_wind_cools_over_R", wc))
	if cr.grows {
		g := cr.spread
		item = append(item, report.KV("growth_rate", []report.Meta{
			report.KV("r_lo_over_R", float64(g.RLo)/bigR), report.KV("r_hi_over_R", float64(g.RHi)/bigR),
			report.KV("mean_msunyr", quantity.Convert(model.DimMassRate, float64(g.Mean))),
			report.KV("spread", report.JSONNumber(g.Spread)), report.KV("slope_dlnmdot_dlnr", report.JSONNumber(g.SlopeR)),
			report.KV("growing", g.Growing)}))
	} else {
		item = append(item, report.KV("growth_rate", nil))
	}
	return item
}

// writeJSON writes the whole run as one document: metadata, the spans
// where each criterion lets the cloud survive, the profile rows and, with
// --carry, each carried path.
func (r *outflowRun) writeJSON(w io.Writer) error {
	fs := r.profileFields()
	rows := make([]report.OrderedJSON, len(r.prof.Rows))
	for j := range r.prof.Rows {
		row := &r.prof.Rows[j]
		obj := make(report.OrderedJSON, len(fs))
		for i, f := range fs {
			var v any
			switch {
			case f.IsBool:
				v = f.Flag(row)
			case f.IsString:
				v = f.Text(row)
			default:
				v = f.Value(row)
			}
			obj[i] = report.KV(f.Name, v)
		}
		rows[j] = obj
	}
	bigR := r.wind.Params.Radius
	spanJSON := func(ss []report.Span) [][2]float64 {
		out := [][2]float64{}
		for _, s := range ss {
			out = append(out, [2]float64{float64(s.Lo / bigR), float64(s.Hi / bigR)})
		}
		return out
	}
	var crit []report.OrderedJSON
	for i := range r.prof.Criteria {
		c := &r.prof.Criteria[i]
		ss := report.SurvivalSpans(&r.prof, i)
		crit = append(crit, report.OrderedJSON{report.KV("id", c.ID), report.KV("label", c.Label), report.KV("formula", c.Formula()),
			report.KV("verified", c.Verified), report.KV("status", c.Status),
			report.KV("survives_over_R", spanJSON(ss)), report.KV("survives", report.SpansText(&r.prof, ss, bigR))})
	}
	doc := report.OrderedJSON{
		report.KV("schema", report.OutflowSchema),
		report.KV("meta", r.meta()),
		report.KV("criteria", crit),
		report.KV("disagree_over_R", spanJSON(report.DisagreementSpans(&r.prof))),
		report.KV("rows", rows),
	}
	if r.carry {
		cf := report.CarriedFields(bigR, r.launchMass())
		var paths []report.OrderedJSON
		for i := range r.carried {
			cr := &r.carried[i]
			item := report.OrderedJSON(r.carriedSummary(cr))
			if cr.err == nil {
				var pts []report.OrderedJSON
				for _, p := range report.CarriedSamples(&cr.cc, r.samples) {
					obj := make(report.OrderedJSON, len(cf))
					for k, f := range cf {
						obj[k] = report.KV(f.Name, f.Value(&p))
					}
					pts = append(pts, obj)
				}
				item = append(item, report.KV("path", pts))
			}
			paths = append(paths, item)
		}
		doc = append(doc, report.KV("carried", paths))
	}
	return report.WriteJSON(w, doc)
}

// writeText writes the summary for people: the wind, a table along r,
// where each criterion lets the cloud survive, the carried clouds, the
// cautions, the statuses and the assumptions.
func (r *outflowRun) writeText(w io.Writer) error {
	var b strings.Builder
	wd := &r.wind
	q := wd.Params
	bigR := q.Radius
	L := func(x model.Length) string { return quantity.Format(model.DimLength, float64(x)) }
	inR := func(x model.Length) string { return quantity.FormatSig(float64(x/bigR), 3) + " R" }
	fmt.Fprintf(&b, "Outflow: Chevalier & Clegg 1985, adiabatic")
	if q.SFR != 0 {
		fmt.Fprintf(&b, ", from SFR = %s with α = %s, β = %s", quantity.Format(model.DimMassRate, float64(q.SFR)), quantity.FormatSig(q.EnergyLoading, 3), quantity.FormatSig(q.MassLoading, 3))
	}
	fmt.Fprintf(&b, "\n  Ė = %s, Ṁ = %s, R = %s, v_∞ = %s\n", quantity.Format(model.DimPower, float64(wd.EnergyRate)), quantity.Format(model.DimMassRate, float64(wd.MassRate)),
		L(bigR), quantity.Format(model.DimVelocity, float64(wd.VInf)))
	fmt.Fprintf(&b, "  T(0) = %s, T(R) = %s; the wind is as cold as the cloud (χ = 1) at %s\n", quantity.Format(model.DimTemperature, float64(wd.TCentre)),
		quantity.Format(model.DimTemperature, float64(wd.TAtR)), inR(wd.RChiOne))
	fmt.Fprintf(&b, "Cloud: r_cl = %s, T_cl = %s, Z = %s\nCooling: %s\n\n", L(r.prof.RCloud), quantity.Format(model.DimTemperature, float64(q.TCloud)),
		quantity.Format(model.DimMetallicity, q.Metallicity), r.cooling)

	radiative := 0
	for i := range r.prof.Criteria {
		if r.prof.Criteria[i].Cool != model.CoolNone {
			radiative++
		}
	}
	t := report.Table{Indent: "  "}
	t.Row("r/R", "r (pc)", "χ", "M", "P/k_B (K cm⁻³)", "t_cool/t_flow", "survive", "r_crit (pc) from–to", "")
	pc := func(x float64) string { return quantity.FormatSig(x/float64(model.Parsec), 3) }
	for j := range r.prof.Rows {
		row := &r.prof.Rows[j]
		pt := &row.Wind
		cool := quantity.FormatSig(float64(row.TCool/pt.TFlow), 3)
		if !row.Adiabatic {
			cool += " !"
		}
		surv, rng, mark := "—", "no cloud: χ ≤ 1", ""
		if row.Err == nil {
			n, lo, hi := 0, math.Inf(1), math.Inf(-1)
			for i, c := range r.prof.Criteria {
				if c.Cool == model.CoolNone {
					continue
				}
				oc := &row.Outcomes[i]
				if oc.Verdict == model.Survives {
					n++
				}
				if oc.HasThreshold() {
					lo, hi = min(lo, float64(oc.RCrit)), max(hi, float64(oc.RCrit))
				}
			}
			surv = fmt.Sprintf("%d of %d", n, radiative)
			rng = "—"
			if lo <= hi {
				rng = pc(lo) + "–" + pc(hi)
			}
			if row.Disagree {
				mark = "≠"
			}
		}
		t.Row(quantity.FormatSig(float64(pt.R/bigR), 3), pc(float64(pt.R)), quantity.FormatSig(pt.Chi, 3), quantity.FormatSig(pt.Mach, 3),
			quantity.FormatSig(float64(pt.Pressure), 3), cool, surv, rng, mark)
	}
	b.WriteString(t.String())
	fmt.Fprintf(&b, "  survive: how many criteria with cooling say the cloud survives and grows; ≠ they disagree;\n  ! the wind cools within a flow time: the adiabatic solution fails\n\n")

	fmt.Fprintf(&b, "Where a %s cloud survives and grows, by criterion:\n", L(r.prof.RCloud))
	st := report.Table{Indent: "  ", Wrap: []bool{false, true}}
	for i := range r.prof.Criteria {
		c := &r.prof.Criteria[i]
		if c.Cool == model.CoolNone {
			continue
		}
		mark := ""
		if !c.Verified {
			mark = " *"
		}
		st.Row(quantity.Sanitize(c.ID)+mark, report.SpansText(&r.prof, report.SurvivalSpans(&r.prof, i), bigR))
	}
	b.WriteString(st.String())
	if ds := report.DisagreementSpans(&r.prof); len(ds) > 0 {
		fmt.Fprintf(&b, "  The criteria disagree at %s.\n", report.SpansText(&r.prof, ds, bigR))
	} else {
		fmt.Fprintf(&b, "  The criteria agree at every radius of the grid.\n")
	}
	b.WriteString("  * a constant not verified against the paper ('cloudwind eval' shows each status)\n")

	if r.carry {
		q := r.set.WithDefaults(wd)
		fmt.Fprintf(&b, "\nCarried cloud: launched at %s (%s) at %s, run to %s; branch %s\n", inR(q.R0), L(q.R0),
			quantity.Format(model.DimVelocity, float64(q.V0)), inR(q.REnd), q.ODE.Branch)
		ct := report.Table{Indent: "  "}
		ct.Row("criterion", "fate", "entrained", "doubled", "end m/m0", "end v (km s⁻¹)")
		var growth []string
		for i := range r.carried {
			cr := &r.carried[i]
			id := quantity.Sanitize(cr.c.ID)
			if cr.err != nil {
				ct.Row(id, "error: "+cr.err.Error())
				continue
			}
			cc := &cr.cc
			at := func(x model.Length) string {
				if math.IsNaN(float64(x)) {
					return "—"
				}
				return inR(x)
			}
			fate := map[model.CarryStop]string{model.StopReached: "reached " + inR(cc.RStop), model.StopColdWind: "χ = 1 at " + inR(cc.RStop),
				model.StopDestroyed: "destroyed at " + at(cc.RDestroy), model.StopMassCap: "mass cap at " + inR(cc.RStop), model.StopTime: "time cap at " + inR(cc.RStop)}[cc.Stop]
			n := len(cc.M) - 1
			ct.Row(id, fate, at(cc.REntrain), at(cc.RDouble), quantity.FormatSig(cc.M[n], 3),
				quantity.FormatSig(quantity.Convert(model.DimVelocity, float64(cc.V[n])), 4))
			if cr.grows {
				g := cr.spread
				growth = append(growth, fmt.Sprintf("%s: %s on average over %s–%s; spread %s, d ln ṁ/d ln r = %s", id, quantity.Format(model.DimMassRate, float64(g.Mean)),
					quantity.FormatSig(float64(g.RLo/bigR), 2), inR(g.RHi), pct(g.Spread), quantity.FormatSig(g.SlopeR, 2)))
			} else {
				growth = append(growth, id+": does not grow")
			}
		}
		b.WriteString(ct.String())
		if m0 := r.launchMass(); m0 > 0 {
			fmt.Fprintf(&b, "  m0 = %s. A steady stream of such clouds carries a cold mass flux ∝ m/m0 (end m/m0 above)", quantity.Format(model.DimMass, float64(m0)))
			if r.cold > 0 {
				fmt.Fprintf(&b, "; %s launched", quantity.Format(model.DimMassRate, float64(r.cold)))
			}
			b.WriteString(".\n")
		}
		b.WriteString("\n  The growth rate dm/dt over the stretch where the cloud grows. Gronke & Oh 2020 state that in\n  such a wind it is constant: spread = (max − min)/mean, 0 when it is.\n")
		for _, g := range growth {
			for _, l := range report.Wrap(g, report.TextWidth, "  ", "      ") {
				b.WriteString(l + "\n")
			}
		}
	}

	if cau := report.OutflowCautions(wd, &r.prof); len(cau) > 0 {
		b.WriteString("\nCautions\n")
		for _, c := range cau {
			for _, l := range report.Wrap(c, report.TextWidth, "  ! ", "    ") {
				b.WriteString(l + "\n")
			}
		}
	}
	b.WriteString("\nStatus\n")
	for _, s := range []string{model.WindStatus, model.WindLoadingStatus} {
		for _, l := range report.Wrap(s, report.TextWidth, "  * ", "    ") {
			b.WriteString(l + "\n")
		}
	}
	b.WriteString("\nAssumptions\n")
	for _, a := range model.WindAssumptions() {
		for _, l := range report.Wrap(a, report.TextWidth, "  - ", "    ") {
			b.WriteString(l + "\n")
		}
	}
	return writeTrimmed(w, b.String())
}

// pct writes a fraction as a percentage with two significant figures.
func pct(x float64) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return "—"
	}
	return quantity.FormatSig(100*x, 2) + "%"
}
