package model_test

import (
	"fmt"
	"math"

	"cloudwind/model"
)

// Evaluate the Gronke & Oh (2018) fiducial problem with their cooling
// normalisation and the convention f = 3/2, 𝒩 = n².
func ExampleEvaluate() {
	p := model.Fiducial() // χ = 100, M = 1, P/k_B = 1e3 K cm⁻³, T_cl = 1e4 K, r_cl = 1 pc
	p.DensityProduct = model.N2
	cf := model.ConstantCooling{Value: model.CoolingRate(math.Pow(10, -21.4))}
	r, err := model.Evaluate(p, cf, model.BuiltinCriteria())
	if err != nil {
		fmt.Println(err)
		return
	}
	for i, c := range r.Criteria {
		o := r.Outcomes[i]
		if !o.HasThreshold() {
			fmt.Printf("%-19s no threshold       %v\n", c.ID, o.Verdict)
			continue
		}
		fmt.Printf("%-19s r_crit = %-6.3g pc  %v\n", c.ID, float64(o.RCrit/model.Parsec), o.Verdict)
	}
	// Output:
	// gronke-oh-2018      r_crit = 2.55   pc  destroyed
	// li-2020             r_crit = 25.5   pc  destroyed
	// sparre-2020         r_crit = 25.5   pc  destroyed
	// abruzzo-2023        r_crit = 0.255  pc  survives-and-grows
	// farber-gronke-2022  r_crit = 2.55   pc  destroyed
	// adiabatic           no threshold       destroyed
}

// Derive the state and read the timescales.
func ExampleDerive() {
	p := model.Fiducial()
	s, err := model.Derive(p, model.PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("T_hot = %.3g K, v_w = %.3g km/s\n", float64(s.THot), float64(s.VWind/model.KilometrePerSecond))
	fmt.Printf("t_cc = %.3g Myr, t_cool,mix = %.3g Myr\n", float64(s.TCC/model.Megayear), float64(s.TCoolMix/model.Megayear))
	// Output:
	// T_hot = 1e+06 K, v_w = 151 km/s
	// t_cc = 0.0646 Myr, t_cool,mix = 0.837 Myr
}

// Validate names the field that is wrong.
func ExampleParams_Validate() {
	p := model.Fiducial()
	p.Chi = 0.5
	fmt.Println(p.Validate())
	// Output:
	// chi: must be greater than 1 (got 0.5)
}

// CloudCrushingTime of a 100 pc cloud at χ = 100 in a 100 km/s wind
// (physics reference §3.4).
func ExampleCloudCrushingTime() {
	t := model.CloudCrushingTime(100*model.Parsec, 100, 100*model.KilometrePerSecond)
	fmt.Printf("%.4g Myr\n", float64(t/model.Megayear))
	// Output:
	// 9.778 Myr
}

// A criterion's general form and its threshold at χ = 1000.
func ExampleCriterion_Threshold() {
	c, _ := model.CriterionByID(model.BuiltinCriteria(), "farber-gronke-2022")
	fmt.Println(c.Formula())
	fmt.Printf("%.3g\n", c.Threshold(1000))
	// Output:
	// t_cool,mix / t_cc < (χ/100)^-0.5
	// 0.316
}
