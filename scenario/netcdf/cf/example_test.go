package cf_test

import (
	"fmt"
	"log"
	"os"
	"path/filepath"
	"time"

	"github.com/murk-optics/murk/scenario/netcdf"
	"github.com/murk-optics/murk/scenario/netcdf/cf"
)

// A tiny CF file: salinity along the Quell at two times. The Writer fills
// in the coordinate values; the caller streams only the data variable.
func Example() {
	dir, err := os.MkdirTemp("", "cf-example")
	if err != nil {
		log.Fatal(err)
	}
	defer os.RemoveAll(dir)

	d := &cf.Dataset{Global: cf.Global{Title: "Quell estuary salinity", Source: "murk example"}}
	d.AddTime(cf.Time{Epoch: time.Date(2026, 6, 1, 0, 0, 0, 0, time.UTC), Seconds: []float64{0, 3600}, Unlimited: true})
	d.AddCoord(cf.Coord{Name: "distance", Values: []float64{0, 5, 10}, Units: "km",
		LongName: "distance along channel from the river head", Axis: "X"})
	d.AddVar(cf.Var{Name: "salinity", Type: netcdf.Float, Dims: []string{"time", "distance"},
		Units: "1", LongName: "practical salinity", StandardName: cf.StdSalinity, Fill: true})

	path := filepath.Join(dir, "quell.nc")
	err = cf.Create(path, d, func(w *cf.Writer) error {
		for _, s := range [][]float32{{0.1, 8, 25}, {0.2, 12, netcdf.FillFloat}} {
			if err := w.Float32s("salinity", s); err != nil {
				return err
			}
		}
		return nil
	})
	if err != nil {
		log.Fatal(err)
	}
	info, err := os.Stat(path)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Println(cf.TimeUnits(time.Date(2026, 6, 1, 0, 0, 0, 0, time.UTC)))
	fmt.Printf("%s: %d bytes\n", filepath.Base(path), info.Size())
	// Output:
	// seconds since 2026-06-01 00:00:00
	// quell.nc: 792 bytes
}
