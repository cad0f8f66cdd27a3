package report

import (
	"strings"
	"testing"
	"unicode/utf8"
)

// FuzzWrap: Wrap never panics, never loses a word, and keeps every line
// within the width whenever the prefixes leave room.
func FuzzWrap(f *testing.F) {
	f.Add("the regulator's input peak 12.2 V (the rectifier model at high mains)", 20, "  - ", "    ")
	f.Add("19 % 4.7 kΩ\nµµµµµµµµµµµµµµµµ", 5, "", "")
	f.Add("", 0, "> ", "")
	f.Fuzz(func(t *testing.T, text string, width int, first, rest string) {
		width = width % 200
		lines := Wrap(text, width, first, rest)
		if len(lines) == 0 {
			t.Fatal("no lines")
		}
		if strings.ContainsAny(first+rest, "\n\u00a0") || !utf8.ValidString(text+first+rest) {
			return // prefixes are indents and bullets, never line breaks
		}
		// Nothing is lost: without the prefixes and the white space, the
		// lines spell the text.
		var got strings.Builder
		for i, l := range lines {
			p := rest
			if i == 0 {
				p = first
			}
			switch {
			case strings.HasPrefix(l, p):
				l = l[len(p):]
			case l == strings.TrimRight(p, " "):
				l = ""
			default:
				t.Fatalf("line %d %q does not start with %q", i, l, p)
			}
			got.WriteString(l)
		}
		strip := func(s string) string { return strings.Join(strings.Fields(strings.ReplaceAll(s, "\u00a0", " ")), "") }
		if strip(got.String()) != strip(text) {
			t.Fatalf("Wrap(%q) lost text: %q", text, lines)
		}
		if Width(first) < width-1 && Width(rest) < width-1 {
			for _, l := range lines {
				if Width(l) > width && strings.TrimSpace(l) != "" {
					t.Fatalf("line %q is wider than %d", l, width)
				}
			}
		}
	})
}

// FuzzReflowMarkdown: any document reflows without a panic, to a document
// that ends with a newline and that reflows again without a panic.
func FuzzReflowMarkdown(f *testing.F) {
	f.Add("# title\n\nsome words here\n- item one two\n\n| a | b |\n| --- | --- |\n| 1 \\| 2 | 3 |\n", 20)
	f.Add("```\ncode | not a table\n```\n", 10)
	f.Fuzz(func(t *testing.T, md string, width int) {
		width = 20 + (width%100+100)%100
		once := ReflowMarkdown(md, width)
		if !strings.HasSuffix(once, "\n") {
			t.Fatalf("ReflowMarkdown(%q) = %q: no final newline", md, once)
		}
		_ = ReflowMarkdown(once, width)
	})
}

// FuzzTable: any cells at any width write without a panic.
func FuzzTable(f *testing.F) {
	f.Add("78xx", "1 A", "positive fixed three-terminal regulator", 30)
	f.Fuzz(func(t *testing.T, a, b, c string, width int) {
		tb := &Table{Columns: []Column{{Header: "A"}, {Header: "B", Align: Right, Wrap: true}, {Header: "C", Wrap: true, Under: true}}}
		tb.Row(a, b, c)
		tb.Row(c, a)
		var sb strings.Builder
		if err := tb.Write(&sb, width%300); err != nil {
			t.Fatal(err)
		}
	})
}
