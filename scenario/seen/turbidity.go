package seen

import (
	"fmt"
	"math"
)

// ISO 7027 geometry used by Turbidimeter (ISO 7027-1:2016). The source
// wavelength and detection angle are as commonly quoted for the standard
// (from memory; a national laboratory's method page for SS-EN ISO 7027
// lists an 870 nm, 90° instrument, consistent with them); check the
// standard's text before relying on the tolerances.
const (
	// ISOWavelength is the nominal source wavelength of ISO 7027, m.
	ISOWavelength = 860e-9
	// ISOHalfBand is the tolerance on the source wavelength used for
	// FlagOffStandard, m: half of a 60 nm bandwidth (from memory; check the
	// current edition of ISO 7027-1 before relying on it).
	ISOHalfBand = 30e-9
	// ISODetectionAngle is the nephelometric detection angle, rad (90°).
	ISODetectionAngle = math.Pi / 2
	// NephelometricMax is the top of the typical nephelometric range of
	// ISO 7027-1, FNU (the scope of ISO 7027-1:2016 gives <0.05–400).
	NephelometricMax = 400
)

// Calibration describes the turbidity standard a Turbidimeter is calibrated
// against. murk has no sourced optical description of formazin, so the
// standard's optics are an input: this is an ASSUMPTION of the caller, and
// the readings are "formazin-like" ratios, not certified FNU.
type Calibration struct {
	// Turbidity is the nominal turbidity of the standard, FNU, > 0.
	Turbidity float64
	// Beta90 is the particle β(90°) of the standard at the source
	// wavelength, m⁻¹ sr⁻¹, > 0 (water blank removed).
	Beta90 float64
	// Attenuation is the standard's beam attenuation c at the source
	// wavelength, m⁻¹, ≥ 0; used only when the Turbidimeter has a
	// PathLength. 0 ignores the standard's self-attenuation.
	Attenuation float64
}

// Turbidimeter is a nephelometer in the ISO 7027 geometry: near-infrared
// source (860 nm), detector at 90° to the beam. Its signal is taken as
// proportional to the particle β(90°) attenuated over the light path in the
// sample, and the reading is the ratio to a calibration standard:
//
//	T = T_cal · β_p(90°) e^{−c ℓ} / (β_cal(90°) e^{−c_cal ℓ}).
//
// This single-scattering, single-angle model is an ASSUMPTION (common
// practice for describing nephelometers), not part of ISO 7027, which defines
// turbidity operationally by formazin. Turbidity is not a property of the
// water alone: instruments built to different standards (ISO 7027, USEPA
// 180.1) disagree for natural particles even when they agree on formazin
// (Kitchener, Wainwright & Parsons 2017, Prog. Phys. Geogr.,
// doi:10.1177/0309133317726540).
// Validity: c ℓ below SingleScatteringDepth (flagged beyond; at high
// concentration real readings can fall as concentration rises, Voichick,
// Topping & Griffiths 2018, Hydrol. Earth Syst. Sci. 22:1767); readings above
// NephelometricMax are flagged.
type Turbidimeter struct {
	// WaterBeta90 is β(90°) of particle-free water at the source
	// wavelength, m⁻¹ sr⁻¹, ≥ 0; removed as the instrument blank.
	WaterBeta90 float64
	// PathLength is the mean light path in the sample (source to scattering
	// volume to detector), m, in [0, 1]. 0 ignores self-attenuation.
	PathLength float64
	// Calibration is the standard; its fields have no defaults.
	Calibration Calibration
}

// TurbidityReading is what a Turbidimeter reports.
type TurbidityReading struct {
	// Turbidity in formazin-like units (FNU-equivalent under the stated
	// assumptions), ≥ 0.
	Turbidity float64
	// ParticleBeta90 is β_p(90°) of the sample, m⁻¹ sr⁻¹.
	ParticleBeta90 float64
	// OpticalDepth is c·ℓ over the light path, dimensionless.
	OpticalDepth float64
	// Flags: FlagOffStandard, FlagNegativeParticle, FlagThickPath,
	// FlagAboveNephelometricRange.
	Flags Flag
}

// Read simulates the instrument with the total VSF and beam attenuation c
// (m⁻¹) of the sample at the source wavelength (m).
func (t Turbidimeter) Read(wavelength, c float64, vsf VSF) (TurbidityReading, error) {
	var r TurbidityReading
	if err := checkScalar("wavelength", wavelength, MinWavelength, MaxWavelength, "m"); err != nil {
		return r, err
	}
	if err := checkScalar("c", c, 0, MaxCoefficient, "m⁻¹"); err != nil {
		return r, err
	}
	if err := checkScalar("Turbidimeter.WaterBeta90", t.WaterBeta90, 0, math.MaxFloat64, "m⁻¹ sr⁻¹"); err != nil {
		return r, err
	}
	if err := checkScalar("Turbidimeter.PathLength", t.PathLength, 0, 1, "m"); err != nil {
		return r, err
	}
	cal := t.Calibration
	if err := checkScalar("Calibration.Turbidity", cal.Turbidity, math.SmallestNonzeroFloat64, math.MaxFloat64, "FNU"); err != nil {
		return r, err
	}
	if err := checkScalar("Calibration.Beta90", cal.Beta90, math.SmallestNonzeroFloat64, math.MaxFloat64, "m⁻¹ sr⁻¹"); err != nil {
		return r, err
	}
	if err := checkScalar("Calibration.Attenuation", cal.Attenuation, 0, MaxCoefficient, "m⁻¹"); err != nil {
		return r, err
	}
	if err := vsf.Validate(); err != nil {
		return r, err
	}
	if ISODetectionAngle < vsf.Angle[0] || ISODetectionAngle > vsf.Angle[len(vsf.Angle)-1] {
		return r, fmt.Errorf("seen: the VSF's sampled angles [%g, %g] rad do not include 90° (%g rad)", vsf.Angle[0], vsf.Angle[len(vsf.Angle)-1], ISODetectionAngle)
	}
	if math.Abs(wavelength-ISOWavelength) > ISOHalfBand {
		r.Flags |= FlagOffStandard
	}
	r.ParticleBeta90 = vsf.at(ISODetectionAngle) - t.WaterBeta90
	if r.ParticleBeta90 < 0 {
		r.ParticleBeta90 = 0
		r.Flags |= FlagNegativeParticle
	}
	r.OpticalDepth = c * t.PathLength
	if r.OpticalDepth > SingleScatteringDepth {
		r.Flags |= FlagThickPath
	}
	att := math.Exp(-(c - cal.Attenuation) * t.PathLength)
	r.Turbidity = cal.Turbidity * r.ParticleBeta90 / cal.Beta90 * att
	if math.IsInf(r.Turbidity, 0) || math.IsNaN(r.Turbidity) {
		return TurbidityReading{}, fmt.Errorf("seen: turbidity overflows (β_p(90°) = %g, Calibration.Beta90 = %g m⁻¹ sr⁻¹)", r.ParticleBeta90, cal.Beta90)
	}
	if r.Turbidity > NephelometricMax {
		r.Flags |= FlagAboveNephelometricRange
	}
	return r, nil
}
