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
}

// DividerSpec describes what [ChooseDivider] must meet.
type DividerSpec struct {
	TargetV  float64   // wanted output (above the return rail)
	VrefV    float64   // reference or nominal voltage
	ITypA    float64   // typical ADJ / quiescent current
	IMinA    float64   // least ADJ / quiescent current (0 if unknown)
	IMaxA    float64   // greatest ADJ / quiescent current
	MinLoadA float64   // the divider current must be at least this (the part's minimum load)
	VbottomV float64   // return rail
	Series   []float64 // resistor series (default E24)
	MinR1Ohm float64   // smallest R1 considered (default 10 Ω)
	MaxR1Ohm float64   // largest R1 considered (default 10 kΩ)
}

// ChooseDivider picks a pair from the series with the divider current at or
// above MinLoadA: among the pairs within 1 % of the target (or as close as
// the closest pair, if none is that close) the one with the largest R1, which
// wastes least current. It returns an
// error when the target is at or below Vref (plus the rail), or when no pair
// meets the minimum load.
func ChooseDivider(s DividerSpec) (DividerChoice, error) {
	if s.Series == nil {
		s.Series = E24
	}
	if s.MinR1Ohm == 0 {
		s.MinR1Ohm = 10
	}
	if s.MaxR1Ohm == 0 {
		s.MaxR1Ohm = 10e3
	}
	for _, v := range []float64{s.TargetV, s.VrefV, s.ITypA, s.IMinA, s.IMaxA, s.MinLoadA, s.VbottomV} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return DividerChoice{}, fmt.Errorf("divider: values must be finite")
		}
	}
	if !(s.VrefV > 0) {
		return DividerChoice{}, fmt.Errorf("divider: the reference must be positive")
	}
	rise := s.TargetV - s.VbottomV
	if rise <= s.VrefV {
		return DividerChoice{}, fmt.Errorf("target %g V is not above the reference %g V (plus the return rail %g V): no divider can give it", s.TargetV, s.VrefV, s.VbottomV)
	}
	vals := Values(s.Series, 1, 10e6)
	var all []DividerChoice
	for _, r1 := range Values(s.Series, s.MinR1Ohm, s.MaxR1Ohm) {
		if s.VrefV/r1 < s.MinLoadA {
			continue
		}
		ideal := (rise - s.VrefV) / (s.VrefV/r1 + s.ITypA)
		lo, hi, ok := Nearest(vals, ideal)
		if !ok {
			continue
		}
		for _, r2 := range []float64{lo, hi} {
			v, _ := DividerVout(s.VrefV, s.ITypA, r1, r2, s.VbottomV)
			vl, _ := DividerVout(s.VrefV, s.IMinA, r1, r2, s.VbottomV)
			vh, _ := DividerVout(s.VrefV, s.IMaxA, r1, r2, s.VbottomV)
			all = append(all, DividerChoice{R1Ohm: r1, R2Ohm: r2, VoutV: v, ErrorV: v - s.TargetV, SpreadLowV: vl, SpreadHighV: vh, DividerA: s.VrefV / r1})
		}
	}
	found := len(all) > 0
	var best DividerChoice
	if found {
		// The closest pair sets the bar; within 1 % of the target (or of
		// that best error) the pair with the largest R1 wastes least current.
		minErr := math.Inf(1)
		for _, c := range all {
			minErr = math.Min(minErr, math.Abs(c.ErrorV))
		}
		bar := math.Max(minErr, 0.01*math.Abs(s.TargetV))
		for _, c := range all {
			if math.Abs(c.ErrorV) <= bar+1e-12 && (best.R1Ohm == 0 || c.R1Ohm > best.R1Ohm ||
				(c.R1Ohm == best.R1Ohm && math.Abs(c.ErrorV) < math.Abs(best.ErrorV))) {
				best = c
			}
		}
	}
	if !found {
		return DividerChoice{}, fmt.Errorf("no R1 from %g to %g Ω draws the minimum load %g mA", s.MinR1Ohm, s.MaxR1Ohm, s.MinLoadA*1e3)
	}
	return best, nil
}
