package scenario

import (
	"context"
	"fmt"

	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
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
	so := m.Water.OceanSalinity
	if so <= 0 {
		so = 35
	}
	// A scenario wrapper so that the run's code serves the sample.
	s := spec.Scenario{Mixture: m}
	s.Estuary.Ocean.Salinity = so
	ref := water.Medium{Salinity: m.Water.Salinity, TemperatureC: m.Water.Temperature}
	pops, err := buildPopulations(ctx, s, opt, ref, func(string, ...any) {})
	if err != nil {
		return nil, err
	}
	r := &Result{Scenario: s, Wavelengths: m.Optics.Wavelengths, Angles: m.Optics.Angles}
	r.Components = components(r.Scenario)
	w, err := r.newWorker(pops, opt)
	if err != nil {
		return nil, err
	}
	for i, po := range pops {
		if po.isFloc {
			w.mass[i], w.flocD[i] = po.fixedMass, po.d0
		}
	}
	if err := w.fill(r, pops, m.Water.Salinity, m.Water.Temperature); err != nil {
		return nil, err
	}
	return &MixtureResult{Mixture: m, Wavelengths: r.Wavelengths, Angles: r.Angles, Components: r.Components, Spectra: w.spectra}, nil
}

// Table returns one row per wavelength: each component's a (and b, b_b
// for water and particles), the totals, c and b_b/b.
func (mr *MixtureResult) Table() *table.Table {
	sp := mr.Spectra
	t := &table.Table{Title: fmt.Sprintf("IOP spectra of the sample (salinity %g, %g °C)", mr.Mixture.Water.Salinity, mr.Mixture.Water.Temperature)}
	t.Columns = append([]table.Column{{Name: "wavelength", Unit: "nm"}}, spectrumColumns(mr.Components)...)
	for w, lam := range mr.Wavelengths {
		t.Add(spectrumRow([]any{lam * 1e9}, mr.Components, func(q iop.Quantity, k int) float64 { return sp.Components[k].Value(q, w) })...)
	}
	return t
}
