package products

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"sync"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/internal/safefile"
	"github.com/murk-optics/murk/scenario/plot"
)

// product is one output file: its path and the function that writes it
// there atomically.
type product struct {
	path  string
	write func(path string) error
}

// atomic is a product written through safefile (temporary file, rename).
func atomic(path string, fill func(io.Writer) error) product {
	return product{path, func(p string) error { return safefile.Write(p, fill) }}
}

// WriteOutputs writes the products the scenario asks for (Outputs: CSV
// tables, NetCDF, figures, the summary) into dir and returns the paths
// written, in a fixed order (CSV, NetCDF, figures, summary). A scenario
// that lists no product gets CSV tables and the summary.
func WriteOutputs(r *scenario.Result, dir string) ([]string, error) {
	o := r.Scenario.Outputs
	if !o.CSV && !o.NetCDF && !o.Plots && !o.Summary {
		o.CSV, o.Summary = true, true
	}
	var ps []product
	if o.CSV {
		ps = append(ps, csvProducts(r, dir)...)
	}
	if o.NetCDF {
		ps = append(ps, product{filepath.Join(dir, "murk.nc"), func(path string) error { return WriteNetCDF(r, path) }})
	}
	if o.Plots {
		fp, err := plotProducts(r, dir)
		if err != nil {
			return nil, err
		}
		ps = append(ps, fp...)
	}
	if o.Summary {
		ps = append(ps, summaryProduct(r, dir))
	}
	return writeProducts(dir, ps)
}

// writeProducts writes the products into dir (created if needed), several
// at once on GOMAXPROCS goroutines: each file depends only on the scenario.Result,
// so its bytes do not depend on the order or the number of workers. It
// returns the paths written, in the order of ps, and the first error in
// that order; every file is written atomically, so a failed product leaves
// no partial file and the others stay.
func writeProducts(dir string, ps []product) ([]string, error) {
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
				errs[i] = ps[i].write(ps[i].path)
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
			out = append(out, p.path)
		}
	}
	return out, errors.Join(errs...)
}

// csvProducts are the CSV tables, each written in chunks of output times.
func csvProducts(r *scenario.Result, dir string) []product {
	var ps []product
	for _, f := range csvTables(r) {
		ps = append(ps, atomic(filepath.Join(dir, f.name), func(w io.Writer) error { return f.writeCSV(w, len(r.Times)) }))
	}
	return ps
}

// plotProducts are the figures in the scenario's plot formats (SVG and
// PNG by default), every figure checked before any is drawn.
func plotProducts(r *scenario.Result, dir string) ([]product, error) {
	formats := r.Scenario.Outputs.PlotFormats
	if len(formats) == 0 {
		formats = []string{"svg", "png"}
	}
	var ps []product
	for _, nf := range Figures(r) {
		f := nf.Figure
		if err := f.Check(); err != nil {
			return nil, fmt.Errorf("figure %s: %w", nf.Base, err)
		}
		for _, fm := range formats {
			ps = append(ps, atomic(filepath.Join(dir, nf.Base+"."+fm), func(w io.Writer) error {
				if err := f.WriteTo(w, plot.Format(fm)); err != nil {
					return fmt.Errorf("figure %s: %w", nf.Base, err)
				}
				return nil
			}))
		}
	}
	return ps, nil
}

func summaryProduct(r *scenario.Result, dir string) product {
	return atomic(filepath.Join(dir, "summary.txt"), func(w io.Writer) error { return WriteSummary(r, w) })
}

// WriteCSV writes the CSV tables of the run into dir (created if needed)
// and returns the paths written. Every file is written to a temporary file
// and renamed, so an error leaves no partial file.
func WriteCSV(r *scenario.Result, dir string) ([]string, error) {
	return writeProducts(dir, csvProducts(r, dir))
}

// WritePlots draws every figure into dir in the scenario's plot formats
// (SVG and PNG by default) and returns the paths written.
func WritePlots(r *scenario.Result, dir string) ([]string, error) {
	ps, err := plotProducts(r, dir)
	if err != nil {
		return nil, err
	}
	return writeProducts(dir, ps)
}

// WriteSummaryFile writes the text summary to dir/summary.txt atomically.
func WriteSummaryFile(r *scenario.Result, dir string) (string, error) {
	p := summaryProduct(r, dir)
	_, err := writeProducts(dir, []product{p})
	return p.path, err
}
