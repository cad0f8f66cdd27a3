package catalog_test

import (
	"os"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
)

func TestNotes(t *testing.T) {
	if n := catalog.Notes(builtin.Catalog()); len(n) > 0 {
		t.Errorf("the built-in catalog has notes: %v", n)
	}
	data, err := os.ReadFile("../testdata/catalog/good/replace-78xx.toml")
	if err != nil {
		t.Fatal(err)
	}
	ambiguous := `[[family]]
id = "my-ldo"
title = "test"
polarity = "positive"
kind = "fixed"
outputs_v = [1.8, 3.3]
tolerance = 0.02
current_a = 0.3
vin_max_v = 6
dropout_v = 0.3
tj_max_c = 125
status = "active"
commonness = 2
markings = ["*MY{VV}*"]
source = "invented for a test"
  [[family.package]]
  outline = "SOT-23"
  pins = ["GND", "OUT", "IN"]
  tab = "none"
  theta_ja = 300
`
	base, _ := builtin.Files()
	f1, errs := catalog.Load("mine.toml", data)
	f2, errs2 := catalog.Load("ldo.toml", []byte(ambiguous))
	if len(errs)+len(errs2) > 0 {
		t.Fatal(errs, errs2)
	}
	c := catalog.Merge(append(base, f1, f2)...)
	if lint := catalog.Lint(c); len(lint) > 0 {
		t.Fatalf("lint: %v", lint)
	}
	var got []string
	for _, n := range catalog.Notes(c, "mine.toml", "ldo.toml") {
		got = append(got, n.Error())
	}
	want := []string{
		`ldo.toml:6:1: family[0].outputs_v: the voltage code "18" of 1.8 V also reads as 18 V`,
		`mine.toml:3:1: family[0].id: family "78xx" replaces the one from builtin:fixed-positive.toml`,
	}
	if len(got) != len(want) {
		t.Fatalf("got %d notes, want %d:\n%s", len(got), len(want), strings.Join(got, "\n"))
	}
	for i := range want {
		if !strings.HasPrefix(got[i], want[i]) {
			t.Errorf("note %d:\n got %s\nwant %s…", i, got[i], want[i])
		}
	}
}

// TestLintAdded checks that only what user files add is linted, and
// everything when they define an outline.
func TestLintAdded(t *testing.T) {
	base, _ := builtin.Files()
	if errs := catalog.LintAdded(catalog.Merge(base...)); len(errs) > 0 {
		t.Errorf("nothing added, yet: %v", errs)
	}
	// A user outline that replaces TO-220 with two leads breaks every
	// built-in TO-220 package: LintAdded must see it.
	f, errs := catalog.Load("to220.toml", []byte(`[[outline]]
name = "TO-220"
leads = 2
pitch_mm = 2.54
tab = true
mounting_hole = true
view = "marked face toward you"
source = "invented for a test"
`))
	if len(errs) > 0 {
		t.Fatal(errs)
	}
	c := catalog.Merge(append(base, f)...)
	if got := catalog.LintAdded(c, f); len(got) == 0 {
		t.Error("a replaced TO-220 with two leads lints clean")
	}
}
