package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/report"
)

// The text helpers every command shares: probabilities, titles, lists,
// Markdown escaping. Numbers in sentences go through report.Num.

// pct writes a probability as a percentage, "<0.1 %" for the smallest.
func pct(p float64) string {
	if p >= 0.0005 {
		return fmt.Sprintf("%.1f %%", 100*p)
	}
	return "<0.1 %"
}

// title names the evidence: its reference and equipment, else its file.
func title(ev *infer.Evidence) string {
	var parts []string
	if ev.Ref != "" {
		parts = append(parts, ev.Ref)
	}
	if ev.Equipment != "" {
		parts = append(parts, ev.Equipment)
	}
	if len(parts) == 0 {
		return ev.File
	}
	return strings.Join(parts, " — ")
}

// writeList writes a titled list after a blank line, each item wrapped to
// width; nothing when the list is empty.
func writeList(w io.Writer, width int, title string, items []string) {
	if len(items) == 0 {
		return
	}
	fmt.Fprintf(w, "\n%s\n", title)
	for _, it := range items {
		report.Fill(w, it, width, "  - ", "    ")
	}
}

// mdEscape escapes the table separator of Markdown.
func mdEscape(s string) string { return strings.ReplaceAll(s, "|", "\\|") }
