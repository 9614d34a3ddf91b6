package mixing

import (
	"fmt"
	"math"
)

// RegimeClass is an estuary type in the Geyer & MacCready (2014) parameter space.
type RegimeClass int

// Regime classes, in the order tried by Classify.
const (
	Unclassified RegimeClass = iota // fjord/bay corner or outside the digitised region
	SaltWedge
	TimeDependentSaltWedge
	StronglyStratified
	PartiallyMixed
	SIPS // strain-induced periodic stratification
	WellMixed
)

var regimeNames = [...]string{"unclassified", "salt wedge", "time-dependent salt wedge",
	"strongly stratified", "partially mixed", "SIPS", "well mixed"}

func (r RegimeClass) String() string {
	if r < 0 || int(r) >= len(regimeNames) {
		return fmt.Sprintf("RegimeClass(%d)", int(r))
	}
	return regimeNames[r]
}

// RegimeDigitisation names the boundaries used by Classify; it belongs in any
// output's metadata.
const RegimeDigitisation = "Geyer & MacCready (2014, Annu. Rev. Fluid Mech. 46:175) Fig. 6 regions as " +
	"polygons in (M, Fr_f): salt wedge (0.19,7e-2)(0.3,1)(1,1)(0.8,7e-2); time-dependent salt wedge " +
	"(0.8,7e-2)(1,1)(2,1)(2,7e-2); strongly stratified (0.1,2e-3)(0.19,7e-2)(0.75,7e-2)(0.45,2e-3); " +
	"partially mixed (0.8,2e-3)(1.4,7e-2)(0.75,7e-2)(0.45,2e-3); SIPS (1.4,7e-2)(2,7e-2)(2,1e-2)(1,1e-4)(0.5,1e-4); " +
	"well mixed (1,1e-4)(2,1e-2)(2,1e-4); point-in-polygon in log10 coordinates, first match wins; " +
	"a third-party digitisation of the figure, uncertain by up to a factor 2 in M"

type poly struct {
	class RegimeClass
	m, f  []float64
}

var regimePolys = []poly{
	{SaltWedge, []float64{0.19, 0.3, 1, 0.8}, []float64{7e-2, 1, 1, 7e-2}},
	{TimeDependentSaltWedge, []float64{0.8, 1, 2, 2}, []float64{7e-2, 1, 1, 7e-2}},
	{StronglyStratified, []float64{0.1, 0.19, 0.75, 0.45}, []float64{2e-3, 7e-2, 7e-2, 2e-3}},
	{PartiallyMixed, []float64{0.8, 1.4, 0.75, 0.45}, []float64{2e-3, 7e-2, 7e-2, 2e-3}},
	{SIPS, []float64{1.4, 2, 2, 1, 0.5}, []float64{7e-2, 7e-2, 1e-2, 1e-4, 1e-4}},
	{WellMixed, []float64{1, 2, 2}, []float64{1e-4, 1e-2, 1e-4}},
}

// Regime is the position of an estuary in the Geyer & MacCready (2014) space.
type Regime struct {
	Froude float64     // freshwater Froude number Fr_f = U_R/c0, c0 = √(gβ s_ocean H)
	Mixing float64     // mixing number M = √(C_D U_T²/(ω N0 H²)), N0 = √(gβ s_ocean/H)
	Class  RegimeClass // by RegimeDigitisation
}

// NewRegime computes Fr_f and M (Geyer & MacCready 2014, as defined in
// MacCready's public scripts) from the river velocity ur = Q_R/A (m s⁻¹), the
// tidal velocity amplitude ut (m s⁻¹), depth h (m), ocean salinity (PSU), drag
// coefficient cd, haline contraction beta (PSU⁻¹) and tidal frequency omega (s⁻¹),
// and classifies the result.
func NewRegime(ur, ut, h, sOcean, cd, beta, omega float64) Regime {
	c0 := math.Sqrt(gravity * beta * sOcean * h)
	n0 := c0 / h
	r := Regime{Froude: ur / c0, Mixing: math.Sqrt(cd * ut * ut / (omega * n0 * h * h))}
	r.Class = Classify(r.Mixing, r.Froude)
	return r
}

// Classify returns the regime of the point (M, Fr_f) by RegimeDigitisation.
// Points on no polygon (including M ≤ 0 or Fr_f ≤ 0) are Unclassified.
func Classify(m, fr float64) RegimeClass {
	if !(m > 0) || !(fr > 0) || math.IsInf(m, 0) || math.IsInf(fr, 0) {
		return Unclassified
	}
	x, y := math.Log10(m), math.Log10(fr)
	for _, p := range regimePolys {
		if inside(p, x, y) {
			return p.class
		}
	}
	return Unclassified
}

// inside is the even–odd rule with boundary points counted inside.
func inside(p poly, x, y float64) bool {
	n := len(p.m)
	in := false
	for i, j := 0, n-1; i < n; j, i = i, i+1 {
		xi, yi := math.Log10(p.m[i]), math.Log10(p.f[i])
		xj, yj := math.Log10(p.m[j]), math.Log10(p.f[j])
		// on-edge test
		cross := (x-xi)*(yj-yi) - (y-yi)*(xj-xi)
		if math.Abs(cross) < 1e-12 && x >= math.Min(xi, xj)-1e-12 && x <= math.Max(xi, xj)+1e-12 &&
			y >= math.Min(yi, yj)-1e-12 && y <= math.Max(yi, yj)+1e-12 {
			return true
		}
		if (yi > y) != (yj > y) && x < (xj-xi)*(y-yi)/(yj-yi)+xi {
			in = !in
		}
	}
	return in
}
