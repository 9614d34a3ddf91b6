// Package testrun holds the cut-down demo scenario that the tests of
// package scenario and its products share.
package testrun

import (
	"testing"

	"github.com/murk-optics/murk/scenario/demo"
	"github.com/murk-optics/murk/scenario/spec"
)

// SmallDemo is the demo scenario cut down for tests: 6 wavelengths, 20
// size bins, 40 cells, a 3-day spin-up and 4 hours of output.
func SmallDemo(t testing.TB) spec.Scenario {
	t.Helper()
	s, err := demo.Scenario()
	if err != nil {
		t.Fatal(err)
	}
	// 660, 700 and 860 nm: the demo's instruments sit on the grid.
	s.Mixture.Optics.Wavelengths = []float64{400e-9, 500e-9, 550e-9, 660e-9, 700e-9, 860e-9}
	s.Mixture.Optics.SizeBins = 20
	s.Estuary.Geometry.Cells = 40
	s.Estuary.Run.SpinUp = 3 * 86400
	s.Estuary.Run.Duration = 4 * 3600
	s.Estuary.Run.OutputInterval = 2 * 3600
	return s
}
