package main

import (
	"errors"
	"io/fs"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
)

func newEvidenceCmd(app *App) *cobra.Command {
	cmd := &cobra.Command{
		Use:     "evidence",
		Short:   "Write an evidence template to fill in at the bench",
		Example: `  whichreg evidence init u4.toml`,
	}
	var force bool
	init := &cobra.Command{
		Use:   "init [FILE]",
		Short: "Write a commented evidence template (to stdout, or to FILE; --force to replace it)",
		Example: `  whichreg evidence init u4.toml
  whichreg infer u4.toml`,
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			file := ""
			if len(args) == 1 {
				file = args[0]
			}
			return writeOut(app, file, []byte(infer.Template), force)
		},
	}
	init.Flags().BoolVar(&force, "force", false, "replace FILE if it exists")
	cmd.AddCommand(init)
	return cmd
}

func article(w string) string {
	if strings.ContainsAny(w[:1], "aeiou") {
		return "an " + w
	}
	return "a " + w
}

// loadEvidence reads and checks an evidence file.
func loadEvidence(app *App, c *catalog.Catalog, file string) (*infer.Evidence, error) {
	ev, _, err := loadEvidenceSource(app, c, file)
	return ev, err
}

// loadEvidenceSource is loadEvidence that also returns the file's text (the
// record carries its comments).
func loadEvidenceSource(app *App, c *catalog.Catalog, file string) (*infer.Evidence, []byte, error) {
	data, err := app.readLimited(file, "evidence", 1<<20)
	if err != nil {
		if errors.Is(err, fs.ErrNotExist) {
			return nil, nil, ioError(err, "'whichreg evidence init FILE' writes a template to fill in")
		}
		return nil, nil, err
	}
	ev, err := infer.LoadEvidence(displayName(file), data, c)
	if err != nil {
		return nil, nil, inputError(err, "'whichreg evidence init' writes a template with every key")
	}
	return ev, data, nil
}
