package model

import "math"

// statusFromMemory marks constants that were not checked against the paper.
const statusFromMemory = "from memory — check the paper"

// BuiltinCriteria returns the criteria cloudwind ships, in display order.
// Their forms and defaults follow the physics reference §5.12; every
// constant not checked against its paper has Verified = false and says so
// in Status. A criteria file can correct any of them by id.
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
				Chi: Interval{10, 1000}, Mach: Interval{0.5, 1.5}, TCloud: Interval{1e4, 4e4},
				Status: "from memory: χ ≈ 10–1000, M ≈ 0.5–1.5, cooling floors 10⁴–4×10⁴ K; χ = 100 canonical",
			},
			Note: "clouds survive and grow when mixed gas cools faster than the cloud is crushed",
		},
		{
			ID:       "li-2020",
			Label:    "Li et al. 2020",
			Citation: Citation{Authors: "Li, Hopkins, Squire & Hummels", Year: 2020, Journal: "MNRAS 492, 1841", ArXiv: "1909.02632"},
			Cool:     CoolHot, Dyn: DynCloudCrushing, Alpha: 10, Beta: 0,
			Verified: false,
			Status:   "form (cloud lifetime longer than the cooling time of swept-up wind gas) confirmed from the abstract; α = 10 (t_life ≈ 10 t_cc) " + statusFromMemory,
			Range:    Calibration{Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded(), Status: "not known"},
			Note:     "clouds grow when they outlive the cooling time of the wind gas they sweep up",
		},
		{
			ID:       "sparre-2020",
			Label:    "Sparre et al. 2020",
			Citation: Citation{Authors: "Sparre, Pfrommer & Ehlert", Year: 2020, Journal: "MNRAS 499, 4261", ArXiv: "2008.09118"},
			Cool:     CoolHot, Dyn: DynCloudCrushing, Alpha: 10, Beta: 0,
			Verified: false,
			Status:   "that the hot-wind cooling time sets the transition is confirmed from the abstract; the transition value α = 10 is " + statusFromMemory,
			Range:    Calibration{Chi: Unbounded(), Mach: Unbounded(), TCloud: Unbounded(), Status: "not known"},
			Note:     "the hot-wind cooling time, not that of mixed gas, sets the transition radius",
		},
		{
			ID:       "abruzzo-2023",
			Label:    "Abruzzo et al. 2023",
			Citation: Citation{Authors: "Abruzzo, Fielding & Bryan", Year: 2023, Journal: "preprint (ApJ 2024, reference from memory)", ArXiv: "2307.03228"},
			Cool:     CoolMinMix, Dyn: DynShear, Alpha: 1, Beta: 0,
			Verified: false,
			Status:   "form " + statusFromMemory + "; α = 1 chosen so that it agrees with gronke-oh-2018 near χ = 100 (a cloudwind choice, not the paper's number)",
			Range: Calibration{
				Chi: Interval{100, 1000}, Mach: Interval{1, inf}, TCloud: Unbounded(),
				Status: "supersonic winds and χ = 1000 confirmed from the abstract; the lower χ bound is from memory",
			},
			Note: "clouds grow if they mix and cool hot gas faster than it flows past the cloud",
		},
		{
			ID:       "farber-gronke-2022",
			Label:    "Farber & Gronke 2022",
			Citation: Citation{Authors: "Farber & Gronke", Year: 2022, Journal: "MNRAS 510, 551 (reference from memory)", ArXiv: "2107.07991"},
			Cool:     CoolMix, Dyn: DynCloudCrushing, Alpha: 1, Beta: -0.5,
			Verified: false,
			Status:   "large-χ tightening (χ/100)^-1/2 " + statusFromMemory + "; that the criteria compare cooling times with t_cc is confirmed from the abstract",
			Range: Calibration{
				Chi: Interval{100, 1e4}, Mach: Unbounded(), TCloud: Unbounded(),
				Status: "from memory: clouds colder than 10⁴ K, hence large χ",
			},
			Note: "χ-corrected mixed-gas criterion for cold, dense clouds",
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
