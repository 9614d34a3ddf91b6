package spec

import (
	"bytes"
	"encoding/json"
	"flag"
	"math"
	"os"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite golden files in testdata")

// exactTol is for values that unit conversion should give to within a few
// ulp (factors such as 1e-9 are not exact in binary).
const exactTol = 1e-15

func near(a, b, rel float64) bool {
	if a == b {
		return true
	}
	return math.Abs(a-b) <= rel*math.Max(math.Abs(a), math.Abs(b))
}

// TestQuellGolden loads the example scenario and compares the whole SI
// value with the golden JSON file (regenerate with go test -run
// TestQuellGolden -update after checking the diff by eye).
func TestQuellGolden(t *testing.T) {
	s, err := Load("testdata/quell.yaml")
	if err != nil {
		t.Fatal(err)
	}
	got, err := json.MarshalIndent(s, "", "  ")
	if err != nil {
		t.Fatal(err)
	}
	got = append(got, '\n')
	const golden = "testdata/quell.golden.json"
	if *update {
		if err := os.WriteFile(golden, got, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(golden)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("scenario differs from %s; run with -update and review the diff", golden)
	}
}

// TestQuellValues checks individual values of the example against
// conversions done by hand from unit definitions (SI Brochure, 9th ed.,
// 2019, unless noted), independently of the golden file.
func TestQuellValues(t *testing.T) {
	s, err := Load("testdata/quell.yaml")
	if err != nil {
		t.Fatal(err)
	}
	e, m := s.Estuary, s.Mixture
	checks := []struct {
		name      string
		got, want float64
	}{
		{"length 80 km", e.Geometry.Length, 80 * 1000},
		{"convergence 25 km", e.Geometry.ConvergenceLength, 25000},
		{"M2 amplitude = range/2 (definition of tidal range)", e.Tide.M2.Amplitude, 3.5 / 2},
		{"S2 amplitude", e.Tide.S2.Amplitude, 0.6},
		{"M2 period 12.4206 h (Doodson speed 28.9841042°/h, common practice)", e.Tide.M2.Period / 3600, 12.420601},
		{"river discharge", e.River.Discharge.At(0), 150},
		{"spin-up 10 day", e.Run.SpinUp, 10 * 86400},
		{"output interval 1 h", e.Run.OutputInterval, 3600},
		{"station 70 km", e.Run.Stations[7], 70e3},
		{"settling 0.02 mm/s", e.Classes[0].SettlingVelocity, 0.02e-3},
		{"erosion rate from closures", e.Classes[0].Bed.ErosionRate.Value, 1e-4},
		{"tau_ce from closures", e.Classes[0].Bed.CriticalStressErosion.Value, 0.15},
		{"tau_ce class override", e.Classes[1].Bed.CriticalStressErosion.Value, 0.2},
		{"ocean background 3 g/m3", e.Ocean.Background[1], 3e-3},
		{"rating at Q_ref gives a (C = a·(Q/Qref)^b)", e.River.Supply[0].At(150), 0.025},
		{"rating at 2·Q_ref", e.River.Supply[0].At(300), 0.025 * math.Pow(2, 1.1)},
		{"constant supply", e.River.Supply[1].At(999), 0.015},
		{"CDOM slope 0.0176 1/nm", m.Water.CDOM.Slope, 0.0176e9},
		{"CDOM river", m.Water.CDOM.Absorption.River, 1.5},
		{"chlorophyll 4 mg/m3", m.Water.Chlorophyll.River, 4e-6},
		{"ocean salinity copied to water", m.Water.OceanSalinity, 34},
		{"diatoms 2000 per mL (1 mL = 1e-6 m3)", m.Populations[2].Concentration.Value, 2000e6},
		{"silt dmax 60 µm", m.Populations[0].Size.DMax, 60e-6},
		{"floc primary 4 µm", m.Populations[3].Floc.PrimarySize, 4e-6},
		{"k_slope 0.011 1/nm", m.Populations[0].Index.KSlope, 0.011e9},
		{"first wavelength", m.Optics.Wavelengths[0], 400e-9},
		{"last wavelength exactly 900 nm", m.Optics.Wavelengths[50], 900e-9},
		{"angle 124°", m.Optics.Angles[2], 124 * math.Pi / 180},
		{"path length 25 cm", m.Optics.Instruments[0].PathLength, 0.25},
		{"turbidity at 860 nm (ISO 7027-1)", m.Optics.Instruments[2].Wavelength, 860e-9},
		{"turbidity at 90° (ISO 7027-1)", m.Optics.Instruments[2].Angle, math.Pi / 2},
	}
	for _, c := range checks {
		if !near(c.got, c.want, 1e-6) {
			t.Errorf("%s: got %.10g, want %.10g", c.name, c.got, c.want)
		}
	}
	if len(m.Optics.Wavelengths) != 51 {
		t.Errorf("400–900 nm step 10 nm: %d wavelengths, want 51", len(m.Optics.Wavelengths))
	}
	if m.Optics.Wavelengths[50] != 900e-9 {
		t.Errorf("last wavelength %v, want exactly 900e-9", m.Optics.Wavelengths[50])
	}
	if p := m.Populations[1]; p.Class != "fine_mud" || p.ClassIndex != 0 || p.ClassFraction != 0.2 {
		t.Errorf("detritus rides on %q (%d) at %v, want fine_mud (0) at 0.2", p.Class, p.ClassIndex, p.ClassFraction)
	}
	if p := m.Populations[2]; p.Concentration.Basis != ByNumber || p.ClassIndex != -1 {
		t.Errorf("diatoms: basis %q class %d, want number and none", p.Concentration.Basis, p.ClassIndex)
	}
	if !m.Populations[3].Floc.Dynamic || e.Classes[1].Settling != SettlingFloc {
		t.Error("flocs should be dynamic and the flocs class should settle as flocs")
	}
	if !s.Outputs.NetCDF || !s.Outputs.Plots || len(s.Outputs.PlotFormats) != 2 ||
		!strings.HasSuffix(s.Outputs.Directory, "testdata/quell-out") {
		t.Errorf("outputs %+v", s.Outputs)
	}
}

// TestPartialDocuments reads the estuary and mixture documents, which use
// the same sections as the scenario.
func TestPartialDocuments(t *testing.T) {
	e, err := LoadEstuary("testdata/quell_estuary.yaml")
	if err != nil {
		t.Fatal(err)
	}
	full, err := Load("testdata/quell.yaml")
	if err != nil {
		t.Fatal(err)
	}
	if g := e.Geometry; g.Length != 80e3 || g.Cells != 160 || g.Shape != ShapeExponential || g.MouthWidth != 3e3 ||
		g.ConvergenceLength != 25e3 || g.Depth != 10 || g.Length != full.Estuary.Geometry.Length {
		t.Errorf("geometry %+v", e.Geometry)
	}
	q := e.River.Discharge
	checks := []struct {
		name      string
		got, want float64
	}{
		{"series midpoint (linear interpolation)", q.At(12.5 * 86400), (400 + 250) / 2.0},
		{"series after the end holds the last value", q.At(40 * 86400), 150},
		{"default max gap = 1.5 × median interval (5 day)", q.MaxGap, 7.5 * 86400},
		{"285.15 K is 12 °C (SI Brochure 2.3.1)", e.River.Temperature, 12},
		{"15 mg/L = 15 g/m3", e.River.Supply[1].Concentration, 0.015},
		{"tidal velocity amplitude", e.Tide.M2.Velocity, 0.9},
		{"1.5 m/day", e.Classes[1].SettlingVelocity, 1.5 / 86400},
		{"5000 g/m2", e.Classes[1].Bed.BedInventory.Value, 5},
		{"ocean background default 0", e.Ocean.Background[1], 0},
		{"30 min", e.Run.OutputInterval, 1800},
	}
	for _, c := range checks {
		if !near(c.got, c.want, 1e-12) {
			t.Errorf("%s: got %.10g, want %.10g", c.name, c.got, c.want)
		}
	}
	if e.Classes[0].Bed.BedInventory.Set {
		t.Error("fine_mud bed inventory should be unset (model default)")
	}

	m, err := LoadMixture("testdata/quell_mixture.yaml")
	if err != nil {
		t.Fatal(err)
	}
	if !m.Water.HasState || m.Water.Salinity != 5 || m.Water.OceanSalinity != 34 {
		t.Errorf("water %+v", m.Water)
	}
	if got := m.Water.CDOM.Absorption.AtSalinity(5, 34); !near(got, 1.5+(0.05-1.5)*5/34, exactTol) {
		t.Errorf("CDOM at S = 5: %v", got)
	}
	if m.Water.CDOM.ReferenceWavelength != 440e-9 || m.Water.CDOM.Slope != 0.0176e9 {
		t.Errorf("CDOM defaults %+v", m.Water.CDOM)
	}
	if got := m.Water.Chlorophyll.River; !near(got, 4e-6, exactTol) {
		t.Errorf("4 µg/L = %v kg/m3", got)
	}
	p := m.Populations
	if p[0].Size.Kind != SizeTable || len(p[0].Size.Table.Classes) != 6 || !near(p[0].Size.Table.Classes[0].Upper, 4e-6, exactTol) {
		t.Errorf("size table %+v", p[0].Size)
	}
	if p[0].Density != 2650 || p[0].Index.RelativeTo != RelativeToVacuum {
		t.Errorf("silt %+v", p[0])
	}
	if p[1].Concentration.Basis != ByVolume || !near(p[1].Concentration.Value, 30e-6, exactTol) || p[1].Floc.Dynamic || p[1].Floc.Optics != FlocRDG {
		t.Errorf("flocs %+v", p[1])
	}
	if p[2].Cell.Structure != CellCoated || p[2].Cell.CoreFraction != 0.9 || p[2].Cell.Shell.N != 1.10 {
		t.Errorf("cells %+v", p[2].Cell)
	}
	if len(m.Optics.Angles) != 9 || !near(m.Optics.Angles[8], 170*math.Pi/180, exactTol) || m.Optics.SizeBins != 200 {
		t.Errorf("optics defaults: %d angles, %d bins", len(m.Optics.Angles), m.Optics.SizeBins)
	}
}

func TestLoadMissingFile(t *testing.T) {
	_, err := Load("testdata/no-such-file.yaml")
	if err == nil || IsInvalid(err) || !os.IsNotExist(err) {
		t.Errorf("got %v, want a not-exist error that is not a validation error", err)
	}
}

// TestAllErrorsCollected makes many independent mistakes at once: every one
// must be reported, in document order.
func TestAllErrorsCollected(t *testing.T) {
	doc := quellText(t)
	edits := [][2]string{
		{`  depth: "10 m"`, `  depth: "-10 m"`},
		{`  temperature: "12 degC"`, `  temperature: "12 m"`},
		{"    kind: mineral", "    kind: mineal"},
		{`dmin: "0.5 µm"`, `dmin: "80 µm"`},
		{"fractal_dimension: 2.0", "fractal_dimension: 3.2"},
		{`  output_interval: "1 h"`, `  output_interval: "20 day"`},
		{`"80 km"]`, `"95 km"]`},
		{"  products: [netcdf, csv, plots, summary]", "  products: [netcdf, hdf5]"},
	}
	for _, e := range edits {
		doc = edit(t, doc, e[0], e[1])
	}
	_, err := Parse("many.yaml", []byte(doc))
	list, ok := err.(ErrorList)
	if !ok {
		t.Fatalf("got %T %v", err, err)
	}
	wantPaths := []string{"geometry.depth", "river.temperature", "populations[0].kind", "populations[0].size.dmax",
		"populations[3].floc.fractal_dimension", "run.output_interval", "run.stations[8]", "outputs.products[1]"}
	if len(list) != len(wantPaths) {
		t.Fatalf("%d errors, want %d:\n%v", len(list), len(wantPaths), err)
	}
	for i, e := range list {
		if e.Path != wantPaths[i] {
			t.Errorf("error %d at %s, want %s", i, e.Path, wantPaths[i])
		}
		if i > 0 && e.Line < list[i-1].Line {
			t.Errorf("errors not in document order: %v", err)
		}
	}
}

func TestBadSizeTable(t *testing.T) {
	doc := edit(t, quellText(t), `size: {kind: junge, slope: 4.0, dmin: "0.5 µm", dmax: "60 µm"}`, `size: {kind: table, csv: bad_psd.csv}`)
	_, err := Parse("testdata/quell.yaml", []byte(doc))
	if err == nil || !strings.Contains(err.Error(), "populations[0].size.csv: value \"bad_psd.csv\": bad size table: ") {
		t.Errorf("got %v", err)
	}
}

// TestSyntaxError: the YAML parser reports a line but no column.
func TestSyntaxError(t *testing.T) {
	doc := "geometry:\n  length: \"80 km\"\n  cells: [1, 2\nriver: {}\n"
	_, err := Parse("syntax.yaml", []byte(doc))
	list, ok := err.(ErrorList)
	if !ok || len(list) != 1 || list[0].Line == 0 || !strings.HasPrefix(err.Error(), "syntax.yaml:"+itoa(list[0].Line)+": YAML syntax: ") {
		t.Errorf("got %v", err)
	}
	for _, bad := range []string{"", "# only a comment\n", "a: 1\n---\nb: 2\n"} {
		_, err := Parse("x.yaml", []byte(bad))
		if !IsInvalid(err) {
			t.Errorf("%q: got %v", bad, err)
		}
	}
}

func TestEndMembersSpecialCases(t *testing.T) {
	e := EndMembers{River: 2, Ocean: 0.1}
	cases := []struct{ s, so, want float64 }{
		{0, 35, 2},          // river end
		{35, 35, 0.1},       // ocean end
		{17.5, 35, 1.05},    // halfway (linear mixing)
		{40, 35, 0.1},       // clamped above the ocean salinity
		{5, 0, 2},           // no ocean salinity: river value
		{math.NaN(), 35, 2}, // NaN salinity: river value
	}
	for _, c := range cases {
		if got := e.AtSalinity(c.s, c.so); !near(got, c.want, 1e-12) {
			t.Errorf("AtSalinity(%v, %v) = %v, want %v", c.s, c.so, got, c.want)
		}
	}
	r := Supply{Kind: SupplyRating, A: 0.02, B: -0.5, QRef: 1}
	if r.At(0) != 0 || r.At(-1) != 0 || !near(r.At(4), 0.01, 1e-12) {
		t.Errorf("rating special cases: %v %v %v", r.At(0), r.At(-1), r.At(4))
	}
}
