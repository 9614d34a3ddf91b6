package netcdf

import (
	"encoding/binary"
	"errors"
	"fmt"
	"io"
	"math"

	"github.com/murk-optics/murk/scenario/internal/safefile"
)

// bufSize is the size of the Writer's conversion buffer in bytes.
const bufSize = 1 << 15

// Writer streams one file: the header first, then the data in file order.
// Data are written in slabs: each fixed-size variable in the order of
// Header.Vars is one slab; then, for each record in turn, each record
// variable's part of that record is one slab. A slab may be given in any
// number of consecutive chunks, so memory stays bounded by the caller's
// chunk size. The Write methods must match the variable's type exactly; a
// call for any variable other than the one due next is an error.
//
// Floating-point data must be finite, except NaN for a variable whose
// _FillValue is NaN; write missing values as the variable's _FillValue.
//
// After any error the Writer is spent: every later call returns that error.
// A Writer is not safe for concurrent use.
type Writer struct {
	w   io.Writer
	h   Header
	lay *layout
	pos int64 // bytes written so far

	fixed, rec []int // variable indices in slab order
	slab       int   // index of the current slab
	nslab      int
	done       int64 // values written in the current slab
	fillNaN    []bool
	padding    [][]byte // per variable: bytes after its data in each slab
	err        error
	buf        [bufSize]byte
}

// NewWriter checks h, writes its header to w and returns a Writer for the
// data. The Writer keeps h: do not modify it, or the slices it refers to,
// before Close.
func NewWriter(w io.Writer, h Header) (*Writer, error) {
	L, err := h.check()
	if err != nil {
		return nil, err
	}
	nw := &Writer{w: w, h: h, lay: L}
	for i := range h.Vars {
		if L.record[i] {
			nw.rec = append(nw.rec, i)
		} else {
			nw.fixed = append(nw.fixed, i)
		}
	}
	nw.nslab = len(nw.fixed) + h.NumRecs*len(nw.rec)
	nw.fillNaN = make([]bool, len(h.Vars))
	nw.padding = make([][]byte, len(h.Vars))
	for i, v := range h.Vars {
		fill := fillBytes(v)
		if a, ok := findAttr(v.Attrs, "_FillValue"); ok {
			switch x := a.Value.(type) {
			case []float32:
				nw.fillNaN[i] = math.IsNaN(float64(x[0]))
			case []float64:
				nw.fillNaN[i] = math.IsNaN(x[0])
			}
		}
		np := L.vsize[i] - L.dataLen[i]
		if L.record[i] && len(nw.rec) == 1 {
			np = 0 // single record variable: records are not padded
		}
		// Data padding repeats the fill value (specification: "In data,
		// padding uses variable's fill value").
		for j := int64(0); j < np; j++ {
			nw.padding[i] = append(nw.padding[i], fill[j%int64(len(fill))])
		}
	}
	hdr := h.encode(L)
	if int64(len(hdr)) != L.headerSize {
		return nil, fmt.Errorf("netcdf: internal error: header is %d bytes, computed %d", len(hdr), L.headerSize)
	}
	if err := nw.write(hdr); err != nil {
		return nil, err
	}
	return nw, nil
}

// Create writes the file at path atomically: it checks h, writes the
// header, calls fill to stream the data, checks that every value was
// written, and only then renames the file into place. On any error, from h,
// fill or the file system, path is left untouched and no temporary file
// remains.
func Create(path string, h Header, fill func(w *Writer) error) error {
	return safefile.Write(path, func(out io.Writer) error {
		w, err := NewWriter(out, h)
		if err != nil {
			return err
		}
		if err := fill(w); err != nil {
			return err
		}
		return w.Close()
	})
}

func findAttr(attrs []Attr, name string) (Attr, bool) {
	for _, a := range attrs {
		if a.Name == name {
			return a, true
		}
	}
	return Attr{}, false
}

// fillBytes is the external representation of v's fill value: its
// _FillValue attribute if any, else the default of its type.
func fillBytes(v Var) []byte {
	if a, ok := findAttr(v.Attrs, "_FillValue"); ok {
		switch x := a.Value.(type) {
		case string:
			return []byte{x[0]}
		case []int8:
			return []byte{byte(x[0])}
		case []int16:
			return binary.BigEndian.AppendUint16(nil, uint16(x[0]))
		case []int32:
			return binary.BigEndian.AppendUint32(nil, uint32(x[0]))
		case []float32:
			return binary.BigEndian.AppendUint32(nil, math.Float32bits(x[0]))
		case []float64:
			return binary.BigEndian.AppendUint64(nil, math.Float64bits(x[0]))
		}
	}
	switch v.Type {
	case Byte:
		return []byte{0x81} // FillByte = -127 in two's complement
	case Char:
		return []byte{FillChar}
	case Short:
		return binary.BigEndian.AppendUint16(nil, 0x8001) // FillShort
	case Int:
		return binary.BigEndian.AppendUint32(nil, 0x80000001) // FillInt
	case Float:
		return binary.BigEndian.AppendUint32(nil, math.Float32bits(FillFloat))
	}
	return binary.BigEndian.AppendUint64(nil, math.Float64bits(FillDouble))
}

func (w *Writer) write(b []byte) error {
	n, err := w.w.Write(b)
	w.pos += int64(n)
	if err != nil {
		w.err = fmt.Errorf("netcdf: writing: %w", err)
		return w.err
	}
	return nil
}

// Next reports the slab due next: the variable's name, the record index
// (-1 for a fixed-size variable) and how many values of it remain. When all
// data have been written it returns "", -1, 0.
func (w *Writer) Next() (name string, record int, remaining int) {
	if w.slab >= w.nslab {
		return "", -1, 0
	}
	vi, r := w.current()
	return w.h.Vars[vi].Name, r, int(w.lay.nelems[vi] - w.done)
}

func (w *Writer) current() (vi, record int) {
	if w.slab < len(w.fixed) {
		return w.fixed[w.slab], -1
	}
	k := w.slab - len(w.fixed)
	return w.rec[k%len(w.rec)], k / len(w.rec)
}

// begin checks a chunk of n values of type t for variable name against the
// slab due next and returns the variable's index.
func (w *Writer) begin(name string, t Type, n int) (int, error) {
	if w.err != nil {
		return 0, w.err
	}
	if w.slab >= w.nslab {
		w.err = fmt.Errorf("netcdf: variable %q: %d more values given after all data were written", name, n)
		return 0, w.err
	}
	vi, r := w.current()
	v := &w.h.Vars[vi]
	where := recordNote(r) // formatted with %v only on error
	if v.Name != name {
		w.err = fmt.Errorf("netcdf: data for variable %q given while variable %q%s is due next; data must follow the file order", name, v.Name, where)
		return 0, w.err
	}
	if v.Type != t {
		w.err = fmt.Errorf("netcdf: variable %q is of type %s, values given as %s", name, v.Type, t)
		return 0, w.err
	}
	if rem := w.lay.nelems[vi] - w.done; int64(n) > rem {
		w.err = fmt.Errorf("netcdf: variable %q%s: %d values given, %d remain in this slab", name, where, n, rem)
		return 0, w.err
	}
	if w.done == 0 {
		want := w.lay.begin[vi]
		if r > 0 {
			want += int64(r) * w.lay.recSize
		}
		if w.pos != want {
			w.err = fmt.Errorf("netcdf: internal error: variable %q%s starts at byte %d, header says %d", name, where, w.pos, want)
			return 0, w.err
		}
	}
	return vi, nil
}

// recordNote describes record r for error messages.
type recordNote int

func (r recordNote) String() string {
	if r < 0 {
		return ""
	}
	return fmt.Sprintf(" (record %d)", int(r))
}

// advance accounts for n values written to variable vi and closes the slab
// when it is complete.
func (w *Writer) advance(vi, n int) error {
	w.done += int64(n)
	if w.done < w.lay.nelems[vi] {
		return nil
	}
	if p := w.padding[vi]; len(p) > 0 {
		if err := w.write(p); err != nil {
			return err
		}
	}
	w.slab++
	w.done = 0
	return nil
}

func (w *Writer) nonFinite(vi int, at int) error {
	_, r := w.current()
	where := ""
	if r >= 0 {
		where = fmt.Sprintf(" record %d", r)
	}
	w.err = fmt.Errorf("netcdf: variable %q%s: value %d of the slab is not finite; allowed finite values (write missing data as _FillValue)", w.h.Vars[vi].Name, where, w.done+int64(at))
	return w.err
}

// WriteFloat64s writes the next values of the Double variable name.
func (w *Writer) WriteFloat64s(name string, v []float64) error {
	vi, err := w.begin(name, Double, len(v))
	if err != nil {
		return err
	}
	allowNaN := w.fillNaN[vi]
	const step = bufSize / 8
	for lo := 0; lo < len(v); lo += step {
		hi := min(lo+step, len(v))
		b := w.buf[:0]
		for i, x := range v[lo:hi] {
			if math.IsInf(x, 0) || (x != x && !allowNaN) {
				return w.nonFinite(vi, lo+i)
			}
			b = binary.BigEndian.AppendUint64(b, math.Float64bits(x))
		}
		if err := w.write(b); err != nil {
			return err
		}
	}
	return w.advance(vi, len(v))
}

// WriteFloat32s writes the next values of the Float variable name.
func (w *Writer) WriteFloat32s(name string, v []float32) error {
	vi, err := w.begin(name, Float, len(v))
	if err != nil {
		return err
	}
	allowNaN := w.fillNaN[vi]
	const step = bufSize / 4
	for lo := 0; lo < len(v); lo += step {
		hi := min(lo+step, len(v))
		b := w.buf[:0]
		for i, x := range v[lo:hi] {
			if math.IsInf(float64(x), 0) || (x != x && !allowNaN) {
				return w.nonFinite(vi, lo+i)
			}
			b = binary.BigEndian.AppendUint32(b, math.Float32bits(x))
		}
		if err := w.write(b); err != nil {
			return err
		}
	}
	return w.advance(vi, len(v))
}

// WriteInt32s writes the next values of the Int variable name.
func (w *Writer) WriteInt32s(name string, v []int32) error {
	vi, err := w.begin(name, Int, len(v))
	if err != nil {
		return err
	}
	const step = bufSize / 4
	for lo := 0; lo < len(v); lo += step {
		b := w.buf[:0]
		for _, x := range v[lo:min(lo+step, len(v))] {
			b = binary.BigEndian.AppendUint32(b, uint32(x))
		}
		if err := w.write(b); err != nil {
			return err
		}
	}
	return w.advance(vi, len(v))
}

// WriteInt16s writes the next values of the Short variable name.
func (w *Writer) WriteInt16s(name string, v []int16) error {
	vi, err := w.begin(name, Short, len(v))
	if err != nil {
		return err
	}
	const step = bufSize / 2
	for lo := 0; lo < len(v); lo += step {
		b := w.buf[:0]
		for _, x := range v[lo:min(lo+step, len(v))] {
			b = binary.BigEndian.AppendUint16(b, uint16(x))
		}
		if err := w.write(b); err != nil {
			return err
		}
	}
	return w.advance(vi, len(v))
}

// WriteInt8s writes the next values of the Byte variable name.
func (w *Writer) WriteInt8s(name string, v []int8) error {
	vi, err := w.begin(name, Byte, len(v))
	if err != nil {
		return err
	}
	const step = bufSize
	for lo := 0; lo < len(v); lo += step {
		b := w.buf[:0]
		for _, x := range v[lo:min(lo+step, len(v))] {
			b = append(b, byte(x))
		}
		if err := w.write(b); err != nil {
			return err
		}
	}
	return w.advance(vi, len(v))
}

// WriteText writes the next characters of the Char variable name, one byte
// per value. A char array of strings is written as fixed-width rows: use
// [PadText] to pad each string to the row length.
func (w *Writer) WriteText(name string, s string) error {
	vi, err := w.begin(name, Char, len(s))
	if err != nil {
		return err
	}
	const step = bufSize
	for lo := 0; lo < len(s); lo += step {
		b := append(w.buf[:0], s[lo:min(lo+step, len(s))]...)
		if err := w.write(b); err != nil {
			return err
		}
	}
	return w.advance(vi, len(s))
}

// PadText returns s padded with NUL bytes (the char fill value) to n bytes,
// for one row of a char array. It returns an error if s is longer than n.
func PadText(s string, n int) (string, error) {
	if len(s) > n {
		return "", fmt.Errorf("netcdf: text %q is %d bytes; allowed at most the row length %d", s, len(s), n)
	}
	b := make([]byte, n)
	copy(b, s)
	return string(b), nil
}

// ErrIncomplete is returned (wrapped) by Close when some data were not
// written.
var ErrIncomplete = errors.New("netcdf: file incomplete")

// Close checks that every value of every variable was written. It does not
// close the underlying io.Writer. A file whose Close fails is not valid and
// must be discarded ([Create] does that).
func (w *Writer) Close() error {
	if w.err != nil {
		return w.err
	}
	if w.slab < w.nslab {
		name, r, rem := w.Next()
		where := ""
		if r >= 0 {
			where = fmt.Sprintf(" record %d of %d", r, w.h.NumRecs)
		}
		w.err = fmt.Errorf("%w: variable %q%s still lacks %d values", ErrIncomplete, name, where, rem)
		return w.err
	}
	if w.pos != w.lay.fileSize {
		w.err = fmt.Errorf("netcdf: internal error: wrote %d bytes, layout computed %d", w.pos, w.lay.fileSize)
		return w.err
	}
	w.err = errors.New("netcdf: Writer already closed")
	return nil
}
