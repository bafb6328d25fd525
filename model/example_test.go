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
	// li-2020             r_crit = 22.1   pc  destroyed
	// sparre-2020         r_crit = 25.5   pc  destroyed
	// abruzzo-2023        r_crit = 0.255  pc  survives-and-grows
	// farber-gronke-2022  r_crit = 2.55   pc  destroyed
	// tan-oh-gronke-2023  r_crit = 123    pc  destroyed
	// turbulent-wind-2025 r_crit = 2.55   pc  destroyed
	// turbulent-box       r_crit = 2.55   pc  destroyed
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
// (Klein, McKee & Colella 1994: t_cc = χ^{1/2} r_cl/v_wind).
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
	// t_cool,mix / t_cc < (χ/100)^-0.5; below 10000 K: the same test for the 10000 K gas and for the cold side, transformed when only the first passes
	// 0.316
}

// Plan the wind-tunnel run of the planner's derived step-count check:
// χ = 100, M = 1.5, 16 cells per cloud radius, C = 0.3, 20 t_cc, in a
// cloud-tracking frame with the default 40 × 20 × 20 r_cl box, on a mesh
// of 16³-cell blocks.
func ExampleMakePlan() {
	p := model.Fiducial() // P/k_B = 1e3 K cm⁻³, T_cl = 1e4 K, r_cl = 1 pc
	p.Mach, p.DensityProduct, p.RCloud = 1.5, model.N2, 10*model.Parsec
	r, err := model.Evaluate(p, model.ConstantCooling{Value: model.CoolingRate(math.Pow(10, -21.4))}, model.BuiltinCriteria())
	if err != nil {
		fmt.Println(err)
		return
	}
	pl, err := model.MakePlan(&r, model.PlanSettings{RunTcc: 20, Tracking: true, Block: 16})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Δx = %.3g pc, grid %d × %d × %d = %.3g cells\n", float64(pl.Dx/model.Parsec), pl.Nx, pl.Ny, pl.Nz, pl.Cells)
	fmt.Printf("t_end = %.3g t_cc (mass doubles at %.3g t_cc, t_cool,hot = %.3g t_cc), %.3g steps\n", pl.RunTcc, pl.TDoubleTcc, pl.TCoolHotTcc, pl.Steps)
	fmt.Printf("%.3g core-hours, %.3g GB\n", pl.CoreHours, pl.MemoryBytes/1e9)
	for _, R := range []float64{8, 32} {
		g := pl.AtResolution(R)
		fmt.Printf("R = %g: %.3g cells, %.3g core-hours\n", R, g.Cells, g.CoreHours)
	}
	// Output:
	// Δx = 0.625 pc, grid 640 × 320 × 320 = 6.55e+07 cells
	// t_end = 20 t_cc (mass doubles at 8.51 t_cc, t_cool,hot = 38.3 t_cc), 1.78e+04 steps
	// 324 core-hours, 16.8 GB
	// R = 8: 8.19e+06 cells, 20.2 core-hours
	// R = 32: 5.24e+08 cells, 5.18e+03 core-hours
}

// Plan the simulations that tell the built-in criteria apart at the
// Gronke & Oh (2018) fiducial problem (χ = 100, M = 1, Λ = 10^-21.4, 𝒩 = n²),
// in a cloud-tracking frame.
func ExampleComparePlans() {
	p := model.Fiducial()
	p.DensityProduct = model.N2
	cf := model.ConstantCooling{Value: model.CoolingRate(math.Pow(10, -21.4))}
	r, err := model.Evaluate(p, cf, model.BuiltinCriteria())
	if err != nil {
		fmt.Println(err)
		return
	}
	cmp, err := model.ComparePlans(&r, model.PlanSettings{Tracking: true})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, c := range cmp {
		pl := c.Plan
		fmt.Printf("%v vs %v: r_cl = %.3g pc for %.3g t_cc on the branch of %s, %.3g core-hours\n",
			c.LowerIDs, c.UpperIDs, float64(c.RCloud/model.Parsec), pl.RunTcc, pl.Criterion, pl.CoreHours)
		fmt.Printf("  survive %v\n  destroy %v\n", c.Survive, c.Destroy)
	}
	// Output:
	// [abruzzo-2023] vs [gronke-oh-2018 farber-gronke-2022 turbulent-wind-2025 turbulent-box]: r_cl = 0.807 pc for 16 t_cc on the branch of abruzzo-2023, 310 core-hours
	//   survive [abruzzo-2023]
	//   destroy [gronke-oh-2018 li-2020 sparre-2020 farber-gronke-2022 tan-oh-gronke-2023 turbulent-wind-2025 turbulent-box adiabatic]
	// [gronke-oh-2018 farber-gronke-2022 turbulent-wind-2025 turbulent-box] vs [li-2020]: r_cl = 7.51 pc for 10 t_cc on the branch of gronke-oh-2018, 194 core-hours
	//   survive [gronke-oh-2018 abruzzo-2023 farber-gronke-2022 turbulent-wind-2025 turbulent-box]
	//   destroy [li-2020 sparre-2020 tan-oh-gronke-2023 adiabatic]
	// [li-2020] vs [sparre-2020]: r_cl = 23.8 pc for 10 t_cc on the branch of li-2020, 194 core-hours
	//   survive [gronke-oh-2018 li-2020 abruzzo-2023 farber-gronke-2022 turbulent-wind-2025 turbulent-box]
	//   destroy [sparre-2020 tan-oh-gronke-2023 adiabatic]
	// [sparre-2020] vs [tan-oh-gronke-2023]: r_cl = 56.1 pc for 10 t_cc on the branch of sparre-2020, 194 core-hours
	//   survive [gronke-oh-2018 li-2020 sparre-2020 abruzzo-2023 farber-gronke-2022 turbulent-wind-2025 turbulent-box]
	//   destroy [tan-oh-gronke-2023 adiabatic]
}

// Evolve a 30 pc cloud in the fiducial wind. It lies above the
// gronke-oh-2018 threshold radius (≈ 13 pc with this cooling function),
// so it grows and is entrained.
func ExampleEvolve() {
	p := model.Fiducial()
	p.RCloud = 30 * model.Parsec
	s, err := model.Derive(p, model.PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7})
	if err != nil {
		fmt.Println(err)
		return
	}
	c, _ := model.CriterionByID(model.BuiltinCriteria(), "gronke-oh-2018")
	tr, err := model.Evolve(&s, c, model.EvolveSettings{TEnd: 100})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("t_cool,mix/t_cc = %.3g, t_grow,0 = %.3g t_cc\n", tr.Ratio0, tr.TGrow0)
	fmt.Printf("mass doubled at %.3g t_cc, entrained at %.3g t_cc\n", tr.TDouble, tr.TEntrain)
	m, v, x := tr.At(50)
	fmt.Printf("t = 50 t_cc: m = %.3g m0, v = %.3g v_w, x = %.3g r0\n", m, v, x)
	n := len(tr.T) - 1
	fmt.Printf("t = %.3g t_cc: m = %.3g m0, v = %.3g v_w\n", tr.T[n], tr.M[n], tr.V[n])
	// Output:
	// t_cool,mix/t_cc = 0.432, t_grow,0 = 5.71 t_cc
	// mass doubled at 4.32 t_cc, entrained at 16.9 t_cc
	// t = 50 t_cc: m = 103 m0, v = 0.991 v_w, x = 430 r0
	// t = 100 t_cc: m = 836 m0, v = 0.999 v_w
}

// The settings of Evolve with their defaults; each also carries a status
// (here the first of them).
func ExampleEvolveSettings_Constants() {
	ks := model.DefaultEvolveSettings().Constants()
	for _, k := range ks[:7] {
		v := fmt.Sprintf("%.3g", k.Value)
		if k.Text != "" {
			v = k.Text
		}
		fmt.Printf("%-18s %s\n", k.Symbol, v)
	}
	fmt.Println(ks[0].Status)
	// Output:
	// α_v                1
	// f_A                1
	// κ                  4
	// C_D                0.5
	// v_A/v_w            0
	// (Δv/c_s,hot)^1/2   off
	// v0/v_w             0
	// value from memory — check the paper; the form v_mix ∝ c_s,cl (t_cool/t_sc,cl)^-1/4 is confirmed (Tan, Oh & Gronke 2021, abstract)
}

func ExampleFormatNumber() {
	fmt.Println(model.FormatNumber(1e8, 6), model.FormatNumber(2.5e-5, 6), model.FormatNumber(123456.7, 3), model.FormatNumber(-0.1, 6))
	// Output: 1e8 2.5e-5 1.23e5 -0.1
}
