package optics

import (
	"math"
	"slices"
	"testing"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/refindex"
)

// mineralAbs is the mineral index in absolute terms for water of index 1.34.
var mineralAbs = refindex.Constant{N: real(mineral) * 1.34, K: imag(mineral) * 1.34}

func kernelSpec(nb, nl, workers int) kernel.Spec {
	edges, err := kernel.LogEdges(4e-6, 1e-3, nb)
	if err != nil {
		panic(err)
	}
	wl := make([]float64, nl)
	for i := range wl {
		wl[i] = 400e-9 + 380e-9*float64(i)/float64(max(nl-1, 1))
	}
	return kernel.Spec{
		Edges: edges, Wavelengths: wl, Angles: []float64{math.Pi / 2, 2.042, 2.443, math.Pi},
		Medium: refindex.ConstantMedium(1.34), MaxSub: 16, Workers: workers, // the documented floc spec
	}
}

func TestKernelDeterministic(t *testing.T) {
	// Identical tables for any number of workers (STYLE.md determinism).
	ev := Evaluator{Fractal: floc.DefaultFractal, Index: mineralAbs}
	a, err := kernel.Build(ev, kernelSpec(12, 3, 1))
	if err != nil {
		t.Fatal(err)
	}
	b, err := kernel.Build(ev, kernelSpec(12, 3, 2))
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range [][2][]float64{{a.Cext, b.Cext}, {a.Cbb, b.Cbb}, {a.DCsca, b.DCsca}} {
		if !slices.Equal(p[0], p[1]) {
			t.Fatal("tables differ between 1 and 2 workers")
		}
	}
}

func TestKernelMatchesDirect(t *testing.T) {
	// A one-sub-point bin is the method evaluated at the bin's centre in
	// ln D (the kernel builder's midpoint rule), bit for bit.
	spec := kernelSpec(5, 2, 1)
	spec.SubStep, spec.MinSub, spec.MaxSub = 1e9, 1, 1
	ev := Evaluator{Method: FractalRDG{}, Fractal: floc.DefaultFractal, Index: mineralAbs}
	tab, err := kernel.Build(ev, spec)
	if err != nil {
		t.Fatal(err)
	}
	var ws Workspace
	nb := tab.NBins()
	for l, lam := range tab.Wavelengths {
		for i := range nb {
			d := tab.Edges[i] * math.Exp(0.5*math.Log(tab.Edges[i+1]/tab.Edges[i]))
			p := Problem{Fractal: floc.DefaultFractal, Diameter: d, Wavelength: lam, MediumIndex: 1.34, Index: complex(mineralAbs.N, mineralAbs.K) / 1.34}
			cs, err := FractalRDG{}.Evaluate(&ws, p, nil, nil)
			if err != nil {
				t.Fatal(err)
			}
			c := l*nb + i
			if math.Abs(tab.Cext[c]/cs.Extinction-1) > 1e-13 || math.Abs(tab.Cbb[c]/cs.Backscattering-1) > 1e-13 {
				t.Errorf("cell %d: table %g/%g direct %g/%g", c, tab.Cext[c], tab.Cbb[c], cs.Extinction, cs.Backscattering)
			}
		}
	}
}

// BenchmarkKernel builds the kernel: 100 floc sizes (4 µm–1 mm) ×
// 20 wavelengths (400–780 nm), 4 angles, the documented floc spec (SubStep
// 0.2, at most 16 sub-points per bin; b_b at 3 of them for "bbsub3").
// Per-cell cost = ns/op ÷ 2000.
func BenchmarkKernel(b *testing.B) {
	for _, c := range []struct {
		m     Method
		bbSub int
	}{{Composite{}, 0}, {Composite{}, 3}, {FractalRDG{}, 0}} {
		name := c.m.Name()
		if c.bbSub > 0 {
			name += "/bbsub3"
		}
		b.Run(name, func(b *testing.B) {
			ev := Evaluator{Method: c.m, Fractal: floc.DefaultFractal, Index: mineralAbs}
			spec := kernelSpec(100, 20, 0)
			spec.BackscatterSub = c.bbSub
			b.ReportAllocs()
			for b.Loop() {
				if _, err := kernel.Build(ev, spec); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkEvaluate is the cost of one floc at one wavelength, with the
// primary's tables cached.
func BenchmarkEvaluate(b *testing.B) {
	mu := []float64{0, -0.5, -1}
	diff := make([]float64, len(mu))
	for _, m := range methods[:4] {
		for _, d := range []float64{20e-6, 200e-6, 1000e-6} {
			b.Run(m.Name()+"/"+map[float64]string{20e-6: "20um", 200e-6: "200um", 1000e-6: "1000um"}[d], func(b *testing.B) {
				var ws Workspace
				p := problem(d, 550e-9)
				if _, err := m.Evaluate(&ws, p, mu, diff); err != nil { // fill the primaries' cache
					b.Fatal(err)
				}
				b.ReportAllocs()
				for b.Loop() {
					if _, err := m.Evaluate(&ws, p, mu, diff); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}

func TestKernelFewSubPointsSuffice(t *testing.T) {
	// The documentation's recommended floc spec (SubStep default 0.2,
	// MaxSub 8, BackscatterSub 3) against a converged one (SubStep 0.02,
	// MaxSub 256) on bins 0.055 wide in ln D (100 bins over 4 µm–1 mm), near
	// the primary size (where the nearly solid porous sphere still shows
	// Mie ripple) and at 30 and 300 µm. Away from ripple the midpoint error
	// for C ∝ D^p is about (p·h/S)²/24 (Taylor expansion), below 1e-4 here.
	const smoothTol = 2e-3
	for _, m := range []Method{Composite{}, FractalRDG{}} {
		for _, d0 := range []float64{4e-6, 30e-6, 300e-6} {
			spec := kernelSpec(3, 2, 1) // one worker: the primaries' averages are computed once
			spec.Edges, _ = kernel.LogEdges(d0, d0*math.Exp(0.055*3), 3)
			spec.Angles = nil
			spec.SubStep, spec.MaxSub, spec.BackscatterSub = 0, 16, 0
			few, err := kernel.Build(Evaluator{Method: m, Fractal: floc.DefaultFractal, Index: mineralAbs}, spec)
			if err != nil {
				t.Fatal(err)
			}
			spec.SubStep, spec.MaxSub, spec.BackscatterSub = 0.02, 256, 0
			many, err := kernel.Build(Evaluator{Method: m, Fractal: floc.DefaultFractal, Index: mineralAbs}, spec)
			if err != nil {
				t.Fatal(err)
			}
			for c := range few.Cext {
				for _, v := range [][2]float64{{few.Cext[c], many.Cext[c]}, {few.Cbb[c], many.Cbb[c]}} {
					if math.Abs(v[0]/v[1]-1) > smoothTol {
						t.Errorf("%s D0=%g cell %d: recommended %g, converged %g (%.2g)", m.Name(), d0, c, v[0], v[1], v[0]/v[1]-1)
					}
				}
			}
		}
	}
}
