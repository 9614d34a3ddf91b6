package main

import (
	"flag"
	"fmt"
	"io"
	"strconv"
	"strings"

	"github.com/murk-optics/murk/floc"
	"github.com/murk-optics/murk/floc/optics"
	"github.com/murk-optics/murk/scenario/table"
)

func init() {
	register(command{
		name:    "floc",
		summary: "print floc structure, settling velocity and optics per unit mass",
		run:     runFloc,
	})
}

func runFloc(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("floc", flag.ContinueOnError)
	fs.SetOutput(stderr)
	primary := fs.Float64("primary-um", 4, "primary particle diameter, µm")
	gsd := fs.Float64("primary-gsd", floc.DefaultPrimaryGSD, "geometric standard deviation of the log-normal primary sizes (1: identical primaries; -primary-um is then their Sauter diameter)")
	density := fs.Float64("density", 2650, "primary grain density, kg m-3")
	df := fs.Float64("df", 2, "fractal dimension n_f, in (1, 3]")
	sizes := fs.String("sizes-um", "10,30,100,300,1000", "comma-separated floc diameters, µm")
	waves := fs.String("wavelengths-nm", "443,555,670", "comma-separated vacuum wavelengths, nm")
	n := fs.Float64("n", 1.17, "real part of the primary index relative to water")
	k := fs.Float64("k", 0.0003, "imaginary part of the primary index relative to water (≥ 0 absorbing)")
	nw := fs.Float64("water-index", 1.34, "refractive index of water")
	sal := fs.Float64("salinity", 30, "salinity for settling, PSU")
	temp := fs.Float64("temperature", 15, "temperature for settling, °C")
	conc := fs.Float64("concentration", 0, "sediment concentration for hindered settling, kg m-3 (with -hindered)")
	hindered := fs.Float64("hindered", 0, "Richardson–Zaki exponent for hindered settling (0: off)")
	method := fs.String("method", "composite", "optics method: "+strings.Join(optics.MethodNames, ", "))
	format := fs.String("format", "table", "output format: table, csv or json")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: murk floc [flags]\n\nStructure (Kranenburg 1994), settling velocity (Winterwerp 1998) and optics per unit dry mass of flocs.\n\nflags:")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		if err == flag.ErrHelp {
			return exitOK
		}
		return exitUsage
	}
	if fs.NArg() > 0 {
		fmt.Fprintf(stderr, "murk floc: unexpected arguments %q\n", fs.Args())
		return exitUsage
	}
	fail := func(err error) int {
		fmt.Fprintln(stderr, "murk floc:", err)
		return exitInvalid
	}
	f, err := table.ParseFormat(*format)
	if err != nil {
		return fail(err)
	}
	sizesUm, err := parseList("sizes-um", *sizes)
	if err != nil {
		return fail(err)
	}
	wavesNm, err := parseList("wavelengths-nm", *waves)
	if err != nil {
		return fail(err)
	}
	m, err := optics.ParseMethod(*method)
	if err != nil {
		return fail(err)
	}
	fr := floc.Fractal{PrimaryDiameter: *primary * 1e-6, PrimaryDensity: *density, Dimension: *df, PrimaryGSD: *gsd}
	if err := fr.Validate(); err != nil {
		return fail(err)
	}
	st := floc.Settling{Shape: 1, HinderedExponent: *hindered}
	rho, err := floc.WaterDensity(*sal, *temp)
	if err != nil {
		return fail(err)
	}
	t := table.Table{
		Title: fmt.Sprintf("flocs of %g µm primaries (σ_g = %g), n_f = %g, method %s", *primary, fr.PrimarySpread(), *df, m.Name()),
		Columns: []table.Column{
			{Name: "diameter", Unit: "um"}, {Name: "primaries", Unit: "1"}, {Name: "solid_fraction", Unit: "1"}, {Name: "excess_density", Unit: "kg m-3"},
			{Name: "settling_velocity", Unit: "mm s-1"}, {Name: "wavelength", Unit: "nm"},
			{Name: "attenuation_per_mass", Unit: "m2 g-1"}, {Name: "scattering_per_mass", Unit: "m2 g-1"}, {Name: "absorption_per_mass", Unit: "m2 g-1"},
			{Name: "backscattering_per_mass", Unit: "m2 g-1"}, {Name: "backscattering_ratio", Unit: "1"}, {Name: "phase_shift", Unit: "1"},
		},
	}
	var ws optics.Workspace
	for _, dUm := range sizesUm {
		d := dUm * 1e-6
		a, err := fr.Aggregate(d, rho)
		if err != nil {
			return fail(err)
		}
		w, err := st.Velocity(fr, d, *sal, *temp, *conc)
		if err != nil {
			return fail(err)
		}
		for _, lNm := range wavesNm {
			l := lNm * 1e-9
			p := optics.Problem{Fractal: fr, Diameter: d, Wavelength: l, MediumIndex: *nw, Index: complex(*n, *k)}
			cs, err := m.Evaluate(&ws, p, nil, nil)
			if err != nil {
				return fail(err)
			}
			ms, err := cs.PerMass(a.DryMass)
			if err != nil {
				return fail(err)
			}
			ratio := 0.0
			if cs.Scattering > 0 {
				ratio = cs.Backscattering / cs.Scattering
			}
			if err := t.Add(dUm, a.Primaries, a.SolidFraction, a.ExcessDensity, w*1e3, lNm,
				ms.Attenuation/1e3, ms.Scattering/1e3, ms.Absorption/1e3, ms.Backscattering/1e3, ratio, cs.PhaseShift); err != nil {
				fmt.Fprintln(stderr, "murk floc:", err)
				return exitFailure
			}
		}
	}
	if err := t.Write(stdout, f); err != nil {
		fmt.Fprintln(stderr, "murk floc:", err)
		return exitFailure
	}
	return exitOK
}

// parseList reads comma-separated numbers.
func parseList(flagName, s string) ([]float64, error) {
	var out []float64
	for _, f := range strings.Split(s, ",") {
		f = strings.TrimSpace(f)
		if f == "" {
			continue
		}
		v, err := strconv.ParseFloat(f, 64)
		if err != nil {
			return nil, fmt.Errorf("-%s: %q is not a number", flagName, f)
		}
		out = append(out, v)
	}
	if len(out) == 0 {
		return nil, fmt.Errorf("-%s: empty list", flagName)
	}
	return out, nil
}
