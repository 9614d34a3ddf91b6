package kernel

import (
	"errors"
	"fmt"
	"math"
)

// IOP holds bulk inherent optical properties per wavelength. Make one with
// Table.NewIOP and reuse it.
type IOP struct {
	A   []float64 // absorption coefficient a, m⁻¹
	B   []float64 // scattering coefficient b, m⁻¹
	Bb  []float64 // backscattering coefficient b_b, m⁻¹
	C   []float64 // attenuation coefficient c, m⁻¹
	VSF []float64 // volume scattering function β(θ), m⁻¹ sr⁻¹, at l*len(Angles)+a
}

// NewIOP returns an IOP sized for t.
func (t *Table) NewIOP() IOP {
	nl := len(t.Wavelengths)
	return IOP{
		A: make([]float64, nl), B: make([]float64, nl), Bb: make([]float64, nl), C: make([]float64, nl),
		VSF: make([]float64, nl*len(t.Angles)),
	}
}

// BackscatteringRatio returns b_b/b at wavelength index l (0 if b = 0).
func (p IOP) BackscatteringRatio(l int) float64 {
	if p.B[l] == 0 {
		return 0
	}
	return p.Bb[l] / p.B[l]
}

// Add adds q to p (same table shape): IOPs of populations in one water add.
func (p IOP) Add(q IOP) {
	for _, s := range [...][2][]float64{{p.A, q.A}, {p.B, q.B}, {p.Bb, q.Bb}, {p.C, q.C}, {p.VSF, q.VSF}} {
		for i := range s[0] {
			s[0][i] += s[1][i]
		}
	}
}

// Evaluate fills dst with the bulk IOPs of a population whose number
// concentration in bin i is numbers[i] (m⁻³, from psd.BinNumbers):
// a = Σ N_i ⟨Cabs⟩_i and so on. It allocates nothing. dst must come from
// t.NewIOP (a length mismatch panics: a programming error); negative or
// non-finite numbers are an error.
func (t *Table) Evaluate(numbers []float64, dst *IOP) error {
	nb := t.NBins()
	if len(numbers) != nb {
		return fmt.Errorf("kernel: %d bin concentrations, want %d (one per bin)", len(numbers), nb)
	}
	for i, n := range numbers {
		if !(n >= 0) || math.IsInf(n, 0) {
			return fmt.Errorf("kernel: number concentration in bin %d = %g m-3, want a finite value ≥ 0 m-3", i, n)
		}
	}
	na := len(t.Angles)
	if len(dst.A) != len(t.Wavelengths) || len(dst.VSF) != len(t.Wavelengths)*na {
		panic("kernel: Evaluate: dst was not made by this table's NewIOP")
	}
	for l := range t.Wavelengths {
		o := l * nb
		dst.A[l] = dot(numbers, t.Cabs[o:o+nb])
		dst.B[l] = dot(numbers, t.Csca[o:o+nb])
		dst.Bb[l] = dot(numbers, t.Cbb[o:o+nb])
		dst.C[l] = dot(numbers, t.Cext[o:o+nb])
		for a := 0; a < na; a++ {
			o := (l*na + a) * nb
			dst.VSF[l*na+a] = dot(numbers, t.DCsca[o:o+nb])
		}
	}
	return nil
}

// dot is an unrolled dot product; four partial sums in a fixed order keep
// it deterministic.
func dot(x, y []float64) float64 {
	y = y[:len(x)]
	var s0, s1, s2, s3 float64
	i := 0
	for ; i+4 <= len(x); i += 4 {
		s0 += x[i] * y[i]
		s1 += x[i+1] * y[i+1]
		s2 += x[i+2] * y[i+2]
		s3 += x[i+3] * y[i+3]
	}
	for ; i < len(x); i++ {
		s0 += x[i] * y[i]
	}
	return (s0 + s1) + (s2 + s3)
}

// PowerLawSlope fits v(λ) = v0·(λ/λ0)^−γ by least squares in ln v vs ln λ to
// the points with lo ≤ λ ≤ hi (m) and returns γ: the spectral slope of
// particulate attenuation (Boss, Twardowski & Herring 2001) or
// backscattering. It needs at least two distinct wavelengths in the band and
// positive values there.
func PowerLawSlope(wavelengths, values []float64, lo, hi float64) (float64, error) {
	if len(wavelengths) != len(values) {
		return 0, fmt.Errorf("kernel: %d wavelengths but %d values", len(wavelengths), len(values))
	}
	var n, sx, sy, sxx, sxy float64
	for i, l := range wavelengths {
		if l < lo || l > hi {
			continue
		}
		v := values[i]
		if !(v > 0) || math.IsInf(v, 0) {
			return 0, fmt.Errorf("kernel: value %g at %g m is not positive, want > 0 for a power-law fit", v, l)
		}
		x, y := math.Log(l), math.Log(v)
		n++
		sx += x
		sy += y
		sxx += x * x
		sxy += x * y
	}
	den := n*sxx - sx*sx
	if n < 2 || !(den > 1e-12*n*sxx) {
		return 0, errors.New("kernel: power-law fit needs at least two distinct wavelengths in the band")
	}
	return -(n*sxy - sx*sy) / den, nil
}
