package main

import (
	"errors"
	"fmt"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
)

type swapOptions struct {
	app      *App
	Format   string
	Original string
	All      bool
	File     string
	Details  int
	Quiet    bool
}

func newSwapCmd(app *App, runF func(*swapOptions) error) *cobra.Command {
	opts := &swapOptions{app: app}
	cmd := &cobra.Command{
		Use:   "swap EVIDENCE.toml",
		Short: "Rank current-production replacements checked against the circuit",
		Long: `swap takes the original from infer's leader (or from --original) and checks
every current-production candidate in every package: outline and footprint,
lead-by-lead function, tab potential against the mounting, polarity, output
voltage, current, input maximum at high mains and light load, dropout at the
ripple trough at low mains and full load, junction temperature, output-capacitor
stability and minimum load. Drop-in parts come first, then parts that need
work; unsuitable ones are shown with --all or when nothing else fits.

--original takes ID, ID:OUTLINE or ID:OUTLINE:VOUT, e.g. 78xx:TO-3:5.`,
		Example: `  whichreg swap testdata/demo/vending-lifted-ground.toml
  whichreg swap board.toml --original 317:TO-220 --format json
  whichreg swap board.toml --all`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.File = args[0]
			if runF != nil {
				return runF(opts)
			}
			return swapRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json", "markdown")
	cmd.Flags().StringVar(&opts.Original, "original", "", "the original part as `ID[:OUTLINE[:VOUT]]` instead of infer's leader")
	cmd.Flags().BoolVar(&opts.All, "all", false, "include obsolete, scarce and unsuitable candidates")
	cmd.Flags().IntVar(&opts.Details, "details", 3, "show the full check table of this many candidates (text)")
	cmd.Flags().BoolVarP(&opts.Quiet, "quiet", "q", false, "leave out the legend of statuses and margins")
	return cmd
}

// resolveOriginal returns identification's result and the original: named
// with spec (ID[:OUTLINE[:VOUT]]), or identification's leader.
func resolveOriginal(c *catalog.Catalog, ev *infer.Evidence, spec string) (infer.Original, *infer.Result, error) {
	res, err := infer.Identify(c, ev, infer.Options{})
	if err != nil {
		return infer.Original{}, nil, inputError(err)
	}
	var named *infer.Hypothesis
	if spec != "" {
		h, err := infer.ParseVariant(c, spec)
		if err != nil {
			if id, _, _ := strings.Cut(spec, ":"); c.Family(id) == nil {
				return infer.Original{}, res, inputError(fmt.Errorf("--original: %v", err), suggestIDs(c, id))
			}
			return infer.Original{}, res, inputError(fmt.Errorf("--original: %v", err))
		}
		named = &h
	}
	orig, err := infer.ChooseOriginal(res, named)
	switch {
	case errors.Is(err, infer.ErrNotInCatalog):
		return orig, res, inputError(err, "name the original with --original ID[:OUTLINE[:VOUT]]")
	case err != nil:
		return orig, res, inputError(err)
	}
	return orig, res, nil
}

// swapState is what swap and record share: the catalog, the evidence (and
// its source text), the identification, and the checked replacements.
type swapState struct {
	cat  *catalog.Catalog
	ev   *infer.Evidence
	src  []byte
	ires *infer.Result
	sres *replace.Result
}

func prepareSwap(app *App, file, original string, all bool) (*swapState, error) {
	c, err := app.loadCatalog()
	if err != nil {
		return nil, err
	}
	ev, src, err := loadEvidenceSource(app, c, file)
	if err != nil {
		return nil, err
	}
	orig, ires, err := resolveOriginal(c, ev, original)
	if err != nil {
		return nil, err
	}
	sres, err := replace.Swap(c, ev, orig, replace.Options{All: all})
	if err != nil {
		return nil, inputError(fmt.Errorf("%s: %w", file, err))
	}
	return &swapState{c, ev, src, ires, sres}, nil
}

func swapRun(o *swapOptions) error {
	st, err := prepareSwap(o.app, o.File, o.Original, o.All)
	if err != nil {
		return err
	}
	res := st.sres
	out := o.app.IO.Out
	switch o.Format {
	case "json":
		return writeJSON(out, swapDocOf(res))
	case "markdown":
		writeSwapMarkdown(out, res, o.Details)
	default:
		var conflicts []string
		if st.ires != nil {
			conflicts = st.ires.Conflicts
		}
		writeSwapText(out, o.app.Width(), res, conflicts, o.Details, o.Quiet)
	}
	return nil
}
