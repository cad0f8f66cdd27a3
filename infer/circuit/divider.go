package circuit

import (
	"fmt"
	"math"
)

// DividerVout returns the output of a regulator whose common lead sits on a
// divider: R1 from the output to the common lead, R2 from the common lead to
// a return rail at vbottomV (0 for ground; magnitudes for a negative regulator):
//
//	Vout = Vbottom + Vref·(1 + R2/R1) + I·R2
//
// For an adjustable part Vref is the reference and I the ADJ current
// (ST LM317L application information; onsemi LM317 front page); for a fixed
// part with a lifted ground Vref is the nominal output and I the quiescent
// current (Fairchild LM7805 application, valid while I_R1 ≥ 5·IQ).
func DividerVout(vrefV, iA, r1Ohm, r2Ohm, vbottomV float64) (float64, error) {
	if !(r1Ohm > 0) || r2Ohm < 0 || math.IsInf(r1Ohm, 0) || math.IsInf(r2Ohm, 0) || math.IsNaN(r2Ohm) {
		return 0, fmt.Errorf("divider: R1 must be positive and R2 not negative (R1 %g Ω, R2 %g Ω)", r1Ohm, r2Ohm)
	}
	return vbottomV + vrefV*(1+r2Ohm/r1Ohm) + iA*r2Ohm, nil
}

// DividerChoice is a resistor pair for a target output.
type DividerChoice struct {
	R1Ohm       float64 `json:"r1_ohm"`        // output to common/ADJ
	R2Ohm       float64 `json:"r2_ohm"`        // common/ADJ to the return rail
	VoutV       float64 `json:"vout_v"`        // with the typical common-lead current
	ErrorV      float64 `json:"error_v"`       // VoutV − target
	SpreadLowV  float64 `json:"spread_low_v"`  // output with the least common-lead current
	SpreadHighV float64 `json:"spread_high_v"` // output with the most
	DividerA    float64 `json:"divider_a"`     // current through R1 (Vref/R1)
	R1W         float64 `json:"r1_w"`          // R1's dissipation: Vref²/R1
	R2W         float64 `json:"r2_w"`          // R2's dissipation at the most common-lead current
	R1RatingW   float64 `json:"r1_rating_w"`   // a resistor rating for R1 (at least twice its dissipation)
	R2RatingW   float64 `json:"r2_rating_w"`   // and for R2
	// Trimmer says a trimmer is needed: the pair's error is beyond the
	// part's own tolerance.
	Trimmer bool `json:"trimmer"`
}

// DividerSpec describes what [ChooseDivider] must meet.
type DividerSpec struct {
	TargetV  float64   // wanted output (above the return rail)
	VrefV    float64   // reference or nominal voltage
	ITypA    float64   // typical ADJ / quiescent current
	IMinA    float64   // least ADJ / quiescent current (0 = unknown: the typical)
	IMaxA    float64   // greatest ADJ / quiescent current
	MinLoadA float64   // the divider current must be at least this (the part's minimum load; 0 = DefaultMinLoadA)
	MaxLoadA float64   // and at most this (0 = DividerSpan × MinLoadA)
	VbottomV float64   // return rail
	Series   []float64 // resistor series (default E24)
	// Tolerance is the part's own output tolerance, fraction: pairs within
	// it count as good enough, and beyond it a trimmer is suggested
	// (0 = 2 %).
	Tolerance float64
}

// DefaultMinLoadA is the divider current taken when the part's minimum load
// is not known: 5 mA, the smaller of the classic adjustables' figures
// (LM317L 5 mA; LM317 3.5 mA typical, 10 mA maximum).
const DefaultMinLoadA = 5e-3

// DividerSpan is how far above the minimum load the divider current may go:
// enough room for a close E-series pair, while the divider wastes little
// (the LM317 datasheet's 240 Ω gives 5.2 mA against 3.5 mA typical; common
// practice, no source for the factor).
const DividerSpan = 2.5

// ratings are the usual resistor power ratings, watts.
var ratings = []float64{0.125, 0.25, 0.5, 1, 2, 3, 5, 10}

// rating returns the smallest usual rating at least twice w (the common
// derating to half power; common practice, no source).
func rating(w float64) float64 {
	for _, r := range ratings {
		if r >= 2*w {
			return r
		}
	}
	return math.Ceil(2 * w)
}

// ChooseDivider picks a pair from the series whose divider current Vref/R1
// lies between the minimum load and DividerSpan times it: among the pairs
// whose error is within the part's tolerance (or as close as the closest
// pair, if none is), the one with the largest R1, which wastes least
// current. It gives each resistor's dissipation and a rating, and asks for
// a trimmer when even the best pair misses by more than the tolerance. It
// returns an error when the target is at or below Vref (plus the rail).
func ChooseDivider(s DividerSpec) (DividerChoice, error) {
	if s.Series == nil {
		s.Series = E24
	}
	if s.MinLoadA == 0 {
		s.MinLoadA = DefaultMinLoadA
	}
	if s.MaxLoadA == 0 {
		s.MaxLoadA = DividerSpan * s.MinLoadA
	}
	if s.Tolerance == 0 {
		s.Tolerance = 0.02
	}
	for _, v := range []float64{s.TargetV, s.VrefV, s.ITypA, s.IMinA, s.IMaxA, s.MinLoadA, s.MaxLoadA, s.VbottomV, s.Tolerance} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return DividerChoice{}, fmt.Errorf("divider: values must be finite")
		}
	}
	if !(s.VrefV > 0) {
		return DividerChoice{}, fmt.Errorf("divider: the reference must be positive")
	}
	if !(s.MinLoadA > 0) || s.MaxLoadA < s.MinLoadA {
		return DividerChoice{}, fmt.Errorf("divider: the current window %g to %g A is empty", s.MinLoadA, s.MaxLoadA)
	}
	rise := s.TargetV - s.VbottomV
	if rise <= s.VrefV {
		return DividerChoice{}, fmt.Errorf("target %g V is not above the reference %g V (plus the return rail %g V): no divider can give it", s.TargetV, s.VrefV, s.VbottomV)
	}
	vals := Values(s.Series, 0.1, 10e6)
	var all []DividerChoice
	for _, r1 := range Values(s.Series, s.VrefV/s.MaxLoadA*(1-1e-9), s.VrefV/s.MinLoadA*(1+1e-9)) {
		ideal := (rise - s.VrefV) / (s.VrefV/r1 + s.ITypA)
		lo, hi, ok := Nearest(vals, ideal)
		if !ok {
			continue
		}
		for _, r2 := range []float64{lo, hi} {
			all = append(all, s.pair(r1, r2))
		}
	}
	if len(all) == 0 {
		return DividerChoice{}, fmt.Errorf("no %d-value series resistor gives %g to %g mA through R1 with Vref %g V", len(s.Series), s.MinLoadA*1e3, s.MaxLoadA*1e3, s.VrefV)
	}
	minErr := math.Inf(1)
	for _, c := range all {
		minErr = math.Min(minErr, math.Abs(c.ErrorV))
	}
	bar := math.Max(minErr, s.Tolerance*math.Abs(s.TargetV))
	var best DividerChoice
	for _, c := range all {
		if math.Abs(c.ErrorV) <= bar+1e-12 && (best.R1Ohm == 0 || c.R1Ohm > best.R1Ohm ||
			(c.R1Ohm == best.R1Ohm && math.Abs(c.ErrorV) < math.Abs(best.ErrorV))) {
			best = c
		}
	}
	best.Trimmer = math.Abs(best.ErrorV) > s.Tolerance*math.Abs(s.TargetV)
	return best, nil
}

// leastA is the least common-lead current of the spread: IMinA when given,
// else the typical (a ground current never falls to zero; makers give a
// typical and a maximum).
func (s DividerSpec) leastA() float64 {
	if s.IMinA > 0 {
		return s.IMinA
	}
	return s.ITypA
}

// Evaluate returns the figures of a given pair R1 over R2 under the spec
// (output, spread over the common-lead current, divider current, resistor
// powers and ratings; ErrorV against TargetV when one is given).
func (s DividerSpec) Evaluate(r1, r2 float64) (DividerChoice, error) {
	if _, err := DividerVout(s.VrefV, s.ITypA, r1, r2, s.VbottomV); err != nil {
		return DividerChoice{}, err
	}
	c := s.pair(r1, r2)
	if s.TargetV == 0 {
		c.ErrorV = 0
	}
	return c, nil
}

// pair evaluates R1 over R2 against the spec.
func (s DividerSpec) pair(r1, r2 float64) DividerChoice {
	v, _ := DividerVout(s.VrefV, s.ITypA, r1, r2, s.VbottomV)
	vl, _ := DividerVout(s.VrefV, s.leastA(), r1, r2, s.VbottomV)
	vh, _ := DividerVout(s.VrefV, s.IMaxA, r1, r2, s.VbottomV)
	i1 := s.VrefV / r1
	i2 := i1 + math.Max(s.IMaxA, s.ITypA)
	c := DividerChoice{R1Ohm: r1, R2Ohm: r2, VoutV: v, ErrorV: v - s.TargetV, SpreadLowV: vl, SpreadHighV: vh, DividerA: i1,
		R1W: i1 * i1 * r1, R2W: i2 * i2 * r2}
	c.R1RatingW, c.R2RatingW = rating(c.R1W), rating(c.R2W)
	return c
}
