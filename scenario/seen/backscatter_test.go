package seen

import (
	"math"
	"testing"
)

const deg = math.Pi / 180

func TestChiPublishedAngles(t *testing.T) {
	// χ_p(θ) and its relative uncertainty, Sullivan et al. (2013), as
	// tabulated in research/water-optics.md §7.1 (typed here, not read from
	// the embedded file). Tolerance: conversion of degrees to radians and
	// back only.
	const tol = 1e-12
	for _, tc := range []struct{ deg, chi, sigma float64 }{
		{90, 0.684, 0.034}, {100, 0.858, 0.032}, {110, 1.000, 0.026},
		{120, 1.097, 0.032}, {130, 1.153, 0.044}, {140, 1.167, 0.049},
		{150, 1.156, 0.054}, {160, 1.131, 0.054}, {170, 1.093, 0.057},
	} {
		chi, sig, err := Chi(tc.deg * deg)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(chi-tc.chi) > tol || math.Abs(sig-tc.sigma) > tol {
			t.Errorf("χ_p(%g°) = %g ± %g, published %g ± %g", tc.deg, chi, sig, tc.chi, tc.sigma)
		}
	}
	// Between nodes: linear interpolation gives χ_p(117°) = 1.068,
	// χ_p(124°) = 1.119, χ_p(142°) = 1.165 (research notes, computed from the
	// table). Tolerance: half a unit in the printed third decimal.
	for _, tc := range []struct{ deg, chi float64 }{{117, 1.068}, {124, 1.119}, {142, 1.165}} {
		chi, _, _ := Chi(tc.deg * deg)
		if math.Abs(chi-tc.chi) > 5e-4 {
			t.Errorf("χ_p(%g°) = %.4f, want %.3f", tc.deg, chi, tc.chi)
		}
	}
	for _, d := range []float64{89, 171, 180} {
		if _, _, err := Chi(d * deg); err == nil {
			t.Errorf("χ_p(%g°) accepted outside the table", d)
		}
	}
}

func TestBackscatterSensorRead(t *testing.T) {
	// b_bp = 2π χ_p(θ) (β − β_w) and b_b = b_bp + b_bw (Sullivan et al.
	// 2013; water subtraction as in Zhang et al. 2021). A VSF that is flat
	// across the backward hemisphere makes β(θ) known exactly at any angle.
	const beta, betaW, bbw = 2e-3, 1.6e-4, 1.3e-3
	v := VSF{Angle: []float64{0, 90 * deg, 180 * deg}, Beta: []float64{1, beta, beta}}
	s := BackscatterSensor{Angle: 124 * deg, WaterBeta: betaW, WaterBb: bbw}
	r, err := s.Read(v)
	if err != nil {
		t.Fatal(err)
	}
	chi, _, _ := Chi(124 * deg)
	wantBbp := 2 * math.Pi * chi * (beta - betaW)
	if math.Abs(r.ParticleBb-wantBbp) > 1e-15 || math.Abs(r.Bb-(wantBbp+bbw)) > 1e-15 {
		t.Errorf("b_bp %g, b_b %g; want %g, %g", r.ParticleBb, r.Bb, wantBbp, wantBbp+bbw)
	}
	// Common practice: the sensor's b_bp is linear in particle concentration.
	v2 := VSF{Angle: v.Angle, Beta: []float64{1, 2*beta - betaW, 2*beta - betaW}}
	r2, _ := s.Read(v2)
	if math.Abs(r2.ParticleBb/r.ParticleBb-2) > 1e-12 {
		t.Errorf("doubling particles changed b_bp by %g", r2.ParticleBb/r.ParticleBb)
	}
	// Water brighter than the sample: flagged, particle part 0.
	s.WaterBeta = 3e-3
	r, _ = s.Read(v)
	if !r.Flags.Has(FlagNegativeParticle) || r.ParticleBb != 0 {
		t.Errorf("over-subtraction: %+v", r)
	}
	// Angle not sampled by the VSF.
	short := VSF{Angle: []float64{0, 100 * deg}, Beta: []float64{1, 1e-3}}
	if _, err := (BackscatterSensor{Angle: 120 * deg}).Read(short); err == nil {
		t.Error("angle beyond the VSF accepted")
	}
}

func TestVSFBackscatteringHenyeyGreenstein(t *testing.T) {
	// Backward fraction of the Henyey–Greenstein function, from the same
	// closed form as hgCone: 1 − F(π/2) = (1 − g²)/(2g) [1/√(1 + g²) −
	// 1/(1 + g)]. The VSF is sampled every 1° (a typical goniometer step);
	// tolerance 1e-4 relative for power-law interpolation on that grid
	// (measured error below 2e-5).
	const relTol = 1e-4
	for _, g := range []float64{0.5, 0.8, 0.95} {
		var v VSF
		for d := 0; d <= 180; d++ {
			th := float64(d) * deg
			if d == 180 {
				th = math.Pi
			}
			v.Angle = append(v.Angle, th)
			v.Beta = append(v.Beta, 2*(1-g*g)/(4*math.Pi*math.Pow(1+g*g-2*g*math.Cos(th), 1.5)))
		}
		got, err := v.Backscattering()
		if err != nil {
			t.Fatal(err)
		}
		want := 2 * (1 - g*g) / (2 * g) * (1/math.Sqrt(1+g*g) - 1/(1+g))
		if math.Abs(got/want-1) > relTol {
			t.Errorf("g=%g: b_b %.8g, exact %.8g", g, got, want)
		}
		// The sensor reports the same integral for comparison.
		r, err := BackscatterSensor{Angle: 120 * deg}.Read(v)
		if err != nil || !r.HasVSFBb || r.VSFBb != got {
			t.Errorf("sensor VSFBb %g (has %v, %v), want %g", r.VSFBb, r.HasVSFBb, err, got)
		}
	}
	if _, err := (VSF{Angle: []float64{0, 2}, Beta: []float64{1, 1}}).Backscattering(); err == nil {
		t.Error("VSF ending at 2 rad accepted")
	}
}
