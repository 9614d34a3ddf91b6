package scenario

// readInstruments simulates every instrument at point p (stage 5, package
// scenario/sensing) from the worker's total IOPs and VSF at salinity sal
// and temperature temp; rrs is the point's remote-sensing reflectance
// when it is in the surface layer, else nil.
func (r *Result) readInstruments(w *worker, p int, sal, temp float64, rrs []float64) error {
	pt := w.point
	pt.A, pt.B, pt.Bb, pt.VSF = w.total.A, w.total.B, w.total.Bb, w.total.VSF
	pt.Salinity, pt.Temperature, pt.Rrs = sal, temp, rrs
	for i, in := range r.Instruments {
		rd, err := in.Read(pt)
		if err != nil {
			return err
		}
		r.Readings[p*len(r.Instruments)+i] = rd
	}
	return nil
}
