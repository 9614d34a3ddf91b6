package mie

import "math"

// Element holds the four independent scattering-matrix elements of a sphere
// (Bohren & Huffman 1983, eq. 4.77), unnormalised:
// S11 = (|S2|²+|S1|²)/2, S12 = (|S2|²−|S1|²)/2, S33 = Re(S2·S1*),
// S34 = Im(S2·S1*). The degree of linear polarisation of scattered
// unpolarised light is −S12/S11.
type Element struct{ S11, S12, S33, S34 float64 }

// angTerm holds the per-term constants of the angular sums for the particle
// held: A_n = (2n+1)/(n(n+1))·a_n, B_n likewise, and the coefficients of
// the π_n recurrence, so that the loop over terms has no division.
type angTerm struct {
	ar, ai, br, bi float64 // A_n, B_n
	n, n1          float64 // n, n+1
	c1, c2         float64 // (2n+1)/n, (n+1)/n
}

// prepareAngular fills s.ang once per particle.
func (s *Solver) prepareAngular() {
	if s.angReady {
		return
	}
	s.ang = grow(s.ang, s.n)
	for n := 1; n <= s.n; n++ {
		fn := float64(n)
		f := (2*fn + 1) / (fn * (fn + 1))
		a, b := s.a[n-1], s.b[n-1]
		s.ang[n-1] = angTerm{f * real(a), f * imag(a), f * real(b), f * imag(b), fn, fn + 1, (2*fn + 1) / fn, (fn + 1) / fn}
	}
	s.angReady = true
}

// angularSums evaluates S1 and S2 at mu = cos θ from the held coefficients
// with the angular functions π_n, τ_n by upward recurrence
// (Bohren & Huffman 1983, eqs. 4.46–4.47), which is stable.
func (s *Solver) angularSums(mu float64) (s1, s2 complex128) {
	s.prepareAngular()
	pi0, pi1 := 0.0, 1.0
	var s1r, s1i, s2r, s2i float64
	for i := range s.ang {
		t := &s.ang[i]
		mp := mu * pi1
		tau := t.n*mp - t.n1*pi0
		s1r += t.ar*pi1 + t.br*tau
		s1i += t.ai*pi1 + t.bi*tau
		s2r += t.ar*tau + t.br*pi1
		s2i += t.ai*tau + t.bi*pi1
		// c1·μ does not depend on π, so the recurrence's critical path is
		// one multiply and one subtract per term.
		pi0, pi1 = pi1, (t.c1*mu)*pi1-t.c2*pi0
	}
	return complex(s1r, s1i), complex(s2r, s2i)
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
