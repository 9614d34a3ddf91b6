package iop

import (
	"fmt"

	"github.com/murk-optics/murk/mie/population"
)

// FillParticles sets c (sized for s) to the bulk IOPs of a particle
// population whose kernel is built (population.New or FromTable): a, b,
// b_b and the VSF are the kernel sums Σ N_i ⟨C⟩_i over size bins (package
// mie/kernel), and c.Mass the population's dry mass concentration inside the
// kernel's size range (kg m⁻³). The kernel must have been built on exactly
// s's wavelengths and angles. It allocates nothing. c.Kind becomes
// Particles.
func (s *Spectra) FillParticles(c *Component, o *population.Optics) error {
	if err := s.sized(c); err != nil {
		return err
	}
	if o == nil || o.Table == nil {
		return fmt.Errorf("iop: component %q: population optics not built (use population.New)", c.Name)
	}
	t := o.Table
	if !sameGrid(s.Wavelengths, t.Wavelengths) || !sameGrid(s.Angles, t.Angles) {
		return fmt.Errorf("iop: population %q: kernel built on %d wavelengths and %d angles that differ from this grid's %d and %d (build the kernel with Spec.Wavelengths and Spec.Angles set to the Spectra's)",
			o.Population.Name, len(t.Wavelengths), len(t.Angles), len(s.Wavelengths), len(s.Angles))
	}
	if err := o.IOP(&s.kiop); err != nil {
		return fmt.Errorf("iop: population %q: %w", o.Population.Name, err)
	}
	copy(c.A, s.kiop.A)
	copy(c.B, s.kiop.B)
	copy(c.Bb, s.kiop.Bb)
	copy(c.VSF, s.kiop.VSF)
	c.Kind, c.Mass = Particles, o.Mass()
	return nil
}

// AddParticles appends a component for population o, named after it (see
// FillParticles).
func (s *Spectra) AddParticles(o *population.Optics) error {
	if o == nil {
		return fmt.Errorf("iop: population optics is nil")
	}
	c := s.Blank(o.Population.Name, Particles, 0)
	if err := s.FillParticles(&c, o); err != nil {
		return err
	}
	return s.Add(c)
}

func sameGrid(a, b []float64) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}
