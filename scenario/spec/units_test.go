package spec

import (
	"math"
	"strings"
	"testing"
)

// TestUnitConversions checks each accepted unit against its definition.
// Sources: SI Brochure (BIPM, 9th ed., 2019) tables 7–8 for prefixes, the
// litre (1 L = 1e-3 m³), minute, hour, day, degree (π/180 rad) and
// Celsius (T/°C = T/K − 273.15); practical salinity is dimensionless
// (UNESCO 1981).
func TestUnitConversions(t *testing.T) {
	cases := []struct {
		text string
		k    kind
		want float64
	}{
		{"80 km", kLength, 80e3},
		{"3.5 m", kTideHeight, 3.5},
		{"35 cm", kTideHeight, 0.35},
		{"650 nm", kWavelength, 650e-9},
		{"0.65 µm", kWavelength, 650e-9},
		{"0.65 um", kWavelength, 650e-9},
		{"0.65 μm", kWavelength, 650e-9}, // Greek mu
		{"0.5 mm", kDiameter, 0.5e-3},
		{"30 day", kTime, 30 * 86400},
		{"30 d", kTime, 30 * 86400},
		{"90 min", kTime, 5400},
		{"12 h", kTime, 43200},
		{"0.5 mm/s", kSettling, 0.5e-3},
		{"2 cm/s", kVelocity, 0.02},
		{"8.64 m/day", kSettling, 1e-4},
		{"1200 m3/s", kDischarge, 1200},
		{"1200 m³/s", kDischarge, 1200},
		{"500 L/s", kDischarge, 0.5},
		{"12 degC", kTemperature, 12},
		{"12 °C", kTemperature, 12},
		{"273.15 K", kTemperature, 0},
		{"35 PSU", kSalinity, 35},
		{"35 psu", kSalinity, 35},
		{"50 g/m3", kMassConc, 0.05},
		{"50 mg/L", kMassConc, 0.05},
		{"1.2 g/L", kMassConc, 1.2},
		{"3 µg/L", kChl, 3e-6},
		{"3 mg/m3", kChl, 3e-6},
		{"2.65 g/cm3", kDensity, 2650},
		{"1.05 g/mL", kDensity, 1050},
		{"0.15 Pa", kStress, 0.15},
		{"150 mPa", kStress, 0.15},
		{"0.15 N/m2", kStress, 0.15},
		{"0.1 g/m2/s", kMassFlux, 1e-4},
		{"20 kg/m2", kArealMass, 20},
		{"1.5 1/m", kAbsorption, 1.5},
		{"1.5 m-1", kAbsorption, 1.5},
		{"0.018 1/nm", kSlope, 0.018e9},
		{"18 1/µm", kSlope, 0.018e9},
		{"124 deg", kAngle, 124 * math.Pi / 180},
		{"124°", kAngle, 124 * math.Pi / 180},
		{"1 rad", kAngle, 1},
		{"1e-5 m2/s", kDiffusivity, 1e-5},
		{"3.5e-3 µm2", kCauchy, 3.5e-15},
		{"5 µL/L", kConcentration, 5e-6},
		{"5 1/mL", kConcentration, 5e6},
		{"5 1/L", kConcentration, 5e3},
		{"  +2.5E+1   km ", kLength, 25e3},
		{"25km", kLength, 25e3},
		{".5 m", kDepth, 0.5},
	}
	for _, c := range cases {
		got, _, err := parseWith(c.text, c.k)
		if err != nil {
			t.Errorf("%q: %v", c.text, err)
			continue
		}
		if !near(got, c.want, exactTol) && math.Abs(got-c.want) > 1e-12 {
			t.Errorf("%q: got %.17g, want %.17g", c.text, got, c.want)
		}
	}
}

// TestExactDecimalScaling: dividing by an exact power of ten rounds
// correctly, so a value written in nm equals the float64 literal in m.
func TestExactDecimalScaling(t *testing.T) {
	for _, nm := range []int{400, 443, 555, 700, 860, 900} {
		got, _, err := parseWith(itoa(nm)+" nm", kWavelength)
		if err != nil {
			t.Fatal(err)
		}
		want := float64(nm) / 1e9 // correctly rounded, like the literal 900e-9
		if got != want {
			t.Errorf("%d nm = %.17g, want %.17g", nm, got, want)
		}
	}
}

func TestUnitErrors(t *testing.T) {
	cases := []struct {
		text string
		k    kind
		want string
	}{
		{"80", kLength, "missing unit; allowed units: m, km"},
		{"80 furlong", kLength, `unknown unit "furlong"; allowed units: m, km`},
		{"80 nm", kLength, `unit "nm" is not accepted for a length; allowed units: m, km`},
		{"80 s", kLength, `unit "s" is a time, but a length is wanted`},
		{"35 m3/m3", kSalinity, `unit "m3/m3" is a dimensionless ratio, but a salinity is wanted`},
		{"1 deg", kConcentration, `unit "deg" is not accepted for a particle concentration`},
		{"km", kLength, "not a quantity"},
		{"", kLength, "not a quantity"},
		{"NaN m", kLength, "not a quantity"},
		{"Inf m", kLength, "not a quantity"},
		{"1e999 m", kLength, "not a quantity"},
		{"- 5 m", kLength, "not a quantity"},
	}
	for _, c := range cases {
		_, _, err := parseWith(c.text, c.k)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q: got %v, want %q", c.text, err, c.want)
		}
	}
}

func TestParseQuantity(t *testing.T) {
	v, err := ParseQuantity("650 nm", "wavelength")
	if err != nil || v != 650e-9 {
		t.Errorf("got %v, %v", v, err)
	}
	if _, err := ParseQuantity("650 nm", "colour"); err == nil {
		t.Error("unknown quantity accepted")
	}
	if _, err := ParseQuantity("650", "wavelength"); err == nil || !strings.Contains(err.Error(), "nm, µm") {
		t.Errorf("missing unit: %v", err)
	}
}

// TestKindUnitsKnown guards the tables against a typo: every unit a field
// accepts must exist, have one dimension per field (except the
// concentration field, which spans three bases) and print in its display
// unit.
func TestKindUnitsKnown(t *testing.T) {
	kinds := []kind{kLength, kDepth, kWidth, kDistance, kTideHeight, kDiameter, kWavelength, kTime, kShortTime,
		kVelocity, kSettling, kDischarge, kTemperature, kSalinity, kDensity, kMassConc, kChl, kStress, kMassFlux,
		kArealMass, kAbsorption, kSlope, kAngle, kCauchy, kDiffusivity, kConcentration}
	for _, k := range kinds {
		var d0 dim
		for i, a := range k.allowed {
			u, ok := units[normUnit(a)]
			if !ok {
				t.Errorf("%s: unit %q not defined", k.name, a)
				continue
			}
			if i == 0 {
				d0 = u.d
			} else if u.d != d0 && k.name != kConcentration.name {
				t.Errorf("%s: %q has another dimension", k.name, a)
			}
		}
		if k.show != "" && !contains(k.allowed, k.show) {
			t.Errorf("%s: display unit %q not among allowed", k.name, k.show)
		}
	}
}
