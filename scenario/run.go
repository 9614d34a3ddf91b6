package scenario

import (
	"context"
	"errors"
	"fmt"
	"io"
	"math"
	"runtime"
	"sync"
	"time"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/seen"
	"github.com/murk-optics/murk/scenario/sensing"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/water"
)

// Options are the choices of a run that are not part of the scenario. The
// zero value is ready to use.
type Options struct {
	// Workers is the number of goroutines for the kernels and the IOP
	// evaluation; 0 means runtime.GOMAXPROCS(0). Results do not depend on
	// it.
	Workers int
	// FlocInterval is the longest time between floc size updates, s; 0
	// means DefaultFlocInterval.
	FlocInterval float64
	// Kernel tunes the sub-sampling of the particle kernels (package
	// mie/kernel; zero fields take that package's defaults).
	Kernel KernelOptions
	// SolarZenith is the sun's zenith angle for reflectance, K_d and
	// Secchi depth, rad, in [0, π/2); 0 means DefaultSolarZenith.
	SolarZenith float64
	// Progress, when not nil, receives one line per stage of the run
	// once the run has taken longer than a second.
	Progress io.Writer
}

// KernelOptions are the sub-sampling controls of kernel.Spec. The zero
// value means DefaultKernel; set Exact for the kernel package's own
// defaults (fully resolved ripple, exact C_bb to x = 200).
type KernelOptions struct {
	SubStep        float64 // largest size-parameter spacing of sub-points
	BackscatterX   float64 // size parameter beyond which C_bb is stratified
	BackscatterSub int     // strata for C_bb beyond BackscatterX
	Exact          bool    // use kernel.DefaultSubStep, DefaultBackscatterX, DefaultBackscatterSub
}

// DefaultKernel trades the ripple resolution of the kernels for speed:
// sub-points every 0.5 in size parameter (two per ripple period instead of
// five) and exact hemispherical backscattering up to x = 50 (then four
// jittered strata per bin, the kernel package's own number). Natural populations are broad (Junge or
// lognormal with σg ≥ 1.5), so a bulk IOP sums hundreds of ripple periods
// and the aliasing averages out: the tests bound the change of bulk
// a, b and b_b against the exact settings (TestDefaultKernelAccuracy);
// the saving is a factor of three to five in the kernel build, the
// dominant cost of a run.
var DefaultKernel = KernelOptions{SubStep: 0.5, BackscatterX: 50, BackscatterSub: 4}

// progressDelay is how long a run goes quiet before progress lines start.
const progressDelay = time.Second

// DefaultSolarZenith is 30°, a mid-latitude mid-morning sun inside the
// 0–60° range of the K_d model's simulations (Lee et al. 2005; common
// practice for a reference geometry).
const DefaultSolarZenith = 30 * math.Pi / 180

// Component kinds of a Result (the kinds of package iop).
const (
	KindWater     = iop.Water
	KindDissolved = iop.Dissolved
	KindPigment   = iop.Pigment
	KindParticles = iop.Particles
)

// Component names one separable contribution to the IOPs.
type Component struct {
	Name string
	Kind iop.Kind
	// Population is the scenario population (KindParticles), else nil.
	Population *spec.Population
}

// Result is a scenario run: the estuary state and the IOPs at every
// station, layer and output time.
//
// Points are indexed p = (t·len(Stations) + j)·mixing.Layers + l for output
// time t, station j and layer l (0 upper, 1 lower). Per point and
// wavelength w, component k's absorption, scattering and backscattering are
// A[(p·NK + k)·NW + w] and so on (NK components, NW wavelengths); the total
// VSF is VSF[(p·NW + w)·NA + a]. The column-wide apparent properties use
// the upper layer and are indexed by q = t·len(Stations) + j.
type Result struct {
	Scenario    spec.Scenario
	Wavelengths []float64 // vacuum wavelength, m
	Angles      []float64 // scattering angles, rad
	Times       []float64 // output times, s since the start of the spin-up
	Stations    []float64 // distance from the mouth, m
	Classes     []string  // sediment classes
	Components  []Component
	Estuary     *mixing.Result // snapshots at Times (Hydrodynamics.Result)

	// Plan and Hydrodynamics are the stages the result was evaluated on.
	Plan          *Plan
	Hydrodynamics *Hydrodynamics

	// Points is the state and bulk optics at the stations
	// (Points.Distance is Stations).
	Points
	// Section is the same at every model cell (Section.Distance holds
	// the cell centres), for sections along the channel at the model's
	// full resolution, with its totals at the reference wavelength only;
	// spectra, the components, the VSF, apparent properties and
	// instruments are kept at the stations only.
	Section Points

	A, B, Bb []float64 // m⁻¹ per component, at the stations
	VSF      []float64 // m⁻¹ sr⁻¹, total, at the stations

	// Apparent properties per station and time (upper layer).
	Rrs, Kd   []float64 // sr⁻¹ and m⁻¹, [q·NW + w]
	Secchi    []float64 // m
	Hue       []float64 // degree
	ForelUle  []int     // 1–21, 0 undefined
	SeenFlags []seen.Flag

	SolarZenith float64 // rad, the sun of the apparent properties

	// Instruments are the simulated sensors (package scenario/sensing);
	// Readings[p·len(Instruments) + i] is instrument i at point p.
	Instruments []sensing.Instrument
	Readings    []sensing.Reading

	Summary Summary
}

// Points holds the water state and the bulk optics at a set of positions
// along the channel, every output time and layer: point
// p = (t·len(Distance) + i)·mixing.Layers + l.
type Points struct {
	Distance []float64 // from the mouth, m, strictly increasing for the section

	Salinity, Temperature, ShearRate, Thickness []float64 // PSU, °C, s⁻¹, m
	Concentration                               []float64 // kg m⁻³, [p·NC + class]
	FlocDiameter                                []float64 // median of floc mass, m, [p·NP + population]; 0 for non-floc populations

	// Band lists the run's wavelength indices the totals are kept at:
	// every wavelength at the stations, the reference wavelength (nearest
	// 550 nm) in the section, whose memory then grows with the cells and
	// not with the spectrum. Ref is the reference wavelength's place in
	// Band.
	Band []int
	Ref  int
	// Totals, m⁻¹, [p·len(Band) + k] for wavelength Band[k]: all
	// components (A, B, Bb) and the particles alone (Bp, Bbp).
	TotalA, TotalB, TotalBb []float64
	Bp, Bbp                 []float64

	ParticleBbSlope []float64 // γ of b_bp(λ) ∝ λ^−γ over all wavelengths, 1
	ParticleCSlope  []float64 // γ of c_p(λ), 1
}

// newPoints allocates the points of positions x at nt times, with totals
// at the wavelengths band of which ref is the reference.
func newPoints(x []float64, band []int, ref, nt, nc, np int) Points {
	n := nt * len(x) * mixing.Layers
	nw := len(band)
	f := func(k int) []float64 { return make([]float64, k) }
	return Points{
		Distance: x, Band: band, Ref: ref,
		Salinity: f(n), Temperature: f(n), ShearRate: f(n), Thickness: f(n),
		Concentration: f(n * nc), FlocDiameter: f(n * np),
		TotalA: f(n * nw), TotalB: f(n * nw), TotalBb: f(n * nw), Bp: f(n * nw), Bbp: f(n * nw),
		ParticleBbSlope: f(n), ParticleCSlope: f(n),
	}
}

// Point returns the point index of output time t, position i and layer l.
func (ps *Points) Point(t, i, l int) int { return (t*len(ps.Distance)+i)*mixing.Layers + l }

// AtRef returns total v (one of TotalA, TotalB, TotalBb, Bp, Bbp) at point
// p and the reference wavelength.
func (ps *Points) AtRef(v []float64, p int) float64 { return v[p*len(ps.Band)+ps.Ref] }

// SSC is the suspended sediment concentration of all classes at point p,
// kg m⁻³.
func (ps *Points) SSC(p, nc int) float64 {
	s := 0.0
	for c := 0; c < nc; c++ {
		s += ps.Concentration[p*nc+c]
	}
	return s
}

// NW, NA, NK, NC, NP: grid sizes.
func (r *Result) NW() int { return len(r.Wavelengths) }
func (r *Result) NA() int { return len(r.Angles) }
func (r *Result) NK() int { return len(r.Components) }
func (r *Result) NC() int { return len(r.Classes) }
func (r *Result) NP() int { return len(r.Scenario.Mixture.Populations) }

// Value returns quantity q of component k at point p and wavelength w.
func (r *Result) Value(q iop.Quantity, p, k, w int) float64 {
	i := (p*r.NK()+k)*r.NW() + w
	switch q {
	case iop.Absorption:
		return r.A[i]
	case iop.Scattering:
		return r.B[i]
	case iop.Backscattering:
		return r.Bb[i]
	case iop.Attenuation:
		return r.A[i] + r.B[i]
	}
	return math.NaN()
}

// Sum returns quantity q summed over the components for which keep is true
// (all when keep is nil) at point p and wavelength w.
func (r *Result) Sum(q iop.Quantity, p, w int, keep func(Component) bool) float64 {
	s := 0.0
	for k, c := range r.Components {
		if keep == nil || keep(c) {
			s += r.Value(q, p, k, w)
		}
	}
	return s
}

// Particles selects the particle components for Sum.
func Particles(c Component) bool { return c.Kind == iop.Particles }

// Run runs a validated scenario through the pipeline (doc.go): the optics
// plan (kernels of every population, once), the hydrodynamics (the estuary
// model coupled to the floc model), the IOPs at every station, layer and
// output time, and what is sensed there. It honours ctx between stages and
// between output times.
func Run(ctx context.Context, s spec.Scenario, opt Options) (*Result, error) {
	opt, err := opt.normalise()
	if err != nil {
		return nil, err
	}
	start := time.Now()
	progress := func(format string, a ...any) {
		// Runs shorter than progressDelay print nothing.
		if opt.Progress != nil && time.Since(start) >= progressDelay {
			fmt.Fprintf(opt.Progress, "%6.2fs  "+format+"\n", append([]any{time.Since(start).Seconds()}, a...)...)
		}
	}
	cfg, err := EstuaryConfig(s.Estuary)
	if err != nil {
		return nil, err
	}
	plan, err := preparePlan(s.Mixture, referenceWater(s), s.Estuary.Ocean.Salinity, opt)
	if err != nil {
		return nil, err
	}

	// The hydrodynamics, with floc settling from the plan's floc models,
	// run in their own goroutine while the plan builds its kernels: the
	// two are independent until the IOPs are evaluated.
	progress("running the estuary model: %d cells, %.1f days; building optical kernels for %d populations",
		cfg.Geometry.Cells, cfg.Run.Duration/86400, len(s.Mixture.Populations))
	var (
		hydro    *Hydrodynamics
		hydroErr error
		done     = make(chan struct{})
	)
	go func() {
		defer close(done)
		hydro, hydroErr = runHydrodynamics(ctx, s.Estuary, cfg, opt.FlocInterval, planFlocs(s.Estuary, plan))
	}()
	err = plan.build(ctx, opt, progress)
	<-done
	if err != nil {
		return nil, err
	}
	if hydroErr != nil {
		return nil, hydroErr
	}
	progress("estuary model done: %d steps", hydro.Result.Steps)
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	return Evaluate(ctx, s, plan, hydro, opt)
}

// Evaluate runs the last stages for scenario s on a built plan and
// hydrodynamics: the IOPs at every station, layer and output time (cheap
// weighted sums of the plan's kernels), what is sensed there, and the
// summary. Workflows that share one plan between runs call it directly.
func Evaluate(ctx context.Context, s spec.Scenario, plan *Plan, hydro *Hydrodynamics, opt Options) (*Result, error) {
	opt, err := opt.normalise()
	if err != nil {
		return nil, err
	}
	r := newResult(s, plan, hydro)
	r.SolarZenith = opt.SolarZenith
	if err := r.evaluate(ctx, opt); err != nil {
		return nil, err
	}
	r.Summary = summarise(r)
	return r, nil
}

// normalise fills the zero fields of opt.
func (opt Options) normalise() (Options, error) {
	if opt.Workers <= 0 {
		opt.Workers = runtime.GOMAXPROCS(0)
	}
	if opt.FlocInterval <= 0 {
		opt.FlocInterval = DefaultFlocInterval
	}
	if opt.Kernel == (KernelOptions{}) {
		opt.Kernel = DefaultKernel
	}
	if opt.Kernel.Exact {
		opt.Kernel = KernelOptions{}
	}
	if opt.SolarZenith == 0 {
		opt.SolarZenith = DefaultSolarZenith
	}
	if !(opt.SolarZenith > 0 && opt.SolarZenith < math.Pi/2) {
		return opt, fmt.Errorf("scenario: Options.SolarZenith %g rad outside (0, π/2)", opt.SolarZenith)
	}
	return opt, nil
}

// newResult allocates the result of scenario s on plan and hydro.
func newResult(s spec.Scenario, plan *Plan, hydro *Hydrodynamics) *Result {
	est := hydro.Result
	r := &Result{
		Scenario:      s,
		Plan:          plan,
		Hydrodynamics: hydro,
		Wavelengths:   plan.Wavelengths,
		Angles:        plan.Angles,
		Times:         hydro.Config.Run.Output,
		Classes:       est.Classes,
		Estuary:       est,
		Components:    plan.Components,
	}
	r.Stations = s.Estuary.Run.Stations
	if len(r.Stations) == 0 {
		r.Stations = est.X
	}
	np := len(r.Times) * len(r.Stations) * mixing.Layers
	nq := len(r.Times) * len(r.Stations)
	nw, nk := r.NW(), r.NK()
	f := func(n int) []float64 { return make([]float64, n) }
	all := make([]int, nw)
	for i := range all {
		all[i] = i
	}
	wref := refWavelength(r.Wavelengths)
	r.Points = newPoints(r.Stations, all, wref, len(r.Times), r.NC(), r.NP())
	r.Section = newPoints(est.X, []int{wref}, 0, len(r.Times), r.NC(), r.NP())
	r.A, r.B, r.Bb = f(np*nk*nw), f(np*nk*nw), f(np*nk*nw)
	r.VSF = f(np * nw * r.NA())
	r.Rrs, r.Kd = f(nq*nw), f(nq*nw)
	r.Secchi, r.Hue = f(nq), f(nq)
	r.ForelUle = make([]int, nq)
	r.Instruments = plan.Instruments
	r.Readings = make([]sensing.Reading, np*len(r.Instruments))
	r.SeenFlags = make([]seen.Flag, nq)
	return r
}

// site is where a point sits between the cell centres xc: a field f
// (per cell) has the value f[i]·(1−u) + f[i+1]·u there, linear
// interpolation between centres, held constant beyond the first and last
// centre. At a cell centre u is 0 and the value is the cell's own.
type site struct {
	i int
	u float64
}

// siteAt returns the site of distance x between the centres xc, which are
// evenly spaced (package mixing's grid).
func siteAt(xc []float64, x float64) site {
	n := len(xc)
	switch {
	case x <= xc[0]:
		return site{0, 0}
	case x >= xc[n-1]:
		return site{n - 1, 0}
	}
	dx := xc[1] - xc[0]
	i := min(int((x-xc[0])/dx), n-2)
	return site{i, (x - xc[i]) / dx}
}

// of returns field f at the site.
func (s site) of(f []float64) float64 {
	if s.u == 0 {
		return f[s.i]
	}
	return f[s.i]*(1-s.u) + f[s.i+1]*s.u
}

// flocOf returns the floc median diameter of layer l at the site from the
// per-cell sizes d ([cell·Layers + layer]), interpolated in ln D: floc
// sizes vary over orders of magnitude.
func (s site) flocOf(d []float64, l int) float64 {
	if s.u == 0 {
		return d[s.i*mixing.Layers+l]
	}
	a, b := math.Log(d[s.i*mixing.Layers+l]), math.Log(d[(s.i+1)*mixing.Layers+l])
	return math.Exp(a*(1-s.u) + b*s.u)
}

// worker holds the scratch space of one goroutine of the IOP evaluation.
type worker struct {
	spectra *iop.Spectra
	total   iop.Component
	part    iop.Component
	popIOP  []kernel.IOP
	numbers [][]float64
	bbp, cp []float64
	cdom    water.CDOMMixing
	pigment water.ChlPowerLaw
	obs     seen.Observer
	app     seen.Apparent
	bbw     []float64
	point   *sensing.Point // the instruments' view of the point
	mass    []float64      // per population: dry mass, kg m⁻³ (class-riding and flocs)
	flocD   []float64      // per population: floc median diameter, m
}

// fill sets the worker's components to water of salinity sal and
// temperature temp (°C) holding CDOM and pigment mixed at that salinity and
// the populations at w.mass (class-riding ones and flocs; uniform ones at
// their own concentration) with floc sizes w.flocD. This is the cheap part
// of the optics: every population term is a dot product of its kernel with
// bin numbers, or a scaled mass-specific spectrum.
func (w *worker) fill(p *Plan, sal, temp float64) error {
	comps := w.spectra.Components
	k := 0
	if err := w.spectra.FillWater(&comps[k], water.Medium{Salinity: sal, TemperatureC: min(max(temp, water.MinTemperatureC), water.MaxTemperatureC)}); err != nil {
		return err
	}
	copy(w.bbw, comps[k].Bb)
	k++
	if err := w.spectra.FillCDOM(&comps[k], w.cdom, min(sal, w.cdom.OceanSalinity)); err != nil {
		return err
	}
	k++
	if p.Components[k].Kind == iop.Pigment {
		chl := p.Mixture.Water.Chlorophyll.AtSalinity(sal, w.cdom.OceanSalinity)
		c := &comps[k]
		c.Kind = iop.Pigment
		for i, lam := range p.Wavelengths {
			a, err := w.pigment.Absorption(lam, chl)
			if err != nil {
				return err
			}
			c.A[i], c.B[i], c.Bb[i] = a, 0, 0
		}
		for i := range c.VSF {
			c.VSF[i] = 0
		}
		k++
	}
	for i, po := range p.populations {
		c := &comps[k+i]
		dst := &w.popIOP[i]
		switch {
		case po.isFloc:
			if err := po.flocNumbers(w.numbers[i], w.mass[i], w.flocD[i], sal); err != nil {
				return err
			}
			if err := po.table.Evaluate(w.numbers[i], dst); err != nil {
				return err
			}
			setComponent(c, dst, 1)
		case po.uniform:
			setComponent(c, &po.iop, 1)
		default:
			setComponent(c, &po.iop, w.mass[i])
		}
		c.Mass = w.mass[i]
	}
	return nil
}

// newWorker returns the scratch space of one goroutine evaluating the
// plan's optics at points.
func (p *Plan) newWorker(opt Options) (*worker, error) {
	sp, err := iop.New(p.Wavelengths, p.Angles)
	if err != nil {
		return nil, err
	}
	w := &worker{spectra: sp, obs: seen.Observer{SolarZenith: opt.SolarZenith}}
	for _, c := range p.Components {
		sp.Components = append(sp.Components, sp.Blank(c.Name, c.Kind, 0))
	}
	w.total = sp.Blank("total", iop.Particles, 0)
	w.part = sp.Blank("particles", iop.Particles, 0)
	pops := p.populations
	nw := len(p.Wavelengths)
	for _, po := range pops {
		w.popIOP = append(w.popIOP, po.table.NewIOP())
		w.numbers = append(w.numbers, make([]float64, po.table.NBins()))
	}
	w.bbp, w.cp = make([]float64, nw), make([]float64, nw)
	w.bbw = make([]float64, nw)
	w.point = sensing.NewPoint(p.Wavelengths, p.Angles)
	w.mass, w.flocD = make([]float64, len(pops)), make([]float64, len(pops))
	so := p.OceanSalinity
	cd := p.Mixture.Water.CDOM
	lref := cd.ReferenceWavelength
	if lref <= 0 {
		lref = 440e-9
	}
	w.cdom = water.CDOMMixing{
		River:         water.CDOM{RefWavelength: lref, ARef: cd.Absorption.River, Slope: cd.Slope},
		Ocean:         water.CDOM{RefWavelength: lref, ARef: cd.Absorption.Ocean, Slope: cd.Slope},
		OceanSalinity: so,
	}
	if err := w.cdom.Validate(); err != nil {
		return nil, fmt.Errorf("scenario: CDOM: %w", err)
	}
	w.pigment = water.BricaudDefault()
	return w, nil
}

// evaluate fills the per-point state and optics. Output times are shared
// out to workers; every point is computed by one worker into its own slots,
// so the result does not depend on the number of workers.
func (r *Result) evaluate(ctx context.Context, opt Options) error {
	nt := len(r.Times)
	jobs := make(chan int)
	errs := make([]error, nt)
	var wg sync.WaitGroup
	nwk := min(opt.Workers, nt)
	workers := make([]*worker, nwk)
	for i := range workers {
		w, err := r.Plan.newWorker(opt)
		if err != nil {
			return err
		}
		workers[i] = w
	}
	for _, w := range workers {
		wg.Add(1)
		go func(w *worker) {
			defer wg.Done()
			for t := range jobs {
				errs[t] = r.evaluateTime(w, t)
			}
		}(w)
	}
	var cerr error
	for t := 0; t < nt; t++ {
		if cerr = ctx.Err(); cerr != nil {
			break
		}
		jobs <- t
	}
	close(jobs)
	wg.Wait()
	if cerr != nil {
		return cerr
	}
	return errors.Join(errs...)
}

func (r *Result) evaluateTime(w *worker, t int) error {
	x := r.Estuary.X
	nk, nw, na := r.NK(), r.NW(), r.NA()
	comps := w.spectra.Components
	// Stations: every component, the VSF, instruments and what is seen.
	for j, xs := range r.Stations {
		st := siteAt(x, xs)
		for l := 0; l < mixing.Layers; l++ {
			p := r.Point(t, j, l)
			if err := r.evaluatePoint(w, &r.Points, p, t, st, l); err != nil {
				return err
			}
			for kk := range comps {
				o := (p*nk + kk) * nw
				copy(r.A[o:o+nw], comps[kk].A)
				copy(r.B[o:o+nw], comps[kk].B)
				copy(r.Bb[o:o+nw], comps[kk].Bb)
			}
			copy(r.VSF[p*nw*na:(p+1)*nw*na], w.total.VSF)
			var rrs []float64 // reflectance, at the surface only
			if l == 0 {
				q := t*len(r.Stations) + j
				if err := r.see(w, q); err != nil {
					return err
				}
				rrs = r.Rrs[q*nw : (q+1)*nw]
			}
			if err := r.readInstruments(w, p, r.Salinity[p], r.Temperature[p], rrs); err != nil {
				return err
			}
		}
	}
	// The section: bulk optics at every cell centre.
	for i := range x {
		for l := 0; l < mixing.Layers; l++ {
			if err := r.evaluatePoint(w, &r.Section, r.Section.Point(t, i, l), t, site{i, 0}, l); err != nil {
				return err
			}
		}
	}
	return nil
}

// evaluatePoint computes point p of ps (output time t, layer l, at site
// st of the model grid): the water state, the worker's components and
// their total and particle sum, and the stored totals and slopes.
func (r *Result) evaluatePoint(w *worker, ps *Points, p, t int, st site, l int) error {
	snap := &r.Estuary.Snapshots[t]
	nc, np := r.NC(), r.NP()
	ncell := len(r.Estuary.X)
	var sizes []float64
	if t < len(r.Hydrodynamics.FlocDiameter) {
		sizes = r.Hydrodynamics.FlocDiameter[t]
	}
	sal := clampSalinity(st.of(snap.Salinity[l]))
	temp := st.of(snap.Temperature[l])
	ps.Salinity[p], ps.Temperature[p] = sal, temp
	ps.ShearRate[p] = st.of(snap.ShearRate[l])
	ps.Thickness[p] = st.of(snap.Thickness[l])
	for c := 0; c < nc; c++ {
		ps.Concentration[p*nc+c] = max(st.of(snap.Concentration[l][c]), 0)
	}
	for i, po := range r.Plan.populations {
		w.mass[i], w.flocD[i] = 0, 0
		switch {
		case po.uniform:
		case po.isFloc:
			w.mass[i] = po.fixedMass
			if po.spec.ClassIndex >= 0 {
				w.mass[i] = ps.Concentration[p*nc+po.spec.ClassIndex] * po.spec.ClassFraction
			}
			d := po.d0
			if f := r.Hydrodynamics.flocSlot(po.spec.ClassIndex); f >= 0 && sizes != nil {
				d = st.flocOf(sizes[f*ncell*mixing.Layers:], l)
			}
			w.flocD[i] = d
			ps.FlocDiameter[p*np+i] = d
		default:
			w.mass[i] = ps.Concentration[p*nc+po.spec.ClassIndex] * po.spec.ClassFraction
		}
	}
	if err := w.fill(r.Plan, sal, temp); err != nil {
		return err
	}
	w.spectra.Sum(&w.total, nil)
	w.spectra.Sum(&w.part, iop.OfKind(iop.Particles))
	o := p * len(ps.Band)
	for k, wl := range ps.Band {
		ps.TotalA[o+k], ps.TotalB[o+k], ps.TotalBb[o+k] = w.total.A[wl], w.total.B[wl], w.total.Bb[wl]
		ps.Bp[o+k], ps.Bbp[o+k] = w.part.B[wl], w.part.Bb[wl]
	}
	ps.ParticleBbSlope[p] = slopeOrZero(w.spectra, &w.part, iop.Backscattering, r.Wavelengths)
	ps.ParticleCSlope[p] = slopeOrZero(w.spectra, &w.part, iop.Attenuation, r.Wavelengths)
	return nil
}

// setComponent sets c to scale × the population IOP in.
func setComponent(c *iop.Component, in *kernel.IOP, scale float64) {
	for i := range c.A {
		c.A[i] = scale * in.A[i]
		c.B[i] = scale * in.B[i]
		c.Bb[i] = scale * in.Bb[i]
	}
	for i := range c.VSF {
		c.VSF[i] = scale * in.VSF[i]
	}
}

// slopeOrZero fits the power-law slope of quantity q over the whole grid
// (reference 550 nm); 0 where it cannot be fitted (no particles).
func slopeOrZero(s *iop.Spectra, c *iop.Component, q iop.Quantity, wl []float64) float64 {
	if len(wl) < 2 {
		return 0
	}
	pl, err := s.Slope(c, q, wl[0], wl[len(wl)-1], 550e-9)
	if err != nil {
		return 0
	}
	return pl.Slope
}

// see computes the apparent properties of the upper layer at station and
// time q from the worker's total.
func (r *Result) see(w *worker, q int) error {
	nw := r.NW()
	sp := seen.Spectra{Wavelength: r.Wavelengths, A: w.total.A, B: w.total.B, Bb: w.total.Bb}
	if err := w.obs.See(&w.app, sp, w.bbw); err != nil {
		return err
	}
	copy(r.Rrs[q*nw:(q+1)*nw], w.app.Rrs)
	copy(r.Kd[q*nw:(q+1)*nw], w.app.Kd)
	r.SeenFlags[q] = w.app.Flags
	if w.app.HasSecchi {
		r.Secchi[q] = w.app.Secchi.Depth
		r.SeenFlags[q] |= w.app.Secchi.Flags
	}
	if w.app.HasColour {
		r.Hue[q] = w.app.Colour.HueAngle
		r.ForelUle[q] = w.app.Colour.ForelUle
		r.SeenFlags[q] |= w.app.Colour.Flags
	}
	return nil
}
