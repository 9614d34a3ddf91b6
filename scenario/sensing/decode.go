package sensing

import (
	"fmt"
	"slices"

	"github.com/murk-optics/murk/scenario/spec"
)

// FromSpec returns the instrument a scenario's instrument entry describes.
// It is the one place that switches over instrument kinds.
func FromSpec(in spec.Instrument) (Instrument, error) {
	switch in.Kind {
	case spec.Transmissometer:
		return Transmissometer{Name: in.Name, Wavelength: in.Wavelength, PathLength: in.PathLength, AcceptanceHalfAngle: in.AcceptanceAngle / 2}, nil
	case spec.Backscatter:
		return Backscatter{Name: in.Name, Wavelength: in.Wavelength, Angle: in.Angle}, nil
	case spec.Turbidity:
		return Turbidimeter{Name: in.Name}, nil
	}
	return nil, fmt.Errorf("instrument %q: unknown kind %q", in.Name, in.Kind)
}

// FromSpecs returns the instruments of a scenario in document order.
func FromSpecs(ins []spec.Instrument) ([]Instrument, error) {
	out := make([]Instrument, 0, len(ins))
	for _, in := range ins {
		i, err := FromSpec(in)
		if err != nil {
			return nil, err
		}
		out = append(out, i)
	}
	return out, nil
}

// NeededAngles returns the VSF angle grid extended so that every
// instrument's angles lie inside it: an angle below the first or above the
// last grid angle is added to the grid; angles inside the grid's range are
// interpolated between its nodes and add nothing. The result is sorted and
// shares no memory with grid.
func NeededAngles(grid []float64, ins []Instrument) []float64 {
	out := slices.Clone(grid)
	for _, in := range ins {
		for _, a := range in.Angles() {
			if len(out) == 0 || a < out[0]-angleTol || a > out[len(out)-1]+angleTol {
				out = append(out, a)
				slices.Sort(out)
			}
		}
	}
	return out
}

// angleTol is the tolerance below which an instrument angle counts as on a
// grid end, rad (1e-12: round-off of a degree-to-radian conversion).
const angleTol = 1e-12
