package kernel

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/murk-optics/murk/mie"
	"github.com/murk-optics/murk/mie/refindex"
)

// TestSphereOracle compares Build with a straightforward loop over the same
// sub-points using mie.Sphere's convenience wrapper (a separate Solver per
// call, Qbb filled by the wrapper): only bookkeeping may differ.
func TestSphereOracle(t *testing.T) {
	water := refindex.ConstantMedium(1.34)
	mat := refindex.Relative{Rel: refindex.Constant{N: 1.17, K: 2e-4}, Water: water}
	edges, _ := LogEdges(0.3e-6, 8e-6, 12)
	spec := Spec{Edges: edges, Wavelengths: []float64{440e-9, 660e-9}, Angles: []float64{math.Pi / 2, 2.5}, Medium: water, Workers: 2}
	tab, err := Build(Sphere{Index: mat}, spec)
	if err != nil {
		t.Fatal(err)
	}
	p := spec.plan()
	nb := tab.NBins()
	for l, lam := range spec.Wavelengths {
		for i := 0; i < nb; i++ {
			n, jit := p.count(edges[i], edges[i+1], lam, 1.34)
			var sca, bb float64
			for j := 0; j < n; j++ {
				d := subPoint(edges[i], edges[i+1], j, n, jit)
				e, err := mie.Sphere(mie.SizeParameter(d, lam, 1.34), complex(1.17, 2e-4))
				if err != nil {
					t.Fatal(err)
				}
				g := math.Pi * d * d / 4
				sca += e.Qsca * g
				bb += e.Qbb * g
			}
			sca /= float64(n)
			bb /= float64(n)
			// oracleTol: the relative index 1.17·1.34/1.34 is rounded once.
			const oracleTol = 1e-12
			if c := l*nb + i; math.Abs(tab.Csca[c]-sca) > oracleTol*sca || math.Abs(tab.Cbb[c]-bb) > oracleTol*bb {
				t.Errorf("λ %g bin %d: Csca %g vs %g, Cbb %g vs %g", lam, i, tab.Csca[c], sca, tab.Cbb[c], bb)
			}
		}
	}
}

// TestRippleConvergence: bin averages at the default SubStep (0.2 in x,
// 4–5 points per ripple period of Chýlek 1976) agree with a ten times finer
// reference; two points per bin (aliasing) do not. Non-absorbing spheres,
// m = 1.2, bins at x ≈ 15–90, the region with strong ripple.
func TestRippleConvergence(t *testing.T) {
	water := refindex.ConstantMedium(1.34)
	mat := refindex.Relative{Rel: refindex.Constant{N: 1.2}, Water: water}
	edges, _ := LogEdges(2e-6, 12e-6, 40) // h = 0.045 in ln D, as a 200-bin 0.1–500 µm grid
	base := Spec{Edges: edges, Wavelengths: []float64{550e-9}, Medium: water, BackscatterSub: -1}
	build := func(step float64, min, max int) *Table {
		s := base
		s.SubStep, s.MinSub, s.MaxSub = step, min, max
		tab, err := Build(Sphere{Index: mat}, s)
		if err != nil {
			t.Fatal(err)
		}
		return tab
	}
	ref := build(0.02, 0, 0)
	def := build(0, 0, 0)
	alias := build(0, 2, 2)
	worst := func(tab *Table, q func(*Table) []float64) float64 {
		var w float64
		for c := range q(ref) {
			w = math.Max(w, math.Abs(q(tab)[c]/q(ref)[c]-1))
		}
		return w
	}
	sca := func(t *Table) []float64 { return t.Csca }
	bb := func(t *Table) []float64 { return t.Cbb }
	// Tolerances, from what a kernel needs rather than from this result:
	// bulk IOPs to 1 % when summed over the ≥ 20 bins a distribution spans,
	// whose sampling errors are uncorrelated (they come from different
	// resonances), so 1 % per bin for Csca and 5 % per bin for Cbb, whose
	// narrowest resonance spikes are sampled rather than resolved.
	const scaTol, bbTol = 0.01, 0.05
	ws, wb := worst(def, sca), worst(def, bb)
	t.Logf("default SubStep: worst bin error Csca %.2g, Cbb %.2g; two points per bin: Csca %.2g, Cbb %.2g",
		ws, wb, worst(alias, sca), worst(alias, bb))
	if ws > scaTol || wb > bbTol {
		t.Errorf("default sub-points: Csca error %.3g (tol %g), Cbb %.3g (tol %g)", ws, scaTol, wb, bbTol)
	}
	if worst(alias, bb) < 3*wb {
		t.Errorf("two points per bin not visibly worse (%.3g) than default (%.3g): the test cannot detect aliasing", worst(alias, bb), wb)
	}
}

// TestBackscatterSubsample measures the scatter of the capped Cbb (4
// jittered strata beyond BackscatterX) against every sub-point, for bins at
// x ≈ 250–400, and of their sum over the bins (what a population sees).
func TestBackscatterSubsample(t *testing.T) {
	if testing.Short() {
		t.Skip("O(x²) hemispherical integrals")
	}
	water := refindex.ConstantMedium(1.34)
	mat := refindex.Relative{Rel: refindex.Constant{N: 1.17, K: 1e-4}, Water: water}
	edges, _ := LogEdges(30e-6, 48e-6, 11)
	spec := Spec{Edges: edges, Wavelengths: []float64{550e-9}, Medium: water}
	capped, err := Build(Sphere{Index: mat}, spec)
	if err != nil {
		t.Fatal(err)
	}
	spec.BackscatterSub = -1
	full, err := Build(Sphere{Index: mat}, spec)
	if err != nil {
		t.Fatal(err)
	}
	var worst, sc, sf float64
	for c := range full.Cbb {
		worst = math.Max(worst, math.Abs(capped.Cbb[c]/full.Cbb[c]-1))
		sc += capped.Cbb[c]
		sf += full.Cbb[c]
	}
	t.Logf("Cbb from 4 strata vs all: worst bin %.3g, sum over %d bins %.3g", worst, len(full.Cbb), sc/sf-1)
	// Tolerances: as TestRippleConvergence's requirement on the sum (a few
	// per cent in b_b), with 4 samples per bin allowed 25 % per bin.
	if worst > 0.25 || math.Abs(sc/sf-1) > 0.05 {
		t.Errorf("capped Cbb: worst bin %.3g, sum %.3g", worst, sc/sf-1)
	}
	// The capped table did fewer hemispherical integrals but the same
	// everything else.
	for c := range full.Csca {
		if capped.Csca[c] != full.Csca[c] {
			t.Fatalf("Csca changed by the Cbb cap in cell %d", c)
		}
	}
}

// TestVSFIntegrals: the tabulated dCsca/dΩ integrates to Csca over the
// sphere and to Cbb over the back hemisphere (definitions; Bohren & Huffman
// 1983 eq. 3.24), with Gauss–Legendre in μ = cos θ (exact for the
// polynomial |S|² of degree 2N when the node count exceeds N; here x ≤ 12,
// N ≤ 22, 40 nodes per hemisphere).
func TestVSFIntegrals(t *testing.T) {
	const nodes = 40
	mu := make([]float64, 2*nodes)
	w := make([]float64, 2*nodes)
	glBack(mu[:nodes], w[:nodes], -1, 0)
	glBack(mu[nodes:], w[nodes:], 0, 1)
	angles := make([]float64, len(mu))
	for i, m := range mu {
		angles[i] = math.Acos(m)
	}
	water := refindex.ConstantMedium(1.34)
	edges, _ := LogEdges(0.2e-6, 1.5e-6, 6)
	tab, err := Build(Sphere{Index: refindex.Relative{Rel: refindex.Constant{N: 1.15, K: 1e-3}, Water: water}}, Spec{Edges: edges, Wavelengths: []float64{550e-9}, Angles: angles, Medium: water})
	if err != nil {
		t.Fatal(err)
	}
	nb, na := tab.NBins(), len(angles)
	for i := 0; i < nb; i++ {
		var all, back float64
		for a := 0; a < na; a++ {
			v := 2 * math.Pi * w[a] * tab.DCsca[a*nb+i]
			all += v
			if a < nodes {
				back += v
			}
		}
		// quadTol: exact quadrature of a polynomial; round-off only.
		const quadTol = 1e-10
		if math.Abs(all/tab.Csca[i]-1) > quadTol || math.Abs(back/tab.Cbb[i]-1) > quadTol {
			t.Errorf("bin %d: ∫VSF = %g vs Csca %g; back %g vs Cbb %g", i, all, tab.Csca[i], back, tab.Cbb[i])
		}
	}
}

func glBack(x, w []float64, lo, hi float64) { quad.Legendre{}.FixedLocations(x, w, lo, hi) }

// TestSphereDeterministic: Mie tables are bit-for-bit identical for 1 and 3
// workers (each cell is one worker's fixed-order sum).
func TestSphereDeterministic(t *testing.T) {
	water := refindex.ConstantMedium(1.34)
	edges, _ := LogEdges(0.2e-6, 30e-6, 30)
	spec := Spec{Edges: edges, Wavelengths: []float64{450e-9, 650e-9}, Angles: []float64{2.5}, Medium: water, BackscatterX: 50}
	ev := Sphere{Index: refindex.Relative{Rel: refindex.Constant{N: 1.17, K: 1e-4}, Water: water}}
	spec.Workers = 1
	a, err := Build(ev, spec)
	if err != nil {
		t.Fatal(err)
	}
	spec.Workers = 3
	b, err := Build(ev, spec)
	if err != nil {
		t.Fatal(err)
	}
	for k := range a.Cbb {
		if a.Cbb[k] != b.Cbb[k] || a.Cext[k] != b.Cext[k] || a.DCsca[k] != b.DCsca[k] {
			t.Fatalf("cell %d differs between 1 and 3 workers", k)
		}
	}
}
