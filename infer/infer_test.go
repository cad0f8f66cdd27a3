package infer_test

import (
	"encoding/json"
	"flag"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/internal/gencat"
	"github.com/whichreg/whichreg/internal/golden"
)

var update = flag.Bool("update", false, "update golden files")

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

// header reads the "# want:", "# conflict:" and "# prior-only" lines at the top of a scenario.
type header struct {
	family, pkg string
	vout        float64
	notInCat    bool
	any         bool
	conflict    string
	priorOnly   bool
}

func readHeader(t *testing.T, name string) header {
	data, _ := os.ReadFile(name)
	var h header
	for _, line := range strings.Split(string(data), "\n") {
		switch {
		case strings.HasPrefix(line, "# want: "):
			f := strings.Fields(strings.TrimPrefix(line, "# want: "))
			switch f[0] {
			case "not-in-catalog":
				h.notInCat = true
			case "any":
				h.any = true
			default:
				h.family, h.pkg = f[0], f[1]
				if len(f) > 2 {
					h.vout, _ = strconv.ParseFloat(f[2], 64)
				}
			}
		case strings.HasPrefix(line, "# conflict: "):
			h.conflict = strings.TrimPrefix(line, "# conflict: ")
		case line == "# prior-only":
			h.priorOnly = true
		}
	}
	if h.family == "" && !h.notInCat && !h.any {
		t.Fatalf("%s has no '# want:' line", name)
	}
	return h
}

type goldenCandidate struct {
	Label       string  `json:"label"`
	Probability float64 `json:"probability"`
	Score       float64 `json:"score"`
}

type goldenResult struct {
	Top          []goldenCandidate `json:"top"`
	NotInCatalog float64           `json:"not_in_catalog"`
	Conflicts    []string          `json:"conflicts"`
	Next         []string          `json:"next"`
}

func r4(x float64) float64 { return math.Round(x*1e4) / 1e4 }

// TestScenarios runs every demo and test scenario, checks its intended leader
// and compares the ranking with its golden JSON.
func TestScenarios(t *testing.T) {
	c := builtinCatalog(t)
	files, _ := filepath.Glob("../testdata/demo/*.toml")
	more, _ := filepath.Glob("../testdata/infer/*.toml")
	if len(files) < 4 || len(more) < 12 {
		t.Fatalf("want at least 4 demo and 12 test scenarios, found %d and %d", len(files), len(more))
	}
	for _, name := range append(files, more...) {
		t.Run(filepath.Base(name), func(t *testing.T) {
			h := readHeader(t, name)
			res, err := infer.Identify(c, load(t, c, name), infer.Options{})
			if err != nil {
				t.Fatal(err)
			}
			lead := res.Candidates[0]
			switch {
			case h.notInCat:
				if res.NotInCatalog < lead.Probability {
					t.Errorf("not in catalog %.3f, but %s leads with %.3f", res.NotInCatalog, lead.Label(), lead.Probability)
				}
			case !h.any:
				if lead.Family.ID != h.family || lead.Package.Outline != h.pkg || (h.vout > 0 && lead.VoutV != h.vout) {
					t.Errorf("leader %s (%.3f), want %s %s %g", lead.Label(), lead.Probability, h.family, h.pkg, h.vout)
				}
				if res.NotInCatalog > lead.Probability {
					t.Errorf("not in catalog %.3f beats the leader", res.NotInCatalog)
				}
			}
			if h.conflict != "" && !strings.Contains(strings.Join(res.Conflicts, "\n"), h.conflict) {
				t.Errorf("conflicts %q lack %q", res.Conflicts, h.conflict)
			}
			if res.PriorOnly != h.priorOnly {
				t.Errorf("PriorOnly = %v, want %v", res.PriorOnly, h.priorOnly)
			}
			checkInvariants(t, res)
			g := goldenResult{NotInCatalog: r4(res.NotInCatalog), Conflicts: res.Conflicts}
			for _, cd := range res.Candidates[:5] {
				g.Top = append(g.Top, goldenCandidate{cd.Label(), r4(cd.Probability), r4(cd.Score)})
			}
			for _, m := range res.Next {
				g.Next = append(g.Next, fmt.Sprintf("%s (%.2f bits)", m.Measure, m.GainBits))
			}
			got, _ := json.MarshalIndent(g, "", "  ")
			golden.Check(t, strings.TrimSuffix(name, ".toml")+".golden.json", string(got)+"\n", golden.Update(*update))
		})
	}
}

// checkInvariants: probabilities sum to 1; each score is the sum of its
// reasons; candidates are sorted.
func checkInvariants(t *testing.T, res *infer.Result) {
	t.Helper()
	sum := res.NotInCatalog
	for i, c := range res.Candidates {
		sum += c.Probability
		w := 0.0
		for _, r := range c.Reasons {
			w += r.Weight
		}
		if math.Abs(w-c.Score) > 1e-9 {
			t.Errorf("%s: score %g but reasons add to %g", c.Label(), c.Score, w)
		}
		if i > 0 && c.Probability > res.Candidates[i-1].Probability {
			t.Errorf("candidates not sorted at %d", i)
		}
	}
	if math.Abs(sum-1) > 1e-9 {
		t.Errorf("probabilities sum to %.12f", sum)
	}
}

// TestAgreeingEvidence: adding evidence that agrees with the leader never
// lowers its probability.
func TestAgreeingEvidence(t *testing.T) {
	c := builtinCatalog(t)
	tests := []struct {
		file, old, new string // replace old by new ("" old: append new)
	}{
		{"../testdata/infer/to220-7805-plain.toml", "", "[outline]\nleads = 3\nmetal_can = false\n"},
		{"../testdata/infer/to220-7805-plain.toml", "ref = ", "marking = \"LM7805CT\"\nref = "},
		{"../testdata/demo/controller-to3-case.toml", "", "[pins.2]\nwired_to = \"unregulated\"\n"},
		{"../testdata/demo/preamp-adjustable.toml", "marking   = \"*\"", "marking = \"LM317T\""},
		{"../testdata/infer/to92-79l12.toml", "", "[case]\ntied_to_pin = 0\n"},
	}
	for _, tt := range tests {
		base := load(t, c, tt.file)
		r0, _ := infer.Identify(c, base, infer.Options{})
		data, _ := os.ReadFile(tt.file)
		text := string(data)
		if tt.old == "" {
			text += tt.new
		} else if !strings.Contains(text, tt.old) {
			t.Fatalf("%s lacks %q", tt.file, tt.old)
		} else {
			text = strings.Replace(text, tt.old, tt.new, 1)
		}
		ev, err := infer.LoadEvidence(tt.file, []byte(text), c)
		if err != nil {
			t.Fatalf("%s: %v", tt.file, err)
		}
		r1, _ := infer.Identify(c, ev, infer.Options{})
		lead := r0.Candidates[0].Label()
		var p1 float64
		for _, cd := range r1.Candidates {
			if cd.Label() == lead {
				p1 = cd.Probability
			}
		}
		if p1 < r0.Candidates[0].Probability-1e-12 {
			t.Errorf("%s: leader %s fell from %.4f to %.4f after agreeing evidence", tt.file, lead, r0.Candidates[0].Probability, p1)
		}
	}
}

// TestShuffledCatalog: the order of the catalog does not change the result.
func TestShuffledCatalog(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../testdata/demo/vending-lifted-ground.toml")
	r0, _ := infer.Identify(c, ev, infer.Options{})
	rng := rand.New(rand.NewPCG(1, 1))
	sh := &catalog.Catalog{Outlines: append([]catalog.Outline(nil), c.Outlines...), Families: append([]catalog.Family(nil), c.Families...)}
	rng.Shuffle(len(sh.Families), func(i, j int) { sh.Families[i], sh.Families[j] = sh.Families[j], sh.Families[i] })
	rng.Shuffle(len(sh.Outlines), func(i, j int) { sh.Outlines[i], sh.Outlines[j] = sh.Outlines[j], sh.Outlines[i] })
	ev2 := load(t, sh, "../testdata/demo/vending-lifted-ground.toml")
	r1, _ := infer.Identify(sh, ev2, infer.Options{})
	for i := range r0.Candidates[:20] {
		a, b := r0.Candidates[i], r1.Candidates[i]
		if a.Label() != b.Label() || math.Abs(a.Probability-b.Probability) > 1e-12 {
			t.Fatalf("rank %d: %s %.6f vs %s %.6f", i, a.Label(), a.Probability, b.Label(), b.Probability)
		}
	}
}

// TestBadEvidence: each bad file gives its golden, positioned message.
func TestBadEvidence(t *testing.T) {
	c := builtinCatalog(t)
	files, _ := filepath.Glob("../testdata/evidence/bad/*.toml")
	if len(files) < 8 {
		t.Fatalf("found %d bad evidence files", len(files))
	}
	for _, name := range files {
		t.Run(filepath.Base(name), func(t *testing.T) {
			data, _ := os.ReadFile(name)
			rel := "testdata/evidence/bad/" + filepath.Base(name)
			_, err := infer.LoadEvidence(rel, data, c)
			if err == nil {
				t.Fatal("loads without error")
			}
			got := err.Error() + "\n"
			if !strings.HasPrefix(got, rel+":") {
				t.Errorf("message does not start with file:line: %q", got)
			}
			golden.Check(t, strings.TrimSuffix(name, ".toml")+".golden", got, golden.Update(*update))
		})
	}
}

func FuzzLoadEvidence(f *testing.F) {
	seeds, _ := filepath.Glob("../testdata/*/*.toml")
	bad, _ := filepath.Glob("../testdata/evidence/bad/*.toml")
	corpus, _ := filepath.Glob("../testdata/bad/evidence-*.toml")
	more, _ := filepath.Glob("../testdata/fuzz/evidence/*")
	seeds = append(append(append(seeds, bad...), corpus...), more...)
	if len(seeds) == 0 {
		f.Fatal("no seeds")
	}
	for _, s := range seeds {
		data, _ := os.ReadFile(s)
		f.Add(data)
	}
	c := builtinCatalog(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		ev, err := infer.LoadEvidence("fuzz.toml", data, c)
		if err != nil {
			_ = err.Error()
			return
		}
		res, err := infer.Identify(c, ev, infer.Options{})
		if err != nil {
			return
		}
		for _, cd := range res.Candidates {
			if math.IsNaN(cd.Probability) || math.IsNaN(cd.Score) {
				t.Fatalf("NaN for %s", cd.Label())
			}
		}
	})
}

// BenchmarkIdentify: the text output's path (reasons written for the leaders).
func BenchmarkIdentify(b *testing.B) {
	c := builtinCatalog(b)
	ev := load(b, c, "../testdata/demo/bench-supply-negative.toml")
	for b.Loop() {
		if _, err := infer.Identify(c, ev, infer.Options{Explain: 8}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkIdentifyAllReasons: the JSON path (every candidate's reasons written).
func BenchmarkIdentifyAllReasons(b *testing.B) {
	c := builtinCatalog(b)
	ev := load(b, c, "../testdata/demo/bench-supply-negative.toml")
	for b.Loop() {
		if _, err := infer.Identify(c, ev, infer.Options{Explain: infer.ExplainAll}); err != nil {
			b.Fatal(err)
		}
	}
}

func benchIdentifyN(b *testing.B, n int) {
	base, _ := builtin.Files()
	f, errs := catalog.Load("gen.toml", gencat.Generate(n))
	if len(errs) > 0 {
		b.Fatal(errs)
	}
	c := catalog.Merge(append(base, f)...)
	ev := load(b, c, "../testdata/demo/bench-supply-negative.toml")
	b.ResetTimer()
	for b.Loop() {
		if _, err := infer.Identify(c, ev, infer.Options{Explain: 8}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkIdentify1k(b *testing.B)   { benchIdentifyN(b, 1000) }
func BenchmarkIdentify10k(b *testing.B)  { benchIdentifyN(b, 10000) }
func BenchmarkIdentify100k(b *testing.B) { benchIdentifyN(b, 100000) }

func ExampleIdentify() {
	files, _ := builtin.Files()
	c := catalog.Merge(files...)
	ev, err := infer.LoadEvidence("u1.toml", []byte(`
package = "TO-92"
[pins.1]
wired_to = "load"
volts = 5.0
[pins.2]
wired_to = "ground"
[pins.3]
wired_to = "unregulated"
volts = 9.0
`), c)
	if err != nil {
		fmt.Println(err)
		return
	}
	res, _ := infer.Identify(c, ev, infer.Options{})
	fmt.Printf("%s %.2f\n", res.Candidates[0].Label(), res.Candidates[0].Probability)
	// Output: 78Lxx TO-92 5 V 0.81
}

// TestLookAlikeVariantsRankAsOne: variants of one family that share the
// outline, pinout and tab (the two 1117 SOT-223 ratings) are one
// candidate whose score is still the sum of its reasons and whose label
// names a variant only when the evidence separates them (a 0.9 A load rules
// out National's 0.5 A 317 DPAK: LM317 datasheet, MDT current limit 0.5 A
// minimum).
func TestLookAlikeVariantsRankAsOne(t *testing.T) {
	c := builtinCatalog(t)
	for _, tc := range []struct{ file, label string }{
		{"../testdata/infer/sot223-1117-33.toml", "1117 SOT-223 3.3 V"},
		{"../testdata/infer/dpak-317-load-separates.toml", "317 DPAK (1.5 A TI KVU) 5 V"},
	} {
		res, err := infer.Identify(c, load(t, c, tc.file), infer.Options{})
		if err != nil {
			t.Fatal(err)
		}
		lead := res.Candidates[0]
		if lead.Label() != tc.label || len(lead.Variants) != 1 {
			t.Errorf("%s: leader %q with %d look-alikes, want %q with 1", tc.file, lead.Label(), len(lead.Variants), tc.label)
		}
		sum := 0.0
		for _, r := range lead.Reasons {
			sum += r.Weight
		}
		if math.Abs(sum-lead.Score) > 1e-9 {
			t.Errorf("%s: score %g, reasons sum to %g", tc.file, lead.Score, sum)
		}
		for _, cd := range res.Candidates[1:] {
			if cd.Family == lead.Family && cd.Package.Outline == lead.Package.Outline && cd.VoutV == lead.VoutV {
				t.Errorf("%s: look-alike %s ranked apart from %s", tc.file, cd.Label(), lead.Label())
			}
		}
	}
}
