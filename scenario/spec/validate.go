package spec

import (
	"fmt"
	"math"
)

// crossEstuary checks relations between the estuary sections. Each check
// runs only when the values it needs decoded cleanly, so that one bad value
// gives one error, not a cascade.
func (d *decoder) crossEstuary(e *Estuary) {
	g := e.Geometry
	// A geometry table must reach the head.
	if g.Shape == ShapeTable && g.Length > 0 && len(g.Table) >= 2 {
		last := g.Table[len(g.Table)-1]
		if last.Distance > 0 && last.Distance < g.Length {
			d.addAt(index("geometry.table", len(g.Table)-1)+".distance", "the table ends before the head of the channel",
				"at least geometry.length = "+formatIn(g.Length, kDistance))
		}
	}
	// River discharge series must cover the whole run.
	q := e.River.Discharge
	if !q.IsConstant() && len(q.Times) >= 2 && e.Run.Duration > 0 {
		end := e.Run.End()
		if q.Times[0] > 0 {
			d.addAt("river.discharge.series[0].time", "the series starts after the run does",
				"at most 0 day (the start of spin-up)")
		}
		if last := q.Times[len(q.Times)-1]; last < end {
			d.addAt(index("river.discharge.series", len(q.Times)-1)+".time", "the series ends before the run does",
				"at least spin_up + duration = "+formatIn(end, kTime))
		}
	}
	// An estuary needs something to move the water.
	tidal := e.Tide.M2.Present() || e.Tide.S2.Present()
	if len(q.Values) > 0 && q.Max() == 0 && !tidal && d.pos["river.discharge"] != nil {
		d.addAt("river.discharge", "zero river discharge with no tide: nothing moves the water",
			"discharge greater than 0 m3/s, or a tide section with a non-zero M2")
	}
	// The tide must not dry the mouth.
	if tidal && g.Length > 0 {
		_, h0 := g.At(0)
		amp := e.Tide.M2.Amplitude + e.Tide.S2.Amplitude
		if h0 > 0 && amp >= h0 {
			path := "tide.m2.range"
			if e.Tide.M2.Amplitude == 0 {
				path = "tide.s2.range"
			}
			d.addAt(path, fmt.Sprintf("the tidal amplitude (M2+S2: %s) reaches the depth at the mouth, so the channel would dry",
				formatIn(amp, kTideHeight)), "M2+S2 amplitude (half the range) less than the depth at the mouth = "+formatIn(h0, kDepth))
		}
	}
	// Output interval within the run.
	if e.Run.Duration > 0 && e.Run.OutputInterval > e.Run.Duration {
		d.addAt("run.output_interval", "the output interval is longer than the run",
			"0 < value ≤ run.duration = "+formatIn(e.Run.Duration, kTime))
	}
	// Floc settling needs a floc population, which only a full scenario has.
	if d.kind == docEstuary {
		for i, c := range e.Classes {
			if c.Settling == SettlingFloc {
				d.addAt(index("sediment_classes", i)+".settling_velocity",
					"floc settling needs a floc population, which an estuary document cannot hold",
					"a settling velocity such as \"0.5 mm/s\" (floc only in a full scenario)")
			}
		}
	}
}

// crossMixture checks relations inside the mixture sections.
func (d *decoder) crossMixture(m *Mixture) {
	ws := m.Optics.Wavelengths
	if len(ws) == 0 {
		return
	}
	if _, inc := increasing(ws); !inc {
		return
	}
	lo, hi := ws[0], ws[len(ws)-1]
	span := formatIn(lo, kWavelength) + " … " + formatIn(hi, kWavelength)
	for i, ins := range m.Optics.Instruments {
		if ins.Wavelength == 0 {
			continue
		}
		if ins.Wavelength < lo || ins.Wavelength > hi {
			p := index("optics.instruments", i) + ".wavelength"
			if ins.Kind == Turbidity {
				p = index("optics.instruments", i) + ".kind"
			}
			d.addAt(p, fmt.Sprintf("instrument wavelength %s lies outside the optics wavelengths", formatIn(ins.Wavelength, kWavelength)),
				"within optics.wavelengths "+span)
		}
	}
	check := func(path string, ri RefractiveIndex) {
		if ri.Model == IndexSmooth && ri.WavelengthRef > 0 && ri.CauchyB != 0 {
			// the Cauchy term must not carry n out of range at any wavelength
			for _, l := range []float64{lo, hi} {
				if n, _ := ri.At(l); !indexRealRange.contains(n) {
					d.addAt(path+".cauchy_b", fmt.Sprintf("gives n = %.4g at %s", n, formatIn(l, kWavelength)),
						"n within "+indexRealRange.describe(nil)+" at every optics wavelength")
					return
				}
			}
		}
		if ri.Model != IndexTable || len(ri.Wavelengths) < 2 {
			return
		}
		if _, inc := increasing(ri.Wavelengths); !inc {
			return
		}
		if ri.Wavelengths[0] > lo || ri.Wavelengths[len(ri.Wavelengths)-1] < hi {
			d.addAt(path+".table", fmt.Sprintf("the table spans %s … %s but the optics wavelengths need %s",
				formatIn(ri.Wavelengths[0], kWavelength), formatIn(ri.Wavelengths[len(ri.Wavelengths)-1], kWavelength), span),
				"a table covering "+span)
		}
	}
	for i, p := range m.Populations {
		path := index("populations", i)
		check(path+".refractive_index", p.Index)
		if p.Cell.Structure == CellCoated {
			check(path+".cell.shell_index", p.Cell.Shell)
		}
	}
}

// crossFull checks relations between the estuary and mixture halves.
func (d *decoder) crossFull(s *Scenario) {
	s.Mixture.Water.OceanSalinity = s.Estuary.Ocean.Salinity
	classes := s.Estuary.Classes
	sum := make([]float64, len(classes))
	flocs := make([]int, len(classes))
	for _, p := range s.Mixture.Populations {
		if p.ClassIndex >= 0 {
			sum[p.ClassIndex] += p.ClassFraction
			if p.Kind == KindFloc {
				flocs[p.ClassIndex]++
			}
		}
	}
	// rounding slack for fractions such as 0.7 + 0.2 + 0.1
	const fractionSlack = 1e-9
	for i, c := range classes {
		if sum[i] > 1+fractionSlack {
			// report at the last population riding on the class
			for j := len(s.Mixture.Populations) - 1; j >= 0; j-- {
				if s.Mixture.Populations[j].ClassIndex == i {
					path := index("populations", j) + ".class_fraction"
					if d.pos[path] == nil {
						path = index("populations", j) + ".class"
					}
					d.addAt(path, fmt.Sprintf("the populations riding on class %s carry %.6g of its mass", c.Name, sum[i]),
						"class fractions on one class summing to at most 1")
					break
				}
			}
		}
		if c.Settling == SettlingFloc && flocs[i] != 1 {
			d.addAt(index("sediment_classes", i)+".settling_velocity",
				fmt.Sprintf("floc settling needs exactly one floc population riding on class %s; found %d", c.Name, flocs[i]),
				"one population with kind: floc and class: "+c.Name)
		}
	}
	// Particle sizes the optics can treat: the sphere solver's size
	// parameter x = π·D·n_water/λ is limited to 2e4 (package mie contract);
	// n_water ≤ 1.35 over 400–900 nm (Quan & Fry 1995, from memory).
	if ws := s.Mixture.Optics.Wavelengths; len(ws) > 0 {
		dLimit := 2e4 * ws[0] / (math.Pi * 1.35)
		for i, p := range s.Mixture.Populations {
			if p.Kind == KindFloc {
				continue // aggregates are not solved as one solid sphere
			}
			var dmax float64
			var what string
			switch p.Size.Kind {
			case SizeJunge:
				dmax, what = p.Size.DMax, "size.dmax"
			default:
				continue
			}
			if dmax > dLimit {
				d.addAt(join(index("populations", i), what), "too large for the sphere optics at the shortest wavelength",
					"at most "+formatIn(dLimit, kDiameter))
			}
		}
	}
}
