package netcdf

import (
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// ncdumpValues returns the values ncdump prints for variable name.
func ncdumpValues(t *testing.T, ncdump, path, name string) []float64 {
	t.Helper()
	out, err := exec.Command(ncdump, "-v", name, path).Output()
	if err != nil {
		t.Fatalf("ncdump -v %s: %v", name, err)
	}
	s := string(out)
	i := strings.Index(s, "data:")
	if i < 0 {
		t.Fatalf("ncdump output has no data section:\n%s", s)
	}
	s = s[i:]
	j := strings.Index(s, " "+name+" =")
	if j < 0 {
		t.Fatalf("ncdump output has no data for %s", name)
	}
	s = s[j+len(name)+3:]
	s = s[:strings.Index(s, ";")]
	var vals []float64
	for _, f := range strings.FieldsFunc(s, func(r rune) bool { return r == ',' || r == ' ' || r == '\n' || r == '\t' }) {
		v, err := strconv.ParseFloat(strings.TrimRight(f, "fbs"), 64)
		if err != nil {
			t.Fatalf("ncdump value %q of %s: %v", f, name, err)
		}
		vals = append(vals, v)
	}
	return vals
}

// Large slabs written in uneven chunks that cross the writer's conversion
// buffer are read back value for value by Unidata's ncdump (an independent
// decoder; Debian netcdf-bin, installed by .ci/run). Values are chosen to
// print exactly in ncdump's default precision.
func TestLargeSlabsNcdump(t *testing.T) {
	ncdump, err := exec.LookPath("ncdump")
	if err != nil {
		t.Skip("ncdump not found (Debian package netcdf-bin; .ci/run installs it)")
	}
	const nd, nf, ns, nb, ni = 10007, 9001, 20001, 40003, 9000
	want := map[string][]float64{"d": make([]float64, nd), "f": make([]float64, nf),
		"s": make([]float64, ns), "b": make([]float64, nb), "i": make([]float64, ni)}
	d, f, s, b, iv := make([]float64, nd), make([]float32, nf), make([]int16, ns), make([]int8, nb), make([]int32, ni)
	for k := range d {
		d[k] = 0.25 * float64(k)
		want["d"][k] = d[k]
	}
	for k := range f {
		f[k] = 0.5*float32(k) - 100
		want["f"][k] = float64(f[k])
	}
	for k := range s {
		s[k] = int16(k - 10000)
		want["s"][k] = float64(s[k])
	}
	for k := range b {
		b[k] = int8(k%255 - 127) // -127 … 127
		want["b"][k] = float64(b[k])
	}
	for k := range iv {
		iv[k] = int32(1000*k - 4_000_000)
		want["i"][k] = float64(iv[k])
	}
	for _, format := range []Format{CDF1, CDF2} {
		h := Header{
			Format: format,
			Dims: []Dim{{Name: "nd", Len: nd}, {Name: "nf", Len: nf}, {Name: "ns", Len: ns},
				{Name: "nb", Len: nb}, {Name: "ni", Len: ni}},
			Vars: []Var{
				{Name: "s", Type: Short, Dims: []string{"ns"}},
				{Name: "d", Type: Double, Dims: []string{"nd"}},
				{Name: "b", Type: Byte, Dims: []string{"nb"}},
				{Name: "f", Type: Float, Dims: []string{"nf"}},
				{Name: "i", Type: Int, Dims: []string{"ni"}},
			},
		}
		path := filepath.Join(t.TempDir(), "large.nc")
		err := Create(path, h, func(w *Writer) error {
			for _, step := range []func() error{
				func() error { return w.WriteInt16s("s", s[:3]) },
				func() error { return w.WriteInt16s("s", s[3:]) },
				func() error { return w.WriteFloat64s("d", d[:5000]) },
				func() error { return w.WriteFloat64s("d", d[5000:]) },
				func() error { return w.WriteInt8s("b", b) },
				func() error { return w.WriteFloat32s("f", f[:8193]) },
				func() error { return w.WriteFloat32s("f", f[8193:]) },
				func() error { return w.WriteInt32s("i", iv) },
			} {
				if err := step(); err != nil {
					return err
				}
			}
			return nil
		})
		if err != nil {
			t.Fatal(err)
		}
		for name, wv := range want {
			got := ncdumpValues(t, ncdump, path, name)
			if len(got) != len(wv) {
				t.Fatalf("%v %s: ncdump shows %d values, want %d", format, name, len(got), len(wv))
			}
			for k := range wv {
				if got[k] != wv[k] {
					t.Fatalf("%v %s[%d]: ncdump shows %v, want %v", format, name, k, got[k], wv[k])
				}
			}
		}
	}
}
