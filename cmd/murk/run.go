package main

import (
	"io"

	"github.com/murk-optics/murk/scenario/spec"
)

func init() {
	register(command{
		name:    "run",
		summary: "run a scenario: estuary, flocs and optics from river to sea",
		run:     runRun,
	})
}

const runHelp = `usage: murk run scenario.yaml [-out DIR] [-quiet]

Runs the scenario end to end (estuary model coupled to the floc model,
optical kernels once per population, IOPs at every station, layer and output
time, and the along-channel section at every model cell), writes the products
it asks for into DIR (default: the scenario's outputs.directory, relative to
the file) and prints the summary.
Exit status 3 if the scenario is invalid, 1 if the run fails.
`

func runRun(args []string, stdout, stderr io.Writer) int {
	c := newCLI("run", runHelp, stderr)
	out := c.fs.String("out", "", "output directory (overrides outputs.directory)")
	quiet := c.fs.Bool("quiet", false, "do not print the summary")
	s, _, code, ok := loadOne(c, args, "scenario file", spec.Load)
	if !ok {
		return code
	}
	dir := *out
	if dir == "" {
		dir = s.Outputs.Directory
	}
	return c.runScenario(s, dir, !*quiet, stdout)
}
