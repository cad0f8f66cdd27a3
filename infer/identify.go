package infer

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer/circuit"
)

// Hypothesis is one thing the unknown part could be.
type Hypothesis struct {
	Family  *catalog.Family  // the family
	Package *catalog.Package // the package variant (one of Family.Packages)
	Outline *catalog.Outline // the variant's outline; nil only if the catalog lacks it
	// VoutV is the output voltage as a magnitude: a fixed family's nominal
	// voltage, or what an adjustable part is set to (measured or from the
	// divider); 0 when unknown.
	VoutV float64
}

// Label returns "family package vout", e.g. "78xx TO-220 5 V".
func (h Hypothesis) Label() string {
	s := h.Family.ID + " " + h.Package.Outline
	if h.VoutV > 0 {
		sign := ""
		if h.Family.Negative() {
			sign = "-"
		}
		s += fmt.Sprintf(" %s%s V", sign, trimFloat(h.VoutV))
	}
	return s
}

func trimFloat(v float64) string {
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.2f", v), "0"), ".")
}

// Reason is one term of a candidate's score: a natural-log weight (prior, or
// likelihood ratio against a part about which nothing is known) and a line
// of text saying where it comes from.
type Reason struct {
	Evidence string  `json:"evidence"` // the evidence key, e.g. "pins.2", "case", "prior"
	Weight   float64 `json:"weight"`   // natural-log weight; positive favours the candidate
	Text     string  `json:"text"`     // one line of why; "" beyond Options.Explain
}

// Candidate is a scored hypothesis. Score is exactly the sum of the reasons'
// weights.
type Candidate struct {
	Hypothesis
	Score       float64  // sum of the reasons' weights
	Probability float64  // posterior probability, 0 to 1
	Reasons     []Reason // the terms of Score, prior first

	label string // Label(), kept
}

// name returns the candidate's label, formatted once.
func (c *Candidate) name() string {
	if c.label == "" {
		c.label = c.Label()
	}
	return c.label
}

// Result is the outcome of [Identify].
type Result struct {
	// Candidates are every hypothesis, most probable first.
	Candidates []Candidate
	// NotInCatalog is the probability that the part is none of them.
	NotInCatalog float64
	// NotInCatalogScore is the score of that hypothesis (its prior: every
	// likelihood is measured against it).
	NotInCatalogScore float64
	// Conflicts lists evidence that contradicts itself or every leader.
	Conflicts []string
	// Next lists the most informative measurements still open, best first.
	Next []Measurement
	// PriorOnly is true when no evidence bore on the ranking.
	PriorOnly bool
	// Assumptions lists defaults the model used.
	Assumptions []string
	// InputPeakV is the highest input the circuit can present (high mains,
	// light load), from the rectifier model; 0 when not computable.
	InputPeakV float64
}

// Options tune [Identify].
type Options struct {
	// NextCount is how many next measurements to return (3 if zero).
	NextCount int
	// Explain is how many leading candidates get the text of their reasons
	// (0 = all). Every candidate always has its reasons' weights, so the
	// score is the same either way; the text costs time.
	Explain int
}

// Probability constants of the likelihoods. They are judgement, not
// datasheet values: "common practice, no source".
const (
	pFlatWired = 0.2  // a lead of an unknown part: five words, equally likely
	meterAbsV  = 0.02 // meter error: 20 mV plus 0.5 % of reading
	meterRel   = 0.005
	pNICPrior  = 0.03 // prior probability that the part is not in the catalog
)

// wiredLikelihood is P(wired_to word | lead function).
var wiredLikelihood = map[string]map[Wiring]float64{
	catalog.PinIn:  {WiredUnregulated: 0.90, WiredNetwork: 0.02, WiredLoad: 0.02, WiredGround: 0.03, WiredOpen: 0.03},
	catalog.PinOut: {WiredLoad: 0.86, WiredNetwork: 0.10, WiredUnregulated: 0.02, WiredGround: 0.01, WiredOpen: 0.01},
	catalog.PinGnd: {WiredGround: 0.80, WiredNetwork: 0.15, WiredLoad: 0.02, WiredUnregulated: 0.015, WiredOpen: 0.015},
	catalog.PinAdj: {WiredNetwork: 0.85, WiredGround: 0.10, WiredLoad: 0.02, WiredUnregulated: 0.015, WiredOpen: 0.015},
	catalog.PinNC:  {WiredOpen: 0.70, WiredGround: 0.1, WiredNetwork: 0.05, WiredLoad: 0.1, WiredUnregulated: 0.05},
	catalog.PinEn:  {WiredGround: 0.70, WiredNetwork: 0.1, WiredUnregulated: 0.1, WiredLoad: 0.05, WiredOpen: 0.05},
	catalog.PinInh: {WiredGround: 0.70, WiredNetwork: 0.1, WiredUnregulated: 0.1, WiredLoad: 0.05, WiredOpen: 0.05},
}

var functionWords = map[string]string{
	catalog.PinIn: "IN", catalog.PinOut: "OUT", catalog.PinGnd: "GND", catalog.PinAdj: "ADJ", catalog.PinNC: "NC", catalog.PinEn: "EN", catalog.PinInh: "INH",
}

// typicalHeadroom is the fraction of the datasheet's worst-case dropout
// ([catalog.Family.HeadroomNeeded]) with which a typical part still
// regulates: identification and the next-measurement planner ask whether a
// running part could be this one, not whether every part is guaranteed to
// work, which replacement asks with the whole figure (typical dropouts are
// 50–90 % of the maximum: LM2940 0.5/1.0 V, LM1117 1.2/1.4 V, LM7805 about 1.7/2 V; common
// practice, no source for the single fraction).
const typicalHeadroom = 0.8

// window is the likelihood of a measured deviation z (in units of the
// allowed error): 0.9 inside, falling off as a Gaussian outside, with a
// floor for gross mistakes.
func window(z float64) float64 {
	if z <= 1 {
		return 0.9
	}
	return 0.9*math.Exp(-2*(z-1)*(z-1)) + 0.002
}

// opPoint holds what the evidence says about the circuit, shared by all hypotheses.
type opPoint struct {
	input   *Operating             // the input model (peak only), shared with replacement
	marks   map[string]catalog.Hit // the marking decoded, by family id
	legible bool
	text    bool // format reason texts
}

// Identify ranks the catalog's hypotheses for the evidence.
func Identify(c *catalog.Catalog, ev *Evidence, opts Options) (*Result, error) {
	if opts.NextCount == 0 {
		opts.NextCount = 3
	}
	op, err := operatingPoint(c, ev)
	if err != nil {
		return nil, err
	}
	op.text = opts.Explain == 0
	var hyps []Hypothesis
	for _, f := range c.Sorted() {
		for i := range f.Packages {
			p := &f.Packages[i]
			o := c.Outline(p.Outline)
			if f.Adjustable() {
				hyps = append(hyps, Hypothesis{Family: f, Package: p, Outline: o})
				continue
			}
			for _, v := range f.OutputsV {
				hyps = append(hyps, Hypothesis{Family: f, Package: p, Outline: o, VoutV: v})
			}
		}
	}
	res := &Result{Assumptions: op.input.Assumptions, InputPeakV: op.input.Peak.V}
	cands := make([]Candidate, len(hyps))
	priorMass := 0.0
	evidenceUsed := false
	for i, h := range hyps {
		if h.Family.Adjustable() {
			h.VoutV = adjustableVout(h, ev)
			hyps[i] = h
		}
		rs := priorReasons(h, ev, c, op.text)
		prior := 0.0
		for _, r := range rs {
			prior += r.Weight
		}
		priorMass += math.Exp(prior)
		ls := likelihoods(h, ev, op)
		if len(ls) > 0 {
			evidenceUsed = true
		}
		rs = append(rs, ls...)
		score := 0.0
		for _, r := range rs {
			score += r.Weight
		}
		cands[i] = Candidate{Hypothesis: h, Score: score, Reasons: rs}
	}
	res.PriorOnly = !evidenceUsed
	res.NotInCatalogScore = math.Log(pNICPrior / (1 - pNICPrior) * priorMass)
	// Normalise with the largest score subtracted, for floating point.
	top := res.NotInCatalogScore
	for _, cd := range cands {
		top = math.Max(top, cd.Score)
	}
	z := math.Exp(res.NotInCatalogScore - top)
	for _, cd := range cands {
		z += math.Exp(cd.Score - top)
	}
	for i := range cands {
		cands[i].Probability = math.Exp(cands[i].Score-top) / z
	}
	res.NotInCatalog = math.Exp(res.NotInCatalogScore-top) / z
	order := make([]int, len(cands))
	keys := make([]string, len(cands))
	for i := range cands {
		order[i] = i
		keys[i] = cands[i].name()
	}
	sort.SliceStable(order, func(a, b int) bool {
		i, j := order[a], order[b]
		if cands[i].Probability != cands[j].Probability {
			return cands[i].Probability > cands[j].Probability
		}
		return keys[i] < keys[j]
	})
	sorted := make([]Candidate, len(cands))
	for k, i := range order {
		sorted[k] = cands[i]
	}
	cands = sorted
	// Texts for the leaders (the conflicts read the first five).
	if !op.text {
		op.text = true
		for i := 0; i < min(len(cands), max(opts.Explain, 5)); i++ {
			cd := &cands[i]
			cd.Reasons = append(priorReasons(cd.Hypothesis, ev, c, true), likelihoods(cd.Hypothesis, ev, op)...)
		}
	}
	res.Candidates = cands
	res.Conflicts = conflicts(ev, res)
	res.Next = nextMeasurements(ev, res, opts.NextCount)
	return res, nil
}

// operatingPoint prepares the marking matches and the input model.
func operatingPoint(c *catalog.Catalog, ev *Evidence) (*opPoint, error) {
	op := &opPoint{legible: catalog.Legible(catalog.NormalizeMarking(ev.Marking))}
	if op.legible {
		op.marks = map[string]catalog.Hit{}
		for _, h := range catalog.Find(c, ev.Marking) {
			if _, have := op.marks[h.Family.ID]; !have {
				op.marks[h.Family.ID] = h
			}
		}
	}
	in, err := OperatingPoint(ev, OperatingOptions{Sweep: SweepPeak})
	if err != nil {
		return nil, err
	}
	op.input = in
	return op, nil
}

// terminalVolts maps the measured voltages onto the hypothesis's terminal
// functions. Known tells whether a function's voltage is measured (or known
// from its wiring: a lead wired to ground is at 0 V).
func terminalVolts(h Hypothesis, ev *Evidence) map[string]float64 {
	v := map[string]float64{}
	for i, fn := range h.Package.Pins {
		p, ok := ev.Lead(i + 1)
		if !ok {
			continue
		}
		if _, have := v[fn]; have {
			continue
		}
		if p.Volts.Set {
			v[fn] = p.Volts.V
		} else if p.WiredTo == WiredGround && (fn == catalog.PinGnd || fn == catalog.PinAdj) {
			v[fn] = 0
		}
	}
	if ev.Case != nil && h.Package.Tab != catalog.TabNone {
		if _, have := v[h.Package.Tab]; !have {
			if ev.Case.Volts.Set {
				v[h.Package.Tab] = ev.Case.Volts.V
			} else if h.Outline != nil && h.Outline.CaseTerminal && ev.Case.WiredTo == WiredGround && h.Package.Tab == catalog.PinGnd {
				v[catalog.PinGnd] = 0
			}
		}
	}
	return v
}

func common(h Hypothesis, v map[string]float64) (float64, bool) {
	if x, ok := v[catalog.PinGnd]; ok {
		return x, true
	}
	x, ok := v[catalog.PinAdj]
	return x, ok
}

// adjustableVout is the output an adjustable hypothesis is set to: the
// measured OUT lead, or what the divider gives.
func adjustableVout(h Hypothesis, ev *Evidence) float64 {
	v := terminalVolts(h, ev)
	if x, ok := v[catalog.PinOut]; ok {
		return math.Abs(x)
	}
	if nw := ev.Network; nw != nil && nw.RTopOhms.Set && nw.RBottomOhms.Set {
		f := h.Family
		vo, err := circuit.DividerVout(f.VrefV, f.IadjTypUA*1e-6, nw.RTopOhms.V, nw.RBottomOhms.V, math.Abs(nw.BottomToVolts.V))
		if err == nil {
			return vo
		}
	}
	return 0
}

// priorReasons returns the prior of h: the family's commonness on a
// geometric scale (each step of the 1–5 scale three times as common; common
// practice, no source), shared among its packages by outline commonness and
// among its voltages by [voltageWeight], and the era.
func priorReasons(h Hypothesis, ev *Evidence, c *catalog.Catalog, text bool) []Reason {
	f := h.Family
	nv := 1
	if !f.Adjustable() {
		nv = len(f.OutputsV)
	}
	say := func(format string, args ...any) string {
		if !text {
			return ""
		}
		return fmt.Sprintf(format, args...)
	}
	rs := []Reason{{"prior", float64(f.Commonness-1) * math.Log(3), say("commonness %d of 5", f.Commonness)}}
	total := 0.0
	for _, p := range f.Packages {
		total += c.Outline(p.Outline).Weight()
	}
	share := h.Outline.Weight() / total
	pkgShare := share
	vs := 1.0
	if nv > 1 {
		sum := 0.0
		for _, v := range f.OutputsV {
			sum += voltageWeight(v)
		}
		vs = voltageWeight(h.VoutV) / sum
		share *= vs
	}
	t := say("%s is %.0f %% of %s's packages", h.Package.Outline, 100*pkgShare, f.ID)
	if nv > 1 && text {
		t += say("; %s V is %.0f %% of its voltages", trimFloat(h.VoutV), 100*vs)
	}
	rs = append(rs, Reason{"prior", math.Log(share), t})
	if ev.Year > 0 && f.Since > ev.Year {
		rs = append(rs, Reason{"year", math.Log(0.02), say("%s appeared in %d, after the equipment was made (%d)", f.ID, f.Since, ev.Year)})
	}
	return rs
}

// likelihoods returns the evidence terms for h, each a log-likelihood ratio
// against a part about which nothing is known.
func likelihoods(h Hypothesis, ev *Evidence, op *opPoint) []Reason {
	rs := make([]Reason, 0, 16)
	add := func(key string, p, flat float64, format string, args ...any) {
		r := Reason{Evidence: key, Weight: math.Log(p / flat)}
		if op.text {
			r.Text = fmt.Sprintf(format, args...)
		}
		rs = append(rs, r)
	}
	o := h.Outline
	f := h.Family
	pk := h.Package
	// Outline, named.
	if ev.Package != "" && o != nil {
		if strings.EqualFold(o.Name, ev.Package) || outlineHasAlias(o, ev.Package) {
			add("package", 0.95, 1.0/12, "package %s named; this variant is %s", ev.Package, o.Name)
		} else {
			add("package", 0.01, 1.0/12, "package %s named, but this variant is %s", ev.Package, o.Name)
		}
	}
	// Outline, measured.
	if m := ev.Outline; m != nil && o != nil {
		if m.Leads != nil {
			if *m.Leads == o.Leads {
				add("outline.leads", 0.97, 0.25, "%d leads, as %s has", *m.Leads, o.Name)
			} else {
				add("outline.leads", 0.005, 0.25, "%d leads measured, %s has %d", *m.Leads, o.Name, o.Leads)
			}
		}
		if m.PitchMM.Set {
			sigma := 0.1 + 0.04*o.PitchMM
			pdf := math.Exp(-0.5*sq((m.PitchMM.V-o.PitchMM)/sigma)) / (sigma * math.Sqrt(2*math.Pi))
			add("outline.pitch_mm", 0.95*pdf+0.05/20, 1.0/20, "pitch %.2f mm measured, %s is %.2f mm", m.PitchMM.V, o.Name, o.PitchMM)
		}
		if m.HoleSpacingMM.Set {
			if o.HoleSpacingMM > 0 {
				sigma := 0.6
				pdf := math.Exp(-0.5*sq((m.HoleSpacingMM.V-o.HoleSpacingMM)/sigma)) / (sigma * math.Sqrt(2*math.Pi))
				add("outline.hole_spacing_mm", 0.95*pdf+0.05/50, 1.0/50, "holes %.1f mm apart, %s %.2f mm", m.HoleSpacingMM.V, o.Name, o.HoleSpacingMM)
			} else {
				add("outline.hole_spacing_mm", 0.01, 1.0/50, "two mounting holes measured; %s has none or one", o.Name)
			}
		}
		if m.MetalCan != nil {
			if *m.MetalCan == o.MetalCan {
				add("outline.metal_can", 0.97, 0.5, "metal can %v, as %s", *m.MetalCan, o.Name)
			} else {
				add("outline.metal_can", 0.01, 0.5, "metal can %v measured; %s is not", *m.MetalCan, o.Name)
			}
		}
	}
	// Leads: continuity.
	for _, n := range ev.Leads() {
		p, _ := ev.Lead(n)
		if p.WiredTo == "" {
			continue
		}
		key := fmt.Sprintf("pins.%d", n)
		if n > len(pk.Pins) {
			add(key, 0.01, pFlatWired, "lead %d measured, but %s has only %d leads", n, pk.Outline, len(pk.Pins))
			continue
		}
		fn := pk.Pins[n-1]
		pr := wiredLikelihood[fn][p.WiredTo]
		add(key, pr, pFlatWired, "lead %d to %s: this pinout puts %s there", n, p.WiredTo, functionWords[fn])
	}
	// Case.
	if cs := ev.Case; cs != nil && o != nil {
		switch {
		case o.CaseTerminal:
			if cs.TiedToPin != nil && *cs.TiedToPin > 0 {
				add("case.tied_to_pin", 0.02, 1.0/3, "case tied to lead %d, but on %s the can is a terminal of its own (%s)", *cs.TiedToPin, o.Name, pk.Tab)
			} else if cs.TiedToPin != nil {
				add("case.tied_to_pin", 0.95, 1.0/3, "case tied to no lead: on %s the can is the %s terminal", o.Name, functionWords[pk.Tab])
			}
			if cs.WiredTo != "" {
				add("case.wired_to", wiredLikelihood[pk.Tab][cs.WiredTo], pFlatWired, "can to %s: this variant's can is %s", cs.WiredTo, functionWords[pk.Tab])
			}
		default:
			if cs.TiedToPin != nil {
				k := *cs.TiedToPin
				flat := 1.0 / float64(len(pk.Pins)+1)
				want := 0
				if pk.Tab != catalog.TabNone {
					want = pk.Lead(pk.Tab)
				}
				switch {
				case k == want && want == 0:
					add("case.tied_to_pin", 0.9, flat, "case tied to no lead: %s has no live tab", pk.Outline)
				case k == want:
					add("case.tied_to_pin", 0.92, flat, "case tied to lead %d: this variant's tab is %s", k, functionWords[pk.Tab])
				case want == 0:
					add("case.tied_to_pin", 0.04, flat, "case tied to lead %d, but %s has no tab tied to a lead", k, pk.Outline)
				case k == 0:
					add("case.tied_to_pin", 0.03, flat, "case tied to no lead, but this variant's tab is %s (lead %d)", functionWords[pk.Tab], want)
				default:
					add("case.tied_to_pin", 0.02, flat, "case tied to lead %d, but this variant's tab is %s (lead %d)", k, functionWords[pk.Tab], want)
				}
			} else if cs.WiredTo != "" && pk.Tab != catalog.TabNone {
				add("case.wired_to", wiredLikelihood[pk.Tab][cs.WiredTo], pFlatWired, "case to %s: this variant's tab is %s", cs.WiredTo, functionWords[pk.Tab])
			}
		}
	}
	// Voltages mapped through the pinout.
	tv := terminalVolts(h, ev)
	vout, haveOut := tv[catalog.PinOut]
	vin, haveIn := tv[catalog.PinIn]
	vcom, haveCom := common(h, tv)
	sign := 1.0
	if f.Negative() {
		sign = -1
	}
	if haveOut && haveCom {
		d := vout - vcom
		want := f.VrefV
		what := "reference"
		if !f.Adjustable() {
			want = h.VoutV
			what = "output"
		}
		allowed := f.Tolerance*want + 2*(meterAbsV+meterRel*math.Abs(d))
		z := math.Abs(d-sign*want) / allowed
		add("voltages.regulation", window(z), 0.05, "OUT − %s = %+.3f V; the %s is %+.3f V ±%.3f", f.Common(pk), d, what, sign*want, allowed)
	}
	if haveOut && !haveCom && !f.Adjustable() {
		// Only the output is known: most fixed parts have their common lead
		// at ground (then OUT reads the nominal voltage); a lifted ground
		// reads higher (common practice, no source: 80 / 20).
		allowed := f.Tolerance*h.VoutV + 2*(meterAbsV+meterRel*math.Abs(vout))
		z := math.Abs(vout-sign*h.VoutV) / allowed
		lifted := 0.002
		if sign*vout > h.VoutV {
			lifted = 0.2 * 0.05
		}
		add("voltages.output", 0.8*window(z)+lifted, 0.05, "OUT reads %+.3f V (common lead not measured); this part's output is %+.3f V ±%.3f", vout, sign*h.VoutV, allowed)
	}
	if haveIn && haveOut {
		head := sign * (vin - vout)
		// The datasheet's worst-case dropout, the same figure replacement
		// checks against (catalog.Family.HeadroomNeeded). A running part may
		// be a typical one, which regulates with less: see typicalHeadroom.
		drop := f.HeadroomNeeded()
		thr := drop * typicalHeadroom
		switch {
		case head < -0.3:
			add("voltages.headroom", 0.003, 0.3, "IN − OUT = %+.2f V: a %s regulator's input must be %s its output", vin-vout, f.Polarity, map[bool]string{true: "below", false: "above"}[f.Negative()])
		case head < thr:
			d := (thr - head) / drop
			add("voltages.headroom", 0.9*math.Exp(-0.5*sq(d/0.15))+0.01, 0.3, "headroom %.2f V, below even a typical part's %.2f V (worst-case dropout %.2f V)", head, thr, drop)
		default:
			add("voltages.headroom", 0.9, 0.3, "headroom %.2f V, above a typical part's %.2f V (worst-case dropout %.2f V)", head, thr, drop)
		}
	}
	// Regulator current against the rating.
	if out := ev.Output; out != nil && out.Amps.Set && out.Amps.V > 0 {
		i := out.Amps.V
		share := 0.0
		if b := ev.Bypass; b != nil && b.Ohms.V > 0 && haveIn && haveOut {
			// The resistor's share, the same rule as replacement's (circuit.Bypass).
			if br, err := (circuit.Bypass{ROhm: b.Ohms.V, VinMinV: math.Abs(vin), VinMaxV: math.Abs(vin), VoutV: math.Abs(vout), LoadMinA: i, LoadMaxA: i}).Solve(); err == nil {
				share = br.ResistorMinA
			}
		}
		ireg := math.Max(0, i-share)
		rating := f.Current(pk)
		r := ireg / rating
		text := fmt.Sprintf("regulator current %.3f A against %.3g A rated", ireg, rating)
		if share > 0 {
			text = fmt.Sprintf("regulator current %.3f A (%.3f A load less %.3f A through the bypass resistor) against %.3g A rated", ireg, i, share, rating)
		}
		// Designers leave margin below the rating and seldom use a large part
		// for a tiny load (common practice, no source).
		switch {
		case r > 1:
			add("current", 0.6*math.Exp(-0.5*sq((r-1)/0.15))+0.01, 0.3, "%s: over the rating", text)
		case r > 0.8:
			add("current", 0.6, 0.3, "%s: close to the rating", text)
		case r < 0.05:
			add("current", 0.3, 0.3, "%s: a large part for so small a load", text)
		default:
			add("current", 0.9, 0.3, "%s", text)
		}
	}
	// Input peak against the input maximum.
	inPeak := op.input.Peak
	if haveIn {
		inPeak = op.input.PeakFor(vin)
	}
	peak, from := inPeak.V, inPeak.At
	if peak > 0 {
		// A part that has been running stood its running limit (start-up is
		// replacement's question): the same rule, catalog.Family.InputLimit.
		il := f.InputLimit(h.VoutV)
		limit, what := il.RunV, il.What
		if f.Adjustable() && h.VoutV > 0 && limit > il.StartV {
			what += " plus the output"
		}
		if limit > 0 {
			q := peak / limit
			switch {
			case q <= 1:
				add("input_max", 0.9, 0.5, "input peak %.1f V (%s) within the %s %.0f V", peak, from, what, limit)
			case q <= 1.05:
				add("input_max", 0.3, 0.5, "input peak %.1f V (%s) just over the %s %.0f V", peak, from, what, limit)
			case q <= 1.15:
				add("input_max", 0.05, 0.5, "input peak %.1f V (%s) over the %s %.0f V", peak, from, what, limit)
			default:
				add("input_max", 0.01, 0.5, "input peak %.1f V (%s) far over the %s %.0f V", peak, from, what, limit)
			}
		}
	}
	// Divider: what it predicts for this hypothesis against the measured output.
	if nw := ev.Network; nw != nil && nw.RTopOhms.Set && nw.RBottomOhms.Set && haveOut {
		bottom := nw.BottomToVolts.V
		rt, rb := nw.RTopOhms.V, nw.RBottomOhms.V
		var pred, spread float64
		if f.Adjustable() {
			pred, _ = circuit.DividerVout(f.VrefV, f.IadjTypUA*1e-6, rt, rb, sign*bottom)
			spread = f.Tolerance*f.VrefV*(1+rb/rt) + f.IadjUA*1e-6*rb
		} else {
			pred, _ = circuit.DividerVout(h.VoutV, f.IqTypMA*1e-3, rt, rb, sign*bottom)
			spread = f.Tolerance*h.VoutV*(1+rb/rt) + f.IqMA*1e-3*rb
		}
		allowed := spread + 2*(meterAbsV+meterRel*math.Abs(vout))
		z := math.Abs(math.Abs(vout)-pred) / allowed
		add("network", window(z), 0.05, "the divider (%s over %s) gives %.2f V with this part; %.2f V measured", ohmsText(rt), ohmsText(rb), sign*pred, vout)
	}
	if nw := ev.Network; nw != nil && nw.Trimmer != nil && *nw.Trimmer {
		if f.Adjustable() {
			add("network.trimmer", 0.7, 0.5, "a trimmer in the network: usual for an adjustable part")
		} else {
			add("network.trimmer", 0.3, 0.5, "a trimmer in the network: a fixed part would need a lifted ground")
		}
	}
	// Marking, decoded by the catalog (prefix, number, voltage, package
	// suffix; date codes left out): a fit confirming n characters of the
	// number is worth n·ln 4 (a character read by chance matches about one
	// time in four among the characters regulator markings use; common
	// practice, no source). A package suffix that names another outline
	// takes two characters' worth off.
	if op.legible {
		m, found := op.marks[f.ID]
		voltOK, outlineOK := m.Fits(o, h.VoutV)
		switch {
		case !found:
			add("marking", 0.01, 0.1, "marking %q fits no marking of %s", ev.Marking, f.ID)
		case m.How == "fuzzy" || !voltOK:
			add("marking", 0.05, 0.1, "marking %q %s; not this variant", ev.Marking, m.Detail)
		case !outlineOK:
			n := math.Max(m.Score-2, 0)
			add("marking", 0.9, 0.9*math.Pow(4, -n), "marking %q %s; not this package", ev.Marking, m.Detail)
		default:
			add("marking", 0.9, 0.9*math.Pow(4, -math.Max(m.Score, 0)), "marking %q %s", ev.Marking, m.Detail)
		}
	}
	return rs
}

// voltageWeight is how common an output voltage is among fixed regulators:
// 5, 12, 15 and 3.3 V three times as common as 6, 8, 9, 10, 18, 24, 1.8 and
// 2.5 V, and those twice as common as odd values such as 8.5 or 5.2 V
// (common practice, no source).
func voltageWeight(v float64) float64 {
	switch v {
	case 5, 12, 15, 3.3:
		return 3
	case 6, 8, 9, 10, 18, 24, 1.8, 2.5:
		return 1
	}
	return 0.5
}

func outlineHasAlias(o *catalog.Outline, name string) bool {
	for _, a := range o.Aliases {
		if strings.EqualFold(a, name) {
			return true
		}
	}
	return false
}

func sq(x float64) float64 { return x * x }

func ohmsText(r float64) string {
	switch {
	case r >= 1e6:
		return trimFloat(r/1e6) + " MΩ"
	case r >= 1e3:
		return trimFloat(r/1e3) + " kΩ"
	}
	return trimFloat(r) + " Ω"
}
