package replace

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
)

// Swap checks every current-production candidate against the circuit of
// the original and ranks them: drop-in first, then needs-work (least work
// first), then (with All, or when nothing else fits) unsuitable; within a
// class by the smallest margin, then by commonness. It refuses an original
// that is not a regulator with an error wrapping [infer.ErrNonRegulator].
func Swap(c *catalog.Catalog, ev *infer.Evidence, orig infer.Original, opts Options) (*Result, error) {
	if orig.Family == nil || orig.Package == nil {
		return nil, fmt.Errorf("no original part given")
	}
	if err := infer.NonRegulator(orig.Hypothesis); err != nil {
		return nil, err
	}
	in, as, err := Prepare(ev, orig)
	if err != nil {
		return nil, err
	}
	res := &Result{Original: orig, Conditions: in.Cond, Assumptions: as}
	var all []Replacement
	for _, f := range c.Sorted() {
		if f.NonRegulator() {
			continue // a transistor or switching IC is never a replacement
		}
		if f.Polarity != orig.Family.Polarity && !opts.All {
			continue // the polarity check would fail: not worth listing
		}
		for i := range f.Packages {
			p := &f.Packages[i]
			if !opts.All && f.StatusOf(p) != "active" {
				continue
			}
			all = append(all, Evaluate(in, infer.Hypothesis{Family: f, Package: p, Outline: c.Outline(p.Outline)}))
		}
	}
	res.OriginalShortfalls = originalShortfalls(in, orig, all)
	sort.SliceStable(all, func(i, j int) bool { return better(&all[i], &all[j]) })
	usable := 0
	for _, r := range all {
		if r.Verdict != Unsuitable {
			usable++
		}
	}
	for _, r := range all {
		if r.Verdict == Unsuitable && !opts.All && usable > 0 {
			res.Hidden++
			continue
		}
		res.Replacements = append(res.Replacements, r)
	}
	return res, nil
}

// better orders candidates: verdict; within unsuitable those that fail only
// where the original fails too; within needs-work the fewer checks needing
// work; then the larger smallest margin; then commonness; then label.
func better(a, b *Replacement) bool {
	if a.Verdict != b.Verdict {
		return a.Verdict.rank() < b.Verdict.rank()
	}
	if a.Verdict == Unsuitable && a.FailsLikeOriginal != b.FailsLikeOriginal {
		return a.FailsLikeOriginal // no worse here than the part that was there
	}
	if a.Verdict == Unsuitable && a.Deciding == b.Deciding {
		// Failing the same check: the one that misses by less, in the
		// check's unit (a normalised margin would favour the part that
		// needs more headroom when the headroom is negative).
		ma, oka := a.Check(a.Deciding).MarginInUnit()
		mb, okb := b.Check(b.Deciding).MarginInUnit()
		if oka && okb && math.Abs(ma-mb) > 1e-9 {
			return ma > mb
		}
	}
	if a.Verdict == NeedsWork && a.WorkCount != b.WorkCount {
		return a.WorkCount < b.WorkCount
	}
	if math.Abs(a.MinMargin-b.MinMargin) > 1e-9 {
		return a.MinMargin > b.MinMargin
	}
	if a.Family.Commonness != b.Family.Commonness {
		return a.Family.Commonness > b.Family.Commonness
	}
	return a.Label() < b.Label()
}

// WhyNotFirst says truthfully why r ranks below first: a worse verdict (the
// check that decides it), more work, a smaller margin, or only commonness.
func WhyNotFirst(r, first *Replacement) string {
	dec := r.Check(r.Deciding)
	switch {
	case r.Verdict != first.Verdict:
		if dec != nil {
			return fmt.Sprintf("%s: %s %s: %s", r.Verdict, r.Deciding, r.DecidingWhy, dec.Text)
		}
		return string(r.Verdict)
	case r.Verdict == Unsuitable && first.FailsLikeOriginal && !r.FailsLikeOriginal && dec != nil:
		return fmt.Sprintf("also unsuitable, and it fails where the original does not: %s: %s", r.Deciding, dec.Text)
	case r.Verdict == Unsuitable && r.Deciding == first.Deciding && dec != nil && unitGap(r, first):
		mr, _ := dec.MarginInUnit()
		mf, _ := first.Check(first.Deciding).MarginInUnit()
		return fmt.Sprintf("also unsuitable, missing %s by more than %s does (%s against %s): %s", r.Deciding, first.Label(),
			signedIn(mr, dec.Unit), signedIn(mf, dec.Unit), dec.Text)
	case r.Verdict == NeedsWork && r.WorkCount != first.WorkCount:
		return fmt.Sprintf("more work (%s) than %s (%s)", r.WorkList(), first.Label(), first.WorkList())
	case math.Abs(r.MinMargin-first.MinMargin) > 1e-9 && dec != nil:
		return fmt.Sprintf("also %s, with a smaller margin: %s %+.2f against %+.2f (%s)", r.Verdict, r.Deciding, r.MinMargin, first.MinMargin, dec.Text)
	}
	return fmt.Sprintf("also %s with the same margin; %s is the more common part", r.Verdict, first.Family.ID)
}

// Evaluate runs every check that applies to candidate h in the fixed order
// and judges it.
func Evaluate(in *Input, h infer.Hypothesis) Replacement {
	c := prepareCandidate(in, h)
	r := Replacement{Hypothesis: c.Hypothesis}
	for _, k := range checks {
		if ch, ok := k.fn(*in, c); ok { // copies: no check can change what another reads
			r.Checks = append(r.Checks, ch)
		}
	}
	judge(&r)
	for _, ch := range r.Checks {
		if ch.Action != "" && ch.Status != Fail && ch.Status != Pass {
			r.Install = append(r.Install, ch.Action)
		}
	}
	if r.Verdict != Unsuitable {
		r.Install = append(r.Install, afterPowerUp(*in, c)...)
	}
	return r
}

// judge sets the verdict and the deciding check: the failing check with
// the smallest margin, else the work check with the smallest margin, else
// the check with the smallest margin.
func judge(r *Replacement) {
	r.Verdict, r.MinMargin = DropIn, math.Inf(1)
	worst := -1
	for _, ch := range r.Checks {
		r.MinMargin = math.Min(r.MinMargin, ch.Margin)
		if ch.Status == Work {
			r.WorkCount++
		}
		worst = max(worst, ch.Status.rank())
	}
	switch {
	case worst >= Fail.rank():
		r.Verdict, r.DecidingWhy = Unsuitable, "fails"
	case worst == Work.rank():
		r.Verdict, r.DecidingWhy = NeedsWork, "needs work"
	default:
		r.DecidingWhy = "smallest margin"
	}
	best := math.Inf(1)
	for _, ch := range r.Checks {
		if (worst < Work.rank() || ch.Status.rank() == worst) && ch.Margin < best {
			best, r.Deciding = ch.Margin, ch.Name
		}
	}
}

// afterPowerUp is what to measure once the part is in.
func afterPowerUp(in Input, c cand) []string {
	cd := &in.Cond
	theta, _ := thermalPath(in, c)
	tcase := cd.AmbientC + c.powerW*(theta-c.Package.ThetaJC)
	if c.Outline != nil && c.Outline.SMD || cd.HeatsinkCW <= 0 {
		tcase = cd.AmbientC + c.powerW*theta*0.8 // the body runs a little below the junction (common practice, no source)
	}
	s := c.Family.SignText()
	out := fmt.Sprintf("%s%.2f V ±%g %% at full load", s, c.outV, c.Family.Tolerance*100)
	if in.Lifted && !c.Family.Adjustable() && !c.Family.Switching() {
		// On the lifted ground the output moves with the ground current:
		// say the range to expect (with the new bottom resistor, if any).
		p := planLift(&in, c, c.VoutV)
		lo, hi := p.got, p.hi
		if p.retuned() {
			lo, hi = p.gotN, p.hiN
		}
		if math.Abs(hi-lo) >= 0.005 {
			out = fmt.Sprintf("%s%.2f V (a typical part, light load) to %s%.2f V (worst case, full load) as the ground current lifts it, with the part's own ±%g %% (±%.2f V) on top", s, lo, s, hi, c.Family.Tolerance*100, c.Family.Tolerance*c.VoutV)
		}
	}
	if in.SourceA > 0 {
		// A current source: its output voltage follows the load.
		out = fmt.Sprintf("the set current, about %.3g A into the load (a meter in series with the load, or the drop across the OUT resistor), not a voltage", in.SourceA)
	}
	heat := fmt.Sprintf("after 10 minutes at full load: case about %.0f °C (expect within 10 °C); do not touch it bare-handed", tcase)
	if tj := cd.AmbientC + c.powerW*theta; tj > c.Family.TjMaxC {
		// The model puts the junction past its limit: the mounting or load
		// assumed is not the board's, so no case temperature is predicted.
		heat = fmt.Sprintf("heat: on the mounting and load as described the junction would pass its %g °C limit, so no case temperature is predicted; settle the mounting first (see above), then run at a light load and check the case with a thermocouple, not a finger, before full load", c.Family.TjMaxC)
	}
	return []string{
		fmt.Sprintf("after power-up: output %s; ripple at the output a few mV (a scope, AC-coupled)", out),
		heat,
	}
}

// originalShortfalls runs the checks on the original part itself in this
// circuit and returns those it fails (a circuit marginal at low mains, an
// input above its own rating). Each candidate's failing check of the same
// name says so in its sentence, and a candidate whose every failure is one
// of these is marked [Replacement.FailsLikeOriginal].
func originalShortfalls(in *Input, orig infer.Original, all []Replacement) []Shortfall {
	own := Evaluate(in, orig.Hypothesis)
	var out []Shortfall
	failed, onBound := map[CheckName]*Check{}, map[CheckName]*Check{}
	for _, ch := range own.Checks {
		switch ch.Name {
		case CheckOutline, CheckPolarity, CheckPinout, CheckTab:
			continue // the original fits its own place by definition
		}
		switch {
		case ch.Status == Fail:
			failed[ch.Name] = &ch
			out = append(out, Shortfall{Check: ch, cond: in.Cond})
		case ch.Status == Warn && ch.Margin < 0 && in.Cond.Source == infer.InputReading && (ch.Name == CheckDropout || ch.Name == CheckVinMax || ch.Name == CheckThermal):
			side := infer.BoundLow
			switch ch.Name {
			case CheckVinMax:
				side = infer.BoundHigh
			case CheckThermal:
				side = infer.BoundMean
			}
			onBound[ch.Name] = &ch
			out = append(out, Shortfall{Check: ch, cond: in.Cond, OnBound: true, advice: in.Op.BoundAdvice(side)})
		}
	}
	if len(out) == 0 {
		return nil
	}
	for i := range all {
		r := &all[i]
		fails, shared := 0, 0
		for j := range r.Checks {
			ch := &r.Checks[j]
			if oc, ok := onBound[ch.Name]; ok && ch.Margin < 0 {
				ch.Text += "; the original part misses this bound too (" + oc.ValueText + " against " + oc.LimitText + ")"
			}
			if ch.Status != Fail {
				continue
			}
			fails++
			if oc, ok := failed[ch.Name]; ok {
				shared++
				ch.Text += "; the original part has the same shortfall (" + oc.ValueText + " against " + oc.LimitText + "): " + circuitWords(*oc, in.Cond)
			}
		}
		r.FailsLikeOriginal = fails > 0 && fails == shared
	}
	// The best candidate that passes each shortfall: the lowest need among
	// the candidates that are not unsuitable.
	for k := range out {
		var best *Replacement
		for i := range all {
			r := &all[i]
			ch := r.Check(out[k].Check.Name)
			if r.Verdict == Unsuitable || ch == nil || (ch.Status != Pass && ch.Status != Warn) || ch.Margin < 0 {
				continue
			}
			if best == nil || better(r, best) {
				best = r
			}
		}
		if best != nil {
			ch := best.Check(out[k].Check.Name)
			out[k].PassedBy = best.Label()
			out[k].PassedWith = ch.ValueText + " against " + ch.LimitText
		}
	}
	return out
}

// circuitWords says what the original's own shortfall means: the circuit
// is marginal where it fails; or, for heat and current far beyond the
// rating, the original could not have run so and the evidence is to be
// checked (a confident verdict on a wrong load or mounting is the worst
// outcome).
func circuitWords(own Check, cd Conditions) string {
	if (own.Name == CheckThermal || own.Name == CheckCurrent) && own.Margin < -0.5 {
		return "the original could not have run like this for long: check the load and the mounting the evidence gives"
	}
	if cd.Source == infer.InputReading && (own.Name == CheckDropout || own.Name == CheckVinMax) {
		// A fail here is the measured reading's own (a miss on the bound
		// alone is a warn, see [boundOnly]).
		return "the measured input itself is outside the part's limit: check the reading and what feeds the part"
	}
	at := where(own.Name, cd.Source)
	if own.Name == CheckVinMax && cd.TransientV > 0 && own.Value != nil && math.Abs(*own.Value) >= cd.TransientV {
		at = "at the stated transient (load dump)" // the surge, not the steady supply, crosses the limit
	}
	s := "the circuit, not the part, is marginal " + at
	var on []string
	if cd.LoadAssumed && own.Name != CheckVinMax {
		on = append(on, "the assumed load")
	}
	if cd.Source == infer.InputReading && own.Name == CheckThermal {
		on = append(on, "the bound from the meter reading")
	}
	if len(on) > 0 {
		s += " (this rests on " + strings.Join(on, " and ") + ": measure to settle it)"
	}
	return s
}

// where says under which condition a check's shortfall shows, for an
// input from source src.
func where(n CheckName, src infer.InputSource) string {
	switch {
	case src == infer.InputDC && n == CheckDropout:
		return "at the supply's lowest"
	case src == infer.InputDC && (n == CheckVinMax || n == CheckThermal):
		return "at the supply's highest"
	}
	switch n {
	case CheckDropout:
		return "at low mains and full load"
	case CheckVinMax:
		return "at high mains and light load"
	case CheckThermal:
		return "at high mains and full load"
	case CheckCurrent:
		return "at full load"
	case CheckMinLoad:
		return "at light load"
	}
	return "here"
}

// unitGap reports whether r and first, failing the same check, miss it by
// different amounts in its unit.
func unitGap(r, first *Replacement) bool {
	mr, ok1 := r.Check(r.Deciding).MarginInUnit()
	mf, ok2 := first.Check(first.Deciding).MarginInUnit()
	return ok1 && ok2 && math.Abs(mr-mf) > 1e-9
}

// signedIn writes a signed margin in its unit with three significant figures.
func signedIn(v float64, unit string) string {
	return fmt.Sprintf("%+.3g %s", v, unit)
}
