package optics

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/murk-optics/murk/mie"
)

// FractalRDG models a floc as a fractal aggregate of N = (D/D_p)^n_f primary
// particles in the Rayleigh–Debye–Gans approximation for the aggregate
// (RDG-FA; Sorensen 2001, Aerosol Sci. Technol. 35:648–687, §4–5), with the
// primaries' own scattering from Lorenz–Mie theory instead of the Rayleigh
// limit:
//
//	dC_sca/dΩ(θ) = N²·S11_p(θ)/k² · S_N(q),   q = 2k·sin(θ/2),
//	S_N(q)       = 1/N + (1 − 1/N)·S(q·R_g),
//	C_abs        = N·C_abs,p,   C_sca = ∫ dC_sca/dΩ dΩ,   C_ext = C_abs + C_sca,
//
// where S11_p is the primary's scattering-matrix element (mie), k the
// wavenumber in water, S the structure factor (StructureFactor) and R_g the
// radius of gyration (floc.Fractal.GyrationRadius). The 1/N self term is the
// i = j part of the pair sum Σ_ij sin(q·r_ij)/(q·r_ij)/N², which the usual
// fractal forms of S omit: it makes one primary (N = 1) reproduce its Mie
// result exactly and keeps the incoherent sum of the primaries where
// q·D_p ≫ 1 (backward angles for primaries larger than the wavelength).
// Absorption is additive over primaries (no shielding), scattering is the
// integral over angle of the VSF, and extinction is their sum.
//
// Validity: RDG needs each primary to be seen by the incident field alone,
// i.e. weak coupling between primaries: |m − 1| small and a phase shift
// ρ = 2x|m_v − 1| through the whole floc below about 1 (CrossSections
// reports ρ). Using Mie primaries removes the condition on the primary's own
// phase shift. For D_f ≤ 2 the primaries do not shadow each other on
// average (projected area ∝ N), multiple scattering is weak and the method
// remains useful well beyond ρ = 1 (Sorensen 2001 for soot, D_f ≈ 1.8);
// for D_f > 2 and large flocs it ignores internal multiple scattering and
// shadowing, so the coherent forward lobe and C_sca grow too fast with size
// and C_ext may exceed twice the floc's projected area (the large-particle
// limit) — the comparison table in the package documentation shows where.
//
// Angular integration: the primary's S11 and q are tabulated once per
// wavelength, index and primary size (cached in the Workspace) on
// composite 8-point Gauss–Legendre panels in ln θ from 1e-8 rad (below
// which the contribution is taken as S11(0)·θ²/2·S_N ≈ 1) until the panel
// width reaches Δ = min(π/(2x_p), 0.1), uniform panels of width Δ up to 90°,
// and an N_terms+9 point Gauss–Legendre rule in cos θ on the backward
// hemisphere (exact for S11's polynomial there). Each floc size then costs
// one structure-factor evaluation per node (≈ 500 nodes for x_p ≈ 30).
type FractalRDG struct {
	Structure StructureFactor
}

// Name implements Method.
func (r FractalRDG) Name() string { return "rdg-" + r.Structure.String() }

// primaryCache holds one primary particle's angular tables.
type primaryCache struct {
	valid          bool
	used           uint64 // workspace clock at last use (least-recently-used eviction)
	dp, lam, nw    float64
	m              complex128
	k              float64
	cabs           float64   // primary absorption cross-section, m²
	csca, cbb, g   float64   // primary scattering and backscattering cross-sections (m²), asymmetry
	q, w, mu       []float64 // nodes: wavevector (m⁻¹), weight 2π·S11/k²·dμ (m²), cos θ
	back           int       // nodes [back:] lie in the backward hemisphere
	capW           float64   // 2π·S11(0)/k²·(1 − cos θ0), m²
	userMu, userS  []float64 // caller's cosines and S11/k² there (m² sr⁻¹)
	userQ          []float64
	scratchMu      []float64
	scratchElement []mie.Element
}

const (
	theta0    = 1e-8 // rad, start of the logarithmic panels
	logPanel  = 0.5  // panel width in ln θ
	panelNode = 8    // Gauss–Legendre nodes per panel
)

var unitNodes, unitWeights = func() ([]float64, []float64) {
	x, w := make([]float64, panelNode), make([]float64, panelNode)
	quad.Legendre{}.FixedLocations(x, w, 0, 1)
	return x, w
}()

// maxCached is the number of primaries (wavelength × index × size) a
// Workspace keeps; a kernel build over up to this many wavelengths never
// recomputes a primary.
const maxCached = 64

// primary returns the cache entry for p's primary, filling the least
// recently used entry if none holds it.
func (ws *Workspace) primary(p Problem) (*primaryCache, error) {
	ws.clock++
	var lru *primaryCache
	for _, c := range ws.cache {
		if c.valid && c.dp == p.Fractal.PrimaryDiameter && c.lam == p.Wavelength && c.nw == p.MediumIndex && c.m == p.Index {
			c.used = ws.clock
			return c, nil
		}
		if lru == nil || c.used < lru.used {
			lru = c
		}
	}
	if len(ws.cache) < maxCached {
		lru = new(primaryCache)
		ws.cache = append(ws.cache, lru)
	}
	lru.used = ws.clock
	if err := lru.prepare(&ws.solver, p); err != nil {
		return nil, err
	}
	return lru, nil
}

// prepare fills the cache entry for p's primary.
func (c *primaryCache) prepare(s *mie.Solver, p Problem) error {
	c.valid = false
	xp := mie.SizeParameter(p.Fractal.PrimaryDiameter, p.Wavelength, p.MediumIndex)
	ef, err := s.Sphere(xp, p.Index)
	if err != nil {
		return err
	}
	c.k = 2 * math.Pi * p.MediumIndex / p.Wavelength
	a := math.Pi * p.Fractal.PrimaryDiameter * p.Fractal.PrimaryDiameter / 4
	c.cabs = ef.Qabs * a
	c.csca, c.g = ef.Qsca*a, ef.G
	c.cbb = s.BackHemisphere() * a

	// Node set in θ: logarithmic panels, then uniform ones, to 90°.
	delta := min(math.Pi/(2*xp), 0.1)
	c.q, c.w, c.mu = c.q[:0], c.w[:0], c.mu[:0]
	th := theta0
	addPanel := func(t0, t1 float64, logScale bool) {
		for j := range panelNode {
			var t, dt float64
			if logScale {
				lt := math.Log(t0) + unitNodes[j]*(math.Log(t1)-math.Log(t0))
				t = math.Exp(lt)
				dt = unitWeights[j] * (math.Log(t1) - math.Log(t0)) * t
			} else {
				t = t0 + unitNodes[j]*(t1-t0)
				dt = unitWeights[j] * (t1 - t0)
			}
			c.q = append(c.q, 2*c.k*math.Sin(t/2))
			c.mu = append(c.mu, math.Cos(t))
			c.w = append(c.w, 2*math.Pi*math.Sin(t)*dt)
		}
	}
	for {
		next := th * math.Exp(logPanel)
		if next-th > delta || next >= math.Pi/2 {
			break
		}
		addPanel(th, next, true)
		th = next
	}
	n := int(math.Ceil((math.Pi/2 - th) / delta))
	for i := range n {
		t0 := th + (math.Pi/2-th)*float64(i)/float64(n)
		t1 := th + (math.Pi/2-th)*float64(i+1)/float64(n)
		addPanel(t0, t1, false)
	}
	c.back = len(c.q)
	nb := ef.Terms + 9
	mb, wb := make([]float64, nb), make([]float64, nb)
	quad.Legendre{}.FixedLocations(mb, wb, -1, 0)
	for i := range nb {
		c.mu = append(c.mu, mb[i])
		c.q = append(c.q, c.k*math.Sqrt(2*(1-mb[i])))
		c.w = append(c.w, 2*math.Pi*wb[i])
	}
	// S11 at the nodes (and θ = 0 for the cap).
	c.scratchMu = append(append(c.scratchMu[:0], 1), c.mu...)
	c.scratchElement = grow(c.scratchElement, len(c.scratchMu))
	s.Matrix(c.scratchMu, c.scratchElement)
	k2 := c.k * c.k
	for i := range c.w {
		c.w[i] *= c.scratchElement[i+1].S11 / k2
	}
	c.capW = 2 * math.Pi * c.scratchElement[0].S11 / k2 * (1 - math.Cos(theta0))
	c.userMu = c.userMu[:0] // force the angle table to be rebuilt
	c.dp, c.lam, c.nw, c.m = p.Fractal.PrimaryDiameter, p.Wavelength, p.MediumIndex, p.Index
	c.valid = true
	return nil
}

// prepareAngles tabulates S11/k² and q at the caller's cosines.
func (c *primaryCache) prepareAngles(s *mie.Solver, p Problem, mu []float64) error {
	same := len(mu) == len(c.userMu)
	for i := 0; same && i < len(mu); i++ {
		same = mu[i] == c.userMu[i]
	}
	if same {
		return nil
	}
	xp := mie.SizeParameter(p.Fractal.PrimaryDiameter, p.Wavelength, p.MediumIndex)
	if _, err := s.Sphere(xp, p.Index); err != nil {
		return err
	}
	c.scratchElement = grow(c.scratchElement, len(mu))
	s.Matrix(mu, c.scratchElement)
	c.userMu = append(c.userMu[:0], mu...)
	c.userS = grow(c.userS, len(mu))
	c.userQ = grow(c.userQ, len(mu))
	k2 := c.k * c.k
	for i, m := range mu {
		c.userS[i] = c.scratchElement[i].S11 / k2
		c.userQ[i] = c.k * math.Sqrt(2*max(1-m, 0))
	}
	return nil
}

// Evaluate implements Method.
func (r FractalRDG) Evaluate(ws *Workspace, p Problem, mu, diff []float64) (CrossSections, error) {
	if len(mu) != len(diff) {
		panic("optics: Evaluate slice lengths differ")
	}
	x, phi, err := p.check()
	if err != nil {
		return CrossSections{}, err
	}
	c, err := ws.primary(p)
	if err != nil {
		return CrossSections{}, err
	}
	if len(mu) > 0 {
		if err := c.prepareAngles(&ws.solver, p, mu); err != nil {
			return CrossSections{}, err
		}
	}
	df := p.Fractal.Dimension
	n := max(math.Pow(p.Diameter/p.Fractal.PrimaryDiameter, df), 1)
	rg := p.Fractal.GyrationRadius(p.Diameter)
	self := 1 / n
	sn := func(q float64) float64 { return self + (1-self)*r.Structure.Value(q*rg, df) }
	var fwd, bwd, gsum float64
	for i := 0; i < c.back; i++ {
		v := c.w[i] * sn(c.q[i])
		fwd += v
		gsum += v * c.mu[i]
	}
	for i := c.back; i < len(c.w); i++ {
		v := c.w[i] * sn(c.q[i])
		bwd += v
		gsum += v * c.mu[i]
	}
	n2 := n * n
	sca := n2 * (fwd + bwd + c.capW)
	cs := CrossSections{
		Scattering:     sca,
		Backscattering: n2 * bwd,
		Absorption:     n * c.cabs,
	}
	cs.Extinction = cs.Scattering + cs.Absorption
	if sca > 0 {
		cs.Asymmetry = n2 * (gsum + c.capW) / sca
	}
	p.phaseShifts(&cs, x, phi)
	for i := range mu {
		diff[i] = n2 * c.userS[i] * sn(c.userQ[i])
	}
	if !finite(cs.Extinction, cs.Scattering, cs.Backscattering, cs.Asymmetry) {
		return CrossSections{}, errNonFinite
	}
	return cs, nil
}
