package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/spec"
)

func init() {
	register(command{
		name:    "estuary",
		summary: "run the estuary model alone and write its state as CSV",
		run:     runEstuary,
	})
}

const estuaryHelp = `usage: murk estuary file.yaml [-out file.csv]

Runs the two-layer estuary model of an estuary document (the geometry, river,
tide, ocean, closures, sediment_classes and run sections of a scenario) and
writes the state at every output time, cell and layer as CSV with units in the
header (to stdout without -out). Prints the regime, salt intrusion and
turbidity maximum of the last output to stderr.
`

func runEstuary(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("estuary", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() { fmt.Fprint(stderr, estuaryHelp); fs.PrintDefaults() }
	out := fs.String("out", "", "CSV file to write (default stdout)")
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK
		}
		return exitUsage
	}
	if len(pos) != 1 {
		fmt.Fprintln(stderr, "murk estuary: want exactly one estuary file")
		return exitUsage
	}
	e, err := spec.LoadEstuary(pos[0])
	if err != nil {
		return reportLoadError("estuary", err, stderr)
	}
	er, err := scenario.RunEstuary(context.Background(), e, scenario.Options{})
	if err != nil {
		fmt.Fprintf(stderr, "murk estuary: %v\n", err)
		return exitFailure
	}
	t := er.Table()
	if *out == "" {
		err = t.WriteCSV(stdout)
	} else {
		err = scenario.WriteTable(*out, t)
	}
	if err != nil {
		fmt.Fprintf(stderr, "murk estuary: %v\n", err)
		return exitFailure
	}
	fmt.Fprint(stderr, er.Describe())
	return exitOK
}
