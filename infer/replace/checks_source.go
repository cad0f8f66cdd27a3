package replace

import (
	"fmt"
	"math"
)

// checkSourceCurrent is the vout check of a regulator wired as a current
// source: the part holds its own voltage (a fixed part's output, an
// adjustable part's reference) across the old resistor from OUT to its
// common lead, and its common-lead current flows into the load too
// (I = V/R + IQ: the "current regulator" application of the onsemi MC7800
// and TI LM317 data sheets). A divider would turn the source into a voltage
// regulator, so a different set voltage needs a new resistor, never one.
// Within 3 % of the old current passes, within 10 % warns (the load sees
// the difference in common-lead current), beyond that the resistor is
// changed (common practice, no source).
func checkSourceCurrent(in Input, c cand) Check {
	f, want, r := c.Family, in.SourceA, in.Ev.Network.RTopOhms.V
	ch := Check{Name: CheckVout, Unit: "A", Limit: num(want), LimitText: fmt.Sprintf("%.3g A set by %s", want, ohms(r))}
	if f.Switching() {
		ch.ValueText, ch.Margin, ch.Status = "switching", -1, Fail
		ch.Text = "a switching module cannot hold its voltage across a current-setting resistor with its common lead on the load"
		return ch
	}
	vset := c.VoutV
	if f.Adjustable() {
		vset = f.VrefV
	}
	got := vset/r + f.GroundCurrentA(vset/r)
	d := math.Abs(got-want) / want
	ch.Value, ch.ValueText = num(got), fmt.Sprintf("%.3g A through %s", got, ohms(r))
	ch.Margin = 1 - d/0.1
	ch.Text = fmt.Sprintf("a current source: this part's %.3g V across the old %s from OUT to its common lead, plus its %.3g mA common-lead current, gives %.3g A against the %.3g A the original sets", vset, ohms(r), f.GroundCurrentA(vset/r)*1e3, got, want)
	switch {
	case d <= 0.03:
		ch.Status = Pass
	case d <= 0.1:
		ch.Status = Warn
	default:
		ch.Status = Work
		iq := in.Orig.Family.GroundCurrentA(want)
		if nr := vset / math.Max(want-iq, 1e-6); nr > 0 {
			ch.Action = fmt.Sprintf("resistor: change the %s from OUT to the common lead to about %s (%.3g V / %.3g A), no divider: the common lead stays on the load", ohms(r), ohms(nr), vset, want-iq)
		}
	}
	return ch
}
