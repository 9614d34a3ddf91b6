package iop_test

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/water"
)

func Example() {
	// Mid-estuary water in the Quell at salinity 17, 14 °C.
	wl := []float64{440e-9, 555e-9, 670e-9}
	s, err := iop.New(wl, []float64{math.Pi / 2, 2.44}) // 90° and 140°
	if err != nil {
		fmt.Println(err)
		return
	}
	river, _ := water.NewCDOM(440e-9, 3.0, 0.018)
	sea, _ := water.NewCDOM(440e-9, 0.04, 0.014)
	mix := water.CDOMMixing{River: river, Ocean: sea, RiverSalinity: 0, OceanSalinity: 34}
	if err := s.AddWater("water", water.Medium{Salinity: 17, TemperatureC: 14}); err != nil {
		fmt.Println(err)
		return
	}
	if err := s.AddCDOM("cdom", mix, 17); err != nil {
		fmt.Println(err)
		return
	}
	tot := s.Total()
	for i, l := range wl {
		fmt.Printf("%3.0f nm  a %.4f  b %.5f  bb %.6f  c %.4f m-1\n",
			l*1e9, tot.A[i], tot.B[i], tot.Bb[i], tot.Value(iop.Attenuation, i))
	}
	// Output:
	// 440 nm  a 1.5264  b 0.00393  bb 0.001963  c 1.5303 m-1
	// 555 nm  a 0.2529  b 0.00148  bb 0.000739  c 0.2544 m-1
	// 670 nm  a 0.4637  b 0.00068  bb 0.000338  c 0.4644 m-1
}

func ExampleFitPowerLaw() {
	wl := []float64{450e-9, 550e-9, 650e-9}
	bbp := []float64{0.0122, 0.0100, 0.0085} // m-1
	p, _ := iop.FitPowerLaw(wl, bbp, 550e-9)
	fmt.Printf("b_bp(550) = %.4f m-1, slope %.2f\n", p.Value, p.Slope)
	// Output:
	// b_bp(550) = 0.0100 m-1, slope 0.98
}
