package scenario

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie/population"
	"github.com/murk-optics/murk/mie/psd"
	"github.com/murk-optics/murk/mie/refindex"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/water"
)

// Size-range choices for the optical kernels.
const (
	// lognormalSpan: a lognormal kernel runs from the count median / σg³
	// to the volume median × σg³, so that 99.87 % of both number and
	// volume lie inside (three geometric standard deviations).
	lognormalSpan = 3
	// minKernelDiameter and maxKernelDiameter clamp every sphere kernel,
	// m: below 0.05 µm particles are Rayleigh scatterers that add nothing
	// visible at the concentrations of natural water; 500 µm is the
	// largest sphere the kernel package is documented for at 400 nm in
	// water (x ≈ 5300).
	minKernelDiameter = 0.05e-6
	maxKernelDiameter = 500e-6
	// maxFlocDiameter is the top of a floc kernel, m: flocs reach a few
	// hundred µm to about 1 mm in estuaries (common practice); the
	// Kolmogorov cap keeps them below 1.5 mm for G ≥ 0.5 s⁻¹.
	maxFlocDiameter = 1.5e-3
	// flocSubStep makes the kernel builder use its minimum of sub-points
	// per bin: floc cross-sections have no Mie ripple in floc size (package
	// floc/optics, Evaluator).
	flocSubStep = 1e9
)

// referenceWater is the water in which every kernel is built: mid-estuary
// salinity and the mean of river and ocean temperatures. Particle indices
// given relative to water keep their relative value exactly (refindex.
// Relative); only the size parameter x = πD·n_w/λ0 moves, by at most 0.4 %
// between fresh and ocean water (Quan & Fry 1995), which a kernel bin
// average does not resolve. Building one kernel per salinity would
// multiply the cost of the expensive part for no visible change.
func referenceWater(s spec.Scenario) water.Medium {
	e := s.Estuary
	return water.Medium{
		Salinity:     e.Ocean.Salinity / 2,
		TemperatureC: (e.River.Temperature + e.Ocean.Temperature) / 2,
	}
}

func indexModel(r spec.RefractiveIndex, w refindex.Medium) refindex.Model {
	var m refindex.Model
	switch r.Model {
	case spec.IndexTable:
		m = refindex.Table{Wavelengths: r.Wavelengths, N: r.NTable, K: r.KTable}
	case spec.IndexSmooth:
		m = refindex.Smooth{Ref: r.WavelengthRef, N: r.N, B: r.CauchyB, K: r.KRef, S: r.KSlope, KFloor: r.KFloor}
	default:
		m = refindex.Constant{N: r.N, K: r.K}
	}
	if r.RelativeTo != spec.RelativeToVacuum {
		m = refindex.Relative{Rel: m, Water: w}
	}
	return m
}

// sizeShape returns the population's size distribution shape (arbitrary
// normalisation) and the diameter range its kernel covers.
func sizeShape(sd spec.SizeDistribution) (psd.Distribution, float64, float64, error) {
	switch sd.Kind {
	case spec.SizeJunge:
		d := psd.PowerLaw{N: 1, Slope: sd.Slope, Min: sd.DMin, Max: sd.DMax}
		return d, sd.DMin, sd.DMax, nil
	case spec.SizeLognormal:
		var d psd.Lognormal
		if sd.By == spec.ByNumber {
			d = psd.Lognormal{N: 1, Median: sd.Median, GSD: sd.GSD}
		} else {
			var err error
			// By volume or mass: for particles of one density the mass
			// distribution is the volume distribution.
			if d, err = psd.LognormalByVolume(1, sd.Median, sd.GSD); err != nil {
				return nil, 0, 0, err
			}
		}
		f := math.Pow(sd.GSD, lognormalSpan)
		vmd := d.Median * math.Exp(3*math.Pow(math.Log(sd.GSD), 2))
		return d, d.Median / f, vmd * f, nil
	case spec.SizeTable:
		b, err := psd.ReadCSVFile(sd.CSV)
		if err != nil {
			return nil, 0, 0, err
		}
		lo, hi := b.Range()
		return b, lo, hi, nil
	}
	return nil, 0, 0, fmt.Errorf("scenario: unknown size distribution kind %q", sd.Kind)
}

func popKind(k spec.PopulationKind) population.Kind {
	switch k {
	case spec.KindOrganic:
		return population.Detritus
	case spec.KindPhytoplankton:
		return population.Phytoplankton
	}
	return population.Mineral
}

func concentration(c spec.Concentration) psd.Concentration {
	switch c.Basis {
	case spec.ByNumber:
		return psd.Concentration{Basis: psd.ByNumber, Value: c.Value}
	case spec.ByVolume:
		return psd.Concentration{Basis: psd.ByVolume, Value: c.Value}
	}
	return psd.Concentration{Basis: psd.ByMass, Value: c.Value}
}
