package seen

import (
	"math"
	"testing"
)

// The checks below are identities of an ideal linear digitiser (common
// practice): counts = round(offset + gain·x + noise·z), clipped.

func TestElectronicsRead(t *testing.T) {
	e := Electronics{Gain: 1000, Offset: 50, DarkNoise: 2, FullScale: 4095}
	d, err := e.Read(1.2345, 0)
	if err != nil {
		t.Fatal(err)
	}
	if d.Counts != math.Round(50+1234.5) || d.Saturated || d.Flags != 0 {
		t.Errorf("reading %+v", d)
	}
	// Recovered value within half a count.
	if math.Abs(d.Value-1.2345) > 0.5/e.Gain+1e-15 {
		t.Errorf("value %g, want 1.2345 ± %g", d.Value, 0.5/e.Gain)
	}
	// Noise moves the counts by DarkNoise·z.
	dn, _ := e.Read(1.2345, 1.5)
	if dn.Counts-d.Counts != math.Round(1284.5+3)-math.Round(1284.5) {
		t.Errorf("noise shift %g counts", dn.Counts-d.Counts)
	}
	// Saturation at full scale, never beyond.
	ds, _ := e.Read(10, 0)
	if !ds.Saturated || ds.Counts != 4095 || !ds.Flags.Has(FlagSaturated) {
		t.Errorf("saturating reading %+v", ds)
	}
	du, _ := e.Read(-1, 0)
	if du.Counts != 0 || !du.Flags.Has(FlagUnderrange) {
		t.Errorf("underrange reading %+v", du)
	}
	db, _ := e.Read(0.005, 0)
	if !db.Flags.Has(FlagBelowDetection) || db.DetectionLimit != 3*2.0/1000 {
		t.Errorf("below detection %+v", db)
	}
}

func TestElectronicsGainChoice(t *testing.T) {
	e := Electronics{Offset: 50, DarkNoise: 2, FullScale: 4095}
	g, err := e.MaxGain(2.5)
	if err != nil {
		t.Fatal(err)
	}
	// At the largest gain the maximum quantity sits 3σ below full scale.
	if want := (4095 - 50 - 6) / 2.5; math.Abs(g-want) > 1e-12 {
		t.Errorf("MaxGain %g, want %g", g, want)
	}
	f := e
	f.Gain = g
	if d, _ := f.Read(2.5, 2.5); d.Saturated {
		t.Error("MaxGain saturates with 2.5σ of noise")
	}
	gains := []float64{10, 1000, 100}
	for _, tc := range []struct {
		x    float64
		want int
		ok   bool
	}{{1, 1, true}, {10, 2, true}, {300, 0, true}, {1000, 0, false}, {1e-4, 1, false}} {
		i, ok, err := e.ChooseGain(gains, tc.x)
		if err != nil || i != tc.want || ok != tc.ok {
			t.Errorf("ChooseGain(%g) = %d, %v, %v; want %d, %v", tc.x, i, ok, err, tc.want, tc.ok)
		}
	}
	bad := Electronics{Gain: 1, Offset: 5000, FullScale: 4095}
	if _, err := bad.Read(1, 0); err == nil {
		t.Error("offset above full scale accepted")
	}
	if _, err := e.Read(1, 0); err == nil {
		t.Error("zero gain accepted")
	}
}
