package replace_test

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
)

func builtinCatalog(t testing.TB) *catalog.Catalog {
	t.Helper()
	files, errs := builtin.Files()
	if len(errs) > 0 {
		t.Fatal(errs)
	}
	return catalog.Merge(files...)
}

func load(t testing.TB, c *catalog.Catalog, name string) *infer.Evidence {
	t.Helper()
	data, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	ev, err := infer.LoadEvidence(name, data, c)
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	return ev
}

// original chooses the original of a case: "# original: ID:OUTLINE[:VOUT]"
// or identification's leader.
func original(t testing.TB, c *catalog.Catalog, ev *infer.Evidence, spec string) infer.Original {
	t.Helper()
	res, err := infer.Identify(c, ev, infer.Options{})
	if err != nil {
		t.Fatal(err)
	}
	var named *infer.Hypothesis
	if spec != "" {
		h, err := infer.ParseVariant(c, spec)
		if err != nil {
			t.Fatal(err)
		}
		named = &h
	}
	o, err := infer.ChooseOriginal(res, named)
	if err != nil {
		t.Fatal(err)
	}
	return o
}

// TestSwapCases runs the cases under testdata/swap. Each names the expected
// verdict and check statuses of candidates in "# expect:" lines:
//
//	# expect: FAMILY:OUTLINE VERDICT check=status … check.margin=M check.value=V
//	# shortfall: CHECK value=V limit=L status=fail|warn passed_by=FAMILY:OUTLINE|none text=WORDS
//
// A "# shortfall:" line pins a check the original part itself fails in the
// circuit (status=warn: misses only on the assumed bound from a bare
// reading); a case without one expects the original to pass every check it
// can fail.
// margins are pinned to ±0.01 and values to ±0.5 % (±0.01 near zero); the
// hand calculation and the datasheet behind each number are in the file's
// comments.
func TestSwapCases(t *testing.T) {
	c := builtinCatalog(t)
	files, _ := filepath.Glob("../../testdata/swap/*.toml")
	if len(files) < 15 {
		t.Fatalf("want at least 15 swap cases, found %d", len(files))
	}
	seen := map[string]map[replace.Status]bool{} // check -> statuses seen
	for _, name := range files {
		t.Run(filepath.Base(name), func(t *testing.T) {
			data, _ := os.ReadFile(name)
			ev := load(t, c, name)
			var spec string
			var expects, shortfalls []string
			for _, line := range strings.Split(string(data), "\n") {
				if s, ok := strings.CutPrefix(line, "# original: "); ok {
					spec = strings.TrimSpace(s)
				}
				if s, ok := strings.CutPrefix(line, "# expect: "); ok {
					expects = append(expects, s)
				}
				if s, ok := strings.CutPrefix(line, "# shortfall: "); ok {
					shortfalls = append(shortfalls, s)
				}
			}
			if len(expects) == 0 {
				t.Fatal("no '# expect:' lines")
			}
			sres, err := replace.Swap(c, ev, original(t, c, ev, spec), replace.Options{All: true})
			if err != nil {
				t.Fatal(err)
			}
			for _, e := range expects {
				expectOne(t, c, sres, strings.Fields(e), seen)
			}
			expectShortfalls(t, c, sres, shortfalls)
		})
	}
	// Every check must be seen failing and passing somewhere (module: failing
	// and warning, since a switching module always carries the noise caution).
	for _, k := range []string{"outline", "pinout", "polarity", "vout", "current", "vin_max", "dropout", "thermal", "cout", "min_load"} {
		if !seen[k][replace.Fail] || !seen[k][replace.Pass] {
			t.Errorf("check %s seen as %v; want both fail and pass among the cases", k, seen[k])
		}
	}
	// An insulating kit always settles a live tab: tab is seen passing and
	// needing work.
	if !seen["tab"][replace.Work] || !seen["tab"][replace.Pass] {
		t.Errorf("tab seen as %v; want work and pass", seen["tab"])
	}
	if !seen["module"][replace.Fail] || !seen["module"][replace.Warn] {
		t.Errorf("module seen as %v; want fail and warn", seen["module"])
	}
}

func expectOne(t *testing.T, c *catalog.Catalog, sres *replace.Result, f []string, seen map[string]map[replace.Status]bool) {
	t.Helper()
	want, err := infer.ParseVariant(c, f[0])
	if err != nil {
		t.Fatal(err)
	}
	var got *replace.Replacement
	for i := range sres.Replacements {
		r := &sres.Replacements[i]
		if r.Family == want.Family && r.Package == want.Package {
			got = r
		}
	}
	if got == nil {
		t.Errorf("%s: not among the candidates", f[0])
		return
	}
	if string(got.Verdict) != f[1] {
		t.Errorf("%s: verdict %s, want %s (%s)", f[0], got.Verdict, f[1], got.Summary())
		for _, ch := range got.Checks {
			t.Logf("  %s %s %+.3f %s", ch.Name, ch.Status, ch.Margin, ch.Text)
		}
	}
	for _, kv := range f[2:] {
		k, v, _ := strings.Cut(kv, "=")
		check, field, _ := strings.Cut(k, ".")
		ch := got.Check(replace.CheckName(check))
		if ch == nil {
			t.Errorf("%s: no %s check", f[0], check)
			continue
		}
		switch field {
		case "":
			if string(ch.Status) != v {
				t.Errorf("%s: check %s is %s (%s), want %s", f[0], check, ch.Status, ch.Text, v)
			}
			if seen[check] == nil {
				seen[check] = map[replace.Status]bool{}
			}
			seen[check][ch.Status] = true
		case "margin":
			x, _ := strconv.ParseFloat(v, 64)
			if math.Abs(ch.Margin-x) > 0.01 {
				t.Errorf("%s: %s margin %.4f, want %s (%s)", f[0], check, ch.Margin, v, ch.Text)
			}
		case "value", "limit":
			x, _ := strconv.ParseFloat(v, 64)
			p := ch.Value
			if field == "limit" {
				p = ch.Limit
			}
			if p == nil || math.Abs(*p-x) > math.Max(0.005*math.Abs(x), 0.01) {
				t.Errorf("%s: %s %s %v, want %s (%s)", f[0], check, field, fmtNum(p), v, ch.Text)
			}
		case "text":
			if !strings.Contains(ch.Text, strings.ReplaceAll(v, "_", " ")) {
				t.Errorf("%s: %s text %q lacks %q", f[0], check, ch.Text, v)
			}
		case "action":
			if !strings.Contains(ch.Action, strings.ReplaceAll(v, "_", " ")) {
				t.Errorf("%s: %s action %q lacks %q", f[0], check, ch.Action, v)
			}
		case "unit":
			if ch.Unit != v {
				t.Errorf("%s: %s unit %q, want %q", f[0], check, ch.Unit, v)
			}
		default:
			t.Fatalf("unknown expectation %q", kv)
		}
	}
}

// expectShortfalls compares the original's own failing checks with the
// case's "# shortfall:" lines.
func expectShortfalls(t *testing.T, c *catalog.Catalog, sres *replace.Result, lines []string) {
	t.Helper()
	if len(sres.OriginalShortfalls) != len(lines) {
		var got []string
		for _, sf := range sres.OriginalShortfalls {
			got = append(got, sf.Sentence(sres.Original.Label()))
		}
		t.Errorf("original's shortfalls: %q, want %d", got, len(lines))
		return
	}
	for i, line := range lines {
		f := strings.Fields(line)
		sf := sres.OriginalShortfalls[i]
		if string(sf.Check.Name) != f[0] {
			t.Errorf("shortfall %d is %s, want %s", i, sf.Check.Name, f[0])
		}
		for _, kv := range f[1:] {
			k, v, _ := strings.Cut(kv, "=")
			switch k {
			case "value", "limit":
				x, _ := strconv.ParseFloat(v, 64)
				p := sf.Check.Value
				if k == "limit" {
					p = sf.Check.Limit
				}
				if p == nil || math.Abs(*p-x) > math.Max(0.005*math.Abs(x), 0.01) {
					t.Errorf("shortfall %s %s %v, want %s", f[0], k, fmtNum(p), v)
				}
			case "status":
				if string(sf.Check.Status) != v || sf.OnBound != (v == string(replace.Warn)) {
					t.Errorf("shortfall %s status %s (on the bound only: %v), want %s", f[0], sf.Check.Status, sf.OnBound, v)
				}
			case "passed_by":
				want := ""
				if v != "none" {
					h, err := infer.ParseVariant(c, v)
					if err != nil {
						t.Fatal(err)
					}
					want = h.Label()
				}
				if !strings.HasPrefix(sf.PassedBy, want) || (want == "" && sf.PassedBy != "") {
					t.Errorf("shortfall %s passed by %q, want %q", f[0], sf.PassedBy, want)
				}
			case "text":
				if want, got := strings.ReplaceAll(v, "_", " "), sf.Sentence(sres.Original.Label()); !strings.Contains(got, want) {
					t.Errorf("shortfall %s sentence %q lacks %q", f[0], got, want)
				}
			default:
				t.Fatalf("unknown shortfall expectation %q", kv)
			}
		}
	}
}

func fmtNum(p *float64) string {
	if p == nil {
		return "null"
	}
	return fmt.Sprintf("%.4g", *p)
}

func BenchmarkSwap(b *testing.B) {
	c := builtinCatalog(b)
	ev := load(b, c, "../../testdata/demo/vending-lifted-ground.toml")
	o := original(b, c, ev, "")
	for b.Loop() {
		if _, err := replace.Swap(c, ev, o, replace.Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

func ExampleSwap() {
	files, _ := builtin.Files()
	c := catalog.Merge(files...)
	ev, _ := infer.LoadEvidence("u1.toml", []byte(`
package = "TO-220"
[pins.1]
wired_to = "unregulated"
volts = 11.5
[pins.2]
wired_to = "ground"
[pins.3]
wired_to = "load"
volts = 5.0
[case]
tied_to_pin = 2
[output]
amps = 0.5
[mount]
heatsink_c_per_w = 8
insulator = "mica"
chassis_heatsink = true
`), c)
	res, _ := infer.Identify(c, ev, infer.Options{Explain: 1})
	orig, _ := infer.ChooseOriginal(res, nil)
	sres, _ := replace.Swap(c, ev, orig, replace.Options{})
	for _, r := range sres.Replacements[:2] {
		fmt.Println(r.Label(), r.Verdict)
	}
	// Output:
	// 340 TO-220 5 V drop-in
	// 78xx TO-220 5 V drop-in
}

func mustRead(t *testing.T, name string) []byte {
	t.Helper()
	data, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	return data
}

// TestUnsuitableRanking: when nothing passes (a DC supply stated to sag to
// 12.1 V leaves 0.10 V of headroom for a 12 V rail;
// testdata/swap/dc-sag-dropout.toml), the parts that fail only where the
// original fails rank first, the one that misses the dropout by the least
// volts leading (a 2937 needs 1.0 V, TI LM2937: −0.90 V, against the 78xx's
// 2.0 V, Fairchild LM78xx: −1.90 V), and the runners-up say so in volts.
func TestUnsuitableRanking(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../../testdata/swap/dc-sag-dropout.toml")
	res, err := replace.Swap(c, ev, original(t, c, ev, "78xx:TO-220:12"), replace.Options{All: true})
	if err != nil {
		t.Fatal(err)
	}
	first := &res.Replacements[0]
	if first.Verdict != replace.Unsuitable || !first.FailsLikeOriginal || first.Deciding != replace.CheckDropout {
		t.Fatalf("first: %s %s", first.Label(), first.Summary())
	}
	if m, _ := first.Check(replace.CheckDropout).MarginInUnit(); math.Abs(m+0.90) > 0.01 {
		t.Errorf("first %s misses the dropout by %.3f V, want −0.90 V", first.Label(), m)
	}
	for i := range res.Replacements {
		r := &res.Replacements[i]
		if r.Family.ID == "78xx" && r.Package.Outline == "TO-220" {
			if w := replace.WhyNotFirst(r, first); !strings.Contains(w, "missing dropout by more") || !strings.Contains(w, "-1.9 V") {
				t.Errorf("why not first: %q", w)
			}
		}
	}
}
