package products

import (
	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/table"
)

// EstuaryTable returns the estuary state at every output time, cell and layer.
func EstuaryTable(h *scenario.Hydrodynamics) *table.Table {
	res := h.Result
	t := &table.Table{Title: "estuary state"}
	t.Columns = []table.Column{
		{Name: "time", Unit: "h"}, {Name: "distance", Unit: "km"}, {Name: "layer"},
		{Name: "width", Unit: "m"}, {Name: "thickness", Unit: "m"}, {Name: "velocity", Unit: "m s-1"},
		{Name: "salinity", Unit: "1"}, {Name: "temperature", Unit: "degC"}, {Name: "shear_rate", Unit: "s-1"},
	}
	for _, c := range res.Classes {
		t.Columns = append(t.Columns, table.Column{Name: "ssc_" + c, Unit: "g m-3"})
	}
	for _, k := range h.FlocClasses {
		t.Columns = append(t.Columns, table.Column{Name: "floc_d50_" + res.Classes[k], Unit: "um"})
	}
	n := len(res.X)
	for i := range res.Snapshots {
		sn := &res.Snapshots[i]
		for c := 0; c < n; c++ {
			for l := 0; l < mixing.Layers; l++ {
				row := []any{sn.Time / 3600, res.X[c] / 1e3, layerName(l), res.Width[c], sn.Thickness[l][c],
					sn.Velocity[l][c], sn.Salinity[l][c], sn.Temperature[l][c], sn.ShearRate[l][c]}
				for k := range res.Classes {
					row = append(row, sn.Concentration[l][k][c]*1e3)
				}
				for f := range h.FlocClasses {
					v := 0.0
					if i < len(h.FlocDiameter) {
						v = h.FlocDiameter[i][(f*n+c)*mixing.Layers+l] * 1e6
					}
					row = append(row, v)
				}
				t.Add(row...)
			}
		}
	}
	return t
}
