package psd

import (
	"fmt"
	"math"
)

// powInt returns ∫_a^b D^(p-1) dD for 0 < a ≤ b, stable as p → 0 (where it
// tends to ln(b/a)).
func powInt(a, b, p float64) float64 {
	if b <= a {
		return 0
	}
	L := math.Log(b / a)
	t := p * L
	if math.Abs(t) < 1e-8 {
		return math.Pow(a, p) * L * (1 + t/2)
	}
	return math.Pow(a, p) * math.Expm1(t) / p
}

// PowerLaw is the Junge (power-law) distribution n(D) = K·D^-Slope on
// [Min, Max], with K chosen so that the total number concentration is N
// (Junge 1963). The zero value is invalid.
type PowerLaw struct {
	N     float64 // total number concentration, m⁻³, ≥ 0
	Slope float64 // Junge slope ξ of the number density (dimensionless), finite; natural waters 3–5
	Min   float64 // smallest diameter, m, > 0
	Max   float64 // largest diameter, m, > Min
}

// Validate implements Validator.
func (p PowerLaw) Validate() error {
	if !(p.N >= 0) || math.IsInf(p.N, 0) {
		return fmt.Errorf("psd: PowerLaw.N = %g m-3, want a finite value ≥ 0 m-3", p.N)
	}
	if math.IsNaN(p.Slope) || math.IsInf(p.Slope, 0) || math.Abs(p.Slope) > 20 {
		return fmt.Errorf("psd: PowerLaw.Slope = %g, want -20 ≤ ξ ≤ 20", p.Slope)
	}
	return checkRange("PowerLaw [Min, Max]", p.Min, p.Max)
}

// K returns the coefficient K (m^(ξ-4)) of n(D) = K·D^-ξ.
func (p PowerLaw) K() float64 { return p.N / powInt(p.Min, p.Max, 1-p.Slope) }

// Density implements Distribution.
func (p PowerLaw) Density(d float64) float64 {
	if d < p.Min || d > p.Max {
		return 0
	}
	return p.K() * math.Pow(d, -p.Slope)
}

// Range implements Distribution.
func (p PowerLaw) Range() (float64, float64) { return p.Min, p.Max }

// PartialMoment implements PartialMomenter (closed form).
func (p PowerLaw) PartialMoment(k, lo, hi float64) float64 {
	lo, hi = math.Max(lo, p.Min), math.Min(hi, p.Max)
	if !(hi > lo) {
		return 0
	}
	return p.K() * powInt(lo, hi, k+1-p.Slope)
}

// Lognormal is the log-normal distribution by number (Hatch & Choate 1929):
//
//	n(D) = N / (√(2π) D ln σg) · exp(−(ln D − ln Dg)² / (2 ln² σg))
//
// with count median diameter Dg = Median and geometric standard deviation
// σg = GSD. Its moments are M_k = N·Dg^k·exp(k² ln²σg / 2) (the Hatch–Choate
// relations). Range truncates the support where every moment up to k = 4
// has lost less than 1e-12 of its value (7 or more standard deviations
// beyond the centre of the k = 4 integrand).
type Lognormal struct {
	N      float64 // total number concentration, m⁻³, ≥ 0
	Median float64 // count median diameter Dg, m, > 0
	GSD    float64 // geometric standard deviation σg, dimensionless, 1 < σg ≤ 10
}

// LognormalByVolume returns the log-normal whose VOLUME distribution has
// median vmd (m) and geometric standard deviation gsd, holding n total
// particles per m³: by Hatch & Choate (1929) the volume distribution of a
// log-normal is log-normal with the same σg and median Dg·exp(3 ln²σg).
func LognormalByVolume(n, vmd, gsd float64) (Lognormal, error) {
	l := Lognormal{N: n, Median: vmd, GSD: gsd}
	if err := l.Validate(); err != nil {
		return Lognormal{}, err
	}
	s := math.Log(gsd)
	l.Median = vmd * math.Exp(-3*s*s)
	return l, l.Validate()
}

// Validate implements Validator.
func (l Lognormal) Validate() error {
	if !(l.N >= 0) || math.IsInf(l.N, 0) {
		return fmt.Errorf("psd: Lognormal.N = %g m-3, want a finite value ≥ 0 m-3", l.N)
	}
	if !(l.Median > 0) || math.IsInf(l.Median, 0) {
		return fmt.Errorf("psd: Lognormal.Median = %g m, want a finite value > 0 m", l.Median)
	}
	if !(l.GSD > 1 && l.GSD <= 10) {
		return fmt.Errorf("psd: Lognormal.GSD = %g, want 1 < σg ≤ 10", l.GSD)
	}
	return nil
}

// Density implements Distribution.
func (l Lognormal) Density(d float64) float64 {
	lo, hi := l.Range()
	if d < lo || d > hi {
		return 0
	}
	s := math.Log(l.GSD)
	z := (math.Log(d) - math.Log(l.Median)) / s
	return l.N / (math.Sqrt(2*math.Pi) * d * s) * math.Exp(-0.5*z*z)
}

// Range implements Distribution.
func (l Lognormal) Range() (float64, float64) {
	s := math.Log(l.GSD)
	w := s * math.Max(10, 4*s+7)
	return l.Median * math.Exp(-w), l.Median * math.Exp(w)
}

// normalInterval returns Φ(b) − Φ(a) for a ≤ b without cancellation in
// either tail.
func normalInterval(a, b float64) float64 {
	if a > 0 {
		return 0.5 * (math.Erfc(a/math.Sqrt2) - math.Erfc(b/math.Sqrt2))
	}
	if b < 0 {
		return 0.5 * (math.Erfc(-b/math.Sqrt2) - math.Erfc(-a/math.Sqrt2))
	}
	return 1 - 0.5*(math.Erfc(-a/math.Sqrt2)+math.Erfc(b/math.Sqrt2))
}

// PartialMoment implements PartialMomenter in closed form:
// ∫_lo^hi D^k n dD = N Dg^k e^(k²s²/2) [Φ(z_hi) − Φ(z_lo)],
// z = (ln D − ln Dg − k s²)/s, s = ln σg, clipped to Range.
func (l Lognormal) PartialMoment(k, lo, hi float64) float64 {
	rlo, rhi := l.Range()
	lo, hi = math.Max(lo, rlo), math.Min(hi, rhi)
	if !(hi > lo) {
		return 0
	}
	s := math.Log(l.GSD)
	mu := math.Log(l.Median) + k*s*s
	za := (math.Log(lo) - mu) / s
	zb := (math.Log(hi) - mu) / s
	return l.N * math.Pow(l.Median, k) * math.Exp(0.5*k*k*s*s) * normalInterval(za, zb)
}
