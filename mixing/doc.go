// Package mixing is a width-averaged, two-layer, finite-volume model of an
// estuary from the tidal limit to the sea, stepped through the tide. It gives
// salinity, temperature, velocity, layer thickness, turbulence shear rate and
// suspended sediment per class in an upper and a lower layer of every cell,
// the sediment on the bed, and derived diagnostics: salt intrusion length,
// stratification, estuarine regime and the turbidity maximum.
//
// The model spans salt-wedge, partially mixed and well-mixed estuaries. It
// imports neither floc nor mie: settling velocities come from a Settling
// value supplied by the caller.
//
// # Use
//
//	cfg := mixing.DefaultConfig()          // SI units, published closure defaults
//	cfg.River.Discharge = 300              // m³ s⁻¹
//	cfg.Sediment = []mixing.Class{{...}}   // zero or more classes
//	res, err := mixing.Run(cfg, mixing.ConstantSettling{5e-4})
//
// Config.Validate reports every problem at once, each naming the field path,
// the value and the allowed range with its unit. Result holds Snapshots at the
// requested Run.Output times and Cycles, the means over every complete M2
// cycle; fields are indexed [layer][cell] (layer 0 upper, 1 lower),
// [layer][class][cell] and, at faces, [layer][face] with face 0 at the mouth.
// For finer control, New builds a Model whose Step advances one automatic
// step without allocating.
//
// # Units and conventions
//
// x is the distance from the mouth, positive landward; velocities and
// transports are positive landward (flood). Salinity is in PSU, temperature in
// °C, concentrations in kg m⁻³, bed mass in kg m⁻², stresses in Pa, shear rate
// G in s⁻¹. Times are seconds from the start of the run.
//
// # Equations
//
// Geometry. N equal cells of length Δx with width B(x) = B0·exp(−x/b) or a
// table, and depth H(x) below mean sea level.
//
// Tide. The elevation η(t) = a_M2·sin(ω_M2 t) + a_S2·sin(ω_S2 t) is uniform
// along the channel (a channel short compared with the tidal wave), so the
// tidal transport through a face is the rate of filling of the prism landward
// of it, Q_T(x,t) = dη/dt·∫ₓ^L B dx' (classic prism estimate; DESIGN
// reference formulation); a velocity amplitude at the mouth is converted
// through the same relation. The tidal transport is shared between the layers
// as by a 1/7-power velocity profile (common practice): the layer below a
// fraction f of the depth carries f^(8/7) of it. This vertical shear strains
// the salinity field: stratification grows on the ebb and breaks down on the
// flood (Simpson et al. 1990, Estuaries 13:125).
//
// Residual exchange. At every face the tidally averaged flow is the
// Hansen & Rattray (1965, J. Mar. Res. 23:104) profile in the form of
// MacCready (2004, J. Phys. Oceanogr. 34:1296),
// u(ζ) = U_R·(3/2 − (3/2)ζ²) + u_E·(1 − 9ζ² − 8ζ³), u_E = g·β·s_x·H³/(48·K_M),
// driven by the along-channel gradient s_x of the depth-mean salinity
// filtered over one M2 period and averaged over the tidal excursion: s_x is
// the difference of its means over the half excursions U_T/ω seaward and
// landward of the face, divided by U_T/ω (at least half a cell). The interface is the level of flow reversal, and the
// lower layer carries the landward part of the profile, Q_in. K_M is tidal
// mixing a·C_D·U_T·H (U_T the spring–neap envelope of the tidal current) plus
// background K₀ plus an interfacial-friction viscosity K_i = c_K·H²·√(c_i·g·β·s_x)
// (InterfacialViscosity: K_M such that the profile's stress at the flow
// reversal equals the two-layer drag c_i·Δū², c_K ≈ 0.084, derived here).
// Q_in never exceeds the hydraulic limit of two-layer flow, composite Froude
// number F1² + F2² ≤ 1 (Armi & Farmer 1986, J. Fluid Mech. 164:27); where the
// closure would exceed it, the interface moves to the position of maximal
// exchange (MaximalExchange). When the river alone makes the upper layer
// critical, Q_in = 0 and the salt wedge is expelled. With weak tides K_i
// dominates and an arrested salt wedge results; for densimetric Froude
// numbers F ≤ 0.3 its length is within a factor of two of Schijf & Schönfeld
// (1953, WedgeLength), nearer F = 1 it is longer than theirs (a few cells),
// and it vanishes for F ≥ 1.
//
// Continuity. Each layer's volume changes by the face transports and by the
// vertical transport W between the layers; W relaxes the lower layer to the
// exchange-flow interface over one M2 period (see Numerics). Water volumes are state variables,
// so the water budget closes to round-off.
//
// Vertical exchange. The layers exchange salt, heat and sediment at the
// velocity K_S/(H/2) (DESIGN) with
//
//	K_S = a·C_D·(π/2)·|u_b(t)|·H·f(Ri_b) + K₀,  f(Ri) = (1 + 3.33·Ri)^(−3/2),
//
// u_b the lower-layer velocity, so that mixing follows |u(t)| through the tide
// and vanishes under an arrested wedge; without stratification its tidal mean
// is K_M's tidal part (K_S = K_M as in MacCready 2004). f is the scalar
// damping function of Munk & Anderson (1948, J. Mar. Res. 7:276; f(0.25) =
// 0.403, f(1) = 0.111), Closure.Damping (PacanowskiPhilander gives
// (1 + 5Ri)^(−3), the zero value none). Ri_b is the bulk layer Richardson
// number of the tidal flow (LayerRichardson), Ri_b = g·β·⟨Δs⟩·H/U_T², with
// U_T the spring–neap amplitude of the section-mean tidal current, not the
// instantaneous velocity (which makes Ri infinite at every slack water), and
// ⟨Δs⟩ the lower-minus-upper salinity filtered over one M2 period and
// averaged over the cells within one tidal excursion U_T/ω either side. It is
// the gradient Richardson number of a linear profile with N² = g'/H and shear
// U_T/H; the Munk–Anderson function was fitted to gradient Richardson numbers,
// so its use with Ri_b is an estimate (validity: 0 ≤ Ri_b < ∞; f → 0 as
// Ri_b → ∞, where K₀ remains as the floor; Ri_b = ∞ for a stratified column
// with no tide). Ri_b and f are updated with the exchange flow every 15
// minutes from the filtered fields, so the damping lags the stratification by
// about an M2 period. Closure.Entrainment (e.g. DefaultTurner) adds
// interfacial entrainment w_e = E(Ri)·Δu_r by the residual exchange shear,
// E = (A − B·Ri)/(1 + C·Ri), Turner (1986, J. Fluid Mech. 173:431):
// A = 0.08, B = 0.1, C = 5, zero above Ri = 0.8, with the layer Richardson
// number Ri = g'·h1·h2/(H·Δu_r²).
//
// Transport. Every tracer is advected in each layer by finite volumes with
// the flux-limited scheme of Sweby (1984, SIAM J. Numer. Anal. 21:995) and the
// van Leer (1974) limiter, monotone so that salinity stays between river and
// sea values; tidal and lateral dispersion K_H = c·U_T·B (MacCready 2004 form)
// acts between neighbouring cells and with the sea at the mouth. Inflow at the
// mouth has ocean values, at the head river values.
//
// Sediment. Each class settles from the upper to the lower layer and from the
// lower layer to the bed at the supplied velocity w_s, either at any stress or
// with Krone's (1962) factor (1 − τ_b/τ_cd); it is eroded by
// E = M·(τ_b/τ_ce − 1) for τ_b > τ_ce (Partheniades 1965, J. Hydraul. Div.
// ASCE 91) from a finite bed inventory. The bed stress is
// τ_b = ρ·C_D·u_b² with the near-bed (lower-layer) velocity. River supply is
// C = a·Q_R^b (a rating curve), sea water carries a background concentration.
// Vertical exchange, settling, deposition and erosion are solved implicitly
// per cell (backward Euler; stable for any step, mass-conserving). The
// turbidity maximum is not imposed: it forms where landward near-bed transport
// meets the river outflow, at the head of the salt intrusion.
//
// Shear rate. G = √(ε/ν) per layer with ε from the log layer,
// ε = u*³/(κz), averaged over each layer (u* = √C_D·|u_b|, z0 from
// C_D = (κ/(ln(H/z0) − 1))²), plus c_i·Δu³/h1 from interfacial shear in the
// upper layer; ν(T) from the Vogel equation (within 2.5 % over 0–40 °C).
//
// Journal details given here for Hansen & Rattray, Knudsen, Armi & Farmer,
// Sweby, van Leer, Turner (1973, 1986), Munk & Anderson (and its coefficients),
// Pacanowski & Philander, Phillips, Simpson et al.,
// Partheniades and Krone, the Vogel constants and the 0.035 dispersion
// coefficient are from memory; the other formulas and constants were read in
// the sources collected for the project (research note on estuaries and flocs).
//
// # Diagnostics
//
// Salt intrusion length: distance to the most landward point where lower-layer
// salinity reaches Run.BottomThreshold (2 PSU by default, as in the "X2"
// convention). Stratification: (s_lower − s_upper)/s̄ per cell and its mean over
// the salt intrusion. Regime: freshwater Froude number Fr_f = U_R/√(gβs_ocean H)
// and mixing number M = √(C_D U_T²/(ω N0 H²)), N0 = √(gβs_ocean/H) (Geyer &
// MacCready 2014, Annu. Rev. Fluid Mech. 46:175), at the mouth, classified by
// the polygons of RegimeDigitisation, which every output should carry. The
// Knudsen (1900) relations are exposed as Knudsen; Cycles hold the tidally
// averaged layer transports and salt fluxes from which they can be checked.
//
// # Closure constants and defaults
//
//	C_D   drag coefficient                2.5e-3   MacCready's Geyer & MacCready (2014) scripts (2.5e-3 to 3.1e-3 in use)
//	a     tidal mixing coefficient        0.028    MacCready's basin–strait code (attributed to MacCready 2007 and Ralston et al. 2008, from memory)
//	K₀    background mixing               1e-5 m² s⁻¹ (common practice)
//	c     dispersion K_H = c·U_T·B        0.035    MacCready 2004 (from memory)
//	β     haline contraction              7.7e-4 PSU⁻¹
//	c_i   interfacial drag                3e-4     Sørgard, Martinsen & Aas 1990 (1.1e-4 to 4.2e-4)
//	fmin  smallest lower-layer fraction   0.1      numerical choice
//	f     Richardson damping of K_S       (1 + 3.33Ri)^(−3/2)  Munk & Anderson 1948 (from memory) via MunkAnderson
//	E     entrainment law                 off      Turner 1986 A, B, C = 0.08, 0.1, 5 via DefaultTurner
//	Erosion rate, critical stresses and bed inventory are per class, no
//	default: Wadden Sea mudflats give τ_ce = 0.11–0.18 Pa and M = 5e-5 to
//	3e-3 kg m⁻² s⁻¹; τ_cd ≈ 0.016 Pa (US Army ERDC TN-DOER-E10).
//
// # Numerics
//
// The time step is chosen every step so that the outflow of every cell and
// layer (advection, dispersion and vertical transport) removes at most
// Run.Courant of its volume (0.9 by default, at most Run.MaxStep); steps end
// exactly on output times and M2-cycle boundaries. Vertical processes are
// implicit and impose no limit. The exchange flow is recomputed every 15
// minutes of model time. Step allocates nothing.
//
// Along-channel smoothness. Two discretisation choices are needed for a
// smooth salinity field once vertical mixing is weak (stratification
// damping, or a small a), and both were found by testing, not tuned:
// (1) the exchange-driving gradient is a difference of excursion means, not
// a two-point difference across the excursion, which responds fully to a
// 2Δx (odd–even) salinity mode: alternating Q_in makes alternating up- and
// downwelling W, which refreshes the lower layer in every other cell and so
// feeds the mode; (2) the interface relaxes over an M2 period, the averaging
// time of the exchange flow it follows; relaxing within one hour drove waves of
// stratification at the tidal-excursion scale that drifted along the channel.
// With these, damping of K_S by the filtered, excursion-averaged Ri_b and
// even by the instantaneous Ri = g'H/u_b² gives no steps in the cases tested
// (TestNoGridScaleOscillation: every feature spans at least 1.5 cells).
// The layering mechanism of Phillips (1972, Deep-Sea Res. 19:79) remains
// possible in principle: the damped buoyancy flux Ri·f(Ri) falls beyond
// Ri = 1/(α(n − 1)) ≈ 0.6 (PeakFluxRichardson), and the excursion average
// of Ri_b keeps any such structure wider than a tidal excursion.
//
// # Validity
//
// Width-averaged and two-layer: no lateral circulation, no continuous
// vertical profile, no tidal wave propagation (η is uniform: channels shorter
// than about a tenth of the tidal wavelength, a few tens to a hundred km), no
// tidal flats, rigid bed geometry, salinity-only density (temperature is a
// passive tracer). The exchange closure is the tidally averaged Hansen–Rattray
// balance; intratidal variation enters through the resolved tidal advection,
// straining and |u(t)|-dependent mixing and erosion. Salinity 0–42 PSU,
// depths 0–1000 m.
//
// # Departures from the DESIGN reference formulation
//
//   - Only K_S is damped by the bulk Richardson number; the exchange closure's
//     K_M is not. The Hansen–Rattray profile then has K_M/K_S = 1/f ≥ 1, a
//     turbulent Prandtl number above one as Munk & Anderson's own pair gives
//     (their momentum function (1 + 10Ri)^(−1/2) falls more slowly than the
//     scalar one); damping K_M as well is not done here.
//   - Bulk-Richardson-number entrainment (Turner 1986) is available as
//     Closure.Entrainment; with the exchange-flow shear of this closure it
//     nearly homogenises partially mixed estuaries, so it is off by default.
//   - Bed stress and tidal mixing use the lower-layer velocity, so that an
//     arrested wedge is not stirred by the river flowing over it.
//   - An interfacial-friction viscosity joins the tidal K_M so that one closure
//     covers the arrested salt wedge (weak tides) and partially mixed estuaries.
//   - At the hydraulic limit the interface moves to the maximal-exchange
//     position instead of keeping the Hansen–Rattray interface.
//   - The salinity gradient is taken over a tidal excursion and filtered over
//     an M2 period, the scales on which the tidally averaged balance holds.
package mixing
