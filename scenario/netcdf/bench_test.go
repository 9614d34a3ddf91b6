package netcdf

import (
	"io"
	"path/filepath"
	"testing"
)

// BenchmarkWrite4D streams a 4-D double variable of 24 × 200 × 2 × 100 =
// 960 000 values (7.68 MB) to io.Discard, one time step (40 000 values) per
// call, with time as the record dimension or as a fixed one, and (file)
// through Create to a real file. The io.Discard figures measure encoding;
// their allocations come from NewWriter only (none per Write call).
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
		if !unlimited {
			continue
		}
		// The same through Create: temporary file, buffered writes, fsync
		// and rename, so disk speed is included.
		b.Run("file", func(b *testing.B) {
			path := filepath.Join(b.TempDir(), "bench.nc")
			b.SetBytes(nt * nx * nl * nw * 8)
			b.ReportAllocs()
			for b.Loop() {
				err := Create(path, h, func(w *Writer) error {
					for range nt {
						if err := w.WriteFloat64s("bb", slab); err != nil {
							return err
						}
					}
					return nil
				})
				if err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
