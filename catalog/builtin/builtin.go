// Package builtin holds the catalog shipped with whichreg: TOML files, every
// value with its datasheet source. See package catalog for the format and
// DEVELOPERS.md for how to add a family.
//
// The TOML files are the source. "go generate ./catalog/builtin" turns them
// into Go values (builtin_gen.go) so that the tool starts without decoding
// TOML; a test fails when the two differ.
package builtin

//go:generate go run ./internal/gen

import (
	"embed"

	"github.com/whichreg/whichreg/catalog"
)

//go:embed *.toml
var files embed.FS

// Prefix is written before the file name in the Origin of built-in entries.
const Prefix = "builtin:"

// Files returns the built-in catalog files, as generated from their TOML.
// The error list is always empty; it is there so that callers treat the
// built-in catalog like any other.
func Files() ([]*catalog.File, catalog.ErrorList) {
	return generated(), nil
}

// Catalog returns the built-in catalog merged, as the tool has it before
// any user file: the entry point for a front end that does not load user
// catalogs. Each call returns a fresh catalog the caller may change.
func Catalog() *catalog.Catalog {
	return catalog.Merge(generated()...)
}

// Decode loads the built-in catalog from its TOML files, with key positions
// for messages. The tests compare it with [Files].
func Decode() ([]*catalog.File, catalog.ErrorList) {
	return catalog.LoadFS(files, ".", Prefix)
}
