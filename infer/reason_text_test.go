package infer_test

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
)

// TestReasonSentencesComplete: every reason sentence of every candidate of
// every scenario reads whole: no word left out between two spaces (a lead
// function printed as "" once gave "this pinout puts  there"), no dangling
// space, no Go formatting noise.
func TestReasonSentencesComplete(t *testing.T) {
	files, _ := filepath.Glob("../testdata/infer/*.toml")
	demos, _ := filepath.Glob("../testdata/demo/*.toml")
	files = append(files, demos...)
	if len(files) < 10 {
		t.Fatalf("only %d scenarios found", len(files))
	}
	c := builtin.Catalog()
	for _, name := range files {
		data, err := os.ReadFile(name)
		if err != nil {
			t.Fatal(err)
		}
		ev, err := infer.LoadEvidence(name, data, c)
		if err != nil {
			continue // the bad scenarios are tested elsewhere
		}
		res, err := infer.Identify(c, ev, infer.Options{Explain: infer.ExplainAll})
		if err != nil {
			continue
		}
		for _, cd := range res.Candidates {
			for _, r := range cd.Reasons {
				if r.Text == "" || strings.Contains(r.Text, "  ") || strings.TrimSpace(r.Text) != r.Text ||
					strings.Contains(r.Text, "%!") || strings.Contains(r.Text, "<nil>") {
					t.Errorf("%s: %s: %s: sentence %q", filepath.Base(name), cd.Label(), r.Evidence, r.Text)
				}
			}
		}
	}
}
