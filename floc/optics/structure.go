package optics

import (
	"fmt"
	"math"
)

// StructureFactor selects the form of the structure factor S(q) of a
// fractal aggregate, the Fourier transform of its pair-correlation function
// normalised to S(0) = 1, with q = 2k·sin(θ/2) the scattering wavevector.
// Each form depends only on u = q·R_g and the fractal dimension D_f, tends to
// 1 − u²/3 as u → 0 (Guinier 1939) and falls as u^(−D_f) for u ≫ 1. The forms
// follow from different cut-off functions of the pair correlation at the
// aggregate's edge; Sorensen (2001, Aerosol Sci. Technol. 35:648–687, §4)
// reviews them.
type StructureFactor int

const (
	// FisherBurford is S = (1 + 2u²/(3D_f))^(−D_f/2) (Fisher & Burford
	// 1967, Phys. Rev. 156:583), the smooth interpolation between the Guinier
	// and power-law regimes that Sorensen (2001) recommends as a close
	// approximation to the Gaussian cut-off. The zero value and default.
	FisherBurford StructureFactor = iota
	// DobbinsMegaridis is the piecewise form of the Gaussian cut-off used
	// by Dobbins & Megaridis (1991, Appl. Opt. 30:4747): exp(−u²/3) for
	// u² ≤ 3D_f/2, and (3D_f/(2e))^(D_f/2)·u^(−D_f) beyond (continuous at the
	// junction).
	DobbinsMegaridis
	// ExponentialCutoff is the closed form for an exponential cut-off
	// (Sorensen 2001, from memory): S = sin[(D_f−1)·atan(qξ)] /
	// [(D_f−1)·qξ·(1+q²ξ²)^((D_f−1)/2)] with R_g² = D_f(D_f+1)ξ²/2 (the
	// tests confirm its Guinier limit). At D_f = 3 its tail falls as u⁻⁴.
	ExponentialCutoff
)

// String returns the form's name.
func (s StructureFactor) String() string {
	switch s {
	case FisherBurford:
		return "fisher-burford"
	case DobbinsMegaridis:
		return "dobbins-megaridis"
	case ExponentialCutoff:
		return "exponential"
	}
	return fmt.Sprintf("StructureFactor(%d)", int(s))
}

// ParseStructureFactor accepts the names printed by String.
func ParseStructureFactor(name string) (StructureFactor, error) {
	for _, s := range []StructureFactor{FisherBurford, DobbinsMegaridis, ExponentialCutoff} {
		if s.String() == name {
			return s, nil
		}
	}
	return 0, fmt.Errorf("optics: unknown structure factor %q (allowed: fisher-burford, dobbins-megaridis, exponential)", name)
}

// Value returns S(u) for u = q·R_g ≥ 0 and fractal dimension df in (1, 3].
// Special cases: S(0) = 1; u = +Inf gives 0. The caller validates df.
func (s StructureFactor) Value(u, df float64) float64 {
	if u == 0 {
		return 1
	}
	if math.IsInf(u, 1) {
		return 0
	}
	switch s {
	case DobbinsMegaridis:
		u2 := u * u
		if u2 <= 1.5*df {
			return math.Exp(-u2 / 3)
		}
		return math.Pow(1.5*df/math.E/u2, df/2)
	case ExponentialCutoff:
		xi := u * math.Sqrt(2/(df*(df+1)))
		a := df - 1
		if xi < 1e-4 {
			// Series to O(ξ⁴) avoids cancellation: S = 1 − (a+1)(a+2)ξ²/6 + …
			// (from the expansion of the closed form; Guinier at this order).
			return 1 - (a+1)*(a+2)*xi*xi/6
		}
		return math.Sin(a*math.Atan(xi)) / (a * xi * math.Pow(1+xi*xi, a/2))
	default:
		return math.Pow(1+2*u*u/(3*df), -df/2)
	}
}
