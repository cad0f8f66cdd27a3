package replace_test

import (
	"path/filepath"
	"regexp"
	"strconv"
	"testing"

	"github.com/whichreg/whichreg/infer/replace"
)

// TestInstallCaseTemperature checks that no install note tells the
// technician to expect a case temperature the part cannot survive: a case
// hotter than the junction's own limit means the assumed mounting or load is
// not the board's, and the note must say to measure rather than predict
// (a case is never hotter than its junction: common practice, no source).
func TestInstallCaseTemperature(t *testing.T) {
	c := builtinCatalog(t)
	files, _ := filepath.Glob("../../testdata/swap/*.toml")
	re := regexp.MustCompile(`case about (-?[0-9]+) °C`)
	for _, name := range files {
		ev := load(t, c, name)
		sres, err := replace.Swap(c, ev, original(t, c, ev, ""), replace.Options{All: true})
		if err != nil {
			continue // a case naming its original by hand is TestSwapCases' business
		}
		for _, r := range sres.Replacements {
			if r.Verdict == replace.Unsuitable {
				continue
			}
			for _, note := range r.Install {
				m := re.FindStringSubmatch(note)
				if m == nil {
					continue
				}
				tc, _ := strconv.ParseFloat(m[1], 64)
				if tc > r.Family.TjMaxC {
					t.Errorf("%s: %s: install note predicts a case at %g °C, past the %g °C junction limit: %q", filepath.Base(name), r.Label(), tc, r.Family.TjMaxC, note)
				}
			}
		}
	}
}
