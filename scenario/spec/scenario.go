package spec

import (
	"math"
	"sort"

	"github.com/murk-optics/murk/mie/psd"
)

// Scenario is one validated murk scenario, every value in SI units (with
// temperatures in °C; see the package documentation). The zero value is not
// a valid scenario; obtain one from Load or Parse.
type Scenario struct {
	Name        string // free text; "" if not given
	Description string // free text; "" if not given
	Estuary     Estuary
	Mixture     Mixture
	Outputs     Outputs
}

// Estuary is the part of a scenario that drives the estuary model: the
// sections geometry, river, tide, ocean, closures, sediment_classes and run.
// It is also the whole of an estuary document (LoadEstuary).
type Estuary struct {
	Geometry Geometry
	River    River
	Tide     Tide // zero value: no tide
	Ocean    Ocean
	Closures Closures // zero value: every closure at the model's default
	// Classes are the sediment classes in document order. River.Supply and
	// Ocean.Background are indexed like Classes.
	Classes []SedimentClass
	Run     Run
}

// Mixture is the part of a scenario that sets the optics: the sections
// water, populations and optics. It is also the whole of a mixture document
// (LoadMixture).
type Mixture struct {
	Water       Water
	Populations []Population // document order
	Optics      Optics
}

// WidthShape says how channel width and depth vary along the channel.
type WidthShape string

const (
	// ShapeExponential is B(x) = B0·exp(−x/Lb) with uniform depth, the usual
	// description of an alluvial estuary (Savenije 1993, J. Hydrol. 143:209).
	ShapeExponential WidthShape = "exponential"
	// ShapeTable is a table of (distance, width, depth), interpolated
	// linearly in distance.
	ShapeTable WidthShape = "table"
)

// Geometry is the channel. Distance x is measured from the mouth (x = 0,
// the sea) landward to the head (x = Length, the river).
type Geometry struct {
	Length float64    // channel length, m (0.5 km … 1000 km)
	Cells  int        // number of finite-volume cells along the channel (4 … 5000)
	Shape  WidthShape // which of the fields below apply
	// MouthWidth is B0, the width at x = 0, m (ShapeExponential only).
	MouthWidth float64
	// ConvergenceLength is Lb in B(x) = B0·exp(−x/Lb), m (ShapeExponential
	// only). 0 means a prismatic channel (width given as one value), as in
	// package mixing.
	ConvergenceLength float64
	// Depth is the uniform depth below mean water, m (ShapeExponential only).
	Depth float64
	// Table holds sections with strictly increasing Distance, the first at 0
	// and the last at or beyond Length (ShapeTable only).
	Table []Section
}

// Section is one row of a geometry table.
type Section struct {
	Distance float64 // from the mouth, m
	Width    float64 // m
	Depth    float64 // below mean water, m
}

// At returns width and depth (m) at distance x (m) from the mouth. Table
// geometries are interpolated linearly and held constant beyond their ends.
func (g Geometry) At(x float64) (width, depth float64) {
	if g.Shape != ShapeTable {
		if g.ConvergenceLength == 0 {
			return g.MouthWidth, g.Depth
		}
		return g.MouthWidth * math.Exp(-x/g.ConvergenceLength), g.Depth
	}
	t := g.Table
	if len(t) == 0 {
		return 0, 0
	}
	if x <= t[0].Distance {
		return t[0].Width, t[0].Depth
	}
	i := sort.Search(len(t), func(i int) bool { return t[i].Distance >= x })
	if i == len(t) {
		return t[len(t)-1].Width, t[len(t)-1].Depth
	}
	a, b := t[i-1], t[i]
	f := (x - a.Distance) / (b.Distance - a.Distance)
	return a.Width + f*(b.Width-a.Width), a.Depth + f*(b.Depth-a.Depth)
}

// Signal is a forcing that is either constant or a time series.
type Signal struct {
	// Times are seconds since the start of the run (the start of spin-up),
	// strictly increasing; nil for a constant.
	Times []float64
	// Values are in SI units: one value for a constant, else one per time.
	Values []float64
	// MaxGap is the longest interval allowed between samples, s: the
	// series' max_gap, default 1.5 times its median sampling interval (a
	// design choice that catches one missing sample in a regular record). 0
	// for a constant.
	MaxGap float64
}

// IsConstant reports whether s is a single constant value.
func (s Signal) IsConstant() bool { return len(s.Times) == 0 }

// At returns the value at time t (s), interpolating linearly between
// samples and holding the end values outside the series. An empty signal
// gives 0; a NaN time gives NaN.
func (s Signal) At(t float64) float64 {
	if len(s.Values) == 0 {
		return 0
	}
	if math.IsNaN(t) {
		return t
	}
	if len(s.Times) == 0 || t <= s.Times[0] {
		return s.Values[0]
	}
	n := len(s.Times)
	if t >= s.Times[n-1] {
		return s.Values[n-1]
	}
	i := sort.SearchFloat64s(s.Times, t)
	if s.Times[i] == t {
		return s.Values[i]
	}
	f := (t - s.Times[i-1]) / (s.Times[i] - s.Times[i-1])
	return s.Values[i-1] + f*(s.Values[i]-s.Values[i-1])
}

// Max returns the largest value (0 for an empty signal).
func (s Signal) Max() float64 {
	m := 0.0
	for i, v := range s.Values {
		if i == 0 || v > m {
			m = v
		}
	}
	return m
}

// River is the fresh-water end: discharge, temperature and sediment supply.
// River water is fresh (salinity 0).
type River struct {
	Discharge   Signal  // m³/s, each value 0 … 1e6
	Temperature float64 // °C (−2 … 40)
	// Supply is the sediment concentration of river water per class,
	// indexed like Estuary.Classes. A class not listed under river.sediment
	// has a constant supply of 0 (default: the river brings none of it).
	Supply []Supply
}

// SupplyKind says how river sediment concentration is given.
type SupplyKind string

const (
	SupplyConstant SupplyKind = "constant" // C = Concentration
	SupplyRating   SupplyKind = "rating"   // C = A·(Q/QRef)^B
)

// Supply is the river concentration of one sediment class.
type Supply struct {
	Kind          SupplyKind
	Concentration float64 // kg/m³ (SupplyConstant)
	// A, B and QRef define the rating curve C = A·(Q/QRef)^B (SupplyRating),
	// the usual power-law sediment rating curve (e.g. Syvitski et al. 2000,
	// Water Resour. Res. 36:2747). A in kg/m³, B dimensionless (−2 … 3),
	// QRef in m³/s (default 1 m³/s, so that A is the coefficient of C = a·Q^b
	// with Q in m³/s).
	A, B, QRef float64
}

// At returns the concentration (kg/m³) at river discharge q (m³/s). A
// rating curve gives 0 for q ≤ 0 (no flow carries no sediment), whatever
// the sign of B.
func (s Supply) At(q float64) float64 {
	if s.Kind == SupplyRating {
		if q <= 0 {
			return 0
		}
		return s.A * math.Pow(q/s.QRef, s.B)
	}
	return s.Concentration
}

// TideForm says how a tidal constituent is given.
type TideForm string

const (
	TideAbsent   TideForm = ""         // constituent not present
	TideRange    TideForm = "range"    // elevation: Amplitude is half the given range
	TideVelocity TideForm = "velocity" // current: Velocity is the velocity amplitude at the mouth
)

// Constituent is one tidal constituent at the mouth.
type Constituent struct {
	Form      TideForm
	Amplitude float64 // elevation amplitude η0 (half the tidal range), m (TideRange)
	Velocity  float64 // section-averaged velocity amplitude U_T, m/s (TideVelocity)
	Period    float64 // s: M2 44714.16 s (12.4206 h), S2 43200 s (12 h); common practice
}

// Present reports whether the constituent is given with a non-zero size.
func (c Constituent) Present() bool {
	return c.Form != TideAbsent && (c.Amplitude > 0 || c.Velocity > 0)
}

// Tide is the tide at the mouth. A missing tide section means no tide.
type Tide struct {
	M2 Constituent
	S2 Constituent // optional; TideAbsent if not given (no spring–neap cycle)
}

// Periods of the principal lunar and solar semidiurnal constituents
// (common practice; Doodson's tables give M2 = 28.9841042°/h).
const (
	PeriodM2 = 360 / 28.9841042 * 3600 // s
	PeriodS2 = 12 * 3600.0             // s
)

// Ocean is the sea end at the mouth.
type Ocean struct {
	Salinity    float64 // practical salinity (0 < S ≤ 42)
	Temperature float64 // °C (−2 … 40)
	// Background is the marine sediment concentration per class, kg/m³,
	// indexed like Estuary.Classes. Default 0 for a class not listed.
	Background []float64
}

// Override is an optional value: Set false means "use the model's own
// published default", which the estuary model (package mixing) documents.
type Override struct {
	Value float64 // SI units of the field
	Set   bool
}

// Or returns the value if set, else def.
func (o Override) Or(def float64) float64 {
	if o.Set {
		return o.Value
	}
	return def
}

// Closures are optional overrides of the estuary model's closure constants.
// The vertical exchange between the layers (entrainment included) follows
// from the mixing coefficients; the estuary model has no separate
// entrainment constant.
type Closures struct {
	DragCoefficient       Override // C_D in τ_b = ρ·C_D·u|u|, dimensionless (1e-4 … 0.05)
	MixingCoefficient     Override // a in K_M = K_S = a·C_D·U_T·H, dimensionless (1e-4 … 1)
	BackgroundMixing      Override // K₀ added to K_M and K_S, m²/s (0 … 1)
	DispersionCoefficient Override // c in K_H = c·U_T·B, tidal dispersion, dimensionless (0 … 1)
	InterfacialFriction   Override // c_i, interfacial drag coefficient, dimensionless (0 … 0.05)
	// Bed holds bed defaults for every class (a class may override each).
	Bed BedParams
}

// BedParams are the bed-exchange constants of a sediment class (Partheniades
// 1965 erosion, Krone 1962 deposition threshold).
type BedParams struct {
	ErosionRate              Override // Partheniades rate constant M, kg m⁻² s⁻¹ (0 … 0.1)
	CriticalStressErosion    Override // τ_ce, Pa (0 < τ ≤ 10)
	CriticalStressDeposition Override // τ_cd, Pa (0 … 10; 0 = deposit at any stress); ≤ τ_ce
	BedInventory             Override // erodible mass per bed area at the start, kg/m² (0 … 1e5)
}

// Merge returns b with every unset field taken from def.
func (b BedParams) Merge(def BedParams) BedParams {
	pick := func(o, d Override) Override {
		if o.Set {
			return o
		}
		return d
	}
	return BedParams{
		ErosionRate:              pick(b.ErosionRate, def.ErosionRate),
		CriticalStressErosion:    pick(b.CriticalStressErosion, def.CriticalStressErosion),
		CriticalStressDeposition: pick(b.CriticalStressDeposition, def.CriticalStressDeposition),
		BedInventory:             pick(b.BedInventory, def.BedInventory),
	}
}

// SettlingKind says where a sediment class's settling velocity comes from.
type SettlingKind string

const (
	// SettlingConstant uses SedimentClass.SettlingVelocity everywhere.
	SettlingConstant SettlingKind = "constant"
	// SettlingFloc takes the settling velocity from the floc population that
	// rides on the class (floc size from shear, concentration and salinity).
	SettlingFloc SettlingKind = "floc"
)

// SedimentClass is one sediment class carried by the estuary model.
type SedimentClass struct {
	Name             string // unique; letters, digits, '_' and '-'
	Settling         SettlingKind
	SettlingVelocity float64 // m/s, 0 … 0.1 (SettlingConstant only)
	// Bed holds the class's bed constants, merged with closures: the
	// class's own value, else the closures value, else unset (the model's
	// default).
	Bed BedParams
}

// Run sets the simulated period and what is kept.
type Run struct {
	// Duration is the simulated time after spin-up, s (1 h … 3650 day).
	Duration float64
	// SpinUp is simulated before outputs start, s (default 0: none). Run
	// time runs from 0 at the start of spin-up to SpinUp+Duration.
	SpinUp float64
	// OutputInterval is the time between outputs, s (≤ Duration).
	OutputInterval float64
	// Stations are output distances from the mouth, m, in document order,
	// each within [0, Geometry.Length]. Default (empty): every cell centre.
	Stations []float64
}

// End returns the run length including spin-up, s.
func (r Run) End() float64 { return r.SpinUp + r.Duration }

// Water is pure water plus dissolved and pigment matter.
type Water struct {
	// HasState is true when salinity and temperature were given; they are
	// required in a mixture document and not allowed in a full scenario,
	// where the estuary model sets them.
	HasState    bool
	Salinity    float64 // practical salinity, 0 … 42 (mixture document only)
	Temperature float64 // °C, −2 … 40 (mixture document only)
	// OceanSalinity is the salinity of the ocean end member of CDOM and
	// chlorophyll: ocean.salinity in a full scenario; water.ocean_salinity
	// in a mixture document (default 35, typical open-ocean surface
	// salinity: common practice).
	OceanSalinity float64
	CDOM          CDOM
	Chlorophyll   EndMembers // kg/m³ (default 0 at both ends)
}

// EndMembers are river (S = 0) and ocean values of a quantity that mixes
// linearly with salinity between them.
type EndMembers struct {
	River, Ocean float64
}

// AtSalinity mixes the end members linearly in salinity s for an ocean
// salinity sOcean (conservative mixing; common practice). The salinity
// fraction s/sOcean is clamped to [0, 1]; sOcean ≤ 0 or a NaN input gives
// the river value.
func (e EndMembers) AtSalinity(s, sOcean float64) float64 {
	f := s / sOcean
	if !(sOcean > 0) || math.IsNaN(f) {
		return e.River
	}
	f = math.Max(0, math.Min(1, f))
	return e.River + f*(e.Ocean-e.River)
}

// CDOM is coloured dissolved organic matter: a_g(λ) = a_g(λ0)·exp(−S·(λ−λ0)).
type CDOM struct {
	ReferenceWavelength float64    // λ0, m (default 440 nm; common practice)
	Absorption          EndMembers // a_g(λ0) at river and ocean ends, 1/m (default 0: no CDOM)
	// Slope S, 1/m (stored in SI: 0.0176 nm⁻¹ = 1.76e7 m⁻¹). Default
	// 0.0176 nm⁻¹, the mean of Babin et al. (2003, J. Geophys. Res. 108(C7),
	// 3211) for European coastal waters. Allowed 0.005 … 0.04 nm⁻¹.
	Slope float64
}

// PopulationKind is what a particle population is made of.
type PopulationKind string

const (
	KindMineral       PopulationKind = "mineral"
	KindOrganic       PopulationKind = "organic"
	KindPhytoplankton PopulationKind = "phytoplankton"
	KindFloc          PopulationKind = "floc"
)

// Population is one particle population.
type Population struct {
	Name        string // unique
	Kind        PopulationKind
	Composition string  // free text, e.g. "illite"; "" if not given
	Density     float64 // particle (for flocs: primary particle) density, kg/m³ (800 … 6000)
	Index       RefractiveIndex
	Size        SizeDistribution
	// Concentration is set when the population is uniform in space and
	// time; in a full scenario a population has either Concentration or a
	// Class, in a mixture document always Concentration.
	Concentration Concentration
	// Class is the sediment class the population rides on ("" for none);
	// ClassIndex its index in Estuary.Classes (−1 for none); ClassFraction
	// the mass fraction of that class's concentration this population
	// carries (0 < f ≤ 1, default 1). Fractions on one class sum to ≤ 1.
	Class         string
	ClassIndex    int
	ClassFraction float64
	Floc          FlocParams // KindFloc only
	Cell          CellParams // KindPhytoplankton only
}

// Medium says what a refractive index is relative to.
type Medium string

const (
	RelativeToWater  Medium = "water"  // index relative to the surrounding water
	RelativeToVacuum Medium = "vacuum" // absolute index, as handbooks tabulate it
)

// IndexModel says how a refractive index depends on wavelength.
type IndexModel string

const (
	IndexConstant IndexModel = "constant" // m = N + iK at every wavelength
	IndexTable    IndexModel = "table"    // rows of (λ, n, k), linear interpolation
	// IndexSmooth is a smooth spectral model:
	//
	//	n(λ) = N + CauchyB·(1/λ² − 1/WavelengthRef²)     (Cauchy 1836)
	//	k(λ) = KRef·exp(−KSlope·(λ − WavelengthRef)) + KFloor
	//
	// the exponential decay of the absorption of mineral and detrital
	// particles with wavelength (Babin & Stramski 2004, Limnol. Oceanogr.
	// 49:756; Bricaud et al. 1998, J. Geophys. Res. 103:31033). The same form
	// as package mie/refindex's Smooth model.
	IndexSmooth IndexModel = "smooth"
)

// RefractiveIndex is a complex index m = n + ik, k ≥ 0 absorbing.
type RefractiveIndex struct {
	Model      IndexModel
	RelativeTo Medium
	N, K       float64 // IndexConstant; N also for IndexSmooth. n 0.5 … 3.5, k 0 … 10
	// Table rows (IndexTable): Wavelengths in m, strictly increasing, and
	// covering every optics wavelength (no extrapolation).
	Wavelengths, NTable, KTable []float64
	WavelengthRef               float64 // IndexSmooth: reference vacuum wavelength, m
	CauchyB                     float64 // IndexSmooth: m² (default 0: no dispersion)
	KRef                        float64 // IndexSmooth: k at WavelengthRef above KFloor
	KSlope                      float64 // IndexSmooth: 1/m (stored in SI: 0.011 nm⁻¹ = 1.1e7 m⁻¹)
	KFloor                      float64 // IndexSmooth: wavelength-independent part of k (default 0)
}

// At returns n and k at vacuum wavelength lambda (m). A table is
// interpolated linearly and held constant beyond its ends (validation
// makes the table cover the optics wavelengths); the smooth model is
// evaluated at any lambda > 0 (validation checks n at the optics band's
// ends).
func (r RefractiveIndex) At(lambda float64) (n, k float64) {
	switch r.Model {
	case IndexTable:
		w := r.Wavelengths
		if len(w) == 0 {
			return 0, 0
		}
		if lambda <= w[0] {
			return r.NTable[0], r.KTable[0]
		}
		i := sort.SearchFloat64s(w, lambda)
		if i == len(w) {
			return r.NTable[i-1], r.KTable[i-1]
		}
		if w[i] == lambda {
			return r.NTable[i], r.KTable[i]
		}
		f := (lambda - w[i-1]) / (w[i] - w[i-1])
		return r.NTable[i-1] + f*(r.NTable[i]-r.NTable[i-1]), r.KTable[i-1] + f*(r.KTable[i]-r.KTable[i-1])
	case IndexSmooth:
		n = r.N + r.CauchyB*(1/(lambda*lambda)-1/(r.WavelengthRef*r.WavelengthRef))
		return n, r.KRef*math.Exp(-r.KSlope*(lambda-r.WavelengthRef)) + r.KFloor
	}
	return r.N, r.K
}

// SizeKind is the form of a size distribution.
type SizeKind string

const (
	// SizeJunge is a power law n(D) ∝ D^−Slope on [DMin, DMax] (Junge 1963).
	SizeJunge SizeKind = "junge"
	// SizeLognormal has median Median and geometric standard deviation GSD,
	// of the number or the volume distribution (By).
	SizeLognormal SizeKind = "lognormal"
	// SizeTable is read from a CSV of volume concentration per size class.
	SizeTable SizeKind = "table"
)

// Basis says what a concentration or a distribution median counts.
type Basis string

const (
	ByNumber Basis = "number" // particles per m³
	ByVolume Basis = "volume" // m³ of particles per m³ of water
	ByMass   Basis = "mass"   // kg per m³ of water
)

// SizeDistribution is a particle size distribution by diameter.
type SizeDistribution struct {
	Kind  SizeKind
	Slope float64 // Junge slope ξ of the number distribution per unit diameter (0 … 8)
	DMin  float64 // m (SizeJunge)
	DMax  float64 // m (SizeJunge); DMin < DMax
	// Median diameter, m, and geometric standard deviation (> 1, ≤ 10) of a
	// lognormal; By says whether the median is of number or volume.
	Median, GSD float64
	By          Basis
	// CSV is the path of the size table (SizeTable), resolved against the
	// scenario file's directory, and Table its contents as read by
	// mie/psd.ReadCSVFile (which documents the columns).
	CSV   string
	Table psd.Binned
}

// Concentration is an amount of particles per volume of water.
type Concentration struct {
	Basis Basis   // "" when not given
	Value float64 // kg/m³ (ByMass), m³/m³ (ByVolume) or 1/m³ (ByNumber)
}

// FlocOptics chooses the aggregate optics method of a floc population.
type FlocOptics string

const (
	// FlocEffectiveMedium is a homogeneous porous sphere with an
	// effective-medium index.
	FlocEffectiveMedium FlocOptics = "effective_medium"
	// FlocRDG is fractal-aggregate Rayleigh–Debye–Gans with Mie primaries
	// (Sorensen 2001, Aerosol Sci. Technol. 35:648).
	FlocRDG FlocOptics = "rdg"
)

// FlocParams describe the aggregates of a floc population (Kranenburg 1994,
// Estuar. Coast. Shelf Sci. 39:451).
type FlocParams struct {
	PrimarySize      float64    // primary particle diameter, m; smaller than the flocs
	FractalDimension float64    // 1 < Df ≤ 3
	Optics           FlocOptics // "" (not given): the floc package's documented default method
	// Dynamic: floc size follows shear, concentration and salinity (floc
	// package kinetics); the size distribution then sets the initial median
	// and the width. Default true in a full scenario; always false in a
	// mixture document, which has no flow.
	Dynamic bool
}

// CellStructure is the model of a phytoplankton cell.
type CellStructure string

const (
	CellHomogeneous CellStructure = "homogeneous"
	CellCoated      CellStructure = "coated" // core (Index) in a shell (Shell)
)

// CellParams describe phytoplankton cells.
type CellParams struct {
	Structure CellStructure // default CellHomogeneous
	// CoreFraction is core diameter / cell diameter, 0 < f < 1 (CellCoated),
	// as in package mie/population's Cell. Population.Index is then the
	// core's index and Shell the shell's.
	CoreFraction float64
	Shell        RefractiveIndex
}

// InstrumentKind is the kind of a simulated sensor.
type InstrumentKind string

const (
	// Transmissometer: beam attenuation over PathLength with a finite
	// AcceptanceAngle.
	Transmissometer InstrumentKind = "transmissometer"
	// Backscatter: single-angle backscattering sensor at Angle, converted
	// to b_b with a χ factor.
	Backscatter InstrumentKind = "backscatter"
	// Turbidity: the ISO 7027-1:2016 nephelometric geometry, 860 nm and 90°;
	// its Wavelength and Angle are filled in and cannot be set.
	Turbidity InstrumentKind = "turbidity"
)

// Instrument is one simulated sensor.
type Instrument struct {
	Name            string // unique
	Kind            InstrumentKind
	Wavelength      float64 // m, within the optics wavelength range
	Angle           float64 // scattering angle, rad (Backscatter, Turbidity)
	PathLength      float64 // m (Transmissometer)
	AcceptanceAngle float64 // full acceptance angle, rad (Transmissometer)
}

// Optics sets where the optical properties are computed.
type Optics struct {
	Wavelengths []float64 // vacuum wavelengths, m, strictly increasing, 400 … 900 nm
	// Angles for the volume scattering function, rad, strictly increasing
	// in (0, π]. Default 90°, 100°, …, 170°: the angles at which Sullivan et
	// al. (2013, Light Scattering Reviews 7) tabulate χ_p for single-angle
	// backscatter sensors.
	Angles      []float64
	Instruments []Instrument
	// SizeBins is the number of diameter bins of each population's optical
	// kernel (default 200, the kernel size the particle optics are
	// benchmarked at; 10 … 2000).
	SizeBins int
}

// Outputs chooses what a run writes.
type Outputs struct {
	Directory string // resolved against the scenario file's directory (default "murk-out")
	NetCDF    bool   // CF-conventions NetCDF file
	CSV       bool   // CSV tables with units in the header
	Plots     bool   // figures
	Summary   bool   // short text summary
	// PlotFormats are "svg" and/or "png" (default both).
	PlotFormats []string
}
