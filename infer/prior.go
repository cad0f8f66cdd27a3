package infer

import (
	"fmt"
	"math"

	"github.com/whichreg/whichreg/catalog"
)

// pNICPrior is the prior probability that the part is not in the catalog
// (judgement: common practice, no source).
const pNICPrior = 0.03

// priorReasons returns the prior of h: the family's commonness on a
// geometric scale (each step of the 1–5 scale three times as common; common
// practice, no source), shared among its packages by outline commonness and
// among its voltages by [voltageWeight], and the era.
func priorReasons(h Hypothesis, ev *Evidence, c *catalog.Catalog, text bool) []Reason {
	return appendPriorReasons(nil, h, ev, c, text)
}

// appendPriorReasons appends [priorReasons] to rs, so that identification's
// loop over the hypotheses can keep every candidate's reasons in one array.
func appendPriorReasons(rs []Reason, h Hypothesis, ev *Evidence, c *catalog.Catalog, text bool) []Reason {
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
	rs = append(rs, Reason{"prior", float64(f.Commonness-1) * math.Log(3), say("commonness %d of 5", f.Commonness)})
	// Each outline carries its weight once, shared by the variants sold in
	// it (two ratings of one SOT-223 carry the mass one would).
	total, variants := 0.0, 0
	seen := map[string]bool{}
	for _, p := range f.Packages {
		if !seen[p.Outline] {
			seen[p.Outline] = true
			total += c.Outline(p.Outline).Weight()
		}
		if p.Outline == h.Package.Outline {
			variants++
		}
	}
	pkgShare := h.Outline.Weight() / total
	share := pkgShare / float64(max(1, variants))
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
	if variants > 1 && text {
		t += say(", shared by its %d variants", variants)
	}
	if nv > 1 && text {
		t += say("; %s V is %.0f %% of its voltages", trimFloat(h.VoutV), 100*vs)
	}
	rs = append(rs, Reason{"prior", math.Log(share), t})
	if ev.Year > 0 && f.Since > ev.Year {
		rs = append(rs, Reason{"year", math.Log(0.02), say("%s appeared in %d, after the equipment was made (%d)", f.ID, f.Since, ev.Year)})
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
