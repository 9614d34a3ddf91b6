package products

import (
	"fmt"
	"io"
	"math"
	"strings"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/seen"
)

// WriteSummary prints the text summary of a run.
func WriteSummary(r *scenario.Result, w io.Writer) error {
	s := r.Summary
	var b strings.Builder
	name := s.Name
	if name == "" {
		name = "murk scenario"
	}
	fmt.Fprintf(&b, "%s\n%s\n\n", name, strings.Repeat("=", len([]rune(name))))
	t0, t1 := r.Times[0], r.Times[len(r.Times)-1]
	fmt.Fprintf(&b, "Run: %d output times from %.2f to %.2f days after the start (tidal means below), %d stations, %d wavelengths %.0f–%.0f nm.\n\n",
		len(r.Times), t0/86400, t1/86400, len(r.Stations), r.NW(), r.Wavelengths[0]*1e9, r.Wavelengths[r.NW()-1]*1e9)

	fmt.Fprintf(&b, "Estuary: %s (freshwater Froude number %.3g, mixing number %.3g; Geyer & MacCready 2014 map).\n",
		s.Regime.Class, s.Regime.Froude, s.Regime.Mixing)
	fmt.Fprintf(&b, "Salt intrusion (bottom %g PSU): %.1f km from the mouth on average (%.1f–%.1f km through the tide); mean stratification Δs/s̄ = %.2f.\n\n",
		float64(scenario.BottomThreshold), s.IntrusionLength/1e3, s.IntrusionMin/1e3, s.IntrusionMax/1e3, s.MeanStratification)

	if len(r.Classes) > 0 {
		fmt.Fprintf(&b, "Turbidity maximum: %.1f km from the mouth, peak depth-mean suspended sediment %.3g g/m3, bottom salinity there %.1f PSU",
			s.ETMPosition/1e3, s.ETMPeak*1e3, s.ETMBottomSalinity)
		if s.IntrusionLength > 0 {
			d := s.IntrusionLength - s.ETMPosition
			if d >= 0 {
				fmt.Fprintf(&b, " (%.1f km seaward of the salt limit).\n", d/1e3)
			} else {
				fmt.Fprintf(&b, " (%.1f km landward of the salt limit).\n", -d/1e3)
			}
		} else {
			b.WriteString(".\n")
		}
		if s.ETMFlocDiameter > 0 {
			fmt.Fprintf(&b, "Flocs near the bed: median %.0f µm near the turbidity maximum against %.0f µm at the landward end.\n",
				s.ETMFlocDiameter*1e6, s.RiverFlocDiameter*1e6)
		}
		b.WriteString("\n")
	}

	fmt.Fprintf(&b, "Along the channel, river to sea (tidal means, upper layer, λ = %.0f nm; c total attenuation; Kd, Secchi depth\n", s.ReferenceWavelength*1e9)
	fmt.Fprintf(&b, "and Forel-Ule colour class FU for the upper layer seen from above, sun %.0f° from the zenith):\n", r.SolarZenith*180/math.Pi)
	fmt.Fprintf(&b, "  %6s %5s %5s %8s %8s %5s %6s %6s %6s %6s %6s %3s  %s\n", "km", "S", "S_bed", "SSC g/m3", "b_bp 1/m", "γ_bbp", "bbp/bp", "c 1/m", "Kd 1/m", "floc", "Secchi", "FU", "main backscatterer")
	order := make([]int, len(s.Stations))
	for i := range order {
		order[i] = i
	}
	// river (landward, large distance) first
	for i := 1; i < len(order); i++ {
		for j := i; j > 0 && s.Stations[order[j]].Distance > s.Stations[order[j-1]].Distance; j-- {
			order[j], order[j-1] = order[j-1], order[j]
		}
	}
	if len(order) > maxSummaryRows {
		// Every k-th station, keeping both ends.
		var sub []int
		for i := 0; i < len(order); i++ {
			if i%((len(order)+maxSummaryRows-2)/(maxSummaryRows-1)) == 0 || i == len(order)-1 {
				sub = append(sub, order[i])
			}
		}
		order = sub
	}
	for _, j := range order {
		st := s.Stations[j]
		floc := "–"
		if st.FlocDiameter > 0 {
			floc = fmt.Sprintf("%.0fµm", st.FlocDiameter*1e6)
		}
		fu := "–"
		if st.ForelUle > 0 {
			fu = fmt.Sprint(st.ForelUle)
		}
		fmt.Fprintf(&b, "  %6.1f %5.1f %5.1f %8.3g %8.3g %5.2f %6.4f %6.3g %6.3g %6s %5.2fm %3s  %s (%.0f %%)\n",
			st.Distance/1e3, st.Salinity, st.BottomSalinity, st.Concentration*1e3, st.ParticleBb, st.BbSlope,
			st.ParticleBbRatio, st.Attenuation, st.Kd, floc, st.Secchi, fu, st.Dominant, 100*st.DominantShare)
	}
	b.WriteString("\n")
	b.WriteString(interpretation(r))
	if len(r.Instruments) > 0 {
		b.WriteString(instrumentLines(r))
	}
	if s.PigmentFromParticles {
		b.WriteString("\nNote: chlorophyll is carried by the phytoplankton population's own absorption, so it is not added again as dissolved pigment.\n")
	}
	b.WriteString("\n")
	b.WriteString(scenario.Caution)
	b.WriteString("\n")
	_, err := io.WriteString(w, b.String())
	return err
}

// instrumentLines reports each simulated sensor's tidal-mean upper-layer
// reading at the mouth, the station nearest the turbidity maximum and the
// river end, with the flags raised anywhere.
func instrumentLines(r *scenario.Result) string {
	var b strings.Builder
	b.WriteString("\nSimulated instruments (upper layer, tidal means; sea / turbidity maximum / river):\n")
	order := r.StationOrder()
	if len(order) == 0 {
		return ""
	}
	mouth, head := order[0], order[len(order)-1]
	etm := r.NearestStation(r.Summary.ETMPosition)
	ni := len(r.Instruments)
	for i, in := range r.Instruments {
		mean := func(j int) (v, t float64) {
			for ti := range r.Times {
				rd := r.Readings[r.Point(ti, j, 0)*ni+i]
				v += rd.Value / float64(len(r.Times))
				t += rd.True / float64(len(r.Times))
			}
			return v, t
		}
		var flags seen.Flag
		for p := 0; p*ni+i < len(r.Readings); p++ {
			flags |= r.Readings[p*ni+i].Flags
		}
		v0, t0 := mean(mouth)
		v1, t1 := mean(etm)
		v2, t2 := mean(head)
		d := in.Describe()
		fmt.Fprintf(&b, "  %-12s %s: %.3g / %.3g / %.3g %s (model value %.3g / %.3g / %.3g)",
			d.Name, d.Quantity, v0, v1, v2, d.Unit, t0, t1, t2)
		if flags != 0 {
			fmt.Fprintf(&b, "; flags: %s", flags)
		}
		b.WriteString("\n")
	}
	b.WriteString("  The turbidity sensor is reported as the particle β(90°) at 860 nm, the signal an ISO 7027 nephelometer measures; converting it to FNU needs the optics of a formazin standard.\n")
	return b.String()
}

// maxSummaryRows bounds the station table of the text summary (the CSV
// tables hold every station).
const maxSummaryRows = 12

// slopeChange is the least change of γ_bbp the summary calls a change:
// 0.1 is about the scatter of γ_bbp fitted to field spectra of similar
// waters (common practice; fits over 400–900 nm are steadier than that).
const slopeChange = 0.1

// saltLimitReach is how near, as a fraction of the salt intrusion length,
// the summary calls a turbidity maximum "near the limit of salt": a
// quarter, the band in which turbidity maxima are usually found around the
// landward limit of salt (Schubel 1968, Chesapeake Sci. 9:131; from
// memory; the same limit as TestExamples).
const saltLimitReach = 0.25

// ratioChange is the least relative difference of b_bp/b_p the summary
// explains: 10 %, about the uncertainty of measured ratios (common
// practice; Twardowski et al. 2001, J. Geophys. Res. 106:14129, resolve
// ratios to a few 10⁻³ at values near 0.01).
const ratioChange = 0.1

// interpretation turns the station table into sentences: each states a
// computed direction of change and the physical reason the model holds for
// it, so that it is only printed when the numbers show it.
func interpretation(r *scenario.Result) string {
	s := r.Summary
	if len(s.Stations) < 2 {
		return ""
	}
	var head, mouth, etm scenario.StationSummary
	head, mouth = s.Stations[0], s.Stations[0]
	etm = s.Stations[0]
	for _, st := range s.Stations {
		if st.Distance > head.Distance {
			head = st
		}
		if st.Distance < mouth.Distance {
			mouth = st
		}
		if math.Abs(st.Distance-s.ETMPosition) < math.Abs(etm.Distance-s.ETMPosition) {
			etm = st
		}
	}
	var b strings.Builder
	b.WriteString("What the numbers say:\n")
	fmt.Fprintf(&b, "- Backscattering b_bp goes from %.3g 1/m at the river end (%.0f km) to %.3g 1/m at the mouth; along the section (every model cell) its largest value is %.3g 1/m at %.1f km.\n",
		head.ParticleBb, head.Distance/1e3, mouth.ParticleBb, s.BbpPeak, s.BbpPeakPosition/1e3)
	fmt.Fprintf(&b, "- Its spectral slope γ goes from %.2f (river) through %.2f (turbidity maximum) to %.2f (sea).", head.BbSlope, etm.BbSlope, mouth.BbSlope)
	gLo, gHi := head.BbSlope, head.BbSlope
	dLo, dHi := math.Inf(1), 0.0
	for _, st := range s.Stations {
		gLo, gHi = min(gLo, st.BbSlope), max(gHi, st.BbSlope)
		if st.FlocDiameter > 0 {
			dLo, dHi = min(dLo, st.FlocDiameter), max(dHi, st.FlocDiameter)
		}
	}
	switch d := etm.BbSlope - head.BbSlope; {
	case gHi-gLo < slopeChange:
		fmt.Fprintf(&b, " It hardly changes (%.2f–%.2f over the stations, within the %.1f that separates fitted slopes):", gLo, gHi, float64(slopeChange))
		switch {
		case head.Dominant != mouth.Dominant || dHi > 2*dLo:
			b.WriteString(" the b_bp spectra of the particles here are about equally flat, so")
			if head.Dominant != mouth.Dominant {
				fmt.Fprintf(&b, " the change of the main backscatterer (%s at the river end, %s at sea)", head.Dominant, mouth.Dominant)
				if dHi > 2*dLo {
					b.WriteString(" and")
				}
			}
			if dHi > 2*dLo {
				fmt.Fprintf(&b, " the change of floc size (%.0f–%.0f µm in the upper layer)", dLo*1e6, dHi*1e6)
			}
			b.WriteString(" do not show in γ")
			rLo, rHi := math.Inf(1), 0.0
			for _, st := range s.Stations {
				rLo, rHi = min(rLo, st.ParticleBbRatio), max(rHi, st.ParticleBbRatio)
			}
			if rHi > (1+ratioChange)*rLo {
				b.WriteString("; the backscattering ratio below does respond to them")
			}
			b.WriteString(".\n")
		default:
			b.WriteString(" the particles that dominate b_bp keep their size distribution along the channel.\n")
		}
	case d < 0:
		b.WriteString(" A flatter spectrum (smaller γ) means larger particles: flocs formed at the salt front.\n")
	default:
		b.WriteString(" A steeper spectrum (larger γ) means relatively more small particles.\n")
	}
	fmt.Fprintf(&b, "- The backscattering ratio b_bp/b_p goes from %.4f (river) through %.4f (turbidity maximum) to %.4f (sea).\n",
		head.ParticleBbRatio, etm.ParticleBbRatio, mouth.ParticleBbRatio)
	for _, x := range []struct {
		where string
		st    scenario.StationSummary
	}{{"river", head}, {"turbidity maximum", etm}, {"sea", mouth}} {
		fmt.Fprintf(&b, "  %s: mineral grains %.0f %% of b_p and %.0f %% of b_bp; flocs %.0f %% of b_bp; organic particles %.0f %% of b_bp.\n",
			x.where, 100*x.st.MineralScatterShare, 100*x.st.MineralShare, 100*x.st.FlocShare, 100*x.st.OrganicShare)
	}
	hi, lo := s.Stations[0], s.Stations[0]
	for _, st := range s.Stations {
		if st.MineralScatterShare > hi.MineralScatterShare {
			hi = st
		}
		if st.MineralScatterShare < lo.MineralScatterShare {
			lo = st
		}
	}
	low, big := s.Stations[0], s.Stations[0]
	for _, st := range s.Stations {
		if st.ParticleBbRatio < low.ParticleBbRatio {
			low = st
		}
		if st.FlocDiameter > big.FlocDiameter {
			big = st
		}
	}
	if big.FlocDiameter > 0 && low.Distance == big.Distance && head.ParticleBbRatio > (1+ratioChange)*low.ParticleBbRatio {
		fmt.Fprintf(&b, "  The ratio is lowest at %.0f km, where flocs are largest (%.0f µm in the upper layer against %.0f µm at the river end): large porous aggregates send most of their light forward, while disaggregated mud (mostly loose mineral primaries in fresh water) backscatters like mineral grains.\n",
			low.Distance/1e3, big.FlocDiameter*1e6, head.FlocDiameter*1e6)
	}
	if hi.ParticleBbRatio > (1+ratioChange)*lo.ParticleBbRatio && hi.MineralScatterShare > lo.MineralScatterShare {
		fmt.Fprintf(&b, "  The ratio is higher where dense, high-index mineral grains carry the scattering (%.4f at %.0f km) than where porous flocs and soft organic particles do (%.4f at %.0f km): those scatter more of their light forward.\n",
			hi.ParticleBbRatio, hi.Distance/1e3, lo.ParticleBbRatio, lo.Distance/1e3)
	}
	if len(r.Classes) > 0 {
		fmt.Fprintf(&b, "- Why the turbidity maximum sits at %.0f km: near-bed water flows landward with the salt and river water seaward above it;", s.ETMPosition/1e3)
		b.WriteString(" sediment settling out of the upper layer is carried back up-estuary by the bottom flow and collects where that flow weakens.")
		if d := s.IntrusionLength - s.ETMPosition; math.Abs(d) <= saltLimitReach*s.IntrusionLength {
			fmt.Fprintf(&b, " That is near the limit of salt (%.0f km).", s.IntrusionLength/1e3)
		} else if d > 0 {
			fmt.Fprintf(&b, " Here that is %.0f km seaward of the limit of salt (%.0f km), where the bottom water still has %.1f PSU.", d/1e3, s.IntrusionLength/1e3, s.ETMBottomSalinity)
		} else {
			fmt.Fprintf(&b, " Here that is %.0f km landward of the limit of salt (%.0f km).", -d/1e3, s.IntrusionLength/1e3)
		}
		if s.ETMFlocDiameter > 0 && s.ETMFlocDiameter > s.RiverFlocDiameter {
			fmt.Fprintf(&b, " Flocs grow in salt water (%.0f µm there against %.0f µm in fresh water), settle faster and are trapped more strongly.", s.ETMFlocDiameter*1e6, s.RiverFlocDiameter*1e6)
		}
		b.WriteString("\n")
	}
	return b.String()
}

// Summary is the product of the text summary, summary.txt.
type Summary struct{}

// Name is "summary".
func (Summary) Name() string { return "summary" }

// Files lists summary.txt.
func (Summary) Files(r *scenario.Result) ([]File, error) {
	return []File{atomic("summary.txt", func(w io.Writer) error { return WriteSummary(r, w) })}, nil
}
