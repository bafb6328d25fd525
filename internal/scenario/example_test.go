package scenario_test

import (
	"fmt"
	"os"
	"strings"

	"cloudwind/internal/scenario"
	"cloudwind/model"
)

func ExampleLoadCriteria() {
	const file = `# my criteria
[[criterion]]
id = "li-2020"
alpha = 5                # changed without verified = true

[[criterion]]
id = "my-2026"
label = "Me et al. 2026"
authors = "Me, You & Them"
year = 2026
journal = ""
arxiv = "2601.00001"
equation = "12"
cooling_time = "mix"
dynamical_time = "t_cc"
alpha = 1.0
beta = -0.5
[criterion.range]
chi = [100, 1000]
`
	cs, err := scenario.LoadCriteria(strings.NewReader(file), "my.toml", model.BuiltinCriteria())
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, id := range []string{"li-2020", "my-2026"} {
		c, _ := model.CriterionByID(cs, id)
		fmt.Printf("%s: %s, threshold at χ = 1000: %.3g, verified: %v\n", c.ID, c.Formula(), c.Threshold(1000), c.Verified)
		fmt.Printf("  status: %s\n", c.Status)
	}

	_, err = scenario.LoadCriteria(strings.NewReader("[[criterion]]\nid = \"li-2020\"\nalpah = 5\n"), "typo.toml", model.BuiltinCriteria())
	fmt.Println(err)
	// The threshold of my-2026 is α (χ/100)^β = 1 × 10^-0.5 = 0.316 from the
	// file's α and β; the built-in li-2020 form is in model/builtin.go.

	// Output:
	// li-2020: t_cool,shocked / t_cc < 5, threshold at χ = 1000: 5, verified: false
	//   status: changed by criteria file my.toml: not verified
	// my-2026: t_cool,mix / t_cc < (χ/100)^-0.5, threshold at χ = 1000: 0.316, verified: false
	//   status: from criteria file my.toml, no status given
	// typo.toml:3: unknown key "alpah" (did you mean "alpha"?)
}

func ExampleParse() {
	const file = `# cloudwind scenario
[scenario]
name = "My cloud"
[inputs]
chi = 300
radius = 10            # pc
[conventions]
heat_capacity = "isobaric"
`
	s, err := scenario.Parse(strings.NewReader(file), "my.toml")
	if err != nil {
		fmt.Println(err)
		return
	}
	// Inputs left out are those of model.Fiducial(): M = 1, P/k_B = 1e3.
	p := s.Params
	fmt.Printf("%s: chi = %.3g, M = %.3g, P/k_B = %.3g K cm^-3, r_cl = %.3g pc, f = %.3g\n",
		s.Name, p.Chi, p.Mach, float64(p.Pressure), float64(p.RCloud/model.Parsec), p.HeatCapacity.Factor())

	if err := scenario.Write(os.Stdout, s); err != nil {
		fmt.Println(err)
	}

	_, err = scenario.Parse(strings.NewReader("[inputs]\nchi = 100\nradius = 2e7\n"), "big.toml")
	fmt.Println(err)

	// Output:
	// My cloud: chi = 300, M = 1, P/k_B = 1e+03 K cm^-3, r_cl = 10 pc, f = 2.5
	// # cloudwind scenario
	// [scenario]
	// name = "My cloud"
	// demo = false
	//
	// [inputs]
	// chi = 300                # rho_cl/rho_hot
	// mach = 1
	// pressure = 1000          # P/k_B in K cm^-3
	// t_cloud = 10000          # K
	// radius = 10              # pc
	// metallicity = 1          # Z/Z_sun
	//
	// [conventions]
	// heat_capacity = "isobaric"
	// big.toml:3: radius: must not exceed 1e7 pc (got 2e7 pc)
}
