package mie

import (
	"math"
	"sync"

	"gonum.org/v1/gonum/integrate/quad"
)

// Element holds the four independent scattering-matrix elements of a sphere
// (Bohren & Huffman 1983, eq. 4.77), unnormalised:
// S11 = (|S2|²+|S1|²)/2, S12 = (|S2|²−|S1|²)/2, S33 = Re(S2·S1*),
// S34 = Im(S2·S1*). The degree of linear polarisation of scattered
// unpolarised light is −S12/S11.
type Element struct{ S11, S12, S33, S34 float64 }

// angularSums evaluates S1 and S2 at mu = cos θ from the held coefficients
// with the angular functions π_n, τ_n by upward recurrence
// (Bohren & Huffman 1983, eqs. 4.46–4.47), which is stable.
func (s *Solver) angularSums(mu float64) (s1, s2 complex128) {
	pi0, pi1 := 0.0, 1.0
	for n := 1; n <= s.n; n++ {
		fn := float64(n)
		tau := fn*mu*pi1 - (fn+1)*pi0
		f := complex((2*fn+1)/(fn*(fn+1)), 0)
		an, bn := s.a[n-1]*f, s.b[n-1]*f
		s1 += an*complex(pi1, 0) + bn*complex(tau, 0)
		s2 += an*complex(tau, 0) + bn*complex(pi1, 0)
		pi0, pi1 = pi1, ((2*fn+1)*mu*pi1-(fn+1)*pi0)/fn
	}
	return s1, s2
}

func (s *Solver) mustHold() {
	if !s.valid {
		panic("mie: no particle solved; call Sphere or Coated first and check its error")
	}
}

// Amplitudes fills s1[i], s2[i] with the amplitude functions S1, S2
// (Bohren & Huffman 1983, eq. 4.74; exp(−iωt) convention, so they are the
// complex conjugates of Wiscombe's) at mu[i] = cos θ_i for the last particle
// solved. It panics if the slices differ in length or no particle is held.
func (s *Solver) Amplitudes(mu []float64, s1, s2 []complex128) {
	s.mustHold()
	if len(s1) != len(mu) || len(s2) != len(mu) {
		panic("mie: Amplitudes slice lengths differ")
	}
	for i, m := range mu {
		s1[i], s2[i] = s.angularSums(m)
	}
}

// Matrix fills dst[i] with the scattering-matrix elements at mu[i].
func (s *Solver) Matrix(mu []float64, dst []Element) {
	s.mustHold()
	if len(dst) != len(mu) {
		panic("mie: Matrix slice lengths differ")
	}
	for i, m := range mu {
		a, b := s.angularSums(m)
		dst[i] = element(a, b)
	}
}

func element(s1, s2 complex128) Element {
	i1 := real(s1)*real(s1) + imag(s1)*imag(s1)
	i2 := real(s2)*real(s2) + imag(s2)*imag(s2)
	c := s2 * complex(real(s1), -imag(s1))
	return Element{S11: (i1 + i2) / 2, S12: (i2 - i1) / 2, S33: real(c), S34: imag(c)}
}

// PhaseFunction fills dst[i] with the normalised phase function
// p(θ) = S11/(π·x²·Qsca) in sr⁻¹ at mu[i], so that ∫p dΩ = 1. It is zero
// everywhere when the particle does not scatter.
func (s *Solver) PhaseFunction(mu []float64, dst []float64) {
	s.mustHold()
	if len(dst) != len(mu) {
		panic("mie: PhaseFunction slice lengths differ")
	}
	norm := math.Pi * s.x * s.x * s.qsca
	for i, m := range mu {
		a, b := s.angularSums(m)
		if norm == 0 {
			dst[i] = 0
			continue
		}
		dst[i] = element(a, b).S11 / norm
	}
}

// VolumeScattering fills dst[i] with the volume scattering function
// β(θ) = N·S11(θ)/k² (m⁻¹ sr⁻¹) at mu[i] of numberDensity N particles per m³
// like the last one solved, with wavenumber k = 2π·nMedium/λ0 in the medium
// (λ0 the vacuum wavelength in metres) (Bohren & Huffman 1983, eq. 3.16).
func (s *Solver) VolumeScattering(mu []float64, numberDensity, vacuumWavelength, mediumIndex float64, dst []float64) {
	s.mustHold()
	if len(dst) != len(mu) {
		panic("mie: VolumeScattering slice lengths differ")
	}
	k := 2 * math.Pi * mediumIndex / vacuumWavelength
	f := numberDensity / (k * k)
	for i, m := range mu {
		a, b := s.angularSums(m)
		dst[i] = f * element(a, b).S11
	}
}

// backTerm packs the constants of term n of the back-hemisphere sum in one
// cache line: (A_n ± B_n) with A_n = (2n+1)/(n(n+1))·a_n and the
// coefficients of the π_n recurrence.
type backTerm struct {
	pr, pi float64 // A_n + B_n
	mr, mi float64 // A_n − B_n
	n, n1  float64 // n, n+1
	c1, c2 float64 // (2n+1)/n, (n+1)/n
}

// BackHemisphere returns the hemispherical backscattering efficiency
// Qbb = (1/x²)·∫_{−1}^{0} (|S1|² + |S2|²) dμ of the last particle solved.
//
// Method: |S1|²+|S2|² is a polynomial of degree 2N in μ = cos θ for a series
// of N terms, so Gauss–Legendre quadrature with N+1 nodes on [−1, 0] is exact
// (up to rounding). Nodes come from the iteration-free formulas of Bogaert
// (2014, SIAM J. Sci. Comput. 36:A1008) via gonum, are computed once per node
// count and shared; node counts are rounded up to a geometric ladder (ratio
// 1.0625) so that a size sweep reuses a few node sets. The sum is evaluated
// with S1 ± S2 = Σ (A_n ± B_n)(π_n ± τ_n), halving the multiplications, and
// four nodes advance together so their independent recurrences overlap in
// the processor. Cost is O(N²): about 2·N² multiply–adds.
func (s *Solver) BackHemisphere() float64 {
	s.mustHold()
	nodes := backNodes(s.n + 1)
	s.terms = grow(s.terms, s.n)
	for n := 1; n <= s.n; n++ {
		fn := float64(n)
		f := complex((2*fn+1)/(fn*(fn+1)), 0)
		a, b := s.a[n-1]*f, s.b[n-1]*f
		p, m := a+b, a-b
		s.terms[n-1] = backTerm{real(p), imag(p), real(m), imag(m), fn, fn + 1, (2*fn + 1) / fn, (fn + 1) / fn}
	}
	var sum float64
	mu, w := nodes.mu, nodes.w
	j := 0
	for ; j+4 <= len(mu); j += 4 {
		sum += hemi4(s.terms, mu[j:j+4:j+4], w[j:j+4:j+4])
	}
	for ; j < len(mu); j++ {
		sum += hemi1(s.terms, mu[j], w[j])
	}
	return sum / (s.x * s.x)
}

// hemi1 returns w·(|S1|²+|S2|²) at one node.
func hemi1(terms []backTerm, mu, w float64) float64 {
	pi0, pi1 := 0.0, 1.0
	var pr, pim, mr, mim float64
	for i := range terms {
		t := &terms[i]
		mp := mu * pi1
		tau := t.n*mp - t.n1*pi0
		u, v := pi1+tau, pi1-tau
		pr += t.pr * u
		pim += t.pi * u
		mr += t.mr * v
		mim += t.mi * v
		pi0, pi1 = pi1, t.c1*mp-t.c2*pi0
	}
	return w * (pr*pr + pim*pim + mr*mr + mim*mim) / 2
}

// hemi4 is hemi1 for four nodes at once.
func hemi4(terms []backTerm, mu, w []float64) float64 {
	m0, m1, m2, m3 := mu[0], mu[1], mu[2], mu[3]
	var a0, a1, a2, a3 float64 = 0, 0, 0, 0 // π_{n−1}
	var b0, b1, b2, b3 float64 = 1, 1, 1, 1 // π_n
	var pr0, pi0, mr0, mi0 float64
	var pr1, pi1, mr1, mi1 float64
	var pr2, pi2, mr2, mi2 float64
	var pr3, pi3, mr3, mi3 float64
	for i := range terms {
		t := &terms[i]
		p0, p1, p2, p3 := m0*b0, m1*b1, m2*b2, m3*b3
		t0, t1, t2, t3 := t.n*p0-t.n1*a0, t.n*p1-t.n1*a1, t.n*p2-t.n1*a2, t.n*p3-t.n1*a3
		u0, v0 := b0+t0, b0-t0
		u1, v1 := b1+t1, b1-t1
		u2, v2 := b2+t2, b2-t2
		u3, v3 := b3+t3, b3-t3
		pr0 += t.pr * u0
		pi0 += t.pi * u0
		mr0 += t.mr * v0
		mi0 += t.mi * v0
		pr1 += t.pr * u1
		pi1 += t.pi * u1
		mr1 += t.mr * v1
		mi1 += t.mi * v1
		pr2 += t.pr * u2
		pi2 += t.pi * u2
		mr2 += t.mr * v2
		mi2 += t.mi * v2
		pr3 += t.pr * u3
		pi3 += t.pi * u3
		mr3 += t.mr * v3
		mi3 += t.mi * v3
		a0, b0 = b0, t.c1*p0-t.c2*a0
		a1, b1 = b1, t.c1*p1-t.c2*a1
		a2, b2 = b2, t.c1*p2-t.c2*a2
		a3, b3 = b3, t.c1*p3-t.c2*a3
	}
	return (w[0]*(pr0*pr0+pi0*pi0+mr0*mr0+mi0*mi0) +
		w[1]*(pr1*pr1+pi1*pi1+mr1*mr1+mi1*mi1) +
		w[2]*(pr2*pr2+pi2*pi2+mr2*mr2+mi2*mi2) +
		w[3]*(pr3*pr3+pi3*pi3+mr3*mr3+mi3*mi3)) / 2
}

// nodeSet is a Gauss–Legendre rule on [−1, 0].
type nodeSet struct{ mu, w []float64 }

var (
	nodeMu    sync.Mutex
	nodeCache = map[int]nodeSet{}
)

// backNodes returns a Gauss–Legendre rule on [−1, 0] with at least n nodes,
// from a shared cache.
func backNodes(n int) nodeSet {
	size := 8
	for size < n {
		size = max(size+1, int(math.Ceil(float64(size)*1.0625)))
	}
	nodeMu.Lock()
	defer nodeMu.Unlock()
	if ns, ok := nodeCache[size]; ok {
		return ns
	}
	ns := nodeSet{make([]float64, size), make([]float64, size)}
	quad.Legendre{}.FixedLocations(ns.mu, ns.w, -1, 0)
	nodeCache[size] = ns
	return ns
}
