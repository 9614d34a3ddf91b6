package water

import (
	_ "embed"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"github.com/murk-optics/murk/scenario/internal/csvrows"
)

// The embedded tables keep the provenance lines ('#' comments) of the copies
// in the project's shared research data.
var (
	//go:embed data/pope_fry_1997.csv
	popeFryCSV []byte
	//go:embed data/morel2007_table2a.csv
	morel2007CSV []byte
	//go:embed data/segelstein_1981_nk_650_1000nm.csv
	segelsteinCSV []byte
)

// Table is a tabulated spectrum with linear interpolation between nodes.
// The zero value is an empty table; use the package's published tables.
type Table struct {
	Source string    // citation of the table
	nm     []float64 // wavelengths, nm, strictly increasing
	v      []float64 // tabulated quantity at nm
	// imag marks a table of the imaginary index k: At returns 4πk/λ.
	imag bool
}

// Range returns the first and last tabulated wavelengths, in metres.
func (t *Table) Range() (lo, hi float64) {
	return t.nm[0] * 1e-9, t.nm[len(t.nm)-1] * 1e-9
}

// Len returns the number of tabulated nodes.
func (t *Table) Len() int { return len(t.nm) }

// Node returns the i-th tabulated wavelength (m) and absorption (m⁻¹).
func (t *Table) Node(i int) (lambda, a float64) {
	nm := t.nm[i]
	if t.imag {
		return nm * 1e-9, 4 * math.Pi * t.v[i] / (nm * 1e-9)
	}
	return nm * 1e-9, t.v[i]
}

// At returns the absorption coefficient (m⁻¹) at vacuum wavelength lambda
// (m), interpolated linearly between tabulated nodes (for a table of the
// imaginary index k, k is interpolated and a = 4πk/λ). It returns a
// *RangeError outside the table.
func (t *Table) At(lambda float64) (float64, error) {
	lo, hi := t.nm[0], t.nm[len(t.nm)-1]
	if err := checkWavelength("wavelength", lambda, lo, hi); err != nil {
		return 0, fmt.Errorf("%w (table: %s)", err, t.Source)
	}
	return t.at(toNM(lambda)), nil
}

// at interpolates at nm, which the caller has checked is inside the table.
func (t *Table) at(nm float64) float64 {
	i := sort.SearchFloat64s(t.nm, nm) // first node ≥ nm
	var v float64
	switch {
	case i < len(t.nm) && t.nm[i] == nm:
		v = t.v[i]
	case i == 0:
		v = t.v[0]
	case i >= len(t.nm):
		v = t.v[len(t.nm)-1]
	default:
		x0, x1 := t.nm[i-1], t.nm[i]
		w := (nm - x0) / (x1 - x0)
		v = t.v[i-1] + w*(t.v[i]-t.v[i-1])
	}
	if t.imag {
		return 4 * math.Pi * v / (nm * 1e-9)
	}
	return v
}

// parseTable reads a CSV whose '#' lines are comments and whose first other
// line is a header. It returns columns xcol and ycol of the data rows.
func parseTable(name string, data []byte, xcol, ycol int) (x, y []float64, err error) {
	for line, f := range csvrows.Rows(data) {
		if len(f) <= xcol || len(f) <= ycol {
			return nil, nil, fmt.Errorf("water: %s line %d: want at least %d columns, have %d", name, line, max(xcol, ycol)+1, len(f))
		}
		xv, err1 := strconv.ParseFloat(strings.TrimSpace(f[xcol]), 64)
		yv, err2 := strconv.ParseFloat(strings.TrimSpace(f[ycol]), 64)
		if err1 != nil || err2 != nil {
			return nil, nil, fmt.Errorf("water: %s line %d: bad number in %q", name, line, strings.Join(f, ","))
		}
		if len(x) > 0 && xv <= x[len(x)-1] {
			return nil, nil, fmt.Errorf("water: %s line %d: wavelength %g not increasing", name, line, xv)
		}
		x = append(x, xv)
		y = append(y, yv)
	}
	if err := csvrows.Err(data); err != nil {
		return nil, nil, fmt.Errorf("water: %s: %w", name, err)
	}
	if len(x) < 2 {
		return nil, nil, fmt.Errorf("water: %s: fewer than two rows", name)
	}
	return x, y, nil
}

func mustTable(source, name string, data []byte, xcol, ycol int, xscale float64, imag bool) *Table {
	x, y, err := parseTable(name, data, xcol, ycol)
	if err != nil {
		panic(err) // embedded data: a failure is a build defect
	}
	for i := range x {
		x[i] *= xscale
	}
	return &Table{Source: source, nm: x, v: y, imag: imag}
}

// PopeFry1997 is the pure water absorption of Pope & Fry (1997), Appl. Opt.
// 36(33):8710–8723, 380–727.5 nm on a 2.5 nm grid, m⁻¹. Values above 700 nm
// are in the distributed data set but outside the paper's title range.
var PopeFry1997 = mustTable("Pope & Fry (1997) Appl. Opt. 36:8710", "pope_fry_1997.csv", popeFryCSV, 0, 1, 1, false)

// Morel2007 is the pure water absorption column of Morel et al. (2007),
// Limnol. Oceanogr. 52(1):217–229, Table 2a, 300–500 nm on a 5 nm grid,
// m⁻¹ (Pope & Fry 1997 at and above 420 nm).
var Morel2007 = mustTable("Morel et al. (2007) Limnol. Oceanogr. 52:217, Table 2a", "morel2007_table2a.csv", morel2007CSV, 0, 1, 1, false)

// Segelstein1981 is the imaginary index k of water compiled by Segelstein
// (1981, M.Sc. thesis), 650–920 nm at 25 °C; At returns a = 4πk/λ in m⁻¹.
var Segelstein1981 = mustTable("Segelstein (1981) M.Sc. thesis", "segelstein_1981_nk_650_1000nm.csv", segelsteinCSV, 0, 2, 1000, true)
