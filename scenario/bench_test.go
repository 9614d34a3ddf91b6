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
	s := smallDemo(b)
	r0, err := Run(context.Background(), s, Options{})
	if err != nil {
		b.Fatal(err)
	}
	r, w := fillWorker(b, r0)
	b.ReportAllocs()
	for b.Loop() {
		if err := w.fill(r.Plan, 12, 11.5); err != nil {
			b.Fatal(err)
		}
	}
}
