package products

import (
	"context"
	"testing"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/demo"
)

// BenchmarkWriteOutputs writes every product of the demo (CSV tables at
// the stations and at every cell, NetCDF, figures, summary).
func BenchmarkWriteOutputs(b *testing.B) {
	s, err := demo.Scenario()
	if err != nil {
		b.Fatal(err)
	}
	r, err := scenario.Run(context.Background(), s, scenario.Options{})
	if err != nil {
		b.Fatal(err)
	}
	dir := b.TempDir()
	b.ReportAllocs()
	for b.Loop() {
		if _, err := WriteOutputs(r, dir); err != nil {
			b.Fatal(err)
		}
	}
}
