package population

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie/psd"
	"github.com/murk-optics/murk/mie/refindex"
)

// TypicalMineral returns a mineral population of typical optics, without
// size distribution or concentration, in water of index water(λ0):
//
//   - real index 1.15 relative to water, the inorganic component of Brown &
//     Gordon's (1974) two-component Mie model and a mode of the index
//     distribution inverted by Zaneveld, Roach & Pak (1974);
//   - imaginary part 1e-3 at 400 nm decaying exponentially to 1e-4 at
//     650 nm (S = ln 10 / 250 nm), with a floor of 1e-5: the shape and
//     order of magnitude of mineral absorption (Babin & Stramski 2004; from
//     memory, not checked against their tables);
//   - apparent density 2650 kg m⁻³ (quartz grains; from memory).
func TypicalMineral(water refindex.Medium) Population {
	return Population{
		Name:    "mineral",
		Kind:    Mineral,
		Density: 2650,
		Index: refindex.Relative{
			Rel:   refindex.Smooth{Ref: 400e-9, N: 1.15, K: 1e-3, S: math.Ln10 / 250e-9, KFloor: 1e-5},
			Water: water,
		},
	}
}

// TypicalDetritus returns an organic-detritus population of typical optics:
//
//   - real index 1.05 relative to water, the organic mode of Zaneveld, Roach
//     & Pak (1974);
//   - material absorption a(λ) = a(400 nm)·exp(−0.011 nm⁻¹·(λ − 400 nm)),
//     the exponential with the non-algal particle slope of Bricaud et al.
//     (1998, J. Geophys. Res. 103:31033), entering as k = a·λ0/(4π); a(400
//     nm) = 1.26e4 m⁻¹ is k = 3e-4 relative to water of index 1.34 (from
//     memory; order of magnitude only);
//   - apparent density 700 kg m⁻³: dry organic matter of about 1400 kg m⁻³
//     holding half its volume as water (both from memory).
func TypicalDetritus(water refindex.Medium) Population {
	const (
		a400  = 4 * math.Pi * 3e-4 * 1.34 / 400e-9 // m⁻¹
		slope = 0.011e9                            // m⁻¹ of wavelength (0.011 nm⁻¹)
	)
	return Population{
		Name:    "detritus",
		Kind:    Detritus,
		Density: 700,
		Index: refindex.Absorbing{
			Base:       refindex.Relative{Rel: refindex.Constant{N: 1.05}, Water: water},
			Absorption: func(l float64) float64 { return a400 * math.Exp(-slope*(l-400e-9)) },
		},
	}
}

// TypicalPhytoplankton returns phytoplankton cells as coated spheres: a
// cytoplasm core of relative index 1.02 and 90 % of the cell diameter (73 %
// of its volume) inside a chloroplast shell of relative index 1.10 whose
// absorption coefficient (m⁻¹ of shell material) is shellAbsorption(λ0)
// (see ShellAbsorption). Apparent density 300 kg m⁻³ (dry mass per cell
// volume; from memory). These layer values are from memory: the two-layer
// geometry is common practice in cell optics, the numbers should be
// replaced by a species' own.
func TypicalPhytoplankton(water refindex.Medium, shellAbsorption func(vacuumWavelength float64) float64) Population {
	return Population{
		Name:    "phytoplankton",
		Kind:    Phytoplankton,
		Density: 300,
		Cell: &Cell{
			Core: refindex.Relative{Rel: refindex.Constant{N: 1.02}, Water: water},
			Shell: refindex.Absorbing{
				Base:       refindex.Relative{Rel: refindex.Constant{N: 1.10}, Water: water},
				Absorption: shellAbsorption,
			},
			CoreFraction: 0.9,
		},
	}
}

// ShellAbsorption converts a chlorophyll-specific absorption spectrum of
// unpackaged pigment, aStar(λ0) in m² mg⁻¹ (supplied by the water optics),
// into the absorption coefficient of the chloroplast shell material (m⁻¹):
// a_shell = aStar·Ci/(1 − f³), with Ci the chlorophyll per cell volume
// (mg m⁻³; 1e6–5e6 mg m⁻³ is typical, from memory) and f the core diameter
// fraction, all the pigment sitting in the shell. The package effect then
// follows from the Mie calculation itself rather than from a parameter.
func ShellAbsorption(aStar func(vacuumWavelength float64) float64, ci, coreFraction float64) (func(float64) float64, error) {
	if !(ci >= 0) || math.IsInf(ci, 0) {
		return nil, fmt.Errorf("population: intracellular chlorophyll = %g mg m-3, want a finite value ≥ 0", ci)
	}
	if !(coreFraction >= 0 && coreFraction < 1) {
		return nil, fmt.Errorf("population: core fraction = %g, want 0 ≤ f < 1 (a shell must exist to hold pigment)", coreFraction)
	}
	share := 1 - coreFraction*coreFraction*coreFraction
	return func(l float64) float64 { return aStar(l) * ci / share }, nil
}

// ChlorophyllConcentration returns the cell volume concentration of a
// phytoplankton population holding chl (mg m⁻³ of water) at ci mg
// chlorophyll per m³ of cell volume.
func ChlorophyllConcentration(chl, ci float64) (psd.Concentration, error) {
	if !(chl >= 0) || math.IsInf(chl, 0) {
		return psd.Concentration{}, fmt.Errorf("population: chlorophyll = %g mg m-3, want a finite value ≥ 0 mg m-3", chl)
	}
	if !(ci > 0) || math.IsInf(ci, 0) {
		return psd.Concentration{}, fmt.Errorf("population: intracellular chlorophyll = %g mg m-3, want a finite value > 0", ci)
	}
	return psd.Concentration{Basis: psd.ByVolume, Value: chl / ci}, nil
}
