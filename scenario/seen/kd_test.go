package seen

import (
	"math"
	"testing"
)

func TestLee2013Kd(t *testing.T) {
	// Values computed from the sourced Lee et al. (2013) formula in
	// research/water-optics.md (table rows 26–27). Tolerance: half a unit in
	// the printed fifth/sixth significant digit.
	const tol = 1e-5
	for _, tc := range []struct{ a, bb, bbw, zenDeg, want float64 }{
		{0.5, 0.05, 0.0006, 30, 0.78675},
		{1, 0.2, 0.0005, 0, 1.85142},
	} {
		k, _, err := Lee2013Kd.Kd(tc.a, tc.bb, tc.bbw, tc.zenDeg*math.Pi/180)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(k-tc.want) > tol {
			t.Errorf("Kd(a=%g, bb=%g, θ=%g°) = %.6f, want %.5f", tc.a, tc.bb, tc.zenDeg, k, tc.want)
		}
	}
}

func TestKdLimits(t *testing.T) {
	// Exact radiative-transfer limit: a collimated beam entering
	// non-scattering water vertically decays as exp(−a z), so K_d = a.
	for _, m := range []KdModel{Lee2005Kd, Lee2013Kd} {
		k, _, err := m.Kd(0.37, 0, 0, 0)
		if err != nil || k != 0.37 {
			t.Errorf("%s: Kd(b_b = 0, sun at zenith) = %g (%v), want a = 0.37", m.Name, k, err)
		}
		// Common practice: a lower sun lengthens the path, so K_d grows with
		// zenith angle.
		k0, _, _ := m.Kd(0.2, 0.05, 0.001, 0)
		k1, _, _ := m.Kd(0.2, 0.05, 0.001, 40*math.Pi/180)
		if !(k1 > k0) {
			t.Errorf("%s: Kd at 40° (%g) not above Kd at 0° (%g)", m.Name, k1, k0)
		}
	}
}

func TestKdClearWater(t *testing.T) {
	// Clearest natural water: K_w(490) = 0.0166 m⁻¹ for pure seawater
	// (Morel & Maritorena 2001, J. Geophys. Res. 106:7163, Table 2; from
	// memory). Inputs: a_w(490) = 0.0150 m⁻¹ (Pope & Fry 1997) and
	// b_bw(490) = 1.39e-3 m⁻¹ (Zhang, Hu & He 2009 at S = 35, 20 °C,
	// interpolated as a power law between the 450 and 500 nm values of
	// research/water-optics.md §2.2). Tolerance 10 %: the two sources use
	// different pure-water absorption, and the Lee 2005 paper quotes errors
	// up to ~12 % against exact radiative transfer.
	const relTol = 0.10
	k, _, err := Lee2013Kd.Kd(0.0150, 1.39e-3, 1.39e-3, 0)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(k/0.0166-1) > relTol {
		t.Errorf("clear-water Kd(490) = %.5f m⁻¹, published 0.0166 m⁻¹", k)
	}
	// Kd can never fall below a in this model (exact for the sun at zenith).
	if k < 0.0150 {
		t.Errorf("Kd %g below a", k)
	}
}

func TestKdFlagsAndErrors(t *testing.T) {
	if _, f, _ := Lee2013Kd.Kd(0.1, 0.01, 0.001, 70*math.Pi/180); !f.Has(FlagLowSun) {
		t.Error("70° zenith not flagged")
	}
	if _, _, err := Lee2013Kd.Kd(0.1, 0.01, 0.02, 0); err == nil {
		t.Error("b_bw > b_b accepted")
	}
	if _, _, err := Lee2013Kd.Kd(0.1, 0.01, 0.001, math.Pi/2); err == nil {
		t.Error("zenith 90° accepted")
	}
	s := Spectra{Wavelength: []float64{500e-9}, A: []float64{0.1}, B: []float64{1}, Bb: []float64{0.02}}
	if _, err := Lee2013Kd.Spectrum(make([]float64, 1), s, nil, 0); err == nil {
		t.Error("missing water backscattering accepted for Lee2013")
	}
	if _, err := Lee2005Kd.Spectrum(make([]float64, 1), s, nil, 0); err != nil {
		t.Errorf("Lee2005 needs no water backscattering: %v", err)
	}
}
