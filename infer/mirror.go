package infer

import (
	"fmt"
	"math"
	"strconv"

	"github.com/whichreg/whichreg/catalog"
)

// mirrorMargin is how much better (natural-log score) the readings must fit
// with the leads numbered the other way before the slip is named: e^3, some
// twenty times likelier (judgement: common practice, no source).
const mirrorMargin = 3

// mirrored returns the evidence with its leads numbered from the other side
// (lead k of n becomes lead n+1−k, the case tie with it), and false when the
// lead count is not known or fewer than two leads carry evidence.
func mirrored(c *catalog.Catalog, ev *Evidence) (*Evidence, int, bool) {
	n := 0
	if o := c.Outline(ev.Package); o != nil {
		n = o.Leads
	}
	if ev.Outline != nil && ev.Outline.Leads != nil {
		n = *ev.Outline.Leads
	}
	if n < 2 || len(ev.Leads()) < 2 {
		return nil, 0, false
	}
	m := *ev
	m.Pins = map[string]PinEvidence{}
	for _, k := range ev.Leads() {
		if k > n {
			return nil, 0, false
		}
		p, _ := ev.Lead(k)
		m.Pins[strconv.Itoa(n+1-k)] = p
	}
	if cs := ev.Case; cs != nil && cs.TiedToPin != nil && *cs.TiedToPin > 0 {
		cc := *cs
		t := n + 1 - *cs.TiedToPin
		cc.TiedToPin = &t
		m.Case = &cc
	}
	return &m, n, true
}

// mirrorSlip names leads numbered from the wrong side: when the best
// hypothesis scores far better with the leads mirrored than the leader does
// as written. Only asked when the leader is in doubt or contradicted.
func (sc *scene) mirrorSlip(res *Result) []string {
	if len(res.Candidates) == 0 {
		return nil
	}
	lead := res.Candidates[0]
	if lead.Probability >= 0.9 && !hasVeto(lead) {
		if w, ok := weightOf(lead, "package"); !ok || w >= 0 {
			return nil
		}
	}
	m, n, ok := mirrored(sc.c, sc.ev)
	if !ok {
		return nil
	}
	ms := *sc
	ms.ev, ms.text = m, false
	ms.measured, ms.volts = measuredLeads(m), nil
	ms.setLeads(m.Leads())
	best, label := math.Inf(-1), ""
	named := sc.c.Outline(sc.ev.Package)
	if sc.packageContradicted() {
		named = nil
	}
	for _, h := range hypotheses(sc.c, m) {
		// The same outline (the one named, when a name stands): the slip is
		// in the numbering, not in the package.
		if len(h.Package.Pins) != n || (named != nil && h.Outline != named) {
			continue
		}
		s := 0.0
		for _, r := range priorReasons(h, m, sc.c, false) {
			s += r.Weight
		}
		for _, r := range ms.likelihoods(h) {
			s += r.Weight
		}
		if s > best {
			best, label = s, h.Label()
		}
	}
	if best < lead.Score+mirrorMargin || best < res.NotInCatalogScore {
		return nil
	}
	return []string{fmt.Sprintf("numbered from the other side (lead 1 as lead %d), the readings fit %s far better (score %+.2f against the leader's %+.2f): "+
		"check which lead is lead 1 ('whichreg catalog show' draws the numbering)", n, label, best, lead.Score)}
}
