package mie

import (
	"fmt"
	"math"
	"math/cmplx"
)

// Coated computes the series coefficients and efficiencies of a concentric
// coated sphere: a core of size parameter xCore and relative index mCore
// inside a shell whose outer size parameter is x and index mShell (both
// indices relative to the medium). It fills every field except Qbb.
// xCore = 0 is a homogeneous sphere of the shell material; xCore = x is a
// homogeneous sphere of the core material.
//
// Theory: Aden & Kerker (1951, J. Appl. Phys. 22:1242). Algorithm: the
// recursive form of Yang (2003, Appl. Opt. 42:1710, eqs. 13–20), which works
// only with logarithmic derivatives D1 = ψ'/ψ, D3 = ξ'/ξ and the ratio
// Q_n = [ψ_n/ξ_n](m2·x1) / [ψ_n/ξ_n](m2·x2), all bounded for absorbing
// shells, and so avoids the overflow of the Riccati–Bessel functions of
// complex argument that limits Bohren & Huffman's BHCOAT (Toon & Ackerman
// 1981, Appl. Opt. 20:3657, discuss the same instability). Same domain as
// Sphere.
func (s *Solver) Coated(xCore, x float64, mCore, mShell complex128) (Efficiencies, error) {
	s.valid = false
	if err := validate("shell size parameter x", x, "shell index", mShell); err != nil {
		return Efficiencies{}, err
	}
	if err := validateIndex("core index", mCore); err != nil {
		return Efficiencies{}, err
	}
	if math.IsNaN(xCore) || xCore < 0 || xCore > x {
		return Efficiencies{}, fmt.Errorf("mie: core size parameter %g is outside [0, %g] (must not exceed the shell's)", xCore, x)
	}
	if xCore < MinSizeParameter*1e-6 {
		return s.Sphere(x, mShell)
	}
	nstop := seriesLength(x)
	z1c := mCore * complex(xCore, 0) // m1·x1
	z1 := mShell * complex(xCore, 0) // m2·x1
	z2 := mShell * complex(x, 0)     // m2·x2
	s.dc = grow(s.dc, nstop+1)
	s.d2 = grow(s.d2, nstop+1)
	s.d = grow(s.d, nstop+1)
	s.hb = grow(s.hb, nstop+1)
	logDerivative(s.dc, nstop, z1c)
	logDerivative(s.d2, nstop, z1)
	logDerivative(s.d, nstop, z2)

	// Upward recurrences (Yang 2003, eqs. 15–18), BH convention
	// ξ_n(z) = z·h_n^(1)(z): ψ_0ξ_0 = (1 − e^{2iz})/2, D3_0 = i,
	// ψ_nξ_n = ψ_{n−1}ξ_{n−1}·(ψ_n/ψ_{n−1})(ξ_n/ξ_{n−1}),
	// D3_n = D1_n + i/(ψ_nξ_n). The ratio ψ_n/ψ_{n−1} is taken as
	// 1/(D1_n + n/z) rather than Yang's n/z − D1_{n−1}, which cancels
	// catastrophically for |z| ≪ n (a vanishing core); ξ_n/ξ_{n−1} =
	// n/z − D3_{n−1} has no such cancellation.
	px1 := -expm1i2(z1) / 2
	px2 := -expm1i2(z2) / 2
	q := cmplx.Exp(2i*(z2-z1)) * expm1i2(z1) / expm1i2(z2)
	d31, d32 := complex(0, 1), complex(0, 1) // D3_{n−1}(z1), D3_{n−1}(z2)
	for n := 1; n <= nstop; n++ {
		fn := complex(float64(n), 0)
		d1z1, d1z2 := s.d2[n], s.d[n] // D1_n
		rp1, rp2 := 1/(d1z1+fn/z1), 1/(d1z2+fn/z2)
		rx1, rx2 := fn/z1-d31, fn/z2-d32
		px1 *= rp1 * rx1
		px2 *= rp2 * rx2
		q *= rp1 / rx1 * rx2 / rp2
		d3z1 := d1z1 + 1i/px1
		d3z2 := d1z2 + 1i/px2
		core := s.dc[n]
		g1 := mShell*core - mCore*d1z1
		g2 := mShell*core - mCore*d3z1
		ha := (g2*d1z2 - q*g1*d3z2) / (g2 - q*g1)
		h1 := mCore*core - mShell*d1z1
		h2 := mCore*core - mShell*d3z1
		hb := (h2*d1z2 - q*h1*d3z2) / (h2 - q*h1)
		s.hb[n] = hb
		d31, d32 = d3z1, d3z2
		// D1_{n−1}(z1) has been used for the last time: park H^a_n there.
		s.d2[n-1] = ha
	}
	// Move H^a into s.d at index n (finish reads ha[n]).
	for n := nstop; n >= 1; n-- {
		s.d[n] = s.d2[n-1]
	}
	absorbing := imag(mCore) > 0 || imag(mShell) > 0
	return s.finish(x, mShell, s.d, s.hb, nstop, absorbing)
}

// expm1i2 returns e^{2iz} − 1 without cancellation for small |z|.
func expm1i2(z complex128) complex128 {
	a, b := real(z), imag(z)
	e := math.Expm1(-2 * b) // e^{−2b} − 1
	s2a, c2a := math.Sincos(2 * a)
	sa := math.Sin(a)
	// e^{−2b}·cos 2a − 1 = (e^{−2b} − 1)·cos 2a − 2 sin² a
	return complex(e*c2a-2*sa*sa, (e+1)*s2a)
}

// Coated solves a coated sphere with a fresh Solver and also fills Qbb.
func Coated(xCore, x float64, mCore, mShell complex128) (Efficiencies, error) {
	var s Solver
	e, err := s.Coated(xCore, x, mCore, mShell)
	if err != nil {
		return e, err
	}
	e.Qbb = s.BackHemisphere()
	return e, nil
}
