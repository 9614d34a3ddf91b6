package mixing

import "fmt"

// Layers is the number of layers in every cell: 0 is the upper (surface)
// layer, 1 the lower (near-bed) layer.
const Layers = 2

// Local is the water in one cell and layer at one instant, as handed to a
// Settling model.
type Local struct {
	Cell, Layer   int
	Salinity      float64   // PSU
	Temperature   float64   // °C
	ShearRate     float64   // G = sqrt(ε/ν), s⁻¹
	Concentration []float64 // kg m⁻³ per class; a read-only view valid during the call
	Total         float64   // kg m⁻³, sum over classes
	Depth         float64   // m, total water depth of the cell
	Thickness     float64   // m, thickness of this layer
}

// Settling supplies settling velocities. Once per time step, before the
// transport, the model calls Velocities with the step length dt (s; dt = 0 on
// the first call, which happens at the initial state) and the conditions of every
// cell and layer, local[cell*Layers+layer]. The implementation writes the
// settling velocity (m s⁻¹, finite and ≥ 0) of class k there to
// ws[(cell*Layers+layer)*classes+k]. A stateless closure ignores dt; a stateful
// one (floc size relaxing towards equilibrium, so that size lags the tide)
// advances its own state by dt on each call. The slices are reused between
// calls: do not keep them.
type Settling interface {
	Velocities(dt float64, local []Local, ws []float64) error
}

// SettlingFunc adapts a stateless function of the local conditions.
type SettlingFunc func(class int, c *Local) float64

// Velocities implements Settling.
func (f SettlingFunc) Velocities(_ float64, local []Local, ws []float64) error {
	if len(local) == 0 {
		return nil
	}
	n := len(ws) / len(local)
	for i := range local {
		for k := 0; k < n; k++ {
			ws[i*n+k] = f(k, &local[i])
		}
	}
	return nil
}

// ConstantSettling gives each class a fixed settling velocity, m s⁻¹.
type ConstantSettling []float64

// Velocities implements Settling.
func (c ConstantSettling) Velocities(_ float64, local []Local, ws []float64) error {
	if len(local) == 0 {
		return nil
	}
	n := len(ws) / len(local)
	if len(c) != n {
		return fmt.Errorf("mixing: ConstantSettling has %d velocities for %d sediment classes", len(c), n)
	}
	for i := range local {
		copy(ws[i*n:(i+1)*n], c)
	}
	return nil
}
