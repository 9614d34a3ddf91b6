package products

import (
	"fmt"
	"slices"
	"strings"
	"time"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/netcdf"
	"github.com/murk-optics/murk/scenario/netcdf/cf"
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
// time, distance (stations), cell_distance (model cell centres, for the
// full-resolution section), layer, component, wavelength and angle;
// variables with units, long_name and, where the CF Standard Name Table has
// one, standard_name (see ncVars).
func Dataset(r *scenario.Result) *cf.Dataset {
	name := r.Scenario.Name
	if name == "" {
		name = "murk scenario run"
	}
	d := &cf.Dataset{Global: cf.Global{
		Title:      name,
		Source:     "murk scenario run (github.com/murk-optics/murk)",
		References: netcdfReferences,
		Comment: strings.Join(strings.Fields(scenario.Caution), " ") + " Regime boundaries: " + mixing.RegimeDigitisation +
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
	if len(r.Section.Distance) > 0 {
		km := make([]float64, len(r.Section.Distance))
		for i, x := range r.Section.Distance {
			km[i] = x / 1e3
		}
		d.AddCoord(cf.Coord{Name: "cell_distance", Values: km, Units: "km", LongName: "distance of the model cell centre along the channel from the mouth (landward positive)", Axis: "X"})
	}
	for _, v := range ncVars(r) {
		d.AddVar(cf.Var{Name: v.name, Type: netcdf.Float, Dims: v.dims, Units: v.units, LongName: v.long, StandardName: v.std,
			Extra: coordsAttr(v.dims)})
	}
	return d
}

// ncVar is one data variable of the NetCDF file with the function that
// computes its values (called only while the file is written, one
// variable at a time).
type ncVar struct {
	name, units, long, std string
	dims                   []string
	data                   func() []float64
}

// ncVars lists the file's data variables in file order: the state and
// bulk optics at the stations (dimension distance), the same at every model
// cell (dimension cell_distance, names prefixed section_), the components
// and VSF and what is seen at the stations, and the instruments.
func ncVars(r *scenario.Result) []ncVar {
	var vs []ncVar
	add := func(name string, dims []string, units, long, std string, data func() []float64) {
		vs = append(vs, ncVar{name: name, dims: dims, units: units, long: long, std: std, data: data})
	}
	addPointVars(r, add, &r.Points, "", "distance", " at the station")
	addPointVars(r, add, &r.Section, "section_", "cell_distance", " at the model cell centre")
	tdlkw := []string{"time", "distance", "layer", "component", "wavelength"}
	same := func(v []float64) func() []float64 { return func() []float64 { return v } }
	add("component_a", tdlkw, "m-1", "absorption coefficient of each component", "", same(r.A))
	add("component_b", tdlkw, "m-1", "scattering coefficient of each component", "", same(r.B))
	add("component_bb", tdlkw, "m-1", "backscattering coefficient of each component", "", same(r.Bb))
	if r.NA() > 0 {
		add("vsf", []string{"time", "distance", "layer", "wavelength", "angle"}, "m-1 sr-1", "volume scattering function, total", "", same(r.VSF))
	}
	tdw := []string{"time", "distance", "wavelength"}
	td := []string{"time", "distance"}
	add("rrs", tdw, "sr-1", "above-surface remote-sensing reflectance of the upper layer taken as optically deep", "", same(r.Rrs))
	add("kd", tdw, "m-1", "diffuse attenuation of downwelling irradiance", cf.StdDiffuseAttenuation, same(r.Kd))
	add("secchi_depth", td, "m", "Secchi disk depth", cf.StdSecchiDepth, same(r.Secchi))
	add("hue_angle", td, "degree", "hue angle of the water-leaving light (CIE 1931)", "", same(r.Hue))
	add("forel_ule", td, "1", "Forel-Ule colour class (1-21; 0 undefined)", "", func() []float64 {
		fu := make([]float64, len(r.ForelUle))
		for i, v := range r.ForelUle {
			fu[i] = float64(v)
		}
		return fu
	})
	ni := len(r.Instruments)
	for i, in := range r.Instruments {
		d := in.Describe()
		add("instrument_"+d.Name, []string{"time", "distance", "layer"}, d.Unit,
			fmt.Sprintf("simulated %s %s: %s", d.Kind, d.Name, d.Quantity), d.StandardName, func() []float64 {
				v := make([]float64, len(r.Salinity))
				for p := range v {
					v[p] = r.Readings[p*ni+i].Value
				}
				return v
			})
	}
	return vs
}

// addPointVars adds the variables of the points ps along dimension dist:
// the water state, the bulk optics per wavelength and the slopes, named
// prefix + name; where qualifies every long name.
func addPointVars(r *scenario.Result, add func(name string, dims []string, units, long, std string, data func() []float64), ps *scenario.Points, prefix, dist, where string) {
	tdl := []string{"time", dist, "layer"}
	tdlw := []string{"time", dist, "layer", "wavelength"}
	whereW := where
	if len(ps.Band) != r.NW() {
		// The section keeps its totals at the reference wavelength only.
		tdlw = tdl
		whereW = fmt.Sprintf("%s, at %.0f nm", where, r.Wavelengths[ps.Band[ps.Ref]]*1e9)
	}
	same := func(v []float64) func() []float64 { return func() []float64 { return v } }
	add(prefix+"salinity", tdl, "1", "practical salinity of the layer"+where, cf.StdSalinity, same(ps.Salinity))
	add(prefix+"temperature", tdl, "degC", "water temperature of the layer"+where, cf.StdTemperature, same(ps.Temperature))
	add(prefix+"thickness", tdl, "m", "layer thickness"+where, "", same(ps.Thickness))
	add(prefix+"shear_rate", tdl, "s-1", "turbulence shear rate G = sqrt(epsilon/nu)"+where, "", same(ps.ShearRate))
	add(prefix+"ssc", tdl, "kg m-3", "suspended sediment concentration, all classes"+where, cf.StdSuspendedMatter, func() []float64 {
		v := make([]float64, len(ps.Salinity))
		for p := range v {
			v[p] = ps.SSC(p, r.NC())
		}
		return v
	})
	for i, pop := range r.Scenario.Mixture.Populations {
		if hasFlocs(r, i) {
			add(prefix+"floc_d50_"+pop.Name, tdl, "m", "median diameter of the floc mass of population "+pop.Name+where, "", func() []float64 {
				v := make([]float64, len(ps.Salinity))
				for p := range v {
					v[p] = ps.FlocDiameter[p*r.NP()+i]
				}
				return v
			})
		}
	}
	add(prefix+"a", tdlw, "m-1", "absorption coefficient, total"+whereW, cf.StdAbsorption, same(ps.TotalA))
	add(prefix+"b", tdlw, "m-1", "scattering coefficient, total"+whereW, cf.StdScattering, same(ps.TotalB))
	add(prefix+"bb", tdlw, "m-1", "backscattering coefficient, total"+whereW, cf.StdBackscattering, same(ps.TotalBb))
	add(prefix+"c", tdlw, "m-1", "beam attenuation coefficient, total"+whereW, cf.StdBeamAttenuation, func() []float64 {
		v := make([]float64, len(ps.TotalA))
		for i := range v {
			v[i] = ps.TotalA[i] + ps.TotalB[i]
		}
		return v
	})
	add(prefix+"bb_ratio", tdlw, "1", "backscattering ratio bb/b, total"+whereW, "", func() []float64 {
		v := make([]float64, len(ps.TotalB))
		for i := range v {
			v[i] = ratio(ps.TotalBb[i], ps.TotalB[i])
		}
		return v
	})
	add(prefix+"bp", tdlw, "m-1", "scattering coefficient of the particles"+whereW, "", same(ps.Bp))
	add(prefix+"bbp", tdlw, "m-1", "backscattering coefficient of the particles"+whereW, "", same(ps.Bbp))
	add(prefix+"bbp_slope", tdl, "1", "power-law spectral slope of particulate backscattering, bbp ~ wavelength^-slope"+where, "", same(ps.ParticleBbSlope))
	add(prefix+"cp_slope", tdl, "1", "power-law spectral slope of particulate beam attenuation"+where, "", same(ps.ParticleCSlope))
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
// Values are stored as floats (single precision), one variable at a time.
func WriteNetCDF(r *scenario.Result, path string) error {
	d := Dataset(r)
	vs := ncVars(r)
	var buf []float32
	return cf.Create(path, d, func(w *cf.Writer) error {
		for _, v := range vs {
			data := v.data()
			buf = slices.Grow(buf[:0], len(data))[:len(data)]
			for i, x := range data {
				buf[i] = float32(x)
			}
			if err := w.Float32s(v.name, buf); err != nil {
				return fmt.Errorf("%s: %w", v.name, err)
			}
		}
		return nil
	})
}

// NetCDF is the product of one CF-conventions NetCDF file, murk.nc.
type NetCDF struct{}

// Name is "netcdf".
func (NetCDF) Name() string { return "netcdf" }

// Files lists murk.nc.
func (NetCDF) Files(r *scenario.Result) ([]File, error) {
	return []File{{"murk.nc", func(path string) error { return WriteNetCDF(r, path) }}}, nil
}
