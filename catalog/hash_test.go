package catalog_test

import (
	"fmt"
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

// Hash covers a catalog's content, not where its files were read from: the
// record names it so that a later reader can tell which figures were used.
func ExampleCatalog_Hash() {
	data := []byte(`[[family]]
id = "shop-5v"
title = "the shop's own 5 V module"
polarity = "positive"
kind = "fixed"
outputs_v = [5]
tolerance = 0.05
current_a = 0.5
vin_max_v = 30
dropout_v = 2
tj_max_c = 125
status = "active"
commonness = 1
source = "example"
  [[family.package]]
  outline = "TO-220"
  pins = ["IN", "GND", "OUT"]
  tab = "GND"
  theta_jc = 5
  theta_ja = 50
`)
	base, _ := builtin.Files()
	a, errs := catalog.Load("/home/ann/catalog/shop.toml", data)
	b, _ := catalog.Load("/mnt/bench/copy.toml", data)
	fmt.Println(errs)
	x, y := catalog.Merge(append(base, a)...), catalog.Merge(append(base, b)...)
	fmt.Println(len(x.Hash()), x.Hash() == y.Hash(), x.Hash() == builtin.Catalog().Hash())
	// Output:
	// no errors
	// 64 true false
}
