package mixing

import (
	"fmt"
	"testing"
)

func TestSmoke2(t *testing.T) {
	for _, q := range []float64{250, 500, 1000, 2000} {
		cfg := DefaultConfig()
		cfg.Tide.S2Amplitude = 0
		cfg.River.Discharge = q
		cfg.Run.Duration = 40 * 86400
		cfg.Run.Courant = 0.8
		cfg.Geometry.Length = 150e3
		cfg.Geometry.Cells = 100
		cfg.Geometry.WidthConvergence = 60e3
		res, err := Run(cfg, nil)
		if err != nil {
			t.Fatal(err)
		}
		for _, ci := range []int{len(res.Cycles) - 20, len(res.Cycles) - 10, len(res.Cycles) - 1} {
			c := res.Cycles[ci]
			d := c.Diagnostics
			fmt.Printf("Q=%g t=%.1fd L=%.1fkm strat=%.3f Fr=%.3g M=%.3g %v steps=%d\n", q, c.Time/86400, d.IntrusionLength/1e3, d.MeanStratification, d.Regime.Froude, d.Regime.Mixing, d.Regime.Class, res.Steps)
		}
	}
}
