package model

import "math"

// Physical and astronomical constants in CGS units, pinned to CODATA 2018
// (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010) and the IAU 2012/2015
// resolutions: the default constant sets of astropy 5.2.1, which the test
// suite uses for cross-checks. CODATA 2022 values are not mixed in.
// Derived constants are written as expressions of their parents, never
// retyped; Go evaluates constant expressions exactly.

// Boltzmann is Boltzmann's constant k_B in erg K⁻¹ (exact in the 2019 SI;
// CODATA 2018).
const Boltzmann = 1.380649e-16

// ProtonMass is the proton mass m_p in g (CODATA 2018; standard uncertainty
// 5.1e-34 g). It is the mass unit of the mean molecular weight μ here.
const ProtonMass Mass = 1.67262192369e-24

// AtomicMassConstant is the atomic mass constant m_u in g (CODATA 2018;
// standard uncertainty 5.0e-34 g).
const AtomicMassConstant Mass = 1.66053906660e-24

// ElectronMass is the electron mass m_e in g (CODATA 2018; standard
// uncertainty 2.8e-37 g).
const ElectronMass Mass = 9.1093837015e-28

// HydrogenAtomMass is the mass of the ¹H atom m_H in g: 1.00782503223 u.
// Status: secondary source (the value used by public codes citing NIST and
// the Atomic Mass Evaluation; the primary table was not read).
const HydrogenAtomMass = 1.00782503223 * AtomicMassConstant

// GravitationalConstant is Newton's constant G in cm³ g⁻¹ s⁻² (CODATA 2018;
// standard uncertainty 1.5e-12).
const GravitationalConstant = 6.67430e-8

// AstronomicalUnit is the au in cm (exact; IAU 2012 Resolution B2).
const AstronomicalUnit Length = 1.495978707e13

// Parsec is one parsec in cm, (648000/π) au (IAU 2015 Resolution B2, note 4).
const Parsec = AstronomicalUnit / (math.Pi / 648000)

// Kiloparsec is 1000 pc in cm.
const Kiloparsec = 1000 * Parsec

// Day is one day of 86400 s.
const Day Time = 86400

// Year is the Julian year of 365.25 d in s (the year of the IAU light-year,
// 1 ly = c × 1 Julian yr).
const Year = 365.25 * Day

// Megayear is 10⁶ Julian years in s.
const Megayear = 1e6 * Year

// KilometrePerSecond is 1 km s⁻¹ in cm s⁻¹ (definition).
const KilometrePerSecond Velocity = 1e5

// SolarMassParameter is the nominal solar mass parameter (GM)☉ in cm³ s⁻²
// (IAU 2015 Resolution B3). Status: from memory, not checked against the
// resolution text.
const SolarMassParameter = 1.3271244e26

// SolarMass is M☉ = (GM)☉/G in g, derived from its parents as IAU 2015
// Resolution B3 recommends.
const SolarMass Mass = SolarMassParameter / GravitationalConstant

// ElectronVolt is 1 eV in erg (exact in the 2019 SI; CODATA 2018).
const ElectronVolt = 1.602176634e-12

// Planck is Planck's constant h in erg s (exact in the 2019 SI; CODATA 2018).
const Planck = 6.62607015e-27

// SpeedOfLight is the speed of light in vacuum c in cm s⁻¹ (exact; CODATA
// 2018).
const SpeedOfLight = 2.99792458e10

// ElementaryCharge is the elementary charge e in statcoulomb (esu),
// 1.602176634e-19 C (exact in the 2019 SI; CODATA 2018) times c/(10 cm s⁻¹)
// statC per C: 4.80320471…e-10 esu. Derived, never retyped.
const ElementaryCharge = 1.602176634e-19 * SpeedOfLight / 10

// SolarMassPerYear is 1 M☉ yr⁻¹ in g s⁻¹: SolarMass over the Julian Year.
// Derived, never retyped.
const SolarMassPerYear = MassRate(float64(SolarMass) / float64(Year))

// SupernovaPowerPerSFR is the energy injection rate per unit
// star-formation rate that sets an outflow's Ė = α · SupernovaPowerPerSFR ·
// SFR: 3×10⁴¹ erg s⁻¹ per M☉ yr⁻¹, here in erg g⁻¹ (erg s⁻¹ per g s⁻¹).
// Status: from memory (a typical input for a [CC85] wind), not
// checked against a source; WindLoadingStatus says so for people.
const SupernovaPowerPerSFR = 3e41 / float64(SolarMassPerYear)
