package model

// Quantity types. Each carries one unit, stated here and nowhere else.
// They make a mix-up such as passing a temperature where a pressure is
// expected a compile-time error. They cannot catch every dimensional
// mistake: in Go the product of two Lengths is still a Length, so function
// bodies convert to float64 once at the top, write the formula in the
// paper's notation, and convert the result back.

// Temperature is a temperature in K.
type Temperature float64

// NumberDensity is a particle number density in cm⁻³.
type NumberDensity float64

// Density is a mass density in g cm⁻³.
type Density float64

// Mass is a mass in g.
type Mass float64

// Length is a length in cm.
type Length float64

// Velocity is a speed in cm s⁻¹.
type Velocity float64

// Time is a time in s.
type Time float64

// CoolingRate is a cooling function value Λ in erg cm³ s⁻¹. In cloudwind it
// is always normalised per n_H²: the volumetric loss rate is n_H² Λ(T).
type CoolingRate float64

// Pressure is a thermal pressure divided by Boltzmann's constant, P/k_B, in
// K cm⁻³: the form in which astrophysicists quote it.
type Pressure float64

// ColumnDensity is a column density in cm⁻².
type ColumnDensity float64
