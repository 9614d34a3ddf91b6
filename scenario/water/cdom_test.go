package water

import (
	"math"
	"strings"
	"testing"
)

// cdomTol: the research record prints the exponential check values to
// four or five significant figures; 5e-5 relative covers the rounding of
// the five-figure ones (the four-figure ones use printedHalfUnit).
const cdomTol = 5e-5

func TestCDOMExponential(t *testing.T) {
	// Research record §3 and §10 rows 18–19 [C]: a_g(440) = 1 m⁻¹.
	for _, c := range []struct{ slope, nm, want, tol float64 }{
		{0.014, 500, 0.43171, cdomTol},
		{0.018, 400, 2.05443, cdomTol},
		{0.014, 400, 1.7507, printedHalfUnit},
		{0.014, 550, 0.2144, printedHalfUnit},
		{0.014, 700, 0.0263, 2e-3}, // three figures printed
		{0.018, 500, 0.3396, printedHalfUnit},
	} {
		g, err := NewCDOM(440e-9, 1, c.slope)
		if err != nil {
			t.Fatal(err)
		}
		got, err := g.Absorption(c.nm * 1e-9)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got/c.want-1) > c.tol {
			t.Errorf("a_g(%g nm; S=%g) = %.6g, want %g", c.nm, c.slope, got, c.want)
		}
	}
	// Identity: a_g(λ0) = ARef exactly.
	g, _ := NewCDOM(412e-9, 3.7, 0.016)
	if got, _ := g.Absorption(412e-9); got != 3.7 {
		t.Errorf("a_g(λ0) = %g, want 3.7", got)
	}
}

func TestCDOMMixingConservative(t *testing.T) {
	river, _ := NewCDOM(440e-9, 5, 0.018)
	ocean, _ := NewCDOM(440e-9, 0.05, 0.014)
	mix := CDOMMixing{River: river, Ocean: ocean, RiverSalinity: 0, OceanSalinity: 35}
	// Research record row 30 (exact algebra): river 5, sea 0.05 m⁻¹ at
	// S = 17.5 of 35 → 2.525 m⁻¹.
	got, err := mix.Absorption(440e-9, 17.5)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(got-2.525) > 1e-12 {
		t.Errorf("mixed a_g(440) = %.15g, want 2.525", got)
	}
	// End members are recovered exactly, and the mixture is linear in
	// salinity at every wavelength (exact algebra, to rounding).
	for _, nm := range []float64{350, 412, 555, 700, 900} {
		l := nm * 1e-9
		r, _ := river.Absorption(l)
		o, _ := ocean.Absorption(l)
		a0, _ := mix.Absorption(l, 0)
		a35, _ := mix.Absorption(l, 35)
		if a0 != r || math.Abs(a35-o) > 1e-15*o {
			t.Errorf("%g nm: end members %g, %g; want %g, %g", nm, a0, a35, r, o)
		}
		for _, s := range []float64{3, 11, 29} {
			a, _ := mix.Absorption(l, s)
			want := r + (o-r)*s/35
			if math.Abs(a-want) > 1e-14*math.Max(r, o) {
				t.Errorf("%g nm, S=%g: %g, linear mix %g", nm, s, a, want)
			}
		}
	}
	// The mixture's apparent slope lies between the end members' (common
	// practice: mixing two exponentials is not an exponential).
	apparent := func(s float64) float64 {
		a1, _ := mix.Absorption(400e-9, s)
		a2, _ := mix.Absorption(500e-9, s)
		return math.Log(a1/a2) / 100
	}
	if s := apparent(20); !(s < 0.018 && s > 0.014) {
		t.Errorf("apparent slope at S=20 = %g nm-1, want between 0.014 and 0.018", s)
	}
}

func TestCDOMSpectrumMatchesPointwise(t *testing.T) {
	river, _ := NewCDOM(440e-9, 2, 0.017)
	ocean, _ := NewCDOM(440e-9, 0.02, 0.015)
	mix := CDOMMixing{River: river, Ocean: ocean, RiverSalinity: 0.2, OceanSalinity: 33}
	wl := []float64{380e-9, 443e-9, 560e-9, 665e-9, 860e-9}
	dst := make([]float64, len(wl))
	if err := mix.Spectrum(dst, wl, 14); err != nil {
		t.Fatal(err)
	}
	for i, l := range wl {
		want, _ := mix.Absorption(l, 14)
		if dst[i] != want {
			t.Errorf("Spectrum[%d] = %g, Absorption = %g", i, dst[i], want)
		}
	}
}

func TestCDOMErrors(t *testing.T) {
	good, _ := NewCDOM(440e-9, 1, 0.014)
	for _, c := range []struct {
		err  error
		want string
	}{
		{second(NewCDOM(440e-9, -1, 0.014)), "CDOM absorption at the reference wavelength = -1 m-1"},
		{second(NewCDOM(440e-9, 1, -0.01)), "CDOM spectral slope = -0.01 nm-1"},
		{second(NewCDOM(440e-9, 1, 0.2)), "[0, 0.05] nm-1"},
		{second(NewCDOM(100e-9, 1, 0.014)), "CDOM reference wavelength = 100 nm"},
		{second(good.Absorption(1200e-9)), "wavelength = 1200 nm"},
		{second(CDOMMixing{River: good, Ocean: good, RiverSalinity: 0, OceanSalinity: 30}.Absorption(500e-9, 31)), "salinity = 31"},
		{second(CDOMMixing{River: good, Ocean: good, RiverSalinity: 0, OceanSalinity: 30}.Absorption(500e-9, -1)), "between the end members"},
		{second(CDOMMixing{River: good, Ocean: good, RiverSalinity: 10, OceanSalinity: 5}.Absorption(500e-9, 7)), "ocean end-member salinity = 5"},
		{second(CDOMMixing{River: CDOM{}, Ocean: good, OceanSalinity: 30}.Absorption(500e-9, 7)), "river end member"},
	} {
		if c.err == nil || !strings.Contains(c.err.Error(), c.want) {
			t.Errorf("err = %v, want mention of %q", c.err, c.want)
		}
	}
}

func second[T any](_ T, err error) error { return err }
