// Package optics computes the optical cross-sections of flocs, the fractal
// aggregates of primary particles described by package floc: extinction,
// scattering, absorption, hemispherical backscattering (what backscatter
// sensors see) and the differential scattering cross-section (VSF per floc)
// at requested angles.
//
// # Methods
//
// Every method implements Method and takes a Problem (structure, floc
// diameter, vacuum wavelength, water index, primary index relative to
// water) and a reusable Workspace:
//
//   - EffectiveMedium: a homogeneous porous sphere of the floc's diameter
//     with the Maxwell Garnett (1904) or volume-averaged index of its solid
//     fraction φ = (D/D_p)^(n_f−3), solved with Lorenz–Mie theory (package
//     mie); beyond Mie's domain extinction and absorption come from van de
//     Hulst's (1957) anomalous diffraction (AnomalousDiffraction), valid for
//     x ≫ 1 and |m − 1| ≪ 1.
//   - FractalRDG: Rayleigh–Debye–Gans for the aggregate with Lorenz–Mie
//     primaries and a structure factor from Sorensen's (2001, Aerosol Sci.
//     Technol. 35:648) review (Fisher–Burford by default; Dobbins–Megaridis
//     and exponential cut-off available). Absorption is additive over
//     primaries, scattering is integrated over angle, extinction is their sum.
//   - Composite (the default): extinction, absorption and scattering of the
//     effective-medium sphere, with the angular distribution of the
//     scattered light shared between the sphere and its independently
//     scattering primaries in proportion to the fluctuation (incoherent)
//     share of the scattering, (1 − φ)·N·C_sca,p (Debye & Bueche 1949);
//     the sphere's interference in its phase shift is averaged over the
//     rays' primaries (see Primary particles).
//
// # Primary particles
//
// Natural primaries are polydisperse (floc.Fractal.PrimaryGSD; default
// σ_g = 2 around a Sauter diameter D32 = PrimaryDiameter). Every method
// uses the primaries' cross-sections and S11 averaged over their volume
// distribution, per primary of the representative volume πD32³/6, so that
// N = (D/D32)^n_f such primaries carry the floc's dry mass (floc.Fractal).
// The average is a midpoint rule in size parameter with steps of 0.25
// over ±3σ of the volume distribution (rdg.go, subPoints), fine enough to
// resolve the primaries' Mie ripple: identical primaries (σ_g = 1, exactly
// the one-primary Lorenz–Mie result) make floc b_b spectra ripple by
// by 10–30 % between wavelengths 25 nm apart, and fitted spectral slopes
// then depend on the wavelength grid (0.44 on a 10 nm grid, 0.33 on a
// 100 nm grid for 100 µm flocs); with the default spread the roughness of
// ln b_b against ln λ falls 480-fold (FractalRDG) and the two grids' slopes
// agree to within the spectrum's curvature (TestFlocSpectraSmooth). The
// cost is paid once per wavelength and Workspace: 0.04–0.2 s for the
// default primaries against 0.1–0.4 ms for identical ones
// (BenchmarkPrimaries).
//
// A second ripple has the same cause. Composite's C_ext and C_sca come from
// the homogeneous porous sphere, whose interference structure in the phase
// shift ρ (Q_ext oscillating about 2 with amplitude ≈ 4/ρ, van de Hulst
// 1957) does not average out over floc size for n_f = 2, because ρ is then
// the same for every size (below): with one phase shift for every ray,
// floc b undulates by ±20 % over 400–900 nm (period ≈ 300 nm at ρ ≈ 10)
// and its fitted slope changes from 0.29 on a 10 nm grid to 0.06 on a
// 100 nm grid. In a real open floc (about 1.5 primaries along a central ray
// for n_f = 2) the phase delay of a ray is that of the primaries it
// crosses, so Composite averages the sphere's interference over the
// primaries' sizes in anomalous diffraction (rayPhaseCorrection in
// composite.go; Composite.UniformPhase switches it off). With both
// averages, for 100 µm flocs, the roughness of ln b falls from 12.9 to 0.28
// and that of ln b_b from 282 to 0.64, and the slopes of b and b_b on the
// 10 nm and 100 nm grids agree to 0.003 after the spectra's smooth
// curvature is allowed for (TestFlocSpectraSmooth). Flocs of a few
// primaries (D ≲ 2D_p) remain nearly solid spheres and keep some ripple.
//
// # Validity
//
// Two numbers decide which physics applies; CrossSections reports both:
//
//   - the phase shift through the floc, ρ = 2x|m_v − 1| with x = πD·n_w/λ and
//     m_v = 1 + φ(m − 1). For n_f = 2 it is independent of size
//     (x·φ = πD_p·n_w/λ), about 10 for 4 µm mineral primaries in visible
//     light: every such floc is far outside the RDG condition ρ ≪ 1.
//   - the optical depth across the floc from its primaries,
//     τ ≈ 3φD/D_p·(Q_ext,p/2), also size-independent for n_f = 2 (about 3):
//     multiple scattering and shadowing inside the floc are not small.
//
// RDG ignores both: it adds the primaries' fields coherently as if each saw
// the incident wave. Its coherent forward lobe N²·S11_p(0)·S(q) then grows
// faster than the floc's projected area, and attenuation per unit mass
// rises with size without bound (four times the observed range at 1 mm,
// table below), against the observation that attenuation per unit mass of
// natural particles varies little (0.2–0.6 m² g⁻¹, Opt. Express 17:9408,
// 2009) and falls, not rises, when aggregates form. RDG stays right where
// q·D_p ≫ 1, i.e. at backward angles for primaries larger than the
// wavelength: there the primaries scatter incoherently (the 1/N self term)
// and b_b per unit mass equals that of the dispersed primaries.
//
// The effective-medium sphere includes shadowing and the large-particle
// extinction limit (Q_ext → 2 once ρ ≫ 1), so its attenuation per unit mass
// is nearly size-independent for n_f ≈ 2 — the observed behaviour. But a
// smooth sphere with |m_eff − 1| ~ 10⁻² scatters almost only forward: its
// backscattering ratio falls from 2.5×10⁻² (primaries) to 10⁻⁶ and below
// (table), whereas b_b per unit mass of natural particles is well
// constrained at about 0.012 m² g⁻¹ for mineral-dominated samples
// (Neukermans et al. 2012, L&O 57:124).
//
// Composite is the default because it keeps the part of each that its
// physics supports: the sphere's extinction (shadowing, extinction limit)
// and the primaries' wide-angle scattering. It reduces exactly to Mie for
// one primary (of identical primaries) or a solid floc, conserves energy (∫VSF = C_sca, b_b < b < c),
// and gives c* ≈ 0.31 m² g⁻¹ and b_b* ≈ 0.008 m² g⁻¹ for n_f = 2 mineral flocs
// of any size, within the published ranges, with a b_b spectral slope
// (η ≈ 0.24–0.30) close to the dispersed primaries'. Its limits: the near-forward
// VSF (θ ≲ λ/D_p) is that of the primaries, not the much narrower
// diffraction peak of the whole floc, so acceptance-angle corrections of
// transmissometers are underestimated for large flocs; and for very open
// flocs (n_f < 2) much larger than the wavelength, where ρ becomes small,
// the primaries' scattering should add to the sphere's and FractalRDG is
// better.
//
// # Comparison table
//
// Mass-specific optics of n_f = 2 flocs against the same mass as dispersed
// primaries, regenerated by `go test ./floc/optics -run TestComparisonTable
// -update` (the test fails when this table is stale):
//
// The table below is generated by TestComparisonTable; do not edit it by hand.
//
//	primaries log-normal, Sauter diameter D_p = 4 µm, σ_g = 2, ρ_s = 2650 kg m⁻³,
//	m = 1.17 + 0.0003i (relative to water, n_w = 1.34), n_f = 2
//	c*, b*, b_b* per unit dry mass at 555 nm (m² g⁻¹); B̃ = b_b/b at 555 nm; η: b_b ∝ λ^−η fitted over 443–670 nm
//
//	dispersed primaries (same mass):  c* 0.342  b* 0.337  b_b* 0.00856  B̃ 0.0254  η 0.24
//
//	composite
//	  D (µm)      c*      b*      b_b*        B̃      η
//	      10   0.323   0.319  5.44e-03  1.71e-02   0.30
//	      30   0.317   0.313  7.42e-03  2.37e-02   0.24
//	     100   0.313   0.310  7.87e-03  2.54e-02   0.28
//	     300   0.312   0.309  7.83e-03  2.54e-02   0.29
//	    1000   0.311   0.308  7.82e-03  2.54e-02   0.29
//
//	rdg-fisher-burford
//	  D (µm)      c*      b*      b_b*        B̃      η
//	      10   0.627   0.622  8.57e-03  1.38e-02   0.24
//	      30   1.203   1.199  8.58e-03  7.16e-03   0.24
//	     100   2.070   2.066  8.58e-03  4.15e-03   0.24
//	     300   2.949   2.945  8.58e-03  2.91e-03   0.24
//	    1000   3.934   3.930  8.58e-03  2.18e-03   0.24
//
//	effective-medium-maxwell-garnett
//	  D (µm)      c*      b*      b_b*        B̃      η
//	      10   0.343   0.339  8.83e-04  2.60e-03   1.67
//	      30   0.330   0.327  2.47e-05  7.57e-05   0.26
//	     100   0.325   0.322  1.85e-06  5.75e-06  -0.03
//	     300   0.323   0.320  2.03e-07  6.36e-07  -0.03
//	    1000   0.323   0.319  1.82e-08  5.71e-08  -0.03
//
//	solid spheres of the same material and size (Mie), c* at 555 nm (m² g⁻¹):
//	10 µm 0.1133, 30 µm 0.0378, 100 µm 0.0114, 300 µm 0.0038, 1000 µm 0.0011
//
// End of the generated table.
//
// # Kernels
//
// Evaluator plugs any Method into the kernel tables of package mie/kernel
// (the same table type, bin averaging and deterministic parallel builder as
// the sphere kernels). Per wavelength each worker averages the primaries
// once (above); the fractal method then costs one structure-factor
// evaluation per quadrature node per floc size, and the effective-medium
// sphere a Lorenz–Mie series of length ≈ x per size (x up to 10⁴ for 1 mm
// flocs in blue light), which dominates Composite's cost; its
// hemispherical backscattering, O(x log x) in package mie, is needed by
// Composite only where the primaries' share w < 1 (flocs of a few
// primaries). Measured (BenchmarkKernel, 100 sizes × 20 wavelengths,
// 2 workers on a shared 2-core machine): 3.8 s for Composite (1.9 ms per
// cell), of which about half is the primaries' averages, computed by each
// worker for each wavelength (BenchmarkPrimaries: 0.04–0.22 s each), and
// most of the rest the porous sphere's Lorenz–Mie series; 7 s for
// FractalRDG, dominated by its node tables (0.1–0.7 s per wavelength and
// worker). With identical primaries (σ_g = 1) these averages cost under
// 1 ms.
//
// # Use in a scenario
//
// For one sediment class at one place and time:
//
//  1. floc.Model.Equilibrium or Step gives the median floc size from shear,
//     concentration and salinity; Model.Population adds the spread and the
//     unflocculated fraction.
//  2. A kernel table built once per run, kernel.Build(Evaluator{…}, spec)
//     with spec.Edges from the primary diameter upward, holds the per-floc
//     cross-sections. Beyond a few primary diameters floc cross-sections are
//     smooth in floc size (the porous sphere's index is too close to water's
//     for Mie ripple), but flocs of a few primaries are nearly solid and do
//     ripple; with bins up to 0.055 wide in ln D (100 bins over 4 µm–1 mm)
//     the default SubStep with MaxSub 16 gives bin averages within 2e-3 of
//     converged ones (tested), at a fraction of the sphere default's cost.
//  3. floc.Population.BinNumbers turns the class's mass concentration into
//     floc numbers per bin; the bulk IOPs are the dot products with the
//     table (mie/kernel). The unflocculated primaries go through a sphere
//     kernel of package mie/kernel, with the same size distribution
//     (floc.Fractal.PrimaryDistribution) for consistency with the flocs.
//
// # Units
//
// SI: diameters and vacuum wavelengths in m, cross-sections in m²,
// differential cross-sections in m² sr⁻¹, angles as cosines μ = cos θ.
// Indices are relative to water with m = n + ik, k ≥ 0 absorbing
// (Bohren & Huffman 1983 convention, as package mie).
package optics
