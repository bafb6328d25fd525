package model

import "math"

// statusFromMemory marks constants that were not checked against the paper.
const statusFromMemory = "from memory — check the paper"

// BuiltinCriteria returns the criteria cloudwind ships, in display order.
// Their forms follow the abstract of each cited paper; constants the
// abstracts do not give are from memory or cloudwind's choice, as each
// Status says. Every constant not checked against its paper has Verified =
// false and says so in Status. A criteria file can correct any of them by
// id.
func BuiltinCriteria() []Criterion {
	inf := math.Inf(1)
	return []Criterion{
		{
			ID:       "gronke-oh-2018",
			Label:    "Gronke & Oh 2018",
			Citation: Citation{Authors: "Gronke & Oh", Year: 2018, Journal: "MNRAS 480, L111", ArXiv: "1806.02728"},
			Cool:     CoolMix, Dyn: DynCloudCrushing, Alpha: 1, Beta: 0,
			Verified: true,
			Status:   "criterion t_cool,mix/t_cc < 1 confirmed from the abstract; its cooling convention is not stated there",
			Range: Calibration{
				Chi: Interval{10, 1000}, Mach: Interval{0.5, 1.5}, TCloud: Interval{1e4, 4e4}, MachTurb: Interval{0, 0},
				Status: "from memory: χ ≈ 10–1000, M ≈ 0.5–1.5, cooling floors 10⁴–4×10⁴ K; χ = 100 canonical",
			},
			Note: "clouds survive and grow when mixed gas cools faster than the cloud is crushed",
		},
		{
			ID:       "li-2020",
			Label:    "Li et al. 2020",
			Citation: Citation{Authors: "Li, Hopkins, Squire & Hummels", Year: 2020, Journal: "MNRAS 492, 1841", ArXiv: "1909.02632"},
			Cool:     CoolShocked, Dyn: DynCloudCrushing, Alpha: 10, Beta: 0,
			Verified: false,
			Status:   "form confirmed from the abstract: the cloud survives once its lifetime exceeds the cooling time of gas swept up in the leading bow shock (here the Rankine–Hugoniot post-shock state for M > 1, the stagnation state for M ≤ 1: cloudwind's reading); the lifetime t_life ≈ α t_cc with α = 10 " + statusFromMemory,
			Range:    Calibration{Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded(), Status: "not stated in the abstract"},
			Note:     "clouds grow when they outlive the cooling time of the wind gas their bow shock sweeps up",
		},
		{
			ID:       "sparre-2020",
			Label:    "Sparre et al. 2020",
			Citation: Citation{Authors: "Sparre, Pfrommer & Ehlert", Year: 2020, Journal: "MNRAS 499, 4261", ArXiv: "2008.09118"},
			Cool:     CoolHot, Dyn: DynCloudCrushing, Alpha: 10, Beta: 0,
			Verified: false,
			Status:   "that the hot-wind (unshocked) cooling time sets the transition radius is confirmed from the abstract; the transition value α = 10 is " + statusFromMemory,
			Range:    Calibration{Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded(), Status: "not stated in the abstract"},
			Note:     "the cooling time of the unshocked wind, not that of mixed gas, sets the transition radius",
		},
		{
			ID:       "abruzzo-2023",
			Label:    "Abruzzo et al. 2023",
			Citation: Citation{Authors: "Abruzzo, Fielding & Bryan", Year: 2023, Journal: "preprint (ApJ 2024, reference from memory)", ArXiv: "2307.03228"},
			Cool:     CoolMinMix, Dyn: DynShear, Alpha: 1, Beta: 0,
			Verified: false,
			Status:   "τ_dyn = the cloud-crossing time of a hot fluid element confirmed from the abstract; τ_cool = t_cool,minmix " + statusFromMemory + "; α = 1 is cloudwind's choice (it agrees with gronke-oh-2018 near χ = 100, as the paper says its criterion agrees with an earlier empirical formula), not the paper's number",
			Range: Calibration{
				Chi: Interval{100, 1000}, Mach: Interval{1, inf}, TCloud: Unbounded(),
				Status: "supersonic winds and high density contrasts confirmed from the abstract; the bounds from memory",
			},
			Note: "clouds grow if they mix and cool hot gas faster than it flows past the cloud",
		},
		{
			ID:       "farber-gronke-2022",
			Label:    "Farber & Gronke 2022",
			Citation: Citation{Authors: "Farber & Gronke", Year: 2022, Journal: "MNRAS 510, 551 (reference from memory)", ArXiv: "2107.07991"},
			Cool:     CoolMix, Dyn: DynCloudCrushing, Alpha: 1, Beta: -0.5, WarmTemperature: 1e4,
			Verified: false,
			Status:   "three outcomes (destroyed, survives, transformed entirely to ~10⁴ K gas) for clouds colder than ~10⁴ K, decided by cooling times against t_cc, confirmed from the abstract; the forms are " + statusFromMemory + ": survival when t_cool,mix/t_cc < (χ/100)^-1/2, else transformed when the 10⁴ K gas the cloud would become passes the same test, else destroyed",
			Range: Calibration{
				Chi: Interval{100, 1e4}, Mach: Unbounded(), TCloud: Interval{10, 1e4},
				Status: "clouds colder than 10⁴ K (hence large χ) confirmed from the abstract; the bounds from memory",
			},
			Note: "cold, dense clouds are destroyed, survive, or are transformed to 10⁴ K gas",
		},
		{
			ID:       "tan-oh-gronke-2023",
			Label:    "Tan, Oh & Gronke 2023 (infall)",
			Citation: Citation{Authors: "Tan, Oh & Gronke", Year: 2023, Journal: "MNRAS 520, 2571 (reference from memory)", ArXiv: "2210.06493"},
			Cool:     CoolGrow, Dyn: DynCloudCrushing, Alpha: 4, Beta: 0,
			Verified: true,
			Status:   "survival iff t_grow < 4 t_cc confirmed from the abstract, for clouds falling through a hot halo; t_grow is cloudwind's growth model (its cooling time is the --mix-cooling choice)",
			Range: Calibration{
				Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded(),
				Status: "the infalling-cloud case, not a wind tunnel: apply it to clouds falling under gravity",
			},
			Note: "the infalling-cloud case: a cloud survives when it grows faster than it is crushed",
		},
		{
			ID:       "turbulent-wind-2025",
			Label:    "Turbulent wind (arXiv:2510.03552)",
			Citation: Citation{Authors: "authors not seen", Year: 2025, ArXiv: "2510.03552"},
			Cool:     CoolMix, Dyn: DynTurbulentCC, Alpha: 1, Beta: 0, FMix: DefaultFMix,
			Verified: true,
			Status:   "t_cool,mix/t̃_cc < 1 with t̃_cc = t_cc/(1 + (M_turb/(f_mix M))²)^1/2 and f_mix ~ 0.6 confirmed from the abstract (f_mix quoted as approximate); it reduces to gronke-oh-2018 at M_turb = 0",
			Range: Calibration{
				Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded(), MachTurb: Unbounded(),
				Status: "the calibrated range is not stated in the abstract",
			},
			Note: "turbulence in the wind shortens the effective crushing time",
		},
		{
			ID:       "turbulent-box",
			Label:    "Turbulent box (Gronke+ 2022; George+ 2025)",
			Citation: Citation{Authors: "Gronke, Oh, Ji & Norman 2022 (arXiv:2107.13012); George, Das & Gronke", Year: 2025, ArXiv: "2507.20962"},
			Cool:     CoolMix, Dyn: DynTurbulentCC, Alpha: 1, Beta: -2, FMix: 1,
			Verified: false,
			Status:   "survival for t_cool,mix shorter than the clump's Kelvin–Helmholtz time, with a weak Mach dependence, at χ = 100 (Gronke, Oh, Ji & Norman 2022, abstract) and only for t_cool,mix/t_cc ≲ 0.01 at χ = 1000 (George et al. 2025, abstract), both confirmed; α = 1 at χ = 100 and β = −2, so that the limit is 0.01 at χ = 1000, is cloudwind's two-point reading of them, and t_cc with the turbulent and wind velocities added in quadrature (f = 1) is cloudwind's combination",
			Range: Calibration{
				Chi: Interval{100, 1000}, Mach: Interval{0, 0}, TCloud: Unbounded(), MachTurb: Interval{0.25, 0.75},
				Status: "turbulent boxes without a wind: χ = 100 (Gronke et al. 2022) and χ = 1000 with turbulent Mach 0.25–0.75 (George et al. 2025), confirmed from the abstracts",
			},
			Note: "in turbulent boxes the survival limit on t_cool,mix/t_cc falls steeply with χ",
		},
		{
			ID:       "adiabatic",
			Label:    "Non-radiative baseline",
			Citation: Citation{Authors: "Klein, McKee & Colella", Year: 1994, Journal: "ApJ 420, 213"},
			Cool:     CoolNone, Dyn: DynCloudCrushing,
			Verified: true,
			Status:   "destruction within ~3–10 t_cc confirmed (Nakamura et al. 2006, arXiv:astro-ph/0511016, abstract)",
			Range:    Calibration{Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded(), Status: "applies to any non-radiative cloud"},
			Note:     "without cooling every cloud is destroyed within a few cloud-crushing times",
		},
	}
}

// CriterionByID returns the criterion with the given id from cs.
func CriterionByID(cs []Criterion, id string) (*Criterion, bool) {
	for i := range cs {
		if cs[i].ID == id {
			return &cs[i], true
		}
	}
	return nil, false
}
