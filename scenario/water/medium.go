package water

// IndexFunc returns water's real refractive index (relative to vacuum) as a
// function of vacuum wavelength in metres for this medium, in the form the
// particle index models take as their medium (refindex.Medium). The medium
// is checked here, once; the returned function evaluates the Quan & Fry
// (1995) relation times the index of air without a range check, so callers
// must keep to 350–900 nm, where RefractiveIndex documents its accuracy
// (the relation is a polynomial in 1/λ times Ciddor's air index, finite for
// all wavelengths above 140 nm; the air term has poles near 65 and 132 nm).
func (m Medium) IndexFunc() (func(lambda float64) float64, error) {
	if err := m.check(); err != nil {
		return nil, err
	}
	return func(lambda float64) float64 {
		n, _ := seawaterIndexNM(lambda*1e9, m.Salinity, m.TemperatureC)
		return n
	}, nil
}
