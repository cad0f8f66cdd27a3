package infer

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer/circuit"
)

// Check statuses.
const (
	Pass = "pass"
	Warn = "warn"
	Fail = "fail"
)

// Verdicts of a replacement.
const (
	DropIn     = "drop-in"    // no fail, no warn
	NeedsWork  = "needs-work" // warnings only
	Unsuitable = "unsuitable" // at least one fail
)

// Check is one row of a replacement's check table.
type Check struct {
	Check  string  `json:"check"`  // outline, pinout, tab, polarity, vout, current, vin_max, dropout, thermal, cout, min_load, module
	Value  string  `json:"value"`  // what the candidate meets in this circuit
	Limit  string  `json:"limit"`  // what it must meet
	Margin float64 `json:"margin"` // normalised: > 0 inside the limit, < 0 beyond it
	Status string  `json:"status"` // pass | warn | fail
	Text   string  `json:"text"`   // one sentence of why
}

// Replacement is one candidate with its checks.
type Replacement struct {
	Hypothesis
	Verdict string   // drop-in, needs-work or unsuitable
	Checks  []Check  // every check that applies, in a fixed order
	Install []string // install notes: lead mapping, insulator, capacitors, resistors, what to measure
	// Deciding is the check that sets the verdict (the worst one).
	Deciding string
	// MinMargin is the smallest margin over the checks.
	MinMargin float64
}

// Conditions are the worst-corner numbers the checks use.
type Conditions struct {
	VoutV      float64 `json:"vout_v"`       // target output (magnitude)
	LoadMaxA   float64 `json:"load_max_a"`   // heaviest load
	LoadMinA   float64 `json:"load_min_a"`   // lightest load
	TroughV    float64 `json:"trough_v"`     // lowest input: low mains, full load, low capacitance
	TroughAt   string  `json:"trough_at"`    // the corner or measurement it comes from
	PeakV      float64 `json:"peak_v"`       // highest input: high mains, light load
	PeakAt     string  `json:"peak_at"`      //
	HotInV     float64 `json:"hot_in_v"`     // mean input at high mains, full load (dissipation)
	AmbientC   float64 `json:"ambient_c"`    //
	HeatsinkCW float64 `json:"heatsink_c_w"` // θSA; 0 = free air
	Insulator  string  `json:"insulator"`    //
	Grounded   bool    `json:"grounded"`     // heat sink bonded to chassis/ground
	BypassOhm  float64 `json:"bypass_ohm"`   // 0 = none
	// Corners is the rectifier sweep, when the evidence describes the rectifier.
	Corners *circuit.CornerResult `json:"corners,omitempty"`
	// Rectifier is the nominal rectifier circuit (nil when not described).
	Rectifier *circuit.Rectifier `json:"-"`
}

// SwapResult is the outcome of [Swap].
type SwapResult struct {
	Original     Hypothesis    // the part being replaced
	Probability  float64       // of the original, when it came from Identify; 1 when named
	FromInfer    bool          // the original is infer's leader (not named)
	Replacements []Replacement // ranked: drop-in, needs-work, unsuitable
	Conditions   Conditions    // the worst-corner numbers the checks used
	Assumptions  []string      // defaults used where the evidence was silent
	// Hidden counts unsuitable candidates left out (without All).
	Hidden int
}

// SwapOptions tune [Swap].
type SwapOptions struct {
	// All includes obsolete and scarce parts, and unsuitable candidates
	// (which are otherwise shown only when nothing else fits).
	All bool
}

// conditions works out the operating conditions of the original's circuit
// from the one input model ([OperatingPoint]).
func conditions(ev *Evidence, orig Hypothesis) (Conditions, []string, error) {
	cd := Conditions{VoutV: orig.VoutV}
	tv := terminalVolts(orig, ev)
	if v, ok := tv[catalog.PinOut]; ok && math.Abs(v) > 0 {
		cd.VoutV = math.Abs(v)
	}
	if cd.VoutV == 0 {
		return cd, nil, fmt.Errorf("the output voltage is unknown: give the OUT lead's volts or the [network] resistors")
	}
	opp, err := OperatingPoint(ev, OperatingOptions{Sweep: SweepAll, AssumedLoadA: orig.Family.Current(orig.Package)})
	if err != nil {
		return cd, nil, err
	}
	op := *opp
	if vin, ok := tv[catalog.PinIn]; ok {
		op = op.FromReading(vin)
	}
	if op.Source == InputUnknown {
		return cd, nil, fmt.Errorf("the input voltage is unknown: give the IN lead's volts or the [input] rectifier, secondary and filter")
	}
	as := op.Assumptions
	cd.LoadMaxA, cd.LoadMinA = op.LoadMaxA, op.LoadMinA
	cd.TroughV, cd.TroughAt = op.Trough.V, op.Trough.At
	cd.PeakV, cd.PeakAt = op.Peak.V, op.Peak.At
	cd.HotInV = op.MeanHigh.V
	cd.Corners, cd.Rectifier = op.Corners, op.Rectifier
	if ev.Bypass != nil {
		cd.BypassOhm = ev.Bypass.Ohms.V
	}
	m := ev.Mount
	cd.AmbientC = 40
	if m != nil && m.AmbientC.Set {
		cd.AmbientC = m.AmbientC.V
	} else {
		as = append(as, "ambient 40 °C assumed (inside a closed cabinet)")
	}
	if m != nil {
		cd.HeatsinkCW = m.HeatsinkCPerW.V
		cd.Insulator = string(m.Insulator)
		cd.Grounded = m.ChassisHeatsink != nil && *m.ChassisHeatsink
	}
	if m == nil || !m.HeatsinkCPerW.Set {
		as = append(as, "no heat sink given: free air assumed")
	}
	if cd.Insulator == "" {
		cd.Insulator = "unknown"
	}
	return cd, as, nil
}

// Swap checks every current-production candidate against the circuit of
// the original and ranks them: drop-in first, then needs-work, then (with
// All, or when nothing else fits) unsuitable; within a class by the smallest
// normalised margin, then by commonness.
func Swap(c *catalog.Catalog, ev *Evidence, orig Hypothesis, prob float64, fromInfer bool, opts SwapOptions) (*SwapResult, error) {
	cd, as, err := conditions(ev, orig)
	if err != nil {
		return nil, err
	}
	res := &SwapResult{Original: orig, Probability: prob, FromInfer: fromInfer, Conditions: cd, Assumptions: as}
	var all []Replacement
	for _, f := range c.Sorted() {
		if f.NonRegulator() {
			continue // a transistor or switching IC is never a replacement
		}
		for i := range f.Packages {
			p := &f.Packages[i]
			if !opts.All && f.StatusOf(p) != "active" {
				continue
			}
			h := Hypothesis{Family: f, Package: p, Outline: c.Outline(p.Outline)}
			if f.Polarity != orig.Family.Polarity && !opts.All {
				continue // the polarity check would fail: not worth listing
			}
			r := checkReplacement(c, ev, orig, h, &cd)
			all = append(all, r)
		}
	}
	rank := map[string]int{DropIn: 0, NeedsWork: 1, Unsuitable: 2}
	sort.SliceStable(all, func(i, j int) bool {
		a, b := all[i], all[j]
		if rank[a.Verdict] != rank[b.Verdict] {
			return rank[a.Verdict] < rank[b.Verdict]
		}
		if math.Abs(a.MinMargin-b.MinMargin) > 1e-9 {
			return a.MinMargin > b.MinMargin
		}
		if a.Family.Commonness != b.Family.Commonness {
			return a.Family.Commonness > b.Family.Commonness
		}
		return a.Label() < b.Label()
	})
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

func status(margin, warnBelow float64) string {
	switch {
	case margin < 0:
		return Fail
	case margin < warnBelow:
		return Warn
	}
	return Pass
}

// checkReplacement runs every check that applies to candidate h.
func checkReplacement(c *catalog.Catalog, ev *Evidence, orig, h Hypothesis, cd *Conditions) Replacement {
	f, p, o := h.Family, h.Package, h.Outline
	of, op, oo := orig.Family, orig.Package, orig.Outline
	var checks []Check
	var install []string
	add := func(ch Check) { checks = append(checks, ch) }
	sign := ""
	if f.Negative() {
		sign = "-"
	}

	// Outline and footprint. sameHoles: the leads go into the old holes in
	// the old order, so lead functions must match position by position.
	sameOutline := oo != nil && o != nil && oo.Name == o.Name
	sameHoles := sameOutline
	switch {
	case sameOutline:
		add(Check{"outline", o.Name, oo.Name, 1, Pass, "same outline: it fits the old footprint and mounting"})
	case o != nil && o.Name == "SIP-3" && oo != nil && oo.Leads == 3 && oo.PitchMM > 2.4 && oo.PitchMM < 2.7 && !oo.SMD:
		add(Check{"outline", o.Name, oo.Name, 0.5, Pass, "a SIP-3 module fits the three 2.54 mm holes; nothing needs bolting down"})
		sameHoles = true
	case o != nil && oo != nil && o.Leads == oo.Leads && math.Abs(o.PitchMM-oo.PitchMM) < 0.15 && o.SMD == oo.SMD:
		sameHoles = true
		add(Check{"outline", o.Name, oo.Name, 0.2, Warn, fmt.Sprintf("%s fits the holes of the %s but the body and mounting differ", o.Name, oo.Name)})
	case o != nil && oo != nil && len(p.Terminals(o)) != len(op.Terminals(oo)):
		add(Check{"outline", fmt.Sprintf("%s, %d terminals", o.Name, len(p.Terminals(o))), fmt.Sprintf("%s, %d terminals", oo.Name, len(op.Terminals(oo))), -1, Fail,
			fmt.Sprintf("a %d-terminal %s has no place on a %d-terminal footprint without a new board", len(p.Terminals(o)), o.Name, len(op.Terminals(oo)))})
	default:
		add(Check{"outline", name(o), name(oo), 0, Warn, fmt.Sprintf("needs rework: a %s in place of a %s (adapter board or flying leads, and a new mounting)", name(o), name(oo))})
		if oo != nil && oo.CaseTerminal && o != nil && !o.CaseTerminal {
			install = append(install, fmt.Sprintf("mount the %s on the old heat sink with thermal compound; run short leads to the can's old connections", o.Name))
		}
	}

	// Polarity.
	if f.Polarity != of.Polarity {
		add(Check{"polarity", f.Polarity.String(), of.Polarity.String(), -1, Fail, fmt.Sprintf("a %s regulator cannot replace a %s one", f.Polarity, of.Polarity)})
	} else {
		add(Check{"polarity", f.Polarity.String(), of.Polarity.String(), 1, Pass, "same polarity"})
	}

	// Lead-by-lead function.
	oldT, newT := op.Terminals(oo), p.Terminals(o)
	norm := func(fn string) string {
		if fn == catalog.PinAdj {
			return catalog.PinGnd // the common lead, either way
		}
		return fn
	}
	if sameHoles {
		var diffs []string
		for i := 0; i < len(oldT) && i < len(newT); i++ {
			if norm(oldT[i]) != norm(newT[i]) {
				diffs = append(diffs, fmt.Sprintf("lead %d is %s, was %s", i+1, newT[i], oldT[i]))
			}
		}
		if len(diffs) == 0 {
			add(Check{"pinout", strings.Join(newT, "-"), strings.Join(oldT, "-"), 1, Pass, "every lead has the old lead's function"})
		} else {
			add(Check{"pinout", strings.Join(newT, "-"), strings.Join(oldT, "-"), -1, Fail, "not a drop-in: " + strings.Join(diffs, "; ")})
		}
	} else {
		add(Check{"pinout", strings.Join(newT, "-"), strings.Join(oldT, "-"), 0.1, Warn, "wire by function: " + leadMap(oldT, newT)})
		install = append(install, "lead mapping: "+leadMap(oldT, newT))
	}

	// Tab or can against the mounting.
	tab := p.Tab
	live := tab != catalog.TabNone && tab != catalog.PinGnd
	if o != nil && (o.Tab || o.MetalCan) && !o.Isolated {
		what := "tab"
		if o.MetalCan {
			what = "can"
		}
		ins := cd.Insulator
		switch {
		case !live:
			add(Check{"tab", tabText(tab), "heat sink " + groundText(cd.Grounded), 1, Pass, fmt.Sprintf("the %s is %s: nothing live to insulate", what, tabText(tab))})
		case cd.Grounded && ins == "none":
			add(Check{"tab", fmt.Sprintf("%s at %s", what, tab), "grounded heat sink, no insulator", -1, Fail,
				fmt.Sprintf("the %s is %s and would short that rail to the grounded heat sink: fit an insulating washer and bushing", what, tab)})
			install = append(install, fmt.Sprintf("insulator kit: mica or silicone washer plus a shoulder bushing for the screw; check with an ohmmeter that the %s does not reach the heat sink", what))
		case cd.Grounded && ins == "unknown":
			add(Check{"tab", fmt.Sprintf("%s at %s", what, tab), "grounded heat sink, insulator unknown", 0, Warn,
				fmt.Sprintf("the %s is %s: make sure an insulator and bushing are fitted", what, tab)})
			install = append(install, fmt.Sprintf("insulator kit: the %s is live (%s); fit a washer and bushing and check with an ohmmeter", what, tab))
		case cd.Grounded:
			add(Check{"tab", fmt.Sprintf("%s at %s", what, tab), "grounded heat sink on " + ins, 0.5, Pass,
				fmt.Sprintf("the %s is %s, insulated by the %s washer", what, tab, ins)})
		case op.Tab != tab:
			add(Check{"tab", fmt.Sprintf("%s at %s", what, tab), "heat sink at the old " + tabText(op.Tab), 0, Warn,
				fmt.Sprintf("the heat sink sat at the old part's %s potential; the new %s is %s: insulate it or check what else touches the heat sink", tabText(op.Tab), what, tab)})
		default:
			add(Check{"tab", fmt.Sprintf("%s at %s", what, tab), "as the old part", 0.5, Pass, fmt.Sprintf("the %s has the old part's potential (%s)", what, tab)})
		}
	}

	// Output voltage.
	vout := cd.VoutV
	lifted := !of.Adjustable() && ev.Network != nil && ev.Network.RTopOhms.Set && ev.Network.RBottomOhms.Set
	nw := ev.Network
	switch {
	case f.Adjustable():
		if f.VoutMaxV > 0 && vout > f.VoutMaxV {
			add(Check{"vout", fmt.Sprintf("%s%.2f V", sign, vout), fmt.Sprintf("%g V max", f.VoutMaxV), vout/f.VoutMaxV - 1, Fail, "the output is above this part's range"})
		} else if of.Adjustable() && nw != nil && nw.RTopOhms.Set && nw.RBottomOhms.Set {
			got, _ := circuit.DividerVout(f.VrefV, f.IadjTypUA*1e-6, nw.RTopOhms.V, nw.RBottomOhms.V, math.Abs(nw.BottomToVolts.V))
			dev := math.Abs(got-vout) / vout
			st := status(0.03-dev, 0.01)
			if st == Fail {
				st = Warn
			}
			add(Check{"vout", fmt.Sprintf("%s%.2f V on the old divider", sign, got), fmt.Sprintf("%s%.2f V", sign, vout), 1 - dev/0.03, st,
				fmt.Sprintf("the old divider (%s over %s) with this part's %.3g V reference and %g µA ADJ current", ohmsText(nw.RTopOhms.V), ohmsText(nw.RBottomOhms.V), f.VrefV, f.IadjTypUA)})
			if st != Pass {
				if ch, err := chooseFor(f, vout); err == nil {
					install = append(install, fmt.Sprintf("resistors: R1 %s (OUT to ADJ), R2 %s (ADJ to the return) for %.2f V", ohmsText(ch.R1Ohm), ohmsText(ch.R2Ohm), ch.VoutV))
				}
			}
		} else {
			ch, err := chooseFor(f, vout)
			if err != nil {
				add(Check{"vout", "-", fmt.Sprintf("%s%.2f V", sign, vout), -1, Fail, err.Error()})
			} else {
				add(Check{"vout", fmt.Sprintf("%s%.2f V with E24 %s / %s", sign, ch.VoutV, ohmsText(ch.R1Ohm), ohmsText(ch.R2Ohm)), fmt.Sprintf("%s%.2f V", sign, vout),
					1 - math.Abs(ch.ErrorV)/(0.03*vout), Warn, fmt.Sprintf("needs a divider: R1 %s from OUT to ADJ, R2 %s from ADJ to ground (%s%.2f to %s%.2f V over the ADJ-current spread)", ohmsText(ch.R1Ohm), ohmsText(ch.R2Ohm), sign, ch.SpreadLowV, sign, ch.SpreadHighV)})
				install = append(install, fmt.Sprintf("resistors: add R1 %s (OUT to ADJ) and R2 %s (ADJ to ground), 1 %% metal film", ohmsText(ch.R1Ohm), ohmsText(ch.R2Ohm)))
			}
		}
	default:
		nom := orig.VoutV
		if of.Adjustable() {
			nom = vout
		}
		v, ok := nearestOutput(f, nom)
		switch {
		case !ok:
			add(Check{"vout", fmt.Sprintf("%s%s V nearest", sign, trimFloat(v)), fmt.Sprintf("%s%.2f V", sign, nom), -math.Abs(v-nom) / nom, Fail, fmt.Sprintf("%s is not made for %.2f V", f.ID, nom)})
		case lifted && f.Switching():
			add(Check{"vout", fmt.Sprintf("%s%s V", sign, trimFloat(v)), fmt.Sprintf("%s%.2f V (lifted ground)", sign, vout), -1, Fail, "a switching module's ground carries the input return current: it cannot sit on a lifted-ground divider"})
		case lifted:
			rt, rb := nw.RTopOhms.V, nw.RBottomOhms.V
			bottom := math.Abs(nw.BottomToVolts.V)
			got, _ := circuit.DividerVout(v, iqTyp(f)*1e-3, rt, rb, bottom)
			hi, _ := circuit.DividerVout(v, f.IqMA*1e-3, rt, rb, bottom)
			dev := math.Max(math.Abs(got-vout), math.Abs(hi-vout)) / vout
			st := status(0.05-dev, 0.03)
			text := fmt.Sprintf("lifted ground: this part's %.3g mA typical (%.3g max) ground current through %s gives %.2f V (up to %.2f V)", iqTyp(f), f.IqMA, ohmsText(rb), got, hi)
			if st != Pass {
				r2 := (vout - bottom - v) / (v/rt + iqTyp(f)*1e-3)
				if lo, hi2, ok := circuit.Nearest(circuit.Values(circuit.E24, 1, 1e6), r2); ok && r2 > 0 {
					best := lo
					if math.Abs(hi2-r2) < math.Abs(lo-r2) {
						best = hi2
					}
					text += fmt.Sprintf("; change the bottom resistor to about %s (E24 %s)", ohmsText(r2), ohmsText(best))
					install = append(install, fmt.Sprintf("resistors: change the ground-lead resistor from %s to %s to restore %.2f V", ohmsText(rb), ohmsText(best), vout))
				}
			}
			add(Check{"vout", fmt.Sprintf("%s%.2f V", sign, got), fmt.Sprintf("%s%.2f V ±5 %%", sign, vout), 1 - dev/0.05, st, text})
		case of.Adjustable():
			add(Check{"vout", fmt.Sprintf("%s%s V fixed", sign, trimFloat(v)), fmt.Sprintf("%s%.2f V", sign, nom), 0.5, Warn, "a fixed part at the set voltage: remove the divider and ground the common lead"})
			install = append(install, "resistors: remove the ADJ divider; the common lead goes to ground")
		default:
			add(Check{"vout", fmt.Sprintf("%s%s V ±%g %%", sign, trimFloat(v), f.Tolerance*100), fmt.Sprintf("%s%s V", sign, trimFloat(nom)), 1, Pass, "the same nominal output"})
		}
		h.VoutV = v
	}
	if f.Adjustable() {
		h.VoutV = vout
	}

	// Regulator current at the worst corner.
	share := 0.0
	if cd.BypassOhm > 0 {
		share = math.Max(0, (cd.TroughV-vout)/cd.BypassOhm)
	}
	ireg := math.Max(0, cd.LoadMaxA-share)
	rating := f.Current(p)
	m := 1 - ireg/rating
	curText := fmt.Sprintf("%.3g A at full load against %.3g A rated", ireg, rating)
	if share > 0 {
		curText = fmt.Sprintf("%.3g A (load %.3g A less %.3g A through the bypass resistor at the lowest input) against %.3g A rated", ireg, cd.LoadMaxA, share, rating)
	}
	add(Check{"current", fmt.Sprintf("%.3g A", ireg), fmt.Sprintf("%.3g A", rating), m, status(m, 0.2), curText})

	// Input maximum at the worst peak.
	limit, what := f.VinMax(h.VoutV), "input maximum"
	if f.Adjustable() {
		limit, what = f.VdiffMaxV+vout, fmt.Sprintf("input-output maximum %g V plus the output", f.VdiffMaxV)
		if f.VinMaxV > 0 && f.VinMaxV < limit {
			limit, what = f.VinMaxV, "input maximum"
		}
	}
	if limit > 0 {
		m := 1 - cd.PeakV/limit
		text := fmt.Sprintf("%s%.1f V at %s against the %s", sign, cd.PeakV, cd.PeakAt, what)
		if f.Adjustable() && cd.PeakV > f.VdiffMaxV {
			text += fmt.Sprintf("; at power-up or into a short the whole %.1f V appears across it", cd.PeakV)
		}
		add(Check{"vin_max", fmt.Sprintf("%.1f V", cd.PeakV), fmt.Sprintf("%.0f V", limit), m, status(m, 0.05), text})
	}

	// Dropout at the worst trough.
	need := f.DropoutV * (0.7 + 0.3*math.Min(1, ireg/rating))
	if f.Switching() {
		need = f.DropoutV
	}
	head := cd.TroughV - vout
	dm := (head - need) / need
	beyond := "above"
	if f.Negative() {
		beyond = "beyond"
	}
	add(Check{"dropout", fmt.Sprintf("%.2f V headroom", head), fmt.Sprintf("%.2f V needed", need), dm, status(dm, 0.1),
		fmt.Sprintf("the input falls to %s%.2f V at %s; this part needs %.2f V %s the %s%.2f V output there", sign, cd.TroughV, cd.TroughAt, need, beyond, sign, vout)})

	// Junction temperature at the worst dissipation.
	var pw float64
	if f.Switching() {
		pw = vout * ireg * (1/f.Efficiency - 1)
	} else {
		pw = circuit.RegulatorDissipation(cd.HotInV, vout, ireg, f.IqMA*1e-3)
	}
	var tj float64
	path := ""
	if cd.HeatsinkCW > 0 && o != nil && (o.Tab || o.MetalCan) && !f.Switching() {
		cs, _ := circuit.CaseToSink(cd.Insulator, o.CaseTerminal)
		jc := p.ThetaJC
		if o.Isolated && jc == 0 {
			jc = p.ThetaJA / 4
		}
		tj = circuit.JunctionTemp(pw, cd.AmbientC, jc, cs, cd.HeatsinkCW)
		path = fmt.Sprintf("θJC %g + θCS %g (%s) + θSA %g °C/W", jc, cs, cd.Insulator, cd.HeatsinkCW)
	} else if o != nil && o.Isolated && cd.HeatsinkCW > 0 {
		cs, _ := circuit.CaseToSink("none", false)
		tj = circuit.JunctionTemp(pw, cd.AmbientC, p.ThetaJC, cs, cd.HeatsinkCW)
		path = fmt.Sprintf("θJC %g (isolated body) + θCS %g + θSA %g °C/W", p.ThetaJC, cs, cd.HeatsinkCW)
	} else {
		tj = circuit.FreeAirTemp(pw, cd.AmbientC, p.ThetaJA)
		path = fmt.Sprintf("free air, θJA %g °C/W", p.ThetaJA)
	}
	tm := (f.TjMaxC - tj) / math.Max(1, f.TjMaxC-cd.AmbientC)
	tst := Pass
	switch {
	case tj > f.TjMaxC:
		tst = Fail
	case tj > f.TjMaxC-15:
		tst = Warn
	}
	add(Check{"thermal", fmt.Sprintf("Tj %.0f °C", tj), fmt.Sprintf("%g °C", f.TjMaxC), tm, tst,
		fmt.Sprintf("%.2f W at high mains and full load through %s, from %g °C ambient", pw, path, cd.AmbientC)})

	// Output-capacitor stability.
	if ch, ok := coutCheck(f, ev); ok {
		add(ch)
		if ch.Status != Pass {
			install = append(install, coutAdvice(f))
		}
	}

	// Minimum load.
	if f.Adjustable() || cd.BypassOhm > 0 {
		div := 0.0
		if f.Adjustable() {
			if nw != nil && nw.RTopOhms.Set && nw.RTopOhms.V > 0 && of.Adjustable() {
				div = f.VrefV / nw.RTopOhms.V
			} else if ch, err := chooseFor(f, vout); err == nil {
				div = ch.DividerA
			}
		}
		regMin := f.MinLoadMA * 1e-3
		avail := cd.LoadMinA + div
		needA := regMin
		text := fmt.Sprintf("divider %.1f mA plus the lightest load %.3g A against this part's %g mA minimum", div*1e3, cd.LoadMinA, f.MinLoadMA)
		if cd.BypassOhm > 0 {
			shareHi := math.Max(0, (cd.PeakV-vout)/cd.BypassOhm)
			needA += shareHi
			text = fmt.Sprintf("the bypass resistor passes %.3g A at %s; with the part's own %g mA the load must stay above %.3g A, and the lightest is %.3g A", shareHi, cd.PeakAt, f.MinLoadMA, needA, cd.LoadMinA+div)
		}
		m := (avail - needA) / math.Max(needA, 1e-3)
		if needA == 0 {
			m = 1
		}
		add(Check{"min_load", fmt.Sprintf("%.3g A", avail), fmt.Sprintf("%.3g A", needA), m, status(m, 0.2), text})
	}

	// Switching drop-in specifics.
	if f.Switching() {
		var probs []string
		st := Warn
		if cd.BypassOhm > 0 {
			probs = append(probs, fmt.Sprintf("remove the %s bypass resistor: the module cannot sink the current it would push into the output", ohmsText(cd.BypassOhm)))
			st = Fail
		}
		if lifted {
			probs = append(probs, "it cannot work on a lifted ground")
			st = Fail
		}
		if ev.Output != nil && ev.Output.CapUF.Set && f.Cout.MaxUF > 0 && ev.Output.CapUF.V > f.Cout.MaxUF {
			probs = append(probs, fmt.Sprintf("the board's %g µF at the output is more than the %g µF it starts into", ev.Output.CapUF.V, f.Cout.MaxUF))
			st = Fail
		}
		probs = append(probs, "it cannot sink current (no output held up by another rail)", "fit an input capacitor (47 µF) at its leads if the filter is far away", "switching noise of tens of mV at hundreds of kHz: not for audio, RF or precision analogue without filtering")
		m := 0.0
		if st == Fail {
			m = -1
		}
		add(Check{"module", "switching step-down", "linear regulator's circuit", m, st, strings.Join(probs, "; ")})
		if cd.BypassOhm > 0 {
			install = append(install, fmt.Sprintf("remove the %s bypass resistor before fitting the module", ohmsText(cd.BypassOhm)))
		}
	}

	// After power-up.
	tcase := cd.AmbientC + pw*(cd.HeatsinkCW+1)
	if cd.HeatsinkCW == 0 {
		tcase = tj - pw*p.ThetaJC
	}
	install = append(install,
		fmt.Sprintf("after power-up: output %s%.2f V ±%g %% at full load; ripple at the output a few mV (a scope, AC-coupled)", sign, vout, f.Tolerance*100),
		fmt.Sprintf("after 10 minutes at full load: case about %.0f °C (expect within 10 °C); do not touch it bare-handed", tcase))

	r := Replacement{Hypothesis: h, Checks: checks, Install: install}
	r.Verdict, r.Deciding, r.MinMargin = verdict(checks)
	return r
}

func verdict(checks []Check) (string, string, float64) {
	v := DropIn
	worst := ""
	minM := math.Inf(1)
	worstRank := -1
	rank := map[string]int{Pass: 0, Warn: 1, Fail: 2}
	for _, ch := range checks {
		if rank[ch.Status] > worstRank || (rank[ch.Status] == worstRank && ch.Margin < minM) {
			worstRank, worst = rank[ch.Status], ch.Check
		}
		minM = math.Min(minM, ch.Margin)
	}
	switch worstRank {
	case 2:
		v = Unsuitable
	case 1:
		v = NeedsWork
	}
	// The deciding check is the worst one of the worst status.
	best := math.Inf(1)
	for _, ch := range checks {
		if rank[ch.Status] == worstRank && ch.Margin < best {
			best, worst = ch.Margin, ch.Check
		}
	}
	return v, worst, minM
}

func chooseFor(f *catalog.Family, vout float64) (circuit.DividerChoice, error) {
	return circuit.ChooseDivider(circuit.DividerSpec{TargetV: vout, VrefV: f.VrefV, ITypA: f.IadjTypUA * 1e-6,
		IMaxA: f.IadjUA * 1e-6, MinLoadA: f.MinLoadMA * 1e-3, MaxR1Ohm: 1e3})
}

func iqTyp(f *catalog.Family) float64 {
	if f.IqTypMA > 0 {
		return f.IqTypMA
	}
	return f.IqMA
}

// nearestOutput returns the family's standard output nearest to v, and
// whether it is within 2 %.
func nearestOutput(f *catalog.Family, v float64) (float64, bool) {
	best := 0.0
	for _, o := range f.OutputsV {
		if best == 0 || math.Abs(o-v) < math.Abs(best-v) {
			best = o
		}
	}
	return best, best > 0 && math.Abs(best-v) <= 0.02*v
}

// esrEstimate is a rough ESR of a capacitor by type and value, ohms:
// general-purpose aluminium electrolytics about 150 Ω·µF / C (a fit to the
// chart quoted in shared/reference/methods.md §6: 10 µF 20 Ω, 100 µF 1.6 Ω
// at 16 V), solid tantalum about 3 Ω at 1 µF falling as 1/√C (from memory),
// ceramic 0.01 Ω (methods.md §6: MLCC 0.01–0.1 Ω).
func esrEstimate(kind string, uf float64) float64 {
	switch kind {
	case "electrolytic":
		return 150 / math.Max(uf, 0.1)
	case "tantalum":
		return 3 / math.Sqrt(math.Max(uf, 0.1))
	case "ceramic":
		return 0.01
	}
	return 0
}

func coutCheck(f *catalog.Family, ev *Evidence) (Check, bool) {
	req := f.Cout
	needs := req.MinUF > 0 || req.ESRMinOhm > 0 || req.ESRMaxOhm > 0 || !req.CeramicOK
	out := ev.Output
	if out == nil || (!out.CapUF.Set && out.CapType == "") {
		if !needs {
			return Check{}, false
		}
		return Check{"cout", "unknown", coutLimit(req), 0, Warn, "the board's output capacitor is not described: " + coutAdvice(f)}, true
	}
	uf, kind := out.CapUF.V, string(out.CapType)
	if kind == "none" {
		uf = 0
	}
	value := fmt.Sprintf("%g µF %s", uf, kind)
	switch {
	case req.MinUF > 0 && uf < req.MinUF:
		return Check{"cout", value, coutLimit(req), uf/req.MinUF - 1, Fail, fmt.Sprintf("needs at least %g µF at the output for stability; the board has %g µF", req.MinUF, uf)}, true
	case kind == "ceramic" && !req.CeramicOK:
		return Check{"cout", value, coutLimit(req), -1, Fail, "not stable with ceramic capacitors alone: its loop needs the ESR of a tantalum or aluminium part"}, true
	}
	esr := esrEstimate(kind, uf)
	if req.ESRMaxOhm > 0 && esr > req.ESRMaxOhm {
		return Check{"cout", fmt.Sprintf("%s, ESR about %.2g Ω", value, esr), coutLimit(req), req.ESRMaxOhm/esr - 1, Warn,
			fmt.Sprintf("the capacitor's ESR (about %.2g Ω, and up to 30× more when cold) is above the %.2g Ω the part tolerates", esr, req.ESRMaxOhm)}, true
	}
	if req.ESRMinOhm > 0 && esr > 0 && esr < req.ESRMinOhm {
		return Check{"cout", fmt.Sprintf("%s, ESR about %.2g Ω", value, esr), coutLimit(req), esr/req.ESRMinOhm - 1, Fail,
			fmt.Sprintf("the capacitor's ESR (about %.2g Ω) is below the %.2g Ω the loop needs: it may oscillate", esr, req.ESRMinOhm)}, true
	}
	if f.Cout.MaxUF > 0 && uf > f.Cout.MaxUF {
		return Check{"cout", value, coutLimit(req), f.Cout.MaxUF/uf - 1, Fail, fmt.Sprintf("more than the %g µF it can start into", f.Cout.MaxUF)}, true
	}
	if !needs {
		return Check{"cout", value, "none needed", 1, Pass, "not needed for stability; the board's capacitor helps the transient response"}, true
	}
	return Check{"cout", value, coutLimit(req), 0.5, Pass, "within the part's output-capacitor requirement"}, true
}

func coutLimit(c catalog.COut) string {
	var parts []string
	if c.MinUF > 0 {
		parts = append(parts, fmt.Sprintf("≥ %g µF", c.MinUF))
	}
	if c.ESRMinOhm > 0 || c.ESRMaxOhm > 0 {
		parts = append(parts, fmt.Sprintf("ESR %g–%g Ω", c.ESRMinOhm, c.ESRMaxOhm))
	}
	if !c.CeramicOK {
		parts = append(parts, "not ceramic alone")
	}
	if len(parts) == 0 {
		return "none needed"
	}
	return strings.Join(parts, ", ")
}

func coutAdvice(f *catalog.Family) string {
	c := f.Cout
	switch {
	case c.ESRMinOhm > 0 || c.ESRMaxOhm > 0:
		return fmt.Sprintf("capacitor: fit %g µF or more of solid tantalum (ESR inside %g–%g Ω) right at the output lead", math.Max(c.MinUF, 10), c.ESRMinOhm, c.ESRMaxOhm)
	case c.MinUF > 0:
		return fmt.Sprintf("capacitor: fit at least %g µF (tantalum, or %g µF aluminium) right at the output lead", c.MinUF, 10*c.MinUF)
	}
	return "capacitor: 0.1 µF ceramic at the input and output leads"
}

func leadMap(oldT, newT []string) string {
	var parts []string
	for i, fn := range newT {
		j := -1
		for k, ofn := range oldT {
			if ofn == fn || (fn == catalog.PinAdj && ofn == catalog.PinGnd) || (fn == catalog.PinGnd && ofn == catalog.PinAdj) {
				j = k
				break
			}
		}
		if j >= 0 {
			parts = append(parts, fmt.Sprintf("new lead %d (%s) to the old lead %d's pad", i+1, fn, j+1))
		} else {
			parts = append(parts, fmt.Sprintf("new lead %d (%s) has no old counterpart", i+1, fn))
		}
	}
	return strings.Join(parts, ", ")
}

func name(o *catalog.Outline) string {
	if o == nil {
		return "?"
	}
	return o.Name
}

func tabText(t string) string {
	switch t {
	case catalog.TabNone:
		return "insulated"
	case catalog.PinGnd:
		return "at ground"
	}
	return "at " + t
}

func groundText(g bool) string {
	if g {
		return "grounded"
	}
	return "not grounded"
}
