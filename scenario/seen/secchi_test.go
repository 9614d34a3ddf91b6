package seen

import (
	"math"
	"testing"
)

func TestSecchiLee2015(t *testing.T) {
	// Z_SD = ln(|0.14 − R_rs|/0.013)/(2.5 K_d) of Lee et al. (2015); values
	// computed from the sourced relation in research/water-optics.md (table
	// rows 28–29). Tolerance: half a unit in the printed fifth digit.
	const tol = 5e-5
	for _, tc := range []struct{ kd, rrs, want float64 }{
		{0.5, 0.01, 1.8421},
		{0.1, 0.005, 9.3613},
	} {
		z, f, err := SecchiDepth(tc.kd, tc.rrs)
		if err != nil || f != 0 {
			t.Fatalf("SecchiDepth(%g, %g): %v %v", tc.kd, tc.rrs, f, err)
		}
		if math.Abs(z-tc.want) > tol*tc.want {
			t.Errorf("SecchiDepth(%g, %g) = %.5f m, want %.4f m", tc.kd, tc.rrs, z, tc.want)
		}
	}
	// Identity of the relation: Z_SD·K_d is fixed by R_rs alone; doubling
	// K_d halves the depth.
	z1, _, _ := SecchiDepth(0.3, 0.008)
	z2, _, _ := SecchiDepth(0.6, 0.008)
	if math.Abs(z1/z2-2) > 1e-14 {
		t.Errorf("depth ratio %g, want 2", z1/z2)
	}
}

func TestSecchiSpecialCases(t *testing.T) {
	// No contrast: |0.14 − R_rs| ≤ 0.013.
	z, f, err := SecchiDepth(1, 0.13)
	if err != nil || z != 0 || !f.Has(FlagNoSecchi) {
		t.Errorf("R_rs = 0.13: depth %g flags %v err %v", z, f, err)
	}
	_, f, _ = SecchiDepth(1, 0.2)
	if !f.Has(FlagBrightWater) {
		t.Errorf("R_rs = 0.2 not flagged bright: %v", f)
	}
	if _, _, err := SecchiDepth(0, 0.01); err == nil {
		t.Error("K_d = 0 accepted")
	}
}

func TestSecchiWindow(t *testing.T) {
	wl := []float64{400e-9, 443e-9, 490e-9, 560e-9, 665e-9, 700e-9}
	kd := []float64{0.01, 0.9, 0.6, 0.4, 0.8, 0.001}
	rrs := []float64{0.001, 0.002, 0.003, 0.01, 0.004, 0.0001}
	s, err := SecchiWindow(wl, kd, rrs, SecchiWindowMin, SecchiWindowMax)
	if err != nil {
		t.Fatal(err)
	}
	// 400 and 700 nm lie outside the window; the minimum inside is 560 nm.
	if s.Wavelength != 560e-9 || s.Kd != 0.4 || s.Rrs != 0.01 {
		t.Fatalf("window pick %+v, want 560 nm", s)
	}
	want, _, _ := SecchiDepth(0.4, 0.01)
	if s.Depth != want {
		t.Errorf("depth %g, want %g", s.Depth, want)
	}
	if _, err := SecchiWindow(wl, kd, rrs, 300e-9, 350e-9); err == nil {
		t.Error("empty window accepted")
	}
}
