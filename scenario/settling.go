package scenario

import (
	"context"
	"fmt"
	"math"
	"sort"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/mixing"
)

// DefaultFlocInterval is the longest time, s, between updates of the floc
// sizes (Options.FlocInterval). Floc size relaxes towards equilibrium over
// tens of minutes to hours in estuarine mud (the relaxation time
// 1/(k_A·C·G·D^(3−n_f)) of Winterwerp 1998, J. Hydraul. Res. 36:309, is of
// order an hour at C = 0.1 kg m⁻³ and G = 2 s⁻¹), so updating every half
// hour resolves the tide (25 updates per M2 period) at a fraction of the
// cost of updating every model step.
const DefaultFlocInterval = 1800.0

// flocClass is one sediment class whose settling velocity comes from the
// floc population riding on it.
type flocClass struct {
	class   int        // index in the estuary's sediment classes
	model   floc.Model // structure, kinetics, settling and spread
	dynamic bool       // size follows the kinetics; else fixed at d0
	d0      float64    // initial (or fixed) median diameter of the floc mass, m
	table   wsTable    // mass settling velocity against size, salinity, temperature
	d       []float64  // present median diameter per cell and layer, m
}

// settling couples the estuary model to the floc model: it is the
// mixing.Settling the run hands to package mixing. Constant classes settle
// at their given velocity. Floc classes settle at the mass-weighted
// velocity of their size distribution (floc.Model.MassSettlingVelocity,
// tabulated once, see wsTable) for the present floc median diameter in each
// cell and layer; with dynamic flocs that diameter follows the Winterwerp
// (1998) growth/break-up kinetics (floc.Model.Step) under the local shear
// rate, concentration of the class, salinity and temperature, so that size
// lags the tide.
//
// Time stepping: package mixing calls Velocities at the start of every step
// with the state at time t and the step dt about to be taken. The velocity
// of that step is the one of the present size D(t); then the size is
// advanced towards t + dt with the conditions at t. Updates are gathered
// into intervals of at most interval seconds (and always at output times),
// each integrated by floc.Model.Step in one call.
type settling struct {
	ctx      context.Context // cancels the estuary run between steps; nil for none
	nc       int             // classes
	constant []float64       // per class; NaN for floc classes
	flocs    []flocClass
	interval float64
	outputs  []float64

	t, acc  float64
	next    int         // next output index
	started bool        // the first (dt = 0) call has happened
	sizes   [][]float64 // per output: per floc class, d per cell and layer, [f][cell*Layers+layer] flattened f-major
}

func (s *settling) Velocities(dt float64, local []mixing.Local, ws []float64) error {
	if s.ctx != nil {
		if err := s.ctx.Err(); err != nil {
			return err
		}
	}
	nc := s.nc
	if !s.started {
		s.started = true
		for f := range s.flocs {
			fc := &s.flocs[f]
			fc.d = make([]float64, len(local))
			for i := range fc.d {
				fc.d[i] = fc.d0
			}
		}
	}
	for i := range local {
		l := &local[i]
		for k := 0; k < nc; k++ {
			if v := s.constant[k]; !math.IsNaN(v) {
				ws[i*nc+k] = v
			}
		}
		for f := range s.flocs {
			fc := &s.flocs[f]
			ws[i*nc+fc.class] = fc.table.at(fc.d[i], l.Salinity, l.Temperature)
		}
	}
	s.acc += dt
	tEnd := s.t + dt
	due := s.next < len(s.outputs) && tEnd >= s.outputs[s.next]-1e-6
	if s.acc > 0 && (s.acc >= s.interval || due) {
		for f := range s.flocs {
			fc := &s.flocs[f]
			if !fc.dynamic {
				continue
			}
			for i := range local {
				l := &local[i]
				c := max(l.Concentration[fc.class], 0)
				d, err := fc.model.Step(fc.d[i], l.ShearRate, c, clampSalinity(l.Salinity), l.Temperature, s.acc)
				if err != nil {
					return fmt.Errorf("scenario: floc size of class %d in cell %d layer %d at t = %.0f s: %w", fc.class, l.Cell, l.Layer, s.t, err)
				}
				fc.d[i] = d
			}
		}
		s.acc = 0
	}
	s.t = tEnd
	for s.next < len(s.outputs) && s.t >= s.outputs[s.next]-1e-6 {
		var rec []float64
		for f := range s.flocs {
			rec = append(rec, s.flocs[f].d...)
		}
		s.sizes = append(s.sizes, rec)
		s.next++
	}
	return nil
}

func clampSalinity(v float64) float64 { return min(max(v, 0), 42) }

// wsTable tabulates floc.Model.MassSettlingVelocity, which integrates the
// floc size distribution over 32 bins (each solving the drag law) and is
// too costly to call in every cell at every update. Nodes: 64 diameters
// evenly in ln D from the primary size to wsMaxDiameter, the salinities of
// wsSalinities (dense across the 0–3 PSU step of the primary fraction and
// the collision efficiency, floc.DefaultSpread), and the river and ocean
// temperatures (the only temperatures a conservative tracer can take).
// Interpolation is linear in ln w_s against ln D, S and T; the tests bound
// its error against direct calls.
type wsTable struct {
	lnD0, dlnD float64
	nd         int
	temps      []float64 // 1 or 2 nodes
	v          []float64 // ln w_s at [(t*len(wsSalinities)+s)*nd+d]
}

// wsMaxDiameter is the largest tabulated floc median diameter, m: larger
// than any Kolmogorov-capped floc in moving water (η = √(ν/G) = 3 mm at
// G = 0.1 s⁻¹); larger sizes are held at the last node.
const wsMaxDiameter = 5e-3

var wsSalinities = []float64{0, 0.5, 1, 1.5, 2, 2.5, 3, 4, 6, 10, 15, 20, 25, 30, 35, 42}

const wsDiameters = 64

func newWSTable(m floc.Model, tRiver, tOcean, c float64) (wsTable, error) {
	dp := m.Fractal.PrimaryDiameter
	t := wsTable{lnD0: math.Log(dp), nd: wsDiameters}
	t.dlnD = (math.Log(wsMaxDiameter) - t.lnD0) / float64(t.nd-1)
	t.temps = []float64{tRiver}
	if tOcean != tRiver {
		t.temps = []float64{min(tRiver, tOcean), max(tRiver, tOcean)}
	}
	ns := len(wsSalinities)
	t.v = make([]float64, len(t.temps)*ns*t.nd)
	for it, temp := range t.temps {
		for is, sal := range wsSalinities {
			for id := 0; id < t.nd; id++ {
				d := math.Exp(t.lnD0 + float64(id)*t.dlnD)
				if id == 0 {
					d = dp
				}
				w, err := m.MassSettlingVelocity(d, sal, temp, c)
				if err != nil {
					return wsTable{}, err
				}
				if !(w > 0) {
					return wsTable{}, fmt.Errorf("scenario: floc settling velocity %g m/s at D = %g m, S = %g, T = %g °C; need > 0", w, d, sal, temp)
				}
				t.v[(it*ns+is)*t.nd+id] = math.Log(w)
			}
		}
	}
	return t, nil
}

// at returns the mass settling velocity, m s⁻¹, for median diameter d (m),
// salinity s (PSU) and temperature temp (°C), clamping each to the table.
func (t *wsTable) at(d, s, temp float64) float64 {
	x := (math.Log(max(d, 1e-300)) - t.lnD0) / t.dlnD
	x = min(max(x, 0), float64(t.nd-1))
	id := min(int(x), t.nd-2)
	fx := x - float64(id)

	s = clampSalinity(s)
	ns := len(wsSalinities)
	is := sort.SearchFloat64s(wsSalinities, s) - 1
	is = min(max(is, 0), ns-2)
	fs := (s - wsSalinities[is]) / (wsSalinities[is+1] - wsSalinities[is])

	plane := func(it int) float64 {
		row := func(j int) float64 {
			v := t.v[(it*ns+j)*t.nd:]
			return v[id]*(1-fx) + v[id+1]*fx
		}
		return row(is)*(1-fs) + row(is+1)*fs
	}
	if len(t.temps) == 1 {
		return math.Exp(plane(0))
	}
	ft := (temp - t.temps[0]) / (t.temps[1] - t.temps[0])
	ft = min(max(ft, 0), 1)
	return math.Exp(plane(0)*(1-ft) + plane(1)*ft)
}
