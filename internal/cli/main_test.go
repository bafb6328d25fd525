package cli

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"cloudwind/model"
)

// runCmd runs cloudwind with args and returns status, stdout and stderr.
func runCmd(t *testing.T, stdin string, args ...string) (int, string, string) {
	t.Helper()
	var out, errb bytes.Buffer
	code := run(&env{args: args, stdin: strings.NewReader(stdin), stdout: &out, stderr: &errb, getenv: func(string) string { return "" }})
	return code, out.String(), errb.String()
}

func TestEvalJSONSchema(t *testing.T) {
	// The Gronke & Oh (2018) normalisation, derived: r_crit = 2.5528 pc
	// with Λ = 10^-21.4, f = 3/2, 𝒩 = n², χ = 100, T_cl = 1e4 K, P/k = 1e3, M = 1, μ = 0.6.
	code, out, errs := runCmd(t, "", "eval", "--format", "json", "--density-product", "n2", "--cooling", "const:10^-21.4")
	if code != 0 {
		t.Fatalf("eval exit %d, stderr %q", code, errs)
	}
	var doc struct {
		Derived  map[string]*float64 `json:"derived"`
		Criteria []struct {
			ID       string   `json:"id"`
			Ratio    *float64 `json:"ratio"`
			RCrit    *float64 `json:"radius_crit_pc"`
			Margin   *float64 `json:"margin"`
			Verdict  string   `json:"verdict"`
			Verified *bool    `json:"verified"`
			InRange  *bool    `json:"in_range"`
			Citation string   `json:"citation"`
		} `json:"criteria"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("eval JSON does not parse: %v\n%s", err, out)
	}
	// Derived values of the fiducial problem (as in model's TestFiducialState).
	want := map[string]float64{
		"t_hot_k": 1e6, "n_hot_cm3": 1e-3, "t_mix_k": 1e5, "v_wind_kms": 151.423,
		"t_cc_myr": 0.064574, "t_shear_myr": 0.0064574, "t_cool_mix_myr": 0.164843,
	}
	for k, v := range want {
		got := doc.Derived[k]
		if got == nil || math.Abs(*got-v) > 1e-4*v {
			t.Errorf("derived.%s = %v, want %g (±1e-4 relative)", k, got, v)
		}
	}
	for _, k := range []string{"t_cool_hot_myr", "t_cool_minmix_myr"} {
		if doc.Derived[k] == nil {
			t.Errorf("derived.%s missing or null", k)
		}
	}
	if len(doc.Criteria) != len(model.BuiltinCriteria()) {
		t.Fatalf("criteria: %d entries, want %d", len(doc.Criteria), len(model.BuiltinCriteria()))
	}
	go18 := doc.Criteria[0]
	if go18.ID != "gronke-oh-2018" || go18.RCrit == nil || math.Abs(*go18.RCrit-2.5528) > 1e-4*2.5528 {
		t.Errorf("criteria[0] = %s r_crit %v, want gronke-oh-2018 with 2.5528 pc", go18.ID, go18.RCrit)
	}
	for _, c := range doc.Criteria {
		if c.Ratio == nil && c.ID != "adiabatic" || c.Verdict == "" || c.Verified == nil || c.InRange == nil || c.Citation == "" {
			t.Errorf("criterion %s lacks a field: %+v", c.ID, c)
		}
	}
	if ad := doc.Criteria[len(doc.Criteria)-1]; ad.RCrit != nil || ad.Verdict != "destroyed" {
		t.Errorf("adiabatic: radius_crit_pc %v, verdict %q; want null, destroyed", ad.RCrit, ad.Verdict)
	}
}

func TestEvalText(t *testing.T) {
	code, out, _ := runCmd(t, "", "eval", "--radius", "30 pc", "--chi", "300")
	if code != 0 {
		t.Fatalf("eval exit %d", code)
	}
	for _, frag := range []string{"r_cl", "30 pc", "t_cc", "Myr", "Gronke & Oh 2018", "survives-and-grows", "km s⁻¹", "* constant not verified", "Convention spread"} {
		if !strings.Contains(out, frag) {
			t.Errorf("eval text lacks %q:\n%s", frag, out)
		}
	}
}

func TestEvalBadInput(t *testing.T) {
	cases := []struct {
		args []string
		frag string
	}{
		{[]string{"--chi", "-100"}, "--chi: must be greater than 1"},
		{[]string{"--chi", "abc"}, "--chi: invalid value"},
		{[]string{"--chii", "100"}, "unknown flag --chii (did you mean --chi?)"},
		{[]string{"--mach", "0"}, "--mach: must be greater than 0"},
		{[]string{"--radius", "3 parsecs"}, `--radius: invalid value: unknown unit "parsecs"`},
		{[]string{"--radius", "-2"}, "--radius: must be at least"},
		{[]string{"--t-floor", "2e4"}, "--t-floor: the cooling floor"},
		{[]string{"--pressure", "NaN"}, "--pressure"},
		{[]string{"--heat-capacity", "isothermal"}, "--heat-capacity: want isochoric or isobaric"},
		{[]string{"--density-product", "ne"}, "--density-product: want nh2, n2 or neni"},
		{[]string{"--cooling", "const:-1"}, "--cooling const: Λ must be a finite number greater than 0"},
		{[]string{"--cooling", "bultin"}, `--cooling: "bultin" is neither a cooling function name nor a file (did you mean "builtin"?)`},
		{[]string{"--cooling", "builtin", "--table", "norm: nH2"}, "table settings apply to a table file, but --cooling is \"builtin\""},
		{[]string{"--metallicity", "-1"}, "--metallicity: must be at least 0"},
		{[]string{"--format", "yaml"}, "--format: want text or json"},
		{[]string{"--mixture", "solar"}, "--mixture: unknown mixture"},
		{[]string{"--chi"}, "--chi needs a value"},
		{[]string{"stray"}, `unexpected argument "stray"`},
	}
	for _, c := range cases {
		code, out, errs := runCmd(t, "", append([]string{"eval"}, c.args...)...)
		if code != 2 {
			t.Errorf("eval %v: exit %d, want 2", c.args, code)
		}
		if out != "" {
			t.Errorf("eval %v: wrote to stdout: %q", c.args, out)
		}
		if strings.Count(errs, "\n") != 1 || !strings.Contains(errs, c.frag) {
			t.Errorf("eval %v: stderr %q, want one line containing %q", c.args, errs, c.frag)
		}
	}
}

func TestEvalCriteriaFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "c.toml")
	os.WriteFile(path, []byte("[[criterion]]\nid = \"li-2020\"\nalpha = 5\n"), 0o644)
	code, out, errs := runCmd(t, "", "eval", "--format", "json", "--criteria", path)
	if code != 0 {
		t.Fatalf("eval --criteria: exit %d: %s", code, errs)
	}
	if !strings.Contains(out, `"alpha": 5`) {
		t.Errorf("li-2020 alpha not overridden:\n%s", out)
	}
	// The same from stdin.
	code, _, errs = runCmd(t, "[[criterion]]\nid = \"li-2020\"\nalpah = 5\n", "eval", "--criteria", "-")
	if code != 2 && code != 1 || !strings.Contains(errs, "3") || !strings.Contains(errs, "alpha") {
		t.Errorf("bad criteria from stdin: exit %d, stderr %q; want the line (3) and a suggestion", code, errs)
	}
	code, _, errs = runCmd(t, "", "eval", "--criteria", filepath.Join(dir, "missing.toml"))
	if code != 1 || !strings.Contains(errs, "no such file") {
		t.Errorf("missing criteria file: exit %d, stderr %q", code, errs)
	}
}

func TestTopLevel(t *testing.T) {
	if code, out, _ := runCmd(t, "", "--help"); code != 0 || !strings.Contains(out, "eval") {
		t.Errorf("--help: exit %d, out %q", code, out)
	}
	if code, out, _ := runCmd(t, "", "eval", "--help"); code != 0 || !strings.Contains(out, "Examples:") || !strings.Contains(out, "--radius") {
		t.Errorf("eval --help: exit %d, out %q", code, out)
	}
	if code, _, errs := runCmd(t, "", "evl"); code != 2 || !strings.Contains(errs, `did you mean "eval"`) {
		t.Errorf("evl: exit %d, stderr %q", code, errs)
	}
	if code, out, _ := runCmd(t, "", "version"); code != 0 || !strings.HasPrefix(out, "cloudwind ") {
		t.Errorf("version: exit %d, out %q", code, out)
	}
}

func TestCoolingCommand(t *testing.T) {
	code, out, errs := runCmd(t, "", "cooling", "--points", "5", "--format", "csv", "--vs", "const:1e-22")
	if code != 0 {
		t.Fatalf("cooling: exit %d: %s", code, errs)
	}
	lines := strings.Split(strings.TrimSpace(out), "\n")
	// Output layout of the issue: T in K first, Λ per n_H² second, then n_e/n_H, then the --vs curve and the ratio.
	if want := "T_K,lambda_nH2_erg_cm3_s,ne_over_nH,lambda_vs_nH2_erg_cm3_s,ratio,status,status_vs"; lines[0] != want {
		t.Errorf("cooling CSV header %q, want %q", lines[0], want)
	}
	if len(lines) != 6 {
		t.Fatalf("cooling CSV: %d lines, want 6", len(lines))
	}
	// 1e4 to 1e8 K in 5 points: the middle one is 1e6 K.
	f := strings.Split(lines[3], ",")
	if f[0] != "1000000" {
		t.Errorf("third temperature %q, want 1000000", f[0])
	}
	for _, bad := range [][]string{{"--tmin", "1e6", "--tmax", "1e5"}, {"--points", "1"}, {"--format", "xml"}, {"--vs-table", "norm: nH2"}, {"--metallicity", "-2"}} {
		if code, _, errs := runCmd(t, "", append([]string{"cooling"}, bad...)...); code != 2 || strings.Count(errs, "\n") != 1 {
			t.Errorf("cooling %v: exit %d, stderr %q; want 2 and one line", bad, code, errs)
		}
	}
}

// A table in cloudwind's own layout with an H+He and a metals column
// (synthetic values, no physical source) loads through --cooling FILE.
func TestEvalWithTable(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "mine.txt")
	table := "# cloudwind-table\n# norm: nH2\n# columns: T=1 HHe=2 metals=3\n# log: T=yes lambda=yes\n" +
		"4.0 -23.0 -22.0\n5.0 -22.5 -21.3\n6.0 -23.2 -22.0\n7.0 -23.0 -22.6\n8.0 -22.6 -23.5\n"
	os.WriteFile(path, []byte(table), 0o644)
	code, out, errs := runCmd(t, "", "eval", "--cooling", path, "--metallicity", "0.5", "--format", "json")
	if code != 0 {
		t.Fatalf("eval --cooling FILE: exit %d: %s", code, errs)
	}
	var doc struct {
		Derived map[string]*float64 `json:"derived"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	// At T_hot = 1e6 K, a node: Λ = 10^-23.2 + 0.5 × 10^-22.0 (the table's own rows).
	want := math.Pow(10, -23.2) + 0.5*math.Pow(10, -22)
	if got := doc.Derived["lambda_hot_ergcm3s"]; got == nil || math.Abs(*got/want-1) > 1e-9 {
		t.Errorf("lambda_hot = %v, want %g", got, want)
	}
	// The same table without its norm directive is refused: never guessed.
	os.WriteFile(path, []byte(strings.Replace(table, "# norm: nH2\n", "", 1)), 0o644)
	if code, _, errs := runCmd(t, "", "eval", "--cooling", path); code != 2 || !strings.Contains(errs, "normalisation is required") {
		t.Errorf("table without norm: exit %d, stderr %q", code, errs)
	}
	// ...unless the command line gives it.
	if code, _, errs := runCmd(t, "", "eval", "--cooling", path, "--table", "norm: nH2"); code != 0 {
		t.Errorf("table with --table norm: exit %d, stderr %q", code, errs)
	}
	// A broken row is reported with its line.
	os.WriteFile(path, []byte(table+"8.5 abc -23\n"), 0o644)
	if code, _, errs := runCmd(t, "", "eval", "--cooling", path); code != 1 || !strings.Contains(errs, "mine.txt:10") {
		t.Errorf("bad row: exit %d, stderr %q; want the file and line 10", code, errs)
	}
}
