package optics

import (
	"fmt"
	"strings"
)

// MassSpecific holds cross-sections per unit dry mass of a floc, m² kg⁻¹:
// the inherent optical properties of a suspension of 1 kg m⁻³ of such flocs.
type MassSpecific struct {
	Attenuation, Scattering, Absorption, Backscattering float64
}

// PerMass divides the cross-sections by the floc's dry mass (kg), for
// example floc.Aggregate.DryMass. dryMass must be positive.
func (cs CrossSections) PerMass(dryMass float64) (MassSpecific, error) {
	if !(dryMass > 0) {
		return MassSpecific{}, fmt.Errorf("optics: dry mass = %g kg, want > 0 kg", dryMass)
	}
	return MassSpecific{cs.Extinction / dryMass, cs.Scattering / dryMass, cs.Absorption / dryMass, cs.Backscattering / dryMass}, nil
}

// MethodNames lists the names ParseMethod accepts, default first.
var MethodNames = []string{
	"composite",
	"rdg-fisher-burford", "rdg-dobbins-megaridis", "rdg-exponential",
	"effective-medium-maxwell-garnett", "effective-medium-volume-average",
}

// ParseMethod returns the method named by one of MethodNames, or the short
// forms "rdg" (Fisher–Burford) and "effective-medium" (Maxwell Garnett).
func ParseMethod(name string) (Method, error) {
	switch name {
	case "composite":
		return Composite{}, nil
	case "rdg", "rdg-fisher-burford":
		return FractalRDG{Structure: FisherBurford}, nil
	case "rdg-dobbins-megaridis":
		return FractalRDG{Structure: DobbinsMegaridis}, nil
	case "rdg-exponential":
		return FractalRDG{Structure: ExponentialCutoff}, nil
	case "effective-medium", "effective-medium-maxwell-garnett":
		return EffectiveMedium{Rule: MaxwellGarnett}, nil
	case "effective-medium-volume-average":
		return EffectiveMedium{Rule: VolumeAverage}, nil
	}
	return nil, fmt.Errorf("optics: unknown method %q (allowed: %s, rdg, effective-medium)", name, strings.Join(MethodNames, ", "))
}
