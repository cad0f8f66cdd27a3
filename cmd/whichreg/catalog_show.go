package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
)

type catalogShowOptions struct {
	app    *App
	Format string
	ID     string
}

func newCatalogShowCmd(app *App, runF func(*catalogShowOptions) error) *cobra.Command {
	opts := &catalogShowOptions{app: app}
	cmd := &cobra.Command{
		Use:   "show ID",
		Short: "Show every field of a family and draw each package's pinout",
		Example: `  whichreg catalog show 317
  whichreg catalog show 79xx --format json`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.ID = args[0]
			if runF != nil {
				return runF(opts)
			}
			return catalogShowRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// showJSON is the JSON shape of `catalog show`: the family and its outlines.
type showJSON struct {
	*catalog.Family
	Outlines []*catalog.Outline `json:"outlines"`
}

func catalogShowRun(opts *catalogShowOptions) error {
	c, err := opts.app.loadCatalog()
	if err != nil {
		return err
	}
	f := c.Family(opts.ID)
	if f == nil {
		return inputError(fmt.Errorf("no family %q in the catalog", opts.ID), suggestIDs(c, opts.ID))
	}
	out := opts.app.IO.Out
	if opts.Format == "json" {
		sj := showJSON{Family: f}
		for _, p := range f.Packages {
			sj.Outlines = append(sj.Outlines, c.Outline(p.Outline))
		}
		return writeJSON(out, sj)
	}
	writeFamily(out, c, f)
	return nil
}

func suggestIDs(c *catalog.Catalog, id string) string {
	var near []string
	for _, f := range c.Sorted() {
		if strings.Contains(strings.ToLower(f.ID), strings.ToLower(strings.TrimRight(id, "xX"))) {
			near = append(near, f.ID)
		}
	}
	if len(near) > 0 {
		return "did you mean " + strings.Join(near, ", ") + "? 'whichreg catalog list' lists every id"
	}
	return "'whichreg catalog list' lists every id; 'whichreg catalog find MARKING' searches by marking"
}

func writeFamily(w io.Writer, c *catalog.Catalog, f *catalog.Family) {
	fmt.Fprintf(w, "%s — %s\n", f.ID, f.Title)
	fmt.Fprintf(w, "  from:          %s", f.Origin)
	if f.Replaces != "" {
		fmt.Fprintf(w, " (replaces the entry from %s)", f.Replaces)
	}
	fmt.Fprintln(w)
	pass := f.Pass
	if pass == "" {
		pass = "npn"
	}
	fmt.Fprintf(w, "  polarity:      %s, %s, pass element %s\n", f.Polarity, f.Kind, pass)
	if f.Adjustable() {
		fmt.Fprintf(w, "  reference:     %g V ±%g %% (OUT to ADJ); output up to %g V\n", f.VrefV, f.Tolerance*100, f.VoutMaxV)
		fmt.Fprintf(w, "  ADJ current:   %g µA max (%g typ)\n", f.IadjUA, f.IadjTypUA)
		fmt.Fprintf(w, "  differential:  %g V max input-output\n", f.VdiffMaxV)
		if f.VinMaxV > 0 {
			fmt.Fprintf(w, "  input:         %g V max\n", f.VinMaxV)
		}
	} else {
		fmt.Fprintf(w, "  outputs:       %s ±%g %%\n", outputsText(f), f.Tolerance*100)
		fmt.Fprintf(w, "  input:         %g V max", f.VinMaxV)
		if f.VinMaxHighV > 0 {
			fmt.Fprintf(w, " (%g V for %g V and up)", f.VinMaxHighV, f.VinMaxHighFromV)
		}
		fmt.Fprintln(w)
		fmt.Fprintf(w, "  ground current: %g mA max (%g typ)\n", f.IqMA, f.IqTypMA)
	}
	fmt.Fprintf(w, "  current:       %g A rated\n", f.CurrentA)
	fmt.Fprintf(w, "  dropout:       %g V at rated current\n", f.DropoutV)
	fmt.Fprintf(w, "  minimum load:  %g mA\n", f.MinLoadMA)
	fmt.Fprintf(w, "  junction:      %g °C max\n", f.TjMaxC)
	fmt.Fprintf(w, "  output cap:    %s\n", coutText(f.Cout))
	if f.Efficiency > 0 {
		fmt.Fprintf(w, "  efficiency:    %g %%\n", f.Efficiency*100)
	}
	fmt.Fprintf(w, "  status:        %s; since %d; commonness %d of 5\n", f.Status, f.Since, f.Commonness)
	fmt.Fprintf(w, "  markings:      %s\n", strings.Join(f.Markings, " "))
	fmt.Fprintf(w, "  source:        %s\n", f.Source)
	for _, n := range f.Notes {
		fmt.Fprintf(w, "  note:          %s\n", n)
	}
	for i := range f.Packages {
		p := &f.Packages[i]
		o := c.Outline(p.Outline)
		fmt.Fprintf(w, "\n  package %s: %g A, theta_jc %g, theta_ja %g °C/W, %s\n", p.Outline, f.Current(p), p.ThetaJC, p.ThetaJA, f.StatusOf(p))
		if p.Note != "" {
			fmt.Fprintf(w, "  note: %s\n", p.Note)
		}
		for _, line := range strings.Split(strings.TrimRight(catalog.Drawing(o, p), "\n"), "\n") {
			fmt.Fprintf(w, "    %s\n", line)
		}
	}
}

func coutText(c catalog.COut) string {
	if c.MinUF == 0 && c.ESRMinOhm == 0 && c.ESRMaxOhm == 0 {
		s := "not needed for stability"
		if !c.CeramicOK {
			s += "; not for ceramic alone"
		}
		if c.MaxUF > 0 {
			s += fmt.Sprintf("; at most %g µF", c.MaxUF)
		}
		return s
	}
	s := fmt.Sprintf("at least %g µF", c.MinUF)
	if c.ESRMinOhm > 0 || c.ESRMaxOhm > 0 {
		s += fmt.Sprintf(", ESR %g–%g Ω", c.ESRMinOhm, c.ESRMaxOhm)
	}
	if c.CeramicOK {
		s += "; ceramic OK"
	} else {
		s += "; not stable with ceramic alone"
	}
	return s
}
