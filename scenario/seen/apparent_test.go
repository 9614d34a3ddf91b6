package seen

import (
	"math"
	"strings"
	"testing"
)

func TestObserverSeeMatchesParts(t *testing.T) {
	// Observer.See is a composition: its results must equal the individual
	// functions with the documented defaults (Lee2002, Lee2013Kd, the
	// default windows).
	s, bbw := benchSpectra(63)
	obs := Observer{SolarZenith: 20 * deg}
	var ap Apparent
	if err := obs.See(&ap, s, bbw); err != nil {
		t.Fatal(err)
	}
	rrs := make([]float64, 63)
	kd := make([]float64, 63)
	Lee2002.Rrs(rrs, s)
	Lee2013Kd.Spectrum(kd, s, bbw, 20*deg)
	for i := range rrs {
		if rrs[i] != ap.Rrs[i] || kd[i] != ap.Kd[i] {
			t.Fatalf("wavelength %d: R_rs %g vs %g, K_d %g vs %g", i, ap.Rrs[i], rrs[i], ap.Kd[i], kd[i])
		}
	}
	sec, _ := SecchiWindow(s.Wavelength, kd, rrs, SecchiWindowMin, SecchiWindowMax)
	col, _ := ColourOf(s.Wavelength, rrs, ColourMin, ColourMax)
	if !ap.HasSecchi || ap.Secchi != sec || !ap.HasColour || ap.Colour != col {
		t.Errorf("Secchi %+v vs %+v; colour %+v vs %+v", ap.Secchi, sec, ap.Colour, col)
	}
	// Reuse: a second call with the same capacity keeps the slices.
	p := &ap.Rrs[0]
	obs.See(&ap, s, bbw)
	if &ap.Rrs[0] != p {
		t.Error("R_rs slice reallocated on reuse")
	}
}

func TestObserverNearInfrared(t *testing.T) {
	// A near-infrared-only spectrum has no colour and no transparent window,
	// which is not an error.
	s := Spectra{Wavelength: []float64{860e-9, 870e-9}, A: []float64{4.9, 5.4}, B: []float64{5, 5}, Bb: []float64{0.1, 0.1}}
	var ap Apparent
	if err := (Observer{Kd: Lee2005Kd}).See(&ap, s, nil); err != nil {
		t.Fatal(err)
	}
	if ap.HasColour || ap.HasSecchi || len(ap.Rrs) != 2 {
		t.Errorf("%+v", ap)
	}
	for _, v := range append(ap.Rrs, ap.Kd...) {
		if math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
			t.Errorf("non-positive or non-finite value %g", v)
		}
	}
}

func TestSpectraValidateMessages(t *testing.T) {
	// Errors name the field, the value and the allowed range with its unit.
	ok := func() Spectra {
		return Spectra{Wavelength: []float64{500e-9, 600e-9}, A: []float64{0.1, 0.3}, B: []float64{1, 1}, Bb: []float64{0.02, 0.02}}
	}
	for _, tc := range []struct {
		edit func(*Spectra)
		want string
	}{
		{func(s *Spectra) { s.A[1] = -1 }, "Spectra.A[1] = -1 m⁻¹"},
		{func(s *Spectra) { s.B = s.B[:1] }, "Spectra.B has 1 values"},
		{func(s *Spectra) { s.Wavelength[1] = 500e-9 }, "wavelengths must increase"},
		{func(s *Spectra) { s.Wavelength[0] = 500 }, "outside [3e-07, 1.1e-06] m"},
		{func(s *Spectra) { s.C = []float64{1.1, 2} }, "Spectra.C[1] = 2 m⁻¹ differs from a + b"},
		{func(s *Spectra) { s.A[0], s.Bb[0] = 0, 0 }, "need a + b_b > 0"},
		{func(s *Spectra) { s.Bb[0] = math.NaN() }, "Spectra.Bb[0] = NaN"},
	} {
		s := ok()
		tc.edit(&s)
		err := s.Validate()
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("got %v, want message containing %q", err, tc.want)
		}
	}
	s := ok()
	s.C = []float64{1.1, 1.3}
	if err := s.Validate(); err != nil {
		t.Errorf("consistent C rejected: %v", err)
	}
}

func TestFlagString(t *testing.T) {
	if got := (FlagThickPath | FlagOutOfGamut).String(); got != "thick-path|out-of-gamut" {
		t.Errorf("got %q", got)
	}
	if Flag(0).String() != "none" || !strings.Contains(Flag(1<<31).String(), "unknown") {
		t.Error("none/unknown")
	}
	if len(flagNames) != 17 || FlagNotSurface != 1<<16 {
		t.Error("flag names out of step with constants")
	}
}
