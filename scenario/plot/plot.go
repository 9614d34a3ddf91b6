package plot

import (
	"bytes"
	"fmt"
	"image/color"
	"image/png"
	"io"
	"math"
	"strconv"

	gplot "gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"

	"github.com/murk-optics/murk/scenario/internal/safefile"
)

// Quantity names what an axis shows and its unit. The axis label reads
// "Name (Unit)"; a dimensionless quantity has Unit "1" and is labelled
// "Name (dimensionless)".
type Quantity struct {
	Name string // e.g. "Backscattering coefficient b_b"
	Unit string // UDUNITS-style, e.g. "m-1"; required, "1" if dimensionless
}

// Label is the axis label for q.
func (q Quantity) Label() string {
	if q.Unit == "1" {
		return q.Name + " (dimensionless)"
	}
	return q.Name + " (" + q.Unit + ")"
}

// Line is one curve over the figure's X values.
type Line struct {
	Label string    // legend entry; required when a figure has more than one line
	Y     []float64 // one value per X, finite
}

// Band is a shaded range over the figure's X values, e.g. the tidal
// minimum to maximum.
type Band struct {
	Label  string    // legend entry; optional
	Lo, Hi []float64 // one value per X, finite, Lo ≤ Hi
}

// Figure is one line plot with an optional shaded band. Use [Section],
// [Spectra] or [Envelope] to build the three figures murk draws.
type Figure struct {
	Title string
	X, Y  Quantity
	XData []float64 // strictly monotonic, finite, at least 2 values
	Lines []Line    // at least one
	Band  *Band     // optional, drawn beneath the lines
	LogY  bool      // logarithmic Y axis; every value must then be > 0
	// Width and Height of the figure; 16 cm × 10 cm when zero. PNG
	// files are rendered at 96 dots per inch (gonum/plot's default).
	Width, Height vg.Length
}

// Section is a figure along the channel: x is the distance along the
// channel in km, one line per layer or per wavelength, with an optional
// band (for example the tidal range).
func Section(title string, distanceKm []float64, y Quantity, lines []Line, band *Band) Figure {
	return Figure{Title: title, X: Quantity{"Distance along channel", "km"}, Y: y,
		XData: distanceKm, Lines: lines, Band: band}
}

// Spectra is a figure of spectra at stations: x is the wavelength in nm,
// one line per station.
func Spectra(title string, wavelengthNm []float64, y Quantity, lines []Line) Figure {
	return Figure{Title: title, X: Quantity{"Wavelength", "nm"}, Y: y, XData: wavelengthNm, Lines: lines}
}

// Envelope is a tidal envelope at a station: x is the time in hours since
// the start of the run, lines (e.g. mean or per layer) over a band from the
// minimum to the maximum.
func Envelope(title string, timeH []float64, y Quantity, lines []Line, band Band) Figure {
	return Figure{Title: title, X: Quantity{"Time since start", "h"}, Y: y,
		XData: timeH, Lines: lines, Band: &band}
}

// Format is an output format.
type Format string

// The formats a figure is saved in.
const (
	SVG Format = "svg"
	PNG Format = "png"
)

const (
	defaultWidth  = 16 * vg.Centimeter
	defaultHeight = 10 * vg.Centimeter
)

func badValue(v float64, logY bool) bool {
	return math.IsNaN(v) || math.IsInf(v, 0) || (logY && v <= 0)
}

// Check reports the first problem that would stop f from being drawn.
func (f *Figure) Check() error {
	if f.Title == "" {
		return fmt.Errorf("plot: Title is empty")
	}
	for _, q := range []struct {
		axis string
		q    Quantity
	}{{"X", f.X}, {"Y", f.Y}} {
		if q.q.Name == "" || q.q.Unit == "" {
			return fmt.Errorf("plot %q: %s axis needs Name and Unit, got %q and %q (Unit \"1\" for dimensionless)", f.Title, q.axis, q.q.Name, q.q.Unit)
		}
	}
	n := len(f.XData)
	if n < 2 {
		return fmt.Errorf("plot %q: %d %s values; allowed at least 2", f.Title, n, f.X.Name)
	}
	up := f.XData[1] > f.XData[0]
	for i, x := range f.XData {
		if math.IsNaN(x) || math.IsInf(x, 0) || (i > 0 && (x > f.XData[i-1]) != up) || (i > 0 && x == f.XData[i-1]) {
			return fmt.Errorf("plot %q: %s[%d] = %g %s breaks strictly monotonic finite order", f.Title, f.X.Name, i, x, f.X.Unit)
		}
	}
	if len(f.Lines) == 0 {
		return fmt.Errorf("plot %q: no lines; allowed at least 1", f.Title)
	}
	allowed := "finite"
	if f.LogY {
		allowed = "finite and > 0 (log axis)"
	}
	for k, l := range f.Lines {
		if len(f.Lines) > 1 && l.Label == "" {
			return fmt.Errorf("plot %q: line %d has no Label; required when there are %d lines", f.Title, k, len(f.Lines))
		}
		if len(l.Y) != n {
			return fmt.Errorf("plot %q: line %q has %d values for %d %s values", f.Title, l.Label, len(l.Y), n, f.X.Name)
		}
		for i, y := range l.Y {
			if badValue(y, f.LogY) {
				return fmt.Errorf("plot %q: line %q value %d is %g %s; allowed %s", f.Title, l.Label, i, y, f.Y.Unit, allowed)
			}
		}
	}
	if b := f.Band; b != nil {
		if len(b.Lo) != n || len(b.Hi) != n {
			return fmt.Errorf("plot %q: band %q has %d low and %d high values for %d %s values", f.Title, b.Label, len(b.Lo), len(b.Hi), n, f.X.Name)
		}
		for i := range b.Lo {
			if badValue(b.Lo[i], f.LogY) || badValue(b.Hi[i], f.LogY) || b.Lo[i] > b.Hi[i] {
				return fmt.Errorf("plot %q: band %q at index %d is [%g, %g] %s; allowed %s with low ≤ high", f.Title, b.Label, i, b.Lo[i], b.Hi[i], f.Y.Unit, allowed)
			}
		}
	}
	if f.Width < 0 || f.Height < 0 {
		return fmt.Errorf("plot %q: size %v × %v; allowed positive or zero (default)", f.Title, f.Width, f.Height)
	}
	return nil
}

// bandColor is the fill of the shaded band: a light grey, so that it reads
// as background behind the coloured lines.
var bandColor = color.NRGBA{R: 200, G: 200, B: 210, A: 255}

// build makes the gonum plot for f, which must have passed Check.
func (f *Figure) build() (*gplot.Plot, error) {
	p := gplot.New()
	p.Title.Text = f.Title
	p.X.Label.Text = f.X.Label()
	p.Y.Label.Text = f.Y.Label()
	if f.LogY {
		p.Y.Scale = gplot.LogScale{}
		p.Y.Tick.Marker = logTicks{}
	}
	p.Add(plotter.NewGrid())
	if b := f.Band; b != nil {
		ring := make(plotter.XYs, 0, 2*len(f.XData))
		for i, x := range f.XData {
			ring = append(ring, plotter.XY{X: x, Y: b.Hi[i]})
		}
		for i := len(f.XData) - 1; i >= 0; i-- {
			ring = append(ring, plotter.XY{X: f.XData[i], Y: b.Lo[i]})
		}
		poly, err := plotter.NewPolygon(ring)
		if err != nil {
			return nil, fmt.Errorf("plot %q: band: %w", f.Title, err)
		}
		poly.Color = bandColor
		poly.LineStyle.Width = 0
		p.Add(poly)
		if b.Label != "" {
			p.Legend.Add(b.Label, poly)
		}
	}
	for k, l := range f.Lines {
		xy := make(plotter.XYs, len(f.XData))
		for i, x := range f.XData {
			xy[i] = plotter.XY{X: x, Y: l.Y[i]}
		}
		line, err := plotter.NewLine(xy)
		if err != nil {
			return nil, fmt.Errorf("plot %q: line %q: %w", f.Title, l.Label, err)
		}
		line.Color = plotutil.Color(k)
		line.Dashes = plotutil.Dashes(k)
		line.Width = vg.Points(1.5)
		p.Add(line)
		if l.Label != "" {
			p.Legend.Add(l.Label, line)
		}
	}
	p.Legend.Top = true
	f.legendRoom(p)
	return p, nil
}

// legendRoom raises the top of the Y axis so that the legend, drawn in the
// top right corner, sits above the data instead of over them.
func (f *Figure) legendRoom(p *gplot.Plot) {
	entries := len(f.Lines)
	if f.Band != nil && f.Band.Label != "" {
		entries++
	}
	if entries == 1 && f.Lines[0].Label == "" {
		return
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	see := func(v float64) {
		if f.LogY {
			v = math.Log10(v)
		}
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	for _, l := range f.Lines {
		for _, y := range l.Y {
			see(y)
		}
	}
	if b := f.Band; b != nil {
		for i := range b.Lo {
			see(b.Lo[i])
			see(b.Hi[i])
		}
	}
	span := hi - lo
	if span == 0 {
		span = math.Max(math.Abs(hi), 1) * 0.1
		lo -= span / 2
		hi += span / 2
		span *= 2
	}
	// Fraction of the data area the legend needs: one text line per entry
	// (legend font ≈ 12 pt plus spacing) of a data area about 75 % of the
	// figure's height.
	_, h := f.size()
	frac := math.Min(0.6, (float64(entries)*14+8)/(0.75*h.Points()))
	top := hi + span*frac/(1-frac)
	if f.LogY {
		p.Y.Min, p.Y.Max = math.Pow(10, lo), math.Pow(10, top)
	} else {
		p.Y.Min, p.Y.Max = lo, top
	}
}

// logTicks marks a logarithmic axis: every power of ten labelled, and
// also 2 and 5 times powers of ten when the axis spans at most two decades
// (gonum's LogTicks labels only powers of ten, which leaves a narrow axis
// with one label or none).
type logTicks struct{}

func (logTicks) Ticks(min, max float64) []gplot.Tick {
	lo, hi := math.Floor(math.Log10(min)), math.Ceil(math.Log10(max))
	dense := hi-lo <= 2
	var ticks []gplot.Tick
	for e := lo; e <= hi; e++ {
		base := math.Pow(10, e)
		for i := 1; i <= 9; i++ {
			v := float64(i) * base
			if v < min*(1-1e-9) || v > max*(1+1e-9) {
				continue
			}
			t := gplot.Tick{Value: v}
			if i == 1 || (dense && (i == 2 || i == 5)) {
				t.Label = strconv.FormatFloat(v, 'g', 3, 64)
			}
			ticks = append(ticks, t)
		}
	}
	return ticks
}

func (f *Figure) size() (w, h vg.Length) {
	w, h = f.Width, f.Height
	if w == 0 {
		w = defaultWidth
	}
	if h == 0 {
		h = defaultHeight
	}
	return w, h
}

// render checks f and draws it in format into memory.
func (f *Figure) render(format Format) ([]byte, error) {
	if err := f.Check(); err != nil {
		return nil, err
	}
	if format != SVG && format != PNG {
		return nil, fmt.Errorf("plot %q: format %q; allowed %q or %q", f.Title, format, SVG, PNG)
	}
	p, err := f.build()
	if err != nil {
		return nil, err
	}
	w, h := f.size()
	var buf bytes.Buffer
	if format == PNG {
		// Drawn on vgimg's canvas (DefaultDPI) and encoded here with
		// png.BestSpeed: the default zlib level took two thirds of the
		// time for a few per cent smaller files.
		c := vgimg.New(w, h)
		p.Draw(draw.New(c))
		enc := png.Encoder{CompressionLevel: png.BestSpeed}
		if err := enc.Encode(&buf, c.Image()); err != nil {
			return nil, fmt.Errorf("plot %q: encoding PNG: %w", f.Title, err)
		}
		return buf.Bytes(), nil
	}
	wt, err := p.WriterTo(w, h, string(format))
	if err != nil {
		return nil, fmt.Errorf("plot %q: %w", f.Title, err)
	}
	if _, err := wt.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("plot %q: rendering %s: %w", f.Title, format, err)
	}
	return buf.Bytes(), nil
}

// WriteTo draws f in format to out.
func (f *Figure) WriteTo(out io.Writer, format Format) error {
	b, err := f.render(format)
	if err != nil {
		return err
	}
	_, err = out.Write(b)
	return err
}

// Save writes f as base+".svg" and base+".png". Both figures are checked
// and drawn in memory before any file is touched, and each file is written
// to a temporary file and renamed (package safefile), so a bad figure or a
// failed write leaves no partial file and keeps any earlier file intact.
func (f *Figure) Save(base string) error {
	svg, err := f.render(SVG)
	if err != nil {
		return err
	}
	png, err := f.render(PNG)
	if err != nil {
		return err
	}
	for _, out := range []struct {
		path string
		data []byte
	}{{base + ".svg", svg}, {base + ".png", png}} {
		err := safefile.Write(out.path, func(w io.Writer) error {
			_, err := w.Write(out.data)
			return err
		})
		if err != nil {
			return fmt.Errorf("plot %q: %w", f.Title, err)
		}
	}
	return nil
}
