package optics

import (
	"fmt"
	"math"
	"math/cmplx"

	"github.com/murk-optics/murk/mie"
)

// MixingRule selects the effective-medium index of a porous floc.
type MixingRule int

const (
	// MaxwellGarnett treats the primaries as inclusions of volume fraction
	// φ in a water host (Maxwell Garnett 1904, Philos. Trans. R. Soc. A
	// 203:385): ε_eff = 1 + 3φβ/(1 − φβ), β = (m² − 1)/(m² + 2), m_eff = √ε_eff.
	// Exact in the dilute, small-inclusion limit. The zero value.
	MaxwellGarnett MixingRule = iota
	// VolumeAverage is the volume-averaged index m_eff = 1 + φ(m − 1), the
	// linear mixing that Gladstone–Dale-type arguments give for |m − 1| ≪ 1.
	VolumeAverage
)

// String returns the rule's name.
func (r MixingRule) String() string {
	if r == VolumeAverage {
		return "volume-average"
	}
	return "maxwell-garnett"
}

// EffectiveIndex returns the effective index relative to water of a porous
// sphere holding solid fraction phi in [0, 1] of material of relative index
// m. phi = 0 gives 1 and phi = 1 gives m for both rules.
func (r MixingRule) EffectiveIndex(m complex128, phi float64) complex128 {
	if r == VolumeAverage {
		return 1 + complex(phi, 0)*(m-1)
	}
	b := (m*m - 1) / (m*m + 2)
	f := complex(phi, 0)
	e := 1 + 3*f*b/(1-f*b)
	return cmplx.Sqrt(e)
}

// EffectiveMedium models a floc as a homogeneous porous sphere of the floc's
// diameter whose index is the effective-medium index of its solid fraction
// φ = (D/D_p)^(n_f−3), solved with Lorenz–Mie theory (package mie). Beyond
// Mie's size domain (x > mie.MaxSizeParameter) extinction and absorption
// come from AnomalousDiffraction, which is then accurate because
// |m_eff − 1| ≪ 1 for any porous floc that large; backscattering and the
// VSF are not available there and are reported as an error unless
// NoBackscatter is set and no angles are asked for.
//
// Validity: the mean-field index assumes the primaries are small compared
// with the wavelength (x_p = πD_p·n_w/λ ≲ 1); for mineral primaries of a few
// µm in visible light they are not, and the homogeneous sphere loses the
// primaries' own wide-angle scattering: it underestimates backscattering
// (a soft, smooth sphere scatters almost only forward). Multiple scattering
// inside the floc is included in the mean-field sense of the index, and the
// extinction of large flocs tends correctly to twice the projected area
// when the phase shift ρ = 2x|m_eff − 1| is large.
type EffectiveMedium struct {
	Rule MixingRule
}

// Name implements Method.
func (e EffectiveMedium) Name() string { return "effective-medium-" + e.Rule.String() }

// Evaluate implements Method.
func (e EffectiveMedium) Evaluate(ws *Workspace, p Problem, mu, diff []float64) (CrossSections, error) {
	if len(mu) != len(diff) {
		panic("optics: Evaluate slice lengths differ")
	}
	x, phi, err := p.check()
	if err != nil {
		return CrossSections{}, err
	}
	meff := e.Rule.EffectiveIndex(p.Index, phi)
	area := math.Pi * p.Diameter * p.Diameter / 4
	var cs CrossSections
	p.phaseShifts(&cs, x, phi)
	if x > mie.MaxSizeParameter {
		if !p.NoBackscatter || len(mu) > 0 {
			return CrossSections{}, fmt.Errorf("optics: effective medium: size parameter %.4g exceeds the Mie domain %g; only extinction and absorption are available there (set NoBackscatter, ask for no angles)", x, mie.MaxSizeParameter)
		}
		qext, qabs, err := AnomalousDiffraction(x, meff)
		if err != nil {
			return CrossSections{}, err
		}
		cs.Extinction, cs.Absorption = qext*area, qabs*area
		cs.Scattering = max(cs.Extinction-cs.Absorption, 0)
		cs.Asymmetry = 1 // diffraction-dominated; forward limit
		return cs, nil
	}
	ef, err := ws.solver.Sphere(x, meff)
	if err != nil {
		return CrossSections{}, err
	}
	cs.Extinction, cs.Scattering, cs.Absorption = ef.Qext*area, ef.Qsca*area, ef.Qabs*area
	cs.Asymmetry = ef.G
	if !p.NoBackscatter {
		cs.Backscattering = ws.solver.BackHemisphere() * area
	}
	if len(mu) > 0 {
		ws.solver.VolumeScattering(mu, 1, p.Wavelength, p.MediumIndex, diff)
	}
	if !finite(cs.Extinction, cs.Scattering, cs.Absorption, cs.Backscattering, cs.Asymmetry) {
		return CrossSections{}, errNonFinite
	}
	return cs, nil
}
