package mixing

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// TestExchangeVelocityCheckValues: u_E = gβ s_x H³/(48 K_M) with
// K_M = 0.028 C_D U_T H, C_D = 2.5e-3, s_x = 6e-4 PSU/m (research note §A3.3
// table, computed by checkvalues.py with g = 9.81).
func TestExchangeVelocityCheckValues(t *testing.T) {
	const tol = 5e-3 // the table gives three significant figures
	for _, c := range []struct{ h, ut, km, ue float64 }{
		{10, 1, 7.0e-4, 0.135},
		{20, 1, 1.4e-3, 0.540},
		{10, 0.5, 3.5e-4, 0.270},
	} {
		km := 0.028 * 2.5e-3 * c.ut * c.h
		if math.Abs(km-c.km) > tol*c.km {
			t.Errorf("K_M(H=%g, U_T=%g) = %.4g, want %.4g", c.h, c.ut, km, c.km)
		}
		if ue := ExchangeVelocity(6e-4, c.h, km, 7.7e-4); math.Abs(ue-c.ue) > tol*c.ue {
			t.Errorf("u_E(H=%g, U_T=%g) = %.4g, want %.4g", c.h, c.ut, ue, c.ue)
		}
	}
}

// TestProfileIdentities: P1 has unit mean and P2 zero mean over the depth;
// P2 reverses at ζ = (−1 − √33)/16 (root of 1 − ζ − 8ζ²); landward bottom flow
// exists only for u_E > U_R/2 (sign of 3U_R − 6u_E at the bed); the crossing is
// a root of u(ζ). Checked with gonum's Gauss–Legendre quadrature as an
// independent integrator (polynomials: exact).
func TestProfileIdentities(t *testing.T) {
	const tol = 1e-12 // polynomial algebra, round-off only
	for _, p := range []Profile{{1, 0}, {0, 1}, {0.3, 0.7}, {0.05, 0.4}} {
		q := quad.Fixed(p.At, -1, 0, 8, quad.Legendre{}, 0)
		if want := p.River; math.Abs(q-want) > tol {
			t.Errorf("%+v: depth mean %.15g, want %g", p, q, want)
		}
		for _, z := range []float64{-0.9, -0.5, -0.2, 0} {
			qz := quad.Fixed(p.At, -1, z, 8, quad.Legendre{}, 0)
			if math.Abs(qz-p.Below(z)) > tol {
				t.Errorf("%+v: Below(%g) = %.15g, quadrature %.15g", p, z, p.Below(z), qz)
			}
		}
		z, ok := p.Crossing()
		if want := p.Exchange > p.River/2; ok != want {
			t.Errorf("%+v: crossing ok = %v, want %v", p, ok, want)
		}
		if ok && math.Abs(p.At(z)) > tol {
			t.Errorf("%+v: u(ζ0 = %g) = %g, want 0", p, z, p.At(z))
		}
	}
	z, _ := Profile{Exchange: 1}.Crossing()
	if want := (-1 - math.Sqrt(33)) / 16; math.Abs(z-want) > tol {
		t.Errorf("pure exchange reversal %g, want %g", z, want)
	}
}

// TestHydraulicLimit: at the returned transport the composite Froude number
// F1² + F2² equals 1 (Armi & Farmer 1986 criticality); zero when the river
// alone is critical; MaximalExchange agrees with a brute-force scan.
func TestHydraulicLimit(t *testing.T) {
	const tol = 1e-10
	gp := 0.2
	for _, c := range [][3]float64{{0.5, 4, 6}, {2, 7, 3}, {0.01, 5, 5}} {
		qr, h1, h2 := c[0], c[1], c[2]
		q := HydraulicLimit(qr, h1, h2, gp)
		g2 := (qr+q)*(qr+q)/(gp*h1*h1*h1) + q*q/(gp*h2*h2*h2)
		if math.Abs(g2-1) > tol {
			t.Errorf("%v: G² = %.12g at the limit, want 1", c, g2)
		}
	}
	if q := HydraulicLimit(math.Sqrt(gp*125)*1.01, 5, 5, gp); q != 0 {
		t.Errorf("supercritical river: limit %g, want 0", q)
	}
	const scanTol = 1e-6 // relative: scan step 1e-5 in a, maximum is flat
	qr, h := 1.0, 10.0
	best := 0.0
	for a := 0.1; a <= 0.9; a += 1e-5 {
		best = math.Max(best, HydraulicLimit(qr, a*h, (1-a)*h, gp))
	}
	if q, _ := MaximalExchange(qr, h, gp, 0.1); math.Abs(q-best) > scanTol*best {
		t.Errorf("MaximalExchange %.10g, scan %.10g", q, best)
	}
}

// TestWedgeLength: Schijf & Schönfeld (1953) lengths for h = 10 m,
// ε = Δρ/ρ = 0.025, c_i = 3e-4 (research note §A2.3 table, checkvalues.py,
// g = 9.81); the closed form equals the quadrature of its own interface
// equation dx/da = h(a³ − F²)(1 − a)/(c_i F²) from a0 = F^(2/3) to 1; L → 0 as
// F → 1; error for bad input.
func TestWedgeLength(t *testing.T) {
	const tableTol = 5e-3 // three significant figures in the table
	const quadTol = 1e-10 // Gauss–Legendre on a degree-4 polynomial: round-off
	gp := 0.025 * gravity
	for _, c := range [][2]float64{{0.1, 396e3}, {0.2, 91.2e3}, {0.4, 17.3e3}} {
		l, err := WedgeLength(10, gp, c[0], 3e-4)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(l-c[1]) > tableTol*c[1] {
			t.Errorf("u_r = %g: L = %.4g m, want %.4g", c[0], l, c[1])
		}
		f := c[0] / math.Sqrt(gp*10)
		ode := func(a float64) float64 { return 10 * (a*a*a - f*f) * (1 - a) / (3e-4 * f * f) }
		q := quad.Fixed(ode, math.Cbrt(f*f), 1, 4, quad.Legendre{}, 0)
		if math.Abs(q-l) > quadTol*l {
			t.Errorf("u_r = %g: closed form %.10g, quadrature %.10g", c[0], l, q)
		}
	}
	c0 := math.Sqrt(gp * 10)
	prev := math.Inf(1)
	for _, f := range []float64{0.9, 0.99, 0.999, 1, 1.5} {
		l, err := WedgeLength(10, gp, f*c0, 3e-4)
		if err != nil {
			t.Fatal(err)
		}
		if l > prev || l < 0 {
			t.Errorf("F = %g: L = %g not shrinking towards 0", f, l)
		}
		prev = l
	}
	if prev != 0 {
		t.Errorf("F ≥ 1: L = %g, want 0", prev)
	}
	if _, err := WedgeLength(-1, gp, 0.1, 3e-4); err == nil {
		t.Error("negative depth accepted")
	}
}

// TestRegimeCheckValues: MacCready's example (research note §A1.1: H = 10 m,
// A = 5e4 m², Q_R = 1500 m³/s, β = 7.7e-4, s = 35, ω = 1.4e-4 s⁻¹, C_D = 3e-3,
// g = 9.8) gives Fr_f = 0.0185 and M = 1.378 (spring, U_T = 1.2 m/s) or 0.689
// (neap, 0.6 m/s): SIPS at spring, partially mixed at neap by the polygon
// digitisation. The model uses g = 9.81: 0.05 % in Fr_f, 0.03 % in M.
func TestRegimeCheckValues(t *testing.T) {
	const tol = 2e-3 // table rounding (3–4 figures) plus the g difference
	for _, c := range []struct {
		ut, fr, m float64
		class     RegimeClass
	}{{1.2, 0.0185, 1.378, SIPS}, {0.6, 0.0185, 0.689, PartiallyMixed}} {
		r := NewRegime(1500/5e4, c.ut, 10, 35, 3e-3, 7.7e-4, 1.4e-4)
		if math.Abs(r.Froude-c.fr) > tol*c.fr+5e-5 || math.Abs(r.Mixing-c.m) > tol*c.m {
			t.Errorf("U_T = %g: Fr_f = %.4g, M = %.4g; want %.4g, %.4g", c.ut, r.Froude, r.Mixing, c.fr, c.m)
		}
		if r.Class != c.class {
			t.Errorf("U_T = %g: %v, want %v", c.ut, r.Class, c.class)
		}
	}
	// polygon interiors (vertex centroids of the digitisation)
	for _, p := range regimePolys {
		var x, y float64
		for i := range p.m {
			x += math.Log10(p.m[i])
			y += math.Log10(p.f[i])
		}
		x /= float64(len(p.m))
		y /= float64(len(p.m))
		if got := Classify(math.Pow(10, x), math.Pow(10, y)); got != p.class {
			t.Errorf("centroid of %v classified %v", p.class, got)
		}
	}
	if Classify(0.05, 1e-5) != Unclassified || Classify(0, 0.1) != Unclassified {
		t.Error("outside points should be unclassified")
	}
}

// TestViscosity: the tabulated Vogel fit against handbook kinematic
// viscosity of pure water, 1.0034e-6 m²/s at 20 °C and 1.787e-6 at 0 °C
// (CRC Handbook; from memory, dynamic viscosity over 1000 kg/m³).
func TestViscosity(t *testing.T) {
	// The three-constant Vogel fit is 2.2 % low at 0 °C (measured here) and
	// better at 20–30 °C; density 998–1000 kg/m³ adds 0.2 %. G = √(ε/ν) then
	// carries half of it.
	const tol = 0.025
	for _, c := range [][2]float64{{20, 1.002e-6}, {0, 1.792e-6}, {30, 0.797e-6}} {
		if v := viscosity(c[0]); math.Abs(v-c[1]) > tol*c[1] {
			t.Errorf("ν(%g °C) = %.4g, want %.4g", c[0], v, c[1])
		}
	}
	const tableTol = 1e-5 // linear interpolation on 0.1 °C steps
	for tc := -2.0; tc <= 40; tc += 0.37 {
		if v, w := viscosity(tc), vogel(tc); math.Abs(v-w) > tableTol*w {
			t.Errorf("table %.6g vs Vogel %.6g at %g °C", v, w, tc)
		}
	}
}

// TestValidate: bad input returns every problem, each naming the field, the
// value and the allowed range with its unit.
func TestValidate(t *testing.T) {
	if err := (&Config{}).Validate(); err == nil {
		t.Fatal("zero Config accepted")
	}
	def := DefaultConfig()
	if err := def.Validate(); err != nil {
		t.Fatalf("DefaultConfig invalid: %v", err)
	}
	cases := []struct {
		name  string
		edit  func(*Config)
		wants []string
	}{
		{"negative depth", func(c *Config) { c.Geometry.Depth = -3 },
			[]string{"geometry.depth: -3 m is outside (0, 1000] m"}},
		{"zero discharge, no tide", func(c *Config) { c.River.Discharge = 0; c.Tide = Tide{} },
			[]string{"river.discharge: 0 m³/s", "need > 0 m³/s or a tide"}},
		{"gap", func(c *Config) {
			c.River.Series = Series{Time: []float64{0, 86400, 5 * 86400, 40 * 86400}, Value: []float64{100, 120, 90, 100}}
		}, []string{"river.series.time[2]: gap of 345600 s", "max_gap 86400 s"}},
		{"missing value", func(c *Config) {
			c.River.Series = Series{Time: []float64{0, 3e6}, Value: []float64{100, math.NaN()}, MaxGap: 4e6}
		}, []string{"river.series.value[1]: NaN m³/s is outside [0, 1e+06] m³/s"}},
		{"unordered", func(c *Config) {
			c.River.Series = Series{Time: []float64{0, 2e6, 1e6, 3e6}, Value: []float64{1, 1, 1, 1}, MaxGap: 4e6}
		}, []string{"river.series.time[2]: 1e+06 s must exceed the previous 2e+06 s"}},
		{"short series", func(c *Config) {
			c.River.Series = Series{Time: []float64{0, 1e5}, Value: []float64{1, 1}}
		}, []string{"ends before run.duration"}},
		{"several", func(c *Config) {
			c.Geometry.Cells = 1
			c.Ocean.Salinity = 50
			c.Sediment = []Class{{CriticalErosion: 0}}
			c.Tide.M2Velocity = 1
			c.Closure.Damping.Alpha = -1
		}, []string{"closure.damping.alpha: -1 is outside [0, 100]", "geometry.cells: 1 is outside [4, 5000]", "ocean.salinity: 50 PSU is outside (0, 42] PSU",
			"sediment[0].critical_erosion: 0 Pa is outside (0, 100] Pa", "not both"}},
	}
	for _, c := range cases {
		cfg := DefaultConfig()
		c.edit(&cfg)
		err := cfg.Validate()
		if err == nil {
			t.Errorf("%s: accepted", c.name)
			continue
		}
		for _, w := range c.wants {
			if !strings.Contains(err.Error(), w) {
				t.Errorf("%s: error %q lacks %q", c.name, err, w)
			}
		}
		if _, err := New(cfg, nil); err == nil {
			t.Errorf("%s: New accepted", c.name)
		}
	}
	cfg := DefaultConfig()
	cfg.Sediment = []Class{{Name: "mud", CriticalErosion: 0.1}}
	if _, err := New(cfg, nil); err == nil {
		t.Error("sediment without a settling model accepted")
	}
	cfg = DefaultConfig()
	cfg.Geometry.Depth = 2
	if _, err := New(cfg, nil); err == nil || !strings.Contains(err.Error(), "tide: spring elevation amplitude 2 m") {
		t.Errorf("tide deeper than the channel: %v", err)
	}
}

// negativeSettling returns a bad velocity for class 0 in cell 3.
type negativeSettling struct{}

func (negativeSettling) Velocities(_ float64, local []Local, ws []float64) error {
	for i := range ws {
		ws[i] = 1e-4
	}
	ws[3*Layers] = -1
	return nil
}

func TestBadSettling(t *testing.T) {
	cfg := DefaultConfig()
	cfg.Sediment = []Class{{Name: "mud", CriticalErosion: 0.1}}
	_, err := New(cfg, negativeSettling{})
	if err == nil || !strings.Contains(err.Error(), "cell 3") {
		t.Errorf("negative settling velocity: %v", err)
	}
}

// relaxing is a stateful settling model: velocity relaxes towards a target
// that depends on salinity with time scale tau, so it lags the tide.
type relaxing struct {
	tau, sum float64
	calls    int
	w        []float64
	sawConc  bool
}

func (r *relaxing) Velocities(dt float64, local []Local, ws []float64) error {
	if r.w == nil {
		r.w = make([]float64, len(local))
	}
	r.calls++
	r.sum += dt
	for i := range local {
		target := 1e-4 + 1e-4*local[i].Salinity/30
		if dt == 0 {
			r.w[i] = target
		} else {
			r.w[i] += (target - r.w[i]) * dt / (r.tau + dt)
		}
		if local[i].Total > 0 && len(local[i].Concentration) == 1 {
			r.sawConc = true
		}
		ws[i] = r.w[i]
	}
	return nil
}

// TestStatefulSettling: a stateful model is called once at the start with
// dt = 0 and then once per step, the step lengths summing to the run duration
// (the interface contract).
func TestStatefulSettling(t *testing.T) {
	const tol = 1e-9 // relative, summation of step lengths
	cfg := DefaultConfig()
	cfg.Run.Duration = 2 * 86400
	cfg.Sediment = []Class{{Name: "mud", RatingA: 0.05, Ocean: 0.01, CriticalErosion: 0.2}}
	r := &relaxing{tau: 3600}
	res, err := Run(cfg, r)
	if err != nil {
		t.Fatal(err)
	}
	if r.calls != res.Steps+1 {
		t.Errorf("%d calls for %d steps, want steps + 1", r.calls, res.Steps)
	}
	if math.Abs(r.sum-cfg.Run.Duration) > tol*cfg.Run.Duration {
		t.Errorf("step lengths sum to %g s, want %g", r.sum, cfg.Run.Duration)
	}
	if !r.sawConc {
		t.Error("settling model never saw concentrations")
	}
}

// TestStepAllocs: the time step allocates nothing (STYLE.md).
func TestStepAllocs(t *testing.T) {
	cfg := benchConfig()
	cfg.Geometry.Cells = 50
	m, err := New(cfg, ConstantSettling{3e-4, 1e-3})
	if err != nil {
		t.Fatal(err)
	}
	if a := testing.AllocsPerRun(200, func() {
		if err := m.Step(); err != nil {
			t.Fatal(err)
		}
	}); a != 0 {
		t.Errorf("Step allocates %v times", a)
	}
}

// TestSnapshotsAndIndexing: snapshots land exactly on the requested times,
// cycle means are one M2 period apart, and slices have the documented shapes.
func TestSnapshotsAndIndexing(t *testing.T) {
	cfg := DefaultConfig()
	cfg.Run.Duration = 3 * 86400
	cfg.Run.Output = []float64{0, 1000, 86400, 3 * 86400}
	cfg.Sediment = []Class{{Name: "a", CriticalErosion: 0.2}, {Name: "b", CriticalErosion: 0.3}}
	res, err := Run(cfg, ConstantSettling{1e-4, 1e-3})
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Snapshots) != len(cfg.Run.Output) {
		t.Fatalf("%d snapshots, want %d", len(res.Snapshots), len(cfg.Run.Output))
	}
	for i, s := range res.Snapshots {
		if s.Time != cfg.Run.Output[i] {
			t.Errorf("snapshot %d at %g s, want %g", i, s.Time, cfg.Run.Output[i])
		}
		if len(s.Salinity[1]) != cfg.Geometry.Cells || len(s.Concentration[1]) != 2 ||
			len(s.Concentration[1][1]) != cfg.Geometry.Cells || len(s.Transport[0]) != cfg.Geometry.Cells+1 {
			t.Fatalf("snapshot %d has wrong shapes", i)
		}
	}
	if want := int(cfg.Run.Duration / PeriodM2); len(res.Cycles) != want {
		t.Errorf("%d cycles, want %d", len(res.Cycles), want)
	}
	for i := 1; i < len(res.Cycles); i++ {
		if d := res.Cycles[i].Time - res.Cycles[i-1].Time; math.Abs(d-PeriodM2) > 1e-6 {
			t.Errorf("cycle spacing %g s", d)
		}
	}
}

// TestEquivalentInputs: a geometry table describing a prismatic channel
// gives the same run as the prismatic parameters, and a mouth velocity
// amplitude gives the same run as the elevation amplitude it stands for
// through the prism relation U = ω·a·P/(B·H) (identities of the input forms).
func TestEquivalentInputs(t *testing.T) {
	const tol = 1e-9 // PSU; the same arithmetic up to the order of operations
	base := DefaultConfig()
	base.Geometry.WidthConvergence = 0
	base.Run.Duration = 2 * 86400
	tab := base
	g := base.Geometry
	tab.Geometry.Table = []Section{{0, g.MouthWidth, g.Depth}, {g.Length, g.MouthWidth, g.Depth}}
	vel := base
	vel.Tide.M2Amplitude, vel.Tide.S2Amplitude = 0, 0
	// prism of the whole prismatic channel over the mouth section: P/(B·H) = L/H
	vel.Tide.M2Velocity = omegaM2 * base.Tide.M2Amplitude * g.Length / g.Depth
	vel.Tide.S2Velocity = omegaS2 * base.Tide.S2Amplitude * g.Length / g.Depth
	var last []float64
	for i, cfg := range []Config{base, tab, vel} {
		res, err := Run(cfg, nil)
		if err != nil {
			t.Fatal(err)
		}
		s := res.Cycles[len(res.Cycles)-1].Salinity[1]
		if i > 0 {
			for c := range s {
				if math.Abs(s[c]-last[c]) > tol {
					t.Fatalf("input form %d: cell %d salinity %.12g vs %.12g", i, c, s[c], last[c])
				}
			}
		}
		last = s
	}
}

// TestShearRate: the layer dissipation rates average to the depth-mean log
// layer value, and for u* = 0.05 m/s, H = 10 m, z0 = 1 mm, ν = 1e-6 m²/s the
// depth-mean shear rate is Ḡ = √(ε̄/ν) = 16.8 s⁻¹ (research note §B4 table,
// checkvalues.py).
func TestShearRate(t *testing.T) {
	const tol = 3e-3 // the table gives three figures
	h, z0, us := 10.0, 1e-3, 0.05
	sq := kappa / (math.Log(h/z0) - 1) // √C_D for this z0
	for _, h2 := range []float64{1, 3, 5, 8} {
		e1, e2 := logLayerDissipation(us*us*us, h, h2, sq)
		mean := (e1*(h-h2) + e2*h2) / h
		want := us * us * us * math.Log(h/z0) / (kappa * h)
		if math.Abs(mean-want) > 1e-12*want {
			t.Errorf("h2 = %g: mean ε %.10g, log layer %.10g", h2, mean, want)
		}
		if g := math.Sqrt(mean / 1e-6); math.Abs(g-16.8) > tol*16.8 {
			t.Errorf("Ḡ = %.4g s⁻¹, want 16.8", g)
		}
	}
}

// TestSettlingFunc: a stateless SettlingFunc that returns each class's
// constant gives the same run as ConstantSettling, and it is asked for every
// class index (identity of the two adapters).
func TestSettlingFunc(t *testing.T) {
	cfg := DefaultConfig()
	cfg.Run.Duration = 86400
	cfg.Sediment = benchConfig().Sediment
	ws := ConstantSettling{3e-4, 2e-3}
	seen := map[int]bool{}
	f := SettlingFunc(func(class int, c *Local) float64 {
		seen[class] = true
		return ws[class]
	})
	ra, err := Run(cfg, ws)
	if err != nil {
		t.Fatal(err)
	}
	rb, err := Run(cfg, f)
	if err != nil {
		t.Fatal(err)
	}
	if len(seen) != 2 {
		t.Errorf("classes asked: %v", seen)
	}
	a, b := lastCycle(t, ra), lastCycle(t, rb)
	for c := range a.BedMass {
		for i := range a.BedMass[c] {
			if a.BedMass[c][i] != b.BedMass[c][i] || a.Concentration[1][c][i] != b.Concentration[1][c][i] {
				t.Fatalf("class %d cell %d differs", c, i)
			}
		}
	}
}
