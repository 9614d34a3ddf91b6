package mie

import (
	"math"
	"math/bits"
	"sync"
)

// fftPlan is an in-place radix-2 decimation-in-time FFT of one power-of-two
// length (Cooley & Tukey 1965, Math. Comp. 19:297), with the bit-reversal
// permutation and each stage's twiddle factors precomputed contiguously.
// Plans are immutable once made and shared between goroutines. It serves the
// hemispherical-backscattering convolution, where it runs several times
// faster than the general mixed-radix transform in gonum's dsp/fourier.
type fftPlan struct {
	n   int
	rev []int32 // bit-reversed index of each position
	// tw holds, for the stage that combines blocks of half-length h, the
	// factors e^{−iπk/h}, k < h, at offset h−1.
	tw []complex128
}

var (
	planMu sync.Mutex
	plans  = map[int]*fftPlan{}
)

// planFor returns the shared plan for length n, a power of two ≥ 2.
func planFor(n int) *fftPlan {
	planMu.Lock()
	defer planMu.Unlock()
	if p, ok := plans[n]; ok {
		return p
	}
	p := &fftPlan{n: n, rev: make([]int32, n), tw: make([]complex128, n-1)}
	shift := 64 - bits.TrailingZeros(uint(n))
	for i := range n {
		p.rev[i] = int32(bits.Reverse64(uint64(i)) >> shift)
	}
	for h := 1; h < n; h <<= 1 {
		for k := range h {
			s, c := math.Sincos(-math.Pi * float64(k) / float64(h))
			p.tw[h-1+k] = complex(c, s)
		}
	}
	plans[n] = p
	return p
}

// transform replaces x by its DFT Σ_j x_j e^{∓2πijk/n} (minus sign when
// inverse is false). The inverse is unnormalised; it is computed as
// conj(DFT(conj(x))).
func (p *fftPlan) transform(x []complex128, inverse bool) {
	x = x[:p.n]
	if inverse {
		conjugate(x)
	}
	for i, r := range p.rev {
		if j := int(r); i < j {
			x[i], x[j] = x[j], x[i]
		}
	}
	// The first stage has only the factor 1.
	for i := 0; i+1 < len(x); i += 2 {
		a, b := x[i], x[i+1]
		x[i], x[i+1] = a+b, a-b
	}
	for h := 2; h < p.n; h <<= 1 {
		tw := p.tw[h-1 : 2*h-1]
		for start := 0; start < p.n; start += 2 * h {
			lo := x[start : start+h]
			hi := x[start+h : start+2*h]
			for k, w := range tw {
				a, b := lo[k], hi[k]
				tr := real(w)*real(b) - imag(w)*imag(b)
				ti := real(w)*imag(b) + imag(w)*real(b)
				lo[k] = complex(real(a)+tr, imag(a)+ti)
				hi[k] = complex(real(a)-tr, imag(a)-ti)
			}
		}
	}
	if inverse {
		conjugate(x)
	}
}

func conjugate(x []complex128) {
	for i, v := range x {
		x[i] = complex(real(v), -imag(v))
	}
}
