package infer

import (
	"fmt"
	"math"
)

// conflicts lists evidence that contradicts itself, and evidence that every
// leading candidate contradicts.
func conflicts(ev *Evidence, res *Result) []string {
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
	// Voltages that fit no pinout at all.
	headroom, reversed := 0, 0
	for _, c := range res.Candidates {
		for _, r := range c.Reasons {
			if r.Evidence == "voltages.headroom" {
				headroom++
				if r.Weight < math.Log(0.01) {
					reversed++
				}
			}
		}
	}
	if headroom > 0 && reversed == headroom {
		out = append(out, "for every pinout in the catalog the output lies beyond the input: check which lead is which and the meter's polarity")
	}
	// Evidence every leader contradicts.
	lead := res.Candidates
	if len(lead) > 5 {
		lead = lead[:5]
	}
	if len(lead) > 0 {
		for _, r := range lead[0].Reasons {
			if r.Weight > -2 || r.Evidence == "prior" || r.Evidence == "year" || r.Evidence == "voltages.headroom" && reversed == headroom {
				continue
			}
			all := true
			for _, c := range lead[1:] {
				if w, ok := weightOf(c, r.Evidence); !ok || w > -2 {
					all = false
					break
				}
			}
			if all {
				out = append(out, fmt.Sprintf("%s: none of the leading candidates explains it (leader: %s)", r.Evidence, r.Text))
			}
		}
	}
	return out
}

func weightOf(c Candidate, key string) (float64, bool) {
	for _, r := range c.Reasons {
		if r.Evidence == key {
			return r.Weight, true
		}
	}
	return 0, false
}
