package scenario

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/spec"
)

// Bed defaults used where neither a sediment class nor the closures section
// sets a bed constant. Package mixing has no defaults of its own for these,
// so they are chosen here, each inside the published range for estuarine mud.
const (
	// DefaultErosionRate is the Partheniades (1965) rate constant M,
	// kg m⁻² s⁻¹: estuarine muds span about 1e-5 … 1e-3 (Winterwerp & van
	// Kesteren 2004, Introduction to the Physics of Cohesive Sediment in
	// the Marine Environment, Elsevier, ch. 10; from memory).
	DefaultErosionRate = 1e-4
	// DefaultCriticalErosion is τ_ce, Pa: 0.1–0.5 Pa for soft estuarine
	// mud (common practice).
	DefaultCriticalErosion = 0.2
	// DefaultCriticalDeposition is τ_cd, Pa: 0 deposits at any stress
	// (continuous deposition; Sanford & Halka 1993, Mar. Geol. 114:37,
	// argue that erosion and deposition act together).
	DefaultCriticalDeposition = 0
	// DefaultBedInventory is the erodible mud per bed area at the start,
	// kg m⁻² (a few centimetres of soft mud; common practice).
	DefaultBedInventory = 10
	// BottomThreshold is the bottom isohaline (PSU) that defines the salt
	// intrusion length: 2 PSU, the usual choice of the estuarine
	// literature (e.g. Monismith et al. 2002, J. Phys. Oceanogr. 32:3003,
	// use X2; 2 PSU at the bed; common practice).
	BottomThreshold = 2
)

// EstuaryConfig converts the estuary part of a validated scenario into the
// configuration of the estuary model. Run time starts at the start of the
// spin-up; outputs are every Run.OutputInterval from the end of the spin-up
// to the end of the run, both included. The model starts fresh (salinity 0
// everywhere): salt enters with the exchange flow during the spin-up,
// which is faster than flushing an initially salt estuary with river water.
//
// Departures from the scenario: the model's tidal constituents have their
// standard periods (mixing.PeriodM2, mixing.PeriodS2); a scenario period
// different from them by more than 1 % is an error.
func EstuaryConfig(e spec.Estuary) (mixing.Config, error) {
	cfg := mixing.DefaultConfig()
	g := e.Geometry
	cfg.Geometry = mixing.Geometry{Length: g.Length, Cells: g.Cells}
	switch g.Shape {
	case spec.ShapeTable:
		for _, s := range g.Table {
			cfg.Geometry.Table = append(cfg.Geometry.Table, mixing.Section{X: s.Distance, Width: s.Width, Depth: s.Depth})
		}
	default:
		cfg.Geometry.MouthWidth = g.MouthWidth
		cfg.Geometry.Depth = g.Depth
		if !math.IsInf(g.ConvergenceLength, 1) {
			cfg.Geometry.WidthConvergence = g.ConvergenceLength
		}
	}

	r := e.River
	cfg.River = mixing.River{Temperature: r.Temperature}
	if r.Discharge.IsConstant() {
		if len(r.Discharge.Values) > 0 {
			cfg.River.Discharge = r.Discharge.Values[0]
		}
	} else {
		cfg.River.Series = mixing.Series{
			Time:   append([]float64(nil), r.Discharge.Times...),
			Value:  append([]float64(nil), r.Discharge.Values...),
			MaxGap: r.Discharge.MaxGap,
		}
		cfg.River.Discharge = r.Discharge.Values[0]
	}

	cfg.Tide = mixing.Tide{}
	for _, c := range []struct {
		name      string
		con       spec.Constituent
		amp, vel  *float64
		reference float64
	}{
		{"tide.m2", e.Tide.M2, &cfg.Tide.M2Amplitude, &cfg.Tide.M2Velocity, mixing.PeriodM2},
		{"tide.s2", e.Tide.S2, &cfg.Tide.S2Amplitude, &cfg.Tide.S2Velocity, mixing.PeriodS2},
	} {
		if !c.con.Present() {
			continue
		}
		if c.con.Period > 0 && math.Abs(c.con.Period/c.reference-1) > 0.01 {
			return mixing.Config{}, fmt.Errorf("scenario: %s.period %.0f s: the estuary model uses the standard period %.0f s (allowed: within 1 %%)", c.name, c.con.Period, c.reference)
		}
		switch c.con.Form {
		case spec.TideRange:
			*c.amp = c.con.Amplitude
		case spec.TideVelocity:
			*c.vel = c.con.Velocity
		}
	}

	cfg.Ocean = mixing.Ocean{Salinity: e.Ocean.Salinity, Temperature: e.Ocean.Temperature}

	cl := e.Closures
	def := mixing.DefaultClosure()
	cfg.Closure = def
	cfg.Closure.DragCoefficient = cl.DragCoefficient.Or(def.DragCoefficient)
	cfg.Closure.MixingCoefficient = cl.MixingCoefficient.Or(def.MixingCoefficient)
	cfg.Closure.BackgroundMixing = cl.BackgroundMixing.Or(def.BackgroundMixing)
	cfg.Closure.DispersionCoeff = cl.DispersionCoefficient.Or(def.DispersionCoeff)
	cfg.Closure.InterfaceFriction = cl.InterfacialFriction.Or(def.InterfaceFriction)

	cfg.Sediment = nil
	for k, c := range e.Classes {
		bed := c.Bed.Merge(cl.Bed)
		mc := mixing.Class{
			Name:               c.Name,
			BedInventory:       bed.BedInventory.Or(DefaultBedInventory),
			ErosionRate:        bed.ErosionRate.Or(DefaultErosionRate),
			CriticalErosion:    bed.CriticalStressErosion.Or(DefaultCriticalErosion),
			CriticalDeposition: bed.CriticalStressDeposition.Or(DefaultCriticalDeposition),
		}
		if k < len(r.Supply) {
			s := r.Supply[k]
			switch s.Kind {
			case spec.SupplyRating:
				// C = A·(Q/Q_ref)^B = [A·Q_ref^−B]·(Q / 1 m³ s⁻¹)^B.
				qref := s.QRef
				if qref <= 0 {
					qref = 1
				}
				mc.RatingA = s.A * math.Pow(qref, -s.B)
				mc.RatingB = s.B
			default:
				mc.RatingA = s.Concentration
			}
		}
		if k < len(e.Ocean.Background) {
			mc.Ocean = e.Ocean.Background[k]
		}
		cfg.Sediment = append(cfg.Sediment, mc)
	}

	run := e.Run
	cfg.Run.Duration = run.End()
	cfg.Run.InitialSalinity = 0
	cfg.Run.BottomThreshold = BottomThreshold
	cfg.Run.Output = OutputTimes(run)
	if err := cfg.Validate(); err != nil {
		return mixing.Config{}, err
	}
	return cfg, nil
}

// OutputTimes returns the output times of a run, s since the start of the
// spin-up: SpinUp, SpinUp + OutputInterval, … up to and including the end
// (the last interval may be shorter so that the end is always included).
func OutputTimes(r spec.Run) []float64 {
	end := r.End()
	var out []float64
	if r.OutputInterval <= 0 {
		return []float64{end}
	}
	n := int(math.Floor(r.Duration/r.OutputInterval + 1e-9))
	for i := 0; i <= n; i++ {
		out = append(out, r.SpinUp+float64(i)*r.OutputInterval)
	}
	if last := out[len(out)-1]; end-last > 1e-6*r.OutputInterval {
		out = append(out, end)
	} else {
		out[len(out)-1] = end
	}
	return out
}
