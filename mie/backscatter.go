package mie

import (
	"math"
	"math/bits"
	"sync"
)

// The hemispherical backscattering efficiency
//
//	Qbb = (1/x²)·∫_{−1}^{0} (|S1|² + |S2|²) dμ,  μ = cos θ,
//
// is computed exactly in O(N log N) for a series of N terms, as follows.
//
// With u_n = π_n + τ_n and v_n = π_n − τ_n, S1 ± S2 = Σ_n c_n^± w_n with
// c_n^± = (2n+1)/(n(n+1))·(a_n ± b_n) and w_n = u_n or v_n, and
// |S1|²+|S2|² = ½(|S1+S2|² + |S1−S2|²). The functions u_n and v_n are
// n(n+1) times the Wigner functions d^n_{1,1}(θ) and d^n_{1,−1}(θ) (up to
// sign), which satisfy the Sturm–Liouville equations
//
//	((1−μ²) y')' + [n(n+1) − 2/(1 ± μ)] y = 0
//
// (Edmonds 1957, Angular Momentum in Quantum Mechanics, eq. 4.1.22;
// the angular functions π_n, τ_n of Bohren & Huffman 1983, eq. 4.46). For two
// solutions of different degree, Green's identity over [−1, 0], where
// 1 − μ² vanishes at −1, gives the half-range overlap in closed form:
//
//	J_nm = ∫_{−1}^{0} w_n w_m dμ = (w_n(0) w_m'(0) − w_m(0) w_n'(0)) / ((n−m)(n+m+1)),
//
// and the values and slopes at μ = 0 follow from P_n(0) and P_n'(0) through
// Legendre's equation. The double sum Σ_nm c_n c_m* J_nm then splits, by
// 1/((m−n)(m+n+1)) = [1/(m−n) + 1/(m+n+1)]/(2m+1), into one discrete
// Hilbert-kernel convolution over an index set extended by n → −n−1, which an
// FFT evaluates (fft.go). The diagonal J_nn come from the
// three-term recurrence of d^n_{1,±1} (Edmonds 1957, eq. 4.1.23 form) written
// in terms of the off-diagonal J, and J^u_nn + J^v_nn = 2n²(n+1)²/(2n+1), the
// full-range norm (Bohren & Huffman 1983, eq. 4.59).
//
// Accuracy: exact up to rounding; tests compare with Gauss–Legendre
// quadrature of N+1 nodes (itself exact for this polynomial integrand) on
// the extended-precision oracle's coefficients. The universal per-degree
// constants are computed once per process and shared.

// hemiConsts holds the per-degree constants, index n = 0..nmax (n = 0 unused).
type hemiConsts struct {
	uu, wu []float64 // u_n(0), u_n'(0)
	uv, wv []float64 // v_n(0), v_n'(0)
	du, dv []float64 // ∫_{−1}^{0} u_n², ∫_{−1}^{0} v_n²
	inv    []float64 // 1/k, k = 0..2·nmax+2 (inv[0] unused)
}

var (
	hemiMu     sync.Mutex
	hemiShared hemiConsts
	kernelMu   sync.Mutex
	kernelFFT  = map[int][]complex128{} // spectrum of the Hilbert kernel per FFT length
)

// constsFor returns constants valid at least up to degree n.
func constsFor(n int) hemiConsts {
	hemiMu.Lock()
	defer hemiMu.Unlock()
	if len(hemiShared.du) > n {
		return hemiShared
	}
	size := max(2*n, 256)
	hemiShared = newHemiConsts(size)
	return hemiShared
}

func newHemiConsts(nmax int) hemiConsts {
	// Values and slopes run one degree further than the diagonal, which
	// the recurrence needs.
	c := hemiConsts{
		uu: make([]float64, nmax+2), wu: make([]float64, nmax+2),
		uv: make([]float64, nmax+2), wv: make([]float64, nmax+2),
		du: make([]float64, nmax+1), dv: make([]float64, nmax+1),
	}
	// e_n = P_n(0) by e_n = −(n−1)/n·e_{n−2}; o_n = P_n'(0) = n·e_{n−1}
	// (Abramowitz & Stegun 1964, eqs. 8.6.1, 22.7.10). With L = n(n+1),
	// π_n(0) = o_n, π_n'(0) = −L e_n, π_n''(0) = (2 − L) o_n from Legendre's
	// equation, and τ_n = μπ_n − (1−μ²)π_n'.
	ePrev, eCur := 1.0, 0.0 // e_{n−1}, e_n for n = 1
	for n := 1; n <= nmax+1; n++ {
		if n > 1 {
			ePrev, eCur = eCur, -float64(n-1)/float64(n)*ePrev
		}
		fn := float64(n)
		l := fn * (fn + 1)
		o := fn * ePrev
		e := eCur
		c.uu[n] = o + l*e
		c.wu[n] = -l*e + (l-1)*o
		c.uv[n] = o - l*e
		c.wv[n] = -l*e + (1-l)*o
	}
	c.recurDiagonal(nmax)
	c.inv = make([]float64, 2*nmax+3)
	for k := 1; k < len(c.inv); k++ {
		c.inv[k] = 1 / float64(k)
	}
	return c
}

// overlap returns J_nm for n ≠ m of the family with values w0 and slopes w1.
func overlap(w0, w1 []float64, n, m int) float64 {
	if n == 0 || m == 0 {
		return 0
	}
	return (w0[n]*w1[m] - w0[m]*w1[n]) / (float64(n-m) * float64(m+n+1))
}

// recurDiagonal fills du with ∫_{−1}^{0} u_n² using the three-term
// recurrence u_{n+1} = (α_n μ + β_n) u_n − γ_n u_{n−1}, with
// α_n = (n+1)(2n+1)/n², β_n = −(2n+1)/n³, γ_n = (n+1)³/n³ (the recurrence of
// d^n_{1,1} rescaled by n(n+1)); then dv from the full-range norm.
func (c *hemiConsts) recurDiagonal(nmax int) {
	alpha := func(n int) float64 { f := float64(n); return (f + 1) * (2*f + 1) / (f * f) }
	beta := func(n int) float64 { f := float64(n); return -(2*f + 1) / (f * f * f) }
	gamma := func(n int) float64 { f := float64(n); return (f + 1) * (f + 1) * (f + 1) / (f * f * f) }
	j := func(n, m int) float64 { return overlap(c.uu, c.wu, n, m) }
	c.du[1] = 1.0 / 3 // ∫_{−1}^{0} (1+μ)² dμ
	for n := 1; n < nmax; n++ {
		c.du[n+1] = alpha(n)/alpha(n+1)*(j(n, n+2)-beta(n+1)*j(n, n+1)+gamma(n+1)*c.du[n]) +
			beta(n)*j(n, n+1) - gamma(n)*j(n-1, n+1)
	}
	for n := 1; n <= nmax; n++ {
		fn := float64(n)
		l := fn * (fn + 1)
		c.dv[n] = 2*l*l/(2*fn+1) - c.du[n]
	}
}

// fftLength returns the smallest power of two ≥ n.
func fftLength(n int) int { return 1 << bits.Len(uint(n-1)) }

// maxDegree is the largest series length an FFT of length l serves:
// the convolution needs kernel offsets d ∈ [−(N−1), 2N+1], 3N+1 distinct
// residues, so l ≥ 3N+2.
func maxDegree(l int) int { return (l - 2) / 3 }

// hilbertSpectrum returns the DFT of the circular kernel k[d mod l] = 1/d
// for d ∈ [−(M−1), 2M+1] \ {0}, M = maxDegree(l), shared per l.
func hilbertSpectrum(l int) []complex128 {
	kernelMu.Lock()
	defer kernelMu.Unlock()
	if k, ok := kernelFFT[l]; ok {
		return k
	}
	m := maxDegree(l)
	k := make([]complex128, l)
	for d := -(m - 1); d <= 2*m+1; d++ {
		if d != 0 {
			k[((d%l)+l)%l] = complex(1/float64(d), 0)
		}
	}
	planFor(l).transform(k, false)
	kernelFFT[l] = k
	return k
}

// BackHemisphere returns the hemispherical backscattering efficiency
// Qbb = (1/x²)·∫_{−1}^{0} (|S1|² + |S2|²) dμ of the last particle solved,
// exactly (up to rounding) in O(N log N) by the closed-form half-range
// overlaps described at the top of backscatter.go. Relative accuracy against
// exact quadrature on extended-precision coefficients is stated in the
// package documentation.
func (s *Solver) BackHemisphere() float64 {
	s.mustHold()
	n := s.n
	c := constsFor(n + 2)
	if n < directBelow {
		return s.backDirect(c)
	}
	l := fftLength(3*n + 2)
	plan, spec := planFor(l), hilbertSpectrum(l)
	s.buf = grow(s.buf, l)
	total := s.family(c.uu, c.wu, c.du, +1, plan, spec) + s.family(c.uv, c.wv, c.dv, -1, plan, spec)
	return math.Max(0, total/(2*s.x*s.x))
}

// directBelow is the series length below which BackHemisphere sums the
// closed-form overlaps directly, O(N²) with a short inner loop, instead of
// by FFT; the two cost about the same there (BenchmarkBackCrossover).
const directBelow = 200

// backDirect is BackHemisphere by the direct double sum over the
// closed-form overlaps J_nm.
func (s *Solver) backDirect(c hemiConsts) float64 {
	n := s.n
	s.buf = grow(s.buf, 2*n)
	cu, cv := s.buf[:n], s.buf[n:2*n]
	var total float64
	for k := 1; k <= n; k++ {
		fk := float64(k)
		f := complex((2*fk+1)/(fk*(fk+1)), 0)
		a, b := s.a[k-1], s.b[k-1]
		cu[k-1], cv[k-1] = f*(a+b), f*(a-b)
		total += abs2(cu[k-1])*c.du[k] + abs2(cv[k-1])*c.dv[k]
	}
	for i := 1; i <= n; i++ {
		ui, wui, vi, wvi := c.uu[i], c.wu[i], c.uv[i], c.wv[i]
		pu, pv := cu[i-1], cv[i-1]
		// Row i against j = i+1..n, with slices aligned so that the loop
		// carries no bounds checks.
		m := n - i
		uu, wu, uv, wv := c.uu[i+1:n+1], c.wu[i+1:n+1], c.uv[i+1:n+1], c.wv[i+1:n+1]
		qus, qvs := cu[i:n], cv[i:n]
		id, is := c.inv[1:m+1], c.inv[2*i+2:2*i+2+m] // 1/(j−i), 1/(i+j+1)
		uu, wu, uv, wv, qvs, id, is = uu[:m], wu[:m], uv[:m], wv[:m], qvs[:m], id[:m], is[:m]
		var row float64
		for k, qu := range qus {
			qv := qvs[k]
			ru := real(pu)*real(qu) + imag(pu)*imag(qu)
			rv := real(pv)*real(qv) + imag(pv)*imag(qv)
			row += (ru*(ui*wu[k]-uu[k]*wui) + rv*(vi*wv[k]-uv[k]*wvi)) * id[k] * is[k]
		}
		total -= 2 * row // 1/((i−j)(i+j+1)) = −1/(j−i) · 1/(i+j+1)
	}
	return math.Max(0, total/(2*s.x*s.x))
}

func abs2(z complex128) float64 { return real(z)*real(z) + imag(z)*imag(z) }

// family returns Σ_nm Re(c_n c_m*) J_nm for c_n = (2n+1)/(n(n+1))(a_n + sign·b_n).
func (s *Solver) family(w0, w1, diag []float64, sign float64, plan *fftPlan, spec []complex128) float64 {
	n, buf := s.n, s.buf
	clear(buf)
	off := n + 1 // buffer position of index j is j + off, j ∈ [−n−1, n]
	var d float64
	for k := 1; k <= n; k++ {
		fk := float64(k)
		cn := complex((2*fk+1)/(fk*(fk+1)), 0) * (s.a[k-1] + complex(sign, 0)*s.b[k-1])
		d += (real(cn)*real(cn) + imag(cn)*imag(cn)) * diag[k]
		x := complex(w0[k], 0) * cn
		buf[k+off] = x
		buf[-k-1+off] = x
	}
	plan.transform(buf, false)
	for i := range buf {
		buf[i] *= spec[i]
	}
	plan.transform(buf, true)
	scale := 1 / float64(len(buf))
	var t float64
	for m := 1; m <= n; m++ {
		fm := float64(m)
		cm := complex((2*fm+1)/(fm*(fm+1)), 0) * (s.a[m-1] + complex(sign, 0)*s.b[m-1])
		z := buf[m+off]*complex(scale, 0) - complex(w0[m], 0)*cm/complex(2*fm+1, 0)
		y := complex(w1[m], 0) * cm
		t += (real(y)*real(z) + imag(y)*imag(z)) / (2*fm + 1)
	}
	return d - 2*t
}
