package mixing_test

import (
	"fmt"
	"log"

	"github.com/murk-optics/murk/mixing"
)

// The fictional Quell estuary: 60 km from Quellmouth to the tidal limit,
// 8 m deep, 1.5 km wide at the mouth, a 1.2 m M2 tide, 300 m³/s of river
// water and one mud class settling at 0.5 mm/s from a uniform 10 kg/m² bed.
func Example() {
	cfg := mixing.DefaultConfig()
	cfg.Geometry = mixing.Geometry{Length: 60e3, MouthWidth: 1500, WidthConvergence: 30e3, Depth: 8, Cells: 60}
	cfg.River.Discharge = 300
	cfg.Tide = mixing.Tide{M2Amplitude: 1.2}
	cfg.Ocean = mixing.Ocean{Salinity: 33, Temperature: 10}
	cfg.Run.Duration = 30 * 86400
	cfg.Sediment = []mixing.Class{{
		Name: "mud", RatingA: 0.03, Ocean: 0.01,
		ErosionRate: 1e-4, CriticalErosion: 0.15, BedInventory: 10,
	}}
	res, err := mixing.Run(cfg, mixing.ConstantSettling{5e-4})
	if err != nil {
		log.Fatal(err)
	}
	last := res.Cycles[len(res.Cycles)-1] // mean over the last M2 cycle
	d := last.Diagnostics
	fmt.Printf("regime: %v (Fr_f = %.3f, M = %.2f)\n", d.Regime.Class, d.Regime.Froude, d.Regime.Mixing)
	fmt.Printf("salt intrusion (2 PSU at the bed): %.0f km\n", d.IntrusionLength/1e3)
	fmt.Printf("turbidity maximum: %.1f km from Quellmouth, %.0f mg/L, bottom salinity %.0f PSU\n", d.ETMPosition/1e3, d.ETMPeak*1e3, d.ETMBottomSalinity)
	// Output:
	// regime: partially mixed (Fr_f = 0.018, M = 0.69)
	// salt intrusion (2 PSU at the bed): 30 km
	// turbidity maximum: 18.5 km from Quellmouth, 88 mg/L, bottom salinity 15 PSU
}
