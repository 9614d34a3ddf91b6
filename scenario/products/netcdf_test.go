package products

import (
	"encoding/json"
	"errors"
	"math"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/murk-optics/murk/scenario/iop"
)

// float32Tol is the relative rounding of values stored as NetCDF float
// (IEEE single precision: 2⁻²⁴ ≈ 6e-8, doubled for safety).
const float32Tol = 1.2e-7

// The run's NetCDF file reads back with two independent clients:
// Debian's ncdump (the netCDF C library) and Python's netCDF4 and xarray.
func TestNetCDFReadBack(t *testing.T) {
	r := runSmall(t)
	path := filepath.Join(t.TempDir(), "run.nc")
	if err := WriteNetCDF(r, path); err != nil {
		t.Fatal(err)
	}
	if _, err := exec.LookPath("ncdump"); err == nil {
		out, err := exec.Command("ncdump", "-h", path).CombinedOutput()
		if err != nil {
			t.Fatalf("ncdump: %v\n%s", err, out)
		}
		for _, want := range []string{"time = 3 ;", "distance = 9 ;", "cell_distance = 40 ;", "float section_bb(time, cell_distance, layer) ;", "layer = 2 ;", "wavelength = 6 ;", "angle = 6 ;",
			`bb:standard_name = "volume_backwards_scattering_coefficient_of_radiative_flux_in_sea_water"`, `:Conventions = "CF-1.8"`} {
			if !strings.Contains(string(out), want) {
				t.Errorf("ncdump -h lacks %q", want)
			}
		}
	} else {
		t.Log("ncdump not installed; skipping that client")
	}
	cmd := exec.Command("/usr/bin/python3", "testdata/readback.py", path)
	out, err := cmd.Output()
	var ee *exec.ExitError
	if errors.As(err, &ee) && ee.ExitCode() == 3 || errors.Is(err, exec.ErrNotFound) {
		t.Skip("python3 netCDF4/xarray not installed")
	}
	if err != nil {
		t.Fatalf("readback.py: %v\n%s", err, out)
	}
	var got struct {
		Dims        map[string]int `json:"dims"`
		Conventions string         `json:"conventions"`
		Salinity    []float64      `json:"salinity"`
		Bb          []float64      `json:"bb"`
		ComponentA  []float64      `json:"component_a"`
		Layers      []string       `json:"layers"`
		TimeHours   []float64      `json:"time_hours"`
		BbUnits     string         `json:"bb_units"`
	}
	if err := json.Unmarshal(out, &got); err != nil {
		t.Fatal(err)
	}
	if got.Conventions != "CF-1.8" || got.BbUnits != "m-1" || len(got.Layers) != 2 || got.Layers[0] != "upper" {
		t.Errorf("attributes: %q %q %v", got.Conventions, got.BbUnits, got.Layers)
	}
	if got.Dims["component"] != r.NK() {
		t.Errorf("component dimension %d, want %d", got.Dims["component"], r.NK())
	}
	for i, v := range got.Salinity {
		if math.Abs(v-r.Salinity[i]) > float32Tol*max(1, r.Salinity[i]) {
			t.Fatalf("salinity[%d] = %g, want %g", i, v, r.Salinity[i])
		}
	}
	nw := r.NW()
	for i, v := range got.Bb {
		want := r.Sum(iop.Backscattering, i/nw, i%nw, nil)
		if math.Abs(v-want) > float32Tol*want {
			t.Fatalf("bb[%d] = %g, want %g", i, v, want)
		}
	}
	for i, v := range got.ComponentA {
		if math.Abs(v-r.A[i]) > float32Tol*max(r.A[i], 1e-30) {
			t.Fatalf("component_a[%d] = %g, want %g", i, v, r.A[i])
		}
	}
	for i, h := range got.TimeHours {
		if want := (r.Times[i] - r.Times[0]) / 3600; math.Abs(h-want) > 1e-9 {
			t.Errorf("time[%d] %g h after the first, want %g", i, h, want)
		}
	}
}

// Every figure passes the plot package's checks and is drawn in both
// formats (gonum/plot renders it; the plot package's own tests compare
// figures with golden output).
func TestFigures(t *testing.T) {
	r := runSmall(t)
	paths, err := Write(r, t.TempDir(), []string{"plots"})
	if err != nil {
		t.Fatal(err)
	}
	// 8 sections (6 optical and state quantities, floc size of the one
	// floc population, the layer structure) + 3 spectra + 3 envelopes,
	// each in SVG and PNG.
	if len(paths) != 28 {
		t.Errorf("%d figure files, want 28: %v", len(paths), paths)
	}
}

// A logarithmic axis only where the values are positive and span a
// decade (common practice: a log axis for data over orders of magnitude).
func TestDecades(t *testing.T) {
	for _, c := range []struct {
		v    []float64
		want bool
	}{
		{[]float64{1, 9.99}, false},
		{[]float64{1, 10}, true},
		{[]float64{200, 1000}, false},
		{[]float64{0.05, 3}, true},
		{[]float64{0, 10}, false},
		{[]float64{-1, 100}, false},
	} {
		if got := decades(c.v); got != c.want {
			t.Errorf("decades(%v) = %v, want %v", c.v, got, c.want)
		}
	}
}

// The spectra figures show at most maxSpectraLines stations, river end
// first and sea end last, with the station nearest the turbidity maximum
// among them.
func TestSpectraStations(t *testing.T) {
	r := runSmall(t)
	st := spectraStations(r)
	if len(st) > maxSpectraLines || len(st) < 3 {
		t.Fatalf("%d stations drawn, want 3 to %d", len(st), maxSpectraLines)
	}
	order := r.StationOrder()
	if st[0].j != order[len(order)-1] || st[len(st)-1].j != order[0] {
		t.Errorf("first %.1f km, last %.1f km; want the river end then the sea end", r.Stations[st[0].j]/1e3, r.Stations[st[len(st)-1].j]/1e3)
	}
	etm := r.NearestStation(r.Summary.ETMPosition)
	if !slices.ContainsFunc(st, func(s spectraStation) bool { return s.j == etm }) {
		t.Errorf("station %.1f km nearest the turbidity maximum (%.1f km) is not drawn", r.Stations[etm]/1e3, r.Summary.ETMPosition/1e3)
	}
	for k := 1; k < len(st); k++ {
		if !(r.Stations[st[k].j] < r.Stations[st[k-1].j]) {
			t.Errorf("stations not from river to sea: %.1f km after %.1f km", r.Stations[st[k].j]/1e3, r.Stations[st[k-1].j]/1e3)
		}
	}
}
