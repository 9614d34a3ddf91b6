package spec

import (
	"fmt"
	"strings"
)

// Error is one problem found in a scenario document. Every field is filled
// where it applies; Error() formats it as
//
//	file:line:column: path: value "v": problem (allowed: range)
type Error struct {
	File    string // file name as given to the loader
	Line    int    // 1-based line of the offending node (0 if unknown)
	Column  int    // 1-based column of the offending node (0 if unknown)
	Path    string // field path, e.g. populations[1].size.median
	Value   string // the value as written ("" for a missing key)
	Problem string // what is wrong
	Allowed string // allowed range with its unit, or allowed values
}

func (e *Error) Error() string {
	var b strings.Builder
	if e.Column > 0 {
		fmt.Fprintf(&b, "%s:%d:%d: ", e.File, e.Line, e.Column)
	} else {
		fmt.Fprintf(&b, "%s:%d: ", e.File, e.Line) // YAML syntax errors have no column
	}
	if e.Path != "" {
		b.WriteString(e.Path)
		b.WriteString(": ")
	}
	if e.Value != "" {
		fmt.Fprintf(&b, "value %q: ", e.Value)
	}
	b.WriteString(e.Problem)
	if e.Allowed != "" {
		fmt.Fprintf(&b, " (allowed: %s)", e.Allowed)
	}
	return b.String()
}

// ErrorList is every problem found in one document, in document order. A
// loader returns a non-empty ErrorList (as error) or nil.
type ErrorList []*Error

func (l ErrorList) Error() string {
	switch len(l) {
	case 0:
		return "no errors"
	case 1:
		return l[0].Error()
	}
	var b strings.Builder
	fmt.Fprintf(&b, "%d problems:", len(l))
	for _, e := range l {
		b.WriteString("\n")
		b.WriteString(e.Error())
	}
	return b.String()
}

// Unwrap lets errors.As find an individual *Error.
func (l ErrorList) Unwrap() []error {
	out := make([]error, len(l))
	for i, e := range l {
		out[i] = e
	}
	return out
}
