package seen

import (
	"fmt"
	"math"
)

// DetectionSigmas is the multiple of the dark noise that defines the limit
// of detection (the usual 3σ criterion; common practice).
const DetectionSigmas = 3

// Electronics is a linear sensor front end with an ideal digitiser:
//
//	counts = round(Offset + Gain·x + DarkNoise·z),  clipped to [0, FullScale],
//
// where x is the optical quantity the sensor is built for (β in m⁻¹ sr⁻¹,
// c in m⁻¹, turbidity in FNU, …) and z a standard normal deviate supplied by
// the caller (0 for the noiseless reading), so that results are
// reproducible. Validity: a linear detector below full scale; real sensors
// lose linearity before they clip, so treat readings near full scale with
// care.
type Electronics struct {
	// Gain in counts per unit of the measured quantity, > 0.
	Gain float64
	// Offset is the dark offset, counts, in [0, FullScale).
	Offset float64
	// DarkNoise is the rms dark noise, counts, ≥ 0.
	DarkNoise float64
	// FullScale is the largest count the digitiser reports, counts, ≥ 1
	// (for example 4095 for 12 bits, 65535 for 16 bits).
	FullScale float64
}

// Validate checks the fields.
func (e Electronics) Validate() error {
	if err := checkScalar("Electronics.FullScale", e.FullScale, 1, 1<<53, "counts"); err != nil {
		return err
	}
	if err := checkScalar("Electronics.Gain", e.Gain, math.SmallestNonzeroFloat64, math.MaxFloat64, "counts per unit"); err != nil {
		return err
	}
	if !(e.Offset >= 0 && e.Offset < e.FullScale) {
		return fmt.Errorf("seen: Electronics.Offset = %g counts is outside [0, FullScale = %g) counts", e.Offset, e.FullScale)
	}
	return checkScalar("Electronics.DarkNoise", e.DarkNoise, 0, e.FullScale, "counts")
}

// Digitized is one digitised reading.
type Digitized struct {
	// Counts is the digitiser output, an integer in [0, FullScale].
	Counts float64
	// Value is the quantity recovered from Counts, (Counts − Offset)/Gain,
	// in the unit of the input.
	Value float64
	// Saturated is true when Counts reached FullScale.
	Saturated bool
	// Resolution is one count in the unit of the input, 1/Gain.
	Resolution float64
	// DetectionLimit is DetectionSigmas·DarkNoise/Gain, in the unit of the
	// input.
	DetectionLimit float64
	// Flags: FlagSaturated, FlagUnderrange, FlagBelowDetection.
	Flags Flag
}

// Read digitises quantity x with noise deviate z.
func (e Electronics) Read(x, z float64) (Digitized, error) {
	var d Digitized
	if err := e.Validate(); err != nil {
		return d, err
	}
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return d, fmt.Errorf("seen: quantity to digitise is %g; need a finite value", x)
	}
	if math.IsNaN(z) || math.IsInf(z, 0) {
		return d, fmt.Errorf("seen: noise deviate is %g; need a finite value", z)
	}
	raw := math.Round(e.Offset + e.Gain*x + e.DarkNoise*z)
	switch {
	case raw >= e.FullScale:
		raw = e.FullScale
		d.Saturated = true
		d.Flags |= FlagSaturated
	case raw < 0:
		raw = 0
		d.Flags |= FlagUnderrange
	}
	d.Counts = raw
	d.Value = (raw - e.Offset) / e.Gain
	d.Resolution = 1 / e.Gain
	d.DetectionLimit = DetectionSigmas * e.DarkNoise / e.Gain
	if math.Abs(x) < d.DetectionLimit {
		d.Flags |= FlagBelowDetection
	}
	return d, nil
}

// Range returns the measurable span in the unit of the quantity: from the
// detection limit to the largest quantity that stays below full scale with
// DetectionSigmas of noise headroom.
func (e Electronics) Range() (lo, hi float64, err error) {
	if err := e.Validate(); err != nil {
		return 0, 0, err
	}
	lo = DetectionSigmas * e.DarkNoise / e.Gain
	hi = (e.FullScale - e.Offset - DetectionSigmas*e.DarkNoise) / e.Gain
	return lo, math.Max(hi, 0), nil
}

// MaxGain returns the largest gain (counts per unit) for which quantity
// xmax stays DetectionSigmas of dark noise below full scale, with e's
// offset, noise and full scale. xmax must be positive.
func (e Electronics) MaxGain(xmax float64) (float64, error) {
	f := e
	f.Gain = 1
	if err := f.Validate(); err != nil {
		return 0, err
	}
	if err := checkScalar("xmax", xmax, math.SmallestNonzeroFloat64, math.MaxFloat64, "(unit of the quantity)"); err != nil {
		return 0, err
	}
	head := e.FullScale - e.Offset - DetectionSigmas*e.DarkNoise
	if head <= 0 {
		return 0, fmt.Errorf("seen: Electronics leaves no headroom: FullScale − Offset − %g·DarkNoise = %g counts", float64(DetectionSigmas), head)
	}
	return head / xmax, nil
}

// ChooseGain returns the index of the highest gain in gains (counts per
// unit, any order) whose Range contains x, as an autoranging sensor would
// select, with e's offset, noise and full scale. If x saturates every gain
// the index of the lowest gain is returned with ok = false; if x is below
// the detection limit of every gain, the highest gain with ok = false.
func (e Electronics) ChooseGain(gains []float64, x float64) (index int, ok bool, err error) {
	if len(gains) == 0 {
		return 0, false, fmt.Errorf("seen: no gains to choose from")
	}
	best, lowest, highest := -1, 0, 0
	for i, g := range gains {
		f := e
		f.Gain = g
		lo, hi, err := f.Range()
		if err != nil {
			return 0, false, fmt.Errorf("seen: gains[%d]: %w", i, err)
		}
		if g < gains[lowest] {
			lowest = i
		}
		if g > gains[highest] {
			highest = i
		}
		if x >= lo && x <= hi && (best < 0 || g > gains[best]) {
			best = i
		}
	}
	if best >= 0 {
		return best, true, nil
	}
	f := e
	f.Gain = gains[lowest]
	if _, hi, _ := f.Range(); x > hi {
		return lowest, false, nil
	}
	return highest, false, nil
}
