package infer_test

import (
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
)

func hypothesis(t *testing.T, c *catalog.Catalog, spec string) infer.Hypothesis {
	parts := strings.Split(spec, ":")
	f := c.Family(parts[0])
	if f == nil {
		t.Fatalf("no family %s", parts[0])
	}
	p := f.Package(c, parts[1])
	if p == nil {
		t.Fatalf("%s has no %s", parts[0], parts[1])
	}
	h := infer.Hypothesis{Family: f, Package: p, Outline: c.Outline(p.Outline)}
	if len(parts) > 2 {
		h.VoutV, _ = strconv.ParseFloat(parts[2], 64)
	}
	return h
}

// TestSwapCases runs the cases under testdata/swap. Each names the expected
// verdict and check statuses of candidates in "# expect:" lines; the
// datasheet limits behind them are named in each file's comment.
func TestSwapCases(t *testing.T) {
	c := builtinCatalog(t)
	files, _ := filepath.Glob("../testdata/swap/*.toml")
	if len(files) < 15 {
		t.Fatalf("want at least 15 swap cases, found %d", len(files))
	}
	seen := map[string]map[string]bool{} // check -> statuses seen
	for _, name := range files {
		t.Run(filepath.Base(name), func(t *testing.T) {
			data, _ := os.ReadFile(name)
			ev := load(t, c, name)
			var orig infer.Hypothesis
			var expects []string
			for _, line := range strings.Split(string(data), "\n") {
				if s, ok := strings.CutPrefix(line, "# original: "); ok {
					orig = hypothesis(t, c, s)
				}
				if s, ok := strings.CutPrefix(line, "# expect: "); ok {
					expects = append(expects, s)
				}
			}
			if len(expects) == 0 {
				t.Fatal("no '# expect:' lines")
			}
			if orig.Family == nil {
				res, err := infer.Identify(c, ev, infer.Options{})
				if err != nil {
					t.Fatal(err)
				}
				orig = res.Candidates[0].Hypothesis
			} else if orig.Family.Adjustable() {
				res, _ := infer.Identify(c, ev, infer.Options{})
				for _, cd := range res.Candidates {
					if cd.Family == orig.Family && cd.Package == orig.Package {
						orig.VoutV = cd.VoutV
						break
					}
				}
			}
			sres, err := infer.Swap(c, ev, orig, 1, false, infer.SwapOptions{All: true})
			if err != nil {
				t.Fatal(err)
			}
			for _, e := range expects {
				f := strings.Fields(e)
				want := hypothesis(t, c, f[0])
				var got *infer.Replacement
				for i := range sres.Replacements {
					r := &sres.Replacements[i]
					if r.Family == want.Family && r.Package == want.Package {
						got = r
					}
				}
				if got == nil {
					t.Errorf("%s: not among the candidates", f[0])
					continue
				}
				if got.Verdict != f[1] {
					t.Errorf("%s: verdict %s, want %s (deciding %s)", f[0], got.Verdict, f[1], got.Deciding)
					for _, ch := range got.Checks {
						t.Logf("  %s %s %s", ch.Check, ch.Status, ch.Text)
					}
				}
				for _, kv := range f[2:] {
					k, v, _ := strings.Cut(kv, "=")
					found := false
					for _, ch := range got.Checks {
						if ch.Check == k {
							found = true
							if ch.Status != v {
								t.Errorf("%s: check %s is %s (%s), want %s", f[0], k, ch.Status, ch.Text, v)
							}
							if seen[k] == nil {
								seen[k] = map[string]bool{}
							}
							seen[k][ch.Status] = true
						}
					}
					if !found {
						t.Errorf("%s: no %s check", f[0], k)
					}
				}
			}
		})
	}
	// Every check must be seen failing and passing somewhere (module: failing
	// and warning, since a switching module always carries the noise caution).
	for _, k := range []string{"outline", "pinout", "tab", "polarity", "vout", "current", "vin_max", "dropout", "thermal", "cout", "min_load"} {
		if !seen[k][infer.Fail] || !seen[k][infer.Pass] {
			t.Errorf("check %s seen as %v; want both fail and pass among the cases", k, seen[k])
		}
	}
	if !seen["module"][infer.Fail] || !seen["module"][infer.Warn] {
		t.Errorf("module seen as %v; want fail and warn", seen["module"])
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
	sres, _ := infer.Swap(c, ev, res.Candidates[0].Hypothesis, res.Candidates[0].Probability, true, infer.SwapOptions{})
	for _, r := range sres.Replacements[:2] {
		fmt.Println(r.Label(), r.Verdict)
	}
	// Output:
	// 340 TO-220 5 V drop-in
	// 78xx TO-220 5 V drop-in
}
