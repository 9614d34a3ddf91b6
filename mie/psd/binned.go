package psd

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"sort"
	"strconv"
	"strings"
)

// Class is one size class of a Binned distribution.
type Class struct {
	Lower, Upper float64 // class edges, m, 0 < Lower < Upper
	Volume       float64 // particle volume concentration in the class, m³ m⁻³ (or a relative share), ≥ 0
}

// Binned is a distribution given as volume concentration per size class, the
// way laser-diffraction particle sizers report it. Within a class the volume
// is spread uniformly in ln D (constant dV/d ln D, as sizers plot it), so
// that n(D) = (6/π)·V/ln(Upper/Lower)·D⁻⁴ inside the class. Classes must be
// in increasing order and must not overlap; gaps between them have zero
// density.
type Binned struct {
	Classes []Class
}

// Validate implements Validator.
func (b Binned) Validate() error {
	if len(b.Classes) == 0 {
		return errors.New("psd: Binned has no size classes, want at least 1")
	}
	for i, c := range b.Classes {
		if err := checkRange(fmt.Sprintf("Binned class %d", i+1), c.Lower, c.Upper); err != nil {
			return err
		}
		if !(c.Volume >= 0) || math.IsInf(c.Volume, 0) {
			return fmt.Errorf("psd: Binned class %d Volume = %g m3 m-3, want a finite value ≥ 0", i+1, c.Volume)
		}
		if i > 0 && c.Lower < b.Classes[i-1].Upper*(1-1e-9) {
			return fmt.Errorf("psd: Binned class %d lower edge %g m overlaps class %d (upper edge %g m), want increasing, non-overlapping classes", i+1, c.Lower, i, b.Classes[i-1].Upper)
		}
	}
	return nil
}

// Range implements Distribution.
func (b Binned) Range() (float64, float64) {
	if len(b.Classes) == 0 {
		return 0, 0
	}
	return b.Classes[0].Lower, b.Classes[len(b.Classes)-1].Upper
}

func (c Class) coef() float64 { return 6 / math.Pi * c.Volume / math.Log(c.Upper/c.Lower) }

// Density implements Distribution.
func (b Binned) Density(d float64) float64 {
	i := sort.Search(len(b.Classes), func(i int) bool { return b.Classes[i].Upper >= d })
	if i == len(b.Classes) || d < b.Classes[i].Lower {
		return 0
	}
	c := b.Classes[i]
	return c.coef() / (d * d * d * d)
}

// PartialMoment implements PartialMomenter (closed form per class).
func (b Binned) PartialMoment(k, lo, hi float64) float64 {
	var sum float64
	for _, c := range b.Classes {
		a, z := math.Max(lo, c.Lower), math.Min(hi, c.Upper)
		if z > a {
			sum += c.coef() * powInt(a, z, k-3)
		}
	}
	return sum
}

// diameterUnits and volumeUnits are the units accepted in CSV headers, with
// their factor to SI.
var diameterUnits = map[string]float64{"nm": 1e-9, "um": 1e-6, "mm": 1e-3, "m": 1}

var volumeUnits = map[string]float64{
	"uL/L": 1e-6, "ul/l": 1e-6, "ppmv": 1e-6, "mm3/L": 1e-6, "nL/L": 1e-9, "nl/l": 1e-9, "m3/m3": 1,
	"%": 0.01, // relative shares: normalise the result before use
}

// parseHeader splits "lower (um)" or "lower [um]" or "lower_um" into name
// and unit.
func parseHeader(h string) (name, unit string) {
	h = strings.TrimSpace(h)
	if i := strings.IndexAny(h, "(["); i >= 0 {
		j := strings.LastIndexAny(h, ")]")
		if j > i {
			return strings.ToLower(strings.TrimSpace(h[:i])), normaliseUnit(h[i+1 : j])
		}
	}
	return strings.ToLower(h), ""
}

// ReadCSV reads a Binned distribution from comma-separated text as a
// laser-diffraction sizer exports it. The expected layout:
//
//	# lines starting with # are comments (anywhere)
//	lower (um), upper (um), volume (uL/L)
//	2.50, 2.95, 0.81
//	2.95, 3.48, 1.02
//
// The header row names three columns, in any order and among any others
// (which are ignored): "lower" and "upper", the class edges, with a unit of
// nm, um (µm), mm or m; and "volume", the volume concentration in the class,
// in uL/L (µL/L, ppmv, mm3/L), nL/L or m3/m3, or % for relative shares (the
// result then holds volume fractions summing to the shares and must be
// normalised with Normalize). Units are written in parentheses or brackets.
// Rows must be in increasing size. name labels errors, which read
// "name:line:column (field): problem".
func ReadCSV(r io.Reader, name string) (Binned, error) {
	cr := csv.NewReader(r)
	cr.Comment = '#'
	cr.FieldsPerRecord = -1
	cr.TrimLeadingSpace = true
	header, err := cr.Read()
	if err == io.EOF {
		return Binned{}, fmt.Errorf("%s: no header row, want columns lower, upper, volume", name)
	}
	if err != nil {
		return Binned{}, fmt.Errorf("%s: %w", name, err)
	}
	hline, _ := cr.FieldPos(0)
	col := map[string]int{}
	factor := map[string]float64{}
	for i, h := range header {
		n, u := parseHeader(h)
		var f float64
		var ok bool
		switch n {
		case "lower", "upper":
			if f, ok = diameterUnits[u]; !ok {
				return Binned{}, fmt.Errorf("%s:%d:%d (%s): diameter unit %q unknown, want nm, um, mm or m", name, hline, i+1, n, u)
			}
		case "volume":
			if f, ok = volumeUnits[u]; !ok {
				return Binned{}, fmt.Errorf("%s:%d:%d (%s): volume unit %q unknown, want uL/L, nL/L, mm3/L, ppmv, m3/m3 or %%", name, hline, i+1, n, u)
			}
		default:
			continue
		}
		if _, dup := col[n]; dup {
			return Binned{}, fmt.Errorf("%s:%d:%d: column %q appears twice", name, hline, i+1, n)
		}
		col[n], factor[n] = i, f
	}
	for _, n := range []string{"lower", "upper", "volume"} {
		if _, ok := col[n]; !ok {
			return Binned{}, fmt.Errorf("%s:%d: header lacks column %q, want lower, upper, volume with units, e.g. \"lower (um)\"", name, hline, n)
		}
	}
	var b Binned
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return Binned{}, fmt.Errorf("%s: %w", name, err)
		}
		line, _ := cr.FieldPos(0)
		var v [3]float64
		for j, n := range []string{"lower", "upper", "volume"} {
			c := col[n]
			if c >= len(rec) {
				return Binned{}, fmt.Errorf("%s:%d:%d (%s): missing value, row has %d columns", name, line, c+1, n, len(rec))
			}
			x, perr := strconv.ParseFloat(strings.TrimSpace(rec[c]), 64)
			if perr != nil || math.IsNaN(x) || math.IsInf(x, 0) {
				return Binned{}, fmt.Errorf("%s:%d:%d (%s): value %q is not a finite number", name, line, c+1, n, rec[c])
			}
			if n == "volume" && x < 0 {
				return Binned{}, fmt.Errorf("%s:%d:%d (%s): value %g is negative, want ≥ 0", name, line, c+1, n, x)
			}
			if n != "volume" && !(x > 0) {
				return Binned{}, fmt.Errorf("%s:%d:%d (%s): diameter %g is not positive, want > 0", name, line, c+1, n, x)
			}
			v[j] = x * factor[n]
		}
		if !(v[1] > v[0]) {
			return Binned{}, fmt.Errorf("%s:%d:%d (upper): upper edge %s is not above lower edge %s", name, line, col["upper"]+1, rec[col["upper"]], rec[col["lower"]])
		}
		if k := len(b.Classes); k > 0 && v[0] < b.Classes[k-1].Upper*(1-1e-9) {
			return Binned{}, fmt.Errorf("%s:%d:%d (lower): lower edge %s overlaps the previous class, want rows in increasing size", name, line, col["lower"]+1, rec[col["lower"]])
		}
		b.Classes = append(b.Classes, Class{Lower: v[0], Upper: v[1], Volume: v[2]})
	}
	if len(b.Classes) == 0 {
		return Binned{}, fmt.Errorf("%s: no size classes after the header, want at least 1 row", name)
	}
	return b, nil
}

// ReadCSVFile opens path and calls ReadCSV with path as the name.
func ReadCSVFile(path string) (Binned, error) {
	f, err := os.Open(path)
	if err != nil {
		return Binned{}, fmt.Errorf("psd: %w", err)
	}
	defer f.Close()
	return ReadCSV(f, path)
}
