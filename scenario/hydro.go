package scenario

import (
	"context"
	"fmt"
	"math"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/spec"
)

// Hydrodynamics is stage 3 of the pipeline: the estuary model run with its
// floc state. The estuary model (package mixing) moves water, salt and
// sediment; the floc sizes of every floc-settling class evolve with it
// through the settling coupling (settling.go), so that package mixing
// never imports package floc.
type Hydrodynamics struct {
	Estuary spec.Estuary
	Config  mixing.Config
	Result  *mixing.Result // snapshots at Config.Run.Output
	// FlocDiameter per output: median floc diameter per floc class, cell
	// and layer, [output][f·cells·Layers + cell·Layers + layer], m.
	FlocDiameter [][]float64
	FlocClasses  []int // sediment class index of each floc class f
}

// flocSlot returns the floc class index f of sediment class k, or −1.
func (h *Hydrodynamics) flocSlot(k int) int {
	for f, c := range h.FlocClasses {
		if c == k {
			return f
		}
	}
	return -1
}

// RunEstuary runs the estuary part of a scenario without optics. Classes
// that settle as flocs use floc.DefaultModel (dynamic, starting at the
// primary size times ten), since an estuary document has no particle
// populations.
func RunEstuary(ctx context.Context, e spec.Estuary, opt Options) (*Hydrodynamics, error) {
	opt, err := opt.normalise()
	if err != nil {
		return nil, err
	}
	cfg, err := EstuaryConfig(e)
	if err != nil {
		return nil, err
	}
	return runHydrodynamics(ctx, e, cfg, opt.FlocInterval, func(k int) (flocClass, error) {
		m := floc.DefaultModel
		return flocClass{class: k, model: m, dynamic: true, d0: 10 * m.Fractal.PrimaryDiameter}, nil
	})
}

// planFlocs returns the floc coupling of plan p: each class that settles as
// flocs takes the model of the first floc population riding on it (the
// plan's own model, built once).
func planFlocs(e spec.Estuary, p *Plan) func(k int) (flocClass, error) {
	return func(k int) (flocClass, error) {
		po, ok := p.flocModelOf(k)
		if !ok {
			return flocClass{}, fmt.Errorf("scenario: sediment class %q settles as flocs but no floc population rides on it", e.Classes[k].Name)
		}
		return flocClass{class: k, model: po.model, dynamic: po.spec.Floc.Dynamic, d0: po.d0}, nil
	}
}

// runHydrodynamics runs estuary e with its model configuration cfg: classes of constant settling keep their
// velocity, and each floc class k settles as the floc model flocFor(k)
// returns (its settling table is built here).
func runHydrodynamics(ctx context.Context, e spec.Estuary, cfg mixing.Config, interval float64, flocFor func(k int) (flocClass, error)) (*Hydrodynamics, error) {
	set := &settling{ctx: ctx, nc: len(e.Classes), interval: interval, outputs: cfg.Run.Output}
	set.constant = make([]float64, len(e.Classes))
	for k, c := range e.Classes {
		if c.Settling != spec.SettlingFloc {
			set.constant[k] = c.SettlingVelocity
			continue
		}
		set.constant[k] = math.NaN()
		fc, err := flocFor(k)
		if err != nil {
			return nil, err
		}
		if fc.table, err = newWSTable(fc.model, e.River.Temperature, e.Ocean.Temperature, 0); err != nil {
			return nil, fmt.Errorf("scenario: class %q: %w", c.Name, err)
		}
		set.flocs = append(set.flocs, fc)
	}
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
	if len(res.Snapshots) != len(cfg.Run.Output) {
		return nil, fmt.Errorf("scenario: estuary model returned %d snapshots for %d output times", len(res.Snapshots), len(cfg.Run.Output))
	}
	h := &Hydrodynamics{Estuary: e, Config: cfg, Result: res, FlocDiameter: set.sizes}
	for _, f := range set.flocs {
		h.FlocClasses = append(h.FlocClasses, f.class)
	}
	return h, nil
}

// Describe returns a few lines on the last snapshot: regime, salt
// intrusion and turbidity maximum.
func (h *Hydrodynamics) Describe() string {
	res := h.Result
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
