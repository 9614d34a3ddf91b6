package products

import (
	"fmt"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
)

// InstrumentTable returns the readings of instrument i at every output
// time, station and layer.
func InstrumentTable(r *scenario.Result, i int) *table.Table {
	return instrumentTable(r, i, 0, len(r.Times))
}

func instrumentTable(r *scenario.Result, i, t0, t1 int) *table.Table {
	in := r.Instruments[i]
	u := instrumentUnit(in.Kind)
	q := instrumentQuantity(in.Kind)
	lambda := in.Wavelength
	if in.Kind == spec.Turbidity {
		lambda = 860e-9
	}
	t := &table.Table{Title: fmt.Sprintf("instrument %s: %s, %s at %.0f nm", in.Name, in.Kind, q, lambda*1e9)}
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

// instrumentUnit returns the unit of an instrument's reading.
func instrumentUnit(k spec.InstrumentKind) string {
	if k == spec.Turbidity {
		return "m-1 sr-1"
	}
	return "m-1"
}

func instrumentQuantity(k spec.InstrumentKind) string {
	switch k {
	case spec.Transmissometer:
		return "beam attenuation c"
	case spec.Backscatter:
		return "backscattering b_b"
	}
	return "particle VSF at 90 deg"
}
