package sensing

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/scenario/netcdf/cf"
	"github.com/murk-optics/murk/scenario/seen"
	"github.com/murk-optics/murk/scenario/water"
)

// Transmissometer is a beam transmissometer: source and detector PathLength
// apart, detector accepting light within AcceptanceHalfAngle of the beam.
// It reports c_m = a + b minus the scattering collected inside the cone
// (seen.Transmissometer); the VSF is known only at the point's angles, so
// without angles inside the cone the forward VSF is extrapolated (flagged
// seen.FlagForwardExtrapolated) and the reading is close to the true c.
type Transmissometer struct {
	Name                string
	Wavelength          float64 // m
	PathLength          float64 // m
	AcceptanceHalfAngle float64 // rad
}

// Describe says the reading is beam attenuation in m⁻¹.
func (t Transmissometer) Describe() Description {
	return Description{Name: t.Name, Kind: "transmissometer", Quantity: "beam attenuation c", Unit: "m-1",
		StandardName: cf.StdBeamAttenuation, Wavelength: t.Wavelength}
}

// Angles: none beyond the point's own (the cone uses what is there).
func (Transmissometer) Angles() []float64 { return nil }

// Read simulates the transmissometer at p.
func (t Transmissometer) Read(p *Point) (Reading, error) {
	a, b, _, vsf := p.interpolate(t.Wavelength)
	res, err := seen.Transmissometer{PathLength: t.PathLength, AcceptanceHalfAngle: t.AcceptanceHalfAngle}.Read(a, b, vsf)
	if err != nil {
		return Reading{}, wrap(t.Name, err)
	}
	return Reading{Value: res.Attenuation, True: res.TrueAttenuation, Flags: res.Flags}, nil
}

// Backscatter is a single-angle backscattering meter at centroid Angle
// (seen.BackscatterSensor, χ_p of Sullivan et al. 2013), with the water β
// and b_b of the Zhang, Hu & He (2009) model at the point's salinity and
// temperature. Its model value is the total b_b of the IOPs.
type Backscatter struct {
	Name       string
	Wavelength float64 // m
	Angle      float64 // rad, in [90°, 170°]
}

// Describe says the reading is backscattering in m⁻¹.
func (s Backscatter) Describe() Description {
	return Description{Name: s.Name, Kind: "backscatter", Quantity: "backscattering b_b", Unit: "m-1",
		StandardName: cf.StdBackscattering, Wavelength: s.Wavelength}
}

// Angles is the sensor's centroid angle.
func (s Backscatter) Angles() []float64 { return []float64{s.Angle} }

// Read simulates the sensor at p.
func (s Backscatter) Read(p *Point) (Reading, error) {
	_, _, bb, vsf := p.interpolate(s.Wavelength)
	res, err := readBeta(p, vsf, s.Wavelength, s.Angle)
	if err != nil {
		return Reading{}, wrap(s.Name, err)
	}
	return Reading{Value: res.Bb, True: bb, Flags: res.Flags}, nil
}

// readBeta reads the total VSF at angle with the water of point p removed.
func readBeta(p *Point, vsf seen.VSF, lambda, angle float64) (seen.BackscatterReading, error) {
	sc, err := water.Scatter(lambda, water.Medium{Salinity: p.Salinity, TemperatureC: min(max(p.Temperature, water.MinTemperatureC), water.MaxTemperatureC)}, 0)
	if err != nil {
		return seen.BackscatterReading{}, err
	}
	sensor := seen.BackscatterSensor{Angle: max(angle, math.Pi/2), WaterBeta: sc.VSF(angle), WaterBb: sc.Bb}
	return sensor.Read(vsf)
}

// Turbidimeter is a side-scatter turbidimeter in the ISO 7027 geometry
// (860 nm source, detector at 90°). Its signal is the particle β(90°);
// with a Calibration it is reported in FNU, without one as β_p(90°) in
// m⁻¹ sr⁻¹ (no invented default: see the package doc).
type Turbidimeter struct {
	Name        string
	Calibration *Calibration // nil: report β_p(90°)
}

// Calibration turns the ISO 7027 signal into FNU: FNU = Factor · β_p(90°).
// The factor is the user's, from the instrument's own formazin
// calibration or a site relation; murk has none of its own.
type Calibration struct {
	// Factor in FNU per m⁻¹ sr⁻¹ of particle β(90°) at 860 nm, > 0.
	Factor float64
}

// Describe says what the reading is: FNU with a calibration, β_p(90°)
// without.
func (t Turbidimeter) Describe() Description {
	d := Description{Name: t.Name, Kind: "turbidity", Quantity: "particle VSF at 90 deg", Unit: "m-1 sr-1", Wavelength: seen.ISOWavelength}
	if t.Calibration != nil {
		d.Quantity, d.Unit = "turbidity (ISO 7027 geometry, user calibration)", "FNU"
	}
	return d
}

// Angles is the detection angle, 90°.
func (Turbidimeter) Angles() []float64 { return []float64{seen.ISODetectionAngle} }

// Read simulates the turbidimeter at p.
func (t Turbidimeter) Read(p *Point) (Reading, error) {
	_, _, _, vsf := p.interpolate(seen.ISOWavelength)
	res, err := readBeta(p, vsf, seen.ISOWavelength, seen.ISODetectionAngle)
	if err != nil {
		return Reading{}, wrap(t.Name, err)
	}
	v := res.ParticleBeta
	if t.Calibration != nil {
		v *= t.Calibration.Factor
		if v > seen.NephelometricMax {
			res.Flags |= seen.FlagAboveNephelometricRange
		}
	}
	return Reading{Value: v, True: v, Flags: res.Flags}, nil
}

// RadiometerBand is an above-water radiometer band: remote-sensing
// reflectance weighted by a Gaussian spectral response centred at
// Wavelength with full width at half maximum Width, normalised over the
// point's wavelength grid (trapezoidal rule). It reads only at the surface
// (Point.Rrs set); elsewhere the reading is 0 with seen.FlagNotSurface.
type RadiometerBand struct {
	Name       string
	Wavelength float64 // band centre, m
	Width      float64 // full width at half maximum, m, > 0
}

// Describe says the reading is R_rs in sr⁻¹.
func (r RadiometerBand) Describe() Description {
	return Description{Name: r.Name, Kind: "radiometer", Quantity: "remote-sensing reflectance R_rs in band", Unit: "sr-1", Wavelength: r.Wavelength}
}

// Angles: none.
func (RadiometerBand) Angles() []float64 { return nil }

// Read returns the band-weighted R_rs at p.
func (r RadiometerBand) Read(p *Point) (Reading, error) {
	if p.Rrs == nil {
		return Reading{Flags: seen.FlagNotSurface}, nil
	}
	if !(r.Width > 0) {
		return Reading{}, wrap(r.Name, fmt.Errorf("band width %g m, want > 0", r.Width))
	}
	sigma := r.Width / (2 * math.Sqrt(2*math.Ln2))
	wl := p.Wavelengths
	var num, den float64
	for i := 0; i+1 < len(wl); i++ {
		h := wl[i+1] - wl[i]
		s0 := math.Exp(-0.5 * math.Pow((wl[i]-r.Wavelength)/sigma, 2))
		s1 := math.Exp(-0.5 * math.Pow((wl[i+1]-r.Wavelength)/sigma, 2))
		num += h / 2 * (s0*p.Rrs[i] + s1*p.Rrs[i+1])
		den += h / 2 * (s0 + s1)
	}
	if len(wl) == 1 {
		num, den = p.Rrs[0], 1
	}
	if !(den > 0) {
		return Reading{}, wrap(r.Name, fmt.Errorf("band at %.0f nm (FWHM %.0f nm) has no response on the wavelength grid %.0f-%.0f nm",
			r.Wavelength*1e9, r.Width*1e9, wl[0]*1e9, wl[len(wl)-1]*1e9))
	}
	v := num / den
	return Reading{Value: v, True: v}, nil
}

// Digitised is an instrument behind a sensor front end: its reading is
// digitised by Electronics (noiseless: the deviate is 0, so readings are
// reproducible), reported as the value recovered from the counts, with
// the saturation, under-range and detection flags added.
type Digitised struct {
	Instrument
	Electronics seen.Electronics
}

// Read reads the inner instrument and digitises its value.
func (d Digitised) Read(p *Point) (Reading, error) {
	r, err := d.Instrument.Read(p)
	if err != nil {
		return r, err
	}
	dg, err := d.Electronics.Read(r.Value, 0)
	if err != nil {
		return r, wrap(d.Describe().Name, err)
	}
	r.Value, r.Counts, r.HasCounts = dg.Value, dg.Counts, true
	r.Flags |= dg.Flags
	return r, nil
}
