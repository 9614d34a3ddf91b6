package floc

import (
	"math"
	"strings"
	"testing"
)

// The check values in these tables come from the research note
// estuary-and-flocs.md §B1–B2, where an independent script (checkvalues.py,
// outside this module) evaluated the published relations of Kranenburg
// (1994) and Winterwerp (1998); they are printed there to three figures.
const threeFigures = 6e-3 // half a unit in the third significant figure, relative

func TestAggregateKranenburg(t *testing.T) {
	// Source: research note §B1 check-value table (ρ_s = 2650, ρ_w = 1020,
	// D_p = 4 µm), from Kranenburg (1994) N = (D/D_p)^n_f, φ = (D/D_p)^(n_f−3).
	cases := []struct {
		nf, d          float64
		phi, drho, num float64
	}{
		{1.7, 100e-6, 0.0152, 24.8, 238},
		{2.0, 20e-6, 0.200, 326, 25},
		{2.0, 100e-6, 0.040, 65.2, 625},
		{2.0, 300e-6, 0.0133, 21.7, 5625},
		{2.3, 100e-6, 0.105, 171, 1642},
	}
	for _, c := range cases {
		f := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: c.nf}
		a, err := f.Aggregate(c.d, 1020)
		if err != nil {
			t.Fatal(err)
		}
		for _, q := range []struct {
			name      string
			got, want float64
		}{{"φ", a.SolidFraction, c.phi}, {"Δρ", a.ExcessDensity, c.drho}, {"N", a.Primaries, c.num}} {
			tol := threeFigures
			if q.name == "N" {
				tol = 0.5 / q.want // printed as a rounded integer
			}
			if math.Abs(q.got/q.want-1) > tol {
				t.Errorf("n_f=%g D=%g: %s = %.5g, want %.4g", c.nf, c.d, q.name, q.got, q.want)
			}
		}
		// Identity: dry mass = N primaries' mass (pure geometry).
		mp := 2650 * math.Pi * math.Pow(4e-6, 3) / 6
		if math.Abs(a.DryMass/(a.Primaries*mp)-1) > 1e-12 {
			t.Errorf("dry mass %g != N·m_p %g", a.DryMass, a.Primaries*mp)
		}
		if math.Abs(a.Porosity+a.SolidFraction-1) > 1e-15 {
			t.Errorf("porosity + solid fraction = %g", a.Porosity+a.SolidFraction)
		}
	}
}

func TestAggregateLimits(t *testing.T) {
	// A floc of one primary is that primary, solid, for any n_f; n_f = 3 is
	// solid at every size (Kranenburg 1994 relations; limits).
	for _, nf := range []float64{1.2, 2, 2.7, 3} {
		f := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: nf}
		a, err := f.Aggregate(4e-6, 1000)
		if err != nil {
			t.Fatal(err)
		}
		if a.Primaries != 1 || a.SolidFraction != 1 || a.ExcessDensity != 1650 {
			t.Errorf("n_f=%g one primary: %+v", nf, a)
		}
	}
	f := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 3}
	a, _ := f.Aggregate(400e-6, 1000)
	if math.Abs(a.SolidFraction-1) > 1e-15 {
		t.Errorf("n_f=3: φ = %g, want 1", a.SolidFraction)
	}
	// Excess density falls with size for n_f < 3 (research note §C item 9).
	prev := math.Inf(1)
	for _, d := range []float64{10e-6, 30e-6, 100e-6, 300e-6, 1000e-6} {
		a, _ := DefaultFractal.Aggregate(d, 1020)
		if a.ExcessDensity >= prev {
			t.Errorf("Δρ not falling at D=%g", d)
		}
		prev = a.ExcessDensity
	}
}

func TestBadInput(t *testing.T) {
	// The issue asks for errors that name field, value and allowed range.
	cases := []struct {
		name string
		err  func() error
		want []string
	}{
		{"dimension high", func() error {
			_, err := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 3.2}.Aggregate(1e-4, 1020)
			return err
		}, []string{"Dimension", "3.2", "(1, 3]"}},
		{"dimension one", func() error {
			_, err := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 1}.Aggregate(1e-4, 1020)
			return err
		}, []string{"Dimension", "= 1 ", "(1, 3]"}},
		{"primary spread", func() error {
			_, err := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 2, PrimaryGSD: 0.5}.Aggregate(1e-4, 1020)
			return err
		}, []string{"PrimaryGSD", "0.5", "[1, 2.5]"}},
		{"floc smaller than primary", func() error {
			_, err := DefaultFractal.Aggregate(2e-6, 1020)
			return err
		}, []string{"Diameter", "2e-06", "PrimaryDiameter", "m"}},
		{"negative shear", func() error {
			_, err := DefaultModel.Equilibrium(-1, 0.1, 30, 15)
			return err
		}, []string{"Shear", "-1", "[0, 1e4]", "s-1"}},
		{"negative shear step", func() error {
			_, err := DefaultModel.Step(1e-4, -3, 0.1, 30, 15, 60)
			return err
		}, []string{"Shear", "-3", "s-1"}},
		{"NaN concentration", func() error {
			_, err := DefaultModel.Equilibrium(10, math.NaN(), 30, 15)
			return err
		}, []string{"Concentration", "NaN", "kg m-3"}},
		{"salinity", func() error {
			_, err := DefaultModel.SettlingVelocity(1e-4, 50, 15, 0)
			return err
		}, []string{"Salinity", "50", "PSU"}},
		{"zero shear equilibrium", func() error {
			_, err := DefaultModel.Equilibrium(0, 0.1, 30, 15)
			return err
		}, []string{"Shear", "0", "(0, 1e4]"}},
	}
	for _, c := range cases {
		err := c.err()
		if err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		for _, w := range c.want {
			if !strings.Contains(err.Error(), w) {
				t.Errorf("%s: error %q does not contain %q", c.name, err, w)
			}
		}
	}
}

func TestWaterProperties(t *testing.T) {
	// EOS-80 check values at zero pressure (UNESCO 1983, Tech. Pap. Mar.
	// Sci. 44, Fofonoff & Millard; from memory).
	dens := []struct{ s, t, want float64 }{
		{0, 5, 999.96675},
		{35, 5, 1027.67547},
		{35, 25, 1023.34306},
	}
	const densTol = 1e-5 // kg m-3; the check values carry five decimals
	for _, c := range dens {
		got, err := WaterDensity(c.s, c.t)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got-c.want) > densTol {
			t.Errorf("ρ(S=%g, T=%g) = %.6f, want %.5f", c.s, c.t, got, c.want)
		}
	}
	// Viscosity of pure water: 1.0016 mPa s at 20 °C (ISO/TR 3666:1998,
	// from memory); 0.8900 at 25 °C and 1.792 at 0 °C (CRC Handbook, from
	// memory); sea water S = 35, 20 °C ≈ 1.08 mPa s (Sharqawy et al. 2010
	// Table, from memory).
	const viscTol = 0.015 // the correlation's stated ±1.5 %
	visc := []struct{ s, t, want float64 }{
		{0, 20, 1.0016e-3}, {0, 25, 0.8900e-3}, {0, 0, 1.792e-3}, {35, 20, 1.08e-3},
	}
	for _, c := range visc {
		got, err := WaterViscosity(c.s, c.t)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got/c.want-1) > viscTol {
			t.Errorf("μ(S=%g, T=%g) = %.5g, want %.5g", c.s, c.t, got, c.want)
		}
	}
}

func TestSettlingWinterwerp(t *testing.T) {
	// Source: research note §B2 (n_f = 2, α = β = 1, D_p = 4 µm, ρ_s = 2650,
	// ρ_w = 1020, μ = 1e-3), Winterwerp (1998) formula with and without the
	// Reynolds correction; ν = μ/ρ_w.
	f := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 2}
	cases := []struct{ d, plain, corrected float64 }{
		{20e-6, 0.0711e-3, 0.0709e-3},
		{50e-6, 0.178e-3, 0.177e-3},
		{100e-6, 0.355e-3, 0.350e-3},
		{200e-6, 0.711e-3, 0.684e-3},
		{500e-6, 1.777e-3, 1.574e-3},
	}
	for _, c := range cases {
		st := Settling{Shape: 1, Drag: Stokes}
		w, err := st.velocity(f, c.d, 1020, 1e-3)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(w/c.plain-1) > threeFigures {
			t.Errorf("D=%g Stokes drag: %.5g, want %.4g", c.d, w, c.plain)
		}
		st.Drag = SchillerNaumann
		w, err = st.velocity(f, c.d, 1020, 1e-3)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(w/c.corrected-1) > threeFigures {
			t.Errorf("D=%g Re-corrected: %.5g, want %.4g", c.d, w, c.corrected)
		}
		// The solution satisfies its own implicit equation (consistency).
		re := w * c.d / (1e-3 / 1020)
		w0exact, _ := Settling{Shape: 1, Drag: Stokes}.velocity(f, c.d, 1020, 1e-3)
		if r := w*(1+0.15*math.Pow(re, 0.687)) - w0exact; math.Abs(r) > 1e-12*w0exact {
			t.Errorf("D=%g: residual %g", c.d, r)
		}
	}
	// n_f = 3 with Stokes drag is Stokes' law for a solid sphere (Stokes
	// 1851), exactly; with the Reynolds correction a solid 100 µm grain
	// settles at 7.87 mm/s (research note §B2).
	solid := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: 3}
	w, _ := Settling{Shape: 1, Drag: Stokes}.velocity(solid, 100e-6, 1020, 1e-3)
	stokes := (2650 - 1020) * Gravity * 100e-6 * 100e-6 / (18 * 1e-3)
	if math.Abs(w/stokes-1) > 1e-12 {
		t.Errorf("solid 100 µm: %g, Stokes %g", w, stokes)
	}
	w, _ = Settling{Shape: 1}.velocity(solid, 100e-6, 1020, 1e-3)
	if math.Abs(w/7.87e-3-1) > threeFigures {
		t.Errorf("solid 100 µm with Re correction: %g, want 7.87e-3", w)
	}
}

func TestSettlingPublishedRange(t *testing.T) {
	// Typical estuarine flocs (n_f 1.9–2.3, 50–500 µm) settle at about
	// 0.1–10 mm/s: San Francisco Bay 0.04–15.8 mm/s for 22–639 µm (Manning &
	// Schoellhamer 2013, Mar. Geol. 345:266); research note §C item 9.
	for _, nf := range []float64{1.9, 2.0, 2.3} {
		f := Fractal{PrimaryDiameter: 4e-6, PrimaryDensity: 2650, Dimension: nf}
		for _, d := range []float64{50e-6, 100e-6, 200e-6, 500e-6} {
			w, err := DefaultSettling.Velocity(f, d, 25, 15, 0.1)
			if err != nil {
				t.Fatal(err)
			}
			if w < 0.05e-3 || w > 10e-3 {
				t.Errorf("n_f=%g D=%g: w_s = %.3g mm/s outside 0.05–10 mm/s", nf, d, w*1e3)
			}
		}
	}
}

func TestSettlingHindered(t *testing.T) {
	// Richardson & Zaki (1954): w = w0(1−Φ)^n; Φ = C/(ρ_s φ).
	st := Settling{Shape: 1, HinderedExponent: 4.65}
	free, _ := DefaultSettling.Velocity(DefaultFractal, 100e-6, 30, 15, 5)
	hind, _ := st.Velocity(DefaultFractal, 100e-6, 30, 15, 5)
	vol := 5 / (2650 * 0.04)
	if want := free * math.Pow(1-vol, 4.65); math.Abs(hind/want-1) > 1e-12 {
		t.Errorf("hindered %g, want %g", hind, want)
	}
}

// Equilibrium sizes: Winterwerp (1998) with n_f = 2, q = ½ gives
// D_e = D_p + k_A C/(k_B √G). Rows 1–2 from the research note §B2 table;
// row 3 is the published FlocData "composite" example (k_A = 14,
// k_B = 1400, C = 0.05 kg m⁻³, G = 35 s⁻¹, D_p = 7 µm → 91.5 µm).
func TestEquilibriumWinterwerp(t *testing.T) {
	cases := []struct{ kA, kB, c, g, dp, want float64 }{
		{14.6, 14e3, 0.1, 10, 4e-6, 37.0e-6},
		{14.6, 14e3, 0.5, 5, 4e-6, 237e-6},
		{14, 1400, 0.05, 35, 7e-6, 91.5e-6},
	}
	for _, c := range cases {
		m := DefaultModel
		m.Fractal = Fractal{PrimaryDiameter: c.dp, PrimaryDensity: 2650, Dimension: 2}
		const s, temp = 30.0, 15.0
		mu := waterViscosity(s, temp)
		base := DefaultKinetics
		base.FreshwaterEfficiency = 1
		m.Kinetics = KineticsFromCoefficients(c.kA, c.kB, m.Fractal, mu, base)
		// Shear low enough that the Kolmogorov cap does not bind.
		got, err := m.Equilibrium(c.g, c.c, s, temp)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got/c.want-1) > threeFigures {
			t.Errorf("k_A=%g C=%g G=%g: D_e = %.4g µm, want %.3g", c.kA, c.c, c.g, got*1e6, c.want*1e6)
		}
		// Closed form (Winterwerp 1998 for n_f = 2) to bisection accuracy.
		closed := c.dp + c.kA*c.c/(c.kB*math.Sqrt(c.g))
		if math.Abs(got/closed-1) > 1e-11 {
			t.Errorf("closed form %g vs %g", closed, got)
		}
	}
	// The primed Ems constants convert to k_A = 14.60 and k_B = 13 993 at
	// D_p = 4 µm, ρ_s = 2650, n_f = 2, μ = 1e-3 (research note §B2).
	k := KineticsFromCoefficients(14.60, 13993, DefaultFractal, 1e-3, DefaultKinetics)
	if math.Abs(k.Aggregation/0.3095-1) > 5e-4 || math.Abs(k.Breakup/3.54e-5-1) > 5e-4 {
		t.Errorf("primed constants %g %g, want 0.3095 3.54e-5", k.Aggregation, k.Breakup)
	}
}

func TestEquilibriumTrends(t *testing.T) {
	// D_e rises with C and falls with G (Winterwerp 1998; note §C item 9),
	// for several fractal dimensions; it is capped by the Kolmogorov scale
	// (common practice) and is smaller in fresh water (common practice).
	for _, nf := range []float64{1.8, 2.0, 2.4} {
		m := DefaultModel
		m.Fractal.Dimension = nf
		prev := 0.0
		for _, c := range []float64{0.01, 0.05, 0.2, 1} {
			d, err := m.Equilibrium(5, c, 30, 15)
			if err != nil {
				t.Fatal(err)
			}
			if d <= prev {
				t.Errorf("n_f=%g: D_e(C=%g) = %g not above %g", nf, c, d, prev)
			}
			prev = d
		}
		prev = math.Inf(1)
		for _, g := range []float64{0.5, 2, 10, 50} {
			d, _ := m.Equilibrium(g, 0.1, 30, 15)
			if d >= prev {
				t.Errorf("n_f=%g: D_e(G=%g) = %g not below %g", nf, g, d, prev)
			}
			prev = d
		}
	}
	eta, _ := KolmogorovScale(20, 30, 15)
	d, _ := DefaultModel.Equilibrium(20, 100, 30, 15)
	if d != eta {
		t.Errorf("C = 100 kg m-3: D_e = %g, want the Kolmogorov scale %g", d, eta)
	}
	// η = √(ν/G): 316 µm at G = 10 for ν = 1e-6 (note §B2); our ν at 20 °C
	// fresh water is 1.003e-6.
	eta, _ = KolmogorovScale(10, 0, 20)
	if math.Abs(eta/316.2e-6-1) > 3e-3 {
		t.Errorf("η(G=10) = %g", eta)
	}
	fresh, _ := DefaultModel.Equilibrium(5, 0.2, 0, 15)
	salt, _ := DefaultModel.Equilibrium(5, 0.2, 20, 15)
	if !(fresh < salt) {
		t.Errorf("fresh %g not below saline %g", fresh, salt)
	}
	dp, _ := DefaultModel.Equilibrium(5, 0, 20, 15)
	if dp != DefaultFractal.PrimaryDiameter {
		t.Errorf("C = 0: D_e = %g, want D_p", dp)
	}
}

// oracleStep integrates dD/dt with forward Euler and a tiny fixed step: a
// straightforward implementation kept beside the fast one (STYLE.md).
func oracleStep(r rates, d, dt float64) float64 {
	const n = 200000
	h := dt / n
	for range n {
		d += h * r.f(d)
		d = min(d, r.eta)
	}
	return d
}

func TestStepAgainstOracle(t *testing.T) {
	// The fast sub-stepped RK4 matches a fine Euler integration to within
	// its O(h) error (h = dt/2e5 with relaxation times ≳ 300 s gives ≲1e-5).
	const oracleTol = 2e-5
	cases := []struct{ d0, g, c, dt float64 }{
		{4e-6, 10, 0.1, 600},        // growth from primaries
		{20e-6, 5, 0.5, 1800},       // growth
		{300e-6, 20, 0.1, 300},      // break-up
		{150e-6, 2, 0.05, 6 * 3600}, // long step
	}
	for _, c := range cases {
		got, err := DefaultModel.Step(c.d0, c.g, c.c, 30, 15, c.dt)
		if err != nil {
			t.Fatal(err)
		}
		r := makeRates(DefaultFractal, DefaultKinetics, c.g, c.c, 30, 15)
		want := oracleStep(r, min(c.d0, r.eta), c.dt)
		if math.Abs(got/want-1) > oracleTol {
			t.Errorf("%+v: Step = %.7g, oracle %.7g", c, got, want)
		}
	}
	// Many short steps equal one long step (the scheme is consistent), and
	// a long step reaches the equilibrium.
	d1, _ := DefaultModel.Step(10e-6, 8, 0.3, 30, 15, 3600)
	d := 10e-6
	for range 60 {
		d, _ = DefaultModel.Step(d, 8, 0.3, 30, 15, 60)
	}
	if math.Abs(d/d1-1) > 1e-6 {
		t.Errorf("60×60 s = %g, 1×3600 s = %g", d, d1)
	}
	de, _ := DefaultModel.Equilibrium(8, 0.3, 30, 15)
	dl, _ := DefaultModel.Step(10e-6, 8, 0.3, 30, 15, 1e6)
	if math.Abs(dl/de-1) > 1e-9 {
		t.Errorf("long step %g, equilibrium %g", dl, de)
	}
}

func TestSizeLagsTide(t *testing.T) {
	// Under a shear that varies over a tidal period the size lags the
	// equilibrium (Winterwerp 1998: finite flocculation time): the largest
	// floc comes after the weakest shear.
	const period = 12.42 * 3600
	const dt = 120.0
	d := 50e-6
	g := func(tm float64) float64 { return 1 + 9*math.Abs(math.Cos(2*math.Pi*tm/period)) }
	var tMax, dMax float64
	n := int(math.Round(3 * period / dt))
	for i := range n {
		tm := float64(i) * dt
		d, _ = DefaultModel.Step(d, g(tm), 0.1, 30, 15, dt)
		if tm > 2*period && d > dMax {
			dMax, tMax = d, tm+dt
		}
	}
	// Weakest shear at t = period/4 + k·period/2.
	phase := math.Mod(tMax-period/4, period/2)
	if !(phase > 0 && phase < period/4) {
		t.Errorf("size maximum at phase %g s after slack, want a positive lag under a quarter period", phase)
	}
	deMin, _ := DefaultModel.Equilibrium(1, 0.1, 30, 15)
	if dMax >= deMin {
		t.Errorf("lagging size %g reached the slack-water equilibrium %g", dMax, deMin)
	}
}

func TestPopulation(t *testing.T) {
	// Mass fractions sum to 1 − primary fraction (identity); primary
	// fraction falls with salinity (common practice).
	p, err := DefaultModel.Population(80e-6, 20)
	if err != nil {
		t.Fatal(err)
	}
	sum := p.MassFraction(0, 80e-6) + p.MassFraction(80e-6, math.Inf(1))
	if math.Abs(sum-(1-p.PrimaryFraction)) > 1e-14 {
		t.Errorf("sum %g, want %g", sum, 1-p.PrimaryFraction)
	}
	fresh, _ := DefaultModel.Population(80e-6, 0)
	if !(fresh.PrimaryFraction > p.PrimaryFraction) {
		t.Errorf("primary fraction fresh %g, saline %g", fresh.PrimaryFraction, p.PrimaryFraction)
	}
	w, err := DefaultModel.MassSettlingVelocity(80e-6, 20, 15, 0.1)
	if err != nil {
		t.Fatal(err)
	}
	wf, _ := DefaultModel.SettlingVelocity(80e-6, 20, 15, 0.1)
	wp, _ := DefaultModel.SettlingVelocity(4e-6, 20, 15, 0.1)
	if !(w > wp && w < wf*2) {
		t.Errorf("mass-mean w_s %g outside (%g, %g)", w, wp, 2*wf)
	}
}

func TestStepNoAllocs(t *testing.T) {
	allocs := testing.AllocsPerRun(100, func() {
		_, _ = DefaultModel.Step(30e-6, 10, 0.2, 30, 15, 300)
		_, _ = DefaultModel.EquilibriumSettlingVelocity(10, 0.2, 30, 15)
	})
	if allocs != 0 {
		t.Errorf("%g allocations per call", allocs)
	}
}

func BenchmarkStep(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		_, _ = DefaultModel.Step(30e-6, 10, 0.2, 30, 15, 300)
	}
}

func BenchmarkEquilibriumSettlingVelocity(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		_, _ = DefaultModel.EquilibriumSettlingVelocity(10, 0.2, 30, 15)
	}
}

func TestBinNumbers(t *testing.T) {
	// Oracle: midpoint sum in ln D of the lognormal mass density divided by
	// the floc mass (straightforward integration), and the identity that
	// bins covering all sizes hold the floc mass (1 − f_p)·C.
	const oracleTol = 1e-6
	p, _ := DefaultModel.Population(120e-6, 25)
	edges := []float64{4e-6, 20e-6, 60e-6, 120e-6, 300e-6, 2e-3, 0.05}
	got := make([]float64, len(edges)-1)
	if err := p.BinNumbers(DefaultFractal, 0.3, edges, got); err != nil {
		t.Fatal(err)
	}
	massOf := func(d float64) float64 {
		a, _ := DefaultFractal.Aggregate(d, 1000)
		return a.DryMass
	}
	total := 0.0
	for i := range got {
		const n = 20000
		sum, msum := 0.0, 0.0
		a, b := math.Log(edges[i]), math.Log(edges[i+1])
		for j := range n {
			x := a + (b-a)*(float64(j)+0.5)/n
			d := math.Exp(x)
			frac := p.MassFraction(math.Exp(x-(b-a)/(2*n)), math.Exp(x+(b-a)/(2*n)))
			sum += 0.3 * frac / massOf(d)
			msum += 0.3 * frac
		}
		if math.Abs(got[i]/sum-1) > oracleTol {
			t.Errorf("bin %d: %g, oracle %g", i, got[i], sum)
		}
		total += msum
	}
	if math.Abs(total/(0.3*(1-p.PrimaryFraction))-1) > 1e-9 {
		t.Errorf("mass in bins %g, want %g", total, 0.3*(1-p.PrimaryFraction))
	}
}

func TestPopulationNoAllocs(t *testing.T) {
	p, _ := DefaultModel.Population(80e-6, 20)
	edges := []float64{4e-6, 20e-6, 80e-6, 300e-6, 1e-3}
	dst := make([]float64, len(edges)-1)
	allocs := testing.AllocsPerRun(50, func() {
		_, _ = DefaultModel.MassSettlingVelocity(80e-6, 20, 15, 0.1)
		_ = p.BinNumbers(DefaultFractal, 0.2, edges, dst)
	})
	if allocs != 0 {
		t.Errorf("%g allocations per call", allocs)
	}
}

func BenchmarkMassSettlingVelocity(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		_, _ = DefaultModel.MassSettlingVelocity(80e-6, 20, 15, 0.1)
	}
}

func BenchmarkBinNumbers100(b *testing.B) {
	p, _ := DefaultModel.Population(80e-6, 20)
	edges := make([]float64, 101)
	for i := range edges {
		edges[i] = 4e-6 * math.Pow(250, float64(i)/100)
	}
	dst := make([]float64, 100)
	b.ReportAllocs()
	for b.Loop() {
		_ = p.BinNumbers(DefaultFractal, 0.2, edges, dst)
	}
}

func TestPublishedExampleTimeIntegration(t *testing.T) {
	// The FlocData "composite" example of Winterwerp (1998) kinetics
	// (research note §B2): k_A = 14, k_B = 1400, C = 0.05 kg m⁻³, G = 35 s⁻¹,
	// D_p = 7 µm, starting from 20 µm and integrated to 1000 min: 91.5 µm.
	m := DefaultModel
	m.Fractal = Fractal{PrimaryDiameter: 7e-6, PrimaryDensity: 2650, Dimension: 2}
	base := DefaultKinetics
	base.FreshwaterEfficiency = 1
	m.Kinetics = KineticsFromCoefficients(14, 1400, m.Fractal, waterViscosity(30, 15), base)
	d := 20e-6
	for range 1000 {
		var err error
		if d, err = m.Step(d, 35, 0.05, 30, 15, 60); err != nil {
			t.Fatal(err)
		}
	}
	if math.Abs(d/91.5e-6-1) > threeFigures {
		t.Errorf("D(1000 min) = %.4g µm, want 91.5", d*1e6)
	}
}

func TestDefaultPrimarySpread(t *testing.T) {
	// The default primaries against the clay-mineral sizes of the research
	// note estuary-and-flocs.md §B1 ("median of about 1–2 µm, spread
	// 0.1–10 µm"): count median in [1, 2] µm and ±3 standard deviations
	// inside [0.1, 10] µm. Zero PrimaryGSD means the default; 1 is
	// identical primaries (no log-normal).
	f := DefaultFractal
	f.PrimaryGSD = 0
	if f.PrimarySpread() != DefaultPrimaryGSD {
		t.Fatalf("PrimarySpread() = %g for PrimaryGSD 0", f.PrimarySpread())
	}
	l, err := f.PrimaryDistribution(1)
	if err != nil {
		t.Fatal(err)
	}
	lo, hi := l.Median/math.Pow(l.GSD, 3), l.Median*math.Pow(l.GSD, 3)
	if l.Median < 1e-6 || l.Median > 2e-6 || lo < 0.1e-6 || hi > 10e-6 {
		t.Errorf("count median %g m, ±3σ [%g, %g] m", l.Median, lo, hi)
	}
	// Structure does not depend on the spread (Kranenburg relations on D32).
	a, _ := f.Aggregate(100e-6, 1020)
	f.PrimaryGSD = 1
	b, _ := f.Aggregate(100e-6, 1020)
	if a != b {
		t.Errorf("aggregate depends on the spread: %+v vs %+v", a, b)
	}
}
