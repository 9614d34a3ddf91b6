package scenario_test

import (
	"context"
	"fmt"
	"log"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/demo"
	"github.com/murk-optics/murk/scenario/spec"
)

// Output times run from the end of the spin-up to the end of the run.
func ExampleOutputTimes() {
	r := spec.Run{SpinUp: 2 * 86400, Duration: 6 * 3600, OutputInterval: 2 * 3600}
	for _, t := range scenario.OutputTimes(r) {
		fmt.Printf("%.0f h\n", t/3600)
	}
	// Output:
	// 48 h
	// 50 h
	// 52 h
	// 54 h
}

// The embedded demo, run at reduced optical resolution: the estuary's
// regime, and where its turbidity maximum lies against the salt limit.
func ExampleRun() {
	s, err := demo.Scenario()
	if err != nil {
		log.Fatal(err)
	}
	s.Mixture.Optics.Wavelengths = []float64{450e-9, 550e-9, 650e-9}
	s.Mixture.Optics.SizeBins = 16
	r, err := scenario.Run(context.Background(), s, scenario.Options{})
	if err != nil {
		log.Fatal(err)
	}
	sum := r.Summary
	fmt.Println("regime:", sum.Regime.Class)
	fmt.Println("turbidity maximum inside the salt intrusion:", sum.ETMPosition < sum.IntrusionLength)
	fmt.Println("flocs larger there than in the river:", sum.ETMFlocDiameter > sum.RiverFlocDiameter)
	fmt.Println("components:", len(r.Components))
	// Output:
	// regime: partially mixed
	// turbidity maximum inside the salt intrusion: true
	// flocs larger there than in the river: true
	// components: 6
}
