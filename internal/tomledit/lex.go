package tomledit

import (
	"fmt"
	"strconv"
	"strings"
)

// stmtKind says what a statement of the document is.
type stmtKind int

const (
	stmtTrivia     stmtKind = iota // blank lines and comment lines
	stmtTable                      // [a.b]
	stmtArrayTable                 // [[a.b]]
	stmtKeyVal                     // key = value
)

// stmt is one statement of the document: whole lines from start to end
// (byte offsets; end is just past the last line's newline, or the end of the
// document).
type stmt struct {
	kind       stmtKind
	start, end int
	line       int      // 1-based line of the first byte
	path       []string // table: the header's key; key/value: the full key (table + relative key)
	rel        []string // key/value: the key as written, relative to its table
	table      []string // key/value: the table it belongs to
	vstart     int      // key/value: the value's first byte
	vend       int      // key/value: just past the value's last byte
	compound   bool     // key/value: the value is an inline table or an array
}

// lexError reports a document the editor cannot follow.
type lexError struct {
	line int
	msg  string
}

func (e *lexError) Error() string { return fmt.Sprintf("line %d: %s", e.line, e.msg) }

// lexer splits a TOML document into statements. It follows the grammar far
// enough to find keys, headers and the extent of each value (strings,
// multi-line strings, arrays and inline tables over several lines).
type lexer struct {
	src   string
	pos   int
	line  int
	table []string
	out   []stmt
}

// lex returns the statements of src in document order; every byte of src
// belongs to exactly one statement.
func lex(src string) ([]stmt, error) {
	l := &lexer{src: src, line: 1}
	for l.pos < len(src) {
		if err := l.statement(); err != nil {
			return nil, err
		}
	}
	return l.out, nil
}

func (l *lexer) errorf(format string, args ...any) error {
	return &lexError{l.line, fmt.Sprintf(format, args...)}
}

func (l *lexer) skipSpace() {
	for l.pos < len(l.src) && (l.src[l.pos] == ' ' || l.src[l.pos] == '\t') {
		l.pos++
	}
}

// restOfLine accepts spaces and an optional comment up to the newline, and
// the newline itself.
func (l *lexer) restOfLine() error {
	l.skipSpace()
	if l.pos < len(l.src) && l.src[l.pos] == '#' {
		for l.pos < len(l.src) && l.src[l.pos] != '\n' {
			l.pos++
		}
	}
	if l.pos < len(l.src) && l.src[l.pos] == '\r' {
		l.pos++
	}
	if l.pos >= len(l.src) {
		return nil
	}
	if l.src[l.pos] != '\n' {
		return l.errorf("unexpected %q after the value", l.src[l.pos])
	}
	l.pos++
	l.line++
	return nil
}

func (l *lexer) statement() error {
	start, line := l.pos, l.line
	l.skipSpace()
	st := stmt{start: start, line: line}
	switch {
	case l.pos >= len(l.src) || l.src[l.pos] == '#' || l.src[l.pos] == '\n' || l.src[l.pos] == '\r':
		st.kind = stmtTrivia
	case l.src[l.pos] == '[':
		st.kind = stmtTable
		l.pos++
		if l.pos < len(l.src) && l.src[l.pos] == '[' {
			st.kind = stmtArrayTable
			l.pos++
		}
		key, err := l.key(']')
		if err != nil {
			return err
		}
		l.pos++
		if st.kind == stmtArrayTable {
			if l.pos >= len(l.src) || l.src[l.pos] != ']' {
				return l.errorf("an array-of-tables header ends with ]]")
			}
			l.pos++
		}
		st.path = key
		l.table = key
	default:
		st.kind = stmtKeyVal
		key, err := l.key('=')
		if err != nil {
			return err
		}
		l.pos++
		l.skipSpace()
		st.rel, st.table = key, l.table
		st.path = append(append([]string{}, l.table...), key...)
		st.vstart = l.pos
		if l.pos < len(l.src) {
			st.compound = l.src[l.pos] == '[' || l.src[l.pos] == '{'
		}
		if err := l.value(); err != nil {
			return err
		}
		st.vend = l.pos
	}
	if err := l.restOfLine(); err != nil {
		return err
	}
	st.end = l.pos
	l.out = append(l.out, st)
	return nil
}

// key reads a dotted key up to the byte stop (which it leaves unread).
func (l *lexer) key(stop byte) ([]string, error) {
	var parts []string
	for {
		l.skipSpace()
		if l.pos >= len(l.src) {
			return nil, l.errorf("the key is not finished")
		}
		switch c := l.src[l.pos]; {
		case c == '"':
			end := l.basicString()
			if end < 0 {
				return nil, l.errorf("unterminated quoted key")
			}
			s, err := unquoteBasic(l.src[l.pos:end])
			if err != nil {
				return nil, l.errorf("quoted key: %v", err)
			}
			parts = append(parts, s)
			l.pos = end
		case c == '\'':
			end := strings.IndexAny(l.src[l.pos+1:], "'\n")
			if end < 0 || l.src[l.pos+1+end] != '\'' {
				return nil, l.errorf("unterminated quoted key")
			}
			parts = append(parts, l.src[l.pos+1:l.pos+1+end])
			l.pos += end + 2
		case isBare(c):
			s := l.pos
			for l.pos < len(l.src) && isBare(l.src[l.pos]) {
				l.pos++
			}
			parts = append(parts, l.src[s:l.pos])
		default:
			return nil, l.errorf("unexpected %q in a key", c)
		}
		l.skipSpace()
		if l.pos >= len(l.src) {
			return nil, l.errorf("the key is not finished")
		}
		switch l.src[l.pos] {
		case '.':
			l.pos++
		case stop:
			return parts, nil
		default:
			return nil, l.errorf("unexpected %q after a key", l.src[l.pos])
		}
	}
}

func isBare(c byte) bool {
	return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_' || c == '-'
}

// basicString returns the offset just past the "…" string at l.pos, or -1.
func (l *lexer) basicString() int {
	for i := l.pos + 1; i < len(l.src); i++ {
		switch l.src[i] {
		case '\\':
			i++
		case '"':
			return i + 1
		case '\n':
			return -1
		}
	}
	return -1
}

// value reads one value and leaves l.pos just past it.
func (l *lexer) value() error {
	if l.pos >= len(l.src) {
		return l.errorf("a key without a value")
	}
	rest := l.src[l.pos:]
	switch {
	case strings.HasPrefix(rest, `"""`), strings.HasPrefix(rest, `'''`):
		return l.multiline(rest[:3])
	case rest[0] == '"':
		end := l.basicString()
		if end < 0 {
			return l.errorf("unterminated string")
		}
		l.pos = end
	case rest[0] == '\'':
		end := strings.IndexAny(rest[1:], "'\n")
		if end < 0 || rest[1+end] != '\'' {
			return l.errorf("unterminated string")
		}
		l.pos += end + 2
	case rest[0] == '[' || rest[0] == '{':
		return l.compound()
	default:
		s := l.pos
		for l.pos < len(l.src) && !strings.ContainsRune(" \t\r\n#,]}", rune(l.src[l.pos])) {
			l.pos++
		}
		// A date and time may be separated by one space: 1979-05-27 07:32:00.
		if l.pos-s == 10 && strings.Count(l.src[s:l.pos], "-") == 2 && l.pos+1 < len(l.src) &&
			l.src[l.pos] == ' ' && l.src[l.pos+1] >= '0' && l.src[l.pos+1] <= '9' {
			l.pos++
			for l.pos < len(l.src) && !strings.ContainsRune(" \t\r\n#,]}", rune(l.src[l.pos])) {
				l.pos++
			}
		}
		if l.pos == s {
			return l.errorf("a key without a value")
		}
	}
	return nil
}

// multiline reads a """…""" or ”'…”' string, which may span lines.
func (l *lexer) multiline(delim string) error {
	i := l.pos + 3
	for i < len(l.src) {
		switch {
		case delim[0] == '"' && l.src[i] == '\\':
			if i+1 < len(l.src) && l.src[i+1] == '\n' {
				l.line++
			}
			i += 2
			continue
		case l.src[i] == '\n':
			l.line++
		case strings.HasPrefix(l.src[i:], delim):
			i += 3
			// Up to two quotes may stand just inside the closing delimiter.
			for k := 0; k < 2 && i < len(l.src) && l.src[i] == delim[0]; k++ {
				i++
			}
			l.pos = i
			return nil
		}
		i++
	}
	return l.errorf("unterminated multi-line string")
}

// compound reads an array or inline table, nested values and comments
// included, over as many lines as it takes.
func (l *lexer) compound() error {
	var stack []byte
	for l.pos < len(l.src) {
		c := l.src[l.pos]
		switch c {
		case '[', '{':
			stack = append(stack, c)
			l.pos++
		case ']', '}':
			if len(stack) == 0 || (c == ']') != (stack[len(stack)-1] == '[') {
				return l.errorf("unbalanced %q", c)
			}
			stack = stack[:len(stack)-1]
			l.pos++
			if len(stack) == 0 {
				return nil
			}
		case '"', '\'':
			if err := l.value(); err != nil {
				return err
			}
		case '#':
			for l.pos < len(l.src) && l.src[l.pos] != '\n' {
				l.pos++
			}
		case '\n':
			l.line++
			l.pos++
		default:
			l.pos++
		}
	}
	return l.errorf("unterminated array or inline table")
}

// unquoteBasic decodes a TOML basic string, quotes included.
func unquoteBasic(q string) (string, error) {
	inner := q[1 : len(q)-1]
	if !strings.Contains(inner, `\`) {
		return inner, nil
	}
	var b strings.Builder
	for i := 0; i < len(inner); i++ {
		if inner[i] != '\\' {
			b.WriteByte(inner[i])
			continue
		}
		i++
		if i >= len(inner) {
			return "", fmt.Errorf("a lone backslash")
		}
		switch inner[i] {
		case 'b':
			b.WriteByte('\b')
		case 't':
			b.WriteByte('\t')
		case 'n':
			b.WriteByte('\n')
		case 'f':
			b.WriteByte('\f')
		case 'r':
			b.WriteByte('\r')
		case 'e':
			b.WriteByte(0x1b)
		case '"', '\\':
			b.WriteByte(inner[i])
		case 'x', 'u', 'U':
			n := map[byte]int{'x': 2, 'u': 4, 'U': 8}[inner[i]]
			if i+1+n > len(inner) {
				return "", fmt.Errorf("a short \\%c escape", inner[i])
			}
			r, err := strconv.ParseUint(inner[i+1:i+1+n], 16, 32)
			if err != nil {
				return "", fmt.Errorf("a bad \\%c escape", inner[i])
			}
			b.WriteRune(rune(r))
			i += n
		default:
			return "", fmt.Errorf("unknown escape \\%c", inner[i])
		}
	}
	return b.String(), nil
}
