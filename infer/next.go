package infer

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/catalog"
)

// AskKind is how a measurement's answer is written.
type AskKind string

// The answer kinds.
const (
	AskChoice AskKind = "choice" // one of Choices
	AskNumber AskKind = "number" // a number, with Unit (SI prefixes and RKM code allowed)
	AskText   AskKind = "text"   // free text
)

// String returns the word.
func (k AskKind) String() string { return string(k) }

// Measurement is a suggested next measurement: what to do, which evidence
// key the answer fills, and what each likely outcome would mean.
type Measurement struct {
	// Key is the evidence key the answer fills, e.g. "pins.2.volts".
	Key string `json:"key"`
	// Kind is how the answer is written; Choices are the allowed words of
	// a choice, Unit the unit of a number.
	Kind    AskKind  `json:"kind"`
	Choices []string `json:"choices,omitempty"`
	Unit    string   `json:"unit,omitempty"`
	// Measure says in a few words what to measure.
	Measure string `json:"measure"`
	// Prompt says in plain words what to connect where, with the power off
	// or on, and what to write down.
	Prompt string `json:"prompt"`
	// Powered is true for a measurement made with the equipment running;
	// Safety is then the caution to show first.
	Powered bool   `json:"powered"`
	Safety  string `json:"safety,omitempty"`
	// GainBits is the expected information gain over the leaders, bits.
	GainBits float64 `json:"gain_bits"`
	// Outcomes says what each likely outcome would mean.
	Outcomes []string `json:"outcomes"`
}

// nextMeasurements ranks the measurements still open by expected
// information gain over the leaders (mutual information between the leading
// hypothesis and the outcome).
func nextMeasurements(c *catalog.Catalog, ev *Evidence, res *Result, opts Options) []Measurement {
	n := opts.NextCount
	// The leaders: the hypotheses that carry 95 % of the posterior (at most
	// 20, at least 2), renormalised; the expected drop in entropy is taken
	// over them.
	var hs []Candidate
	mass := 0.0
	for _, c := range res.Candidates {
		if (mass >= 0.95 && len(hs) >= 2) || len(hs) >= 20 {
			break
		}
		hs = append(hs, c)
		mass += c.Probability
	}
	for i := range hs {
		hs[i].Probability /= mass
	}
	// While the leader is under 95 %, something is always offered: the
	// best of what is left, however little it is expected to tell.
	floor := 0.01
	if len(res.Candidates) > 0 && res.Candidates[0].Probability < 0.95 {
		floor = 1e-6
	}
	var out []Measurement
	effort := map[string]float64{}
	for _, m := range asks(c, ev, hs) {
		if m.effort >= benchEffort && opts.Tests == ReadingsOnly {
			continue
		}
		gain, joint := mutualInfo(hs, 0, m.predict)
		if gain < floor {
			continue
		}
		a := m.Measurement
		a.GainBits, a.Outcomes = gain, outcomeLines(joint, m.describe)
		if a.Powered && a.Safety == "" {
			a.Safety = poweredSafety
		}
		out = append(out, a)
		effort[a.Key] = max(1, m.effort)
	}
	// The most information per effort first: a reading before a bench test.
	sort.SliceStable(out, func(i, j int) bool { return out[i].GainBits/effort[out[i].Key] > out[j].GainBits/effort[out[j].Key] })
	if len(out) > n {
		out = out[:n]
	}
	return out
}

// outcomeDist is a measurement's predicted outcome distribution for one hypothesis.
type outcomeDist map[string]float64

// wiringDist is the distribution of the wiring word of a lead of function fn.
func wiringDist(f *catalog.Family, fn string) outcomeDist {
	d := outcomeDist{}
	for i, p := range wiringOf(f, fn) {
		d[string(wirings.words[i])] = p
	}
	return d
}

func troughBucket(h float64) string {
	switch {
	case h < 1:
		return "below 1 V"
	case h < 2:
		return "1 to 2 V"
	}
	return "above 2 V"
}

var currentBuckets = []float64{0.15, 0.6, 1.2, 2, 4}

func bucketName(i int) string {
	switch {
	case i == 0:
		return fmt.Sprintf("below %g A", currentBuckets[0])
	case i == len(currentBuckets):
		return fmt.Sprintf("above %g A", currentBuckets[i-1])
	}
	return fmt.Sprintf("%g to %g A", currentBuckets[i-1], currentBuckets[i])
}

// logUniformBuckets spreads a log-uniform distribution on [lo, hi] over the
// buckets bounded by edges.
func logUniformBuckets(lo, hi float64, edges []float64) outcomeDist {
	d := outcomeDist{}
	l0, l1 := math.Log(lo), math.Log(hi)
	bounds := append([]float64{1e-9}, edges...)
	bounds = append(bounds, 1e9)
	for i := 0; i+1 < len(bounds); i++ {
		a, b := math.Max(math.Log(bounds[i]), l0), math.Min(math.Log(bounds[i+1]), l1)
		if b > a {
			d[bucketName(i)] = (b - a) / (l1 - l0)
		}
	}
	return d
}

// mutualInfo returns I(H; O) in bits over the hypotheses (the not-in-catalog
// hypothesis spreads evenly over the outcomes), and the joint P(h, o).
func mutualInfo(hs []Candidate, nic float64, predict func(Hypothesis) outcomeDist) (float64, map[string][]weighted) {
	joint := map[string][]weighted{}
	po := map[string]float64{}
	total := nic
	condEntropy := 0.0
	for i := range hs {
		c := &hs[i]
		d := predict(c.Hypothesis)
		total += c.Probability
		for k, p := range d {
			if p <= 0 {
				continue
			}
			joint[k] = append(joint[k], weighted{c.name(), c.Probability * p})
			po[k] += c.Probability * p
			condEntropy -= c.Probability * p * math.Log2(p)
		}
	}
	if len(po) == 0 || total <= 0 {
		return 0, joint
	}
	n := float64(len(po))
	for k := range po {
		po[k] += nic / n
	}
	condEntropy += nic * math.Log2(n)
	h := 0.0
	for _, p := range po {
		q := p / total
		if q > 0 {
			h -= q * math.Log2(q)
		}
	}
	return math.Max(0, h-condEntropy/total), joint
}

type weighted struct {
	label string
	p     float64
}

func outcomeLines(joint map[string][]weighted, describe func(string) string) []string {
	type oc struct {
		key string
		p   float64
		hs  []weighted
	}
	var ocs []oc
	total := 0.0
	for k, ws := range joint {
		p := 0.0
		for _, w := range ws {
			p += w.p
		}
		total += p
		ocs = append(ocs, oc{k, p, ws})
	}
	sort.Slice(ocs, func(i, j int) bool {
		if ocs[i].p != ocs[j].p {
			return ocs[i].p > ocs[j].p
		}
		return ocs[i].key < ocs[j].key
	})
	var out []string
	for _, o := range ocs {
		if o.p/total < 0.01 || len(out) == 4 {
			break
		}
		// Merge the same label (several voltages of one family and package may share an outcome).
		sort.SliceStable(o.hs, func(i, j int) bool { return o.hs[i].p > o.hs[j].p })
		var parts []string
		for _, w := range o.hs[:min(2, len(o.hs))] {
			parts = append(parts, fmt.Sprintf("%s %.0f %%", w.label, 100*w.p/o.p))
		}
		out = append(out, fmt.Sprintf("%s (%.0f %%) → %s", describe(o.key), 100*o.p/total, strings.Join(parts, ", ")))
	}
	return out
}
