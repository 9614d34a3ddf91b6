package mixing

import (
	"fmt"
	"math"
)

// ExchangeVelocity returns the gravitational-circulation velocity scale
// u_E = g·β·s_x·H³/(48·K_M) (Hansen & Rattray 1965, J. Mar. Res. 23:104;
// MacCready 2004, J. Phys. Oceanogr. 34:1296). sx is the along-channel salinity
// gradient (PSU m⁻¹, ≥ 0 when salinity rises seaward), h the depth (m), km the
// eddy viscosity (m² s⁻¹, > 0) and beta the haline contraction (PSU⁻¹).
// Valid for a tidally averaged, laterally uniform channel with constant K_M.
func ExchangeVelocity(sx, h, km, beta float64) float64 {
	return gravity * beta * sx * h * h * h / (48 * km)
}

// Profile is the tidally averaged Hansen–Rattray/MacCready (2004) velocity
// profile u(ζ) = U_R·P1(ζ) + u_E·P2(ζ), positive seaward, ζ = z/H ∈ [−1, 0],
// with P1 = 3/2 − (3/2)ζ² and P2 = 1 − 9ζ² − 8ζ³ (no slip at the bed, no stress
// at the surface, constant K_M).
type Profile struct {
	River    float64 // U_R = Q_R/A, m s⁻¹, ≥ 0
	Exchange float64 // u_E, m s⁻¹, ≥ 0
}

// At returns u(ζ), m s⁻¹, positive seaward.
func (p Profile) At(zeta float64) float64 {
	z2 := zeta * zeta
	return p.River*(1.5-1.5*z2) + p.Exchange*(1-9*z2-8*z2*zeta)
}

// Crossing returns the level ζ0 ∈ (−1, 0) where the flow changes from landward
// (below) to seaward (above), and ok = false when there is no landward flow
// anywhere (u_E ≤ U_R/2, from the sign of ∂u/∂ζ at the bed: 3U_R − 6u_E).
// Exact root of u/(1+ζ) = 0: 8u_E ζ² + kζ − k = 0, k = 1.5U_R + u_E.
func (p Profile) Crossing() (zeta float64, ok bool) {
	if !(p.Exchange > 0.5*p.River) || p.Exchange <= 0 {
		return -1, false
	}
	k := 1.5*p.River + p.Exchange
	return (-k - math.Sqrt(k*k+32*p.Exchange*k)) / (16 * p.Exchange), true
}

// Below returns ∫_{−1}^{ζ} u dζ' (m s⁻¹ times depth fraction): the seaward
// transport per unit width and depth below level ζ. Negative values are
// landward.
func (p Profile) Below(zeta float64) float64 {
	z2 := zeta * zeta
	f1 := 1.5*zeta - 0.5*z2*zeta + 1 // ∫P1 from −1
	f2 := zeta - 3*z2*zeta - 2*z2*z2 // ∫P2 from −1 (the antiderivative vanishes at −1)
	return p.River*f1 + p.Exchange*f2
}

// InterfacialViscosity returns the eddy viscosity (m² s⁻¹) for which the
// stress of the pure-exchange Hansen–Rattray profile at its flow reversal,
// K_M·(u_E/H)·P2'(ζ0), equals the two-layer interfacial stress c_i·(ū1 − ū2)²
// (interfacial drag law as in Schijf & Schönfeld 1953). With u_E from
// ExchangeVelocity this gives K_i = c_K·H²·√(c_i·g·β·s_x),
// c_K = |ū1 − ū2|/(u_E·√(48·P2'(ζ0))) ≈ 0.084 (derived here; see doc.go).
// It supplies the friction of weakly mixed, salt-wedge-like flow. Returns 0
// for sx ≤ 0 or ci ≤ 0; h > 0 (m), beta > 0 (PSU⁻¹).
func InterfacialViscosity(sx, h, ci, beta float64) float64 {
	if !(sx > 0) || !(ci > 0) {
		return 0
	}
	return interfacialCK * h * h * math.Sqrt(ci*gravity*beta*sx)
}

var interfacialCK = func() float64 {
	z := (-1 - math.Sqrt(33)) / 16 // flow reversal of P2
	p := Profile{Exchange: 1}
	t := p.Below(z) // landward transport below the reversal (negative)
	du := t/z - t/(1+z)
	d2 := -18*z - 24*z*z
	return math.Abs(du) / math.Sqrt(48*d2)
}()

// StratificationHR returns the top-to-bottom salinity difference of the
// Hansen–Rattray/MacCready (2004) solution, Δs = (K_M/K_S)·48/(g·β·H)·u_E·(U_R/8 + 3u_E/20),
// from s'(ζ) = (K_M/K_S)(48/(gβH))·u_E·(U_R·P3 + u_E·P4),
// P3 = −7/120 + ζ²/4 − ζ⁴/8 and P4 = −1/12 + ζ²/2 − (3/4)ζ⁴ − (2/5)ζ⁵.
// h > 0 (m), kmOverKs > 0, beta > 0 (PSU⁻¹); valid while Δs is small
// against the mean salinity (the theory is linear in the perturbation).
func StratificationHR(p Profile, h, kmOverKs, beta float64) float64 {
	return kmOverKs * 48 / (gravity * beta * h) * p.Exchange * (p.River/8 + 0.15*p.Exchange)
}

// HydraulicLimit returns the largest landward lower-layer transport per unit
// width q_in (m² s⁻¹) for which two-layer flow with seaward upper-layer
// transport q_R + q_in stays subcritical: composite Froude number
// G² = F1² + F2² ≤ 1 with F_i² = u_i²/(g'·h_i) (Armi & Farmer 1986, J. Fluid
// Mech. 164:27). It returns 0 when the river alone makes the upper layer
// critical (F1 ≥ 1: the salt wedge is expelled). h1, h2 > 0 (m), gp = g' ≥ 0 (m s⁻²).
func HydraulicLimit(qR, h1, h2, gp float64) float64 {
	a := 1/(h1*h1*h1) + 1/(h2*h2*h2)
	b := 2 * qR / (h1 * h1 * h1)
	c := qR*qR/(h1*h1*h1) - gp
	if c >= 0 {
		return 0
	}
	return (-b + math.Sqrt(b*b-4*a*c)) / (2 * a)
}

// MaximalExchange returns the largest subcritical landward transport per unit
// width over all interface positions a = h1/h ∈ [amin, 1 − amin] (maximal
// two-layer exchange, Armi & Farmer 1986) and the interface fraction a that
// achieves it, by golden-section search on HydraulicLimit (unimodal in a).
// h > 0 (m), gp ≥ 0 (m s⁻²), 0 < amin < 0.5.
func MaximalExchange(qR, h, gp, amin float64) (q, a float64) {
	lo, hi := amin, 1-amin
	if !(gp > 0) {
		return 0, 0.5
	}
	// below a_c = (q_R²/(g'h³))^(1/3) the upper layer is supercritical on its own
	if ac := math.Cbrt(qR * qR / (gp * h * h * h)); ac >= hi {
		return 0, hi
	} else if ac > lo {
		lo = ac
	}
	const r = 0.6180339887498949
	f := func(a float64) float64 { return HydraulicLimit(qR, a*h, (1-a)*h, gp) }
	x1, x2 := hi-r*(hi-lo), lo+r*(hi-lo)
	f1, f2 := f(x1), f(x2)
	for i := 0; i < 40; i++ {
		if f1 < f2 {
			lo, x1, f1 = x1, x2, f2
			x2 = lo + r*(hi-lo)
			f2 = f(x2)
		} else {
			hi, x2, f2 = x2, x1, f1
			x1 = hi - r*(hi-lo)
			f1 = f(x1)
		}
	}
	a = 0.5 * (lo + hi)
	return f(a), a
}

// Turner is an entrainment law E = w_e/|Δu| = (A − B·Ri)/(1 + C·Ri) for a
// sheared density interface at bulk Richardson number Ri, zero for
// Ri ≥ A/B. The zero value entrains nothing.
type Turner struct {
	A float64 // –, [0, 0.2]
	B float64 // –, [0, 10]
	C float64 // –, [0, 100]
}

// DefaultTurner returns A = 0.08, B = 0.1, C = 5 (Turner 1986, J. Fluid Mech.
// 173:431, fit to Ellison & Turner 1959 data; E = 0 above Ri = 0.8).
func DefaultTurner() Turner { return Turner{A: 0.08, B: 0.1, C: 5} }

// Coefficient returns E(ri); Ri < 0 (unstable) is treated as 0.
func (t Turner) Coefficient(ri float64) float64 {
	ri = math.Max(ri, 0)
	e := (t.A - t.B*ri) / (1 + t.C*ri)
	if !(e > 0) {
		return 0
	}
	return e
}

// Knudsen returns the tidally averaged landward (qIn) and seaward (qOut)
// exchange transports implied by steady water and salt balances,
// Q_out = Q_R·s_in/(s_in − s_out), Q_in = Q_R·s_out/(s_in − s_out)
// (Knudsen 1900; in the total-exchange-flow form of MacCready 2011, J. Phys.
// Oceanogr. 41:1116). qR ≥ 0 (m³ s⁻¹), 0 ≤ sOut < sIn (PSU).
func Knudsen(qR, sIn, sOut float64) (qIn, qOut float64, err error) {
	if !(qR >= 0) || math.IsInf(qR, 0) {
		return 0, 0, fmt.Errorf("mixing: Knudsen river flow %g m³/s is outside [0, ∞) m³/s", qR)
	}
	if !(sOut >= 0) || !(sIn > sOut) || math.IsInf(sIn, 0) {
		return 0, 0, fmt.Errorf("mixing: Knudsen salinities s_in = %g, s_out = %g PSU need 0 ≤ s_out < s_in", sIn, sOut)
	}
	d := sIn - sOut
	return qR * sOut / d, qR * sIn / d, nil
}

// WedgeLength returns the length (m) of an arrested salt wedge in a prismatic
// channel with a stagnant lower layer, interfacial stress ρ·c_i·u1² and a
// critical upper layer at the mouth (Schijf & Schönfeld 1953, Proc. 5th IAHR
// Congress, 321–333):
//
//	L = h/(4c_i) · [F⁻²/5 − 2 + 3F^(2/3) − (6/5)F^(4/3)],  F = u_r/√(g'h),
//
// the integral of dx/da = h(a³ − F²)(1 − a)/(c_i F²) from the mouth a0 = F^(2/3)
// to the tip a = 1, a = h1/h. L = 0 for F ≥ 1 (the wedge is expelled); L ∝ F⁻²
// for F ≪ 1. h > 0 (m), gp = g' > 0 (m s⁻²), ur ≥ 0 (m s⁻¹), ci > 0.
func WedgeLength(h, gp, ur, ci float64) (float64, error) {
	if !(h > 0) || !(gp > 0) || !(ur >= 0) || !(ci > 0) || math.IsInf(h+gp+ur+ci, 0) {
		return 0, fmt.Errorf("mixing: WedgeLength needs depth %g m > 0, g' %g m/s² > 0, river velocity %g m/s ≥ 0, c_i %g > 0", h, gp, ur, ci)
	}
	if ur == 0 {
		return math.Inf(1), fmt.Errorf("mixing: WedgeLength river velocity 0 m/s: wedge length unbounded; need > 0 m/s")
	}
	f := ur / math.Sqrt(gp*h)
	if f >= 1 {
		return 0, nil
	}
	f23 := math.Cbrt(f * f)
	return h / (4 * ci) * (1/(5*f*f) - 2 + 3*f23 - 1.2*f23*f23), nil
}
