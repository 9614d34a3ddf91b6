package seen

import (
	"fmt"
	"math"
)

// Chi returns the particulate χ_p(θ) factor of Sullivan, Twardowski,
// Zaneveld & Moore (2013, "Measuring optical backscattering in water", Light
// Scattering Reviews 7, Springer) and its relative uncertainty σ, at
// scattering angle theta (rad), so that
//
//	b_bp ≈ 2π χ_p(θ) β_p(θ).
//
// The table is given every 10° from 90° to 170°; between nodes χ_p and σ
// are interpolated linearly. Validity: θ in [90°, 170°]; outside it an
// error is returned. The factor is for particles only: water must be
// removed from β before it is applied (see BackscatterSensor).
func Chi(theta float64) (chi, sigma float64, err error) {
	deg := theta * 180 / math.Pi
	lo, hi := chiTable[0][0], chiTable[0][len(chiTable[0])-1]
	// Allow 1e-9° of rounding from degree–radian conversion at the ends.
	if !(deg >= lo-1e-9 && deg <= hi+1e-9) {
		return 0, 0, fmt.Errorf("seen: backscatter angle %g rad (%.4g°) is outside the χ_p table range [%g°, %g°]", theta, deg, lo, hi)
	}
	deg = math.Min(math.Max(deg, lo), hi)
	return interp(chiTable[0], chiTable[1], deg), interp(chiTable[0], chiTable[2], deg), nil
}

// BackscatterSensor is a single-angle backscattering meter that measures
// β(θ) at its centroid angle and converts it to b_b with the χ_p factor
// (Chi):
//
//	β_p = β(θ) − β_w(θ),   b_bp = 2π χ_p(θ) β_p,   b_b = b_bp + b_bw.
//
// The instrument's finite field of view is represented by its centroid
// angle only (the χ_p table was derived for that use). Validity: Angle in
// [90°, 170°]; single scattering in the sensing volume (a few cm, so this
// holds until c reaches several m⁻¹; the electronics' saturation usually
// comes first). Water β and b_b come from the caller (for example a
// pure-seawater model at the local temperature and salinity).
type BackscatterSensor struct {
	// Angle is the centroid scattering angle, rad, in [90°, 170°].
	Angle float64
	// WaterBeta is β of particle-free water at Angle, m⁻¹ sr⁻¹, ≥ 0;
	// subtracted before χ_p is applied. 0 treats all of β as particles.
	WaterBeta float64
	// WaterBb is b_b of particle-free water, m⁻¹, ≥ 0; added back to give
	// total b_b.
	WaterBb float64
}

// BackscatterReading is what a BackscatterSensor reports.
type BackscatterReading struct {
	// Beta is the total β at the sensor angle, m⁻¹ sr⁻¹.
	Beta float64
	// ParticleBeta is β_p = β − β_w, m⁻¹ sr⁻¹ (0 if negative, flagged).
	ParticleBeta float64
	// Chi is χ_p at the sensor angle, dimensionless.
	Chi float64
	// ChiUncertainty is the relative uncertainty of Chi from the table,
	// dimensionless.
	ChiUncertainty float64
	// ParticleBb is b_bp = 2π χ_p β_p, m⁻¹.
	ParticleBb float64
	// Bb is the total b_b = b_bp + b_bw, m⁻¹.
	Bb float64
	// VSFBb is the total b_b integrated from the VSF itself,
	// 2π ∫_{90°}^{180°} β sin θ dθ, m⁻¹, when the VSF is sampled over the
	// whole backward hemisphere (HasVSFBb); comparing it with Bb shows the
	// error of the single-angle method for this particle population.
	VSFBb    float64
	HasVSFBb bool
	// Flags: FlagNegativeParticle.
	Flags Flag
}

// Read simulates the sensor with the total VSF at one wavelength. The VSF
// must be sampled on both sides of (or at) the sensor angle.
func (s BackscatterSensor) Read(vsf VSF) (BackscatterReading, error) {
	var r BackscatterReading
	chi, sig, err := Chi(s.Angle)
	if err != nil {
		return r, err
	}
	if err := checkScalar("BackscatterSensor.WaterBeta", s.WaterBeta, 0, math.MaxFloat64, "m⁻¹ sr⁻¹"); err != nil {
		return r, err
	}
	if err := checkScalar("BackscatterSensor.WaterBb", s.WaterBb, 0, math.MaxFloat64, "m⁻¹"); err != nil {
		return r, err
	}
	if err := vsf.Validate(); err != nil {
		return r, err
	}
	if s.Angle < vsf.Angle[0] || s.Angle > vsf.Angle[len(vsf.Angle)-1] {
		return r, fmt.Errorf("seen: BackscatterSensor.Angle = %g rad is outside the VSF's sampled angles [%g, %g] rad", s.Angle, vsf.Angle[0], vsf.Angle[len(vsf.Angle)-1])
	}
	r.Beta = vsf.at(s.Angle)
	r.ParticleBeta = r.Beta - s.WaterBeta
	if r.ParticleBeta < 0 {
		r.ParticleBeta = 0
		r.Flags |= FlagNegativeParticle
	}
	r.Chi, r.ChiUncertainty = chi, sig
	r.ParticleBb = 2 * math.Pi * chi * r.ParticleBeta
	r.Bb = r.ParticleBb + s.WaterBb
	if vsf.Angle[0] <= math.Pi/2 && vsf.Angle[len(vsf.Angle)-1] >= math.Pi {
		r.VSFBb, r.HasVSFBb = vsf.backward(), true
	}
	return r, nil
}

// Backscattering returns b_b = 2π ∫_{π/2}^{π} β(θ) sin θ dθ (m⁻¹),
// integrated with the VSF's interpolation. The VSF must be sampled from at
// most π/2 to π; otherwise an error is returned.
func (v VSF) Backscattering() (float64, error) {
	if err := v.Validate(); err != nil {
		return 0, err
	}
	if v.Angle[0] > math.Pi/2 || v.Angle[len(v.Angle)-1] < math.Pi {
		return 0, fmt.Errorf("seen: VSF sampled over [%g, %g] rad does not cover the backward hemisphere [π/2, π]", v.Angle[0], v.Angle[len(v.Angle)-1])
	}
	return v.backward(), nil
}

// backward integrates a validated VSF that covers [π/2, π].
func (v VSF) backward() float64 {
	var total float64
	for i := 0; i+1 < len(v.Angle); i++ {
		lo, hi := v.Angle[i], v.Angle[i+1]
		if hi <= math.Pi/2 {
			continue
		}
		lo = math.Max(lo, math.Pi/2)
		k, power := v.exponent(i)
		total += 2 * math.Pi * v.segmentGL(i, k, power, lo, hi)
	}
	return total
}
