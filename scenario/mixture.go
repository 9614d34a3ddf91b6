package scenario

import (
	"context"

	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/water"
)

// MixtureResult holds the IOP spectra of one water sample (a mixture
// document): water at the sample's salinity and temperature, CDOM and
// pigment at that salinity, and every population at its own concentration.
type MixtureResult struct {
	Mixture     spec.Mixture
	Wavelengths []float64
	Angles      []float64
	Components  []Component
	Spectra     *iop.Spectra // the components, on Wavelengths and Angles
}

// Mixture computes the IOP spectra of a water sample. Kernels are built in
// the sample's own water. Floc populations take their size distribution
// as given (no flow, so no kinetics) and need a mass concentration.
func Mixture(ctx context.Context, m spec.Mixture, opt Options) (*MixtureResult, error) {
	opt, err := opt.normalise()
	if err != nil {
		return nil, err
	}
	ref := water.Medium{Salinity: m.Water.Salinity, TemperatureC: m.Water.Temperature}
	plan, err := NewPlan(ctx, m, ref, defaultOceanSalinity, opt)
	if err != nil {
		return nil, err
	}
	w, err := plan.newWorker(opt)
	if err != nil {
		return nil, err
	}
	for i, po := range plan.populations {
		if po.isFloc {
			w.mass[i], w.flocD[i] = po.fixedMass, po.d0
		}
	}
	if err := w.fill(plan, m.Water.Salinity, m.Water.Temperature); err != nil {
		return nil, err
	}
	return &MixtureResult{Mixture: m, Wavelengths: plan.Wavelengths, Angles: plan.Angles, Components: plan.Components, Spectra: w.spectra}, nil
}

// defaultOceanSalinity closes a sample's CDOM and chlorophyll mixing lines
// when its water section gives no ocean salinity: 35 PSU, standard
// seawater (common practice).
const defaultOceanSalinity = 35
