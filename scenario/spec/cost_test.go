package spec

import (
	"math"
	"testing"
)

// prismaticEstuary is a uniform channel, where the prism estimate has a
// closed form: ∫ₓᴸ B dx' = B·(L − x).
func prismaticEstuary() Estuary {
	return Estuary{
		Geometry: Geometry{Length: 50e3, Cells: 100, Shape: ShapeExponential, MouthWidth: 1000, Depth: 8},
		River:    River{Discharge: Signal{Values: []float64{200}}},
		Tide:     Tide{M2: Constituent{Form: TideRange, Amplitude: 1, Period: PeriodM2}},
		Ocean:    Ocean{Salinity: 30},
		Run:      Run{Duration: 10 * 86400, SpinUp: 2 * 86400, OutputInterval: 3600},
	}
}

// midpointTol: the midpoint rule on 100–160 cells integrates the
// exponential width to a relative error of about (dx/Lb)²/24 ≈ 2e-5
// (standard midpoint-rule error bound); 1e-4 leaves room.
const midpointTol = 1e-4

// TestTidalVelocityPrism checks the prism estimate U_T(x) = ω·η0·∫ₓᴸB dx'/(B·H)
// (DESIGN.md reference formulation) against its closed forms: B(L − x) for a
// prismatic channel and B0·Lb·(e^(−x/Lb) − e^(−L/Lb)) for an exponential one.
func TestTidalVelocityPrism(t *testing.T) {
	e := prismaticEstuary()
	omega := 2 * math.Pi / PeriodM2
	dx := e.Geometry.Length / float64(e.Geometry.Cells)
	ut := tidalVelocities(e)
	for _, i := range []int{0, 37, 99} {
		x := (float64(i) + 0.5) * dx
		want := omega * 1 * (e.Geometry.Length - x) / 8
		if !near(ut[i], want, 1e-12) {
			t.Errorf("prismatic cell %d: %v, want %v", i, ut[i], want)
		}
	}
	e.Geometry = Geometry{Length: 80e3, Cells: 160, Shape: ShapeExponential, MouthWidth: 3000, ConvergenceLength: 25e3, Depth: 10}
	dx = e.Geometry.Length / 160
	ut = tidalVelocities(e)
	for _, i := range []int{0, 80, 150} {
		x := (float64(i) + 0.5) * dx
		b, _ := e.Geometry.At(x)
		prism := 3000 * 25e3 * (math.Exp(-x/25e3) - math.Exp(-80e3/25e3))
		want := omega * prism / (b * 10)
		if !near(ut[i], want, midpointTol) {
			t.Errorf("exponential cell %d: %v, want %v", i, ut[i], want)
		}
	}
}

// TestEstimateEstuary checks the step count against the CFL limit computed
// here from the formula in EstimateEstuary's documentation.
func TestEstimateEstuary(t *testing.T) {
	e := prismaticEstuary()
	c := EstimateEstuary(e)
	dx := 500.0
	omega := 2 * math.Pi / PeriodM2
	ut := omega * 1 * (50e3 - dx/2) / 8             // largest at the mouth cell
	ur := 200.0 / (1000 * 8)                        // Q/(B·H)
	ci := math.Sqrt(9.81*7.7e-4*30*8) / 2           // two-layer internal wave speed
	dt := math.Min(0.9*dx/(ut+ur+ci), PeriodM2/100) // CFL 0.9, ≥ 100 steps per tide
	if !near(c.TimeStep, dt, 1e-12) {
		t.Errorf("time step %v, want %v", c.TimeStep, dt)
	}
	if end := 12 * 86400.0; float64(c.Steps)*c.TimeStep < end || float64(c.Steps-1)*c.TimeStep >= end {
		t.Errorf("%d steps of %v s do not just cover %v s", c.Steps, c.TimeStep, end)
	}
	if c.CellSteps != 100*2*c.Steps || c.Outputs != 241 || c.Stations != 100 {
		t.Errorf("counts %+v", c)
	}
	// Doubling the cells while the CFL limit governs also halves the step:
	// cell-steps rise about four-fold.
	e.Geometry.Cells = 200
	c2 := EstimateEstuary(e)
	if r := float64(c2.CellSteps) / float64(c.CellSteps); r < 3.9 || r > 4.1 {
		t.Errorf("cell-steps ratio %v for twice the cells, want about 4", r)
	}
}

// TestEstimateMixtureScaling: the Mie series length depends on size and
// wavelength only through x = π·D·n/λ, so scaling every diameter and every
// wavelength by the same factor leaves the count unchanged (identity).
func TestEstimateMixtureScaling(t *testing.T) {
	mk := func(f float64) Mixture {
		return Mixture{
			Populations: []Population{
				{Kind: KindMineral, Size: SizeDistribution{Kind: SizeJunge, DMin: f * 0.5e-6, DMax: f * 60e-6}},
				{Kind: KindOrganic, Size: SizeDistribution{Kind: SizeLognormal, Median: f * 8e-6, GSD: 2}},
				{Kind: KindFloc, Size: SizeDistribution{Kind: SizeLognormal, Median: f * 80e-6, GSD: 1.8},
					Floc: FlocParams{PrimarySize: f * 4e-6}},
			},
			Optics: Optics{Wavelengths: []float64{f * 400e-9, f * 550e-9, f * 700e-9}, Angles: []float64{1, 2}, SizeBins: 50},
		}
	}
	a, b := EstimateMixture(mk(1)), EstimateMixture(mk(3))
	if !near(a.MieTerms, b.MieTerms, 1e-12) || a.KernelSizes != 2*50+100 || a.AngleTerms != 2*a.MieTerms {
		t.Errorf("terms %v vs %v, sizes %d", a.MieTerms, b.MieTerms, a.KernelSizes)
	}
	// More terms than the size parameter itself at the largest grain
	// (Wiscombe's criterion exceeds x): a lower bound from the grid.
	x := math.Pi * costWaterIndex * 60e-6 / 400e-9
	if a.MieTerms < x {
		t.Errorf("terms %v below x = %v", a.MieTerms, x)
	}
}

func TestWiscombeTermsContinuity(t *testing.T) {
	// The three branches of the criterion join within a few terms at their
	// boundaries (x = 8 and 4200; Wiscombe 1980 chose them to).
	for _, x := range []float64{8, 4200} {
		lo, hi := wiscombeTerms(math.Nextafter(x, 0)), wiscombeTerms(x)
		if math.Abs(hi-lo) > 2 {
			t.Errorf("jump of %v terms at x = %v", hi-lo, x)
		}
	}
}
