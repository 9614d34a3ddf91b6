package seen

import (
	"math"
	"testing"
)

// hgVSF samples b times the Henyey–Greenstein phase function with asymmetry
// g at 0 and n angles spaced logarithmically from 1e-4 rad to π.
func hgVSF(b, g float64, n int) VSF {
	v := VSF{Angle: []float64{0}}
	for i := 0; i < n; i++ {
		v.Angle = append(v.Angle, 1e-4*math.Pow(math.Pi/1e-4, float64(i)/float64(n-1)))
	}
	v.Angle[n] = math.Pi // exactly, despite rounding in Pow
	for _, th := range v.Angle {
		v.Beta = append(v.Beta, b*(1-g*g)/(4*math.Pi*math.Pow(1+g*g-2*g*math.Cos(th), 1.5)))
	}
	return v
}

// hgCone is the exact fraction of Henyey–Greenstein scattering within θa:
// (1 − g²)/(2g) [1/(1 − g) − (1 + g² − 2g cos θa)^(−1/2)], from integrating
// the phase function (Henyey & Greenstein 1941, ApJ 93:70) in cos θ.
func hgCone(g, theta float64) float64 {
	return (1 - g*g) / (2 * g) * (1/(1-g) - 1/math.Sqrt(1+g*g-2*g*math.Cos(theta)))
}

func TestTransmissometerHenyeyGreenstein(t *testing.T) {
	// The collected forward scattering is compared with the closed form for
	// a Henyey–Greenstein VSF sampled at 200 log-spaced angles. Tolerance
	// 2e-3 relative: the power-law interpolation between samples 4 % apart in
	// angle is that accurate on this smooth peak (measured < 5e-4).
	const relTol = 2e-3
	const b = 2.0
	for _, g := range []float64{0.8, 0.9, 0.95} {
		v := hgVSF(b, g, 200)
		for _, deg := range []float64{0.1, 0.5, 1, 5, 30} {
			th := deg * math.Pi / 180
			tr := Transmissometer{PathLength: 0.1, AcceptanceHalfAngle: th}
			r, err := tr.Read(0.3, b, v)
			if err != nil {
				t.Fatal(err)
			}
			want := b * hgCone(g, th)
			if math.Abs(r.ForwardCollected/want-1) > relTol {
				t.Errorf("g=%g θa=%g°: collected %.6g m⁻¹, exact %.6g m⁻¹", g, deg, r.ForwardCollected, want)
			}
		}
	}
	// The whole sphere collects all of b (normalisation of the phase function).
	full, _ := hgVSF(b, 0.9, 200).cone(math.Pi)
	if math.Abs(full/b-1) > relTol {
		t.Errorf("4π integral %g, want b = %g", full, b)
	}
}

func TestTransmissometerIdentities(t *testing.T) {
	// Isotropic VSF β = b/4π: 2π∫β sin θ dθ over the cone = b(1 − cos θa)/2
	// (exact; constant β is reproduced exactly by the interpolation).
	const b, a, L = 1.5, 0.4, 0.25
	iso := VSF{Angle: []float64{0, 0.3, math.Pi}, Beta: []float64{b / (4 * math.Pi), b / (4 * math.Pi), b / (4 * math.Pi)}}
	for _, th := range []float64{0, 0.01, 0.2, 1} {
		r, err := Transmissometer{PathLength: L, AcceptanceHalfAngle: th}.Read(a, b, iso)
		if err != nil {
			t.Fatal(err)
		}
		want := b * (1 - math.Cos(th)) / 2
		if math.Abs(r.ForwardCollected-want) > 1e-14 {
			t.Errorf("θa=%g: collected %.15g, want %.15g", th, r.ForwardCollected, want)
		}
		// Definition c = −ln(T)/L (Boss et al. 2009) and c_m = c − collected.
		if math.Abs(-math.Log(r.Transmittance)/L-r.Attenuation) > 1e-14 || math.Abs(r.Attenuation-(a+b-want)) > 1e-14 {
			t.Errorf("θa=%g: T = %g, c_m = %g", th, r.Transmittance, r.Attenuation)
		}
	}
	// A point acceptance reads the true c.
	r, _ := Transmissometer{PathLength: L}.Read(a, b, iso)
	if r.Attenuation != a+b || r.Flags != 0 {
		t.Errorf("θa = 0: c_m = %g, flags %v; want %g, none", r.Attenuation, r.Flags, a+b)
	}
}

func TestTransmissometerAcceptanceOrdering(t *testing.T) {
	// Boss et al. (2009): a smaller acceptance angle reads a higher c.
	v := hgVSF(1, 0.93, 120)
	prev := math.Inf(1)
	for _, deg := range []float64{0.1, 0.5, 0.93, 1.5, 3} {
		r, err := Transmissometer{PathLength: 0.25, AcceptanceHalfAngle: deg * math.Pi / 180}.Read(0.2, 1, v)
		if err != nil {
			t.Fatal(err)
		}
		if !(r.Attenuation < prev) {
			t.Errorf("θa=%g°: c_m %g not below %g", deg, r.Attenuation, prev)
		}
		prev = r.Attenuation
	}
}

func TestTransmissometerFlagsAndErrors(t *testing.T) {
	v := hgVSF(4, 0.9, 100)
	r, err := Transmissometer{PathLength: 0.25, AcceptanceHalfAngle: 0.01}.Read(1, 4, v)
	if err != nil {
		t.Fatal(err)
	}
	if !r.Flags.Has(FlagThickPath) {
		t.Errorf("τ = %g not flagged", r.OpticalDepth)
	}
	// First sample at 1° with a 2° acceptance: the constant hold below 1°
	// contributes more than 1 %.
	coarse := VSF{Angle: []float64{1 * math.Pi / 180, 10 * math.Pi / 180, math.Pi}, Beta: []float64{30, 1, 0.01}}
	r, err = Transmissometer{PathLength: 0.1, AcceptanceHalfAngle: 2 * math.Pi / 180}.Read(0.1, 2, coarse)
	if err != nil {
		t.Fatal(err)
	}
	if !r.Flags.Has(FlagForwardExtrapolated) {
		t.Errorf("flags %v, want forward-extrapolated", r.Flags)
	}
	// A VSF much larger than b is inconsistent.
	if _, err := (Transmissometer{PathLength: 0.1, AcceptanceHalfAngle: 0.5}).Read(0.1, 0.01, v); err == nil {
		t.Error("VSF exceeding b accepted")
	}
	if _, err := (Transmissometer{PathLength: 0, AcceptanceHalfAngle: 0.01}).Read(0.1, 1, v); err == nil {
		t.Error("zero path accepted")
	}
	bad := VSF{Angle: []float64{0, 0}, Beta: []float64{1, 1}}
	if _, err := (Transmissometer{PathLength: 0.1}).Read(0.1, 1, bad); err == nil {
		t.Error("repeated angles accepted")
	}
}

// slowPowerSin is the straightforward oracle for powerSinSeries: composite
// 8-point Gauss–Legendre of b0 (θ/t0)^k sin θ over 64 sub-intervals spaced
// geometrically (the integrand is a power law, steep near t0).
func slowPowerSin(t0, t1, b0, k float64) float64 {
	const parts = 64
	q := math.Pow(t1/t0, 1.0/parts)
	var s float64
	for p := 0; p < parts; p++ {
		lo := t0 * math.Pow(q, float64(p))
		h := lo*q - lo
		for j, x := range glX {
			th := lo + h/2*(1+x)
			s += glW[j] * h / 2 * b0 * math.Pow(th/t0, k) * math.Sin(th)
		}
	}
	return s
}

func TestPowerSinSeriesAgainstQuadrature(t *testing.T) {
	// The closed-form series must agree with brute-force quadrature,
	// including exponents where k + m + 1 = 0 (k = −2, −4, −6: the log
	// branch). Tolerance 1e-10 relative: the series truncation error is
	// ≤ 1.3e-11 and the quadrature converges to round-off on these smooth
	// integrands.
	const relTol = 1e-10
	for _, k := range []float64{-3.5, -2, -2 + 1e-7, -4, -6, -1, 0, 0.7} {
		for _, seg := range [][2]float64{{1e-4, 2e-4}, {0.01, 0.03}, {0.2, 0.5}, {1e-3, 0.4}} {
			t0, t1 := seg[0], seg[1]
			b0 := 3.0
			b1 := b0 * math.Pow(t1/t0, k)
			got := powerSinSeries(t0, t1, b0, b1, k)
			want := slowPowerSin(t0, t1, b0, k)
			if math.Abs(got/want-1) > relTol {
				t.Errorf("k=%g [%g, %g]: series %.15g, quadrature %.15g", k, t0, t1, got, want)
			}
		}
	}
}
