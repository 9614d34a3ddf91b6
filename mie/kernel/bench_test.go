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
