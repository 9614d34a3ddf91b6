package mie

import (
	"math"
	"math/big"

	"gonum.org/v1/gonum/integrate/quad"
)

// This file is the slow, straightforward oracle: the Lorenz–Mie series of
// Bohren & Huffman (1983, eqs. 4.53, 4.61, 4.62, 4.88, 4.89) evaluated in
// 256-bit floating point with math/big, with none of the fast engine's
// choices: the series runs 40 terms past Wiscombe's length, the logarithmic
// derivative starts far above any turning point, ψ_n and χ_n come from
// plain upward recurrence (whose loss of digits is harmless at 77 digits),
// and sin/cos are Taylor series. Only the coefficients a_n, b_n are rounded
// to float64 at the end; the efficiencies are summed in big precision.

const oraclePrec = 256

type bc struct{ r, i *big.Float }

func bf(v float64) *big.Float { return new(big.Float).SetPrec(oraclePrec).SetFloat64(v) }

func bcf(r, i float64) bc { return bc{bf(r), bf(i)} }

func (a bc) add(b bc) bc {
	return bc{new(big.Float).SetPrec(oraclePrec).Add(a.r, b.r), new(big.Float).SetPrec(oraclePrec).Add(a.i, b.i)}
}
func (a bc) sub(b bc) bc {
	return bc{new(big.Float).SetPrec(oraclePrec).Sub(a.r, b.r), new(big.Float).SetPrec(oraclePrec).Sub(a.i, b.i)}
}
func mulf(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(oraclePrec).Mul(a, b) }
func (a bc) mul(b bc) bc {
	rr := new(big.Float).SetPrec(oraclePrec).Sub(mulf(a.r, b.r), mulf(a.i, b.i))
	ii := new(big.Float).SetPrec(oraclePrec).Add(mulf(a.r, b.i), mulf(a.i, b.r))
	return bc{rr, ii}
}
func (a bc) quo(b bc) bc {
	den := new(big.Float).SetPrec(oraclePrec).Add(mulf(b.r, b.r), mulf(b.i, b.i))
	rr := new(big.Float).SetPrec(oraclePrec).Add(mulf(a.r, b.r), mulf(a.i, b.i))
	ii := new(big.Float).SetPrec(oraclePrec).Sub(mulf(a.i, b.r), mulf(a.r, b.i))
	return bc{rr.Quo(rr, den), ii.Quo(ii, den)}
}
func (a bc) abs2() *big.Float {
	return new(big.Float).SetPrec(oraclePrec).Add(mulf(a.r, a.r), mulf(a.i, a.i))
}
func (a bc) c128() complex128 {
	r, _ := a.r.Float64()
	i, _ := a.i.Float64()
	return complex(r, i)
}

// bigSinCos returns sin x and cos x by Taylor series after reducing x by
// multiples of 2π (π from Machin's formula).
func bigSinCos(x *big.Float) (s, c *big.Float) {
	twoPi := mulf(bigPi(), bf(2))
	q := new(big.Float).SetPrec(oraclePrec).Quo(x, twoPi)
	qi, _ := q.Int(nil)
	r := new(big.Float).SetPrec(oraclePrec).Sub(x, mulf(new(big.Float).SetPrec(oraclePrec).SetInt(qi), twoPi))
	s, c = bf(0), bf(0)
	term := bf(1)
	eps := new(big.Float).SetMantExp(bf(1), -oraclePrec-8)
	for k := 0; ; k++ {
		if k%2 == 0 {
			if (k/2)%2 == 0 {
				c.Add(c, term)
			} else {
				c.Sub(c, term)
			}
		} else {
			if (k/2)%2 == 0 {
				s.Add(s, term)
			} else {
				s.Sub(s, term)
			}
		}
		term = mulf(term, r)
		term.Quo(term, bf(float64(k+1)))
		if k > 10 && new(big.Float).Abs(term).Cmp(eps) < 0 {
			return s, c
		}
	}
}

var piCache *big.Float

func bigPi() *big.Float {
	if piCache != nil {
		return piCache
	}
	atanInv := func(n int64) *big.Float { // arctan(1/n)
		sum, x := bf(0), new(big.Float).SetPrec(oraclePrec).Quo(bf(1), bf(float64(n)))
		n2 := bf(float64(n * n))
		eps := new(big.Float).SetMantExp(bf(1), -oraclePrec-8)
		for k := 0; x.Cmp(eps) > 0; k++ {
			t := new(big.Float).SetPrec(oraclePrec).Quo(x, bf(float64(2*k+1)))
			if k%2 == 0 {
				sum.Add(sum, t)
			} else {
				sum.Sub(sum, t)
			}
			x.Quo(x, n2)
		}
		return sum
	}
	p := new(big.Float).SetPrec(oraclePrec).Sub(mulf(bf(16), atanInv(5)), mulf(bf(4), atanInv(239)))
	piCache = p
	return p
}

// bigLogDerivative returns D_n(z) = ψ_n'(z)/ψ_n(z) for n = 0..nmax by
// downward recurrence started with D = 0 far above the turning point
// (|z| + 30|z|^(1/3) + 60, where the starting error is damped far below
// 256-bit precision).
func bigLogDerivative(z bc, nmax int) []bc {
	zr, _ := z.r.Float64()
	zi, _ := z.i.Float64()
	az := math.Hypot(zr, zi)
	nmx := int(math.Max(float64(nmax), az)+30*math.Cbrt(az)) + 60
	d := make([]bc, nmax+1)
	dn := bcf(0, 0)
	for n := nmx; n >= 1; n-- {
		nz := bc{bf(float64(n)), bf(0)}.quo(z)
		dn = nz.sub(bcf(1, 0).quo(dn.add(nz)))
		if n-1 <= nmax {
			d[n-1] = dn
		}
	}
	return d
}

type oracleResult struct {
	qext, qsca, qback, g float64
	a, b                 []complex128
}

// oracleSphere evaluates the homogeneous-sphere series in big precision.
func oracleSphere(x float64, m complex128) oracleResult {
	nstop := seriesLength(x) + 40
	bx := bf(x)
	mm := bcf(real(m), imag(m))
	d := bigLogDerivative(mm.mul(bc{bx, bf(0)}), nstop)
	sinx, cosx := bigSinCos(bx)
	psi0, psi1 := cosx, sinx
	chi0, chi1 := new(big.Float).Neg(sinx), cosx
	res := oracleResult{a: make([]complex128, nstop), b: make([]complex128, nstop)}
	qext, qsca := bf(0), bf(0)
	back := bcf(0, 0)
	var as, bs []bc
	for n := 1; n <= nstop; n++ {
		fn := bf(float64(n))
		k := new(big.Float).SetPrec(oraclePrec).Quo(bf(float64(2*n-1)), bx)
		psi := new(big.Float).SetPrec(oraclePrec).Sub(mulf(k, psi1), psi0)
		chi := new(big.Float).SetPrec(oraclePrec).Sub(mulf(k, chi1), chi0)
		xi := bc{psi, new(big.Float).Neg(chi)}
		xi1 := bc{psi1, new(big.Float).Neg(chi1)}
		nx := bc{new(big.Float).SetPrec(oraclePrec).Quo(fn, bx), bf(0)}
		ta := d[n].quo(mm).add(nx)
		tb := d[n].mul(mm).add(nx)
		p, p1 := bc{psi, bf(0)}, bc{psi1, bf(0)}
		an := ta.mul(p).sub(p1).quo(ta.mul(xi).sub(xi1))
		bn := tb.mul(p).sub(p1).quo(tb.mul(xi).sub(xi1))
		as, bs = append(as, an), append(bs, bn)
		w := bf(float64(2*n + 1))
		qext.Add(qext, mulf(w, new(big.Float).SetPrec(oraclePrec).Add(an.r, bn.r)))
		qsca.Add(qsca, mulf(w, new(big.Float).SetPrec(oraclePrec).Add(an.abs2(), bn.abs2())))
		sw := float64(2*n + 1)
		if n%2 == 1 {
			sw = -sw
		}
		back = back.add(bcf(sw, 0).mul(an.sub(bn)))
		psi0, psi1 = psi1, psi
		chi0, chi1 = chi1, chi
		res.a[n-1], res.b[n-1] = an.c128(), bn.c128()
	}
	gs := bf(0)
	for n := 1; n <= nstop; n++ {
		fn := float64(n)
		an, bn := as[n-1], bs[n-1]
		cross := new(big.Float).SetPrec(oraclePrec).Add(mulf(an.r, bn.r), mulf(an.i, bn.i))
		gs.Add(gs, mulf(bf((2*fn+1)/(fn*(fn+1))), cross))
		if n < nstop {
			an1, bn1 := as[n], bs[n]
			t := new(big.Float).SetPrec(oraclePrec).Add(mulf(an.r, an1.r), mulf(an.i, an1.i))
			t.Add(t, mulf(bn.r, bn1.r))
			t.Add(t, mulf(bn.i, bn1.i))
			gs.Add(gs, mulf(bf(fn*(fn+2)/(fn+1)), t))
		}
	}
	x2 := mulf(bx, bx)
	qe := new(big.Float).SetPrec(oraclePrec).Quo(mulf(bf(2), qext), x2)
	qs := new(big.Float).SetPrec(oraclePrec).Quo(mulf(bf(2), qsca), x2)
	qb := new(big.Float).SetPrec(oraclePrec).Quo(back.abs2(), x2)
	g := new(big.Float).SetPrec(oraclePrec).Quo(mulf(bf(4), gs), mulf(x2, qs))
	res.qext, _ = qe.Float64()
	res.qsca, _ = qs.Float64()
	res.qback, _ = qb.Float64()
	res.g, _ = g.Float64()
	return res
}

// oracleBack integrates (|S1|²+|S2|²) over the back hemisphere from the
// oracle's coefficients by plain quadrature: a Gauss–Legendre rule of 2N+16
// nodes (exact for this polynomial integrand of degree 2N, with margin) and
// the angular recurrence. It is independent of the closed-form overlaps and
// FFT that BackHemisphere uses.
func oracleBack(x float64, o oracleResult) float64 {
	var s Solver
	s.a, s.b, s.n, s.x, s.valid = o.a, o.b, len(o.a), x, true
	nn := 2*len(o.a) + 16
	mu, w := legendreNodes(make([]float64, nn), make([]float64, nn))
	var sum float64
	for i := range mu {
		s1, s2 := s.angularSums(mu[i])
		sum += w[i] * (real(s1)*real(s1) + imag(s1)*imag(s1) + real(s2)*real(s2) + imag(s2)*imag(s2))
	}
	return sum / (x * x)
}

// legendreNodes fills a Gauss–Legendre rule on [−1, 0] with len(mu) nodes,
// or with one more node when len(mu) is 26: gonum v0.17.0's tabulated
// 26-point rule is defective (its weights sum to 1 − 1.06e−2; every other
// order up to 3000 sums to 1 within 1e−13, checked while writing these
// tests). One more node keeps the rule exact for the same polynomials. It
// returns the slices actually filled.
func legendreNodes(mu, w []float64) ([]float64, []float64) {
	if len(mu) == 26 {
		mu, w = make([]float64, 27), make([]float64, 27)
	}
	quad.Legendre{}.FixedLocations(mu, w, -1, 0)
	return mu, w
}
