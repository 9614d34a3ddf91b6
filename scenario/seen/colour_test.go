package seen

import (
	"math"
	"testing"
)

// grid returns wavelengths (m) from lo to hi nm in steps of step nm.
func grid(lo, hi, step float64) []float64 {
	var wl []float64
	for nm := lo; nm <= hi+1e-9; nm += step {
		wl = append(wl, nm*1e-9)
	}
	return wl
}

// gaussian fills an R_rs spectrum peaking at peak nm with width sigma nm.
func gaussian(wl []float64, peak, sigma float64) []float64 {
	r := make([]float64, len(wl))
	for i, w := range wl {
		d := (w*1e9 - peak) / sigma
		r[i] = 0.01 * math.Exp(-0.5*d*d)
	}
	return r
}

func TestCMFTable555(t *testing.T) {
	// CIE 1931 2° observer at 555 nm: (0.5121, 1.0000, 0.0057) to four
	// decimals (CIE 015:2004 table; REFERENCES.md). Tolerance: half a unit
	// in the fourth decimal.
	const tol = 5e-5
	i, err := cmfIndex("lambda", 555e-9)
	if err != nil {
		t.Fatal(err)
	}
	got := [3]float64{cmfTable[1][i], cmfTable[2][i], cmfTable[3][i]}
	want := [3]float64{0.5121, 1.0000, 0.0057}
	for k := range got {
		if math.Abs(got[k]-want[k]) > tol {
			t.Errorf("CMF(555 nm)[%d] = %.7f, want %.4f", k, got[k], want[k])
		}
	}
}

func TestEqualEnergyWhite(t *testing.T) {
	// Exact property of the CIE 1931 functions: ∫x̄ = ∫ȳ = ∫z̄, so the
	// equal-energy spectrum has x = y = 1/3 (CIE 015:2004). Tolerance: the
	// identity holds for the full 1 nm table; sampling at 5 nm with the
	// trapezium rule over 380–780 nm moves x and y by ~1e-5 (measured
	// 1.8e-5), so 5e-5 separates that from any copying error (a single
	// wrong digit in the table's fourth place moves x by ~1e-4).
	const tol = 5e-5
	wl := grid(360, 830, 1)
	flat := make([]float64, len(wl))
	for i := range flat {
		flat[i] = 0.004
	}
	c, err := ColourOf(wl, flat, 380e-9, 780e-9)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(c.ChromaX-1.0/3) > tol || math.Abs(c.ChromaY-1.0/3) > tol {
		t.Errorf("white chromaticity = (%.6f, %.6f), want (1/3, 1/3)", c.ChromaX, c.ChromaY)
	}
	// Y is normalised to the photopic mean of R_rs: a flat R_rs gives Y = R_rs
	// (definition of the normalisation, exact up to rounding).
	if math.Abs(c.Y-0.004) > 1e-15 {
		t.Errorf("Y of flat R_rs 0.004 = %g, want 0.004", c.Y)
	}
}

func TestHueAngleGaussians(t *testing.T) {
	// Hue angles of Gaussian R_rs spectra (σ = 20 nm, integrated 400–710 nm at
	// 5 nm with the CIE table, white point 1/3, 1/3), computed by the research
	// notes with an independent script from the Van der Woerd & Wernand
	// (2015) method (research/water-optics.md §9.2 and table row 33–34).
	// Tolerance: the notes print two decimals; 0.05° allows for their
	// rounding and for trapezium vs plain sums (end weights change α by
	// < 0.01° because the Gaussians vanish at 400 and 710 nm).
	const tol = 0.05
	wl := grid(400, 710, 1)
	for _, tc := range []struct{ peak, want float64 }{
		{450, 238.66}, {490, 193.24}, {530, 108.67}, {560, 77.91}, {580, 43.52}, {600, 15.52},
	} {
		c, err := ColourOf(wl, gaussian(wl, tc.peak, 20), ColourMin, ColourMax)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(c.HueAngle-tc.want) > tol {
			t.Errorf("peak %g nm: hue angle %.3f°, want %.2f°", tc.peak, c.HueAngle, tc.want)
		}
	}
}

func TestDominantWavelengthOfNarrowLine(t *testing.T) {
	// Definition: a monochromatic stimulus lies on the spectral locus, so its
	// dominant wavelength is its own wavelength (CIE 015:2004). A 1 nm wide
	// line sampled at 0.5 nm sits within a fraction of a nm of the locus; the
	// 0.5 nm tolerance also covers straight-line interpolation of the locus
	// between 5 nm nodes.
	const tol = 0.5
	wl := grid(400, 710, 0.5)
	for _, peak := range []float64{470, 500, 530, 555, 575, 600, 650} {
		c, err := ColourOf(wl, gaussian(wl, peak, 1), ColourMin, ColourMax)
		if err != nil {
			t.Fatal(err)
		}
		if c.Flags.Has(FlagComplementary) {
			t.Fatalf("peak %g nm flagged complementary", peak)
		}
		if d := c.DominantWavelength * 1e9; math.Abs(d-peak) > tol {
			t.Errorf("peak %g nm: dominant wavelength %.3f nm", peak, d)
		}
	}
}

func TestForelUleThresholds(t *testing.T) {
	// Forel-Ule class from dominant wavelength: breaks 470, 475, 480, 485,
	// 489, 495, 509, 530, 549, 559, 564, 567, 568, 569, 570, 571, 573, 575,
	// 577, 579, 581, 600 nm, intervals (lower, upper] (Wang et al. 2015 as
	// tabulated in research/water-optics.md §9.3). Values typed here, not
	// read from the embedded file, so a corrupted table fails.
	breaks := []float64{470, 475, 480, 485, 489, 495, 509, 530, 549, 559, 564, 567, 568, 569, 570, 571, 573, 575, 577, 579, 581, 600}
	for k := 1; k <= 21; k++ {
		lo, hi := breaks[k-1], breaks[k]
		for _, nm := range []float64{lo + 1e-6, (lo + hi) / 2, hi} {
			got, clamped := forelUle(nm)
			if got != k || clamped {
				t.Errorf("dominant wavelength %g nm: class %d (clamped %v), want %d", nm, got, clamped, k)
			}
		}
	}
	for _, tc := range []struct {
		nm   float64
		want int
	}{{465, 1}, {470, 1}, {600.5, 21}, {650, 21}} {
		got, clamped := forelUle(tc.nm)
		if got != tc.want || !clamped {
			t.Errorf("dominant wavelength %g nm: class %d (clamped %v), want %d clamped", tc.nm, got, clamped, tc.want)
		}
	}
}

func TestForelUleOrdering(t *testing.T) {
	// Common practice: Forel-Ule classes run from blue (1) to brown (21) as
	// the reflectance peak moves to longer wavelengths, and the hue angle
	// falls (research/water-optics.md §11).
	wl := grid(400, 710, 5)
	prevFU, prevHue := 0, 361.0
	for _, peak := range []float64{450, 480, 510, 540, 560, 575, 590, 620} {
		c, err := ColourOf(wl, gaussian(wl, peak, 25), ColourMin, ColourMax)
		if err != nil {
			t.Fatal(err)
		}
		if c.ForelUle < prevFU || c.HueAngle > prevHue {
			t.Errorf("peak %g nm: FU %d after %d, hue %.1f° after %.1f°", peak, c.ForelUle, prevFU, c.HueAngle, prevHue)
		}
		prevFU, prevHue = c.ForelUle, c.HueAngle
	}
}

func TestPurpleIsComplementary(t *testing.T) {
	// A mixture of deep blue and deep red lies below the line joining the
	// white point to the ends of the locus: it has no dominant wavelength,
	// only a complementary one, in the green (CIE 015:2004 definition).
	wl := grid(400, 710, 1)
	r := gaussian(wl, 420, 10)
	red := gaussian(wl, 690, 10)
	for i := range r {
		r[i] += 3 * red[i]
	}
	c, err := ColourOf(wl, r, ColourMin, ColourMax)
	if err != nil {
		t.Fatal(err)
	}
	if !c.Flags.Has(FlagComplementary) || c.ForelUle != 0 {
		t.Fatalf("flags %v, FU %d: want complementary, FU 0", c.Flags, c.ForelUle)
	}
	if d := c.DominantWavelength * 1e9; d < 490 || d > 570 {
		t.Errorf("complementary wavelength %.1f nm, want in the green 490–570 nm", d)
	}
}

func TestColourSpecialCases(t *testing.T) {
	wl := grid(400, 710, 5)
	zero := make([]float64, len(wl))
	c, err := ColourOf(wl, zero, ColourMin, ColourMax)
	if err != nil {
		t.Fatal(err)
	}
	if !c.Flags.Has(FlagAchromatic) || c.HueAngle != 0 || c.ForelUle != 0 {
		t.Errorf("zero R_rs: %+v, want achromatic with zero hue and class", c)
	}
	// Input errors.
	if _, err := ColourOf(wl[1:], zero[1:], ColourMin, ColourMax); err == nil {
		t.Error("R_rs starting at 405 nm accepted for a 400–710 nm integral")
	}
	if _, err := ColourOf(wl, zero, 402e-9, ColourMax); err == nil {
		t.Error("off-grid lower limit accepted")
	}
	neg := append([]float64(nil), zero...)
	neg[3] = -1e-3
	if _, err := ColourOf(wl, neg, ColourMin, ColourMax); err == nil {
		t.Error("negative R_rs accepted")
	}
}

func TestSRGB(t *testing.T) {
	// IEC 61966-2-1: the D65 white (X, Y, Z) = (0.95047, 1, 1.08883) maps to
	// linear RGB (1, 1, 1). Tolerance: the matrix is published to four
	// decimals, which leaves ~1e-4 error.
	const tol = 5e-4
	lin := XYZToLinearSRGB(0.95047, 1, 1.08883)
	for i, v := range lin {
		if math.Abs(v-1) > tol {
			t.Errorf("linear sRGB[%d] of D65 white = %.5f, want 1", i, v)
		}
	}
	// IEC 61966-2-1 transfer function: the two branches meet at 0.0031308
	// (value 0.04045 to the standard's precision), 0 → 0 and 1 → 1.
	const joinTol = 1e-5
	lo := 12.92 * 0.0031308
	hi := 1.055*math.Pow(0.0031308, 1/2.4) - 0.055
	if math.Abs(lo-hi) > joinTol || math.Abs(SRGBEncode(0.0031308)-0.04045) > joinTol {
		t.Errorf("transfer function branches %.6f and %.6f at the break", lo, hi)
	}
	if SRGBEncode(0) != 0 || math.Abs(SRGBEncode(1)-1) > 1e-15 {
		t.Errorf("SRGBEncode(0), (1) = %g, %g", SRGBEncode(0), SRGBEncode(1))
	}
	// A green water colour must display with green as its largest channel
	// (common practice: hue ≈ 100° is green).
	wl := grid(400, 710, 5)
	c, err := ColourOf(wl, gaussian(wl, 540, 30), ColourMin, ColourMax)
	if err != nil {
		t.Fatal(err)
	}
	if !(c.SRGB[1] >= c.SRGB[0] && c.SRGB[1] >= c.SRGB[2]) {
		t.Errorf("green water displayed as %v", c.SRGB)
	}
}
