package scenario

import (
	"errors"
	"math"
	"strings"
	"testing"

	"cloudwind/model"
)

// Outcomes files: the layout is this package's rule (outcomes.go).

func TestLoadOutcomes(t *testing.T) {
	base := model.Fiducial()
	src := "chi,Mach,pressure_kcm3,t_cloud,r_cl,outcome,label,source\n" +
		"300,1.5,2e3,1e4,30 pc,grew,run 1,mine\n" +
		"100,1,1000,8000 K,0.5 kpc,Transformed,,\n"
	got, err := LoadOutcomes(strings.NewReader(src), "o.csv", base)
	if err != nil {
		t.Fatal(err)
	}
	if len(got.Runs) != 2 {
		t.Fatalf("%d runs", len(got.Runs))
	}
	r := got.Runs[0]
	if r.Params.Chi != 300 || r.Params.Mach != 1.5 || r.Params.Pressure != 2e3 || r.Params.RCloud != 30*model.Parsec || r.Outcome != model.RunGrew || r.Label != "run 1" || r.Source != "mine" {
		t.Errorf("run 1 = %+v", r)
	}
	if r := got.Runs[1]; r.Params.RCloud != 500*model.Parsec || r.Params.TCloud != 8000 || r.Outcome != model.RunTransformed || r.Label != "line 3" {
		t.Errorf("run 2 = %+v", r)
	}
	if strings.Join(got.Defaulted, ",") != "metallicity,mach_turb" {
		t.Errorf("defaulted %v, want metallicity and mach_turb", got.Defaulted)
	}
	// n_hot instead of pressure: P/k_B = n_hot T_hot, T_hot = χ T_cl (one μ).
	got, err = LoadOutcomes(strings.NewReader("chi,t_cloud,n_hot,r_cl,outcome\n100,1e4,1e-3,1,destroyed\n"), "n.csv", base)
	if err != nil || got.Runs[0].Params.Pressure != 1e3 {
		t.Errorf("n_hot: %v, pressure %g, want 1e3 (1e-3 × 1e6 K)", err, float64(got.Runs[0].Params.Pressure))
	}
	// ECSV with a unit on a column.
	ecsv := "# %ECSV 1.0\n# ---\n# delimiter: ' '\n# datatype:\n# - {name: r_cl, unit: kpc, datatype: float64}\n# - {name: outcome, datatype: string}\n# schema: astropy-2.0\nr_cl outcome\n0.03 grew\n"
	got, err = LoadOutcomes(strings.NewReader(ecsv), "o.ecsv", base)
	if err != nil || math.Abs(float64(got.Runs[0].Params.RCloud/model.Parsec)/30-1) > 1e-12 { // 0.03 kpc, rounding of the unit factor
		t.Errorf("ECSV: %v, r_cl %g pc", err, float64(got.Runs[0].Params.RCloud/model.Parsec))
	}
}

func TestLoadOutcomesErrors(t *testing.T) {
	for _, c := range []struct {
		src, frag string
		line      int
	}{
		{"chi,outcme\n100,grew\n", `unknown column "outcme" (did you mean "outcome"?)`, 1},
		{"chi,r_cl\n100,1\n", "no outcome column", 1},
		{"chi,outcome\n100,grow\n", `unknown outcome "grow"`, 2},
		{"chi,outcome\n-3,grew\n", "chi: must be greater than 1", 2},
		{"chi,outcome\n100\n", "1 fields, but the header has 2 columns", 2},
		{"chi,r_cl,outcome\n100,3 parsec,grew\n", `unknown unit "parsec"`, 2},
		{"chi,chi,outcome\n", `column "chi" appears twice`, 1},
		{"chi,pressure,n_hot,outcome\n", "pressure or n_hot, not both", 1},
		{"chi,outcome,label\n100,grew,a\u202eb\n", "U+202E", 2},
		{"", "no header row", 0},
		{"chi,outcome\n", "no runs", 0},
		{"chi,outcome\n\"100,grew\n", "", 2},
	} {
		_, err := LoadOutcomes(strings.NewReader(c.src), "bad.csv", model.Fiducial())
		var pe *ParseError
		if !errors.As(err, &pe) || pe.Line != c.line || !strings.Contains(err.Error(), c.frag) || pe.File != "bad.csv" {
			t.Errorf("LoadOutcomes(%q) = %v, want bad.csv line %d with %q", c.src, err, c.line, c.frag)
		}
	}
}

func TestDemoOutcomesLoad(t *testing.T) {
	got, err := LoadOutcomes(strings.NewReader(DemoOutcomes), "demo", model.Fiducial())
	if err != nil || len(got.Runs) < 10 {
		t.Fatalf("the demo outcomes: %v (%d runs)", err, len(got.Runs))
	}
	for _, r := range got.Runs {
		if !strings.Contains(r.Source, "fictional") {
			t.Errorf("demo run %s is not marked fictional: %q", r.Label, r.Source)
		}
	}
}

func FuzzLoadOutcomes(f *testing.F) {
	f.Add([]byte(DemoOutcomes))
	f.Add([]byte("# %ECSV 1.0\n# - {name: r_cl, unit: pc}\nr_cl outcome\n1 grew\n"))
	f.Add([]byte("chi,outcome\n\"1\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		got, err := LoadOutcomes(strings.NewReader(string(data)), "fuzz.csv", model.Fiducial())
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v is not a *ParseError", err)
			}
			return
		}
		for _, r := range got.Runs {
			if err := r.Params.Validate(); err != nil {
				t.Fatalf("accepted an invalid run: %v", err)
			}
		}
	})
}
