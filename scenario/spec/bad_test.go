package spec

import (
	"errors"
	"os"
	"strings"
	"testing"
	"unicode/utf8"
)

// quellText is the good example scenario; each bad case edits a copy.
func quellText(t testing.TB) string {
	t.Helper()
	b, err := os.ReadFile("testdata/quell.yaml")
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// edit replaces exactly one occurrence of old by new, failing the test if
// old does not occur exactly once (so that a case cannot silently test
// nothing).
func edit(t testing.TB, doc, old, new string) string {
	t.Helper()
	if n := strings.Count(doc, old); n != 1 {
		t.Fatalf("edit: %q occurs %d times, want 1", old, n)
	}
	return strings.Replace(doc, old, new, 1)
}

// position returns the 1-based line and column (in characters, as YAML
// counts them) of the first occurrence of marker in doc at or after byte
// offset from: the expected error position, found by plain text search and
// not by the YAML parser under test.
func position(t testing.TB, doc, marker string, from int) (line, col int) {
	t.Helper()
	i := strings.Index(doc[from:], marker)
	if i < 0 {
		t.Fatalf("marker %q not in document", marker)
	}
	i += from
	line = strings.Count(doc[:i], "\n") + 1
	col = utf8.RuneCountInString(doc[strings.LastIndex(doc[:i], "\n")+1:i]) + 1
	return line, col
}

type badCase struct {
	name    string
	edits   [][2]string // applied in order to quell.yaml
	doc     string      // used instead of quell.yaml when non-empty
	load    func(name string, data []byte) error
	at      string // marker: the error points at its first occurrence
	atAfter string // if set, search for at only after this text
	path    string // field path in the message
	allowed string // text of the allowed range or values in the message
	problem string // text of the problem in the message
}

func loadFull(name string, data []byte) error    { _, err := Parse(name, data); return err }
func loadEstuary(name string, data []byte) error { _, err := ParseEstuary(name, data); return err }
func loadMixture(name string, data []byte) error { _, err := ParseMixture(name, data); return err }

const seriesDoc = `  discharge:
    series:
      - {time: "0 day", value: "150 m3/s"}
      - {time: "10 day", value: "300 m3/s"}
      - {time: "20 day", value: "200 m3/s"}
      - {time: "30 day", value: "150 m3/s"}
`

var badCases = []badCase{
	// --- unknown and repeated keys
	{name: "unknown key", edits: [][2]string{{`  depth: "10 m"`, `  detph: "10 m"`}},
		at: "detph", path: "geometry.detph", problem: `unknown key (did you mean "depth"?)`, allowed: "keys length, cells, width, depth, table"},
	{name: "missing key", edits: [][2]string{{`  depth: "10 m"            # uniform depth below mean water` + "\n", ""}},
		at: "length:", path: "geometry.depth", problem: "missing required key depth", allowed: "a depth such as"},
	{name: "repeated key", edits: [][2]string{{"  cells: 160", "  cells: 160\n  cells: 80"}},
		at: "cells: 80", path: "geometry.cells", problem: "key given twice", allowed: "each key once"},
	{name: "unknown top-level section", edits: [][2]string{{"version: 1", "version: 1\nweather: {}"}},
		at: "weather", path: "weather", problem: "unknown key", allowed: "keys version, name, description, geometry"},
	// --- wrong types
	{name: "word for an integer", edits: [][2]string{{"  cells: 160", "  cells: many"}},
		at: "many", path: "geometry.cells", problem: "wrong type: want a whole number", allowed: "integer 4 ≤ value ≤ 5000"},
	{name: "list for a quantity", edits: [][2]string{{`  depth: "10 m"`, `  depth: [10]`}},
		at: "[10]", path: "geometry.depth", problem: "want a depth", allowed: "units m, cm"},
	{name: "quoted number", edits: [][2]string{{"fractal_dimension: 2.0", `fractal_dimension: "2.0"`}},
		at: `"2.0"`, path: "populations[3].floc.fractal_dimension", problem: "want a plain number without unit", allowed: "1 < value ≤ 3"},
	{name: "not finite", edits: [][2]string{{"      n: 1.04\n", "      n: .nan\n"}},
		at: ".nan", path: "populations[1].refractive_index.n", problem: "not a finite decimal number", allowed: "0.5 ≤ value ≤ 3.5"},
	{name: "scalar for a section", edits: [][2]string{{"tide:\n  m2: {range: \"3.5 m\"}     # meso-tidal range at the mouth\n  s2: {range: \"1.2 m\"}     # S2/M2 about 1/3 gives a clear spring-neap cycle\n", "tide: strong\n"}},
		at: "strong", path: "tide", problem: "wrong type: want a mapping of keys, got a string", allowed: "keys m2, s2"},
	// --- units
	{name: "missing unit", edits: [][2]string{{`  length: "80 km"`, `  length: 80`}},
		at: "80 ", atAfter: "length:", path: "geometry.length", problem: "missing unit; allowed units: m, km", allowed: "0.5 km ≤ value ≤ 1000 km"},
	{name: "unknown unit", edits: [][2]string{{`  discharge: "150 m3/s"    #`, `  discharge: "150 cfs"    #`}},
		at: `"150 cfs"`, path: "river.discharge", problem: `unknown unit "cfs"; allowed units: m3/s, L/s`, allowed: "0 m3/s ≤ value ≤ 1e+06 m3/s"},
	{name: "wrong dimension", edits: [][2]string{{`  temperature: "12 degC"`, `  temperature: "12 m"`}},
		at: `"12 m"`, atAfter: "river:", path: "river.temperature", problem: `unit "m" is a length, but a temperature is wanted; allowed units: degC, K`, allowed: "-2 degC ≤ value ≤ 40 degC"},
	{name: "unit of the right dimension not accepted for the field", edits: [][2]string{{`density: "2650 kg/m3"  # density`, `density: "2650 mg/L"  # density`}},
		at: `"2650 mg/L"`, path: "populations[3].density", problem: `unit "mg/L" is not accepted for a density; allowed units: kg/m3, g/cm3, g/mL`, allowed: "800 kg/m3 ≤ value ≤ 6000 kg/m3"},
	// --- ranges
	{name: "negative depth", edits: [][2]string{{`  depth: "10 m"`, `  depth: "-10 m"`}},
		at: `"-10 m"`, path: "geometry.depth", problem: "out of range", allowed: "0.1 m ≤ value ≤ 1000 m"},
	{name: "wavelength beyond the water tables", edits: [][2]string{{`to: "900 nm"`, `to: "950 nm"`}},
		at: `"950 nm"`, path: "optics.wavelengths.to", problem: "out of range", allowed: "400 nm ≤ value ≤ 900 nm"},
	{name: "fractal dimension above 3", edits: [][2]string{{"fractal_dimension: 2.0", "fractal_dimension: 3.2"}},
		at: "3.2", path: "populations[3].floc.fractal_dimension", problem: "out of range", allowed: "1 < value ≤ 3"},
	{name: "fractal dimension at 1", edits: [][2]string{{"fractal_dimension: 2.0", "fractal_dimension: 1"}},
		at: "1     ", atAfter: "fractal_dimension:", path: "populations[3].floc.fractal_dimension", problem: "out of range", allowed: "1 < value ≤ 3"},
	{name: "gsd of one", edits: [][2]string{{"gsd: 2.0", "gsd: 1"}},
		at: "1, by: volume}\n    class: fine_mud", path: "populations[1].size.gsd", problem: "out of range", allowed: "1 < value ≤ 10"},
	{name: "negative concentration", edits: [][2]string{{`"2000 1/mL"`, `"-5 1/mL"`}},
		at: `"-5 1/mL"`, path: "populations[2].concentration", problem: "out of range", allowed: "0 1/mL ≤ value ≤ 1e+12 1/mL"},
	{name: "non-positive real index", edits: [][2]string{{"      n: 1.17\n      k: 0.001", "      n: 0\n      k: 0.001"}},
		at: "0\n      k: 0.001", path: "populations[3].refractive_index.n", problem: "out of range", allowed: "0.5 ≤ value ≤ 3.5"},
	// --- inconsistent values
	{name: "dmin not below dmax", edits: [][2]string{{`dmin: "0.5 µm"`, `dmin: "80 µm"`}},
		at: `"60 µm"`, path: "populations[0].size.dmax", problem: "dmax must exceed dmin", allowed: "greater than dmin = 80 µm"},
	{name: "floc primaries as large as the flocs", edits: [][2]string{{`primary_size: "4 µm"`, `primary_size: "100 µm"`}},
		at: `"100 µm"`, path: "populations[3].floc.primary_size", problem: "primary particles must be smaller than the flocs", allowed: "less than size.median = 80 µm"},
	{name: "zero discharge and no tide", edits: [][2]string{
		{`  discharge: "150 m3/s"`, `  discharge: "0 m3/s"`},
		{"tide:\n  m2: {range: \"3.5 m\"}     # meso-tidal range at the mouth\n  s2: {range: \"1.2 m\"}     # S2/M2 about 1/3 gives a clear spring-neap cycle\n", ""}},
		at: `"0 m3/s"`, path: "river.discharge", problem: "zero river discharge with no tide", allowed: "discharge greater than 0 m3/s, or a tide section"},
	{name: "unsorted series", edits: [][2]string{{`  discharge: "150 m3/s"    # mean flow; a time series is {series: [{time, value}, ...]}` + "\n",
		strings.Replace(seriesDoc, `"20 day"`, `"5 day"`, 1)}},
		at: `"5 day"`, path: "river.discharge.series[2].time", problem: "sample times must increase strictly", allowed: "later than 240 h"},
	{name: "gap in a series", edits: [][2]string{{`  discharge: "150 m3/s"    # mean flow; a time series is {series: [{time, value}, ...]}` + "\n",
		strings.Replace(seriesDoc, `      - {time: "20 day", value: "200 m3/s"}`+"\n", "", 1) + `    max_gap: "12 day"` + "\n"}},
		at: `"30 day"`, path: "river.discharge.series[2].time", problem: "gap of 480 h after the previous sample", allowed: "at most 288 h between samples"},
	{name: "missing sample in a regular series", edits: [][2]string{{`  discharge: "150 m3/s"    # mean flow; a time series is {series: [{time, value}, ...]}` + "\n",
		"  discharge:\n    series:\n" + dailySeries(0, 12) + dailySeries(14, 26)}},
		at: `"14 day"`, path: "river.discharge.series[13].time", problem: "gap of 48 h", allowed: "at most 36 h"},
	{name: "series ends before the run", edits: [][2]string{{`  discharge: "150 m3/s"    # mean flow; a time series is {series: [{time, value}, ...]}` + "\n",
		strings.Replace(seriesDoc, `"30 day"`, `"22 day"`, 1) + "    max_gap: \"10 day\"\n"}},
		at: `"22 day"`, path: "river.discharge.series[3].time", problem: "the series ends before the run does", allowed: "at least spin_up + duration = 25 day"},
	{name: "output interval longer than the run", edits: [][2]string{{`  output_interval: "1 h"`, `  output_interval: "20 day"`}},
		at: `"20 day"`, path: "run.output_interval", problem: "the output interval is longer than the run", allowed: "0 < value ≤ run.duration = 15 day"},
	{name: "station beyond the head", edits: [][2]string{{`"80 km"]`, `"95 km"]`}},
		at: `"95 km"`, path: "run.stations[8]", problem: "station beyond the head", allowed: "0 km ≤ value ≤ geometry.length = 80 km"},
	{name: "tide dries the mouth", edits: [][2]string{{`{range: "3.5 m"}`, `{range: "19 m"}`}},
		at: `"19 m"`, path: "tide.m2.range", problem: "the channel would dry", allowed: "less than the depth at the mouth = 10 m"},
	{name: "unknown sediment class", edits: [][2]string{{"    class: fine_mud\n    class_fraction: 0.2", "    class: sand\n    class_fraction: 0.2"}},
		at: "sand", path: "populations[1].class", problem: "no sediment class of that name", allowed: "one of: fine_mud, flocs"},
	{name: "class fractions above one", edits: [][2]string{{"class_fraction: 0.2", "class_fraction: 0.5"}},
		at: "0.5", atAfter: "name: detritus", path: "populations[1].class_fraction", problem: "carry 1.3 of its mass", allowed: "summing to at most 1"},
	{name: "floc class without a floc population", edits: [][2]string{{"    class: flocs\n", "    concentration: \"10 g/m3\"\n"}},
		at: "floc          # from", path: "sediment_classes[1].settling_velocity", problem: "exactly one floc population riding on class flocs; found 0", allowed: "kind: floc and class: flocs"},
	{name: "both concentration and class", edits: [][2]string{{"    class: flocs\n", "    class: flocs\n    concentration: \"10 g/m3\"\n"}},
		at: "class: flocs", path: "populations[3].class", problem: "not both", allowed: "concentration or class"},
	{name: "deposition threshold above erosion threshold", edits: [][2]string{{`critical_stress_deposition: "0.07 Pa"`, `critical_stress_deposition: "0.3 Pa"`}},
		at: `"0.3 Pa"`, path: "closures.critical_stress_deposition", problem: "exceeds the erosion threshold", allowed: "at most critical_stress_erosion = 0.15 Pa"},
	{name: "index table short of the optics wavelengths", edits: [][2]string{{`        - {wavelength: "900 nm", n: 1.05, k: 0.00005}` + "\n", ""}},
		at: `- {wavelength: "400 nm", n: 1.05`, path: "populations[2].refractive_index.table", problem: "the table spans 400 nm … 750 nm", allowed: "a table covering 400 nm … 900 nm"},
	{name: "instrument outside the optics band", edits: [][2]string{{`to: "900 nm"`, `to: "800 nm"`}},
		at: "turbidity}", path: "optics.instruments[2].kind", problem: "instrument wavelength 860 nm lies outside", allowed: "within optics.wavelengths 400 nm … 800 nm"},
	{name: "key that does not apply to the model", edits: [][2]string{{"      n: 1.17\n      k: 0.001", "      n: 1.17\n      k: 0.001\n      k_slope: \"0.01 1/nm\""}},
		at: "k_slope: \"0.01", atAfter: "name: mud_flocs", path: "populations[3].refractive_index.k_slope", problem: "does not apply to model constant", allowed: "keys model, relative_to, n, k"},
	{name: "misspelt choice", edits: [][2]string{{"    kind: mineral", "    kind: mineal"}},
		at: "mineal", path: "populations[0].kind", problem: `unknown choice (did you mean "mineral"?)`, allowed: "mineral, organic, phytoplankton, floc"},
	{name: "size table file missing", edits: [][2]string{{`size: {kind: junge, slope: 4.0, dmin: "0.5 µm", dmax: "60 µm"}`, `size: {kind: table, csv: no-such.csv}`}},
		at: "no-such.csv", path: "populations[0].size.csv", problem: "cannot read the size table", allowed: "an existing CSV file"},
	{name: "unsorted wavelengths", edits: [][2]string{{`wavelengths: {from: "400 nm", to: "900 nm", step: "10 nm"}`, `wavelengths: ["400 nm", "550 nm", "500 nm", "900 nm"]`}},
		at: `"500 nm"`, atAfter: "optics:", path: "optics.wavelengths[2]", problem: "wavelengths must increase strictly", allowed: "greater than 550 nm"},
	{name: "width and a table", edits: [][2]string{{"  # table:\n", "  table:\n"}, {`  #   - {distance: "0 km",  width: "3 km",  depth: "12 m"}`, `    - {distance: "0 km",  width: "3 km",  depth: "12 m"}`}, {`  #   - {distance: "80 km", width: "120 m", depth: "4 m"}`, `    - {distance: "80 km", width: "120 m", depth: "4 m"}`}},
		at: "width:\n    mouth", path: "geometry.width", problem: "give either width and depth, or a table of sections, not both", allowed: "width and depth, or table"},
	{name: "geometry table not from the mouth", doc: "geometry:\n  length: \"20 km\"\n  cells: 40\n  table:\n    - {distance: \"1 km\", width: \"800 m\", depth: \"6 m\"}\n    - {distance: \"20 km\", width: \"200 m\", depth: \"3 m\"}\nriver: {discharge: \"50 m3/s\", temperature: \"10 degC\"}\nocean: {salinity: \"30 PSU\", temperature: \"10 degC\"}\nrun: {duration: \"2 day\", output_interval: \"1 h\"}\n",
		load: loadEstuary, at: `"1 km"`, path: "geometry.table[0].distance", problem: "the first section must be at the mouth", allowed: "0 km"},
	{name: "geometry table short of the head", doc: "geometry:\n  length: \"20 km\"\n  cells: 40\n  table:\n    - {distance: \"0 km\", width: \"800 m\", depth: \"6 m\"}\n    - {distance: \"15 km\", width: \"200 m\", depth: \"3 m\"}\nriver: {discharge: \"50 m3/s\", temperature: \"10 degC\"}\nocean: {salinity: \"30 PSU\", temperature: \"10 degC\"}\nrun: {duration: \"2 day\", output_interval: \"1 h\"}\n",
		load: loadEstuary, at: `"15 km"`, path: "geometry.table[1].distance", problem: "the table ends before the head", allowed: "at least geometry.length = 20 km"},
	{name: "tidal range and velocity both", edits: [][2]string{{`m2: {range: "3.5 m"}`, `m2: {range: "3.5 m", velocity: "1 m/s"}`}},
		at: "velocity: \"1 m/s\"", path: "tide.m2.velocity", problem: "give either range or velocity, not both", allowed: "range or velocity"},
	{name: "format version", edits: [][2]string{{"version: 1", "version: 2"}},
		at: "2\n", atAfter: "version:", path: "version", problem: "out of range", allowed: "integer 1 ≤ value ≤ 1"},
	{name: "unknown product", edits: [][2]string{{"products: [netcdf, csv, plots, summary]", "products: [netcdf, hdf5]"}},
		at: "hdf5", path: "outputs.products[1]", problem: "unknown choice", allowed: "netcdf, csv, plots, summary"},
	{name: "station twice", edits: [][2]string{{`"10 km", "20 km"`, `"10 km", "10 km"`}},
		at: `"10 km", "30 km"`, path: "run.stations[2]", problem: "station given twice", allowed: "distinct distances"},
	{name: "population name twice", edits: [][2]string{{"  - name: detritus", "  - name: silt"}},
		at: "silt\n    kind: organic", path: "populations[1].name", problem: "population name used twice", allowed: "unique names"},
	{name: "floc parameters on a mineral", edits: [][2]string{{"    class: fine_mud\n    class_fraction: 0.8", "    class: fine_mud\n    class_fraction: 0.8\n    floc: {primary_size: \"4 µm\", fractal_dimension: 2}"}},
		at: "floc: {primary", path: "populations[0].floc", problem: "floc parameters apply only to kind floc", allowed: "kind: floc"},
	{name: "class fraction without a class", edits: [][2]string{{"    concentration: \"2000 1/mL\"   # uniform", "    concentration: \"2000 1/mL\"\n    class_fraction: 0.5   # uniform"}},
		at: "class_fraction: 0.5", path: "populations[2].class_fraction", problem: "class_fraction needs a class", allowed: "only with class"},
	{name: "dynamic flocs in a mixture document", load: loadMixture,
		doc: "water: {salinity: \"20 PSU\", temperature: \"12 degC\"}\noptics: {wavelengths: [\"550 nm\"]}\npopulations:\n  - name: f\n    kind: floc\n    density: \"2650 kg/m3\"\n    refractive_index: {model: constant, relative_to: water, n: 1.17}\n    size: {kind: lognormal, median: \"100 µm\", gsd: 1.5, by: volume}\n    concentration: \"20 g/m3\"\n    floc: {primary_size: \"4 µm\", fractal_dimension: 2, dynamic: true}\n",
		at:  "true", path: "populations[0].floc.dynamic", problem: "a mixture document has no flow", allowed: "false"},
	// n(900 nm) = 0.8 + 0.1 µm²·(1/900² − 1/440²) nm⁻² = 0.4069 (computed by hand)
	{name: "Cauchy term drives n out of range", edits: [][2]string{{"      n: 1.04\n", "      n: 0.8\n      cauchy_b: \"0.1 µm2\"\n"}},
		at: `"0.1 µm2"`, path: "populations[1].refractive_index.cauchy_b", problem: "gives n = 0.4069 at 900 nm", allowed: "n within 0.5 ≤ value ≤ 3.5 at every optics wavelength"},
	{name: "too many wavelengths", edits: [][2]string{{`step: "10 nm"`, `step: "0.2 nm"`}},
		at: `"0.2 nm"`, path: "optics.wavelengths.step", problem: "gives 2501 wavelengths", allowed: "at most 1000 wavelengths"},
	{name: "settling too fast", edits: [][2]string{{`settling_velocity: "0.02 mm/s"`, `settling_velocity: "20 cm/s"`}},
		at: `"20 cm/s"`, path: "sediment_classes[0].settling_velocity", problem: "out of range", allowed: "0 mm/s ≤ value ≤ 100 mm/s"},
	// --- document-level problems
	{name: "alias", edits: [][2]string{{"  cells: 160", "  cells: &c 160"}, {`  output_interval: "1 h"`, "  output_interval: *c"}},
		at: "*c", path: "run.output_interval", problem: "YAML aliases are not supported", allowed: "write the value out"},
	{name: "section of a full scenario in an estuary document", load: loadEstuary,
		at: "water:", path: "water", problem: "section water is not part of an estuary document", allowed: "sections version, name, description, geometry"},
	{name: "floc settling in an estuary document", load: loadEstuary,
		edits: [][2]string{{"water:", "waterX:"}}, // waterX is an unknown key; the floc check still runs
		at:    "floc          # from", path: "sediment_classes[1].settling_velocity", problem: "an estuary document cannot hold", allowed: "floc only in a full scenario"},
	{name: "mixture document without the sample's salinity", load: loadMixture,
		doc: "water:\n  temperature: \"12 degC\"\noptics:\n  wavelengths: [\"550 nm\"]\n",
		at:  "temperature", path: "water.salinity", problem: "missing required key salinity", allowed: "a salinity such as"},
	{name: "class in a mixture document", load: loadMixture,
		doc: "water: {salinity: \"20 PSU\", temperature: \"12 degC\"}\noptics: {wavelengths: [\"550 nm\"]}\npopulations:\n  - name: s\n    kind: mineral\n    density: \"2650 kg/m3\"\n    refractive_index: {model: constant, relative_to: water, n: 1.17}\n    size: {kind: junge, slope: 4, dmin: \"1 µm\", dmax: \"50 µm\"}\n    class: fine_mud\n",
		at:  "class:", path: "populations[0].class", problem: "a mixture document has no sediment classes", allowed: "concentration"},
	{name: "water state in a full scenario", edits: [][2]string{{"water:\n", "water:\n  salinity: \"20 PSU\"\n"}},
		at: "salinity: \"20", path: "water.salinity", problem: "set by the estuary model", allowed: "only in a mixture document"},
}

// dailySeries writes {time, value} rows for days from..to inclusive.
func dailySeries(from, to int) string {
	var b strings.Builder
	for d := from; d <= to; d++ {
		b.WriteString("      - {time: \"")
		b.WriteString(itoa(d))
		b.WriteString(" day\", value: \"150 m3/s\"}\n")
	}
	return b.String()
}

func itoa(i int) string {
	if i == 0 {
		return "0"
	}
	s := ""
	for ; i > 0; i /= 10 {
		s = string(rune('0'+i%10)) + s
	}
	return s
}

func TestBadScenarios(t *testing.T) {
	base := quellText(t)
	for _, c := range badCases {
		t.Run(c.name, func(t *testing.T) {
			doc := c.doc
			if doc == "" {
				doc = base
				for _, e := range c.edits {
					doc = edit(t, doc, e[0], e[1])
				}
			}
			load := c.load
			if load == nil {
				load = loadFull
			}
			err := load("bad.yaml", []byte(doc))
			if err == nil {
				t.Fatal("accepted a bad document")
			}
			var list ErrorList
			if !errors.As(err, &list) || !IsInvalid(err) {
				t.Fatalf("error is %T, want ErrorList", err)
			}
			from := 0
			if c.atAfter != "" {
				from = strings.Index(doc, c.atAfter)
				if from < 0 {
					t.Fatalf("atAfter %q not found", c.atAfter)
				}
			}
			line, col := position(t, doc, c.at, from)
			want := []string{"bad.yaml:" + itoa(line) + ":" + itoa(col) + ": ", c.path + ": ", c.problem, c.allowed}
			for _, e := range list {
				msg := e.Error()
				ok := true
				for _, w := range want {
					if !strings.Contains(msg, w) {
						ok = false
					}
				}
				if ok {
					return
				}
			}
			t.Errorf("no error matches %q\ngot:\n%v", want, err)
		})
	}
}
