package seen

import "strings"

// Flag marks a reading or prediction made where a model's assumptions are
// stretched. Flags are advisory: the value is still computed, but it should
// not be trusted as far as one without flags. Flags combine with |.
type Flag uint32

const (
	// FlagThickPath: the optical depth (a+b)·L over an instrument's path
	// exceeds SingleScatteringDepth, so light scattered more than once reaches
	// the detector and the single-scattering treatment underestimates the
	// collected light (common practice).
	FlagThickPath Flag = 1 << iota
	// FlagForwardExtrapolated: the VSF has no sample at 0 and more than 1 % of
	// the collected near-forward scattering came from holding β constant
	// between 0 and the first sampled angle.
	FlagForwardExtrapolated
	// FlagNegativeParticle: total β at a sensor angle is below the water β
	// supplied for subtraction; the particle signal was set to 0.
	FlagNegativeParticle
	// FlagOffStandard: a turbidity reading was made away from the ISO 7027
	// band (860 nm ± 30 nm).
	FlagOffStandard
	// FlagAboveNephelometricRange: turbidity above 400 FNU, the top of the
	// typical range of the nephelometric method of ISO 7027-1.
	FlagAboveNephelometricRange
	// FlagSaturated: the signal drives the digitiser to (or past) full scale.
	FlagSaturated
	// FlagUnderrange: the signal plus offset is below zero counts.
	FlagUnderrange
	// FlagBelowDetection: the signal is below three times the dark noise
	// (the usual 3σ limit of detection, common practice).
	FlagBelowDetection
	// FlagOutsideFit: u = b_b/(a+b_b) lies outside the fit range of the
	// reflectance model used.
	FlagOutsideFit
	// FlagLowSun: solar zenith angle above the range of the Kd model's
	// simulations.
	FlagLowSun
	// FlagNoSecchi: |0.14 − Rrs| ≤ 0.013 sr⁻¹, so the disk has no contrast in
	// the Lee et al. (2015) theory; the depth is reported as 0.
	FlagNoSecchi
	// FlagBrightWater: Rrs in the transparent window above 0.14 sr⁻¹, the
	// disk's reflectance term: the water is brighter than the disk.
	FlagBrightWater
	// FlagAchromatic: the chromaticity is (within 1e-9) the white point, so
	// hue angle and dominant wavelength are undefined (reported as 0).
	FlagAchromatic
	// FlagComplementary: the dominant-wavelength ray meets the purple line;
	// the complementary wavelength is reported instead, and no Forel-Ule
	// class is assigned.
	FlagComplementary
	// FlagForelUleClamped: the dominant wavelength lies outside the
	// 470–600 nm span of the Forel-Ule table; class 1 or 21 was assigned.
	FlagForelUleClamped
	// FlagOutOfGamut: the colour lies outside the sRGB gamut; negative linear
	// components were clipped to 0.
	FlagOutOfGamut
	// FlagNotSurface: a reading that needs the light leaving the surface
	// (a radiometer band) was asked for below the surface layer.
	FlagNotSurface
)

var flagNames = [...]string{
	"thick-path", "forward-extrapolated", "negative-particle", "off-standard",
	"above-nephelometric-range", "saturated", "underrange", "below-detection",
	"outside-fit", "low-sun", "no-secchi", "bright-water", "achromatic",
	"complementary", "forel-ule-clamped", "out-of-gamut", "not-surface",
}

// Has reports whether every flag in q is set in f.
func (f Flag) Has(q Flag) bool { return f&q == q }

// String lists the set flags separated by '|', or "none".
func (f Flag) String() string {
	if f == 0 {
		return "none"
	}
	var parts []string
	for i, n := range flagNames {
		if f&(1<<i) != 0 {
			parts = append(parts, n)
		}
	}
	if rest := f &^ (1<<len(flagNames) - 1); rest != 0 {
		parts = append(parts, "unknown")
	}
	return strings.Join(parts, "|")
}
