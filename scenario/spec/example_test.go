package spec_test

import (
	"errors"
	"fmt"

	"github.com/murk-optics/murk/scenario/spec"
)

const smallEstuary = `
geometry: {length: "40 km", cells: 80, width: "500 m", depth: "6 m"}
river: {discharge: "80 m3/s", temperature: "14 degC"}
tide: {m2: {range: "2.4 m"}}
ocean: {salinity: "32 PSU", temperature: "13 degC"}
run: {duration: "5 day", output_interval: "30 min", stations: ["5 km", "20 km"]}
`

// Parse an estuary document: values come back in SI units.
func ExampleParseEstuary() {
	e, err := spec.ParseEstuary("small.yaml", []byte(smallEstuary))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("length %.0f m, %d cells, depth %.0f m\n", e.Geometry.Length, e.Geometry.Cells, e.Geometry.Depth)
	fmt.Printf("M2 amplitude %.2f m, period %.4f h\n", e.Tide.M2.Amplitude, e.Tide.M2.Period/3600)
	fmt.Printf("run %.0f s, outputs every %.0f s, stations %v m\n", e.Run.Duration, e.Run.OutputInterval, e.Run.Stations)
	// Output:
	// length 40000 m, 80 cells, depth 6 m
	// M2 amplitude 1.20 m, period 12.4206 h
	// run 432000 s, outputs every 1800 s, stations [5000 20000] m
}

// A rejected document returns every problem with its position, field path,
// value and allowed range.
func ExampleErrorList() {
	bad := `
geometry: {length: "40 km", cells: 80, width: "500 m", depth: "-6 m"}
river: {discharge: "80 m3/s", temperature: "14 C"}
ocean: {salinity: "32 PSU", temperature: "13 degC"}
run: {duration: "5 day", output_interval: "30 min", stations: ["45 km"]}
`
	_, err := spec.ParseEstuary("bad.yaml", []byte(bad))
	var list spec.ErrorList
	if errors.As(err, &list) {
		for _, e := range list {
			fmt.Println(e)
		}
	}
	// Output:
	// bad.yaml:2:63: geometry.depth: value "-6 m": out of range (allowed: 0.1 m ≤ value ≤ 1000 m)
	// bad.yaml:3:44: river.temperature: value "14 C": unknown unit "C"; allowed units: degC, K (allowed: -2 degC ≤ value ≤ 40 degC)
	// bad.yaml:5:64: run.stations[0]: value "45 km": station beyond the head of the channel (allowed: 0 km ≤ value ≤ geometry.length = 40 km)
}

func ExampleParseQuantity() {
	v, err := spec.ParseQuantity("50 mg/L", "mass concentration")
	fmt.Println(v, "kg/m3", err)
	_, err = spec.ParseQuantity("25", "length")
	fmt.Println(err)
	// Output:
	// 0.05 kg/m3 <nil>
	// missing unit; allowed units: m, km
}

func ExampleEstimateEstuary() {
	e, err := spec.ParseEstuary("small.yaml", []byte(smallEstuary))
	if err != nil {
		fmt.Println(err)
		return
	}
	c := spec.EstimateEstuary(e)
	fmt.Printf("%d cells × %d layers, Δt ≈ %.0f s, %d output times\n", c.Cells, c.Layers, c.TimeStep, c.Outputs)
	// Output:
	// 80 cells × 2 layers, Δt ≈ 258 s, 241 output times
}
