package main

import (
	"math"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/report"
)

type inferOptions struct {
	app    *App
	Format string
	Top    int
	All    bool
	Why    int
	Quiet  bool
	File   string
}

// defaultTop is how many candidates infer lists unless told.
const defaultTop = 8

func newInferCmd(app *App, runF func(*inferOptions) error) *cobra.Command {
	opts := &inferOptions{app: app}
	cmd := &cobra.Command{
		Use:   "infer EVIDENCE.toml|-",
		Short: "Rank what an unmarked regulator could be, with the reasons",
		Long: `infer ranks every (family, outline, output voltage) in the catalog against
what you measured. Each candidate's score is the sum of its reasons: a prior
(commonness, era) and one term per piece of evidence, as a natural-log
likelihood ratio against a part about which nothing is known. Probabilities
are the scores normalised over every candidate and "not in the catalog",
which is always listed: if it leads, the evidence fits nothing known.

The leader's reasons are shown in full, the runners-up's as the differences
from the leader. Then come the measurements that would best separate the
leaders, in bits of expected information (one bit halves the doubt).

EVIDENCE.toml of - reads the evidence from standard input.`,
		Example: `  whichreg infer testdata/demo/bench-supply-negative.toml
  whichreg infer board.toml --top 10 --format json
  whichreg infer - < board.toml`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.File = args[0]
			if opts.Top < 0 || opts.Why < 0 {
				return flagErrorf("--top and --why take 0 or more")
			}
			if opts.All {
				opts.Top = 0
			} else if !cmd.Flags().Changed("top") {
				opts.Top = defaultTop
			}
			if runF != nil {
				return runF(opts)
			}
			return inferRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json", "markdown")
	cmd.Flags().IntVar(&opts.Top, "top", defaultTop, "list the `N` leading candidates; 0 lists every one (as --all does)")
	cmd.Flags().BoolVar(&opts.All, "all", false, "list every candidate (JSON: with every reason)")
	cmd.Flags().IntVar(&opts.Why, "why", 3, "explain this many leaders: the first in full, the others as differences (text and markdown)")
	cmd.Flags().BoolVarP(&opts.Quiet, "quiet", "q", false, "leave out the legend of score, probability and bits")
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
	listed := o.Top
	if listed == 0 {
		listed = math.MaxInt
	}
	// Explain: how many candidates get their reasons' text.
	explain := o.Top
	switch {
	case o.Top == 0:
		explain = infer.ExplainAll
	case o.Format != "json":
		explain = max(o.Top, o.Why)
	}
	res, err := infer.Identify(c, ev, infer.Options{Explain: explain})
	if err != nil {
		return inputError(err)
	}
	out := o.app.IO.Out
	switch o.Format {
	case "json":
		return writeJSON(out, inferDocOf(res, o.Top))
	case "markdown":
		writeInferMarkdown(out, ev, res, listed, o.Why)
	default:
		writeInferText(out, o.app.Width(), ev, res, listed, o.Why, o.Quiet)
	}
	return nil
}

// inferDoc is the JSON document of `whichreg infer` (schema
// whichreg/infer/v1, docs/schema/infer.json).
type inferDoc struct {
	Schema string `json:"schema"`
	// PriorOnly is true when no evidence bore on the ranking.
	PriorOnly  bool           `json:"prior_only"`
	Candidates []inferCandDoc `json:"candidates"`
	// Others is the probability of the candidates not listed, OthersCount
	// how many they are.
	Others      float64 `json:"others"`
	OthersCount int     `json:"others_count"`
	// NotInCatalog is the probability that the part is none of them.
	NotInCatalog      float64          `json:"not_in_catalog"`
	NotInCatalogScore float64          `json:"not_in_catalog_score"`
	Conflicts         []string         `json:"conflicts"`
	Next              []measurementDoc `json:"next"`
	Assumptions       []string         `json:"assumptions"`
}

// inferCandDoc is one candidate: family, outline and output voltage.
type inferCandDoc struct {
	Family  string `json:"family"`
	Outline string `json:"outline"`
	// VoutV is signed (negative regulators below zero); null when unknown.
	VoutV       *float64 `json:"vout_v"`
	Probability float64  `json:"probability"`
	// Score is null for a candidate the evidence rules out entirely.
	Score   *float64    `json:"score"`
	Reasons []reasonDoc `json:"reasons"`
}

// reasonDoc is one term of a score.
type reasonDoc struct {
	Evidence string `json:"evidence"`
	// Weight is a natural-log likelihood ratio; null for "impossible".
	Weight *float64 `json:"weight"`
	Text   string   `json:"text"`
}

// measurementDoc is one suggested measurement (the guide's ask, plus the
// expected gain and what each outcome would mean).
type measurementDoc struct {
	Key      string   `json:"key"`
	Kind     string   `json:"kind"`
	Choices  []string `json:"choices"`
	Unit     *string  `json:"unit"`
	Measure  string   `json:"measure"`
	Prompt   string   `json:"prompt"`
	Powered  bool     `json:"powered"`
	Safety   *string  `json:"safety"`
	GainBits float64  `json:"gain_bits"`
	Outcomes []string `json:"outcomes"`
}

func inferDocOf(res *infer.Result, top int) inferDoc {
	d := inferDoc{Schema: report.Schema("infer"), PriorOnly: res.PriorOnly,
		NotInCatalog: round(res.NotInCatalog, 6), NotInCatalogScore: round(res.NotInCatalogScore, 4),
		Conflicts: nonNil(res.Conflicts), Assumptions: nonNil(res.Assumptions), Candidates: []inferCandDoc{}, Next: []measurementDoc{}}
	for i, c := range res.Candidates {
		if top > 0 && i >= top {
			d.Others += c.Probability
			d.OthersCount++
			continue
		}
		cd := inferCandDoc{Family: c.Family.ID, Outline: c.Package.Outline, Probability: round(c.Probability, 6),
			Score: finite(c.Score, 4), Reasons: []reasonDoc{}}
		if c.VoutV > 0 {
			v := signedVout(c.Hypothesis)
			cd.VoutV = &v
		}
		for _, r := range c.Reasons {
			cd.Reasons = append(cd.Reasons, reasonDoc{r.Evidence, finite(r.Weight, 4), r.Text})
		}
		d.Candidates = append(d.Candidates, cd)
	}
	d.Others = round(d.Others, 6)
	for _, m := range res.Next {
		d.Next = append(d.Next, measurementDoc{Key: m.Key, Kind: string(m.Kind), Choices: nonNil(m.Choices), Unit: orNull(m.Unit),
			Measure: m.Measure, Prompt: m.Prompt, Powered: m.Powered, Safety: orNull(m.Safety), GainBits: round(m.GainBits, 4),
			Outcomes: nonNil(m.Outcomes)})
	}
	return d
}
