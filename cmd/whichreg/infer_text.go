package main

import (
	"fmt"
	"io"
	"math"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/report"
)

// inferLegend explains score and probability the first time they appear.
const inferLegend = `Score: the sum of the reasons' weights, each a natural-log likelihood ratio (+ favours the candidate). Probability: its share after normalising over every candidate and "not in the catalog".`

// weightText writes a score or weight; minus infinity is "ruled out".
func weightText(w float64) string {
	if math.IsInf(w, -1) {
		return "ruled out"
	}
	return fmt.Sprintf("%+.2f", w)
}

func writeInferText(w io.Writer, width int, ev *infer.Evidence, res *infer.Result, top, why int, quiet bool) {
	report.Fill(w, title(ev), width, "", "")
	if res.PriorOnly {
		report.Fill(w, "No evidence bears on the ranking: candidates are ranked by prior (commonness and era) alone.", width, "", "")
	}
	if !quiet {
		fmt.Fprintln(w)
		report.Fill(w, inferLegend, width, "", "")
	}
	fmt.Fprintln(w)
	t := &report.Table{Columns: []report.Column{{Header: "rank", Align: report.Right}, {Header: "probability", Align: report.Right},
		{Header: "candidate", Wrap: true}, {Header: "score", Align: report.Right}}}
	rest, restP := 0, 0.0
	for i, c := range res.Candidates {
		if i >= top {
			rest++
			restP += c.Probability
			continue
		}
		t.Row(fmt.Sprint(i+1), pct(c.Probability), c.Label(), weightText(c.Score))
	}
	t.Row("-", pct(res.NotInCatalog), "not in the catalog", weightText(res.NotInCatalogScore))
	_ = t.Write(w, width)
	if rest > 0 {
		report.Fill(w, fmt.Sprintf("(%d more, %s together; --top N or --all lists them)", rest, pct(restP)), width, "", "")
	}
	if why > 0 && len(res.Candidates) > 0 {
		lead := res.Candidates[0]
		fmt.Fprintln(w)
		report.Fill(w, fmt.Sprintf("Why %s (%s): score %s, the sum of", lead.Label(), pct(lead.Probability), weightText(lead.Score)), width, "", "  ")
		writeReasons(w, width, lead.Reasons)
		for i, c := range res.Candidates[1:] {
			if i+1 >= why {
				break
			}
			fmt.Fprintln(w)
			report.Fill(w, fmt.Sprintf("How %s (%s, score %s) differs from the leader:", c.Label(), pct(c.Probability), weightText(c.Score)), width, "", "  ")
			writeDifferences(w, width, lead.Reasons, c.Reasons)
		}
	}
	writeList(w, width, "Conflicts in the evidence:", res.Conflicts)
	writeNext(w, width, res.Next)
	writeList(w, width, "Assumed:", res.Assumptions)
	fmt.Fprintln(w)
	report.Fill(w, "Confirm the pinout against the maker's datasheet before fitting anything; 'whichreg swap' checks replacements.", width, "", "")
}

// reasonsTable is the layout of a list of reasons: weight, evidence key, why.
func reasonsTable() *report.Table {
	return &report.Table{Columns: []report.Column{{Align: report.Right}, {}, {Wrap: true, Under: true}}}
}

func writeReasons(w io.Writer, width int, rs []infer.Reason) {
	t := reasonsTable()
	for _, r := range rs {
		t.Row("  "+weightText(r.Weight), r.Evidence, r.Text)
	}
	_ = t.Write(w, width)
}

// reasonGroup is the reasons of one evidence key, summed.
type reasonGroup struct {
	weight float64
	text   string
}

func groupReasons(rs []infer.Reason) ([]string, map[string]*reasonGroup) {
	var keys []string
	m := map[string]*reasonGroup{}
	for _, r := range rs {
		g := m[r.Evidence]
		if g == nil {
			g = &reasonGroup{}
			m[r.Evidence] = g
			keys = append(keys, r.Evidence)
		}
		g.weight += r.Weight
		if r.Text != "" {
			if g.text != "" {
				g.text += "; "
			}
			g.text += r.Text
		}
	}
	return keys, m
}

// newText joins the runner-up's reasons for key that the leader does not
// have word for word; all of them when it has every one.
func newText(other, lead []infer.Reason, key, all string) string {
	seen := map[string]bool{}
	for _, r := range lead {
		if r.Evidence == key {
			seen[r.Text] = true
		}
	}
	s := ""
	for _, r := range other {
		if r.Evidence == key && r.Text != "" && !seen[r.Text] {
			if s != "" {
				s += "; "
			}
			s += r.Text
		}
	}
	if s == "" {
		return all
	}
	return s
}

// writeDifferences writes, per evidence key, how a runner-up's weight
// differs from the leader's, with the runner-up's reason.
func writeDifferences(w io.Writer, width int, lead, other []infer.Reason) {
	lk, lm := groupReasons(lead)
	ok, om := groupReasons(other)
	keys := append([]string(nil), lk...)
	for _, k := range ok {
		if lm[k] == nil {
			keys = append(keys, k)
		}
	}
	t := reasonsTable()
	for _, k := range keys {
		l, o := lm[k], om[k]
		if l == nil {
			l = &reasonGroup{}
		}
		if o == nil {
			o = &reasonGroup{text: "(no term: the leader's is " + weightText(l.weight) + ")"}
		}
		o = &reasonGroup{weight: o.weight, text: newText(other, lead, k, o.text)}
		d := o.weight - l.weight
		if math.IsNaN(d) || (math.Abs(d) < 0.005 && o.text == l.text) {
			continue
		}
		if math.IsInf(o.weight, -1) {
			t.Row("  ruled out", k, o.text)
			continue
		}
		t.Row("  "+weightText(d), k, o.text)
	}
	if t.Len() == 0 {
		fmt.Fprintln(w, "  (every term as the leader's)")
		return
	}
	_ = t.Write(w, width)
}

// writeNext writes the suggested measurements with their prompts and the
// caution for powered ones.
func writeNext(w io.Writer, width int, next []infer.Measurement) {
	if len(next) == 0 {
		return
	}
	fmt.Fprintln(w)
	report.Fill(w, "Measure next (expected information gain in bits: one bit halves the doubt):", width, "", "  ")
	safety := ""
	for i, m := range next {
		report.Fill(w, fmt.Sprintf("%d. %s — %.2f bits, fills %s", i+1, m.Measure, m.GainBits, m.Key), width, "  ", "     ")
		report.Fill(w, m.Prompt, width, "     ", "     ")
		for _, o := range m.Outcomes {
			report.Fill(w, o, width, "     - ", "       ")
		}
		if m.Safety != "" {
			safety = m.Safety
		}
	}
	if safety != "" {
		report.Fill(w, safety, width, "  ", "  ")
	}
}

func writeInferMarkdown(w io.Writer, ev *infer.Evidence, res *infer.Result, top, why int) {
	fmt.Fprintf(w, "# Identification: %s\n\n", title(ev))
	if res.PriorOnly {
		fmt.Fprintln(w, "_No evidence bears on the ranking: candidates are ranked by prior alone._")
		fmt.Fprintln(w)
	}
	fmt.Fprintf(w, "%s\n\n", mdEscape(inferLegend))
	fmt.Fprintln(w, "| rank | probability | candidate | score |\n| ---: | ---: | --- | ---: |")
	for i, c := range res.Candidates {
		if i >= top {
			break
		}
		fmt.Fprintf(w, "| %d | %s | %s | %s |\n", i+1, pct(c.Probability), c.Label(), weightText(c.Score))
	}
	fmt.Fprintf(w, "| – | %s | not in the catalog | %s |\n", pct(res.NotInCatalog), weightText(res.NotInCatalogScore))
	for i, c := range res.Candidates {
		if i >= why {
			break
		}
		fmt.Fprintf(w, "\n## Why %s (%s)\n\n| weight | evidence | reason |\n| ---: | --- | --- |\n", c.Label(), pct(c.Probability))
		for _, r := range c.Reasons {
			fmt.Fprintf(w, "| %s | %s | %s |\n", weightText(r.Weight), r.Evidence, mdEscape(r.Text))
		}
		fmt.Fprintf(w, "| **%s** | | score |\n", weightText(c.Score))
	}
	if len(res.Conflicts) > 0 {
		fmt.Fprintln(w, "\n## Conflicts")
		for _, c := range res.Conflicts {
			fmt.Fprintf(w, "- %s\n", mdEscape(c))
		}
	}
	if len(res.Next) > 0 {
		fmt.Fprintln(w, "\n## Measure next")
		for i, m := range res.Next {
			fmt.Fprintf(w, "%d. %s (%.2f bits; fills `%s`): %s\n", i+1, mdEscape(m.Measure), m.GainBits, m.Key, mdEscape(m.Prompt))
			for _, o := range m.Outcomes {
				fmt.Fprintf(w, "   - %s\n", mdEscape(o))
			}
		}
	}
}
