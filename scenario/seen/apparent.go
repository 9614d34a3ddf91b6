package seen

import "fmt"

// Observer collects the choices behind the apparent optical properties of a
// water column. The zero value uses the defaults named on each field.
type Observer struct {
	// Reflectance is the r_rs model; zero value (empty Name) means Lee2002.
	Reflectance ReflectanceModel
	// Kd is the diffuse-attenuation model; zero value means Lee2013Kd.
	Kd KdModel
	// SolarZenith is the sun's zenith angle, rad, in [0, π/2).
	SolarZenith float64
	// SecchiMin and SecchiMax bound the transparent window, m; both 0 means
	// SecchiWindowMin, SecchiWindowMax.
	SecchiMin, SecchiMax float64
	// ColourMin and ColourMax bound the colour integral, m, on the 5 nm CIE
	// grid; both 0 means ColourMin, ColourMax (400–710 nm).
	ColourMin, ColourMax float64
}

// Apparent holds the apparent optical properties of one water column. Its
// slices are reused by Observer.See when they have enough capacity, so a
// loop over many spectra allocates only on its first call.
type Apparent struct {
	// Rrs is above-surface remote-sensing reflectance, sr⁻¹, per wavelength.
	Rrs []float64
	// Kd is the diffuse attenuation of downwelling irradiance, m⁻¹.
	Kd []float64
	// HasSecchi is false when no wavelength lies in the transparent window.
	HasSecchi bool
	// Secchi is the Secchi depth and where it was evaluated.
	Secchi Secchi
	// HasColour is false when the spectra do not cover the colour range.
	HasColour bool
	// Colour of the water-leaving light.
	Colour Colour
	// Flags is the union of the reflectance and K_d flags (Secchi and
	// Colour carry their own).
	Flags Flag
}

// See computes R_rs, K_d, Secchi depth and colour of spectra s, with water
// backscattering bbw (m⁻¹ per wavelength; may be nil when the K_d model has
// Chi = 0), into dst.
func (o Observer) See(dst *Apparent, s Spectra, bbw []float64) error {
	refl := o.Reflectance
	if refl.Name == "" && refl.G1 == 0 && refl.G2 == 0 {
		refl = Lee2002
	}
	kdm := o.Kd
	if kdm.Name == "" && kdm.M1 == 0 {
		kdm = Lee2013Kd
	}
	smin, smax := o.SecchiMin, o.SecchiMax
	if smin == 0 && smax == 0 {
		smin, smax = SecchiWindowMin, SecchiWindowMax
	}
	cmin, cmax := o.ColourMin, o.ColourMax
	if cmin == 0 && cmax == 0 {
		cmin, cmax = ColourMin, ColourMax
	}
	n := len(s.Wavelength)
	dst.Rrs = resize(dst.Rrs, n)
	dst.Kd = resize(dst.Kd, n)
	*dst = Apparent{Rrs: dst.Rrs, Kd: dst.Kd}
	f1, err := refl.Rrs(dst.Rrs, s)
	if err != nil {
		return err
	}
	f2, err := kdm.Spectrum(dst.Kd, s, bbw, o.SolarZenith)
	if err != nil {
		return err
	}
	dst.Flags = f1 | f2
	wl := s.Wavelength
	if wl[0] <= smax && wl[n-1] >= smin {
		sec, err := SecchiWindow(wl, dst.Kd, dst.Rrs, smin, smax)
		if err == nil {
			dst.Secchi, dst.HasSecchi = sec, true
		} else if !noneInWindow(wl, smin, smax) {
			return err
		}
	}
	const tol = 1e-15
	if n >= 2 && wl[0] <= cmin+tol && wl[n-1] >= cmax-tol {
		c, err := ColourOf(wl, dst.Rrs, cmin, cmax)
		if err != nil {
			return fmt.Errorf("seen: colour: %w", err)
		}
		dst.Colour, dst.HasColour = c, true
	}
	return nil
}

func noneInWindow(wl []float64, lo, hi float64) bool {
	for _, w := range wl {
		if w >= lo && w <= hi {
			return false
		}
	}
	return true
}

func resize(v []float64, n int) []float64 {
	if cap(v) >= n {
		return v[:n]
	}
	return make([]float64, n)
}
