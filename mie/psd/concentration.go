package psd

import (
	"fmt"
	"math"
	"strings"
)

// Basis names what a concentration measures.
type Basis int

const (
	// ByNumber: particles per cubic metre (m⁻³).
	ByNumber Basis = iota + 1
	// ByArea: projected (cross-sectional) area per volume of water, m² m⁻³.
	ByArea
	// ByVolume: particle volume per volume of water, m³ m⁻³ (volume fraction).
	ByVolume
	// ByMass: particle mass per volume of water, kg m⁻³ (1 kg m⁻³ = 1 g/L).
	ByMass
)

func (b Basis) String() string {
	switch b {
	case ByNumber:
		return "number"
	case ByArea:
		return "area"
	case ByVolume:
		return "volume"
	case ByMass:
		return "mass"
	}
	return fmt.Sprintf("Basis(%d)", int(b))
}

// SIUnit returns the SI unit of a concentration on this basis.
func (b Basis) SIUnit() string {
	switch b {
	case ByNumber:
		return "m-3"
	case ByArea:
		return "m2 m-3"
	case ByVolume:
		return "m3 m-3"
	case ByMass:
		return "kg m-3"
	}
	return "?"
}

// Concentration is an amount of particles per volume of water on one basis.
type Concentration struct {
	Basis Basis
	Value float64 // in Basis.SIUnit(); ≥ 0
}

// Validate reports a negative, non-finite value or an unknown basis.
func (c Concentration) Validate() error {
	if c.Basis < ByNumber || c.Basis > ByMass {
		return fmt.Errorf("psd: concentration basis %d unknown, want number, area, volume or mass", int(c.Basis))
	}
	if !(c.Value >= 0) || math.IsInf(c.Value, 0) {
		return fmt.Errorf("psd: %s concentration = %g %s, want a finite value ≥ 0 %s", c.Basis, c.Value, c.Basis.SIUnit(), c.Basis.SIUnit())
	}
	return nil
}

// concentrationUnits maps accepted unit spellings to a basis and the factor
// that converts to SI. Spaces are removed and µ may be written u before
// lookup.
var concentrationUnits = map[string]struct {
	basis  Basis
	factor float64
}{
	// mass
	"kg/m3": {ByMass, 1}, "kgm-3": {ByMass, 1}, "g/L": {ByMass, 1}, "g/l": {ByMass, 1},
	"g/m3": {ByMass, 1e-3}, "gm-3": {ByMass, 1e-3}, "mg/L": {ByMass, 1e-3}, "mg/l": {ByMass, 1e-3},
	"mg/m3": {ByMass, 1e-6}, "ug/L": {ByMass, 1e-6}, "ug/l": {ByMass, 1e-6},
	// volume
	"m3/m3": {ByVolume, 1}, "m3m-3": {ByVolume, 1}, "1": {ByVolume, 1},
	"uL/L": {ByVolume, 1e-6}, "ul/l": {ByVolume, 1e-6}, "ppmv": {ByVolume, 1e-6}, "mm3/L": {ByVolume, 1e-6},
	"nL/L": {ByVolume, 1e-9}, "nl/l": {ByVolume, 1e-9},
	// number
	"m-3": {ByNumber, 1}, "1/m3": {ByNumber, 1}, "L-1": {ByNumber, 1e3}, "1/L": {ByNumber, 1e3}, "/L": {ByNumber, 1e3},
	"mL-1": {ByNumber, 1e6}, "1/mL": {ByNumber, 1e6}, "/mL": {ByNumber, 1e6}, "cm-3": {ByNumber, 1e6}, "1/cm3": {ByNumber, 1e6},
	// area
	"m2/m3": {ByArea, 1}, "m2m-3": {ByArea, 1}, "m-1": {ByArea, 1},
}

func normaliseUnit(u string) string {
	u = strings.ReplaceAll(u, " ", "")
	u = strings.ReplaceAll(u, "µ", "u")
	u = strings.ReplaceAll(u, "μ", "u") // Greek mu as well as the micro sign
	u = strings.ReplaceAll(u, "·", "")
	return u
}

// ParseConcentration converts value in unit to a Concentration in SI. Units
// accepted (µ may be written u): mass kg/m3, g/L, g/m3, mg/L, mg/m3, µg/L;
// volume m3/m3, µL/L, ppmv, mm3/L, nL/L; number m-3, L-1 (1/L), mL-1, cm-3;
// projected area m2/m3. An unknown unit or a negative value is an error.
func ParseConcentration(value float64, unit string) (Concentration, error) {
	u, ok := concentrationUnits[normaliseUnit(unit)]
	if !ok {
		return Concentration{}, fmt.Errorf("psd: concentration unit %q unknown, want one of mg/L, g/m3, kg/m3, uL/L, m3/m3, L-1, mL-1, m-3, m2/m3", unit)
	}
	c := Concentration{Basis: u.basis, Value: value * u.factor}
	if !(value >= 0) || math.IsInf(value, 0) {
		return Concentration{}, fmt.Errorf("psd: concentration = %g %s, want a finite value ≥ 0", value, unit)
	}
	return c, nil
}

// Amount returns d's concentration on the given basis (SI unit of the
// basis). density (kg m⁻³) is used only for ByMass and must then be > 0.
func Amount(d Distribution, b Basis, density float64) (float64, error) {
	switch b {
	case ByNumber:
		return Moment(d, 0)
	case ByArea:
		m, err := Moment(d, 2)
		return math.Pi / 4 * m, err
	case ByVolume:
		m, err := Moment(d, 3)
		return math.Pi / 6 * m, err
	case ByMass:
		if err := checkDensity(density); err != nil {
			return 0, err
		}
		m, err := Moment(d, 3)
		return density * math.Pi / 6 * m, err
	}
	return 0, fmt.Errorf("psd: concentration basis %d unknown, want number, area, volume or mass", int(b))
}

func checkDensity(rho float64) error {
	if !(rho > 0) || math.IsInf(rho, 0) {
		return fmt.Errorf("psd: particle density = %g kg m-3, want a finite value > 0 kg m-3", rho)
	}
	return nil
}

// Normalize rescales the shape d so that its concentration on c's basis is
// c.Value. density (kg m⁻³) is the particle density, used only when c is by
// mass. A shape with zero amount on that basis cannot be normalised.
func Normalize(d Distribution, c Concentration, density float64) (Scaled, error) {
	if err := c.Validate(); err != nil {
		return Scaled{}, err
	}
	have, err := Amount(d, c.Basis, density)
	if err != nil {
		return Scaled{}, err
	}
	if !(have > 0) {
		return Scaled{}, fmt.Errorf("psd: cannot normalise a distribution whose %s concentration is %g", c.Basis, have)
	}
	// Unwrap an existing Scaled so that factors do not nest.
	if s, ok := d.(Scaled); ok {
		return Scaled{Of: s.Of, Factor: s.Factor * c.Value / have}, nil
	}
	return Scaled{Of: d, Factor: c.Value / have}, nil
}

// SauterDiameter returns D32 = M_3/M_2 (m), the diameter of the sphere with
// the population's volume-to-area ratio.
func SauterDiameter(d Distribution) (float64, error) {
	m3, err := Moment(d, 3)
	if err != nil {
		return 0, err
	}
	m2, _ := Moment(d, 2)
	if !(m2 > 0) {
		return 0, fmt.Errorf("psd: Sauter diameter undefined for an empty distribution")
	}
	return m3 / m2, nil
}

// MedianDiameter returns the diameter (m) below which the fraction q of the
// k-th moment lies: q = 0.5, k = 3 gives the volume median diameter D50
// (D_v50 of laser diffraction); k = 0 the count median. It solves by
// bisection in ln D to a relative tolerance of 1e-10. q must lie in (0, 1).
func MedianDiameter(d Distribution, k, q float64) (float64, error) {
	if !(q > 0 && q < 1) {
		return 0, fmt.Errorf("psd: quantile = %g, want 0 < q < 1", q)
	}
	total, err := Moment(d, k)
	if err != nil {
		return 0, err
	}
	if !(total > 0) {
		return 0, fmt.Errorf("psd: quantile undefined for an empty distribution")
	}
	lo, hi := d.Range()
	a, b := math.Log(lo), math.Log(hi)
	for b-a > 1e-10 {
		mid := 0.5 * (a + b)
		if PartialMoment(d, k, lo, math.Exp(mid)) < q*total {
			a = mid
		} else {
			b = mid
		}
	}
	return math.Exp(0.5 * (a + b)), nil
}

// VolumeMedianDiameter returns D50 by volume (m): MedianDiameter(d, 3, 0.5).
func VolumeMedianDiameter(d Distribution) (float64, error) { return MedianDiameter(d, 3, 0.5) }
