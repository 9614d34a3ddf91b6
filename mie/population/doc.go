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
//	kind           index relative to water             apparent density
//	mineral        1.15 + i·1e-3·e^(−(λ−400 nm)/109 nm)  2650 kg m⁻³
//	detritus       1.05, a ∝ e^(−0.011 nm⁻¹ (λ−400 nm))  700 kg m⁻³
//	phytoplankton  core 1.02 (90 % of D), shell 1.10     300 kg m⁻³
//	               + pigment absorption of the shell
//
// Real parts: two-component Mie models of ocean particles used 1.15
// (inorganic) and 1.01 (organic) relative to water (Brown & Gordon 1974),
// and an inversion of a measured VSF found modes at 1.05 and 1.15
// (Zaneveld, Roach & Pak 1974, J. Geophys. Res. 79:4091). The detritus
// absorption slope 0.011 nm⁻¹ is that of non-algal particles (Bricaud et
// al. 1998). Densities, the mineral and detrital k magnitudes and the cell
// layers are from memory, marked so at each Typical function, and should be
// replaced by measured values where known.
//
// # Checks
//
// The tests compare, for Junge slope 4 over 0.05–100 µm at 555 nm, with
// published ranges: mineral c* 0.34, b* 0.34, b_b* 0.0095 m² g⁻¹, b_b/b
// 0.028; detritus c* 0.44, b* 0.44, b_b* 0.0031 m² g⁻¹, b_b/b 0.0070
// (against c* 0.2–0.6, b* averages 0.5–1.0, b_b* ≈ 0.012 and ≈ 0.005 about
// 3× apart, b_b/b 0.015–0.03 and 0.005–0.01). These depend strongly on the
// smallest particles: cut at 0.2 µm instead, b_b* falls to 0.0070 and
// 0.0019 m² g⁻¹ (the organic value then below the published range). The
// γ–ξ relation of Boss, Twardowski & Herring (2001) holds to 0.09 in ξ for
// ξ = 3–5 over 0.02–100 µm and fails by 0.4–1.3 when particles below 1 µm
// are missing.
//
// # Units
//
// SI: densities kg m⁻³, wavelengths m, IOPs m⁻¹ (VSF m⁻¹ sr⁻¹),
// mass-specific IOPs m² kg⁻¹ (divide by 1000 for the customary m² g⁻¹).
package population
