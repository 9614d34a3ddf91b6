package optics

import (
	"errors"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/refindex"
)

// Evaluator adapts a Method to the kernel tables of package mie/kernel, so
// that floc kernels use the same table type, bin averaging and
// deterministic parallel builder as the sphere kernels:
//
//	t, err := kernel.Build(optics.Evaluator{Method: optics.Composite{}, Fractal: f, Index: mineral}, spec)
//
// The table's size grid is then over floc diameter and its cross-sections
// are per floc; divide by Fractal.Aggregate(D).DryMass for values per unit
// mass. The grid must start at or above the primary diameter.
//
// Sub-points: flocs larger than a few primaries have no Mie ripple in floc
// size (the porous sphere's index is within about 10⁻² of water's), so a
// modest Spec.MaxSub such as 16 suffices (see the package documentation);
// the sphere default of 2048 would cost a hundred times more for no gain.
type Evaluator struct {
	Method  Method       // nil means Composite{}
	Fractal floc.Fractal // structure of the flocs
	Index   refindex.Model
}

// NewWorker implements kernel.Evaluator.
func (e Evaluator) NewWorker() kernel.Worker {
	m := e.Method
	if m == nil {
		m = Composite{}
	}
	return &worker{method: m, fractal: e.Fractal, index: e.Index}
}

type worker struct {
	method  Method
	fractal floc.Fractal
	index   refindex.Model
	ws      Workspace
}

// Eval implements kernel.Worker.
func (w *worker) Eval(r kernel.Request, s *kernel.Sample) error {
	if w.index == nil {
		return errors.New("optics: Evaluator.Index is nil")
	}
	abs, err := w.index.Index(r.Wavelength)
	if err != nil {
		return err
	}
	m := abs / complex(r.Medium, 0)
	if err := refindex.Check("primary index relative to the medium", m); err != nil {
		return err
	}
	p := Problem{Fractal: w.fractal, Diameter: r.Diameter, Wavelength: r.Wavelength, MediumIndex: r.Medium, Index: m, NoBackscatter: !r.Backscatter}
	cs, err := w.method.Evaluate(&w.ws, p, r.Mu, s.DCsca[:len(r.Mu)])
	if err != nil {
		return err
	}
	s.Cext, s.Csca, s.Cabs, s.Cbb = cs.Extinction, cs.Scattering, cs.Absorption, cs.Backscattering
	return nil
}
