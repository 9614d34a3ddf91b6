package mie

import (
	"math"
	"math/cmplx"
	"testing"
)

// Published tables print 6 significant digits or 6 decimals; agreement to
// half a unit in the last place is all a printed table can show.
const (
	sixDigits   = 5e-6 // relative, for values printed to 6 significant digits (allows a rounding of the input x)
	sixDecimals = 6e-7 // absolute, for values printed to 6 decimals
)

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got-want) / math.Abs(want)
}

// checkEfficiencies compares Qext, Qsca and Qback with values printed to 6
// significant digits.
func checkEfficiencies(t *testing.T, e Efficiencies, qext, qsca, qback float64) {
	t.Helper()
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"Qext", e.Qext, qext}, {"Qsca", e.Qsca, qsca}, {"Qback", e.Qback, qback}} {
		if r := relErr(c.got, c.want); r > sixDigits {
			t.Errorf("%s = %.7g, published %.6g (rel. err %.1e)", c.name, c.got, c.want, r)
		}
	}
}

// Bohren & Huffman (1983), Appendix A, BHMIE sample output: sphere of index
// 1.55 in a medium of index 1, radius 0.525 µm, wavelength 0.6328 µm.
func TestBohrenHuffmanSample(t *testing.T) {
	x := 2 * math.Pi * 0.525 / 0.6328
	e, err := Sphere(x, 1.55)
	if err != nil {
		t.Fatal(err)
	}
	checkEfficiencies(t, e, 3.10543, 3.10543, 2.92534)
	// Angular table, S11 normalised to S11(0°) and POL = −S12/S11,
	// at 0:9:180° (selected rows of the appendix table).
	rows := []struct{ deg, s11, pol, s33, s34 float64 }{
		{0, 1.000000e+00, 0, 1.000000e+00, 0},
		{9, 7.853900e-01, -4.598110e-03, 9.994000e-01, 3.432610e-02},
		{36, 3.553550e-02, -5.349970e-01, 6.869670e-01, -4.917870e-01},
		{72, 1.259590e-02, -8.319960e-01, 2.032550e-01, -5.162080e-01},
		{90, 1.246010e-02, 2.304620e-01, 9.374970e-01, 2.607420e-01},
		{126, 2.274210e-03, -2.396120e-01, 9.676020e-01, 7.957980e-02},
		{153, 1.888520e-02, -8.910810e-01, 4.532770e-01, -2.268170e-02},
		{180, 3.831890e-02, 0, -1.000000e+00, 0},
	}
	var s Solver
	if _, err := s.Sphere(x, 1.55); err != nil {
		t.Fatal(err)
	}
	mu := make([]float64, len(rows)+1)
	mu[0] = 1
	for i, r := range rows {
		mu[i+1] = math.Cos(r.deg * math.Pi / 180)
	}
	el := make([]Element, len(mu))
	s.Matrix(mu, el)
	for i, r := range rows {
		m := el[i+1]
		got := []float64{m.S11 / el[0].S11, -m.S12 / m.S11, m.S33 / m.S11, m.S34 / m.S11}
		want := []float64{r.s11, r.pol, r.s33, r.s34}
		for k := range got {
			// The table prints 6 significant digits of values of order 1e-3…1
			// (and exact zeros); 2e-6 absolute covers that rounding.
			if math.Abs(got[k]-want[k]) > 2e-6+sixDigits*math.Abs(want[k]) {
				t.Errorf("θ=%g° column %d: got %.7g, published %.7g", r.deg, k, got[k], want[k])
			}
		}
	}
}

// Bohren & Huffman (1983), Appendix B, BHCOAT sample: λ = 3, core radius
// 0.171, mantle radius 6.265, core 1.59+0.66i, mantle 1.409+0.1747i, medium 1.
func TestBohrenHuffmanCoatedSample(t *testing.T) {
	k := 2 * math.Pi / 3.0
	e, err := Coated(k*0.171, k*6.265, 1.59+0.66i, 1.409+0.1747i)
	if err != nil {
		t.Fatal(err)
	}
	checkEfficiencies(t, e, 2.32803, 1.14341, 0.0285099)
}

// Wiscombe (1979/1996), NCAR/TN-140+STR, appendix tables and the MIEV0 test
// cases. Wiscombe writes m = n − ik; efficiencies and g are the same in our
// m = n + ik convention, amplitudes are complex conjugates.
func TestWiscombeTables(t *testing.T) {
	nan := math.NaN()
	cases := []struct {
		name          string
		m             complex128 // in our convention (conjugate of Wiscombe's)
		x             float64
		qext, qsca, g float64 // 6 decimals; NaN = not printed
		s1back        complex128
		s1digits      bool // S1(180°) printed to 6 significant digits
	}{
		{"TN-140 1.5 x=10", 1.5, 10, 2.881999, 2.881999, 0.742913, 0, false},
		{"TN-140 1.5 x=100", 1.5, 100, 2.094388, 2.094388, 0.818246, 0, false},
		{"TN-140 1.5 x=1000", 1.5, 1000, 2.013945, 2.013945, 0.827882, 0, false},
		{"TN-140 1.5 x=5000", 1.5, 5000, 2.008650, 2.008650, 0.829592, 0, false},
		{"TN-140 1.5-0.1i x=10", 1.5 + 0.1i, 10, 2.459791, 1.235144, 0.922350, 0, false},
		{"TN-140 1.5-0.1i x=100", 1.5 + 0.1i, 100, 2.089822, 1.132134, 0.950392, 0, false},
		{"TN-140 1.5-0.1i x=1000", 1.5 + 0.1i, 1000, 2.019703, 1.106932, 0.950880, 0, false},
		{"TN-140 1.5-0.1i x=5000", 1.5 + 0.1i, 5000, 2.006775, 1.099193, 0.950650, 0, false},
		{"MIEV0 case 7 (bubble)", 0.75, 10, nan, 2.232265, 0.896473, -1.07857 - 3.60881e-2i, true},
		{"MIEV0 case 8 (bubble, large)", 0.75, 1000, nan, 1.997908, 0.844944, 17.0578 + 484.251i, true},
		{"MIEV0 case 11 (weakly absorbing, x=1e4)", 1.33 + 1e-5i, 10000, nan, 1.723857, 0.907840, -182.119 - 951.912i, true},
		{"MIEV0 case 12 (small absorbing)", 1.5 + 1i, 0.055, 0.101491, 0.000011, 0.000491, 7.66140e-5 + 8.33814e-5i, true},
		{"MIEV0 case 14", 1.5 + 1i, 1, 2.336321, 0.663454, 0.192136, 0, false},
		{"MIEV0 case 15", 1.5 + 1i, 100, 2.097502, 1.283697, 0.850252, 0, false},
		{"MIEV0 case 17 (strongly absorbing)", 10 + 10i, 1, nan, 2.049405, -0.110664, 0.448546 + 0.791237i, true},
		{"MIEV0 case 18", 10 + 10i, 100, nan, 1.836785, 0.556215, -41.4538 - 18.2181i, true},
		{"MIEV0 case 19", 10 + 10i, 10000, nan, 1.795393, 0.548194, 2252.48 - 3924.47i, true},
	}
	var s Solver
	for _, c := range cases {
		e, err := s.Sphere(c.x, c.m)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		check := func(q string, got, want float64) {
			if !math.IsNaN(want) && math.Abs(got-want) > sixDecimals {
				t.Errorf("%s: %s = %.7f, published %.6f", c.name, q, got, want)
			}
		}
		check("Qext", e.Qext, c.qext)
		check("Qsca", e.Qsca, c.qsca)
		check("g", e.G, c.g)
		if c.s1digits {
			s1 := make([]complex128, 1)
			s2 := make([]complex128, 1)
			s.Amplitudes([]float64{-1}, s1, s2)
			// MIEV0 prints S1 in the n − ik convention: compare with conj.
			got := cmplx.Conj(s1[0])
			if d := cmplx.Abs(got-c.s1back) / cmplx.Abs(c.s1back); d > 1e-5 {
				t.Errorf("%s: S1(180°) = %.6g, published (conjugated) %.6g, rel. diff %.1e", c.name, got, c.s1back, d)
			}
		}
	}
}
