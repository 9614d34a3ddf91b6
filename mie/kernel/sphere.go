package kernel

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie"
	"github.com/murk-optics/murk/mie/refindex"
)

// Sphere evaluates homogeneous spheres by Lorenz–Mie theory (package mie;
// Bohren & Huffman 1983, chapter 4) with the material index Index, made
// relative to the medium index of each Request. Validity: the mie package's
// domain, 1e-6 ≤ x ≤ 2e4 (D ≤ 500 µm at λ0 = 400 nm in water gives
// x ≈ 5300), relative index 0 < n, 0 ≤ k ≤ 10.
type Sphere struct {
	Index refindex.Model // absolute index of the particle material
}

// NewWorker implements Evaluator.
func (s Sphere) NewWorker() Worker { return &sphereWorker{index: s.Index} }

type sphereWorker struct {
	index  refindex.Model
	solver mie.Solver
	cache  indexCache
}

// indexCache holds the relative index for the last (wavelength, medium):
// a Build cell asks for one wavelength many times in a row.
type indexCache struct {
	lam, nm float64
	m       complex128
	err     error
}

func (c *indexCache) get(model refindex.Model, lam, nm float64) (complex128, error) {
	if lam != c.lam || nm != c.nm {
		c.lam, c.nm = lam, nm
		if model == nil {
			c.m, c.err = 0, fmt.Errorf("kernel: particle index model is nil")
		} else {
			c.m, c.err = refindex.InMedium(model, refindex.ConstantMedium(nm), lam)
		}
	}
	return c.m, c.err
}

// crossSections converts the solver's efficiencies for a particle of
// diameter d into s.
func crossSections(sv *mie.Solver, e mie.Efficiencies, r Request, s *Sample) {
	g := math.Pi * r.Diameter * r.Diameter / 4
	s.Cext, s.Csca, s.Cabs = e.Qext*g, e.Qsca*g, e.Qabs*g
	s.Cbb = 0
	if r.Backscatter {
		s.Cbb = sv.BackHemisphere() * g
	}
	if len(r.Mu) > 0 {
		// dCsca/dΩ = S11/k² is the VSF of one particle per m³.
		sv.VolumeScattering(r.Mu, 1, r.Wavelength, r.Medium, s.DCsca[:len(r.Mu)])
	}
}

func (w *sphereWorker) Eval(r Request, s *Sample) error {
	m, err := w.cache.get(w.index, r.Wavelength, r.Medium)
	if err != nil {
		return err
	}
	x := mie.SizeParameter(r.Diameter, r.Wavelength, r.Medium)
	e, err := w.solver.Sphere(x, m)
	if err != nil {
		return err
	}
	crossSections(&w.solver, e, r, s)
	return nil
}

// Coated evaluates concentric coated spheres (Aden & Kerker 1951, via package
// mie): a core of diameter CoreFraction·D and index Core inside a shell of
// index Shell. Phytoplankton cells are commonly modelled so (a low-index
// cytoplasm core in a denser, pigmented chloroplast layer). Same validity as
// Sphere; CoreFraction in [0, 1] (0: homogeneous shell material, 1:
// homogeneous core material).
type Coated struct {
	Core, Shell  refindex.Model // absolute indices of core and shell material
	CoreFraction float64        // core diameter / outer diameter, 0–1
}

// NewWorker implements Evaluator.
func (c Coated) NewWorker() Worker { return &coatedWorker{c: c} }

type coatedWorker struct {
	c           Coated
	solver      mie.Solver
	core, shell indexCache
}

func (w *coatedWorker) Eval(r Request, s *Sample) error {
	f := w.c.CoreFraction
	if !(f >= 0 && f <= 1) {
		return fmt.Errorf("kernel: Coated.CoreFraction = %g, want 0 ≤ f ≤ 1", f)
	}
	mc, err := w.core.get(w.c.Core, r.Wavelength, r.Medium)
	if err != nil {
		return fmt.Errorf("core: %w", err)
	}
	ms, err := w.shell.get(w.c.Shell, r.Wavelength, r.Medium)
	if err != nil {
		return fmt.Errorf("shell: %w", err)
	}
	x := mie.SizeParameter(r.Diameter, r.Wavelength, r.Medium)
	e, err := w.solver.Coated(f*x, x, mc, ms)
	if err != nil {
		return err
	}
	crossSections(&w.solver, e, r, s)
	return nil
}
