package catalog_test

import (
	"testing"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/internal/gencat"
)

// BenchmarkLoadBuiltin: the generated built-in catalog, merged, with only
// what user files add linted (what the tool does at start, here with none).
func BenchmarkLoadBuiltin(b *testing.B) {
	for b.Loop() {
		files, errs := builtin.Files()
		if len(errs) > 0 {
			b.Fatal(errs)
		}
		c := catalog.Merge(files...)
		if len(catalog.LintAdded(c)) > 0 {
			b.Fatal("lint")
		}
	}
}

// BenchmarkLintBuiltin: the whole built-in catalog linted (catalog check).
func BenchmarkLintBuiltin(b *testing.B) {
	files, _ := builtin.Files()
	c := catalog.Merge(files...)
	for b.Loop() {
		if len(catalog.Lint(c)) > 0 {
			b.Fatal("lint")
		}
	}
}

// BenchmarkDecodeBuiltin: the built-in catalog decoded from its TOML files.
func BenchmarkDecodeBuiltin(b *testing.B) {
	for b.Loop() {
		if _, errs := builtin.Decode(); len(errs) > 0 {
			b.Fatal(errs)
		}
	}
}

func benchLoadN(b *testing.B, n int) {
	data := gencat.Generate(n)
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

func benchFindN(b *testing.B, n int) { benchFindQuery(b, n, "?M3?7") }

func benchFindQuery(b *testing.B, n int, query string) {
	base, _ := builtin.Files()
	f, _ := catalog.Load("gen.toml", gencat.Generate(n))
	c := catalog.Merge(append(base, f)...)
	for b.Loop() {
		if hits := catalog.Find(c, query); len(hits) == 0 {
			b.Fatal("no hits")
		}
	}
}

// BenchmarkFindMarking10k: a whole marking (maker prefix, number, package
// suffix, a date code on the second line) over 10 000 extra families.
func BenchmarkFindMarking10k(b *testing.B) { benchFindQuery(b, 10000, "L7805CV 9402") }

func BenchmarkFind1k(b *testing.B)   { benchFindN(b, 1000) }
func BenchmarkFind10k(b *testing.B)  { benchFindN(b, 10000) }
func BenchmarkFind100k(b *testing.B) { benchFindN(b, 100000) }
