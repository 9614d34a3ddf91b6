package products

import (
	"bytes"
	"context"
	"os"
	"path/filepath"
	"runtime"
	"testing"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/internal/testrun"
	"github.com/murk-optics/murk/scenario/table"
)

var smallResult *scenario.Result

// runSmall runs the cut-down demo once for the tests of this package.
func runSmall(t *testing.T) *scenario.Result {
	t.Helper()
	if smallResult != nil {
		return smallResult
	}
	r, err := scenario.Run(context.Background(), testrun.SmallDemo(t), scenario.Options{})
	if err != nil {
		t.Fatal(err)
	}
	smallResult = r
	return r
}

// Identical results for GOMAXPROCS 1 and 2 (STYLE.md: deterministic
// parallel work), compared byte for byte on the CSV tables, the summary
// and the NetCDF file.
func TestDeterministic(t *testing.T) {
	s := testrun.SmallDemo(t)
	s.Estuary.Run.Duration = 2 * 3600
	run := func(procs int) []byte {
		old := runtime.GOMAXPROCS(procs)
		defer runtime.GOMAXPROCS(old)
		r, err := scenario.Run(context.Background(), s, scenario.Options{})
		if err != nil {
			t.Fatal(err)
		}
		var b bytes.Buffer
		for _, tb := range csvTables(r) {
			if err := tb.writeCSV(&b, len(r.Times)); err != nil {
				t.Fatal(err)
			}
		}
		if err := WriteSummary(r, &b); err != nil {
			t.Fatal(err)
		}
		nc := filepath.Join(t.TempDir(), "run.nc")
		if err := WriteNetCDF(r, nc); err != nil {
			t.Fatal(err)
		}
		data, err := os.ReadFile(nc)
		if err != nil {
			t.Fatal(err)
		}
		b.Write(data)
		return b.Bytes()
	}
	one, two := run(1), run(2)
	if !bytes.Equal(one, two) {
		t.Fatalf("outputs differ between GOMAXPROCS 1 and 2 (%d vs %d bytes)", len(one), len(two))
	}
}

// Chunked CSV writing gives the same bytes as the whole table at once.
func TestChunkedCSV(t *testing.T) {
	s := testrun.SmallDemo(t)
	s.Estuary.Run.Duration = 20 * 3600 // 11 output times: two chunks
	r, err := scenario.Run(context.Background(), s, scenario.Options{})
	if err != nil {
		t.Fatal(err)
	}
	var whole, chunked bytes.Buffer
	if err := SpectraTable(r).WriteCSV(&whole); err != nil {
		t.Fatal(err)
	}
	if err := (namedTable{chunk: func(t0, t1 int) *table.Table { return spectraTable(r, t0, t1) }}).writeCSV(&chunked, len(r.Times)); err != nil {
		t.Fatal(err)
	}
	if len(r.Times) <= csvChunk || !bytes.Equal(whole.Bytes(), chunked.Bytes()) {
		t.Errorf("%d times: chunked CSV differs from the whole table (%d vs %d bytes)", len(r.Times), chunked.Len(), whole.Len())
	}
}
