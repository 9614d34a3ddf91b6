package iop

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie/kernel"
)

// PowerLaw is a spectrum X(λ) = Value·(λ/Ref)^(−Slope).
type PowerLaw struct {
	Ref   float64 // reference wavelength, m
	Value float64 // X at Ref from the fit, in X's unit
	Slope float64 // spectral slope γ, dimensionless (positive: X falls with λ)
	RMS   float64 // root-mean-square residual of ln X, dimensionless
}

// At evaluates the power law at wavelength lambda (m).
func (p PowerLaw) At(lambda float64) float64 {
	return p.Value * math.Pow(lambda/p.Ref, -p.Slope)
}

// FitPowerLaw fits X(λ) = X0 (λ/ref)^(−γ) to all points (wavelengths[i],
// values[i]) by least squares of ln X against ln λ (the slope comes from
// kernel.PowerLawSlope; Boss, Twardowski & Herring 2001 use this hyperbolic
// slope for c_p). X0 is the least-squares intercept for that slope. It
// needs at least two distinct wavelengths, every value > 0, and ref > 0; it
// allocates nothing.
func FitPowerLaw(wavelengths, values []float64, ref float64) (PowerLaw, error) {
	return fitBand(wavelengths, values, math.Inf(-1), math.Inf(1), ref)
}

func fitBand(wl, v []float64, lo, hi, ref float64) (PowerLaw, error) {
	if !(ref > 0) || math.IsInf(ref, 0) {
		return PowerLaw{}, fmt.Errorf("iop: power-law fit: reference wavelength %g m (need a positive finite value in m)", ref)
	}
	g, err := kernel.PowerLawSlope(wl, v, lo, hi)
	if err != nil {
		return PowerLaw{}, fmt.Errorf("iop: %w", err)
	}
	// With the slope fixed, the least-squares ln X0 is the band mean of
	// ln X + γ ln(λ/ref); the residuals follow.
	var n, sum float64
	for i, l := range wl {
		if l >= lo && l <= hi {
			sum += math.Log(v[i]) + g*math.Log(l/ref)
			n++
		}
	}
	lnX0 := sum / n
	var ss float64
	for i, l := range wl {
		if l >= lo && l <= hi {
			r := math.Log(v[i]) + g*math.Log(l/ref) - lnX0
			ss += r * r
		}
	}
	return PowerLaw{Ref: ref, Value: math.Exp(lnX0), Slope: g, RMS: math.Sqrt(ss / n)}, nil
}

// Slope fits a power law to quantity q of component c over the wavelengths
// of s inside [lo, hi] (m), with reference wavelength ref (m). It allocates
// nothing (c's values are staged in a workspace of s, so Slope is not safe
// for concurrent use on one Spectra).
func (s *Spectra) Slope(c *Component, q Quantity, lo, hi, ref float64) (PowerLaw, error) {
	if err := s.sized(c); err != nil {
		return PowerLaw{}, err
	}
	s.tmp = c.Values(s.tmp, q)
	p, err := fitBand(s.Wavelengths, s.tmp, lo, hi, ref)
	if err != nil {
		return PowerLaw{}, fmt.Errorf("iop: %s slope of %q over [%g, %g] m: %w", q, c.Name, lo, hi, err)
	}
	return p, nil
}
