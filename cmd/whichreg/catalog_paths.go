package main

import (
	"fmt"
	"path/filepath"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/report"
)

type catalogPathsOptions struct {
	app    *App
	Format string
}

func newCatalogPathsCmd(app *App, runF func(*catalogPathsOptions) error) *cobra.Command {
	opts := &catalogPathsOptions{app: app}
	cmd := &cobra.Command{
		Use:   "paths",
		Short: "Print where user catalogs are read from, and the files found there",
		Long: `paths prints the folder whose *.toml files are read as user catalogs on top
of the built-in one (the whichreg/catalog folder of your configuration
directory), the files found there, and the --catalog files given.`,
		Example: `  whichreg catalog paths
  whichreg catalog paths --format json`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			if runF != nil {
				return runF(opts)
			}
			return catalogPathsRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// pathsJSON is the JSON document of `catalog paths`.
type pathsJSON struct {
	Schema string `json:"schema"`
	// UserCatalogDir is null when there is no configuration directory.
	UserCatalogDir *string `json:"user_catalog_dir"`
	// UserCatalogUsed is false under --no-user-catalog.
	UserCatalogUsed bool `json:"user_catalog_used"`
	// Files are every user catalog file read, in merge order.
	Files []string `json:"files"`
}

func catalogPathsRun(o *catalogPathsOptions) error {
	dir, derr := o.app.userCatalogDir()
	files := o.app.catalogSources()
	if files == nil {
		files = []string{}
	}
	out := o.app.IO.Out
	if o.Format == "json" {
		j := pathsJSON{Schema: report.Schema("catalog-paths"), UserCatalogUsed: !o.app.NoUserCatalog, Files: files}
		if derr == nil {
			j.UserCatalogDir = &dir
		}
		return writeJSON(out, j)
	}
	switch {
	case derr != nil:
		fmt.Fprintf(out, "user catalogs: no configuration directory (%v)\n", derr)
	case o.app.NoUserCatalog:
		// A path is never broken across lines: it may be copied.
		fmt.Fprintf(out, "user catalogs: %s (left out: --no-user-catalog)\n", dir)
	default:
		fmt.Fprintf(out, "user catalogs: %s\n", filepath.Join(dir, "*.toml"))
	}
	if len(files) == 0 {
		fmt.Fprintln(out, "files read: none (the built-in catalog only)")
		return nil
	}
	fmt.Fprintln(out, "files read, in merge order (a later id replaces an earlier one):")
	for _, f := range files {
		fmt.Fprintf(out, "  %s\n", f)
	}
	return nil
}
