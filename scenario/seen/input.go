package seen

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/integrate/quad"
)

// Spectra holds bulk inherent optical properties (water, dissolved matter and
// particles together) at a set of wavelengths. All slices have the same
// length and are indexed by wavelength. The package never keeps or modifies
// them.
type Spectra struct {
	// Wavelength in vacuum, m, strictly increasing, within
	// [MinWavelength, MaxWavelength].
	Wavelength []float64
	// A is the total absorption coefficient a, m⁻¹, ≥ 0.
	A []float64
	// B is the total scattering coefficient b, m⁻¹, ≥ 0.
	B []float64
	// Bb is the total backscattering coefficient b_b, m⁻¹, in [0, b].
	Bb []float64
	// C is the beam attenuation coefficient c, m⁻¹. Optional: nil means
	// c = a + b. When given it must equal a + b within a relative 1e-3
	// (c = a + b is the definition; the tolerance allows for rounding in
	// files).
	C []float64
}

// Wavelength limits accepted by this package, m. The models here are
// defined for the ultraviolet-to-near-infrared window of natural waters.
const (
	MinWavelength = 300e-9
	MaxWavelength = 1100e-9
)

// Validate checks lengths, ordering, signs and finiteness, and that a + b_b
// is positive at every wavelength (the reflectance and Kd models divide by
// it).
func (s Spectra) Validate() error {
	n := len(s.Wavelength)
	if n == 0 {
		return fmt.Errorf("seen: Spectra.Wavelength is empty; need at least 1 wavelength")
	}
	for _, f := range [...]struct {
		name string
		v    []float64
	}{{"A", s.A}, {"B", s.B}, {"Bb", s.Bb}} {
		if len(f.v) != n {
			return fmt.Errorf("seen: Spectra.%s has %d values, Spectra.Wavelength has %d", f.name, len(f.v), n)
		}
	}
	if s.C != nil && len(s.C) != n {
		return fmt.Errorf("seen: Spectra.C has %d values, Spectra.Wavelength has %d", len(s.C), n)
	}
	if err := checkWavelengths("Spectra.Wavelength", s.Wavelength); err != nil {
		return err
	}
	for i := 0; i < n; i++ {
		if err := checkCoef("Spectra.A", i, s.A[i]); err != nil {
			return err
		}
		if err := checkCoef("Spectra.B", i, s.B[i]); err != nil {
			return err
		}
		if err := checkCoef("Spectra.Bb", i, s.Bb[i]); err != nil {
			return err
		}
		if s.Bb[i] > s.B[i] {
			return fmt.Errorf("seen: Spectra.Bb[%d] = %g m⁻¹ exceeds Spectra.B[%d] = %g m⁻¹; allowed range [0, b]", i, s.Bb[i], i, s.B[i])
		}
		if s.A[i]+s.Bb[i] <= 0 {
			return fmt.Errorf("seen: Spectra.A[%d] + Spectra.Bb[%d] = 0 m⁻¹; need a + b_b > 0", i, i)
		}
		if s.C != nil {
			c := s.A[i] + s.B[i]
			if math.IsNaN(s.C[i]) || math.Abs(s.C[i]-c) > 1e-3*c+1e-12 {
				return fmt.Errorf("seen: Spectra.C[%d] = %g m⁻¹ differs from a + b = %g m⁻¹ by more than 0.1 %%", i, s.C[i], c)
			}
		}
	}
	return nil
}

func checkWavelengths(field string, wl []float64) error {
	for i, w := range wl {
		if !(w >= MinWavelength && w <= MaxWavelength) {
			return fmt.Errorf("seen: %s[%d] = %g m is outside [%g, %g] m", field, i, w, MinWavelength, MaxWavelength)
		}
		if i > 0 && !(w > wl[i-1]) {
			return fmt.Errorf("seen: %s[%d] = %g m is not greater than %s[%d] = %g m; wavelengths must increase", field, i, w, field, i-1, wl[i-1])
		}
	}
	return nil
}

// MaxCoefficient is the largest absorption, scattering or attenuation
// coefficient accepted, m⁻¹: far above any natural water (fluid mud reaches
// ~1e4 m⁻¹), low enough that no product overflows.
const MaxCoefficient = 1e6

func checkCoef(field string, i int, v float64) error {
	if !(v >= 0 && v <= MaxCoefficient) {
		return fmt.Errorf("seen: %s[%d] = %g m⁻¹ is outside [0, %g] m⁻¹", field, i, v, float64(MaxCoefficient))
	}
	return nil
}

func checkScalar(field string, v, lo, hi float64, unit string) error {
	if !(v >= lo && v <= hi) {
		return fmt.Errorf("seen: %s = %g %s is outside [%g, %g] %s", field, v, unit, lo, hi, unit)
	}
	return nil
}

// VSF is a volume scattering function β(θ) sampled at one wavelength.
// Between samples β is interpolated as a power law in θ (straight in
// log β – log θ) when both samples are positive and the lower angle is
// above 0, and linearly otherwise; the power law follows the steep forward
// peak of particle scattering far better than a straight line. Below the
// first sampled angle β is held at its first value (the diffraction peak of
// finite particles is flat near 0; common practice).
type VSF struct {
	// Angle is the scattering angle, rad, strictly increasing in [0, π].
	Angle []float64
	// Beta is β(θ) at each angle, m⁻¹ sr⁻¹, ≥ 0.
	Beta []float64
}

// Validate checks lengths, ordering, ranges and finiteness.
func (v VSF) Validate() error {
	if len(v.Angle) < 2 {
		return fmt.Errorf("seen: VSF.Angle has %d values; need at least 2", len(v.Angle))
	}
	if len(v.Beta) != len(v.Angle) {
		return fmt.Errorf("seen: VSF.Beta has %d values, VSF.Angle has %d", len(v.Beta), len(v.Angle))
	}
	for i, t := range v.Angle {
		if !(t >= 0 && t <= math.Pi) {
			return fmt.Errorf("seen: VSF.Angle[%d] = %g rad is outside [0, π] rad", i, t)
		}
		if i > 0 && !(t > v.Angle[i-1]) {
			return fmt.Errorf("seen: VSF.Angle[%d] = %g rad is not greater than VSF.Angle[%d] = %g rad; angles must increase", i, t, i-1, v.Angle[i-1])
		}
		if b := v.Beta[i]; !(b >= 0) || math.IsInf(b, 1) {
			return fmt.Errorf("seen: VSF.Beta[%d] = %g m⁻¹ sr⁻¹ is outside [0, +∞) m⁻¹ sr⁻¹", i, b)
		}
	}
	return nil
}

// at returns β(θ) interpolated as described on VSF. θ must lie within
// [0, last sampled angle]; the caller has validated v.
func (v VSF) at(theta float64) float64 {
	n := len(v.Angle)
	if theta <= v.Angle[0] {
		return v.Beta[0]
	}
	i := sort.SearchFloat64s(v.Angle, theta) // Angle[i-1] < theta <= Angle[i]
	if i >= n {
		return v.Beta[n-1]
	}
	return v.segment(i-1, theta)
}

// segment interpolates inside [Angle[i], Angle[i+1]].
func (v VSF) segment(i int, theta float64) float64 {
	k, power := v.exponent(i)
	return v.segmentWith(i, k, power, theta)
}

// exponent returns the power-law exponent of segment i, or power = false
// when the segment is interpolated linearly.
func (v VSF) exponent(i int) (k float64, power bool) {
	t0, t1 := v.Angle[i], v.Angle[i+1]
	b0, b1 := v.Beta[i], v.Beta[i+1]
	if t0 > 0 && b0 > 0 && b1 > 0 {
		return math.Log(b1/b0) / math.Log(t1/t0), true
	}
	return 0, false
}

func (v VSF) segmentWith(i int, k float64, power bool, theta float64) float64 {
	t0, b0 := v.Angle[i], v.Beta[i]
	if power {
		return b0 * math.Pow(theta/t0, k)
	}
	return b0 + (v.Beta[i+1]-b0)*(theta-t0)/(v.Angle[i+1]-t0)
}

// glX and glW are 8-point Gauss–Legendre nodes and weights on [-1, 1]
// (from gonum's quad.Legendre). Eight points integrate the smooth power-law
// × sin θ segment integrand to far better than the interpolation error.
var glX, glW = func() ([]float64, []float64) {
	x := make([]float64, 8)
	w := make([]float64, 8)
	quad.Legendre{}.FixedLocations(x, w, -1, 1)
	return x, w
}()

// cone returns 2π ∫_0^θmax β(θ) sin θ dθ, m⁻¹, and the part of it that came
// from the constant hold below the first sampled angle.
func (v VSF) cone(thetaMax float64) (total, held float64) {
	if thetaMax <= 0 {
		return 0, 0
	}
	t0 := v.Angle[0]
	if t0 > 0 {
		hi := math.Min(t0, thetaMax)
		// 2π β0 (1 − cos hi), written with the half-angle form to keep
		// precision at small angles.
		s := math.Sin(hi / 2)
		held = 2 * math.Pi * v.Beta[0] * 2 * s * s
		total = held
	}
	for i := 0; i+1 < len(v.Angle); i++ {
		lo, hi := v.Angle[i], v.Angle[i+1]
		if lo >= thetaMax {
			break
		}
		k, power := v.exponent(i)
		b1 := v.Beta[i+1]
		if hi > thetaMax {
			hi = thetaMax
			b1 = v.segmentWith(i, k, power, hi)
		}
		if power && hi <= seriesMaxAngle {
			total += 2 * math.Pi * powerSinSeries(lo, hi, v.Beta[i], b1, k)
		} else {
			total += 2 * math.Pi * v.segmentGL(i, k, power, lo, hi)
		}
	}
	if last := v.Angle[len(v.Angle)-1]; thetaMax > last {
		// Beyond the last sample, hold the last value.
		c0, c1 := math.Cos(last), math.Cos(thetaMax)
		total += 2 * math.Pi * v.Beta[len(v.Beta)-1] * (c0 - c1)
	}
	return total, held
}

// segmentGL integrates β(θ) sin θ over [lo, hi] inside segment i with
// 8-point Gauss–Legendre quadrature.
func (v VSF) segmentGL(i int, k float64, power bool, lo, hi float64) float64 {
	mid, half := (lo+hi)/2, (hi-lo)/2
	var s float64
	for j, x := range glX {
		t := mid + half*x
		s += glW[j] * v.segmentWith(i, k, power, t) * math.Sin(t)
	}
	return half * s
}

// seriesMaxAngle is the largest angle, rad, for which powerSinSeries is
// used: the sine series below is truncated after the θ⁹ term, whose
// successor θ¹¹/11! is below 1.3e-11·θ at 0.5 rad.
const seriesMaxAngle = 0.5

// sinSeries holds the Taylor coefficients of sin θ = Σ c_j θ^(2j+1).
var sinSeries = [...]float64{1, -1.0 / 6, 1.0 / 120, -1.0 / 5040, 1.0 / 362880}

// powerSinSeries integrates β(θ) sin θ over [t0, t1] (0 < t0 < t1 ≤
// seriesMaxAngle) for the power law β = b0 (θ/t0)^k through (t1, b1), in
// closed form term by term of the sine series:
//
//	∫ b0 (θ/t0)^k θ^m dθ = (b1 t1^(m+1) − b0 t0^(m+1)) / (k + m + 1),
//
// using (t1/t0)^k = b1/b0, so no powers are evaluated. When k + m + 1 is
// near 0 the expression is replaced by its expm1 series in (k+m+1)·ln(t1/t0)
// to avoid cancellation.
func powerSinSeries(t0, t1, b0, b1, k float64) float64 {
	L := math.Log(t1 / t0)
	p0, p1 := t0*t0, t1*t1 // t^(m+1) for m = 1
	var s float64
	for j, c := range sinSeries {
		m := float64(2*j + 1)
		e := k + m + 1
		var term float64
		if x := e * L; math.Abs(x) > 1e-4 {
			term = (b1*p1 - b0*p0) / e
		} else {
			term = b0 * p0 * L * (1 + x/2 + x*x/6)
		}
		s += c * term
		p0 *= t0 * t0
		p1 *= t1 * t1
	}
	return s
}

// interp returns y(xq) by linear interpolation on ascending x; xq must lie
// within [x[0], x[len-1]].
func interp(x, y []float64, xq float64) float64 {
	n := len(x)
	if n == 1 || xq <= x[0] {
		return y[0]
	}
	if xq >= x[n-1] {
		return y[n-1]
	}
	i := sort.SearchFloat64s(x, xq)
	if x[i] == xq {
		return y[i]
	}
	f := (xq - x[i-1]) / (x[i] - x[i-1])
	return y[i-1] + f*(y[i]-y[i-1])
}
