package catalog

import (
	"fmt"
	"io/fs"
	"path"
	"sort"
	"strings"
	"sync"

	"github.com/whichreg/whichreg/internal/tomlpos"
)

// File is one decoded catalog file.
type File struct {
	Name     string    // the name given to Load, used in messages and as Origin
	Outlines []Outline // the file's outlines, in file order
	Families []Family  // the file's families, in file order
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

// LoadFS loads every *.toml file under dir in fsys, in name order. It is
// safe for concurrent use.
// Origins are written as prefix + file name (e.g. "builtin:fixed.toml").
func LoadFS(fsys fs.FS, dir, prefix string) ([]*File, ErrorList) {
	names, err := fs.Glob(fsys, path.Join(dir, "*.toml"))
	var errs ErrorList
	if err != nil {
		errs = append(errs, &Error{File: prefix + dir, Err: err})
		return nil, errs
	}
	sort.Strings(names)
	// Decode the files concurrently (TOML decoding dominates start-up); the
	// results keep name order.
	files := make([]*File, len(names))
	perFile := make([]ErrorList, len(names))
	var wg sync.WaitGroup
	for i, n := range names {
		wg.Add(1)
		go func() {
			defer wg.Done()
			data, err := fs.ReadFile(fsys, n)
			if err != nil {
				perFile[i] = ErrorList{&Error{File: prefix + n, Err: err}}
				return
			}
			files[i], perFile[i] = Load(prefix+path.Base(n), data)
		}()
	}
	wg.Wait()
	var out []*File
	for i := range names {
		errs = append(errs, perFile[i]...)
		if files[i] != nil {
			out = append(out, files[i])
		}
	}
	return out, errs
}

// Merge builds a catalog from files in order: an outline with the same name
// (case-insensitive) or a family with the same id as an earlier one replaces
// it, and the replacement records the origin it replaced.
func Merge(files ...*File) *Catalog {
	c := &Catalog{}
	outlineAt := map[string]int{}
	familyAt := map[string]int{}
	for _, f := range files {
		if f == nil {
			continue
		}
		for _, o := range f.Outlines {
			k := strings.ToLower(o.Name)
			if i, ok := outlineAt[k]; ok {
				c.Outlines[i] = o
				continue
			}
			outlineAt[k] = len(c.Outlines)
			c.Outlines = append(c.Outlines, o)
		}
		for _, fa := range f.Families {
			k := strings.ToLower(fa.ID)
			if i, ok := familyAt[k]; ok {
				fa.Replaces = c.Families[i].Origin
				c.Families[i] = fa
				continue
			}
			familyAt[k] = len(c.Families)
			c.Families = append(c.Families, fa)
		}
	}
	return c
}
