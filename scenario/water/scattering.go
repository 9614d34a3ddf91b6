package water

import "math"

// DefaultDepolarisation is the depolarisation ratio of water used by Zhang,
// Hu & He (2009), 0.039 (Zhang et al. 2019, Appl. Opt. 58(4):991, measure
// 0.039 ± 0.001 for pure water).
const DefaultDepolarisation = 0.039

// Physical constants as used by Zhang, Hu & He (2009).
const (
	avogadro     = 6.0221417930e23 // mol⁻¹
	boltzmann    = 1.3806503e-23   // J K⁻¹
	waterMolMass = 18e-3           // kg mol⁻¹
)

// Scattering is molecular scattering by water or seawater at one
// wavelength.
type Scattering struct {
	Beta90 float64 // volume scattering function at 90°, m⁻¹ sr⁻¹
	B      float64 // total scattering coefficient, m⁻¹
	Bb     float64 // backscattering coefficient (half of B), m⁻¹
	Delta  float64 // depolarisation ratio used, dimensionless
}

// VSF returns the volume scattering function (m⁻¹ sr⁻¹) at scattering angle
// theta (radians): β(θ) = β(90°)[1 + cos²θ (1−δ)/(1+δ)] (Zhang, Hu & He 2009,
// eq. 2; Morel 1974). Any real theta is accepted.
func (s Scattering) VSF(theta float64) float64 {
	c := math.Cos(theta)
	return s.Beta90 * (1 + c*c*(1-s.Delta)/(1+s.Delta))
}

// Scatter returns molecular scattering by seawater of the given salinity and
// temperature at vacuum wavelength lambda (m), from the model of Zhang, Hu &
// He (2009), Opt. Express 17(7):5698–5710, eqs. (1)–(10): β(90°) is the sum
// of density-fluctuation scattering (Einstein–Smoluchowski, with the
// Proutière et al. relation for ρ ∂n²/∂ρ) and concentration-fluctuation
// scattering from salt, both multiplied by the Cabannes factor
// (6+6δ)/(6−7δ). Inputs: isothermal compressibility of Lepple & Millero
// (1971), seawater density UNESCO (1981), ∂ln(a_w)/∂S of Millero & Leung
// (1976), refractive index of Quan & Fry (1995) times that of air (Ciddor
// 1996).
//
// Validity: 350–900 nm, salinity 0–42, −2 to 40 °C (the paper's analysis
// covers S 0–40; the constituent fits cover roughly 0–40 °C, from memory).
// delta ≤ 0 selects DefaultDepolarisation; delta above 0.5 is an error.
// Special case: S = 0 gives pure water (no concentration-fluctuation term).
func Scatter(lambda float64, m Medium, delta float64) (Scattering, error) {
	if err := checkWavelength("wavelength", lambda, MinWavelengthNM, MaxWavelengthNM); err != nil {
		return Scattering{}, err
	}
	if err := m.check(); err != nil {
		return Scattering{}, err
	}
	if delta <= 0 {
		delta = DefaultDepolarisation
	}
	if err := checkRange("depolarisation ratio", delta, 0, 0.5, "(dimensionless)"); err != nil {
		return Scattering{}, err
	}
	st := newSaltState(m)
	return st.scatter(toNM(lambda), delta), nil
}

// ScatterNM is Scatter with the wavelength in nanometres.
func ScatterNM(nm float64, m Medium, delta float64) (Scattering, error) {
	return Scatter(nm*1e-9, m, delta)
}

// saltState holds the wavelength-independent parts of the model for one
// salinity and temperature, so that a spectrum costs one evaluation of them.
type saltState struct {
	s, tc     float64
	kT        float64 // k_B T, J
	isoComp   float64 // isothermal compressibility βT, Pa⁻¹
	rho       float64 // seawater density, kg m⁻³
	negDlnaDS float64 // −∂ln(a_w)/∂S
}

func newSaltState(m Medium) saltState {
	s, tc := m.Salinity, m.TemperatureC
	t2, t3, t4, t5 := tc*tc, tc*tc*tc, tc*tc*tc*tc, tc*tc*tc*tc*tc
	s15 := s * math.Sqrt(s)

	// Isothermal compressibility, Lepple & Millero (1971), secant bulk
	// modulus in bar; βT = 1e-5/K Pa⁻¹.
	kw := 19652.21 + 148.4206*tc - 2.327105*t2 + 1.360477e-2*t3 - 5.155288e-5*t4
	a0 := 54.6746 - 0.603459*tc + 1.09987e-2*t2 - 6.167e-5*t3
	b0 := 7.944e-2 + 1.6483e-2*tc - 5.3009e-4*t2
	iso := 1e-5 / (kw + a0*s + b0*s15)

	// Density of seawater at atmospheric pressure, UNESCO (1981).
	rhoW := 999.842594 + 6.793952e-2*tc - 9.09529e-3*t2 + 1.001685e-4*t3 - 1.120083e-6*t4 + 6.536332e-9*t5
	rho := rhoW + (8.24493e-1-4.0899e-3*tc+7.6438e-5*t2-8.2467e-7*t3+5.3875e-9*t4)*s +
		(-5.72466e-3+1.0227e-4*tc-1.6546e-6*t2)*s15 + 4.8314e-4*s*s

	// ∂ln(water activity)/∂S, Millero & Leung (1976).
	dlna := (-5.58651e-4 + 2.40452e-7*tc - 3.12165e-9*t2 + 2.40808e-11*t3) +
		1.5*(1.79613e-5-9.9422e-8*tc+2.08919e-9*t2-1.39872e-11*t3)*math.Sqrt(s) +
		2*(-2.31065e-6-1.37674e-9*tc-1.93316e-11*t2)*s

	return saltState{s: s, tc: tc, kT: boltzmann * (tc + 273.15), isoComp: iso, rho: rho, negDlnaDS: -dlna}
}

// scatter evaluates the model at nm for this state.
func (st *saltState) scatter(nm, delta float64) Scattering {
	n, dnds := seawaterIndexNM(nm, st.s, st.tc)
	n2 := n * n
	// ρ ∂n²/∂ρ, Proutière, Megnassan & Hucteau (1992) as used by Zhang et al.
	q := n/3 - 1/(3*n)
	dfri := (n2 - 1) * (1 + 2.0/3.0*(n2+2)*q*q)
	lm := nm * 1e-9
	l4 := 1 / (lm * lm * lm * lm)
	cabannes := (6 + 6*delta) / (6 - 7*delta)
	betaDF := math.Pi * math.Pi / 2 * l4 * st.kT * st.isoComp * dfri * dfri * cabannes
	fluct := st.s * waterMolMass * dnds * dnds / st.rho / st.negDlnaDS / avogadro
	betaCF := 2 * math.Pi * math.Pi * l4 * n2 * fluct * cabannes
	b90 := betaDF + betaCF
	b := 8 * math.Pi / 3 * b90 * (2 + delta) / (1 + delta)
	return Scattering{Beta90: b90, B: b, Bb: b / 2, Delta: delta}
}
