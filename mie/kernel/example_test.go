package kernel_test

import (
	"fmt"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/psd"
	"github.com/murk-optics/murk/mie/refindex"
)

// Build a kernel for weakly absorbing mineral spheres once, then evaluate
// bulk IOPs of two Junge populations from it.
func Example() {
	water := refindex.ConstantMedium(1.34)
	grain := kernel.Sphere{Index: refindex.Relative{Rel: refindex.Constant{N: 1.15, K: 1e-4}, Water: water}}
	edges, _ := kernel.LogEdges(0.1e-6, 20e-6, 60)
	tab, err := kernel.Build(grain, kernel.Spec{
		Edges:       edges,
		Wavelengths: []float64{450e-9, 550e-9, 650e-9},
		Medium:      water,
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	num := make([]float64, tab.NBins())
	iop := tab.NewIOP()
	for _, xi := range []float64{3.5, 4.5} {
		psd.BinNumbers(psd.PowerLaw{N: 1e12, Slope: xi, Min: 0.1e-6, Max: 20e-6}, edges, num)
		if err := tab.Evaluate(num, &iop); err != nil {
			fmt.Println(err)
			return
		}
		g, _ := kernel.PowerLawSlope(tab.Wavelengths, iop.C, 0, 1)
		fmt.Printf("ξ %.1f: c(550) %.3f m-1, b_b/b %.4f, γ %.2f\n", xi, iop.C[1], iop.BackscatteringRatio(1), g)
	}
	// Output:
	// ξ 3.5: c(550) 0.034 m-1, b_b/b 0.0200, γ 0.58
	// ξ 4.5: c(550) 0.004 m-1, b_b/b 0.0417, γ 1.45
}
