package seen

import (
	"fmt"
	"math"
)

// Integration limits of the water-colour tristimulus integral, m: the
// 400–710 nm range of Van der Woerd & Wernand (2015).
const (
	ColourMin = 400e-9
	ColourMax = 710e-9
)

// Colour is the colour of water-leaving light.
type Colour struct {
	// X, Y, Z are CIE 1931 tristimulus values of R_rs under an
	// equal-energy illuminant, normalised by ∫ȳ dλ over the same range, so
	// that Y is the photopically weighted mean R_rs, sr⁻¹.
	X, Y, Z float64
	// ChromaX and ChromaY are the chromaticity coordinates x = X/(X+Y+Z),
	// y = Y/(X+Y+Z), dimensionless.
	ChromaX, ChromaY float64
	// HueAngle α is the angle of (x − 1/3, y − 1/3) counter-clockwise from
	// the positive x axis, degrees in [0, 360) (Van der Woerd & Wernand
	// 2015): ≈ 200–240° blue, ≈ 100° green, small angles yellow-brown.
	HueAngle float64
	// DominantWavelength is the spectral wavelength whose chromaticity lies
	// on the ray from the white point through (x, y), m. With
	// FlagComplementary it is the complementary wavelength instead.
	DominantWavelength float64
	// ForelUle is the Forel-Ule class 1 (indigo blue) … 21 (cola brown)
	// from DominantWavelength; 0 when undefined (achromatic or
	// complementary).
	ForelUle int
	// SRGB is a display colour for plots: IEC 61966-2-1 sRGB components in
	// [0, 1], gamma-encoded, with the luminance scaled so that the largest
	// linear component is 1 (hue and saturation are kept, brightness is
	// not). No chromatic adaptation from the equal-energy white to D65 is
	// applied, so a spectrally flat R_rs shows slightly pink.
	SRGB [3]float64
	// Flags: FlagAchromatic, FlagComplementary, FlagForelUleClamped,
	// FlagOutOfGamut.
	Flags Flag
}

// white point of the equal-energy illuminant E (exact).
const whiteXY = 1.0 / 3

// Spectral locus used for dominant wavelength: 380–780 nm, closed by the
// purple line from 780 nm back to 380 nm.
const (
	locusFirstNM = 380
	locusLastNM  = 780
)

var locusX, locusY = func() ([]float64, []float64) {
	i0 := int((locusFirstNM - cmfFirstNM) / cmfStepNM)
	i1 := int((locusLastNM - cmfFirstNM) / cmfStepNM)
	var xs, ys []float64
	for i := i0; i <= i1; i++ {
		s := cmfTable[1][i] + cmfTable[2][i] + cmfTable[3][i]
		xs = append(xs, cmfTable[1][i]/s)
		ys = append(ys, cmfTable[2][i]/s)
	}
	return xs, ys
}()

// ColourOf computes the colour of the above-surface reflectance spectrum
// rrs (sr⁻¹) given at wavelengths wl (m, increasing), integrated from lo to
// hi (m; both on the 5 nm grid of the CIE table, 360–830 nm; ColourMin and
// ColourMax for the usual water-colour range).
//
// Method (Van der Woerd & Wernand 2015, Sensors 15:25663): R_rs is
// interpolated linearly to the 5 nm nodes of the CIE 1931 2° colour-matching
// functions (CIE 015:2004 table), the illuminant is taken as unity, and
// X = Σ w R_rs x̄ with trapezium weights w (likewise Y, Z). Dominant
// wavelength is found by intersecting the ray from the white point (1/3,
// 1/3) with the spectral locus (straight between 5 nm nodes); the Forel-Ule
// class follows from the dominant wavelength with the thresholds tabulated
// by Wang et al. (2015) (embedded table; (lower, upper] nm per class).
// Values outside 470–600 nm are clamped to class 1 or 21 and flagged: that
// extension of the table is an assumption. The grid wl must cover [lo, hi].
// It allocates nothing.
func ColourOf(wl, rrs []float64, lo, hi float64) (Colour, error) {
	var c Colour
	if len(wl) != len(rrs) {
		return c, fmt.Errorf("seen: wavelength has %d values, R_rs %d", len(wl), len(rrs))
	}
	if len(wl) < 2 {
		return c, fmt.Errorf("seen: R_rs has %d values; need at least 2 to interpolate", len(wl))
	}
	if err := checkWavelengths("wavelength", wl); err != nil {
		return c, err
	}
	i0, err := cmfIndex("lo", lo)
	if err != nil {
		return c, err
	}
	i1, err := cmfIndex("hi", hi)
	if err != nil {
		return c, err
	}
	if i1 <= i0 {
		return c, fmt.Errorf("seen: colour range [%g, %g] m is empty", lo, hi)
	}
	const tol = 1e-15 // m, rounding of wavelengths written in nm × 1e-9
	if wl[0] > lo+tol || wl[len(wl)-1] < hi-tol {
		return c, fmt.Errorf("seen: R_rs spans [%g, %g] m, not the colour range [%g, %g] m", wl[0], wl[len(wl)-1], lo, hi)
	}
	for i, r := range rrs {
		// A perfect diffuse reflector has R_rs = 1/π sr⁻¹; 1 sr⁻¹ is a
		// generous physical bound that also keeps the sums finite.
		if !(r >= 0 && r <= 1) {
			return c, fmt.Errorf("seen: R_rs[%d] = %g sr⁻¹ is outside [0, 1] sr⁻¹", i, r)
		}
	}
	var X, Y, Z, norm float64
	for i := i0; i <= i1; i++ {
		w := 1.0
		if i == i0 || i == i1 {
			w = 0.5
		}
		lam := (cmfFirstNM + cmfStepNM*float64(i)) * 1e-9
		r := interp(wl, rrs, math.Min(math.Max(lam, wl[0]), wl[len(wl)-1]))
		X += w * r * cmfTable[1][i]
		Y += w * r * cmfTable[2][i]
		Z += w * r * cmfTable[3][i]
		norm += w * cmfTable[2][i]
	}
	c.X, c.Y, c.Z = X/norm, Y/norm, Z/norm
	sum := c.X + c.Y + c.Z
	if sum <= 0 {
		c.Flags |= FlagAchromatic
		return c, nil
	}
	c.ChromaX, c.ChromaY = c.X/sum, c.Y/sum
	dx, dy := c.ChromaX-whiteXY, c.ChromaY-whiteXY
	if math.Hypot(dx, dy) < 1e-9 {
		c.Flags |= FlagAchromatic
	} else {
		a := math.Atan2(dy, dx) * 180 / math.Pi
		if a < 0 {
			a += 360
		}
		c.HueAngle = a
		nm, purple := dominant(dx, dy)
		if purple {
			nm, _ = dominant(-dx, -dy)
			c.Flags |= FlagComplementary
		}
		c.DominantWavelength = nm * 1e-9
		if !purple {
			cls, clamped := forelUle(nm)
			c.ForelUle = cls
			if clamped {
				c.Flags |= FlagForelUleClamped
			}
		}
	}
	var oog bool
	c.SRGB, oog = displayRGB(c.X, c.Y, c.Z)
	if oog {
		c.Flags |= FlagOutOfGamut
	}
	return c, nil
}

// cmfIndex maps a wavelength (m) on the CIE table's 5 nm grid to its row.
func cmfIndex(field string, lam float64) (int, error) {
	nm := lam * 1e9
	f := (nm - cmfFirstNM) / cmfStepNM
	i := int(math.Round(f))
	if !(math.Abs(f-float64(i)) < 1e-6) || i < 0 || i >= len(cmfTable[0]) {
		return 0, fmt.Errorf("seen: colour range %s = %g m is not on the 5 nm grid of the CIE table (360–830 nm)", field, lam)
	}
	return i, nil
}

// dominant intersects the ray from the white point in direction (dx, dy)
// with the spectral locus and the purple line. It returns the wavelength in
// nm of the nearest spectral hit, or purple = true if the purple line is hit
// first.
func dominant(dx, dy float64) (nm float64, purple bool) {
	bestT := math.Inf(1)
	n := len(locusX)
	for k := 0; k < n; k++ {
		// Segment k joins locus point k to k+1; segment n−1 is the purple
		// line from the last point back to the first.
		j := k + 1
		if j == n {
			j = 0
		}
		ax, ay := locusX[k]-whiteXY, locusY[k]-whiteXY
		ex, ey := locusX[j]-locusX[k], locusY[j]-locusY[k]
		den := dx*ey - dy*ex
		if den == 0 {
			continue
		}
		t := (ax*ey - ay*ex) / den
		s := (ax*dy - ay*dx) / den
		if t <= 0 || s < 0 || s > 1 || t >= bestT {
			continue
		}
		bestT = t
		if k == n-1 {
			purple, nm = true, 0
		} else {
			purple = false
			nm = locusFirstNM + cmfStepNM*(float64(k)+s)
		}
	}
	return nm, purple
}

// forelUle returns the Forel-Ule class for dominant wavelength nm.
func forelUle(nm float64) (cls int, clamped bool) {
	if nm <= fuLower[0] {
		return 1, true
	}
	for k, hi := range fuUpper {
		if nm <= hi {
			return k + 1, false
		}
	}
	return len(fuUpper), true
}

// srgbMatrix converts CIE XYZ to linear sRGB (IEC 61966-2-1:1999).
var srgbMatrix = [3][3]float64{
	{3.2406, -1.5372, -0.4986},
	{-0.9689, 1.8758, 0.0415},
	{0.0557, -0.2040, 1.0570},
}

// displayRGB converts XYZ to gamma-encoded sRGB scaled so that the largest
// linear component is 1, clipping negative components (reported).
func displayRGB(X, Y, Z float64) (rgb [3]float64, outOfGamut bool) {
	lin := XYZToLinearSRGB(X, Y, Z)
	m := 0.0
	for i := range lin {
		if lin[i] < 0 {
			lin[i] = 0
			outOfGamut = true
		}
		m = math.Max(m, lin[i])
	}
	if m <= 0 {
		return rgb, outOfGamut
	}
	for i, v := range lin {
		rgb[i] = SRGBEncode(v / m)
	}
	return rgb, outOfGamut
}

// SRGBEncode applies the sRGB transfer function (IEC 61966-2-1) to a linear
// component in [0, 1]: 12.92 v below 0.0031308, else 1.055 v^(1/2.4) −
// 0.055. Inputs outside [0, 1] are clipped.
func SRGBEncode(v float64) float64 {
	v = math.Min(math.Max(v, 0), 1)
	if v <= 0.0031308 {
		return 12.92 * v
	}
	return 1.055*math.Pow(v, 1/2.4) - 0.055
}

// XYZToLinearSRGB converts CIE XYZ (Y = 1 for the display white) to linear
// sRGB components with the IEC 61966-2-1 matrix, without clipping.
func XYZToLinearSRGB(X, Y, Z float64) [3]float64 {
	var lin [3]float64
	for i := range lin {
		lin[i] = srgbMatrix[i][0]*X + srgbMatrix[i][1]*Y + srgbMatrix[i][2]*Z
	}
	return lin
}
