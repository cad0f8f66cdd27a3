package infer_test

import (
	"errors"
	"os"
	"testing"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
)

// TestChooseOriginalPackageAtGlance: a leader in an outline nobody would
// mistake for the named one (a TO-92 for a TO-220) is not taken as the
// original; the choice is refused as not in the catalog.
func TestChooseOriginalPackageAtGlance(t *testing.T) {
	name := "../testdata/infer/reversed-meter-negative.toml"
	data, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	c := builtin.Catalog()
	ev, err := infer.LoadEvidence(name, data, c)
	if err != nil {
		t.Fatal(err)
	}
	res, err := infer.Identify(c, ev, infer.Options{})
	if err != nil {
		t.Fatal(err)
	}
	o, err := infer.ChooseOriginal(res, nil)
	if !errors.Is(err, infer.ErrNotInCatalog) {
		t.Fatalf("ChooseOriginal = %s, %v; want ErrNotInCatalog", o.Label(), err)
	}
}
