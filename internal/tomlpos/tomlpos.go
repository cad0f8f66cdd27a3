// Package tomlpos finds where each key of a TOML document is written, so that
// errors found after decoding (a range check, an unknown key) can name a line
// and column. The TOML library reports positions only for syntax errors.
//
// It is an index, not a parser: it assumes the document has already been
// parsed successfully, and it never fails. On input that is not valid TOML it
// returns whatever entries it could find.
//
// # Paths
//
// A path joins keys with dots and writes the element of an array of tables
// with its index from 0: the key "pins" inside the second [[family.package]]
// of the third [[family]] is "family[2].package[1].pins". [Entry.Stripped] is
// the same path without indices ("family.package.pins"), which is how the TOML
// library names undecoded keys.
package tomlpos

import (
	"strconv"
	"strings"
)

// Entry is one key (or table header) and where it stands.
type Entry struct {
	Path     string // indexed dotted path, e.g. "family[0].cout.min_uf"
	Stripped string // Path without array indices, e.g. "family.cout.min_uf"
	Line     int    // 1-based line number
	Col      int    // 1-based column of the key's first character, in bytes
}

// Index is the list of entries of one document, in document order.
type Index []Entry

// Lookup returns the entry whose Path is path.
func (ix Index) Lookup(path string) (Entry, bool) {
	for _, e := range ix {
		if e.Path == path {
			return e, true
		}
	}
	return Entry{}, false
}

// Nearest returns the entry for path or, failing that, for the longest prefix
// of path that has one (a missing key reports the table it belongs in).
// The zero Entry is returned when nothing matches.
func (ix Index) Nearest(path string) Entry {
	for p := path; p != ""; {
		if e, ok := ix.Lookup(p); ok {
			return e
		}
		i := strings.LastIndexAny(p, ".[")
		if i < 0 {
			break
		}
		p = p[:i]
	}
	return Entry{}
}

// StrippedMatches returns every entry whose stripped path is path.
func (ix Index) StrippedMatches(path string) []Entry {
	var out []Entry
	for _, e := range ix {
		if e.Stripped == path {
			out = append(out, e)
		}
	}
	return out
}

// Strip removes array indices from an indexed path.
func Strip(path string) string {
	var b strings.Builder
	depth := 0
	for _, r := range path {
		switch {
		case r == '[':
			depth++
		case r == ']':
			if depth > 0 {
				depth--
			}
		case depth == 0:
			b.WriteRune(r)
		}
	}
	return b.String()
}

type scanner struct {
	ix     Index
	counts map[string]int // array-of-tables path (indexed prefix) -> elements so far
}

// Scan indexes the keys of a TOML document.
func Scan(data []byte) Index {
	s := &scanner{counts: map[string]int{}}
	lines := strings.Split(string(data), "\n")
	current := ""
	multiStr := "" // closing delimiter of an open multi-line string
	arrDepth := 0  // open brackets of a multi-line array value
	for n, raw := range lines {
		line := strings.TrimRight(raw, "\r")
		if multiStr != "" {
			if strings.Contains(line, multiStr) {
				multiStr = ""
			}
			continue
		}
		if arrDepth > 0 {
			arrDepth, multiStr = skipValue(line, arrDepth)
			continue
		}
		trimmed := strings.TrimLeft(line, " \t")
		col := len(line) - len(trimmed) + 1
		if trimmed == "" || trimmed[0] == '#' {
			continue
		}
		switch {
		case strings.HasPrefix(trimmed, "[["):
			end := strings.Index(trimmed, "]]")
			if end < 0 {
				continue
			}
			parts := splitKey(trimmed[2:end])
			if len(parts) == 0 {
				continue
			}
			prefix := s.resolve(parts[:len(parts)-1], "")
			key := join(prefix, parts[len(parts)-1])
			idx := s.counts[key]
			s.counts[key] = idx + 1
			current = key + "[" + strconv.Itoa(idx) + "]"
			s.add(current, n+1, col)
		case trimmed[0] == '[':
			end := strings.Index(trimmed, "]")
			if end < 0 {
				continue
			}
			current = s.resolve(splitKey(trimmed[1:end]), "")
			s.add(current, n+1, col)
		default:
			eq := findEq(trimmed)
			if eq < 0 {
				continue
			}
			parts := splitKey(trimmed[:eq])
			if len(parts) == 0 {
				continue
			}
			path := s.resolve(parts, current)
			s.add(path, n+1, col)
			value := trimmed[eq+1:]
			vcol := col + eq + 1
			vt := strings.TrimLeft(value, " \t")
			vcol += len(value) - len(vt)
			if strings.HasPrefix(vt, "{") {
				s.inline(vt, path, n+1, vcol)
			}
			arrDepth, multiStr = skipValue(vt, 0)
		}
	}
	return s.ix
}

func (s *scanner) add(path string, line, col int) {
	s.ix = append(s.ix, Entry{Path: path, Stripped: Strip(path), Line: line, Col: col})
}

// resolve turns key parts into an indexed path below base, giving each part
// that names an array of tables its latest index.
func (s *scanner) resolve(parts []string, base string) string {
	p := base
	for _, part := range parts {
		p = join(p, part)
		if c, ok := s.counts[p]; ok && c > 0 {
			p += "[" + strconv.Itoa(c-1) + "]"
		}
	}
	return p
}

// inline indexes the keys of an inline table written on one line.
func (s *scanner) inline(text, base string, line, col int) {
	depth := 0
	keyStart := -1
	for i := 0; i < len(text); i++ {
		c := text[i]
		switch c {
		case '"', '\'':
			j := closeQuote(text, i)
			if keyStart < 0 && depth == 1 {
				keyStart = i
			}
			i = j
		case '{':
			depth++
			if depth == 1 {
				keyStart = -1
			}
		case '}':
			depth--
			if depth <= 0 {
				return
			}
		case '[':
			depth++
		case ']':
			depth--
		case ',':
			if depth == 1 {
				keyStart = -1
			}
		case '=':
			if depth == 1 && keyStart >= 0 {
				parts := splitKey(text[keyStart:i])
				if len(parts) > 0 {
					s.add(s.resolve(parts, base), line, col+keyStart)
				}
				keyStart = -2 // in a value until the next comma
			}
		case ' ', '\t':
		default:
			if depth == 1 && keyStart == -1 {
				keyStart = i
			}
		}
	}
}

// skipValue scans a value for unclosed brackets and multi-line strings,
// starting with depth open brackets, and returns what is still open at the
// end of the line.
func skipValue(text string, depth int) (int, string) {
	for i := 0; i < len(text); i++ {
		c := text[i]
		switch c {
		case '#':
			return depth, ""
		case '"', '\'':
			if strings.HasPrefix(text[i:], `"""`) || strings.HasPrefix(text[i:], `'''`) {
				delim := text[i : i+3]
				rest := text[i+3:]
				j := strings.Index(rest, delim)
				if j < 0 {
					return depth, delim
				}
				i += 3 + j + 2
				continue
			}
			i = closeQuote(text, i)
		case '[', '{':
			depth++
		case ']', '}':
			if depth > 0 {
				depth--
			}
		}
	}
	return depth, ""
}

// closeQuote returns the index of the quote that closes the one at i
// (or the last index when it is not closed on the line).
func closeQuote(text string, i int) int {
	q := text[i]
	for j := i + 1; j < len(text); j++ {
		if q == '"' && text[j] == '\\' {
			j++
			continue
		}
		if text[j] == q {
			return j
		}
	}
	return len(text) - 1
}

// findEq returns the index of the '=' that ends the key, outside quotes.
func findEq(text string) int {
	for i := 0; i < len(text); i++ {
		switch text[i] {
		case '"', '\'':
			i = closeQuote(text, i)
		case '=':
			return i
		case '#':
			return -1
		}
	}
	return -1
}

// splitKey splits a dotted key into parts, unquoting quoted parts.
func splitKey(key string) []string {
	var parts []string
	var b strings.Builder
	for i := 0; i < len(key); i++ {
		c := key[i]
		switch {
		case c == '"' || c == '\'':
			j := closeQuote(key, i)
			if j > i {
				inner := key[i+1 : j]
				if c == '"' {
					if u, err := strconv.Unquote(`"` + inner + `"`); err == nil {
						inner = u
					}
				}
				b.WriteString(inner)
			}
			i = j
		case c == '.':
			parts = append(parts, strings.TrimSpace(b.String()))
			b.Reset()
		case c == ' ' || c == '\t':
		default:
			b.WriteByte(c)
		}
	}
	parts = append(parts, strings.TrimSpace(b.String()))
	for _, p := range parts {
		if p == "" {
			return nil
		}
	}
	return parts
}

func join(a, b string) string {
	if a == "" {
		return b
	}
	return a + "." + b
}
