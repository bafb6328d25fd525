package config_test

import (
	"fmt"
	"strings"

	"cloudwind/config"
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
	cs, err := config.LoadCriteria(strings.NewReader(file), "my.toml", model.BuiltinCriteria())
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, id := range []string{"li-2020", "my-2026"} {
		c, _ := model.CriterionByID(cs, id)
		fmt.Printf("%s: %s, threshold at χ = 1000: %.3g, verified: %v\n", c.ID, c.Formula(), c.Threshold(1000), c.Verified)
		fmt.Printf("  status: %s\n", c.Status)
	}

	_, err = config.LoadCriteria(strings.NewReader("[[criterion]]\nid = \"li-2020\"\nalpah = 5\n"), "typo.toml", model.BuiltinCriteria())
	fmt.Println(err)
	// The threshold of my-2026 is α (χ/100)^β = 1 × 10^-0.5 = 0.316 from the
	// file's α and β; the built-in li-2020 form is in model/builtin.go.

	// Output:
	// li-2020: t_cool,hot / t_cc < 5, threshold at χ = 1000: 5, verified: false
	//   status: changed by criteria file my.toml: not verified
	// my-2026: t_cool,mix / t_cc < (χ/100)^-0.5, threshold at χ = 1000: 0.316, verified: false
	//   status: from criteria file my.toml, no status given
	// typo.toml:3: unknown key "alpah" (did you mean "alpha"?)
}
