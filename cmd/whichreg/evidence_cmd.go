package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
)

func newEvidenceCmd(app *App) *cobra.Command {
	cmd := &cobra.Command{
		Use:   "evidence",
		Short: "Write an evidence template to fill in at the bench",
	}
	init := &cobra.Command{
		Use:   "init [FILE]",
		Short: "Write a commented evidence template (to stdout, or to FILE; never overwrites)",
		Example: `  whichreg evidence init u4.toml
  whichreg infer u4.toml`,
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			file := ""
			if len(args) == 1 {
				file = args[0]
			}
			return writeOut(app, file, []byte(infer.Template), false)
		},
	}
	cmd.AddCommand(init)
	return cmd
}

// loadEvidence reads and checks an evidence file.
func loadEvidence(app *App, c *catalog.Catalog, file string) (*infer.Evidence, error) {
	data, err := os.ReadFile(file)
	if err != nil {
		if errors.Is(err, fs.ErrNotExist) {
			return nil, ioError(fmt.Errorf("reading evidence: %v", err), "'whichreg evidence init FILE' writes a template to fill in")
		}
		return nil, ioError(fmt.Errorf("reading evidence: %v", err))
	}
	if len(data) > 1<<20 {
		return nil, inputError(fmt.Errorf("%s: %d bytes is far too large for an evidence file (at most 1 MiB); is it the right file?", file, len(data)))
	}
	ev, err := infer.LoadEvidence(file, data, c)
	if err != nil {
		return nil, inputError(err, "'whichreg evidence init' writes a template with every key")
	}
	return ev, nil
}
