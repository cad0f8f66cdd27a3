package infer

import (
	"math"
)

// termMarking weighs the legible marking, decoded by the catalog (prefix,
// number, voltage, package suffix; date codes left out): a fit confirming n
// characters of the number is worth n·ln 4 (a character read by chance
// matches about one time in four among the characters regulator markings
// use; common practice, no source). A package suffix that names another
// outline takes two characters' worth off.
func termMarking(sc *scene, h Hypothesis, _ voltsView, r *reasons) {
	if !sc.legible {
		return
	}
	ev, f := sc.ev, h.Family
	m, found := sc.marks[f.ID]
	voltOK, outlineOK := m.Fits(h.Outline, h.VoutV)
	switch {
	case !found:
		r.add("marking", 0.01, 0.1, "marking %q fits no marking of %s", ev.Marking, f.ID)
	case m.How == "fuzzy" || !voltOK:
		r.add("marking", 0.05, 0.1, "marking %q %s; not this variant", ev.Marking, m.Detail)
	case !outlineOK:
		n := math.Max(m.Score-2, 0)
		r.add("marking", 0.9, 0.9*math.Pow(4, -n), "marking %q %s; not this package", ev.Marking, m.Detail)
	default:
		r.add("marking", 0.9, 0.9*math.Pow(4, -math.Max(m.Score, 0)), "marking %q %s", ev.Marking, m.Detail)
	}
}
