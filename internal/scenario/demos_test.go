package scenario

import (
	"bytes"
	"math"
	"reflect"
	"strings"
	"testing"

	"cloudwind/cooling"
	"cloudwind/model"
)

// The scenarios tested here are cloudwind's demo scenarios (fictional,
// demos.go); the expectations are rules of this package: demos are labelled
// fictional, valid, and chosen to make the built-in criteria disagree.

func TestDemoScenarios(t *testing.T) {
	demos, err := Demos()
	if err != nil {
		t.Fatalf("Demos: %v", err)
	}
	if len(demos) < 3 || len(demos) > 5 {
		t.Errorf("Demos returned %d demos, want 3 to 5", len(demos))
	}
	seen := map[string]bool{}
	for _, d := range demos {
		if !d.Demo || !strings.HasPrefix(d.Name, "Demo (fictional): ") || !strings.Contains(d.Description, "Invented numbers") {
			t.Errorf("demo %q: Demo = %v, description %q; want Demo set and both texts labelled fictional", d.Name, d.Demo, d.Description)
		}
		if seen[d.Name] {
			t.Errorf("demo name %q appears twice", d.Name)
		}
		seen[d.Name] = true
		if err := d.Params.Validate(); err != nil {
			t.Errorf("demo %q: Validate: %v", d.Name, err)
		}
		// "builtin" names the built-in curve, the one the disagreement test uses.
		if d.Cooling != "builtin" || d.Table != nil {
			t.Errorf("demo %q uses cooling %q %q, want \"builtin\"", d.Name, d.Cooling, d.Table)
		}
		// A demo saved by the explorer must read back unchanged.
		var b bytes.Buffer
		if err := Write(&b, d); err != nil {
			t.Fatalf("demo %q: Write: %v", d.Name, err)
		}
		back, err := Parse(&b, "saved.toml")
		if err != nil || !reflect.DeepEqual(back, d) {
			t.Errorf("demo %q: saved and read back = %+v, %v; want it unchanged", d.Name, back, err)
		}
	}
}

func TestDemoScenariosDisagree(t *testing.T) {
	demos, err := Demos()
	if err != nil {
		t.Fatalf("Demos: %v", err)
	}
	b, err := cooling.NewBuiltin()
	if err != nil {
		t.Fatal(err)
	}
	cs := model.BuiltinCriteria()
	disagreements, caution := 0, false
	for _, d := range demos {
		cf, err := b.At(d.Params.Metallicity)
		if err != nil {
			t.Fatal(err)
		}
		r, err := model.Evaluate(d.Params, cf, cs)
		if err != nil {
			t.Fatalf("demo %q: Evaluate: %v", d.Name, err)
		}
		// The adiabatic baseline always says destroyed; disagreement counts
		// among the criteria that use cooling.
		var survive, destroyed []string
		for i, c := range r.Criteria {
			switch {
			case c.Cool == model.CoolNone:
			case r.Outcomes[i].Verdict == model.Survives:
				survive = append(survive, c.ID)
			default:
				destroyed = append(destroyed, c.ID)
			}
		}
		if len(survive) > 0 && len(destroyed) > 0 {
			disagreements++
		} else {
			t.Errorf("demo %q: the criteria with cooling agree (survive %v, destroyed %v); a demo should show disagreement", d.Name, survive, destroyed)
		}
		// A demo below 10⁴ K, where the built-in curve is its low-temperature
		// part, so that the cooling below the CIE range is on show: a finite
		// cooling time from Koyama & Inutsuka 2002 (cooling/builtin.go).
		if d.Params.TCloud < 1e4 && r.LambdaCold > 0 && !math.IsInf(float64(r.TCoolCold), 0) {
			caution = true
		}
	}
	if disagreements == 0 {
		t.Error("the built-in criteria agree in every demo")
	}
	if !caution {
		t.Error("no demo has a cloud colder than 10⁴ K with a finite cooling time from the built-in low-temperature part")
	}
}

func TestDemoScenariosConstantCooling(t *testing.T) {
	// With a constant Λ = 3.98e-22 erg cm³ s⁻¹ (an arbitrary test value, no
	// source) every demo still evaluates: the demos do not depend on the
	// cooling curve's range to be valid.
	demos, err := Demos()
	if err != nil {
		t.Fatalf("Demos: %v", err)
	}
	for _, d := range demos {
		r, err := model.Evaluate(d.Params, model.ConstantCooling{Value: 3.98e-22}, model.BuiltinCriteria())
		if err != nil || len(r.Outcomes) != len(model.BuiltinCriteria()) {
			t.Errorf("demo %q with constant cooling: %d outcomes, error %v", d.Name, len(r.Outcomes), err)
		}
	}
}

// TestDemoOutflow: one demo holds an outflow, a valid wind along which
// the built-in criteria disagree about its clouds over a stretch of radii
// (a rule of this package: demos show disagreement).
func TestDemoOutflow(t *testing.T) {
	demos, err := Demos()
	if err != nil {
		t.Fatal(err)
	}
	b, err := cooling.NewBuiltin()
	if err != nil {
		t.Fatal(err)
	}
	found := 0
	for _, d := range demos {
		wp, ok := d.Wind()
		if !ok {
			continue
		}
		found++
		w, err := model.NewWind(wp)
		if err != nil {
			t.Fatalf("demo %q: NewWind: %v", d.Name, err)
		}
		cf, err := b.At(wp.Metallicity)
		if err != nil {
			t.Fatal(err)
		}
		prof, err := w.Profile(d.Params.RCloud, cf, model.BuiltinCriteria(), model.ProfileGrid{})
		if err != nil {
			t.Fatalf("demo %q: Profile: %v", d.Name, err)
		}
		disagree := 0
		for _, row := range prof.Rows {
			if row.Err == nil && row.Disagree {
				disagree++
			}
		}
		if disagree < len(prof.Rows)/4 {
			t.Errorf("demo %q: the criteria disagree at %d of %d radii; want a stretch of at least a quarter", d.Name, disagree, len(prof.Rows))
		}
		// [inputs] is the wind at R, rounded: within 5% in χ and P/k_B.
		at := w.At(wp.Radius)
		if math.Abs(at.Chi/d.Params.Chi-1) > 0.05 || math.Abs(float64(at.Pressure/d.Params.Pressure)-1) > 0.05 || d.Params.Mach != 1 {
			t.Errorf("demo %q: [inputs] χ = %g, M = %g, P/k_B = %g; the wind at R has %g, 1, %g", d.Name, d.Params.Chi, d.Params.Mach, float64(d.Params.Pressure), at.Chi, float64(at.Pressure))
		}
	}
	if found != 1 {
		t.Errorf("%d demos hold an outflow, want 1", found)
	}
}
