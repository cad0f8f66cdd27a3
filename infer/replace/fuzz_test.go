package replace_test

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
)

// FuzzSwap runs identification and the replacement checks on any evidence
// the loader accepts: no panic, and every check's margin and figures are
// numbers (JSON has no NaN or infinity).
func FuzzSwap(f *testing.F) {
	files, _ := filepath.Glob("../../testdata/swap/*.toml")
	for _, name := range files {
		if data, err := os.ReadFile(name); err == nil {
			f.Add(data)
		}
	}
	c := builtin.Catalog()
	f.Fuzz(func(t *testing.T, data []byte) {
		ev, err := infer.LoadEvidence("f.toml", data, c)
		if err != nil {
			return
		}
		res, err := infer.Identify(c, ev, infer.Options{})
		if err != nil {
			return
		}
		o, err := infer.ChooseOriginal(res, nil)
		if err != nil {
			return
		}
		sres, err := replace.Swap(c, ev, o, replace.Options{All: true})
		if err != nil {
			return
		}
		bad := func(x float64) bool { return math.IsNaN(x) || math.IsInf(x, 0) }
		for _, r := range sres.Replacements {
			for _, ch := range r.Checks {
				if bad(ch.Margin) || (ch.Value != nil && bad(*ch.Value)) || (ch.Limit != nil && bad(*ch.Limit)) {
					t.Fatalf("%s %s: margin %v value %v limit %v (%s)", r.Label(), ch.Name, ch.Margin, ch.Value, ch.Limit, ch.Text)
				}
			}
		}
	})
}
