package refindex_test

import (
	"fmt"

	"github.com/murk-optics/murk/mie/refindex"
)

// A mineral quoted relative to water (1.16, weakly absorbing in the blue)
// placed in sea water of index 1.34, then seen from a slightly fresher water.
func Example() {
	mineral := refindex.Relative{
		Rel:   refindex.Smooth{Ref: 440e-9, N: 1.16, K: 8e-4, S: 1.2e7, KFloor: 1e-5},
		Water: refindex.ConstantMedium(1.34),
	}
	for _, l := range []float64{440e-9, 550e-9, 670e-9} {
		abs, _ := mineral.Index(l)
		rel, _ := refindex.InMedium(mineral, refindex.ConstantMedium(1.335), l)
		fmt.Printf("%.0f nm: absolute %.4f%+.2ei, relative %.4f%+.2ei\n", l*1e9, real(abs), imag(abs), real(rel), imag(rel))
	}
	// Output:
	// 440 nm: absolute 1.5544+1.09e-03i, relative 1.1643+8.13e-04i
	// 550 nm: absolute 1.5544+3.00e-04i, relative 1.1643+2.25e-04i
	// 670 nm: absolute 1.5544+8.12e-05i, relative 1.1643+6.09e-05i
}
