package main

import (
	"errors"
	"flag"
	"fmt"
	"io"

	"github.com/murk-optics/murk/scenario/demo"
)

func init() {
	register(command{
		name:    "demo",
		summary: "run the embedded Quell estuary demo and print its summary",
		run:     runDemo,
	})
}

const demoHelp = `usage: murk demo [-out DIR] [-print]

Runs murk's embedded demonstration scenario, a partially mixed estuary in the
fictional Quell estuary, and prints its summary: how backscattering, its
spectral slope and the backscattering ratio change from river to sea, where the
turbidity maximum is and why. With -out, the products (CSV tables, summary,
NetCDF, figures) are written into DIR. -print writes the scenario's YAML to
stdout instead, as a starting point for your own.
`

func runDemo(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("demo", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() { fmt.Fprint(stderr, demoHelp); fs.PrintDefaults() }
	out := fs.String("out", "", "output directory (default: no files, summary only)")
	print := fs.Bool("print", false, "print the demo scenario YAML and exit")
	if err := fs.Parse(args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK
		}
		return exitUsage
	}
	if fs.NArg() > 0 {
		fmt.Fprintf(stderr, "murk demo: unexpected argument %q\n", fs.Arg(0))
		return exitUsage
	}
	if *print {
		if _, err := stdout.Write(demo.Source()); err != nil {
			return exitFailure
		}
		return exitOK
	}
	s, err := demo.Scenario()
	if err != nil {
		return reportLoadError("demo", err, stderr)
	}
	return runScenario("demo", s, *out, true, stdout, stderr)
}
