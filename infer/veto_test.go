package infer_test

import (
	"math"
	"path/filepath"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/infer"
)

// TestMissingEvidenceAddsNothing: evidence that measures nothing gives every
// candidate its prior and nothing else (missing evidence adds exactly 0).
func TestMissingEvidenceAddsNothing(t *testing.T) {
	c := builtinCatalog(t)
	for _, ev := range []*infer.Evidence{
		{},
		{Ref: "U1", Equipment: "a board"},
		{Pins: map[string]infer.PinEvidence{"1": {}}, Input: &infer.InputEvidence{}, Output: &infer.OutputEvidence{},
			Network: &infer.NetworkEvidence{}, Booster: &infer.BoosterEvidence{}, Bench: &infer.BenchEvidence{}, Case: &infer.CaseEvidence{}},
	} {
		if err := ev.Check(c); err != nil {
			t.Fatal(err)
		}
		res, err := infer.Identify(c, ev, infer.Options{Explain: infer.ExplainAll})
		if err != nil {
			t.Fatal(err)
		}
		if !res.PriorOnly {
			t.Errorf("%+v: not prior-only", ev)
		}
		for _, cd := range res.Candidates {
			for _, r := range cd.Reasons {
				if r.Evidence != "prior" && r.Evidence != "year" {
					t.Fatalf("%s: reason %q (%+.2f) without evidence", cd.Label(), r.Evidence, r.Weight)
				}
			}
		}
	}
}

// TestVetoedCannotLead: in every scenario, a candidate carrying a near-veto
// (evidence it cannot produce) scores below "not in the catalog", so it can
// never lead; and each look-alike scenario leaves every regulator below 50 %.
func TestVetoedCannotLead(t *testing.T) {
	c := builtinCatalog(t)
	files, _ := filepath.Glob("../testdata/infer/*.toml")
	demo, _ := filepath.Glob("../testdata/demo/*.toml")
	vetoes := 0
	for _, name := range append(files, demo...) {
		res, err := infer.Identify(c, load(t, c, name), infer.Options{Explain: infer.ExplainAll})
		if err != nil {
			t.Fatal(err)
		}
		for _, cd := range res.Candidates {
			for _, r := range cd.Reasons {
				if strings.HasPrefix(r.Text, "impossible for this part") {
					vetoes++
					if cd.Score >= res.NotInCatalogScore {
						t.Errorf("%s: %s carries a veto (%s) but scores %.2f, not below not-in-catalog's %.2f", name, cd.Label(), r.Evidence, cd.Score, res.NotInCatalogScore)
					}
					if r.Weight > math.Log(1e-4)+1e-9 {
						t.Errorf("%s: %s: veto weight %.2f", name, cd.Label(), r.Weight)
					}
				}
			}
			if strings.Contains(name, "lookalike-") && !cd.Family.NonRegulator() && cd.Probability >= 0.5 {
				t.Errorf("%s: regulator %s at %.2f", name, cd.Label(), cd.Probability)
			}
		}
	}
	if vetoes == 0 {
		t.Error("no scenario exercises a near-veto")
	}
}
