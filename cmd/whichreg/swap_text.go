package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/whichreg/whichreg/infer/replace"
	"github.com/whichreg/whichreg/report"
)

// swapLegend explains the statuses and margins the first time they appear.
const swapLegend = `pass: within the limit; warn: a caution, no work needed; work: something must be done; fail: unsuitable. A margin is how far the value is inside its limit (- beyond it), in the check's unit and as a share of the limit.`

func originalLine(res *replace.Result) string {
	o := res.Original
	if !o.Named {
		s := fmt.Sprintf("original: %s, infer's leader at %s", o.Label(), pct(o.Probability))
		if o.Probability < 0.6 {
			s += " — below 60 %: identification is uncertain; make the suggested measurements or name it with --original"
		}
		return s
	}
	return fmt.Sprintf("original: %s (named with --original)", o.Label())
}

// marginText writes a check's margin in its unit where the limit is a
// bound ([replace.Check.MarginInUnit]), with the normalised margin as a
// percentage.
func marginText(ch replace.Check) string {
	m := fmt.Sprintf("%+.0f %%", 100*ch.Margin)
	d, ok := ch.MarginInUnit()
	if !ok {
		return m // a target with a tolerance, a fit, a word: the share says it
	}
	if report.Num(d, ch.Unit) == report.Num(0, ch.Unit) {
		return m // a target with a tolerance: the share says it
	}
	return report.Signed(d, ch.Unit) + " (" + m + ")"
}

// writeSwapText writes the swap as text; conflicts are identification's
// conflicts in the evidence, repeated here (when the original is
// identification's leader) so that a slip or a dead part is not lost
// between the two commands.
func writeSwapText(w io.Writer, width int, res *replace.Result, conflicts []string, details int, quiet bool) {
	cd := res.Conditions
	sign := 1.0
	if res.Original.Family.Negative() {
		sign = -1
	}
	v := func(x float64) string { return report.Num(sign*x, "V") }
	report.Fill(w, originalLine(res), width, "", "  ")
	report.Fill(w, fmt.Sprintf("circuit: %s out, %s to %s; input %s at its lowest (%s), %s at its highest (%s)",
		v(cd.VoutV), report.Num(cd.LoadMinA, "A"), report.Num(cd.LoadMaxA, "A"), v(cd.TroughV), cd.TroughAt, v(cd.PeakV), cd.PeakAt), width, "", "  ")
	if cd.InputConflict != "" {
		report.Fill(w, "conflict: "+cd.InputConflict, width, "", "  ")
	}
	if !res.Original.Named {
		for _, c := range conflicts {
			// swap states its own input conflict above; identification's
			// wording of the same slip names "the [input] model".
			if cd.InputConflict == "" || !strings.Contains(c, "[input] model") {
				report.Fill(w, "conflict in the evidence (infer): "+c, width, "", "  ")
			}
		}
	}
	for _, sf := range res.OriginalShortfalls {
		report.Fill(w, "note: "+sf.Sentence(res.Original.Label()), width, "", "  ")
	}
	if !quiet {
		fmt.Fprintln(w)
		report.Fill(w, swapLegend, width, "", "")
	}
	fmt.Fprintln(w)
	t := &report.Table{Columns: []report.Column{{Header: "#", Align: report.Right}, {Header: "candidate", Wrap: true}, {Header: "verdict"},
		{Header: "deciding check", Wrap: true, Under: true}}}
	for i, r := range res.Replacements {
		dec := ""
		if ch := r.Check(r.Deciding); ch != nil {
			dec = fmt.Sprintf("%s (%s): %s", ch.Name, r.DecidingWhy, ch.Text)
		}
		t.Row(fmt.Sprintf("%d.", i+1), r.Label(), string(r.Verdict), dec)
	}
	if len(res.Replacements) == 0 {
		fmt.Fprintln(w, "no candidate in the catalog")
	} else {
		_ = t.Write(w, width)
	}
	if res.Hidden > 0 {
		report.Fill(w, fmt.Sprintf("(%d unsuitable candidates not shown; --all shows them)", res.Hidden), width, "", "  ")
	}
	for i, r := range res.Replacements {
		if i >= details {
			break
		}
		fmt.Fprintln(w)
		report.Fill(w, fmt.Sprintf("%s — %s", r.Label(), r.Verdict), width, "", "  ")
		ct := &report.Table{Columns: []report.Column{{Header: "  status"}, {Header: "check"}, {Header: "value", Wrap: true},
			{Header: "limit", Wrap: true}, {Header: "margin", Align: report.Right, Wrap: true}, {Header: "why", Wrap: true, Under: true}}}
		for _, ch := range r.Checks {
			ct.Row("  "+string(ch.Status), string(ch.Name), ch.ValueText, ch.LimitText, marginText(ch), ch.Text)
		}
		_ = ct.Write(w, width)
		for _, in := range r.Install {
			report.Fill(w, in, width, "  - ", "    ")
		}
	}
	writeList(w, width, "Assumed:", res.Assumptions)
	fmt.Fprintln(w)
	report.Fill(w, "Safety: unplug and discharge the filter capacitors before desoldering; tabs and heat sinks may be live or hot. Confirm against the maker's datasheet.", width, "", "")
}

func writeSwapMarkdown(w io.Writer, res *replace.Result, details int) {
	fmt.Fprintf(w, "# Replacements\n\n%s\n\n", mdEscape(originalLine(res)))
	if c := res.Conditions.InputConflict; c != "" {
		fmt.Fprintf(w, "Conflict: %s\n\n", mdEscape(c))
	}
	for _, sf := range res.OriginalShortfalls {
		fmt.Fprintf(w, "Note: %s\n\n", mdEscape(sf.Sentence(res.Original.Label())))
	}
	fmt.Fprintf(w, "%s\n\n| # | candidate | verdict | deciding check |\n| ---: | --- | --- | --- |\n", mdEscape(swapLegend))
	for i, r := range res.Replacements {
		fmt.Fprintf(w, "| %d | %s | %s | %s (%s) |\n", i+1, r.Label(), r.Verdict, r.Deciding, r.DecidingWhy)
	}
	for i, r := range res.Replacements {
		if i >= details {
			break
		}
		fmt.Fprintf(w, "\n## %s — %s\n\n", r.Label(), r.Verdict)
		writeCheckTable(w, r)
	}
}

func writeCheckTable(w io.Writer, r replace.Replacement) {
	fmt.Fprintln(w, "| check | value | limit | margin | status | why |\n| --- | --- | --- | ---: | --- | --- |")
	for _, ch := range r.Checks {
		fmt.Fprintf(w, "| %s | %s | %s | %s | %s | %s |\n", ch.Name, mdEscape(ch.ValueText), mdEscape(ch.LimitText), marginText(ch), ch.Status, mdEscape(ch.Text))
	}
}
