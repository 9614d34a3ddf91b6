// Package psd describes particle size distributions: how many particles of
// each diameter a litre of water holds.
//
// # Model
//
// A size distribution is the number density per unit diameter n(D), in
// particles per cubic metre of water per metre of diameter (m⁻⁴), over a
// finite diameter range [Dmin, Dmax] in metres. Everything else follows from
// its moments
//
//	M_k = ∫ D^k n(D) dD          (m^(k-3))
//
// number concentration N = M_0 (m⁻³), projected-area concentration
// A = (π/4) M_2 (m² m⁻³), volume concentration V = (π/6) M_3 (m³ m⁻³), mass
// concentration ρ V (kg m⁻³) for particles of density ρ (kg m⁻³), Sauter mean
// diameter D32 = M_3/M_2 and the volume median diameter D50 (half the
// particle volume lies in smaller particles).
//
// Shapes provided:
//
//   - PowerLaw: the Junge distribution n ∝ D^-ξ (Junge 1963, Air Chemistry
//     and Radioactivity, Academic Press); natural waters typically have
//     ξ = 3–5 (common practice).
//   - Lognormal: log-normal by number, with count median diameter and
//     geometric standard deviation; LognormalByVolume converts a volume
//     median diameter with the Hatch–Choate relations (Hatch & Choate 1929,
//     J. Franklin Inst. 207:369).
//   - Binned: piecewise distribution over size classes, as laser-diffraction
//     sizers report it; ReadCSV reads volume concentration per class.
//
// Any type with Density and Range is a Distribution, so callers (the floc
// package, a user's measured spectrum) can supply their own. Types that can
// integrate themselves exactly implement PartialMomenter; others are
// integrated numerically in ln D (composite Gauss–Legendre, panels at most
// 0.05 wide in ln D, 8 nodes each: relative error about 1e-12 for smooth
// densities whose scale of variation in ln D is 0.1 or more; discontinuities
// inside the range cost accuracy, so piecewise types should implement
// PartialMomenter).
//
// # Units
//
// SI throughout the API: diameters in m, n(D) in m⁻⁴, concentrations in m⁻³,
// m² m⁻³, m³ m⁻³ (volume fraction) or kg m⁻³. ParseConcentration and the CSV
// reader accept the units practitioners write (mg/L, µL/L, µm) and convert.
//
// # Validity
//
// Diameters must be positive and finite; ranges must have Dmin < Dmax.
// Concentrations may be zero but not negative. Functions return errors naming
// the field, value and allowed range rather than NaN.
package psd
