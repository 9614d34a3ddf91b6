package water

import (
	"fmt"
	"math"
)

// Limits for CDOM spectra.
const (
	// MaxCDOMSlopePerNM bounds the spectral slope, nm⁻¹: published slopes
	// run from below 0.01 to 0.04 nm⁻¹ (Schwarz et al. 2002, Oceanologia
	// 44:209); 0.05 leaves margin without admitting nonsense.
	MaxCDOMSlopePerNM = 0.05
	// MaxCDOMAbsorption bounds a_g at the reference wavelength, m⁻¹
	// (estuarine a_g(355) reaches about 6 m⁻¹; Lei & Pan 2016; 100 leaves
	// room for blackwater rivers).
	MaxCDOMAbsorption = 100.0
)

// CDOM is the absorption spectrum of coloured dissolved organic matter,
//
//	a_g(λ) = ARef · exp(−Slope · (λ − RefWavelength))
//
// (Jerlov 1968; Bricaud, Morel & Prieur 1981, Limnol. Oceanogr. 26(1):43–53,
// eq. 1). A typical slope is 0.014 nm⁻¹ (common practice; Schwarz et al.
// 2002 give 0.0165 ± 0.0035 nm⁻¹ for their data set) with λ0 = 440 nm.
// The zero value absorbs nothing at any wavelength but has no reference
// wavelength and does not validate; use NewCDOM or fill every field.
type CDOM struct {
	RefWavelength float64 // reference wavelength λ0, m (350–900 nm)
	ARef          float64 // absorption at λ0, m⁻¹, 0–MaxCDOMAbsorption
	Slope         float64 // spectral slope S_g, m⁻¹ (per metre of wavelength; 0.014 nm⁻¹ = 0.014*PerNM)
}

// NewCDOM returns a validated CDOM spectrum from a reference wavelength (m),
// its absorption (m⁻¹) and the slope in nm⁻¹ (the unit it is quoted in).
func NewCDOM(refWavelength, aRef, slopePerNM float64) (CDOM, error) {
	c := CDOM{RefWavelength: refWavelength, ARef: aRef, Slope: slopePerNM * PerNM}
	return c, c.Validate()
}

// Validate reports the first field outside its allowed range.
func (c CDOM) Validate() error {
	if err := checkWavelength("CDOM reference wavelength", c.RefWavelength, MinWavelengthNM, MaxWavelengthNM); err != nil {
		return err
	}
	if err := checkRange("CDOM absorption at the reference wavelength", c.ARef, 0, MaxCDOMAbsorption, "m-1"); err != nil {
		return err
	}
	return checkRange("CDOM spectral slope", c.Slope/PerNM, 0, MaxCDOMSlopePerNM, "nm-1")
}

// Absorption returns a_g at vacuum wavelength lambda (m), 350–900 nm, in
// m⁻¹. It validates c.
func (c CDOM) Absorption(lambda float64) (float64, error) {
	if err := c.Validate(); err != nil {
		return 0, err
	}
	if err := checkWavelength("wavelength", lambda, MinWavelengthNM, MaxWavelengthNM); err != nil {
		return 0, err
	}
	return c.at(lambda), nil
}

func (c CDOM) at(lambda float64) float64 {
	return c.ARef * math.Exp(-c.Slope*(lambda-c.RefWavelength))
}

// CDOMMixing mixes two CDOM end members conservatively with salinity: with
// f = (S − RiverSalinity)/(OceanSalinity − RiverSalinity),
//
//	a_g(λ; S) = (1 − f) · River(λ) + f · Ocean(λ)
//
// at every wavelength (two-end-member conservative mixing, common practice;
// absorption coefficients add linearly). Unless the end members share one
// slope, the mixture is not a single exponential: its apparent slope moves
// from the river's to the ocean's along the salinity gradient.
type CDOMMixing struct {
	River, Ocean  CDOM
	RiverSalinity float64 // salinity of the river end member, 0–42
	OceanSalinity float64 // salinity of the ocean end member, > RiverSalinity, ≤ 42
}

// Validate checks both end members and their salinities.
func (m CDOMMixing) Validate() error {
	if err := m.River.Validate(); err != nil {
		return fmt.Errorf("river end member: %w", err)
	}
	if err := m.Ocean.Validate(); err != nil {
		return fmt.Errorf("ocean end member: %w", err)
	}
	if err := checkRange("river end-member salinity", m.RiverSalinity, MinSalinity, MaxSalinity, "(practical salinity)"); err != nil {
		return err
	}
	return checkRange("ocean end-member salinity", m.OceanSalinity, math.Nextafter(m.RiverSalinity, math.Inf(1)), MaxSalinity, "(practical salinity)")
}

// fraction returns the ocean fraction f for salinity s after checking s
// lies between the end members.
func (m CDOMMixing) fraction(s float64) (float64, error) {
	if err := checkRange("salinity", s, m.RiverSalinity, m.OceanSalinity, "(practical salinity)"); err != nil {
		return 0, fmt.Errorf("%w: conservative mixing holds only between the end members", err)
	}
	return (s - m.RiverSalinity) / (m.OceanSalinity - m.RiverSalinity), nil
}

// Absorption returns the mixed a_g (m⁻¹) at wavelength lambda (m) and
// salinity s, which must lie between the end-member salinities.
func (m CDOMMixing) Absorption(lambda, s float64) (float64, error) {
	if err := m.Validate(); err != nil {
		return 0, err
	}
	if err := checkWavelength("wavelength", lambda, MinWavelengthNM, MaxWavelengthNM); err != nil {
		return 0, err
	}
	f, err := m.fraction(s)
	if err != nil {
		return 0, err
	}
	return (1-f)*m.River.at(lambda) + f*m.Ocean.at(lambda), nil
}

// Spectrum fills dst[i] with the mixed a_g (m⁻¹) at wavelengths[i] (m) for
// salinity s. It allocates nothing; dst shorter than wavelengths panics.
func (m CDOMMixing) Spectrum(dst, wavelengths []float64, s float64) error {
	_ = dst[:len(wavelengths)]
	if err := m.Validate(); err != nil {
		return err
	}
	f, err := m.fraction(s)
	if err != nil {
		return err
	}
	for _, l := range wavelengths {
		if err := checkWavelength("wavelength", l, MinWavelengthNM, MaxWavelengthNM); err != nil {
			return err
		}
	}
	for i, l := range wavelengths {
		dst[i] = (1-f)*m.River.at(l) + f*m.Ocean.at(l)
	}
	return nil
}
