package main

import (
	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
)

type catalogInitOptions struct {
	app   *App
	File  string
	Force bool
}

func newCatalogInitCmd(app *App, runF func(*catalogInitOptions) error) *cobra.Command {
	opts := &catalogInitOptions{app: app}
	cmd := &cobra.Command{
		Use:   "init [FILE]",
		Short: "Write a commented starter catalog (to stdout, or to FILE; --force to replace it)",
		Example: `  whichreg catalog init my-parts.toml
  whichreg catalog check my-parts.toml`,
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			if len(args) == 1 {
				opts.File = args[0]
			}
			if runF != nil {
				return runF(opts)
			}
			return writeOut(opts.app, opts.File, []byte(catalog.StarterFile), opts.Force)
		},
	}
	cmd.Flags().BoolVar(&opts.Force, "force", false, "replace FILE if it exists")
	return cmd
}
