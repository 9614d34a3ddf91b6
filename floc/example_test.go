package floc_test

import (
	"fmt"

	"github.com/murk-optics/murk/floc"
)

// A 100 µm floc of 4 µm mineral primaries with fractal dimension 2.
func ExampleFractal_Aggregate() {
	a, err := floc.DefaultFractal.Aggregate(100e-6, 1020)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("N = %.0f, φ = %.3f, Δρ = %.1f kg/m³, dry mass = %.3g kg\n", a.Primaries, a.SolidFraction, a.ExcessDensity, a.DryMass)
	// Output: N = 625, φ = 0.040, Δρ = 65.2 kg/m³, dry mass = 5.55e-11 kg
}

// Equilibrium size and its settling velocity in brackish water over a tide
// of shear rates.
func ExampleModel_Equilibrium() {
	m := floc.DefaultModel
	for _, g := range []float64{2, 10, 50} {
		d, err := m.Equilibrium(g, 0.2, 20, 15)
		if err != nil {
			fmt.Println(err)
			return
		}
		w, _ := m.SettlingVelocity(d, 20, 15, 0.2)
		fmt.Printf("G = %2.0f s⁻¹: D = %3.0f µm, w_s = %.2f mm/s\n", g, d*1e6, w*1e3)
	}
	// Output:
	// G =  2 s⁻¹: D = 140 µm, w_s = 0.41 mm/s
	// G = 10 s⁻¹: D =  65 µm, w_s = 0.19 mm/s
	// G = 50 s⁻¹: D =  31 µm, w_s = 0.09 mm/s
}

// Size relaxing after the shear drops at slack water.
func ExampleModel_Step() {
	m := floc.DefaultModel
	d := 40e-6
	for i := 1; i <= 3; i++ {
		d, _ = m.Step(d, 2, 0.2, 20, 15, 1800)
		fmt.Printf("after %d min: %.0f µm\n", 30*i, d*1e6)
	}
	// Output:
	// after 30 min: 56 µm
	// after 60 min: 81 µm
	// after 90 min: 112 µm
}
