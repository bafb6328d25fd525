package cli

import (
	"context"
	"encoding/json"
	"errors"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestSweepBadSpecs(t *testing.T) {
	cases := []struct {
		args []string
		frag string
	}{
		{[]string{"--chi", "log:0:10:5"}, "a log range needs A > 0 and B > 0"},
		{[]string{"--radius", "lin:1:2:0"}, "N must be at least 2"},
		{[]string{"--radius", "lin:1:2"}, "want lin:A:B:N"},
		{[]string{"--radius", "lin:1:2:x"}, "N must be a whole number"},
		{[]string{"--radius", "log:1 parsec:2:3"}, `unknown unit "parsec"`},
		{[]string{"--chi", "100,abc"}, "--chi"},
		{[]string{"--chi", "lin:0.5:10:3"}, "--chi: must be greater than 1"},
		{[]string{"--chi", "log:10:1e7:3", "--t-cloud", "1e5"}, "--chi: the wind temperature"},
		{[]string{"--t-cloud", "lin:1e4:3e4:3", "--t-floor", "2e4"}, "--t-floor"},
		{[]string{"--chi", "log:2:1e4:5000", "--radius", "log:1:10:5000"}, "more than 10000000; pass --force"},
		{[]string{"--format", "xlsx"}, "--format: want csv, ecsv, json, jsonl or parquet"},
		{[]string{"--workers", "0"}, "--workers"},
	}
	for _, c := range cases {
		code, out, errs := runCmd(t, "", append([]string{"sweep"}, c.args...)...)
		if code != 2 || out != "" || strings.Count(errs, "\n") != 1 || !strings.Contains(errs, c.frag) {
			t.Errorf("sweep %v: exit %d, stdout %d bytes, stderr %q; want 2, nothing, one line with %q", c.args, code, len(out), errs, c.frag)
		}
	}
}

func TestSweepGridAndOrder(t *testing.T) {
	code, out, errs := runCmd(t, "", "sweep", "--chi", "100,1000", "--mach", "lin:0.5:1.5:3", "--radius", "log:1:100:5", "--format", "csv")
	if code != 0 {
		t.Fatalf("sweep: exit %d: %s", code, errs)
	}
	lines := strings.Split(strings.TrimSpace(out), "\n")
	if len(lines) != 1+2*3*5 {
		t.Fatalf("sweep: %d lines, want %d (header + 2×3×5 rows)", len(lines), 1+30)
	}
	head := strings.Split(lines[0], ",")
	col := func(name string) int {
		for i, h := range head {
			if h == name {
				return i
			}
		}
		t.Fatalf("no column %s", name)
		return -1
	}
	// Row order: radius fastest, then mach, then chi (documented order).
	row := func(i int) []string { return strings.Split(lines[1+i], ",") }
	if r := row(0); r[col("chi")] != "100" || r[col("mach")] != "0.5" || r[col("radius_pc")] != "1" {
		t.Errorf("first row chi %s mach %s radius %s", r[col("chi")], r[col("mach")], r[col("radius_pc")])
	}
	if r := row(4); r[col("radius_pc")] != "100" || r[col("mach")] != "0.5" {
		t.Errorf("row 4: radius %s mach %s, want 100 and 0.5", r[col("radius_pc")], r[col("mach")])
	}
	if r := row(5); r[col("radius_pc")] != "1" || r[col("mach")] != "1" {
		t.Errorf("row 5: radius %s mach %s, want 1 and 1", r[col("radius_pc")], r[col("mach")])
	}
	if r := row(15); r[col("chi")] != "1000" {
		t.Errorf("row 15: chi %s, want 1000", r[col("chi")])
	}
	// Each row agrees with eval at the same point (the sweep's fast path is exact).
	r := row(22) // chi 1000 (15 rows in), mach 1 (5 more), radius index 2 of log:1:100:5 = 10 pc
	code, js, _ := runCmd(t, "", "eval", "--format", "json", "--chi", "1000", "--mach", "1", "--radius", "10")
	if code != 0 {
		t.Fatal("eval failed")
	}
	var doc struct {
		Criteria []struct {
			RCrit *float64 `json:"radius_crit_pc"`
		} `json:"criteria"`
		Derived map[string]*float64 `json:"derived"`
	}
	json.Unmarshal([]byte(js), &doc)
	for name, want := range map[string]*float64{"t_cc_myr": doc.Derived["t_cc_myr"], "gronke_oh_2018_radius_crit_pc": doc.Criteria[0].RCrit} {
		got := parseF(r[col(name)])
		if want == nil || math.Abs(got / *want - 1) > 1e-8 {
			t.Errorf("sweep row 22 %s = %g, eval gives %v", name, got, fmtPtr(want))
		}
	}
}

func fmtPtr(p *float64) any {
	if p == nil {
		return nil
	}
	return *p
}

func parseF(s string) float64 {
	var v float64
	json.Unmarshal([]byte(s), &v)
	return v
}

// TestSweepDeterministic: one worker and four give the same bytes.
func TestSweepDeterministic(t *testing.T) {
	args := []string{"sweep", "--chi", "log:10:1e4:13", "--pressure", "100,1e4", "--radius", "log:0.1:1e3:401", "--metallicity", "0.3,1"}
	_, one, _ := runCmd(t, "", append(args, "--workers", "1")...)
	_, four, _ := runCmd(t, "", append(args, "--workers", "4")...)
	if one != four || len(one) < 1000 {
		t.Errorf("1 and 4 workers differ (%d vs %d bytes)", len(one), len(four))
	}
}

func TestSweepFormats(t *testing.T) {
	code, out, _ := runCmd(t, "", "sweep", "--chi", "100,300", "--radius", "1,10", "--format", "json")
	var doc struct {
		Schema  string           `json:"schema"`
		Meta    map[string]any   `json:"meta"`
		Columns []map[string]any `json:"columns"`
		Rows    []map[string]any `json:"rows"`
	}
	if code != 0 || json.Unmarshal([]byte(out), &doc) != nil || len(doc.Rows) != 4 || doc.Schema != "cloudwind.sweep/1" || doc.Meta["cooling"] == nil {
		t.Errorf("json: exit %d, %d rows, schema %q; output %.200s", code, len(doc.Rows), doc.Schema, out)
	}
	if v, ok := doc.Rows[0]["adiabatic_radius_crit_pc"]; !ok || v != nil {
		t.Errorf("json: an infinite r_crit must be null, got %v", v)
	}
	code, out, _ = runCmd(t, "", "sweep", "--chi", "100,300", "--radius", "1,10", "--format", "jsonl")
	lines := strings.Split(strings.TrimSpace(out), "\n")
	for _, l := range lines {
		var m map[string]any
		if err := json.Unmarshal([]byte(l), &m); err != nil {
			t.Errorf("jsonl line %q: %v", l, err)
		}
	}
	if code != 0 || len(lines) != 4 {
		t.Errorf("jsonl: exit %d, %d lines, want 4", code, len(lines))
	}
}

func TestSweepOutputFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "g.csv")
	if code, out, errs := runCmd(t, "", "sweep", "--chi", "100,300", "-o", path); code != 0 || out != "" {
		t.Fatalf("sweep -o: exit %d, stdout %q, stderr %q", code, out, errs)
	}
	b, err := os.ReadFile(path)
	if err != nil || strings.Count(string(b), "\n") != 3 {
		t.Fatalf("sweep -o wrote %q, %v", b, err)
	}
	// A failing run leaves the old file as it was and no temporary files.
	os.WriteFile(path, []byte("precious\n"), 0o644)
	if code, _, _ := runCmd(t, "", "sweep", "--chi", "100,300", "--criteria", filepath.Join(dir, "none.toml"), "-o", path); code == 0 {
		t.Fatal("sweep with a missing criteria file succeeded")
	}
	err = writeFileAtomic(path, func(w io.Writer) error {
		io.WriteString(w, "half a ")
		return errors.New("disk on fire")
	})
	if err == nil {
		t.Fatal("writeFileAtomic returned no error")
	}
	if b, _ := os.ReadFile(path); string(b) != "precious\n" {
		t.Errorf("failed write changed the file to %q", b)
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 1 {
		t.Errorf("failed write left %d entries in the directory, want 1", len(ents))
	}
}

// TestSweepInterrupted cancels a sweep and expects the atomic writer to
// leave the old file intact.
func TestSweepInterrupted(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "g.csv")
	os.WriteFile(path, []byte("precious\n"), 0o644)
	var sf scenarioFlags
	f := newFlagSet("sweep", "", "")
	sf.register(f)
	e := &env{args: []string{"--radius", "log:0.01:1e4:100000"}, stdin: strings.NewReader(""), stdout: io.Discard, stderr: io.Discard, getenv: os.Getenv}
	if err := f.parse(e); err != nil {
		t.Fatal(err)
	}
	opt, err := sweepSetup(e, &sf, f, "csv", 2, false)
	if err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	err = writeFileAtomic(path, func(w io.Writer) error { return runSweepTo(ctx, e, opt, w) })
	if err == nil || !strings.Contains(err.Error(), "interrupted") {
		t.Errorf("cancelled sweep: err %v, want interrupted", err)
	}
	if b, _ := os.ReadFile(path); string(b) != "precious\n" {
		t.Errorf("interrupted sweep changed the file to %.40q", b)
	}
}
