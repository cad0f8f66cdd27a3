package main

import (
	"bytes"
	"io"
	"regexp"
	"strings"
	"sync"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/report"
)

// fitHelpFunc makes every command's --help fit app.Width(): cobra renders
// its help as usual and fitHelp folds the lines that are too wide.
func fitHelpFunc(root *cobra.Command, app *App) {
	render := root.HelpFunc()
	root.SetHelpFunc(func(c *cobra.Command, args []string) {
		out := root.OutOrStdout()
		var buf bytes.Buffer
		root.SetOut(&buf)
		render(c, args)
		root.SetOut(out)
		// A write error here surfaces at the final flush (exit 3).
		_, _ = io.WriteString(out, fitHelp(buf.String(), app.Width()))
	})
}

// termLine is a line of a list: indent, a term (a flag or a command name,
// single spaces allowed), a gap of two or more spaces, and its description.
var termLine = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`^( +)(\S(?:\S| \S)*)( {2,})(\S.*)$`) })

// fitHelp folds the lines of a help text that are wider than width: a
// flag's or command's description wraps under itself (or, when its column
// leaves too little room, under the term, indented); an example command
// line continues on the next line after " \" so it still pastes into a
// shell; any other line wraps at spaces with its own indent.
func fitHelp(text string, width int) string {
	var out []string
	examples := false
	for _, line := range strings.Split(text, "\n") {
		if line != "" && !strings.HasPrefix(line, " ") {
			examples = strings.HasPrefix(line, "Example")
		}
		if report.Width(line) <= width {
			out = append(out, line)
			continue
		}
		indent := line[:len(line)-len(strings.TrimLeft(line, " "))]
		if examples {
			out = append(out, foldCommand(line, width, indent)...)
			continue
		}
		if m := termLine().FindStringSubmatch(line); m != nil {
			head := m[1] + m[2] + m[3]
			if width-report.Width(head) >= 30 {
				out = append(out, report.Wrap(m[4], width, head, strings.Repeat(" ", report.Width(head)))...)
			} else {
				out = append(out, m[1]+m[2])
				deeper := m[1] + strings.Repeat(" ", 8)
				out = append(out, report.Wrap(m[4], width, deeper, deeper)...)
			}
			continue
		}
		out = append(out, report.Wrap(strings.TrimLeft(line, " "), width, indent, indent)...)
	}
	return strings.Join(out, "\n")
}

// foldCommand breaks a shell command line at spaces outside quotes, ending
// each broken line with " \" and indenting the rest four more columns.
func foldCommand(line string, width int, indent string) []string {
	var words []string
	var cur strings.Builder
	quote := rune(0)
	for _, r := range strings.TrimLeft(line, " ") {
		switch {
		case quote != 0:
			if r == quote {
				quote = 0
			}
		case r == '"' || r == '\'':
			quote = r
		case r == ' ':
			if cur.Len() > 0 {
				words = append(words, cur.String())
				cur.Reset()
			}
			continue
		}
		cur.WriteRune(r)
	}
	if cur.Len() > 0 {
		words = append(words, cur.String())
	}
	var lines []string
	rest := indent + "    "
	l := indent
	for i, w := range words {
		switch {
		case i == 0:
			l += w
		case report.Width(l)+1+report.Width(w)+2 > width && strings.TrimSpace(l) != "":
			lines = append(lines, l+" \\")
			l = rest + w
		default:
			l += " " + w
		}
	}
	return append(lines, l)
}
