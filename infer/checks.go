package infer

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer/circuit"
)

// conflicts lists evidence that contradicts itself, evidence that every
// leading candidate contradicts, and the cross-checks that failed. They are
// listed, not errors: the ranking still answers.
func (sc *scene) conflicts(res *Result) []string {
	ev := sc.ev
	out := selfContradictions(ev)
	out = append(out, sc.packageSlip()...)
	out = append(out, sc.inputSlip(res)...)
	out = append(out, deadPart(ev)...)
	out = append(out, sc.markingSlip(res)...)
	out = append(out, sc.reversedLeads(res)...)
	out = append(out, sc.mirrorSlip(res)...)
	out = append(out, sc.unitSlips()...)
	outline := sc.leaderOutline(res)
	out = append(out, outline...)
	// Voltages that fit no regulator's pinout at all.
	regs, reversed := 0, 0
	for _, c := range res.Candidates {
		if !isRegulator(c.Hypothesis) {
			continue
		}
		v := viewOf(c.Hypothesis, ev)
		if v.haveIn && v.haveOut {
			regs++
			if v.sign*(v.in-v.out) < -0.3 {
				reversed++
			}
		}
	}
	allReversed := regs > 0 && reversed == regs
	if allReversed {
		out = append(out, "for every regulator pinout in the catalog the output lies beyond the input: check which lead is which and the meter's polarity")
	}
	// Evidence every leader contradicts. When "not in the catalog" leads,
	// the leaders are poor fits anyway and their quarrels are noise, except
	// for a marking that fits nothing and the veto that put the leader out.
	lead := res.Candidates[:min(5, len(res.Candidates))]
	nicLeads := len(lead) > 0 && lead[0].Probability < res.NotInCatalog
	if len(lead) > 0 {
		for _, r := range lead[0].Reasons {
			if r.Weight > -2 || r.Evidence == "prior" || r.Evidence == "year" || r.Evidence == "voltages.headroom" && allReversed || r.Evidence == "package" && len(outline) > 0 {
				continue
			}
			all := true
			for _, c := range lead[1:] {
				if w, ok := weightOf(c, r.Evidence); !ok || w > -2 {
					all = false
					break
				}
			}
			if nicLeads && r.Evidence != "marking" {
				all = false
			}
			switch {
			case all:
				out = append(out, fmt.Sprintf("%s: none of the leading candidates explains it (leader: %s)", r.Evidence, r.Text))
			case r.Weight <= math.Log(vetoRatio)+1e-9:
				out = append(out, fmt.Sprintf("%s: the leader %s cannot produce it (%s); a slip in the notes is the likeliest explanation", r.Evidence, lead[0].name(), r.Text))
			}
		}
	}
	return out
}

// selfContradictions are readings that disagree with the evidence's own
// wiring.
func selfContradictions(ev *Evidence) []string {
	var out []string
	for _, n := range ev.Leads() {
		p, _ := ev.Lead(n)
		if p.WiredTo == WiredGround && p.Volts.Set && math.Abs(p.Volts.V) > 0.3 {
			out = append(out, fmt.Sprintf("pins.%d is wired to ground but reads %+.2f V: check the continuity or the meter's ground", n, p.Volts.V))
		}
		if p.WiredTo == WiredOpen && p.Volts.Set && math.Abs(p.Volts.V) > 0.3 {
			out = append(out, fmt.Sprintf("pins.%d is open but reads %+.2f V", n, p.Volts.V))
		}
	}
	// The rail a lead feeds cannot stand beyond the rail another lead draws from.
	for _, a := range ev.Leads() {
		pa, _ := ev.Lead(a)
		if pa.WiredTo != WiredUnregulated || !pa.Volts.Set {
			continue
		}
		for _, b := range ev.Leads() {
			pb, _ := ev.Lead(b)
			if pb.WiredTo == WiredLoad && pb.Volts.Set && pa.Volts.V*pb.Volts.V >= 0 && math.Abs(pb.Volts.V) > math.Abs(pa.Volts.V)+0.3 {
				out = append(out, fmt.Sprintf("lead %d (wired to the load) reads %+.2f V, beyond lead %d (wired to the unregulated rail) at %+.2f V: "+
					"a series part's input sits beyond its output; check the wiring notes and the readings (swapped?)", b, pb.Volts.V, a, pa.Volts.V))
			}
		}
	}
	if m := ev.Mount; m != nil && m.ChassisHeatsink != nil && *m.ChassisHeatsink && (m.Insulator == "none" || m.Insulator == "grease") {
		if v, ok := caseVolts(ev); ok && math.Abs(v) > 0.3 {
			out = append(out, fmt.Sprintf("the tab or can reads %+.2f V, but the notes have it bare on a grounded heat sink, which would hold it at 0 V: "+
				"there is an insulator (mount.insulator), or the package is an insulated one", v))
		}
	}
	if cs := ev.Case; cs != nil && cs.TiedToPin != nil && *cs.TiedToPin > 0 {
		if p, ok := ev.Lead(*cs.TiedToPin); ok {
			if cs.Volts.Set && p.Volts.Set && math.Abs(cs.Volts.V-p.Volts.V) > math.Max(0.2, 0.05*math.Abs(p.Volts.V)) {
				out = append(out, fmt.Sprintf("the case is tied to lead %d but reads %+.2f V against the lead's %+.2f V", *cs.TiedToPin, cs.Volts.V, p.Volts.V))
			}
			if cs.WiredTo != "" && p.WiredTo != "" && cs.WiredTo != p.WiredTo {
				out = append(out, fmt.Sprintf("the case is tied to lead %d but is wired to %s while the lead goes to %s", *cs.TiedToPin, cs.WiredTo, p.WiredTo))
			}
		}
	}
	return out
}

// packageSlip: the named package against the leads counted.
func (sc *scene) packageSlip() []string {
	if !sc.packageContradicted() {
		return nil
	}
	n := *sc.ev.Outline.Leads
	var names []string
	for _, o := range sc.c.Outlines {
		if o.Leads == n {
			names = append(names, o.Name)
		}
	}
	sort.Strings(names)
	also := ""
	if len(names) > 0 {
		also = fmt.Sprintf(" (%d-lead outlines: %s)", n, strings.Join(names, ", "))
	}
	return []string{fmt.Sprintf("package %s is named but %d leads were counted: the ranking uses the measured outline; the package name looks wrong%s",
		sc.ev.Package, n, also)}
}

// leaderOutline: the leader's outline is not the package named (the name
// is taken as a possible slip, so the ranking may still lead with another
// outline): say so, so that the outline gets a second look.
func (sc *scene) leaderOutline(res *Result) []string {
	ev := sc.ev
	if ev.Package == "" || len(res.Candidates) == 0 || sc.packageContradicted() || res.Candidates[0].Probability < res.NotInCatalog {
		return nil
	}
	lead := res.Candidates[0]
	if lead.Outline == nil || namesOutline(ev.Package, lead.Outline) {
		return nil
	}
	return []string{fmt.Sprintf("package %s is named, but the leader is %s: no %s part in the catalog fits the readings as well; look at the outline again ('whichreg catalog show %s' draws it)",
		ev.Package, lead.name(), ev.Package, lead.Family.ID)}
}

// inputLead returns the reading of the part's input: a lead wired to the
// unregulated rail, else the leader's IN lead; ok is false when neither is
// measured.
func inputLead(ev *Evidence, res *Result) (n int, v float64, ok bool) {
	for _, k := range ev.Leads() {
		if p, _ := ev.Lead(k); p.WiredTo == WiredUnregulated && p.Volts.Set {
			return k, p.Volts.V, true
		}
	}
	if len(res.Candidates) == 0 || !isRegulator(res.Candidates[0].Hypothesis) {
		return 0, 0, false
	}
	if k := res.Candidates[0].Package.Lead(catalog.PinIn); k > 0 {
		if p, _ := ev.Lead(k); p.Volts.Set {
			return k, p.Volts.V, true
		}
	}
	return 0, 0, false
}

// inputSlip: the input lead's reading against the rectifier model's range.
// A reading above the highest peak the model allows (high mains, light load)
// or below its lowest trough (low mains, full load, low filter capacitance)
// says a figure of the [input] table is wrong: most often the secondary.
func (sc *scene) inputSlip(res *Result) []string {
	in := sc.ev.Input
	if sc.input.Source != InputRectifier || in == nil {
		return nil
	}
	n, v, ok := inputLead(sc.ev, res)
	if !ok {
		return nil
	}
	vm := math.Abs(v)
	desc := fmt.Sprintf("%s V secondary, %s", trimFloat(in.SecondaryVrms.V), in.Rectifier)
	if hi := sc.input.Peak.V; vm > hi*1.05 {
		return []string{fmt.Sprintf("lead %d (the input) reads %.2f V, but the [input] model (%s) gives at most %.1f V, even at high mains and light load: "+
			"the transformer figure looks wrong; check input.secondary_vrms (the other winding, or both halves of a centre-tapped one?)", n, v, desc, hi)}
	}
	if r := sc.input.Rectifier; r != nil && vm < sc.input.Peak.V*0.8 {
		// The lowest trough: low mains, full load, low filter capacitance.
		low, err := sc.ev.memo.solve(r.At(circuit.Corner{Mains: 1 - sc.input.MainsTol, CapFactor: 1 - FilterCapTolerance, Load: r.Load}))
		if err == nil && vm < low.TroughV*0.95 {
			msg := fmt.Sprintf("lead %d (the input) reads %.2f V, but the [input] model (%s) never falls below %.1f V, even at low mains and full load: "+
				"check input.secondary_vrms and input.filter_uf (a dried-out filter capacitor reads low too)", n, v, desc, low.TroughV)
			if in.Rectifier == RectifierCenterTap {
				// The usual slip: the whole winding read for one half.
				msg += fmt.Sprintf("; for a center-tap, secondary_vrms is one half's voltage: if %s V is the whole winding end to end, write %s", trimFloat(in.SecondaryVrms.V), trimFloat(in.SecondaryVrms.V/2))
			}
			return []string{msg}
		}
	}
	return nil
}

// outputReading returns the magnitude of the regulated rail: a lead wired
// to the load, else the leader's output lead.
func outputReading(ev *Evidence, res *Result) (float64, bool) {
	for _, k := range ev.Leads() {
		if p, _ := ev.Lead(k); p.WiredTo == WiredLoad && p.Volts.Set {
			return math.Abs(p.Volts.V), true
		}
	}
	if len(res.Candidates) > 0 && isRegulator(res.Candidates[0].Hypothesis) {
		v := viewOf(res.Candidates[0].Hypothesis, ev)
		if v.haveOut {
			return math.Abs(v.out - v.com), true
		}
	}
	return 0, false
}

// markingSlip: a marking's voltage code against the measured output.
func (sc *scene) markingSlip(res *Result) []string {
	if len(sc.codeVolts) == 0 {
		return nil
	}
	out, ok := outputReading(sc.ev, res)
	if !ok {
		return nil
	}
	up, _ := lift(sc.ev)
	lifted := up > 0 || sc.ev.Network != nil
	for _, want := range sc.codeVolts {
		d := out - want
		if math.Abs(d) <= 0.08*want+0.2 || (d > 0 && lifted) {
			return nil
		}
	}
	return []string{fmt.Sprintf("the marking %q reads as a %s V part but the output measures %.2f V: a misread digit, a lifted ground or a failed part; "+
		"look at the marking again under a loupe before trusting either", sc.ev.Marking, trimFloat(sc.codeVolts[0]), out)}
}

// reversedLeads: every reading has one sign while the wiring, outline and
// marking (the evidence a meter's polarity cannot change) fit a regulator of
// the other polarity far better: the meter's leads were
// probably swapped.
func (sc *scene) reversedLeads(res *Result) []string {
	pos, neg := 0, 0
	for _, x := range measuredLeads(sc.ev) {
		switch {
		case x > 0.3:
			pos++
		case x < -0.3:
			neg++
		}
	}
	if (pos > 0) == (neg > 0) || pos+neg < 2 || len(res.Candidates) == 0 {
		return nil
	}
	// Only when nothing explains the readings as they are: a leader that
	// contradicts the named package at a glance (a TO-92 for the TO-220 in
	// the technician's hand) explains nothing either.
	if lead := res.Candidates[0]; res.NotInCatalog < lead.Probability && !hasVeto(lead) && !packageAtGlance(lead) {
		return nil
	}
	best := map[bool]float64{true: math.Inf(-1), false: math.Inf(-1)}
	label := map[bool]string{}
	miss := map[bool]float64{true: math.Inf(1), false: math.Inf(1)}
	for _, c := range res.Candidates {
		if c.Family.NonRegulator() {
			continue
		}
		s, any := 0.0, false
		for _, r := range c.Reasons {
			if strings.HasPrefix(r.Evidence, "pins.") || strings.HasPrefix(r.Evidence, "case.") ||
				r.Evidence == "package" || strings.HasPrefix(r.Evidence, "outline.") || r.Evidence == "marking" {
				s += r.Weight
				any = true
			}
		}
		// Among equal wiring scores, name the voltage the readings show.
		neg := c.Family.Negative()
		if d := outputMiss(sc.ev, c); any && (s > best[neg]+1e-9 || s > best[neg]-1e-9 && d < miss[neg]) {
			best[neg], label[neg], miss[neg] = s, c.name(), d
		}
	}
	readNeg := neg > 0
	if math.IsInf(best[!readNeg], -1) || best[!readNeg] < best[readNeg]+2 {
		return nil
	}
	sign, other := "negative", "positive"
	if !readNeg {
		sign, other = "positive", "negative"
	}
	return []string{fmt.Sprintf("every lead reads %s, but the wiring fits a %s regulator (%s) far better: "+
		"check the meter's common lead (black on board ground, red on the lead): swapped leads flip every sign", sign, other, label[!readNeg])}
}

// outputMiss is how far c's output magnitude is from the OUT-to-common
// reading's magnitude, volts (+Inf when either is unknown).
func outputMiss(ev *Evidence, c Candidate) float64 {
	tv := terminalVolts(c.Hypothesis, ev)
	out, ok := tv[catalog.PinOut]
	if !ok || c.VoutV == 0 {
		return math.Inf(1)
	}
	common := tv[catalog.PinGnd]
	if c.Family.Adjustable() {
		common = tv[catalog.PinAdj]
	}
	return math.Abs(math.Abs(out-common) - math.Abs(c.VoutV))
}

// packageAtGlance reports whether c's package reason contradicts the named
// package at a glance or in its lead count ([packageConfusion]).
func packageAtGlance(c Candidate) bool {
	w, ok := weightOf(c, "package")
	return ok && w <= math.Log(pGlance/pFlatPackage)+1e-9
}

func weightOf(c Candidate, key string) (float64, bool) {
	for _, r := range c.Reasons {
		if r.Evidence == key {
			return r.Weight, true
		}
	}
	return 0, false
}

// hasVeto reports whether a candidate carries a near-veto.
func hasVeto(c Candidate) bool {
	for _, r := range c.Reasons {
		if r.Evidence != "prior" && r.Weight <= math.Log(vetoRatio)+1e-9 {
			return true
		}
	}
	return false
}

// unitSlips names figures that read like a unit slipped: a load no part in
// the catalog carries (milliamperes written as amperes), a reservoir
// capacitor too small to filter anything (farads written as microfarads).
func (sc *scene) unitSlips() []string {
	var out []string
	ev := sc.ev
	if o := ev.Output; o != nil && o.Amps.Set {
		top := 0.0
		for _, f := range sc.c.Families {
			for i := range f.Packages {
				top = math.Max(top, f.Current(&f.Packages[i]))
			}
		}
		if top > 0 && o.Amps.V > 2*top {
			out = append(out, fmt.Sprintf("output.amps = %g A: no part in the catalog carries even half of that; if it is milliamperes, write \"%gm\"", o.Amps.V, o.Amps.V))
		}
	}
	for _, k := range ev.Leads() {
		if p, _ := ev.Lead(k); p.Volts.Set && math.Abs(p.Volts.V) > 1000 {
			out = append(out, fmt.Sprintf("pins.%d.volts = %g V: if that is millivolts, write \"%gm\"", k, p.Volts.V, p.Volts.V))
		}
	}
	if in := ev.Input; in != nil && in.FilterUF.Set && in.FilterUF.V < 1 {
		if _, ok := in.Rectifier.Topology(); ok {
			out = append(out, fmt.Sprintf("input.filter_uf = %g µF is far too small for a reservoir capacitor; the key is in microfarads (write 2200 for 2200 µF)", in.FilterUF.V))
		}
	}
	return out
}

// caseVolts returns the case's reading, or that of the lead it is tied to.
func caseVolts(ev *Evidence) (float64, bool) {
	cs := ev.Case
	if cs == nil {
		return 0, false
	}
	if cs.Volts.Set {
		return cs.Volts.V, true
	}
	if cs.TiedToPin != nil && *cs.TiedToPin > 0 {
		if p, ok := ev.Lead(*cs.TiedToPin); ok && p.Volts.Set {
			return p.Volts.V, true
		}
	}
	return 0, false
}
