package products

import (
	"bytes"
	"fmt"
	"io"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/internal/safefile"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
)

// layerName labels layer l.
func layerName(l int) string {
	if l == 0 {
		return "upper"
	}
	return "lower"
}

// SectionTable is the along-channel section at every model cell: one row
// per output time, cell centre and layer with the water state and the
// bulk IOPs at the reference wavelength (nearest 550 nm), totals and
// particles.
func SectionTable(r *scenario.Result) *table.Table { return sectionTable(r, 0, len(r.Times)) }

// StationTable is the same at the stations.
func StationTable(r *scenario.Result) *table.Table { return stationTable(r, 0, len(r.Times)) }

func sectionTable(r *scenario.Result, t0, t1 int) *table.Table {
	return pointsTable(r, &r.Section, "section along the channel at every model cell", t0, t1)
}

func stationTable(r *scenario.Result, t0, t1 int) *table.Table {
	return pointsTable(r, &r.Points, "state and bulk optics at the stations", t0, t1)
}

// pointsTable tabulates the points ps at output times t0 to t1.
func pointsTable(r *scenario.Result, ps *scenario.Points, title string, t0, t1 int) *table.Table {
	wref := r.Points.Band[r.Points.Ref]
	t := &table.Table{Title: fmt.Sprintf("%s (IOPs at %.0f nm)", title, r.Wavelengths[wref]*1e9)}
	t.Columns = []table.Column{
		{Name: "time", Unit: "h"}, {Name: "distance", Unit: "km"}, {Name: "layer"},
		{Name: "thickness", Unit: "m"}, {Name: "salinity", Unit: "1"}, {Name: "temperature", Unit: "degC"},
		{Name: "shear_rate", Unit: "s-1"},
	}
	for _, c := range r.Classes {
		t.Columns = append(t.Columns, table.Column{Name: "ssc_" + c, Unit: "g m-3"})
	}
	for i, p := range r.Scenario.Mixture.Populations {
		if hasFlocs(r, i) {
			t.Columns = append(t.Columns, table.Column{Name: "floc_d50_" + p.Name, Unit: "um"})
		}
	}
	t.Columns = append(t.Columns,
		table.Column{Name: "a", Unit: "m-1"}, table.Column{Name: "b", Unit: "m-1"},
		table.Column{Name: "bb", Unit: "m-1"}, table.Column{Name: "c", Unit: "m-1"},
		table.Column{Name: "bb_over_b", Unit: "1"}, table.Column{Name: "bbp", Unit: "m-1"},
		table.Column{Name: "bbp_over_bp", Unit: "1"}, table.Column{Name: "bbp_slope", Unit: "1"},
		table.Column{Name: "cp_slope", Unit: "1"},
	)
	for ti := t0; ti < t1; ti++ {
		for j, x := range ps.Distance {
			for l := 0; l < mixing.Layers; l++ {
				p := ps.Point(ti, j, l)
				row := []any{r.Times[ti] / 3600, x / 1e3, layerName(l), ps.Thickness[p], ps.Salinity[p], ps.Temperature[p], ps.ShearRate[p]}
				for c := range r.Classes {
					row = append(row, ps.Concentration[p*r.NC()+c]*1e3)
				}
				for i := range r.Scenario.Mixture.Populations {
					if hasFlocs(r, i) {
						row = append(row, ps.FlocDiameter[p*r.NP()+i]*1e6)
					}
				}
				a, b, bb := ps.AtRef(ps.TotalA, p), ps.AtRef(ps.TotalB, p), ps.AtRef(ps.TotalBb, p)
				bp, bbp := ps.AtRef(ps.Bp, p), ps.AtRef(ps.Bbp, p)
				row = append(row, a, b, bb, a+b, ratio(bb, b), bbp, ratio(bbp, bp), ps.ParticleBbSlope[p], ps.ParticleCSlope[p])
				t.Add(row...)
			}
		}
	}
	return t
}

func ratio(x, y float64) float64 {
	if y == 0 {
		return 0
	}
	return x / y
}

func hasFlocs(r *scenario.Result, i int) bool {
	return r.Components[r.ComponentOf(i)].Population.Kind == spec.KindFloc
}

// SpectraTable holds the spectra at every station, layer and output time:
// each component's a, b and b_b and the totals.
func SpectraTable(r *scenario.Result) *table.Table { return spectraTable(r, 0, len(r.Times)) }

func spectraTable(r *scenario.Result, t0, t1 int) *table.Table {
	t := &table.Table{Title: "spectra at stations"}
	t.Columns = append([]table.Column{{Name: "time", Unit: "h"}, {Name: "distance", Unit: "km"}, {Name: "layer"}, {Name: "wavelength", Unit: "nm"}},
		spectrumColumns(r.Components)...)
	for ti := t0; ti < t1; ti++ {
		for j := range r.Stations {
			for l := 0; l < mixing.Layers; l++ {
				p := r.Point(ti, j, l)
				for w, lam := range r.Wavelengths {
					row := []any{r.Times[ti] / 3600, r.Stations[j] / 1e3, layerName(l), lam * 1e9}
					t.Add(spectrumRow(row, r.Components, func(q iop.Quantity, k int) float64 { return r.Value(q, p, k, w) })...)
				}
			}
		}
	}
	return t
}

// spectrumColumns are the columns of one spectrum: each component's a
// (and b and b_b for water and particles), then the totals a, b, b_b, c
// and b_b/b.
func spectrumColumns(comps []scenario.Component) []table.Column {
	var cols []table.Column
	for _, c := range comps {
		cols = append(cols, table.Column{Name: "a_" + c.Name, Unit: "m-1"})
		if c.Kind == iop.Water || c.Kind == iop.Particles {
			cols = append(cols, table.Column{Name: "b_" + c.Name, Unit: "m-1"}, table.Column{Name: "bb_" + c.Name, Unit: "m-1"})
		}
	}
	return append(cols, table.Column{Name: "a", Unit: "m-1"}, table.Column{Name: "b", Unit: "m-1"},
		table.Column{Name: "bb", Unit: "m-1"}, table.Column{Name: "c", Unit: "m-1"}, table.Column{Name: "bb_over_b", Unit: "1"})
}

// spectrumRow appends the cells of spectrumColumns at one wavelength to
// row; v(q, k) is quantity q (absorption, scattering or backscattering)
// of component k. Totals are summed in component order.
func spectrumRow(row []any, comps []scenario.Component, v func(q iop.Quantity, k int) float64) []any {
	var a, b, bb float64
	for k, c := range comps {
		ak := v(iop.Absorption, k)
		row = append(row, ak)
		a += ak
		bk, bbk := v(iop.Scattering, k), v(iop.Backscattering, k)
		b += bk
		bb += bbk
		if c.Kind == iop.Water || c.Kind == iop.Particles {
			row = append(row, bk, bbk)
		}
	}
	return append(row, a, b, bb, a+b, ratio(bb, b))
}

// ApparentTable holds what is seen from above at every station and time:
// R_rs and K_d per wavelength, with the Secchi depth, hue angle and
// Forel-Ule class of the spectrum (computed from the upper layer, taken
// as optically deep and homogeneous).
func ApparentTable(r *scenario.Result) *table.Table { return apparentTable(r, 0, len(r.Times)) }

func apparentTable(r *scenario.Result, t0, t1 int) *table.Table {
	t := &table.Table{Title: "reflectance and clarity at stations (upper layer)"}
	t.Columns = []table.Column{{Name: "time", Unit: "h"}, {Name: "distance", Unit: "km"}, {Name: "wavelength", Unit: "nm"},
		{Name: "Rrs", Unit: "sr-1"}, {Name: "Kd", Unit: "m-1"}, {Name: "secchi_depth", Unit: "m"},
		{Name: "hue_angle", Unit: "degree"}, {Name: "forel_ule", Unit: "1"}, {Name: "flags"}}
	nw := r.NW()
	for ti := t0; ti < t1; ti++ {
		for j := range r.Stations {
			q := ti*len(r.Stations) + j
			for w, lam := range r.Wavelengths {
				t.Add(r.Times[ti]/3600, r.Stations[j]/1e3, lam*1e9, r.Rrs[q*nw+w], r.Kd[q*nw+w],
					r.Secchi[q], r.Hue[q], float64(r.ForelUle[q]), r.SeenFlags[q].String())
			}
		}
	}
	return t
}

// WriteTable writes t as CSV to path atomically.
func WriteTable(path string, t *table.Table) error {
	return safefile.Write(path, func(w io.Writer) error { return t.Write(w, table.CSV) })
}

// namedTable is a CSV file built one output time at a time, so that a
// long run never holds a whole table of boxed cells in memory.
type namedTable struct {
	name  string
	chunk func(t0, t1 int) *table.Table
}

func csvTables(r *scenario.Result) []namedTable {
	t := []namedTable{
		{"section.csv", func(t0, t1 int) *table.Table { return sectionTable(r, t0, t1) }},
		{"stations.csv", func(t0, t1 int) *table.Table { return stationTable(r, t0, t1) }},
		{"spectra.csv", func(t0, t1 int) *table.Table { return spectraTable(r, t0, t1) }},
		{"apparent.csv", func(t0, t1 int) *table.Table { return apparentTable(r, t0, t1) }},
	}
	for i, in := range r.Instruments {
		t = append(t, namedTable{"instrument_" + in.Describe().Name + ".csv", func(t0, t1 int) *table.Table { return instrumentTable(r, i, t0, t1) }})
	}
	return t
}

// writeCSV writes the table in chunks of output times: the header with the
// first chunk, then only the rows of the others (their header line, the
// same for every chunk, is dropped).
func (nt namedTable) writeCSV(w io.Writer, times int) error {
	var buf bytes.Buffer
	for t0 := 0; t0 < max(times, 1); t0 += csvChunk {
		buf.Reset()
		if err := nt.chunk(t0, min(t0+csvChunk, times)).WriteCSV(&buf); err != nil {
			return err
		}
		b := buf.Bytes()
		if t0 > 0 {
			i := bytes.IndexByte(b, '\n')
			b = b[i+1:]
		}
		if _, err := w.Write(b); err != nil {
			return err
		}
	}
	return nil
}

// csvChunk is the number of output times per chunk of a CSV file.
const csvChunk = 8

// CSV is the product of tidy CSV tables with units in their headers:
// section.csv, stations.csv, spectra.csv, apparent.csv and one table per
// instrument, each written in chunks of output times.
type CSV struct{}

// Name is "csv".
func (CSV) Name() string { return "csv" }

// Files lists the tables.
func (CSV) Files(r *scenario.Result) ([]File, error) {
	var fs []File
	for _, f := range csvTables(r) {
		fs = append(fs, atomic(f.name, func(w io.Writer) error { return f.writeCSV(w, len(r.Times)) }))
	}
	return fs, nil
}
