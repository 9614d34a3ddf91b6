package demo

import (
	"testing"

	"github.com/murk-optics/murk/scenario/spec"
)

// The embedded scenario must pass the scenario validator (an outside
// check: package spec is the format's definition).
func TestScenarioValid(t *testing.T) {
	s, err := Scenario()
	if err != nil {
		t.Fatal(err)
	}
	if s.Estuary.Geometry.Cells != 80 || len(s.Mixture.Populations) != 4 {
		t.Errorf("demo scenario: %d cells, %d populations; want 80 and 4", s.Estuary.Geometry.Cells, len(s.Mixture.Populations))
	}
	if s.Mixture.Populations[3].Kind != spec.KindFloc || !s.Mixture.Populations[3].Floc.Dynamic {
		t.Errorf("demo scenario: fourth population is %s (dynamic %v); want dynamic flocs", s.Mixture.Populations[3].Kind, s.Mixture.Populations[3].Floc.Dynamic)
	}
}
