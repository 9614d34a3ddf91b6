package sensing

import (
	"math"
	"testing"

	"github.com/murk-optics/murk/scenario/seen"
	"github.com/murk-optics/murk/scenario/spec"
)

// testPoint is a point on a 4-wavelength, 3-angle grid with IOPs linear in
// wavelength and a VSF falling with angle.
func testPoint() *Point {
	wl := []float64{500e-9, 600e-9, 700e-9, 800e-9}
	ang := []float64{math.Pi / 2, 2.2, math.Pi}
	p := NewPoint(wl, ang)
	for i := range wl {
		f := float64(i + 1)
		p.A = append(p.A, 0.1*f)
		p.B = append(p.B, 2*f)
		p.Bb = append(p.Bb, 0.03*f)
		p.VSF = append(p.VSF, 0.01*f, 0.006*f, 0.004*f)
	}
	p.Salinity, p.Temperature = 20, 12
	return p
}

// tight is the tolerance of results that differ only by round-off.
const tight = 1e-12

// A transmissometer with no acceptance cone reads c = a + b exactly (the
// definition of beam attenuation; common practice), interpolated linearly
// in wavelength between grid nodes.
func TestTransmissometerNarrowBeam(t *testing.T) {
	p := testPoint()
	tr := Transmissometer{Name: "t", Wavelength: 650e-9, PathLength: 0.1}
	rd, err := tr.Read(p)
	if err != nil {
		t.Fatal(err)
	}
	want := 0.1*2.5 + 2*2.5
	if math.Abs(rd.True-want) > tight*want {
		t.Errorf("c = %g, want %g", rd.True, want)
	}
	if rd.Value > rd.True {
		t.Errorf("c_m %g > c %g", rd.Value, rd.True)
	}
}

// The backscatter sensor follows b_b = 2π χ_p (β − β_w) + b_bw (Boss &
// Pegau 2001, Appl. Opt. 40:5503; χ_p of Sullivan et al. 2013) and the
// model value is the point's own b_b.
func TestBackscatterDefinition(t *testing.T) {
	p := testPoint()
	s := Backscatter{Name: "b", Wavelength: 600e-9, Angle: 2.2}
	rd, err := s.Read(p)
	if err != nil {
		t.Fatal(err)
	}
	_, _, _, vsf := p.interpolate(600e-9)
	ref, err := readBeta(p, vsf, 600e-9, 2.2)
	if err != nil {
		t.Fatal(err)
	}
	chi, _, _ := seen.Chi(2.2)
	if want := 2*math.Pi*chi*ref.ParticleBeta + (ref.Bb - ref.ParticleBb); math.Abs(rd.Value-want) > tight*want {
		t.Errorf("b_b %g, want %g", rd.Value, want)
	}
	if rd.True != p.Bb[1] {
		t.Errorf("model value %g, want %g", rd.True, p.Bb[1])
	}
}

// A turbidimeter reports β_p(90°) without a calibration and the user's
// factor times it with one; above 400 FNU (top of the ISO 7027-1 range)
// it is flagged.
func TestTurbidimeterCalibration(t *testing.T) {
	p := testPoint()
	raw, err := Turbidimeter{Name: "n"}.Read(p)
	if err != nil {
		t.Fatal(err)
	}
	if (Turbidimeter{}).Describe().Unit != "m-1 sr-1" {
		t.Errorf("uncalibrated unit %q", (Turbidimeter{}).Describe().Unit)
	}
	cal := Turbidimeter{Name: "n", Calibration: &Calibration{Factor: 1e5}}
	rd, err := cal.Read(p)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(rd.Value-1e5*raw.Value) > tight*rd.Value || cal.Describe().Unit != "FNU" {
		t.Errorf("calibrated %g %s, want %g FNU", rd.Value, cal.Describe().Unit, 1e5*raw.Value)
	}
	if !rd.Flags.Has(seen.FlagAboveNephelometricRange) {
		t.Errorf("%g FNU not flagged above the nephelometric range", rd.Value)
	}
}

// A symmetric band response over reflectance linear in wavelength returns
// the value at the band centre (the trapezoidal rule is exact for the
// symmetric part; identity); below the surface there is no reading.
func TestRadiometerBand(t *testing.T) {
	p := NewPoint([]float64{400e-9, 450e-9, 500e-9, 550e-9, 600e-9, 650e-9, 700e-9}, nil)
	p.Rrs = []float64{0.001, 0.002, 0.003, 0.004, 0.005, 0.006, 0.007}
	rd, err := RadiometerBand{Name: "r", Wavelength: 550e-9, Width: 40e-9}.Read(p)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(rd.Value-0.004) > tight {
		t.Errorf("band R_rs %g, want 0.004", rd.Value)
	}
	p.Rrs = nil
	rd, err = RadiometerBand{Name: "r", Wavelength: 550e-9, Width: 40e-9}.Read(p)
	if err != nil || !rd.Flags.Has(seen.FlagNotSurface) {
		t.Errorf("below the surface: %+v, %v; want FlagNotSurface", rd, err)
	}
}

// The front end rounds Offset + Gain·x to counts and clips at full scale
// (seen.Electronics), whatever the instrument behind it.
func TestDigitised(t *testing.T) {
	p := testPoint()
	inner := Transmissometer{Name: "t", Wavelength: 600e-9, PathLength: 0.1}
	raw, _ := inner.Read(p)
	d := Digitised{Instrument: inner, Electronics: seen.Electronics{Gain: 100, Offset: 10, FullScale: 4095}}
	rd, err := d.Read(p)
	if err != nil {
		t.Fatal(err)
	}
	if want := math.Round(10 + 100*raw.Value); !rd.HasCounts || rd.Counts != want {
		t.Errorf("counts %g, want %g", rd.Counts, want)
	}
	d.Electronics.Gain = 1e6
	rd, err = d.Read(p)
	if err != nil || !rd.Flags.Has(seen.FlagSaturated) || rd.Counts != 4095 {
		t.Errorf("gain 1e6: %+v, %v; want saturated at 4095 counts", rd, err)
	}
}

// Every kind of the scenario file decodes; instrument angles outside the
// VSF grid extend it, those inside do not.
func TestFromSpecAndAngles(t *testing.T) {
	ins, err := FromSpecs([]spec.Instrument{
		{Name: "c", Kind: spec.Transmissometer, Wavelength: 600e-9, PathLength: 0.1, AcceptanceAngle: 0.02},
		{Name: "b", Kind: spec.Backscatter, Wavelength: 600e-9, Angle: 2.9},
		{Name: "n", Kind: spec.Turbidity},
	})
	if err != nil {
		t.Fatal(err)
	}
	got := NeededAngles([]float64{1.8, 2.0, 2.4}, ins)
	want := []float64{math.Pi / 2, 1.8, 2.0, 2.4, 2.9}
	if len(got) != len(want) {
		t.Fatalf("angles %v, want %v", got, want)
	}
	for i := range want {
		if got[i] != want[i] {
			t.Fatalf("angles %v, want %v", got, want)
		}
	}
	if _, err := FromSpec(spec.Instrument{Name: "x", Kind: "sonar"}); err == nil {
		t.Error("unknown kind accepted")
	}
}

// BenchmarkRead is one point read by the three scenario instruments.
func BenchmarkRead(b *testing.B) {
	p := testPoint()
	ins := []Instrument{Transmissometer{Name: "t", Wavelength: 650e-9, PathLength: 0.1, AcceptanceHalfAngle: 0.01},
		Backscatter{Name: "b", Wavelength: 650e-9, Angle: 2.2}, Turbidimeter{Name: "n"}}
	b.ReportAllocs()
	for b.Loop() {
		for _, in := range ins {
			if _, err := in.Read(p); err != nil {
				b.Fatal(err)
			}
		}
	}
}
