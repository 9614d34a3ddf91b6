package scenario

import (
	"context"
	"errors"
	"math"
	"slices"
	"sort"
	"testing"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/internal/testrun"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/seen"
	"github.com/murk-optics/murk/scenario/sensing"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/water"
)

func smallDemo(t testing.TB) spec.Scenario { return testrun.SmallDemo(t) }

var smallResult *Result

func runSmall(t *testing.T) *Result {
	t.Helper()
	if smallResult != nil {
		return smallResult
	}
	r, err := Run(context.Background(), smallDemo(t), Options{})
	if err != nil {
		t.Fatal(err)
	}
	smallResult = r
	return r
}

// roundOff is the relative tolerance for sums that differ only in the
// order of floating-point additions (a few ulps of double precision).
const roundOff = 1e-12

// The section holds every model cell, with the estuary model's own
// values there; the stations are the section interpolated linearly between
// cell centres and held at the end cells beyond them (the contract of the
// package doc; identities of linear interpolation).
func TestSectionAtCells(t *testing.T) {
	r := runSmall(t)
	x := r.Estuary.X
	if len(r.Section.Distance) != len(x) {
		t.Fatalf("section has %d positions, model %d cells", len(r.Section.Distance), len(x))
	}
	for ti := range r.Times {
		sn := &r.Estuary.Snapshots[ti]
		for i := range x {
			for l := 0; l < mixing.Layers; l++ {
				p := r.Section.Point(ti, i, l)
				if got, want := r.Section.Salinity[p], clampSalinity(sn.Salinity[l][i]); got != want {
					t.Fatalf("t %d cell %d layer %d: section salinity %g, model %g", ti, i, l, got, want)
				}
				if got, want := r.Section.Thickness[p], sn.Thickness[l][i]; got != want {
					t.Fatalf("t %d cell %d layer %d: section thickness %g, model %g", ti, i, l, got, want)
				}
			}
		}
		for j, xs := range r.Stations {
			lo := max(0, min(sort.SearchFloat64s(x, xs)-1, len(x)-2))
			u := min(max((xs-x[lo])/(x[lo+1]-x[lo]), 0), 1)
			for l := 0; l < mixing.Layers; l++ {
				a, b := r.Section.Thickness[r.Section.Point(ti, lo, l)], r.Section.Thickness[r.Section.Point(ti, lo+1, l)]
				want := a*(1-u) + b*u
				if got := r.Thickness[r.Point(ti, j, l)]; math.Abs(got-want) > roundOff*want {
					t.Errorf("t %d station %.1f km layer %d: thickness %.15g, interpolated section %.15g", ti, xs/1e3, l, got, want)
				}
			}
		}
	}
}

// The separable components add up to the totals, c = a + b and b_b ≤ b
// (definitions of the IOPs; Mobley 1994, Light and Water, ch. 3).
func TestComponentsAddUp(t *testing.T) {
	r := runSmall(t)
	np := len(r.Times) * len(r.Stations) * mixing.Layers
	for p := 0; p < np; p++ {
		for w := range r.Wavelengths {
			a, b, bb := 0.0, 0.0, 0.0
			for k := range r.Components {
				a += r.Value(iop.Absorption, p, k, w)
				b += r.Value(iop.Scattering, p, k, w)
				bb += r.Value(iop.Backscattering, p, k, w)
				if v := r.Value(iop.Backscattering, p, k, w); v > r.Value(iop.Scattering, p, k, w)*(1+roundOff) {
					t.Fatalf("point %d λ %d component %s: b_b %g > b %g", p, w, r.Components[k].Name, v, r.Value(iop.Scattering, p, k, w))
				}
			}
			if c := r.Sum(iop.Attenuation, p, w, nil); math.Abs(c-(a+b)) > roundOff*(a+b) {
				t.Fatalf("point %d λ %d: c %g ≠ a + b %g", p, w, c, a+b)
			}
			if got := r.Sum(iop.Backscattering, p, w, nil); math.Abs(got-bb) > roundOff*bb {
				t.Fatalf("point %d λ %d: Σb_b %g ≠ %g", p, w, got, bb)
			}
		}
	}
}

// The water component is exactly package water's seawater model at the
// local salinity and temperature (Zhang, Hu & He 2009 scattering, Pope &
// Fry 1997 absorption), and CDOM at zero salinity is the river end member
// a_g(λ0)·exp(−S(λ−λ0)) (Bricaud, Morel & Prieur 1981, eq. 1).
func TestWaterAndCDOM(t *testing.T) {
	r := runSmall(t)
	cd := r.Scenario.Mixture.Water.CDOM
	for _, p := range []int{0, len(r.Salinity) - 1} {
		for w, lam := range r.Wavelengths {
			sc, err := water.Scatter(lam, water.Medium{Salinity: r.Salinity[p], TemperatureC: r.Temperature[p]}, 0)
			if err != nil {
				t.Fatal(err)
			}
			aw, _ := water.Absorption(lam)
			if got := r.Value(iop.Scattering, p, 0, w); math.Abs(got-sc.B) > roundOff*sc.B {
				t.Errorf("point %d λ %.0f nm: b_w %g, want %g", p, lam*1e9, got, sc.B)
			}
			if got := r.Value(iop.Absorption, p, 0, w); math.Abs(got-aw) > roundOff*aw {
				t.Errorf("point %d λ %.0f nm: a_w %g, want %g", p, lam*1e9, got, aw)
			}
			if r.Salinity[p] == 0 {
				want := cd.Absorption.River * math.Exp(-cd.Slope*(lam-cd.ReferenceWavelength))
				if got := r.Value(iop.Absorption, p, 1, w); math.Abs(got-want) > 1e-9*want {
					t.Errorf("river CDOM at %.0f nm: %g, want %g", lam*1e9, got, want)
				}
			}
		}
	}
}

// A class-riding population scales linearly with its class's concentration
// (single scattering by independent particles: IOPs are proportional to
// concentration; common practice for dilute suspensions).
func TestLinearInConcentration(t *testing.T) {
	r := runSmall(t)
	k := r.ComponentOf(0) // silt rides on fine_mud
	pop := r.Scenario.Mixture.Populations[0]
	w := refWavelength(r.Wavelengths)
	var ref float64
	for p := range r.Salinity {
		c := r.Concentration[p*r.NC()+pop.ClassIndex] * pop.ClassFraction
		if c <= 0 {
			continue
		}
		spec := r.Value(iop.Backscattering, p, k, w) / c
		if ref == 0 {
			ref = spec
			continue
		}
		if math.Abs(spec-ref) > 1e-12*ref {
			t.Fatalf("point %d: b_b per mass %g, want %g at every point", p, spec, ref)
		}
	}
}

// wsTableTol bounds the interpolation error of the settling-velocity
// table against direct calls: w_s varies as D^(n_f−1) (linear in ln–ln)
// and smoothly in S and T, so bilinear interpolation on 64 diameter nodes
// is good to well under a per cent; 1 % leaves room at the 0–3 PSU step.
const wsTableTol = 0.01

// The settling table reproduces floc.Model.MassSettlingVelocity (the
// slow oracle) between its nodes.
func TestWSTable(t *testing.T) {
	m := floc.DefaultModel
	tab, err := newWSTable(m, 12, 11, 0)
	if err != nil {
		t.Fatal(err)
	}
	for _, d := range []float64{5e-6, 17e-6, 63e-6, 150e-6, 420e-6} {
		for _, s := range []float64{0, 0.7, 1.8, 2.9, 7, 33} {
			for _, temp := range []float64{11, 11.4, 12} {
				want, err := m.MassSettlingVelocity(d, s, temp, 0)
				if err != nil {
					t.Fatal(err)
				}
				got := tab.at(d, s, temp)
				if math.Abs(got/want-1) > wsTableTol {
					t.Errorf("D %g m S %g T %g: table %g m/s, direct %g m/s", d, s, temp, got, want)
				}
			}
		}
	}
}

// The rating curve C = A·(Q/Q_ref)^B of the scenario is the model's
// C = A'·Q^B: both give the same concentration at any discharge.
func TestRatingCurveConversion(t *testing.T) {
	s := smallDemo(t)
	cfg, err := EstuaryConfig(s.Estuary)
	if err != nil {
		t.Fatal(err)
	}
	for k, sup := range s.Estuary.River.Supply {
		mc := cfg.Sediment[k]
		for _, q := range []float64{10, 150, 900} {
			want := sup.At(q)
			got := mc.RatingA * math.Pow(q, mc.RatingB)
			if math.Abs(got-want) > 1e-12*want {
				t.Errorf("class %s at %g m3/s: model %g kg/m3, scenario %g kg/m3", mc.Name, q, got, want)
			}
		}
	}
}

func TestOutputTimes(t *testing.T) {
	for _, c := range []struct {
		r    spec.Run
		want []float64
	}{
		{spec.Run{SpinUp: 100, Duration: 30, OutputInterval: 10}, []float64{100, 110, 120, 130}},
		{spec.Run{SpinUp: 0, Duration: 25, OutputInterval: 10}, []float64{0, 10, 20, 25}},
	} {
		got := OutputTimes(c.r)
		if len(got) != len(c.want) {
			t.Fatalf("%+v: %v, want %v", c.r, got, c.want)
		}
		for i := range got {
			if got[i] != c.want[i] {
				t.Errorf("%+v: %v, want %v", c.r, got, c.want)
			}
		}
	}
}

// kernelSpeedTol bounds the change of bulk IOPs between DefaultKernel and
// the kernel package's fully resolved defaults. 3 % for b_b and 0.5 % for
// a and b: a tenth of the change that an uncertainty of ±0.01 in a
// particle's relative index makes to b_b (about 10 % for mineral
// particles near n = 1.17; from memory), so the faster kernels never
// decide a result.
const (
	kernelSpeedTolBb = 0.03
	kernelSpeedTol   = 0.005
)

func TestDefaultKernelAccuracy(t *testing.T) {
	s := smallDemo(t)
	s.Mixture.Optics.Wavelengths = []float64{450e-9, 650e-9}
	s.Mixture.Populations = s.Mixture.Populations[:2] // silt (Junge) and detritus (lognormal)
	fastPlan, err := NewPlan(context.Background(), s.Mixture, referenceWater(s), s.Estuary.Ocean.Salinity, Options{Kernel: DefaultKernel})
	if err != nil {
		t.Fatal(err)
	}
	exactPlan, err := NewPlan(context.Background(), s.Mixture, referenceWater(s), s.Estuary.Ocean.Salinity, Options{Kernel: KernelOptions{Exact: true}})
	if err != nil {
		t.Fatal(err)
	}
	for i, p := range s.Mixture.Populations {
		fast, exact := fastPlan.populations[i], exactPlan.populations[i]
		for w := range s.Mixture.Optics.Wavelengths {
			for _, q := range []struct {
				name     string
				got, ref float64
				tol      float64
			}{
				{"a", fast.iop.A[w], exact.iop.A[w], kernelSpeedTol},
				{"b", fast.iop.B[w], exact.iop.B[w], kernelSpeedTol},
				{"bb", fast.iop.Bb[w], exact.iop.Bb[w], kernelSpeedTolBb},
			} {
				if math.Abs(q.got/q.ref-1) > q.tol {
					t.Errorf("%s λ %d: %s %g with DefaultKernel, %g exact (tolerance %g)", p.Name, w, q.name, q.got, q.ref, q.tol)
				}
			}
		}
	}
}

// The per-point optics (water, CDOM, every population) allocate nothing
// once a worker is built (STYLE.md: hot loops allocate nothing).
func TestFillAllocs(t *testing.T) {
	r, w := fillWorker(t, runSmall(t))
	allocs := testing.AllocsPerRun(20, func() {
		if err := w.fill(r.Plan, 12, 11.5); err != nil {
			t.Fatal(err)
		}
	})
	if allocs != 0 {
		t.Errorf("fill allocates %g times per call, want 0", allocs)
	}
}

// fillWorker returns a worker on r's plan holding every population at
// 50 g m⁻³ with 80 µm flocs, for the per-point optics.
func fillWorker(tb testing.TB, r *Result) (*Result, *worker) {
	tb.Helper()
	opt, _ := Options{}.normalise()
	w, err := r.Plan.newWorker(opt)
	if err != nil {
		tb.Fatal(err)
	}
	for i := range w.mass {
		w.mass[i], w.flocD[i] = 0.05, 80e-6
	}
	return r, w
}

// A cancelled context stops the run with the context's error (an
// interrupt leaves no partial result and, in the CLI, no partial file).
func TestCancel(t *testing.T) {
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if _, err := Run(ctx, smallDemo(t), Options{}); !errors.Is(err, context.Canceled) {
		t.Errorf("Run with a cancelled context: %v, want context.Canceled", err)
	}
}

// The simulated sensors follow their published definitions from the
// run's own total VSF: the backscatter sensor reads b_b = 2π·χ_p(θ)·(β(θ) −
// β_w(θ)) + b_bw (Sullivan et al. 2013, χ_p from package seen's table)
// and the turbidity signal is β(90°) − β_w(90°) at 860 nm (ISO 7027-1
// geometry), with water from Zhang, Hu & He (2009).
func TestInstruments(t *testing.T) {
	r := runSmall(t)
	if len(r.Instruments) != 3 {
		t.Fatalf("instruments %v; want the demo's three", r.Instruments)
	}
	onGrid := func(grid []float64, v, tol float64) int {
		i := slices.IndexFunc(grid, func(g float64) bool { return math.Abs(g-v) < tol })
		if i < 0 {
			t.Fatalf("%g not on the grid %v", v, grid)
		}
		return i
	}
	angleIndex := func(theta float64) int { return onGrid(r.Angles, theta, 1e-9) }
	wlIndex := func(l float64) int { return onGrid(r.Wavelengths, l, 1e-15) }
	for i, in := range r.Instruments {
		for p := range r.Salinity {
			rd := r.Readings[p*len(r.Instruments)+i]
			med := water.Medium{Salinity: r.Salinity[p], TemperatureC: r.Temperature[p]}
			name := in.Describe().Name
			switch in := in.(type) {
			case sensing.Backscatter:
				w, a := wlIndex(in.Wavelength), angleIndex(in.Angle)
				sc, _ := water.Scatter(in.Wavelength, med, 0)
				chi, _, err := seen.Chi(in.Angle)
				if err != nil {
					t.Fatal(err)
				}
				beta := r.VSF[(p*r.NW()+w)*r.NA()+a]
				want := 2*math.Pi*chi*(beta-sc.VSF(in.Angle)) + sc.Bb
				if math.Abs(rd.Value-want) > 1e-9*want {
					t.Fatalf("%s point %d: %g, want %g", name, p, rd.Value, want)
				}
			case sensing.Turbidimeter:
				w, a := wlIndex(860e-9), angleIndex(math.Pi/2)
				sc, _ := water.Scatter(860e-9, med, 0)
				want := r.VSF[(p*r.NW()+w)*r.NA()+a] - sc.VSF(math.Pi/2)
				if math.Abs(rd.Value-want) > 1e-9*want {
					t.Fatalf("%s point %d: %g, want %g", name, p, rd.Value, want)
				}
			case sensing.Transmissometer:
				// A meter that collects forward light reads less than c.
				if !(rd.Value <= rd.True && rd.Value > 0) {
					t.Fatalf("%s point %d: c_m %g, c %g; want 0 < c_m ≤ c", name, p, rd.Value, rd.True)
				}
			default:
				t.Fatalf("%s: unexpected instrument type %T", name, in)
			}
		}
	}
}
