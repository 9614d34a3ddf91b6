// Package sensing is stage 5 of murk's pipeline: what instruments read from
// the optics at a point. Every instrument implements Instrument: it states
// the wavelength and the scattering angles it needs, and Read turns one
// point's total IOPs and VSF (a Point) into a Reading with flags. The
// physical sensor models are those of package scenario/seen:
//
//   - Transmissometer: c_m = a + b minus the scattering collected inside the
//     acceptance cone (Boss et al. 2009, Appl. Opt. 48:4397), flagged when
//     the path is optically thick for single scattering.
//   - Backscatter: β(θ) converted to b_b with the χ_p factor of Sullivan et
//     al. (2013, Light Scattering Reviews 7:189), water β and b_b from the
//     Zhang, Hu & He (2009, Opt. Express 17:5698) model at the point's
//     salinity and temperature.
//   - Turbidimeter: the particle β(90°) at 860 nm, the signal of the ISO
//     7027 geometry. It is reported in FNU only through a calibration the
//     user states (Calibration); without one the reading stays β_p(90°),
//     because murk has no sourced optical description of formazin.
//   - RadiometerBand: remote-sensing reflectance averaged over a Gaussian
//     spectral response, at the surface only.
//
// Digitised wraps any instrument in a sensor front end (seen.Electronics:
// gain, offset, dark noise, digitiser, saturation), so that every reading
// can be given in counts with its saturation and detection flags.
//
// FromSpec is the one place that turns a scenario's instrument entry into
// an Instrument; nothing else switches over instrument kinds.
//
// Units: SI throughout (m, rad, m⁻¹, m⁻¹ sr⁻¹, sr⁻¹), salinity in PSU and
// temperature in °C; the Description of each instrument states its
// reading's unit.
//
// Cautions: simulated readings are estimates for design and planning, not
// calibrated measurements. Instrument work at sea follows the operator's
// own safety rules.
package sensing
