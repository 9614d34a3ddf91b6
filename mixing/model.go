package mixing

import (
	"fmt"
	"math"
)

// Numerical choices (see doc.go, "Numerics").
const (
	// relaxTime (s): the lower-layer volume relaxes to the interface of the
	// tidally averaged exchange flow on the time scale over which that flow is
	// defined (the M2 filter of its salinity gradient). Faster relaxation (one
	// hour was used before) imposes the tidal-mean interface within the tide
	// and, once vertical mixing is weak, drives along-channel waves of
	// stratification at the tidal-excursion scale (doc.go, Numerics).
	relaxTime  = PeriodM2
	filterTime = PeriodM2
	// exchangeInterval is how often (s) the residual exchange flow is
	// recomputed; it follows a salinity field filtered over an M2 period and the
	// spring–neap envelope, both far slower.
	exchangeInterval = 900.0
)

// Model is an estuary being stepped in time. It is not safe for concurrent use.
type Model struct {
	cfg   Config
	set   Settling
	n, nc int // cells, sediment classes

	// geometry
	dx             float64
	x, b, h, area  []float64 // cell centres, width, depth, plan area B·dx
	xf, bf, hf, pf []float64 // faces: position, width, depth, prism landward Σ B dx

	// tide (elevation amplitudes at the mouth, m)
	a1, a2 float64

	// state
	t      float64
	vol    [Layers][]float64   // m³
	conc   [][Layers][]float64 // [tracer][layer][cell]; tracer 0 salinity, 1 temperature, 2+c sediment
	bed    [][]float64         // [class][cell] kg m⁻²
	sfilt  []float64           // tidally filtered depth-mean salinity
	dsfilt []float64           // tidally filtered lower − upper salinity
	ri     []float64           // cells, bulk layer Richardson number Ri_b (see richardson)
	damp   []float64           // cells, stratification damping factor f(Ri_b) of tidal K_S
	cum    []float64           // cells+1, prefix sums of the filtered stratification
	sint   []float64           // cells+1, prefix integrals of sfilt (sbarIntegral)

	// per-step work
	q2res, f2f, kh []float64         // faces
	phi2           []float64         // faces, lower-layer share of the tidal transport
	halfc, dcoef   [Layers][]float64 // faces: (1 − ν)/2 and dispersion conductance, m³ s⁻¹
	inv            [Layers][]float64 // cells: 1/new volume
	nextExchange   float64           // s, when the exchange flow is next recomputed
	q              [Layers][]float64 // faces, m³ s⁻¹ landward positive
	w              []float64         // cells, upward volume flux lower → upper, m³ s⁻¹
	u              [Layers][]float64 // cells, m s⁻¹
	g              [Layers][]float64 // cells, shear rate s⁻¹
	umean, taub    []float64
	xv             []float64 // cells, vertical exchange velocity, m s⁻¹
	flux, mass     []float64
	local          []Local
	ws             []float64
	bnd            []float64 // boundary values per tracer: ocean then river, [2*tracers]
	saltFlux       [Layers][]float64
	qr             float64

	// accounting
	inflow  []float64 // [tracer] accumulated boundary inflow (mass·unit); water in index len
	waterIn float64

	acc cycleAcc
}

// New checks cfg and builds a model at its initial state. settling may be nil
// when there are no sediment classes.
func New(cfg Config, settling Settling) (*Model, error) {
	if err := cfg.Validate(); err != nil {
		return nil, err
	}
	if len(cfg.Sediment) > 0 && settling == nil {
		return nil, errNoSettling
	}
	// own copies of the slices, so that the caller may reuse cfg
	cfg.Geometry.Table = append([]Section(nil), cfg.Geometry.Table...)
	cfg.River.Series.Time = append([]float64(nil), cfg.River.Series.Time...)
	cfg.River.Series.Value = append([]float64(nil), cfg.River.Series.Value...)
	cfg.Sediment = append([]Class(nil), cfg.Sediment...)
	cfg.Run.Output = append([]float64(nil), cfg.Run.Output...)
	m := &Model{cfg: cfg, set: settling, n: cfg.Geometry.Cells, nc: len(cfg.Sediment)}
	n := m.n
	m.dx = cfg.Geometry.Length / float64(n)
	mk := func(k int) []float64 { return make([]float64, k) }
	m.x, m.b, m.h, m.area = mk(n), mk(n), mk(n), mk(n)
	m.xf, m.bf, m.hf, m.pf = mk(n+1), mk(n+1), mk(n+1), mk(n+1)
	for i := 0; i < n; i++ {
		m.x[i] = (float64(i) + 0.5) * m.dx
		m.b[i], m.h[i] = cfg.Geometry.at(m.x[i])
		m.area[i] = m.b[i] * m.dx
	}
	for j := 0; j <= n; j++ {
		m.xf[j] = float64(j) * m.dx
		m.bf[j], m.hf[j] = cfg.Geometry.at(m.xf[j])
	}
	for j := n - 1; j >= 0; j-- {
		m.pf[j] = m.pf[j+1] + m.area[j]
	}
	// Tide: a velocity amplitude at the mouth converts through the prism.
	m.a1, m.a2 = cfg.Tide.M2Amplitude, cfg.Tide.S2Amplitude
	conv := m.bf[0] * m.hf[0] / m.pf[0]
	if cfg.Tide.M2Velocity > 0 {
		m.a1 = cfg.Tide.M2Velocity * conv / omegaM2
	}
	if cfg.Tide.S2Velocity > 0 {
		m.a2 = cfg.Tide.S2Velocity * conv / omegaS2
	}
	hmin := math.Inf(1)
	for _, h := range m.h {
		hmin = math.Min(hmin, h)
	}
	if m.a1+m.a2 > 0.9*hmin {
		return nil, fmt.Errorf("mixing: tide: spring elevation amplitude %g m (M2 %g m + S2 %g m) is outside [0, %g] m, 0.9 of the smallest depth %g m",
			m.a1+m.a2, m.a1, m.a2, 0.9*hmin, hmin)
	}
	nt := 2 + m.nc
	m.conc = make([][Layers][]float64, nt)
	for t := range m.conc {
		for k := 0; k < Layers; k++ {
			m.conc[t][k] = mk(n)
		}
	}
	m.bed = make([][]float64, m.nc)
	for c := range m.bed {
		m.bed[c] = mk(n)
		for i := range m.bed[c] {
			m.bed[c][i] = cfg.Sediment[c].BedInventory
		}
	}
	for k := 0; k < Layers; k++ {
		m.vol[k] = mk(n)
		m.q[k] = mk(n + 1)
		m.u[k] = mk(n)
		m.g[k] = mk(n)
		m.saltFlux[k] = mk(n + 1)
		m.halfc[k], m.dcoef[k], m.inv[k] = mk(n+1), mk(n+1), mk(n)
	}
	m.sfilt, m.dsfilt = mk(n), mk(n)
	m.ri, m.damp, m.cum, m.sint = mk(n), mk(n), mk(n+1), mk(n+1)
	m.q2res, m.f2f, m.kh, m.phi2 = mk(n+1), mk(n+1), mk(n+1), mk(n+1)
	m.w, m.umean, m.taub, m.xv = mk(n), mk(n), mk(n), mk(n)
	m.flux, m.mass = mk(n+1), mk(Layers*n)
	m.local = make([]Local, n*Layers)
	m.ws = mk(n * Layers * m.nc)
	m.bnd = mk(2 * nt)
	m.inflow = mk(nt)
	for i := 0; i < n; i++ {
		for t := 0; t < nt; t++ {
			v := 0.0
			switch t {
			case 0:
				v = cfg.Run.InitialSalinity
			case 1:
				v = cfg.River.Temperature
			}
			m.conc[t][0][i], m.conc[t][1][i] = v, v
		}
		m.sfilt[i] = cfg.Run.InitialSalinity
	}
	m.qr = m.river(0)
	m.exchange()
	for i := 0; i < n; i++ {
		f := 0.5 * (m.f2f[i] + m.f2f[i+1])
		vt := m.area[i] * m.h[i]
		m.vol[1][i] = f * vt
		m.vol[0][i] = vt - m.vol[1][i]
	}
	m.transports(m.tideRate(0))
	m.kinematics()
	if m.nc > 0 {
		if err := m.settle(0); err != nil {
			return nil, err
		}
	}
	m.acc.init(m)
	return m, nil
}

// at returns width and depth at x (m from the mouth).
func (g *Geometry) at(x float64) (b, h float64) {
	if len(g.Table) == 0 {
		b = g.MouthWidth
		if g.WidthConvergence > 0 {
			b *= math.Exp(-x / g.WidthConvergence)
		}
		return b, g.Depth
	}
	t := g.Table
	if x <= t[0].X {
		return t[0].Width, t[0].Depth
	}
	for i := 1; i < len(t); i++ {
		if x <= t[i].X {
			f := (x - t[i-1].X) / (t[i].X - t[i-1].X)
			return t[i-1].Width + f*(t[i].Width-t[i-1].Width), t[i-1].Depth + f*(t[i].Depth-t[i-1].Depth)
		}
	}
	l := t[len(t)-1]
	return l.Width, l.Depth
}

// Time returns the model time, s from the start.
func (m *Model) Time() float64 { return m.t }

func (m *Model) river(t float64) float64 {
	if len(m.cfg.River.Series.Time) > 0 {
		return m.cfg.River.Series.at(t)
	}
	return m.cfg.River.Discharge
}

// eta is the (spatially uniform) tidal elevation, m.
func (m *Model) eta(t float64) float64 {
	return m.a1*math.Sin(omegaM2*t) + m.a2*math.Sin(omegaS2*t)
}

func (m *Model) tideRate(t float64) float64 {
	return m.a1*omegaM2*math.Cos(omegaM2*t) + m.a2*omegaS2*math.Cos(omegaS2*t)
}

// envelope is the amplitude of dη/dt at time t (spring–neap envelope), m s⁻¹.
func (m *Model) envelope(t float64) float64 {
	p, r := m.a1*omegaM2, m.a2*omegaS2
	return math.Sqrt(math.Max(0, p*p+r*r+2*p*r*math.Cos((omegaS2-omegaM2)*t)))
}

// tidalVelocity is the amplitude of the section-mean tidal current at face j.
func (m *Model) tidalVelocity(j int, env float64) float64 {
	return env * m.pf[j] / (m.bf[j] * m.hf[j])
}

// exchange sets the residual lower-layer transport, the interface and the
// dispersion coefficient at every face from the filtered salinity field.
func (m *Model) exchange() {
	cl := m.cfg.Closure
	beta := cl.HalineContraction
	env := m.envelope(m.t)
	fmin := cl.MinLayerFraction
	m.sbarIntegral()
	for j := 0; j <= m.n; j++ {
		bf, hf := m.bf[j], m.hf[j]
		ut := m.tidalVelocity(j, env)
		km := cl.MixingCoefficient*cl.DragCoefficient*ut*hf + cl.BackgroundMixing
		sx := 0.0
		if j < m.n {
			// gradient over one peak-to-peak tidal excursion 2U_T/ω (at least a cell)
			half := math.Max(ut/omegaM2, 0.5*m.dx)
			// as the difference of the means over the seaward and the
			// landward half excursion: a two-point difference across the
			// excursion responds fully to a 2Δx mode and, with weak
			// vertical mixing, lets one grow (doc.go, Numerics)
			x := m.xf[j]
			i0, i1, i2 := m.sbarBelow(x-half), m.sbarBelow(x), m.sbarBelow(x+half)
			sx = ((i1 - i0) - (i2 - i1)) / (half * half)
		}
		if sx < 0 {
			sx = 0
		}
		km += InterfacialViscosity(sx, hf, cl.InterfaceFriction, beta)
		km = math.Max(km, 1e-9) // floor: no tide, no background and no gradient
		p := Profile{River: m.qr / (bf * hf), Exchange: ExchangeVelocity(sx, hf, km, beta)}
		zi, _ := p.Crossing()
		zi = math.Max(zi, -1+fmin)
		zi = math.Min(zi, -fmin)
		q2 := -bf * hf * p.Below(zi)
		if q2 > 0 {
			ds := 0.0
			if j > 0 && j < m.n {
				ds = 0.5 * (m.dsfilt[j-1] + m.dsfilt[j])
			} else if j == 0 {
				ds = m.dsfilt[0]
			}
			// density contrast: at least the Hansen–Rattray estimate, at most sea against river water
			ds = math.Min(math.Max(ds, StratificationHR(p, hf, 1, beta)), m.cfg.Ocean.Salinity)
			gp := gravity * beta * ds
			if lim := bf * HydraulicLimit(m.qr/bf, -zi*hf, (1+zi)*hf, gp); q2 > lim {
				// hydraulic control: the interface moves to the position of maximal exchange
				qm, a := MaximalExchange(m.qr/bf, hf, gp, fmin)
				q2 = math.Min(q2, bf*qm)
				zi = -a
			}
		}
		m.q2res[j], m.f2f[j] = q2, 1+zi
		// 1/7-power velocity profile u ∝ (z_b/H)^(1/7) (common practice):
		// the layer below fraction f of the depth carries f^(8/7) of the transport.
		m.phi2[j] = math.Exp(8.0 / 7 * math.Log(1+zi))
		m.kh[j] = cl.DispersionCoeff * ut * bf
	}
	m.richardson(env)
}

// sbarIntegral sets the prefix integrals of the piecewise-linear filtered
// depth-mean salinity between cell centres (sint[k+1] = ∫ from the ghost sea
// node at −Δx/2 to centre k), for sbarBelow.
func (m *Model) sbarIntegral() {
	prev := m.cfg.Ocean.Salinity
	m.sint[0] = 0
	for k := 0; k < m.n; k++ {
		m.sint[k+1] = m.sint[k] + 0.5*m.dx*(prev+m.sfilt[k])
		prev = m.sfilt[k]
	}
}

// sbarBelow returns ∫ s̄ dx from the ghost sea node (x = −Δx/2) to x of the
// filtered depth-mean salinity interpolated linearly between cell centres;
// seaward of the ghost node s̄ is the ocean value, landward of the last centre
// it is constant.
func (m *Model) sbarBelow(x float64) float64 {
	n := m.n
	f := x/m.dx - 0.5 // fractional cell index; the ghost node is at −1
	switch {
	case f <= -1:
		return (f + 1) * m.dx * m.cfg.Ocean.Salinity
	case f >= float64(n-1):
		return m.sint[n] + (f-float64(n-1))*m.dx*m.sfilt[n-1]
	}
	k := int(math.Floor(f)) // −1 … n−2
	r := f - float64(k)
	v0 := m.cfg.Ocean.Salinity
	if k >= 0 {
		v0 = m.sfilt[k]
	}
	v1 := m.sfilt[k+1]
	return m.sint[k+1] + r*m.dx*(v0+0.5*r*(v1-v0))
}

// transports sets the face transports per layer for a tidal elevation rate
// (m s⁻¹) and the vertical transport w in each cell.
func (m *Model) transports(rate float64) {
	for j := 0; j <= m.n; j++ {
		qt := m.pf[j] * rate
		q2 := m.q2res[j] + m.phi2[j]*qt
		m.q[1][j] = q2
		m.q[0][j] = qt - m.qr - q2
	}
	for i := 0; i < m.n; i++ {
		vt := m.vol[0][i] + m.vol[1][i]
		target := 0.5 * (m.f2f[i] + m.f2f[i+1]) * vt
		m.w[i] = m.q[1][i] - m.q[1][i+1] + (m.vol[1][i]-target)/relaxTime
	}
}

// kinematics sets layer velocities, depth-mean velocity, bed stress, mixing
// and shear rate from the current transports and volumes.
func (m *Model) kinematics() {
	cl := m.cfg.Closure
	beta := cl.HalineContraction
	cd := cl.DragCoefficient
	sq := math.Sqrt(cd)
	for i := 0; i < m.n; i++ {
		var hk [Layers]float64
		qs := 0.0
		for k := 0; k < Layers; k++ {
			hk[k] = m.vol[k][i] / m.area[i]
			qc := 0.5 * (m.q[k][i] + m.q[k][i+1])
			qs += qc
			m.u[k][i] = qc / (m.b[i] * hk[k])
		}
		htot := hk[0] + hk[1]
		um := qs / (m.b[i] * htot)
		m.umean[i] = um
		// Bed stress, bed-generated turbulence and mixing follow the near-bed
		// (lower-layer) velocity: under an arrested wedge they vanish.
		ub := m.u[1][i]
		sb := m.conc[0][1][i]
		rho := rhoFresh * (1 + beta*sb)
		m.taub[i] = rho * cd * ub * ub
		// Dissipation: log layer below, log layer plus interfacial shear above.
		us := sq * math.Abs(ub)
		us3 := us * us * us
		h2 := hk[1]
		e1, e2 := logLayerDissipation(us3, htot, h2, sq)
		du := math.Abs(m.u[0][i] - m.u[1][i])
		e1 += cl.InterfaceFriction * du * du * du / hk[0]
		// Vertical exchange velocity between the layers: tidal mixing
		// K_S/(H/2) with K_S = a·C_D·(π/2)|u|·H·f(Ri_b) + K₀ (unstratified
		// tidal mean a·C_D·U_T·H, equal to K_M as in MacCready 2004; f the
		// Munk–Anderson damping of the bulk layer Richardson number set by
		// richardson, see doc.go), plus, with Closure.Entrainment set, entrainment by the residual
		// exchange-flow shear Δu_r, w_e = E(Ri)·Δu_r (Turner form) with the layer
		// Richardson number Ri = g'·h1·h2/(H·Δu_r²).
		ks := cl.MixingCoefficient*cd*0.5*math.Pi*math.Abs(ub)*htot*m.damp[i] + cl.BackgroundMixing
		xv := ks / (0.5 * htot)
		// residual (exchange-flow) shear between the layers
		q2 := 0.5 * (m.q2res[i] + m.q2res[i+1])
		dur := math.Abs((-m.qr-q2)/(m.b[i]*hk[0]) - q2/(m.b[i]*h2))
		if dur > 0 && cl.Entrainment.A > 0 {
			gp := gravity * beta * math.Max(0, m.conc[0][1][i]-m.conc[0][0][i])
			ri := gp * hk[0] * h2 / (htot * dur * dur)
			xv += cl.Entrainment.Coefficient(ri) * dur
		}
		m.xv[i] = xv
		m.g[1][i] = math.Sqrt(e2 / viscosity(m.conc[1][1][i]))
		m.g[0][i] = math.Sqrt(e1 / viscosity(m.conc[1][0][i]))
	}
}

// logLayerDissipation returns the mean dissipation rate (W kg⁻¹) in the
// upper (h2 < z < H) and lower (z0 < z < h2) layer of a log layer,
// ε = u*³/(κz) (common practice), given u*³, depth H, lower-layer thickness h2
// and √C_D. The roughness z0 follows from the depth-mean log law
// C_D = (κ/(ln(H/z0) − 1))², so ln(h2/z0) = ln(h2/H) + 1 + κ/√C_D; the lower
// layer's log factor is kept ≥ 1 for layers thinner than e·z0. The
// thickness-weighted mean is u*³·ln(H/z0)/(κH).
func logLayerDissipation(us3, h, h2, sqcd float64) (upper, lower float64) {
	lr := math.Log(h2 / h)
	lower = us3 * math.Max(lr+1+kappa/sqcd, 1) / (kappa * h2)
	upper = us3 * (-lr) / (kappa * (h - h2))
	return upper, lower
}

// viscosity of water, m² s⁻¹, at temperature tc (°C): Vogel equation
// μ = 2.414e-5·10^(247.8/(T − 140)) Pa s (T in K; fit to handbook values, from
// memory), over ρ = 1000 kg m⁻³. Within 2.5 % of handbook values over 0–40 °C
// (2.2 % low at 0 °C); below 0 °C it is extrapolated.
// The model reads it from a 0.1 °C table over [−2, 40] °C (interpolation error < 1e-5 relative).
func viscosity(tc float64) float64 {
	f := (tc - viscT0) / viscDT
	if !(f > 0) {
		return viscTable[0]
	}
	i := int(f)
	if i >= len(viscTable)-1 {
		return viscTable[len(viscTable)-1]
	}
	r := f - float64(i)
	return viscTable[i] + r*(viscTable[i+1]-viscTable[i])
}

func vogel(tc float64) float64 {
	tk := tc + 273.15
	return 2.414e-5 * math.Pow(10, 247.8/(tk-140)) / rhoFresh
}

const (
	viscT0 = -2.0
	viscDT = 0.1
)

var viscTable = func() []float64 {
	t := make([]float64, 421)
	for i := range t {
		t[i] = vogel(viscT0 + viscDT*float64(i))
	}
	return t
}()

func (m *Model) settle(dt float64) error {
	nc := m.nc
	for i := 0; i < m.n; i++ {
		for k := 0; k < Layers; k++ {
			l := &m.local[i*Layers+k]
			l.Cell, l.Layer = i, k
			l.Salinity = m.conc[0][k][i]
			l.Temperature = m.conc[1][k][i]
			l.ShearRate = m.g[k][i]
			l.Depth = (m.vol[0][i] + m.vol[1][i]) / m.area[i]
			l.Thickness = m.vol[k][i] / m.area[i]
			if l.Concentration == nil {
				l.Concentration = make([]float64, nc)
			}
			tot := 0.0
			for c := 0; c < nc; c++ {
				v := m.conc[2+c][k][i]
				l.Concentration[c] = v
				tot += v
			}
			l.Total = tot
		}
	}
	if err := m.set.Velocities(dt, m.local, m.ws); err != nil {
		return err
	}
	for idx, v := range m.ws {
		if !(v >= 0) || math.IsInf(v, 0) {
			cell := idx / (Layers * nc)
			return fmt.Errorf("mixing: settling velocity of class %d in cell %d layer %d is %g m/s; need finite ≥ 0 m/s",
				idx%nc, cell, (idx/nc)%Layers, v)
		}
	}
	return nil
}

// boundaries fills the ocean and river values of every tracer.
func (m *Model) boundaries() {
	nt := 2 + m.nc
	m.bnd[0], m.bnd[nt] = m.cfg.Ocean.Salinity, 0
	m.bnd[1], m.bnd[nt+1] = m.cfg.Ocean.Temperature, m.cfg.River.Temperature
	for c, k := range m.cfg.Sediment {
		m.bnd[2+c] = k.Ocean
		v := 0.0
		if m.qr > 0 {
			v = k.RatingA * math.Pow(m.qr, k.RatingB)
		}
		m.bnd[nt+2+c] = v
	}
}

// conductances sets the dispersion conductance K_H·h_k·B/Δx (m³ s⁻¹) of
// every face and layer from the present volumes; at the mouth it couples the
// first cell to the sea, at the head it is zero.
func (m *Model) conductances() {
	n := m.n
	for k := 0; k < Layers; k++ {
		v, dc := m.vol[k], m.dcoef[k]
		for j := 1; j < n; j++ {
			hk := 0.5 * (v[j-1]/m.area[j-1] + v[j]/m.area[j])
			dc[j] = m.kh[j] * hk * m.bf[j] / m.dx
		}
		dc[0] = m.kh[0] * v[0] / m.area[0] * m.bf[0] / m.dx
		dc[n] = 0
	}
}

// stepLimit returns the largest stable step (s) for the current transports.
func (m *Model) stepLimit() float64 {
	cfl := m.cfg.Run.Courant
	dt := m.cfg.Run.MaxStep
	for i := 0; i < m.n; i++ {
		for k := 0; k < Layers; k++ {
			out := 0.0
			if m.q[k][i] < 0 {
				out -= m.q[k][i]
			}
			if m.q[k][i+1] > 0 {
				out += m.q[k][i+1]
			}
			if (k == 1 && m.w[i] > 0) || (k == 0 && m.w[i] < 0) {
				out += math.Abs(m.w[i])
			}
			out += m.dcoef[k][i] + m.dcoef[k][i+1]
			if out > 0 {
				dt = math.Min(dt, cfl*m.vol[k][i]/out)
			}
		}
	}
	return dt
}

// Step advances the model by one automatically chosen stable step, ending at
// the next output time, tidal-cycle boundary or the end of the run if sooner.
// It allocates nothing.
func (m *Model) Step() error {
	end := m.cfg.Run.Duration
	if m.t >= end {
		return nil
	}
	if m.acc.done {
		m.acc.reset() // the caller (Run) has had the finished cycle
	}
	m.qr = m.river(m.t)
	m.boundaries()
	if m.t >= m.nextExchange {
		m.exchange()
		m.nextExchange = m.t + exchangeInterval
	}
	m.transports(m.tideRate(m.t))
	m.conductances()
	dt := m.stepLimit()
	next := m.acc.nextEvent(m, end)
	t1 := m.t + dt
	if t1 >= next-1e-6*dt {
		dt, t1 = next-m.t, next // land exactly on the event
	}
	if !(dt > 0) {
		return fmt.Errorf("mixing: time step %g s at t = %g s (numerical failure; report it)", dt, m.t)
	}
	rate := (m.eta(t1) - m.eta(m.t)) / dt
	m.transports(rate)
	m.kinematics()
	if m.nc > 0 {
		if err := m.settle(dt); err != nil {
			return err
		}
	}
	m.advect(dt)
	m.vertical(dt)
	for i := 0; i < m.n; i++ {
		if !(m.vol[0][i] > 0) || !(m.vol[1][i] > 0) || math.IsInf(m.vol[0][i]+m.vol[1][i], 0) {
			return fmt.Errorf("mixing: layer volume in cell %d became %g, %g m³ at t = %g s (numerical failure; report it)",
				i, m.vol[0][i], m.vol[1][i], t1)
		}
	}
	m.t = t1
	// tidal filter of depth-mean salinity and stratification
	f := dt / (filterTime + dt)
	for i := 0; i < m.n; i++ {
		vt := m.vol[0][i] + m.vol[1][i]
		sm := (m.vol[0][i]*m.conc[0][0][i] + m.vol[1][i]*m.conc[0][1][i]) / vt
		m.sfilt[i] += f * (sm - m.sfilt[i])
		m.dsfilt[i] += f * (m.conc[0][1][i] - m.conc[0][0][i] - m.dsfilt[i])
	}
	m.acc.add(m, dt)
	return nil
}

// advect moves every tracer along each layer (flux-limited upwind with the
// van Leer 1974 limiter, Sweby 1984 form) and between the layers (upwind), then
// updates the volumes. Fluxes use the concentrations at the start of the step.
func (m *Model) advect(dt float64) {
	n := m.n
	nt := 2 + m.nc
	// per face and layer: half (1 − Courant number)
	for k := 0; k < Layers; k++ {
		v, q := m.vol[k], m.q[k]
		hc := m.halfc[k]
		for j := 1; j < n; j++ {
			vd := v[j]
			if q[j] > 0 {
				vd = v[j-1]
			}
			hc[j] = 0.5 * (1 - math.Abs(q[j])*dt/vd)
		}
	}
	for i := 0; i < n; i++ {
		w := m.w[i]
		m.inv[0][i] = 1 / (m.vol[0][i] + dt*(m.q[0][i]-m.q[0][i+1]+w))
		m.inv[1][i] = 1 / (m.vol[1][i] + dt*(m.q[1][i]-m.q[1][i+1]-w))
	}
	for t := 0; t < nt; t++ {
		ocean, river := m.bnd[t], m.bnd[nt+t]
		for k := 0; k < Layers; k++ {
			c := m.conc[t][k]
			q := m.q[k]
			hc, dc := m.halfc[k], m.dcoef[k]
			fl := m.flux
			// mouth
			if q[0] > 0 {
				fl[0] = q[0]*ocean + dc[0]*(ocean-c[0])
			} else {
				fl[0] = q[0]*c[0] + dc[0]*(ocean-c[0])
			}
			for j := 1; j < n; j++ {
				qj := q[j]
				var d, r, up float64
				if qj > 0 {
					d, r = c[j-1], c[j]
					if j >= 2 {
						up = c[j-2]
					} else {
						up = ocean
					}
				} else {
					d, r = c[j], c[j-1]
					if j+1 < n {
						up = c[j+1]
					} else {
						up = river
					}
				}
				cf := d
				if den := r - d; den != 0 {
					rr := (d - up) / den
					ar := math.Abs(rr)
					cf = d + (rr+ar)/(1+ar)*hc[j]*den
				}
				fl[j] = qj*cf + dc[j]*(c[j-1]-c[j])
			}
			// head
			if q[n] < 0 {
				fl[n] = q[n] * river
			} else {
				fl[n] = q[n] * c[n-1]
			}
			if t == 0 {
				copy(m.saltFlux[k], fl)
			}
			m.inflow[t] += dt * (fl[0] - fl[n])
			mk := m.mass[k*n : (k+1)*n]
			v := m.vol[k]
			for i := 0; i < n; i++ {
				mk[i] = c[i]*v[i] + dt*(fl[i]-fl[i+1])
			}
		}
		cu, cl := m.conc[t][0], m.conc[t][1]
		for i := 0; i < n; i++ {
			w := m.w[i]
			fx := w * cu[i]
			if w > 0 {
				fx = w * cl[i]
			}
			cu[i] = (m.mass[i] + dt*fx) * m.inv[0][i]
			cl[i] = (m.mass[n+i] - dt*fx) * m.inv[1][i]
		}
	}
	m.waterIn += dt * (m.q[0][0] + m.q[1][0] - m.q[0][n] - m.q[1][n])
	for i := 0; i < n; i++ {
		w := m.w[i]
		m.vol[0][i] += dt * (m.q[0][i] - m.q[0][i+1] + w)
		m.vol[1][i] += dt * (m.q[1][i] - m.q[1][i+1] - w)
	}
}

func errNonFinite(t float64, layer, cell int) error {
	return fmt.Errorf("mixing: state became non-finite at t = %g s, layer %d, cell %d (numerical failure; report it)", t, layer, cell)
}
