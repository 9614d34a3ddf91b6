package scenario

import (
	"context"
	"testing"

	"github.com/murk-optics/murk/scenario/demo"
)

// BenchmarkDemo runs the embedded demo scenario end to end (the issue's
// speed target: about 2 s on 2 cores).
func BenchmarkDemo(b *testing.B) {
	s, err := demo.Scenario()
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Run(context.Background(), s, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkFill is the cheap per-point part: water, CDOM and every
// population's IOPs at one station, layer and time.
func BenchmarkFill(b *testing.B) {
	r := runSmall(&testing.T{})
	s := r.Scenario
	pops, err := buildPopulations(context.Background(), s, Options{Kernel: DefaultKernel}, referenceWater(s), func(string, ...any) {})
	if err != nil {
		b.Fatal(err)
	}
	opt, _ := Options{}.normalise()
	w, err := r.newWorker(pops, opt)
	if err != nil {
		b.Fatal(err)
	}
	for i, po := range pops {
		w.mass[i], w.flocD[i] = 0.05, 80e-6
		if po.isFloc {
			w.flocD[i] = 80e-6
		}
	}
	b.ReportAllocs()
	for b.Loop() {
		if err := w.fill(r, pops, 12, 11.5); err != nil {
			b.Fatal(err)
		}
	}
}
