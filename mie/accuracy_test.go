package mie

import (
	"math"
	"math/rand/v2"
	"testing"
)

// Accuracy of the fast engine against the extended-precision oracle
// (oracle_test.go). The bounds are what the engine achieves over the seeded
// sample plus a margin of about 3×; they are stated in doc.go.
const (
	tolQ    = 2e-12 // Qext, Qsca: relative (worst seen 4.4e-13)
	tolAbs  = 5e-14 // Qabs: relative to Qext, since Qabs = Qext − Qsca inherits Qext's absolute error (worst seen 8.6e-15)
	tolG    = 3e-13 // g: absolute (worst seen 6.5e-14)
	tolBack = 3e-10 // Qback: relative; the 180° sum converges last and alternates in sign (worst seen 5.6e-11)
	tolHemi = 2e-12 // Qbb: relative, plus tolHemiA below (worst seen 1.1e-12 where Qbb/Qsca ≥ 1e-4)
	// tolHemiA bounds the absolute Qbb error in units of Qsca: the
	// closed-form overlaps cancel when little light goes backwards (worst
	// seen 1.3e-15·Qsca, at Qbb/Qsca = 3.9e-6 for m = 1.001, x = 200).
	tolHemiA = 5e-15
	oracleXs = 24 // random cases per run
)

type accCase struct {
	x float64
	m complex128
}

// sampleCases draws (x, m) log-uniformly in x over the domain, n in
// [0.5, 3], k either 0, log-uniform in [1e-6, 10], with a fixed seed, plus
// fixed cases where textbook choices lose accuracy: large |m|x (downward
// recurrence start), m → 1 (porous aggregates) and tiny x.
func sampleCases(short bool) []accCase {
	r := rand.New(rand.NewPCG(2026, 12))
	xmax := 2e4
	if short {
		xmax = 2e3
	}
	var cs []accCase
	for range oracleXs {
		x := math.Exp(math.Log(1e-6) + r.Float64()*(math.Log(xmax)-math.Log(1e-6)))
		n := 0.5 + 2.5*r.Float64()
		k := 0.0
		if r.IntN(3) > 0 {
			k = math.Exp(math.Log(1e-6) + r.Float64()*(math.Log(10)-math.Log(1e-6)))
		}
		cs = append(cs, accCase{x, complex(n, k)})
	}
	cs = append(cs,
		accCase{1e-6, 1.5 + 1i}, accCase{3e-4, 1.001}, accCase{0.3, 0.75},
		accCase{200, 1.001}, accCase{1500, 1.02 + 1e-4i}, accCase{800, 1.05},
		accCase{1000, 3 + 0.01i}, accCase{600, 2.5}, accCase{300, 3 + 10i},
	)
	if !short {
		cs = append(cs, accCase{2e4, 1.33 + 1e-5i}, accCase{1e4, 3}, accCase{5000, 1.2 + 0.001i})
	}
	return cs
}

func TestAgainstOracle(t *testing.T) {
	var s Solver
	worst := map[string]float64{}
	for _, c := range sampleCases(testing.Short()) {
		o := oracleSphere(c.x, c.m)
		e, err := s.Sphere(c.x, c.m)
		if err != nil {
			t.Fatalf("x=%g m=%v: %v", c.x, c.m, err)
		}
		errs := map[string]float64{
			"Qext":  relErr(e.Qext, o.qext),
			"Qsca":  relErr(e.Qsca, o.qsca),
			"Qabs":  math.Abs(e.Qabs-(o.qext-o.qsca)) / o.qext,
			"g":     math.Abs(e.G - o.g),
			"Qback": relErr(e.Qback, o.qback),
		}
		if c.x <= 3000 { // the oracle's quadrature is O(N²)
			qbb, want := s.BackHemisphere(), oracleBack(c.x, o)
			errs["Qbb"] = relErr(qbb, want)
			if math.Abs(qbb-want) > tolHemi*want+tolHemiA*o.qsca {
				t.Errorf("x=%.6g m=%v: Qbb %.17g, quadrature %.17g", c.x, c.m, qbb, want)
			}
		}
		tol := map[string]float64{"Qext": tolQ, "Qsca": tolQ, "Qabs": tolAbs, "g": tolG, "Qback": tolBack}
		for q, v := range errs {
			worst[q] = math.Max(worst[q], v)
			if tq, ok := tol[q]; ok && v > tq {
				t.Errorf("x=%.6g m=%v: %s error %.2e > %.0e", c.x, c.m, q, v, tol[q])
			}
		}
	}
	t.Logf("worst errors against the oracle: %v", worst)
}

// The per-degree diagonal overlaps ∫_{−1}^{0} u_n² come from a recurrence;
// compare them with quadrature at degrees up to 4000, and the whole Qbb with
// quadrature on the engine's own coefficients at large x, where the oracle
// comparison above does not reach.
func TestBackHemisphereLarge(t *testing.T) {
	c := constsFor(4100)
	for _, n := range []int{1, 2, 3, 10, 57, 300, 1001, 4000} {
		nn := n + 4
		mu, w := legendreNodes(make([]float64, nn), make([]float64, nn))
		var du float64
		for i := range mu {
			// π_n + τ_n at mu[i] by the angular recurrence.
			pi0, pi1 := 0.0, 1.0
			var u float64
			for k := 1; k <= n; k++ {
				fk := float64(k)
				if k == n {
					u = pi1 + fk*mu[i]*pi1 - (fk+1)*pi0
				}
				pi0, pi1 = pi1, ((2*fk+1)*mu[i]*pi1-(fk+1)*pi0)/fk
			}
			du += w[i] * u * u
		}
		// Relative: both are sums of ~n rounded terms of one sign.
		if r := relErr(c.du[n], du); r > 1e-11 {
			t.Errorf("∫u_%d² = %.15g by recurrence, %.15g by quadrature (%.1e)", n, c.du[n], du, r)
		}
	}
	if testing.Short() {
		return
	}
	var s Solver
	for _, m := range []complex128{1.33, 1.05 + 1e-4i} {
		e, err := s.Sphere(8000, m)
		if err != nil {
			t.Fatal(err)
		}
		got := s.BackHemisphere()
		want := oracleBack(8000, oracleResult{a: s.a[:s.n], b: s.b[:s.n]})
		if math.Abs(got-want) > tolHemi*want+tolHemiA*e.Qsca {
			t.Errorf("x=8000 m=%v: Qbb %.15g, quadrature %.15g", m, got, want)
		}
	}
}
