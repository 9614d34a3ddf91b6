package cf

import (
	"io"

	"github.com/murk-optics/murk/scenario/internal/safefile"
	"github.com/murk-optics/murk/scenario/netcdf"
)

// Writer streams the data of a [Dataset]. It writes the values of the time
// and other coordinate variables itself as they fall due in file order
// (all fixed-size coordinates before the first data variable, the time of
// each record at the start of that record when time is unlimited), so the
// caller writes only the data variables, in the order of the
// [netcdf.Writer]: fixed-size variables in definition order, then for each
// record each record variable.
type Writer struct {
	w      *netcdf.Writer
	coords map[string]coordData
	labels map[string]string
}

type coordData struct {
	f64 []float64
	f32 []float32 // non-nil for Float coordinates
}

// NewWriter writes the header of d to out and returns a Writer for its
// data.
func NewWriter(out io.Writer, d *Dataset) (*Writer, error) {
	h, err := d.Header()
	if err != nil {
		return nil, err
	}
	nw, err := netcdf.NewWriter(out, h)
	if err != nil {
		return nil, err
	}
	w := &Writer{w: nw, coords: make(map[string]coordData, len(d.coords)), labels: d.labels}
	for _, v := range h.Vars {
		vals, ok := d.coords[v.Name]
		if !ok {
			continue
		}
		c := coordData{f64: vals}
		if v.Type == netcdf.Float {
			c.f32 = make([]float32, len(vals))
			for i, x := range vals {
				c.f32[i] = float32(x)
			}
		}
		w.coords[v.Name] = c
	}
	return w, nil
}

// Create writes the file at path atomically (see [netcdf.Create]): fill
// writes the data variables; on any error no file and no temporary file
// remain.
func Create(path string, d *Dataset, fill func(w *Writer) error) error {
	return safefile.Write(path, func(out io.Writer) error {
		w, err := NewWriter(out, d)
		if err != nil {
			return err
		}
		if err := fill(w); err != nil {
			return err
		}
		return w.Close()
	})
}

// coordinates writes every coordinate slab that is due next.
func (w *Writer) coordinates() error {
	for {
		name, rec, _ := w.w.Next()
		if text, ok := w.labels[name]; ok {
			if err := w.w.WriteText(name, text); err != nil {
				return err
			}
			continue
		}
		c, ok := w.coords[name]
		if !ok {
			return nil
		}
		lo, hi := 0, len(c.f64)
		if rec >= 0 {
			lo, hi = rec, rec+1
		}
		var err error
		if c.f32 != nil {
			err = w.w.WriteFloat32s(name, c.f32[lo:hi])
		} else {
			err = w.w.WriteFloat64s(name, c.f64[lo:hi])
		}
		if err != nil {
			return err
		}
	}
}

// Next reports the data variable due next, its record (-1 for fixed-size)
// and the values that remain of its slab; "" when the file is complete.
func (w *Writer) Next() (name string, record, remaining int) {
	if err := w.coordinates(); err != nil {
		return "", -1, 0 // the error is sticky and returned by the next call
	}
	return w.w.Next()
}

// Float64s writes the next values of the Double variable name.
func (w *Writer) Float64s(name string, v []float64) error {
	if err := w.coordinates(); err != nil {
		return err
	}
	return w.w.WriteFloat64s(name, v)
}

// Float32s writes the next values of the Float variable name.
func (w *Writer) Float32s(name string, v []float32) error {
	if err := w.coordinates(); err != nil {
		return err
	}
	return w.w.WriteFloat32s(name, v)
}

// Int32s writes the next values of the Int variable name.
func (w *Writer) Int32s(name string, v []int32) error {
	if err := w.coordinates(); err != nil {
		return err
	}
	return w.w.WriteInt32s(name, v)
}

// Int16s writes the next values of the Short variable name.
func (w *Writer) Int16s(name string, v []int16) error {
	if err := w.coordinates(); err != nil {
		return err
	}
	return w.w.WriteInt16s(name, v)
}

// Int8s writes the next values of the Byte variable name.
func (w *Writer) Int8s(name string, v []int8) error {
	if err := w.coordinates(); err != nil {
		return err
	}
	return w.w.WriteInt8s(name, v)
}

// Close writes any coordinates still due and checks that the file is
// complete.
func (w *Writer) Close() error {
	if err := w.coordinates(); err != nil {
		return err
	}
	return w.w.Close()
}
