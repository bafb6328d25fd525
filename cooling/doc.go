// Package cooling provides cooling functions Λ(T, Z) for cloudwind: a
// built-in curve (collisional ionisation equilibrium from published rates
// and a fit from 10^4 K, and from 10 K to 10^4 K the Koyama & Inutsuka 2002
// fit for neutral gas capped at the CIE value at 10^4 K; see Builtin),
// historical fits for comparison, the user's own tables, and exact cooling
// times.
//
// Every curve has one canonical form, *PowerLaw: a piecewise power law in
// log10 T – log10 Λ with Λ per n_H² in erg cm³ s⁻¹, which satisfies
// model.CoolingFunction, model.PiecewisePowerLaw and model.RangedCooling.
// Tables are used at their own nodes and converted to n_H² once, on load;
// the source's normalisation is kept in Meta.
//
// # Units
//
// Every quantity is CGS unless its name says otherwise: T in K, Λ in
// erg cm³ s⁻¹ per n_H², times in s. Logarithms are base 10 and named
// log10….
//
// # Range policy
//
// Above the last node Λ continues with the bremsstrahlung slope T^{1/2}
// (flagged AboveTable); below the first node Λ = 0 (BelowTable). The cooling
// floor is a caller's setting. See PowerLaw.
package cooling
