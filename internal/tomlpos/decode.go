package tomlpos

import (
	"errors"
	"fmt"
	"reflect"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"sync"
	"unicode/utf8"

	"github.com/BurntSushi/toml"
)

// Error is a problem at a place in a file. Lines and columns start at 1;
// 0 means the place is not known. Key is the dotted path of the key
// concerned (with array indices, see [Index]), or "" when there is none.
type Error struct {
	File string // file name as given
	Line int    // from 1; 0 = unknown
	Col  int    // from 1, in bytes; 0 = unknown
	Key  string // dotted key path with array indices; "" = none
	Err  error  // what is wrong and what to do
}

// Error returns the problem on one line, "file:line:col: key: message".
func (e *Error) Error() string {
	var b strings.Builder
	if e.File != "" {
		b.WriteString(e.File)
		b.WriteString(":")
	}
	if e.Line > 0 {
		b.WriteString(strconv.Itoa(e.Line))
		b.WriteString(":")
		if e.Col > 0 {
			b.WriteString(strconv.Itoa(e.Col))
			b.WriteString(":")
		}
	}
	if b.Len() > 0 {
		b.WriteString(" ")
	}
	if e.Key != "" {
		b.WriteString(e.Key)
		b.WriteString(": ")
	}
	if e.Err != nil {
		b.WriteString(e.Err.Error())
	}
	return b.String()
}

// Unwrap returns the underlying error.
func (e *Error) Unwrap() error { return e.Err }

// ErrorList is a list of positioned errors. The zero value is an empty list.
type ErrorList []*Error

// Locator finds where a key is written; [Index] and [*Lazy] are Locators.
type Locator interface {
	// Nearest returns the entry for the dotted key path or, failing that,
	// for its longest prefix that has one; the zero Entry when none does.
	Nearest(path string) Entry
}

var (
	_ Locator = Index(nil)
	_ Locator = (*Lazy)(nil)
)

// Lazy is the index of a document, built the first time it is asked for:
// positions are only needed when there is something to report.
type Lazy struct {
	data []byte
	ix   Index
	done bool
}

// NewLazy returns a Lazy index of data.
func NewLazy(data []byte) *Lazy { return &Lazy{data: data} }

// Index returns the document's index, scanning it on first use.
func (l *Lazy) Index() Index {
	if !l.done {
		l.ix, l.done = Scan(l.data), true
	}
	return l.ix
}

// Nearest is [Index.Nearest] on the document's index.
func (l *Lazy) Nearest(path string) Entry { return l.Index().Nearest(path) }

// Add appends an error at the place of key (or the nearest enclosing table
// when the key itself is not written).
func (l *ErrorList) Add(file string, loc Locator, key string, format string, args ...any) {
	ent := loc.Nearest(key)
	*l = append(*l, &Error{File: file, Line: ent.Line, Col: ent.Col, Key: key, Err: fmt.Errorf(format, args...)})
}

// Sort orders the list by file, line and column.
func (l ErrorList) Sort() {
	sort.SliceStable(l, func(i, j int) bool {
		a, b := l[i], l[j]
		if a.File != b.File {
			return a.File < b.File
		}
		if a.Line != b.Line {
			return a.Line < b.Line
		}
		return a.Col < b.Col
	})
}

// Error returns the first error and how many more there are.
func (l ErrorList) Error() string {
	switch len(l) {
	case 0:
		return "no errors"
	case 1:
		return l[0].Error()
	}
	return fmt.Sprintf("%s (and %d more errors)", l[0], len(l)-1)
}

// typeErrRE reads the line and key out of the TOML library's type errors.
// It is compiled on first use: most runs never meet a type error, and a
// compiled regexp at package initialisation costs every start of the tool.
var typeErrRE = sync.OnceValue(func() *regexp.Regexp {
	return regexp.MustCompile(`^toml: (?:line (\d+) )?\(last key "([^"]*)"\): (.*)$`)
})

// Decode decodes the TOML document data strictly into v: syntax errors, type
// errors and every key that v has no field for are returned as positioned
// errors naming file. hint is added to the message of an unknown key (for
// example, where to find the list of known keys). The returned index locates
// the document's keys for later checks; it scans the document only when
// asked. ok is false when v could not be decoded (a syntax or type error):
// its contents are then partial and must not be used.
func Decode(file string, data []byte, v any, hint string) (lz *Lazy, errs ErrorList, ok bool) {
	if !utf8.Valid(data) {
		line := 1 + strings.Count(string(data[:invalidAt(data)]), "\n")
		errs = append(errs, &Error{File: file, Line: line, Err: errors.New("the file is not UTF-8 text (is it the right file?)")})
		return nil, errs, false
	}
	md, err := toml.Decode(string(data), v)
	lz = NewLazy(data)
	if err != nil {
		var perr toml.ParseError
		if errors.As(err, &perr) {
			msg := perr.Message
			if perr.Usage != "" {
				msg += " (" + strings.TrimSpace(strings.SplitN(perr.Usage, "\n", 2)[0]) + ")"
			}
			e := &Error{File: file, Line: perr.Position.Line, Col: perr.Position.Col, Key: perr.LastKey, Err: errors.New(msg)}
			// A value refused by its type (a word not in a vocabulary) names the
			// key without array indices; give the indexed path written there.
			for _, ent := range lz.Index() {
				if perr.LastKey != "" && ent.Stripped == perr.LastKey && ent.Line == e.Line {
					e.Key = ent.Path
					break
				}
			}
			errs = append(errs, e)
			return lz, errs, false
		}
		if m := typeErrRE().FindStringSubmatch(err.Error()); m != nil {
			line, _ := strconv.Atoi(m[1])
			e := &Error{File: file, Line: line, Key: m[2], Err: errors.New(m[3])}
			for _, ent := range lz.Index() {
				if ent.Stripped == m[2] && (line == 0 || ent.Line == line) {
					e.Line, e.Col, e.Key = ent.Line, ent.Col, ent.Path
					break
				}
			}
			errs = append(errs, e)
			return lz, errs, false
		}
		errs = append(errs, &Error{File: file, Err: errors.New(strings.TrimPrefix(err.Error(), "toml: "))})
		return lz, errs, false
	}
	// The TOML library accepts a plain value where a table belongs (a map
	// field given "pins = 3" decodes to nothing); say so instead.
	for _, p := range mapPaths(reflect.TypeOf(v), nil, 0) {
		if !md.IsDefined(p...) {
			continue
		}
		if typ := md.Type(p...); typ != "Hash" && typ != "" { // "" is a table made implicitly by [pins.1]
			k := toml.Key(p)
			ent := lz.Index().Nearest(k.String())
			errs = append(errs, &Error{File: file, Line: ent.Line, Col: ent.Col, Key: k.String(),
				Err: fmt.Errorf("%q must be a table ([%s] with keys below it), not %s", k.String(), k.String(), withArticle(strings.ToLower(typ)))})
		}
	}
	if len(errs) > 0 {
		return lz, errs, false
	}
	seen := map[string]bool{}
	for _, k := range md.Undecoded() {
		s := k.String()
		if seen[s] {
			continue
		}
		seen[s] = true
		ents := lz.Index().StrippedMatches(s)
		// Name the first part of the path the destination has no place for
		// ("pinz" in pinz.1.wired_to, "dropout" in family.dropout).
		bad := k[len(k)-1]
		for i := 1; i <= len(k); i++ {
			if destType(reflect.TypeOf(v), k[:i]) == nil {
				bad = k[i-1]
				break
			}
		}
		msg := fmt.Sprintf("unknown key %q", bad)
		if hint != "" {
			msg += "; " + hint
		}
		if len(ents) == 0 {
			errs = append(errs, &Error{File: file, Key: s, Err: errors.New(msg)})
			continue
		}
		for _, ent := range ents {
			errs = append(errs, &Error{File: file, Line: ent.Line, Col: ent.Col, Key: ent.Path, Err: errors.New(msg)})
		}
	}
	// A table whose own key is unknown lists its sub-keys too; keep the table.
	errs = dropNested(errs)
	errs.Sort()
	return lz, errs, true
}

func withArticle(w string) string {
	if w != "" && strings.ContainsAny(w[:1], "aeiou") {
		return "an " + w
	}
	return "a " + w
}

var unmarshalerType = reflect.TypeOf((*toml.Unmarshaler)(nil)).Elem()

// mapPaths returns the key paths of the map-typed fields of struct type t
// (not below arrays, where the TOML library reports mismatches itself).
func mapPaths(t reflect.Type, prefix []string, depth int) [][]string {
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	if t.Kind() != reflect.Struct || depth > 8 {
		return nil
	}
	var out [][]string
	for i := 0; i < t.NumField(); i++ {
		f := t.Field(i)
		name := strings.Split(f.Tag.Get("toml"), ",")[0]
		if name == "-" || !f.IsExported() {
			continue
		}
		if name == "" {
			name = f.Name
		}
		p := append(append([]string(nil), prefix...), name)
		ft := f.Type
		for ft.Kind() == reflect.Pointer {
			ft = ft.Elem()
		}
		switch {
		case ft.Kind() == reflect.Map:
			out = append(out, p)
		case ft.Kind() == reflect.Struct && !reflect.PointerTo(ft).Implements(unmarshalerType):
			out = append(out, mapPaths(ft, p, depth+1)...)
		}
	}
	return out
}

// destType follows a key path through the Go type the document is decoded
// into (struct fields by toml tag, map values, slice elements) and returns the
// type at its end, or nil when the path leaves the type.
func destType(t reflect.Type, k toml.Key) reflect.Type {
	for _, part := range k {
		for t.Kind() == reflect.Pointer || t.Kind() == reflect.Slice {
			t = t.Elem()
		}
		switch t.Kind() {
		case reflect.Map:
			t = t.Elem()
		case reflect.Struct:
			found := false
			for i := 0; i < t.NumField(); i++ {
				f := t.Field(i)
				name := strings.Split(f.Tag.Get("toml"), ",")[0]
				if name == "" {
					name = f.Name
				}
				if name == part {
					t, found = f.Type, true
					break
				}
			}
			if !found {
				return nil
			}
		default:
			return nil
		}
	}
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	return t
}

func dropNested(l ErrorList) ErrorList {
	var out ErrorList
	for _, e := range l {
		nested := false
		for _, o := range l {
			if o != e && o.File == e.File && strings.HasPrefix(e.Key, o.Key+".") {
				nested = true
				break
			}
		}
		if !nested {
			out = append(out, e)
		}
	}
	return out
}

func invalidAt(data []byte) int {
	for i := 0; i < len(data); {
		r, n := utf8.DecodeRune(data[i:])
		if r == utf8.RuneError && n <= 1 {
			return i
		}
		i += n
	}
	return len(data)
}
