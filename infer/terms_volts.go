package infer

import (
	"fmt"
	"math"

	"github.com/whichreg/whichreg/catalog"
)

// vetoZ is how many allowed errors off a regulated voltage must be before
// it is impossible rather than unlikely (judgement: common practice, no
// source): six times the tolerance plus meter error is no regulator at work.
const vetoZ = 6

// isRegulator reports whether h regulates a voltage of its own between an
// output (or feedback) lead and a common lead: regulators, and switching ICs.
func isRegulator(h Hypothesis) bool {
	return !h.Family.NonRegulator() || h.Family.Device == catalog.DeviceBuck
}

// regulated returns what the family holds between output and common: the
// reference of an adjustable part, else the output voltage.
func regulated(h Hypothesis) (float64, string) {
	if h.Family.Adjustable() {
		return h.Family.VrefV, "reference"
	}
	return h.VoutV, "output"
}

// groundReferenced reports whether h is an adjustable part with a GND lead
// as well as ADJ (2941, L200): its reference sits between ADJ and ground and
// the divider runs from OUT to ADJ to ground (TI LM2941 SNVS770G: VOUT =
// VREF (R1 + R2) / R1), so the output is not OUT minus a fixed reference.
func groundReferenced(h Hypothesis) bool {
	return h.Family.Adjustable() && h.Package != nil &&
		h.Package.Lead(catalog.PinAdj) > 0 && h.Package.Lead(catalog.PinGnd) > 0
}

// heldFn is the lead whose voltage against the common lead h holds: ADJ on
// a ground-referenced adjustable part, else the output (FB on a switcher).
func heldFn(h Hypothesis, v voltsView) string {
	if groundReferenced(h) {
		return catalog.PinAdj
	}
	return v.outFn
}

// regulationZ is how far the held lead (OUT, FB, or ADJ on a
// ground-referenced part) less common lies from what h holds, in allowed
// errors (tolerance plus twice the meter error).
func regulationZ(h Hypothesis, v voltsView) (z, d, want, allowed float64) {
	d = v.tv[heldFn(h, v)] - v.com
	want, _ = regulated(h)
	allowed = h.Family.Tolerance*want + 2*(meterAbsV+meterRel*math.Abs(d))
	return math.Abs(d-v.sign*want) / allowed, d, want, allowed
}

// headroomOK reports whether the input lead is known and far enough above
// the output for h to regulate (a part in dropout may read anything lower).
func headroomOK(h Hypothesis, v voltsView, ev *Evidence) bool {
	need, _ := headroomNeed(h, ev)
	return v.haveIn && v.haveOut && v.sign*(v.in-v.out) >= need*typicalHeadroom
}

// headroomNeed is the worst-case dropout of h at the evidence's load
// ([catalog.Family.HeadroomAt]) and a few words saying at what load; a
// PNP or P-MOS pass LDO whose load is not given is taken at light load
// (its dropout falls with the load, and nothing says the load is heavy).
func headroomNeed(h Hypothesis, ev *Evidence) (float64, string) {
	f := h.Family
	if !f.ScalesDropout() {
		return f.HeadroomNeeded(), ""
	}
	if ev.Output == nil || !ev.Output.Amps.Set || ev.Output.Amps.V <= 0 {
		return f.HeadroomAt(h.Package, 1e-9), " at light load"
	}
	return f.HeadroomAt(h.Package, ev.Output.Amps.V), fmt.Sprintf(" at %.3g A", ev.Output.Amps.V)
}

// termRegulation weighs OUT − common against the output or reference. Far
// off while the input leaves room to regulate, it is an output the part
// cannot make: a near-veto.
func termRegulation(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	held := heldFn(h, v)
	if _, ok := v.tv[held]; !isRegulator(h) || !ok || !v.haveCom || (h.VoutV == 0 && !h.Family.Adjustable()) {
		return
	}
	f := h.Family
	z, d, want, allowed := regulationZ(h, v)
	_, what := regulated(h)
	com := f.Common(h.Package)
	if z > vetoZ && (headroomOK(h, v, sc.ev) || !v.haveIn) {
		if !r.text {
			r.veto("voltages.regulation", "") // nothing to box for a text
			return
		}
		r.veto("voltages.regulation", "%s − %s = %+.3f V, but this part holds %+.3f V ±%.3f there", held, com, d, v.sign*want, allowed)
		return
	}
	if !r.text {
		r.add("voltages.regulation", window(z), 0.05, "")
		return
	}
	r.add("voltages.regulation", window(z), 0.05, "%s − %s = %+.3f V; the %s is %+.3f V ±%.3f", held, com, d, what, v.sign*want, allowed)
}

// lift returns the voltage a diode string or zener in the common lead
// raises a fixed part's ground by, and its spread: 0.65 V a silicon diode
// (0.6–0.75 V at milliamperes, 1N4148/1N4007 datasheet curves) and the
// zener's figure ±5 % (the usual BZX tolerance).
func lift(ev *Evidence) (v, spread float64) {
	nw := ev.Network
	if nw == nil {
		return 0, 0
	}
	if nw.DiodeDrops != nil {
		v += 0.65 * float64(*nw.DiodeDrops)
		spread += 0.08 * float64(*nw.DiodeDrops)
	}
	if nw.ZenerVolts.Set {
		v += math.Abs(nw.ZenerVolts.V)
		spread += 0.05 * math.Abs(nw.ZenerVolts.V)
	}
	return v, spread
}

// termOutputOnly weighs the output of a fixed part when its common lead is
// not measured: most fixed parts have their common lead at ground (then OUT
// reads the nominal voltage); a lifted ground reads higher (common
// practice, no source: 80 / 20). A diode string or zener in the common lead
// predicts the lift.
func termOutputOnly(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	f := h.Family
	if !v.haveOut || v.haveCom || f.Adjustable() || h.VoutV == 0 || !isRegulator(h) {
		return
	}
	up, spread := lift(sc.ev)
	want := h.VoutV + up
	allowed := f.Tolerance*h.VoutV + spread + 2*(meterAbsV+meterRel*math.Abs(v.out))
	z := math.Abs(v.out-v.sign*want) / allowed
	if up > 0 {
		r.add("voltages.output", window(z), 0.05, "%s reads %+.3f V (common lead not measured); this part's %+.3f V lifted %.2f V by the common-lead parts gives %+.3f V ±%.3f",
			v.outFn, v.out, v.sign*h.VoutV, up, v.sign*want, allowed)
		return
	}
	lifted := 0.002
	if v.sign*v.out > h.VoutV {
		lifted = 0.2 * 0.05
	}
	r.add("voltages.output", 0.8*window(z)+lifted, 0.05, "%s reads %+.3f V (common lead not measured); this part's output is %+.3f V ±%.3f", v.outFn, v.out, v.sign*h.VoutV, allowed)
}

// termPolarity is a near-veto on a regulator whose polarity every reading
// contradicts: all leads positive to ground against a negative part, or all
// negative against a positive one.
func termPolarity(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	if h.Family.NonRegulator() {
		return
	}
	pos, neg := 0, 0
	for _, x := range sc.measured {
		switch {
		case x > 0.3:
			pos++
		case x < -0.3:
			neg++
		}
	}
	switch {
	case pos >= 2 && neg == 0 && h.Family.Negative():
		r.veto("voltages.polarity", "every lead reads positive to ground, but a negative regulator's input and output sit below ground")
	case neg >= 2 && pos == 0 && !h.Family.Negative():
		r.veto("voltages.polarity", "every lead reads negative to ground, but a positive regulator's input and output sit above ground")
	}
}

// termHeadroom weighs IN − OUT against what the part needs. An input below
// the output, or an output that holds with far less headroom than the part
// can work with, is a near-veto.
func termHeadroom(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	f := h.Family
	if !isRegulator(h) || !v.haveIn || !v.haveOut {
		return
	}
	head := v.sign * (v.in - v.out)
	// The datasheet's worst-case dropout at this load, the figure
	// replacement checks against at full load (catalog.Family.HeadroomAt).
	// A running part may be a typical one, which regulates with less: see
	// typicalHeadroom.
	drop, at := headroomNeed(h, sc.ev)
	thr := drop * typicalHeadroom
	// Far below what the part needs, the headroom is impossible whether the
	// output holds or sags: in dropout a part's output still trails its
	// input by about its dropout.
	vetoBelow := 0.5 * thr
	switch {
	case head < -0.3:
		below := "above"
		if f.Negative() {
			below = "below"
		}
		r.veto("voltages.headroom", "IN − %s = %+.2f V, but a %s regulator's input must be %s its output", v.outFn, v.in-v.out, f.Polarity, below)
	case head < vetoBelow:
		r.veto("voltages.headroom", "the output holds with only %.2f V headroom, but this part needs about %.2f V (worst-case dropout %.2f V%s)", head, thr, drop, at)
	case head < thr:
		d := (thr - head) / drop
		p := 0.9*math.Exp(-0.5*sq(d/0.15)) + 0.01
		if p > 0.3 {
			r.add("voltages.headroom", p, 0.3, "headroom %.2f V, a little under a typical part's %.2f V (worst-case dropout %.2f V%s): a better-than-typical part still regulates there", head, thr, drop, at)
		} else {
			r.add("voltages.headroom", p, 0.3, "headroom %.2f V, below even a typical part's %.2f V (worst-case dropout %.2f V%s)", head, thr, drop, at)
		}
	default:
		r.add("voltages.headroom", 0.9, 0.3, "headroom %.2f V, above a typical part's %.2f V (worst-case dropout %.2f V%s)", head, thr, drop, at)
	}
}

// termBenchDropout weighs a measured dropout (the input lowered on a bench
// supply until the output falls) against the family's. A classic or
// quasi-LDO part drops out between half its datasheet worst case and a
// little above it (typical dropouts are 50–90 % of the maximum, see
// typicalHeadroom); below half the typical figure it is impossible, as for
// the headroom. A PNP-pass LDO's dropout shrinks with the load, so only its
// upper bound counts.
func termBenchDropout(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	b := sc.ev.Bench
	if b == nil || !b.DropoutVolts.Set || !isRegulator(h) {
		return
	}
	need, _ := headroomNeed(h, sc.ev)
	if need <= 0 {
		return
	}
	d := math.Abs(b.DropoutVolts.V)
	lo, hi := 0.5*need, 1.15*need
	pnp := h.Family.ScalesDropout()
	if pnp {
		lo = 0
	}
	switch {
	case !pnp && d < 0.5*need*typicalHeadroom:
		r.veto("bench.dropout_volts", "the output held down to %.2f V of headroom, but this part drops out at about %.2f V (worst case %.2f V)", d, need*typicalHeadroom, need)
	case d >= lo && d <= hi:
		r.add("bench.dropout_volts", 0.8, 0.3, "drops out at %.2f V: this part's dropout is up to %.2f V", d, need)
	case d < lo:
		r.add("bench.dropout_volts", 0.8*math.Exp(-0.5*sq((lo-d)/(0.1*need)))+0.002, 0.3, "drops out at %.2f V, below this part's usual %.2f–%.2f V", d, lo, need)
	default:
		r.add("bench.dropout_volts", 0.8*math.Exp(-0.5*sq((d-hi)/(0.15*need)))+0.01, 0.3, "drops out at %.2f V, above this part's worst case %.2f V", d, need)
	}
}
