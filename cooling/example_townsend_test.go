package cooling_test

import (
	"fmt"

	"cloudwind/cooling"
	"cloudwind/model"
)

// A flat Λ = 10^-22 erg cm³ s⁻¹ from 10^4 to 10^8 K: the isochoric time is
// (3/2)(n_tot/n_H) k ΔT/(n_H Λ).
func ExamplePowerLaw_TimeToCool() {
	p, err := cooling.NewPowerLaw([]float64{4, 8}, []float64{-22, -22}, cooling.Meta{Name: "flat"})
	if err != nil {
		fmt.Println(err)
		return
	}
	gas := cooling.Gas{NH: 1e-3, TotalPerH: 2.25} // fully ionised, y ≈ 0.083
	for _, proc := range []cooling.Process{cooling.Isochoric, cooling.Isobaric} {
		ct, err := p.TimeToCool(proc, gas, 1e6, 1e4, 1e4)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("%s 10^6 → 10^4 K: %.3g Myr (%.2g of it within 0.1 dex of the floor; floor-dominated: %v)\n",
			proc, float64(ct.Time/model.Megayear), ct.FloorFraction, ct.FloorDominated)
	}
	// Output:
	// isochoric 10^6 → 10^4 K: 146 Myr (0.0026 of it within 0.1 dex of the floor; floor-dominated: false)
	// isobaric 10^6 → 10^4 K: 123 Myr (5.8e-05 of it within 0.1 dex of the floor; floor-dominated: false)
}

// TemperatureAfter inverts TimeToCool exactly and stops at the floor.
func ExamplePowerLaw_TemperatureAfter() {
	p, err := cooling.NewPowerLaw([]float64{4, 5.3, 8}, []float64{-23, -21.3, -22.6}, cooling.Meta{Name: "peaked"})
	if err != nil {
		fmt.Println(err)
		return
	}
	gas := cooling.Gas{NH: 1e-2, TotalPerH: 2.25}
	ct, err := p.TimeToCool(cooling.Isobaric, gas, 3e6, 1e4, 1e4)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("3×10^6 K → floor: %.3g Myr\n", float64(ct.Time/model.Megayear))
	for _, tMyr := range []float64{1, 10, 20, 21.5, 30} {
		T, err := p.TemperatureAfter(cooling.Isobaric, gas, 3e6, model.Time(tMyr)*model.Megayear, 1e4)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("after %4g Myr: T = %.3g K\n", tMyr, float64(T))
	}
	// Output:
	// 3×10^6 K → floor: 21.9 Myr
	// after    1 Myr: T = 2.94e+06 K
	// after   10 Myr: T = 2.35e+06 K
	// after   20 Myr: T = 1.12e+06 K
	// after 21.5 Myr: T = 5.93e+05 K
	// after   30 Myr: T = 1e+04 K
}

// Integral gives the bare ∫ T^m/Λ dT, here of Λ = C T^{1/2}: 2(√b − √a)/C.
func ExamplePowerLaw_Integral() {
	p, err := cooling.NewPowerLaw([]float64{4, 6}, []float64{-27, -26}, cooling.Meta{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%.4g K/(erg cm³ s⁻¹)\n", p.Integral(1e4, 1e8, 0)) // 2(10^4 − 10^2)/10^-29
	fmt.Println(p.Integral(5e3, 1e8, 0))                          // below the first node Λ = 0
	// Output:
	// 1.98e+33 K/(erg cm³ s⁻¹)
	// +Inf
}
