package kernel

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"sort"
	"sync"
	"sync/atomic"

	"github.com/murk-optics/murk/mie/refindex"
)

// Request describes one particle to evaluate.
type Request struct {
	Diameter    float64   // particle (outer) diameter, m
	Wavelength  float64   // vacuum wavelength, m
	Medium      float64   // real refractive index of the medium at Wavelength
	Mu          []float64 // cosines of the scattering angles at which to fill DCsca
	Backscatter bool      // fill Cbb (costly for large spheres); when false Cbb may be left 0
}

// Sample is the optical response of one particle.
type Sample struct {
	Cext, Csca, Cabs float64   // extinction, scattering, absorption cross-sections, m²
	Cbb              float64   // hemispherical backscattering cross-section (90°–180°), m²
	DCsca            []float64 // dCsca/dΩ at Request.Mu, m² sr⁻¹ (len(Mu), allocated by the caller)
}

// Worker evaluates particles. A Worker is used by one goroutine at a time.
type Worker interface {
	// Eval fills s (all fields, DCsca of length len(r.Mu)) for the particle
	// r. It must not retain r.Mu or s.DCsca, and should not allocate once
	// warmed up.
	Eval(r Request, s *Sample) error
}

// Evaluator is a single-particle optics model: a factory of Workers, one per
// goroutine (each owning its workspace, e.g. a mie.Solver).
type Evaluator interface {
	NewWorker() Worker
}

// Spec is what to tabulate.
type Spec struct {
	Edges       []float64       // size bin edges, m, strictly increasing, ≥ 2 (LogEdges)
	Wavelengths []float64       // vacuum wavelengths, m, ≥ 1
	Angles      []float64       // scattering angles for the VSF, rad, in [0, π]; may be empty
	Medium      refindex.Medium // real index of the medium vs vacuum wavelength; required

	// SubStep is the largest spacing in size parameter between sub-points
	// inside a bin (0 means 0.2: four to five per Mie ripple period).
	SubStep float64
	// MinSub and MaxSub bound the sub-points per bin (0 means 3 and 2048).
	MinSub, MaxSub int
	// Cbb needs the hemispherical integral, about ten times the cost of the
	// rest at large x (see the package documentation). Below size
	// parameter BackscatterX (0 means 200) Cbb is evaluated at every
	// sub-point; in bins reaching beyond it, at BackscatterSub jittered
	// strata of its own (0 means 4; negative means every sub-point, exact
	// and slow). SkipBackscatter leaves Cbb = 0 everywhere (for tables of
	// attenuation and scattering only).
	BackscatterX    float64
	BackscatterSub  int
	SkipBackscatter bool
	// Workers is the number of goroutines (0 means runtime.GOMAXPROCS(0)).
	Workers int
}

// Defaults for Spec's zero fields.
const (
	DefaultSubStep = 0.2
	DefaultMinSub  = 3
	DefaultMaxSub  = 2048

	DefaultBackscatterX   = 200
	DefaultBackscatterSub = 4
)

// Table holds bin-averaged cross-sections. Arrays are flat, wavelength-major:
// cell (wavelength l, bin i) is at l*NBins()+i, and the differential
// cross-section at angle a is at (l*len(Angles)+a)*NBins()+i, so that each
// IOP is a contiguous dot product.
type Table struct {
	Edges       []float64 // bin edges, m
	Wavelengths []float64 // vacuum wavelengths, m
	Angles      []float64 // scattering angles, rad
	Medium      []float64 // medium index used at each wavelength

	Cext, Csca, Cabs, Cbb []float64 // bin-averaged cross-sections, m²
	DCsca                 []float64 // bin-averaged dCsca/dΩ, m² sr⁻¹
	SubPoints             []int32   // sub-points used per cell (diagnostic)
}

// NBins returns the number of size bins.
func (t *Table) NBins() int { return len(t.Edges) - 1 }

// LogEdges returns n+1 bin edges spaced evenly in ln D from min to max (m).
func LogEdges(min, max float64, n int) ([]float64, error) {
	if !(min > 0) || !(max > min) || math.IsInf(max, 0) {
		return nil, fmt.Errorf("kernel: size range [%g, %g] m is empty or invalid, want 0 < min < max < ∞", min, max)
	}
	if n < 1 || n > 1e6 {
		return nil, fmt.Errorf("kernel: %d bins, want 1 to 1e6", n)
	}
	e := make([]float64, n+1)
	r := math.Log(max / min)
	for i := range e {
		e[i] = min * math.Exp(r*float64(i)/float64(n))
	}
	e[n] = max
	return e, nil
}

func (s *Spec) validate() error {
	if len(s.Edges) < 2 {
		return fmt.Errorf("kernel: Spec.Edges has %d edges, want ≥ 2 (an empty size range)", len(s.Edges))
	}
	for i, e := range s.Edges {
		if !(e > 0) || math.IsInf(e, 0) {
			return fmt.Errorf("kernel: Spec.Edges[%d] = %g m, want a finite value > 0 m", i, e)
		}
		if i > 0 && !(e > s.Edges[i-1]) {
			return fmt.Errorf("kernel: Spec.Edges[%d] = %g m not above %g m, want strictly increasing (no empty bins)", i, e, s.Edges[i-1])
		}
	}
	if len(s.Wavelengths) == 0 {
		return errors.New("kernel: Spec.Wavelengths is empty, want ≥ 1 wavelength")
	}
	for i, l := range s.Wavelengths {
		if !(l > 0) || math.IsInf(l, 0) {
			return fmt.Errorf("kernel: Spec.Wavelengths[%d] = %g m, want a finite value > 0 m", i, l)
		}
	}
	for i, a := range s.Angles {
		if !(a >= 0 && a <= math.Pi) {
			return fmt.Errorf("kernel: Spec.Angles[%d] = %g rad, want 0 ≤ θ ≤ π", i, a)
		}
	}
	if s.Medium == nil {
		return errors.New("kernel: Spec.Medium is nil, want the medium's refractive index vs wavelength")
	}
	if !(s.SubStep >= 0) || !(s.BackscatterX >= 0) || s.MinSub < 0 || s.MaxSub < 0 || s.Workers < 0 {
		return fmt.Errorf("kernel: Spec.SubStep = %g, BackscatterX = %g, MinSub = %d, MaxSub = %d, Workers = %d: want all ≥ 0", s.SubStep, s.BackscatterX, s.MinSub, s.MaxSub, s.Workers)
	}
	return nil
}

// plan fixes the sub-point rule of a Spec with defaults applied.
type plan struct {
	subStep        float64
	minSub, maxSub int
	bbSub          int // < 0: no cap
	bbX            float64
	skipBB         bool
}

func (s *Spec) plan() plan {
	p := plan{subStep: s.SubStep, minSub: s.MinSub, maxSub: s.MaxSub, bbSub: s.BackscatterSub, bbX: s.BackscatterX, skipBB: s.SkipBackscatter}
	if p.bbSub == 0 {
		p.bbSub = DefaultBackscatterSub
	}
	if p.bbX == 0 {
		p.bbX = DefaultBackscatterX
	}
	if p.subStep == 0 {
		p.subStep = DefaultSubStep
	}
	if p.minSub == 0 {
		p.minSub = DefaultMinSub
	}
	if p.maxSub == 0 {
		p.maxSub = DefaultMaxSub
	}
	if p.maxSub < p.minSub {
		p.maxSub = p.minSub
	}
	return p
}

// count returns the number of strata S for a bin [lo, hi) (m) at
// vacuum wavelength l (m) in a medium of index nm, and whether the count was
// capped by MaxSub (then sub-points are jittered).
func (p plan) count(lo, hi, l, nm float64) (int, bool) {
	dx := math.Pi * (hi - lo) * nm / l
	s := math.Ceil(dx / p.subStep)
	if s < float64(p.minSub) {
		return p.minSub, false
	}
	if s > float64(p.maxSub) {
		return p.maxSub, true
	}
	return int(s), false
}

// phi is the fractional part of the golden ratio: the additive recurrence
// frac(j·phi) is the most evenly spread one-dimensional sequence (Weyl).
const phi = 0.6180339887498949

// subPoint returns the diameter of sub-point j of s in [lo, hi): the
// midpoint (or jittered point) of stratum j in ln D.
func subPoint(lo, hi float64, j, s int, jitter bool) float64 {
	f := 0.5
	if jitter {
		f = math.Mod(float64(j+1)*phi, 1)
	}
	u := (float64(j) + f) / float64(s)
	return lo * math.Exp(u*math.Log(hi/lo))
}

// Build tabulates bin-averaged cross-sections of ev over spec.
func Build(ev Evaluator, spec Spec) (*Table, error) {
	if ev == nil {
		return nil, errors.New("kernel: Evaluator is nil")
	}
	if err := spec.validate(); err != nil {
		return nil, err
	}
	nb, nl, na := len(spec.Edges)-1, len(spec.Wavelengths), len(spec.Angles)
	t := &Table{
		Edges:       append([]float64(nil), spec.Edges...),
		Wavelengths: append([]float64(nil), spec.Wavelengths...),
		Angles:      append([]float64(nil), spec.Angles...),
		Medium:      make([]float64, nl),
		Cext:        make([]float64, nl*nb),
		Csca:        make([]float64, nl*nb),
		Cabs:        make([]float64, nl*nb),
		Cbb:         make([]float64, nl*nb),
		DCsca:       make([]float64, nl*na*nb),
		SubPoints:   make([]int32, nl*nb),
	}
	for l, lam := range t.Wavelengths {
		nm := spec.Medium(lam)
		if !(nm > 0) || math.IsInf(nm, 0) {
			return nil, fmt.Errorf("kernel: medium index at %g m = %g, want a finite value > 0", lam, nm)
		}
		t.Medium[l] = nm
	}
	mu := make([]float64, na)
	for a, th := range t.Angles {
		mu[a] = math.Cos(th)
	}
	p := spec.plan()

	// Order cells by decreasing cost (largest x first) so that the long
	// cells do not end up last on one worker; the order affects timing only.
	cells := make([]int, nl*nb)
	for c := range cells {
		cells[c] = c
	}
	xmax := func(c int) float64 { l, i := c/nb, c%nb; return spec.Edges[i+1] * t.Medium[l] / t.Wavelengths[l] }
	sort.SliceStable(cells, func(a, b int) bool { return xmax(cells[a]) > xmax(cells[b]) })

	workers := spec.Workers
	if workers == 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	// With enough wavelengths, a worker takes all the bins of one
	// wavelength at a time (largest first within it): evaluators that
	// prepare per-wavelength tables (the floc package's primary-particle
	// averages) then prepare each once instead of once per worker. With few
	// wavelengths, cells are handed out one by one so that every worker has
	// work.
	unit := 1
	if nl >= 4*workers {
		unit = nb
		sort.SliceStable(cells, func(a, b int) bool {
			la, lb := cells[a]/nb, cells[b]/nb
			if la != lb {
				return t.Wavelengths[la] < t.Wavelengths[lb] // shortest wavelength (largest x) first
			}
			return false
		})
	}
	units := len(cells) / unit
	if workers > units {
		workers = units
	}
	var next atomic.Int64
	errs := make([]error, len(cells)) // per cell: deterministic choice of the error to report
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			wk := ev.NewWorker()
			s := Sample{DCsca: make([]float64, na)}
			acc := make([]float64, na)
			for {
				k := int(next.Add(1)) - 1
				if k >= units {
					return
				}
				for _, c := range cells[k*unit : (k+1)*unit] {
					if err := t.fill(wk, &s, acc, mu, p, c); err != nil {
						errs[c] = err
					}
				}
			}
		}()
	}
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return nil, err
		}
	}
	return t, nil
}

// fill computes cell c = l*nb + i.
func (t *Table) fill(wk Worker, s *Sample, acc, mu []float64, p plan, c int) error {
	nb, na := t.NBins(), len(t.Angles)
	l, i := c/nb, c%nb
	lo, hi := t.Edges[i], t.Edges[i+1]
	lam, nm := t.Wavelengths[l], t.Medium[l]
	n, jitter := p.count(lo, hi, lam, nm)
	// Cbb on every sub-point, or (beyond BackscatterX, capped by
	// BackscatterSub) in a second pass over fewer jittered strata of its own.
	full := !p.skipBB
	nbb := n
	if p.bbSub > 0 && n > p.bbSub && math.Pi*hi*nm/lam > p.bbX {
		nbb, full = p.bbSub, false
	}
	for a := range acc {
		acc[a] = 0
	}
	var ext, sca, abs, bb float64
	for j := 0; j < n; j++ {
		r := Request{Diameter: subPoint(lo, hi, j, n, jitter), Wavelength: lam, Medium: nm, Mu: mu, Backscatter: full}
		if err := wk.Eval(r, s); err != nil {
			return fmt.Errorf("kernel: bin %d (%g–%g m) at %g m: %w", i, lo, hi, lam, err)
		}
		ext += s.Cext
		sca += s.Csca
		abs += s.Cabs
		bb += s.Cbb
		for a := range acc {
			acc[a] += s.DCsca[a]
		}
	}
	switch {
	case p.skipBB:
		bb = 0
	case full:
		bb /= float64(n)
	default:
		bb = 0
		for j := 0; j < nbb; j++ {
			r := Request{Diameter: subPoint(lo, hi, j, nbb, true), Wavelength: lam, Medium: nm, Mu: mu[:0], Backscatter: true}
			if err := wk.Eval(r, s); err != nil {
				return fmt.Errorf("kernel: bin %d (%g–%g m) at %g m: %w", i, lo, hi, lam, err)
			}
			bb += s.Cbb
		}
		bb /= float64(nbb)
	}
	inv := 1 / float64(n)
	t.Cext[c], t.Csca[c], t.Cabs[c], t.Cbb[c] = ext*inv, sca*inv, abs*inv, bb
	for a := 0; a < na; a++ {
		t.DCsca[(l*na+a)*nb+i] = acc[a] * inv
	}
	t.SubPoints[c] = int32(n)
	for _, v := range [...]float64{t.Cext[c], t.Csca[c], t.Cabs[c], t.Cbb[c]} {
		if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
			return fmt.Errorf("kernel: bin %d at %g m: evaluator returned a cross-section %g (not finite or negative)", i, lam, v)
		}
	}
	return nil
}
