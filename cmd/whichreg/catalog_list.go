package main

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
)

type catalogListOptions struct {
	app      *App
	Format   string
	Polarity string
	Kind     string
	Outline  string
	Status   string
}

func newCatalogListCmd(app *App, runF func(*catalogListOptions) error) *cobra.Command {
	opts := &catalogListOptions{app: app}
	cmd := &cobra.Command{
		Use:   "list",
		Short: "List the families, optionally filtered",
		Example: `  whichreg catalog list
  whichreg catalog list --polarity negative --outline TO-220
  whichreg catalog list --status active --format json`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			if runF != nil {
				return runF(opts)
			}
			return catalogListRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	addEnumFlag(cmd, &opts.Polarity, "polarity", "only this polarity", "", "positive", "negative")
	addEnumFlag(cmd, &opts.Kind, "kind", "only this kind", "", "fixed", "adjustable", "non-regulator")
	addEnumFlag(cmd, &opts.Status, "status", "only this production status", "", "active", "obsolete", "scarce")
	cmd.Flags().StringVar(&opts.Outline, "outline", "", "only families sold in this `OUTLINE` (name or alias)")
	return cmd
}

func catalogListRun(opts *catalogListOptions) error {
	c, err := opts.app.loadCatalog()
	if err != nil {
		return err
	}
	if opts.Outline != "" && c.Outline(opts.Outline) == nil {
		return inputError(fmt.Errorf("unknown outline %q", opts.Outline), "see 'whichreg catalog list' and the outline names in 'whichreg catalog show ID'")
	}
	var fams []*catalog.Family
	for _, f := range c.Sorted() {
		if (opts.Polarity != "" && string(f.Polarity) != opts.Polarity) || (opts.Kind != "" && string(f.Kind) != opts.Kind) ||
			(opts.Status != "" && string(f.Status) != opts.Status) || (opts.Outline != "" && f.Package(c, opts.Outline) == nil) {
			continue
		}
		fams = append(fams, f)
	}
	out := opts.app.IO.Out
	if opts.Format == "json" {
		if fams == nil {
			fams = []*catalog.Family{}
		}
		return writeJSON(out, fams)
	}
	var tw io.Writer = out
	var flush func() error
	if isTerminal(out) {
		t := tabwriter.NewWriter(out, 0, 4, 2, ' ', 0)
		fmt.Fprintln(t, "ID\tPOLARITY\tKIND\tCURRENT\tOUTPUT\tPACKAGES\tSTATUS\tTITLE")
		tw, flush = t, t.Flush
	}
	for _, f := range fams {
		fmt.Fprintf(tw, "%s\t%s\t%s\t%g A\t%s\t%s\t%s\t%s\n", f.ID, f.Polarity, f.Kind, f.CurrentA, outputsText(f), packagesText(f), f.Status, f.Title)
	}
	if flush == nil {
		return nil
	}
	return flush()
}

func outputsText(f *catalog.Family) string {
	sign := ""
	if f.Negative() {
		sign = "-"
	}
	if f.Adjustable() {
		return fmt.Sprintf("%s%g V ref", sign, f.VrefV)
	}
	var vs []string
	for _, v := range f.OutputsV {
		vs = append(vs, sign+fmt.Sprint(v))
	}
	return strings.Join(vs, "/") + " V"
}

func packagesText(f *catalog.Family) string {
	var ps []string
	for _, p := range f.Packages {
		ps = append(ps, p.Outline)
	}
	return strings.Join(ps, ",")
}
