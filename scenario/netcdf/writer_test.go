package netcdf

import (
	"encoding/binary"
	"errors"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func simpleHeader() Header {
	return Header{
		Format:  CDF1,
		NumRecs: 2,
		Dims:    []Dim{{Name: "time", Unlimited: true}, {Name: "x", Len: 3}},
		Vars: []Var{
			{Name: "x", Type: Double, Dims: []string{"x"}},
			{Name: "v", Type: Double, Dims: []string{"time", "x"}},
			{Name: "f", Type: Float, Dims: []string{"time"}, Attrs: []Attr{Floats("_FillValue", float32(math.NaN()))}},
		},
	}
}

// Each malformed header is refused with an error naming the item and what
// is allowed (limits from the classic-format specification).
func TestHeaderErrors(t *testing.T) {
	cases := []struct {
		name string
		edit func(*Header)
		want string
	}{
		{"format", func(h *Header) { h.Format = 5 }, "allowed CDF1 (1) or CDF2 (2)"},
		{"numrecs", func(h *Header) { h.NumRecs = -1 }, "Header.NumRecs is -1"},
		{"empty name", func(h *Header) { h.Dims[1].Name = "" }, "dimension name is empty"},
		{"bad name", func(h *Header) { h.Vars[0].Name = "1x" }, `variable name "1x" has character '1' at byte 0`},
		{"slash", func(h *Header) { h.Vars[0].Name = "a/b" }, `has character '/' at byte 1`},
		{"dup dim", func(h *Header) { h.Dims = append(h.Dims, Dim{Name: "x", Len: 1}) }, `dimension "x" is defined twice`},
		{"two unlimited", func(h *Header) { h.Dims = append(h.Dims, Dim{Name: "t2", Unlimited: true}) }, "both unlimited"},
		{"zero len", func(h *Header) { h.Dims[1].Len = 0 }, `dimension "x" has length 0; allowed 1 to`},
		{"undefined dim", func(h *Header) { h.Vars[0].Dims = []string{"y"} }, `uses dimension "y", which is not defined`},
		{"record not first", func(h *Header) { h.Vars[1].Dims = []string{"x", "time"} }, "unlimited dimension \"time\" at position 1; allowed only first"},
		{"dup var", func(h *Header) { h.Vars[1].Name = "x" }, `variable "x" is defined twice`},
		{"bad type", func(h *Header) { h.Vars[0].Type = 9 }, "has type 9"},
		{"fill type", func(h *Header) { h.Vars[0].Attrs = []Attr{Floats("_FillValue", 1)} }, "_FillValue of variable \"x\" is 1 value(s) of type float; allowed exactly 1 value of the variable's type double"},
		{"fill count", func(h *Header) { h.Vars[0].Attrs = []Attr{Doubles("_FillValue", 1, 2)} }, "2 value(s)"},
		{"global fill", func(h *Header) { h.Attrs = []Attr{Doubles("_FillValue", 1)} }, "_FillValue is a variable attribute"},
		{"attr go type", func(h *Header) { h.Attrs = []Attr{{Name: "a", Value: []int{1}}} }, "has Go type []int"},
		{"attr empty", func(h *Header) { h.Attrs = []Attr{Doubles("a")} }, "has no values"},
		{"attr nan", func(h *Header) { h.Attrs = []Attr{Doubles("a", 1, math.NaN())} }, "non-finite value at index 1"},
		{"attr inf", func(h *Header) { h.Vars[0].Attrs = []Attr{Floats("a", float32(math.Inf(1)))} }, "non-finite value at index 0"},
		{"dup attr", func(h *Header) { h.Attrs = []Attr{Text("a", "1"), Text("a", "2")} }, `attribute "a" twice`},
		{"utf8", func(h *Header) { h.Attrs = []Attr{Text("a", "\xff")} }, "not valid UTF-8"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			h := simpleHeader()
			c.edit(&h)
			_, err := NewWriter(io.Discard, h)
			if err == nil || !strings.Contains(err.Error(), c.want) {
				t.Errorf("err = %v, want it to contain %q", err, c.want)
			}
		})
	}
}

// Data given out of file order, with the wrong type, too many values or
// non-finite values is refused, and the error sticks.
func TestWriteOrderErrors(t *testing.T) {
	cases := []struct {
		name  string
		steps func(w *Writer) error
		want  string
	}{
		{"wrong var", func(w *Writer) error { return w.WriteFloat64s("v", []float64{1}) }, `data for variable "v" given while variable "x" is due next`},
		{"wrong type", func(w *Writer) error { return w.WriteFloat32s("x", []float32{1}) }, `variable "x" is of type double, values given as float`},
		{"too many", func(w *Writer) error { return w.WriteFloat64s("x", []float64{1, 2, 3, 4}) }, "4 values given, 3 remain"},
		{"nan", func(w *Writer) error { return w.WriteFloat64s("x", []float64{1, math.NaN(), 3}) }, `variable "x": value 1 of the slab is not finite`},
		{"inf in record", func(w *Writer) error {
			if err := w.WriteFloat64s("x", []float64{1, 2, 3}); err != nil {
				return err
			}
			return w.WriteFloat64s("v", []float64{1, 2, math.Inf(-1)})
		}, `variable "v" record 0: value 2 of the slab is not finite`},
		{"record order", func(w *Writer) error {
			if err := w.WriteFloat64s("x", []float64{1, 2, 3}); err != nil {
				return err
			}
			if err := w.WriteFloat64s("v", []float64{1, 2, 3}); err != nil {
				return err
			}
			return w.WriteFloat64s("v", []float64{1, 2, 3})
		}, `variable "f" (record 0) is due next`},
		{"after end", func(w *Writer) error {
			for _, s := range []func() error{
				func() error { return w.WriteFloat64s("x", []float64{1, 2, 3}) },
				func() error { return w.WriteFloat64s("v", []float64{1, 2, 3}) },
				func() error { return w.WriteFloat32s("f", []float32{1}) },
				func() error { return w.WriteFloat64s("v", []float64{1, 2, 3}) },
				func() error { return w.WriteFloat32s("f", []float32{float32(math.NaN())}) }, // NaN is f's _FillValue
			} {
				if err := s(); err != nil {
					return err
				}
			}
			return w.WriteFloat64s("v", []float64{1})
		}, "after all data were written"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			w, err := NewWriter(io.Discard, simpleHeader())
			if err != nil {
				t.Fatal(err)
			}
			err = c.steps(w)
			if err == nil || !strings.Contains(err.Error(), c.want) {
				t.Fatalf("err = %v, want it to contain %q", err, c.want)
			}
			if err2 := w.Close(); err2 == nil || err2.Error() != err.Error() {
				t.Errorf("error did not stick: Close = %v", err2)
			}
		})
	}
}

// Specification limits checked on the header alone (nothing is written
// but the header, so no large buffers are needed).
func TestFormatLimits(t *testing.T) {
	// Three fixed variables of 1.5e9 bytes: the third begins beyond
	// 2^31 - 1, which CDF-1's 32-bit signed offsets cannot hold but CDF-2
	// can (specification: OFFSET).
	big := Header{
		Dims: []Dim{{Name: "n", Len: 187_500_000}},
		Vars: []Var{
			{Name: "a", Type: Double, Dims: []string{"n"}},
			{Name: "b", Type: Double, Dims: []string{"n"}},
			{Name: "c", Type: Double, Dims: []string{"n"}},
		},
	}
	big.Format = CDF1
	if _, err := NewWriter(io.Discard, big); err == nil || !strings.Contains(err.Error(), `variable "c" would begin at byte`) {
		t.Errorf("CDF1 offset overflow: err = %v", err)
	}
	big.Format = CDF2
	if _, err := NewWriter(io.Discard, big); err != nil {
		t.Errorf("CDF2: %v", err)
	}
	// A variable over 2^32 - 4 bytes is allowed only as the last variable
	// of a file without record variables, with vsize written as 2^32 - 1
	// (specification: "Note on vsize").
	huge := Header{
		Format: CDF2,
		Dims:   []Dim{{Name: "n", Len: 600_000_000}, {Name: "m", Len: 2}},
		Vars:   []Var{{Name: "small", Type: Int, Dims: []string{"m"}}, {Name: "h", Type: Double, Dims: []string{"n"}}},
	}
	L, err := huge.check()
	if err != nil {
		t.Fatal(err)
	}
	hdr := huge.encode(L)
	// vsize of h sits 12 bytes before the end (vsize u32, begin u64).
	if vs := binary.BigEndian.Uint32(hdr[len(hdr)-12:]); vs != math.MaxUint32 {
		t.Errorf("vsize of oversized last variable = %#x, want 0xffffffff", vs)
	}
	// 2.4e9 bytes is within CDF-2's 2^32 - 4 but over CDF-1's 2^31 - 4
	// for a variable that is not last.
	mid := Header{
		Format: CDF2,
		Dims:   []Dim{{Name: "n", Len: 300_000_000}, {Name: "m", Len: 2}},
		Vars:   []Var{{Name: "big", Type: Double, Dims: []string{"n"}}, {Name: "small", Type: Int, Dims: []string{"m"}}},
	}
	if _, err := mid.check(); err != nil {
		t.Errorf("CDF2, 2.4e9-byte variable: %v", err)
	}
	mid.Format = CDF1
	if _, err := mid.check(); err == nil || !strings.Contains(err.Error(), `variable "big" takes 2400000000 bytes`) {
		t.Errorf("CDF1, 2.4e9-byte variable not last: err = %v", err)
	}
	huge.Vars[0], huge.Vars[1] = huge.Vars[1], huge.Vars[0]
	if _, err := huge.check(); err == nil || !strings.Contains(err.Error(), `variable "h" takes 4800000000 bytes`) {
		t.Errorf("oversized variable not last: err = %v", err)
	}
}

// The Writer's Next reports the slab due, walking the file order of the
// specification: fixed-size variables, then records interleaving the record
// variables.
func TestNext(t *testing.T) {
	w, err := NewWriter(io.Discard, simpleHeader())
	if err != nil {
		t.Fatal(err)
	}
	type slab struct {
		name string
		rec  int
		rem  int
	}
	var got []slab
	for {
		n, r, rem := w.Next()
		got = append(got, slab{n, r, rem})
		if n == "" {
			break
		}
		switch n {
		case "f":
			err = w.WriteFloat32s(n, make([]float32, rem))
		default:
			err = w.WriteFloat64s(n, make([]float64, rem))
		}
		if err != nil {
			t.Fatal(err)
		}
	}
	want := []slab{{"x", -1, 3}, {"v", 0, 3}, {"f", 0, 1}, {"v", 1, 3}, {"f", 1, 1}, {"", -1, 0}}
	if len(got) != len(want) {
		t.Fatalf("got %v, want %v", got, want)
	}
	for i := range want {
		if got[i] != want[i] {
			t.Errorf("slab %d = %v, want %v", i, got[i], want[i])
		}
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
}

// Create leaves no file when the header is bad, fill fails or data are
// missing, and writes the file when all is well.
func TestCreateAtomic(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "out.nc")
	bad := simpleHeader()
	bad.Format = 0
	if err := Create(path, bad, func(*Writer) error { return nil }); err == nil {
		t.Error("bad header: no error")
	}
	boom := errors.New("boom")
	if err := Create(path, simpleHeader(), func(*Writer) error { return boom }); !errors.Is(err, boom) {
		t.Errorf("err = %v, want boom", err)
	}
	err := Create(path, simpleHeader(), func(w *Writer) error { return w.WriteFloat64s("x", []float64{1, 2, 3}) })
	if !errors.Is(err, ErrIncomplete) || !strings.Contains(err.Error(), `variable "v" record 0 of 2 still lacks 3 values`) {
		t.Errorf("incomplete: err = %v", err)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 0 {
		t.Fatalf("files left after failures: %v", entries)
	}
	err = Create(path, simpleHeader(), func(w *Writer) error {
		for {
			n, _, rem := w.Next()
			if n == "" {
				return nil
			}
			var err error
			if n == "f" {
				err = w.WriteFloat32s(n, make([]float32, rem))
			} else {
				err = w.WriteFloat64s(n, make([]float64, rem))
			}
			if err != nil {
				return err
			}
		}
	})
	if err != nil {
		t.Fatal(err)
	}
	b, err := os.ReadFile(path)
	if err != nil || string(b[:4]) != "CDF\x01" {
		t.Fatalf("file: % x, %v", b[:min(4, len(b))], err)
	}
}

// Writing data allocates nothing (the conversion buffer is reused).
func TestWriteAllocs(t *testing.T) {
	h := Header{Format: CDF2, Dims: []Dim{{Name: "n", Len: 100_000}},
		Vars: []Var{{Name: "a", Type: Double, Dims: []string{"n"}}}}
	w, err := NewWriter(io.Discard, h)
	if err != nil {
		t.Fatal(err)
	}
	chunk := make([]float64, 1000)
	allocs := testing.AllocsPerRun(50, func() {
		if err := w.WriteFloat64s("a", chunk); err != nil {
			t.Fatal(err)
		}
	})
	if allocs != 0 {
		t.Errorf("WriteFloat64s: %v allocations per call, want 0", allocs)
	}
	// Record variables: one whole record slab per call.
	h = Header{Format: CDF2, NumRecs: 100, Dims: []Dim{{Name: "t", Unlimited: true}, {Name: "n", Len: 1000}},
		Vars: []Var{{Name: "r", Type: Double, Dims: []string{"t", "n"}}}}
	if w, err = NewWriter(io.Discard, h); err != nil {
		t.Fatal(err)
	}
	allocs = testing.AllocsPerRun(50, func() {
		if err := w.WriteFloat64s("r", chunk); err != nil {
			t.Fatal(err)
		}
	})
	if allocs != 0 {
		t.Errorf("WriteFloat64s, record variable: %v allocations per call, want 0", allocs)
	}
}
