package water

import (
	"fmt"
	"math"
)

// Chlorophyll range of the data behind the Bricaud et al. power laws,
// mg m⁻³ (Bricaud et al. 1995, 1998: 0.02–25 mg m⁻³). Concentrations below
// the lower limit are accepted (the power law tends to zero); above the upper
// limit an error is returned.
const MaxChlMgM3 = 25.0

// ChlPowerLaw is phytoplankton absorption as a power law of chlorophyll a
// concentration at each wavelength (Bricaud, Babin, Morel & Claustre 1995,
// J. Geophys. Res. 100(C7):13321–13332; Bricaud, Morel, Babin, Allali &
// Claustre 1998, J. Geophys. Res. 103(C13):31033–31044):
//
//	a_φ(λ) = A(λ) · Chl^E(λ),   Chl in mg m⁻³,
//
// so the chlorophyll-specific absorption a*_φ = A·Chl^(E−1) falls as Chl
// rises (pigment packaging and changing accessory pigments). Coefficients
// are interpolated linearly in wavelength between nodes.
type ChlPowerLaw struct {
	Source      string
	Wavelengths []float64 // nodes, vacuum wavelength in m, strictly increasing
	A           []float64 // a_φ at 1 mg m⁻³, m⁻¹, ≥ 0
	E           []float64 // exponent, dimensionless, 0–1.5
}

// BricaudDefault returns the default phytoplankton model: the power-law form
// of Bricaud et al. (1998) with coefficients at ocean-colour band centres
// that are FROM MEMORY, not read from the paper's table (which was not
// available to us). They reproduce the published qualitative facts (blue
// maximum near 440 nm, red maximum near 676 nm, minimum near 600 nm; a*_φ at
// the blue maximum within 0.01–0.18 m² mg⁻¹ over 0.02–25 mg m⁻³ as Bricaud
// et al. 1995 report) but should be replaced by the published Table 2 before
// quantitative use. The project's research record holds a different memory
// for 440 nm (A = 0.0654, E = 0.728); the discrepancy is unresolved. Above
// 700 nm the nodes at 750 and 900 nm are zero because particle absorption is
// negligible at 700–850 nm (Babin & Stramski 2002, Limnol. Oceanogr.
// 47(3):911); between 700 and 750 nm the coefficient falls linearly to zero
// (a choice, not a measurement). Range 400–900 nm.
func BricaudDefault() ChlPowerLaw {
	nm := []float64{400, 412, 443, 490, 510, 555, 620, 665, 676, 700, 750, 900}
	a := []float64{0.0241, 0.0323, 0.0394, 0.0279, 0.0180, 0.0068, 0.0064, 0.0140, 0.0189, 0.0025, 0, 0}
	e := []float64{0.6877, 0.6724, 0.6655, 0.6180, 0.5950, 0.5450, 0.6990, 0.8400, 0.8800, 0.8500, 0.8500, 0.8500}
	w := make([]float64, len(nm))
	for i, v := range nm {
		w[i] = v * 1e-9
	}
	return ChlPowerLaw{Source: "Bricaud et al. (1998) form; coefficients from memory", Wavelengths: w, A: a, E: e}
}

// Validate checks lengths, ordering and ranges of the coefficients.
func (p ChlPowerLaw) Validate() error {
	n := len(p.Wavelengths)
	if n < 2 || len(p.A) != n || len(p.E) != n {
		return fmt.Errorf("water: phytoplankton model %q: need ≥ 2 nodes with equal-length Wavelengths, A, E (have %d, %d, %d)",
			p.Source, n, len(p.A), len(p.E))
	}
	for i := range n {
		if err := checkWavelength(fmt.Sprintf("phytoplankton node wavelength [%d]", i), p.Wavelengths[i], 300, 1000); err != nil {
			return err
		}
		if i > 0 && !(p.Wavelengths[i] > p.Wavelengths[i-1]) {
			return fmt.Errorf("water: phytoplankton node wavelength [%d] = %g nm does not increase", i, toNM(p.Wavelengths[i]))
		}
		if err := checkRange(fmt.Sprintf("phytoplankton coefficient A[%d]", i), p.A[i], 0, 10, "m-1"); err != nil {
			return err
		}
		if err := checkRange(fmt.Sprintf("phytoplankton exponent E[%d]", i), p.E[i], 0, 1.5, "(dimensionless)"); err != nil {
			return err
		}
	}
	return nil
}

// coeffs interpolates A and E at lambda (m) after checking the range.
func (p ChlPowerLaw) coeffs(lambda float64) (a, e float64, err error) {
	n := len(p.Wavelengths)
	if err := checkWavelength("wavelength", lambda, toNM(p.Wavelengths[0]), toNM(p.Wavelengths[n-1])); err != nil {
		return 0, 0, fmt.Errorf("%w (phytoplankton model %q)", err, p.Source)
	}
	i := 1
	for i < n-1 && p.Wavelengths[i] < lambda {
		i++
	}
	w := (lambda - p.Wavelengths[i-1]) / (p.Wavelengths[i] - p.Wavelengths[i-1])
	w = min(max(w, 0), 1)
	return p.A[i-1] + w*(p.A[i]-p.A[i-1]), p.E[i-1] + w*(p.E[i]-p.E[i-1]), nil
}

// Absorption returns a_φ (m⁻¹) at vacuum wavelength lambda (m) for
// chlorophyll a concentration chl (kg m⁻³; 1 mg m⁻³ =
// MilligramPerCubicMetre). chl = 0 gives 0.
func (p ChlPowerLaw) Absorption(lambda, chl float64) (float64, error) {
	if err := p.Validate(); err != nil {
		return 0, err
	}
	mg := chl / MilligramPerCubicMetre
	if err := checkRange("chlorophyll", mg, 0, MaxChlMgM3, "mg m-3"); err != nil {
		return 0, err
	}
	a, e, err := p.coeffs(lambda)
	if err != nil {
		return 0, err
	}
	if mg == 0 {
		return 0, nil
	}
	return a * math.Pow(mg, e), nil
}

// Specific returns the chlorophyll-specific absorption a*_φ = a_φ/Chl in
// m² kg⁻¹ (divide by 1e6 for m² mg⁻¹) at lambda (m) and chl (kg m⁻³,
// > 0).
func (p ChlPowerLaw) Specific(lambda, chl float64) (float64, error) {
	if !(chl > 0) {
		return 0, &RangeError{Field: "chlorophyll", Value: chl / MilligramPerCubicMetre, Min: math.SmallestNonzeroFloat64, Max: MaxChlMgM3, Unit: "mg m-3"}
	}
	a, err := p.Absorption(lambda, chl)
	if err != nil {
		return 0, err
	}
	return a / chl, nil
}

// PackageQa is the absorption efficiency of a homogeneous, weakly refracting
// absorbing sphere in the anomalous-diffraction approximation (van de Hulst
// 1957, Light Scattering by Small Particles, §11.22; Duysens 1956),
//
//	Q_a(ρ') = 1 + 2 e^(−ρ')/ρ' + 2 (e^(−ρ') − 1)/ρ'²,   ρ' = a_cm · D,
//
// where a_cm is the absorption coefficient of the cell material and D the
// diameter. Q_a rises from (2/3)ρ' at small ρ' to 1. For ρ' < 0.05 a series
// Σ 2(−1)^(n+1)(n+1)ρ'^n/(n+2)! replaces the closed form, which loses digits
// to cancellation there. ρ' must be ≥ 0 and finite (ρ' = 0 gives 0).
func PackageQa(rho float64) float64 {
	switch {
	case rho == 0:
		return 0
	case rho < 0.05:
		// Term n+1 over term n is −ρ'(n+2)/((n+1)(n+3)) < ρ': ten terms
		// leave a remainder below 0.05¹⁰ relative.
		sum, p, fact, sign := 0.0, 1.0, 6.0, 1.0 // fact = (n+2)!
		for n := 1; n <= 10; n++ {
			p *= rho
			sum += sign * 2 * float64(n+1) * p / fact
			sign = -sign
			fact *= float64(n + 3)
		}
		return sum
	default:
		e := math.Exp(-rho)
		return 1 + 2*e/rho + 2*(e-1)/(rho*rho)
	}
}

// PackagedSpecific returns the chlorophyll-specific absorption of cells
// (m² kg⁻¹) given the specific absorption of the same pigments in solution
// aSol (m² kg⁻¹), the intracellular chlorophyll concentration ci (kg m⁻³)
// and the cell diameter d (m): the package effect of Morel & Bricaud (1981),
// "Theoretical results concerning light absorption in a discrete medium, and
// application to specific absorption of phytoplankton", Deep-Sea Res.
// 28A(11):1375–1393,
//
//	a*_cell = a*_sol · Q*_a(ρ'),   Q*_a = (3/2) Q_a(ρ')/ρ',   ρ' = ci · a*_sol · d.
//
// Q*_a → 1 for small or dilute cells (no packaging) and → 3/(2ρ') for
// large, dense ones. All inputs must be ≥ 0 and finite.
func PackagedSpecific(aSol, ci, d float64) (float64, error) {
	for _, c := range []struct {
		f string
		v float64
		u string
	}{{"specific absorption in solution", aSol, "m2 kg-1"}, {"intracellular chlorophyll", ci, "kg m-3"}, {"cell diameter", d, "m"}} {
		if err := checkRange(c.f, c.v, 0, math.MaxFloat64, c.u); err != nil {
			return 0, err
		}
	}
	rho := ci * aSol * d
	if rho == 0 {
		return aSol, nil
	}
	return aSol * 1.5 * PackageQa(rho) / rho, nil
}

// UnpackagedSpecific inverts the package effect of Morel & Bricaud (1981):
// given the chlorophyll-specific absorption of cells aCell (m² kg⁻¹), their
// intracellular chlorophyll concentration ci (kg m⁻³) and diameter d (m), it
// returns the specific absorption the same pigment would have unpackaged
// (in solution), a*_sol (m² kg⁻¹), so that PackagedSpecific(a*_sol, ci, d) =
// aCell. It solves Q_a(ρ') = (2/3)·aCell·ci·d for ρ' = ci·a*_sol·d by
// bisection (Q_a increases monotonically from 0 to 1). This is the spectrum
// a coated-cell model (population.ShellAbsorption, in m² mg⁻¹: divide by
// 1e6) needs to absorb, after its own packaging, what the bulk model says.
// Errors: a negative or non-finite input, d ≤ 0, or (2/3)·aCell·ci·d ≥ 1,
// which no cell of that size and pigment content can reach (packaging caps
// absorption at the cell's geometric cross-section).
func UnpackagedSpecific(aCell, ci, d float64) (float64, error) {
	if err := checkRange("cell chlorophyll-specific absorption", aCell, 0, math.MaxFloat64, "m2 kg-1"); err != nil {
		return 0, err
	}
	if err := checkRange("intracellular chlorophyll", ci, 0, math.MaxFloat64, "kg m-3"); err != nil {
		return 0, err
	}
	if err := checkRange("cell diameter", d, math.SmallestNonzeroFloat64, math.MaxFloat64, "m"); err != nil {
		return 0, err
	}
	q := 2.0 / 3.0 * aCell * ci * d
	if q == 0 {
		return aCell, nil
	}
	if q >= 1 {
		return 0, fmt.Errorf("water: (2/3)·a*·c_i·D = %g ≥ 1: a cell of diameter %g m with %g kg m-3 chlorophyll cannot absorb %g m2 kg-1 (allowed: below %g m2 kg-1)",
			q, d, ci, aCell, 1.5/(ci*d))
	}
	// Bracket: Q_a(ρ') ≤ (2/3)ρ', so ρ' ≥ 1.5q; grow hi until Q_a(hi) > q.
	lo, hi := 1.5*q, 3*q
	for PackageQa(hi) <= q {
		lo, hi = hi, 2*hi
	}
	for range 200 {
		mid := 0.5 * (lo + hi)
		if mid == lo || mid == hi {
			break
		}
		if PackageQa(mid) < q {
			lo = mid
		} else {
			hi = mid
		}
	}
	rho := 0.5 * (lo + hi)
	return rho / (ci * d), nil
}

// CellIndex returns the imaginary part k of the refractive index, relative to
// the medium, of a homogeneous spherical cell of diameter d (m) and
// intracellular chlorophyll concentration ci (kg m⁻³) whose packaged
// chlorophyll-specific absorption is aCell (m² kg⁻¹, e.g. from Specific) at
// vacuum wavelength lambda (m), in a medium of real index nMedium: the cell
// material absorbs a_cm = ci·a*_sol with a*_sol from UnpackagedSpecific, and
//
//	k = a_cm · λ / (4π · nMedium)
//
// (a_cm = 4π k_abs/λ with k_abs = k·nMedium the absolute imaginary index).
// A Mie calculation with this k for a weakly refracting cell then absorbs
// as the bulk model says, to the accuracy of the anomalous-diffraction
// approximation behind Q_a: measured against Mie, 0.2 % at m = 1.001 and
// x = 1000; at m = 1.03 and x ≈ 100 (a 10 µm cell at 440 nm) the Mie cell
// absorbs about 6 % more than asked, because refraction lengthens the paths
// inside it. Errors as UnpackagedSpecific, and for nMedium outside [1, 2].
func CellIndex(aCell, ci, d, lambda, nMedium float64) (float64, error) {
	if err := checkWavelength("wavelength", lambda, 200, 2000); err != nil {
		return 0, err
	}
	if err := checkRange("medium refractive index", nMedium, 1, 2, "(dimensionless)"); err != nil {
		return 0, err
	}
	aSol, err := UnpackagedSpecific(aCell, ci, d)
	if err != nil {
		return 0, err
	}
	return imagIndex(ci*aSol, lambda) / nMedium, nil
}
