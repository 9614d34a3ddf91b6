package population

import (
	"math"
	"strings"
	"testing"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/psd"
)

// TestPackageEffect: pigment packed into cells absorbs less per unit pigment
// as cells grow (the package effect; Duysens 1956, Biochim. Biophys. Acta
// 19:1; Morel & Bricaud 1981, Deep-Sea Res. 28A:1375: common practice for
// the direction). For cells much smaller than the wavelength the Rayleigh
// limit (Bohren & Huffman 1983, §5.2) gives Cabs = V_shell·a_shell times an
// internal-field factor n·|3/(m²+2)|² which is 0.96 for the shell index
// 1.10 (core and shell fields differ little at these indices): the check
// allows 0.85–1.05. Between the two, cells of a few wavelengths absorb
// slightly MORE than unpackaged pigment (internal focusing; exact Mie
// exceeds the anomalous-diffraction absorption of weakly absorbing spheres,
// which ignores it), so the decrease is checked from 6 µm upward, where
// self-shading dominates.
func TestPackageEffect(t *testing.T) {
	const aStar = 0.03 // m² mg⁻¹, a flat test spectrum of the order of a*_φ(440) (from memory)
	const ci = 3e6     // mg Chl per m³ of cell (from memory)
	shell, err := ShellAbsorption(func(float64) float64 { return aStar }, ci, 0.9)
	if err != nil {
		t.Fatal(err)
	}
	p := TypicalPhytoplankton(water, shell)
	edges, _ := kernel.LogEdges(0.1e-6, 40e-6, 60)
	tab, err := kernel.Build(p.Evaluator(), kernel.Spec{Edges: edges, Wavelengths: []float64{440e-9}, Medium: water, SkipBackscatter: true})
	if err != nil {
		t.Fatal(err)
	}
	const chl = 2.0 // mg m⁻³
	p.Concentration, err = ChlorophyllConcentration(chl, ci)
	if err != nil {
		t.Fatal(err)
	}
	prev := math.Inf(1)
	for _, d := range []float64{0.15e-6, 1.5e-6, 6e-6, 12e-6, 25e-6} {
		p.Size = psd.Lognormal{N: 1, Median: d, GSD: 1.15}
		o, err := FromTable(p, tab)
		if err != nil {
			t.Fatal(err)
		}
		iop := tab.NewIOP()
		_ = o.IOP(&iop)
		r := iop.A[0] / (chl * aStar) // packaged / unpackaged
		t.Logf("cells %.2f µm: a/(Chl·a*) = %.3f", d*1e6, r)
		if d > 5e-6 && r >= prev {
			t.Errorf("cells %g m absorb %.3f of unpackaged pigment, not below %.3f for smaller cells", d, r, prev)
		}
		if d < 0.2e-6 && (r < 0.85 || r > 1.05) {
			t.Errorf("small cells: ratio %.3f outside the Rayleigh-limit range 0.85–1.05", r)
		}
		prev = r
	}
	if prev > 0.8 {
		t.Errorf("25 µm cells absorb %.3f of unpackaged pigment: no package effect", prev)
	}
	if _, err := ShellAbsorption(func(float64) float64 { return 1 }, 1e6, 1); err == nil || !strings.Contains(err.Error(), "core fraction = 1") {
		t.Errorf("no shell accepted: %v", err)
	}
	if _, err := ChlorophyllConcentration(-1, ci); err == nil || !strings.Contains(err.Error(), "chlorophyll = -1 mg m-3") {
		t.Errorf("negative chlorophyll: %v", err)
	}
}
