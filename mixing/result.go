package mixing

import (
	"math"
)

// Snapshot is the state along the channel at one time, or averaged over one
// M2 cycle. Cell fields are indexed [layer][cell] (layer 0 upper, 1 lower),
// sediment fields [layer][class][cell] and [class][cell], face fields
// [layer][face] with face 0 at the mouth.
type Snapshot struct {
	Time          float64             // s; for a cycle mean, the centre of the cycle
	Elevation     float64             // m, tidal surface elevation (uniform along the channel)
	Thickness     [Layers][]float64   // m
	Velocity      [Layers][]float64   // m s⁻¹, tidal + residual, positive landward
	Salinity      [Layers][]float64   // PSU
	Temperature   [Layers][]float64   // °C
	ShearRate     [Layers][]float64   // s⁻¹
	Concentration [Layers][][]float64 // kg m⁻³
	BedMass       [][]float64         // kg m⁻²
	Transport     [Layers][]float64   // m³ s⁻¹ through each face, positive landward
	SaltFlux      [Layers][]float64   // PSU m³ s⁻¹ (advective + dispersive) through each face, positive landward
	River         float64             // m³ s⁻¹, Q_R
	TidalVelocity float64             // m s⁻¹, amplitude of the section-mean tidal current at the mouth (spring–neap envelope)
	Diagnostics   Diagnostics
}

// Diagnostics derived from one snapshot.
type Diagnostics struct {
	// IntrusionLength is the distance (m) from the mouth to the most landward
	// point where lower-layer salinity reaches Run.BottomThreshold, by linear
	// interpolation between cell centres (and the ocean value at x = 0).
	IntrusionLength float64
	// Stratification (s_lower − s_upper)/s̄ per cell; 0 where s̄ < 0.01 PSU.
	Stratification []float64
	// MeanStratification is Stratification averaged over the cells whose
	// lower-layer salinity exceeds Run.BottomThreshold (0 if none).
	MeanStratification float64
	Regime             Regime
	// Turbidity maximum: the cell with the largest depth-mean total suspended
	// concentration (kg m⁻³), its position (m from the mouth) and its
	// lower-layer salinity (PSU). Zero without sediment classes.
	ETMPosition, ETMPeak, ETMBottomSalinity float64
}

// Result of a run.
type Result struct {
	X, Width, Depth []float64  // cells: centre (m from the mouth), width (m), depth (m)
	XFace           []float64  // faces, m from the mouth
	Classes         []string   // sediment class names
	Snapshots       []Snapshot // at Run.Output times
	Cycles          []Snapshot // means over each complete M2 cycle [n·T_M2, (n+1)·T_M2)
	Digitisation    string     // regime boundaries used (RegimeDigitisation)
	Steps           int        // time steps taken
}

// Run integrates to Run.Duration and returns the snapshots and tidal means.
func Run(cfg Config, settling Settling) (*Result, error) {
	m, err := New(cfg, settling)
	if err != nil {
		return nil, err
	}
	return m.Run()
}

// Run integrates the model to Run.Duration.
func (m *Model) Run() (*Result, error) {
	res := &Result{
		X: append([]float64(nil), m.x...), Width: append([]float64(nil), m.b...),
		Depth: append([]float64(nil), m.h...), XFace: append([]float64(nil), m.xf...),
		Digitisation: RegimeDigitisation,
	}
	for _, c := range m.cfg.Sediment {
		res.Classes = append(res.Classes, c.Name)
	}
	out := m.cfg.Run.Output
	k := 0
	for k < len(out) && out[k] <= m.t {
		res.Snapshots = append(res.Snapshots, m.Snapshot())
		k++
	}
	for m.t < m.cfg.Run.Duration {
		if err := m.Step(); err != nil {
			return nil, err
		}
		res.Steps++
		for k < len(out) && out[k] <= m.t {
			res.Snapshots = append(res.Snapshots, m.Snapshot())
			k++
		}
		if m.acc.done {
			res.Cycles = append(res.Cycles, m.acc.snapshot(m))
		}
	}
	for _, ss := range [][]Snapshot{res.Snapshots, res.Cycles} {
		for i := range ss {
			if err := checkFinite(&ss[i]); err != nil {
				return nil, err
			}
		}
	}
	return res, nil
}

func newSnapshot(n, nc int) Snapshot {
	var s Snapshot
	for k := 0; k < Layers; k++ {
		s.Thickness[k] = make([]float64, n)
		s.Velocity[k] = make([]float64, n)
		s.Salinity[k] = make([]float64, n)
		s.Temperature[k] = make([]float64, n)
		s.ShearRate[k] = make([]float64, n)
		s.Concentration[k] = make([][]float64, nc)
		for c := range s.Concentration[k] {
			s.Concentration[k][c] = make([]float64, n)
		}
		s.Transport[k] = make([]float64, n+1)
		s.SaltFlux[k] = make([]float64, n+1)
	}
	s.BedMass = make([][]float64, nc)
	for c := range s.BedMass {
		s.BedMass[c] = make([]float64, n)
	}
	return s
}

// Snapshot copies the present state (allocates).
func (m *Model) Snapshot() Snapshot {
	s := newSnapshot(m.n, m.nc)
	s.Time = m.t
	s.Elevation = m.eta(m.t)
	for k := 0; k < Layers; k++ {
		for i := 0; i < m.n; i++ {
			s.Thickness[k][i] = m.vol[k][i] / m.area[i]
		}
		copy(s.Velocity[k], m.u[k])
		copy(s.Salinity[k], m.conc[0][k])
		copy(s.Temperature[k], m.conc[1][k])
		copy(s.ShearRate[k], m.g[k])
		for c := 0; c < m.nc; c++ {
			copy(s.Concentration[k][c], m.conc[2+c][k])
		}
		copy(s.Transport[k], m.q[k])
		copy(s.SaltFlux[k], m.saltFlux[k])
	}
	for c := 0; c < m.nc; c++ {
		copy(s.BedMass[c], m.bed[c])
	}
	s.River = m.qr
	s.TidalVelocity = m.tidalVelocity(0, m.envelope(m.t))
	m.diagnose(&s)
	return s
}

// diagnose fills s.Diagnostics from the cell fields of s.
func (m *Model) diagnose(s *Snapshot) {
	d := &s.Diagnostics
	n := m.n
	thr := m.cfg.Run.BottomThreshold
	sb := s.Salinity[1]
	d.Stratification = make([]float64, n)
	cnt := 0
	for i := 0; i < n; i++ {
		h0, h1 := s.Thickness[0][i], s.Thickness[1][i]
		mean := (h0*s.Salinity[0][i] + h1*sb[i]) / (h0 + h1)
		if mean >= 0.01 {
			d.Stratification[i] = (sb[i] - s.Salinity[0][i]) / mean
		}
		if sb[i] >= thr {
			d.MeanStratification += d.Stratification[i]
			cnt++
		}
	}
	if cnt > 0 {
		d.MeanStratification /= float64(cnt)
	}
	d.IntrusionLength = intrusion(m.x, sb, m.cfg.Ocean.Salinity, thr, m.cfg.Geometry.Length)
	cl := m.cfg.Closure
	ur := s.River / (m.bf[0] * m.hf[0])
	d.Regime = NewRegime(ur, s.TidalVelocity, m.hf[0], m.cfg.Ocean.Salinity, cl.DragCoefficient, cl.HalineContraction, omegaM2)
	if m.nc > 0 {
		for i := 0; i < n; i++ {
			h0, h1 := s.Thickness[0][i], s.Thickness[1][i]
			tot := 0.0
			for c := 0; c < m.nc; c++ {
				tot += h0*s.Concentration[0][c][i] + h1*s.Concentration[1][c][i]
			}
			tot /= h0 + h1
			if tot > d.ETMPeak {
				d.ETMPeak, d.ETMPosition, d.ETMBottomSalinity = tot, m.x[i], sb[i]
			}
		}
	}
}

// intrusion returns the landward-most crossing of the threshold by the
// bottom salinity profile sb at cell centres x, with the ocean value at x = 0.
func intrusion(x, sb []float64, ocean, thr, length float64) float64 {
	n := len(x)
	if sb[n-1] >= thr {
		return length
	}
	for i := n - 2; i >= 0; i-- {
		if sb[i] >= thr {
			f := (sb[i] - thr) / (sb[i] - sb[i+1])
			return x[i] + f*(x[i+1]-x[i])
		}
	}
	if ocean >= thr {
		f := (ocean - thr) / (ocean - sb[0])
		return f * x[0]
	}
	return 0
}

// cycleAcc accumulates time-weighted means over one M2 cycle.
type cycleAcc struct {
	start, end float64
	sum        Snapshot
	wsum       float64
	done       bool
	nc         int
}

func (a *cycleAcc) init(m *Model) {
	a.sum = newSnapshot(m.n, m.nc)
	a.nc = m.nc
	a.start = 0
	a.end = PeriodM2
}

func (a *cycleAcc) reset() {
	s := &a.sum
	zero := func(v []float64) {
		for i := range v {
			v[i] = 0
		}
	}
	for k := 0; k < Layers; k++ {
		zero(s.Thickness[k])
		zero(s.Velocity[k])
		zero(s.Salinity[k])
		zero(s.Temperature[k])
		zero(s.ShearRate[k])
		for c := range s.Concentration[k] {
			zero(s.Concentration[k][c])
		}
		zero(s.Transport[k])
		zero(s.SaltFlux[k])
	}
	for c := range s.BedMass {
		zero(s.BedMass[c])
	}
	s.Elevation, s.River, s.TidalVelocity = 0, 0, 0
	a.wsum = 0
	a.start = a.end
	a.end += PeriodM2
	a.done = false
}

// nextEvent is the next time a step must end on: output, cycle end or run end.
func (a *cycleAcc) nextEvent(m *Model, end float64) float64 {
	next := math.Min(end, a.end)
	for _, t := range m.cfg.Run.Output {
		if t > m.t {
			next = math.Min(next, t)
			break
		}
	}
	return next
}

// add accumulates the step just taken (state at its end, transports during it).
func (a *cycleAcc) add(m *Model, dt float64) {
	s := &a.sum
	for k := 0; k < Layers; k++ {
		for i := 0; i < m.n; i++ {
			s.Thickness[k][i] += dt * m.vol[k][i] / m.area[i]
			s.Velocity[k][i] += dt * m.u[k][i]
			s.Salinity[k][i] += dt * m.conc[0][k][i]
			s.Temperature[k][i] += dt * m.conc[1][k][i]
			s.ShearRate[k][i] += dt * m.g[k][i]
			for c := 0; c < m.nc; c++ {
				s.Concentration[k][c][i] += dt * m.conc[2+c][k][i]
			}
		}
		for j := 0; j <= m.n; j++ {
			s.Transport[k][j] += dt * m.q[k][j]
			s.SaltFlux[k][j] += dt * m.saltFlux[k][j]
		}
	}
	for c := 0; c < m.nc; c++ {
		for i := 0; i < m.n; i++ {
			s.BedMass[c][i] += dt * m.bed[c][i]
		}
	}
	s.Elevation += dt * m.eta(m.t)
	s.River += dt * m.qr
	s.TidalVelocity += dt * m.tidalVelocity(0, m.envelope(m.t-0.5*dt))
	a.wsum += dt
	if m.t >= a.end-1e-6 {
		a.done = true
	}
}

// snapshot returns the mean over the cycle (allocates).
func (a *cycleAcc) snapshot(m *Model) Snapshot {
	s := newSnapshot(m.n, m.nc)
	f := 1 / a.wsum
	sc := func(dst, src []float64) {
		for i := range src {
			dst[i] = src[i] * f
		}
	}
	for k := 0; k < Layers; k++ {
		sc(s.Thickness[k], a.sum.Thickness[k])
		sc(s.Velocity[k], a.sum.Velocity[k])
		sc(s.Salinity[k], a.sum.Salinity[k])
		sc(s.Temperature[k], a.sum.Temperature[k])
		sc(s.ShearRate[k], a.sum.ShearRate[k])
		for c := 0; c < m.nc; c++ {
			sc(s.Concentration[k][c], a.sum.Concentration[k][c])
		}
		sc(s.Transport[k], a.sum.Transport[k])
		sc(s.SaltFlux[k], a.sum.SaltFlux[k])
	}
	for c := 0; c < m.nc; c++ {
		sc(s.BedMass[c], a.sum.BedMass[c])
	}
	s.Time = 0.5 * (a.start + a.end)
	s.Elevation = a.sum.Elevation * f
	s.River = a.sum.River * f
	s.TidalVelocity = a.sum.TidalVelocity * f
	m.diagnose(&s)
	return s
}

// Inventory is what the estuary holds.
type Inventory struct {
	Water    float64   // m³
	Salt     float64   // PSU m³
	Heat     float64   // °C m³
	Sediment []float64 // kg per class, suspended plus bed
}

// Inventory returns the present content of the estuary (allocates).
func (m *Model) Inventory() Inventory {
	var v Inventory
	v.Sediment = make([]float64, m.nc)
	for i := 0; i < m.n; i++ {
		for k := 0; k < Layers; k++ {
			vk := m.vol[k][i]
			v.Water += vk
			v.Salt += vk * m.conc[0][k][i]
			v.Heat += vk * m.conc[1][k][i]
			for c := 0; c < m.nc; c++ {
				v.Sediment[c] += vk * m.conc[2+c][k][i]
			}
		}
		for c := 0; c < m.nc; c++ {
			v.Sediment[c] += m.bed[c][i] * m.area[i]
		}
	}
	return v
}

// Inflow returns the accumulated net inflow through the mouth and head since
// the start, in the units of Inventory.
func (m *Model) Inflow() Inventory {
	v := Inventory{Water: m.waterIn, Salt: m.inflow[0], Heat: m.inflow[1]}
	v.Sediment = append([]float64(nil), m.inflow[2:]...)
	return v
}

func checkFinite(s *Snapshot) error {
	bad := func(v []float64) int {
		for i, x := range v {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				return i
			}
		}
		return -1
	}
	for k := 0; k < Layers; k++ {
		fields := [][]float64{s.Thickness[k], s.Velocity[k], s.Salinity[k], s.Temperature[k], s.ShearRate[k]}
		fields = append(fields, s.Concentration[k]...)
		for _, f := range fields {
			if i := bad(f); i >= 0 {
				return errNonFinite(s.Time, k, i)
			}
		}
	}
	for _, f := range s.BedMass {
		if i := bad(f); i >= 0 {
			return errNonFinite(s.Time, 1, i)
		}
	}
	return nil
}
