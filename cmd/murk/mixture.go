package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
)

func init() {
	register(command{
		name:    "mixture",
		summary: "IOP spectra of a water sample: water, CDOM and particle populations",
		run:     runMixture,
	})
}

const mixtureHelp = `usage: murk mixture file.yaml [-format table|csv|json]

Prints the absorption, scattering and backscattering spectra of a water
sample described by a mixture document (the water, populations and optics
sections of a scenario, with the sample's salinity and temperature and every
population's concentration), per component and in total, with units in the
header.
`

func runMixture(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("mixture", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() { fmt.Fprint(stderr, mixtureHelp); fs.PrintDefaults() }
	format := fs.String("format", "table", "output format: table, csv or json")
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK
		}
		return exitUsage
	}
	if len(pos) != 1 {
		fmt.Fprintln(stderr, "murk mixture: want exactly one mixture file")
		return exitUsage
	}
	f, err := table.ParseFormat(*format)
	if err != nil {
		fmt.Fprintf(stderr, "murk mixture: %v\n", err)
		return exitUsage
	}
	m, err := spec.LoadMixture(pos[0])
	if err != nil {
		return reportLoadError("mixture", err, stderr)
	}
	mr, err := scenario.Mixture(context.Background(), m, scenario.Options{})
	if err != nil {
		fmt.Fprintf(stderr, "murk mixture: %v\n", err)
		return exitFailure
	}
	if err := mr.Table().Write(stdout, f); err != nil {
		fmt.Fprintf(stderr, "murk mixture: %v\n", err)
		return exitFailure
	}
	return exitOK
}
