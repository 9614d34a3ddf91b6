package seen_test

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/scenario/seen"
)

// quellStation returns illustrative bulk IOPs for a muddy station off
// Quellmouth in the fictional Quell estuary, 400–710 nm every 10 nm: pure
// water absorption (Pope & Fry 1997 to 700 nm, Segelstein 1981 at 710 nm),
// dissolved organic matter and mineral particles with exponential
// absorption, and particle scattering with a power-law spectrum.
func quellStation() (seen.Spectra, []float64) {
	aw := []float64{0.00663, 0.00473, 0.00454, 0.00495, 0.00635, 0.00922, 0.00979, 0.0106,
		0.0127, 0.015, 0.0204, 0.0325, 0.0409, 0.0434, 0.0474, 0.0565, 0.0619, 0.0695, 0.0896,
		0.1351, 0.2224, 0.2644, 0.2755, 0.2916, 0.3108, 0.34, 0.41, 0.439, 0.465, 0.516, 0.624, 0.8996}
	var s seen.Spectra
	var bbw []float64
	for i, a := range aw {
		nm := 400 + 10*float64(i)
		cdom := 0.6 * math.Exp(-0.016*(nm-440))
		nap := 0.25 * math.Exp(-0.011*(nm-440))
		bp := 4 * math.Pow(550/nm, 0.4)
		bw := 0.0026 * math.Pow(500/nm, 4.3) // seawater, ≈ twice b_bw
		s.Wavelength = append(s.Wavelength, nm*1e-9)
		s.A = append(s.A, a+cdom+nap)
		s.B = append(s.B, bp+bw)
		s.Bb = append(s.Bb, 0.018*bp+bw/2)
		bbw = append(bbw, bw/2)
	}
	return s, bbw
}

// A station in the Quell estuary seen from above with the sun 35° from the
// zenith.
func Example() {
	s, bbw := quellStation()
	obs := seen.Observer{SolarZenith: 35 * math.Pi / 180}
	var ap seen.Apparent
	if err := obs.See(&ap, s, bbw); err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("R_rs(560 nm) = %.4f sr⁻¹\n", ap.Rrs[16])
	fmt.Printf("Secchi depth %.2f m (window %.0f nm, K_d %.2f m⁻¹)\n",
		ap.Secchi.Depth, ap.Secchi.Wavelength*1e9, ap.Secchi.Kd)
	fmt.Printf("hue angle %.1f°, dominant wavelength %.1f nm, Forel-Ule %d\n",
		ap.Colour.HueAngle, ap.Colour.DominantWavelength*1e9, ap.Colour.ForelUle)
	fmt.Println("flags:", ap.Flags)
	// Output:
	// R_rs(560 nm) = 0.0165 sr⁻¹
	// Secchi depth 1.71 m (window 570 nm, K_d 0.53 m⁻¹)
	// hue angle 68.0°, dominant wavelength 567.8 nm, Forel-Ule 12
	// flags: outside-fit
}

// A 25 cm transmissometer with a 0.93° acceptance half-angle, in water whose
// VSF is a Henyey–Greenstein function with g = 0.92.
func ExampleTransmissometer_Read() {
	const a, b, g = 0.4, 3.0, 0.92
	var vsf seen.VSF
	for i := 0; i <= 180; i++ {
		th := math.Pi * math.Pow(float64(i)/180, 3) // dense near 0
		vsf.Angle = append(vsf.Angle, th)
		vsf.Beta = append(vsf.Beta, b*(1-g*g)/(4*math.Pi*math.Pow(1+g*g-2*g*math.Cos(th), 1.5)))
	}
	tr := seen.Transmissometer{PathLength: 0.25, AcceptanceHalfAngle: 0.93 * math.Pi / 180}
	r, err := tr.Read(a, b, vsf)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("true c %.3f m⁻¹, measured c %.3f m⁻¹ (%.1f %% of b collected)\n",
		r.TrueAttenuation, r.Attenuation, 100*r.CollectedFraction)
	fmt.Printf("transmittance %.3f, optical depth %.2f, flags %v\n", r.Transmittance, r.OpticalDepth, r.Flags)
	// Output:
	// true c 3.400 m⁻¹, measured c 3.342 m⁻¹ (1.9 % of b collected)
	// transmittance 0.434, optical depth 0.85, flags thick-path
}

// A backscattering sensor with its centroid at 124°, deployed in the Quell
// estuary's turbidity maximum; water β and b_b at 20 °C, salinity 15.
func ExampleBackscatterSensor_Read() {
	vsf := seen.VSF{
		Angle: []float64{90 * math.Pi / 180, 120 * math.Pi / 180, 130 * math.Pi / 180, 180 * math.Pi / 180},
		Beta:  []float64{0.0410, 0.0215, 0.0190, 0.0170}, // m⁻¹ sr⁻¹
	}
	s := seen.BackscatterSensor{Angle: 124 * math.Pi / 180, WaterBeta: 1.1e-4, WaterBb: 1.0e-3}
	r, err := s.Read(vsf)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("β(124°) = %.4f m⁻¹ sr⁻¹, χ_p = %.3f ± %.1f %%\n", r.Beta, r.Chi, 100*r.ChiUncertainty)
	fmt.Printf("b_bp = %.4f m⁻¹, b_b = %.4f m⁻¹\n", r.ParticleBb, r.Bb)
	fmt.Printf("b_b integrated from the VSF = %.4f m⁻¹\n", r.VSFBb)
	// Output:
	// β(124°) = 0.0204 m⁻¹ sr⁻¹, χ_p = 1.119 ± 3.7 %
	// b_bp = 0.1430 m⁻¹, b_b = 0.1440 m⁻¹
	// b_b integrated from the VSF = 0.1532 m⁻¹
}

// An ISO 7027 turbidimeter calibrated on a standard of 40 FNU whose β(90°)
// at 860 nm is taken as 0.55 m⁻¹ sr⁻¹ (an assumed, instrument-specific
// calibration, not a property of formazin supplied by this package).
func ExampleTurbidimeter_Read() {
	tm := seen.Turbidimeter{
		WaterBeta90: 2.0e-5,
		PathLength:  0.015,
		Calibration: seen.Calibration{Turbidity: 40, Beta90: 0.55, Attenuation: 6},
	}
	vsf := seen.VSF{Angle: []float64{0, math.Pi / 2, math.Pi}, Beta: []float64{90, 0.31, 0.25}}
	r, err := tm.Read(860e-9, 4.2, vsf)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%.1f FNU-equivalent, flags %v\n", r.Turbidity, r.Flags)
	// Output:
	// 23.2 FNU-equivalent, flags none
}

// Choosing the gain range of a 12-bit backscatter channel so that the
// brightest expected water (β = 0.05 m⁻¹ sr⁻¹) does not saturate, then
// checking which of three gains an autoranging sensor would use.
func ExampleElectronics_ChooseGain() {
	e := seen.Electronics{Offset: 60, DarkNoise: 1.5, FullScale: 4095}
	g, err := e.MaxGain(0.05)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("largest safe gain %.0f counts per m⁻¹ sr⁻¹\n", g)
	gains := []float64{8000, 40000, 200000}
	for _, beta := range []float64{0.0004, 0.004, 0.04, 0.4} {
		i, ok, _ := e.ChooseGain(gains, beta)
		e.Gain = gains[i]
		d, _ := e.Read(beta, 0)
		fmt.Printf("β %.4f: gain %6.0f, %4.0f counts, in range %v, flags %v\n", beta, gains[i], d.Counts, ok, d.Flags)
	}
	// Output:
	// largest safe gain 80610 counts per m⁻¹ sr⁻¹
	// β 0.0004: gain 200000,  140 counts, in range true, flags none
	// β 0.0040: gain 200000,  860 counts, in range true, flags none
	// β 0.0400: gain  40000, 1660 counts, in range true, flags none
	// β 0.4000: gain   8000, 3260 counts, in range true, flags none
}

// Secchi depth from K_d and R_rs in the transparent window.
func ExampleSecchiDepth() {
	z, flags, err := seen.SecchiDepth(0.5, 0.01)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Z_SD = %.2f m, flags %v\n", z, flags)
	// Output:
	// Z_SD = 1.84 m, flags none
}

// Colour of a green-brown reflectance spectrum.
func ExampleColourOf() {
	var wl, rrs []float64
	for nm := 400.0; nm <= 710; nm += 5 {
		d := (nm - 570) / 45
		wl = append(wl, nm*1e-9)
		rrs = append(rrs, 0.012*math.Exp(-0.5*d*d)+0.001)
	}
	c, err := seen.ColourOf(wl, rrs, seen.ColourMin, seen.ColourMax)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("x = %.4f, y = %.4f, hue %.1f°, λ_d %.1f nm, Forel-Ule %d\n",
		c.ChromaX, c.ChromaY, c.HueAngle, c.DominantWavelength*1e9, c.ForelUle)
	fmt.Printf("sRGB %.2f %.2f %.2f\n", c.SRGB[0], c.SRGB[1], c.SRGB[2])
	// Output:
	// x = 0.4190, y = 0.4885, hue 61.1°, λ_d 571.1 nm, Forel-Ule 16
	// sRGB 1.00 0.96 0.22
}
