package psd_test

import (
	"fmt"
	"strings"

	"github.com/murk-optics/murk/mie/psd"
)

// A log-normal mineral silt given by volume median and spread, normalised to
// 20 mg/L of quartz-density grains.
func Example() {
	shape, err := psd.LognormalByVolume(1, 8e-6, 1.8) // D50 8 µm, σg 1.8
	if err != nil {
		fmt.Println(err)
		return
	}
	c, _ := psd.ParseConcentration(20, "mg/L")
	silt, err := psd.Normalize(shape, c, 2650)
	if err != nil {
		fmt.Println(err)
		return
	}
	n, _ := psd.Amount(silt, psd.ByNumber, 0)
	v, _ := psd.Amount(silt, psd.ByVolume, 0)
	d50, _ := psd.VolumeMedianDiameter(silt)
	d32, _ := psd.SauterDiameter(silt)
	fmt.Printf("number %.3g per litre, volume %.3g µL/L\n", n/1e3, v*1e6)
	fmt.Printf("D50 %.2f µm, D32 %.2f µm\n", d50*1e6, d32*1e6)
	// Output:
	// number 1.33e+08 per litre, volume 7.55 µL/L
	// D50 8.00 µm, D32 6.73 µm
}

// Reading a sizer export: volume per class in µL/L.
func ExampleReadCSV() {
	text := `# station QM-1
lower (um), upper (um), volume (uL/L)
4, 8, 1.5
8, 16, 3.0
16, 32, 1.5
`
	b, err := psd.ReadCSV(strings.NewReader(text), "qm1.csv")
	if err != nil {
		fmt.Println(err)
		return
	}
	v, _ := psd.Amount(b, psd.ByVolume, 0)
	d50, _ := psd.VolumeMedianDiameter(b)
	fmt.Printf("%d classes, %.1f µL/L, D50 %.1f µm\n", len(b.Classes), v*1e6, d50*1e6)
	// Output: 3 classes, 6.0 µL/L, D50 11.3 µm
}
