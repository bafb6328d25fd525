package cli

import (
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"cloudwind/internal/report"

	"cloudwind/cooling"
	"cloudwind/internal/quantity"
	"cloudwind/model"
)

const coolingSynopsis = `Usage: cloudwind cooling [flags]

Sample a cooling function Λ(T) per n_H² on temperatures evenly spaced in
log T, and compare it with a second one. The output says where each value
comes from: the table itself, the T^1/2 extension above it, or nothing
below it (Λ = 0).`

const coolingExamples = `  cloudwind cooling
  cloudwind cooling --metallicity 0.3 --vs rosen-bregman-1995 --format csv
  cloudwind cooling --cooling m-00.cie --table 'skip: 4' --table 'norm: nH2' \
      --table 'columns: T=1 lambda=5' --vs builtin
  cloudwind cooling --tmin 1e4 --tmax 1e9 --points 101 --format json`

// coolingPoint is one sampled temperature.
type coolingPoint struct {
	t                model.Temperature
	lambda, lambdaVs float64
	neOverNH         float64 // NaN when not known
	status, statusVs cooling.RangeStatus
}

func runCooling(e *env) error {
	f := newFlagSet("cooling", coolingSynopsis, coolingExamples)
	var spec, vsSpec, format, metal, tmin, tmax string
	var table, vsTable tableSettings
	var points int
	registerCoolingFlags(f, &spec, &table, "cooling", "table")
	f.fs.StringVar(&vsSpec, "vs", "", "a second cooling function to compare (same forms as --cooling)")
	f.fs.Var(&vsTable, "vs-table", "how to read a table given to --vs (as --table)")
	f.fs.StringVar(&metal, "metallicity", "1", "metallicity Z in solar units, for functions that depend on it")
	f.fs.StringVar(&tmin, "tmin", "1e4", "lowest temperature in K (or \"1 keV\")")
	f.fs.StringVar(&tmax, "tmax", "1e8", "highest temperature in K")
	f.int(&points, "points", 41, 2, 100000, "number of temperatures, evenly spaced in log T (2–100000)")
	f.fs.StringVar(&format, "format", "text", "output format: text, csv or json")
	if err := f.parse(e); err != nil {
		return err
	}
	z, err := quantity.ParseValue(model.DimMetallicity, metal)
	if err != nil || z < 0 {
		if err == nil {
			err = fmt.Errorf("must be at least 0 (got %s)", model.FormatNumber(z, 6))
		}
		return usagef("--metallicity: %v", err)
	}
	lo, err := quantity.ParseValue(model.DimTemperature, tmin)
	if err != nil || lo <= 0 {
		return usagef("--tmin: %v", errOrPositive(err, lo))
	}
	hi, err := quantity.ParseValue(model.DimTemperature, tmax)
	if err != nil || hi <= 0 {
		return usagef("--tmax: %v", errOrPositive(err, hi))
	}
	if !(hi > lo) {
		return usagef("--tmax (%g K) must be above --tmin (%g K)", hi, lo)
	}
	if format != "text" && format != "csv" && format != "json" {
		return usagef("--format: want text, csv or json (got %q)", sanitizeArg(format))
	}
	if spec == "-" && vsSpec == "-" {
		return usagef("--cooling and --vs cannot both read standard input")
	}
	src, err := resolveCooling(e, "--cooling", spec, table)
	if err != nil {
		return err
	}
	cf, err := src.Function(z)
	if err != nil {
		return usagef("--metallicity: %v", err)
	}
	var vs *coolingSource
	var vf model.CoolingFunction
	if vsSpec != "" {
		if vs, err = resolveCooling(e, "--vs", vsSpec, vsTable); err != nil {
			return err
		}
		if vf, err = vs.Function(z); err != nil {
			return usagef("--metallicity (for --vs): %v", err)
		}
	} else if len(vsTable) > 0 {
		return usagef("--vs-table needs --vs")
	}
	pts := make([]coolingPoint, points)
	a, b := math.Log10(lo), math.Log10(hi)
	for i := range pts {
		t := model.Temperature(math.Pow(10, a+(b-a)*float64(i)/float64(points-1)))
		p := coolingPoint{t: t, lambda: float64(cf.Lambda(t)), neOverNH: math.NaN(), lambdaVs: math.NaN()}
		p.status = statusOf(cf, t)
		if src.NeOverNH != nil {
			p.neOverNH = src.NeOverNH(t)
		}
		if vf != nil {
			p.lambdaVs, p.statusVs = float64(vf.Lambda(t)), statusOf(vf, t)
		}
		pts[i] = p
	}
	c := coolingOutput{src: src, cf: cf, vs: vs, vf: vf, z: z, pts: pts}
	switch format {
	case "csv":
		return c.writeCSV(e.stdout)
	case "json":
		return c.writeJSON(e.stdout)
	}
	return c.writeText(e.stdout)
}

func errOrPositive(err error, v float64) error {
	if err != nil {
		return err
	}
	return fmt.Errorf("must be greater than 0 (got %s)", model.FormatNumber(v, 6))
}

// statusOf classifies t against a curve's table, when it has one.
func statusOf(cf model.CoolingFunction, t model.Temperature) cooling.RangeStatus {
	if p, ok := cf.(*cooling.PowerLaw); ok {
		return p.Classify(t)
	}
	return cooling.InTable
}

type coolingOutput struct {
	src, vs *coolingSource
	cf, vf  model.CoolingFunction
	z       float64
	pts     []coolingPoint
}

// ratio returns Λ/Λ_vs, NaN when Λ_vs is 0.
func (p coolingPoint) ratio() float64 {
	if p.lambdaVs > 0 {
		return p.lambda / p.lambdaVs
	}
	return math.NaN()
}

func statusWord(s cooling.RangeStatus) string {
	switch s {
	case cooling.AboveTable:
		return "extended"
	case cooling.BelowTable:
		return "below"
	}
	return "table"
}

// csvNumber writes v in full precision, or "" when it is NaN.
func csvNumber(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return ""
	}
	return strconv.FormatFloat(v, 'g', 10, 64)
}

func (c *coolingOutput) writeCSV(w io.Writer) error {
	cw := csv.NewWriter(w)
	head := []string{"T_K", "lambda_nH2_erg_cm3_s"}
	haveNe := c.src.NeOverNH != nil
	if haveNe {
		head = append(head, "ne_over_nH")
	}
	if c.vf != nil {
		head = append(head, "lambda_vs_nH2_erg_cm3_s", "ratio")
	}
	head = append(head, "status")
	if c.vf != nil {
		head = append(head, "status_vs")
	}
	cw.Write(head)
	for _, p := range c.pts {
		row := []string{csvNumber(float64(p.t)), csvNumber(p.lambda)}
		if haveNe {
			row = append(row, csvNumber(p.neOverNH))
		}
		if c.vf != nil {
			row = append(row, csvNumber(p.lambdaVs), csvNumber(p.ratio()))
		}
		row = append(row, statusWord(p.status))
		if c.vf != nil {
			row = append(row, statusWord(p.statusVs))
		}
		cw.Write(row)
	}
	cw.Flush()
	return cw.Error()
}

func (c *coolingOutput) writeJSON(w io.Writer) error {
	pts := make([]map[string]any, len(c.pts))
	for i, p := range c.pts {
		m := map[string]any{"t_k": float64(p.t), "lambda_nh2": finite(p.lambda), "status": statusWord(p.status)}
		if c.src.NeOverNH != nil {
			m["ne_over_nh"] = finite(p.neOverNH)
		}
		if c.vf != nil {
			m["lambda_vs_nh2"], m["ratio"], m["status_vs"] = finite(p.lambdaVs), finite(p.ratio()), statusWord(p.statusVs)
		}
		pts[i] = m
	}
	doc := map[string]any{
		"schema":           "cloudwind.cooling/1",
		"version":          versionString(),
		"units":            map[string]string{"t_k": "K", "lambda_nh2": "erg cm3 / s (per n_H^2)"},
		"metallicity_zsun": c.z,
		"cooling":          coolingJSON(c.src, c.cf),
		"points":           pts,
	}
	if c.vf != nil {
		doc["vs"] = coolingJSON(c.vs, c.vf)
	}
	return report.WriteJSON(w, doc)
}

func (c *coolingOutput) writeText(w io.Writer) error {
	var b strings.Builder
	describe := func(label string, src *coolingSource, cf model.CoolingFunction) {
		fmt.Fprintf(&b, "%s %s\n", label, coolingName(src, cf))
		p, ok := cf.(*cooling.PowerLaw)
		if !ok {
			fmt.Fprintf(&b, "    analytic; Λ per n_H²\n")
			return
		}
		m := p.Meta()
		lo, hi := p.ValidRange()
		fmt.Fprintf(&b, "    %s\n", quantity.Sanitize(m.Citation))
		fmt.Fprintf(&b, "    source normalisation per %s (stored per n_H²); y = %s; tabulated %s–%s; above: Λ ∝ T^1/2 (extended); below: Λ = 0\n",
			m.Normalisation.Symbol(), quantity.FormatSig(m.HeliumRatio, 3), quantity.Format(model.DimTemperature, float64(lo)), quantity.Format(model.DimTemperature, float64(hi)))
		if m.Historical {
			fmt.Fprintf(&b, "    historical fit, kept for comparison\n")
		}
		for _, cv := range m.Caveats {
			fmt.Fprintf(&b, "    caveat: %s\n", quantity.Sanitize(cv))
		}
		for _, wn := range m.Warnings {
			fmt.Fprintf(&b, "    warning: %s\n", quantity.Sanitize(wn))
		}
	}
	describe("Λ:", c.src, c.cf)
	if c.vf != nil {
		describe("vs:", c.vs, c.vf)
	}
	b.WriteString("\n")
	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	head := "T (K)\tΛ (erg cm³ s⁻¹)\t"
	if c.src.NeOverNH != nil {
		head += "n_e/n_H\t"
	}
	if c.vf != nil {
		head += "Λ_vs\tΛ/Λ_vs\t"
	}
	fmt.Fprintln(tw, head+"note\t")
	for _, p := range c.pts {
		row := quantity.FormatSig(float64(p.t), 3) + "\t" + quantity.FormatSig(p.lambda, 4) + "\t"
		if c.src.NeOverNH != nil {
			row += quantity.FormatSig(p.neOverNH, 4) + "\t"
		}
		note := ""
		if p.status != cooling.InTable {
			note = statusWord(p.status)
		}
		if c.vf != nil {
			row += quantity.FormatSig(p.lambdaVs, 4) + "\t" + quantity.FormatSig(p.ratio(), 3) + "\t"
			if p.statusVs != cooling.InTable {
				note += " vs:" + statusWord(p.statusVs)
			}
		}
		fmt.Fprintln(tw, row+strings.TrimSpace(note)+"\t")
	}
	tw.Flush()
	return writeTrimmed(w, b.String())
}
