package infer

import "github.com/whichreg/whichreg/catalog"

// CurrentSourceA recognises a regulator wired as a current source: a
// resistor from OUT to the common lead (the network's r_top_ohms, with no
// bottom resistor) and the common lead (GND, or ADJ) wired to the load. The
// part then holds its own voltage across the resistor, so the load current
// is that voltage over the resistor plus the common lead's own current (the
// "current regulator" application of the onsemi MC7800 and TI LM317 data
// sheets: I = VO/R + IQ, I = 1.25 V/R + IADJ). It returns the current and
// true, or 0 and false when the evidence does not show the circuit.
func CurrentSourceA(h Hypothesis, ev *Evidence) (float64, bool) {
	f := h.Family
	nw := ev.Network
	if f == nil || f.NonRegulator() || f.Switching() || nw == nil || nw.RTopOhms.V <= 0 || nw.RBottomOhms.V != 0 ||
		nw.ZenerVolts.V != 0 || (nw.DiodeDrops != nil && *nw.DiodeDrops > 0) {
		return 0, false
	}
	common, vset := catalog.PinGnd, h.VoutV
	if f.Adjustable() {
		common, vset = catalog.PinAdj, f.VrefV
	}
	if vset <= 0 || !commonToLoad(h, ev, common) {
		return 0, false
	}
	i := vset / nw.RTopOhms.V
	return i + f.GroundCurrentA(i), true
}

// commonToLoad reports whether the lead (or the can) with function common
// is wired to the load.
func commonToLoad(h Hypothesis, ev *Evidence, common string) bool {
	for i, fn := range h.Package.Pins {
		if fn != common {
			continue
		}
		if p, ok := ev.Lead(i + 1); ok && p.WiredTo == WiredLoad {
			return true
		}
	}
	return ev.Case != nil && h.Package.Tab == common && h.Outline != nil && h.Outline.CaseTerminal && ev.Case.WiredTo == WiredLoad
}
