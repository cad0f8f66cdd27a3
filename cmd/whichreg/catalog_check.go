package main

import (
	"fmt"
	"strings"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/report"
)

type catalogCheckOptions struct {
	app    *App
	Format string
	Files  []string
}

func newCatalogCheckCmd(app *App, runF func(*catalogCheckOptions) error) *cobra.Command {
	opts := &catalogCheckOptions{app: app}
	cmd := &cobra.Command{
		Use:   "check [FILE...]",
		Short: "Lint catalog files: every problem with file:line:column and what to do",
		Long: `check loads the built-in catalog with the given files (or, with no files, the
built-in catalog and every user catalog) and reports every problem it finds.
It exits 1 when there is any.`,
		Example: `  whichreg catalog check
  whichreg catalog check my-parts.toml`,
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.Files = args
			if runF != nil {
				return runF(opts)
			}
			return catalogCheckRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// problemJSON is one lint problem in `catalog check --format json`.
// catalogCheckDoc is the JSON document of `catalog check`.
type catalogCheckDoc struct {
	Schema   string        `json:"schema"`
	Families int           `json:"families"`
	Outlines int           `json:"outlines"`
	Problems []problemJSON `json:"problems"`
}

type problemJSON struct {
	File    string `json:"file"`
	Line    int    `json:"line"`
	Col     int    `json:"col"`
	Key     string `json:"key"`
	Message string `json:"message"`
}

func catalogCheckRun(opts *catalogCheckOptions) error {
	files, errs := builtin.Files()
	names := opts.Files
	if len(names) == 0 {
		names = opts.app.catalogSources()
	}
	for _, n := range names {
		data, err := opts.app.readLimited(n, "catalog", maxCatalogBytes)
		if err != nil {
			return err
		}
		f, e := catalog.Load(displayName(n), data)
		errs = append(errs, e...)
		files = append(files, f)
	}
	c := catalog.Merge(files...)
	errs = append(errs, catalog.Lint(c)...)
	out := opts.app.IO.Out
	if opts.Format == "json" {
		ps := []problemJSON{}
		for _, e := range errs {
			ps = append(ps, problemJSON{e.File, e.Line, e.Col, e.Key, e.Err.Error()})
		}
		if err := writeJSON(out, catalogCheckDoc{report.Schema("catalog-check"), len(c.Families), len(c.Outlines), ps}); err != nil {
			return ioError(err)
		}
	} else if len(errs) == 0 {
		fmt.Fprintf(out, "ok: %d families, %d outlines, no problems\n", len(c.Families), len(c.Outlines))
		for _, n := range catalog.Notes(c, userOrigins(files)...) {
			report.Fill(out, "note: "+n.Error(), opts.app.Width(), "", "    ")
		}
	} else {
		for _, e := range errs {
			// The file:line:col: prefix stays on the first line, for editors.
			report.Fill(out, e.Error(), opts.app.Width(), "", "    ")
		}
		fmt.Fprintf(out, "%d problem(s)\n", len(errs))
	}
	if len(errs) > 0 {
		return &exitError{code: exitInput, err: errPrinted}
	}
	return nil
}

// userOrigins names the files given beside the built-in catalog, so that
// notes speak only of them.
func userOrigins(files []*catalog.File) []string {
	var out []string
	for _, f := range files {
		if f != nil && !strings.HasPrefix(f.Name, builtin.Prefix) {
			out = append(out, f.Name)
		}
	}
	if out == nil {
		out = []string{""} // no user file: nothing to note
	}
	return out
}
