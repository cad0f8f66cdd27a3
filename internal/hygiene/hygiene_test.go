package hygiene

import (
	"bytes"
	"go/ast"
	"go/doc"
	"go/parser"
	"go/token"
	"io/fs"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"
)

// maxLines is the longest a hand-written Go file may be (RULES.md).
const maxLines = 450

// moduleRoot is the folder that holds go.mod, two levels up from here.
const moduleRoot = "../.."

// sourceFile is one non-test Go file of the module.
type sourceFile struct {
	path      string // relative to the module root, slash-separated
	generated bool   // carries the "Code generated … DO NOT EDIT." line or ends in _gen.go
	lines     int
}

// goFiles lists the module's non-test Go files, grouped by folder.
func goFiles(t *testing.T) map[string][]sourceFile {
	t.Helper()
	dirs := map[string][]sourceFile{}
	err := filepath.WalkDir(moduleRoot, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() {
			name := d.Name()
			if path != moduleRoot && (strings.HasPrefix(name, ".") || name == "testdata") {
				return filepath.SkipDir
			}
			return nil
		}
		if !strings.HasSuffix(path, ".go") || strings.HasSuffix(path, "_test.go") {
			return nil
		}
		data, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		rel, _ := filepath.Rel(moduleRoot, path)
		f := sourceFile{
			path:      filepath.ToSlash(rel),
			generated: strings.HasSuffix(path, "_gen.go") || ast.IsGenerated(mustParseHeader(t, path, data)),
			lines:     bytes.Count(data, []byte("\n")),
		}
		dirs[filepath.Dir(path)] = append(dirs[filepath.Dir(path)], f)
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if len(dirs) < 10 {
		t.Fatalf("found Go files in only %d folders under %s; is the module root right?", len(dirs), moduleRoot)
	}
	return dirs
}

func mustParseHeader(t *testing.T, path string, data []byte) *ast.File {
	t.Helper()
	f, err := parser.ParseFile(token.NewFileSet(), path, data, parser.ParseComments|parser.PackageClauseOnly)
	if err != nil {
		t.Fatal(err)
	}
	return f
}

// TestFileLength: no hand-written Go file over 450 lines; generated files
// and tests are exempt (RULES.md).
func TestFileLength(t *testing.T) {
	for _, files := range goFiles(t) {
		for _, f := range files {
			if !f.generated && f.lines > maxLines {
				t.Errorf("%s has %d lines; a hand-written file keeps to %d: split it by job", f.path, f.lines, maxLines)
			}
		}
	}
}

// parsePackages parses every folder's non-test, hand-written files.
func parsePackages(t *testing.T, fset *token.FileSet) map[string][]*ast.File {
	t.Helper()
	pkgs := map[string][]*ast.File{}
	for dir, files := range goFiles(t) {
		for _, f := range files {
			if f.generated {
				continue
			}
			af, err := parser.ParseFile(fset, filepath.Join(moduleRoot, f.path), nil, parser.ParseComments)
			if err != nil {
				t.Fatal(err)
			}
			pkgs[dir] = append(pkgs[dir], af)
		}
	}
	return pkgs
}

// TestDocComments: every package and every exported name (types, functions,
// methods of exported types, constants, variables and the fields of
// exported structs) has a doc comment (RULES.md; STYLE.md guideline 12).
// A name in a const or var group may share the group's comment.
func TestDocComments(t *testing.T) {
	fset := token.NewFileSet()
	var missing []string
	for dir, files := range parsePackages(t, fset) {
		if len(files) == 0 {
			continue
		}
		p, err := doc.NewFromFiles(fset, files, "example.com/"+dir, doc.PreserveAST)
		if err != nil {
			t.Fatal(err)
		}
		rel, _ := filepath.Rel(moduleRoot, dir)
		if strings.TrimSpace(p.Doc) == "" && p.Name != "main" {
			missing = append(missing, "package "+filepath.ToSlash(rel))
		}
		if p.Name == "main" && strings.TrimSpace(p.Doc) == "" {
			missing = append(missing, "package "+filepath.ToSlash(rel)+" (the command's doc)")
		}
		pos := func(n ast.Node) string {
			return strings.TrimPrefix(filepath.ToSlash(fset.Position(n.Pos()).String()), "../../")
		}
		checkValues := func(vs []*doc.Value) {
			for _, v := range vs {
				if strings.TrimSpace(v.Doc) != "" {
					continue
				}
				for _, spec := range v.Decl.Specs {
					vs := spec.(*ast.ValueSpec)
					if vs.Doc != nil || vs.Comment != nil {
						continue
					}
					for _, n := range vs.Names {
						if n.IsExported() {
							missing = append(missing, pos(n)+": "+n.Name)
						}
					}
				}
			}
		}
		checkFuncs := func(fs []*doc.Func) {
			for _, f := range fs {
				if strings.TrimSpace(f.Doc) == "" {
					name := f.Name
					if f.Recv != "" {
						name = "(" + f.Recv + ")." + name
					}
					missing = append(missing, pos(f.Decl)+": "+name)
				}
			}
		}
		checkValues(p.Consts)
		checkValues(p.Vars)
		checkFuncs(p.Funcs)
		for _, ty := range p.Types {
			if strings.TrimSpace(ty.Doc) == "" {
				missing = append(missing, pos(ty.Decl)+": type "+ty.Name)
			}
			for _, spec := range ty.Decl.Specs {
				ts := spec.(*ast.TypeSpec)
				if ts.Name.Name != ty.Name {
					continue
				}
				switch tt := ts.Type.(type) {
				case *ast.StructType:
					for _, n := range undocumentedFields(fset, tt.Fields) {
						missing = append(missing, pos(n)+": field "+ty.Name+"."+n.Name)
					}
				case *ast.InterfaceType:
					for _, n := range undocumentedFields(fset, tt.Methods) {
						missing = append(missing, pos(n)+": method "+ty.Name+"."+n.Name)
					}
				}
			}
			checkValues(ty.Consts)
			checkValues(ty.Vars)
			checkFuncs(ty.Funcs)
			checkFuncs(ty.Methods)
		}
	}
	sort.Strings(missing)
	for _, m := range missing {
		t.Errorf("no doc comment: %s", m)
	}
}

// TestNoBareBool: no exported function or method takes a bool parameter
// (RULES.md): a call reads f(x, true) and the reader cannot tell what true
// means. Use a named type, an option struct or two functions.
func TestNoBareBool(t *testing.T) {
	fset := token.NewFileSet()
	for _, files := range parsePackages(t, fset) {
		for _, f := range files {
			for _, d := range f.Decls {
				fn, ok := d.(*ast.FuncDecl)
				if !ok || !fn.Name.IsExported() {
					continue
				}
				for _, p := range fn.Type.Params.List {
					if id, ok := p.Type.(*ast.Ident); ok && id.Name == "bool" {
						t.Errorf("%s: %s takes a bare bool", strings.TrimPrefix(filepath.ToSlash(fset.Position(fn.Pos()).String()), "../../"), fn.Name.Name)
					}
				}
			}
		}
	}
}

// undocumentedFields returns the exported fields (or interface methods)
// of a list with no comment. A
// field on the line right below a documented field shares that field's
// leading comment ("// MeanHigh and MeanLow are …"), as gofmt groups them.
func undocumentedFields(fset *token.FileSet, list *ast.FieldList) []*ast.Ident {
	var missing []*ast.Ident
	grouped, prevEnd := false, -1
	for _, fld := range list.List {
		line := fset.Position(fld.Pos()).Line
		switch {
		case fld.Doc != nil:
			grouped = true
		case grouped && line == prevEnd+1:
			// under the group's comment
		default:
			grouped = false
			if fld.Comment == nil {
				for _, n := range fld.Names {
					if n.IsExported() {
						missing = append(missing, n)
					}
				}
			}
		}
		prevEnd = fset.Position(fld.End()).Line
	}
	return missing
}
