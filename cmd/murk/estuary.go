package main

import (
	"context"
	"fmt"
	"io"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/products"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
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
	c := newCLI("estuary", estuaryHelp, stderr)
	out := c.fs.String("out", "", "CSV file to write (default stdout)")
	e, _, code, ok := loadOne(c, args, "estuary file", spec.LoadEstuary)
	if !ok {
		return code
	}
	er, err := scenario.RunEstuary(context.Background(), e, scenario.Options{})
	if err != nil {
		return c.fail(err)
	}
	if code := c.writeTable(products.EstuaryTable(er), *out, table.CSV, stdout); code != exitOK {
		return code
	}
	fmt.Fprint(stderr, er.Describe())
	return exitOK
}
