package refindex

import (
	"fmt"
	"math"
	"math/cmplx"
	"sort"
)

// Model is a complex refractive-index model of a material.
type Model interface {
	// Index returns the absolute complex index n + ik (k ≥ 0 absorbing) at
	// vacuum wavelength λ0 (m), or an error if λ0 is outside the model's
	// range or the result is not a valid index.
	Index(vacuumWavelength float64) (complex128, error)
}

// Medium returns the real refractive index of the surrounding medium at a
// vacuum wavelength (m). Water's index comes from the water optics package.
type Medium func(vacuumWavelength float64) float64

// Check validates an index value: finite, real part > 0, imaginary part ≥ 0.
// field names it in the error.
func Check(field string, m complex128) error {
	n, k := real(m), imag(m)
	if cmplx.IsNaN(m) || cmplx.IsInf(m) {
		return fmt.Errorf("refindex: %s = %v is not finite", field, m)
	}
	if !(n > 0) {
		return fmt.Errorf("refindex: %s real part = %g, want n > 0", field, n)
	}
	if !(k >= 0) {
		return fmt.Errorf("refindex: %s imaginary part = %g, want k ≥ 0 (convention m = n + ik, k ≥ 0 absorbing)", field, k)
	}
	return nil
}

func checkWavelength(l float64) error {
	if !(l > 0) || math.IsInf(l, 0) {
		return fmt.Errorf("refindex: vacuum wavelength = %g m, want a finite value > 0 m", l)
	}
	return nil
}

// Constant is a wavelength-independent index N + iK.
type Constant struct {
	N float64 // real part, > 0
	K float64 // imaginary part, ≥ 0
}

// Index implements Model.
func (c Constant) Index(l float64) (complex128, error) {
	if err := checkWavelength(l); err != nil {
		return 0, err
	}
	m := complex(c.N, c.K)
	return m, Check("Constant", m)
}

// Table is an index tabulated at increasing vacuum wavelengths, linearly
// interpolated in wavelength. Asking outside [first, last] is an error (no
// extrapolation).
type Table struct {
	Wavelengths []float64 // vacuum wavelength, m, strictly increasing
	N           []float64 // real part at each wavelength, > 0
	K           []float64 // imaginary part at each wavelength, ≥ 0; nil means 0
}

// Validate reports inconsistent lengths, unordered wavelengths or invalid
// entries.
func (t Table) Validate() error {
	if len(t.Wavelengths) == 0 || len(t.N) != len(t.Wavelengths) || (t.K != nil && len(t.K) != len(t.Wavelengths)) {
		return fmt.Errorf("refindex: Table lengths: %d wavelengths, %d N, %d K; want equal and ≥ 1", len(t.Wavelengths), len(t.N), len(t.K))
	}
	for i, l := range t.Wavelengths {
		if err := checkWavelength(l); err != nil {
			return err
		}
		if i > 0 && !(l > t.Wavelengths[i-1]) {
			return fmt.Errorf("refindex: Table.Wavelengths[%d] = %g m not above previous %g m, want strictly increasing", i, l, t.Wavelengths[i-1])
		}
		k := 0.0
		if t.K != nil {
			k = t.K[i]
		}
		if err := Check(fmt.Sprintf("Table entry %d (%g m)", i, l), complex(t.N[i], k)); err != nil {
			return err
		}
	}
	return nil
}

// Index implements Model.
func (t Table) Index(l float64) (complex128, error) {
	if err := t.Validate(); err != nil {
		return 0, err
	}
	w := t.Wavelengths
	if !(l >= w[0] && l <= w[len(w)-1]) {
		return 0, fmt.Errorf("refindex: wavelength %g m outside the table's range [%g, %g] m", l, w[0], w[len(w)-1])
	}
	i := sort.SearchFloat64s(w, l)
	if w[i] == l {
		return t.at(i), nil
	}
	f := (l - w[i-1]) / (w[i] - w[i-1])
	a, b := t.at(i-1), t.at(i)
	return a + complex(f, 0)*(b-a), nil
}

func (t Table) at(i int) complex128 {
	if t.K == nil {
		return complex(t.N[i], 0)
	}
	return complex(t.N[i], t.K[i])
}

// Smooth is a smooth spectral model: Cauchy dispersion of the real part and
// an exponential imaginary part,
//
//	n(λ) = N + B·(1/λ² − 1/Ref²)
//	k(λ) = K·exp(−S·(λ − Ref)) + KFloor
//
// (Cauchy 1836 for n; the exponential decay of mineral absorption with
// wavelength, Babin & Stramski 2004, from memory). Valid over the visible and
// near infrared where these forms hold (roughly 350–1000 nm for common
// minerals); the model itself accepts any wavelength that keeps n > 0.
type Smooth struct {
	Ref    float64 // reference vacuum wavelength, m, > 0
	N      float64 // real part at Ref, > 0
	B      float64 // Cauchy coefficient, m² (e.g. quartz ≈ 3.5e-15 m², from memory); 0 for none
	K      float64 // imaginary part at Ref (above KFloor), ≥ 0
	S      float64 // spectral slope of k, m⁻¹ of wavelength (0.01 nm⁻¹ = 1e7 m⁻¹)
	KFloor float64 // wavelength-independent imaginary part, ≥ 0
}

// Index implements Model.
func (s Smooth) Index(l float64) (complex128, error) {
	if err := checkWavelength(l); err != nil {
		return 0, err
	}
	if err := checkWavelength(s.Ref); err != nil {
		return 0, fmt.Errorf("refindex: Smooth.Ref: %w", err)
	}
	if !(s.K >= 0) || !(s.KFloor >= 0) {
		return 0, fmt.Errorf("refindex: Smooth.K = %g, KFloor = %g, want both ≥ 0", s.K, s.KFloor)
	}
	n := s.N + s.B*(1/(l*l)-1/(s.Ref*s.Ref))
	k := s.K*math.Exp(-s.S*(l-s.Ref)) + s.KFloor
	m := complex(n, k)
	return m, Check("Smooth", m)
}

// Absorbing adds to a base model the imaginary index of an absorption
// spectrum: k(λ0) += a(λ0)·λ0/(4π), a in m⁻¹ the absorption coefficient of
// the material itself (not of the suspension); Bohren & Huffman (1983) eq.
// 2.52. Phytoplankton cells take their pigment absorption this way (a
// chlorophyll-tied spectrum supplied by the water optics).
type Absorbing struct {
	Base       Model
	Absorption func(vacuumWavelength float64) float64 // m⁻¹, ≥ 0
}

// Index implements Model.
func (a Absorbing) Index(l float64) (complex128, error) {
	if a.Base == nil || a.Absorption == nil {
		return 0, fmt.Errorf("refindex: Absorbing needs Base and Absorption")
	}
	m, err := a.Base.Index(l)
	if err != nil {
		return 0, err
	}
	abs := a.Absorption(l)
	if !(abs >= 0) || math.IsInf(abs, 0) {
		return 0, fmt.Errorf("refindex: material absorption at %g m = %g m-1, want a finite value ≥ 0 m-1", l, abs)
	}
	return m + complex(0, abs*l/(4*math.Pi)), nil
}

// Relative places a model of index RELATIVE to water in a reference water
// of index Water(λ0): the absolute index is Rel(λ0)·Water(λ0). In that same
// water the kernel's relative index is Rel exactly.
type Relative struct {
	Rel   Model
	Water Medium
}

// Index implements Model.
func (r Relative) Index(l float64) (complex128, error) {
	if r.Rel == nil || r.Water == nil {
		return 0, fmt.Errorf("refindex: Relative needs Rel and Water")
	}
	m, err := r.Rel.Index(l)
	if err != nil {
		return 0, err
	}
	nw := r.Water(l)
	if !(nw > 0) || math.IsInf(nw, 0) {
		return 0, fmt.Errorf("refindex: water index at %g m = %g, want a finite value > 0", l, nw)
	}
	return m * complex(nw, 0), nil
}

// ConstantMedium returns a Medium of fixed index n (for tests and for media
// whose dispersion is negligible over the band).
func ConstantMedium(n float64) Medium { return func(float64) float64 { return n } }

// InMedium returns the index of model relative to medium at λ0: m/n_medium,
// checked.
func InMedium(model Model, medium Medium, l float64) (complex128, error) {
	m, err := model.Index(l)
	if err != nil {
		return 0, err
	}
	nm := medium(l)
	if !(nm > 0) || math.IsInf(nm, 0) {
		return 0, fmt.Errorf("refindex: medium index at %g m = %g, want a finite value > 0", l, nm)
	}
	rel := m / complex(nm, 0)
	return rel, Check("relative index", rel)
}
