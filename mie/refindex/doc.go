// Package refindex provides complex refractive-index models of particle
// materials as functions of vacuum wavelength.
//
// # Convention
//
// An index is m = n + ik with k ≥ 0 for an absorbing material, the time
// dependence exp(−iωt) of Bohren & Huffman (1983, Absorption and Scattering
// of Light by Small Particles, Wiley, §2.5). Models return the ABSOLUTE index
// of the material (relative to vacuum). Light scattering needs the index
// relative to the surrounding water, m/n_w(λ); the kernel package divides by
// the medium index that its caller supplies, because water's index depends on
// wavelength, salinity and temperature (that model lives with the water
// optics).
//
// Literature often quotes particle indices relative to water (mineral ≈ 1.15–
// 1.20, organic 1.02–1.06; Brown & Gordon 1974, Zaneveld, Roach & Pak 1974).
// Relative wraps such a model with a reference water index so that the
// relative index is recovered exactly in that water and follows the water's
// dispersion elsewhere.
//
// The imaginary part is tied to the material's absorption coefficient
// a = 4πk/λ0 (Bohren & Huffman 1983, eq. 2.52), so a pigment or mineral
// absorption spectrum (m⁻¹) converts to k(λ0) = a(λ0)·λ0/(4π): see Absorbing.
//
// # Models
//
//   - Constant: n + ik independent of wavelength.
//   - Table: n and k tabulated by wavelength, linearly interpolated; an error
//     outside the table.
//   - Smooth: Cauchy dispersion n(λ) = N + B(1/λ² − 1/λref²) (Cauchy 1836)
//     and an exponentially decaying imaginary part k(λ) = K·exp(−S(λ−λref)) +
//     KFloor, the usual shape of mineral absorption in the visible (Babin &
//     Stramski 2004, L&O 49:756, from memory).
//   - Absorbing: adds k from an absorption spectrum to any model.
//   - Relative: a relative-index model placed in a reference water.
//
// # Units and validity
//
// Wavelengths in the API are vacuum wavelengths in metres. Models are
// validated for n > 0 and k ≥ 0 at every wavelength they are asked for; an
// invalid index is an error naming the field, the value and the range.
package refindex
