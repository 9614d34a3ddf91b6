package seen

import (
	"fmt"
	"math"
)

// ReflectanceModel is a quadratic model of subsurface remote-sensing
// reflectance r_rs (L_u/E_d just below the surface, sr⁻¹) in
// u = b_b/(a + b_b):
//
//	r_rs = G1·u + G2·u².
//
// The models assume an optically deep, vertically homogeneous water column
// and ignore the dependence on sun and viewing geometry, bottom reflection,
// fluorescence and Raman scattering.
type ReflectanceModel struct {
	// Name identifies the model in output.
	Name string
	// G1 is the linear coefficient, sr⁻¹.
	G1 float64
	// G2 is the quadratic coefficient, sr⁻¹.
	G2 float64
	// UMax is the upper end of u for which the coefficients were fitted,
	// dimensionless; larger u is flagged with FlagOutsideFit.
	UMax float64
}

var (
	// Gordon1988 is the fit of Gordon, Brown, Evans, Brown, Smith, Baker &
	// Clark (1988, "A semianalytic radiance model of ocean color", J.
	// Geophys. Res. 93(D9):10909–10924): g1 = 0.0949, g2 = 0.0794 sr⁻¹,
	// read as subsurface r_rs as in Lee et al. (2002).
	// UMax = 0.25 is from memory (the Monte Carlo simulations behind the fit
	// covered oceanic waters); check the paper before relying on it.
	Gordon1988 = ReflectanceModel{Name: "Gordon1988", G1: 0.0949, G2: 0.0794, UMax: 0.25}
	// Lee2002 is the form used by Lee, Carder & Arnone (2002, "Deriving
	// inherent optical properties from water color: a multiband
	// quasi-analytical algorithm for optically deep waters", Appl. Opt.
	// 41(27):5755–5772): g0 = 0.089, g1 = 0.125 sr⁻¹. UMax = 0.25 is from
	// memory, as for Gordon1988.
	Lee2002 = ReflectanceModel{Name: "Lee2002", G1: 0.089, G2: 0.125, UMax: 0.25}
)

// Coefficients of the sub- to above-surface conversion of Lee et al. (2002):
// R_rs = 0.52 r_rs / (1 − 1.7 r_rs). 0.52 collects the transmission of the
// surface in both directions over n²; 1.7 r_rs the internal reflection of
// upwelling light.
const (
	surfaceT = 0.52
	surfaceR = 1.7
)

// AboveSurface converts subsurface r_rs (sr⁻¹) to above-surface remote-
// sensing reflectance R_rs (sr⁻¹) with Lee et al. (2002):
// R_rs = 0.52 r_rs/(1 − 1.7 r_rs). Valid for r_rs in [0, 1/1.7); outside it
// an error is returned (quadratic models give at most G1 + G2 ≈ 0.2).
func AboveSurface(rrs float64) (float64, error) {
	if !(rrs >= 0 && rrs < 1/surfaceR) {
		return 0, fmt.Errorf("seen: subsurface r_rs = %g sr⁻¹ is outside [0, %g) sr⁻¹", rrs, 1/surfaceR)
	}
	return surfaceT * rrs / (1 - surfaceR*rrs), nil
}

// BelowSurface is the inverse of AboveSurface: r_rs = R_rs/(0.52 + 1.7 R_rs),
// valid for R_rs ≥ 0.
func BelowSurface(Rrs float64) (float64, error) {
	if !(Rrs >= 0) || math.IsInf(Rrs, 1) {
		return 0, fmt.Errorf("seen: above-surface R_rs = %g sr⁻¹ is outside [0, +∞) sr⁻¹", Rrs)
	}
	return Rrs / (surfaceT + surfaceR*Rrs), nil
}

// Subsurface returns r_rs (sr⁻¹) for absorption a and backscattering b_b
// (m⁻¹), with FlagOutsideFit when u exceeds m.UMax. a + b_b must be
// positive.
func (m ReflectanceModel) Subsurface(a, bb float64) (float64, Flag, error) {
	if !(a >= 0 && a <= MaxCoefficient) || !(bb >= 0 && bb <= MaxCoefficient) || a+bb <= 0 {
		return 0, 0, fmt.Errorf("seen: a = %g m⁻¹, b_b = %g m⁻¹: need both in [0, %g] m⁻¹ and a + b_b > 0", a, bb, float64(MaxCoefficient))
	}
	u := bb / (a + bb)
	var f Flag
	if u > m.UMax {
		f = FlagOutsideFit
	}
	return (m.G1 + m.G2*u) * u, f, nil
}

// Rrs fills dst (len = number of wavelengths) with above-surface R_rs
// (sr⁻¹) for the spectra s, and returns the union of flags. It allocates
// nothing.
func (m ReflectanceModel) Rrs(dst []float64, s Spectra) (Flag, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	if len(dst) != len(s.Wavelength) {
		return 0, fmt.Errorf("seen: dst has %d values for %d wavelengths", len(dst), len(s.Wavelength))
	}
	if !(m.G1 >= 0 && m.G2 >= 0 && m.G1+m.G2 < 1/surfaceR) {
		return 0, fmt.Errorf("seen: ReflectanceModel %q: G1 = %g, G2 = %g sr⁻¹ need G1, G2 ≥ 0 and G1 + G2 < %g sr⁻¹", m.Name, m.G1, m.G2, 1/surfaceR)
	}
	var flags Flag
	for i := range dst {
		r, f, err := m.Subsurface(s.A[i], s.Bb[i])
		if err != nil {
			return 0, err
		}
		flags |= f
		dst[i] = surfaceT * r / (1 - surfaceR*r)
	}
	return flags, nil
}
