package optics

import (
	"fmt"
	"math"
	"math/cmplx"
)

// AnomalousDiffraction returns the extinction and absorption efficiencies
// of a sphere of size parameter x and relative index m = n + ik in van de
// Hulst's (1957, Light Scattering by Small Particles, Wiley, §11.2 and
// §11.22) anomalous-diffraction approximation:
//
//	Q_ext = 4·Re K(w),  w = 2x(k − i(n − 1)),
//	Q_abs = 2·K(4xk),
//	K(w)  = ½ + e^(−w)/w + (e^(−w) − 1)/w²,
//
// which for k = 0 is Q_ext = 2 − (4/ρ)·sin ρ + (4/ρ²)(1 − cos ρ), ρ = 2x(n−1).
// Near w = 0 the series K = w/3 − w²/8 + w³/30 − w⁴/144 avoids cancellation.
//
// Valid for x ≫ 1 and |m − 1| ≪ 1 (rays cross the sphere undeviated): the
// error in Q_ext is a few per cent for x ≳ 20 and |m − 1| ≲ 0.1, and the
// method gives no backscattering (van de Hulst 1957). Errors for x ≤ 0,
// non-finite input or k < 0.
func AnomalousDiffraction(x float64, m complex128) (qext, qabs float64, err error) {
	if !(x > 0) || math.IsInf(x, 0) || cmplx.IsNaN(m) || cmplx.IsInf(m) || imag(m) < 0 {
		return 0, 0, fmt.Errorf("optics: anomalous diffraction needs x > 0 and finite m with k ≥ 0 (got x = %g, m = %v)", x, m)
	}
	n, k := real(m), imag(m)
	w := complex(2*x*k, -2*x*(n-1))
	qext = 4 * real(kFunc(w))
	qabs = 2 * real(kFunc(complex(4*x*k, 0)))
	return qext, qabs, nil
}

// kFunc is van de Hulst's K(w).
func kFunc(w complex128) complex128 {
	if cmplx.Abs(w) < 1e-2 {
		return w * (1.0/3 + w*(-1.0/8+w*(1.0/30-w/144)))
	}
	e := cmplx.Exp(-w)
	return 0.5 + e/w + (e-1)/(w*w)
}
