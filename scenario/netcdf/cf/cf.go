package cf

import (
	"fmt"
	"math"
	"strings"
	"time"

	"github.com/murk-optics/murk/scenario/netcdf"
)

// Conventions is the value of the global Conventions attribute.
const Conventions = "CF-1.8"

// Standard names used by murk's outputs, with their canonical units in
// comments. Source: the CF Standard Name Table (names and canonical units
// from memory; each is also in use in published CF datasets). A quantity
// that has no standard name carries only long_name and units.
const (
	StdTime                = "time"                                                                      // s
	StdSalinity            = "sea_water_practical_salinity"                                              // 1
	StdTemperature         = "sea_water_temperature"                                                     // K
	StdSuspendedMatter     = "mass_concentration_of_suspended_matter_in_sea_water"                       // kg m-3
	StdChlorophyllA        = "mass_concentration_of_chlorophyll_a_in_sea_water"                          // kg m-3
	StdAbsorption          = "volume_absorption_coefficient_of_radiative_flux_in_sea_water"              // m-1
	StdScattering          = "volume_scattering_coefficient_of_radiative_flux_in_sea_water"              // m-1
	StdBackscattering      = "volume_backwards_scattering_coefficient_of_radiative_flux_in_sea_water"    // m-1
	StdBeamAttenuation     = "volume_beam_attenuation_coefficient_of_radiative_flux_in_sea_water"        // m-1
	StdDiffuseAttenuation  = "volume_attenuation_coefficient_of_downwelling_radiative_flux_in_sea_water" // m-1
	StdSecchiDepth         = "secchi_depth_of_sea_water"                                                 // m
	StdTurbidity           = "sea_water_turbidity"                                                       // 1
	StdRadiationWavelength = "radiation_wavelength"                                                      // m
	StdDepth               = "depth"                                                                     // m
)

// Global holds the global attributes recommended by CF section 2.6.2.
// Title is required; the others are written when non-empty. Conventions is
// always written as [Conventions].
type Global struct {
	Title       string // short description of the file's contents
	Institution string // where the data were produced
	Source      string // how the data were produced, e.g. program and version
	History     string // audit trail of processing steps
	References  string // published or web-based references for the methods
	Comment     string // anything else
	Extra       []netcdf.Attr
}

// Coord is a coordinate variable: a one-dimensional variable with the same
// name as its dimension, holding strictly monotonic values (CF section
// 5, "coordinate variables"). Its values are known when the file is defined
// and are written by the [Writer] itself.
type Coord struct {
	Name         string      // dimension and variable name
	Values       []float64   // strictly increasing or strictly decreasing, finite
	Units        string      // UDUNITS string, e.g. "km", "nm", "degree"; required
	LongName     string      // required
	StandardName string      // optional; only names from the CF table
	Axis         string      // "X", "Y", "Z", "T" or "" for none
	Positive     string      // "up", "down" or "" (vertical coordinates)
	Type         netcdf.Type // Double (zero value) or Float
	Extra        []netcdf.Attr
}

// Time is the time coordinate, written as seconds since Epoch in the
// standard (mixed Gregorian/Julian, proleptic after 1582) calendar.
type Time struct {
	Name      string    // dimension and variable name; "time" if empty
	Epoch     time.Time // reference time; must be a whole second; written in UTC
	Seconds   []float64 // time of each index, s since Epoch, strictly increasing
	Unlimited bool      // make time the record (unlimited) dimension
}

// Var is a data variable.
type Var struct {
	Name         string
	Type         netcdf.Type // Double (zero value), Float, Int, Short or Byte
	Dims         []string    // dimension names, slowest varying first; time first if used
	Units        string      // UDUNITS string, "1" for dimensionless; required
	LongName     string      // required
	StandardName string      // optional; only names from the CF table
	// Fill, when true, adds a _FillValue attribute equal to the format's
	// default fill value of Type ([netcdf.FillDouble] etc.); write it
	// wherever a value is missing.
	Fill  bool
	Extra []netcdf.Attr // further attributes, e.g. comment, coordinates
}

// Dataset collects the definition of one CF file. Add the time
// coordinate, other coordinates and data variables in the order they
// should appear; then build the header with Header or write the file with
// [Create].
type Dataset struct {
	Format netcdf.Format // netcdf.CDF2 if zero
	Global Global

	dims   []netcdf.Dim
	vars   []netcdf.Var
	coords map[string][]float64 // values written automatically
	labels map[string]string    // padded label text written automatically
	time   string
	nrec   int
	errs   []string
}

func (d *Dataset) fail(format string, args ...any) {
	d.errs = append(d.errs, fmt.Sprintf(format, args...))
}

func (d *Dataset) hasName(name string) bool {
	for _, v := range d.vars {
		if v.Name == name {
			return true
		}
	}
	for _, dm := range d.dims {
		if dm.Name == name {
			return true
		}
	}
	return false
}

// monotonic reports the index of the first value that breaks strict
// monotonicity or is not finite, or -1.
func monotonic(v []float64) int {
	for i, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return i
		}
	}
	if len(v) < 2 {
		return -1
	}
	up := v[1] > v[0]
	for i := 1; i < len(v); i++ {
		if (up && !(v[i] > v[i-1])) || (!up && !(v[i] < v[i-1])) {
			return i
		}
	}
	return -1
}

// increasing reports the index of the first value that is not finite or
// not greater than its predecessor, or -1.
func increasing(v []float64) int {
	for i, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) || (i > 0 && !(x > v[i-1])) {
			return i
		}
	}
	return -1
}

func addText(attrs []netcdf.Attr, name, value string) []netcdf.Attr {
	if value == "" {
		return attrs
	}
	return append(attrs, netcdf.Text(name, value))
}

// TimeUnits returns the CF units string for seconds since epoch, e.g.
// "seconds since 2026-06-01 00:00:00" (UDUNITS time syntax; CF section
// 4.4, no time zone means UTC).
func TimeUnits(epoch time.Time) string {
	return "seconds since " + epoch.UTC().Format("2006-01-02 15:04:05")
}

// AddTime defines the time dimension and its coordinate variable
// (standard_name time, axis T, calendar standard).
func (d *Dataset) AddTime(t Time) {
	name := t.Name
	if name == "" {
		name = "time"
	}
	if d.time != "" {
		d.fail("time coordinate defined twice (%q and %q)", d.time, name)
		return
	}
	if d.hasName(name) {
		d.fail("time coordinate %q: name already used", name)
		return
	}
	if t.Epoch.IsZero() {
		d.fail("time coordinate %q: Epoch is not set", name)
		return
	}
	if t.Epoch.Nanosecond() != 0 {
		d.fail("time coordinate %q: Epoch %s has a fraction of a second; allowed whole seconds", name, t.Epoch.Format(time.RFC3339Nano))
		return
	}
	if len(t.Seconds) == 0 && !t.Unlimited {
		d.fail("time coordinate %q: no times; allowed at least 1 (or Unlimited with 0 records)", name)
		return
	}
	if i := increasing(t.Seconds); i >= 0 {
		d.fail("time coordinate %q: Seconds[%d] = %g s breaks strictly increasing finite order", name, i, t.Seconds[i])
		return
	}
	d.time = name
	if t.Unlimited {
		d.dims = append(d.dims, netcdf.Dim{Name: name, Unlimited: true})
		d.nrec = len(t.Seconds)
	} else {
		d.dims = append(d.dims, netcdf.Dim{Name: name, Len: len(t.Seconds)})
	}
	d.vars = append(d.vars, netcdf.Var{
		Name: name, Type: netcdf.Double, Dims: []string{name},
		Attrs: []netcdf.Attr{
			netcdf.Text("standard_name", StdTime),
			netcdf.Text("long_name", "time"),
			netcdf.Text("units", TimeUnits(t.Epoch)),
			netcdf.Text("calendar", "standard"),
			netcdf.Text("axis", "T"),
		},
	})
	d.setCoord(name, t.Seconds)
}

func (d *Dataset) setCoord(name string, v []float64) {
	if d.coords == nil {
		d.coords = make(map[string][]float64)
	}
	d.coords[name] = append([]float64(nil), v...)
}

// AddCoord defines a dimension and its coordinate variable.
func (d *Dataset) AddCoord(c Coord) {
	if d.hasName(c.Name) {
		d.fail("coordinate %q: name already used", c.Name)
		return
	}
	if len(c.Values) == 0 {
		d.fail("coordinate %q: no values; allowed at least 1", c.Name)
		return
	}
	if i := monotonic(c.Values); i >= 0 {
		d.fail("coordinate %q: Values[%d] = %g breaks strict monotonic finite order (CF 5: coordinate variables)", c.Name, i, c.Values[i])
		return
	}
	if c.Units == "" || c.LongName == "" {
		d.fail("coordinate %q: Units %q and LongName %q are both required", c.Name, c.Units, c.LongName)
		return
	}
	switch c.Axis {
	case "", "X", "Y", "Z", "T":
	default:
		d.fail("coordinate %q: Axis %q; allowed X, Y, Z, T or empty", c.Name, c.Axis)
		return
	}
	switch c.Positive {
	case "", "up", "down":
	default:
		d.fail("coordinate %q: Positive %q; allowed up, down or empty", c.Name, c.Positive)
		return
	}
	typ := c.Type
	if typ == 0 {
		typ = netcdf.Double
	}
	if typ != netcdf.Double && typ != netcdf.Float {
		d.fail("coordinate %q: Type %s; allowed Double or Float", c.Name, typ)
		return
	}
	if typ == netcdf.Float {
		// Rounding to float32 must keep the values distinct and in order.
		f := make([]float64, len(c.Values))
		for i, x := range c.Values {
			f[i] = float64(float32(x))
		}
		if i := monotonic(f); i >= 0 {
			d.fail("coordinate %q: Values[%d] = %g is not strictly monotonic once rounded to float; use Double", c.Name, i, c.Values[i])
			return
		}
	}
	var attrs []netcdf.Attr
	attrs = addText(attrs, "standard_name", c.StandardName)
	attrs = addText(attrs, "long_name", c.LongName)
	attrs = addText(attrs, "units", c.Units)
	attrs = addText(attrs, "axis", c.Axis)
	attrs = addText(attrs, "positive", c.Positive)
	attrs = append(attrs, c.Extra...)
	d.dims = append(d.dims, netcdf.Dim{Name: c.Name, Len: len(c.Values)})
	d.vars = append(d.vars, netcdf.Var{Name: c.Name, Type: typ, Dims: []string{c.Name}, Attrs: attrs})
	d.setCoord(c.Name, c.Values)
}

// Labels is a dimension whose indices are named, such as particle
// populations or stations: it defines the dimension Name, a dimension
// Name+"_strlen" as long as the longest label, and a char variable
// Name+"_name"(Name, Name+"_strlen") holding the labels, which data
// variables can reference through their coordinates attribute (CF section
// 6.1, labels as auxiliary coordinates).
type Labels struct {
	Name     string   // dimension name
	Labels   []string // one per index: non-empty, distinct, ASCII or UTF-8 text
	LongName string   // required, e.g. "particle population"
}

// AddLabels defines a labelled dimension (see [Labels]).
func (d *Dataset) AddLabels(l Labels) {
	strlen, vname := l.Name+"_strlen", l.Name+"_name"
	for _, n := range []string{l.Name, strlen, vname} {
		if d.hasName(n) {
			d.fail("labels %q: name %q already used", l.Name, n)
			return
		}
	}
	if len(l.Labels) == 0 || l.LongName == "" {
		d.fail("labels %q: %d labels and LongName %q; at least 1 label and a LongName are required", l.Name, len(l.Labels), l.LongName)
		return
	}
	width := 0
	seen := make(map[string]bool, len(l.Labels))
	for i, s := range l.Labels {
		if s == "" || seen[s] || strings.IndexByte(s, 0) >= 0 {
			d.fail("labels %q: label %d %q is empty, repeated or contains NUL; allowed distinct non-empty text", l.Name, i, s)
			return
		}
		seen[s] = true
		width = max(width, len(s))
	}
	var text strings.Builder
	for _, s := range l.Labels {
		text.WriteString(s)
		text.WriteString(strings.Repeat("\x00", width-len(s)))
	}
	d.dims = append(d.dims, netcdf.Dim{Name: l.Name, Len: len(l.Labels)}, netcdf.Dim{Name: strlen, Len: width})
	d.vars = append(d.vars, netcdf.Var{Name: vname, Type: netcdf.Char, Dims: []string{l.Name, strlen},
		Attrs: []netcdf.Attr{netcdf.Text("long_name", l.LongName)}})
	if d.labels == nil {
		d.labels = make(map[string]string)
	}
	d.labels[vname] = text.String()
}

// AddVar defines a data variable over dimensions already defined.
func (d *Dataset) AddVar(v Var) {
	if d.hasName(v.Name) {
		d.fail("variable %q: name already used", v.Name)
		return
	}
	if v.Units == "" || v.LongName == "" {
		d.fail("variable %q: Units %q and LongName %q are both required (use Units \"1\" for dimensionless)", v.Name, v.Units, v.LongName)
		return
	}
	typ := v.Type
	if typ == 0 {
		typ = netcdf.Double
	}
	if typ == netcdf.Char {
		d.fail("variable %q: Type char; allowed Double, Float, Int, Short or Byte", v.Name)
		return
	}
	for _, dn := range v.Dims {
		found := false
		for _, dm := range d.dims {
			found = found || dm.Name == dn
		}
		if !found {
			d.fail("variable %q: dimension %q is not defined", v.Name, dn)
			return
		}
	}
	var attrs []netcdf.Attr
	attrs = addText(attrs, "standard_name", v.StandardName)
	attrs = addText(attrs, "long_name", v.LongName)
	attrs = addText(attrs, "units", v.Units)
	if v.Fill {
		attrs = append(attrs, fillAttr(typ))
	}
	attrs = append(attrs, v.Extra...)
	d.vars = append(d.vars, netcdf.Var{Name: v.Name, Type: typ, Dims: append([]string(nil), v.Dims...), Attrs: attrs})
}

func fillAttr(t netcdf.Type) netcdf.Attr {
	switch t {
	case netcdf.Float:
		return netcdf.Floats("_FillValue", netcdf.FillFloat)
	case netcdf.Int:
		return netcdf.Ints("_FillValue", netcdf.FillInt)
	case netcdf.Short:
		return netcdf.Shorts("_FillValue", netcdf.FillShort)
	case netcdf.Byte:
		return netcdf.Bytes("_FillValue", netcdf.FillByte)
	}
	return netcdf.Doubles("_FillValue", netcdf.FillDouble)
}

// Header returns the file's header, or an error listing every problem
// found while defining the dataset.
func (d *Dataset) Header() (netcdf.Header, error) {
	errs := d.errs
	if d.Global.Title == "" {
		errs = append(errs, "Global.Title is required")
	}
	if len(errs) > 0 {
		return netcdf.Header{}, fmt.Errorf("cf: %s", strings.Join(errs, "; "))
	}
	g := d.Global
	attrs := []netcdf.Attr{netcdf.Text("Conventions", Conventions), netcdf.Text("title", g.Title)}
	attrs = addText(attrs, "institution", g.Institution)
	attrs = addText(attrs, "source", g.Source)
	attrs = addText(attrs, "history", g.History)
	attrs = addText(attrs, "references", g.References)
	attrs = addText(attrs, "comment", g.Comment)
	attrs = append(attrs, g.Extra...)
	f := d.Format
	if f == 0 {
		f = netcdf.CDF2
	}
	return netcdf.Header{Format: f, Dims: d.dims, Attrs: attrs, Vars: d.vars, NumRecs: d.nrec}, nil
}
