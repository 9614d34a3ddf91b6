// Package table holds small column-oriented result tables whose columns carry
// a name and a unit, and writes them as aligned text, CSV or JSON. Every murk
// subcommand that prints numbers goes through it, so units appear the same
// way everywhere: CSV headers read "name [unit]", JSON objects carry a
// "units" map beside the rows.
package table

import (
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"
)

// Column describes one column. Unit is a UDUNITS-style string ("m-1",
// "m2 g-1", "1" for dimensionless); leave it empty for text columns and for
// columns without a single unit.
type Column struct {
	Name string
	Unit string
}

// Table is a list of rows under a header. Cells are float64 or string.
type Table struct {
	Title   string // optional, printed above text output
	Columns []Column
	Rows    [][]any
}

// Add appends a row; it returns an error if the row length does not match.
func (t *Table) Add(cells ...any) error {
	if len(cells) != len(t.Columns) {
		return fmt.Errorf("table: row has %d cells, header has %d", len(cells), len(t.Columns))
	}
	for i, c := range cells {
		switch c.(type) {
		case float64, string, int:
		default:
			return fmt.Errorf("table: column %q: unsupported cell type %T", t.Columns[i].Name, c)
		}
	}
	t.Rows = append(t.Rows, cells)
	return nil
}

// Format names an output format.
type Format string

// The output formats.
const (
	Text Format = "table"
	CSV  Format = "csv"
	JSON Format = "json"
)

// ParseFormat accepts "table", "csv" or "json".
func ParseFormat(s string) (Format, error) {
	switch Format(s) {
	case Text, CSV, JSON:
		return Format(s), nil
	}
	return "", fmt.Errorf("unknown output format %q (allowed: table, csv, json)", s)
}

// Write writes t in format f.
func (t *Table) Write(w io.Writer, f Format) error {
	switch f {
	case CSV:
		return t.WriteCSV(w)
	case JSON:
		return t.WriteJSON(w)
	default:
		return t.WriteText(w)
	}
}

func header(c Column) string {
	if c.Unit == "" {
		return c.Name
	}
	return c.Name + " [" + c.Unit + "]"
}

// cell formats a value with enough digits to round-trip to 7 significant
// figures in text and full precision in CSV.
func cell(v any, full bool) string {
	switch x := v.(type) {
	case string:
		return x
	case int:
		return strconv.Itoa(x)
	case float64:
		if math.IsNaN(x) {
			return "NaN"
		}
		if full {
			return strconv.FormatFloat(x, 'g', -1, 64)
		}
		return strconv.FormatFloat(x, 'g', 7, 64)
	}
	return fmt.Sprint(v)
}

// WriteText writes an aligned, human-readable table: numbers right-aligned,
// text left-aligned, units in the header. Widths count runes, not bytes.
func (t *Table) WriteText(w io.Writer) error {
	n := len(t.Columns)
	width := make([]int, n)
	heads := make([]string, n)
	numeric := make([]bool, n)
	for i, c := range t.Columns {
		heads[i] = header(c)
		width[i] = utf8.RuneCountInString(heads[i])
		if len(t.Rows) > 0 {
			_, isText := t.Rows[0][i].(string)
			numeric[i] = !isText
		}
	}
	cells := make([][]string, len(t.Rows))
	for r, row := range t.Rows {
		cells[r] = make([]string, n)
		for i, v := range row {
			s := cell(v, false)
			cells[r][i] = s
			width[i] = max(width[i], utf8.RuneCountInString(s))
		}
	}
	var b strings.Builder
	if t.Title != "" {
		b.WriteString(t.Title)
		b.WriteByte('\n')
	}
	line := func(vals []string) {
		for i, s := range vals {
			if i > 0 {
				b.WriteString("  ")
			}
			pad := strings.Repeat(" ", width[i]-utf8.RuneCountInString(s))
			switch {
			case numeric[i]:
				b.WriteString(pad + s)
			case i == n-1:
				b.WriteString(s)
			default:
				b.WriteString(s + pad)
			}
		}
		b.WriteByte('\n')
	}
	line(heads)
	for _, row := range cells {
		line(row)
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// WriteCSV writes RFC 4180 CSV with a header row of "name [unit]".
func (t *Table) WriteCSV(w io.Writer) error {
	cw := csv.NewWriter(w)
	heads := make([]string, len(t.Columns))
	for i, c := range t.Columns {
		heads[i] = header(c)
	}
	if err := cw.Write(heads); err != nil {
		return err
	}
	rec := make([]string, len(t.Columns))
	for _, row := range t.Rows {
		for i, v := range row {
			rec[i] = cell(v, true)
		}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// WriteJSON writes {"title":…, "units":{name:unit}, "rows":[{name:value}]}.
// Object keys keep the column order. NaN is written as null.
func (t *Table) WriteJSON(w io.Writer) error {
	var b strings.Builder
	b.WriteString("{\n")
	if t.Title != "" {
		b.WriteString(`  "title": ` + quote(t.Title) + ",\n")
	}
	b.WriteString(`  "units": {`)
	first := true
	for _, c := range t.Columns {
		if c.Unit == "" {
			continue
		}
		if !first {
			b.WriteString(", ")
		}
		first = false
		b.WriteString(quote(c.Name) + ": " + quote(c.Unit))
	}
	b.WriteString("},\n  \"rows\": [")
	for r, row := range t.Rows {
		if r > 0 {
			b.WriteByte(',')
		}
		b.WriteString("\n    {")
		for i, v := range row {
			if i > 0 {
				b.WriteString(", ")
			}
			b.WriteString(quote(t.Columns[i].Name) + ": ")
			switch x := v.(type) {
			case string:
				b.WriteString(quote(x))
			case float64:
				if math.IsNaN(x) || math.IsInf(x, 0) {
					b.WriteString("null")
				} else {
					b.WriteString(strconv.FormatFloat(x, 'g', -1, 64))
				}
			default:
				b.WriteString(cell(v, true))
			}
		}
		b.WriteByte('}')
	}
	b.WriteString("\n  ]\n}\n")
	_, err := io.WriteString(w, b.String())
	return err
}

func quote(s string) string {
	q, _ := json.Marshal(s)
	return string(q)
}
