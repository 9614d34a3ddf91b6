package iop

import (
	"fmt"
	"math"
)

// PowerLaw is a spectrum X(λ) = Value·(λ/Ref)^(−Slope).
type PowerLaw struct {
	Ref   float64 // reference wavelength, m
	Value float64 // X at Ref, in X's unit
	Slope float64 // spectral slope γ, dimensionless (positive: X falls with λ)
	RMS   float64 // root-mean-square residual of ln X, dimensionless
}

// At evaluates the power law at wavelength lambda (m).
func (p PowerLaw) At(lambda float64) float64 {
	return p.Value * math.Pow(lambda/p.Ref, -p.Slope)
}

// FitPowerLaw fits X(λ) = X0 (λ/ref)^(−γ) to the points (wavelengths[i],
// values[i]) by ordinary least squares of ln X against ln λ (common
// practice for the hyperbolic slope of c_p and b_bp; Boss, Twardowski &
// Herring 2001). It needs at least two distinct wavelengths, every value
// > 0, and ref > 0; it allocates nothing. Equal weights in log space give
// every wavelength the same relative importance.
func FitPowerLaw(wavelengths, values []float64, ref float64) (PowerLaw, error) {
	if len(wavelengths) != len(values) {
		return PowerLaw{}, fmt.Errorf("iop: power-law fit: %d wavelengths but %d values", len(wavelengths), len(values))
	}
	return fitPowerLaw(wavelengths, values, nil, ref)
}

// fitPowerLaw fits v1[i] (+ v2[i] if v2 is not nil) against wl[i].
func fitPowerLaw(wl, v1, v2 []float64, ref float64) (PowerLaw, error) {
	if len(wl) < 2 {
		return PowerLaw{}, fmt.Errorf("iop: power-law fit: %d points (need at least 2)", len(wl))
	}
	if !(ref > 0) || math.IsInf(ref, 0) {
		return PowerLaw{}, fmt.Errorf("iop: power-law fit: reference wavelength %g m (need a positive finite value in m)", ref)
	}
	val := func(i int) float64 {
		if v2 != nil {
			return v1[i] + v2[i]
		}
		return v1[i]
	}
	// Centre the abscissa for a well-conditioned fit.
	var mx, my float64
	for i, l := range wl {
		if !(l > 0) || math.IsInf(l, 0) {
			return PowerLaw{}, fmt.Errorf("iop: power-law fit: wavelength %g m at index %d (need > 0)", l, i)
		}
		v := val(i)
		if !(v > 0) || math.IsInf(v, 0) {
			return PowerLaw{}, fmt.Errorf("iop: power-law fit: value %g at %g m (need a positive finite value: a power law cannot pass through zero)", v, l)
		}
		mx += math.Log(l / ref)
		my += math.Log(v)
	}
	n := float64(len(wl))
	mx /= n
	my /= n
	var sxx, sxy float64
	for i, l := range wl {
		dx := math.Log(l/ref) - mx
		sxx += dx * dx
		sxy += dx * (math.Log(val(i)) - my)
	}
	if sxx == 0 {
		return PowerLaw{}, fmt.Errorf("iop: power-law fit: all wavelengths equal (%g m)", wl[0])
	}
	beta := sxy / sxx // d ln X / d ln λ
	alpha := my - beta*mx
	var ss float64
	for i, l := range wl {
		r := math.Log(val(i)) - alpha - beta*math.Log(l/ref)
		ss += r * r
	}
	return PowerLaw{Ref: ref, Value: math.Exp(alpha), Slope: -beta, RMS: math.Sqrt(ss / n)}, nil
}

// Slope fits a power law to quantity q of component c over the wavelengths
// of s inside [lo, hi] (m), with reference wavelength ref (m). It allocates
// nothing.
func (s *Spectra) Slope(c *Component, q Quantity, lo, hi, ref float64) (PowerLaw, error) {
	i0, i1 := -1, -1
	for i, l := range s.Wavelengths {
		if l >= lo && l <= hi {
			if i0 < 0 {
				i0 = i
			}
			i1 = i + 1
		}
	}
	if i0 < 0 || i1-i0 < 2 {
		return PowerLaw{}, fmt.Errorf("iop: %s slope of %q: band [%g, %g] m holds fewer than 2 grid wavelengths", q, c.Name, lo, hi)
	}
	wl := s.Wavelengths[i0:i1]
	switch q {
	case Absorption:
		return fitPowerLaw(wl, c.A[i0:i1], nil, ref)
	case Scattering:
		return fitPowerLaw(wl, c.B[i0:i1], nil, ref)
	case Backscattering:
		return fitPowerLaw(wl, c.Bb[i0:i1], nil, ref)
	case Attenuation:
		return fitPowerLaw(wl, c.A[i0:i1], c.B[i0:i1], ref)
	}
	return PowerLaw{}, fmt.Errorf("iop: unknown quantity %d", uint8(q))
}
