package floc

import (
	"fmt"
	"math"
)

// Fractal describes a population of self-similar aggregates built from
// identical spherical primary particles (Kranenburg 1994, Estuar. Coast.
// Shelf Sci. 39:451–460). The zero value is not valid; see DefaultFractal.
type Fractal struct {
	// PrimaryDiameter D_p of the primary particles, m. Allowed (0, 1e-3].
	PrimaryDiameter float64
	// PrimaryDensity ρ_s, the grain density of the primary particles,
	// kg m⁻³. Allowed (1000, 10000).
	PrimaryDensity float64
	// Dimension n_f, the three-dimensional (mass) fractal dimension.
	// Allowed (1, 3]; 3 is a solid sphere.
	Dimension float64
}

// DefaultFractal is a mineral mud floc: 4 µm primaries of quartz/clay grain
// density 2650 kg m⁻³ (grain density: common practice) with n_f = 2, the value
// Winterwerp (1998) used for Ems mud. The 4 µm primary size is the one used
// with that calibration (see Kinetics).
var DefaultFractal = Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 2}

// Validate reports the first field outside its allowed range.
func (f Fractal) Validate() error {
	if !(f.PrimaryDiameter > 0 && f.PrimaryDiameter <= 1e-3) {
		return rangeError("PrimaryDiameter", f.PrimaryDiameter, "(0, 1e-3]", "m")
	}
	if !(f.PrimaryDensity > 1000 && f.PrimaryDensity < 10000) {
		return rangeError("PrimaryDensity", f.PrimaryDensity, "(1000, 10000)", "kg m-3")
	}
	if !(f.Dimension > 1 && f.Dimension <= 3) {
		return rangeError("Dimension", f.Dimension, "(1, 3]", "1")
	}
	return nil
}

// Aggregate is the structure of one floc of a given size.
type Aggregate struct {
	Diameter      float64 // D, the floc diameter, m
	Primaries     float64 // N = (D/D_p)^n_f, number of primary particles (real-valued), 1
	SolidFraction float64 // φ = (D/D_p)^(n_f−3), volume fraction of solids inside the floc, 1
	Porosity      float64 // 1 − φ, 1
	ExcessDensity float64 // Δρ_f = (ρ_s − ρ_w)·φ, floc density minus water density, kg m⁻³
	Density       float64 // ρ_f = ρ_w + Δρ_f, wet bulk density of the floc, kg m⁻³
	DryMass       float64 // ρ_s·φ·πD³/6 = N·ρ_s·πD_p³/6, mass of solids in the floc, kg
}

// Aggregate returns the structure of a floc of diameter d (m) in water of
// density waterDensity (kg m⁻³), from the fractal relations of Kranenburg
// (1994): N = (D/D_p)^n_f with unit prefactor, so that φ = N(D_p/D)³ and
// Δρ_f = (ρ_s − ρ_w)(D/D_p)^(n_f−3).
//
// Valid for D ≥ D_p (the floc is at least one primary); d = D_p gives a
// single solid primary (N = 1, φ = 1) for every n_f. For n_f = 3 every size
// is solid. Errors name the field, value and range for d < D_p, d > 0.1 m,
// an invalid Fractal or a water density outside [900, 1100) or not below ρ_s.
func (f Fractal) Aggregate(d, waterDensity float64) (Aggregate, error) {
	if err := f.Validate(); err != nil {
		return Aggregate{}, err
	}
	if err := f.checkDiameter("Diameter", d); err != nil {
		return Aggregate{}, err
	}
	if !(waterDensity >= 900 && waterDensity < 1100 && waterDensity < f.PrimaryDensity) {
		return Aggregate{}, rangeError("WaterDensity", waterDensity, "[900, 1100) and below PrimaryDensity", "kg m-3")
	}
	r := d / f.PrimaryDiameter
	phi := math.Pow(r, f.Dimension-3)
	a := Aggregate{
		Diameter:      d,
		Primaries:     math.Pow(r, f.Dimension),
		SolidFraction: phi,
		Porosity:      1 - phi,
		ExcessDensity: (f.PrimaryDensity - waterDensity) * phi,
		DryMass:       f.PrimaryDensity * phi * math.Pi * d * d * d / 6,
	}
	a.Density = waterDensity + a.ExcessDensity
	return a, nil
}

// SolidFraction returns φ = (D/D_p)^(n_f−3) for a floc of diameter d (m).
// Errors as Aggregate for d.
func (f Fractal) SolidFraction(d float64) (float64, error) {
	if err := f.Validate(); err != nil {
		return 0, err
	}
	if err := f.checkDiameter("Diameter", d); err != nil {
		return 0, err
	}
	return math.Pow(d/f.PrimaryDiameter, f.Dimension-3), nil
}

// GyrationRadius returns the radius of gyration R_g (m) of a floc of
// diameter d (m) whose mass density falls as r^(n_f−3) from its centre out
// to radius D/2, the radial profile implied by self-similarity:
// R_g² = n_f/(n_f+2)·(D/2)² (pure geometry: ∫r²·r^(n_f−1)dr / ∫r^(n_f−1)dr).
// For n_f = 3 this is the uniform sphere's √(3/5)·D/2. The result is used by
// the fractal-aggregate optics. No validation beyond d ≥ 0.
func (f Fractal) GyrationRadius(d float64) float64 {
	return 0.5 * d * math.Sqrt(f.Dimension/(f.Dimension+2))
}

// checkDiameter rejects a floc size below the primary size or above 0.1 m.
func (f Fractal) checkDiameter(field string, d float64) error {
	// Allow one part in 1e12 below D_p so that D = D_p computed from a
	// grid does not fail on rounding.
	if !(d >= f.PrimaryDiameter*(1-1e-12) && d <= 0.1) {
		return fmt.Errorf("floc: %s = %g m is outside the allowed range [PrimaryDiameter = %g m, 0.1 m] (a floc is at least one primary particle)", field, d, f.PrimaryDiameter)
	}
	return nil
}

// rangeError is the package's error for a value outside its range.
func rangeError(field string, v float64, allowed, unit string) error {
	if unit == "1" {
		unit = "(dimensionless)"
	}
	return fmt.Errorf("floc: %s = %g is outside the allowed range %s %s", field, v, allowed, unit)
}
