package water

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// zhhTol is the tolerance against the project's independent recomputation
// of the Zhang, Hu & He (2009) formulas (printed to five significant
// figures, so half a unit is ≤ 5e-5 relative; 1e-4 allows for it).
const zhhTol = 1e-4

func TestScatterZhangHuHe(t *testing.T) {
	// Check values [C] from the project's research record (table in
	// research/water-optics.md §10, rows 9–12): an independent Python
	// implementation of the Zhang, Hu & He (2009) model, 20 °C, δ = 0.039.
	for _, c := range []struct{ nm, s, b, beta90 float64 }{
		{500, 0, 1.9575e-3, 1.1907e-4},
		{500, 35, 2.5473e-3, 1.5494e-4},
		{400, 0, 5.0386e-3, 0},
		{400, 35, 6.5918e-3, 0},
		{700, 0, 4.8494e-4, 0},
		{700, 35, 6.2550e-4, 0},
	} {
		sc, err := ScatterNM(c.nm, Medium{Salinity: c.s, TemperatureC: 20}, 0)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(sc.B/c.b-1) > zhhTol {
			t.Errorf("b(%g nm, S=%g) = %.5e m-1, want %.5e", c.nm, c.s, sc.B, c.b)
		}
		if c.beta90 != 0 && math.Abs(sc.Beta90/c.beta90-1) > zhhTol {
			t.Errorf("β90(%g nm, S=%g) = %.5e, want %.5e", c.nm, c.s, sc.Beta90, c.beta90)
		}
		if sc.Bb != sc.B/2 {
			t.Errorf("b_b = %g, want b/2 = %g", sc.Bb, sc.B/2)
		}
	}
}

func TestScatterTemperature(t *testing.T) {
	// Project research record [C]: b_w(500 nm, S = 0) at 0/10/20/30 °C =
	// 2.038/1.980/1.958/1.958 ×10⁻³ m⁻¹ (four printed figures).
	for _, c := range []struct{ tc, b float64 }{{0, 2.038e-3}, {10, 1.980e-3}, {20, 1.958e-3}, {30, 1.958e-3}} {
		sc, _ := ScatterNM(500, Medium{TemperatureC: c.tc}, 0)
		if math.Abs(sc.B/c.b-1) > printedHalfUnit {
			t.Errorf("b_w(500 nm, %g °C) = %.4e, want %.4e", c.tc, sc.B, c.b)
		}
	}
}

func TestSeawaterToPureWaterRatio(t *testing.T) {
	// Zhang, Hu & He (2009) reproduce Morel's ≈ 30 % enhancement of
	// seawater over pure water; the research record computes 1.3013 for
	// S = 35 at 500 nm, 20 °C (independent implementation, zhhTol).
	pure, _ := ScatterNM(500, Medium{TemperatureC: 20}, 0)
	sea, _ := ScatterNM(500, Medium{Salinity: 35, TemperatureC: 20}, 0)
	if r := sea.B / pure.B; math.Abs(r/1.3013-1) > zhhTol {
		t.Errorf("b_sw/b_w(500 nm, S=35) = %.5f, model value 1.3013", r)
	}
	// Morel (1974), as restated in Twardowski's Buiteveld-based code: 30 %
	// for 37 ppt seawater, "probably about ±5 % accuracy".
	sea37, _ := ScatterNM(500, Medium{Salinity: 37, TemperatureC: 20}, 0)
	if r := sea37.B / pure.B; math.Abs(r-1.30) > 0.05*1.30 {
		t.Errorf("b_sw/b_w(S=37) = %.4f, Morel: 1.30 ± 5 %%", r)
	}
	// The ratio is nearly independent of wavelength (both terms scale as
	// λ⁻⁴ apart from dispersion): within 2 % across 400–700 nm (common
	// practice: Morel's constant factor).
	for _, nm := range []float64{400, 550, 700} {
		p, _ := ScatterNM(nm, Medium{TemperatureC: 20}, 0)
		s, _ := ScatterNM(nm, Medium{Salinity: 35, TemperatureC: 20}, 0)
		if r := s.B / p.B; math.Abs(r/1.3013-1) > 0.02 {
			t.Errorf("ratio at %g nm = %g", nm, r)
		}
	}
}

func TestScatterMorel2007(t *testing.T) {
	// Morel et al. (2007) Table 2a: b_sw(500 nm) = 0.0027 m⁻¹ for S ≈ 36 at
	// 20 °C, from the Buiteveld et al. (1994) model ×1.30. The research
	// record computes Buiteveld 2.105e-3 against Zhang 1.958e-3 for pure
	// water (7.5 % apart), so the two models may differ by up to 10 %.
	sc, _ := ScatterNM(500, Medium{Salinity: 36, TemperatureC: 20}, 0)
	if math.Abs(sc.B/0.0027-1) > 0.10 {
		t.Errorf("b_sw(500 nm, S=36) = %.4e, Morel et al. 2007: 0.0027 (±10 %% between models)", sc.B)
	}
}

func TestScatterSalinitySteepensSlope(t *testing.T) {
	// Zhang, Hu & He (2009) abstract: the power-law slope increases in
	// magnitude from 4.286 to 4.306 as salinity rises from 0 to 40 (Δ =
	// 0.020). The fitted value depends on the band (research record: 0.02–
	// 0.03), so only the difference is checked, over 400–700 nm, 20 °C,
	// within 0.01–0.035.
	slope := func(s float64) float64 {
		var sx, sy, sxx, sxy, n float64
		for nm := 400.0; nm <= 700; nm += 10 {
			sc, _ := ScatterNM(nm, Medium{Salinity: s, TemperatureC: 20}, 0)
			x, y := math.Log(nm), math.Log(sc.B)
			sx, sy, sxx, sxy, n = sx+x, sy+y, sxx+x*x, sxy+x*y, n+1
		}
		return -(n*sxy - sx*sy) / (n*sxx - sx*sx)
	}
	d := slope(40) - slope(0)
	if d < 0.01 || d > 0.035 {
		t.Errorf("slope(S=40) − slope(S=0) = %.4f, Zhang et al.: ≈ 0.020", d)
	}
}

func TestVSFIntegratesToB(t *testing.T) {
	// Identity: b = 2π∫β(θ) sinθ dθ over [0, π] and b_b the same over
	// [π/2, π]. β is a polynomial of degree 2 in μ = cosθ, so 4-point
	// Gauss–Legendre in μ is exact to rounding.
	sc, _ := ScatterNM(532, Medium{Salinity: 30, TemperatureC: 12}, 0)
	f := func(mu float64) float64 { return 2 * math.Pi * sc.VSF(math.Acos(mu)) }
	b := quad.Fixed(f, -1, 1, 4, quad.Legendre{}, 0)
	bb := quad.Fixed(f, -1, 0, 4, quad.Legendre{}, 0)
	if math.Abs(b/sc.B-1) > 1e-12 || math.Abs(bb/sc.Bb-1) > 1e-12 {
		t.Errorf("∫β = %g, %g; B, Bb = %g, %g", b, bb, sc.B, sc.Bb)
	}
	// Research record row 15/16: b/β90 = 16.4407 and cos² coefficient
	// 0.92493 for δ = 0.039.
	if r := sc.B / sc.Beta90; math.Abs(r/16.4407-1) > 1e-5 {
		t.Errorf("b/β90 = %g, want 16.4407", r)
	}
	if r := sc.VSF(0)/sc.Beta90 - 1; math.Abs(r/0.92493-1) > 1e-5 {
		t.Errorf("cos² coefficient = %g, want 0.92493", r)
	}
}

func TestScatterErrors(t *testing.T) {
	for _, c := range []struct {
		nm    float64
		m     Medium
		delta float64
		want  string
	}{
		{500, Medium{Salinity: -1, TemperatureC: 20}, 0, "salinity = -1"},
		{500, Medium{Salinity: 50, TemperatureC: 20}, 0, "[0, 42]"},
		{500, Medium{TemperatureC: 60}, 0, "temperature = 60 °C"},
		{500, Medium{TemperatureC: math.NaN()}, 0, "temperature"},
		{200, Medium{}, 0, "wavelength = 200 nm"},
		{500, Medium{}, 0.9, "depolarisation ratio"},
	} {
		_, err := ScatterNM(c.nm, c.m, c.delta)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("ScatterNM(%g, %+v, %g): err = %v, want mention of %q", c.nm, c.m, c.delta, err, c.want)
		}
	}
}
