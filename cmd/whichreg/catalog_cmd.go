package main

import (
	"github.com/spf13/cobra"
)

func newCatalogCmd(app *App) *cobra.Command {
	cmd := &cobra.Command{
		Use:   "catalog",
		Short: "Browse, search and check the regulator catalog",
		Long: `The catalog lists the regulator families whichreg knows, the packages each comes
in with its lead-by-lead pinout, and the datasheet figures behind every check.
The built-in catalog can be extended with --catalog FILE or with *.toml files in
the whichreg/catalog folder of your configuration directory ('whichreg catalog
paths' prints where that is; --no-user-catalog leaves those files out).`,
		Example: `  whichreg catalog list
  whichreg catalog show 317
  whichreg catalog find '?M3?7'
  whichreg catalog paths`,
	}
	cmd.AddCommand(newCatalogListCmd(app, nil), newCatalogShowCmd(app, nil), newCatalogFindCmd(app, nil),
		newCatalogCheckCmd(app, nil), newCatalogInitCmd(app, nil), newCatalogPathsCmd(app, nil))
	return cmd
}
