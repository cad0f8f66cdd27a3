package infer

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/whichreg/whichreg/catalog"
)

// poweredSafety is the caution shown before every powered measurement.
const poweredSafety = "Powered measurement: mains may be present inside the equipment and the regulator's tab or can may be live. " +
	"Clip the meter's black lead to board ground before switching on, probe with one hand, and keep clear of the mains wiring; " +
	"follow local codes and qualified practice."

// benchEffort is the effort of a bench test against a meter reading.
const benchEffort = 4

// noLead is the outcome of a lead measurement on a part with fewer leads.
const noLead = "no such lead"

// discharged is the start of every power-off prompt.
const discharged = "Power off, unplugged, and the filter capacitors discharged (measure across them first)."

// measurement is one measurement that could be made next: its description
// as the user sees it, what each hypothesis predicts, and how to put an
// outcome into words.
type measurement struct {
	Measurement
	predict  func(h Hypothesis) outcomeDist
	describe func(key string) string // an outcome key in words
	// effort is the relative work of a measurement that takes rework (a
	// bench supply or a test load in place of the circuit's own); the
	// suggestions are ordered by expected gain per effort, so such a test
	// comes after readings of similar gain (judgement: common practice, no
	// source). 0 = a reading.
	effort float64
}

// askScope is what the leaders say about the part's outline: how many
// leads it can have, whether it has a tab or can, and how its leads are
// numbered when that is settled.
type askScope struct {
	leads    int    // the most leads a considered leader has (capped by what is known)
	caseful  bool   // some considered leader has a tab, pad or can
	terminal bool   // some considered leader's can is a terminal of its own (TO-3, TO-66)
	view     string // "on a TO-220: …" when every considered leader shares one outline; "" otherwise
}

// scopeOf works out the [askScope] of the leaders, honouring a measured lead
// count and a named package: no measurement of lead 5 on a three-lead part,
// no tab on a TO-92.
func scopeOf(c *catalog.Catalog, ev *Evidence, hs []Candidate) askScope {
	known := 0
	if o := c.Outline(ev.Package); o != nil {
		known = o.Leads
	}
	if ev.Outline != nil && ev.Outline.Leads != nil {
		known = *ev.Outline.Leads // counted: it rules a name that disagrees
	}
	named := func(o *catalog.Outline) bool {
		return ev.Package == "" || (o != nil && (strings.EqualFold(o.Name, ev.Package) || outlineHasAlias(o, ev.Package)))
	}
	var s askScope
	outlines := map[string]*catalog.Outline{}
	consider := func(strict bool) {
		for _, cd := range hs {
			o := cd.Outline
			if cd.Probability <= 0.01 || o == nil || (known > 0 && o.Leads != known) || (strict && !named(o)) {
				continue
			}
			s.leads = max(s.leads, len(cd.Package.Pins))
			s.caseful = s.caseful || o.Tab || o.MetalCan || o.CaseTerminal
			s.terminal = s.terminal || o.CaseTerminal
			outlines[o.Name] = o
		}
	}
	consider(true)
	if len(outlines) == 0 { // the named package fits no leader: ask about every leader's
		consider(false)
	}
	if o := c.Outline(ev.Package); o != nil && (ev.Outline == nil || ev.Outline.Leads == nil) {
		s.caseful = o.Tab || o.MetalCan || o.CaseTerminal
		s.terminal = o.CaseTerminal
	}
	if known > 0 {
		s.leads = known
	}
	s.leads = min(s.leads, 8)
	if len(outlines) == 1 {
		for _, o := range outlines {
			s.view = fmt.Sprintf("Leads are numbered as on a %s: %s.", o.Name, o.View)
		}
	}
	return s
}

// asks lists the measurements still open, each with its evidence key.
func asks(c *catalog.Catalog, ev *Evidence, hs []Candidate) []measurement {
	sc := scopeOf(c, ev, hs)
	var ms []measurement
	for k := 1; k <= sc.leads; k++ {
		p, _ := ev.Lead(k)
		if p.WiredTo == "" {
			ms = append(ms, continuityAsk(k, sc))
		}
		if !p.Volts.Set {
			ms = append(ms, voltageAsk(ev, k, sc))
		}
	}
	if sc.caseful && (ev.Case == nil || ev.Case.TiedToPin == nil) {
		ms = append(ms, caseAsk(sc))
	}
	ms = append(ms, caseTerminalAsks(ev, sc)...)
	if ev.Output == nil || !ev.Output.Amps.Set {
		ms = append(ms, loadAsk())
	}
	if tr := troughAsk(ev); tr != nil {
		ms = append(ms, *tr)
	}
	if ev.Bench == nil || !ev.Bench.DropoutVolts.Set {
		ms = append(ms, dropoutAsk(ev))
	}
	if ev.Bench == nil || !ev.Bench.HoldsAmps.Set {
		if m, ok := holdsAsk(hs); ok {
			ms = append(ms, m)
		}
	}
	if ev.Package == "" && (ev.Outline == nil || ev.Outline.Leads == nil) {
		ms = append(ms, packageAsk(hs))
	}
	if !catalog.Legible(catalog.NormalizeMarking(ev.Marking)) {
		ms = append(ms, markingAsk())
	}
	return ms
}

// markingAsk offers a second look at the marking: each family prints its
// own designation, so a legible marking names the family (its voltage code
// the output).
func markingAsk() measurement {
	return measurement{
		Measurement: Measurement{
			Key: "marking", Kind: AskText,
			Measure: "any legible character of the marking (loupe, raking light)",
			Prompt: "Power off. Clean the face with isopropyl alcohol and look with a loupe under light from the side: " +
				"write what is legible, with ? for each unreadable character and * for an unreadable run (e.g. \"?M3?7*\").",
		},
		predict:  func(h Hypothesis) outcomeDist { return outcomeDist{"the markings of " + h.Family.ID: 1} },
		describe: func(key string) string { return key },
	}
}

func continuityAsk(k int, sc askScope) measurement {
	words := make([]string, len(wirings.words))
	for i, w := range wirings.words {
		words[i] = string(w)
	}
	return measurement{
		Measurement: Measurement{
			Key: fmt.Sprintf("pins.%d.wired_to", k), Kind: AskChoice, Choices: words,
			Measure: fmt.Sprintf("where lead %d goes on the board (ohmmeter, power off)", k),
			Prompt: join(discharged, sc.view, fmt.Sprintf("Follow lead %d with an ohmmeter and write where it goes: "+
				"'unregulated' (the + of the main filter capacitor, after the rectifier), 'load' (the regulated rail the part feeds), "+
				"'ground', 'network' (a resistor, trimmer, zener or diodes to ground or to the output), or 'open' (nothing).", k)),
		},
		predict: func(h Hypothesis) outcomeDist {
			if k > len(h.Package.Pins) {
				return outcomeDist{noLead: 1}
			}
			return wiringDist(h.Family, h.Package.Pins[k-1])
		},
		describe: func(key string) string {
			if key == noLead {
				return fmt.Sprintf("there is no lead %d", k)
			}
			return fmt.Sprintf("lead %d to %s", k, key)
		},
	}
}

func voltageAsk(ev *Evidence, k int, sc askScope) measurement {
	return measurement{
		Measurement: Measurement{
			Key: fmt.Sprintf("pins.%d.volts", k), Kind: AskNumber, Unit: "V", Powered: true,
			Measure: fmt.Sprintf("DC volts on lead %d to board ground (powered)", k),
			Prompt: join(sc.view, fmt.Sprintf("Power on, at normal load. Meter on DC volts: black lead on board ground "+
				"(the − side of the main filter capacitor), red lead on lead %d. Write the reading with its sign.", k)),
		},
		predict: func(h Hypothesis) outcomeDist {
			if k > len(h.Package.Pins) {
				return outcomeDist{noLead: 1}
			}
			p, _ := ev.Lead(k)
			return railDist(h, p.WiredTo, h.Package.Pins[k-1], terminalVolts(h, ev))
		},
		describe: func(key string) string {
			if key == noLead {
				return fmt.Sprintf("there is no lead %d", k)
			}
			return fmt.Sprintf("lead %d reads %s", k, key)
		},
	}
}

func caseAsk(sc askScope) measurement {
	choices := []string{"0"}
	for k := 1; k <= sc.leads; k++ {
		choices = append(choices, strconv.Itoa(k))
	}
	return measurement{
		Measurement: Measurement{
			Key: "case.tied_to_pin", Kind: AskChoice, Choices: choices,
			Measure: "which lead the tab or can is tied to (ohmmeter, power off)",
			Prompt: join(discharged, sc.view, "Ohmmeter from the metal tab (or the can) to each lead in turn: "+
				"write the number of the lead it reads near 0 Ω to, or 0 when it is tied to none."),
		},
		predict: func(h Hypothesis) outcomeDist {
			switch {
			case h.Outline != nil && h.Outline.CaseTerminal:
				return outcomeDist{"no lead (the can is a terminal of its own)": 1}
			case h.Package.Tab == catalog.TabNone || h.Package.Tab == "":
				return outcomeDist{"no lead": 1}
			}
			return outcomeDist{fmt.Sprintf("lead %d", h.Package.Lead(h.Package.Tab)): 1}
		},
		describe: func(key string) string { return "case to " + key },
	}
}

func loadAsk() measurement {
	return measurement{
		Measurement: Measurement{
			Key: "output.amps", Kind: AskNumber, Unit: "A", Powered: true,
			Measure: "load current (powered)",
			Prompt: "Power on, at normal load. Measure the current the part delivers: an ammeter in series with its output, " +
				"or the DC volts across a known series resistor divided by its ohms. Write amperes.",
		},
		// A part is usually run between a tenth of its rating and its rating
		// (common practice, no source): log-uniform over that range.
		predict: func(h Hypothesis) outcomeDist {
			r := h.Family.Current(h.Package)
			if r <= 0 {
				return outcomeDist{"unknown": 1}
			}
			return logUniformBuckets(0.1*r, r, currentBuckets)
		},
		describe: func(key string) string { return "load " + key },
	}
}

func packageAsk(hs []Candidate) measurement {
	var names []string
	seen := map[string]bool{}
	for _, c := range hs {
		if c.Outline != nil && !seen[c.Outline.Name] {
			seen[c.Outline.Name] = true
			names = append(names, c.Outline.Name)
		}
	}
	return measurement{
		Measurement: Measurement{
			Key: "package", Kind: AskChoice, Choices: names,
			Measure: "the package outline (look, count the leads)",
			Prompt:  "Look at the part: count its leads, note any metal tab or can, and name the outline ('whichreg catalog show ID' draws each one).",
		},
		predict: func(h Hypothesis) outcomeDist {
			if h.Outline == nil {
				return outcomeDist{"unknown": 1}
			}
			return outcomeDist{h.Outline.Name: 1}
		},
		describe: func(key string) string { return "a " + key },
	}
}

// dropoutAsk offers the bench test that separates low-dropout parts from
// classic ones: lower the input on a bench supply until the output falls.
// A part drops out at about typicalHeadroom of its worst case (a PNP-pass
// LDO at light load far less); a transistor follower as soon as its
// collector nears its emitter.
func dropoutAsk(ev *Evidence) measurement {
	return measurement{
		Measurement: Measurement{
			Key: "bench.dropout_volts", Kind: AskNumber, Unit: "V", Powered: true,
			Safety: "Bench test: unplug the equipment from the mains and discharge its filter capacitors before disconnecting anything; " +
				"current-limit the bench supply to a little above the normal load; the part and its heat sink may be hot. Follow local codes and qualified practice.",
			Measure: "where the output drops out (bench supply in place of the input, powered)",
			Prompt: "Unplug the equipment from the mains. Disconnect the part's input from its supply and feed it from a current-limited bench supply " +
				"(ground to board ground) set to the usual input, with the normal load connected. Lower the supply slowly, watching the output: " +
				"write the input − output difference at which the output has fallen by 2 %. Under 1 V means a low-dropout part; about 2 V a classic one.",
		},
		predict: func(h Hypothesis) outcomeDist {
			if !isRegulator(h) {
				return outcomeDist{dropoutBucket(0.3): 1}
			}
			d, _ := headroomNeed(h, ev)
			return outcomeDist{dropoutBucket(d * typicalHeadroom): 1}
		},
		describe: func(key string) string { return "drops out at " + key },
		effort:   benchEffort,
	}
}

// holdsAsk offers the load test that separates families of one pinout by
// their rating: raise a test load up to the largest leader's rating and note
// the largest the output holds; none when no regulator leads. Each part holds about its rating (its
// current limit lies above it, but the test stops at the largest rating).
func holdsAsk(hs []Candidate) (measurement, bool) {
	top := 0.0
	for _, c := range hs {
		if c.Probability > 0.01 && isRegulator(c.Hypothesis) {
			top = math.Max(top, c.Family.Current(c.Package))
		}
	}
	if top <= 0 { // no regulator worth a load test leads
		return measurement{}, false
	}
	return measurement{
		Measurement: Measurement{
			Key: "bench.holds_amps", Kind: AskNumber, Unit: "A", Powered: true,
			Measure: fmt.Sprintf("the largest load the output holds (test load up to %.3g A, powered)", top),
			Prompt: fmt.Sprintf("Power on. Connect a test load (power resistors or an electronic load) from the output to ground and raise it in steps "+
				"up to %.3g A, holding each step for ten seconds while watching the output: write the largest load at which the output stayed within 2 %%. "+
				"Watch the input too: if it sags to within the headroom of the output, the supply ended the test, not the part. "+
				"A part that gives up below %.3g A has the smaller rating.", top, top),
			Safety: "Load test: the part, its heat sink and the test load get hot enough to burn; mains is present inside the equipment. " +
				"Keep the test short, stop if the output falls or the part smells hot, and follow local codes and qualified practice.",
		},
		predict: func(h Hypothesis) outcomeDist {
			if !isRegulator(h) {
				return outcomeDist{"unknown": 1}
			}
			return outcomeDist{fmt.Sprintf("about %.3g A", math.Min(top, h.Family.Current(h.Package))): 1}
		},
		describe: func(key string) string { return "holds " + key },
		effort:   benchEffort,
	}, true
}

func dropoutBucket(v float64) string {
	switch {
	case v < 0.5:
		return "under 0.5 V"
	case v < 1:
		return "0.5 to 1 V"
	case v < 1.5:
		return "1 to 1.5 V"
	case v < 2.2:
		return "1.5 to 2.2 V"
	}
	return "above 2.2 V"
}

// troughAsk offers the scope measurement of the input's ripple trough, when
// the part is fed from a rectifier (a DC supply has none) and the trough is
// not yet measured. The true part regulates, so its trough headroom lies
// between what it needs and the measured mean headroom: uniformly, for want
// of anything better (common practice, no source).
func troughAsk(ev *Evidence) *measurement {
	if ev.Input != nil && (ev.Input.TroughVolts.Set || ev.Input.Rectifier.DC()) {
		return nil
	}
	return &measurement{
		Measurement: Measurement{
			Key: "input.trough_volts", Kind: AskNumber, Unit: "V", Powered: true,
			Measure: "lowest point of the input ripple (oscilloscope, powered, full load)",
			Prompt: "Power on, at full load. Oscilloscope on the part's input lead, ground clip on board ground, DC coupling: " +
				"write the lowest voltage the ripple reaches. A trough close to the output says the part regulates with little headroom (a low-dropout part).",
		},
		predict: func(h Hypothesis) outcomeDist {
			tv := terminalVolts(h, ev)
			vin, okIn := tv[catalog.PinIn]
			vout, okOut := tv[catalog.PinOut]
			if !okIn || !okOut {
				return outcomeDist{"unknown": 1}
			}
			mean := math.Abs(vin - vout)
			need, _ := headroomNeed(h, ev)
			need *= typicalHeadroom
			if mean <= need {
				return outcomeDist{troughBucket(mean): 1}
			}
			d := outcomeDist{}
			edges := []float64{need, 1, 2, mean}
			for i := 0; i+1 < len(edges); i++ {
				a, b := math.Max(edges[i], need), math.Min(edges[i+1], mean)
				if i == 2 {
					a = math.Max(2, need)
				}
				if b > a {
					d[troughBucket((a+b)/2)] += (b - a) / (mean - need)
				}
			}
			return d
		},
		describe: func(key string) string { return "trough headroom " + key },
	}
}

// join joins the non-empty sentences with spaces.
func join(parts ...string) string {
	var out []string
	for _, p := range parts {
		if p != "" {
			out = append(out, p)
		}
	}
	return strings.Join(out, " ")
}
