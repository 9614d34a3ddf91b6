package spec

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"gopkg.in/yaml.v3"
)

// decoder walks a yaml.Node tree, building SI values and collecting every
// problem. It never stops at the first error: a reader that fails reports
// and returns ok = false, and its caller carries on with the next field.
type decoder struct {
	file string
	dir  string  // directory for relative paths
	kind docKind // which document is being read
	errs ErrorList
	seen map[Error]bool // reported errors, to report each once
	// pos remembers the node of each decoded path, for cross-field checks
	// made after decoding.
	pos map[string]*yaml.Node
}

func (d *decoder) add(n *yaml.Node, path, value, problem, allowed string) {
	e := &Error{File: d.file, Path: path, Value: value, Problem: problem, Allowed: allowed}
	if n != nil {
		e.Line, e.Column = n.Line, n.Column
	}
	// A value shared by several fields (a closures default merged into
	// every class) is reported once.
	if d.seen[*e] {
		return
	}
	if d.seen == nil {
		d.seen = map[Error]bool{}
	}
	d.seen[*e] = true
	d.errs = append(d.errs, e)
}

// addAt reports a problem at a previously decoded path.
func (d *decoder) addAt(path, problem, allowed string) {
	n := d.pos[path]
	v := ""
	if n != nil && n.Kind == yaml.ScalarNode {
		v = n.Value
	}
	d.add(n, path, v, problem, allowed)
}

func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

func index(path string, i int) string { return fmt.Sprintf("%s[%d]", path, i) }

func kindName(n *yaml.Node) string {
	switch n.Kind {
	case yaml.MappingNode:
		return "a mapping"
	case yaml.SequenceNode:
		return "a list"
	case yaml.AliasNode:
		return "an alias"
	case yaml.DocumentNode:
		return "a document"
	}
	switch n.ShortTag() {
	case "!!null":
		return "an empty value"
	case "!!bool":
		return "a boolean"
	case "!!int", "!!float":
		return "a number"
	}
	return "a string"
}

// usable reports alias nodes, which scenario files do not support (they
// would let a small file expand without bound), and records the position.
func (d *decoder) usable(n *yaml.Node, path string) bool {
	if n == nil {
		return false
	}
	if n.Kind == yaml.AliasNode {
		d.add(n, path, "*"+n.Value, "YAML aliases are not supported in scenario files", "write the value out")
		return false
	}
	d.pos[path] = n
	return true
}

// object is a mapping node with its keys checked.
type object struct {
	d      *decoder
	n      *yaml.Node
	path   string
	values map[string]*yaml.Node
}

// object checks that n is a mapping whose keys are all in allowed and
// unique. Unknown or repeated keys are reported; the returned object is
// always usable (empty on a type error).
func (d *decoder) object(n *yaml.Node, path string, allowed ...string) *object {
	o := &object{d: d, n: n, path: path, values: map[string]*yaml.Node{}}
	if !d.usable(n, path) {
		return o
	}
	if n.Kind != yaml.MappingNode {
		d.add(n, path, scalarValue(n), "wrong type: want a mapping of keys, got "+kindName(n), "keys "+strings.Join(allowed, ", "))
		return o
	}
	for i := 0; i+1 < len(n.Content); i += 2 {
		k, v := n.Content[i], n.Content[i+1]
		if k.Kind != yaml.ScalarNode {
			d.add(k, path, "", "wrong type: a key must be a plain name, got "+kindName(k), strings.Join(allowed, ", "))
			continue
		}
		key := k.Value
		if !contains(allowed, key) {
			d.add(k, join(path, key), key, "unknown key"+suggest(key, allowed), "keys "+strings.Join(allowed, ", "))
			continue
		}
		if _, dup := o.values[key]; dup {
			d.add(k, join(path, key), key, "key given twice", "each key once")
			continue
		}
		o.values[key] = v
	}
	return o
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// suggest proposes a close allowed key for a likely typo.
func suggest(key string, allowed []string) string {
	best, bestD := "", 3
	for _, a := range allowed {
		if dd := editDistance(strings.ToLower(key), a); dd < bestD {
			best, bestD = a, dd
		}
	}
	if best == "" {
		return ""
	}
	return fmt.Sprintf(" (did you mean %q?)", best)
}

func editDistance(a, b string) int {
	if len(a) > 64 || len(b) > 64 {
		return 99
	}
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			c := 1
			if a[i-1] == b[j-1] {
				c = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+c)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}

func scalarValue(n *yaml.Node) string {
	if n != nil && n.Kind == yaml.ScalarNode {
		return n.Value
	}
	return ""
}

// has reports whether key is present.
func (o *object) has(key string) bool { _, ok := o.values[key]; return ok }

// get returns the value of key or nil.
func (o *object) get(key string) *yaml.Node { return o.values[key] }

// req returns the value of key, reporting it missing at the mapping.
func (o *object) req(key, allowed string) *yaml.Node {
	v, ok := o.values[key]
	if !ok {
		o.missing(key, allowed)
		return nil
	}
	return v
}

func (o *object) missing(key, allowed string) {
	if o.n == nil || o.n.Kind != yaml.MappingNode {
		return // the type error was already reported
	}
	o.d.add(o.n, join(o.path, key), "", "missing required key "+key, allowed)
}

func (o *object) at(key string) string { return join(o.path, key) }

// interval is an allowed range of an SI value, printed in a display unit.
type interval struct {
	lo, hi         float64
	loOpen, hiOpen bool
}

func closed(lo, hi float64) interval   { return interval{lo: lo, hi: hi} }
func openLo(lo, hi float64) interval   { return interval{lo: lo, hi: hi, loOpen: true} }
func openBoth(lo, hi float64) interval { return interval{lo: lo, hi: hi, loOpen: true, hiOpen: true} }

// boundarySlack is the relative tolerance at a closed boundary, so that a
// value written at the limit in another unit ("0.9 µm" against 900 nm) is
// not rejected for a rounding error of the unit conversion (float64 unit
// conversions are good to a few ulp).
const boundarySlack = 1e-12

func (r interval) contains(v float64) bool {
	if math.IsNaN(v) {
		return false
	}
	if !r.loOpen && v < r.lo && v >= r.lo-boundarySlack*math.Abs(r.lo) {
		v = r.lo
	}
	if !r.hiOpen && v > r.hi && v <= r.hi+boundarySlack*math.Abs(r.hi) {
		v = r.hi
	}
	if v < r.lo || (r.loOpen && v == r.lo) {
		return false
	}
	if v > r.hi || (r.hiOpen && v == r.hi) {
		return false
	}
	return true
}

// describe prints the range in the display unit of k ("" for a pure number).
func (r interval) describe(k *kind) string {
	f := func(v float64) string {
		if math.IsInf(v, 0) {
			return "∞"
		}
		if k == nil {
			return strconv.FormatFloat(v, 'g', 6, 64)
		}
		return formatIn(v, *k)
	}
	lo, hi := "≤", "≤"
	if r.loOpen {
		lo = "<"
	}
	if r.hiOpen {
		hi = "<"
	}
	if math.IsInf(r.hi, 1) {
		if lo == "<" {
			return "greater than " + f(r.lo)
		}
		return "at least " + f(r.lo)
	}
	return fmt.Sprintf("%s %s value %s %s", f(r.lo), lo, hi, f(r.hi))
}

// quantity reads a dimensional value such as "25 km" and checks its range.
func (d *decoder) quantity(n *yaml.Node, path string, k kind, r interval) (float64, bool) {
	v, _, ok := d.quantityUnit(n, path, k, r)
	return v, ok
}

func (d *decoder) quantityUnit(n *yaml.Node, path string, k kind, r interval) (float64, unitDef, bool) {
	if !d.usable(n, path) {
		return 0, unitDef{}, false
	}
	if n.Kind != yaml.ScalarNode || n.ShortTag() == "!!null" {
		d.add(n, path, scalarValue(n), "wrong type: want a "+k.name+" such as \""+example(k)+"\", got "+kindName(n),
			"units "+k.allowedList())
		return 0, unitDef{}, false
	}
	v, u, err := parseWith(n.Value, k)
	if err != nil {
		allowed := ""
		if k.show != "" {
			allowed = r.describe(&k)
		}
		d.add(n, path, n.Value, err.Error(), allowed)
		return 0, unitDef{}, false
	}
	if !r.contains(v) {
		d.add(n, path, n.Value, "out of range", r.describe(&k))
		return 0, unitDef{}, false
	}
	return v, u, true
}

// number reads a plain (dimensionless) number and checks its range.
func (d *decoder) number(n *yaml.Node, path string, r interval) (float64, bool) {
	if !d.usable(n, path) {
		return 0, false
	}
	tag := n.ShortTag()
	if n.Kind != yaml.ScalarNode || (tag != "!!int" && tag != "!!float") {
		d.add(n, path, scalarValue(n), "wrong type: want a plain number without unit, got "+kindName(n), r.describe(nil))
		return 0, false
	}
	v, err := strconv.ParseFloat(strings.ReplaceAll(n.Value, "_", ""), 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		d.add(n, path, n.Value, "not a finite decimal number", r.describe(nil))
		return 0, false
	}
	if !r.contains(v) {
		d.add(n, path, n.Value, "out of range", r.describe(nil))
		return 0, false
	}
	return v, true
}

// integer reads a whole number in [lo, hi].
func (d *decoder) integer(n *yaml.Node, path string, lo, hi int) (int, bool) {
	allowed := fmt.Sprintf("integer %d ≤ value ≤ %d", lo, hi)
	if !d.usable(n, path) {
		return 0, false
	}
	if n.Kind != yaml.ScalarNode || n.ShortTag() != "!!int" {
		d.add(n, path, scalarValue(n), "wrong type: want a whole number, got "+kindName(n), allowed)
		return 0, false
	}
	v, err := strconv.ParseInt(strings.ReplaceAll(n.Value, "_", ""), 10, 64)
	if err != nil || v < int64(lo) || v > int64(hi) {
		d.add(n, path, n.Value, "out of range", allowed)
		return 0, false
	}
	return int(v), true
}

// text reads a non-empty string.
func (d *decoder) text(n *yaml.Node, path string) (string, bool) {
	if !d.usable(n, path) {
		return "", false
	}
	if n.Kind != yaml.ScalarNode || n.ShortTag() == "!!null" {
		d.add(n, path, scalarValue(n), "wrong type: want text, got "+kindName(n), "")
		return "", false
	}
	if strings.TrimSpace(n.Value) == "" {
		d.add(n, path, n.Value, "empty text", "non-empty text")
		return "", false
	}
	return n.Value, true
}

// name reads an identifier: letters, digits, '_' and '-', 1–64 characters.
func (d *decoder) name(n *yaml.Node, path string) (string, bool) {
	const allowed = "1–64 letters, digits, '_' or '-'"
	s, ok := d.text(n, path)
	if !ok {
		return "", false
	}
	valid := len(s) <= 64
	for _, r := range s {
		if !(r == '_' || r == '-' || r >= '0' && r <= '9' || r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z') {
			valid = false
		}
	}
	if !valid {
		d.add(n, path, s, "not a valid name", allowed)
		return "", false
	}
	return s, true
}

// choice reads one of a fixed set of words.
func (d *decoder) choice(n *yaml.Node, path string, options ...string) (string, bool) {
	allowed := strings.Join(options, ", ")
	if !d.usable(n, path) {
		return "", false
	}
	if n.Kind != yaml.ScalarNode {
		d.add(n, path, "", "wrong type: want one of the words "+allowed+", got "+kindName(n), allowed)
		return "", false
	}
	if !contains(options, n.Value) {
		d.add(n, path, n.Value, "unknown choice"+suggest(n.Value, options), allowed)
		return "", false
	}
	return n.Value, true
}

// boolean reads true or false.
func (d *decoder) boolean(n *yaml.Node, path string) (bool, bool) {
	if !d.usable(n, path) {
		return false, false
	}
	if n.Kind != yaml.ScalarNode || n.ShortTag() != "!!bool" {
		d.add(n, path, scalarValue(n), "wrong type: want true or false, got "+kindName(n), "true, false")
		return false, false
	}
	return n.Value == "true" || n.Value == "True" || n.Value == "TRUE", true
}

// list returns the items of a sequence with at least minLen items.
func (d *decoder) list(n *yaml.Node, path string, minLen int, what string) []*yaml.Node {
	if !d.usable(n, path) {
		return nil
	}
	if n.Kind != yaml.SequenceNode {
		d.add(n, path, scalarValue(n), "wrong type: want a list of "+what+", got "+kindName(n), "")
		return nil
	}
	if len(n.Content) < minLen {
		d.add(n, path, "", fmt.Sprintf("too few items: %d", len(n.Content)), fmt.Sprintf("at least %d %s", minLen, what))
	}
	return n.Content
}

// increasing reports the first index where xs does not strictly increase.
func increasing(xs []float64) (int, bool) {
	for i := 1; i < len(xs); i++ {
		if !(xs[i] > xs[i-1]) {
			return i, false
		}
	}
	return 0, true
}

func sortedCopy(xs []float64) []float64 {
	c := append([]float64(nil), xs...)
	sort.Float64s(c)
	return c
}
