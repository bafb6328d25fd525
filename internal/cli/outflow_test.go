package cli

import (
	"encoding/csv"
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"cloudwind/cooling"
	"cloudwind/model"
)

// Tests of cloudwind outflow: the profile in every format against the
// model evaluated independently at each radius, the wind's conservation
// laws read back from the ECSV by astropy, the scenario's [outflow], the
// carried cloud's outputs, and the refusals.

func mustRun(t *testing.T, args ...string) string {
	t.Helper()
	code, out, errs := runCmd(t, "", args...)
	if code != 0 {
		t.Fatalf("cloudwind %s: exit %d: %s", strings.Join(args, " "), code, errs)
	}
	return out
}

// TestOutflowProfileCSV: every CSV row holds the wind at its radius and
// the outcome of model.Evaluate on the wind-tunnel problem there
// (Wind.CloudParams), computed here without the command; the grid is
// log-spaced from --r-min to --r-max. v_∞ in the JSON is (2Ė/Ṁ)^{1/2}
// with Ė = α 3e41 erg/s per M☉/yr (the loading recalled in the model, from
// memory) and Ṁ = β SFR, M☉ = 1.98841e33 g (IAU 2015 nominal GM☉ over
// CODATA 2018 G), yr = 3.15576e7 s (Julian year, IAU).
func TestOutflowProfileCSV(t *testing.T) {
	args := []string{"outflow", "--sfr", "20", "--energy-loading", "0.6", "--mass-loading", "0.5", "--injection-radius", "200pc",
		"--radius", "5pc", "--points", "9", "--r-min", "0.2", "--r-max", "50"}
	out := mustRun(t, append(args, "--format", "csv")...)
	recs, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != 10 {
		t.Fatalf("%d CSV lines, want a header and 9 rows", len(recs))
	}
	col := map[string]int{}
	for i, n := range recs[0] {
		col[n] = i
	}
	wp := model.WindParams{SFR: 20 * model.SolarMassPerYear, EnergyLoading: 0.6, MassLoading: 0.5, Radius: 200 * model.Parsec, TCloud: 1e4, Metallicity: 1}
	w, err := model.NewWind(wp)
	if err != nil {
		t.Fatal(err)
	}
	b, err := cooling.NewBuiltin()
	if err != nil {
		t.Fatal(err)
	}
	cf, err := b.At(1)
	if err != nil {
		t.Fatal(err)
	}
	cs := model.BuiltinCriteria()
	num := func(rec []string, name string) float64 {
		i, ok := col[name]
		if !ok {
			t.Fatalf("no column %q in %v", name, recs[0])
		}
		v, err := strconv.ParseFloat(rec[i], 64)
		if err != nil {
			t.Fatalf("column %s: %v", name, err)
		}
		return v
	}
	for j, rec := range recs[1:] {
		x := num(rec, "r_over_R")
		want := 0.2 * math.Pow(50/0.2, float64(j)/8) // log grid, common practice
		if math.Abs(x/want-1) > 1e-8 {
			t.Errorf("row %d: r/R = %g, want %g", j, x, want)
		}
		r := model.Length(x) * w.Params.Radius
		pt := w.At(r)
		for _, c := range []struct {
			name string
			v    float64
		}{{"chi", pt.Chi}, {"mach", pt.Mach}, {"pressure_kcm3", float64(pt.Pressure)}, {"t_hot_k", float64(pt.T)},
			{"v_wind_kms", float64(pt.V / model.KilometrePerSecond)}} {
			if got := num(rec, c.name); math.Abs(got/c.v-1) > 1e-7 {
				t.Errorf("row %d: %s = %g, want %g", j, c.name, got, c.v)
			}
		}
		p, err := w.CloudParams(r, 5*model.Parsec)
		if err != nil {
			t.Fatal(err)
		}
		res, err := model.Evaluate(p, cf, cs)
		if err != nil {
			t.Fatal(err)
		}
		for i, c := range cs {
			base := strings.ReplaceAll(c.ID, "-", "_")
			if got, want := rec[col[base+"_verdict"]], res.Outcomes[i].Verdict.String(); got != want {
				t.Errorf("row %d %s: verdict %s, want %s", j, c.ID, got, want)
			}
			if rc := float64(res.Outcomes[i].RCrit / model.Parsec); !math.IsInf(rc, 0) {
				if got := num(rec, base+"_radius_crit_pc"); math.Abs(got/rc-1) > 1e-7 {
					t.Errorf("row %d %s: r_crit %g pc, want %g", j, c.ID, got, rc)
				}
			}
		}
	}

	var doc struct {
		Meta struct {
			Wind map[string]float64 `json:"wind"`
		} `json:"meta"`
		Criteria []struct {
			ID       string       `json:"id"`
			Survives [][2]float64 `json:"survives_over_R"`
		} `json:"criteria"`
		Rows []map[string]any `json:"rows"`
	}
	if err := json.Unmarshal([]byte(mustRun(t, append(args, "--format", "json")...)), &doc); err != nil {
		t.Fatal(err)
	}
	msun, yr := 1.98841e33, 3.15576e7
	eDot, mDot := 0.6*3e41*20, 0.5*20*msun/yr
	if got, want := doc.Meta.Wind["v_inf_kms"], math.Sqrt(2*eDot/mDot)/1e5; math.Abs(got/want-1) > 1e-4 {
		t.Errorf("v_inf = %g km/s, want (2Ė/Ṁ)^1/2 = %g", got, want)
	}
	if len(doc.Rows) != 9 || len(doc.Criteria) != len(cs) {
		t.Fatalf("%d rows and %d criteria in JSON", len(doc.Rows), len(doc.Criteria))
	}
	if _, ok := doc.Rows[0]["adiabatic"].(bool); !ok {
		t.Errorf("adiabatic is %T in JSON, want a boolean", doc.Rows[0]["adiabatic"])
	}
}

// TestOutflowText: the text names the wind, the table, the survival
// stretches, the cautions, the statuses from memory and the assumptions.
func TestOutflowText(t *testing.T) {
	out := mustRun(t, "outflow", "--radius", "5pc")
	for _, want := range []string{"Chevalier & Clegg 1985", "v_∞ = 975.8 km s⁻¹", "Where a 5 pc cloud survives", "gronke-oh-2018",
		"from memory", "Assumptions", "no gravity", "pressure equilibrium", "The criteria disagree at"} {
		if !strings.Contains(out, want) {
			t.Errorf("text output lacks %q:\n%s", want, out)
		}
	}
	if n := strings.Count(out, "\n  0.1 "); n != 1 {
		t.Errorf("the table has %d rows at 0.1 R, want 1", n)
	}
	// A big cloud near the centre is flagged: r_cl = 50 pc > 0.1 r inside 500 pc.
	out = mustRun(t, "outflow", "--radius", "50pc")
	if !strings.Contains(out, "larger than 0.1 of its distance from the centre") {
		t.Errorf("no caution for a cloud large against r:\n%s", out)
	}
	// A grid beyond χ = 1 says so.
	out = mustRun(t, "outflow", "--r-max", "1000")
	if !strings.Contains(out, "no cloud: χ ≤ 1") || !strings.Contains(out, "no hotter than the cloud") {
		t.Errorf("no χ ≤ 1 rows or caution out to 1000 R:\n%s", out)
	}
}

// TestOutflowScenario: a scenario file's [outflow] sets the wind, its
// cloud the cloud, and flags given override them.
func TestOutflowScenario(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "wind.toml")
	text := "[inputs]\nradius = 7\nt_cloud = 8000\n[outflow]\nenergy_rate = 1e42\nmass_rate = 2\ninjection_radius = 150\n"
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	inputs := func(args ...string) map[string]any {
		var doc struct {
			Meta struct {
				Inputs map[string]any `json:"inputs"`
			} `json:"meta"`
		}
		if err := json.Unmarshal([]byte(mustRun(t, append([]string{"outflow", "--scenario", path, "--format", "json", "--points", "3"}, args...)...)), &doc); err != nil {
			t.Fatal(err)
		}
		return doc.Meta.Inputs
	}
	in := inputs()
	if in["energy_rate_ergs"] != 1e42 || in["mass_rate_msunyr"] != 2.0 || in["injection_radius_pc"] != 150.0 || in["radius_pc"] != 7.0 || in["t_cloud_k"] != 8000.0 {
		t.Errorf("inputs from the scenario: %v", in)
	}
	if in := inputs("--edot", "2e42", "--radius", "3pc"); in["energy_rate_ergs"] != 2e42 || in["mass_rate_msunyr"] != 2.0 || in["radius_pc"] != 3.0 {
		t.Errorf("flags over the scenario: %v", in)
	}
	// The star-formation flags replace the scenario's rates.
	if in := inputs("--sfr", "5"); in["sfr_msunyr"] != 5.0 || in["energy_loading"] != 1.0 || in["energy_rate_ergs"] != nil {
		t.Errorf("--sfr over a scenario with rates: %v", in)
	}
}

// TestOutflowCarry: the carried cloud in CSV (its path, one block per
// criterion), JSON (events and the growth-rate measure) and text.
func TestOutflowCarry(t *testing.T) {
	// In the fiducial wind a 1 pc cloud grows from 1 R to about 9 R on
	// the gronke-oh-2018 branch (measured), then fails it and is destroyed.
	out := mustRun(t, "outflow", "--carry", "--criterion", "gronke-oh-2018", "--radius", "1pc", "--samples", "11", "--end-radius", "8", "--format", "csv")
	recs, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != 12 || recs[0][0] != "criterion" || recs[1][0] != "gronke-oh-2018" {
		t.Fatalf("carried CSV: %d lines, header %v", len(recs), recs[0])
	}
	prevR, prevM := 0.0, 0.0
	for i, rec := range recs[1:] {
		r, _ := strconv.ParseFloat(rec[1], 64)
		m, _ := strconv.ParseFloat(rec[4], 64)
		if r <= prevR {
			t.Errorf("row %d: r/R = %g not beyond %g", i, r, prevR)
		}
		if i == 0 && (r != 1 || m != 1) {
			t.Errorf("launch row: r/R = %g, m/m0 = %g; want 1, 1", r, m)
		}
		prevR, prevM = r, m
	}
	if prevM <= 1 {
		t.Errorf("a 1 pc cloud on the growth branch ends with m/m0 = %g, want growth", prevM)
	}
	var doc struct {
		Carried []struct {
			Criterion string         `json:"criterion"`
			Stop      string         `json:"stop"`
			Growth    map[string]any `json:"growth_rate"`
			Path      []map[string]float64
		} `json:"carried"`
	}
	if err := json.Unmarshal([]byte(mustRun(t, "outflow", "--carry", "--radius", "1pc", "--format", "json", "--points", "3", "--samples", "5", "--cold-rate", "2")), &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Carried) != len(model.BuiltinCriteria()) {
		t.Fatalf("%d carried runs, want one per criterion", len(doc.Carried))
	}
	for _, c := range doc.Carried {
		if c.Criterion == "gronke-oh-2018" && (c.Growth == nil || c.Growth["spread"] == nil || len(c.Path) != 5) {
			t.Errorf("gronke-oh-2018 carried: growth %v, %d path points", c.Growth, len(c.Path))
		}
		if c.Criterion == "adiabatic" && c.Stop != "destroyed" {
			t.Errorf("the adiabatic baseline stops %q, want destroyed", c.Stop)
		}
	}
	text := mustRun(t, "outflow", "--carry", "--radius", "1pc")
	for _, want := range []string{"Carried cloud: launched at 1 R", "Gronke & Oh 2020 state", "spread", "m0 = "} {
		if !strings.Contains(text, want) {
			t.Errorf("carry text lacks %q:\n%s", want, text)
		}
	}
}

// TestOutflowRefusals: mistakes on the command line name the flag.
func TestOutflowRefusals(t *testing.T) {
	for _, c := range []struct {
		args []string
		frag string
	}{
		{[]string{"--sfr", "-1"}, "--sfr: must be"},
		{[]string{"--sfr", "10 pc"}, "--sfr: "},
		{[]string{"--edot", "1e42"}, "--edot needs --mdot"},
		{[]string{"--mdot", "3"}, "--mdot needs --edot"},
		{[]string{"--edot", "1e42", "--mdot", "3", "--sfr", "4"}, "not both"},
		{[]string{"--energy-loading", "0"}, "--energy-loading: must be greater than 0"},
		{[]string{"--injection-radius", "0"}, "--injection-radius: must be"},
		{[]string{"--chi", "300"}, "unknown flag --chi"},
		{[]string{"--launch-radius", "2"}, "--launch-radius applies to the carried cloud: add --carry"},
		{[]string{"--r-min", "10", "--r-max", "5"}, "--r-max (1500 pc) must be beyond --r-min (3000 pc)"},
		{[]string{"--r-min", "-1"}, "--r-min: must be a positive multiple of R"},
		{[]string{"--r-max", "3 parsec"}, "--r-max: want a multiple of R"},
		{[]string{"--points", "1"}, "--points: must be at least 2"},
		{[]string{"--carry", "--launch-radius", "1e4"}, "--launch-radius"},
		{[]string{"--carry", "--launch-speed", "-5"}, "--launch-speed"},
		{[]string{"--carry", "--criterion", "gronke-oh-2017"}, "did you mean"},
		{[]string{"--carry", "--cold-rate", "0"}, "--cold-rate: must be a positive"},
		{[]string{"--edot", "1e40", "--mdot", "1e3"}, "nowhere hotter than the clouds"},
		{[]string{"--format", "xml"}, "--format"},
		{[]string{"-o", "x.ecsv", "--format", "csv"}, "names the ecsv format"},
	} {
		code, out, errs := runCmd(t, "", append([]string{"outflow"}, c.args...)...)
		if code != 2 || out != "" || !strings.Contains(errs, c.frag) {
			t.Errorf("outflow %v: exit %d, stdout %d bytes, stderr %q; want exit 2 and %q", c.args, code, len(out), errs, c.frag)
		}
	}
}

// TestOutflowAstropy writes the profile as ECSV and has astropy check it
// (testdata/astropy_outflow.py): units, the boolean columns, and with
// astropy.constants the ideal-gas law P/k_B = n T, χ = T/T_cl, the mass
// flux ρ v 4π r² = Ṁ and Bernoulli's constant v²/2 + c_s²/(γ−1) = Ė/Ṁ
// outside R (Chevalier & Clegg 1985's conservation laws, derived).
func TestOutflowAstropy(t *testing.T) {
	py := requireAstropy(t)
	out := filepath.Join(t.TempDir(), "profile.ecsv")
	mustRun(t, "outflow", "--edot", "3e42", "--mdot", "4", "--injection-radius", "250pc", "--points", "40", "-o", out)
	b, err := exec.Command(py, filepath.Join("..", "..", "testdata", "astropy_outflow.py"), out).CombinedOutput()
	if err != nil {
		t.Fatalf("astropy check failed: %v\n%s", err, b)
	}
	t.Logf("%s", b)
}
