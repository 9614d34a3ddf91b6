package netcdf

import (
	"encoding/binary"
	"math"
)

// Tags of the header lists (specification: NC_DIMENSION, NC_VARIABLE,
// NC_ATTRIBUTE); an empty list is written as ABSENT = ZERO ZERO.
const (
	tagDimension = 0x0A
	tagVariable  = 0x0B
	tagAttribute = 0x0C
)

func nameSize(s string) int64 { return 4 + pad4(int64(len(s))) }

func attrsSize(attrs []Attr) int64 {
	n := int64(8) // tag (or ZERO) and nelems
	for _, a := range attrs {
		n += nameSize(a.Name) + 4 + 4 + pad4(int64(a.Len()*a.Type().Size()))
	}
	return n
}

// encodedSize is the exact length of the header in bytes.
func (h *Header) encodedSize() int64 {
	n := int64(4 + 4) // magic, numrecs
	n += 8
	for _, d := range h.Dims {
		n += nameSize(d.Name) + 4
	}
	n += attrsSize(h.Attrs)
	n += 8
	offSize := int64(4)
	if h.Format == CDF2 {
		offSize = 8
	}
	for _, v := range h.Vars {
		n += nameSize(v.Name) + 4 + 4*int64(len(v.Dims)) + attrsSize(v.Attrs) + 4 + 4 + offSize
	}
	return n
}

// encoder appends big-endian header items to a byte slice.
type encoder struct{ b []byte }

func (e *encoder) u32(v uint32) { e.b = binary.BigEndian.AppendUint32(e.b, v) }
func (e *encoder) u64(v uint64) { e.b = binary.BigEndian.AppendUint64(e.b, v) }

// pad appends zero bytes up to the next 4-byte boundary (header padding
// uses null bytes).
func (e *encoder) pad() {
	for len(e.b)%4 != 0 {
		e.b = append(e.b, 0)
	}
}

func (e *encoder) name(s string) {
	e.u32(uint32(len(s)))
	e.b = append(e.b, s...)
	e.pad()
}

// list starts a header list of n items: tag and nelems, or ABSENT
// (ZERO ZERO) when n is 0.
func (e *encoder) list(tag uint32, n int) {
	if n == 0 {
		e.u32(0)
		e.u32(0)
		return
	}
	e.u32(tag)
	e.u32(uint32(n))
}

func (e *encoder) attrs(attrs []Attr) {
	e.list(tagAttribute, len(attrs))
	for _, a := range attrs {
		e.name(a.Name)
		e.u32(uint32(a.Type()))
		e.u32(uint32(a.Len()))
		switch v := a.Value.(type) {
		case string:
			e.b = append(e.b, v...)
		case []int8:
			for _, x := range v {
				e.b = append(e.b, byte(x))
			}
		case []int16:
			for _, x := range v {
				e.b = binary.BigEndian.AppendUint16(e.b, uint16(x))
			}
		case []int32:
			for _, x := range v {
				e.u32(uint32(x))
			}
		case []float32:
			for _, x := range v {
				e.u32(math.Float32bits(x))
			}
		case []float64:
			for _, x := range v {
				e.u64(math.Float64bits(x))
			}
		}
		e.pad()
	}
}

// encode returns the header bytes for the layout L computed by check.
func (h *Header) encode(L *layout) []byte {
	e := &encoder{b: make([]byte, 0, L.headerSize)}
	e.b = append(e.b, 'C', 'D', 'F', byte(h.Format))
	e.u32(uint32(h.NumRecs))
	dimIndex := make(map[string]int, len(h.Dims))
	e.list(tagDimension, len(h.Dims))
	for i, d := range h.Dims {
		dimIndex[d.Name] = i
		e.name(d.Name)
		if d.Unlimited {
			e.u32(0)
		} else {
			e.u32(uint32(d.Len))
		}
	}
	e.attrs(h.Attrs)
	e.list(tagVariable, len(h.Vars))
	for i, v := range h.Vars {
		e.name(v.Name)
		e.u32(uint32(len(v.Dims)))
		for _, dn := range v.Dims {
			e.u32(uint32(dimIndex[dn]))
		}
		e.attrs(v.Attrs)
		e.u32(uint32(v.Type))
		vs := L.vsize[i]
		if vs > maxVsize {
			vs = maxUint32
		}
		e.u32(uint32(vs))
		if h.Format == CDF2 {
			e.u64(uint64(L.begin[i]))
		} else {
			e.u32(uint32(L.begin[i]))
		}
	}
	return e.b
}
