package replace_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/infer/replace"
)

// reasonText returns the text of h's identification reason for key.
func reasonText(t *testing.T, res *infer.Result, h infer.Hypothesis, key string) string {
	t.Helper()
	for _, cd := range res.Candidates {
		if cd.Family == h.Family && cd.Package == h.Package {
			for _, r := range cd.Reasons {
				if r.Evidence == key {
					return r.Text
				}
			}
		}
	}
	t.Fatalf("%s: no %s reason", h.Label(), key)
	return ""
}

// swapOne runs identification (all reasons written) and the replacement
// checks of the original's own family and package.
func swapOne(t *testing.T, c *catalog.Catalog, file, spec string) (*infer.Result, *replace.Replacement) {
	t.Helper()
	ev := load(t, c, file)
	res, err := infer.Identify(c, ev, infer.Options{Explain: 1000})
	if err != nil {
		t.Fatal(err)
	}
	o := original(t, c, ev, spec)
	sres, err := replace.Swap(c, ev, o, replace.Options{All: true})
	if err != nil {
		t.Fatal(err)
	}
	for i := range sres.Replacements {
		r := &sres.Replacements[i]
		if r.Family == o.Family && r.Package == o.Package {
			return res, r
		}
	}
	t.Fatalf("%s: the original is not among the candidates", file)
	return nil, nil
}

// TestRulesAgree checks, rule by rule, that identification and replacement
// take the same figure from the one place it lives.
func TestRulesAgree(t *testing.T) {
	c := builtinCatalog(t)
	t.Run("dropout headroom (catalog.Family.HeadroomNeeded)", func(t *testing.T) {
		res, r := swapOne(t, c, "../../testdata/swap/why-1117-dropout.toml", "1117:SOT-223:3.3")
		need := r.Family.HeadroomNeeded()
		if ch := r.Check(replace.CheckDropout); ch == nil || *ch.Limit != need {
			t.Fatalf("replacement's dropout limit %v, want %g", ch, need)
		}
		if txt := reasonText(t, res, r.Hypothesis, "voltages.headroom"); !strings.Contains(txt, fmt.Sprintf("worst-case dropout %.2f V", need)) {
			t.Errorf("identification's headroom reason %q does not use the %.2f V figure", txt, need)
		}
	})
	t.Run("adjustable input limit (catalog.Family.InputLimit)", func(t *testing.T) {
		res, r := swapOne(t, c, "../../testdata/swap/why-adj-startup.toml", "317:TO-220")
		il := r.Family.InputLimit(r.VoutV)
		if ch := r.Check(replace.CheckVinMax); ch == nil || *ch.Limit != il.StartV {
			t.Fatalf("replacement's input limit %v, want the start-up %g V", ch, il.StartV)
		}
		if txt := reasonText(t, res, r.Hypothesis, "input_max"); !strings.Contains(txt, fmt.Sprintf("%.0f V", il.RunV)) {
			t.Errorf("identification's input reason %q does not use the running %.0f V", txt, il.RunV)
		}
	})
	t.Run("input peak without a rectifier (infer.Operating.PeakFor)", func(t *testing.T) {
		res, r := swapOne(t, c, "../../testdata/swap/why-no-rectifier-vinmax.toml", "78xx:TO-220:5")
		ch := r.Check(replace.CheckVinMax)
		if txt := reasonText(t, res, r.Hypothesis, "input_max"); !strings.Contains(txt, fmt.Sprintf("input peak %.1f V", *ch.Value)) {
			t.Errorf("identification's peak %q is not replacement's %.1f V", txt, *ch.Value)
		}
	})
	t.Run("input peak from the rectifier (Rectifier.At, FilterCapTolerance)", func(t *testing.T) {
		res, r := swapOne(t, c, "../../testdata/swap/adj-vin-max.toml", "317:TO-220")
		ch := r.Check(replace.CheckVinMax)
		if math.Abs(res.InputPeakV-*ch.Value) > 1e-9 {
			t.Errorf("identification's peak %.4f V, replacement's %.4f V", res.InputPeakV, *ch.Value)
		}
	})
	t.Run("bypass share (circuit.Bypass)", func(t *testing.T) {
		res, r := swapOne(t, c, "../../testdata/swap/why-bypass-thermal.toml", "78xx:TO-220:5")
		// Identification at the measured 9.5 V; replacement at the lowest
		// 8 V: both (Vin − Vout)/R through circuit.Bypass.
		b, _ := circuit.Bypass{ROhm: 4.7, VinMinV: 9.5, VinMaxV: 9.5, VoutV: 5, LoadMinA: 1.6, LoadMaxA: 1.6}.Solve()
		if txt := reasonText(t, res, r.Hypothesis, "current"); !strings.Contains(txt, fmt.Sprintf("less %.3f A through the bypass resistor", b.ResistorMinA)) {
			t.Errorf("identification's current reason %q lacks the %.3f A share", txt, b.ResistorMinA)
		}
		if ch := r.Check(replace.CheckCurrent); math.Abs(*ch.Value-(1.6-3/4.7)) > 1e-9 {
			t.Errorf("replacement's regulator current %.4f A, want %.4f", *ch.Value, 1.6-3/4.7)
		}
	})
	t.Run("negative rails keep their sign (catalog.Polarity.Signed)", func(t *testing.T) {
		_, r := swapOne(t, c, "../../testdata/swap/why-cout-337-aluminium.toml", "337:TO-220")
		if ch := r.Check(replace.CheckVout); ch == nil || *ch.Value >= 0 || *ch.Limit >= 0 {
			t.Errorf("a 337's output check is not negative: %+v", ch)
		}
	})
}

// TestNonRegulatorRefused: a transistor is never replaced by a regulator;
// choosing and swapping it say what it is.
func TestNonRegulatorRefused(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../../testdata/swap/why-same-part-80.toml")
	res, _ := infer.Identify(c, ev, infer.Options{})
	h, err := infer.ParseVariant(c, "npn-power:TO-220")
	if err != nil {
		t.Fatal(err)
	}
	o, err := infer.ChooseOriginal(res, &h)
	if !errors.Is(err, infer.ErrNonRegulator) || !strings.Contains(err.Error(), "NPN power transistor") {
		t.Errorf("ChooseOriginal: %v; want ErrNonRegulator naming the device", err)
	}
	if _, err := replace.Swap(c, ev, infer.Original{Hypothesis: h, Named: true, Probability: 1}, replace.Options{}); !errors.Is(err, infer.ErrNonRegulator) {
		t.Errorf("Swap: %v; want ErrNonRegulator", err)
	}
	_ = o
}

// TestDecidingAndRunnersUp: the deciding check of an unsuitable candidate
// is a failing one, of a needs-work candidate a work one; a runner-up's
// reason names a check of its own worst status, never a passing one.
func TestDecidingAndRunnersUp(t *testing.T) {
	c := builtinCatalog(t)
	for _, file := range []string{"why-lifted-chassis.toml", "why-smd-thermal.toml", "to3-to-to220.toml", "317-grounded-no-insulator.toml"} {
		ev := load(t, c, "../../testdata/swap/"+file)
		sres, err := replace.Swap(c, ev, original(t, c, ev, specOf(t, "../../testdata/swap/"+file)), replace.Options{All: true})
		if err != nil {
			t.Fatal(err)
		}
		first := &sres.Replacements[0]
		for i := range sres.Replacements {
			r := &sres.Replacements[i]
			dec := r.Check(r.Deciding)
			want := map[replace.Verdict]replace.Status{replace.Unsuitable: replace.Fail, replace.NeedsWork: replace.Work}[r.Verdict]
			if want != "" && dec.Status != want {
				t.Errorf("%s %s: %s deciding check %s is %s", file, r.Label(), r.Verdict, r.Deciding, dec.Status)
			}
			why := replace.WhyNotFirst(r, first)
			if r.Verdict != first.Verdict && !strings.Contains(why, dec.Text) {
				t.Errorf("%s %s: why-not %q does not give its deciding check", file, r.Label(), why)
			}
			if i > 0 && r.Verdict == replace.NeedsWork && first.Verdict == replace.NeedsWork && r.WorkCount < first.WorkCount {
				t.Errorf("%s: %s needs less work than the first", file, r.Label())
			}
		}
	}
}

func specOf(t *testing.T, file string) string {
	data := string(mustRead(t, file))
	for _, line := range strings.Split(data, "\n") {
		if s, ok := strings.CutPrefix(line, "# original: "); ok {
			return strings.TrimSpace(s)
		}
	}
	return ""
}
