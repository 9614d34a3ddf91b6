package water

// Optics is the absorption and molecular scattering of (sea)water at one
// wavelength.
type Optics struct {
	Wavelength float64 // vacuum wavelength, m
	A          float64 // absorption coefficient of pure water, m⁻¹
	Scattering         // molecular scattering of water or seawater
	N          float64 // real refractive index relative to vacuum
}

// C returns the beam attenuation coefficient a + b, m⁻¹.
func (o Optics) C() float64 { return o.A + o.B }

// Evaluate fills dst[i] with the optical properties of water of medium m at
// wavelengths[i] (m): Absorption, Scatter (with depolarisation delta, ≤ 0
// for the default) and RefractiveIndex. It allocates nothing; the salinity-
// and temperature-dependent parts of the scattering model are computed once
// per call. dst must be at least as long as wavelengths (a shorter dst is a
// programming error and panics). On an input error nothing is guaranteed
// about dst.
func Evaluate(dst []Optics, wavelengths []float64, m Medium, delta float64) error {
	_ = dst[:len(wavelengths)]
	if err := m.check(); err != nil {
		return err
	}
	if delta <= 0 {
		delta = DefaultDepolarisation
	}
	if err := checkRange("depolarisation ratio", delta, 0, 0.5, "(dimensionless)"); err != nil {
		return err
	}
	for _, l := range wavelengths {
		if err := checkWavelength("wavelength", l, max(MinWavelengthNM, MinAbsorptionNM), min(MaxWavelengthNM, MaxAbsorptionNM)); err != nil {
			return err
		}
	}
	st := newSaltState(m)
	for i, l := range wavelengths {
		nm := toNM(l)
		n, _ := seawaterIndexNM(nm, m.Salinity, m.TemperatureC)
		dst[i] = Optics{Wavelength: l, A: absorptionNM(nm), Scattering: st.scatter(nm, delta), N: n}
	}
	return nil
}
