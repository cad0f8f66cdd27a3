package report

import (
	"regexp"
	"strings"
	"sync"
)

// listItem matches the start of a Markdown list item: indent, marker, space.
var listItem = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`^(\s*)([-*+]|\d+[.)])\s+`) })

// ReflowMarkdown fits a Markdown document to width columns without
// changing what it says: paragraphs and list items are wrapped (list
// continuation lines indented under the item's text), and a table wider
// than width becomes a list, one item per row ("- **first cell**: header
// cell; …; last cell"). Headings, fenced code, images, HTML and tables that
// fit are left as they are.
func ReflowMarkdown(md string, width int) string {
	lines := strings.Split(strings.TrimSuffix(md, "\n"), "\n")
	var out []string
	fenced := false
	for i := 0; i < len(lines); {
		l := lines[i]
		t := strings.TrimSpace(l)
		switch {
		case strings.HasPrefix(t, "```"):
			fenced = !fenced
			out = append(out, l)
			i++
		case fenced || t == "" || strings.HasPrefix(t, "#") || strings.HasPrefix(t, "![") || strings.HasPrefix(t, "<"):
			out = append(out, l)
			i++
		case strings.HasPrefix(t, "|"):
			j := i
			for j < len(lines) && strings.HasPrefix(strings.TrimSpace(lines[j]), "|") {
				j++
			}
			out = append(out, table(lines[i:j], width)...)
			i = j
		default:
			// A list item or a paragraph, with its continuation lines.
			first, rest := "", ""
			text := t
			if m := listItem().FindStringSubmatch(l); m != nil {
				first = m[0]
				rest = strings.Repeat(" ", Width(m[0]))
				text = l[len(m[0]):]
			}
			j := i + 1
			for j < len(lines) {
				n := lines[j]
				nt := strings.TrimSpace(n)
				if nt == "" || listItem().MatchString(n) || strings.HasPrefix(nt, "|") || strings.HasPrefix(nt, "#") || strings.HasPrefix(nt, "```") {
					break
				}
				text += " " + nt
				j++
			}
			out = append(out, wrapMD(text, width, first, rest)...)
			i = j
		}
	}
	return strings.Join(out, "\n") + "\n"
}

// blockStart matches text that Markdown reads as the start of a new block
// at the start of a line: a list marker ("+ 5 mA", "- x", "2. y"), a
// heading, a quote, a table row, or a setext underline.
var blockStart = sync.OnceValue(func() *regexp.Regexp {
	return regexp.MustCompile(`^(([-*+]|\d+[.)])(\s|$)|#{1,6}(\s|$)|>|\||[-=]+$)`)
})

// wrapMD wraps text like [Wrap] but never breaks a line before a word that
// would start a new block there: such a word is glued to the word before.
func wrapMD(text string, width int, first, rest string) []string {
	return wrap(text, width, first, rest, func(words []string) []string {
		words = glueUnits(words)
		out := words[:0:0]
		for _, w := range words {
			if n := len(out); n > 0 && blockStart().MatchString(w) {
				out[n-1] += nbsp + w
				continue
			}
			out = append(out, w)
		}
		return out
	})
}

// table returns a Markdown table as it is when it fits width, else as a
// list with one item per row.
func table(rows []string, width int) []string {
	fits := true
	for _, r := range rows {
		if Width(r) > width {
			fits = false
		}
	}
	if fits || len(rows) < 2 {
		return rows
	}
	header := cells(rows[0])
	var out []string
	for _, r := range rows[2:] { // rows[1] is the alignment row
		cs := cells(r)
		if len(cs) == 0 {
			continue
		}
		var parts []string
		for k := 1; k < len(cs); k++ {
			c := cs[k]
			if c == "" {
				continue
			}
			h := ""
			if k < len(header) && k < len(cs)-1 {
				h = header[k]
			}
			if h != "" {
				c = h + " " + c
			}
			parts = append(parts, c)
		}
		item := cs[0]
		if item != "" && !strings.HasPrefix(item, "**") {
			item = "**" + item + "**"
		}
		if len(parts) > 0 {
			if item != "" {
				item += ": "
			}
			item += strings.Join(parts, "; ")
		}
		out = append(out, wrapMD(item, width, "- ", "  ")...)
	}
	return out
}

// cells splits a table row at its unescaped pipes, unescaping \| in the cells.
func cells(row string) []string {
	row = strings.TrimSpace(row)
	row = strings.TrimPrefix(row, "|")
	if strings.HasSuffix(row, "|") && !strings.HasSuffix(row, `\|`) {
		row = row[:len(row)-1]
	}
	var out []string
	var b strings.Builder
	for i := 0; i < len(row); i++ {
		switch {
		case row[i] == '\\' && i+1 < len(row) && row[i+1] == '|':
			b.WriteByte('|')
			i++
		case row[i] == '|':
			out = append(out, strings.TrimSpace(b.String()))
			b.Reset()
		default:
			b.WriteByte(row[i])
		}
	}
	return append(out, strings.TrimSpace(b.String()))
}
