package iop

import (
	"math"
	"testing"

	"github.com/murk-optics/murk/scenario/water"
)

func benchSpectra(b *testing.B) (*Spectra, water.CDOMMixing) {
	wl := make([]float64, 20)
	for i := range wl {
		wl[i] = (400 + 25*float64(i)) * 1e-9
	}
	s, err := New(wl, []float64{math.Pi / 2, 2.1, 2.6, 3.1})
	if err != nil {
		b.Fatal(err)
	}
	mix := quellMix(b)
	if err := s.AddWater("w", water.Medium{Salinity: 5, TemperatureC: 12}); err != nil {
		b.Fatal(err)
	}
	if err := s.AddCDOM("g", mix, 5); err != nil {
		b.Fatal(err)
	}
	return s, mix
}

// BenchmarkFillWater20 refills the water component (a, b, b_b, VSF at 4
// angles) at 20 wavelengths, as at each station and time step.
func BenchmarkFillWater20(b *testing.B) {
	s, _ := benchSpectra(b)
	m := water.Medium{Salinity: 7, TemperatureC: 12}
	b.ReportAllocs()
	for b.Loop() {
		if err := s.FillWater(&s.Components[0], m); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSum20 sums two components at 20 wavelengths and 4 angles.
func BenchmarkSum20(b *testing.B) {
	s, _ := benchSpectra(b)
	var tot Component
	b.ReportAllocs()
	for b.Loop() {
		s.Sum(&tot, nil)
	}
}

func BenchmarkSlope20(b *testing.B) {
	s, _ := benchSpectra(b)
	tot := s.Total()
	b.ReportAllocs()
	for b.Loop() {
		if _, err := s.Slope(&tot, Attenuation, 400e-9, 875e-9, 550e-9); err != nil {
			b.Fatal(err)
		}
	}
}
