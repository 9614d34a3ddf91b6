package mixing

import "math"

// RichardsonDamping is a stratification damping function
// f(Ri) = (1 + Alpha·Ri)^(−Exponent) of the Munk & Anderson (1948) family,
// multiplying the tidal part of the vertical diffusivity K_S. The zero value
// (Alpha = 0 or Exponent = 0) is f ≡ 1, no damping. MunkAnderson gives the
// default.
type RichardsonDamping struct {
	Alpha    float64 // –, [0, 100]
	Exponent float64 // –, [0, 5]
}

// MunkAnderson returns the scalar (salt and heat) form of Munk & Anderson
// (1948, J. Mar. Res. 7:276; from memory): K_S = K_S0·(1 + 3.33·Ri)^(−3/2).
// Its buoyancy flux Ri·f(Ri) is largest at Ri = 1/(α(n − 1)) ≈ 0.6
// (PeakFluxRichardson).
func MunkAnderson() RichardsonDamping { return RichardsonDamping{Alpha: 3.33, Exponent: 1.5} }

// PacanowskiPhilander returns the scalar form of Pacanowski & Philander (1981,
// J. Phys. Oceanogr. 11:1443; from memory), fitted for the equatorial upper
// ocean, without its background terms ν_b and κ_b:
// κ = ν0/(1 + 5Ri)^2/(1 + 5Ri) = ν0·(1 + 5Ri)^(−3).
func PacanowskiPhilander() RichardsonDamping { return RichardsonDamping{Alpha: 5, Exponent: 3} }

// Factor returns f(ri) ∈ [0, 1]. Ri ≤ 0 (unstable or unstratified) and NaN
// (no stratification information) give 1; Ri = +Inf (a stratified column
// with no tidal current) gives 0.
func (d RichardsonDamping) Factor(ri float64) float64 {
	if d.Alpha == 0 || d.Exponent == 0 {
		return 1
	}
	if !(ri > 0) {
		return 1
	}
	if math.IsInf(ri, 1) {
		return 0
	}
	return math.Pow(1+d.Alpha*ri, -d.Exponent)
}

// PeakFluxRichardson returns the Richardson number at which the damped
// buoyancy flux Ri·f(Ri) is largest, 1/(Alpha·(Exponent − 1)), or +Inf when the
// flux rises for all Ri (Exponent ≤ 1 or no damping). Beyond it a flux law in
// the local stratification has a falling branch, the condition for the
// layering instability of Phillips (1972, Deep-Sea Res. 19:79).
func (d RichardsonDamping) PeakFluxRichardson() float64 {
	if d.Alpha == 0 || d.Exponent <= 1 {
		return math.Inf(1)
	}
	return 1 / (d.Alpha * (d.Exponent - 1))
}

// LayerRichardson returns the bulk (layer) Richardson number
// Ri_b = g'·h/ΔU² with g' = g·β·Δs (research note §A7 form; Turner 1973,
// Buoyancy Effects in Fluids, ch. 6, from memory) for a salinity difference
// ds ≥ 0 (PSU) across a depth h > 0 (m) sheared by a velocity scale du ≥ 0
// (m s⁻¹), beta > 0 (PSU⁻¹). It is 0 for ds ≤ 0 and +Inf for ds > 0 with
// du = 0 (Factor maps +Inf to 0).
func LayerRichardson(ds, h, du, beta float64) float64 {
	if !(ds > 0) {
		return 0
	}
	if !(du > 0) {
		return math.Inf(1)
	}
	return gravity * beta * ds * h / (du * du)
}

// richardson sets, per cell, the bulk layer Richardson number of the tidal
// flow and the damping factor f(Ri_b) of the tidal vertical diffusivity:
// Ri_b = LayerRichardson(⟨Δs⟩, H, U_T) with U_T the spring–neap amplitude of
// the section-mean tidal current (env is the amplitude of dη/dt) and ⟨Δs⟩
// the lower-minus-upper salinity, filtered over an M2 period (as the
// exchange flow's salinity gradient is) and averaged over the cells within
// one tidal excursion U_T/ω either side, the water a column meets in a tide.
// It is called with the exchange flow, every exchangeInterval.
func (m *Model) richardson(env float64) {
	cl := m.cfg.Closure
	n := m.n
	m.cum[0] = 0
	for i := 0; i < n; i++ {
		m.cum[i+1] = m.cum[i] + math.Max(0, m.dsfilt[i])
	}
	for i := 0; i < n; i++ {
		ut := 0.5 * (m.tidalVelocity(i, env) + m.tidalVelocity(i+1, env))
		k := int(ut / (omegaM2 * m.dx))
		lo, hi := max(0, i-k), min(n-1, i+k)
		ds := (m.cum[hi+1] - m.cum[lo]) / float64(hi-lo+1)
		m.ri[i] = LayerRichardson(ds, m.h[i], ut, cl.HalineContraction)
		m.damp[i] = cl.Damping.Factor(m.ri[i])
	}
}
