package infer_test

import (
	"testing"

	"github.com/whichreg/whichreg/infer"
)

// markingWeight returns the weight of the marking reason of the candidate
// with the given label, and whether it has one.
func markingWeight(t *testing.T, res *infer.Result, label string) float64 {
	t.Helper()
	for _, cd := range res.Candidates {
		if cd.Label() != label {
			continue
		}
		for _, r := range cd.Reasons {
			if r.Evidence == "marking" {
				return r.Weight
			}
		}
		t.Fatalf("%s has no marking reason", label)
	}
	t.Fatalf("no candidate %s", label)
	return 0
}

// TestIdentifyMarkingDecoded: identification reads the marking with the
// catalog's decoder, so that the voltage code and the package suffix count
// as evidence, a date code does not, and a transistor number fits no
// regulator.
func TestIdentifyMarkingDecoded(t *testing.T) {
	c := builtinCatalog(t)
	identify := func(marking string) *infer.Result {
		t.Helper()
		ev, err := infer.LoadEvidence("m.toml", []byte("marking = \""+marking+"\"\n"), c)
		if err != nil {
			t.Fatal(err)
		}
		res, err := infer.Identify(c, ev, infer.Options{Explain: 1000})
		if err != nil {
			t.Fatal(err)
		}
		return res
	}

	// Practice (reference practice.md §8): a four-digit group beside the
	// number is a date code; LM317T 7812 is a 317 made in 1978, week 12.
	res := identify("LM317T 7812")
	if w := markingWeight(t, res, "317 TO-220"); w <= 0 {
		t.Errorf("LM317T 7812: 317 TO-220 marking weight %+.2f, want > 0", w)
	}
	if w := markingWeight(t, res, "78xx TO-220 12 V"); w >= 0 {
		t.Errorf("LM317T 7812: 78xx 12 V marking weight %+.2f, want < 0 (7812 is the date code)", w)
	}
	if got := res.Candidates[0].Family.ID; got != "317" {
		t.Errorf("LM317T 7812: leader %s, want 317", got)
	}

	// onsemi MC7800/D and National LM78XX: CT = TO-220, 12 = 12 V.
	res = identify("LM7812CT")
	to220, to3 := markingWeight(t, res, "78xx TO-220 12 V"), markingWeight(t, res, "78xx TO-3 12 V")
	if to220 <= to3 {
		t.Errorf("LM7812CT: TO-220 marking weight %+.2f not above TO-3's %+.2f (CT = TO-220)", to220, to3)
	}
	if v5 := markingWeight(t, res, "78xx TO-220 5 V"); v5 >= to220 {
		t.Errorf("LM7812CT: 5 V marking weight %+.2f not below 12 V's %+.2f", v5, to220)
	}
	if res.Candidates[0].Label() != "78xx TO-220 12 V" {
		t.Errorf("LM7812CT: leader %s, want 78xx TO-220 12 V", res.Candidates[0].Label())
	}

	// BC337 is an NPN transistor (Pro Electron BC prefix), not a 337.
	res = identify("BC337")
	for _, cd := range res.Candidates {
		if cd.Family.NonRegulator() {
			continue
		}
		for _, r := range cd.Reasons {
			if r.Evidence == "marking" && r.Weight >= 0 {
				t.Errorf("BC337: regulator %s has marking weight %+.2f (%s)", cd.Label(), r.Weight, r.Text)
			}
		}
	}
}
