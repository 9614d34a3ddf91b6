package spec

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// dim is a physical dimension as integer exponents of the base quantities
// murk needs. Salinity and angle are kept as their own pseudo-dimensions,
// although both are dimensionless in SI, so that "35 PSU" can never be
// accepted where a volume fraction or an angle is expected.
type dim struct {
	L, M, T, K, S, A int8 // length, mass, time, temperature, salinity, angle
}

var (
	dimNone        = dim{}
	dimLength      = dim{L: 1}
	dimTime        = dim{T: 1}
	dimVelocity    = dim{L: 1, T: -1}
	dimDischarge   = dim{L: 3, T: -1}
	dimTemperature = dim{K: 1}
	dimSalinity    = dim{S: 1}
	dimDensity     = dim{M: 1, L: -3} // mass per volume: density and mass concentration
	dimNumberConc  = dim{L: -3}
	dimStress      = dim{M: 1, L: -1, T: -2}
	dimMassFlux    = dim{M: 1, L: -2, T: -1}
	dimArealMass   = dim{M: 1, L: -2}
	dimPerLength   = dim{L: -1}
	dimAngle       = dim{A: 1}
	dimArea        = dim{L: 2}
	dimDiffusivity = dim{L: 2, T: -1}
)

// dimName names a dimension in error messages.
func (d dim) name() string {
	switch d {
	case dimNone:
		return "a dimensionless ratio"
	case dimLength:
		return "a length"
	case dimTime:
		return "a time"
	case dimVelocity:
		return "a velocity"
	case dimDischarge:
		return "a discharge"
	case dimTemperature:
		return "a temperature"
	case dimSalinity:
		return "a salinity"
	case dimDensity:
		return "a mass per volume"
	case dimNumberConc:
		return "a number per volume"
	case dimStress:
		return "a stress"
	case dimMassFlux:
		return "a mass flux"
	case dimArealMass:
		return "a mass per area"
	case dimPerLength:
		return "an inverse length"
	case dimAngle:
		return "an angle"
	case dimArea:
		return "an area"
	case dimDiffusivity:
		return "a diffusivity"
	}
	return fmt.Sprintf("dimension %+v", d)
}

// unitDef is one accepted unit symbol: SI value = number·factor + offset.
type unitDef struct {
	sym    string // canonical spelling, shown in messages
	d      dim
	factor float64
	offset float64
	// div, when non-zero, is the exact integer 1/factor: dividing by it
	// rounds correctly, so "900 nm" gives exactly the float64 900e-9.
	div float64
}

// toSI converts a number in unit u to SI.
func (u unitDef) toSI(v float64) float64 {
	if u.div != 0 {
		return v/u.div + u.offset
	}
	return v*u.factor + u.offset
}

// fromSI converts an SI value to unit u.
func (u unitDef) fromSI(v float64) float64 {
	if u.div != 0 {
		return (v - u.offset) * u.div
	}
	return (v - u.offset) / u.factor
}

// units lists every unit symbol murk accepts, keyed by its normalised
// spelling (see normUnit). Conversion factors are exact SI definitions
// (BIPM SI Brochure, 9th ed., 2019, tables 8 and 9) except where noted.
var units = map[string]unitDef{}

func addUnit(sym string, d dim, factor, offset float64, aliases ...string) {
	u := unitDef{sym: sym, d: d, factor: factor, offset: offset}
	if inv := math.Round(1 / factor); factor < 1 && math.Abs(inv*factor-1) < 1e-12 {
		u.div = inv
	}
	for _, s := range append([]string{sym}, aliases...) {
		units[normUnit(s)] = u
	}
}

func init() {
	// length
	addUnit("m", dimLength, 1, 0)
	addUnit("km", dimLength, 1e3, 0)
	addUnit("cm", dimLength, 1e-2, 0)
	addUnit("mm", dimLength, 1e-3, 0)
	addUnit("µm", dimLength, 1e-6, 0)
	addUnit("nm", dimLength, 1e-9, 0)
	// time (minute, hour and day are SI-accepted units, SI Brochure table 8)
	addUnit("s", dimTime, 1, 0)
	addUnit("min", dimTime, 60, 0)
	addUnit("h", dimTime, 3600, 0)
	addUnit("day", dimTime, 86400, 0, "d")
	// velocity
	addUnit("m/s", dimVelocity, 1, 0)
	addUnit("cm/s", dimVelocity, 1e-2, 0)
	addUnit("mm/s", dimVelocity, 1e-3, 0)
	addUnit("µm/s", dimVelocity, 1e-6, 0)
	addUnit("m/day", dimVelocity, 1.0/86400, 0)
	// discharge
	addUnit("m3/s", dimDischarge, 1, 0)
	addUnit("L/s", dimDischarge, 1e-3, 0)
	// Celsius temperature: murk stores °C (see doc.go), so degC is the
	// identity and kelvin is shifted by 273.15 (SI Brochure, section 2.3.1).
	addUnit("degC", dimTemperature, 1, 0, "°C")
	addUnit("K", dimTemperature, 1, -273.15)
	// practical salinity (UNESCO 1981 Practical Salinity Scale, dimensionless)
	addUnit("PSU", dimSalinity, 1, 0, "psu")
	// mass per volume (1 mg/L = 1 g/m3 exactly)
	addUnit("kg/m3", dimDensity, 1, 0)
	addUnit("g/cm3", dimDensity, 1e3, 0)
	addUnit("g/mL", dimDensity, 1e3, 0)
	addUnit("g/L", dimDensity, 1, 0)
	addUnit("g/m3", dimDensity, 1e-3, 0)
	addUnit("mg/L", dimDensity, 1e-3, 0)
	addUnit("mg/m3", dimDensity, 1e-6, 0)
	addUnit("µg/L", dimDensity, 1e-6, 0)
	// number per volume
	addUnit("1/m3", dimNumberConc, 1, 0)
	addUnit("1/L", dimNumberConc, 1e3, 0)
	addUnit("1/mL", dimNumberConc, 1e6, 0, "1/cm3")
	// volume fraction
	addUnit("m3/m3", dimNone, 1, 0)
	addUnit("mL/L", dimNone, 1e-3, 0)
	addUnit("µL/L", dimNone, 1e-6, 0)
	// stress
	addUnit("Pa", dimStress, 1, 0, "N/m2")
	addUnit("mPa", dimStress, 1e-3, 0)
	// mass flux
	addUnit("kg/m2/s", dimMassFlux, 1, 0)
	addUnit("g/m2/s", dimMassFlux, 1e-3, 0)
	// mass per area
	addUnit("kg/m2", dimArealMass, 1, 0)
	addUnit("g/m2", dimArealMass, 1e-3, 0)
	// inverse length
	addUnit("1/m", dimPerLength, 1, 0, "m-1")
	addUnit("1/nm", dimPerLength, 1e9, 0, "nm-1")
	addUnit("1/µm", dimPerLength, 1e6, 0, "µm-1")
	// area (Cauchy dispersion coefficients)
	addUnit("m2", dimArea, 1, 0)
	addUnit("µm2", dimArea, 1e-12, 0)
	addUnit("nm2", dimArea, 1e-18, 0)
	// diffusivity
	addUnit("m2/s", dimDiffusivity, 1, 0)
	addUnit("cm2/s", dimDiffusivity, 1e-4, 0)
	// angle
	addUnit("deg", dimAngle, math.Pi/180, 0, "°")
	addUnit("rad", dimAngle, 1, 0)
}

// normUnit folds the spellings people type for the same symbol: the micro
// sign (U+00B5), Greek mu (U+03BC) and ASCII "u" all mean micro;
// superscript ² and ³ mean 2 and 3. Case is kept (mm ≠ Mm).
func normUnit(s string) string {
	s = strings.TrimSpace(s)
	r := strings.NewReplacer("μ", "u", "µ", "u", "³", "3", "²", "2", "⁻¹", "-1", " ", "")
	return r.Replace(s)
}

// kind is what a field holds: its dimension(s), the unit symbols it accepts
// (a subset of units, so that a wavelength cannot be written in km) and the
// unit its allowed range is printed in.
type kind struct {
	name    string   // e.g. "wavelength"
	allowed []string // canonical symbols, in the order shown to users
	show    string   // display unit for ranges
}

var (
	kLength      = kind{"length", []string{"m", "km"}, "km"}
	kDepth       = kind{"depth", []string{"m", "cm"}, "m"}
	kWidth       = kind{"width", []string{"m", "km"}, "m"}
	kDistance    = kind{"distance", []string{"m", "km"}, "km"}
	kTideHeight  = kind{"tidal height", []string{"m", "cm"}, "m"}
	kDiameter    = kind{"particle diameter", []string{"nm", "µm", "mm", "m"}, "µm"}
	kWavelength  = kind{"wavelength", []string{"nm", "µm"}, "nm"}
	kTime        = kind{"time", []string{"s", "min", "h", "day"}, "day"}
	kShortTime   = kind{"time interval", []string{"s", "min", "h", "day"}, "h"}
	kVelocity    = kind{"velocity", []string{"m/s", "cm/s", "mm/s", "µm/s", "m/day"}, "m/s"}
	kSettling    = kind{"settling velocity", []string{"m/s", "cm/s", "mm/s", "µm/s", "m/day"}, "mm/s"}
	kDischarge   = kind{"discharge", []string{"m3/s", "L/s"}, "m3/s"}
	kTemperature = kind{"temperature", []string{"degC", "K"}, "degC"}
	kSalinity    = kind{"salinity", []string{"PSU"}, "PSU"}
	kDensity     = kind{"density", []string{"kg/m3", "g/cm3", "g/mL"}, "kg/m3"}
	kMassConc    = kind{"mass concentration", []string{"kg/m3", "g/L", "g/m3", "mg/L", "mg/m3", "µg/L"}, "g/m3"}
	kChl         = kind{"chlorophyll concentration", []string{"mg/m3", "µg/L", "g/m3", "mg/L"}, "mg/m3"}
	kStress      = kind{"stress", []string{"Pa", "N/m2", "mPa"}, "Pa"}
	kMassFlux    = kind{"erosion rate", []string{"kg/m2/s", "g/m2/s"}, "kg/m2/s"}
	kArealMass   = kind{"bed inventory", []string{"kg/m2", "g/m2"}, "kg/m2"}
	kAbsorption  = kind{"absorption coefficient", []string{"1/m", "m-1"}, "1/m"}
	kSlope       = kind{"spectral slope", []string{"1/nm", "1/µm", "1/m"}, "1/nm"}
	kAngle       = kind{"angle", []string{"deg", "rad"}, "deg"}
	kCauchy      = kind{"Cauchy coefficient", []string{"µm2", "nm2", "m2"}, "µm2"}
	kDiffusivity = kind{"diffusivity", []string{"m2/s", "cm2/s"}, "m2/s"}
	// kConcentration accepts three dimensions; the unit decides the basis.
	kConcentration = kind{"particle concentration", []string{
		"kg/m3", "g/L", "g/m3", "mg/L", "mg/m3", "µg/L",
		"m3/m3", "mL/L", "µL/L",
		"1/m3", "1/L", "1/mL"}, ""}
)

func (k kind) allowedList() string { return strings.Join(k.allowed, ", ") }

// showFactor returns the SI value of one display unit and its offset.
func (k kind) showUnit() unitDef { return units[normUnit(k.show)] }

// splitQuantity splits "12.5 km" into its number and unit text. The number
// is a decimal with optional exponent; NaN and infinities are not numbers
// here. Whitespace between number and unit is optional.
func splitQuantity(s string) (num float64, unit string, ok bool) {
	s = strings.TrimSpace(s)
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	digits := 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i++
		digits++
	}
	if i < len(s) && s[i] == '.' {
		i++
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i++
			digits++
		}
	}
	if digits == 0 {
		return 0, "", false
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		if k > j {
			i = k
		}
	}
	v, err := strconv.ParseFloat(s[:i], 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, "", false
	}
	return v, strings.TrimSpace(s[i:]), true
}

// ParseQuantity converts text such as "1200 m3/s" or "650 nm" to SI,
// checking that the unit has the wanted dimension. It serves callers outside
// the loader (command-line flags): want is one of "length", "wavelength",
// "particle diameter", "time", "velocity", "discharge", "temperature",
// "salinity", "mass concentration", "density", "angle". The error names the
// units allowed for that quantity.
func ParseQuantity(text, want string) (float64, error) {
	k, ok := kindsByName[want]
	if !ok {
		return 0, fmt.Errorf("spec: unknown quantity %q", want)
	}
	v, _, err := parseWith(text, k)
	return v, err
}

var kindsByName = map[string]kind{}

func init() {
	for _, k := range []kind{kLength, kWavelength, kDiameter, kTime, kVelocity, kDischarge,
		kTemperature, kSalinity, kMassConc, kDensity, kAngle} {
		kindsByName[k.name] = k
	}
}

// parseWith parses text as a quantity of kind k and returns its SI value
// and unit. Errors say what was wrong and list the allowed units.
func parseWith(text string, k kind) (float64, unitDef, error) {
	num, us, ok := splitQuantity(text)
	if !ok {
		return 0, unitDef{}, fmt.Errorf("not a quantity: want a number and a unit, e.g. \"%s\"; allowed units: %s",
			example(k), k.allowedList())
	}
	if us == "" {
		return 0, unitDef{}, fmt.Errorf("missing unit; allowed units: %s", k.allowedList())
	}
	u, known := units[normUnit(us)]
	if !known {
		return 0, unitDef{}, fmt.Errorf("unknown unit %q; allowed units: %s", us, k.allowedList())
	}
	accepted := false
	for _, a := range k.allowed {
		if units[normUnit(a)].sym == u.sym {
			accepted = true
			break
		}
	}
	if !accepted {
		kd := units[normUnit(k.allowed[0])].d
		if u.d != kd && k.name != kConcentration.name {
			return 0, unitDef{}, fmt.Errorf("unit %q is %s, but a %s is wanted; allowed units: %s",
				us, u.d.name(), k.name, k.allowedList())
		}
		return 0, unitDef{}, fmt.Errorf("unit %q is not accepted for a %s; allowed units: %s",
			us, k.name, k.allowedList())
	}
	return u.toSI(num), u, nil
}

func example(k kind) string {
	if k.show != "" {
		return "1 " + k.show
	}
	return "1 " + k.allowed[0]
}

// formatIn prints an SI value in the display unit of k, e.g. "80 km".
func formatIn(v float64, k kind) string {
	u := k.showUnit()
	if u.factor == 0 {
		return strconv.FormatFloat(v, 'g', 6, 64)
	}
	return strconv.FormatFloat(u.fromSI(v), 'g', 6, 64) + " " + u.sym
}
