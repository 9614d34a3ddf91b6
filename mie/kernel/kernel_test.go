package kernel

import (
	"math"
	"strings"
	"testing"

	"github.com/murk-optics/murk/mie/refindex"
)

// geometric is a test evaluator with closed-form cross-sections: a
// non-absorbing sphere in the geometric-optics limit, Cext = 2·πD²/4 (the
// extinction paradox, van de Hulst 1957 §8.22), half of it scattered, a
// fixed backscattered share, and an isotropic-plus-cosine VSF. Only the
// algebra of averaging is under test.
type geometric struct{}

type geoWorker struct{ calls int }

func (geometric) NewWorker() Worker { return &geoWorker{} }

func (w *geoWorker) Eval(r Request, s *Sample) error {
	w.calls++
	g := math.Pi * r.Diameter * r.Diameter / 4
	s.Cext, s.Csca, s.Cabs = 2*g, 1.5*g, 0.5*g
	s.Cbb = 0
	if r.Backscatter {
		s.Cbb = 0.02 * g
	}
	for a, mu := range r.Mu {
		s.DCsca[a] = 1.5 * g / (4 * math.Pi) * (1 + mu)
	}
	return nil
}

// buildGeometric builds the table of geometric{} for spec, failing the
// test on an error.
func buildGeometric(t *testing.T, spec Spec) *Table {
	t.Helper()
	tab, err := Build(geometric{}, spec)
	if err != nil {
		t.Fatal(err)
	}
	return tab
}

func testSpec() Spec {
	edges, _ := LogEdges(0.5e-6, 50e-6, 40)
	return Spec{
		Edges:       edges,
		Wavelengths: []float64{400e-9, 550e-9, 700e-9},
		Angles:      []float64{0, math.Pi / 2, 2 * math.Pi / 3, math.Pi},
		Medium:      refindex.ConstantMedium(1.34),
	}
}

// TestBinAverage: with w ∝ 1/D the exact average of D² over [lo, hi] is
// (hi² − lo²)/(2 ln(hi/lo)) (calculus). The midpoint rule on S strata in
// ln D has relative error ≈ (h/S)²·p²/24 for C ∝ D^p, h = ln(hi/lo).
func TestBinAverage(t *testing.T) {
	spec := testSpec()
	tab := buildGeometric(t, spec)
	nb := tab.NBins()
	for l := range tab.Wavelengths {
		for i := 0; i < nb; i++ {
			lo, hi := tab.Edges[i], tab.Edges[i+1]
			want := 2 * math.Pi / 4 * (hi*hi - lo*lo) / (2 * math.Log(hi/lo))
			h := math.Log(hi/lo) / float64(tab.SubPoints[l*nb+i])
			tol := 2 * 4 * h * h / 24 // twice the leading midpoint-rule error for p = 2
			if got := tab.Cext[l*nb+i]; math.Abs(got-want)/want > tol {
				t.Errorf("λ %d bin %d: ⟨Cext⟩ = %g, want %g (tol %g)", l, i, got, want, tol)
			}
		}
	}
}

// TestSubPointRule: S = ceil(Δx/SubStep) within [MinSub, MaxSub].
func TestSubPointRule(t *testing.T) {
	p := (&Spec{}).plan()
	// Bin 10–11 µm at 500 nm in n = 1.34: Δx = π·1e-6·1.34/5e-7 = 8.419 → 43.
	if n, capped := p.count(10e-6, 11e-6, 500e-9, 1.34); n != 43 || capped {
		t.Errorf("count = %d (capped %v), want 43", n, capped)
	}
	if n, _ := p.count(0.1e-6, 0.101e-6, 500e-9, 1.34); n != DefaultMinSub {
		t.Errorf("small bin: %d, want MinSub %d", n, DefaultMinSub)
	}
	if n, capped := p.count(400e-6, 500e-6, 400e-9, 1.34); n != DefaultMaxSub || !capped {
		t.Errorf("huge bin: %d (capped %v), want MaxSub", n, capped)
	}
}

// TestDeterministic: the table is bit-for-bit the same for 1 and 5 workers.
func TestDeterministic(t *testing.T) {
	spec := testSpec()
	spec.Workers = 1
	a, err := Build(jitterEval{}, spec)
	if err != nil {
		t.Fatal(err)
	}
	spec.Workers = 5
	b, err := Build(jitterEval{}, spec)
	if err != nil {
		t.Fatal(err)
	}
	for k := range a.Csca {
		if a.Csca[k] != b.Csca[k] || a.Cbb[k] != b.Cbb[k] || a.Cext[k] != b.Cext[k] {
			t.Fatalf("cell %d differs between 1 and 5 workers", k)
		}
	}
	for k := range a.DCsca {
		if a.DCsca[k] != b.DCsca[k] {
			t.Fatalf("VSF entry %d differs", k)
		}
	}
}

// jitterEval has cross-sections whose sum depends on summation order in the
// last bits (an oscillating term), to make order dependence visible.
type jitterEval struct{}

func (jitterEval) NewWorker() Worker { return jitterWorker{} }

type jitterWorker struct{}

func (jitterWorker) Eval(r Request, s *Sample) error {
	x := math.Pi * r.Diameter * r.Medium / r.Wavelength
	g := math.Pi * r.Diameter * r.Diameter / 4
	q := 2 + 0.3*math.Sin(x)/math.Sqrt(x)
	s.Cext, s.Csca, s.Cabs, s.Cbb = q*g, q*g, 0, 0.01*q*g*(1+0.1*math.Cos(3*x))
	for a := range r.Mu {
		s.DCsca[a] = q * g * (1 + math.Sin(x+float64(a)))
	}
	return nil
}

// TestBackscatterSub: capping Cbb sub-points evaluates Cbb fewer times and
// still averages it over the bin.
func TestBackscatterSub(t *testing.T) {
	spec := testSpec()
	spec.Workers = 1
	spec.BackscatterSub = 4
	spec.BackscatterX = 1 // cap from x = 1 on, so the test grid exercises it
	tab := buildGeometric(t, spec)
	nb := tab.NBins()
	for l := range tab.Wavelengths {
		for i := 0; i < nb; i++ {
			c := l*nb + i
			// Cbb = 0.01·Cext for geometric{}; the strata differ, so only to
			// the midpoint/jitter error with 4 strata: h/4 ≤ 0.03 in ln D,
			// C ∝ D² → ≤ 6 % at worst for a one-sided jitter.
			if r := tab.Cbb[c] / tab.Cext[c] / 0.01; math.Abs(r-1) > 0.06 {
				t.Errorf("cell %d: Cbb/Cext = %g × 0.01", c, r)
			}
		}
	}
}

func TestEvaluate(t *testing.T) {
	tab := buildGeometric(t, testSpec())
	nb := tab.NBins()
	num := make([]float64, nb)
	for i := range num {
		num[i] = 1e6 * float64(i+1)
	}
	iop := tab.NewIOP()
	if err := tab.Evaluate(num, &iop); err != nil {
		t.Fatal(err)
	}
	// Straightforward oracle: plain sums.
	for l := range tab.Wavelengths {
		var a, b, bb, c float64
		for i := 0; i < nb; i++ {
			a += num[i] * tab.Cabs[l*nb+i]
			b += num[i] * tab.Csca[l*nb+i]
			bb += num[i] * tab.Cbb[l*nb+i]
			c += num[i] * tab.Cext[l*nb+i]
		}
		// sumTol: only summation order differs.
		const sumTol = 1e-14
		for _, p := range [][2]float64{{iop.A[l], a}, {iop.B[l], b}, {iop.Bb[l], bb}, {iop.C[l], c}} {
			if math.Abs(p[0]-p[1]) > sumTol*p[1] {
				t.Errorf("λ %d: %g vs oracle %g", l, p[0], p[1])
			}
		}
		// c = a + b (energy conservation of the evaluator carried through).
		if math.Abs(iop.C[l]-iop.A[l]-iop.B[l]) > 1e-14*iop.C[l] {
			t.Errorf("c ≠ a + b")
		}
	}
	// b_b ∝ concentration (common practice; exact for independent scatterers).
	num2 := make([]float64, nb)
	for i := range num {
		num2[i] = 3 * num[i]
	}
	iop2 := tab.NewIOP()
	_ = tab.Evaluate(num2, &iop2)
	for l := range iop.Bb {
		if math.Abs(iop2.Bb[l]/iop.Bb[l]-3) > 1e-14 {
			t.Errorf("b_b does not triple with concentration: ratio %g", iop2.Bb[l]/iop.Bb[l])
		}
	}
	if allocs := testing.AllocsPerRun(20, func() { _ = tab.Evaluate(num, &iop) }); allocs != 0 {
		t.Errorf("Evaluate allocates %v times", allocs)
	}
}

func TestPowerLawSlope(t *testing.T) {
	ls := []float64{400e-9, 450e-9, 500e-9, 550e-9, 600e-9, 650e-9, 700e-9}
	v := make([]float64, len(ls))
	for i, l := range ls {
		v[i] = 0.7 * math.Pow(l/550e-9, -1.3)
	}
	g, err := PowerLawSlope(ls, v, 400e-9, 700e-9)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(g-1.3) > 1e-12 {
		t.Errorf("γ = %g, want 1.3 (exact power law)", g)
	}
	if _, err := PowerLawSlope(ls, v, 520e-9, 540e-9); err == nil {
		t.Error("fit with no points in band accepted")
	}
}

func TestBadInput(t *testing.T) {
	if _, err := LogEdges(5e-6, 5e-6, 10); err == nil || !strings.Contains(err.Error(), "empty") {
		t.Errorf("empty range: %v", err)
	}
	spec := testSpec()
	spec.Edges = spec.Edges[:1]
	if _, err := Build(geometric{}, spec); err == nil || !strings.Contains(err.Error(), "empty size range") {
		t.Errorf("one edge: %v", err)
	}
	spec = testSpec()
	spec.Wavelengths = []float64{-5e-7}
	if _, err := Build(geometric{}, spec); err == nil || !strings.Contains(err.Error(), "Wavelengths[0] = -5e-07 m") {
		t.Errorf("negative wavelength: %v", err)
	}
	spec = testSpec()
	spec.Angles = []float64{4}
	if _, err := Build(geometric{}, spec); err == nil || !strings.Contains(err.Error(), "0 ≤ θ ≤ π") {
		t.Errorf("angle: %v", err)
	}
	tab, _ := Build(geometric{}, testSpec())
	num := make([]float64, tab.NBins())
	num[3] = -1
	iop := tab.NewIOP()
	if err := tab.Evaluate(num, &iop); err == nil || !strings.Contains(err.Error(), "bin 3 = -1 m-3") {
		t.Errorf("negative concentration: %v", err)
	}
}
