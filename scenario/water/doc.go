// Package water gives the inherent optical properties of pure water,
// seawater and the dissolved and pigmented matter murk mixes into it:
// absorption by pure water, molecular scattering and backscattering of water
// and seawater, the real refractive index of seawater (the medium index the
// particle kernels divide by), absorption by coloured dissolved organic
// matter (CDOM) with conservative mixing between a river and an ocean end
// member, and phytoplankton absorption per unit chlorophyll.
//
// # Units
//
// Every wavelength passed to or returned by this package is a vacuum
// wavelength in metres (550 nm is 550e-9). Functions whose name ends in NM
// take nanometres instead and exist only for convenience. Absorption,
// scattering and backscattering coefficients are in m⁻¹, volume scattering
// functions in m⁻¹ sr⁻¹, concentrations in kg m⁻³, spectral slopes in m⁻¹
// (per metre of wavelength: 0.014 nm⁻¹ is 0.014*PerNM = 1.4e7 m⁻¹).
// Salinity is practical salinity (PSS-78, dimensionless, numerically close to
// g kg⁻¹); temperature is in degrees Celsius, as every source formula here is
// written in °C (field names carry the C suffix).
//
// # Pure water absorption
//
// Absorption is read from published tables, embedded with their provenance
// headers in data/, and merged by a fixed rule (see Absorption):
//
//   - 350 ≤ λ < 420 nm: Morel, Gentili, Claustre, Babin, Bricaud, Ras &
//     Tièche (2007), "Optical properties of the 'clearest' natural waters",
//     Limnol. Oceanogr. 52(1):217–229, Table 2a (a_w column, 5 nm grid).
//   - 420 ≤ λ ≤ 700 nm: Pope & Fry (1997), "Absorption spectrum (380–700 nm)
//     of pure water. II. Integrating cavity measurements", Appl. Opt.
//     36(33):8710–8723 (2.5 nm grid).
//   - 700 < λ ≤ 900 nm: Segelstein (1981), "The complex refractive index of
//     water", M.Sc. thesis, as a = 4πk/λ with k interpolated linearly
//     in λ.
//
// Morel et al. (2007) built their column from Pope & Fry at and above
// 420 nm, so the join at 420 nm is continuous (both give 0.00454 m⁻¹). The
// two sources disagree between 380 and 420 nm (at 400 nm Pope & Fry give
// 0.00663, Morel et al. 0.0046 m⁻¹); taking Morel et al. throughout
// 350–420 nm avoids a factor-2 step at 380 nm where Pope & Fry's table
// begins. At 700 nm Pope & Fry (0.624 m⁻¹) and Segelstein (0.605 m⁻¹) differ
// by 3 %, which shows as a step of that size; 700 nm is the upper end of the
// range Pope & Fry measured for (their distributed table continues to
// 727.5 nm). Each source table is also available on its own (PopeFry1997,
// Morel2007, Segelstein1981) for comparison.
//
// The temperature and salinity dependence of water absorption is not
// modelled: Sullivan et al. (2006, Appl. Opt.; volume 45, page 5294 from memory) report no significant
// dependence below 550 nm; their red and near-infrared coefficients were not
// available to us. Pope & Fry measured at 22 °C, Segelstein compiled 25 °C.
//
// # Scattering by water and seawater
//
// Zhang, Hu & He (2009), "Scattering by pure seawater: effect of salinity",
// Opt. Express 17(7):5698–5710: density-fluctuation scattering from the
// Einstein–Smoluchowski theory plus concentration-fluctuation scattering from
// salt, using the seawater refractive index of Quan & Fry (1995), the
// refractive index of air of Ciddor (1996), the isothermal compressibility of
// Lepple & Millero (1971), the UNESCO (1981) seawater density and the water
// activity derivative of Millero & Leung (1976). The volume scattering
// function is β(θ) = β(90°)[1 + cos²θ (1−δ)/(1+δ)], total scattering
// b = (8π/3) β(90°) (2+δ)/(1+δ), and backscattering b_b = b/2 by symmetry
// about 90°. The depolarisation ratio δ defaults to 0.039 (Zhang, Hu & He
// 2009; confirmed for pure water by Zhang et al. 2019, Appl. Opt.
// 58(4):991).
//
// # Refractive index
//
// Quan & Fry (1995), "Empirical equation for the index of refraction of
// seawater", Appl. Opt. 34(18):3477–3480, gives the index relative to air;
// this package multiplies by the index of air (Ciddor 1996, Appl. Opt.
// 35(9):1566) and returns the index relative to vacuum, which is what the
// particle kernels need as the medium index at a vacuum wavelength.
//
// # Dissolved matter and phytoplankton
//
// CDOM absorption is a_g(λ) = a_g(λ0) exp(−S_g (λ−λ0)) (Jerlov 1968;
// Bricaud, Morel & Prieur 1981, Limnol. Oceanogr. 26:43), mixed
// conservatively between two end members by salinity. Phytoplankton
// absorption follows the power law in chlorophyll of Bricaud et al. (1995,
// J. Geophys. Res. 100(C7):13321; 1998, J. Geophys. Res. 103(C13):31033),
// a_φ(λ) = A(λ) Chl^E(λ); the default coefficients are from memory (see
// BricaudDefault). CellIndex turns a chlorophyll-specific absorption into the
// imaginary refractive index of a homogeneous cell using the package-effect
// relation of Morel & Bricaud (1981).
//
// # Validity
//
// Wavelengths 350–900 nm (absorption table range; Quan & Fry's fit covers
// 400–700 nm and is extrapolated outside it, see RefractiveIndex for the
// measured accuracy), salinity 0–42, temperature −2 to 40 °C. Outside these
// ranges every function returns an error naming the field, the value and
// the allowed range with its unit; none returns NaN or
// Inf.
package water
