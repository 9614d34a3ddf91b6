package seen

import (
	"fmt"
	"math"
)

// SingleScatteringDepth is the optical depth τ = (a+b)·L over an instrument
// path above which readings are flagged with FlagThickPath: beyond it a
// noticeable share of the detected light has been scattered more than once
// and the single-scattering relations used here no longer hold (common
// practice; the value is a rule of thumb, not a sharp limit).
const SingleScatteringDepth = 0.5

// Transmissometer is a collimated-beam attenuation meter: a source, a path
// of water of length PathLength, and a detector that accepts light arriving
// within AcceptanceHalfAngle of the beam axis.
//
// Light scattered by less than the acceptance half-angle θ_a is counted as
// transmitted, so the meter reads
//
//	c_m = a + b − 2π ∫_0^θa β(θ) sin θ dθ,   T = exp(−c_m L),
//
// with c = −ln(T)/L the usual definition of measured attenuation (Boss et al.
// 2009, Opt. Express 17(3):1535, who show that smaller acceptance angles read
// higher c because less forward-scattered light is collected). The angular
// response of the detector is taken as a step at θ_a, which McKee et al.
// (2008, Opt. Express 16(24):19480) found a good approximation for the
// attenuation channel of reflecting-tube meters.
//
// Validity: single scattering along the path, i.e. τ = (a+b)L below about
// SingleScatteringDepth (flagged beyond); θ_a small enough that the
// collected cone is near-forward (up to 90° is accepted, but the step
// response is only meaningful for a few degrees).
type Transmissometer struct {
	// PathLength is the beam path in water, m, in (0, 100].
	PathLength float64
	// AcceptanceHalfAngle is the detector's acceptance half-angle θ_a, rad,
	// in [0, π/2]. Typical meters use about 0.5°–1°; 0 gives the true c.
	AcceptanceHalfAngle float64
}

// TransmissometerReading is what a Transmissometer reports.
type TransmissometerReading struct {
	// Transmittance T = exp(−c_m L), dimensionless, in (0, 1].
	Transmittance float64
	// Attenuation is the measured c_m = −ln(T)/L, m⁻¹.
	Attenuation float64
	// TrueAttenuation is c = a + b, m⁻¹.
	TrueAttenuation float64
	// ForwardCollected is 2π ∫_0^θa β sin θ dθ, m⁻¹: scattering counted as
	// transmitted.
	ForwardCollected float64
	// CollectedFraction is ForwardCollected / b, dimensionless (0 when b = 0).
	CollectedFraction float64
	// OpticalDepth is τ = (a + b) L, dimensionless.
	OpticalDepth float64
	// Flags: FlagThickPath, FlagForwardExtrapolated.
	Flags Flag
}

// Read simulates a reading at one wavelength from total absorption a and
// scattering b (m⁻¹) and the total VSF at that wavelength. The VSF must be
// consistent with b: its integral over the acceptance cone may not exceed b
// by more than 1 %.
func (t Transmissometer) Read(a, b float64, vsf VSF) (TransmissometerReading, error) {
	var r TransmissometerReading
	if err := checkScalar("Transmissometer.PathLength", t.PathLength, math.SmallestNonzeroFloat64, 100, "m"); err != nil {
		return r, err
	}
	if err := checkScalar("Transmissometer.AcceptanceHalfAngle", t.AcceptanceHalfAngle, 0, math.Pi/2, "rad"); err != nil {
		return r, err
	}
	if err := checkScalar("a", a, 0, MaxCoefficient, "m⁻¹"); err != nil {
		return r, err
	}
	if err := checkScalar("b", b, 0, MaxCoefficient, "m⁻¹"); err != nil {
		return r, err
	}
	if err := vsf.Validate(); err != nil {
		return r, err
	}
	fwd, held := vsf.cone(t.AcceptanceHalfAngle)
	if fwd > 1.01*b+1e-15 {
		return r, fmt.Errorf("seen: VSF integrated over the acceptance cone gives %g m⁻¹, more than b = %g m⁻¹; the VSF and b disagree", fwd, b)
	}
	fwd = math.Min(fwd, b)
	c := a + b
	r.TrueAttenuation = c
	r.ForwardCollected = fwd
	if b > 0 {
		r.CollectedFraction = fwd / b
	}
	r.Attenuation = c - fwd
	r.Transmittance = math.Exp(-r.Attenuation * t.PathLength)
	r.OpticalDepth = c * t.PathLength
	if r.OpticalDepth > SingleScatteringDepth {
		r.Flags |= FlagThickPath
	}
	if held > 0.01*fwd {
		r.Flags |= FlagForwardExtrapolated
	}
	return r, nil
}
