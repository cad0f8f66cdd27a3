package main

import (
	"fmt"
	"io"
	"math"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/infer"
)

type inferOptions struct {
	app    *App
	Format string
	Top    int
	Why    int
	File   string
}

func newInferCmd(app *App, runF func(*inferOptions) error) *cobra.Command {
	opts := &inferOptions{app: app}
	cmd := &cobra.Command{
		Use:   "infer EVIDENCE.toml",
		Short: "Rank what an unmarked regulator could be, with probabilities and reasons",
		Long: `infer ranks every (family, package, output voltage) in the catalog against what
you measured. Each candidate's score is the sum of its reasons: a prior
(commonness, era) and one term per piece of evidence, as a natural-log
likelihood ratio against a part about which nothing is known. "Not in the
catalog" is always listed: if it leads, the evidence fits nothing known.
Then it lists the measurements that would best separate the leaders.`,
		Example: `  whichreg infer testdata/demo/bench-supply-negative.toml
  whichreg infer board.toml --top 10 --format json`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.File = args[0]
			if opts.Top < 0 {
				return flagErrorf("--top must be 0 (all) or more")
			}
			if runF != nil {
				return runF(opts)
			}
			return inferRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json", "markdown")
	cmd.Flags().IntVar(&opts.Top, "top", 0, "candidates to list (0 = 8 in text and markdown, all in JSON)")
	cmd.Flags().IntVar(&opts.Why, "why", 3, "show the reasons of this many leaders (text and markdown)")
	return cmd
}

func inferRun(o *inferOptions) error {
	c, err := o.app.loadCatalog()
	if err != nil {
		return err
	}
	ev, err := loadEvidence(o.app, c, o.File)
	if err != nil {
		return err
	}
	explain := infer.ExplainAll // JSON: every candidate's reasons
	if o.Format != "json" {
		explain = max(o.Why, topOr(o.Top, 8))
	}
	res, err := infer.Identify(c, ev, infer.Options{Explain: explain})
	if err != nil {
		return inputError(err)
	}
	out := o.app.IO.Out
	switch o.Format {
	case "json":
		return writeJSON(out, inferJSONOf(res, o.Top))
	case "markdown":
		writeInferMarkdown(out, ev, res, topOr(o.Top, 8), o.Why)
	default:
		writeInferText(out, ev, res, topOr(o.Top, 8), o.Why)
	}
	return nil
}

func topOr(top, def int) int {
	if top == 0 {
		return def
	}
	return top
}

// inferJSON is the JSON contract of `whichreg infer` (issue #3; keys may be
// added, never renamed).
type inferJSON struct {
	Candidates   []candidateJSON     `json:"candidates"`
	NotInCatalog float64             `json:"not_in_catalog"`
	Others       float64             `json:"others"`
	Conflicts    []string            `json:"conflicts"`
	Next         []infer.Measurement `json:"next"`
	PriorOnly    bool                `json:"prior_only"`
	Assumptions  []string            `json:"assumptions"`
}

type candidateJSON struct {
	Family      string         `json:"family"`
	Package     string         `json:"package"`
	Vout        float64        `json:"vout"`
	Probability float64        `json:"probability"`
	Score       float64        `json:"score"`
	Reasons     []infer.Reason `json:"reasons"`
}

func signedVout(h infer.Hypothesis) float64 {
	if h.Family.Negative() {
		return -h.VoutV
	}
	return h.VoutV
}

func round(x float64, digits int) float64 {
	p := math.Pow(10, float64(digits))
	return math.Round(x*p) / p
}

func inferJSONOf(res *infer.Result, top int) inferJSON {
	j := inferJSON{NotInCatalog: round(res.NotInCatalog, 6), Conflicts: res.Conflicts, Next: res.Next,
		PriorOnly: res.PriorOnly, Assumptions: res.Assumptions, Candidates: []candidateJSON{}}
	for i, c := range res.Candidates {
		if top > 0 && i >= top {
			j.Others += c.Probability
			continue
		}
		rs := make([]infer.Reason, len(c.Reasons))
		for k, r := range c.Reasons {
			rs[k] = infer.Reason{Evidence: r.Evidence, Weight: round(r.Weight, 4), Text: r.Text}
		}
		j.Candidates = append(j.Candidates, candidateJSON{c.Family.ID, c.Package.Outline, signedVout(c.Hypothesis),
			round(c.Probability, 6), round(c.Score, 4), rs})
	}
	j.Others = round(j.Others, 6)
	if j.Conflicts == nil {
		j.Conflicts = []string{}
	}
	if j.Next == nil {
		j.Next = []infer.Measurement{}
	}
	if j.Assumptions == nil {
		j.Assumptions = []string{}
	}
	return j
}

func pct(p float64) string {
	switch {
	case p >= 0.995:
		return fmt.Sprintf("%.1f %%", 100*p)
	case p >= 0.001:
		return fmt.Sprintf("%.1f %%", 100*p)
	}
	return "<0.1 %"
}

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

func writeInferText(w io.Writer, ev *infer.Evidence, res *infer.Result, top, why int) {
	fmt.Fprintf(w, "%s (%s)\n", title(ev), ev.File)
	if res.PriorOnly {
		fmt.Fprintln(w, "No evidence bears on the ranking: candidates are ranked by prior (commonness and era) alone.")
	}
	fmt.Fprintf(w, "\n%-4s %-9s %-28s %s\n", "rank", "prob", "candidate", "score")
	for i, c := range res.Candidates {
		if i >= top {
			break
		}
		fmt.Fprintf(w, "%-4d %-9s %-28s %+.2f\n", i+1, pct(c.Probability), c.Label(), c.Score)
	}
	fmt.Fprintf(w, "%-4s %-9s %-28s %+.2f\n", "-", pct(res.NotInCatalog), "not in the catalog", res.NotInCatalogScore)
	for i, c := range res.Candidates {
		if i >= why {
			break
		}
		fmt.Fprintf(w, "\nWhy %s (%s): score %+.2f =\n", c.Label(), pct(c.Probability), c.Score)
		for _, r := range c.Reasons {
			fmt.Fprintf(w, "  %+6.2f  %-22s %s\n", r.Weight, r.Evidence, r.Text)
		}
	}
	writeList(w, "Conflicts in the evidence:", res.Conflicts)
	if len(res.Next) > 0 {
		fmt.Fprintln(w, "\nMeasure next (expected information gain):")
		safety := ""
		for i, m := range res.Next {
			fmt.Fprintf(w, "  %d. %s — %.2f bits, fills %s\n", i+1, m.Measure, m.GainBits, m.Key)
			for _, line := range wrapWords(m.Prompt, 72) {
				fmt.Fprintf(w, "       %s\n", line)
			}
			for _, o := range m.Outcomes {
				fmt.Fprintf(w, "       %s\n", o)
			}
			if m.Safety != "" {
				safety = m.Safety
			}
		}
		for _, line := range wrapWords(safety, 76) {
			fmt.Fprintf(w, "  %s\n", line)
		}
	}
	writeList(w, "Assumed:", res.Assumptions)
	fmt.Fprintln(w, "\nConfirm the pinout against the maker's datasheet before fitting anything; 'whichreg swap' checks replacements.")
}

func writeInferMarkdown(w io.Writer, ev *infer.Evidence, res *infer.Result, top, why int) {
	fmt.Fprintf(w, "# Identification: %s\n\n", title(ev))
	if res.PriorOnly {
		fmt.Fprintln(w, "_No evidence bears on the ranking: candidates are ranked by prior alone._")
		fmt.Fprintln(w)
	}
	writeCandidateTable(w, res, top)
	for i, c := range res.Candidates {
		if i >= why {
			break
		}
		fmt.Fprintf(w, "\n## Why %s (%s)\n\n| weight | evidence | reason |\n| ---: | --- | --- |\n", c.Label(), pct(c.Probability))
		for _, r := range c.Reasons {
			fmt.Fprintf(w, "| %+.2f | %s | %s |\n", r.Weight, r.Evidence, mdEscape(r.Text))
		}
		fmt.Fprintf(w, "| **%+.2f** | | score |\n", c.Score)
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

func writeCandidateTable(w io.Writer, res *infer.Result, top int) {
	fmt.Fprintln(w, "| rank | probability | candidate | score |\n| ---: | ---: | --- | ---: |")
	for i, c := range res.Candidates {
		if i >= top {
			break
		}
		fmt.Fprintf(w, "| %d | %s | %s | %+.2f |\n", i+1, pct(c.Probability), c.Label(), c.Score)
	}
	fmt.Fprintf(w, "| – | %s | not in the catalog | %+.2f |\n", pct(res.NotInCatalog), res.NotInCatalogScore)
}

// writeList writes a titled list of lines after a blank line, or nothing when empty.
func writeList(w io.Writer, title string, items []string) {
	if len(items) == 0 {
		return
	}
	fmt.Fprintf(w, "\n%s\n", title)
	for _, it := range items {
		fmt.Fprintf(w, "  - %s\n", it)
	}
}

// wrapWords breaks s into lines of at most width characters, at spaces.
func wrapWords(s string, width int) []string {
	var lines []string
	line := ""
	for _, word := range strings.Fields(s) {
		switch {
		case line == "":
			line = word
		case len([]rune(line))+1+len([]rune(word)) > width:
			lines = append(lines, line)
			line = word
		default:
			line += " " + word
		}
	}
	if line != "" {
		lines = append(lines, line)
	}
	return lines
}

func mdEscape(s string) string { return strings.ReplaceAll(s, "|", "\\|") }
