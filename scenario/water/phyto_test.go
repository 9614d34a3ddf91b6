package water

import (
	"math"
	"strings"
	"testing"

	"github.com/murk-optics/murk/mie"
	"gonum.org/v1/gonum/integrate/quad"
)

const mg = MilligramPerCubicMetre

func TestPhytoplanktonSpecificRanges(t *testing.T) {
	p := BricaudDefault()
	if err := p.Validate(); err != nil {
		t.Fatal(err)
	}
	spec := func(nm, chl float64) float64 {
		s, err := p.Specific(nm*1e-9, chl*mg)
		if err != nil {
			t.Fatal(err)
		}
		return s / 1e6 // m² mg⁻¹
	}
	// Bricaud et al. (1995) abstract: at the blue maximum a*_φ spans 0.18
	// to 0.01 m² mg⁻¹ from oligotrophic to eutrophic waters over Chl
	// 0.02–25 mg m⁻³, falling regularly.
	prev := math.Inf(1)
	for _, chl := range []float64{0.02, 0.1, 1, 5, 25} {
		s := spec(440, chl)
		if s < 0.01 || s > 0.18 {
			t.Errorf("a*_φ(440 nm, Chl %g) = %.4f m2 mg-1 outside 0.01–0.18 (Bricaud et al. 1995)", chl, s)
		}
		if !(s < prev) {
			t.Errorf("a*_φ(440) does not fall with Chl at %g", chl)
		}
		prev = s
		// Red maximum: from memory, natural populations show a*_φ(675)
		// between about 0.005 and 0.04 m² mg⁻¹.
		if r := spec(675, chl); r < 0.005 || r > 0.04 {
			t.Errorf("a*_φ(675 nm, Chl %g) = %.4f m2 mg-1 outside 0.005–0.04 (from memory)", chl, r)
		}
		// Blue-to-red ratio at least that of detritus-corrected cultures
		// (1–1.5; "Quantitative in vivo absorption spectra of phytoplankton",
		// L&O abstract): natural populations carry more accessory pigment.
		if q := spec(440, chl) / spec(675, chl); q < 1 {
			t.Errorf("a*_φ(440)/a*_φ(675) = %g < 1 at Chl %g", q, chl)
		}
	}
	// Shape (common practice): blue maximum near 440 nm, red maximum near
	// 676 nm, a trough between them, near zero in the near infrared
	// (Babin & Stramski 2002: negligible particle absorption 700–850 nm).
	a440, _ := p.Absorption(440e-9, mg)
	a600, _ := p.Absorption(600e-9, mg)
	a676, _ := p.Absorption(676e-9, mg)
	a800, _ := p.Absorption(800e-9, mg)
	if !(a600 < a676 && a676 < a440 && a800 == 0) {
		t.Errorf("shape: a(440) %g, a(600) %g, a(676) %g, a(800) %g", a440, a600, a676, a800)
	}
	if a, _ := p.Absorption(500e-9, 0); a != 0 {
		t.Errorf("a_φ at Chl 0 = %g", a)
	}
}

func TestPhytoplanktonErrors(t *testing.T) {
	p := BricaudDefault()
	for _, c := range []struct {
		err  error
		want string
	}{
		{second(p.Absorption(440e-9, -1*mg)), "chlorophyll = -1 mg m-3"},
		{second(p.Absorption(440e-9, 30*mg)), "[0, 25] mg m-3"},
		{second(p.Absorption(380e-9, mg)), "wavelength = 380 nm"},
		{second(p.Specific(440e-9, 0)), "chlorophyll = 0"},
		{second(ChlPowerLaw{Wavelengths: []float64{4e-7}, A: []float64{1}, E: []float64{1}}.Absorption(4e-7, mg)), "need ≥ 2 nodes"},
		{second(ChlPowerLaw{Wavelengths: []float64{5e-7, 4e-7}, A: []float64{1, 1}, E: []float64{1, 1}}.Absorption(4e-7, mg)), "does not increase"},
	} {
		if c.err == nil || !strings.Contains(c.err.Error(), c.want) {
			t.Errorf("err = %v, want mention of %q", c.err, c.want)
		}
	}
}

func TestPackageQaAnomalousDiffraction(t *testing.T) {
	// Independent check of the closed form (van de Hulst 1957): absorption
	// efficiency of a non-refracting absorbing sphere is the projected-area
	// average of 1 − exp(−a·l) over chords l = D·sqrt(1 − u²), u = p/r:
	// Q_a = 2∫₀¹ (1 − exp(−ρ' sqrt(1−u²))) u du. Substituting v = sqrt(1−u²)
	// makes the integrand smooth: Q_a = 2∫₀¹ (1 − exp(−ρ'v)) v dv.
	// 40-point Gauss–Legendre is exact to rounding for this entire function
	// at ρ' ≤ 50.
	const tol = 1e-12
	for _, rho := range []float64{1e-6, 1e-3, 0.049, 0.05, 0.3, 1, 4, 20, 50} {
		f := func(v float64) float64 { return 2 * -math.Expm1(-rho*v) * v }
		want := quad.Fixed(f, 0, 1, 40, quad.Legendre{}, 0)
		if got := PackageQa(rho); math.Abs(got-want) > tol*math.Max(want, 1e-300)+1e-300 {
			t.Errorf("Q_a(%g) = %.16g, quadrature %.16g", rho, got, want)
		}
	}
	// Limits: Q_a ≈ (2/3)ρ' for small ρ', → 1 for large.
	if q := PackageQa(1e-9); math.Abs(q/(2e-9/3)-1) > 1e-8 {
		t.Errorf("Q_a(1e-9) = %g", q)
	}
	if q := PackageQa(1e6); math.Abs(q-1) > 3e-12 {
		t.Errorf("Q_a(1e6) = %g", q)
	}
}

func TestCellIndexRoundTrip(t *testing.T) {
	// Inverse consistency with Morel & Bricaud (1981): the index returned
	// for a cell, converted back to a material absorption a_cm = 4πk·n/λ and
	// packaged, reproduces the cell's specific absorption.
	const nw, lambda = 1.34, 440e-9
	for _, c := range []struct{ aCell, ci, d float64 }{
		{0.03e6, 2, 5e-6},    // 0.03 m² mg⁻¹, 2 kg m⁻³ intracellular, 5 µm
		{0.01e6, 6, 20e-6},   // strongly packaged
		{0.1e6, 0.5, 1e-6},   // almost unpackaged
		{0.02e6, 1e-3, 2e-6}, // dilute
	} {
		k, err := CellIndex(c.aCell, c.ci, c.d, lambda, nw)
		if err != nil {
			t.Fatal(err)
		}
		acm := 4 * math.Pi * k * nw / lambda
		back, err := PackagedSpecific(acm/c.ci, c.ci, c.d)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(back/c.aCell-1) > 1e-10 {
			t.Errorf("%+v: k = %g, repackaged a* = %g", c, k, back)
		}
		// Packaging never raises absorption (Morel & Bricaud 1981).
		if acm/c.ci < c.aCell*(1-1e-12) {
			t.Errorf("%+v: solution a* %g below cell a* %g", c, acm/c.ci, c.aCell)
		}
	}
	if _, err := CellIndex(0.1e6, 10, 20e-6, lambda, nw); err == nil || !strings.Contains(err.Error(), "cannot absorb") {
		t.Errorf("impossible packaging accepted: %v", err)
	}
	if _, err := CellIndex(0.1e6, 1, -1, lambda, nw); err == nil || !strings.Contains(err.Error(), "cell diameter") {
		t.Errorf("negative diameter: %v", err)
	}
}

func TestCellIndexAgainstMie(t *testing.T) {
	// Independent check with Lorenz–Mie theory (package mie). Q_a is the
	// anomalous-diffraction absorption efficiency (van de Hulst 1957), exact
	// in the limit m → 1, x → ∞; the leading correction is the edge term,
	// of order x^(−2/3) (from memory: Nussenzveig & Wiscombe 1980), about
	// 1 % at x = 1000. So a cell of real relative index 1.001 with the
	// imaginary index from CellIndex must absorb, per chlorophyll, what the
	// packaged model says to 2 % (twice that edge term).
	const nw, lambda = 1.3387, 440e-9   // Quan & Fry at 440 nm, ~15 °C, S ≈ 5
	d := 1000 * lambda / (math.Pi * nw) // x = 1000
	for _, c := range []struct{ aCell, ci float64 }{
		{5000, 1},  // ρ' ≈ 0.6
		{1300, 10}, // ρ' ≈ 4.5: strong packaging
	} {
		k, err := CellIndex(c.aCell, c.ci, d, lambda, nw)
		if err != nil {
			t.Fatal(err)
		}
		x := mie.SizeParameter(d, lambda, nw)
		e, err := mie.Sphere(x, complex(1.001, k))
		if err != nil {
			t.Fatal(err)
		}
		perChl := e.Qabs * 1.5 / (c.ci * d) // C_abs/(ci·V) = Qabs·πr²/(ci·4πr³/3)
		if math.Abs(perChl/c.aCell-1) > 0.02 {
			t.Errorf("%+v: x = %.0f, k = %.3g: Mie a* = %.5g m2 kg-1, packaged model %.5g", c, x, k, perChl, c.aCell)
		}
		if testing.Verbose() {
			t.Logf("ρ' case %+v: Mie/model = %.5f", c, perChl/c.aCell)
		}
	}
}
