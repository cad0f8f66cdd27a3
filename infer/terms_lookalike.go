package infer

import (
	"math"

	"github.com/whichreg/whichreg/catalog"
)

// Terms that recognise parts that sit where a regulator might but are not
// one (catalog kind "non-regulator"): a transistor's control drop and its
// main leads' order, a shunt reference's reference and cathode. They read
// the family's device word, lead functions and figures, never its id.

// pFlatControl is the chance that two leads of an unknown part differ by a
// transistor's control drop (0.6–2 V, 2–6 V for a MOSFET's gate): about one
// in ten (judgement: common practice, no source).
const pFlatControl = 0.1

// controlLeads returns the control and the output-side main lead of a
// transistor (base and emitter, gate and source) and the sign that makes a
// conducting control drop positive (+1 N-type, −1 P-type).
func controlLeads(d catalog.Device) (ctl, em, main string, s float64) {
	s = 1
	if d.Polarity() == "negative" {
		s = -1
	}
	if d.MOS() {
		return catalog.PinG, catalog.PinS, catalog.PinD, s
	}
	return catalog.PinB, catalog.PinE, catalog.PinC, s
}

// termControlDrop weighs the drop from a transistor's control lead to its
// emitter or source against the datasheet range (control_drop_v): an
// emitter follower's base sits 0.6–0.7 V above its emitter (1.2–1.4 V for a
// Darlington), a source follower's gate some volts above its source.
func termControlDrop(_ *scene, h Hypothesis, v voltsView, r *reasons) {
	f := h.Family
	if !f.Device.Transistor() || len(f.ControlDropV) != 2 {
		return
	}
	ctl, em, _, s := controlLeads(f.Device)
	vc, ok1 := v.tv[ctl]
	ve, ok2 := v.tv[em]
	if !ok1 || !ok2 {
		return
	}
	d := s * (vc - ve)
	lo, hi := f.ControlDropV[0], f.ControlDropV[1]
	slack := 2 * (meterAbsV + meterRel*math.Max(math.Abs(vc), math.Abs(ve)))
	if d >= lo-slack && d <= hi+slack {
		r.add("voltages.control", 0.9, pFlatControl, "%s − %s = %.2f V: a conducting %s's drop is %.2f–%.2f V", ctl, em, s*(vc-ve), f.Device, lo, hi)
		return
	}
	// Well below the range the part is off, and an off part passes no
	// current to the load; well above it a bipolar junction would be
	// destroyed (a MOSFET's gate may sit far above its source as a switch).
	if d < lo-slack-0.3 || (f.Device.Bipolar() && d > hi+slack+1) {
		r.veto("voltages.control", "%s − %s = %.2f V: a conducting %s's drop is %.2f–%.2f V", ctl, em, s*(vc-ve), f.Device, lo, hi)
		return
	}
	off := math.Min(math.Abs(d-lo), math.Abs(d-hi)) - slack
	r.add("voltages.control", 0.9*math.Exp(-0.5*sq(off/0.1))+0.005, pFlatControl, "%s − %s = %.2f V, outside a conducting %s's %.2f–%.2f V", ctl, em, s*(vc-ve), f.Device, lo, hi)
}

// termConduction weighs the order of a transistor's main leads: a
// conducting NPN's collector (an N-channel drain) sits above its emitter
// (source), a PNP's below. The other way round is a near-veto.
func termConduction(_ *scene, h Hypothesis, v voltsView, r *reasons) {
	f := h.Family
	if !f.Device.Transistor() {
		return
	}
	_, em, main, s := controlLeads(f.Device)
	vm, ok1 := v.tv[main]
	ve, ok2 := v.tv[em]
	if !ok1 || !ok2 {
		return
	}
	d := s * (vm - ve)
	switch {
	case d < -0.3:
		r.veto("voltages.conduction", "%s − %s = %+.2f V: a conducting %s's %s must sit %s its %s", main, em, vm-ve, f.Device, main, map[bool]string{true: "above", false: "below"}[s > 0], em)
	case d > 0.2:
		supply := main // an N-type part's collector (drain) is on the supply side, a P-type's emitter (source)
		if s < 0 {
			supply = em
		}
		r.add("voltages.conduction", 0.9, 0.5, "%s − %s = %+.2f V: the %s's %s is on the supply side, as it is when it conducts", main, em, vm-ve, f.Device, supply)
	default:
		r.add("voltages.conduction", 0.4, 0.5, "%s − %s = %+.2f V: a saturated %s", main, em, vm-ve, f.Device)
	}
}

// termShunt weighs a shunt reference: REF − A against its reference, and
// no lead above the cathode (it is fed through a resistor and holds the
// rail; nothing of it sits at the unregulated input).
func termShunt(_ *scene, h Hypothesis, v voltsView, r *reasons) {
	f := h.Family
	if f.Device != catalog.DeviceShuntRef {
		return
	}
	vref, okR := v.tv[catalog.PinRef]
	va, okA := v.tv[catalog.PinA]
	vk, okK := v.tv[catalog.PinK]
	if okR && okA {
		d := vref - va
		allowed := f.Tolerance*f.VrefV + 2*(meterAbsV+meterRel*math.Abs(d))
		r.add("voltages.regulation", window(math.Abs(d-f.VrefV)/allowed), 0.05, "REF − A = %+.3f V; the reference is %+.3f V ±%.3f", d, f.VrefV, allowed)
	}
	if okK {
		for _, o := range []struct {
			fn string
			v  float64
			ok bool
		}{{catalog.PinRef, vref, okR}, {catalog.PinA, va, okA}} {
			if o.ok && o.v > vk+0.3 {
				r.veto("voltages.shunt", "%s reads %+.2f V, above the cathode's %+.2f V: no lead of a shunt reference sits above its cathode", o.fn, o.v, vk)
			}
		}
	}
}
