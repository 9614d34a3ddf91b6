package products

import (
	"fmt"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/table"
)

// InstrumentTable returns the readings of instrument i at every output
// time, station and layer.
func InstrumentTable(r *scenario.Result, i int) *table.Table {
	return instrumentTable(r, i, 0, len(r.Times))
}

func instrumentTable(r *scenario.Result, i, t0, t1 int) *table.Table {
	d := r.Instruments[i].Describe()
	u := d.Unit
	t := &table.Table{Title: fmt.Sprintf("instrument %s: %s, %s at %.0f nm", d.Name, d.Kind, d.Quantity, d.Wavelength*1e9)}
	t.Columns = []table.Column{{Name: "time", Unit: "h"}, {Name: "distance", Unit: "km"}, {Name: "layer"},
		{Name: "reading", Unit: u}, {Name: "model_value", Unit: u}, {Name: "flags"}}
	for ti := t0; ti < t1; ti++ {
		for j := range r.Stations {
			for l := 0; l < 2; l++ {
				p := r.Point(ti, j, l)
				rd := r.Readings[p*len(r.Instruments)+i]
				t.Add(r.Times[ti]/3600, r.Stations[j]/1e3, layerName(l), rd.Value, rd.True, rd.Flags.String())
			}
		}
	}
	return t
}
