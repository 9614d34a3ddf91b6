package optics

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/mie"
)

// Problem is one floc at one wavelength.
type Problem struct {
	Fractal     floc.Fractal // structure of the aggregate (primary size, fractal dimension)
	Diameter    float64      // floc diameter D, m; at least Fractal.PrimaryDiameter
	Wavelength  float64      // vacuum wavelength λ0, m; allowed [1e-7, 1e-5]
	MediumIndex float64      // real refractive index of the water at λ0; allowed [1, 2]
	// Index is the complex index of the primary material RELATIVE to the
	// water, m = n + ik with k ≥ 0 absorbing (Bohren & Huffman 1983
	// convention, as in package mie).
	Index complex128
	// NoBackscatter skips the hemispherical backscattering cross-section
	// where it is costly (the effective-medium method at large size
	// parameter); Backscattering is then 0.
	NoBackscatter bool
}

// CrossSections is the optical response of one floc.
type CrossSections struct {
	Extinction     float64 // C_ext, m²
	Scattering     float64 // C_sca, m²
	Absorption     float64 // C_abs, m²
	Backscattering float64 // C_bb, power scattered into 90°–180° per unit irradiance, m²
	Asymmetry      float64 // ⟨cos θ⟩, 1
	// PhaseShift is ρ = 2x|m_v − 1| of the whole floc, with x = πD·n_w/λ0
	// and m_v = 1 + φ(m − 1) the volume-averaged index: the phase delay of
	// a ray through the floc's centre. RDG-type methods assume ρ ≪ 1; the
	// value is returned so callers can flag results beyond a method's
	// validity.
	PhaseShift float64
	// PrimaryPhaseShift is 2x_p|m − 1| of one primary particle.
	PrimaryPhaseShift float64
}

// Method computes the optics of one floc. Implementations are small value
// types holding only their options; all scratch space is in the Workspace.
type Method interface {
	// Name is a short identifier, e.g. "rdg" or "effective-medium".
	Name() string
	// Evaluate returns the cross-sections of the floc p and fills diff[i]
	// with the differential scattering cross-section dC_sca/dΩ (m² sr⁻¹,
	// unpolarised incident light) at mu[i] = cos θ_i. len(diff) must equal
	// len(mu). It does not retain mu or diff.
	Evaluate(ws *Workspace, p Problem, mu, diff []float64) (CrossSections, error)
}

// Workspace holds the scratch space of the methods: a Lorenz–Mie solver and
// the cached primary-particle quantities of the fractal method. The zero
// value is ready to use. A Workspace is not safe for concurrent use; give
// each goroutine its own. Once warmed up, evaluations allocate nothing.
type Workspace struct {
	solver mie.Solver
	cache  []*primaryCache // primaries met, at most maxCached
	clock  uint64
}

// check validates p and returns x (floc size parameter), the solid
// fraction and the volume-averaged phase shifts.
func (p Problem) check() (x, phi float64, err error) {
	if err := p.Fractal.Validate(); err != nil {
		return 0, 0, err
	}
	if !(p.Wavelength >= 1e-7 && p.Wavelength <= 1e-5) {
		return 0, 0, fmt.Errorf("optics: Wavelength = %g m is outside the allowed range [1e-7, 1e-5] m", p.Wavelength)
	}
	if !(p.MediumIndex >= 1 && p.MediumIndex <= 2) {
		return 0, 0, fmt.Errorf("optics: MediumIndex = %g is outside the allowed range [1, 2]", p.MediumIndex)
	}
	m := p.Index
	if cmplx.IsNaN(m) || cmplx.IsInf(m) || !(real(m) >= 0.5 && real(m) <= 3) || !(imag(m) >= 0 && imag(m) <= 10) {
		return 0, 0, fmt.Errorf("optics: Index = %v is outside the allowed range n in [0.5, 3], k in [0, 10] (relative to water)", m)
	}
	phi, err = p.Fractal.SolidFraction(p.Diameter)
	if err != nil {
		return 0, 0, err
	}
	return mie.SizeParameter(p.Diameter, p.Wavelength, p.MediumIndex), phi, nil
}

// phaseShifts fills the two validity indicators.
func (p Problem) phaseShifts(cs *CrossSections, x, phi float64) {
	dm := cmplx.Abs(p.Index - 1)
	cs.PhaseShift = 2 * x * phi * dm
	cs.PrimaryPhaseShift = 2 * mie.SizeParameter(p.Fractal.PrimaryDiameter, p.Wavelength, p.MediumIndex) * dm
}

// errNonFinite guards every returned result.
var errNonFinite = errors.New("optics: computation produced a non-finite result (please report the inputs)")

func finite(v ...float64) bool {
	for _, f := range v {
		if math.IsNaN(f) || math.IsInf(f, 0) {
			return false
		}
	}
	return true
}

// grow returns s with length n, reusing its storage.
func grow[T any](s []T, n int) []T {
	if cap(s) < n {
		return make([]T, n)
	}
	return s[:n]
}
