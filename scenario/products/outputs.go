package products

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"slices"
	"sync"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/internal/safefile"
	"github.com/murk-optics/murk/scenario/spec"
)

// Product is one kind of output of a run: CSV tables, the NetCDF file,
// figures, the text summary. Adding a product is one file that implements
// it plus one line in Registry.
type Product interface {
	// Name is the product's name in a scenario's outputs.products list.
	Name() string
	// Files lists the files the product writes for r, each with the
	// function that writes it at a path; nothing is written yet.
	Files(r *scenario.Result) ([]File, error)
}

// File is one output file of a product.
type File struct {
	Name  string                  // base name inside the output directory
	Write func(path string) error // writes the file at path atomically
}

// Registry lists every product in the order its files are written and
// reported.
var Registry = []Product{CSV{}, NetCDF{}, Plots{}, Summary{}}

// atomic is a file written through safefile (temporary file, rename).
func atomic(name string, fill func(io.Writer) error) File {
	return File{name, func(p string) error { return safefile.Write(p, fill) }}
}

// Requested returns the names of the products a scenario's outputs
// section asks for; a section that lists none gets CSV tables and the
// summary.
func Requested(o spec.Outputs) []string {
	var names []string
	for _, p := range []struct {
		on   bool
		name string
	}{{o.CSV, "csv"}, {o.NetCDF, "netcdf"}, {o.Plots, "plots"}, {o.Summary, "summary"}} {
		if p.on {
			names = append(names, p.name)
		}
	}
	if len(names) == 0 {
		names = []string{"csv", "summary"}
	}
	return names
}

// WriteOutputs writes the products the scenario asks for into dir and
// returns the paths written, in Registry order.
func WriteOutputs(r *scenario.Result, dir string) ([]string, error) {
	return Write(r, dir, Requested(r.Scenario.Outputs))
}

// Write writes the named products of r into dir (created if needed) and
// returns the paths written, in Registry order. Every file of every
// product is prepared (and checked) before any is written.
func Write(r *scenario.Result, dir string, names []string) ([]string, error) {
	var files []File
	for _, p := range Registry {
		if !slices.Contains(names, p.Name()) {
			continue
		}
		fs, err := p.Files(r)
		if err != nil {
			return nil, fmt.Errorf("%s: %w", p.Name(), err)
		}
		files = append(files, fs...)
	}
	return writeFiles(dir, files)
}

// writeFiles writes the files into dir (created if needed), several
// at once on GOMAXPROCS goroutines: each file depends only on the scenario.Result,
// so its bytes do not depend on the order or the number of workers. It
// returns the paths written, in the order of ps, and the first error in
// that order; every file is written atomically, so a failed product leaves
// no partial file and the others stay.
func writeFiles(dir string, ps []File) ([]string, error) {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, err
	}
	errs := make([]error, len(ps))
	jobs := make(chan int)
	var wg sync.WaitGroup
	for range min(runtime.GOMAXPROCS(0), len(ps)) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				errs[i] = ps[i].Write(filepath.Join(dir, ps[i].Name))
			}
		}()
	}
	for i := range ps {
		jobs <- i
	}
	close(jobs)
	wg.Wait()
	var out []string
	for i, p := range ps {
		if errs[i] == nil {
			out = append(out, filepath.Join(dir, p.Name))
		}
	}
	return out, errors.Join(errs...)
}
