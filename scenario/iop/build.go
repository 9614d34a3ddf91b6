package iop

import (
	"fmt"

	"github.com/murk-optics/murk/scenario/water"
)

// FillWater sets c (sized for s, e.g. by Blank) to pure water or seawater of
// medium m: absorption from water.Absorption (merged Pope & Fry 1997 table),
// scattering, backscattering and the VSF from the Zhang, Hu & He (2009)
// model with the default depolarisation ratio. It allocates nothing. c.Kind
// becomes Water and c.Mass 0.
func (s *Spectra) FillWater(c *Component, m water.Medium) error {
	if err := s.sized(c); err != nil {
		return err
	}
	if err := water.Evaluate(s.optics, s.Wavelengths, m, 0); err != nil {
		return err
	}
	na := len(s.Angles)
	for i := range s.optics {
		o := &s.optics[i]
		c.A[i], c.B[i], c.Bb[i] = o.A, o.B, o.Bb
		f := (1 - o.Delta) / (1 + o.Delta)
		row := c.VSF[i*na : (i+1)*na]
		for j, c2 := range s.cos2 {
			row[j] = o.Beta90 * (1 + c2*f)
		}
	}
	c.Kind, c.Mass = Water, 0
	return nil
}

// AddWater appends a component named name holding water of medium m (see
// FillWater).
func (s *Spectra) AddWater(name string, m water.Medium) error {
	c := s.Blank(name, Water, 0)
	if err := s.FillWater(&c, m); err != nil {
		return err
	}
	return s.Add(c)
}

// FillCDOM sets c (sized for s) to the absorption of dissolved organic
// matter mixed conservatively at salinity (see water.CDOMMixing); it does
// not scatter (CDOM scattering is commonly neglected: common practice). It
// allocates nothing. c.Kind becomes Dissolved and c.Mass 0.
func (s *Spectra) FillCDOM(c *Component, mix water.CDOMMixing, salinity float64) error {
	if err := s.sized(c); err != nil {
		return err
	}
	if err := mix.Spectrum(c.A, s.Wavelengths, salinity); err != nil {
		return err
	}
	clear(c.B)
	clear(c.Bb)
	clear(c.VSF)
	c.Kind, c.Mass = Dissolved, 0
	return nil
}

// AddCDOM appends a component named name holding mixed CDOM absorption at
// salinity (see FillCDOM).
func (s *Spectra) AddCDOM(name string, mix water.CDOMMixing, salinity float64) error {
	c := s.Blank(name, Dissolved, 0)
	if err := s.FillCDOM(&c, mix, salinity); err != nil {
		return err
	}
	return s.Add(c)
}

// AddPigment appends an absorption-only component for phytoplankton pigment
// at chlorophyll concentration chl (kg m⁻³) from model p (e.g.
// water.BricaudDefault()). Use it when cells are not also modelled as a
// particle population, whose Mie absorption would count the pigment twice.
// Mass is left 0: chlorophyll is not the particles' mass.
func (s *Spectra) AddPigment(name string, p water.ChlPowerLaw, chl float64) error {
	c := s.Blank(name, Pigment, 0)
	for i, l := range s.Wavelengths {
		a, err := p.Absorption(l, chl)
		if err != nil {
			return fmt.Errorf("iop: pigment %q: %w", name, err)
		}
		c.A[i] = a
	}
	return s.Add(c)
}

func (s *Spectra) sized(c *Component) error {
	n, m := len(s.Wavelengths), len(s.Angles)
	if len(c.A) != n || len(c.B) != n || len(c.Bb) != n || len(c.VSF) != n*m {
		return fmt.Errorf("iop: component %q not sized for this grid (use Spectra.Blank)", c.Name)
	}
	return nil
}
