package main

import (
	"context"
	"io"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/products"
	"github.com/murk-optics/murk/scenario/spec"
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
	c := newCLI("mixture", mixtureHelp, stderr)
	format := c.formatFlag()
	m, _, code, ok := loadOne(c, args, "mixture file", spec.LoadMixture)
	if !ok {
		return code
	}
	mr, err := scenario.Mixture(context.Background(), m, scenario.Options{})
	if err != nil {
		return c.fail(err)
	}
	return c.writeTable(products.MixtureTable(mr), "", *format, stdout)
}
