package scenario

import (
	"context"
	"fmt"
	"math"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/floc/optics"
	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/population"
	"github.com/murk-optics/murk/mie/psd"
	"github.com/murk-optics/murk/mie/refindex"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/sensing"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/water"
)

// Plan is stage 2 of the pipeline, the optics plan: everything about the
// optics that does not depend on where or when. It holds the water and
// dissolved-matter models, every particle population with its size
// distribution, index model and (for flocs) floc model, and the kernel of
// every population over its size grid, the optics wavelengths and the VSF
// angles. Each is built exactly once; a Plan is read-only after NewPlan and
// is shared by Run, Mixture and every workflow that evaluates optics at many
// points (baseline and works runs, sensor candidates, bench members).
type Plan struct {
	Mixture     spec.Mixture
	Wavelengths []float64 // vacuum wavelength, m
	Angles      []float64 // scattering angles, rad
	// Reference is the water every kernel is built in (see
	// referenceWater).
	Reference water.Medium
	// OceanSalinity is the salinity of the ocean end member of the CDOM
	// and chlorophyll mixing lines, PSU.
	OceanSalinity float64
	// Components are the separable contributions to the IOPs: water,
	// CDOM, pigment (when it applies) and every population in document
	// order.
	Components []Component
	// Instruments are the simulated sensors of the mixture's optics
	// section; Angles holds every angle they need.
	Instruments []sensing.Instrument

	populations []*popOptics
	workers     int
}

// popOptics is one particle population of the plan: its models, and its
// kernel once the plan is built.
type popOptics struct {
	spec  spec.Population
	shape psd.Distribution
	lo    float64 // kernel diameter range, m
	hi    float64
	index refindex.Model
	table *kernel.Table
	// For spheres and cells: IOP per kg m⁻³ of the population's dry mass
	// (class-riding) or the IOP itself (uniform).
	iop     kernel.IOP
	uniform bool
	// Flocs.
	isFloc   bool
	model    floc.Model // the floc population's model
	d0       float64    // initial or fixed median diameter of floc mass, m
	dryMass  []float64  // per bin, kg per floc at the bin's geometric centre
	primMass float64    // kg per primary particle
	// fixedMass is the dry mass concentration, kg m⁻³, of a floc
	// population with its own concentration (no sediment class).
	fixedMass float64
}

// NewPlan builds the optics plan of mixture m with kernels in the reference
// water ref; oceanSalinity (PSU) closes the CDOM and chlorophyll mixing
// lines when the mixture's water section does not set one. It honours ctx
// between populations.
func NewPlan(ctx context.Context, m spec.Mixture, ref water.Medium, oceanSalinity float64, opt Options) (*Plan, error) {
	opt, err := opt.normalise()
	if err != nil {
		return nil, err
	}
	p, err := preparePlan(m, ref, oceanSalinity, opt)
	if err != nil {
		return nil, err
	}
	if err := p.build(ctx, opt, func(string, ...any) {}); err != nil {
		return nil, err
	}
	return p, nil
}

// preparePlan sets up the plan's models, the cheap part: size
// distributions, index models and floc models, but no kernel yet. The
// estuary run needs the floc models while the kernels are built.
func preparePlan(m spec.Mixture, ref water.Medium, oceanSalinity float64, opt Options) (*Plan, error) {
	wref, err := ref.IndexFunc()
	if err != nil {
		return nil, err
	}
	ins, err := sensing.FromSpecs(m.Optics.Instruments)
	if err != nil {
		return nil, err
	}
	m.Optics.Angles = sensing.NeededAngles(m.Optics.Angles, ins)
	p := &Plan{
		Mixture: m, Wavelengths: m.Optics.Wavelengths, Angles: m.Optics.Angles, Instruments: ins,
		Reference: ref, OceanSalinity: m.Water.OceanSalinity, workers: opt.Workers,
	}
	if p.OceanSalinity <= 0 {
		p.OceanSalinity = oceanSalinity
	}
	p.Components = components(p.Mixture)
	for _, sp := range m.Populations {
		po, err := preparePopulation(sp, wref)
		if err != nil {
			return nil, err
		}
		p.populations = append(p.populations, po)
	}
	return p, nil
}

// preparePopulation sets up one population's models.
func preparePopulation(p spec.Population, w refindex.Medium) (*popOptics, error) {
	shape, lo, hi, err := sizeShape(p.Size)
	if err != nil {
		return nil, fmt.Errorf("population %q: %w", p.Name, err)
	}
	po := &popOptics{spec: p, shape: shape, lo: lo, hi: hi, index: indexModel(p.Index, w), uniform: p.ClassIndex < 0}
	if p.Kind == spec.KindFloc {
		po.isFloc = true
		if po.model, po.d0, err = flocModel(p, shape); err != nil {
			return nil, err
		}
	}
	return po, nil
}

// flocModelOf returns the floc model of the first floc population riding
// on sediment class k, or ok false when none does.
func (p *Plan) flocModelOf(k int) (po *popOptics, ok bool) {
	for _, po := range p.populations {
		if po.isFloc && po.spec.ClassIndex == k {
			return po, true
		}
	}
	return nil, false
}

// build builds the kernel of every population: the expensive,
// position-independent part of the optics, once per plan.
func (p *Plan) build(ctx context.Context, opt Options, progress func(string, ...any)) error {
	wref, err := p.Reference.IndexFunc()
	if err != nil {
		return err
	}
	for _, po := range p.populations {
		if err := ctx.Err(); err != nil {
			return err
		}
		if err := p.buildPopulation(po, opt, wref); err != nil {
			return err
		}
		progress("  kernel %q: %d bins", po.spec.Name, po.table.NBins())
	}
	return nil
}

// kernelSpec is the grid shared by all kernels of a plan.
func (p *Plan) kernelSpec(opt Options, w refindex.Medium, lo, hi float64) (kernel.Spec, error) {
	edges, err := kernel.LogEdges(lo, hi, p.Mixture.Optics.SizeBins)
	if err != nil {
		return kernel.Spec{}, err
	}
	return kernel.Spec{
		Edges:          edges,
		Wavelengths:    p.Wavelengths,
		Angles:         p.Angles,
		Medium:         w,
		SubStep:        opt.Kernel.SubStep,
		BackscatterX:   opt.Kernel.BackscatterX,
		BackscatterSub: opt.Kernel.BackscatterSub,
		Workers:        opt.Workers,
	}, nil
}

// buildPopulation builds the kernel of one population.
func (p *Plan) buildPopulation(po *popOptics, opt Options, w refindex.Medium) error {
	sp := po.spec
	if po.isFloc {
		return p.buildFloc(po, opt, w)
	}
	lo, hi := max(po.lo, minKernelDiameter), min(po.hi, maxKernelDiameter)
	ks, err := p.kernelSpec(opt, w, lo, hi)
	if err != nil {
		return fmt.Errorf("population %q: %w", sp.Name, err)
	}
	pp := population.Population{Name: sp.Name, Kind: popKind(sp.Kind), Density: sp.Density, Index: po.index, Size: po.shape}
	if sp.Kind == spec.KindPhytoplankton && sp.Cell.Structure == spec.CellCoated {
		pp.Cell = &population.Cell{Core: po.index, Shell: indexModel(sp.Cell.Shell, w), CoreFraction: sp.Cell.CoreFraction}
	}
	if po.uniform {
		pp.Concentration = concentration(sp.Concentration)
	} else {
		pp.Concentration = psd.Concentration{Basis: psd.ByMass, Value: 1} // per kg m⁻³
	}
	o, err := population.New(pp, ks)
	if err != nil {
		return fmt.Errorf("population %q: %w", sp.Name, err)
	}
	po.table = o.Table
	po.iop = o.Table.NewIOP()
	if err := o.IOP(&po.iop); err != nil {
		return fmt.Errorf("population %q: %w", sp.Name, err)
	}
	return nil
}

// buildFloc builds a floc kernel over floc diameter from the primary size
// to maxFlocDiameter. The aggregate optics method follows the scenario:
// "effective_medium" is package floc/optics' Composite (effective-medium
// sphere for extinction and absorption, with the angular distribution
// shared with the primaries: that package's default, because the pure
// porous sphere scatters almost nothing backward), "rdg" is FractalRDG
// with the Fisher–Burford structure factor.
func (p *Plan) buildFloc(po *popOptics, opt Options, w refindex.Medium) error {
	sp := po.spec
	fr := po.model.Fractal
	var method optics.Method = optics.Composite{}
	if sp.Floc.Optics == spec.FlocRDG {
		method = optics.FractalRDG{}
	}
	ks, err := p.kernelSpec(opt, w, fr.PrimaryDiameter, maxFlocDiameter)
	if err != nil {
		return fmt.Errorf("population %q: %w", sp.Name, err)
	}
	ks.SubStep = flocSubStep
	t, err := kernel.Build(optics.Evaluator{Method: method, Fractal: fr, Index: po.index}, ks)
	if err != nil {
		return fmt.Errorf("population %q: floc kernel: %w", sp.Name, err)
	}
	po.table = t
	po.iop = t.NewIOP()
	rhoW, err := floc.WaterDensity(p.Reference.Salinity, p.Reference.TemperatureC)
	if err != nil {
		return err
	}
	po.dryMass = make([]float64, t.NBins())
	for i := range po.dryMass {
		d := math.Sqrt(t.Edges[i] * t.Edges[i+1])
		a, err := fr.Aggregate(d, rhoW)
		if err != nil {
			return fmt.Errorf("population %q: %w", sp.Name, err)
		}
		po.dryMass[i] = a.DryMass
	}
	po.primMass = fr.PrimaryDensity * math.Pi / 6 * math.Pow(fr.PrimaryDiameter, 3)
	if sp.ClassIndex < 0 {
		return po.setFixedMass(p.Reference.Salinity)
	}
	return nil
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

// components lists the separable components of mixture m: water, CDOM,
// pigment (if it applies) and every population, in the population order.
// The populations refer to m's own slice.
func components(m spec.Mixture) []Component {
	c := []Component{{Name: "water", Kind: iop.Water}, {Name: "cdom", Kind: iop.Dissolved}}
	if pigmentApplies(m) {
		c = append(c, Component{Name: "pigment", Kind: iop.Pigment})
	}
	for i := range m.Populations {
		c = append(c, Component{Name: m.Populations[i].Name, Kind: iop.Particles, Population: &m.Populations[i]})
	}
	return c
}

// pigmentApplies: chlorophyll absorbs as a separate pigment component only
// when no phytoplankton population is modelled as particles, whose own
// absorption already holds the pigment (package iop, AddPigment).
func pigmentApplies(m spec.Mixture) bool {
	c := m.Water.Chlorophyll
	if c.River <= 0 && c.Ocean <= 0 {
		return false
	}
	for _, p := range m.Populations {
		if p.Kind == spec.KindPhytoplankton {
			return false
		}
	}
	return true
}
