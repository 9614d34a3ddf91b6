// Package floc describes flocs, the loose fractal aggregates of mineral and
// organic primary particles that carry most fine sediment in estuaries:
// their structure, settling velocity, and growth and break-up in turbulent,
// salty water. Their optics is in the sub-package floc/optics.
//
// # Structure
//
// A floc of diameter D made of primaries of diameter D_p and grain density
// ρ_s is self-similar with fractal dimension n_f (Kranenburg 1994, Estuar.
// Coast. Shelf Sci. 39:451–460):
//
//	N   = (D/D_p)^n_f                       number of primaries
//	φ   = (D/D_p)^(n_f − 3)                 solid volume fraction (porosity 1 − φ)
//	Δρ_f = (ρ_s − ρ_w)·φ                    excess density over water
//	M   = ρ_s·φ·πD³/6 = N·ρ_s·πD_p³/6        dry mass
//
// n_f = 3 is a solid sphere; natural estuarine flocs have n_f ≈ 1.7–2.3.
// Primaries may be polydisperse (log-normal with geometric standard
// deviation Fractal.PrimaryGSD, default 2); D_p is then their Sauter
// diameter D32, the size that keeps their surface per unit volume (and so
// their geometric optical cross-section per unit mass and the floc's
// permeability) equal to that of identical primaries. N then counts
// primaries of that representative size; only floc/optics uses the spread.
// Fractal.Aggregate evaluates these; Fractal.GyrationRadius gives the
// radius of gyration of the radial mass profile r^(n_f−3) used by the optics.
//
// # Settling
//
// Settling.Velocity is Winterwerp's (1998, J. Hydraul. Res. 36:309–326)
// fractal form of Stokes' law with the Schiller–Naumann (1933) drag
// correction solved consistently for the floc Reynolds number:
//
//	w_s·(1 + 0.15·Re^0.687) = (α/18β)·(ρ_s − ρ_w)·g/μ·D_p^(3−n_f)·D^(n_f−1),   Re = w_s·D/ν
//
// which is Stokes' law for n_f = 3 and Stokes drag. Water density and
// viscosity come from salinity and temperature (WaterDensity: UNESCO 1981
// EOS-80; WaterViscosity: Sharqawy et al. 2010). Hindered settling
// (Richardson & Zaki 1954) is optional.
//
// # Size kinetics
//
// Floc size follows Winterwerp's (1998) aggregation–break-up equation
// (Kinetics): growth ∝ G·C·D^(4−n_f) with a collision efficiency that rises
// with salinity (weak flocculation in fresh water; common practice, with a
// documented tunable default), break-up ∝ G^(3/2)·(D − D_p)^(3−n_f)·D², and a
// cap at the Kolmogorov microscale √(ν/G). Model.Equilibrium gives the
// balance size (for n_f = 2: D_e = D_p + k_A·C/(k_B·√G), rising with C and
// falling with G); Model.Step integrates the equation over a time step so
// that size lags a tidally varying shear. Model.Population adds a lognormal
// spread around the kinetic size and a fraction of unflocculated primaries
// that falls with salinity.
//
// # Use from an estuary model
//
// All entry points take local conditions as plain SI numbers, so a
// transport model can be handed method values without importing this
// package:
//
//	ws  := model.EquilibriumSettlingVelocity      // func(G, C, S, T float64) (float64, error)
//	d1, err := model.Step(d0, G, C, S, T, dt)    // size after dt
//	w,  err := model.SettlingVelocity(d1, S, T, C)
//
// # Units and ranges
//
// SI throughout: diameters in m, densities and concentrations in kg m⁻³,
// shear rate G in s⁻¹, velocities in m s⁻¹, time in s, viscosity in Pa s,
// salinity in PSU, temperature in °C. Allowed ranges are stated per field;
// out-of-range input (n_f outside (1, 3], a floc smaller than its primaries,
// negative shear, …) returns an error naming the field, its value and the
// allowed range with its unit. Water properties hold for 0–42 PSU and
// −2–40 °C; the drag law for Re ≤ 800.
//
// # Calibration caveat
//
// The default kinetic constants are Winterwerp's single calibration on Ems
// mud in a laboratory settling column; real flocculation ability varies by
// orders of magnitude with organic content and mineralogy. The salinity
// factor and the primary fraction are tunable choices without a published
// calibration. Check values in the tests confirm the implementation of the
// published relations, not agreement with any particular estuary.
package floc
