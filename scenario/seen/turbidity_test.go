package seen

import (
	"math"
	"strings"
	"testing"
)

// flatVSF has β = beta at every angle (with a forward peak of 1 m⁻¹ sr⁻¹ at 0).
func flatVSF(beta float64) VSF {
	return VSF{Angle: []float64{0, 10 * deg, math.Pi}, Beta: []float64{1, beta, beta}}
}

func TestTurbidimeterCalibrationIdentity(t *testing.T) {
	// Definition of a calibrated ratio instrument: the standard itself reads
	// its nominal value, and the reading is proportional to particle β(90°)
	// after the water blank (ISO 7027-1 calibrates against formazin;
	// proportionality is this package's single-scattering assumption).
	cal := Calibration{Turbidity: 40, Beta90: 0.9, Attenuation: 2}
	tm := Turbidimeter{WaterBeta90: 1e-5, PathLength: 0.02, Calibration: cal}
	r, err := tm.Read(ISOWavelength, cal.Attenuation, flatVSF(cal.Beta90+tm.WaterBeta90))
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r.Turbidity-40) > 1e-12 || r.Flags != 0 {
		t.Errorf("standard reads %g FNU, flags %v; want 40, none", r.Turbidity, r.Flags)
	}
	// Particle-free water reads 0.
	r, _ = tm.Read(ISOWavelength, 0, flatVSF(tm.WaterBeta90))
	if r.Turbidity != 0 {
		t.Errorf("water blank reads %g", r.Turbidity)
	}
	// Without self-attenuation the reading is linear in β_p.
	tm.PathLength = 0
	r1, _ := tm.Read(ISOWavelength, 1, flatVSF(0.3+tm.WaterBeta90))
	r2, _ := tm.Read(ISOWavelength, 2, flatVSF(0.6+tm.WaterBeta90))
	if math.Abs(r2.Turbidity/r1.Turbidity-2) > 1e-12 {
		t.Errorf("doubling β_p changed the reading by %g", r2.Turbidity/r1.Turbidity)
	}
	// Self-attenuation lowers the reading of a more attenuating sample.
	tm.PathLength = 0.02
	r3, _ := tm.Read(ISOWavelength, 20, flatVSF(0.6+tm.WaterBeta90))
	if !(r3.Turbidity < r2.Turbidity*math.Exp(-(20-2)*0.02)*1.0000001) {
		t.Errorf("self-attenuation: %g vs %g", r3.Turbidity, r2.Turbidity)
	}
}

func TestTurbidimeterFlagsAndErrors(t *testing.T) {
	tm := Turbidimeter{PathLength: 0.02, Calibration: Calibration{Turbidity: 40, Beta90: 0.9}}
	r, err := tm.Read(550e-9, 1, flatVSF(0.1))
	if err != nil {
		t.Fatal(err)
	}
	if !r.Flags.Has(FlagOffStandard) {
		t.Error("550 nm not flagged off-standard")
	}
	r, _ = tm.Read(ISOWavelength, 40, flatVSF(40))
	if !r.Flags.Has(FlagThickPath) || !r.Flags.Has(FlagAboveNephelometricRange) {
		t.Errorf("turbid sample flags %v", r.Flags)
	}
	_, err = Turbidimeter{Calibration: Calibration{Turbidity: 40}}.Read(ISOWavelength, 1, flatVSF(0.1))
	if err == nil || !strings.Contains(err.Error(), "Calibration.Beta90") {
		t.Errorf("missing calibration β: %v", err)
	}
}
