package plot_test

import (
	"fmt"
	"log"
	"os"
	"path/filepath"

	"github.com/murk-optics/murk/scenario/plot"
)

// A section along the Quell with one line per layer and the tidal range
// shaded, saved as SVG and PNG.
func Example() {
	dir, err := os.MkdirTemp("", "plot-example")
	if err != nil {
		log.Fatal(err)
	}
	defer os.RemoveAll(dir)

	km := []float64{0, 10, 20, 30}
	fig := plot.Section("Salinity along the Quell", km, plot.Quantity{Name: "Practical salinity", Unit: "1"},
		[]plot.Line{
			{Label: "upper layer", Y: []float64{0.1, 4, 18, 29}},
			{Label: "lower layer", Y: []float64{0.2, 9, 24, 31}},
		},
		&plot.Band{Label: "tidal range", Lo: []float64{0, 2, 14, 27}, Hi: []float64{0.5, 13, 28, 33}})
	if err := fig.Save(filepath.Join(dir, "salinity")); err != nil {
		log.Fatal(err)
	}
	entries, _ := os.ReadDir(dir)
	for _, e := range entries {
		fmt.Println(e.Name())
	}
	fmt.Println(fig.Y.Label())
	// Output:
	// salinity.png
	// salinity.svg
	// Practical salinity (dimensionless)
}
