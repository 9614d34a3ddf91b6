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

// BinNumbers fills dst[i] with the number concentration (m⁻³) of flocs with
// diameters in [edges[i], edges[i+1]) (m) when the sediment of this
// population has total dry mass concentration c (kg m⁻³) and the flocs have
// structure f: the floc part (1 − PrimaryFraction)·c is spread lognormally
// by mass, and a floc of diameter D holds M(D) = ρ_s·(π/6)·D_p^(3−n_f)·D^n_f,
// so N_i = ∫_bin (dm/d ln D)/M(D) d ln D, evaluated exactly (the Gaussian in
// ln D times exp(−n_f ln D) is a shifted Gaussian). With bin-averaged
// kernels (package mie/kernel, floc/optics.Evaluator) the bulk IOPs are
// Σ_i N_i·⟨C⟩_i. The unflocculated primaries, PrimaryFraction·c, are not
// included: they form a separate population of solid spheres. Mass outside
// the edges is dropped. len(dst) must be len(edges) − 1; edges must
// increase. A zero LogWidth puts all flocs in the bin holding Median.
func (p Population) BinNumbers(f Fractal, c float64, edges, dst []float64) error {
	if err := f.Validate(); err != nil {
		return err
	}
	if !(c >= 0 && c <= 500) {
		return rangeError("Concentration", c, "[0, 500]", "kg m-3")
	}
	if len(edges) < 2 || len(dst) != len(edges)-1 {
		return fmt.Errorf("floc: BinNumbers needs len(dst) = len(edges) − 1 ≥ 1 (got %d and %d)", len(dst), len(edges))
	}
	for i := 1; i < len(edges); i++ {
		if !(edges[i] > edges[i-1] && edges[i-1] > 0) {
			return fmt.Errorf("floc: bin edges must be positive and increasing (edges[%d] = %g m, edges[%d] = %g m)", i-1, edges[i-1], i, edges[i])
		}
	}
	mass := (1 - p.PrimaryFraction) * c
	nf := f.Dimension
	k := f.PrimaryDensity * math.Pi / 6 * math.Pow(f.PrimaryDiameter, 3-nf)
	mu, s := math.Log(p.Median), p.LogWidth
	if s == 0 {
		for i := range dst {
			dst[i] = 0
			if p.Median >= edges[i] && p.Median < edges[i+1] {
				dst[i] = mass / (k * math.Pow(p.Median, nf))
			}
		}
		return nil
	}
	// Normalisation of the truncated lognormal (mass below D_p removed).
	norm := 1 - 0.5*math.Erfc(-(math.Log(p.Primary)-mu)/(s*math.Sqrt2))
	// ∫ φ((x−μ)/s)/s·e^(−n_f x) dx over [a, b] = e^(−n_f μ + n_f²s²/2)·[Φ] with
	// the Gaussian centred at μ − n_f s².
	shift := mu - nf*s*s
	scale := math.Exp(-nf*mu + nf*nf*s*s/2)
	cdf := func(d float64) float64 {
		return 0.5 * math.Erfc(-(math.Log(d)-shift)/(s*math.Sqrt2))
	}
	for i := range dst {
		lo, hi := max(edges[i], p.Primary), edges[i+1]
		if hi <= lo {
			dst[i] = 0
			continue
		}
		dst[i] = mass / norm / k * scale * (cdf(hi) - cdf(lo))
	}
	return nil
}
