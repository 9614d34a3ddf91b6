package scenario

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/scenario/seen"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/water"
)

// Instrument readings. Each instrument of the scenario is simulated at every
// station, layer and output time from the total IOPs at its wavelength,
// interpolated linearly between the two nearest grid wavelengths (IOP
// spectra are smooth on the scale of a grid step; common practice):
//
//   - transmissometer: package seen's Transmissometer, c_m = a + b minus the
//     scattering collected inside half its full acceptance angle (Boss et
//     al. 2009). The VSF is known only at optics.angles: include angles
//     inside the acceptance cone there, or the forward VSF is extrapolated
//     (flagged FlagForwardExtrapolated) and the reading is close to the
//     true c.
//   - backscatter: package seen's BackscatterSensor, b_b from β at the
//     sensor angle with the χ_p factor of Sullivan et al. (2013), water β
//     and b_b from the Zhang, Hu & He (2009) model at the local salinity
//     and temperature.
//   - turbidity: the particle volume scattering function β_p(90°) at 860 nm,
//     the quantity an ISO 7027 nephelometer responds to. It is not
//     converted to FNU: that needs the optics of a formazin standard, which
//     murk has no sourced description of (see package seen, Turbidimeter).
//
// A sensor whose angle lies outside optics.angles is skipped and named in
// Result.SkippedInstruments.

// InstrumentReading is one simulated reading.
type InstrumentReading struct {
	Value float64   // the reading: c_m (m⁻¹), b_b (m⁻¹) or β_p(90°) (m⁻¹ sr⁻¹)
	True  float64   // the model's own value: c, b_b or β_p(90°) from the VSF
	Flags seen.Flag // the sensor model's flags
}

// instruments returns the instruments that can be simulated and the names
// of those skipped.
func usableInstruments(s spec.Scenario) ([]spec.Instrument, []string) {
	ang := s.Mixture.Optics.Angles
	var ok []spec.Instrument
	var skipped []string
	for _, in := range s.Mixture.Optics.Instruments {
		need := in.Angle
		if in.Kind == spec.Turbidity {
			need = math.Pi / 2
		}
		if in.Kind != spec.Transmissometer && (len(ang) == 0 || need < ang[0]-1e-12 || need > ang[len(ang)-1]+1e-12) {
			skipped = append(skipped, fmt.Sprintf("%s (angle %.0f° outside optics.angles)", in.Name, need*180/math.Pi))
			continue
		}
		ok = append(ok, in)
	}
	return ok, skipped
}

// wavelengthWeights returns the grid index l and weight u so that a value
// at lambda is (1−u)·v[l] + u·v[l+1] (l+1 clamped to the grid).
func wavelengthWeights(wl []float64, lambda float64) (int, float64) {
	n := len(wl)
	if n == 1 || lambda <= wl[0] {
		return 0, 0
	}
	for l := 0; l < n-1; l++ {
		if lambda <= wl[l+1] {
			return l, (lambda - wl[l]) / (wl[l+1] - wl[l])
		}
	}
	return n - 2, 1
}

// readInstruments simulates every instrument at point p from the worker's
// total IOPs, at salinity sal and temperature temp.
func (r *Result) readInstruments(w *worker, p int, sal, temp float64) error {
	na := r.NA()
	for i, in := range r.Instruments {
		lambda := in.Wavelength
		if in.Kind == spec.Turbidity {
			lambda = 860e-9
		}
		l, u := wavelengthWeights(r.Wavelengths, lambda)
		l1 := min(l+1, r.NW()-1)
		a := (1-u)*w.total.A[l] + u*w.total.A[l1]
		b := (1-u)*w.total.B[l] + u*w.total.B[l1]
		bb := (1-u)*w.total.Bb[l] + u*w.total.Bb[l1]
		for j := 0; j < na; j++ {
			w.vsf.Beta[j] = (1-u)*w.total.VSF[l*na+j] + u*w.total.VSF[l1*na+j]
		}
		var rd InstrumentReading
		switch in.Kind {
		case spec.Transmissometer:
			t := seen.Transmissometer{PathLength: in.PathLength, AcceptanceHalfAngle: in.AcceptanceAngle / 2}
			res, err := t.Read(a, b, w.vsf)
			if err != nil {
				return fmt.Errorf("instrument %q: %w", in.Name, err)
			}
			rd = InstrumentReading{Value: res.Attenuation, True: res.TrueAttenuation, Flags: res.Flags}
		default:
			angle := in.Angle
			if in.Kind == spec.Turbidity {
				angle = math.Pi / 2
			}
			sc, err := water.Scatter(lambda, water.Medium{Salinity: sal, TemperatureC: min(max(temp, water.MinTemperatureC), water.MaxTemperatureC)}, 0)
			if err != nil {
				return fmt.Errorf("instrument %q: %w", in.Name, err)
			}
			sensor := seen.BackscatterSensor{Angle: max(angle, math.Pi/2), WaterBeta: sc.VSF(angle), WaterBb: sc.Bb}
			res, err := sensor.Read(w.vsf)
			if err != nil {
				return fmt.Errorf("instrument %q: %w", in.Name, err)
			}
			if in.Kind == spec.Turbidity {
				rd = InstrumentReading{Value: res.ParticleBeta, True: res.ParticleBeta, Flags: res.Flags}
			} else {
				rd = InstrumentReading{Value: res.Bb, True: bb, Flags: res.Flags}
			}
		}
		r.Readings[p*len(r.Instruments)+i] = rd
	}
	return nil
}
