package catalog_test

import (
	"fmt"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
)

func BenchmarkLoadBuiltin(b *testing.B) {
	for b.Loop() {
		files, errs := builtin.Files()
		if len(errs) > 0 {
			b.Fatal(errs)
		}
		c := catalog.Merge(files...)
		if len(catalog.Lint(c)) > 0 {
			b.Fatal("lint")
		}
	}
}

// genCatalog writes a catalog of n invented families (for benchmarks only),
// each a fixed 5 V part in a TO-220 with a marking of its own.
func genCatalog(n int) []byte {
	var b strings.Builder
	for i := 0; i < n; i++ {
		fmt.Fprintf(&b, `[[family]]
id = "gen%d"
title = "generated"
polarity = "positive"
kind = "fixed"
outputs_v = [5]
tolerance = 0.04
current_a = 1.0
vin_max_v = 35
dropout_v = 2.0
iq_ma = 8
tj_max_c = 125
status = "active"
commonness = 3
markings = ["*G%dX{VV}*"]
source = "generated for a benchmark"
  [[family.package]]
  outline = "TO-220"
  pins = ["IN", "GND", "OUT"]
  tab = "GND"
  theta_jc = 5
  theta_ja = 65
`, i, i)
	}
	return []byte(b.String())
}

func benchLoadN(b *testing.B, n int) {
	data := genCatalog(n)
	base, _ := builtin.Files()
	b.SetBytes(int64(len(data)))
	for b.Loop() {
		f, errs := catalog.Load("gen.toml", data)
		if len(errs) > 0 {
			b.Fatal(errs[0])
		}
		c := catalog.Merge(append(append([]*catalog.File(nil), base...), f)...)
		if errs := catalog.Lint(c); len(errs) > 0 {
			b.Fatal(errs[0])
		}
	}
}

func BenchmarkLoad1k(b *testing.B)  { benchLoadN(b, 1000) }
func BenchmarkLoad10k(b *testing.B) { benchLoadN(b, 10000) }

func benchFindN(b *testing.B, n int) {
	base, _ := builtin.Files()
	f, _ := catalog.Load("gen.toml", genCatalog(n))
	c := catalog.Merge(append(base, f)...)
	for b.Loop() {
		if hits := catalog.Find(c, "?M3?7"); len(hits) == 0 {
			b.Fatal("no hits")
		}
	}
}

func BenchmarkFind1k(b *testing.B)   { benchFindN(b, 1000) }
func BenchmarkFind10k(b *testing.B)  { benchFindN(b, 10000) }
func BenchmarkFind100k(b *testing.B) { benchFindN(b, 100000) }
