package guide

import (
	"fmt"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
)

// Infer ranks evidence documents with the catalog's identification
// ([infer.LoadEvidence] and [infer.Identify]).
type Infer struct {
	Catalog *catalog.Catalog // the merged, linted catalog
	// Leaders is how many leaders a ranking carries (5 if zero).
	Leaders int
}

var _ Identifier = Infer{}

// Rank loads doc with the evidence loader and identifies it. It returns the
// loader's error (a positioned list) for a document it refuses.
func (in Infer) Rank(name string, doc []byte) (*Ranking, error) {
	ev, err := infer.LoadEvidence(name, doc, in.Catalog)
	if err != nil {
		return nil, err
	}
	// Readings only: a bench test (a bench supply or a test load in place of
	// the circuit's own) takes rework a session does not ask for; infer
	// suggests them with their cautions.
	res, err := infer.Identify(in.Catalog, ev, infer.Options{NextCount: 50, Explain: 1, Tests: infer.ReadingsOnly})
	if err != nil {
		return nil, err
	}
	n := in.Leaders
	if n == 0 {
		n = 5
	}
	r := &Ranking{NotInCatalog: res.NotInCatalog, Conflicts: res.Conflicts}
	for i, c := range res.Candidates {
		if i >= n {
			break
		}
		v := c.VoutV
		if c.Family.Negative() {
			v = -v
		}
		r.Leaders = append(r.Leaders, Leader{Family: c.Family.ID, Package: c.Package.Outline, VoutV: v,
			Probability: c.Probability, Label: c.Label(), Title: c.Family.Title, Device: string(c.Family.Device)})
		if i == 0 {
			for _, rs := range c.Reasons {
				r.Reasons = append(r.Reasons, fmt.Sprintf("%+6.2f  %-16s %s", rs.Weight, rs.Evidence, rs.Text))
			}
		}
	}
	for _, m := range res.Next {
		r.Questions = append(r.Questions, Question{Key: m.Key, Measure: m.Measure, Prompt: m.Prompt,
			Kind: Kind(m.Kind), Choices: m.Choices, Unit: m.Unit, Powered: m.Powered, Safety: m.Safety, GainBits: m.GainBits})
	}
	return r, nil
}
