package infer

import (
	"math"

	"github.com/whichreg/whichreg/catalog"
)

// termMarking weighs the legible marking. A fit confirming n legible
// characters is worth n·ln 4 (a character read by chance matches about one
// time in four among the characters regulator markings use; common
// practice, no source).
func termMarking(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	if !sc.legible {
		return
	}
	f := h.Family
	k := markKey{f, h.VoutV}
	m, seen := sc.matches[k]
	if !seen {
		exps, have := sc.expansions[f]
		if !have {
			exps = f.Expand()
			sc.expansions[f] = exps
		}
		m.e, m.n, m.ok = catalog.BestMatch(exps, sc.marking, h.VoutV)
		sc.matches[k] = m
	}
	ev := sc.ev
	switch {
	case m.ok:
		r.add("marking", 0.9, 0.9*math.Pow(4, -float64(m.n)), "marking %q fits %s (%d of %d legible characters confirmed)", ev.Marking, m.e.Expanded, m.n, sc.nLegible)
	case sc.fuzzyHit[f.ID]:
		r.add("marking", 0.05, 0.1, "marking %q: the legible characters appear in %s's markings, but no pattern fits this variant", ev.Marking, f.ID)
	default:
		r.add("marking", 0.01, 0.1, "marking %q fits no marking of %s", ev.Marking, f.ID)
	}
}
