package mixing

import "math"

// vertical applies, cell by cell and implicitly (backward Euler, so stable
// for any step and positive), turbulent exchange between the layers with
// velocity K_S/(H/2) + w_e (DESIGN reference formulation; see kinematics), settling from the upper to
// the lower layer and from the lower layer to the bed, deposition (continuous
// or Krone 1962) and Partheniades (1965) erosion from a finite bed inventory.
// Each 2×2 system conserves mass exactly.
func (m *Model) vertical(dt float64) {
	n, nc := m.n, m.nc
	for i := 0; i < n; i++ {
		a := m.area[i]
		v0, v1 := m.vol[0][i], m.vol[1][i]
		ex := dt * m.xv[i] * a // m³ exchanged per unit concentration difference
		for t := 0; t < 2+nc; t++ {
			c0, c1 := m.conc[t][0][i], m.conc[t][1][i]
			m0, m1 := c0*v0, c1*v1
			var s0, s1, ero float64 // settling volume rates ×dt, erosion mass
			if t >= 2 {
				cls := &m.cfg.Sediment[t-2]
				k := t - 2
				s0 = dt * m.ws[(i*Layers+0)*nc+k] * a
				s1 = dt * m.ws[(i*Layers+1)*nc+k] * a
				if cls.CriticalDeposition > 0 {
					s1 *= math.Max(0, 1-m.taub[i]/cls.CriticalDeposition)
				}
				if tb := m.taub[i]; tb > cls.CriticalErosion && m.bed[k][i] > 0 {
					e := cls.ErosionRate * (tb/cls.CriticalErosion - 1) * dt // kg m⁻²
					ero = math.Min(e, m.bed[k][i])
				}
				m1 += ero * a
			}
			// [v0+ex+s0   −ex     ] [c0']   [m0]
			// [−ex−s0     v1+ex+s1] [c1'] = [m1]
			a11, a12 := v0+ex+s0, -ex
			a21, a22 := -ex-s0, v1+ex+s1
			det := a11*a22 - a12*a21
			n0 := (m0*a22 - a12*m1) / det
			n1 := (a11*m1 - a21*m0) / det
			m.conc[t][0][i], m.conc[t][1][i] = n0, n1
			if t >= 2 {
				m.bed[t-2][i] += s1*n1/a - ero
			}
		}
	}
}
