package products

import (
	"fmt"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/table"
)

// MixtureTable returns one row per wavelength: each component's a (and b, b_b
// for water and particles), the totals, c and b_b/b.
func MixtureTable(mr *scenario.MixtureResult) *table.Table {
	sp := mr.Spectra
	t := &table.Table{Title: fmt.Sprintf("IOP spectra of the sample (salinity %g, %g °C)", mr.Mixture.Water.Salinity, mr.Mixture.Water.Temperature)}
	t.Columns = append([]table.Column{{Name: "wavelength", Unit: "nm"}}, spectrumColumns(mr.Components)...)
	for w, lam := range mr.Wavelengths {
		t.Add(spectrumRow([]any{lam * 1e9}, mr.Components, func(q iop.Quantity, k int) float64 { return sp.Components[k].Value(q, w) })...)
	}
	return t
}
