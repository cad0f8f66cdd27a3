package infer

import "fmt"

// BoundSide names which end of the input a limit is checked against.
type BoundSide int

const (
	// BoundLow is the lowest input (the trough): dropout.
	BoundLow BoundSide = iota
	// BoundHigh is the highest input (the peak): the input maximum.
	BoundHigh
	// BoundMean is the highest mean input at full load: dissipation.
	BoundMean
)

// Measured returns the input the evidence itself gives at side when the
// input is bounded from a bare reading: for BoundLow a scope trough when
// one was measured, else the meter reading; for BoundHigh the meter
// reading (also for BoundMean). ok is false when the input is not a bound
// from a reading.
func (op *Operating) Measured(side BoundSide) (v float64, ok bool) {
	if op.Source != InputReading || op.ReadingV == 0 {
		return 0, false
	}
	if side == BoundLow && op.troughMeasured > 0 {
		return op.troughMeasured, true
	}
	return op.ReadingV, true
}

// OnlyBoundCrosses reports whether a limit at limitV (volts, magnitude) is
// crossed only by the assumed bound from a bare reading and not by what
// was measured: for BoundLow the trough bound lies below limitV while the
// reading (or the measured trough) does not; for BoundHigh the peak bound
// lies above limitV while the reading does not. A measured value is hard
// evidence, a bound is an assumption: a check then warns instead of
// failing. False unless the input is bounded from a reading.
func (op *Operating) OnlyBoundCrosses(side BoundSide, limitV float64) bool {
	m, ok := op.Measured(side)
	if !ok {
		return false
	}
	switch side {
	case BoundLow:
		return op.Trough.V < limitV && m >= limitV
	case BoundMean:
		return false // dissipation is settled by the check itself (replace's thermal check)
	}
	return op.Peak.V > limitV && m <= limitV
}

// BoundAdvice says that a conclusion rests on the assumed mains-rectifier
// bound from a single reading, and how the technician settles it.
func (op *Operating) BoundAdvice(side BoundSide) string {
	measure := "measure the trough with a scope at full load"
	switch side {
	case BoundHigh:
		measure = "measure the peak at light load (a scope, or a meter with the load disconnected)"
	case BoundMean:
		measure = "measure the input with a meter at full load and allow for high mains"
	}
	return fmt.Sprintf("this rests on an assumed mains-rectifier bound from the single %.3g V reading: describe [input] (rectifier, secondary and filter, or rectifier = \"dc\" with dc_volts_min/max for a battery or DC supply) or %s to settle it", op.ReadingV, measure)
}
