package refindex

import (
	"math"
	"math/cmplx"
	"strings"
	"testing"
)

// TestAbsorbingSegelstein: the relation a = 4πk/λ0 (Bohren & Huffman 1983,
// eq. 2.52) maps Segelstein's (1981) water k = 1.5587991e-7 at 749.89 nm to
// a = 2.612 m⁻¹ (check value 4 of the project's water-optics research notes,
// computed from Segelstein's table). Here we go the other way.
func TestAbsorbingSegelstein(t *testing.T) {
	a := Absorbing{Base: Constant{N: 1.33}, Absorption: func(float64) float64 { return 2.612 }}
	m, err := a.Index(749.89e-9)
	if err != nil {
		t.Fatal(err)
	}
	// printedTol: the published a is given to 4 significant figures.
	const printedTol = 5e-4
	if got, want := imag(m), 1.5587991e-7; math.Abs(got-want)/want > printedTol {
		t.Errorf("k = %g, want %g (Segelstein 1981)", got, want)
	}
	if real(m) != 1.33 {
		t.Errorf("real part changed to %g", real(m))
	}
}

func TestTable(t *testing.T) {
	tab := Table{
		Wavelengths: []float64{400e-9, 500e-9, 700e-9},
		N:           []float64{1.56, 1.55, 1.54},
		K:           []float64{1e-3, 4e-4, 1e-4},
	}
	for _, c := range []struct {
		l    float64
		want complex128
	}{
		{400e-9, complex(1.56, 1e-3)},
		{450e-9, complex(1.555, 7e-4)}, // midpoint of a linear segment (definition)
		{600e-9, complex(1.545, 2.5e-4)},
		{700e-9, complex(1.54, 1e-4)},
	} {
		m, err := tab.Index(c.l)
		if err != nil {
			t.Fatal(err)
		}
		if cmplx.Abs(m-c.want) > 1e-15 {
			t.Errorf("λ %g: %v, want %v", c.l, m, c.want)
		}
	}
	if _, err := tab.Index(350e-9); err == nil || !strings.Contains(err.Error(), "outside") {
		t.Errorf("extrapolation not refused: %v", err)
	}
}

func TestSmooth(t *testing.T) {
	s := Smooth{Ref: 550e-9, N: 1.55, B: 3.5e-15, K: 1e-4, S: 1e7, KFloor: 1e-6}
	m, err := s.Index(550e-9)
	if err != nil {
		t.Fatal(err)
	}
	if cmplx.Abs(m-complex(1.55, 1.01e-4)) > 1e-15 {
		t.Errorf("at Ref: %v", m)
	}
	// One e-folding length of k above Ref (1/S = 100 nm): k − KFloor = K/e.
	m, _ = s.Index(650e-9)
	if got := imag(m) - 1e-6; math.Abs(got-1e-4/math.E) > 1e-18 {
		t.Errorf("k at 650 nm = %g, want K/e", got)
	}
	// Normal dispersion: n falls with wavelength for B > 0.
	if real(m) >= 1.55 {
		t.Errorf("n(650) = %g not below n(550)", real(m))
	}
}

// TestRelative: in its reference water a relative model is recovered exactly.
func TestRelative(t *testing.T) {
	water := func(l float64) float64 { return 1.33 + 3e3*1e-18/(l*l) } // any dispersive medium
	r := Relative{Rel: Constant{N: 1.15, K: 1e-3}, Water: water}
	for _, l := range []float64{400e-9, 550e-9, 860e-9} {
		rel, err := InMedium(r, water, l)
		if err != nil {
			t.Fatal(err)
		}
		if cmplx.Abs(rel-complex(1.15, 1e-3)) > 1e-15 {
			t.Errorf("λ %g: relative %v, want 1.15+0.001i", l, rel)
		}
	}
}

func TestBadInput(t *testing.T) {
	for _, c := range []struct {
		name string
		m    Model
		want string
	}{
		{"negative n", Constant{N: -1.2}, "real part = -1.2, want n > 0"},
		{"zero n", Constant{N: 0}, "want n > 0"},
		{"negative k", Constant{N: 1.2, K: -0.1}, "imaginary part = -0.1, want k ≥ 0"},
		{"unordered table", Table{Wavelengths: []float64{5e-7, 4e-7}, N: []float64{1.5, 1.5}}, "strictly increasing"},
		{"table n", Table{Wavelengths: []float64{5e-7}, N: []float64{-1}}, "real part = -1"},
		{"absorption", Absorbing{Base: Constant{N: 1.05}, Absorption: func(float64) float64 { return -1 }}, "absorption at 5e-07 m = -1 m-1"},
	} {
		_, err := c.m.Index(500e-9)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
	if _, err := (Constant{N: 1.2}).Index(-5e-7); err == nil || !strings.Contains(err.Error(), "wavelength") {
		t.Errorf("negative wavelength: %v", err)
	}
}
