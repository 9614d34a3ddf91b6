// Package iop holds bulk inherent optical properties (IOPs) of a water
// sample as spectra on a fixed wavelength grid, one component per
// constituent, so that water, dissolved matter, pigments and each particle
// population stay separable while their sums give the bulk water.
//
// # Model
//
// IOPs of constituents add (common practice; single scattering per volume
// element in dilute suspensions):
//
//	a   = a_w + a_g + a_φ + Σ a_p        absorption
//	b   = b_w + Σ b_p                    scattering
//	b_b = b_bw + Σ b_bp                  backscattering
//	c   = a + b                          beam attenuation
//	β(θ) = β_w(θ) + Σ β_p(θ)             volume scattering function
//
// The backscattering ratio is b_b/b. Mass-specific values divide a
// component's coefficient by its mass concentration. Spectral slopes are
// power-law fits X(λ) = X(λ0)(λ/λ0)^(−γ) by least squares in log–log space
// (the usual description of particulate attenuation and backscattering
// spectra, e.g. Boss, Twardowski & Herring 2001, Appl. Opt. 40:4885, for c_p).
//
// Water comes from package water (Pope & Fry 1997 and the merged absorption
// table; Zhang, Hu & He 2009 scattering), dissolved matter from water.CDOM
// and water.CDOMMixing, pigment absorption without scattering from
// water.ChlPowerLaw, and particle populations from the Mie kernels
// (AddParticles).
//
// # Units
//
// Wavelengths are vacuum wavelengths in metres; scattering angles in
// radians (0 forward, π backward); a, b, b_b, c in m⁻¹; β in m⁻¹ sr⁻¹;
// mass concentrations in kg m⁻³, so mass-specific values are in m² kg⁻¹
// (1 m² g⁻¹ = 1000 m² kg⁻¹).
//
// # Layout and cost
//
// A Component keeps one slice per quantity, indexed by wavelength, and the
// VSF as one slice of len(Wavelengths)·len(Angles) values, row-major by
// wavelength: VSF[i*len(Angles)+j] is β at Wavelengths[i], Angles[j].
// Refilling a component (FillWater, FillCDOM, Sum) allocates nothing, so a
// run can keep one Spectra per worker and refill it at every station and
// time step.
package iop
