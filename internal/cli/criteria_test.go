package cli

import (
	"encoding/json"
	"path/filepath"
	"strings"
	"testing"
)

// TestOutcomesFromAbstracts scores the criteria against the runs of
// testdata/outcomes/abstracts.csv, built from statements the papers'
// abstracts confirm (each row names its source): George, Das & Gronke 2025
// (arXiv:2507.20962: at χ = 1000 in turbulent boxes, survival only for
// t_cool,mix/t_cc ≲ 0.01) and Gronke & Oh 2018 (arXiv:1806.02728: growth
// whenever t_cool,mix/t_cc < 1). The turbulent-box criterion, built from
// them, must call every George row; Gronke & Oh's wind criterion must call
// its own rows and misses the turbulent-box destructions at ratios below 1.
func TestOutcomesFromAbstracts(t *testing.T) {
	file := filepath.Join("..", "..", "testdata", "outcomes", "abstracts.csv")
	code, out, errs := runCmd(t, "", "eval", "--outcomes", file, "--format", "json")
	if code != 0 {
		t.Fatalf("eval --outcomes: exit %d: %s", code, errs)
	}
	var doc struct {
		Outcomes struct {
			Scores []struct {
				ID           string `json:"id"`
				Hits, Misses int
			} `json:"scores"`
			Runs []struct {
				Label    string            `json:"label"`
				Source   string            `json:"source"`
				Outcome  string            `json:"outcome"`
				Verdicts map[string]string `json:"verdicts"`
			} `json:"runs"`
		} `json:"outcomes"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Outcomes.Runs) != 5 {
		t.Fatalf("%d runs, want 5", len(doc.Outcomes.Runs))
	}
	for _, r := range doc.Outcomes.Runs {
		if r.Source == "" {
			t.Errorf("run %s names no source", r.Label)
		}
		want := map[string]string{"destroyed": "destroyed", "survived": "survives-and-grows", "grew": "survives-and-grows"}[r.Outcome]
		switch {
		case strings.HasPrefix(r.Label, "George"):
			if r.Verdicts["turbulent-box"] != want {
				t.Errorf("%s (%s): turbulent-box says %s", r.Label, r.Outcome, r.Verdicts["turbulent-box"])
			}
		case strings.HasPrefix(r.Label, "GO18"):
			if r.Verdicts["gronke-oh-2018"] != want {
				t.Errorf("%s (%s): gronke-oh-2018 says %s", r.Label, r.Outcome, r.Verdicts["gronke-oh-2018"])
			}
		}
	}
	var box, go18 struct{ Hits, Misses int }
	for _, s := range doc.Outcomes.Scores {
		switch s.ID {
		case "turbulent-box":
			box.Hits, box.Misses = s.Hits, s.Misses
		case "gronke-oh-2018":
			go18.Hits, go18.Misses = s.Hits, s.Misses
		}
	}
	if box.Hits < 3 || go18.Misses < 1 {
		t.Errorf("turbulent-box %+v, gronke-oh-2018 %+v: want the box to call the George rows and GO18 to miss one", box, go18)
	}
	// The text form and the fictional demo.
	code, text, _ := runCmd(t, "", "eval", "--outcomes", "demo")
	if code != 0 || !strings.Contains(text, "Scores against 12 simulation runs") || !strings.Contains(text, "accuracy") {
		t.Errorf("eval --outcomes demo: exit %d\n%s", code, text)
	}
	if code, _, errs := runCmd(t, "", "eval", "--outcomes", filepath.Join(t.TempDir(), "none.csv")); code != 1 || !strings.Contains(errs, "--outcomes") {
		t.Errorf("missing outcomes file: exit %d %q", code, errs)
	}
}

// TestConventionSpreadJSON: eval's JSON carries the spread of every
// criterion over f × 𝒩 (6 cases), 12 with --spread-cooling.
func TestConventionSpreadJSON(t *testing.T) {
	for _, c := range []struct {
		args  []string
		cases int
	}{{nil, 6}, {[]string{"--spread-cooling", "rosen-bregman-1995"}, 12}} {
		code, out, errs := runCmd(t, "", append([]string{"eval", "--format", "json"}, c.args...)...)
		if code != 0 {
			t.Fatalf("eval %v: exit %d: %s", c.args, code, errs)
		}
		var doc struct {
			Spread []struct {
				ID      string           `json:"id"`
				Summary string           `json:"summary"`
				Cases   []map[string]any `json:"cases"`
				Min     *float64         `json:"radius_crit_min_pc"`
				Max     *float64         `json:"radius_crit_max_pc"`
			} `json:"convention_spread"`
		}
		if err := json.Unmarshal([]byte(out), &doc); err != nil {
			t.Fatal(err)
		}
		if len(doc.Spread) == 0 || len(doc.Spread[0].Cases) != c.cases || doc.Spread[0].Summary == "" || *doc.Spread[0].Min > *doc.Spread[0].Max {
			t.Errorf("eval %v: spread %+v", c.args, doc.Spread[0])
		}
	}
	for _, args := range [][]string{{"--density-product", "neni"}, {"--mach-turb", "0.5"}} {
		if code, _, errs := runCmd(t, "", append([]string{"eval"}, args...)...); code != 0 {
			t.Errorf("eval %v: exit %d %s", args, code, errs)
		}
	}
	if code, _, errs := runCmd(t, "", "eval", "--mach-turb", "-1"); code != 2 || !strings.Contains(errs, "--mach-turb") {
		t.Errorf("--mach-turb -1: exit %d %q", code, errs)
	}
}

// TestTransformedVerdict: an 800 K cloud can come out "transformed" (Farber
// & Gronke 2022's third outcome, confirmed from the abstract; the forms
// cloudwind's reading) and every output format says so: eval JSON, sweep
// CSV and ECSV. The radii span the three outcomes with the built-in curve
// (measured: destroyed below ~2 pc, transformed to ~50 pc, survives above).
func TestTransformedVerdict(t *testing.T) {
	base := []string{"--t-cloud", "800", "--chi", "3750", "--pressure", "1e4"}
	seen := map[string]bool{}
	for _, r := range []string{"0.3pc", "10pc", "300pc"} {
		code, out, errs := runCmd(t, "", append([]string{"eval", "--format", "json", "--radius", r}, base...)...)
		if code != 0 {
			t.Fatalf("eval: %s", errs)
		}
		var doc struct {
			Criteria []struct {
				ID, Verdict string
			} `json:"criteria"`
		}
		json.Unmarshal([]byte(out), &doc)
		for _, c := range doc.Criteria {
			if c.ID == "farber-gronke-2022" {
				seen[c.Verdict] = true
			}
		}
	}
	for _, v := range []string{"destroyed", "transformed", "survives-and-grows"} {
		if !seen[v] {
			t.Errorf("no radius gave %s (saw %v)", v, seen)
		}
	}
	for _, format := range []string{"csv", "ecsv"} {
		code, out, errs := runCmd(t, "", append([]string{"sweep", "--format", format, "--radius", "0.3,10,300"}, base...)...)
		if code != 0 || !strings.Contains(out, "transformed") {
			t.Errorf("sweep %s: exit %d %s, no transformed verdict", format, code, errs)
		}
	}
}
