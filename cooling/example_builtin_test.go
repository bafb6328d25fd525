package cooling_test

import (
	"errors"
	"fmt"

	"cloudwind/cooling"
	"cloudwind/model"
)

// The built-in curve at a few metallicities: Λ per n_H² at 10^5.5 K and
// at 10^4 K (CIE), and at 10^3 K (the Koyama & Inutsuka 2002 part, capped
// at the CIE value at 10^4 K), and the cap temperature from which the cap
// applies.
func ExampleBuiltin_At() {
	b, err := cooling.NewBuiltin()
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, z := range []float64{0, 0.1, 1} {
		p, err := b.At(z)
		if err != nil {
			fmt.Println(err)
			return
		}
		tc, _ := b.CapTemperature(z)
		fmt.Printf("Z = %.1f: Λ(10^5.5 K) = %.3g, Λ(10^4 K) = %.3g, Λ(10^3 K) = %.3g erg cm^3 s^-1; capped from %.4g K\n",
			z, float64(p.Lambda(316227.766)), float64(p.Lambda(1e4)), float64(p.Lambda(1000)), float64(tc))
	}
	lo, hi := b.HHe().ValidRange()
	fmt.Printf("nodes from %g K to %g K\n", float64(lo), float64(hi))
	// Output:
	// Z = 0.0: Λ(10^5.5 K) = 1.26e-23, Λ(10^4 K) = 6.05e-27, Λ(10^3 K) = 3.9e-45 erg cm^3 s^-1; capped from 5839 K
	// Z = 0.1: Λ(10^5.5 K) = 5.36e-23, Λ(10^4 K) = 6.67e-27, Λ(10^3 K) = 8.08e-28 erg cm^3 s^-1; capped from 5730 K
	// Z = 1.0: Λ(10^5.5 K) = 4.22e-22, Λ(10^4 K) = 1.22e-26, Λ(10^3 K) = 8.08e-27 erg cm^3 s^-1; capped from 2084 K
	// nodes from 10 K to 1e+08 K
}

// The Koyama & Inutsuka (2002) fit for neutral gas: its cooling term, with
// the fine-structure term scaled by Z.
func ExampleKoyamaInutsuka02Lambda() {
	for _, t := range []float64{30, 300, 3000} {
		fmt.Printf("Λ(%g K) = %.3g erg cm^3 s^-1\n", t, float64(cooling.KoyamaInutsuka02Lambda(model.Temperature(t), 1)))
	}
	// Output:
	// Λ(30 K) = 7.14e-29 erg cm^3 s^-1
	// Λ(300 K) = 3.57e-27 erg cm^3 s^-1
	// Λ(3000 K) = 1.49e-26 erg cm^3 s^-1
}

// The ionisation state and the cooling of hydrogen and helium at 10^5 K,
// with the default rates and with KWH96's as published (Cen's factor on
// the He+ excitation term).
func ExamplePrimordialCIE() {
	ion, c := cooling.PrimordialCIE(1e5, 0.0851, cooling.PrimordialOptions{})
	fmt.Printf("n_e/n_H = %.3g, x_He++ = %.3g\n", ion.NeOverNH, ion.XHepp)
	fmt.Printf("Λ = %.3g erg cm^3 s^-1, of which He+ excitation %.2f\n", float64(c.Total()), float64(c.ExcitationHep/c.Total()))
	_, k := cooling.PrimordialCIE(1e5, 0.0851, cooling.KWH96Options())
	fmt.Printf("KWH96 as published: Λ = %.3g erg cm^3 s^-1\n", float64(k.Total()))
	// Output:
	// n_e/n_H = 1.15, x_He++ = 0.821
	// Λ = 9.93e-23 erg cm^3 s^-1, of which He+ excitation 0.89
	// KWH96 as published: Λ = 5.84e-23 erg cm^3 s^-1
}

// Bremsstrahlung of fully ionised gas at 10^8 K (Rybicki & Lightman 1979;
// the values derived).
func ExampleFreeFree() {
	fmt.Printf("C_ff = %.6g\n", cooling.FreeFreePrefactor())
	fmt.Printf("Λ_ff = %.4g erg cm^3 s^-1\n", float64(cooling.FreeFree(1e8, 0.0833, 1.2)))
	// Output:
	// C_ff = 1.42556e-27
	// Λ_ff = 2.661e-23 erg cm^3 s^-1
}

// The Tozzi & Norman (2001) fit refuses temperatures below 0.1 keV.
func ExampleTozziNorman01Lambda() {
	_, err := cooling.TozziNorman01Lambda(1e6)
	fmt.Println(errors.Is(err, cooling.ErrBelowValidity))
	l, _ := cooling.TozziNorman01Lambda(1e7)
	fmt.Printf("%.3g\n", float64(l))
	// Output:
	// true
	// 1.28e-23
}
