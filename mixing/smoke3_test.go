package mixing

import (
	"fmt"
	"testing"
)

func TestSmoke3(t *testing.T) {
	for _, ws := range []float64{2e-4, 5e-4, 1e-3} {
		cfg := DefaultConfig()
		cfg.Tide.S2Amplitude = 0
		cfg.River.Discharge = 500
		cfg.Run.Duration = 40 * 86400
		cfg.Run.Courant = 0.8
		cfg.Geometry.Length = 150e3
		cfg.Geometry.Cells = 100
		cfg.Geometry.WidthConvergence = 60e3
		cfg.Sediment = []Class{{Name: "mud", RatingA: 0.02, Ocean: 0.01, BedInventory: 0, ErosionRate: 1e-4, CriticalErosion: 0.15}}
		res, err := Run(cfg, ConstantSettling{ws})
		if err != nil {
			t.Fatal(err)
		}
		for _, ci := range []int{len(res.Cycles) - 20, len(res.Cycles) - 1} {
			c := res.Cycles[ci]
			d := c.Diagnostics
			fmt.Printf("ws=%g t=%.1fd L=%.1fkm strat=%.3f ETM x=%.1f peak=%.3f sb=%.2f\n", ws, c.Time/86400, d.IntrusionLength/1e3, d.MeanStratification, d.ETMPosition/1e3, d.ETMPeak, d.ETMBottomSalinity)
		}
		c := res.Cycles[len(res.Cycles)-1]
		for i := 0; i < len(res.X); i += 5 {
			fmt.Printf("x=%5.1f s=%.2f/%.2f C=%.4f/%.4f bed=%.2f tau=%.2f\n", res.X[i]/1e3, c.Salinity[0][i], c.Salinity[1][i], c.Concentration[0][0][i], c.Concentration[1][0][i], c.BedMass[0][i], 0.0)
		}
	}
}
