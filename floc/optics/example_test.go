package optics_test

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/floc/optics"
)

// Attenuation and backscattering per unit mass of a 200 µm mineral floc at
// 555 nm with the default (composite) method, and the VSF at 90° and 140°,
// for the default primaries (Sauter diameter 4 µm, σ_g = 2).
func ExampleComposite() {
	var ws optics.Workspace
	d := 200e-6
	p := optics.Problem{Fractal: floc.DefaultFractal, Diameter: d, Wavelength: 555e-9, MediumIndex: 1.34, Index: complex(1.17, 0.0003)}
	mu := []float64{math.Cos(math.Pi / 2), math.Cos(140 * math.Pi / 180)}
	vsf := make([]float64, len(mu))
	cs, err := optics.Composite{}.Evaluate(&ws, p, mu, vsf)
	if err != nil {
		fmt.Println(err)
		return
	}
	a, _ := floc.DefaultFractal.Aggregate(d, 1025)
	g := a.DryMass * 1000
	fmt.Printf("c* = %.3f m²/g, b_b* = %.4f m²/g, b_b/b = %.4f\n", cs.Extinction/g, cs.Backscattering/g, cs.Backscattering/cs.Scattering)
	fmt.Printf("β*(90°) = %.2e, β*(140°) = %.2e m² sr⁻¹ g⁻¹\n", vsf[0]/g, vsf[1]/g)
	fmt.Printf("phase shift ρ = %.1f\n", cs.PhaseShift)
	// Output:
	// c* = 0.312 m²/g, b_b* = 0.0078 m²/g, b_b/b = 0.0254
	// β*(90°) = 9.22e-04, β*(140°) = 7.76e-04 m² sr⁻¹ g⁻¹
	// phase shift ρ = 10.3
}
