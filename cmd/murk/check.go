package main

import (
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
	c := newCLI("check", checkHelp, stderr)
	s, path, code, ok := loadOne(c, args, "scenario file", spec.Load)
	if !ok {
		return code
	}
	// The estuary model's own checks (e.g. stability limits) come after
	// the file's; they name model fields, not file positions.
	if _, err := scenario.EstuaryConfig(s.Estuary); err != nil {
		fmt.Fprintf(stderr, "%s: %v\n", path, err)
		return exitInvalid
	}
	fmt.Fprintf(stdout, "%s: valid\n", path)
	est := spec.Estimate(s).String()
	fmt.Fprint(stdout, est)
	if !strings.HasSuffix(est, "\n") {
		fmt.Fprintln(stdout)
	}
	return exitOK
}
