package infer

import (
	"fmt"
	"math"
)

// deadPart: a part whose output reads nothing, or the input itself, is
// most often a failed one (an open part, a shorted load, a pass transistor
// failed short), and a failed part's voltages cannot name it. The ranking
// still answers (a 15 V low-dropout part in dropout also reads its input
// on its output), but the technician is told not to take the output
// reading as the part's voltage. Leads are taken from the evidence's own
// wiring (unregulated and load), so the note holds for every candidate.
// The thresholds are common practice, no source: a running regulator's
// rail is more than 0.3 V from ground, and very few designs run a part
// within 0.2 V of its input.
func deadPart(ev *Evidence) []string {
	in, out := 0, 0
	var vin, vout float64
	for _, k := range ev.Leads() {
		p, _ := ev.Lead(k)
		if !p.Volts.Set {
			continue
		}
		switch p.WiredTo {
		case WiredUnregulated:
			in, vin = k, p.Volts.V
		case WiredLoad:
			out, vout = k, p.Volts.V
		}
	}
	if in == 0 || out == 0 || math.Abs(vin) < 3 {
		return nil
	}
	const check = "compare with the rail's design voltage (the loads' ratings, a sister board, the schematic) before trusting the output reading"
	switch {
	case math.Abs(vout) < 0.3:
		return []string{fmt.Sprintf("lead %d (the load) reads %.2f V with %.2f V on lead %d (the input): the part is dead (open) or its load is shorted, and its voltages cannot name it; with the power off, measure the load's resistance to ground, and %s", out, vout, vin, in, check)}
	case vin*vout > 0 && math.Abs(vin-vout) < 0.2:
		return []string{fmt.Sprintf("lead %d (the load) reads %.2f V, within %.2f V of lead %d (the input): a low-dropout part in dropout, or a part whose pass transistor failed short and passes its input through; %s", out, vout, math.Abs(vin-vout), in, check)}
	}
	return nil
}
