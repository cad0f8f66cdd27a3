package infer

import (
	"fmt"
	"math"
	"strings"

	"github.com/whichreg/whichreg/catalog"
)

// pFlatWired is the chance of a wiring word for a lead of an unknown part:
// six words, equally likely.
const pFlatWired = 1.0 / 6

// wiringRow is P(wiring word | what the lead does), in the order of the
// wiring words ([Wirings]). Each row sums to 1 (judgement: common practice,
// no source).
type wiringRow [6]float64

// The rows: (unregulated, load, ground, network, open, inductor).
func row(u, l, g, n, o, i float64) wiringRow { return wiringRow{u, l, g, n, o, i} }

// p returns the probability of word w (0 for a word not in the list).
func (wr wiringRow) p(w Wiring) float64 {
	for i, x := range wirings.words {
		if x == w {
			return wr[i]
		}
	}
	return 0
}

// wiringOf returns the row of a lead of function fn in family f (what each
// lead is wired to on a board: common practice, no source). A
// transistor's leads take the row of what they do in a series pass circuit:
// the collector (drain) of an N-type part and the emitter (source) of a
// P-type part come from the unregulated rail, the other main lead feeds the
// load, the base (gate) sits on a network.
func wiringOf(f *catalog.Family, fn string) wiringRow {
	supply := row(0.85, 0.03, 0.03, 0.06, 0.02, 0.01)
	output := row(0.02, 0.80, 0.08, 0.08, 0.01, 0.01)
	control := row(0.05, 0.03, 0.04, 0.85, 0.02, 0.01)
	ground := row(0.015, 0.02, 0.795, 0.15, 0.01, 0.01)
	if d := f.Device; d.Transistor() {
		pType := d.Polarity() == "negative"
		switch fn {
		case catalog.PinC, catalog.PinD:
			if pType {
				return output
			}
			return supply
		case catalog.PinE, catalog.PinS:
			if pType {
				return supply
			}
			return output
		case catalog.PinB, catalog.PinG:
			return control
		}
	}
	switch fn {
	case catalog.PinIn:
		return row(0.89, 0.02, 0.03, 0.02, 0.03, 0.01)
	case catalog.PinOut:
		return row(0.02, 0.85, 0.01, 0.10, 0.01, 0.01)
	case catalog.PinGnd, catalog.PinA:
		return ground
	case catalog.PinAdj, catalog.PinRef, catalog.PinB, catalog.PinG:
		return row(0.015, 0.02, 0.10, 0.85, 0.005, 0.01)
	case catalog.PinNC:
		return row(0.05, 0.10, 0.10, 0.05, 0.69, 0.01)
	case catalog.PinSense: // remote sense: to the load, at its far end
		return row(0.02, 0.85, 0.01, 0.10, 0.01, 0.01)
	case catalog.PinEn: // on when high: tied to the input, or driven through a resistor
		return row(0.55, 0.05, 0.05, 0.30, 0.04, 0.01)
	case catalog.PinInh: // off when high: tied to ground, or driven through a resistor
		return row(0.05, 0.03, 0.65, 0.22, 0.04, 0.01)
	case catalog.PinPG: // an open-drain flag on its pull-up resistor
		return row(0.03, 0.10, 0.02, 0.80, 0.04, 0.01)
	case catalog.PinBYP: // a small capacitor to ground: traced as a network, or reads open on an ohmmeter
		return row(0.01, 0.02, 0.05, 0.55, 0.36, 0.01)
	case catalog.PinK: // a shunt reference's cathode is the rail it holds, fed through a resistor
		return row(0.03, 0.55, 0.02, 0.38, 0.01, 0.01)
	case catalog.PinFB: // tied to the output after the coil, or to a divider
		return row(0.01, 0.55, 0.02, 0.40, 0.01, 0.01)
	case catalog.PinSW: // the switch node drives the coil (continuity through it reads as the load)
		return row(0.02, 0.15, 0.01, 0.02, 0.01, 0.79)
	}
	return row(0.2, 0.2, 0.2, 0.2, 0.15, 0.05)
}

// termPackage weighs a named package against the variant's outline. A name
// whose lead count contradicts the leads counted is left out: the measured
// outline decides, and the cross-checks say the name looks wrong.
func termPackage(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	ev, o := sc.ev, h.Outline
	if ev.Package == "" || o == nil || sc.packageContradicted() {
		return
	}
	if namesOutline(ev.Package, o) {
		r.add("package", pNamedRight, pFlatPackage, "package %s named; this variant is %s", ev.Package, o.Name)
		return
	}
	p, why := packageConfusion(ev.Package, sc.c.Outline(ev.Package), o)
	if p <= pGlance {
		// Nobody writes TO-220 for a TO-92 or TO-39 for a TO-3: a variant
		// the technician could not have mistaken for the named package
		// must not lead on the strength of its readings (common practice,
		// no source). A near-veto sends the mass to the named outline's
		// families, the look-alikes or "not in the catalog".
		if !r.text {
			r.veto("package", "") // nothing to box for a text
			return
		}
		r.veto("package", "package %s named, and a %s cannot be mistaken for it (%s)", ev.Package, o.Name, why)
		return
	}
	r.add("package", p, pFlatPackage, "package %s named, but this variant is %s: %s", ev.Package, o.Name, why)
}

// The chances of a package name in the notes, given the part's outline
// (judgement: common practice, no source). The name is right nearly
// always; a slip between names a character apart (SOT-23 for SOT-223,
// DPAK for D2PAK, TO-220 for TO-220FP) happens a few times in a hundred;
// another outline of the same kind (TO-126 for TO-220) about once; an
// outline that differs at a glance (surface-mount against through-hole, a
// metal can against plastic, a tiny SOT-23 or TO-92 against a power
// package) or in its lead count hardly ever.
const (
	pNamedRight   = 0.95
	pNameSlip     = 0.03
	pSameKind     = 0.01
	pGlance       = 0.003
	pOtherLeads   = 0.001
	pFlatPackage  = 1.0 / 12 // about a dozen outlines a regulator comes in
	tinyPitchMaxM = 2.0      // mm: a tiny outline's pitch is under this (SOT-23 0.95, TO-92 1.27)
)

// packageConfusion is the chance that a part of outline o is written down
// as name (named is its catalog outline, nil when the catalog lacks it),
// and why.
func packageConfusion(name string, named, o *catalog.Outline) (float64, string) {
	switch {
	case named != nil && named.Leads != o.Leads:
		return pOtherLeads, fmt.Sprintf("%d leads against %d", named.Leads, o.Leads)
	case nameSlip(name, o):
		return pNameSlip, "names a character apart, an easy slip"
	case named == nil:
		return pSameKind, "an outline the catalog does not know"
	}
	if d := glanceDifference(named, o); d != "" {
		return pGlance, d
	}
	return pSameKind, "another outline of the same kind"
}

// nameSlip reports whether name is a character away from o's name or an
// alias, or the same name with a letter suffix (TO-220FP for TO-220),
// spaces and hyphens ignored: a slip of the pen, not of the eye.
func nameSlip(name string, o *catalog.Outline) bool {
	n := normName(name)
	for _, x := range append([]string{o.Name}, o.Aliases...) {
		x = normName(x)
		if editDistanceAtMostOne(n, x) || letterSuffix(n, x) || letterSuffix(x, n) {
			return true
		}
	}
	return false
}

// letterSuffix reports whether long is short followed by letters only.
func letterSuffix(long, short string) bool {
	if len(long) <= len(short) || !strings.HasPrefix(long, short) {
		return false
	}
	return strings.Trim(long[len(short):], "ABCDEFGHIJKLMNOPQRSTUVWXYZ") == ""
}

// normName is an outline name with hyphens and spaces dropped, upper case
// ("to-220 fp" → "TO220FP").
func normName(s string) string {
	return strings.ToUpper(strings.Map(func(r rune) rune {
		if r == '-' || r == ' ' {
			return -1
		}
		return r
	}, s))
}

// editDistanceAtMostOne reports whether a and b differ by at most one
// inserted, deleted or replaced character.
func editDistanceAtMostOne(a, b string) bool {
	if len(a) > len(b) {
		a, b = b, a
	}
	if len(b)-len(a) > 1 {
		return false
	}
	i := 0
	for i < len(a) && a[i] == b[i] {
		i++
	}
	if len(a) == len(b) {
		return a[i+min(1, len(a)-i):] == b[i+min(1, len(b)-i):]
	}
	return a[i:] == b[i+1:]
}

// glanceDifference says how two outlines with the same lead count differ
// at a glance ("" when they do not): surface-mount against through-hole, a
// metal can against plastic, a tiny body against a power package.
func glanceDifference(a, b *catalog.Outline) string {
	kind := func(o *catalog.Outline) string {
		switch {
		case o.MetalCan:
			return "a metal can"
		case o.SMD:
			return "surface-mount"
		}
		return "through-hole"
	}
	if ka, kb := kind(a), kind(b); ka != kb {
		return ka + " against " + kb
	}
	tiny := func(o *catalog.Outline) bool {
		return !o.Tab && !o.MetalCan && o.PitchMM > 0 && o.PitchMM < tinyPitchMaxM
	}
	power := func(o *catalog.Outline) bool {
		return o.MetalCan || (o.PitchMM >= tinyPitchMaxM && (o.Tab || o.Isolated || o.MountingHole))
	}
	switch {
	case tiny(a) && power(b), power(a) && tiny(b):
		return "a tiny body against a power package"
	}
	return ""
}

// packageContradicted reports whether the named package's lead count
// differs from the leads counted.
func (sc *scene) packageContradicted() bool {
	ev := sc.ev
	if ev.Package == "" || ev.Outline == nil || ev.Outline.Leads == nil {
		return false
	}
	o := sc.c.Outline(ev.Package)
	return o != nil && o.Leads != *ev.Outline.Leads
}

// termOutline weighs the outline measured with calipers: the lead count,
// the pitch and the hole spacing (Gaussian about the outline's figure), a
// metal can.
func termOutline(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	m, o := sc.ev.Outline, h.Outline
	if m == nil || o == nil {
		return
	}
	if m.Leads != nil {
		if *m.Leads == o.Leads {
			r.add("outline.leads", 0.97, 0.25, "%d leads, as %s has", *m.Leads, o.Name)
		} else {
			r.add("outline.leads", 0.005, 0.25, "%d leads measured, %s has %d", *m.Leads, o.Name, o.Leads)
		}
	}
	if m.PitchMM.Set {
		sigma := 0.1 + 0.04*o.PitchMM
		pdf := math.Exp(-0.5*sq((m.PitchMM.V-o.PitchMM)/sigma)) / (sigma * math.Sqrt(2*math.Pi))
		r.add("outline.pitch_mm", 0.95*pdf+0.05/20, 1.0/20, "pitch %.2f mm measured, %s is %.2f mm", m.PitchMM.V, o.Name, o.PitchMM)
	}
	if m.HoleSpacingMM.Set {
		if o.HoleSpacingMM > 0 {
			sigma := 0.6
			pdf := math.Exp(-0.5*sq((m.HoleSpacingMM.V-o.HoleSpacingMM)/sigma)) / (sigma * math.Sqrt(2*math.Pi))
			r.add("outline.hole_spacing_mm", 0.95*pdf+0.05/50, 1.0/50, "holes %.1f mm apart, %s %.2f mm", m.HoleSpacingMM.V, o.Name, o.HoleSpacingMM)
		} else {
			r.add("outline.hole_spacing_mm", 0.01, 1.0/50, "two mounting holes measured; %s has none or one", o.Name)
		}
	}
	if m.MetalCan != nil {
		is := map[bool]string{true: "a metal can", false: "no metal can"}
		if *m.MetalCan == o.MetalCan {
			r.add("outline.metal_can", 0.97, 0.5, "%s, as on %s", is[*m.MetalCan], o.Name)
		} else {
			r.add("outline.metal_can", 0.01, 0.5, "%s seen, but %s has %s", is[*m.MetalCan], o.Name, is[o.MetalCan])
		}
	}
}

// termWiring weighs each lead's continuity against the function the
// pinout gives it.
func termWiring(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	pk, f := h.Package, h.Family
	for i, n := range sc.leads {
		p, _ := sc.ev.Lead(n)
		if p.WiredTo == "" {
			continue
		}
		key := sc.pinKeys[i]
		if n > len(pk.Pins) {
			r.add(key, 0.01, pFlatWired, "lead %d measured, but %s has only %d leads", n, pk.Outline, len(pk.Pins))
			continue
		}
		fn := pk.Pins[n-1]
		q := wiringOf(f, fn).p(p.WiredTo)
		if !r.text {
			r.add(key, q, pFlatWired, "") // no text: nothing to box for it
			continue
		}
		r.add(key, q, pFlatWired, "lead %d to %s: this pinout puts %s there", n, p.WiredTo, fn)
	}
}

// termCase weighs the tab's or can's continuity and wiring.
func termCase(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	cs, o, pk, f := sc.ev.Case, h.Outline, h.Package, h.Family
	if cs == nil || o == nil {
		return
	}
	if o.CaseTerminal {
		if cs.TiedToPin != nil && *cs.TiedToPin > 0 {
			r.add("case.tied_to_pin", 0.02, 1.0/3, "case tied to lead %d, but on %s the can is a terminal of its own (%s)", *cs.TiedToPin, o.Name, pk.Tab)
		} else if cs.TiedToPin != nil {
			r.add("case.tied_to_pin", 0.95, 1.0/3, "case tied to no lead: on %s the can is the %s terminal", o.Name, pk.Tab)
		}
		if cs.WiredTo != "" {
			r.add("case.wired_to", wiringOf(f, pk.Tab).p(cs.WiredTo), pFlatWired, "can to %s: this variant's can is %s", cs.WiredTo, pk.Tab)
		}
		return
	}
	live := pk.Tab != catalog.TabNone && pk.Tab != ""
	if cs.TiedToPin == nil {
		if cs.WiredTo != "" && live {
			r.add("case.wired_to", wiringOf(f, pk.Tab).p(cs.WiredTo), pFlatWired, "case to %s: this variant's tab is %s", cs.WiredTo, pk.Tab)
		}
		return
	}
	k := *cs.TiedToPin
	flat := 1.0 / float64(len(pk.Pins)+1)
	want := 0
	if live {
		want = pk.Lead(pk.Tab)
	}
	switch {
	case !o.Tab && !o.MetalCan && k > 0:
		r.add("case.tied_to_pin", 0.01, flat, "case tied to lead %d, but %s has no metal tab or can", k, o.Name)
	case k == want && want == 0:
		r.add("case.tied_to_pin", 0.9, flat, "case tied to no lead: %s has no live tab", pk.Outline)
	case k == want:
		r.add("case.tied_to_pin", 0.92, flat, "case tied to lead %d: this variant's tab is %s", k, pk.Tab)
	case want == 0:
		r.add("case.tied_to_pin", 0.04, flat, "case tied to lead %d, but %s has no tab tied to a lead", k, pk.Outline)
	case k == 0:
		r.add("case.tied_to_pin", 0.03, flat, "case tied to no lead, but this variant's tab is %s (lead %d)", pk.Tab, want)
	default:
		r.add("case.tied_to_pin", 0.02, flat, "case tied to lead %d, but this variant's tab is %s (lead %d)", k, pk.Tab, want)
	}
}

// termMounting weighs a bare mounting on a grounded heat sink: the tab or
// can is then at ground, so a variant whose tab carries a lead that reads
// well away from 0 V would short that lead (a lifted ground, an output, an
// input) and cannot be mounted so. Notes often forget an insulator, so it
// is strong evidence, not a veto (judgement: common practice, no source).
func termMounting(sc *scene, h Hypothesis, v voltsView, r *reasons) {
	m, o, pk := sc.ev.Mount, h.Outline, h.Package
	if m == nil || m.ChassisHeatsink == nil || !*m.ChassisHeatsink || o == nil || o.Isolated {
		return
	}
	if m.Insulator != "none" && m.Insulator != "grease" {
		return
	}
	if pk.Tab == catalog.TabNone || pk.Tab == "" || (!o.Tab && !o.MetalCan) {
		return
	}
	x, ok := v.tv[pk.Tab]
	if !ok {
		return
	}
	if math.Abs(x) > 0.3 {
		r.add("mount", 0.01, 0.5, "bare on a grounded heat sink, but this variant's tab is %s at %+.2f V: it would be shorted to ground", pk.Tab, x)
	} else {
		r.add("mount", 0.9, 0.5, "bare on a grounded heat sink: this variant's tab is %s, at ground", pk.Tab)
	}
}
