package cf

import (
	"encoding/json"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/murk-optics/murk/scenario/netcdf"
)

// quellDataset is a small CF file shaped like murk's output: time
// (unlimited or fixed), distance along the channel, layer, wavelength.
func quellDataset(unlimited bool) *Dataset {
	d := &Dataset{
		Format: netcdf.CDF2,
		Global: Global{
			Title:       "Quell estuary test file",
			Institution: "murk tests",
			Source:      "murk scenario/netcdf/cf tests",
		},
	}
	d.AddTime(Time{
		Epoch:     time.Date(2026, 6, 1, 0, 0, 0, 0, time.UTC),
		Seconds:   []float64{0, 1800, 3600},
		Unlimited: unlimited,
	})
	d.AddCoord(Coord{Name: "distance", Values: []float64{0, 2.5, 5, 7.5}, Units: "km",
		LongName: "distance along channel from the river head", Axis: "X"})
	d.AddCoord(Coord{Name: "layer", Values: []float64{1, 2}, Units: "1",
		LongName: "layer number (1 upper, 2 lower)", Axis: "Z", Positive: "down"})
	d.AddCoord(Coord{Name: "wavelength", Values: []float64{440, 550, 660}, Units: "nm",
		LongName: "wavelength in vacuum", StandardName: StdRadiationWavelength, Type: netcdf.Float})
	d.AddLabels(Labels{Name: "population", Labels: []string{"mineral", "organic", "phytoplankton"},
		LongName: "particle population"})
	d.AddVar(Var{Name: "share", Type: netcdf.Short, Dims: []string{"population"}, Units: "percent",
		LongName: "share of backscattering", Extra: []netcdf.Attr{netcdf.Text("coordinates", "population_name")}})
	d.AddVar(Var{Name: "depth_mean", Dims: []string{"distance"}, Units: "m", LongName: "mean channel depth"})
	d.AddVar(Var{Name: "salinity", Type: netcdf.Float, Dims: []string{"time", "distance", "layer"},
		Units: "1", LongName: "practical salinity", StandardName: StdSalinity, Fill: true})
	d.AddVar(Var{Name: "bb", Dims: []string{"time", "distance", "layer", "wavelength"},
		Units: "m-1", LongName: "backscattering coefficient", StandardName: StdBackscattering})
	return d
}

// Values written: depth = 5 + i; salinity = 10*t + i + 0.5*layer, with
// record 1, distance 0, layer 0 missing; bb = 0.01*(1 + flat index).
func salinityValue(t, i, l int) float32 { return float32(10*t+i) + 0.5*float32(l) }

func writeQuell(t *testing.T, path string, unlimited bool) {
	t.Helper()
	err := Create(path, quellDataset(unlimited), func(w *Writer) error {
		if err := w.Int16s("share", []int16{70, 20, 10}); err != nil {
			return err
		}
		if err := w.Float64s("depth_mean", []float64{5, 6, 7, 8}); err != nil {
			return err
		}
		sal := make([]float32, 8)
		bb := make([]float64, 24)
		writeRec := func(r int) error {
			for i := range 4 {
				for l := range 2 {
					sal[2*i+l] = salinityValue(r, i, l)
				}
			}
			if r == 1 {
				sal[0] = netcdf.FillFloat
			}
			for k := range bb {
				bb[k] = 0.01 * float64(1+24*r+k)
			}
			if err := w.Float32s("salinity", sal); err != nil {
				return err
			}
			return nil
		}
		if unlimited {
			for r := range 3 {
				if err := writeRec(r); err != nil {
					return err
				}
				if err := w.Float64s("bb", bb); err != nil {
					return err
				}
			}
			return nil
		}
		// Fixed time: all of salinity, then all of bb.
		for r := range 3 {
			if err := writeRec(r); err != nil {
				return err
			}
		}
		for r := range 3 {
			for k := range bb {
				bb[k] = 0.01 * float64(1+24*r+k)
			}
			if err := w.Float64s("bb", bb); err != nil {
				return err
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
}

// TestNcdumpHeader reads the header back with Unidata's ncdump (Debian
// netcdf-bin; .ci/run installs it) and checks the CF attributes it reports.
func TestNcdumpHeader(t *testing.T) {
	ncdump, err := exec.LookPath("ncdump")
	if err != nil {
		t.Skip("ncdump not found (Debian package netcdf-bin; .ci/run installs it)")
	}
	for _, unlimited := range []bool{true, false} {
		path := filepath.Join(t.TempDir(), "quell.nc")
		writeQuell(t, path, unlimited)
		out, err := exec.Command(ncdump, "-h", path).CombinedOutput()
		if err != nil {
			t.Fatalf("ncdump -h: %v\n%s", err, out)
		}
		timeDim := "time = 3 ;"
		if unlimited {
			timeDim = "time = UNLIMITED ; // (3 currently)"
		}
		// Expected lines in ncdump's CDL syntax (ncdump(1)).
		for _, want := range []string{
			timeDim,
			"distance = 4 ;",
			"double time(time) ;",
			`time:units = "seconds since 2026-06-01 00:00:00" ;`,
			`time:calendar = "standard" ;`,
			`time:standard_name = "time" ;`,
			`time:axis = "T" ;`,
			`distance:units = "km" ;`,
			`layer:positive = "down" ;`,
			"float wavelength(wavelength) ;",
			`wavelength:standard_name = "radiation_wavelength" ;`,
			"float salinity(time, distance, layer) ;",
			"salinity:_FillValue = 9.96921e+36f ;",
			`salinity:standard_name = "sea_water_practical_salinity" ;`,
			"double bb(time, distance, layer, wavelength) ;",
			`bb:units = "m-1" ;`,
			`:Conventions = "CF-1.8" ;`,
			"population_strlen = 13 ;",
			"char population_name(population, population_strlen) ;",
			`share:coordinates = "population_name" ;`,
			`:title = "Quell estuary test file" ;`,
		} {
			if !strings.Contains(string(out), want) {
				t.Errorf("unlimited=%v: ncdump -h lacks %q; got:\n%s", unlimited, want, out)
			}
		}
	}
}

const python = "/usr/bin/python3" // Debian's interpreter, which sees python3-netcdf4 and python3-xarray

type readback struct {
	NetCDF4 struct {
		Format string                    `json:"format"`
		Global map[string]any            `json:"global"`
		Dims   map[string][2]any         `json:"dims"`
		Vars   map[string]readbackNC4Var `json:"vars"`
	} `json:"netCDF4"`
	Xarray struct {
		Time []string `json:"time"`
		Vars map[string]struct {
			Units  string     `json:"units"`
			Values []*float64 `json:"values"`
			Text   []string   `json:"text"`
		} `json:"vars"`
	} `json:"xarray"`
}

type readbackNC4Var struct {
	Dims   []string       `json:"dims"`
	Dtype  string         `json:"dtype"`
	Attrs  map[string]any `json:"attrs"`
	Values []float64      `json:"values"`
	Text   []string       `json:"text"`
}

// TestReadBackPython reads the file with Python's netCDF4 (raw values) and
// xarray (CF decoding of time and _FillValue), two clients independent of
// this writer; .ci/run installs them.
func TestReadBackPython(t *testing.T) {
	if _, err := os.Stat(python); err != nil {
		t.Skip("/usr/bin/python3 not found (Debian python3 with python3-netcdf4 and python3-xarray; .ci/run installs them)")
	}
	dir := t.TempDir()
	paths := []string{filepath.Join(dir, "unlimited.nc"), filepath.Join(dir, "fixed.nc")}
	writeQuell(t, paths[0], true)
	writeQuell(t, paths[1], false)
	cmd := exec.Command(python, append([]string{filepath.Join("testdata", "readback.py")}, paths...)...)
	var stderr strings.Builder
	cmd.Stderr = &stderr
	out, err := cmd.Output()
	if cmd.ProcessState != nil && cmd.ProcessState.ExitCode() == 3 {
		t.Skipf("python modules missing (Debian python3-netcdf4, python3-xarray; .ci/run installs them): %s", stderr.String())
	}
	if err != nil {
		t.Fatalf("readback.py: %v\n%s", err, stderr.String())
	}
	var rbs []readback
	if err := json.Unmarshal(out, &rbs); err != nil || len(rbs) != 2 {
		t.Fatalf("decoding readback.py output (%d files): %v\n%s", len(rbs), err, out)
	}
	for k, unlimited := range []bool{true, false} {
		rb := rbs[k]
		nc := rb.NetCDF4
		if nc.Format != "NETCDF3_64BIT_OFFSET" {
			t.Errorf("data model %q, want NETCDF3_64BIT_OFFSET", nc.Format)
		}
		if nc.Global["Conventions"] != "CF-1.8" {
			t.Errorf("Conventions = %v", nc.Global["Conventions"])
		}
		if d := nc.Dims["time"]; d[0] != 3.0 || d[1] != unlimited {
			t.Errorf("time dimension %v, want [3 %v]", d, unlimited)
		}
		bb := nc.Vars["bb"]
		if strings.Join(bb.Dims, ",") != "time,distance,layer,wavelength" || bb.Dtype != "float64" {
			t.Errorf("bb: dims %v dtype %s", bb.Dims, bb.Dtype)
		}
		// Doubles must come back bit for bit (exact equality is the check).
		for k, got := range bb.Values {
			if want := 0.01 * float64(1+k); got != want {
				t.Fatalf("bb[%d] = %v, want %v", k, got, want)
			}
		}
		if len(bb.Values) != 72 {
			t.Errorf("bb has %d values, want 72", len(bb.Values))
		}
		if got := nc.Vars["wavelength"].Values; len(got) != 3 || got[1] != 550 || nc.Vars["wavelength"].Dtype != "float32" {
			t.Errorf("wavelength = %v (%s)", got, nc.Vars["wavelength"].Dtype)
		}
		// xarray: times decoded from "seconds since" units.
		wantTimes := []string{"2026-06-01T00:00:00", "2026-06-01T00:30:00", "2026-06-01T01:00:00"}
		if strings.Join(rb.Xarray.Time, ",") != strings.Join(wantTimes, ",") {
			t.Errorf("xarray times %v, want %v", rb.Xarray.Time, wantTimes)
		}
		sal := rb.Xarray.Vars["salinity"]
		if sal.Units != "1" || len(sal.Values) != 24 {
			t.Fatalf("xarray salinity: units %q, %d values", sal.Units, len(sal.Values))
		}
		for r := range 3 {
			for i := range 4 {
				for l := range 2 {
					got := sal.Values[8*r+2*i+l]
					if r == 1 && i == 0 && l == 0 {
						if got != nil {
							t.Errorf("salinity fill value decoded as %v, want NaN (masked)", *got)
						}
						continue
					}
					if want := float64(salinityValue(r, i, l)); got == nil || *got != want {
						t.Errorf("salinity[%d,%d,%d] = %v, want %v", r, i, l, got, want)
					}
				}
			}
		}
		wantLabels := "mineral,organic,phytoplankton"
		if got := strings.Join(nc.Vars["population_name"].Text, ","); got != wantLabels {
			t.Errorf("netCDF4 population_name = %q, want %q", got, wantLabels)
		}
		if got := strings.Join(rb.Xarray.Vars["population_name"].Text, ","); got != wantLabels {
			t.Errorf("xarray population_name = %q, want %q", got, wantLabels)
		}
		if got := nc.Vars["share"].Values; len(got) != 3 || got[0] != 70 || got[2] != 10 {
			t.Errorf("share = %v, want [70 20 10]", got)
		}
		if u := rb.Xarray.Vars["distance"].Units; u != "km" {
			t.Errorf("distance units %q", u)
		}
	}
}

// Every definition error is reported at once, each naming the item and the
// allowed values.
func TestDatasetErrors(t *testing.T) {
	d := &Dataset{}
	d.AddTime(Time{Epoch: time.Date(2026, 1, 1, 0, 0, 0, 5e8, time.UTC), Seconds: []float64{0}})
	d.AddCoord(Coord{Name: "x", Values: []float64{0, 1, 1}, Units: "km", LongName: "x"})
	d.AddCoord(Coord{Name: "y", Values: []float64{0, 1}, LongName: "y"})
	d.AddCoord(Coord{Name: "z", Values: []float64{0, 1}, Units: "m", LongName: "z", Axis: "Q"})
	d.AddCoord(Coord{Name: "w", Values: []float64{2, 1}, Units: "nm", LongName: "w"}) // decreasing is fine
	d.AddVar(Var{Name: "v", Dims: []string{"nowhere"}, Units: "m", LongName: "v"})
	d.AddVar(Var{Name: "w", Dims: []string{"w"}, Units: "m", LongName: "dup"})
	d.AddVar(Var{Name: "u", Dims: []string{"w"}, LongName: "u"})
	d.AddLabels(Labels{Name: "pop", Labels: []string{"a", "a"}, LongName: "p"})
	d.AddCoord(Coord{Name: "f", Values: []float64{1, 1 + 1e-12}, Units: "m", LongName: "f", Type: netcdf.Float})
	_, err := d.Header()
	if err == nil {
		t.Fatal("no error")
	}
	for _, want := range []string{
		"fraction of a second",
		`coordinate "x": Values[2] = 1 breaks strict monotonic`,
		`coordinate "y": Units "" and LongName "y" are both required`,
		`Axis "Q"; allowed X, Y, Z, T or empty`,
		`dimension "nowhere" is not defined`,
		`variable "w": name already used`,
		`variable "u": Units ""`,
		"Global.Title is required",
		`labels "pop": label 1 "a" is empty, repeated`,
		`coordinate "f": Values[1] = 1.000000000001 is not strictly monotonic once rounded to float`,
	} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("error lacks %q:\n%v", want, err)
		}
	}
	d2 := &Dataset{Global: Global{Title: "t"}}
	d2.AddTime(Time{Epoch: time.Unix(0, 0), Seconds: []float64{0, 10, 5}})
	if _, err := d2.Header(); err == nil || !strings.Contains(err.Error(), "Seconds[2] = 5 s breaks strictly increasing") {
		t.Errorf("decreasing time: %v", err)
	}
}

// A failing fill, or a file left incomplete, leaves no file behind.
func TestCreateAtomic(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "quell.nc")
	boom := errors.New("boom")
	if err := Create(path, quellDataset(true), func(w *Writer) error { return boom }); !errors.Is(err, boom) {
		t.Fatalf("err = %v, want boom", err)
	}
	err := Create(path, quellDataset(true), func(w *Writer) error {
		if err := w.Int16s("share", []int16{1, 2, 3}); err != nil {
			return err
		}
		return w.Float64s("depth_mean", []float64{1, 2, 3, 4})
	})
	if !errors.Is(err, netcdf.ErrIncomplete) {
		t.Fatalf("err = %v, want ErrIncomplete", err)
	}
	if !strings.Contains(err.Error(), `variable "salinity" record 0 of 3 still lacks 8 values`) {
		t.Errorf("incomplete error does not say what is missing: %v", err)
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 0 {
		t.Errorf("directory not empty after failures: %v", entries)
	}
}
