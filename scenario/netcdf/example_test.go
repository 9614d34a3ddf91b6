package netcdf_test

import (
	"bytes"
	"fmt"
	"log"

	"github.com/murk-optics/murk/scenario/netcdf"
)

// A file with one record variable, streamed one record at a time.
func Example() {
	h := netcdf.Header{
		Format:  netcdf.CDF1,
		NumRecs: 2,
		Dims:    []netcdf.Dim{{Name: "time", Unlimited: true}, {Name: "station", Len: 3}},
		Attrs:   []netcdf.Attr{netcdf.Text("title", "Quellmouth gauges")},
		Vars: []netcdf.Var{
			{Name: "station", Type: netcdf.Int, Dims: []string{"station"}},
			{Name: "level", Type: netcdf.Float, Dims: []string{"time", "station"},
				Attrs: []netcdf.Attr{netcdf.Text("units", "m")}},
		},
	}
	var buf bytes.Buffer
	w, err := netcdf.NewWriter(&buf, h)
	if err != nil {
		log.Fatal(err)
	}
	if err := w.WriteInt32s("station", []int32{1, 2, 3}); err != nil {
		log.Fatal(err)
	}
	for r := range 2 {
		name, rec, n := w.Next()
		fmt.Printf("due: %s record %d, %d values\n", name, rec, n)
		if err := w.WriteFloat32s("level", []float32{1.5, 2, float32(r)}); err != nil {
			log.Fatal(err)
		}
	}
	if err := w.Close(); err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%q, %d bytes\n", buf.Bytes()[:4], buf.Len())
	// Output:
	// due: level record 0, 3 values
	// due: level record 1, 3 values
	// "CDF\x01", 244 bytes
}
