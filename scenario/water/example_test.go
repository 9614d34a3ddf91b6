package water_test

import (
	"fmt"

	"github.com/murk-optics/murk/scenario/water"
)

func ExampleAbsorption() {
	for _, nm := range []float64{440, 550, 700, 860} {
		a, err := water.Absorption(nm * 1e-9) // wavelengths in metres
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("%g nm: a_w = %.4g m-1\n", nm, a)
	}
	_, err := water.AbsorptionNM(1000)
	fmt.Println(err)
	// Output:
	// 440 nm: a_w = 0.00635 m-1
	// 550 nm: a_w = 0.0565 m-1
	// 700 nm: a_w = 0.624 m-1
	// 860 nm: a_w = 4.94 m-1
	// water: wavelength = 1000 nm outside the allowed range [350, 900] nm
}

func ExampleScatter() {
	fresh := water.Medium{Salinity: 0, TemperatureC: 20}
	sea := water.Medium{Salinity: 35, TemperatureC: 20}
	w, _ := water.Scatter(500e-9, fresh, 0)
	s, _ := water.Scatter(500e-9, sea, 0)
	fmt.Printf("b_w = %.4e m-1, b_sw = %.4e m-1, ratio %.3f\n", w.B, s.B, s.B/w.B)
	fmt.Printf("b_bsw = %.4e m-1\n", s.Bb)
	// Output:
	// b_w = 1.9575e-03 m-1, b_sw = 2.5473e-03 m-1, ratio 1.301
	// b_bsw = 1.2737e-03 m-1
}

func ExampleRefractiveIndex() {
	n, _ := water.RefractiveIndex(589.3e-9, water.Medium{Salinity: 0, TemperatureC: 20})
	fmt.Printf("n = %.5f\n", n)
	// Output:
	// n = 1.33337
}

func ExampleCDOMMixing() {
	// Quell estuary: dark river water meets clear sea water.
	river, _ := water.NewCDOM(440e-9, 4.0, 0.018) // slope in nm⁻¹
	sea, _ := water.NewCDOM(440e-9, 0.05, 0.014)
	mix := water.CDOMMixing{River: river, Ocean: sea, RiverSalinity: 0, OceanSalinity: 34}
	for _, s := range []float64{0, 17, 34} {
		a, _ := mix.Absorption(440e-9, s)
		fmt.Printf("S = %2.0f: a_g(440) = %.3f m-1\n", s, a)
	}
	// Output:
	// S =  0: a_g(440) = 4.000 m-1
	// S = 17: a_g(440) = 2.025 m-1
	// S = 34: a_g(440) = 0.050 m-1
}

func ExampleCellIndex() {
	// Quell estuary diatoms: 10 µm cells holding 3 kg m⁻³ chlorophyll
	// (3e6 mg m⁻³) in water of 5 psu at 15 °C, at Chl = 4 mg m⁻³.
	const lambda = 440e-9
	p := water.BricaudDefault()
	aCell, _ := p.Specific(lambda, 4*water.MilligramPerCubicMetre) // m² kg⁻¹
	nw, _ := water.RefractiveIndex(lambda, water.Medium{Salinity: 5, TemperatureC: 15})
	aSol, _ := water.UnpackagedSpecific(aCell, 3, 10e-6)
	k, _ := water.CellIndex(aCell, 3, 10e-6, lambda, nw)
	fmt.Printf("a*_cell = %.4f m2 mg-1, a*_sol = %.4f m2 mg-1, k = %.2e\n", aCell/1e6, aSol/1e6, k)
	// Output:
	// a*_cell = 0.0244 m2 mg-1, a*_sol = 0.0350 m2 mg-1, k = 2.74e-03
}
