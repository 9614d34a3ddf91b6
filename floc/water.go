package floc

import "math"

// Gravity is the standard acceleration of free fall, m s⁻² (CGPM 1901, exact).
const Gravity = 9.80665

// WaterDensity returns the density of sea water at atmospheric pressure,
// kg m⁻³, for practical salinity s (PSU) and temperature t (°C): the
// one-atmosphere UNESCO (1981) international equation of state of seawater
// (EOS-80; Millero & Poisson 1981, Deep-Sea Res. 28A:625), with the pure-water
// density of Bigg (1967) as its S = 0 term.
//
// Valid for 0 ≤ s ≤ 42 and −2 ≤ t ≤ 40 °C; errors outside.
func WaterDensity(s, t float64) (float64, error) {
	if err := checkWater(s, t); err != nil {
		return 0, err
	}
	return waterDensity(s, t), nil
}

func waterDensity(s, t float64) float64 {
	rw := 999.842594 + t*(6.793952e-2+t*(-9.09529e-3+t*(1.001685e-4+t*(-1.120083e-6+t*6.536332e-9))))
	a := 8.24493e-1 + t*(-4.0899e-3+t*(7.6438e-5+t*(-8.2467e-7+t*5.3875e-9)))
	b := -5.72466e-3 + t*(1.0227e-4-t*1.6546e-6)
	return rw + a*s + b*s*math.Sqrt(s) + 4.8314e-4*s*s
}

// WaterViscosity returns the dynamic viscosity of sea water, Pa s, for
// salinity s (PSU, taken as g kg⁻¹ of dissolved salt) and temperature t (°C),
// from the correlation of Sharqawy, Lienhard & Zubair (2010, Desalination
// and Water Treatment 16:354–380, eqs. 22–23, from memory): the pure-water
// term 4.2844e-5 + 1/(0.157(t+64.993)² − 91.296) times 1 + A·S + B·S² with
// S in kg kg⁻¹. Stated accuracy ±1.5 %.
//
// Valid for 0 ≤ s ≤ 42 and −2 ≤ t ≤ 40 °C (the correlation itself holds to
// 150 g kg⁻¹ and 180 °C); errors outside.
func WaterViscosity(s, t float64) (float64, error) {
	if err := checkWater(s, t); err != nil {
		return 0, err
	}
	return waterViscosity(s, t), nil
}

func waterViscosity(s, t float64) float64 {
	mw := 4.2844e-5 + 1/(0.157*(t+64.993)*(t+64.993)-91.296)
	sk := s / 1000
	a := 1.541 + 1.998e-2*t - 9.52e-5*t*t
	b := 7.974 - 7.561e-2*t + 4.724e-4*t*t
	return mw * (1 + a*sk + b*sk*sk)
}

func checkWater(s, t float64) error {
	if !(s >= 0 && s <= 42) {
		return rangeError("Salinity", s, "[0, 42]", "PSU")
	}
	if !(t >= -2 && t <= 40) {
		return rangeError("Temperature", t, "[-2, 40]", "degC")
	}
	return nil
}
