package kernel

import (
	"math"
	"testing"

	"github.com/murk-optics/murk/mie/refindex"
)

// BenchmarkEvaluate: 200 bins × 20 wavelengths × (4 coefficients + 5 VSF
// angles). Report bin·wavelength products per second with the custom metric.
func BenchmarkEvaluate(b *testing.B) {
	edges, _ := LogEdges(0.1e-6, 500e-6, 200)
	ls := make([]float64, 20)
	for i := range ls {
		ls[i] = 400e-9 + float64(i)*20e-9
	}
	tab, err := Build(geometric{}, Spec{Edges: edges, Wavelengths: ls, Angles: []float64{0.1, 1, 2, 2.5, math.Pi}, Medium: refindex.ConstantMedium(1.34), MaxSub: 4})
	if err != nil {
		b.Fatal(err)
	}
	num := make([]float64, 200)
	for i := range num {
		num[i] = 1e6 / float64(i+1)
	}
	iop := tab.NewIOP()
	b.ReportAllocs()
	for b.Loop() {
		if err := tab.Evaluate(num, &iop); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.N)*200*20/b.Elapsed().Seconds(), "binλ/s")
}

// BenchmarkBuildSphere: a small Mie kernel (50 bins over 0.1–10 µm, 5
// wavelengths, 3 angles, Cbb everywhere below x = 200), per regime of the
// cost.
func BenchmarkBuildSphere(b *testing.B) {
	water := refindex.ConstantMedium(1.34)
	ev := Sphere{Index: refindex.Relative{Rel: refindex.Constant{N: 1.15, K: 1e-4}, Water: water}}
	for _, c := range []struct {
		name     string
		min, max float64
		skipBB   bool
	}{
		{"0.1-1um", 0.1e-6, 1e-6, false},
		{"1-10um", 1e-6, 10e-6, false},
		{"1-10um-noBB", 1e-6, 10e-6, true},
	} {
		b.Run(c.name, func(b *testing.B) {
			edges, _ := LogEdges(c.min, c.max, 50)
			spec := Spec{Edges: edges, Wavelengths: []float64{400e-9, 500e-9, 600e-9, 700e-9, 800e-9}, Angles: []float64{1, 2, 3}, Medium: water, SkipBackscatter: c.skipBB}
			b.ReportAllocs()
			for b.Loop() {
				if _, err := Build(ev, spec); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(b.Elapsed().Seconds()/float64(b.N)/250*1e6, "µs/cell")
		})
	}
}
