package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"strings"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/spec"
)

func init() {
	register(command{
		name:    "check",
		summary: "validate a scenario without running it and estimate its cost",
		run:     runCheck,
	})
}

const checkHelp = `usage: murk check scenario.yaml

Validates the scenario (every problem is listed as file:line:column: path:
value: problem (allowed: range)) and, if it is valid, prints a rough cost
estimate. Exit status 0 if valid, 3 if not, 1 if the file cannot be read.
`

func runCheck(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("check", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() { fmt.Fprint(stderr, checkHelp); fs.PrintDefaults() }
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK
		}
		return exitUsage
	}
	if len(pos) != 1 {
		fmt.Fprintln(stderr, "murk check: want exactly one scenario file")
		return exitUsage
	}
	s, err := spec.Load(pos[0])
	if err != nil {
		return reportLoadError("check", err, stderr)
	}
	// The estuary model's own checks (e.g. stability limits) come after
	// the file's; they name model fields, not file positions.
	if _, err := scenario.EstuaryConfig(s.Estuary); err != nil {
		fmt.Fprintf(stderr, "%s: %v\n", pos[0], err)
		return exitInvalid
	}
	fmt.Fprintf(stdout, "%s: valid\n", pos[0])
	est := spec.Estimate(s).String()
	fmt.Fprint(stdout, est)
	if !strings.HasSuffix(est, "\n") {
		fmt.Fprintln(stdout)
	}
	return exitOK
}
