package optics

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/murk-optics/murk/floc"
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
// Polydisperse primaries (floc.Fractal.PrimaryGSD): S11_p, C_abs,p and the
// self term are those of the primaries' size distribution per primary of
// the representative (Sauter) volume, Σ_j s_j·S11(d_j) (see subPoints):
// the intensity average ⟨|S|²⟩, also in the coherent term. The exact
// decoupling form for polydisperse scatterers would use |⟨S⟩|² there
// (Kotlarchyk & Chen 1983, J. Chem. Phys. 79:2461; from memory), which is
// smaller away from the forward direction; it needs the complex amplitudes
// and is not implemented.
//
// Angular integration: S̄11 and q are tabulated once per wavelength, index
// and primary distribution (cached in the Workspace) on composite 8-point
// Gauss–Legendre panels in ln θ from 1e-8 rad (below which the
// contribution is taken as S11(0)·θ²/2·S_N ≈ 1) until the panel width
// reaches Δ = min(π/(2x_p), 0.1), uniform panels of width Δ up to 90°, and
// an N_terms+9 point Gauss–Legendre rule in cos θ on the backward
// hemisphere (exact for S11's polynomial there), x_p and N_terms being
// those of the primary at the volume median. Only the
// coherent (1 − 1/N)·S part is integrated on these nodes; the 1/N self
// part is the primaries' C̄_sca and C̄_bb. Each floc size then costs one
// structure-factor evaluation per node (≈ 500 nodes for x_p ≈ 30, ≈ 2000
// for the default distribution at 400 nm).
//
// Validity of the primary average: the primaries scatter independently of
// their size (sizes uncorrelated with position in the floc).
type FractalRDG struct {
	Structure StructureFactor
}

// Name implements Method.
func (r FractalRDG) Name() string { return "rdg-" + r.Structure.String() }

// primaryCache holds the primary particles' angular tables, averaged over
// their size distribution (subPoints).
type primaryCache struct {
	valid          bool
	used           uint64 // workspace clock at last use (least-recently-used eviction)
	dp, gsd        float64
	lam, nw        float64
	m              complex128
	k              float64
	cabs           float64   // absorption cross-section per representative primary, m²
	csca, cbb, g   float64   // scattering and backscattering cross-sections per representative primary (m²), asymmetry
	q, w, mu       []float64 // nodes: wavevector (m⁻¹), weight 2π·S̄11·dμ/k² (m²), cos θ
	back           int       // nodes [back:] lie in the backward hemisphere
	capW           float64   // 2π·S̄11(0)/k²·(1 − cos θ0), m²
	userMu, userS  []float64 // caller's cosines and S̄11/k² there (m² sr⁻¹)
	userQ          []float64
	sub, nodeSub   []subPoint // averaging rules: full (cross-sections, user angles) and coarse (node table)
	nodesValid     bool
	acc            []float64
	scratchMu      []float64
	scratchElement []mie.Element
}

// subPoint is one primary size of the averaging rule: diameter d (m) and
// weight s = ω·(D32/d)³, so that Σ s·C(d) is the cross-section per
// primary of the representative (Sauter) volume.
type subPoint struct{ d, s float64 }

// Primary size averaging. The primaries' VOLUME distribution is log-normal
// with the number distribution's σ = ln σ_g and median D_v50 =
// D32·exp(σ²/2) (Hatch & Choate 1929), and cross-sections per unit solid
// volume are its mean of C(d)/v(d): ⟨C⟩/⟨v⟩ = E_vol[C/v]. The volume
// distribution is truncated at ±primaryZ = 3 standard deviations (99.73 %
// of the solid volume kept, renormalised; 0.64–41 µm for the default), and
// the mean is taken with the midpoint rule on equal steps in size
// parameter x_p of at most primaryStep = 0.25, weights
// exp(−z²/2)·Δx/x with z = ln(d/D_v50)/σ.
//
// Why steps in x of 0.25: besides the broad interference structure
// (period Δx = π/|m − 1| ≈ 18 for m = 1.17) the cross-sections of each
// primary carry the ripple and resonance spikes of period Δx ≈ 0.85–1
// (Chýlek 1976, J. Opt. Soc. Am. 66:285; from memory) at every size, which
// is strongest in C_bb. Steps of 0.25 put four in each such period
// (mie/kernel's SubStep rule, for the same reason). Coarser rules alias
// the ripple into wavelength-to-wavelength noise. Measured in development
// on n_f = 2, 100 µm flocs, roughness of ln b_b against ln λ (see
// TestFlocSpectraSmooth; 318 for identical primaries): 166 for 48 equal
// steps in ln d over ±3σ, 7.7 for steps growing as x beyond the volume
// median, 0.66 for this rule. The count is ceil((x_max − x_min)/0.25),
// at least primaryMinSub and at most primaryMaxSub: about 1700 at 400 nm
// and 800 at 860 nm for the default primaries, computed once per
// wavelength and Workspace (0.04–0.3 s; BenchmarkPrimaries).
//
// The fractal method's angular node table uses the coarser step
// primaryNodeStep = 2 (about 210 sub-points at 400 nm; only its coherent
// term uses it, see prepareNodes): roughness of ln b for 100 µm flocs
// 1.1 with it, 32 with steps of 4 (identical primaries: 136).
const (
	primaryZ      = 3.0
	primaryStep   = 0.25
	primaryMinSub = 64
	primaryMaxSub = 8192
	// primaryNodeStep is the coarser step of the rule for S̄11 at the
	// fractal method's angular nodes (see prepareNodes); nodeZ places the
	// primary whose x_p sets the node spacing, in standard deviations from
	// the volume median: 0, the median itself, is within 1e-7 of a fine
	// θ quadrature (TestRDGPolydisperseAgainstOracle).
	primaryNodeStep = 2.0
	nodeZ           = 0.0
)

// subPoints returns the averaging rule for f's primaries at vacuum
// wavelength lam in water of index nw in dst: one point of weight 1 at D_p
// for identical primaries (σ_g = 1).
func subPoints(f floc.Fractal, lam, nw, step float64, dst []subPoint) []subPoint {
	dst = dst[:0]
	g := f.PrimarySpread()
	if g == 1 {
		return append(dst, subPoint{d: f.PrimaryDiameter, s: 1})
	}
	sg := math.Log(g)
	dv := f.PrimaryDiameter * math.Exp(0.5*sg*sg)
	xlo := mie.SizeParameter(dv*math.Exp(-primaryZ*sg), lam, nw)
	xhi := mie.SizeParameter(dv*math.Exp(primaryZ*sg), lam, nw)
	k := min(max(int(math.Ceil((xhi-xlo)/step)), primaryMinSub), primaryMaxSub)
	h := (xhi - xlo) / float64(k)
	var sum float64
	for j := range k {
		x := xlo + (float64(j)+0.5)*h
		d := dv * x / mie.SizeParameter(dv, lam, nw)
		z := math.Log(d/dv) / sg
		w := math.Exp(-0.5*z*z) * h / x
		r := f.PrimaryDiameter / d
		dst = append(dst, subPoint{d: d, s: w * r * r * r})
		sum += w
	}
	for j := range dst {
		dst[j].s /= sum
	}
	return dst
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
	gsd := p.Fractal.PrimarySpread()
	for _, c := range ws.cache {
		if c.valid && c.dp == p.Fractal.PrimaryDiameter && c.gsd == gsd && c.lam == p.Wavelength && c.nw == p.MediumIndex && c.m == p.Index {
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

// prepare fills the cache entry for p's primaries with their
// cross-sections averaged over the sub-points; the angular node table of
// the fractal method is built on first use (prepareNodes).
func (c *primaryCache) prepare(s *mie.Solver, p Problem) error {
	c.valid, c.nodesValid = false, false
	c.sub = subPoints(p.Fractal, p.Wavelength, p.MediumIndex, primaryStep, c.sub)
	c.k = 2 * math.Pi * p.MediumIndex / p.Wavelength
	var gsum float64
	c.cabs, c.csca, c.cbb = 0, 0, 0
	for _, sp := range c.sub {
		ef, err := s.Sphere(mie.SizeParameter(sp.d, p.Wavelength, p.MediumIndex), p.Index)
		if err != nil {
			return err
		}
		a := sp.s * math.Pi * sp.d * sp.d / 4
		c.cabs += ef.Qabs * a
		c.csca += ef.Qsca * a
		gsum += ef.Qsca * a * ef.G
		c.cbb += s.BackHemisphere() * a
	}
	c.g = 0
	if c.csca > 0 {
		c.g = gsum / c.csca
	}
	c.userMu = c.userMu[:0] // force the angle table to be rebuilt
	c.dp, c.gsd, c.lam, c.nw, c.m = p.Fractal.PrimaryDiameter, p.Fractal.PrimarySpread(), p.Wavelength, p.MediumIndex, p.Index
	c.valid = true
	return nil
}

// prepareNodes builds the fractal method's node set and S̄11 there, from
// the coarser rule nodeSub (steps primaryNodeStep in x): only the coherent
// (structure-factor) part of the RDG integrals uses it; the self term uses
// the full-rule C̄_sca and C̄_bb. The node spacing follows the primary at
// the volume median (nodeZ; the single one for identical primaries); the
// backward Gauss rule has that primary's N_terms + 9 points (exact for its
// S11, a polynomial of degree 2N in μ; the average over larger primaries is
// smoother than any one of them, and the oracle test bounds the error).
func (c *primaryCache) prepareNodes(s *mie.Solver, p Problem) error {
	if c.nodesValid {
		return nil
	}
	c.nodeSub = subPoints(p.Fractal, p.Wavelength, p.MediumIndex, primaryNodeStep, c.nodeSub)
	sg := math.Log(p.Fractal.PrimarySpread())
	dv50 := p.Fractal.PrimaryDiameter * math.Exp(0.5*sg*sg)
	xNode, terms := 0.0, 0
	for _, sp := range c.nodeSub {
		if len(c.nodeSub) == 1 || math.Log(sp.d/dv50) <= nodeZ*sg {
			x := mie.SizeParameter(sp.d, p.Wavelength, p.MediumIndex)
			if x > xNode {
				ef, err := s.Sphere(x, p.Index)
				if err != nil {
					return err
				}
				xNode, terms = x, ef.Terms
			}
		}
	}

	// Node set in θ: logarithmic panels, then uniform ones, to 90°.
	delta := min(math.Pi/(2*xNode), 0.1)
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
	nb := terms + 9
	mb, wb := make([]float64, nb), make([]float64, nb)
	quad.Legendre{}.FixedLocations(mb, wb, -1, 0)
	for i := range nb {
		c.mu = append(c.mu, mb[i])
		c.q = append(c.q, c.k*math.Sqrt(2*(1-mb[i])))
		c.w = append(c.w, 2*math.Pi*wb[i])
	}
	// S̄11 at the nodes (and θ = 0 for the cap).
	c.scratchMu = append(append(c.scratchMu[:0], 1), c.mu...)
	if err := c.averageS11(s, p, c.nodeSub, c.scratchMu); err != nil {
		return err
	}
	k2 := c.k * c.k
	for i := range c.w {
		c.w[i] *= c.acc[i+1] / k2
	}
	c.capW = 2 * math.Pi * c.acc[0] / k2 * (1 - math.Cos(theta0))
	c.nodesValid = true
	return nil
}

// averageS11 fills c.acc[i] with Σ_j s_j·S11_j(mu[i]) over the sub-points sub.
func (c *primaryCache) averageS11(s *mie.Solver, p Problem, sub []subPoint, mu []float64) error {
	c.acc = grow(c.acc, len(mu))
	clear(c.acc)
	c.scratchElement = grow(c.scratchElement, len(mu))
	for _, sp := range sub {
		if _, err := s.Sphere(mie.SizeParameter(sp.d, p.Wavelength, p.MediumIndex), p.Index); err != nil {
			return err
		}
		s.Matrix(mu, c.scratchElement)
		for i := range mu {
			c.acc[i] += sp.s * c.scratchElement[i].S11
		}
	}
	return nil
}

// prepareAngles tabulates S̄11/k² and q at the caller's cosines.
func (c *primaryCache) prepareAngles(s *mie.Solver, p Problem, mu []float64) error {
	same := len(mu) == len(c.userMu)
	for i := 0; same && i < len(mu); i++ {
		same = mu[i] == c.userMu[i]
	}
	if same {
		return nil
	}
	if err := c.averageS11(s, p, c.sub, mu); err != nil {
		return err
	}
	c.userMu = append(c.userMu[:0], mu...)
	c.userS = grow(c.userS, len(mu))
	c.userQ = grow(c.userQ, len(mu))
	k2 := c.k * c.k
	for i, m := range mu {
		c.userS[i] = c.acc[i] / k2
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
	if err := c.prepareNodes(&ws.solver, p); err != nil {
		return CrossSections{}, err
	}
	df := p.Fractal.Dimension
	n := max(math.Pow(p.Diameter/p.Fractal.PrimaryDiameter, df), 1)
	rg := p.Fractal.GyrationRadius(p.Diameter)
	self := 1 / n
	sn := func(q float64) float64 { return self + (1-self)*r.Structure.Value(q*rg, df) }
	// Coherent part (1 − 1/N)·∫S̄11·S dΩ/k² on the node table; the self
	// part (1/N)·∫S̄11 dΩ/k² is the full-rule C̄_sca (C̄_bb backward).
	var fwd, bwd, gsum float64
	for i := 0; i < c.back; i++ {
		v := c.w[i] * r.Structure.Value(c.q[i]*rg, df)
		fwd += v
		gsum += v * c.mu[i]
	}
	for i := c.back; i < len(c.w); i++ {
		v := c.w[i] * r.Structure.Value(c.q[i]*rg, df)
		bwd += v
		gsum += v * c.mu[i]
	}
	n2 := n * n
	coh := 1 - self
	sca := n2 * (self*c.csca + coh*(fwd+bwd+c.capW))
	cs := CrossSections{
		Scattering:     sca,
		Backscattering: n2 * (self*c.cbb + coh*bwd),
		Absorption:     n * c.cabs,
	}
	cs.Extinction = cs.Scattering + cs.Absorption
	if sca > 0 {
		cs.Asymmetry = n2 * (self*c.csca*c.g + coh*(gsum+c.capW)) / sca
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
