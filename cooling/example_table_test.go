package cooling_test

import (
	"fmt"
	"math"
	"strings"

	"cloudwind/cooling"
)

// A table of cloudwind's own layout: directives at the top, then log T and
// one log Λ column per metallicity, per n_e n_H (synthetic values).
func ExampleParseTable() {
	const src = `# cloudwind-table
# norm: nenH
# columns: T=1 lambda=2,3
# log: T=yes lambda=yes
# Z: 0.1 1
# y: 0.0851
4.5  -21.9  -21.5
5.0  -21.7  -21.0
5.5  -21.8  -21.1
6.0  -22.3  -21.8
`
	tab, err := cooling.ParseTable(strings.NewReader(src), "mytable.txt", cooling.TableOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	lo, hi, _ := tab.ZRange()
	fmt.Printf("source normalisation %s, Z from %g to %g\n", tab.Meta().Normalisation.Symbol(), lo, hi)
	for _, w := range tab.Meta().Warnings {
		fmt.Println("warning:", w)
	}
	p, err := tab.At(0.55) // halfway in Z: linear, not logarithmic
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Λ(10^5 K, Z = 0.55) = %.3g erg cm³ s⁻¹ per n_H²\n", float64(p.Lambda(1e5)))
	// Output:
	// source normalisation n_e n_H, Z from 0.1 to 1
	// warning: n_e/n_H = 1+2y = 1.17 assumed (fully ionised H+He)
	// warning: 3 steps wider than 0.2 dex in log T (first at line 8): log-log interpolation across them is coarse
	// Λ(10^5 K, Z = 0.55) = 7.02e-22 erg cm³ s⁻¹ per n_H²
}

// Errors name the file and line.
func ExampleParseError() {
	const src = "5e3 -3e-23\n1e4 1.0e-22\n3e4 2.0e-22\n"
	norm := cooling.PerNH2
	_, err := cooling.ParseTable(strings.NewReader(src), "w09.txt", cooling.TableOptions{Norm: &norm})
	fmt.Println(err)
	// Dropping the rows below 10^4 K explicitly loads the rest.
	tab, err := cooling.ParseTable(strings.NewReader(src), "w09.txt", cooling.TableOptions{Norm: &norm, ClipBelow: 1e4})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, w := range tab.Meta().Warnings {
		fmt.Println("warning:", w)
	}
	// Output:
	// w09.txt:1: column 2: Λ = -3e-23 at T = 5000 K: net heating (Λ ≤ 0): clip the rows below a temperature to drop them
	// warning: 1 row below T = 10000 K dropped (clip below), 1 of them with net heating
	// warning: 1 step wider than 0.2 dex in log T (first at line 3): log-log interpolation across them is coarse
}

// A Wiersma et al. 2009-style table (T linear; H+He and metals-only
// columns, per n_H²): any Z ≥ 0 is Λ_HHe + Z Λ_metals (synthetic values).
func ExampleTable_At() {
	const src = `# T        HHe       ne/nH  metals
1.0e4  2.0e-24  0.01  4.0e-23
1.0e5  2.0e-23  1.16  5.0e-22
1.0e6  5.0e-24  1.17  1.0e-22
`
	norm := cooling.PerNH2
	tab, err := cooling.ParseTable(strings.NewReader(src), "w09.txt", cooling.TableOptions{Norm: &norm, HHeColumn: 2, MetalsColumn: 4})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, z := range []float64{0, 0.3, 1} {
		p, err := tab.At(z)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("Z = %.1f: Λ(10^5 K) = %.3g\n", z, float64(p.Lambda(1e5)))
	}
	_, err = tab.At(math.NaN())
	fmt.Println(err)
	// Output:
	// Z = 0.0: Λ(10^5 K) = 2e-23
	// Z = 0.3: Λ(10^5 K) = 1.7e-22
	// Z = 1.0: Λ(10^5 K) = 5.2e-22
	// z = NaN Z☉, want ≥ 0: metallicity outside the table's range
}
