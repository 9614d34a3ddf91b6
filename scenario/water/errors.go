package water

import (
	"fmt"
	"math"
)

// PerNM converts a spectral slope given per nanometre of wavelength into the
// per-metre value this package uses: 0.014*PerNM = 1.4e7 m⁻¹.
const PerNM = 1e9

// MilligramPerCubicMetre is 1 mg m⁻³ in kg m⁻³, the unit chlorophyll
// concentrations are usually quoted in.
const MilligramPerCubicMetre = 1e-6

// RangeError reports an input outside the range a routine is valid for.
type RangeError struct {
	Field    string  // name of the offending input
	Value    float64 // its value, in Unit
	Min, Max float64 // allowed closed range, in Unit
	Unit     string  // unit of Value, Min and Max
}

func (e *RangeError) Error() string {
	return fmt.Sprintf("water: %s = %g %s outside the allowed range [%g, %g] %s",
		e.Field, e.Value, e.Unit, e.Min, e.Max, e.Unit)
}

// checkRange returns a *RangeError unless lo ≤ v ≤ hi (NaN fails).
func checkRange(field string, v, lo, hi float64, unit string) error {
	if !(v >= lo && v <= hi) {
		return &RangeError{Field: field, Value: v, Min: lo, Max: hi, Unit: unit}
	}
	return nil
}

// checkWavelength checks a wavelength given in metres against [loNM, hiNM]
// nanometres and reports it in nanometres.
func checkWavelength(field string, lambda, loNM, hiNM float64) error {
	return checkRange(field, toNM(lambda), loNM, hiNM, "nm")
}

// toNM converts a wavelength in metres to nanometres, rounded to 1e-6 nm so
// that a wavelength written as 700e-9 lands exactly on the 700 nm node and
// range limits (not 700.0000000000001).
func toNM(lambda float64) float64 { return math.Round(lambda*1e15) / 1e6 }
