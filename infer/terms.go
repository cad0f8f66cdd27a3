package infer

import (
	"fmt"
	"math"

	"github.com/whichreg/whichreg/catalog"
)

// A likelihood term weighs one kind of evidence for one hypothesis: it adds
// nothing when that evidence is missing, and otherwise one or more reasons,
// each the log of P(evidence | hypothesis) over P(evidence | a part about
// which nothing is known).
type term func(sc *scene, h Hypothesis, v voltsView, r *reasons)

// likelihoodTerms is the list of terms, in the order their reasons are shown.
func likelihoodTerms() []term {
	return []term{
		termPackage, termOutline, termWiring, termCase, termMounting,
		termRegulation, termOutputOnly, termPolarity, termHeadroom, termBenchDropout,
		termControlDrop, termConduction, termShunt,
		termCurrent, termBenchLoad, termInputMax, termTransient, termDivider, termCommonParts, termTrimmer,
		termMarking,
	}
}

// Probability constants of the likelihoods. They are judgement, not
// datasheet values: "common practice, no source".
const (
	meterAbsV = 0.02 // meter error: 20 mV plus 0.5 % of reading
	meterRel  = 0.005
	// vetoRatio is a near-veto: evidence this hypothesis cannot produce is
	// taken as 10 000 times less likely under it than under an unknown part
	// (only a slip in the notes explains it), so that a family contradicted
	// by it cannot lead while a better fit, a look-alike or "not in the
	// catalog" remains.
	vetoRatio = 1e-4
)

// typicalHeadroom is the fraction of the datasheet's worst-case dropout
// ([catalog.Family.HeadroomNeeded]) with which a typical part still
// regulates: identification and the next-measurement planner ask whether a
// running part could be this one, not whether every part is guaranteed to
// work, which replacement asks with the whole figure (typical dropouts are
// 50–90 % of the maximum: LM2940 0.5/1.0 V, LM1117 1.2/1.4 V, LM7805 about 1.7/2 V; common
// practice, no source for the single fraction).
const typicalHeadroom = 0.8

// reasons collects a hypothesis's likelihood reasons, writing their text
// only when asked (the text costs more than the arithmetic).
type reasons struct {
	rs     []Reason
	start  int // rs[:start] belong to the caller (the prior), not to the terms
	text   bool
	vetoAt int // index of the first near-veto, -1 = none
}

// add appends the term log(p / flat).
func (r *reasons) add(key string, p, flat float64, format string, args ...any) {
	x := Reason{Evidence: key, Weight: math.Log(p / flat)}
	if r.text {
		x.Text = fmt.Sprintf(format, args...)
	}
	r.rs = append(r.rs, x)
}

// say formats a reason's text, or returns "" when no text is wanted (the
// ranking of every hypothesis needs only the weights).
func (r *reasons) say(format string, args ...any) string {
	if !r.text {
		return ""
	}
	return fmt.Sprintf(format, args...)
}

// veto appends a near-veto: evidence the hypothesis cannot produce. See
// [reasons.settle] for its weight.
func (r *reasons) veto(key string, format string, args ...any) {
	if r.vetoAt < 0 {
		r.vetoAt = len(r.rs)
	}
	if r.text {
		format = "impossible for this part: " + format
	}
	r.add(key, vetoRatio, 1, format, args...)
}

// settle gives the first near-veto its weight: log(vetoRatio), less all the
// support the other evidence gives the hypothesis. Evidence a part cannot
// produce outweighs any amount of agreeing evidence (a perfect pinout fit
// does not make a 78L05 work on 0.6 V headroom), so a contradicted family
// stays below "not in the catalog" and below every family that fits.
func (r *reasons) settle() {
	if r.vetoAt < 0 {
		return
	}
	support := 0.0
	for i, x := range r.rs[r.start:] {
		if r.start+i != r.vetoAt && x.Weight > 0 {
			support += x.Weight
		}
	}
	if support == 0 {
		return
	}
	v := &r.rs[r.vetoAt]
	v.Weight -= support
	if r.text {
		v.Text += fmt.Sprintf("; this outweighs the %+.2f the rest of the evidence gives", support)
	}
}

// likelihoods returns the evidence terms for h.
func (sc *scene) likelihoods(h Hypothesis) []Reason {
	return sc.appendLikelihoods(make([]Reason, 0, 16), h)
}

// appendLikelihoods appends [scene.likelihoods] to dst; a near-veto is
// settled against the appended terms only.
func (sc *scene) appendLikelihoods(dst []Reason, h Hypothesis) []Reason {
	r := &reasons{rs: dst, start: len(dst), text: sc.text, vetoAt: -1}
	v := viewWith(h, sc.terminalVolts(h))
	for _, t := range likelihoodTerms() {
		t(sc, h, v, r)
	}
	r.settle()
	return r.rs
}

// voltsView is the lead voltages of the evidence mapped through one
// hypothesis's pinout.
type voltsView struct {
	tv       map[string]float64 // by function
	out, in  float64
	com      float64
	haveOut  bool // the output (or a switching IC's feedback lead)
	haveIn   bool
	haveCom  bool
	outFn    string // OUT or FB
	sign     float64
	polarity catalog.Polarity
}

func viewOf(h Hypothesis, ev *Evidence) voltsView {
	return viewWith(h, terminalVolts(h, ev))
}

// viewWith is [viewOf] with the terminal voltages given (read, never
// written).
func viewWith(h Hypothesis, tv map[string]float64) voltsView {
	v := voltsView{tv: tv, outFn: senseFn(h), sign: 1, polarity: h.Family.Polarity}
	v.out, v.haveOut = v.tv[v.outFn]
	v.in, v.haveIn = v.tv[catalog.PinIn]
	v.com, v.haveCom = common(v.tv)
	v.sign = h.Family.Signed(1)
	return v
}

// window is the likelihood of a measured deviation z (in units of the
// allowed error): 0.9 inside, falling off as a Gaussian outside, with a
// floor for gross mistakes.
func window(z float64) float64 {
	if z <= 1 {
		return 0.9
	}
	return 0.9*math.Exp(-2*(z-1)*(z-1)) + 0.002
}
