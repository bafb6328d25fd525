package model

// A Mixture is a named set of solar mass fractions X, Y, Z (hydrogen, helium,
// metals). The values are those tabulated by Asplund, Amarsi & Grevesse 2021
// [AAG21] Table 4 for each source.
type Mixture struct {
	Name     string  // short name, e.g. "A09"
	Citation string  // the source of the abundances
	X, Y, Z  float64 // mass fractions; X+Y+Z = 1 to the quoted precision
}

// The solar mixtures cloudwind knows. Asplund2009 is the default.
var (
	// Asplund2009 is the present-day photospheric mixture of Asplund et al.
	// 2009 (ARA&A 47, 481) as given in [AAG21] Table 4.
	Asplund2009 = Mixture{"A09", "Asplund, Grevesse, Sauval & Scott 2009, ARA&A 47, 481 (present-day)", 0.7381, 0.2485, 0.0134}
	// Asplund2009Protosolar is the proto-solar mixture of Asplund et al. 2009.
	Asplund2009Protosolar = Mixture{"A09p", "Asplund, Grevesse, Sauval & Scott 2009, ARA&A 47, 481 (proto-solar)", 0.7154, 0.2703, 0.0142}
	// AndersGrevesse1989 is the mixture of Anders & Grevesse 1989 (GCA 53, 197).
	AndersGrevesse1989 = Mixture{"AG89", "Anders & Grevesse 1989, Geochim. Cosmochim. Acta 53, 197", 0.7065, 0.2741, 0.0194}
	// GrevesseSauval1998 is the mixture of Grevesse & Sauval 1998 (SSRv 85,
	// 161), which the CHIANTI-based built-in metal curve assumes.
	GrevesseSauval1998 = Mixture{"GS98", "Grevesse & Sauval 1998, Space Sci. Rev. 85, 161", 0.7347, 0.2483, 0.0169}
	// Asplund2021 is the mixture of Asplund, Amarsi & Grevesse 2021.
	Asplund2021 = Mixture{"A21", "Asplund, Amarsi & Grevesse 2021, A&A 653, A141", 0.7438, 0.2423, 0.0139}
)

// Mixtures lists the known mixtures, default first.
func Mixtures() []Mixture {
	return []Mixture{Asplund2009, Asplund2009Protosolar, AndersGrevesse1989, GrevesseSauval1998, Asplund2021}
}

// MixtureByName returns the mixture with the given Name.
func MixtureByName(name string) (Mixture, bool) {
	for _, m := range Mixtures() {
		if m.Name == name {
			return m, true
		}
	}
	return Mixture{}, false
}

// MuIonised returns the mean molecular weight of fully ionised gas,
//
//	1/μ = 2X + (3/4)Y + (1/2)Z,
//
// the standard approximation that counts one electron per two nucleons for
// the metals. Status: the formula is from memory (textbook form); the numbers
// it gives are derived (A09: 0.5991; AG89: 0.6141).
func (m Mixture) MuIonised() float64 {
	return 1 / (2*m.X + 0.75*m.Y + 0.5*m.Z)
}

// HeliumToHydrogen returns the helium-to-hydrogen number ratio
// y = n_He/n_H = (Y/4)/X, taking the helium atom as four hydrogen masses.
func (m Mixture) HeliumToHydrogen() float64 {
	return m.Y / (4 * m.X)
}
