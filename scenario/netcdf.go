package scenario

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"time"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/iop"
	"github.com/murk-optics/murk/scenario/netcdf"
	"github.com/murk-optics/murk/scenario/netcdf/cf"
	"github.com/murk-optics/murk/scenario/spec"
)

// NetCDFEpoch is the nominal calendar date of the start of a run (the
// start of the spin-up): scenarios have no dates, and CF time coordinates
// need one. The file's time coordinate says so in its comment.
var NetCDFEpoch = time.Date(2000, 1, 1, 0, 0, 0, 0, time.UTC)

// netcdfReferences lists the methods behind the file's numbers.
const netcdfReferences = "Hansen & Rattray 1965; MacCready 2004; Geyer & MacCready 2014 (estuary); " +
	"Kranenburg 1994; Winterwerp 1998 (flocs); Lorenz-Mie after Bohren & Huffman 1983; Sorensen 2001 (fractal aggregates); " +
	"Pope & Fry 1997; Zhang, Hu & He 2009; Bricaud et al. 1981 (water and CDOM); " +
	"Lee et al. 2002, 2013, 2015 (reflectance, Kd, Secchi depth); CIE 1931 colour matching functions"

// Dataset returns the CF definition of the run's NetCDF file: dimensions
// time, distance (stations), layer, component, wavelength and angle;
// variables with units, long_name and, where the CF Standard Name Table has
// one, standard_name.
func (r *Result) Dataset() *cf.Dataset {
	name := r.Scenario.Name
	if name == "" {
		name = "murk scenario run"
	}
	d := &cf.Dataset{Global: cf.Global{
		Title:      name,
		Source:     "murk scenario run (github.com/murk-optics/murk)",
		References: netcdfReferences,
		Comment: strings.Join(strings.Fields(Caution), " ") + " Regime boundaries: " + mixing.RegimeDigitisation +
			". Optical values are single-scattering estimates from the stated models. Time counts from the start of the run (the start of the spin-up) at a nominal epoch.",
	}}
	d.AddTime(cf.Time{Epoch: NetCDFEpoch, Seconds: r.Times, Unlimited: false})
	km := make([]float64, len(r.Stations))
	for i, x := range r.Stations {
		km[i] = x / 1e3
	}
	d.AddCoord(cf.Coord{Name: "distance", Values: km, Units: "km", LongName: "distance along the channel from the mouth (landward positive)", Axis: "X"})
	d.AddLabels(cf.Labels{Name: "layer", Labels: []string{"upper", "lower"}, LongName: "layer of the two-layer estuary model (upper: surface, lower: near-bed)"})
	var names []string
	for _, c := range r.Components {
		names = append(names, c.Name)
	}
	d.AddLabels(cf.Labels{Name: "component", Labels: names, LongName: "separable optical component (water, dissolved matter, pigment, particle populations)"})
	nm := make([]float64, r.NW())
	for i, l := range r.Wavelengths {
		nm[i] = l * 1e9
	}
	d.AddCoord(cf.Coord{Name: "wavelength", Values: nm, Units: "nm", LongName: "vacuum wavelength of light", StandardName: cf.StdRadiationWavelength})
	if r.NA() > 0 {
		deg := make([]float64, r.NA())
		for i, a := range r.Angles {
			deg[i] = a * 180 / 3.141592653589793
		}
		d.AddCoord(cf.Coord{Name: "angle", Values: deg, Units: "degree", LongName: "scattering angle"})
	}
	tdl := []string{"time", "distance", "layer"}
	tdlw := append(append([]string{}, tdl...), "wavelength")
	tdlkw := append(append([]string{}, tdl...), "component", "wavelength")
	add := func(name string, dims []string, units, long, std string) {
		d.AddVar(cf.Var{Name: name, Type: netcdf.Float, Dims: dims, Units: units, LongName: long, StandardName: std,
			Extra: coordsAttr(dims)})
	}
	add("salinity", tdl, "1", "practical salinity of the layer", cf.StdSalinity)
	add("temperature", tdl, "degC", "water temperature of the layer", cf.StdTemperature)
	add("thickness", tdl, "m", "layer thickness", "")
	add("shear_rate", tdl, "s-1", "turbulence shear rate G = sqrt(epsilon/nu)", "")
	add("ssc", tdl, "kg m-3", "suspended sediment concentration, all classes", cf.StdSuspendedMatter)
	for i, p := range r.Scenario.Mixture.Populations {
		if r.hasFlocs(i) {
			add("floc_d50_"+p.Name, tdl, "m", "median diameter of the floc mass of population "+p.Name, "")
		}
	}
	add("a", tdlw, "m-1", "absorption coefficient, total", cf.StdAbsorption)
	add("b", tdlw, "m-1", "scattering coefficient, total", cf.StdScattering)
	add("bb", tdlw, "m-1", "backscattering coefficient, total", cf.StdBackscattering)
	add("c", tdlw, "m-1", "beam attenuation coefficient, total", cf.StdBeamAttenuation)
	add("bb_ratio", tdlw, "1", "backscattering ratio bb/b, total", "")
	add("component_a", tdlkw, "m-1", "absorption coefficient of each component", "")
	add("component_b", tdlkw, "m-1", "scattering coefficient of each component", "")
	add("component_bb", tdlkw, "m-1", "backscattering coefficient of each component", "")
	if r.NA() > 0 {
		add("vsf", append(append([]string{}, tdlw...), "angle"), "m-1 sr-1", "volume scattering function, total", "")
	}
	add("bbp_slope", tdl, "1", "power-law spectral slope of particulate backscattering, bbp ~ wavelength^-slope", "")
	add("cp_slope", tdl, "1", "power-law spectral slope of particulate beam attenuation", "")
	tdw := []string{"time", "distance", "wavelength"}
	add("rrs", tdw, "sr-1", "above-surface remote-sensing reflectance of the upper layer taken as optically deep", "")
	add("kd", tdw, "m-1", "diffuse attenuation of downwelling irradiance", cf.StdDiffuseAttenuation)
	add("secchi_depth", []string{"time", "distance"}, "m", "Secchi disk depth", cf.StdSecchiDepth)
	add("hue_angle", []string{"time", "distance"}, "degree", "hue angle of the water-leaving light (CIE 1931)", "")
	add("forel_ule", []string{"time", "distance"}, "1", "Forel-Ule colour class (1-21; 0 undefined)", "")
	for _, in := range r.Instruments {
		std := ""
		switch in.Kind {
		case spec.Transmissometer:
			std = cf.StdBeamAttenuation
		case spec.Backscatter:
			std = cf.StdBackscattering
		}
		add("instrument_"+in.Name, tdl, instrumentUnit(in.Kind), fmt.Sprintf("simulated %s %s: %s", in.Kind, in.Name, instrumentQuantity(in.Kind)), std)
	}
	return d
}

// coordsAttr names the label variables of a variable's labelled
// dimensions (CF section 6.1).
func coordsAttr(dims []string) []netcdf.Attr {
	var c []string
	for _, d := range dims {
		if d == "layer" || d == "component" {
			c = append(c, d+"_name")
		}
	}
	if len(c) == 0 {
		return nil
	}
	return []netcdf.Attr{netcdf.Text("coordinates", strings.Join(c, " "))}
}

// WriteNetCDF writes the run as a CF NetCDF file at path, atomically.
func (r *Result) WriteNetCDF(path string) error {
	d := r.Dataset()
	np := len(r.Salinity)
	nw := r.NW()
	f32 := func(v []float64) []float32 {
		out := make([]float32, len(v))
		for i, x := range v {
			out[i] = float32(x)
		}
		return out
	}
	return cf.Create(path, d, func(w *cf.Writer) error {
		put := func(name string, v []float64) error {
			if err := w.Float32s(name, f32(v)); err != nil {
				return fmt.Errorf("%s: %w", name, err)
			}
			return nil
		}
		ssc := make([]float64, np)
		for p := range ssc {
			for c := 0; c < r.NC(); c++ {
				ssc[p] += r.Concentration[p*r.NC()+c]
			}
		}
		for _, v := range []struct {
			n string
			v []float64
		}{{"salinity", r.Salinity}, {"temperature", r.Temperature}, {"thickness", r.Thickness}, {"shear_rate", r.ShearRate}, {"ssc", ssc}} {
			if err := put(v.n, v.v); err != nil {
				return err
			}
		}
		for i, p := range r.Scenario.Mixture.Populations {
			if !r.hasFlocs(i) {
				continue
			}
			v := make([]float64, np)
			for q := range v {
				v[q] = r.FlocDiameter[q*r.NP()+i]
			}
			if err := put("floc_d50_"+p.Name, v); err != nil {
				return err
			}
		}
		tot := func(q iop.Quantity) []float64 {
			v := make([]float64, np*nw)
			for p := 0; p < np; p++ {
				for l := 0; l < nw; l++ {
					v[p*nw+l] = r.Sum(q, p, l, nil)
				}
			}
			return v
		}
		a, b, bb, c := tot(iop.Absorption), tot(iop.Scattering), tot(iop.Backscattering), tot(iop.Attenuation)
		ratioV := make([]float64, len(b))
		for i := range b {
			ratioV[i] = ratio(bb[i], b[i])
		}
		for _, v := range []struct {
			n string
			v []float64
		}{{"a", a}, {"b", b}, {"bb", bb}, {"c", c}, {"bb_ratio", ratioV}, {"component_a", r.A}, {"component_b", r.B}, {"component_bb", r.Bb}} {
			if err := put(v.n, v.v); err != nil {
				return err
			}
		}
		if r.NA() > 0 {
			if err := put("vsf", r.VSF); err != nil {
				return err
			}
		}
		fu := make([]float64, len(r.ForelUle))
		for i, v := range r.ForelUle {
			fu[i] = float64(v)
		}
		for _, v := range []struct {
			n string
			v []float64
		}{{"bbp_slope", r.ParticleBbSlope}, {"cp_slope", r.ParticleCSlope}, {"rrs", r.Rrs}, {"kd", r.Kd}, {"secchi_depth", r.Secchi}, {"hue_angle", r.Hue}, {"forel_ule", fu}} {
			if err := put(v.n, v.v); err != nil {
				return err
			}
		}
		ni := len(r.Instruments)
		for i, in := range r.Instruments {
			v := make([]float64, np)
			for p := range v {
				v[p] = r.Readings[p*ni+i].Value
			}
			if err := put("instrument_"+in.Name, v); err != nil {
				return err
			}
		}
		return nil
	})
}

// writeNetCDFInto writes dir/murk.nc.
func (r *Result) writeNetCDFInto(dir string) (string, error) {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return "", err
	}
	p := filepath.Join(dir, "murk.nc")
	return p, r.WriteNetCDF(p)
}
