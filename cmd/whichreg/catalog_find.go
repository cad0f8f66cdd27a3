package main

import (
	"fmt"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
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
		Long: `find matches what is legible on a part against the catalog's marking patterns.
Write ? for each character you cannot read and * for a run of unknown length.
Wildcard matches come first, most specific pattern first; fuzzy matches of the
legible characters follow.`,
		Example: `  whichreg catalog find '?M3?7'
  whichreg catalog find 7912
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

// findHitJSON is one hit of `catalog find --format json`.
type findHitJSON struct {
	ID      string    `json:"id"`
	Title   string    `json:"title"`
	How     string    `json:"how"`
	Pattern string    `json:"pattern"`
	VoutV   []float64 `json:"vout_v"`
	Score   int       `json:"score"`
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
		res := []findHitJSON{}
		for _, h := range hits {
			v := h.VoutV
			if v == nil {
				v = []float64{}
			}
			res = append(res, findHitJSON{h.Family.ID, h.Family.Title, h.How, h.Pattern, v, h.Score, h.Detail})
		}
		return writeJSON(out, map[string]any{"query": opts.Pattern, "hits": res})
	}
	if len(hits) == 0 {
		fmt.Fprintf(out, "no family matches %q\n", opts.Pattern)
		if !catalog.Legible(catalog.NormalizeMarking(opts.Pattern)) {
			fmt.Fprintln(out, "(nothing legible in it: give at least one letter or digit)")
		}
		return nil
	}
	for i, h := range hits {
		fmt.Fprintf(out, "%2d. %-10s %-8s %s\n    %s\n", i+1, h.Family.ID, h.How, h.Family.Title, h.Detail)
	}
	return nil
}
