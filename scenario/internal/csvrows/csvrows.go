// Package csvrows scans the small numeric tables murk embeds (published data
// with their provenance in '#' comment lines): it yields each data row's
// comma-separated fields with its line number, skipping blank lines,
// comment lines and the one header row.
package csvrows

import (
	"bufio"
	"bytes"
	"iter"
	"strings"
)

// Rows yields the data rows of data as comma-separated fields (not
// trimmed), with the 1-based line number in the file. Blank lines, lines
// starting with '#' and the first remaining row (the column header) are
// skipped. A line longer than bufio.MaxScanTokenSize ends the sequence;
// callers check Err afterwards for that.
func Rows(data []byte) iter.Seq2[int, []string] {
	return func(yield func(int, []string) bool) {
		sc := bufio.NewScanner(bytes.NewReader(data))
		header := true
		line := 0
		for sc.Scan() {
			line++
			t := strings.TrimSpace(sc.Text())
			if t == "" || strings.HasPrefix(t, "#") {
				continue
			}
			if header {
				header = false
				continue
			}
			if !yield(line, strings.Split(t, ",")) {
				return
			}
		}
	}
}

// Err reports whether data has a line too long for Rows to scan.
func Err(data []byte) error {
	sc := bufio.NewScanner(bytes.NewReader(data))
	for sc.Scan() {
	}
	return sc.Err()
}
