package infer

import (
	"math"

	"github.com/whichreg/whichreg/infer/circuit"
)

// boosterVBE is the base-emitter drop at which a booster transistor takes
// over from the regulator: about 0.7 V for a silicon power transistor at
// tens of milliamperes (2N2955/TIP42 class datasheet VBE(on) curves; the
// usual design figure of the datasheets' current-boost circuit).
const boosterVBE = 0.7

// termCurrent weighs the current the part itself carries against its
// rating: the load, less a bypass resistor's share (circuit.Bypass, the same
// rule as replacement's) or, with a booster transistor, what its sense
// resistor lets through before the transistor takes over. Far above the
// rating is a near-veto.
func termCurrent(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	ev, f := sc.ev, h.Family
	out := ev.Output
	if out == nil || !out.Amps.Set || out.Amps.V <= 0 {
		return
	}
	i := out.Amps.V
	var text string
	ireg := i
	switch b := ev.Booster; {
	case b != nil && !b.RSenseOhms.Set:
		return // the booster's share is unknown: the load says nothing of the part
	case b != nil:
		ireg = math.Min(i, boosterVBE/b.RSenseOhms.V)
		text = r.say("part current %.3f A (%.3f A load; the booster takes over above %.2f V across %s) against %.3g A rated",
			ireg, i, boosterVBE, ohmsText(b.RSenseOhms.V), f.Current(h.Package))
	case ev.Bypass != nil && ev.Bypass.Ohms.V > 0 && v.haveIn && v.haveOut:
		br, err := (circuit.Bypass{ROhm: ev.Bypass.Ohms.V, VinMinV: math.Abs(v.in), VinMaxV: math.Abs(v.in), VoutV: math.Abs(v.out), LoadMinA: i, LoadMaxA: i}).Solve()
		if err == nil && br.ResistorMinA > 0 {
			ireg = math.Max(0, i-br.ResistorMinA)
			text = r.say("part current %.3f A (%.3f A load less %.3f A through the bypass resistor) against %.3g A rated", ireg, i, br.ResistorMinA, f.Current(h.Package))
		}
	}
	rating := f.Current(h.Package)
	if rating <= 0 {
		return
	}
	if text == "" {
		text = r.say("part current %.3f A against %.3g A rated", ireg, rating)
	}
	q := ireg / rating
	// Designers leave margin below the rating and seldom use a large part
	// for a tiny load (common practice, no source).
	switch {
	case q >= 2:
		r.veto("current", "%s, twice the rating or more", text)
	case q > 1:
		r.add("current", 0.6*math.Exp(-0.5*sq((q-1)/0.15))+0.01, 0.3, "%s: over the rating", text)
	case q > 0.8:
		r.add("current", 0.6, 0.3, "%s: close to the rating", text)
	case q < 0.05:
		r.add("current", 0.3, 0.3, "%s: a large part for so small a load", text)
	default:
		r.add("current", 0.9, 0.3, "%s", text)
	}
}

// termInputMax weighs the highest input the circuit presents against the
// part's running limit ([catalog.Family.InputLimit]; start-up is
// replacement's question). With no [input] described, the part has
// survived the reading on its input lead: a reading over the limit weighs
// as a described input's peak would, while the bound taken from the reading
// (high mains, light load, assumed ripple and transformer rise) is an
// assumption and weighs at most mildly.
func termInputMax(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	f := h.Family
	il := f.InputLimit(h.VoutV)
	limit := il.RunV
	if limit <= 0 {
		return
	}
	s := f.SignText() // negative rails keep their sign in every figure
	var lim string
	if r.text { // formatted (and its arguments boxed) only when wanted
		switch {
		case f.NonRegulator():
			lim = r.say("%.0f V voltage rating", limit)
		case f.Adjustable() && h.VoutV > 0 && limit > il.StartV:
			lim = r.say("%s%.0f V limit (the %.0f V %s plus the %s%.3g V output)", s, limit, il.StartV, il.What, s, h.VoutV)
		default:
			lim = r.say("%s%.0f V %s", s, limit, il.What)
		}
	}
	if f.NonRegulator() {
		s = ""
	}
	if sc.input.Source == InputUnknown {
		if !v.haveIn || v.in == 0 {
			return
		}
		read, bound := math.Abs(v.in), sc.input.PeakFor(v.in).V
		switch {
		case read > readingVetoQ*limit:
			r.veto("input_max", "input %s%.1f V measured, far over the %s: the part could not have run on it", s, read, lim)
		case read > limit:
			r.add("input_max", overLimit(read/limit), 0.5, "input %s%.1f V measured, %s the %s", s, read, overWords(read/limit), lim)
		case bound > limit:
			// The part has run on the reading; only the assumed rise
			// (high mains, light load) takes it over.
			r.add("input_max", 0.35, 0.5, "input peak %s%.1f V at most, a bound from the %s%.1f V reading at high mains and light load: over the %s, but the part runs on the %s%.1f V measured, so the bound weighs lightly", s, bound, s, read, lim, s, read)
		default:
			r.add("input_max", 0.9, 0.5, "input peak %s%.1f V at most, a bound from the %s%.1f V reading at high mains and light load: within the %s", s, bound, s, read, lim)
		}
		return
	}
	peak, from := sc.input.Peak.V, sc.input.Peak.At
	if peak <= 0 {
		return
	}
	q := peak / limit
	if q <= 1 {
		r.add("input_max", 0.9, 0.5, "input peak %s%.1f V (%s) within the %s", s, peak, from, lim)
		return
	}
	r.add("input_max", overLimit(q), 0.5, "input peak %s%.1f V (%s) %s the %s", s, peak, from, overWords(q), lim)
}

// readingVetoQ is how far over its running limit a measured input must be
// before the part could not have been running on it: parts survive a
// little over their absolute maximum, not a third over it for years
// (common practice, no source).
const readingVetoQ = 1.3

// overLimit is the chance of an input q times the part's limit (q > 1):
// a little over it parts often survive, far over it they do not (common
// practice, no source).
func overLimit(q float64) float64 {
	switch {
	case q <= 1.05:
		return 0.3
	case q <= 1.15:
		return 0.05
	}
	return 0.01
}

// overWords says how far over its limit an input q times the limit is.
func overWords(q float64) string {
	switch {
	case q <= 1.05:
		return "just over"
	case q <= 1.15:
		return "over"
	}
	return "far over"
}

// termDivider weighs what the resistor network predicts for this part
// against the measured output.
func termDivider(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	nw := sc.ev.Network
	if nw == nil || !nw.RTopOhms.Set || !nw.RBottomOhms.Set || !v.haveOut || !isRegulator(h) || (h.VoutV == 0 && !h.Family.Adjustable()) {
		return
	}
	f := h.Family
	bottom := nw.BottomToVolts.V
	rt, rb := nw.RTopOhms.V, nw.RBottomOhms.V
	var pred, spread float64
	if f.Adjustable() {
		pred, _ = circuit.DividerVout(f.VrefV, f.IadjTypUA*1e-6, rt, rb, v.sign*bottom)
		spread = f.Tolerance*f.VrefV*(1+rb/rt) + f.IadjUA*1e-6*rb
	} else {
		pred, _ = circuit.DividerVout(h.VoutV, f.IqTypMA*1e-3, rt, rb, v.sign*bottom)
		spread = f.Tolerance*h.VoutV*(1+rb/rt) + f.IqMA*1e-3*rb
	}
	allowed := spread + 2*(meterAbsV+meterRel*math.Abs(v.out))
	z := math.Abs(math.Abs(v.out)-pred) / allowed
	r.add("network", window(z), 0.05, "the divider (%s over %s) gives %.2f V with this part; %.2f V measured", ohmsText(rt), ohmsText(rb), v.sign*pred, v.out)
}

// termCommonParts weighs diodes or a zener in the common lead: the usual
// lifted ground of a fixed part, an odd way to set an adjustable one (its
// output is set with resistors), no place for a transistor. A measured
// common lead must sit at the lift.
func termCommonParts(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	up, spread := lift(sc.ev)
	if up == 0 {
		return
	}
	f := h.Family
	switch {
	case f.Adjustable():
		r.add("network.lift", 0.2, 0.5, "diodes or a zener in the common lead: an adjustable part sets its output with resistors")
	case !isRegulator(h):
		r.add("network.lift", 0.2, 0.5, "diodes or a zener in a common lead: this part has no common lead to lift")
	default:
		r.add("network.lift", 0.8, 0.5, "diodes or a zener in the common lead: the usual way to lift a fixed part's ground")
	}
	if v.haveCom && isRegulator(h) && !f.Adjustable() {
		allowed := spread + 2*(meterAbsV+meterRel*math.Abs(v.com))
		z := math.Abs(math.Abs(v.com)-up) / allowed
		r.add("network.lift", window(z), 0.05, "%s lead reads %+.2f V; the common-lead parts give %.2f V ±%.2f", f.Common(h.Package), v.com, up, allowed)
	}
}

// termTrimmer weighs a trimmer in the network.
func termTrimmer(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	nw := sc.ev.Network
	if nw == nil || nw.Trimmer == nil || !*nw.Trimmer {
		return
	}
	switch {
	case h.Family.Adjustable():
		r.add("network.trimmer", 0.7, 0.5, "a trimmer in the network: usual for an adjustable part")
	case h.Family.NonRegulator():
		r.add("network.trimmer", 0.5, 0.5, "a trimmer in the network: it may set a transistor's base or a reference")
	default:
		r.add("network.trimmer", 0.3, 0.5, "a trimmer in the network: a fixed part would need a lifted ground")
	}
}

// termBenchLoad weighs the largest test load the part held against its
// rating: a part holds its rating, and often more until its current limit
// (about 1.4–2.2 times the rating: LM7805 2.2 A peak for 1 A, 78M05 0.7 A
// for 0.5 A, typical peak-output figures of the datasheets, from memory);
// two and a half times its rating it cannot.
func termBenchLoad(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	b := sc.ev.Bench
	if b == nil || !b.HoldsAmps.Set || b.HoldsAmps.V <= 0 || !isRegulator(h) {
		return
	}
	rating := h.Family.Current(h.Package)
	if rating <= 0 {
		return
	}
	q := b.HoldsAmps.V / rating
	switch {
	case q >= 2.5:
		r.veto("bench.holds_amps", "held %.3g A on the test load, %.1f times the %.3g A rating: beyond any current limit", b.HoldsAmps.V, q, rating)
	case q > 1.6:
		r.add("bench.holds_amps", 0.03, 0.3, "held %.3g A on the test load, %.1f times the %.3g A rating: at the edge of its current limit", b.HoldsAmps.V, q, rating)
	case q > 1.05:
		r.add("bench.holds_amps", 0.25, 0.3, "held %.3g A on the test load, beyond the %.3g A rating (inside its current limit)", b.HoldsAmps.V, rating)
	case q >= 0.8:
		r.add("bench.holds_amps", 0.6, 0.3, "held %.3g A on the test load: about the %.3g A rating", b.HoldsAmps.V, rating)
	default:
		r.add("bench.holds_amps", 0.08, 0.3, "gave up above %.3g A on the test load, below the %.3g A rating (unlikely for this part unless its input sagged)", b.HoldsAmps.V, rating)
	}
}

// termTransient weighs a stated surge (a car's load dump) that the original
// has lived through against the part's surge rating (the catalog's
// transient_max_v, else its running limit): a part rated for the steady
// input only would not have lasted. A stated surge may be the technician's
// requirement rather than a measurement, so it weighs mildly (common
// practice, no source).
func termTransient(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	f := h.Family
	tv := sc.input.TransientV
	il := f.InputLimit(h.VoutV)
	limit, what := il.RunV, il.What
	if tv <= 0 || limit <= 0 || f.NonRegulator() {
		return
	}
	if !f.Adjustable() && f.TransientMaxV > limit {
		limit, what = f.TransientMaxV, "transient (load dump) rating"
	}
	s := f.SignText()
	q := tv / limit
	switch {
	case q <= 1:
		r.add("transient", 0.9, 0.5, "stated transient %s%.0f V within the %s%.0f V %s", s, tv, s, limit, what)
	case q <= 1.15:
		r.add("transient", 0.3, 0.5, "stated transient %s%.0f V just over the %s%.0f V %s: it would have been at risk at every surge", s, tv, s, limit, what)
	default:
		r.add("transient", 0.15, 0.5, "stated transient %s%.0f V over the %s%.0f V %s: a part without a surge rating for it would not have lasted", s, tv, s, limit, what)
	}
}
