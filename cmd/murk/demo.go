package main

import (
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
	c := newCLI("demo", demoHelp, stderr)
	out := c.fs.String("out", "", "output directory (default: no files, summary only)")
	print := c.fs.Bool("print", false, "print the demo scenario YAML and exit")
	if _, code, ok := c.parse(args, 0, ""); !ok {
		return code
	}
	if *print {
		if _, err := stdout.Write(demo.Source()); err != nil {
			return c.fail(err)
		}
		return exitOK
	}
	s, err := demo.Scenario()
	if err != nil {
		return c.loadFailed(err)
	}
	return c.runScenario(s, *out, true, stdout)
}
