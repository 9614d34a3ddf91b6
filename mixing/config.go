package mixing

import (
	"errors"
	"fmt"
	"math"
)

// Tidal constituents (periods as used in many public harmonic-analysis
// codes; the spring–neap period 1/(1/T_S2 − 1/T_M2) = 14.765 d follows).
const (
	PeriodM2 = 12.4206012 * 3600 // s
	PeriodS2 = 12.0 * 3600       // s
	omegaM2  = 2 * math.Pi / PeriodM2
	omegaS2  = 2 * math.Pi / PeriodS2
	gravity  = 9.81   // m s⁻²
	rhoFresh = 1000.0 // kg m⁻³, reference density of river water
	kappa    = 0.41   // von Kármán constant (common practice)
)

// Config is a complete estuary run. All quantities are SI (m, s, kg) except
// salinity (PSU, practical salinity) and temperature (°C). Build one with
// DefaultConfig and change what differs; Validate reports every problem.
type Config struct {
	Geometry Geometry
	River    River
	Tide     Tide
	Ocean    Ocean
	Sediment []Class // zero or more sediment classes
	Closure  Closure
	Run      RunControl
}

// Geometry is the channel from the mouth (x = 0) to the tidal limit (x = Length).
// Either the exponential form (MouthWidth, WidthConvergence, Depth) or Table is used.
type Geometry struct {
	Length           float64   // m, distance mouth → head, (0, 1e6]
	MouthWidth       float64   // m, width at x = 0, (0, 1e5]
	WidthConvergence float64   // m, e-folding length b of B(x) = B0·exp(−x/b); 0 = prismatic; else [1e2, 1e8]
	Depth            float64   // m, uniform depth below mean sea level, (0, 1000]
	Table            []Section // if non-empty, replaces the three fields above; linear interpolation in x
	Cells            int       // number of finite-volume cells, [4, 5000]
}

// Section is one row of a geometry table.
type Section struct {
	X     float64 // m from the mouth; rows strictly increasing, first 0, last ≥ Length
	Width float64 // m, (0, 1e5]
	Depth float64 // m, (0, 1000]
}

// River is the fresh-water inflow at the head.
type River struct {
	Discharge   float64 // m³ s⁻¹, constant river flow Q_R, [0, 1e6]; ignored when Series is set
	Series      Series  // optional Q_R(t), m³ s⁻¹ against s from the start of the run
	Temperature float64 // °C, [−2, 40]
}

// Tide is the forcing at the mouth. Give either elevation amplitudes (half the
// tidal range) or velocity amplitudes of the section-mean tidal current at the
// mouth, not both for one constituent.
type Tide struct {
	M2Amplitude float64 // m, [0, 10]
	M2Velocity  float64 // m s⁻¹, [0, 5]
	S2Amplitude float64 // m, [0, 10]; sets the spring–neap cycle
	S2Velocity  float64 // m s⁻¹, [0, 5]
}

// Ocean holds the sea-side boundary values.
type Ocean struct {
	Salinity    float64 // PSU, (0, 42]
	Temperature float64 // °C, [−2, 40]
}

// Class is one sediment class. Its settling velocity comes from the Settling
// model passed to New.
type Class struct {
	Name string
	// River supply by rating curve C = RatingA·(Q_R / 1 m³ s⁻¹)^RatingB, kg m⁻³.
	// RatingB = 0 gives a constant concentration RatingA.
	RatingA float64 // kg m⁻³, [0, 100]
	RatingB float64 // –, [−2, 3]
	Ocean   float64 // kg m⁻³, background concentration of sea water, [0, 100]
	// Bed exchange (Partheniades 1965 erosion; deposition continuous or Krone 1962).
	BedInventory       float64 // kg m⁻², initial erodible mass per bed area, [0, 1e6]
	ErosionRate        float64 // kg m⁻² s⁻¹, Partheniades M, [0, 1]
	CriticalErosion    float64 // Pa, τ_ce, (0, 100]
	CriticalDeposition float64 // Pa, τ_cd for Krone's factor (1 − τ_b/τ_cd); 0 = deposit at any stress, [0, 100]
}

// Closure constants. DefaultClosure gives the published defaults.
type Closure struct {
	DragCoefficient   float64 // C_D, –, (0, 0.05]
	MixingCoefficient float64 // a in K = a·C_D·U_T·H, –, (0, 1]
	BackgroundMixing  float64 // K₀ added to K_M and K_S, m² s⁻¹, [0, 1]
	DispersionCoeff   float64 // c in K_H = c·U_T·B (tidal/lateral dispersion), –, [0, 1]
	HalineContraction float64 // β, PSU⁻¹, (0, 0.01]
	InterfaceFriction float64 // c_i, interfacial drag (shear production in the upper layer), –, [0, 0.05]
	MinLayerFraction  float64 // smallest allowed lower-layer fraction of the depth, –, [0.02, 0.45]
	// Entrainment adds entrainment by the residual exchange-flow shear to the
	// tidal mixing between the layers. The zero value is off, the default
	// (doc.go); DefaultTurner gives Turner's (1986) coefficients.
	Entrainment Turner
	// Damping multiplies the tidal part of K_S by f(Ri_b), Ri_b the bulk
	// layer Richardson number of the tidal flow in each cell (doc.go,
	// Vertical exchange). The zero value is no damping; the default is
	// MunkAnderson.
	Damping RichardsonDamping
}

// RunControl controls the time integration.
type RunControl struct {
	Duration        float64   // s, (0, 1e9]
	Output          []float64 // s, snapshot times in [0, Duration], strictly increasing
	Courant         float64   // advective Courant safety number, (0, 0.9]
	MaxStep         float64   // s, longest step allowed, (0, PeriodM2/12]
	InitialSalinity float64   // PSU, uniform initial salinity, [0, 42]
	BottomThreshold float64   // PSU, bottom isohaline defining the intrusion length, (0, 42]
}

// Series is a time series of (Time, Value) pairs, Time in s from the start of
// the run. It must be strictly increasing, finite, cover the whole run and have
// no gap longer than MaxGap (0 means one day).
type Series struct {
	Time   []float64
	Value  []float64
	MaxGap float64 // s
}

// DefaultClosure returns the published closure constants:
//   - C_D = 2.5e-3, the depth-mean quadratic drag of MacCready's scripts for the
//     Geyer & MacCready (2014) parameter space (public codes use 2.5e-3 to 3.1e-3).
//   - a = 0.028 in K_M = K_S = a·C_D·U_T·H (MacCready's basin–strait code;
//     attributed to MacCready 2007 and Ralston et al. 2008, from memory).
//   - K₀ = 1e-5 m² s⁻¹ background mixing (common practice).
//   - c = 0.035 in K_H = c·U_T·B (MacCready 2004, J. Phys. Oceanogr. 34:1296; from memory).
//   - β = 7.7e-4 PSU⁻¹ (MacCready's scripts; Geyer & MacCready 2014).
//   - c_i = 3e-4, interfacial drag at a salt wedge (Sørgard, Martinsen & Aas 1990, JGR 95,
//     report 1.1e-4 to 4.2e-4).
//   - lower layer at least 0.1 of the depth (numerical choice, see doc.go).
//   - tidal K_S damped by the Munk & Anderson (1948) scalar function of the
//     bulk layer Richardson number of the tidal flow (see doc.go, Vertical exchange).
//   - no entrainment beyond tidal mixing (see doc.go, departures).
func DefaultClosure() Closure {
	return Closure{
		DragCoefficient:   2.5e-3,
		MixingCoefficient: 0.028,
		BackgroundMixing:  1e-5,
		DispersionCoeff:   0.035,
		HalineContraction: 7.7e-4,
		InterfaceFriction: 3e-4,
		MinLayerFraction:  0.1,
		Damping:           MunkAnderson(),
	}
}

// DefaultConfig returns a valid partially mixed estuary: 80 km long, 10 m deep,
// 2 km wide at the mouth converging with a 40 km e-folding length, 200 m³ s⁻¹ of
// river water, a 1.5 m M2 and 0.5 m S2 tide, ocean salinity 32, no sediment,
// 30 days run on 100 cells. It is an illustration, not a particular estuary.
func DefaultConfig() Config {
	return Config{
		Geometry: Geometry{Length: 80e3, MouthWidth: 2000, WidthConvergence: 40e3, Depth: 10, Cells: 100},
		River:    River{Discharge: 200, Temperature: 12},
		Tide:     Tide{M2Amplitude: 1.5, S2Amplitude: 0.5},
		Ocean:    Ocean{Salinity: 32, Temperature: 11},
		Closure:  DefaultClosure(),
		Run: RunControl{
			Duration:        30 * 86400,
			Courant:         0.9,
			MaxStep:         1800,
			BottomThreshold: 2,
		},
	}
}

// ValidationError lists every problem found in a Config.
type ValidationError struct {
	Problems []string
}

func (e *ValidationError) Error() string {
	if len(e.Problems) == 1 {
		return "mixing: " + e.Problems[0]
	}
	s := fmt.Sprintf("mixing: %d problems:", len(e.Problems))
	for _, p := range e.Problems {
		s += "\n  " + p
	}
	return s
}

type checker struct{ problems []string }

func (c *checker) addf(format string, args ...any) {
	c.problems = append(c.problems, fmt.Sprintf(format, args...))
}

// rng checks lo <(=) v <(=) hi. openLo/openHi select open ends.
func (c *checker) rng(field string, v, lo, hi float64, openLo, openHi bool, unit string) {
	bad := math.IsNaN(v) || math.IsInf(v, 0) || (openLo && v <= lo) || (!openLo && v < lo) ||
		(openHi && v >= hi) || (!openHi && v > hi)
	if !bad {
		return
	}
	l, r := "[", "]"
	if openLo {
		l = "("
	}
	if openHi {
		r = ")"
	}
	u := ""
	if unit != "" {
		u = " " + unit
	}
	c.addf("%s: %g%s is outside %s%g, %g%s%s", field, v, u, l, lo, hi, r, u)
}

// Validate returns nil or a *ValidationError listing every problem, each naming
// the field path, the value and the allowed range with its unit.
func (cfg *Config) Validate() error {
	var c checker
	g := cfg.Geometry
	c.rng("geometry.length", g.Length, 0, 1e6, true, false, "m")
	if g.Cells < 4 || g.Cells > 5000 {
		c.addf("geometry.cells: %d is outside [4, 5000]", g.Cells)
	}
	if len(g.Table) == 0 {
		c.rng("geometry.mouth_width", g.MouthWidth, 0, 1e5, true, false, "m")
		c.rng("geometry.depth", g.Depth, 0, 1000, true, false, "m")
		if g.WidthConvergence != 0 {
			c.rng("geometry.width_convergence", g.WidthConvergence, 1e2, 1e8, false, false, "m")
		}
	} else {
		for i, s := range g.Table {
			c.rng(fmt.Sprintf("geometry.table[%d].width", i), s.Width, 0, 1e5, true, false, "m")
			c.rng(fmt.Sprintf("geometry.table[%d].depth", i), s.Depth, 0, 1000, true, false, "m")
			if i == 0 && s.X != 0 {
				c.addf("geometry.table[0].x: %g m must be 0 m (the mouth)", s.X)
			}
			if i > 0 && !(s.X > g.Table[i-1].X) {
				c.addf("geometry.table[%d].x: %g m must exceed the previous row's %g m", i, s.X, g.Table[i-1].X)
			}
		}
		if last := g.Table[len(g.Table)-1].X; last < g.Length {
			c.addf("geometry.table: last x %g m is short of geometry.length %g m", last, g.Length)
		}
	}
	r := cfg.River
	if len(r.Series.Time) == 0 && len(r.Series.Value) == 0 {
		c.rng("river.discharge", r.Discharge, 0, 1e6, false, false, "m³/s")
	} else {
		r.Series.check(&c, "river.series", 0, 1e6, "m³/s", cfg.Run.Duration)
	}
	c.rng("river.temperature", r.Temperature, -2, 40, false, false, "°C")
	t := cfg.Tide
	c.rng("tide.m2_amplitude", t.M2Amplitude, 0, 10, false, false, "m")
	c.rng("tide.m2_velocity", t.M2Velocity, 0, 5, false, false, "m/s")
	c.rng("tide.s2_amplitude", t.S2Amplitude, 0, 10, false, false, "m")
	c.rng("tide.s2_velocity", t.S2Velocity, 0, 5, false, false, "m/s")
	if t.M2Amplitude > 0 && t.M2Velocity > 0 {
		c.addf("tide: give m2_amplitude (%g m) or m2_velocity (%g m/s), not both", t.M2Amplitude, t.M2Velocity)
	}
	if t.S2Amplitude > 0 && t.S2Velocity > 0 {
		c.addf("tide: give s2_amplitude (%g m) or s2_velocity (%g m/s), not both", t.S2Amplitude, t.S2Velocity)
	}
	noTide := t.M2Amplitude == 0 && t.M2Velocity == 0 && t.S2Amplitude == 0 && t.S2Velocity == 0
	if noTide && len(r.Series.Time) == 0 && r.Discharge == 0 {
		c.addf("river.discharge: 0 m³/s with no tide leaves nothing to move the water; need > 0 m³/s or a tide")
	}
	if noTide && len(r.Series.Time) > 0 {
		for i, v := range r.Series.Value {
			if v == 0 {
				c.addf("river.series.value[%d]: 0 m³/s with no tide; need > 0 m³/s or a tide", i)
				break
			}
		}
	}
	c.rng("ocean.salinity", cfg.Ocean.Salinity, 0, 42, true, false, "PSU")
	c.rng("ocean.temperature", cfg.Ocean.Temperature, -2, 40, false, false, "°C")
	for i, k := range cfg.Sediment {
		p := fmt.Sprintf("sediment[%d]", i)
		c.rng(p+".rating_a", k.RatingA, 0, 100, false, false, "kg/m³")
		c.rng(p+".rating_b", k.RatingB, -2, 3, false, false, "")
		c.rng(p+".ocean", k.Ocean, 0, 100, false, false, "kg/m³")
		c.rng(p+".bed_inventory", k.BedInventory, 0, 1e6, false, false, "kg/m²")
		c.rng(p+".erosion_rate", k.ErosionRate, 0, 1, false, false, "kg/m²/s")
		c.rng(p+".critical_erosion", k.CriticalErosion, 0, 100, true, false, "Pa")
		c.rng(p+".critical_deposition", k.CriticalDeposition, 0, 100, false, false, "Pa")
	}
	k := cfg.Closure
	c.rng("closure.drag_coefficient", k.DragCoefficient, 0, 0.05, true, false, "")
	c.rng("closure.mixing_coefficient", k.MixingCoefficient, 0, 1, true, false, "")
	c.rng("closure.background_mixing", k.BackgroundMixing, 0, 1, false, false, "m²/s")
	c.rng("closure.dispersion_coeff", k.DispersionCoeff, 0, 1, false, false, "")
	c.rng("closure.haline_contraction", k.HalineContraction, 0, 0.01, true, false, "1/PSU")
	c.rng("closure.interface_friction", k.InterfaceFriction, 0, 0.05, false, false, "")
	c.rng("closure.min_layer_fraction", k.MinLayerFraction, 0.02, 0.45, false, false, "")
	c.rng("closure.entrainment.a", k.Entrainment.A, 0, 0.2, false, false, "")
	c.rng("closure.entrainment.b", k.Entrainment.B, 0, 10, false, false, "")
	c.rng("closure.entrainment.c", k.Entrainment.C, 0, 100, false, false, "")
	c.rng("closure.damping.alpha", k.Damping.Alpha, 0, 100, false, false, "")
	c.rng("closure.damping.exponent", k.Damping.Exponent, 0, 5, false, false, "")
	if k.Entrainment.A > 0 && k.Entrainment.B == 0 {
		c.addf("closure.entrainment.b: 0 with a = %g gives entrainment at any Richardson number; need b in (0, 10]", k.Entrainment.A)
	}
	u := cfg.Run
	c.rng("run.duration", u.Duration, 0, 1e9, true, false, "s")
	c.rng("run.courant", u.Courant, 0, 0.9, true, false, "")
	c.rng("run.max_step", u.MaxStep, 0, PeriodM2/12, true, false, "s")
	c.rng("run.initial_salinity", u.InitialSalinity, 0, 42, false, false, "PSU")
	c.rng("run.bottom_threshold", u.BottomThreshold, 0, 42, true, false, "PSU")
	for i, t := range u.Output {
		c.rng(fmt.Sprintf("run.output[%d]", i), t, 0, u.Duration, false, false, "s")
		if i > 0 && !(t > u.Output[i-1]) {
			c.addf("run.output[%d]: %g s must exceed the previous %g s", i, t, u.Output[i-1])
		}
	}
	if len(c.problems) == 0 {
		return nil
	}
	return &ValidationError{Problems: c.problems}
}

func (s *Series) check(c *checker, field string, lo, hi float64, unit string, duration float64) {
	if len(s.Time) != len(s.Value) {
		c.addf("%s: %d times but %d values", field, len(s.Time), len(s.Value))
		return
	}
	if len(s.Time) < 1 {
		c.addf("%s: empty", field)
		return
	}
	gap := s.MaxGap
	if gap == 0 {
		gap = 86400
	}
	for i, t := range s.Time {
		if math.IsNaN(t) || math.IsInf(t, 0) {
			c.addf("%s.time[%d]: %g s is not finite", field, i, t)
			continue
		}
		if i > 0 {
			d := t - s.Time[i-1]
			if !(d > 0) {
				c.addf("%s.time[%d]: %g s must exceed the previous %g s", field, i, t, s.Time[i-1])
			} else if d > gap {
				c.addf("%s.time[%d]: gap of %g s after %g s exceeds max_gap %g s", field, i, d, s.Time[i-1], gap)
			}
		}
		c.rng(fmt.Sprintf("%s.value[%d]", field, i), s.Value[i], lo, hi, false, false, unit)
	}
	if s.Time[0] > 0 {
		c.addf("%s.time[0]: %g s starts after the run start 0 s", field, s.Time[0])
	}
	if last := s.Time[len(s.Time)-1]; last < duration {
		c.addf("%s.time[%d]: %g s ends before run.duration %g s", field, len(s.Time)-1, last, duration)
	}
}

// at interpolates the series linearly; it assumes a validated series.
func (s *Series) at(t float64) float64 {
	n := len(s.Time)
	if t <= s.Time[0] {
		return s.Value[0]
	}
	if t >= s.Time[n-1] {
		return s.Value[n-1]
	}
	lo, hi := 0, n-1
	for hi-lo > 1 {
		m := (lo + hi) / 2
		if s.Time[m] <= t {
			lo = m
		} else {
			hi = m
		}
	}
	f := (t - s.Time[lo]) / (s.Time[hi] - s.Time[lo])
	return s.Value[lo] + f*(s.Value[hi]-s.Value[lo])
}

var errNoSettling = errors.New("mixing: sediment classes given but Settling is nil")
