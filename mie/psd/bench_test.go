package psd

import (
	"math"
	"testing"
)

func BenchmarkBinNumbers(b *testing.B) {
	edges := make([]float64, 201)
	for i := range edges {
		edges[i] = 0.1e-6 * math.Pow(5000, float64(i)/200)
	}
	dst := make([]float64, 200)
	for _, c := range []struct {
		name string
		d    Distribution
	}{
		{"Lognormal", Lognormal{N: 1e9, Median: 2e-6, GSD: 2}},
		{"PowerLaw", PowerLaw{N: 1e9, Slope: 4, Min: 0.2e-6, Max: 200e-6}},
		{"Quadrature", Scaled{Of: userDist{}, Factor: 1}},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				BinNumbers(c.d, edges, dst)
			}
		})
	}
}

// userDist is a Distribution with no closed-form moments.
type userDist struct{}

func (userDist) Density(d float64) float64 { return 1e20 * math.Exp(-d/5e-6) }
func (userDist) Range() (float64, float64) { return 0.1e-6, 100e-6 }
