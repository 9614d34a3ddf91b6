package products

import (
	"fmt"
	"io"
	"math"
	"slices"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/plot"
)

// maxSpectraLines bounds the stations drawn in a spectra figure: more
// lines than the plot's palette has colours cannot be told apart.
const maxSpectraLines = 5

// sectionFigure is one figure along the channel: a section quantity at
// every model cell (tidal mean per layer over a band from the tidal minimum
// to maximum of the upper layer), also drawn as a tidal envelope at a
// station when envelope is true.
type sectionFigure struct {
	base     string
	q        plot.Quantity
	f        scenario.PointValue
	log      bool
	envelope bool
}

// Figures returns the run's figures, each keyed by its file base name:
//   - sections along the channel at every model cell (tidal mean of each
//     layer, with the tidal range of the upper layer shaded) of salinity,
//     suspended sediment, backscattering, attenuation, the particulate
//     backscattering ratio, the b_bp spectral slope, the floc size (when a
//     population flocculates) and the layer structure (depth of the
//     interface and of the bed);
//   - spectra of b_b, c and R_rs at up to five stations from river to sea,
//     always including the station nearest the turbidity maximum (tidal
//     means, upper layer);
//   - tidal envelopes of salinity, suspended sediment and backscattering at
//     the station nearest the turbidity maximum.
//
// A figure has a logarithmic Y axis when its quantity can span decades
// (concentration, b_b, c, floc size) and its values do span at least one
// decade; otherwise the axis is linear, which reads more easily.
func Figures(r *scenario.Result) []NamedFigure {
	var figs []NamedFigure
	wref := r.Points.Band[r.Points.Ref]
	lam := fmt.Sprintf("%.0f nm", r.Wavelengths[wref]*1e9)
	nc, nw := r.NC(), r.NW()
	vals := []sectionFigure{
		{"section_salinity", plot.Quantity{Name: "Practical salinity", Unit: "1"}, func(ps *scenario.Points, p int) float64 { return ps.Salinity[p] }, false, true},
		{"section_ssc", plot.Quantity{Name: "Suspended sediment", Unit: "g m-3"}, func(ps *scenario.Points, p int) float64 { return ps.SSC(p, nc) * 1e3 }, true, true},
		{"section_bb", plot.Quantity{Name: "Backscattering b_b at " + lam, Unit: "m-1"}, func(ps *scenario.Points, p int) float64 { return ps.AtRef(ps.TotalBb, p) }, true, true},
		{"section_c", plot.Quantity{Name: "Beam attenuation c at " + lam, Unit: "m-1"}, func(ps *scenario.Points, p int) float64 {
			return ps.AtRef(ps.TotalA, p) + ps.AtRef(ps.TotalB, p)
		}, true, false},
		{"section_bb_ratio", plot.Quantity{Name: "Particle backscattering ratio b_bp/b_p at " + lam, Unit: "1"}, func(ps *scenario.Points, p int) float64 {
			return ratio(ps.AtRef(ps.Bbp, p), ps.AtRef(ps.Bp, p))
		}, false, false},
		{"section_bbp_slope", plot.Quantity{Name: "Spectral slope γ of b_bp (b_bp ~ λ^-γ)", Unit: "1"}, func(ps *scenario.Points, p int) float64 { return ps.ParticleBbSlope[p] }, false, false},
	}
	for i, pop := range r.Scenario.Mixture.Populations {
		if hasFlocs(r, i) {
			vals = append(vals, sectionFigure{"section_floc_" + pop.Name, plot.Quantity{Name: "Median floc size of " + pop.Name, Unit: "µm"},
				func(ps *scenario.Points, p int) float64 { return ps.FlocDiameter[p*r.NP()+i] * 1e6 }, true, false})
		}
	}
	sec := &r.Section
	if n := len(sec.Distance); n >= 2 {
		// Cell centres plus the mouth and the head, where the end cells'
		// values hold (the package's convention between the last centre
		// and either end), so that the axis spans the whole channel.
		km := make([]float64, 0, n+2)
		km = append(km, 0)
		for _, x := range sec.Distance {
			km = append(km, x/1e3)
		}
		km = append(km, (sec.Distance[n-1]+(sec.Distance[n-1]-sec.Distance[n-2])/2)/1e3)
		ends := func(v []float64) []float64 { return append(append([]float64{v[0]}, v...), v[n-1]) }
		for _, v := range vals {
			lines := make([]plot.Line, mixing.Layers)
			var band *plot.Band
			for l := range lines {
				mean, lo, hi := r.TidalStats(sec, l, v.f)
				lines[l] = plot.Line{Label: layerName(l) + " layer, tidal mean", Y: ends(mean)}
				if l == 0 {
					band = &plot.Band{Label: "upper layer, tidal range", Lo: ends(lo), Hi: ends(hi)}
				}
			}
			title := v.q.Name + " along the channel"
			if v.base == "section_bbp_slope" {
				title = fmt.Sprintf("b_bp spectral slope along the channel (differences below %.1f are within fit scatter)", float64(slopeChange))
			}
			f := sectionPlot(r, title, km, v.q, lines, band)
			f.LogY = v.log && decades(band.Lo, band.Hi, lines[1].Y)
			figs = append(figs, NamedFigure{v.base, f})
		}
		// The layer structure, as heights above the bed: the water
		// surface (total depth) and the interface (lower-layer thickness).
		surface, _, _ := r.TidalStats(sec, 0, func(ps *scenario.Points, p int) float64 { return ps.Thickness[p] + ps.Thickness[p+1] })
		iface, lo, hi := r.TidalStats(sec, 1, func(ps *scenario.Points, p int) float64 { return ps.Thickness[p] })
		f := sectionPlot(r, "Layer structure along the channel", km, plot.Quantity{Name: "Height above the bed", Unit: "m"},
			[]plot.Line{{Label: "water surface, tidal mean", Y: ends(surface)}, {Label: "interface between the layers, tidal mean", Y: ends(iface)}},
			&plot.Band{Label: "interface, tidal range", Lo: ends(lo), Hi: ends(hi)})
		figs = append(figs, NamedFigure{"section_layers", f})
	}
	// Spectra at stations.
	spec := spectraStations(r)
	if nw >= 2 && len(spec) > 0 {
		nm := make([]float64, nw)
		for i, l := range r.Wavelengths {
			nm[i] = l * 1e9
		}
		nt := len(r.Times)
		for _, sp := range []struct {
			base string
			q    plot.Quantity
			f    func(t, j, w int) float64
		}{
			{"spectra_bb", plot.Quantity{Name: "Backscattering b_b", Unit: "m-1"}, func(t, j, w int) float64 { return r.TotalBb[r.Point(t, j, 0)*nw+w] }},
			{"spectra_c", plot.Quantity{Name: "Beam attenuation c", Unit: "m-1"}, func(t, j, w int) float64 {
				p := r.Point(t, j, 0)
				return r.TotalA[p*nw+w] + r.TotalB[p*nw+w]
			}},
			{"spectra_rrs", plot.Quantity{Name: "Remote-sensing reflectance R_rs", Unit: "sr-1"}, func(t, j, w int) float64 { return r.Rrs[(t*len(r.Stations)+j)*nw+w] }},
		} {
			var lines []plot.Line
			var all []float64
			for _, st := range spec {
				ln := plot.Line{Label: st.label, Y: make([]float64, nw)}
				for w := range r.Wavelengths {
					for t := 0; t < nt; t++ {
						ln.Y[w] += sp.f(t, st.j, w) / float64(nt)
					}
				}
				all = append(all, ln.Y...)
				lines = append(lines, ln)
			}
			f := plot.Spectra(sp.q.Name+", upper layer, tidal mean", nm, sp.q, lines)
			f.LogY = sp.base != "spectra_rrs" && decades(all)
			figs = append(figs, NamedFigure{sp.base, f})
		}
	}
	// Tidal envelopes at the station nearest the turbidity maximum.
	if nt := len(r.Times); nt >= 2 && len(r.Stations) > 0 {
		j := r.NearestStation(r.Summary.ETMPosition)
		th := make([]float64, nt)
		for t := range th {
			th[t] = (r.Times[t] - r.Times[0]) / 3600
		}
		for _, v := range vals {
			if !v.envelope {
				continue
			}
			lines := make([]plot.Line, mixing.Layers)
			band := plot.Band{Label: "between the layers", Lo: make([]float64, nt), Hi: make([]float64, nt)}
			for l := range lines {
				lines[l] = plot.Line{Label: layerName(l) + " layer", Y: make([]float64, nt)}
				for t := 0; t < nt; t++ {
					lines[l].Y[t] = v.f(&r.Points, r.Point(t, j, l))
				}
			}
			for t := 0; t < nt; t++ {
				band.Lo[t], band.Hi[t] = min(lines[0].Y[t], lines[1].Y[t]), max(lines[0].Y[t], lines[1].Y[t])
			}
			base := "envelope_" + v.base[len("section_"):]
			f := plot.Envelope(fmt.Sprintf("Through the tide at %.1f km, near the turbidity maximum", r.Stations[j]/1e3), th, v.q, lines, band)
			f.X = plot.Quantity{Name: fmt.Sprintf("Time since the first output, %.1f days after the start", r.Times[0]/86400), Unit: "h"}
			f.LogY = v.log && decades(band.Lo, band.Hi)
			figs = append(figs, NamedFigure{base, f})
		}
	}
	return figs
}

// sectionPlot is a section figure with the distance axis stating which
// end is the sea.
func sectionPlot(r *scenario.Result, title string, km []float64, q plot.Quantity, lines []plot.Line, band *plot.Band) plot.Figure {
	f := plot.Section(title, km, q, lines, band)
	f.X = plot.Quantity{Name: "Distance landward from the mouth (sea at 0)", Unit: "km"}
	return f
}

// decades reports whether the values are all positive and span at least
// one decade, the case for a logarithmic axis.
func decades(vs ...[]float64) bool {
	lo, hi := math.Inf(1), 0.0
	for _, v := range vs {
		for _, x := range v {
			if !(x > 0) {
				return false
			}
			lo, hi = min(lo, x), max(hi, x)
		}
	}
	return hi >= 10*lo
}

// spectraStation is one station drawn in the spectra figures.
type spectraStation struct {
	j     int
	label string
}

// spectraStations picks at most maxSpectraLines stations, river first:
// the two ends, the station nearest the turbidity maximum (the middle of
// the channel without sediment) and the stations nearest halfway between
// it and either end.
func spectraStations(r *scenario.Result) []spectraStation {
	order := r.StationOrder()
	n := len(order)
	if n == 0 {
		return nil
	}
	x0, x1 := r.Stations[order[0]], r.Stations[order[n-1]]
	xe, etm := (x0+x1)/2, -1
	if len(r.Classes) > 0 {
		etm = r.NearestStation(r.Summary.ETMPosition)
		xe = r.Stations[etm]
	}
	pick := order
	if n > maxSpectraLines {
		pick = nil
		for _, x := range []float64{x0, (x0 + xe) / 2, xe, (xe + x1) / 2, x1} {
			if j := r.NearestStation(x); !slices.Contains(pick, j) {
				pick = append(pick, j)
			}
		}
	}
	var out []spectraStation
	for k := len(pick) - 1; k >= 0; k-- {
		j := pick[k]
		label := fmt.Sprintf("%.1f km", r.Stations[j]/1e3)
		switch {
		case k == len(pick)-1 && n > 1:
			label += " (river end)"
		case k == 0 && n > 1:
			label += " (sea end)"
		case j == etm:
			label += " (turbidity max.)"
		}
		out = append(out, spectraStation{j, label})
	}
	return out
}

// NamedFigure is a figure with its file base name.
type NamedFigure struct {
	Base   string
	Figure plot.Figure
}

// Plots is the product of figures in the scenario's plot formats (SVG and
// PNG by default), every figure checked before any is drawn.
type Plots struct{}

// Name is "plots".
func (Plots) Name() string { return "plots" }

// Files lists one file per figure and format.
func (Plots) Files(r *scenario.Result) ([]File, error) {
	formats := r.Scenario.Outputs.PlotFormats
	if len(formats) == 0 {
		formats = []string{"svg", "png"}
	}
	var fs []File
	for _, nf := range Figures(r) {
		f := nf.Figure
		if err := f.Check(); err != nil {
			return nil, fmt.Errorf("figure %s: %w", nf.Base, err)
		}
		for _, fm := range formats {
			fs = append(fs, atomic(nf.Base+"."+fm, func(w io.Writer) error {
				if err := f.WriteTo(w, plot.Format(fm)); err != nil {
					return fmt.Errorf("figure %s: %w", nf.Base, err)
				}
				return nil
			}))
		}
	}
	return fs, nil
}
