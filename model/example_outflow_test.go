package model_test

import (
	"fmt"

	"cloudwind/model"
)

// The fiducial outflow (SFR = 10 M☉ yr⁻¹, α = β = 1, R = 300 pc) at a few
// radii: subsonic inside R, M = 1 at R, supersonic and cooling
// adiabatically outside, χ falling with the wind's temperature.
func ExampleNewWind() {
	w, err := model.NewWind(model.FiducialWind())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Ė = %.3g erg/s, Ṁ = %.3g M☉/yr, v_∞ = %.3g km/s, T(0) = %.3g K\n", float64(w.EnergyRate),
		float64(w.MassRate/model.SolarMassPerYear), float64(w.VInf/model.KilometrePerSecond), float64(w.TCentre))
	for _, f := range []float64{0.5, 1, 2, 10} {
		p := w.At(model.Length(f) * w.Params.Radius)
		fmt.Printf("r = %-3g R: M = %-5.3g n = %-8.3g cm⁻³ P/k = %-8.3g K cm⁻³ χ = %.3g\n", f, p.Mach, float64(p.N), float64(p.Pressure), p.Chi)
	}
	fmt.Printf("χ = 1 at %.3g R\n", float64(w.RChiOne/w.Params.Radius))
	// Output:
	// Ė = 3e+42 erg/s, Ṁ = 10 M☉/yr, v_∞ = 976 km/s, T(0) = 1.38e+07 K
	// r = 0.5 R: M = 0.181 n = 2.87     cm⁻³ P/k = 3.93e+07 K cm⁻³ χ = 1.37e+03
	// r = 1   R: M = 1     n = 1.19     cm⁻³ P/k = 1.24e+07 K cm⁻³ χ = 1.04e+03
	// r = 2   R: M = 3.44  n = 0.167    cm⁻³ P/k = 4.68e+05 K cm⁻³ χ = 280
	// r = 10  R: M = 11.5  n = 0.00604  cm⁻³ P/k = 1.85e+03 K cm⁻³ χ = 30.6
	// χ = 1 at 129 R
}

// Every built-in criterion along the outflow for a 1 pc cloud at rest at
// each radius, with an analytic cooling function: where Gronke & Oh
// (2018) put the threshold, whether the criteria disagree, and whether
// the wind is still adiabatic there.
func ExampleWind_Profile() {
	w, err := model.NewWind(model.FiducialWind())
	if err != nil {
		fmt.Println(err)
		return
	}
	cf := model.PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}
	prof, err := w.Profile(model.Parsec, cf, model.BuiltinCriteria(), model.ProfileGrid{Points: 4})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, row := range prof.Rows {
		o := row.Outcomes[0] // gronke-oh-2018
		fmt.Printf("r = %-5.3g R: χ = %-6.3g M = %-5.3g r_crit = %-8.3g pc %-18v disagree %-5v adiabatic %v\n",
			float64(row.Wind.R/w.Params.Radius), row.Wind.Chi, row.Wind.Mach, float64(o.RCrit/model.Parsec), o.Verdict, row.Disagree, row.Adiabatic)
	}
	if prof.Cools {
		fmt.Printf("the wind cools within a flow time beyond %.3g R\n", float64(prof.RCool/w.Params.Radius))
	}
	// Output:
	// r = 0.1   R: χ = 1.38e+03 M = 0.033 r_crit = 0.000343 pc survives-and-grows disagree false adiabatic true
	// r = 1     R: χ = 1.04e+03 M = 1     r_crit = 0.0246   pc survives-and-grows disagree true  adiabatic true
	// r = 10    R: χ = 30.6   M = 11.5  r_crit = 16.3     pc destroyed          disagree true  adiabatic true
	// r = 100   R: χ = 1.41   M = 54.3  r_crit = 2.65e+03 pc destroyed          disagree true  adiabatic false
	// the wind cools within a flow time beyond 24.2 R
}

// A 1 pc cloud launched at rest at R on the Gronke & Oh (2018) branch: it
// swells as the wind's pressure falls and grows while carried out, until
// the criterion fails downstream and it is destroyed. With this cooling
// function its growth rate rises along the way (a spread of dm/dt larger
// than its mean): the constant rate Gronke & Oh (2020) state for such
// winds holds here only for some cloud sizes.
func ExampleWind_Carry() {
	w, err := model.NewWind(model.FiducialWind())
	if err != nil {
		fmt.Println(err)
		return
	}
	cf := model.PowerLawCooling{L0: 4e-22, T0: 1e5, Slope: -0.7}
	c, _ := model.CriterionByID(model.BuiltinCriteria(), "gronke-oh-2018")
	cc, err := w.Carry(model.Parsec, cf, c, model.CarrySettings{R0: w.Params.Radius})
	if err != nil {
		fmt.Println(err)
		return
	}
	bigR := w.Params.Radius
	fmt.Printf("m0 = %.3g M☉, stop: %v at %.3g R after %.3g Myr\n", float64(cc.M0/model.SolarMass), cc.Stop,
		float64(cc.RStop/bigR), float64(cc.T[len(cc.T)-1]/model.Megayear))
	fmt.Printf("mass doubled at %.3g R\n", float64(cc.RDouble/bigR))
	for _, f := range []float64{2, 5} {
		p, _ := cc.AtRadius(model.Length(f) * bigR)
		fmt.Printf("r = %g R: m = %.3g m0, v = %.3g v_w, χ = %.3g, r_cl = %.3g pc\n", f, p.M, float64(p.V/p.VWind), p.Chi, float64(p.RCl/model.Parsec))
	}
	if lo, hi, ok := cc.GrowingPath(); ok {
		g, _ := cc.GrowthSpread(lo, hi)
		fmt.Printf("grows from %.3g to %.3g R; dm/dt spread %.3g, d ln ṁ/d ln r = %.3g\n", float64(lo/bigR), float64(hi/bigR), g.Spread, g.SlopeR)
	}
	// Output:
	// m0 = 77.1 M☉, stop: destroyed at 63.8 R after 21.4 Myr
	// mass doubled at 1.47 R
	// r = 2 R: m = 2.62 m0, v = 0.553 v_w, χ = 280, r_cl = 4.11 pc
	// r = 5 R: m = 5.4 m0, v = 0.763 v_w, χ = 78, r_cl = 15.2 pc
	// grows from 1 to 35.8 R; dm/dt spread 1.26, d ln ṁ/d ln r = 0.352
}
