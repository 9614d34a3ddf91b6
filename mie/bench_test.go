package mie

import (
	"fmt"
	"math"
	"testing"
)

// sizes400 returns 400 size parameters log-spaced over [0.1, 2000].
func sizes400() []float64 {
	xs := make([]float64, 400)
	for i := range xs {
		xs[i] = 0.1 * math.Pow(2000/0.1, float64(i)/399)
	}
	return xs
}

// BenchmarkEfficiencies400 solves 400 sizes at m = 1.2 + 0.001i (one op is
// the whole sweep); it reports ns per series term.
func BenchmarkEfficiencies400(b *testing.B) {
	xs := sizes400()
	var s Solver
	terms := 0
	for _, x := range xs {
		e, _ := s.Sphere(x, 1.2+0.001i)
		terms += e.Terms
	}
	b.ReportAllocs()
	for b.Loop() {
		for _, x := range xs {
			s.Sphere(x, 1.2+0.001i)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(terms), "ns/term")
}

// BenchmarkSphere covers the regimes separately: small, large, absorbing.
func BenchmarkSphere(b *testing.B) {
	for _, c := range []struct {
		name string
		x    float64
		m    complex128
	}{
		{"x=0.1", 0.1, 1.2 + 0.001i},
		{"x=10", 10, 1.5},
		{"x=1000", 1000, 1.2 + 0.001i},
		{"x=1000/absorbing", 1000, 1.5 + 1i},
		{"x=10000", 10000, 1.33 + 1e-5i},
	} {
		b.Run(c.name, func(b *testing.B) {
			var s Solver
			s.Sphere(c.x, c.m)
			b.ReportAllocs()
			for b.Loop() {
				s.Sphere(c.x, c.m)
			}
		})
	}
}

func BenchmarkCoated(b *testing.B) {
	var s Solver
	s.Coated(300, 1000, 1.5+0.01i, 1.05)
	b.ReportAllocs()
	for b.Loop() {
		s.Coated(300, 1000, 1.5+0.01i, 1.05)
	}
}

// BenchmarkBackHemisphere measures the exact back-hemisphere integral per
// size at x = 1e2, 1e3, 1e4 (coefficients already solved).
func BenchmarkBackHemisphere(b *testing.B) {
	for _, x := range []float64{100, 1000, 10000} {
		b.Run("x="+formatX(x), func(b *testing.B) {
			var s Solver
			s.Sphere(x, 1.2+0.001i)
			s.BackHemisphere()
			b.ReportAllocs()
			for b.Loop() {
				s.BackHemisphere()
			}
		})
	}
}

func formatX(x float64) string {
	switch x {
	case 100:
		return "1e2"
	case 1000:
		return "1e3"
	}
	return "1e4"
}

// BenchmarkBackCrossover times both evaluations near the switch-over size.
func BenchmarkBackCrossover(b *testing.B) {
	for _, x := range []float64{50, 150, 250, 400} {
		var s Solver
		s.Sphere(x, 1.2+0.001i)
		c := constsFor(s.n + 2)
		b.Run(fmt.Sprintf("direct/N=%d", s.n), func(b *testing.B) {
			for b.Loop() {
				s.backDirect(c)
			}
		})
		b.Run(fmt.Sprintf("fft/N=%d", s.n), func(b *testing.B) {
			l := fftLength(3*s.n + 2)
			plan, spec := planFor(l), hilbertSpectrum(l)
			s.buf = grow(s.buf, l)
			for b.Loop() {
				s.family(c.uu, c.wu, c.du, +1, plan, spec)
				s.family(c.uv, c.wv, c.dv, -1, plan, spec)
			}
		})
	}
}

// BenchmarkMatrix evaluates the scattering matrix at 1000 angles for a
// solved sphere (x = 100); the cost is per angle and term.
func BenchmarkMatrix(b *testing.B) {
	var s Solver
	s.Sphere(100, 1.17+0.001i)
	mu := make([]float64, 1000)
	for i := range mu {
		mu[i] = math.Cos(math.Pi * float64(i) / 999)
	}
	el := make([]Element, len(mu))
	b.ReportAllocs()
	for b.Loop() {
		s.Matrix(mu, el)
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(len(mu)*s.n), "ns/angle/term")
}
