package mie

import (
	"fmt"
	"math"
	"math/cmplx"
	"testing"
)

// The FFT against the defining sum of the discrete Fourier transform, and
// the unnormalised inverse against n times the input (definitions).
func TestFFTAgainstDFT(t *testing.T) {
	const tol = 1e-12 // relative to the largest |x| (rounding grows like log n)
	for _, n := range []int{2, 4, 8, 64, 512} {
		x := make([]complex128, n)
		for i := range x {
			x[i] = complex(math.Sin(float64(i*i)), math.Cos(float64(3*i)))
		}
		y := append([]complex128(nil), x...)
		planFor(n).transform(y, false)
		z := append([]complex128(nil), y...)
		planFor(n).transform(z, true)
		for k := range n {
			var s complex128
			for j := range n {
				s += x[j] * cmplx.Exp(complex(0, -2*math.Pi*float64(j*k)/float64(n)))
			}
			if d := cmplx.Abs(s - y[k]); d > tol*float64(n) {
				t.Errorf("n=%d k=%d: FFT %v, DFT %v", n, k, y[k], s)
			}
			if d := cmplx.Abs(z[k]/complex(float64(n), 0) - x[k]); d > tol {
				t.Errorf("n=%d k=%d: inverse gives %v, want %v", n, k, z[k], x[k])
			}
		}
	}
}

func BenchmarkFFT(b *testing.B) {
	for _, n := range []int{1024, 16384} {
		p := planFor(n)
		x := make([]complex128, n)
		b.Run(fmt.Sprintf("n=%d", n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				p.transform(x, false)
			}
		})
	}
}
