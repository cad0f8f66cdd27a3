package catalog

import (
	"fmt"
	"io/fs"
	"path"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/internal/tomlpos"
)

// File is one decoded catalog file.
type File struct {
	Name     string
	Outlines []Outline
	Families []Family
}

type fileData struct {
	Outline []Outline `toml:"outline"`
	Family  []Family  `toml:"family"`
}

const unknownKeyHint = "the known keys are listed in the starter file that `whichreg catalog init` writes"

// Load decodes one catalog file. name is used in error messages and as the
// entries' Origin. It returns the decoded entries and every problem found
// while decoding: syntax and type errors, unknown keys, and ids or outline
// names given twice in the file. Entries are returned even when there are
// errors, except after a syntax error.
func Load(name string, data []byte) (*File, ErrorList) {
	var d fileData
	ix, errs, ok := tomlpos.Decode(name, data, &d, unknownKeyHint)
	f := &File{Name: name}
	if !ok {
		return f, errs
	}
	f.Outlines, f.Families = d.Outline, d.Family
	seenO := map[string]int{}
	for i := range f.Outlines {
		o := &f.Outlines[i]
		o.Origin = name
		o.pos = position{file: name, ix: ix, path: fmt.Sprintf("outline[%d]", i)}
		k := strings.ToLower(o.Name)
		if j, ok := seenO[k]; ok && k != "" {
			errs.Add(name, ix, o.pos.path+".name", "outline %q is defined twice in this file (also outline[%d]); keep one", o.Name, j)
		}
		seenO[k] = i
	}
	seenF := map[string]int{}
	for i := range f.Families {
		fa := &f.Families[i]
		fa.Origin = name
		fa.pos = position{file: name, ix: ix, path: fmt.Sprintf("family[%d]", i)}
		k := strings.ToLower(fa.ID)
		if j, ok := seenF[k]; ok && k != "" {
			errs.Add(name, ix, fa.pos.path+".id", "duplicate id %q (also family[%d], line %d); ids must be unique within a file", fa.ID, j, ix.Nearest(fmt.Sprintf("family[%d].id", j)).Line)
		}
		seenF[k] = i
	}
	errs.Sort()
	return f, errs
}

// LoadFS loads every *.toml file under dir in fsys, in name order.
// Origins are written as prefix + file name (e.g. "builtin:fixed.toml").
func LoadFS(fsys fs.FS, dir, prefix string) ([]*File, ErrorList) {
	names, err := fs.Glob(fsys, path.Join(dir, "*.toml"))
	var errs ErrorList
	if err != nil {
		errs = append(errs, &Error{File: prefix + dir, Err: err})
		return nil, errs
	}
	sort.Strings(names)
	var files []*File
	for _, n := range names {
		data, err := fs.ReadFile(fsys, n)
		if err != nil {
			errs = append(errs, &Error{File: prefix + n, Err: err})
			continue
		}
		f, e := Load(prefix+path.Base(n), data)
		errs = append(errs, e...)
		files = append(files, f)
	}
	return files, errs
}

// Merge builds a catalog from files in order: an outline with the same name
// (case-insensitive) or a family with the same id as an earlier one replaces
// it, and the replacement records the origin it replaced.
func Merge(files ...*File) *Catalog {
	c := &Catalog{}
	for _, f := range files {
		if f == nil {
			continue
		}
		for _, o := range f.Outlines {
			replaced := false
			for i := range c.Outlines {
				if strings.EqualFold(c.Outlines[i].Name, o.Name) {
					c.Outlines[i] = o
					replaced = true
				}
			}
			if !replaced {
				c.Outlines = append(c.Outlines, o)
			}
		}
		for _, fa := range f.Families {
			replaced := false
			for i := range c.Families {
				if strings.EqualFold(c.Families[i].ID, fa.ID) {
					fa.Replaces = c.Families[i].Origin
					c.Families[i] = fa
					replaced = true
				}
			}
			if !replaced {
				c.Families = append(c.Families, fa)
			}
		}
	}
	return c
}
