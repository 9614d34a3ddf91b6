package sensing_test

import (
	"fmt"

	"github.com/murk-optics/murk/scenario/sensing"
)

// A radiometer band reads the remote-sensing reflectance weighted by its
// Gaussian response; for a flat spectrum that is the spectrum's value.
func ExampleRadiometerBand() {
	p := sensing.NewPoint([]float64{600e-9, 650e-9, 700e-9}, nil)
	p.Rrs = []float64{0.012, 0.012, 0.012}
	band := sensing.RadiometerBand{Name: "red", Wavelength: 650e-9, Width: 30e-9}
	rd, err := band.Read(p)
	if err != nil {
		fmt.Println(err)
		return
	}
	d := band.Describe()
	fmt.Printf("%s: %.4f %s\n", d.Quantity, rd.Value, d.Unit)
	// Output:
	// remote-sensing reflectance R_rs in band: 0.0120 sr-1
}
