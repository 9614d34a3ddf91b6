// Package population describes suspended particle populations (mineral
// grains, organic detritus, phytoplankton cells) and computes their bulk
// inherent optical properties from a kernel table.
//
// # Model
//
// A Population is a kind, a particle density, an optical model (a
// homogeneous sphere of one complex index, or a coated sphere for cells), a
// size distribution shape (package psd) and a concentration (by number,
// area, volume or mass). New builds its kernel once (package kernel: the
// expensive Lorenz–Mie part, depending only on size, wavelength and index)
// and the number per size bin; IOP then costs one dot product per bin and
// wavelength, and SetConcentration / SetDistribution change the amount or
// shape without rebuilding the kernel. Several populations in one water add
// their IOPs (single scattering; common practice for dilute suspensions).
//
// Mass-specific IOPs divide by the population's dry mass concentration
// ρ·V, with ρ the APPARENT density (dry mass per particle volume including
// the water a particle holds): for water-rich organic particles it is far
// below the density of their dry matter, which is why they scatter more per
// gram than their index alone suggests (Babin et al. 2003, Limnol. Oceanogr.
// 48:843).
//
// # Typical parameters
//
// Typical returns starting values per kind, each with its source:
//
//	kind           index rel. to water           apparent density
//	mineral        1.16 + i·k(λ)                  2650 kg m⁻³
//	detritus       1.04 + i·k(λ)                  1100 kg m⁻³ × dry share
//	phytoplankton  core 1.02, shell 1.10 + pigment ~1030 kg m⁻³ wet, dry share
//
// Real parts: two-component Mie models of ocean particles used 1.15
// (inorganic) and 1.01–1.05 (organic) relative to water (Brown & Gordon
// 1974; Zaneveld, Roach & Pak 1974, J. Geophys. Res. 79:4091). Quartz grain
// density 2650 kg m⁻³ (from memory). Mineral imaginary part: order 1e-3 at
// 400 nm falling exponentially toward the red (Babin & Stramski 2004, from
// memory). Everything from memory is marked so in Typical's comments and
// should be replaced by measured values where known.
//
// # Units
//
// SI: densities kg m⁻³, wavelengths m, IOPs m⁻¹ (VSF m⁻¹ sr⁻¹),
// mass-specific IOPs m² kg⁻¹ (divide by 1000 for the customary m² g⁻¹).
package population
