package seen

import (
	_ "embed"
	"fmt"
	"strconv"
	"strings"

	"github.com/murk-optics/murk/scenario/internal/csvrows"
)

// The tables below are published measured or standard values, embedded with
// their provenance headers (the lines starting with '#' in each file).

//go:embed data/chi_p_sullivan2013.csv
var chiCSV []byte

//go:embed data/cie1931_2deg_cmf_5nm.csv
var cmfCSV []byte

//go:embed data/fu_dominant_wavelength_thresholds.csv
var fuCSV []byte

// chiTable is χ_p(θ) of Sullivan et al. (2013), θ in degrees.
var chiTable = mustTable(chiCSV, 3)

// cmfTable is the CIE 1931 2° observer on a 5 nm grid, 360–830 nm.
var cmfTable = mustTable(cmfCSV, 4)

// fuUpper holds the inclusive upper dominant-wavelength limit (nm) of each
// Forel-Ule class 1..21; fuLower[0] is the exclusive lower limit of class 1.
var fuLower, fuUpper = mustFU(fuCSV)

const (
	cmfFirstNM = 360.0 // first wavelength of cmfTable, nm
	cmfStepNM  = 5.0   // grid step of cmfTable, nm
)

// mustTable parses a numeric CSV with '#' comment lines and one header row.
// The tables are embedded at build time, so a parse failure is a programming
// error and panics at package initialisation.
func mustTable(data []byte, cols int) [][]float64 {
	out := make([][]float64, cols)
	for line, f := range csvrows.Rows(data) {
		if len(f) < cols {
			panic(fmt.Sprintf("seen: embedded table line %d: %d fields, want %d", line, len(f), cols))
		}
		for j := 0; j < cols; j++ {
			v, err := strconv.ParseFloat(strings.TrimSpace(f[j]), 64)
			if err != nil {
				panic(fmt.Sprintf("seen: embedded table line %d: %v", line, err))
			}
			out[j] = append(out[j], v)
		}
	}
	return out
}

// mustFU parses the Forel-Ule threshold table (class, lower nm, upper nm),
// panicking like mustTable on a malformed embedded file.
func mustFU(data []byte) (lower, upper []float64) {
	for _, f := range csvrows.Rows(data) {
		cls, err1 := strconv.Atoi(f[0])
		lo, err2 := strconv.ParseFloat(f[1], 64)
		hi, err3 := strconv.ParseFloat(f[2], 64)
		if err1 != nil || err2 != nil || err3 != nil || cls != len(upper)+1 {
			panic("seen: embedded Forel-Ule table is malformed at class " + f[0])
		}
		lower = append(lower, lo)
		upper = append(upper, hi)
	}
	return lower, upper
}
