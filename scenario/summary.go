package scenario

import (
	"math"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/spec"
)

// Caution is printed with every summary.
const Caution = `Cautions: these predictions are estimates for planning and for understanding the
optics of the estuary; they are not a substitute for calibrated measurement.
Turbidity limits and plume compliance are set by local regulations and
licensed practice, not by this model.`

// StationSummary holds tidal means (over the output times) at one station.
// Optical values are of the upper layer at the reference wavelength; the
// concentration is the depth mean.
type StationSummary struct {
	Distance        float64 // m from the mouth
	Salinity        float64 // upper layer, PSU
	BottomSalinity  float64 // lower layer, PSU
	Concentration   float64 // depth-mean suspended sediment, kg m⁻³
	ParticleBb      float64 // b_bp, m⁻¹
	ParticleBbRatio float64 // b_bp/b_p, 1
	BbSlope         float64 // γ of b_bp, 1
	Attenuation     float64 // total c, m⁻¹
	FlocDiameter    float64 // median floc size (upper layer) of the first floc population, m; 0 if none
	Dominant        string  // the population with the largest share of b_bp
	DominantShare   float64 // its share, 1
	// Shares of b_bp and of b_p by particle type, 1: mineral grains
	// (kind mineral), flocs, organic particles (organic and phytoplankton).
	MineralShare, FlocShare, OrganicShare float64
	MineralScatterShare                   float64 // share of b_p from mineral grains, 1
	Secchi                                float64 // m
	ForelUle                              int     // most frequent Forel-Ule class over the outputs (0: undefined)
	Kd                                    float64 // K_d at the reference wavelength, m⁻¹
}

// Summary is the digest of a run that the text summary prints.
type Summary struct {
	Name                string
	Regime              mixing.Regime
	IntrusionLength     float64 // mean over outputs, m (bottom 2 PSU isohaline)
	IntrusionMin        float64 // m
	IntrusionMax        float64 // m
	MeanStratification  float64 // mean over outputs, 1
	ETMPosition         float64 // tidally averaged turbidity maximum, m from the mouth
	ETMPeak             float64 // depth-mean concentration there, kg m⁻³
	ETMBottomSalinity   float64 // mean lower-layer salinity there, PSU
	ETMFlocDiameter     float64 // lower-layer median floc size at the station nearest the ETM, m (0: no flocs)
	RiverFlocDiameter   float64 // lower-layer median floc size at the most landward station, m
	ReferenceWavelength float64 // m
	// BbpPeak is the largest tidal-mean upper-layer b_bp at the reference
	// wavelength along the section (every model cell), m⁻¹, at
	// BbpPeakPosition, m from the mouth.
	BbpPeak, BbpPeakPosition float64
	Stations                 []StationSummary
	PigmentFromParticles     bool // chlorophyll was not added as pigment (phytoplankton are particles)
}

// refWavelength returns the index of the grid wavelength nearest 550 nm,
// the usual reference of ocean-colour backscattering spectra (common
// practice).
func refWavelength(wl []float64) int {
	best := 0
	for i, l := range wl {
		if math.Abs(l-550e-9) < math.Abs(wl[best]-550e-9) {
			best = i
		}
	}
	return best
}

func kindOf(c Component) spec.PopulationKind {
	if c.Population == nil {
		return ""
	}
	return c.Population.Kind
}

func summarise(r *Result) Summary {
	s := Summary{Name: r.Scenario.Name}
	est := r.Estuary
	nt := len(r.Times)
	if nt == 0 {
		return s
	}
	s.IntrusionMin = math.Inf(1)
	for i := range est.Snapshots {
		d := est.Snapshots[i].Diagnostics
		s.IntrusionLength += d.IntrusionLength / float64(nt)
		s.MeanStratification += d.MeanStratification / float64(nt)
		s.IntrusionMin = min(s.IntrusionMin, d.IntrusionLength)
		s.IntrusionMax = max(s.IntrusionMax, d.IntrusionLength)
	}
	s.Regime = est.Snapshots[nt-1].Diagnostics.Regime

	// Tidally averaged turbidity maximum on the model grid.
	nx := len(est.X)
	mean := make([]float64, nx)
	sb := make([]float64, nx)
	for i := range est.Snapshots {
		sn := &est.Snapshots[i]
		for c := 0; c < nx; c++ {
			h := sn.Thickness[0][c] + sn.Thickness[1][c]
			tot := 0.0
			for l := 0; l < mixing.Layers; l++ {
				for k := range sn.Concentration[l] {
					tot += sn.Concentration[l][k][c] * sn.Thickness[l][c]
				}
			}
			if h > 0 {
				mean[c] += tot / h / float64(nt)
			}
			sb[c] += sn.Salinity[1][c] / float64(nt)
		}
	}
	if len(r.Classes) > 0 {
		best := 0
		for c := range mean {
			if mean[c] > mean[best] {
				best = c
			}
		}
		s.ETMPosition, s.ETMPeak, s.ETMBottomSalinity = est.X[best], mean[best], sb[best]
	}

	wref := refWavelength(r.Wavelengths)
	s.ReferenceWavelength = r.Wavelengths[wref]
	if sec := &r.Section; len(sec.Distance) > 0 {
		bbp, _, _ := r.TidalStats(sec, 0, func(ps *Points, p int) float64 { return ps.AtRef(ps.Bbp, p) })
		for i, v := range bbp {
			if v > s.BbpPeak {
				s.BbpPeak, s.BbpPeakPosition = v, sec.Distance[i]
			}
		}
	}
	s.PigmentFromParticles = !pigmentApplies(r.Scenario.Mixture) && (r.Scenario.Mixture.Water.Chlorophyll.River > 0 || r.Scenario.Mixture.Water.Chlorophyll.Ocean > 0)
	firstFloc := -1
	for i, p := range r.Scenario.Mixture.Populations {
		if p.Kind == spec.KindFloc {
			firstFloc = i
			break
		}
	}
	ns := len(r.Stations)
	np := r.NP()
	for j := range r.Stations {
		st := StationSummary{Distance: r.Stations[j]}
		share := make([]float64, r.NK())
		var bpSum, bpGrain float64
		fuCount := make([]int, 22)
		var bbpSum float64
		for t := 0; t < nt; t++ {
			p0, p1 := r.Point(t, j, 0), r.Point(t, j, 1)
			q := t*ns + j
			f := 1 / float64(nt)
			st.Salinity += r.Salinity[p0] * f
			st.BottomSalinity += r.Salinity[p1] * f
			h := r.Thickness[p0] + r.Thickness[p1]
			for c := range r.Classes {
				if h > 0 {
					st.Concentration += (r.Concentration[p0*r.NC()+c]*r.Thickness[p0] + r.Concentration[p1*r.NC()+c]*r.Thickness[p1]) / h * f
				}
			}
			bbp := r.Sum(iop.Backscattering, p0, wref, Particles)
			bp := r.Sum(iop.Scattering, p0, wref, Particles)
			st.ParticleBb += bbp * f
			if bp > 0 {
				st.ParticleBbRatio += bbp / bp * f
			}
			st.BbSlope += r.ParticleBbSlope[p0] * f
			st.Attenuation += r.Sum(iop.Attenuation, p0, wref, nil) * f
			st.Secchi += r.Secchi[q] * f
			st.Kd += r.Kd[q*r.NW()+wref] * f
			if fu := r.ForelUle[q]; fu >= 0 && fu < len(fuCount) {
				fuCount[fu]++
			}
			if firstFloc >= 0 {
				st.FlocDiameter += math.Log(r.FlocDiameter[p0*np+firstFloc]) * f
			}
			for k := range r.Components {
				if r.Components[k].Kind == iop.Particles {
					v := r.Value(iop.Backscattering, p0, k, wref)
					share[k] += v
					bbpSum += v
					b := r.Value(iop.Scattering, p0, k, wref)
					bpSum += b
					if kindOf(r.Components[k]) == spec.KindMineral {
						bpGrain += b
					}
				}
			}
		}
		if firstFloc >= 0 {
			st.FlocDiameter = math.Exp(st.FlocDiameter)
		}
		for fu := 1; fu < len(fuCount); fu++ {
			if fuCount[fu] > fuCount[st.ForelUle] {
				st.ForelUle = fu
			}
		}
		if bbpSum > 0 {
			for k, c := range r.Components {
				if c.Kind != iop.Particles {
					continue
				}
				if share[k]/bbpSum > st.DominantShare {
					st.DominantShare, st.Dominant = share[k]/bbpSum, c.Name
				}
				switch kindOf(c) {
				case spec.KindMineral:
					st.MineralShare += share[k] / bbpSum
				case spec.KindFloc:
					st.FlocShare += share[k] / bbpSum
				default:
					st.OrganicShare += share[k] / bbpSum
				}
			}
		}
		if bpSum > 0 {
			st.MineralScatterShare = bpGrain / bpSum
		}
		s.Stations = append(s.Stations, st)
	}
	if firstFloc >= 0 && ns > 0 {
		near, head := r.NearestStation(s.ETMPosition), 0
		for j, x := range r.Stations {
			if x > r.Stations[head] {
				head = j
			}
		}
		geo := func(j int) float64 {
			v := 0.0
			for t := 0; t < nt; t++ {
				v += math.Log(r.FlocDiameter[r.Point(t, j, 1)*np+firstFloc]) / float64(nt)
			}
			return math.Exp(v)
		}
		s.ETMFlocDiameter, s.RiverFlocDiameter = geo(near), geo(head)
	}
	return s
}
