package scenario

import (
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"sort"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/plot"
	"github.com/murk-optics/murk/scenario/safefile"
)

// stationOrder returns the station indices sorted by distance, keeping
// the first of equal distances (a section needs strictly increasing x).
func (r *Result) stationOrder() []int {
	idx := make([]int, len(r.Stations))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return r.Stations[idx[a]] < r.Stations[idx[b]] })
	out := idx[:0]
	for _, j := range idx {
		if len(out) == 0 || r.Stations[j] > r.Stations[out[len(out)-1]] {
			out = append(out, j)
		}
	}
	return out
}

// pointValue is one scalar of a point, for figures.
type pointValue func(p int) float64

func (r *Result) sscAt(p int) float64 {
	s := 0.0
	for c := 0; c < r.NC(); c++ {
		s += r.Concentration[p*r.NC()+c]
	}
	return s * 1e3 // g m⁻³
}

// Figures returns the run's figures: sections along the channel (tidal
// mean per layer over a band from the tidal minimum to maximum of the upper
// layer) of salinity, suspended sediment, backscattering, attenuation,
// backscattering ratio and b_bp spectral slope; spectra of b_b, c and R_rs
// at every station (tidal means, upper layer); and tidal envelopes of
// suspended sediment and backscattering at the station nearest the
// turbidity maximum. Each is keyed by its file base name.
func (r *Result) Figures() []NamedFigure {
	var figs []NamedFigure
	order := r.stationOrder()
	wref := refWavelength(r.Wavelengths)
	lam := fmt.Sprintf("%.0f nm", r.Wavelengths[wref]*1e9)
	nt := len(r.Times)
	bbp := func(p int) float64 { return r.Sum(iop.Backscattering, p, wref, Particles) }
	vals := []struct {
		base string
		q    plot.Quantity
		f    pointValue
		log  bool
	}{
		{"section_salinity", plot.Quantity{Name: "Practical salinity", Unit: "1"}, func(p int) float64 { return r.Salinity[p] }, false},
		{"section_ssc", plot.Quantity{Name: "Suspended sediment", Unit: "g m-3"}, r.sscAt, true},
		{"section_bb", plot.Quantity{Name: "b_b at " + lam, Unit: "m-1"}, func(p int) float64 { return r.Sum(iop.Backscattering, p, wref, nil) }, true},
		{"section_c", plot.Quantity{Name: "c at " + lam, Unit: "m-1"}, func(p int) float64 { return r.Sum(iop.Attenuation, p, wref, nil) }, true},
		{"section_bb_ratio", plot.Quantity{Name: "b_bp/b_p at " + lam, Unit: "1"}, func(p int) float64 {
			return ratio(bbp(p), r.Sum(iop.Scattering, p, wref, Particles))
		}, false},
		{"section_bbp_slope", plot.Quantity{Name: "Slope of b_bp", Unit: "1"}, func(p int) float64 { return r.ParticleBbSlope[p] }, false},
	}
	if len(order) >= 2 {
		km := make([]float64, len(order))
		for i, j := range order {
			km[i] = r.Stations[j] / 1e3
		}
		for _, v := range vals {
			lines := make([]plot.Line, mixing.Layers)
			band := &plot.Band{Label: "tidal range, upper layer", Lo: make([]float64, len(order)), Hi: make([]float64, len(order))}
			ok := true
			for l := 0; l < mixing.Layers; l++ {
				lines[l] = plot.Line{Label: layerName(l) + " layer, tidal mean", Y: make([]float64, len(order))}
				for i, j := range order {
					lo, hi, sum := math.Inf(1), math.Inf(-1), 0.0
					for t := 0; t < nt; t++ {
						x := v.f(r.Point(t, j, l))
						sum += x
						lo, hi = min(lo, x), max(hi, x)
					}
					lines[l].Y[i] = sum / float64(nt)
					if l == 0 {
						band.Lo[i], band.Hi[i] = lo, hi
					}
					if v.log && lo <= 0 {
						ok = false
					}
				}
			}
			f := plot.Section(r.title(v.q.Name), km, v.q, lines, band)
			f.LogY = v.log && ok
			figs = append(figs, NamedFigure{v.base, f})
		}
	}
	// Spectra at stations.
	if r.NW() >= 2 {
		nm := make([]float64, r.NW())
		for i, l := range r.Wavelengths {
			nm[i] = l * 1e9
		}
		for _, sp := range []struct {
			base string
			q    plot.Quantity
			f    func(t, j, w int) float64
		}{
			{"spectra_bb", plot.Quantity{Name: "b_b", Unit: "m-1"}, func(t, j, w int) float64 { return r.Sum(iop.Backscattering, r.Point(t, j, 0), w, nil) }},
			{"spectra_c", plot.Quantity{Name: "c", Unit: "m-1"}, func(t, j, w int) float64 { return r.Sum(iop.Attenuation, r.Point(t, j, 0), w, nil) }},
			{"spectra_rrs", plot.Quantity{Name: "R_rs", Unit: "sr-1"}, func(t, j, w int) float64 { return r.Rrs[(t*len(r.Stations)+j)*r.NW()+w] }},
		} {
			var lines []plot.Line
			pos := true
			for _, j := range order {
				ln := plot.Line{Label: fmt.Sprintf("%.1f km", r.Stations[j]/1e3), Y: make([]float64, r.NW())}
				for w := range r.Wavelengths {
					for t := 0; t < nt; t++ {
						ln.Y[w] += sp.f(t, j, w) / float64(nt)
					}
					if ln.Y[w] <= 0 {
						pos = false
					}
				}
				lines = append(lines, ln)
			}
			f := plot.Spectra(r.title(sp.q.Name+", upper layer, tidal mean"), nm, sp.q, lines)
			f.LogY = pos && sp.base != "spectra_rrs"
			figs = append(figs, NamedFigure{sp.base, f})
		}
	}
	// Tidal envelopes at the station nearest the turbidity maximum.
	if nt >= 2 && len(r.Stations) > 0 {
		j := 0
		for i, x := range r.Stations {
			if math.Abs(x-r.Summary.ETMPosition) < math.Abs(r.Stations[j]-r.Summary.ETMPosition) {
				j = i
			}
		}
		th := make([]float64, nt)
		for t := range th {
			th[t] = r.Times[t] / 3600
		}
		for _, v := range vals[:3] {
			lines := make([]plot.Line, mixing.Layers)
			band := plot.Band{Label: "between the layers", Lo: make([]float64, nt), Hi: make([]float64, nt)}
			for l := range lines {
				lines[l] = plot.Line{Label: layerName(l) + " layer", Y: make([]float64, nt)}
				for t := 0; t < nt; t++ {
					lines[l].Y[t] = v.f(r.Point(t, j, l))
				}
			}
			for t := 0; t < nt; t++ {
				band.Lo[t], band.Hi[t] = min(lines[0].Y[t], lines[1].Y[t]), max(lines[0].Y[t], lines[1].Y[t])
			}
			base := "envelope_" + v.base[len("section_"):]
			figs = append(figs, NamedFigure{base, plot.Envelope(r.title(fmt.Sprintf("%s at %.1f km", v.q.Name, r.Stations[j]/1e3)), th, v.q, lines, band)})
		}
	}
	return figs
}

// NamedFigure is a figure with its file base name.
type NamedFigure struct {
	Base   string
	Figure plot.Figure
}

func (r *Result) title(s string) string { return s }

// WritePlots draws every figure into dir in the scenario's plot formats
// (SVG and PNG by default) and returns the paths written.
func (r *Result) WritePlots(dir string) ([]string, error) {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, err
	}
	formats := r.Scenario.Outputs.PlotFormats
	if len(formats) == 0 {
		formats = []string{"svg", "png"}
	}
	var out []string
	for _, nf := range r.Figures() {
		f := nf.Figure
		if err := f.Check(); err != nil {
			return out, fmt.Errorf("figure %s: %w", nf.Base, err)
		}
		for _, fm := range formats {
			p := filepath.Join(dir, nf.Base+"."+fm)
			err := safefile.Write(p, func(w io.Writer) error { return f.WriteTo(w, plot.Format(fm)) })
			if err != nil {
				return out, fmt.Errorf("figure %s: %w", nf.Base, err)
			}
			out = append(out, p)
		}
	}
	return out, nil
}
