package seen

import (
	"fmt"
	"math"
)

// KdModel is the semi-analytical model of the diffuse attenuation of
// downwelling irradiance, averaged over the euphotic layer (Lee, Du & Arnone
// 2005, J. Geophys. Res. 110:C02016; revised by Lee et al. 2013, J. Geophys.
// Res. Oceans 118:4241, citation details from memory):
//
//	K_d = (1 + M0·θ_s) a + (1 − Chi·b_bw/b_b) M1 (1 − M2 e^{−M3 a}) b_b,
//
// with θ_s the solar zenith angle in degrees (the API takes radians).
// The 2013 form weighs water backscattering less than particle
// backscattering (Chi > 0), because the nearly isotropic water VSF sends
// less of its backscattered light far from the downward direction.
// Validity: the coefficients were fitted to radiative-transfer
// simulations with an average particle phase function; the 2005 paper
// reports ≈2 % average and ≈12 % maximum error against those simulations
// for other phase functions (abstract). Solar zenith up to ZenithMax
// (flagged beyond); deep homogeneous water.
type KdModel struct {
	// Name identifies the model in output.
	Name string
	// M0 is the solar-zenith coefficient, per degree.
	M0 float64
	// M1, M2 (dimensionless) and M3 (m) shape the backscattering term.
	M1, M2, M3 float64
	// Chi weighs water backscattering, dimensionless; 0 ignores the
	// distinction.
	Chi float64
	// ZenithMax is the largest solar zenith angle of the fit, rad.
	ZenithMax float64
}

var (
	// Lee2005Kd: m0 = 0.005, m1 = 4.18, m2 = 0.52, m3 = 10.8 (coefficients
	// from memory; verify against Lee, Du & Arnone 2005 before relying on
	// them). ZenithMax = 60° is from memory.
	Lee2005Kd = KdModel{Name: "Lee2005", M0: 0.005, M1: 4.18, M2: 0.52, M3: 10.8, ZenithMax: 60 * math.Pi / 180}
	// Lee2013Kd: m0 = 0.005, m1 = 4.26, m2 = 0.52, m3 = 10.54, χ = 0.265
	// (Lee et al. 2013). ZenithMax = 60° is from memory.
	Lee2013Kd = KdModel{Name: "Lee2013", M0: 0.005, M1: 4.26, M2: 0.52, M3: 10.54, Chi: 0.265, ZenithMax: 60 * math.Pi / 180}
)

// Kd returns K_d (m⁻¹) for total absorption a, total backscattering b_b and
// water backscattering b_bw (m⁻¹, 0 ≤ b_bw ≤ b_b; ignored when Chi = 0) at
// solar zenith angle zenith (rad, in [0, π/2)). Special case: b_b = 0 gives
// (1 + M0 θ_s) a, which for the sun at zenith is a, the exact limit for a
// collimated beam in non-scattering water.
func (m KdModel) Kd(a, bb, bbw, zenith float64) (float64, Flag, error) {
	if err := checkScalar("a", a, 0, MaxCoefficient, "m⁻¹"); err != nil {
		return 0, 0, err
	}
	if err := checkScalar("b_b", bb, 0, MaxCoefficient, "m⁻¹"); err != nil {
		return 0, 0, err
	}
	if m.Chi != 0 && !(bbw >= 0 && bbw <= bb) {
		return 0, 0, fmt.Errorf("seen: b_bw = %g m⁻¹ is outside [0, b_b = %g] m⁻¹", bbw, bb)
	}
	if !(zenith >= 0 && zenith < math.Pi/2) {
		return 0, 0, fmt.Errorf("seen: solar zenith = %g rad is outside [0, π/2) rad", zenith)
	}
	var f Flag
	if zenith > m.ZenithMax {
		f = FlagLowSun
	}
	deg := zenith * 180 / math.Pi
	k := (1 + m.M0*deg) * a
	if bb > 0 {
		k += (1 - m.Chi*bbw/bb) * m.M1 * (1 - m.M2*math.Exp(-m.M3*a)) * bb
	}
	return k, f, nil
}

// Spectrum fills dst with K_d (m⁻¹) for the spectra s, water
// backscattering bbw (m⁻¹, same length; may be nil when m.Chi = 0) and
// solar zenith angle zenith (rad). It allocates nothing.
func (m KdModel) Spectrum(dst []float64, s Spectra, bbw []float64, zenith float64) (Flag, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	n := len(s.Wavelength)
	if len(dst) != n {
		return 0, fmt.Errorf("seen: dst has %d values for %d wavelengths", len(dst), n)
	}
	if m.Chi != 0 && len(bbw) != n {
		return 0, fmt.Errorf("seen: water backscattering has %d values for %d wavelengths", len(bbw), n)
	}
	var flags Flag
	for i := range dst {
		w := 0.0
		if m.Chi != 0 {
			w = bbw[i]
		}
		k, f, err := m.Kd(s.A[i], s.Bb[i], w, zenith)
		if err != nil {
			return 0, fmt.Errorf("seen: wavelength %d (%g m): %w", i, s.Wavelength[i], err)
		}
		flags |= f
		dst[i] = k
	}
	return flags, nil
}
