package psd

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// Distribution is a particle size distribution: number density per unit
// diameter over a finite diameter range.
type Distribution interface {
	// Density returns n(D), the number of particles per cubic metre of water
	// per metre of diameter (m⁻⁴), at diameter D (m). It is zero outside
	// Range.
	Density(diameter float64) float64
	// Range returns the smallest and largest diameter (m) with non-zero
	// density. For distributions with unbounded support (Lognormal) it is a
	// truncation that holds all but a negligible fraction of every moment up
	// to the fourth.
	Range() (min, max float64)
}

// PartialMomenter is implemented by distributions that integrate their own
// moments exactly. PartialMoment returns ∫ D^k n(D) dD over [lo, hi] (m),
// clipped to the distribution's range, in m^(k-3).
type PartialMomenter interface {
	PartialMoment(k, lo, hi float64) float64
}

// Validator is implemented by distributions whose parameters can be invalid.
type Validator interface {
	Validate() error
}

// Check reports whether d is usable: its range is finite, positive and not
// empty, and its own Validate (if any) passes.
func Check(d Distribution) error {
	if d == nil {
		return fmt.Errorf("psd: distribution is nil")
	}
	if v, ok := d.(Validator); ok {
		if err := v.Validate(); err != nil {
			return err
		}
	}
	lo, hi := d.Range()
	return checkRange("Range", lo, hi)
}

func checkRange(field string, lo, hi float64) error {
	if !(lo > 0) || math.IsInf(lo, 0) {
		return fmt.Errorf("psd: %s minimum diameter = %g m, want a finite value > 0 m", field, lo)
	}
	if !(hi > lo) || math.IsInf(hi, 0) {
		return fmt.Errorf("psd: %s is empty or unbounded: [%g, %g] m, want 0 < min < max < ∞", field, lo, hi)
	}
	return nil
}

// Numerical quadrature in u = ln D: panels no wider than panelWidth, each
// with glNodes Gauss–Legendre nodes. An 8-node rule is exact for polynomials
// of degree 15 in u; a lognormal with geometric SD 1.2 (ln σ = 0.18) varies
// on a scale 3.6 panels wide, which gives errors far below 1e-12.
const (
	panelWidth = 0.05
	glNodes    = 8
)

var glX, glW = func() ([]float64, []float64) {
	x := make([]float64, glNodes)
	w := make([]float64, glNodes)
	quad.Legendre{}.FixedLocations(x, w, 0, 1)
	return x, w
}()

// Integrate returns ∫ D^k n(D) dD over [lo, hi] (m) clipped to d's range, by
// composite Gauss–Legendre quadrature in ln D whatever d implements. It is the
// slow reference that exact PartialMoment methods are tested against.
func Integrate(d Distribution, k, lo, hi float64) float64 {
	dmin, dmax := d.Range()
	lo = math.Max(lo, dmin)
	hi = math.Min(hi, dmax)
	if !(hi > lo) {
		return 0
	}
	ua, ub := math.Log(lo), math.Log(hi)
	np := int(math.Ceil((ub - ua) / panelWidth))
	if np < 1 {
		np = 1
	}
	h := (ub - ua) / float64(np)
	var sum float64
	for p := 0; p < np; p++ {
		u0 := ua + float64(p)*h
		var s float64
		for j := range glX {
			u := u0 + glX[j]*h
			D := math.Exp(u)
			// dD = D du.
			s += glW[j] * math.Pow(D, k+1) * d.Density(D)
		}
		sum += s * h
	}
	return sum
}

// PartialMoment returns ∫ D^k n(D) dD over [lo, hi] (m), clipped to d's range,
// in m^(k-3): exactly if d implements PartialMomenter, else by Integrate.
func PartialMoment(d Distribution, k, lo, hi float64) float64 {
	if pm, ok := d.(PartialMomenter); ok {
		return pm.PartialMoment(k, lo, hi)
	}
	return Integrate(d, k, lo, hi)
}

// Moment returns the k-th moment M_k = ∫ D^k n(D) dD over d's range
// (m^(k-3)), or an error if d fails Check.
func Moment(d Distribution, k float64) (float64, error) {
	if err := Check(d); err != nil {
		return 0, err
	}
	lo, hi := d.Range()
	m := PartialMoment(d, k, lo, hi)
	if math.IsNaN(m) || math.IsInf(m, 0) {
		return 0, fmt.Errorf("psd: moment %g is not finite (%g)", k, m)
	}
	return m, nil
}

// BinNumbers fills dst[i] with the number concentration (m⁻³) of particles
// with diameters in [edges[i], edges[i+1]) (m). It panics if
// len(dst) != len(edges)-1 (a programming error). It allocates nothing.
func BinNumbers(d Distribution, edges, dst []float64) {
	if len(dst) != len(edges)-1 {
		panic(fmt.Sprintf("psd: BinNumbers: len(dst) = %d, want len(edges)-1 = %d", len(dst), len(edges)-1))
	}
	for i := range dst {
		dst[i] = PartialMoment(d, 0, edges[i], edges[i+1])
	}
}

// Scaled multiplies a distribution by a constant factor: n(D) = Factor·Of(D).
// Normalize returns one.
type Scaled struct {
	Of     Distribution
	Factor float64 // dimensionless, ≥ 0
}

// Density implements Distribution.
func (s Scaled) Density(d float64) float64 { return s.Factor * s.Of.Density(d) }

// Range implements Distribution.
func (s Scaled) Range() (float64, float64) { return s.Of.Range() }

// PartialMoment implements PartialMomenter.
func (s Scaled) PartialMoment(k, lo, hi float64) float64 {
	return s.Factor * PartialMoment(s.Of, k, lo, hi)
}

// Validate implements Validator.
func (s Scaled) Validate() error {
	if !(s.Factor >= 0) || math.IsInf(s.Factor, 0) {
		return fmt.Errorf("psd: Scaled.Factor = %g, want a finite value ≥ 0", s.Factor)
	}
	return Check(s.Of)
}
