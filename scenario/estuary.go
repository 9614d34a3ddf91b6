package scenario

import (
	"context"
	"fmt"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
)

// EstuaryRun is the estuary model run alone (an estuary document).
type EstuaryRun struct {
	Estuary spec.Estuary
	Result  *mixing.Result
	// FlocDiameter per output: median floc diameter per floc class, cell
	// and layer, [output][f·cells·Layers + cell·Layers + layer], m.
	FlocDiameter [][]float64
	FlocClasses  []int // class index of each floc class
}

// RunEstuary runs the estuary part of a scenario without optics. Classes
// that settle as flocs use floc.DefaultModel (dynamic, starting at the
// primary size times ten), since an estuary document has no particle
// populations.
func RunEstuary(ctx context.Context, e spec.Estuary, opt Options) (*EstuaryRun, error) {
	if opt.FlocInterval <= 0 {
		opt.FlocInterval = DefaultFlocInterval
	}
	cfg, err := EstuaryConfig(e)
	if err != nil {
		return nil, err
	}
	set, err := settlingFor(e, cfg, opt.FlocInterval, func(k int) (flocClass, error) {
		m := floc.DefaultModel
		return flocClass{class: k, model: m, dynamic: true, d0: 10 * m.Fractal.PrimaryDiameter}, nil
	})
	if err != nil {
		return nil, err
	}
	set.ctx = ctx
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	var ms mixing.Settling
	if len(cfg.Sediment) > 0 {
		ms = set
	}
	res, err := mixing.Run(cfg, ms)
	if err != nil {
		return nil, err
	}
	er := &EstuaryRun{Estuary: e, Result: res, FlocDiameter: set.sizes}
	for _, f := range set.flocs {
		er.FlocClasses = append(er.FlocClasses, f.class)
	}
	return er, nil
}

// Table returns the estuary state at every output time, cell and layer.
func (er *EstuaryRun) Table() *table.Table {
	res := er.Result
	t := &table.Table{Title: "estuary state"}
	t.Columns = []table.Column{
		{Name: "time", Unit: "h"}, {Name: "distance", Unit: "km"}, {Name: "layer"},
		{Name: "width", Unit: "m"}, {Name: "thickness", Unit: "m"}, {Name: "velocity", Unit: "m s-1"},
		{Name: "salinity", Unit: "1"}, {Name: "temperature", Unit: "degC"}, {Name: "shear_rate", Unit: "s-1"},
	}
	for _, c := range res.Classes {
		t.Columns = append(t.Columns, table.Column{Name: "ssc_" + c, Unit: "g m-3"})
	}
	for _, k := range er.FlocClasses {
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
				for f := range er.FlocClasses {
					v := 0.0
					if i < len(er.FlocDiameter) {
						v = er.FlocDiameter[i][(f*n+c)*mixing.Layers+l] * 1e6
					}
					row = append(row, v)
				}
				t.Add(row...)
			}
		}
	}
	return t
}

// Describe returns a few lines on the last snapshot: regime, salt
// intrusion and turbidity maximum.
func (er *EstuaryRun) Describe() string {
	res := er.Result
	if len(res.Snapshots) == 0 {
		return "no output times\n"
	}
	d := res.Snapshots[len(res.Snapshots)-1].Diagnostics
	s := fmt.Sprintf("regime: %s (Fr_f %.3g, M %.3g)\nsalt intrusion (bottom %g PSU): %.1f km\nmean stratification: %.2f\n",
		d.Regime.Class, d.Regime.Froude, d.Regime.Mixing, float64(BottomThreshold), d.IntrusionLength/1e3, d.MeanStratification)
	if len(res.Classes) > 0 {
		s += fmt.Sprintf("turbidity maximum: %.1f km, %.3g g/m3, bottom salinity %.1f PSU\n", d.ETMPosition/1e3, d.ETMPeak*1e3, d.ETMBottomSalinity)
	}
	return s
}
