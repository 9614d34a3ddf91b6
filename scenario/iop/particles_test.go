package iop

import (
	"math"
	"strings"
	"sync"
	"testing"

	"github.com/murk-optics/murk/mie/kernel"
	"github.com/murk-optics/murk/mie/population"
	"github.com/murk-optics/murk/mie/psd"
	"github.com/murk-optics/murk/scenario/water"
)

var (
	particleWL     = []float64{443e-9, 555e-9, 670e-9}
	particleAngles = []float64{math.Pi / 2, 2.44}
	medium         = water.Medium{Salinity: 12, TemperatureC: 14}
)

// builtPopulation builds one small kernel (30 bins, 0.3–30 µm) per kind for
// the whole test binary.
var builtPopulation = sync.OnceValues(func() (map[string]*population.Optics, error) {
	nw, err := medium.IndexFunc()
	if err != nil {
		return nil, err
	}
	edges, err := kernel.LogEdges(0.3e-6, 30e-6, 30)
	if err != nil {
		return nil, err
	}
	spec := kernel.Spec{Edges: edges, Wavelengths: particleWL, Angles: particleAngles, Medium: nw}
	out := map[string]*population.Optics{}
	for _, p := range []population.Population{population.TypicalMineral(nw), population.TypicalDetritus(nw)} {
		p.Size = psd.Lognormal{N: 1, Median: 2e-6, GSD: 1.8}
		p.Concentration = psd.Concentration{Basis: psd.ByMass, Value: 0.01} // 10 g m⁻³
		o, err := population.New(p, spec)
		if err != nil {
			return nil, err
		}
		out[p.Name] = o
	}
	return out, nil
})

func particles(t testing.TB, name string) *population.Optics {
	t.Helper()
	m, err := builtPopulation()
	if err != nil {
		t.Fatal(err)
	}
	return m[name]
}

func TestParticlesMatchPopulation(t *testing.T) {
	o := particles(t, "mineral")
	s, err := New(particleWL, particleAngles)
	if err != nil {
		t.Fatal(err)
	}
	if err := s.AddWater("water", medium); err != nil {
		t.Fatal(err)
	}
	if err := s.AddParticles(o); err != nil {
		t.Fatal(err)
	}
	want := o.Table.NewIOP()
	if err := o.IOP(&want); err != nil {
		t.Fatal(err)
	}
	c := &s.Components[1]
	for i := range particleWL {
		if c.A[i] != want.A[i] || c.B[i] != want.B[i] || c.Bb[i] != want.Bb[i] {
			t.Errorf("wavelength %d: component (%g, %g, %g), population (%g, %g, %g)", i, c.A[i], c.B[i], c.Bb[i], want.A[i], want.B[i], want.Bb[i])
		}
		// Kernel consistency: c from Cext equals a + b from Cabs + Csca
		// (Qext = Qsca + Qabs, an identity of Mie theory), to rounding.
		if math.Abs(c.Value(Attenuation, i)/want.C[i]-1) > 1e-9 {
			t.Errorf("c = a + b = %g, kernel c = %g", c.Value(Attenuation, i), want.C[i])
		}
	}
	if c.Mass != o.Mass() || c.Kind != Particles || c.Name != "mineral" {
		t.Errorf("component %q kind %v mass %g; population mass %g", c.Name, c.Kind, c.Mass, o.Mass())
	}
	tot := s.Total()
	if got := tot.Bb[1]; math.Abs(got-(s.Components[0].Bb[1]+c.Bb[1])) > 1e-15*got {
		t.Errorf("total b_b %g ≠ water + particles", got)
	}
}

func TestBackscatterProportionalToConcentration(t *testing.T) {
	// Common practice: for a fixed population, backscatter is proportional to
	// concentration (single scattering), so mass-specific values do not
	// change. The kernel is reused; only the bin numbers scale.
	base := particles(t, "mineral")
	o2, err := population.FromTable(base.Population, base.Table) // same kernel table
	if err != nil {
		t.Fatal(err)
	}
	s, _ := New(particleWL, particleAngles)
	c1 := s.Blank("m", Particles, 0)
	c2 := s.Blank("m", Particles, 0)
	if err := s.FillParticles(&c1, o2); err != nil {
		t.Fatal(err)
	}
	if err := o2.SetConcentration(psd.Concentration{Basis: psd.ByMass, Value: 0.03}); err != nil {
		t.Fatal(err)
	}
	if err := s.FillParticles(&c2, o2); err != nil {
		t.Fatal(err)
	}
	m1, _ := c1.MassSpecific(nil, Backscattering)
	m2, _ := c2.MassSpecific(nil, Backscattering)
	for i := range particleWL {
		if r := c2.Bb[i] / c1.Bb[i]; math.Abs(r-3) > 1e-12 {
			t.Errorf("b_bp ratio at 3× mass = %.15g, want 3", r)
		}
		if math.Abs(m2[i]/m1[i]-1) > 1e-12 {
			t.Errorf("mass-specific b_bp changed: %g → %g", m1[i], m2[i])
		}
	}
}

func TestMineralBackscatterRatioAboveOrganic(t *testing.T) {
	// Common practice (project REFERENCES.md): the backscattering ratio is
	// higher for mineral particles (higher index) than for organic ones.
	s, _ := New(particleWL, particleAngles)
	if err := s.AddParticles(particles(t, "mineral")); err != nil {
		t.Fatal(err)
	}
	if err := s.AddParticles(particles(t, "detritus")); err != nil {
		t.Fatal(err)
	}
	rm, err := s.Components[0].BackscatterRatio(nil)
	if err != nil {
		t.Fatal(err)
	}
	rd, err := s.Components[1].BackscatterRatio(nil)
	if err != nil {
		t.Fatal(err)
	}
	for i := range particleWL {
		if !(rm[i] > rd[i]) {
			t.Errorf("%g m: mineral b_b/b %g not above detritus %g", particleWL[i], rm[i], rd[i])
		}
	}
}

func TestParticlesGridMismatch(t *testing.T) {
	s, _ := New([]float64{443e-9, 555e-9}, particleAngles)
	err := s.AddParticles(particles(t, "mineral"))
	if err == nil || !strings.Contains(err.Error(), "differ from this grid") {
		t.Errorf("mismatched grid: %v", err)
	}
	if err := s.AddParticles(nil); err == nil {
		t.Error("nil population accepted")
	}
}

func TestFillParticlesDoesNotAllocate(t *testing.T) {
	o := particles(t, "mineral")
	s, _ := New(particleWL, particleAngles)
	c := s.Blank("m", Particles, 0)
	if n := testing.AllocsPerRun(50, func() { _ = s.FillParticles(&c, o) }); n != 0 {
		t.Errorf("FillParticles allocates %g times", n)
	}
}

func BenchmarkFillParticles(b *testing.B) {
	o := particles(b, "mineral")
	s, _ := New(particleWL, particleAngles)
	c := s.Blank("m", Particles, 0)
	b.ReportAllocs()
	for b.Loop() {
		if err := s.FillParticles(&c, o); err != nil {
			b.Fatal(err)
		}
	}
}
