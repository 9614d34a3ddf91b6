package mie

import (
	"math"
	"math/bits"
	"sync"
)

// fftPlan is an in-place radix-2 decimation-in-time FFT of one power-of-two
// length (Cooley & Tukey 1965, Math. Comp. 19:297), with the bit-reversal
// permutation and twiddle factors e^{−2πik/n} precomputed. Plans are
// immutable once made and shared between goroutines. It serves the
// hemispherical-backscattering convolution, where it runs several times
// faster than the general mixed-radix transform in gonum's dsp/fourier.
type fftPlan struct {
	n   int
	rev []int32      // bit-reversed index of each position
	tw  []complex128 // e^{−2πik/n}, k < n/2
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
	p := &fftPlan{n: n, rev: make([]int32, n), tw: make([]complex128, n/2)}
	shift := 64 - bits.TrailingZeros(uint(n))
	for i := range n {
		p.rev[i] = int32(bits.Reverse64(uint64(i)) >> shift)
	}
	for k := range p.tw {
		s, c := math.Sincos(-2 * math.Pi * float64(k) / float64(n))
		p.tw[k] = complex(c, s)
	}
	plans[n] = p
	return p
}

// transform replaces x by its DFT Σ_j x_j e^{∓2πijk/n} (minus sign when
// inverse is false). The inverse is unnormalised.
func (p *fftPlan) transform(x []complex128, inverse bool) {
	n := p.n
	for i, r := range p.rev {
		if j := int(r); i < j {
			x[i], x[j] = x[j], x[i]
		}
	}
	for size := 2; size <= n; size <<= 1 {
		half := size >> 1
		step := n / size
		for start := 0; start < n; start += size {
			for k := range half {
				w := p.tw[k*step]
				if inverse {
					w = complex(real(w), -imag(w))
				}
				a, b := x[start+k], x[start+k+half]
				tr := real(w)*real(b) - imag(w)*imag(b)
				ti := real(w)*imag(b) + imag(w)*real(b)
				x[start+k] = complex(real(a)+tr, imag(a)+ti)
				x[start+k+half] = complex(real(a)-tr, imag(a)-ti)
			}
		}
	}
}
