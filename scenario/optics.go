package scenario

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/floc/optics"
	"github.com/murk-optics/murk/mie/kernel"
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

// popOptics is one particle population with its kernel built.
type popOptics struct {
	spec  spec.Population
	table *kernel.Table
	// For spheres and cells: IOP per kg m⁻³ of the population's dry mass
	// (class-riding) or the IOP itself (uniform).
	iop     kernel.IOP
	uniform bool
	// Flocs.
	isFloc   bool
	flocIdx  int        // index in settling.flocs (−1 if its class is not floc-settling)
	model    floc.Model // the floc population's model
	d0       float64    // initial or fixed median diameter of floc mass, m
	dynamic  bool
	dryMass  []float64 // per bin, kg per floc at the bin's geometric centre
	primMass float64   // kg per primary particle
	// fixedMass is the dry mass concentration, kg m⁻³, of a floc
	// population with its own concentration (no sediment class).
	fixedMass float64
}

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

// kernelSpec is the grid shared by all kernels of a run.
func kernelSpec(s spec.Scenario, opt Options, w refindex.Medium, lo, hi float64) (kernel.Spec, error) {
	// s supplies the optics grid only.
	edges, err := kernel.LogEdges(lo, hi, s.Mixture.Optics.SizeBins)
	if err != nil {
		return kernel.Spec{}, err
	}
	return kernel.Spec{
		Edges:          edges,
		Wavelengths:    s.Mixture.Optics.Wavelengths,
		Angles:         s.Mixture.Optics.Angles,
		Medium:         w,
		SubStep:        opt.Kernel.SubStep,
		BackscatterX:   opt.Kernel.BackscatterX,
		BackscatterSub: opt.Kernel.BackscatterSub,
		Workers:        opt.Workers,
	}, nil
}

// buildPopulation builds the kernel of one population: the expensive,
// position-independent part of the optics, done once per run.
func buildPopulation(p spec.Population, s spec.Scenario, opt Options, w refindex.Medium, ref water.Medium) (*popOptics, error) {
	po := &popOptics{spec: p, flocIdx: -1}
	shape, lo, hi, err := sizeShape(p.Size)
	if err != nil {
		return nil, fmt.Errorf("population %q: %w", p.Name, err)
	}
	idx := indexModel(p.Index, w)
	if p.Kind == spec.KindFloc {
		return buildFloc(po, shape, s, opt, w, idx, ref)
	}
	lo, hi = max(lo, minKernelDiameter), min(hi, maxKernelDiameter)
	ks, err := kernelSpec(s, opt, w, lo, hi)
	if err != nil {
		return nil, fmt.Errorf("population %q: %w", p.Name, err)
	}
	pp := population.Population{Name: p.Name, Kind: popKind(p.Kind), Density: p.Density, Index: idx, Size: shape}
	if p.Kind == spec.KindPhytoplankton && p.Cell.Structure == spec.CellCoated {
		pp.Cell = &population.Cell{Core: idx, Shell: indexModel(p.Cell.Shell, w), CoreFraction: p.Cell.CoreFraction}
	}
	po.uniform = p.ClassIndex < 0
	if po.uniform {
		pp.Concentration = concentration(p.Concentration)
	} else {
		pp.Concentration = psd.Concentration{Basis: psd.ByMass, Value: 1} // per kg m⁻³
	}
	o, err := population.New(pp, ks)
	if err != nil {
		return nil, fmt.Errorf("population %q: %w", p.Name, err)
	}
	po.table = o.Table
	po.iop = o.Table.NewIOP()
	if err := o.IOP(&po.iop); err != nil {
		return nil, fmt.Errorf("population %q: %w", p.Name, err)
	}
	return po, nil
}

// buildFloc builds a floc kernel over floc diameter from the primary size
// to maxFlocDiameter. The aggregate optics method follows the scenario:
// "effective_medium" is package floc/optics' Composite (effective-medium
// sphere for extinction and absorption, with the angular distribution
// shared with the primaries: that package's default, because the pure
// porous sphere scatters almost nothing backward), "rdg" is FractalRDG
// with the Fisher–Burford structure factor.
func buildFloc(po *popOptics, shape psd.Distribution, s spec.Scenario, opt Options, w refindex.Medium, idx refindex.Model, ref water.Medium) (*popOptics, error) {
	p := po.spec
	po.isFloc = true
	po.dynamic = p.Floc.Dynamic
	m, d0, err := flocModel(p, shape)
	if err != nil {
		return nil, err
	}
	po.model, po.d0 = m, d0
	fr := m.Fractal

	var method optics.Method = optics.Composite{}
	if p.Floc.Optics == spec.FlocRDG {
		method = optics.FractalRDG{}
	}
	ks, err := kernelSpec(s, opt, w, fr.PrimaryDiameter, maxFlocDiameter)
	if err != nil {
		return nil, fmt.Errorf("population %q: %w", p.Name, err)
	}
	ks.SubStep = flocSubStep
	t, err := kernel.Build(optics.Evaluator{Method: method, Fractal: fr, Index: idx}, ks)
	if err != nil {
		return nil, fmt.Errorf("population %q: floc kernel: %w", p.Name, err)
	}
	po.table = t
	po.iop = t.NewIOP()
	rhoW, err := floc.WaterDensity(ref.Salinity, ref.TemperatureC)
	if err != nil {
		return nil, err
	}
	po.dryMass = make([]float64, t.NBins())
	for i := range po.dryMass {
		d := math.Sqrt(t.Edges[i] * t.Edges[i+1])
		a, err := fr.Aggregate(d, rhoW)
		if err != nil {
			return nil, fmt.Errorf("population %q: %w", p.Name, err)
		}
		po.dryMass[i] = a.DryMass
	}
	po.primMass = fr.PrimaryDensity * math.Pi / 6 * math.Pow(fr.PrimaryDiameter, 3)
	if p.ClassIndex < 0 {
		if err := po.setFixedMass(ref.Salinity); err != nil {
			return nil, err
		}
	}
	return po, nil
}

// flocModel returns the floc model of a floc population (package floc's
// defaults with the population's primary size, primary density and
// fractal dimension, and for a lognormal size distribution its width) and
// the initial median diameter of the floc mass (mass ∝ D^n_f) of its size
// distribution shape.
func flocModel(p spec.Population, shape psd.Distribution) (floc.Model, float64, error) {
	fr := floc.Fractal{PrimaryDiameter: p.Floc.PrimarySize, PrimaryDensity: p.Density, Dimension: p.Floc.FractalDimension}
	m := floc.DefaultModel
	m.Fractal = fr
	if p.Size.Kind == spec.SizeLognormal {
		m.Spread.LogWidth = math.Log(p.Size.GSD)
	}
	if err := m.Validate(); err != nil {
		return floc.Model{}, 0, fmt.Errorf("population %q: %w", p.Name, err)
	}
	d0, err := psd.MedianDiameter(shape, fr.Dimension, 0.5)
	if err != nil {
		return floc.Model{}, 0, fmt.Errorf("population %q: %w", p.Name, err)
	}
	return m, max(d0, fr.PrimaryDiameter), nil
}

// setFixedMass converts the own concentration of a floc population
// without a sediment class to dry mass, kg m⁻³. By number it counts flocs
// and loose primaries; by volume it counts the flocs' whole (porous)
// volume, πD³/6 per floc at the bin's geometric centre, for the size
// distribution at the initial median and salinity sal.
func (po *popOptics) setFixedMass(sal float64) error {
	c := po.spec.Concentration
	if c.Basis == spec.ByMass || c.Basis == "" {
		po.fixedMass = c.Value
		return nil
	}
	n := make([]float64, po.table.NBins())
	if err := po.flocNumbers(n, 1, po.d0, sal); err != nil {
		return err
	}
	per := 0.0 // amount per kg m⁻³ of dry mass
	e := po.table.Edges
	for i, v := range n {
		if c.Basis == spec.ByNumber {
			per += v
		} else {
			d := math.Sqrt(e[i] * e[i+1])
			if i == 0 {
				d = po.model.Fractal.PrimaryDiameter
			}
			per += v * math.Pi / 6 * d * d * d
		}
	}
	if !(per > 0) {
		return fmt.Errorf("population %q: cannot convert a %s concentration of flocs to mass", po.spec.Name, c.Basis)
	}
	po.fixedMass = c.Value / per
	return nil
}

// flocNumbers fills n with the number of flocs per kernel bin (m⁻³) for a
// floc mass concentration c (kg m⁻³), median diameter d (m) of the floc
// mass and salinity sal: the flocculated mass is spread over the bins by
// floc.Population.MassFraction and divided by the dry mass of a floc at
// the bin's geometric centre; the unflocculated primaries
// (Population.PrimaryFraction) are counted as single primaries in the
// first bin, which starts at the primary diameter.
func (po *popOptics) flocNumbers(n []float64, c, d, sal float64) error {
	pop, err := po.model.Population(max(d, po.model.Fractal.PrimaryDiameter), clampSalinity(sal))
	if err != nil {
		return err
	}
	e := po.table.Edges
	for i := range n {
		n[i] = c * pop.MassFraction(e[i], e[i+1]) / po.dryMass[i]
	}
	n[0] += c * pop.PrimaryFraction / po.primMass
	return nil
}
