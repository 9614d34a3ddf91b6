package mie

import (
	"math"
	"math/big"
	"math/rand/v2"
	"testing"
)

// A second oracle for the coated sphere: the Aden–Kerker coefficients in the
// form printed by Bohren & Huffman (1983, eq. 8.2, with A_n and B_n as in
// their BHCOAT listing), evaluated in 256-bit arithmetic with the
// Riccati–Bessel functions of complex argument themselves (which the fast
// engine never forms): ψ_n from ψ_0 = sin z and the downward-recurrence
// logarithmic derivative, χ_n by upward recurrence (its stable direction).

func bigExp(r *big.Float) *big.Float {
	k := 0
	s := new(big.Float).SetPrec(oraclePrec).Set(r)
	half := bf(0.5)
	for new(big.Float).Abs(s).Cmp(half) > 0 {
		s.Quo(s, bf(2))
		k++
	}
	sum, term := bf(1), bf(1)
	eps := new(big.Float).SetMantExp(bf(1), -oraclePrec-8)
	for i := 1; new(big.Float).Abs(term).Cmp(eps) > 0; i++ {
		term = mulf(term, s)
		term.Quo(term, bf(float64(i)))
		sum.Add(sum, term)
	}
	for range k {
		sum = mulf(sum, sum)
	}
	return sum
}

// bigSinCosC returns sin z and cos z for complex z.
func bigSinCosC(z bc) (s, c bc) {
	sa, ca := bigSinCos(z.r)
	eb := bigExp(z.i)
	emb := new(big.Float).SetPrec(oraclePrec).Quo(bf(1), eb)
	ch := mulf(new(big.Float).SetPrec(oraclePrec).Add(eb, emb), bf(0.5))
	sh := mulf(new(big.Float).SetPrec(oraclePrec).Sub(eb, emb), bf(0.5))
	return bc{mulf(sa, ch), mulf(ca, sh)}, bc{mulf(ca, ch), new(big.Float).Neg(mulf(sa, sh))}
}

// bigRiccati returns ψ_n, ψ_n', χ_n, χ_n' of z for n = 0..nmax.
func bigRiccati(z bc, nmax int) (psi, dpsi, chi, dchi []bc) {
	d := bigLogDerivative(z, nmax)
	s, c := bigSinCosC(z)
	psi, dpsi = make([]bc, nmax+1), make([]bc, nmax+1)
	chi, dchi = make([]bc, nmax+1), make([]bc, nmax+1)
	psi[0], chi[0] = s, c
	chiPrev := bc{new(big.Float).Neg(s.r), new(big.Float).Neg(s.i)} // χ_{−1} = −sin z
	psiPrev := c                                                    // ψ_{−1} = cos z
	for n := 1; n <= nmax; n++ {
		nz := bc{bf(float64(n)), bf(0)}.quo(z)
		psi[n] = psi[n-1].quo(d[n].add(nz))
		k := bc{bf(float64(2*n - 1)), bf(0)}.quo(z)
		prev := chiPrev
		if n > 1 {
			prev = chi[n-2]
		}
		chi[n] = k.mul(chi[n-1]).sub(prev)
	}
	for n := 0; n <= nmax; n++ {
		nz := bc{bf(float64(n)), bf(0)}.quo(z)
		pm, cm := psiPrev, chiPrev
		if n > 0 {
			pm, cm = psi[n-1], chi[n-1]
		}
		dpsi[n] = pm.sub(nz.mul(psi[n]))
		dchi[n] = cm.sub(nz.mul(chi[n]))
	}
	return psi, dpsi, chi, dchi
}

// oracleCoated returns Qext, Qsca, Qback and g of a coated sphere.
func oracleCoated(xc, y float64, m1, m2 complex128) (qext, qsca, qback, g float64) {
	nstop := seriesLength(y) + 30
	M1, M2 := bcf(real(m1), imag(m1)), bcf(real(m2), imag(m2))
	X, Y := bcf(xc, 0), bcf(y, 0)
	p1, dp1, _, _ := bigRiccati(M1.mul(X), nstop)    // m1·x
	p2, dp2, c2, dc2 := bigRiccati(M2.mul(X), nstop) // m2·x
	p3, dp3, c3, dc3 := bigRiccati(M2.mul(Y), nstop) // m2·y
	py, dpy, cy, dcy := bigRiccati(Y, nstop)         // y (real)
	var as, bs []complex128
	for n := 1; n <= nstop; n++ {
		an := M2.mul(p2[n]).mul(dp1[n]).sub(M1.mul(dp2[n]).mul(p1[n])).quo(
			M2.mul(c2[n]).mul(dp1[n]).sub(M1.mul(dc2[n]).mul(p1[n])))
		bn := M2.mul(p1[n]).mul(dp2[n]).sub(M1.mul(p2[n]).mul(dp1[n])).quo(
			M2.mul(dc2[n]).mul(p1[n]).sub(M1.mul(dp1[n]).mul(c2[n])))
		xi := py[n].sub(bc{new(big.Float).Neg(cy[n].i), cy[n].r}) // ξ = ψ − iχ
		dxi := dpy[n].sub(bc{new(big.Float).Neg(dcy[n].i), dcy[n].r})
		ua := dp3[n].sub(an.mul(dc3[n]))
		va := p3[n].sub(an.mul(c3[n]))
		a := py[n].mul(ua).sub(M2.mul(dpy[n]).mul(va)).quo(xi.mul(ua).sub(M2.mul(dxi).mul(va)))
		ub := dp3[n].sub(bn.mul(dc3[n]))
		vb := p3[n].sub(bn.mul(c3[n]))
		b := M2.mul(py[n]).mul(ub).sub(dpy[n].mul(vb)).quo(M2.mul(xi).mul(ub).sub(dxi.mul(vb)))
		as, bs = append(as, a.c128()), append(bs, b.c128())
	}
	var back complex128
	for n := 1; n <= nstop; n++ {
		a, b := as[n-1], bs[n-1]
		w := float64(2*n + 1)
		qext += w * real(a+b)
		qsca += w * (abs2(a) + abs2(b))
		sgn := -1.0
		if n%2 == 0 {
			sgn = 1
		}
		back += complex(w*sgn, 0) * (a - b)
		fn := float64(n)
		g += (2*fn + 1) / (fn * (fn + 1)) * real(a*complexConj(b))
		if n < nstop {
			g += fn * (fn + 2) / (fn + 1) * real(a*complexConj(as[n])+b*complexConj(bs[n]))
		}
	}
	y2 := y * y
	return 2 * qext / y2, 2 * qsca / y2, abs2(back) / y2, 4 * g / (y2 * 2 * qsca / y2)
}

func complexConj(z complex128) complex128 { return complex(real(z), -imag(z)) }

// Bohren & Huffman's BHCOAT sample reproduced by the oracle itself, then the
// fast recursive algorithm against the oracle over a seeded random sample of
// core fraction, size and both indices.
func TestCoatedAgainstOracle(t *testing.T) {
	k := 2 * math.Pi / 3.0
	qe, qs, qb, _ := oracleCoated(k*0.171, k*6.265, 1.59+0.66i, 1.409+0.1747i)
	if relErr(qe, 2.32803) > sixDigits || relErr(qs, 1.14341) > sixDigits || relErr(qb, 0.0285099) > sixDigits {
		t.Fatalf("oracle misses the BHCOAT sample: %g %g %g", qe, qs, qb)
	}
	const tol = 1e-10 // relative, Qext, Qsca, Qback; absolute for g
	r := rand.New(rand.NewPCG(7, 2026))
	var s Solver
	worst := 0.0
	nCases, ymax := 30, 1500.0
	if testing.Short() {
		nCases, ymax = 10, 300
	}
	for range nCases {
		y := math.Exp(math.Log(0.01) + r.Float64()*(math.Log(ymax)-math.Log(0.01)))
		xc := y * r.Float64()
		m1 := complex(1+2*r.Float64(), math.Pow(10, -4+4*r.Float64()))
		m2 := complex(1.0+0.5*r.Float64(), math.Pow(10, -6+5*r.Float64()))
		e, err := s.Coated(xc, y, m1, m2)
		if err != nil {
			t.Fatal(err)
		}
		qe, qs, qb, g := oracleCoated(xc, y, m1, m2)
		for _, d := range []float64{relErr(e.Qext, qe), relErr(e.Qsca, qs), relErr(e.Qback, qb), math.Abs(e.G - g)} {
			worst = math.Max(worst, d)
			if d > tol {
				t.Errorf("core %.4g shell %.4g m1=%v m2=%v: fast (%g %g %g %g) oracle (%g %g %g %g)", xc, y, m1, m2, e.Qext, e.Qsca, e.Qback, e.G, qe, qs, qb, g)
				break
			}
		}
	}
	t.Logf("worst coated discrepancy %.1e", worst)
}
