package spec

import (
	"fmt"
	"math"
	"os"
	"path/filepath"

	"gopkg.in/yaml.v3"

	"github.com/murk-optics/murk/mie/psd"
)

// Defaults of the mixture sections (documented in doc.go).
const (
	defaultCDOMReference = 440e-9   // m; common practice (a_g reported at 440 nm)
	defaultCDOMSlope     = 0.0176e9 // 1/m; Babin et al. (2003) mean, 0.0176 nm⁻¹
	defaultOceanSalinity = 35       // mixture documents only; common practice (open-ocean surface)
	defaultSizeBins      = 200
)

// defaultAngles are 90°, 100°, …, 170° (Sullivan et al. 2013 χ_p table).
func defaultAngles() []float64 {
	var a []float64
	for deg := 90; deg <= 170; deg += 10 {
		a = append(a, float64(deg)*math.Pi/180)
	}
	return a
}

// wavelengthRange is where murk has water optics: the embedded pure-water
// absorption table spans 400–900 nm (Pope & Fry 1997; Segelstein 1981).
var wavelengthRange = closed(400e-9, 900e-9)

func (d *decoder) mixture(top *object, s *Scenario, kind docKind) {
	m := &s.Mixture
	if n := top.get("water"); n != nil {
		m.Water = d.water(n, "water", kind)
	} else {
		m.Water = Water{CDOM: CDOM{ReferenceWavelength: defaultCDOMReference, Slope: defaultCDOMSlope}, OceanSalinity: defaultOceanSalinity}
		if kind == docMixture {
			top.missing("water", "salinity and temperature of the sample")
		}
	}
	if n := top.req("optics", "wavelengths, and optionally angles, instruments, size_bins"); n != nil {
		m.Optics = d.optics(n, "optics")
	}
	if n := top.get("populations"); n != nil {
		m.Populations = d.populations(n, "populations", kind, s.Estuary.Classes)
	}
	d.crossMixture(m)
}

// ---- water -------------------------------------------------------------------

func (d *decoder) water(n *yaml.Node, path string, kind docKind) Water {
	o := d.object(n, path, "salinity", "temperature", "ocean_salinity", "cdom", "chlorophyll")
	w := Water{CDOM: CDOM{ReferenceWavelength: defaultCDOMReference, Slope: defaultCDOMSlope}, OceanSalinity: defaultOceanSalinity}
	if kind == docMixture {
		w.HasState = true
		w.Salinity, _ = d.quantity(o.req("salinity", "a salinity such as \"20 PSU\""), o.at("salinity"), kSalinity, closed(0, 42))
		w.Temperature, _ = d.quantity(o.req("temperature", "a temperature such as \"12 degC\""), o.at("temperature"), kTemperature, closed(-2, 40))
		if sn := o.get("ocean_salinity"); sn != nil {
			w.OceanSalinity, _ = d.quantity(sn, o.at("ocean_salinity"), kSalinity, openLo(0, 42))
		}
	} else {
		for _, k := range []string{"salinity", "temperature", "ocean_salinity"} {
			if o.has(k) {
				d.add(keyNode(n, k), o.at(k), "", "set by the estuary model in a full scenario (ocean and river sections); remove it",
					"only in a mixture document")
			}
		}
	}
	if cn := o.get("cdom"); cn != nil {
		co := d.object(cn, o.at("cdom"), "reference_wavelength", "river", "ocean", "slope")
		if rn := co.get("reference_wavelength"); rn != nil {
			w.CDOM.ReferenceWavelength, _ = d.quantity(rn, co.at("reference_wavelength"), kWavelength, closed(300e-9, 800e-9))
		}
		w.CDOM.Absorption.River, _ = d.quantity(co.req("river", "an absorption such as \"1.2 1/m\""), co.at("river"), kAbsorption, closed(0, 100))
		w.CDOM.Absorption.Ocean, _ = d.quantity(co.req("ocean", "an absorption such as \"0.05 1/m\""), co.at("ocean"), kAbsorption, closed(0, 100))
		if sn := co.get("slope"); sn != nil {
			w.CDOM.Slope, _ = d.quantity(sn, co.at("slope"), kSlope, closed(0.005e9, 0.04e9))
		}
	}
	if cn := o.get("chlorophyll"); cn != nil {
		co := d.object(cn, o.at("chlorophyll"), "river", "ocean")
		w.Chlorophyll.River, _ = d.quantity(co.req("river", "a concentration such as \"3 mg/m3\""), co.at("river"), kChl, closed(0, 1e-3))
		w.Chlorophyll.Ocean, _ = d.quantity(co.req("ocean", "a concentration such as \"1 mg/m3\""), co.at("ocean"), kChl, closed(0, 1e-3))
	}
	return w
}

// ---- optics --------------------------------------------------------------------

func (d *decoder) optics(n *yaml.Node, path string) Optics {
	o := d.object(n, path, "wavelengths", "angles", "instruments", "size_bins")
	op := Optics{SizeBins: defaultSizeBins}
	if wn := o.req("wavelengths", "a list such as [\"440 nm\", \"550 nm\"] or {from, to, step}"); wn != nil {
		op.Wavelengths = d.wavelengths(wn, o.at("wavelengths"))
	}
	if an := o.get("angles"); an != nil {
		items := d.list(an, o.at("angles"), 1, "angles")
		ok := true
		for i, it := range items {
			a, good := d.quantity(it, index(o.at("angles"), i), kAngle, interval{lo: 0, hi: math.Pi, loOpen: true})
			ok = ok && good
			op.Angles = append(op.Angles, a)
		}
		if ok {
			if i, inc := increasing(op.Angles); !inc {
				d.addAt(index(o.at("angles"), i), "angles must increase strictly", "greater than "+formatIn(op.Angles[i-1], kAngle))
			}
		}
	} else {
		op.Angles = defaultAngles()
	}
	if bn := o.get("size_bins"); bn != nil {
		op.SizeBins, _ = d.integer(bn, o.at("size_bins"), 10, 2000)
	}
	if in := o.get("instruments"); in != nil {
		op.Instruments = d.instruments(in, o.at("instruments"))
	}
	return op
}

func (d *decoder) wavelengths(n *yaml.Node, path string) []float64 {
	var out []float64
	if n.Kind == yaml.MappingNode {
		o := d.object(n, path, "from", "to", "step")
		from, ok1 := d.quantity(o.req("from", "a wavelength such as \"400 nm\""), o.at("from"), kWavelength, wavelengthRange)
		to, ok2 := d.quantity(o.req("to", "a wavelength such as \"900 nm\""), o.at("to"), kWavelength, wavelengthRange)
		step, ok3 := d.quantity(o.req("step", "a wavelength step such as \"10 nm\""), o.at("step"), kWavelength, closed(0.1e-9, 500e-9))
		if !(ok1 && ok2 && ok3) {
			return nil
		}
		if to <= from {
			d.addAt(o.at("to"), "the range is empty", "greater than from = "+formatIn(from, kWavelength))
			return nil
		}
		count := math.Floor((to-from)/step+1e-9) + 1
		if count > 1000 {
			d.addAt(o.at("step"), fmt.Sprintf("gives %.0f wavelengths", count), "at most 1000 wavelengths")
			return nil
		}
		for i := 0; i < int(count); i++ {
			// round to 1 fm so that 400 nm + 50·10 nm is exactly 900e-9
			out = append(out, math.Round((from+float64(i)*step)*1e15)/1e15)
		}
		return out
	}
	items := d.list(n, path, 1, "wavelengths")
	if len(items) > 1000 {
		d.add(n, path, "", fmt.Sprintf("%d wavelengths", len(items)), "at most 1000 wavelengths")
		return nil
	}
	ok := true
	for i, it := range items {
		w, good := d.quantity(it, index(path, i), kWavelength, wavelengthRange)
		ok = ok && good
		out = append(out, w)
	}
	if ok {
		if i, inc := increasing(out); !inc {
			d.addAt(index(path, i), "wavelengths must increase strictly", "greater than "+formatIn(out[i-1], kWavelength))
		}
	}
	return out
}

func (d *decoder) instruments(n *yaml.Node, path string) []Instrument {
	items := d.list(n, path, 0, "instruments")
	var out []Instrument
	seen := map[string]bool{}
	for i, it := range items {
		p := index(path, i)
		o := d.object(it, p, "name", "kind", "wavelength", "angle", "path_length", "acceptance_angle")
		var ins Instrument
		if nn := o.req("name", "a name such as ctd_bb"); nn != nil {
			if name, ok := d.name(nn, o.at("name")); ok {
				if seen[name] {
					d.add(nn, o.at("name"), name, "instrument name used twice", "unique names")
				}
				seen[name] = true
				ins.Name = name
			}
		}
		kn := o.req("kind", "transmissometer, backscatter, turbidity")
		if kn == nil {
			continue
		}
		k, ok := d.choice(kn, o.at("kind"), string(Transmissometer), string(Backscatter), string(Turbidity))
		if !ok {
			continue
		}
		ins.Kind = InstrumentKind(k)
		want := map[InstrumentKind][]string{
			Transmissometer: {"wavelength", "path_length", "acceptance_angle"},
			Backscatter:     {"wavelength", "angle"},
			Turbidity:       {},
		}[ins.Kind]
		for _, key := range []string{"wavelength", "angle", "path_length", "acceptance_angle"} {
			if o.has(key) && !contains(want, key) {
				d.add(keyNode(it, key), o.at(key), "", "does not apply to a "+k+" instrument", "keys name, kind"+prefixList(want))
			}
		}
		if ins.Kind == Turbidity {
			// ISO 7027-1:2016: 860 nm source, detection at 90°.
			ins.Wavelength, ins.Angle = 860e-9, math.Pi/2
		} else {
			ins.Wavelength, _ = d.quantity(o.req("wavelength", "a wavelength such as \"650 nm\""), o.at("wavelength"), kWavelength, wavelengthRange)
		}
		switch ins.Kind {
		case Transmissometer:
			ins.PathLength, _ = d.quantity(o.req("path_length", "a length such as \"25 cm\""), o.at("path_length"),
				kind{"path length", []string{"m", "cm", "mm"}, "cm"}, closed(1e-3, 10))
			ins.AcceptanceAngle, _ = d.quantity(o.req("acceptance_angle", "an angle such as \"1.2 deg\""), o.at("acceptance_angle"),
				kAngle, openLo(0, 30*math.Pi/180))
		case Backscatter:
			ins.Angle, _ = d.quantity(o.req("angle", "an angle such as \"124 deg\""), o.at("angle"), kAngle, closed(math.Pi/2, math.Pi))
		}
		out = append(out, ins)
	}
	return out
}

func prefixList(keys []string) string {
	s := ""
	for _, k := range keys {
		s += ", " + k
	}
	return s
}

// ---- populations ------------------------------------------------------------------

var popKeys = []string{"name", "kind", "composition", "density", "refractive_index", "size",
	"concentration", "class", "class_fraction", "floc", "cell"}

func (d *decoder) populations(n *yaml.Node, path string, kind docKind, classes []SedimentClass) []Population {
	items := d.list(n, path, 0, "populations")
	var out []Population
	seen := map[string]bool{}
	for i, it := range items {
		p := index(path, i)
		o := d.object(it, p, popKeys...)
		pop := Population{ClassIndex: -1}
		if nn := o.req("name", "a name such as silt"); nn != nil {
			if name, ok := d.name(nn, o.at("name")); ok {
				if seen[name] {
					d.add(nn, o.at("name"), name, "population name used twice", "unique names")
				}
				seen[name] = true
				pop.Name = name
			}
		}
		if kn := o.req("kind", "mineral, organic, phytoplankton, floc"); kn != nil {
			k, _ := d.choice(kn, o.at("kind"), string(KindMineral), string(KindOrganic), string(KindPhytoplankton), string(KindFloc))
			pop.Kind = PopulationKind(k)
		}
		if cn := o.get("composition"); cn != nil {
			pop.Composition, _ = d.text(cn, o.at("composition"))
		}
		pop.Density, _ = d.quantity(o.req("density", "a density such as \"2650 kg/m3\""), o.at("density"), kDensity, closed(800, 6000))
		if rn := o.req("refractive_index", "{model: constant|table|smooth, relative_to: water|vacuum, ...}"); rn != nil {
			pop.Index = d.index(rn, o.at("refractive_index"))
		}
		if sn := o.req("size", "{kind: junge|lognormal|table, ...}"); sn != nil {
			pop.Size = d.size(sn, o.at("size"))
		}
		d.placement(o, &pop, kind, classes)
		// kind-specific sub-sections
		if fn := o.get("floc"); fn != nil {
			if pop.Kind != KindFloc && pop.Kind != "" {
				d.add(keyNode(it, "floc"), o.at("floc"), "", "floc parameters apply only to kind floc", "kind: floc")
			} else {
				pop.Floc = d.floc(fn, o.at("floc"), kind)
			}
		} else if pop.Kind == KindFloc {
			o.missing("floc", "{primary_size, fractal_dimension, optics}")
		}
		if cn := o.get("cell"); cn != nil {
			if pop.Kind != KindPhytoplankton && pop.Kind != "" {
				d.add(keyNode(it, "cell"), o.at("cell"), "", "cell parameters apply only to kind phytoplankton", "kind: phytoplankton")
			} else {
				pop.Cell = d.cell(cn, o.at("cell"))
			}
		} else if pop.Kind == KindPhytoplankton {
			pop.Cell.Structure = CellHomogeneous
		}
		if pop.Kind == KindFloc {
			d.flocSize(p, &pop)
		}
		out = append(out, pop)
	}
	return out
}

// placement reads concentration, class and class_fraction.
func (d *decoder) placement(o *object, pop *Population, kind docKind, classes []SedimentClass) {
	hasC, hasK := o.has("concentration"), o.has("class")
	switch {
	case kind == docMixture && hasK:
		d.add(keyNode(o.n, "class"), o.at("class"), "", "a mixture document has no sediment classes; give a concentration", "concentration")
	case hasC && hasK:
		d.add(keyNode(o.n, "class"), o.at("class"), "", "give either a concentration (uniform) or a class to ride on, not both", "concentration or class")
	case !hasC && !hasK:
		if kind == docMixture {
			o.missing("concentration", "a concentration such as \"20 g/m3\", \"5 µL/L\" or \"1e4 1/mL\"")
		} else {
			o.missing("concentration", "a concentration, or class: the sediment class it rides on")
		}
	}
	if hasC {
		pop.Concentration = d.concentration(o.get("concentration"), o.at("concentration"))
	}
	if hasK && kind != docMixture {
		kn := o.get("class")
		if name, ok := d.name(kn, o.at("class")); ok {
			for i, c := range classes {
				if c.Name == name {
					pop.Class, pop.ClassIndex = name, i
				}
			}
			if pop.ClassIndex < 0 {
				d.add(kn, o.at("class"), name, "no sediment class of that name", "one of: "+listOrNone(classNames(classes)))
			}
		}
		pop.ClassFraction = 1
		if fn := o.get("class_fraction"); fn != nil {
			pop.ClassFraction, _ = d.number(fn, o.at("class_fraction"), openLo(0, 1))
		}
	} else if fn := o.get("class_fraction"); fn != nil {
		d.add(keyNode(o.n, "class_fraction"), o.at("class_fraction"), "", "class_fraction needs a class", "only with class")
	}
}

func listOrNone(xs []string) string {
	if len(xs) == 0 {
		return "(none defined under sediment_classes)"
	}
	s := ""
	for i, x := range xs {
		if i > 0 {
			s += ", "
		}
		s += x
	}
	return s
}

// Concentration ranges by basis. Upper limits: 100 kg/m³ is fluid mud
// (common practice: suspensions above some tens of g/L behave as a bed),
// far beyond where single-scattering optics holds; the volume and number
// limits are the same order for silt-sized particles.
var (
	massConcRange   = closed(0, 100)
	volumeConcRange = closed(0, 0.05)
	numberConcRange = closed(0, 1e18)
)

func (d *decoder) concentration(n *yaml.Node, path string) Concentration {
	v, u, ok := d.quantityUnit(n, path, kConcentration, interval{lo: math.Inf(-1), hi: math.Inf(1)})
	if !ok {
		return Concentration{}
	}
	var c Concentration
	var r interval
	var k kind
	switch u.d {
	case dimDensity:
		c.Basis, r, k = ByMass, massConcRange, kMassConc
	case dimNone:
		c.Basis, r, k = ByVolume, volumeConcRange, kind{"volume concentration", []string{"µL/L"}, "µL/L"}
	default:
		c.Basis, r, k = ByNumber, numberConcRange, kind{"number concentration", []string{"1/mL"}, "1/mL"}
	}
	if !r.contains(v) {
		d.add(n, path, n.Value, "out of range", r.describe(&k))
		return Concentration{}
	}
	c.Value = v
	return c
}

// index reads a refractive index.
func (d *decoder) index(n *yaml.Node, path string) RefractiveIndex {
	o := d.object(n, path, "model", "relative_to", "n", "k", "table",
		"wavelength_ref", "cauchy_b", "k_ref", "k_slope", "k_floor")
	var ri RefractiveIndex
	if rn := o.req("relative_to", "water or vacuum"); rn != nil {
		m, _ := d.choice(rn, o.at("relative_to"), string(RelativeToWater), string(RelativeToVacuum))
		ri.RelativeTo = Medium(m)
	}
	mn := o.req("model", "constant, table, smooth")
	if mn == nil {
		return ri
	}
	m, ok := d.choice(mn, o.at("model"), string(IndexConstant), string(IndexTable), string(IndexSmooth))
	if !ok {
		return ri
	}
	ri.Model = IndexModel(m)
	want := map[IndexModel][]string{
		IndexConstant: {"n", "k"},
		IndexTable:    {"table"},
		IndexSmooth:   {"n", "wavelength_ref", "cauchy_b", "k_ref", "k_slope", "k_floor"},
	}[ri.Model]
	for _, key := range []string{"n", "k", "table", "wavelength_ref", "cauchy_b", "k_ref", "k_slope", "k_floor"} {
		if o.has(key) && !contains(want, key) {
			d.add(keyNode(n, key), o.at(key), "", "does not apply to model "+m, "keys model, relative_to"+prefixList(want))
		}
	}
	switch ri.Model {
	case IndexConstant:
		ri.N, _ = d.number(o.req("n", "real part 0.5 ≤ value ≤ 3.5"), o.at("n"), indexRealRange)
		if kn := o.get("k"); kn != nil {
			ri.K, _ = d.number(kn, o.at("k"), indexImagRange)
		}
	case IndexSmooth:
		ri.N, _ = d.number(o.req("n", "real part 0.5 ≤ value ≤ 3.5"), o.at("n"), indexRealRange)
		ri.WavelengthRef, _ = d.quantity(o.req("wavelength_ref", "a wavelength such as \"440 nm\""), o.at("wavelength_ref"), kWavelength, closed(300e-9, 1000e-9))
		if bn := o.get("cauchy_b"); bn != nil {
			ri.CauchyB, _ = d.quantity(bn, o.at("cauchy_b"), kCauchy, closed(-0.1e-12, 0.1e-12))
		}
		ri.KRef, _ = d.number(o.req("k_ref", "imaginary part at wavelength_ref, 0 ≤ value ≤ 10"), o.at("k_ref"), indexImagRange)
		ri.KSlope, _ = d.quantity(o.req("k_slope", "a spectral slope such as \"0.011 1/nm\""), o.at("k_slope"), kSlope, closed(0, 0.1e9))
		if fn := o.get("k_floor"); fn != nil {
			ri.KFloor, _ = d.number(fn, o.at("k_floor"), indexImagRange)
		}
	case IndexTable:
		tp := o.at("table")
		items := d.list(o.req("table", "a list of {wavelength, n, k}"), tp, 2, "rows {wavelength, n, k}")
		good := true
		for i, it := range items {
			p := index(tp, i)
			ro := d.object(it, p, "wavelength", "n", "k")
			w, ok1 := d.quantity(ro.req("wavelength", "a wavelength such as \"500 nm\""), ro.at("wavelength"), kWavelength, closed(300e-9, 1000e-9))
			nn, ok2 := d.number(ro.req("n", "real part 0.5 ≤ value ≤ 3.5"), ro.at("n"), indexRealRange)
			kk, ok3 := d.number(ro.req("k", "imaginary part 0 ≤ value ≤ 10"), ro.at("k"), indexImagRange)
			good = good && ok1 && ok2 && ok3
			ri.Wavelengths = append(ri.Wavelengths, w)
			ri.NTable = append(ri.NTable, nn)
			ri.KTable = append(ri.KTable, kk)
		}
		if good && len(items) >= 2 {
			if i, inc := increasing(ri.Wavelengths); !inc {
				d.addAt(index(tp, i)+".wavelength", "wavelengths must increase strictly",
					"greater than "+formatIn(ri.Wavelengths[i-1], kWavelength))
			}
		}
	}
	return ri
}

// Refractive index ranges: the real part spans bubbles-in-water (< 1
// relative) to dense minerals (≈ 2.5–3 absolute); package mie recommends
// 0.5 ≤ n ≤ 3 and accepts 0 ≤ k ≤ 10.
var (
	indexRealRange = closed(0.5, 3.5)
	indexImagRange = closed(0, 10)
)

var diameterRange = closed(1e-8, 5e-3) // 10 nm … 5 mm

func (d *decoder) size(n *yaml.Node, path string) SizeDistribution {
	o := d.object(n, path, "kind", "slope", "dmin", "dmax", "median", "gsd", "by", "csv")
	var sd SizeDistribution
	kn := o.req("kind", "junge, lognormal, table")
	if kn == nil {
		return sd
	}
	k, ok := d.choice(kn, o.at("kind"), string(SizeJunge), string(SizeLognormal), string(SizeTable))
	if !ok {
		return sd
	}
	sd.Kind = SizeKind(k)
	want := map[SizeKind][]string{
		SizeJunge:     {"slope", "dmin", "dmax"},
		SizeLognormal: {"median", "gsd", "by"},
		SizeTable:     {"csv"},
	}[sd.Kind]
	for _, key := range []string{"slope", "dmin", "dmax", "median", "gsd", "by", "csv"} {
		if o.has(key) && !contains(want, key) {
			d.add(keyNode(n, key), o.at(key), "", "does not apply to size kind "+k, "keys kind"+prefixList(want))
		}
	}
	switch sd.Kind {
	case SizeJunge:
		sd.Slope, _ = d.number(o.req("slope", "Junge slope 0 < value ≤ 8"), o.at("slope"), openLo(0, 8))
		lo, ok1 := d.quantity(o.req("dmin", "a diameter such as \"0.5 µm\""), o.at("dmin"), kDiameter, diameterRange)
		hi, ok2 := d.quantity(o.req("dmax", "a diameter such as \"200 µm\""), o.at("dmax"), kDiameter, diameterRange)
		sd.DMin, sd.DMax = lo, hi
		if ok1 && ok2 && lo >= hi {
			d.addAt(o.at("dmax"), "dmax must exceed dmin", "greater than dmin = "+formatIn(lo, kDiameter))
		}
	case SizeLognormal:
		sd.Median, _ = d.quantity(o.req("median", "a diameter such as \"20 µm\""), o.at("median"), kDiameter, diameterRange)
		sd.GSD, _ = d.number(o.req("gsd", "geometric standard deviation 1 < value ≤ 10"), o.at("gsd"), openLo(1, 10))
		if bn := o.req("by", "number or volume"); bn != nil {
			b, _ := d.choice(bn, o.at("by"), string(ByNumber), string(ByVolume))
			sd.By = Basis(b)
		}
	case SizeTable:
		cn := o.req("csv", "path of a CSV file of volume concentration per size class")
		if p, ok := d.text(cn, o.at("csv")); ok {
			if !filepath.IsAbs(p) {
				p = filepath.Join(d.dir, p)
			}
			st, err := os.Stat(p)
			switch {
			case err != nil:
				d.add(cn, o.at("csv"), cn.Value, "cannot read the size table: "+err.Error(), "an existing CSV file, relative to the scenario file")
			case !st.Mode().IsRegular():
				d.add(cn, o.at("csv"), cn.Value, "not a regular file", "an existing CSV file, relative to the scenario file")
			default:
				b, err := psd.ReadCSVFile(p)
				if err != nil {
					d.add(cn, o.at("csv"), cn.Value, "bad size table: "+err.Error(),
						"columns lower, upper (with units) and volume (µL/L), rows in increasing size; see mie/psd.ReadCSV")
					break
				}
				sd.CSV, sd.Table = p, b
			}
		}
	}
	return sd
}

func (d *decoder) floc(n *yaml.Node, path string, kind docKind) FlocParams {
	o := d.object(n, path, "primary_size", "fractal_dimension", "optics", "dynamic")
	f := FlocParams{Dynamic: kind == docFull}
	f.PrimarySize, _ = d.quantity(o.req("primary_size", "a diameter such as \"4 µm\""), o.at("primary_size"), kDiameter, closed(1e-8, 1e-3))
	f.FractalDimension, _ = d.number(o.req("fractal_dimension", "1 < value ≤ 3"), o.at("fractal_dimension"), openLo(1, 3))
	if on := o.get("optics"); on != nil {
		m, _ := d.choice(on, o.at("optics"), string(FlocEffectiveMedium), string(FlocRDG))
		f.Optics = FlocOptics(m)
	}
	if dn := o.get("dynamic"); dn != nil {
		v, ok := d.boolean(dn, o.at("dynamic"))
		if ok && v && kind == docMixture {
			d.add(dn, o.at("dynamic"), dn.Value, "a mixture document has no flow to drive floc size", "false")
		} else if ok {
			f.Dynamic = v
		}
	}
	return f
}

// flocSize checks that the primaries are smaller than the flocs.
func (d *decoder) flocSize(path string, pop *Population) {
	dp := pop.Floc.PrimarySize
	if dp <= 0 {
		return
	}
	var smallest float64
	var what string
	switch pop.Size.Kind {
	case SizeJunge:
		smallest, what = pop.Size.DMin, "size.dmin"
	case SizeLognormal:
		smallest, what = pop.Size.Median, "size.median"
	default:
		return
	}
	if smallest > 0 && dp >= smallest {
		d.addAt(join(path, "floc.primary_size"), "primary particles must be smaller than the flocs",
			"less than "+what+" = "+formatIn(smallest, kDiameter))
	}
}

func (d *decoder) cell(n *yaml.Node, path string) CellParams {
	o := d.object(n, path, "structure", "core_fraction", "shell_index")
	c := CellParams{Structure: CellHomogeneous}
	if sn := o.get("structure"); sn != nil {
		s, _ := d.choice(sn, o.at("structure"), string(CellHomogeneous), string(CellCoated))
		c.Structure = CellStructure(s)
	}
	if c.Structure == CellCoated {
		c.CoreFraction, _ = d.number(o.req("core_fraction", "core diameter / cell diameter, 0 < value < 1"), o.at("core_fraction"), openBoth(0, 1))
		if sn := o.req("shell_index", "the shell's refractive index"); sn != nil {
			c.Shell = d.index(sn, o.at("shell_index"))
		}
	} else {
		for _, key := range []string{"core_fraction", "shell_index"} {
			if o.has(key) {
				d.add(keyNode(n, key), o.at(key), "", "applies only to structure coated", "structure: coated")
			}
		}
	}
	return c
}

// ---- outputs ----------------------------------------------------------------------

func (d *decoder) outputs(n *yaml.Node, path string) Outputs {
	out := Outputs{Directory: filepath.Join(d.dir, "murk-out"), NetCDF: true, CSV: true, Plots: true, Summary: true,
		PlotFormats: []string{"svg", "png"}}
	if n == nil {
		return out
	}
	o := d.object(n, path, "directory", "products", "plot_formats")
	if dn := o.get("directory"); dn != nil {
		if s, ok := d.text(dn, o.at("directory")); ok {
			if !filepath.IsAbs(s) {
				s = filepath.Join(d.dir, s)
			}
			out.Directory = s
		}
	}
	if pn := o.get("products"); pn != nil {
		out.NetCDF, out.CSV, out.Plots, out.Summary = false, false, false, false
		seen := map[string]bool{}
		for i, it := range d.list(pn, o.at("products"), 1, "products") {
			p := index(o.at("products"), i)
			s, ok := d.choice(it, p, "netcdf", "csv", "plots", "summary")
			if !ok {
				continue
			}
			if seen[s] {
				d.add(it, p, s, "product listed twice", "each product once")
			}
			seen[s] = true
			switch s {
			case "netcdf":
				out.NetCDF = true
			case "csv":
				out.CSV = true
			case "plots":
				out.Plots = true
			case "summary":
				out.Summary = true
			}
		}
	}
	if fn := o.get("plot_formats"); fn != nil {
		out.PlotFormats = nil
		for i, it := range d.list(fn, o.at("plot_formats"), 1, "formats") {
			p := index(o.at("plot_formats"), i)
			s, ok := d.choice(it, p, "svg", "png")
			if !ok {
				continue
			}
			if contains(out.PlotFormats, s) {
				d.add(it, p, s, "format listed twice", "each format once")
				continue
			}
			out.PlotFormats = append(out.PlotFormats, s)
		}
	}
	return out
}
