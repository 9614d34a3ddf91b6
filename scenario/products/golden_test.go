package products

import (
	"context"
	"crypto/sha256"
	"encoding/hex"
	"flag"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/demo"
	"github.com/murk-optics/murk/scenario/spec"
)

var updateGolden = flag.Bool("update", false, "rewrite testdata/golden/*.sha256 from this run")

// TestGoldenOutputs runs the embedded demo and the three examples at their
// full resolution and compares the SHA-256 digest of every NetCDF and CSV
// file they write with testdata/golden/<case>.sha256. The digests were
// captured before the pipeline restructure; a refactor must leave every
// byte unchanged, and a physics change that is meant to move the numbers
// regenerates them (go test ./scenario -run TestGoldenOutputs -update) in
// the same commit.
func TestGoldenOutputs(t *testing.T) {
	if testing.Short() {
		t.Skip("full-resolution runs of the demo and the examples")
	}
	cases := []struct {
		name string
		load func() (spec.Scenario, error)
	}{
		{"demo", demo.Scenario},
		{"salt_wedge", func() (spec.Scenario, error) {
			return spec.Load(filepath.Join("..", "..", "examples", "salt_wedge.yaml"))
		}},
		{"partially_mixed", func() (spec.Scenario, error) {
			return spec.Load(filepath.Join("..", "..", "examples", "partially_mixed.yaml"))
		}},
		{"well_mixed", func() (spec.Scenario, error) {
			return spec.Load(filepath.Join("..", "..", "examples", "well_mixed.yaml"))
		}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			s, err := c.load()
			if err != nil {
				t.Fatal(err)
			}
			dir := t.TempDir()
			got := goldenDigests(t, s, dir)
			path := filepath.Join("testdata", "golden", c.name+".sha256")
			if *updateGolden {
				if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatal(err)
			}
			if got != string(want) {
				t.Errorf("outputs of %s changed (regenerate with -update only for an intended physics change):\n%s",
					c.name, diffLines(string(want), got))
			}
		})
	}
}

// goldenDigests runs s, writes its NetCDF and CSV products into dir and
// returns "sha256  file" lines in file-name order.
func goldenDigests(t *testing.T, s spec.Scenario, dir string) string {
	t.Helper()
	s.Outputs = spec.Outputs{Directory: dir, NetCDF: true, CSV: true}
	r, err := scenario.Run(context.Background(), s, scenario.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := WriteOutputs(r, dir); err != nil {
		t.Fatal(err)
	}
	ents, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	var lines []string
	for _, e := range ents {
		b, err := os.ReadFile(filepath.Join(dir, e.Name()))
		if err != nil {
			t.Fatal(err)
		}
		h := sha256.Sum256(b)
		lines = append(lines, hex.EncodeToString(h[:])+"  "+e.Name())
	}
	slices.Sort(lines)
	return strings.Join(lines, "\n") + "\n"
}

// diffLines lists the lines of want missing from got and the reverse.
func diffLines(want, got string) string {
	w, g := strings.Split(want, "\n"), strings.Split(got, "\n")
	var out []string
	for _, l := range w {
		if l != "" && !slices.Contains(g, l) {
			out = append(out, "- "+l)
		}
	}
	for _, l := range g {
		if l != "" && !slices.Contains(w, l) {
			out = append(out, "+ "+l)
		}
	}
	return strings.Join(out, "\n")
}
