package replace

import (
	"fmt"
	"math"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/circuit"
)

func checkVout(in Input, c cand) (Check, bool) {
	if in.SourceA > 0 {
		return checkSourceCurrent(in, c), true
	}
	f, of, cd := c.Family, in.Orig.Family, &in.Cond
	target := cd.VoutV
	s := f.SignText()
	ch := Check{Name: CheckVout, Unit: "V", Limit: num(f.Signed(target)), LimitText: fmt.Sprintf("%s%.2f V", s, target)}
	dev := func(v float64) float64 { return math.Abs(v-target) / target }
	switch {
	case f.Adjustable() && f.VoutMaxV > 0 && target > f.VoutMaxV:
		ch.Value, ch.ValueText = num(f.Signed(f.VoutMaxV)), fmt.Sprintf("%g V max", f.VoutMaxV)
		ch.Margin, ch.Status, ch.Text = f.VoutMaxV/target-1, Fail, fmt.Sprintf("%s%.2f V is above this part's %g V range", s, target, f.VoutMaxV)
	case f.Adjustable() && c.divider == nil && c.dividerErr != nil:
		ch.ValueText, ch.Margin, ch.Status, ch.Text = "no divider", -1, Fail, c.dividerErr.Error()
	case f.Adjustable() && c.divider == nil:
		// The old divider, with this part's reference and ADJ current.
		n := in.Network
		got, _ := circuit.DividerVout(f.VrefV, f.IadjTypUA*1e-6, n.RTopOhm, n.RBottomOhm, n.BottomV)
		d := dev(got)
		ch.Value, ch.ValueText = num(f.Signed(got)), fmt.Sprintf("%s%.2f V on the old divider", s, got)
		ch.Margin = 1 - d/0.03
		ch.Text = fmt.Sprintf("the old divider (%s over %s) with this part's %.3g V reference and %g µA ADJ current gives %s%.2f V", ohms(n.RTopOhm), ohms(n.RBottomOhm), f.VrefV, f.IadjTypUA, s, got)
		switch {
		case d <= 0.02:
			ch.Status = Pass
		case d <= 0.03:
			ch.Status = Warn
		default:
			ch.Status = Work
			if d2, err := chooseFor(f, target); err == nil {
				ch.Action = fmt.Sprintf("resistors: R1 %s (OUT to ADJ), R2 %s (ADJ to the return) for %s%.2f V", ohms(d2.R1Ohm), ohms(d2.R2Ohm), s, d2.VoutV)
			}
		}
	case f.Adjustable():
		d := c.divider
		ch.Value, ch.ValueText = num(f.Signed(d.VoutV)), fmt.Sprintf("%s%.2f V with E24 %s / %s", s, d.VoutV, ohms(d.R1Ohm), ohms(d.R2Ohm))
		ch.Margin, ch.Status = 1-math.Abs(d.ErrorV)/(0.03*target), Work
		ch.Text = fmt.Sprintf("needs a divider: R1 %s from OUT to ADJ, R2 %s from ADJ to ground (%s%.2f to %s%.2f V over the ADJ-current spread)", ohms(d.R1Ohm), ohms(d.R2Ohm), s, d.SpreadLowV, s, d.SpreadHighV)
		ch.Action = fmt.Sprintf("resistors: add R1 %s (OUT to ADJ, %g W) and R2 %s (ADJ to ground, %g W), 1 %% metal film", ohms(d.R1Ohm), d.R1RatingW, ohms(d.R2Ohm), d.R2RatingW)
		if d.Trimmer {
			ch.Action += "; the nearest pair misses by more than the part's tolerance: make R2 part trimmer and set the output"
		}
	default:
		nom, want := c.VoutV, wantedNominal(&in)
		_, ok := nearestOutput(f, want)
		ch.Value = num(f.Signed(c.outV))
		switch {
		case !ok:
			ch.ValueText, ch.Margin, ch.Status = fmt.Sprintf("%s%s V nearest", s, trim(nom)), -math.Abs(nom-want)/want, Fail
			ch.Text = fmt.Sprintf("%s is not made for %.2f V", f.ID, want)
		case in.Lifted && f.Switching():
			ch.ValueText, ch.Margin, ch.Status = fmt.Sprintf("%s%s V", s, trim(nom)), -1, Fail
			ch.Text = "a switching module's ground carries the input return current: it cannot sit on a lifted-ground network"
		case in.Lifted:
			checkLifted(in, c, nom, &ch)
		case of.Adjustable():
			ch.ValueText, ch.Margin, ch.Status = fmt.Sprintf("%s%s V fixed", s, trim(nom)), 1-dev(nom)/0.03, Work
			ch.Text = "a fixed part at the set voltage: the ADJ divider comes out and the common lead goes to ground"
			ch.Action = "resistors: remove the ADJ divider; the common lead goes to ground"
		default:
			ch.ValueText, ch.Margin, ch.Status = fmt.Sprintf("%s%s V ±%g %%", s, trim(nom), f.Tolerance*100), 1, Pass
			ch.Text = "the same nominal output"
		}
	}
	return ch, true
}

// checkLifted judges a fixed candidate on the old lifted-ground network:
// its ground current (typical and maximum) through the bottom resistor
// sets the lift.
func checkLifted(in Input, c cand, nom float64, ch *Check) {
	f, n, target := c.Family, in.Network, in.Cond.VoutV
	s := f.SignText()
	p := planLift(&in, c, nom)
	got, hi, d := p.got, p.hi, p.d
	ch.Value, ch.ValueText = num(f.Signed(got)), fmt.Sprintf("%s%.2f V (up to %s%.2f V)", s, got, s, hi)
	ch.LimitText += " ±5 %"
	ch.Margin = 1 - d/0.05
	ch.Text = fmt.Sprintf("lifted ground: this part's %.3g mA typical (%.3g mA at full load, worst case) ground current in the common-lead network gives %s%.2f V (up to %s%.2f V)",
		iqTypA(f)*1e3, f.GroundCurrentA(in.Cond.LoadMaxA)*1e3, s, got, s, hi)
	switch {
	case d <= 0.02:
		ch.Status = Pass
	case d <= 0.05:
		ch.Status = Warn
	default:
		ch.Status = Work
	}
	switch {
	case ch.Status == Pass:
	case !n.Resistors():
		if ch.Status == Work {
			ch.Status = Fail // diodes or a zener: nothing to retune
		}
	case p.spread:
		ch.Status = Fail
		ch.Margin = math.Min(ch.Margin, 1-(hi-got)/target/0.10)
		ch.Text += fmt.Sprintf("; its ground current rises with load, which moves the output by %.2f V through the %s bottom resistor, more than the ±5 %% window: no resistor value fixes a spread; keep a part with a steady ground current (an NPN-pass regulator)", hi-got, ohms(n.RBottomOhm))
	case p.best == 0:
	case p.same:
		if ch.Status == Work {
			ch.Status = Fail // the present resistor is already the best
			ch.Text += "; no E24 bottom resistor brings it inside ±5 %"
		}
	case p.dN <= 0.05:
		ch.Text += fmt.Sprintf("; a bottom resistor of %s centres it (%s%.2f to %s%.2f V)", ohms(p.best), s, p.gotN, s, p.hiN)
		if ch.Status == Work {
			ch.Action = fmt.Sprintf("resistors: change the common-lead resistor from %s to %s to centre the output on %s%.2f V", ohms(n.RBottomOhm), ohms(p.best), s, target)
		}
	default:
		if ch.Status == Work {
			ch.Status = Fail
			ch.Text += fmt.Sprintf("; even the best E24 bottom resistor (%s) leaves %s%.2f to %s%.2f V, outside ±5 %%", ohms(p.best), s, p.gotN, s, p.hiN)
		}
	}
}

// liftPlan is what a fixed candidate makes on the old lifted-ground network
// and what retuning its bottom resistor can do.
type liftPlan struct {
	got, hi float64 // output with the typical and the full-load ground current
	d       float64 // the larger deviation from the target, fraction
	// spread: the ground current's rise with load alone moves the output by
	// more than the ±5 % window, which no resistor narrows.
	spread bool
	// best is the E24 bottom resistor that centres the output (0 = none
	// found); gotN, hiN and dN are the output range and deviation with it;
	// same: it is the resistor already fitted, or no better.
	best, gotN, hiN, dN float64
	same                bool
}

// retuned reports whether the plan changes the bottom resistor (the vout
// check's work): the part is off by more than 5 % and the new resistor
// brings it inside.
func (p liftPlan) retuned() bool {
	return p.d > 0.05 && !p.spread && p.best > 0 && !p.same && p.dN <= 0.05
}

// planLift works out the lifted output of a fixed candidate with nominal
// nom, and the bottom resistor that centres it. A ground current that rises
// with load moves the output by the rise times the bottom resistor; no
// resistor narrows that spread, it can only centre it in the ±5 % window,
// with the mean of the typical and the full-load ground current (the
// resistors' equation as in [Network.Lift]).
func planLift(in *Input, c cand, nom float64) liftPlan {
	f, n, target := c.Family, in.Network, in.Cond.VoutV
	ityp, imax := iqTypA(f), f.GroundCurrentA(in.Cond.LoadMaxA)
	p := liftPlan{got: nom + n.Lift(nom, ityp), hi: nom + n.Lift(nom, imax)}
	p.d = math.Max(math.Abs(p.got-target), math.Abs(p.hi-target)) / target
	if !n.Resistors() {
		return p
	}
	if (p.hi-p.got)/target > 0.10 {
		p.spread = true
		return p
	}
	r2 := (target - n.BottomV - nom) / (nom/n.RTopOhm + (ityp+imax)/2)
	lo, hi2, ok := circuit.Nearest(circuit.Values(circuit.E24, 1, 1e6), r2)
	if !ok || r2 <= 0 {
		return p
	}
	p.best = lo
	if math.Abs(hi2-r2) < math.Abs(lo-r2) {
		p.best = hi2
	}
	nn := *n
	nn.RBottomOhm = p.best
	p.gotN, p.hiN = nom+nn.Lift(nom, ityp), nom+nn.Lift(nom, imax)
	p.dN = math.Max(math.Abs(p.gotN-target), math.Abs(p.hiN-target)) / target
	p.same = math.Abs(p.best-n.RBottomOhm) < 1e-9 || p.dN >= p.d
	return p
}

func checkCurrent(in Input, c cand) (Check, bool) {
	cd := &in.Cond
	rating := c.Family.Current(c.Package)
	m := 1 - c.iregA/rating
	ch := Check{Name: CheckCurrent, Unit: "A", Value: num(c.iregA), Limit: num(rating), Margin: m, Status: status(m, 0.2),
		ValueText: fmt.Sprintf("%.3g A", c.iregA), LimitText: fmt.Sprintf("%.3g A rated", rating)}
	ch.Text = fmt.Sprintf("%.3g A at full load against %.3g A rated", c.iregA, rating)
	if c.bypass != nil && c.bypass.ResistorMinA > 0 {
		ch.Text = fmt.Sprintf("%.3g A (load %.3g A less %.3g A through the bypass resistor at the lowest input) against %.3g A rated", c.iregA, cd.LoadMaxA, c.bypass.ResistorMinA, rating)
	}
	if in.Booster && in.RegLoadA < cd.LoadMaxA {
		ch.Text += fmt.Sprintf(" (the external transistor carries the rest of the %.3g A load)", cd.LoadMaxA)
	}
	if cd.LoadAssumed {
		ch.Text += " (the load is assumed: see the assumptions)"
	}
	return ch, true
}

func checkVinMax(in Input, c cand) (Check, bool) {
	f, cd := c.Family, &in.Cond
	il := f.InputLimit(c.VoutV)
	if il.StartV <= 0 {
		return Check{}, false
	}
	s := f.SignText()
	peak, at := cd.PeakV, cd.PeakAt
	limit, what := il.StartV, il.What
	m := 1 - peak/limit
	if cd.TransientV > peak {
		// A surge is held to the datasheet's transient rating where it has
		// one (an automotive LDO's load dump), else to the absolute maximum;
		// the steady peak still answers to the steady maximum.
		tl, tat, twhat := il.StartV, "the stated transient (no transient rating in the catalog: held to the absolute maximum)", il.What
		if !f.Adjustable() && f.TransientMaxV > il.StartV {
			tl, tat, twhat = f.TransientMaxV, "the stated transient", "transient (load dump) rating"
		}
		if tm := 1 - cd.TransientV/tl; tm < m {
			peak, at, limit, what, m = cd.TransientV, tat, tl, twhat, tm
		}
	}
	ch := Check{Name: CheckVinMax, Unit: "V", Value: num(f.Signed(peak)), Limit: num(f.Signed(limit)), Margin: m, Status: status(m, 0.05),
		ValueText: fmt.Sprintf("%s%.1f V", s, peak), LimitText: fmt.Sprintf("%s%.0f V %s", s, limit, what)}
	ch.Text = fmt.Sprintf("%s%.1f V at %s against the %s", s, peak, at, what)
	if f.Adjustable() {
		ch.Text = fmt.Sprintf("%s%.1f V at %s against the %g V %s: at switch-on into the discharged output capacitor, or with the output shorted, the whole input appears across the part", s, peak, at, f.VdiffMaxV, il.What)
		if ch.Status == Fail {
			ch.Text += "; use a high-voltage version or drop the input with a pre-regulator; protection diodes (OUT to IN, ADJ to OUT) guard against capacitor discharge, not against this"
		}
	}
	if cd.Source == infer.InputReading && at == cd.PeakAt {
		boundOnly(&in.Op, &ch, infer.BoundHigh, il.StartV, s, func(m float64) string {
			return fmt.Sprintf("the reading itself is %s%.3g V against %s%.0f V", s, m, s, il.StartV)
		}, " (the highest input is a bound from the meter reading: describe the rectifier to confirm)")
	}
	return ch, true
}

// boundOnly settles a check against an input bounded from a bare reading:
// a pass (or a warn inside its limit) becomes a warn with passNote; a fail
// that only the assumed bound makes (the measured value is inside limitV)
// becomes a warn that says so and how to settle it, keeping the bound's
// margin, with an install note to measure before relying on it; a fail the
// measured value itself makes stays a fail. measured words the measured
// value m against the limit; sign is the family's sign text.
func boundOnly(op *infer.Operating, ch *Check, side infer.BoundSide, limitV float64, sign string, measured func(m float64) string, passNote string) {
	m, _ := op.Measured(side)
	switch {
	case ch.Status == Pass || (ch.Status == Warn && ch.Margin >= 0):
		ch.Status = Warn
		ch.Text += passNote
	case ch.Status == Fail && op.OnlyBoundCrosses(side, limitV):
		ch.Status = Warn
		ch.Text += "; only the assumed bound misses it (" + measured(m) + "): " + op.BoundAdvice(side)
		ch.Action = fmt.Sprintf("input: before relying on it, measure the trough with a scope at full load: it must stay above %s%.2f V", sign, limitV)
		if side == infer.BoundHigh {
			ch.Action = fmt.Sprintf("input: before relying on it, measure the input peak at light load: it must stay under %s%.3g V, with room left for high mains", sign, limitV)
		}
	case ch.Status == Fail:
		ch.Text += "; the measurement itself misses it (" + measured(m) + "), whatever feeds the part"
	}
}

func checkDropout(in Input, c cand) (Check, bool) {
	f, cd := c.Family, &in.Cond
	s := f.SignText()
	need := f.HeadroomNeeded()
	head := cd.TroughV - cd.VoutV
	m := (head - need) / need
	ch := Check{Name: CheckDropout, Unit: "V", Value: num(head), Limit: num(need), Margin: m, Status: status(m, 0.1),
		ValueText: fmt.Sprintf("%.2f V headroom", head), LimitText: fmt.Sprintf("%.2f V needed", need)}
	beyond := "above"
	if f.Negative() {
		beyond = "beyond"
	}
	ch.Text = fmt.Sprintf("the input falls to %s%.2f V at %s; this part needs %.2f V (its datasheet's worst case) %s the %s%.2f V output", s, cd.TroughV, cd.TroughAt, need, beyond, s, cd.VoutV)
	if cd.Source == infer.InputReading {
		boundOnly(&in.Op, &ch, infer.BoundLow, cd.VoutV+need, s, func(m float64) string {
			return fmt.Sprintf("the %s%.3g V measured leaves %.2f V against %.2f V needed", s, m, m-cd.VoutV, need)
		}, "; the lowest input is a bound from the meter reading: measure the trough with a scope at full load to settle it")
	}
	return ch, true
}

// ohms writes a resistance with its SI prefix.
func ohms(r float64) string {
	switch {
	case r >= 1e6:
		return trim(r/1e6) + " MΩ"
	case r >= 1e3:
		return trim(r/1e3) + " kΩ"
	}
	return trim(r) + " Ω"
}

func trim(v float64) string {
	s := fmt.Sprintf("%.2f", v)
	for len(s) > 1 && s[len(s)-1] == '0' {
		s = s[:len(s)-1]
	}
	if s[len(s)-1] == '.' {
		s = s[:len(s)-1]
	}
	return s
}
