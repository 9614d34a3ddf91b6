package water

import "testing"

// grid20 is 20 wavelengths 400–875 nm, a typical run's spectral grid.
func grid20() []float64 {
	wl := make([]float64, 20)
	for i := range wl {
		wl[i] = (400 + 25*float64(i)) * 1e-9
	}
	return wl
}

func BenchmarkEvaluate20(b *testing.B) {
	wl := grid20()
	dst := make([]Optics, len(wl))
	m := Medium{Salinity: 18, TemperatureC: 14}
	b.ReportAllocs()
	for b.Loop() {
		if err := Evaluate(dst, wl, m, 0); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkCDOMSpectrum20(b *testing.B) {
	wl := grid20()
	dst := make([]float64, len(wl))
	r, _ := NewCDOM(440e-9, 3, 0.018)
	o, _ := NewCDOM(440e-9, 0.05, 0.014)
	mix := CDOMMixing{River: r, Ocean: o, OceanSalinity: 34}
	b.ReportAllocs()
	for b.Loop() {
		if err := mix.Spectrum(dst, wl, 17); err != nil {
			b.Fatal(err)
		}
	}
}

func TestHotPathsDoNotAllocate(t *testing.T) {
	wl := grid20()
	dst := make([]Optics, len(wl))
	m := Medium{Salinity: 18, TemperatureC: 14}
	if n := testing.AllocsPerRun(50, func() { _ = Evaluate(dst, wl, m, 0) }); n != 0 {
		t.Errorf("Evaluate allocates %g times per call", n)
	}
	r, _ := NewCDOM(440e-9, 3, 0.018)
	o, _ := NewCDOM(440e-9, 0.05, 0.014)
	mix := CDOMMixing{River: r, Ocean: o, OceanSalinity: 34}
	a := make([]float64, len(wl))
	if n := testing.AllocsPerRun(50, func() { _ = mix.Spectrum(a, wl, 17) }); n != 0 {
		t.Errorf("CDOMMixing.Spectrum allocates %g times per call", n)
	}
}

func TestEvaluateMatchesPointwise(t *testing.T) {
	wl := grid20()
	dst := make([]Optics, len(wl))
	m := Medium{Salinity: 18, TemperatureC: 14}
	if err := Evaluate(dst, wl, m, 0); err != nil {
		t.Fatal(err)
	}
	for i, l := range wl {
		a, _ := Absorption(l)
		sc, _ := Scatter(l, m, 0)
		n, _ := RefractiveIndex(l, m)
		if dst[i].A != a || dst[i].Scattering != sc || dst[i].N != n || dst[i].Wavelength != l {
			t.Errorf("Evaluate[%d] = %+v; pointwise a %g, %+v, n %g", i, dst[i], a, sc, n)
		}
	}
	if err := Evaluate(dst[:1], []float64{300e-9}, m, 0); err == nil {
		t.Error("Evaluate accepted 300 nm")
	}
}
