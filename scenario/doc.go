// Package scenario runs a murk scenario end to end: one validated scenario
// file (package scenario/spec) in, the optical state of an estuary from river
// to sea and through the tide out.
//
// # The coupled run
//
// Run takes four steps, and keeps the split between the expensive,
// position-independent optics and the cheap per-point sums visible:
//
//  1. Kernels, once per population. Every particle population gets a kernel
//     table (package mie/kernel) over its size range, the optics wavelengths
//     and the VSF angles: Lorenz–Mie spheres or coated cells (package
//     mie/population) for mineral, organic and phytoplankton populations,
//     aggregates (package floc/optics) for flocs. Kernels are built in one
//     reference water (mid-estuary salinity, mean temperature); indices
//     given relative to water stay exactly relative in every water.
//  2. The estuary, coupled to the flocs. EstuaryConfig turns the scenario
//     into a mixing.Config; the run hands package mixing a Settling model
//     that gives constant classes their velocity and floc classes the
//     mass-weighted settling velocity of their floc size distribution
//     (Winterwerp 1998, J. Hydraul. Res. 36:309, eq. 9, via package floc).
//     With dynamic flocs the median floc size in every cell and layer
//     follows Winterwerp's (1998) growth/break-up kinetics under the local
//     shear rate, concentration, salinity (collision efficiency rising with
//     salinity) and temperature, updated at least every FlocInterval, so
//     that floc size lags the tide and grows at the salt front. The
//     estuary model never imports the floc package: the coupling is this
//     settling function.
//  3. IOPs at every station, layer and output time, and the bulk IOPs at
//     every model cell for the along-channel section, as cheap weighted sums:
//     water with the local salinity and temperature (package scenario/water:
//     Pope & Fry 1997 and companions for absorption, Zhang, Hu & He 2009 for
//     scattering), CDOM mixed conservatively with salinity, pigment
//     absorption (Bricaud et al. 1998; only when no phytoplankton population
//     is modelled as particles), and each population: class-riding spheres
//     as concentration × mass-specific spectrum, flocs as the kernel's dot
//     product with the bin numbers of the present floc size distribution.
//     Components stay separable in the Result (A, B, Bb per component;
//     totals and particle sums by Result.Sum). Spectral slopes of b_bp and
//     c_p are power-law fits over all wavelengths (Boss, Twardowski &
//     Herring 2001; package scenario/iop).
//  4. What is seen, per station and time, from the upper layer taken as an
//     optically deep homogeneous column (package scenario/seen): R_rs (Lee
//     et al. 2002 quadratic model), K_d (Lee et al. 2013), Secchi depth (Lee
//     et al. 2015) and colour (CIE 1931, hue angle, Forel-Ule class), for a
//     sun at Options.SolarZenith.
//  5. Instruments, per station, layer and time: the scenario's
//     transmissometers, backscatter sensors and nephelometers simulated from
//     the total IOPs and VSF with package seen (see instruments.go for what
//     each reports and its limits).
//
// Station values are interpolated linearly between cell centres (floc size
// in ln D), held constant between the mouth and the first centre and
// between the last centre and the head. The section (Result.Section) is
// evaluated at the cell centres themselves: the water state, total and
// particulate a, b and b_b at the reference wavelength (nearest 550 nm)
// and the spectral slopes (fitted over the whole spectrum), at the model's
// full resolution; full spectra, the components, the VSF, apparent
// properties and instruments stay at the stations, so that the section's
// memory grows with the cells alone.
//
// # Determinism
//
// Kernels are built by package mie/kernel's deterministic parallel builder;
// the per-point evaluation hands whole output times to workers, each point is
// computed by one worker into its own slots, and every reduction is in index
// order. Output files are written several at once, each from the finished
// Result alone. Results are bit-for-bit identical for any GOMAXPROCS and any
// Options.Workers (tested).
//
// # Outputs
//
// CSV tables with units in the header (section.csv: the section along the
// channel at every model cell, IOPs at the reference wavelength nearest
// 550 nm; stations.csv: the same at the stations; spectra per component at
// every station, layer and time; reflectance and clarity; instruments), the
// text summary, a CF NetCDF file (station variables on dimension distance,
// section variables, prefixed section_, on dimension cell_distance) and
// figures (sections at every cell, spectra at up to five stations, tidal
// envelopes near the turbidity maximum). Every file is written to a
// temporary file and renamed (package scenario/internal/safefile).
//
// # Units
//
// SI throughout the API (m, s, kg, m⁻¹, m⁻¹ sr⁻¹), salinity in PSU and
// temperature in °C as in package mixing. Tables use the units their headers
// state (km, h, g m⁻³, µm, nm).
//
// # Validity and cautions
//
// Single scattering by independent particles; the two-layer, width-averaged
// estuary; floc kinetics calibrated on one mud (Winterwerp 1998) with a
// salinity factor that is a documented choice of package floc. Predictions
// are estimates for planning, not a substitute for calibrated measurement;
// turbidity limits and plume compliance are set by local regulations and
// licensed practice (Caution is printed with every summary).
package scenario
