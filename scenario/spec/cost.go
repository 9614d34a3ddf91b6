package spec

import (
	"fmt"
	"math"
	"strings"
)

// Cost is a rough count of the work a scenario asks for, for `murk check`.
// It counts operations, not seconds: multiply by throughputs measured with
// the benchmarks of packages mixing and mie to get a time. Every count is an
// estimate good to a factor of a few; the assumptions are the constants
// below.
type Cost struct {
	// Estuary model.
	Cells     int     // finite-volume cells
	Layers    int     // layers per cell (2)
	TimeStep  float64 // estimated stable step, s
	Steps     int64   // time steps over spin-up + duration
	CellSteps int64   // Cells × Layers × Steps
	Outputs   int64   // output times after spin-up
	Stations  int     // output stations (cells when none are listed)

	// Optical kernels, built once per run.
	Wavelengths int
	Angles      int
	KernelSizes int     // diameter bins summed over populations (floc sizes included)
	MieTerms    float64 // Lorenz–Mie series terms summed over sub-points, bins and wavelengths
	AngleTerms  float64 // MieTerms × Angles: amplitude-function evaluations for the VSF

	// Per-output work and size.
	IOPProducts  float64 // kernel bin × wavelength products over all outputs, stations and layers
	OutputValues float64 // numbers written to the NetCDF file (8 bytes each at most)
}

// Assumptions of Estimate.
const (
	// costCFL is the Courant number assumed for the explicit advection of
	// the estuary model (common practice for monotone upwind schemes: < 1).
	costCFL = 0.9
	// costStepsPerTide is the least number of steps per M2 period assumed
	// for a resolved tide.
	costStepsPerTide = 100
	// costSubPoints is the number of size sub-points per kernel bin assumed
	// for bin averaging of Mie ripple.
	costSubPoints = 8
	// costFlocSizes is the floc-size grid of a floc kernel (issue 4 sizes
	// its benchmark at 100 floc sizes).
	costFlocSizes = 100
	// costRDGQuadrature is the number of angle nodes assumed for integrating
	// a structure factor over angle (fractal RDG optics).
	costRDGQuadrature = 200
	// costWaterIndex bounds the refractive index of water over 400–900 nm
	// for size parameters (about 1.33–1.34: Quan & Fry 1995, from memory).
	costWaterIndex = 1.34
	// costQuantities is the number of IOP quantities written per component
	// besides the VSF angles (a, b, bb, c, bb/b, and one slope).
	costQuantities = 6
	// gravity and the haline contraction coefficient (β ≈ 7.7e-4 per PSU,
	// as used by MacCready for the Geyer & MacCready 2014 parameters).
	costG    = 9.81
	costBeta = 7.7e-4
)

// wiscombeTerms is the Lorenz–Mie series length criterion of Wiscombe
// (1980, Appl. Opt. 19:1505; from memory): N = x + 4·x^(1/3) + 1 for
// x < 8, x + 4.05·x^(1/3) + 2 for 8 ≤ x < 4200, x + 4·x^(1/3) + 2 above.
// Package mie uses a few more terms (see its seriesLength); for a cost
// estimate the difference (about 1.5·x^(1/3)) does not matter.
func wiscombeTerms(x float64) float64 {
	switch {
	case x < 8:
		return x + 4*math.Cbrt(x) + 1
	case x < 4200:
		return x + 4.05*math.Cbrt(x) + 2
	}
	return x + 4*math.Cbrt(x) + 2
}

// Estimate returns the rough cost of a full scenario.
func Estimate(s Scenario) Cost {
	c := EstimateEstuary(s.Estuary)
	m := EstimateMixture(s.Mixture)
	c.Wavelengths, c.Angles, c.KernelSizes = m.Wavelengths, m.Angles, m.KernelSizes
	c.MieTerms, c.AngleTerms = m.MieTerms, m.AngleTerms
	comps := float64(len(s.Mixture.Populations) + 2) // + water + dissolved
	points := float64(c.Outputs) * float64(c.Stations) * float64(c.Layers)
	c.IOPProducts = points * float64(m.KernelSizes) * float64(m.Wavelengths) * float64(costQuantities+m.Angles)
	c.OutputValues = points * comps * float64(m.Wavelengths) * float64(costQuantities+m.Angles)
	return c
}

// EstimateEstuary returns the estuary part of the cost. The time step is
// the advective limit dx/(U_T + U_R + c_i): U_T the tidal velocity
// amplitude (given, or the prism estimate ω·η0·∫ₓᴸB dx'/(B·H) at the mouth
// end), U_R the river velocity Q/(B·H) at the head and c_i the two-layer
// internal wave speed sqrt(g·β·S·H)/2 at equal layers; it is also capped
// at costStepsPerTide steps per M2 period.
func EstimateEstuary(e Estuary) Cost {
	g := e.Geometry
	c := Cost{Cells: g.Cells, Layers: 2, Stations: len(e.Run.Stations)}
	if c.Stations == 0 {
		c.Stations = g.Cells
	}
	if g.Cells <= 0 || g.Length <= 0 {
		return c
	}
	dx := g.Length / float64(g.Cells)
	var uMax float64
	ut := tidalVelocities(e)
	for i := 0; i < g.Cells; i++ {
		b, h := g.At((float64(i) + 0.5) * dx)
		if b <= 0 || h <= 0 {
			continue
		}
		ur := e.River.Discharge.Max() / (b * h)
		ci := math.Sqrt(costG*costBeta*e.Ocean.Salinity*h) / 2
		uMax = math.Max(uMax, ut[i]+ur+ci)
	}
	dt := PeriodM2 / costStepsPerTide
	if uMax > 0 {
		dt = math.Min(dt, costCFL*dx/uMax)
	}
	c.TimeStep = dt
	c.Steps = int64(math.Ceil(e.Run.End() / dt))
	c.CellSteps = int64(c.Cells) * int64(c.Layers) * c.Steps
	if e.Run.OutputInterval > 0 {
		c.Outputs = int64(math.Floor(e.Run.Duration/e.Run.OutputInterval)) + 1
	}
	return c
}

// EstimateMixture returns the optical-kernel part of the cost: for each
// population, diameter bins over its size range × costSubPoints ×
// wavelengths × the Wiscombe series length at each sub-point.
func EstimateMixture(m Mixture) Cost {
	c := Cost{Wavelengths: len(m.Optics.Wavelengths), Angles: len(m.Optics.Angles)}
	bins := m.Optics.SizeBins
	for _, p := range m.Populations {
		lo, hi := sizeSpan(p.Size)
		if p.Kind == KindFloc {
			c.KernelSizes += costFlocSizes
			for _, lambda := range m.Optics.Wavelengths {
				k := math.Pi * costWaterIndex / lambda
				// primaries once per wavelength
				c.MieTerms += wiscombeTerms(k * p.Floc.PrimarySize)
				if p.Floc.Optics == FlocRDG {
					c.MieTerms += costFlocSizes * costRDGQuadrature
					continue
				}
				d, r := logGrid(lo, hi, costFlocSizes)
				for range costFlocSizes {
					c.MieTerms += wiscombeTerms(k * d)
					d *= r
				}
			}
			continue
		}
		c.KernelSizes += bins
		n := bins * costSubPoints
		for _, lambda := range m.Optics.Wavelengths {
			k := math.Pi * costWaterIndex / lambda
			d, r := logGrid(lo, hi, n)
			for range n {
				c.MieTerms += wiscombeTerms(k * d)
				d *= r
			}
		}
	}
	c.AngleTerms = c.MieTerms * float64(c.Angles)
	return c
}

// tidalVelocities returns the tidal velocity amplitude (M2 + S2, m/s) at
// each cell centre: a given velocity amplitude, or the classic prism
// estimate U_T(x) = ω·η0·∫ₓᴸ B dx' / (B(x)·H(x)) with the prism landward of
// the cell centre integrated by the midpoint rule on the cell grid (half
// the cell's own width, then every cell landward).
func tidalVelocities(e Estuary) []float64 {
	g := e.Geometry
	out := make([]float64, g.Cells)
	dx := g.Length / float64(g.Cells)
	omega := 2 * math.Pi / PeriodM2
	amp := e.Tide.M2.Amplitude + e.Tide.S2.Amplitude
	prism := 0.0 // ∫ B dx' from the current cell's landward face to the head
	for i := g.Cells - 1; i >= 0; i-- {
		x := (float64(i) + 0.5) * dx
		b, h := g.At(x)
		out[i] = e.Tide.M2.Velocity + e.Tide.S2.Velocity
		if amp > 0 && b > 0 && h > 0 {
			half, _ := g.At(x + dx/4) // midpoint of the landward half cell
			out[i] += omega * amp * (prism + half*dx/2) / (b * h)
		}
		prism += b * dx
	}
	return out
}

// sizeSpan is the diameter range a kernel must cover: the Junge limits, a
// lognormal's median·gsd^±4 (beyond 4 geometric standard deviations lies
// less than 1e-4 of the distribution), or 0.1–500 µm for a table.
func sizeSpan(s SizeDistribution) (lo, hi float64) {
	switch s.Kind {
	case SizeJunge:
		return s.DMin, s.DMax
	case SizeLognormal:
		f := math.Pow(s.GSD, 4)
		return s.Median / f, s.Median * f
	}
	return 0.1e-6, 500e-6
}

// logGrid returns the first centre and the ratio of n bins spaced evenly in
// ln D over [lo, hi]: centres lo·r^(i+½) with r = (hi/lo)^(1/n).
func logGrid(lo, hi float64, n int) (first, ratio float64) {
	if n < 1 || !(lo > 0) || !(hi > lo) {
		return math.Max(lo, 0), 1
	}
	r := math.Pow(hi/lo, 1/float64(n))
	return lo * math.Sqrt(r), r
}

// String prints the estimate as a few aligned lines.
func (c Cost) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "estuary:  %d cells × %d layers × %d steps (Δt ≈ %.0f s) = %.3g cell-steps\n",
		c.Cells, c.Layers, c.Steps, c.TimeStep, float64(c.CellSteps))
	fmt.Fprintf(&b, "kernels:  %d size bins × %d wavelengths, %.3g Mie terms, %.3g angle terms (%d angles)\n",
		c.KernelSizes, c.Wavelengths, c.MieTerms, c.AngleTerms, c.Angles)
	fmt.Fprintf(&b, "outputs:  %d times × %d stations: %.3g kernel products, %.3g values (%.3g MB)\n",
		c.Outputs, c.Stations, c.IOPProducts, c.OutputValues, c.OutputValues*8/1e6)
	return b.String()
}
