package scenario

import (
	"fmt"
	"strings"
)

// The demo scenarios are fictional settings of cloudwind's own invention.
// Every number in them is made up to show how the published criteria
// disagree; none is a measurement, an observation or a value from a paper.
// They are scenario files, read by Parse like the files
// people save, so the demos exercise the same path.

// demoStarburst is a fast, dense wind: the criteria built on mixed-gas
// cooling and those built on hot-wind cooling disagree.
const demoStarburst = `# cloudwind demo scenario: fictional, invented numbers
[scenario]
name = "Demo (fictional): starburst-like wind"
description = "Invented numbers, no real object: a dense, supersonic wind in which criteria built on mixed-gas cooling and criteria built on hot-wind cooling part ways."
demo = true

[inputs]
chi = 500
mach = 1.5
pressure = 2e5          # P/k_B in K cm^-3
t_cloud = 1e4           # K
radius = 5              # pc
metallicity = 1         # Z/Z_sun

[cooling]
spec = "builtin"
`

// demoCGM is a slow, dilute halo wind around a large cloud: the cloud
// sits between the threshold radii of several criteria.
const demoCGM = `# cloudwind demo scenario: fictional, invented numbers
[scenario]
name = "Demo (fictional): circumgalactic cloud in a slow halo wind"
description = "Invented numbers, no real object: a dilute, subsonic, metal-poor halo wind; the cloud radius falls between the threshold radii of the criteria, and the chi correction matters."
demo = true

[inputs]
chi = 200
mach = 0.6
pressure = 100          # P/k_B in K cm^-3
t_cloud = 1e4           # K
radius = 400            # pc
metallicity = 0.3       # Z/Z_sun

[cooling]
spec = "builtin"
`

// demoClusterCore is a hot (10⁷ K), high-pressure medium with a small
// cloud at χ = 1000.
const demoClusterCore = `# cloudwind demo scenario: fictional, invented numbers
[scenario]
name = "Demo (fictional): hot cluster-core-like medium"
description = "Invented numbers, no real object: a 1e7 K, high-pressure medium flowing slowly past a small cloud at chi = 1000; the threshold radii of the criteria lie far apart."
demo = true

[inputs]
chi = 1000
mach = 0.5
pressure = 3e5          # P/k_B in K cm^-3
t_cloud = 1e4           # K
radius = 1              # pc
metallicity = 0.5       # Z/Z_sun

[cooling]
spec = "builtin"
`

// demoColdClump is a cloud at 10³ K, where the built-in curve is its
// low-temperature part (Koyama & Inutsuka 2002, capped), in the regime of
// Farber & Gronke 2022's three outcomes.
const demoColdClump = `# cloudwind demo scenario: fictional, invented numbers
[scenario]
name = "Demo (fictional): cold dense clump below 1e4 K"
description = "Invented numbers, no real object: a 1000 K clump at chi = 3000, where the built-in curve is Koyama & Inutsuka 2002's neutral-gas fit (capped, no heating); watch Farber & Gronke 2022's three outcomes and the criteria calibrated on warmer clouds."
demo = true

[inputs]
chi = 3000
mach = 1
pressure = 1e4          # P/k_B in K cm^-3
t_cloud = 1000          # K
radius = 0.5            # pc
metallicity = 1         # Z/Z_sun

[cooling]
spec = "builtin"
`

// demoOutflow is a starburst-driven Chevalier & Clegg wind carrying 5 pc
// clouds; [inputs] is the wind at its injection radius R (χ, M = 1 and
// P/k_B there, rounded), where the other views start.
const demoOutflow = `# cloudwind demo scenario: fictional, invented numbers
[scenario]
name = "Demo (fictional): clouds in a starburst-driven outflow"
description = "Invented numbers, no real object: a Chevalier & Clegg wind from 20 M_sun/yr of star formation inside 200 pc, carrying 5 pc clouds; the criteria part ways from about 0.5 R to 20 R. The inputs are the wind at R."
demo = true

[inputs]
chi = 1250              # the wind at r = R: T(R)/T_cl
mach = 1
pressure = 3e7          # P/k_B in K cm^-3
t_cloud = 1e4           # K
radius = 5              # pc
metallicity = 1         # Z/Z_sun

[cooling]
spec = "builtin"

[outflow]
sfr = 20                # M_sun/yr
energy_loading = 0.6    # alpha
mass_loading = 0.5      # beta
injection_radius = 200  # pc
`

// Demos returns cloudwind's demo scenarios, in display order:
// fictional settings, labelled so in Name and Description, with Demo set.
// It returns an error only if a demo file fails to parse, which the tests
// rule out.
func Demos() ([]Scenario, error) {
	files := []struct{ name, text string }{
		{"demo/starburst.toml", demoStarburst},
		{"demo/cgm.toml", demoCGM},
		{"demo/cluster-core.toml", demoClusterCore},
		{"demo/cold-clump.toml", demoColdClump},
		{"demo/outflow.toml", demoOutflow},
	}
	out := make([]Scenario, 0, len(files))
	for _, f := range files {
		s, err := Parse(strings.NewReader(f.text), f.name)
		if err != nil {
			return nil, fmt.Errorf("demo scenario: %w", err)
		}
		out = append(out, s)
	}
	return out, nil
}
