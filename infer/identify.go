package infer

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/catalog"
)

// Hypothesis is one thing the unknown part could be.
type Hypothesis struct {
	Family  *catalog.Family  // the family
	Package *catalog.Package // the package variant (one of Family.Packages)
	Outline *catalog.Outline // the variant's outline; nil only if the catalog lacks it
	// VoutV is the output voltage as a magnitude: a fixed family's nominal
	// voltage, or what an adjustable part is set to (measured or from the
	// divider); 0 when unknown or when the part is not a regulator.
	VoutV float64
}

// Label returns "family package vout", e.g. "78xx TO-220 5 V"; a package
// variant that shares its outline with another is named in brackets.
func (h Hypothesis) Label() string { return h.labelWith(h.Package.Variant) }

// labelWith is the label with variant named in brackets ("" for none).
func (h Hypothesis) labelWith(variant string) string {
	s := h.Family.ID + " " + h.Package.Outline
	if variant != "" {
		s += " (" + variant + ")"
	}
	if h.VoutV > 0 {
		s += fmt.Sprintf(" %s%s V", h.Family.SignText(), trimFloat(h.VoutV))
	}
	return s
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
	// Variants are the other package variants that look the same on the
	// board (same outline, pinout and tab; another rating or maker), ranked
	// with this one: see the last prior reason.
	Variants []*catalog.Package

	label string  // Label(), kept
	share float64 // with Variants: this variant's share of the look-alikes
}

// Label is the hypothesis's label; a candidate that stands for look-alike
// variants names its own only when the evidence gives it nine tenths of
// their mass or more.
func (c Candidate) Label() string {
	if len(c.Variants) > 0 && c.share < 0.9 {
		return c.labelWith("")
	}
	return c.Hypothesis.Label()
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
	// Conflicts lists evidence that contradicts itself or every leader, and
	// the cross-checks that failed (a slip in the notes, a misread marking,
	// reversed meter leads, a package name that does not fit the outline).
	Conflicts []string
	// Next lists the most informative measurements still open, best first.
	Next []Measurement
	// PriorOnly is true when no evidence bore on the ranking.
	PriorOnly bool
	// Assumptions lists defaults the model used.
	Assumptions []string
	// InputPeakV is the highest input the circuit can present (high mains,
	// light load), from the input model; 0 when not computable.
	InputPeakV float64
}

// ExplainAll, as [Options.Explain], writes the reasons' text for every
// candidate (what a JSON document of the whole ranking needs).
const ExplainAll = -1

// defaultExplain is how many leaders get their reasons' text by default: the
// conflicts read the first five.
const defaultExplain = 5

// Options tune [Identify]. The zero value is the cheap, usual setting.
type Options struct {
	// NextCount is how many next measurements to return (3 if zero).
	NextCount int
	// Explain is how many leading candidates get the text of their reasons:
	// 0 means the first five, [ExplainAll] every candidate. Every candidate
	// always has its reasons' weights, so the score is the same either way;
	// only the text costs time.
	Explain int
	// Tests says which measurements may be suggested: every kind (the zero
	// value), or [ReadingsOnly] for a front end that asks only what a meter,
	// a scope or a look can tell without rework.
	Tests TestScope
}

// TestScope says which kinds of measurement [Identify] suggests.
type TestScope int

const (
	// AllTests suggests readings and bench tests (a bench supply or a test
	// load in place of the circuit's own), each with its caution.
	AllTests TestScope = iota
	// ReadingsOnly suggests no bench test.
	ReadingsOnly
)

// Identify ranks the catalog's hypotheses for the evidence: a prior for
// each, one likelihood term per kind of evidence (see [likelihoodTerms]),
// normalised against a "not in the catalog" hypothesis; then the
// cross-checks and the measurements that would best separate the leaders.
func Identify(c *catalog.Catalog, ev *Evidence, opts Options) (*Result, error) {
	if opts.NextCount == 0 {
		opts.NextCount = 3
	}
	sc, err := newScene(c, ev)
	if err != nil {
		return nil, err
	}
	sc.text = opts.Explain == ExplainAll
	hyps := hypotheses(c, ev)
	res := &Result{Assumptions: sc.input.Assumptions, InputPeakV: sc.input.Peak.V}
	cands := make([]Candidate, len(hyps))
	priorMass := 0.0
	evidenceUsed := false
	// The candidates' reasons share arrays of reasonChunk (each slice capped
	// at its own length, so a later append copies): a few allocations for
	// all the hypotheses, not four per hypothesis, and none copied to grow.
	var arena []Reason
	for i, h := range hyps {
		if cap(arena)-len(arena) < reasonChunk/16 {
			arena = make([]Reason, 0, reasonChunk)
		}
		start := len(arena)
		arena = appendPriorReasons(arena, h, ev, c, sc.text)
		// The not-in-catalog prior is a share of the catalog's mass before
		// the era: when every family is younger than the equipment, the
		// part is likelier something the catalog lacks.
		prior := 0.0
		for _, r := range arena[start:] {
			if r.Evidence == "prior" {
				prior += r.Weight
			}
		}
		priorMass += math.Exp(prior)
		np := len(arena)
		arena = sc.appendLikelihoods(arena, h)
		evidenceUsed = evidenceUsed || len(arena) > np
		rs := arena[start:len(arena):len(arena)]
		score := 0.0
		for _, r := range rs {
			score += r.Weight
		}
		cands[i] = Candidate{Hypothesis: h, Score: score, Reasons: rs}
	}
	res.PriorOnly = !evidenceUsed
	cands = mergeVariants(cands)
	res.NotInCatalogScore = math.Log(pNICPrior / (1 - pNICPrior) * priorMass)
	res.Candidates, res.NotInCatalog = rank(cands, res.NotInCatalogScore)
	// Texts for the leaders.
	if !sc.text {
		sc.text = true
		n := opts.Explain
		if n <= 0 {
			n = defaultExplain
		}
		for i := 0; i < min(len(res.Candidates), max(n, defaultExplain)); i++ {
			cd := &res.Candidates[i]
			var merged []Reason
			if n := len(cd.Reasons); len(cd.Variants) > 0 {
				merged = cd.Reasons[n-1:] // the look-alikes' prior reason stays last
			}
			cd.Reasons = append(append(priorReasons(cd.Hypothesis, ev, c, true), sc.likelihoods(cd.Hypothesis)...), merged...)
		}
	}
	res.Conflicts = sc.conflicts(res)
	res.Next = nextMeasurements(c, ev, res, opts)
	return res, nil
}

// reasonChunk is how many reasons [Identify] allocates at a time (a
// hypothesis has 3 to 15 of them).
const reasonChunk = 1024

// hypotheses lists every (family, package, voltage) of the catalog: one per
// output voltage of a fixed family, one per package of an adjustable family
// (its voltage from the evidence) and of a look-alike without set outputs.
func hypotheses(c *catalog.Catalog, ev *Evidence) []Hypothesis {
	var hyps []Hypothesis
	for _, f := range c.Sorted() {
		for i := range f.Packages {
			p := &f.Packages[i]
			o := c.Outline(p.Outline)
			switch {
			case f.Adjustable():
				h := Hypothesis{Family: f, Package: p, Outline: o}
				h.VoutV = adjustableVout(h, ev)
				hyps = append(hyps, h)
			case len(f.OutputsV) == 0:
				hyps = append(hyps, Hypothesis{Family: f, Package: p, Outline: o})
			default:
				for _, v := range f.OutputsV {
					hyps = append(hyps, Hypothesis{Family: f, Package: p, Outline: o, VoutV: v})
				}
			}
		}
	}
	return hyps
}

// rank normalises the scores against the not-in-catalog score (the largest
// subtracted first, for floating point) and sorts the candidates, most
// probable first, ties by label.
func rank(cands []Candidate, nicScore float64) ([]Candidate, float64) {
	top := nicScore
	for _, cd := range cands {
		top = math.Max(top, cd.Score)
	}
	z := math.Exp(nicScore - top)
	for _, cd := range cands {
		z += math.Exp(cd.Score - top)
	}
	order := make([]int, len(cands))
	for i := range cands {
		cands[i].Probability = math.Exp(cands[i].Score-top) / z
		order[i] = i
	}
	// Sort indices, not the (large) candidates.
	sort.SliceStable(order, func(a, b int) bool {
		i, j := order[a], order[b]
		if cands[i].Probability != cands[j].Probability {
			return cands[i].Probability > cands[j].Probability
		}
		return cands[i].name() < cands[j].name() // formatted on a tie only
	})
	sorted := make([]Candidate, len(cands))
	for k, i := range order {
		sorted[k] = cands[i]
	}
	return sorted, math.Exp(nicScore-top) / z
}

func trimFloat(v float64) string {
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.2f", v), "0"), ".")
}

func ohmsText(r float64) string {
	switch {
	case r >= 1e6:
		return trimFloat(r/1e6) + " MΩ"
	case r >= 1e3:
		return trimFloat(r/1e3) + " kΩ"
	}
	return trimFloat(r) + " Ω"
}

func sq(x float64) float64 { return x * x }

func outlineHasAlias(o *catalog.Outline, name string) bool {
	for _, a := range o.Aliases {
		if strings.EqualFold(a, name) {
			return true
		}
	}
	return false
}

// namesOutline reports whether the evidence's package name is o's name or alias.
func namesOutline(name string, o *catalog.Outline) bool {
	return o != nil && (strings.EqualFold(o.Name, name) || outlineHasAlias(o, name))
}
