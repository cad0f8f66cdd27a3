package replace

import (
	"fmt"
	"math"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
)

// checkFn is one check: it reads the prepared input and the candidate and
// returns its row, or false when it does not apply. It gets copies of both,
// so no check can change what another reads.
type checkFn func(in Input, c cand) (Check, bool)

// checks is the table of checks, in the order they run.
var checks = []struct {
	name CheckName
	fn   checkFn
}{
	{CheckOutline, checkOutline},
	{CheckPolarity, checkPolarity},
	{CheckPinout, checkPinout},
	{CheckTab, checkTab},
	{CheckVout, checkVout},
	{CheckCurrent, checkCurrent},
	{CheckVinMax, checkVinMax},
	{CheckDropout, checkDropout},
	{CheckThermal, checkThermal},
	{CheckCout, checkCout},
	{CheckMinLoad, checkMinLoad},
	{CheckModule, checkModule},
}

// status grades a margin: fail below 0, warn below warnBelow, else pass.
func status(margin, warnBelow float64) Status {
	switch {
	case margin < 0:
		return Fail
	case margin < warnBelow-1e-9:
		return Warn
	}
	return Pass
}

func checkOutline(in Input, c cand) (Check, bool) {
	o, oo := c.Outline, in.Orig.Outline
	ch := Check{Name: CheckOutline, ValueText: name(o), LimitText: name(oo)}
	nNew, nOld := len(c.Package.Terminals(o)), len(in.Orig.Package.Terminals(oo))
	switch {
	case o != nil && o == oo:
		ch.Margin, ch.Status, ch.Text = 1, Pass, "same outline: it fits the old footprint and mounting"
	case c.sameHoles && !o.Tab && !o.MetalCan && !o.Isolated:
		ch.Margin, ch.Status = 0.5, Pass
		ch.Text = fmt.Sprintf("a %s fits the %d holes at %g mm of the %s; nothing needs bolting down", o.Name, o.Leads, o.PitchMM, oo.Name)
	case c.sameHoles:
		ch.Margin, ch.Status = 0.2, Warn
		ch.Text = fmt.Sprintf("%s fits the holes of the %s but the body and mounting differ", o.Name, oo.Name)
	case o != nil && oo != nil && nNew != nOld:
		ch.ValueText, ch.LimitText = fmt.Sprintf("%s, %d terminals", o.Name, nNew), fmt.Sprintf("%s, %d terminals", oo.Name, nOld)
		ch.Margin, ch.Status = -1, Fail
		ch.Text = fmt.Sprintf("a %d-terminal %s has no place on a %d-terminal footprint without a new board", nNew, o.Name, nOld)
	default:
		ch.Margin, ch.Status = 0, Work
		ch.Text = fmt.Sprintf("needs rework: a %s in place of a %s (adapter board or flying leads, and a new mounting)", name(o), name(oo))
		ch.Action = fmt.Sprintf("mounting: fit the %s on an adapter board or with short flying leads to the old pads", name(o))
		if oo != nil && oo.CaseTerminal && o != nil && !o.CaseTerminal && !o.SMD {
			ch.Action = fmt.Sprintf("mounting: bolt the %s to the old heat sink with thermal compound; run short leads to the can's old connections", o.Name)
		}
	}
	return ch, true
}

func checkPolarity(in Input, c cand) (Check, bool) {
	f, of := c.Family, in.Orig.Family
	ch := Check{Name: CheckPolarity, ValueText: string(f.Polarity), LimitText: string(of.Polarity)}
	if f.Polarity != of.Polarity {
		ch.Margin, ch.Status, ch.Text = -1, Fail, fmt.Sprintf("a %s regulator cannot replace a %s one", f.Polarity, of.Polarity)
	} else {
		ch.Margin, ch.Status, ch.Text = 1, Pass, "same polarity"
	}
	return ch, true
}

// common maps ADJ to GND: the common lead, either way.
func common(fn string) string {
	if fn == catalog.PinAdj {
		return catalog.PinGnd
	}
	return fn
}

func checkPinout(in Input, c cand) (Check, bool) {
	oldT, newT := in.Orig.Package.Terminals(in.Orig.Outline), c.Package.Terminals(c.Outline)
	ch := Check{Name: CheckPinout, ValueText: strings.Join(newT, "-"), LimitText: strings.Join(oldT, "-")}
	if !c.sameHoles {
		ch.Margin, ch.Status = 0, Work
		ch.Text = "wire by function: " + leadMapText(LeadMap(in.Orig.Hypothesis, c.Hypothesis))
		ch.Action = "lead mapping: " + leadMapText(LeadMap(in.Orig.Hypothesis, c.Hypothesis))
		return ch, true
	}
	var diffs []string
	for i := 0; i < len(oldT) && i < len(newT); i++ {
		if common(oldT[i]) != common(newT[i]) {
			diffs = append(diffs, fmt.Sprintf("lead %d is %s, was %s", i+1, newT[i], oldT[i]))
		}
	}
	if len(diffs) == 0 {
		ch.Margin, ch.Status, ch.Text = 1, Pass, "every lead has the old lead's function"
	} else {
		ch.Margin, ch.Status, ch.Text = -1, Fail, "not a drop-in: "+strings.Join(diffs, "; ")+" (crossing leads in the old holes is not a sound repair)"
	}
	return ch, true
}

// Link joins one terminal of the new part to the old part's pad.
type Link struct {
	New int    `json:"new"`      // the candidate's terminal, 1-based (the can is the last terminal)
	Old int    `json:"old"`      // the old part's terminal it goes to; 0 = no counterpart
	Fn  string `json:"function"` // the function
}

// LeadMap returns, for each terminal of the candidate, the old terminal
// with the same function (the common lead matching GND or ADJ).
func LeadMap(orig, cand infer.Hypothesis) []Link {
	oldT, newT := orig.Package.Terminals(orig.Outline), cand.Package.Terminals(cand.Outline)
	var ls []Link
	for i, fn := range newT {
		l := Link{New: i + 1, Fn: fn}
		for k, ofn := range oldT {
			if common(ofn) == common(fn) {
				l.Old = k + 1
				break
			}
		}
		ls = append(ls, l)
	}
	return ls
}

func leadMapText(ls []Link) string {
	var parts []string
	for _, l := range ls {
		if l.Old > 0 {
			parts = append(parts, fmt.Sprintf("new lead %d (%s) to the old lead %d's pad", l.New, l.Fn, l.Old))
		} else {
			parts = append(parts, fmt.Sprintf("new lead %d (%s) has no old counterpart", l.New, l.Fn))
		}
	}
	return strings.Join(parts, ", ")
}

func checkTab(in Input, c cand) (Check, bool) {
	o, cd := c.Outline, &in.Cond
	if o == nil || !(o.Tab || o.MetalCan) {
		return Check{}, false
	}
	what := "tab"
	if o.MetalCan {
		what = "can"
	}
	ch := Check{Name: CheckTab, Unit: "V", LimitText: mountingText(&in)}
	switch {
	case c.tabV == nil && o.SMD:
		ch.ValueText, ch.Margin, ch.Status = "soldered pad", 1, Pass
		ch.Text = fmt.Sprintf("the %s's pad is soldered to the board's copper, not to the old heat sink", o.Name)
		return ch, true
	case c.tabV == nil:
		ch.ValueText, ch.Margin, ch.Status = "insulated", 1, Pass
		ch.Text = fmt.Sprintf("the %s is insulated from every lead", what)
		return ch, true
	}
	v := *c.tabV
	ch.Value = num(v)
	ch.ValueText = fmt.Sprintf("%s at %+.2f V (%s)", what, v, c.Package.Tab)
	sink, sinkText := 0.0, "0 V (chassis)"
	if !cd.Grounded && cd.OldTabV != nil {
		sink, sinkText = *cd.OldTabV, fmt.Sprintf("%+.2f V (the old part's %s)", *cd.OldTabV, what)
	}
	if hasHeatsink(&in) {
		ch.Limit = num(sink)
	}
	live := math.Abs(v-sink) >= liveV && (cd.Grounded || !sameNode(&in, c.Hypothesis))
	switch {
	case !hasHeatsink(&in):
		ch.Margin, ch.Status = 0.5, Pass
		ch.Text = fmt.Sprintf("the %s sits at %+.2f V in free air: keep it clear of other parts and fingers", what, v)
	case !live:
		ch.Margin, ch.Status = 1, Pass
		ch.Text = fmt.Sprintf("the %s sits at %+.2f V, on the same net as the heat sink's %s: nothing to insulate", what, v, sinkText)
	case c.kit:
		ch.Margin, ch.Status = 0, Work
		ch.Text = fmt.Sprintf("the %s sits at %+.2f V and the heat sink at %s: fitted bare it would short the two; it needs an insulating washer and bushing", what, v, sinkText)
		ch.Action = fmt.Sprintf("insulating kit: greased mica (or silicone) washer and a shoulder bushing for the screw; afterwards check with an ohmmeter that the %s does not reach the heat sink", what)
	default:
		ch.Margin, ch.Status = 0.5, Pass
		ch.Text = fmt.Sprintf("the %s sits at %+.2f V against the heat sink's %s, insulated by the board's %s washer", what, v, sinkText, cd.Insulator)
		ch.Action = fmt.Sprintf("insulator: renew the %s washer and bushing if damaged; check with an ohmmeter that the %s does not reach the heat sink", cd.Insulator, what)
	}
	return ch, true
}

// mountingText describes what the tab is bolted to.
func mountingText(in *Input) string {
	cd := &in.Cond
	switch {
	case !hasHeatsink(in):
		return "no heat sink"
	case cd.Grounded:
		return "heat sink bonded to chassis, insulator " + cd.Insulator
	}
	return "floating heat sink, insulator " + cd.Insulator
}

func name(o *catalog.Outline) string {
	if o == nil {
		return "?"
	}
	return o.Name
}
