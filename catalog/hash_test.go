package catalog_test

import (
	"os"
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
)

// TestHashIsContent checks that the catalog hash follows the content, not
// where the files were loaded from.
func TestHashIsContent(t *testing.T) {
	data, err := os.ReadFile("../testdata/catalog/good/one-family.toml")
	if err != nil {
		t.Fatal(err)
	}
	load := func(name string, data []byte) *catalog.Catalog {
		f, errs := catalog.Load(name, data)
		if len(errs) > 0 {
			t.Fatal(errs)
		}
		base, _ := builtin.Files()
		return catalog.Merge(append(base, f)...)
	}
	a := load("/home/one/catalog/mine.toml", data)
	b := load("/mnt/other/place/copy.toml", data)
	if a.Hash() != b.Hash() {
		t.Errorf("the same file in two folders hashes differently: %s, %s", a.Hash(), b.Hash())
	}
	if a.Hash() == builtin.Catalog().Hash() {
		t.Error("adding a user family did not change the hash")
	}
	c := builtin.Catalog()
	c.Families[0].Packages[0].ThetaJA += 1
	if c.Hash() == builtin.Catalog().Hash() {
		t.Error("a changed thermal figure did not change the hash")
	}
	if first, second := builtin.Catalog(), builtin.Catalog(); first.Hash() != second.Hash() {
		t.Error("the built-in catalog hashes differently from call to call (or a caller's change leaked into it)")
	}
	if len(builtin.Catalog().Hash()) != 64 {
		t.Error("not a hex SHA-256")
	}
}
