package iop

import (
	"errors"
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/scenario/water"
)

// Kind classifies a component.
type Kind uint8

// The component kinds.
const (
	Water     Kind = iota + 1 // pure water or seawater
	Dissolved                 // coloured dissolved organic matter (absorbs only)
	Pigment                   // pigment absorption with no scattering (phytoplankton not modelled as particles)
	Particles                 // a suspended particle population
)

func (k Kind) String() string {
	switch k {
	case Water:
		return "water"
	case Dissolved:
		return "dissolved"
	case Pigment:
		return "pigment"
	case Particles:
		return "particles"
	}
	return fmt.Sprintf("Kind(%d)", uint8(k))
}

// Quantity selects one of a component's spectra.
type Quantity uint8

// The quantities.
const (
	Absorption     Quantity = iota + 1 // a, m⁻¹
	Scattering                         // b, m⁻¹
	Backscattering                     // b_b, m⁻¹
	Attenuation                        // c = a + b, m⁻¹
)

func (q Quantity) String() string {
	switch q {
	case Absorption:
		return "absorption"
	case Scattering:
		return "scattering"
	case Backscattering:
		return "backscattering"
	case Attenuation:
		return "attenuation"
	}
	return fmt.Sprintf("Quantity(%d)", uint8(q))
}

// Component holds one constituent's IOPs on the grid of the Spectra it
// belongs to.
type Component struct {
	Name string
	Kind Kind
	Mass float64   // mass concentration, kg m⁻³ (particles; 0 where not meaningful)
	A    []float64 // absorption coefficient per wavelength, m⁻¹
	B    []float64 // scattering coefficient per wavelength, m⁻¹
	Bb   []float64 // backscattering coefficient per wavelength, m⁻¹
	VSF  []float64 // volume scattering function, m⁻¹ sr⁻¹, [i*len(Angles)+j]
}

// Value returns quantity q at wavelength index i.
func (c *Component) Value(q Quantity, i int) float64 {
	switch q {
	case Absorption:
		return c.A[i]
	case Scattering:
		return c.B[i]
	case Backscattering:
		return c.Bb[i]
	case Attenuation:
		return c.A[i] + c.B[i]
	}
	panic(fmt.Sprintf("iop: unknown quantity %d", uint8(q)))
}

// Values fills dst with quantity q at every wavelength and returns it; dst
// is grown if it is too short (pass a reused slice to avoid allocation).
func (c *Component) Values(dst []float64, q Quantity) []float64 {
	dst = grow(dst, len(c.A))
	for i := range c.A {
		dst[i] = c.Value(q, i)
	}
	return dst
}

// BackscatterRatio fills dst with b_b/b at every wavelength. It returns an
// error for a wavelength where b = 0 (a component that does not scatter has
// no backscattering ratio).
func (c *Component) BackscatterRatio(dst []float64) ([]float64, error) {
	dst = grow(dst, len(c.B))
	for i, b := range c.B {
		if !(b > 0) {
			return dst, fmt.Errorf("iop: %s: backscattering ratio undefined at wavelength index %d: scattering coefficient %g m-1 (need > 0)", c.Name, i, b)
		}
		dst[i] = c.Bb[i] / b
	}
	return dst, nil
}

// MassSpecific fills dst with quantity q divided by the mass concentration,
// m² kg⁻¹. It returns an error if the component has no positive Mass.
func (c *Component) MassSpecific(dst []float64, q Quantity) ([]float64, error) {
	if !(c.Mass > 0) || math.IsInf(c.Mass, 0) {
		return dst, fmt.Errorf("iop: %s: mass concentration %g kg m-3: mass-specific values need a mass in (0, ∞) kg m-3", c.Name, c.Mass)
	}
	dst = c.Values(dst, q)
	for i := range dst {
		dst[i] /= c.Mass
	}
	return dst, nil
}

func grow(s []float64, n int) []float64 {
	if cap(s) < n {
		return make([]float64, n)
	}
	return s[:n]
}

// Spectra is a set of components on a common wavelength and angle grid.
type Spectra struct {
	Wavelengths []float64 // vacuum wavelengths, m, strictly increasing, 350–900 nm for water
	Angles      []float64 // scattering angles for the VSF, rad, in [0, π]
	Components  []Component

	cos2   []float64      // cos² of each angle
	optics []water.Optics // workspace for water
	tmp    []float64      // workspace for slopes
	kiop   kernel.IOP     // workspace for particle populations
}

// New returns an empty Spectra on the given grid. Wavelengths must be
// positive, finite and strictly increasing; angles must lie in [0, π]. The
// slices are copied.
func New(wavelengths, angles []float64) (*Spectra, error) {
	if len(wavelengths) == 0 {
		return nil, errors.New("iop: wavelengths: empty list (need at least one wavelength, in m)")
	}
	for i, l := range wavelengths {
		if !(l > 0) || math.IsInf(l, 0) {
			return nil, fmt.Errorf("iop: wavelengths[%d] = %g m: need a positive finite vacuum wavelength in m", i, l)
		}
		if i > 0 && !(l > wavelengths[i-1]) {
			return nil, fmt.Errorf("iop: wavelengths[%d] = %g m is not greater than wavelengths[%d] = %g m (need strictly increasing)", i, l, i-1, wavelengths[i-1])
		}
	}
	s := &Spectra{
		Wavelengths: append([]float64(nil), wavelengths...),
		Angles:      append([]float64(nil), angles...),
		cos2:        make([]float64, len(angles)),
		optics:      make([]water.Optics, len(wavelengths)),
		tmp:         make([]float64, len(wavelengths)),
	}
	n, m := len(wavelengths), len(angles)
	s.kiop = kernel.IOP{A: make([]float64, n), B: make([]float64, n), Bb: make([]float64, n), C: make([]float64, n), VSF: make([]float64, n*m)}
	for j, t := range angles {
		if !(t >= 0 && t <= math.Pi) {
			return nil, fmt.Errorf("iop: angles[%d] = %g rad outside the allowed range [0, π] rad", j, t)
		}
		c := math.Cos(t)
		s.cos2[j] = c * c
	}
	return s, nil
}

// Blank returns a zeroed component sized for s (not yet added).
func (s *Spectra) Blank(name string, kind Kind, mass float64) Component {
	n, m := len(s.Wavelengths), len(s.Angles)
	return Component{Name: name, Kind: kind, Mass: mass,
		A: make([]float64, n), B: make([]float64, n), Bb: make([]float64, n), VSF: make([]float64, n*m)}
}

// Add validates c against the grid and appends it. Names must be unique and
// non-empty; coefficients must be finite and ≥ 0, b_b ≤ b.
func (s *Spectra) Add(c Component) error {
	if err := s.check(&c); err != nil {
		return err
	}
	if c.Name == "" {
		return errors.New("iop: component name: empty (need a unique name)")
	}
	if _, ok := s.Lookup(c.Name); ok {
		return fmt.Errorf("iop: component name %q already present (need a unique name)", c.Name)
	}
	s.Components = append(s.Components, c)
	return nil
}

// Lookup returns the index of the component with the given name.
func (s *Spectra) Lookup(name string) (int, bool) {
	for i := range s.Components {
		if s.Components[i].Name == name {
			return i, true
		}
	}
	return -1, false
}

func (s *Spectra) check(c *Component) error {
	n, m := len(s.Wavelengths), len(s.Angles)
	if len(c.A) != n || len(c.B) != n || len(c.Bb) != n || len(c.VSF) != n*m {
		return fmt.Errorf("iop: component %q: lengths A %d, B %d, Bb %d, VSF %d; grid needs %d, %d, %d, %d",
			c.Name, len(c.A), len(c.B), len(c.Bb), len(c.VSF), n, n, n, n*m)
	}
	if !(c.Mass >= 0) || math.IsInf(c.Mass, 0) {
		return fmt.Errorf("iop: component %q: mass concentration %g kg m-3 outside the allowed range [0, ∞) kg m-3", c.Name, c.Mass)
	}
	for i := range n {
		for _, v := range [...]struct {
			f string
			x float64
		}{{"absorption", c.A[i]}, {"scattering", c.B[i]}, {"backscattering", c.Bb[i]}} {
			if !(v.x >= 0) || math.IsInf(v.x, 0) {
				return fmt.Errorf("iop: component %q: %s %g m-1 at %g m outside the allowed range [0, ∞) m-1", c.Name, v.f, v.x, s.Wavelengths[i])
			}
		}
		if c.Bb[i] > c.B[i]*(1+1e-12) {
			return fmt.Errorf("iop: component %q: backscattering %g m-1 exceeds scattering %g m-1 at %g m", c.Name, c.Bb[i], c.B[i], s.Wavelengths[i])
		}
	}
	for k, v := range c.VSF {
		if !(v >= 0) || math.IsInf(v, 0) {
			return fmt.Errorf("iop: component %q: VSF %g m-1 sr-1 at index %d outside the allowed range [0, ∞) m-1 sr-1", c.Name, v, k)
		}
	}
	return nil
}

// Sum sets dst to the sum of the components for which keep returns true
// (all of them if keep is nil). dst's slices are reused when large enough,
// so a sized dst costs no allocation. dst.Mass becomes the summed Mass of
// the kept components; dst.Name and dst.Kind are left as they are.
func (s *Spectra) Sum(dst *Component, keep func(*Component) bool) {
	n, m := len(s.Wavelengths), len(s.Angles)
	dst.A, dst.B, dst.Bb, dst.VSF = grow(dst.A, n), grow(dst.B, n), grow(dst.Bb, n), grow(dst.VSF, n*m)
	clear(dst.A)
	clear(dst.B)
	clear(dst.Bb)
	clear(dst.VSF)
	dst.Mass = 0
	for k := range s.Components {
		c := &s.Components[k]
		if keep != nil && !keep(c) {
			continue
		}
		dst.Mass += c.Mass
		for i := range n {
			dst.A[i] += c.A[i]
			dst.B[i] += c.B[i]
			dst.Bb[i] += c.Bb[i]
		}
		for i, v := range c.VSF {
			dst.VSF[i] += v
		}
	}
}

// Total returns a new component holding the sum of all components, named
// "total".
func (s *Spectra) Total() Component {
	t := Component{Name: "total"}
	s.Sum(&t, nil)
	return t
}

// OfKind returns a keep function for Sum selecting one kind.
func OfKind(k Kind) func(*Component) bool {
	return func(c *Component) bool { return c.Kind == k }
}
