package seen

import (
	"fmt"
	"math"
)

// Constants of the Secchi-depth theory of Lee et al. (2015).
const (
	secchiDisk     = 0.14  // sr⁻¹, reflectance term of the white disk
	secchiContrast = 0.013 // sr⁻¹, contrast threshold term of the eye
	secchiCoupling = 2.5   // K_d multiplier: 1 + (attenuation of the upward path)/K_d
)

// Default transparent-window limits for SecchiWindow, m (from memory: the
// visible range over which Lee et al. 2015 took the minimum K_d).
const (
	SecchiWindowMin = 410e-9
	SecchiWindowMax = 665e-9
)

// SecchiDepth is Z_SD of Lee, Shang, Hu, Du, Weidemann, Hou, Lin & Lin (2015,
// "Secchi disk depth: A new theory and mechanistic model for underwater
// visibility", Remote Sens. Environ. 169:139; citation details from memory):
//
//	Z_SD = ln(|0.14 − R_rs^tr| / 0.013) / (2.5 K_d^tr),
//
// where K_d^tr (m⁻¹) is the diffuse attenuation and R_rs^tr (sr⁻¹) the
// above-surface remote-sensing reflectance in the transparent window (the
// visible wavelength of minimum K_d). The result is in m.
// Special cases: |0.14 − R_rs| ≤ 0.013 leaves the disk no contrast: depth 0
// with FlagNoSecchi; R_rs > 0.14 is flagged FlagBrightWater.
// Validity: the theory treats the disk as seen by a human observer from
// just above the surface in daylight; it is calibrated for natural waters.
func SecchiDepth(kd, rrs float64) (float64, Flag, error) {
	if !(kd > 0) || math.IsInf(kd, 1) {
		return 0, 0, fmt.Errorf("seen: K_d^tr = %g m⁻¹ is outside (0, +∞) m⁻¹", kd)
	}
	if !(rrs >= 0) || math.IsInf(rrs, 1) {
		return 0, 0, fmt.Errorf("seen: R_rs^tr = %g sr⁻¹ is outside [0, +∞) sr⁻¹", rrs)
	}
	var f Flag
	if rrs > secchiDisk {
		f |= FlagBrightWater
	}
	ratio := math.Abs(secchiDisk-rrs) / secchiContrast
	if ratio <= 1 {
		return 0, f | FlagNoSecchi, nil
	}
	return math.Log(ratio) / (secchiCoupling * kd), f, nil
}

// Secchi is the result of SecchiWindow.
type Secchi struct {
	// Depth is Z_SD, m.
	Depth float64
	// Wavelength is the transparent-window wavelength (minimum K_d), m.
	Wavelength float64
	// Kd is K_d there, m⁻¹.
	Kd float64
	// Rrs is the above-surface R_rs there, sr⁻¹.
	Rrs float64
	// Flags: FlagNoSecchi, FlagBrightWater.
	Flags Flag
}

// SecchiWindow finds the wavelength of minimum K_d within [lo, hi] (m) on
// the grid wl (m, increasing), with kd (m⁻¹) and rrs (above-surface, sr⁻¹)
// on the same grid, and returns the Secchi depth there. Pass
// SecchiWindowMin, SecchiWindowMax for the usual visible window. Ties go to
// the shorter wavelength. It allocates nothing.
func SecchiWindow(wl, kd, rrs []float64, lo, hi float64) (Secchi, error) {
	var s Secchi
	if len(kd) != len(wl) || len(rrs) != len(wl) {
		return s, fmt.Errorf("seen: wavelength, K_d and R_rs have %d, %d and %d values; need equal lengths", len(wl), len(kd), len(rrs))
	}
	if err := checkWavelengths("wavelength", wl); err != nil {
		return s, err
	}
	if !(lo <= hi) {
		return s, fmt.Errorf("seen: transparent window [%g, %g] m is empty", lo, hi)
	}
	for i := range kd {
		if !(kd[i] >= 0 && kd[i] <= MaxCoefficient) {
			return s, fmt.Errorf("seen: K_d[%d] = %g m⁻¹ is outside [0, %g] m⁻¹", i, kd[i], float64(MaxCoefficient))
		}
		if !(rrs[i] >= 0 && rrs[i] <= 1) {
			return s, fmt.Errorf("seen: R_rs[%d] = %g sr⁻¹ is outside [0, 1] sr⁻¹", i, rrs[i])
		}
	}
	best := -1
	for i, w := range wl {
		if w < lo || w > hi {
			continue
		}
		if best < 0 || kd[i] < kd[best] {
			best = i
		}
	}
	if best < 0 {
		return s, fmt.Errorf("seen: no wavelength of the grid lies in the transparent window [%g, %g] m", lo, hi)
	}
	d, f, err := SecchiDepth(kd[best], rrs[best])
	if err != nil {
		return s, fmt.Errorf("seen: at %g m: %w", wl[best], err)
	}
	return Secchi{Depth: d, Wavelength: wl[best], Kd: kd[best], Rrs: rrs[best], Flags: f}, nil
}
