// Package tomledit changes one key of a TOML document and leaves everything
// else as the author wrote it: comments, blank lines, the order of tables and
// keys, and every untouched line byte for byte.
//
// [Set] replaces a key's value in place (a comment after the value stays
// where it was), or adds the key at the end of its table, creating the table
// when the document has none: a new [pins.3] goes after [pins.2], a new table
// with no siblings at the end of the document. [Remove] deletes the lines of
// one key.
//
// Keys are dotted paths such as "pins.2.volts", "case.tied_to_pin" or
// "marking"; a part that is not a bare key is quoted as in TOML
// (`"my key".x`). The editor does not reach into inline tables or arrays of
// tables: a key there is refused with [ErrUnsupported].
package tomledit

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"
)

// ErrNotFound is returned by [Remove] when the document does not have the key.
var ErrNotFound = errors.New("no such key")

// ErrUnsupported is wrapped by errors for edits the editor will not make:
// a key inside an inline table or an array of tables, a key below a value,
// or a key that names a table.
var ErrUnsupported = errors.New("cannot edit this key")

// Set returns doc with key set to v, which is a string, an int, an int64, a
// float64 (finite; written with a decimal point so that it stays a float)
// or a bool. The document must be TOML the editor can follow; it returns an
// error naming the line otherwise, an error wrapping [ErrUnsupported] for a
// key it will not edit, and never changes doc itself.
func Set(doc []byte, key string, v any) ([]byte, error) {
	lit, err := literal(v)
	if err != nil {
		return nil, fmt.Errorf("setting %s: %v", key, err)
	}
	src, sts, path, at, err := locate(doc, key, "setting")
	switch {
	case err != nil:
		return nil, err
	case at >= 0:
		return []byte(replaceValue(src, sts[at], lit)), nil
	}
	pos, text := insertion(sts, src, path, lit)
	return []byte(src[:pos] + text + src[pos:]), nil
}

// Remove returns doc without the lines of key. It returns [ErrNotFound]
// when doc has no such key, and an error wrapping [ErrUnsupported] for a
// key inside an inline table.
func Remove(doc []byte, key string) ([]byte, error) {
	src, sts, _, at, err := locate(doc, key, "removing")
	switch {
	case err != nil:
		return nil, err
	case at < 0:
		return nil, fmt.Errorf("removing %s: %w", key, ErrNotFound)
	}
	return []byte(src[:sts[at].start] + src[sts[at].end:]), nil
}

// locate lexes doc, checks that key can be edited, and returns the
// statement that holds key (at = -1 when none does).
func locate(doc []byte, key, verb string) (src string, sts []stmt, path []string, at int, err error) {
	path, err = parseKey(key)
	if err != nil {
		return "", nil, nil, -1, err
	}
	src = string(doc)
	sts, err = lex(src)
	if err != nil {
		return "", nil, nil, -1, fmt.Errorf("%s %s: %w", verb, key, err)
	}
	if err := checkPath(sts, path, key); err != nil {
		return "", nil, nil, -1, err
	}
	for i, st := range sts {
		if st.kind == stmtKeyVal && slices.Equal(st.path, path) {
			return src, sts, path, i, nil
		}
	}
	return src, sts, path, -1, nil
}

// parseKey splits a dotted key as TOML does.
func parseKey(key string) ([]string, error) {
	l := &lexer{src: key + "=", line: 1}
	parts, err := l.key('=')
	if err != nil || l.pos != len(key) {
		return nil, fmt.Errorf("%q is not a dotted key such as pins.2.volts", key)
	}
	return parts, nil
}

// checkPath refuses keys the editor would have to reach through a value,
// an inline table or an array of tables, and keys that name a table.
func checkPath(sts []stmt, path []string, key string) error {
	for _, st := range sts {
		switch {
		case st.kind == stmtKeyVal && len(st.path) < len(path) && hasPrefix(path, st.path):
			what := "a value"
			if st.compound {
				what = "an inline table or array"
			}
			return fmt.Errorf("%s: %s is %s at line %d; edit it by hand: %w", key, join(st.path), what, st.line, ErrUnsupported)
		case st.kind == stmtArrayTable && hasPrefix(path, st.path):
			return fmt.Errorf("%s: %s is an array of tables (line %d): %w", key, join(st.path), st.line, ErrUnsupported)
		case st.kind == stmtKeyVal && len(st.path) > len(path) && hasPrefix(st.path, path),
			st.kind == stmtTable && hasPrefix(st.path, path):
			return fmt.Errorf("%s is a table (line %d), not a value: %w", key, st.line, ErrUnsupported)
		}
	}
	return nil
}

func hasPrefix(s, prefix []string) bool {
	return len(s) >= len(prefix) && slices.Equal(s[:len(prefix)], prefix)
}

// replaceValue writes lit over the statement's value. A comment after a
// one-line value keeps its column where the line allows.
func replaceValue(src string, st stmt, lit string) string {
	after := src[st.vend:st.end]
	old := src[st.vstart:st.vend]
	if !strings.Contains(old, "\n") {
		gap := len(after) - len(strings.TrimLeft(after, " \t"))
		if rest := after[gap:]; strings.HasPrefix(rest, "#") {
			pad := max(1, gap-(len(lit)-len(old)))
			after = strings.Repeat(" ", pad) + rest
		}
	}
	return src[:st.start] + src[st.start:st.vstart] + lit + after + src[st.end:]
}

// insertion returns where to insert a new key and the text to insert.
func insertion(sts []stmt, src string, path []string, lit string) (int, string) {
	nl := newline(src)
	table, leaf := path[:len(path)-1], path[len(path)-1:]
	line := func(st *stmt, rel []string) string {
		indent := ""
		if st != nil {
			indent = src[st.start : st.start+len(src[st.start:])-len(strings.TrimLeft(src[st.start:], " \t"))]
		}
		return indent + join(rel) + " = " + lit + nl
	}
	// The table's own header, or keys written into it with dotted keys.
	last, lastHeader := -1, -1
	for i, st := range sts {
		switch {
		case st.kind == stmtTable && slices.Equal(st.path, table):
			lastHeader, last = i, i
		case st.kind == stmtKeyVal && slices.Equal(st.table, table) && lastHeader >= 0:
			last = i
		}
	}
	if len(table) == 0 {
		return rootInsertion(sts, src, line(nil, leaf))
	}
	if lastHeader >= 0 {
		var like *stmt
		if last != lastHeader {
			like = &sts[last]
		}
		return fixEnd(src, sts[last].end, line(like, leaf))
	}
	// A table written with dotted keys (case.volts = 0, or 2.volts = 5 under
	// [pins]) gets another dotted key beside the last of them.
	for k := len(table); k >= 1; k-- {
		for i := len(sts) - 1; i >= 0; i-- {
			st := sts[i]
			if st.kind == stmtKeyVal && len(st.table) < k && hasPrefix(st.path, table[:k]) && hasPrefix(table, st.table) {
				return fixEnd(src, st.end, line(&st, append(slices.Clone(table[len(st.table):]), leaf...)))
			}
		}
	}
	return newTable(sts, src, table, line(nil, leaf), nl)
}

// rootInsertion adds a top-level key after the last top-level key, or before
// the first table and the comments attached to it.
func rootInsertion(sts []stmt, src, text string) (int, string) {
	lastKV, firstHeader := -1, len(sts)
	for i, st := range sts {
		if st.kind == stmtTable || st.kind == stmtArrayTable {
			firstHeader = i
			break
		}
		if st.kind == stmtKeyVal {
			lastKV = i
		}
	}
	if lastKV >= 0 {
		return fixEnd(src, sts[lastKV].end, text)
	}
	if firstHeader == len(sts) {
		return fixEnd(src, len(src), text)
	}
	at := attached(sts, src, firstHeader)
	return sts[at].start, text + newline(src)
}

// attached returns the first statement of the comment block directly above
// statement i (no blank line between), or i itself.
func attached(sts []stmt, src string, i int) int {
	for i > 0 && sts[i-1].kind == stmtTrivia && strings.TrimSpace(src[sts[i-1].start:sts[i-1].end]) != "" {
		i--
	}
	return i
}

// fixEnd inserts text at offset at, first ending an unterminated last line.
func fixEnd(src string, at int, text string) (int, string) {
	if at == len(src) && at > 0 && src[at-1] != '\n' {
		return at, newline(src) + text
	}
	return at, text
}

// newTable places a new [table] among its siblings, in order (numerically
// for lead numbers), or after its parent's tables, or at the end.
func newTable(sts []stmt, src string, table []string, body, nl string) (int, string) {
	header := "[" + join(table) + "]" + nl + body
	parent := table[:len(table)-1]
	name := table[len(table)-1]
	prev, next := -1, -1
	for i, st := range sts {
		if st.kind != stmtTable || len(st.path) != len(table) || !hasPrefix(st.path, parent) {
			continue
		}
		if less(st.path[len(st.path)-1], name) {
			prev = i
		} else if next < 0 {
			next = i
		}
	}
	blankBefore := func(i int) bool {
		a := attached(sts, src, i)
		return a > 0 && strings.TrimSpace(src[sts[a-1].start:sts[a-1].end]) == ""
	}
	switch {
	case prev >= 0:
		end := subtreeEnd(sts, prev)
		sep := ""
		// Separate it as the next sibling is separated, else as the previous.
		if next >= 0 && blankBefore(next) || next < 0 && blankBefore(prev) {
			sep = nl
		}
		return fixEnd(src, sts[end].end, sep+header)
	case next >= 0:
		at := attached(sts, src, next)
		sep := ""
		if blankBefore(next) {
			sep = nl
		}
		return sts[at].start, header + sep
	}
	end := len(src)
	for i, st := range sts {
		if st.kind == stmtTable && len(parent) > 0 && slices.Equal(st.path, parent) {
			end = sts[subtreeEnd(sts, i)].end
		}
	}
	sep := nl
	if strings.TrimSpace(src[:end]) == "" || strings.HasSuffix(src[:end], nl+nl) {
		sep = ""
	}
	return fixEnd(src, end, sep+header)
}

// subtreeEnd returns the last key/value or header statement of the table at
// statement i and of the tables below it that follow it directly.
func subtreeEnd(sts []stmt, i int) int {
	root := sts[i].path
	end := i
	for j := i + 1; j < len(sts); j++ {
		st := sts[j]
		if (st.kind == stmtTable || st.kind == stmtArrayTable) && !hasPrefix(st.path, root) {
			break
		}
		if st.kind != stmtTrivia {
			end = j
		}
	}
	return end
}

// less orders table names: numbers by value, before words; words as strings.
func less(a, b string) bool {
	x, errA := strconv.Atoi(a)
	y, errB := strconv.Atoi(b)
	switch {
	case errA == nil && errB == nil:
		return x < y
	case errA == nil:
		return true
	case errB == nil:
		return false
	}
	return a < b
}

// newline returns the document's line ending: CRLF when its first line ends so.
func newline(src string) string {
	if i := strings.IndexByte(src, '\n'); i > 0 && src[i-1] == '\r' {
		return "\r\n"
	}
	return "\n"
}

// join writes a key path back as a dotted key, quoting parts that are not bare.
func join(path []string) string {
	parts := make([]string, len(path))
	for i, p := range path {
		parts[i] = p
		bare := p != ""
		for k := 0; k < len(p); k++ {
			bare = bare && isBare(p[k])
		}
		if !bare {
			parts[i] = quote(p)
		}
	}
	return strings.Join(parts, ".")
}

// literal formats v as a TOML value.
func literal(v any) (string, error) {
	switch x := v.(type) {
	case string:
		if !utf8.ValidString(x) {
			return "", fmt.Errorf("%q is not valid UTF-8", x)
		}
		return quote(x), nil
	case int:
		return strconv.Itoa(x), nil
	case int64:
		return strconv.FormatInt(x, 10), nil
	case bool:
		return strconv.FormatBool(x), nil
	case float64:
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return "", fmt.Errorf("%v is not a finite number", x)
		}
		s := strconv.FormatFloat(x, 'g', -1, 64)
		if !strings.ContainsAny(s, ".e") {
			s += ".0"
		}
		return s, nil
	}
	return "", fmt.Errorf("a %T cannot be written (want a string, int, float64 or bool)", v)
}

// quote writes s as a TOML basic string.
func quote(s string) string {
	var b strings.Builder
	b.WriteByte('"')
	for _, r := range s {
		switch {
		case r == '"' || r == '\\':
			b.WriteByte('\\')
			b.WriteRune(r)
		case r == '\n':
			b.WriteString(`\n`)
		case r == '\t':
			b.WriteString(`\t`)
		case r < 0x20 || r == 0x7f:
			fmt.Fprintf(&b, `\u%04X`, r)
		default:
			b.WriteRune(r)
		}
	}
	b.WriteByte('"')
	return b.String()
}
