package main

import (
	"fmt"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/report"
)

type catalogFindOptions struct {
	app     *App
	Format  string
	Pattern string
}

func newCatalogFindCmd(app *App, runF func(*catalogFindOptions) error) *cobra.Command {
	opts := &catalogFindOptions{app: app}
	cmd := &cobra.Command{
		Use:   "find MARKING",
		Short: "Find families by a partial marking (? = one unreadable character, * = any run)",
		Long: `find reads what is legible on a part against the catalog's marking patterns.
Write ? for each character you cannot read and * for a run of unknown length
(a * never stands for the first digit of a part number). Type the lines of
the marking separated by spaces: a four-digit year-and-week group beside the
number is left out as a date code.

The maker's prefix (LM, MC, L, µA, KA ...), the grade and package letters
(CT, CV: TO-220; K: TO-3; DT: DPAK; Z: TO-92 ...) and a voltage code
(LM2940CT-5.0, LD1117V33) are decoded; O/0, I/1, B/8, S/5, Z/2 and G/6 are
tried at a small cost. A transistor number (BC, 2N, TIP, IRF ...) finds only
the look-alike families. Best readings come first; fuzzy matches of the
legible characters follow.`,
		Example: `  whichreg catalog find '?M3?7'
  whichreg catalog find 'LM317T 7812'
  whichreg catalog find L78M05CDT
  whichreg catalog find 'LM3*K' --format json`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.Pattern = args[0]
			if runF != nil {
				return runF(opts)
			}
			return catalogFindRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// catalogFindDoc is the JSON document of `catalog find` (DESIGN.md
// contract: {schema, query, hits: [{id, kind, vout_v, outline, score,
// detail}]}, plus title, how and pattern).
type catalogFindDoc struct {
	Schema string       `json:"schema"`
	Query  string       `json:"query"`
	Hits   []findHitDoc `json:"hits"`
}

// findHitDoc is one hit. VoutV and Outline are what the marking's suffixes
// say ([] and "" when they say nothing).
type findHitDoc struct {
	ID      string    `json:"id"`
	Kind    string    `json:"kind"`
	Title   string    `json:"title"`
	How     string    `json:"how"`
	Pattern string    `json:"pattern"`
	VoutV   []float64 `json:"vout_v"`
	Outline string    `json:"outline"`
	Score   float64   `json:"score"`
	Detail  string    `json:"detail"`
}

func catalogFindRun(opts *catalogFindOptions) error {
	c, err := opts.app.loadCatalog()
	if err != nil {
		return err
	}
	hits := catalog.Find(c, opts.Pattern)
	out := opts.app.IO.Out
	if opts.Format == "json" {
		d := catalogFindDoc{Schema: report.Schema("catalog-find"), Query: opts.Pattern, Hits: []findHitDoc{}}
		for _, h := range hits {
			vs := []float64{}
			for _, v := range h.VoutV {
				if h.Family.Negative() {
					v = -v
				}
				vs = append(vs, v)
			}
			d.Hits = append(d.Hits, findHitDoc{ID: h.Family.ID, Kind: string(h.Family.Kind), Title: h.Family.Title, How: h.How,
				Pattern: h.Pattern, VoutV: vs, Outline: h.Outline, Score: h.Score, Detail: h.Detail})
		}
		return writeJSON(out, d)
	}
	width := opts.app.Width()
	if len(hits) == 0 {
		report.Fill(out, fmt.Sprintf("no family matches %q", opts.Pattern), width, "", "  ")
		if !catalog.Legible(catalog.NormalizeMarking(opts.Pattern)) {
			fmt.Fprintln(out, "(nothing legible in it: give at least one letter or digit)")
		}
		return nil
	}
	for i, h := range hits {
		report.Fill(out, fmt.Sprintf("%s (%s): %s", h.Family.ID, h.How, h.Family.Title), width, fmt.Sprintf("%2d. ", i+1), "    ")
		report.Fill(out, h.Detail, width, "    ", "      ")
	}
	return nil
}
