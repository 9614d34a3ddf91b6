package water

// Limits of the merged pure water absorption spectrum, nm.
const (
	MinAbsorptionNM = 350.0
	MaxAbsorptionNM = 900.0

	// Junctions of the merge rule, nm (see the package documentation).
	morelToPopeFryNM      = 420.0
	popeFryToSegelsteinNM = 700.0
)

// Absorption returns the absorption coefficient of pure water (m⁻¹) at the
// vacuum wavelength lambda (m), 350–900 nm, merged from published tables:
//
//	350 ≤ λ < 420 nm   Morel et al. (2007) Table 2a, linear between 5 nm nodes
//	420 ≤ λ ≤ 700 nm   Pope & Fry (1997), linear between 2.5 nm nodes
//	700 < λ ≤ 900 nm   Segelstein (1981), a = 4πk/λ, k linear in λ
//
// The rule and the size of the steps at the junctions are explained in the
// package documentation. No temperature or salinity correction is applied.
// Outside 350–900 nm it returns a *RangeError.
func Absorption(lambda float64) (float64, error) {
	if err := checkWavelength("wavelength", lambda, MinAbsorptionNM, MaxAbsorptionNM); err != nil {
		return 0, err
	}
	return absorptionNM(toNM(lambda)), nil
}

// AbsorptionNM is Absorption with the wavelength in nanometres.
func AbsorptionNM(nm float64) (float64, error) { return Absorption(nm * 1e-9) }

// absorptionNM applies the merge rule at nm, already checked to be in range.
func absorptionNM(nm float64) float64 {
	switch {
	case nm < morelToPopeFryNM:
		return Morel2007.at(nm)
	case nm <= popeFryToSegelsteinNM:
		return PopeFry1997.at(nm)
	default:
		return Segelstein1981.at(nm)
	}
}

// AbsorptionSource names the table Absorption uses at lambda (m), or "" if
// lambda is outside 350–900 nm.
func AbsorptionSource(lambda float64) string {
	nm := toNM(lambda)
	switch {
	case !(nm >= MinAbsorptionNM && nm <= MaxAbsorptionNM):
		return ""
	case nm < morelToPopeFryNM:
		return Morel2007.Source
	case nm <= popeFryToSegelsteinNM:
		return PopeFry1997.Source
	default:
		return Segelstein1981.Source
	}
}
