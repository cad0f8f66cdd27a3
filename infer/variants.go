package infer

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Variants of one family that share an outline, a pinout and a tab and
// differ only in rating or maker (a 317 DPAK of 0.5 A and of 1.5 A, a 1117
// SOT-223 of 0.8 A and of 1 A) look the same on the board: most evidence
// cannot tell them apart. They are ranked as one candidate, the variant the
// evidence favours standing for the others, so that the probability is not
// split between twins; a reason names the others and adds their share.

// lookAlikeKey is what a variant looks like on the board: family, outline,
// pinout, tab and output voltage.
func lookAlikeKey(h Hypothesis) string {
	// As fmt's %g would print the voltage, without fmt's cost (one key per
	// hypothesis).
	return h.Family.ID + "|" + h.Package.Outline + "|" + strings.Join(h.Package.Pins, ",") + "|" + h.Package.Tab + "|" + strconv.FormatFloat(h.VoutV, 'g', -1, 64)
}

// mergeVariants folds look-alike variants into one candidate each: the
// best-scoring variant (the first in catalog order on a tie) with a
// prior reason of log Σ exp(score − best) (the twins' summed prior, each
// weighed by how well it fits), so that its score is the
// log of the twins' summed likelihood and still the sum of its reasons.
func mergeVariants(cands []Candidate) []Candidate {
	groups := map[string][]int{}
	var order []string
	for i, cd := range cands {
		k := lookAlikeKey(cd.Hypothesis)
		if _, ok := groups[k]; !ok {
			order = append(order, k)
		}
		groups[k] = append(groups[k], i)
	}
	if len(order) == len(cands) {
		return cands
	}
	out := make([]Candidate, 0, len(order))
	for _, k := range order {
		idx := groups[k]
		best := idx[0]
		for _, i := range idx[1:] {
			if cands[i].Score > cands[best].Score {
				best = i
			}
		}
		cd := cands[best]
		if len(idx) > 1 {
			cd.Reasons = append(cd.Reasons, variantReason(cands, idx, best))
			cd.Score += cd.Reasons[len(cd.Reasons)-1].Weight
			cd.share = math.Exp(-cd.Reasons[len(cd.Reasons)-1].Weight)
			for _, i := range idx {
				if i != best {
					cd.Variants = append(cd.Variants, cands[i].Package)
				}
			}
		}
		out = append(out, cd)
	}
	return out
}

// variantReason is the reason that adds the other variants' share to the
// best one's score, naming each with its share of the group.
func variantReason(cands []Candidate, idx []int, best int) Reason {
	sum := 0.0
	for _, i := range idx {
		sum += math.Exp(cands[i].Score - cands[best].Score)
	}
	var parts []string
	for _, i := range idx {
		name := cands[i].Package.Variant
		if name == "" {
			name = "unnamed"
		}
		parts = append(parts, fmt.Sprintf("%s %.0f %%", name, 100*math.Exp(cands[i].Score-cands[best].Score)/sum))
	}
	f := cands[best].Family
	tell := "a load test or the marking tells them apart"
	if 1/sum >= 0.9 {
		tell = "here the evidence already tells them apart"
	}
	return Reason{Evidence: "prior", Weight: math.Log(sum), Text: fmt.Sprintf(
		"%s comes in %d variants in %s that look the same on the board (%s): only the rating or maker differs, so they count as one; %s",
		f.ID, len(idx), cands[best].Package.Outline, strings.Join(parts, ", "), tell)}
}
