package mixing

import "testing"

// benchConfig is the performance case: 200 cells, 30 days with an
// M2+S2 tide and two sediment classes.
func benchConfig() Config {
	cfg := DefaultConfig()
	cfg.Geometry.Cells = 200
	cfg.Run.Duration = 30 * 86400
	cfg.Sediment = []Class{
		{Name: "fine", RatingA: 0.02, Ocean: 0.01, BedInventory: 1, ErosionRate: 1e-4, CriticalErosion: 0.15},
		{Name: "coarse", RatingA: 0.01, Ocean: 0.005, BedInventory: 1, ErosionRate: 5e-5, CriticalErosion: 0.3},
	}
	return cfg
}

func BenchmarkRun200Cells30Days(b *testing.B) {
	cfg := benchConfig()
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Run(cfg, ConstantSettling{3e-4, 1e-3}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkStep is one automatic step of the 200-cell, two-class estuary.
func BenchmarkStep(b *testing.B) {
	cfg := benchConfig()
	cfg.Run.Duration = 1e9
	m, err := New(cfg, ConstantSettling{3e-4, 1e-3})
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if err := m.Step(); err != nil {
			b.Fatal(err)
		}
	}
}
