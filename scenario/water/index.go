package water

import "math"

// Validity limits shared by the refractive index and scattering models.
const (
	MinWavelengthNM = 350.0 // shortest wavelength accepted, nm
	MaxWavelengthNM = 900.0 // longest wavelength accepted, nm
	MinSalinity     = 0.0   // practical salinity
	MaxSalinity     = 42.0  // practical salinity
	MinTemperatureC = -2.0  // °C
	MaxTemperatureC = 40.0  // °C
)

// Medium is the state of the water a property is evaluated for.
// The zero value is fresh water at 0 °C.
type Medium struct {
	Salinity     float64 // practical salinity (PSS-78), dimensionless, 0–42
	TemperatureC float64 // temperature, °C, −2 to 40
}

func (m Medium) check() error {
	if err := checkRange("salinity", m.Salinity, MinSalinity, MaxSalinity, "(practical salinity)"); err != nil {
		return err
	}
	return checkRange("temperature", m.TemperatureC, MinTemperatureC, MaxTemperatureC, "°C")
}

// AirIndex returns the refractive index of standard dry air (15 °C,
// 101 325 Pa, 450 ppm CO₂) at vacuum wavelength lambda (m), from Ciddor
// (1996), Appl. Opt. 35(9):1566–1573, eq. (1):
//
//	n − 1 = 10⁻⁸ [5 792 105/(238.0185 − σ²) + 167 917/(57.362 − σ²)],  σ = 1/λ[µm].
//
// Ciddor states validity 0.3–1.69 µm (from memory); this package calls it
// only for 350–900 nm, which it checks.
func AirIndex(lambda float64) (float64, error) {
	if err := checkWavelength("wavelength", lambda, MinWavelengthNM, MaxWavelengthNM); err != nil {
		return 0, err
	}
	return airIndexNM(toNM(lambda)), nil
}

func airIndexNM(nm float64) float64 {
	s2 := 1 / (nm * 1e-3 * nm * 1e-3)
	return 1 + (5792105/(238.0185-s2)+167917/(57.362-s2))/1e8
}

// RefractiveIndex returns the real refractive index of seawater relative to
// vacuum at vacuum wavelength lambda (m): the empirical relation of Quan &
// Fry (1995), Appl. Opt. 34(18):3477–3480, eq. (3), which gives the index
// relative to air,
//
//	n = n0 + (n1 + n2 T + n3 T²) S + n4 T² + (n5 + n6 S + n7 T)/λ + n8/λ² + n9/λ³   (λ in nm),
//
// with n0 = 1.31405, n1 = 1.779e-4, n2 = −1.05e-6, n3 = 1.6e-8, n4 = −2.02e-6,
// n5 = 15.868, n6 = 0.01155, n7 = −0.00423, n8 = −4382, n9 = 1.1455e6,
// multiplied by the index of air (AirIndex), as in Zhang, Hu & He (2009).
//
// Quan & Fry fitted 400–700 nm, 0–30 °C and S 0–35 (from memory); the
// package accepts 350–900 nm, −2 to 40 °C and S 0–42. Accuracy, from the
// tests: at 589.3 nm and 20 °C the relation reproduces the handbook index of
// water to 1e-5; from 725 to 900 nm (extrapolation) it lies between the
// compilations of Segelstein (1981) and Hale & Querry (1973) at 25 °C, which
// themselves differ there by 2–4e-3; below 400 nm no independent data were
// at hand. The imaginary part of water's index is Absorption·λ/(4π).
func RefractiveIndex(lambda float64, m Medium) (float64, error) {
	if err := checkWavelength("wavelength", lambda, MinWavelengthNM, MaxWavelengthNM); err != nil {
		return 0, err
	}
	if err := m.check(); err != nil {
		return 0, err
	}
	n, _ := seawaterIndexNM(toNM(lambda), m.Salinity, m.TemperatureC)
	return n, nil
}

// RefractiveIndexNM is RefractiveIndex with the wavelength in nanometres.
func RefractiveIndexNM(nm float64, m Medium) (float64, error) {
	return RefractiveIndex(nm*1e-9, m)
}

// seawaterIndexNM returns the Quan & Fry index times the index of air, and
// its derivative with respect to salinity, dn/dS, likewise scaled.
func seawaterIndexNM(nm, s, tc float64) (n, dnds float64) {
	na := airIndexNM(nm)
	t2 := tc * tc
	k := 1.779e-4 - 1.05e-6*tc + 1.6e-8*t2
	n = 1.31405 + k*s - 2.02e-6*t2 + (15.868+0.01155*s-0.00423*tc)/nm - 4382/(nm*nm) + 1.1455e6/(nm*nm*nm)
	dnds = k + 0.01155/nm
	return n * na, dnds * na
}

// imagIndex converts an absorption coefficient a (m⁻¹) at vacuum wavelength
// lambda (m) into the imaginary index k = aλ/(4π).
func imagIndex(a, lambda float64) float64 { return a * lambda / (4 * math.Pi) }
