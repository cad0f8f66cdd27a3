package main

import (
	"fmt"
	"strings"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/report"
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
		d := catalogListDoc{Schema: report.Schema("catalog-list"), Families: []familyDoc{}}
		for _, f := range fams {
			d.Families = append(d.Families, familyDocOf(f))
		}
		return writeJSON(out, d)
	}
	// The title says polarity and kind; it moves under its row when the
	// width is short.
	t := &report.Table{Columns: []report.Column{{Header: "ID"}, {Header: "CURRENT", Align: report.Right},
		{Header: "OUTPUT", Wrap: true}, {Header: "OUTLINES", Wrap: true}, {Header: "STATUS"}, {Header: "TITLE", Wrap: true, Under: true}}}
	for _, f := range fams {
		t.Row(f.ID, report.Num(f.CurrentA, "A"), outputsText(f), packagesText(f), string(f.Status), f.Title)
	}
	return t.Write(out, opts.app.Width())
}

// catalogListDoc is the JSON document of `catalog list`.
type catalogListDoc struct {
	Schema   string      `json:"schema"`
	Families []familyDoc `json:"families"`
}

func outputsText(f *catalog.Family) string {
	sign := ""
	if f.Negative() {
		sign = "-"
	}
	if f.Kind == "non-regulator" {
		return string(f.Device)
	}
	if f.Adjustable() {
		return sign + report.Num(f.VrefV, "V") + " ref"
	}
	var vs []string
	for _, v := range f.OutputsV {
		vs = append(vs, sign+fmt.Sprint(v))
	}
	return strings.Join(vs, ", ") + " V"
}

func packagesText(f *catalog.Family) string {
	var ps []string
	for _, p := range f.Packages {
		ps = append(ps, p.Outline)
	}
	return strings.Join(ps, ", ")
}
