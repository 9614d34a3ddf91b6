package spec

import (
	"math"
	"os"
	"testing"
)

func BenchmarkParseQuell(b *testing.B) {
	data, err := os.ReadFile("testdata/quell.yaml")
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Parse("testdata/quell.yaml", data); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkEstimateQuell(b *testing.B) {
	s, err := Load("testdata/quell.yaml")
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		_ = Estimate(s)
	}
}

// The At methods are called at every step and station of a run: they must
// not allocate.
func quellForAt(tb testing.TB) Scenario {
	s, err := Load("testdata/quell.yaml")
	if err != nil {
		tb.Fatal(err)
	}
	return s
}

func hourlySeries() Signal {
	var s Signal
	for i := 0; i <= 24*30; i++ {
		s.Times = append(s.Times, float64(i)*3600)
		s.Values = append(s.Values, 150+float64(i%24))
	}
	return s
}

func BenchmarkSignalAt(b *testing.B) {
	s := hourlySeries()
	t := 0.0
	b.ReportAllocs()
	for b.Loop() {
		_ = s.At(t)
		t += 977
		if t > 30*86400 {
			t = 0
		}
	}
}

func BenchmarkIndexAt(b *testing.B) {
	ri := quellForAt(b).Mixture.Populations[2].Index // table model
	l := 400e-9
	b.ReportAllocs()
	for b.Loop() {
		_, _ = ri.At(l)
		l += 1e-9
		if l > 900e-9 {
			l = 400e-9
		}
	}
}

func TestAtAllocatesNothing(t *testing.T) {
	s := quellForAt(t)
	sig := hourlySeries()
	g := s.Estuary.Geometry
	g2 := Geometry{Shape: ShapeTable, Length: 2, Table: []Section{{0, 10, 2}, {1, 8, 3}, {2, 6, 4}}}
	ri := s.Mixture.Populations[2].Index
	sm := s.Mixture.Populations[0].Index
	sup := s.Estuary.River.Supply[0]
	allocs := testing.AllocsPerRun(100, func() {
		_ = sig.At(12345)
		_, _ = g.At(1000)
		_, _ = g2.At(1.5)
		_, _ = ri.At(555e-9)
		_, _ = sm.At(555e-9)
		_ = sup.At(200)
	})
	if allocs != 0 {
		t.Errorf("%v allocations per call set, want 0", allocs)
	}
}

// TestAtInterpolation checks the interpolating accessors against values
// worked by hand (linear interpolation; B0·e⁻¹ at one convergence length).
func TestAtInterpolation(t *testing.T) {
	s := quellForAt(t)
	if b, h := s.Estuary.Geometry.At(25e3); !near(b, 3000/2.718281828459045, 1e-12) || h != 10 {
		t.Errorf("B(Lb) = %v, depth %v", b, h)
	}
	g := Geometry{Shape: ShapeTable, Length: 2, Table: []Section{{0, 10, 2}, {1, 8, 3}, {2, 6, 4}}}
	if b, h := g.At(1.5); b != 7 || h != 3.5 {
		t.Errorf("table at 1.5: %v %v", b, h)
	}
	if b, _ := g.At(5); b != 6 {
		t.Errorf("beyond the table: %v", b)
	}
	ri := s.Mixture.Populations[2].Index // 675 nm k = 0.0030, 700 nm k = 0.0010
	if n, k := ri.At(687.5e-9); n != 1.05 || !near(k, 0.002, 1e-12) {
		t.Errorf("table index at 687.5 nm: %v %v", n, k)
	}
	sm := s.Mixture.Populations[0].Index                                  // k_ref 0.002 at 440 nm, slope 0.011/nm
	if _, k := sm.At(540e-9); !near(k, 0.002*0.33287108369807955, 1e-9) { // e^(−1.1)
		t.Errorf("smooth index at 540 nm: k = %v", k)
	}
	sig := hourlySeries()
	if v := sig.At(1800); v != 150.5 {
		t.Errorf("series midpoint %v", v)
	}
}

func TestSignalAtSpecialCases(t *testing.T) {
	s := Signal{Times: []float64{0, 10}, Values: []float64{1, 3}}
	if v := s.At(math.NaN()); !math.IsNaN(v) {
		t.Errorf("At(NaN) = %v", v)
	}
	if s.At(-5) != 1 || s.At(50) != 3 || s.At(10) != 3 || s.At(2.5) != 1.5 {
		t.Error("clamping or interpolation wrong")
	}
	if (Signal{}).At(3) != 0 || (Signal{Values: []float64{7}}).At(-1) != 7 {
		t.Error("empty or constant signal wrong")
	}
}
