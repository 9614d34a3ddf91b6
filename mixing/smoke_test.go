package mixing

import (
	"fmt"
	"testing"
	"time"
)

func TestSmoke(t *testing.T) {
	cfg := DefaultConfig()
	cfg.Sediment = []Class{{Name: "mud", RatingA: 0.02, Ocean: 0.01, BedInventory: 5, ErosionRate: 1e-4, CriticalErosion: 0.2}}
	t0 := time.Now()
	res, err := Run(cfg, ConstantSettling{5e-4})
	if err != nil {
		t.Fatal(err)
	}
	fmt.Println("elapsed", time.Since(t0), "steps", res.Steps, "cycles", len(res.Cycles))
	for ci, c := range res.Cycles {
		if ci%6 != 0 && ci != len(res.Cycles)-1 {
			continue
		}
		d := c.Diagnostics
		fmt.Printf("t=%.1fd L=%.1fkm strat=%.3f Fr=%.3g M=%.3g %v ETM x=%.1fkm peak=%.3f sb=%.2f UT=%.2f\n", c.Time/86400, d.IntrusionLength/1e3, d.MeanStratification, d.Regime.Froude, d.Regime.Mixing, d.Regime.Class, d.ETMPosition/1e3, d.ETMPeak, d.ETMBottomSalinity, c.TidalVelocity)
	}
	c := res.Cycles[len(res.Cycles)-1]
	for i := 0; i < len(res.X); i += 5 {
		fmt.Printf("x=%5.1f h1=%.2f s=%.2f/%.2f u=%.3f/%.3f G=%.1f/%.1f C=%.4f/%.4f bed=%.2f Q=%.1f/%.1f\n", res.X[i]/1e3, c.Thickness[0][i], c.Salinity[0][i], c.Salinity[1][i], c.Velocity[0][i], c.Velocity[1][i], c.ShearRate[0][i], c.ShearRate[1][i], c.Concentration[0][0][i], c.Concentration[1][0][i], c.BedMass[0][i], c.Transport[0][i], c.Transport[1][i])
	}
}
