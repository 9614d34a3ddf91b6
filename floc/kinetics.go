package floc

import (
	"fmt"
	"math"
)

// Kinetics holds the growth and break-up closure of Winterwerp (1998,
// J. Hydraul. Res. 36:309–326) in its dimensionless ("primed")
// form, so that one parameter set holds for any primary size and fractal
// dimension:
//
//	dD/dt = A − B
//	A = e(S)·k'_A · D_p^(n_f−3)/(n_f·ρ_s) · G·C·D^(4−n_f)                      (aggregation)
//	B = k'_B · D_p^(−p)/n_f · (μ/F_y)^q · G^(q+1)·(D − D_p)^p·D^(2q+1),  p = 3 − n_f   (break-up)
//
// with G the turbulence shear rate (s⁻¹), C the mass concentration (kg m⁻³),
// μ the dynamic viscosity and e(S) a salinity factor on the collision
// efficiency. The size is capped by the Kolmogorov microscale η = √(ν/G):
// the aggregation term assumes flocs smaller than the smallest eddies, and
// larger flocs are torn apart (common practice).
type Kinetics struct {
	// Aggregation is k'_A in saline water, dimensionless. Allowed (0, 100].
	Aggregation float64
	// Breakup is k'_B, dimensionless. Allowed (0, 1].
	Breakup float64
	// YieldStrength F_y of the floc, N. Allowed (0, 1e-6].
	YieldStrength float64
	// BreakupExponent q, dimensionless. Allowed (0, 2].
	BreakupExponent float64
	// FreshwaterEfficiency is e(0), the collision efficiency in fresh
	// water relative to saline water. Allowed [0, 1]; 1 removes the
	// salinity dependence.
	FreshwaterEfficiency float64
	// SalinityScale S_c, PSU: e(S) rises from FreshwaterEfficiency at S = 0
	// to 1 at S ≥ S_c along the smooth step 3s² − 2s³, s = S/S_c. Allowed
	// (0, 35].
	SalinityScale float64
}

// DefaultKinetics is Winterwerp's calibration on Ems mud (k_A = 14.6 m² kg⁻¹,
// k_B = 14×10³ s^½ m⁻² with D_p = 4 µm, ρ_s = 2650 kg m⁻³, n_f = 2, μ = 10⁻³ Pa s,
// F_y = 10⁻¹⁰ N, q = ½) written in primed form: k'_A = 0.3095, k'_B = 3.54×10⁻⁵.
//
// The salinity factor is a documented, tunable choice (common practice: no
// single published calibration): S_c = 3 PSU, within the 1–5 PSU threshold
// band where fine sediment starts to flocculate, and e(0) = 0.1, which makes
// the excess equilibrium size D_e − D_p ten times smaller in fresh water, the
// contrast between river micro-flocs (10–20 µm) and estuarine macro-flocs
// (100–200 µm) reported for the Seine and Gironde estuaries (a 2010
// laboratory and field study; citation not verified).
var DefaultKinetics = Kinetics{
	Aggregation:          0.3095,
	Breakup:              3.54e-5,
	YieldStrength:        1e-10,
	BreakupExponent:      0.5,
	FreshwaterEfficiency: 0.1,
	SalinityScale:        3,
}

// Validate reports the first field outside its allowed range.
func (k Kinetics) Validate() error {
	switch {
	case !(k.Aggregation > 0 && k.Aggregation <= 100):
		return rangeError("Aggregation", k.Aggregation, "(0, 100]", "1")
	case !(k.Breakup > 0 && k.Breakup <= 1):
		return rangeError("Breakup", k.Breakup, "(0, 1]", "1")
	case !(k.YieldStrength > 0 && k.YieldStrength <= 1e-6):
		return rangeError("YieldStrength", k.YieldStrength, "(0, 1e-6]", "N")
	case !(k.BreakupExponent > 0 && k.BreakupExponent <= 2):
		return rangeError("BreakupExponent", k.BreakupExponent, "(0, 2]", "1")
	case !(k.FreshwaterEfficiency >= 0 && k.FreshwaterEfficiency <= 1):
		return rangeError("FreshwaterEfficiency", k.FreshwaterEfficiency, "[0, 1]", "1")
	case !(k.SalinityScale > 0 && k.SalinityScale <= 35):
		return rangeError("SalinityScale", k.SalinityScale, "(0, 35]", "PSU")
	}
	return nil
}

// KineticsFromCoefficients returns the primed parameters equivalent to
// dimensional coefficients k_A and k_B, defined by A = k_A·G·C·D^(4−n_f) and
// B = k_B·G^(q+1)·(D−D_p)^p·D^(2q+1) in SI units (for n_f = 2: m² kg⁻¹ and
// s^½ m⁻²), calibrated
// for structure f at dynamic viscosity mu (Pa s), keeping the other fields
// of base. This is how Winterwerp (1998) and most later work quote their
// calibrations. It inverts the definitions in Kinetics exactly.
func KineticsFromCoefficients(kA, kB float64, f Fractal, mu float64, base Kinetics) Kinetics {
	k := base
	k.Aggregation = kA * f.Dimension * f.PrimaryDensity / math.Pow(f.PrimaryDiameter, f.Dimension-3)
	p := 3 - f.Dimension
	k.Breakup = kB * f.Dimension * math.Pow(f.PrimaryDiameter, p) / math.Pow(mu/k.YieldStrength, k.BreakupExponent)
	return k
}

// Efficiency returns the salinity factor e(S) on the collision efficiency,
// in [FreshwaterEfficiency, 1], for salinity s (PSU, clamped to ≥ 0).
func (k Kinetics) Efficiency(s float64) float64 {
	return k.FreshwaterEfficiency + (1-k.FreshwaterEfficiency)*smoothStep(s/k.SalinityScale)
}

// smoothStep is 3x² − 2x³ on [0, 1], 0 below and 1 above.
func smoothStep(x float64) float64 {
	if x <= 0 {
		return 0
	}
	if x >= 1 {
		return 1
	}
	return x * x * (3 - 2*x)
}

// rates holds the coefficients of dD/dt = a·D^(4−n_f) − b·(D−D_p)^p·D^(2q+1)
// for fixed local conditions.
type rates struct {
	a, b   float64 // aggregation and break-up prefactors
	dp, nf float64 // primary diameter, fractal dimension
	q      float64 // break-up exponent
	eta    float64 // Kolmogorov microscale, m
}

func (r rates) f(d float64) float64 {
	p := 3 - r.nf
	g := r.a * math.Pow(d, 4-r.nf)
	if d > r.dp {
		g -= r.b * math.Pow(d-r.dp, p) * math.Pow(d, 2*r.q+1)
	}
	return g
}

// equilibrium solves A = B, i.e. b/a·D^(2q)·(1 − D_p/D)^p = 1 (monotonic
// increasing in D, so the root is unique), by bisection in ln D to 1e-13
// relative. It returns D_p when aggregation vanishes (a = 0) and +Inf when
// break-up vanishes (b = 0).
func (r rates) equilibrium() float64 {
	if r.a == 0 {
		return r.dp
	}
	if r.b == 0 {
		return math.Inf(1)
	}
	p := 3 - r.nf
	h := func(d float64) float64 {
		return math.Log(r.b/r.a) + 2*r.q*math.Log(d) + p*math.Log1p(-r.dp/d)
	}
	if p == 0 && h(r.dp) >= 0 {
		return r.dp // solid primaries do not aggregate past this point
	}
	lo, hi := r.dp, 2*r.dp
	for h(hi) < 0 {
		lo = hi
		hi *= 2
		if hi > 1e3 {
			return math.Inf(1)
		}
	}
	for hi-lo > 1e-13*hi {
		mid := math.Sqrt(lo * hi)
		if mid <= lo || mid >= hi {
			break
		}
		if h(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi)
}

// checkConditions validates the local conditions of the kinetics.
func checkConditions(g, c, s, t float64) error {
	if !(g >= 0 && g <= 1e4) {
		return rangeError("Shear", g, "[0, 1e4]", "s-1")
	}
	if !(c >= 0 && c <= 500) {
		return rangeError("Concentration", c, "[0, 500]", "kg m-3")
	}
	return checkWater(s, t)
}

// makeRates evaluates the prefactors for f, k and local conditions.
func makeRates(f Fractal, k Kinetics, g, c, s, t float64) rates {
	mu := waterViscosity(s, t)
	nu := mu / waterDensity(s, t)
	p := 3 - f.Dimension
	r := rates{dp: f.PrimaryDiameter, nf: f.Dimension, q: k.BreakupExponent, eta: math.Inf(1)}
	r.a = k.Efficiency(s) * k.Aggregation * math.Pow(f.PrimaryDiameter, f.Dimension-3) / (f.Dimension * f.PrimaryDensity) * g * c
	r.b = k.Breakup * math.Pow(f.PrimaryDiameter, -p) / f.Dimension * math.Pow(mu/k.YieldStrength, k.BreakupExponent) * math.Pow(g, k.BreakupExponent+1)
	if g > 0 {
		r.eta = math.Sqrt(nu / g)
	}
	return r
}

// KolmogorovScale returns η = √(ν/G) (m), the Kolmogorov microscale for
// shear rate g (s⁻¹) in water of salinity s (PSU) and temperature t (°C):
// with ε = νG², η = (ν³/ε)^¼ = √(ν/G) (Kolmogorov 1941; G = √(ε/ν) as in
// Camp & Stein 1943). +Inf for g = 0.
func KolmogorovScale(g, s, t float64) (float64, error) {
	if err := checkConditions(g, 0, s, t); err != nil {
		return 0, err
	}
	if g == 0 {
		return math.Inf(1), nil
	}
	return math.Sqrt(waterViscosity(s, t) / waterDensity(s, t) / g), nil
}

// stepSize is the integration of dD/dt = r.f(D) over dt from d0, with the
// Kolmogorov cap. The trajectory of a one-dimensional autonomous equation
// is monotonic and never crosses the equilibrium, so the result is clamped
// to lie between d0 and D_e; the classical fourth-order Runge–Kutta method
// runs with sub-steps of at most a fifth of the local relaxation time.
func (r rates) step(d0, dt float64) float64 {
	if d0 > r.eta {
		d0 = max(r.eta, r.dp) // torn apart by eddies smaller than the floc
	}
	de := r.equilibrium()
	target := min(de, max(r.eta, r.dp))
	if dt == 0 || d0 == target || (r.a == 0 && r.b == 0) {
		return d0
	}
	lo, hi := min(d0, target), max(d0, target)
	// Relaxation time: the linearised rate at equilibrium and the secant
	// from the start point; the smaller governs the sub-step.
	tau := math.Inf(1)
	if f0 := r.f(d0); f0 != 0 {
		tau = math.Abs(target-d0) / math.Abs(f0)
	}
	if !math.IsInf(de, 1) {
		h := 1e-6 * de
		if dfd := math.Abs(r.f(de+h)-r.f(de-h)) / (2 * h); dfd > 0 {
			tau = min(tau, 1/dfd)
		}
	}
	if dt > 60*tau && target == de {
		return de // relaxed to within e^-60
	}
	n := int(math.Ceil(dt / (0.2 * tau)))
	n = max(1, min(n, 100000))
	h := dt / float64(n)
	clamp := func(d float64) float64 { return min(max(d, lo), hi) }
	d := d0
	for range n {
		k1 := r.f(d)
		k2 := r.f(clamp(d + 0.5*h*k1))
		k3 := r.f(clamp(d + 0.5*h*k2))
		k4 := r.f(clamp(d + h*k3))
		d = clamp(d + h/6*(k1+2*k2+2*k3+k4))
		if d == target {
			break
		}
	}
	return d
}

// errNoEquilibrium is returned when the kinetics have no finite size.
func errNoEquilibrium(g float64) error {
	return fmt.Errorf("floc: Shear = %g s-1 has no equilibrium floc size (allowed range (0, 1e4] s-1 for equilibrium)", g)
}
