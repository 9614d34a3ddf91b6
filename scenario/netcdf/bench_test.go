package netcdf

import (
	"io"
	"testing"
)

// BenchmarkWrite4D streams a 4-D double variable of 24 × 200 × 2 × 100 =
// 960 000 values (7.68 MB) to io.Discard, one time step (40 000 values) per
// call, with time as the record dimension or as a fixed one. The MB/s
// figure measures encoding; allocations come from NewWriter only.
func BenchmarkWrite4D(b *testing.B) {
	const nt, nx, nl, nw = 24, 200, 2, 100
	slab := make([]float64, nx*nl*nw)
	for i := range slab {
		slab[i] = 1e-3 * float64(i)
	}
	for _, unlimited := range []bool{true, false} {
		name := "fixed-time"
		if unlimited {
			name = "record-time"
		}
		h := Header{
			Format: CDF2,
			Dims: []Dim{{Name: "time", Len: nt, Unlimited: unlimited}, {Name: "distance", Len: nx},
				{Name: "layer", Len: nl}, {Name: "wavelength", Len: nw}},
			Vars: []Var{{Name: "bb", Type: Double, Dims: []string{"time", "distance", "layer", "wavelength"},
				Attrs: []Attr{Text("units", "m-1")}}},
		}
		if unlimited {
			h.NumRecs = nt
		}
		b.Run(name, func(b *testing.B) {
			b.SetBytes(nt * nx * nl * nw * 8)
			b.ReportAllocs()
			for b.Loop() {
				w, err := NewWriter(io.Discard, h)
				if err != nil {
					b.Fatal(err)
				}
				for range nt {
					if err := w.WriteFloat64s("bb", slab); err != nil {
						b.Fatal(err)
					}
				}
				if err := w.Close(); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
