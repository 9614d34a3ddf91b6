package plot

import (
	"bytes"
	"encoding/xml"
	"image"
	"image/png"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/vgimg"
)

func sectionFigure() Figure {
	x := []float64{0, 5, 10, 15, 20, 25, 30}
	upper := make([]float64, len(x))
	lower := make([]float64, len(x))
	lo := make([]float64, len(x))
	hi := make([]float64, len(x))
	for i, d := range x {
		upper[i] = 30 / (1 + math.Exp(-(d-15)/4))
		lower[i] = upper[i] + 2
		lo[i] = upper[i] - 3
		hi[i] = lower[i] + 3
	}
	return Section("Salinity along the Quell", x, Quantity{"Practical salinity", "1"},
		[]Line{{"upper layer", upper}, {"lower layer", lower}},
		&Band{Label: "tidal range", Lo: lo, Hi: hi})
}

func spectraFigure() Figure {
	wl := []float64{400, 450, 500, 550, 600, 650, 700}
	var lines []Line
	for k, name := range []string{"Quellmouth", "mid-estuary", "river"} {
		y := make([]float64, len(wl))
		for i, l := range wl {
			y[i] = 0.01 * float64(k+1) * math.Pow(550/l, 1.0)
		}
		lines = append(lines, Line{name, y})
	}
	f := Spectra("Backscattering spectra", wl, Quantity{"Backscattering coefficient b_b", "m-1"}, lines)
	f.LogY = true
	return f
}

func envelopeFigure() Figure {
	n := 25
	t := make([]float64, n)
	mean := make([]float64, n)
	lo := make([]float64, n)
	hi := make([]float64, n)
	for i := range n {
		t[i] = float64(i) * 0.5
		mean[i] = 2 + math.Sin(2*math.Pi*t[i]/12.42)
		lo[i], hi[i] = mean[i]-0.5, mean[i]+0.7
	}
	return Envelope("Attenuation at Quellmouth", t, Quantity{"Beam attenuation c", "m-1"},
		[]Line{{"depth mean", mean}}, Band{Label: "min to max over depth", Lo: lo, Hi: hi})
}

// svgTexts returns the root element name and all character data of an SVG
// document, which must be well-formed XML.
func svgTexts(t *testing.T, b []byte) (string, string) {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(b))
	root := ""
	var text strings.Builder
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("SVG is not well-formed XML: %v", err)
		}
		switch v := tok.(type) {
		case xml.StartElement:
			if root == "" {
				root = v.Name.Local
			}
		case xml.CharData:
			text.Write(v)
			text.WriteByte('\n')
		}
	}
	return root, text.String()
}

// Each figure is saved as an SVG (well-formed XML, root <svg>, axis labels
// with units present as text) and a PNG that image/png decodes at the
// size gonum/plot's vgimg gives at its DefaultDPI.
func TestSave(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		name   string
		fig    Figure
		labels []string
	}{
		{"section", sectionFigure(), []string{"Distance along channel (km)", "Practical salinity (dimensionless)", "tidal range", "upper layer"}},
		{"spectra", spectraFigure(), []string{"Wavelength (nm)", "Backscattering coefficient b_b (m-1)", "Quellmouth"}},
		{"envelope", envelopeFigure(), []string{"Time since start (h)", "Beam attenuation c (m-1)", "min to max over depth"}},
	} {
		t.Run(c.name, func(t *testing.T) {
			base := filepath.Join(dir, c.name)
			if err := c.fig.Save(base); err != nil {
				t.Fatal(err)
			}
			svg, err := os.ReadFile(base + ".svg")
			if err != nil {
				t.Fatal(err)
			}
			root, text := svgTexts(t, svg)
			if root != "svg" {
				t.Errorf("SVG root element %q, want svg", root)
			}
			for _, want := range append(c.labels, c.fig.Title) {
				if !strings.Contains(text, want) {
					t.Errorf("SVG lacks text %q", want)
				}
			}
			f, err := os.Open(base + ".png")
			if err != nil {
				t.Fatal(err)
			}
			defer f.Close()
			img, err := png.Decode(f)
			if err != nil {
				t.Fatalf("PNG does not decode: %v", err)
			}
			// vgimg sizes images as round(length in inches × DPI).
			w, h := defaultWidth.Dots(vgimg.DefaultDPI), defaultHeight.Dots(vgimg.DefaultDPI)
			if b := img.Bounds(); b.Dx() != int(w+0.5) || b.Dy() != int(h+0.5) {
				t.Errorf("PNG is %d × %d px, want %.0f × %.0f", b.Dx(), b.Dy(), w, h)
			}
			// A drawn figure has background, text, grid, band and lines
			// (common practice: a blank or failed render is one colour).
			if n := distinctColours(img); n < 4 {
				t.Errorf("PNG has %d distinct colours; a drawn figure has lines, band, text", n)
			}
		})
	}
}

func distinctColours(img image.Image) int {
	seen := map[[4]uint32]bool{}
	b := img.Bounds()
	for y := b.Min.Y; y < b.Max.Y; y += 3 {
		for x := b.Min.X; x < b.Max.X; x += 3 {
			r, g, bl, a := img.At(x, y).RGBA()
			seen[[4]uint32{r, g, bl, a}] = true
		}
	}
	return len(seen)
}

// Bad figures are refused before any file is touched: nothing new appears
// and an earlier file keeps its content.
func TestSaveAtomicOnError(t *testing.T) {
	cases := []struct {
		name string
		edit func(*Figure)
		want string
	}{
		{"nan", func(f *Figure) { f.Lines[0].Y[2] = math.NaN() }, `line "upper layer" value 2 is NaN`},
		{"length", func(f *Figure) { f.Lines[1].Y = f.Lines[1].Y[:3] }, `line "lower layer" has 3 values for 7`},
		{"x order", func(f *Figure) { f.XData[3] = f.XData[2] }, "Distance along channel[3] = 10 km breaks strictly monotonic"},
		{"x short", func(f *Figure) { f.XData = f.XData[:1] }, "1 Distance along channel values; allowed at least 2"},
		{"no unit", func(f *Figure) { f.Y.Unit = "" }, `Y axis needs Name and Unit`},
		{"no label", func(f *Figure) { f.Lines[1].Label = "" }, "line 1 has no Label"},
		{"band order", func(f *Figure) { f.Band.Lo[4], f.Band.Hi[4] = 5, 4 }, `band "tidal range" at index 4 is [5, 4]`},
		{"log", func(f *Figure) { f.LogY = true; f.Band.Lo[0] = 0 }, "allowed finite and > 0 (log axis)"},
		{"no lines", func(f *Figure) { f.Lines = nil }, "no lines"},
		{"title", func(f *Figure) { f.Title = "" }, "Title is empty"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			dir := t.TempDir()
			base := filepath.Join(dir, "fig")
			if err := os.WriteFile(base+".svg", []byte("earlier"), 0o644); err != nil {
				t.Fatal(err)
			}
			f := sectionFigure()
			c.edit(&f)
			err := f.Save(base)
			if err == nil || !strings.Contains(err.Error(), c.want) {
				t.Fatalf("err = %v, want it to contain %q", err, c.want)
			}
			entries, _ := os.ReadDir(dir)
			if len(entries) != 1 {
				t.Errorf("files after failed Save: %v, want only fig.svg", entries)
			}
			if b, _ := os.ReadFile(base + ".svg"); string(b) != "earlier" {
				t.Errorf("earlier file changed to %d bytes", len(b))
			}
		})
	}
	// A write failure (missing directory) leaves nothing either.
	f := sectionFigure()
	if err := f.Save(filepath.Join(t.TempDir(), "missing", "fig")); err == nil {
		t.Error("Save into a missing directory: no error")
	}
}

func TestWriteToFormats(t *testing.T) {
	f := spectraFigure()
	f.Width, f.Height = 10*vg.Centimeter, 8*vg.Centimeter
	var buf bytes.Buffer
	if err := f.WriteTo(&buf, PNG); err != nil {
		t.Fatal(err)
	}
	cfg, err := png.DecodeConfig(&buf)
	if err != nil {
		t.Fatal(err)
	}
	if want := int(f.Width.Dots(vgimg.DefaultDPI) + 0.5); cfg.Width != want {
		t.Errorf("width %d px, want %d", cfg.Width, want)
	}
	if err := f.WriteTo(io.Discard, "gif"); err == nil || !strings.Contains(err.Error(), `format "gif"`) {
		t.Errorf("unknown format: err = %v", err)
	}
}

// BenchmarkSave renders a section figure (7 points, 2 lines and a band)
// in each format into memory.
func BenchmarkRender(b *testing.B) {
	f := sectionFigure()
	for _, format := range []Format{SVG, PNG} {
		b.Run(string(format), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if err := f.WriteTo(io.Discard, format); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// Log-axis ticks: powers of ten always labelled, 2 and 5 too on narrow
// axes (common practice for log axes).
func TestLogTicks(t *testing.T) {
	labels := func(min, max float64) []string {
		var out []string
		for _, tk := range (logTicks{}).Ticks(min, max) {
			if tk.Label != "" {
				out = append(out, tk.Label)
			}
		}
		return out
	}
	if got := strings.Join(labels(0.007, 0.06), " "); got != "0.01 0.02 0.05" {
		t.Errorf("narrow axis labels %q, want \"0.01 0.02 0.05\"", got)
	}
	if got := strings.Join(labels(0.001, 10), " "); got != "0.001 0.01 0.1 1 10" {
		t.Errorf("wide axis labels %q", got)
	}
}
