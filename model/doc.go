// Package model computes whether a cold cloud in a hot wind survives and
// grows or is destroyed, according to each published criterion: the
// derived state of the cloud–wind problem (temperatures, densities, sound
// speeds, the wind speed, the cloud-crushing, shear, drag and growth times,
// the cooling times of hot, mixed and cold gas and the minimum along the
// mixing isobar, cooling and shattering lengths) and, for every criterion,
// the ratio τ_cool/τ_dyn, the threshold radius r_crit, the margin and the
// verdict. Evolve integrates the semi-analytic growth and entrainment of
// the cloud (mass, velocity and position against t/t_cc, with its own
// adaptive Dormand–Prince 5(4) integrator), and MakePlan and ComparePlans
// turn a scenario into a costed wind-tunnel simulation that can tell the
// criteria apart. Wind is the adiabatic outflow of [CC85], whose χ, Mach
// number and pressure vary with radius: Wind.Profile evaluates every
// criterion along it and Wind.Carry integrates a cloud carried outward
// through it.
//
// The package is pure: it does no I/O and imports nothing of the program's
// interface. It declares the cooling-function interface it consumes
// (CoolingFunction); package cooling provides real ones, and this package
// ships two analytic ones (ConstantCooling, PowerLawCooling).
//
// # Units
//
// Every quantity is CGS unless its name says otherwise, carried in a typed
// float64 whose doc states the unit (Temperature in K, Length in cm, Time in
// s, ...). Pressure is P/k_B in K cm⁻³. Dimensionless ratios (χ, the Mach
// number, t_cool/t_cc) are plain float64. Constants (constants.go) are pinned
// to CODATA 2018 and IAU 2012/2015, the defaults of astropy 5.2.1.
//
// # Conventions
//
// Λ is always normalised per n_H²; the density product 𝒩 that multiplies it
// in t_cool = f n k_B T/(𝒩 Λ) is either n_H² (NH2, the default: the
// physical loss rate) or n² with n the total particle density (N2, the
// simplified form of many analytic estimates). f is 3/2 (Isochoric, the
// default) or 5/2 (Isobaric). The Mach number is measured against the
// adiabatic sound speed of the hot gas. One μ = 0.6 serves both phases
// unless MuCold and MuHot are set. Logarithms are base 10 and named log10….
// Published threshold radii differ by factors of 2–10 through these choices
// alone (derived from the factors f and 𝒩; see ConventionSpread), so every
// output names them.
//
// # References
//
//   - [AFB23] Abruzzo, Fielding & Bryan 2023, arXiv:2307.03228.
//   - [Bre73] Brent 1973, Algorithms for Minimization without Derivatives, Prentice-Hall, chapter 4.
//   - [BB18] Banda-Barragán, Federrath, Crocker & Bicknell 2018, MNRAS 473, 3454, arXiv:1706.06607.
//   - [CC85] Chevalier & Clegg 1985, Nature 317, 44.
//   - [DSG25] Dutta, Sharma & Gronke 2025, arXiv:2506.08545.
//   - [DP80] Dormand & Prince 1980, J. Comput. Appl. Math. 6, 19.
//   - [GOJN22] Gronke, Oh, Ji & Norman 2022, MNRAS 511, 859, arXiv:2107.13012.
//   - [HNW93] Hairer, Nørsett & Wanner 1993, Solving Ordinary Differential Equations I, Springer, §II.4.
//   - [LRS26] Leary, Richie & Schneider 2026, arXiv:2602.10082.
//   - [McC15] McCourt, O'Leary, Madigan & Quataert 2015, MNRAS 449, 2, arXiv:1409.6719.
//   - [YFB10] Yirak, Frank & Cunningham 2010, ApJ 722, 412, arXiv:0912.4777.
//   - [AAG21] Asplund, Amarsi & Grevesse 2021, A&A 653, A141.
//   - [BF90] Begelman & Fabian 1990, MNRAS 244, 26P.
//   - [FG22] Farber & Gronke 2022, MNRAS 510, 551, arXiv:2107.07991.
//   - [GO18] Gronke & Oh 2018, MNRAS 480, L111, arXiv:1806.02728.
//   - [GO20] Gronke & Oh 2020, MNRAS 492, 1970, arXiv:1907.04771.
//   - [KDS21] Kanjilal, Dutta & Sharma 2021, MNRAS 501, 1143, arXiv:2009.00525.
//   - [KMC94] Klein, McKee & Colella 1994, ApJ 420, 213.
//   - [Li20] Li, Hopkins, Squire & Hummels 2020, MNRAS 492, 1841, arXiv:1909.02632.
//   - [McC18] McCourt, Oh, O'Leary & Madigan 2018, MNRAS 473, 5407, arXiv:1610.01164.
//   - [SPE20] Sparre, Pfrommer & Ehlert 2020, MNRAS 499, 4261, arXiv:2008.09118.
//   - [TOG21] Tan, Oh & Gronke 2021, MNRAS 502, 3179, arXiv:2008.12302.
//
// Journal references of [BB18], [CC85], [FG22], [GOJN22], [KDS21], [McC15],
// [McC18], [TOG21] and [YFB10], the authors of [McC15] and [YFB10], and the
// year of [BF90] are from memory; the arXiv identifiers were checked
// against the arXiv abstract pages. The relations of [CC85] are from memory too
// (WindStatus). No equation number is cited, because none was read from the
// papers themselves.
//
// [AFB23]: https://arxiv.org/abs/2307.03228
// [AAG21]: https://arxiv.org/abs/2105.01661
// [CC85]: https://ui.adsabs.harvard.edu/abs/1985Natur.317...44C
// [DSG25]: https://arxiv.org/abs/2506.08545
// [BB18]: https://arxiv.org/abs/1706.06607
// [GOJN22]: https://arxiv.org/abs/2107.13012
// [LRS26]: https://arxiv.org/abs/2602.10082
// [McC15]: https://arxiv.org/abs/1409.6719
// [YFB10]: https://arxiv.org/abs/0912.4777
// [BF90]: https://ui.adsabs.harvard.edu/abs/1990MNRAS.244P..26B
// [FG22]: https://arxiv.org/abs/2107.07991
// [GO18]: https://arxiv.org/abs/1806.02728
// [GO20]: https://arxiv.org/abs/1907.04771
// [KDS21]: https://arxiv.org/abs/2009.00525
// [KMC94]: https://ui.adsabs.harvard.edu/abs/1994ApJ...420..213K
// [Li20]: https://arxiv.org/abs/1909.02632
// [McC18]: https://arxiv.org/abs/1610.01164
// [SPE20]: https://arxiv.org/abs/2008.09118
// [TOG21]: https://arxiv.org/abs/2008.12302
package model
