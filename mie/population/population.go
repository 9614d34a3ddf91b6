package population

import (
	"errors"
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/psd"
	"github.com/murk-optics/murk/mie/refindex"
)

// Kind is the type of particle.
type Kind int

const (
	Mineral       Kind = iota + 1 // mineral grains (clays, quartz, carbonates)
	Detritus                      // non-living organic particles
	Phytoplankton                 // living algal cells
)

func (k Kind) String() string {
	switch k {
	case Mineral:
		return "mineral"
	case Detritus:
		return "detritus"
	case Phytoplankton:
		return "phytoplankton"
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// ParseKind converts "mineral", "detritus" or "phytoplankton" to a Kind.
func ParseKind(s string) (Kind, error) {
	for _, k := range []Kind{Mineral, Detritus, Phytoplankton} {
		if s == k.String() {
			return k, nil
		}
	}
	return 0, fmt.Errorf("population: kind %q unknown, want mineral, detritus or phytoplankton", s)
}

// Cell is a coated-sphere particle: a core of diameter CoreFraction·D inside
// a shell. Used for phytoplankton (a low-index cytoplasm in a pigmented,
// denser chloroplast layer).
type Cell struct {
	Core, Shell  refindex.Model // absolute indices (use refindex.Relative for values quoted relative to water)
	CoreFraction float64        // core diameter / cell diameter, 0–1
}

// Population is one kind of suspended particles.
type Population struct {
	Name string
	Kind Kind
	// Density is the apparent particle density: dry mass per particle
	// volume (including internal water), kg m⁻³, > 0. Used to convert
	// between volume and mass.
	Density float64
	// Index is the absolute index of homogeneous particles. Ignored when
	// Cell is set.
	Index refindex.Model
	// Cell, if set, makes the particles coated spheres.
	Cell *Cell
	// Size is the size distribution; its own normalisation is replaced by
	// Concentration.
	Size psd.Distribution
	// Concentration is the amount in the water (mass, volume, area or
	// number).
	Concentration psd.Concentration
}

// Validate checks every field and names the offending one.
func (p Population) Validate() error {
	if p.Kind < Mineral || p.Kind > Phytoplankton {
		return fmt.Errorf("population %q: Kind = %d unknown, want mineral, detritus or phytoplankton", p.Name, int(p.Kind))
	}
	if !(p.Density > 0) || math.IsInf(p.Density, 0) {
		return fmt.Errorf("population %q: Density = %g kg m-3, want a finite value > 0 kg m-3", p.Name, p.Density)
	}
	if p.Cell == nil && p.Index == nil {
		return fmt.Errorf("population %q: neither Index nor Cell is set", p.Name)
	}
	if p.Cell != nil {
		if p.Cell.Core == nil || p.Cell.Shell == nil {
			return fmt.Errorf("population %q: Cell needs Core and Shell indices", p.Name)
		}
		if !(p.Cell.CoreFraction >= 0 && p.Cell.CoreFraction <= 1) {
			return fmt.Errorf("population %q: Cell.CoreFraction = %g, want 0 ≤ f ≤ 1", p.Name, p.Cell.CoreFraction)
		}
	}
	if err := psd.Check(p.Size); err != nil {
		return fmt.Errorf("population %q: Size: %w", p.Name, err)
	}
	if err := p.Concentration.Validate(); err != nil {
		return fmt.Errorf("population %q: Concentration: %w", p.Name, err)
	}
	return nil
}

// Evaluator returns the single-particle optics model of p.
func (p Population) Evaluator() kernel.Evaluator {
	if p.Cell != nil {
		return kernel.Coated{Core: p.Cell.Core, Shell: p.Cell.Shell, CoreFraction: p.Cell.CoreFraction}
	}
	return kernel.Sphere{Index: p.Index}
}

// Distribution returns p's size distribution normalised to its
// concentration.
func (p Population) Distribution() (psd.Scaled, error) {
	if err := p.Validate(); err != nil {
		return psd.Scaled{}, err
	}
	if p.Concentration.Value == 0 {
		return psd.Scaled{Of: p.Size, Factor: 0}, nil
	}
	d, err := psd.Normalize(p.Size, p.Concentration, p.Density)
	if err != nil {
		return psd.Scaled{}, fmt.Errorf("population %q: %w", p.Name, err)
	}
	return d, nil
}

// Optics is a population with its kernel built: IOPs for any concentration
// and size distribution on the kernel's grid, cheaply.
type Optics struct {
	Population Population
	Table      *kernel.Table
	numbers    []float64 // per-bin number concentration, m⁻³
	mass       float64   // kg m⁻³ of the particles on the grid
	covered    float64   // share of the population's volume inside the grid
}

// New validates p, builds its kernel over spec (the population's evaluator
// is used; spec carries the grid, wavelengths, angles and medium) and
// computes the number per bin.
func New(p Population, spec kernel.Spec) (*Optics, error) {
	if err := p.Validate(); err != nil {
		return nil, err
	}
	t, err := kernel.Build(p.Evaluator(), spec)
	if err != nil {
		return nil, fmt.Errorf("population %q: %w", p.Name, err)
	}
	return FromTable(p, t)
}

// FromTable attaches an already built table (one per optical model can
// serve several populations of the same material).
func FromTable(p Population, t *kernel.Table) (*Optics, error) {
	if t == nil {
		return nil, errors.New("population: table is nil")
	}
	o := &Optics{Population: p, Table: t, numbers: make([]float64, t.NBins())}
	if err := o.SetDistribution(p.Size); err != nil {
		return nil, err
	}
	return o, nil
}

// SetDistribution replaces the size distribution shape (normalised to the
// current concentration) and recomputes the bin numbers: 200 bins of a
// log-normal cost about 60 µs and three small allocations (interface
// values), independent of the number of wavelengths.
func (o *Optics) SetDistribution(d psd.Distribution) error {
	p := o.Population
	p.Size = d
	dist, err := p.Distribution()
	if err != nil {
		return err
	}
	psd.BinNumbers(dist, o.Table.Edges, o.numbers)
	e := o.Table.Edges
	inside := math.Pi / 6 * psd.PartialMoment(dist, 3, e[0], e[len(e)-1])
	total, _ := psd.Amount(dist, psd.ByVolume, 0)
	o.covered = 1
	if total > 0 {
		o.covered = inside / total
	}
	o.mass = p.Density * inside
	o.Population = p
	return nil
}

// SetConcentration rescales the population to c without changing its shape
// or rebuilding anything.
func (o *Optics) SetConcentration(c psd.Concentration) error {
	p := o.Population
	p.Concentration = c
	if err := p.Validate(); err != nil {
		return err
	}
	old := o.Population
	o.Population = p
	if err := o.SetDistribution(p.Size); err != nil {
		o.Population = old
		return err
	}
	return nil
}

// Numbers returns the number concentration per kernel bin (m⁻³); do not
// modify.
func (o *Optics) Numbers() []float64 { return o.numbers }

// Mass returns the dry mass concentration of the particles inside the
// kernel's size range, kg m⁻³.
func (o *Optics) Mass() float64 { return o.mass }

// Coverage returns the share (0–1) of the population's particle volume that
// lies inside the kernel's size range; the rest is not seen by IOP.
func (o *Optics) Coverage() float64 { return o.covered }

// IOP fills dst (from o.Table.NewIOP) with the population's bulk IOPs.
func (o *Optics) IOP(dst *kernel.IOP) error { return o.Table.Evaluate(o.numbers, dst) }

// MassSpecific holds IOPs per unit dry mass concentration, m² kg⁻¹ (VSF
// m² kg⁻¹ sr⁻¹), per wavelength.
type MassSpecific struct {
	A, B, Bb, C []float64
}

// PerMass divides iop by the mass concentration (kg m⁻³, > 0).
func PerMass(iop kernel.IOP, mass float64) (MassSpecific, error) {
	if !(mass > 0) || math.IsInf(mass, 0) {
		return MassSpecific{}, fmt.Errorf("population: mass concentration = %g kg m-3, want > 0 for mass-specific IOPs", mass)
	}
	div := func(v []float64) []float64 {
		o := make([]float64, len(v))
		for i, x := range v {
			o[i] = x / mass
		}
		return o
	}
	return MassSpecific{A: div(iop.A), B: div(iop.B), Bb: div(iop.Bb), C: div(iop.C)}, nil
}

// Sum fills dst with the total IOPs of several populations in one water
// (their IOPs add). All tables must share wavelengths and angles.
func Sum(dst *kernel.IOP, scratch *kernel.IOP, parts ...*Optics) error {
	for _, v := range [][]float64{dst.A, dst.B, dst.Bb, dst.C, dst.VSF} {
		for i := range v {
			v[i] = 0
		}
	}
	for k, o := range parts {
		if k > 0 && !sameAxes(parts[0].Table, o.Table) {
			return fmt.Errorf("population: %q and %q have kernels on different wavelengths or angles", parts[0].Population.Name, o.Population.Name)
		}
		if err := o.IOP(scratch); err != nil {
			return err
		}
		dst.Add(*scratch)
	}
	return nil
}

func sameAxes(a, b *kernel.Table) bool {
	if len(a.Wavelengths) != len(b.Wavelengths) || len(a.Angles) != len(b.Angles) {
		return false
	}
	for i := range a.Wavelengths {
		if a.Wavelengths[i] != b.Wavelengths[i] {
			return false
		}
	}
	for i := range a.Angles {
		if a.Angles[i] != b.Angles[i] {
			return false
		}
	}
	return true
}
