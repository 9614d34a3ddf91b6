package floc

import (
	"fmt"
	"math"
)

// Model bundles the structure, kinetics, settling and size-distribution
// closures of one floc population. Its methods take local conditions as
// plain SI numbers, so that an estuary model can call them through function
// values without importing this package:
//
//	shear rate G (s⁻¹), mass concentration C (kg m⁻³), salinity S (PSU),
//	temperature T (°C), floc diameter D (m), time step dt (s).
type Model struct {
	Fractal  Fractal
	Kinetics Kinetics
	Settling Settling
	Spread   Spread
}

// DefaultModel combines DefaultFractal, DefaultKinetics, DefaultSettling and
// DefaultSpread.
var DefaultModel = Model{Fractal: DefaultFractal, Kinetics: DefaultKinetics, Settling: DefaultSettling, Spread: DefaultSpread}

// Validate reports the first invalid field.
func (m Model) Validate() error {
	if err := m.Fractal.Validate(); err != nil {
		return err
	}
	if err := m.Kinetics.Validate(); err != nil {
		return err
	}
	if err := m.Settling.Validate(); err != nil {
		return err
	}
	return m.Spread.Validate()
}

// Equilibrium returns the equilibrium floc diameter D_e (m) where growth
// balances break-up in the Winterwerp (1998) kinetics (see Kinetics), capped
// by the Kolmogorov microscale and never below D_p. For n_f = 2 and q = ½ it
// is D_e = D_p + k_A·C/(k_B·√G) exactly (Winterwerp 1998): D_e rises with C and
// falls with G. C = 0 gives D_p. G must be positive (still water has no
// equilibrium in these kinetics): errors for g ≤ 0.
func (m Model) Equilibrium(g, c, s, t float64) (float64, error) {
	if err := m.Validate(); err != nil {
		return 0, err
	}
	if err := checkConditions(g, c, s, t); err != nil {
		return 0, err
	}
	if g == 0 {
		return 0, errNoEquilibrium(g)
	}
	r := makeRates(m.Fractal, m.Kinetics, g, c, s, t)
	return min(r.equilibrium(), max(r.eta, r.dp)), nil
}

// Step advances the floc diameter d (m) by dt (s) under constant local
// conditions, integrating dD/dt = A − B of Winterwerp (1998) (see
// Kinetics): size relaxes towards the equilibrium with a time scale of
// order 1/(k_A·C·G·D^(3−n_f)), so that it lags a tidally varying shear. A
// floc larger than the Kolmogorov microscale is first reduced to it. G = 0
// leaves the size unchanged. The result lies between d (after the cap) and
// the capped equilibrium; the error of the sub-stepped Runge–Kutta scheme is
// below 1e-6 relative (see the tests).
func (m Model) Step(d, g, c, s, t, dt float64) (float64, error) {
	if err := m.Validate(); err != nil {
		return 0, err
	}
	if err := m.Fractal.checkDiameter("Diameter", d); err != nil {
		return 0, err
	}
	if err := checkConditions(g, c, s, t); err != nil {
		return 0, err
	}
	if !(dt >= 0 && dt <= 1e7) {
		return 0, rangeError("TimeStep", dt, "[0, 1e7]", "s")
	}
	r := makeRates(m.Fractal, m.Kinetics, g, c, s, t)
	return max(r.step(max(d, r.dp), dt), r.dp), nil
}

// SettlingVelocity returns the settling velocity (m s⁻¹, downward) of a floc
// of diameter d (m) in water of salinity s (PSU), temperature t (°C) and
// concentration c (kg m⁻³); see Settling.Velocity.
func (m Model) SettlingVelocity(d, s, t, c float64) (float64, error) {
	return m.Settling.Velocity(m.Fractal, d, s, t, c)
}

// EquilibriumSettlingVelocity returns the settling velocity (m s⁻¹) of the
// equilibrium floc for shear g (s⁻¹), concentration c (kg m⁻³), salinity s
// (PSU) and temperature t (°C). Its method value has the plain signature
// func(G, C, S, T float64) (float64, error) that an estuary model can take.
func (m Model) EquilibriumSettlingVelocity(g, c, s, t float64) (float64, error) {
	d, err := m.Equilibrium(g, c, s, t)
	if err != nil {
		return 0, err
	}
	return m.SettlingVelocity(d, s, t, c)
}

// MassSettlingVelocity returns the mass-weighted mean settling velocity
// (m s⁻¹) of a population whose flocculated part has median diameter d (m)
// at conditions s, t, c: the unflocculated primaries (mass fraction from
// Spread) settle as solid primaries, the flocs with the lognormal spread of
// Spread, integrated over ±4σ in ln D in 32 bins, each bin's exact lognormal
// mass weighting its mid-point velocity (truncated at D_p, renormalised).
func (m Model) MassSettlingVelocity(d, s, t, c float64) (float64, error) {
	if err := m.Validate(); err != nil {
		return 0, err
	}
	pop, err := m.Population(d, s)
	if err != nil {
		return 0, err
	}
	wp, err := m.SettlingVelocity(m.Fractal.PrimaryDiameter, s, t, c)
	if err != nil {
		return 0, err
	}
	const n = 32
	sum, wsum := 0.0, 0.0
	lo := max(math.Log(pop.Median)-4*pop.LogWidth, math.Log(m.Fractal.PrimaryDiameter))
	hi := math.Log(pop.Median) + 4*pop.LogWidth
	if hi <= lo || pop.LogWidth == 0 {
		w, err := m.SettlingVelocity(pop.Median, s, t, c)
		if err != nil {
			return 0, err
		}
		return pop.PrimaryFraction*wp + (1-pop.PrimaryFraction)*w, nil
	}
	for i := range n {
		x0 := lo + (hi-lo)*float64(i)/n
		x1 := lo + (hi-lo)*float64(i+1)/n
		frac := pop.massFraction(math.Exp(x0), math.Exp(x1))
		w, err := m.SettlingVelocity(math.Exp(0.5*(x0+x1)), s, t, c)
		if err != nil {
			return 0, err
		}
		sum += frac * w
		wsum += frac
	}
	return pop.PrimaryFraction*wp + (1-pop.PrimaryFraction)*sum/wsum, nil
}

// Spread holds the shape of the floc size distribution around the kinetic
// (median) size and the share of sediment left as unflocculated primaries.
type Spread struct {
	// LogWidth σ is the standard deviation of ln D of the lognormal mass
	// distribution of flocs. Allowed [0, 2].
	LogWidth float64
	// PrimaryFresh is the mass fraction of unflocculated primary particles
	// in fresh water. Allowed [0, 1].
	PrimaryFresh float64
	// PrimarySaline is that fraction at salinities ≥ SalinityScale.
	// Allowed [0, PrimaryFresh].
	PrimarySaline float64
	// SalinityScale S_c (PSU) of the smooth step 3s² − 2s³, s = S/S_c, from
	// PrimaryFresh to PrimarySaline. Allowed (0, 35].
	SalinityScale float64
}

// DefaultSpread is a documented, tunable choice (common practice; no single
// published calibration): σ = 0.5 (geometric standard deviation 1.65, typical
// of in-situ floc size spectra, from memory); 70 % of the mass as primaries in
// fresh water, where river particles are mostly disaggregated, and 10 % in
// saline water, on the same 3 PSU scale as DefaultKinetics.
var DefaultSpread = Spread{LogWidth: 0.5, PrimaryFresh: 0.7, PrimarySaline: 0.1, SalinityScale: 3}

// Validate reports the first field outside its allowed range.
func (p Spread) Validate() error {
	switch {
	case !(p.LogWidth >= 0 && p.LogWidth <= 2):
		return rangeError("LogWidth", p.LogWidth, "[0, 2]", "1")
	case !(p.PrimaryFresh >= 0 && p.PrimaryFresh <= 1):
		return rangeError("PrimaryFresh", p.PrimaryFresh, "[0, 1]", "1")
	case !(p.PrimarySaline >= 0 && p.PrimarySaline <= p.PrimaryFresh):
		return rangeError("PrimarySaline", p.PrimarySaline, fmt.Sprintf("[0, PrimaryFresh = %g]", p.PrimaryFresh), "1")
	case !(p.SalinityScale > 0 && p.SalinityScale <= 35):
		return rangeError("SalinityScale", p.SalinityScale, "(0, 35]", "PSU")
	}
	return nil
}

// Population describes the sediment of one class at one place and time.
type Population struct {
	Median          float64 // median diameter of the floc mass distribution, m
	LogWidth        float64 // σ of ln D of that lognormal, 1
	PrimaryFraction float64 // mass fraction left as unflocculated primaries, 1
	Primary         float64 // primary diameter D_p, m (the lognormal is truncated below it)
}

// Population returns the size distribution for flocs of median diameter d
// (m), for example from Equilibrium or Step, at salinity s (PSU).
func (m Model) Population(d, s float64) (Population, error) {
	if err := m.Spread.Validate(); err != nil {
		return Population{}, err
	}
	if err := m.Fractal.checkDiameter("Diameter", d); err != nil {
		return Population{}, err
	}
	if !(s >= 0 && s <= 42) {
		return Population{}, rangeError("Salinity", s, "[0, 42]", "PSU")
	}
	sp := m.Spread
	fp := sp.PrimaryFresh + (sp.PrimarySaline-sp.PrimaryFresh)*smoothStep(s/sp.SalinityScale)
	return Population{Median: d, LogWidth: sp.LogWidth, PrimaryFraction: fp, Primary: m.Fractal.PrimaryDiameter}, nil
}

// MassFraction returns the fraction of the total sediment mass (flocs and
// primaries) held in flocs with diameters in [d1, d2) (m). The lognormal is
// truncated at D_p and renormalised, so the fractions of all floc sizes sum
// to 1 − PrimaryFraction. A zero LogWidth puts all floc mass at Median.
func (p Population) MassFraction(d1, d2 float64) float64 {
	return (1 - p.PrimaryFraction) * p.massFraction(d1, d2)
}

// massFraction is the fraction of floc mass in [d1, d2).
func (p Population) massFraction(d1, d2 float64) float64 {
	d1 = max(d1, p.Primary)
	if !(d2 > d1) {
		return 0
	}
	if p.LogWidth == 0 {
		if p.Median >= d1 && p.Median < d2 {
			return 1
		}
		return 0
	}
	cdf := func(d float64) float64 {
		if math.IsInf(d, 1) {
			return 1
		}
		return 0.5 * math.Erfc(-(math.Log(d)-math.Log(p.Median))/(p.LogWidth*math.Sqrt2))
	}
	c0 := cdf(p.Primary)
	return (cdf(d2) - cdf(d1)) / (1 - c0)
}
