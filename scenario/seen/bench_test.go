package seen

import (
	"math"
	"testing"
)

// benchSpectra returns n wavelengths from 400 to 710 nm of a turbid-water
// spectrum (analytic shapes; values only need to be valid).
func benchSpectra(n int) (Spectra, []float64) {
	var s Spectra
	bbw := make([]float64, n)
	for i := 0; i < n; i++ {
		nm := 400 + 310*float64(i)/float64(n-1)
		s.Wavelength = append(s.Wavelength, nm*1e-9)
		s.A = append(s.A, 0.05+0.8*math.Exp(-0.014*(nm-440))+0.6*math.Exp(0.02*(nm-710)))
		bp := 3 * math.Pow(550/nm, 0.5)
		s.B = append(s.B, bp)
		s.Bb = append(s.Bb, 0.015*bp+0.001)
		bbw[i] = 0.001
	}
	return s, bbw
}

func TestZeroAllocs(t *testing.T) {
	s, bbw := benchSpectra(311)
	dst := make([]float64, len(s.Wavelength))
	kd := make([]float64, len(s.Wavelength))
	vsf := hgVSF(3, 0.92, 200)
	tr := Transmissometer{PathLength: 0.25, AcceptanceHalfAngle: 0.0162}
	bs := BackscatterSensor{Angle: 124 * deg, WaterBeta: 1e-4, WaterBb: 1e-3}
	tm := Turbidimeter{PathLength: 0.02, Calibration: Calibration{Turbidity: 40, Beta90: 0.5}}
	el := Electronics{Gain: 1000, Offset: 50, DarkNoise: 2, FullScale: 4095}
	obs := Observer{SolarZenith: 0.5}
	var ap Apparent
	if err := obs.See(&ap, s, bbw); err != nil {
		t.Fatal(err)
	}
	copy(dst, ap.Rrs)
	copy(kd, ap.Kd)
	if _, err := SecchiWindow(s.Wavelength, kd, dst, SecchiWindowMin, SecchiWindowMax); err != nil {
		t.Fatal(err)
	}
	for name, f := range map[string]func(){
		"Rrs":             func() { Lee2002.Rrs(dst, s) },
		"Kd":              func() { Lee2013Kd.Spectrum(kd, s, bbw, 0.5) },
		"SecchiWindow":    func() { SecchiWindow(s.Wavelength, kd, dst, SecchiWindowMin, SecchiWindowMax) },
		"ColourOf":        func() { ColourOf(s.Wavelength, dst, ColourMin, ColourMax) },
		"Observer.See":    func() { obs.See(&ap, s, bbw) },
		"Transmissometer": func() { tr.Read(0.4, 3, vsf) },
		"Backscatter":     func() { bs.Read(vsf) },
		"Turbidimeter":    func() { tm.Read(ISOWavelength, 3.4, vsf) },
		"Electronics":     func() { el.Read(1.2, 0.3) },
	} {
		if n := testing.AllocsPerRun(20, f); n != 0 {
			t.Errorf("%s allocates %g times per call", name, n)
		}
	}
}

func BenchmarkRrs(b *testing.B) {
	for _, n := range []int{31, 311} {
		s, _ := benchSpectra(n)
		dst := make([]float64, n)
		b.Run(itoa(n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				Lee2002.Rrs(dst, s)
			}
		})
	}
}

func BenchmarkKd(b *testing.B) {
	for _, n := range []int{31, 311} {
		s, bbw := benchSpectra(n)
		dst := make([]float64, n)
		b.Run(itoa(n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				Lee2013Kd.Spectrum(dst, s, bbw, 0.5)
			}
		})
	}
}

func BenchmarkColourOf(b *testing.B) {
	for _, n := range []int{32, 311} {
		s, _ := benchSpectra(n)
		rrs := make([]float64, n)
		Lee2002.Rrs(rrs, s)
		b.Run(itoa(n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				ColourOf(s.Wavelength, rrs, ColourMin, ColourMax)
			}
		})
	}
}

func BenchmarkObserverSee(b *testing.B) {
	for _, n := range []int{32, 311} {
		s, bbw := benchSpectra(n)
		obs := Observer{SolarZenith: 0.5}
		var ap Apparent
		b.Run(itoa(n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				obs.See(&ap, s, bbw)
			}
		})
	}
}

func BenchmarkTransmissometerRead(b *testing.B) {
	for _, n := range []int{50, 500} {
		vsf := hgVSF(3, 0.92, n)
		tr := Transmissometer{PathLength: 0.25, AcceptanceHalfAngle: 0.0162}
		b.Run(itoa(n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				tr.Read(0.4, 3, vsf)
			}
		})
	}
}

func BenchmarkBackscatterRead(b *testing.B) {
	vsf := hgVSF(3, 0.92, 200)
	s := BackscatterSensor{Angle: 124 * deg, WaterBeta: 1e-4, WaterBb: 1e-3}
	b.ReportAllocs()
	for b.Loop() {
		s.Read(vsf)
	}
}

func BenchmarkTurbidimeterRead(b *testing.B) {
	vsf := hgVSF(3, 0.92, 200)
	tm := Turbidimeter{PathLength: 0.02, Calibration: Calibration{Turbidity: 40, Beta90: 0.5}}
	b.ReportAllocs()
	for b.Loop() {
		tm.Read(ISOWavelength, 3.4, vsf)
	}
}

func BenchmarkElectronicsRead(b *testing.B) {
	e := Electronics{Gain: 1000, Offset: 50, DarkNoise: 2, FullScale: 4095}
	b.ReportAllocs()
	for b.Loop() {
		e.Read(1.2, 0.3)
	}
}

func itoa(n int) string {
	const digits = "0123456789"
	if n == 0 {
		return "n=0"
	}
	var buf [20]byte
	i := len(buf)
	for ; n > 0; n /= 10 {
		i--
		buf[i] = digits[n%10]
	}
	return "n=" + string(buf[i:])
}
