package floc

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie/psd"
)

// Fractal describes a population of self-similar aggregates built from
// spherical primary particles (Kranenburg 1994, Estuar. Coast. Shelf Sci.
// 39:451–460). The zero value is not valid; see DefaultFractal.
//
// The primaries may be polydisperse: log-normal by number with geometric
// standard deviation PrimaryGSD. The fractal relations then use one
// representative primary diameter, the Sauter diameter D32 = M3/M2 of the
// primaries (PrimaryDiameter), because it is the diameter that keeps the
// primaries' specific surface (surface per unit solid volume, 6/D32) and
// so both the geometric-optics cross-section per unit mass
// (C/M → 3Q/(2ρ_s·D32) for primaries much larger than the wavelength) and
// the Kozeny–Carman permeability of the floc (common practice) equal to
// those of identical primaries of that size. N counts primaries of that
// representative size; a polydisperse floc holds N·(D32/D30)³ real primaries
// (D30 = M3^(1/3)/M0^(1/3), the mean-volume diameter), and its dry mass is
// the one given by N and D32 (Aggregate), exactly as for identical ones.
type Fractal struct {
	// PrimaryDiameter D_p of the primary particles, m: their diameter if
	// monodisperse, their Sauter diameter D32 otherwise. Allowed (0, 1e-3].
	PrimaryDiameter float64
	// PrimaryDensity ρ_s, the grain density of the primary particles,
	// kg m⁻³. Allowed (1000, 10000).
	PrimaryDensity float64
	// Dimension n_f, the three-dimensional (mass) fractal dimension.
	// Allowed (1, 3]; 3 is a solid sphere.
	Dimension float64
	// PrimaryGSD σ_g is the geometric standard deviation of the primaries'
	// log-normal size distribution, 1. 0 means DefaultPrimaryGSD; 1 means
	// identical primaries (monodisperse). Allowed 0 or [1, 2.5]. Only the
	// optics (package floc/optics) depend on it.
	PrimaryGSD float64
}

// DefaultPrimaryGSD is the geometric standard deviation of the primaries
// when Fractal.PrimaryGSD is 0. With the default Sauter diameter of 4 µm
// it gives a count median of 1.2 µm and puts 99.7 % of the primaries
// (±3 standard deviations) within 0.15–9.6 µm, the clay-mineral sizes
// "median about 1–2 µm, spread 0.1–10 µm" of the coastal-engineering
// summary cited in the research note estuary-and-flocs.md §B1 (Coastal
// Wiki, "Flocculation cohesive sediments"). It is also wide enough to
// average away the interference ripple of the primaries' Mie
// cross-sections in wavelength (period Δln x ≈ 2π/ρ_p ≈ 0.4–0.7 for
// ρ_p = 2x_p|m − 1| ≈ 9–16 at 4 µm), which σ = ln σ_g = 0.69 spans.
const DefaultPrimaryGSD = 2

// PrimarySpread returns the geometric standard deviation in force:
// PrimaryGSD, or DefaultPrimaryGSD when it is 0.
func (f Fractal) PrimarySpread() float64 {
	if f.PrimaryGSD == 0 {
		return DefaultPrimaryGSD
	}
	return f.PrimaryGSD
}

// PrimaryDistribution returns the primaries' number size distribution,
// log-normal with n particles per m³ (n ≥ 0), geometric standard deviation
// PrimarySpread() and Sauter diameter PrimaryDiameter: by the Hatch–Choate
// relations (Hatch & Choate 1929, J. Franklin Inst. 207:369) the count
// median is Dg = D32·exp(−2.5 ln²σ_g). Errors for an invalid Fractal and
// for identical primaries (σ_g = 1, not a log-normal).
func (f Fractal) PrimaryDistribution(n float64) (psd.Lognormal, error) {
	if err := f.Validate(); err != nil {
		return psd.Lognormal{}, err
	}
	g := f.PrimarySpread()
	if g == 1 {
		return psd.Lognormal{}, fmt.Errorf("floc: PrimaryGSD = 1: identical primaries have no log-normal distribution")
	}
	s := math.Log(g)
	l := psd.Lognormal{N: n, Median: f.PrimaryDiameter * math.Exp(-2.5*s*s), GSD: g}
	return l, l.Validate()
}

// DefaultFractal is a mineral mud floc: 4 µm primaries of quartz/clay grain
// density 2650 kg m⁻³ (grain density: common practice) with n_f = 2, the value
// Winterwerp (1998) used for Ems mud. The 4 µm primary size is the one used
// with that calibration (see Kinetics); it is taken as the Sauter diameter
// of primaries spread with DefaultPrimaryGSD.
var DefaultFractal = Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 2, PrimaryGSD: DefaultPrimaryGSD}

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
	if !(f.PrimaryGSD == 0 || f.PrimaryGSD >= 1 && f.PrimaryGSD <= 2.5) {
		return rangeError("PrimaryGSD", f.PrimaryGSD, "0 (default) or [1, 2.5]", "1")
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
