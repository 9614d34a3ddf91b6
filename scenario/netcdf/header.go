package netcdf

import (
	"fmt"
	"math"
	"strings"
	"unicode/utf8"
)

// Format selects the classic-format variant, written as the version byte of
// the magic number 'C' 'D' 'F' version.
type Format byte

const (
	// CDF1 is the original classic format: 32-bit file offsets, so every
	// variable must begin before byte 2^31 - 1.
	CDF1 Format = 1
	// CDF2 is the 64-bit offset format: identical to CDF1 except that the
	// begin offsets in the header are 64-bit.
	CDF2 Format = 2
)

func (f Format) String() string {
	switch f {
	case CDF1:
		return "CDF-1 (classic)"
	case CDF2:
		return "CDF-2 (64-bit offset)"
	}
	return fmt.Sprintf("Format(%d)", byte(f))
}

// Type is an external data type of the classic format (nc_type).
type Type int32

// The six classic types with their nc_type codes from the specification.
const (
	Byte   Type = 1 // signed 8-bit integer (NC_BYTE)
	Char   Type = 2 // 8-bit character, text (NC_CHAR)
	Short  Type = 3 // signed 16-bit integer (NC_SHORT)
	Int    Type = 4 // signed 32-bit integer (NC_INT)
	Float  Type = 5 // IEEE 754 binary32 (NC_FLOAT)
	Double Type = 6 // IEEE 754 binary64 (NC_DOUBLE)
)

// Size is the number of bytes one value of t takes in the file.
// It is 0 for an invalid type.
func (t Type) Size() int {
	switch t {
	case Byte, Char:
		return 1
	case Short:
		return 2
	case Int, Float:
		return 4
	case Double:
		return 8
	}
	return 0
}

func (t Type) String() string {
	switch t {
	case Byte:
		return "byte"
	case Char:
		return "char"
	case Short:
		return "short"
	case Int:
		return "int"
	case Float:
		return "float"
	case Double:
		return "double"
	}
	return fmt.Sprintf("Type(%d)", int32(t))
}

// Default fill values of the classic format (netcdf.h NC_FILL_*), used to
// pad a variable's data to a 4-byte boundary when it has no _FillValue
// attribute, and recommended as the _FillValue of missing data.
const (
	FillByte   int8    = -127
	FillChar   byte    = 0
	FillShort  int16   = -32767
	FillInt    int32   = -2147483647
	FillFloat  float32 = 9.9692099683868690e+36
	FillDouble float64 = 9.9692099683868690e+36
)

// Dim is a named dimension. Len is the number of indices along it; for the
// unlimited (record) dimension Len is ignored and the record count is
// Header.NumRecs.
type Dim struct {
	Name      string
	Len       int
	Unlimited bool
}

// Attr is a named attribute. Value holds the data and fixes the type:
//
//	string   → Char
//	[]int8   → Byte
//	[]int16  → Short
//	[]int32  → Int
//	[]float32 → Float
//	[]float64 → Double
//
// Use the constructors [Text], [Bytes], [Shorts], [Ints], [Floats] and
// [Doubles]. Numeric attributes need at least one value; floating-point
// values must be finite except a _FillValue, which may be NaN.
type Attr struct {
	Name  string
	Value any
}

// Text returns a character attribute.
func Text(name, s string) Attr { return Attr{name, s} }

// Bytes returns a byte attribute.
func Bytes(name string, v ...int8) Attr { return Attr{name, v} }

// Shorts returns a short attribute.
func Shorts(name string, v ...int16) Attr { return Attr{name, v} }

// Ints returns an int attribute.
func Ints(name string, v ...int32) Attr { return Attr{name, v} }

// Floats returns a float attribute.
func Floats(name string, v ...float32) Attr { return Attr{name, v} }

// Doubles returns a double attribute.
func Doubles(name string, v ...float64) Attr { return Attr{name, v} }

// Type reports the attribute's external type, or 0 if Value has an
// unsupported dynamic type.
func (a Attr) Type() Type {
	switch a.Value.(type) {
	case string:
		return Char
	case []int8:
		return Byte
	case []int16:
		return Short
	case []int32:
		return Int
	case []float32:
		return Float
	case []float64:
		return Double
	}
	return 0
}

// Len is the number of values (characters for text).
func (a Attr) Len() int {
	switch v := a.Value.(type) {
	case string:
		return len(v)
	case []int8:
		return len(v)
	case []int16:
		return len(v)
	case []int32:
		return len(v)
	case []float32:
		return len(v)
	case []float64:
		return len(v)
	}
	return 0
}

// Var is a variable: a typed array over named dimensions (slowest-varying
// first, C order). A variable whose first dimension is the unlimited one is
// a record variable; the unlimited dimension may appear only first.
// A variable with no dimensions is a scalar.
type Var struct {
	Name  string
	Type  Type
	Dims  []string
	Attrs []Attr
}

// Header describes a whole file: everything except the data. Variables'
// data follow in the file in the order of Vars, fixed-size variables
// first, then NumRecs records each holding one slab of every record
// variable.
type Header struct {
	Format  Format
	Dims    []Dim
	Attrs   []Attr // global attributes
	Vars    []Var
	NumRecs int // number of records along the unlimited dimension
}

// Limits of the classic formats (specification: "Note on vsize" and the
// OFFSET production).
const (
	maxInt32   = math.MaxInt32
	maxUint32  = math.MaxUint32
	maxVsize   = maxUint32 - 3 // largest vsize field that is a multiple of 4
	maxNameLen = 256           // NC_MAX_NAME of netcdf.h
)

// checkName reports whether s is an acceptable name. The specification
// admits any normalised UTF-8 not starting with a digit or punctuation other
// than underscore, without '/' or control characters and without trailing
// spaces; this writer accepts the portable subset that CF also recommends:
// an ASCII letter or underscore followed by ASCII letters, digits,
// underscores, '.', '-', '+' and '@'.
func checkName(what, s string) error {
	if s == "" {
		return fmt.Errorf("netcdf: %s name is empty", what)
	}
	if len(s) > maxNameLen {
		return fmt.Errorf("netcdf: %s name %.20q… is %d bytes long; allowed 1 to %d", what, s, len(s), maxNameLen)
	}
	for i := 0; i < len(s); i++ {
		c := s[i]
		ok := c == '_' || ('a' <= c && c <= 'z') || ('A' <= c && c <= 'Z')
		if i > 0 {
			ok = ok || ('0' <= c && c <= '9') || strings.IndexByte(".-+@", c) >= 0
		}
		if !ok {
			return fmt.Errorf("netcdf: %s name %q has character %q at byte %d; allowed: an ASCII letter or '_' first, then letters, digits and _.-+@", what, s, c, i)
		}
	}
	return nil
}

func checkAttrs(owner string, attrs []Attr, varType Type) error {
	seen := make(map[string]bool, len(attrs))
	for _, a := range attrs {
		what := "attribute of " + owner
		if err := checkName(what, a.Name); err != nil {
			return err
		}
		if seen[a.Name] {
			return fmt.Errorf("netcdf: %s has attribute %q twice", owner, a.Name)
		}
		seen[a.Name] = true
		t := a.Type()
		if t == 0 {
			return fmt.Errorf("netcdf: attribute %q of %s has Go type %T; allowed string, []int8, []int16, []int32, []float32, []float64", a.Name, owner, a.Value)
		}
		if t == Char {
			if !utf8.ValidString(a.Value.(string)) {
				return fmt.Errorf("netcdf: text attribute %q of %s is not valid UTF-8", a.Name, owner)
			}
		} else if a.Len() == 0 {
			return fmt.Errorf("netcdf: numeric attribute %q of %s has no values; allowed at least 1", a.Name, owner)
		}
		if a.Len() > maxInt32 {
			return fmt.Errorf("netcdf: attribute %q of %s has %d values; allowed at most %d", a.Name, owner, a.Len(), maxInt32)
		}
		isFill := a.Name == "_FillValue"
		if isFill {
			if varType == 0 {
				return fmt.Errorf("netcdf: _FillValue is a variable attribute, found among the global attributes")
			}
			if t != varType || a.Len() != 1 {
				return fmt.Errorf("netcdf: _FillValue of %s is %d value(s) of type %s; allowed exactly 1 value of the variable's type %s", owner, a.Len(), t, varType)
			}
		}
		var bad = -1
		switch v := a.Value.(type) {
		case []float32:
			for i, x := range v {
				if f := float64(x); (math.IsNaN(f) && !isFill) || math.IsInf(f, 0) {
					bad = i
					break
				}
			}
		case []float64:
			for i, x := range v {
				if (math.IsNaN(x) && !isFill) || math.IsInf(x, 0) {
					bad = i
					break
				}
			}
		}
		if bad >= 0 {
			return fmt.Errorf("netcdf: attribute %q of %s has a non-finite value at index %d; allowed finite values (NaN only as _FillValue)", a.Name, owner, bad)
		}
	}
	return nil
}

// layout is the computed placement of every variable's data.
type layout struct {
	headerSize int64
	begin      []int64 // file offset of each variable's data (first record for record vars)
	vsize      []int64 // padded bytes per variable (per record for record vars), as in the header
	dataLen    []int64 // unpadded bytes (per record for record vars)
	nelems     []int64 // values (per record for record vars)
	record     []bool
	recDim     int   // index of the unlimited dimension, -1 if none
	beginRec   int64 // offset of the first record
	recSize    int64 // bytes per record
	fileSize   int64
}

func pad4(n int64) int64 { return (n + 3) &^ 3 }

// check validates h and computes the data layout. The placement follows the
// specification with no extra header space and 4-byte alignment, which is
// also what the reference library does by default (nc_enddef).
func (h *Header) check() (*layout, error) {
	if h.Format != CDF1 && h.Format != CDF2 {
		return nil, fmt.Errorf("netcdf: Header.Format is %d; allowed CDF1 (1) or CDF2 (2)", byte(h.Format))
	}
	if h.NumRecs < 0 || h.NumRecs > maxInt32 {
		return nil, fmt.Errorf("netcdf: Header.NumRecs is %d; allowed 0 to %d records", h.NumRecs, maxInt32)
	}
	L := &layout{recDim: -1}
	dimIndex := make(map[string]int, len(h.Dims))
	for i, d := range h.Dims {
		if err := checkName("dimension", d.Name); err != nil {
			return nil, err
		}
		if _, dup := dimIndex[d.Name]; dup {
			return nil, fmt.Errorf("netcdf: dimension %q is defined twice", d.Name)
		}
		dimIndex[d.Name] = i
		if d.Unlimited {
			if L.recDim >= 0 {
				return nil, fmt.Errorf("netcdf: dimensions %q and %q are both unlimited; the classic format allows one", h.Dims[L.recDim].Name, d.Name)
			}
			L.recDim = i
			continue
		}
		if d.Len < 1 || d.Len > maxInt32 {
			return nil, fmt.Errorf("netcdf: dimension %q has length %d; allowed 1 to %d (or Unlimited)", d.Name, d.Len, maxInt32)
		}
	}
	if err := checkAttrs("the file (global)", h.Attrs, 0); err != nil {
		return nil, err
	}
	n := len(h.Vars)
	L.begin = make([]int64, n)
	L.vsize = make([]int64, n)
	L.dataLen = make([]int64, n)
	L.nelems = make([]int64, n)
	L.record = make([]bool, n)
	varSeen := make(map[string]bool, n)
	for i, v := range h.Vars {
		if err := checkName("variable", v.Name); err != nil {
			return nil, err
		}
		if varSeen[v.Name] {
			return nil, fmt.Errorf("netcdf: variable %q is defined twice", v.Name)
		}
		varSeen[v.Name] = true
		if v.Type.Size() == 0 {
			return nil, fmt.Errorf("netcdf: variable %q has type %d; allowed Byte, Char, Short, Int, Float or Double", v.Name, int32(v.Type))
		}
		count := int64(1)
		for j, dn := range v.Dims {
			di, ok := dimIndex[dn]
			if !ok {
				return nil, fmt.Errorf("netcdf: variable %q uses dimension %q, which is not defined", v.Name, dn)
			}
			if di == L.recDim {
				if j != 0 {
					return nil, fmt.Errorf("netcdf: variable %q has the unlimited dimension %q at position %d; allowed only first", v.Name, dn, j)
				}
				L.record[i] = true
				continue
			}
			count *= int64(h.Dims[di].Len)
			if count > 1<<53 {
				return nil, fmt.Errorf("netcdf: variable %q has more than 2^53 values", v.Name)
			}
		}
		if err := checkAttrs("variable "+fmt.Sprintf("%q", v.Name), v.Attrs, v.Type); err != nil {
			return nil, err
		}
		L.nelems[i] = count
		L.dataLen[i] = count * int64(v.Type.Size())
		L.vsize[i] = pad4(L.dataLen[i])
	}
	L.headerSize = h.encodedSize()
	// Fixed-size variables, in definition order, right after the header.
	off := L.headerSize
	lastFixed, nrec := -1, 0
	for i := range h.Vars {
		if L.record[i] {
			nrec++
			continue
		}
		lastFixed = i
	}
	// Variable size limit: 2^31 - 4 bytes in CDF-1 and 2^32 - 4 bytes in
	// CDF-2 (per record for record variables), except for the last
	// fixed-size variable of a file without record variables, whose vsize
	// is written as 2^32 - 1 when it does not fit (specification, "Note on
	// vsize"; the CDF-1 limit is the reference library's, from memory of
	// its NC_check_vlens).
	limit := int64(maxVsize)
	if h.Format == CDF1 {
		limit = maxInt32 - 3
	}
	for i := range h.Vars {
		if L.vsize[i] > limit {
			if i == lastFixed && nrec == 0 {
				continue
			}
			return nil, fmt.Errorf("netcdf: variable %q takes %d bytes (per record if a record variable); allowed at most %d in %v unless it is the last variable of a file without record variables", h.Vars[i].Name, L.vsize[i], limit, h.Format)
		}
	}
	for i := range h.Vars {
		if L.record[i] {
			continue
		}
		if err := h.checkOffset(i, off); err != nil {
			return nil, err
		}
		L.begin[i] = off
		off += L.vsize[i]
	}
	// Record variables: one slab of each per record, interleaved.
	L.beginRec = off
	for i := range h.Vars {
		if !L.record[i] {
			continue
		}
		if err := h.checkOffset(i, off); err != nil {
			return nil, err
		}
		L.begin[i] = off
		off += L.vsize[i]
		L.recSize += L.vsize[i]
	}
	if nrec == 1 {
		// Specification: with a single record variable no padding is
		// used between records (matters for byte, char and short).
		for i := range h.Vars {
			if L.record[i] {
				L.recSize = L.dataLen[i]
			}
		}
	}
	if L.recSize > maxUint32 && h.NumRecs > 1 {
		return nil, fmt.Errorf("netcdf: a record takes %d bytes; allowed at most %d", L.recSize, int64(maxUint32))
	}
	if nrec > 0 {
		L.fileSize = L.beginRec + int64(h.NumRecs)*L.recSize
	} else {
		L.fileSize = off
	}
	return L, nil
}

func (h *Header) checkOffset(i int, off int64) error {
	if h.Format == CDF1 && off > maxInt32 {
		return fmt.Errorf("netcdf: variable %q would begin at byte %d; CDF1 allows offsets up to %d, use CDF2", h.Vars[i].Name, off, int64(maxInt32))
	}
	return nil
}
