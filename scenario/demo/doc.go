// Package demo holds murk's embedded demonstration scenario: a partially
// mixed estuary in the fictional Quell estuary (river Quell, town
// Quellmouth), with mineral silt, organic detritus, diatoms and dynamic
// mud flocs. Every value in it is a demonstration value chosen inside
// published ranges, not a measurement (see the comments in quell.yaml).
//
// The resolution is chosen for a run of a couple of seconds: 80 cells of
// 1 km, an 11-day spin-up and two M2 tides of output, 21 wavelengths from
// 400 to 900 nm, 32 size bins per kernel and six VSF angles.
package demo

import (
	_ "embed"

	"github.com/murk-optics/murk/scenario/spec"
)

// Name is the file name the demo scenario is parsed under (it appears in
// error positions and resolves relative paths, of which it has none).
const Name = "quell.yaml"

//go:embed quell.yaml
var source []byte

// Source returns the YAML text of the demo scenario.
func Source() []byte { return append([]byte(nil), source...) }

// Scenario parses and validates the demo scenario.
func Scenario() (spec.Scenario, error) { return spec.Parse(Name, source) }
