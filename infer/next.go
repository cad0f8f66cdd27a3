package infer

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/catalog"
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

// outcomeDist is a measurement's predicted outcome distribution for one hypothesis.
type outcomeDist map[string]float64

// wiringDist is the distribution of the wiring word of a lead of function fn.
func wiringDist(fn string) outcomeDist {
	d := outcomeDist{}
	for w, p := range wiredLikelihood[fn] {
		d[string(w)] = p
	}
	return d
}

type measurement struct {
	name    string
	predict func(h Hypothesis) outcomeDist
	// describe turns an outcome key into words.
	describe func(key string) string
}

// nextMeasurements ranks the measurements still open by expected
// information gain over the leaders (mutual information between the leading
// hypothesis and the outcome).
func nextMeasurements(ev *Evidence, res *Result, n int) []Measurement {
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
	maxLeads := 0
	for _, c := range hs {
		if c.Probability > 0.01 {
			maxLeads = max(maxLeads, len(c.Package.Pins))
		}
	}
	maxLeads = min(maxLeads, 8)
	var ms []measurement
	for k := 1; k <= maxLeads; k++ {
		k := k
		p, _ := ev.Lead(k)
		if p.WiredTo == "" {
			ms = append(ms, measurement{
				name: fmt.Sprintf("continuity of lead %d (power off): where it goes on the board", k),
				predict: func(h Hypothesis) outcomeDist {
					if k > len(h.Package.Pins) {
						return outcomeDist{"none": 1}
					}
					return wiringDist(h.Package.Pins[k-1])
				},
				describe: func(key string) string { return fmt.Sprintf("lead %d to %s", k, key) },
			})
		}
		if !p.Volts.Set {
			ms = append(ms, measurement{
				name: fmt.Sprintf("voltage on lead %d (powered, to board ground)", k),
				predict: func(h Hypothesis) outcomeDist {
					if k > len(h.Package.Pins) {
						return outcomeDist{"none": 1}
					}
					return outcomeDist{leadLevel(h, h.Package.Pins[k-1]): 1}
				},
				describe: func(key string) string { return fmt.Sprintf("lead %d reads %s", k, key) },
			})
		}
	}
	for i := 1; i <= min(maxLeads, 3); i++ {
		for j := i + 1; j <= min(maxLeads, 3); j++ {
			i, j := i, j
			pi, _ := ev.Lead(i)
			pj, _ := ev.Lead(j)
			if pi.Volts.Set && pj.Volts.Set {
				continue
			}
			ms = append(ms, measurement{
				name: fmt.Sprintf("voltage from lead %d to lead %d (powered, meter across the two leads)", i, j),
				predict: func(h Hypothesis) outcomeDist {
					if j > len(h.Package.Pins) {
						return outcomeDist{"none": 1}
					}
					return outcomeDist{pairLevel(h, h.Package.Pins[i-1], h.Package.Pins[j-1]): 1}
				},
				describe: func(key string) string { return fmt.Sprintf("lead %d − lead %d: %s", i, j, key) },
			})
		}
	}
	if ev.Case == nil || ev.Case.TiedToPin == nil {
		ms = append(ms, measurement{
			name: "case or tab: continuity to which lead (power off)",
			predict: func(h Hypothesis) outcomeDist {
				switch {
				case h.Outline != nil && h.Outline.CaseTerminal:
					return outcomeDist{"no lead (the can is a terminal)": 1}
				case h.Package.Tab == catalog.TabNone:
					return outcomeDist{"no lead": 1}
				}
				return outcomeDist{fmt.Sprintf("lead %d", h.Package.Lead(h.Package.Tab)): 1}
			},
			describe: func(key string) string { return "case to " + key },
		})
	}
	if ev.Output == nil || !ev.Output.Amps.Set {
		ms = append(ms, measurement{
			name: "load current (ammeter in the output, or the drop across a known resistor)",
			// A part is usually run between a tenth of its rating and its rating
			// (common practice, no source): log-uniform over that range.
			predict: func(h Hypothesis) outcomeDist {
				r := h.Family.Current(h.Package)
				return logUniformBuckets(0.1*r, r, currentBuckets)
			},
			describe: func(key string) string { return "load " + key },
		})
	}
	if tr := troughMeasurement(ev); tr != nil {
		ms = append(ms, *tr)
	}
	var out []Measurement
	for _, m := range ms {
		gain, joint := mutualInfo(hs, 0, m.predict)
		if gain < 0.01 {
			continue
		}
		out = append(out, Measurement{Measure: m.name, GainBits: gain, Outcomes: outcomeLines(joint, m.describe)})
	}
	sort.SliceStable(out, func(i, j int) bool { return out[i].GainBits > out[j].GainBits })
	if len(out) > n {
		out = out[:n]
	}
	return out
}

// troughMeasurement offers the scope measurement of the input's ripple
// trough, when the mean input and output are known but the trough is not.
// The true part regulates, so its trough headroom lies between what it needs
// and the measured mean headroom: uniformly, for want of anything better
// (common practice, no source).
func troughMeasurement(ev *Evidence) *measurement {
	if ev.Input != nil && ev.Input.TroughVolts.Set {
		return nil
	}
	return &measurement{
		name: "input ripple trough (scope on the IN lead at full load)",
		predict: func(h Hypothesis) outcomeDist {
			tv := terminalVolts(h, ev)
			vin, okIn := tv[catalog.PinIn]
			vout, okOut := tv[catalog.PinOut]
			if !okIn || !okOut {
				return outcomeDist{"unknown": 1}
			}
			mean := math.Abs(vin - vout)
			need := h.Family.HeadroomNeeded() * typicalHeadroom
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

func troughBucket(h float64) string {
	switch {
	case h < 1:
		return "below 1 V"
	case h < 2:
		return "1 to 2 V"
	}
	return "above 2 V"
}

// leadLevel names the level a lead of function fn sits at under h.
func leadLevel(h Hypothesis, fn string) string {
	f := h.Family
	sign := "+"
	if f.Negative() {
		sign = "−"
	}
	switch fn {
	case catalog.PinIn:
		return "the unregulated input (the largest voltage)"
	case catalog.PinOut:
		if h.VoutV > 0 {
			return fmt.Sprintf("the output, %s%s V", sign, trimFloat(h.VoutV))
		}
		return "the output"
	case catalog.PinGnd:
		return "ground (or a lifted-ground level)"
	case catalog.PinAdj:
		if h.VoutV > 0 {
			return fmt.Sprintf("%s%s V, the output less the reference", sign, trimFloat(h.VoutV-f.VrefV))
		}
		return "the output less the reference"
	}
	return "nothing"
}

// pairLevel names the voltage between leads of functions a and b under h.
func pairLevel(h Hypothesis, a, b string) string {
	f := h.Family
	s := 1.0
	if f.Negative() {
		s = -1
	}
	reg := f.VrefV
	if !f.Adjustable() {
		reg = h.VoutV
	}
	isCom := func(x string) bool { return x == catalog.PinGnd || x == catalog.PinAdj }
	switch {
	case a == catalog.PinOut && isCom(b):
		return fmt.Sprintf("%+.2f V", s*reg)
	case isCom(a) && b == catalog.PinOut:
		return fmt.Sprintf("%+.2f V", -s*reg)
	case a == catalog.PinIn || b == catalog.PinIn:
		if (a == catalog.PinIn) == (s > 0) {
			return "the headroom or more, input side positive"
		}
		return "the headroom or more, input side negative"
	}
	return "about 0 V"
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
