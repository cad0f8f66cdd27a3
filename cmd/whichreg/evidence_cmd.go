package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"strings"

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

// readLimited reads a file of at most limit bytes. A larger file is invalid
// input (it is not the kind of file wanted); a failure to read is an I/O error.
func readLimited(file, what string, limit int64) ([]byte, error) {
	st, err := os.Stat(file)
	if err != nil {
		return nil, ioError(fmt.Errorf("reading %s: %w", what, err))
	}
	if st.IsDir() {
		return nil, inputError(fmt.Errorf("%s is a directory, not %s file", file, article(what)))
	}
	if st.Size() > limit {
		return nil, inputError(fmt.Errorf("%s: %d bytes is far too large for %s file (at most %d MiB); is it the right file?", file, st.Size(), article(what), limit>>20))
	}
	data, err := os.ReadFile(file)
	if err != nil {
		return nil, ioError(fmt.Errorf("reading %s: %w", what, err))
	}
	return data, nil
}

func article(w string) string {
	if strings.ContainsAny(w[:1], "aeiou") {
		return "an " + w
	}
	return "a " + w
}

// loadEvidence reads and checks an evidence file.
func loadEvidence(app *App, c *catalog.Catalog, file string) (*infer.Evidence, error) {
	data, err := readLimited(file, "evidence", 1<<20)
	if err != nil {
		if errors.Is(err, fs.ErrNotExist) {
			return nil, ioError(err, "'whichreg evidence init FILE' writes a template to fill in")
		}
		return nil, err
	}
	ev, err := infer.LoadEvidence(file, data, c)
	if err != nil {
		return nil, inputError(err, "'whichreg evidence init' writes a template with every key")
	}
	return ev, nil
}
