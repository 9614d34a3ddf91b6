package psd

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// quadTol: composite 8-node Gauss–Legendre with panels 0.05 wide in ln D
// integrates the smooth test densities to near round-off; 1e-11 leaves room
// for the summation of a few thousand terms.
const quadTol = 1e-11

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got-want) / math.Abs(want)
}

// TestHatchChoate checks the numerical moments of log-normal distributions
// against the Hatch–Choate relations (Hatch & Choate 1929, J. Franklin Inst.
// 207:369): M_k = N·Dg^k·exp(k² ln²σg / 2), count median Dg, σg the
// geometric standard deviation. Integrate is the generic quadrature, not the
// closed form of Lognormal.PartialMoment.
func TestHatchChoate(t *testing.T) {
	for _, c := range []struct{ n, dg, gsd float64 }{
		{1e9, 2e-6, 1.2},
		{3e8, 5e-6, 1.8},
		{1e6, 40e-6, 2.5},
		{1e12, 0.3e-6, 4},
	} {
		l := Lognormal{N: c.n, Median: c.dg, GSD: c.gsd}
		s := math.Log(c.gsd)
		lo, hi := l.Range()
		for k := 0.0; k <= 4; k++ {
			want := c.n * math.Pow(c.dg, k) * math.Exp(k*k*s*s/2)
			if got := Integrate(l, k, lo, hi); relErr(got, want) > quadTol {
				t.Errorf("%+v: numeric M_%g = %.15g, Hatch–Choate %.15g (rel %.2g)", c, k, got, want, relErr(got, want))
			}
			if got := l.PartialMoment(k, lo, hi); relErr(got, want) > quadTol {
				t.Errorf("%+v: closed-form M_%g = %.15g, Hatch–Choate %.15g", c, k, got, want)
			}
		}
		// Hatch–Choate: Sauter diameter D32 = Dg·exp(2.5 ln²σg); volume
		// median diameter Dg·exp(3 ln²σg).
		d32, err := SauterDiameter(l)
		if err != nil {
			t.Fatal(err)
		}
		if want := c.dg * math.Exp(2.5*s*s); relErr(d32, want) > quadTol {
			t.Errorf("%+v: D32 = %g, Hatch–Choate %g", c, d32, want)
		}
		d50, err := VolumeMedianDiameter(l)
		if err != nil {
			t.Fatal(err)
		}
		// bisectTol: bisection stops at 1e-10 in ln D.
		const bisectTol = 2e-10
		if want := c.dg * math.Exp(3*s*s); relErr(d50, want) > bisectTol {
			t.Errorf("%+v: D50 = %g, Hatch–Choate %g", c, d50, want)
		}
	}
}

// TestLognormalByVolume: the volume median of the converted distribution,
// found numerically, is the requested one (Hatch & Choate 1929).
func TestLognormalByVolume(t *testing.T) {
	l, err := LognormalByVolume(1, 20e-6, 2)
	if err != nil {
		t.Fatal(err)
	}
	d50, err := VolumeMedianDiameter(Scaled{Of: l, Factor: 1}) // via generic path
	if err != nil {
		t.Fatal(err)
	}
	if relErr(d50, 20e-6) > 1e-9 {
		t.Errorf("D50 = %g m, want 20e-6 m", d50)
	}
	if _, err := LognormalByVolume(1, 20e-6, 1); err == nil || !strings.Contains(err.Error(), "GSD") {
		t.Errorf("GSD = 1 accepted or error lacks field name: %v", err)
	}
}

// TestPowerLaw checks the closed form against quadrature and against the
// calculus identity for ξ = 4: V = (π/6)·K·ln(Dmax/Dmin) (exact integral).
func TestPowerLaw(t *testing.T) {
	for _, xi := range []float64{2.5, 3, 3.999999999, 4, 4.5, 5} {
		p := PowerLaw{N: 1e10, Slope: xi, Min: 0.2e-6, Max: 200e-6}
		for k := 0.0; k <= 4; k++ {
			got := p.PartialMoment(k, 1e-6, 50e-6)
			want := Integrate(p, k, 1e-6, 50e-6)
			if relErr(got, want) > quadTol {
				t.Errorf("ξ=%g k=%g: closed form %g, quadrature %g", xi, k, got, want)
			}
		}
		n, _ := Moment(p, 0)
		if relErr(n, 1e10) > 1e-13 {
			t.Errorf("ξ=%g: N = %g, want 1e10", xi, n)
		}
	}
	p := PowerLaw{N: 1e10, Slope: 4, Min: 0.2e-6, Max: 200e-6}
	v, _ := Amount(p, ByVolume, 0)
	if want := math.Pi / 6 * p.K() * math.Log(1000); relErr(v, want) > 1e-13 {
		t.Errorf("ξ=4 volume %g, want %g", v, want)
	}
}

// TestNormalize: after normalising, the amount on each basis is the one
// asked for (definition), and conversions are consistent: mass = ρ·volume.
func TestNormalize(t *testing.T) {
	shape := Lognormal{N: 1, Median: 3e-6, GSD: 1.7}
	const rho = 2650 // kg m-3, quartz grain density (from memory)
	c, err := ParseConcentration(25, "mg/L")
	if err != nil {
		t.Fatal(err)
	}
	if c.Basis != ByMass || relErr(c.Value, 0.025) > 1e-15 {
		t.Fatalf("25 mg/L parsed as %+v, want mass 0.025 kg m-3", c)
	}
	d, err := Normalize(shape, c, rho)
	if err != nil {
		t.Fatal(err)
	}
	m, _ := Amount(d, ByMass, rho)
	v, _ := Amount(d, ByVolume, 0)
	if relErr(m, 0.025) > 1e-14 || relErr(v, 0.025/rho) > 1e-14 {
		t.Errorf("mass %g kg m-3 (want 0.025), volume %g (want %g)", m, v, 0.025/rho)
	}
	// Renormalising a Scaled does not nest.
	d2, err := Normalize(d, Concentration{ByNumber, 5e6}, 0)
	if err != nil {
		t.Fatal(err)
	}
	if _, nested := d2.Of.(Scaled); nested {
		t.Error("Normalize nested a Scaled inside a Scaled")
	}
	if n, _ := Amount(d2, ByNumber, 0); relErr(n, 5e6) > 1e-14 {
		t.Errorf("number %g, want 5e6", n)
	}
	// Projected area of a monodisperse-like narrow lognormal ≈ N·π/4·D² e^{2s²}
	// (Hatch–Choate for k = 2).
	a, _ := Amount(d2, ByArea, 0)
	s := math.Log(1.7)
	if want := 5e6 * math.Pi / 4 * 9e-12 * math.Exp(2*s*s); relErr(a, want) > quadTol {
		t.Errorf("area %g, want %g", a, want)
	}
}

// TestBadInput: errors name the field, the value and the allowed range.
func TestBadInput(t *testing.T) {
	for _, c := range []struct {
		name string
		err  error
		want []string
	}{
		{"negative concentration", func() error { _, err := ParseConcentration(-3, "mg/L"); return err }(), []string{"-3", "≥ 0"}},
		{"unknown unit", func() error { _, err := ParseConcentration(3, "furlongs"); return err }(), []string{"furlongs", "mg/L"}},
		{"negative mass", Concentration{ByMass, -1}.Validate(), []string{"mass", "-1", "kg m-3"}},
		{"empty range", Check(PowerLaw{N: 1, Slope: 4, Min: 5e-6, Max: 5e-6}), []string{"empty", "5e-06"}},
		{"zero min", Check(PowerLaw{N: 1, Slope: 4, Min: 0, Max: 5e-6}), []string{"minimum", "> 0"}},
		{"negative N", Check(Lognormal{N: -1, Median: 1e-6, GSD: 2}), []string{"Lognormal.N", "-1"}},
		{"density", func() error { _, err := Amount(Lognormal{N: 1, Median: 1e-6, GSD: 2}, ByMass, 0); return err }(), []string{"density", "0", "> 0"}},
		{"empty binned", Check(Binned{}), []string{"no size classes"}},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		for _, w := range c.want {
			if !strings.Contains(c.err.Error(), w) {
				t.Errorf("%s: error %q lacks %q", c.name, c.err, w)
			}
		}
	}
}

// TestReadCSV reads the sample export. Total volume is the column sum
// (conservation: Binned spreads each class's volume inside the class).
func TestReadCSV(t *testing.T) {
	b, err := ReadCSVFile(filepath.Join("testdata", "sizer.csv"))
	if err != nil {
		t.Fatal(err)
	}
	if len(b.Classes) != 12 {
		t.Fatalf("%d classes, want 12", len(b.Classes))
	}
	var sum float64
	for _, v := range []float64{0.81, 1.02, 1.40, 1.95, 2.60, 3.10, 3.32, 3.05, 2.41, 1.60, 0.88, 0.35} {
		sum += v * 1e-6
	}
	v, err := Amount(b, ByVolume, 0)
	if err != nil {
		t.Fatal(err)
	}
	if relErr(v, sum) > 1e-13 {
		t.Errorf("volume %g m3 m-3, want column sum %g", v, sum)
	}
	// The closed form per class agrees with quadrature inside one class.
	got := b.PartialMoment(2, 5e-6, 5.5e-6)
	if want := Integrate(b, 2, 5e-6, 5.5e-6); relErr(got, want) > quadTol {
		t.Errorf("class moment %g, quadrature %g", got, want)
	}
	// D50 lies in the class where the cumulative volume passes half:
	// cumulative to 6.75 µm is 10.88 of 22.49 µL/L, to 7.97 µm 14.20.
	d50, _ := VolumeMedianDiameter(b)
	if d50 < 6.75e-6 || d50 > 7.97e-6 {
		t.Errorf("D50 = %g m, want within class 6.75–7.97 µm", d50)
	}
}

func TestReadCSVErrors(t *testing.T) {
	for _, c := range []struct{ name, text, want string }{
		{"bad number", "lower (um),upper (um),volume (uL/L)\n1,2,0.5\n2,3,abc\n", "x.csv:3:3 (volume): value \"abc\""},
		{"negative", "# c\nlower (um),upper (um),volume (uL/L)\n1,2,-0.5\n", "x.csv:3:3 (volume): value -0.5 is negative"},
		{"unit", "lower (furlong),upper (um),volume (uL/L)\n", "x.csv:1:1 (lower): diameter unit \"furlong\" unknown"},
		{"volume unit", "lower (um),upper (um),volume (g)\n", "volume unit \"g\" unknown"},
		{"missing column", "lower (um),volume (uL/L)\n", "lacks column \"upper\""},
		{"order", "lower (um),upper (um),volume (uL/L)\n1,2,1\n1.5,3,1\n", "x.csv:3:1 (lower): lower edge 1.5 overlaps"},
		{"inverted", "lower (um),upper (um),volume (uL/L)\n2,1,1\n", "x.csv:2:2 (upper): upper edge 1 is not above lower edge 2"},
		{"no rows", "lower (um),upper (um),volume (uL/L)\n# nothing\n", "no size classes"},
		{"short row", "lower (um),upper (um),volume (uL/L)\n1,2\n", "x.csv:2:3 (volume): missing value"},
	} {
		_, err := ReadCSV(strings.NewReader(c.text), "x.csv")
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want it to contain %q", c.name, err, c.want)
		}
	}
}

// TestBinNumbers: bin numbers sum to the total (additivity of integrals).
func TestBinNumbers(t *testing.T) {
	l := Lognormal{N: 1e9, Median: 2e-6, GSD: 2}
	lo, hi := l.Range()
	const n = 300
	edges := make([]float64, n+1)
	for i := range edges {
		edges[i] = lo * math.Pow(hi/lo, float64(i)/n)
	}
	dst := make([]float64, n)
	BinNumbers(l, edges, dst)
	var s float64
	for _, v := range dst {
		s += v
	}
	if relErr(s, 1e9) > 1e-12 {
		t.Errorf("sum of bins %g, want 1e9", s)
	}
	var d Distribution = l
	if allocs := testing.AllocsPerRun(10, func() { BinNumbers(d, edges, dst) }); allocs != 0 {
		t.Errorf("BinNumbers allocates %v times", allocs)
	}
}

func TestMain(m *testing.M) { os.Exit(m.Run()) }
