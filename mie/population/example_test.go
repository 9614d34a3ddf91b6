package population_test

import (
	"fmt"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/population"
	"github.com/murk-optics/murk/mie/psd"
	"github.com/murk-optics/murk/mie/refindex"
)

// Quell estuary near-bed silt: 40 mg/L of mineral grains, log-normal by
// volume (D50 6 µm, σg 1.8), in water of index 1.34. The kernel is built
// once; the concentration then changes without rebuilding.
func Example() {
	water := refindex.ConstantMedium(1.34)
	silt := population.TypicalMineral(water)
	silt.Size, _ = psd.LognormalByVolume(1, 6e-6, 1.8)
	silt.Concentration, _ = psd.ParseConcentration(40, "mg/L")

	edges, _ := kernel.LogEdges(0.2e-6, 60e-6, 60)
	o, err := population.New(silt, kernel.Spec{Edges: edges, Wavelengths: []float64{550e-9, 660e-9}, Medium: water})
	if err != nil {
		fmt.Println(err)
		return
	}
	iop := o.Table.NewIOP()
	for _, mgL := range []float64{40, 80} {
		c, _ := psd.ParseConcentration(mgL, "mg/L")
		if err := o.SetConcentration(c); err != nil {
			fmt.Println(err)
			return
		}
		_ = o.IOP(&iop)
		fmt.Printf("%2.0f mg/L: c(550) %.2f m-1, b_b(550) %.4f m-1, b_b/b %.4f\n", mgL, iop.C[0], iop.Bb[0], iop.BackscatteringRatio(0))
	}
	fmt.Printf("volume inside the grid %.4f\n", o.Coverage())
	// Output:
	// 40 mg/L: c(550) 10.43 m-1, b_b(550) 0.2501 m-1, b_b/b 0.0243
	// 80 mg/L: c(550) 20.86 m-1, b_b(550) 0.5001 m-1, b_b/b 0.0243
	// volume inside the grid 1.0000
}
