package seen

import (
	"math"
	"testing"
)

func TestGordon1988Form(t *testing.T) {
	// Gordon et al. (1988): r_rs = 0.0949 u + 0.0794 u², u = b_b/(a + b_b).
	// The published coefficients are typed here and the published form is
	// evaluated directly as the oracle. Tolerance: rounding only.
	const tol = 1e-15
	if Gordon1988.G1 != 0.0949 || Gordon1988.G2 != 0.0794 {
		t.Fatalf("Gordon1988 coefficients %g, %g; published 0.0949, 0.0794", Gordon1988.G1, Gordon1988.G2)
	}
	for _, tc := range []struct{ a, bb float64 }{{0.05, 0.005}, {1, 0.01}, {0.2, 0.2}, {3, 0.02}} {
		u := tc.bb / (tc.a + tc.bb)
		want := 0.0949*u + 0.0794*u*u
		got, _, err := Gordon1988.Subsurface(tc.a, tc.bb)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got-want) > tol {
			t.Errorf("a=%g bb=%g: r_rs %.8g, published form %.8g", tc.a, tc.bb, got, want)
		}
	}
}

func TestLee2002(t *testing.T) {
	// Lee et al. (2002): g0 = 0.089, g1 = 0.125; at u = 1/6 r_rs = 1.8306e-2
	// sr⁻¹ (research/water-optics.md table row 25, computed from the
	// sourced formula). Tolerance: half a unit in the printed fifth digit.
	r, _, err := Lee2002.Subsurface(1, 0.2)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r-1.8306e-2) > 5e-7 {
		t.Errorf("r_rs(u=1/6) = %.6g, want 1.8306e-2", r)
	}
	// Sub- to above-surface, Lee et al. (2002): R_rs = 0.52 r_rs/(1 − 1.7 r_rs),
	// the published form evaluated literally as the oracle. (The research
	// notes' row 24, 4.9047e-3 for r_rs = 9.2830e-3, is one unit high in the
	// last digit: the formula gives 4.90456e-3.)
	for _, r := range []float64{9.2830e-3, 0.001, 0.05} {
		R, err := AboveSurface(r)
		if err != nil {
			t.Fatal(err)
		}
		if want := 0.52 * r / (1 - 1.7*r); math.Abs(R-want) > 1e-17 {
			t.Errorf("R_rs(%g) = %.8g, published form %.8g", r, R, want)
		}
	}
	// Identities of the conversion: the inverse recovers r_rs, and for small
	// r_rs the ratio tends to 0.52.
	for _, r := range []float64{0, 1e-6, 0.003, 0.02, 0.15} {
		R, _ := AboveSurface(r)
		back, err := BelowSurface(R)
		if err != nil || math.Abs(back-r) > 1e-15 {
			t.Errorf("round trip %g → %g → %g (%v)", r, R, back, err)
		}
	}
	R, _ := AboveSurface(1e-8)
	if math.Abs(R/1e-8-0.52) > 1e-7 {
		t.Errorf("small-signal ratio %g, want 0.52", R/1e-8)
	}
}

func TestReflectanceFlagsAndErrors(t *testing.T) {
	// u = 0.5 is outside the fit range.
	if _, f, _ := Gordon1988.Subsurface(0.1, 0.1); !f.Has(FlagOutsideFit) {
		t.Error("u = 0.5 not flagged")
	}
	if _, f, _ := Gordon1988.Subsurface(1, 0.01); f != 0 {
		t.Errorf("u ≈ 0.01 flagged %v", f)
	}
	if _, _, err := Gordon1988.Subsurface(0, 0); err == nil {
		t.Error("a = b_b = 0 accepted")
	}
	if _, err := AboveSurface(0.6); err == nil {
		t.Error("r_rs = 0.6 accepted")
	}
	s := Spectra{Wavelength: []float64{500e-9, 550e-9}, A: []float64{0.1, 0.1}, B: []float64{1, 1}, Bb: []float64{0.02, -0.1}}
	dst := make([]float64, 2)
	if _, err := Lee2002.Rrs(dst, s); err == nil {
		t.Error("negative b_b accepted")
	}
	s.Bb[1] = 2
	if _, err := Lee2002.Rrs(dst, s); err == nil {
		t.Error("b_b > b accepted")
	}
}

func TestRrsMonotoneInBackscatter(t *testing.T) {
	// Common practice: at fixed absorption, more backscattering (more
	// suspended sediment) gives brighter water.
	s := Spectra{Wavelength: []float64{550e-9, 550.1e-9, 550.2e-9}, A: []float64{0.5, 0.5, 0.5}, B: []float64{1, 5, 20}, Bb: []float64{0.02, 0.1, 0.4}}
	dst := make([]float64, 3)
	if _, err := Lee2002.Rrs(dst, s); err != nil {
		t.Fatal(err)
	}
	if !(dst[0] < dst[1] && dst[1] < dst[2]) {
		t.Errorf("R_rs not increasing with b_b: %v", dst)
	}
}
