package cli

import (
	"encoding/csv"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// planDoc runs plan with --format json and decodes it.
func planDoc(t *testing.T, args ...string) map[string]any {
	t.Helper()
	code, out, errs := runCmd(t, "", append(append([]string{"plan"}, args...), "--format", "json")...)
	if code != 0 {
		t.Fatalf("plan %q: exit %d: %s", args, code, errs)
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	return doc
}

// TestPlanFiducialCases: the cases that made the growth-and-plans issue
// (the built-in cooling function, the default growth model). Expected:
// plans of tens of t_cc with finite integer grids, or an explicit "not
// testable" with the reason (the issue's acceptance rule; the trajectory
// itself is model.Evolve's).
func TestPlanFiducialCases(t *testing.T) {
	for _, c := range []struct {
		name     string
		args     []string
		testable bool
	}{
		{"χ = 100, M = 1.5, r_cl = 30 pc", []string{"--chi", "100", "--mach", "1.5", "--radius", "30pc"}, true},
		{"the starburst demo", []string{"--chi", "500", "--mach", "1.5", "--pressure", "2e5", "--radius", "5pc"}, true},
		{"default r_cl = 1 pc", nil, false},
	} {
		doc := planDoc(t, c.args...)
		run, _ := doc["run_tcc"].(float64)
		grid, _ := doc["grid"].([]any)
		if len(grid) != 3 {
			t.Fatalf("%s: grid %v", c.name, doc["grid"])
		}
		cells := 1.0
		for _, g := range grid {
			n, _ := g.(float64)
			if n < 1 || n != math.Trunc(n) {
				t.Errorf("%s: grid %v is not whole cells", c.name, grid)
			}
			cells *= n
		}
		if got, _ := doc["cells"].(float64); got != cells {
			t.Errorf("%s: cells %g, want the product of the grid %g", c.name, got, cells)
		}
		if doc["testable"] != c.testable {
			t.Errorf("%s: testable %v, want %v (verdict %q)", c.name, doc["testable"], c.testable, doc["verdict"])
		}
		if c.testable && !(run >= 10 && run < 100) {
			t.Errorf("%s: run %g t_cc, want tens of t_cc", c.name, run)
		}
		if !c.testable {
			verdict, _ := doc["verdict"].(string)
			sugg, _ := doc["suggestion"].(string)
			if !strings.Contains(verdict, "every criterion predicts destruction") || !strings.Contains(sugg, "growth becomes testable") {
				t.Errorf("%s: verdict %q, suggestion %q", c.name, verdict, sugg)
			}
			if r, _ := doc["radius_testable_pc"].(float64); !(r > 1) {
				t.Errorf("%s: radius_testable_pc %v, want > 1 pc", c.name, doc["radius_testable_pc"])
			}
		}
	}
	// The text says "not testable" first.
	_, out, _ := runCmd(t, "", "plan")
	if i := strings.Index(out, "NOT TESTABLE"); i < 0 || i > strings.Index(out, "  run ") {
		t.Errorf("plan text does not open with the verdict:\n%.400s", out)
	}
}

// TestPlanGridLadderBlock: --block rounds every axis up to whole blocks,
// --ladder repeats the run at each R with cells ∝ R³ when L R is whole
// (derived from N = ⌈L R/B⌉ B).
func TestPlanGridLadderBlock(t *testing.T) {
	doc := planDoc(t, "--radius", "30pc", "--box", "40x20x20", "--run-tcc", "20", "--block", "16", "--ladder", "8,16,32")
	grid, _ := doc["grid"].([]any)
	for i, want := range []float64{640, 320, 320} { // 40·16 and 20·16, already multiples of 16
		if grid[i].(float64) != want {
			t.Errorf("grid[%d] = %v, want %g", i, grid[i], want)
		}
	}
	rungs, _ := doc["ladder"].([]any)
	if len(rungs) != 3 {
		t.Fatalf("ladder has %d rungs, want 3", len(rungs))
	}
	for i, R := range []float64{8, 16, 32} {
		r := rungs[i].(map[string]any)
		want := math.Ceil(40*R/16) * 16 * math.Ceil(20*R/16) * 16 * math.Ceil(20*R/16) * 16
		if r["cells"].(float64) != want {
			t.Errorf("rung R = %g: cells %v, want %g", R, r["cells"], want)
		}
	}
	for _, bad := range [][]string{{"--ladder", "8,abc"}, {"--ladder", "0.5"}, {"--block", "0"}, {"--block", "2.5"}, {"--run-cap", "0"}, {"--budget", "-1"}} {
		if code, _, errs := runCmd(t, "", append([]string{"plan"}, bad...)...); code != 2 || strings.Count(errs, "\n") != 1 {
			t.Errorf("plan %v: exit %d, stderr %q; want 2 and one line", bad, code, errs)
		}
	}
}

// TestPlanCampaign: a grid of scenarios gives one row per run, the total
// against --budget, and CSV/JSON files whose rows agree with single plans.
func TestPlanCampaign(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "campaign.csv")
	code, _, errs := runCmd(t, "", "plan", "--radius", "log:1pc:100pc:3", "--mach", "1,1.5", "--budget", "2000", "-o", out)
	if code != 0 {
		t.Fatalf("campaign: exit %d: %s", code, errs)
	}
	f, err := os.Open(out)
	if err != nil {
		t.Fatal(err)
	}
	recs, err := csv.NewReader(f).ReadAll()
	f.Close()
	if err != nil || len(recs) != 7 {
		t.Fatalf("campaign CSV: %d records, %v; want a header and 6 runs", len(recs), err)
	}
	col := map[string]int{}
	for i, n := range recs[0] {
		col[n] = i
	}
	// The run at r_cl = 10 pc, M = 1 agrees with a single plan there.
	single := planDoc(t, "--radius", "10pc", "--mach", "1")
	var found bool
	for _, r := range recs[1:] {
		if r[col["radius_pc"]] == "10" && r[col["mach"]] == "1" {
			found = true
			ch, _ := strconv.ParseFloat(r[col["core_hours"]], 64)
			want := single["core_hours"].(float64)
			if math.Abs(ch/want-1) > 1e-8 || r[col["testable"]] != "true" || r[col["tells_apart"]] != "true" { // CSV: nine figures
				t.Errorf("campaign row %v disagrees with the single plan (core-hours %v)", r, single["core_hours"])
			}
		}
	}
	if !found {
		t.Error("no campaign row at 10 pc, M = 1")
	}
	code, text, _ := runCmd(t, "", "plan", "--radius", "log:1pc:100pc:3", "--mach", "1,1.5", "--budget", "2000")
	if code != 0 || !strings.Contains(text, "Budget: 2000 core-hours, over the budget") || !strings.Contains(text, "◆") || !strings.Contains(text, "✗ run 1:") {
		t.Errorf("campaign text: exit %d\n%s", code, text)
	}
	js := planDoc(t, "--radius", "10pc,30pc")
	if runs, _ := js["runs"].([]any); len(runs) != 2 || js["schema"] != "cloudwind.campaign/1" {
		t.Errorf("campaign JSON: %d runs, schema %v", len(runs), js["schema"])
	}
	if code, _, errs := runCmd(t, "", "plan", "--radius", "10pc,30pc", "--compare"); code != 2 || !strings.Contains(errs, "--compare") {
		t.Errorf("campaign with --compare: exit %d, %q", code, errs)
	}
}
