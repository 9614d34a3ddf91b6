package population

import (
	"math"
	"testing"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/psd"
)

// benchSpec is the benchmark grid: 200 bins over 0.1–500 µm, 20
// wavelengths 400–780 nm, default sub-point rule.
func benchSpec() kernel.Spec {
	edges, _ := kernel.LogEdges(0.1e-6, 500e-6, 200)
	ls := make([]float64, 20)
	for i := range ls {
		ls[i] = 400e-9 + float64(i)*20e-9
	}
	return kernel.Spec{Edges: edges, Wavelengths: ls, Medium: water}
}

// BenchmarkBuildKernel builds the mineral kernel. Run with -benchtime=1x:
// one build takes tens of seconds. Sub-benchmarks separate the
// hemispherical backscattering integral (Cbb) from the rest.
func BenchmarkBuildKernel(b *testing.B) {
	for _, c := range []struct {
		name string
		mod  func(*kernel.Spec)
	}{
		{"NoBackscatter", func(s *kernel.Spec) { s.SkipBackscatter = true }},
		{"Default", func(*kernel.Spec) {}},
	} {
		b.Run(c.name, func(b *testing.B) {
			spec := benchSpec()
			c.mod(&spec)
			ev := TypicalMineral(water).Evaluator()
			b.ReportAllocs()
			var tab *kernel.Table
			for b.Loop() {
				var err error
				if tab, err = kernel.Build(ev, spec); err != nil {
					b.Fatal(err)
				}
			}
			var sub int64
			for _, s := range tab.SubPoints {
				sub += int64(s)
			}
			cells := float64(len(tab.SubPoints))
			b.ReportMetric(b.Elapsed().Seconds()/float64(b.N)/cells*1e3, "ms/cell")
			b.ReportMetric(float64(sub)/cells, "subpoints/cell")
		})
	}
}

// BenchmarkIOP: bulk IOPs of one population from a built kernel (200 bins ×
// 20 wavelengths, 3 VSF angles).
func BenchmarkIOP(b *testing.B) {
	spec := benchSpec()
	spec.Edges, _ = kernel.LogEdges(0.1e-6, 5e-6, 200) // small sizes: the table only needs to exist
	spec.Angles = []float64{math.Pi / 2, 2.0944, 2.618}
	p := TypicalMineral(water)
	p.Size = psd.PowerLaw{N: 1, Slope: 4, Min: 0.1e-6, Max: 5e-6}
	p.Concentration = psd.Concentration{Basis: psd.ByMass, Value: 0.02}
	o, err := New(p, spec)
	if err != nil {
		b.Fatal(err)
	}
	iop := o.Table.NewIOP()
	b.ReportAllocs()
	for b.Loop() {
		if err := o.IOP(&iop); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.N)*200*20/b.Elapsed().Seconds(), "binλ/s")
}

// BenchmarkSetDistribution: re-binning a new size distribution (what a
// floc-size change costs per station and time step).
func BenchmarkSetDistribution(b *testing.B) {
	spec := benchSpec()
	spec.Edges, _ = kernel.LogEdges(0.1e-6, 5e-6, 200)
	spec.Wavelengths = spec.Wavelengths[:1]
	p := TypicalMineral(water)
	p.Size = psd.Lognormal{N: 1, Median: 1e-6, GSD: 2}
	p.Concentration = psd.Concentration{Basis: psd.ByMass, Value: 0.02}
	o, err := New(p, spec)
	if err != nil {
		b.Fatal(err)
	}
	var d psd.Distribution = psd.Lognormal{N: 1, Median: 1.2e-6, GSD: 1.9}
	b.ReportAllocs()
	for b.Loop() {
		if err := o.SetDistribution(d); err != nil {
			b.Fatal(err)
		}
	}
}
