package scenario

import (
	"context"
	"math"
	"path/filepath"
	"testing"

	"github.com/murk-optics/murk/mixing"
	"github.com/murk-optics/murk/scenario/spec"
)

// Qualitative behaviour of the three example scenarios (examples/README.md).
// Limits, each from published descriptions of estuaries:
const (
	// etmNearSaltLimit: the turbidity maximum lies near the landward limit
	// of salt (Schubel 1968, Chesapeake Sci. 9:131; Geyer 1993, Estuaries
	// 16:113; from memory) — here within a quarter of the intrusion length
	// of the bottom 2 PSU isohaline.
	etmNearSaltLimit = 0.25
	// etmMaxBottomSalinity: it sits in the low-salinity zone, bottom
	// salinity a few PSU (Schubel 1968; from memory); 10 PSU is the upper
	// end of the oligohaline–mesohaline range used for that zone (Venice
	// system 1958: mesohaline 5–18; common practice).
	etmMaxBottomSalinity = 10
)

func loadExample(t *testing.T, name string) spec.Scenario {
	t.Helper()
	s, err := spec.Load(filepath.Join("..", "examples", name))
	if err != nil {
		t.Fatal(err)
	}
	// Optics at reduced resolution: the behaviours are about the estuary
	// and the particle mix, not spectral detail.
	s.Mixture.Optics.Wavelengths = []float64{400e-9, 500e-9, 550e-9, 650e-9, 850e-9}
	s.Mixture.Optics.SizeBins = 16
	s.Estuary.Run.Duration = 12.5 * 3600 // one M2 tide of output
	return s
}

func TestExamples(t *testing.T) {
	names := []string{"salt_wedge.yaml", "partially_mixed.yaml", "well_mixed.yaml"}
	regimes := []mixing.RegimeClass{mixing.SaltWedge, mixing.PartiallyMixed, mixing.WellMixed}
	res := make([]*Result, len(names))
	for i, n := range names {
		r, err := Run(context.Background(), loadExample(t, n), Options{})
		if err != nil {
			t.Fatalf("%s: %v", n, err)
		}
		res[i] = r
		s := r.Summary
		t.Logf("%s: %s, stratification %.2f, intrusion %.1f km, ETM %.1f km at %.1f PSU, flocs %.0f/%.0f µm",
			n, s.Regime.Class, s.MeanStratification, s.IntrusionLength/1e3, s.ETMPosition/1e3, s.ETMBottomSalinity,
			s.ETMFlocDiameter*1e6, s.RiverFlocDiameter*1e6)
		if s.Regime.Class != regimes[i] {
			t.Errorf("%s: regime %s, want %s", n, s.Regime.Class, regimes[i])
		}
		if d := math.Abs(s.ETMPosition - s.IntrusionLength); d > etmNearSaltLimit*s.IntrusionLength {
			t.Errorf("%s: turbidity maximum at %.1f km is %.1f km from the salt limit at %.1f km", n, s.ETMPosition/1e3, d/1e3, s.IntrusionLength/1e3)
		}
		if s.ETMBottomSalinity > etmMaxBottomSalinity {
			t.Errorf("%s: bottom salinity %.1f at the turbidity maximum, want ≤ %g", n, s.ETMBottomSalinity, float64(etmMaxBottomSalinity))
		}
		// Flocculation at the salt front: flocs are larger at the
		// turbidity maximum than in the river (Kranenburg 1994;
		// Winterwerp 1998: collision efficiency rises with salinity).
		if !(s.ETMFlocDiameter > s.RiverFlocDiameter) {
			t.Errorf("%s: flocs %.0f µm at the turbidity maximum, %.0f µm in the river; want larger at the ETM", n, s.ETMFlocDiameter*1e6, s.RiverFlocDiameter*1e6)
		}
	}
	// Stratification falls from salt wedge to partially mixed to well
	// mixed (Geyer & MacCready 2014, Fig. 6: the regimes order by mixing).
	for i := 1; i < len(res); i++ {
		if !(res[i-1].Summary.MeanStratification > res[i].Summary.MeanStratification) {
			t.Errorf("stratification %s %.2f ≤ %s %.2f", names[i-1], res[i-1].Summary.MeanStratification, names[i], res[i].Summary.MeanStratification)
		}
	}
	// Where mineral grains carry the scattering, b_bp/b_p is higher than
	// where porous flocs and organic particles do (Twardowski et al. 2001,
	// J. Geophys. Res. 106:14129: b_bp/b_p rises with the bulk refractive
	// index of the particles).
	for _, i := range []int{1, 2} {
		st := res[i].Summary.Stations
		hi, lo := st[0], st[0]
		for _, x := range st {
			if x.MineralScatterShare > hi.MineralScatterShare {
				hi = x
			}
			if x.MineralScatterShare < lo.MineralScatterShare {
				lo = x
			}
		}
		if !(hi.ParticleBbRatio > lo.ParticleBbRatio) {
			t.Errorf("%s: b_bp/b_p %.4f where mineral grains give %.0f %% of b_p, %.4f where they give %.0f %%",
				names[i], hi.ParticleBbRatio, 100*hi.MineralScatterShare, lo.ParticleBbRatio, 100*lo.MineralScatterShare)
		}
	}
}
