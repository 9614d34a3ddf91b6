package spec

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strconv"
	"strings"

	"gopkg.in/yaml.v3"
)

// docKind is which of the three documents is being read; all three share
// one schema and differ only in the sections they hold.
type docKind int

const (
	docFull docKind = iota
	docEstuary
	docMixture
)

func (k docKind) String() string {
	switch k {
	case docEstuary:
		return "an estuary document"
	case docMixture:
		return "a mixture document"
	}
	return "a scenario"
}

var (
	commonKeys  = []string{"version", "name", "description"}
	estuaryKeys = []string{"geometry", "river", "tide", "ocean", "closures", "sediment_classes", "run"}
	mixtureKeys = []string{"water", "populations", "optics"}
	allKeys     = concat(commonKeys, estuaryKeys, mixtureKeys, []string{"outputs"})
)

func concat(lists ...[]string) []string {
	var out []string
	for _, l := range lists {
		out = append(out, l...)
	}
	return out
}

func (k docKind) keys() []string {
	switch k {
	case docEstuary:
		return concat(commonKeys, estuaryKeys)
	case docMixture:
		return concat(commonKeys, mixtureKeys)
	}
	return allKeys
}

// Load reads and validates a full scenario file. A file that cannot be read
// gives the *os.PathError; a document that fails validation gives an
// ErrorList with every problem found (use errors.As to tell them apart).
func Load(path string) (Scenario, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return Scenario{}, err
	}
	return Parse(path, data)
}

// Parse validates a full scenario held in memory. name is used in error
// positions, and its directory resolves relative paths in the document.
func Parse(name string, data []byte) (Scenario, error) {
	s, errs := parse(name, data, docFull)
	if len(errs) > 0 {
		return Scenario{}, errs
	}
	return s, nil
}

// LoadEstuary reads an estuary document: the sections geometry, river,
// tide, ocean, closures, sediment_classes and run of the scenario schema
// (plus version, name, description). Errors as for Load.
func LoadEstuary(path string) (Estuary, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return Estuary{}, err
	}
	return ParseEstuary(path, data)
}

// ParseEstuary is LoadEstuary for a document held in memory.
func ParseEstuary(name string, data []byte) (Estuary, error) {
	s, errs := parse(name, data, docEstuary)
	if len(errs) > 0 {
		return Estuary{}, errs
	}
	return s.Estuary, nil
}

// LoadMixture reads a mixture document: the sections water, populations and
// optics of the scenario schema (plus version, name, description). In a
// mixture document water.salinity and water.temperature are required, and
// every population has a concentration. Errors as for Load.
func LoadMixture(path string) (Mixture, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return Mixture{}, err
	}
	return ParseMixture(path, data)
}

// ParseMixture is LoadMixture for a document held in memory.
func ParseMixture(name string, data []byte) (Mixture, error) {
	s, errs := parse(name, data, docMixture)
	if len(errs) > 0 {
		return Mixture{}, errs
	}
	return s.Mixture, nil
}

// IsInvalid reports whether err is (or wraps) a validation ErrorList, as
// opposed to an I/O error: commands use it to pick their exit status.
func IsInvalid(err error) bool {
	var l ErrorList
	return errors.As(err, &l)
}

func parse(name string, data []byte, kind docKind) (Scenario, ErrorList) {
	d := &decoder{file: name, dir: filepath.Dir(name), kind: kind, pos: map[string]*yaml.Node{}}
	root := d.parseYAML(data)
	if root == nil {
		return Scenario{}, d.errs
	}
	s := d.document(root, kind)
	// report in document order; problems at one node keep their order
	sort.SliceStable(d.errs, func(i, j int) bool {
		a, b := d.errs[i], d.errs[j]
		if a.Line != b.Line {
			return a.Line < b.Line
		}
		return a.Column < b.Column
	})
	return s, d.errs
}

var lineRE = regexp.MustCompile(`line (\d+)`)

// safeDecode guards against a panic inside the YAML parser: a scenario file
// must never crash murk, whatever its bytes.
func safeDecode(dec *yaml.Decoder, n *yaml.Node) (err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("yaml: parser failure: %v", r)
		}
	}()
	return dec.Decode(n)
}

func (d *decoder) parseYAML(data []byte) *yaml.Node {
	dec := yaml.NewDecoder(bytes.NewReader(data))
	var doc yaml.Node
	err := safeDecode(dec, &doc)
	if err == io.EOF {
		d.errs = append(d.errs, &Error{File: d.file, Line: 1, Column: 1,
			Problem: "empty document", Allowed: "a mapping of sections " + strings.Join(allKeys, ", ")})
		return nil
	}
	if err != nil {
		e := &Error{File: d.file, Problem: "YAML syntax: " + strings.TrimPrefix(err.Error(), "yaml: ")}
		if m := lineRE.FindStringSubmatch(err.Error()); m != nil {
			e.Line, _ = strconv.Atoi(m[1])
		}
		d.errs = append(d.errs, e)
		return nil
	}
	var extra yaml.Node
	if err := safeDecode(dec, &extra); err != io.EOF {
		line := 0
		if err == nil {
			line = extra.Line
		}
		d.errs = append(d.errs, &Error{File: d.file, Line: line, Column: 1,
			Problem: "more than one YAML document in the file", Allowed: "exactly one document"})
		return nil
	}
	if doc.Kind != yaml.DocumentNode || len(doc.Content) != 1 {
		d.errs = append(d.errs, &Error{File: d.file, Line: 1, Column: 1, Problem: "empty document"})
		return nil
	}
	return doc.Content[0]
}

// document decodes the top level and every section, then checks the
// relations between sections.
func (d *decoder) document(root *yaml.Node, kind docKind) Scenario {
	top := d.object(root, "", allKeys...)
	for _, key := range allKeys {
		if top.has(key) && !contains(kind.keys(), key) {
			d.add(keyNode(root, key), key, "", fmt.Sprintf("section %s is not part of %s", key, kind),
				"sections "+strings.Join(kind.keys(), ", "))
			delete(top.values, key)
		}
	}
	var s Scenario
	if n := top.get("version"); n != nil {
		d.integer(n, "version", 1, 1)
	}
	if n := top.get("name"); n != nil {
		s.Name, _ = d.text(n, "name")
	}
	if n := top.get("description"); n != nil {
		s.Description, _ = d.text(n, "description")
	}
	if kind != docMixture {
		d.estuary(top, &s.Estuary)
	}
	if kind != docEstuary {
		d.mixture(top, &s, kind)
	}
	if kind == docFull {
		s.Outputs = d.outputs(top.get("outputs"), "outputs")
		d.crossFull(&s)
	}
	return s
}

// keyNode returns the key node of key in mapping m (for positions).
func keyNode(m *yaml.Node, key string) *yaml.Node {
	if m == nil || m.Kind != yaml.MappingNode {
		return m
	}
	for i := 0; i+1 < len(m.Content); i += 2 {
		if m.Content[i].Value == key {
			return m.Content[i]
		}
	}
	return m
}

func (d *decoder) estuary(top *object, e *Estuary) {
	if n := top.get("sediment_classes"); n != nil {
		e.Classes = d.classes(n, "sediment_classes")
	}
	if n := top.req("geometry", "the channel: length, cells, width and depth or a table"); n != nil {
		e.Geometry = d.geometry(n, "geometry")
	}
	if n := top.req("river", "discharge, temperature and sediment"); n != nil {
		e.River = d.river(n, "river", e.Classes)
	} else {
		e.River.Supply = zeroSupply(len(e.Classes))
	}
	if n := top.get("tide"); n != nil {
		e.Tide = d.tide(n, "tide")
	}
	if n := top.req("ocean", "salinity, temperature and sediment"); n != nil {
		e.Ocean = d.ocean(n, "ocean", e.Classes)
	} else {
		e.Ocean.Background = make([]float64, len(e.Classes))
	}
	if n := top.get("closures"); n != nil {
		e.Closures = d.closures(n, "closures")
	}
	for i := range e.Classes {
		e.Classes[i].Bed = e.Classes[i].Bed.Merge(e.Closures.Bed)
		d.checkBed(e.Classes[i].Bed, index("sediment_classes", i))
	}
	if len(e.Classes) == 0 {
		d.checkBed(e.Closures.Bed, "closures")
	}
	if n := top.req("run", "duration, output_interval and optionally spin_up and stations"); n != nil {
		e.Run = d.run(n, "run", e.Geometry.Length)
	}
	d.crossEstuary(e)
}

func zeroSupply(n int) []Supply {
	out := make([]Supply, n)
	for i := range out {
		out[i] = Supply{Kind: SupplyConstant}
	}
	return out
}

// ---- geometry -------------------------------------------------------------

func (d *decoder) geometry(n *yaml.Node, path string) Geometry {
	o := d.object(n, path, "length", "cells", "width", "depth", "table")
	var g Geometry
	g.Length, _ = d.quantity(o.req("length", "a length such as \"80 km\""), o.at("length"), kLength, closed(500, 1e6))
	g.Cells, _ = d.integer(o.req("cells", "integer 4 ≤ value ≤ 5000"), o.at("cells"), 4, 5000)
	if o.has("table") {
		g.Shape = ShapeTable
		for _, k := range []string{"width", "depth"} {
			if o.has(k) {
				d.add(keyNode(n, k), o.at(k), "", "give either width and depth, or a table of sections, not both", "width and depth, or table")
			}
		}
		g.Table = d.sections(o.get("table"), o.at("table"))
		return g
	}
	g.Shape = ShapeExponential
	g.Depth, _ = d.quantity(o.req("depth", "a depth such as \"10 m\", or a table of sections"), o.at("depth"), kDepth, closed(0.1, 1000))
	wn := o.req("width", "a width such as \"300 m\", or {mouth, convergence_length}")
	switch {
	case wn == nil:
	case wn.Kind == yaml.ScalarNode:
		g.MouthWidth, _ = d.quantity(wn, o.at("width"), kWidth, closed(1, 1e5))
	default:
		w := d.object(wn, o.at("width"), "mouth", "convergence_length")
		g.MouthWidth, _ = d.quantity(w.req("mouth", "a width such as \"3 km\""), w.at("mouth"), kWidth, closed(1, 1e5))
		g.ConvergenceLength, _ = d.quantity(w.req("convergence_length", "a length such as \"25 km\""), w.at("convergence_length"), kLength, closed(100, 1e7))
	}
	return g
}

func (d *decoder) sections(n *yaml.Node, path string) []Section {
	items := d.list(n, path, 2, "sections {distance, width, depth}")
	var out []Section
	ok := true
	for i, it := range items {
		p := index(path, i)
		o := d.object(it, p, "distance", "width", "depth")
		x, ok1 := d.quantity(o.req("distance", "a distance such as \"10 km\""), o.at("distance"), kDistance, closed(0, 1e6))
		w, ok2 := d.quantity(o.req("width", "a width such as \"800 m\""), o.at("width"), kWidth, closed(1, 1e5))
		h, ok3 := d.quantity(o.req("depth", "a depth such as \"8 m\""), o.at("depth"), kDepth, closed(0.1, 1000))
		ok = ok && ok1 && ok2 && ok3
		out = append(out, Section{Distance: x, Width: w, Depth: h})
	}
	if !ok || len(out) < 2 {
		return out
	}
	if out[0].Distance != 0 {
		d.addAt(index(path, 0)+".distance", "the first section must be at the mouth", "0 km")
	}
	for i := 1; i < len(out); i++ {
		if out[i].Distance <= out[i-1].Distance {
			d.addAt(index(path, i)+".distance", "distances must increase strictly",
				"greater than "+formatIn(out[i-1].Distance, kDistance))
		}
	}
	return out
}

// ---- river ------------------------------------------------------------------

func (d *decoder) river(n *yaml.Node, path string, classes []SedimentClass) River {
	o := d.object(n, path, "discharge", "temperature", "sediment")
	var r River
	if dn := o.req("discharge", "a discharge such as \"150 m3/s\" or {series: [...]}"); dn != nil {
		r.Discharge = d.signal(dn, o.at("discharge"), kDischarge, closed(0, 1e6))
	}
	r.Temperature, _ = d.quantity(o.req("temperature", "a temperature such as \"12 degC\""), o.at("temperature"), kTemperature, closed(-2, 40))
	r.Supply = zeroSupply(len(classes))
	if sn := o.get("sediment"); sn != nil {
		so := d.object(sn, o.at("sediment"), classNames(classes)...)
		for i, c := range classes {
			cn := so.get(c.Name)
			if cn == nil {
				continue
			}
			p := so.at(c.Name)
			if cn.Kind == yaml.MappingNode {
				ro := d.object(cn, p, "a", "b", "reference_discharge")
				s := Supply{Kind: SupplyRating, QRef: 1}
				s.A, _ = d.quantity(ro.req("a", "a concentration such as \"20 g/m3\""), ro.at("a"), kMassConc, closed(0, 100))
				s.B, _ = d.number(ro.req("b", "exponent −2 ≤ value ≤ 3"), ro.at("b"), closed(-2, 3))
				if qn := ro.get("reference_discharge"); qn != nil {
					s.QRef, _ = d.quantity(qn, ro.at("reference_discharge"), kDischarge, openLo(0, 1e6))
				}
				r.Supply[i] = s
				continue
			}
			v, _ := d.quantity(cn, p, kMassConc, closed(0, 100))
			r.Supply[i] = Supply{Kind: SupplyConstant, Concentration: v}
		}
	}
	return r
}

func classNames(cs []SedimentClass) []string {
	out := make([]string, 0, len(cs))
	for _, c := range cs {
		if c.Name != "" {
			out = append(out, c.Name)
		}
	}
	return out
}

// signal reads a constant ("150 m3/s") or a series
// {series: [{time, value}, ...], max_gap}.
func (d *decoder) signal(n *yaml.Node, path string, k kind, r interval) Signal {
	if n.Kind == yaml.ScalarNode {
		v, ok := d.quantity(n, path, k, r)
		if !ok {
			return Signal{}
		}
		return Signal{Values: []float64{v}}
	}
	o := d.object(n, path, "series", "max_gap")
	items := d.list(o.req("series", "a list of {time, value}"), o.at("series"), 2, "samples {time, value}")
	var s Signal
	ok := true
	for i, it := range items {
		p := index(o.at("series"), i)
		so := d.object(it, p, "time", "value")
		t, ok1 := d.quantity(so.req("time", "a time such as \"2 day\""), so.at("time"), kTime, closed(-3650*86400, 36500*86400))
		v, ok2 := d.quantity(so.req("value", "a "+k.name), so.at("value"), k, r)
		ok = ok && ok1 && ok2
		s.Times = append(s.Times, t)
		s.Values = append(s.Values, v)
	}
	// A series with a bad sample comes back empty, so that the checks
	// across sections do not report on half-read data.
	if !ok || len(s.Times) < 2 {
		return Signal{}
	}
	sorted := true
	for i := 1; i < len(s.Times); i++ {
		if s.Times[i] <= s.Times[i-1] {
			d.addAt(index(o.at("series"), i)+".time", "sample times must increase strictly",
				"later than "+formatIn(s.Times[i-1], kShortTime))
			sorted = false
		}
	}
	if !sorted {
		return Signal{}
	}
	// Gap check: default maximum gap is 1.5 times the median sampling
	// interval, so that one missing sample in a regular record (a gap of
	// twice the interval) is caught.
	steps := make([]float64, len(s.Times)-1)
	for i := range steps {
		steps[i] = s.Times[i+1] - s.Times[i]
	}
	maxGap := 1.5 * sortedCopy(steps)[len(steps)/2]
	if gn := o.get("max_gap"); gn != nil {
		g, ok := d.quantity(gn, o.at("max_gap"), kShortTime, openLo(0, 3650*86400))
		if !ok {
			return Signal{}
		}
		maxGap = g
	}
	s.MaxGap = maxGap
	for i, st := range steps {
		if st > maxGap {
			d.addAt(index(o.at("series"), i+1)+".time", fmt.Sprintf("gap of %s after the previous sample", formatIn(st, kShortTime)),
				"at most "+formatIn(maxGap, kShortTime)+" between samples (set max_gap to allow longer)")
		}
	}
	return s
}

// ---- tide, ocean, closures ----------------------------------------------------

func (d *decoder) tide(n *yaml.Node, path string) Tide {
	o := d.object(n, path, "m2", "s2")
	var t Tide
	if mn := o.req("m2", "{range: ...} or {velocity: ...}"); mn != nil {
		t.M2 = d.constituent(mn, o.at("m2"), PeriodM2)
	}
	if sn := o.get("s2"); sn != nil {
		t.S2 = d.constituent(sn, o.at("s2"), PeriodS2)
	}
	return t
}

func (d *decoder) constituent(n *yaml.Node, path string, period float64) Constituent {
	o := d.object(n, path, "range", "velocity")
	c := Constituent{Period: period}
	switch {
	case o.has("range") && o.has("velocity"):
		d.add(keyNode(n, "velocity"), o.at("velocity"), "", "give either range or velocity, not both", "range or velocity")
	case o.has("range"):
		v, ok := d.quantity(o.get("range"), o.at("range"), kTideHeight, closed(0, 20))
		if ok {
			c.Form, c.Amplitude = TideRange, v/2
		}
	case o.has("velocity"):
		v, ok := d.quantity(o.get("velocity"), o.at("velocity"), kVelocity, closed(0, 5))
		if ok {
			c.Form, c.Velocity = TideVelocity, v
		}
	default:
		o.missing("range", "range (tidal range, e.g. \"3.5 m\") or velocity (velocity amplitude, e.g. \"1 m/s\")")
	}
	return c
}

func (d *decoder) ocean(n *yaml.Node, path string, classes []SedimentClass) Ocean {
	o := d.object(n, path, "salinity", "temperature", "sediment")
	var oc Ocean
	oc.Salinity, _ = d.quantity(o.req("salinity", "a salinity such as \"35 PSU\""), o.at("salinity"), kSalinity, openLo(0, 42))
	oc.Temperature, _ = d.quantity(o.req("temperature", "a temperature such as \"12 degC\""), o.at("temperature"), kTemperature, closed(-2, 40))
	oc.Background = make([]float64, len(classes))
	if sn := o.get("sediment"); sn != nil {
		so := d.object(sn, o.at("sediment"), classNames(classes)...)
		for i, c := range classes {
			if cn := so.get(c.Name); cn != nil {
				oc.Background[i], _ = d.quantity(cn, so.at(c.Name), kMassConc, closed(0, 100))
			}
		}
	}
	return oc
}

func (d *decoder) closures(n *yaml.Node, path string) Closures {
	o := d.object(n, path, append([]string{"drag_coefficient", "mixing_coefficient", "background_mixing",
		"dispersion_coefficient", "interfacial_friction"}, bedKeys...)...)
	var c Closures
	num := func(key string, r interval) Override {
		if v := o.get(key); v != nil {
			x, ok := d.number(v, o.at(key), r)
			return Override{Value: x, Set: ok}
		}
		return Override{}
	}
	c.DragCoefficient = num("drag_coefficient", closed(1e-4, 0.05))
	c.MixingCoefficient = num("mixing_coefficient", closed(1e-4, 1))
	if v := o.get("background_mixing"); v != nil {
		x, ok := d.quantity(v, o.at("background_mixing"), kDiffusivity, closed(0, 1))
		c.BackgroundMixing = Override{Value: x, Set: ok}
	}
	c.DispersionCoefficient = num("dispersion_coefficient", closed(0, 1))
	c.InterfacialFriction = num("interfacial_friction", closed(0, 0.05))
	c.Bed = d.bed(o)
	return c
}

var bedKeys = []string{"erosion_rate", "critical_stress_erosion", "critical_stress_deposition", "bed_inventory"}

// bed reads the bed-exchange keys of a closures or sediment-class mapping.
func (d *decoder) bed(o *object) BedParams {
	qty := func(key string, k kind, r interval) Override {
		if v := o.get(key); v != nil {
			x, ok := d.quantity(v, o.at(key), k, r)
			return Override{Value: x, Set: ok}
		}
		return Override{}
	}
	var b BedParams
	b.ErosionRate = qty("erosion_rate", kMassFlux, closed(0, 0.1))
	b.CriticalStressErosion = qty("critical_stress_erosion", kStress, openLo(0, 10))
	b.CriticalStressDeposition = qty("critical_stress_deposition", kStress, closed(0, 10))
	b.BedInventory = qty("bed_inventory", kArealMass, closed(0, 1e5))
	return b
}

// checkBed reports a deposition threshold above the erosion threshold: in
// the Krone (1962) / Partheniades (1965) framework τ_cd ≤ τ_ce.
func (d *decoder) checkBed(b BedParams, path string) {
	if b.CriticalStressErosion.Set && b.CriticalStressDeposition.Set &&
		b.CriticalStressDeposition.Value > b.CriticalStressErosion.Value {
		p := join(path, "critical_stress_deposition")
		if d.pos[p] == nil {
			p = "closures.critical_stress_deposition"
		}
		d.addAt(p, "the deposition threshold exceeds the erosion threshold",
			"at most critical_stress_erosion = "+formatIn(b.CriticalStressErosion.Value, kStress))
	}
}

// ---- sediment classes, run ------------------------------------------------------

func (d *decoder) classes(n *yaml.Node, path string) []SedimentClass {
	items := d.list(n, path, 0, "sediment classes {name, settling_velocity}")
	var out []SedimentClass
	seen := map[string]bool{}
	for i, it := range items {
		p := index(path, i)
		o := d.object(it, p, append([]string{"name", "settling_velocity"}, bedKeys...)...)
		var c SedimentClass
		c.Bed = d.bed(o)
		if nn := o.req("name", "a name such as fine_mud"); nn != nil {
			if name, ok := d.name(nn, o.at("name")); ok {
				if seen[name] {
					d.add(nn, o.at("name"), name, "sediment class name used twice", "unique names")
				} else {
					seen[name] = true
					c.Name = name
				}
			}
		}
		if sn := o.req("settling_velocity", "a velocity such as \"0.5 mm/s\", or floc"); sn != nil {
			if sn.Kind == yaml.ScalarNode && sn.Value == "floc" {
				c.Settling = SettlingFloc
				d.pos[o.at("settling_velocity")] = sn
			} else {
				c.Settling = SettlingConstant
				c.SettlingVelocity, _ = d.quantity(sn, o.at("settling_velocity"), kSettling, closed(0, 0.1))
			}
		}
		out = append(out, c)
	}
	return out
}

// run reads the run section; length (m, 0 if unknown) bounds the stations.
func (d *decoder) run(n *yaml.Node, path string, length float64) Run {
	o := d.object(n, path, "duration", "spin_up", "output_interval", "stations")
	var r Run
	r.Duration, _ = d.quantity(o.req("duration", "a time such as \"30 day\""), o.at("duration"), kTime, closed(3600, 3650*86400))
	if sn := o.get("spin_up"); sn != nil {
		r.SpinUp, _ = d.quantity(sn, o.at("spin_up"), kTime, closed(0, 3650*86400))
	}
	r.OutputInterval, _ = d.quantity(o.req("output_interval", "a time such as \"1 h\""), o.at("output_interval"), kShortTime, openLo(0, 3650*86400))
	if sn := o.get("stations"); sn != nil {
		items := d.list(sn, o.at("stations"), 1, "distances from the mouth")
		seen := map[float64]bool{}
		for i, it := range items {
			p := index(o.at("stations"), i)
			x, ok := d.quantity(it, p, kDistance, closed(0, 1e6))
			if !ok {
				continue
			}
			if seen[x] {
				d.add(it, p, it.Value, "station given twice", "distinct distances")
				continue
			}
			if length > 0 && x > length {
				d.add(it, p, it.Value, "station beyond the head of the channel",
					"0 km ≤ value ≤ geometry.length = "+formatIn(length, kDistance))
				continue
			}
			seen[x] = true
			r.Stations = append(r.Stations, x)
		}
	}
	return r
}
