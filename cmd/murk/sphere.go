package main

import (
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/murk-optics/murk/mie"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
)

func init() {
	register(command{
		name:    "sphere",
		summary: "optics of one homogeneous or coated sphere (Lorenz–Mie)",
		run:     runSphere,
	})
}

const sphereHelp = `usage: murk sphere [flags]

Prints the efficiencies of one sphere, and with -angles its amplitude
functions, scattering-matrix elements, phase function and (with -number) its
volume scattering function.

Give the size either as a size parameter (-x, with -m relative to the
medium) or as a diameter with a vacuum wavelength and the medium's index
(-d, -wavelength, -medium; -m is then the particle's own index and is
divided by -medium). Indices are n+ki with k >= 0 absorbing, e.g. 1.55+0.01i.
A coated sphere adds -core-m and -core-x (or -core-d).

examples:
  murk sphere -x 5.213 -m 1.55 -angles 0,90,180
  murk sphere -d "2 µm" -wavelength "550 nm" -medium 1.334 -m 1.56+0.001i -format json
`

type sphereArgs struct {
	x, d, wavelength, medium string
	m, coreM, coreX, coreD   string
	angles, number, format   string
}

func runSphere(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("sphere", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() { fmt.Fprint(stderr, sphereHelp); fs.PrintDefaults() }
	var a sphereArgs
	fs.StringVar(&a.x, "x", "", "size parameter 2πr·n_medium/λ0 (dimensionless)")
	fs.StringVar(&a.d, "d", "", `outer diameter with unit, e.g. "2 µm"`)
	fs.StringVar(&a.wavelength, "wavelength", "", `vacuum wavelength with unit, e.g. "550 nm" (with -d)`)
	fs.StringVar(&a.medium, "medium", "1", "real refractive index of the medium (with -d)")
	fs.StringVar(&a.m, "m", "", "refractive index of the sphere (of the shell if coated)")
	fs.StringVar(&a.coreM, "core-m", "", "refractive index of the core (coated sphere)")
	fs.StringVar(&a.coreX, "core-x", "", "core size parameter (with -x)")
	fs.StringVar(&a.coreD, "core-d", "", "core diameter with unit (with -d)")
	fs.StringVar(&a.angles, "angles", "", "comma-separated scattering angles in degrees, 0–180")
	fs.StringVar(&a.number, "number", "", "number concentration in particles per m³ for the volume scattering function")
	fs.StringVar(&a.format, "format", "table", "output format: table, csv or json")
	if err := fs.Parse(args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK
		}
		return exitUsage
	}
	if fs.NArg() > 0 {
		fmt.Fprintf(stderr, "murk sphere: unexpected argument %q\n", fs.Arg(0))
		return exitUsage
	}
	res, err := solveSphere(a)
	if err != nil {
		fmt.Fprintf(stderr, "murk sphere: %v\n", err)
		return exitUsage
	}
	format, err := table.ParseFormat(a.format)
	if err != nil {
		fmt.Fprintf(stderr, "murk sphere: -format: %v\n", err)
		return exitUsage
	}
	if err := res.write(stdout, format); err != nil {
		fmt.Fprintf(stderr, "murk sphere: %v\n", err)
		return exitFailure
	}
	return exitOK
}

// sphereResult is what the subcommand prints.
type sphereResult struct {
	X          float64          `json:"size_parameter"`
	CoreX      float64          `json:"core_size_parameter,omitempty"`
	M          string           `json:"relative_index"`
	CoreM      string           `json:"core_relative_index,omitempty"`
	Eff        map[string]any   `json:"efficiencies"`
	Angles     []map[string]any `json:"angles,omitempty"`
	effTable   *table.Table
	angleTable *table.Table
}

func parseIndex(flagName, s string) (complex128, error) {
	c, err := strconv.ParseComplex(strings.ReplaceAll(s, " ", ""), 128)
	if err != nil {
		return 0, fmt.Errorf("%s: %q is not a refractive index (write n or n+ki, e.g. 1.55+0.01i)", flagName, s)
	}
	return c, nil
}

func solveSphere(a sphereArgs) (*sphereResult, error) {
	if a.m == "" {
		return nil, errors.New("-m (refractive index) is required")
	}
	m, err := parseIndex("-m", a.m)
	if err != nil {
		return nil, err
	}
	coated := a.coreM != ""
	var mc complex128
	if coated {
		if mc, err = parseIndex("-core-m", a.coreM); err != nil {
			return nil, err
		}
	}
	var x, xc float64
	var wavelength, medium float64
	switch {
	case a.x != "" && a.d != "":
		return nil, errors.New("give either -x or -d, not both")
	case a.x != "":
		if x, err = strconv.ParseFloat(a.x, 64); err != nil {
			return nil, fmt.Errorf("-x: %q is not a number", a.x)
		}
		if coated {
			if a.coreX == "" {
				return nil, errors.New("-core-x is required with -x and -core-m")
			}
			if xc, err = strconv.ParseFloat(a.coreX, 64); err != nil {
				return nil, fmt.Errorf("-core-x: %q is not a number", a.coreX)
			}
		}
	case a.d != "":
		d, err := spec.ParseQuantity(a.d, "particle diameter")
		if err != nil {
			return nil, fmt.Errorf("-d: %v", err)
		}
		if a.wavelength == "" {
			return nil, errors.New("-wavelength is required with -d")
		}
		if wavelength, err = spec.ParseQuantity(a.wavelength, "wavelength"); err != nil {
			return nil, fmt.Errorf("-wavelength: %v", err)
		}
		if medium, err = strconv.ParseFloat(a.medium, 64); err != nil || !(medium > 0) || math.IsInf(medium, 0) {
			return nil, fmt.Errorf("-medium: %q must be a positive real refractive index", a.medium)
		}
		x = mie.SizeParameter(d, wavelength, medium)
		m /= complex(medium, 0)
		if coated {
			if a.coreD == "" {
				return nil, errors.New("-core-d is required with -d and -core-m")
			}
			dc, err := spec.ParseQuantity(a.coreD, "particle diameter")
			if err != nil {
				return nil, fmt.Errorf("-core-d: %v", err)
			}
			xc = mie.SizeParameter(dc, wavelength, medium)
			mc /= complex(medium, 0)
		}
	default:
		return nil, errors.New("give the size as -x or as -d with -wavelength")
	}
	var s mie.Solver
	var e mie.Efficiencies
	if coated {
		e, err = s.Coated(xc, x, mc, m)
	} else {
		e, err = s.Sphere(x, m)
	}
	if err != nil {
		return nil, err
	}
	e.Qbb = s.BackHemisphere()

	r := &sphereResult{X: x, M: fmt.Sprint(m)}
	if coated {
		r.CoreX, r.CoreM = xc, fmt.Sprint(mc)
	}
	rows := []struct {
		key, label, unit string
		v                float64
	}{
		{"size_parameter", "size parameter x", "1", x},
		{"Qext", "extinction efficiency Qext", "1", e.Qext},
		{"Qsca", "scattering efficiency Qsca", "1", e.Qsca},
		{"Qabs", "absorption efficiency Qabs", "1", e.Qabs},
		{"Qback", "radar backscattering efficiency Qback (180°)", "1", e.Qback},
		{"Qbb", "hemispherical backscattering efficiency Qbb (90–180°)", "1", e.Qbb},
		{"backscattering_ratio", "backscattering ratio Qbb/Qsca", "1", e.BackscatteringRatio()},
		{"g", "asymmetry parameter g", "1", e.G},
		{"single_scattering_albedo", "single-scattering albedo Qsca/Qext", "1", e.Qsca / e.Qext},
		{"terms", "series terms", "1", float64(e.Terms)},
	}
	if coated {
		rows = append(rows[:1], append([]struct {
			key, label, unit string
			v                float64
		}{{"core_size_parameter", "core size parameter", "1", xc}}, rows[1:]...)...)
	}
	if a.d != "" {
		geo := math.Pi * math.Pow(x*wavelength/(2*math.Pi*medium), 2)
		rows = append(rows,
			struct {
				key, label, unit string
				v                float64
			}{"Cext", "extinction cross-section", "m2", e.Qext * geo},
			struct {
				key, label, unit string
				v                float64
			}{"Cbb", "hemispherical backscattering cross-section", "m2", e.Qbb * geo})
	}
	r.Eff = map[string]any{}
	r.effTable = &table.Table{
		Title:   "sphere: relative index m = " + r.M,
		Columns: []table.Column{{Name: "quantity"}, {Name: "key"}, {Name: "value"}, {Name: "unit"}},
	}
	for _, row := range rows {
		r.Eff[row.key] = row.v
		r.effTable.Add(row.label, row.key, row.v, row.unit)
	}
	if a.angles != "" {
		if err := r.addAngles(&s, a, e, wavelength, medium); err != nil {
			return nil, err
		}
	}
	return r, nil
}

func (r *sphereResult) addAngles(s *mie.Solver, a sphereArgs, e mie.Efficiencies, wavelength, medium float64) error {
	var deg []float64
	for _, f := range strings.Split(a.angles, ",") {
		v, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
		if err != nil || v < 0 || v > 180 {
			return fmt.Errorf("-angles: %q must be a number in [0, 180] degrees", f)
		}
		deg = append(deg, v)
	}
	var number float64
	if a.number != "" {
		var err error
		number, err = strconv.ParseFloat(a.number, 64)
		if err != nil || number < 0 || math.IsInf(number, 0) {
			return fmt.Errorf("-number: %q must be a non-negative number of particles per m³", a.number)
		}
		if a.d == "" {
			return errors.New("-number needs -d and -wavelength (the VSF needs a wavelength)")
		}
	}
	mu := make([]float64, len(deg))
	for i, d := range deg {
		mu[i] = math.Cos(d * math.Pi / 180)
	}
	s1 := make([]complex128, len(mu))
	s2 := make([]complex128, len(mu))
	el := make([]mie.Element, len(mu))
	p := make([]float64, len(mu))
	s.Amplitudes(mu, s1, s2)
	s.Matrix(mu, el)
	s.PhaseFunction(mu, p)
	cols := []table.Column{{Name: "angle", Unit: "deg"}, {Name: "Re_S1", Unit: "1"}, {Name: "Im_S1", Unit: "1"}, {Name: "Re_S2", Unit: "1"}, {Name: "Im_S2", Unit: "1"},
		{Name: "S11", Unit: "1"}, {Name: "S12", Unit: "1"}, {Name: "S33", Unit: "1"}, {Name: "S34", Unit: "1"}, {Name: "phase_function", Unit: "sr-1"}}
	var beta []float64
	if a.number != "" {
		beta = make([]float64, len(mu))
		s.VolumeScattering(mu, number, wavelength, medium, beta)
		cols = append(cols, table.Column{Name: "vsf", Unit: "m-1 sr-1"})
	}
	r.angleTable = &table.Table{Title: "angular scattering (BH 1983 convention, exp(-iωt))", Columns: cols}
	for i := range mu {
		row := []any{deg[i], real(s1[i]), imag(s1[i]), real(s2[i]), imag(s2[i]), el[i].S11, el[i].S12, el[i].S33, el[i].S34, p[i]}
		if beta != nil {
			row = append(row, beta[i])
		}
		r.angleTable.Add(row...)
		obj := map[string]any{}
		for k, c := range cols {
			obj[c.Name] = row[k]
		}
		r.Angles = append(r.Angles, obj)
	}
	return nil
}

func (r *sphereResult) write(w io.Writer, f table.Format) error {
	if f == table.JSON {
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		return enc.Encode(r)
	}
	if err := r.effTable.Write(w, f); err != nil {
		return err
	}
	if r.angleTable != nil {
		fmt.Fprintln(w)
		return r.angleTable.Write(w, f)
	}
	return nil
}
