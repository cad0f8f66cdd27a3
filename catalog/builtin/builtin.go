// Package builtin holds the catalog shipped with whichreg: TOML files embedded
// in the binary, every value with its datasheet source. See package catalog
// for the format and DEVELOPERS.md for how to add a family.
package builtin

import (
	"embed"

	"github.com/whichreg/whichreg/catalog"
)

//go:embed *.toml
var files embed.FS

// Prefix is written before the file name in the Origin of built-in entries.
const Prefix = "builtin:"

// Files loads the built-in catalog files. The error list is empty for the
// shipped catalog; a test keeps it so.
func Files() ([]*catalog.File, catalog.ErrorList) {
	return catalog.LoadFS(files, ".", Prefix)
}

// Raw returns the text of the built-in files by name, for hashing and for
// the starter file.
func Raw() (map[string][]byte, error) {
	ents, err := files.ReadDir(".")
	if err != nil {
		return nil, err
	}
	out := map[string][]byte{}
	for _, e := range ents {
		b, err := files.ReadFile(e.Name())
		if err != nil {
			return nil, err
		}
		out[e.Name()] = b
	}
	return out, nil
}
