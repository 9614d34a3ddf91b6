// Package plot draws murk's figures with gonum.org/v1/plot and saves each
// as SVG and PNG:
//
//   - [Section]: a quantity along the channel (x = distance along the
//     channel in km), one line per layer or per wavelength, optionally over
//     a shaded band such as the tidal range;
//   - [Spectra]: spectra at stations (x = wavelength in nm), one line per
//     station;
//   - [Envelope]: a tidal envelope at a station (x = time in h since the
//     start), lines over a shaded minimum-to-maximum band.
//
// Every axis label states its unit ("Name (unit)"; "(dimensionless)" for
// unit "1"). A figure is checked before it is drawn: lengths must match, X
// values must be strictly monotonic, all values finite (and positive on a
// logarithmic Y axis), and errors name the figure, the line or band, the
// index and the value. [Figure.Save] draws both formats in memory first and
// then writes each file through package safefile, so an error leaves no
// partial file and keeps earlier files intact.
//
// Figures are 16 cm × 10 cm unless set; PNG files use gonum/plot's 96 dots
// per inch. Colours and dash patterns follow gonum's plotutil palette in
// line order; the band is light grey beneath the lines.
package plot
