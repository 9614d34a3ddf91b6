package scenario

import (
	"math"
	"sort"
)

// StationOrder returns the station indices sorted by distance, keeping
// the first of equal distances (a section needs strictly increasing x).
func (r *Result) StationOrder() []int {
	idx := make([]int, len(r.Stations))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return r.Stations[idx[a]] < r.Stations[idx[b]] })
	out := idx[:0]
	for _, j := range idx {
		if len(out) == 0 || r.Stations[j] > r.Stations[out[len(out)-1]] {
			out = append(out, j)
		}
	}
	return out
}

// PointValue is one scalar of point p of a set of points, for figures.
type PointValue func(ps *Points, p int) float64

// TidalStats returns the mean, minimum and maximum over the output times of
// f at every position of ps in layer l.
func (r *Result) TidalStats(ps *Points, l int, f PointValue) (mean, lo, hi []float64) {
	n, nt := len(ps.Distance), len(r.Times)
	mean, lo, hi = make([]float64, n), make([]float64, n), make([]float64, n)
	for i := range mean {
		lo[i], hi[i] = math.Inf(1), math.Inf(-1)
		for t := 0; t < nt; t++ {
			x := f(ps, ps.Point(t, i, l))
			mean[i] += x
			lo[i], hi[i] = min(lo[i], x), max(hi[i], x)
		}
		mean[i] /= float64(nt)
	}
	return mean, lo, hi
}

// NearestStation returns the index of the station nearest distance x.
func (r *Result) NearestStation(x float64) int {
	j := 0
	for i, s := range r.Stations {
		if math.Abs(s-x) < math.Abs(r.Stations[j]-x) {
			j = i
		}
	}
	return j
}

// ComponentOf returns the component index of population i.
func (r *Result) ComponentOf(i int) int { return r.NK() - r.NP() + i }
