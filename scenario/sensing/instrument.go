package sensing

import (
	"fmt"

	"github.com/murk-optics/murk/scenario/seen"
)

// Point is the optics at one point, handed to every instrument: totals of
// all components (water, dissolved matter, particles) on the run's
// wavelength and angle grids. The slices are borrowed: an instrument reads
// them and keeps nothing.
type Point struct {
	Wavelengths []float64 // vacuum wavelength, m, increasing
	Angles      []float64 // scattering angle, rad, increasing
	A, B, Bb    []float64 // total absorption, scattering, backscattering, m⁻¹, per wavelength
	VSF         []float64 // total β, m⁻¹ sr⁻¹, [w·len(Angles) + a]
	Salinity    float64   // PSU
	Temperature float64   // °C
	// Rrs is the remote-sensing reflectance just above the surface, sr⁻¹,
	// per wavelength, for a point in the surface layer; nil elsewhere.
	Rrs []float64

	beta []float64 // scratch: the VSF at one wavelength
}

// NewPoint returns a point on the given grids with its scratch space; the
// caller sets the optics fields before each Read.
func NewPoint(wavelengths, angles []float64) *Point {
	return &Point{Wavelengths: wavelengths, Angles: angles, beta: make([]float64, len(angles))}
}

// Description says what an instrument reports.
type Description struct {
	Name         string  // the instrument's name in the scenario
	Kind         string  // transmissometer, backscatter, turbidity, radiometer
	Quantity     string  // what the reading estimates, in words with its symbol
	Unit         string  // UDUNITS unit of the reading
	StandardName string  // CF standard name of the quantity, "" when CF has none
	Wavelength   float64 // m
}

// Reading is one simulated reading.
type Reading struct {
	Value float64   // the reading, in Description.Unit
	True  float64   // the model's own value of the quantity the reading estimates
	Flags seen.Flag // the sensor model's flags
	// Counts is the digitiser output when the instrument is Digitised
	// (HasCounts), else 0.
	Counts    float64
	HasCounts bool
}

// Instrument is a simulated sensor.
type Instrument interface {
	Describe() Description
	// Angles are the scattering angles, rad, at which the instrument
	// needs the VSF (none for a transmissometer or a radiometer).
	Angles() []float64
	// Read returns the reading at point p.
	Read(p *Point) (Reading, error)
}

// interpolate returns a, b, b_b at lambda, linear between the two nearest
// grid wavelengths (IOP spectra are smooth on the scale of a grid step;
// common practice), and fills p's scratch VSF at lambda.
func (p *Point) interpolate(lambda float64) (a, b, bb float64, vsf seen.VSF) {
	l, u := wavelengthWeights(p.Wavelengths, lambda)
	l1 := min(l+1, len(p.Wavelengths)-1)
	na := len(p.Angles)
	a = (1-u)*p.A[l] + u*p.A[l1]
	b = (1-u)*p.B[l] + u*p.B[l1]
	bb = (1-u)*p.Bb[l] + u*p.Bb[l1]
	for j := 0; j < na; j++ {
		p.beta[j] = (1-u)*p.VSF[l*na+j] + u*p.VSF[l1*na+j]
	}
	return a, b, bb, seen.VSF{Angle: p.Angles, Beta: p.beta}
}

// wavelengthWeights returns the grid index l and weight u so that a value
// at lambda is (1−u)·v[l] + u·v[l+1] (l+1 clamped to the grid).
func wavelengthWeights(wl []float64, lambda float64) (int, float64) {
	n := len(wl)
	if n == 1 || lambda <= wl[0] {
		return 0, 0
	}
	for l := 0; l < n-1; l++ {
		if lambda <= wl[l+1] {
			return l, (lambda - wl[l]) / (wl[l+1] - wl[l])
		}
	}
	return n - 2, 1
}

// wrap prefixes an instrument's error with its name.
func wrap(name string, err error) error { return fmt.Errorf("instrument %q: %w", name, err) }
